//! The shortlist for the supplier: text (80 columns, a page per bay),
//! Markdown and CSV, written over `impl Write`; the PDF is the text set on
//! pages by [`super::pdf`].

use std::io::{self, Write};

use crate::bay::Bay;
use crate::catalog::Catalog;
use crate::checks::fire::fmt_h;
use crate::job::Job;
use crate::select::{BayRanking, Ranked, evaluation, failure_reason};
use crate::units::{System, display};

/// Output format.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Format {
    /// Plain text, 80 columns, form feed between bays.
    Text,
    /// Markdown.
    Markdown,
    /// Comma-separated values, one row per member.
    Csv,
    /// A printable PDF ([`pdf`]).
    Pdf,
}

/// One bay of the shortlist: the bay and its ranking.
pub struct BayList<'a, 'c> {
    /// The bay.
    pub bay: &'a Bay,
    /// Its ranking.
    pub ranking: &'a BayRanking<'c>,
}

/// The figures printed for one member.
struct Row {
    designation: String,
    id: String,
    topping: String,
    weight_psf: f64,
    depth_in: f64,
    governing: String,
    ratio: f64,
    phi_mn_over_mu: f64,
    shear_ratio: f64,
    class: &'static str,
    camber_erection: f64,
    camber_final: f64,
    defl_live: f64,
    /// Camber at erection to expect (age-adjusted method): least, greatest.
    camber_range: (f64, f64),
    fire: String,
    member_length_in: f64,
    pieces: Option<u64>,
    /// What the bay's openings do to units of this member.
    openings: Vec<String>,
}

/// A listed member's row: its checks are evaluated again (a ranking keeps
/// only the verdict).
fn row(cat: &Catalog, r: &Ranked, bay: &Bay, sys: System) -> Row {
    let e = &evaluation(cat, bay, &r.entry);
    let flex = e.check("flexure");
    let shear = e.check("shear");
    let fire = match (e.fire.rating_h, e.fire.rating_cover_h) {
        (Some(h), Some(c)) => {
            let by = match c.total_cmp(&e.fire.rating_thickness_h) {
                std::cmp::Ordering::Less => "by cover",
                std::cmp::Ordering::Greater => "by thickness",
                std::cmp::Ordering::Equal => "thickness and cover",
            };
            format!("{} h ({by})", fmt_h(h))
        }
        _ => "not rated".into(),
    };
    let width_ft = r.entry.section.props.width_in / 12.0;
    let pieces = bay.pieces.map(u64::from).or_else(|| {
        bay.area
            .map(|a| (a.in_unit("ft2") / (width_ft * bay.case.span.get() / 12.0)).ceil() as u64)
    });
    Row {
        designation: format!("{} — {}", r.entry.section.designation, r.entry.pattern.designation),
        id: format!("{} / {}", r.entry.section.id, r.entry.pattern.id),
        topping: r.entry.topping.map_or("no topping".into(), |t| match sys {
            System::Us => format!("{} in topping", crate::section::family::fmt(t.get())),
            System::Si => format!("{} topping", display::with_unit(t.get(), "in", 0, sys)),
        }),
        weight_psf: r.metrics.weight_psf,
        depth_in: r.metrics.depth_in,
        governing: e.governing().info.title.to_string(),
        ratio: e.governing().ratio,
        phi_mn_over_mu: flex.map_or(0.0, |f| f.capacity / f.demand),
        shear_ratio: shear.map_or(0.0, |s| s.ratio),
        class: e.service_class.name(),
        camber_erection: e.camber.camber_erection_in,
        camber_final: e.camber.camber_final_in,
        defl_live: e.camber.defl_live_in,
        camber_range: e.camber_range,
        fire,
        member_length_in: e.member_length_in,
        pieces,
        openings: {
            let case = crate::select::case_for(bay, r.entry.topping, &crate::select::topping_mix(cat, bay));
            crate::checks::describe_openings_as(&r.entry.candidate(), &case, true)
                .iter()
                .map(|o| display::localize(o, sys))
                .collect()
        },
    }
}

fn criteria(bay: &Bay, sys: System) -> Vec<String> {
    let c = &bay.case;
    let load = |q: crate::units::AreaLoad| display::with_unit(q.in_unit("psf"), "psf", 0, sys);
    let mut v = vec![format!(
        "span {}, {}, SDL {}, L {}, Lr {}, S {}",
        display::span(c.span.get(), sys),
        match c.member_use {
            crate::case::Use::Floor => "floor",
            crate::case::Use::Roof => "roof",
        },
        load(c.sdl),
        load(c.live),
        load(c.roof_live),
        load(c.snow)
    )];
    if c.has_overhang() {
        v.push(format!(
            "overhangs: left {}, right {}; top bars {}",
            display::span(c.overhang.0.get(), sys),
            display::span(c.overhang.1.get(), sys),
            display::with_unit(c.top_bars.in_unit("in2"), "in²", 2, sys)
        ));
    }
    v.extend(crate::report::check::items_text(c, sys));
    if !c.placed.is_empty() || !c.openings.is_empty() {
        v.push(format!(
            "shared between hollow-core units: {}; between double-tee stems: {}",
            match c.unit_share {
                crate::case::UnitShare::Whole => "the loaded unit carries it all".to_string(),
                crate::case::UnitShare::Width(w) => format!("over {}", display::span(w.get(), sys)),
                crate::case::UnitShare::Rule => format!("published rule ({})", crate::loads::RULE_MARK),
            },
            match c.stem_share {
                crate::case::StemShare::Lever => "lever rule",
                crate::case::StemShare::OneStem => "one stem carries it all",
            }
        ));
    }
    v.push(format!(
        "class {} allowed, fire {}, {}, objective {}",
        c.class_allowed.name(),
        c.fire_rating.map_or("not required".into(), |h| format!(
            "{} h {}",
            fmt_h(h),
            if c.restrained { "restrained" } else { "unrestrained" }
        )),
        match c.exposure {
            crate::fire::Exposure::Interior => "interior",
            crate::fire::Exposure::Weather => "exposed to weather",
        },
        bay.objective.name()
    ));
    let area = bay.area.map(|a| display::with_unit(a.in_unit("ft2"), "ft²", 0, sys));
    let pieces = bay.pieces.map(|p| format!("{p} pieces"));
    if area.is_some() || pieces.is_some() {
        v.push(format!(
            "quantity: {}",
            [area, pieces].into_iter().flatten().collect::<Vec<_>>().join(", ")
        ));
    }
    v
}

/// Write the shortlist of bays already ranked.
pub fn write(w: &mut impl Write, format: Format, job: &Job, cat: &Catalog, bays: &[BayList], top: usize, sys: System) -> io::Result<()> {
    let mut i = 0;
    write_each(w, format, job, cat, top, sys, &mut |_, _| {
        i += 1;
        bays[i - 1].ranking.clone()
    })
}

/// Write the shortlist, ranking each bay of the job with `rank` as it comes
/// to it: one bay's ranking is held at a time, so a job of thousands of
/// bays takes the memory of one.
pub fn write_each<'c>(
    w: &mut impl Write,
    format: Format,
    job: &Job,
    cat: &'c Catalog,
    top: usize,
    sys: System,
    rank: &mut dyn FnMut(usize, &Bay) -> BayRanking<'c>,
) -> io::Result<()> {
    match format {
        Format::Text => {
            wrap_into(w, |b| text_head(b, job, cat, sys))?;
            let mut seen = Vec::new();
            for (i, bay) in job.bays.iter().enumerate() {
                let r = rank(i, bay);
                let beside = beside_line(cat, job, bay, &r, &mut seen, sys);
                wrap_into(w, |b| text_bay(b, cat, i, bay, &r, top, sys, beside.as_deref()))?;
            }
            wrap_into(w, |b| text_tail(b, job))
        }
        Format::Markdown => {
            md_head(w, job, cat, sys)?;
            let mut seen = Vec::new();
            for (i, bay) in job.bays.iter().enumerate() {
                let r = rank(i, bay);
                let beside = beside_line(cat, job, bay, &r, &mut seen, sys);
                md_bay(w, cat, i, bay, &r, top, sys, beside.as_deref())?;
            }
            md_tail(w, job)
        }
        Format::Pdf => {
            let bytes = pdf(job, cat, top, sys, rank).map_err(io::Error::other)?;
            w.write_all(&bytes)
        }
        Format::Csv => {
            csv_head(w, sys)?;
            for (i, bay) in job.bays.iter().enumerate() {
                let r = rank(i, bay);
                csv_bay(w, job, cat, bay, &r, top, sys)?;
            }
            Ok(())
        }
    }
}
/// The first listed member of each bay written so far: (bay, member, its
/// camber at erection by the age-adjusted method, in).
type Seen = Vec<(String, String, f64)>;

/// Differential camber across a shared line: when this bay and one written
/// before it name each other as `beside`, their first members' cambers at
/// erection compared against this bay's `camber_limit` (common practice,
/// no source).
fn beside_line(cat: &Catalog, job: &Job, bay: &Bay, r: &BayRanking, seen: &mut Seen, sys: System) -> Option<String> {
    let first = r.viable.first()?;
    let e = evaluation(cat, bay, &first.entry);
    let mine = e.aged.erection_in;
    let label = first.entry.label();
    let pair = |other: &Bay| bay.beside.as_deref() == Some(other.name.as_str()) || other.beside.as_deref() == Some(bay.name.as_str());
    let line = seen
        .iter()
        .filter(|(name, _, _)| job.bays.iter().any(|b| &b.name == name && pair(b)))
        .map(|(name, other, theirs)| {
            let d = (mine - theirs).abs();
            let limit = bay.case.camber_limit.get();
            format!(
                "beside bay '{name}' along a shared line: camber at erection {} here ({label}) against {} there ({other}), {} apart — {} the {} limit (common practice, no source)",
                display::with_unit(mine, "in", 2, sys),
                display::with_unit(*theirs, "in", 2, sys),
                display::with_unit(d, "in", 2, sys),
                if d <= limit + 1e-9 { "within" } else { "BEYOND" },
                display::with_unit(limit, "in", 2, sys)
            )
        })
        .next();
    seen.push((bay.name.clone(), label, mine));
    line
}

fn header_lines(job: &Job, cat: &Catalog, sys: System) -> Vec<String> {
    vec![
        format!("Project   {}", job.project),
        format!("Engineer  {}", job.engineer),
        format!("Date      {}", job.date),
        format!("Catalog   {} (content hash {})", cat.meta.name, cat.hash),
        format!("Producer  {}", cat.meta.producer),
        format!("Basis     {}; ASCE 7-16 load combinations; IBC 2021 §722 fire", job.code),
        format!(
            "Units     {}",
            match sys {
                System::Us => "US customary (ft-in, in, psf, kip, kip-ft, psi)",
                System::Si => "SI (m, mm, kPa, kN, kN·m, MPa)",
            }
        ),
    ]
}

/// Wrap `line` at spaces to 78 columns; continuation lines get `indent`.
fn wrapped(line: &str, indent: &str) -> String {
    let lead: String = line.chars().take_while(|c| *c == ' ').collect();
    let mut out = String::new();
    let mut cur = lead.clone();
    for word in line[lead.len()..].split(' ') {
        if cur.len() > lead.len() && cur.chars().count() + 1 + word.chars().count() > 78 {
            out.push_str(cur.trim_end());
            out.push('\n');
            cur = indent.to_string();
        } else if cur.len() > lead.len() {
            cur.push(' ');
        }
        cur.push_str(word);
    }
    out.push_str(&cur);
    out
}

/// Write what `part` writes, each line wrapped at 78 columns.
fn wrap_into(w: &mut impl Write, part: impl FnOnce(&mut Vec<u8>) -> io::Result<()>) -> io::Result<()> {
    let mut buf = Vec::new();
    part(&mut buf)?;
    for line in String::from_utf8_lossy(&buf).split_inclusive('\n') {
        let (body, nl) = line.strip_suffix('\n').map_or((line, ""), |b| (b, "\n"));
        let indent: String = body.chars().take_while(|c| *c == ' ').collect::<String>() + "    ";
        write!(w, "{}{nl}", wrapped(body, &indent))?;
    }
    Ok(())
}

fn text_head(w: &mut impl Write, job: &Job, cat: &Catalog, sys: System) -> io::Result<()> {
    writeln!(w, "PRECAST MEMBER SHORTLIST — PRELIMINARY")?;
    writeln!(w, "{}", "=".repeat(78))?;
    for l in header_lines(job, cat, sys) {
        writeln!(w, "{l}")?;
    }
    Ok(())
}

#[allow(clippy::too_many_arguments)]
fn text_bay(
    w: &mut impl Write,
    cat: &Catalog,
    i: usize,
    bay: &Bay,
    ranking: &BayRanking,
    top: usize,
    sys: System,
    beside: Option<&str>,
) -> io::Result<()> {
    if i > 0 {
        write!(w, "\x0c")?;
    }
    writeln!(w)?;
    writeln!(w, "Bay {}: {}", i + 1, bay.name)?;
    writeln!(w, "{}", "-".repeat(78))?;
    for c in criteria(bay, sys) {
        writeln!(w, "  {c}")?;
    }
    if let Some(l) = beside {
        writeln!(w, "  {l}")?;
    }
    writeln!(w)?;
    if ranking.viable.is_empty() {
        writeln!(w, "  NO CATALOG MEMBER WORKS FOR THIS BAY. Nearest misses:")?;
        for r in ranking.failing.iter().take(3) {
            writeln!(w, "  - {}: {}", r.entry.label(), display::localize(&failure_reason(r), sys))?;
        }
        return Ok(());
    }
    let len_u = display::unit("in", sys);
    for (k, r) in ranking.viable.iter().take(top).enumerate() {
        let x = row(cat, r, bay, sys);
        writeln!(w, "{:>3}. {}", k + 1, x.designation)?;
        writeln!(
            w,
            "     [{}] {}, {}, {} deep, member {}",
            x.id,
            x.topping,
            display::with_unit(x.weight_psf, "psf", 1, sys),
            display::with_unit(x.depth_in, "in", 2, sys),
            display::span(x.member_length_in, sys)
        )?;
        writeln!(
            w,
            "     governs: {} {:.2}; φMn/Mu {:.2}; Vu/φVn {:.2}; class {}",
            x.governing, x.ratio, x.phi_mn_over_mu, x.shear_ratio, x.class
        )?;
        writeln!(
            w,
            "     camber at erection {} {len_u}, final {} {len_u}; live defl. {} {len_u}",
            signed(x.camber_erection, sys),
            signed(x.camber_final, sys),
            display::num(x.defl_live, "in", 2, sys)
        )?;
        writeln!(
            w,
            "     expected camber at erection {} to {} {len_u} (ACI 209R-92 with age, the bay's erection ages and units)",
            signed(x.camber_range.0, sys),
            signed(x.camber_range.1, sys)
        )?;
        writeln!(
            w,
            "     fire {}{}",
            x.fire,
            x.pieces.map_or(String::new(), |p| format!("; {p} pieces"))
        )?;
        for o in &x.openings {
            writeln!(w, "     {o}")?;
        }
    }
    Ok(())
}

fn text_tail(w: &mut impl Write, job: &Job) -> io::Result<()> {
    writeln!(w)?;
    writeln!(w, "Notes")?;
    for n in &job.notes {
        writeln!(w, "  - {n}")?;
    }
    writeln!(w, "  - Camber upward positive (Martin 1977 multipliers); checks per ACI 318-19.")?;
    writeln!(w)?;
    writeln!(w, "Cautions")?;
    for c in super::CAUTIONS {
        writeln!(w, "  ! {c}")?;
    }
    Ok(())
}

fn md_head(w: &mut impl Write, job: &Job, cat: &Catalog, sys: System) -> io::Result<()> {
    writeln!(w, "# Precast member shortlist — preliminary")?;
    writeln!(w)?;
    for l in header_lines(job, cat, sys) {
        let (k, v) = l.split_at(10);
        writeln!(w, "- **{}**: {}", k.trim(), v.trim())?;
    }
    Ok(())
}

#[allow(clippy::too_many_arguments)]
fn md_bay(
    w: &mut impl Write,
    cat: &Catalog,
    i: usize,
    bay: &Bay,
    ranking: &BayRanking,
    top: usize,
    sys: System,
    beside: Option<&str>,
) -> io::Result<()> {
    let b = BayList { bay, ranking };
    {
        writeln!(w)?;
        writeln!(w, "## Bay {}: {}", i + 1, b.bay.name)?;
        writeln!(w)?;
        for c in criteria(b.bay, sys) {
            writeln!(w, "- {c}")?;
        }
        if let Some(l) = beside {
            writeln!(w, "- {l}")?;
        }
        writeln!(w)?;
        if b.ranking.viable.is_empty() {
            writeln!(w, "**No catalog member works for this bay.** Nearest misses:")?;
            writeln!(w)?;
            for r in b.ranking.failing.iter().take(3) {
                writeln!(w, "- `{}`: {}", r.entry.label(), display::localize(&failure_reason(r), sys))?;
            }
            return Ok(());
        }
        let (wu, lu) = (display::unit("psf", sys), display::unit("in", sys));
        writeln!(
            w,
            "| # | member | topping | {wu} | depth {lu} | governs | ratio | φMn/Mu | Vu/φVn | class | camber erection {lu} | expected at erection {lu} | camber final {lu} | live defl {lu} | fire | length | pieces |"
        )?;
        writeln!(w, "|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|")?;
        for (k, r) in b.ranking.viable.iter().take(top).enumerate() {
            let x = row(cat, r, b.bay, sys);
            writeln!(
                w,
                "| {} | {} (`{}`) | {} | {} | {} | {} | {:.2} | {:.2} | {:.2} | {} | {} | {} to {} | {} | {} | {} | {} | {} |",
                k + 1,
                x.designation,
                x.id,
                x.topping,
                display::num(x.weight_psf, "psf", 1, sys),
                display::num(x.depth_in, "in", 2, sys),
                x.governing,
                x.ratio,
                x.phi_mn_over_mu,
                x.shear_ratio,
                x.class,
                signed(x.camber_erection, sys),
                signed(x.camber_range.0, sys),
                signed(x.camber_range.1, sys),
                signed(x.camber_final, sys),
                display::num(x.defl_live, "in", 2, sys),
                x.fire,
                display::span(x.member_length_in, sys),
                x.pieces.map_or("-".into(), |p| p.to_string())
            )?;
        }
        let cuts: Vec<(usize, Row)> = if b.bay.case.openings.is_empty() {
            Vec::new()
        } else {
            b.ranking
                .viable
                .iter()
                .take(top)
                .enumerate()
                .map(|(k, r)| (k, row(cat, r, b.bay, sys)))
                .collect()
        };
        if !cuts.is_empty() {
            writeln!(w)?;
            for (k, x) in cuts {
                writeln!(w, "- {} (`{}`): {}", k + 1, x.id, x.openings.join("; "))?;
            }
        }
    }
    Ok(())
}

fn md_tail(w: &mut impl Write, job: &Job) -> io::Result<()> {
    writeln!(w)?;
    writeln!(w, "## Notes")?;
    writeln!(w)?;
    for n in &job.notes {
        writeln!(w, "- {n}")?;
    }
    writeln!(w, "- Camber upward positive (Martin 1977 multipliers); checks per ACI 318-19.")?;
    writeln!(w)?;
    writeln!(w, "## Cautions")?;
    writeln!(w)?;
    for c in super::CAUTIONS {
        writeln!(w, "- **{c}**")?;
    }
    Ok(())
}

fn q(s: &str) -> String {
    if s.contains([',', '"', '\n']) {
        format!("\"{}\"", s.replace('"', "\"\""))
    } else {
        s.to_string()
    }
}

/// The CSV columns of a US run; an SI run renames those with a unit.
const CSV_COLUMNS: &str = "project,bay,rank,section,pattern,designation,topping_in,weight_psf,depth_in,governing,governing_ratio,phi_mn_over_mu,shear_ratio,service_class,camber_erection_in,camber_erection_low_in,camber_erection_high_in,camber_final_in,defl_live_in,fire,member_length_ft,pieces,units_cut";

fn csv_head(w: &mut impl Write, sys: System) -> io::Result<()> {
    let cols: Vec<String> = CSV_COLUMNS.split(',').map(|c| display::key(c, sys)).collect();
    writeln!(w, "{}", cols.join(","))
}

/// A camber or deflection with its sign: "+0.52" (in) or "+13.2" (mm).
fn signed(v: f64, sys: System) -> String {
    let s = display::num(v, "in", 2, sys);
    if s.starts_with('-') { s } else { format!("+{s}") }
}

fn csv_bay(w: &mut impl Write, job: &Job, cat: &Catalog, bay: &Bay, ranking: &BayRanking, top: usize, sys: System) -> io::Result<()> {
    let b = BayList { bay, ranking };
    {
        if b.ranking.viable.is_empty() {
            writeln!(w, "{},{},,,,NO VIABLE MEMBER,,,,,,,,,,,,,,,,,", q(&job.project), q(&b.bay.name))?;
            return Ok(());
        }
        for (k, r) in b.ranking.viable.iter().take(top).enumerate() {
            let x = row(cat, r, b.bay, sys);
            let n = |v: f64, us: &'static str, places: usize| display::num(v, us, places, sys);
            writeln!(
                w,
                "{},{},{},{},{},{},{},{},{},{},{:.3},{:.3},{:.3},{},{},{},{},{},{},{},{},{},{}",
                q(&job.project),
                q(&b.bay.name),
                k + 1,
                q(&r.entry.section.id),
                q(&r.entry.pattern.id),
                q(&x.designation),
                n(r.entry.topping.map_or(0.0, |t| t.get()), "in", 2),
                n(x.weight_psf, "psf", 1),
                n(x.depth_in, "in", 2),
                q(&x.governing),
                x.ratio,
                x.phi_mn_over_mu,
                x.shear_ratio,
                x.class,
                n(x.camber_erection, "in", 3),
                n(x.camber_range.0, "in", 3),
                n(x.camber_range.1, "in", 3),
                n(x.camber_final, "in", 3),
                n(x.defl_live, "in", 3),
                q(&x.fire),
                n(x.member_length_in / 12.0, "ft", 3),
                x.pieces.map_or(String::new(), |p| p.to_string()),
                q(&x.openings.join("; "))
            )?;
        }
    }
    Ok(())
}

/// Spans of a listed member's capacity chart: 60 % to 140 % of the bay's
/// span, ft (the range an engineer moving a support line would look at).
pub fn chart_spans(span_ft: f64) -> Vec<f64> {
    (0..=32).map(|k| span_ft * (0.6 + 0.8 * k as f64 / 32.0)).collect()
}

/// A listed member's capacity chart: the largest variable load the bay's
/// use names (floor live, or on a roof the larger of Lr and S) against
/// span, and the bay's design point.
fn chart(k: usize, r: &Ranked, bay: &Bay, curve: &[crate::select::envelope::LoadLimit], sys: System) -> super::pdf::Chart {
    let (x_unit, y_unit) = (display::unit("ft", sys), display::unit("psf", sys));
    let load = match bay.case.member_use {
        crate::case::Use::Floor => "live load",
        crate::case::Use::Roof => "roof load (larger of Lr, S)",
    };
    super::pdf::Chart {
        title: format!("{}. {}", k + 1, r.entry.label()),
        x_label: format!("span, {x_unit}"),
        y_label: format!("largest {load}, {y_unit}"),
        curve: super::load_curve(curve, sys),
        point: Some((
            display::convert(bay.case.span.in_unit("ft"), "ft", sys).0,
            display::convert(bay.case.varied().in_unit("psf"), "psf", sys).0,
            "design point".into(),
        )),
    }
}

/// The shortlist as a PDF: the text shortlist's header, and for each bay
/// (a new page each) its criteria and members, a capacity chart for each
/// listed member with the bay's design point, then the notes and a
/// signature block; the cautions and page numbers on every page. `rank`
/// ranks a bay as the writer comes to it.
pub fn pdf<'c>(
    job: &Job,
    cat: &'c Catalog,
    top: usize,
    sys: System,
    rank: &mut dyn FnMut(usize, &Bay) -> BayRanking<'c>,
) -> Result<Vec<u8>, String> {
    use super::pdf::{Block, Doc, Paper};
    let text_of = |part: &dyn Fn(&mut Vec<u8>) -> io::Result<()>| -> Result<Vec<String>, String> {
        let mut buf = Vec::new();
        part(&mut buf).map_err(|e| e.to_string())?;
        Ok(String::from_utf8_lossy(&buf)
            .replace('\x0c', "")
            .lines()
            .map(str::to_string)
            .collect())
    };
    let mut blocks = Vec::new();
    let head = text_of(&|b| text_head(b, job, cat, sys))?;
    blocks.push(Block::Heading(head[0].clone()));
    blocks.push(Block::Lines(head[1..].to_vec()));
    let mut seen = Vec::new();
    for (i, bay) in job.bays.iter().enumerate() {
        let r = rank(i, bay);
        let beside = beside_line(cat, job, bay, &r, &mut seen, sys);
        let lines = text_of(&|b| text_bay(b, cat, i, bay, &r, top, sys, beside.as_deref()))?;
        if i > 0 {
            blocks.push(Block::Break);
        }
        // the bay's title line as a heading, the rest as written
        let first = lines.iter().position(|l| !l.trim().is_empty()).unwrap_or(0);
        blocks.push(Block::Heading(lines.get(first).cloned().unwrap_or_default()));
        blocks.push(Block::Lines(lines.iter().skip(first + 1).cloned().collect()));
        let spans = chart_spans(bay.case.span.in_unit("ft"));
        let charts: Vec<_> = r
            .viable
            .iter()
            .take(top)
            .enumerate()
            .map(|(k, m)| chart(k, m, bay, &crate::select::envelope::bay_envelope(cat, bay, &m.entry, &spans), sys))
            .collect();
        if !charts.is_empty() {
            blocks.push(Block::Lines(vec![
                String::new(),
                "  Capacity of each listed member against span (the bay's other loads held), with the bay's design point:".into(),
            ]));
            blocks.push(Block::Charts(charts));
        }
    }
    blocks.push(Block::Lines(text_of(&|b| text_tail(b, job))?));
    blocks.push(Block::Signatures(vec![
        "Prepared by".into(),
        "Reviewed by (supplier's engineer)".into(),
        "Engineer of record".into(),
    ]));
    super::pdf::render(&Doc {
        title: "plankwise — precast member shortlist (preliminary)".into(),
        head_right: format!("{} · {}", job.project, job.date),
        paper: Paper::of(sys),
        blocks,
    })
}

//! The selection commands: rank, envelope, spanmap, shortlist.

use std::io::{self, Write};
use std::path::{Path, PathBuf};

use serde::Serialize;

use plankwise::bay::{Bay, Objective};
use plankwise::catalog::Catalog;
use plankwise::job::Job;
use plankwise::report::shortlist::{self, Format};
use plankwise::select::envelope::{LoadLimit, longest_span, max_live, span_map};
use plankwise::select::{Entry, Ranked, case_for, cross_check, failure_reason, rank_bay, topping_mix};
use plankwise::units::{Length, System, display};

use super::bay::{BayFlags, objective};
use super::{Failure, NONE_VIABLE, OK, UnitsFlag, find_entry, load, print_warnings, write_json};

/// Arguments of `plankwise rank`.
#[derive(Debug, clap::Args)]
pub struct RankArgs {
    /// Catalog file (TOML); the built-in demo catalog when omitted.
    catalog: Option<PathBuf>,
    /// Job file (TOML) with the bays; "demo" for the built-in demo job.
    /// With a job, --objective ranks every bay by that objective; other bay
    /// flags are refused.
    #[arg(long)]
    job: Option<PathBuf>,
    #[command(flatten)]
    bay: BayFlags,
    /// How many viable and failing entries to list per bay (1 or more).
    #[arg(long, default_value_t = 10, value_parser = clap::value_parser!(u32).range(1..))]
    top: u32,
    /// Print JSON.
    #[arg(long, conflicts_with = "csv")]
    json: bool,
    /// Print CSV.
    #[arg(long)]
    csv: bool,
    #[command(flatten)]
    units: UnitsFlag,
}

/// Arguments of `plankwise envelope`.
#[derive(Debug, clap::Args)]
pub struct EnvelopeArgs {
    /// Catalog file (TOML); the built-in demo catalog when omitted.
    catalog: Option<PathBuf>,
    /// Section id.
    #[arg(long)]
    section: String,
    /// Strand pattern id.
    #[arg(long)]
    pattern: String,
    /// Span range, e.g. "20 ft..40 ft".
    #[arg(long, default_value = "20 ft..40 ft")]
    spans: String,
    /// Step between spans.
    #[arg(long, default_value = "2 ft")]
    step: String,
    #[command(flatten)]
    bay: BayFlags,
    /// Print JSON.
    #[arg(long, conflicts_with = "csv")]
    json: bool,
    /// Print CSV.
    #[arg(long)]
    csv: bool,
    #[command(flatten)]
    units: UnitsFlag,
}

/// Arguments of `plankwise spanmap`.
#[derive(Debug, clap::Args)]
pub struct SpanmapArgs {
    /// Catalog file (TOML); the built-in demo catalog when omitted.
    catalog: Option<PathBuf>,
    /// Job file; with --bay, take that bay's loads and criteria.
    #[arg(long, requires = "bay_name")]
    job: Option<PathBuf>,
    /// Bay name in the job.
    #[arg(long = "bay")]
    bay_name: Option<String>,
    /// Span range, e.g. "16 ft..40 ft".
    #[arg(long, default_value = "16 ft..40 ft")]
    spans: String,
    /// Sampling step before bisection of each change.
    #[arg(long, default_value = "1 ft")]
    step: String,
    #[command(flatten)]
    flags: BayFlags,
    /// Print JSON.
    #[arg(long)]
    json: bool,
    #[command(flatten)]
    units: UnitsFlag,
}

/// Arguments of `plankwise capacity`.
#[derive(Debug, clap::Args)]
pub struct CapacityArgs {
    /// Catalog file (TOML); the built-in demo catalog when omitted.
    catalog: Option<PathBuf>,
    /// Span range of the largest loads, e.g. "20 ft..40 ft"; the longest
    /// spans are sought within it.
    #[arg(long, default_value = "12 ft..60 ft")]
    spans: String,
    /// Step between spans.
    #[arg(long, default_value = "2 ft")]
    step: String,
    /// Load levels for the longest spans (the load the bay's use names:
    /// floor live, or roof Lr = S), e.g. "40 psf, 100 psf" (default: 40, 60,
    /// 80, 100, 150 psf on a floor; 20, 30, 40, 60 psf on a roof).
    #[arg(long)]
    loads: Option<String>,
    /// Only entries whose depth with topping lies in this range, e.g. "8 in..12 in".
    #[arg(long)]
    depth: Option<String>,
    #[command(flatten)]
    bay: BayFlags,
    /// text, md, csv, json or pdf (default: from the extension of -o, else text).
    #[arg(long, value_enum)]
    format: Option<OutFormat>,
    /// Write to this file instead of the standard output.
    #[arg(short = 'o', long = "output")]
    output: Option<PathBuf>,
    /// Replace an existing output file.
    #[arg(long, requires = "output")]
    force: bool,
    #[command(flatten)]
    units: UnitsFlag,
}

/// An output format, as `--format` spells it.
#[derive(Debug, Clone, Copy, PartialEq, Eq, clap::ValueEnum)]
pub enum OutFormat {
    /// Plain text.
    Text,
    /// Markdown.
    Md,
    /// Comma-separated values.
    Csv,
    /// JSON.
    Json,
    /// PDF.
    Pdf,
}

impl OutFormat {
    /// The format a file's extension names, if any.
    pub fn of_path(p: &Path) -> Option<OutFormat> {
        use plankwise::report::FileKind;
        Some(match FileKind::of_path(p)? {
            FileKind::Text => OutFormat::Text,
            FileKind::Markdown => OutFormat::Md,
            FileKind::Csv => OutFormat::Csv,
            FileKind::Json => OutFormat::Json,
            FileKind::Pdf => OutFormat::Pdf,
        })
    }
}

/// Load levels as typed: "40 psf, 60 psf".
fn loads(text: &str) -> Result<Vec<f64>, Failure> {
    let mut v = Vec::new();
    for part in text.split(',').map(str::trim).filter(|p| !p.is_empty()) {
        let q = plankwise::units::AreaLoad::parse(part).map_err(|e| Failure::Message(format!("--loads: {e}")))?;
        let psf = q.in_unit("psf");
        if !(0.0..=2000.0).contains(&psf) {
            return Err(Failure::Message(format!("--loads: '{part}' must lie from 0 to 2000 psf")));
        }
        v.push(psf);
    }
    if v.is_empty() || v.len() > 12 {
        return Err(Failure::Message(format!(
            "--loads: '{text}' must give 1 to 12 loads, e.g. \"40 psf, 100 psf\""
        )));
    }
    Ok(v)
}

/// `plankwise capacity`: the capacity table of the catalog.
pub fn capacity(a: &CapacityArgs) -> Result<i32, Failure> {
    let (cat, _) = load(a.catalog.as_ref())?;
    print_warnings(&cat);
    let spans = range(&a.spans, &a.step)?;
    let mut flags = a.bay.clone();
    if flags.gives("span") {
        return Err(Failure::Message("--span: the capacity table takes its spans from --spans".into()));
    }
    flags.given.push(("span", format!("{} ft", spans[0])));
    let bay = flags.to_bay(&cat)?;
    check_job(&cat, std::slice::from_ref(&bay))?;
    let roof = bay.case.member_use == plankwise::case::Use::Roof;
    let levels = match &a.loads {
        Some(t) => loads(t)?,
        None if roof => vec![20.0, 30.0, 40.0, 60.0],
        None => vec![40.0, 60.0, 80.0, 100.0, 150.0],
    };
    let depth = match &a.depth {
        None => None,
        Some(t) => {
            let (lo, hi) = t
                .split_once("..")
                .ok_or_else(|| Failure::Message(format!("--depth: '{t}' should read like \"8 in..12 in\"")))?;
            let p = |x: &str| Length::parse(x).map_err(|e| Failure::Message(format!("--depth: {e}")));
            let (lo, hi) = (p(lo)?.get(), p(hi)?.get());
            if hi < lo {
                return Err(Failure::Message(format!("--depth: '{t}' must run upward")));
            }
            Some((lo, hi))
        }
    };
    let req = plankwise::select::capacity::Request {
        spans_ft: spans,
        loads_psf: levels,
        depth_in: depth,
    };
    let format = a
        .format
        .or_else(|| a.output.as_deref().and_then(OutFormat::of_path))
        .unwrap_or(OutFormat::Text);
    let sys = a.units.system(None, &cat);
    // refused before any work
    let target = match &a.output {
        None => None,
        Some(o) => {
            let inputs: Vec<&Path> = a.catalog.iter().map(|p| p.as_path()).collect();
            Some(plankwise::files::writable(o, &inputs, a.force).map_err(|e| Failure::Message(format!("-o: '{}' {e}", o.display())))?)
        }
    };
    let rows = plankwise::select::capacity::table(&cat, &bay, &req);
    let load = |q: plankwise::units::AreaLoad| display::with_unit(q.in_unit("psf"), "psf", 0, sys);
    let heading = plankwise::report::capacity::Heading {
        catalog: &cat.meta.name,
        hash: &cat.hash,
        held: format!(
            "SDL {}{}{}",
            load(bay.case.sdl),
            if bay.toppings.iter().any(|t| t.is_some()) {
                ", toppings as listed"
            } else {
                ""
            },
            bay.case.fire_rating.map_or(String::new(), |h| format!(", fire rating {h} h"))
        ),
        varied: if roof { "roof (Lr = S)" } else { "live" },
    };
    let write = |w: &mut dyn Write| -> io::Result<()> {
        let mut w = w;
        match format {
            OutFormat::Text => plankwise::report::capacity::text(&mut w, &heading, &rows, sys),
            OutFormat::Md => plankwise::report::capacity::markdown(&mut w, &heading, &rows, sys),
            OutFormat::Csv => plankwise::report::capacity::csv(&mut w, &rows, sys),
            OutFormat::Json => {
                let v = serde_json::to_value(&rows).map_err(io::Error::from)?;
                serde_json::to_writer_pretty(&mut w, &display::json(v, sys)).map_err(io::Error::from)?;
                writeln!(w)
            }
            OutFormat::Pdf => w.write_all(&plankwise::report::capacity::pdf(&heading, &rows, sys).map_err(io::Error::other)?),
        }
    };
    match target {
        None => write(&mut io::stdout().lock())?,
        Some(real) => {
            let shown = a.output.as_ref().map_or(String::new(), |o| o.display().to_string());
            plankwise::files::write_atomic_with(&real, |mut w| write(&mut w))
                .map_err(|e| Failure::Message(format!("-o: '{shown}' cannot be written: {e}")))?;
            eprintln!("plankwise: wrote {shown} ({} entries)", rows.len());
        }
    }
    Ok(OK)
}

/// Arguments of `plankwise shortlist`.
#[derive(Debug, clap::Args)]
pub struct ShortlistArgs {
    /// Catalog file (TOML); the built-in demo catalog when omitted.
    catalog: Option<PathBuf>,
    /// Job file (TOML); "demo" for the built-in demo job.
    #[arg(long)]
    job: PathBuf,
    /// Output file.
    #[arg(short = 'o', long = "output")]
    output: PathBuf,
    /// text, md, csv or pdf (default: from the extension of -o — .md, .csv, .pdf — else text).
    #[arg(long, value_parser = ["text", "md", "csv", "pdf"])]
    format: Option<String>,
    /// Members listed per bay (1 or more).
    #[arg(long, default_value_t = 5, value_parser = clap::value_parser!(u32).range(1..))]
    top: u32,
    /// Replace an existing output file.
    #[arg(long)]
    force: bool,
    #[command(flatten)]
    units: UnitsFlag,
}

/// A job file, or with "demo" the built-in demo job of the catalog.
fn load_job(path: &Path, cat: &Catalog) -> Result<(Job, String), Failure> {
    if path.as_os_str() == "demo" {
        let (job, name) = plankwise::job::demo_for(cat)?;
        return Ok((job, name.into()));
    }
    Ok((Job::load(path)?, path.display().to_string()))
}

/// With a job file the bays come from it: bay flags would be ignored, so
/// they are refused — except the objective, which ranks every bay.
/// The bays, the objective the flags impose and the job's display units.
type Bays = (Vec<Bay>, Option<Objective>, Option<System>);

fn job_or_flags(job: Option<&PathBuf>, flags: &BayFlags, cat: &Catalog) -> Result<Bays, Failure> {
    let obj = flags.given.iter().find(|(k, _)| *k == "objective").map(|(_, v)| v.as_str());
    match job {
        Some(j) => {
            let ignored: Vec<String> = flags
                .given
                .iter()
                .filter(|(k, _)| *k != "objective")
                .map(|(k, _)| format!("--{}", plankwise::criteria::find(k).and_then(|c| c.flag).unwrap_or(k)))
                .chain((!flags.line_dead.is_empty()).then(|| "--line-dead".to_string()))
                .chain((!flags.line_live.is_empty()).then(|| "--line-live".to_string()))
                .collect();
            if !ignored.is_empty() {
                return Err(Failure::Message(format!(
                    "{} describe one bay, but --job gives the bays; put them in the job file, or leave out --job",
                    ignored.join(", ")
                )));
            }
            let job = load_job(j, cat)?.0;
            Ok((job.bays, objective(obj)?, job.units))
        }
        None => Ok((vec![flags.to_bay(cat)?], None, None)),
    }
}

fn check_job(cat: &Catalog, bays: &[Bay]) -> Result<(), Failure> {
    let problems = cross_check(cat, bays);
    if problems.is_empty() {
        Ok(())
    } else {
        Err(Failure::Message(problems.join("\n           ")))
    }
}

fn range(text: &str, step: &str) -> Result<Vec<f64>, Failure> {
    let (a, b) = text
        .split_once("..")
        .ok_or_else(|| Failure::Message(format!("--spans: '{text}' should read like \"20 ft..40 ft\"")))?;
    let p = |t: &str| Length::parse(t).map_err(|e| Failure::Message(format!("--spans: {e}")));
    let (a, b) = (p(a)?.get() / 12.0, p(b)?.get() / 12.0);
    let s = Length::parse(step).map_err(|e| Failure::Message(format!("--step: {e}")))?.get() / 12.0;
    if !(a > 1.0 && b > a && b <= 200.0) || s <= 0.0 || (b - a) / s > 2000.0 {
        return Err(Failure::Message(format!(
            "--spans: '{text}' must run upward between 1 ft and 200 ft, at most 2000 steps of '{step}'"
        )));
    }
    let mut v = Vec::new();
    let mut x = a;
    while x <= b + 1e-9 {
        v.push(x);
        x += s;
    }
    Ok(v)
}

#[derive(Serialize)]
struct EntryJson {
    rank: usize,
    viable: bool,
    section: String,
    pattern: String,
    topping_in: f64,
    weight_psf: f64,
    depth_in: f64,
    strand_in2_per_ft: f64,
    price_per_ft2: Option<f64>,
    governing: String,
    governing_ratio: f64,
    first_failure: Option<String>,
    first_failure_ratio: Option<f64>,
    reason: String,
}

fn entry_json(rank: usize, r: &Ranked) -> EntryJson {
    let f = r.verdict.first_failure();
    EntryJson {
        rank,
        viable: r.verdict.viable,
        section: r.entry.section.id.clone(),
        pattern: r.entry.pattern.id.clone(),
        topping_in: r.entry.topping.map_or(0.0, |t| t.get()),
        weight_psf: r.metrics.weight_psf,
        depth_in: r.metrics.depth_in,
        strand_in2_per_ft: r.metrics.strand_in2_per_ft,
        price_per_ft2: r.metrics.price_per_ft2,
        governing: r.verdict.governing().info.id.to_string(),
        governing_ratio: r.verdict.governing().ratio,
        first_failure: f.map(|c| c.info.id.to_string()),
        first_failure_ratio: f.map(|c| c.ratio),
        reason: failure_reason(r),
    }
}

#[derive(Serialize)]
struct BayJson {
    name: String,
    objective: &'static str,
    viable_count: usize,
    failing_count: usize,
    viable: Vec<EntryJson>,
    failing: Vec<EntryJson>,
}

/// `plankwise rank`: each bay is ranked and printed in turn, so a job of
/// thousands of bays holds one bay's ranking at a time.
pub fn rank(a: &RankArgs) -> Result<i32, Failure> {
    let (cat, _) = load(a.catalog.as_ref())?;
    print_warnings(&cat);
    let (bays, obj, job_units) = job_or_flags(a.job.as_ref(), &a.bay, &cat)?;
    check_job(&cat, &bays)?;
    let sys = display::choose(a.units.flag(), job_units, cat.meta.units);
    let top = a.top as usize;
    let mut out = io::stdout().lock();
    let mut none: Vec<&str> = Vec::new();
    if a.json {
        write!(out, "[")?;
    } else if a.csv {
        let cols: Vec<String> = "bay,rank,viable,section,pattern,topping_in,weight_psf,depth_in,strand_in2_per_ft,governing,governing_ratio,first_failure,first_failure_ratio"
            .split(',')
            .map(|c| display::key(c, sys))
            .collect();
        writeln!(out, "{}", cols.join(","))?;
    }
    for (n, b) in bays.iter().enumerate() {
        let r = rank_bay(&cat, b, obj);
        if r.viable.is_empty() {
            none.push(b.name.as_str());
        }
        if a.json {
            let v = BayJson {
                name: b.name.clone(),
                objective: obj.unwrap_or(b.objective).name(),
                viable_count: r.viable.len(),
                failing_count: r.failing.len(),
                viable: r.viable.iter().take(top).enumerate().map(|(i, x)| entry_json(i + 1, x)).collect(),
                failing: r.failing.iter().take(top).enumerate().map(|(i, x)| entry_json(i + 1, x)).collect(),
            };
            writeln!(out, "{}", if n == 0 { "" } else { "," })?;
            let v = display::json(serde_json::to_value(&v).map_err(io::Error::from)?, sys);
            serde_json::to_writer_pretty(&mut out, &v).map_err(io::Error::from)?;
        } else if a.csv {
            for (i, x) in r.viable.iter().take(top).chain(r.failing.iter().take(top)).enumerate() {
                let e = entry_json(i + 1, x);
                let n = |v: f64, us: &'static str, places: usize| display::num(v, us, places, sys);
                writeln!(
                    out,
                    "\"{}\",{},{},{},{},{},{},{},{},{},{:.4},{},{}",
                    b.name.replace('"', "\"\""),
                    e.rank,
                    e.viable,
                    e.section,
                    e.pattern,
                    n(e.topping_in, "in", 2),
                    n(e.weight_psf, "psf", 2),
                    n(e.depth_in, "in", 2),
                    n(e.strand_in2_per_ft, "in²/ft", 5),
                    e.governing,
                    e.governing_ratio,
                    e.first_failure.unwrap_or_default(),
                    e.first_failure_ratio.map_or(String::new(), |r| format!("{r:.4}"))
                )?;
            }
        } else {
            writeln!(
                out,
                "Bay '{}' — span {}; objective {}",
                b.name,
                display::span(b.case.span.get(), sys),
                obj.unwrap_or(b.objective).name()
            )?;
            writeln!(out, "  {} viable of {} entries", r.viable.len(), r.viable.len() + r.failing.len())?;
            if !r.viable.is_empty() {
                writeln!(
                    out,
                    "  {:>3} {:<42} {:>6} {:>7} {:<24} {:>6}",
                    "#",
                    "entry",
                    display::unit("psf", sys),
                    format!("h {}", display::unit("in", sys)),
                    "governing",
                    "ratio"
                )?;
            }
            for (i, x) in r.viable.iter().take(top).enumerate() {
                writeln!(
                    out,
                    "  {:>3} {:<42} {:>6} {:>7} {:<24} {:>6.3}",
                    i + 1,
                    display::localize(&x.entry.label(), sys),
                    display::num(x.metrics.weight_psf, "psf", 1, sys),
                    display::num(x.metrics.depth_in, "in", 2, sys),
                    x.verdict.governing().info.id,
                    x.verdict.governing().ratio
                )?;
            }
            if r.viable.is_empty() {
                writeln!(out, "  NO VIABLE MEMBER. Nearest misses:")?;
            } else if !r.failing.is_empty() {
                writeln!(out, "  not viable (first failing check, in order of importance):")?;
            }
            for x in r.failing.iter().take(top) {
                writeln!(
                    out,
                    "      {:<42} {}",
                    display::localize(&x.entry.label(), sys),
                    display::localize(&failure_reason(x), sys)
                )?;
            }
            writeln!(out)?;
        }
    }
    if a.json {
        writeln!(out, "\n]")?;
    } else if !a.csv {
        plankwise::report::write_cautions(&mut out)?;
    }
    if !none.is_empty() {
        eprintln!("plankwise: no viable member for: {}", none.join(", "));
        return Ok(NONE_VIABLE);
    }
    Ok(OK)
}

/// `plankwise envelope`.
pub fn envelope(a: &EnvelopeArgs) -> Result<i32, Failure> {
    let (cat, _) = load(a.catalog.as_ref())?;
    print_warnings(&cat);
    let (section, pattern) = find_entry(&cat, &a.section, &a.pattern)?;
    let spans = range(&a.spans, &a.step)?;
    let mut flags = a.bay.clone();
    if !flags.gives("span") {
        flags.given.push(("span", format!("{} ft", spans[0])));
    }
    let bay = flags.to_bay(&cat)?;
    let entry = Entry {
        section,
        pattern,
        mix: section.mix(&cat),
        topping: bay.toppings[0],
    };
    let base = case_for(&bay, entry.topping, &topping_mix(&cat, &bay));
    let limits: Vec<LoadLimit> = spans
        .iter()
        .map(|&s| {
            let mut c = base.clone();
            c.span = Length::from_unit(s, "ft");
            max_live(&entry, &c)
        })
        .collect();
    let cap_ft = pattern
        .max_length
        .or(section.max_length)
        .map_or(120.0, |m| (m.get() - base.bearing.get()) / 12.0);
    let longest = longest_span(&entry, &base, cap_ft);
    let sys = a.units.system(None, &cat);
    let mut out = io::stdout().lock();
    if a.json {
        #[derive(Serialize)]
        struct EnvJson<'a> {
            section: &'a str,
            pattern: &'a str,
            topping_in: f64,
            /// The largest live load at each span.
            limits: &'a [LoadLimit],
            longest_span_ft: Option<f64>,
            longest_span_under_live_psf: f64,
        }
        write_json(
            &mut out,
            &EnvJson {
                section: &section.id,
                pattern: &pattern.id,
                topping_in: entry.topping.map_or(0.0, |t| t.get()),
                limits: &limits,
                longest_span_ft: longest,
                longest_span_under_live_psf: base.live.in_unit("psf"),
            },
            sys,
        )?;
    } else if a.csv {
        writeln!(
            out,
            "{},{},governing,ratio",
            display::key("span_ft", sys),
            display::key("live_psf", sys)
        )?;
        for l in &limits {
            writeln!(
                out,
                "{},{},{},{:.6}",
                display::num(l.span_ft, "ft", 3, sys),
                l.live_psf.map_or(String::new(), |q| display::num(q, "psf", 2, sys)),
                l.governing,
                l.ratio
            )?;
        }
    } else {
        writeln!(
            out,
            "Envelope of {} (SDL {} held)",
            display::localize(&entry.label(), sys),
            display::with_unit(base.sdl.in_unit("psf"), "psf", 1, sys)
        )?;
        writeln!(
            out,
            "  {:>10} {:>12}  limited by",
            format!("span {}", display::unit("ft", sys)),
            format!("live {}", display::unit("psf", sys))
        )?;
        for l in &limits {
            writeln!(
                out,
                "  {:>10} {:>12}  {}",
                display::span(l.span_ft * 12.0, sys),
                l.live_psf
                    .map_or("none".into(), |q| if q >= plankwise::select::envelope::MAX_LIVE_PSF {
                        format!("> {}", display::num(plankwise::select::envelope::MAX_LIVE_PSF, "psf", 0, sys))
                    } else {
                        display::num(q, "psf", 1, sys)
                    }),
                if l.live_psf.is_none() {
                    format!("{} fails without live load", l.governing)
                } else {
                    l.governing.clone()
                }
            )?;
        }
        writeln!(
            out,
            "  longest span under {} live: {}",
            display::with_unit(base.live.in_unit("psf"), "psf", 1, sys),
            longest.map_or(format!("none from {} up", display::span(48.0, sys)), |s| display::span(
                s * 12.0,
                sys
            ))
        )?;
        writeln!(out)?;
        plankwise::report::write_cautions(&mut out)?;
    }
    Ok(OK)
}

/// `plankwise spanmap`.
pub fn spanmap(a: &SpanmapArgs) -> Result<i32, Failure> {
    let (cat, _) = load(a.catalog.as_ref())?;
    print_warnings(&cat);
    let spans = range(&a.spans, &a.step)?;
    let mut job_units = None;
    let bay = match (&a.job, &a.bay_name) {
        (Some(j), Some(name)) => {
            let job = load_job(j, &cat)?.0;
            job_units = job.units;
            let names: Vec<&str> = job.bays.iter().map(|b| b.name.as_str()).collect();
            job.bays.iter().find(|b| &b.name == name).cloned().ok_or_else(|| {
                Failure::Message(format!(
                    "--bay: no bay '{name}'{}; the job has: {}",
                    plankwise::input::diag::suggestion(name, names.iter().copied()),
                    names.join(", ")
                ))
            })?
        }
        _ => {
            let mut f = a.flags.clone();
            if !f.gives("span") {
                f.given.push(("span", format!("{} ft", spans[0])));
            }
            f.to_bay(&cat)?
        }
    };
    check_job(&cat, std::slice::from_ref(&bay))?;
    let obj = match a.flags.given.iter().find(|(k, _)| *k == "objective") {
        Some((_, o)) if a.job.is_some() => objective(Some(o))?.unwrap_or(bay.objective),
        _ => bay.objective,
    };
    let step = spans.get(1).map_or(1.0, |s| s - spans[0]);
    let runs = span_map(&cat, &bay, spans[0], *spans.last().unwrap_or(&spans[0]), step, obj);
    let sys = display::choose(a.units.flag(), job_units, cat.meta.units);
    let mut out = io::stdout().lock();
    if a.json {
        write_json(&mut out, &runs, sys)?;
    } else {
        writeln!(out, "Best entry by span for '{}' (objective {})", bay.name, obj.name())?;
        for r in &runs {
            writeln!(
                out,
                "  {:>10} – {:>10}  {}",
                display::span(r.from_ft * 12.0, sys),
                display::span(r.to_ft * 12.0, sys),
                r.best.as_deref().map_or("no viable member".into(), |b| display::localize(b, sys))
            )?;
        }
        writeln!(out)?;
        plankwise::report::write_cautions(&mut out)?;
    }
    Ok(OK)
}

/// `plankwise shortlist`.
pub fn shortlist(a: &ShortlistArgs) -> Result<i32, Failure> {
    let (cat, _) = load(a.catalog.as_ref())?;
    print_warnings(&cat);
    let (job, _) = load_job(&a.job, &cat)?;
    check_job(&cat, &job.bays)?;
    let sys = a.units.system(Some(&job), &cat);
    let named = a.format.clone().unwrap_or_else(|| match OutFormat::of_path(&a.output) {
        Some(OutFormat::Md) => "md".into(),
        Some(OutFormat::Csv) => "csv".into(),
        Some(OutFormat::Pdf) => "pdf".into(),
        _ => "text".into(),
    });
    let format = match named.as_str() {
        "text" | "txt" => Format::Text,
        "md" | "markdown" => Format::Markdown,
        "csv" => Format::Csv,
        "pdf" => Format::Pdf,
        other => {
            return Err(Failure::Message(format!(
                "--format: '{other}' is not a format; use text, md, csv or pdf"
            )));
        }
    };
    let inputs: Vec<&Path> = a
        .catalog
        .iter()
        .map(|p| p.as_path())
        .chain(std::iter::once(a.job.as_path()))
        .collect();
    // refused before any work: an input, not a regular file, or there already
    plankwise::files::writable(&a.output, &inputs, a.force).map_err(|e| Failure::Message(format!("-o: '{}' {e}", a.output.display())))?;
    // each bay ranked as the writer comes to it, straight into the file:
    // one ranking held at a time
    let mut none: Vec<String> = Vec::new();
    let real = plankwise::files::writable(&a.output, &inputs, a.force)
        .map_err(|e| Failure::Message(format!("-o: '{}' {e}", a.output.display())))?;
    let mut rank = |_: usize, bay: &plankwise::bay::Bay| {
        let r = rank_bay(&cat, bay, None);
        if r.viable.is_empty() {
            none.push(bay.name.clone());
        }
        r
    };
    let written = plankwise::files::write_atomic_with(&real, |mut w| {
        shortlist::write_each(&mut w, format, &job, &cat, a.top as usize, sys, &mut rank)
    });
    written.map_err(|e| Failure::Message(format!("-o: '{}' cannot be written: {e}", a.output.display())))?;
    eprintln!("plankwise: wrote {} ({} bays)", a.output.display(), job.bays.len());
    if !none.is_empty() {
        eprintln!("plankwise: no viable member for: {}", none.join(", "));
        return Ok(NONE_VIABLE);
    }
    Ok(OK)
}

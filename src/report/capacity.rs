//! The capacity table of a catalog, printed: one row per entry, one
//! column per load level, each cell the longest span the entry carries that
//! load over and the check that ends it (text, Markdown, CSV; JSON is the
//! rows themselves, with the largest load at each span too).

use std::io::{self, Write};

use crate::select::capacity::CapacityRow;
use crate::units::{System, display};

/// What the table is of, for its heading.
pub struct Heading<'a> {
    /// Catalog name.
    pub catalog: &'a str,
    /// Catalog content hash.
    pub hash: &'a str,
    /// The loads held, in words.
    pub held: String,
    /// The load varied: "live" or "roof (Lr = S)".
    pub varied: &'a str,
}

fn cell(r: &crate::select::capacity::Reach, sys: System) -> String {
    match (r.longest_span_ft, &r.stopped_by) {
        (None, Some(c)) => format!("none ({c})"),
        (None, None) => "none".into(),
        (Some(s), Some(c)) => format!("{} {c}", display::span(s * 12.0, sys)),
        (Some(s), None) => format!("{} (end of range)", display::span(s * 12.0, sys)),
    }
}

fn load_head(q: f64, sys: System) -> String {
    display::with_unit(q, "psf", if sys == System::Si { 2 } else { 0 }, sys)
}

/// Write the table as text.
pub fn text(w: &mut impl Write, h: &Heading, rows: &[CapacityRow], sys: System) -> io::Result<()> {
    writeln!(w, "Capacity of '{}' (content hash {})", h.catalog, h.hash)?;
    writeln!(
        w,
        "Longest span at each {} load, and the check that ends it; {} held",
        h.varied, h.held
    )?;
    let loads: Vec<f64> = rows.first().map_or(Vec::new(), |r| r.reach.iter().map(|x| x.load_psf).collect());
    let cw = 30;
    write!(
        w,
        "{:<42} {:>7} {:>6}",
        "entry",
        format!("h {}", display::unit("in", sys)),
        display::unit("psf", sys)
    )?;
    for q in &loads {
        write!(w, "  {:<cw$}", load_head(*q, sys))?;
    }
    writeln!(w)?;
    for r in rows {
        write!(
            w,
            "{:<42} {:>7} {:>6}",
            display::localize(&r.entry, sys),
            display::num(r.depth_in, "in", 1, sys),
            display::num(r.weight_psf, "psf", 1, sys)
        )?;
        for x in &r.reach {
            write!(w, "  {:<cw$}", cell(x, sys))?;
        }
        writeln!(w)?;
    }
    writeln!(w)?;
    writeln!(
        w,
        "Each cell: the longest span (to 0.01 ft) at which every check passes with that load; the check named fails just beyond it. The span range and the catalog's production limit end a row's reach."
    )?;
    writeln!(w)?;
    super::write_cautions(w)
}

/// Write the table as Markdown.
pub fn markdown(w: &mut impl Write, h: &Heading, rows: &[CapacityRow], sys: System) -> io::Result<()> {
    writeln!(w, "# Capacity of {}", h.catalog)?;
    writeln!(w)?;
    writeln!(
        w,
        "Longest span at each {} load, and the check that ends it; {} held. Catalog content hash `{}`.",
        h.varied, h.held, h.hash
    )?;
    writeln!(w)?;
    let loads: Vec<f64> = rows.first().map_or(Vec::new(), |r| r.reach.iter().map(|x| x.load_psf).collect());
    write!(w, "| entry | h {} | {} |", display::unit("in", sys), display::unit("psf", sys))?;
    for q in &loads {
        write!(w, " {} |", load_head(*q, sys))?;
    }
    writeln!(w)?;
    writeln!(w, "|---|---|---|{}", "---|".repeat(loads.len()))?;
    for r in rows {
        write!(
            w,
            "| `{}` | {} | {} |",
            r.entry,
            display::num(r.depth_in, "in", 1, sys),
            display::num(r.weight_psf, "psf", 1, sys)
        )?;
        for x in &r.reach {
            write!(w, " {} |", cell(x, sys))?;
        }
        writeln!(w)?;
    }
    writeln!(w)?;
    for c in super::CAUTIONS {
        writeln!(w, "- **{c}**")?;
    }
    Ok(())
}

/// Write the table as CSV: one line per entry and load level.
pub fn csv(w: &mut impl Write, rows: &[CapacityRow], sys: System) -> io::Result<()> {
    let cols: Vec<String> = "entry,section,pattern,topping_in,depth_in,weight_psf,load_psf,longest_span_ft,stopped_by"
        .split(',')
        .map(|c| display::key(c, sys))
        .collect();
    writeln!(w, "{}", cols.join(","))?;
    let n = |v: f64, us: &'static str, places: usize| display::num(v, us, places, sys);
    for r in rows {
        for x in &r.reach {
            writeln!(
                w,
                "\"{}\",{},{},{},{},{},{},{},{}",
                r.entry.replace('"', "\"\""),
                r.section,
                r.pattern,
                n(r.topping_in, "in", 2),
                n(r.depth_in, "in", 2),
                n(r.weight_psf, "psf", 2),
                n(x.load_psf, "psf", 2),
                x.longest_span_ft.map_or(String::new(), |s| n(s, "ft", 3)),
                x.stopped_by.clone().unwrap_or_default()
            )?;
        }
    }
    Ok(())
}

/// The table as a PDF: for each entry its depth and weight, and at each
/// load level the longest span and the check that ends it, one line each
/// (a portrait page has no room for the load levels side by side); then
/// each entry's largest load against span as a chart.
pub fn pdf(h: &Heading, rows: &[CapacityRow], sys: System) -> Result<Vec<u8>, String> {
    use super::pdf::{Block, Chart, Doc, Paper};
    let mut lines = vec![
        format!("Catalog   {} (content hash {})", h.catalog, h.hash),
        format!("Basis     ACI 318-19; longest span at each {} load; {} held", h.varied, h.held),
        String::new(),
    ];
    for r in rows {
        lines.push(format!(
            "{} — h {}, {}",
            display::localize(&r.entry, sys),
            display::with_unit(r.depth_in, "in", 1, sys),
            display::with_unit(r.weight_psf, "psf", 1, sys)
        ));
        for x in &r.reach {
            lines.push(format!("    at {:>9}: {}", load_head(x.load_psf, sys), cell(x, sys)));
        }
    }
    lines.push(String::new());
    lines.push(
        "Each line: the longest span (to 0.01 ft) at which every check passes with that load; the check named fails just beyond it. The span range and the catalog's production limit end an entry's reach."
            .into(),
    );
    let (x_unit, y_unit) = (display::unit("ft", sys), display::unit("psf", sys));
    let charts: Vec<Chart> = rows
        .iter()
        .filter(|r| !r.limits.is_empty())
        .map(|r| Chart {
            title: display::localize(&r.entry, sys),
            x_label: format!("span, {x_unit}"),
            y_label: format!("largest {} load, {y_unit}", h.varied),
            curve: super::load_curve(&r.limits, sys),
            point: None,
        })
        .collect();
    let mut blocks = vec![Block::Heading(format!("CAPACITY OF '{}'", h.catalog)), Block::Lines(lines)];
    if !charts.is_empty() {
        blocks.push(Block::Break);
        blocks.push(Block::Heading("Largest load against span, each entry".into()));
        blocks.push(Block::Charts(charts));
    }
    super::pdf::render(&Doc {
        title: "plankwise — capacity table (preliminary)".into(),
        head_right: h.catalog.to_string(),
        paper: Paper::of(sys),
        blocks,
    })
}

//! Printers over `impl Write`: plain text for people, JSON for scripts.

pub mod capacity;
pub mod check;
pub mod pdf;
pub mod sheet;
pub mod shortlist;

use std::io::{self, Write};

use crate::catalog::{Catalog, Severity};
use crate::units::{System, display};

/// The cautions printed with every result.
pub const CAUTIONS: &[&str] = &[
    "This is a preliminary selection aid, not a design.",
    "The supplier's engineer and the engineer of record make the final design.",
    "Local codes and licensed practice govern.",
];

/// What kind of file a path names by its extension, case aside: the one
/// rule every route that writes a report (each command's `-o`, the UI's
/// shortlist and sheet prompts) follows.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum FileKind {
    /// `.txt`, `.text`.
    Text,
    /// `.md`, `.markdown`.
    Markdown,
    /// `.csv`.
    Csv,
    /// `.json`.
    Json,
    /// `.pdf`.
    Pdf,
}

impl FileKind {
    /// The kind a file's extension names (None: no extension, or one of no kind).
    pub fn of_path(p: &std::path::Path) -> Option<FileKind> {
        match p.extension()?.to_str()?.to_ascii_lowercase().as_str() {
            "txt" | "text" => Some(FileKind::Text),
            "md" | "markdown" => Some(FileKind::Markdown),
            "csv" => Some(FileKind::Csv),
            "json" => Some(FileKind::Json),
            "pdf" => Some(FileKind::Pdf),
            _ => None,
        }
    }
}

/// A capacity curve as a chart draws it: (span, largest load) in the
/// display units, the load absent where the member fails without it.
pub fn load_curve(limits: &[crate::select::envelope::LoadLimit], sys: System) -> Vec<(f64, Option<f64>)> {
    limits
        .iter()
        .map(|l| {
            (
                display::convert(l.span_ft, "ft", sys).0,
                l.live_psf.map(|q| display::convert(q, "psf", sys).0),
            )
        })
        .collect()
}

/// Write the cautions, one per line, with a leading marker.
pub fn write_cautions(w: &mut impl Write) -> io::Result<()> {
    for c in CAUTIONS {
        writeln!(w, "  ! {c}")?;
    }
    Ok(())
}

/// One-paragraph summary of a catalog: name, producer, counts, warnings.
pub fn write_summary(w: &mut impl Write, cat: &Catalog, file: &str) -> io::Result<()> {
    let warnings = cat.warnings.iter().filter(|p| p.severity == Severity::Warning).count();
    writeln!(w, "Catalog  {}", cat.meta.name)?;
    if !cat.meta.producer.is_empty() {
        writeln!(w, "Producer {}", cat.meta.producer)?;
    }
    writeln!(w, "File     {file} (hash {})", cat.hash)?;
    writeln!(w, "Basis    {}", cat.meta.code)?;
    writeln!(
        w,
        "Contents {} mixes, {} strand kinds (+ built-in Grade 270), {} sections, {} patterns, {} warning(s)",
        cat.mixes.len(),
        cat.strands.len(),
        cat.sections.len(),
        cat.entry_count(),
        warnings
    )?;
    for n in &cat.meta.notes {
        writeln!(w, "Note     {n}")?;
    }
    Ok(())
}

/// Table of exact section properties, one row per section, in the
/// display units (SI areas in 10³ mm², moduli in 10⁶ mm³, second moments
/// in 10⁶ mm⁴, as SI tables print them).
pub fn write_section_table(w: &mut impl Write, cat: &Catalog, sys: System) -> io::Result<()> {
    let si = sys == System::Si;
    let (hu, au, iu, su, wu) = if si {
        ("mm", "e3mm2", "e6mm4", "e6mm3", "kPa")
    } else {
        ("in", "in2", "in4", "in3", "psf")
    };
    let h = |l: &str, u: &str| format!("{l} {u}");
    writeln!(
        w,
        "{:<22} {:<11} {:>7} {:>7} {:>9} {:>7} {:>9} {:>9} {:>9} {:>7} {:>6} {:>6} {:>6}",
        "section",
        "family",
        h("h", hu),
        h("b", hu),
        h("A", au),
        h("yb", hu),
        h("I", iu),
        h("Sb", su),
        h("St", su),
        h("w", wu),
        h("V/S", hu),
        h("te", hu),
        h("bw", hu)
    )?;
    let len = |v: f64, places: usize| display::num(v, "in", places, sys);
    let scaled = |v: f64, us: &'static str, places: usize, per: f64| {
        if si {
            format!("{:.2}", display::convert(v, us, sys).0 / per)
        } else {
            format!("{v:.places$}")
        }
    };
    for s in &cat.sections {
        let m = s.summary(cat);
        let p = &m.props;
        writeln!(
            w,
            "{:<22} {:<11} {:>7} {:>7} {:>9} {:>7} {:>9} {:>9} {:>9} {:>7} {:>6} {:>6} {:>6}",
            truncate(&s.id, 22),
            s.family.name(),
            len(p.depth_in, 2),
            len(p.width_in, 1),
            scaled(p.area_in2, "in²", 1, 1e3),
            len(p.yb_in, 2),
            scaled(p.ix_in4, "in⁴", 0, 1e6),
            scaled(p.sb_in3, "in³", 1, 1e6),
            scaled(p.st_in3, "in³", 1, 1e6),
            display::num(m.weight_psf, "psf", 1, sys),
            len(p.vs_ratio_in, 2),
            len(m.equiv_thickness_in, 2),
            len(p.web_width_min_in, 2)
        )?;
    }
    writeln!(w)?;
    writeln!(
        w,
        "h depth, b width, A net area, yb centroid above soffit, I and S about the centroid, w self-weight,"
    )?;
    writeln!(
        w,
        "V/S volume-to-surface ratio, te equivalent thickness (IBC 722.2.2.1), bw least summed web width."
    )?;
    Ok(())
}

fn truncate(s: &str, n: usize) -> String {
    if s.chars().count() <= n {
        s.to_string()
    } else {
        let mut t: String = s.chars().take(n - 1).collect();
        t.push('…');
        t
    }
}

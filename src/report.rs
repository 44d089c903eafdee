//! Printers over `impl Write`: plain text for people, JSON for scripts.

pub mod check;
pub mod shortlist;

use std::io::{self, Write};

use crate::catalog::{Catalog, Severity};

/// The cautions printed with every result.
pub const CAUTIONS: &[&str] = &[
    "This is a preliminary selection aid, not a design.",
    "The supplier's engineer and the engineer of record make the final design.",
    "Local codes and licensed practice govern.",
];

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

/// Table of exact section properties, one row per section.
pub fn write_section_table(w: &mut impl Write, cat: &Catalog) -> io::Result<()> {
    writeln!(
        w,
        "{:<22} {:<11} {:>5} {:>5} {:>7} {:>6} {:>8} {:>7} {:>7} {:>6} {:>5} {:>5} {:>5}",
        "section", "family", "h in", "b in", "A in2", "yb in", "I in4", "Sb in3", "St in3", "w psf", "V/S", "te in", "bw in"
    )?;
    for s in &cat.sections {
        let m = s.summary(cat);
        let p = &m.props;
        writeln!(
            w,
            "{:<22} {:<11} {:>5.2} {:>5.1} {:>7.1} {:>6.2} {:>8.0} {:>7.1} {:>7.1} {:>6.1} {:>5.2} {:>5.2} {:>5.2}",
            truncate(&s.id, 22),
            s.family.name(),
            p.depth_in,
            p.width_in,
            p.area_in2,
            p.yb_in,
            p.ix_in4,
            p.sb_in3,
            p.st_in3,
            m.weight_psf,
            p.vs_ratio_in,
            m.equiv_thickness_in,
            p.web_width_min_in
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

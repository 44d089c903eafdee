//! The catalog: a producer's sections and strand patterns, read from TOML.
//!
//! Loading has two stages, as with ripgrep's arguments: a raw serde mirror
//! that only parses ([`raw`]), then [`validate`] into this model, which holds
//! only sound values with units read. Every problem in the file is reported
//! at once, each with file, line, column, field path, what was found and what
//! is allowed; see [`crate::input::diag::Problem`]. The key reference is
//! `catalog/README.md`.

pub mod keys;
pub mod raw;
pub mod validate;

use std::path::Path;

use serde::Serialize;

pub use crate::input::diag::{self, Problem, Problems, Severity};
use crate::material::{Mix, StrandKind};
use crate::section::{DoubleTee, Family, Generic, Geometry, HollowCore, Properties};
use crate::units::{Area, Length, PricePerArea, Stress};

/// Largest catalog or job file plankwise reads, bytes (16 MiB); a 10 000-entry
/// catalog is a few MB.
pub const MAX_FILE_BYTES: u64 = 16 * 1024 * 1024;

/// What the catalog is.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct Meta {
    /// Catalog name.
    pub name: String,
    /// Producer.
    pub producer: String,
    /// Code basis.
    pub code: String,
    /// Notes.
    pub notes: Vec<String>,
    /// Display units the catalog names, if any.
    pub units: Option<crate::units::System>,
    /// The system its quantities are mostly written in (when it names none).
    pub written_in: crate::units::System,
}

/// Family-specific description, as written in the catalog.
#[derive(Debug, Clone, PartialEq)]
pub enum FamilySpec {
    /// Hollow-core.
    HollowCore(HollowCore),
    /// Double tee.
    DoubleTee(DoubleTee),
    /// Generic polygon.
    Generic(Generic),
}

/// The producer's published properties.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Published {
    /// Area, in².
    pub area: Option<Area>,
    /// Centroid height, in.
    pub yb: Option<Length>,
    /// Second moment of area, in⁴.
    pub inertia: Option<f64>,
    /// Weight per plan area, lbf/in².
    pub weight_per_area: Option<f64>,
    /// Weight per length, lbf/in.
    pub weight_per_length: Option<f64>,
}

/// A strand row.
#[derive(Debug, Clone, PartialEq)]
pub struct Row {
    /// Number of strands.
    pub count: u32,
    /// Height of the strand centres above the soffit (at the hold-downs when depressed).
    pub height: Length,
    /// Height at the member ends when depressed.
    pub end_height: Option<Length>,
    /// Horizontal position of each strand from the left edge, in.
    pub x: Vec<f64>,
    /// Debonded length at each end.
    pub debond: Option<Length>,
}

/// Mild reinforcement in a pattern.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Bar {
    /// Number of bars.
    pub count: u32,
    /// Area of one bar.
    pub area: Area,
    /// Yield strength.
    pub fy: Stress,
    /// Height of the bar centres above the soffit.
    pub height: Length,
}

/// Shear reinforcement in each stem of a double tee (stirrups or a welded
/// wire sheet): the area of the legs in one stem at each spacing.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct WebSteel {
    /// Area of the legs in one stem at each spacing.
    pub area: Area,
    /// Spacing along the member.
    pub spacing: Length,
    /// Yield strength (ACI 318-19 counts at most 60 ksi in shear).
    pub fy: Stress,
}

/// A strand pattern of a section.
#[derive(Debug, Clone, PartialEq)]
pub struct Pattern {
    /// Id within its section.
    pub id: String,
    /// Name shown to users.
    pub designation: String,
    /// Strand kind.
    pub strand: StrandKind,
    /// Jacking stress ÷ fpu.
    pub jacking: f64,
    /// Hold-down points as a fraction of member length from each end
    /// (0.5 = one point at midspan), when any row is depressed.
    pub hold_down: Option<f64>,
    /// Strand rows.
    pub rows: Vec<Row>,
    /// Mild bars.
    pub bars: Vec<Bar>,
    /// Shear reinforcement per stem (double tees), if the catalog gives it.
    pub web_steel: Option<WebSteel>,
    /// Price per plan area.
    pub price: Option<PricePerArea>,
    /// Longest member the plant makes.
    pub max_length: Option<Length>,
    /// Remarks.
    pub remarks: String,
}

impl Pattern {
    /// Number of strands.
    pub fn strand_count(&self) -> u32 {
        self.rows.iter().map(|r| r.count).sum()
    }
    /// Total strand area, in².
    pub fn aps(&self) -> f64 {
        self.strand_count() as f64 * self.strand.area.get()
    }
    /// Strand centroid at midspan (at the hold-downs), in above the soffit.
    pub fn centroid(&self) -> f64 {
        let n = self.strand_count() as f64;
        self.rows.iter().map(|r| r.count as f64 * r.height.get()).sum::<f64>() / n
    }
    /// Strand centroid at the member ends, in above the soffit.
    pub fn end_centroid(&self) -> f64 {
        let n = self.strand_count() as f64;
        self.rows
            .iter()
            .map(|r| r.count as f64 * r.end_height.unwrap_or(r.height).get())
            .sum::<f64>()
            / n
    }
    /// Whether any row is depressed.
    pub fn is_depressed(&self) -> bool {
        self.rows.iter().any(|r| r.end_height.is_some())
    }
    /// Whether any row is debonded.
    pub fn has_debonding(&self) -> bool {
        self.rows.iter().any(|r| r.debond.is_some())
    }
    /// "straight", "depressed" or "straight, debonded".
    pub fn profile_name(&self) -> &'static str {
        match (self.is_depressed(), self.has_debonding()) {
            (true, true) => "depressed, debonded",
            (true, false) => "depressed",
            (false, true) => "straight, debonded",
            (false, false) => "straight",
        }
    }
}

/// A section with its patterns.
#[derive(Debug, Clone, PartialEq)]
pub struct Section {
    /// Id.
    pub id: String,
    /// Name shown to users.
    pub designation: String,
    /// Family.
    pub family: Family,
    /// Index of its mix in [`Catalog::mixes`].
    pub mix: usize,
    /// Family description as written.
    pub spec: FamilySpec,
    /// Geometry built from it.
    pub geometry: Geometry,
    /// Exact properties.
    pub props: Properties,
    /// Published properties, if given.
    pub published: Published,
    /// Strand patterns.
    pub patterns: Vec<Pattern>,
    /// Price per plan area.
    pub price: Option<PricePerArea>,
    /// Longest member the plant makes.
    pub max_length: Option<Length>,
    /// Remarks.
    pub remarks: String,
}

/// A validated catalog.
#[derive(Debug, Clone, PartialEq)]
pub struct Catalog {
    /// Metadata.
    pub meta: Meta,
    /// Concrete mixes.
    pub mixes: Vec<Mix>,
    /// Strand kinds defined in the file (built-ins are not listed).
    pub strands: Vec<StrandKind>,
    /// Sections.
    pub sections: Vec<Section>,
    /// Warnings found while loading.
    pub warnings: Vec<Problem>,
    /// FNV-1a 64-bit hash of the file's bytes, hex, to name the catalog used.
    pub hash: String,
}

/// Section properties with units in their key names, for `plankwise sections`.
#[derive(Debug, Clone, Serialize)]
pub struct SectionSummary {
    /// Section id.
    pub id: String,
    /// Designation.
    pub designation: String,
    /// Family.
    pub family: Family,
    /// Mix id.
    pub mix: String,
    /// Exact properties.
    #[serde(flatten)]
    pub props: Properties,
    /// Self-weight per length, plf.
    pub weight_plf: f64,
    /// Self-weight per plan area, psf.
    pub weight_psf: f64,
    /// Equivalent thickness for fire, IBC 2021 §722.2.2.1, in.
    pub equiv_thickness_in: f64,
    /// Summed web width at 21 heights from soffit to top: [height_in, width_in].
    pub web_widths_in: Vec<[f64; 2]>,
    /// Pattern ids.
    pub patterns: Vec<String>,
}

impl Section {
    /// Its concrete mix.
    pub fn mix<'c>(&self, cat: &'c Catalog) -> &'c Mix {
        &cat.mixes[self.mix]
    }
    /// Self-weight per length, lbf/in.
    pub fn weight_per_length(&self, mix: &Mix) -> f64 {
        self.props.area_in2 * mix.unit_weight.get()
    }
    /// Equivalent thickness for heat transmission, IBC 2021 §722.2.2.1, in.
    /// Hollow-core: net area ÷ width (§722.2.2.1.1). Double tee: a ribbed
    /// soffit (§722.2.2.1.3) — stems at more than 4 t give the flange
    /// thickness t; closer stems use the rule's interpolation with the
    /// thickness counted no more than 2 t. Generic: net area ÷ width.
    pub fn equivalent_thickness(&self) -> f64 {
        match &self.spec {
            FamilySpec::DoubleTee(dt) => {
                let t = dt.flange_thickness;
                let s = dt.stem_spacing;
                // te with each stem counted only to 2t below the top
                let te = (dt.flange_width * t + dt.stems as f64 * dt.stem_width_top * t) / dt.flange_width;
                if dt.stems < 2 || s >= 4.0 * t {
                    t
                } else if s <= 2.0 * t {
                    te
                } else {
                    t + (4.0 * t / s - 1.0) * (te - t)
                }
            }
            _ => self.props.net_thickness_in,
        }
    }
    /// The summary row for `plankwise sections`.
    pub fn summary(&self, cat: &Catalog) -> SectionSummary {
        let mix = self.mix(cat);
        let wl = self.weight_per_length(mix);
        SectionSummary {
            id: self.id.clone(),
            designation: self.designation.clone(),
            family: self.family,
            mix: mix.id.clone(),
            props: self.props.clone(),
            weight_plf: wl * 12.0,
            weight_psf: wl / self.props.width_in * 144.0,
            equiv_thickness_in: self.equivalent_thickness(),
            web_widths_in: (0..=20)
                .map(|k| {
                    // just inside the soffit and the top, so the faces count
                    let y = (k as f64 / 20.0 * self.props.depth_in).clamp(1e-6, self.props.depth_in - 1e-6);
                    [y, self.geometry.width_at(y)]
                })
                .collect(),
            patterns: self.patterns.iter().map(|p| p.id.clone()).collect(),
        }
    }
}

impl Catalog {
    /// Read and validate the catalog at `path`.
    pub fn load(path: &Path) -> Result<Catalog, Problems> {
        let name = path.display().to_string();
        let text = read_text(path)?;
        Catalog::from_str(&text, &name)
    }

    /// Validate catalog text; `file` names it in messages.
    pub fn from_str(text: &str, file: &str) -> Result<Catalog, Problems> {
        // a metric catalog's problems are told in metric units
        let sys = written_in(text);
        match validate::catalog(text, file) {
            Ok(mut c) => {
                c.warnings = Problems(std::mem::take(&mut c.warnings)).localized(sys).0;
                Ok(c)
            }
            Err(p) => Err(p.localized(sys)),
        }
    }

    /// Every problem in the text, warnings included (empty when clean).
    pub fn problems(text: &str, file: &str) -> Vec<Problem> {
        match Catalog::from_str(text, file) {
            Ok(c) => c.warnings,
            Err(p) => p.0,
        }
    }

    /// The number of entries (section × pattern).
    pub fn entry_count(&self) -> usize {
        self.sections.iter().map(|s| s.patterns.len()).sum()
    }

    /// A section by id.
    pub fn section(&self, id: &str) -> Option<&Section> {
        self.sections.iter().find(|s| s.id == id)
    }
}

/// The US customary demo catalog, embedded so the default run needs no file.
pub const DEMO_US: &str = include_str!("../catalog/demo-us.toml");
/// The SI demo catalog.
pub const DEMO_SI: &str = include_str!("../catalog/demo-si.toml");

impl Catalog {
    /// The display units of this catalog: the ones it names, else the
    /// system its quantities are mostly written in.
    pub fn units(&self) -> crate::units::System {
        self.meta.units.unwrap_or(self.meta.written_in)
    }
}

/// The system most quantities of a text are written in: SI when metric
/// units ("mm", "MPa", "kg/m3", "kPa", "m") outnumber US ones.
pub fn written_in(text: &str) -> crate::units::System {
    let count = |units: &[&str]| -> usize { units.iter().map(|u| text.matches(&format!(" {u}\"")).count()).sum() };
    let si = count(&["mm", "MPa", "kg/m3", "kPa", "m", "kN/m", "mm2"]);
    let us = count(&["in", "psi", "pcf", "ft", "psf", "ksi", "in2", "klf"]);
    if si > us {
        crate::units::System::Si
    } else {
        crate::units::System::Us
    }
}

/// Read a UTF-8 text file of bounded size, as a problem list on failure.
pub fn read_text(path: &Path) -> Result<String, Problems> {
    let name = path.display().to_string();
    let fail = |message: String| {
        Problems(vec![Problem {
            severity: Severity::Error,
            file: name.clone(),
            line: 0,
            column: 0,
            path: String::new(),
            message,
        }])
    };
    // a regular file only, never blocking, the size capped while reading
    let bytes = crate::files::read_bounded(path, MAX_FILE_BYTES).map_err(fail)?;
    String::from_utf8(bytes).map_err(|e| {
        let at = e.utf8_error().valid_up_to();
        let good = String::from_utf8_lossy(&e.as_bytes()[..at]).into_owned();
        let line = good.matches('\n').count() + 1;
        let column = good.rsplit('\n').next().map_or(0, |l| l.chars().count()) + 1;
        Problems(vec![Problem {
            severity: Severity::Error,
            file: name.clone(),
            line,
            column,
            path: String::new(),
            message: format!("byte {at} is not valid UTF-8; save the file as UTF-8 text"),
        }])
    })
}

/// FNV-1a 64-bit hash, hex.
pub fn content_hash(text: &str) -> String {
    let mut h: u64 = 0xcbf2_9ce4_8422_2325;
    for b in text.bytes() {
        h ^= u64::from(b);
        h = h.wrapping_mul(0x0000_0100_0000_01b3);
    }
    format!("{h:016x}")
}

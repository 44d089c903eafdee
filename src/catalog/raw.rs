//! The raw mirror of a catalog file: only parses, keeps every span.
//!
//! Quantities stay strings here; [`super::validate`] reads their units.
//! The keys, their meaning, units, defaults and ranges are defined in
//! [`super::keys`]; a test proves these structures have exactly those keys.
//! Unknown keys are refused (`deny_unknown_fields`). The top level and the
//! `[[section]]` / `[[section.pattern]]` arrays are split by hand so that
//! one bad entry does not hide the problems of the others.

use serde::Deserialize;
use toml::Spanned;

/// A string field with its position.
pub use crate::input::S;
/// A point given as two quantity strings, [x, y].
pub type Point = Spanned<Vec<S>>;

/// `[catalog]`: what this catalog is.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawMeta {
    /// Catalog name.
    pub name: S,
    /// Producer.
    pub producer: Option<S>,
    /// Code basis ("ACI 318-19").
    pub code: Option<S>,
    /// Free notes.
    pub notes: Option<Vec<S>>,
    /// Display units of the catalog's users: "us" or "si".
    pub units: Option<S>,
}

/// `[[mix]]`: a concrete mix.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawMix {
    /// Id used by sections.
    pub id: S,
    /// f′c.
    pub fc: S,
    /// f′ci.
    pub fci: S,
    /// Unit weight.
    pub unit_weight: S,
    /// Aggregate kind.
    pub aggregate: S,
    /// "unit-weight", "normalweight" or a stress.
    pub modulus: Option<S>,
}

/// `[[strand]]`: a strand kind beyond the built-in ones.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawStrand {
    /// Id used by patterns.
    pub id: S,
    /// Nominal diameter.
    pub diameter: S,
    /// Nominal area.
    pub area: S,
    /// fpu.
    pub fpu: S,
    /// fpy (default 0.90 fpu, or 0.85 fpu if stress-relieved).
    pub fpy: Option<S>,
    /// Eps (default 28 500 ksi).
    pub modulus: Option<S>,
    /// "low" or "stress-relieved" (default low).
    pub relaxation: Option<S>,
}

/// `[[section]]` without its patterns.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawSection {
    /// Id.
    pub id: S,
    /// Name shown to users (default: the id).
    pub designation: Option<S>,
    /// Mix id.
    pub mix: S,
    /// Hollow-core geometry.
    pub hollow_core: Option<Spanned<RawHollowCore>>,
    /// Double-tee geometry.
    pub double_tee: Option<Spanned<RawDoubleTee>>,
    /// Generic geometry.
    pub generic: Option<Spanned<RawGeneric>>,
    /// Producer's published properties.
    pub published: Option<RawPublished>,
    /// Price per plan area.
    pub price: Option<S>,
    /// Longest member the plant makes.
    pub max_length: Option<S>,
    /// Remarks.
    pub remarks: Option<S>,
}

/// `[section.hollow_core]`.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawHollowCore {
    /// Nominal width.
    pub width: S,
    /// Depth.
    pub depth: S,
    /// The cores.
    pub cores: Spanned<RawCores>,
    /// Edge keyway.
    pub keyway: Option<Spanned<RawKeyway>>,
}

/// `[section.hollow_core.cores]`.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawCores {
    /// "circle", "stadium" (or "oval"), "rounded-rectangle".
    pub shape: S,
    /// Number of cores.
    pub count: Spanned<i64>,
    /// Diameter (circles).
    pub diameter: Option<S>,
    /// Width (stadiums, rounded rectangles).
    pub width: Option<S>,
    /// Height (stadiums, rounded rectangles).
    pub height: Option<S>,
    /// Corner radius (rounded rectangles).
    pub corner_radius: Option<S>,
    /// Centre-to-centre spacing.
    pub spacing: S,
    /// Height of the core centres (default mid-depth).
    pub center_height: Option<S>,
}

/// `[section.hollow_core.keyway]`: either a profile or an area.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawKeyway {
    /// Side-face points [inset, height] from soffit to top.
    pub profile: Option<Spanned<Vec<Point>>>,
    /// Area removed at both edges together.
    pub area: Option<S>,
    /// Centroid height of that area (default mid-depth).
    pub center_height: Option<S>,
}

/// `[section.double_tee]`.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawDoubleTee {
    /// Flange width.
    pub flange_width: S,
    /// Flange thickness.
    pub flange_thickness: S,
    /// Total depth.
    pub depth: S,
    /// Number of stems (default 2).
    pub stems: Option<Spanned<i64>>,
    /// Stem spacing, centre to centre.
    pub stem_spacing: S,
    /// Stem width under the flange.
    pub stem_width_top: S,
    /// Stem width at the soffit.
    pub stem_width_bottom: S,
    /// 45° chamfer at the stem's bottom corners.
    pub chamfer: Option<S>,
}

/// `[section.generic]`.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawGeneric {
    /// Outline points [x, y].
    pub outline: Spanned<Vec<Point>>,
    /// Voids.
    pub void: Option<Vec<Spanned<RawVoid>>>,
}

/// `[[section.generic.void]]`: a polygon or a circle.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawVoid {
    /// Polygon points.
    pub points: Option<Spanned<Vec<Point>>>,
    /// Circle centre [x, y].
    pub center: Option<Point>,
    /// Circle diameter.
    pub diameter: Option<S>,
}

/// `[section.published]`: the producer's figures, compared with ours.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawPublished {
    /// Area.
    pub area: Option<S>,
    /// Centroid height.
    pub yb: Option<S>,
    /// Second moment of area.
    pub inertia: Option<S>,
    /// Weight, per area (psf) or per length (plf).
    pub weight: Option<S>,
}

/// `[[section.pattern]]`.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawPattern {
    /// Id within the section.
    pub id: S,
    /// Name shown to users (default: the id).
    pub designation: Option<S>,
    /// Strand kind: a built-in name or a `[[strand]]` id.
    pub strand: S,
    /// Jacking stress as a fraction of fpu (default 0.75).
    pub jacking: Option<Spanned<f64>>,
    /// Hold-down points as a fraction of the member length from each end.
    pub hold_down: Option<Spanned<f64>>,
    /// Strand rows.
    pub row: Option<Vec<Spanned<RawRow>>>,
    /// Mild reinforcement.
    pub bar: Option<Vec<Spanned<RawBar>>>,
    /// Shear reinforcement in each stem of a double tee.
    pub web_steel: Option<Spanned<RawWebSteel>>,
    /// Price per plan area (overrides the section's).
    pub price: Option<S>,
    /// Longest member (overrides the section's).
    pub max_length: Option<S>,
    /// Remarks.
    pub remarks: Option<S>,
}

/// `[[section.pattern.row]]`.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawRow {
    /// Number of strands.
    pub count: Spanned<i64>,
    /// Height of the strand centres above the soffit (at the hold-downs if depressed).
    pub height: S,
    /// Height at the member ends, for depressed strands.
    pub end_height: Option<S>,
    /// Horizontal positions from the left edge (default: webs or stems).
    pub x: Option<Spanned<Vec<S>>>,
    /// Debonded (shielded) length at each end.
    pub debond: Option<S>,
}

/// `web_steel = { area, spacing, fy }` of a pattern: the shear
/// reinforcement of one stem.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawWebSteel {
    /// Area of the legs crossing a crack in one stem, at each spacing.
    pub area: S,
    /// Spacing along the member.
    pub spacing: S,
    /// Yield strength.
    pub fy: S,
}

/// `[[section.pattern.bar]]`.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawBar {
    /// Number of bars.
    pub count: Spanned<i64>,
    /// Area of one bar.
    pub area: S,
    /// Yield strength.
    pub fy: S,
    /// Height of the bar centres above the soffit.
    pub height: S,
}

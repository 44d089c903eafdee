//! Fire-resistance and cover tables (IBC 2021 §722, ACI 216.1, ACI 318-19
//! Table 20.5.1.3.3), kept in one place with their table numbers and the
//! confidence marks of the engineering reference sheet. Ratings in hours,
//! thicknesses and covers in inches.

use crate::material::Aggregate;

/// The ratings the tables give, hours.
pub const RATINGS: [f64; 5] = [1.0, 1.5, 2.0, 3.0, 4.0];

/// IBC 2021 Table 722.2.2.1, minimum equivalent thickness of floors and
/// roofs (in) for 1, 1½, 2, 3, 4 h. Values verified for the wall table
/// 722.2.1.1 (IBC text); the floor/roof table carries the same values from
/// memory, high confidence — verify (reference sheet §7.1).
pub const EQUIV_THICKNESS: [(Aggregate, [f64; 5]); 4] = [
    (Aggregate::Siliceous, [3.5, 4.3, 5.0, 6.2, 7.0]),
    (Aggregate::Carbonate, [3.2, 4.0, 4.6, 5.7, 6.6]),
    (Aggregate::SandLightweight, [2.7, 3.3, 3.8, 4.6, 5.4]),
    (Aggregate::Lightweight, [2.5, 3.1, 3.6, 4.4, 5.1]),
];

/// IBC 2021 Table 722.2.3(1), minimum cover to prestressed positive-moment
/// reinforcement of slabs, unrestrained (in) for 1, 1½, 2, 3, 4 h; sand-
/// lightweight and lightweight share a column. From memory, medium
/// confidence — verify every cell (reference sheet §7.3).
pub const SLAB_COVER_UNRESTRAINED: [(Aggregate, [f64; 5]); 4] = [
    (Aggregate::Siliceous, [1.125, 1.5, 1.75, 2.375, 2.75]),
    (Aggregate::Carbonate, [1.0, 1.375, 1.625, 2.125, 2.25]),
    (Aggregate::SandLightweight, [1.0, 1.375, 1.5, 2.0, 2.25]),
    (Aggregate::Lightweight, [1.0, 1.375, 1.5, 2.0, 2.25]),
];

/// IBC 2021 Table 722.2.3(1), restrained slabs: 3/4 in for every rating and
/// aggregate (from memory, medium confidence — verify).
pub const SLAB_COVER_RESTRAINED: f64 = 0.75;

fn row<T: Copy>(table: &[(Aggregate, [T; 5])], agg: Aggregate) -> [T; 5] {
    table
        .iter()
        .find(|(a, _)| *a == agg)
        .map(|r| r.1)
        .expect("every aggregate has a row")
}

/// Largest tabulated rating whose requirement `need[i]` is met by `have`
/// (hours; 0 when not even 1 h).
fn best(have: f64, need: [f64; 5]) -> f64 {
    RATINGS
        .iter()
        .zip(need)
        .filter(|(_, n)| have >= n - 1e-9)
        .map(|(r, _)| *r)
        .fold(0.0, f64::max)
}

/// Rating by heat transmission from the equivalent thickness.
pub fn rating_by_thickness(agg: Aggregate, te: f64) -> f64 {
    best(te, row(&EQUIV_THICKNESS, agg))
}

/// Required equivalent thickness for a rating (None when not tabulated).
pub fn thickness_for(agg: Aggregate, rating: f64) -> Option<f64> {
    RATINGS
        .iter()
        .position(|r| (r - rating).abs() < 1e-9)
        .map(|i| row(&EQUIV_THICKNESS, agg)[i])
}

/// Slab strand cover for a rating (None when not tabulated).
pub fn slab_cover_for(agg: Aggregate, restrained: bool, rating: f64) -> Option<f64> {
    let i = RATINGS.iter().position(|r| (r - rating).abs() < 1e-9)?;
    Some(if restrained {
        SLAB_COVER_RESTRAINED
    } else {
        row(&SLAB_COVER_UNRESTRAINED, agg)[i]
    })
}

/// Rating of a slab by the cover to its strands.
pub fn rating_by_slab_cover(agg: Aggregate, restrained: bool, cover: f64) -> f64 {
    if restrained {
        best(cover, [SLAB_COVER_RESTRAINED; 5])
    } else {
        best(cover, row(&SLAB_COVER_UNRESTRAINED, agg))
    }
}

/// A cell of the beam and stem cover tables: the average cover needed
/// (in), or not permitted.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Cell {
    /// Average cover needed, in.
    Cover(f64),
    /// The same, but only with U-shaped or hooped stirrups at a spacing no
    /// more than the member depth (footnote c of Tables 722.2.3(4)/(5),
    /// from memory, medium): credited only when the pattern gives stem
    /// reinforcement at such a spacing.
    WithStirrups(f64),
    /// Not permitted.
    No,
}

use Cell::{Cover as C, No, WithStirrups as S};

/// The confidence of the beam and stem tables, printed with every rating
/// that rests on them.
pub const BEAM_TABLES_MARK: &str = "values from memory — verify against the code in force";

/// IBC 2021 Table 722.2.3(4), cover to prestressing tendons of beams at
/// least 8 in wide (in) for 1, 1½, 2, 3, 4 h, by restraint, aggregate
/// group (normalweight or sand-lightweight) and width (8 in, ≥ 12 in;
/// between, interpolated, customary practice from memory, medium).
/// **From memory (reference sheets: cells medium to low confidence) —
/// values from memory, verify against the code in force.** The 8 in
/// unrestrained 3 h cell (5 in) is given for interpolation only (footnote
/// b). Footnote a (restrained beams 4 ft apart or closer need ¾ in) is not
/// applied: not transcribed.
pub const BEAM_COVER: [(bool, bool, f64, [Cell; 5]); 8] = [
    (true, false, 8.0, [C(1.5), C(1.5), C(1.5), C(1.75), C(2.5)]),
    (true, false, 12.0, [C(1.5), C(1.5), C(1.5), C(1.5), C(1.875)]),
    (true, true, 8.0, [C(1.5), C(1.5), C(1.5), C(1.5), C(2.0)]),
    (true, true, 12.0, [C(1.5), C(1.5), C(1.5), C(1.5), C(1.625)]),
    (false, false, 8.0, [C(1.5), C(1.75), C(2.5), C(5.0), No]),
    (false, false, 12.0, [C(1.5), C(1.5), S(1.875), S(2.5), S(3.0)]),
    (false, true, 8.0, [C(1.5), C(1.5), C(2.0), S(3.25), No]),
    (false, true, 12.0, [C(1.5), C(1.5), C(1.625), S(2.0), S(2.5)]),
];

/// IBC 2021 Table 722.2.3(5), cover to prestressing tendons of beams and
/// stems of any width with a cross-section area of at least 40 in² (in),
/// for 1, 1½, 2, 3, 4 h: (restrained, lightweight, least area, greatest
/// area, cells). The area may count a strip of flange up to three average
/// stem widths wide (footnote, from memory, medium). **Layout and cells
/// from memory, low confidence — values from memory, verify against the
/// code in force** (next-capabilities reference §1.2).
pub const STEM_COVER: [(bool, bool, f64, f64, [Cell; 5]); 10] = [
    (true, false, 40.0, 150.0, [C(1.5), C(1.5), C(2.0), C(2.5), No]),
    (true, false, 150.0, 300.0, [C(1.5), C(1.5), C(1.5), C(1.75), C(2.5)]),
    (true, false, 300.0, f64::INFINITY, [C(1.5), C(1.5), C(1.5), C(1.5), C(2.0)]),
    (true, true, 40.0, 150.0, [C(1.5), C(1.5), C(1.5), C(2.0), No]),
    (true, true, 150.0, f64::INFINITY, [C(1.5), C(1.5), C(1.5), C(1.5), C(2.0)]),
    (false, false, 40.0, 150.0, [C(2.0), C(2.5), No, No, No]),
    (false, false, 150.0, 300.0, [C(1.5), C(1.75), C(2.5), No, No]),
    (false, false, 300.0, f64::INFINITY, [C(1.5), C(1.5), C(2.0), S(3.0), S(4.0)]),
    (false, true, 40.0, 150.0, [C(2.0), C(2.0), No, No, No]),
    (false, true, 150.0, f64::INFINITY, [C(1.5), C(1.5), C(2.0), S(3.0), S(4.0)]),
];

fn lightweight(agg: Aggregate) -> bool {
    matches!(agg, Aggregate::SandLightweight | Aggregate::Lightweight)
}

/// The cover a cell asks for, given whether stirrups as footnote c wants
/// are there (None: not permitted).
fn cell(c: Cell, stirrups: bool) -> Option<f64> {
    match c {
        C(v) => Some(v),
        S(v) if stirrups => Some(v),
        _ => None,
    }
}

/// Table 722.2.3(4) cover for rating index `i` of a beam `width` wide (None
/// below 8 in or where not permitted); widths between 8 and 12 in are
/// interpolated.
pub fn beam_cover_for(agg: Aggregate, restrained: bool, width: f64, i: usize, stirrups: bool) -> Option<f64> {
    if width < 8.0 {
        return None;
    }
    let lw = lightweight(agg);
    let pick = |w: f64| {
        BEAM_COVER
            .iter()
            .find(|r| r.0 == restrained && r.1 == lw && r.2 == w)
            .map(|r| cell(r.3[i], stirrups))
            .expect("row")
    };
    let t = ((width - 8.0) / 4.0).clamp(0.0, 1.0);
    match (pick(8.0), pick(12.0)) {
        (Some(x), Some(y)) => Some(x + (y - x) * t),
        (Some(x), None) if t <= 1e-9 => Some(x),
        (None, Some(y)) if t >= 1.0 - 1e-9 => Some(y),
        _ => None,
    }
}

/// Table 722.2.3(5) cover for rating index `i` of a stem of `area` in²
/// (None below 40 in² or where not permitted).
pub fn stem_cover_for(agg: Aggregate, restrained: bool, area: f64, i: usize, stirrups: bool) -> Option<f64> {
    if area < 40.0 {
        return None;
    }
    let lw = lightweight(agg);
    STEM_COVER
        .iter()
        .find(|r| r.0 == restrained && r.1 == lw && area > r.2 - 1e-9 && (area <= r.3 + 1e-9 || r.3.is_infinite()))
        .and_then(|r| cell(r.4[i], stirrups))
}

/// The average cover a stem needs for rating index `i`: where both tables
/// apply the smaller value may be used (IBC 2021 §722.2.3.3); None when
/// neither permits the rating.
pub fn stem_requirement(agg: Aggregate, restrained: bool, width: f64, area: f64, i: usize, stirrups: bool) -> Option<f64> {
    match (
        beam_cover_for(agg, restrained, width, i, stirrups),
        stem_cover_for(agg, restrained, area, i, stirrups),
    ) {
        (Some(a), Some(b)) => Some(a.min(b)),
        (a, b) => a.or(b),
    }
}

/// Exposure for durability cover.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Exposure {
    /// Not exposed to weather or in contact with ground.
    Interior,
    /// Exposed to weather or in contact with ground.
    Weather,
}

/// Durability cover for strand of diameter `db` in precast members made
/// under plant conditions, ACI 318-19 Table 20.5.1.3.3 (from memory,
/// medium confidence — verify; reference sheet §7.6): not exposed, slabs
/// and joists, strand ≤ 1-1/2 in: 3/4 in (double-tee stems counted as
/// joists); exposed, other members: strand ≤ 5/8 in: 1-1/4 in, larger
/// through 1-1/2 in: 1-1/2 in.
pub fn durability_cover(exposure: Exposure, db: f64) -> f64 {
    match exposure {
        Exposure::Interior => 0.75,
        Exposure::Weather => {
            if db <= 0.625 + 1e-9 {
                1.25
            } else {
                1.5
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn tables_cell_by_cell() {
        // IBC 2021 Table 722.2.2.1 (verified for the wall table; floors from memory, high)
        assert_eq!(row(&EQUIV_THICKNESS, Aggregate::Siliceous), [3.5, 4.3, 5.0, 6.2, 7.0]);
        assert_eq!(row(&EQUIV_THICKNESS, Aggregate::Carbonate), [3.2, 4.0, 4.6, 5.7, 6.6]);
        assert_eq!(row(&EQUIV_THICKNESS, Aggregate::SandLightweight), [2.7, 3.3, 3.8, 4.6, 5.4]);
        assert_eq!(row(&EQUIV_THICKNESS, Aggregate::Lightweight), [2.5, 3.1, 3.6, 4.4, 5.1]);
        // IBC 2021 Table 722.2.3(1), unrestrained prestressed (from memory, medium)
        assert_eq!(row(&SLAB_COVER_UNRESTRAINED, Aggregate::Siliceous), [1.125, 1.5, 1.75, 2.375, 2.75]);
        assert_eq!(
            row(&SLAB_COVER_UNRESTRAINED, Aggregate::Carbonate),
            [1.0, 1.375, 1.625, 2.125, 2.25]
        );
        assert_eq!(
            row(&SLAB_COVER_UNRESTRAINED, Aggregate::SandLightweight),
            [1.0, 1.375, 1.5, 2.0, 2.25]
        );
        assert_eq!(SLAB_COVER_RESTRAINED, 0.75);
    }

    #[test]
    fn ratings_by_hand() {
        // 8 in plank of the demo catalog: te = 236.8/48 = 4.93 in carbonate:
        // 4.6 ≤ 4.93 < 5.7 → 2 h by IBC Table 722.2.2.1.
        assert_eq!(rating_by_thickness(Aggregate::Carbonate, 236.76 / 48.0), 2.0);
        assert_eq!(rating_by_thickness(Aggregate::Siliceous, 3.4), 0.0);
        assert_eq!(rating_by_thickness(Aggregate::Siliceous, 7.0), 4.0);
        // 1/2 in strand at 1.75 in: 1.5 in clear, carbonate unrestrained:
        // 1.375 ≤ 1.5 < 1.625 → 1½ h by IBC Table 722.2.3(1).
        assert_eq!(rating_by_slab_cover(Aggregate::Carbonate, false, 1.5), 1.5);
        assert_eq!(rating_by_slab_cover(Aggregate::Carbonate, true, 0.75), 4.0);
        assert_eq!(slab_cover_for(Aggregate::Siliceous, false, 2.0), Some(1.75));
        assert_eq!(thickness_for(Aggregate::Carbonate, 1.5), Some(4.0));
        assert_eq!(thickness_for(Aggregate::Carbonate, 2.5), None);
    }

    #[test]
    fn beam_and_stem_tables() {
        // IBC 2021 Table 722.2.3(4) — values from memory, verify against the
        // code in force: unrestrained normalweight 12 in wide, 2 h needs 1⅞ in
        // with stirrups (footnote c), not permitted without
        assert_eq!(beam_cover_for(Aggregate::Carbonate, false, 12.0, 2, true), Some(1.875));
        assert_eq!(beam_cover_for(Aggregate::Carbonate, false, 12.0, 2, false), None);
        assert_eq!(beam_cover_for(Aggregate::Carbonate, false, 8.0, 2, false), Some(2.5));
        assert_eq!(
            beam_cover_for(Aggregate::Carbonate, false, 8.0, 4, true),
            None,
            "4 h not permitted at 8 in"
        );
        assert_eq!(
            beam_cover_for(Aggregate::Carbonate, false, 6.0, 0, false),
            None,
            "under 8 in: Table 722.2.3(5)"
        );
        // IBC 2021 Table 722.2.3(5) — values from memory, verify against the
        // code in force (next-capabilities §8 test vector: 161 in² lies in
        // the 150–300 band; unrestrained carbonate 1, 1½, 2 h need 1½, 1¾, 2½ in)
        let need: Vec<Option<f64>> = (0..3)
            .map(|i| stem_cover_for(Aggregate::Carbonate, false, 161.0, i, false))
            .collect();
        assert_eq!(need, [Some(1.5), Some(1.75), Some(2.5)]);
        // 126.5 in² (the stem alone) falls in 40–150: 2 h not permitted
        assert_eq!(stem_cover_for(Aggregate::Carbonate, false, 126.5, 2, false), None);
        // 306 in² > 300: 2 h needs 2 in; the smaller of the two tables governs
        assert_eq!(stem_cover_for(Aggregate::Siliceous, false, 306.0, 2, false), Some(2.0));
        assert_eq!(stem_requirement(Aggregate::Siliceous, false, 8.0, 306.0, 2, false), Some(2.0));
        assert_eq!(stem_requirement(Aggregate::Siliceous, false, 8.0, 171.0, 2, false), Some(2.5));
        assert_eq!(stem_cover_for(Aggregate::Carbonate, false, 39.0, 0, false), None, "under 40 in²");
    }

    #[test]
    fn durability_cover_by_exposure() {
        // ACI 318-19 Table 20.5.1.3.3 (from memory, medium)
        assert_eq!(durability_cover(Exposure::Interior, 0.5), 0.75);
        assert_eq!(durability_cover(Exposure::Weather, 0.5), 1.25);
        assert_eq!(durability_cover(Exposure::Weather, 0.7), 1.5);
    }
}

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

/// IBC 2021 Table 722.2.3(4), cover to prestressing tendons of beams at
/// least 8 in wide (in) for 1, 1½, 2, 3, 4 h, by restraint, aggregate
/// group (normalweight or sand-lightweight) and width (8 in, ≥ 12 in;
/// between, interpolated). `None` = not permitted. From memory, LOW
/// confidence — transcribe from the IBC before relying on it (reference
/// sheet §7.4). Beams narrower than 8 in fall under Table 722.2.3(5), whose
/// values the reference sheet withholds; plankwise does not rate them.
pub const BEAM_COVER: [(bool, bool, f64, [Option<f64>; 5]); 8] = [
    (true, false, 8.0, [Some(1.5), Some(1.5), Some(1.5), Some(1.75), Some(2.5)]),
    (true, false, 12.0, [Some(1.5), Some(1.5), Some(1.5), Some(1.5), Some(1.875)]),
    (true, true, 8.0, [Some(1.5), Some(1.5), Some(1.5), Some(1.5), Some(2.0)]),
    (true, true, 12.0, [Some(1.5), Some(1.5), Some(1.5), Some(1.5), Some(1.625)]),
    (false, false, 8.0, [Some(1.5), Some(1.75), Some(2.5), Some(5.0), None]),
    (false, false, 12.0, [Some(1.5), Some(1.5), Some(1.875), Some(2.5), Some(3.0)]),
    (false, true, 8.0, [Some(1.5), Some(1.5), Some(2.0), Some(3.25), None]),
    (false, true, 12.0, [Some(1.5), Some(1.5), Some(1.625), Some(2.0), Some(2.5)]),
];

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

/// Rating of a beam at least 8 in wide by Table 722.2.3(4) (None below 8 in).
pub fn rating_by_beam_cover(agg: Aggregate, restrained: bool, width: f64, avg_cover: f64) -> Option<f64> {
    if width < 8.0 {
        return None;
    }
    let lw = matches!(agg, Aggregate::SandLightweight | Aggregate::Lightweight);
    let pick = |w: f64| {
        BEAM_COVER
            .iter()
            .find(|r| r.0 == restrained && r.1 == lw && r.2 == w)
            .map(|r| r.3)
            .expect("row")
    };
    let (a, b) = (pick(8.0), pick(12.0));
    let t = ((width - 8.0) / 4.0).clamp(0.0, 1.0);
    let mut rating: f64 = 0.0;
    for (i, r) in RATINGS.iter().enumerate() {
        // interpolate between the 8 in and 12 in rows; not permitted stays so
        let need = match (a[i], b[i]) {
            (Some(x), Some(y)) => Some(x + (y - x) * t),
            (None, Some(y)) if t >= 1.0 => Some(y),
            _ => None,
        };
        if let Some(n) = need {
            if avg_cover >= n - 1e-9 {
                rating = rating.max(*r);
            }
        }
    }
    Some(rating)
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
    fn beam_table_and_narrow_stems() {
        // Table 722.2.3(4) (from memory, LOW): unrestrained normalweight 12 in wide, 2 in average cover → 2 h
        assert_eq!(rating_by_beam_cover(Aggregate::Carbonate, false, 12.0, 2.0), Some(2.0));
        assert_eq!(
            rating_by_beam_cover(Aggregate::Carbonate, false, 8.0, 5.5),
            Some(3.0),
            "4 h not permitted at 8 in"
        );
        assert_eq!(
            rating_by_beam_cover(Aggregate::Carbonate, false, 6.0, 3.0),
            None,
            "stems under 8 in: Table 722.2.3(5)"
        );
    }

    #[test]
    fn durability_cover_by_exposure() {
        // ACI 318-19 Table 20.5.1.3.3 (from memory, medium)
        assert_eq!(durability_cover(Exposure::Interior, 0.5), 0.75);
        assert_eq!(durability_cover(Exposure::Weather, 0.5), 1.25);
        assert_eq!(durability_cover(Exposure::Weather, 0.7), 1.5);
    }
}

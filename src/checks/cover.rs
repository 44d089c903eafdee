//! Concrete cover to the strands: the larger of durability and fire.
//!
//! Clauses: ACI 318-19 Table 20.5.1.3.3 (precast, plant conditions) by
//! exposure, and for slabs (hollow-core, generic) IBC 2021 Table 722.2.3(1)
//! at the required fire rating (§20.5.1.1: the building code's fire cover
//! governs when larger). Double-tee stem fire cover is the average-cover
//! rule of the fire check. Clear cover to the soffit — and for double-tee
//! stems to their side faces too — at the ends and at midspan; the cores
//! and the grouted joints between planks are not exposed surfaces.
//!
//! Where the worst point lies: not a station check — every strand at its
//! height at the ends and between the hold-downs, where the cover is least.

use super::{Analysis, CheckInfo, CheckResult, Group, Reads};
use crate::fire::{durability_cover, slab_cover_for};
use crate::section::Family;

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "cover",
    title: "Strand cover (durability and fire)",
    clause: "ACI 318-19 Table 20.5.1.3.3; IBC 2021 Table 722.2.3(1)",
    unit: "in",
    group: Group::Cover,
    reads: Reads::Need,
    load_driven: false,
};

/// Run the check: demand is the cover required, capacity the least given.
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let m = &an.member;
    let db = m.db();
    let g = &m.section.geometry;
    let mut least = f64::INFINITY;
    for l in &m.layers {
        for &x in &l.x {
            for y in [l.y_mid, l.y_end] {
                // clear cover to the soffit
                least = least.min(y - db / 2.0);
                if m.section.family == Family::DoubleTee {
                    // the stem's own faces: half the stem width at that height less the offset
                    let n = g.stems.len().max(1) as f64;
                    let stem_side = g
                        .stems
                        .iter()
                        .map(|&xc| g.width_at(y) / n / 2.0 - (x - xc).abs() - db / 2.0)
                        .fold(f64::NEG_INFINITY, f64::max);
                    least = least.min(stem_side);
                }
            }
        }
    }
    let dur = durability_cover(m.case.exposure, db);
    let fire = match (m.section.family, m.case.fire_rating) {
        (Family::DoubleTee, _) | (_, None) => None,
        (_, Some(r)) => slab_cover_for(m.mix.aggregate, m.case.restrained, r),
    };
    let need = fire.map_or(dur, |f| f.max(dur));
    let why = match fire {
        Some(f) if f > dur => an.note(format_args!("fire {f:.3} in governs over durability {dur:.3} in")),
        _ => an
            .note(format_args!("durability {dur:.3} in ({:?} exposure)", m.case.exposure))
            .to_lowercase(),
    };
    let mut r = CheckResult::new(
        &INFO,
        need,
        least,
        None,
        an.note(format_args!("least clear cover {least:.2} in; {why}")),
    );
    // the check passes when the least cover is at least the required one
    r.ratio = if least > 0.0 {
        (need / least).min(super::RATIO_NONE)
    } else {
        super::RATIO_NONE
    };
    r.pass = least >= need - 1e-9;
    Some(r)
}

//! The far support stays in bearing: with an overhang, the load on it lifts
//! the member off the other support unless the load between the supports
//! holds that end down. A precast member sits on its bearings without a
//! tie-down (common practice, no source), so a net upward reaction is a
//! failure, not a force to resist.
//!
//! Statics of the member on its two supports ([`crate::beam`]): a load F
//! at x gives the left support F(ℓ − x)/ℓ and the right one F·x/ℓ, so a
//! load beyond a support pulls the far support up. At each support the
//! loads that press it down (dead loads only: a variable load may be
//! absent) are taken at 0.9, and those that lift it at the factors of
//! each ASCE 7-16 §2.3.1 combination 1–3 (1.4D; 1.2D + 1.6L + 0.5(Lr or
//! S); 1.2D + 1.6(Lr or S) + 0.5L). The 0.9 is the factor §2.3.1 gives dead
//! load that counteracts wind or earthquake, applied here to gravity
//! overturning (common practice, no source). Demand is the lifting part of
//! the reaction, capacity the holding part: a ratio above 1 means the end
//! rises. Every arrangement of the variable loads is checked (merge keeps
//! the worst), so load on the overhangs alone is seen.
//!
//! Where the worst point lies: the two supports (the reactions).

use super::{Analysis, CheckInfo, CheckResult, Group, Reads};
use crate::beam::Load;
use crate::case::COMBINATIONS;
use crate::loads::{LIVE, ROOF, SDL, SELF, TOPPING};

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "uplift",
    title: "Far support stays in bearing (no uplift)",
    clause: "statics; ASCE 7-16 2.3.1 (0.9D holding down: common practice, no source)",
    unit: "kip",
    group: Group::Bearing,
    reads: Reads::Demand,
    load_driven: true,
};

/// Factor on the dead load that holds a support down.
pub const HOLDING_DEAD_FACTOR: f64 = 0.9;

/// What one group's loads do to the support at `right` (false: x = 0,
/// true: x = ℓ): (pressing it down, lifting it), both ≥ 0, lbf.
pub fn parts(loads: &[Load], l: f64, right: bool) -> (f64, f64) {
    let share = |x: f64| if right { x / l } else { (l - x) / l };
    let (mut down, mut up) = (0.0, 0.0);
    let mut add = |f: f64, x: f64| {
        let r = f * share(x);
        if r >= 0.0 {
            down += r;
        } else {
            up -= r;
        }
    };
    for ld in loads {
        match *ld {
            Load::Point { p, a } => add(p, a),
            Load::Span { w, a, b } => {
                // split at the supports, where a piece's pull changes sign
                let mut cuts = vec![a];
                cuts.extend([0.0, l].into_iter().filter(|&c| c > a && c < b));
                cuts.push(b);
                for s in cuts.windows(2) {
                    add(w * (s[1] - s[0]), 0.5 * (s[0] + s[1]));
                }
            }
        }
    }
    (down, up)
}

/// The worst support: (lifting, holding, support at ℓ?, combination), lbf.
pub fn worst(an: &Analysis) -> Option<(f64, f64, bool, &'static str)> {
    let m = &an.member;
    if !m.overhangs() {
        return None;
    }
    let l = m.loads.beam.l;
    let mut best: Option<(f64, f64, bool, &'static str)> = None;
    for right in [false, true] {
        let p = |g: usize| parts(&m.loads.groups[g], l, right);
        let dead = [SELF, TOPPING, SDL].map(p);
        let hold = HOLDING_DEAD_FACTOR * dead.iter().map(|d| d.0).sum::<f64>();
        let dead_up: f64 = dead.iter().map(|d| d.1).sum();
        let (live_up, roof_up) = (p(LIVE).1, p(ROOF).1);
        for c in &COMBINATIONS {
            let lift = c.d * dead_up + c.l * live_up + c.r * roof_up;
            let worse = match best {
                None => true,
                Some((bl, bh, _, _)) => lift * bh > bl * hold,
            };
            if worse {
                best = Some((lift, hold, right, c.name));
            }
        }
    }
    best
}

/// Run the check (members with an overhang only).
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let (lift, hold, right, combo) = worst(an)?;
    let m = &an.member;
    let note = an.note(format_args!(
        "{} support: the loads beyond the other support lift it {:.2} kip ({combo}), the dead load that presses on it holds it down {:.2} kip (×{HOLDING_DEAD_FACTOR}); no tie-down assumed at a bearing",
        if right { "right" } else { "left" },
        lift / 1000.0,
        hold / 1000.0
    ));
    Some(CheckResult::new(
        &INFO,
        lift / 1000.0,
        hold / 1000.0,
        Some(if right { m.loads.beam.l } else { 0.0 }),
        note,
    ))
}

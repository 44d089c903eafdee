//! The member before service: stripping or lifting from the bed, yard
//! storage, transport and erection (ACI 318-19 §16.2.1 asks that the design
//! cover them; ACI gives no handling stress limits, so the PCI Design
//! Handbook's are used — next-capabilities §3).
//!
//! At each stage the member hangs or rests on two or four points with its
//! own weight times the stage's equivalent static multiplier, with the
//! prestress and the concrete strength of its age:
//!
//! | stage | age | supports | multiplier |
//! |---|---|---|---|
//! | stripping / lifting from the bed | release (f′ci, prestress after transfer) | the lift points | by product and finish (`finish`): hollow-core lifted from its bed 1.2 (no form suction: common practice, no source); a double tee stripped from a steel form as "fluted, with proper drafts", smooth mould 1.6, exposed aggregate 1.4 (the row: from memory, low confidence); other slabs "flat, removable side forms", smooth mould 1.3, exposed aggregate 1.2 |
//! | yard storage | 7 days (common practice, no source) | dunnage at the lift points (common practice, no source) | 1.2 |
//! | transport | the erection age | the truck bunks (`bunk_at`, default the lift points) | 1.5 |
//! | erection | the erection age | the lift points | 1.2 |
//!
//! The multipliers are the PCI Design Handbook's table of equivalent static
//! load multipliers, **from memory, medium confidence** [M-M]. Lift points:
//! two-point rigging at (√2 − 1)/2·L = 0.2071 L from each end, or four-point
//! equalising rigging at 0.104 L and 0.396 L (next-capabilities §3.3, [D]),
//! or where the bay says (`lift_at`). f′c at an age after release follows
//! ACI 209R-92 (steam cured, never below f′ci); the prestress loses the
//! share of its long-term loss that creep has reached
//! ([`crate::aging::creep_time`]).
//!
//! Limits (PCI, from memory, medium confidence): no cracking — extreme-fibre
//! tension at most fr/1.5 = 5λ√f′c(t); compression at most 0.60 f′c(t)
//! (common practice, after ACI 318-19 Table 24.5.3.1).

use serde::Serialize;

use crate::member::Member;
use crate::section::Family;

/// How the member is lifted.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Rigging {
    /// Two vertical slings.
    TwoPoint,
    /// Four points on equalising (rolling) blocks: every reaction a quarter.
    FourPoint,
}

/// Two-point lift points from each end, as a share of the member length:
/// (√2 − 1)/2, where the moments over the lifts and at midspan are equal
/// (next-capabilities §3.3, [D]).
pub const TWO_POINT: f64 = 0.207_106_781_186_547_5;
/// Four-point equalising lift points from each end, shares of the member
/// length (next-capabilities §3.3, [D]; the usual layout, from memory, medium confidence).
pub const FOUR_POINT: [f64; 2] = [0.104, 0.396];

/// One stage of the member's life before service, as checked.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Stage {
    /// Its name.
    pub name: &'static str,
    /// Age, days.
    pub age_days: f64,
    /// f′c at that age, psi.
    pub fc_psi: f64,
    /// Equivalent static multiplier on the self-weight.
    pub multiplier: f64,
    /// Where the multiplier comes from and its confidence.
    pub multiplier_source: &'static str,
    /// Support or lift points, in from the left bearing centre.
    pub supports_in: Vec<f64>,
    /// Strand stress at the stage, psi.
    pub fp_psi: f64,
    /// Greatest sagging moment, lbf·in.
    pub m_pos_lbin: f64,
    /// Greatest hogging moment (negative), lbf·in.
    pub m_neg_lbin: f64,
    /// The most tensile fibre stress (compression positive, so the most
    /// negative), psi.
    pub tension_psi: f64,
    /// Where the greatest tension is, in from the left bearing centre.
    pub tension_at_in: f64,
    /// Its fibre: top or bottom.
    pub tension_fibre: &'static str,
    /// The greatest compression, psi.
    pub compression_psi: f64,
    /// Where the greatest compression is, in from the left bearing centre.
    pub compression_at_in: f64,
    /// Its fibre.
    pub compression_fibre: &'static str,
    /// Tension limit 5λ√f′c(t) (as a positive number), psi.
    pub tension_limit_psi: f64,
    /// Compression limit 0.60 f′c(t), psi.
    pub compression_limit_psi: f64,
}

impl Stage {
    /// The larger of the tension and compression ratios.
    pub fn ratio(&self) -> f64 {
        let t = (-self.tension_psi).max(0.0) / self.tension_limit_psi;
        let c = self.compression_psi.max(0.0) / self.compression_limit_psi;
        t.max(c)
    }
}

/// The multiplier of stripping by product and finish (see the module
/// table; `exposed`: exposed aggregate with retarder, else a smooth mould
/// with form oil only) and its source.
pub fn stripping_multiplier(family: Family, exposed: bool) -> (f64, &'static str) {
    match (family, exposed) {
        (Family::HollowCore, _) => (
            1.2,
            "lifted from the bed, no form suction (common practice, no source): yard handling 1.2 (PCI, from memory)",
        ),
        (Family::DoubleTee, false) => (
            1.6,
            "stripped from a steel form, fluted with proper drafts, smooth mould (PCI, from memory; the row from memory, low confidence)",
        ),
        (Family::DoubleTee, true) => (
            1.4,
            "stripped from a form, fluted with proper drafts, exposed aggregate (PCI, from memory; the row from memory, low confidence)",
        ),
        (Family::Generic, false) => (1.3, "stripped, flat, removable side forms, smooth mould (PCI, from memory)"),
        (Family::Generic, true) => (1.2, "stripped, flat, removable side forms, exposed aggregate (PCI, from memory)"),
    }
}

/// The lift points of a member of length `lm` with ends `ends`, in from
/// the left bearing centre: at `at` from each end, else by the rigging.
pub fn lift_points(ends: (f64, f64), rigging: Rigging, at: Option<f64>) -> Vec<f64> {
    let (e0, e1) = ends;
    let lm = e1 - e0;
    let from_ends: Vec<f64> = match (at, rigging) {
        (Some(a), _) => vec![a.clamp(0.0, lm / 2.0)],
        (None, Rigging::TwoPoint) => vec![TWO_POINT * lm],
        (None, Rigging::FourPoint) => FOUR_POINT.iter().map(|f| f * lm).collect(),
    };
    let mut pts: Vec<f64> = from_ends.iter().map(|a| e0 + a).chain(from_ends.iter().map(|a| e1 - a)).collect();
    pts.sort_by(f64::total_cmp);
    pts.dedup_by(|a, b| (*a - *b).abs() < 1e-9);
    pts
}

/// The moment at `x` of a member from `ends.0` to `ends.1` under a uniform
/// `w` hung on `supports` that each carry an equal share (two vertical
/// slings, dunnage or bunks placed symmetrically, or equalising blocks).
pub fn moment(ends: (f64, f64), w: f64, supports: &[f64], x: f64) -> f64 {
    let (e0, e1) = ends;
    let r = w * (e1 - e0) / supports.len() as f64;
    let x = x.clamp(e0, e1);
    -w * (x - e0).powi(2) / 2.0 + supports.iter().filter(|&&s| s < x).map(|&s| r * (x - s)).sum::<f64>()
}

/// The bay's choices for handling.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Setup {
    /// Rigging.
    pub rigging: Rigging,
    /// Lift points from each end, in (None: by the rigging).
    pub lift_at: Option<f64>,
    /// Truck bunks from each end, in (None: at the lift points).
    pub bunk_at: Option<f64>,
    /// Age at erection, days.
    pub erection_age: f64,
}

/// Two-point lift positions tried, as shares of the member length from
/// each end, when the bay gives none: a prestressed member is best lifted
/// nearer its ends than the 0.207 L that balances the moments of a plain
/// one, since the hogging over the lifts adds to the top-fibre tension of
/// the prestress (next-capabilities §3.4, common practice, no source).
pub const LIFT_TRIALS: [f64; 9] = [0.04, 0.06, 0.08, 0.10, 0.12, 0.14, 0.16, 0.18, TWO_POINT];

impl Setup {
    /// The handling choices a bay's case makes.
    pub fn of(c: &crate::case::DesignCase) -> Setup {
        Setup {
            rigging: c.rigging,
            lift_at: c.lift_at.map(|l| l.get()),
            bunk_at: c.bunk_at.map(|l| l.get()),
            erection_age: c.erection_age,
        }
    }
}

/// Every stage of a member. With two-point rigging and no lift points
/// given, the lifts (and the dunnage under them) go where the stripping
/// stage — the most prestress on the weakest concrete — fares best among
/// [`LIFT_TRIALS`].
pub fn stages(m: &Member, setup: &Setup) -> Vec<Stage> {
    let cond = crate::checks::aging_conditions(m);
    let (e0, e1) = m.ends;
    let lm = e1 - e0;
    // every place a stage's extreme can lie, on the left half (the member,
    // its strands and its weight are symmetric, and so are the supports)
    let mut xs: Vec<f64> = (0..=12).map(|i| e0 + 0.5 * lm * i as f64 / 12.0).collect();
    xs.extend(LIFT_TRIALS.iter().map(|f| e0 + f * lm));
    xs.extend(FOUR_POINT.iter().map(|f| e0 + f * lm));
    xs.push(e0 + 0.25 * lm);
    for a in [setup.lift_at, setup.bunk_at].into_iter().flatten() {
        xs.push(e0 + a.clamp(0.0, lm / 2.0));
    }
    xs.push(e0 + m.ltr);
    if let Some(hd) = m.hold_down {
        xs.push(e0 + hd);
    }
    for layer in &m.layers {
        if layer.debond > 0.0 {
            xs.push(e0 + layer.debond + m.ltr);
        }
    }
    xs.retain(|&x| x <= e0 + 0.5 * lm + 1e-9);
    xs.sort_by(f64::total_cmp);
    xs.dedup_by(|a, b| (*a - *b).abs() < 1e-9);
    let pre: Vec<Point> = xs.iter().map(|&x| point(m, x)).collect();
    let (strip_k, strip_src) = stripping_multiplier(m.section.family, m.case.exposed_finish);
    let strip = |supports: &[f64]| {
        stage(
            m,
            &cond,
            &pre,
            "stripping",
            crate::camber::RELEASE_AGE_DAYS,
            strip_k,
            strip_src,
            supports,
        )
    };
    let lift = match (setup.rigging, setup.lift_at) {
        (Rigging::TwoPoint, None) => LIFT_TRIALS
            .iter()
            .map(|f| lift_points(m.ends, Rigging::TwoPoint, Some(f * lm)))
            .map(|pts| (strip(&pts).ratio(), pts))
            .min_by(|a, b| a.0.total_cmp(&b.0))
            .map(|p| p.1)
            .unwrap_or_default(),
        _ => lift_points(m.ends, setup.rigging, setup.lift_at),
    };
    let bunks = match setup.bunk_at {
        Some(b) => lift_points(m.ends, Rigging::TwoPoint, Some(b)),
        None => lift.clone(),
    };
    let yard = "yard handling and erection, all products (PCI, from memory)";
    let travel = "travel, all products (PCI, from memory)";
    let te = setup.erection_age.max(crate::camber::RELEASE_AGE_DAYS);
    vec![
        strip(&lift),
        stage(m, &cond, &pre, "yard storage", STORAGE_AGE_DAYS, 1.2, yard, &lift),
        stage(m, &cond, &pre, "transport", te, 1.5, travel, &bunks),
        stage(m, &cond, &pre, "erection", te, 1.2, yard, &lift),
    ]
}

/// Age of the stored members checked, days (common practice, no source).
pub const STORAGE_AGE_DAYS: f64 = 7.0;

/// What a stage needs at one place, worked out once: the fibre stresses of
/// the prestress after transfer (they scale with the strand stress) and the
/// stress of a unit moment in each fibre.
#[derive(Debug, Clone, Copy)]
struct Point {
    x: f64,
    top_p: f64,
    bottom_p: f64,
    top_m: f64,
    bottom_m: f64,
}

fn point(m: &Member, x: f64) -> Point {
    let (p, y) = m.force_at(x, m.history.fpo_psi, m.ltr);
    let (pr, _) = m.props_at(x);
    let e = pr.yb_in - y;
    Point {
        x,
        top_p: p / pr.area_in2 - p * e * pr.yt_in / pr.ix_in4,
        bottom_p: p / pr.area_in2 + p * e * pr.yb_in / pr.ix_in4,
        top_m: pr.yt_in / pr.ix_in4,
        bottom_m: -pr.yb_in / pr.ix_in4,
    }
}

#[allow(clippy::too_many_arguments)]
fn stage(
    m: &Member,
    cond: &crate::aging::Conditions,
    pre: &[Point],
    name: &'static str,
    age: f64,
    k: f64,
    src: &'static str,
    supports: &[f64],
) -> Stage {
    use crate::aging::{creep_time, strength_ratio};
    let at_release = age <= crate::camber::RELEASE_AGE_DAYS;
    let fci = m.mix.fci.get();
    let fc = if at_release {
        fci
    } else {
        (m.mix.fc.get() * strength_ratio(age, cond.curing) / strength_ratio(28.0, cond.curing)).clamp(fci, m.mix.fc.get())
    };
    let h = &m.history;
    let loss = ((h.fpo_psi - h.fse_psi) / h.fpo_psi).max(0.0);
    let fp = if at_release {
        h.fpo_psi
    } else {
        h.fpo_psi * (1.0 - loss * creep_time(age - crate::camber::RELEASE_AGE_DAYS))
    };
    let scale = fp / h.fpo_psi;
    // the bare precast member, its own weight only (of the whole section:
    // an opening is usually cut or blocked out with the member whole)
    let w = m.bare.area_in2 * m.mix.unit_weight.get() * k;
    let (mut m_pos, mut m_neg) = (0.0f64, 0.0f64);
    let mut tension = (f64::INFINITY, 0.0, "top");
    let mut compression = (f64::NEG_INFINITY, 0.0, "top");
    for pt in pre {
        let mx = moment(m.ends, w, supports, pt.x);
        m_pos = m_pos.max(mx);
        m_neg = m_neg.min(mx);
        let top = scale * pt.top_p + mx * pt.top_m;
        let bottom = scale * pt.bottom_p + mx * pt.bottom_m;
        for (f, fibre) in [(top, "top"), (bottom, "bottom")] {
            if f < tension.0 {
                tension = (f, pt.x, fibre);
            }
            if f > compression.0 {
                compression = (f, pt.x, fibre);
            }
        }
    }
    Stage {
        name,
        age_days: age,
        fc_psi: fc,
        multiplier: k,
        multiplier_source: src,
        supports_in: supports.to_vec(),
        fp_psi: fp,
        m_pos_lbin: m_pos,
        m_neg_lbin: m_neg,
        tension_psi: tension.0,
        tension_at_in: tension.1,
        tension_fibre: tension.2,
        compression_psi: compression.0,
        compression_at_in: compression.1,
        compression_fibre: compression.2,
        tension_limit_psi: 5.0 * m.mix.aggregate.lambda() * fc.sqrt(),
        compression_limit_psi: 0.60 * fc,
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn lift_point_moments_as_derived() {
        // next-capabilities §3.3 / §8 [D]: two-point lifts at 0.2071L give
        // wa²/2 = 0.02145 wL² over the lifts and the same at midspan;
        // four-point equalising at 0.104L / 0.396L: −0.00541 wL² at the
        // lifts, +0.00525 wL² at 0.25L, 0 at midspan.
        let l = 100.0;
        let w = 1.0;
        let ends = (0.0, l);
        let two = lift_points(ends, Rigging::TwoPoint, None);
        assert_relative_eq!(two[0], 20.710678, epsilon = 1e-6);
        assert_relative_eq!(moment(ends, w, &two, two[0]), -0.02145 * l * l, epsilon = 1e-3 * l * l * 0.02145);
        assert_relative_eq!(moment(ends, w, &two, l / 2.0), 0.02145 * l * l, epsilon = 1e-3 * l * l * 0.02145);
        let four = lift_points(ends, Rigging::FourPoint, None);
        assert_eq!(four.len(), 4);
        assert_relative_eq!(moment(ends, w, &four, four[0]), -0.00541 * l * l, epsilon = 1e-5 * l * l);
        assert_relative_eq!(moment(ends, w, &four, 0.25 * l), 0.00525 * l * l, epsilon = 1e-5 * l * l);
        assert_relative_eq!(moment(ends, w, &four, 0.5 * l), 0.0, epsilon = 1e-5 * l * l);
        // supports at the ends: wL²/8
        assert_relative_eq!(moment(ends, w, &[0.0, l], l / 2.0), l * l / 8.0, epsilon = 1e-9);
    }

    #[test]
    fn the_tension_limit_is_fr_over_one_and_a_half() {
        // PCI (from memory, medium confidence): 7.5λ√f′c / 1.5 = 5λ√f′c
        assert_relative_eq!(7.5 / 1.5, 5.0);
    }
}

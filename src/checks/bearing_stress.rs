//! Bearing strength of the member's end on its support, ACI 318-19 §22.8
//! (Table 22.8.3.2): φBn ≥ Bu with φ = 0.65 (Table 21.2.1) and Bn =
//! 0.85 f′c A1 — the support is taken no wider than the bearing area, so
//! the √(A2/A1) increase is not used (conservative). Clause numbers and φ
//! from memory, high confidence [M-H] (next-capabilities §6).
//!
//! Bu is the largest factored reaction at either support over the ASCE 7
//! combinations (with an overhang, the jump in shear across the support).
//! A1 is the bearing width — the unit's width for a slab, the stems'
//! bottom widths for a double tee, or the bay's `pad_width` — times the
//! bearing length less the ½ in a pad is set back from the face of the
//! support (ACI 318-19 16.2.6.2(b), from memory, high confidence).
//!
//! Worst point: the supports, where the reactions are.

use super::{Analysis, CheckInfo, CheckResult, Group, Reads};
use crate::case::{COMBINATIONS, Effects};

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "bearing_stress",
    title: "Bearing strength Bu ≤ φBn",
    clause: "ACI 318-19 22.8.3.2 (Table 22.8.3.2), 21.2.1, 16.2.6.2(b) (from memory)",
    unit: "kip",
    group: Group::Bearing,
    reads: Reads::Demand,
    load_driven: true,
};

/// φ for bearing on concrete (ACI 318-19 Table 21.2.1, from memory, high confidence).
pub const PHI_BEARING: f64 = 0.65;

/// How far a bearing pad is set back from the face of the support, in
/// (ACI 318-19 16.2.6.2(b), from memory, high confidence).
pub const PAD_SETBACK_IN: f64 = 0.5;

/// The reaction at the support at `xs` by load group: the jump in shear
/// across it (shear in the sense of the member's statics).
fn reaction(an: &Analysis, xs: f64) -> Effects {
    let m = &an.member;
    let (lo, hi) = m.range();
    let e = 1e-6;
    let v = |g: usize, x: f64| if x < lo || x > hi { 0.0 } else { m.loads.at(g, x).1 };
    let r = |g: usize| (v(g, xs + e) - v(g, xs - e)).abs();
    Effects {
        v_self: r(crate::loads::SELF),
        v_topping: r(crate::loads::TOPPING),
        v_sdl: r(crate::loads::SDL),
        v_live: r(crate::loads::LIVE),
        v_roof: r(crate::loads::ROOF),
        ..Effects::default()
    }
}

/// The largest factored reaction (lbf), the support (0 left, 1 right) and
/// the combination.
pub fn factored_reaction(an: &Analysis) -> (f64, usize, &'static str) {
    let mut best = (0.0, 0, "");
    for (i, xs) in [0.0, an.member.l].into_iter().enumerate() {
        let r = reaction(an, xs);
        for c in &COMBINATIONS {
            let v = c.apply(&r).1;
            if v > best.0 {
                best = (v, i, c.name);
            }
        }
    }
    best
}

/// The largest service reaction (lbf): dead plus the larger of the live
/// and the roof load, unfactored, at either support.
pub fn service_reaction(an: &Analysis) -> f64 {
    [0.0, an.member.l]
        .into_iter()
        .map(|xs| {
            let r = reaction(an, xs);
            r.v_dead() + r.v_live.max(r.v_roof)
        })
        .fold(0.0, f64::max)
}

/// The bearing width, in: the bay's pad width if given, else the unit's
/// width (slabs) or the stems' summed width at the soffit (double tees).
pub fn bearing_width(an: &Analysis) -> f64 {
    let m = &an.member;
    match m.case.pad_width {
        Some(w) => w.get(),
        None => match m.section.family {
            crate::section::Family::DoubleTee => m.section.geometry.width_at(1e-3),
            _ => m.section.props.width_in,
        },
    }
}

/// Run the check.
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let m = &an.member;
    let (bu, side, combo) = factored_reaction(an);
    let length = (m.case.bearing.get() - PAD_SETBACK_IN).max(0.0);
    let width = bearing_width(an);
    let a1 = width * length;
    let phi_bn = PHI_BEARING * 0.85 * m.mix.fc.get() * a1;
    Some(CheckResult::new(
        &INFO,
        bu / 1000.0,
        phi_bn / 1000.0,
        Some(if side == 0 { 0.0 } else { m.l }),
        an.note(format_args!(
            "{combo} at the {} support; A1 = {width:.1} in × ({:.2} in bearing − {PAD_SETBACK_IN} in setback) = {a1:.1} in², φBn = 0.65 × 0.85 f′c A1, f′c = {:.0} psi; no √(A2/A1) increase",
            if side == 0 { "left" } else { "right" },
            m.case.bearing.get(),
            m.mix.fc.get()
        )),
    ))
}

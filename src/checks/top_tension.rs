//! Tension in the top fibre at service where an overhang makes the moment
//! hog: the hogging moment adds its top tension to the prestress's own.
//!
//! The top fibre over a support is not a precompressed tension zone, so
//! Table 24.5.2.1 does not classify it; it is held to 7.5√f′c, the class U
//! limit, so that it stays uncracked (common practice, no source). With
//! mild top bars given (`top_bars`), the limit is 12√f′c provided the bars
//! carry the whole tension force of the uncracked section at 30 ksi (the
//! rule ACI 318-19 §24.5.3.2.1 gives at release, applied here by analogy:
//! common practice, no source). Service moments: the least of D alone and
//! the combinations of ASCE 7-16 §2.4.1 ([`crate::case::service_least`]).
//!
//! Where the worst point lies: the stress is quadratic in x between
//! stations, so its maximum is at a station or a segment's vertex
//! ([`super::peak`]).

use super::{Analysis, CheckInfo, CheckResult, Group, Reads, peak};
use crate::member::Member;

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "top_tension_hogging",
    title: "Top-fibre tension where the moment hogs (overhang)",
    clause: "ACI 318-19 24.5.2.1 (class U limit applied to the top fibre); 24.5.3.2.1 by analogy with top bars",
    unit: "psi",
    group: Group::Stresses,
    reads: Reads::Stress,
    load_driven: true,
};

/// Stress the top bars may carry, psi (§24.5.3.2.1: 0.6 fy, at most 30 ksi).
const BAR_STRESS_PSI: f64 = 30_000.0;

/// The tension force (lbf) in the concrete of the uncracked section at `x`
/// when the top fibre is at `top` (psi, tension negative): the stress is
/// linear over the depth, so the force over the part in tension is its
/// area times the stress at its centroid.
fn tension_force(m: &Member, x: f64, top: f64, bottom: f64) -> f64 {
    let b = m.props_at(x).0;
    let h = b.depth_in;
    if top >= 0.0 {
        return 0.0;
    }
    // stress at height y: bottom + (top − bottom)·y/h; zero at y0
    let y0 = if top == bottom {
        0.0
    } else {
        (h * (-bottom) / (top - bottom)).clamp(0.0, h)
    };
    let zone = m.section.geometry.moments_between(y0, h);
    if zone.area <= 0.0 {
        return 0.0;
    }
    let yc = zone.qx / zone.area;
    -(bottom + (top - bottom) * yc / h) * zone.area
}

/// Run the check (members with an overhang only).
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let m = &an.member;
    if !m.overhangs() {
        return None;
    }
    let rt = m.mix.fc.get().sqrt();
    let bars = m.case.top_bars.get();
    let limit = if bars > 0.0 { 12.0 * rt } else { 7.5 * rt };
    let p = peak(
        an,
        |s, _| -s.top_least_psi,
        |_, _| limit,
        |x, _| -super::service::at(m, x, m.effective_at(x), &m.effects(x)).top_least_psi,
    )?;
    let mut r = CheckResult::tension(
        &INFO,
        -p.value,
        limit,
        Some(p.x_in),
        an.note(format_args!(
            "precast top fibre under the least service moment; {}",
            if bars > 0.0 {
                "12√f'c with the top bars carrying the tension force at 30 ksi"
            } else {
                "7.5√f'c (uncracked); give top_bars to allow more"
            }
        )),
    );
    if bars > 0.0 && p.value > 7.5 * rt {
        let s = super::service::at(m, p.x_in, m.effective_at(p.x_in), &m.effects(p.x_in));
        let t = tension_force(m, p.x_in, s.top_least_psi, s.bottom_least_psi);
        if bars * BAR_STRESS_PSI < t {
            r.pass = false;
            r.ratio = r.ratio.max(t / (bars * BAR_STRESS_PSI));
            if !an.brief {
                r.note.push_str(&format!(
                    "; the tension force {:.1} kip needs {:.2} in² of bars at 30 ksi, {:.2} in² given",
                    t / 1000.0,
                    t / BAR_STRESS_PSI,
                    bars
                ));
            }
        }
    }
    Some(r)
}

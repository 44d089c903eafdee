//! Punching of the flange under a concentrated load: two-way shear of the
//! double tee's flange, or of the top flange over a hollow-core core, with
//! any topping.
//!
//! Clauses: ACI 318-19 §22.6.4.1 (critical perimeter bo at d/2 from the
//! loaded area), §22.6.5.2 (Table 22.6.5.2: vc the least of 4λsλ√f′c,
//! (2 + 4/β)λsλ√f′c and (2 + αs d/bo)λsλ√f′c, αs = 40 for an interior
//! load), the size-effect factor λs = √(2/(1 + d/10)) ≤ 1 (§22.5.5.1.3),
//! √f′c ≤ 100 psi (§22.6.3.1), φ = 0.75 (Table 21.2.1); the clause numbers
//! from memory, high confidence (reference sheet next-capabilities §2.2).
//! d = 0.8 of the slab thickness, the flange not being reinforced by
//! design (common practice, no source); the slab is the top flange (over a
//! core for hollow-core, where it is thinnest) plus the topping, with the
//! lower f′c of the two. The factored load is the load itself times 1.4
//! (dead) or 1.6 (live, roof live, snow) — what combinations 1–3 of ASCE
//! 7-16 §2.3.1 put on it; the flange's own weight inside the perimeter is
//! left out. A load near a free edge or a corner has a shorter perimeter
//! (αs 30 or 20), which is not checked.

use super::{Analysis, CheckInfo, CheckResult, Group, Reads, kip};
use crate::case::{LoadKind, Placed};

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "punching",
    title: "Punching of the flange under a point load",
    clause: "ACI 318-19 22.6.4.1, 22.6.5.2 (with λs); φ 21.2.1",
    unit: "kip",
    group: Group::Shear,
    reads: Reads::Demand,
    load_driven: true,
};

/// Strength reduction factor for shear, Table 21.2.1.
const PHI: f64 = 0.75;

/// The punching strength φVc (lbf) of a slab `h` thick (in) under a loaded
/// area `c1` × `c2` (in), in concrete of `fc` (psi), λ `lam`, interior
/// (αs = 40): (φVc, d, bo, vc) with d = 0.8h.
pub fn strength(h: f64, c1: f64, c2: f64, fc: f64, lam: f64) -> (f64, f64, f64, f64) {
    let d = 0.8 * h;
    let bo = 2.0 * (c1 + d) + 2.0 * (c2 + d);
    let beta = c1.max(c2) / c1.min(c2).max(1e-9);
    let lam_s = (2.0 / (1.0 + d / 10.0)).sqrt().min(1.0);
    let rt = fc.sqrt().min(100.0);
    let k = 4.0f64.min(2.0 + 4.0 / beta).min(2.0 + 40.0 * d / bo);
    let vc = k * lam_s * lam * rt;
    (PHI * vc * bo * d, d, bo, vc)
}

/// Run the check (bays with point loads only): the worst point load.
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let m = &an.member;
    let t = m.case.topping.as_ref();
    let h = m.bare.top_flange_in + t.map_or(0.0, |t| t.thickness.get());
    let fc = t.map_or(m.mix.fc.get(), |t| t.mix.fc.get().min(m.mix.fc.get()));
    let lam = m.mix.aggregate.lambda();
    let mut best: Option<(f64, f64, f64, usize, f64, f64, f64)> = None;
    let mut k = 0;
    for pl in &m.case.placed {
        let Placed::Point(p) = pl.load else { continue };
        k += 1;
        let factor = if pl.kind == LoadKind::Dead { 1.4 } else { 1.6 };
        let pu = factor * p.p.get();
        let (c1, c2) = (p.size.0.get(), p.size.1.get());
        let (cap, d, bo, vc) = strength(h, c1, c2, fc, lam);
        if best.is_none_or(|b| pu / cap > b.0 / b.1) {
            best = Some((pu, cap, p.at.get(), k, d, bo, vc));
        }
    }
    let (pu, cap, x, k, d, bo, vc) = best?;
    Some(CheckResult::new(
        &INFO,
        kip(pu),
        kip(cap),
        Some(x),
        an.note(format_args!(
            "point {k}: slab {h:.2} in ({}), d = 0.8h = {d:.2} in, bo = {bo:.1} in, vc = {vc:.0} psi; interior perimeter (an edge or corner load is not checked)",
            if m.section.family == crate::section::Family::HollowCore {
                "top flange over a core"
            } else {
                "flange"
            }
            .to_string()
                + if t.is_some() { " + topping" } else { "" }
        )),
    ))
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn reference_sheet_vectors() {
        // next-capabilities §8 (derived from ACI 318-19 §22.6 as the sheet
        // gives it): 4 × 4 in load, f′c 5000 psi, λ 1, αs 40, d = 0.8h.
        // h = 2 in: d 1.6, bo 22.4 in, λs 1.0, vc = 4√f′c = 282.8 psi, φVc 7.6 kip.
        let (cap, d, bo, vc) = strength(2.0, 4.0, 4.0, 5000.0, 1.0);
        assert_relative_eq!(d, 1.6);
        assert_relative_eq!(bo, 22.4);
        assert_relative_eq!(vc, 282.84, max_relative = 1e-4);
        assert_relative_eq!(cap / 1000.0, 7.6, max_relative = 5e-3);
        // h = 4 in (2 in flange + 2 in topping): d 3.2, bo 28.8 in, φVc 19.55 → 19.6 kip
        let (cap, d, bo, _) = strength(4.0, 4.0, 4.0, 5000.0, 1.0);
        assert_relative_eq!(d, 3.2);
        assert_relative_eq!(bo, 28.8);
        assert_relative_eq!(cap / 1000.0, 19.55, max_relative = 2e-3);
        // a long, narrow load: β = 4 gives (2 + 4/β) = 3 < 4
        let (_, _, _, vc) = strength(2.0, 16.0, 4.0, 5000.0, 1.0);
        assert_relative_eq!(vc, 3.0 * 5000f64.sqrt(), max_relative = 1e-9);
        // a deep slab: λs < 1 once d > 10 in
        let (_, d, _, vc) = strength(15.0, 40.0, 40.0, 4000.0, 1.0);
        assert_relative_eq!(d, 12.0);
        assert_relative_eq!(vc, 4.0 * (2.0f64 / 2.2).sqrt() * 4000f64.sqrt(), max_relative = 1e-9);
    }
}

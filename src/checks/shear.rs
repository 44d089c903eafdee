//! One-way shear strength without shear reinforcement, Vu ≤ φVc, at every
//! station from h/2 off the support face (ACI 318-19 §7.4.3.2 / §9.4.3.2).
//!
//! Clauses: ACI 318-19 §22.5.6.3: Vc the lesser of flexure-shear
//! Vci = 0.6λ√f′c bw dp + Vd + Vi·Mcre/Mmax ≥ 1.7λ√f′c bw dp (Eq.
//! 22.5.6.3.1a/b), Mcre = (I/yt)(6λ√f′c + fpe − fd) (Eq. 22.5.6.3.1c), and
//! web-shear Vcw = (3.5λ√f′c + 0.3 fpc) bw dp + Vp (Eq. 22.5.6.3.2);
//! dp ≥ 0.8h; √f′c ≤ 100 psi (§22.5.3.1); prestress built up linearly over
//! 50 db (§22.5.9); φ = 0.75 (Table 21.2.1). Vi = Vu − Vd and Mmax = Mu − Md
//! (commentary R22.5.6.3.1, reference sheet from memory, medium). bw is the
//! least summed web width. Hollow-core (a one-way slab) passes with
//! Vu ≤ φVc (§7.6.3.1); untopped units deeper than 12.5 in also need
//! Vu ≤ 0.5φVcw ([`DEEP_INFO`]). Double-tee stems are beams: the note names
//! where Av,min is needed (Vu > 0.5φVc, §9.6.3.1); Vu > φVc fails as it
//! would need designed stirrups, which are not checked.

use serde::Serialize;

use super::{Analysis, CheckInfo, CheckResult, Group, kip};
use crate::case::Effects;
use crate::member::{Effective, Member};
use crate::section::Family;

/// Registry entry: Vu ≤ φVc.
pub const INFO: CheckInfo = CheckInfo {
    id: "shear",
    title: "Shear strength (Vci, Vcw)",
    clause: "ACI 318-19 22.5.6.3, 22.5.9, 7.6.3.1 / 9.6.3.1; φ 21.2.1",
    unit: "kip",
    group: Group::Shear,
};

/// Registry entry: deep untopped hollow-core.
pub const DEEP_INFO: CheckInfo = CheckInfo {
    id: "shear_deep_hollow_core",
    title: "Deep hollow-core without stirrups: Vu ≤ 0.5 φVcw",
    clause: "ACI 318-19 7.6.3.1",
    unit: "kip",
    group: Group::Shear,
};

/// Shear strength at one station, lbf.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct AtStation {
    /// Flexure-shear strength.
    pub vci_lbf: f64,
    /// Web-shear strength.
    pub vcw_lbf: f64,
    /// φVc.
    pub phi_vc_lbf: f64,
    /// Factored shear.
    pub vu_lbf: f64,
}

const PHI: f64 = 0.75;

/// Shear strength at distance `d` from the end, with the station's effects
/// and factored Mu, Vu.
pub fn at(m: &Member, d: f64, pre: Effective, eff: &Effects, mu: f64, vu: f64) -> AtStation {
    let lam = m.mix.aggregate.lambda();
    let rt = m.mix.fc.get().sqrt().min(100.0);
    let b = m.bare;
    let bw = b.web_width_min_in;
    let (pe, y) = (pre.pe_shear, pre.y_shear);
    let dp = (m.h_total - y).max(0.8 * m.h_total);
    let e = b.yb_in - y;
    let fpe = pe / b.area_in2 + pe * e / b.sb_in3;
    let mnc = eff.m_self + eff.m_topping;
    let (s_ext, fd, fpc) = match m.comp {
        Some(c) => {
            // stress at the composite centroid (or the web–flange junction
            // when that centroid lies in the flange) from prestress and the
            // moments the precast carries alone
            let y_web_top = b.depth_in - b.top_flange_in;
            let yr = c.yb_in.min(y_web_top) - b.yb_in;
            let fpc = pe / b.area_in2 - pe * e * yr / b.ix_in4 + mnc * yr / b.ix_in4;
            (c.sb_in3, mnc / b.sb_in3 + eff.m_sdl / c.sb_in3, fpc)
        }
        None => (b.sb_in3, eff.m_dead() / b.sb_in3, pe / b.area_in2),
    };
    let mcre = s_ext * (6.0 * lam * rt + fpe - fd);
    let vd = eff.v_dead().abs();
    let vi = (vu - vd).max(0.0);
    let mmax = (mu - eff.m_dead()).max(1e-6);
    let vci = (0.6 * lam * rt * bw * dp + vd + vi * mcre.max(0.0) / mmax).max(1.7 * lam * rt * bw * dp);
    let vcw = (3.5 * lam * rt + 0.3 * fpc) * bw * dp + m.vp_at(d);
    AtStation {
        vci_lbf: vci,
        vcw_lbf: vcw,
        phi_vc_lbf: PHI * vci.min(vcw),
        vu_lbf: vu,
    }
}

/// Run the check.
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let shear: Vec<(&super::Station, &AtStation)> = an.stations.iter().filter_map(|s| s.shear.as_ref().map(|v| (s, v))).collect();
    let (s, v) = shear
        .iter()
        .copied()
        .max_by(|a, b| (a.1.vu_lbf / a.1.phi_vc_lbf).total_cmp(&(b.1.vu_lbf / b.1.phi_vc_lbf)))?;
    let governs = if v.vci_lbf <= v.vcw_lbf {
        "Vci (flexure-shear)"
    } else {
        "Vcw (web-shear)"
    };
    let mut note = an.note(format_args!("{governs} governs; {}", s.vu_combo));
    if an.member.section.family == Family::DoubleTee {
        let need: Vec<f64> = shear
            .iter()
            .filter(|(_, v)| v.vu_lbf > 0.5 * v.phi_vc_lbf)
            .map(|(s, _)| s.x_in / 12.0)
            .collect();
        if let (Some(a), Some(b)) = (need.first(), need.last()) {
            note.push_str(&an.note(format_args!(
                "; stems need Av,min (9.6.3.1, Vu > 0.5φVc) over {a:.1}–{b:.1} ft; designed stirrups beyond φVc are not checked"
            )));
        } else {
            note.push_str("; Vu ≤ 0.5φVc throughout: no web reinforcement required (9.6.3.1)");
        }
    }
    Some(CheckResult::new(&INFO, kip(v.vu_lbf), kip(v.phi_vc_lbf), Some(s.x_in), note))
}

/// Untopped hollow-core deeper than 12.5 in: Vu ≤ 0.5φVcw (§7.6.3.1).
pub fn run_deep(an: &Analysis) -> Option<CheckResult> {
    let m = &an.member;
    if m.section.family != Family::HollowCore || m.comp.is_some() || m.bare.depth_in <= 12.5 * (1.0 + 1e-9) {
        return None;
    }
    let (s, v) = an
        .stations
        .iter()
        .filter_map(|s| s.shear.as_ref().map(|v| (s, v)))
        .max_by(|a, b| (a.1.vu_lbf / a.1.vcw_lbf).total_cmp(&(b.1.vu_lbf / b.1.vcw_lbf)))?;
    Some(CheckResult::new(
        &DEEP_INFO,
        kip(v.vu_lbf),
        kip(0.5 * PHI * v.vcw_lbf),
        Some(s.x_in),
        an.note(format_args!(
            "untopped depth {:.1} in > 12.5 in; no stirrups in hollow-core",
            m.bare.depth_in
        )),
    ))
}

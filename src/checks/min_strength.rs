//! Minimum flexural strength: φMn ≥ 1.2 Mcr.
//!
//! Clauses: ACI 318-19 §7.6.2.1 (one-way slabs: hollow-core) and §9.6.2.1
//! (beams: double tees), with the exception of §7.6.2.2 / §9.6.2.2: not
//! required where both φMn ≥ 2 Mu and φVn ≥ 2 Vu. fr = 7.5λ√f′c
//! (§19.2.3.1). Mcr with the effective prestress, in the staged composite
//! form when topped ([`super::flexure::mcr`]). Checked at the station of
//! greatest factored moment.

use super::{Analysis, CheckInfo, CheckResult, Group, kipft};
use crate::section::Family;

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "min_strength",
    title: "Minimum strength φMn ≥ 1.2 Mcr",
    clause: "ACI 318-19 7.6.2.1 / 9.6.2.1 (exception 7.6.2.2 / 9.6.2.2)",
    unit: "kip-ft",
    group: Group::Strength,
};

/// Run the check.
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let s = an.stations.iter().max_by(|a, b| a.mu_lbin.total_cmp(&b.mu_lbin))?;
    let f = &s.flexure;
    let clause = if an.member.section.family == Family::HollowCore {
        "7.6.2"
    } else {
        "9.6.2"
    };
    let two_m = f.phi_mn_lbin >= 2.0 * s.mu_lbin;
    let two_v = an
        .stations
        .iter()
        .filter_map(|s| s.shear.as_ref())
        .all(|v| v.phi_vc_lbf >= 2.0 * v.vu_lbf);
    let mut r = CheckResult::new(
        &INFO,
        kipft(1.2 * f.mcr_lbin),
        kipft(f.phi_mn_lbin),
        Some(s.x_in),
        an.note(format_args!("Mcr = {:.1} kip-ft at the section of greatest Mu", kipft(f.mcr_lbin))),
    );
    if !r.pass && two_m && two_v {
        // waived: the ratio becomes that of the waiver's own condition, so
        // that it still reads ≤ 1 exactly when the check passes
        let shear = an
            .stations
            .iter()
            .filter_map(|s| s.shear.as_ref())
            .map(|v| 2.0 * v.vu_lbf / v.phi_vc_lbf)
            .fold(0.0, f64::max);
        r.ratio = (2.0 * s.mu_lbin / f.phi_mn_lbin).max(shear);
        r.pass = true;
        r.note.push_str(&an.note(format_args!(
            "; waived by {clause}.2: φMn ≥ 2Mu and φVn ≥ 2Vu (ratio shown is the larger of 2Mu/φMn and 2Vu/φVc)"
        )));
    }
    Some(r)
}

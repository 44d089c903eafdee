//! Minimum flexural strength: the reinforcement develops a factored load at
//! least 1.2 times the cracking load.
//!
//! Clauses: ACI 318-19 §7.6.2.1 (one-way slabs: hollow-core) and §9.6.2.1
//! (beams: double tees), with the exception of §7.6.2.2 / §9.6.2.2: not
//! required where both φMn ≥ 2 Mu and φVn ≥ 2 Vu (numbering from memory,
//! high). fr = 7.5λ√f′c (§19.2.3.1). Mcr with the effective prestress at
//! each station, in the staged composite form when topped
//! ([`super::flexure::mcr`]).
//!
//! "Load" is read as the factored load pattern scaled as a whole: the
//! cracking load is λcr·(factored loads) with λcr the least Mcr/Mu over the
//! member, the strength load λn·(factored loads) with λn the least φMn/Mu,
//! and the requirement is λn ≥ 1.2 λcr. Where both least values lie at the
//! section of greatest moment this is the familiar φMn ≥ 1.2 Mcr there;
//! near the ends, where Mcr counts prestress not yet developed for φMn,
//! comparing moments section by section would reject every member. λn is
//! the least φMn/Mu of the flexure check, found with its refinement; a
//! λcr missed between stations could only be larger, which makes the check
//! stricter.
//!
//! The result says which rule applied: the requirement met outright (then
//! it does not limit the load and never governs), waived (demand and
//! capacity are those of the waiver's governing part, 2Mu against φMn or
//! 2Vu against φVn, and it governs as a load limit: more load ends the
//! waiver), or failed.

use super::{Analysis, CheckInfo, CheckResult, Group, Reads, kip, kipft};
use crate::section::Family;

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "min_strength",
    title: "Minimum strength φMn ≥ 1.2 Mcr",
    clause: "ACI 318-19 7.6.2.1 / 9.6.2.1 (exception 7.6.2.2 / 9.6.2.2)",
    unit: "kip-ft",
    group: Group::Strength,
    reads: Reads::Demand,
    load_driven: false,
};

/// Run the check.
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let clause = if an.member.section.family == Family::HollowCore {
        "7.6.2"
    } else {
        "9.6.2"
    };
    let loaded = || an.stations.iter().filter(|s| s.mu_lbin > 0.0);
    // cracking load factor: the least Mcr/Mu (a section that would crack
    // under the precast's own dead load counts as cracking at no load)
    let lam = |s: &super::Station| s.flexure.mcr_lbin.max(0.0) / s.mu_lbin;
    let cr = loaded().min_by(|a, b| lam(a).total_cmp(&lam(b)))?;
    let lam_cr = lam(cr);
    // strength load factor: the least φMn/Mu, where the flexure check finds it
    let fl = super::flexure::worst(an)?;
    let lam_n = fl.phi_mn_lbin / fl.mu_lbin;
    let need = 1.2 * lam_cr * fl.mu_lbin;
    let mut r = CheckResult::new(
        &INFO,
        kipft(need),
        kipft(fl.phi_mn_lbin),
        Some(fl.x_in),
        an.note(format_args!(
            "met outright: 1.2 Mcr = {:.1} kip-ft ≤ φMn = {:.1} kip-ft (cracking first at {:.2} ft, Mcr {:.1} kip-ft; factored load ×{:.2} to crack, ×{:.2} to reach φMn); a requirement the load does not change, so it never governs",
            kipft(need),
            kipft(fl.phi_mn_lbin),
            cr.x_in / 12.0,
            kipft(cr.flexure.mcr_lbin),
            lam_cr,
            lam_n
        )),
    );
    if r.pass {
        r.governs = false;
        return Some(r);
    }
    // §7.6.2.2 / §9.6.2.2: waived where φMn ≥ 2Mu and φVn ≥ 2Vu
    let m_ratio = 2.0 / lam_n;
    // 2Vu/φVn is greatest where Vu/φVn is
    let v = super::shear::worst_vn(an);
    let v_ratio = v.map_or(0.0, |v| 2.0 * v.ratio);
    if m_ratio <= 1.0 + 1e-9 && v_ratio <= 1.0 + 1e-9 {
        let (demand, capacity, unit_note) = match v {
            Some(v) if v_ratio > m_ratio => (
                2.0 * v.combo.vu_lbf,
                v.combo.phi_vn_lbf,
                format!(
                    "2Vu = {:.2} kip ≤ φVn = {:.2} kip governs the waiver",
                    kip(2.0 * v.combo.vu_lbf),
                    kip(v.combo.phi_vn_lbf)
                ),
            ),
            _ => (
                2.0 * fl.mu_lbin,
                fl.phi_mn_lbin,
                format!(
                    "2Mu = {:.1} kip-ft ≤ φMn = {:.1} kip-ft governs the waiver",
                    kipft(2.0 * fl.mu_lbin),
                    kipft(fl.phi_mn_lbin)
                ),
            ),
        };
        let note = an.note(format_args!(
            "waived by {clause}.2 (φMn ≥ 2Mu and φVn ≥ 2Vu): 1.2 Mcr = {:.1} kip-ft > φMn = {:.1} kip-ft is not required; {unit_note}; more load ends the waiver",
            kipft(need),
            kipft(fl.phi_mn_lbin)
        ));
        let (d, c, x, unit) = match v {
            Some(v) if v_ratio > m_ratio => (kip(demand), kip(capacity), v.x_in, "kip"),
            _ => (kipft(demand), kipft(capacity), fl.x_in, "kip-ft"),
        };
        let mut w = CheckResult::new(&INFO, d, c, Some(x), note);
        w.unit = unit;
        w.governs = true;
        return Some(w);
    }
    r.governs = false;
    // where strand is not yet developed the φ of Table 21.2.3 is what falls short
    let phi_note = if fl.phi_mn_lbin <= 0.0 {
        format!(
            "; no strand or bar carries stress at {:.2} ft (each is cut by an opening or not yet bonded): no flexural strength there",
            fl.x_in / 12.0
        )
    } else if fl.at.developed {
        String::new()
    } else {
        format!(
            "; φMn at {:.2} ft takes φ = {:.2}: strand not fully developed there (21.2.3, Table 21.2.3 from memory)",
            fl.x_in / 12.0,
            fl.at.phi
        )
    };
    r.note = an.note(format_args!(
        "1.2 Mcr = {:.1} kip-ft > φMn = {:.1} kip-ft (cracking first at {:.2} ft), and not waived by {clause}.2: 2Mu/φMn = {}, 2Vu/φVn = {}{phi_note}",
        kipft(need),
        kipft(fl.phi_mn_lbin),
        cr.x_in / 12.0,
        if m_ratio.is_finite() { format!("{m_ratio:.2}") } else { "unbounded (φMn = 0)".to_string() },
        if v.is_some_and(|v| v.ratio >= super::RATIO_NONE) { "unbounded (φVn = 0)".to_string() } else { format!("{v_ratio:.2}") }
    ));
    Some(r)
}

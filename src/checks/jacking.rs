//! Jacking stress of the strand.
//!
//! Clause: ACI 318-19 Table 20.3.2.5.1: during stressing, the least of
//! 0.94 fpy and 0.80 fpu (and the manufacturer's recommendation, which the
//! catalog does not give) (reference sheet §1.2, indirect).

use super::{Analysis, CheckInfo, CheckResult, Group, Reads};

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "jacking",
    title: "Jacking stress",
    clause: "ACI 318-19 Table 20.3.2.5.1",
    unit: "ksi",
    group: Group::Strand,
    reads: Reads::Demand,
    load_driven: false,
};

/// Run the check.
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let s = an.member.strand;
    let limit = (0.94 * s.fpy.get()).min(0.80 * s.fpu.get());
    let which = if 0.94 * s.fpy.get() < 0.80 * s.fpu.get() {
        "0.94 fpy"
    } else {
        "0.80 fpu"
    };
    Some(CheckResult::new(
        &INFO,
        an.member.history.fpj_psi / 1000.0,
        limit / 1000.0,
        None,
        an.note(format_args!("{} fpu jacking; limit {which}", an.member.pattern.jacking)),
    ))
}

//! The bearing pad's average service pressure: the largest service
//! reaction (dead + live, or dead + roof load, unfactored) over the pad's
//! area — the bearing width times the bearing length less the ½ in setback
//! ([`super::bearing_stress`]) — against the pad material's allowable
//! average pressure (PCI Design Handbook ranges, **from memory, low
//! confidence**: [`crate::case::Pad::allowable_psi`]). Applies when the bay
//! names a pad. Shape factor, rotation and slip are not checked.
//!
//! Worst point: the supports.

use super::{Analysis, CheckInfo, CheckResult, Group, Reads};

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "pad_pressure",
    title: "Bearing pad pressure",
    clause: "ACI 318-19 16.2.6.2(b); PCI Design Handbook bearing pads (from memory, low confidence)",
    unit: "psi",
    group: Group::Bearing,
    reads: Reads::Demand,
    load_driven: true,
};

/// Run the check.
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let m = &an.member;
    let allow = m.case.pad.allowable_psi()?;
    let service = super::bearing_stress::service_reaction(an);
    let width = super::bearing_stress::bearing_width(an);
    let length = (m.case.bearing.get() - super::bearing_stress::PAD_SETBACK_IN).max(0.0);
    let area = width * length;
    Some(CheckResult::new(
        &INFO,
        if area > 0.0 { service / area } else { f64::INFINITY },
        allow,
        None,
        format!(
            "{} pad {width:.1} × {length:.2} in = {area:.1} in²; service reaction {:.2} kip (D + L or D + roof load); allowable average pressure from memory, low confidence",
            m.case.pad.name(),
            service / 1000.0
        ),
    ))
}

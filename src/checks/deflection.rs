//! Deflection limits, ACI 318-19 Table 24.2.2.
//!
//! Immediate deflection from live load L (floors, ℓ/360) or from the larger
//! of Lr and S (flat roofs, ℓ/180); where nonstructural elements are
//! attached, the part of the deflection after attachment — the long-term
//! change after erection from all sustained loads plus the immediate live
//! deflection — against ℓ/480 (likely to be damaged) or ℓ/240 (not likely).
//! Camber and deflection by [`crate::camber`]: Martin (1977) multipliers,
//! gross section for class U, bilinear effective inertia for classes T and
//! C (PCI Design Handbook method). Ponding of roofs is not checked.
//!
//! Where the worst point lies: midspan deflections of the closed forms; the
//! cracked stiffness takes its stresses where the bottom-fibre tension is
//! greatest (stations and segment vertices, [`super::peak`]).

use super::{Analysis, CheckInfo, CheckResult, Group, Reads};
use crate::case::{Attachment, Use};

/// Registry entry: immediate live deflection.
pub const LIVE: CheckInfo = CheckInfo {
    id: "defl_live",
    title: "Immediate live-load deflection",
    clause: "ACI 318-19 Table 24.2.2 (floor l/360, flat roof l/180)",
    unit: "in",
    group: Group::Deflection,
    reads: Reads::Demand,
    load_driven: true,
};

/// Registry entry: deflection after attachment.
pub const AFTER: CheckInfo = CheckInfo {
    id: "defl_after_attach",
    title: "Deflection after attachment",
    clause: "ACI 318-19 Table 24.2.2 (l/480 or l/240)",
    unit: "in",
    group: Group::Deflection,
    reads: Reads::Demand,
    load_driven: true,
};

/// Immediate live deflection.
pub fn run_live(an: &Analysis) -> Option<CheckResult> {
    let m = &an.member;
    let (div, what) = match m.case.member_use {
        Use::Floor => (360.0, "floor, L"),
        Use::Roof => (180.0, "flat roof, Lr or S"),
    };
    let c = &an.camber;
    Some(CheckResult::new(
        &LIVE,
        c.defl_live_in,
        m.l / div,
        Some(m.l / 2.0),
        an.note(format_args!(
            "{what}: l/{div:.0}{}",
            if c.cracked {
                "; class T/C: bilinear cracked stiffness"
            } else {
                "; gross section (class U)"
            }
        )),
    ))
}

/// After attachment of nonstructural elements, when the case says they are attached.
pub fn run_after(an: &Analysis) -> Option<CheckResult> {
    let m = &an.member;
    let div = match m.case.attachment {
        Attachment::None => return None,
        Attachment::Tolerant => 240.0,
        Attachment::Sensitive => 480.0,
    };
    let c = &an.camber;
    Some(CheckResult::new(
        &AFTER,
        c.defl_after_attach_in,
        m.l / div,
        Some(m.l / 2.0),
        an.note(format_args!(
            "l/{div:.0}; long-term change after erection {:.2} in + live {:.2} in",
            (c.camber_erection_in - c.camber_final_in).max(0.0),
            c.defl_live_in
        )),
    ))
}

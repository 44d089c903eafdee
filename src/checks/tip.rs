//! Deflection at the tip of an overhang, ACI 318-19 Table 24.2.2 with ℓ
//! the length of the overhang (common practice, no source: the table
//! itself does not define ℓ for a cantilever).
//!
//! The immediate deflection from the variable load (floor L against ℓ/360,
//! roof Lr or S against ℓ/180) and, where nonstructural elements are
//! attached, the part after attachment (the long-term change after erection
//! plus the immediate variable-load deflection) against ℓ/480 or ℓ/240.
//! Tip deflections by virtual work over the member on its in-place
//! supports, gross sections, the Martin (1977) multipliers as at midspan
//! ([`crate::camber`]); the worse tip and the worse limit are reported.
//! The variable load lies on the overhangs in one of the arrangements, so
//! the tip's greatest downward deflection is among them.

use super::{Analysis, CheckInfo, CheckResult, Group, Reads};
use crate::case::{Attachment, Use};

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "defl_tip",
    title: "Deflection at an overhang's tip",
    clause: "ACI 318-19 Table 24.2.2 (l = overhang length)",
    unit: "in",
    group: Group::Deflection,
    reads: Reads::Demand,
    load_driven: true,
};

/// Run the check (members with an overhang only).
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let m = &an.member;
    let c = &an.camber;
    let live_div = if m.case.member_use == Use::Roof { 180.0 } else { 360.0 };
    let after_div = match m.case.attachment {
        Attachment::None => None,
        Attachment::Tolerant => Some(240.0),
        Attachment::Sensitive => Some(480.0),
    };
    let mut best: Option<(f64, f64, f64, String)> = None;
    for (tip, side, x) in [(c.tip_left, "left", m.range().0), (c.tip_right, "right", m.range().1)] {
        let Some(t) = tip else { continue };
        let mut cands = vec![(
            t.defl_live_in,
            t.length_in / live_div,
            format!("{side} tip, immediate variable load, l/{live_div:.0}"),
        )];
        if let Some(d) = after_div {
            cands.push((
                t.defl_after_attach_in,
                t.length_in / d,
                format!("{side} tip, after attachment, l/{d:.0}"),
            ));
        }
        for (dem, cap, what) in cands {
            if best.as_ref().is_none_or(|b| dem / cap > b.0 / b.1) {
                best = Some((dem, cap, x, what));
            }
        }
    }
    let (dem, cap, x, what) = best?;
    Some(CheckResult::new(
        &INFO,
        dem,
        cap,
        Some(x),
        an.note(format_args!("{what} (l the overhang length); gross section, downward positive")),
    ))
}

//! Horizontal shear at the interface of a composite topping, Vu ≤ φVnh.
//!
//! Clause: ACI 318-19 §16.4 (Table 16.4.4.2): contact surface clean and
//! intentionally roughened, no ties: Vnh = 80·bv·d; φ = 0.75 (reference
//! sheet §5.8, from memory, medium). bv is the member width; d the depth from
//! the topping top to the strand centroid, not less than 0.8h. Vu at the
//! critical section h/2 from the support face.
//!
//! Where the worst point lies: Vu is linear between stations (both sides of
//! each line load are stations), so its greatest value in the shear range
//! is at a station.
//!
//! Does not cover: ties across the interface, shear friction (§22.9).

use super::{Analysis, CheckInfo, CheckResult, Group, Reads, kip};

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "horizontal_shear",
    title: "Horizontal shear at the topping interface",
    clause: "ACI 318-19 16.4.4.2 (80 bv d, roughened, no ties); φ 0.75",
    unit: "kip",
    group: Group::Shear,
    reads: Reads::Demand,
    load_driven: true,
};

/// Run the check (topped members only).
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let m = &an.member;
    m.comp?;
    let s = an
        .stations
        .iter()
        .filter(|s| s.shear.is_some())
        .max_by(|a, b| a.vu_lbf.total_cmp(&b.vu_lbf))?;
    let d = (m.h_total - m.pattern.centroid()).max(0.8 * m.h_total);
    let bv = m.bare.width_in;
    let cap = 0.75 * 80.0 * bv * d;
    Some(CheckResult::new(
        &INFO,
        kip(s.vu_lbf),
        kip(cap),
        Some(s.x_in),
        an.note(format_args!("bv = {bv:.1} in, d = {d:.2} in")),
    ))
}

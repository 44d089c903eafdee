//! Clear spacing of pretensioned strand at the member ends.
//!
//! Clause: ACI 318-19 §25.2.3: centre-to-centre spacing at least 4 db; where
//! f′ci ≥ 4000 psi, at least 1-3/4 in for strand up to 1/2 in and 2 in for
//! 0.6 in strand (reference sheet §4.6, from an older edition's text; the
//! 318-19 clause number from memory, medium). Checked at the end and
//! hold-down positions of every row.

use super::{Analysis, CheckInfo, CheckResult, Group, Reads};

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "strand_spacing",
    title: "Strand spacing at the ends",
    clause: "ACI 318-19 25.2.3",
    unit: "in",
    group: Group::Strand,
    reads: Reads::Need,
    load_driven: false,
};

/// Run the check; demand is the required spacing, capacity the least given.
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let m = &an.member;
    let db = m.db();
    // the threshold is compared with a tolerance so that 27.58 MPa, which
    // is 4000 psi, counts as 4000 psi (found by the US/SI property test)
    let required = if m.mix.fci.get() >= 4000.0 * (1.0 - 1e-9) {
        if db <= 0.5 + 1e-9 { 1.75 } else { 2.0 }
    } else {
        4.0 * db
    };
    let mut least = f64::INFINITY;
    for pick in [true, false] {
        let pts: Vec<(f64, f64)> = m
            .layers
            .iter()
            .flat_map(|l| l.x.iter().map(move |&x| (x, if pick { l.y_end } else { l.y_mid })))
            .collect();
        for (i, a) in pts.iter().enumerate() {
            for b in &pts[i + 1..] {
                least = least.min((a.0 - b.0).hypot(a.1 - b.1));
            }
        }
    }
    if !least.is_finite() {
        return None;
    }
    // the check passes when the least spacing is at least the required one
    let mut r = CheckResult::new(
        &INFO,
        required,
        least,
        None,
        an.note(format_args!("least centre-to-centre spacing {least:.2} in")),
    );
    if least < 1e-9 {
        r.ratio = super::RATIO_NONE;
        r.pass = false;
    }
    Some(r)
}

//! Bearing length against the minimum of ACI 318-19 §16.2.6.2, Table
//! 16.2.6.2 (the least design distance from the face of the support to the
//! end of a precast member, along the span): a solid or hollow-core slab
//! the greater of ℓn/180 and 2 in; a beam or stemmed member (a double tee)
//! the greater of ℓn/180 and 3 in. The table's title and structure are
//! checked indirectly (next-capabilities §6, [V~]); **the values are from
//! memory, high confidence** [M-H], and the output says so.
//!
//! ℓn is the clear span: the span between bearing centres less one bearing
//! length (half at each end). The member's bearing length is the bay's
//! `bearing` (the member is span + bearing long). A requirement the load
//! does not change: it never governs. An overhang's end is not a bearing:
//! the supports' own bearing is checked all the same.
//!
//! Worst point: none — one number per member.

use super::{Analysis, CheckInfo, CheckResult, Group, Reads};
use crate::section::Family;

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "bearing_length",
    title: "Bearing length at least the minimum",
    clause: "ACI 318-19 16.2.6.2 (Table 16.2.6.2, values from memory)",
    unit: "in",
    group: Group::Bearing,
    reads: Reads::Need,
    load_driven: false,
};

/// The Table 16.2.6.2 minimum, in, for a member of `family` with clear
/// span `ln_in` (from memory, high confidence).
pub fn minimum(family: Family, ln_in: f64) -> f64 {
    let fixed = match family {
        Family::DoubleTee => 3.0,
        Family::HollowCore | Family::Generic => 2.0,
    };
    (ln_in / 180.0).max(fixed)
}

/// Run the check.
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let m = &an.member;
    let bearing = m.case.bearing.get();
    let ln = m.l - bearing;
    let need = minimum(m.section.family, ln);
    let kind = match m.section.family {
        Family::DoubleTee => "stemmed member: ℓn/180, at least 3 in",
        _ => "slab: ℓn/180, at least 2 in",
    };
    Some(CheckResult::new(
        &INFO,
        need,
        bearing,
        None,
        an.note(format_args!(
            "{kind}; ℓn = span − bearing = {:.1} ft; bearing {:.2} in, {:.2} in to spare (table values from memory)",
            ln / 12.0,
            bearing,
            bearing - need
        )),
    ))
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn table_minimums_at_four_spans() {
        // next-capabilities §6 / §8 test vectors [D] from the Table 16.2.6.2
        // values (from memory, high confidence).
        assert_relative_eq!(minimum(Family::HollowCore, 30.0 * 12.0), 2.00, epsilon = 5e-3);
        assert_relative_eq!(minimum(Family::HollowCore, 40.0 * 12.0), 2.67, epsilon = 5e-3);
        assert_relative_eq!(minimum(Family::DoubleTee, 60.0 * 12.0), 4.00, epsilon = 5e-3);
        assert_relative_eq!(minimum(Family::DoubleTee, 80.0 * 12.0), 5.33, epsilon = 5e-3);
        // the fixed minimums govern short spans
        assert_relative_eq!(minimum(Family::HollowCore, 20.0 * 12.0), 2.0);
        assert_relative_eq!(minimum(Family::DoubleTee, 30.0 * 12.0), 3.0);
    }
}

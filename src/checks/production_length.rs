//! Member length against the plant's longest member.
//!
//! Not a code clause: the producer's limit from the catalog (`max_length`,
//! per pattern or per section). Member length = span + bearing length.

use super::{Analysis, CheckInfo, CheckResult, Group, Reads};

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "production_length",
    title: "Member length within production limit",
    clause: "catalog max_length (producer's limit)",
    unit: "ft",
    group: Group::Production,
    reads: Reads::Demand,
    load_driven: false,
};

/// Run the check (only when the catalog gives a limit).
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let m = &an.member;
    let max = m.pattern.max_length.or(m.section.max_length)?;
    Some(CheckResult::new(
        &INFO,
        m.lm / 12.0,
        max.get() / 12.0,
        None,
        "span + bearing length".into(),
    ))
}

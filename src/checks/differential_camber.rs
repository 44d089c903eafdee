//! Differential camber between adjacent units at erection — the most
//! common complaint on site: units of other ages (cast weeks apart: the
//! bay's `erection_spread`) or other strands (a unit an opening cuts) set
//! side by side camber differently, and the joint between them steps.
//!
//! The camber at erection is the age-adjusted effective modulus value of
//! ACI 209R-92 ([`crate::camber::aged`]): at the erection age and at that
//! age plus the spread, for every unit of the bay analysed. The difference
//! between the greatest and the least is checked against the bay's
//! `camber_limit` — ¾ in by default (common practice, no source; the
//! grout or topping must take up the step). Not a code clause.
//!
//! Adjacent bays with other patterns are not compared (plankwise does not
//! know which bays share a line). A requirement the load does not change:
//! it never governs.
//!
//! Worst point: midspan, where the cambers are compared.

use super::{Analysis, CheckInfo, CheckResult, Evaluation, Group, Reads};

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "differential_camber",
    title: "Camber difference between units at erection",
    clause: "ACI 209R-92 camber with age; the limit common practice, no source",
    unit: "in",
    group: Group::Deflection,
    reads: Reads::Demand,
    load_driven: false,
};

/// The least and greatest camber at erection of this unit over the bay's
/// erection ages, in.
pub fn range(an: &Analysis) -> (f64, f64) {
    let m = &an.member;
    let te = an.aged.erection_age_days;
    let spread = m.case.erection_spread;
    let a = an.aged.erection_in;
    if spread <= 0.0 {
        return (a, a);
    }
    let x = crate::camber::aged_inputs(m, &an.camber);
    let cond = super::aging_conditions(m);
    // the oldest units, at their own erection (no topping on them yet)
    let b = crate::camber::aged(&x, te + spread, &cond).erection_in;
    (a.min(b), a.max(b))
}

fn result(lo: f64, hi: f64, limit: f64, what: Option<&str>) -> CheckResult {
    CheckResult::new(
        &INFO,
        hi - lo,
        limit,
        None,
        // no note for a ranking, which reads the numbers only
        what.map_or(String::new(), |what| {
            format!(
                "camber at erection {lo:+.2} to {hi:+.2} in over {what} (ACI 209R-92, age-adjusted effective modulus); limit {limit:.2} in (common practice, no source)"
            )
        }),
    )
}

/// Run the check for one unit: its own range of ages.
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let (lo, hi) = range(an);
    let c = an.member.case;
    let te = an.aged.erection_age_days;
    let what = (!an.brief).then(|| format!("erection ages {te:.0}–{:.0} d", te + c.erection_spread));
    Some(result(lo, hi, c.camber_limit.get(), what.as_deref()))
}

/// With several units analysed (an opening cuts one), the difference over
/// all of them ([`super::merge`] calls this on the merged evaluation, before
/// it decides the verdict).
pub fn across_units(ev: &mut Evaluation) {
    let (lo, hi) = ev.camber_range;
    if let Some(c) = ev.checks.iter_mut().find(|c| c.info.id == INFO.id)
        && hi - lo > c.demand + 1e-12
    {
        // written for a brief evaluation too: trimming drops it
        *c = result(lo, hi, c.capacity, Some("the units analysed and the bay's erection ages"));
    }
}

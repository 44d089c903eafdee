//! Stresses before service — stripping or lifting from the bed, yard
//! storage, transport and erection — against the PCI handling limits
//! (no cracking: tension ≤ 5λ√f′c(t); compression ≤ 0.60 f′c(t)), with the
//! PCI equivalent static multipliers on the self-weight (ACI 318-19
//! §16.2.1 asks that these stages be designed for; the limits and the
//! multipliers are from memory, medium confidence). The stages, ages,
//! supports and strengths: [`crate::handling`].
//!
//! Applies unless the bay marks handling `not-checked`. A requirement the
//! service load does not change: it never governs, but a failing stage
//! makes the entry non-viable with its reason.
//!
//! Worst point: each stage's moment is piecewise quadratic between its
//! supports and the prestress changes its law only at the transfer
//! lengths, debonding and hold-downs; the stage takes the supports, the
//! midpoints between them, those points and a grid of eight.

use super::{Analysis, CheckInfo, CheckResult, Group, Reads};

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "handling",
    title: "Stripping, storage, transport, erection",
    clause: "ACI 318-19 16.2.1; PCI Design Handbook handling multipliers and limits (from memory)",
    unit: "psi",
    group: Group::Stresses,
    reads: Reads::Stress,
    load_driven: false,
};

/// Run the check: the worst stage.
pub fn run(an: &Analysis) -> Option<CheckResult> {
    if !an.member.case.handling {
        return None;
    }
    let stages = crate::handling::stages(&an.member, &crate::handling::Setup::of(an.member.case));
    let worst = stages.iter().max_by(|a, b| a.ratio().total_cmp(&b.ratio()))?;
    let t = (-worst.tension_psi).max(0.0) / worst.tension_limit_psi;
    let c = worst.compression_psi.max(0.0) / worst.compression_limit_psi;
    // a ranking reads the numbers only: no note is written for it
    let note = if an.brief {
        String::new()
    } else {
        format!(
            "{} at {:.0} d (×{:.1} self-weight, {}; f′c {:.0} psi; strand {:.1} ksi; supports at {}); {} fibre at {:.1} ft; limits 5λ√f′c = {:.0} psi tension, 0.60 f′c = {:.0} psi compression",
            worst.name,
            worst.age_days,
            worst.multiplier,
            worst.multiplier_source,
            worst.fc_psi,
            worst.fp_psi / 1000.0,
            worst
                .supports_in
                .iter()
                .map(|x| format!("{:.1} ft", x / 12.0))
                .collect::<Vec<_>>()
                .join(", "),
            if t >= c { worst.tension_fibre } else { worst.compression_fibre },
            if t >= c { worst.tension_at_in } else { worst.compression_at_in } / 12.0,
            worst.tension_limit_psi,
            worst.compression_limit_psi
        )
    };
    Some(if t >= c {
        CheckResult::tension(&INFO, worst.tension_psi, worst.tension_limit_psi, Some(worst.tension_at_in), note)
    } else {
        CheckResult::compression(
            &INFO,
            worst.compression_psi,
            worst.compression_limit_psi,
            Some(worst.compression_at_in),
            note,
        )
    })
}

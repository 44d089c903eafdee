//! Concrete stresses immediately after transfer.
//!
//! Clauses: ACI 318-19 §24.5.3.1 (Table 24.5.3.1: compression 0.70 f′ci at
//! the ends of simply supported members, 0.60 f′ci elsewhere) and §24.5.3.2
//! (Table 24.5.3.2: tension 6√f′ci at the ends, 3√f′ci elsewhere, without
//! added bonded reinforcement). Elastic theory on the gross section
//! (§24.5.1.2). Force after elastic shortening, built up over the transfer
//! length (fse/3000)·db; self-weight on the full member length, resting on
//! its ends. "Ends" are taken as within one transfer length of the member
//! end (reference sheet §3.1, from memory, medium).
//!
//! Does not cover: bonded reinforcement that resists the tension force
//! (§24.5.3.2.1), which would allow the tension limit to be exceeded.

use super::{Analysis, CheckInfo, CheckResult, Group};
use crate::member::Member;

/// Registry entry: compression.
pub const COMPRESSION: CheckInfo = CheckInfo {
    id: "release_compression",
    title: "Compression at release",
    clause: "ACI 318-19 24.5.3.1 (Table 24.5.3.1)",
    unit: "psi",
    group: Group::Stresses,
};

/// Registry entry: tension.
pub const TENSION: CheckInfo = CheckInfo {
    id: "release_tension",
    title: "Tension at release",
    clause: "ACI 318-19 24.5.3.2 (Table 24.5.3.2)",
    unit: "psi",
    group: Group::Stresses,
};

/// (top, bottom) fibre stress at release at distance `d` from the end, psi,
/// compression positive.
pub fn at(m: &Member, d: f64) -> (f64, f64) {
    let (p, y) = m.force_at(d, m.history.fpo_psi, m.ltr);
    let e = m.bare.yb_in - y;
    let mg = m.release_moment(d);
    let a = m.bare.area_in2;
    (
        p / a - p * e / m.bare.st_in3 + mg / m.bare.st_in3,
        p / a + p * e / m.bare.sb_in3 - mg / m.bare.sb_in3,
    )
}

fn in_end(an: &Analysis, d: f64) -> bool {
    d <= an.member.ltr + 1e-9
}

/// Compression check.
pub fn run_compression(an: &Analysis) -> Option<CheckResult> {
    let fci = an.member.mix.fci.get();
    let worst = an
        .stations
        .iter()
        .map(|s| {
            let limit = if in_end(an, s.d_in) { 0.70 * fci } else { 0.60 * fci };
            (s, s.release_psi.0.max(s.release_psi.1), limit)
        })
        .max_by(|a, b| (a.1 / a.2).total_cmp(&(b.1 / b.2)))?;
    let (s, f, lim) = worst;
    let fibre = if s.release_psi.1 >= s.release_psi.0 { "bottom" } else { "top" };
    let zone = if in_end(an, s.d_in) { "end region, 0.70 f'ci" } else { "0.60 f'ci" };
    Some(CheckResult::new(
        &COMPRESSION,
        f,
        lim,
        Some(s.x_in),
        an.note(format_args!("{fibre} fibre; {zone}; f'ci = {fci:.0} psi")),
    ))
}

/// Tension check.
pub fn run_tension(an: &Analysis) -> Option<CheckResult> {
    let r = an.member.mix.fci.get().sqrt();
    let worst = an
        .stations
        .iter()
        .map(|s| {
            let limit = if in_end(an, s.d_in) { 6.0 * r } else { 3.0 * r };
            (s, -s.release_psi.0.min(s.release_psi.1), limit)
        })
        .max_by(|a, b| (a.1 / a.2).total_cmp(&(b.1 / b.2)))?;
    let (s, f, lim) = worst;
    let fibre = if s.release_psi.0 <= s.release_psi.1 { "top" } else { "bottom" };
    let zone = if in_end(an, s.d_in) { "end region, 6√f'ci" } else { "3√f'ci" };
    Some(CheckResult::new(
        &TENSION,
        f,
        lim,
        Some(s.x_in),
        an.note(format_args!("{fibre} fibre tension; {zone}")),
    ))
}

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
//! Both fibres are checked in both checks. Where the worst point lies: the
//! stresses are quadratic in x between stations (prestress and eccentricity
//! linear, self-weight moment quadratic), so the maximum of each fibre's
//! ratio is at a station or at the vertex of its segment ([`super::peak`]).
//! The end region ends at ℓtr, which is a station; that station is held to
//! the stricter limit (0.60 f′ci, 3√f′ci), because the stress just beyond
//! it is the same and must meet the limit of the region it enters.
//!
//! Does not cover: bonded reinforcement that resists the tension force
//! (§24.5.3.2.1), which would allow the tension limit to be exceeded.

use serde::Serialize;

use super::{Analysis, CheckInfo, CheckResult, Group, Peak, Reads, peak};
use crate::member::Member;

/// Registry entry: compression.
pub const COMPRESSION: CheckInfo = CheckInfo {
    id: "release_compression",
    title: "Compression at release",
    clause: "ACI 318-19 24.5.3.1 (Table 24.5.3.1)",
    unit: "psi",
    group: Group::Stresses,
    reads: Reads::Stress,
    load_driven: false,
};

/// Registry entry: tension.
pub const TENSION: CheckInfo = CheckInfo {
    id: "release_tension",
    title: "Tension at release",
    clause: "ACI 318-19 24.5.3.2 (Table 24.5.3.2)",
    unit: "psi",
    group: Group::Stresses,
    reads: Reads::Stress,
    load_driven: false,
};

/// (top, bottom) fibre stress at release at `x`, psi, compression
/// positive; the net section where an opening cuts the unit.
pub fn at(m: &Member, x: f64) -> (f64, f64) {
    let (p, y) = m.force_at(x, m.history.fpo_psi, m.ltr);
    let b = m.props_at(x).0;
    let e = b.yb_in - y;
    let mg = m.release_moment(x);
    let a = b.area_in2;
    (p / a - p * e / b.st_in3 + mg / b.st_in3, p / a + p * e / b.sb_in3 - mg / b.sb_in3)
}

/// The terms of the fibre stresses at release at one point, as put into
/// f = P/A ∓ P e/S ± Mg/S (psi, in, lbf; compression positive), for the
/// calculation sheet.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Terms {
    /// Where, from the left bearing centre, in.
    pub x_in: f64,
    /// Prestress force there just after transfer (within the transfer length, in part), lbf.
    pub p_lbf: f64,
    /// Its eccentricity below the centroid, in.
    pub e_in: f64,
    /// Self-weight moment at release (the member on its ends), lbf·in.
    pub mg_lbin: f64,
    /// Area, in².
    pub area_in2: f64,
    /// Section moduli, bottom and top, in³.
    pub sb_in3: f64,
    /// Top.
    pub st_in3: f64,
    /// The fibre stresses, psi.
    pub top_psi: f64,
    /// Bottom.
    pub bottom_psi: f64,
}

/// The terms of [`at`] at `x`.
pub fn terms(m: &Member, x: f64) -> Terms {
    let (p, y) = m.force_at(x, m.history.fpo_psi, m.ltr);
    let b = m.props_at(x).0;
    let (top, bottom) = at(m, x);
    Terms {
        x_in: x,
        p_lbf: p,
        e_in: b.yb_in - y,
        mg_lbin: m.release_moment(x),
        area_in2: b.area_in2,
        sb_in3: b.sb_in3,
        st_in3: b.st_in3,
        top_psi: top,
        bottom_psi: bottom,
    }
}

/// Whether `d` lies in the end region (within ℓtr of the member end). A
/// point exactly on the boundary is not: it takes the stricter limit.
fn in_end(an: &Analysis, d: f64, at_station: bool) -> bool {
    if at_station { d < an.member.ltr - 1e-9 } else { d < an.member.ltr }
}

/// The worst point of one fibre: `pick` chooses top (0) or bottom (1),
/// `sign` is +1 for compression, −1 for tension; `end` and `other` are the
/// limits (positive) of the end region and elsewhere.
fn fibre(an: &Analysis, pick: usize, sign: f64, end: f64, other: f64) -> Option<Peak> {
    let m = &an.member;
    let get = move |r: (f64, f64)| sign * if pick == 0 { r.0 } else { r.1 };
    peak(
        an,
        move |_, r| get(r),
        |d, at_station| if in_end(an, d, at_station) { end } else { other },
        |x, _| get(at(m, x)),
    )
}

fn zone(an: &Analysis, p: &Peak, end: &str, other: &str) -> String {
    if in_end(an, p.d_in, true) { end.into() } else { other.into() }
}

/// Compression check: the greater ratio of the top and bottom fibres.
pub fn run_compression(an: &Analysis) -> Option<CheckResult> {
    let fci = an.member.mix.fci.get();
    let top = fibre(an, 0, 1.0, 0.70 * fci, 0.60 * fci)?;
    let bot = fibre(an, 1, 1.0, 0.70 * fci, 0.60 * fci)?;
    let (p, name) = if bot.ratio >= top.ratio { (bot, "bottom") } else { (top, "top") };
    let z = zone(an, &p, "end region, 0.70 f'ci", "0.60 f'ci");
    Some(CheckResult::compression(
        &COMPRESSION,
        p.value,
        p.limit,
        Some(p.x_in),
        an.note(format_args!("{name} fibre; {z}; f'ci = {fci:.0} psi")),
    ))
}

/// Tension check: the greater ratio of the top and bottom fibres.
pub fn run_tension(an: &Analysis) -> Option<CheckResult> {
    let r = an.member.mix.fci.get().sqrt();
    let top = fibre(an, 0, -1.0, 6.0 * r, 3.0 * r)?;
    let bot = fibre(an, 1, -1.0, 6.0 * r, 3.0 * r)?;
    let (p, name) = if bot.ratio > top.ratio || (bot.ratio == top.ratio && bot.value > top.value) {
        (bot, "bottom")
    } else {
        (top, "top")
    };
    let z = zone(an, &p, "end region, 6√f'ci", "3√f'ci");
    let what = if p.value > 0.0 {
        an.note(format_args!("{name} fibre tension; {z}"))
    } else {
        an.note(format_args!(
            "no tension at release: both fibres in compression (least {:.0} psi, {name} fibre); ratio 0",
            -p.value
        ))
    };
    Some(CheckResult::tension(&TENSION, -p.value, p.limit, Some(p.x_in), what))
}

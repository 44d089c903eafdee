//! Concrete stresses at service loads, after all losses.
//!
//! Clauses: ACI 318-19 §24.5.2.1 (Table 24.5.2.1: class U ft ≤ 7.5√f′c,
//! T ≤ 12√f′c, C above), §24.5.4.1 (Table 24.5.4.1: compression 0.45 f′c
//! under prestress plus sustained load, 0.60 f′c under prestress plus total
//! load; the topping against its own f′c). Staged, unshored: self-weight and
//! topping on the bare section, superimposed loads on the composite
//! transformed section; the uncracked section throughout (§24.5.2.2, valid
//! for classes U and T). Service loads per [`crate::case::service_moments`].
//!
//! Does not cover: cracked-section stresses and crack control of class C
//! members (§24.5.2.3, §24.3).

use serde::Serialize;

use super::{Analysis, CheckInfo, CheckResult, Group};
use crate::case::{Effects, ServiceClass, service_moments};
use crate::member::{Effective, Member};

/// Registry entry: tension (class).
pub const TENSION: CheckInfo = CheckInfo {
    id: "service_tension",
    title: "Tension at service (class)",
    clause: "ACI 318-19 24.5.2.1 (Table 24.5.2.1)",
    unit: "psi",
    group: Group::Stresses,
};
/// Registry entry: compression, sustained.
pub const SUSTAINED: CheckInfo = CheckInfo {
    id: "service_compression_sustained",
    title: "Compression, prestress + sustained load",
    clause: "ACI 318-19 24.5.4.1 (Table 24.5.4.1), 0.45 f'c",
    unit: "psi",
    group: Group::Stresses,
};
/// Registry entry: compression, total.
pub const TOTAL: CheckInfo = CheckInfo {
    id: "service_compression_total",
    title: "Compression, prestress + total load",
    clause: "ACI 318-19 24.5.4.1 (Table 24.5.4.1), 0.60 f'c",
    unit: "psi",
    group: Group::Stresses,
};
/// Registry entry: topping compression.
pub const TOPPING: CheckInfo = CheckInfo {
    id: "topping_compression",
    title: "Topping compression at service",
    clause: "ACI 318-19 24.5.4.1 (Table 24.5.4.1), topping f'c",
    unit: "psi",
    group: Group::Stresses,
};

/// Service stresses at one station, psi, compression positive.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct AtStation {
    /// Precast bottom fibre, total load.
    pub bottom_total_psi: f64,
    /// Precast top fibre, total load.
    pub top_total_psi: f64,
    /// Precast top fibre, sustained load.
    pub top_sustained_psi: f64,
    /// Topping top fibre, total load (0 untopped).
    pub topping_total_psi: f64,
    /// Topping top fibre, sustained load (0 untopped).
    pub topping_sustained_psi: f64,
}

/// Service stresses at distance `d` from the end.
pub fn at(m: &Member, pre: Effective, eff: &Effects) -> AtStation {
    let (pe, y) = (pre.pe, pre.y);
    let e = m.bare.yb_in - y;
    let b = m.bare;
    let pre_top = pe / b.area_in2 - pe * e / b.st_in3;
    let pre_bot = pe / b.area_in2 + pe * e / b.sb_in3;
    let mnc = eff.m_self + eff.m_topping;
    let (sus, tot) = service_moments(eff, m.case.sustained_live);
    match m.comp {
        Some(c) => {
            let (ms, mt) = (sus - mnc, tot - mnc);
            AtStation {
                bottom_total_psi: pre_bot - mnc / b.sb_in3 - mt / c.sb_in3,
                top_total_psi: pre_top + mnc / b.st_in3 + mt / c.st_precast_in3,
                top_sustained_psi: pre_top + mnc / b.st_in3 + ms / c.st_precast_in3,
                topping_total_psi: mt / c.st_topping_in3,
                topping_sustained_psi: ms / c.st_topping_in3,
            }
        }
        None => AtStation {
            bottom_total_psi: pre_bot - tot / b.sb_in3,
            top_total_psi: pre_top + tot / b.st_in3,
            top_sustained_psi: pre_top + sus / b.st_in3,
            topping_total_psi: 0.0,
            topping_sustained_psi: 0.0,
        },
    }
}

/// Class by Table 24.5.2.1 for a bottom-fibre tension ft (psi, tension positive).
pub fn class_of(ft: f64, fc: f64) -> ServiceClass {
    if ft <= 7.5 * fc.sqrt() {
        ServiceClass::U
    } else if ft <= 12.0 * fc.sqrt() {
        ServiceClass::T
    } else {
        ServiceClass::C
    }
}

fn max_tension<'s>(an: &'s Analysis) -> Option<(&'s super::Station, f64)> {
    an.stations
        .iter()
        .map(|s| (s, -s.service.bottom_total_psi))
        .max_by(|a, b| a.1.total_cmp(&b.1))
}

/// The class the member reaches.
pub fn class_reached(an: &Analysis) -> ServiceClass {
    max_tension(an).map_or(ServiceClass::U, |(_, ft)| class_of(ft, an.member.mix.fc.get()))
}

/// Tension: the bottom-fibre tension against the limit of the class allowed.
pub fn run_tension(an: &Analysis) -> Option<CheckResult> {
    let (s, ft) = max_tension(an)?;
    let fc = an.member.mix.fc.get();
    let allowed = an.case_class();
    let class = class_of(ft, fc);
    let (limit, what) = match allowed {
        ServiceClass::U => (7.5 * fc.sqrt(), "class U allowed: 7.5√f'c"),
        ServiceClass::T => (12.0 * fc.sqrt(), "class T allowed: 12√f'c"),
        // class C has no tension limit; crack control (24.3) is not checked
        ServiceClass::C => (
            12.0 * fc.sqrt(),
            "class C allowed: no tension limit (12√f'c shown is where class C begins); crack control (24.3) not checked",
        ),
    };
    let mut r = CheckResult::new(
        &TENSION,
        ft,
        limit,
        Some(s.x_in),
        an.note(format_args!("precast bottom fibre, class {} reached; {what}", class.name())),
    );
    if allowed == ServiceClass::C {
        r.ratio = r.ratio.min(1.0);
        r.pass = true;
    }
    Some(r)
}

fn compression(an: &Analysis, info: &'static CheckInfo, k: f64, pick: fn(&AtStation) -> f64, fibre: &str) -> Option<CheckResult> {
    let fc = an.member.mix.fc.get();
    let (s, f) = an
        .stations
        .iter()
        .map(|s| (s, pick(&s.service)))
        .max_by(|a, b| a.1.total_cmp(&b.1))?;
    Some(CheckResult::new(
        info,
        f,
        k * fc,
        Some(s.x_in),
        an.note(format_args!("{fibre}; f'c = {fc:.0} psi")),
    ))
}

/// Compression under prestress + sustained load.
pub fn run_sustained(an: &Analysis) -> Option<CheckResult> {
    compression(an, &SUSTAINED, 0.45, |a| a.top_sustained_psi, "precast top fibre")
}

/// Compression under prestress + total load (top or bottom fibre).
pub fn run_total(an: &Analysis) -> Option<CheckResult> {
    compression(
        an,
        &TOTAL,
        0.60,
        |a| a.top_total_psi.max(a.bottom_total_psi),
        "precast top or bottom fibre",
    )
}

/// Topping compression: the worse of sustained (0.45) and total (0.60).
pub fn run_topping(an: &Analysis) -> Option<CheckResult> {
    let t = an.member.case.topping.as_ref()?;
    let fc = t.mix.fc.get();
    let sus = an
        .stations
        .iter()
        .map(|s| (s, s.service.topping_sustained_psi))
        .max_by(|a, b| a.1.total_cmp(&b.1))?;
    let tot = an
        .stations
        .iter()
        .map(|s| (s, s.service.topping_total_psi))
        .max_by(|a, b| a.1.total_cmp(&b.1))?;
    let r = if sus.1 / (0.45 * fc) >= tot.1 / (0.60 * fc) {
        CheckResult::new(
            &TOPPING,
            sus.1,
            0.45 * fc,
            Some(sus.0.x_in),
            an.note(format_args!("sustained load, 0.45 f'c of the topping ({fc:.0} psi)")),
        )
    } else {
        CheckResult::new(
            &TOPPING,
            tot.1,
            0.60 * fc,
            Some(tot.0.x_in),
            an.note(format_args!("total load, 0.60 f'c of the topping ({fc:.0} psi)")),
        )
    };
    Some(r)
}

impl Analysis<'_> {
    /// The class allowed by the case.
    pub fn case_class(&self) -> ServiceClass {
        self.member.case.class_allowed
    }
}

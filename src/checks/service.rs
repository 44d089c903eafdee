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
//! Every extreme fibre is checked: the precast top and bottom under both
//! the sustained and the total load, and the top of a topping. Where the
//! worst point lies: between stations the stresses are quadratic in x, so
//! each fibre's maximum is at a station or at its segment's vertex
//! ([`super::peak`]); the transfer zones are inside the station set.
//!
//! Does not cover: cracked-section stresses and crack control of class C
//! members (§24.5.2.3, §24.3).

use serde::Serialize;

use super::{Analysis, CheckInfo, CheckResult, Group, Peak, Reads, peak};
use crate::case::{Effects, ServiceClass, service_least, service_moments};
use crate::member::{Effective, Member};

/// Registry entry: tension (class).
pub const TENSION: CheckInfo = CheckInfo {
    id: "service_tension",
    title: "Tension at service (class)",
    clause: "ACI 318-19 24.5.2.1 (Table 24.5.2.1)",
    unit: "psi",
    group: Group::Stresses,
    reads: Reads::Stress,
    load_driven: true,
};
/// Registry entry: compression, sustained.
pub const SUSTAINED: CheckInfo = CheckInfo {
    id: "service_compression_sustained",
    title: "Compression, prestress + sustained load",
    clause: "ACI 318-19 24.5.4.1 (Table 24.5.4.1), 0.45 f'c",
    unit: "psi",
    group: Group::Stresses,
    reads: Reads::Stress,
    load_driven: true,
};
/// Registry entry: compression, total.
pub const TOTAL: CheckInfo = CheckInfo {
    id: "service_compression_total",
    title: "Compression, prestress + total load",
    clause: "ACI 318-19 24.5.4.1 (Table 24.5.4.1), 0.60 f'c",
    unit: "psi",
    group: Group::Stresses,
    reads: Reads::Stress,
    load_driven: true,
};
/// Registry entry: topping compression.
pub const TOPPING: CheckInfo = CheckInfo {
    id: "topping_compression",
    title: "Topping compression at service",
    clause: "ACI 318-19 24.5.4.1 (Table 24.5.4.1), topping f'c",
    unit: "psi",
    group: Group::Stresses,
    reads: Reads::Stress,
    load_driven: true,
};

/// Service stresses at one station, psi, compression positive.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct AtStation {
    /// Precast bottom fibre, total load.
    pub bottom_total_psi: f64,
    /// Precast top fibre, total load.
    pub top_total_psi: f64,
    /// Precast bottom fibre, sustained load.
    pub bottom_sustained_psi: f64,
    /// Precast top fibre, sustained load.
    pub top_sustained_psi: f64,
    /// Topping top fibre, total load (0 untopped).
    pub topping_total_psi: f64,
    /// Topping top fibre, sustained load (0 untopped).
    pub topping_sustained_psi: f64,
    /// Precast top fibre under the least service moment (the most hogging
    /// of D alone and the combinations above): where an overhang hogs.
    pub top_least_psi: f64,
    /// Precast bottom fibre under the least service moment.
    pub bottom_least_psi: f64,
    /// Precast bottom fibre under the least sustained moment (D, or D + ψL
    /// where the live load hogs).
    pub bottom_least_sustained_psi: f64,
}

/// Service stresses at `x`, with the prestress there: the net section
/// where an opening cuts the unit.
pub fn at(m: &Member, x: f64, pre: Effective, eff: &Effects) -> AtStation {
    let (pe, y) = (pre.pe, pre.y);
    let (b, comp) = m.props_at(x);
    let e = b.yb_in - y;
    let pre_top = pe / b.area_in2 - pe * e / b.st_in3;
    let pre_bot = pe / b.area_in2 + pe * e / b.sb_in3;
    let mnc = eff.m_self + eff.m_topping;
    let (sus, tot) = service_moments(eff, m.case.sustained_live);
    let least = service_least(eff, m.case.sustained_live);
    let d = eff.m_dead();
    let least_sus = d.min(d + m.case.sustained_live * eff.m_live);
    match comp {
        Some(c) => {
            let (ms, mt, ml, mls) = (sus - mnc, tot - mnc, least - mnc, least_sus - mnc);
            AtStation {
                bottom_total_psi: pre_bot - mnc / b.sb_in3 - mt / c.sb_in3,
                top_total_psi: pre_top + mnc / b.st_in3 + mt / c.st_precast_in3,
                bottom_sustained_psi: pre_bot - mnc / b.sb_in3 - ms / c.sb_in3,
                top_sustained_psi: pre_top + mnc / b.st_in3 + ms / c.st_precast_in3,
                topping_total_psi: mt / c.st_topping_in3,
                topping_sustained_psi: ms / c.st_topping_in3,
                top_least_psi: pre_top + mnc / b.st_in3 + ml / c.st_precast_in3,
                bottom_least_psi: pre_bot - mnc / b.sb_in3 - ml / c.sb_in3,
                bottom_least_sustained_psi: pre_bot - mnc / b.sb_in3 - mls / c.sb_in3,
            }
        }
        None => AtStation {
            bottom_total_psi: pre_bot - tot / b.sb_in3,
            top_total_psi: pre_top + tot / b.st_in3,
            bottom_sustained_psi: pre_bot - sus / b.sb_in3,
            top_sustained_psi: pre_top + sus / b.st_in3,
            topping_total_psi: 0.0,
            topping_sustained_psi: 0.0,
            top_least_psi: pre_top + least / b.st_in3,
            bottom_least_psi: pre_bot - least / b.sb_in3,
            bottom_least_sustained_psi: pre_bot - least_sus / b.sb_in3,
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

/// The service stresses at any x, for the vertex of a segment.
fn exact(m: &Member, x: f64) -> AtStation {
    at(m, x, m.effective_at(x), &m.effects(x))
}

/// One service fibre's worst point against a constant limit.
fn worst(an: &Analysis, pick: fn(&AtStation) -> f64, limit: f64) -> Option<Peak> {
    let m = &an.member;
    peak(an, move |s, _| pick(s), |_, _| limit, |x, _| pick(&exact(m, x)))
}

/// The greatest bottom-fibre tension under total service load (psi,
/// tension positive) and where it is: stations and segment vertices.
pub fn max_tension(an: &Analysis) -> Option<Peak> {
    worst(an, |s| -s.bottom_total_psi, 1.0)
}

/// The class the member reaches.
pub fn class_reached(an: &Analysis) -> ServiceClass {
    max_tension(an).map_or(ServiceClass::U, |p| class_of(p.value, an.member.mix.fc.get()))
}

/// Tension: the bottom-fibre tension (the precompressed tension zone)
/// against the limit of the class allowed. The maximum is at a station or
/// a segment vertex ([`super::peak`]).
pub fn run_tension(an: &Analysis) -> Option<CheckResult> {
    let fc = an.member.mix.fc.get();
    let allowed = an.case_class();
    let (limit, what) = match allowed {
        ServiceClass::U => (7.5 * fc.sqrt(), "class U allowed: 7.5√f'c"),
        ServiceClass::T => (12.0 * fc.sqrt(), "class T allowed: 12√f'c"),
        // class C has no tension limit; crack control (24.3) is not checked
        ServiceClass::C => (
            12.0 * fc.sqrt(),
            "class C allowed: no tension limit (12√f'c shown is where class C begins); crack control (24.3) not checked",
        ),
    };
    let p = worst(an, |s| -s.bottom_total_psi, limit)?;
    let class = class_of(p.value, fc);
    let note = if p.value > 0.0 {
        an.note(format_args!("precast bottom fibre, class {} reached; {what}", class.name()))
    } else {
        an.note(format_args!(
            "precast bottom fibre in compression everywhere (least {:.0} psi): no tension, class U; ratio 0",
            -p.value
        ))
    };
    let mut r = CheckResult::tension(&TENSION, -p.value, limit, Some(p.x_in), note);
    if allowed == ServiceClass::C {
        r.ratio = r.ratio.min(1.0);
        r.pass = true;
    }
    Some(r)
}

/// A fibre: how to read its stress, its name, and whether load raises it.
type Fibre = (fn(&AtStation) -> f64, &'static str, bool);

/// The worse of several fibres in compression against `k` f′c; each fibre
/// says whether load raises it (the top fibres) or relieves it (the bottom
/// fibre, compressed by prestress): the result governs as a load limit
/// only when such a fibre is the worse.
fn compression(an: &Analysis, info: &'static CheckInfo, k: f64, fc: f64, fibres: &[Fibre]) -> Option<CheckResult> {
    let (p, name, loaded) = fibres
        .iter()
        .filter_map(|&(pick, name, loaded)| worst(an, pick, k * fc).map(|p| (p, name, loaded)))
        .max_by(|a, b| a.0.ratio.total_cmp(&b.0.ratio).then(a.0.value.total_cmp(&b.0.value)))?;
    let mut r = CheckResult::compression(
        info,
        p.value,
        p.limit,
        Some(p.x_in),
        an.note(format_args!(
            "{name}; {k:.2} f'c = {:.0} psi (f'c = {fc:.0} psi){}",
            k * fc,
            if loaded {
                ""
            } else {
                "; compression from prestress, which load relieves: not a load limit"
            }
        )),
    );
    r.governs = loaded;
    Some(r)
}

/// Compression under prestress + sustained load: the precast top and
/// bottom fibres (near the ends the bottom fibre carries the most), at
/// every station and segment vertex; with an overhang, also the bottom
/// fibre under the least sustained moment (a hogging moment adds its
/// compression there, so it is a load limit).
pub fn run_sustained(an: &Analysis) -> Option<CheckResult> {
    let mut fibres: Vec<Fibre> = vec![
        (|a| a.top_sustained_psi, "precast top fibre", true),
        (|a| a.bottom_sustained_psi, "precast bottom fibre", false),
    ];
    if an.member.overhangs() {
        fibres.push((
            |a| a.bottom_least_sustained_psi,
            "precast bottom fibre under the least moment",
            true,
        ));
    }
    compression(an, &SUSTAINED, 0.45, an.member.mix.fc.get(), &fibres)
}

/// Compression under prestress + total load: the precast top and bottom
/// fibres; with an overhang, also the bottom fibre under the least moment.
pub fn run_total(an: &Analysis) -> Option<CheckResult> {
    let mut fibres: Vec<Fibre> = vec![
        (|a| a.top_total_psi, "precast top fibre", true),
        (|a| a.bottom_total_psi, "precast bottom fibre", false),
    ];
    if an.member.overhangs() {
        fibres.push((|a| a.bottom_least_psi, "precast bottom fibre under the least moment", true));
    }
    compression(an, &TOTAL, 0.60, an.member.mix.fc.get(), &fibres)
}

/// Topping compression: the top of the topping against its own f′c, the
/// worse of sustained (0.45) and total (0.60) load.
pub fn run_topping(an: &Analysis) -> Option<CheckResult> {
    let t = an.member.case.topping.as_ref()?;
    let fc = t.mix.fc.get();
    let sus = worst(an, |s| s.topping_sustained_psi, 0.45 * fc)?;
    let tot = worst(an, |s| s.topping_total_psi, 0.60 * fc)?;
    let (p, what) = if sus.ratio >= tot.ratio {
        (sus, "sustained load, 0.45 f'c")
    } else {
        (tot, "total load, 0.60 f'c")
    };
    Some(CheckResult::compression(
        &TOPPING,
        p.value,
        p.limit,
        Some(p.x_in),
        an.note(format_args!("top of the topping, {what} of the topping ({fc:.0} psi)")),
    ))
}

impl Analysis<'_> {
    /// The class allowed by the case.
    pub fn case_class(&self) -> ServiceClass {
        self.member.case.class_allowed
    }
}

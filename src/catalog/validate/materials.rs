//! Mixes and strand kinds.

use super::{Ctx, join, keys, span};
use crate::catalog::raw;
use crate::input::diag::suggestion;
use crate::material::{Aggregate, Mix, Modulus, Relaxation, StrandKind};
use crate::section::family::fmt;
use crate::units::Stress;

pub(super) fn mix(cx: &mut Ctx, m: &raw::RawMix, path: &str) -> Option<Mix> {
    let id = cx.id(&m.id, path);
    let fc = cx.key_q::<crate::units::StressK>(&m.fc, path, &keys::FC);
    let fci = cx.key_q::<crate::units::StressK>(&m.fci, path, &keys::FCI);
    let wc = cx.key_q::<crate::units::UnitWeightK>(&m.unit_weight, path, &keys::UNIT_WEIGHT);
    let agg = Aggregate::from_name(m.aggregate.get_ref());
    if agg.is_none() {
        cx.rep.error(
            span(&m.aggregate),
            &join(path, "aggregate"),
            format!(
                "'{}' is not an aggregate kind{}; use one of: {}",
                m.aggregate.get_ref(),
                suggestion(m.aggregate.get_ref(), Aggregate::NAMES.iter().copied()),
                Aggregate::NAMES.join(", ")
            ),
        );
    }
    let modulus = match m.modulus.as_ref().map(|s| (s, s.get_ref().as_str())) {
        None | Some((_, "unit-weight")) => Some(Modulus::UnitWeight),
        Some((_, "normalweight")) => Some(Modulus::Normalweight),
        Some((s, _)) => match Stress::parse(s.get_ref()) {
            Ok(_) => cx.key_q::<crate::units::StressK>(s, path, &keys::EC).map(Modulus::Given),
            Err(_) => {
                cx.rep.error(
                    span(s),
                    &join(path, "modulus"),
                    format!(
                        "'{}' is neither a formula nor a stress{}; use 'unit-weight' (33 wc^1.5 √f'c), 'normalweight' (57000 √f'c) or a value such as \"4400 ksi\"",
                        s.get_ref(),
                        suggestion(s.get_ref(), ["unit-weight", "normalweight"])
                    ),
                );
                None
            }
        },
    };
    let (fc, fci, wc, agg, modulus) = (fc?, fci?, wc?, agg?, modulus?);
    if fci.get() > fc.get() {
        cx.rep.error(
            span(&m.fci),
            &join(path, "fci"),
            format!(
                "f'ci '{}' is above f'c '{}'; the strength at release cannot exceed the specified strength",
                m.fci.get_ref(),
                m.fc.get_ref()
            ),
        );
        return None;
    }
    if modulus == Modulus::Normalweight && !matches!(agg, Aggregate::Siliceous | Aggregate::Carbonate) {
        cx.rep.error(
            m.modulus.as_ref().map(|s| s.span()),
            &join(path, "modulus"),
            format!(
                "'normalweight' (57000 √f'c) applies only to normalweight concrete, not {}; use 'unit-weight'",
                agg.name()
            ),
        );
        return None;
    }
    Some(Mix {
        id,
        fc,
        fci,
        unit_weight: wc,
        aggregate: agg,
        modulus,
    })
}

pub(super) fn strand(cx: &mut Ctx, s: &raw::RawStrand, path: &str) -> Option<StrandKind> {
    let id = cx.id(&s.id, path);
    let d = cx.key_q::<crate::units::LengthK>(&s.diameter, path, &keys::STRAND_DIAMETER);
    let a = cx.key_q::<crate::units::AreaK>(&s.area, path, &keys::STRAND_AREA);
    let fpu = cx.key_q::<crate::units::StressK>(&s.fpu, path, &keys::FPU);
    let relaxation = match s.relaxation.as_ref().map(|r| r.get_ref().as_str()) {
        None | Some("low") => Some(Relaxation::Low),
        Some("stress-relieved") => Some(Relaxation::StressRelieved),
        Some(other) => {
            cx.rep.error(
                s.relaxation.as_ref().map(|r| r.span()),
                &join(path, "relaxation"),
                format!(
                    "'{other}'{} is not a relaxation class; use 'low' or 'stress-relieved'",
                    suggestion(other, ["low", "stress-relieved"])
                ),
            );
            None
        }
    };
    let eps = match &s.modulus {
        None => Some(Stress::from_unit(28_500.0, "ksi")),
        Some(m) => cx.key_q::<crate::units::StressK>(m, path, &keys::EPS),
    };
    let fpy = cx.opt_q::<crate::units::StressK>(&s.fpy, path, "fpy");
    let (d, a, fpu, relaxation, eps, fpy) = (d?, a?, fpu?, relaxation?, eps?, fpy?);
    // ASTM A416: fpy at 1 % extension is 0.90 fpu (low-relaxation) or 0.85 fpu
    let fpy = fpy.unwrap_or(fpu * if relaxation == Relaxation::Low { 0.90 } else { 0.85 });
    if fpy.get() > fpu.get() || fpy.get() < 0.8 * fpu.get() {
        cx.rep.error(
            s.fpy.as_ref().map(|f| f.span()),
            &join(path, "fpy"),
            format!(
                "fpy {} ksi must lie between 0.80 fpu and fpu ({} ksi)",
                fmt(fpy.in_unit("ksi")),
                fmt(fpu.in_unit("ksi"))
            ),
        );
        return None;
    }
    Some(StrandKind {
        id,
        diameter: d,
        area: a,
        fpu,
        fpy,
        eps,
        relaxation,
    })
}

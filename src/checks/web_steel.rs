//! The stem reinforcement a double-tee pattern gives: at least Av,min
//! where it is required, at no more than the largest spacing.
//!
//! Clauses: ACI 318-19 §9.6.3.1 (beams: Av,min wherever Vu > 0.5φVc,
//! except the shallow members of Table 9.6.3.1, h ≤ 10 in), Table 9.6.3.4
//! (Av,min for prestressed members with Aps fse ≥ 0.4 Aps fpu: the lesser
//! of the greater of 0.75√f′c bw s/fyt and 50 bw s/fyt, and
//! Aps fpu s/(80 fyt d)·√(d/bw)), §9.7.6.2.2 (spacing of prestressed
//! members at most the lesser of 3h/4 and 24 in, halved where
//! Vs > 4√f′c bw d). Numbering and expressions from memory, medium
//! (reference sheet §5.7). fyt counted at most 60 ksi (§20.2.2.4). The
//! strength Vs = Av fyt d/s adds to Vc in the shear check.
//!
//! Where the worst point lies: Av,min/s depends only on the section and
//! the prestress, so the requirement is one value wherever it applies;
//! where it applies (Vu > 0.5φVc) is read at the stations and in the shear
//! check's search. Only patterns that give `web_steel` are checked; for the
//! others the shear check names the Av/s the stems need.

use super::shear::{FYT_MAX_PSI, av_min_per_length};
use super::{Analysis, CheckInfo, CheckResult, Group, Reads};

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "web_steel",
    title: "Stem reinforcement: Av,min and spacing",
    clause: "ACI 318-19 9.6.3.1, Table 9.6.3.4, 9.7.6.2.2",
    unit: "in2/ft",
    group: Group::Shear,
    reads: Reads::Need,
    load_driven: true,
};

/// Run the check (patterns with `web_steel` only).
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let m = &an.member;
    let ws = m.pattern.web_steel?;
    let n = m.section.geometry.stems.len().max(1) as f64;
    let fyt = ws.fy.get().min(FYT_MAX_PSI);
    let s = ws.spacing.get();
    // where Av,min applies: Vu > 0.5φVc anywhere (Table 9.6.3.1 spares h ≤ 10 in)
    let shear: Vec<&super::shear::AtStation> = an.stations.iter().filter_map(|s| s.shear.as_ref()).collect();
    let needed = m.h_total > 10.0
        && (shear.iter().any(|a| a.combos.iter().any(|c| c.vu_lbf > 0.5 * c.phi_vc_lbf))
            || super::shear::worst(an, |c| c.vu_lbf, |c| 0.5 * c.phi_vc_lbf).is_some_and(|w| w.ratio > 1.0));
    let d = shear.first().map_or(0.8 * m.h_total, |a| a.gov().dp_in);
    let have = ws.area.get() / s * 12.0;
    let need = if needed { av_min_per_length(m, d, fyt) / n * 12.0 } else { 0.0 };
    // spacing: 3h/4 and 24 in, halved where Vs > 4√f′c bw d
    let bw = m.bare.web_width_min_in;
    let heavy = shear
        .iter()
        .any(|a| a.gov().vs_lbf > 4.0 * m.mix.fc.get().sqrt() * bw * a.gov().dp_in);
    let smax = if heavy {
        (3.0 * m.h_total / 8.0).min(12.0)
    } else {
        (0.75 * m.h_total).min(24.0)
    };
    let spacing_ratio = s / smax;
    let area_ratio = if have > 0.0 { need / have } else { super::RATIO_NONE };
    let what = if needed {
        format!(
            "Av,min {need:.3} in²/ft per stem where Vu > 0.5φVc (fyt {:.0} ksi counted)",
            fyt / 1000.0
        )
    } else {
        "Vu ≤ 0.5φVc throughout: Av,min not required".to_string()
    };
    if spacing_ratio > area_ratio {
        let mut r = CheckResult::new(
            &INFO,
            s,
            smax,
            None,
            an.note(format_args!(
                "spacing {s:.1} in against the largest {smax:.1} in (3h/4 ≤ 24 in{}); {what}; provided {have:.3} in²/ft per stem",
                if heavy { ", halved as Vs > 4√f'c bw d" } else { "" }
            )),
        );
        r.unit = "in";
        return Some(r);
    }
    Some(CheckResult::new(
        &INFO,
        need,
        have,
        None,
        an.note(format_args!(
            "{what}; provided {:.3} in² at {s:.1} in = {have:.3} in²/ft per stem; spacing {s:.1} in ≤ {smax:.1} in",
            ws.area.get()
        )),
    ))
}

//! One-way shear strength, Vu ≤ φVn, from h/2 off each support face to the
//! other (ACI 318-19 §7.4.3.2 / §9.4.3.2).
//!
//! Clauses: ACI 318-19 §22.5.6.3: Vc the lesser of flexure-shear
//! Vci = 0.6λ√f′c bw dp + Vd + Vi·Mcre/Mmax ≥ 1.7λ√f′c bw dp (Eq.
//! 22.5.6.3.1a/b), Mcre = (I/yt)(6λ√f′c + fpe − fd) (Eq. 22.5.6.3.1c), and
//! web-shear Vcw = (3.5λ√f′c + 0.3 fpc) bw dp + Vp (Eq. 22.5.6.3.2);
//! dp ≥ 0.8h (§22.5.2.1); √f′c ≤ 100 psi (§22.5.3.1); prestress built up
//! linearly over 50 db in the transfer zone (§22.5.7 in 318-19 numbering,
//! §22.5.9 in 318-14 — the 318-19 number from memory, medium); φ = 0.75
//! (Table 21.2.1). Vi = Vu − Vd and Mmax = Mu − Md (commentary
//! R22.5.6.3.1, reference sheet from memory, medium). bw is the least
//! summed web width.
//!
//! Hollow-core (a one-way slab) passes with Vu ≤ φVc (§7.6.3.1); untopped
//! units deeper than 12.5 in also need Vu ≤ 0.5φVcw ([`DEEP_INFO`]).
//! Double-tee stems are beams (§9.6.3.1): Vn = Vc + Vs (§22.5.1.1), with
//! Vs = Av fyt d / s (§22.5.8.5.3), fyt ≤ 60 ksi (§20.2.2.4, from memory,
//! medium), Vs ≤ 8√f′c bw d (§22.5.1.2). A pattern that gives its stem
//! reinforcement (`web_steel`) is credited with it and checked for Av,min
//! and spacing by [`super::web_steel`]; a pattern that does not is taken
//! to receive the ordinary stem reinforcement the producer details (stems
//! are always reinforced), counted as Vs ≤ 4√f′c bw d — the most before
//! §9.7.6.2.2 halves the spacing — and the note names the Av/s needed
//! along the member.
//!
//! Where the worst point lies: Vu is piecewise linear (both sides of each
//! line load are stations) and the parts of Vc are monotone between
//! stations, so in each segment and combination Vu/φVn is bounded by the
//! largest Vu at its ends over the least φVn at its ends. Each segment
//! whose bound exceeds the worst station is searched: the points where Vci
//! meets its lower bound and where Mcre reaches zero (corners where Vci
//! stops falling, so the ratio can peak there) are found by root search;
//! where Vci meets Vcw, Vc = min(Vci, Vcw) has a ridge and the ratio a
//! trough, never a peak. In each smooth piece the parabola through its
//! ends and midpoint says whether a peak near the worst point lies inside,
//! which is then searched by successive parabolas ([`super::refine_max`]). Vci is found per
//! combination, since Vi and Mmax must occur together.

use serde::Serialize;

use super::{Analysis, CheckInfo, CheckResult, Group, Reads, kip};
use crate::case::Effects;
use crate::member::{Effective, Member};
use crate::section::Family;

/// Registry entry: Vu ≤ φVn.
pub const INFO: CheckInfo = CheckInfo {
    id: "shear",
    title: "Shear strength Vu ≤ φVn",
    clause: "ACI 318-19 22.5.6.3, 22.5.7, 22.5.8.5.3, 22.5.1.2, 7.6.3.1 / 9.6.3.1; φ 21.2.1",
    unit: "kip",
    group: Group::Shear,
    reads: Reads::Demand,
    load_driven: true,
};

/// Registry entry: deep untopped hollow-core.
pub const DEEP_INFO: CheckInfo = CheckInfo {
    id: "shear_deep_hollow_core",
    title: "Deep hollow-core without stirrups: Vu ≤ 0.5 φVcw",
    clause: "ACI 318-19 7.6.3.1",
    unit: "kip",
    group: Group::Shear,
    reads: Reads::Demand,
    load_driven: true,
};

/// Shear strength under one load combination at one point, lbf.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Combo {
    /// Which combination (index into [`crate::case::COMBINATIONS`]).
    pub combo: u8,
    /// Factored shear.
    pub vu_lbf: f64,
    /// Flexure-shear strength by Eq. 22.5.6.3.1a, before its lower bound,
    /// with Vi and Mmax of this combination.
    pub vci_raw_lbf: f64,
    /// Its lower bound 1.7λ√f′c bw dp (Eq. 22.5.6.3.1b).
    pub vci_min_lbf: f64,
    /// Flexure-shear strength (with the lower bound).
    pub vci_lbf: f64,
    /// Web-shear strength.
    pub vcw_lbf: f64,
    /// φVc, concrete alone.
    pub phi_vc_lbf: f64,
    /// Shear reinforcement strength counted, Vs.
    pub vs_lbf: f64,
    /// φVn = φ(Vc + Vs).
    pub phi_vn_lbf: f64,
    /// Effective depth dp (≥ 0.8h), in.
    pub dp_in: f64,
    /// Mcre of Eq. 22.5.6.3.1c before it is floored at 0 (negative where
    /// the dead load alone would crack the section), lbf·in.
    pub mcre_raw_lbin: f64,
}

/// Shear at one station: each combination (Vi and Mmax of Eq.
/// 22.5.6.3.1a occur together, so Vci is found per combination), the one
/// with the highest Vu/φVn first in `gov`.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct AtStation {
    /// Every combination, in the order of [`crate::case::COMBINATIONS`].
    pub combos: [Combo; 3],
    /// Index of the combination with the highest Vu/φVn.
    pub gov: u8,
}

impl AtStation {
    /// The combination with the highest Vu/φVn.
    pub fn gov(&self) -> &Combo {
        &self.combos[self.gov as usize]
    }
    /// Factored shear of the governing combination, lbf.
    pub fn vu_lbf(&self) -> f64 {
        self.gov().vu_lbf
    }
    /// φVn of the governing combination, lbf.
    pub fn phi_vn_lbf(&self) -> f64 {
        self.gov().phi_vn_lbf
    }
}

impl Combo {
    /// The name of its combination, as printed.
    pub fn name(&self) -> &'static str {
        crate::case::COMBINATIONS[self.combo as usize].name
    }
}

/// Strength reduction factor for shear, Table 21.2.1.
pub const PHI: f64 = 0.75;
/// Largest yield strength counted in shear reinforcement, psi (ACI 318-19
/// §20.2.2.4, Table 20.2.2.4(a); from memory, medium).
pub const FYT_MAX_PSI: f64 = 60_000.0;

/// Whether the member's shear strength may count stem reinforcement (a
/// stemmed member: double tee).
pub fn stemmed(m: &Member) -> bool {
    m.section.family == Family::DoubleTee
}

/// Vs the given stem reinforcement provides (all stems), before the
/// §22.5.1.2 cap, lbf.
pub fn vs_provided(m: &Member, dp: f64) -> Option<f64> {
    let w = m.pattern.web_steel?;
    let n = m.section.geometry.stems.len().max(1) as f64;
    Some(n * w.area.get() * w.fy.get().min(FYT_MAX_PSI) * dp / w.spacing.get())
}

/// The terms of the concrete shear strengths at one point, as put into
/// ACI 318-19 Eqs. 22.5.6.3.1a–c and 22.5.6.3.2 (lbf, in, psi): what
/// [`at`] computes with, and what the calculation sheet shows.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Terms {
    /// λ.
    pub lambda: f64,
    /// √f′c, psi (at most 100, §22.5.3.1).
    pub sqrt_fc_psi: f64,
    /// Web width bw (webs or stems summed; the webs left over an opening), in.
    pub bw_in: f64,
    /// dp, at least 0.8h, in.
    pub dp_in: f64,
    /// Compressive stress at the centroid from prestress (composite: the
    /// stress where §22.5.6.3.2 reads it), psi.
    pub fpc_psi: f64,
    /// Vertical component of the prestress Vp, lbf.
    pub vp_lbf: f64,
    /// Web-shear strength Vcw, lbf.
    pub vcw_lbf: f64,
    /// Compressive stress at the extreme tension fibre from prestress fpe, psi.
    pub fpe_psi: f64,
    /// Stress there from the unfactored dead load fd, psi.
    pub fd_psi: f64,
    /// Section modulus to the extreme tension fibre (composite when topped), in³.
    pub s_in3: f64,
    /// Mcre = S (6λ√f′c + fpe − fd), before flooring at 0, lbf·in.
    pub mcre_raw_lbin: f64,
    /// Mcre floored at 0, lbf·in.
    pub mcre_lbin: f64,
    /// Unfactored dead-load shear Vd, lbf.
    pub vd_lbf: f64,
    /// Lower bound of Vci, 1.7λ√f′c bw dp, lbf.
    pub vci_min_lbf: f64,
    /// Vci where the moment hogs, 1.7λ√f′c bw 0.8h, lbf.
    pub vci_hog_lbf: f64,
    /// Shear reinforcement strength counted Vs, lbf.
    pub vs_lbf: f64,
    /// Unfactored dead-load moment Md, lbf·in.
    pub md_lbin: f64,
}

/// The terms of [`at`] at `x`.
pub fn terms(m: &Member, x: f64, pre: Effective, eff: &Effects) -> Terms {
    let lam = m.mix.aggregate.lambda();
    let rt = m.mix.fc.get().sqrt().min(100.0);
    let (b, comp) = m.props_at(x);
    let bw = m.bw_at(x);
    let (pe, y) = (pre.pe_shear, pre.y_shear);
    let dp = (m.h_total - y).max(0.8 * m.h_total);
    let e = b.yb_in - y;
    let fpe = pe / b.area_in2 + pe * e / b.sb_in3;
    let mnc = eff.m_self + eff.m_topping;
    let (s_ext, fd, fpc) = match comp {
        Some(c) => {
            // stress at the composite centroid (or the web–flange junction
            // when that centroid lies in the flange) from prestress and the
            // moments the precast carries alone; a solid section has no
            // flange apart from its web, so its centroid is used as it is
            let solid = b.top_flange_in >= b.depth_in - 1e-9;
            let y_web_top = if solid { f64::INFINITY } else { b.depth_in - b.top_flange_in };
            let yr = c.yb_in.min(y_web_top) - b.yb_in;
            let fpc = pe / b.area_in2 - pe * e * yr / b.ix_in4 + mnc * yr / b.ix_in4;
            (c.sb_in3, mnc / b.sb_in3 + eff.m_sdl / c.sb_in3, fpc)
        }
        None => (b.sb_in3, eff.m_dead() / b.sb_in3, pe / b.area_in2),
    };
    let mcre_raw = s_ext * (6.0 * lam * rt + fpe - fd);
    let mcre = mcre_raw.max(0.0);
    let vd = eff.v_dead().abs();
    let vp = m.vp_at(x);
    let vcw = (3.5 * lam * rt + 0.3 * fpc) * bw * dp + vp;
    let vci_min = 1.7 * lam * rt * bw * dp;
    let vci_hog = 1.7 * lam * rt * bw * 0.8 * m.h_total;
    // §22.5.1.2: Vs counted at most 8√f′c bw d; stems whose reinforcement
    // the catalog does not give are taken to receive ordinary stem
    // reinforcement, at most 4√f′c bw d (beyond it §9.7.6.2.2 halves the
    // spacing)
    let rfc = m.mix.fc.get().sqrt();
    let vs = if stemmed(m) {
        vs_provided(m, dp).map_or(4.0 * rfc * bw * dp, |v| v.min(8.0 * rfc * bw * dp))
    } else {
        0.0
    };
    Terms {
        lambda: lam,
        sqrt_fc_psi: rt,
        bw_in: bw,
        dp_in: dp,
        fpc_psi: fpc,
        vp_lbf: vp,
        vcw_lbf: vcw,
        fpe_psi: fpe,
        fd_psi: fd,
        s_in3: s_ext,
        mcre_raw_lbin: mcre_raw,
        mcre_lbin: mcre,
        vd_lbf: vd,
        vci_min_lbf: vci_min,
        vci_hog_lbf: vci_hog,
        vs_lbf: vs,
        md_lbin: eff.m_dead(),
    }
}

/// Shear strength at `x`, from the station's unfactored effects: every
/// combination of ASCE 7-16 §2.3.1. Where an opening cuts the unit, the net
/// section and the webs left (over the opening and h/2 beyond). Where a
/// combination's moment does not sag (over a support with an overhang),
/// Eq. 22.5.6.3.1a, written for flexure-shear cracking from the soffit,
/// does not apply and Vci is taken at its lower bound 1.7λ√f′c bw dp, with
/// dp = 0.8h (conservative; common practice, no source).
pub fn at(m: &Member, x: f64, pre: Effective, eff: &Effects) -> AtStation {
    let t = terms(m, x, pre, eff);
    let mut k = 0u8;
    let combos = crate::case::COMBINATIONS.map(|c| {
        let (mu, v) = c.apply(eff);
        k += 1;
        let vu = v.abs();
        let (vci_raw, vci_min) = if mu > 0.0 {
            let vi = (vu - t.vd_lbf).max(0.0);
            let mmax = (mu - t.md_lbin).max(1e-6);
            (
                0.6 * t.lambda * t.sqrt_fc_psi * t.bw_in * t.dp_in + t.vd_lbf + vi * t.mcre_lbin / mmax,
                t.vci_min_lbf,
            )
        } else {
            (t.vci_hog_lbf, t.vci_hog_lbf)
        };
        let vci = vci_raw.max(vci_min);
        let vc = vci.min(t.vcw_lbf).max(0.0);
        Combo {
            combo: k - 1,
            vu_lbf: vu,
            vci_raw_lbf: vci_raw,
            vci_min_lbf: vci_min,
            vci_lbf: vci,
            vcw_lbf: t.vcw_lbf,
            phi_vc_lbf: PHI * vc,
            vs_lbf: t.vs_lbf,
            phi_vn_lbf: PHI * (vc + t.vs_lbf),
            dp_in: t.dp_in,
            mcre_raw_lbin: t.mcre_raw_lbin,
        }
    });
    let gov = combos
        .iter()
        .max_by(|a, b| {
            (a.vu_lbf * b.phi_vn_lbf)
                .total_cmp(&(b.vu_lbf * a.phi_vn_lbf))
                .then(a.vu_lbf.total_cmp(&b.vu_lbf))
        })
        .map_or(0, |c| c.combo);
    AtStation { combos, gov }
}

/// Shear strength at any x.
pub fn at_x(m: &Member, x: f64) -> AtStation {
    at(m, x, m.effective_at(x), &m.effects(x))
}

/// The worst point of a shear ratio over the member.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Worst {
    /// Distance from the left bearing centre, in.
    pub x_in: f64,
    /// The combination there that gives the ratio.
    pub combo: Combo,
    /// The ratio.
    pub ratio: f64,
}

/// The greatest of demand ÷ capacity over the shear range and the
/// combinations, at the stations and between them (see the module comment
/// for why this finds it).
pub fn worst(an: &Analysis, demand: fn(&Combo) -> f64, capacity: fn(&Combo) -> f64) -> Option<Worst> {
    let m = &an.member;
    let ratio = |c: &Combo| {
        let cap = capacity(c);
        if cap > 0.0 { demand(c) / cap } else { super::RATIO_NONE }
    };
    // with no strength at all (webs cut away) every point is as bad: the
    // largest shear is then the worst, and the one reported
    let top = |a: &AtStation| -> (usize, f64) {
        (0..3)
            .map(|i| (i, ratio(&a.combos[i])))
            .max_by(|x, y| x.1.total_cmp(&y.1).then(a.combos[x.0].vu_lbf.total_cmp(&a.combos[y.0].vu_lbf)))
            .expect("three")
    };
    let pts: Vec<(usize, f64, AtStation)> = an
        .stations
        .iter()
        .enumerate()
        .filter_map(|(i, s)| s.shear.map(|v| (i, s.x_in, v)))
        .collect();
    let mut best = pts
        .iter()
        .map(|(_, x, a)| {
            let (i, r) = top(a);
            Worst {
                x_in: *x,
                combo: a.combos[i],
                ratio: r,
            }
        })
        .max_by(|a, b| a.ratio.total_cmp(&b.ratio).then(a.combo.vu_lbf.total_cmp(&b.combo.vu_lbf)))?;
    // a point is searched further only when a first estimate comes within
    // this fraction of the worst point found
    const SCREEN: f64 = 2e-3;
    for w in pts.windows(2) {
        let ((i0, x0, a0), (i1, x1, a1)) = (w[0], w[1]);
        // two shear zones (span and overhang) are not one stretch
        if x1 - x0 < 1e-6 || i1 != i0 + 1 {
            continue;
        }
        let mut mid: Option<AtStation> = None;
        for i in 0..3 {
            let (c0, c1) = (a0.combos[i], a1.combos[i]);
            let cap = capacity(&c0).min(capacity(&c1));
            let bound = if cap > 0.0 {
                demand(&c0).max(demand(&c1)) / cap
            } else {
                super::RATIO_NONE
            };
            if bound <= best.ratio * (1.0 + 1e-12) {
                continue;
            }
            let combo_at = |x: f64| at_x(m, x).combos[i];
            let keep = |best: &mut Worst, x: f64, c: Combo| {
                let r = ratio(&c);
                if r > best.ratio {
                    *best = Worst {
                        x_in: x,
                        combo: c,
                        ratio: r,
                    };
                }
            };
            // the kinks of Vc inside the segment where the ratio can peak —
            // Vci meeting its lower bound and Mcre reaching zero, both
            // corners where Vci stops falling — split it into smooth pieces;
            // the ratio at a kink is taken as it is. (Where Vci meets Vcw,
            // Vc = min(Vci, Vcw) has a ridge, so Vu/φVn has a trough there:
            // never a maximum.)
            let mut cuts = [(x0, c0), (x1, c1), (x1, c1), (x1, c1)];
            let mut n = 2;
            for g in [(|c: &Combo| c.vci_raw_lbf - c.vci_min_lbf) as fn(&Combo) -> f64, |c: &Combo| {
                c.mcre_raw_lbin
            }] {
                let (g0, g1) = (g(&c0), g(&c1));
                if g0 * g1 < 0.0 {
                    let xk = super::root(|x| g(&combo_at(x)), x0, g0, x1, g1);
                    let ck = combo_at(xk);
                    keep(&mut best, xk, ck);
                    cuts[n] = (xk, ck);
                    n += 1;
                }
            }
            let cuts = &mut cuts[..n];
            cuts.sort_by(|a, b| a.0.total_cmp(&b.0));
            // each smooth piece: the parabola through its ends and midpoint
            // says whether a peak near the worst point lies inside; only
            // then is it searched
            for piece in cuts.windows(2) {
                let ((xa, ca), (xb, cb)) = (piece[0], piece[1]);
                if xb - xa < 1e-6 {
                    continue;
                }
                let xm = 0.5 * (xa + xb);
                let cm = if n == 2 {
                    mid.get_or_insert_with(|| at_x(m, xm)).combos[i]
                } else {
                    combo_at(xm)
                };
                keep(&mut best, xm, cm);
                let (r0, rm, r1) = (ratio(&ca), ratio(&cm), ratio(&cb));
                let (b, c) = (4.0 * rm - 3.0 * r0 - r1, 2.0 * r0 + 2.0 * r1 - 4.0 * rm);
                if c < 0.0 {
                    let t = -b / (2.0 * c);
                    let est = r0 + b * t + c * t * t;
                    if t > 0.0 && t < 1.0 && est > best.ratio * (1.0 - SCREEN) {
                        let (x, _) = super::refine_max(|x| ratio(&combo_at(x)), xa, r0, xb, r1);
                        keep(&mut best, x, combo_at(x));
                    }
                }
            }
        }
    }
    Some(best)
}

/// Av/s the member needs at a point (all stems, in²/in), fyt = 60 ksi:
/// Av,min/s where Vu > 0.5φVc (§9.6.3.1, Table 9.6.3.4), and enough for
/// Vs = Vu/φ − Vc where Vu > φVc (§22.5.8.5.3); 0 elsewhere.
pub fn av_s_needed(m: &Member, a: &Combo) -> f64 {
    if a.vu_lbf <= 0.5 * a.phi_vc_lbf {
        return 0.0;
    }
    let min = av_min_per_length(m, a.dp_in, FYT_MAX_PSI);
    let vc = a.phi_vc_lbf / PHI;
    let strength = ((a.vu_lbf / PHI - vc) / (FYT_MAX_PSI * a.dp_in)).max(0.0);
    min.max(strength)
}

/// Av,min ÷ s for the whole member (in²/in), ACI 318-19 Table 9.6.3.4
/// (9.6.3.3 in 318-14; numbering and expressions from memory, medium): for
/// prestressed members with Aps fse ≥ 0.4 Aps fpu, the lesser of the
/// greater of 0.75√f′c bw/fyt and 50 bw/fyt, and Aps fpu/(80 fyt d)·√(d/bw);
/// otherwise the first.
pub fn av_min_per_length(m: &Member, d: f64, fyt: f64) -> f64 {
    let bw = m.bare.web_width_min_in;
    let fc = m.mix.fc.get();
    let general = (0.75 * fc.sqrt() * bw / fyt).max(50.0 * bw / fyt);
    let fpu = m.strand.fpu.get();
    if m.history.fse_psi >= 0.4 * fpu {
        general.min(m.aps * fpu / (80.0 * fyt * d) * (d / bw).sqrt())
    } else {
        general
    }
}

/// The greatest Vu/φVn (found once per analysis).
pub fn worst_vn(an: &Analysis) -> Option<Worst> {
    *an.shear_worst.get_or_init(|| worst(an, |a| a.vu_lbf, |a| a.phi_vn_lbf))
}

/// Run the check.
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let w = worst_vn(an)?;
    let v = w.combo;
    let m = &an.member;
    let governs = if v.phi_vn_lbf <= 0.0 {
        "no web is left to carry shear here (an opening cuts them all): no shear strength;"
    } else if v.vci_lbf <= v.vcw_lbf {
        "Vci (flexure-shear) governs;"
    } else {
        "Vcw (web-shear) governs;"
    };
    let mut note = an.note(format_args!("{governs} {}", v.name()));
    if stemmed(m) && !an.brief {
        let n = m.section.geometry.stems.len().max(1) as f64;
        let need: Vec<(f64, f64)> = an
            .stations
            .iter()
            .filter_map(|s| {
                s.shear
                    .map(|a| (s.x_in / 12.0, a.combos.iter().map(|c| av_s_needed(m, c)).fold(0.0, f64::max)))
            })
            .filter(|&(_, r)| r > 0.0)
            .collect();
        let most = need.iter().map(|n| n.1).fold(0.0, f64::max) * 12.0 / n;
        match (m.pattern.web_steel, need.first(), need.last()) {
            (Some(ws), _, _) => note.push_str(&format!(
                "; stem reinforcement {:.3} in² at {:.1} in per stem (fyt {:.0} ksi counted): Vs = {:.1} kip",
                ws.area.get(),
                ws.spacing.get(),
                ws.fy.get().min(FYT_MAX_PSI) / 1000.0,
                kip(v.vs_lbf)
            )),
            (None, Some(a), Some(b)) => note.push_str(&format!(
                "; no stem reinforcement in the catalog: the stems need Av/s up to {most:.3} in²/ft per stem (fyt 60 ksi) over {:.1}–{:.1} ft (Av,min where Vu > 0.5φVc, §9.6.3.1; more where Vu > φVc); ordinary stem reinforcement assumed, Vs counted up to 4√f'c bw d",
                a.0, b.0
            )),
            (None, _, _) => note.push_str("; Vu ≤ 0.5φVc throughout: no stem reinforcement required (9.6.3.1)"),
        }
    }
    Some(CheckResult::new(&INFO, kip(v.vu_lbf), kip(v.phi_vn_lbf), Some(w.x_in), note))
}

/// Untopped hollow-core deeper than 12.5 in: Vu ≤ 0.5φVcw (§7.6.3.1).
pub fn run_deep(an: &Analysis) -> Option<CheckResult> {
    let m = &an.member;
    if m.section.family != Family::HollowCore || m.comp.is_some() || m.bare.depth_in <= 12.5 * (1.0 + 1e-9) {
        return None;
    }
    let w = worst(an, |a| a.vu_lbf, |a| 0.5 * PHI * a.vcw_lbf)?;
    Some(CheckResult::new(
        &DEEP_INFO,
        kip(w.combo.vu_lbf),
        kip(0.5 * PHI * w.combo.vcw_lbf),
        Some(w.x_in),
        an.note(format_args!(
            "untopped depth {:.1} in > 12.5 in; no stirrups in hollow-core",
            m.bare.depth_in
        )),
    ))
}

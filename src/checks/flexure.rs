//! Flexural strength φMn ≥ Mu at every station.
//!
//! Clauses: ACI 318-19 §22.2 and §22.3 (strain compatibility: plane
//! sections, εcu = 0.003, stress block 0.85 f′c over β1·c, Table 22.2.2.4.3),
//! strand stress by the Devalapura–Tadros power formula capped at fpu
//! (PCI Design Handbook method), effective prestrain fse/Eps plus the
//! decompression strain at each strand level; near the ends the strand
//! stress is limited by §25.4.8.3 over ℓtr and ℓd (ℓd doubled for debonded
//! strand, §25.4.8.1(b)); φ by Table 21.2.2 (εty = 0.002) and, where the
//! strand is not developed, by §21.2.3 (0.75 to ℓtr, rising to 0.90 at ℓd).
//! Factored moments by ASCE 7-16 §2.3.1. ACI Eq. 20.3.2.3.1 is reported
//! beside it at midspan. Mild bars counted elastic–plastic (Es = 29 000 ksi).
//!
//! Does not cover: compression steel, strand above the neutral axis in
//! compression beyond its elastic response, unbonded tendons.

use serde::Serialize;

use super::{Analysis, CheckInfo, CheckResult, Group, Reads, kipft};
use crate::material::beta1;
use crate::member::{Effective, Member};
use crate::prestress::{developed_stress, development_length};
use crate::strength::{Concrete, Steel, SteelLayer, fps_approx, mn_fixed_stress, strain_compatibility};

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "flexure",
    title: "Flexural strength",
    clause: "ACI 318-19 22.2, 22.3, 21.2.2, 21.2.3, 25.4.8.3; ASCE 7-16 2.3.1",
    unit: "kip-ft",
    group: Group::Strength,
    reads: Reads::Demand,
    load_driven: true,
};

/// Flexure at one station.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct AtStation {
    /// Nominal strength, lbf·in.
    pub mn_lbin: f64,
    /// φ used.
    pub phi: f64,
    /// Design strength, lbf·in.
    pub phi_mn_lbin: f64,
    /// Net tensile strain in the extreme strand layer.
    pub eps_t: f64,
    /// Neutral-axis depth, in.
    pub c_in: f64,
    /// Whether every strand is fully developed here.
    pub developed: bool,
    /// Cracking moment Mcr with the prestress at this station, lbf·in.
    pub mcr_lbin: f64,
}

/// The member's concrete for flexure: the full section, or with `net` the
/// section an opening leaves (its part of the precast and of the topping
/// taken out).
fn concrete<'m>(m: &'m Member, net: bool) -> Concrete<'m> {
    let (props, geometry) = match (&m.net, &m.net_geometry, net) {
        (Some((p, _)), Some(g), true) => (p, g),
        _ => (m.bare, &m.section.geometry),
    };
    let topping = m.case.topping.as_ref().map(|t| (t.thickness.get(), props.width_in, t.mix.fc.get()));
    let b1 = m.case.topping.as_ref().map_or(m.mix.beta1(), |t| beta1(t.mix.fc));
    Concrete {
        geometry,
        fc: m.mix.fc.get(),
        topping,
        beta1: b1,
        top_band: props.top_band,
    }
}

/// Whether `x` lies where an opening cuts the unit (the net section).
fn over_cut(m: &Member, x: f64) -> bool {
    m.cut.is_some_and(|c| x >= c.along.0 && x <= c.along.1)
}

/// Steel layers at `x`; `full` gives the developed stresses that set ℓd
/// (None: no development limit).
fn layers<'m>(m: &'m Member, x: f64, full: Option<&[f64]>) -> Vec<SteelLayer<'m>> {
    let mut out = Vec::with_capacity(m.layers.len() + m.pattern.bars.len());
    layers_into(m, x, m.effective_at(x), full, &mut out);
    out
}

/// [`layers`] into a buffer (a station's flexure reuses one).
fn layers_into<'m>(m: &'m Member, x: f64, pre: Effective, full: Option<&[f64]>, out: &mut Vec<SteelLayer<'m>>) {
    out.clear();
    let fse = m.history.fse_psi;
    let ec = m.ec;
    let d = m.end_distance(x);
    let b = m.props_at(x).0;
    let (pe, y) = (pre.pe, pre.y);
    let e = b.yb_in - y;
    out.extend(m.layers.iter().enumerate().map(|(i, layer)| {
        let yi = m.layer_y(layer, d);
        let ei = b.yb_in - yi;
        // decompression: concrete strain at the strand level from prestress
        let eps2 = (pe / b.area_in2 + pe * e * ei / b.ix_in4) / ec;
        let cap = match full {
            None => m.strand.fpu.get(),
            Some(f) => {
                let ld = development_length(fse, f[i], m.db(), layer.debond > 0.0);
                developed_stress(m.bonded(layer, x), fse, f[i], m.ltr, ld)
            }
        };
        SteelLayer {
            area: layer.area,
            depth: m.h_total - yi,
            steel: Steel::Strand {
                kind: m.strand,
                prestrain: fse / m.strand.eps.get() + eps2,
                cap,
            },
        }
    }));
    for bar in &m.pattern.bars {
        out.push(SteelLayer {
            area: bar.count as f64 * bar.area.get(),
            depth: m.h_total - bar.height.get(),
            steel: Steel::Bar {
                fy: bar.fy.get(),
                es: 29_000_000.0,
            },
        });
    }
}

/// φ where strand is not fully developed, ACI 318-19 Table 21.2.3
/// (reference sheet §4.3, from memory, medium confidence): 0.75 from the
/// point where bonding begins to ℓtr, then linear to 0.90 at ℓd.
fn phi_development(m: &Member, at: f64, full: &[f64]) -> (f64, bool) {
    let mut phi: f64 = 0.90;
    let mut developed = true;
    for (i, layer) in m.layers.iter().enumerate() {
        let x = m.bonded(layer, at);
        let ld = development_length(m.history.fse_psi, full[i], m.db(), layer.debond > 0.0);
        let p = if x <= m.ltr {
            0.75
        } else if x < ld {
            0.75 + 0.15 * (x - m.ltr) / (ld - m.ltr)
        } else {
            0.90
        };
        if x < ld {
            developed = false;
        }
        phi = phi.min(p);
    }
    (phi, developed)
}

/// Cracking moment with the effective prestress at `x`, lbf·in:
/// Mcr = Sb (fr + Pe/A + Pe e/Sb) bare, or for an unshored topping
/// Mcr = Sbc (fr + Pe/A + Pe e/Sb − Mnc/Sb) + Mnc (PCI Design Handbook form;
/// reference sheet §4.5, from memory, high confidence), Mnc the moment of
/// self-weight and topping at the same section; the net section where an
/// opening cuts the unit.
pub fn mcr(m: &Member, x: f64) -> f64 {
    mcr_with(m, x, m.effective_at(x))
}

/// [`mcr`] with the effective prestress at the station already found.
fn mcr_with(m: &Member, x: f64, pre: Effective) -> f64 {
    mcr_terms(m, x, pre).mcr_lbin
}

/// The terms of [`mcr`] at one section, for the calculation sheet.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct McrTerms {
    /// Precast area there (the net section over an opening), in².
    pub area_in2: f64,
    /// Precast bottom section modulus there, in³.
    pub sb_in3: f64,
    /// Composite bottom section modulus there (topped members), in³.
    pub sbc_in3: Option<f64>,
    /// Precast top section modulus there (the service stresses beside Mcr), in³.
    pub st_in3: f64,
    /// Composite section modulus at the precast top there (topped members), in³.
    pub stc_in3: Option<f64>,
    /// Moment on the precast alone, self-weight and topping (topped members), lbf·in.
    pub mnc_lbin: f64,
    /// Effective prestress force there, lbf.
    pub pe_lbf: f64,
    /// Its eccentricity below the precast centroid there, in.
    pub e_in: f64,
    /// Modulus of rupture, psi.
    pub fr_psi: f64,
    /// Mcr, lbf·in.
    pub mcr_lbin: f64,
}

/// The terms of Mcr at `x` with the effective prestress there.
pub fn mcr_terms(m: &Member, x: f64, pre: Effective) -> McrTerms {
    let (pe, y) = (pre.pe, pre.y);
    let (b, comp) = m.props_at(x);
    let e = b.yb_in - y;
    let fr = m.mix.fr().get();
    let pre = pe / b.area_in2 + pe * e / b.sb_in3;
    let (mnc, mcr) = match comp {
        None => (0.0, b.sb_in3 * (fr + pre)),
        Some(c) => {
            let mnc = m.loads.at(crate::loads::SELF, x).0 + m.loads.at(crate::loads::TOPPING, x).0;
            (mnc, c.sb_in3 * (fr + pre - mnc / b.sb_in3) + mnc)
        }
    };
    McrTerms {
        area_in2: b.area_in2,
        sb_in3: b.sb_in3,
        sbc_in3: comp.map(|c| c.sb_in3),
        st_in3: b.st_in3,
        stc_in3: comp.map(|c| c.st_precast_in3),
        mnc_lbin: mnc,
        pe_lbf: pe,
        e_in: e,
        fr_psi: fr,
        mcr_lbin: mcr,
    }
}

/// Strain-compatibility results already found for a given set of steel
/// layers — stations in the developed region of straight strand share them —
/// the member's concrete, built once, and the per-layer strand stress with
/// full development at midspan (psi), which sets ℓd.
#[derive(Debug)]
pub struct Memo<'m> {
    entries: Vec<(bool, Vec<SteelLayer<'m>>, crate::strength::Flexure)>,
    conc: Concrete<'m>,
    /// The concrete where an opening cuts the unit.
    conc_net: Concrete<'m>,
    scratch: Vec<SteelLayer<'m>>,
    /// Per-layer strand stress with full development at midspan, psi.
    pub full: Vec<f64>,
}

impl<'m> Memo<'m> {
    /// A memo that starts empty, given the strand stresses with full
    /// development already found (what [`Memo::new`] would find again).
    pub fn with_full(m: &'m Member, full: &[f64]) -> Memo<'m> {
        Memo {
            full: full.to_vec(),
            entries: Vec::new(),
            conc: concrete(m, false),
            conc_net: concrete(m, true),
            scratch: Vec::new(),
        }
    }

    /// The memo of a member, holding its midspan answer.
    pub fn new(m: &'m Member) -> Memo<'m> {
        let conc = concrete(m, false);
        // the middle of the member, every strand bonded there counted
        // developed: the stresses that set each layer's ℓd
        let ls = layers(m, 0.5 * (m.ends.0 + m.ends.1), None);
        let f = strain_compatibility(&conc, &ls);
        let full: Vec<f64> = f.stresses.iter().copied().take(m.layers.len()).collect();
        // the same answer holds with each strand capped at its own stress,
        // which is how the developed stations see it
        let mut capped = ls;
        for (l, &fi) in capped.iter_mut().zip(&full) {
            if let Steel::Strand { cap, .. } = &mut l.steel {
                *cap = fi;
            }
        }
        Memo {
            full,
            entries: vec![(false, capped, f)],
            conc,
            conc_net: concrete(m, true),
            scratch: Vec::new(),
        }
    }
}

/// Whether two sets of steel layers are the same to the bit (same answer).
fn same(a: &[SteelLayer], b: &[SteelLayer]) -> bool {
    a.len() == b.len()
        && a.iter().zip(b).all(|(x, y)| {
            x.area.to_bits() == y.area.to_bits()
                && x.depth.to_bits() == y.depth.to_bits()
                && match (x.steel, y.steel) {
                    (Steel::Strand { prestrain: p, cap: c, .. }, Steel::Strand { prestrain: q, cap: d, .. }) => {
                        p.to_bits() == q.to_bits() && c.to_bits() == d.to_bits()
                    }
                    (Steel::Bar { fy: f, .. }, Steel::Bar { fy: g, .. }) => f.to_bits() == g.to_bits(),
                    _ => false,
                }
        })
}

/// Flexure at `x`.
pub fn at<'m>(m: &'m Member, x: f64, pre: Effective, memo: &mut Memo<'m>) -> AtStation {
    let mut ls = std::mem::take(&mut memo.scratch);
    layers_into(m, x, pre, Some(&memo.full), &mut ls);
    let net = over_cut(m, x);
    let i = match memo.entries.iter().position(|(n, l, _)| *n == net && same(l, &ls)) {
        Some(i) => i,
        None => {
            let f = strain_compatibility(if net { &memo.conc_net } else { &memo.conc }, &ls);
            memo.entries.push((net, ls.clone(), f));
            memo.entries.len() - 1
        }
    };
    memo.scratch = ls;
    let f = &memo.entries[i].2;
    let (phi_dev, developed) = phi_development(m, x, &memo.full);
    let phi = f.phi.min(phi_dev);
    AtStation {
        mn_lbin: f.mn,
        phi,
        // no strand left (an opening cutting them all): nil, not a rounding below it
        phi_mn_lbin: (phi * f.mn).max(0.0),
        eps_t: f.eps_t,
        c_in: f.c,
        developed,
        mcr_lbin: mcr_with(m, x, pre),
    }
}

/// Mn at midspan by ACI Eq. 20.3.2.3.1 (lbf·in) and its fps (psi).
pub fn approximate_mn(m: &Member) -> (f64, f64) {
    let conc = concrete(m, false);
    let dp = m.h_total - m.pattern.centroid();
    let fc = m.case.topping.as_ref().map_or(m.mix.fc.get(), |t| t.mix.fc.get());
    let fps = fps_approx(m.aps, m.strand.fpu.get(), m.strand.fpy.get(), m.bare.width_in, dp, fc, conc.beta1);
    (mn_fixed_stress(&conc, m.aps, fps, dp).0, fps)
}

/// The point of greatest Mu/φMn.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Worst {
    /// Distance from the left bearing centre, in.
    pub x_in: f64,
    /// Factored moment there, lbf·in.
    pub mu_lbin: f64,
    /// Its combination.
    pub combo: &'static str,
    /// Design strength there, lbf·in.
    pub phi_mn_lbin: f64,
    /// Flexure there.
    pub at: AtStation,
}

/// The greatest Mu/φMn over the member. Mu is concave between stations
/// and greatest at the zero-shear stations, so it is monotone in every
/// segment; φMn is constant where the strand is developed and its profile
/// straight, and monotone in the development and drape zones. So in each
/// segment Mu/φMn is bounded by the larger Mu at its ends over the smaller
/// φMn; a segment whose bound exceeds the worst station is searched by
/// successive parabolas ([`super::refine_max`]) with strain compatibility
/// at each point tried.
pub fn worst(an: &Analysis) -> Option<Worst> {
    *an.flexure_worst.get_or_init(|| search(an))
}

fn search(an: &Analysis) -> Option<Worst> {
    let ratio = |s: &super::Station| s.mu_lbin / s.flexure.phi_mn_lbin;
    let pts: Vec<&super::Station> = an.stations.iter().filter(|s| s.mu_lbin > 0.0).collect();
    // where no strength is left (an opening cutting every strand) the ratio
    // is infinite at several stations: the largest moment among them is
    // the worst, and the one reported
    let s = pts
        .iter()
        .copied()
        .max_by(|a, b| ratio(a).total_cmp(&ratio(b)).then(a.mu_lbin.total_cmp(&b.mu_lbin)))?;
    let mut best = Worst {
        x_in: s.x_in,
        mu_lbin: s.mu_lbin,
        combo: s.mu_combo,
        phi_mn_lbin: s.flexure.phi_mn_lbin,
        at: s.flexure,
    };
    let m = &an.member;
    let mut memo: Option<Memo> = None;
    for w in pts.windows(2) {
        let (a, b) = (w[0], w[1]);
        let cap = a.flexure.phi_mn_lbin.min(b.flexure.phi_mn_lbin);
        let bound = a.mu_lbin.max(b.mu_lbin) / cap;
        if bound <= best.mu_lbin / best.phi_mn_lbin * (1.0 + 1e-12) || b.x_in - a.x_in < 1e-6 {
            continue;
        }
        let memo = memo.get_or_insert_with(|| Memo::with_full(m, &an.full));
        let mut state = |x: f64| {
            let f = at(m, x, m.effective_at(x), memo);
            let (mu, combo, _, _) = crate::case::factored(&m.effects(x));
            (f, mu, combo)
        };
        let (x, rx) = super::refine_max(
            |x| {
                let (f, mu, _) = state(x);
                mu / f.phi_mn_lbin
            },
            a.x_in,
            ratio(a),
            b.x_in,
            ratio(b),
        );
        if rx > best.mu_lbin / best.phi_mn_lbin {
            let (f, mu, combo) = state(x);
            best = Worst {
                x_in: x,
                mu_lbin: mu,
                combo,
                phi_mn_lbin: f.phi_mn_lbin,
                at: f,
            };
        }
    }
    Some(best)
}

/// Run the check: the point with the highest Mu/φMn ([`worst`]).
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let w = worst(an)?;
    let (mn_aci, fps_aci) = if an.brief { (0.0, 0.0) } else { approximate_mn(&an.member) };
    let f = &w.at;
    if w.phi_mn_lbin <= 0.0 {
        let note = an.note(format_args!(
            "{}; no strand or bar carries stress here (each is cut by an opening or not yet bonded): no flexural strength",
            w.combo
        ));
        return Some(CheckResult::new(&INFO, kipft(w.mu_lbin), 0.0, Some(w.x_in), note));
    }
    let note = an.note(format_args!(
        "{}; φ = {:.2}, εt = {:.4}{}; c = {:.2} in; Mn by ACI Eq. 20.3.2.3.1 at midspan {:.1} kip-ft (fps {:.1} ksi)",
        w.combo,
        f.phi,
        f.eps_t,
        if f.developed { "" } else { ", strand not fully developed here" },
        f.c_in,
        kipft(mn_aci),
        fps_aci / 1000.0
    ));
    Some(CheckResult::new(&INFO, kipft(w.mu_lbin), kipft(w.phi_mn_lbin), Some(w.x_in), note))
}

//! Flexural strength where the moment hogs, over a support with an
//! overhang: φMn ≥ |Mu| with the soffit in compression and the top strands
//! and any mild top bars in tension.
//!
//! Clauses: ACI 318-19 §22.2 and §22.3 (strain compatibility, as for the
//! sagging moment, on the section turned upside down: the topping is then
//! on the tension side and carries nothing), §25.4.8.3 (the strand stress
//! is limited by development from where its bond begins: at the tip of a
//! short overhang the top strands are far from developed at the support),
//! §21.2.2 and §21.2.3 (φ); ASCE 7-16 §2.3.1. Mild top bars (`top_bars`,
//! Grade 60) are taken with their centroid 2 in below the top and fully
//! developed (common practice, no source: they are detailed to be). A
//! member with no strand or bar in its top half has no reinforcement on
//! the tension side and is given no hogging strength: the couple its
//! bottom strands make against the soffit is not counted.
//! Where the strands and bars given fall short, the note estimates the
//! Grade 60 top bars needed, As ≈ (|Mu|/φ − Mn)/(fy · 0.9 d), φ 0.9.
//!
//! Where the worst point lies: the hogging moment is a station's own (the
//! supports are stations, both sides); the strength jumps where a draped
//! strand crosses mid-depth (it leaves the tension side, and its reduced φ
//! with it), so both sides of each crossing are points too; between them the ratio is
//! bounded by the larger moment over the smaller strength at the segment's
//! ends and searched by successive parabolas where the bound exceeds the
//! worst station, as for the sagging moment.

use super::{Analysis, CheckInfo, CheckResult, Group, Reads, kipft};
use crate::member::Member;
use crate::prestress::{developed_stress, development_length};
use crate::strength::{Concrete, Flexure, Steel, SteelLayer, phi_flexure, strain_compatibility};

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "flexure_hogging",
    title: "Flexural strength where the moment hogs (overhang)",
    clause: "ACI 318-19 22.2, 22.3, 21.2.2, 21.2.3, 25.4.8.3; ASCE 7-16 2.3.1",
    unit: "kip-ft",
    group: Group::Strength,
    reads: Reads::Demand,
    load_driven: true,
};

/// Yield strength of mild top bars, psi (Grade 60).
pub const BAR_FY_PSI: f64 = 60_000.0;
/// Depth of the top bars' centroid below the top, in (common practice, no source).
pub const BAR_DEPTH_IN: f64 = 2.0;

/// Steel in tension under a hogging moment at `x`, depths measured up
/// from the soffit (the compression face); `full` caps each strand by its
/// development (None: uncapped, for the stresses that set ℓd).
fn steel<'m>(m: &'m Member, x: f64, full: Option<&[f64]>) -> Vec<SteelLayer<'m>> {
    let d = m.end_distance(x);
    let pre = m.effective_at(x);
    let b = m.props_at(x).0;
    let e = b.yb_in - pre.y;
    let fse = m.history.fse_psi;
    let mut out: Vec<SteelLayer<'m>> = m
        .layers
        .iter()
        .enumerate()
        .map(|(i, layer)| {
            let yi = m.layer_y(layer, d);
            let eps2 = (pre.pe / b.area_in2 + pre.pe * e * (b.yb_in - yi) / b.ix_in4) / m.ec;
            let cap = match full {
                None => m.strand.fpu.get(),
                Some(f) => {
                    let ld = development_length(fse, f[i], m.db(), layer.debond > 0.0);
                    developed_stress(m.bonded(layer, x), fse, f[i], m.ltr, ld)
                }
            };
            SteelLayer {
                area: layer.area,
                depth: yi,
                steel: Steel::Strand {
                    kind: m.strand,
                    prestrain: fse / m.strand.eps.get() + eps2,
                    cap,
                },
            }
        })
        .collect();
    for bar in &m.pattern.bars {
        out.push(SteelLayer {
            area: bar.count as f64 * bar.area.get(),
            depth: bar.height.get(),
            steel: Steel::Bar {
                fy: bar.fy.get(),
                es: 29_000_000.0,
            },
        });
    }
    let top = m.case.top_bars.get();
    if top > 0.0 {
        out.push(SteelLayer {
            area: top,
            depth: m.h_total - BAR_DEPTH_IN,
            steel: Steel::Bar {
                fy: BAR_FY_PSI,
                es: 29_000_000.0,
            },
        });
    }
    out
}

/// The hogging strength at a point.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct AtPoint {
    /// Distance from the left bearing centre, in.
    pub x_in: f64,
    /// The most hogging factored moment there (magnitude), lbf·in.
    pub mu_lbin: f64,
    /// Nominal strength (≤ 0 when nothing resists), lbf·in.
    pub mn_lbin: f64,
    /// φ used.
    pub phi: f64,
    /// Design strength (≥ 0), lbf·in.
    pub phi_mn_lbin: f64,
}

/// What finds the hogging strength along one member.
struct Hog<'m> {
    m: &'m Member<'m>,
    flipped: crate::section::Geometry,
    /// The section an opening leaves, upside down.
    flipped_net: Option<crate::section::Geometry>,
    full: Vec<f64>,
    /// Whether any strand or bar lies in the top half, the tension side:
    /// without it the top is unreinforced and the strength is taken as nil
    /// (the couple of bottom strands against the soffit is no reinforcement).
    top_steel: bool,
}

impl<'m> Hog<'m> {
    fn new(m: &'m Member<'m>) -> Hog<'m> {
        let flipped = m.section.geometry.flipped();
        let half = m.bare.depth_in / 2.0;
        let top_steel = m.case.top_bars.get() > 0.0
            || m.layers.iter().any(|l| l.y_mid.min(l.y_end) > half)
            || m.pattern.bars.iter().any(|b| b.height.get() > half);
        let mut h = Hog {
            m,
            flipped,
            flipped_net: m.net_geometry.as_ref().map(|g| g.flipped()),
            full: Vec::new(),
            top_steel,
        };
        let mid = 0.5 * (m.ends.0 + m.ends.1);
        let f = h.solve(mid, None);
        h.full = f.stresses.iter().copied().take(m.layers.len()).collect();
        h
    }

    fn solve(&self, x: f64, full: Option<&[f64]>) -> Flexure {
        let m = self.m;
        let over = m.cut.is_some_and(|c| x >= c.along.0 && x <= c.along.1);
        let conc = match (&self.flipped_net, over) {
            // the net section's outline is bridged: no band shortcut on it
            (Some(g), true) => Concrete {
                geometry: g,
                fc: m.mix.fc.get(),
                topping: None,
                beta1: m.mix.beta1(),
                top_band: (0.0, 0.0),
            },
            _ => Concrete {
                geometry: &self.flipped,
                fc: m.mix.fc.get(),
                topping: None,
                beta1: m.mix.beta1(),
                top_band: self.flipped.top_band(),
            },
        };
        strain_compatibility(&conc, &steel(m, x, full))
    }

    /// φ where strand of the tension side (the top half) is not developed
    /// (Table 21.2.3, from memory, medium): 0.75 to ℓtr, rising to 0.90 at
    /// ℓd. Strand in the bottom half is not the hogging reinforcement.
    fn phi_dev(&self, x: f64) -> f64 {
        let m = self.m;
        let d = m.end_distance(x);
        let half = m.bare.depth_in / 2.0;
        let mut phi: f64 = 0.90;
        for (i, layer) in m.layers.iter().enumerate() {
            if m.layer_y(layer, d) <= half {
                continue;
            }
            let at = m.bonded(layer, x);
            let ld = development_length(m.history.fse_psi, self.full[i], m.db(), layer.debond > 0.0);
            let p = if at <= m.ltr {
                0.75
            } else if at < ld {
                0.75 + 0.15 * (at - m.ltr) / (ld - m.ltr)
            } else {
                0.90
            };
            phi = phi.min(p);
        }
        phi
    }

    fn at(&self, x: f64, mu: f64) -> AtPoint {
        if !self.top_steel {
            return AtPoint {
                x_in: x,
                mu_lbin: mu,
                mn_lbin: 0.0,
                phi: 0.0,
                phi_mn_lbin: 0.0,
            };
        }
        let f = self.solve(x, Some(&self.full));
        let phi = phi_flexure(f.eps_t).min(self.phi_dev(x));
        AtPoint {
            x_in: x,
            mu_lbin: mu,
            mn_lbin: f.mn,
            phi,
            phi_mn_lbin: (phi * f.mn).max(0.0),
        }
    }
}

fn ratio(p: &AtPoint) -> f64 {
    if p.phi_mn_lbin > 0.0 {
        (p.mu_lbin / p.phi_mn_lbin).min(super::RATIO_NONE)
    } else if p.mu_lbin > 0.0 {
        super::RATIO_NONE
    } else {
        0.0
    }
}

/// Which of two points is worse: the higher Mu/φMn uncapped (a point with
/// no strength is infinitely bad), then the larger moment.
fn order(a: &AtPoint, b: &AtPoint) -> std::cmp::Ordering {
    let raw = |p: &AtPoint| {
        if p.phi_mn_lbin > 0.0 {
            p.mu_lbin / p.phi_mn_lbin
        } else if p.mu_lbin > 0.0 {
            f64::INFINITY
        } else {
            0.0
        }
    };
    raw(a).total_cmp(&raw(b)).then(a.mu_lbin.total_cmp(&b.mu_lbin))
}

/// The worst point where the moment hogs, if it hogs anywhere.
pub fn worst(an: &Analysis) -> Option<AtPoint> {
    let m = &an.member;
    if !m.overhangs() {
        return None;
    }
    let hog = Hog::new(m);
    let most = |x: f64| {
        let e = m.effects(x);
        -crate::case::COMBINATIONS.iter().map(|c| c.apply(&e).0).fold(0.0, f64::min)
    };
    let mut pts: Vec<AtPoint> = an
        .stations
        .iter()
        .filter(|s| s.mu_neg_lbin < 0.0)
        .map(|s| hog.at(s.x_in, -s.mu_neg_lbin))
        .collect();
    // the development lengths of the hogging strand stresses end at points
    // of their own (the station set holds those of the sagging ones)
    let (lo, hi) = m.range();
    for (i, layer) in m.layers.iter().enumerate() {
        let ld = development_length(m.history.fse_psi, hog.full[i], m.db(), layer.debond > 0.0);
        let mut origins = vec![(m.ends.0 + layer.debond, 1.0), (m.ends.1 - layer.debond, -1.0)];
        if let Some((o1, o2)) = layer.cut {
            origins.extend([(o2, 1.0), (o1, -1.0)]);
        }
        for (o, dir) in origins {
            let x = o + dir * ld;
            let mu = most(x);
            if x > lo && x < hi && mu > 0.0 {
                pts.push(hog.at(x, mu));
            }
        }
    }
    // a draped strand crossing mid-depth leaves the tension side, and the
    // reduced φ of its development with it ([`Hog::phi_dev`]): the strength
    // jumps there, so the worst point can lie just on the near side
    if let Some(hd) = m.hold_down {
        let half = m.bare.depth_in / 2.0;
        for layer in &m.layers {
            let (ye, ym) = (layer.y_end, layer.y_mid);
            if (ye - half) * (ym - half) >= 0.0 {
                continue;
            }
            let d = (half - ye) / (ym - ye) * hd;
            for c in [m.ends.0 + d, m.ends.1 - d] {
                for x in [c - super::JUMP_IN, c + super::JUMP_IN] {
                    let mu = most(x);
                    if x > lo && x < hi && mu > 0.0 {
                        pts.push(hog.at(x, mu));
                    }
                }
            }
        }
    }
    pts.sort_by(|a, b| a.x_in.total_cmp(&b.x_in));
    // with no hogging strength at all the ratio is the same everywhere: the
    // largest moment is then the worst, the one reported and the one the
    // estimate of top bars must carry
    let mut best = *pts.iter().max_by(|a, b| order(a, b))?;
    for w in pts.windows(2) {
        let (a, b) = (w[0], w[1]);
        let cap = a.phi_mn_lbin.min(b.phi_mn_lbin);
        if b.x_in - a.x_in < 1e-6 || cap <= 0.0 || a.mu_lbin.max(b.mu_lbin) / cap <= ratio(&best) * (1.0 + 1e-12) {
            continue;
        }
        let (x, _) = super::refine_max(|x| ratio(&hog.at(x, most(x))), a.x_in, ratio(&a), b.x_in, ratio(&b));
        let p = hog.at(x, most(x));
        if order(&p, &best).is_gt() {
            best = p;
        }
    }
    Some(best)
}

/// Run the check (members with an overhang only).
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let w = worst(an)?;
    let m = &an.member;
    let note = if an.brief {
        String::new()
    } else {
        let top = m.case.top_bars.get();
        let bars = if top > 0.0 {
            format!("; top bars {top:.2} in² Grade 60 at {BAR_DEPTH_IN} in below the top counted")
        } else {
            String::new()
        };
        let short = if ratio(&w) > 1.0 {
            let d = m.h_total - BAR_DEPTH_IN;
            let need = (w.mu_lbin / 0.9 - w.mn_lbin.max(0.0)) / (BAR_FY_PSI * 0.9 * d);
            format!(
                "; needs mild top reinforcement: about {:.2} in² more of Grade 60 bars {BAR_DEPTH_IN} in below the top (give it as top_bars)",
                need.max(0.0)
            )
        } else {
            String::new()
        };
        if w.phi == 0.0 {
            format!("no strand or bar in the top half: the top is unreinforced where the moment hogs{short}")
        } else {
            let half = m.bare.depth_in / 2.0;
            let top_strand = m.layers.iter().any(|l| l.y_mid.min(l.y_end) > half);
            let tension = match (top_strand, m.pattern.bars.is_empty()) {
                (true, true) => "the top strands in tension; strand stress limited by development from the member end (§25.4.8.3)",
                (true, false) => {
                    "the top strands and the pattern's bars in tension; strand stress limited by development from the member end (§25.4.8.3)"
                }
                (false, true) => "the top bars in tension, the strands (all in the bottom half) by strain compatibility",
                (false, false) => {
                    "the pattern's bars and the top bars in tension, the strands (all in the bottom half) by strain compatibility"
                }
            };
            format!("the soffit in compression, {tension}; φ = {:.2}{bars}{short}", w.phi)
        }
    };
    Some(CheckResult::new(&INFO, kipft(w.mu_lbin), kipft(w.phi_mn_lbin), Some(w.x_in), note))
}

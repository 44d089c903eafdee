//! The analysis model of one candidate under one design case: sections,
//! strand layers along the member, loads, and the prestress history.
//!
//! Built once per evaluation; every check reads it. Internal units (in, lbf, psi).

use serde::Serialize;

use crate::case::{DesignCase, Effects, LossMethod};
use crate::catalog::{Pattern, Section};
use crate::loads::{Arrangement, Cut, Loads, Unit};
use crate::material::{Aggregate, Mix, StrandKind};
use crate::prestress::{Losses, ZiaInput, transfer_length, transfer_length_shear, zia};
use crate::section::Composite;
use crate::section::Properties;

/// One row of strands as the analysis sees it (a row an opening cuts is
/// split in two: the strands it cuts and the rest).
#[derive(Debug, Clone, PartialEq)]
pub struct Layer {
    /// Strand area of the row, in².
    pub area: f64,
    /// Height at the hold-downs (or everywhere when straight), in.
    pub y_mid: f64,
    /// Height at the member ends, in.
    pub y_end: f64,
    /// Debonded length at each end, in (0 when fully bonded).
    pub debond: f64,
    /// Horizontal positions, in.
    pub x: Vec<f64>,
    /// Where an opening cuts these strands, along the span (in from the
    /// left support): they carry nothing there and bond again from its edges.
    pub cut: Option<(f64, f64)>,
}

/// The prestress history, psi.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct History {
    /// Jacking stress.
    pub fpj_psi: f64,
    /// Stress just after transfer (jacking less elastic shortening).
    pub fpo_psi: f64,
    /// Effective stress after all losses.
    pub fse_psi: f64,
    /// Jacking force, lbf.
    pub pj_lbf: f64,
    /// Force after transfer, lbf.
    pub po_lbf: f64,
    /// Effective force, lbf.
    pub pe_lbf: f64,
    /// Loss components (Zia et al. 1979, or ES with a lump sum).
    pub losses: Losses,
    /// Whether the total came from a user-given lump sum.
    pub lump_sum: bool,
}

/// The effective prestress force at a station and the height it acts at.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Effective {
    /// Force transferred over ℓtr (stresses, flexure), lbf.
    pub pe: f64,
    /// Its height, in.
    pub y: f64,
    /// Force transferred over 50 db (shear, ACI 318-19 §22.5.7), lbf.
    pub pe_shear: f64,
    /// Its height, in.
    pub y_shear: f64,
}

/// The member model.
#[derive(Debug, Clone)]
pub struct Member<'a> {
    /// The section.
    pub section: &'a Section,
    /// The strand pattern.
    pub pattern: &'a Pattern,
    /// Precast concrete.
    pub mix: &'a Mix,
    /// The design case.
    pub case: &'a DesignCase,
    /// Bare precast properties.
    pub bare: &'a Properties,
    /// Composite properties when topped.
    pub comp: Option<Composite>,
    /// Span, in.
    pub l: f64,
    /// Member length, in.
    pub lm: f64,
    /// Overall depth with topping, in.
    pub h_total: f64,
    /// Strand layers.
    pub layers: Vec<Layer>,
    /// Strand kind.
    pub strand: &'a StrandKind,
    /// Total strand area, in².
    pub aps: f64,
    /// Uniform loads along the member, lbf/in: self, topping, sdl, live, roof.
    pub w: [f64; 5],
    /// Every load on the member, by group.
    pub loads: Loads,
    /// Which arrangement of the variable loads this model carries.
    pub arrangement: Arrangement,
    /// The cut of an opening through this unit, if any.
    pub cut: Option<Cut>,
    /// Where the cut is: its section, its properties (bare, composite), if any.
    pub net: Option<(Properties, Option<Composite>)>,
    /// The section the cut leaves ([`crate::section::Geometry::net`]).
    pub net_geometry: Option<crate::section::Geometry>,
    /// The member ends, in from the left support (left, right).
    pub ends: (f64, f64),
    /// Prestress history.
    pub history: History,
    /// Transfer length for stresses and flexure, (fse/3000)·db, in.
    pub ltr: f64,
    /// Transfer length for shear, 50 db, in.
    pub ltr_shear: f64,
    /// Hold-down distance from each member end, in (when depressed).
    pub hold_down: Option<f64>,
    /// Ec of the precast concrete, psi (found once: it takes a power).
    pub ec: f64,
    /// Eci of the precast concrete at release, psi.
    pub eci: f64,
}

impl<'a> Member<'a> {
    /// The loaded unit under the first arrangement of its variable loads
    /// (the only one without overhangs or placed roof loads).
    pub fn new(section: &'a Section, pattern: &'a Pattern, mix: &'a Mix, case: &'a DesignCase) -> Member<'a> {
        let arr = crate::loads::arrangements(case).first().copied().unwrap_or(Arrangement::PLAIN);
        Member::build(section, pattern, mix, case, &Unit::loaded(), arr)
    }

    /// Build the model of `unit` under arrangement `arr`.
    pub fn build(
        section: &'a Section,
        pattern: &'a Pattern,
        mix: &'a Mix,
        case: &'a DesignCase,
        unit: &Unit,
        arr: Arrangement,
    ) -> Member<'a> {
        let bare = &section.props;
        let b = bare.width_in;
        let l = case.span.get();
        let lm = case.member_length();
        let comp = case.topping.as_ref().map(|t| {
            let n = t.mix.ec().get() / mix.ec().get();
            Composite::new(bare, t.thickness.get(), b, n)
        });
        let h_total = comp.map_or(bare.depth_in, |c| c.depth_in);
        let area = pattern.strand.area.get();
        let cut = unit.cut;
        let mut layers: Vec<Layer> = Vec::with_capacity(pattern.rows.len() + 1);
        for r in &pattern.rows {
            let layer = |x: Vec<f64>, cut: Option<(f64, f64)>| Layer {
                area: x.len() as f64 * area,
                y_mid: r.height.get(),
                y_end: r.end_height.unwrap_or(r.height).get(),
                debond: r.debond.map_or(0.0, |d| d.get()),
                x,
                cut,
            };
            let (cut_x, kept): (Vec<f64>, Vec<f64>) = match cut {
                Some(c) => r.x.iter().partition(|&&x| x >= c.across.0 && x <= c.across.1),
                None => (Vec::new(), r.x.clone()),
            };
            if !kept.is_empty() {
                layers.push(layer(kept, None));
            }
            if let (false, Some(c)) = (cut_x.is_empty(), cut) {
                layers.push(layer(cut_x, Some(c.along)));
            }
        }
        let aps: f64 = layers.iter().map(|l| l.area).sum();
        let top_w = case.topping.as_ref().map_or(0.0, |t| t.thickness.get() * t.mix.unit_weight.get());
        let net_geometry = cut.map(|c| section.geometry.net(c.across.0, c.across.1));
        let loads = Loads::new(case, section, mix.unit_weight.get(), top_w, unit, arr);
        let net = cut.zip(net_geometry.as_ref()).map(|(c, g)| {
            let p = section.geometry.net_properties(g, bare, c.across.0, c.across.1);
            let cc = case.topping.as_ref().map(|t| {
                let n = t.mix.ec().get() / mix.ec().get();
                Composite::new(&p, t.thickness.get(), p.width_in, n)
            });
            (p, cc)
        });
        let mut m = Member {
            section,
            pattern,
            mix,
            case,
            bare,
            comp,
            l,
            lm,
            h_total,
            layers,
            strand: &pattern.strand,
            aps,
            w: loads.w,
            loads,
            arrangement: arr,
            cut,
            net,
            net_geometry,
            ends: case.ends(),
            history: History {
                fpj_psi: 0.0,
                fpo_psi: 0.0,
                fse_psi: 0.0,
                pj_lbf: 0.0,
                po_lbf: 0.0,
                pe_lbf: 0.0,
                losses: zero_losses(),
                lump_sum: false,
            },
            ltr: 0.0,
            ltr_shear: transfer_length_shear(pattern.strand.diameter.get()),
            hold_down: pattern.hold_down.map(|f| f * lm),
            ec: mix.ec().get(),
            eci: mix.eci().get(),
        };
        m.history = m.prestress();
        m.ltr = transfer_length(m.history.fse_psi, pattern.strand.diameter.get());
        m
    }

    /// Strand diameter, in.
    pub fn db(&self) -> f64 {
        self.strand.diameter.get()
    }

    /// Height of a layer at distance `d` from the nearer member end, in.
    pub fn layer_y(&self, layer: &Layer, d: f64) -> f64 {
        match self.hold_down {
            Some(hd) if d < hd => layer.y_end + (layer.y_mid - layer.y_end) * d.max(0.0) / hd,
            _ => layer.y_mid,
        }
    }

    /// Distance from the nearer member end of a station x, in.
    pub fn end_distance(&self, x: f64) -> f64 {
        (x - self.ends.0).min(self.ends.1 - x)
    }

    /// Whether the member has an overhang beyond either support.
    pub fn overhangs(&self) -> bool {
        self.case.has_overhang()
    }

    /// How far a layer's strands are bonded on the near side of `x`: from
    /// the nearer member end less the debonded length, or from the edge of
    /// the opening that cuts them, where they start again as from an end
    /// (ACI 318-19 §25.4.8); 0 inside the opening, in.
    pub fn bonded(&self, layer: &Layer, x: f64) -> f64 {
        let d = self.end_distance(x) - layer.debond;
        match layer.cut {
            None => d,
            Some((o1, _)) if x <= o1 => d.min(o1 - x),
            Some((_, o2)) if x >= o2 => d.min(x - o2),
            Some(_) => 0.0,
        }
    }

    /// The section's properties at `x`: bare and composite, the net ones
    /// where an opening cuts the unit.
    pub fn props_at(&self, x: f64) -> (&Properties, Option<&Composite>) {
        match (&self.net, self.cut) {
            (Some((p, c)), Some(cut)) if x >= cut.along.0 && x <= cut.along.1 => (p, c.as_ref()),
            _ => (self.bare, self.comp.as_ref()),
        }
    }

    /// The web width for shear at `x`: less the webs an opening cuts over
    /// the opening and h/2 beyond it, in.
    pub fn bw_at(&self, x: f64) -> f64 {
        match (&self.net, self.cut) {
            (Some((p, _)), Some(cut)) if x >= cut.along.0 - self.h_total / 2.0 && x <= cut.along.1 + self.h_total / 2.0 => {
                p.web_width_min_in
            }
            _ => self.bare.web_width_min_in,
        }
    }

    /// Prestress force (lbf) and its centroid height (in) at `x`, for
    /// strand stress `f` built up linearly over `ltr` from where each
    /// layer's bond begins.
    pub fn force_at(&self, x: f64, f: f64, ltr: f64) -> (f64, f64) {
        let d = self.end_distance(x);
        let (mut p, mut py) = (0.0, 0.0);
        for layer in &self.layers {
            let frac = (self.bonded(layer, x) / ltr).clamp(0.0, 1.0);
            let pl = layer.area * f * frac;
            p += pl;
            py += pl * self.layer_y(layer, d);
        }
        if p > 0.0 { (p, py / p) } else { (0.0, self.pattern.centroid()) }
    }

    /// The effective prestress at `x`, for stresses and flexure (over ℓtr)
    /// and for shear (over 50 db): what every station reads, found once.
    pub fn effective_at(&self, x: f64) -> Effective {
        let (pe, y) = self.force_at(x, self.history.fse_psi, self.ltr);
        let (pe_shear, y_shear) = self.force_at(x, self.history.fse_psi, self.ltr_shear);
        Effective { pe, y, pe_shear, y_shear }
    }

    /// Vertical component of the effective prestress at `x` (draped layers), lbf.
    pub fn vp_at(&self, x: f64) -> f64 {
        let Some(hd) = self.hold_down else { return 0.0 };
        let d = self.end_distance(x);
        if d >= hd {
            return 0.0;
        }
        self.layers
            .iter()
            .map(|layer| {
                let frac = (self.bonded(layer, x) / self.ltr_shear).clamp(0.0, 1.0);
                let slope = (layer.y_end - layer.y_mid) / hd;
                layer.area * self.history.fse_psi * frac * slope.abs() / (1.0 + slope * slope).sqrt()
            })
            .sum()
    }

    /// Unfactored effects at x. At either end of the stretch checked — a
    /// free tip, or a support with no overhang beyond it — the moment is
    /// nil, and is returned as exactly nil rather than a rounding away.
    pub fn effects(&self, x: f64) -> Effects {
        let [(ms, vs), (mt, vt), (md, vd), (ml, vl), (mr, vr)] = std::array::from_fn(|g| self.loads.at(g, x));
        let (lo, hi) = self.range();
        if x <= lo + 1e-9 || x >= hi - 1e-9 {
            return Effects {
                v_self: vs,
                v_topping: vt,
                v_sdl: vd,
                v_live: vl,
                v_roof: vr,
                ..Effects::default()
            };
        }
        Effects {
            m_self: ms,
            m_topping: mt,
            m_sdl: md,
            m_live: ml,
            m_roof: mr,
            v_self: vs,
            v_topping: vt,
            v_sdl: vd,
            v_live: vl,
            v_roof: vr,
        }
    }

    /// The factors (D, L, Lr or S) of every combination whose moment a
    /// check reads: ASCE 7-16 §2.3.1 combinations 1–3 and the service
    /// combinations of §2.4.1 (sustained D + ψL; D + L, D + (Lr or S),
    /// D + 0.75L + 0.75(Lr or S); D alone).
    pub fn combinations(&self) -> Vec<(f64, f64, f64)> {
        let psi = self.case.sustained_live;
        let mut combos: Vec<(f64, f64, f64)> = crate::case::COMBINATIONS.iter().map(|c| (c.d, c.l, c.r)).collect();
        combos.extend([
            (1.0, psi, 0.0),
            (1.0, 1.0, 0.0),
            (1.0, 0.0, 1.0),
            (1.0, 0.75, 0.75),
            (1.0, 0.0, 0.0),
        ]);
        combos
    }

    /// Where the shear of each combination ([`Member::combinations`])
    /// passes through zero inside a stretch between two load breaks (the
    /// moment extrema there), and, with overhangs, where its moment does
    /// (where the moment changes sign), in from the left support. Between
    /// breaks the shear is linear and the moment quadratic in x; a zero of
    /// the shear at a point load's jump is that load's own station.
    pub fn turning_points(&self) -> Vec<f64> {
        let breaks = self.loads.breaks();
        let (lo, hi) = self.range();
        let mut cuts: Vec<f64> = breaks.iter().map(|b| b.0).filter(|&x| x > lo && x < hi).collect();
        cuts.insert(0, lo);
        cuts.push(hi);
        let combos = self.combinations();
        let hog = self.overhangs();
        let mut out = Vec::new();
        for w in cuts.windows(2) {
            let (a, b) = (w[0], w[1]);
            if b - a < 1e-9 {
                continue;
            }
            // each group's moment at the quarter points and the middle
            let xs = [a + 0.25 * (b - a), a + 0.5 * (b - a), a + 0.75 * (b - a)];
            let e = xs.map(|x| self.effects(x));
            for &(kd, kl, kr) in &combos {
                let mv = |e: &Effects| {
                    (
                        kd * e.m_dead() + kl * e.m_live + kr * e.m_roof,
                        kd * e.v_dead() + kl * e.v_live + kr * e.v_roof,
                    )
                };
                let [(m0, v0), (m1, _), (m2, v2)] = e.each_ref().map(mv);
                // shear: linear, through the quarter points
                let (va, vb) = (1.5 * v0 - 0.5 * v2, 1.5 * v2 - 0.5 * v0);
                if (va > 0.0 && vb < 0.0) || (va < 0.0 && vb > 0.0) {
                    out.push(a + (b - a) * va / (va - vb));
                }
                if hog {
                    // moment: the parabola through the three points, t in [0, 1]
                    let (c2, c1, c0) = quadratic(m0, m1, m2);
                    for t in roots(c2, c1, c0) {
                        if t > 1e-9 && t < 1.0 - 1e-9 {
                            out.push(a + t * (b - a));
                        }
                    }
                }
            }
        }
        out
    }

    /// The stretch of the member the checks cover, in from the left
    /// support: between the bearing centres, and out to the tip of each overhang.
    pub fn range(&self) -> (f64, f64) {
        let (a1, a2) = (self.case.overhang.0.get(), self.case.overhang.1.get());
        (if a1 > 0.0 { -a1 } else { 0.0 }, if a2 > 0.0 { self.l + a2 } else { self.l })
    }

    /// Self-weight moment at release at `x`: the member rests on the bed at
    /// its ends, over its full length (lbf·in).
    pub fn release_moment(&self, x: f64) -> f64 {
        self.loads.release_moment(x)
    }

    fn prestress(&self) -> History {
        let fpu = self.strand.fpu.get();
        let fpj = self.pattern.jacking * fpu;
        // critical section for fcir: midspan (Zia et al. 1979 use the section
        // of maximum moment)
        let mid = self.l / 2.0;
        let e = self.bare.yb_in - self.pattern.centroid();
        let eff = self.effects(mid);
        let fcds = eff.m_topping * e / self.bare.ix_in4
            + self.comp.map_or(eff.m_sdl * e / self.bare.ix_in4, |c| {
                eff.m_sdl * (c.yb_in - self.pattern.centroid()) / c.ix_in4
            });
        let input = ZiaInput {
            fpj,
            fpu,
            aps: self.aps,
            area: self.bare.area_in2,
            inertia: self.bare.ix_in4,
            e,
            mg: eff.m_self,
            fcds,
            es: self.strand.eps.get(),
            eci: self.eci,
            ec: self.ec,
            vs: self.bare.vs_ratio_in,
            rh: self.case.humidity,
            lightweight: matches!(self.mix.aggregate, Aggregate::SandLightweight | Aggregate::Lightweight),
            relaxation: self.strand.relaxation,
        };
        let mut losses = zia(&input);
        let lump = matches!(self.case.losses, LossMethod::LumpSum(_));
        if let LossMethod::LumpSum(total) = self.case.losses {
            losses = Losses {
                cr_psi: 0.0,
                sh_psi: 0.0,
                re_psi: 0.0,
                total_psi: total.get().max(losses.es_psi),
                ..losses
            };
        }
        let fpo = fpj - losses.es_psi;
        let fse = fpj - losses.total_psi;
        History {
            fpj_psi: fpj,
            fpo_psi: fpo,
            fse_psi: fse,
            pj_lbf: fpj * self.aps,
            po_lbf: fpo * self.aps,
            pe_lbf: fse * self.aps,
            losses,
            lump_sum: lump,
        }
    }
}

fn zero_losses() -> Losses {
    Losses {
        fcir_psi: 0.0,
        fcds_psi: 0.0,
        es_psi: 0.0,
        cr_psi: 0.0,
        sh_psi: 0.0,
        re_psi: 0.0,
        total_psi: 0.0,
        c_factor: 1.0,
        c_clamped: false,
        terms: Default::default(),
    }
}

/// The parabola c2 t² + c1 t + c0 through (0.25, m0), (0.5, m1), (0.75, m2),
/// as (c2, c1, c0).
fn quadratic(m0: f64, m1: f64, m2: f64) -> (f64, f64, f64) {
    // second difference over a step of 0.25
    let c2 = (m0 - 2.0 * m1 + m2) / (2.0 * 0.0625);
    let slope = (m2 - m0) / 0.5;
    let c1 = slope - 2.0 * c2 * 0.5;
    let c0 = m1 - c2 * 0.25 - c1 * 0.5;
    (c2, c1, c0)
}

/// Real roots of c2 t² + c1 t + c0.
fn roots(c2: f64, c1: f64, c0: f64) -> Vec<f64> {
    let scale = c2.abs().max(c1.abs()).max(c0.abs());
    if scale == 0.0 {
        return Vec::new();
    }
    if c2.abs() < 1e-12 * scale {
        return if c1.abs() > 1e-12 * scale { vec![-c0 / c1] } else { Vec::new() };
    }
    let disc = c1 * c1 - 4.0 * c2 * c0;
    if disc < 0.0 {
        return Vec::new();
    }
    let q = -0.5 * (c1 + c1.signum() * disc.sqrt());
    let mut r = vec![q / c2];
    if q != 0.0 {
        r.push(c0 / q);
    }
    r
}

//! The analysis model of one candidate under one design case: sections,
//! strand layers along the member, loads, and the prestress history.
//!
//! Built once per evaluation; every check reads it. Internal units (in, lbf, psi).

use serde::Serialize;

use crate::case::{DesignCase, Effects, LoadKind, LossMethod, point, uniform};
use crate::catalog::{Pattern, Section};
use crate::material::{Aggregate, Mix, StrandKind};
use crate::prestress::{Losses, ZiaInput, transfer_length, transfer_length_shear, zia};
use crate::section::{Composite, Properties};

/// One row of strands as the analysis sees it.
#[derive(Debug, Clone, PartialEq)]
pub struct Layer<'a> {
    /// Strand area of the row, in².
    pub area: f64,
    /// Height at the hold-downs (or everywhere when straight), in.
    pub y_mid: f64,
    /// Height at the member ends, in.
    pub y_end: f64,
    /// Debonded length at each end, in (0 when fully bonded).
    pub debond: f64,
    /// Horizontal positions, in (the catalog's own list).
    pub x: &'a [f64],
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
    pub layers: Vec<Layer<'a>>,
    /// Strand kind.
    pub strand: &'a StrandKind,
    /// Total strand area, in².
    pub aps: f64,
    /// Uniform loads along the member, lbf/in: self, topping, sdl, live, roof.
    pub w: [f64; 5],
    /// Point loads (lbf, position in, dead or live).
    pub points: Vec<(f64, f64, LoadKind)>,
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
    /// Build the model.
    pub fn new(section: &'a Section, pattern: &'a Pattern, mix: &'a Mix, case: &'a DesignCase) -> Member<'a> {
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
        let layers: Vec<Layer<'a>> = pattern
            .rows
            .iter()
            .map(|r| Layer {
                area: r.count as f64 * area,
                y_mid: r.height.get(),
                y_end: r.end_height.unwrap_or(r.height).get(),
                debond: r.debond.map_or(0.0, |d| d.get()),
                x: &r.x,
            })
            .collect();
        let aps: f64 = layers.iter().map(|l| l.area).sum();
        let w_top = case
            .topping
            .as_ref()
            .map_or(0.0, |t| t.thickness.get() * b * t.mix.unit_weight.get());
        let w = [
            section.weight_per_length(mix),
            w_top,
            case.sdl.get() * b,
            case.live.get() * b,
            case.roof_load() * b,
        ];
        let points = case.line_loads.iter().map(|p| (p.w.get() * b, p.at.get(), p.kind)).collect();
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
            w,
            points,
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

    /// Distance from the nearer member end of a span station x, in.
    pub fn end_distance(&self, x: f64) -> f64 {
        let half = (self.lm - self.l) / 2.0;
        (x + half).min(self.l - x + half)
    }

    /// Prestress force (lbf) and its centroid height (in) at distance `d`
    /// from the nearer end, for strand stress `f` built up linearly over
    /// `ltr` from where each layer's bond begins.
    pub fn force_at(&self, d: f64, f: f64, ltr: f64) -> (f64, f64) {
        let (mut p, mut py) = (0.0, 0.0);
        for layer in &self.layers {
            let frac = ((d - layer.debond) / ltr).clamp(0.0, 1.0);
            let pl = layer.area * f * frac;
            p += pl;
            py += pl * self.layer_y(layer, d);
        }
        if p > 0.0 { (p, py / p) } else { (0.0, self.pattern.centroid()) }
    }

    /// The effective prestress at `d`, for stresses and flexure (over ℓtr)
    /// and for shear (over 50 db): what every station reads, found once.
    pub fn effective_at(&self, d: f64) -> Effective {
        let (pe, y) = self.force_at(d, self.history.fse_psi, self.ltr);
        let (pe_shear, y_shear) = self.force_at(d, self.history.fse_psi, self.ltr_shear);
        Effective { pe, y, pe_shear, y_shear }
    }

    /// Vertical component of the effective prestress at `d` (draped layers), lbf.
    pub fn vp_at(&self, d: f64) -> f64 {
        let Some(hd) = self.hold_down else { return 0.0 };
        if d >= hd {
            return 0.0;
        }
        self.layers
            .iter()
            .map(|layer| {
                let frac = ((d - layer.debond) / self.ltr_shear).clamp(0.0, 1.0);
                let slope = (layer.y_end - layer.y_mid) / hd;
                layer.area * self.history.fse_psi * frac * slope.abs() / (1.0 + slope * slope).sqrt()
            })
            .sum()
    }

    /// Unfactored effects at span station x.
    pub fn effects(&self, x: f64) -> Effects {
        let u = |w: f64| uniform(w, self.l, x);
        let (ms, vs) = u(self.w[0]);
        let (mt, vt) = u(self.w[1]);
        let (mut md, mut vd) = u(self.w[2]);
        let (mut ml, mut vl) = u(self.w[3]);
        let (mr, vr) = u(self.w[4]);
        for &(p, a, kind) in &self.points {
            let (m, v) = point(p, a, self.l, x);
            match kind {
                LoadKind::Dead => {
                    md += m;
                    vd += v;
                }
                LoadKind::Live => {
                    ml += m;
                    vl += v;
                }
            }
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

    /// Where the shear of each load combination that sets a moment check
    /// passes through zero, in from the left bearing centre: the maxima of
    /// the factored moments (ASCE 7-16 §2.3.1 combinations 1–3) and of the
    /// service moments (sustained D + ψL; D + L, D + (Lr or S),
    /// D + 0.75L + 0.75(Lr or S), §2.4.1). All loads act downward, so the
    /// shear of a combination falls along the span and crosses zero once;
    /// a crossing at a line load's jump is that load's own station.
    pub fn zero_shear_points(&self) -> Vec<f64> {
        let psi = self.case.sustained_live;
        let mut combos: Vec<(f64, f64, f64)> = crate::case::COMBINATIONS.iter().map(|c| (c.d, c.l, c.r)).collect();
        combos.extend([(1.0, psi, 0.0), (1.0, 1.0, 0.0), (1.0, 0.0, 1.0), (1.0, 0.75, 0.75)]);
        let mut out = Vec::with_capacity(combos.len());
        for (kd, kl, kr) in combos {
            let w = kd * (self.w[0] + self.w[1] + self.w[2]) + kl * self.w[3] + kr * self.w[4];
            let mut loads: Vec<(f64, f64)> = self
                .points
                .iter()
                .map(|&(p, a, k)| (if k == LoadKind::Dead { kd } else { kl } * p, a))
                .collect();
            loads.sort_by(|a, b| a.1.total_cmp(&b.1));
            // shear just right of the left support, then segment by segment
            let mut v = w * self.l / 2.0 + loads.iter().map(|&(p, a)| p * (self.l - a) / self.l).sum::<f64>();
            let mut from = 0.0;
            for (p, a) in loads.into_iter().chain(std::iter::once((0.0, self.l))) {
                let at_end = v - w * (a - from);
                if v > 0.0 && at_end <= 0.0 && w > 0.0 {
                    out.push(from + v / w);
                    break;
                }
                // past the load the shear drops by its weight
                v = at_end - p;
                from = a;
                if v <= 0.0 {
                    break;
                }
            }
        }
        out
    }

    /// Self-weight moment at release at distance `d` from the end: the
    /// member rests on the bed at its ends, over its full length (lbf·in).
    pub fn release_moment(&self, d: f64) -> f64 {
        uniform(self.w[0], self.lm, d).0
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
    }
}

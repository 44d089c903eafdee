//! The ACI 318-19 checks of one candidate under one design case.
//!
//! [`evaluate`] builds the member model, computes the state at every
//! station once (moments, shears, stresses, strengths), and hands it to each
//! check in the [`REGISTRY`]; every check lives in its own file under
//! `checks/`, names its clause, and returns a [`CheckResult`].
//!
//! Sign convention for stresses: **compression positive, tension negative**.

pub mod bearing_length;
pub mod bearing_stress;
pub mod cover;
pub mod deflection;
pub mod differential_camber;
pub mod fire;
pub mod flexure;
pub mod handling;
pub mod hogging;
pub mod horizontal_shear;
pub mod jacking;
pub mod min_strength;
pub mod pad_pressure;
pub mod production_length;
pub mod punching;
pub mod release;
pub mod service;
pub mod shear;
pub mod spacing;
pub mod tip;
pub mod top_tension;
pub mod uplift;
pub mod vibration;
pub mod web_steel;

use serde::Serialize;

use crate::case::{DesignCase, ServiceClass, factored};
use crate::catalog::{Pattern, Section};
use crate::loads::{Arrangement, Unit};
use crate::material::Mix;
use crate::member::{Effective, History, Member};

/// Families of checks, in the order a failure is reported (most important first).
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Group {
    /// Flexural strength.
    Strength,
    /// Shear.
    Shear,
    /// Stresses at release and service.
    Stresses,
    /// Strand sanity (jacking, spacing).
    Strand,
    /// Deflection and camber.
    Deflection,
    /// Fire resistance.
    Fire,
    /// Cover.
    Cover,
    /// Bearing length and strength.
    Bearing,
    /// Production limits.
    Production,
}

/// How a check's numbers read when it fails.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Reads {
    /// A demand against a capacity: "53.8 kip-ft against 41.0 kip-ft".
    Demand,
    /// A fibre stress against its limit, in the sign convention
    /// (compression positive, tension negative).
    Stress,
    /// Something needed against what the member has: "needs 1.25 in, has 0.75 in".
    Need,
    /// A fire rating in hours: "needs 2 h, reaches 1½ h".
    Hours,
}

/// What a check is, independent of any member: the registry entry.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct CheckInfo {
    /// Stable id (JSON, CSV).
    pub id: &'static str,
    /// Short title.
    pub title: &'static str,
    /// Governing clause(s).
    pub clause: &'static str,
    /// Unit of demand and capacity.
    pub unit: &'static str,
    /// Group, for the failure order.
    pub group: Group,
    /// How its numbers read in a failure reason.
    pub reads: Reads,
    /// Whether the check limits the load a member carries: only such a
    /// check can govern (a requirement the load cannot change — release
    /// stresses, cover, fire, strand sanity, length — passes or fails but
    /// says nothing about how much of the member is used).
    pub load_driven: bool,
}

/// Whether a check's result can change with the load on the member: the
/// checks that limit the load, and minimum strength (the load ends its
/// waiver). The rest — release stresses, handling, cover, fire, strand
/// sanity, bearing length, production length, camber at erection across
/// units — read the member, its strand and its own weight only, so the
/// envelope runs them once per span
/// (`checks_that_do_not_vary_ignore_the_varied_load` proves it).
pub fn varies_with_load(info: &CheckInfo) -> bool {
    info.load_driven || info.id == min_strength::INFO.id
}

/// The result of one check.
#[derive(Debug, Clone, PartialEq)]
pub struct CheckResult {
    /// Registry entry: id, title, clause, unit and group.
    pub info: &'static CheckInfo,
    /// Demand, in the entry's unit.
    pub demand: f64,
    /// Capacity (or limit), in the entry's unit.
    pub capacity: f64,
    /// Demand ÷ capacity.
    pub ratio: f64,
    /// Whether the check passes.
    pub pass: bool,
    /// Governing station, ft from the left bearing centre.
    pub station_ft: Option<f64>,
    /// What governed and any caveat.
    pub note: String,
    /// Unit of demand and capacity (the entry's, unless the result says
    /// otherwise: a waived minimum-strength check governed by shear is in kip).
    pub unit: &'static str,
    /// Whether this result limits the load (see [`CheckInfo::load_driven`];
    /// the minimum-strength check limits it only while it is waived).
    pub governs: bool,
}

impl Serialize for CheckResult {
    fn serialize<S: serde::Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        use serde::ser::SerializeStruct;
        let mut m = s.serialize_struct("CheckResult", 12)?;
        m.serialize_field("id", self.info.id)?;
        m.serialize_field("title", self.info.title)?;
        m.serialize_field("clause", self.info.clause)?;
        m.serialize_field("demand", &self.demand)?;
        m.serialize_field("capacity", &self.capacity)?;
        m.serialize_field("unit", self.unit)?;
        m.serialize_field("ratio", &self.ratio)?;
        m.serialize_field("pass", &self.pass)?;
        m.serialize_field("station_ft", &self.station_ft)?;
        m.serialize_field("note", &self.note)?;
        m.serialize_field("group", &self.info.group)?;
        m.serialize_field("governs", &self.governs)?;
        m.end()
    }
}

impl CheckResult {
    /// A result from the registry entry and the numbers.
    pub fn new(info: &'static CheckInfo, demand: f64, capacity: f64, station_in: Option<f64>, note: String) -> CheckResult {
        // no capacity at all reads as RATIO_NONE, so no infinity reaches an output
        let ratio = if capacity > 0.0 {
            (demand / capacity).min(RATIO_NONE)
        } else if demand > 0.0 {
            RATIO_NONE
        } else {
            0.0
        };
        CheckResult {
            info,
            demand,
            capacity,
            ratio,
            pass: ratio <= 1.0 + 1e-9,
            station_ft: station_in.map(|x| x / 12.0),
            note,
            unit: info.unit,
            governs: info.load_driven,
        }
    }

    /// A compression check in the sign convention of every output
    /// (compression positive): the fibre stress against its (positive)
    /// limit; a fibre in tension has ratio 0.
    pub fn compression(info: &'static CheckInfo, stress: f64, limit: f64, station_in: Option<f64>, note: String) -> CheckResult {
        let mut r = CheckResult::new(info, stress.max(0.0), limit, station_in, note);
        r.demand = stress;
        r
    }

    /// A tension check in the same convention (tension negative): `stress`
    /// is the fibre stress (negative in tension) and the capacity is the
    /// limit written as a stress, −`limit`; the ratio is the tension over
    /// the limit, 0 when the fibre is in compression — never negative.
    pub fn tension(info: &'static CheckInfo, stress: f64, limit: f64, station_in: Option<f64>, note: String) -> CheckResult {
        let mut r = CheckResult::new(info, (-stress).max(0.0), limit, station_in, note);
        r.demand = stress;
        r.capacity = -limit;
        r
    }
}

impl CheckResult {
    /// By how much it falls short, in words a reader of the check expects:
    /// a rating is in hours and a requirement is "needs / has", never a
    /// percentage.
    pub fn shortfall(&self) -> String {
        let u = self.unit;
        match self.info.reads {
            Reads::Hours => format!(
                "needs {} h, reaches {}",
                fire::fmt_h(self.demand),
                if self.capacity < 1.0 {
                    "less than 1 h".to_string()
                } else {
                    format!("{} h", fire::fmt_h(self.capacity))
                }
            ),
            Reads::Need => format!("needs {:.2} {u}, has {:.2} {u}", self.demand, self.capacity),
            Reads::Stress if self.capacity < 0.0 => format!(
                "tension {:.0} {u} against the {:.0} {u} allowed (ratio {:.2})",
                -self.demand, -self.capacity, self.ratio
            ),
            Reads::Stress => format!(
                "compression {:.0} {u} against the {:.0} {u} allowed (ratio {:.2})",
                self.demand, self.capacity, self.ratio
            ),
            Reads::Demand => format!("{:.2} {u} against {:.2} {u} (ratio {:.2})", self.demand, self.capacity, self.ratio),
        }
    }
}

/// The ratio reported when there is no capacity at all (kept finite for output).
pub const RATIO_NONE: f64 = 999.0;

/// A check: its registry entry and the function that runs it (None when it
/// does not apply to this member).
pub struct Check {
    /// Registry entry.
    pub info: CheckInfo,
    /// Run on an analysis.
    pub run: fn(&Analysis) -> Option<CheckResult>,
}

/// Every check, in reporting order. Ranking, help, JSON and the report
/// legend all read this list.
pub const REGISTRY: &[Check] = &[
    Check {
        info: flexure::INFO,
        run: flexure::run,
    },
    Check {
        info: hogging::INFO,
        run: hogging::run,
    },
    Check {
        info: min_strength::INFO,
        run: min_strength::run,
    },
    Check {
        info: shear::INFO,
        run: shear::run,
    },
    Check {
        info: punching::INFO,
        run: punching::run,
    },
    Check {
        info: shear::DEEP_INFO,
        run: shear::run_deep,
    },
    Check {
        info: web_steel::INFO,
        run: web_steel::run,
    },
    Check {
        info: horizontal_shear::INFO,
        run: horizontal_shear::run,
    },
    Check {
        info: release::COMPRESSION,
        run: release::run_compression,
    },
    Check {
        info: release::TENSION,
        run: release::run_tension,
    },
    Check {
        info: service::TENSION,
        run: service::run_tension,
    },
    Check {
        info: top_tension::INFO,
        run: top_tension::run,
    },
    Check {
        info: service::SUSTAINED,
        run: service::run_sustained,
    },
    Check {
        info: service::TOTAL,
        run: service::run_total,
    },
    Check {
        info: service::TOPPING,
        run: service::run_topping,
    },
    Check {
        info: deflection::LIVE,
        run: deflection::run_live,
    },
    Check {
        info: deflection::AFTER,
        run: deflection::run_after,
    },
    Check {
        info: tip::INFO,
        run: tip::run,
    },
    Check {
        info: differential_camber::INFO,
        run: differential_camber::run,
    },
    Check {
        info: vibration::INFO,
        run: vibration::run,
    },
    Check {
        info: fire::INFO,
        run: fire::run,
    },
    Check {
        info: cover::INFO,
        run: cover::run,
    },
    Check {
        info: jacking::INFO,
        run: jacking::run,
    },
    Check {
        info: spacing::INFO,
        run: spacing::run,
    },
    Check {
        info: handling::INFO,
        run: handling::run,
    },
    Check {
        info: bearing_length::INFO,
        run: bearing_length::run,
    },
    Check {
        info: bearing_stress::INFO,
        run: bearing_stress::run,
    },
    Check {
        info: uplift::INFO,
        run: uplift::run,
    },
    Check {
        info: pad_pressure::INFO,
        run: pad_pressure::run,
    },
    Check {
        info: production_length::INFO,
        run: production_length::run,
    },
];

/// The state of the member at one station.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Station {
    /// Distance from the left bearing centre, in.
    pub x_in: f64,
    /// Distance from the nearer member end, in.
    pub d_in: f64,
    /// Governing factored moment, lbf·in.
    pub mu_lbin: f64,
    /// The most hogging factored moment (0 when no combination hogs), lbf·in.
    pub mu_neg_lbin: f64,
    /// Its combination.
    pub mu_combo: &'static str,
    /// Governing factored shear (magnitude), lbf.
    pub vu_lbf: f64,
    /// Unfactored effects by load group.
    pub effects: crate::case::Effects,
    /// Its combination.
    pub vu_combo: &'static str,
    /// Flexure at the station.
    pub flexure: flexure::AtStation,
    /// Release stresses, psi: (top, bottom).
    pub release_psi: (f64, f64),
    /// Service stresses.
    pub service: service::AtStation,
    /// Shear strength, when the station is at or beyond the critical section.
    pub shear: Option<shear::AtStation>,
    /// Effective prestress here.
    pub prestress: Effective,
}

/// The fibre stresses halfway between two neighbouring stations.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Mid {
    /// Distance from the left bearing centre, in.
    pub x_in: f64,
    /// Distance from the nearer member end, in.
    pub d_in: f64,
    /// Release stresses, psi: (top, bottom).
    pub release_psi: (f64, f64),
    /// Service stresses.
    pub service: service::AtStation,
}

impl Mid {
    fn at(m: &Member, x: f64) -> Mid {
        let d = m.end_distance(x);
        Mid {
            x_in: x,
            d_in: d,
            release_psi: release::at(m, x),
            service: service::at(m, x, m.effective_at(x), &m.effects(x)),
        }
    }
}

/// Where a quantity is greatest over the member.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Peak {
    /// Distance from the left bearing centre, in.
    pub x_in: f64,
    /// Distance from the nearer member end, in.
    pub d_in: f64,
    /// The quantity there.
    pub value: f64,
    /// Its limit there.
    pub limit: f64,
    /// value ÷ limit (0 when the value is not positive).
    pub ratio: f64,
}

/// The greatest ratio of a fibre stress `q` to its `limit` over the member.
///
/// `q` is quadratic in x between neighbouring stations (prestress and
/// eccentricity are linear there, moments quadratic; see [`stations`]), and
/// `limit(d, at_station)` is constant inside each segment: a station on the
/// boundary of two limit regions takes the stricter side
/// (`at_station = true`), since the stress just beyond it is the same.
/// So the maximum is at a station or at the vertex of the parabola through
/// a segment's ends and its midpoint; the vertex is evaluated exactly
/// (`exact(x, d)`) when it lies inside the segment and could exceed the
/// best found. A quantity that is not positive has ratio 0 (a tension
/// check on a fibre in compression).
pub fn peak(
    an: &Analysis,
    q: impl Fn(&service::AtStation, (f64, f64)) -> f64,
    limit: impl Fn(f64, bool) -> f64,
    exact: impl Fn(f64, f64) -> f64,
) -> Option<Peak> {
    let ratio = |v: f64, lim: f64| if v > 0.0 && lim > 0.0 { v / lim } else { 0.0 };
    let mut best: Option<Peak> = None;
    let keep = |best: &mut Option<Peak>, p: Peak| {
        if best.is_none_or(|b| p.ratio > b.ratio || (p.ratio == b.ratio && p.value > b.value)) {
            *best = Some(p);
        }
    };
    for s in &an.stations {
        let (v, lim) = (q(&s.service, s.release_psi), limit(s.d_in, true));
        keep(
            &mut best,
            Peak {
                x_in: s.x_in,
                d_in: s.d_in,
                value: v,
                limit: lim,
                ratio: ratio(v, lim),
            },
        );
    }
    for (w, m) in an.stations.windows(2).zip(&an.mids) {
        let (v0, v1, vm) = (
            q(&w[0].service, w[0].release_psi),
            q(&w[1].service, w[1].release_psi),
            q(&m.service, m.release_psi),
        );
        let lim = limit(m.d_in, false);
        // f(t) = v0 + b t + c t², t from 0 to 1 over the segment
        let b = 4.0 * vm - 3.0 * v0 - v1;
        let c = 2.0 * v0 + 2.0 * v1 - 4.0 * vm;
        keep(
            &mut best,
            Peak {
                x_in: m.x_in,
                d_in: m.d_in,
                value: vm,
                limit: lim,
                ratio: ratio(vm, lim),
            },
        );
        if c < 0.0 {
            let t = -b / (2.0 * c);
            let top = v0 + b * t + c * t * t;
            if t > 0.0 && t < 1.0 && best.is_none_or(|p| ratio(top, lim) > p.ratio) {
                let x = w[0].x_in + t * (w[1].x_in - w[0].x_in);
                let d = an.member.end_distance(x);
                let v = exact(x, d);
                keep(
                    &mut best,
                    Peak {
                        x_in: x,
                        d_in: d,
                        value: v,
                        limit: lim,
                        ratio: ratio(v, lim),
                    },
                );
            }
        }
    }
    best
}

/// A root of `g` between `a` and `b`, where g(a) = `ga` and g(b) = `gb`
/// have opposite signs (Illinois regula falsi, to 1e-4 of the interval:
/// the checks need the quantity there, which changes little over it).
pub fn root(g: impl Fn(f64) -> f64, mut a: f64, mut ga: f64, mut b: f64, mut gb: f64) -> f64 {
    let tol = 1e-4 * (b - a).abs().max(1e-9);
    let mut last = f64::NAN;
    // which end was kept last time (Illinois: halve the kept end's value
    // when the same end is kept twice, so neither end sticks)
    let mut kept = 0;
    for _ in 0..40 {
        let x = (a * gb - b * ga) / (gb - ga);
        if (x - last).abs() < tol {
            return x;
        }
        last = x;
        let gx = g(x);
        if gx == 0.0 {
            return x;
        }
        if (gx < 0.0) == (ga < 0.0) {
            (a, ga) = (x, gx);
            if kept == 2 {
                gb /= 2.0;
            }
            kept = 2;
        } else {
            (b, gb) = (x, gx);
            if kept == 1 {
                ga /= 2.0;
            }
            kept = 1;
        }
    }
    0.5 * (a + b)
}

/// The largest value of a smooth `f` on [a, b], given f(a) = `fa` and
/// f(b) = `fb`: successive parabolas through the best three points, from
/// the midpoint, until the step is below 1e-4 of the interval (a handful
/// of evaluations for the smooth ratios of the checks). Returns (x, f(x)).
pub fn refine_max(mut f: impl FnMut(f64) -> f64, a: f64, fa: f64, b: f64, fb: f64) -> (f64, f64) {
    let m = 0.5 * (a + b);
    let mut p = [(a, fa), (m, f(m)), (b, fb)];
    let tol = 1e-4 * (b - a);
    for _ in 0..8 {
        let [(x0, y0), (x1, y1), (x2, y2)] = p;
        let den = (x1 - x0) * (y1 - y2) - (x1 - x2) * (y1 - y0);
        let num = (x1 - x0).powi(2) * (y1 - y2) - (x1 - x2).powi(2) * (y1 - y0);
        if den.abs() < 1e-300 {
            break;
        }
        let v = x1 - 0.5 * num / den;
        if !(v > x0 && v < x2) || (v - x1).abs() < tol {
            break;
        }
        let fv = f(v);
        // keep a bracket around the best point
        p = if v < x1 {
            if fv >= y1 {
                [(x0, y0), (v, fv), (x1, y1)]
            } else {
                [(v, fv), (x1, y1), (x2, y2)]
            }
        } else if fv >= y1 {
            [(x1, y1), (v, fv), (x2, y2)]
        } else {
            [(x0, y0), (x1, y1), (v, fv)]
        };
    }
    p.into_iter().max_by(|a, b| a.1.total_cmp(&b.1)).expect("three points")
}

/// Everything the checks read: the member model and the stations.
pub struct Analysis<'a> {
    /// The member.
    pub member: Member<'a>,
    /// Stations, sorted by x.
    pub stations: Vec<Station>,
    /// The midpoint of each pair of neighbouring stations (the fibre
    /// stresses there find each segment's own maximum, see [`peak`]).
    pub mids: Vec<Mid>,
    /// Where shear is checked: from each critical section (h/2 from the
    /// support face, or the face itself when a concentrated load lies
    /// between them) to the other, and on each overhang from its critical
    /// section to the tip, in.
    pub shear_zones: Vec<(f64, f64)>,
    /// Which unit of the bay this is, and how its variable loads lie.
    pub unit: String,
    /// Camber and deflections.
    pub camber: crate::camber::Camber,
    /// Camber with age (ACI 209R-92, age-adjusted effective modulus).
    pub aged: crate::camber::AgedCamber,
    /// Fire assessment.
    pub fire: fire::Fire,
    /// Natural frequency, Hz.
    pub frequency_hz: f64,
    /// Whether the checks skip their notes (ranking needs only the numbers).
    pub brief: bool,
    /// Per-layer strand stress with full development (sets ℓd), psi.
    pub full: Vec<f64>,
    /// The greatest Mu/φMn, found once for the checks that read it.
    pub flexure_worst: std::cell::OnceCell<Option<flexure::Worst>>,
    /// The greatest Vu/φVn, found once for the checks that read it.
    pub shear_worst: std::cell::OnceCell<Option<shear::Worst>>,
}

impl Analysis<'_> {
    /// A check's note, or nothing in a brief evaluation.
    pub fn note(&self, text: std::fmt::Arguments) -> String {
        if self.brief { String::new() } else { text.to_string() }
    }
}

/// The full evaluation of one candidate.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Evaluation {
    /// Every applicable check, in registry order.
    pub checks: Vec<CheckResult>,
    /// Index of the check with the highest ratio.
    pub governing: usize,
    /// Whether every check passes.
    pub viable: bool,
    /// Service class reached at service loads.
    pub service_class: ServiceClass,
    /// Prestress history.
    pub history: History,
    /// Transfer length (fse/3000)·db, in.
    pub transfer_length_in: f64,
    /// Member length, in.
    pub member_length_in: f64,
    /// Camber and deflections.
    pub camber: crate::camber::Camber,
    /// Camber with age by ACI 209R-92 and the age-adjusted effective
    /// modulus method, beside the multipliers of `camber`.
    pub aged: crate::camber::AgedCamber,
    /// The camber at erection to expect (age-adjusted method), least and
    /// greatest over the erection ages of the bay and the units analysed, in.
    pub camber_range: (f64, f64),
    /// Fire assessment.
    pub fire: fire::Fire,
    /// Natural frequency, Hz.
    pub frequency_hz: f64,
    /// Stations.
    pub stations: Vec<Station>,
    /// The units analysed (not kept by a brief evaluation).
    pub units: Vec<UnitReport>,
    /// What each opening does to the units of this member (not kept by a
    /// brief evaluation).
    pub openings: Vec<String>,
    /// The terms of the stresses at release where the release compression
    /// check finds its worst point (not kept by a brief evaluation).
    pub release_at: Option<release::Terms>,
    /// The terms of the shear strength where the shear check finds its
    /// worst point (x, in), with the governing combination there and its
    /// factored moment, lbf·in (not kept by a brief evaluation).
    pub shear_at: Option<(f64, shear::Terms, shear::Combo, f64)>,
    /// The terms of Mcr at the station of the greatest factored moment (not
    /// kept by a brief evaluation).
    pub mcr_at: Option<flexure::McrTerms>,
    /// The terms of the natural frequency (not kept by a brief evaluation).
    pub frequency_terms: Option<vibration::Terms>,
}

impl Evaluation {
    /// The governing check.
    pub fn governing(&self) -> &CheckResult {
        &self.checks[self.governing]
    }
    /// The first failing check in the order of importance, if any.
    pub fn first_failure(&self) -> Option<&CheckResult> {
        self.checks.iter().filter(|c| !c.pass).min_by_key(|c| c.info.group)
    }
    /// A check by id.
    pub fn check(&self, id: &str) -> Option<&CheckResult> {
        self.checks.iter().find(|c| c.info.id == id)
    }
    /// The verdict (notes dropped: a ranking shows numbers).
    pub fn verdict(&self) -> Verdict {
        let bare = |c: &CheckResult| CheckResult {
            note: String::new(),
            ..c.clone()
        };
        Verdict {
            viable: self.viable,
            governing: bare(self.governing()),
            first_failure: self.first_failure().map(bare),
        }
    }
}

/// What a ranking keeps of an evaluation: whether every check passes, the
/// governing check and the first failure in the order of importance —
/// no heap, so 10 000 of them stay small.
#[derive(Debug, Clone, PartialEq)]
pub struct Verdict {
    /// Whether every check passes.
    pub viable: bool,
    governing: CheckResult,
    first_failure: Option<CheckResult>,
}

impl Verdict {
    /// The governing check (highest ratio, strand checks aside).
    pub fn governing(&self) -> &CheckResult {
        &self.governing
    }
    /// The first failing check in the order of importance, if any.
    pub fn first_failure(&self) -> Option<&CheckResult> {
        self.first_failure.as_ref()
    }
}

/// A candidate member: a section, one of its patterns, and its concrete.
#[derive(Debug, Clone, Copy)]
pub struct Candidate<'a> {
    /// The section.
    pub section: &'a Section,
    /// The pattern.
    pub pattern: &'a Pattern,
    /// The precast concrete.
    pub mix: &'a Mix,
}

impl Station {
    /// The same state seen from the other end, at `l − x`.
    fn mirrored(&self, l: f64) -> Station {
        let mut s = self.clone();
        s.x_in = l - self.x_in;
        let e = &mut s.effects;
        for v in [&mut e.v_self, &mut e.v_topping, &mut e.v_sdl, &mut e.v_live, &mut e.v_roof] {
            *v = -*v;
        }
        s
    }
}

/// Whether the member and its loads are symmetric about midspan: every
/// load has its mirror, no opening cuts it, and the overhangs are equal
/// (strand, debonding and harping are measured from the nearer end, so
/// they always are).
fn symmetric(m: &Member) -> bool {
    m.cut.is_none() && m.case.overhang.0 == m.case.overhang.1 && m.loads.symmetric()
}

/// Where shear is checked ([`Analysis::shear_zones`]): ACI 318-19
/// §7.4.3.2 / §9.4.3.2 allow the critical section at h/2 from the support
/// face only when no concentrated load lies between them; otherwise the
/// face itself. On an overhang, from its critical section to the tip.
pub fn shear_zones(m: &Member) -> Vec<(f64, f64)> {
    let face = m.case.bearing.get() / 2.0;
    let h2 = m.h_total / 2.0;
    let points: Vec<f64> = m
        .loads
        .groups
        .iter()
        .flatten()
        .filter_map(|ld| match *ld {
            crate::beam::Load::Point { p, a } if p != 0.0 => Some(a),
            _ => None,
        })
        .collect();
    // the critical section out from a support face at `f`, towards `dir`
    let crit = |f: f64, dir: f64| {
        let far = f + dir * h2;
        let inside = points.iter().any(|&a| (a - f) * dir > 1e-9 && (far - a) * dir >= -1e-9);
        if inside { f } else { far }
    };
    let l = m.l;
    let (lo, hi) = m.range();
    let mut zones = vec![(crit(face, 1.0), crit(l - face, -1.0))];
    if lo < 0.0 {
        let c = crit(-face, -1.0);
        if c > lo {
            zones.insert(0, (lo, c));
        }
    }
    if hi > l {
        let c = crit(l + face, 1.0);
        if c < hi {
            zones.push((c, hi));
        }
    }
    zones
}

/// Whether `x` lies where shear is checked.
fn in_zones(zones: &[(f64, f64)], x: f64) -> bool {
    zones.iter().any(|&(a, b)| x >= a - 1e-9 && x <= b + 1e-9)
}

/// How far either side of a jump (a line load's shear step) its two
/// stations sit, in: small enough that moments and stresses are those of
/// the jump itself, large enough to keep the stations apart.
pub const JUMP_IN: f64 = 1e-3;

/// Stations: every point where a checked quantity or its limit changes
/// its law, so that each check's maximum is at a station or is found
/// between two by the check itself, and no two further apart than ℓ/20
/// (a quarter of an overhang: gaps are filled evenly) so that what is read
/// at stations only — the first cracking, the stem reinforcement needed —
/// is read closely:
/// - the ends of the shear zones ([`shear_zones`]);
/// - where each layer's bond begins (after its debonded length, and at the
///   edges of an opening that cuts it), the middle of each bonded piece
///   (where the distances from its two ends cross), and the transfer lengths
///   (fse/3000)·db and 50 db and the development length ℓd from there
///   (`full`: the strand stresses with full development, psi); ℓtr from
///   each member end (the end-region release limits of Tables
///   24.5.3.1/24.5.3.2 end there);
/// - hold-downs (the strand profile bends);
/// - every load break ([`crate::loads::Loads::breaks`]): point loads and
///   supports on both sides of their shear step ([`JUMP_IN`]), the ends of
///   partial loads;
/// - an opening's edges (the section changes: both sides) and h/2 beyond
///   them (the web width for shear changes);
/// - where the shear of each combination passes through zero, and with
///   overhangs where its moment does ([`Member::turning_points`]), and midspan.
///
/// Between these points prestress, eccentricity and section are constant or
/// linear and moments quadratic in x, so the fibre stresses are quadratic;
/// the stress checks find each segment's vertex ([`peak`]).
fn stations(m: &Member, zones: &[(f64, f64)], full: &[f64]) -> Vec<f64> {
    let l = m.l;
    let (lo, hi) = m.range();
    let (e0, e1) = m.ends;
    let mut xs: Vec<f64> = Vec::with_capacity(64);
    xs.extend([lo, 0.0, l / 2.0, l, hi]);
    for &(a, b) in zones {
        xs.extend([a, b]);
    }
    // from each member end, and from each edge an opening's cut strands bond again
    let from = |xs: &mut Vec<f64>, origin: f64, dir: f64, len: f64| xs.push(origin + dir * len);
    for &(e, dir) in &[(e0, 1.0), (e1, -1.0)] {
        from(&mut xs, e, dir, m.ltr);
        from(&mut xs, e, dir, m.ltr_shear);
        if let Some(hd) = m.hold_down {
            from(&mut xs, e, dir, hd);
        }
    }
    // the middle of each bonded piece of strand, where the distances from
    // its two ends cross (the prestress of a short piece peaks there)
    xs.push(0.5 * (e0 + e1));
    for (i, layer) in m.layers.iter().enumerate() {
        let fps = full.get(i).copied().unwrap_or(m.strand.fpu.get());
        let mut origins = vec![
            (e0 + layer.debond, 1.0, layer.debond > 0.0),
            (e1 - layer.debond, -1.0, layer.debond > 0.0),
        ];
        if let Some((o1, o2)) = layer.cut {
            // ℓd from an opening's edge as the strength caps take it: doubled
            // for a debonded layer (§25.4.8.1(b)), whichever end its bond starts at
            let debonded = layer.debond > 0.0;
            origins.extend([(o2, 1.0, debonded), (o1, -1.0, debonded)]);
            xs.extend([0.5 * (e0 + layer.debond + o1), 0.5 * (o2 + e1 - layer.debond)]);
        }
        for (o, dir, debonded) in origins {
            let ld = crate::prestress::development_length(m.history.fse_psi, fps, m.db(), debonded);
            xs.push(o);
            for len in [m.ltr, m.ltr_shear, ld] {
                from(&mut xs, o, dir, len);
            }
        }
    }
    for (x, jump) in m.loads.breaks() {
        // a support at the end of the stretch checked has one side only
        if jump && x > lo + 1e-9 && x < hi - 1e-9 {
            xs.extend([x - JUMP_IN, x + JUMP_IN]);
        } else {
            xs.push(x);
        }
    }
    if let Some(c) = m.cut {
        let h2 = m.h_total / 2.0;
        xs.extend([
            c.along.0 - JUMP_IN,
            c.along.0,
            c.along.1,
            c.along.1 + JUMP_IN,
            c.along.0 - h2,
            c.along.1 + h2,
        ]);
    }
    xs.extend(m.turning_points());
    xs.retain(|&x| x >= lo && x <= hi);
    xs.sort_by(f64::total_cmp);
    xs.dedup_by(|a, b| (*a - *b).abs() < 1e-6);
    // no two stations further apart than ℓ/20 (a quarter of an overhang)
    let mut filled = Vec::with_capacity(xs.len() + 24);
    for w in xs.windows(2) {
        let (a, b) = (w[0], w[1]);
        filled.push(a);
        let most = if a < 0.0 || b > l {
            0.25 * if a < 0.0 { -lo } else { hi - l }
        } else {
            l / 20.0
        };
        let n = ((b - a) / most * (1.0 - 1e-9)).ceil() as usize;
        filled.extend((1..n).map(|k| a + (b - a) * k as f64 / n as f64));
    }
    filled.extend(xs.last());
    filled
}

/// Build the analysis of the loaded unit under the first arrangement of
/// its variable loads (the only one of a bay without overhangs, openings
/// or placed roof loads): the member and the state at every station.
pub fn analyse<'a>(cand: &Candidate<'a>, case: &'a DesignCase) -> Analysis<'a> {
    let arr = crate::loads::arrangements(case).first().copied().unwrap_or(Arrangement::PLAIN);
    analyse_unit(cand, case, &Unit::loaded(), arr, false, None)
}

/// Every unit of the bay that must be checked, each under every
/// arrangement of its variable loads ([`crate::loads`]).
pub fn scenarios(cand: &Candidate, case: &DesignCase) -> Vec<(Unit, Arrangement)> {
    let top_w = case.topping.as_ref().map_or(0.0, |t| t.thickness.get() * t.mix.unit_weight.get());
    let units = crate::loads::units(case, cand.section, cand.mix.unit_weight.get(), top_w);
    let arrs = crate::loads::arrangements(case);
    let mut out = Vec::with_capacity(units.len() * arrs.len());
    for u in units {
        for &a in &arrs {
            out.push((u.clone(), a));
        }
    }
    out
}

/// Every check on a station set given by the caller (x from the left
/// bearing centre, in) instead of the member's own: the proof that the
/// member's own stations miss no maximum compares the two on a dense set.
pub fn evaluate_on_stations(cand: &Candidate, case: &DesignCase, xs: &[f64]) -> Evaluation {
    let evs = scenarios(cand, case)
        .into_iter()
        .map(|(u, a)| finish(analyse_unit(cand, case, &u, a, false, Some(xs))))
        .collect();
    merge(evs)
}

/// The analysis of one unit of the bay under one arrangement of its
/// variable loads ([`scenarios`] lists them all).
pub fn analyse_as<'a>(cand: &Candidate<'a>, case: &'a DesignCase, unit: &Unit, arr: Arrangement) -> Analysis<'a> {
    analyse_unit(cand, case, unit, arr, false, None)
}

/// How one analysis is run.
#[derive(Clone, Copy)]
struct How<'b, 'a> {
    /// Notes left out (ranking).
    brief: bool,
    /// Every station kept, the mirrored half of a symmetric member too
    /// (another unit's analysis borrows them).
    whole: bool,
    /// The loaded unit's analysis under the same arrangement, for a unit an
    /// opening cuts: outside the opening's reach the two are the same
    /// member under the same loads, so its stations are borrowed.
    base: Option<&'b Analysis<'a>>,
}

fn analyse_unit<'a>(
    cand: &Candidate<'a>,
    case: &'a DesignCase,
    unit: &Unit,
    arr: Arrangement,
    brief: bool,
    given: Option<&[f64]>,
) -> Analysis<'a> {
    analyse_how(
        cand,
        case,
        unit,
        arr,
        given,
        How {
            brief,
            whole: !brief,
            base: None,
        },
    )
}

/// Where an opening's cut makes a unit differ from the uncut one: its
/// length along the span and the reach beyond each edge of the strand's
/// development (the prestress, the strength cap and φ all recover within
/// ℓd) and of the webs cut (h/2).
fn reach(m: &Member, full: &[f64]) -> Option<(f64, f64)> {
    let c = m.cut?;
    let mut r = m.h_total / 2.0;
    for (i, layer) in m.layers.iter().enumerate() {
        if layer.cut.is_some() {
            let fps = full.get(i).copied().unwrap_or(m.strand.fpu.get());
            // the strength caps' own ℓd (doubled for a debonded layer)
            r = r
                .max(crate::prestress::development_length(
                    m.history.fse_psi,
                    fps,
                    m.db(),
                    layer.debond > 0.0,
                ))
                .max(m.ltr_shear);
        }
    }
    Some((c.along.0 - r - 1e-6, c.along.1 + r + 1e-6))
}

fn analyse_how<'a>(
    cand: &Candidate<'a>,
    case: &'a DesignCase,
    unit: &Unit,
    arr: Arrangement,
    given: Option<&[f64]>,
    how: How<'_, 'a>,
) -> Analysis<'a> {
    let brief = how.brief;
    let member = Member::build(cand.section, cand.pattern, cand.mix, case, unit, arr);
    let zones = shear_zones(&member);
    let mut memo = flexure::Memo::new(&member);
    let xs = stations(&member, &zones, &memo.full);
    let full = memo.full.clone();
    let label = if arr == Arrangement::PLAIN {
        unit.label.clone()
    } else {
        format!("{}, {}", unit.label, arr.describe())
    };
    let mut at = |x: f64| {
        let pre = member.effective_at(x);
        let flex = flexure::at(&member, x, pre, &mut memo);
        loaded(&member, x, &zones, pre, flex, release::at(&member, x))
    };
    if let Some(xs) = given {
        let stations = xs.iter().map(|&x| at(x)).collect();
        let fire = fire::assess(&member, brief);
        return complete(member, stations, zones, fire, brief, full, label, None);
    }
    // a cut unit under the loaded unit's loads: its own state only within
    // the opening's reach, the loaded unit's elsewhere
    let borrow = match (how.base, unit.headers.is_empty()) {
        (Some(b), true) if b.member.cut.is_none() => reach(&member, &full).map(|z| (b, z)),
        _ => None,
    };
    if let Some((b, (z0, z1))) = borrow {
        // the loaded unit's stations outside the reach, this unit's own within
        let mut stations: Vec<Station> = Vec::with_capacity(b.stations.len() + xs.len());
        let mut own = xs.iter().copied().filter(|&x| x >= z0 && x <= z1).peekable();
        for s in &b.stations {
            if s.x_in >= z0 && s.x_in <= z1 {
                continue;
            }
            while let Some(&x) = own.peek().filter(|&&x| x < s.x_in) {
                stations.push(at(x));
                own.next();
            }
            stations.push(s.clone());
        }
        stations.extend(own.map(&mut at));

        let fire = fire::assess(&member, brief);
        return complete(member, stations, zones, fire, brief, full, label, Some((b, (z0, z1))));
    }
    let stations = if symmetric(&member) {
        // the member, its strand and its loads are the same seen from either
        // end: the right half mirrors the left (shears change sign), and a
        // station's state is worked out once
        let (lo, hi) = member.range();
        let half = 0.5 * (lo + hi);
        // xs is sorted: the left half is a prefix
        let n = xs.iter().take_while(|&&x| x <= half + 1e-9).count();
        let mut all = Vec::with_capacity(if how.whole { 2 * n } else { n });
        all.extend(xs[..n].iter().map(|&x| at(x)));
        // a brief evaluation keeps the numbers only: every maximum over the
        // stations is already found on the left half
        if how.whole {
            for i in (0..n).rev() {
                if all[i].x_in < half - 1e-9 {
                    let m = all[i].mirrored(member.l);
                    all.push(m);
                }
            }
        }
        all
    } else {
        xs.into_iter().map(at).collect::<Vec<Station>>()
    };
    let fire = fire::assess(&member, brief);
    complete(member, stations, zones, fire, brief, full, label, None)
}

/// Every unit of the bay the checks must see, each under every arrangement
/// of its variable loads: under each arrangement the loaded unit first,
/// then the others, a cut unit borrowing the loaded unit's stations away
/// from its opening.
fn analyses<'a>(cand: &Candidate<'a>, case: &'a DesignCase, brief: bool) -> Vec<Analysis<'a>> {
    let mut out = Vec::new();
    let sc = scenarios(cand, case);
    let mut arrs: Vec<Arrangement> = Vec::new();
    for (_, a) in &sc {
        if !arrs.contains(a) {
            arrs.push(*a);
        }
    }
    let shares = sc.iter().any(|(u, _)| u.cut.is_some() && u.headers.is_empty());
    for a in arrs {
        let mut units = sc.iter().filter(|(_, x)| *x == a).map(|(u, _)| u);
        let Some(first) = units.next() else { continue };
        let base = analyse_how(
            cand,
            case,
            first,
            a,
            None,
            How {
                brief,
                whole: !brief || shares,
                base: None,
            },
        );
        let others: Vec<Analysis<'a>> = units
            .map(|u| {
                analyse_how(
                    cand,
                    case,
                    u,
                    a,
                    None,
                    How {
                        brief,
                        whole: !brief,
                        base: Some(&base),
                    },
                )
            })
            .collect();
        out.push(base);
        out.extend(others);
    }
    out
}

/// The state at station `x` under the member's loads, given what does not
/// depend on them: the prestress, the flexural strength and the release stresses.
fn loaded(member: &Member, x: f64, zones: &[(f64, f64)], pre: Effective, flexure: flexure::AtStation, release_psi: (f64, f64)) -> Station {
    let eff = member.effects(x);
    let (mu, mu_combo, vu, vu_combo) = factored(&eff);
    let shear = in_zones(zones, x).then(|| shear::at(member, x, pre, &eff));
    let mu_neg = crate::case::COMBINATIONS.iter().map(|c| c.apply(&eff).0).fold(0.0, f64::min);
    Station {
        x_in: x,
        d_in: member.end_distance(x),
        mu_lbin: mu,
        mu_neg_lbin: mu_neg,
        mu_combo,
        vu_lbf: vu,
        effects: eff,
        vu_combo,
        flexure,
        release_psi,
        service: service::at(member, x, pre, &eff),
        prestress: pre,
        shear,
    }
}

/// The analysis from its stations: camber and frequency added. `borrow`:
/// the loaded unit's analysis and the stretch outside which its midpoints
/// are this one's too.
#[allow(clippy::too_many_arguments)]
fn complete<'a>(
    member: Member<'a>,
    stations: Vec<Station>,
    shear_zones: Vec<(f64, f64)>,
    fire: fire::Fire,
    brief: bool,
    full: Vec<f64>,
    unit: String,
    borrow: Option<(&Analysis<'a>, (f64, f64))>,
) -> Analysis<'a> {
    let frequency_hz = vibration::frequency(&member);
    let mids = stations
        .windows(2)
        .map(|w| {
            let x = (w[0].x_in + w[1].x_in) / 2.0;
            if w[1].x_in - w[0].x_in <= 2.0 * JUMP_IN * (1.0 + 1e-9) {
                // the two sides of a shear step: one section, no vertex between
                return Mid {
                    x_in: x,
                    d_in: member.end_distance(x),
                    release_psi: w[0].release_psi,
                    service: w[0].service,
                };
            }
            if let Some((b, (z0, z1))) = borrow
                && (w[1].x_in < z0 || w[0].x_in > z1)
                && let Ok(k) = b.mids.binary_search_by(|m| m.x_in.total_cmp(&x))
            {
                return b.mids[k];
            }
            Mid::at(&member, x)
        })
        .collect();
    let mut an = Analysis {
        member,
        stations,
        mids,
        shear_zones,
        unit,
        camber: crate::camber::Camber::default(),
        aged: crate::camber::AgedCamber::default(),
        fire,
        frequency_hz,
        brief,
        full,
        flexure_worst: std::cell::OnceCell::new(),
        shear_worst: std::cell::OnceCell::new(),
    };
    // camber needs the class reached and, for T and C, the stresses of the
    // bilinear method where the bottom-fibre tension is greatest
    let m = &an.member;
    let (ft_total, x) = service::max_tension(&an).map_or((0.0, m.l / 2.0), |p| (p.value, p.x_in));
    let s_live = m.props_at(x).1.map_or(m.props_at(x).0.sb_in3, |c| c.sb_in3);
    let eff = m.effects(x);
    let f_live = eff.m_live.max(eff.m_roof) / s_live;
    let class = service::class_of(ft_total, m.mix.fc.get());
    an.camber = crate::camber::camber(m, class, ft_total, f_live);
    an.aged = aged_camber(&an.member, &an.camber);
    an
}

/// A brief analysis kept for trying other uniform variable loads on the
/// same member and span: the prestress history, the flexural strength and
/// the release stresses at each station do not depend on the variable
/// load (the losses of Zia et al. take the sustained dead loads only), so a
/// trial load recomputes moments, shears, service stresses, shear strength,
/// camber and frequency, and runs the checks. The capacity envelope tries
/// many loads per span. The load varied is the one the bay's use names
/// ([`DesignCase::with_varied`]); placed loads stay as they are.
pub struct Prepared<'a> {
    bases: Vec<(Unit, Analysis<'a>)>,
    /// Per-layer strand stress with full development (sets ℓd), psi, of each base.
    full: Vec<Vec<f64>>,
}

impl<'a> Prepared<'a> {
    /// Prepare a candidate under a case (its varied load is replaced by each trial).
    pub fn new(cand: &Candidate<'a>, case: &'a DesignCase) -> Prepared<'a> {
        // the arrangements of a loaded case: a trial load may add a roof load the case lacks
        let probe = case.with_varied(crate::units::AreaLoad::from_unit(1.0, "psf"));
        let top_w = case.topping.as_ref().map_or(0.0, |t| t.thickness.get() * t.mix.unit_weight.get());
        let units = crate::loads::units(case, cand.section, cand.mix.unit_weight.get(), top_w);
        let arrs = crate::loads::arrangements(&probe);
        let mut bases = Vec::new();
        for &a in &arrs {
            for u in &units {
                let an = analyse_unit(cand, case, u, a, true, None);
                bases.push((u.clone(), an));
            }
        }
        let full = bases.iter().map(|b| b.1.full.clone()).collect();
        Prepared { bases, full }
    }

    /// The brief evaluation at the case's own loads (as [`evaluate_brief`]).
    pub fn evaluation(&self) -> Evaluation {
        trimmed(merge(self.bases.iter().map(|b| results(&b.1)).collect()))
    }

    /// The brief evaluation with the varied load `q` instead of the
    /// case's: equal to [`evaluate_brief`] of [`DesignCase::with_varied`].
    pub fn with_live(&self, q: crate::units::AreaLoad) -> Evaluation {
        trimmed(merge((0..self.bases.len()).map(|i| finish(self.analysis(i, q))).collect()))
    }

    /// Only the ratios of the checks `ids` (in registry order) at varied
    /// load `q`, the worst over the units and arrangements: what the
    /// envelope's later trials read, without running the checks the load
    /// cannot change.
    pub fn ratios_with_live(&self, q: crate::units::AreaLoad, ids: &[&'static str]) -> Vec<(&'static str, f64)> {
        let mut out: Vec<(&'static str, f64)> = Vec::new();
        for i in 0..self.bases.len() {
            let an = self.analysis(i, q);
            for r in REGISTRY.iter().filter(|c| ids.contains(&c.info.id)).filter_map(|c| (c.run)(&an)) {
                match out.iter_mut().find(|o| o.0 == r.info.id) {
                    // the worst as merge keeps it: a later unit only when higher by more than rounding
                    Some(o) if r.ratio > o.1 + 1e-12 => o.1 = r.ratio,
                    Some(_) => {}
                    None => out.push((r.info.id, r.ratio)),
                }
            }
        }
        out
    }

    fn analysis(&self, i: usize, q: crate::units::AreaLoad) -> Analysis<'a> {
        let (unit, b) = &self.bases[i];
        let mut member = b.member.clone();
        let varied = member.case.with_varied(q);
        let top_w = varied.topping.as_ref().map_or(0.0, |t| t.thickness.get() * t.mix.unit_weight.get());
        member.loads = crate::loads::Loads::new(
            &varied,
            member.section,
            member.mix.unit_weight.get(),
            top_w,
            unit,
            member.arrangement,
        );
        member.w = member.loads.w;
        // the station set of a fresh evaluation at this load: the same
        // load-independent points, and the turning points of these loads
        let mut xs = stations(&member, &b.shear_zones, &self.full[i]);
        if symmetric(&member) {
            let (lo, hi) = member.range();
            let half = 0.5 * (lo + hi);
            xs.truncate(xs.iter().take_while(|&&x| x <= half + 1e-9).count());
        }
        let stations: Vec<Station> = {
            let mut memo: Option<flexure::Memo> = None;
            xs.iter()
                .map(|&x| match b.stations.binary_search_by(|s| s.x_in.total_cmp(&x)) {
                    Ok(k) => {
                        let s = &b.stations[k];
                        loaded(&member, s.x_in, &b.shear_zones, s.prestress, s.flexure, s.release_psi)
                    }
                    Err(_) => {
                        // a turning point these loads move: worked out afresh
                        let pre = member.effective_at(x);
                        // the same memo a fresh evaluation starts with, so
                        // the answers agree to the bit
                        let memo = memo.get_or_insert_with(|| flexure::Memo::new(&member));
                        let flex = flexure::at(&member, x, pre, memo);
                        loaded(&member, x, &b.shear_zones, pre, flex, release::at(&member, x))
                    }
                })
                .collect()
        };
        complete(
            member,
            stations,
            b.shear_zones.clone(),
            b.fire.clone(),
            true,
            self.full[i].clone(),
            b.unit.clone(),
            None,
        )
    }
}

/// Evaluate every check for one candidate under one case: every unit of
/// the bay the checks must see under every arrangement of its variable
/// loads, each check at its worst ([`merge`]).
pub fn evaluate(cand: &Candidate, case: &DesignCase) -> Evaluation {
    let evs = analyses(cand, case, false).into_iter().map(finish).collect();
    let mut ev = merge(evs);
    ev.openings = describe_openings(cand, case);
    ev
}

/// What each opening does to units of this member laid side by side from
/// the joint its place across is measured from: the units it cuts through
/// (their pieces hang on headers), those it cuts partly (strands and web
/// width lost), and those the headers bear on.
pub fn describe_openings(cand: &Candidate, case: &DesignCase) -> Vec<String> {
    describe_openings_as(cand, case, false)
}

/// [`describe_openings`], `short` for a shortlist line: the units only.
pub fn describe_openings_as(cand: &Candidate, case: &DesignCase, short: bool) -> Vec<String> {
    let b = cand.section.props.width_in;
    let g = &cand.section.geometry;
    let props = &cand.section.props;
    case.openings
        .iter()
        .enumerate()
        .map(|(k, o)| {
            let lay = crate::loads::layout(o, b);
            let mut parts = Vec::new();
            if !lay.through.is_empty() {
                let units: Vec<String> = lay.through.iter().map(|j| (j + 1).to_string()).collect();
                parts.push(format!(
                    "cuts unit{} {} through (not members: their pieces hang on headers)",
                    if units.len() > 1 { "s" } else { "" },
                    units.join(", ")
                ));
            }
            for (j, cut) in &lay.partly {
                let strands: usize = cand
                    .pattern
                    .rows
                    .iter()
                    .map(|r| r.x.iter().filter(|&&x| x >= cut.across.0 && x <= cut.across.1).count())
                    .sum();
                let total: usize = cand.pattern.rows.iter().map(|r| r.x.len()).sum();
                let net = g.net_properties(&g.net(cut.across.0, cut.across.1), props, cut.across.0, cut.across.1);
                parts.push(format!(
                    "cuts unit {} over {:.1}–{:.1} in of its width: {} of {} strands, web width {:.2} in → {:.2} in, area {:.0} in² → {:.0} in²",
                    j + 1,
                    cut.across.0,
                    cut.across.1,
                    strands,
                    total,
                    props.web_width_min_in,
                    net.web_width_min_in,
                    props.area_in2,
                    net.area_in2
                ));
            }
            let (l, r) = lay.bearing;
            if short {
                let mut v = Vec::new();
                if !lay.through.is_empty() {
                    v.push(format!(
                        "unit(s) {} cut through",
                        lay.through.iter().map(|j| (j + 1).to_string()).collect::<Vec<_>>().join(", ")
                    ));
                }
                for (j, cut) in &lay.partly {
                    let strands: usize = cand
                        .pattern
                        .rows
                        .iter()
                        .map(|r| r.x.iter().filter(|&&x| x >= cut.across.0 && x <= cut.across.1).count())
                        .sum();
                    v.push(format!("unit {} cut partly ({strands} strand(s))", j + 1));
                }
                v.push(if l == r {
                    format!("headers on unit {}", l + 1)
                } else {
                    format!("headers on units {} and {}", l + 1, r + 1)
                });
                return format!("opening {}: {}", k + 1, v.join(", "));
            }
            parts.push(if l == r {
                format!("its headers bear on unit {}", l + 1)
            } else {
                format!("its headers bear on units {} and {}", l + 1, r + 1)
            });
            format!(
                "opening {} ({} to {} along, {:.1} in wide from {:.1} in across; {} in units of {:.1} in): {}",
                k + 1,
                crate::units::fmt_ft_in(o.from),
                crate::units::fmt_ft_in(o.to),
                o.across.1.get() - o.across.0.get(),
                o.across.0.get(),
                if lay.partly.is_empty() && lay.through.is_empty() {
                    "no unit cut"
                } else {
                    "units numbered from that joint"
                },
                b,
                parts.join("; ")
            )
        })
        .collect()
}

/// The same numbers as [`evaluate`] without the checks' notes and the
/// stations: what ranking and the envelope need, in less time and memory.
pub fn evaluate_brief(cand: &Candidate, case: &DesignCase) -> Evaluation {
    let evs = analyses(cand, case, true).iter().map(results).collect();
    trimmed(merge(evs))
}

/// The evaluations of several units or arrangements as one: each check at
/// its worst (a failure before a pass, then the higher ratio), its note
/// naming the unit and arrangement it comes from; the stations, camber and
/// prestress history are the first's (the loaded unit, variable loads on
/// the span).
pub fn merge(mut evs: Vec<Evaluation>) -> Evaluation {
    if evs.len() == 1 {
        return evs.pop().expect("one");
    }
    let mut out = evs.remove(0);
    for ev in evs {
        for c in ev.checks {
            match out.checks.iter_mut().find(|o| o.info.id == c.info.id) {
                Some(o) => {
                    let worse = (!c.pass && o.pass) || (c.pass == o.pass && (c.ratio > o.ratio + 1e-12 || beyond_cap(&c, o)));
                    if worse {
                        // the terms shown for a check's worst point come
                        // with it from the unit or arrangement it is found in
                        if c.info.id == shear::INFO.id {
                            out.shear_at = ev.shear_at;
                        }
                        if c.info.id == release::COMPRESSION.id {
                            out.release_at = ev.release_at;
                        }
                        *o = c;
                    }
                }
                None => out.checks.push(c),
            }
        }
        out.service_class = out.service_class.max(ev.service_class);
        out.units.extend(ev.units);
        out.camber_range = (out.camber_range.0.min(ev.camber_range.0), out.camber_range.1.max(ev.camber_range.1));
    }
    // units side by side: the spread of their cambers at erection
    differential_camber::across_units(&mut out);
    out.checks.sort_by_key(|c| REGISTRY.iter().position(|r| r.info.id == c.info.id));
    out.viable = out.checks.iter().all(|c| c.pass);
    out.governing = governing_of(&out.checks);
    out
}

/// Whether `c` is worse than `o` where both ratios sit at [`RATIO_NONE`]
/// (no capacity, or the ratio past what is printed): the higher true
/// ratio, then the larger demand — with no hogging strength anywhere, the
/// arrangement with the larger hogging moment is the one to report.
fn beyond_cap(c: &CheckResult, o: &CheckResult) -> bool {
    if c.ratio < RATIO_NONE || o.ratio < RATIO_NONE {
        return false;
    }
    let raw = |r: &CheckResult| {
        if r.capacity != 0.0 {
            (r.demand / r.capacity).abs()
        } else {
            f64::INFINITY
        }
    };
    raw(c).total_cmp(&raw(o)).then(c.demand.abs().total_cmp(&o.demand.abs())).is_gt()
}

/// A brief evaluation as kept: no stations, no notes, no spare capacity.
fn trimmed(mut ev: Evaluation) -> Evaluation {
    ev.stations = Vec::new();
    // a ranking holds thousands of these: no spare capacity
    ev.checks.shrink_to_fit();
    for c in &mut ev.checks {
        c.note = String::new();
    }
    ev.units = Vec::new();
    ev.openings = Vec::new();
    ev
}

fn finish(an: Analysis) -> Evaluation {
    let mut ev = results(&an);
    ev.stations = an.stations;
    ev
}

/// The check that limits the load: requirements the load cannot change
/// (release stresses, cover, fire, strand, length, minimum strength when
/// met outright) pass or fail but do not govern.
fn governing_of(checks: &[CheckResult]) -> usize {
    checks
        .iter()
        .enumerate()
        .filter(|(_, c)| c.governs)
        .max_by(|a, b| a.1.ratio.total_cmp(&b.1.ratio))
        .or_else(|| checks.iter().enumerate().max_by(|a, b| a.1.ratio.total_cmp(&b.1.ratio)))
        .map_or(0, |(i, _)| i)
}

/// Every check's result on an analysis, without its stations; each note
/// names the unit and arrangement when they are not the plain ones.
fn results(an: &Analysis) -> Evaluation {
    let mut checks: Vec<CheckResult> = Vec::with_capacity(REGISTRY.len());
    checks.extend(REGISTRY.iter().filter_map(|c| (c.run)(an)));
    let plain = an.unit == Unit::loaded().label;
    if !an.brief && !plain {
        for c in &mut checks {
            if c.info.load_driven {
                c.note = if c.note.is_empty() {
                    an.unit.clone()
                } else {
                    format!("{}; {}", c.note, an.unit)
                };
            }
        }
    }
    let governing = governing_of(&checks);
    let viable = checks.iter().all(|c| c.pass);
    Evaluation {
        governing,
        viable,
        service_class: service::class_reached(an),
        history: an.member.history,
        transfer_length_in: an.member.ltr,
        member_length_in: an.member.lm,
        camber: an.camber,
        aged: an.aged,
        camber_range: differential_camber::range(an),
        fire: an.fire.clone(),
        frequency_hz: an.frequency_hz,
        stations: Vec::new(),
        units: if an.brief { Vec::new() } else { vec![UnitReport::of(an)] },
        openings: Vec::new(),
        shear_at: if an.brief {
            None
        } else {
            checks.iter().find(|c| c.info.id == "shear").and_then(|c| c.station_ft).map(|x| {
                let (m, x) = (&an.member, x * 12.0);
                let (pre, eff) = (m.effective_at(x), m.effects(x));
                let gov = *shear::at(m, x, pre, &eff).gov();
                // the factored moment of that combination there, lbf·in
                let mu = crate::case::COMBINATIONS[gov.combo as usize].apply(&eff).0;
                (x, shear::terms(m, x, pre, &eff), gov, mu)
            })
        },
        frequency_terms: (!an.brief).then(|| vibration::terms(&an.member)),
        mcr_at: if an.brief {
            None
        } else {
            an.stations
                .iter()
                .max_by(|a, b| a.mu_lbin.total_cmp(&b.mu_lbin))
                .map(|s| flexure::mcr_terms(&an.member, s.x_in, s.prestress))
        },
        release_at: if an.brief {
            None
        } else {
            checks
                .iter()
                .find(|c| c.info.id == "release_compression")
                .and_then(|c| c.station_ft)
                .map(|x| release::terms(&an.member, x * 12.0))
        },
        checks,
    }
}

/// The conditions of the precast concrete with age: steam cured (the
/// usual precast practice: common practice, no source), the bay's humidity,
/// the section's volume-to-surface ratio.
pub fn aging_conditions(m: &Member) -> crate::aging::Conditions {
    crate::aging::Conditions {
        curing: crate::aging::Curing::Steam,
        humidity: m.case.humidity,
        vs_in: m.bare.vs_ratio_in,
    }
}

/// The member's camber with age at the bay's erection age.
fn aged_camber(m: &Member, cam: &crate::camber::Camber) -> crate::camber::AgedCamber {
    crate::camber::aged(&crate::camber::aged_inputs(m, cam), m.case.erection_age, &aging_conditions(m))
}

/// What the output says of one unit analysed: which it is, how its
/// variable loads lie, and the share it takes of each placed load.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct UnitReport {
    /// Which unit, and the arrangement.
    pub unit: String,
    /// Strands its opening cuts, of all (0 when uncut).
    pub strands_cut: usize,
    /// Strands in all.
    pub strands: usize,
    /// The share of each placed load.
    pub shares: Vec<crate::loads::Share>,
}

impl UnitReport {
    fn of(an: &Analysis) -> UnitReport {
        let m = &an.member;
        UnitReport {
            unit: an.unit.clone(),
            strands_cut: m.layers.iter().filter(|l| l.cut.is_some()).map(|l| l.x.len()).sum(),
            strands: m.layers.iter().map(|l| l.x.len()).sum(),
            shares: m.loads.shares.clone(),
        }
    }
}

/// kip·ft from lbf·in.
pub fn kipft(m: f64) -> f64 {
    m / 12_000.0
}
/// kip from lbf.
pub fn kip(v: f64) -> f64 {
    v / 1000.0
}

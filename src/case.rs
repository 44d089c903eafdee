//! The design case: span, bearings, loads and criteria, and the moments and
//! shears they cause along a simply supported member.
//!
//! x is measured along the span from the centre of the left bearing; the
//! member ends lie half a bearing length beyond each bearing centre, so the
//! member length is span + bearing length (common practice, no source).

use serde::Serialize;

use crate::material::Mix;
use crate::units::{AreaLoad, Length, LineLoad};

/// What the member carries.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Use {
    /// A floor (live load L).
    Floor,
    /// A roof (roof live load Lr or snow S).
    Roof,
}

/// Service class of a prestressed flexural member, ACI 318-19 Table 24.5.2.1.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Serialize)]
pub enum ServiceClass {
    /// Uncracked: ft ≤ 7.5√f′c.
    U,
    /// Transition: 7.5√f′c < ft ≤ 12√f′c.
    T,
    /// Cracked: ft > 12√f′c.
    C,
}

impl ServiceClass {
    /// "U", "T" or "C".
    pub fn name(self) -> &'static str {
        match self {
            ServiceClass::U => "U",
            ServiceClass::T => "T",
            ServiceClass::C => "C",
        }
    }
}

/// What kind of load a load is: ASCE 7 D, L, Lr or S.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum LoadKind {
    /// Permanent (a wall, a mechanical unit's weight).
    Dead,
    /// Floor live load.
    Live,
    /// Roof live load.
    RoofLive,
    /// Snow.
    Snow,
}

impl LoadKind {
    /// Every kind, in the order of [`LoadKind::NAMES`].
    pub const ALL: [LoadKind; 4] = [LoadKind::Dead, LoadKind::Live, LoadKind::RoofLive, LoadKind::Snow];
    /// Their names, as the job file and the flags write them.
    pub const NAMES: [&'static str; 4] = ["dead", "live", "roof-live", "snow"];
    /// Its name.
    pub fn name(self) -> &'static str {
        Self::NAMES[Self::ALL.iter().position(|&k| k == self).unwrap_or(0)]
    }
    /// Whether the load varies (L, Lr, S): placed where it does most harm.
    pub fn variable(self) -> bool {
        self != LoadKind::Dead
    }
}

/// A concentrated load: a force at a place along the span and across the
/// member, over a bearing area.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PointLoad {
    /// Force, lbf.
    pub p: crate::units::Force,
    /// Place along the span from the left support.
    pub at: Length,
    /// Place across the member from its left edge (None: where it does most harm).
    pub across: Option<Length>,
    /// Size of the bearing area: along the span × across.
    pub size: (Length, Length),
}

/// A load along the span over part of it (a wall or partition running
/// along a unit): force per length from one place to another.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct StripLoad {
    /// Force per length along the span, lbf/in.
    pub w: LineLoad,
    /// Start along the span.
    pub from: Length,
    /// End along the span.
    pub to: Length,
    /// Place across the member from its left edge (None: where it does most harm).
    pub across: Option<Length>,
}

/// An area load over a rectangle of the floor.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PatchLoad {
    /// Intensity.
    pub q: AreaLoad,
    /// Start along the span.
    pub from: Length,
    /// End along the span.
    pub to: Length,
    /// Extent across the member from its left edge: (from, to).
    pub across: (Length, Length),
}

/// A load placed on the bay.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Placed {
    /// A concentrated load.
    Point(PointLoad),
    /// A load along the span.
    Strip(StripLoad),
    /// A rectangle of area load.
    Patch(PatchLoad),
}

/// A placed load and its kind.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PlacedLoad {
    /// The load.
    pub load: Placed,
    /// D, L, Lr or S.
    pub kind: LoadKind,
}

/// An opening through the floor: along the span from one place to another,
/// across the member from its left edge; a header along it may carry a
/// load of its own.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Opening {
    /// Start along the span.
    pub from: Length,
    /// End along the span.
    pub to: Length,
    /// Extent across the member from its left edge: (from, to).
    pub across: (Length, Length),
    /// Load on the header framing the opening, per length of the opening
    /// (dead), if any.
    pub header: Option<LineLoad>,
}

/// How a concentrated or partial load on hollow-core is shared between the
/// units that carry it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum UnitShare {
    /// The loaded unit carries it all (conservative; the default).
    Whole,
    /// Spread over an effective width the user gives.
    Width(Length),
    /// The published rule (PCI hollow-core manual, from memory, low
    /// confidence): 0.5ℓ over the middle half of the span, narrowing
    /// linearly to one unit's width at the supports, half near a free edge.
    Rule,
}

/// How a load on a double tee goes to its stems.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum StemShare {
    /// By statics: the lever rule between the stems either side of it
    /// (uplift on the far stem for a load beyond a stem).
    Lever,
    /// One stem carries it all (conservative).
    OneStem,
}

/// A line load across the member (a wall or partition parallel to the
/// supports): force per unit width of member at a distance from the left support.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LineLoadSpec {
    /// Force per width, lbf/in (entered as "0.8 klf").
    pub w: LineLoad,
    /// Distance from the left bearing centre.
    pub at: Length,
    /// Dead or live.
    pub kind: LoadKind,
}

/// A composite cast-in-place topping, placed unshored: its weight acts on
/// the bare member, later loads on the composite section.
#[derive(Debug, Clone, PartialEq)]
pub struct Topping {
    /// Thickness.
    pub thickness: Length,
    /// Topping concrete.
    pub mix: Mix,
}

/// How the long-term prestress loss is found.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum LossMethod {
    /// Zia, Preston, Scott & Workman (1979).
    Zia,
    /// A total loss given by the user (elastic shortening still computed
    /// for the release stresses).
    LumpSum(crate::units::Stress),
}

/// Which deflection limits of ACI 318-19 Table 24.2.2 apply.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Attachment {
    /// Not supporting or attached to nonstructural elements likely to be
    /// damaged: the immediate live-load limit only (floor ℓ/360, flat roof ℓ/180).
    None,
    /// Attached elements not likely to be damaged: also ℓ/240 after attachment.
    Tolerant,
    /// Attached elements likely to be damaged: also ℓ/480 after attachment.
    Sensitive,
}

/// One bay's design case.
#[derive(Debug, Clone, PartialEq)]
pub struct DesignCase {
    /// Span, centre to centre of bearings.
    pub span: Length,
    /// Bearing length at each end.
    pub bearing: Length,
    /// Superimposed dead load (area).
    pub sdl: AreaLoad,
    /// Live load (area).
    pub live: AreaLoad,
    /// Roof live load (area).
    pub roof_live: AreaLoad,
    /// Snow load (area).
    pub snow: AreaLoad,
    /// Sustained part of the live load, 0–1.
    pub sustained_live: f64,
    /// Line loads across the member.
    pub line_loads: Vec<LineLoadSpec>,
    /// Concentrated, along-span and patch loads.
    pub placed: Vec<PlacedLoad>,
    /// Openings through the floor.
    pub openings: Vec<Opening>,
    /// How hollow-core units share a concentrated or partial load.
    pub unit_share: UnitShare,
    /// Whether the loaded unit is at a free edge (no grouted neighbour on
    /// one side): the published rule then takes half its width.
    pub free_edge: bool,
    /// How a double tee's stems share one.
    pub stem_share: StemShare,
    /// Overhangs beyond the left and right supports (balcony, eave), from
    /// the bearing centre to the tip.
    pub overhang: (Length, Length),
    /// Mild top reinforcement over a support with an overhang, area per
    /// unit (Grade 60, in the topping or grouted keyways), in².
    pub top_bars: crate::units::Area,
    /// Composite topping, if any.
    pub topping: Option<Topping>,
    /// Floor or roof.
    pub member_use: Use,
    /// Highest service class allowed.
    pub class_allowed: ServiceClass,
    /// Average ambient relative humidity, %.
    pub humidity: f64,
    /// Age of the members at erection, days (camber with age).
    pub erection_age: f64,
    /// How much older the oldest members may be at erection, days (units
    /// cast weeks apart set side by side).
    pub erection_spread: f64,
    /// The largest camber difference allowed between adjacent units at
    /// erection, in.
    pub camber_limit: Length,
    /// Width of the bearing (pad) at each support, when the bay gives it.
    pub pad_width: Option<Length>,
    /// The bearing pad's material, if the bay names one.
    pub pad: Pad,
    /// Whether stripping, storage, transport and erection are checked.
    pub handling: bool,
    /// How the member is lifted.
    pub rigging: crate::handling::Rigging,
    /// The form finish: exposed aggregate (with retarder) instead of a
    /// smooth mould with form oil only (less form suction at stripping).
    pub exposed_finish: bool,
    /// Lift points from each end, when the bay gives them.
    pub lift_at: Option<Length>,
    /// Truck bunks from each end, when the bay gives them.
    pub bunk_at: Option<Length>,
    /// Loss method.
    pub losses: LossMethod,
    /// Required fire rating, hours (None: not required).
    pub fire_rating: Option<f64>,
    /// Restrained assembly for fire (default unrestrained, conservative).
    pub restrained: bool,
    /// Exposure for durability cover.
    pub exposure: crate::fire::Exposure,
    /// Deflection limits that apply.
    pub attachment: Attachment,
    /// Least natural frequency required, Hz (None: information only).
    pub min_frequency_hz: Option<f64>,
}

/// Default bearing length, in (common practice, no source: 3–4 in on steel
/// or concrete ledges for hollow-core, more for tees).
pub const DEFAULT_BEARING_IN: f64 = 4.0;
/// Default sustained part of the live load (common practice, no source;
/// ACI 318 does not define it).
pub const DEFAULT_SUSTAINED_LIVE: f64 = 0.3;
/// Default relative humidity, %.
pub const DEFAULT_HUMIDITY: f64 = 70.0;
/// A bearing pad's material, with the average service pressure it takes.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Pad {
    /// No pad named: the member bears on grout, mortar or the support (only
    /// ACI 318-19 22.8 is checked).
    None,
    /// Plain elastomeric.
    Elastomeric,
    /// Random-oriented fibre reinforced.
    Fibre,
    /// Cotton-duck.
    CottonDuck,
}

impl Pad {
    /// The average service pressure allowed, psi: the PCI Design Handbook's
    /// ranges, **from memory, low confidence** — plain elastomeric about
    /// 800–1000 psi (the lower end taken), random-oriented fibre about
    /// 1500 psi, cotton-duck about 2500–3000 psi (the lower end taken).
    pub fn allowable_psi(self) -> Option<f64> {
        match self {
            Pad::None => None,
            Pad::Elastomeric => Some(800.0),
            Pad::Fibre => Some(1500.0),
            Pad::CottonDuck => Some(2500.0),
        }
    }
    /// Its name in a job file.
    pub fn name(self) -> &'static str {
        match self {
            Pad::None => "none",
            Pad::Elastomeric => "elastomeric",
            Pad::Fibre => "fibre",
            Pad::CottonDuck => "cotton-duck",
        }
    }
}

/// Default limit on the camber difference between adjacent units at
/// erection, in (common practice, no source).
pub const DEFAULT_CAMBER_LIMIT_IN: f64 = 0.75;
/// Default age at erection, days (common practice, no source).
pub const DEFAULT_ERECTION_AGE: f64 = 30.0;

impl DesignCase {
    /// A floor case with the defaults and no loads.
    pub fn new(span: Length) -> DesignCase {
        DesignCase {
            span,
            bearing: Length::new(DEFAULT_BEARING_IN),
            sdl: AreaLoad::new(0.0),
            live: AreaLoad::new(0.0),
            roof_live: AreaLoad::new(0.0),
            snow: AreaLoad::new(0.0),
            sustained_live: DEFAULT_SUSTAINED_LIVE,
            line_loads: Vec::new(),
            placed: Vec::new(),
            openings: Vec::new(),
            unit_share: UnitShare::Whole,
            free_edge: false,
            stem_share: StemShare::Lever,
            overhang: (Length::new(0.0), Length::new(0.0)),
            top_bars: crate::units::Area::new(0.0),
            topping: None,
            member_use: Use::Floor,
            class_allowed: ServiceClass::U,
            humidity: DEFAULT_HUMIDITY,
            erection_age: DEFAULT_ERECTION_AGE,
            erection_spread: 0.0,
            camber_limit: Length::new(DEFAULT_CAMBER_LIMIT_IN),
            pad_width: None,
            pad: Pad::None,
            handling: true,
            rigging: crate::handling::Rigging::TwoPoint,
            exposed_finish: false,
            lift_at: None,
            bunk_at: None,
            losses: LossMethod::Zia,
            fire_rating: None,
            restrained: false,
            exposure: crate::fire::Exposure::Interior,
            attachment: Attachment::None,
            min_frequency_hz: None,
        }
    }
    /// Member length: span + bearing length, and any overhang beyond a
    /// bearing centre in place of that end's half bearing.
    pub fn member_length(&self) -> f64 {
        let (a, b) = self.ends();
        b - a
    }
    /// Where the member ends, in from the left support: (left end, right end).
    pub fn ends(&self) -> (f64, f64) {
        let half = self.bearing.get() / 2.0;
        let (a1, a2) = (self.overhang.0.get(), self.overhang.1.get());
        (
            -(if a1 > 0.0 { a1 } else { half }),
            self.span.get() + if a2 > 0.0 { a2 } else { half },
        )
    }
    /// The same case with the uniform load its use names set to `q`: the
    /// floor live load L, or for a roof both roof live load and snow (the
    /// larger of which acts). Placed loads stay as they are.
    pub fn with_varied(&self, q: AreaLoad) -> DesignCase {
        let mut c = self.clone();
        match self.member_use {
            Use::Floor => c.live = q,
            Use::Roof => {
                c.roof_live = q;
                c.snow = q;
            }
        }
        c
    }
    /// The uniform load the use names: floor live, or the larger of roof live and snow.
    pub fn varied(&self) -> AreaLoad {
        match self.member_use {
            Use::Floor => self.live,
            Use::Roof => AreaLoad::new(self.roof_load()),
        }
    }
    /// Whether the member overhangs either support.
    pub fn has_overhang(&self) -> bool {
        self.overhang.0.get() > 0.0 || self.overhang.1.get() > 0.0
    }
    /// The larger of the roof live and snow loads: "(Lr or S)" in ASCE 7.
    pub fn roof_load(&self) -> f64 {
        self.roof_live.get().max(self.snow.get())
    }
}

/// Moment (lbf·in) and shear (lbf) at x from a uniform load w (lbf/in) on span l.
pub fn uniform(w: f64, l: f64, x: f64) -> (f64, f64) {
    (w * x * (l - x) / 2.0, w * (l / 2.0 - x))
}

/// Moment and shear at x from a point load p (lbf) at a on span l.
pub fn point(p: f64, a: f64, l: f64, x: f64) -> (f64, f64) {
    if x <= a {
        (p * (l - a) * x / l, p * (l - a) / l)
    } else {
        (p * a * (l - x) / l, -p * a / l)
    }
}

/// The unfactored load effects at one station, by load group (lbf·in, lbf).
#[derive(Debug, Clone, Copy, PartialEq, Default, Serialize)]
pub struct Effects {
    /// Member self-weight, on the bare section.
    pub m_self: f64,
    /// Topping weight, on the bare section.
    pub m_topping: f64,
    /// Superimposed dead and dead line loads, on the composite section.
    pub m_sdl: f64,
    /// Live load and live line loads.
    pub m_live: f64,
    /// Roof live or snow, the larger.
    pub m_roof: f64,
    /// Shears in the same groups.
    pub v_self: f64,
    /// Shear from topping weight.
    pub v_topping: f64,
    /// Shear from superimposed dead.
    pub v_sdl: f64,
    /// Shear from live.
    pub v_live: f64,
    /// Shear from roof live or snow.
    pub v_roof: f64,
}

impl Effects {
    /// Dead-load moment, all groups.
    pub fn m_dead(&self) -> f64 {
        self.m_self + self.m_topping + self.m_sdl
    }
    /// Dead-load shear, all groups.
    pub fn v_dead(&self) -> f64 {
        self.v_self + self.v_topping + self.v_sdl
    }
}

/// A strength load combination of ASCE 7-16 §2.3.1 (gravity only).
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Combination {
    /// Its name as printed.
    pub name: &'static str,
    /// Factor on D.
    pub d: f64,
    /// Factor on L.
    pub l: f64,
    /// Factor on Lr or S.
    pub r: f64,
}

/// ASCE 7-16 §2.3.1 combinations 1–3 (reference sheet §8.1: checked against
/// the published text). Combination 3 takes 0.5L, the exception for
/// L ≤ 100 psf outside garages and assembly areas.
pub const COMBINATIONS: [Combination; 3] = [
    Combination {
        name: "1.4D",
        d: 1.4,
        l: 0.0,
        r: 0.0,
    },
    Combination {
        name: "1.2D+1.6L+0.5(Lr or S)",
        d: 1.2,
        l: 1.6,
        r: 0.5,
    },
    Combination {
        name: "1.2D+1.6(Lr or S)+0.5L",
        d: 1.2,
        l: 0.5,
        r: 1.6,
    },
];

impl Combination {
    /// Factored moment and shear.
    pub fn apply(&self, e: &Effects) -> (f64, f64) {
        (
            self.d * e.m_dead() + self.l * e.m_live + self.r * e.m_roof,
            self.d * e.v_dead() + self.l * e.v_live + self.r * e.v_roof,
        )
    }
}

/// The governing factored moment and shear at a station, with the names of
/// the combinations that give them.
pub fn factored(e: &Effects) -> (f64, &'static str, f64, &'static str) {
    let mut best_m = (f64::NEG_INFINITY, "");
    let mut best_v = (f64::NEG_INFINITY, "");
    for c in &COMBINATIONS {
        let (m, v) = c.apply(e);
        if m > best_m.0 {
            best_m = (m, c.name);
        }
        if v.abs() > best_v.0 {
            best_v = (v.abs(), c.name);
        }
    }
    (best_m.0, best_m.1, best_v.0, best_v.1)
}

/// Service moments: (sustained, total), lbf·in. Sustained = D + ψL; total
/// is the largest of D + L, D + (Lr or S) and D + 0.75L + 0.75(Lr or S),
/// the gravity combinations of ASCE 7-16 §2.4.1 (ACI 318 prescribes no
/// service factors).
pub fn service_moments(e: &Effects, sustained_live: f64) -> (f64, f64) {
    let d = e.m_dead();
    let total = (d + e.m_live).max(d + e.m_roof).max(d + 0.75 * e.m_live + 0.75 * e.m_roof);
    (d + sustained_live * e.m_live, total)
}

/// The least service moment (lbf·in): the most hogging of D alone, the
/// sustained D + ψL and the total combinations of [`service_moments`] —
/// where an overhang's loads hog, the variable loads add to it.
pub fn service_least(e: &Effects, sustained_live: f64) -> f64 {
    let d = e.m_dead();
    d.min(d + sustained_live * e.m_live)
        .min(d + e.m_live)
        .min(d + e.m_roof)
        .min(d + 0.75 * e.m_live + 0.75 * e.m_roof)
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn beam_formulas() {
        // wL²/8 and wL/2 (any statics text).
        let (m, v) = uniform(2.0, 120.0, 60.0);
        assert_relative_eq!(m, 2.0 * 120.0 * 120.0 / 8.0);
        assert_relative_eq!(v, 0.0);
        assert_relative_eq!(uniform(2.0, 120.0, 0.0).1, 120.0);
        // P at a: M = P a b / L under the load
        let (m, v) = point(10.0, 30.0, 120.0, 30.0);
        assert_relative_eq!(m, 10.0 * 30.0 * 90.0 / 120.0);
        assert_relative_eq!(v, 7.5);
        assert_relative_eq!(point(10.0, 30.0, 120.0, 60.0).1, -2.5);
    }

    #[test]
    fn governing_combination_is_named() {
        let e = Effects {
            m_self: 100.0,
            m_live: 100.0,
            ..Effects::default()
        };
        let (m, name, _, _) = factored(&e);
        assert_relative_eq!(m, 1.2 * 100.0 + 1.6 * 100.0);
        assert_eq!(name, "1.2D+1.6L+0.5(Lr or S)");
        let dead_only = Effects {
            m_self: 100.0,
            ..Effects::default()
        };
        assert_eq!(factored(&dead_only).1, "1.4D");
        let roof = Effects {
            m_self: 100.0,
            m_roof: 80.0,
            ..Effects::default()
        };
        assert_eq!(factored(&roof).1, "1.2D+1.6(Lr or S)+0.5L");
        let (sus, tot) = service_moments(&e, 0.3);
        assert_relative_eq!(sus, 130.0);
        assert_relative_eq!(tot, 200.0);
    }
}

//! One definition of each bay criterion: its key in the job file, its flag
//! on the command line, its label in the UI, the kind of value it takes,
//! its default and the range it allows, how text is read into a bay and how
//! the bay's value is written back. The job reader, the job writer, the
//! command-line flags and the UI editor all go through [`CRITERIA`], so the
//! same value is accepted or refused the same way, with the same words,
//! wherever it is typed.
//!
//! Every value arrives as text: a TOML string as it is, a TOML number or
//! boolean as it would be typed, a TOML list as its items joined by ", ";
//! a flag's text; what was typed in the UI.

use crate::bay::{Bay, Objective};
use crate::case::{Attachment, LossMethod, ServiceClass, StemShare, UnitShare, Use};
use crate::fire::Exposure;
use crate::input::diag::suggestion;
use crate::section::Family;
use crate::units::{Area, AreaLoad, Duration, Length, Stress, System, fmt_ft_in, trim_number};

/// The kinds of quantity a criterion takes.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Quantity {
    /// A length (in).
    Length,
    /// An area load (psi internally).
    AreaLoad,
    /// A stress (psi).
    Stress,
    /// An area (in²).
    Area,
    /// A force (lbf).
    Force,
    /// A force per length (lbf/in).
    LineLoad,
}

impl Quantity {
    /// Read a quantity of this kind (internal units).
    pub fn parse(self, text: &str) -> Result<f64, String> {
        let r = match self {
            Quantity::Length => Length::parse(text).map(|q| q.get()),
            Quantity::AreaLoad => AreaLoad::parse(text).map(|q| q.get()),
            Quantity::Stress => Stress::parse(text).map(|q| q.get()),
            Quantity::Area => Area::parse(text).map(|q| q.get()),
            Quantity::Force => crate::units::Force::parse(text).map(|q| q.get()),
            Quantity::LineLoad => crate::units::LineLoad::parse(text).map(|q| q.get()),
        };
        r.map_err(|e| e.to_string())
    }
    /// The value (internal units) in `unit`.
    pub fn in_unit(self, v: f64, unit: &str) -> f64 {
        match self {
            Quantity::Length => Length::new(v).in_unit(unit),
            Quantity::AreaLoad => AreaLoad::new(v).in_unit(unit),
            Quantity::Stress => Stress::new(v).in_unit(unit),
            Quantity::Area => Area::new(v).in_unit(unit),
            Quantity::Force => crate::units::Force::new(v).in_unit(unit),
            Quantity::LineLoad => crate::units::LineLoad::new(v).in_unit(unit),
        }
    }
    /// The plain name, for messages and the schema ("a length").
    pub fn name(self) -> &'static str {
        use crate::units::Kind;
        match self {
            Quantity::Length => crate::units::LengthK::NAME,
            Quantity::AreaLoad => crate::units::AreaLoadK::NAME,
            Quantity::Stress => crate::units::StressK::NAME,
            Quantity::Area => crate::units::AreaK::NAME,
            Quantity::Force => crate::units::ForceK::NAME,
            Quantity::LineLoad => crate::units::LineLoadK::NAME,
        }
    }
}

/// An allowed range, in `unit`.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Range {
    /// Least value.
    pub lo: f64,
    /// Greatest value.
    pub hi: f64,
    /// Unit of `lo` and `hi` (a quantity's unit, or a word for a number).
    pub unit: &'static str,
}

/// The kind of value a criterion takes.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Form {
    /// A quantity within a range; `optional`: may be absent (no default).
    Quantity {
        /// Its kind.
        q: Quantity,
        /// Allowed range.
        range: Range,
    },
    /// A plain number within a range.
    Number {
        /// Allowed range.
        range: Range,
    },
    /// A whole number within a range.
    Count {
        /// Least.
        lo: i64,
        /// Greatest.
        hi: i64,
    },
    /// One of a set of words.
    Choice(&'static [&'static str]),
    /// Yes or no.
    Flag,
    /// A fire rating: "none" or a tabulated duration.
    Rating,
    /// A list of quantities, each within the range, or "none".
    QuantityList {
        /// Its kind.
        q: Quantity,
        /// Allowed range.
        range: Range,
    },
    /// A list of words from a set; never empty.
    ChoiceList(&'static [&'static str]),
    /// Free text (no control characters).
    Text,
    /// One of a set of words, or a quantity within a range.
    ChoiceOrQuantity {
        /// The words.
        choices: &'static [&'static str],
        /// The quantity's kind.
        q: Quantity,
        /// Its allowed range.
        range: Range,
    },
}

/// A criterion's value, in internal units.
#[derive(Debug, Clone, PartialEq)]
pub enum Value {
    /// A number or quantity (absent when None).
    Num(Option<f64>),
    /// A whole number (absent when None).
    Count(Option<u32>),
    /// The index of a choice.
    Pick(usize),
    /// Yes or no.
    Flag(bool),
    /// Quantities, None for "none".
    List(Vec<Option<f64>>),
    /// Choices.
    Picks(Vec<usize>),
    /// Text (absent when None).
    Text(Option<String>),
}

/// One bay criterion.
#[derive(Debug, Clone, Copy)]
pub struct Criterion {
    /// Key in the job file.
    pub key: &'static str,
    /// Label in the UI.
    pub label: &'static str,
    /// Flag on the command line (without the dashes), if it has one.
    pub flag: Option<&'static str>,
    /// What it means, for help, the reference and the schema.
    pub help: &'static str,
    /// The value it takes.
    pub form: Form,
    /// The default, as text ("" when there is none: absent, or required).
    pub default: &'static str,
    /// Whether a bay must give it.
    pub required: bool,
    /// Whether `[defaults]` may give it for every bay.
    pub inherit: bool,
    /// Display units of a quantity: (US, SI); "ft-in" shows feet and inches.
    pub units: (&'static str, &'static str),
    get: fn(&Bay) -> Value,
    set: fn(&mut Bay, Value),
}

const LENGTH: Quantity = Quantity::Length;
const LOAD: Quantity = Quantity::AreaLoad;

const USES: &[&str] = &["floor", "roof"];
const CLASSES: &[&str] = &["U", "T", "C"];
const EXPOSURES: &[&str] = &["interior", "weather"];
const ATTACHED: &[&str] = &["none", "tolerant", "sensitive"];
const OBJECTIVES: &[&str] = &["lightest", "shallowest", "least-steel", "cheapest", "most-reserve"];
const FAMILIES: &[&str] = &["hollow-core", "double-tee", "generic"];
const SHARES: &[&str] = &["whole", "rule"];
const STEM_SHARES: &[&str] = &["lever", "one"];
const HANDLING: &[&str] = &["checked", "not-checked"];
const FINISHES: &[&str] = &["smooth", "exposed"];
const PADS: &[&str] = &["none", "elastomeric", "fibre", "cotton-duck"];
const RIGGINGS: &[&str] = &["two-point", "four-point"];

/// The area-load range every load criterion allows, psf.
const LOAD_RANGE: Range = Range {
    lo: 0.0,
    hi: 2000.0,
    unit: "psf",
};

fn num(v: &Value) -> f64 {
    match v {
        Value::Num(Some(x)) => *x,
        _ => 0.0,
    }
}

fn pick(v: &Value) -> usize {
    match v {
        Value::Pick(i) => *i,
        _ => 0,
    }
}

/// Every bay criterion, in the order they are read (a later one may depend
/// on an earlier: line loads lie within the span) and shown.
pub const CRITERIA: &[Criterion] = &[
    Criterion {
        key: "span",
        label: "Span",
        flag: Some("span"),
        help: "span, centre to centre of bearings",
        form: Form::Quantity {
            q: LENGTH,
            range: Range {
                lo: 2.0,
                hi: 200.0,
                unit: "ft",
            },
        },
        default: "",
        required: true,
        inherit: false,
        units: ("ft-in", "m"),
        get: |b| Value::Num(Some(b.case.span.get())),
        set: |b, v| b.case.span = Length::new(num(&v)),
    },
    Criterion {
        key: "sdl",
        label: "Dead (SDL)",
        flag: Some("sdl"),
        help: "superimposed dead load",
        form: Form::Quantity {
            q: LOAD,
            range: LOAD_RANGE,
        },
        default: "0 psf",
        required: false,
        inherit: false,
        units: ("psf", "kPa"),
        get: |b| Value::Num(Some(b.case.sdl.get())),
        set: |b, v| b.case.sdl = AreaLoad::new(num(&v)),
    },
    Criterion {
        key: "live",
        label: "Live",
        flag: Some("live"),
        help: "live load (L)",
        form: Form::Quantity {
            q: LOAD,
            range: LOAD_RANGE,
        },
        default: "0 psf",
        required: false,
        inherit: false,
        units: ("psf", "kPa"),
        get: |b| Value::Num(Some(b.case.live.get())),
        set: |b, v| b.case.live = AreaLoad::new(num(&v)),
    },
    Criterion {
        key: "roof_live",
        label: "Roof live",
        flag: Some("roof-live"),
        help: "roof live load (Lr)",
        form: Form::Quantity {
            q: LOAD,
            range: LOAD_RANGE,
        },
        default: "0 psf",
        required: false,
        inherit: false,
        units: ("psf", "kPa"),
        get: |b| Value::Num(Some(b.case.roof_live.get())),
        set: |b, v| b.case.roof_live = AreaLoad::new(num(&v)),
    },
    Criterion {
        key: "snow",
        label: "Snow",
        flag: Some("snow"),
        help: "snow load (S)",
        form: Form::Quantity {
            q: LOAD,
            range: LOAD_RANGE,
        },
        default: "0 psf",
        required: false,
        inherit: false,
        units: ("psf", "kPa"),
        get: |b| Value::Num(Some(b.case.snow.get())),
        set: |b, v| b.case.snow = AreaLoad::new(num(&v)),
    },
    Criterion {
        key: "use",
        label: "Use",
        flag: Some("use"),
        help: "floor (live load L, ℓ/360) or roof (Lr or S, ℓ/180)",
        form: Form::Choice(USES),
        default: "floor",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Pick(if b.case.member_use == Use::Roof { 1 } else { 0 }),
        set: |b, v| b.case.member_use = if pick(&v) == 1 { Use::Roof } else { Use::Floor },
    },
    Criterion {
        key: "toppings",
        label: "Topping",
        flag: Some("toppings"),
        help: "composite topping thicknesses to try, \"none\" for none, e.g. \"none, 2 in\"",
        form: Form::QuantityList {
            q: LENGTH,
            range: Range {
                lo: 0.5,
                hi: 12.0,
                unit: "in",
            },
        },
        default: "none",
        required: false,
        inherit: true,
        units: ("in", "mm"),
        get: |b| Value::List(b.toppings.iter().map(|t| t.map(|l| l.get())).collect()),
        set: |b, v| {
            if let Value::List(l) = v {
                b.toppings = l.into_iter().map(|t| t.map(Length::new)).collect()
            }
        },
    },
    Criterion {
        key: "topping_mix",
        label: "Topping mix",
        flag: Some("topping-mix"),
        help: "the catalog mix id of the topping concrete (default 4000 psi normalweight at 150 pcf)",
        form: Form::Text,
        default: "",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Text(b.topping_mix.clone()),
        set: |b, v| {
            if let Value::Text(t) = v {
                b.topping_mix = t
            }
        },
    },
    Criterion {
        key: "fire",
        label: "Fire",
        flag: Some("fire"),
        help: "required fire rating: none, 1, 1.5, 2, 3 or 4 h (\"none\" drops an inherited rating)",
        form: Form::Rating,
        default: "none",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Num(b.case.fire_rating),
        set: |b, v| {
            if let Value::Num(h) = v {
                b.case.fire_rating = h
            }
        },
    },
    Criterion {
        key: "restrained",
        label: "Restraint",
        flag: Some("restrained"),
        help: "the assembly is restrained for fire (unrestrained is the conservative default)",
        form: Form::Flag,
        default: "false",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Flag(b.case.restrained),
        set: |b, v| b.case.restrained = v == Value::Flag(true),
    },
    Criterion {
        key: "class",
        label: "Class",
        flag: Some("class"),
        help: "highest service class allowed (ACI 318-19 Table 24.5.2.1): U, T or C",
        form: Form::Choice(CLASSES),
        default: "U",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Pick(b.case.class_allowed as usize),
        set: |b, v| b.case.class_allowed = [ServiceClass::U, ServiceClass::T, ServiceClass::C][pick(&v).min(2)],
    },
    Criterion {
        key: "objective",
        label: "Objective",
        flag: Some("objective"),
        help: "how to rank the members that work (ties broken by the others in this order, then by id)",
        form: Form::Choice(OBJECTIVES),
        default: "lightest",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Pick(Objective::ALL.iter().position(|&o| o == b.objective).unwrap_or(0)),
        set: |b, v| b.objective = Objective::ALL[pick(&v).min(Objective::ALL.len() - 1)],
    },
    Criterion {
        key: "exposure",
        label: "Exposure",
        flag: Some("exposure"),
        help: "interior, or weather (exposed to weather or in contact with ground: more cover)",
        form: Form::Choice(EXPOSURES),
        default: "interior",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Pick(if b.case.exposure == Exposure::Weather { 1 } else { 0 }),
        set: |b, v| b.case.exposure = if pick(&v) == 1 { Exposure::Weather } else { Exposure::Interior },
    },
    Criterion {
        key: "attached",
        label: "Attached",
        flag: Some("attached"),
        help: "nonstructural elements attached: none, tolerant (ℓ/240 after attachment) or sensitive (ℓ/480)",
        form: Form::Choice(ATTACHED),
        default: "none",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| {
            Value::Pick(match b.case.attachment {
                Attachment::None => 0,
                Attachment::Tolerant => 1,
                Attachment::Sensitive => 2,
            })
        },
        set: |b, v| b.case.attachment = [Attachment::None, Attachment::Tolerant, Attachment::Sensitive][pick(&v).min(2)],
    },
    Criterion {
        key: "bearing",
        label: "Bearing",
        flag: Some("bearing"),
        help: "bearing length at each end; member length = span + bearing",
        form: Form::Quantity {
            q: LENGTH,
            range: Range {
                lo: 0.5,
                hi: 24.0,
                unit: "in",
            },
        },
        default: "4 in",
        required: false,
        inherit: true,
        units: ("in", "mm"),
        get: |b| Value::Num(Some(b.case.bearing.get())),
        set: |b, v| b.case.bearing = Length::new(num(&v)),
    },
    Criterion {
        key: "pad_width",
        label: "Pad width",
        flag: Some("pad-width"),
        help: "width of the bearing at each support (ACI 318-19 22.8 bearing area = width × (bearing − ½ in)); default the unit's width, or a double tee's stems",
        form: Form::Quantity {
            q: LENGTH,
            range: Range {
                lo: 1.0,
                hi: 240.0,
                unit: "in",
            },
        },
        default: "",
        required: false,
        inherit: true,
        units: ("in", "mm"),
        get: |b| Value::Num(b.case.pad_width.map(|w| w.get())),
        set: |b, v| {
            b.case.pad_width = match v {
                Value::Num(Some(x)) => Some(Length::new(x)),
                _ => None,
            }
        },
    },
    Criterion {
        key: "pad",
        label: "Bearing pad",
        flag: Some("pad"),
        help: "the bearing pad's material: none, elastomeric, fibre or cotton-duck (its average service pressure, PCI, from memory, low confidence)",
        form: Form::Choice(PADS),
        default: "none",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| {
            Value::Pick(match b.case.pad {
                crate::case::Pad::None => 0,
                crate::case::Pad::Elastomeric => 1,
                crate::case::Pad::Fibre => 2,
                crate::case::Pad::CottonDuck => 3,
            })
        },
        set: |b, v| {
            b.case.pad = match pick(&v) {
                1 => crate::case::Pad::Elastomeric,
                2 => crate::case::Pad::Fibre,
                3 => crate::case::Pad::CottonDuck,
                _ => crate::case::Pad::None,
            }
        },
    },
    Criterion {
        key: "handling",
        label: "Handling",
        flag: Some("handling"),
        help: "check stripping, yard storage, transport and erection (PCI handling multipliers and limits, from memory), or leave them to the producer",
        form: Form::Choice(HANDLING),
        default: "checked",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Pick(if b.case.handling { 0 } else { 1 }),
        set: |b, v| b.case.handling = pick(&v) == 0,
    },
    Criterion {
        key: "rigging",
        label: "Rigging",
        flag: Some("rigging"),
        help: "how the member is lifted: two-point (slings at 0.207 L from each end) or four-point (equalising, 0.104 L and 0.396 L)",
        form: Form::Choice(RIGGINGS),
        default: "two-point",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| {
            Value::Pick(if b.case.rigging == crate::handling::Rigging::FourPoint {
                1
            } else {
                0
            })
        },
        set: |b, v| {
            b.case.rigging = if pick(&v) == 1 {
                crate::handling::Rigging::FourPoint
            } else {
                crate::handling::Rigging::TwoPoint
            }
        },
    },
    Criterion {
        key: "finish",
        label: "Form finish",
        flag: Some("finish"),
        help: "the form's finish at stripping: smooth (mould with form oil only) or exposed (exposed aggregate with retarder: less form suction)",
        form: Form::Choice(FINISHES),
        default: "smooth",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Pick(if b.case.exposed_finish { 1 } else { 0 }),
        set: |b, v| b.case.exposed_finish = pick(&v) == 1,
    },
    Criterion {
        key: "lift_at",
        label: "Lift points",
        flag: Some("lift-at"),
        help: "lift points (and dunnage) from each end of the member, instead of the rigging's own",
        form: Form::Quantity {
            q: LENGTH,
            range: Range {
                lo: 0.0,
                hi: 60.0,
                unit: "ft",
            },
        },
        default: "",
        required: false,
        inherit: true,
        units: ("ft-in", "m"),
        get: |b| Value::Num(b.case.lift_at.map(|w| w.get())),
        set: |b, v| {
            b.case.lift_at = match v {
                Value::Num(Some(x)) => Some(Length::new(x)),
                _ => None,
            }
        },
    },
    Criterion {
        key: "bunk_at",
        label: "Truck bunks",
        flag: Some("bunk-at"),
        help: "truck bunks from each end of the member in transport, instead of the lift points",
        form: Form::Quantity {
            q: LENGTH,
            range: Range {
                lo: 0.0,
                hi: 60.0,
                unit: "ft",
            },
        },
        default: "",
        required: false,
        inherit: true,
        units: ("ft-in", "m"),
        get: |b| Value::Num(b.case.bunk_at.map(|w| w.get())),
        set: |b, v| {
            b.case.bunk_at = match v {
                Value::Num(Some(x)) => Some(Length::new(x)),
                _ => None,
            }
        },
    },
    Criterion {
        key: "overhang_left",
        label: "Overhang (L)",
        flag: Some("overhang-left"),
        help: "overhang beyond the left support (a balcony, an eave), bearing centre to tip",
        form: Form::Quantity {
            q: LENGTH,
            range: Range {
                lo: 0.0,
                hi: 30.0,
                unit: "ft",
            },
        },
        default: "0 ft",
        required: false,
        inherit: false,
        units: ("ft-in", "m"),
        get: |b| Value::Num(Some(b.case.overhang.0.get())),
        set: |b, v| b.case.overhang.0 = Length::new(num(&v)),
    },
    Criterion {
        key: "overhang_right",
        label: "Overhang (R)",
        flag: Some("overhang-right"),
        help: "overhang beyond the right support, bearing centre to tip",
        form: Form::Quantity {
            q: LENGTH,
            range: Range {
                lo: 0.0,
                hi: 30.0,
                unit: "ft",
            },
        },
        default: "0 ft",
        required: false,
        inherit: false,
        units: ("ft-in", "m"),
        get: |b| Value::Num(Some(b.case.overhang.1.get())),
        set: |b, v| b.case.overhang.1 = Length::new(num(&v)),
    },
    Criterion {
        key: "top_bars",
        label: "Top bars",
        flag: Some("top-bars"),
        help: "mild top reinforcement over a support with an overhang, area per unit (Grade 60, centroid 2 in below the top: in the topping or grouted keyways)",
        form: Form::Quantity {
            q: Quantity::Area,
            range: Range {
                lo: 0.0,
                hi: 20.0,
                unit: "in2",
            },
        },
        default: "0 in2",
        required: false,
        inherit: false,
        units: ("in2", "mm2"),
        get: |b| Value::Num(Some(b.case.top_bars.get())),
        set: |b, v| b.case.top_bars = Area::new(num(&v)),
    },
    Criterion {
        key: "share",
        label: "Share (units)",
        flag: Some("share"),
        help: "how hollow-core units share a point, strip or patch load: whole (the loaded unit carries it all; conservative), rule (the published distribution width, from memory — low confidence), or an effective width such as \"8 ft\"",
        form: Form::ChoiceOrQuantity {
            choices: SHARES,
            q: LENGTH,
            range: Range {
                lo: 1.0,
                hi: 100.0,
                unit: "ft",
            },
        },
        default: "whole",
        required: false,
        inherit: true,
        units: ("ft-in", "m"),
        get: |b| match b.case.unit_share {
            UnitShare::Whole => Value::Pick(0),
            UnitShare::Rule => Value::Pick(1),
            UnitShare::Width(w) => Value::Num(Some(w.get())),
        },
        set: |b, v| {
            b.case.unit_share = match v {
                Value::Pick(1) => UnitShare::Rule,
                Value::Num(Some(w)) => UnitShare::Width(Length::new(w)),
                _ => UnitShare::Whole,
            }
        },
    },
    Criterion {
        key: "free_edge",
        label: "Free edge",
        flag: Some("free-edge"),
        help: "the loaded unit has no grouted neighbour on one side (the published rule then takes half its width)",
        form: Form::Flag,
        default: "false",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Flag(b.case.free_edge),
        set: |b, v| b.case.free_edge = v == Value::Flag(true),
    },
    Criterion {
        key: "stem_share",
        label: "Share (stems)",
        flag: Some("stem-share"),
        help: "how a double tee's stems share a load: lever (statics across the flange) or one (one stem carries it all; conservative)",
        form: Form::Choice(STEM_SHARES),
        default: "lever",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Pick(if b.case.stem_share == StemShare::OneStem { 1 } else { 0 }),
        set: |b, v| b.case.stem_share = if pick(&v) == 1 { StemShare::OneStem } else { StemShare::Lever },
    },
    Criterion {
        key: "sustained",
        label: "Sustained",
        flag: Some("sustained"),
        help: "sustained part of the live load, 0 to 1",
        form: Form::Number {
            range: Range {
                lo: 0.0,
                hi: 1.0,
                unit: "(a fraction of the live load)",
            },
        },
        default: "0.3",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Num(Some(b.case.sustained_live)),
        set: |b, v| b.case.sustained_live = num(&v),
    },
    Criterion {
        key: "humidity",
        label: "Humidity",
        flag: Some("humidity"),
        help: "average ambient relative humidity, % (shrinkage and creep)",
        form: Form::Number {
            range: Range {
                lo: 20.0,
                hi: 100.0,
                unit: "%",
            },
        },
        default: "70",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Num(Some(b.case.humidity)),
        set: |b, v| b.case.humidity = num(&v),
    },
    Criterion {
        key: "erection_age",
        label: "Erection age",
        flag: Some("erection-age"),
        help: "age of the members when erected, days (camber with age by ACI 209R-92; 30 by common practice, no source)",
        form: Form::Number {
            range: Range {
                lo: 3.0,
                hi: 720.0,
                unit: "days",
            },
        },
        default: "30",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Num(Some(b.case.erection_age)),
        set: |b, v| b.case.erection_age = num(&v),
    },
    Criterion {
        key: "erection_spread",
        label: "Age spread",
        flag: Some("erection-spread"),
        help: "how much older the oldest units may be at erection, days (their camber differs from the youngest's)",
        form: Form::Number {
            range: Range {
                lo: 0.0,
                hi: 720.0,
                unit: "days",
            },
        },
        default: "0",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Num(Some(b.case.erection_spread)),
        set: |b, v| b.case.erection_spread = num(&v),
    },
    Criterion {
        key: "camber_limit",
        label: "Camber diff.",
        flag: Some("camber-limit"),
        help: "largest camber difference allowed between adjacent units at erection (3/4 in by common practice, no source)",
        form: Form::Quantity {
            q: LENGTH,
            range: Range {
                lo: 0.1,
                hi: 6.0,
                unit: "in",
            },
        },
        default: "0.75 in",
        required: false,
        inherit: true,
        units: ("in", "mm"),
        get: |b| Value::Num(Some(b.case.camber_limit.get())),
        set: |b, v| b.case.camber_limit = Length::new(num(&v)),
    },
    Criterion {
        key: "lump_loss",
        label: "Lump-sum loss",
        flag: Some("lump-loss"),
        help: "total prestress loss as a lump sum instead of Zia et al. (1979)",
        form: Form::Quantity {
            q: Quantity::Stress,
            range: Range {
                lo: 0.0,
                hi: 100.0,
                unit: "ksi",
            },
        },
        default: "",
        required: false,
        inherit: true,
        units: ("ksi", "MPa"),
        get: |b| {
            Value::Num(match b.case.losses {
                LossMethod::LumpSum(v) => Some(v.get()),
                LossMethod::Zia => None,
            })
        },
        set: |b, v| {
            b.case.losses = match v {
                Value::Num(Some(x)) => LossMethod::LumpSum(Stress::new(x)),
                _ => LossMethod::Zia,
            }
        },
    },
    Criterion {
        key: "min_frequency",
        label: "Least frequency",
        flag: Some("min-frequency"),
        help: "least natural frequency required, Hz (otherwise only reported)",
        form: Form::Number {
            range: Range {
                lo: 0.5,
                hi: 50.0,
                unit: "Hz",
            },
        },
        default: "",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| Value::Num(b.case.min_frequency_hz),
        set: |b, v| {
            if let Value::Num(f) = v {
                b.case.min_frequency_hz = f
            }
        },
    },
    Criterion {
        key: "families",
        label: "Families",
        flag: Some("families"),
        help: "the member families to try: hollow-core, double-tee, generic (all when not given)",
        form: Form::ChoiceList(FAMILIES),
        default: "",
        required: false,
        inherit: true,
        units: ("", ""),
        get: |b| {
            Value::Picks(
                b.families
                    .iter()
                    .map(|f| match f {
                        Family::HollowCore => 0,
                        Family::DoubleTee => 1,
                        Family::Generic => 2,
                    })
                    .collect(),
            )
        },
        set: |b, v| {
            if let Value::Picks(p) = v {
                b.families = p
                    .into_iter()
                    .map(|i| [Family::HollowCore, Family::DoubleTee, Family::Generic][i.min(2)])
                    .collect()
            }
        },
    },
    Criterion {
        key: "area",
        label: "Plan area",
        flag: None,
        help: "plan area of the bay, for the number of pieces",
        form: Form::Quantity {
            q: Quantity::Area,
            range: Range {
                lo: 1.0,
                hi: 1.0e7,
                unit: "ft2",
            },
        },
        default: "",
        required: false,
        inherit: false,
        units: ("ft2", "m2"),
        get: |b| Value::Num(b.area.map(|a| a.get())),
        set: |b, v| {
            if let Value::Num(a) = v {
                b.area = a.map(Area::new)
            }
        },
    },
    Criterion {
        key: "pieces",
        label: "Pieces",
        flag: None,
        help: "number of pieces (otherwise from the plan area)",
        form: Form::Count { lo: 1, hi: 100_000 },
        default: "",
        required: false,
        inherit: false,
        units: ("", ""),
        get: |b| Value::Count(b.pieces),
        set: |b, v| {
            if let Value::Count(p) = v {
                b.pieces = p
            }
        },
    },
    Criterion {
        key: "beside",
        label: "Beside bay",
        flag: None,
        help: "the bay whose units sit beside this bay's along a shared line: the shortlist compares the cambers at erection of the two bays' first members",
        form: Form::Text,
        default: "",
        required: false,
        inherit: false,
        units: ("", ""),
        get: |b| Value::Text(b.beside.clone()),
        set: |b, v| {
            b.beside = match v {
                Value::Text(Some(t)) if !t.trim().is_empty() => Some(t),
                _ => None,
            }
        },
    },
    Criterion {
        key: "name",
        label: "Name",
        flag: None,
        help: "the bay's name, unique in the job",
        form: Form::Text,
        default: "",
        required: true,
        inherit: false,
        units: ("", ""),
        get: |b| Value::Text(Some(b.name.clone())),
        set: |b, v| {
            if let Value::Text(Some(t)) = v {
                b.name = t
            }
        },
    },
];

/// A criterion by its job-file key.
pub fn find(key: &str) -> Option<&'static Criterion> {
    CRITERIA.iter().find(|c| c.key == key)
}

/// Control characters that must never reach a terminal or a report: C0
/// except tab, DEL, C1 (ESC among them), and the bidirectional overrides
/// and isolates (U+202A–U+202E, U+2066–U+2069). The first one and its
/// place, or None.
pub fn control_char(s: &str) -> Option<(usize, char)> {
    s.chars().enumerate().find(|&(_, c)| crate::input::is_control(c))
}

/// `s` quoted for a message, every control character escaped.
pub fn quoted(s: &str) -> String {
    format!("'{}'", crate::input::escape_controls(s))
}

/// Text that may reach a terminal or a report: refused when it holds a
/// control character.
pub fn check_text(s: &str) -> Result<(), String> {
    match control_char(s) {
        Some((i, c)) => Err(format!(
            "{} holds the control character {} at character {}; plain text only (a tab is allowed)",
            quoted(s),
            c.escape_unicode(),
            i + 1
        )),
        None => Ok(()),
    }
}

/// A refusal's allowed range in the display system: "… outside the
/// allowed range 2 to 200 ft" reads "… 0.61 to 61 m" in SI. Other words
/// are kept (the user's own text is quoted as typed).
pub fn range_in(message: &str, sys: System) -> String {
    const AT: &str = "allowed range ";
    let Some(i) = message.find(AT) else { return message.to_string() };
    if sys == System::Us {
        return message.to_string();
    }
    let rest = &message[i + AT.len()..];
    let mut words = rest.splitn(4, ' ');
    let (Some(lo), Some("to"), Some(hi), Some(unit)) = (words.next(), words.next(), words.next(), words.next()) else {
        return message.to_string();
    };
    let (Ok(lo), Ok(hi)) = (lo.parse::<f64>(), hi.parse::<f64>()) else {
        return message.to_string();
    };
    match crate::units::display::find(unit.trim()) {
        Some(r) => format!(
            "{}{AT}{} to {} {}",
            &message[..i],
            significant3(lo * r.factor),
            significant3(hi * r.factor),
            r.si
        ),
        None => message.to_string(),
    }
}

pub(crate) fn range_error(text: &str, r: &Range) -> String {
    format!(
        "{} is outside the allowed range {} to {} {}",
        quoted(text.trim()),
        trim_number(r.lo, 6),
        trim_number(r.hi, 6),
        r.unit
    )
}

pub(crate) fn choose(text: &str, choices: &[&str]) -> Result<usize, String> {
    let t = text.trim();
    choices.iter().position(|c| c.eq_ignore_ascii_case(t)).ok_or_else(|| {
        format!(
            "{} is not allowed{}; use one of: {}",
            quoted(t),
            suggestion(t, choices.iter().copied()),
            choices.join(", ")
        )
    })
}

fn items(text: &str) -> Vec<&str> {
    text.split(',').map(str::trim).filter(|p| !p.is_empty()).collect()
}

impl Criterion {
    /// Read text into a value, or say what is wrong in words every route shows.
    pub fn parse(&self, text: &str) -> Result<Value, String> {
        match self.form {
            Form::Quantity { q, range } => {
                if !self.required && self.default.is_empty() && text.trim().eq_ignore_ascii_case("none") {
                    return Ok(Value::Num(None));
                }
                let v = q.parse(text)?;
                let x = q.in_unit(v, range.unit);
                if !(range.lo..=range.hi).contains(&x) {
                    return Err(range_error(text, &range));
                }
                Ok(Value::Num(Some(v)))
            }
            Form::Number { range } => {
                if !self.required && self.default.is_empty() && text.trim().eq_ignore_ascii_case("none") {
                    return Ok(Value::Num(None));
                }
                let v: f64 = text
                    .trim()
                    .parse()
                    .ok()
                    .filter(|v: &f64| v.is_finite())
                    .ok_or_else(|| format!("{} is not a number", quoted(text.trim())))?;
                if !(range.lo..=range.hi).contains(&v) {
                    return Err(range_error(text, &range));
                }
                Ok(Value::Num(Some(v)))
            }
            Form::Count { lo, hi } => {
                if !self.required && self.default.is_empty() && text.trim().eq_ignore_ascii_case("none") {
                    return Ok(Value::Count(None));
                }
                let v: i64 = text
                    .trim()
                    .parse()
                    .map_err(|_| format!("{} is not a whole number", quoted(text.trim())))?;
                if !(lo..=hi).contains(&v) {
                    return Err(format!("{v} is outside the allowed range {lo} to {hi}"));
                }
                Ok(Value::Count(Some(v as u32)))
            }
            Form::Choice(choices) => choose(text, choices).map(Value::Pick),
            Form::ChoiceOrQuantity { choices, q, range } => {
                if let Ok(i) = choose(text, choices) {
                    return Ok(Value::Pick(i));
                }
                let t = text.trim();
                if !t.starts_with(|c: char| c.is_ascii_digit() || c == '.') {
                    return Err(format!(
                        "{} is not allowed{}; use one of: {}, or {} such as \"8 ft\"",
                        quoted(t),
                        suggestion(t, choices.iter().copied()),
                        choices.join(", "),
                        q.name()
                    ));
                }
                let v = q.parse(text)?;
                if !(range.lo..=range.hi).contains(&q.in_unit(v, range.unit)) {
                    return Err(range_error(text, &range));
                }
                Ok(Value::Num(Some(v)))
            }
            Form::Flag => match text.trim() {
                "true" | "yes" => Ok(Value::Flag(true)),
                "false" | "no" => Ok(Value::Flag(false)),
                t => Err(format!("{} is not true or false", quoted(t))),
            },
            Form::Rating => {
                let t = text.trim();
                if t.eq_ignore_ascii_case("none") {
                    return Ok(Value::Num(None));
                }
                let h = Duration::parse(t).map_err(|e| e.to_string())?.get();
                if crate::fire::RATINGS.iter().any(|r| (r - h).abs() < 1e-9) {
                    Ok(Value::Num(Some(h)))
                } else {
                    Err(format!("{} is not a tabulated rating; use none, 1, 1.5, 2, 3 or 4 h", quoted(t)))
                }
            }
            Form::QuantityList { q, range } => {
                let parts = items(text);
                if parts.is_empty() {
                    return Err("is empty; give \"none\" or values such as \"2 in\", separated by commas".into());
                }
                let mut out = Vec::with_capacity(parts.len());
                for p in parts {
                    if p.eq_ignore_ascii_case("none") {
                        out.push(None);
                        continue;
                    }
                    let v = q.parse(p)?;
                    if !(range.lo..=range.hi).contains(&q.in_unit(v, range.unit)) {
                        return Err(range_error(p, &range));
                    }
                    out.push(Some(v));
                }
                Ok(Value::List(out))
            }
            Form::ChoiceList(choices) => {
                let parts = items(text);
                if parts.len() == 1 && parts[0].eq_ignore_ascii_case("all") {
                    return Ok(Value::Picks(Vec::new()));
                }
                if parts.is_empty() {
                    return Err(format!(
                        "is empty, which would allow nothing; leave it out or write \"all\" to allow all, or name some of: {}",
                        choices.join(", ")
                    ));
                }
                parts
                    .into_iter()
                    .map(|p| choose(p, choices))
                    .collect::<Result<Vec<_>, _>>()
                    .map(Value::Picks)
            }
            Form::Text => {
                let t = text.trim();
                if self.required && t.is_empty() {
                    return Err("is empty; give it a name".into());
                }
                check_text(t)?;
                if t.chars().count() > crate::input::TEXT_CHARS {
                    return Err(format!(
                        "is {} characters long; at most {} allowed",
                        t.chars().count(),
                        crate::input::TEXT_CHARS
                    ));
                }
                Ok(Value::Text((!t.is_empty()).then(|| t.to_string())))
            }
        }
    }

    /// Read text into the bay.
    pub fn apply(&self, bay: &mut Bay, text: &str) -> Result<(), String> {
        let v = self.parse(text)?;
        (self.set)(bay, v);
        Ok(())
    }

    /// The bay's value.
    pub fn value(&self, bay: &Bay) -> Value {
        (self.get)(bay)
    }

    /// Set the bay's value.
    pub fn set(&self, bay: &mut Bay, v: Value) {
        (self.set)(bay, v)
    }

    /// The value as the display system shows it; it reads back as the
    /// same value to the places shown.
    pub fn show(&self, bay: &Bay, sys: System) -> String {
        self.format(&self.value(bay), sys, false)
    }

    /// The value as text to write into a job file: in the style of `like`
    /// (the text that was there, so a value keeps the unit its user typed)
    /// or of the display system, at full precision.
    pub fn write(&self, bay: &Bay, like: Option<&str>, sys: System) -> String {
        let v = self.value(bay);
        match (like, self.form) {
            (Some(l), Form::Quantity { q, .. } | Form::ChoiceOrQuantity { q, .. }) => match v {
                Value::Num(Some(x)) => format_like(q, x, l).unwrap_or_else(|| self.format(&v, sys, true)),
                _ => self.format(&v, sys, true),
            },
            _ => self.format(&v, sys, true),
        }
    }

    fn unit_for(&self, sys: System) -> &'static str {
        if sys == System::Si { self.units.1 } else { self.units.0 }
    }

    fn quantity_text(&self, q: Quantity, x: f64, sys: System, exact: bool) -> String {
        let unit = self.unit_for(sys);
        if unit == "ft-in" {
            return fmt_ft_in(Length::new(x));
        }
        let places = if exact {
            6
        } else {
            match unit {
                "m" => 3,
                "mm" | "psf" => 0,
                "kPa" | "ksi" | "MPa" => 2,
                _ => 3,
            }
        };
        format!("{} {unit}", trim_number(q.in_unit(x, unit), places))
    }

    fn format(&self, v: &Value, sys: System, exact: bool) -> String {
        match (self.form, v) {
            (Form::Quantity { q, .. } | Form::ChoiceOrQuantity { q, .. }, Value::Num(Some(x))) => self.quantity_text(q, *x, sys, exact),
            (Form::ChoiceOrQuantity { choices, .. }, Value::Pick(i)) => choices.get(*i).copied().unwrap_or("").to_string(),
            (_, Value::Num(None)) | (_, Value::Count(None)) | (_, Value::Text(None)) => "none".into(),
            (Form::Number { .. }, Value::Num(Some(x))) => trim_number(*x, 6),
            (Form::Rating, Value::Num(Some(h))) => format!("{} h", trim_number(*h, 2)),
            (_, Value::Count(Some(n))) => n.to_string(),
            (Form::Choice(c), Value::Pick(i)) => c.get(*i).copied().unwrap_or("").to_string(),
            (_, Value::Flag(b)) => b.to_string(),
            (Form::QuantityList { q, .. }, Value::List(l)) => l
                .iter()
                .map(|t| t.map_or("none".to_string(), |x| self.quantity_text(q, x, sys, exact)))
                .collect::<Vec<_>>()
                .join(", "),
            (Form::ChoiceList(c), Value::Picks(p)) => {
                if p.is_empty() {
                    "all".into()
                } else {
                    p.iter().map(|&i| c.get(i).copied().unwrap_or("")).collect::<Vec<_>>().join(", ")
                }
            }
            (_, Value::Text(Some(t))) => t.clone(),
            _ => String::new(),
        }
    }

    /// The allowed values in words, for help and the schema.
    pub fn allowed(&self) -> String {
        self.allowed_in(System::Us)
    }

    /// What the criterion allows, its range in the display system `sys`
    /// (the UI's prompt in SI says "from 0.61 to 61 m").
    pub fn allowed_in(&self, sys: System) -> String {
        // a range's ends in the system: the unit's SI form, three figures
        let r = |range: &Range| -> (String, String, &'static str) {
            match crate::units::display::find(range.unit).filter(|_| sys == System::Si) {
                Some(row) => (significant3(range.lo * row.factor), significant3(range.hi * row.factor), row.si),
                None => (trim_number(range.lo, 6), trim_number(range.hi, 6), range.unit),
            }
        };
        match self.form {
            Form::Quantity { q, range } => format!(
                "{} from {} to {} {}{}",
                q.name(),
                r(&range).0,
                r(&range).1,
                r(&range).2,
                if !self.required && self.default.is_empty() {
                    ", or none"
                } else {
                    ""
                }
            ),
            Form::Number { range } => format!("a number from {} to {} {}", r(&range).0, r(&range).1, r(&range).2),
            Form::Count { lo, hi } => format!("a whole number from {lo} to {hi}"),
            Form::Choice(c) => format!("one of: {}", c.join(", ")),
            Form::Flag => "true or false".into(),
            Form::Rating => "none, 1, 1.5, 2, 3 or 4 h".into(),
            Form::QuantityList { q, range } => format!(
                "a list of \"none\" or {} from {} to {} {}",
                q.name(),
                r(&range).0,
                r(&range).1,
                r(&range).2
            ),
            Form::ChoiceList(c) => format!("\"all\", or a list of: {}", c.join(", ")),
            Form::Text => "text, no control characters".into(),
            Form::ChoiceOrQuantity { choices, q, range } => format!(
                "{}, or {} from {} to {} {}",
                choices.join(", "),
                q.name(),
                r(&range).0,
                r(&range).1,
                r(&range).2
            ),
        }
    }
}

/// A number to three significant figures, trailing zeros dropped.
fn significant3(v: f64) -> String {
    if v == 0.0 {
        return "0".into();
    }
    let mag = v.abs().log10().floor() as i32;
    trim_number(v, (2 - mag).max(0) as usize)
}

/// A quantity written in the unit style of `like`: feet and inches when it
/// was written so (as `30'-6"`, or "30 ft 6 in"), else its one unit at full
/// precision. None when `like` names no unit of the kind.
pub fn format_like(q: Quantity, x: f64, like: &str) -> Option<String> {
    let t = like.trim();
    if q == Quantity::Length && (t.contains('\'') || (t.contains("ft") && t.contains("in"))) {
        return Some(if t.contains('\'') {
            fmt_ft_in(Length::new(x))
        } else {
            let ft = (x / 12.0).floor();
            let inch = x - 12.0 * ft;
            if inch.abs() < 1e-9 {
                format!("{} ft", trim_number(ft, 0))
            } else {
                format!("{} ft {} in", trim_number(ft, 0), trim_number(inch, 4))
            }
        });
    }
    // the unit is what follows the number
    let unit = t.trim_start_matches(|c: char| c.is_ascii_digit() || matches!(c, '.' | '-' | '+' | '/' | 'e' | 'E') || c == ' ');
    let unit = unit.trim();
    if unit.is_empty() || q.parse(&format!("1 {unit}")).is_err() {
        return None;
    }
    Some(format!("{} {unit}", trim_number(q.in_unit(x, unit), 6)))
}

#[cfg(test)]
mod tests {
    use super::*;

    fn bay() -> Bay {
        Bay::new("b", Length::from_unit(30.0, "ft"))
    }

    #[test]
    fn every_key_is_unique_and_every_flag_too() {
        for (i, a) in CRITERIA.iter().enumerate() {
            for b in &CRITERIA[i + 1..] {
                assert_ne!(a.key, b.key);
                assert!(a.flag.is_none() || a.flag != b.flag, "{}", a.key);
            }
        }
    }

    #[test]
    fn values_shown_read_back_the_same() {
        let mut b = bay();
        for c in CRITERIA {
            for sys in [System::Us, System::Si] {
                let shown = c.show(&b, sys);
                if c.required && shown == "none" {
                    continue;
                }
                let v = c.parse(&shown).unwrap_or_else(|e| panic!("{}: '{shown}': {e}", c.key));
                c.set(&mut b, v);
                assert_eq!(c.show(&b, sys), shown, "{}", c.key);
            }
        }
    }

    #[test]
    fn out_of_range_and_misspelt_values_say_what_is_allowed() {
        let span = find("span").unwrap();
        assert_eq!(
            span.parse("250 ft").unwrap_err(),
            "'250 ft' is outside the allowed range 2 to 200 ft"
        );
        assert!(
            span.parse("20 psf")
                .unwrap_err()
                .contains("is an area load, but a length is needed")
        );
        let class = find("class").unwrap();
        assert_eq!(class.parse("u").unwrap(), Value::Pick(0));
        assert!(class.parse("X").unwrap_err().contains("use one of: U, T, C"));
        let fam = find("families").unwrap();
        assert!(fam.parse("").unwrap_err().contains("would allow nothing"));
        let top = find("toppings").unwrap();
        assert!(top.parse("").unwrap_err().contains("is empty"));
        let fire = find("fire").unwrap();
        assert_eq!(fire.parse("none").unwrap(), Value::Num(None));
        assert!(find("name").unwrap().parse("a\u{1b}[31mred").unwrap_err().contains("\\u{1b}"));
    }

    #[test]
    fn a_value_keeps_the_unit_its_user_typed() {
        assert_eq!(format_like(Quantity::Length, 372.0, "30 ft 6 in").unwrap(), "31 ft");
        assert_eq!(format_like(Quantity::Length, 366.5, "30'-6\"").unwrap(), "30'-6 1/2\"");
        assert_eq!(
            format_like(Quantity::AreaLoad, 2.4 / 6.894757293168361, "2.0 kPa").unwrap(),
            "2.4 kPa"
        );
        assert_eq!(format_like(Quantity::Length, 120.0, "3.5 m").unwrap(), "3.048 m");
    }
}

//! One definition of each kind of load or opening a bay may list: line
//! loads across the member, point loads, strips of load along the span,
//! patches of area load and openings. Each kind names its parts (key, kind
//! of value, range, default); the job reader, the job writer, the
//! command-line flags and the UI all read and write an item through
//! [`ItemKind`], so a part is accepted or refused the same way wherever it
//! is typed.
//!
//! As text, an item is its parts as `key=value` separated by commas:
//! `p=4 kip, at=12 ft, across=2 ft, long=8 in, wide=8 in, kind=live`. In a
//! job file it is a table with the same keys, in a list under the kind's
//! key: `point = [{ p = "4 kip", at = "12 ft", kind = "live" }]`.
//!
//! Places along the span are measured from the centre of the left bearing
//! and lie on the member (an overhang reaches beyond a bearing); places
//! across are measured from the left edge of the unit (of an opening, from
//! the joint at the left edge of the unit it starts in).

use crate::case::{DesignCase, LineLoadSpec, LoadKind, Opening, PatchLoad, Placed, PlacedLoad, PointLoad, StripLoad};
use crate::criteria::{Quantity, Range, choose, quoted, range_error};
use crate::input::diag::suggestion;
use crate::units::{AreaLoad, Force, Length, LineLoad, System, fmt_ft_in, trim_number};

/// The kind of value a part takes.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum PartForm {
    /// A quantity within a range.
    Quantity(Quantity, Range),
    /// A place along the member, from the left support.
    Along,
    /// D, L, Lr or S.
    Kind,
}

/// One part of an item.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Part {
    /// Its key.
    pub key: &'static str,
    /// What it means.
    pub help: &'static str,
    /// The value it takes.
    pub form: PartForm,
    /// Its default as text ("" when required, "none" when it may be absent).
    pub default: &'static str,
    /// Display units (US, SI); "ft-in" shows feet and inches.
    pub units: (&'static str, &'static str),
}

/// A part's value, in internal units.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Val {
    /// A quantity or place (None: absent).
    Num(Option<f64>),
    /// A load kind.
    Kind(LoadKind),
}

impl Val {
    fn num(self) -> Option<f64> {
        match self {
            Val::Num(x) => x,
            Val::Kind(_) => None,
        }
    }
    fn kind(self) -> LoadKind {
        match self {
            Val::Kind(k) => k,
            Val::Num(_) => LoadKind::Dead,
        }
    }
}

/// A rule between an item's parts and against its case: the part at fault and why.
type Rule = fn(&[Val], &DesignCase) -> Result<(), (&'static str, String)>;

/// A kind of item a bay lists.
#[derive(Clone, Copy)]
pub struct ItemKind {
    /// Its key in the job file.
    pub key: &'static str,
    /// Its flag on the command line (without the dashes).
    pub flag: &'static str,
    /// Its label in the UI.
    pub label: &'static str,
    /// What it is.
    pub help: &'static str,
    /// Its parts, in the order written.
    pub parts: &'static [Part],
    /// Every item of the kind in a case, as part values.
    list: fn(&DesignCase) -> Vec<Vec<Val>>,
    /// Replace every item of the kind in a case.
    store: fn(&mut DesignCase, Vec<Vec<Val>>),
    /// Rules between parts and against the case, naming the part at fault.
    check: Rule,
}

impl std::fmt::Debug for ItemKind {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "ItemKind({})", self.key)
    }
}

impl PartialEq for ItemKind {
    fn eq(&self, o: &ItemKind) -> bool {
        self.key == o.key
    }
}

const KIND: Part = Part {
    key: "kind",
    help: "dead, live, roof-live or snow",
    form: PartForm::Kind,
    default: "dead",
    units: ("", ""),
};

const ALONG_AT: Part = Part {
    key: "at",
    help: "place along the span from the left support",
    form: PartForm::Along,
    default: "",
    units: ("ft-in", "m"),
};
const FROM: Part = Part {
    key: "from",
    help: "start along the span from the left support",
    form: PartForm::Along,
    default: "",
    units: ("ft-in", "m"),
};
const TO: Part = Part {
    key: "to",
    help: "end along the span from the left support",
    form: PartForm::Along,
    default: "",
    units: ("ft-in", "m"),
};
const ACROSS_RANGE: Range = Range {
    lo: 0.0,
    hi: 600.0,
    unit: "in",
};
const SIZE_RANGE: Range = Range {
    lo: 0.5,
    hi: 600.0,
    unit: "in",
};
const LINE_RANGE: Range = Range {
    lo: 0.0,
    hi: 100.0,
    unit: "klf",
};

/// Every kind of item, in the order listed.
pub const ITEMS: &[ItemKind] = &[
    ItemKind {
        key: "line",
        flag: "line",
        label: "Line load",
        help: "a line load across the member (a wall or partition parallel to the supports), per width of member",
        parts: &[
            Part {
                key: "w",
                help: "load per width of member",
                form: PartForm::Quantity(Quantity::LineLoad, LINE_RANGE),
                default: "",
                units: ("klf", "kN/m"),
            },
            ALONG_AT,
            KIND,
        ],
        list: |c| {
            c.line_loads
                .iter()
                .map(|l| vec![Val::Num(Some(l.w.get())), Val::Num(Some(l.at.get())), Val::Kind(l.kind)])
                .collect()
        },
        store: |c, all| {
            c.line_loads = all
                .into_iter()
                .map(|v| LineLoadSpec {
                    w: LineLoad::new(v[0].num().unwrap_or(0.0)),
                    at: Length::new(v[1].num().unwrap_or(0.0)),
                    kind: v[2].kind(),
                })
                .collect()
        },
        check: |_, _| Ok(()),
    },
    ItemKind {
        key: "point",
        flag: "point",
        label: "Point load",
        help: "a concentrated load (a post, a hanger, a unit's foot) over a bearing area",
        parts: &[
            Part {
                key: "p",
                help: "the force",
                form: PartForm::Quantity(
                    Quantity::Force,
                    Range {
                        lo: 0.0,
                        hi: 1000.0,
                        unit: "kip",
                    },
                ),
                default: "",
                units: ("kip", "kN"),
            },
            ALONG_AT,
            Part {
                key: "across",
                help: "place across the unit from its left edge (none: where it does most harm)",
                form: PartForm::Quantity(Quantity::Length, ACROSS_RANGE),
                default: "none",
                units: ("in", "mm"),
            },
            Part {
                key: "long",
                help: "length of the bearing area along the span",
                form: PartForm::Quantity(Quantity::Length, SIZE_RANGE),
                default: "4 in",
                units: ("in", "mm"),
            },
            Part {
                key: "wide",
                help: "width of the bearing area across the span",
                form: PartForm::Quantity(Quantity::Length, SIZE_RANGE),
                default: "4 in",
                units: ("in", "mm"),
            },
            KIND,
        ],
        list: |c| {
            c.placed
                .iter()
                .filter_map(|p| match p.load {
                    Placed::Point(q) => Some(vec![
                        Val::Num(Some(q.p.get())),
                        Val::Num(Some(q.at.get())),
                        Val::Num(q.across.map(|a| a.get())),
                        Val::Num(Some(q.size.0.get())),
                        Val::Num(Some(q.size.1.get())),
                        Val::Kind(p.kind),
                    ]),
                    _ => None,
                })
                .collect()
        },
        store: |c, all| {
            c.placed.retain(|p| !matches!(p.load, Placed::Point(_)));
            c.placed.extend(all.into_iter().map(|v| PlacedLoad {
                load: Placed::Point(PointLoad {
                    p: Force::new(v[0].num().unwrap_or(0.0)),
                    at: Length::new(v[1].num().unwrap_or(0.0)),
                    across: v[2].num().map(Length::new),
                    size: (Length::new(v[3].num().unwrap_or(4.0)), Length::new(v[4].num().unwrap_or(4.0))),
                }),
                kind: v[5].kind(),
            }));
        },
        check: |_, _| Ok(()),
    },
    ItemKind {
        key: "strip",
        flag: "strip",
        label: "Strip load",
        help: "a load along the span over part of it (a wall or partition running along a unit)",
        parts: &[
            Part {
                key: "w",
                help: "load per length along the span",
                form: PartForm::Quantity(Quantity::LineLoad, LINE_RANGE),
                default: "",
                units: ("klf", "kN/m"),
            },
            FROM,
            TO,
            Part {
                key: "across",
                help: "place across the unit from its left edge (none: where it does most harm)",
                form: PartForm::Quantity(Quantity::Length, ACROSS_RANGE),
                default: "none",
                units: ("in", "mm"),
            },
            KIND,
        ],
        list: |c| {
            c.placed
                .iter()
                .filter_map(|p| match p.load {
                    Placed::Strip(q) => Some(vec![
                        Val::Num(Some(q.w.get())),
                        Val::Num(Some(q.from.get())),
                        Val::Num(Some(q.to.get())),
                        Val::Num(q.across.map(|a| a.get())),
                        Val::Kind(p.kind),
                    ]),
                    _ => None,
                })
                .collect()
        },
        store: |c, all| {
            c.placed.retain(|p| !matches!(p.load, Placed::Strip(_)));
            c.placed.extend(all.into_iter().map(|v| PlacedLoad {
                load: Placed::Strip(StripLoad {
                    w: LineLoad::new(v[0].num().unwrap_or(0.0)),
                    from: Length::new(v[1].num().unwrap_or(0.0)),
                    to: Length::new(v[2].num().unwrap_or(0.0)),
                    across: v[3].num().map(Length::new),
                }),
                kind: v[4].kind(),
            }));
        },
        check: |v, _| ordered(v, 1, 2),
    },
    ItemKind {
        key: "patch",
        flag: "patch",
        label: "Patch load",
        help: "an area load over a rectangle of the floor (a mechanical pad, storage)",
        parts: &[
            Part {
                key: "q",
                help: "load per area",
                form: PartForm::Quantity(
                    Quantity::AreaLoad,
                    Range {
                        lo: 0.0,
                        hi: 2000.0,
                        unit: "psf",
                    },
                ),
                default: "",
                units: ("psf", "kPa"),
            },
            FROM,
            TO,
            Part {
                key: "across",
                help: "where it starts across the unit, from its left edge",
                form: PartForm::Quantity(Quantity::Length, ACROSS_RANGE),
                default: "0 in",
                units: ("in", "mm"),
            },
            Part {
                key: "wide",
                help: "its width across the span",
                form: PartForm::Quantity(Quantity::Length, SIZE_RANGE),
                default: "",
                units: ("in", "mm"),
            },
            KIND,
        ],
        list: |c| {
            c.placed
                .iter()
                .filter_map(|p| match p.load {
                    Placed::Patch(q) => Some(vec![
                        Val::Num(Some(q.q.get())),
                        Val::Num(Some(q.from.get())),
                        Val::Num(Some(q.to.get())),
                        Val::Num(Some(q.across.0.get())),
                        Val::Num(Some(q.across.1.get() - q.across.0.get())),
                        Val::Kind(p.kind),
                    ]),
                    _ => None,
                })
                .collect()
        },
        store: |c, all| {
            c.placed.retain(|p| !matches!(p.load, Placed::Patch(_)));
            c.placed.extend(all.into_iter().map(|v| {
                let a = v[3].num().unwrap_or(0.0);
                PlacedLoad {
                    load: Placed::Patch(PatchLoad {
                        q: AreaLoad::new(v[0].num().unwrap_or(0.0)),
                        from: Length::new(v[1].num().unwrap_or(0.0)),
                        to: Length::new(v[2].num().unwrap_or(0.0)),
                        across: (Length::new(a), Length::new(a + v[4].num().unwrap_or(0.0))),
                    }),
                    kind: v[5].kind(),
                }
            }));
        },
        check: |v, _| ordered(v, 1, 2),
    },
    ItemKind {
        key: "opening",
        flag: "opening",
        label: "Opening",
        help: "an opening through the floor (a shaft, a stair, a chase); across is measured from the joint at the left edge of the unit it starts in",
        parts: &[
            FROM,
            TO,
            Part {
                key: "across",
                help: "where it starts across, from a joint between units",
                form: PartForm::Quantity(Quantity::Length, ACROSS_RANGE),
                default: "0 in",
                units: ("in", "mm"),
            },
            Part {
                key: "wide",
                help: "its width across the span",
                form: PartForm::Quantity(Quantity::Length, SIZE_RANGE),
                default: "",
                units: ("in", "mm"),
            },
            Part {
                key: "header",
                help: "dead load along each header that frames it (the header and what it carries), per length of header",
                form: PartForm::Quantity(Quantity::LineLoad, LINE_RANGE),
                default: "none",
                units: ("klf", "kN/m"),
            },
        ],
        list: |c| {
            c.openings
                .iter()
                .map(|o| {
                    vec![
                        Val::Num(Some(o.from.get())),
                        Val::Num(Some(o.to.get())),
                        Val::Num(Some(o.across.0.get())),
                        Val::Num(Some(o.across.1.get() - o.across.0.get())),
                        Val::Num(o.header.map(|h| h.get())),
                    ]
                })
                .collect()
        },
        store: |c, all| {
            c.openings = all
                .into_iter()
                .map(|v| {
                    let a = v[2].num().unwrap_or(0.0);
                    Opening {
                        from: Length::new(v[0].num().unwrap_or(0.0)),
                        to: Length::new(v[1].num().unwrap_or(0.0)),
                        across: (Length::new(a), Length::new(a + v[3].num().unwrap_or(0.0))),
                        header: v[4].num().map(LineLoad::new),
                    }
                })
                .collect()
        },
        check: |v, c| {
            ordered(v, 0, 1)?;
            let (a, b) = (v[0].num().unwrap_or(0.0), v[1].num().unwrap_or(0.0));
            let l = c.span.get();
            if a < 0.0 || b > l + 1e-9 {
                return Err((
                    if a < 0.0 { "from" } else { "to" },
                    format!(
                        "an opening lies between the supports (0 to {}); an overhang is not cut",
                        fmt_ft_in(c.span)
                    ),
                ));
            }
            Ok(())
        },
    },
];

/// `from` before `to` (parts `i` and `j`).
fn ordered(v: &[Val], i: usize, j: usize) -> Result<(), (&'static str, String)> {
    let (a, b) = (v[i].num().unwrap_or(0.0), v[j].num().unwrap_or(0.0));
    if b <= a {
        return Err((
            "to",
            format!(
                "ends at {} but starts at {}: 'to' must lie beyond 'from'",
                fmt_ft_in(Length::new(b)),
                fmt_ft_in(Length::new(a))
            ),
        ));
    }
    Ok(())
}

/// An item kind by its job-file key.
pub fn find(key: &str) -> Option<&'static ItemKind> {
    ITEMS.iter().find(|k| k.key == key)
}

impl Part {
    /// Read a part's text (the member's stretch `range`, in, for places along).
    pub fn parse(&self, text: &str, (lo, hi): (f64, f64)) -> Result<Val, String> {
        let t = text.trim();
        match self.form {
            PartForm::Kind => Ok(Val::Kind(LoadKind::ALL[choose(t, &LoadKind::NAMES)?])),
            PartForm::Quantity(_, _) if self.default == "none" && t.eq_ignore_ascii_case("none") => Ok(Val::Num(None)),
            PartForm::Quantity(q, r) => {
                let v = q.parse(t)?;
                if !(r.lo..=r.hi).contains(&q.in_unit(v, r.unit)) {
                    return Err(range_error(t, &r));
                }
                Ok(Val::Num(Some(v)))
            }
            PartForm::Along => {
                let v = Length::parse(t).map_err(|e| e.to_string())?.get();
                if v < lo - 1e-9 || v > hi + 1e-9 {
                    return Err(format!(
                        "{} is not on the member; a place along it lies from {} to {} from the left support{}",
                        quoted(t),
                        fmt_ft_in(Length::new(lo)),
                        fmt_ft_in(Length::new(hi)),
                        if lo < 0.0 { " (negative on the left overhang)" } else { "" }
                    ));
                }
                Ok(Val::Num(Some(v)))
            }
        }
    }

    /// The value as text in the display system.
    pub fn show(&self, v: Val, sys: System) -> String {
        match (self.form, v) {
            (_, Val::Kind(k)) => k.name().to_string(),
            (_, Val::Num(None)) => "none".into(),
            (PartForm::Along, Val::Num(Some(x))) | (PartForm::Quantity(Quantity::Length, _), Val::Num(Some(x)))
                if self.unit(sys) == "ft-in" =>
            {
                fmt_ft_in(Length::new(x))
            }
            (PartForm::Along, Val::Num(Some(x))) => {
                format!("{} {}", trim_number(Length::new(x).in_unit(self.unit(sys)), 4), self.unit(sys))
            }
            (PartForm::Quantity(q, _), Val::Num(Some(x))) => format!("{} {}", trim_number(q.in_unit(x, self.unit(sys)), 4), self.unit(sys)),
            (PartForm::Kind, Val::Num(_)) => String::new(),
        }
    }

    fn unit(&self, sys: System) -> &'static str {
        if sys == System::Si { self.units.1 } else { self.units.0 }
    }

    /// The allowed values in words.
    pub fn allowed(&self) -> String {
        match self.form {
            PartForm::Kind => format!("one of: {}", LoadKind::NAMES.join(", ")),
            PartForm::Along => "a length along the member from the left support (negative on a left overhang)".into(),
            PartForm::Quantity(q, r) => format!(
                "{} from {} to {} {}{}",
                q.name(),
                trim_number(r.lo, 6),
                trim_number(r.hi, 6),
                r.unit,
                if self.default == "none" { ", or none" } else { "" }
            ),
        }
    }
}

impl ItemKind {
    /// The stretch of the member places along it may take: from the tip of
    /// a left overhang (negative) to the tip of a right one, in.
    fn range(case: &DesignCase) -> (f64, f64) {
        (-case.overhang.0.get(), case.span.get() + case.overhang.1.get())
    }

    /// Read an item from its parts as (key, text) pairs: unknown and
    /// missing parts, values out of range and rules between parts are
    /// refused, naming the part (None: the item as a whole).
    pub fn read(&self, pairs: &[(&str, &str)], case: &DesignCase) -> Result<Vec<Val>, (Option<&'static str>, String)> {
        let keys: Vec<&str> = self.parts.iter().map(|p| p.key).collect();
        for (k, _) in pairs {
            if !keys.contains(k) {
                return Err((
                    None,
                    format!(
                        "unknown part '{}'{}; a {} has: {}",
                        k.escape_debug(),
                        suggestion(k, keys.iter().copied()),
                        self.key,
                        keys.join(", ")
                    ),
                ));
            }
        }
        let range = ItemKind::range(case);
        let mut vals = Vec::with_capacity(self.parts.len());
        for p in self.parts {
            let given = pairs.iter().rev().find(|(k, _)| *k == p.key).map(|(_, t)| *t);
            let text = match (given, p.default) {
                (Some(t), _) => t,
                (None, "") => return Err((Some(p.key), format!("missing: {} ({})", p.help, p.allowed()))),
                (None, d) => d,
            };
            vals.push(p.parse(text, range).map_err(|e| (Some(p.key), e))?);
        }
        (self.check)(&vals, case).map_err(|(k, e)| (Some(k), e))?;
        Ok(vals)
    }

    /// Read an item typed as text, `key=value, key=value`.
    pub fn parse(&self, text: &str, case: &DesignCase) -> Result<Vec<Val>, String> {
        let mut pairs = Vec::new();
        for piece in text.split(',').map(str::trim).filter(|p| !p.is_empty()) {
            let Some((k, v)) = piece.split_once('=') else {
                return Err(format!(
                    "{} is not key=value; write the parts as, e.g., {}",
                    quoted(piece),
                    self.example()
                ));
            };
            pairs.push((k.trim(), v.trim()));
        }
        if pairs.is_empty() {
            return Err(format!("is empty; write the parts as, e.g., {}", self.example()));
        }
        self.read(&pairs, case).map_err(|(k, e)| match k {
            Some(k) => format!("{k}: {e}"),
            None => e,
        })
    }

    /// An example of the text form.
    /// An example in the display system: the UI's prompt and the text a
    /// new row starts with.
    pub fn example_in(&self, sys: System) -> &'static str {
        if sys == System::Us {
            return self.example();
        }
        match self.key {
            "line" => "\"w=9 kN/m, at=2.4 m, kind=dead\"",
            "point" => "\"p=18 kN, at=3.6 m, across=600 mm, long=200 mm, wide=200 mm, kind=live\"",
            "strip" => "\"w=7 kN/m, from=0 m, to=6 m, kind=dead\"",
            "patch" => "\"q=7 kPa, from=3 m, to=5 m, across=0 mm, wide=1200 mm, kind=live\"",
            _ => "\"from=2.4 m, to=4.2 m, across=300 mm, wide=600 mm, header=3 kN/m\"",
        }
    }

    /// An example in US units (the job file reference and the flags).
    pub fn example(&self) -> &'static str {
        match self.key {
            "line" => "\"w=0.6 klf, at=8 ft, kind=dead\"",
            "point" => "\"p=4 kip, at=12 ft, across=24 in, long=8 in, wide=8 in, kind=live\"",
            "strip" => "\"w=0.5 klf, from=0 ft, to=20 ft, kind=dead\"",
            "patch" => "\"q=150 psf, from=10 ft, to=16 ft, across=0 in, wide=48 in, kind=live\"",
            _ => "\"from=8 ft, to=14 ft, across=12 in, wide=24 in, header=0.2 klf\"",
        }
    }

    /// The items of this kind in a case.
    pub fn list(&self, case: &DesignCase) -> Vec<Vec<Val>> {
        (self.list)(case)
    }

    /// Replace the items of this kind in a case.
    pub fn store(&self, case: &mut DesignCase, all: Vec<Vec<Val>>) {
        (self.store)(case, all)
    }

    /// Every part of an item as (key, text) in the display system, the
    /// parts at their default left out.
    pub fn parts_text(&self, v: &[Val], sys: System) -> Vec<(&'static str, String)> {
        let range = (f64::NEG_INFINITY, f64::INFINITY);
        self.parts
            .iter()
            .zip(v)
            .filter(|(p, val)| p.default.is_empty() || p.parse(p.default, range).ok() != Some(**val))
            .map(|(p, val)| (p.key, p.show(*val, sys)))
            .collect()
    }

    /// An item for a reader: every part given (defaults too), none left out
    /// but the absent ones.
    pub fn describe(&self, v: &[Val], sys: System) -> String {
        self.parts
            .iter()
            .zip(v)
            .filter(|(_, val)| **val != Val::Num(None))
            .map(|(p, val)| format!("{}={}", p.key, p.show(*val, sys)))
            .collect::<Vec<_>>()
            .join(", ")
    }

    /// An item as its text form.
    pub fn text(&self, v: &[Val], sys: System) -> String {
        self.parts_text(v, sys)
            .into_iter()
            .map(|(k, t)| format!("{k}={t}"))
            .collect::<Vec<_>>()
            .join(", ")
    }
}

/// Every item a case lists, by kind: (kind, index within the kind, values).
pub fn all(case: &DesignCase) -> Vec<(&'static ItemKind, usize, Vec<Val>)> {
    let mut out = Vec::new();
    for k in ITEMS {
        for (i, v) in k.list(case).into_iter().enumerate() {
            out.push((k, i, v));
        }
    }
    out
}

/// Items that no longer lie on a member whose span or overhangs changed:
/// (kind key, index) of each, so an editor can say what it drops.
pub fn off_member(case: &DesignCase) -> Vec<(&'static str, usize)> {
    let (lo, hi) = ItemKind::range(case);
    let mut out = Vec::new();
    for k in ITEMS {
        for (i, v) in k.list(case).iter().enumerate() {
            let on = k.parts.iter().zip(v).all(|(p, val)| match (p.form, val) {
                (PartForm::Along, Val::Num(Some(x))) => *x >= lo - 1e-6 && *x <= hi + 1e-6,
                _ => true,
            });
            if !on || (k.check)(v, case).is_err() {
                out.push((k.key, i));
            }
        }
    }
    out
}

/// Drop the items that no longer lie on the member (after its span or an
/// overhang changed); returns how many went.
pub fn keep_on_member(case: &mut DesignCase) -> usize {
    let off = off_member(case);
    for k in ITEMS {
        let mut all = k.list(case);
        let n = all.len();
        let mut i = 0;
        all.retain(|_| {
            i += 1;
            !off.contains(&(k.key, i - 1))
        });
        if all.len() != n {
            k.store(case, all);
        }
    }
    off.len()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn case() -> DesignCase {
        DesignCase::new(Length::from_unit(30.0, "ft"))
    }

    #[test]
    fn items_read_from_text_and_show_back() {
        let c = case();
        let k = find("point").unwrap();
        let v = k.parse("p=4 kip, at=12 ft, across=24 in, kind=live", &c).unwrap();
        assert_eq!(v[0], Val::Num(Some(4000.0)));
        assert_eq!(v[1], Val::Num(Some(144.0)));
        assert_eq!(v[3], Val::Num(Some(4.0)));
        assert_eq!(v[5], Val::Kind(LoadKind::Live));
        let t = k.text(&v, System::Us);
        assert_eq!(t, "p=4 kip, at=12'-0\", across=24 in, kind=live");
        assert_eq!(k.parse(&t, &c).unwrap(), v);
        let si = k.text(&v, System::Si);
        assert_eq!(si, "p=17.7929 kN, at=3.6576 m, across=609.6 mm, kind=live");
        let back = k.parse(&si, &c).unwrap();
        for (a, b) in back.iter().zip(&v) {
            match (a, b) {
                (Val::Num(Some(a)), Val::Num(Some(b))) => assert!((a - b).abs() <= 1e-5 * b.abs().max(1.0), "{a} {b}"),
                _ => assert_eq!(a, b),
            }
        }
    }

    #[test]
    fn bad_parts_are_named() {
        let c = case();
        let k = find("strip").unwrap();
        assert!(
            k.parse("w=0.5 klf, from=10 ft, to=5 ft", &c)
                .unwrap_err()
                .starts_with("to: ends at 5'-0\" but starts at 10'-0\"")
        );
        assert!(
            k.parse("w=0.5 klf, from=0 ft, to=40 ft", &c)
                .unwrap_err()
                .contains("is not on the member")
        );
        assert!(
            k.parse("w=0.5 klf, form=0 ft, to=4 ft", &c)
                .unwrap_err()
                .contains("unknown part 'form' (did you mean 'from'?)")
        );
        assert!(
            k.parse("w=0.5 psf, from=0 ft, to=4 ft", &c)
                .unwrap_err()
                .starts_with("w: '0.5 psf' is an area load")
        );
        assert!(k.parse("from=0 ft, to=4 ft", &c).unwrap_err().starts_with("w: missing"));
        assert!(k.parse("w 0.5 klf", &c).unwrap_err().contains("is not key=value"));
        let o = find("opening").unwrap();
        let mut c2 = c.clone();
        c2.overhang.1 = Length::from_unit(4.0, "ft");
        assert!(
            o.parse("from=28 ft, to=32 ft, wide=2 ft", &c2)
                .unwrap_err()
                .contains("an overhang is not cut")
        );
        // on an overhang, a load may lie beyond the support
        assert!(find("point").unwrap().parse("p=1 kip, at=33 ft", &c2).is_ok());
        assert!(
            find("point")
                .unwrap()
                .parse("p=1 kip, at=-1 ft", &c2)
                .unwrap_err()
                .contains("not on the member")
        );
    }
}

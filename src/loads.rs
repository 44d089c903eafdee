//! The loads one unit carries, as beam loads by load group, and the
//! arrangements of the variable loads that the checks must see.
//!
//! A bay's loads are of three sorts: area loads over the whole floor
//! (self-weight, topping, superimposed dead, live, roof live, snow), line
//! loads across the member at a place along the span, and placed loads —
//! concentrated loads, loads along the span (a wall over a unit) and
//! rectangles of area load. The unit analysed carries every placed load at
//! the share it takes ([`share`]): together, as if all sat on that unit,
//! which is conservative for loads that in fact sit on different units.
//!
//! Variable loads (L, Lr, S) are placed where they do most harm
//! ([`Arrangement`]): with an overhang, the span loaded alone gives the
//! greatest sagging moment, the overhangs loaded alone the greatest hogging
//! moment, and both together the greatest reactions and the shears beside
//! the supports. "Lr or S" of ASCE 7-16 §2.3.1 and §2.4.1 is one or the
//! other, each with its own placed loads.
//!
//! Openings ([`units`]): the units an opening cuts partly are analysed with
//! their cut, the units it cuts through are not members (their pieces hang
//! on headers), and the units the headers bear on carry the headers'
//! reactions.

use serde::Serialize;

use crate::beam::{Beam, Load};
use crate::case::{DesignCase, LoadKind, Placed, StemShare, UnitShare};
use crate::catalog::Section;
use crate::section::Family;

/// Number of load groups.
pub const GROUPS: usize = 5;
/// Member self-weight (on the bare section).
pub const SELF: usize = 0;
/// Topping weight (on the bare section, unshored).
pub const TOPPING: usize = 1;
/// Superimposed dead load (on the composite section).
pub const SDL: usize = 2;
/// Floor live load L.
pub const LIVE: usize = 3;
/// Roof live load Lr or snow S, as the arrangement says.
pub const ROOF: usize = 4;

/// Where the variable loads go.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Region {
    /// Between the supports (without overhangs, the only arrangement).
    Span,
    /// On the overhangs only.
    Overhangs,
    /// Everywhere.
    All,
}

/// Which roof load is "Lr or S".
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum RoofKind {
    /// The larger uniform load of the two (no placed roof loads).
    Larger,
    /// Roof live load Lr, with the placed roof live loads.
    RoofLive,
    /// Snow S, with the placed snow loads.
    Snow,
}

/// One arrangement of the variable loads.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
pub struct Arrangement {
    /// Where the variable loads act.
    pub region: Region,
    /// Which roof load acts.
    pub roof: RoofKind,
}

impl Arrangement {
    /// The arrangement of a member without overhangs or placed roof loads.
    pub const PLAIN: Arrangement = Arrangement {
        region: Region::Span,
        roof: RoofKind::Larger,
    };

    /// In words, for notes.
    pub fn describe(&self) -> String {
        let region = match self.region {
            Region::Span => "variable loads on the span",
            Region::Overhangs => "variable loads on the overhangs only",
            Region::All => "variable loads on span and overhangs",
        };
        match self.roof {
            RoofKind::Larger => region.to_string(),
            RoofKind::RoofLive => format!("{region}; roof live load Lr"),
            RoofKind::Snow => format!("{region}; snow S"),
        }
    }
}

/// Every arrangement the checks must see for a case.
pub fn arrangements(case: &DesignCase) -> Vec<Arrangement> {
    let regions: &[Region] = if case.has_overhang() {
        &[Region::Span, Region::Overhangs, Region::All]
    } else {
        &[Region::Span]
    };
    let placed_roof = |k: LoadKind| case.placed.iter().any(|p| p.kind == k) || case.line_loads.iter().any(|l| l.kind == k);
    let roofs: Vec<RoofKind> = if !placed_roof(LoadKind::RoofLive) && !placed_roof(LoadKind::Snow) {
        vec![RoofKind::Larger]
    } else {
        let mut r = Vec::new();
        if case.roof_live.get() > 0.0 || placed_roof(LoadKind::RoofLive) {
            r.push(RoofKind::RoofLive);
        }
        if case.snow.get() > 0.0 || placed_roof(LoadKind::Snow) {
            r.push(RoofKind::Snow);
        }
        r
    };
    let mut out = Vec::with_capacity(regions.len() * roofs.len());
    for &region in regions {
        for &roof in &roofs {
            out.push(Arrangement { region, roof });
        }
    }
    out
}

/// A cut through one unit: along the span from one place to another, and
/// across the unit from its left edge, in.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Cut {
    /// Start and end along the span, in from the left support.
    pub along: (f64, f64),
    /// Start and end across the unit, in from its left edge.
    pub across: (f64, f64),
}

/// A header's reaction on the unit it bears on: a dead load (the header
/// and the floor it carries) and a variable part, at a place along the span.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct HeaderLoad {
    /// Place along the span, in from the left support.
    pub at: f64,
    /// Force by load group (lbf): self, topping, sdl, live, roof live, snow.
    pub p: [f64; 6],
    /// Place across the unit where it bears, in from its left edge.
    pub across: f64,
}

/// Which unit of the bay is analysed, and why.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Unit {
    /// What it is, for the output: "the loaded unit", "unit 2 of opening 1 (cut)".
    pub label: String,
    /// Its cut, if an opening cuts it partly.
    pub cut: Option<Cut>,
    /// Headers bearing on it.
    pub headers: Vec<HeaderLoad>,
}

impl Unit {
    /// The unit every placed load sits on, uncut.
    pub fn loaded() -> Unit {
        Unit {
            label: "the loaded unit".into(),
            cut: None,
            headers: Vec::new(),
        }
    }
}

/// What an opening does to the units of width `b` laid side by side from
/// the joint its across position is measured from.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct OpeningLayout {
    /// Units cut partly: (index from the joint, cut in its own coordinates).
    pub partly: Vec<(i64, Cut)>,
    /// Units cut through (not members: their pieces hang on headers).
    pub through: Vec<i64>,
    /// The units the headers bear on (left, right), by index.
    pub bearing: (i64, i64),
}

/// How an opening lies over units of width `b`.
pub fn layout(o: &crate::case::Opening, b: f64) -> OpeningLayout {
    let (a, e) = (o.across.0.get(), o.across.1.get());
    let tol = 1e-6 * b.max(1.0);
    let first = ((a + tol) / b).floor() as i64;
    let last = ((e - tol) / b).floor() as i64;
    let mut partly = Vec::new();
    let mut through = Vec::new();
    for j in first..=last.max(first) {
        let lo = j as f64 * b;
        let c0 = (a - lo).max(0.0);
        let c1 = (e - lo).min(b);
        if c1 - c0 <= tol {
            continue;
        }
        if c0 <= tol && c1 >= b - tol {
            through.push(j);
        } else {
            partly.push((
                j,
                Cut {
                    along: (o.from.get(), o.to.get()),
                    across: (c0, c1),
                },
            ));
        }
    }
    // the headers bear on the concrete just beside the opening
    let left = ((a - tol) / b).floor() as i64;
    let right = ((e + tol) / b).floor() as i64;
    OpeningLayout {
        partly,
        through,
        bearing: (left, right),
    }
}

/// The units a bay's openings make distinct, besides the loaded unit (the
/// same for every unit width `b` of `section`).
pub fn units(case: &DesignCase, section: &Section, mix_weight: f64, topping_weight: f64) -> Vec<Unit> {
    let b = section.props.width_in;
    let mut out = vec![Unit::loaded()];
    for (k, o) in case.openings.iter().enumerate() {
        let lay = layout(o, b);
        let headers = header_loads(case, section, o, &lay, mix_weight, topping_weight);
        let mut mine: Vec<(i64, Unit)> = Vec::new();
        for &(j, cut) in &lay.partly {
            mine.push((
                j,
                Unit {
                    label: format!(
                        "opening {}: unit {} (cut over {:.1}–{:.1} in of its width)",
                        k + 1,
                        j + 1,
                        cut.across.0,
                        cut.across.1
                    ),
                    cut: Some(cut),
                    headers: Vec::new(),
                },
            ));
        }
        for (side, j) in [(0, lay.bearing.0), (1, lay.bearing.1)] {
            let hs: Vec<HeaderLoad> = headers
                .iter()
                .map(|h| HeaderLoad {
                    across: if side == 0 {
                        (o.across.0.get() - j as f64 * b).clamp(0.0, b)
                    } else {
                        (o.across.1.get() - j as f64 * b).clamp(0.0, b)
                    },
                    ..*h
                })
                .collect();
            if hs.iter().all(|h| h.p.iter().all(|&p| p == 0.0)) {
                continue;
            }
            match mine.iter_mut().find(|(i, _)| *i == j) {
                Some((_, u)) => u.headers.extend(hs),
                None => mine.push((
                    j,
                    Unit {
                        label: format!("opening {}: unit {} (beside it, carrying the headers)", k + 1, j + 1),
                        cut: None,
                        headers: hs,
                    },
                )),
            }
        }
        for (_, u) in mine {
            if !out.iter().any(|v| v.cut == u.cut && v.headers == u.headers) {
                out.push(u);
            }
        }
    }
    out
}

/// Each header's reaction on one of the two units it bears on: half of
/// the header, which carries half of each piece of the units cut through
/// (each piece spans from its support to the header) and the header's own
/// line load over the opening's width (common practice, no source).
fn header_loads(
    case: &DesignCase,
    section: &Section,
    o: &crate::case::Opening,
    lay: &OpeningLayout,
    mix_weight: f64,
    topping_weight: f64,
) -> Vec<HeaderLoad> {
    let b = section.props.width_in;
    let l = case.span.get();
    let wc = lay.through.len() as f64 * b;
    let width = o.across.1.get() - o.across.0.get();
    let own = o.header.map_or(0.0, |h| h.get() * width);
    let per_area = [
        // self-weight per plan area of the units cut through
        section.props.area_in2 * mix_weight / b,
        topping_weight,
        case.sdl.get(),
        case.live.get(),
        case.roof_live.get(),
        case.snow.get(),
    ];
    let mut out = Vec::with_capacity(2);
    for (at, piece) in [(o.from.get(), o.from.get()), (o.to.get(), l - o.to.get())] {
        let mut p = [0.0; 6];
        for (g, q) in per_area.iter().enumerate() {
            p[g] = q * wc * piece.max(0.0) / 2.0 / 2.0;
        }
        p[SDL] += own / 2.0;
        if p.iter().any(|&v| v != 0.0) {
            out.push(HeaderLoad { at, p, across: 0.0 });
        }
    }
    out
}

/// How much of a placed load the analysed member takes, and why. The
/// words of `what` and `how` are made only when a note or the JSON asks
/// for them (ranking builds thousands of these).
#[derive(Debug, Clone, PartialEq)]
pub struct Share {
    /// Which kind of load: "point", "strip", "patch" or "header".
    pub kind: &'static str,
    /// Its number among the loads of its kind, from 1.
    pub number: usize,
    /// The multiple of the load the member is analysed with.
    pub factor: f64,
    /// For a double tee, each stem's share of the load (negative: uplift).
    pub stems: Vec<f64>,
    /// How it was found.
    pub basis: Basis,
    /// Whether the rule used is from memory (low confidence).
    pub from_memory: bool,
}

/// How a share was found, with the numbers its note gives.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Basis {
    /// One stem of a tee with `stems` stems carries it all.
    OneStem {
        /// Stems of the tee.
        stems: f64,
    },
    /// The lever rule across the stems, the load at `at` in across.
    Lever {
        /// Where across, in.
        at: f64,
    },
    /// The loaded unit carries it all.
    Whole,
    /// Spread over a width the user gives, in.
    Width {
        /// The width, in.
        width: f64,
    },
    /// A load along the span, carried by the unit beneath it.
    AlongSpan,
    /// The published rule, over this width, in.
    Rule {
        /// The effective width, in.
        width: f64,
        /// Halved at a free edge.
        free_edge: bool,
    },
    /// A patch on a unit that carries its part over its own width, in.
    OverUnit {
        /// The part of the patch over the unit, in.
        over: f64,
    },
}

impl Share {
    /// Which load: "point 1", "strip 2", "patch 1", "header 1".
    pub fn what(&self) -> String {
        format!("{} {}", self.kind, self.number)
    }

    /// How the share was found, in words.
    pub fn how(&self) -> String {
        let f = self.factor;
        match self.basis {
            Basis::OneStem { stems } => format!(
                "one stem carries it all (conservative): {} × the load on the tee",
                crate::units::trim_number(stems, 2)
            ),
            Basis::Lever { at } => format!(
                "lever rule at {:.1} in across: stems take {} of it; the tee is analysed with {} × the load (its most-loaded stem's share on every stem)",
                at,
                self.stems.iter().map(|s| format!("{s:.2}")).collect::<Vec<_>>().join(" / "),
                crate::units::trim_number(f, 3)
            ),
            Basis::Whole => "the loaded unit carries it all (conservative)".into(),
            Basis::Width { width } => format!("spread over {:.1} in: the unit takes {:.2} of it", width, f),
            Basis::AlongSpan => "a load along the span is carried by the unit beneath it (common practice, no source)".into(),
            Basis::Rule { width, free_edge } => format!(
                "spread over {:.1} in{} by the published rule (0.5ℓ over the middle half, tapering linearly to one unit at the supports — {RULE_MARK}): the unit takes {:.2} of it",
                width,
                if free_edge { " (halved at a free edge)" } else { "" },
                f
            ),
            Basis::OverUnit { over } => format!("the unit carries the {:.1} in of it over its width", over),
        }
    }
}

impl Serialize for Share {
    fn serialize<S: serde::Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        use serde::ser::SerializeStruct;
        let mut st = s.serialize_struct("Share", 5)?;
        st.serialize_field("what", &self.what())?;
        st.serialize_field("factor", &self.factor)?;
        st.serialize_field("stems", &self.stems)?;
        st.serialize_field("how", &self.how())?;
        st.serialize_field("from_memory", &self.from_memory)?;
        st.end()
    }
}

/// The mark carried with the published hollow-core distribution rule.
pub const RULE_MARK: &str = "published rule from memory, low confidence — verify";

/// Effective width of the published hollow-core rule at `x` along span
/// `l`, for units of width `b` (PCI hollow-core manual, from memory, low
/// confidence): 0.5ℓ over the middle half of the span, narrowing linearly
/// to one unit width at the supports (the taper is our assumption: the
/// figure is not transcribed), half of it near a free edge, never below
/// one unit width.
pub fn rule_width(x: f64, l: f64, b: f64, free_edge: bool) -> f64 {
    let mid = 0.5 * l;
    let near = x.min(l - x).max(0.0);
    let mut be = if mid > b { b + (mid - b) * (near / (l / 4.0)).min(1.0) } else { b };
    if free_edge {
        be /= 2.0;
    }
    be.max(b)
}

/// The lever rule across a double tee: each stem's share of a unit load at
/// `c` (in from the left edge), stems at `stems` (sorted). Between two
/// stems the load splits by statics; beyond an outer stem the near stem
/// takes more than the whole and the far one is lifted.
pub fn lever(stems: &[f64], c: f64) -> Vec<f64> {
    let n = stems.len();
    let mut out = vec![0.0; n];
    if n == 0 {
        return out;
    }
    if n == 1 {
        out[0] = 1.0;
        return out;
    }
    // the pair of stems whose span holds c, or the outer pair
    let i = stems.windows(2).position(|w| c <= w[1]).unwrap_or(n - 2);
    let (s0, s1) = (stems[i], stems[i + 1]);
    let s = s1 - s0;
    out[i] = (s1 - c) / s;
    out[i + 1] = (c - s0) / s;
    out
}

/// The share of a load the member takes: (factor, stem shares, basis, from memory).
/// `x` is where along the span it acts (for the published rule, the place
/// where the rule gives the least width over the load's extent), `c` where
/// across (None: where it does most harm), `wide` its own width across.
fn member_share(
    case: &DesignCase,
    section: &Section,
    x: (f64, f64),
    c: Option<f64>,
    wide: f64,
    along_span: bool,
) -> (f64, Vec<f64>, Basis, bool) {
    let b = section.props.width_in;
    let l = case.span.get();
    if section.family == Family::DoubleTee {
        let stems = &section.geometry.stems;
        let n = stems.len().max(1) as f64;
        if case.stem_share == StemShare::OneStem || stems.len() < 2 {
            return (n, vec![1.0; 1], Basis::OneStem { stems: n }, false);
        }
        let worst = |c: f64| lever(stems, c).into_iter().fold(f64::NEG_INFINITY, f64::max);
        let (at, shares) = match c {
            Some(c) => (c.clamp(0.0, b), lever(stems, c.clamp(0.0, b))),
            None => {
                // at a flange edge (the largest lever) unless the middle is worse
                let cands = [0.0, b, stems[0], b / 2.0];
                let at = cands.into_iter().fold(0.0, |a, c| if worst(c) > worst(a) + 1e-12 { c } else { a });
                (at, lever(stems, at))
            }
        };
        let top = shares.iter().copied().fold(f64::NEG_INFINITY, f64::max);
        let f = n * top;
        return (f, shares, Basis::Lever { at }, false);
    }
    match case.unit_share {
        UnitShare::Whole => (1.0, Vec::new(), Basis::Whole, false),
        UnitShare::Width(be) => {
            let e = be.get().max(wide);
            ((b / e).min(1.0), Vec::new(), Basis::Width { width: e }, false)
        }
        UnitShare::Rule if along_span => (1.0, Vec::new(), Basis::AlongSpan, false),
        UnitShare::Rule => {
            // the least width over the load's extent gives the largest share
            let (x0, x1) = x;
            let probe = [x0, x1, l / 4.0, 3.0 * l / 4.0, l / 2.0];
            let be = probe
                .into_iter()
                .filter(|&p| p >= x0 - 1e-9 && p <= x1 + 1e-9)
                .map(|p| rule_width(p, l, b, case.free_edge))
                .fold(f64::INFINITY, f64::min)
                .max(wide);
            (
                (b / be).min(1.0),
                Vec::new(),
                Basis::Rule {
                    width: be,
                    free_edge: case.free_edge,
                },
                true,
            )
        }
    }
}

/// The loads on one unit, by group, and the beam they act on.
#[derive(Debug, Clone, PartialEq)]
pub struct Loads {
    /// The member on its supports.
    pub beam: Beam,
    /// Loads by group (self, topping, sdl, live, roof).
    pub groups: [Vec<Load>; GROUPS],
    /// Support reactions of each group.
    pub reactions: [(f64, f64); GROUPS],
    /// The uniform intensity of each group where it acts, lbf/in.
    pub w: [f64; GROUPS],
    /// The shares of the placed loads.
    pub shares: Vec<Share>,
    /// Self-weight on the casting bed: member on its two ends.
    release: (Beam, Vec<Load>, (f64, f64), f64),
}

/// The group a load of `kind` belongs to in `arr`, or None when the
/// arrangement leaves it off (the other roof load).
fn group(kind: LoadKind, arr: Arrangement) -> Option<usize> {
    match kind {
        LoadKind::Dead => Some(SDL),
        LoadKind::Live => Some(LIVE),
        LoadKind::RoofLive => matches!(arr.roof, RoofKind::RoofLive | RoofKind::Larger).then_some(ROOF),
        LoadKind::Snow => matches!(arr.roof, RoofKind::Snow | RoofKind::Larger).then_some(ROOF),
    }
}

/// The parts of [a, b] inside the region's stretches of the member.
fn clip(region: Region, kind: LoadKind, (a, b): (f64, f64), l: f64, (lo, hi): (f64, f64)) -> Vec<(f64, f64)> {
    let zones: Vec<(f64, f64)> = if !kind.variable() {
        vec![(lo, hi)]
    } else {
        match region {
            Region::Span => vec![(0.0, l)],
            Region::Overhangs => vec![(lo, 0.0), (l, hi)],
            Region::All => vec![(lo, hi)],
        }
    };
    zones
        .into_iter()
        .filter_map(|(z0, z1)| {
            let (s, e) = (a.max(z0), b.min(z1));
            (e > s + 1e-12 || (e >= s && (b - a) <= 1e-12 && a >= z0 && a <= z1)).then_some((s, e))
        })
        .collect()
}

impl Loads {
    /// The loads of `unit` under `arr` for a member of `section` in
    /// concrete of unit weight `mix_weight` (lbf/in³), with a topping of
    /// weight per area `topping_weight` (psi). A unit an opening cuts
    /// carries the loads of the whole unit, the floor over the opening and
    /// the concrete it removes included (conservative: it keeps the cut unit
    /// under exactly the loaded unit's loads, so the two differ only near
    /// the opening).
    pub fn new(case: &DesignCase, section: &Section, mix_weight: f64, topping_weight: f64, unit: &Unit, arr: Arrangement) -> Loads {
        let b = section.props.width_in;
        let l = case.span.get();
        let (a1, a2) = (case.overhang.0.get(), case.overhang.1.get());
        // dead loads stop at the bearing centres unless there is an overhang
        let range = (if a1 > 0.0 { -a1 } else { 0.0 }, if a2 > 0.0 { l + a2 } else { l });
        let w_self = section.props.area_in2 * mix_weight;
        let roof = match arr.roof {
            RoofKind::Larger => case.roof_load(),
            RoofKind::RoofLive => case.roof_live.get(),
            RoofKind::Snow => case.snow.get(),
        };
        let w = [w_self, topping_weight * b, case.sdl.get() * b, case.live.get() * b, roof * b];
        let mut groups: [Vec<Load>; GROUPS] = Default::default();
        let kinds = [LoadKind::Dead, LoadKind::Dead, LoadKind::Dead, LoadKind::Live, LoadKind::RoofLive];
        for g in 0..GROUPS {
            if w[g] != 0.0 {
                for (s, e) in clip(arr.region, kinds[g], range, l, range) {
                    groups[g].push(Load::Span { w: w[g], a: s, b: e });
                }
            }
        }
        for ll in &case.line_loads {
            if let Some(g) = group(ll.kind, arr) {
                let a = ll.at.get();
                if !clip(arr.region, ll.kind, (a, a), l, range).is_empty() {
                    groups[g].push(Load::Point { p: ll.w.get() * b, a });
                }
            }
        }
        let mut shares = Vec::new();
        let mut counts = [0usize; 3];
        for pl in &case.placed {
            let Some(g) = group(pl.kind, arr) else {
                // still count it, so names stay those of the input
                counts[match pl.load {
                    Placed::Point(_) => 0,
                    Placed::Strip(_) => 1,
                    Placed::Patch(_) => 2,
                }] += 1;
                continue;
            };
            match pl.load {
                Placed::Point(p) => {
                    counts[0] += 1;
                    let a = p.at.get();
                    let (f, stems, how, mem) = member_share(case, section, (a, a), p.across.map(|c| c.get()), p.size.1.get(), false);
                    shares.push(Share {
                        kind: "point",
                        number: counts[0],
                        factor: f,
                        stems,
                        basis: how,
                        from_memory: mem,
                    });
                    if !clip(arr.region, pl.kind, (a, a), l, range).is_empty() {
                        groups[g].push(Load::Point { p: p.p.get() * f, a });
                    }
                }
                Placed::Strip(s) => {
                    counts[1] += 1;
                    let (x0, x1) = (s.from.get(), s.to.get());
                    let (f, stems, how, mem) = member_share(case, section, (x0, x1), s.across.map(|c| c.get()), 0.0, true);
                    shares.push(Share {
                        kind: "strip",
                        number: counts[1],
                        factor: f,
                        stems,
                        basis: how,
                        from_memory: mem,
                    });
                    for (a, e) in clip(arr.region, pl.kind, (x0, x1), l, range) {
                        groups[g].push(Load::Span { w: s.w.get() * f, a, b: e });
                    }
                }
                Placed::Patch(p) => {
                    counts[2] += 1;
                    let (x0, x1) = (p.from.get(), p.to.get());
                    let (c0, c1) = (p.across.0.get(), p.across.1.get());
                    let wide = c1 - c0;
                    // the part over the unit, and where its resultant is
                    let (o0, o1) = (c0.max(0.0), c1.min(b));
                    let over = (o1 - o0).max(0.0);
                    let (per_length, f, stems, how, mem) = if section.family == Family::DoubleTee {
                        let (f, stems, how, mem) = member_share(case, section, (x0, x1), Some(0.5 * (o0 + o1)), over, false);
                        (p.q.get() * over, f, stems, how, mem)
                    } else {
                        match case.unit_share {
                            UnitShare::Whole => (p.q.get() * over, 1.0, Vec::new(), Basis::OverUnit { over }, false),
                            _ => {
                                let (f, stems, how, mem) = member_share(case, section, (x0, x1), None, wide, false);
                                (p.q.get() * wide, f, stems, how, mem)
                            }
                        }
                    };
                    shares.push(Share {
                        kind: "patch",
                        number: counts[2],
                        factor: f,
                        stems,
                        basis: how,
                        from_memory: mem,
                    });
                    if per_length > 0.0 {
                        for (a, e) in clip(arr.region, pl.kind, (x0, x1), l, range) {
                            groups[g].push(Load::Span {
                                w: per_length * f,
                                a,
                                b: e,
                            });
                        }
                    }
                }
            }
        }
        for (k, h) in unit.headers.iter().enumerate() {
            let (f, stems, how, mem) = member_share(case, section, (h.at, h.at), Some(h.across), 0.0, false);
            shares.push(Share {
                kind: "header",
                number: k + 1,
                factor: f,
                stems,
                basis: how,
                from_memory: mem,
            });
            let kinds6 = [
                LoadKind::Dead,
                LoadKind::Dead,
                LoadKind::Dead,
                LoadKind::Live,
                LoadKind::RoofLive,
                LoadKind::Snow,
            ];
            for (i, &p) in h.p.iter().enumerate() {
                if p == 0.0 {
                    continue;
                }
                let gi = if i < 3 { Some(SDL) } else { group(kinds6[i], arr) };
                if let Some(gi) = gi {
                    if i >= 4 && arr.roof == RoofKind::Larger && !is_larger(case, kinds6[i]) {
                        continue;
                    }
                    if !clip(arr.region, kinds6[i], (h.at, h.at), l, range).is_empty() {
                        groups[gi].push(Load::Point { p: p * f, a: h.at });
                    }
                }
            }
        }
        let beam = Beam { l };
        let reactions = std::array::from_fn(|g| beam.reactions(&groups[g]));
        // on the bed the member rests on its two ends
        let (e0, e1) = case.ends();
        let bed = Beam { l: e1 - e0 };
        let own: Vec<Load> = vec![Load::Span {
            w: w_self,
            a: 0.0,
            b: e1 - e0,
        }];
        let bed_r = bed.reactions(&own);
        Loads {
            beam,
            groups,
            reactions,
            w,
            shares,
            release: (bed, own, bed_r, e0),
        }
    }

    /// Moment (lbf·in) and shear (lbf) of group `g` at `x`.
    pub fn at(&self, g: usize, x: f64) -> (f64, f64) {
        let l = self.beam.l;
        match self.groups[g].as_slice() {
            [] => (0.0, 0.0),
            // the common case, a uniform load from support to support: its closed form
            [Load::Span { w, a, b }] if *a == 0.0 && *b == l && (0.0..=l).contains(&x) => (w * x * (l - x) / 2.0, w * (l / 2.0 - x)),
            loads => self.beam.at(loads, self.reactions[g], x),
        }
    }

    /// Self-weight moment on the casting bed at `x` (from the left support), lbf·in.
    pub fn release_moment(&self, x: f64) -> f64 {
        let (bed, own, r, e0) = &self.release;
        bed.at(own, *r, x - e0).0
    }

    /// Whether every load has its mirror about midspan (same group, same
    /// size, mirrored place).
    pub fn symmetric(&self) -> bool {
        let l = self.beam.l;
        let mirror = |ld: &Load| match *ld {
            Load::Point { p, a } => Load::Point { p, a: l - a },
            Load::Span { w, a, b } => Load::Span { w, a: l - b, b: l - a },
        };
        let close = |x: &Load, y: &Load| match (*x, *y) {
            (Load::Point { p, a }, Load::Point { p: q, a: b }) => p == q && (a - b).abs() < 1e-9,
            (Load::Span { w, a, b }, Load::Span { w: v, a: c, b: d }) => w == v && (a - c).abs() < 1e-9 && (b - d).abs() < 1e-9,
            _ => false,
        };
        self.groups
            .iter()
            .all(|g| g.iter().all(|ld| g.iter().any(|o| close(o, &mirror(ld)))))
    }

    /// Every place along the member where a load's law changes: supports,
    /// point loads (with `true`: the shear jumps there) and the ends of
    /// partial loads, sorted.
    pub fn breaks(&self) -> Vec<(f64, bool)> {
        let mut out: Vec<(f64, bool)> = vec![(0.0, true), (self.beam.l, true)];
        for g in &self.groups {
            for ld in g {
                match *ld {
                    Load::Point { a, .. } => out.push((a, true)),
                    Load::Span { a, b, .. } => {
                        out.push((a, false));
                        out.push((b, false));
                    }
                }
            }
        }
        out.sort_by(|a, b| a.0.total_cmp(&b.0).then(b.1.cmp(&a.1)));
        out.dedup_by(|a, b| (a.0 - b.0).abs() < 1e-9);
        out
    }
}

/// Whether `kind` (Lr or S) is the larger uniform roof load of the case.
fn is_larger(case: &DesignCase, kind: LoadKind) -> bool {
    match kind {
        LoadKind::RoofLive => case.roof_live.get() >= case.snow.get(),
        LoadKind::Snow => case.snow.get() > case.roof_live.get(),
        _ => true,
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn lever_rule_by_statics() {
        // stems at 24 and 72 in (48 in apart): a load over a stem goes to
        // it; midway, half each; at the flange edge 24 in outside stem 1,
        // stem 1 takes (48 + 24)/48 = 1.5 and stem 2 is lifted by 0.5
        // (statics of the flange as a beam on two supports).
        let s = [24.0, 72.0];
        assert_eq!(lever(&s, 24.0), vec![1.0, 0.0]);
        assert_eq!(lever(&s, 48.0), vec![0.5, 0.5]);
        let edge = lever(&s, 0.0);
        assert_relative_eq!(edge[0], 1.5);
        assert_relative_eq!(edge[1], -0.5);
        let other = lever(&s, 96.0);
        assert_relative_eq!(other[0], -0.5);
        assert_relative_eq!(other[1], 1.5);
        // the shares always sum to the load
        for c in [0.0, 10.0, 30.0, 60.0, 90.0] {
            assert_relative_eq!(lever(&s, c).iter().sum::<f64>(), 1.0, max_relative = 1e-12);
        }
    }

    #[test]
    fn published_rule_width_and_its_taper() {
        // 30 ft span, 4 ft units: 0.5ℓ = 15 ft in the middle half, one unit
        // (4 ft) at the support, linear between (our assumed taper).
        let (l, b) = (360.0, 48.0);
        assert_relative_eq!(rule_width(180.0, l, b, false), 180.0);
        assert_relative_eq!(rule_width(90.0, l, b, false), 180.0);
        assert_relative_eq!(rule_width(0.0, l, b, false), 48.0);
        assert_relative_eq!(rule_width(45.0, l, b, false), 48.0 + (180.0 - 48.0) * 0.5);
        assert_relative_eq!(rule_width(180.0, l, b, true), 90.0);
        // never below one unit
        assert_relative_eq!(rule_width(10.0, l, b, true), 48.0);
        assert_relative_eq!(rule_width(60.0, 80.0, b, false), 48.0);
    }
}

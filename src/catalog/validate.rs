//! From the raw mirror to the validated catalog, collecting every problem.

use std::ops::Range;

use serde::Deserialize;
use toml::Spanned;
use toml::de::{DeTable, DeValue, ValueDeserializer};

use super::diag::{Reporter, suggestion};
use super::raw::{self, Point, RawPattern, RawSection, S};
use super::{Bar, Catalog, FamilySpec, Meta, Pattern, Problems, Published, Row, Section, content_hash};
use crate::material::{Aggregate, Mix, Modulus, Relaxation, StrandKind, builtin_strand, builtin_strand_names};
use crate::section::family::fmt;
use crate::section::{CoreShape, Cores, DoubleTee, Family, Generic, HollowCore, Keyway, VoidSpec};
use crate::units::{Area, AreaLoad, Inertia, Kind, Length, LineLoad, Q, Stress};

/// Plausible ranges; values outside are typing mistakes far more often than
/// real members (common practice, no source).
pub mod limits {
    /// f′c, psi.
    pub const FC_PSI: (f64, f64) = (2500.0, 15000.0);
    /// f′ci, psi.
    pub const FCI_PSI: (f64, f64) = (2000.0, 15000.0);
    /// Unit weight, pcf (the range of ACI 318-19 §19.2.2.1(a)).
    pub const WC_PCF: (f64, f64) = (90.0, 160.0);
    /// Given Ec, ksi.
    pub const EC_KSI: (f64, f64) = (1000.0, 10000.0);
    /// Strand diameter, in.
    pub const STRAND_D_IN: (f64, f64) = (0.2, 0.75);
    /// Strand area, in².
    pub const STRAND_A_IN2: (f64, f64) = (0.02, 0.35);
    /// fpu, ksi.
    pub const FPU_KSI: (f64, f64) = (200.0, 300.0);
    /// Eps, ksi.
    pub const EPS_KSI: (f64, f64) = (25000.0, 30000.0);
    /// Member depth, in.
    pub const DEPTH_IN: (f64, f64) = (2.0, 60.0);
    /// Member width, in.
    pub const WIDTH_IN: (f64, f64) = (12.0, 240.0);
    /// Strands in one pattern.
    pub const STRANDS: (i64, i64) = (1, 100);
    /// Cores in one unit.
    pub const CORES: (i64, i64) = (1, 30);
    /// Stems of a tee.
    pub const STEMS: (i64, i64) = (1, 6);
    /// Jacking stress ÷ fpu.
    pub const JACKING: (f64, f64) = (0.5, 0.85);
    /// Hold-down position ÷ member length.
    pub const HOLD_DOWN: (f64, f64) = (0.05, 0.5);
    /// Bars in one group.
    pub const BARS: (i64, i64) = (1, 40);
    /// Bar area, in².
    pub const BAR_A_IN2: (f64, f64) = (0.05, 2.5);
    /// fy, ksi.
    pub const FY_KSI: (f64, f64) = (40.0, 100.0);
    /// Production length, ft.
    pub const LENGTH_FT: (f64, f64) = (5.0, 200.0);
    /// Longest text value, characters.
    pub const TEXT_CHARS: usize = 500;
}

/// Published figures further than this from ours draw a warning.
pub const PUBLISHED_TOLERANCE: f64 = 0.02;

struct Ctx<'a> {
    rep: Reporter<'a>,
}

fn span<T>(s: &Spanned<T>) -> Option<Range<usize>> {
    Some(s.span())
}

impl Ctx<'_> {
    fn q<K: Kind>(&mut self, s: &S, path: &str, field: &str) -> Option<Q<K>> {
        match Q::<K>::parse(s.get_ref()) {
            Ok(v) => Some(v),
            Err(e) => {
                self.rep.error(span(s), &join(path, field), e.to_string());
                None
            }
        }
    }

    fn opt_q<K: Kind>(&mut self, s: &Option<S>, path: &str, field: &str) -> Option<Option<Q<K>>> {
        match s {
            None => Some(None),
            Some(s) => self.q::<K>(s, path, field).map(Some),
        }
    }

    /// A quantity that must lie in [lo, hi] (in `unit`).
    fn ranged<K: Kind>(&mut self, s: &S, path: &str, field: &str, (lo, hi): (f64, f64), unit: &str) -> Option<Q<K>> {
        let v = self.q::<K>(s, path, field)?;
        let x = v.in_unit(unit);
        if !(lo..=hi).contains(&x) {
            self.rep.error(
                span(s),
                &join(path, field),
                format!("'{}' is outside the plausible range {} to {} {unit}", s.get_ref(), fmt(lo), fmt(hi)),
            );
            return None;
        }
        Some(v)
    }

    /// A length that must be positive.
    fn positive_len(&mut self, s: &S, path: &str, field: &str) -> Option<Length> {
        let v = self.q::<crate::units::LengthK>(s, path, field)?;
        if v.get() <= 0.0 {
            self.rep.error(span(s), &join(path, field), format!("'{}' must be greater than zero", s.get_ref()));
            return None;
        }
        Some(v)
    }

    fn count(&mut self, c: &Spanned<i64>, path: &str, field: &str, (lo, hi): (i64, i64)) -> Option<u32> {
        let v = *c.get_ref();
        if !(lo..=hi).contains(&v) {
            self.rep.error(span(c), &join(path, field), format!("{v} is outside the allowed range {lo} to {hi}"));
            return None;
        }
        Some(v as u32)
    }

    fn text(&mut self, s: &Option<S>, path: &str, field: &str) -> String {
        match s {
            None => String::new(),
            Some(s) => {
                if s.get_ref().chars().count() > limits::TEXT_CHARS {
                    self.rep.error(
                        span(s),
                        &join(path, field),
                        format!("is {} characters long; at most {} allowed", s.get_ref().chars().count(), limits::TEXT_CHARS),
                    );
                }
                s.get_ref().clone()
            }
        }
    }

    fn id(&mut self, s: &S, path: &str) -> String {
        let id = s.get_ref();
        if id.trim().is_empty() {
            self.rep.error(span(s), &join(path, "id"), "is empty; give each entry a short id");
        } else if id.chars().count() > 80 {
            self.rep.error(span(s), &join(path, "id"), format!("is {} characters long; at most 80 allowed", id.chars().count()));
        }
        id.clone()
    }

    fn point(&mut self, p: &Point, path: &str, field: &str) -> Option<(f64, f64)> {
        let v = p.get_ref();
        if v.len() != 2 {
            self.rep.error(
                span(p),
                &join(path, field),
                format!("a point is two lengths [x, y], e.g. [\"0 in\", \"8 in\"]; found {} values", v.len()),
            );
            return None;
        }
        let x = self.q::<crate::units::LengthK>(&v[0], path, field)?;
        let y = self.q::<crate::units::LengthK>(&v[1], path, field)?;
        Some((x.get(), y.get()))
    }

    fn points(&mut self, pts: &Spanned<Vec<Point>>, path: &str, field: &str, min: usize) -> Option<Vec<(f64, f64)>> {
        let mut out = Vec::new();
        let mut ok = true;
        for p in pts.get_ref() {
            match self.point(p, path, field) {
                Some(xy) => out.push(xy),
                None => ok = false,
            }
        }
        if ok && out.len() < min {
            self.rep.error(span(pts), &join(path, field), format!("has {} points; at least {min} needed", out.len()));
            return None;
        }
        ok.then_some(out)
    }
}

fn join(path: &str, field: &str) -> String {
    if path.is_empty() {
        field.to_string()
    } else if field.is_empty() {
        path.to_string()
    } else {
        format!("{path} / {field}")
    }
}

/// Turn a serde error into a problem, naming the key and suggesting the
/// nearest allowed one for a misspelling.
fn serde_problem(rep: &mut Reporter, err: &toml::de::Error, entry: &Spanned<DeValue>, path: &str) {
    let msg = err.message().to_string();
    let at = err.span();
    let field = at.as_ref().map(|s| field_path(entry, s.start)).unwrap_or_default();
    let message = if let Some(rest) = msg.strip_prefix("unknown field `") {
        let (name, tail) = rest.split_once('`').unwrap_or((rest, ""));
        let allowed: Vec<&str> = tail.split('`').skip(1).step_by(2).collect();
        format!(
            "unknown key '{name}'{}; allowed here: {}",
            suggestion(name, allowed.iter().copied()),
            allowed.join(", ")
        )
    } else if let Some(rest) = msg.strip_prefix("missing field `") {
        let name = rest.split('`').next().unwrap_or(rest);
        format!("missing key '{name}'")
    } else if msg.starts_with("invalid type") && msg.contains("expected a string") {
        format!("{msg}; quantities are quoted strings with a unit, e.g. \"8 in\"")
    } else {
        msg.replace("expected i64", "expected a whole number").replace("expected f64", "expected a number")
    };
    rep.error(at, &join(path, &field), message);
}

/// The dotted key path of the key or value under byte offset `at` within
/// `v`, searched depth-first (header tables carry no span of their own).
fn field_path(v: &Spanned<DeValue>, at: usize) -> String {
    fn walk(v: &Spanned<DeValue>, at: usize, path: &mut Vec<String>) -> bool {
        match v.get_ref() {
            DeValue::Table(t) => {
                for (k, val) in t.iter() {
                    path.push(k.get_ref().to_string());
                    if k.span().contains(&at) || walk(val, at, path) {
                        return true;
                    }
                    path.pop();
                }
                v.span().contains(&at)
            }
            DeValue::Array(a) => {
                for (i, val) in a.iter().enumerate() {
                    if let Some(last) = path.last_mut() {
                        let base = last.clone();
                        last.push_str(&format!("[{}]", i + 1));
                        if walk(val, at, path) {
                            return true;
                        }
                        if let Some(l) = path.last_mut() {
                            *l = base;
                        }
                    } else if walk(val, at, path) {
                        return true;
                    }
                }
                false
            }
            _ => v.span().contains(&at),
        }
    }
    let mut path = Vec::new();
    if walk(v, at, &mut path) { path.join(" / ") } else { String::new() }
}

fn de<'a, T: Deserialize<'a>>(rep: &mut Reporter, v: &Spanned<DeValue<'a>>, path: &str) -> Option<T> {
    match T::deserialize(ValueDeserializer::from(v.clone())) {
        Ok(t) => Some(t),
        Err(e) => {
            serde_problem(rep, &e, v, path);
            None
        }
    }
}

fn key_str<'t>(t: &'t DeTable, key: &str) -> Option<&'t str> {
    t.iter().find(|(k, _)| k.get_ref() == key).and_then(|(_, v)| v.get_ref().as_str())
}

/// Entries of an array of tables, or a problem when the key is not one.
fn tables<'v, 'a>(rep: &mut Reporter, v: &'v Spanned<DeValue<'a>>, key: &str) -> Vec<&'v Spanned<DeValue<'a>>> {
    match v.get_ref() {
        DeValue::Array(a) if a.iter().all(|e| e.get_ref().is_table()) => a.iter().collect(),
        _ => {
            rep.error(Some(v.span()), key, format!("'{key}' must be a list of tables, written [[{key}]]; found a {}", v.get_ref().type_str()));
            Vec::new()
        }
    }
}

/// Validate catalog text.
pub fn catalog(text: &str, file: &str) -> Result<Catalog, Problems> {
    let mut cx = Ctx {
        rep: Reporter::new(file, text),
    };
    let (root, errors) = DeTable::parse_recoverable(text);
    if !errors.is_empty() {
        for e in &errors {
            cx.rep.error(e.span(), "", format!("TOML syntax: {}", e.message()));
        }
        return Err(Problems(cx.rep.finish()));
    }
    let root_span = root.span();
    let root = root.into_inner();

    let mut meta = Meta {
        code: "ACI 318-19".into(),
        ..Meta::default()
    };
    let mut raw_mixes = Vec::new();
    let mut raw_strands = Vec::new();
    let mut raw_sections: Vec<(Spanned<RawSection>, Vec<Spanned<RawPattern>>, usize)> = Vec::new();
    // ids of entries that failed to parse, so references to them are not
    // reported a second time
    let mut broken_mixes: Vec<String> = Vec::new();
    let mut broken_strands: Vec<String> = Vec::new();
    let mut saw_catalog = false;

    for (k, v) in root.iter() {
        match k.get_ref().as_ref() {
            "catalog" => {
                saw_catalog = true;
                if let Some(m) = de::<raw::RawMeta>(&mut cx.rep, v, "catalog") {
                    meta.name = cx.text(&Some(m.name), "catalog", "name");
                    meta.producer = cx.text(&m.producer, "catalog", "producer");
                    if let Some(code) = &m.code {
                        if code.get_ref() != "ACI 318-19" {
                            cx.rep.error(span(code), "catalog / code", format!("'{}' is not supported; plankwise checks to 'ACI 318-19'", code.get_ref()));
                        }
                    }
                    meta.notes = m.notes.unwrap_or_default().into_iter().map(|n| n.into_inner()).collect();
                }
            }
            "mix" => {
                for (i, e) in tables(&mut cx.rep, v, "mix").into_iter().enumerate() {
                    let id = e.get_ref().as_table().and_then(|t| key_str(t, "id"));
                    let path = id.map_or(format!("mix {}", i + 1), |id| format!("mix '{id}'"));
                    match de::<raw::RawMix>(&mut cx.rep, e, &path) {
                        Some(m) => raw_mixes.push(Spanned::new(e.span(), m)),
                        None => broken_mixes.extend(e.get_ref().as_table().and_then(|t| key_str(t, "id")).map(String::from)),
                    }
                }
            }
            "strand" => {
                for (i, e) in tables(&mut cx.rep, v, "strand").into_iter().enumerate() {
                    let id = e.get_ref().as_table().and_then(|t| key_str(t, "id"));
                    let path = id.map_or(format!("strand {}", i + 1), |id| format!("strand '{id}'"));
                    match de::<raw::RawStrand>(&mut cx.rep, e, &path) {
                        Some(m) => raw_strands.push(Spanned::new(e.span(), m)),
                        None => broken_strands.extend(e.get_ref().as_table().and_then(|t| key_str(t, "id")).map(String::from)),
                    }
                }
            }
            "section" => {
                if v.get_ref().as_table().is_some_and(|t| t.iter().any(|(k, _)| k.get_ref() == "pattern")) {
                    cx.rep.error(
                        Some(v.span()),
                        "section",
                        "a [[section.pattern]] appears before any [[section]]; put each pattern after the [[section]] it belongs to",
                    );
                    continue;
                }
                for (i, e) in tables(&mut cx.rep, v, "section").into_iter().enumerate() {
                    let Some(t) = e.get_ref().as_table() else { continue };
                    let name = key_str(t, "id").map_or(format!("section {}", i + 1), |id| format!("section '{id}'"));
                    // split off the patterns so each is parsed on its own
                    let mut body = t.clone();
                    let pats = body
                        .iter()
                        .find(|(k, _)| k.get_ref() == "pattern")
                        .map(|(k, v)| (k.clone(), v.clone()));
                    let mut patterns = Vec::new();
                    let mut pattern_failures = 0;
                    if let Some((pk, pv)) = pats {
                        body.remove(&pk);
                        for (j, pe) in tables(&mut cx.rep, &pv, &format!("{name} / pattern")).into_iter().enumerate() {
                            let pname = pe
                                .get_ref()
                                .as_table()
                                .and_then(|t| key_str(t, "id"))
                                .map_or(format!("{name} / pattern {}", j + 1), |id| format!("{name} / pattern '{id}'"));
                            match de::<RawPattern>(&mut cx.rep, pe, &pname) {
                                Some(p) => patterns.push(Spanned::new(pe.span(), p)),
                                None => pattern_failures += 1,
                            }
                        }
                    }
                    let bv = Spanned::new(e.span(), DeValue::Table(body));
                    if let Some(s) = de::<RawSection>(&mut cx.rep, &bv, &name) {
                        raw_sections.push((Spanned::new(e.span(), s), patterns, pattern_failures));
                    }
                }
            }
            other => {
                cx.rep.error(
                    Some(k.span()),
                    "",
                    format!(
                        "unknown top-level key '{other}'{}; allowed: {}",
                        suggestion(other, raw::TOP_KEYS.iter().copied()),
                        raw::TOP_KEYS.join(", ")
                    ),
                );
            }
        }
    }
    if !saw_catalog {
        cx.rep.error(Some(root_span.start..root_span.start), "catalog", "missing [catalog] table with at least name = \"…\"");
    }

    // mixes
    let mut mixes: Vec<Mix> = Vec::new();
    for m in &raw_mixes {
        let path = format!("mix '{}'", m.get_ref().id.get_ref());
        let found = mix(&mut cx, m.get_ref(), &path);
        if found.is_none() {
            broken_mixes.push(m.get_ref().id.get_ref().clone());
        }
        if let Some(mix) = found {
            if mixes.iter().any(|x| x.id == mix.id) {
                cx.rep.error(span(&m.get_ref().id), &join(&path, "id"), format!("duplicate mix id '{}'; each id must be unique", mix.id));
            }
            mixes.push(mix);
        }
    }
    // strands
    let mut strands: Vec<StrandKind> = Vec::new();
    for s in &raw_strands {
        let path = format!("strand '{}'", s.get_ref().id.get_ref());
        let found = strand(&mut cx, s.get_ref(), &path);
        if found.is_none() {
            broken_strands.push(s.get_ref().id.get_ref().clone());
        }
        if let Some(st) = found {
            if strands.iter().any(|x| x.id == st.id) || builtin_strand(&st.id).is_some() {
                cx.rep.error(
                    span(&s.get_ref().id),
                    &join(&path, "id"),
                    format!("duplicate strand id '{}'; ids must differ from each other and from the built-in names", st.id),
                );
            }
            strands.push(st);
        }
    }
    // sections
    let mut sections: Vec<Section> = Vec::new();
    let mut section_count = 0;
    for (s, pats, failures) in &raw_sections {
        section_count += 1;
        let path = format!("section '{}'", s.get_ref().id.get_ref());
        let refs = Refs {
            mixes: &mixes,
            broken_mixes: &broken_mixes,
            strands: &strands,
            broken_strands: &broken_strands,
        };
        if let Some(sec) = section(&mut cx, s, pats, *failures, &path, &refs) {
            if sections.iter().any(|x| x.id == sec.id) {
                cx.rep.error(span(&s.get_ref().id), &join(&path, "id"), format!("duplicate section id '{}'; each id must be unique", sec.id));
            }
            sections.push(sec);
        }
    }
    if section_count == 0 && !cx.rep.has_errors() {
        cx.rep.error(Some(root_span.start..root_span.start), "section", "the catalog has no sections; add at least one [[section]] with a [[section.pattern]]");
    }

    if cx.rep.has_errors() {
        return Err(Problems(cx.rep.finish()));
    }
    Ok(Catalog {
        meta,
        mixes,
        strands,
        sections,
        warnings: cx.rep.finish(),
        hash: content_hash(text),
    })
}

fn mix(cx: &mut Ctx, m: &raw::RawMix, path: &str) -> Option<Mix> {
    let id = cx.id(&m.id, path);
    let fc = cx.ranged::<crate::units::StressK>(&m.fc, path, "fc", limits::FC_PSI, "psi");
    let fci = cx.ranged::<crate::units::StressK>(&m.fci, path, "fci", limits::FCI_PSI, "psi");
    let wc = cx.ranged::<crate::units::UnitWeightK>(&m.unit_weight, path, "unit_weight", limits::WC_PCF, "pcf");
    let agg = Aggregate::from_name(m.aggregate.get_ref());
    if agg.is_none() {
        cx.rep.error(
            span(&m.aggregate),
            &join(path, "aggregate"),
            format!(
                "'{}' is not an aggregate kind{}; use one of: {}",
                m.aggregate.get_ref(),
                suggestion(m.aggregate.get_ref(), Aggregate::NAMES.iter().copied()),
                Aggregate::NAMES.join(", ")
            ),
        );
    }
    let modulus = match m.modulus.as_ref().map(|s| (s, s.get_ref().as_str())) {
        None | Some((_, "unit-weight")) => Some(Modulus::UnitWeight),
        Some((_, "normalweight")) => Some(Modulus::Normalweight),
        Some((s, _)) => match Stress::parse(s.get_ref()) {
            Ok(_) => cx.ranged::<crate::units::StressK>(s, path, "modulus", limits::EC_KSI, "ksi").map(Modulus::Given),
            Err(_) => {
                cx.rep.error(
                    span(s),
                    &join(path, "modulus"),
                    format!(
                        "'{}' is neither a formula nor a stress{}; use 'unit-weight' (33 wc^1.5 √f'c), 'normalweight' (57000 √f'c) or a value such as \"4400 ksi\"",
                        s.get_ref(),
                        suggestion(s.get_ref(), ["unit-weight", "normalweight"])
                    ),
                );
                None
            }
        },
    };
    let (fc, fci, wc, agg, modulus) = (fc?, fci?, wc?, agg?, modulus?);
    if fci.get() > fc.get() {
        cx.rep.error(
            span(&m.fci),
            &join(path, "fci"),
            format!("f'ci '{}' is above f'c '{}'; the strength at release cannot exceed the specified strength", m.fci.get_ref(), m.fc.get_ref()),
        );
        return None;
    }
    if modulus == Modulus::Normalweight && !matches!(agg, Aggregate::Siliceous | Aggregate::Carbonate) {
        cx.rep.error(
            m.modulus.as_ref().map(|s| s.span()),
            &join(path, "modulus"),
            format!("'normalweight' (57000 √f'c) applies only to normalweight concrete, not {}; use 'unit-weight'", agg.name()),
        );
        return None;
    }
    Some(Mix {
        id,
        fc,
        fci,
        unit_weight: wc,
        aggregate: agg,
        modulus,
    })
}

fn strand(cx: &mut Ctx, s: &raw::RawStrand, path: &str) -> Option<StrandKind> {
    let id = cx.id(&s.id, path);
    let d = cx.ranged::<crate::units::LengthK>(&s.diameter, path, "diameter", limits::STRAND_D_IN, "in");
    let a = cx.ranged::<crate::units::AreaK>(&s.area, path, "area", limits::STRAND_A_IN2, "in2");
    let fpu = cx.ranged::<crate::units::StressK>(&s.fpu, path, "fpu", limits::FPU_KSI, "ksi");
    let relaxation = match s.relaxation.as_ref().map(|r| r.get_ref().as_str()) {
        None | Some("low") => Some(Relaxation::Low),
        Some("stress-relieved") => Some(Relaxation::StressRelieved),
        Some(other) => {
            cx.rep.error(
                s.relaxation.as_ref().map(|r| r.span()),
                &join(path, "relaxation"),
                format!("'{other}'{} is not a relaxation class; use 'low' or 'stress-relieved'", suggestion(other, ["low", "stress-relieved"])),
            );
            None
        }
    };
    let eps = match &s.modulus {
        None => Some(Stress::from_unit(28_500.0, "ksi")),
        Some(m) => cx.ranged::<crate::units::StressK>(m, path, "modulus", limits::EPS_KSI, "ksi"),
    };
    let fpy = cx.opt_q::<crate::units::StressK>(&s.fpy, path, "fpy");
    let (d, a, fpu, relaxation, eps, fpy) = (d?, a?, fpu?, relaxation?, eps?, fpy?);
    // ASTM A416: fpy at 1 % extension is 0.90 fpu (low-relaxation) or 0.85 fpu
    let fpy = fpy.unwrap_or(fpu * if relaxation == Relaxation::Low { 0.90 } else { 0.85 });
    if fpy.get() > fpu.get() || fpy.get() < 0.8 * fpu.get() {
        cx.rep.error(
            s.fpy.as_ref().map(|f| f.span()),
            &join(path, "fpy"),
            format!("fpy {} ksi must lie between 0.80 fpu and fpu ({} ksi)", fmt(fpy.in_unit("ksi")), fmt(fpu.in_unit("ksi"))),
        );
        return None;
    }
    Some(StrandKind {
        id,
        diameter: d,
        area: a,
        fpu,
        fpy,
        eps,
        relaxation,
    })
}

struct Refs<'r> {
    mixes: &'r [Mix],
    broken_mixes: &'r [String],
    strands: &'r [StrandKind],
    broken_strands: &'r [String],
}

fn section(
    cx: &mut Ctx,
    s: &Spanned<RawSection>,
    pats: &[Spanned<RawPattern>],
    pattern_failures: usize,
    path: &str,
    refs: &Refs,
) -> Option<Section> {
    let r = s.get_ref();
    let id = cx.id(&r.id, path);
    let designation = if r.designation.is_some() { cx.text(&r.designation, path, "designation") } else { id.clone() };
    let remarks = cx.text(&r.remarks, path, "remarks");
    let mix = refs.mixes.iter().position(|m| &m.id == r.mix.get_ref());
    if mix.is_none() && !refs.broken_mixes.contains(r.mix.get_ref()) {
        let ids: Vec<&str> = refs.mixes.iter().map(|m| m.id.as_str()).collect();
        cx.rep.error(
            span(&r.mix),
            &join(path, "mix"),
            format!(
                "no mix with id '{}'{}; the catalog has: {}",
                r.mix.get_ref(),
                suggestion(r.mix.get_ref(), ids.iter().copied()),
                if ids.is_empty() { "no mixes".to_string() } else { ids.join(", ") }
            ),
        );
    }
    let given = [r.hollow_core.is_some(), r.double_tee.is_some(), r.generic.is_some()].iter().filter(|&&b| b).count();
    if given != 1 {
        cx.rep.error(
            Some(s.span()),
            path,
            format!(
                "give exactly one geometry table — [section.hollow_core], [section.double_tee] or [section.generic]; found {given}"
            ),
        );
        return None;
    }
    let spec = if let Some(h) = &r.hollow_core {
        hollow_core(cx, h, &join(path, "hollow_core")).map(FamilySpec::HollowCore)
    } else if let Some(t) = &r.double_tee {
        double_tee(cx, t, &join(path, "double_tee")).map(FamilySpec::DoubleTee)
    } else if let Some(g) = &r.generic {
        generic(cx, g, &join(path, "generic")).map(FamilySpec::Generic)
    } else {
        None
    };
    let price = cx.opt_q::<crate::units::PriceK>(&r.price, path, "price");
    let max_length = match &r.max_length {
        None => Some(None),
        Some(m) => cx.ranged::<crate::units::LengthK>(m, path, "max_length", limits::LENGTH_FT, "ft").map(Some),
    };
    if pats.is_empty() && pattern_failures == 0 {
        cx.rep.error(Some(s.span()), path, "has no strand patterns; add at least one [[section.pattern]]");
    }
    let family = if r.hollow_core.is_some() {
        Family::HollowCore
    } else if r.double_tee.is_some() {
        Family::DoubleTee
    } else {
        Family::Generic
    };
    let shaped = spec.map(|spec| {
        let geometry = match &spec {
            FamilySpec::HollowCore(h) => h.geometry(),
            FamilySpec::DoubleTee(t) => t.geometry(),
            FamilySpec::Generic(g) => g.geometry(),
        };
        (spec, geometry)
    });
    // patterns are checked even when the geometry is broken, so that their
    // own problems are reported too; positions need the geometry
    let mut patterns: Vec<Pattern> = Vec::new();
    for p in pats {
        let ppath = format!("{path} / pattern '{}'", p.get_ref().id.get_ref());
        let shape = shaped.as_ref().map(|(s, g)| (s, g));
        if let Some(pat) = pattern(cx, p, &ppath, shape, family, refs) {
            if patterns.iter().any(|x| x.id == pat.id) {
                cx.rep.error(span(&p.get_ref().id), &join(&ppath, "id"), format!("duplicate pattern id '{}' in this section", pat.id));
            }
            patterns.push(pat);
        }
    }
    let (spec, geometry) = shaped?;
    let props = geometry.properties();
    let published = published(cx, r.published.as_ref(), path);
    let (mix, price, max_length) = (mix?, price?, max_length?);
    let sec = Section {
        id,
        designation,
        family,
        mix,
        spec,
        geometry,
        props,
        published: published?,
        patterns,
        price,
        max_length,
        remarks,
    };
    compare_published(cx, &sec, &refs.mixes[mix], r.published.as_ref(), path);
    Some(sec)
}

fn hollow_core(cx: &mut Ctx, h: &Spanned<raw::RawHollowCore>, path: &str) -> Option<HollowCore> {
    let r = h.get_ref();
    let width = cx.ranged::<crate::units::LengthK>(&r.width, path, "width", limits::WIDTH_IN, "in");
    let depth = cx.ranged::<crate::units::LengthK>(&r.depth, path, "depth", limits::DEPTH_IN, "in");
    let c = r.cores.get_ref();
    let cpath = join(path, "cores");
    let count = cx.count(&c.count, &cpath, "count", limits::CORES);
    let spacing = cx.positive_len(&c.spacing, &cpath, "spacing");
    let center = c.center_height.as_ref().map(|s| cx.positive_len(s, &cpath, "center_height"));
    let need = |cx: &mut Ctx, v: &Option<S>, key: &str, why: &str| -> Option<Length> {
        match v {
            Some(s) => cx.positive_len(s, &cpath, key),
            None => {
                cx.rep.error(Some(r.cores.span()), &cpath, format!("missing key '{key}' ({why})"));
                None
            }
        }
    };
    let shape_name = c.shape.get_ref().as_str();
    let (shape, w, ht) = match shape_name {
        "circle" => {
            for (k, v) in [("width", &c.width), ("height", &c.height), ("corner_radius", &c.corner_radius)] {
                if let Some(v) = v {
                    cx.rep.error(span(v), &join(&cpath, k), format!("'{k}' does not apply to circular cores; give 'diameter'"));
                }
            }
            let d = need(cx, &c.diameter, "diameter", "circular cores need a diameter");
            (Some(CoreShape::Circle), d, d)
        }
        "stadium" | "oval" | "rounded-rectangle" => {
            if let Some(v) = &c.diameter {
                cx.rep.error(span(v), &join(&cpath, "diameter"), format!("'diameter' is for circular cores; {shape_name} cores take 'width' and 'height'"));
            }
            let w = need(cx, &c.width, "width", "the overall core width");
            let ht = need(cx, &c.height, "height", "the overall core height");
            let shape = if shape_name == "rounded-rectangle" {
                need(cx, &c.corner_radius, "corner_radius", "rounded rectangles need a corner radius").and_then(|r| {
                    let limit = w.zip(ht).map_or(f64::INFINITY, |(w, h)| w.get().min(h.get()) / 2.0);
                    if r.get() > limit {
                        cx.rep.error(
                            c.corner_radius.as_ref().map(|s| s.span()),
                            &join(&cpath, "corner_radius"),
                            format!("{} in is more than half the smaller core side ({} in)", fmt(r.get()), fmt(limit)),
                        );
                        None
                    } else {
                        Some(CoreShape::RoundedRect { radius: r.get() })
                    }
                })
            } else {
                if let Some(v) = &c.corner_radius {
                    cx.rep.error(span(v), &join(&cpath, "corner_radius"), "'corner_radius' applies only to rounded-rectangle cores");
                }
                Some(CoreShape::Stadium)
            };
            (shape, w, ht)
        }
        other => {
            cx.rep.error(
                span(&c.shape),
                &join(&cpath, "shape"),
                format!(
                    "'{other}' is not a core shape{}; use circle, stadium (or oval) or rounded-rectangle",
                    suggestion(other, ["circle", "stadium", "oval", "rounded-rectangle"])
                ),
            );
            (None, None, None)
        }
    };
    let keyway = match &r.keyway {
        None => Some(None),
        Some(k) => keyway(cx, k, &join(path, "keyway"), width.zip(depth)).map(Some),
    };
    let (width, depth, count, spacing, shape, w, ht, keyway) = (width?, depth?, count?, spacing?, shape?, w?, ht?, keyway?);
    let center_height = match center {
        None => depth.get() / 2.0,
        Some(c) => c?.get(),
    };
    let hc = HollowCore {
        width: width.get(),
        depth: depth.get(),
        cores: Cores {
            shape,
            count,
            width: w.get(),
            height: ht.get(),
            spacing: spacing.get(),
            center_height,
        },
        keyway,
    };
    let problems = hc.shell_problems();
    for p in &problems {
        cx.rep.error(Some(r.cores.span()), &cpath, p.clone());
    }
    problems.is_empty().then_some(hc)
}

fn keyway(cx: &mut Ctx, k: &Spanned<raw::RawKeyway>, path: &str, wd: Option<(Length, Length)>) -> Option<Keyway> {
    let r = k.get_ref();
    match (&r.profile, &r.area) {
        (Some(p), None) => {
            let pts = cx.points(p, path, "profile", 2)?;
            let (w, d) = wd?;
            let (w, d) = (w.get(), d.get());
            let ok_ends = pts.first().is_some_and(|p| p.1.abs() < 1e-9) && pts.last().is_some_and(|p| (p.1 - d).abs() < 1e-9);
            let rising = pts.windows(2).all(|q| q[1].1 >= q[0].1);
            let insets = pts.iter().all(|p| p.0 >= 0.0 && p.0 < w / 4.0);
            if !ok_ends || !rising || !insets {
                cx.rep.error(
                    span(p),
                    &join(path, "profile"),
                    format!(
                        "the side-face profile must run from height 0 to the depth ({} in) without going down, with insets from 0 to less than a quarter of the width ({} in)",
                        fmt(d),
                        fmt(w / 4.0)
                    ),
                );
                return None;
            }
            Some(Keyway::Profile(pts))
        }
        (None, Some(a)) => {
            let area = cx.q::<crate::units::AreaK>(a, path, "area")?;
            if area.get() <= 0.0 {
                cx.rep.error(span(a), &join(path, "area"), format!("'{}' must be greater than zero", a.get_ref()));
                return None;
            }
            let centroid = match &r.center_height {
                Some(c) => cx.positive_len(c, path, "center_height")?.get(),
                None => wd?.1.get() / 2.0,
            };
            Some(Keyway::Area {
                area: area.get(),
                centroid,
            })
        }
        _ => {
            cx.rep.error(Some(k.span()), path, "give either 'profile' (side-face points) or 'area' (area removed), not both or neither");
            None
        }
    }
}

fn double_tee(cx: &mut Ctx, t: &Spanned<raw::RawDoubleTee>, path: &str) -> Option<DoubleTee> {
    let r = t.get_ref();
    let fw = cx.ranged::<crate::units::LengthK>(&r.flange_width, path, "flange_width", limits::WIDTH_IN, "in");
    let ft = cx.positive_len(&r.flange_thickness, path, "flange_thickness");
    let d = cx.ranged::<crate::units::LengthK>(&r.depth, path, "depth", limits::DEPTH_IN, "in");
    let stems = match &r.stems {
        None => Some(2),
        Some(s) => cx.count(s, path, "stems", limits::STEMS),
    };
    let sp = cx.positive_len(&r.stem_spacing, path, "stem_spacing");
    let wt = cx.positive_len(&r.stem_width_top, path, "stem_width_top");
    let wb = cx.positive_len(&r.stem_width_bottom, path, "stem_width_bottom");
    let ch = match &r.chamfer {
        None => Some(0.0),
        Some(c) => cx.q::<crate::units::LengthK>(c, path, "chamfer").and_then(|v| {
            if v.get() < 0.0 {
                cx.rep.error(span(c), &join(path, "chamfer"), format!("'{}' must not be negative", c.get_ref()));
                None
            } else {
                Some(v.get())
            }
        }),
    };
    let dt = DoubleTee {
        flange_width: fw?.get(),
        flange_thickness: ft?.get(),
        depth: d?.get(),
        stems: stems?,
        stem_spacing: sp?.get(),
        stem_width_top: wt?.get(),
        stem_width_bottom: wb?.get(),
        chamfer: ch?,
    };
    let problems = dt.shape_problems();
    for p in &problems {
        cx.rep.error(Some(t.span()), path, p.clone());
    }
    problems.is_empty().then_some(dt)
}

fn generic(cx: &mut Ctx, g: &Spanned<raw::RawGeneric>, path: &str) -> Option<Generic> {
    let r = g.get_ref();
    let outline = cx.points(&r.outline, path, "outline", 3);
    let mut voids = Vec::new();
    let mut ok = true;
    for (i, v) in r.void.iter().flatten().enumerate() {
        let vpath = join(path, &format!("void {}", i + 1));
        let rv = v.get_ref();
        match (&rv.points, &rv.center, &rv.diameter) {
            (Some(p), None, None) => match cx.points(p, &vpath, "points", 3) {
                Some(p) => voids.push(VoidSpec::Polygon(p)),
                None => ok = false,
            },
            (None, Some(c), Some(d)) => match (cx.point(c, &vpath, "center"), cx.positive_len(d, &vpath, "diameter")) {
                (Some((x, y)), Some(d)) => voids.push(VoidSpec::Circle { x, y, diameter: d.get() }),
                _ => ok = false,
            },
            _ => {
                cx.rep.error(Some(v.span()), &vpath, "a void is either 'points' (a polygon) or 'center' with 'diameter' (a circle)");
                ok = false;
            }
        }
    }
    let outline = outline?;
    if !ok {
        return None;
    }
    let spec = Generic { outline, voids };
    let geo = spec.geometry();
    let mut problems = spec.shape_problems();
    if problems.is_empty() {
        let p = geo.properties();
        if !(limits::DEPTH_IN.0..=limits::DEPTH_IN.1).contains(&p.depth_in) {
            problems.push(format!("depth {} in is outside the plausible range {} to {} in", fmt(p.depth_in), limits::DEPTH_IN.0, limits::DEPTH_IN.1));
        }
        if !(limits::WIDTH_IN.0..=limits::WIDTH_IN.1).contains(&p.width_in) {
            problems.push(format!("width {} in is outside the plausible range {} to {} in", fmt(p.width_in), limits::WIDTH_IN.0, limits::WIDTH_IN.1));
        }
        if p.area_in2 <= 0.0 {
            problems.push("the net area is not positive".into());
        }
    }
    for p in &problems {
        cx.rep.error(Some(g.span()), path, p.clone());
    }
    problems.is_empty().then_some(spec)
}

/// Choose `count` of `n` slots symmetrically (web or stem positions).
fn symmetric_pick(n: usize, count: usize) -> Vec<usize> {
    if count == n {
        return (0..n).collect();
    }
    if count == 1 {
        return vec![(n - 1) / 2];
    }
    let mut idx = vec![0usize; count];
    for i in 0..count / 2 {
        idx[i] = ((i as f64) * (n as f64 - 1.0) / (count as f64 - 1.0)).round() as usize;
        idx[count - 1 - i] = n - 1 - idx[i];
    }
    if count % 2 == 1 {
        idx[count / 2] = (n - 1) / 2;
    }
    idx
}

#[allow(clippy::too_many_arguments)]
fn row_positions(cx: &mut Ctx, row: &Spanned<raw::RawRow>, count: u32, spec: &FamilySpec, geometry: &crate::section::Geometry, path: &str) -> Option<Vec<f64>> {
    let r = row.get_ref();
    if let Some(xs) = &r.x {
        let mut out = Vec::new();
        for x in xs.get_ref() {
            out.push(cx.q::<crate::units::LengthK>(x, path, "x")?.get());
        }
        if out.len() != count as usize {
            cx.rep.error(span(xs), &join(path, "x"), format!("gives {} positions for a row of {count} strands", out.len()));
            return None;
        }
        return Some(out);
    }
    let n = count as usize;
    match spec {
        FamilySpec::HollowCore(h) => {
            let webs = h.cores.web_centres(h.width);
            if n > webs.len() {
                cx.rep.error(
                    Some(row.span()),
                    path,
                    format!("{count} strands do not fit one per web in a unit with {} webs; give their positions with x = [...]", webs.len()),
                );
                return None;
            }
            Some(symmetric_pick(webs.len(), n).into_iter().map(|i| webs[i]).collect())
        }
        FamilySpec::DoubleTee(t) => {
            let stems = t.stem_centres();
            if n % stems.len() != 0 {
                cx.rep.error(
                    Some(row.span()),
                    path,
                    format!("{count} strands do not share equally among {} stems; use a multiple of {} or give x = [...]", stems.len(), stems.len()),
                );
                return None;
            }
            let per = n / stems.len();
            // several strands per stem in one row sit on a 2 in grid (common practice, no source)
            Some(
                stems
                    .iter()
                    .flat_map(|&c| (0..per).map(move |k| c + (k as f64 - (per as f64 - 1.0) / 2.0) * 2.0))
                    .collect(),
            )
        }
        FamilySpec::Generic(_) => {
            let (x0, x1) = geometry.outline.x_range();
            Some((0..n).map(|i| x0 + (x1 - x0) * (i as f64 + 0.5) / n as f64).collect())
        }
    }
}

#[allow(clippy::too_many_arguments)]
fn pattern(
    cx: &mut Ctx,
    p: &Spanned<RawPattern>,
    path: &str,
    shape: Option<(&FamilySpec, &crate::section::Geometry)>,
    family: Family,
    refs: &Refs,
) -> Option<Pattern> {
    let r = p.get_ref();
    let id = cx.id(&r.id, path);
    let designation = if r.designation.is_some() { cx.text(&r.designation, path, "designation") } else { id.clone() };
    let remarks = cx.text(&r.remarks, path, "remarks");
    let strand = builtin_strand(r.strand.get_ref()).or_else(|| refs.strands.iter().find(|s| &s.id == r.strand.get_ref()).cloned());
    if strand.is_none() && !refs.broken_strands.contains(r.strand.get_ref()) {
        let mut names: Vec<&str> = builtin_strand_names();
        names.extend(refs.strands.iter().map(|s| s.id.as_str()));
        cx.rep.error(
            span(&r.strand),
            &join(path, "strand"),
            format!(
                "no strand '{}'{}; use a built-in size ({}) or a [[strand]] id",
                r.strand.get_ref(),
                suggestion(r.strand.get_ref(), names.iter().copied()),
                "3/8 in, 7/16 in, 1/2 in, 0.6 in, 9.5 mm, 11.1 mm, 12.7 mm, 15.2 mm"
            ),
        );
    }
    let jacking = match &r.jacking {
        None => Some(0.75),
        Some(j) => {
            let v = *j.get_ref();
            let (lo, hi) = limits::JACKING;
            if (lo..=hi).contains(&v) {
                Some(v)
            } else {
                cx.rep.error(span(j), &join(path, "jacking"), format!("{v} is outside the plausible range {lo} to {hi} (a fraction of fpu)"));
                None
            }
        }
    };
    let hold_down = match &r.hold_down {
        None => Some(None),
        Some(h) => {
            let v = *h.get_ref();
            let (lo, hi) = limits::HOLD_DOWN;
            if (lo..=hi).contains(&v) {
                Some(Some(v))
            } else {
                cx.rep.error(span(h), &join(path, "hold_down"), format!("{v} is outside {lo} to {hi} (a fraction of the member length from each end; 0.5 is one point at midspan)"));
                None
            }
        }
    };
    let price = cx.opt_q::<crate::units::PriceK>(&r.price, path, "price");
    let max_length = match &r.max_length {
        None => Some(None),
        Some(m) => cx.ranged::<crate::units::LengthK>(m, path, "max_length", limits::LENGTH_FT, "ft").map(Some),
    };
    let rows_raw = r.row.as_deref().unwrap_or(&[]);
    if rows_raw.is_empty() {
        cx.rep.error(Some(p.span()), path, "has no strand rows; add at least one [[section.pattern.row]]");
    }
    let depth = shape.map_or(f64::INFINITY, |(_, g)| g.depth);
    let db = strand.as_ref().map_or(0.5, |s| s.diameter.get());
    let mut rows = Vec::new();
    let mut rows_ok = true;
    let mut total: i64 = 0;
    for (i, row) in rows_raw.iter().enumerate() {
        let rpath = join(path, &format!("row {}", i + 1));
        let rr = row.get_ref();
        total += *rr.count.get_ref();
        let count = cx.count(&rr.count, &rpath, "count", limits::STRANDS);
        let height = cx.positive_len(&rr.height, &rpath, "height");
        let end_height = rr.end_height.as_ref().map(|e| cx.positive_len(e, &rpath, "end_height"));
        let debond = rr.debond.as_ref().map(|d| cx.positive_len(d, &rpath, "debond"));
        let mut ok = true;
        for (h, key, s) in [(height, "height", Some(&rr.height)), (end_height.flatten(), "end_height", rr.end_height.as_ref())] {
            if let (Some(h), Some(s)) = (h, s) {
                if h.get() >= depth {
                    cx.rep.error(span(s), &join(&rpath, key), format!("'{}' is not below the top of the {} in section", s.get_ref(), fmt(depth)));
                    ok = false;
                }
            }
        }
        if end_height.is_some() && !family.allows_depressed() {
            cx.rep.error(
                rr.end_height.as_ref().map(|e| e.span()),
                &join(&rpath, "end_height"),
                format!("{} strands stay straight; depressed strands are allowed for double-tee and generic sections only", family.name()),
            );
            ok = false;
        }
        let Some(count) = count else {
            rows_ok = false;
            continue;
        };
        let Some((spec, geometry)) = shape else {
            rows_ok = false;
            continue;
        };
        let xs = if ok { row_positions(cx, row, count, spec, geometry, &rpath) } else { None };
        match (xs, height, end_height.unwrap_or(Some(Length::new(f64::NAN))), debond.unwrap_or(Some(Length::new(f64::NAN)))) {
            (Some(xs), Some(height), Some(eh), Some(dl)) if ok => {
                let eh = (!eh.get().is_nan()).then_some(eh);
                // strands inside the concrete with positive clear cover
                for (k, &x) in xs.iter().enumerate() {
                    for (y, key) in [(Some(height), "height"), (eh, "end_height")] {
                        let Some(y) = y else { continue };
                        let c = geometry.clear_cover(x, y.get(), db);
                        if c <= 0.0 {
                            let in_void = geometry.voids.iter().any(|v| v.signed_distance(x, y.get()) < 0.0);
                            let msg = if !geometry.outline.contains(x, y.get()) {
                                format!("strand {} at x = {} in, y = {} in is not inside the concrete", k + 1, fmt(x), fmt(y.get()))
                            } else if in_void {
                                format!("strand {} at x = {} in, y = {} in lies inside a core or void", k + 1, fmt(x), fmt(y.get()))
                            } else {
                                format!(
                                    "strand {} at x = {} in, y = {} in ({} in diameter) has no clear cover: it breaks through a surface or into a core",
                                    k + 1,
                                    fmt(x),
                                    fmt(y.get()),
                                    fmt(db)
                                )
                            };
                            cx.rep.error(Some(row.span()), &join(&rpath, key), msg);
                            ok = false;
                        }
                    }
                }
                if ok {
                    rows.push(Row {
                        count,
                        height,
                        end_height: eh,
                        x: xs,
                        debond: (!dl.get().is_nan()).then_some(dl),
                    });
                } else {
                    rows_ok = false;
                }
            }
            _ => rows_ok = false,
        }
    }
    if total > limits::STRANDS.1 {
        cx.rep.error(Some(p.span()), path, format!("has {total} strands; at most {} allowed in one pattern", limits::STRANDS.1));
        rows_ok = false;
    }
    let depressed = rows.iter().any(|r| r.end_height.is_some());
    if let Ok(Some(h)) = hold_down.ok_or(()) {
        if !depressed && rows_ok {
            cx.rep.warn(r.hold_down.as_ref().map(|h| h.span()), &join(path, "hold_down"), format!("hold_down {h} is given but no row has an end_height; the strands are straight"));
        }
    }
    if depressed && matches!(hold_down, Some(None)) {
        cx.rep.error(Some(p.span()), path, "depressed rows need 'hold_down' (a fraction of the member length from each end, e.g. 0.4; 0.5 for one point at midspan)");
        rows_ok = false;
    }
    let mut bars = Vec::new();
    for (i, b) in r.bar.iter().flatten().enumerate() {
        let bpath = join(path, &format!("bar {}", i + 1));
        let rb = b.get_ref();
        let count = cx.count(&rb.count, &bpath, "count", limits::BARS);
        let area = cx.ranged::<crate::units::AreaK>(&rb.area, &bpath, "area", limits::BAR_A_IN2, "in2");
        let fy = cx.ranged::<crate::units::StressK>(&rb.fy, &bpath, "fy", limits::FY_KSI, "ksi");
        let height = cx.positive_len(&rb.height, &bpath, "height");
        if let Some(h) = height {
            if h.get() >= depth {
                cx.rep.error(span(&rb.height), &join(&bpath, "height"), format!("'{}' is not below the top of the {} in section", rb.height.get_ref(), fmt(depth)));
                rows_ok = false;
            }
        }
        match (count, area, fy, height) {
            (Some(count), Some(area), Some(fy), Some(height)) => bars.push(Bar { count, area, fy, height }),
            _ => rows_ok = false,
        }
    }
    let (strand, jacking, hold_down, price, max_length) = (strand?, jacking?, hold_down?, price?, max_length?);
    if !rows_ok || rows.is_empty() {
        return None;
    }
    Some(Pattern {
        id,
        designation,
        strand,
        jacking,
        hold_down: if depressed { hold_down } else { None },
        rows,
        bars,
        price,
        max_length,
        remarks,
    })
}

fn published(cx: &mut Ctx, p: Option<&raw::RawPublished>, path: &str) -> Option<Published> {
    let Some(p) = p else { return Some(Published::default()) };
    let path = join(path, "published");
    let area = cx.opt_q::<crate::units::AreaK>(&p.area, &path, "area");
    let yb = cx.opt_q::<crate::units::LengthK>(&p.yb, &path, "yb");
    let inertia = cx.opt_q::<crate::units::InertiaK>(&p.inertia, &path, "inertia");
    let (mut wa, mut wl) = (None, None);
    let mut ok = true;
    if let Some(w) = &p.weight {
        if let Ok(v) = AreaLoad::parse(w.get_ref()) {
            wa = Some(v.get());
        } else if let Ok(v) = LineLoad::parse(w.get_ref()) {
            wl = Some(v.get());
        } else {
            cx.rep.error(span(w), &join(&path, "weight"), format!("'{}' is neither a weight per area (psf, kPa) nor per length (plf, kN/m)", w.get_ref()));
            ok = false;
        }
    }
    let (area, yb, inertia) = (area?, yb?, inertia?);
    ok.then_some(Published {
        area,
        yb,
        inertia: inertia.map(Inertia::get),
        weight_per_area: wa,
        weight_per_length: wl,
    })
}

fn compare_published(cx: &mut Ctx, s: &Section, mix: &Mix, raw: Option<&raw::RawPublished>, path: &str) {
    let Some(raw) = raw else { return };
    let path = join(path, "published");
    let wl = s.weight_per_length(mix);
    let checks: [(Option<f64>, f64, &str, &str, &Option<S>); 5] = [
        (s.published.area.map(Area::get), s.props.area_in2, "area", "in²", &raw.area),
        (s.published.yb.map(Length::get), s.props.yb_in, "yb", "in", &raw.yb),
        (s.published.inertia, s.props.ix_in4, "inertia", "in⁴", &raw.inertia),
        (s.published.weight_per_area.map(|w| w * 144.0), wl / s.props.width_in * 144.0, "weight", "psf", &raw.weight),
        (s.published.weight_per_length.map(|w| w * 12.0), wl * 12.0, "weight", "plf", &raw.weight),
    ];
    for (given, ours, key, unit, src) in checks {
        let Some(given) = given else { continue };
        let diff = (given - ours) / ours;
        if diff.abs() > PUBLISHED_TOLERANCE {
            cx.rep.warn(
                src.as_ref().map(|s| s.span()),
                &join(&path, key),
                format!(
                    "published {key} {given:.1} {unit} differs from the computed {ours:.1} {unit} by {:+.1} %; check the dimensions or the published figure",
                    diff * 100.0
                ),
            );
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn symmetric_choices() {
        assert_eq!(symmetric_pick(7, 4), vec![0, 2, 4, 6]);
        assert_eq!(symmetric_pick(7, 5), vec![0, 2, 3, 4, 6]);
        assert_eq!(symmetric_pick(7, 7), (0..7).collect::<Vec<_>>());
        assert_eq!(symmetric_pick(8, 2), vec![0, 7]);
        assert_eq!(symmetric_pick(7, 1), vec![3]);
    }
}

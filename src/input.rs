//! What both readers share — the catalog's and the job's: the TOML parse
//! with every syntax error at once, deserialising one entry at a time with
//! its problems located, quantities with units and ranges, and text that may
//! reach a terminal or a report (no control characters).

pub mod diag;

use std::ops::Range;

use serde::Deserialize;
use toml::Spanned;
use toml::de::{DeTable, DeValue, ValueDeserializer};

use crate::catalog::Problems;
use crate::section::family::fmt;
use crate::units::{Kind, Length, Q};
use diag::{Reporter, suggestion};

/// A string value with its place in the file.
pub type S = Spanned<String>;

/// Longest text value, characters.
pub const TEXT_CHARS: usize = 500;

/// Whether a character must never reach a terminal or a report: C0 but
/// tab, DEL, C1 (ESC among them), and the bidirectional overrides and
/// isolates (U+202A–U+202E, U+2066–U+2069).
pub fn is_control(c: char) -> bool {
    (c.is_control() && c != '\t') || ('\u{202A}'..='\u{202E}').contains(&c) || ('\u{2066}'..='\u{2069}').contains(&c)
}

/// `s` with every such character written as its escape (`\u{1b}`).
pub fn escape_controls(s: &str) -> String {
    if !s.chars().any(is_control) {
        return s.to_string();
    }
    let mut out = String::with_capacity(s.len() + 8);
    for c in s.chars() {
        if is_control(c) {
            out.extend(c.escape_unicode());
        } else {
            out.push(c);
        }
    }
    out
}

pub(crate) struct Ctx<'a> {
    pub(crate) rep: Reporter<'a>,
}

pub(crate) fn span<T>(s: &Spanned<T>) -> Option<Range<usize>> {
    Some(s.span())
}

impl Ctx<'_> {
    pub(crate) fn q<K: Kind>(&mut self, s: &S, path: &str, field: &str) -> Option<Q<K>> {
        match Q::<K>::parse(s.get_ref()) {
            Ok(v) => Some(v),
            Err(e) => {
                self.rep.error(span(s), &join(path, field), e.to_string());
                None
            }
        }
    }

    pub(crate) fn opt_q<K: Kind>(&mut self, s: &Option<S>, path: &str, field: &str) -> Option<Option<Q<K>>> {
        match s {
            None => Some(None),
            Some(s) => self.q::<K>(s, path, field).map(Some),
        }
    }

    /// A quantity that must lie in [lo, hi] (in `unit`).
    /// A catalog key's quantity, checked against its plausible range
    /// ([`crate::catalog::keys`] defines both).
    pub(crate) fn key_q<K: Kind>(&mut self, s: &S, path: &str, key: &crate::catalog::keys::Key) -> Option<Q<K>> {
        match key.range() {
            Some(r) => self.ranged::<K>(s, path, key.name, (r.lo, r.hi), r.unit),
            None => self.q::<K>(s, path, key.name),
        }
    }

    /// A catalog key's count, checked against its range.
    pub(crate) fn key_count(&mut self, c: &Spanned<i64>, path: &str, key: &crate::catalog::keys::Key) -> Option<u32> {
        self.count(c, path, key.name, key.counts())
    }

    pub(crate) fn ranged<K: Kind>(&mut self, s: &S, path: &str, field: &str, (lo, hi): (f64, f64), unit: &str) -> Option<Q<K>> {
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

    /// A price, which may not be negative (absent: none given).
    pub(crate) fn price(&mut self, s: &Option<S>, path: &str) -> Option<Option<crate::units::PricePerArea>> {
        let v = self.opt_q::<crate::units::PriceK>(s, path, "price")?;
        if let (Some(p), Some(s)) = (v, s)
            && p.get() < 0.0
        {
            self.rep.error(
                span(s),
                &join(path, "price"),
                format!("'{}' is negative; a price is 0 or more", s.get_ref()),
            );
            return None;
        }
        Some(v)
    }

    /// A length that must be positive.
    pub(crate) fn positive_len(&mut self, s: &S, path: &str, field: &str) -> Option<Length> {
        let v = self.q::<crate::units::LengthK>(s, path, field)?;
        if v.get() <= 0.0 {
            self.rep
                .error(span(s), &join(path, field), format!("'{}' must be greater than zero", s.get_ref()));
            return None;
        }
        Some(v)
    }

    pub(crate) fn count(&mut self, c: &Spanned<i64>, path: &str, field: &str, (lo, hi): (i64, i64)) -> Option<u32> {
        let v = *c.get_ref();
        if !(lo..=hi).contains(&v) {
            self.rep.error(
                span(c),
                &join(path, field),
                format!("{v} is outside the allowed range {lo} to {hi}"),
            );
            return None;
        }
        Some(v as u32)
    }

    pub(crate) fn text(&mut self, s: &Option<S>, path: &str, field: &str) -> String {
        match s {
            None => String::new(),
            Some(s) => {
                if let Err(e) = crate::criteria::check_text(s.get_ref()) {
                    self.rep.error(span(s), &join(path, field), e);
                }
                if s.get_ref().chars().count() > TEXT_CHARS {
                    self.rep.error(
                        span(s),
                        &join(path, field),
                        format!("is {} characters long; at most {} allowed", s.get_ref().chars().count(), TEXT_CHARS),
                    );
                }
                s.get_ref().clone()
            }
        }
    }

    /// The designation, or the id when none is given.
    pub(crate) fn designation(&mut self, d: &Option<S>, id: &str, path: &str) -> String {
        if d.is_some() {
            self.text(d, path, "designation")
        } else {
            id.to_string()
        }
    }

    pub(crate) fn id(&mut self, s: &S, path: &str) -> String {
        let id = s.get_ref();
        if let Err(e) = crate::criteria::check_text(id) {
            self.rep.error(span(s), &join(path, "id"), e);
        } else if id.trim().is_empty() {
            self.rep.error(span(s), &join(path, "id"), "is empty; give each entry a short id");
        } else if id.chars().count() > 80 {
            self.rep.error(
                span(s),
                &join(path, "id"),
                format!("is {} characters long; at most 80 allowed", id.chars().count()),
            );
        }
        id.clone()
    }
}

pub(crate) fn join(path: &str, field: &str) -> String {
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
pub(crate) fn serde_problem(rep: &mut Reporter, err: &toml::de::Error, entry: &Spanned<DeValue>, path: &str) {
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
        msg.replace("expected i64", "expected a whole number")
            .replace("expected f64", "expected a number")
    };
    rep.error(at, &join(path, &field), message);
}

/// The dotted key path of the key or value under byte offset `at` within
/// `v`, searched depth-first (header tables carry no span of their own).
pub(crate) fn field_path(v: &Spanned<DeValue>, at: usize) -> String {
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

pub(crate) fn de<'a, T: Deserialize<'a>>(rep: &mut Reporter, v: &Spanned<DeValue<'a>>, path: &str) -> Option<T> {
    match T::deserialize(ValueDeserializer::from(v.clone())) {
        Ok(t) => Some(t),
        Err(e) => {
            serde_problem(rep, &e, v, path);
            None
        }
    }
}

pub(crate) fn key_str<'t>(t: &'t DeTable, key: &str) -> Option<&'t str> {
    t.iter().find(|(k, _)| k.get_ref() == key).and_then(|(_, v)| v.get_ref().as_str())
}

/// Entries of an array of tables, or a problem when the key is not one.
pub(crate) fn tables<'v, 'a>(rep: &mut Reporter, v: &'v Spanned<DeValue<'a>>, key: &str) -> Vec<&'v Spanned<DeValue<'a>>> {
    match v.get_ref() {
        DeValue::Array(a) if a.iter().all(|e| e.get_ref().is_table()) => a.iter().collect(),
        _ => {
            rep.error(
                Some(v.span()),
                key,
                format!(
                    "'{key}' must be a list of tables, written [[{key}]]; found a {}",
                    v.get_ref().type_str()
                ),
            );
            Vec::new()
        }
    }
}

/// Parse TOML text into its spanned tree and a context for its problems;
/// every syntax error at once when it does not parse.
pub(crate) fn parse<'t>(text: &'t str, file: &str) -> Result<(Ctx<'t>, Spanned<DeTable<'t>>), Problems> {
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
    Ok((cx, root))
}

//! The job file: a project's bays and the criteria they share, read from
//! TOML and validated like the catalog (every problem at once, with file,
//! line and column, every field of an entry even after one fails), through
//! the one definition of each criterion in [`crate::criteria`]. Saving a job
//! that came from a file edits that file in place with a format-preserving
//! TOML editor: comments, `[defaults]`, key order and every untouched value
//! stay as the user typed them; an edited value is written in the unit it
//! was typed in. Keys are documented in `catalog/README.md`.

use std::collections::BTreeMap;

use serde::Deserialize;
use toml::Spanned;
use toml::de::{DeTable, DeValue};

pub use crate::bay::{Bay, Objective};
use crate::catalog::{Problems, content_hash};
use crate::criteria::{CRITERIA, Criterion, Form, Value, check_text, find};
use crate::input::diag::suggestion;
use crate::input::{Ctx, S, de, join, span, tables};
use crate::units::{Length, System};

/// A validated job.
#[derive(Debug, Clone, PartialEq)]
pub struct Job {
    /// Project name.
    pub project: String,
    /// Engineer.
    pub engineer: String,
    /// Date as written.
    pub date: String,
    /// Code basis.
    pub code: String,
    /// Notes for the shortlist.
    pub notes: Vec<String>,
    /// Display units the job asks for, if it names them.
    pub units: Option<System>,
    /// The UI's search when the job was saved ("" for none).
    pub search: String,
    /// The UI hid the non-viable candidates when the job was saved.
    pub hide_failing: bool,
    /// Bays.
    pub bays: Vec<Bay>,
    /// Content hash of the file.
    pub hash: String,
    /// The text it was read from, kept so that saving edits it in place.
    pub source: Option<String>,
    /// Text typed for a value since loading, by (bay, key): the unit it is
    /// saved in.
    pub typed: BTreeMap<(usize, &'static str), String>,
}

/// The demo job, embedded like the demo catalog.
pub const DEMO_JOB: &str = include_str!("../catalog/demo-job.toml");
/// The SI demo job, for the SI demo catalog.
pub const DEMO_JOB_SI: &str = include_str!("../catalog/demo-job-si.toml");

/// The built-in demo job that goes with a catalog: the SI one for the SI
/// demo catalog (recognised by its content), else the US one.
pub fn demo_for(cat: &crate::catalog::Catalog) -> Result<(Job, &'static str), crate::catalog::Problems> {
    let si = crate::catalog::Catalog::from_str(crate::catalog::DEMO_SI, "demo-si.toml")?;
    if cat.hash == si.hash {
        Ok((Job::from_str(DEMO_JOB_SI, "demo-job-si.toml")?, "demo-job-si.toml (built in)"))
    } else {
        Ok((Job::from_str(DEMO_JOB, "demo-job.toml")?, "demo-job.toml (built in)"))
    }
}

#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
struct RawJobMeta {
    project: S,
    engineer: Option<S>,
    date: Option<S>,
    code: Option<S>,
    notes: Option<Vec<S>>,
    units: Option<S>,
    search: Option<S>,
    hide_failing: Option<Spanned<bool>>,
}

/// The keys of `[job]`: (key, kind, meaning) — the schema's source; a test
/// proves the reader takes exactly these.
pub const JOB_KEYS: &[(&str, &str, &str)] = &[
    ("project", "text", "project name, printed on the shortlist (required)"),
    ("engineer", "text", "engineer"),
    ("date", "text", "date as you want it printed"),
    ("code", "text", "code basis (default \"ACI 318-19\")"),
    ("notes", "list", "printed under Notes on the shortlist"),
    ("units", "units", "display units of every output: us or si (--units comes first)"),
    ("search", "text", "the UI's search when the job was last saved from it"),
    (
        "hide_failing",
        "boolean",
        "the UI hid the non-viable candidates when the job was last saved from it",
    ),
];

const TOP_KEYS: &[&str] = &["job", "defaults", "bay"];
/// Bay keys that are not criteria: the items ([`crate::items::ITEMS`]:
/// line, point, strip and patch loads, openings) and the shortlist marks.
const BAY_EXTRA: &[&str] = &["line", "point", "strip", "patch", "opening", "marked"];

/// A value as the criteria read it: its text, and where it is.
#[derive(Debug, Clone)]
struct Given {
    text: String,
    at: std::ops::Range<usize>,
}

/// The text of a TOML value for a criterion of `form`, or what is wrong.
fn text_of(form: Form, v: &Spanned<DeValue>) -> Result<String, String> {
    let found = v.get_ref().type_str();
    let want = |what: &str| Err(format!("found {found}; {what}"));
    match (form, v.get_ref()) {
        (Form::Number { .. }, DeValue::Integer(i)) | (Form::Count { .. }, DeValue::Integer(i)) => Ok(i.to_string()),
        (Form::Number { .. }, DeValue::Float(f)) => Ok(f.to_string()),
        (Form::Number { .. }, _) => want("a number is needed, e.g. 70"),
        (Form::Count { .. }, _) => want("a whole number is needed, e.g. 14"),
        (Form::Flag, DeValue::Boolean(b)) => Ok(b.to_string()),
        (Form::Flag, _) => want("true or false is needed"),
        (Form::QuantityList { .. } | Form::ChoiceList(_), DeValue::Array(a)) => {
            let mut parts = Vec::with_capacity(a.len());
            for e in a.iter() {
                match e.get_ref().as_str() {
                    Some(t) if !t.contains(',') => parts.push(t.to_string()),
                    Some(t) => return Err(format!("'{}' holds a comma; give each item as its own string", t.escape_debug())),
                    None => return Err(format!("a list of strings is needed; an item is {}", e.get_ref().type_str())),
                }
            }
            Ok(parts.join(", "))
        }
        (Form::QuantityList { .. } | Form::ChoiceList(_), _) => want("a list of strings is needed, e.g. [\"none\", \"2 in\"]"),
        (_, DeValue::String(t)) => Ok(t.to_string()),
        (Form::Quantity { .. }, _) => want("quantities are quoted strings with a unit, e.g. \"8 in\""),
        _ => want("a quoted string is needed"),
    }
}

/// The criteria a table gives, by key, and its other keys; unknown keys
/// are reported with the nearest allowed one.
#[allow(clippy::type_complexity)]
fn walk<'t, 'a>(
    cx: &mut Ctx,
    t: &'t DeTable<'a>,
    path: &str,
    defaults: bool,
) -> (BTreeMap<&'static str, Given>, Vec<(String, &'t Spanned<DeValue<'a>>)>) {
    let allowed: Vec<&str> = CRITERIA
        .iter()
        .filter(|c| !defaults || c.inherit)
        .map(|c| c.key)
        .chain(if defaults { &[][..] } else { BAY_EXTRA }.iter().copied())
        .collect();
    let mut given = BTreeMap::new();
    let mut extra = Vec::new();
    for (k, v) in t.iter() {
        let key = k.get_ref().as_ref();
        match find(key).filter(|c| allowed.contains(&c.key)) {
            Some(c) => match text_of(c.form, v) {
                Ok(text) => {
                    given.insert(c.key, Given { text, at: v.span() });
                }
                Err(e) => cx.rep.error(Some(v.span()), &join(path, key), e),
            },
            None if allowed.contains(&key) => extra.push((key.to_string(), v)),
            None => {
                let why = if defaults && find(key).is_some() {
                    format!("'{key}' belongs to each [[bay]], not to [defaults]")
                } else {
                    format!(
                        "unknown key '{key}'{}; allowed here: {}",
                        suggestion(key, allowed.iter().copied()),
                        allowed.join(", ")
                    )
                };
                cx.rep.error(Some(k.span()), path, why);
            }
        }
    }
    (given, extra)
}

/// One bay from its table, the defaults filling what it does not give.
fn bay(cx: &mut Ctx, table: &Spanned<DeValue>, defaults: &BTreeMap<&'static str, Given>, index: usize) -> Option<Bay> {
    let DeValue::Table(t) = table.get_ref() else { return None };
    let name = t
        .iter()
        .find(|(k, _)| k.get_ref() == "name")
        .and_then(|(_, v)| v.get_ref().as_str())
        .map_or(format!("bay {}", index + 1), |n| format!("bay '{}'", n.escape_debug()));
    let (own, extra) = walk(cx, t, &name, false);
    let mut b = Bay::new("", Length::new(0.0));
    let mut ok = true;
    // whether the span read: the line loads' places depend on it
    let mut span_ok = true;
    for c in CRITERIA {
        let given = own.get(c.key).or_else(|| defaults.get(c.key));
        match given {
            Some(g) => {
                if let Err(e) = c.apply(&mut b, &g.text) {
                    cx.rep.error(Some(g.at.clone()), &join(&name, c.key), e);
                    ok = false;
                    span_ok &= c.key != "span";
                }
            }
            None if c.required => {
                cx.rep.error(
                    Some(table.span().start..table.span().start),
                    &join(&name, c.key),
                    format!("missing key '{}': {}", c.key, c.help),
                );
                ok = false;
            }
            None if !c.default.is_empty() => {
                c.apply(&mut b, c.default).expect("defaults are valid");
            }
            None => {}
        }
    }
    for (key, v) in extra {
        match key.as_str() {
            key if crate::items::find(key).is_some() => {
                let kind = crate::items::find(key).expect("an item kind");
                // with no span to measure against, places are not judged
                let mut case = b.case.clone();
                if !span_ok {
                    case.span = Length::new(f64::INFINITY);
                }
                let DeValue::Array(list) = v.get_ref() else {
                    cx.rep.error(
                        Some(v.span()),
                        &join(&name, key),
                        format!("a list of tables is needed, e.g. {key} = [{{ {} }}]", toml_example(kind)),
                    );
                    ok = false;
                    continue;
                };
                let mut read = Vec::with_capacity(list.len());
                for (i, item) in list.iter().enumerate() {
                    let lp = join(&name, &format!("{key} {}", i + 1));
                    let DeValue::Table(lt) = item.get_ref() else {
                        cx.rep.error(
                            Some(item.span()),
                            &lp,
                            format!("a table is needed, e.g. {{ {} }}", toml_example(kind)),
                        );
                        ok = false;
                        continue;
                    };
                    let mut pairs: Vec<(&str, &str)> = Vec::with_capacity(lt.len());
                    let mut fine = true;
                    for (k, val) in lt.iter() {
                        match val.get_ref().as_str() {
                            Some(t) => pairs.push((k.get_ref().as_ref(), t)),
                            None => {
                                cx.rep.error(
                                    Some(val.span()),
                                    &join(&lp, k.get_ref()),
                                    format!("found {}; a quoted string is needed, e.g. \"12 ft\"", val.get_ref().type_str()),
                                );
                                fine = false;
                            }
                        }
                    }
                    if !fine {
                        ok = false;
                        continue;
                    }
                    match kind.read(&pairs, &case) {
                        Ok(vals) => read.push(vals),
                        Err((part, e)) => {
                            let at = part
                                .and_then(|p| lt.iter().find(|(k, _)| k.get_ref() == p).map(|(_, v)| v.span()))
                                .or_else(|| {
                                    // an unknown part: point at its key
                                    lt.iter()
                                        .find(|(k, _)| !kind.parts.iter().any(|p| p.key == k.get_ref().as_ref()))
                                        .map(|(k, _)| k.span())
                                })
                                .unwrap_or(item.span());
                            cx.rep.error(Some(at), &part.map_or(lp.clone(), |p| join(&lp, p)), e);
                            ok = false;
                        }
                    }
                }
                kind.store(&mut b.case, read);
            }
            "marked" => match v.get_ref() {
                DeValue::Array(a) if a.iter().all(|e| e.get_ref().as_str().is_some()) => {
                    for e in a.iter() {
                        let t = e.get_ref().as_str().unwrap_or_default();
                        match check_text(t) {
                            Ok(()) => b.marked.push(t.to_string()),
                            Err(m) => {
                                cx.rep.error(Some(e.span()), &join(&name, "marked"), m);
                                ok = false;
                            }
                        }
                    }
                }
                _ => {
                    cx.rep.error(
                        Some(v.span()),
                        &join(&name, "marked"),
                        "a list of entry labels is needed, e.g. [\"plank-8 / 6x1/2\"]",
                    );
                    ok = false;
                }
            },
            _ => {}
        }
    }
    ok.then_some(b)
}

/// Files at least this large are parsed one `[[bay]]` block at a time.
const BLOCKS_ABOVE: usize = 64 * 1024;

/// What has been read of a job so far.
#[derive(Default)]
struct Reading {
    meta: Option<RawJobMeta>,
    defaults: BTreeMap<&'static str, Given>,
    bays: Vec<Bay>,
    raw_bays: usize,
}

/// Read one parsed tree (the whole file, or one block of it) into `st`:
/// `[job]`, `[defaults]` and unknown keys when `bays` is false, the bays
/// when it is true.
fn take(cx: &mut Ctx, root: &DeTable, st: &mut Reading, bays: bool) {
    for (k, v) in root.iter() {
        match (k.get_ref().as_ref(), bays) {
            ("job", false) => st.meta = de::<RawJobMeta>(&mut cx.rep, v, "job"),
            ("defaults", false) => match v.get_ref() {
                DeValue::Table(t) => {
                    st.defaults = walk(cx, t, "defaults", true).0;
                    // a default that does not read is reported once, here,
                    // and left out of every bay
                    st.defaults.retain(|key, g| match find(key).map(|c| c.parse(&g.text)) {
                        Some(Err(e)) => {
                            cx.rep.error(Some(g.at.clone()), &join("defaults", key), e);
                            false
                        }
                        _ => true,
                    });
                }
                other => cx.rep.error(
                    Some(v.span()),
                    "defaults",
                    format!("[defaults] must be a table; found {}", other.type_str()),
                ),
            },
            ("bay", true) => {
                for t in tables(&mut cx.rep, v, "bay") {
                    let index = st.raw_bays;
                    st.raw_bays += 1;
                    if let Some(b) = bay(cx, t, &st.defaults, index) {
                        if st.bays.iter().any(|x| x.name == b.name) {
                            let at = match t.get_ref() {
                                DeValue::Table(tt) => tt.iter().find(|(k, _)| k.get_ref() == "name").map(|(_, v)| v.span()),
                                _ => None,
                            };
                            cx.rep.error(
                                at,
                                &format!("bay '{}' / name", b.name),
                                "duplicate bay name; each bay needs its own",
                            );
                        }
                        st.bays.push(b);
                    }
                }
            }
            ("job" | "defaults" | "bay", _) => {}
            (other, false) => cx.rep.error(
                Some(k.span()),
                "",
                format!(
                    "unknown top-level key '{}'{}; allowed: {}",
                    other.escape_debug(),
                    suggestion(other, TOP_KEYS.iter().copied()),
                    TOP_KEYS.join(", ")
                ),
            ),
            (_, true) => {}
        }
    }
}

/// The job from what was read, or every problem found.
fn finish(mut cx: Ctx, st: Reading, text: &str, start: usize) -> Result<Job, Problems> {
    if st.meta.is_none() && !cx.rep.has_errors() {
        cx.rep
            .error(Some(start..start), "job", "missing [job] table with at least project = \"…\"");
    }
    if st.raw_bays == 0 && !cx.rep.has_errors() {
        cx.rep.error(
            Some(start..start),
            "bay",
            "the job has no bays; add at least one [[bay]] with name and span",
        );
    }
    let Some(meta) = st.meta else {
        return Err(Problems(cx.rep.finish()));
    };
    let project = cx.text(&Some(meta.project.clone()), "job", "project");
    if project.trim().is_empty() {
        cx.rep
            .error(span(&meta.project), "job / project", "is empty; give the project a name");
    }
    let engineer = cx.text(&meta.engineer, "job", "engineer");
    let date = cx.text(&meta.date, "job", "date");
    let code = match &meta.code {
        Some(c) => cx.text(&Some(c.clone()), "job", "code"),
        None => "ACI 318-19".to_string(),
    };
    let notes: Vec<String> = meta
        .notes
        .iter()
        .flatten()
        .map(|n| cx.text(&Some(n.clone()), "job", "notes"))
        .collect();
    let units = match &meta.units {
        None => None,
        Some(u) => match System::from_name(u.get_ref()) {
            Some(s) => Some(s),
            None => {
                cx.rep.error(
                    span(u),
                    "job / units",
                    format!("{} is not allowed; use one of: us, si", crate::criteria::quoted(u.get_ref())),
                );
                None
            }
        },
    };
    let search = cx.text(&meta.search, "job", "search");
    let hide_failing = meta.hide_failing.as_ref().is_some_and(|b| *b.get_ref());
    if cx.rep.has_errors() {
        return Err(Problems(cx.rep.finish()));
    }
    Ok(Job {
        project,
        engineer,
        date,
        code,
        notes,
        units,
        search,
        hide_failing,
        bays: st.bays,
        hash: content_hash(text),
        source: Some(text.to_string()),
        typed: BTreeMap::new(),
    })
}

impl Job {
    /// Read and validate the job at `path`.
    pub fn load(path: &std::path::Path) -> Result<Job, Problems> {
        let text = crate::catalog::read_text(path)?;
        Job::from_str(&text, &path.display().to_string())
    }

    /// Validate job text; `file` names it in messages. A large job is
    /// parsed one `[[bay]]` block at a time, so its parse tree is never held
    /// whole (a 20 000-bay job stays within a few tens of MB); one that does
    /// not split cleanly is parsed whole, with the same messages.
    pub fn from_str(text: &str, file: &str) -> Result<Job, Problems> {
        // a metric job's problems are told in metric units
        Job::read(text, file).map_err(|p| p.localized(crate::catalog::written_in(text)))
    }

    fn read(text: &str, file: &str) -> Result<Job, Problems> {
        if text.len() >= BLOCKS_ABOVE
            && let Some(r) = Job::from_blocks(text, file)
        {
            return r;
        }
        let (mut cx, root) = crate::input::parse(text, file)?;
        let start = root.span().start;
        let root = root.into_inner();
        let mut st = Reading::default();
        // [job] and [defaults] first, wherever they stand in the file
        take(&mut cx, &root, &mut st, false);
        take(&mut cx, &root, &mut st, true);
        finish(cx, st, text, start)
    }

    fn from_blocks(text: &str, file: &str) -> Option<Result<Job, Problems>> {
        let mut bounds = vec![0];
        let mut at = 0;
        for line in text.split_inclusive('\n') {
            if line.trim_end() == "[[bay]]" && at > 0 {
                bounds.push(at);
            }
            at += line.len();
        }
        bounds.push(text.len());
        if bounds.len() < 3 {
            return None;
        }
        let mut cx = Ctx {
            rep: crate::input::diag::Reporter::new(file, text),
        };
        let mut st = Reading::default();
        for (i, w) in bounds.windows(2).enumerate() {
            let (root, errors) = DeTable::parse_recoverable(&text[w[0]..w[1]]);
            if !errors.is_empty() {
                return None;
            }
            let root = root.into_inner();
            // after the head, a block holds one bay and nothing else
            if i > 0 && root.iter().any(|(k, _)| k.get_ref() != "bay") {
                return None;
            }
            cx.rep.base = w[0];
            take(&mut cx, &root, &mut st, false);
            take(&mut cx, &root, &mut st, true);
        }
        cx.rep.base = 0;
        Some(finish(cx, st, text, 0))
    }

    /// One empty bay in a catalog's units, for a catalog opened without a
    /// job: 30 ft (9 m in SI), no loads, every criterion at its default.
    pub fn empty_for(cat: &crate::catalog::Catalog) -> Job {
        let sys = cat.units();
        let span = if sys == System::Si {
            Length::from_unit(9.0, "m")
        } else {
            Length::from_unit(30.0, "ft")
        };
        let mut job = Job::single("New job", Bay::new("Bay 1", span));
        job.units = Some(sys);
        job
    }

    /// A job of one bay, not read from a file (flags, or a catalog opened
    /// without a job).
    pub fn single(project: &str, bay: Bay) -> Job {
        Job {
            project: project.to_string(),
            engineer: String::new(),
            date: String::new(),
            code: "ACI 318-19".into(),
            notes: Vec::new(),
            units: None,
            search: String::new(),
            hide_failing: false,
            bays: vec![bay],
            hash: String::new(),
            source: None,
            typed: BTreeMap::new(),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::case::ServiceClass;

    #[test]
    fn demo_job_loads() {
        let j = Job::from_str(DEMO_JOB, "demo-job.toml").unwrap();
        assert!((4..=8).contains(&j.bays.len()));
        assert!(j.bays.iter().any(|b| b.case.fire_rating.is_some()));
    }

    #[test]
    fn bay_overrides_defaults_and_problems_are_located() {
        let text = "[job]\nproject = \"p\"\n[defaults]\nclass = \"T\"\nobjective = \"lightest\"\n[[bay]]\nname = \"a\"\nspan = \"20 ft\"\nclass = \"U\"\n[[bay]]\nname = \"b\"\nspan = \"20 ft\"\n";
        let j = Job::from_str(text, "j.toml").unwrap();
        assert_eq!(j.bays[0].case.class_allowed, ServiceClass::U);
        assert_eq!(j.bays[1].case.class_allowed, ServiceClass::T);
        let bad = "[job]\nproject = \"p\"\n[[bay]]\nname = \"a\"\nspan = \"20 psf\"\nobjective = \"lightst\"\n";
        let e = Job::from_str(bad, "j.toml").unwrap_err();
        let s = e.to_string();
        assert!(
            s.contains("j.toml:5:8: error: bay 'a' / span: '20 psf' is an area load, but a length is needed"),
            "{s}"
        );
        assert!(s.contains("'lightst' is not allowed (did you mean 'lightest'?)"), "{s}");
    }
}

/// A criterion's text as a TOML value of the type its form takes.
fn toml_value(c: &Criterion, text: &str) -> toml_edit::Value {
    match c.form {
        Form::Number { .. } => match text.parse::<i64>() {
            Ok(i) => i.into(),
            Err(_) => text.parse::<f64>().map_or_else(|_| text.into(), |f| f.into()),
        },
        Form::Count { .. } => text.parse::<i64>().map_or_else(|_| text.into(), |i| i.into()),
        Form::Flag => (text == "true").into(),
        Form::QuantityList { .. } | Form::ChoiceList(_) => {
            let mut a = toml_edit::Array::new();
            for part in text.split(',').map(str::trim).filter(|p| !p.is_empty()) {
                a.push(part);
            }
            a.into()
        }
        _ => text.into(),
    }
}

/// The text a TOML item holds, for a unit to follow (strings only).
fn item_text(item: Option<&toml_edit::Item>) -> Option<String> {
    item.and_then(|i| i.as_str()).map(str::to_string)
}

/// An item as a TOML inline table of its parts (in the display system).
fn item_table(kind: &crate::items::ItemKind, v: &[crate::items::Val], sys: System) -> toml_edit::InlineTable {
    let mut t = toml_edit::InlineTable::new();
    for (k, text) in kind.parts_text(v, sys) {
        t.insert(k, text.into());
    }
    t
}

/// The items of one kind as a TOML array of inline tables.
fn items_value(kind: &crate::items::ItemKind, b: &Bay, sys: System) -> toml_edit::Value {
    let mut a = toml_edit::Array::new();
    for v in kind.list(&b.case) {
        a.push(item_table(kind, &v, sys));
    }
    a.into()
}

/// An example of a kind's table, for messages.
fn toml_example(kind: &crate::items::ItemKind) -> String {
    kind.example()
        .trim_matches('"')
        .split(", ")
        .map(|p| match p.split_once('=') {
            Some((k, v)) => format!("{k} = \"{v}\""),
            None => p.to_string(),
        })
        .collect::<Vec<_>>()
        .join(", ")
}

/// Edit the list of one kind of item in a bay's table in place: an item
/// that did not change keeps its text; a changed one is written anew; one
/// taken out or added is taken out or added, the rest untouched.
fn edit_items(table: &mut toml_edit::Table, kind: &crate::items::ItemKind, now: &Bay, before: &Bay, sys: System) {
    let (a, b) = (kind.list(&now.case), kind.list(&before.case));
    if a == b {
        return;
    }
    if a.is_empty() {
        table.remove(kind.key);
        return;
    }
    // one item taken out of the middle: remove just that one
    let removed = (b.len() == a.len() + 1)
        .then(|| (0..b.len()).find(|&k| b[..k] == a[..k] && b[k + 1..] == a[k..]))
        .flatten();
    match table.get_mut(kind.key) {
        Some(toml_edit::Item::Value(toml_edit::Value::Array(arr))) => {
            if let Some(k) = removed {
                arr.remove(k);
                return;
            }
            for (i, v) in a.iter().enumerate() {
                if b.get(i) != Some(v) {
                    let t = item_table(kind, v, sys);
                    if i < arr.len() {
                        arr.replace(i, t);
                    } else {
                        arr.push(t);
                    }
                }
            }
            while arr.len() > a.len() {
                arr.remove(arr.len() - 1);
            }
        }
        Some(toml_edit::Item::ArrayOfTables(arr)) => {
            if let Some(k) = removed {
                arr.remove(k);
                return;
            }
            for (i, v) in a.iter().enumerate() {
                if b.get(i) != Some(v) {
                    let mut t = toml_edit::Table::new();
                    for (k, text) in kind.parts_text(v, sys) {
                        t.insert(k, toml_edit::value(text));
                    }
                    match arr.get_mut(i) {
                        Some(old) => *old = t,
                        None => arr.push(t),
                    }
                }
            }
            while arr.len() > a.len() {
                arr.remove(arr.len() - 1);
            }
        }
        _ => put(table, kind.key, items_value(kind, now, sys)),
    }
}

fn strings(items: &[String]) -> toml_edit::Value {
    let mut a = toml_edit::Array::new();
    for m in items {
        a.push(m.as_str());
    }
    a.into()
}

/// Set `key` of `table` to `v`, keeping the place and the comments of a
/// value that was there.
fn put(table: &mut toml_edit::Table, key: &str, mut v: toml_edit::Value) {
    match table.get_mut(key).and_then(|i| i.as_value_mut()) {
        Some(old) => {
            *v.decor_mut() = old.decor().clone();
            *old = v;
        }
        None => {
            table.insert(key, toml_edit::Item::Value(v));
        }
    }
}

impl Job {
    /// The text to save the job as: its own file edited in place when it
    /// came from one (only the values that changed are written, each in
    /// the unit it was typed in; comments, `[defaults]`, key order and the
    /// rest stay as they were), else a fresh job file.
    pub fn save_text(&self, sys: System) -> String {
        self.source
            .as_deref()
            .and_then(|src| self.edit_in_place(src, sys))
            .unwrap_or_else(|| self.to_toml(sys))
    }

    fn edit_in_place(&self, src: &str, sys: System) -> Option<String> {
        let was = Job::from_str(src, "").ok()?;
        if was.bays.len() != self.bays.len() {
            return None;
        }
        let mut doc: toml_edit::DocumentMut = src.parse().ok()?;
        let defaults: BTreeMap<String, String> = doc
            .get("defaults")
            .and_then(|d| d.as_table_like())
            .map(|t| {
                t.iter()
                    .filter_map(|(k, v)| v.as_str().map(|s| (k.to_string(), s.to_string())))
                    .collect()
            })
            .unwrap_or_default();
        if let Some(job) = doc.get_mut("job").and_then(|j| j.as_table_mut()) {
            if self.units != was.units
                && let Some(u) = self.units
            {
                put(job, "units", u.name().into());
            }
            // the UI's view of the job: kept only while it differs from none
            if self.search != was.search {
                if self.search.is_empty() {
                    job.remove("search");
                } else {
                    put(job, "search", self.search.as_str().into());
                }
            }
            if self.hide_failing != was.hide_failing {
                if self.hide_failing {
                    put(job, "hide_failing", true.into());
                } else {
                    job.remove("hide_failing");
                }
            }
        }
        let bays = doc.get_mut("bay")?.as_array_of_tables_mut()?;
        for (i, (now, before)) in self.bays.iter().zip(&was.bays).enumerate() {
            let table = bays.get_mut(i)?;
            for c in CRITERIA {
                if c.value(now) == c.value(before) {
                    continue;
                }
                let like = self
                    .typed
                    .get(&(i, c.key))
                    .cloned()
                    .or_else(|| item_text(table.get(c.key)))
                    .or_else(|| defaults.get(c.key).cloned());
                let text = c.write(now, like.as_deref(), sys);
                put(table, c.key, toml_value(c, &text));
            }
            for kind in crate::items::ITEMS {
                edit_items(table, kind, now, before, sys);
            }
            if now.marked != before.marked {
                if now.marked.is_empty() {
                    table.remove("marked");
                } else {
                    put(table, "marked", strings(&now.marked));
                }
            }
        }
        Some(doc.to_string())
    }

    /// The job as a fresh job file: `[job]`, then each bay with the
    /// criteria that differ from their defaults (in the display system).
    pub fn to_toml(&self, sys: System) -> String {
        let mut doc = toml_edit::DocumentMut::new();
        let mut job = toml_edit::Table::new();
        job.insert("project", toml_edit::value(self.project.as_str()));
        job.insert("engineer", toml_edit::value(self.engineer.as_str()));
        job.insert("date", toml_edit::value(self.date.as_str()));
        job.insert("code", toml_edit::value(self.code.as_str()));
        if !self.notes.is_empty() {
            job.insert("notes", toml_edit::Item::Value(strings(&self.notes)));
        }
        if let Some(u) = self.units {
            job.insert("units", toml_edit::value(u.name()));
        }
        if !self.search.is_empty() {
            job.insert("search", toml_edit::value(self.search.as_str()));
        }
        if self.hide_failing {
            job.insert("hide_failing", toml_edit::value(true));
        }
        doc.insert("job", toml_edit::Item::Table(job));
        let mut bays = toml_edit::ArrayOfTables::new();
        for b in &self.bays {
            let mut t = toml_edit::Table::new();
            for c in CRITERIA {
                let v = c.value(b);
                let default = if c.default.is_empty() { None } else { c.parse(c.default).ok() };
                let absent =
                    matches!(v, Value::Num(None) | Value::Count(None) | Value::Text(None)) || matches!(&v, Value::Picks(p) if p.is_empty());
                if !c.required && (Some(&v) == default.as_ref() || absent) {
                    continue;
                }
                t.insert(c.key, toml_edit::Item::Value(toml_value(c, &c.write(b, None, sys))));
            }
            for kind in crate::items::ITEMS {
                if !kind.list(&b.case).is_empty() {
                    t.insert(kind.key, toml_edit::Item::Value(items_value(kind, b, sys)));
                }
            }
            if !b.marked.is_empty() {
                t.insert("marked", toml_edit::Item::Value(strings(&b.marked)));
            }
            bays.push(t);
        }
        doc.insert("bay", toml_edit::Item::ArrayOfTables(bays));
        format!("# plankwise job file\n\n{doc}")
    }
}

#[cfg(test)]
mod round_trip {
    use super::*;

    #[test]
    fn written_jobs_load_back_the_same() {
        let j = Job::from_str(DEMO_JOB, "demo-job.toml").unwrap();
        let text = j.to_toml(System::Us);
        let k = Job::from_str(&text, "written.toml").unwrap();
        assert_eq!(j.bays.len(), k.bays.len());
        for (a, b) in j.bays.iter().zip(&k.bays) {
            assert_eq!(a.name, b.name);
            assert!((a.case.span.get() - b.case.span.get()).abs() < 1e-6);
            assert!((a.case.live.get() - b.case.live.get()).abs() < 1e-9);
            assert_eq!(a.case.fire_rating, b.case.fire_rating);
            assert_eq!(a.toppings.len(), b.toppings.len());
            assert_eq!(a.objective, b.objective);
            assert_eq!(a.families, b.families);
            assert_eq!(a.case.line_loads.len(), b.case.line_loads.len());
        }
        assert_eq!(j.project, k.project);
    }
}

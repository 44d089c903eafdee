//! From the raw mirror to the validated catalog, collecting every problem.

use toml::Spanned;
use toml::de::{DeTable, DeValue};

use super::keys;
use super::raw::{self, Point, RawPattern, RawSection};
use crate::input::diag::{Reporter, suggestion};
pub(crate) use crate::input::{Ctx, de, join, key_str, parse, span, tables};
mod geometry;
mod materials;
mod pattern;

use geometry::{double_tee, generic, hollow_core};
use materials::{mix, strand};
use pattern::{compare_published, pattern, published};

use super::{Catalog, FamilySpec, Meta, Pattern, Problems, Section, content_hash};
use crate::material::{Mix, StrandKind, builtin_strand};
use crate::section::Family;
use crate::section::family::fmt;

/// Published figures further than this from ours draw a warning.
pub const PUBLISHED_TOLERANCE: f64 = 0.02;

impl Ctx<'_> {
    pub(crate) fn point(&mut self, p: &Point, path: &str, field: &str) -> Option<(f64, f64)> {
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

    pub(crate) fn points(&mut self, pts: &Spanned<Vec<Point>>, path: &str, field: &str, min: usize) -> Option<Vec<(f64, f64)>> {
        let mut out = Vec::new();
        let mut ok = true;
        for p in pts.get_ref() {
            match self.point(p, path, field) {
                Some(xy) => out.push(xy),
                None => ok = false,
            }
        }
        if ok && out.len() < min {
            self.rep.error(
                span(pts),
                &join(path, field),
                format!("has {} points; at least {min} needed", out.len()),
            );
            return None;
        }
        ok.then_some(out)
    }
}

/// Files at least this large are parsed one `[[section]]` block at a time
/// (see [`catalog_in_blocks`]); smaller ones whole.
const BLOCKS_ABOVE: usize = 64 * 1024;

/// Validate catalog text.
pub fn catalog(text: &str, file: &str) -> Result<Catalog, Problems> {
    let mut r = None;
    if text.len() >= BLOCKS_ABOVE {
        r = catalog_in_blocks(text, file);
    }
    let mut r = r.unwrap_or_else(|| catalog_whole(text, file));
    if let Ok(c) = &mut r {
        c.meta.written_in = super::written_in(text);
    }
    r
}

/// Validate catalog text parsed as one tree.
fn catalog_whole(text: &str, file: &str) -> Result<Catalog, Problems> {
    let (mut cx, root) = parse(text, file)?;
    let root_start = root.span().start;
    let mut g = Gathered::new();
    gather(&mut cx, root.get_ref(), 0, &mut g);
    drop(root);
    finish(cx, g, root_start, text)
}

/// A section as gathered: its block offset, the section, its patterns, and
/// how many of its patterns failed to parse.
type GatheredSection = (usize, Spanned<RawSection>, Vec<Spanned<RawPattern>>, usize);

/// What the top level of a catalog gives, before validation; each item
/// with the byte offset of the block it was parsed from (its spans count
/// from there).
#[derive(Default)]
struct Gathered {
    meta: Meta,
    saw_catalog: bool,
    mixes: Vec<(usize, Spanned<raw::RawMix>)>,
    strands: Vec<(usize, Spanned<raw::RawStrand>)>,
    sections: Vec<GatheredSection>,
    // ids of entries that failed to parse, so references to them are not
    // reported a second time
    broken_mixes: Vec<String>,
    broken_strands: Vec<String>,
}

impl Gathered {
    fn new() -> Gathered {
        Gathered {
            meta: Meta {
                code: "ACI 318-19".into(),
                ..Meta::default()
            },
            ..Gathered::default()
        }
    }
}

/// The start of each `[[section]]` header line outside multi-line strings,
/// after the first byte. A header missed (an unusual spelling) only joins
/// two blocks; a wrong one breaks a block's syntax, and the caller then
/// parses the whole file.
fn section_starts(text: &str) -> Vec<usize> {
    let mut starts = Vec::new();
    let (mut basic, mut literal) = (false, false);
    let mut pos = 0;
    for line in text.split_inclusive('\n') {
        if !basic
            && !literal
            && let Some(rest) = line.trim_start().strip_prefix("[[section]]")
        {
            let rest = rest.trim();
            if pos > 0 && (rest.is_empty() || rest.starts_with('#')) {
                starts.push(pos);
            }
        }
        if !literal && line.matches("\"\"\"").count() % 2 == 1 {
            basic = !basic;
        }
        if !basic && line.matches("\'\'\'").count() % 2 == 1 {
            literal = !literal;
        }
        pos += line.len();
    }
    starts
}

/// A large catalog parsed block by block — what precedes the first
/// `[[section]]`, then each section with its patterns — so that only one
/// block's spanned tree is alive at a time (the tree of a whole 10 000-entry
/// file is ~50 MB). None when the file does not split cleanly (a syntax
/// error in a block, a top-level table other than `section` in two blocks,
/// a `section` key before the first header): the whole-file parse then
/// reports it exactly as for a small file.
fn catalog_in_blocks(text: &str, file: &str) -> Option<Result<Catalog, Problems>> {
    let mut bounds = vec![0];
    bounds.extend(section_starts(text));
    bounds.push(text.len());
    if bounds.len() < 4 {
        return None;
    }
    let mut cx = Ctx {
        rep: Reporter::new(file, text),
    };
    let mut g = Gathered::new();
    let mut seen: Vec<String> = Vec::new();
    for (i, w) in bounds.windows(2).enumerate() {
        let (root, errors) = DeTable::parse_recoverable(&text[w[0]..w[1]]);
        if !errors.is_empty() {
            return None;
        }
        let root = root.into_inner();
        let mut has_section = false;
        for (k, _) in root.iter() {
            let k = k.get_ref().as_ref();
            if k == "section" {
                has_section = true;
            } else if seen.iter().any(|x| x == k) {
                return None;
            } else {
                seen.push(k.to_string());
            }
        }
        if has_section == (i == 0) {
            return None;
        }
        gather(&mut cx, &root, w[0], &mut g);
    }
    Some(finish(cx, g, 0, text))
}

/// Take the top-level tables of one parsed block into `g` (spans from `base`).
fn gather(cx: &mut Ctx, root: &DeTable, base: usize, g: &mut Gathered) {
    cx.rep.base = base;
    for (k, v) in root.iter() {
        match k.get_ref().as_ref() {
            "catalog" => {
                g.saw_catalog = true;
                if let Some(m) = de::<raw::RawMeta>(&mut cx.rep, v, "catalog") {
                    if m.name.get_ref().trim().is_empty() {
                        cx.rep.error(span(&m.name), "catalog / name", "is empty; give the catalog a name");
                    }
                    g.meta.name = cx.text(&Some(m.name), "catalog", "name");
                    g.meta.producer = cx.text(&m.producer, "catalog", "producer");
                    if let Some(code) = &m.code
                        && code.get_ref() != "ACI 318-19"
                    {
                        cx.rep.error(
                            span(code),
                            "catalog / code",
                            format!("'{}' is not supported; plankwise checks to 'ACI 318-19'", code.get_ref()),
                        );
                    }
                    g.meta.notes = m
                        .notes
                        .unwrap_or_default()
                        .into_iter()
                        .map(|n| cx.text(&Some(n), "catalog", "notes"))
                        .collect();
                    if let Some(u) = &m.units {
                        match crate::units::System::from_name(u.get_ref()) {
                            Some(s) => g.meta.units = Some(s),
                            None => cx.rep.error(
                                span(u),
                                "catalog / units",
                                format!("{} is not allowed; use one of: us, si", crate::criteria::quoted(u.get_ref())),
                            ),
                        }
                    }
                }
            }
            "mix" => {
                for (i, e) in tables(&mut cx.rep, v, "mix").into_iter().enumerate() {
                    let id = e.get_ref().as_table().and_then(|t| key_str(t, "id"));
                    let path = id.map_or(format!("mix {}", i + 1), |id| format!("mix '{id}'"));
                    match de::<raw::RawMix>(&mut cx.rep, e, &path) {
                        Some(m) => g.mixes.push((base, Spanned::new(e.span(), m))),
                        None => g
                            .broken_mixes
                            .extend(e.get_ref().as_table().and_then(|t| key_str(t, "id")).map(String::from)),
                    }
                }
            }
            "strand" => {
                for (i, e) in tables(&mut cx.rep, v, "strand").into_iter().enumerate() {
                    let id = e.get_ref().as_table().and_then(|t| key_str(t, "id"));
                    let path = id.map_or(format!("strand {}", i + 1), |id| format!("strand '{id}'"));
                    match de::<raw::RawStrand>(&mut cx.rep, e, &path) {
                        Some(m) => g.strands.push((base, Spanned::new(e.span(), m))),
                        None => g
                            .broken_strands
                            .extend(e.get_ref().as_table().and_then(|t| key_str(t, "id")).map(String::from)),
                    }
                }
            }
            "section" => {
                if v.get_ref()
                    .as_table()
                    .is_some_and(|t| t.iter().any(|(k, _)| k.get_ref() == "pattern"))
                {
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
                    // (the section's own keys are copied, the patterns are not)
                    let mut body = DeTable::new();
                    let mut pats = None;
                    for (k, v) in t.iter() {
                        if k.get_ref() == "pattern" {
                            pats = Some(v);
                        } else {
                            body.insert(k.clone(), v.clone());
                        }
                    }
                    let mut patterns = Vec::new();
                    let mut pattern_failures = 0;
                    if let Some(pv) = pats {
                        for (j, pe) in tables(&mut cx.rep, pv, &format!("{name} / pattern")).into_iter().enumerate() {
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
                        g.sections.push((base, Spanned::new(e.span(), s), patterns, pattern_failures));
                    }
                }
            }
            other => {
                cx.rep.error(
                    Some(k.span()),
                    "",
                    format!(
                        "unknown top-level key '{other}'{}; allowed: {}",
                        suggestion(other, keys::names(&keys::FILE)),
                        keys::names(&keys::FILE).join(", ")
                    ),
                );
            }
        }
    }
}

/// Validate what was gathered: mixes, strands, then sections against them.
fn finish(mut cx: Ctx, g: Gathered, root_start: usize, text: &str) -> Result<Catalog, Problems> {
    cx.rep.base = 0;
    if !g.saw_catalog {
        cx.rep.error(
            Some(root_start..root_start),
            "catalog",
            "missing [catalog] table with at least name = \"…\"",
        );
    }

    // mixes
    let mut mixes: Vec<Mix> = Vec::new();
    let mut broken_mixes = g.broken_mixes;
    let mut broken_strands = g.broken_strands;
    for (base, m) in &g.mixes {
        cx.rep.base = *base;
        let path = format!("mix '{}'", m.get_ref().id.get_ref());
        let found = mix(&mut cx, m.get_ref(), &path);
        if found.is_none() {
            broken_mixes.push(m.get_ref().id.get_ref().clone());
        }
        if let Some(mix) = found {
            if mixes.iter().any(|x| x.id == mix.id) {
                cx.rep.error(
                    span(&m.get_ref().id),
                    &join(&path, "id"),
                    format!("duplicate mix id '{}'; each id must be unique", mix.id),
                );
            }
            mixes.push(mix);
        }
    }
    // strands
    let mut strands: Vec<StrandKind> = Vec::new();
    for (base, s) in &g.strands {
        cx.rep.base = *base;
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
                    format!(
                        "duplicate strand id '{}'; ids must differ from each other and from the built-in names",
                        st.id
                    ),
                );
            }
            strands.push(st);
        }
    }
    // sections
    let mut sections: Vec<Section> = Vec::new();
    let mut section_count = 0;
    for (base, s, pats, failures) in &g.sections {
        cx.rep.base = *base;
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
                cx.rep.error(
                    span(&s.get_ref().id),
                    &join(&path, "id"),
                    format!("duplicate section id '{}'; each id must be unique", sec.id),
                );
            }
            sections.push(sec);
        }
    }
    cx.rep.base = 0;
    if section_count == 0 && !cx.rep.has_errors() {
        cx.rep.error(
            Some(root_start..root_start),
            "section",
            "the catalog has no sections; add at least one [[section]] with a [[section.pattern]]",
        );
    }

    if cx.rep.has_errors() {
        return Err(Problems(cx.rep.finish()));
    }
    Ok(Catalog {
        meta: g.meta,
        mixes,
        strands,
        sections,
        warnings: cx.rep.finish(),
        hash: content_hash(text),
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
    let designation = cx.designation(&r.designation, &id, path);
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
    let given = [r.hollow_core.is_some(), r.double_tee.is_some(), r.generic.is_some()]
        .iter()
        .filter(|&&b| b)
        .count();
    if given != 1 {
        cx.rep.error(
            Some(s.span()),
            path,
            format!("give exactly one geometry table — [section.hollow_core], [section.double_tee] or [section.generic]; found {given}"),
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
    let price = cx.price(&r.price, path);
    let max_length = match &r.max_length {
        None => Some(None),
        Some(m) => cx.key_q::<crate::units::LengthK>(m, path, &keys::MAX_LENGTH).map(Some),
    };
    if pats.is_empty() && pattern_failures == 0 {
        cx.rep
            .error(Some(s.span()), path, "has no strand patterns; add at least one [[section.pattern]]");
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
            // a debonded length beyond half the longest member leaves the
            // strand bonded nowhere
            let longest = pat
                .max_length
                .or(max_length.flatten())
                .map_or(keys::MAX_LENGTH.range().map_or(f64::INFINITY, |r| r.hi * 12.0), |m| m.get());
            if let Some(d) = pat.rows.iter().filter_map(|r| r.debond).map(|d| d.get()).reduce(f64::max)
                && d >= longest / 2.0
            {
                cx.rep.error(
                    Some(p.span()),
                    &join(&ppath, "debond"),
                    format!(
                        "a debonded length of {} ft reaches half the longest member ({} ft): that strand would be bonded nowhere",
                        fmt(d / 12.0),
                        fmt(longest / 12.0)
                    ),
                );
            }
            if patterns.iter().any(|x| x.id == pat.id) {
                cx.rep.error(
                    span(&p.get_ref().id),
                    &join(&ppath, "id"),
                    format!("duplicate pattern id '{}' in this section", pat.id),
                );
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

#[cfg(test)]
mod block_tests {
    use super::*;
    use crate::catalog::DEMO_US;

    /// The demo catalog with its sections repeated (new ids) until it is
    /// well above the size parsed block by block, and `edit` applied to the
    /// last copy.
    fn big(edit: impl Fn(String) -> String) -> String {
        let first = DEMO_US.find("[[section]]").unwrap();
        let (head, body) = DEMO_US.split_at(first);
        let mut text = DEMO_US.to_string();
        let mut k = 0;
        while text.len() < 3 * BLOCKS_ABOVE {
            k += 1;
            text.push('\n');
            text.push_str(&body.replace("\nid = \"", &format!("\nid = \"copy{k}-")));
        }
        let cut = text.rfind("[[section]]").unwrap();
        let (a, b) = text.split_at(cut);
        let _ = head;
        format!("{a}{}", edit(b.to_string()))
    }

    fn same_both_ways(text: &str) {
        assert!(text.len() >= BLOCKS_ABOVE);
        let whole = catalog_whole(text, "big.toml");
        let blocks = catalog_in_blocks(text, "big.toml");
        match (&whole, &blocks) {
            (Ok(a), Some(Ok(b))) => {
                assert_eq!(a.sections, b.sections);
                assert_eq!(a.mixes, b.mixes);
                assert_eq!(a.warnings, b.warnings);
            }
            (Err(a), Some(Err(b))) => assert_eq!(a, b),
            (_, None) => {} // fell back to the whole-file parse: same by construction
            _ => panic!("the two parses disagree: {whole:?} / {blocks:?}"),
        }
        assert_eq!(catalog(text, "big.toml").is_ok(), whole.is_ok());
    }

    #[test]
    fn a_large_catalog_reads_the_same_block_by_block() {
        let text = big(|b| b);
        assert!(catalog_in_blocks(&text, "big.toml").is_some_and(|r| r.is_ok()));
        same_both_ways(&text);
    }

    #[test]
    fn problems_deep_in_a_large_catalog_are_located_the_same() {
        let cases: [fn(String) -> String; 6] = [
            // a bad value
            |b| b.replacen("count = ", "count = -", 1),
            // a mix that is not there
            |b| b.replacen("mix = \"", "mix = \"nosuch-", 1),
            // an unknown key
            |b| b.replacen("[[section.pattern]]", "[[section.pattern]]\nstrnad = 1", 1),
            // a duplicate id of an earlier section
            |b| {
                let id = b.split("id = \"").nth(1).unwrap().split('"').next().unwrap().to_string();
                b.replacen(&id, id.trim_start_matches(|c: char| c != '-').trim_start_matches('-'), 1)
            },
            // a syntax error: falls back to the whole file
            |b| b.replacen("[[section.pattern]]", "[[section.pattern]\n", 1),
            // a mix defined after the sections
            |b| {
                format!(
                    "{b}\n[[mix]]\nid = \"late\"\nfc = \"5000 psi\"\nfci = \"3500 psi\"\nunit_weight = \"150 pcf\"\naggregate = \"carbonate\"\n"
                )
            },
        ];
        // the syntax error and the late mix table make the whole file parse
        let by_blocks = [true, true, true, true, false, false];
        for (edit, blocks) in cases.into_iter().zip(by_blocks) {
            let text = big(edit);
            assert_eq!(catalog_in_blocks(&text, "big.toml").is_some(), blocks);
            same_both_ways(&text);
        }
        // the located problem is in the last block, not at its start
        let text = big(|b| b.replacen("mix = \"", "mix = \"nosuch-", 1));
        let Err(e) = catalog(&text, "big.toml") else {
            panic!("the unknown mix is not found")
        };
        let line = e.first().unwrap().line;
        assert!(e.first().unwrap().message.contains("nosuch-"), "{e}");
        assert!(line > text[..text.rfind("[[section]]").unwrap()].lines().count(), "{e}");
    }

    #[test]
    fn headers_inside_multi_line_strings_are_not_block_starts() {
        let text = "[catalog]\nname = \"x\"\nnotes = [\"\"\"\n[[section]]\n\"\"\"]\n[[section]]\nid = \"a\"\n";
        assert_eq!(section_starts(text), vec![text.rfind("[[section]]").unwrap()]);
    }
}

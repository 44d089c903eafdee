//! Strand patterns: rows, positions, cover, bars; published properties.

use toml::Spanned;

use super::{Ctx, PUBLISHED_TOLERANCE, Refs, join, keys, span};
use crate::catalog::raw::{self, RawPattern, S};
use crate::catalog::{Bar, FamilySpec, Pattern, Published, Row, Section, WebSteel};
use crate::input::diag::suggestion;
use crate::material::{Mix, builtin_strand, builtin_strand_names};
use crate::section::Family;
use crate::section::family::fmt;
use crate::units::{Area, AreaLoad, Inertia, Length, LineLoad};

/// Choose `count` of `n` slots symmetrically (web or stem positions).
pub(super) fn symmetric_pick(n: usize, count: usize) -> Vec<usize> {
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
pub(super) fn row_positions(
    cx: &mut Ctx,
    row: &Spanned<raw::RawRow>,
    count: u32,
    spec: &FamilySpec,
    geometry: &crate::section::Geometry,
    path: &str,
) -> Option<Vec<f64>> {
    let r = row.get_ref();
    if let Some(xs) = &r.x {
        let mut out = Vec::new();
        for x in xs.get_ref() {
            out.push(cx.q::<crate::units::LengthK>(x, path, "x")?.get());
        }
        if out.len() != count as usize {
            cx.rep.error(
                span(xs),
                &join(path, "x"),
                format!("gives {} positions for a row of {count} strands", out.len()),
            );
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
                    format!(
                        "{count} strands do not fit one per web in a unit with {} webs; give their positions with x = [...]",
                        webs.len()
                    ),
                );
                return None;
            }
            Some(symmetric_pick(webs.len(), n).into_iter().map(|i| webs[i]).collect())
        }
        FamilySpec::DoubleTee(t) => {
            let stems = t.stem_centres();
            if !n.is_multiple_of(stems.len()) {
                cx.rep.error(
                    Some(row.span()),
                    path,
                    format!(
                        "{count} strands do not share equally among {} stems; use a multiple of {} or give x = [...]",
                        stems.len(),
                        stems.len()
                    ),
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
pub(super) fn pattern(
    cx: &mut Ctx,
    p: &Spanned<RawPattern>,
    path: &str,
    shape: Option<(&FamilySpec, &crate::section::Geometry)>,
    family: Family,
    refs: &Refs,
) -> Option<Pattern> {
    let r = p.get_ref();
    let id = cx.id(&r.id, path);
    let designation = cx.designation(&r.designation, &id, path);
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
            let keys::Range { lo, hi, .. } = keys::JACKING.range().expect("a range");
            if (lo..=hi).contains(&v) {
                Some(v)
            } else {
                cx.rep.error(
                    span(j),
                    &join(path, "jacking"),
                    format!("{v} is outside the plausible range {lo} to {hi} (a fraction of fpu)"),
                );
                None
            }
        }
    };
    let hold_down = match &r.hold_down {
        None => Some(None),
        Some(h) => {
            let v = *h.get_ref();
            let keys::Range { lo, hi, .. } = keys::HOLD_DOWN.range().expect("a range");
            if (lo..=hi).contains(&v) {
                Some(Some(v))
            } else {
                cx.rep.error(
                    span(h),
                    &join(path, "hold_down"),
                    format!("{v} is outside {lo} to {hi} (a fraction of the member length from each end; 0.5 is one point at midspan)"),
                );
                None
            }
        }
    };
    let price = cx.price(&r.price, path);
    let max_length = match &r.max_length {
        None => Some(None),
        Some(m) => cx.key_q::<crate::units::LengthK>(m, path, &keys::MAX_LENGTH).map(Some),
    };
    let rows_raw = r.row.as_deref().unwrap_or(&[]);
    if rows_raw.is_empty() {
        cx.rep
            .error(Some(p.span()), path, "has no strand rows; add at least one [[section.pattern.row]]");
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
        let count = cx.key_count(&rr.count, &rpath, &keys::STRANDS);
        let height = cx.positive_len(&rr.height, &rpath, "height");
        let end_height = rr.end_height.as_ref().map(|e| cx.positive_len(e, &rpath, "end_height"));
        let debond = rr.debond.as_ref().map(|d| cx.positive_len(d, &rpath, "debond"));
        let mut ok = true;
        for (h, key, s) in [
            (height, "height", Some(&rr.height)),
            (end_height.flatten(), "end_height", rr.end_height.as_ref()),
        ] {
            if let (Some(h), Some(s)) = (h, s)
                && h.get() >= depth
            {
                cx.rep.error(
                    span(s),
                    &join(&rpath, key),
                    format!("'{}' is not below the top of the {} in section", s.get_ref(), fmt(depth)),
                );
                ok = false;
            }
        }
        if end_height.is_some() && !family.allows_depressed() {
            cx.rep.error(
                rr.end_height.as_ref().map(|e| e.span()),
                &join(&rpath, "end_height"),
                format!(
                    "{} strands stay straight; depressed strands are allowed for double-tee and generic sections only",
                    family.name()
                ),
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
        let xs = if ok {
            row_positions(cx, row, count, spec, geometry, &rpath)
        } else {
            None
        };
        match (
            xs,
            height,
            end_height.unwrap_or(Some(Length::new(f64::NAN))),
            debond.unwrap_or(Some(Length::new(f64::NAN))),
        ) {
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
                                format!(
                                    "strand {} at x = {} in, y = {} in is not inside the concrete",
                                    k + 1,
                                    fmt(x),
                                    fmt(y.get())
                                )
                            } else if in_void {
                                format!(
                                    "strand {} at x = {} in, y = {} in lies inside a core or void",
                                    k + 1,
                                    fmt(x),
                                    fmt(y.get())
                                )
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
    if total > keys::STRANDS.counts().1 {
        cx.rep.error(
            Some(p.span()),
            path,
            format!("has {total} strands; at most {} allowed in one pattern", keys::STRANDS.counts().1),
        );
        rows_ok = false;
    }
    // two strands cannot share concrete: centres at least a diameter apart,
    // at midspan and at the ends
    if let (true, Some(st)) = (rows_ok, &strand) {
        let db = st.diameter.get();
        let at = |end: bool| -> Vec<(usize, f64, f64)> {
            rows.iter()
                .enumerate()
                .flat_map(|(i, r)| {
                    let y = if end { r.end_height.unwrap_or(r.height) } else { r.height }.get();
                    r.x.iter().map(move |&x| (i, x, y))
                })
                .collect()
        };
        'found: for end in [false, true] {
            let pts = at(end);
            for (k, a) in pts.iter().enumerate() {
                for b in &pts[k + 1..] {
                    let gap = (a.1 - b.1).hypot(a.2 - b.2);
                    if gap < db - 1e-9 {
                        cx.rep.error(
                            rows_raw.get(b.0).map(|r| r.span()),
                            &join(path, &format!("row {}", b.0 + 1)),
                            format!(
                                "two strands {} (at x = {} in and {} in, {} in up{}): their centres are {} in apart, less than the {} in strand diameter",
                                if gap < 1e-9 { "coincide" } else { "overlap" },
                                fmt(a.1),
                                fmt(b.1),
                                fmt(a.2),
                                if end { ", at the ends" } else { "" },
                                fmt(gap),
                                fmt(db)
                            ),
                        );
                        rows_ok = false;
                        break 'found;
                    }
                }
            }
        }
    }
    let depressed = rows.iter().any(|r| r.end_height.is_some());
    if let Ok(Some(h)) = hold_down.ok_or(())
        && !depressed
        && rows_ok
    {
        cx.rep.warn(
            r.hold_down.as_ref().map(|h| h.span()),
            &join(path, "hold_down"),
            format!("hold_down {h} is given but no row has an end_height; the strands are straight"),
        );
    }
    if depressed && matches!(hold_down, Some(None)) {
        cx.rep.error(
            Some(p.span()),
            path,
            "depressed rows need 'hold_down' (a fraction of the member length from each end, e.g. 0.4; 0.5 for one point at midspan)",
        );
        rows_ok = false;
    }
    let mut bars = Vec::new();
    for (i, b) in r.bar.iter().flatten().enumerate() {
        let bpath = join(path, &format!("bar {}", i + 1));
        let rb = b.get_ref();
        let count = cx.key_count(&rb.count, &bpath, &keys::BARS);
        let area = cx.key_q::<crate::units::AreaK>(&rb.area, &bpath, &keys::BAR_AREA);
        let fy = cx.key_q::<crate::units::StressK>(&rb.fy, &bpath, &keys::FY);
        let height = cx.positive_len(&rb.height, &bpath, "height");
        if let Some(h) = height
            && h.get() >= depth
        {
            cx.rep.error(
                span(&rb.height),
                &join(&bpath, "height"),
                format!("'{}' is not below the top of the {} in section", rb.height.get_ref(), fmt(depth)),
            );
            rows_ok = false;
        }
        match (count, area, fy, height) {
            (Some(count), Some(area), Some(fy), Some(height)) => bars.push(Bar { count, area, fy, height }),
            _ => rows_ok = false,
        }
    }
    let web_steel = match &r.web_steel {
        None => Some(None),
        Some(w) => {
            let wpath = join(path, "web_steel");
            if family != Family::DoubleTee {
                cx.rep.error(
                    Some(w.span()),
                    &wpath,
                    format!(
                        "web_steel is the shear reinforcement of double-tee stems; a {} section has no stems",
                        family.name()
                    ),
                );
            }
            let rw = w.get_ref();
            let area = cx.key_q::<crate::units::AreaK>(&rw.area, &wpath, &keys::WEB_AREA);
            let spacing = cx.key_q::<crate::units::LengthK>(&rw.spacing, &wpath, &keys::WEB_SPACING);
            let fy = cx.key_q::<crate::units::StressK>(&rw.fy, &wpath, &keys::FY);
            match (area, spacing, fy) {
                (Some(area), Some(spacing), Some(fy)) if family == Family::DoubleTee => Some(Some(WebSteel { area, spacing, fy })),
                _ => None,
            }
        }
    };
    let (strand, jacking, hold_down, price, max_length, web_steel) = (strand?, jacking?, hold_down?, price?, max_length?, web_steel?);
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
        web_steel,
        price,
        max_length,
        remarks,
    })
}

pub(super) fn published(cx: &mut Ctx, p: Option<&raw::RawPublished>, path: &str) -> Option<Published> {
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
            cx.rep.error(
                span(w),
                &join(&path, "weight"),
                format!(
                    "'{}' is neither a weight per area (psf, kPa) nor per length (plf, kN/m)",
                    w.get_ref()
                ),
            );
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

pub(super) fn compare_published(cx: &mut Ctx, s: &Section, mix: &Mix, raw: Option<&raw::RawPublished>, path: &str) {
    let Some(raw) = raw else { return };
    let path = join(path, "published");
    let wl = s.weight_per_length(mix);
    // (published, computed, key, unit, source string)
    type Check<'s> = (Option<f64>, f64, &'static str, &'static str, &'s Option<S>);
    let checks: [Check; 5] = [
        (s.published.area.map(Area::get), s.props.area_in2, "area", "in²", &raw.area),
        (s.published.yb.map(Length::get), s.props.yb_in, "yb", "in", &raw.yb),
        (s.published.inertia, s.props.ix_in4, "inertia", "in⁴", &raw.inertia),
        (
            s.published.weight_per_area.map(|w| w * 144.0),
            wl / s.props.width_in * 144.0,
            "weight",
            "psf",
            &raw.weight,
        ),
        (
            s.published.weight_per_length.map(|w| w * 12.0),
            wl * 12.0,
            "weight",
            "plf",
            &raw.weight,
        ),
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

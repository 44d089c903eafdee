//! Section geometry of the three families.

use toml::Spanned;

use super::{Ctx, join, keys, span};
use crate::catalog::raw::{self, S};
use crate::input::diag::suggestion;
use crate::section::family::fmt;
use crate::section::{CoreShape, Cores, DoubleTee, Generic, HollowCore, Keyway, VoidSpec};
use crate::units::Length;

pub(super) fn hollow_core(cx: &mut Ctx, h: &Spanned<raw::RawHollowCore>, path: &str) -> Option<HollowCore> {
    let r = h.get_ref();
    let width = cx.key_q::<crate::units::LengthK>(&r.width, path, &keys::WIDTH);
    let depth = cx.key_q::<crate::units::LengthK>(&r.depth, path, &keys::DEPTH);
    let c = r.cores.get_ref();
    let cpath = join(path, "cores");
    let count = cx.key_count(&c.count, &cpath, &keys::CORE_COUNT);
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
                    cx.rep.error(
                        span(v),
                        &join(&cpath, k),
                        format!("'{k}' does not apply to circular cores; give 'diameter'"),
                    );
                }
            }
            let d = need(cx, &c.diameter, "diameter", "circular cores need a diameter");
            (Some(CoreShape::Circle), d, d)
        }
        "stadium" | "oval" | "rounded-rectangle" => {
            if let Some(v) = &c.diameter {
                cx.rep.error(
                    span(v),
                    &join(&cpath, "diameter"),
                    format!("'diameter' is for circular cores; {shape_name} cores take 'width' and 'height'"),
                );
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
                    cx.rep.error(
                        span(v),
                        &join(&cpath, "corner_radius"),
                        "'corner_radius' applies only to rounded-rectangle cores",
                    );
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

pub(super) fn keyway(cx: &mut Ctx, k: &Spanned<raw::RawKeyway>, path: &str, wd: Option<(Length, Length)>) -> Option<Keyway> {
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
                cx.rep
                    .error(span(a), &join(path, "area"), format!("'{}' must be greater than zero", a.get_ref()));
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
            cx.rep.error(
                Some(k.span()),
                path,
                "give either 'profile' (side-face points) or 'area' (area removed), not both or neither",
            );
            None
        }
    }
}

pub(super) fn double_tee(cx: &mut Ctx, t: &Spanned<raw::RawDoubleTee>, path: &str) -> Option<DoubleTee> {
    let r = t.get_ref();
    let fw = cx.key_q::<crate::units::LengthK>(&r.flange_width, path, &keys::FLANGE_WIDTH);
    let ft = cx.positive_len(&r.flange_thickness, path, "flange_thickness");
    let d = cx.key_q::<crate::units::LengthK>(&r.depth, path, &keys::DEPTH);
    let stems = match &r.stems {
        None => Some(2),
        Some(s) => cx.key_count(s, path, &keys::STEMS),
    };
    let sp = cx.positive_len(&r.stem_spacing, path, "stem_spacing");
    let wt = cx.positive_len(&r.stem_width_top, path, "stem_width_top");
    let wb = cx.positive_len(&r.stem_width_bottom, path, "stem_width_bottom");
    let ch = match &r.chamfer {
        None => Some(0.0),
        Some(c) => cx.q::<crate::units::LengthK>(c, path, "chamfer").and_then(|v| {
            if v.get() < 0.0 {
                cx.rep
                    .error(span(c), &join(path, "chamfer"), format!("'{}' must not be negative", c.get_ref()));
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

pub(super) fn generic(cx: &mut Ctx, g: &Spanned<raw::RawGeneric>, path: &str) -> Option<Generic> {
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
                cx.rep.error(
                    Some(v.span()),
                    &vpath,
                    "a void is either 'points' (a polygon) or 'center' with 'diameter' (a circle)",
                );
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
        for (what, v, k) in [("depth", p.depth_in, &keys::DEPTH), ("width", p.width_in, &keys::WIDTH)] {
            let r = k.range().expect("a range");
            if !(r.lo..=r.hi).contains(&v) {
                problems.push(format!(
                    "{what} {} in is outside the plausible range {} to {} in",
                    fmt(v),
                    fmt(r.lo),
                    fmt(r.hi)
                ));
            }
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

//! Member cross-sections: geometry of the three families and their exact
//! section properties.
//!
//! A [`Geometry`] is one outline polygon less any number of voids, with an
//! optional lumped area reduction (an edge keyway given only by its area).
//! [`Geometry::properties`] integrates it in closed form — no meshing.

pub mod composite;
pub mod family;
pub mod shapes;

pub use composite::Composite;
pub use family::{CoreShape, Cores, DoubleTee, Generic, HollowCore, Keyway, VoidSpec};
pub use shapes::{Moments, Polygon, Shape};

use serde::Serialize;

/// Which family a section belongs to; decides which rules apply (depressed
/// strands, fire cover table, shear reinforcement rule).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Family {
    /// Extruded or slip-formed hollow-core plank (a one-way slab).
    HollowCore,
    /// Double tee: flange on two or more stems (stems are beams).
    DoubleTee,
    /// Any other shape given as a polygon with voids.
    Generic,
}

impl Family {
    /// The name used in catalogs and output.
    pub fn name(self) -> &'static str {
        match self {
            Family::HollowCore => "hollow-core",
            Family::DoubleTee => "double-tee",
            Family::Generic => "generic",
        }
    }
    /// Whether strands may be depressed (draped). Hollow-core is cast on a
    /// long bed by extrusion or slip-forming, where strands stay straight
    /// (common practice, no source).
    pub fn allows_depressed(self) -> bool {
        !matches!(self, Family::HollowCore)
    }
}

/// A lumped area taken out of the section (an edge keyway given by area).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct AreaReduction {
    /// Area removed, in².
    pub area: f64,
    /// Height of its centroid above the soffit, in.
    pub centroid: f64,
}

/// A cross-section: outline less voids, in inches (x from the left edge,
/// y up from the soffit).
#[derive(Debug, Clone, PartialEq)]
pub struct Geometry {
    /// Outer boundary.
    pub outline: Polygon,
    /// Voids (cores).
    pub voids: Vec<Shape>,
    /// Lumped reduction, if any.
    pub reduction: Option<AreaReduction>,
    /// Nominal width over which area loads act, in.
    pub width: f64,
    /// Overall depth, in.
    pub depth: f64,
    /// Thickness of solid top flange over which a topping bears and the
    /// compression block first forms, in.
    pub top_flange: f64,
    /// Least thickness of concrete below the voids (0 for open stems), in.
    pub bottom_flange: f64,
    /// Centre-line x of each stem of a stemmed section (empty otherwise), in.
    pub stems: Vec<f64>,
    /// Height of the stem chamfers, below which the web width is not
    /// searched for bw (0 when none), in.
    pub chamfer: f64,
}

/// Exact section properties of the bare precast section.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Properties {
    /// Net area, in².
    pub area_in2: f64,
    /// Centroid height above the soffit, in.
    pub yb_in: f64,
    /// Distance from the centroid to the top fibre, in.
    pub yt_in: f64,
    /// Second moment of area about the horizontal centroidal axis, in⁴.
    pub ix_in4: f64,
    /// Bottom-fibre section modulus I/yb, in³.
    pub sb_in3: f64,
    /// Top-fibre section modulus I/yt, in³.
    pub st_in3: f64,
    /// Overall depth, in.
    pub depth_in: f64,
    /// Nominal width, in.
    pub width_in: f64,
    /// Outer perimeter, in.
    pub perimeter_in: f64,
    /// Perimeter of the voids, in.
    pub void_perimeter_in: f64,
    /// Volume-to-surface ratio for shrinkage and creep: area over the
    /// perimeter exposed to drying, outer and void perimeters counted
    /// (common practice, no source), in.
    pub vs_ratio_in: f64,
    /// Net area ÷ nominal width (IBC 2021 §722.2.2.1.1 for hollow-core), in.
    pub net_thickness_in: f64,
    /// Solid concrete above the voids, or the flange thickness, in.
    pub top_flange_in: f64,
    /// Least concrete below the voids, in (0 for stemmed sections).
    pub bottom_flange_in: f64,
    /// Least summed web width over the height of the voids or stems — the
    /// bw for shear, in.
    pub web_width_min_in: f64,
    /// Height at which that least width occurs, in.
    pub web_width_min_at_in: f64,
    /// The plain rectangle at the top, (width, depth) in, or (0, 0): see
    /// [`Geometry::top_band`].
    pub top_band: (f64, f64),
}

impl Geometry {
    /// Area integrals of the net section about the soffit.
    pub fn moments(&self) -> Moments {
        let mut m = self.outline.moments();
        for v in &self.voids {
            m = m.minus(v.moments());
        }
        if let Some(r) = self.reduction {
            m = m.minus(Moments {
                area: r.area,
                qx: r.area * r.centroid,
                ixx: r.area * r.centroid * r.centroid,
            });
        }
        m
    }

    /// Area integrals of the net concrete between heights `lo` and `hi`
    /// (a lumped keyway reduction is left out: it sits at the edges and is
    /// small next to a compression zone).
    pub fn moments_between(&self, lo: f64, hi: f64) -> Moments {
        let mut m = self.outline.moments_between(lo, hi);
        for v in &self.voids {
            m = m.minus(v.moments_between(lo, hi));
        }
        m
    }

    /// Area integrals of the net concrete between heights `lo` and `hi`
    /// and across from `x0` to `x1` (an opening's part of the section).
    /// Curved voids are traced as 256-gons: within 0.01 % of their area.
    pub fn moments_within(&self, lo: f64, hi: f64, x0: f64, x1: f64) -> Moments {
        let part = |pts: &[(f64, f64)]| {
            let c = shapes::clip_box(pts, (x0, x1), (lo, hi));
            if c.len() < 3 {
                Moments::default()
            } else {
                Polygon { points: c }.moments()
            }
        };
        let mut m = part(&self.outline.points);
        for v in &self.voids {
            m = m.minus(part(&shapes::outline_points(v)));
        }
        m
    }

    /// Net width of concrete on the horizontal line at `y` between `x0` and `x1`, in.
    pub fn chord_within(&self, y: f64, x0: f64, x1: f64) -> f64 {
        let inside = |pts: &[(f64, f64)]| -> f64 {
            shapes::intervals(pts, y)
                .into_iter()
                .map(|(a, b)| (b.min(x1) - a.max(x0)).max(0.0))
                .sum()
        };
        let mut w = inside(&self.outline.points);
        for v in &self.voids {
            w -= match v {
                Shape::Polygon(p) => inside(&p.points),
                Shape::CircleSide { .. } => inside(&shapes::outline_points(v)),
                // the curved voids are symmetric about their centre line
                Shape::Circle { cx, .. } | Shape::Stadium { cx, .. } | Shape::RoundedRect { cx, .. } => {
                    let half = v.chord(y) / 2.0;
                    ((cx + half).min(x1) - (cx - half).max(x0)).max(0.0)
                }
            };
        }
        w.max(0.0)
    }

    /// The section an opening leaves when it takes out the part across
    /// from `x0` to `x1` (in from the left edge): the outline cut on both
    /// sides and joined by a zero-width bridge (its two edges cancel in
    /// every area integral), voids wholly in the opening dropped, voids it
    /// cuts traced as 256-gons and cut. Area integrals
    /// ([`Geometry::moments`], [`Geometry::moments_between`]) are exact on
    /// it; chords are not (the bridge), so widths come from the full
    /// section ([`Geometry::chord_within`]).
    pub fn net(&self, x0: f64, x1: f64) -> Geometry {
        let inf = f64::INFINITY;
        let sides = |pts: &[(f64, f64)]| -> Vec<Vec<(f64, f64)>> {
            [
                shapes::clip_box(pts, (-inf, x0), (-inf, inf)),
                shapes::clip_box(pts, (x1, inf), (-inf, inf)),
            ]
            .into_iter()
            .filter(|p| p.len() >= 3)
            .collect()
        };
        let join = |parts: Vec<Vec<(f64, f64)>>| -> Vec<(f64, f64)> {
            let mut out: Vec<(f64, f64)> = Vec::new();
            for p in parts {
                // each ring closed on its first point, then back along the bridge
                if let Some(&first_prev) = out.first() {
                    let start = p[0];
                    out.extend(p.iter().copied());
                    out.push(start);
                    out.push(first_prev);
                } else {
                    out.extend(p.iter().copied());
                    out.push(p[0]);
                }
            }
            out
        };
        let mut voids = Vec::with_capacity(self.voids.len() + 2);
        for v in &self.voids {
            let (a, b) = v.x_range();
            if b <= x0 || a >= x1 {
                voids.push(v.clone());
            } else if a < x0 || b > x1 {
                match *v {
                    // a round core keeps its exact parts either side of the cut
                    Shape::Circle { cx, cy, r } => {
                        if a < x0 {
                            voids.push(Shape::CircleSide {
                                cx,
                                cy,
                                r,
                                at: x0,
                                left: true,
                            });
                        }
                        if b > x1 {
                            voids.push(Shape::CircleSide {
                                cx,
                                cy,
                                r,
                                at: x1,
                                left: false,
                            });
                        }
                    }
                    _ => {
                        for piece in sides(&shapes::outline_points(v)) {
                            voids.push(Shape::Polygon(Polygon { points: piece }));
                        }
                    }
                }
            }
        }
        let wide = (x1.min(self.width) - x0.max(0.0)).max(0.0);
        Geometry {
            outline: Polygon {
                points: join(sides(&self.outline.points)),
            },
            voids,
            reduction: self.reduction,
            width: self.width - wide,
            depth: self.depth,
            top_flange: self.top_flange,
            bottom_flange: self.bottom_flange,
            stems: self.stems.iter().copied().filter(|&s| s < x0 || s > x1).collect(),
            chamfer: self.chamfer,
        }
    }

    /// The properties of the net section `net` (from [`Geometry::net`] of
    /// the part across from `x0` to `x1`): area, centroid and inertia of
    /// what remains; bw less the concrete taken at the height of the least
    /// web width; the top band narrowed by it.
    pub fn net_properties(&self, net: &Geometry, full: &Properties, x0: f64, x1: f64) -> Properties {
        let m = net.moments();
        let yb = m.qx / m.area;
        let ix = m.ixx - m.area * yb * yb;
        let yt = self.depth - yb;
        let wide = (x1.min(self.width) - x0.max(0.0)).max(0.0);
        let (band_w, band_d) = full.top_band;
        Properties {
            area_in2: m.area,
            yb_in: yb,
            yt_in: yt,
            ix_in4: ix,
            sb_in3: ix / yb,
            st_in3: ix / yt,
            width_in: full.width_in - wide,
            net_thickness_in: m.area / full.width_in,
            web_width_min_in: (full.web_width_min_in - self.chord_within(full.web_width_min_at_in, x0, x1)).max(0.0),
            top_band: if band_w > 0.0 {
                (band_w - self.chord_within(self.depth - band_d / 2.0, x0, x1), band_d)
            } else {
                (0.0, 0.0)
            },
            ..full.clone()
        }
    }

    /// The section turned upside down (y → depth − y): its soffit becomes
    /// the compression face of a hogging moment.
    pub fn flipped(&self) -> Geometry {
        let h = self.depth;
        let flip_poly = |p: &Polygon| Polygon {
            points: p.points.iter().rev().map(|&(x, y)| (x, h - y)).collect(),
        };
        Geometry {
            outline: flip_poly(&self.outline),
            voids: self
                .voids
                .iter()
                .map(|v| match *v {
                    Shape::Polygon(ref p) => Shape::Polygon(flip_poly(p)),
                    Shape::Circle { cx, cy, r } => Shape::Circle { cx, cy: h - cy, r },
                    Shape::CircleSide { cx, cy, r, at, left } => Shape::CircleSide {
                        cx,
                        cy: h - cy,
                        r,
                        at,
                        left,
                    },
                    Shape::Stadium { cx, cy, w, h: hh } => Shape::Stadium { cx, cy: h - cy, w, h: hh },
                    Shape::RoundedRect { cx, cy, w, h: hh, r } => Shape::RoundedRect {
                        cx,
                        cy: h - cy,
                        w,
                        h: hh,
                        r,
                    },
                })
                .collect(),
            reduction: self.reduction.map(|r| AreaReduction {
                area: r.area,
                centroid: h - r.centroid,
            }),
            width: self.width,
            depth: h,
            top_flange: self.bottom_flange,
            bottom_flange: self.top_flange,
            stems: self.stems.clone(),
            chamfer: 0.0,
        }
    }

    /// Net width of concrete cut by the horizontal line at `y`, in: the
    /// summed web width at that height. A lumped reduction is ignored here.
    pub fn width_at(&self, y: f64) -> f64 {
        (self.outline.chord(y) - shapes::chords_at(&self.voids, y)).max(0.0)
    }

    /// The least summed web width and the height where it occurs, searched
    /// over the web zone (the voids' height, or below the flange for stems).
    pub fn min_web_width(&self) -> (f64, f64) {
        let (lo, hi) = if self.voids.is_empty() {
            (self.chamfer, self.depth - self.top_flange)
        } else {
            self.voids.iter().fold((f64::INFINITY, f64::NEG_INFINITY), |(a, b), v| {
                let (y0, y1) = v.y_range();
                (a.min(y0), b.max(y1))
            })
        };
        let (lo, hi) = (lo.max(0.0), hi.min(self.depth));
        if hi <= lo {
            return (self.width_at(self.depth / 2.0), self.depth / 2.0);
        }
        // coarse scan, then golden refinement around the best sample
        let n = 160;
        let mut best = (f64::INFINITY, lo);
        for k in 0..=n {
            let y = lo + (hi - lo) * (k as f64 + 0.5) / (n as f64 + 1.0);
            let b = self.width_at(y);
            if b < best.0 {
                best = (b, y);
            }
        }
        let step = (hi - lo) / n as f64;
        let (mut a, mut c) = ((best.1 - step).max(lo), (best.1 + step).min(hi));
        // golden section: one new width per step, the bracket × 0.618
        const G: f64 = 0.381_966_011_250_105_1;
        let (mut m1, mut m2) = (a + (c - a) * G, c - (c - a) * G);
        let (mut w1, mut w2) = (self.width_at(m1), self.width_at(m2));
        for _ in 0..60 {
            if w1 <= w2 {
                (c, m2, w2) = (m2, m1, w1);
                m1 = a + (c - a) * G;
                w1 = self.width_at(m1);
            } else {
                (a, m1, w1) = (m1, m2, w2);
                m2 = c - (c - a) * G;
                w2 = self.width_at(m2);
            }
        }
        let y = (a + c) / 2.0;
        let b = self.width_at(y).min(best.0);
        (b, if self.width_at(y) <= best.0 { y } else { best.1 })
    }

    /// The rectangle at the top of a precast geometry, if its top flange is one:
    /// (width, depth), found by sampling the chord over the flange.
    pub fn top_band(&self) -> (f64, f64) {
        let g = self;
        let (h, tf) = (g.depth, g.top_flange);
        if tf <= 0.0 {
            return (0.0, 0.0);
        }
        let voids_top = g.voids.iter().map(|v| v.y_range().1).fold(f64::NEG_INFINITY, f64::max);
        if voids_top > h - tf + 1e-9 {
            return (0.0, 0.0);
        }
        let b = g.outline.chord(h - 1e-9);
        let same = (0..=16).all(|k| {
            let y = h - tf + tf * k as f64 / 16.0;
            (g.outline.chord(y.min(h - 1e-9)) - b).abs() <= 1e-9 * b
        });
        if same { (b, tf) } else { (0.0, 0.0) }
    }

    /// Exact properties of the net section.
    pub fn properties(&self) -> Properties {
        let m = self.moments();
        let yb = m.qx / m.area;
        let ix = m.ixx - m.area * yb * yb;
        let yt = self.depth - yb;
        let perimeter = self.outline.perimeter();
        let void_perimeter: f64 = self.voids.iter().map(Shape::perimeter).sum();
        let (bw, bw_at) = self.min_web_width();
        Properties {
            area_in2: m.area,
            yb_in: yb,
            yt_in: yt,
            ix_in4: ix,
            sb_in3: ix / yb,
            st_in3: ix / yt,
            depth_in: self.depth,
            width_in: self.width,
            perimeter_in: perimeter,
            void_perimeter_in: void_perimeter,
            vs_ratio_in: m.area / (perimeter + void_perimeter),
            net_thickness_in: m.area / self.width,
            top_flange_in: self.top_flange,
            bottom_flange_in: self.bottom_flange,
            web_width_min_in: bw,
            web_width_min_at_in: bw_at,
            top_band: self.top_band(),
        }
    }

    /// Clear distance from a bar or strand of diameter `d` centred at (x, y)
    /// to the nearest concrete surface, in; negative when it breaks out.
    pub fn clear_cover(&self, x: f64, y: f64, d: f64) -> f64 {
        let mut c = if self.outline.contains(x, y) {
            self.outline.distance_to_edge(x, y)
        } else {
            -self.outline.distance_to_edge(x, y)
        };
        for v in &self.voids {
            c = c.min(v.signed_distance(x, y));
        }
        c - d / 2.0
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn solid(b: f64, h: f64) -> Geometry {
        Geometry {
            outline: Polygon {
                points: vec![(0.0, 0.0), (b, 0.0), (b, h), (0.0, h)],
            },
            voids: vec![],
            reduction: None,
            width: b,
            depth: h,
            top_flange: h,
            bottom_flange: h,
            stems: vec![],
            chamfer: 0.0,
        }
    }

    #[test]
    fn solid_strip_matches_textbook() {
        // 48 × 8 in strip: A = 384 in², I = bh³/12 = 2048 in⁴, Sb = 512 in³
        // (also the check values of the engineering reference sheet, §10.2 A).
        let p = solid(48.0, 8.0).properties();
        assert_relative_eq!(p.area_in2, 384.0);
        assert_relative_eq!(p.yb_in, 4.0);
        assert_relative_eq!(p.ix_in4, 2048.0, max_relative = 1e-12);
        assert_relative_eq!(p.sb_in3, 512.0, max_relative = 1e-12);
        assert_relative_eq!(p.vs_ratio_in, 384.0 / 112.0, max_relative = 1e-12);
        assert_relative_eq!(p.web_width_min_in, 48.0);
    }

    #[test]
    fn hollow_rectangle_matches_textbook() {
        // 12 × 20 outer, 8 × 16 inner, concentric: I = (12·20³ − 8·16³)/12.
        let mut g = solid(12.0, 20.0);
        g.voids.push(Shape::Polygon(Polygon {
            points: vec![(2.0, 2.0), (10.0, 2.0), (10.0, 18.0), (2.0, 18.0)],
        }));
        let p = g.properties();
        assert_relative_eq!(p.area_in2, 240.0 - 128.0);
        assert_relative_eq!(p.yb_in, 10.0, max_relative = 1e-12);
        assert_relative_eq!(p.ix_in4, (12.0 * 8000.0 - 8.0 * 4096.0) / 12.0, max_relative = 1e-12);
        assert_relative_eq!(p.web_width_min_in, 4.0, max_relative = 1e-9);
    }

    #[test]
    fn tee_section_matches_textbook() {
        // T: flange 30 × 4 on a 6 × 16 web, total depth 20 (hand calculation:
        // A = 216, yb = (96·8 + 120·18)/216 = 13.556, I by parallel axes).
        let g = Geometry {
            outline: Polygon {
                points: vec![
                    (12.0, 0.0),
                    (18.0, 0.0),
                    (18.0, 16.0),
                    (30.0, 16.0),
                    (30.0, 20.0),
                    (0.0, 20.0),
                    (0.0, 16.0),
                    (12.0, 16.0),
                ],
            },
            voids: vec![],
            reduction: None,
            width: 30.0,
            depth: 20.0,
            top_flange: 4.0,
            bottom_flange: 0.0,
            stems: vec![15.0],
            chamfer: 0.0,
        };
        let p = g.properties();
        let yb: f64 = (96.0 * 8.0 + 120.0 * 18.0) / 216.0;
        let i = 6.0 * 16f64.powi(3) / 12.0 + 96.0 * (yb - 8.0).powi(2) + 30.0 * 64.0 / 12.0 + 120.0 * (18.0 - yb).powi(2);
        assert_relative_eq!(p.area_in2, 216.0);
        assert_relative_eq!(p.yb_in, yb, max_relative = 1e-12);
        assert_relative_eq!(p.ix_in4, i, max_relative = 1e-12);
        assert_relative_eq!(p.web_width_min_in, 6.0, max_relative = 1e-9);
        assert_relative_eq!(g.width_at(18.0), 30.0);
    }

    #[test]
    fn the_net_section_integrates_as_the_full_one_less_the_part_taken() {
        // a 48 × 8 slab with six 5.5 in round cores at 7.5 in, cut across
        // 16–32 in (through two cores) and 0–10 in (an edge, one core)
        let mut g = solid(48.0, 8.0);
        for k in 0..6 {
            g.voids.push(Shape::Circle {
                cx: 5.25 + 7.5 * k as f64,
                cy: 4.0,
                r: 2.75,
            });
        }
        for (x0, x1) in [(16.0, 32.0), (0.0, 10.0), (40.0, 48.0)] {
            let net = g.net(x0, x1);
            // both trace a cut core as a 256-gon (its area within 1e-4 of
            // the circle's, 0.0024 in² of a 5.5 in core), on different sides
            // of the cut: they agree to that
            let tol = 0.01;
            for (lo, hi) in [(0.0, 8.0), (6.0, 8.0), (1.0, 7.0), (3.9, 4.1)] {
                let want = g.moments_between(lo, hi).minus(g.moments_within(lo, hi, x0, x1));
                let got = net.moments_between(lo, hi);
                assert!(
                    (got.area - want.area).abs() < tol,
                    "{x0}-{x1} {lo}-{hi}: {} vs {}",
                    got.area,
                    want.area
                );
                assert!((got.qx - want.qx).abs() < tol * 8.0);
                assert!((got.ixx - want.ixx).abs() < tol * 64.0);
            }
            // a band clear of the cores is exact
            let want = g.moments_between(7.0, 8.0).minus(g.moments_within(7.0, 8.0, x0, x1));
            assert!((net.moments_between(7.0, 8.0).area - want.area).abs() < 1e-9);
            // the part taken is what a 256-gon trace of the cores says: the
            // exact circle segments differ by under 0.01 % of a core
            let taken = g.moments().area - net.moments().area;
            let exact_band = 8.0 * (x1.min(48.0) - x0);
            assert!(taken < exact_band && taken > 0.3 * exact_band, "{taken}");
        }
    }

    #[test]
    fn cover_to_surfaces() {
        let g = solid(48.0, 8.0);
        assert_relative_eq!(g.clear_cover(24.0, 1.75, 0.5), 1.5);
        assert!(g.clear_cover(24.0, 0.1, 0.5) < 0.0);
    }
}

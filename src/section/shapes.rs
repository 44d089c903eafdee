//! Plane shapes with closed-form area integrals: polygons, circles, stadiums
//! (ovals) and rounded rectangles. Coordinates in inches, x across the
//! member from its left edge, y up from the soffit.
//!
//! Moments are taken about the soffit line y = 0; the section module moves
//! them to the centroid. Formulas: the shoelace (Green's theorem) integrals
//! for polygons; for curved shapes the exact circle, semicircle and
//! rectangle results of any mechanics text (e.g. Gere & Goodno, *Mechanics
//! of Materials*, Appendix E).

use std::f64::consts::PI;

/// Area integrals of a shape about the soffit line.
#[derive(Debug, Clone, Copy, Default, PartialEq)]
pub struct Moments {
    /// Area, in².
    pub area: f64,
    /// First moment ∫y dA about y = 0, in³.
    pub qx: f64,
    /// Second moment ∫y² dA about y = 0, in⁴.
    pub ixx: f64,
}

impl Moments {
    /// The sum of two sets of integrals.
    pub fn plus(self, o: Moments) -> Moments {
        Moments {
            area: self.area + o.area,
            qx: self.qx + o.qx,
            ixx: self.ixx + o.ixx,
        }
    }
    /// The difference (a void taken out).
    pub fn minus(self, o: Moments) -> Moments {
        Moments {
            area: self.area - o.area,
            qx: self.qx - o.qx,
            ixx: self.ixx - o.ixx,
        }
    }
    /// A rectangle of width `b` and height `h` whose centroid is at height `yc`.
    pub fn rect(b: f64, h: f64, yc: f64) -> Moments {
        let a = b * h;
        Moments {
            area: a,
            qx: a * yc,
            ixx: b * h.powi(3) / 12.0 + a * yc * yc,
        }
    }
    /// A full circle of radius `r` centred at height `yc`.
    pub fn circle(r: f64, yc: f64) -> Moments {
        let a = PI * r * r;
        Moments {
            area: a,
            qx: a * yc,
            ixx: PI * r.powi(4) / 4.0 + a * yc * yc,
        }
    }
    /// A half circle of radius `r` whose diameter lies at height `y0`,
    /// bulging up (`up = true`) or down.
    pub fn semicircle(r: f64, y0: f64, up: bool) -> Moments {
        let a = PI * r * r / 2.0;
        let s = if up { 1.0 } else { -1.0 };
        // about its own diameter: Q = ±2r³/3, I = πr⁴/8
        let q0 = s * 2.0 * r.powi(3) / 3.0;
        let i0 = PI * r.powi(4) / 8.0;
        Moments {
            area: a,
            qx: q0 + a * y0,
            ixx: i0 + 2.0 * y0 * q0 + a * y0 * y0,
        }
    }
}

/// A simple polygon, vertices in order (either direction), not repeated at the end.
#[derive(Debug, Clone, PartialEq)]
pub struct Polygon {
    /// Vertices (x, y), inches.
    pub points: Vec<(f64, f64)>,
}

/// A void or a curved shape.
#[derive(Debug, Clone, PartialEq)]
pub enum Shape {
    /// A polygon.
    Polygon(Polygon),
    /// A circle of centre (cx, cy) and radius r.
    Circle {
        /// Centre x, in.
        cx: f64,
        /// Centre y, in.
        cy: f64,
        /// Radius, in.
        r: f64,
    },
    /// A stadium (oval): a rectangle with semicircular ends on its shorter
    /// sides; `w` × `h` overall. Vertical when h > w.
    Stadium {
        /// Centre x, in.
        cx: f64,
        /// Centre y, in.
        cy: f64,
        /// Overall width, in.
        w: f64,
        /// Overall height, in.
        h: f64,
    },
    /// A rectangle `w` × `h` with corners rounded to radius `r`.
    RoundedRect {
        /// Centre x, in.
        cx: f64,
        /// Centre y, in.
        cy: f64,
        /// Overall width, in.
        w: f64,
        /// Overall height, in.
        h: f64,
        /// Corner radius, in (0 ≤ r ≤ min(w, h)/2).
        r: f64,
    },
    /// The part of a circle on one side of the vertical line x = `at`:
    /// x ≤ `at` when `left`, else x ≥ `at` (a core an opening cuts).
    CircleSide {
        /// Centre x, in.
        cx: f64,
        /// Centre y, in.
        cy: f64,
        /// Radius, in.
        r: f64,
        /// The cutting line, in.
        at: f64,
        /// Which side is kept.
        left: bool,
    },
}

impl Polygon {
    /// Signed area (positive when counter-clockwise).
    fn signed_area(&self) -> f64 {
        self.edges().map(|((x0, y0), (x1, y1))| x0 * y1 - x1 * y0).sum::<f64>() / 2.0
    }

    fn edges(&self) -> impl Iterator<Item = ((f64, f64), (f64, f64))> + '_ {
        let n = self.points.len();
        (0..n).map(move |i| (self.points[i], self.points[(i + 1) % n]))
    }

    /// Area integrals (shoelace forms), independent of vertex order.
    pub fn moments(&self) -> Moments {
        let (mut a, mut q, mut i) = (0.0, 0.0, 0.0);
        for ((x0, y0), (x1, y1)) in self.edges() {
            let c = x0 * y1 - x1 * y0;
            a += c;
            q += (y0 + y1) * c;
            i += (y0 * y0 + y0 * y1 + y1 * y1) * c;
        }
        let s = if a < 0.0 { -1.0 } else { 1.0 };
        Moments {
            area: s * a / 2.0,
            qx: s * q / 6.0,
            ixx: s * i / 12.0,
        }
    }

    /// Perimeter, in.
    pub fn perimeter(&self) -> f64 {
        self.edges().map(|((x0, y0), (x1, y1))| (x1 - x0).hypot(y1 - y0)).sum()
    }

    /// Total width of the polygon cut by the horizontal line at `y`, in.
    /// For a simple polygon the inside runs from each downward crossing to
    /// the next upward one (counter-clockwise order), so the width is the sum
    /// of upward crossings less the downward ones — no sorting needed.
    pub fn chord(&self, y: f64) -> f64 {
        let sign = if self.signed_area() < 0.0 { -1.0 } else { 1.0 };
        let mut w = 0.0;
        for ((x0, y0), (x1, y1)) in self.edges() {
            // half-open rule so shared vertices count once
            if (y0 <= y && y < y1) || (y1 <= y && y < y0) {
                let x = x0 + (y - y0) * (x1 - x0) / (y1 - y0);
                w += if y1 > y0 { x } else { -x };
            }
        }
        (sign * w).max(0.0)
    }

    /// Whether (x, y) lies inside (even-odd rule).
    pub fn contains(&self, x: f64, y: f64) -> bool {
        let mut inside = false;
        for ((x0, y0), (x1, y1)) in self.edges() {
            if (y0 > y) != (y1 > y) && x < x0 + (y - y0) * (x1 - x0) / (y1 - y0) {
                inside = !inside;
            }
        }
        inside
    }

    /// Distance from (x, y) to the nearest edge, in.
    pub fn distance_to_edge(&self, x: f64, y: f64) -> f64 {
        self.edges()
            .map(|(a, b)| dist2_to_segment((x, y), a, b))
            .fold(f64::INFINITY, f64::min)
            .sqrt()
    }

    /// Lowest and highest y.
    pub fn y_range(&self) -> (f64, f64) {
        self.points
            .iter()
            .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), &(_, y)| (lo.min(y), hi.max(y)))
    }

    /// Leftmost and rightmost x.
    pub fn x_range(&self) -> (f64, f64) {
        self.points
            .iter()
            .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), &(x, _)| (lo.min(x), hi.max(x)))
    }

    /// Whether the outline crosses or touches itself (it is not a simple
    /// polygon): two edges that are not neighbours cross, or meet at a
    /// point (a vertex on another edge, two vertices at one place), or two
    /// neighbours fold back over each other.
    pub fn self_intersects(&self) -> bool {
        let n = self.points.len();
        let e: Vec<_> = self.edges().collect();
        let scale = self.points.iter().fold(0.0f64, |m, p| m.max(p.0.abs()).max(p.1.abs())).max(1.0);
        let tol2 = (1e-9 * scale).powi(2);
        for i in 0..n {
            for j in (i + 1)..n {
                let neighbours = j == i + 1 || (i == 0 && j == n - 1);
                let (a, b) = e[i];
                let (c, d) = e[j];
                if neighbours {
                    // the shared vertex; the other ends must not lie on the other edge
                    let (p, q) = if j == i + 1 { (a, d) } else { (b, c) };
                    if dist2_to_segment(p, c, d) < tol2 || dist2_to_segment(q, a, b) < tol2 {
                        return true;
                    }
                    continue;
                }
                if segments_cross(a, b, c, d)
                    || dist2_to_segment(a, c, d) < tol2
                    || dist2_to_segment(b, c, d) < tol2
                    || dist2_to_segment(c, a, b) < tol2
                    || dist2_to_segment(d, a, b) < tol2
                {
                    return true;
                }
            }
        }
        false
    }

    /// Whether the vertices run counter-clockwise.
    pub fn is_ccw(&self) -> bool {
        self.signed_area() > 0.0
    }
}

fn segments_cross(p1: (f64, f64), p2: (f64, f64), q1: (f64, f64), q2: (f64, f64)) -> bool {
    let o = |a: (f64, f64), b: (f64, f64), c: (f64, f64)| (b.0 - a.0) * (c.1 - a.1) - (b.1 - a.1) * (c.0 - a.0);
    let d1 = o(q1, q2, p1);
    let d2 = o(q1, q2, p2);
    let d3 = o(p1, p2, q1);
    let d4 = o(p1, p2, q2);
    (d1 * d2 < 0.0) && (d3 * d4 < 0.0)
}

/// Distance from point p to segment ab.
pub fn dist_to_segment(p: (f64, f64), a: (f64, f64), b: (f64, f64)) -> f64 {
    dist2_to_segment(p, a, b).sqrt()
}

/// Squared distance from point p to segment ab.
fn dist2_to_segment(p: (f64, f64), a: (f64, f64), b: (f64, f64)) -> f64 {
    let (dx, dy) = (b.0 - a.0, b.1 - a.1);
    let len2 = dx * dx + dy * dy;
    let t = if len2 == 0.0 {
        0.0
    } else {
        (((p.0 - a.0) * dx + (p.1 - a.1) * dy) / len2).clamp(0.0, 1.0)
    };
    let (ex, ey) = (p.0 - a.0 - t * dx, p.1 - a.1 - t * dy);
    ex * ex + ey * ey
}

fn half_chord(r: f64, dy: f64) -> f64 {
    if dy.abs() >= r { 0.0 } else { (r * r - dy * dy).sqrt() }
}

/// A horizontal band of a shape, for exact integration between two heights.
#[derive(Debug, Clone, Copy, PartialEq)]
enum Piece {
    /// A rectangle of width `b` from `y0` to `y1`.
    Rect { b: f64, y0: f64, y1: f64 },
    /// The part of a full circle (radius `r`, centre height `yc`) between `lo` and `hi`.
    Circle { r: f64, yc: f64, lo: f64, hi: f64 },
    /// The part of a circle on one side of a vertical line `d` from its
    /// centre (positive: the line lies beyond the centre, the kept part
    /// holds it): at t from the centre height the kept width is
    /// min(2h, max(0, d + h)), h = √(r² − t²).
    Side { r: f64, yc: f64, d: f64 },
}

/// Antiderivatives of the circle chord 2√(r² − t²) times 1, t and t².
fn circle_f(r: f64, t: f64) -> (f64, f64, f64) {
    let t = t.clamp(-r, r);
    let root = (r * r - t * t).max(0.0).sqrt();
    let asin = (t / r).clamp(-1.0, 1.0).asin();
    let f0 = t * root + r * r * asin;
    let f1 = -2.0 / 3.0 * root.powi(3);
    let f2 = t / 4.0 * (2.0 * t * t - r * r) * root + r.powi(4) / 4.0 * asin;
    (f0, f1, f2)
}

impl Piece {
    fn between(self, lo: f64, hi: f64) -> Moments {
        match self {
            Piece::Rect { b, y0, y1 } => {
                let (a, c) = (y0.max(lo), y1.min(hi));
                if c <= a {
                    Moments::default()
                } else {
                    Moments::rect(b, c - a, (a + c) / 2.0)
                }
            }
            Piece::Circle { r, yc, lo: l0, hi: h0 } => {
                let (a, c) = (l0.max(lo), h0.min(hi));
                if c <= a {
                    return Moments::default();
                }
                let (a0, a1, a2) = circle_f(r, a - yc);
                let (c0, c1, c2) = circle_f(r, c - yc);
                let (m0, m1, m2) = (c0 - a0, c1 - a1, c2 - a2);
                Moments {
                    area: m0,
                    qx: yc * m0 + m1,
                    ixx: yc * yc * m0 + 2.0 * yc * m1 + m2,
                }
            }
            Piece::Side { r, yc, d } => {
                // where the line crosses the circle: |t| < T
                let t_cross = if d.abs() < r { (r * r - d * d).sqrt() } else { 0.0 };
                let (a, c) = ((lo - yc).max(-r), (hi - yc).min(r));
                if c <= a {
                    return Moments::default();
                }
                // ∫ 2h {1, t, t²} over [p, q], and ∫ (d + h) {1, t, t²}
                let full = |p: f64, q: f64| {
                    let (p0, p1, p2) = circle_f(r, p);
                    let (q0, q1, q2) = circle_f(r, q);
                    (q0 - p0, q1 - p1, q2 - p2)
                };
                let part = |p: f64, q: f64| {
                    let (h0, h1, h2) = full(p, q);
                    (
                        d * (q - p) + h0 / 2.0,
                        d * (q * q - p * p) / 2.0 + h1 / 2.0,
                        d * (q.powi(3) - p.powi(3)) / 3.0 + h2 / 2.0,
                    )
                };
                let mut m = (0.0, 0.0, 0.0);
                let mut add = |v: (f64, f64, f64)| {
                    m.0 += v.0;
                    m.1 += v.1;
                    m.2 += v.2;
                };
                let clip = |p: f64, q: f64| (p.max(a), q.min(c));
                if d >= r {
                    add(full(a, c));
                } else if d > -r {
                    let (p, q) = clip(-t_cross, t_cross);
                    if q > p {
                        add(part(p, q));
                    }
                    if d > 0.0 {
                        // beyond the crossing the whole chord is kept
                        for (p, q) in [clip(-r, -t_cross), clip(t_cross, r)] {
                            if q > p {
                                add(full(p, q));
                            }
                        }
                    }
                }
                let (m0, m1, m2) = m;
                Moments {
                    area: m0,
                    qx: yc * m0 + m1,
                    ixx: yc * yc * m0 + 2.0 * yc * m1 + m2,
                }
            }
        }
    }

    fn chord(self, y: f64) -> f64 {
        match self {
            Piece::Rect { b, y0, y1 } => {
                if y >= y0 && y < y1 {
                    b
                } else {
                    0.0
                }
            }
            Piece::Circle { r, yc, lo, hi } => {
                if y >= lo && y < hi {
                    2.0 * half_chord(r, y - yc)
                } else {
                    0.0
                }
            }
            Piece::Side { r, yc, d } => {
                let h = half_chord(r, y - yc);
                (2.0 * h).min((d + h).max(0.0))
            }
        }
    }
}

/// Sutherland–Hodgman clip of a polygon to the box x0 ≤ x ≤ x1,
/// lo ≤ y ≤ hi; exact for the area integrals even where the result has
/// zero-width bridges.
pub fn clip_box(points: &[(f64, f64)], (x0, x1): (f64, f64), (lo, hi): (f64, f64)) -> Vec<(f64, f64)> {
    fn clip(pts: &[(f64, f64)], axis: usize, keep_above: bool, at: f64) -> Vec<(f64, f64)> {
        let get = |p: (f64, f64)| if axis == 0 { p.0 } else { p.1 };
        let inside = |p: (f64, f64)| if keep_above { get(p) >= at } else { get(p) <= at };
        let mut out = Vec::with_capacity(pts.len() + 4);
        for i in 0..pts.len() {
            let p = pts[i];
            let q = pts[(i + 1) % pts.len()];
            let (pin, qin) = (inside(p), inside(q));
            if pin {
                out.push(p);
            }
            if pin != qin {
                let t = (at - get(p)) / (get(q) - get(p));
                out.push((p.0 + t * (q.0 - p.0), p.1 + t * (q.1 - p.1)));
            }
        }
        out
    }
    let mut v = points.to_vec();
    for (axis, above, at) in [(0, true, x0), (0, false, x1), (1, true, lo), (1, false, hi)] {
        if v.len() < 3 {
            return Vec::new();
        }
        if at.is_finite() {
            v = clip(&v, axis, above, at);
        }
    }
    v
}

/// Where the horizontal line at `y` is inside a polygon: sorted intervals of x.
pub fn intervals(points: &[(f64, f64)], y: f64) -> Vec<(f64, f64)> {
    let n = points.len();
    let mut xs: Vec<f64> = Vec::new();
    for i in 0..n {
        let (a, b) = (points[i], points[(i + 1) % n]);
        // half-open in y, so a vertex on the line counts once
        if (a.1 <= y) != (b.1 <= y) {
            xs.push(a.0 + (y - a.1) / (b.1 - a.1) * (b.0 - a.0));
        }
    }
    xs.sort_by(f64::total_cmp);
    xs.chunks_exact(2).map(|c| (c[0], c[1])).collect()
}

/// Sides of the polygon that stands for a curved shape where it must be
/// cut across (an opening through a core).
const TRACE: usize = 96;

/// The unit circle's points for [`TRACE`] sides, worked out once.
fn unit_trace() -> &'static [(f64, f64); TRACE] {
    static T: std::sync::OnceLock<[(f64, f64); TRACE]> = std::sync::OnceLock::new();
    T.get_or_init(|| {
        std::array::from_fn(|k| {
            let (sin, cos) = (2.0 * PI * k as f64 / TRACE as f64).sin_cos();
            (cos, sin)
        })
    })
}

/// A polygon standing for a shape where it must be cut across: a
/// polygon's own points; a circle as a regular 96-gon whose radius is
/// scaled so that its area is the circle's (r·√(2π / (n sin(2π/n)))), its
/// second moment then within 1e-5 of the circle's; other curved shapes
/// traced by 256 points (area within 0.01 %).
pub fn outline_points(s: &Shape) -> Vec<(f64, f64)> {
    match *s {
        Shape::Polygon(ref p) => p.points.clone(),
        Shape::Circle { cx, cy, r } => {
            let n = TRACE as f64;
            let k = (2.0 * PI / (n * (2.0 * PI / n).sin())).sqrt();
            unit_trace().iter().map(|&(c, sn)| (cx + r * k * c, cy + r * k * sn)).collect()
        }
        _ => s.boundary_points(256),
    }
}

impl Polygon {
    /// Area integrals of the part between heights `lo` and `hi`.
    ///
    /// By Green's theorem the integrals of 1, y and y² over the region are
    /// ∮ x dy, ∮ x y dy and ∮ x y² dy around it; the band's own top and
    /// bottom edges are horizontal (dy = 0) and add nothing, so each edge
    /// of the polygon is integrated over the part of it inside the band —
    /// exact, and no clipped polygon is built (a hot path of strain
    /// compatibility).
    pub fn moments_between(&self, lo: f64, hi: f64) -> Moments {
        let (mut a, mut q, mut i) = (0.0, 0.0, 0.0);
        for ((x0, y0), (x1, y1)) in self.edges() {
            if y0 == y1 {
                continue;
            }
            // the edge's part inside the band, in its own direction
            let (ya, yb) = (y0.clamp(lo, hi), y1.clamp(lo, hi));
            if ya == yb {
                continue;
            }
            // x = α + β y along the edge
            let beta = (x1 - x0) / (y1 - y0);
            let alpha = x0 - beta * y0;
            let p = |k: i32| (yb.powi(k) - ya.powi(k)) / k as f64;
            a += alpha * p(1) + beta * p(2);
            q += alpha * p(2) + beta * p(3);
            i += alpha * p(3) + beta * p(4);
        }
        // counter-clockwise is positive; the sign of the whole polygon's area
        let s = if self.signed_area() < 0.0 { -1.0 } else { 1.0 };
        Moments {
            area: s * a,
            qx: s * q,
            ixx: s * i,
        }
    }
}

impl Shape {
    /// Horizontal bands that make up the shape (curved shapes only), in a
    /// fixed array (no allocation on this hot path) with the count used.
    fn pieces(&self) -> ([Piece; 5], usize) {
        let none = Piece::Rect { b: 0.0, y0: 0.0, y1: 0.0 };
        let pad = |v: &[Piece]| {
            let mut a = [none; 5];
            a[..v.len()].copy_from_slice(v);
            (a, v.len())
        };
        match *self {
            Shape::Polygon(_) => pad(&[]),
            Shape::CircleSide { cx, cy, r, at, left } => pad(&[Piece::Side {
                r,
                yc: cy,
                d: if left { at - cx } else { cx - at },
            }]),
            Shape::Circle { cy, r, .. } => pad(&[Piece::Circle {
                r,
                yc: cy,
                lo: cy - r,
                hi: cy + r,
            }]),
            Shape::Stadium { cy, w, h, .. } => {
                if h >= w {
                    let (r, s) = (w / 2.0, (h - w) / 2.0);
                    pad(&[
                        Piece::Rect {
                            b: w,
                            y0: cy - s,
                            y1: cy + s,
                        },
                        Piece::Circle {
                            r,
                            yc: cy + s,
                            lo: cy + s,
                            hi: cy + s + r,
                        },
                        Piece::Circle {
                            r,
                            yc: cy - s,
                            lo: cy - s - r,
                            hi: cy - s,
                        },
                    ])
                } else {
                    let r = h / 2.0;
                    pad(&[
                        Piece::Rect {
                            b: w - h,
                            y0: cy - r,
                            y1: cy + r,
                        },
                        Piece::Circle {
                            r,
                            yc: cy,
                            lo: cy - r,
                            hi: cy + r,
                        },
                    ])
                }
            }
            Shape::RoundedRect { cy, w, h, r, .. } => {
                let s = h / 2.0 - r;
                pad(&[
                    Piece::Rect {
                        b: w,
                        y0: cy - s,
                        y1: cy + s,
                    },
                    Piece::Rect {
                        b: w - 2.0 * r,
                        y0: cy + s,
                        y1: cy + h / 2.0,
                    },
                    Piece::Rect {
                        b: w - 2.0 * r,
                        y0: cy - h / 2.0,
                        y1: cy - s,
                    },
                    Piece::Circle {
                        r,
                        yc: cy + s,
                        lo: cy + s,
                        hi: cy + s + r,
                    },
                    Piece::Circle {
                        r,
                        yc: cy - s,
                        lo: cy - s - r,
                        hi: cy - s,
                    },
                ])
            }
        }
    }

    /// Area integrals of the part of the shape between heights `lo` and `hi`.
    pub fn moments_between(&self, lo: f64, hi: f64) -> Moments {
        match self {
            Shape::Polygon(p) => p.moments_between(lo, hi),
            _ => {
                let (p, n) = self.pieces();
                p[..n].iter().fold(Moments::default(), |m, p| m.plus(p.between(lo, hi)))
            }
        }
    }

    /// Area integrals about the soffit line.
    pub fn moments(&self) -> Moments {
        match self {
            Shape::Polygon(p) => p.moments(),
            _ => self.moments_between(f64::NEG_INFINITY, f64::INFINITY),
        }
    }

    /// Perimeter, in.
    pub fn perimeter(&self) -> f64 {
        match *self {
            Shape::Polygon(ref p) => p.perimeter(),
            Shape::Circle { r, .. } => 2.0 * PI * r,
            Shape::Stadium { w, h, .. } => 2.0 * (h - w).abs() + PI * w.min(h),
            Shape::RoundedRect { w, h, r, .. } => 2.0 * (w - 2.0 * r) + 2.0 * (h - 2.0 * r) + 2.0 * PI * r,
            Shape::CircleSide { .. } => Polygon {
                points: self.boundary_points(256),
            }
            .perimeter(),
        }
    }

    /// Width of the shape cut by the horizontal line at `y`, in.
    pub fn chord(&self, y: f64) -> f64 {
        match self {
            Shape::Polygon(p) => p.chord(y),
            _ => {
                let (p, n) = self.pieces();
                p[..n].iter().map(|p| p.chord(y)).sum()
            }
        }
    }

    /// Signed distance from (x, y) to the boundary: negative inside.
    pub fn signed_distance(&self, x: f64, y: f64) -> f64 {
        match *self {
            Shape::Polygon(ref p) => {
                let d = p.distance_to_edge(x, y);
                if p.contains(x, y) { -d } else { d }
            }
            Shape::Circle { cx, cy, r } => (x - cx).hypot(y - cy) - r,
            Shape::Stadium { cx, cy, w, h } => {
                let (a, b, r) = if h >= w {
                    let s = (h - w) / 2.0;
                    ((cx, cy - s), (cx, cy + s), w / 2.0)
                } else {
                    let s = (w - h) / 2.0;
                    ((cx - s, cy), (cx + s, cy), h / 2.0)
                };
                dist_to_segment((x, y), a, b) - r
            }
            Shape::RoundedRect { cx, cy, w, h, r } => {
                // box signed distance of the inner rectangle, less r
                let qx = (x - cx).abs() - (w / 2.0 - r);
                let qy = (y - cy).abs() - (h / 2.0 - r);
                let outside = qx.max(0.0).hypot(qy.max(0.0));
                let inside = qx.max(qy).min(0.0);
                outside + inside - r
            }
            Shape::CircleSide { .. } => Shape::Polygon(Polygon {
                points: self.boundary_points(256),
            })
            .signed_distance(x, y),
        }
    }

    /// Lowest and highest y of the shape.
    pub fn y_range(&self) -> (f64, f64) {
        match *self {
            Shape::Polygon(ref p) => p.y_range(),
            Shape::Circle { cy, r, .. } | Shape::CircleSide { cy, r, .. } => (cy - r, cy + r),
            Shape::Stadium { cy, h, .. } | Shape::RoundedRect { cy, h, .. } => (cy - h / 2.0, cy + h / 2.0),
        }
    }

    /// Leftmost and rightmost x of the shape.
    pub fn x_range(&self) -> (f64, f64) {
        match *self {
            Shape::Polygon(ref p) => p.x_range(),
            Shape::Circle { cx, r, .. } => (cx - r, cx + r),
            Shape::CircleSide { cx, r, at, left, .. } => {
                if left {
                    (cx - r, at.min(cx + r))
                } else {
                    (at.max(cx - r), cx + r)
                }
            }
            Shape::Stadium { cx, w, .. } | Shape::RoundedRect { cx, w, .. } => (cx - w / 2.0, cx + w / 2.0),
        }
    }

    /// Points on the boundary (for clearance checks), `n` of them.
    pub fn boundary_points(&self, n: usize) -> Vec<(f64, f64)> {
        match *self {
            Shape::Polygon(ref p) => {
                let per = (n / p.points.len().max(1)).max(2);
                p.edges()
                    .flat_map(|(a, b)| {
                        (0..per).map(move |k| {
                            let t = k as f64 / per as f64;
                            (a.0 + t * (b.0 - a.0), a.1 + t * (b.1 - a.1))
                        })
                    })
                    .collect()
            }
            Shape::Circle { cx, cy, r } => (0..n)
                .map(|k| {
                    let t = 2.0 * PI * k as f64 / n as f64;
                    (cx + r * t.cos(), cy + r * t.sin())
                })
                .collect(),
            Shape::Stadium { cx, cy, w, h } => rounded_rect_points(cx, cy, w / 2.0, h / 2.0, w.min(h) / 2.0, n),
            Shape::RoundedRect { cx, cy, w, h, r } => rounded_rect_points(cx, cy, w / 2.0, h / 2.0, r, n),
            Shape::CircleSide { cx, cy, r, at, left } => {
                let inf = f64::INFINITY;
                let side = if left { (-inf, at) } else { (at, inf) };
                clip_box(&Shape::Circle { cx, cy, r }.boundary_points(n), side, (-inf, inf))
            }
        }
    }

    /// Whether `o` has the same horizontal cuts as this shape at every
    /// height (the same shape moved sideways), so chords can be shared.
    fn same_rows(&self, o: &Shape) -> bool {
        match (self, o) {
            (Shape::Circle { cy, r, .. }, Shape::Circle { cy: c2, r: r2, .. }) => cy == c2 && r == r2,
            (Shape::Stadium { cy, w, h, .. }, Shape::Stadium { cy: c2, w: w2, h: h2, .. }) => cy == c2 && w == w2 && h == h2,
            (
                Shape::RoundedRect { cy, w, h, r, .. },
                Shape::RoundedRect {
                    cy: c2,
                    w: w2,
                    h: h2,
                    r: r2,
                    ..
                },
            ) => cy == c2 && w == w2 && h == h2 && r == r2,
            _ => false,
        }
    }
}

/// Sum of the chords of `shapes` at height `y`; a shape with the same rows
/// as the one before it (a row of equal cores) reuses its chord.
pub fn chords_at(shapes: &[Shape], y: f64) -> f64 {
    let mut sum = 0.0;
    let mut last: Option<(&Shape, f64)> = None;
    for s in shapes {
        let c = match last {
            Some((p, c)) if p.same_rows(s) => c,
            _ => s.chord(y),
        };
        sum += c;
        last = Some((s, c));
    }
    sum
}

/// `n` points evenly spaced by arc length around a rectangle of half-sizes
/// `hw` × `hh` centred at (cx, cy) with corners rounded to `r`, starting on
/// the right side and running counter-clockwise.
fn rounded_rect_points(cx: f64, cy: f64, hw: f64, hh: f64, r: f64, n: usize) -> Vec<(f64, f64)> {
    let r = r.clamp(0.0, hw.min(hh));
    let (sx, sy) = (hw - r, hh - r);
    let quarter = PI / 2.0 * r;
    // the four sides and four corners in order: (length, point at distance s)
    let sides = [2.0 * sy, 2.0 * sx, 2.0 * sy, 2.0 * sx];
    let corners = [(sx, sy), (-sx, sy), (-sx, -sy), (sx, -sy)];
    let starts = [(hw, -sy), (sx, hh), (-hw, sy), (-sx, -hh)];
    let dirs = [(0.0, 1.0), (-1.0, 0.0), (0.0, -1.0), (1.0, 0.0)];
    let total = 2.0 * (sides[0] + sides[1]) + 4.0 * quarter;
    (0..n)
        .map(|k| {
            let mut s = total * k as f64 / n as f64;
            for i in 0..4 {
                if s <= sides[i] {
                    return (cx + starts[i].0 + s * dirs[i].0, cy + starts[i].1 + s * dirs[i].1);
                }
                s -= sides[i];
                if s <= quarter || i == 3 {
                    let a = i as f64 * PI / 2.0 + if r > 0.0 { s / r } else { 0.0 };
                    let (sin, cos) = a.sin_cos();
                    return (cx + corners[i].0 + r * cos, cy + corners[i].1 + r * sin);
                }
                s -= quarter;
            }
            unreachable!("the last corner takes the rest")
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn rect_poly(b: f64, h: f64) -> Polygon {
        Polygon {
            points: vec![(0.0, 0.0), (b, 0.0), (b, h), (0.0, h)],
        }
    }

    #[test]
    fn a_circle_cut_by_a_line_integrates_exactly() {
        // the part of a circle beyond a chord at distance d from the centre
        // is the circular segment r² acos(d/r) − d √(r² − d²) (any
        // geometry text); the two sides make the whole circle
        let (cx, cy, r) = (10.0, 4.0, 2.75);
        let full = Shape::Circle { cx, cy, r }.moments();
        for d in [-2.5, -1.0, 0.0, 0.7, 2.0] {
            let at = cx + d;
            let left = Shape::CircleSide { cx, cy, r, at, left: true }.moments();
            let right = Shape::CircleSide {
                cx,
                cy,
                r,
                at,
                left: false,
            }
            .moments();
            let seg = |d: f64| r * r * (d / r).acos() - d * (r * r - d * d).sqrt();
            assert!((right.area - seg(d)).abs() < 1e-9, "{d}: {} vs {}", right.area, seg(d));
            assert!((left.area - seg(-d)).abs() < 1e-9);
            let sum = left.plus(right);
            assert!((sum.area - full.area).abs() < 1e-9);
            assert!((sum.qx - full.qx).abs() < 1e-9);
            assert!((sum.ixx - full.ixx).abs() < 1e-8);
            // between two heights, against a fine polygon trace of the side
            let poly = Polygon {
                points: Shape::CircleSide { cx, cy, r, at, left: true }.boundary_points(20_000),
            };
            for (lo, hi) in [(2.0, 3.0), (3.5, 6.0), (0.0, 9.0)] {
                let a = Shape::CircleSide { cx, cy, r, at, left: true }.moments_between(lo, hi);
                let b = poly.moments_between(lo, hi);
                assert!((a.area - b.area).abs() < 1e-4, "{d} {lo}-{hi}: {} vs {}", a.area, b.area);
                assert!((a.ixx - b.ixx).abs() < 1e-2);
            }
        }
    }

    #[test]
    fn rectangle_closed_form() {
        // b h, b h²/2, b h³/3 about the base (any mechanics text).
        let m = rect_poly(12.0, 8.0).moments();
        assert_relative_eq!(m.area, 96.0);
        assert_relative_eq!(m.qx, 12.0 * 64.0 / 2.0);
        assert_relative_eq!(m.ixx, 12.0 * 512.0 / 3.0);
        // clockwise order gives the same result
        let cw = Polygon {
            points: rect_poly(12.0, 8.0).points.into_iter().rev().collect(),
        };
        assert_eq!(cw.moments(), m);
        assert_relative_eq!(rect_poly(12.0, 8.0).chord(3.0), 12.0);
    }

    #[test]
    fn circle_closed_form() {
        // A = πr², I_c = πr⁴/4.
        let c = Shape::Circle { cx: 0.0, cy: 5.0, r: 2.0 };
        let m = c.moments();
        assert_relative_eq!(m.area, PI * 4.0);
        assert_relative_eq!(m.ixx - m.area * 25.0, PI * 16.0 / 4.0, max_relative = 1e-12);
        assert_relative_eq!(c.chord(5.0), 4.0);
        assert_relative_eq!(c.perimeter(), 4.0 * PI);
        assert_relative_eq!(c.signed_distance(0.0, 5.0), -2.0);
    }

    #[test]
    fn stadium_equals_rect_plus_circle() {
        // vertical stadium 4 × 10: rectangle 4 × 6 plus a circle of radius 2
        let s = Shape::Stadium {
            cx: 0.0,
            cy: 6.0,
            w: 4.0,
            h: 10.0,
        };
        let m = s.moments();
        assert_relative_eq!(m.area, 24.0 + PI * 4.0, max_relative = 1e-12);
        assert_relative_eq!(m.qx, m.area * 6.0, max_relative = 1e-12);
        // I about the centre: rect 4·6³/12 + two semicircles at ±3
        let semi_c = PI * 16.0 / 8.0 - (PI * 2.0) * (8.0 / (3.0 * PI)).powi(2);
        let semi = 2.0 * (semi_c + PI * 2.0 * (3.0 + 8.0 / (3.0 * PI)).powi(2));
        assert_relative_eq!(m.ixx - m.area * 36.0, 4.0 * 216.0 / 12.0 + semi, max_relative = 1e-12);
        // horizontal stadium: same area as the rotated one
        let hz = Shape::Stadium {
            cx: 0.0,
            cy: 6.0,
            w: 10.0,
            h: 4.0,
        };
        assert_relative_eq!(hz.moments().area, m.area, max_relative = 1e-12);
        assert_relative_eq!(s.perimeter(), 12.0 + 4.0 * PI, max_relative = 1e-12);
        assert_relative_eq!(s.chord(6.0), 4.0);
        assert_relative_eq!(s.chord(10.0), 2.0 * (4.0f64 - 1.0).sqrt(), max_relative = 1e-12);
    }

    #[test]
    fn rounded_rect_limits() {
        // r = 0 is a rectangle; r = w/2 = h/2 is a circle
        let rr = Shape::RoundedRect {
            cx: 0.0,
            cy: 3.0,
            w: 4.0,
            h: 6.0,
            r: 0.0,
        };
        let m = rr.moments();
        assert_relative_eq!(m.area, 24.0);
        assert_relative_eq!(m.ixx - 24.0 * 9.0, 4.0 * 216.0 / 12.0, max_relative = 1e-12);
        let c = Shape::RoundedRect {
            cx: 0.0,
            cy: 3.0,
            w: 4.0,
            h: 4.0,
            r: 2.0,
        };
        let mc = Shape::Circle { cx: 0.0, cy: 3.0, r: 2.0 }.moments();
        assert_relative_eq!(c.moments().area, mc.area, max_relative = 1e-12);
        assert_relative_eq!(c.moments().ixx, mc.ixx, max_relative = 1e-12);
        // area w h − (4 − π) r²
        let g = Shape::RoundedRect {
            cx: 0.0,
            cy: 8.0,
            w: 7.25,
            h: 12.25,
            r: 2.5,
        };
        assert_relative_eq!(g.moments().area, 7.25 * 12.25 - (4.0 - PI) * 6.25, max_relative = 1e-12);
        assert_relative_eq!(g.signed_distance(0.0, 8.0), -7.25 / 2.0, max_relative = 1e-12);
    }

    #[test]
    fn boundary_points_lie_on_boundary() {
        let s = Shape::Stadium {
            cx: 1.0,
            cy: 6.0,
            w: 4.0,
            h: 10.0,
        };
        for (x, y) in s.boundary_points(64) {
            assert!(s.signed_distance(x, y).abs() < 1e-9);
        }
        // a flat stadium and a rounded rectangle, points evenly spaced: the
        // straight-line gaps between neighbours are equal on the straight parts
        // and no longer than the arc step anywhere
        for s in [
            Shape::Stadium {
                cx: 0.0,
                cy: 3.0,
                w: 9.0,
                h: 4.0,
            },
            Shape::RoundedRect {
                cx: 2.0,
                cy: 5.0,
                w: 6.0,
                h: 8.0,
                r: 1.5,
            },
            Shape::RoundedRect {
                cx: 2.0,
                cy: 5.0,
                w: 6.0,
                h: 8.0,
                r: 0.0,
            },
        ] {
            let pts = s.boundary_points(96);
            assert_eq!(pts.len(), 96);
            let step = s.perimeter() / 96.0;
            for (i, &(x, y)) in pts.iter().enumerate() {
                assert!(s.signed_distance(x, y).abs() < 1e-9, "{s:?} point {i}");
                let (u, v) = pts[(i + 1) % 96];
                let gap = (u - x).hypot(v - y);
                assert!(gap <= step + 1e-9 && gap > 0.6 * step, "{s:?} gap {gap} step {step}");
            }
        }
    }

    #[test]
    fn equal_cores_share_their_chords() {
        let core = |cx| Shape::Stadium {
            cx,
            cy: 4.0,
            w: 5.0,
            h: 6.0,
        };
        let row = [core(3.0), core(9.0), core(15.0), Shape::Circle { cx: 20.0, cy: 4.0, r: 2.0 }];
        for y in [1.0, 1.5, 3.3, 4.0, 6.2, 6.9, 7.5] {
            let each: f64 = row.iter().map(|s| s.chord(y)).sum();
            assert_relative_eq!(chords_at(&row, y), each, max_relative = 1e-15);
        }
    }

    #[test]
    fn bands_add_up_to_the_whole() {
        // Integrating the part above and below any cut gives the whole shape,
        // and a half circle has its centroid 4r/(3π) from the diameter.
        let shapes = [
            Shape::Circle { cx: 0.0, cy: 4.0, r: 2.75 },
            Shape::Stadium {
                cx: 0.0,
                cy: 5.0,
                w: 5.75,
                h: 7.0,
            },
            Shape::Stadium {
                cx: 0.0,
                cy: 4.0,
                w: 9.0,
                h: 4.0,
            },
            Shape::RoundedRect {
                cx: 0.0,
                cy: 8.0,
                w: 7.25,
                h: 12.25,
                r: 2.5,
            },
            Shape::Polygon(rect_poly(12.0, 8.0)),
        ];
        for s in &shapes {
            let whole = s.moments();
            for cut in [0.5, 2.0, 3.3, 4.0, 6.1, 9.0, 13.0] {
                let m = s
                    .moments_between(f64::NEG_INFINITY, cut)
                    .plus(s.moments_between(cut, f64::INFINITY));
                assert_relative_eq!(m.area, whole.area, max_relative = 1e-12);
                assert_relative_eq!(m.qx, whole.qx, max_relative = 1e-12);
                assert_relative_eq!(m.ixx, whole.ixx, max_relative = 1e-12);
            }
        }
        let half = Shape::Circle { cx: 0.0, cy: 0.0, r: 3.0 }.moments_between(0.0, 10.0);
        assert_relative_eq!(half.area, PI * 9.0 / 2.0, max_relative = 1e-12);
        assert_relative_eq!(half.qx / half.area, 4.0 * 3.0 / (3.0 * PI), max_relative = 1e-12);
        let band = Shape::Polygon(rect_poly(12.0, 8.0)).moments_between(6.0, 100.0);
        assert_relative_eq!(band.area, 24.0);
        assert_relative_eq!(band.qx, 24.0 * 7.0);
    }

    #[test]
    fn self_intersection_found() {
        let bow = Polygon {
            points: vec![(0.0, 0.0), (4.0, 4.0), (4.0, 0.0), (0.0, 4.0)],
        };
        assert!(bow.self_intersects());
        assert!(!rect_poly(3.0, 2.0).self_intersects());
        // touching itself: a vertex on another edge, and a fold back
        let touch = Polygon {
            points: vec![(0.0, 0.0), (4.0, 0.0), (4.0, 4.0), (2.0, 0.0), (0.0, 4.0)],
        };
        assert!(touch.self_intersects());
        let fold = Polygon {
            points: vec![(0.0, 0.0), (4.0, 0.0), (2.0, 0.0), (2.0, 3.0)],
        };
        assert!(fold.self_intersects());
    }
}

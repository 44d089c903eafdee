//! The three section families as the catalog describes them, and how each
//! becomes a [`Geometry`]. Dimensions in inches.

use super::{AreaReduction, Geometry, Polygon, Shape};

/// The least concrete allowed between a core and a surface or another core,
/// in: below this a unit cannot be made or handled (common practice, no
/// source; producers' thinnest webs and flanges are about an inch).
pub const MIN_SHELL_IN: f64 = 0.75;

/// Shape of the cores of a hollow-core unit.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum CoreShape {
    /// Circular cores of diameter `width`.
    Circle,
    /// Stadium (oval) cores `width` × `height`.
    Stadium,
    /// Rounded rectangles `width` × `height` with a corner radius.
    RoundedRect {
        /// Corner radius, in.
        radius: f64,
    },
}

/// One row of identical, evenly spaced cores, centred across the width.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Cores {
    /// Core shape.
    pub shape: CoreShape,
    /// Number of cores.
    pub count: u32,
    /// Core width (diameter for circles), in.
    pub width: f64,
    /// Core height (= width for circles), in.
    pub height: f64,
    /// Centre-to-centre spacing, in.
    pub spacing: f64,
    /// Height of the core centres above the soffit, in.
    pub center_height: f64,
}

/// Edge keyway of a hollow-core unit.
#[derive(Debug, Clone, PartialEq)]
pub enum Keyway {
    /// The side face, as (inset from the nominal face, height) points from
    /// the soffit to the top; mirrored on both edges.
    Profile(Vec<(f64, f64)>),
    /// Area taken off at both edges together, with its centroid height.
    Area {
        /// Total area removed, in².
        area: f64,
        /// Centroid height, in.
        centroid: f64,
    },
}

/// A hollow-core unit.
#[derive(Debug, Clone, PartialEq)]
pub struct HollowCore {
    /// Nominal width, in.
    pub width: f64,
    /// Depth, in.
    pub depth: f64,
    /// The cores.
    pub cores: Cores,
    /// Optional edge keyway.
    pub keyway: Option<Keyway>,
}

/// A double tee (or a multi-stem tee).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct DoubleTee {
    /// Flange width, in.
    pub flange_width: f64,
    /// Flange thickness, in.
    pub flange_thickness: f64,
    /// Total depth, in.
    pub depth: f64,
    /// Number of stems.
    pub stems: u32,
    /// Stem centre-to-centre spacing, in.
    pub stem_spacing: f64,
    /// Stem width at the underside of the flange, in.
    pub stem_width_top: f64,
    /// Stem width at the soffit, in.
    pub stem_width_bottom: f64,
    /// 45° chamfer leg at the bottom corners of each stem, in (0 for none).
    pub chamfer: f64,
}

/// A void of a generic section.
#[derive(Debug, Clone, PartialEq)]
pub enum VoidSpec {
    /// A polygonal void.
    Polygon(Vec<(f64, f64)>),
    /// A circular void.
    Circle {
        /// Centre x, in.
        x: f64,
        /// Centre y, in.
        y: f64,
        /// Diameter, in.
        diameter: f64,
    },
}

/// Any section given as a polygon outline with voids.
#[derive(Debug, Clone, PartialEq)]
pub struct Generic {
    /// Outline vertices, in.
    pub outline: Vec<(f64, f64)>,
    /// Voids.
    pub voids: Vec<VoidSpec>,
}

impl Cores {
    /// The core shapes placed across a unit of width `b`.
    pub fn shapes(&self, b: f64) -> Vec<Shape> {
        let n = self.count as f64;
        let x0 = b / 2.0 - (n - 1.0) / 2.0 * self.spacing;
        (0..self.count)
            .map(|i| {
                let cx = x0 + i as f64 * self.spacing;
                let cy = self.center_height;
                match self.shape {
                    CoreShape::Circle => Shape::Circle {
                        cx,
                        cy,
                        r: self.width / 2.0,
                    },
                    CoreShape::Stadium => Shape::Stadium {
                        cx,
                        cy,
                        w: self.width,
                        h: self.height,
                    },
                    CoreShape::RoundedRect { radius } => Shape::RoundedRect {
                        cx,
                        cy,
                        w: self.width,
                        h: self.height,
                        r: radius,
                    },
                }
            })
            .collect()
    }

    /// Centre-line x of each web (between cores, and the two edge webs).
    pub fn web_centres(&self, b: f64) -> Vec<f64> {
        let n = self.count as f64;
        let x0 = b / 2.0 - (n - 1.0) / 2.0 * self.spacing;
        let first_edge = x0 - self.width / 2.0;
        let mut w = vec![first_edge / 2.0];
        for i in 1..self.count {
            w.push(x0 + (i as f64 - 0.5) * self.spacing);
        }
        w.push(b - first_edge / 2.0);
        w
    }
}

impl HollowCore {
    /// The outline polygon: a rectangle, with the keyway profile on both sides.
    fn outline(&self) -> Polygon {
        let (b, h) = (self.width, self.depth);
        match &self.keyway {
            Some(Keyway::Profile(pts)) => {
                // left face from top to bottom, then the right face bottom to top
                let mut p: Vec<(f64, f64)> = pts.iter().rev().map(|&(i, y)| (i, y)).collect();
                p.extend(pts.iter().map(|&(i, y)| (b - i, y)));
                dedupe(p)
            }
            _ => Polygon {
                points: vec![(0.0, 0.0), (b, 0.0), (b, h), (0.0, h)],
            },
        }
    }

    /// Geometry of the unit.
    pub fn geometry(&self) -> Geometry {
        let voids = self.cores.shapes(self.width);
        let top = self.cores.center_height + self.cores.height / 2.0;
        let bottom = self.cores.center_height - self.cores.height / 2.0;
        Geometry {
            outline: self.outline(),
            voids,
            reduction: match self.keyway {
                Some(Keyway::Area { area, centroid }) => Some(AreaReduction { area, centroid }),
                _ => None,
            },
            width: self.width,
            depth: self.depth,
            top_flange: self.depth - top,
            bottom_flange: bottom,
            stems: vec![],
            chamfer: 0.0,
        }
    }

    /// Problems with the shell around the cores, as sentences (empty when sound).
    pub fn shell_problems(&self) -> Vec<String> {
        let mut out = Vec::new();
        let c = &self.cores;
        let g = self.geometry();
        if g.bottom_flange < MIN_SHELL_IN {
            out.push(format!(
                "the cores cut through the bottom flange: {:.2} in of concrete left below them, at least {MIN_SHELL_IN} in needed",
                g.bottom_flange
            ));
        }
        if g.top_flange < MIN_SHELL_IN {
            out.push(format!(
                "the cores cut through the top flange: {:.2} in of concrete left above them, at least {MIN_SHELL_IN} in needed",
                g.top_flange
            ));
        }
        if c.count > 1 && c.spacing - c.width < MIN_SHELL_IN {
            let gap = c.spacing - c.width;
            let what = if gap <= 0.0 { "overlap each other" } else { "leave too thin a web" };
            out.push(format!(
                "cores {what}: spacing {} in less core width {} in leaves {gap:.2} in of web, at least {MIN_SHELL_IN} in needed",
                fmt(c.spacing),
                fmt(c.width)
            ));
        }
        // a keyway given as an area comes off the two edge webs: it may not
        // take more than they hold beyond the least web
        if let Some(Keyway::Area { area, .. }) = self.keyway {
            let net = g.outline.moments().area - g.voids.iter().map(|v| v.moments().area).sum::<f64>();
            let edge = self.width / 2.0 - (c.count as f64 - 1.0) / 2.0 * c.spacing - c.width / 2.0;
            let spare = 2.0 * (edge - MIN_SHELL_IN).max(0.0) * self.depth;
            if area >= net {
                out.push(format!(
                    "the keyway area {} in² is as large as the section itself ({net:.1} in² of concrete)",
                    fmt(area)
                ));
            } else if area > spare {
                out.push(format!(
                    "the keyway area {} in² leaves no edge web: the two edge webs, {edge:.2} in wide, hold {spare:.1} in² beyond the least web of {MIN_SHELL_IN} in",
                    fmt(area)
                ));
            }
        }
        // edge webs, measured to the real side face (keyway included)
        for (i, s) in g.voids.iter().enumerate() {
            if i != 0 && i + 1 != g.voids.len() {
                continue;
            }
            let pts = s.boundary_points(96);
            let inside = pts.iter().all(|&(x, y)| g.outline.contains(x, y));
            let clear = pts
                .iter()
                .map(|&(x, y)| g.outline.distance_to_edge(x, y))
                .fold(f64::INFINITY, f64::min);
            if !inside || clear < MIN_SHELL_IN - 1e-9 {
                let left = if inside { clear } else { 0.0 };
                out.push(format!(
                    "core {} is too close to the side face: {left:.2} in of edge web left, at least {MIN_SHELL_IN} in needed",
                    i + 1
                ));
            }
        }
        out
    }
}

impl DoubleTee {
    /// Centre-line x of each stem.
    pub fn stem_centres(&self) -> Vec<f64> {
        let n = self.stems as f64;
        (0..self.stems)
            .map(|i| self.flange_width / 2.0 + (i as f64 - (n - 1.0) / 2.0) * self.stem_spacing)
            .collect()
    }

    /// Geometry: one outline polygon traced around flange and stems.
    pub fn geometry(&self) -> Geometry {
        let (b, h, tf) = (self.flange_width, self.depth, self.flange_thickness);
        let ys = h - tf;
        let c = self.chamfer;
        let mut p = vec![(0.0, h), (0.0, ys)];
        for xc in self.stem_centres() {
            let (wt, wb) = (self.stem_width_top / 2.0, self.stem_width_bottom / 2.0);
            p.push((xc - wt, ys));
            if c > 0.0 {
                // the chamfer starts c up the sloped face
                let slope = (wt - wb) / ys;
                p.push((xc - wb - slope * c, c));
                p.push((xc - wb + c, 0.0));
                p.push((xc + wb - c, 0.0));
                p.push((xc + wb + slope * c, c));
            } else {
                p.push((xc - wb, 0.0));
                p.push((xc + wb, 0.0));
            }
            p.push((xc + wt, ys));
        }
        p.push((b, ys));
        p.push((b, h));
        Geometry {
            outline: dedupe(p),
            voids: vec![],
            reduction: None,
            width: b,
            depth: h,
            top_flange: tf,
            bottom_flange: 0.0,
            stems: self.stem_centres(),
            chamfer: self.chamfer,
        }
    }

    /// Problems with the proportions, as sentences (empty when sound).
    pub fn shape_problems(&self) -> Vec<String> {
        let mut out = Vec::new();
        if self.flange_thickness >= self.depth {
            out.push(format!(
                "flange_thickness {} in is not less than depth {} in",
                fmt(self.flange_thickness),
                fmt(self.depth)
            ));
            return out;
        }
        let c = self.stem_centres();
        let half = self.stem_width_top.max(self.stem_width_bottom) / 2.0;
        if c.first().is_some_and(|&x| x - half < 0.0) || c.last().is_some_and(|&x| x + half > self.flange_width) {
            out.push(format!(
                "the stems do not fit under the flange: {} stems at {} in spacing, {} in wide, on a {} in flange",
                self.stems,
                fmt(self.stem_spacing),
                fmt(self.stem_width_top.max(self.stem_width_bottom)),
                fmt(self.flange_width)
            ));
        }
        if self.stems > 1 && self.stem_spacing < self.stem_width_top {
            out.push(format!(
                "the stems overlap: spacing {} in is less than the stem width {} in",
                fmt(self.stem_spacing),
                fmt(self.stem_width_top)
            ));
        }
        if 2.0 * self.chamfer >= self.stem_width_bottom {
            out.push(format!(
                "chamfer {} in is too large for a {} in stem bottom (at most half of it)",
                fmt(self.chamfer),
                fmt(self.stem_width_bottom)
            ));
        }
        out
    }
}

impl Generic {
    /// Geometry: outline less the voids.
    pub fn geometry(&self) -> Geometry {
        let outline = Polygon {
            points: self.outline.clone(),
        };
        let (x0, x1) = outline.x_range();
        let (_, y1) = outline.y_range();
        let voids: Vec<Shape> = self
            .voids
            .iter()
            .map(|v| match v {
                VoidSpec::Polygon(p) => Shape::Polygon(Polygon { points: p.clone() }),
                VoidSpec::Circle { x, y, diameter } => Shape::Circle {
                    cx: *x,
                    cy: *y,
                    r: diameter / 2.0,
                },
            })
            .collect();
        let top = voids.iter().map(|v| v.y_range().1).fold(f64::NEG_INFINITY, f64::max);
        let bottom = voids.iter().map(|v| v.y_range().0).fold(f64::INFINITY, f64::min);
        let (top_flange, bottom_flange) = if voids.is_empty() { (y1, y1) } else { (y1 - top, bottom) };
        Geometry {
            outline,
            voids,
            reduction: None,
            width: x1 - x0,
            depth: y1,
            top_flange,
            bottom_flange,
            stems: vec![],
            chamfer: 0.0,
        }
    }

    /// Problems with the shape, as sentences (empty when sound).
    pub fn shape_problems(&self) -> Vec<String> {
        let mut out = Vec::new();
        let g = self.geometry();
        if g.outline.self_intersects() {
            out.push("the outline crosses itself".to_string());
        }
        let (y0, _) = g.outline.y_range();
        if y0.abs() > 1e-9 {
            out.push(format!(
                "the outline's lowest point is at y = {} in; put the soffit at y = 0",
                fmt(y0)
            ));
        }
        for (i, v) in g.voids.iter().enumerate() {
            let pts = v.boundary_points(96);
            if !pts
                .iter()
                .all(|&(x, y)| g.outline.contains(x, y) && g.outline.distance_to_edge(x, y) > 1e-9)
            {
                out.push(format!("void {} is not wholly inside the outline", i + 1));
            }
            for (j, w) in g.voids.iter().enumerate().skip(i + 1) {
                if pts.iter().any(|&(x, y)| w.signed_distance(x, y) < 0.0)
                    || w.boundary_points(96).iter().any(|&(x, y)| v.signed_distance(x, y) < 0.0)
                {
                    out.push(format!("voids {} and {} overlap", i + 1, j + 1));
                }
            }
        }
        out
    }
}

fn dedupe(mut p: Vec<(f64, f64)>) -> Polygon {
    p.dedup_by(|a, b| (a.0 - b.0).abs() < 1e-12 && (a.1 - b.1).abs() < 1e-12);
    if p.len() > 1 && p.first() == p.last() {
        p.pop();
    }
    Polygon { points: p }
}

/// A number for a message, without trailing zeros.
pub fn fmt(v: f64) -> String {
    let s = format!("{v:.4}");
    let s = s.trim_end_matches('0').trim_end_matches('.');
    s.to_string()
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;
    use std::f64::consts::PI;

    fn hc() -> HollowCore {
        HollowCore {
            width: 48.0,
            depth: 8.0,
            cores: Cores {
                shape: CoreShape::Circle,
                count: 6,
                width: 5.5,
                height: 5.5,
                spacing: 7.5,
                center_height: 4.0,
            },
            keyway: None,
        }
    }

    #[test]
    fn hollow_core_by_hand() {
        // 48 × 8 less six 5.5 in circles centred at mid-depth: hand calculation.
        let p = hc().geometry().properties();
        let a = 384.0 - 6.0 * PI * 5.5 * 5.5 / 4.0;
        let i = 48.0 * 512.0 / 12.0 - 6.0 * PI * 5.5f64.powi(4) / 64.0;
        assert_relative_eq!(p.area_in2, a, max_relative = 1e-12);
        assert_relative_eq!(p.yb_in, 4.0, max_relative = 1e-12);
        assert_relative_eq!(p.ix_in4, i, max_relative = 1e-12);
        assert_relative_eq!(p.top_flange_in, 1.25);
        // least web width at core centre height: 48 − 6 × 5.5 = 15 in
        assert_relative_eq!(p.web_width_min_in, 15.0, max_relative = 1e-6);
        assert_relative_eq!(p.web_width_min_at_in, 4.0, epsilon = 1e-3);
        assert!(hc().shell_problems().is_empty());
        let webs = hc().cores.web_centres(48.0);
        assert_eq!(webs.len(), 7);
        assert_relative_eq!(webs[0], 1.25);
        assert_relative_eq!(webs[1], 9.0);
    }

    #[test]
    fn cores_that_break_the_shell_are_named() {
        let mut h = hc();
        h.cores.center_height = 3.0;
        let p = h.shell_problems();
        assert!(p[0].contains("bottom flange: 0.25 in"), "{p:?}");
        let mut h = hc();
        h.cores.spacing = 5.0;
        assert!(h.shell_problems().iter().any(|m| m.contains("overlap each other")));
    }

    #[test]
    fn double_tee_by_hand() {
        // Two 6 in prismatic stems 22 in tall under a 96 × 2 in flange.
        let t = DoubleTee {
            flange_width: 96.0,
            flange_thickness: 2.0,
            depth: 24.0,
            stems: 2,
            stem_spacing: 48.0,
            stem_width_top: 6.0,
            stem_width_bottom: 6.0,
            chamfer: 0.0,
        };
        let p = t.geometry().properties();
        let a = 192.0 + 2.0 * 6.0 * 22.0;
        let yb = (192.0 * 23.0 + 264.0 * 11.0) / a;
        assert_relative_eq!(p.area_in2, a, max_relative = 1e-12);
        assert_relative_eq!(p.yb_in, yb, max_relative = 1e-12);
        assert_relative_eq!(p.web_width_min_in, 12.0, max_relative = 1e-9);
        // a chamfer takes off 2 stems × 2 corners × c²/2
        let mut c = t;
        c.chamfer = 0.75;
        assert_relative_eq!(
            c.geometry().properties().area_in2,
            a - 4.0 * 0.75 * 0.75 / 2.0,
            max_relative = 1e-12
        );
        assert!(t.shape_problems().is_empty());
    }
}

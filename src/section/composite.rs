//! The composite section: a cast-in-place topping bonded to the top of the
//! precast member, transformed into precast concrete by the modular ratio
//! n = Ec,topping / Ec,precast (elastic mechanics; PCI Design Handbook
//! method for topped members).

use serde::Serialize;

use super::Properties;

/// Properties of the precast member with its composite topping, in units of
/// precast concrete. Heights are measured from the precast soffit.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Composite {
    /// Topping thickness, in.
    pub topping_in: f64,
    /// Width of topping acting with the member (the member width), in.
    pub topping_width_in: f64,
    /// Modular ratio Ec,topping / Ec,precast.
    pub n: f64,
    /// Transformed area, in².
    pub area_in2: f64,
    /// Centroid height above the precast soffit, in.
    pub yb_in: f64,
    /// Transformed second moment of area about its centroid, in⁴.
    pub ix_in4: f64,
    /// Section modulus to the precast bottom fibre, in³.
    pub sb_in3: f64,
    /// Section modulus to the precast top fibre, in³ (precast stress).
    pub st_precast_in3: f64,
    /// Section modulus to the topping top fibre, in³, giving topping stress
    /// when M is divided by it (n included).
    pub st_topping_in3: f64,
    /// Total depth with topping, in.
    pub depth_in: f64,
}

impl Composite {
    /// Transform the bare section `p` with a topping `t` thick over width `b`
    /// at modular ratio `n`.
    pub fn new(p: &Properties, t: f64, b: f64, n: f64) -> Composite {
        let at = n * b * t;
        let yt_c = p.depth_in + t / 2.0;
        let area = p.area_in2 + at;
        let yb = (p.area_in2 * p.yb_in + at * yt_c) / area;
        let ix = p.ix_in4 + p.area_in2 * (yb - p.yb_in).powi(2) + n * b * t.powi(3) / 12.0 + at * (yt_c - yb).powi(2);
        let depth = p.depth_in + t;
        Composite {
            topping_in: t,
            topping_width_in: b,
            n,
            area_in2: area,
            yb_in: yb,
            ix_in4: ix,
            sb_in3: ix / yb,
            st_precast_in3: ix / (p.depth_in - yb),
            st_topping_in3: ix / (n * (depth - yb)),
            depth_in: depth,
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::section::{Geometry, Polygon};
    use approx::assert_relative_eq;

    #[test]
    fn topping_of_same_concrete_is_a_deeper_strip() {
        // 48 × 8 strip with a 2 in topping at n = 1 equals a 48 × 10 strip.
        let g = Geometry {
            outline: Polygon {
                points: vec![(0.0, 0.0), (48.0, 0.0), (48.0, 8.0), (0.0, 8.0)],
            },
            voids: vec![],
            reduction: None,
            width: 48.0,
            depth: 8.0,
            top_flange: 8.0,
            bottom_flange: 8.0,
            stems: vec![],
            chamfer: 0.0,
        };
        let c = Composite::new(&g.properties(), 2.0, 48.0, 1.0);
        assert_relative_eq!(c.area_in2, 480.0);
        assert_relative_eq!(c.yb_in, 5.0, max_relative = 1e-12);
        assert_relative_eq!(c.ix_in4, 48.0 * 1000.0 / 12.0, max_relative = 1e-12);
        assert_relative_eq!(c.st_topping_in3, 4000.0 / 5.0, max_relative = 1e-12);
        assert_relative_eq!(c.st_precast_in3, 4000.0 / 3.0, max_relative = 1e-12);
    }

    #[test]
    fn softer_topping_by_hand() {
        // n = 0.8: topping 48 × 2 transforms to 38.4 × 2 (hand calculation).
        let p = Properties {
            area_in2: 384.0,
            yb_in: 4.0,
            yt_in: 4.0,
            ix_in4: 2048.0,
            sb_in3: 512.0,
            st_in3: 512.0,
            depth_in: 8.0,
            width_in: 48.0,
            perimeter_in: 112.0,
            void_perimeter_in: 0.0,
            vs_ratio_in: 384.0 / 112.0,
            net_thickness_in: 8.0,
            top_flange_in: 8.0,
            bottom_flange_in: 8.0,
            web_width_min_in: 48.0,
            web_width_min_at_in: 4.0,
            top_band: (48.0, 8.0),
        };
        let c = Composite::new(&p, 2.0, 48.0, 0.8);
        let at = 76.8;
        let yb: f64 = (384.0 * 4.0 + at * 9.0) / (384.0 + at);
        let i = 2048.0 + 384.0 * (yb - 4.0f64).powi(2) + 38.4 * 8.0 / 12.0 + at * (9.0 - yb).powi(2);
        assert_relative_eq!(c.yb_in, yb, max_relative = 1e-12);
        assert_relative_eq!(c.ix_in4, i, max_relative = 1e-12);
    }
}

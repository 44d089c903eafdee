//! Statics of a member on two supports, with an overhang at either end,
//! under point loads and uniform loads over part of its length — the
//! moment and shear diagrams every check reads.
//!
//! x runs along the member from the left support (the centre of the left
//! bearing); the right support is at x = ℓ; an overhang reaches to −a₁ on
//! the left and ℓ + a₂ on the right. Moments sag positive, shears are the
//! force just right of x (positive up on the left face). The formulas are
//! equilibrium of the free body left of x (any statics text); they are
//! checked against closed forms and, in `tests/reference`, against the
//! open beam-analysis library pycba.

use serde::Serialize;

/// A load on the member.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub enum Load {
    /// A force `p` (lbf, downward positive) at `a` (in).
    Point {
        /// Force, lbf.
        p: f64,
        /// Place, in from the left support.
        a: f64,
    },
    /// A uniform load `w` (lbf/in, downward positive) from `a` to `b` (in).
    Span {
        /// Intensity, lbf/in.
        w: f64,
        /// Start, in.
        a: f64,
        /// End, in.
        b: f64,
    },
}

impl Load {
    /// The total force and the place of its resultant.
    fn resultant(&self) -> (f64, f64) {
        match *self {
            Load::Point { p, a } => (p, a),
            Load::Span { w, a, b } => (w * (b - a), 0.5 * (a + b)),
        }
    }

    /// The force of the part of the load left of `x`, and the moment of
    /// that part about `x` (positive: it makes the left free body hog).
    fn left_of(&self, x: f64) -> (f64, f64) {
        match *self {
            Load::Point { p, a } => {
                if a < x {
                    (p, p * (x - a))
                } else {
                    (0.0, 0.0)
                }
            }
            Load::Span { w, a, b } => {
                let e = x.min(b);
                if e <= a {
                    return (0.0, 0.0);
                }
                let f = w * (e - a);
                (f, f * (x - 0.5 * (a + e)))
            }
        }
    }
}

/// A member on supports at 0 and ℓ.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Beam {
    /// Span between the supports, in.
    pub l: f64,
}

impl Beam {
    /// The support reactions (left, right), lbf, upward positive.
    pub fn reactions(&self, loads: &[Load]) -> (f64, f64) {
        let (mut total, mut moment) = (0.0, 0.0);
        for ld in loads {
            let (f, at) = ld.resultant();
            total += f;
            moment += f * at;
        }
        let right = moment / self.l;
        (total - right, right)
    }

    /// Moment (lbf·in, sagging positive) and shear (lbf) at `x` given the
    /// reactions. The shear is the one inside the span at a support (just
    /// right of the left one, just left of the right one) and just left of
    /// a point load placed exactly at `x`.
    pub fn at(&self, loads: &[Load], (rl, rr): (f64, f64), x: f64) -> (f64, f64) {
        let (mut m, mut v) = (0.0, 0.0);
        if x >= 0.0 {
            m += rl * x;
            v += rl;
        }
        if x > self.l {
            m += rr * (x - self.l);
            v += rr;
        }
        for ld in loads {
            let (f, mo) = ld.left_of(x);
            m -= mo;
            v -= f;
        }
        (m, v)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn simple_span_closed_forms() {
        let b = Beam { l: 240.0 };
        // uniform over the span: wL²/8 at midspan, wL/2 at the support
        let u = [Load::Span { w: 2.0, a: 0.0, b: 240.0 }];
        let r = b.reactions(&u);
        assert_relative_eq!(r.0, 240.0);
        assert_relative_eq!(b.at(&u, r, 120.0).0, 2.0 * 240.0 * 240.0 / 8.0);
        assert_relative_eq!(b.at(&u, r, 0.0).1, 240.0);
        assert_relative_eq!(b.at(&u, r, 240.0).1, -240.0);
        assert_relative_eq!(b.at(&u, r, -1e-9).1, 0.0);
        // a point load P at a: M = P a b / L under it
        let p = [Load::Point { p: 10.0, a: 60.0 }];
        let r = b.reactions(&p);
        assert_relative_eq!(b.at(&p, r, 60.0).0, 10.0 * 60.0 * 180.0 / 240.0);
        // a patch w over [a, b]: R_left = w c (L − x̄)/L; the peak moment at
        // x = a + R_left/w is R_left a + R_left²/(2w)
        let s = [Load::Span { w: 3.0, a: 40.0, b: 100.0 }];
        let r = b.reactions(&s);
        assert_relative_eq!(r.0, 3.0 * 60.0 * (240.0 - 70.0) / 240.0);
        let x0 = 40.0 + r.0 / 3.0;
        assert_relative_eq!(b.at(&s, r, x0).0, r.0 * 40.0 + r.0 * r.0 / 6.0, max_relative = 1e-12);
        assert_relative_eq!(b.at(&s, r, x0).1, 0.0, epsilon = 1e-9);
    }

    #[test]
    fn overhang_closed_forms() {
        // a cantilever c beyond the right support, uniform w over the whole
        // member: M at the support = −w c²/2; R_right = w (L + c)²/(2L)
        let (l, c, w) = (240.0, 48.0, 2.0);
        let b = Beam { l };
        let u = [Load::Span { w, a: 0.0, b: l + c }];
        let r = b.reactions(&u);
        assert_relative_eq!(r.1, w * (l + c) * (l + c) / (2.0 * l), max_relative = 1e-12);
        assert_relative_eq!(b.at(&u, r, l).0, -w * c * c / 2.0, max_relative = 1e-9);
        // a tip load P on the overhang: M at the support = −P c; the far
        // reaction pulls down by P c / L
        let p = [Load::Point { p: 5.0, a: l + c }];
        let r = b.reactions(&p);
        assert_relative_eq!(r.0, -5.0 * c / l, max_relative = 1e-12);
        assert_relative_eq!(b.at(&p, r, l).0, -5.0 * c, max_relative = 1e-12);
        assert_relative_eq!(b.at(&p, r, l + c - 1e-9).1, 5.0, max_relative = 1e-6);
        // a left overhang too: moments there hog from the tip in
        let q = [Load::Point { p: 4.0, a: -30.0 }];
        let r = b.reactions(&q);
        assert_relative_eq!(b.at(&q, r, -10.0).0, -4.0 * 20.0, max_relative = 1e-12);
        assert_relative_eq!(b.at(&q, r, 0.0).0, -4.0 * 30.0, max_relative = 1e-12);
        assert_relative_eq!(b.at(&q, r, l).0, 0.0, epsilon = 1e-9);
    }
}

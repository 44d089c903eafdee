//! Flexural strength by strain compatibility over the real section
//! (ACI 318-19 §22.2: plane sections, εcu = 0.003, the equivalent
//! rectangular stress block 0.85 f′c over a = β1·c of §22.2.2.4), and the
//! approximate strand stress of ACI 318-19 Eq. 20.3.2.3.1 for comparison.
//!
//! Depths are measured down from the top of the member (the topping top
//! when topped). Internal units: in, lbf, psi.

use crate::material::StrandKind;
use crate::section::Geometry;

/// The concrete of a flexural section.
#[derive(Debug, Clone, Copy)]
pub struct Concrete<'a> {
    /// Precast geometry.
    pub geometry: &'a Geometry,
    /// Precast f′c, psi.
    pub fc: f64,
    /// Composite topping: (thickness, width, f′c), if any.
    pub topping: Option<(f64, f64, f64)>,
    /// β1 of the concrete at the compression face.
    pub beta1: f64,
    /// Depth below the precast top over which the precast section is a
    /// plain rectangle of this width: (width, depth); (0, 0) when not. A
    /// shortcut for the common stress block inside the top flange.
    pub top_band: (f64, f64),
}

/// How a steel layer responds to strain.
#[derive(Debug, Clone, Copy)]
pub enum Steel<'a> {
    /// Prestressing strand with its effective prestrain plus decompression
    /// (ε1 + ε2), its stress capped (development, §25.4.8.3), psi.
    Strand {
        /// Strand kind.
        kind: &'a StrandKind,
        /// ε1 + ε2.
        prestrain: f64,
        /// Upper limit on stress, psi.
        cap: f64,
    },
    /// Deformed bar, elastic–perfectly plastic.
    Bar {
        /// fy, psi.
        fy: f64,
        /// Es, psi.
        es: f64,
    },
}

/// A layer of steel at one depth.
#[derive(Debug, Clone, Copy)]
pub struct SteelLayer<'a> {
    /// Area, in².
    pub area: f64,
    /// Depth below the top, in.
    pub depth: f64,
    /// Material.
    pub steel: Steel<'a>,
}

/// Result of a strain-compatibility analysis.
#[derive(Debug, Clone, PartialEq)]
pub struct Flexure {
    /// Neutral-axis depth c, in.
    pub c: f64,
    /// Stress-block depth a = β1 c, in.
    pub a: f64,
    /// Nominal strength Mn, lbf·in.
    pub mn: f64,
    /// Net tensile strain in the extreme tension layer.
    pub eps_t: f64,
    /// φ by ACI 318-19 Table 21.2.2 (εty = 0.002 for prestressed steel).
    pub phi: f64,
    /// Stress in each layer, psi.
    pub stresses: Vec<f64>,
    /// Whether equilibrium was found within the depth.
    pub converged: bool,
}

/// φ for flexure from εt, ACI 318-19 Table 21.2.2 (tied, "other"):
/// 0.65 at εt ≤ εty, 0.90 at εt ≥ εty + 0.003, linear between; εty = 0.002.
pub fn phi_flexure(eps_t: f64) -> f64 {
    (0.65 + 0.25 * (eps_t - 0.002) / 0.003).clamp(0.65, 0.90)
}

impl Concrete<'_> {
    /// Overall depth, in.
    pub fn depth(&self) -> f64 {
        self.geometry.depth + self.topping.map_or(0.0, |t| t.0)
    }

    /// Compression force (lbf) of a stress block `a` deep and the depth of its
    /// centroid below the top (in): 0.85 f′c of each concrete over its area.
    pub fn compression(&self, a: f64) -> (f64, f64) {
        let h = self.geometry.depth;
        let a = a.clamp(0.0, self.depth());
        let (mut force, mut moment) = (0.0, 0.0);
        let mut into_precast = a;
        if let Some((t, b, fc)) = self.topping {
            let at = a.min(t);
            let f = 0.85 * fc * b * at;
            force += f;
            moment += f * at / 2.0;
            into_precast = a - t;
        }
        if into_precast > 0.0 && into_precast <= self.top_band.1 {
            // inside a rectangular top flange: no clipping needed
            let f = 0.85 * self.fc * self.top_band.0 * into_precast;
            force += f;
            moment += f * (self.depth() - h + into_precast / 2.0);
        } else if into_precast > 0.0 {
            let m = self.geometry.moments_between(h - into_precast, h);
            if m.area > 0.0 {
                let f = 0.85 * self.fc * m.area;
                let y = m.qx / m.area;
                force += f;
                moment += f * (self.depth() - y);
            }
        }
        (force, if force > 0.0 { moment / force } else { 0.0 })
    }
}

fn steel_stress(layer: &SteelLayer, c: f64) -> f64 {
    let eps = 0.003 * (layer.depth - c) / c;
    match layer.steel {
        Steel::Strand { kind, prestrain, cap } => kind.stress(prestrain + eps).min(cap),
        Steel::Bar { fy, es } => (es * eps).clamp(-fy, fy),
    }
}

impl Concrete<'_> {
    /// The stress-block depth a whose compression force is `t` (lbf), in:
    /// closed form inside the topping and the rectangular top band, else the
    /// Illinois variant of regula falsi on the monotone force (the overall
    /// depth when `t` exceeds the whole section).
    pub fn block_depth(&self, t: f64) -> f64 {
        if t <= 0.0 {
            return 0.0;
        }
        let mut into = 0.0;
        let mut rest = t;
        if let Some((th, b, fc)) = self.topping {
            let full = 0.85 * fc * b * th;
            if rest <= full {
                return rest / (0.85 * fc * b);
            }
            rest -= full;
            into = th;
        }
        let (bb, db) = self.top_band;
        if bb > 0.0 && rest <= 0.85 * self.fc * bb * db {
            return into + rest / (0.85 * self.fc * bb);
        }
        let h = self.depth();
        let f = |a: f64| self.compression(a).0 - t;
        let (mut lo, mut hi) = (into + if bb > 0.0 { db } else { 0.0 }, h);
        let (mut flo, mut fhi) = (f(lo), f(hi));
        if fhi <= 0.0 {
            return h;
        }
        let mut side = 0i8;
        let mut a = hi;
        for _ in 0..100 {
            a = (lo * fhi - hi * flo) / (fhi - flo);
            let r = f(a);
            if r.abs() <= 1e-12 * t || (hi - lo) < 1e-12 * h {
                break;
            }
            if r < 0.0 {
                lo = a;
                flo = r;
                if side == 1 {
                    fhi /= 2.0;
                }
                side = 1;
            } else {
                hi = a;
                fhi = r;
                if side == -1 {
                    flo /= 2.0;
                }
                side = -1;
            }
        }
        a
    }
}

/// The total tension with every layer at its cap (strand) or yield (bar), lbf.
fn capped_tension(layers: &[SteelLayer]) -> f64 {
    layers.iter().map(|l| l.area * cap_of(l)).sum()
}

fn cap_of(l: &SteelLayer) -> f64 {
    match l.steel {
        Steel::Strand { cap, .. } => cap,
        Steel::Bar { fy, .. } => fy,
    }
}

/// The strain-compatibility answer when every strand is held at its cap
/// (strand not yet developed, §25.4.8.3) and every bar yields: the tension
/// is then known, the block follows from it directly, and the answer is
/// exact if the strains at that neutral axis do put each layer at or past
/// its cap. Otherwise Err with that neutral-axis depth, which bounds the
/// true one from above (less tension, a shallower block), when it lies
/// inside the section.
fn capped(conc: &Concrete, layers: &[SteelLayer]) -> Result<Flexure, Option<f64>> {
    let t = capped_tension(layers);
    if t <= 0.0 {
        return Err(None);
    }
    let c = conc.block_depth(t) / conc.beta1;
    if !(c > 0.0 && c < conc.depth()) {
        return Err(None);
    }
    let at_cap = layers.iter().all(|l| {
        let eps = 0.003 * (l.depth - c) / c;
        match l.steel {
            Steel::Strand { kind, prestrain, cap } => kind.stress(prestrain + eps) >= cap,
            Steel::Bar { fy, es } => es * eps >= fy,
        }
    });
    if at_cap {
        Ok(finish(conc, layers, c, true, layers.iter().map(cap_of).collect()))
    } else {
        Err(Some(c))
    }
}

/// The flexural answer at neutral-axis depth `c` with the layers' stresses there.
fn finish(conc: &Concrete, layers: &[SteelLayer], c: f64, converged: bool, stresses: Vec<f64>) -> Flexure {
    let (cf, cy) = conc.compression(conc.beta1 * c);
    let mn = layers.iter().zip(&stresses).map(|(l, f)| l.area * f * l.depth).sum::<f64>() - cf * cy;
    let dt = layers.iter().map(|l| l.depth).fold(0.0, f64::max);
    let eps_t = 0.003 * (dt - c) / c;
    Flexure {
        c,
        a: conc.beta1 * c,
        mn,
        eps_t,
        phi: phi_flexure(eps_t),
        stresses,
        converged,
    }
}

/// Strain compatibility: find c where steel tension equals concrete
/// compression — directly when every layer sits at its cap, else by the
/// Illinois variant of regula falsi on c.
pub fn strain_compatibility(conc: &Concrete, layers: &[SteelLayer]) -> Flexure {
    let upper = match capped(conc, layers) {
        Ok(f) => return f,
        Err(c) => c,
    };
    let h = conc.depth();
    let tension = |c: f64| layers.iter().map(|l| l.area * steel_stress(l, c)).sum::<f64>();
    let residual = |c: f64| tension(c) - conc.compression(conc.beta1 * c).0;
    let scale = 1.0 + capped_tension(layers).abs();
    // tension falls and compression grows with c, so the capped depth bounds
    // the root from above and the block that balances the tension found
    // there bounds it from below: a tight bracket to start from
    let (mut lo, mut hi, mut rlo, mut rhi) = match upper {
        Some(cu) => {
            let tu = tension(cu);
            let cl = (conc.block_depth(tu) / conc.beta1).clamp(1e-6 * h, cu);
            (cl, cu, residual(cl), tu - conc.compression(conc.beta1 * cu).0)
        }
        None => (1e-6 * h, h, residual(1e-6 * h), residual(h)),
    };
    if rlo < 0.0 || rhi > 0.0 {
        // the bracket did not hold (rounding at its ends): the whole depth
        (lo, hi) = (1e-6 * h, h);
        (rlo, rhi) = (residual(lo), residual(hi));
    }
    let mut converged = rlo >= 0.0 && rhi <= 0.0;
    let mut c = hi;
    if converged && rlo == 0.0 {
        c = lo;
    } else if converged && rhi < 0.0 {
        let mut side = 0i8;
        for _ in 0..100 {
            c = (lo * rhi - hi * rlo) / (rhi - rlo);
            let r = residual(c);
            if r.abs() <= 1e-9 * scale || (hi - lo) < 1e-10 * h {
                break;
            }
            if r > 0.0 {
                lo = c;
                rlo = r;
                if side == 1 {
                    rhi /= 2.0;
                }
                side = 1;
            } else {
                hi = c;
                rhi = r;
                if side == -1 {
                    rlo /= 2.0;
                }
                side = -1;
            }
        }
    } else if rlo <= 0.0 {
        c = lo;
        converged = false;
    }
    let stresses = layers.iter().map(|l| steel_stress(l, c)).collect();
    finish(conc, layers, c, converged, stresses)
}

/// γp of ACI 318-19 Table 20.3.2.3.1 by fpy/fpu: 0.28 (≥ 0.90), 0.40
/// (≥ 0.85), 0.55 (≥ 0.80) (reference sheet §4.1, from memory, high).
pub fn gamma_p(fpy_over_fpu: f64) -> f64 {
    if fpy_over_fpu >= 0.9 - 1e-9 {
        0.28
    } else if fpy_over_fpu >= 0.85 - 1e-9 {
        0.40
    } else {
        0.55
    }
}

/// The approximate strand stress of ACI 318-19 Eq. 20.3.2.3.1 with no mild
/// steel: fps = fpu·(1 − (γp/β1)·ρp·fpu/f′c), ρp = Aps/(b·dp), psi. Valid
/// when fse ≥ 0.5 fpu and all strand is in the tension zone.
pub fn fps_approx(aps: f64, fpu: f64, fpy: f64, b: f64, dp: f64, fc: f64, beta1: f64) -> f64 {
    let rho = aps / (b * dp);
    fpu * (1.0 - gamma_p(fpy / fpu) / beta1 * rho * fpu / fc)
}

/// Mn (lbf·in) with a fixed strand stress `fps` at depth `dp`, the stress
/// block found over the real section (so flanges and cores are exact).
pub fn mn_fixed_stress(conc: &Concrete, aps: f64, fps: f64, dp: f64) -> (f64, f64) {
    let t = aps * fps;
    let a = conc.block_depth(t);
    let (cf, cy) = conc.compression(a);
    (t * dp - cf * cy, a)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::material::builtin_strand;
    use crate::section::{Geometry, Polygon};
    use approx::assert_relative_eq;

    fn strip() -> Geometry {
        Geometry {
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
        }
    }

    /// Engineering reference sheet §10.2 Example A (derived [D] from ACI
    /// 318-19 Eq. 20.3.2.3.1 and the strain-compatibility method): 48 × 8 in
    /// strip, six 1/2 in strands at dp = 6.75 in, f′c 5000 psi.
    #[test]
    fn example_a_approximate() {
        let g = strip();
        let conc = Concrete {
            geometry: &g,
            fc: 5000.0,
            topping: None,
            beta1: 0.80,
            top_band: (0.0, 0.0),
        };
        let fps = fps_approx(0.918, 270_000.0, 243_000.0, 48.0, 6.75, 5000.0, 0.80);
        assert_relative_eq!(fps, 255_540.0, max_relative = 1e-4);
        let (mn, a) = mn_fixed_stress(&conc, 0.918, fps, 6.75);
        assert_relative_eq!(a, 1.150, max_relative = 1e-3);
        assert_relative_eq!(mn / 12_000.0, 120.72, max_relative = 1e-4);
    }

    #[test]
    fn example_a_strain_compatibility() {
        // ε1 = 0.005614 (fse 160 ksi), ε2 = 0.000229; sheet: εps 0.016682,
        // fps 260.14 ksi, c 1.463 in, Mn 122.68 kip-ft, tension-controlled.
        let g = strip();
        let conc = Concrete {
            geometry: &g,
            fc: 5000.0,
            topping: None,
            beta1: 0.80,
            top_band: (0.0, 0.0),
        };
        let s = builtin_strand("1/2 in").unwrap();
        let ec = 57_000.0 * 5000f64.sqrt();
        let pe = 0.918 * 160_000.0;
        let eps2 = pe / (384.0 * ec) * (1.0 + 2.75 * 2.75 / (2048.0 / 384.0));
        assert_relative_eq!(eps2, 0.000229, max_relative = 3e-3);
        let layers = [SteelLayer {
            area: 0.918,
            depth: 6.75,
            steel: Steel::Strand {
                kind: &s,
                prestrain: 160.0 / 28_500.0 + eps2,
                cap: 270_000.0,
            },
        }];
        let f = strain_compatibility(&conc, &layers);
        assert!(f.converged);
        assert_relative_eq!(f.stresses[0], 260_140.0, max_relative = 1e-3);
        assert_relative_eq!(f.c, 1.463, max_relative = 2e-3);
        assert_relative_eq!(f.mn / 12_000.0, 122.68, max_relative = 1e-3);
        assert_relative_eq!(f.phi, 0.90);
    }

    #[test]
    fn phi_table_21_2_2() {
        // ACI 318-19 Table 21.2.2 with εty = 0.002 (from memory, high).
        assert_relative_eq!(phi_flexure(0.001), 0.65);
        assert_relative_eq!(phi_flexure(0.0035), 0.775, max_relative = 1e-12);
        assert_relative_eq!(phi_flexure(0.005), 0.90);
    }

    #[test]
    fn topping_carries_the_block_first() {
        let g = strip();
        let conc = Concrete {
            geometry: &g,
            fc: 5000.0,
            topping: Some((2.0, 48.0, 4000.0)),
            beta1: 0.85,
            top_band: g.top_band(),
        };
        let (f, y) = conc.compression(1.0);
        assert_relative_eq!(f, 0.85 * 4000.0 * 48.0);
        assert_relative_eq!(y, 0.5);
        let (f, _) = conc.compression(3.0);
        assert_relative_eq!(f, 0.85 * 4000.0 * 96.0 + 0.85 * 5000.0 * 48.0);
    }
}

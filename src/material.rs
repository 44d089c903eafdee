//! Concrete and prestressing strand.
//!
//! Stresses in psi, unit weights in lbf/in³ (see [`crate::units`]).

use serde::Serialize;

use crate::units::{Area, Length, Stress, UnitWeight};

/// Aggregate kind, which decides the fire tables used (IBC 2021 §722) and
/// the lightweight factor λ (ACI 318-19 Table 19.2.4.2).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Aggregate {
    /// Siliceous (normalweight).
    Siliceous,
    /// Carbonate (normalweight).
    Carbonate,
    /// Sand-lightweight.
    SandLightweight,
    /// All-lightweight.
    Lightweight,
}

impl Aggregate {
    /// Spellings accepted in a catalog.
    pub const NAMES: &'static [&'static str] = &["siliceous", "carbonate", "sand-lightweight", "lightweight"];

    /// From a catalog spelling.
    pub fn from_name(s: &str) -> Option<Aggregate> {
        Some(match s {
            "siliceous" => Aggregate::Siliceous,
            "carbonate" => Aggregate::Carbonate,
            "sand-lightweight" => Aggregate::SandLightweight,
            "lightweight" => Aggregate::Lightweight,
            _ => return None,
        })
    }

    /// The catalog spelling.
    pub fn name(self) -> &'static str {
        match self {
            Aggregate::Siliceous => "siliceous",
            Aggregate::Carbonate => "carbonate",
            Aggregate::SandLightweight => "sand-lightweight",
            Aggregate::Lightweight => "lightweight",
        }
    }

    /// λ by concrete type, ACI 318-19 Table 19.2.4.2: all-lightweight 0.75,
    /// sand-lightweight 0.85, normalweight 1.0 (reference sheet: from memory,
    /// medium confidence — verify).
    pub fn lambda(self) -> f64 {
        match self {
            Aggregate::Siliceous | Aggregate::Carbonate => 1.0,
            Aggregate::SandLightweight => 0.85,
            Aggregate::Lightweight => 0.75,
        }
    }
}

/// How Ec is found.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Modulus {
    /// Ec = wc^1.5 · 33 · √f′c (psi, wc in pcf), ACI 318-19 §19.2.2.1(a).
    UnitWeight,
    /// Ec = 57 000 √f′c (psi), ACI 318-19 §19.2.2.1(b), normalweight only.
    Normalweight,
    /// Given by the producer (at 28 days; Eci scaled by √(f′ci/f′c)).
    Given(Stress),
}

/// A concrete mix.
#[derive(Debug, Clone, PartialEq)]
pub struct Mix {
    /// Catalog id.
    pub id: String,
    /// Specified compressive strength f′c.
    pub fc: Stress,
    /// Strength at release of the strands f′ci.
    pub fci: Stress,
    /// Unit weight of the hardened reinforced concrete.
    pub unit_weight: UnitWeight,
    /// Aggregate kind.
    pub aggregate: Aggregate,
    /// How Ec is found.
    pub modulus: Modulus,
}

impl Mix {
    fn modulus_at(&self, f: Stress) -> Stress {
        // pcf by its factor, not by name: this runs at every station
        let wc_pcf = self.unit_weight.get() / (1.0 / 1728.0);
        match self.modulus {
            Modulus::UnitWeight => Stress::new(wc_pcf * wc_pcf.sqrt() * 33.0 * f.get().sqrt()),
            Modulus::Normalweight => Stress::new(57_000.0 * f.get().sqrt()),
            Modulus::Given(e) => Stress::new(e.get() * (f.get() / self.fc.get()).sqrt()),
        }
    }
    /// Ec at 28 days (ACI 318-19 §19.2.2.1), psi.
    pub fn ec(&self) -> Stress {
        self.modulus_at(self.fc)
    }
    /// Eci at release: the same formula with f′ci (PCI practice).
    pub fn eci(&self) -> Stress {
        self.modulus_at(self.fci)
    }
    /// Modulus of rupture fr = 7.5 λ √f′c, ACI 318-19 Eq. 19.2.3.1.
    pub fn fr(&self) -> Stress {
        Stress::new(7.5 * self.aggregate.lambda() * self.fc.get().sqrt())
    }
    /// β1, ACI 318-19 Table 22.2.2.4.3.
    pub fn beta1(&self) -> f64 {
        beta1(self.fc)
    }
    /// Which Ec formula, for reports.
    pub fn modulus_note(&self) -> &'static str {
        match self.modulus {
            Modulus::UnitWeight => "Ec = 33 wc^1.5 √f'c (ACI 318-19 19.2.2.1a)",
            Modulus::Normalweight => "Ec = 57000 √f'c (ACI 318-19 19.2.2.1b)",
            Modulus::Given(_) => "Ec given by the producer",
        }
    }
}

/// β1 of the equivalent stress block, ACI 318-19 Table 22.2.2.4.3:
/// 0.85 up to 4000 psi, less 0.05 per 1000 psi, not below 0.65.
pub fn beta1(fc: Stress) -> f64 {
    let f = fc.get();
    (0.85 - 0.05 * (f - 4000.0) / 1000.0).clamp(0.65, 0.85)
}

/// Relaxation class of strand.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Relaxation {
    /// Low-relaxation (ASTM A416).
    Low,
    /// Stress-relieved (normal relaxation).
    StressRelieved,
}

/// A kind of seven-wire strand.
#[derive(Debug, Clone, PartialEq)]
pub struct StrandKind {
    /// Name or catalog id.
    pub id: String,
    /// Nominal diameter.
    pub diameter: Length,
    /// Nominal area.
    pub area: Area,
    /// Specified tensile strength fpu.
    pub fpu: Stress,
    /// Yield strength fpy (stress at 1 % extension).
    pub fpy: Stress,
    /// Modulus Eps.
    pub eps: Stress,
    /// Relaxation class.
    pub relaxation: Relaxation,
}

impl StrandKind {
    /// Stress at strain `eps`, psi, capped at fpu.
    ///
    /// Grade 270 low-relaxation strand: the power formula of Devalapura &
    /// Tadros (1992), adopted by the PCI Design Handbook,
    /// fps = ε·[887 + 27 613 / (1 + (112.4 ε)^7.36)^(1/7.36)] ≤ 270 ksi
    /// (constants from memory, high confidence, per the engineering
    /// reference sheet §1.3(b)). Other strand: the PCI Design Handbook
    /// piecewise curve of the nearer grade (250 or 270), scaled to this
    /// strand's fpu and Eps (reference sheet §1.3(a), from memory, medium).
    pub fn stress(&self, eps: f64) -> f64 {
        // ksi by its factor, not by name: this runs in every strain-compatibility step
        let fpu = self.fpu.get() / 1000.0;
        let e_ksi = self.eps.get() / 1000.0;
        let f = if eps <= 0.0 {
            e_ksi * eps
        } else if (fpu - 270.0).abs() < 1.0 && self.relaxation == Relaxation::Low {
            let b = 1.0 + (112.4 * eps).powf(7.36);
            eps * (887.0 + 27_613.0 / b.powf(1.0 / 7.36))
        } else if fpu < 260.0 {
            let lin = 0.0076 * 28_500.0 / e_ksi;
            if eps <= lin {
                e_ksi * eps
            } else {
                (250.0 - 0.04 / (eps - 0.0064)) * fpu / 250.0
            }
        } else {
            let lin = 0.0086 * 28_500.0 / e_ksi;
            if eps <= lin {
                e_ksi * eps
            } else {
                (270.0 - 0.04 / (eps - 0.007)) * fpu / 270.0
            }
        };
        f.min(fpu) * 1000.0
    }
}

/// The built-in Grade 270 (1860 MPa) low-relaxation seven-wire strands of
/// ASTM A416: (names, diameter in, area in²). Areas 0.085 / 0.115 / 0.153 /
/// 0.217 in² per the engineering reference sheet §1.2 (0.153: published
/// text, indirect; the others from memory, high confidence). fpy = 0.90 fpu
/// (ASTM A416, low-relaxation); Eps = 28 500 ksi (PCI design value, from
/// memory, high confidence).
pub const BUILTIN_STRANDS: &[(&[&str], f64, f64)] = &[
    (&["3/8 in", "0.375 in", "9.5 mm", "9.53 mm"], 0.375, 0.085),
    (&["7/16 in", "0.4375 in", "11.1 mm", "11.11 mm"], 0.4375, 0.115),
    (&["1/2 in", "0.5 in", "12.7 mm", "12.70 mm"], 0.5, 0.153),
    (&["0.6 in", "15.2 mm", "15.24 mm"], 0.6, 0.217),
];

/// A built-in strand by any of its names ("1/2 in", "12.7 mm").
pub fn builtin_strand(name: &str) -> Option<StrandKind> {
    let key: String = name.split_whitespace().collect::<Vec<_>>().join(" ").to_lowercase();
    BUILTIN_STRANDS
        .iter()
        .find(|(names, _, _)| names.iter().any(|n| *n == key))
        .map(|&(names, d, a)| StrandKind {
            id: names[0].to_string(),
            diameter: Length::new(d),
            area: Area::new(a),
            fpu: Stress::from_unit(270.0, "ksi"),
            fpy: Stress::from_unit(243.0, "ksi"),
            eps: Stress::from_unit(28_500.0, "ksi"),
            relaxation: Relaxation::Low,
        })
}

/// The names of the built-in strands, for messages.
pub fn builtin_strand_names() -> Vec<&'static str> {
    BUILTIN_STRANDS.iter().flat_map(|(n, _, _)| n.iter().copied()).collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn mix(fc: f64, wc: f64, m: Modulus) -> Mix {
        Mix {
            id: "m".into(),
            fc: Stress::new(fc),
            fci: Stress::new(3500.0),
            unit_weight: UnitWeight::from_unit(wc, "pcf"),
            aggregate: Aggregate::Carbonate,
            modulus: m,
        }
    }

    #[test]
    fn modulus_check_values() {
        // Engineering reference sheet §1.1 check values (derived from ACI 318-19 §19.2.2.1).
        assert_relative_eq!(
            mix(5000.0, 150.0, Modulus::Normalweight).ec().get(),
            4_030_509.0,
            max_relative = 1e-6
        );
        assert_relative_eq!(mix(5000.0, 150.0, Modulus::UnitWeight).ec().get(), 4_286_826.0, max_relative = 1e-6);
        assert_relative_eq!(mix(5000.0, 145.0, Modulus::UnitWeight).ec().get(), 4_074_281.0, max_relative = 1e-6);
        assert_relative_eq!(
            mix(4000.0, 150.0, Modulus::Normalweight).ec().get(),
            3_604_997.0,
            max_relative = 1e-6
        );
        // Eci with f'ci = 3500 psi: 57000 √3500 = 3 372 165 psi (sheet §10.2 B: 3372.2 ksi)
        assert_relative_eq!(
            mix(5000.0, 150.0, Modulus::Normalweight).eci().get(),
            3_372_165.0,
            max_relative = 1e-6
        );
    }

    #[test]
    fn rupture_and_beta1_check_values() {
        // Sheet §1.1: fr(5000) = 530.3, fr(4000) = 474.3, fr(6000) = 580.9 psi.
        assert_relative_eq!(mix(5000.0, 150.0, Modulus::Normalweight).fr().get(), 530.33, max_relative = 1e-4);
        assert_relative_eq!(mix(4000.0, 150.0, Modulus::Normalweight).fr().get(), 474.34, max_relative = 1e-4);
        assert_relative_eq!(mix(6000.0, 150.0, Modulus::Normalweight).fr().get(), 580.95, max_relative = 1e-4);
        // ACI 318-19 Table 22.2.2.4.3 (from memory, high confidence).
        for (fc, b) in [
            (3000.0, 0.85),
            (4000.0, 0.85),
            (5000.0, 0.80),
            (6000.0, 0.75),
            (7000.0, 0.70),
            (8000.0, 0.65),
            (10000.0, 0.65),
        ] {
            assert_relative_eq!(beta1(Stress::new(fc)), b, max_relative = 1e-12);
        }
    }

    #[test]
    fn power_formula_check_values() {
        // Engineering reference sheet §1.3(b) [D] check values of the
        // Devalapura–Tadros curve: 142.2 ksi at 0.005, 227.2 at 0.0086,
        // 243.0 at 0.010 (= fpy), 258.3 at 0.015, 263.3 at 0.020, 270 by 0.030.
        let s = builtin_strand("1/2 in").unwrap();
        for (e, f) in [
            (0.005, 142.2),
            (0.0086, 227.2),
            (0.010, 243.0),
            (0.015, 258.3),
            (0.020, 263.3),
            (0.030, 270.0),
        ] {
            assert_relative_eq!(s.stress(e) / 1000.0, f, max_relative = 5e-4);
        }
        // a 250 ksi stress-relieved strand follows the PCI 250 curve:
        // 250 − 0.04/(0.01 − 0.0064) = 238.9 ksi at 1 % (sheet §1.3(a))
        let mut g250 = s.clone();
        g250.fpu = Stress::from_unit(250.0, "ksi");
        g250.relaxation = Relaxation::StressRelieved;
        assert_relative_eq!(g250.stress(0.01) / 1000.0, 250.0 - 0.04 / 0.0036, max_relative = 1e-12);
    }

    #[test]
    fn builtin_strands_by_name() {
        let s = builtin_strand("1/2 in").unwrap();
        assert_relative_eq!(s.area.get(), 0.153);
        // Aps·fpu = 41.31 kip (sheet §1.2)
        assert_relative_eq!(s.area.get() * s.fpu.get() / 1000.0, 41.31, max_relative = 1e-12);
        assert_eq!(builtin_strand("12.7 mm").unwrap().id, "1/2 in");
        assert_eq!(builtin_strand("0.6  in").unwrap().area.get(), 0.217);
        assert!(builtin_strand("5/8 in").is_none());
        // metric area 98.7 mm² ≈ 0.153 in² (sheet §1.2)
        assert_relative_eq!(crate::units::Area::from_unit(98.7, "mm2").get(), 0.153, max_relative = 0.001);
    }
}

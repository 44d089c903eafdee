//! Prestress: losses by Zia, Preston, Scott & Workman (1979), transfer and
//! development lengths.
//!
//! Stresses in psi, lengths in inches, forces in lbf.

use serde::Serialize;

use crate::material::Relaxation;

/// Inputs to the Zia et al. (1979) loss estimate for a pretensioned member.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ZiaInput {
    /// Stress in the strand at jacking, psi (taken as fpi for C and fcir).
    pub fpj: f64,
    /// fpu, psi.
    pub fpu: f64,
    /// Total strand area, in².
    pub aps: f64,
    /// Gross area, in².
    pub area: f64,
    /// Gross second moment of area, in⁴.
    pub inertia: f64,
    /// Strand eccentricity below the centroid at the critical section, in.
    pub e: f64,
    /// Self-weight moment at the critical section, lbf·in.
    pub mg: f64,
    /// Concrete stress at the strand centroid from superimposed permanent
    /// dead load, psi (fcds).
    pub fcds: f64,
    /// Strand modulus Es, psi.
    pub es: f64,
    /// Concrete modulus at release Eci, psi.
    pub eci: f64,
    /// Concrete modulus Ec, psi.
    pub ec: f64,
    /// Volume-to-surface ratio, in.
    pub vs: f64,
    /// Relative humidity, %.
    pub rh: f64,
    /// Sand-lightweight or lightweight concrete (Kcr reduced by 20 %).
    pub lightweight: bool,
    /// Relaxation class.
    pub relaxation: Relaxation,
}

/// Prestress losses, psi.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Losses {
    /// Concrete stress at the strand centroid just after transfer, psi.
    pub fcir_psi: f64,
    /// Concrete stress at the strand centroid from superimposed dead load, psi.
    pub fcds_psi: f64,
    /// Elastic shortening, psi.
    pub es_psi: f64,
    /// Creep, psi.
    pub cr_psi: f64,
    /// Shrinkage, psi.
    pub sh_psi: f64,
    /// Relaxation, psi.
    pub re_psi: f64,
    /// Total, psi.
    pub total_psi: f64,
    /// The relaxation factor C used.
    pub c_factor: f64,
    /// Whether fpi/fpu lay outside the C table and was clamped.
    pub c_clamped: bool,
    /// The terms the estimate was made with, for the calculation sheet.
    pub terms: LossTerms,
}

/// The terms of a Zia et al. (1979) estimate, as put into its equations
/// (psi, in, lbf): what the calculation sheet shows substituted.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Default)]
pub struct LossTerms {
    /// Force at jacking Pi = fpj·Aps, lbf.
    pub pi_lbf: f64,
    /// Gross area, in².
    pub area_in2: f64,
    /// Gross second moment, in⁴.
    pub inertia_in4: f64,
    /// Strand eccentricity at the critical section, in.
    pub e_in: f64,
    /// Self-weight moment there, lbf·in.
    pub mg_lbin: f64,
    /// Strand modulus, psi.
    pub eps_psi: f64,
    /// Eci, psi.
    pub eci_psi: f64,
    /// Ec, psi.
    pub ec_psi: f64,
    /// Kcr (2.0, or 1.6 for lightweight concrete).
    pub kcr: f64,
    /// Volume-to-surface ratio, in.
    pub vs_in: f64,
    /// Relative humidity, %.
    pub rh_pct: f64,
    /// Kre, psi.
    pub kre_psi: f64,
    /// J.
    pub j: f64,
}

/// Zia et al. (1979) Table: C against fpi/fpu, rows 0.80 down to 0.60,
/// columns (stress-relieved strand or wire, low-relaxation strand or
/// stress-relieved bar). From memory, medium confidence — verify (reference
/// sheet §2.1, Table 2.1c). `None` where the paper gives no value.
pub const ZIA_C_TABLE: [(f64, Option<f64>, f64); 21] = [
    (0.80, None, 1.28),
    (0.79, None, 1.22),
    (0.78, None, 1.16),
    (0.77, None, 1.11),
    (0.76, None, 1.05),
    (0.75, Some(1.45), 1.00),
    (0.74, Some(1.36), 0.95),
    (0.73, Some(1.27), 0.90),
    (0.72, Some(1.18), 0.85),
    (0.71, Some(1.09), 0.80),
    (0.70, Some(1.00), 0.75),
    (0.69, Some(0.94), 0.70),
    (0.68, Some(0.89), 0.66),
    (0.67, Some(0.83), 0.61),
    (0.66, Some(0.78), 0.57),
    (0.65, Some(0.73), 0.53),
    (0.64, Some(0.68), 0.49),
    (0.63, Some(0.63), 0.45),
    (0.62, Some(0.58), 0.41),
    (0.61, Some(0.53), 0.37),
    (0.60, Some(0.49), 0.33),
];

/// Kre (psi) and J of Zia et al. (1979) Table (reference sheet Table 2.1b):
/// 270 low-relaxation strand 5000 / 0.040 (from memory, high confidence);
/// 250 low-relaxation 4630 / 0.037, 270 stress-relieved 20 000 / 0.15, 250
/// stress-relieved 18 500 / 0.14 (from memory, medium confidence — verify).
pub fn kre_j(relaxation: Relaxation, fpu_psi: f64) -> (f64, f64) {
    let g270 = fpu_psi >= 260_000.0;
    match (relaxation, g270) {
        (Relaxation::Low, true) => (5000.0, 0.040),
        (Relaxation::Low, false) => (4630.0, 0.037),
        (Relaxation::StressRelieved, true) => (20_000.0, 0.15),
        (Relaxation::StressRelieved, false) => (18_500.0, 0.14),
    }
}

/// C by linear interpolation in [`ZIA_C_TABLE`]; (C, clamped).
pub fn c_factor(relaxation: Relaxation, ratio: f64) -> (f64, bool) {
    // the column of this relaxation, highest ratio first (no allocation: losses run per evaluation)
    let col = || {
        ZIA_C_TABLE.iter().filter_map(move |&(r, sr, lr)| match relaxation {
            Relaxation::Low => Some((r, lr)),
            Relaxation::StressRelieved => sr.map(|v| (r, v)),
        })
    };
    let (Some(hi), Some(lo)) = (col().next(), col().next_back()) else {
        return (1.0, true);
    };
    if ratio >= hi.0 {
        return (hi.1, ratio > hi.0 + 1e-9);
    }
    if ratio <= lo.0 {
        return (lo.1, ratio < lo.0 - 1e-9);
    }
    for ((r1, c1), (r0, c0)) in col().zip(col().skip(1)) {
        if ratio <= r1 && ratio >= r0 {
            return (c0 + (c1 - c0) * (ratio - r0) / (r1 - r0), false);
        }
    }
    (1.0, true)
}

/// Losses by Zia et al. (1979), pretensioned, bonded:
/// ES = Kes·Es·fcir/Eci (Kes = 1.0); fcir = Kcir(Pi/A + Pi·e²/I) − Mg·e/I
/// (Kcir = 0.9); CR = Kcr·(Es/Ec)(fcir − fcds) (Kcr = 2.0, ×0.8 for
/// sand-lightweight); SH = 8.2×10⁻⁶·Ksh·Es·(1 − 0.06 V/S)(100 − RH)
/// (Ksh = 1.0); RE = [Kre − J(SH + CR + ES)]·C. Creep is not taken below
/// zero. Factors from the reference sheet §2.1 (Kes from the paper; the
/// rest from memory — verify).
pub fn zia(i: &ZiaInput) -> Losses {
    let pi = i.fpj * i.aps;
    let fcir = 0.9 * (pi / i.area + pi * i.e * i.e / i.inertia) - i.mg * i.e / i.inertia;
    let es = i.es * fcir / i.eci;
    let kcr = if i.lightweight { 1.6 } else { 2.0 };
    let cr = (kcr * i.es / i.ec * (fcir - i.fcds)).max(0.0);
    let sh = 8.2e-6 * i.es * (1.0 - 0.06 * i.vs) * (100.0 - i.rh);
    let (kre, j) = kre_j(i.relaxation, i.fpu);
    let (c, clamped) = c_factor(i.relaxation, i.fpj / i.fpu);
    let re = ((kre - j * (sh + cr + es)) * c).max(0.0);
    Losses {
        fcir_psi: fcir,
        fcds_psi: i.fcds,
        es_psi: es,
        cr_psi: cr,
        sh_psi: sh,
        re_psi: re,
        total_psi: es + cr + sh + re,
        c_factor: c,
        c_clamped: clamped,
        terms: LossTerms {
            pi_lbf: pi,
            area_in2: i.area,
            inertia_in4: i.inertia,
            e_in: i.e,
            mg_lbin: i.mg,
            eps_psi: i.es,
            eci_psi: i.eci,
            ec_psi: i.ec,
            kcr,
            vs_in: i.vs,
            rh_pct: i.rh,
            kre_psi: kre,
            j,
        },
    }
}

/// Transfer length for stresses, flexure and φ: (fse/3000)·db, the first
/// term of ACI 318-19 Eq. 25.4.8.1 (fse in psi), in.
pub fn transfer_length(fse: f64, db: f64) -> f64 {
    fse / 3000.0 * db
}

/// Transfer length for shear: 50 db for strand, ACI 318-19 §22.5.7 (§22.5.9
/// in 318-14; the 318-19 number from memory, medium)
/// (reference sheet §4.6, the 50 db from memory, high confidence), in.
pub fn transfer_length_shear(db: f64) -> f64 {
    50.0 * db
}

/// Development length of seven-wire strand, ACI 318-19 Eq. 25.4.8.1:
/// ℓd = (fse/3000) db + ((fps − fse)/1000) db, doubled for debonded strand
/// (§25.4.8.1(b)), in.
pub fn development_length(fse: f64, fps: f64, db: f64, debonded: bool) -> f64 {
    let ld = fse / 3000.0 * db + (fps - fse).max(0.0) / 1000.0 * db;
    if debonded { 2.0 * ld } else { ld }
}

/// The strand stress that can be developed at distance `x` from where
/// bonding begins, ACI 318-19 §25.4.8.3 (Fig. R25.4.8.3): fse·x/ℓtr up to
/// ℓtr, then linear to fps at ℓd, psi.
pub fn developed_stress(x: f64, fse: f64, fps: f64, ltr: f64, ld: f64) -> f64 {
    if x <= 0.0 {
        0.0
    } else if x <= ltr {
        fse * x / ltr
    } else if x < ld {
        fse + (fps - fse) * (x - ltr) / (ld - ltr)
    } else {
        fps
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    /// Engineering reference sheet §10.2, Example B (derived [D] from the
    /// Zia et al. 1979 equations as the sheet gives them): a 48 × 8 in
    /// strip with six 1/2 in strands at e = 2.75 in, span 24 ft.
    fn example_b() -> ZiaInput {
        ZiaInput {
            fpj: 202_500.0,
            fpu: 270_000.0,
            aps: 0.918,
            area: 384.0,
            inertia: 2048.0,
            e: 2.75,
            mg: 345_600.0,
            fcds: 69_120.0 * 2.75 / 2048.0,
            es: 28_500_000.0,
            eci: 3_372_165.0,
            ec: 4_030_509.0,
            vs: 384.0 / 112.0,
            rh: 70.0,
            lightweight: false,
            relaxation: Relaxation::Low,
        }
    }

    #[test]
    fn zia_example_b() {
        let l = zia(&example_b());
        // sheet: fcir 0.5894 ksi, fcds 0.0928, ES 4.98, CR 7.02, SH 5.57,
        // RE 4.30, TL 21.87 ksi
        assert_relative_eq!(l.fcir_psi, 589.4, max_relative = 1e-3);
        assert_relative_eq!(l.fcds_psi, 92.8, max_relative = 1e-3);
        assert_relative_eq!(l.es_psi, 4980.0, max_relative = 2e-3);
        assert_relative_eq!(l.cr_psi, 7020.0, max_relative = 2e-3);
        assert_relative_eq!(l.sh_psi, 5570.0, max_relative = 2e-3);
        assert_relative_eq!(l.re_psi, 4300.0, max_relative = 2e-3);
        assert_relative_eq!(l.total_psi, 21_870.0, max_relative = 1e-3);
        assert_relative_eq!(l.c_factor, 1.0);
    }

    #[test]
    fn shrinkage_check_values() {
        // Sheet §10.2: SH = 6170 psi at RH 70 %, V/S 2.0; 5317 psi at 75 %, 1.5.
        let mut i = example_b();
        i.vs = 2.0;
        assert_relative_eq!(zia(&i).sh_psi, 6170.0, max_relative = 1e-3);
        i.vs = 1.5;
        i.rh = 75.0;
        assert_relative_eq!(zia(&i).sh_psi, 5317.0, max_relative = 1e-3);
    }

    #[test]
    fn c_table_interpolates_and_clamps() {
        // Zia et al. (1979) C table as in the reference sheet (from memory, medium).
        assert_relative_eq!(c_factor(Relaxation::Low, 0.75).0, 1.00);
        assert_relative_eq!(c_factor(Relaxation::Low, 0.745).0, 0.975, max_relative = 1e-9);
        assert_relative_eq!(c_factor(Relaxation::StressRelieved, 0.70).0, 1.00);
        assert_eq!(c_factor(Relaxation::Low, 0.85), (1.28, true));
        assert_eq!(c_factor(Relaxation::StressRelieved, 0.78), (1.45, true));
        assert_eq!(kre_j(Relaxation::Low, 270_000.0), (5000.0, 0.040));
    }

    #[test]
    fn transfer_and_development_check_values() {
        // Sheet §4.6: 1/2 in strand, fse 160 ksi: ℓtr 26.7 in, 50 db = 25 in,
        // with fps 260 ksi ℓd = 76.7 in (×2 = 153 in debonded).
        assert_relative_eq!(transfer_length(160_000.0, 0.5), 26.667, max_relative = 1e-4);
        assert_relative_eq!(transfer_length_shear(0.5), 25.0);
        assert_relative_eq!(development_length(160_000.0, 260_000.0, 0.5, false), 76.667, max_relative = 1e-4);
        assert_relative_eq!(development_length(160_000.0, 260_000.0, 0.5, true), 153.33, max_relative = 1e-4);
        // ACI Fig. R25.4.8.3: fse at ℓtr, fps at ℓd, halfway between
        assert_relative_eq!(
            developed_stress(26.667 / 2.0, 160_000.0, 260_000.0, 26.667, 76.667),
            80_000.0,
            max_relative = 1e-9
        );
        assert_relative_eq!(
            developed_stress(51.667, 160_000.0, 260_000.0, 26.667, 76.667),
            210_000.0,
            max_relative = 1e-9
        );
        assert_relative_eq!(developed_stress(100.0, 160_000.0, 260_000.0, 26.667, 76.667), 260_000.0);
    }
}

//! Fundamental frequency of the simply supported member, as information or,
//! when the case sets a minimum, as a check.
//!
//! f = (π/2)·√(g·E·I / (w·L⁴)), the first mode of a uniform simply
//! supported beam (any structural dynamics text, e.g. Chopra, *Dynamics of
//! Structures*, §16). w is the dead load plus 10 % of the live load, E = Ec,
//! I of the section carrying superimposed loads (common practice, no source).
//! A walking-comfort threshold of about 3–4 Hz is commonly quoted (common
//! practice, no source). Not a station check: one value for the member.

use serde::Serialize;

use super::{Analysis, CheckInfo, CheckResult, Group, Reads};
use crate::member::Member;
use crate::units::G_IN_PER_S2;

/// Registry entry.
pub const INFO: CheckInfo = CheckInfo {
    id: "frequency",
    title: "Natural frequency (walking comfort)",
    clause: "simply supported beam, f = (π/2)√(gEI/wL⁴); threshold by the case",
    unit: "Hz",
    group: Group::Deflection,
    reads: Reads::Need,
    load_driven: true,
};

/// The terms of the frequency, for the calculation sheet.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Terms {
    /// Weight per length: self-weight, topping, superimposed dead load and
    /// 10 % of the live load, lbf/in.
    pub w_lbf_per_in: f64,
    /// Moment of inertia (the composite section when topped), in⁴.
    pub i_in4: f64,
    /// Modulus of the precast concrete, psi.
    pub ec_psi: f64,
    /// Span, in.
    pub l_in: f64,
    /// Acceleration of gravity, in/s².
    pub g_in_per_s2: f64,
    /// The frequency, Hz.
    pub f_hz: f64,
}

/// The frequency and its terms.
pub fn terms(m: &Member) -> Terms {
    let w = m.w[0] + m.w[1] + m.w[2] + 0.1 * m.w[3];
    let i = m.comp.map_or(m.bare.ix_in4, |c| c.ix_in4);
    let e = m.ec;
    Terms {
        w_lbf_per_in: w,
        i_in4: i,
        ec_psi: e,
        l_in: m.l,
        g_in_per_s2: G_IN_PER_S2,
        f_hz: std::f64::consts::FRAC_PI_2 * (G_IN_PER_S2 * e * i / (w * m.l.powi(4))).sqrt(),
    }
}

/// The frequency, Hz.
pub fn frequency(m: &Member) -> f64 {
    terms(m).f_hz
}

/// Run only when a minimum frequency is set; the demand is the minimum
/// frequency and the capacity the member's own, so a ratio above 1 fails.
pub fn run(an: &Analysis) -> Option<CheckResult> {
    let min = an.member.case.min_frequency_hz?;
    let f = an.frequency_hz;
    Some(CheckResult::new(
        &INFO,
        min,
        f,
        None,
        an.note(format_args!("f = {f:.2} Hz (dead + 10 % live); about 3–4 Hz is commonly sought")),
    ))
}

#[cfg(test)]
mod tests {
    use crate::units::G_IN_PER_S2;
    use approx::assert_relative_eq;

    #[test]
    fn uniform_beam_closed_form() {
        // Chopra, Dynamics of Structures: ω1 = π²√(EI/(m L⁴)), f = ω/2π =
        // (π/2)√(EI/(m L⁴)) with m = w/g.
        let (e, i, w, l): (f64, f64, f64, f64) = (4.0e6, 1772.0, 30.0, 300.0);
        let f = std::f64::consts::FRAC_PI_2 * (G_IN_PER_S2 * e * i / (w * l.powi(4))).sqrt();
        let omega = std::f64::consts::PI.powi(2) * (e * i / ((w / G_IN_PER_S2) * l.powi(4))).sqrt();
        assert_relative_eq!(f, omega / (2.0 * std::f64::consts::PI), max_relative = 1e-12);
    }
}

//! Quantities with units.
//!
//! Every dimensional value in a catalog or job file is a string that carries
//! its unit: `"8 in"`, `"30 ft 6 in"`, `"1-1/2 in"`, `"6000 psi"`, `"41.4 MPa"`,
//! `"2400 kg/m3"`, `"0.5 klf"`, `"2 h"`. Parsing turns the string into a
//! [`Q`] of one kind, stored in the single internal system of plankwise:
//! **inch, pound-force (lbf), second, hour** — so a stress is in psi, a force in
//! lbf, a moment in lbf·in, an area load in psi (lbf/in²), a line load in
//! lbf/in and a unit weight in lbf/in³. √f′c in the ACI formulas is then the
//! square root of the stored value.
//!
//! Conversion factors follow from exact definitions (1 in = 0.0254 m,
//! 1 lb = 0.453 592 37 kg, g_n = 9.806 65 m/s²); the tests compare each with
//! the value tabulated in NIST SP 811 (2008), Appendix B.

pub mod display;

use std::fmt;
use std::marker::PhantomData;
use std::ops::{Add, Div, Mul, Neg, Sub};

/// Metres in one inch (exact by definition).
pub const M_PER_IN: f64 = 0.0254;
/// Newtons in one pound-force: 0.453 592 37 kg × 9.806 65 m/s² (exact).
pub const N_PER_LBF: f64 = 4.448_221_615_260_5;
/// Standard acceleration of gravity, m/s² (exact by definition).
pub const G_N: f64 = 9.806_65;
/// Standard acceleration of gravity in in/s².
pub const G_IN_PER_S2: f64 = G_N / M_PER_IN;
/// Pascals in one psi (lbf/in²).
pub const PA_PER_PSI: f64 = N_PER_LBF / (M_PER_IN * M_PER_IN);

/// A kind of quantity: its name and the units a user may write for it.
pub trait Kind: Copy + Clone + fmt::Debug + PartialEq + 'static {
    /// Plain name used in messages ("a length").
    const NAME: &'static str;
    /// Accepted units: (spelling, factor to the internal unit). Matched
    /// without regard to case; the first spelling is the one shown in lists.
    const UNITS: &'static [(&'static str, f64)];
    /// Whether several terms may be summed ("30 ft 6 in").
    const COMPOUND: bool = false;
}

macro_rules! kinds {
    ($( $(#[$doc:meta])* $kind:ident, $alias:ident, $name:literal, $compound:literal, [ $( ($u:literal, $f:expr) ),* $(,)? ] );* $(;)?) => {
        $(
            $(#[$doc])*
            #[derive(Copy, Clone, Debug, PartialEq)]
            pub struct $kind;
            impl Kind for $kind {
                const NAME: &'static str = $name;
                const UNITS: &'static [(&'static str, f64)] = &[ $( ($u, $f) ),* ];
                const COMPOUND: bool = $compound;
            }
            $(#[$doc])*
            pub type $alias = Q<$kind>;
        )*
        /// Every kind: its name and the spellings it accepts, for messages.
        pub fn all_kinds() -> Vec<(&'static str, &'static [(&'static str, f64)])> {
            vec![ $( ($name, <$kind as Kind>::UNITS) ),* ]
        }
    };
}

const MM: f64 = 1.0 / 25.4;
const MPA: f64 = 1.0e6 / PA_PER_PSI;
const N_PER_M3_TO_LBF_PER_IN3: f64 = M_PER_IN * M_PER_IN * M_PER_IN / N_PER_LBF;
const N_PER_M_TO_LBF_PER_IN: f64 = M_PER_IN / N_PER_LBF;

kinds! {
    /// Length, stored in inches.
    LengthK, Length, "a length", true, [
        ("in", 1.0), ("inch", 1.0), ("inches", 1.0), ("\"", 1.0),
        ("ft", 12.0), ("feet", 12.0), ("foot", 12.0), ("'", 12.0),
        ("mm", MM), ("cm", 10.0 * MM), ("m", 1000.0 * MM),
    ];
    /// Area, stored in in².
    AreaK, Area, "an area", false, [
        ("in2", 1.0), ("in²", 1.0), ("sq in", 1.0), ("ft2", 144.0), ("ft²", 144.0),
        ("mm2", MM * MM), ("mm²", MM * MM), ("cm2", 100.0 * MM * MM), ("m2", 1.0e6 * MM * MM), ("m²", 1.0e6 * MM * MM),
    ];
    /// Section modulus, stored in in³.
    ModulusK, SectionModulus, "a section modulus", false, [
        ("in3", 1.0), ("in³", 1.0), ("mm3", MM * MM * MM), ("mm³", MM * MM * MM), ("cm3", 1000.0 * MM * MM * MM), ("m3", 1.0e9 * MM * MM * MM),
    ];
    /// Second moment of area, stored in in⁴.
    InertiaK, Inertia, "a second moment of area", false, [
        ("in4", 1.0), ("in⁴", 1.0), ("mm4", MM * MM * MM * MM), ("mm⁴", MM * MM * MM * MM), ("cm4", 1.0e4 * MM * MM * MM * MM), ("m4", 1.0e12 * MM * MM * MM * MM),
    ];
    /// Stress or modulus of elasticity, stored in psi.
    StressK, Stress, "a stress", false, [
        ("psi", 1.0), ("ksi", 1000.0), ("MPa", MPA), ("N/mm2", MPA), ("GPa", 1000.0 * MPA), ("kPa", MPA / 1000.0), ("Pa", MPA / 1.0e6),
    ];
    /// Area load (force per plan area), stored in psi (lbf/in²).
    AreaLoadK, AreaLoad, "an area load", false, [
        ("psf", 1.0 / 144.0), ("lb/ft2", 1.0 / 144.0), ("ksf", 1000.0 / 144.0),
        ("kPa", MPA / 1000.0), ("kN/m2", MPA / 1000.0), ("Pa", MPA / 1.0e6), ("N/m2", MPA / 1.0e6),
    ];
    /// Line load or weight per length, stored in lbf/in.
    LineLoadK, LineLoad, "a line load", false, [
        ("klf", 1000.0 / 12.0), ("kip/ft", 1000.0 / 12.0), ("plf", 1.0 / 12.0), ("lb/ft", 1.0 / 12.0),
        ("kN/m", 1000.0 * N_PER_M_TO_LBF_PER_IN), ("N/m", N_PER_M_TO_LBF_PER_IN),
    ];
    /// Unit weight (weight per volume), stored in lbf/in³. A mass density in
    /// kg/m³ is turned into weight with standard gravity.
    UnitWeightK, UnitWeight, "a unit weight", false, [
        ("pcf", 1.0 / 1728.0), ("lb/ft3", 1.0 / 1728.0),
        ("kg/m3", G_N * N_PER_M3_TO_LBF_PER_IN3), ("kg/m³", G_N * N_PER_M3_TO_LBF_PER_IN3),
        ("kN/m3", 1000.0 * N_PER_M3_TO_LBF_PER_IN3),
    ];
    /// Force, stored in lbf.
    ForceK, Force, "a force", false, [
        ("lbf", 1.0), ("lb", 1.0), ("kip", 1000.0), ("kips", 1000.0), ("N", 1.0 / N_PER_LBF), ("kN", 1000.0 / N_PER_LBF),
    ];
    /// Moment, stored in lbf·in.
    MomentK, Moment, "a moment", false, [
        ("lb-in", 1.0), ("kip-in", 1000.0), ("kip-ft", 12_000.0), ("lb-ft", 12.0),
        ("kN-m", 1000.0 / N_PER_LBF / M_PER_IN), ("kN·m", 1000.0 / N_PER_LBF / M_PER_IN),
    ];
    /// Duration, stored in hours (fire ratings).
    TimeK, Duration, "a duration", true, [
        ("h", 1.0), ("hr", 1.0), ("hours", 1.0), ("hour", 1.0), ("min", 1.0 / 60.0),
    ];
    /// Price per plan area, stored per in² (in the catalog's own currency).
    PriceK, PricePerArea, "a price per area", false, [
        ("/ft2", 1.0 / 144.0), ("per ft2", 1.0 / 144.0), ("/m2", M_PER_IN * M_PER_IN), ("per m2", M_PER_IN * M_PER_IN),
    ];
}

/// A quantity of kind `K`, held in the internal unit of that kind.
#[derive(Copy, Clone, PartialEq, PartialOrd, Default)]
pub struct Q<K: Kind>(f64, PhantomData<K>);

impl<K: Kind> Q<K> {
    /// A quantity from a value already in the internal unit.
    pub const fn new(value: f64) -> Self {
        Q(value, PhantomData)
    }
    /// The value in the internal unit (in, in², psi, lbf, lbf/in, …).
    pub const fn get(self) -> f64 {
        self.0
    }
    /// The value expressed in `unit` (one of the kind's spellings).
    ///
    /// # Panics
    /// Only on a unit spelling that the kind does not list: a programming
    /// error, never user input.
    pub fn in_unit(self, unit: &str) -> f64 {
        self.0 / factor::<K>(unit).unwrap_or_else(|| panic!("{unit} is not {}", K::NAME))
    }
    /// A quantity from a value in `unit`.
    ///
    /// # Panics
    /// Only on a unit spelling that the kind does not list (a programming error).
    pub fn from_unit(value: f64, unit: &str) -> Self {
        Q::new(value * factor::<K>(unit).unwrap_or_else(|| panic!("{unit} is not {}", K::NAME)))
    }
    /// Parse a user string such as "30 ft 6 in".
    pub fn parse(text: &str) -> Result<Self, UnitError> {
        parse::<K>(text).map(Q::new)
    }
}

impl<K: Kind> serde::Serialize for Q<K> {
    fn serialize<S: serde::Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        s.serialize_f64(self.0)
    }
}

impl<K: Kind> fmt::Debug for Q<K> {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{} {}", self.0, K::UNITS[0].0)
    }
}

impl<K: Kind> Add for Q<K> {
    type Output = Self;
    fn add(self, o: Self) -> Self {
        Q::new(self.0 + o.0)
    }
}
impl<K: Kind> Sub for Q<K> {
    type Output = Self;
    fn sub(self, o: Self) -> Self {
        Q::new(self.0 - o.0)
    }
}
impl<K: Kind> Neg for Q<K> {
    type Output = Self;
    fn neg(self) -> Self {
        Q::new(-self.0)
    }
}
impl<K: Kind> Mul<f64> for Q<K> {
    type Output = Self;
    fn mul(self, k: f64) -> Self {
        Q::new(self.0 * k)
    }
}
impl<K: Kind> Div<f64> for Q<K> {
    type Output = Self;
    fn div(self, k: f64) -> Self {
        Q::new(self.0 / k)
    }
}
impl<K: Kind> Div for Q<K> {
    type Output = f64;
    fn div(self, o: Self) -> f64 {
        self.0 / o.0
    }
}

fn factor<K: Kind>(unit: &str) -> Option<f64> {
    K::UNITS.iter().find(|(u, _)| u.eq_ignore_ascii_case(unit)).map(|&(_, f)| f)
}

/// Why a quantity string could not be read.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum UnitError {
    /// Nothing but blanks.
    #[error("is empty; {expected} is needed, e.g. '{example}'")]
    Empty {
        /// Kind wanted.
        expected: &'static str,
        /// An example in the kind's first unit.
        example: String,
    },
    /// A number with no unit after it.
    #[error("'{text}' has no unit; {expected} needs one of: {units}")]
    NoUnit {
        /// What was written.
        text: String,
        /// Kind wanted.
        expected: &'static str,
        /// Accepted spellings.
        units: String,
    },
    /// A unit plankwise knows, but of another kind.
    #[error("'{text}' is {found}, but {expected} is needed ({units})")]
    WrongKind {
        /// What was written.
        text: String,
        /// The kind the unit belongs to.
        found: &'static str,
        /// Kind wanted.
        expected: &'static str,
        /// Accepted spellings.
        units: String,
    },
    /// A unit nobody knows.
    #[error("'{unit}' in '{text}' is not a unit of {expected}; use one of: {units}")]
    UnknownUnit {
        /// What was written.
        text: String,
        /// The unknown unit.
        unit: String,
        /// Kind wanted.
        expected: &'static str,
        /// Accepted spellings.
        units: String,
    },
    /// Not a number where one was expected.
    #[error("'{text}' does not start with a number; write e.g. '{example}'")]
    BadNumber {
        /// What was written.
        text: String,
        /// An example.
        example: String,
    },
    /// Several terms where the kind takes one ("6000 psi 5 ksi").
    #[error("'{text}' has several values; {expected} takes one number and one unit")]
    NotCompound {
        /// What was written.
        text: String,
        /// Kind wanted.
        expected: &'static str,
    },
    /// Not finite.
    #[error("'{text}' is not a finite number")]
    NotFinite {
        /// What was written.
        text: String,
    },
    /// Several terms out of order, repeated, or a smaller unit's term as
    /// large as the unit before it ("30 ft 99 in", "6 in 30 ft").
    #[error("'{text}' is not a well-formed {}: {why}; write e.g. '{example}'", expected.trim_start_matches("an ").trim_start_matches("a "))]
    BadCompound {
        /// What was written.
        text: String,
        /// Kind wanted.
        expected: &'static str,
        /// What is wrong.
        why: String,
        /// A well-formed example.
        example: &'static str,
    },
}

fn unit_list<K: Kind>() -> String {
    // Show one spelling per distinct factor, to keep the list short.
    let mut shown: Vec<&str> = Vec::new();
    let mut seen: Vec<f64> = Vec::new();
    for &(u, f) in K::UNITS {
        if !seen.iter().any(|&s| (s - f).abs() <= 1e-12 * f.abs()) {
            seen.push(f);
            shown.push(u);
        }
    }
    shown.join(", ")
}

/// Parse a number: "12", "12.5", "-3", "1/2", "1-1/2", "1e3".
fn parse_number(s: &str) -> Option<f64> {
    if let Ok(v) = s.parse::<f64>() {
        return Some(v);
    }
    let (whole, frac) = match s.rsplit_once('-') {
        Some((w, f)) if !w.is_empty() && f.contains('/') => (w.parse::<f64>().ok()?, f),
        _ => (0.0, s),
    };
    let (n, d) = frac.split_once('/')?;
    let n: f64 = n.parse().ok()?;
    let d: f64 = d.parse().ok()?;
    if d == 0.0 {
        return None;
    }
    let sign = if whole < 0.0 { -1.0 } else { 1.0 };
    Some(whole + sign * n / d)
}

/// Split "30ft 6in" / "30 ft 6 in" into (number, unit) terms.
fn terms(text: &str) -> Result<Vec<(String, String)>, ()> {
    let mut out = Vec::new();
    let chars: Vec<char> = text.chars().collect();
    let mut i = 0;
    let is_num = |c: char| c.is_ascii_digit() || matches!(c, '.' | '/' | '-' | '+' | 'e' | 'E');
    while i < chars.len() {
        while i < chars.len() && chars[i].is_whitespace() {
            i += 1;
        }
        if i >= chars.len() {
            break;
        }
        let start = i;
        // number: digits and . / - + e, but 'e' only after a digit
        while i < chars.len() && is_num(chars[i]) && !(matches!(chars[i], 'e' | 'E') && (i == start || !chars[i - 1].is_ascii_digit())) {
            i += 1;
        }
        if i == start {
            return Err(());
        }
        let num: String = chars[start..i].iter().collect();
        while i < chars.len() && chars[i].is_whitespace() {
            i += 1;
        }
        let ustart = i;
        // unit: run until the next digit that follows whitespace (next term)
        while i < chars.len() {
            if chars[i].is_whitespace() {
                let mut j = i;
                while j < chars.len() && chars[j].is_whitespace() {
                    j += 1;
                }
                if j < chars.len() && (chars[j].is_ascii_digit() || chars[j] == '.') {
                    break;
                }
            }
            if i > ustart && (chars[i].is_ascii_digit()) && !chars[i - 1].is_alphabetic() {
                break;
            }
            i += 1;
        }
        let unit: String = chars[ustart..i].iter().collect::<String>().trim().to_string();
        out.push((num, unit));
    }
    Ok(out)
}

/// The printed feet–inch form, `30'-6"` or `30'-6 1/2"` (as
/// [`fmt_ft_in`] writes it), rewritten as terms the parser reads
/// ("30 ft 6-1/2 in"); other text is returned as it is. A whole number and
/// a fraction written apart, "6 1/2 in", become "6-1/2 in".
fn normalise(t: &str) -> String {
    let mut t = t.to_string();
    if let Some((ft, rest)) = t.split_once('\'') {
        let rest = rest.trim();
        if let Some(inch) = rest.strip_prefix('-').and_then(|r| r.trim().strip_suffix('"'))
            && !ft.trim().is_empty()
            && !ft.contains(' ')
        {
            t = format!("{} ft {} in", ft.trim(), inch.trim());
        }
    }
    // "6 1/2" → "6-1/2": a whole number followed by a bare fraction
    let words: Vec<&str> = t.split_whitespace().collect();
    let mut out: Vec<String> = Vec::with_capacity(words.len());
    for w in words {
        let is_frac = w.contains('/') && w.split('/').all(|p| !p.is_empty() && p.chars().all(|c| c.is_ascii_digit()));
        match out.last_mut() {
            Some(prev) if is_frac && prev.chars().all(|c| c.is_ascii_digit()) => {
                prev.push('-');
                prev.push_str(w);
            }
            _ => out.push(w.to_string()),
        }
    }
    out.join(" ")
}

fn parse<K: Kind>(text: &str) -> Result<f64, UnitError> {
    let example = || format!("12 {}", K::UNITS[0].0);
    let t = text.trim();
    if t.is_empty() {
        return Err(UnitError::Empty {
            expected: K::NAME,
            example: example(),
        });
    }
    let norm = normalise(t);
    let parts = terms(&norm).map_err(|()| UnitError::BadNumber {
        text: t.to_string(),
        example: example(),
    })?;
    if parts.len() > 1 && !K::COMPOUND {
        return Err(UnitError::NotCompound {
            text: t.to_string(),
            expected: K::NAME,
        });
    }
    let mut total = 0.0;
    // (factor, value) of the term before, for the compound rules
    let mut before: Option<(f64, &str)> = None;
    for (num, unit) in &parts {
        let v = parse_number(num).ok_or_else(|| UnitError::BadNumber {
            text: t.to_string(),
            example: example(),
        })?;
        if unit.is_empty() {
            return Err(UnitError::NoUnit {
                text: t.to_string(),
                expected: K::NAME,
                units: unit_list::<K>(),
            });
        }
        let f = match factor::<K>(unit) {
            Some(f) => f,
            None => {
                let other = all_kinds()
                    .into_iter()
                    .find(|(_, us)| us.iter().any(|(u, _)| u.eq_ignore_ascii_case(unit)));
                return Err(match other {
                    Some((found, _)) => UnitError::WrongKind {
                        text: t.to_string(),
                        found,
                        expected: K::NAME,
                        units: unit_list::<K>(),
                    },
                    None => UnitError::UnknownUnit {
                        text: t.to_string(),
                        unit: unit.clone(),
                        expected: K::NAME,
                        units: unit_list::<K>(),
                    },
                });
            }
        };
        if parts.len() > 1 {
            let bad = |why: String| UnitError::BadCompound {
                text: t.to_string(),
                expected: K::NAME,
                why,
                example: if K::NAME == "a duration" { "1 h 30 min" } else { "30 ft 6 in" },
            };
            if v < 0.0 {
                return Err(bad("a value in several terms cannot be negative".into()));
            }
            if let Some((fb, ub)) = before {
                if (f - fb).abs() <= 1e-12 * fb {
                    return Err(bad(format!("'{unit}' is given twice")));
                }
                if f > fb {
                    return Err(bad(format!("'{unit}' comes after the smaller '{ub}'; give the larger unit first")));
                }
                if v * f >= fb * (1.0 - 1e-12) {
                    return Err(bad(format!("{} {unit} is a whole {ub} or more", fmt_plain(v))));
                }
            }
            before = Some((f, unit.as_str()));
        }
        total += v * f;
    }
    if !total.is_finite() {
        return Err(UnitError::NotFinite { text: t.to_string() });
    }
    Ok(total)
}

/// A number without trailing zeros, for messages.
fn fmt_plain(v: f64) -> String {
    let s = format!("{v:.6}");
    s.trim_end_matches('0').trim_end_matches('.').to_string()
}

/// The system of units every output of a run is shown in.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum System {
    /// US customary: ft, in, psf, kip, ksi.
    #[default]
    Us,
    /// SI: m, mm, kPa, kN, MPa.
    Si,
}

impl System {
    /// "us" or "si", as the job and the flags write it.
    pub fn name(self) -> &'static str {
        match self {
            System::Us => "us",
            System::Si => "si",
        }
    }
    /// From its name.
    pub fn from_name(s: &str) -> Option<System> {
        match s.to_ascii_lowercase().as_str() {
            "us" => Some(System::Us),
            "si" => Some(System::Si),
            _ => None,
        }
    }
}

/// A number with at most `places` decimals, trailing zeros dropped: what
/// the job writer and the schema print (it reads back as the same value to
/// that many places).
pub fn trim_number(v: f64, places: usize) -> String {
    let s = format!("{v:.places$}");
    let s = if s.contains('.') {
        s.trim_end_matches('0').trim_end_matches('.')
    } else {
        &s
    };
    if s == "-0" { "0".into() } else { s.to_string() }
}

/// Format a length in feet and inches to the nearest 1/16 in: `30'-6 1/2"`.
pub fn fmt_ft_in(len: Length) -> String {
    let sixteenths = (len.get() * 16.0).round() as i64;
    let sign = if sixteenths < 0 { "-" } else { "" };
    let s = sixteenths.abs();
    let ft = s / (12 * 16);
    let rem = s % (12 * 16);
    let inch = rem / 16;
    let mut frac = rem % 16;
    let mut den = 16;
    while frac != 0 && frac % 2 == 0 {
        frac /= 2;
        den /= 2;
    }
    if frac == 0 {
        format!("{sign}{ft}'-{inch}\"")
    } else {
        format!("{sign}{ft}'-{inch} {frac}/{den}\"")
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    // Factors tabulated in NIST SP 811 (2008), Appendix B.8/B.9, given there
    // to seven significant figures; ours follow from the exact definitions,
    // so they must agree to that precision.
    const SP811: f64 = 5e-7;

    #[test]
    fn length_factors_match_nist_sp811() {
        // NIST SP 811 B.8: inch = 2.54 E-02 m, foot = 3.048 E-01 m (exact).
        assert_relative_eq!(Length::parse("1 in").unwrap().in_unit("m"), 0.0254, max_relative = 1e-15);
        assert_relative_eq!(Length::parse("1 ft").unwrap().in_unit("m"), 0.3048, max_relative = 1e-15);
        assert_relative_eq!(Length::parse("203 mm").unwrap().get(), 203.0 / 25.4, max_relative = 1e-15);
        assert_relative_eq!(Length::parse("9.3 m").unwrap().in_unit("ft"), 9.3 / 0.3048, max_relative = 1e-15);
    }

    #[test]
    fn force_and_stress_factors_match_nist_sp811() {
        // NIST SP 811 B.8: pound-force = 4.448 222 E+00 N.
        assert_relative_eq!(Force::parse("1 lbf").unwrap().in_unit("N"), 4.448222, max_relative = SP811);
        // kip = 4.448 222 E+03 N.
        assert_relative_eq!(Force::parse("1 kip").unwrap().in_unit("kN"), 4.448222, max_relative = SP811);
        // psi = 6.894 757 E+03 Pa; ksi = 6.894 757 E+06 Pa.
        assert_relative_eq!(Stress::parse("1 psi").unwrap().in_unit("Pa"), 6894.757, max_relative = SP811);
        assert_relative_eq!(Stress::parse("1 ksi").unwrap().in_unit("MPa"), 6.894757, max_relative = SP811);
        assert_relative_eq!(Stress::parse("41.4 MPa").unwrap().get(), 41.4 / 6.894757e-3, max_relative = SP811);
    }

    #[test]
    fn load_and_density_factors_match_nist_sp811() {
        // NIST SP 811 B.8: pound-force per square foot = 4.788 026 E+01 Pa.
        assert_relative_eq!(AreaLoad::parse("1 psf").unwrap().in_unit("Pa"), 47.88026, max_relative = SP811);
        assert_relative_eq!(
            AreaLoad::parse("2.4 kPa").unwrap().in_unit("psf"),
            2400.0 / 47.88026,
            max_relative = SP811
        );
        // pound-force per foot = 1.459 390 E+01 N/m.
        assert_relative_eq!(LineLoad::parse("1 plf").unwrap().in_unit("N/m"), 14.59390, max_relative = SP811);
        assert_relative_eq!(
            LineLoad::parse("7.3 kN/m").unwrap().in_unit("klf"),
            7300.0 / 14.59390 / 1000.0,
            max_relative = SP811
        );
        // pound per cubic foot = 1.601 846 E+01 kg/m³ (mass); as weight with g_n.
        assert_relative_eq!(UnitWeight::parse("1 pcf").unwrap().in_unit("kg/m3"), 16.01846, max_relative = SP811);
        assert_relative_eq!(
            UnitWeight::parse("2400 kg/m3").unwrap().in_unit("pcf"),
            2400.0 / 16.01846,
            max_relative = SP811
        );
    }

    #[test]
    fn area_inertia_factors_match_nist_sp811() {
        // NIST SP 811 B.8: square inch = 6.4516 E-04 m² (exact).
        assert_relative_eq!(Area::parse("1 in2").unwrap().in_unit("m2"), 6.4516e-4, max_relative = 1e-14);
        assert_relative_eq!(Area::parse("98.7 mm2").unwrap().get(), 98.7 / 645.16, max_relative = 1e-14);
        assert_relative_eq!(Area::parse("0.153 in2").unwrap().get(), 0.153, max_relative = 1e-15);
        // inch⁴ (second moment of area) = 4.162 314 E-07 m⁴.
        assert_relative_eq!(Inertia::parse("1 in4").unwrap().in_unit("m4"), 4.162314e-7, max_relative = SP811);
        // inch³ (section modulus) = 1.638 706 E-05 m³.
        assert_relative_eq!(
            SectionModulus::parse("1 in3").unwrap().in_unit("m3"),
            1.638706e-5,
            max_relative = SP811
        );
        // foot-pound-force = 1.355 818 E+00 N·m.
        assert_relative_eq!(
            Moment::parse("1 lb-ft").unwrap().in_unit("kN-m") * 1000.0,
            1.355818,
            max_relative = SP811
        );
    }

    #[test]
    fn compound_and_fractional_lengths() {
        assert_relative_eq!(Length::parse("30 ft 6 in").unwrap().get(), 366.0);
        assert_relative_eq!(Length::parse("30ft 6in").unwrap().get(), 366.0);
        assert_relative_eq!(Length::parse("1-1/2 in").unwrap().get(), 1.5);
        assert_relative_eq!(Length::parse("3/4 in").unwrap().get(), 0.75);
        assert_relative_eq!(Length::parse("8 in").unwrap().get(), 8.0);
        assert_relative_eq!(Length::parse("2 ft 1-3/4 in").unwrap().get(), 25.75);
        assert_relative_eq!(Duration::parse("2 h").unwrap().get(), 2.0);
        assert_relative_eq!(Duration::parse("1 h 30 min").unwrap().get(), 1.5);
        assert_relative_eq!(Stress::parse("6000 psi").unwrap().get(), 6000.0);
        assert_relative_eq!(Stress::parse("6 ksi").unwrap().get(), 6000.0);
        assert_relative_eq!(UnitWeight::parse("150 pcf").unwrap().get(), 150.0 / 1728.0);
        assert_relative_eq!(LineLoad::parse("0.5 klf").unwrap().get(), 500.0 / 12.0);
        assert_relative_eq!(AreaLoad::parse("50 psf").unwrap().get(), 50.0 / 144.0);
        assert_relative_eq!(Length::parse("1e1 in").unwrap().get(), 10.0);
    }

    #[test]
    fn wrong_kind_names_both_kinds() {
        let e = Stress::parse("50 ft").unwrap_err();
        assert_eq!(
            e.to_string(),
            "'50 ft' is a length, but a stress is needed (psi, ksi, MPa, GPa, kPa, Pa)"
        );
        let e = Length::parse("12").unwrap_err();
        assert!(e.to_string().contains("has no unit"), "{e}");
        let e = Length::parse("12 furlongs").unwrap_err();
        assert!(e.to_string().contains("'furlongs'"), "{e}");
        let e = Stress::parse("6000 psi 5 ksi").unwrap_err();
        assert!(matches!(e, UnitError::NotCompound { .. }));
        let e = Length::parse("abc in").unwrap_err();
        assert!(matches!(e, UnitError::BadNumber { .. }), "{e:?}");
        assert!(matches!(Length::parse("  ").unwrap_err(), UnitError::Empty { .. }));
        assert!(matches!(Length::parse("1e400 in").unwrap_err(), UnitError::NotFinite { .. }));
    }

    #[test]
    fn feet_inches_display() {
        assert_eq!(fmt_ft_in(Length::new(366.5)), "30'-6 1/2\"");
        assert_eq!(fmt_ft_in(Length::new(360.0)), "30'-0\"");
    }

    #[test]
    fn the_printed_feet_inch_form_reads_back() {
        assert_relative_eq!(Length::parse("30'-6\"").unwrap().get(), 366.0);
        assert_relative_eq!(Length::parse("30'-6 1/2\"").unwrap().get(), 366.5);
        assert_relative_eq!(Length::parse("30' - 0\"").unwrap().get(), 360.0);
        assert_relative_eq!(Length::parse("6 1/2 in").unwrap().get(), 6.5);
        assert_relative_eq!(Length::parse("30 ft 6 1/2 in").unwrap().get(), 366.5);
    }

    #[test]
    fn compound_quantities_are_well_formed_or_refused() {
        for bad in ["30 ft 99 in", "6 in 30 ft", "30 ft 12 in", "1 ft 2 ft", "2 in 3 in", "30'-13\""] {
            let e = Length::parse(bad).unwrap_err();
            assert!(matches!(e, UnitError::BadCompound { .. }), "{bad}: {e}");
        }
        assert!(Length::parse("30 ft -6 in").is_err());
        let e = Length::parse("30 ft 99 in").unwrap_err().to_string();
        assert_eq!(
            e,
            "'30 ft 99 in' is not a well-formed length: 99 in is a whole ft or more; write e.g. '30 ft 6 in'"
        );
        assert!(Duration::parse("1 h 90 min").is_err());
        assert_relative_eq!(Duration::parse("1 h 30 min").unwrap().get(), 1.5);
    }
}

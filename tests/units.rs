//! One run in two systems: every command prints the same numbers in US and
//! in SI, each pair related by the factor of its unit (NIST SP 811 factors,
//! checked in `src/units/display.rs`), and an SI run prints no US unit.

use std::process::Command;

use plankwise::units::System;
use plankwise::units::display::{self, find, key};
use proptest::prelude::*;
use serde_json::Value;

fn run(args: &[&str]) -> (i32, String, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_plankwise"))
        .args(args)
        .current_dir(env!("CARGO_MANIFEST_DIR"))
        .output()
        .unwrap();
    (
        out.status.code().unwrap(),
        String::from_utf8(out.stdout).unwrap(),
        String::from_utf8(out.stderr).unwrap(),
    )
}

fn both(args: &[&str]) -> (String, String) {
    let with = |u: &str| {
        let mut a = args.to_vec();
        a.extend(["--units", u]);
        let (code, out, err) = run(&a);
        assert!(code == 0 || code == 1, "{a:?}: {err}");
        out
    };
    (with("us"), with("si"))
}

fn close(us: f64, si: f64, factor: f64, path: &str) {
    let want = us * factor;
    assert!(
        (si - want).abs() <= 1e-9 * want.abs().max(1e-9),
        "{path}: SI {si} is not US {us} × {factor} = {want}"
    );
}

/// Walk a US and an SI JSON value side by side: every key of the US run
/// is in the SI run under its SI name, each number related by the factor
/// of its unit (1 for ratios and counts).
fn pair(us: &Value, si: &Value, path: &str) -> usize {
    match (us, si) {
        (Value::Object(a), Value::Object(b)) => {
            let unit = a.get("unit").and_then(|u| u.as_str()).and_then(find);
            if let Some(r) = unit {
                assert_eq!(b["unit"], r.si, "{path}.unit");
            }
            let mut n = 0;
            for (k, va) in a {
                let sk = key(k, System::Si);
                let vb = b.get(&sk).unwrap_or_else(|| panic!("{path}: no '{sk}' in the SI run for '{k}'"));
                let factor = match (unit, k.as_str()) {
                    (Some(r), "demand" | "capacity") => Some(r.factor),
                    _ if sk != *k => Some(
                        display::TABLE
                            .iter()
                            .filter(|r| k.ends_with(r.us_key))
                            .max_by_key(|r| r.us_key.len())
                            .unwrap()
                            .factor,
                    ),
                    _ => None,
                };
                n += match (factor, va, vb) {
                    (Some(f), Value::Number(x), Value::Number(y)) => {
                        close(x.as_f64().unwrap(), y.as_f64().unwrap(), f, &format!("{path}.{k}"));
                        1
                    }
                    (Some(f), Value::Array(_), Value::Array(_)) => scaled(va, vb, f, &format!("{path}.{k}")),
                    (_, _, _) => pair(va, vb, &format!("{path}.{k}")),
                };
            }
            n
        }
        (Value::Array(a), Value::Array(b)) => {
            assert_eq!(a.len(), b.len(), "{path}");
            a.iter()
                .zip(b)
                .enumerate()
                .map(|(i, (x, y))| pair(x, y, &format!("{path}[{i}]")))
                .sum()
        }
        (Value::Number(x), Value::Number(y)) => {
            close(x.as_f64().unwrap(), y.as_f64().unwrap(), 1.0, path);
            1
        }
        (Value::String(_), Value::String(y)) => {
            no_us_unit(y, path);
            0
        }
        (x, y) => {
            assert_eq!(x, y, "{path}");
            0
        }
    }
}

/// Numbers (in arrays, at any depth) related by one factor.
fn scaled(us: &Value, si: &Value, f: f64, path: &str) -> usize {
    match (us, si) {
        (Value::Number(x), Value::Number(y)) => {
            close(x.as_f64().unwrap(), y.as_f64().unwrap(), f, path);
            1
        }
        (Value::Array(a), Value::Array(b)) => {
            assert_eq!(a.len(), b.len(), "{path}");
            a.iter().zip(b).map(|(x, y)| scaled(x, y, f, path)).sum()
        }
        (x, y) => {
            assert_eq!(x, y, "{path}");
            0
        }
    }
}

/// The demo catalog's names of sections and patterns: the user's own
/// words, printed as written in any system.
fn without_names(text: &str) -> String {
    let cat = plankwise::catalog::Catalog::from_str(plankwise::catalog::DEMO_US, "demo-us.toml").unwrap();
    // wrapped lines joined, so a name broken over two lines is found
    let mut t = text.split_whitespace().collect::<Vec<_>>().join(" ");
    for s in &cat.sections {
        t = t.replace(&s.designation, "");
        for p in &s.patterns {
            t = t.replace(&p.designation, "");
        }
    }
    t
}

/// No "number US-unit" in SI text (names the user wrote aside).
fn no_us_unit(text: &str, what: &str) {
    let text = &without_names(text);
    let si = display::localize(text, System::Si);
    assert_eq!(&si, text, "{what}: US units left in an SI output:\n{text}");
    for bad in [" psf", " psi", " ksi", " kip", " klf", " plf", " pcf", "'-"] {
        let hit = text
            .match_indices(bad)
            .find(|(i, _)| text[..*i].ends_with(|c: char| c.is_ascii_digit()));
        assert!(hit.is_none(), "{what}: '{bad}' in an SI output:\n{text}");
    }
}

fn json_pair(args: &[&str]) -> usize {
    let mut a = args.to_vec();
    a.push("--json");
    let (us, si) = both(&a);
    let us: Value = serde_json::from_str(&us).unwrap();
    let si: Value = serde_json::from_str(&si).unwrap();
    pair(&us, &si, &args.join(" "))
}

#[test]
fn every_json_output_pairs_us_and_si_by_the_factor() {
    let n = json_pair(&["rank", "--job", "demo", "--top", "3"])
        + json_pair(&["sections", "--topping", "2 in"])
        + json_pair(&["envelope", "--section", "plank-8in-4ft", "--pattern", "6x1/2", "--sdl", "20 psf"])
        + json_pair(&["spanmap", "--job", "demo", "--bay", "Level 1 retail", "--spans", "20 ft..30 ft"])
        + json_pair(&[
            "check",
            "--section",
            "tee-24in-10ft",
            "--pattern",
            "8-straight",
            "--span",
            "34 ft",
            "--use",
            "roof",
            "--roof-live",
            "20 psf",
            "--point",
            "p=3 kip, at=12 ft, kind=dead",
            "--opening",
            "from=20 ft, to=23 ft, across=36 in, wide=16 in, header=0.15 klf",
        ]);
    assert!(n > 500, "{n} numbers compared");
}

#[test]
fn every_text_output_in_si_has_no_us_unit() {
    let dir = std::env::temp_dir().join(format!("plankwise-units-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    for args in [
        vec!["rank", "--job", "demo"],
        vec!["sections", "--topping", "50 mm"],
        vec!["envelope", "--section", "plank-8in-4ft", "--pattern", "6x1/2"],
        vec!["spanmap", "--spans", "6 m..9 m", "--step", "0.5 m", "--live", "2 kPa"],
        vec![
            "check",
            "--section",
            "plank-8in-4ft",
            "--pattern",
            "6x1/2",
            "--span",
            "8 m",
            "--live",
            "2.4 kPa",
        ],
        vec!["rank", "--job", "demo", "--csv"],
        vec!["envelope", "--section", "plank-8in-4ft", "--pattern", "6x1/2", "--csv"],
    ] {
        let (_, si) = both(&args);
        no_us_unit(&si, &args.join(" "));
    }
    for fmt in ["text", "md", "csv"] {
        let out = dir.join(format!("s.{fmt}"));
        let (code, _, err) = run(&[
            "shortlist",
            "--job",
            "demo",
            "-o",
            out.to_str().unwrap(),
            "--format",
            fmt,
            "--force",
            "--units",
            "si",
        ]);
        assert!(code == 0 || code == 1, "{err}");
        let text = std::fs::read_to_string(&out).unwrap();
        assert!(
            (text.contains("kPa") && text.contains(" mm")) || text.contains("weight_kpa,depth_mm"),
            "{text}"
        );
        no_us_unit(&text, fmt);
    }
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn the_job_names_the_units_and_the_flag_overrides() {
    let dir = std::env::temp_dir().join(format!("plankwise-units-job-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let job = dir.join("j.toml");
    let text = plankwise::job::DEMO_JOB.replacen("[job]", "[job]\nunits = \"si\"", 1);
    std::fs::write(&job, text).unwrap();
    let (_, out, _) = run(&["rank", "--job", job.to_str().unwrap(), "--top", "1"]);
    assert!(out.contains(" m;") && out.contains("kPa"), "the job's units: {out}");
    let (_, out, _) = run(&["rank", "--job", job.to_str().unwrap(), "--top", "1", "--units", "us"]);
    assert!(out.contains("'-") && out.contains("psf"), "the flag first: {out}");
    std::fs::remove_dir_all(&dir).ok();
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 6, ..ProptestConfig::default() })]
    /// Any span and loads: the check of one entry gives the same numbers in both systems.
    #[test]
    fn a_check_reads_the_same_in_both_systems(span in 14.0f64..36.0, live in 20.0f64..150.0, sdl in 0.0f64..40.0) {
        let span = format!("{span:.2} ft");
        let live = format!("{live:.1} psf");
        let sdl = format!("{sdl:.1} psf");
        let n = json_pair(&["check", "--section", "plank-10in-4ft", "--pattern", "7x1/2", "--span", &span, "--live", &live, "--sdl", &sdl]);
        prop_assert!(n > 100);
    }
}

#[test]
fn a_metric_file_is_told_its_problems_in_metric_units() {
    use plankwise::catalog::{Catalog, DEMO_SI};
    let bad = DEMO_SI.replace(
        r#"cores = { shape = "circle", count = 6, diameter = "160 mm", spacing = "186 mm" }"#,
        r#"cores = { shape = "circle", count = 6, diameter = "175 mm", spacing = "186 mm" }"#,
    );
    assert_ne!(bad, DEMO_SI);
    let e = Catalog::from_str(&bad, "si.toml").unwrap_err().to_string();
    assert!(
        e.contains("spacing 186.0 mm less core width 175.0 mm leaves 10.9 mm of web, at least 19.0 mm needed"),
        "{e}"
    );
    // the user's own text, quoted, stays as written; a US file stays in US units
    let e = Catalog::from_str(&DEMO_SI.replacen("\"1190 mm\"", "\"47 in\" ", 1), "si.toml");
    if let Err(e) = e {
        assert!(!e.to_string().contains("'1193.8 mm'"), "{e}");
    }
    let us = plankwise::catalog::DEMO_US.replacen(
        r#"diameter = "5.5 in", spacing = "7.5 in""#,
        r#"diameter = "7.0 in", spacing = "7.5 in""#,
        1,
    );
    let e = Catalog::from_str(&us, "us.toml").unwrap_err().to_string();
    assert!(e.contains(" in ") && !e.contains(" mm"), "{e}");
}

#[test]
fn a_refused_flag_says_its_range_in_the_units_of_the_run() {
    let (code, _, err) = run(&["rank", "--span", "100 m", "--units", "si"]);
    assert_eq!(code, 2);
    assert!(err.contains("--span: '100 m' is outside the allowed range 0.61 to 61 m"), "{err}");
    let (_, _, err) = run(&["rank", "--span", "100 m"]);
    assert!(err.contains("allowed range 2 to 200 ft"), "{err}");
    // the SI demo catalog names SI: its runs say SI without the flag
    let (_, _, err) = run(&["rank", "catalog/demo-si.toml", "--live", "9000 kPa", "--span", "8 m"]);
    assert!(err.contains("kPa") && !err.contains("psf"), "{err}");
}

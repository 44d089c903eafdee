//! Camber with age, end to end: the bay's erection age reaches the
//! ACI 209R-92 / age-adjusted effective modulus camber of `check`, which
//! prints it beside the multipliers.

use std::process::Command;

fn check_json(extra: &[&str]) -> serde_json::Value {
    let mut args = vec![
        "check",
        "--section",
        "plank-8in-4ft",
        "--pattern",
        "6x1/2",
        "--span",
        "26 ft",
        "--sdl",
        "20 psf",
        "--live",
        "50 psf",
        "--json",
    ];
    args.extend(extra);
    let out = Command::new(env!("CARGO_BIN_EXE_plankwise")).args(&args).output().unwrap();
    assert!(out.status.success(), "{}", String::from_utf8_lossy(&out.stderr));
    serde_json::from_slice(&out.stdout).unwrap()
}

#[test]
fn the_erection_age_sets_the_aged_camber() {
    let j30 = check_json(&[]);
    let j90 = check_json(&["--erection-age", "90"]);
    let a30 = &j30["aged_camber"];
    let a90 = &j90["aged_camber"];
    assert_eq!(a30["erection_age_days"], 30.0, "default 30 d (common practice, no source)");
    assert_eq!(a90["erection_age_days"], 90.0);
    // the same member: the same release camber, more creep by 90 d
    assert_eq!(a30["release_in"], a90["release_in"]);
    assert!(a90["creep_erection"].as_f64().unwrap() > a30["creep_erection"].as_f64().unwrap());
    assert_eq!(a30["creep_final"], a90["creep_final"]);
    // the release camber is the multipliers' too (both start from the elastic values)
    let rel = j30["camber_release_in"].as_f64().unwrap();
    assert!((a30["release_in"].as_f64().unwrap() - rel).abs() < 1e-12);
    // the library's formula on the member's own elastic parts
    let p = j30["camber_prestress_release_in"].as_f64().unwrap();
    let w = j30["defl_self_release_in"].as_f64().unwrap();
    let phi = a30["creep_erection"].as_f64().unwrap();
    let eta = a30["loss_erection"].as_f64().unwrap();
    let want = p * (1.0 + phi) - eta * p * (1.0 + 0.8 * phi) - w * (1.0 + phi);
    assert!((a30["erection_in"].as_f64().unwrap() - want).abs() < 1e-9, "{want} {a30}");
    // a refused age says what is allowed, as every criterion does
    let out = Command::new(env!("CARGO_BIN_EXE_plankwise"))
        .args([
            "check",
            "--section",
            "plank-8in-4ft",
            "--pattern",
            "6x1/2",
            "--span",
            "26 ft",
            "--erection-age",
            "1",
        ])
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(2));
    assert!(
        String::from_utf8_lossy(&out.stderr).contains("--erection-age"),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
}

#[test]
fn the_check_table_shows_both_methods_side_by_side() {
    let out = Command::new(env!("CARGO_BIN_EXE_plankwise"))
        .args([
            "check",
            "--section",
            "plank-8in-4ft",
            "--pattern",
            "6x1/2",
            "--span",
            "26 ft",
            "--live",
            "50 psf",
        ])
        .output()
        .unwrap();
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.contains("With age   release"), "{text}");
    assert!(text.contains("erection at 30 d") && text.contains("(multipliers"), "{text}");
    assert!(text.contains("ACI 209R-92 creep (steam cured"), "{text}");
}

fn check(v: &serde_json::Value, id: &str) -> serde_json::Value {
    v["checks"]
        .as_array()
        .unwrap()
        .iter()
        .find(|c| c["id"] == id)
        .unwrap_or_else(|| panic!("{id}"))
        .clone()
}

#[test]
fn units_of_other_ages_or_strands_camber_apart() {
    // one unit, one age: no difference
    let j = check_json(&[]);
    assert_eq!(check(&j, "differential_camber")["demand"], 0.0);
    // units erected at 30 and 90 days: the difference is the camber gained
    // from 30 to 90 days (the age-adjusted method, each at its own erection)
    let j = check_json(&["--erection-spread", "60"]);
    let d = check(&j, "differential_camber");
    let at90 = check_json(&["--erection-age", "90"])["aged_camber"]["erection_in"]
        .as_f64()
        .unwrap();
    let at30 = j["aged_camber"]["erection_in"].as_f64().unwrap();
    assert!((d["demand"].as_f64().unwrap() - (at90 - at30).abs()).abs() < 1e-12, "{d}");
    assert_eq!(d["capacity"], 0.75, "¾ in by default (common practice, no source)");
    // a tight limit makes the entry fail, with its reason
    let out = Command::new(env!("CARGO_BIN_EXE_plankwise"))
        .args([
            "check",
            "--section",
            "plank-8in-4ft",
            "--pattern",
            "6x1/2",
            "--span",
            "26 ft",
            "--erection-spread",
            "300",
            "--camber-limit",
            "0.1 in",
        ])
        .output()
        .unwrap();
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(
        text.contains("Camber difference between units at erection") && text.contains("NOT VIABLE"),
        "{text}"
    );
}

#[test]
fn a_unit_an_opening_cuts_cambers_less_than_its_neighbours() {
    // a double tee whose opening cuts a stem's strands: two units analysed
    let out = Command::new(env!("CARGO_BIN_EXE_plankwise"))
        .args([
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
            "--opening",
            "from=14 ft, to=18 ft, across=20 in, wide=24 in",
            "--json",
        ])
        .output()
        .unwrap();
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    let d = check(&v, "differential_camber");
    assert!(v["units"].as_array().unwrap().len() > 1, "{}", v["units"]);
    assert!(d["demand"].as_f64().unwrap() > 0.0, "{d}");
    assert!(d["note"].as_str().unwrap().contains("the units analysed"), "{d}");
}

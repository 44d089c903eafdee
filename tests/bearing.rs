//! Bearing, end to end: the Table 16.2.6.2 minimum length (values from
//! memory, high confidence) and the §22.8 bearing strength by hand.

use std::process::Command;

fn run(args: &[&str]) -> (i32, String, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_plankwise")).args(args).output().unwrap();
    (
        out.status.code().unwrap(),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
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
fn a_short_bearing_makes_the_member_not_viable_with_its_reason() {
    // a 46 ft double tee on 2 in: ℓn = 552 − 2 = 550 in, the table asks max(ℓn/180, 3 in) = 3.06 in
    let (_, out, _) = run(&[
        "rank",
        "--span",
        "46 ft",
        "--live",
        "30 psf",
        "--families",
        "double-tee",
        "--bearing",
        "2 in",
        "--top",
        "40",
    ]);
    assert!(
        out.contains("Bearing length at least the minimum: needs 3.06 in, has 2.00 in"),
        "{out}"
    );
    assert!(
        out.contains("NO VIABLE MEMBER") || !out.contains("tee-24in-10ft / 8-straight  "),
        "{out}"
    );
    // on 4 in it passes and reports its margin
    let (code, out, err) = run(&[
        "check",
        "--section",
        "tee-24in-10ft",
        "--pattern",
        "8-straight",
        "--span",
        "46 ft",
        "--live",
        "30 psf",
        "--json",
    ]);
    assert_eq!(code, 0, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    let b = check(&v, "bearing_length");
    // ℓn = 46 ft − 4 in = 548 in; 548/180 = 3.044 in
    assert!((b["demand"].as_f64().unwrap() - 548.0 / 180.0).abs() < 1e-9, "{b}");
    assert_eq!(b["capacity"], 4.0);
    assert!(b["note"].as_str().unwrap().contains("from memory"), "{b}");
}

#[test]
fn bearing_strength_by_hand() {
    // plank-8in-4ft on 4 in: A1 = 48 × (4 − ½) = 168 in²; f′c 5000 psi;
    // φBn = 0.65 × 0.85 × 5000 × 168 = 464.1 kip (ACI 318-19 22.8.3.2).
    // Bu: 24 ft span, 20 psf SDL, 40 psf live, self 61.66 psf (the demo's
    // own weight, from `sections`): 1.2(61.66 + 20) + 1.6(40) = 161.99 psf
    // × 4 ft × 12 ft = 7.776 kip.
    let (code, out, err) = run(&[
        "check",
        "--section",
        "plank-8in-4ft",
        "--pattern",
        "6x1/2",
        "--span",
        "24 ft",
        "--sdl",
        "20 psf",
        "--live",
        "40 psf",
        "--json",
    ]);
    assert_eq!(code, 0, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    let b = check(&v, "bearing_stress");
    assert!(
        (b["capacity"].as_f64().unwrap() - 0.65 * 0.85 * 5000.0 * 168.0 / 1000.0).abs() < 1e-6,
        "{b}"
    );
    let self_psf = 61.656_961_808_167_49;
    let wu = 1.2 * (self_psf + 20.0) + 1.6 * 40.0;
    // the member is span + bearing long: its self-weight reaction is over the member length
    let bu_span = wu * 4.0 * 12.0 / 1000.0;
    let bu = b["demand"].as_f64().unwrap();
    assert!((bu - bu_span).abs() / bu_span < 0.02, "{bu} against {bu_span}");
    // a narrower pad given by the bay reduces the area in proportion
    let (_, out, _) = run(&[
        "check",
        "--section",
        "plank-8in-4ft",
        "--pattern",
        "6x1/2",
        "--span",
        "24 ft",
        "--pad-width",
        "12 in",
        "--json",
    ]);
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    let b = check(&v, "bearing_stress");
    assert!(
        (b["capacity"].as_f64().unwrap() - 0.65 * 0.85 * 5000.0 * 12.0 * 3.5 / 1000.0).abs() < 1e-6,
        "{b}"
    );
}

#[test]
fn a_named_pad_takes_the_service_reaction_over_its_area() {
    // plank-8in-4ft, 24 ft span, 20 psf SDL, 40 psf live, on a 4 in bearing
    // with an elastomeric pad the width of the unit: the service reaction
    // is half the member's weight and loads over the span (the engine's
    // statics carry the self-weight between the bearing centres; the 2 in
    // beyond each is 0.7 % of this reaction): (61.657 + 60) × 4 × 24 / 2
    // = 5839.5 lb, over 48 × 3.5 = 168 in²: 34.76 psi against 800 psi
    // (PCI range, from memory, low confidence).
    let (code, out, err) = run(&[
        "check",
        "--section",
        "plank-8in-4ft",
        "--pattern",
        "6x1/2",
        "--span",
        "24 ft",
        "--sdl",
        "20 psf",
        "--live",
        "40 psf",
        "--pad",
        "elastomeric",
        "--json",
    ]);
    assert_eq!(code, 0, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    let p = check(&v, "pad_pressure");
    let want = (61.656_961_808_167_49 + 60.0) * 4.0 * 24.0 / 2.0 / 168.0;
    assert!((p["demand"].as_f64().unwrap() - want).abs() < 1e-3 * want, "{p} against {want}");
    assert_eq!(p["capacity"], 800.0);
    // no pad named: no pad check
    let (_, out, _) = run(&[
        "check",
        "--section",
        "plank-8in-4ft",
        "--pattern",
        "6x1/2",
        "--span",
        "24 ft",
        "--json",
    ]);
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    assert!(v["checks"].as_array().unwrap().iter().all(|c| c["id"] != "pad_pressure"));
}

//! `plankwise check` as a user runs it.

use std::process::Command;

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

const BASE: &[&str] = &[
    "check",
    "--section",
    "plank-8in-4ft",
    "--pattern",
    "6x1/2",
    "--span",
    "25 ft",
    "--sdl",
    "15 psf",
    "--live",
    "50 psf",
];

#[test]
fn the_table_names_every_clause_and_the_sign_convention() {
    let (code, out, err) = run(BASE);
    assert_eq!(code, 0, "{err}");
    for frag in [
        "ACI 318-19 22.2, 22.3",
        "ACI 318-19 24.5.3.1",
        "ACI 318-19 24.5.3.2",
        "ACI 318-19 24.5.2.1",
        "ACI 318-19 24.5.4.1",
        "ACI 318-19 22.5.6.3",
        "ACI 318-19 7.6.2.1",
        "ACI 318-19 Table 20.3.2.5.1",
        "ACI 318-19 25.2.3",
        "Zia et al. 1979",
        "compression positive, tension negative",
        "Result     VIABLE",
        "the engineer of record make the final design",
    ] {
        assert!(out.contains(frag), "missing '{frag}' in\n{out}");
    }
}

#[test]
fn json_keys_carry_units() {
    let mut args = BASE.to_vec();
    args.push("--json");
    let (code, out, _) = run(&args);
    assert_eq!(code, 0);
    let j: serde_json::Value = serde_json::from_str(&out).unwrap();
    for key in [
        "phi_mn_kipft",
        "mu_kipft",
        "mcr_kipft",
        "f_bottom_service_psi",
        "f_top_service_psi",
        "service_class",
        "fse_ksi",
        "loss_total_ksi",
        "loss_es_ksi",
        "loss_cr_ksi",
        "loss_sh_ksi",
        "loss_re_ksi",
        "phi_vn_kip",
        "vu_kip",
        "transfer_length_in",
        "member_length_ft",
        "checks",
        "stations",
        "sign_convention",
    ] {
        assert!(j.get(key).is_some(), "missing {key}");
    }
    assert_eq!(j["service_class"], "U");
    let loss = j["loss_es_ksi"].as_f64().unwrap()
        + j["loss_cr_ksi"].as_f64().unwrap()
        + j["loss_sh_ksi"].as_f64().unwrap()
        + j["loss_re_ksi"].as_f64().unwrap();
    assert!((loss - j["loss_total_ksi"].as_f64().unwrap()).abs() < 1e-9);
    let st = &j["stations"].as_array().unwrap()[0];
    for key in [
        "x_ft",
        "mu_kipft",
        "phi_mn_kipft",
        "vu_kip",
        "f_top_release_psi",
        "f_bottom_service_psi",
    ] {
        assert!(st.get(key).is_some(), "station key {key}");
    }
    let checks = j["checks"].as_array().unwrap();
    for c in checks {
        for key in [
            "id",
            "title",
            "clause",
            "demand",
            "capacity",
            "unit",
            "ratio",
            "pass",
            "station_ft",
            "note",
        ] {
            assert!(c.get(key).is_some(), "check key {key}");
        }
    }
}

#[test]
fn bad_flags_are_refused_with_the_allowed_values() {
    let mut a = BASE.to_vec();
    a[2] = "plank-8in-4f";
    let (code, _, err) = run(&a);
    assert_eq!(code, 2);
    assert!(err.contains("no section 'plank-8in-4f' (did you mean 'plank-8in-4ft'?)"), "{err}");
    let mut a = BASE.to_vec();
    a[4] = "6x1/3";
    let (code, _, err) = run(&a);
    assert_eq!(code, 2);
    assert!(err.contains("has no pattern '6x1/3'"), "{err}");
    let mut a = BASE.to_vec();
    a[6] = "25 psf";
    let (code, _, err) = run(&a);
    assert_eq!(code, 2);
    assert!(err.contains("--span: '25 psf' is an area load, but a length is needed"), "{err}");
    let mut a = BASE.to_vec();
    a.extend(["--class", "X"]);
    let (code, _, err) = run(&a);
    assert_eq!(code, 2);
    assert!(err.contains("--class: 'X' is not allowed; use one of: U, T, C"), "{err}");
    let mut a = BASE.to_vec();
    a.extend(["--line-dead", "0.8 klf at 10 ft"]);
    let (code, _, err) = run(&a);
    assert_eq!(code, 2);
    assert!(err.contains("should read like"), "{err}");
}

#[test]
fn a_wall_line_load_raises_the_moment() {
    let (_, plain, _) = run(&[BASE, &["--json"]].concat());
    let (_, wall, _) = run(&[BASE, &["--line-dead", "0.8 klf @ 12.5 ft", "--json"]].concat());
    let a: serde_json::Value = serde_json::from_str(&plain).unwrap();
    let b: serde_json::Value = serde_json::from_str(&wall).unwrap();
    // P = 0.8 klf × 4 ft = 3.2 kip at midspan: 1.2 P L / 4 = 24 kip-ft more (ASCE 7-16 2.3.1 comb. 2)
    let extra = b["mu_kipft"].as_f64().unwrap() - a["mu_kipft"].as_f64().unwrap();
    assert!((extra - 1.2 * 3.2 * 25.0 / 4.0).abs() < 1e-6, "{extra}");
}

#[test]
fn a_long_span_fails_and_says_why() {
    let mut a = BASE.to_vec();
    a[6] = "38 ft";
    let (code, out, _) = run(&a);
    assert_eq!(code, 0, "check reports; only rank decides exit 1");
    assert!(out.contains("NOT VIABLE; first failure:"), "{out}");
}

//! The binary on good input: the default run, `validate`, `sections`.

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

#[test]
fn default_run_prints_the_demo_catalog_and_the_cautions() {
    let (code, out, err) = run(&[]);
    assert_eq!(code, 0, "{err}");
    assert!(out.contains("Demo floor and roof members (US customary)"));
    assert!(out.contains("12 sections, 33 patterns"), "{out}");
    assert!(out.contains("plank-8in-4ft"));
    assert!(out.contains("The supplier's engineer and the engineer of record make the final design."));
}

#[test]
fn demo_catalogs_validate_cleanly() {
    for (file, counts) in [
        ("catalog/demo-us.toml", "12 sections, 33 patterns"),
        ("catalog/demo-si.toml", "6 sections, 15 patterns"),
    ] {
        let (code, out, err) = run(&["validate", file]);
        assert_eq!(code, 0, "{err}");
        assert!(out.contains(counts), "{out}");
        assert!(out.contains("0 warning(s)"), "{out}");
        assert!(err.is_empty(), "{err}");
    }
}

#[test]
fn sections_json_keys_carry_units() {
    let (code, out, _) = run(&["sections", "catalog/demo-us.toml", "--json"]);
    assert_eq!(code, 0);
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    let first = &v[0];
    for key in [
        "id",
        "family",
        "area_in2",
        "yb_in",
        "yt_in",
        "ix_in4",
        "sb_in3",
        "st_in3",
        "weight_plf",
        "weight_psf",
        "vs_ratio_in",
        "equiv_thickness_in",
        "net_thickness_in",
        "top_flange_in",
        "bottom_flange_in",
        "web_width_min_in",
        "perimeter_in",
    ] {
        assert!(first.get(key).is_some(), "missing {key}");
    }
    assert_eq!(first["id"], "plank-6in-4ft");
    assert_eq!(first["family"], "hollow-core");
    // 48 × 6 less seven 4 in circles less a 3 in² keyway (hand calculation)
    let a = 288.0 - 7.0 * std::f64::consts::PI * 4.0 - 3.0;
    assert!((first["area_in2"].as_f64().unwrap() - a).abs() < 1e-9);
}

#[test]
fn sections_with_a_topping_add_the_composite_section() {
    let (code, out, err) = run(&[
        "sections",
        "catalog/demo-us.toml",
        "--json",
        "--topping",
        "2 in",
        "--topping-mix",
        "topping-4000",
    ]);
    assert_eq!(code, 0, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    let c = &v[0]["composite"];
    assert_eq!(c["topping_in"], 2.0);
    // n = Ec(4000)/Ec(5000) with the same unit weight = √(4000/5000)
    assert!((c["modular_ratio"].as_f64().unwrap() - (0.8f64).sqrt()).abs() < 1e-12);
    assert!(c["ix_in4"].as_f64().unwrap() > v[0]["ix_in4"].as_f64().unwrap());
    let (code, _, err) = run(&["sections", "catalog/demo-us.toml", "--topping", "2 psi"]);
    assert_eq!(code, 2);
    assert!(err.contains("--topping: '2 psi' is a stress, but a length is needed"), "{err}");
    let (code, _, err) = run(&["sections", "catalog/demo-us.toml", "--topping", "2 in", "--topping-mix", "nope"]);
    assert_eq!(code, 2);
    assert!(err.contains("no mix 'nope'"), "{err}");
}

#[test]
fn published_properties_far_from_ours_draw_a_warning_not_an_error() {
    let dir = std::env::temp_dir().join(format!("plankwise-pub-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let base = std::fs::read_to_string(concat!(env!("CARGO_MANIFEST_DIR"), "/tests/good/minimal.toml")).unwrap();
    let text = base.replacen(
        "[[section.pattern]]",
        "[section.published]\narea = \"260 in2\"\nweight = \"62 psf\"\n\n[[section.pattern]]",
        1,
    );
    let f = dir.join("pub.toml");
    std::fs::write(&f, text).unwrap();
    let (code, out, err) = run(&["validate", f.to_str().unwrap()]);
    assert_eq!(code, 0, "{err}");
    assert!(out.contains("1 warning(s)"), "{out}");
    // computed: 384 − 6·π·5.5²/4 = 241.45 in²; 260 is +7.7 %
    assert!(
        err.contains("warning: section 'hc8' / published / area: published area 260.0 in² differs from the computed 241.5 in² by +7.7 %"),
        "{err}"
    );
    assert!(!err.contains("published weight"), "62 psf is within 2 % of 62.9 psf: {err}");
    std::fs::remove_dir_all(&dir).unwrap();
}

#[test]
fn help_names_every_command() {
    let (code, out, _) = run(&["--help"]);
    assert_eq!(code, 0);
    for c in ["validate", "sections"] {
        assert!(out.contains(c), "{out}");
    }
}

#[test]
fn a_closed_pipe_is_not_an_error() {
    use std::io::Read;
    use std::process::Stdio;
    let mut child = Command::new(env!("CARGO_BIN_EXE_plankwise"))
        .args(["sections", "--json"])
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .unwrap();
    drop(child.stdout.take());
    let status = child.wait().unwrap();
    let mut err = String::new();
    child.stderr.take().unwrap().read_to_string(&mut err).unwrap();
    assert_eq!(status.code(), Some(0), "{err}");
}

#[test]
fn the_example_in_the_catalog_reference_is_valid() {
    let doc = std::fs::read_to_string(concat!(env!("CARGO_MANIFEST_DIR"), "/catalog/README.md")).unwrap();
    // the catalog's example is the last one before the job file's section
    let catalog_part = &doc[..doc.find("# The job file").unwrap()];
    let start = catalog_part.rfind("```toml").unwrap() + "```toml".len();
    let end = start + doc[start..].find("```").unwrap();
    let cat = plankwise::catalog::Catalog::from_str(&doc[start..end], "catalog/README.md").unwrap();
    assert_eq!(cat.entry_count(), 1);
    assert!(cat.warnings.is_empty());
    // and the loads and openings of a bay, as that section shows them, read in a job
    let start = doc.rfind("```toml").unwrap() + "```toml".len();
    let end = start + doc[start..].find("```").unwrap();
    let job = format!(
        "[job]\nproject = \"p\"\n\n[[bay]]\nname = \"b\"\nspan = \"34 ft\"\n{}",
        &doc[start..end]
    );
    let j = plankwise::job::Job::from_str(&job, "catalog/README.md").unwrap();
    assert_eq!(j.bays[0].case.placed.len(), 2);
    assert_eq!(j.bays[0].case.openings.len(), 1);
}

#[test]
fn web_widths_follow_the_cores() {
    let (_, out, _) = run(&["sections", "--json"]);
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    let w = v[1]["web_widths_in"].as_array().unwrap();
    assert_eq!(w.len(), 21);
    // 8 in plank: full 48 in at the soffit, 48 − 6 × 5.5 − 2 × 0.625 = 13.75 in at core centres
    assert!((w[0][1].as_f64().unwrap() - 48.0).abs() < 1e-9);
    assert!((w[10][1].as_f64().unwrap() - 13.75).abs() < 1e-9);
}

/// Completions offer the values of every option with a fixed set.
#[test]
fn completions_offer_the_values_of_fixed_sets() {
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_plankwise"))
        .args(["completions", "bash"])
        .output()
        .unwrap();
    let text = String::from_utf8_lossy(&out.stdout);
    for values in [
        "lightest shallowest least-steel cheapest most-reserve",
        "U T C",
        "us si",
        "text md csv",
        "two-point four-point",
    ] {
        assert!(text.contains(values), "'{values}' not offered:\n{}", &text[..text.len().min(2000)]);
    }
}

/// The manual page: every command, its options, the exit codes, the files and the cautions.
#[test]
fn the_manual_covers_every_command_exit_code_and_caution() {
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_plankwise"))
        .arg("manual")
        .output()
        .unwrap();
    assert!(out.status.success());
    let page = String::from_utf8_lossy(&out.stdout);
    assert!(page.contains(".TH plankwise 1"), "{page}");
    for cmd in [
        "validate",
        "sections",
        "check",
        "handling",
        "rank",
        "envelope",
        "capacity",
        "spanmap",
        "shortlist",
        "manual",
        "completions",
    ] {
        assert!(page.contains(&format!(".SS \"{cmd}\"")), "{cmd} has its section");
    }
    for want in [
        ".SH EXIT STATUS",
        "no member is viable",
        ".SH FILES",
        "keys.toml",
        ".SH CAUTIONS",
        "\\-\\-sheet",
        "\\-\\-units",
    ] {
        assert!(page.contains(want), "{want}");
    }
    for c in plankwise::report::CAUTIONS {
        assert!(page.contains(&c.replace('-', "\\-")) || page.contains(c), "{c}");
    }
}

//! Handling stages end to end: each stage's moments against the closed
//! forms of its supports and multiplier (next-capabilities §3.3, [D]), and
//! a failing stage making an entry non-viable unless the bay says
//! handling is not checked.

use std::process::Command;

fn run(args: &[&str]) -> (i32, String, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_plankwise")).args(args).output().unwrap();
    (
        out.status.code().unwrap(),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
}

fn stages(extra: &[&str]) -> Vec<serde_json::Value> {
    let mut args = vec![
        "handling",
        "--section",
        "plank-8in-4ft",
        "--pattern",
        "6x1/2",
        "--span",
        "30 ft",
        "--json",
    ];
    args.extend(extra);
    let (code, out, err) = run(&args);
    assert_eq!(code, 0, "{err}");
    serde_json::from_str::<serde_json::Value>(&out).unwrap().as_array().unwrap().clone()
}

#[test]
fn every_stage_by_its_closed_form() {
    // plank-8in-4ft: 61.657 psf × 4 ft = 246.6 plf; member 30 ft + 4 in
    let w = 61.656_961_808_167_49 * 4.0 / 12.0; // lbf/in
    let lm = 30.0 * 12.0 + 4.0;
    let st = stages(&["--lift-at", "5 ft", "--bunk-at", "3 ft"]);
    let names: Vec<&str> = st.iter().map(|s| s["name"].as_str().unwrap()).collect();
    assert_eq!(names, ["stripping", "yard storage", "transport", "erection"]);
    for s in &st {
        let k = s["multiplier"].as_f64().unwrap();
        let a = if s["name"] == "transport" { 36.0 } else { 60.0 };
        // two symmetric supports at a from each end: hogging w a²/2, sagging wL(L/4 − a)/2
        let neg = -k * w * a * a / 2.0;
        let pos = k * w * lm * (lm / 4.0 - a) / 2.0;
        assert!((s["m_neg_lbin"].as_f64().unwrap() - neg).abs() < 1e-6 * neg.abs(), "{s}");
        assert!((s["m_pos_lbin"].as_f64().unwrap() - pos).abs() < 1e-6 * pos.abs(), "{s}");
    }
    // the multipliers (PCI, from memory): hollow-core lifted from its bed 1.2, yard 1.2, travel 1.5, erection 1.2
    let k: Vec<f64> = st.iter().map(|s| s["multiplier"].as_f64().unwrap()).collect();
    assert_eq!(k, [1.2, 1.2, 1.5, 1.2]);
    // stripping at f′ci and the prestress after transfer; later, more strength and less prestress
    assert_eq!(st[0]["fc_psi"], 3500.0);
    assert!(st[1]["fc_psi"].as_f64().unwrap() > 3500.0 && st[1]["fp_psi"].as_f64().unwrap() < st[0]["fp_psi"].as_f64().unwrap());
    // limits 5λ√f′c and 0.60 f′c
    assert!((st[0]["tension_limit_psi"].as_f64().unwrap() - 5.0 * 3500f64.sqrt()).abs() < 1e-9);
    assert!((st[0]["compression_limit_psi"].as_f64().unwrap() - 2100.0).abs() < 1e-9);
    // four-point equalising rigging: the lifts at 0.104 L and 0.396 L
    let st = stages(&["--rigging", "four-point"]);
    let sup: Vec<f64> = st[0]["supports_in"]
        .as_array()
        .unwrap()
        .iter()
        .map(|x| x.as_f64().unwrap())
        .collect();
    assert_eq!(sup.len(), 4);
    assert!(
        (sup[0] + 2.0 - 0.104 * lm).abs() < 1e-9 && (sup[1] + 2.0 - 0.396 * lm).abs() < 1e-9,
        "{sup:?}"
    );
    let neg = -1.2 * w * (0.104 * lm).powi(2) / 2.0;
    assert!((st[0]["m_neg_lbin"].as_f64().unwrap() - neg).abs() < 1e-6 * neg.abs());
}

#[test]
fn a_failing_stage_makes_the_entry_non_viable_unless_not_checked() {
    // a long plank carried on bunks far from its ends: the transport
    // stage's hogging over the bunks cracks the top fibre
    let base = [
        "check",
        "--section",
        "plank-8in-4ft",
        "--pattern",
        "7x1/2",
        "--span",
        "30 ft",
        "--bunk-at",
        "12 ft",
    ];
    let (_, out, _) = run(&base);
    assert!(
        out.contains("NOT VIABLE; first failure: Stripping, storage, transport, erection"),
        "{out}"
    );
    assert!(out.contains("transport at 30 d (×1.5"), "{out}");
    let mut not_checked = base.to_vec();
    not_checked.extend(["--handling", "not-checked"]);
    let (_, out, _) = run(&not_checked);
    assert!(!out.contains("Stripping, storage"), "{out}");
}

//! The calculation sheet: every number on it equals the same number of
//! `check --json` (in both systems), and the sheet and the capacity table
//! match their golden files.

use std::process::Command;

fn run(args: &[&str]) -> String {
    let out = Command::new(env!("CARGO_BIN_EXE_plankwise"))
        .args(args)
        .current_dir(env!("CARGO_MANIFEST_DIR"))
        .output()
        .unwrap();
    assert!(
        out.status.code().is_some_and(|c| c <= 1),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout).unwrap()
}

const ENTRY: [&str; 11] = [
    "check",
    "--section",
    "tee-24in-10ft",
    "--pattern",
    "8-depressed",
    "--span",
    "44 ft",
    "--use",
    "roof",
    "--snow",
    "30 psf",
];

/// The value at a dotted path of the JSON ("checks.flexure" finds the check by id).
fn at<'a>(v: &'a serde_json::Value, path: &str) -> &'a serde_json::Value {
    let mut cur = v;
    let mut parts = path.split('.').peekable();
    while let Some(p) = parts.next() {
        cur = if p == "checks" {
            let id = parts.next().unwrap();
            cur["checks"]
                .as_array()
                .unwrap()
                .iter()
                .find(|c| c["id"] == id)
                .unwrap_or_else(|| panic!("{id}"))
        } else {
            cur.get(p).unwrap_or_else(|| panic!("no {p} in {path}"))
        };
    }
    cur
}

/// The numbers of a line before its "[key]", as written.
fn numbers(text: &str) -> Vec<(f64, usize)> {
    text.split_whitespace()
        .filter_map(|t| {
            let t = t.trim_end_matches(',');
            t.parse::<f64>().ok().map(|v| (v, t.split_once('.').map_or(0, |(_, d)| d.len())))
        })
        .collect()
}

fn agree(shown: (f64, usize), want: f64, what: &str) {
    let tol = 0.5 * 10f64.powi(-(shown.1 as i32)) + 1e-9 * want.abs();
    assert!(
        (shown.0 - want).abs() <= tol,
        "{what}: the sheet says {} where the JSON has {want}",
        shown.0
    );
}

fn sheet_against_json(units: &str) -> usize {
    let mut args = ENTRY.to_vec();
    args.extend(["--units", units]);
    let mut j = args.clone();
    j.push("--json");
    let json: serde_json::Value = serde_json::from_str(&run(&j)).unwrap();
    let mut s = args.clone();
    s.push("--sheet");
    let sheet = run(&s);
    let mut n = 0;
    for line in sheet.lines() {
        let Some((body, key)) = line.rsplit_once("   [") else { continue };
        let key = key.trim_end_matches(']');
        if let Some(id) = key.strip_prefix("checks.") {
            // "title  demand / capacity unit  ratio r ok"
            let c = at(&json, &format!("checks.{id}"));
            let nums = numbers(&body.replace('/', " "));
            let k = nums.len();
            assert!(k >= 3, "{line}");
            agree(nums[k - 3], c["demand"].as_f64().unwrap(), &format!("{id} demand"));
            agree(nums[k - 2], c["capacity"].as_f64().unwrap(), &format!("{id} capacity"));
            agree(nums[k - 1], c["ratio"].as_f64().unwrap(), &format!("{id} ratio"));
            n += 3;
        } else {
            let want = at(&json, key).as_f64().unwrap_or_else(|| panic!("{key} is a number"));
            let nums = numbers(body.split_once(" ").map_or(body, |_| body).rsplit("  ").next().unwrap());
            let last = *nums.last().unwrap_or_else(|| panic!("a number in {line}"));
            agree(last, want, key);
            n += 1;
        }
    }
    n
}

#[test]
fn every_number_on_the_sheet_is_the_json_number() {
    let us = sheet_against_json("us");
    let si = sheet_against_json("si");
    assert!(us > 90 && us == si, "{us} {si}");
}

fn golden(name: &str, got: &str) {
    let path = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/golden").join(name);
    if std::env::var_os("PLANKWISE_BLESS").is_some() {
        std::fs::write(&path, got).unwrap();
    }
    let want = std::fs::read_to_string(&path).unwrap_or_else(|_| panic!("{} missing: run with PLANKWISE_BLESS=1", path.display()));
    assert_eq!(got, want, "{name} differs from its golden file (PLANKWISE_BLESS=1 to accept)");
}

#[test]
fn the_sheet_and_the_capacity_table_match_their_golden_files() {
    let mut s = ENTRY.to_vec();
    s.push("--sheet");
    golden("sheet.txt", &run(&s));
    let cap = ["capacity", "--families", "hollow-core", "--sdl", "20 psf", "--fire", "1 h"];
    golden("capacity.txt", &run(&cap));
    let mut c = cap.to_vec();
    c.extend(["--format", "csv"]);
    golden("capacity.csv", &run(&c));
}

/// Mcr (ACI 318-19 §24.2.3.5; the staged form for an unshored topping)
/// and the service fibre stresses at the section of the greatest factored
/// moment, recomputed from the terms `check --json` gives there: the
/// precast section there (A, Sb, St), the composite moduli when topped.
fn mcr_and_service_stresses_hold(v: &serde_json::Value) {
    let f = |p: &str| at(v, p).as_f64().unwrap_or_else(|| panic!("{p}"));
    let close = |a: f64, b: f64, what: &str| assert!((a - b).abs() <= 1e-9 * b.abs().max(1.0), "{what}: {a} vs {b}");
    let (pe, e) = (f("at_mu.pe_kip") * 1000.0, f("at_mu.e_in"));
    let (a, sb, st) = (f("at_mu.area_in2"), f("at_mu.sb_in3"), f("at_mu.st_in3"));
    let (m, fr) = (f("m_service_total_kipft") * 12000.0, f("concrete.fr_psi"));
    let pre_b = pe / a + pe * e / sb;
    let pre_t = pe / a - pe * e / st;
    match (at(v, "at_mu.sbc_in3").as_f64(), at(v, "at_mu.stc_in3").as_f64()) {
        (Some(sbc), Some(stc)) => {
            let mnc = f("at_mu.m_precast_kipft") * 12000.0;
            close(
                sbc * (fr + pre_b - mnc / sb) / 12000.0 + mnc / 12000.0,
                f("mcr_kipft"),
                "Mcr, topped",
            );
            close(pre_b - mnc / sb - (m - mnc) / sbc, f("f_bottom_service_psi"), "fb, topped");
            close(pre_t + mnc / st + (m - mnc) / stc, f("f_top_service_psi"), "ft, topped");
        }
        _ => {
            close(sb * (fr + pre_b) / 12000.0, f("mcr_kipft"), "Mcr (24.2.3.5)");
            close(pre_b - m / sb, f("f_bottom_service_psi"), "fb");
            close(pre_t + m / st, f("f_top_service_psi"), "ft");
        }
    }
}

/// The final camber with age recomputed from the terms `check --json`
/// gives: creep of the member from release, of the topping and finishes
/// from erection (with Ec then), restrained by the composite section once
/// topped (ACI 209R-92 creep-time ratio, the age-adjusted effective
/// modulus with χ 0.8, from memory).
fn final_camber_with_age_holds(v: &serde_json::Value) {
    let f = |p: &str| at(v, p).as_f64().unwrap_or_else(|| panic!("{p}"));
    let close = |a: f64, b: f64, what: &str| assert!((a - b).abs() <= 1e-9 * b.abs().max(1.0), "{what}: {a} vs {b}");
    let (dp_, dsw, phi) = (
        f("camber_prestress_release_in"),
        f("defl_self_release_in"),
        f("aged_camber.creep_erection"),
    );
    let tf = f("aged_camber.final_age_days") - f("aged_camber.release_age_days");
    let phi_f = tf.powf(0.6) / (10.0 + tf.powf(0.6)) * f("aged_camber.creep_ultimate");
    close(phi_f, f("aged_camber.creep_final"), "φ final");
    let tl = f("aged_camber.final_age_days") - f("aged_camber.erection_age_days");
    let phi_l = tl.powf(0.6) / (10.0 + tl.powf(0.6)) * f("aged_camber.creep_ultimate_erection");
    close(phi_l, f("aged_camber.creep_after_erection"), "φ of the later loads");
    let (top, sdl) = (f("camber_terms.topping_in"), f("camber_terms.sdl_in"));
    let r = f("aged_camber.inertia_ratio");
    let phi_p = if top != 0.0 { phi + (phi_f - phi) * r } else { phi_f };
    let k = f("aged_camber.ec_ratio_erection");
    let eta_f = f("aged_camber.loss_final");
    close(
        dp_ * (1.0 + phi_p)
            - eta_f * dp_ * (1.0 + 0.8 * phi_p)
            - dsw * (1.0 + phi_p)
            - top / k * (1.0 + phi_l * r)
            - sdl / k * (1.0 + phi_l),
        f("aged_camber.final_in"),
        "final camber with age",
    );
}

/// A topped member: the sheet writes Mcr and the service stresses in the
/// staged composite form with the values put in, and they hold; so does
/// its final camber with age, the topping's creep restrained.
#[test]
fn a_topped_members_mcr_and_stresses_hold_with_their_terms() {
    let args = [
        "check",
        "--section",
        "plank-8in-4ft",
        "--pattern",
        "6x1/2",
        "--span",
        "28 ft",
        "--live",
        "50 psf",
        "--topping",
        "2 in",
    ];
    let v: serde_json::Value = serde_json::from_str(&run(&[&args[..], &["--json"]].concat())).unwrap();
    assert!(at(&v, "at_mu.sbc_in3").as_f64().is_some(), "topped: the composite moduli are given");
    mcr_and_service_stresses_hold(&v);
    assert!(at(&v, "camber_terms.topping_in").as_f64().unwrap() > 0.0);
    final_camber_with_age_holds(&v);
    let sheet = run(&[&args[..], &["--sheet", "text"]].concat());
    for want in [
        "Mcr = Sbc (fr + Pe/A + Pe e/Sb − Mnc/Sb) + Mnc = ",
        "fb = Pe/A + Pe e/Sb − Mnc/Sb − (M − Mnc)/Sbc = ",
        "ft = Pe/A − Pe e/St + Mnc/St + (M − Mnc)/Stc = ",
    ] {
        assert!(sheet.contains(want), "{want}\n{sheet}");
    }
}

/// The equations the sheet prints hold with the numbers it prints beside
/// them (the terms from `check --json`): ACI 318-19 Eqs. 19.2.2.1(a) and
/// 19.2.3.1, Table 22.2.2.4.3, the Zia et al. (1979) loss equations and
/// the first term of Eq. 25.4.8.1, Mcr by §24.2.3.5 and the fibre stresses
/// at service, each recomputed here from its terms.
#[test]
fn the_sheets_equations_hold_with_its_terms() {
    let v: serde_json::Value = serde_json::from_str(&run(&[&ENTRY[..], &["--json"]].concat())).unwrap();
    let f = |p: &str| at(&v, p).as_f64().unwrap_or_else(|| panic!("{p}"));
    let close = |a: f64, b: f64, what: &str| assert!((a - b).abs() <= 1e-9 * b.abs().max(1.0), "{what}: {a} vs {b}");
    let fc = f("concrete.fc_psi");
    close(33.0 * f("concrete.wc_pcf").powf(1.5) * fc.sqrt(), f("concrete.ec_psi"), "Ec");
    close(7.5 * f("concrete.lambda") * fc.sqrt(), f("concrete.fr_psi"), "fr");
    close((0.85 - 0.05 * (fc - 4000.0) / 1000.0).clamp(0.65, 0.85), f("concrete.beta1"), "β1");
    let (pi, a, i, e, mg) = (
        f("loss_terms.pi_kip") * 1000.0,
        f("loss_terms.area_in2"),
        f("loss_terms.ix_in4"),
        f("loss_terms.e_in"),
        f("loss_terms.mg_kipft") * 12000.0,
    );
    close(f("fpj_ksi") * f("loss_terms.aps_in2"), f("loss_terms.pi_kip"), "Pi");
    let fcir = 0.9 * (pi / a + pi * e * e / i) - mg * e / i;
    close(fcir, f("loss_terms.fcir_psi"), "fcir");
    let eps = f("inputs.eps_ksi") * 1000.0;
    let es = eps * fcir / f("loss_terms.eci_psi");
    close(es, f("loss_es_ksi") * 1000.0, "ES");
    let cr = f("loss_terms.kcr") * eps / f("loss_terms.ec_psi") * (fcir - f("loss_terms.fcds_psi"));
    close(cr, f("loss_cr_ksi") * 1000.0, "CR");
    let sh = 8.2e-6 * eps * (1.0 - 0.06 * f("loss_terms.vs_in")) * (100.0 - f("loss_terms.rh_pct"));
    close(sh, f("loss_sh_ksi") * 1000.0, "SH");
    let re = (f("loss_terms.kre_psi") - f("loss_terms.j") * (sh + cr + es)) * f("loss_terms.c");
    close(re, f("loss_re_ksi") * 1000.0, "RE");
    close(es + cr + sh + re, f("loss_total_ksi") * 1000.0, "total");
    close(f("fpj_ksi") - f("loss_total_ksi"), f("fse_ksi"), "fse");
    close(f("fpj_ksi") - f("loss_es_ksi"), f("fpo_ksi"), "fpo");
    close(f("fse_ksi") * f("loss_terms.aps_in2"), f("pe_kip"), "Pe");
    close(
        f("fse_ksi") * 1000.0 / 3000.0 * f("inputs.strand_diameter_in"),
        f("transfer_length_in"),
        "ℓtr",
    );
    // at the section of the greatest factored moment (a member without topping)
    mcr_and_service_stresses_hold(&v);
    // the natural frequency, first mode of a uniform simply supported beam
    // (e.g. Chopra, Dynamics of Structures); g is standard gravity
    // 9.80665 m/s² (a defined value) in in/s²
    let (w, l) = (f("frequency_terms.w_plf") / 12.0, f("frequency_terms.span_ft") * 12.0);
    let fq = std::f64::consts::FRAC_PI_2
        * (9.80665 / 0.0254 * f("frequency_terms.ec_psi") * f("frequency_terms.i_in4") / (w * l.powi(4))).sqrt();
    close(fq, f("frequency_hz"), "f");
    close(f("frequency_terms.ec_psi"), f("concrete.ec_psi"), "Ec of f");
    // at release, where the compression check finds its worst point: the
    // fibre stresses from their terms, and the check's demand is the larger
    let (po, er, mg) = (
        f("at_release.po_kip") * 1000.0,
        f("at_release.e_in"),
        f("at_release.mg_kipft") * 12000.0,
    );
    let (ar, sbr, str_) = (f("at_release.area_in2"), f("at_release.sb_in3"), f("at_release.st_in3"));
    let fb = po / ar + po * er / sbr - mg / sbr;
    let ft = po / ar - po * er / str_ + mg / str_;
    close(fb, f("at_release.f_bottom_psi"), "fb at release");
    close(ft, f("at_release.f_top_psi"), "ft at release");
    close(fb.max(ft), f("checks.release_compression.demand"), "release compression demand");
    close(f("at_release.x_ft"), f("checks.release_compression.station_ft"), "where");
    // shear where Vu/φVn is greatest: Vcw (22.5.6.3.2), Mcre (22.5.6.3.1c),
    // Vci (22.5.6.3.1a) and φVn from their terms, and the check's numbers
    let (l, r, bw, dp) = (
        f("at_shear.lambda"),
        f("at_shear.sqrt_fc_psi"),
        f("at_shear.bw_in"),
        f("at_shear.dp_in"),
    );
    let vcw = (3.5 * l * r + 0.3 * f("at_shear.fpc_psi")) * bw * dp + f("at_shear.vp_kip") * 1000.0;
    close(vcw / 1000.0, f("at_shear.vcw_kip"), "Vcw");
    let mcre = (f("at_shear.s_in3") * (6.0 * l * r + f("at_shear.fpe_psi") - f("at_shear.fd_psi"))).max(0.0);
    close(mcre / 12000.0, f("at_shear.mcre_kipft"), "Mcre");
    let vci =
        0.6 * l * r * bw * dp + f("at_shear.vd_kip") * 1000.0 + f("at_shear.vi_kip") * 1000.0 * mcre / (f("at_shear.mmax_kipft") * 12000.0);
    close(vci / 1000.0, f("at_shear.vci_raw_kip"), "Vci");
    close((1.7 * l * r * bw * dp / 1000.0).max(0.0), f("at_shear.vci_min_kip"), "Vci,min");
    let vci = (vci / 1000.0).max(f("at_shear.vci_min_kip"));
    close(
        0.75 * (vci.min(f("at_shear.vcw_kip")) + f("at_shear.vs_kip")),
        f("at_shear.phi_vn_kip"),
        "φVn",
    );
    close(f("at_shear.phi_vn_kip"), f("checks.shear.capacity"), "the shear check's capacity");
    close(f("at_shear.vu_kip"), f("checks.shear.demand"), "the shear check's demand");
    // camber by the multipliers (a member on its two supports)
    let k = |n: &str| f(&format!("camber_terms.multipliers.{n}"));
    let (dp_, dsw) = (f("camber_prestress_release_in"), f("defl_self_release_in"));
    close(dp_ - dsw, f("camber_release_in"), "camber at release");
    close(
        k("erection_prestress") * dp_ - k("erection_self") * dsw,
        f("camber_erection_in"),
        "camber at erection",
    );
    close(
        k("final_prestress") * dp_
            - k("final_self") * dsw
            - k("final_topping") * f("camber_terms.topping_in")
            - k("final_sdl") * f("camber_terms.sdl_in"),
        f("camber_final_in"),
        "final camber",
    );
    // the camber at erection with age (ACI 209R-92 creep, age-adjusted effective modulus)
    let t = f("aged_camber.erection_age_days") - f("aged_camber.release_age_days");
    let phi = t.powf(0.6) / (10.0 + t.powf(0.6)) * f("aged_camber.creep_ultimate");
    close(phi, f("aged_camber.creep_erection"), "φ at erection");
    let eta = f("aged_camber.loss_erection");
    close(
        dp_ * (1.0 + phi) - eta * dp_ * (1.0 + 0.8 * phi) - dsw * (1.0 + phi),
        f("aged_camber.erection_in"),
        "camber at erection with age",
    );
    final_camber_with_age_holds(&v);
    // the immediate live-load deflection, 5wℓ⁴/(384 Ec I) (uniform loads)
    let lt = |n: &str| f(&format!("camber_terms.live.{n}"));
    close(
        lt("ig_over_ie") * 5.0 * (lt("w_plf") / 12.0) * lt("l_in").powi(4) / (384.0 * lt("ec_psi") * lt("ig_in4")),
        f("defl_live_in"),
        "live-load deflection",
    );
    // and the sheet shows each with its values put in
    let sheet = run(&[&ENTRY[..], &["--sheet"]].concat());
    for eq in [
        "Ec = 33 wc^1.5 √f′c = 33 × 150.0^1.5 × √6000 psi",
        "fcir = 0.9 (Pi/A + Pi e²/I) − Mg e/I = 0.9 (",
        "RE = [Kre − J (SH + CR + ES)] C = [5000 − 0.040 × (",
    ] {
        assert!(sheet.contains(eq), "{eq}");
    }
}

//! Invariants as property tests (proptest), and a bounded fuzz of the
//! loaders and of the evaluation. The case counts are small so `cargo test`
//! stays quick; `PROPTEST_CASES=100000 cargo test --release --test properties`
//! runs them longer (see DEVELOPERS.md for recorded runs).

use plankwise::case::{DesignCase, ServiceClass, Topping};
use plankwise::catalog::{Catalog, DEMO_US};
use plankwise::checks::{Candidate, evaluate};
use plankwise::job::{DEMO_JOB, Job};
use plankwise::units::{AreaLoad, Length};
use proptest::prelude::*;

/// The fuzz seeds: (is a job, text).
fn seeds() -> Vec<(bool, String)> {
    let mut v = vec![(false, DEMO_US.to_string()), (true, DEMO_JOB.to_string())];
    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/bad");
    for (dir, job) in [("catalog", false), ("job", true)] {
        let mut files: Vec<_> = std::fs::read_dir(root.join(dir)).unwrap().map(|e| e.unwrap().path()).collect();
        files.sort();
        for f in files.into_iter().filter(|f| f.extension().is_some_and(|e| e == "toml")) {
            v.push((job, std::fs::read_to_string(f).unwrap()));
        }
    }
    v
}

fn demo() -> Catalog {
    Catalog::from_str(DEMO_US, "demo-us.toml").unwrap()
}

/// A case of the given span (ft), SDL and live (psf), optionally with a
/// 2 in topping of the demo topping mix and a dead line load (klf, at a
/// fraction of the span).
fn case(cat: &Catalog, span: f64, sdl: f64, live: f64, topped: bool, line: Option<(f64, f64)>) -> DesignCase {
    let mut k = DesignCase::new(Length::from_unit(span, "ft"));
    k.sdl = AreaLoad::from_unit(sdl, "psf");
    k.live = AreaLoad::from_unit(live, "psf");
    if topped {
        k.topping = Some(Topping {
            thickness: Length::new(2.0),
            mix: cat.mixes[3].clone(),
        });
    }
    if let Some((w, at)) = line {
        k.line_loads.push(plankwise::case::LineLoadSpec {
            w: plankwise::units::LineLoad::from_unit(w, "klf"),
            at: Length::from_unit(span * at, "ft"),
            kind: plankwise::case::LoadKind::Dead,
        });
    }
    k
}

fn all_finite(ev: &plankwise::checks::Evaluation) -> Result<(), String> {
    for c in &ev.checks {
        for (what, v) in [("demand", c.demand), ("capacity", c.capacity), ("ratio", c.ratio)] {
            if !v.is_finite() {
                return Err(format!("{} {what} = {v}", c.info.id));
            }
        }
    }
    for s in &ev.stations {
        let vals = [
            s.mu_lbin,
            s.vu_lbf,
            s.flexure.phi_mn_lbin,
            s.flexure.mcr_lbin,
            s.release_psi.0,
            s.release_psi.1,
            s.service.bottom_total_psi,
            s.service.top_total_psi,
        ];
        if vals.iter().any(|v| !v.is_finite()) || s.shear.is_some_and(|v| !v.phi_vn_lbf().is_finite()) {
            return Err(format!("station {} not finite", s.x_in));
        }
    }
    let c = &ev.camber;
    for v in [
        c.camber_release_in,
        c.camber_erection_in,
        c.camber_final_in,
        c.defl_live_in,
        c.defl_after_attach_in,
        ev.frequency_hz,
        ev.history.fse_psi,
    ] {
        if !v.is_finite() {
            return Err("camber or prestress not finite".into());
        }
    }
    Ok(())
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 48, .. ProptestConfig::default() })]

    /// No NaN or infinity reaches any output, for any entry and any case
    /// inside the validated ranges.
    #[test]
    fn no_nan_or_infinity_anywhere(
        entry in 0usize..33,
        span in 6.0f64..90.0,
        sdl in 0.0f64..150.0,
        live in 0.0f64..400.0,
        snow in 0.0f64..80.0,
        topped in any::<bool>(),
        class in 0usize..3,
        fire in proptest::option::of(0usize..5),
        line in proptest::option::of((0.0f64..3.0, 0.0f64..1.0)),
    ) {
        let cat = demo();
        let (s, p) = cat.sections.iter().flat_map(|s| s.patterns.iter().map(move |p| (s, p))).nth(entry).unwrap();
        let mut k = case(&cat, span, sdl, live, topped, line);
        k.snow = AreaLoad::from_unit(snow, "psf");
        k.class_allowed = [ServiceClass::U, ServiceClass::T, ServiceClass::C][class];
        k.fire_rating = fire.map(|i| plankwise::fire::RATINGS[i]);
        let ev = evaluate(&Candidate { section: s, pattern: p, mix: s.mix(&cat) }, &k);
        prop_assert!(all_finite(&ev).is_ok(), "{:?}", all_finite(&ev));
        let json = plankwise::report::check::to_json(&Candidate { section: s, pattern: p, mix: s.mix(&cat) }, &k, &ev);
        let text = serde_json::to_string(&json).unwrap();
        prop_assert!(!text.contains("null,\"ratio\"") && !text.contains("NaN"));
    }

    /// The shortcuts equal the full route, for any entry and case: the brief
    /// evaluation (left half of a symmetric member, no notes) gives the full
    /// evaluation's numbers, and a prepared analysis tried at another live
    /// load gives a fresh evaluation at that load — with and without a line
    /// load, which turns the mirrored half off.
    #[test]
    fn shortcuts_agree_with_the_full_route(
        entry in 0usize..33,
        span in 6.0f64..90.0,
        sdl in 0.0f64..150.0,
        live in 0.0f64..400.0,
        other_live in 0.0f64..800.0,
        topped in any::<bool>(),
        line in proptest::option::of((0.0f64..3.0, 0.0f64..1.0)),
    ) {
        let cat = demo();
        let (s, p) = cat.sections.iter().flat_map(|s| s.patterns.iter().map(move |p| (s, p))).nth(entry).unwrap();
        let cand = Candidate { section: s, pattern: p, mix: s.mix(&cat) };
        let k = case(&cat, span, sdl, live, topped, line);
        let (full, brief) = (evaluate(&cand, &k), plankwise::checks::evaluate_brief(&cand, &k));
        prop_assert_eq!(full.checks.len(), brief.checks.len());
        // the full evaluation also searches the mirrored half, which may
        // land a rounding away
        let near = |x: f64, y: f64| (x - y).abs() <= 1e-9 * x.abs().max(y.abs()) + 1e-12;
        for (a, b) in full.checks.iter().zip(&brief.checks) {
            prop_assert_eq!((a.info.id, a.pass), (b.info.id, b.pass));
            prop_assert!(near(a.demand, b.demand) && near(a.capacity, b.capacity) && near(a.ratio, b.ratio), "{}: {:?} vs {:?}", a.info.id, a, b);
        }
        prop_assert_eq!((full.viable, full.governing), (brief.viable, brief.governing));
        let prep = plankwise::checks::Prepared::new(&cand, &k);
        let mut k2 = k.clone();
        k2.live = AreaLoad::from_unit(other_live, "psf");
        prop_assert_eq!(prep.with_live(k2.live), plankwise::checks::evaluate_brief(&cand, &k2));
    }

    /// The loaders never panic on a damaged catalog or job: every result is
    /// a catalog or a list of located problems. Seeds: the demo files and
    /// every file of the broken-input corpus.
    #[test]
    fn damaged_files_never_panic(
        cut in 0usize..12000,
        len in 0usize..40,
        junk in "[ -~\\n\\[\\]\"=]{0,12}",
        pick in 0usize..1000,
    ) {
        let seeds = seeds();
        let (is_job, base) = &seeds[pick % seeds.len()];
        let which = if *is_job { 1 } else { 0 };
        let base = base.as_str();
        let mut text: String = base.chars().collect();
        let n = text.chars().count();
        let at = cut % n;
        let start = text.char_indices().nth(at).map_or(text.len(), |(i, _)| i);
        let end = text.char_indices().nth((at + len).min(n)).map_or(text.len(), |(i, _)| i);
        text.replace_range(start..end, &junk);
        let lines = text.lines().count() + 1;
        let problems = if which == 0 {
            Catalog::from_str(&text, "f.toml").err().map(|p| p.0)
        } else {
            Job::from_str(&text, "f.toml").err().map(|p| p.0)
        };
        if let Some(ps) = problems {
            prop_assert!(!ps.is_empty());
            for p in ps {
                prop_assert!(p.line <= lines, "line {} beyond the file", p.line);
                prop_assert!(!p.message.is_empty());
            }
        }
    }
}

/// The same member entered in US customary and in SI units gives the same
/// results, to a relative 1e-9.
#[test]
fn us_and_si_entries_agree() {
    let mm = |inch: f64| format!("{:.12} mm", inch * 25.4);
    let mpa = |psi: f64| format!("{:.12} MPa", psi * 0.006_894_757_293_168_361);
    let us = r#"[catalog]
name = "us"
[[mix]]
id = "m"
fc = "6000 psi"
fci = "4000 psi"
unit_weight = "150 pcf"
aggregate = "carbonate"
[[section]]
id = "s"
mix = "m"
[section.hollow_core]
width = "48 in"
depth = "10 in"
cores = { shape = "stadium", count = 6, width = "5.75 in", height = "7 in", spacing = "7.5 in" }
[[section.pattern]]
id = "p"
strand = "1/2 in"
row = [{ count = 7, height = "1.75 in" }]
"#;
    let si = format!(
        r#"[catalog]
name = "si"
[[mix]]
id = "m"
fc = "{}"
fci = "{}"
unit_weight = "{:.12} kg/m3"
aggregate = "carbonate"
[[section]]
id = "s"
mix = "m"
[section.hollow_core]
width = "{}"
depth = "{}"
cores = {{ shape = "stadium", count = 6, width = "{}", height = "{}", spacing = "{}" }}
[[section.pattern]]
id = "p"
strand = "12.7 mm"
row = [{{ count = 7, height = "{}" }}]
"#,
        mpa(6000.0),
        mpa(4000.0),
        150.0 * 0.453_592_37 / 0.3048f64.powi(3),
        mm(48.0),
        mm(10.0),
        mm(5.75),
        mm(7.0),
        mm(7.5),
        mm(1.75)
    );
    let a = Catalog::from_str(us, "us.toml").unwrap();
    let b = Catalog::from_str(&si, "si.toml").unwrap();
    let case_us = {
        let mut k = DesignCase::new(Length::parse("30 ft").unwrap());
        k.sdl = AreaLoad::parse("15 psf").unwrap();
        k.live = AreaLoad::parse("80 psf").unwrap();
        k
    };
    let case_si = {
        let mut k = DesignCase::new(Length::parse(&format!("{:.12} m", 30.0 * 0.3048)).unwrap());
        k.sdl = AreaLoad::parse(&format!("{:.12} kPa", 15.0 * 0.047_880_258_980_335_84)).unwrap();
        k.live = AreaLoad::parse(&format!("{:.12} kPa", 80.0 * 0.047_880_258_980_335_84)).unwrap();
        k.bearing = Length::parse(&format!("{:.12} mm", 4.0 * 25.4)).unwrap();
        k
    };
    let ea = evaluate(
        &Candidate {
            section: &a.sections[0],
            pattern: &a.sections[0].patterns[0],
            mix: &a.mixes[0],
        },
        &case_us,
    );
    let eb = evaluate(
        &Candidate {
            section: &b.sections[0],
            pattern: &b.sections[0].patterns[0],
            mix: &b.mixes[0],
        },
        &case_si,
    );
    assert_eq!(ea.checks.len(), eb.checks.len());
    for (x, y) in ea.checks.iter().zip(&eb.checks) {
        assert_eq!(x.info.id, y.info.id);
        for (u, v) in [(x.demand, y.demand), (x.capacity, y.capacity), (x.ratio, y.ratio)] {
            assert!((u - v).abs() <= 1e-9 * u.abs().max(v.abs()) + 1e-12, "{}: {u} vs {v}", x.info.id);
        }
    }
    assert!((ea.camber.camber_final_in - eb.camber.camber_final_in).abs() <= 1e-9 * ea.camber.camber_final_in.abs());
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 256, .. ProptestConfig::default() })]

    /// Every quantity plankwise prints reads back to the same value: the
    /// feet–inch form (to 1/16 in), and each criterion's display in either
    /// system — printed again, it prints the same text, and it lies within
    /// half a printed step of the value.
    #[test]
    fn printed_quantities_read_back(ft in 0.0f64..400.0, k in 0usize..64, x in 0.0f64..1.0) {
        use plankwise::criteria::{CRITERIA, Form, Value};
        use plankwise::units::{System, fmt_ft_in};
        let l = Length::from_unit(ft, "ft");
        let text = fmt_ft_in(l);
        let back = Length::parse(&text).unwrap();
        prop_assert!((back.get() - l.get()).abs() <= 1.0 / 32.0 + 1e-9, "{text}");
        prop_assert_eq!(fmt_ft_in(back), text);
        let quantities: Vec<_> = CRITERIA.iter().filter(|c| matches!(c.form, Form::Quantity { .. } | Form::Number { .. })).collect();
        let c = quantities[k % quantities.len()];
        let (lo, hi) = match c.form {
            Form::Quantity { range, .. } | Form::Number { range } => (range.lo, range.hi),
            _ => unreachable!(),
        };
        let mut b = plankwise::bay::Bay::new("b", Length::from_unit(20.0, "ft"));
        // a value inside the range, in the range's own unit
        let probe = match c.form {
            Form::Quantity { q, range } => {
                let one = q.parse(&format!("1 {}", range.unit)).unwrap();
                one * (lo + x * (hi - lo))
            }
            _ => lo + x * (hi - lo),
        };
        c.set(&mut b, Value::Num(Some(probe)));
        for sys in [System::Us, System::Si] {
            let shown = c.show(&b, sys);
            let v = c.parse(&shown).map_err(|e| TestCaseError::fail(format!("{}: '{shown}': {e}", c.key)))?;
            let mut b2 = b.clone();
            c.set(&mut b2, v.clone());
            prop_assert_eq!(c.show(&b2, sys), shown.clone(), "{}", c.key);
            if let (Value::Num(Some(a)), Value::Num(Some(p))) = (v, Value::Num(Some(probe))) {
                // the printed step: 1/16 in for feet–inch, else the last place shown
                let places = shown.split_whitespace().next().and_then(|n| n.split_once('.')).map_or(0, |(_, f)| f.len());
                let step = if shown.contains('\'') { 1.0 / 16.0 } else {
                    let unit = shown.split_whitespace().nth(1).unwrap_or("");
                    let q = match c.form { Form::Quantity { q, .. } => Some(q), _ => None };
                    let base = q.map_or(1.0, |q| q.parse(&format!("1 {unit}")).unwrap());
                    base * 10f64.powi(-(places as i32))
                };
                prop_assert!((a - p).abs() <= step / 2.0 * (1.0 + 1e-9) + 1e-12, "{}: {p} printed '{shown}' reads {a}", c.key);
            }
        }
    }
}

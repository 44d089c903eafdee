//! The capacity table: every cell proved by a forward check, and the
//! command's formats (by flag or by the extension of -o) in both systems.

use std::process::Command;

use plankwise::bay::Bay;
use plankwise::catalog::{Catalog, DEMO_US};
use plankwise::checks::evaluate_brief;
use plankwise::select::capacity::{Request, table};
use plankwise::select::{case_for, entries, topping_mix};
use plankwise::units::{AreaLoad, Length};

fn run(args: &[&str]) -> (i32, String, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_plankwise")).args(args).output().unwrap();
    (
        out.status.code().unwrap(),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
}

#[test]
fn every_longest_span_passes_and_an_inch_more_does_not() {
    let cat = Catalog::from_str(DEMO_US, "demo-us.toml").unwrap();
    let mut bay = Bay::new("t", Length::from_unit(12.0, "ft"));
    bay.case.sdl = AreaLoad::from_unit(20.0, "psf");
    bay.families = vec![plankwise::section::Family::HollowCore];
    let spans: Vec<f64> = (0..=24).map(|k| 12.0 + 2.0 * k as f64).collect();
    let req = Request {
        spans_ft: spans.clone(),
        loads_psf: vec![40.0, 100.0],
        depth_in: Some((8.0, 12.0)),
    };
    let rows = table(&cat, &bay, &req);
    assert!(rows.iter().all(|r| (8.0..=12.0).contains(&r.depth_in)), "the depth filter");
    assert_eq!(
        rows.len(),
        entries(&cat, &bay)
            .iter()
            .filter(|e| (8.0..=12.0).contains(&e.section.props.depth_in))
            .count()
    );
    let mut proved = 0;
    for (r, e) in rows.iter().zip(
        entries(&cat, &bay)
            .into_iter()
            .filter(|e| (8.0..=12.0).contains(&e.section.props.depth_in)),
    ) {
        assert_eq!(r.entry, e.label());
        assert_eq!(r.limits.len(), spans.len(), "the largest load at every span");
        for x in &r.reach {
            let base = case_for(&bay, e.topping, &topping_mix(&cat, &bay)).with_varied(AreaLoad::from_unit(x.load_psf, "psf"));
            let at = |s: f64| {
                let mut c = base.clone();
                c.span = Length::from_unit(s, "ft");
                evaluate_brief(&e.candidate(), &c)
            };
            let Some(s) = x.longest_span_ft else { continue };
            assert!(at(s).viable, "{} at {} psf passes at {s} ft", r.entry, x.load_psf);
            if let Some(why) = &x.stopped_by {
                // the answer is floored to the inch from a search to 0.01 ft
                let beyond = at(s + 1.0 / 12.0 + 0.011);
                assert!(!beyond.viable, "{} at {} psf fails an inch beyond {s} ft", r.entry, x.load_psf);
                // the check named fails within the inch beyond
                assert!(why.len() > 2);
                proved += 1;
            }
        }
    }
    assert!(proved >= 8, "{proved}");
}

#[test]
fn the_command_writes_every_format_by_flag_or_extension() {
    let dir = std::env::temp_dir().join(format!("plankwise-capacity-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    let (code, out, err) = run(&[
        "capacity",
        "--families",
        "hollow-core",
        "--depth",
        "8 in..10 in",
        "--loads",
        "50 psf, 100 psf",
    ]);
    assert_eq!(code, 0, "{err}");
    assert!(
        out.contains("Longest span at each live load") && out.contains("50 psf") && out.contains("plank-8in-4ft / 6x1/2"),
        "{out}"
    );
    assert!(!out.contains("plank-12in"), "the depth filter: {out}");
    for (name, want) in [
        ("t.md", "| entry |"),
        ("t.csv", "entry,section,pattern,topping_in"),
        ("t.json", "\"limits\""),
    ] {
        let p = dir.join(name);
        let (code, _, err) = run(&[
            "capacity",
            "--families",
            "hollow-core",
            "--depth",
            "8 in..8 in",
            "-o",
            p.to_str().unwrap(),
        ]);
        assert_eq!(code, 0, "{err}");
        let text = std::fs::read_to_string(&p).unwrap();
        assert!(text.contains(want), "{name}: {text}");
    }
    // never over an existing file without --force
    let p = dir.join("t.md");
    let (code, _, err) = run(&["capacity", "--families", "hollow-core", "-o", p.to_str().unwrap()]);
    assert_eq!(code, 2, "{err}");
    // SI: metres in the cells, SI keys in the CSV
    let (_, out, _) = run(&["capacity", "--families", "hollow-core", "--depth", "8 in..8 in", "--units", "si"]);
    assert!(out.contains(" m ") && out.contains("kPa") && !out.contains("'-"), "{out}");
    let (_, out, _) = run(&[
        "capacity",
        "--families",
        "hollow-core",
        "--depth",
        "8 in..8 in",
        "--units",
        "si",
        "--format",
        "csv",
    ]);
    assert!(
        out.starts_with("entry,section,pattern,topping_mm,depth_mm,weight_kpa,load_kpa,longest_span_m,stopped_by"),
        "{out}"
    );
    std::fs::remove_dir_all(&dir).ok();
}

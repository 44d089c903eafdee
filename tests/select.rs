//! Selection: ranking, envelope inversion, span map, shortlist, exit codes.

use std::process::Command;

use plankwise::bay::Objective;
use plankwise::catalog::{Catalog, DEMO_US};
use plankwise::job::{DEMO_JOB, Job};
use plankwise::select::envelope::{TOLERANCE, max_live, span_map};
use plankwise::select::{Entry, case_for, compare, rank_bay, topping_mix};

fn demo() -> (Catalog, Job) {
    (
        Catalog::from_str(DEMO_US, "demo-us.toml").unwrap(),
        Job::from_str(DEMO_JOB, "demo-job.toml").unwrap(),
    )
}

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

/// A small hand-built catalog: three sections that differ in weight, depth,
/// steel and price, so each objective picks a different winner.
const SMALL: &str = r#"
[catalog]
name = "small"
[[mix]]
id = "m"
fc = "5000 psi"
fci = "3500 psi"
unit_weight = "150 pcf"
aggregate = "carbonate"

[[section]]
id = "a-light"
mix = "m"
price = "14 /ft2"
[section.hollow_core]
width = "48 in"
depth = "10 in"
cores = { shape = "stadium", count = 6, width = "5.75 in", height = "7 in", spacing = "7.5 in" }
[[section.pattern]]
id = "p7"
strand = "1/2 in"
row = [{ count = 7, height = "1.75 in" }]

[[section]]
id = "b-shallow"
mix = "m"
price = "9 /ft2"
[section.hollow_core]
width = "48 in"
depth = "8 in"
cores = { shape = "circle", count = 3, diameter = "4 in", spacing = "12 in" }
[[section.pattern]]
id = "p4"
strand = "1/2 in"
row = [{ count = 4, height = "1.75 in" }]

[[section]]
id = "c-twin"
mix = "m"
price = "9 /ft2"
[section.hollow_core]
width = "48 in"
depth = "8 in"
cores = { shape = "circle", count = 3, diameter = "4 in", spacing = "12 in" }
[[section.pattern]]
id = "p4"
strand = "1/2 in"
row = [{ count = 4, height = "1.75 in" }]
[[section.pattern]]
id = "p1"
strand = "3/8 in"
row = [{ count = 1, height = "1.5 in" }]
"#;

fn small_job(span: &str) -> Job {
    Job::from_str(
        &format!("[job]\nproject = \"t\"\n[[bay]]\nname = \"b\"\nspan = \"{span}\"\nsdl = \"10 psf\"\nlive = \"40 psf\"\n"),
        "t.toml",
    )
    .unwrap()
}

#[test]
fn objectives_and_tie_breaks_on_a_small_catalog() {
    let cat = Catalog::from_str(SMALL, "small.toml").unwrap();
    let job = small_job("18 ft");
    let bay = &job.bays[0];
    let ids = |o: Objective| -> Vec<String> { rank_bay(&cat, bay, Some(o)).viable.iter().map(|r| r.entry.label()).collect() };
    // lightest: the 10 in cored plank (276 in²) beats the nearly solid 8 in ones (346 in²)
    assert_eq!(ids(Objective::Lightest)[0], "a-light / p7");
    // shallowest: the 8 in ones, tied on depth → next objective (lightest: equal) →
    // least steel (equal) → cheapest (equal) → most reserve (equal) → section id
    let s = ids(Objective::Shallowest);
    assert_eq!(&s[..2], &["b-shallow / p4".to_string(), "c-twin / p4".to_string()]);
    assert_eq!(ids(Objective::Cheapest)[0], "b-shallow / p4");
    // one strand of 3/8 in cannot carry 18 ft: listed with its first failure
    let r = rank_bay(&cat, bay, None);
    let f = r.failing.iter().find(|x| x.entry.pattern.id == "p1").unwrap();
    assert_eq!(f.verdict.first_failure().unwrap().info.id, "flexure");
    assert!(plankwise::select::failure_reason(f).starts_with("Flexural strength: "));
}

#[test]
fn ranking_is_a_stable_total_order() {
    let (cat, job) = demo();
    for bay in &job.bays {
        for o in Objective::ALL {
            let r = rank_bay(&cat, bay, Some(o));
            for w in r.viable.windows(2) {
                assert_eq!(compare(o, &w[0], &w[1]), std::cmp::Ordering::Less, "{} {:?}", bay.name, o);
            }
            let again: Vec<String> = rank_bay(&cat, bay, Some(o)).viable.iter().map(|x| x.entry.label()).collect();
            assert_eq!(again, r.viable.iter().map(|x| x.entry.label()).collect::<Vec<_>>());
        }
    }
}

#[test]
fn envelope_inversion_agrees_with_the_forward_check() {
    let (cat, job) = demo();
    let bay = &job.bays[0];
    for (s, p) in [
        ("plank-8in-4ft", "6x1/2"),
        ("plank-10in-4ft", "5+2x1/2-db"),
        ("plank-12in-4ft", "10x1/2"),
    ] {
        let section = cat.section(s).unwrap();
        let e = Entry {
            section,
            pattern: section.patterns.iter().find(|x| x.id == p).unwrap(),
            mix: section.mix(&cat),
            topping: None,
        };
        for span in [18.0, 24.0, 30.0] {
            let mut base = case_for(bay, None, &topping_mix(&cat, bay));
            base.span = plankwise::units::Length::from_unit(span, "ft");
            let lim = max_live(&e, &base);
            let Some(q) = lim.live_psf else { continue };
            if lim.governing == "none" {
                continue;
            }
            let mut at = base.clone();
            at.live = plankwise::units::AreaLoad::from_unit(q, "psf");
            let ev = plankwise::checks::evaluate(&e.candidate(), &at);
            let g = ev.check(&lim.governing).unwrap();
            assert!(
                (g.ratio - 1.0).abs() <= TOLERANCE,
                "{s} {p} {span} ft: {} ratio {} at {q} psf",
                g.info.id,
                g.ratio
            );
            // every other load-driven check is within its limit there
            assert!(ev.checks.iter().all(|c| c.ratio <= 1.0 + TOLERANCE), "{s} {p} {span}");
        }
    }
}

#[test]
fn capacity_never_rises_with_span() {
    let (cat, job) = demo();
    let bay = &job.bays[0];
    let section = cat.section("plank-8in-4ft").unwrap();
    let e = Entry {
        section,
        pattern: &section.patterns[1],
        mix: section.mix(&cat),
        topping: None,
    };
    let base = case_for(bay, None, &topping_mix(&cat, bay));
    let env = plankwise::select::envelope::envelope(&e, &base, &[14.0, 18.0, 22.0, 26.0, 30.0, 34.0]);
    for w in env.windows(2) {
        assert!(w[1].live_psf.unwrap_or(0.0) <= w[0].live_psf.unwrap_or(0.0) + 1e-9, "{env:?}");
    }
}

#[test]
fn span_map_breakpoints_match_brute_force() {
    let (cat, job) = demo();
    let bay = &job.bays[0];
    let runs = span_map(&cat, bay, 16.0, 32.0, 1.0, Objective::Lightest);
    // brute force on a 0.05 ft grid (in the test only): the winner at each
    // grid span equals the run's winner, away from the breakpoints
    let mut s = 16.0;
    while s <= 32.0 {
        let mut b = bay.clone();
        b.case.span = plankwise::units::Length::from_unit(s, "ft");
        let best = rank_bay(&cat, &b, Some(Objective::Lightest))
            .viable
            .first()
            .map(|r| r.entry.label());
        if let Some(run) = runs.iter().find(|r| s > r.from_ft + 0.01 && s < r.to_ft - 0.01) {
            assert_eq!(best, run.best, "at {s} ft");
        }
        s += 0.05;
    }
    assert!(runs.len() >= 2, "{runs:?}");
    for w in runs.windows(2) {
        assert!(w[1].from_ft - w[0].to_ft <= 0.006, "breakpoints within 0.01 ft: {runs:?}");
        assert_ne!(w[0].best, w[1].best);
    }
}

#[test]
fn exit_codes_say_whether_every_bay_has_a_member() {
    let (code, out, err) = run(&["rank", "--job", "demo"]);
    assert_eq!(code, 1, "the demo job has a bay no member satisfies");
    assert!(err.contains("no viable member for: Mechanical room"), "{err}");
    assert!(out.contains("NO VIABLE MEMBER"));
    let (code, _, _) = run(&["rank", "--span", "20 ft", "--sdl", "10 psf", "--live", "40 psf"]);
    assert_eq!(code, 0);
    let (code, _, err) = run(&["rank", "--span", "20 ft", "--objective", "lightst"]);
    assert_eq!(code, 2);
    assert!(err.contains("(did you mean 'lightest'?)"), "{err}");
    let (code, out, _) = run(&[
        "rank", "--span", "20 ft", "--sdl", "10 psf", "--live", "40 psf", "--json", "--top", "3",
    ]);
    assert_eq!(code, 0);
    let v: serde_json::Value = serde_json::from_str(&out).unwrap();
    assert_eq!(v[0]["viable"].as_array().unwrap().len(), 3);
    for k in [
        "section",
        "pattern",
        "weight_psf",
        "depth_in",
        "governing",
        "governing_ratio",
        "reason",
    ] {
        assert!(v[0]["viable"][0].get(k).is_some(), "{k}");
    }
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
fn shortlists_match_their_golden_files() {
    let dir = std::env::temp_dir().join(format!("plankwise-short-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    for (fmt, name) in [("text", "shortlist.txt"), ("md", "shortlist.md"), ("csv", "shortlist.csv")] {
        let out = dir.join(name);
        let (code, _, err) = run(&["shortlist", "--job", "demo", "-o", out.to_str().unwrap(), "--format", fmt]);
        assert_eq!(code, 1, "{err}");
        let text = std::fs::read_to_string(&out).unwrap();
        golden(name, &text);
        if fmt == "text" {
            assert!(text.lines().all(|l| l.chars().count() <= 80), "text shortlist fits 80 columns");
            assert_eq!(text.matches('\x0c').count(), 6, "a page break between the seven bays");
            for c in plankwise::report::CAUTIONS {
                assert!(text.contains(c));
            }
        }
    }
    std::fs::remove_dir_all(&dir).unwrap();
}

#[test]
fn shortlist_never_overwrites_without_force_nor_an_input() {
    let dir = std::env::temp_dir().join(format!("plankwise-keep-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let out = dir.join("mine.txt");
    std::fs::write(&out, "the user's own words").unwrap();
    let (code, _, err) = run(&["shortlist", "--job", "demo", "-o", out.to_str().unwrap()]);
    assert_eq!(code, 2);
    assert!(err.contains("exists; pass --force"), "{err}");
    assert_eq!(std::fs::read_to_string(&out).unwrap(), "the user's own words");
    let job = dir.join("job.toml");
    std::fs::write(&job, DEMO_JOB).unwrap();
    let (code, _, err) = run(&["shortlist", "--job", job.to_str().unwrap(), "-o", job.to_str().unwrap(), "--force"]);
    assert_eq!(code, 2);
    assert!(err.contains("is an input file"), "{err}");
    assert_eq!(std::fs::read_to_string(&job).unwrap(), DEMO_JOB);
    let (code, _, _) = run(&["shortlist", "--job", "demo", "-o", out.to_str().unwrap(), "--force"]);
    assert_eq!(code, 1);
    assert!(std::fs::read_to_string(&out).unwrap().starts_with("PRECAST MEMBER SHORTLIST"));
    // no temporary file left behind
    assert_eq!(std::fs::read_dir(&dir).unwrap().count(), 2);
    std::fs::remove_dir_all(&dir).unwrap();
}

#[test]
fn completions_are_printed() {
    let (code, out, _) = run(&["completions", "bash"]);
    assert_eq!(code, 0);
    assert!(out.contains("shortlist") && out.contains("envelope"));
}

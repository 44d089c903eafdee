//! Every bay criterion walked through all four routes — the job reader,
//! the command-line flags, the UI editor and the job writer — expecting the
//! same value accepted, the same value refused with the same words, and a
//! written value read back unchanged.

use std::process::Command;

use plankwise::bay::Bay;
use plankwise::catalog::{Catalog, DEMO_US};
use plankwise::criteria::{CRITERIA, Criterion, Form, Value};
use plankwise::job::Job;
use plankwise::tui::keymap::Key;
use plankwise::tui::{Action, App, Focus, update};
use plankwise::units::{Length, System};

/// A value the criterion refuses, and one it takes.
fn samples(c: &Criterion) -> (Option<String>, String) {
    let fmt = |v: f64| plankwise::units::trim_number(v, 6);
    match c.form {
        Form::Quantity { range, .. } => (
            Some(format!("{} {}", fmt(range.hi * 10.0 + 1.0), range.unit)),
            format!("{} {}", fmt((range.lo + range.hi) / 2.0), range.unit),
        ),
        Form::Number { range } => (Some(fmt(range.hi + 1.0)), fmt((range.lo + range.hi) / 2.0)),
        Form::Count { hi, .. } => (Some((hi + 1).to_string()), "3".into()),
        Form::Choice(ch) => (Some("nonsense".into()), ch[ch.len() - 1].to_string()),
        Form::Flag => (None, "true".into()),
        Form::Rating => (Some("2.5 h".into()), "2 h".into()),
        Form::QuantityList { range, .. } => (
            Some(format!("none, {} {}", fmt(range.hi * 10.0), range.unit)),
            format!("none, {} {}", fmt(range.lo.max(1.0)), range.unit),
        ),
        Form::ChoiceList(ch) => (Some("hollowcore".into()), ch[0].to_string()),
        Form::Text if c.required => (Some("tab\u{1b}[31mred".into()), "A bay".into()),
        Form::Text => (Some("mix\u{1b}[2J".into()), "topping-4000".into()),
        Form::ChoiceOrQuantity { range, .. } => (
            Some(format!("{} {}", fmt(range.hi * 10.0 + 1.0), range.unit)),
            format!("{} {}", fmt((range.lo + range.hi) / 2.0), range.unit),
        ),
    }
}

/// The value as a TOML value in a job file.
fn toml(c: &Criterion, text: &str) -> String {
    match c.form {
        Form::Number { .. } | Form::Count { .. } | Form::Flag => text.to_string(),
        Form::QuantityList { .. } | Form::ChoiceList(_) => {
            let items: Vec<String> = text.split(',').map(|p| quote(p.trim())).collect();
            format!("[{}]", items.join(", "))
        }
        _ => quote(text),
    }
}

fn quote(s: &str) -> String {
    toml::Value::String(s.to_string()).to_string()
}

fn job_with(c: &Criterion, text: &str) -> String {
    let name = if c.key == "name" { String::new() } else { "name = \"b\"\n".into() };
    let span = if c.key == "span" {
        String::new()
    } else {
        "span = \"20 ft\"\n".into()
    };
    format!("[job]\nproject = \"p\"\n\n[[bay]]\n{name}{span}{} = {}\n", c.key, toml(c, text))
}

/// Values equal, numbers to a relative 1e-8 (a value written in the other
/// system's units comes back rounded to the places written).
fn same(a: &Value, b: &Value) -> bool {
    let near = |x: f64, y: f64| (x - y).abs() <= 1e-8 * x.abs().max(y.abs()).max(1e-12);
    match (a, b) {
        (Value::Num(Some(x)), Value::Num(Some(y))) => near(*x, *y),
        (Value::List(x), Value::List(y)) => {
            x.len() == y.len()
                && x.iter().zip(y).all(|(p, q)| match (p, q) {
                    (Some(p), Some(q)) => near(*p, *q),
                    (p, q) => p == q,
                })
        }
        _ => a == b,
    }
}

fn cli(args: &[&str]) -> (i32, String) {
    let out = Command::new(env!("CARGO_BIN_EXE_plankwise")).args(args).output().unwrap();
    (out.status.code().unwrap_or(-1), String::from_utf8_lossy(&out.stderr).into_owned())
}

#[test]
fn every_criterion_reads_the_same_through_all_four_routes() {
    let cat = Catalog::from_str(DEMO_US, "demo-us.toml").unwrap();
    for (i, c) in CRITERIA.iter().enumerate() {
        let (bad, good) = samples(c);
        // the words every route must show for the refused value
        if let Some(bad) = &bad {
            let want = c.parse(bad).expect_err(c.key);
            // 1. the job reader
            let e = Job::from_str(&job_with(c, bad), "j.toml").expect_err(c.key).to_string();
            assert!(e.contains(&want), "{}: job reader said\n{e}\nnot\n{want}", c.key);
            // 2. the flag
            if let Some(flag) = c.flag {
                let mut args = vec!["rank", "--top", "1"];
                if c.key != "span" {
                    args.extend(["--span", "20 ft"]);
                }
                let f = format!("--{flag}");
                args.extend([f.as_str(), bad.as_str()]);
                let (code, err) = cli(&args);
                assert_eq!(code, 2, "{}: {err}", c.key);
                assert!(
                    err.contains(&format!("--{flag}: {want}")),
                    "{}: the flag said\n{err}\nnot\n{want}",
                    c.key
                );
            }
            // 3. the UI editor (criteria typed as text)
            if !matches!(c.form, Form::Choice(_) | Form::Flag | Form::Rating) {
                let job = Job::single("p", Bay::new("b", Length::from_unit(20.0, "ft")));
                let mut a = App::new(cat.clone(), job, None);
                a.focus = Focus::Bay;
                a.field = i;
                update(&mut a, Action::Edit);
                for _ in 0..40 {
                    update(&mut a, Action::Input(Key::Backspace));
                }
                for ch in bad.chars() {
                    update(&mut a, Action::Input(Key::Char(ch)));
                }
                update(&mut a, Action::Input(Key::Enter));
                assert!(a.status.1 && a.status.0.contains(&want), "{}: the UI said {:?}", c.key, a.status);
            }
        }
        // the accepted value: read by the job reader, the flag and the UI
        let from_job = Job::from_str(&job_with(c, &good), "j.toml").unwrap_or_else(|e| panic!("{}: {e}", c.key));
        let v = c.value(&from_job.bays[0]);
        assert_eq!(c.parse(&good).unwrap(), v, "{}", c.key);
        if let Some(flag) = c.flag {
            let mut args = vec!["rank", "--top", "1"];
            if c.key != "span" {
                args.extend(["--span", "20 ft"]);
            }
            let f = format!("--{flag}");
            args.push(&f);
            if c.form != Form::Flag {
                args.push(&good);
            }
            let (code, err) = cli(&args);
            assert!(code == 0 || code == 1, "{}: {err}", c.key);
        }
        // 4. the writer: a fresh file and the file edited in place read back the same
        for sys in [System::Us, System::Si] {
            let text = from_job.to_toml(sys);
            let back = Job::from_str(&text, "written.toml").unwrap_or_else(|e| panic!("{}: {e}\n{text}", c.key));
            assert!(same(&c.value(&back.bays[0]), &v), "{} ({sys:?}) wrote\n{text}", c.key);
        }
        let mut edited = Job::from_str(
            &job_with(c, &c.show(&Bay::new("b", Length::from_unit(20.0, "ft")), System::Us)),
            "j.toml",
        );
        if let Ok(j) = &mut edited {
            c.set(&mut j.bays[0], v.clone());
            let text = j.save_text(System::Us);
            let back = Job::from_str(&text, "saved.toml").unwrap_or_else(|e| panic!("{}: {e}\n{text}", c.key));
            assert_eq!(c.value(&back.bays[0]), v, "{} saved\n{text}", c.key);
        }
    }
}

/// A commented job with `[defaults]`: edit one value, save, and the only
/// line that changes is that value's, written in the unit it was typed in.
#[test]
fn saving_a_job_changes_only_the_edited_line() {
    let original = "# A job of our own\n\n[job]\nproject = \"Round trip\"   # the name\n\n[defaults]\nclass = \"T\"   # transition allowed\ntoppings = [\"none\"]\n\n# the first bay\n[[bay]]\nname = \"One\"\nspan = \"30 ft 6 in\"   # grid A–B\nlive = \"2.4 kPa\"\n\n[[bay]]\nname = \"Two\"\nspan = \"24'-0\\\"\"\nfire = \"none\"\n";
    let mut job = Job::from_str(original, "j.toml").unwrap();
    assert_eq!(job.bays[0].case.class_allowed, plankwise::case::ServiceClass::T);
    // a span step of 1 ft on bay One
    job.bays[0].case.span = Length::new(job.bays[0].case.span.get() + 12.0);
    let saved = job.save_text(System::Us);
    let (a, b): (Vec<&str>, Vec<&str>) = (original.lines().collect(), saved.lines().collect());
    assert_eq!(a.len(), b.len(), "{saved}");
    let diff: Vec<(&str, &str)> = a.iter().zip(&b).filter(|(x, y)| x != y).map(|(x, y)| (*x, *y)).collect();
    assert_eq!(
        diff,
        vec![("span = \"30 ft 6 in\"   # grid A–B", "span = \"31 ft 6 in\"   # grid A–B")],
        "{saved}"
    );
    // a typed value keeps the unit it was typed in
    let mut job = Job::from_str(original, "j.toml").unwrap();
    plankwise::criteria::find("live").unwrap().apply(&mut job.bays[0], "3 kPa").unwrap();
    job.typed.insert((0, "live"), "3 kPa".into());
    let saved = job.save_text(System::Us);
    assert!(saved.contains("live = \"3 kPa\""), "{saved}");
    // marks are kept with the job and read back
    let mut job = Job::from_str(original, "j.toml").unwrap();
    job.bays[1].marked = vec!["plank-8in-4ft / 6x1/2".into()];
    let saved = job.save_text(System::Us);
    let back = Job::from_str(&saved, "j.toml").unwrap();
    assert_eq!(back.bays[1].marked, job.bays[1].marked);
    assert_eq!(back.bays[1].case.fire_rating, None, "fire = \"none\" drops an inherited rating");
}

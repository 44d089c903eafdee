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

/// Every kind of load and opening through the same four routes: a job
/// file, a flag, the UI's pane (add, edit, remove) and the writer — the same
/// item read, the same words for a refused one.
#[test]
fn every_item_reads_the_same_through_all_four_routes() {
    use plankwise::items::ITEMS;
    let cat = Catalog::from_str(DEMO_US, "demo-us.toml").unwrap();
    let good = |key: &str| match key {
        "line" => "w=0.6 klf, at=8 ft, kind=live",
        "point" => "p=4 kip, at=12 ft, across=24 in, long=8 in, wide=8 in, kind=snow",
        "strip" => "w=0.5 klf, from=2 ft, to=18 ft, kind=dead",
        "patch" => "q=150 psf, from=10 ft, to=16 ft, across=6 in, wide=30 in, kind=roof-live",
        _ => "from=8 ft, to=11 ft, across=12 in, wide=20 in, header=0.2 klf",
    };
    // a place beyond the 20 ft span: refused in the same words everywhere
    let bad = |key: &str| match key {
        "line" => "w=0.6 klf, at=28 ft",
        "point" => "p=4 kip, at=28 ft",
        "strip" => "w=0.5 klf, from=2 ft, to=28 ft",
        "patch" => "q=150 psf, from=10 ft, to=28 ft, wide=30 in",
        _ => "from=8 ft, to=28 ft, wide=20 in",
    };
    let as_toml = |text: &str| {
        let parts: Vec<String> = text
            .split(',')
            .map(|p| {
                let (k, v) = p.split_once('=').unwrap();
                format!("{} = {}", k.trim(), quote(v.trim()))
            })
            .collect();
        format!("[{{ {} }}]", parts.join(", "))
    };
    let job = |key: &str, text: &str| {
        format!(
            "[job]\nproject = \"p\"\n\n[[bay]]\nname = \"b\"\nspan = \"20 ft\"\n{key} = {}\n",
            as_toml(text)
        )
    };
    for k in ITEMS {
        let base = Bay::new("b", Length::from_unit(20.0, "ft")).case;
        let want = k.parse(bad(k.key), &base).expect_err(k.key);
        // 1. the job reader
        let e = Job::from_str(&job(k.key, bad(k.key)), "j.toml").expect_err(k.key).to_string();
        assert!(
            e.contains(want.split_once(": ").map_or(want.as_str(), |p| p.1)),
            "{}: job said\n{e}\nnot\n{want}",
            k.key
        );
        // 2. the flag
        let flag = format!("--{}", k.flag);
        let (code, err) = cli(&["rank", "--top", "1", "--span", "20 ft", &flag, bad(k.key)]);
        assert_eq!(code, 2, "{}: {err}", k.key);
        assert!(
            err.contains(&format!("{flag}: {want}")),
            "{}: the flag said\n{err}\nnot\n{want}",
            k.key
        );
        // 3. the UI: the add row of the kind, typed
        let mut a = App::new(cat.clone(), Job::single("p", Bay::new("b", Length::from_unit(20.0, "ft"))), None);
        a.focus = Focus::Bay;
        let add = a
            .pane_rows()
            .iter()
            .position(|r| matches!(r, plankwise::tui::PaneRow::Add(x) if x.key == k.key))
            .unwrap();
        let type_in = |a: &mut App, row: usize, text: &str| {
            a.field = row;
            update(a, Action::Edit);
            for _ in 0..120 {
                update(a, Action::Input(Key::Backspace));
            }
            for ch in text.chars() {
                update(a, Action::Input(Key::Char(ch)));
            }
            update(a, Action::Input(Key::Enter));
        };
        type_in(&mut a, add, bad(k.key));
        assert!(a.status.1 && a.status.0.contains(&want), "{}: the UI said {:?}", k.key, a.status);
        type_in(&mut a, add, good(k.key));
        assert!(!a.status.1, "{}: {:?}", k.key, a.status);
        let v = k.parse(good(k.key), &base).unwrap();
        assert_eq!(k.list(&a.current_bay().case), vec![v.clone()], "{}", k.key);
        // edit it in its own row, then remove it
        let row = a
            .pane_rows()
            .iter()
            .position(|r| matches!(r, plankwise::tui::PaneRow::Item(x, 0) if x.key == k.key))
            .unwrap();
        let shown = a.row_text(row).1;
        assert_eq!(k.parse(&shown, &base).unwrap(), v, "{}: shown as {shown}", k.key);
        a.field = row;
        update(&mut a, Action::Remove);
        assert!(k.list(&a.current_bay().case).is_empty(), "{}", k.key);
        // 4. the job file and the writer
        let from_job = Job::from_str(&job(k.key, good(k.key)), "j.toml").unwrap_or_else(|e| panic!("{}: {e}", k.key));
        assert_eq!(k.list(&from_job.bays[0].case), vec![v.clone()], "{}", k.key);
        let (code, err) = cli(&["rank", "--top", "1", "--span", "20 ft", &flag, good(k.key)]);
        assert!(code == 0 || code == 1, "{}: {err}", k.key);
        for sys in [System::Us, System::Si] {
            let text = from_job.to_toml(sys);
            let back = Job::from_str(&text, "w.toml").unwrap_or_else(|e| panic!("{}: {e}\n{text}", k.key));
            let got = k.list(&back.bays[0].case);
            assert_eq!(got.len(), 1, "{}", k.key);
            for (x, y) in got[0].iter().zip(&v) {
                match (x, y) {
                    (plankwise::items::Val::Num(Some(p)), plankwise::items::Val::Num(Some(q))) => {
                        assert!((p - q).abs() <= 1e-5 * q.abs().max(1.0), "{} ({sys:?}): {p} vs {q}\n{text}", k.key)
                    }
                    _ => assert_eq!(x, y, "{} ({sys:?})\n{text}", k.key),
                }
            }
        }
    }
}

/// Saving a job whose bay lists loads: an edited item is the only line
/// that changes; one removed from the middle takes its table with it and
/// leaves the others as typed.
#[test]
fn saving_edits_only_the_item_that_changed() {
    let original = "[job]\nproject = \"p\"\n\n[[bay]]\nname = \"b\"\nspan = \"24 ft\"\npoint = [\n  { p = \"2 kip\", at = \"4 ft\" },   # a post\n  { p = \"3.0 kip\", at = \"12 ft\", kind = \"live\" },\n  { p = \"13.3 kN\", at = \"6.1 m\" },\n]\n";
    let job = Job::from_str(original, "j.toml").unwrap();
    let k = plankwise::items::find("point").unwrap();
    // edit the second
    let mut edited = job.clone();
    let mut all = k.list(&edited.bays[0].case);
    all[1] = k.parse("p=3.5 kip, at=12 ft, kind=live", &edited.bays[0].case).unwrap();
    k.store(&mut edited.bays[0].case, all);
    let saved = edited.save_text(System::Us);
    let diff: Vec<(&str, &str)> = original.lines().zip(saved.lines()).filter(|(a, b)| a != b).collect();
    assert_eq!(diff.len(), 1, "{saved}");
    assert!(diff[0].1.contains("3.5 kip") && diff[0].0.contains("3.0 kip"), "{diff:?}");
    // remove the first: the comment's line goes, the rest stay as typed
    let mut removed = job.clone();
    let mut all = k.list(&removed.bays[0].case);
    all.remove(0);
    k.store(&mut removed.bays[0].case, all);
    let saved = removed.save_text(System::Us);
    assert!(!saved.contains("2 kip"), "{saved}");
    assert!(
        saved.contains("p = \"3.0 kip\"") && saved.contains("p = \"13.3 kN\", at = \"6.1 m\""),
        "{saved}"
    );
    let back = Job::from_str(&saved, "j.toml").unwrap();
    assert_eq!(k.list(&back.bays[0].case).len(), 2);
}

/// The job file's schema: the committed copy is the generated one, every
/// `[job]` key of the schema is read and no other, and every bay criterion
/// and kind of load is in it with its description.
#[test]
fn the_job_schema_is_generated_from_the_definitions() {
    let generated = serde_json::to_string_pretty(&plankwise::schema::job()).unwrap() + "\n";
    let path = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("catalog/job.schema.json");
    if std::env::var_os("PLANKWISE_BLESS").is_some() {
        std::fs::write(&path, &generated).unwrap();
    }
    assert_eq!(
        std::fs::read_to_string(&path).unwrap(),
        generated,
        "regenerate: plankwise job-schema > catalog/job.schema.json"
    );
    let schema = plankwise::schema::job();
    let bay = &schema["properties"]["bay"]["items"]["properties"];
    for c in plankwise::criteria::CRITERIA {
        assert!(bay[c.key]["description"].as_str().is_some_and(|d| d.contains(c.help)), "{}", c.key);
    }
    for k in plankwise::items::ITEMS {
        assert!(bay[k.key]["items"]["properties"].is_object(), "{}", k.key);
    }
    // the reader takes every [job] key of the schema, and refuses another
    let mut text = String::from("[job]\n");
    for (key, kind, _) in plankwise::job::JOB_KEYS {
        text.push_str(&match *kind {
            "list" => format!("{key} = [\"a\"]\n"),
            "boolean" => format!("{key} = true\n"),
            "units" => format!("{key} = \"si\"\n"),
            _ => format!("{key} = \"x\"\n"),
        });
    }
    text.push_str("[[bay]]\nname = \"b\"\nspan = \"20 ft\"\n");
    Job::from_str(&text, "all.toml").unwrap_or_else(|e| panic!("{e}"));
    let e = Job::from_str(&text.replace("[job]\n", "[job]\nmystery = 1\n"), "x.toml")
        .unwrap_err()
        .to_string();
    assert!(e.contains("mystery"), "{e}");
}

/// The catalog file's schema: the committed copy is the generated one, and
/// every key of the key table is in it with its description, unit kind,
/// default and range.
#[test]
fn the_catalog_schema_is_generated_from_the_key_table() {
    use plankwise::catalog::keys::{self, Value};
    let generated = serde_json::to_string_pretty(&plankwise::schema::catalog()).unwrap() + "\n";
    let path = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("catalog/catalog.schema.json");
    if std::env::var_os("PLANKWISE_BLESS").is_some() {
        std::fs::write(&path, &generated).unwrap();
    }
    assert_eq!(
        std::fs::read_to_string(&path).unwrap(),
        generated,
        "regenerate: plankwise catalog-schema > catalog/catalog.schema.json"
    );
    // walk the schema along the tables' paths
    let schema = plankwise::schema::catalog();
    let mut seen = 0;
    for t in keys::tables() {
        let mut node = &schema;
        for part in t.path.split('.').filter(|p| !p.is_empty()) {
            node = &node["properties"][part];
            if node["type"] == "array" {
                node = &node["items"];
            }
        }
        assert_eq!(node["additionalProperties"], false, "[{}]", t.path);
        for k in t.keys {
            let s = &node["properties"][k.name];
            let d = s["description"]
                .as_str()
                .unwrap_or_else(|| panic!("{}.{} has no description", t.path, k.name));
            assert!(d.starts_with(k.help), "{}.{}", t.path, k.name);
            if !k.default.is_empty() {
                assert!(d.contains(&format!("default {}", k.default)), "{}.{}: {d}", t.path, k.name);
            }
            if let Value::Quantity { kind, .. } = k.value {
                assert_eq!(s["x-unit-kind"], kind, "{}.{}", t.path, k.name);
            }
            match (k.value, k.range()) {
                (Value::Number(r), _) => {
                    assert_eq!(
                        (s["minimum"].as_f64(), s["maximum"].as_f64()),
                        (Some(r.lo), Some(r.hi)),
                        "{}.{}",
                        t.path,
                        k.name
                    )
                }
                (_, Some(r)) => assert_eq!(s["x-range"], serde_json::json!([r.lo, r.hi, r.unit]), "{}.{}", t.path, k.name),
                _ => {}
            }
            if let Value::Count(lo, hi) = k.value {
                assert_eq!(
                    (s["minimum"].as_i64(), s["maximum"].as_i64()),
                    (Some(lo), Some(hi)),
                    "{}.{}",
                    t.path,
                    k.name
                );
            }
            assert_eq!(
                node["required"].as_array().unwrap().iter().any(|r| r == k.name),
                k.required,
                "{}.{}",
                t.path,
                k.name
            );
            seen += 1;
        }
    }
    assert!(seen > 60, "{seen} keys");
}

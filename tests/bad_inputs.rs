//! Every broken catalog in tests/bad/catalog must be refused with exit code 2,
//! its expected message, a file:line:column location, no panic, and no file
//! created or changed. The files are written by tests/bad/catalog/make.py
//! from tests/good/minimal.toml, one fault each.

use std::fs;
use std::path::{Path, PathBuf};
use std::process::Command;

fn bin() -> &'static str {
    env!("CARGO_BIN_EXE_plankwise")
}

fn snapshot(dir: &Path) -> Vec<(PathBuf, Vec<u8>)> {
    let mut v: Vec<_> = fs::read_dir(dir)
        .unwrap()
        .map(|e| e.unwrap().path())
        .map(|p| {
            let bytes = if p.is_file() { fs::read(&p).unwrap() } else { Vec::new() };
            (p, bytes)
        })
        .collect();
    v.sort();
    v
}

/// Run `plankwise validate FILE` in a scratch folder holding a copy of it.
fn refuse(name: &str, bytes: &[u8]) -> String {
    let dir = std::env::temp_dir().join(format!("plankwise-bad-{}-{name}", std::process::id()));
    let _ = fs::remove_dir_all(&dir);
    fs::create_dir_all(&dir).unwrap();
    let file = dir.join(name);
    fs::write(&file, bytes).unwrap();
    let before = snapshot(&dir);
    let out = Command::new(bin()).arg("validate").arg(name).current_dir(&dir).output().unwrap();
    let after = snapshot(&dir);
    let stderr = String::from_utf8_lossy(&out.stderr).into_owned();
    assert_eq!(out.status.code(), Some(2), "{name}: exit code; stderr:\n{stderr}");
    assert!(out.stdout.is_empty(), "{name}: nothing on stdout");
    assert!(!stderr.contains("panicked"), "{name}: panic:\n{stderr}");
    assert_eq!(before, after, "{name}: files created or changed");
    fs::remove_dir_all(&dir).unwrap();
    stderr
}

#[test]
fn every_broken_catalog_is_refused_with_its_message() {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/bad/catalog");
    let mut n = 0;
    for entry in fs::read_dir(&dir).unwrap() {
        let path = entry.unwrap().path();
        if path.extension().and_then(|e| e.to_str()) != Some("toml") {
            continue;
        }
        let text = fs::read_to_string(&path).unwrap();
        let expect = text
            .lines()
            .next()
            .and_then(|l| l.strip_prefix("# expect: "))
            .unwrap_or_else(|| panic!("{} has no expect line", path.display()));
        let name = path.file_name().unwrap().to_str().unwrap();
        let stderr = refuse(name, text.as_bytes());
        assert!(stderr.contains(expect), "{name}: expected '{expect}' in:\n{stderr}");
        // every error names the file, and a line and column
        let first = stderr.lines().next().unwrap();
        let loc = format!("{name}:");
        assert!(first.starts_with(&loc), "{name}: no file name in '{first}'");
        let mut parts = first[loc.len()..].splitn(3, ':');
        let line: usize = parts
            .next()
            .unwrap()
            .parse()
            .unwrap_or_else(|_| panic!("{name}: no line in '{first}'"));
        let col: usize = parts
            .next()
            .unwrap()
            .parse()
            .unwrap_or_else(|_| panic!("{name}: no column in '{first}'"));
        assert!(line >= 1 && col >= 1, "{name}");
        n += 1;
    }
    assert!(n >= 60, "only {n} broken catalogs");
}

#[test]
fn misspelt_key_is_located_at_its_line_and_column() {
    let text = fs::read_to_string(Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/bad/catalog/unknown-key-misspelt.toml")).unwrap();
    let line = text.lines().position(|l| l.starts_with("widht")).unwrap() + 1;
    let stderr = refuse("misspelt.toml", text.as_bytes());
    assert!(
        stderr.starts_with(&format!(
            "misspelt.toml:{line}:1: error: section 'hc8' / hollow_core / widht: unknown key 'widht' (did you mean 'width'?)"
        )),
        "{stderr}"
    );
}

#[test]
fn all_problems_are_reported_at_once() {
    let base = fs::read_to_string(Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/good/minimal.toml")).unwrap();
    let text = base
        .replacen("fc = \"5000 psi\"", "fc = \"50000 psi\"", 1)
        .replacen("spacing = \"7.5 in\"", "spacing = \"5 in\"", 1)
        .replacen("stem_spacing = \"48 in\"", "stem_spacing = \"100 in\"", 1)
        .replacen("strand = \"1/2 in\"", "strand = \"1/2 inch\"", 1);
    let stderr = refuse("many.toml", text.as_bytes());
    for frag in [
        "plausible range 2500",
        "overlap each other",
        "stems do not fit",
        "no strand '1/2 inch'",
        "4 problems found",
    ] {
        assert!(stderr.contains(frag), "missing '{frag}' in:\n{stderr}");
    }
}

#[test]
fn non_utf8_bytes_are_refused() {
    let mut bytes = b"[catalog]\nname = \"caf".to_vec();
    bytes.extend([0xff, 0xfe]);
    bytes.extend(b"\"\n");
    let stderr = refuse("latin.toml", &bytes);
    assert!(stderr.contains("latin.toml:2:12: error: byte 21 is not valid UTF-8"), "{stderr}");
}

#[test]
fn a_20_mb_file_is_refused() {
    let mut bytes = b"[catalog]\nname = \"big\"\n".to_vec();
    bytes.resize(20_000_000, b'#');
    let stderr = refuse("big.toml", &bytes);
    assert!(
        stderr.contains("big.toml: error: is larger than 16 MB; plankwise reads files of at most that size"),
        "{stderr}"
    );
}

#[test]
fn a_folder_a_missing_file_and_a_dangling_link_are_refused() {
    let dir = std::env::temp_dir().join(format!("plankwise-dirs-{}", std::process::id()));
    let _ = fs::remove_dir_all(&dir);
    fs::create_dir_all(dir.join("sub.toml")).unwrap();
    let run = |arg: &str| {
        let out = Command::new(bin()).arg("validate").arg(arg).current_dir(&dir).output().unwrap();
        (out.status.code(), String::from_utf8_lossy(&out.stderr).into_owned())
    };
    let (code, err) = run("sub.toml");
    assert_eq!(code, Some(2));
    assert!(err.contains("sub.toml: error: is a folder, not a regular file"), "{err}");
    let (code, err) = run("nothing-here.toml");
    assert_eq!(code, Some(2));
    assert!(err.contains("nothing-here.toml: error: cannot read the file"), "{err}");
    // A file that cannot be read. Permission bits do not stop root, which
    // runs CI, so a link to nowhere stands in for an unreadable file.
    #[cfg(unix)]
    {
        std::os::unix::fs::symlink(dir.join("gone.toml"), dir.join("link.toml")).unwrap();
        let (code, err) = run("link.toml");
        assert_eq!(code, Some(2));
        assert!(err.contains("link.toml: error: cannot read the file"), "{err}");
    }
    fs::remove_dir_all(&dir).unwrap();
}

#[test]
fn every_broken_job_is_refused_with_its_message() {
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let dir = root.join("tests/bad/job");
    let mut n = 0;
    for entry in fs::read_dir(&dir).unwrap() {
        let path = entry.unwrap().path();
        if path.extension().and_then(|e| e.to_str()) != Some("toml") {
            continue;
        }
        let text = fs::read_to_string(&path).unwrap();
        let expect = text.lines().next().and_then(|l| l.strip_prefix("# expect: ")).unwrap();
        let catalog = text
            .lines()
            .find_map(|l| l.strip_prefix("# catalog: "))
            .unwrap_or("catalog/demo-us.toml");
        let name = path.file_name().unwrap().to_str().unwrap();
        let scratch = std::env::temp_dir().join(format!("plankwise-badjob-{}-{name}", std::process::id()));
        let _ = fs::remove_dir_all(&scratch);
        fs::create_dir_all(&scratch).unwrap();
        fs::write(scratch.join(name), &text).unwrap();
        let before = snapshot(&scratch);
        let out = Command::new(bin())
            .args(["rank", root.join(catalog).to_str().unwrap(), "--job", name])
            .current_dir(&scratch)
            .output()
            .unwrap();
        let stderr = String::from_utf8_lossy(&out.stderr);
        assert_eq!(out.status.code(), Some(2), "{name}: {stderr}");
        assert!(stderr.contains(expect), "{name}: expected '{expect}' in:\n{stderr}");
        assert!(!stderr.contains("panicked"), "{name}");
        assert!(out.stdout.is_empty(), "{name}: nothing on stdout");
        assert_eq!(before, snapshot(&scratch), "{name}: files created or changed");
        fs::remove_dir_all(&scratch).unwrap();
        n += 1;
    }
    assert!(n >= 20, "{n}");
}

/// Every problem at once, within one entry too: the fields that do not
/// depend on a failed one are still checked, each with its location; a
/// field that depends on a failed one (a line load's place on a bad span)
/// is not judged.
#[test]
fn every_independent_field_of_an_entry_is_checked() {
    let dir = std::env::temp_dir().join(format!("plankwise-multi-{}", std::process::id()));
    let _ = fs::remove_dir_all(&dir);
    fs::create_dir_all(&dir).unwrap();
    fs::write(
        dir.join("cat.toml"),
        "[catalog]\nname = \"multi\"\n[[mix]]\nid = \"m\"\nfc = \"50000 psi\"\nfci = \"3500 ft\"\nunit_weight = \"300 pcf\"\naggregate = \"carbonat\"\n[[section]]\nid = \"s\"\nmix = \"m\"\nprice = \"-3 /ft2\"\n[section.hollow_core]\nwidth = \"48 in\"\ndepth = \"8 in 9 in\"\ncores = { shape = \"circle\", count = 6, diameter = \"5.5 in\", spacing = \"7.5 in\" }\n[[section.pattern]]\nid = \"p\"\nstrand = \"1/2 in\"\njacking = 0.99\nrow = [{ count = 6, height = \"1.75 in\" }]\n",
    )
    .unwrap();
    let out = Command::new(bin())
        .args(["validate", "cat.toml"])
        .current_dir(&dir)
        .output()
        .unwrap();
    let err = String::from_utf8_lossy(&out.stderr);
    for frag in [
        "cat.toml:5:6: error: mix 'm' / fc:",
        "cat.toml:6:7: error: mix 'm' / fci:",
        "cat.toml:7:15: error: mix 'm' / unit_weight:",
        "cat.toml:8:13: error: mix 'm' / aggregate:",
        "cat.toml:12:9: error: section 's' / price:",
        "cat.toml:15:9: error: section 's' / hollow_core / depth:",
        "cat.toml:20:11: error: section 's' / pattern 'p' / jacking:",
    ] {
        assert!(err.contains(frag), "missing '{frag}' in:\n{err}");
    }
    fs::write(
        dir.join("job.toml"),
        "[job]\nproject = \"p\"\n[[bay]]\nname = \"b\"\nspan = \"900 ft\"\nlive = \"-5 psf\"\nclass = \"X\"\nhumidity = 5\nline = [{ w = \"1 klf\", at = \"2000 ft\" }]\n",
    )
    .unwrap();
    let out = Command::new(bin())
        .args(["rank", "--job", "job.toml"])
        .current_dir(&dir)
        .output()
        .unwrap();
    let err = String::from_utf8_lossy(&out.stderr);
    assert_eq!(out.status.code(), Some(2));
    for frag in [
        "job.toml:5:8: error: bay 'b' / span:",
        "job.toml:6:8: error: bay 'b' / live:",
        "job.toml:7:9: error: bay 'b' / class:",
        "job.toml:8:12: error: bay 'b' / humidity:",
    ] {
        assert!(err.contains(frag), "missing '{frag}' in:\n{err}");
    }
    assert!(
        !err.contains("line 1 / at"),
        "a line load's place is not judged on a span that did not read:\n{err}"
    );
    fs::remove_dir_all(&dir).unwrap();
}

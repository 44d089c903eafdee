//! The user's files are safe: writes refuse what is not a regular file
//! (a device node, a FIFO, a folder, a symlink to one) even with --force,
//! never land on an input, and keep a symlink a symlink; reads refuse a
//! FIFO or a device at once instead of blocking or reading for ever. Every
//! node is made by the test in a temporary folder, never the system's own.

#![cfg(unix)]

use std::fs;
use std::path::{Path, PathBuf};
use std::process::{Command, Output};
use std::time::{Duration, Instant};

fn bin() -> &'static str {
    env!("CARGO_BIN_EXE_plankwise")
}

fn scratch(name: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("plankwise-files-{name}-{}", std::process::id()));
    let _ = fs::remove_dir_all(&d);
    fs::create_dir_all(&d).unwrap();
    d
}

/// Run with a time limit: a read that blocked would hang the test.
fn run(dir: &Path, args: &[&str]) -> Output {
    let mut child = Command::new(bin())
        .args(args)
        .current_dir(dir)
        .stdout(std::process::Stdio::piped())
        .stderr(std::process::Stdio::piped())
        .spawn()
        .unwrap();
    let start = Instant::now();
    while child.try_wait().unwrap().is_none() {
        if start.elapsed() > Duration::from_secs(20) {
            let _ = child.kill();
            panic!("plankwise {args:?} did not finish: it blocked");
        }
        std::thread::sleep(Duration::from_millis(20));
    }
    child.wait_with_output().unwrap()
}

fn made(cmd: &str, args: &[&str]) -> bool {
    Command::new(cmd).args(args).status().is_ok_and(|s| s.success())
}

fn shortlist_to(dir: &Path, out: &str, force: bool) -> (i32, String) {
    let mut args = vec!["shortlist", "--job", "demo", "-o", out];
    if force {
        args.push("--force");
    }
    let o = run(dir, &args);
    (o.status.code().unwrap_or(-1), String::from_utf8_lossy(&o.stderr).into_owned())
}

#[test]
fn writes_onto_a_fifo_a_device_a_folder_or_a_link_to_one_are_refused_even_with_force() {
    let d = scratch("targets");
    assert!(made("mkfifo", &[d.join("pipe").to_str().unwrap()]), "mkfifo");
    fs::create_dir(d.join("folder")).unwrap();
    std::os::unix::fs::symlink(d.join("pipe"), d.join("to-pipe")).unwrap();
    std::os::unix::fs::symlink(d.join("nowhere"), d.join("dangling")).unwrap();
    // a character device like /dev/null, made here (needs root, as CI is)
    let device = made("mknod", &[d.join("null").to_str().unwrap(), "c", "1", "3"]);
    if !device {
        eprintln!("NOTE: mknod needs root; the device-node case is not run here (CI runs it)");
        assert!(std::env::var_os("CI").is_none(), "CI must run the device case");
    }
    let mut cases = vec![
        ("pipe", "a FIFO"),
        ("folder", "a folder"),
        ("to-pipe", "a symbolic link to a FIFO"),
        ("dangling", "a symbolic link to nothing"),
    ];
    if device {
        cases.push(("null", "a device"));
    }
    for (name, what) in cases {
        for force in [false, true] {
            let (code, err) = shortlist_to(&d, name, force);
            assert_eq!(code, 2, "{name}: {err}");
            assert!(err.contains(what), "{name}: {err}");
        }
    }
    // nothing changed kind
    let ft = |n: &str| fs::symlink_metadata(d.join(n)).unwrap().file_type();
    use std::os::unix::fs::FileTypeExt;
    assert!(ft("pipe").is_fifo() && ft("folder").is_dir() && ft("to-pipe").is_symlink());
    fs::remove_dir_all(&d).unwrap();
}

#[test]
fn a_write_through_a_symlink_keeps_the_link_and_never_hits_an_input() {
    let d = scratch("links");
    fs::write(d.join("real.txt"), "old").unwrap();
    std::os::unix::fs::symlink(d.join("real.txt"), d.join("link.txt")).unwrap();
    let (code, err) = shortlist_to(&d, "link.txt", true);
    assert!(code == 0 || code == 1, "{err}");
    assert!(fs::symlink_metadata(d.join("link.txt")).unwrap().file_type().is_symlink());
    assert!(
        fs::read_to_string(d.join("real.txt"))
            .unwrap()
            .starts_with("PRECAST MEMBER SHORTLIST")
    );
    // the job file, reached through a link of another name, is an input
    fs::copy(
        Path::new(env!("CARGO_MANIFEST_DIR")).join("catalog/demo-job.toml"),
        d.join("job.toml"),
    )
    .unwrap();
    std::os::unix::fs::symlink(d.join("job.toml"), d.join("other-name.txt")).unwrap();
    let before = fs::read(d.join("job.toml")).unwrap();
    let o = run(&d, &["shortlist", "--job", "job.toml", "-o", "other-name.txt", "--force"]);
    let err = String::from_utf8_lossy(&o.stderr);
    assert_eq!(o.status.code(), Some(2), "{err}");
    assert!(err.contains("is an input file"), "{err}");
    assert_eq!(fs::read(d.join("job.toml")).unwrap(), before);
    fs::remove_dir_all(&d).unwrap();
}

#[test]
fn reads_of_a_fifo_or_a_device_are_refused_at_once() {
    let d = scratch("reads");
    assert!(made("mkfifo", &[d.join("pipe.toml").to_str().unwrap()]), "mkfifo");
    let o = run(&d, &["validate", "pipe.toml"]);
    let err = String::from_utf8_lossy(&o.stderr);
    assert_eq!(o.status.code(), Some(2), "{err}");
    assert!(
        err.contains("pipe.toml: error: is a FIFO (named pipe), not a regular file"),
        "{err}"
    );
    let o = run(&d, &["rank", "--job", "pipe.toml"]);
    assert!(String::from_utf8_lossy(&o.stderr).contains("is a FIFO"));
    // an endless device, like /dev/zero, made here (root, as CI)
    if made("mknod", &[d.join("zero.toml").to_str().unwrap(), "c", "1", "5"]) {
        let o = run(&d, &["validate", "zero.toml"]);
        let err = String::from_utf8_lossy(&o.stderr);
        assert_eq!(o.status.code(), Some(2), "{err}");
        assert!(err.contains("is a device, not a regular file"), "{err}");
    } else {
        assert!(std::env::var_os("CI").is_none(), "CI must run the device case");
    }
    fs::remove_dir_all(&d).unwrap();
}

#[test]
fn meaningless_options_are_refused() {
    let d = scratch("options");
    let o = run(&d, &["rank", "--span", "20 ft", "--top", "0"]);
    assert_eq!(o.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&o.stderr).contains("--top"));
    let o = run(&d, &["--summary", "--job", "demo"]);
    let err = String::from_utf8_lossy(&o.stderr);
    assert_eq!(o.status.code(), Some(2), "{err}");
    assert!(err.contains("is not read with --summary"), "{err}");
    let o = run(&d, &["rank", "--job", "demo", "--span", "20 ft"]);
    let err = String::from_utf8_lossy(&o.stderr);
    assert_eq!(o.status.code(), Some(2), "{err}");
    assert!(err.contains("--span describe one bay, but --job gives the bays"), "{err}");
    fs::remove_dir_all(&d).unwrap();
}

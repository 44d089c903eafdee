//! The README's commands, run in order as a new user would type them: every
//! line of its `sh` blocks, `plankwise …` and `cargo run --release -- …`
//! run as the built binary (what `cargo run` builds), in a scratch folder
//! holding a copy of `catalog/`, each expected to exit as documented — 0,
//! or the code a `# exits N` comment on the line gives (README: 0 success,
//! 1 some bay has no viable member, 2 bad input). `cargo test`, `cargo
//! build` and `cargo install` are the suite itself or change the machine:
//! they are listed, not run.

use std::path::Path;
use std::process::{Command, Stdio};

/// Split a command line as a POSIX shell would for the quoting the README
/// uses (double quotes, no escapes inside).
fn words(line: &str) -> Vec<String> {
    let mut out = Vec::new();
    let mut cur = String::new();
    let mut quoted = false;
    let mut any = false;
    for c in line.chars() {
        match c {
            '"' => {
                quoted = !quoted;
                any = true;
            }
            c if c.is_whitespace() && !quoted => {
                if any {
                    out.push(std::mem::take(&mut cur));
                    any = false;
                }
            }
            c => {
                cur.push(c);
                any = true;
            }
        }
    }
    if any {
        out.push(cur);
    }
    out
}

/// The lines of the README's `sh` blocks, continuation lines joined: (command, expected exit code).
fn commands(readme: &str) -> Vec<(String, i32)> {
    let mut out = Vec::new();
    let mut inside = false;
    let mut pending = String::new();
    for l in readme.lines() {
        if l.starts_with("```") {
            inside = l == "```sh";
            continue;
        }
        if !inside || l.trim().is_empty() {
            continue;
        }
        if let Some(head) = l.strip_suffix('\\') {
            pending.push_str(head);
            pending.push(' ');
            continue;
        }
        pending.push_str(l);
        let full = std::mem::take(&mut pending);
        let (cmd, comment) = full.split_once('#').map_or((full.as_str(), ""), |(a, b)| (a, b));
        let code = comment
            .trim()
            .strip_prefix("exits ")
            .and_then(|r| r.split(|c: char| !c.is_ascii_digit()).next())
            .and_then(|n| n.parse().ok())
            .unwrap_or(0);
        out.push((cmd.trim().to_string(), code));
    }
    out
}

fn copy_dir(from: &Path, to: &Path) {
    std::fs::create_dir_all(to).unwrap();
    for e in std::fs::read_dir(from).unwrap() {
        let e = e.unwrap();
        if e.file_type().unwrap().is_file() {
            std::fs::copy(e.path(), to.join(e.file_name())).unwrap();
        }
    }
}

#[test]
fn the_readmes_commands_exit_as_documented() {
    let root = Path::new(env!("CARGO_MANIFEST_DIR"));
    let readme = std::fs::read_to_string(root.join("README.md")).unwrap();
    let dir = std::env::temp_dir().join(format!("plankwise-readme-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    copy_dir(&root.join("catalog"), &dir.join("catalog"));
    let cmds = commands(&readme);
    let (mut ran, mut listed) = (0, Vec::new());
    for (cmd, code) in &cmds {
        let w = words(cmd);
        let args: Vec<String> = match w.iter().map(String::as_str).collect::<Vec<_>>().as_slice() {
            ["plankwise", rest @ ..] => rest.iter().map(|s| s.to_string()).collect(),
            ["cargo", "run", "--release"] => Vec::new(),
            ["cargo", "run", "--release", "--", rest @ ..] => rest.iter().map(|s| s.to_string()).collect(),
            ["cargo", "test" | "build" | "install", ..] => {
                listed.push(cmd.clone());
                continue;
            }
            _ => panic!("a README command this test cannot run: {cmd}"),
        };
        let out = Command::new(env!("CARGO_BIN_EXE_plankwise"))
            .args(&args)
            .current_dir(&dir)
            .env("NO_COLOR", "1")
            .stdin(Stdio::null())
            .output()
            .unwrap();
        assert_eq!(
            out.status.code(),
            Some(*code),
            "README command `{cmd}` exited {:?}, documented {code}:\n{}",
            out.status.code(),
            String::from_utf8_lossy(&out.stderr)
        );
        ran += 1;
    }
    // what the README's PDF commands write is there, and is a PDF
    for f in ["shortlist.pdf", "capacity.pdf", "sheet.pdf"] {
        assert!(std::fs::read(dir.join(f)).unwrap().starts_with(b"%PDF-"), "{f}");
    }
    assert!(ran >= 8, "{ran} commands run");
    assert_eq!(listed, ["cargo test"], "only the suite itself is not run");
    std::fs::remove_dir_all(&dir).unwrap();
}

#[test]
fn words_split_as_a_shell_does() {
    assert_eq!(words(r#"a --x "1 ft" b"#), ["a", "--x", "1 ft", "b"]);
    assert_eq!(words(r#"--loads "40 psf, 80 psf""#), ["--loads", "40 psf, 80 psf"]);
}

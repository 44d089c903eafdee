//! The real binary in a pseudo-terminal (tmux): keys typed, screen read.
//! Skipped where tmux is missing, except under CI (`CI` set), where
//! `.ci/run` installs it and a missing tmux is a failure.

use std::process::Command;
use std::thread::sleep;
use std::time::{Duration, Instant};

#[path = "support/synthetic.rs"]
mod synthetic;

fn tmux(args: &[&str]) -> String {
    let out = Command::new("tmux").args(args).output().expect("tmux runs");
    String::from_utf8_lossy(&out.stdout).into_owned()
}

fn have_tmux() -> bool {
    let ok = Command::new("tmux").arg("-V").output().is_ok_and(|o| o.status.success());
    if !ok && std::env::var_os("CI").is_some() {
        panic!("tmux is needed for the terminal tests under CI");
    }
    if !ok {
        // straight to the standard error, past the test harness's capture,
        // so a skipped terminal test is seen in the output of `cargo test`
        use std::io::Write;
        let _ = writeln!(
            std::io::stderr(),
            "\n*** tmux not found: this terminal test is SKIPPED — install tmux to run tests/tui_e2e.rs ***\n"
        );
    }
    ok
}

struct Session {
    name: String,
    socket: String,
}

impl Session {
    fn start(tag: &str, cmd: &str) -> Session {
        let name = format!("pw-{tag}-{}", std::process::id());
        let socket = format!("plankwise-test-{}", std::process::id());
        tmux(&["-L", &socket, "new-session", "-d", "-s", &name, "-x", "100", "-y", "30", cmd]);
        Session { name, socket }
    }
    fn keys(&self, keys: &[&str]) {
        for k in keys {
            tmux(&["-L", &self.socket, "send-keys", "-t", &self.name, k]);
            sleep(Duration::from_millis(60));
        }
    }
    fn screen(&self) -> String {
        tmux(&["-L", &self.socket, "capture-pane", "-p", "-t", &self.name])
    }
    fn wait_for(&self, what: &str) -> String {
        let start = Instant::now();
        loop {
            let s = self.screen();
            if s.contains(what) {
                return s;
            }
            assert!(
                start.elapsed() < Duration::from_secs(20),
                "timed out waiting for '{what}'; screen:\n{s}"
            );
            sleep(Duration::from_millis(100));
        }
    }
}

impl Session {
    fn wait_for_gone(&self, what: &str) -> String {
        let start = Instant::now();
        loop {
            let s = self.screen();
            if !s.contains(what) {
                return s;
            }
            assert!(start.elapsed() < Duration::from_secs(20), "'{what}' stayed; screen:\n{s}");
            sleep(Duration::from_millis(50));
        }
    }
}

impl Drop for Session {
    fn drop(&mut self) {
        tmux(&["-L", &self.socket, "kill-session", "-t", &self.name]);
    }
}

fn command(dir: &std::path::Path) -> String {
    command_with(dir, "")
}

fn command_with(dir: &std::path::Path, env: &str) -> String {
    format!(
        "cd {} && TERM=xterm-256color {env} {}; echo EXITED $?; stty -a | grep -o -- '-icanon' ; sleep 30",
        dir.display(),
        env!("CARGO_BIN_EXE_plankwise")
    )
}

#[test]
fn typing_reranks_searches_writes_and_quits_cleanly() {
    if !have_tmux() {
        return;
    }
    let dir = std::env::temp_dir().join(format!("plankwise-e2e-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let s = Session::start("ui", &command(&dir));
    let first = s.wait_for("Candidates 12 viable of 18");
    assert!(first.contains("plank-6in-4ft / 5x1/2"));
    // a longer span re-ranks at once
    s.keys(&["+", "+", "+", "+", "+", "+"]);
    let after = s.wait_for("30'-0\"");
    assert!(after.contains("Candidates 9 viable of 18"), "{after}");
    // the search narrows the list
    s.keys(&["/", "1", "0", "i", "n"]);
    let found = s.wait_for("/10in");
    assert!(!found.contains("plank-8in-4ft / 6x1/2"), "{found}");
    s.keys(&["Enter", "Escape"]);
    // mark, write the shortlist to a path typed at the prompt
    s.keys(&["Space", "w"]);
    s.wait_for("shortlist file");
    for _ in 0..13 {
        s.keys(&["BSpace"]);
    }
    s.keys(&["m", "i", "n", "e", ".", "m", "d", "Enter"]);
    s.wait_for("wrote mine.md");
    let text = std::fs::read_to_string(dir.join("mine.md")).unwrap();
    assert!(text.starts_with("# Precast member shortlist"));
    // the same as a PDF, and the selected member's calculation sheet too
    s.keys(&["w"]);
    s.wait_for("shortlist file");
    s.keys(&["C-u"]);
    s.keys(&["m", "i", "n", "e", ".", "p", "d", "f", "Enter"]);
    s.wait_for("wrote mine.pdf");
    assert!(std::fs::read(dir.join("mine.pdf")).unwrap().starts_with(b"%PDF-"));
    s.keys(&["e"]);
    s.wait_for("calculation sheet file");
    s.keys(&["C-u"]);
    s.keys(&["c", ".", "p", "d", "f", "Enter"]);
    s.wait_for("wrote c.pdf");
    assert!(std::fs::read(dir.join("c.pdf")).unwrap().starts_with(b"%PDF-"));
    // quitting with edits asks first, then leaves a sane terminal
    s.keys(&["q"]);
    s.wait_for("quit anyway? y / n");
    s.keys(&["y"]);
    let end = s.wait_for("EXITED 0");
    assert!(!end.contains("-icanon"), "the terminal was left in raw mode:\n{end}");
    std::fs::remove_dir_all(&dir).unwrap();
}

fn signal_leaves_terminal_sane(sig: &str) {
    if !have_tmux() {
        return;
    }
    let dir = std::env::temp_dir();
    let s = Session::start(&sig.to_lowercase(), &command(&dir));
    s.wait_for("Candidates");
    // the pane's shell is the parent of this session's plankwise
    let shell = tmux(&["-L", &s.socket, "display-message", "-p", "-t", &s.name, "#{pane_pid}"]);
    let pid = Command::new("pgrep").args(["-P", shell.trim()]).output().unwrap();
    let pid = String::from_utf8_lossy(&pid.stdout).lines().next().unwrap_or("").trim().to_string();
    assert!(!pid.is_empty(), "no child of the pane shell {shell}");
    Command::new("kill").args([&format!("-{sig}"), &pid]).status().unwrap();
    let end = s.wait_for("EXITED");
    assert!(!end.contains("-icanon"), "raw mode left after {sig}:\n{end}");
    assert!(!end.contains("Candidates"), "alternate screen left after {sig}:\n{end}");
}

#[test]
fn sigterm_restores_the_terminal() {
    signal_leaves_terminal_sane("TERM");
}

#[test]
fn sighup_restores_the_terminal() {
    signal_leaves_terminal_sane("HUP");
}

#[test]
fn sigint_restores_the_terminal() {
    signal_leaves_terminal_sane("INT");
}

#[test]
fn sigquit_restores_the_terminal() {
    signal_leaves_terminal_sane("QUIT");
}

#[test]
fn a_panic_restores_the_terminal() {
    if !have_tmux() {
        return;
    }
    let s = Session::start("panic", &command_with(&std::env::temp_dir(), "PLANKWISE_TEST_PANIC_KEY=P"));
    s.wait_for("Candidates");
    s.keys(&["P"]);
    let end = s.wait_for("EXITED 101");
    assert!(
        end.contains("test panic requested"),
        "the panic message is shown on the normal screen:\n{end}"
    );
    assert!(!end.contains("-icanon"), "raw mode left after a panic:\n{end}");
    assert!(!end.contains("Bay criteria"), "alternate screen left after a panic:\n{end}");
}

/// Regression: a UI whose terminal vanished (the tmux pane closed, like a
/// dropped SSH link) kept spinning on the dead descriptor instead of leaving.
#[test]
fn a_vanished_terminal_ends_the_ui() {
    if !have_tmux() {
        return;
    }
    let s = Session::start("gone", &command(&std::env::temp_dir()));
    s.wait_for("Candidates");
    let shell = tmux(&["-L", &s.socket, "display-message", "-p", "-t", &s.name, "#{pane_pid}"]);
    let pid = Command::new("pgrep").args(["-P", shell.trim()]).output().unwrap();
    let pid = String::from_utf8_lossy(&pid.stdout).lines().next().unwrap_or("").trim().to_string();
    assert!(!pid.is_empty());
    tmux(&["-L", &s.socket, "kill-session", "-t", &s.name]);
    let start = Instant::now();
    while std::path::Path::new(&format!("/proc/{pid}")).exists() {
        if let Ok(st) = std::fs::read_to_string(format!("/proc/{pid}/stat"))
            && st.split_whitespace().nth(2) == Some("Z")
        {
            break;
        }
        if start.elapsed() > Duration::from_secs(5) {
            let _ = Command::new("kill").args(["-9", &pid]).status();
            panic!("plankwise {pid} still running 5 s after its terminal closed");
        }
        sleep(Duration::from_millis(100));
    }
}

#[test]
fn a_large_catalog_reranks_off_the_ui_thread() {
    if !have_tmux() {
        return;
    }
    // 2500 entries: above the size ranked at once, so the frame after the
    // key shows the old list marked, and the new ranking follows
    let dir = std::env::temp_dir().join(format!("plankwise-e2e-big-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    std::fs::write(dir.join("big.toml"), synthetic::catalog(500, 5)).unwrap();
    std::fs::write(
        dir.join("job.toml"),
        "[job]\nproject = \"large catalog\"\n\n[[bay]]\nname = \"Big bay\"\nspan = \"24 ft\"\nsdl = \"20 psf\"\nlive = \"40 psf\"\n",
    )
    .unwrap();
    let cmd = format!(
        "cd {} && TERM=xterm-256color {} big.toml --job job.toml; echo EXITED $?; sleep 30",
        dir.display(),
        env!("CARGO_BIN_EXE_plankwise")
    );
    let s = Session::start("big", &cmd);
    let first = s.wait_for("viable of 2500");
    assert!(first.contains("24'-0\""), "{first}");
    s.keys(&["+"]);
    let after = s.wait_for("25'-0\"");
    let ranked = if after.contains("re-ranking") {
        s.wait_for_gone("re-ranking")
    } else {
        after
    };
    assert!(ranked.contains("viable of 2500"), "{ranked}");
    s.keys(&["q", "y"]);
    s.wait_for("EXITED 0");
    std::fs::remove_dir_all(&dir).unwrap();
}

/// The UI's shortlist write refuses the open catalog, by file identity (a
/// link of another name to it too), and leaves it unchanged.
#[test]
fn the_shortlist_is_never_written_over_the_open_catalog() {
    if !have_tmux() {
        return;
    }
    let dir = std::env::temp_dir().join(format!("plankwise-e2e-inputs-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    let cat = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("catalog/demo-us.toml");
    std::fs::copy(&cat, dir.join("mine.toml")).unwrap();
    std::os::unix::fs::symlink(dir.join("mine.toml"), dir.join("alias.txt")).unwrap();
    let before = std::fs::read(dir.join("mine.toml")).unwrap();
    let cmd = format!(
        "cd {} && TERM=xterm-256color {} mine.toml; echo EXITED $?; sleep 30",
        dir.display(),
        env!("CARGO_BIN_EXE_plankwise")
    );
    let s = Session::start("inputs", &cmd);
    s.wait_for("Candidates");
    s.keys(&["w"]);
    s.wait_for("shortlist file");
    for _ in 0..20 {
        s.keys(&["BSpace"]);
    }
    s.keys(&["a", "l", "i", "a", "s", ".", "t", "x", "t", "Enter"]);
    s.wait_for("is an input file");
    s.keys(&["q"]);
    s.wait_for("EXITED 0");
    assert_eq!(std::fs::read(dir.join("mine.toml")).unwrap(), before);
    std::fs::remove_dir_all(&dir).unwrap();
}

/// A fresh folder for one terminal test.
fn scratch(tag: &str) -> std::path::PathBuf {
    let dir = std::env::temp_dir().join(format!("plankwise-e2e-{tag}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

#[test]
fn esc_after_a_search_never_quits() {
    if !have_tmux() {
        return;
    }
    let dir = scratch("esc");
    let s = Session::start("esc", &command(&dir));
    s.wait_for("Candidates 12 viable of 18");
    s.keys(&["/", "1", "6"]);
    s.wait_for("/16");
    s.keys(&["Escape"]);
    s.wait_for("search cleared");
    s.keys(&["Escape", "Escape"]);
    let after = s.wait_for("nothing to leave");
    assert!(!after.contains("EXITED"), "{after}");
    assert!(after.contains("Candidates 12 viable of 18"), "{after}");
    sleep(Duration::from_millis(300));
    assert!(!s.screen().contains("EXITED"));
    s.keys(&["q"]);
    s.wait_for("EXITED 0");
    std::fs::remove_dir_all(&dir).unwrap();
}

#[test]
fn the_detail_pane_scrolls_and_the_compare_view_opens() {
    if !have_tmux() {
        return;
    }
    let dir = scratch("scroll");
    let s = Session::start("scroll", &command(&dir));
    s.wait_for("Detail 1–");
    // Tab to the Detail pane; j scrolls it, the list stays
    s.keys(&["Tab", "j", "j", "j"]);
    let scrolled = s.wait_for("Detail 4–");
    assert!(scrolled.contains("j/k pgup/pgdn"), "{scrolled}");
    s.keys(&["PageDown"]);
    s.wait_for_gone("Detail 4–");
    // back to the list: mark three and compare them
    s.keys(&["BTab", "Space", "j", "Space", "j", "Space", "v"]);
    let cmp = s.wait_for("Compare 3 marked");
    assert!(cmp.contains("governs"), "{cmp}");
    assert!(cmp.contains("Flexural strength"), "{cmp}");
    s.keys(&["v"]);
    s.wait_for("Detail 1–");
    s.keys(&["q"]);
    s.wait_for("quit anyway? y / n");
    s.keys(&["y"]);
    s.wait_for("EXITED 0");
    std::fs::remove_dir_all(&dir).unwrap();
}

/// An SI session from start to shortlist: the SI demo opens on its job, a
/// load typed in kPa, a member marked, the shortlist written — in SI only.
#[test]
fn an_si_session_end_to_end() {
    if !have_tmux() {
        return;
    }
    let dir = scratch("si");
    let cat = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("catalog/demo-si.toml");
    let cmd = format!(
        "cd {} && TERM=xterm-256color {} {}; echo EXITED $?; sleep 30",
        dir.display(),
        env!("CARGO_BIN_EXE_plankwise"),
        cat.display()
    );
    let s = Session::start("si", &cmd);
    let first = s.wait_for("Quayside library extension");
    assert!(first.contains("· SI") && first.contains("kPa"), "{first}");
    // the live load of the first bay, typed in kPa
    s.keys(&["BTab", "j", "j", "Enter"]);
    s.wait_for("edit Live");
    s.keys(&["3", ".", "5", " ", "k", "P", "a", "Enter"]);
    s.wait_for("3.5 kPa");
    // mark the best member and write the shortlist
    s.keys(&["Tab", "Space", "w"]);
    s.wait_for("shortlist file");
    s.keys(&["C-u", "s", "i", ".", "t", "x", "t", "Enter"]);
    s.wait_for("wrote si.txt");
    let text = std::fs::read_to_string(dir.join("si.txt")).unwrap();
    assert!(
        text.contains("L 3.5 kPa") || text.contains("L 4 kPa") || text.contains("kPa"),
        "{text}"
    );
    assert!(text.contains("Units     SI"), "{text}");
    // no number in a US unit (a word such as "in" after a word is not one)
    assert!(!text.contains("'-"), "{text}");
    for us in [" psf", " psi", " ksi", " kip", " klf", " pcf", " in", " ft"] {
        for (i, _) in text.match_indices(us) {
            let after = text[i + us.len()..].chars().next().unwrap_or(' ');
            let number = text[..i].ends_with(|c: char| c.is_ascii_digit());
            assert!(
                !number || after.is_alphanumeric(),
                "'{us}' after a number in an SI shortlist:\n{text}"
            );
        }
    }
    // the calculation sheet of the selected member, in Markdown, in SI
    s.keys(&["e"]);
    s.wait_for("calculation sheet file");
    s.keys(&["C-u", "c", "a", "l", "c", ".", "m", "d", "Enter"]);
    s.wait_for("wrote calc.md");
    let sheet = std::fs::read_to_string(dir.join("calc.md")).unwrap();
    assert!(
        sheet.starts_with("# Calculation sheet") && sheet.contains("kN·m") && sheet.contains("[fse_mpa]"),
        "{sheet}"
    );
    s.keys(&["q"]);
    s.wait_for("quit anyway? y / n");
    s.keys(&["y"]);
    s.wait_for("EXITED 0");
    std::fs::remove_dir_all(&dir).unwrap();
}

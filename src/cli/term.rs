//! The terminal shell around the UI: a blocking event loop, the effects
//! (files) that `update` asks for, and a terminal that is always restored —
//! on quit, on panic (ratatui's hook), and on SIGTERM or SIGHUP.

use std::io;
use std::path::{Path, PathBuf};
use std::sync::Arc;
use std::sync::atomic::{AtomicBool, Ordering};
use std::time::Duration;

use ratatui::crossterm::event::{self, Event, KeyCode, KeyEventKind, KeyModifiers};
use ratatui::widgets::TableState;

use plankwise::catalog::Catalog;
use plankwise::job::Job;
use plankwise::report::shortlist;
use plankwise::select::rank_bay;
use plankwise::tui::keymap::{Key, Keymap};
use plankwise::tui::{Action, App, Effect, report, ui, update};

fn key_of(ev: event::KeyEvent) -> Option<Key> {
    Some(match ev.code {
        KeyCode::Char(c) if ev.modifiers.contains(KeyModifiers::CONTROL) => Key::Ctrl(c),
        KeyCode::Char(c) => Key::Char(c),
        KeyCode::Up => Key::Up,
        KeyCode::Down => Key::Down,
        KeyCode::Left => Key::Left,
        KeyCode::Right => Key::Right,
        KeyCode::Tab => Key::Tab,
        KeyCode::BackTab => Key::BackTab,
        KeyCode::Enter => Key::Enter,
        KeyCode::Esc => Key::Esc,
        KeyCode::Delete => Key::Delete,
        KeyCode::Backspace => Key::Backspace,
        KeyCode::PageUp => Key::PageUp,
        KeyCode::PageDown => Key::PageDown,
        KeyCode::Home => Key::Home,
        KeyCode::End => Key::End,
        _ => return None,
    })
}

/// The keys file in the user's config folder, if there is one.
fn keys_file() -> Option<PathBuf> {
    let base = std::env::var_os("XDG_CONFIG_HOME")
        .map(PathBuf::from)
        .or_else(|| std::env::var_os("HOME").map(|h| PathBuf::from(h).join(".config")))?;
    Some(base.join("plankwise").join("keys.toml"))
}

/// The files the UI has open: a write never lands on them.
struct Inputs {
    catalog: Option<PathBuf>,
}

/// The open files a write must not land on, once `path` is known to be a
/// place the UI may write ("exists" when it holds a file and `force` is off:
/// the UI then asks).
fn writable<'a>(app: &'a App, inputs: &'a Inputs, path: &Path, force: bool) -> Result<Vec<&'a Path>, String> {
    let open: Vec<&Path> = inputs.catalog.iter().chain(app.job_path.iter()).map(|p| p.as_path()).collect();
    match plankwise::files::writable(path, &open, force) {
        Err(plankwise::files::Refusal::Exists) => Err("exists".into()),
        Err(e) => Err(format!("'{}' {e}", path.display())),
        Ok(_) => Ok(open),
    }
}

fn write_shortlist(app: &App, inputs: &Inputs, path: &Path, format: shortlist::Format, force: bool) -> Result<String, String> {
    let open = writable(app, inputs, path, force)?;
    let mut buf = Vec::new();
    shortlist::write_each(&mut buf, format, &app.job, &app.catalog, 3, app.units, &mut |i, bay| {
        let mut r = rank_bay(&app.catalog, bay, None);
        let marked = app.marked_labels(i);
        if !marked.is_empty() {
            r.viable.retain(|x| marked.contains(&x.entry.label()));
        }
        r
    })
    .map_err(|e| e.to_string())?;
    plankwise::files::write_safely(path, &buf, &open, true).map_err(|e| format!("'{}' {e}", path.display()))?;
    Ok(format!("wrote {}", path.display()))
}

fn write_sheet(app: &App, inputs: &Inputs, path: &Path, force: bool) -> Result<String, String> {
    let open = writable(app, inputs, path, force)?;
    let (Some(row), Some(entry), Some(ev)) = (app.selected_row(), app.selected_entry(), app.detail.as_ref()) else {
        return Err("select a candidate first".into());
    };
    let bay = app.current_bay();
    let case = app.case_of(row);
    let j = plankwise::report::check::to_json(&entry.candidate(), &case, ev);
    let title = format!("{} — {} (bay '{}')", entry.section.designation, entry.pattern.designation, bay.name);
    let kind = plankwise::report::FileKind::of_path(path);
    let buf = if kind == Some(plankwise::report::FileKind::Pdf) {
        plankwise::report::sheet::pdf(&title, &j, app.units)?
    } else {
        let mut buf = Vec::new();
        plankwise::report::sheet::write(&mut buf, &title, &j, app.units, kind == Some(plankwise::report::FileKind::Markdown))
            .map_err(|e| e.to_string())?;
        buf
    };
    plankwise::files::write_safely(path, &buf, &open, true).map_err(|e| format!("'{}' {e}", path.display()))?;
    Ok(format!("wrote {}", path.display()))
}

fn save_job(app: &App, inputs: &Inputs, path: &Path) -> Result<String, String> {
    // the job may be saved over itself (edited in place, a backup kept),
    // never over the catalog
    let open: Vec<&Path> = inputs.catalog.iter().map(|p| p.as_path()).collect();
    let text = app.job.save_text(app.units);
    let mut backup = String::new();
    if path.exists() {
        let bak = PathBuf::from(format!("{}.bak", path.display()));
        let old = plankwise::files::read_bounded(path, plankwise::catalog::MAX_FILE_BYTES)
            .map_err(|e| format!("cannot keep a backup of '{}': it {e}", path.display()))?;
        plankwise::files::write_safely(&bak, &old, &open, true).map_err(|e| format!("cannot keep a backup '{}': it {e}", bak.display()))?;
        backup = format!(" (backup {})", bak.display());
    }
    plankwise::files::write_safely(path, text.as_bytes(), &open, true).map_err(|e| format!("'{}' {e}", path.display()))?;
    Ok(format!("saved {}{backup}", path.display()))
}

/// Whether the terminal has gone away under us (its device deleted, as when a
/// tmux pane or an SSH session closes without a SIGHUP reaching us).
fn terminal_gone() -> bool {
    std::fs::read_link("/proc/self/fd/0").is_ok_and(|p| p.to_string_lossy().ends_with(" (deleted)"))
}

/// Run the UI until the user quits or a signal arrives; returns the exit code.
pub fn run(
    catalog: Catalog,
    catalog_path: Option<PathBuf>,
    job: Job,
    job_path: Option<PathBuf>,
    units: plankwise::units::System,
) -> io::Result<i32> {
    let inputs = Inputs { catalog: catalog_path };
    let stop = Arc::new(AtomicBool::new(false));
    // every signal that ends the program ends the loop, which restores the terminal
    for sig in [
        signal_hook::consts::SIGTERM,
        signal_hook::consts::SIGHUP,
        signal_hook::consts::SIGINT,
        signal_hook::consts::SIGQUIT,
    ] {
        signal_hook::flag::register(sig, Arc::clone(&stop))?;
    }
    let mut app = App::new(catalog, job, job_path);
    app.units = units;
    app.mono = std::env::var_os("NO_COLOR").is_some_and(|v| !v.is_empty()) || std::env::var("TERM").is_ok_and(|t| t == "dumb");
    if let Some(f) = keys_file().filter(|f| f.exists()) {
        // the keys file is read like any input: a regular file, bounded
        match plankwise::files::read_bounded(&f, 256 * 1024).and_then(|b| String::from_utf8(b).map_err(|_| "is not UTF-8 text".into())) {
            Ok(text) => {
                let (km, problems) = Keymap::with_overrides(&text);
                app.keymap = km;
                if let Some(p) = problems.first() {
                    app.status = (format!("{} ({})", p, f.display()), true);
                }
            }
            Err(e) => app.status = (format!("keys file '{}' {e}; the default keys are used", f.display()), true),
        }
    }
    // a test hook: this key panics inside the loop, to prove the terminal
    // is restored on a panic (tests/tui_e2e.rs)
    let panic_key = std::env::var("PLANKWISE_TEST_PANIC_KEY").ok().and_then(|k| k.chars().next());
    // crossterm's reader loops for ever on a terminal that has gone away
    // (end of file on the tty), so a watchdog ends the process then: there
    // is no terminal left to restore
    std::thread::spawn(|| {
        loop {
            std::thread::sleep(Duration::from_millis(300));
            if terminal_gone() {
                std::process::exit(0);
            }
        }
    });
    // large bays are ranked on a thread of their own, so that a key press
    // is answered by the next frame at once; it ranks only the latest request
    let (ask, asked) = std::sync::mpsc::channel::<plankwise::tui::RankRequest>();
    let (tell, told) = std::sync::mpsc::channel::<(u64, Vec<plankwise::tui::Row>)>();
    let shared = Arc::clone(&app.catalog);
    std::thread::spawn(move || {
        while let Ok(mut req) = asked.recv() {
            while let Ok(newer) = asked.try_recv() {
                req = newer;
            }
            let rows = plankwise::tui::rows_for(&shared, &req.bay);
            if tell.send((req.generation, rows)).is_err() {
                break;
            }
        }
    });
    app.background = Some(plankwise::tui::BACKGROUND_ABOVE);
    // a terminal that is not there (or vanished) is an error, not a panic
    let mut terminal = ratatui::try_init().map_err(|e| io::Error::other(format!("cannot open the terminal: {e}")))?;
    let mut table = TableState::default();
    let result = (|| -> io::Result<()> {
        loop {
            if let Some(req) = app.request.take() {
                // the thread only ends with the program
                let _ = ask.send(req);
            }
            terminal.draw(|f| ui::draw(f, &app, &mut table))?;
            // wake up now and then to notice a signal or a finished ranking;
            // otherwise block on input
            let mut ev = None;
            while ev.is_none() {
                if stop.load(Ordering::Relaxed) {
                    return Ok(());
                }
                if let Ok((generation, rows)) = told.try_recv() {
                    app.ranked(generation, rows);
                    break;
                }
                let wait = if app.pending.is_some() { 10 } else { 200 };
                if event::poll(Duration::from_millis(wait))? {
                    ev = Some(event::read()?);
                }
            }
            let Some(Event::Key(k)) = ev else { continue };
            if k.kind != KeyEventKind::Press {
                continue;
            }
            let Some(key) = key_of(k) else { continue };
            if panic_key.is_some_and(|p| key == Key::Char(p)) {
                panic!("test panic requested with PLANKWISE_TEST_PANIC_KEY");
            }
            let action = app.action_for(key);
            match update(&mut app, action) {
                Effect::None => {}
                Effect::Quit => return Ok(()),
                Effect::WriteShortlist { path, format, force } => match write_shortlist(&app, &inputs, &path, format, force) {
                    Err(e) if e == "exists" => {
                        update(&mut app, Action::AskOverwrite);
                    }
                    r => report(&mut app, r),
                },
                Effect::WriteSheet { path, force } => match write_sheet(&app, &inputs, &path, force) {
                    Err(e) if e == "exists" => {
                        update(&mut app, Action::AskOverwrite);
                    }
                    r => report(&mut app, r),
                },
                Effect::SaveJob { path } => {
                    let r = save_job(&app, &inputs, &path);
                    if r.is_ok() {
                        app.job_path = Some(path);
                    }
                    report(&mut app, r);
                }
            }
        }
    })();
    ratatui::restore();
    result.map(|()| 0)
}

//! Keys and what they do: defaults in code, overrides from a TOML file.
//!
//! The override file (`keys.toml` in the user's config folder) maps action
//! names to lists of keys:
//!
//! ```toml
//! span_up = ["+", "="]
//! quit = ["q", "ctrl-c"]
//! ```

use std::fmt;

use super::Action;

/// A key, independent of the terminal library.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Key {
    /// A printable character.
    Char(char),
    /// Ctrl with a character.
    Ctrl(char),
    /// Arrow up.
    Up,
    /// Arrow down.
    Down,
    /// Arrow left.
    Left,
    /// Arrow right.
    Right,
    /// Tab.
    Tab,
    /// Shift-Tab.
    BackTab,
    /// Enter.
    Enter,
    /// Escape.
    Esc,
    /// Backspace.
    Backspace,
    /// Page up.
    PageUp,
    /// Page down.
    PageDown,
    /// Delete.
    Delete,
    /// Home.
    Home,
    /// End.
    End,
}

impl fmt::Display for Key {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Key::Char(' ') => write!(f, "space"),
            Key::Char(c) => write!(f, "{c}"),
            Key::Ctrl(c) => write!(f, "ctrl-{c}"),
            Key::Up => write!(f, "↑"),
            Key::Down => write!(f, "↓"),
            Key::Left => write!(f, "←"),
            Key::Right => write!(f, "→"),
            Key::Tab => write!(f, "tab"),
            Key::BackTab => write!(f, "shift-tab"),
            Key::Enter => write!(f, "enter"),
            Key::Esc => write!(f, "esc"),
            Key::Backspace => write!(f, "backspace"),
            Key::PageUp => write!(f, "pgup"),
            Key::PageDown => write!(f, "pgdn"),
            Key::Delete => write!(f, "del"),
            Key::Home => write!(f, "home"),
            Key::End => write!(f, "end"),
        }
    }
}

impl Key {
    /// Parse a key name as written in the override file.
    pub fn parse(s: &str) -> Option<Key> {
        Some(match s {
            "up" => Key::Up,
            "down" => Key::Down,
            "left" => Key::Left,
            "right" => Key::Right,
            "tab" => Key::Tab,
            "shift-tab" => Key::BackTab,
            "enter" => Key::Enter,
            "esc" => Key::Esc,
            "backspace" => Key::Backspace,
            "pgup" => Key::PageUp,
            "pgdn" => Key::PageDown,
            "del" => Key::Delete,
            "home" => Key::Home,
            "end" => Key::End,
            "space" => Key::Char(' '),
            _ => {
                if let Some(c) = s.strip_prefix("ctrl-") {
                    let mut it = c.chars();
                    let (Some(ch), None) = (it.next(), it.next()) else { return None };
                    return Some(Key::Ctrl(ch));
                }
                let mut it = s.chars();
                match (it.next(), it.next()) {
                    (Some(c), None) => Key::Char(c),
                    _ => return None,
                }
            }
        })
    }
}

/// One binding: the action, its name in the override file, a description
/// for the help screen and footer, and its keys.
#[derive(Debug, Clone, PartialEq)]
pub struct Binding {
    /// The action.
    pub action: Action,
    /// Name in the override file.
    pub name: &'static str,
    /// What it does.
    pub help: &'static str,
    /// Keys bound to it.
    pub keys: Vec<Key>,
}

/// The keymap.
#[derive(Debug, Clone, PartialEq)]
pub struct Keymap {
    /// Bindings, in help-screen order.
    pub bindings: Vec<Binding>,
}

impl Default for Keymap {
    fn default() -> Self {
        use Key::*;
        let b = |action, name, help, keys: &[Key]| Binding {
            action,
            name,
            help,
            keys: keys.to_vec(),
        };
        Keymap {
            bindings: vec![
                b(Action::Up, "up", "move up", &[Up, Char('k')]),
                b(Action::Down, "down", "move down", &[Down, Char('j')]),
                b(Action::Left, "left", "previous value / pane", &[Left, Char('h')]),
                b(Action::Right, "right", "next value / pane", &[Right, Char('l')]),
                b(Action::NextPane, "next_pane", "next pane", &[Tab]),
                b(Action::PrevPane, "prev_pane", "previous pane", &[BackTab]),
                b(Action::SpanUp, "span_up", "span + 1 ft (0.25 m)", &[Char('+'), Char('=')]),
                b(Action::SpanDown, "span_down", "span − 1 ft (0.25 m)", &[Char('-')]),
                b(Action::SpanUpFine, "span_up_fine", "span + 1 in (25 mm)", &[Char('>')]),
                b(Action::SpanDownFine, "span_down_fine", "span − 1 in (25 mm)", &[Char('<')]),
                b(
                    Action::LiveUp,
                    "live_up",
                    "live (on a roof Lr or S) + 10 psf (0.5 kPa)",
                    &[Char(']')],
                ),
                b(
                    Action::LiveDown,
                    "live_down",
                    "live (on a roof Lr or S) − 10 psf (0.5 kPa)",
                    &[Char('[')],
                ),
                b(
                    Action::LiveUpFine,
                    "live_up_fine",
                    "live (on a roof Lr or S) + 1 psf (0.05 kPa)",
                    &[Char('}')],
                ),
                b(
                    Action::LiveDownFine,
                    "live_down_fine",
                    "live (on a roof Lr or S) − 1 psf (0.05 kPa)",
                    &[Char('{')],
                ),
                b(
                    Action::Edit,
                    "edit",
                    "edit the bay value or load / add a load or opening / open",
                    &[Enter],
                ),
                b(
                    Action::Remove,
                    "remove",
                    "remove the selected load or opening",
                    &[Delete, Char('d')],
                ),
                b(Action::Search, "search", "search candidates", &[Char('/')]),
                b(Action::CycleObjective, "objective", "next ranking objective", &[Char('o')]),
                b(Action::ToggleFailing, "toggle_failing", "show / hide non-viable", &[Char('x')]),
                b(
                    Action::ToggleView,
                    "toggle_view",
                    "detail / capacity chart / camber picture",
                    &[Char('c')],
                ),
                b(Action::Compare, "compare", "marked candidates side by side", &[Char('v')]),
                b(Action::Mark, "mark", "mark for the shortlist", &[Char(' ')]),
                b(Action::WriteShortlist, "write_shortlist", "write the shortlist", &[Char('w')]),
                b(
                    Action::WriteSheet,
                    "write_sheet",
                    "write the calculation sheet of the selected candidate",
                    &[Char('e')],
                ),
                b(Action::Save, "save", "save the job (keeps a backup)", &[Char('s')]),
                b(Action::ToggleUnits, "units", "US / SI display", &[Char('u')]),
                b(Action::NextBay, "next_bay", "next bay", &[Char('n'), PageDown]),
                b(Action::PrevBay, "prev_bay", "previous bay", &[Char('p'), PageUp]),
                b(Action::Help, "help", "this help", &[Char('?')]),
                b(
                    Action::Quit,
                    "quit",
                    "quit (asks first when the job has unsaved edits)",
                    &[Char('q'), Ctrl('c')],
                ),
            ],
        }
    }
}

impl Keymap {
    /// The action bound to `key`, if any.
    pub fn action(&self, key: Key) -> Option<Action> {
        self.bindings.iter().find(|b| b.keys.contains(&key)).map(|b| b.action)
    }

    /// The first key of an action, for the footer.
    pub fn key_of(&self, a: Action) -> Option<Key> {
        self.bindings.iter().find(|b| b.action == a).and_then(|b| b.keys.first().copied())
    }

    /// The defaults with the overrides of a TOML text applied; problems are
    /// returned as sentences (the defaults stay for those entries).
    pub fn with_overrides(text: &str) -> (Keymap, Vec<String>) {
        let mut km = Keymap::default();
        let mut problems = Vec::new();
        let table: toml::Table = match text.parse() {
            Ok(t) => t,
            Err(e) => return (km, vec![format!("keys file: {}", e.message())]),
        };
        for (name, value) in table {
            let Some(idx) = km.bindings.iter().position(|b| b.name == name) else {
                let names: Vec<&str> = km.bindings.iter().map(|b| b.name).collect();
                problems.push(format!(
                    "keys file: unknown action '{name}'{}",
                    crate::input::diag::suggestion(&name, names.iter().copied())
                ));
                continue;
            };
            let Some(list) = value.as_array() else {
                problems.push(format!("keys file: '{name}' must be a list of keys, e.g. [\"q\"]"));
                continue;
            };
            let mut keys = Vec::new();
            for k in list {
                match k.as_str().and_then(Key::parse) {
                    // ctrl-c always quits, so a binding can never take away every way out
                    Some(Key::Ctrl('c')) if km.bindings[idx].action != Action::Quit => {
                        problems.push(format!("keys file: '{name}': ctrl-c always quits; choose another key"))
                    }
                    Some(key) => keys.push(key),
                    None => problems.push(format!(
                        "keys file: '{name}': {} is not a key",
                        crate::criteria::quoted(&k.to_string())
                    )),
                }
            }
            if !keys.is_empty() {
                // a key moves to its new action
                for b in &mut km.bindings {
                    b.keys.retain(|k| !keys.contains(k));
                }
                km.bindings[idx].keys = keys;
            }
        }
        if let Some(q) = km.bindings.iter_mut().find(|b| b.action == Action::Quit)
            && !q.keys.contains(&Key::Ctrl('c'))
        {
            q.keys.push(Key::Ctrl('c'));
        }
        (km, problems)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn defaults_and_overrides() {
        let km = Keymap::default();
        assert_eq!(km.action(Key::Char('+')), Some(Action::SpanUp));
        assert_eq!(km.action(Key::Char('j')), Some(Action::Down));
        let (km, p) = Keymap::with_overrides("span_up = [\"u\"]\nquit = [\"ctrl-q\"]\nnope = [\"z\"]\n");
        assert_eq!(km.action(Key::Char('u')), Some(Action::SpanUp), "moved from units");
        assert_eq!(km.action(Key::Char('+')), None);
        assert_eq!(km.action(Key::Ctrl('q')), Some(Action::Quit));
        assert_eq!(km.action(Key::Char('q')), None);
        assert_eq!(p.len(), 1);
        assert!(p[0].contains("unknown action 'nope'"));
        // no binding removes every way to quit: ctrl-c stays
        let (km, p) = Keymap::with_overrides("quit = [\"x\"]\nhelp = [\"q\", \"ctrl-c\"]\n");
        assert_eq!(km.action(Key::Ctrl('c')), Some(Action::Quit));
        assert_eq!(km.action(Key::Char('q')), Some(Action::Help));
        assert!(p[0].contains("ctrl-c always quits"), "{p:?}");
    }
}

//! Colours and emphasis in one place, with a monochrome variant for
//! NO_COLOR and terminals without colour. Only the 16 basic colours are used.

use ratatui::style::{Color, Modifier, Style};

/// The styles of the UI.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Theme {
    /// Title bar.
    pub title: Style,
    /// Pane border.
    pub border: Style,
    /// Border of the focused pane.
    pub focus: Style,
    /// Selected row.
    pub selected: Style,
    /// Viable candidate.
    pub viable: Style,
    /// Non-viable candidate.
    pub failing: Style,
    /// Characters matched by the search.
    pub matched: Style,
    /// Status line, normal.
    pub status: Style,
    /// Status line, error.
    pub error: Style,
    /// Ratio bar, within capacity.
    pub bar_ok: Style,
    /// Ratio bar, over capacity.
    pub bar_over: Style,
    /// Muted text.
    pub muted: Style,
}

impl Theme {
    /// The colour theme (16-colour palette).
    pub fn color() -> Theme {
        Theme {
            title: Style::new().fg(Color::Black).bg(Color::Cyan).add_modifier(Modifier::BOLD),
            border: Style::new().fg(Color::DarkGray),
            focus: Style::new().fg(Color::Cyan).add_modifier(Modifier::BOLD),
            selected: Style::new().add_modifier(Modifier::REVERSED),
            viable: Style::new().fg(Color::Reset),
            failing: Style::new().fg(Color::Red),
            matched: Style::new().fg(Color::Yellow).add_modifier(Modifier::BOLD | Modifier::UNDERLINED),
            status: Style::new().fg(Color::Green),
            error: Style::new().fg(Color::Red).add_modifier(Modifier::BOLD),
            bar_ok: Style::new().fg(Color::Green),
            bar_over: Style::new().fg(Color::Red),
            muted: Style::new().fg(Color::DarkGray),
        }
    }

    /// No colour at all: emphasis by bold, reverse and underline only.
    pub fn mono() -> Theme {
        let plain = Style::new();
        Theme {
            title: plain.add_modifier(Modifier::REVERSED | Modifier::BOLD),
            border: plain,
            focus: plain.add_modifier(Modifier::BOLD),
            selected: plain.add_modifier(Modifier::REVERSED),
            viable: plain,
            failing: plain.add_modifier(Modifier::DIM),
            matched: plain.add_modifier(Modifier::UNDERLINED | Modifier::BOLD),
            status: plain,
            error: plain.add_modifier(Modifier::BOLD),
            bar_ok: plain,
            bar_over: plain.add_modifier(Modifier::BOLD),
            muted: plain.add_modifier(Modifier::DIM),
        }
    }
}

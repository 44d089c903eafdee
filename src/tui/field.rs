//! A one-line text field: the search, a bay value being edited, a path
//! being typed. A pre-filled value is replaced by the first character
//! typed (it is shown to be edited, not appended to); moving the cursor or
//! deleting first keeps it for editing.

use super::keymap::Key;

/// What a key did to a field.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Outcome {
    /// The text or the cursor changed.
    Edited,
    /// Enter: the value is given.
    Done,
    /// Esc: the field is left without a value.
    Cancel,
    /// The key means nothing to a field.
    Ignored,
}

/// A one-line text field with a cursor.
#[derive(Debug, Clone, PartialEq, Eq, Default)]
pub struct TextField {
    /// The text.
    pub text: String,
    /// Cursor position, in characters from the start.
    pub cursor: usize,
    /// The text is the pre-filled value, untouched: typing replaces it.
    pub fresh: bool,
}

impl TextField {
    /// A field pre-filled with `text`, cursor at its end; the first
    /// character typed replaces it.
    pub fn prefilled(text: impl Into<String>) -> TextField {
        let text = text.into();
        TextField {
            cursor: text.chars().count(),
            text,
            fresh: true,
        }
    }

    /// An empty field.
    pub fn empty() -> TextField {
        TextField::default()
    }

    fn byte(&self, char_index: usize) -> usize {
        self.text.char_indices().nth(char_index).map_or(self.text.len(), |(b, _)| b)
    }

    fn len(&self) -> usize {
        self.text.chars().count()
    }

    /// Apply one key.
    pub fn key(&mut self, key: Key) -> Outcome {
        let fresh = std::mem::replace(&mut self.fresh, false);
        match key {
            Key::Enter => return Outcome::Done,
            Key::Esc => return Outcome::Cancel,
            Key::Char(c) => {
                if fresh {
                    self.text.clear();
                    self.cursor = 0;
                }
                let b = self.byte(self.cursor);
                self.text.insert(b, c);
                self.cursor += 1;
            }
            Key::Ctrl('u') => {
                self.text.clear();
                self.cursor = 0;
            }
            Key::Backspace => {
                if self.cursor > 0 {
                    self.cursor -= 1;
                    let b = self.byte(self.cursor);
                    self.text.remove(b);
                }
            }
            Key::Delete => {
                if self.cursor < self.len() {
                    let b = self.byte(self.cursor);
                    self.text.remove(b);
                }
            }
            Key::Left => self.cursor = self.cursor.saturating_sub(1),
            Key::Right => self.cursor = (self.cursor + 1).min(self.len()),
            Key::Home | Key::Ctrl('a') => self.cursor = 0,
            Key::End | Key::Ctrl('e') => self.cursor = self.len(),
            _ => {
                self.fresh = fresh;
                return Outcome::Ignored;
            }
        }
        Outcome::Edited
    }

    /// The text with a cursor mark at the cursor (a pre-filled value is
    /// shown selected, in brackets, since typing replaces it).
    pub fn shown(&self) -> String {
        if self.fresh && !self.text.is_empty() {
            return format!("[{}]▏", self.text);
        }
        let b = self.byte(self.cursor);
        format!("{}▏{}", &self.text[..b], &self.text[b..])
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn typed(f: &mut TextField, s: &str) {
        for c in s.chars() {
            f.key(Key::Char(c));
        }
    }

    #[test]
    fn typing_replaces_the_prefilled_value() {
        let mut f = TextField::prefilled("30 ft");
        typed(&mut f, "9.5 m");
        assert_eq!(f.text, "9.5 m");
    }

    #[test]
    fn moving_first_keeps_the_value_for_editing() {
        let mut f = TextField::prefilled("30 ft");
        assert_eq!(f.key(Key::Home), Outcome::Edited);
        typed(&mut f, "1");
        assert_eq!(f.text, "130 ft");
        f.key(Key::End);
        f.key(Key::Backspace);
        f.key(Key::Backspace);
        assert_eq!(f.text, "130 ");
        let mut g = TextField::prefilled("abc");
        g.key(Key::Backspace);
        assert_eq!(g.text, "ab", "backspace edits the value");
    }

    #[test]
    fn ctrl_u_clears_and_cursor_keys_move() {
        let mut f = TextField::prefilled("24 ft");
        f.key(Key::Ctrl('u'));
        assert_eq!((f.text.as_str(), f.cursor), ("", 0));
        typed(&mut f, "ab");
        f.key(Key::Left);
        typed(&mut f, "x");
        assert_eq!(f.text, "axb");
        f.key(Key::Home);
        f.key(Key::Delete);
        assert_eq!(f.text, "xb");
        assert_eq!(f.shown(), "▏xb");
        assert_eq!(f.key(Key::Enter), Outcome::Done);
        assert_eq!(f.key(Key::Esc), Outcome::Cancel);
        assert_eq!(f.key(Key::Tab), Outcome::Ignored);
    }

    #[test]
    fn multibyte_text_is_edited_by_character() {
        let mut f = TextField::prefilled("2 in²");
        f.key(Key::End);
        f.key(Key::Backspace);
        assert_eq!(f.text, "2 in");
        f.key(Key::Left);
        typed(&mut f, "é");
        assert_eq!(f.text, "2 ién");
    }
}

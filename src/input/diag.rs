//! Problems found in an input file: where (file, line, column, field path),
//! what was found and what is allowed.

use std::fmt;
use std::ops::Range;

use serde::Serialize;

/// How serious a problem is.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Severity {
    /// The file cannot be used.
    Error,
    /// The file is used, but something deserves a look.
    Warning,
}

/// One problem in an input file.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Problem {
    /// Error or warning.
    pub severity: Severity,
    /// File name as given by the user.
    pub file: String,
    /// 1-based line (0 when the problem concerns the whole file).
    pub line: usize,
    /// 1-based column in characters (0 when the problem concerns the whole file).
    pub column: usize,
    /// Field path, e.g. `section 'hc-8' / pattern 'six' / row 1 / height`.
    pub path: String,
    /// A sentence: what was found and what is allowed.
    pub message: String,
}

impl fmt::Display for Problem {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let sev = match self.severity {
            Severity::Error => "error",
            Severity::Warning => "warning",
        };
        // nothing a file holds may drive the terminal: control characters
        // in any part are written escaped
        let clean = crate::input::escape_controls;
        if self.line > 0 {
            write!(f, "{}:{}:{}: {sev}: ", clean(&self.file), self.line, self.column)?;
        } else {
            write!(f, "{}: {sev}: ", clean(&self.file))?;
        }
        if !self.path.is_empty() {
            write!(f, "{}: ", clean(&self.path))?;
        }
        write!(f, "{}", clean(&self.message))
    }
}

/// All problems found in one file; the `Err` of every loader.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub struct Problems(pub Vec<Problem>);

impl fmt::Display for Problems {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        for (i, p) in self.0.iter().enumerate() {
            if i > 0 {
                writeln!(f)?;
            }
            write!(f, "{p}")?;
        }
        Ok(())
    }
}

impl Problems {
    /// The first problem (the one to fix first).
    pub fn first(&self) -> Option<&Problem> {
        self.0.first()
    }
    /// Number of errors (warnings not counted).
    pub fn error_count(&self) -> usize {
        self.0.iter().filter(|p| p.severity == Severity::Error).count()
    }

    /// The messages in the units the file is written in (a metric file's
    /// problems say mm, not in); the user's own text quoted in a message
    /// stays as written.
    pub fn localized(mut self, sys: crate::units::System) -> Problems {
        for p in &mut self.0 {
            p.message = localize_message(&p.message, sys);
        }
        self
    }
}

/// [`crate::units::display::localize`] outside the user's quoted text
/// ('…'): with an even number of quotes the quoted parts stay as written.
pub fn localize_message(text: &str, sys: crate::units::System) -> String {
    use crate::units::display::localize;
    if sys == crate::units::System::Us {
        return text.to_string();
    }
    let parts: Vec<&str> = text.split('\'').collect();
    if parts.len().is_multiple_of(2) {
        // an odd number of quotes: a feet-inch length or an apostrophe
        return localize(text, sys);
    }
    parts
        .iter()
        .enumerate()
        .map(|(i, p)| if i % 2 == 1 { p.to_string() } else { localize(p, sys) })
        .collect::<Vec<_>>()
        .join("'")
}

/// Turns byte spans of one text into line and column, and collects problems.
#[derive(Debug)]
pub struct Reporter<'a> {
    file: String,
    text: &'a str,
    line_starts: Vec<usize>,
    /// Problems so far, in the order found.
    pub problems: Vec<Problem>,
    /// Added to every span: the offset in the text of the block the spans
    /// count from (a large catalog is parsed block by block).
    pub base: usize,
}

impl<'a> Reporter<'a> {
    /// A reporter for `text`, read from `file`.
    pub fn new(file: &str, text: &'a str) -> Self {
        let mut line_starts = vec![0];
        line_starts.extend(text.match_indices('\n').map(|(i, _)| i + 1));
        Reporter {
            file: file.to_string(),
            text,
            line_starts,
            problems: Vec::new(),
            base: 0,
        }
    }

    /// 1-based (line, column) of a byte offset.
    pub fn line_col(&self, offset: usize) -> (usize, usize) {
        let offset = offset.min(self.text.len());
        let line = self.line_starts.partition_point(|&s| s <= offset);
        let start = self.line_starts[line - 1];
        let col = self.text.get(start..offset).map_or(offset - start, |s| s.chars().count()) + 1;
        (line, col)
    }

    fn push(&mut self, severity: Severity, span: Option<Range<usize>>, path: &str, message: String) {
        let (line, column) = span.map_or((0, 0), |s| self.line_col(s.start + self.base));
        self.problems.push(Problem {
            severity,
            file: self.file.clone(),
            line,
            column,
            path: path.to_string(),
            message,
        });
    }

    /// Record an error at `span`.
    pub fn error(&mut self, span: Option<Range<usize>>, path: &str, message: impl Into<String>) {
        self.push(Severity::Error, span, path, message.into());
    }

    /// Record a warning at `span`.
    pub fn warn(&mut self, span: Option<Range<usize>>, path: &str, message: impl Into<String>) {
        self.push(Severity::Warning, span, path, message.into());
    }

    /// Whether any error has been recorded.
    pub fn has_errors(&self) -> bool {
        self.problems.iter().any(|p| p.severity == Severity::Error)
    }

    /// Errors and warnings, errors first in order of position.
    pub fn finish(mut self) -> Vec<Problem> {
        self.problems.sort_by_key(|p| (p.severity == Severity::Warning, p.line, p.column));
        self.problems
    }
}

/// The closest of `candidates` to `word`, if close enough to suggest.
pub fn did_you_mean<'c>(word: &str, candidates: impl IntoIterator<Item = &'c str>) -> Option<&'c str> {
    let w = word.to_lowercase();
    candidates
        .into_iter()
        .map(|c| (c, strsim::jaro_winkler(&w, &c.to_lowercase())))
        .filter(|&(_, s)| s >= 0.8)
        .max_by(|a, b| a.1.total_cmp(&b.1))
        .map(|(c, _)| c)
}

/// " (did you mean 'x'?)" or "".
pub fn suggestion<'c>(word: &str, candidates: impl IntoIterator<Item = &'c str>) -> String {
    did_you_mean(word, candidates).map_or(String::new(), |c| format!(" (did you mean '{c}'?)"))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn line_and_column() {
        let r = Reporter::new("f.toml", "ab\ncdé\nx");
        assert_eq!(r.line_col(0), (1, 1));
        assert_eq!(r.line_col(3), (2, 1));
        assert_eq!(r.line_col(7), (2, 4));
        assert_eq!(r.line_col(8), (3, 1));
    }

    #[test]
    fn suggestions() {
        assert_eq!(did_you_mean("widht", ["width", "depth", "cores"]), Some("width"));
        assert_eq!(did_you_mean("zzz", ["width", "depth"]), None);
    }
}

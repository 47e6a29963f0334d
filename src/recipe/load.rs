//! Why a recipe file could not be opened: where (file, line and column, field) and why.

use std::fmt;
use std::path::PathBuf;

/// What kind of trouble a file gave.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum LoadErrorKind {
    /// The file could not be read at all.
    Read,
    /// Nothing in it.
    Empty,
    /// Far larger than any recipe.
    TooLarge,
    /// Not UTF-8 text.
    NotText,
    /// Not a readable recipe: syntax, types, unknown or missing fields.
    Syntax,
    /// Written by a newer Tankwright.
    Newer {
        /// The file's schema.
        schema: u64,
    },
    /// Well-formed, but a value cannot describe a real coil, tank or measurement.
    Invalid,
}

/// A recipe that could not be opened. The document being edited is never touched.
#[derive(Clone, Debug, PartialEq)]
pub struct LoadError {
    /// The file, when loading from disk.
    pub path: Option<PathBuf>,
    /// Line and column (1-based), when known.
    pub position: Option<(usize, usize)>,
    /// The field at fault in file terms (e.g. `coil.turns`), when known.
    pub field: Option<String>,
    /// What kind of trouble.
    pub kind: LoadErrorKind,
    /// The reason, in words.
    pub reason: String,
}

impl LoadError {
    /// An error without a place.
    pub(crate) fn new(kind: LoadErrorKind, reason: impl Into<String>) -> Self {
        Self {
            path: None,
            position: None,
            field: None,
            kind,
            reason: reason.into(),
        }
    }

    /// The same error, said of `path`.
    pub fn with_path(mut self, path: impl Into<PathBuf>) -> Self {
        self.path = Some(path.into());
        self
    }

    /// The same error at a line and column.
    pub(crate) fn at(mut self, position: Option<(usize, usize)>) -> Self {
        self.position = position;
        self
    }

    /// The same error about a field.
    pub(crate) fn about(mut self, field: impl Into<String>) -> Self {
        self.field = Some(field.into());
        self
    }
}

impl fmt::Display for LoadError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match &self.path {
            Some(p) => write!(f, "{}", p.display())?,
            None => f.write_str("recipe")?,
        }
        if let Some((line, col)) = self.position {
            write!(f, ", line {line} column {col}")?;
        }
        if let Some(field) = &self.field {
            write!(f, ", field {field}")?;
        }
        write!(f, ": {}", self.reason)
    }
}

impl std::error::Error for LoadError {}

/// Line and column (1-based) of byte `offset` in `text`.
pub(crate) fn line_col(text: &str, offset: usize) -> (usize, usize) {
    let before = text.get(..offset).unwrap_or(text);
    let line = 1 + before.matches('\n').count();
    let col = 1 + before
        .rsplit_once('\n')
        .map_or(before, |(_, last)| last)
        .chars()
        .count();
    (line, col)
}

/// Where the `nth` (0-based) `key:` stands in `text`, skipping `//` comment lines; best effort,
/// for pointing at a field whose value was refused after parsing.
pub(crate) fn locate_key(text: &str, key: &str, nth: usize) -> Option<(usize, usize)> {
    let mut seen = 0;
    for (i, line) in text.lines().enumerate() {
        if line.trim_start().starts_with("//") {
            continue;
        }
        let mut from = 0;
        while let Some(found) = line[from..].find(key) {
            let start = from + found;
            let end = start + key.len();
            from = end;
            let before_ok = line[..start]
                .chars()
                .next_back()
                .is_none_or(|c| !(c.is_alphanumeric() || c == '_'));
            let after_ok = line[end..].trim_start().starts_with(':');
            if before_ok && after_ok {
                if seen == nth {
                    return Some((i + 1, line[..start].chars().count() + 1));
                }
                seen += 1;
            }
        }
    }
    None
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn positions_are_one_based() {
        assert_eq!(line_col("ab\ncd", 0), (1, 1));
        assert_eq!(line_col("ab\ncd", 4), (2, 2));
        let text = "A(\n  // note: x\n  note: 1,\n  notes: 2,\n  note: 3)";
        assert_eq!(locate_key(text, "note", 0), Some((3, 3)));
        assert_eq!(locate_key(text, "note", 1), Some((5, 3)));
        assert_eq!(locate_key(text, "notes", 0), Some((4, 3)));
    }
}

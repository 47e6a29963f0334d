//! What the file desk remembers between runs (persisted by the app).

use super::folder::default_folder;
use serde::{Deserialize, Serialize};
use std::path::{Path, PathBuf};

/// Most recently used files kept.
pub const RECENT_MAX: usize = 8;

/// The file desk's persisted state. Every field has a default, so a renamed or added field
/// never resets the rest.
#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(default)]
pub struct FileDeskMemory {
    /// Recently opened or saved recipes, newest first.
    pub recent: Vec<PathBuf>,
    /// Where dialogs start and the typed-path field lists recipes.
    pub folder: PathBuf,
}

impl Default for FileDeskMemory {
    fn default() -> Self {
        Self {
            recent: Vec::new(),
            folder: default_folder(),
        }
    }
}

impl FileDeskMemory {
    /// Put `path` first in the recent list (once), keeping at most [`RECENT_MAX`].
    pub fn remember(&mut self, path: &Path) {
        self.recent.retain(|p| p != path);
        self.recent.insert(0, path.to_path_buf());
        self.recent.truncate(RECENT_MAX);
    }

    /// Drop `path` from the recent list.
    pub fn forget(&mut self, path: &Path) {
        self.recent.retain(|p| p != path);
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn recent_list_is_newest_first_without_repeats() {
        let mut m = FileDeskMemory::default();
        for i in 0..10 {
            m.remember(Path::new(&format!("/r/{i}.ron")));
        }
        m.remember(Path::new("/r/5.ron"));
        assert_eq!(m.recent.len(), RECENT_MAX);
        assert_eq!(m.recent[0], PathBuf::from("/r/5.ron"));
        assert_eq!(m.recent[1], PathBuf::from("/r/9.ron"));
        assert_eq!(m.recent.iter().filter(|p| p.ends_with("5.ron")).count(), 1);
    }
}

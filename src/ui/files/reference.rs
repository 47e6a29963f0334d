//! Asking for a recipe to pin as the teaching bench's reference, through the same path asker
//! (system dialog, or the test's answers) and the same reader as "Open…": the file is read,
//! never made the document.

use super::asker::Picked;
use super::desk::FileDesk;
use crate::recipe::{self, Recipe};
use std::path::{Path, PathBuf};

/// What came of asking for a reference file.
#[derive(Clone, Debug, PartialEq)]
pub enum ReferencePick {
    /// The recipe read, and the file's name.
    Read(String, Box<Recipe>),
    /// The user cancelled.
    Cancelled,
    /// No dialog could be shown (the reason); the caller offers a typed path.
    Unavailable(String),
    /// The file could not be read (why, with the path).
    Failed(String),
}

impl FileDesk {
    /// Ask for a recipe file to pin as a reference, starting in the desk's folder.
    pub fn ask_reference(&mut self) -> ReferencePick {
        let folder = self.memory.folder.clone();
        match self.asker.open(&folder) {
            Picked::Path(path) => read_reference(&path),
            Picked::Cancelled => ReferencePick::Cancelled,
            Picked::Unavailable(reason) => ReferencePick::Unavailable(reason),
        }
    }

    /// The folder a typed reference path starts from.
    pub fn reference_folder(&self) -> PathBuf {
        self.memory.folder.clone()
    }
}

/// Read the recipe at `path` as "Open…" reads it (a file that breaks a rule is read as
/// written; the engine judges it when it is pinned).
pub fn read_reference(path: &Path) -> ReferencePick {
    match recipe::open(path) {
        Ok(opened) => {
            let name = path.file_name().map_or_else(
                || path.display().to_string(),
                |n| n.to_string_lossy().into_owned(),
            );
            ReferencePick::Read(name, Box::new(opened.recipe))
        }
        Err(e) => ReferencePick::Failed(format!("could not read {}: {e}", path.display())),
    }
}

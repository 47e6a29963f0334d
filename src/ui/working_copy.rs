//! The working copy kept across restarts in eframe's storage, so a crash or a forgotten save
//! loses at most the last few seconds.
//!
//! Stored as recipe text (the same RON as a recipe file), with the file it came from and the
//! text as last saved, so an unsaved change is still marked unsaved after a restart.

use crate::recipe::{Recipe, format};
use serde::{Deserialize, Serialize};
use std::path::PathBuf;

/// eframe storage key of the working copy.
pub const WORKING_COPY_KEY: &str = "tankwright.working_copy";

/// What is kept between runs.
#[derive(Clone, Debug, Default, PartialEq, Serialize, Deserialize)]
#[serde(default)]
pub struct WorkingCopy {
    /// The recipe on screen, as recipe text.
    pub recipe: String,
    /// The recipe as last saved or opened, as recipe text.
    pub saved: String,
    /// The file it was opened from or saved to.
    pub path: Option<PathBuf>,
}

/// A working copy brought back: the document, what counts as saved, and its file.
#[derive(Clone, Debug, PartialEq)]
pub struct Restored {
    /// The recipe to show.
    pub recipe: Recipe,
    /// The recipe as last saved (equal to `recipe` when nothing was unsaved).
    pub saved: Recipe,
    /// Its file, if any.
    pub path: Option<PathBuf>,
}

impl WorkingCopy {
    /// Capture the document and its saved state.
    pub fn of(recipe: &Recipe, saved: &Recipe, path: Option<PathBuf>) -> Self {
        Self {
            recipe: format::to_text(recipe),
            saved: format::to_text(saved),
            path,
        }
    }

    /// Bring it back. A working copy that no longer reads (e.g. edited to something the
    /// engine refuses before the window closed) gives the reason instead, and the caller
    /// starts from the demo and says so.
    pub fn restore(&self) -> Result<Restored, String> {
        let recipe = format::from_text(&self.recipe).map_err(|e| e.to_string())?;
        let saved = format::from_text(&self.saved).unwrap_or_else(|_| recipe.clone());
        Ok(Restored {
            recipe,
            saved,
            path: self.path.clone(),
        })
    }
}

//! Undo and redo of every change to the recipe: a whole slider drag is one step.

use crate::recipe::Recipe;
use eframe::egui::util::undoer::Undoer;

/// The recipe's history.
#[derive(Default)]
pub struct History {
    undoer: Undoer<Recipe>,
}

impl History {
    /// Tell the history about the recipe as it stands this frame, at `time` seconds. A new step
    /// is recorded once the recipe has stayed the same for a moment (so a drag is one step).
    pub fn feed(&mut self, time: f64, recipe: &Recipe) {
        self.undoer.feed_state(time, recipe);
    }

    /// True while the recipe is changing and no step has been recorded for it yet.
    pub fn is_in_flux(&self) -> bool {
        self.undoer.is_in_flux()
    }

    /// Is there a step to go back to?
    pub fn can_undo(&self, recipe: &Recipe) -> bool {
        self.undoer.has_undo(recipe)
    }

    /// Is there a step to go forward to?
    pub fn can_redo(&self, recipe: &Recipe) -> bool {
        self.undoer.has_redo(recipe)
    }

    /// Go back one step: replaces `recipe` and returns true if there was one.
    pub fn undo(&mut self, recipe: &mut Recipe) -> bool {
        match self.undoer.undo(recipe) {
            Some(previous) => {
                *recipe = previous.clone();
                true
            }
            None => false,
        }
    }

    /// Go forward one step: replaces `recipe` and returns true if there was one.
    pub fn redo(&mut self, recipe: &mut Recipe) -> bool {
        match self.undoer.redo(recipe) {
            Some(next) => {
                *recipe = next.clone();
                true
            }
            None => false,
        }
    }
}

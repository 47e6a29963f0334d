//! Keeping the work: the working copy and session handed to the keeper, its failures said,
//! and the choice between a recovered working copy and the file asked for.

use super::App;
use crate::ui::files::Notice;
use crate::ui::working_copy::{
    self, Keeper, Recovery, RecoveryChoice, SessionStateRef, WORKING_COPY_FAILED,
};
use eframe::egui;

impl App {
    /// Ask about a recovered working copy that differs from the file asked for.
    pub(super) fn recovery_ui(&mut self, ctx: &egui::Context) {
        let Some(recovery) = &self.recovery else {
            return;
        };
        match working_copy::recovery_ui(ctx, recovery, &self.recipe.name) {
            Some(RecoveryChoice::KeepRecovered) => self.recovery = None,
            Some(RecoveryChoice::OpenFile) => {
                if let Some(Recovery { path, opened }) = self.recovery.take() {
                    self.files.notice = opened.refusal.as_ref().map(|e| Notice {
                        text: working_copy::refusal_notice(e),
                        is_error: true,
                    });
                    self.set_document(opened.recipe);
                    self.files.mark_opened(Some(&path), &self.recipe);
                }
            }
            None => {}
        }
    }

    /// Hand the document and the session to the keeper if they changed (it writes them on its
    /// own thread, so an idle window that paints nothing still has them on disk).
    pub(super) fn keep(&mut self) {
        let Some(keeper) = &mut self.keeper else {
            return;
        };
        keeper.observe(
            &self.recipe,
            SessionStateRef {
                preferences: self.preferences,
                files: &self.files.memory,
                origin: self.files.path(),
                saved: self.files.saved_snapshot(),
                parts_on_hand: &self.parts_panel.text,
            },
        );
        match keeper.failure_change() {
            Some(Some(failure)) => {
                self.files.notice = Some(Notice {
                    text: format!(
                        "{WORKING_COPY_FAILED} {} ({failure}); save your recipe to a file",
                        keeper.folder().display()
                    ),
                    is_error: true,
                });
            }
            // Writing holds again: the warning comes down (only if it is still the one shown).
            Some(None)
                if self
                    .files
                    .notice
                    .as_ref()
                    .is_some_and(|n| n.text.starts_with(WORKING_COPY_FAILED)) =>
            {
                self.files.notice = None;
            }
            _ => {}
        }
    }

    /// The data folder the working copy is kept in, when it is kept.
    pub fn data_folder(&self) -> Option<&std::path::Path> {
        self.keeper.as_ref().map(Keeper::folder)
    }

    /// Write the working copy and session now and wait for it (as on closing).
    pub fn flush_working_copy(&mut self) {
        self.keep();
        if let Some(keeper) = &mut self.keeper {
            keeper.flush();
        }
    }

    /// Whether the window is asking about a recovered working copy.
    pub fn is_asking_about_recovery(&self) -> bool {
        self.recovery.is_some()
    }
}

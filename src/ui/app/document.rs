//! The document: replacing the recipe being edited (opened, made new, recovered), and its
//! name and notes at the top of the left panel.

use super::App;
use crate::recipe::{FieldInput, Recipe, Unled};
use crate::ui::evaluation::Evaluation;
use crate::ui::undo::History;
use eframe::egui;

impl App {
    /// Replace the document (a recipe opened or made new): the history starts afresh and the
    /// figures are those of the new recipe (nothing of the old one is shown as "last good").
    pub fn set_document(&mut self, recipe: Recipe) {
        self.files.mark_opened(None, &recipe);
        self.start_document(recipe);
    }

    /// Start on `recipe` (the file desk, when it opened or made it, has already marked it):
    /// fresh figures, a fresh history, an empty reading form.
    pub(super) fn start_document(&mut self, recipe: Recipe) {
        self.evaluation = Evaluation::new(&recipe, FieldInput::Unsolved(Unled::Pending));
        self.recipe = recipe;
        self.history = History::default();
        self.bench_log.reset();
    }
}

/// The recipe's name and notes, at the top of the left panel.
pub(super) fn recipe_header(ui: &mut egui::Ui, recipe: &mut Recipe) {
    ui.horizontal(|ui| {
        ui.label("Recipe name");
        // The recipe rules' longest name: the field cannot hold what the loader refuses.
        ui.add(
            egui::TextEdit::singleline(&mut recipe.name)
                .id_salt("recipe_name")
                .char_limit(crate::recipe::rules::NAME_MAX)
                .desired_width(f32::INFINITY),
        )
        .on_hover_text("Recipe name");
    });
    egui::CollapsingHeader::new("Notes")
        .default_open(false)
        .show(ui, |ui| {
            ui.add(
                egui::TextEdit::multiline(&mut recipe.notes)
                    .id_salt("recipe_notes")
                    .desired_rows(3)
                    .desired_width(f32::INFINITY),
            )
            .on_hover_text("Notes");
        });
}

//! The cautions: a one-line reminder always on screen and a window with the full note (the
//! text itself is [`crate::cautions`], shared with the report and the hand-outs).

use crate::ui::theme;
use crate::ui::widgets::caution_mark;
use eframe::egui::{self, RichText};

use crate::cautions::NOTE;
/// The line shown at the foot of the main screen (the shared text).
pub use crate::cautions::ONE_LINE;

/// Label of the button that opens the full note.
pub const OPEN_LABEL: &str = "Cautions…";

/// The one-line caution with the button that opens the note. Returns true when the button
/// was clicked.
pub fn strip(ui: &mut egui::Ui) -> bool {
    let mut open = false;
    ui.horizontal(|ui| {
        if ui.button(OPEN_LABEL).clicked() {
            open = true;
        }
        caution_mark(ui);
        ui.add(egui::Label::new(RichText::new(ONE_LINE).color(theme::caution(ui))).wrap());
    });
    open
}

/// The window with the full note, while `open` is true (its close button clears it).
pub fn window(ctx: &egui::Context, open: &mut bool) {
    egui::Window::new("Cautions")
        .open(open)
        .collapsible(false)
        .resizable(false)
        .default_size([560.0, 600.0])
        .pivot(egui::Align2::CENTER_CENTER)
        .default_pos(ctx.content_rect().center())
        .show(ctx, |ui| {
            let room = (ctx.content_rect().height() - 120.0).max(200.0);
            egui::ScrollArea::vertical()
                .max_height(room)
                .show(ui, |ui| {
                    for (heading, text) in NOTE {
                        ui.label(RichText::new(heading).strong());
                        ui.label(text);
                        ui.add_space(6.0);
                    }
                });
        });
}

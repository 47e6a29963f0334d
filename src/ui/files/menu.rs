//! The contents of the "Recipe" menu and its keyboard shortcuts.

use super::desk::{FileAction, FileDesk, Intent};
use crate::recipe::{self, Recipe};
use eframe::egui;
use egui::{Key, KeyboardShortcut, Modifiers};

const NEW: KeyboardShortcut = KeyboardShortcut::new(Modifiers::COMMAND, Key::N);
const OPEN: KeyboardShortcut = KeyboardShortcut::new(Modifiers::COMMAND, Key::O);
const SAVE: KeyboardShortcut = KeyboardShortcut::new(Modifiers::COMMAND, Key::S);
const SAVE_AS: KeyboardShortcut =
    KeyboardShortcut::new(Modifiers::COMMAND.plus(Modifiers::SHIFT), Key::S);

impl FileDesk {
    /// The contents of the "Recipe" menu: new, open…, recent files, demos, save, save as…,
    /// quit. Call inside `ui.menu_button("Recipe", ..)`.
    pub fn menu_ui(&mut self, ui: &mut egui::Ui, doc: &Recipe) -> Option<FileAction> {
        let ctx = ui.ctx().clone();
        let keys = |s: &KeyboardShortcut| ctx.format_shortcut(s);
        let mut action = None;
        if ui
            .add(egui::Button::new("New recipe").shortcut_text(keys(&NEW)))
            .clicked()
        {
            ui.close();
            action = self.request(Intent::New(doc.target.plan.service()), doc);
        }
        if ui
            .add(egui::Button::new("Open…").shortcut_text(keys(&OPEN)))
            .clicked()
        {
            ui.close();
            action = self.request(Intent::Open, doc);
        }
        ui.menu_button("Open recent", |ui| {
            if self.memory.recent.is_empty() {
                ui.label("Nothing opened yet");
            }
            for path in self.memory.recent.clone() {
                let name = path.file_name().map_or_else(
                    || path.display().to_string(),
                    |n| n.to_string_lossy().into(),
                );
                if ui
                    .button(name)
                    .on_hover_text(path.display().to_string())
                    .clicked()
                {
                    ui.close();
                    action = self.request(Intent::OpenPath(path), doc);
                }
            }
        });
        ui.menu_button("Demo recipes", |ui| {
            for (i, (file, demo)) in recipe::demos().iter().enumerate() {
                if ui
                    .button(demo.name.as_str())
                    .on_hover_text(format!(
                        "{file}: opens a copy; your changes go to a file of your own"
                    ))
                    .clicked()
                {
                    ui.close();
                    action = self.request(Intent::OpenDemo(i), doc);
                }
            }
        });
        ui.separator();
        let save_label = if self.path.is_some() {
            "Save"
        } else {
            "Save…"
        };
        if ui
            .add(egui::Button::new(save_label).shortcut_text(keys(&SAVE)))
            .clicked()
        {
            ui.close();
            action = self.save(doc, None);
        }
        if ui
            .add(egui::Button::new("Save as…").shortcut_text(keys(&SAVE_AS)))
            .clicked()
        {
            ui.close();
            action = self.save_as(doc, None);
        }
        ui.separator();
        if ui.button("Quit").clicked() {
            ui.close();
            action = self.request(Intent::Quit, doc);
        }
        action
    }

    /// Ctrl+N (new), Ctrl+O (open…), Ctrl+S (save), Ctrl+Shift+S (save as…); ignored while a
    /// dialog of the desk is open.
    pub fn shortcuts(&mut self, ctx: &egui::Context, doc: &Recipe) -> Option<FileAction> {
        if self.is_asking() {
            return None;
        }
        let pressed = |s: &KeyboardShortcut| ctx.input_mut(|i| i.consume_shortcut(s));
        // The most specific first: Ctrl+Shift+S would also match Ctrl+S.
        if pressed(&SAVE_AS) {
            self.save_as(doc, None)
        } else if pressed(&SAVE) {
            self.save(doc, None)
        } else if pressed(&NEW) {
            self.request(Intent::New(doc.target.plan.service()), doc)
        } else if pressed(&OPEN) {
            self.request(Intent::Open, doc)
        } else {
            None
        }
    }
}

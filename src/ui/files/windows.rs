//! The desk's windows: asking before unsaved changes are dropped, and the typed-path prompt
//! used where no system file dialog can be shown.

use super::desk::{FileAction, FileDesk, Intent, Purpose};
use super::folder::{recipes_in, with_ron_extension};
use crate::recipe::Recipe;
use eframe::egui;
use std::path::{Path, PathBuf};

/// The answer to "unsaved changes".
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
enum Answer {
    Save,
    Discard,
    Keep,
}

impl FileDesk {
    /// The desk's windows, shown every frame: asks before a new/open/quit drops unsaved
    /// changes (closing the window included: it is held with `ViewportCommand::CancelClose`
    /// until answered), and the typed-path prompt.
    pub fn windows_ui(&mut self, ctx: &egui::Context, doc: &Recipe) -> Option<FileAction> {
        if ctx.input(|i| i.viewport().close_requested())
            && !self.close_confirmed
            && self.is_dirty(doc)
        {
            ctx.send_viewport_cmd(egui::ViewportCommand::CancelClose);
            self.pending = Some(Intent::Quit);
        }
        if self.pending.is_some() {
            return self.unsaved_ui(ctx, doc);
        }
        if self.prompt.is_some() {
            return self.prompt_ui(ctx, doc);
        }
        None
    }

    /// The last file message with a button to dismiss it; for the app's status bar.
    pub fn notice_ui(&mut self, ui: &mut egui::Ui) {
        let Some(notice) = &self.notice else {
            return;
        };
        let mut dismiss = false;
        // The button first, so a long notice wraps beside it and never pushes it off the
        // window's edge (it was clipped at 1280×720).
        ui.horizontal(|ui| {
            dismiss = ui.small_button("Dismiss").clicked();
            let text = if notice.is_error {
                egui::RichText::new(&notice.text).color(ui.visuals().error_fg_color)
            } else {
                egui::RichText::new(&notice.text)
            };
            ui.add(egui::Label::new(text).wrap());
        });
        if dismiss {
            self.notice = None;
        }
    }

    fn unsaved_ui(&mut self, ctx: &egui::Context, doc: &Recipe) -> Option<FileAction> {
        let intent = self.pending.clone()?;
        let what = match intent {
            Intent::New(_) => "start a new recipe",
            Intent::Open | Intent::OpenPath(_) | Intent::OpenDemo(_) => "open another recipe",
            Intent::Quit => "quit",
        };
        let save_label = if self.path.is_some() {
            "Save first"
        } else {
            "Save first…"
        };
        let mut answer = None;
        let modal =
            egui::Modal::new(egui::Id::unique("tankwright-unsaved-changes")).show(ctx, |ui| {
                ui.heading("Unsaved changes");
                ui.label(format!(
                    "\"{}\" has changes that are not saved. Save them before you {what}?",
                    doc.name
                ));
                ui.add_space(8.0);
                ui.horizontal(|ui| {
                    if ui.button(save_label).clicked() {
                        answer = Some(Answer::Save);
                    }
                    if ui.button("Discard changes").clicked() {
                        answer = Some(Answer::Discard);
                    }
                    if ui.button("Keep editing").clicked() {
                        answer = Some(Answer::Keep);
                    }
                });
            });
        if answer.is_none() && modal.should_close() {
            answer = Some(Answer::Keep);
        }
        match answer? {
            Answer::Save => {
                self.pending = None;
                self.save(doc, Some(intent))
            }
            Answer::Discard => self.carry_out(intent),
            Answer::Keep => {
                self.pending = None;
                None
            }
        }
    }

    fn prompt_ui(&mut self, ctx: &egui::Context, doc: &Recipe) -> Option<FileAction> {
        let mut prompt = self.prompt.take()?;
        let typed = PathBuf::from(prompt.text.trim());
        let listed: &Path = if typed.is_dir() {
            &typed
        } else {
            typed
                .parent()
                .filter(|p| p.is_dir())
                .unwrap_or(&self.memory.folder)
        };
        let listed = listed.to_path_buf();
        let files = recipes_in(&listed);
        let (title, verb) = match prompt.purpose {
            Purpose::Open => ("Open a recipe".to_owned(), "Open"),
            Purpose::SaveAs => ("Save the recipe".to_owned(), "Save"),
            Purpose::Export(e, _) => (format!("Export {}", e.what()), "Write the file"),
        };
        let error = self
            .notice
            .as_ref()
            .filter(|n| n.is_error)
            .map(|n| n.text.clone());
        let (mut go, mut cancel, mut replace, mut keep) = (false, false, false, false);
        let modal = egui::Modal::new(egui::Id::unique("tankwright-path-prompt")).show(ctx, |ui| {
            ui.heading(title);
            ui.label(&prompt.reason);
            ui.add_space(6.0);
            let label = ui.label("File path");
            let edit = ui
                .add(egui::TextEdit::singleline(&mut prompt.text).desired_width(440.0))
                .labelled_by(label.id);
            if edit.lost_focus() && ui.input(|i| i.key_pressed(egui::Key::Enter)) {
                go = true;
            }
            ui.add_space(6.0);
            if files.is_empty() {
                ui.label(format!("No recipes in {} yet.", listed.display()));
            } else {
                ui.label(format!("Recipes in {}:", listed.display()));
                egui::ScrollArea::vertical()
                    .max_height(180.0)
                    .show(ui, |ui| {
                        for f in &files {
                            let name = f
                                .file_name()
                                .map_or_else(String::new, |n| n.to_string_lossy().into_owned());
                            let chosen = Path::new(prompt.text.trim()) == f;
                            if ui.selectable_label(chosen, name).clicked() {
                                prompt.text = f.display().to_string();
                            }
                        }
                    });
            }
            if let Some(e) = &error {
                ui.colored_label(ui.visuals().error_fg_color, e);
            }
            ui.add_space(6.0);
            if let Some(existing) = &prompt.replace {
                let with = match prompt.purpose {
                    Purpose::Export(..) => "this export",
                    Purpose::Open | Purpose::SaveAs => "this recipe",
                };
                ui.label(format!(
                    "{} already exists. Replace it with {with}?",
                    existing.display()
                ));
                ui.horizontal(|ui| {
                    if ui.button("Replace it").clicked() {
                        replace = true;
                    }
                    if ui.button("Keep it").clicked() {
                        keep = true;
                    }
                });
            } else {
                ui.horizontal(|ui| {
                    if ui.button(verb).clicked() {
                        go = true;
                    }
                    if ui.button("Cancel").clicked() {
                        cancel = true;
                    }
                });
            }
        });
        if keep {
            prompt.replace = None;
            self.prompt = Some(prompt);
            return None;
        }
        // Typing after the question was asked withdraws it.
        let typed_path = |text: &str| match prompt.purpose {
            Purpose::Export(e, _) => e.with_extension(PathBuf::from(text.trim())),
            Purpose::Open | Purpose::SaveAs => with_ron_extension(PathBuf::from(text.trim())),
        };
        if prompt
            .replace
            .as_ref()
            .is_some_and(|p| *p != typed_path(&prompt.text))
        {
            prompt.replace = None;
        }
        go |= replace;
        if cancel || (!go && modal.should_close()) {
            return None;
        }
        if !go {
            self.prompt = Some(prompt);
            return None;
        }
        let path = PathBuf::from(prompt.text.trim());
        if prompt.text.trim().is_empty() || path.is_dir() {
            self.notice = Some(super::Notice {
                text: "type the path of a file, not a folder".to_owned(),
                is_error: true,
            });
            self.prompt = Some(prompt);
            return None;
        }
        match prompt.purpose {
            Purpose::Open => {
                let action = self.open_path(&path);
                if action.is_none() {
                    self.prompt = Some(prompt);
                }
                action
            }
            Purpose::SaveAs => {
                let path = with_ron_extension(path);
                // Ask before writing over a file the user did not pick from a system dialog.
                if !replace && std::fs::symlink_metadata(&path).is_ok() {
                    prompt.replace = Some(path);
                    self.prompt = Some(prompt);
                    return None;
                }
                prompt.replace = None;
                let then = prompt.then.take();
                if self.write(&path, doc) {
                    if let Some(dir) = path.parent().filter(|d| !d.as_os_str().is_empty()) {
                        self.memory.folder = dir.to_path_buf();
                    }
                    then.and_then(|t| self.carry_out(t))
                } else {
                    prompt.then = then;
                    self.prompt = Some(prompt);
                    None
                }
            }
            Purpose::Export(export, footing) => {
                let path = export.with_extension(path);
                if !replace && std::fs::symlink_metadata(&path).is_ok() {
                    prompt.replace = Some(path);
                    self.prompt = Some(prompt);
                    return None;
                }
                if self.write_export(export, doc, &path, footing) {
                    if let Some(dir) = path.parent().filter(|d| !d.as_os_str().is_empty()) {
                        self.memory.folder = dir.to_path_buf();
                    }
                } else {
                    prompt.replace = None;
                    self.prompt = Some(prompt);
                }
                None
            }
        }
    }
}

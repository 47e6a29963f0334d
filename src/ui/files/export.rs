//! The "Export" menu: the build sheet and worksheet (PDF) and the charts (SVG, PNG), asked
//! for through the same [`super::PathAsker`] as saving (tests answer with a path; without a
//! system dialog the typed-path prompt asks). The files are made by [`crate::handout`], the
//! same code as `tankwright sheet` and `tankwright chart`.

use super::asker::Picked;
use super::desk::{FileDesk, PathPrompt, Purpose};
use super::folder::suggested_file_name;
use crate::handout::{ChartKind, write_chart, write_sheet};
use crate::recipe::Footing;
use crate::recipe::Recipe;
use eframe::egui;
use std::path::{Path, PathBuf};

/// Something the Export menu writes.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Export {
    /// The build sheet, spacing chart and worksheet, PDF.
    Sheet,
    /// One chart, with the file's extension ("svg" or "png").
    Chart(ChartKind, &'static str),
}

impl Export {
    /// Everything the menu offers, in its order.
    pub const ALL: [Export; 5] = [
        Export::Sheet,
        Export::Chart(ChartKind::Spacing, "svg"),
        Export::Chart(ChartKind::Spacing, "png"),
        Export::Chart(ChartKind::Trimmer, "svg"),
        Export::Chart(ChartKind::Trimmer, "png"),
    ];

    /// The menu item.
    pub fn menu_label(self) -> String {
        match self {
            Export::Sheet => "Build sheet and worksheet (PDF)…".to_owned(),
            Export::Chart(kind, ext) => format!(
                "{} chart as {}…",
                match kind {
                    ChartKind::Spacing => "Spacing",
                    ChartKind::Trimmer => "Trimmer",
                },
                ext.to_uppercase()
            ),
        }
    }

    /// What is written, in words (dialog title and messages).
    pub fn what(self) -> String {
        match self {
            Export::Sheet => "the build sheet and worksheet".to_owned(),
            Export::Chart(kind, ext) => {
                format!("the {} chart ({})", kind.cli_name(), ext.to_uppercase())
            }
        }
    }

    /// The file's extension.
    pub fn extension(self) -> &'static str {
        match self {
            Export::Sheet => "pdf",
            Export::Chart(_, ext) => ext,
        }
    }

    /// The file name offered for `recipe_name`.
    pub fn suggested(self, recipe_name: &str) -> String {
        let recipe_file = suggested_file_name(recipe_name);
        let stem = recipe_file.strip_suffix(".ron").unwrap_or(&recipe_file);
        match self {
            Export::Sheet => format!("{stem}_sheet.pdf"),
            Export::Chart(kind, ext) => format!("{stem}_{}.{ext}", kind.cli_name()),
        }
    }

    /// `path` with this export's extension when it has none.
    pub fn with_extension(self, path: PathBuf) -> PathBuf {
        if path.extension().is_some() {
            path
        } else {
            path.with_extension(self.extension())
        }
    }

    /// Write it for `doc` to `path`, its figures on `footing` (the window's setting).
    pub fn write(self, doc: &Recipe, path: &Path, footing: Footing) -> Result<(), String> {
        match self {
            Export::Sheet => write_sheet(doc, path, footing),
            Export::Chart(kind, _) => write_chart(doc, kind, path, footing),
        }
    }
}

impl FileDesk {
    /// The contents of the "Export" menu. Call inside `ui.menu_button("Export", ..)`.
    /// The figures stand on `footing`, the window's.
    pub fn export_menu_ui(&mut self, ui: &mut egui::Ui, doc: &Recipe, footing: Footing) {
        for (i, export) in Export::ALL.into_iter().enumerate() {
            if i == 1 {
                ui.separator();
            }
            // A fixed tank has no trimmer chart: the item is greyed, its hover says why.
            let refused = match export {
                Export::Chart(kind, _) => crate::handout::refused(kind, doc),
                Export::Sheet => None,
            };
            let button = ui.add_enabled(refused.is_none(), egui::Button::new(export.menu_label()));
            let button = match &refused {
                Some(why) => button.on_disabled_hover_text(why),
                None => button,
            };
            if button.clicked() {
                ui.close();
                self.export(export, doc, footing);
            }
        }
    }

    /// Ask where to write `export` for `doc`, its figures on `footing`, then write it; the
    /// outcome is in the notice.
    pub fn export(&mut self, export: Export, doc: &Recipe, footing: Footing) {
        let folder = self.memory.folder.clone();
        if let Err(e) = std::fs::create_dir_all(&folder) {
            self.warn(format!(
                "cannot create the recipe folder {}: {e}",
                folder.display()
            ));
        }
        let suggested = export.suggested(&doc.name);
        match self
            .asker
            .export(&folder, &suggested, &export.what(), export.extension())
        {
            Picked::Path(p) => {
                self.write_export(export, doc, &export.with_extension(p), footing);
            }
            Picked::Cancelled => {}
            Picked::Unavailable(reason) => {
                self.prompt = Some(PathPrompt {
                    purpose: Purpose::Export(export, footing),
                    text: folder.join(suggested).display().to_string(),
                    reason,
                    then: None,
                    replace: None,
                });
            }
        }
    }

    /// Write `export` for `doc` to `path`, its figures on `footing`, and say how it went;
    /// true when written.
    pub(super) fn write_export(
        &mut self,
        export: Export,
        doc: &Recipe,
        path: &Path,
        footing: Footing,
    ) -> bool {
        match export.write(doc, path, footing) {
            Ok(()) => {
                self.tell(format!("exported {} to {}", export.what(), path.display()));
                true
            }
            Err(e) => {
                self.warn(format!("could not export {}: {e}", export.what()));
                false
            }
        }
    }
}

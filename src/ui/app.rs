//! The application: the recipe being edited, what is shown of it, and the frame loop.

use crate::model::Analysis;
use crate::recipe::Recipe;
use crate::ui::bench_log::{BenchLogAction, BenchLogPanel};
use crate::ui::cautions;
use crate::ui::evaluation::Evaluation;
use crate::ui::files::{FileAction, FileDesk, FileDeskMemory, Notice};
use crate::ui::panels::tank::TankPanel;
use crate::ui::panels::target::TargetPanel;
use crate::ui::panels::top_bar::{self, BarState};
use crate::ui::panels::{Command, bench, readouts, winding};
use crate::ui::preferences::{PREFERENCES_KEY, Preferences};
use crate::ui::screenshot::ScreenshotJob;
use crate::ui::theme::Theme;
use crate::ui::undo::History;
use crate::ui::widgets::LABEL_WIDTH;
use crate::ui::working_copy::{WORKING_COPY_KEY, WorkingCopy};
use eframe::egui::{self, Key, KeyboardShortcut, Modifiers};

/// Seconds a change must rest before it becomes an undo step (the undoer's default), plus a
/// little, so a frame runs then.
const UNDO_SETTLE_SECONDS: f32 = 1.05;

/// Left panel: usual width, narrowest, and largest share of the window (points, fraction).
const LEFT_DEFAULT: f32 = 380.0;
const LEFT_MIN: f32 = 340.0;
const LEFT_SHARE: f32 = 0.3;
/// Right panel: usual width, narrowest, and largest share of the window.
const RIGHT_DEFAULT: f32 = 440.0;
const RIGHT_MIN: f32 = 360.0;
const RIGHT_SHARE: f32 = 0.34;

/// eframe storage key of the file desk's memory (recent files, recipe folder).
const FILES_KEY: &str = "tankwright.files";

const UNDO: KeyboardShortcut = KeyboardShortcut::new(Modifiers::COMMAND, Key::Z);
const REDO: KeyboardShortcut =
    KeyboardShortcut::new(Modifiers::COMMAND.plus(Modifiers::SHIFT), Key::Z);

/// The workbench window.
pub struct App {
    /// The document being edited (the one thing saved to a recipe file).
    recipe: Recipe,
    preferences: Preferences,
    evaluation: Evaluation,
    history: History,
    tank_panel: TankPanel,
    target_panel: TargetPanel,
    bench_log: BenchLogPanel,
    files: FileDesk,
    cautions_open: bool,
    applied_theme: Option<Theme>,
    shown_title: String,
    screenshot: Option<ScreenshotJob>,
}

impl App {
    /// The window as eframe creates it: the working copy of the last session if there is one
    /// (so a crash or a forgotten save loses at most the last few seconds), else the demo
    /// recipe; with the view preferences and recent files of the last session.
    pub fn new(cc: &eframe::CreationContext<'_>) -> Self {
        let mut app = Self::with_recipe(Recipe::demo());
        let Some(storage) = cc.storage else {
            return app;
        };
        if let Some(preferences) = eframe::get_value(storage, PREFERENCES_KEY) {
            app.preferences = preferences;
        }
        if let Some(memory) = eframe::get_value::<FileDeskMemory>(storage, FILES_KEY) {
            app.files.memory = memory;
        }
        if let Some(copy) = eframe::get_value::<WorkingCopy>(storage, WORKING_COPY_KEY) {
            match copy.restore() {
                Ok(restored) => {
                    app.set_document(restored.saved.clone());
                    app.files
                        .mark_opened(restored.path.as_deref(), &restored.saved);
                    app.recipe = restored.recipe;
                    app.evaluation = Evaluation::new(&app.recipe);
                }
                Err(reason) => {
                    app.files.notice = Some(Notice {
                        text: format!(
                            "The last session's working copy could not be restored ({reason}); \
                             showing the demo recipe."
                        ),
                        is_error: true,
                    });
                }
            }
        }
        app
    }

    /// A window editing `recipe`, with default view preferences.
    pub fn with_recipe(recipe: Recipe) -> Self {
        let files = FileDesk::new(FileDeskMemory::default(), &recipe);
        Self {
            evaluation: Evaluation::new(&recipe),
            recipe,
            preferences: Preferences::default(),
            history: History::default(),
            tank_panel: TankPanel::default(),
            target_panel: TargetPanel::default(),
            bench_log: BenchLogPanel::default(),
            files,
            cautions_open: false,
            applied_theme: None,
            shown_title: String::new(),
            screenshot: None,
        }
    }

    /// The same window editing `recipe`, opened from the file at `path` (a fresh history;
    /// Save writes back to that file).
    pub fn with_file(mut self, recipe: Recipe, path: &std::path::Path) -> Self {
        self.set_document(recipe);
        self.files.mark_opened(Some(path), &self.recipe);
        self
    }

    /// Replace the document (a recipe opened or made new): the history starts afresh and the
    /// figures are those of the new recipe (nothing of the old one is shown as "last good").
    pub fn set_document(&mut self, recipe: Recipe) {
        self.files.mark_opened(None, &recipe);
        self.evaluation = Evaluation::new(&recipe);
        self.recipe = recipe;
        self.history = History::default();
        self.bench_log.reset();
    }

    /// Use `theme` from now on.
    pub fn set_theme(&mut self, theme: Theme) {
        self.preferences.theme = theme;
    }

    /// Capture the window to a PNG once it has settled, then close it.
    pub(crate) fn capture_on_start(&mut self, job: ScreenshotJob) {
        self.screenshot = Some(job);
    }

    /// The recipe being edited.
    pub fn recipe(&self) -> &Recipe {
        &self.recipe
    }

    /// The recipe, for changes from outside the window (file loading, benchmarks). Changes are
    /// picked up on the next frame and become an undo step like any other.
    pub fn recipe_mut(&mut self) -> &mut Recipe {
        &mut self.recipe
    }

    /// The analysis of the recipe as last shown, or `None` if the input was refused.
    pub fn analysis(&self) -> Option<&Analysis> {
        self.evaluation.current().ok().map(|f| &f.analysis)
    }

    /// Every figure of the recipe on screen (calibrated once there are bench readings), if it
    /// is valid.
    pub fn figures(&self) -> Option<&crate::recipe::Figures> {
        self.evaluation.current().ok()
    }

    /// The same window asking for file paths through `asker` (tests answer instead of a
    /// system dialog).
    pub fn with_path_asker(mut self, asker: Box<dyn crate::ui::files::PathAsker>) -> Self {
        let placeholder = FileDesk::new(FileDeskMemory::default(), &self.recipe);
        self.files = std::mem::replace(&mut self.files, placeholder).with_asker(asker);
        self
    }

    /// The window title as shown: the recipe's name, marked while there are unsaved changes.
    pub fn title(&self) -> String {
        self.files.title(&self.recipe)
    }

    /// The view preferences.
    pub fn preferences(&self) -> Preferences {
        self.preferences
    }

    /// Draw one frame of the whole window into `ui` (the root ui of the viewport).
    pub fn show(&mut self, ui: &mut egui::Ui) {
        let ctx = ui.ctx().clone();
        if self.applied_theme != Some(self.preferences.theme) {
            self.preferences.theme.apply(&ctx);
            self.applied_theme = Some(self.preferences.theme);
        }
        let title = self.files.title(&self.recipe);
        if self.shown_title != title {
            ctx.send_viewport_cmd(egui::ViewportCommand::Title(title.clone()));
            self.shown_title = title;
        }
        self.evaluation.refresh(&self.recipe);

        let mut commands = Vec::new();
        let mut file_actions = Vec::new();
        file_actions.extend(self.panels(ui, &mut commands));
        file_actions.extend(self.files.shortcuts(&ctx, &self.recipe));
        file_actions.extend(self.files.windows_ui(&ctx, &self.recipe));

        // Shortcuts after the widgets, so a text field being edited keeps its own Ctrl+Z.
        ui.input_mut(|input| {
            if input.consume_shortcut(&REDO) {
                commands.push(Command::Redo);
            } else if input.consume_shortcut(&UNDO) {
                commands.push(Command::Undo);
            }
        });
        for command in commands {
            self.apply(command);
        }
        for action in file_actions {
            match action {
                // The desk has already marked the new document as opened or saved.
                FileAction::Replace(recipe) => self.replace_document(recipe),
                FileAction::Quit => ctx.send_viewport_cmd(egui::ViewportCommand::Close),
            }
        }
        cautions::window(&ctx, &mut self.cautions_open);

        let time = ctx.input(|i| i.time);
        self.history.feed(time, &self.recipe);
        if self.history.is_in_flux() {
            ctx.request_repaint_after_secs(UNDO_SETTLE_SECONDS);
        }
        // A change made this frame is computed now and shown on the next.
        if self.evaluation.refresh(&self.recipe) {
            ctx.request_repaint();
        }
    }

    /// Replace the document with one the file desk opened or made (it keeps its own record of
    /// the file): the history starts afresh.
    fn replace_document(&mut self, recipe: Recipe) {
        self.evaluation = Evaluation::new(&recipe);
        self.recipe = recipe;
        self.history = History::default();
        self.bench_log.reset();
    }

    fn panels(&mut self, ui: &mut egui::Ui, commands: &mut Vec<Command>) -> Option<FileAction> {
        let Self {
            recipe,
            preferences,
            evaluation,
            history,
            tank_panel,
            target_panel,
            bench_log,
            files,
            ..
        } = self;
        let mut file_action = None;
        let unit = preferences.unit;
        let bar = BarState {
            recipe_name: &recipe.name,
            can_undo: history.can_undo(recipe),
            can_redo: history.can_redo(recipe),
            unit,
            theme: preferences.theme,
        };
        egui::Panel::top("top_bar").show(ui, |ui| {
            top_bar::show(ui, &bar, commands, |ui| {
                ui.menu_button("Recipe", |ui| {
                    file_action = files.menu_ui(ui, recipe);
                });
            });
        });
        if files.notice.is_some() {
            egui::Panel::bottom("file_notice").show(ui, |ui| files.notice_ui(ui));
        }
        egui::Panel::bottom("caution_strip").show(ui, |ui| {
            ui.add_space(2.0);
            if cautions::strip(ui) {
                commands.push(Command::OpenCautions);
            }
            ui.add_space(2.0);
        });
        // Side panels take a share of the window so the centre keeps room on small screens.
        let width = ui.available_width();
        let left_max = (width * LEFT_SHARE).max(LEFT_MIN);
        let right_max = (width * RIGHT_SHARE).max(RIGHT_MIN);
        egui::Panel::left("winding_and_tank")
            .resizable(true)
            .default_size(LEFT_DEFAULT.min(left_max))
            .size_range(LEFT_MIN..=left_max)
            .show(ui, |ui| {
                egui::ScrollArea::both().show(ui, |ui| {
                    // Label column, slider, number field: the slider takes what is left.
                    ui.spacing_mut().slider_width =
                        (ui.available_width() - LABEL_WIDTH - 92.0).clamp(80.0, 150.0);
                    let coil = evaluation.latest().map(|f| f.coil);
                    let refused = evaluation.current().err().map(|e| e.field);
                    recipe_header(ui, recipe);
                    ui.add_space(6.0);
                    winding::show(ui, &mut recipe.winding, coil.as_ref(), unit, refused);
                    ui.add_space(8.0);
                    tank_panel.show(ui, &mut recipe.tank, &mut recipe.conditions, refused);
                });
            });
        egui::Panel::right("readouts_and_target")
            .resizable(true)
            .default_size(RIGHT_DEFAULT.min(right_max))
            .size_range(RIGHT_MIN..=right_max)
            .show(ui, |ui| {
                egui::ScrollArea::both().show(ui, |ui| {
                    readouts::show(ui, evaluation, unit);
                    ui.add_space(8.0);
                    target_panel.show(ui, &mut recipe.target, evaluation, unit, commands);
                    ui.add_space(8.0);
                    egui::CollapsingHeader::new("Bench log")
                        .default_open(true)
                        .show(ui, |ui| {
                            let figures = evaluation.current().ok();
                            match bench_log.ui(ui, recipe, figures, unit) {
                                Some(BenchLogAction::Record(entry)) => recipe.bench_log.push(entry),
                                Some(BenchLogAction::Replace(i, entry)) => {
                                    if let Some(slot) = recipe.bench_log.get_mut(i) {
                                        *slot = entry;
                                    }
                                }
                                Some(BenchLogAction::Remove(i)) if i < recipe.bench_log.len() => {
                                    recipe.bench_log.remove(i);
                                }
                                Some(BenchLogAction::SetLength(length)) => {
                                    commands.push(Command::SetLength(length));
                                }
                                Some(BenchLogAction::SetTrimmer(setting)) => {
                                    commands.push(Command::SetTrimmer(setting));
                                }
                                Some(BenchLogAction::SetTurns(turns, length)) => {
                                    commands.push(Command::SetTurns(turns, length));
                                }
                                _ => {}
                            }
                        });
                });
            });
        egui::CentralPanel::default().show(ui, |ui| {
            bench::show(
                ui,
                evaluation,
                &recipe.bench_log,
                recipe.winding.spacing,
                unit,
                commands,
            );
        });
        file_action
    }

    fn apply(&mut self, command: Command) {
        match command {
            Command::Undo => {
                self.history.undo(&mut self.recipe);
            }
            Command::Redo => {
                self.history.redo(&mut self.recipe);
            }
            Command::SetLength(length) => {
                if let Some(coil) = self.evaluation.latest().map(|f| f.coil) {
                    winding::set_length(&mut self.recipe.winding, &coil, length);
                }
            }
            Command::SetTurns(turns, length) => {
                if let Some(coil) = self.evaluation.latest().map(|f| f.coil)
                    && let Ok(rewound) = coil.with_turns(turns, length)
                {
                    self.recipe.winding.turns = turns;
                    winding::set_length(&mut self.recipe.winding, &rewound, length);
                }
            }
            Command::SetTrimmer(setting) => {
                if setting.is_finite() {
                    self.recipe.tank.trimmer_setting = setting.clamp(0.0, 1.0);
                }
            }
            Command::OpenCautions => self.cautions_open = true,
            Command::ToggleTheme => self.preferences.theme = self.preferences.theme.toggled(),
            Command::SetUnit(unit) => self.preferences.unit = unit,
        }
    }
}

impl eframe::App for App {
    fn ui(&mut self, ui: &mut egui::Ui, _frame: &mut eframe::Frame) {
        self.show(ui);
        if let Some(job) = &mut self.screenshot {
            job.step(ui.ctx());
        }
    }

    fn save(&mut self, storage: &mut dyn eframe::Storage) {
        eframe::set_value(storage, PREFERENCES_KEY, &self.preferences);
        eframe::set_value(storage, FILES_KEY, &self.files.memory);
        let saved = self.files.saved_snapshot();
        let copy = WorkingCopy::of(&self.recipe, saved, self.files.path().map(Into::into));
        eframe::set_value(storage, WORKING_COPY_KEY, &copy);
    }

    /// Save the working copy every few seconds: a crash loses at most that much.
    fn auto_save_interval(&self) -> std::time::Duration {
        std::time::Duration::from_secs(5)
    }
}

/// The recipe's name and notes, at the top of the left panel.
fn recipe_header(ui: &mut egui::Ui, recipe: &mut Recipe) {
    ui.horizontal(|ui| {
        ui.label("Recipe name");
        ui.add(egui::TextEdit::singleline(&mut recipe.name).desired_width(f32::INFINITY))
            .on_hover_text("Recipe name");
    });
    egui::CollapsingHeader::new("Notes")
        .default_open(false)
        .show(ui, |ui| {
            ui.add(
                egui::TextEdit::multiline(&mut recipe.notes)
                    .desired_rows(3)
                    .desired_width(f32::INFINITY),
            )
            .on_hover_text("Notes");
        });
}

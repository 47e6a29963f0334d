//! The application: the recipe being edited, what is shown of it, and the frame loop.
//!
//! Split by what changes together: the layout of the panels (`layout.rs`), carrying out what
//! the user asked for (`commands.rs`), the document (`document.rs`), the figures on screen
//! (`figures.rs`) and keeping the work on disk (`keeping.rs`).

mod commands;
mod document;
mod figures;
mod keeping;
mod layout;

pub use layout::MODULATION_CHARTS;

use crate::model::Analysis;
use crate::recipe::{FieldInput, Recipe, Unled};
use crate::ui::bench_log::BenchLogPanel;
use crate::ui::cautions;
use crate::ui::charts::modulation::ModulationSweeps;
use crate::ui::evaluation::Evaluation;
use crate::ui::files::{FileAction, FileDesk, FileDeskMemory, Notice};
use crate::ui::panels::Command;
use crate::ui::panels::tank::TankPanel;
use crate::ui::panels::target::TargetPanel;
use crate::ui::preferences::Preferences;
use crate::ui::screenshot::ScreenshotJob;
use crate::ui::theme::Theme;
use crate::ui::undo::History;
use crate::ui::working_copy::{self, Keeper, Recovery};
use eframe::egui::{self, Key, KeyboardShortcut, Modifiers};

/// Seconds a change must rest before it becomes an undo step (the undoer's default), plus a
/// little, so a frame runs then.
const UNDO_SETTLE_SECONDS: f32 = 1.05;

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
    stray_panel: crate::ui::panels::stray::StrayPanel,
    audio_panel: crate::ui::panels::audio::AudioPanel,
    stage_panel: crate::ui::panels::stage::StagePanel,
    target_panel: TargetPanel,
    bench_log: BenchLogPanel,
    files: FileDesk,
    cautions_open: bool,
    applied_theme: Option<Theme>,
    shown_title: String,
    screenshot: Option<ScreenshotJob>,
    /// Keeps the working copy and the session on disk (absent in tests and captures).
    keeper: Option<Keeper>,
    /// A recovered working copy that differs from the file asked for, until the user chooses.
    recovery: Option<Recovery>,
    /// Test-only helpers given on the command line.
    driver: Option<crate::ui::replay::Driver>,
    /// The field solution, computed off the frame.
    field: crate::ui::field_worker::FieldWorker,
    /// The charts' field shape, computed off the frame once the field solution leads.
    shape: crate::ui::field_worker::ShapeWorker,
    /// The "before calibration" curve's field shape, computed off the frame while the figures
    /// are calibrated.
    uncalibrated_shape: crate::ui::field_worker::ShapeWorker,
    /// The figures landed on the field solution, computed off the frame when its answer
    /// arrives.
    figures_worker: crate::ui::field_worker::FiguresWorker,
    /// The teaching bench (shows a derived copy of the recipe; never changes it).
    teaching: crate::ui::teaching::Teaching,
    /// Design from the parts on hand (issue 23).
    parts_panel: crate::ui::panels::parts_on_hand::PartsOnHandPanel,
}

impl App {
    /// The window as eframe creates it, on the demo recipe with default preferences and
    /// nothing kept on disk (see [`App::restore`] for the window a user starts).
    pub fn new(_cc: &eframe::CreationContext<'_>) -> Self {
        Self::with_recipe(Recipe::demo())
    }

    /// The window a user starts: the working copy, preferences and recent files of the last
    /// session from `folder` (see [`working_copy`]), kept there from now on; then `open`, the
    /// file asked for on the command line, if any. A file that cannot be read leaves the
    /// working copy on screen and says why; one that breaks a rule opens as written, with the
    /// rule shown; one that differs from a recovered working copy with unsaved changes waits
    /// for the user to choose between them.
    pub fn restore(folder: std::path::PathBuf, open: Option<&std::path::Path>) -> Self {
        let restored = working_copy::restore(&folder);
        let mut app = Self::with_recipe(Recipe::demo());
        app.preferences = restored.session.preferences;
        app.parts_panel.text = restored.session.parts_on_hand.clone();
        app.files.memory = restored.session.files.clone();
        let mut notices = restored.problems.clone();
        let unsaved = restored.has_unsaved_changes();
        if let Some(copy) = &restored.copy {
            let saved = restored.saved.as_ref().unwrap_or(&copy.recipe);
            app.set_document(copy.recipe.clone());
            // Measured against the recipe as last saved, so unsaved changes stay marked.
            app.files
                .mark_opened(restored.session.origin.as_deref(), saved);
            if let Some(e) = &copy.refusal {
                notices.push(working_copy::refusal_notice(e));
            }
        }
        if let Some(path) = open {
            match crate::recipe::open(path) {
                Err(e) => notices.push(format!("could not open {}: {e}", path.display())),
                Ok(opened)
                    if unsaved
                        && restored
                            .copy
                            .as_ref()
                            .is_some_and(|c| c.recipe != opened.recipe) =>
                {
                    app.recovery = Some(Recovery {
                        path: path.to_path_buf(),
                        opened,
                    });
                }
                Ok(opened) => {
                    if let Some(e) = &opened.refusal {
                        notices.push(working_copy::refusal_notice(e));
                    }
                    app = app.with_file(opened.recipe, path);
                }
            }
        }
        if !notices.is_empty() {
            app.files.notice = Some(Notice {
                text: notices.join("; "),
                is_error: true,
            });
        }
        app.keeper = Some(Keeper::start(folder, &restored));
        app
    }

    /// A window editing `recipe`, with default view preferences.
    pub fn with_recipe(recipe: Recipe) -> Self {
        let files = FileDesk::new(FileDeskMemory::default(), &recipe);
        Self {
            evaluation: Evaluation::new(&recipe, FieldInput::Unsolved(Unled::Pending)),
            field: Default::default(),
            shape: Default::default(),
            uncalibrated_shape: Default::default(),
            figures_worker: Default::default(),
            recipe,
            preferences: Preferences::default(),
            history: History::default(),
            tank_panel: TankPanel::default(),
            stray_panel: Default::default(),
            audio_panel: Default::default(),
            stage_panel: Default::default(),
            target_panel: TargetPanel::default(),
            bench_log: BenchLogPanel::default(),
            files,
            cautions_open: false,
            applied_theme: None,
            shown_title: String::new(),
            screenshot: None,
            keeper: None,
            recovery: None,
            driver: None,
            teaching: Default::default(),
            parts_panel: Default::default(),
        }
    }

    /// The same window editing `recipe`, opened from the file at `path` (a fresh history;
    /// Save writes back to that file).
    pub fn with_file(mut self, recipe: Recipe, path: &std::path::Path) -> Self {
        self.set_document(recipe);
        self.files.mark_opened(Some(path), &self.recipe);
        self
    }

    /// Use `theme` from now on.
    pub fn set_theme(&mut self, theme: Theme) {
        self.preferences.theme = theme;
    }

    /// Run the test-only command-line helpers (`--replay-edit`, `--print-shown`).
    pub(crate) fn test_driver(&mut self, driver: crate::ui::replay::Driver) {
        self.driver = Some(driver);
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

    /// Where the build can be expected to land (the stray estimate, the spread and the band on
    /// the spacing chart), for the figures on screen.
    pub fn expectation(&self) -> Option<&crate::recipe::Expectation> {
        self.evaluation.expectation()
    }

    /// The modulation charts' data as last drawn (empty until "Audio and drift" is opened).
    pub fn modulation_sweeps(&self) -> &ModulationSweeps {
        self.evaluation.modulation_sweeps_shown()
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

    /// The same window with the field solution switched on or off (the View menu's entry;
    /// tests that compare the screen with the classical model switch it off).
    pub fn with_field_solution(mut self, on: bool) -> Self {
        self.preferences.field_solution = on;
        self
    }

    /// The view preferences.
    pub fn preferences(&self) -> Preferences {
        self.preferences
    }

    /// The teaching bench.
    pub fn teaching(&self) -> &crate::ui::teaching::Teaching {
        &self.teaching
    }

    /// The teaching bench, to switch it or pin a reference from outside the window (tests).
    pub fn teaching_mut(&mut self) -> &mut crate::ui::teaching::Teaching {
        &mut self.teaching
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
        self.refresh_figures(&ctx);
        self.teaching.update(&ctx, &self.recipe, &self.evaluation);
        if self.teaching.presentation() {
            crate::ui::teaching::presentation::enlarge(ui.style_mut());
        }

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
                FileAction::Replace(recipe) => self.start_document(recipe),
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
        if self.refresh_figures(&ctx) {
            ctx.request_repaint();
        }
        self.teaching.settle(&ctx, &self.recipe, &self.evaluation);
        self.recovery_ui(&ctx);
        self.keep();
    }
}

impl eframe::App for App {
    fn ui(&mut self, ui: &mut egui::Ui, _frame: &mut eframe::Frame) {
        self.show(ui);
        if let Some(job) = &mut self.screenshot {
            job.step(ui.ctx());
        }
        if let Some(driver) = &mut self.driver {
            let title = self.files.title(&self.recipe);
            let notice = self.files.notice.as_ref().map(|n| n.text.clone());
            if driver.step(ui.ctx(), &mut self.recipe, &title, notice.as_deref()) {
                self.files.confirm_close();
            }
        }
    }

    /// Nothing that matters is kept in eframe's storage (it rewrites its file in place): the
    /// working copy, preferences and recent files are kept by [`Keeper`].
    fn save(&mut self, _storage: &mut dyn eframe::Storage) {
        self.flush_working_copy();
    }

    fn on_exit(&mut self, _gl: Option<&eframe::glow::Context>) {
        self.flush_working_copy();
    }
}

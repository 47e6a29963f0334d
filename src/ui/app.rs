//! The application: the recipe being edited, what is shown of it, and the frame loop.

use crate::model::Analysis;
use crate::recipe::FieldInput;
use crate::recipe::Recipe;
use crate::ui::bench_log::{BenchLogAction, BenchLogPanel};
use crate::ui::cautions;
use crate::ui::charts::modulation::{ModulationSweeps, modulation_charts};
use crate::ui::evaluation::{Evaluation, FIELD_PENDING, FieldState};
use crate::ui::field_worker::FieldRequest;
use crate::ui::files::{FileAction, FileDesk, FileDeskMemory, Notice};
use crate::ui::panels::tank::TankPanel;
use crate::ui::panels::target::TargetPanel;
use crate::ui::panels::top_bar::{self, BarState};
use crate::ui::panels::{Command, bench, readouts, verdict, winding};
use crate::ui::preferences::Preferences;
use crate::ui::screenshot::ScreenshotJob;
use crate::ui::theme::Theme;
use crate::ui::undo::History;
use crate::ui::widgets::LABEL_WIDTH;
use crate::ui::working_copy::{
    self, Keeper, Recovery, RecoveryChoice, SessionStateRef, WORKING_COPY_FAILED,
};
use eframe::egui::{self, Key, KeyboardShortcut, Modifiers};

/// The collapsible section (inside "Audio and drift") holding the modulation charts.
pub const MODULATION_CHARTS: &str = "Modulation charts";

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
/// The teaching bench's share of the width in the presentation layout (no left panel there;
/// the spacing chart keeps more than half the window).
const PRESENTATION_SHARE: f32 = 0.42;

/// Window height from which the readouts start open, points: below it they start folded so
/// that the verdict, the target and the bench log all show without scrolling (1280×720).
const READOUTS_OPEN_HEIGHT: f32 = 860.0;

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
            evaluation: Evaluation::new(&recipe, FieldInput::Unsolved(FIELD_PENDING.to_owned())),
            field: Default::default(),
            shape: Default::default(),
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

    /// Replace the document (a recipe opened or made new): the history starts afresh and the
    /// figures are those of the new recipe (nothing of the old one is shown as "last good").
    pub fn set_document(&mut self, recipe: Recipe) {
        self.files.mark_opened(None, &recipe);
        self.evaluation = Evaluation::new(&recipe, FieldInput::Unsolved(FIELD_PENDING.to_owned()));
        self.recipe = recipe;
        self.history = History::default();
        self.bench_log.reset();
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
        self.teaching
            .set_field_solution(self.preferences.field_solution);
        self.files.footing = crate::recipe::Footing::of_setting(self.preferences.field_solution);
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
        if self.refresh_figures(&ctx) {
            ctx.request_repaint();
        }
        self.teaching.settle(&ctx, &self.recipe, &self.evaluation);
        self.recovery_ui(&ctx);
        self.keep();
    }

    /// Hand the present coil to the field worker (a no-op when it has not changed; nothing
    /// while the field solution is switched off or the recipe is refused), take its answer if
    /// one has come, and bring the figures up to the recipe and the answer; true if they
    /// changed.
    fn refresh_figures(&mut self, ctx: &egui::Context) -> bool {
        // The junction counted in the tank (the audio panel's switch) is in every figure,
        // put there by the same function as `evaluate --junction-…`; never in the recipe.
        let with_junction = self.audio_panel.junction_in_tank().map(|(m, bias)| Recipe {
            tank: crate::tuning::modulation::tank_with_junction(&self.recipe.tank, &m, bias),
            ..self.recipe.clone()
        });
        let recipe = with_junction.as_ref().unwrap_or(&self.recipe);
        let on = self.preferences.field_solution;
        let request = on.then(|| field_request(recipe)).flatten();
        self.field.ask(request, ctx);
        self.field.poll();
        let state = match (on, self.field.ready()) {
            (false, _) => FieldState::Off,
            (true, Some(answer)) => FieldState::Ready(&answer.tank),
            (true, None) => FieldState::Pending,
        };
        let input = self.evaluation.field_input(state);
        let changed = self.evaluation.refresh(recipe, input);
        // Then the charts' field shape for the figures now shown.
        self.shape.ask(self.evaluation.shape_request(), ctx);
        self.shape.poll();
        self.evaluation.set_shape(self.shape.ready()) || changed
    }

    /// Whether the charts draw the field shape (for tests and captures).
    pub fn charts_field_shaped(&self) -> bool {
        self.evaluation.field_shaped()
    }

    /// The charts' sweeps as drawn (for tests and captures): the present figures' curves.
    pub fn chart_sweeps(&self) -> &crate::ui::charts::ChartCache {
        self.evaluation.sweeps()
    }

    /// The field solution of the present coil, once the worker has it.
    pub fn field_solution(&self) -> Option<&crate::ui::field_worker::FieldResult> {
        self.field.ready()
    }

    /// Ask about a recovered working copy that differs from the file asked for.
    fn recovery_ui(&mut self, ctx: &egui::Context) {
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
    fn keep(&mut self) {
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

    /// Replace the document with one the file desk opened or made (it keeps its own record of
    /// the file): the history starts afresh.
    fn replace_document(&mut self, recipe: Recipe) {
        self.evaluation = Evaluation::new(&recipe, FieldInput::Unsolved(FIELD_PENDING.to_owned()));
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
            stray_panel,
            audio_panel,
            stage_panel,
            target_panel,
            bench_log,
            files,
            field,
            teaching,
            parts_panel,
            ..
        } = self;
        let mut file_action = None;
        let unit = preferences.unit;
        let bar = BarState {
            recipe_name: &recipe.name,
            unsaved: files.is_dirty(recipe),
            can_undo: history.can_undo(recipe),
            can_redo: history.can_redo(recipe),
            unit,
            theme: preferences.theme,
            field_solution: preferences.field_solution,
        };
        egui::Panel::top("top_bar").show(ui, |ui| {
            top_bar::show(
                ui,
                &bar,
                commands,
                |ui| {
                    ui.menu_button("Recipe", |ui| {
                        file_action = files.menu_ui(ui, recipe);
                    });
                    ui.menu_button("Export", |ui| files.export_menu_ui(ui, recipe));
                },
                |ui| teaching.view_menu(ui),
            );
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
        // The presentation layout leaves the controls out; the teaching bench takes the right.
        let mut left_open = !teaching.presentation();
        let mut right_open = !teaching.is_on();
        egui::Panel::left("winding_and_tank")
            .resizable(true)
            .drag_to_open(false)
            .default_size(LEFT_DEFAULT.min(left_max))
            .size_range(LEFT_MIN..=left_max)
            .show_collapsible(ui, &mut left_open, |ui| {
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
                    ui.add_space(8.0);
                    egui::CollapsingHeader::new("Where the stray comes from")
                        .default_open(false)
                        .show(ui, |ui| {
                            if let Some(stray) = stray_panel.show(
                                ui,
                                &mut recipe.stray_estimate,
                                evaluation.expectation(),
                                recipe.tank.stray,
                            ) {
                                recipe.tank.stray = stray;
                            }
                        });
                    // Design from the parts on hand (issue 23).
                    egui::CollapsingHeader::new("Design from the parts on hand")
                        .default_open(false)
                        .show(ui, |ui| parts_panel.show(ui, recipe));
                    egui::CollapsingHeader::new("Audio and drift")
                        .default_open(false)
                        .show(ui, |ui| {
                            // Before the first figures: the recipe's own tolerance (its
                            // plan's service practice unless typed), never a second copy.
                            let tolerance = evaluation
                                .latest()
                                .map_or(recipe.target.tolerance(), |f| f.target.tolerance);
                            // The tank as the figures drive it (on the field solution,
                            // calibrated once there are readings), as `evaluate` does.
                            let (tank, conditions) = evaluation
                                .latest()
                                .map_or((recipe.tank, recipe.conditions), |f| {
                                    (f.tank, f.conditions)
                                });
                            // Without the junction the panel counts in it (if any): the
                            // modulation adds it back at each bias.
                            let tank = audio_panel.without_junction(&tank);
                            audio_panel.show(ui, coil.as_ref(), &tank, &conditions, tolerance);
                            egui::CollapsingHeader::new(MODULATION_CHARTS)
                                .default_open(true)
                                .show(ui, |ui| {
                                    let inputs = audio_panel.inputs();
                                    if let Some(sweeps) =
                                        evaluation.modulation_sweeps(&tank, &conditions, &inputs)
                                    {
                                        modulation_charts(ui, sweeps);
                                    }
                                });
                        });
                    egui::CollapsingHeader::new(crate::ui::panels::stage::SECTION)
                        .default_open(false)
                        .show(ui, |ui| {
                            // The tank as the figures drive it, as `tankwright stage` takes it.
                            let (tank, conditions) = evaluation
                                .latest()
                                .map_or((recipe.tank, recipe.conditions), |f| {
                                    (f.tank, f.conditions)
                                });
                            stage_panel.show(ui, coil.as_ref(), &tank, &conditions);
                        });
                });
            });
        let mut teaching_open = teaching.is_on();
        // In the presentation layout the type is larger and the left panel is gone: the bench
        // gets a wider panel of its own (its own id, so each layout keeps its own width).
        let (teaching_id, teaching_default, teaching_max) = if teaching.presentation() {
            let max = (width * PRESENTATION_SHARE).max(RIGHT_MIN);
            ("teaching_bench_presentation", max, max)
        } else {
            (
                "teaching_bench",
                RIGHT_DEFAULT.min(right_max),
                right_max.max(RIGHT_DEFAULT),
            )
        };
        egui::Panel::right(teaching_id)
            .resizable(true)
            .drag_to_open(false)
            .default_size(teaching_default)
            .size_range(RIGHT_MIN..=teaching_max)
            .show_collapsible(ui, &mut teaching_open, |ui| {
                // Both ways (see the readouts column below): never wider than the panel.
                egui::ScrollArea::both().show(ui, |ui| {
                    let keep = teaching.panel(ui, recipe, evaluation, unit, files);
                    if let Some(length) = keep {
                        commands.push(Command::SetLength(length));
                    }
                });
            });
        egui::Panel::right("readouts_and_target")
            .resizable(true)
            .drag_to_open(false)
            .default_size(RIGHT_DEFAULT.min(right_max))
            .size_range(RIGHT_MIN..=right_max)
            .show_collapsible(ui, &mut right_open, |ui| {
                // Lines wrap at the column's width, and what cannot wrap (a table) scrolls
                // inside its own area. The column itself scrolls both ways as the last guard:
                // content wider than a right-hand panel makes egui keep the content's right
                // edge, so the panel's visible part shrinks to a sliver at the window's edge
                // and the centre paints over the rest (issue 21). A scroll area that may
                // scroll sideways is never wider than the room it is given.
                egui::ScrollArea::both().show(ui, |ui| {
                    verdict::show(ui, evaluation, unit);
                    ui.add_space(8.0);
                    let tall = ui.ctx().content_rect().height() >= READOUTS_OPEN_HEIGHT;
                    readouts::show(ui, evaluation, unit, tall);
                    ui.add_space(8.0);
                    egui::CollapsingHeader::new("Impedance of the coil")
                        .default_open(false)
                        .show(ui, |ui| {
                            crate::ui::charts::impedance::impedance_section(
                                ui,
                                evaluation.current().ok(),
                                field,
                            );
                        });
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
            let mut overlays = Vec::new();
            let (shown, extras) = teaching.centre(evaluation, &mut overlays);
            bench::show(
                ui,
                shown,
                &recipe.bench_log,
                recipe.winding.spacing,
                unit,
                &extras,
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
                if let Some(coil) = self.evaluation.latest().map(|f| f.coil)
                    && !self.teaching.take_length(length, &coil)
                {
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
            Command::SetFieldSolution(on) => self.preferences.field_solution = on,
        }
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

/// The recipe's name and notes, at the top of the left panel.
fn recipe_header(ui: &mut egui::Ui, recipe: &mut Recipe) {
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

/// What the field worker is asked to solve for `recipe` (`None` when its coil or tank is
/// refused): the coil, everything across it but its own capacitance, and the temperature (the
/// only condition the field solution uses, so choosing another driving model asks for
/// nothing new; the field solution knows nothing of the bench readings either).
fn field_request(recipe: &Recipe) -> Option<FieldRequest> {
    let coil = crate::model::Coil::from_winding(&recipe.winding).ok()?;
    recipe.tank.validate().ok()?;
    Some(FieldRequest {
        coil,
        external_capacitance: recipe.tank.external_capacitance(),
        conditions: crate::tuning::field_tank::field_conditions(&recipe.conditions),
    })
}

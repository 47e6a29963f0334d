//! The window's layout: the top bar, the notices, the three columns and the centre, each
//! drawn by its own method; what the user asks for is queued as [`Command`]s and carried out
//! at the end of the frame (`commands.rs`).

use super::App;
use super::document::recipe_header;
use crate::ui::charts::modulation::modulation_charts;
use crate::ui::files::FileAction;
use crate::ui::panels::top_bar::{self, BarState};
use crate::ui::panels::{Command, bench, readouts, verdict, winding};
use crate::ui::widgets::LABEL_WIDTH;
use crate::ui::{cautions, panels};
use eframe::egui;

/// The collapsible section (inside "Audio and drift") holding the modulation charts.
pub const MODULATION_CHARTS: &str = "Modulation charts";

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

impl App {
    /// Every panel of one frame; a file action the menus asked for, if any.
    pub(super) fn panels(
        &mut self,
        ui: &mut egui::Ui,
        commands: &mut Vec<Command>,
    ) -> Option<FileAction> {
        let file_action = self.top_bar(ui, commands);
        if self.files.notice.is_some() {
            egui::Panel::bottom("file_notice").show(ui, |ui| self.files.notice_ui(ui));
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
        let mut left_open = !self.teaching.presentation();
        let mut right_open = !self.teaching.is_on();
        egui::Panel::left("winding_and_tank")
            .resizable(true)
            .drag_to_open(false)
            .default_size(LEFT_DEFAULT.min(left_max))
            .size_range(LEFT_MIN..=left_max)
            .show_collapsible(ui, &mut left_open, |ui| {
                egui::ScrollArea::both().show(ui, |ui| self.left_column(ui));
            });
        let mut teaching_open = self.teaching.is_on();
        // In the presentation layout the type is larger and the left panel is gone: the bench
        // gets a wider panel of its own (its own id, so each layout keeps its own width).
        let (teaching_id, teaching_default, teaching_max) = if self.teaching.presentation() {
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
                    let unit = self.preferences.unit;
                    let keep = self.teaching.panel(
                        ui,
                        &self.recipe,
                        &self.evaluation,
                        unit,
                        &mut self.files,
                    );
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
                egui::ScrollArea::both().show(ui, |ui| self.right_column(ui, commands));
            });
        egui::CentralPanel::default().show(ui, |ui| self.centre(ui, commands));
        file_action
    }

    /// The top bar: the menus, undo and redo, the unit, the theme and the field solution.
    fn top_bar(&mut self, ui: &mut egui::Ui, commands: &mut Vec<Command>) -> Option<FileAction> {
        let updating = self.updating();
        let Self {
            recipe,
            preferences,
            history,
            files,
            teaching,
            ..
        } = self;
        let mut file_action = None;
        let footing = preferences.footing();
        let bar = BarState {
            recipe_name: &recipe.name,
            unsaved: files.is_dirty(recipe),
            can_undo: history.can_undo(recipe),
            can_redo: history.can_redo(recipe),
            unit: preferences.unit,
            theme: preferences.theme,
            field_solution: preferences.field_solution,
            updating,
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
                    ui.menu_button("Export", |ui| files.export_menu_ui(ui, recipe, footing));
                },
                |ui| teaching.view_menu(ui),
            );
        });
        file_action
    }

    /// The left column: the recipe's name, the winding, the tank, and the folded sections
    /// (stray, design from parts, audio and drift, the oscillator stage).
    fn left_column(&mut self, ui: &mut egui::Ui) {
        let Self {
            recipe,
            preferences,
            evaluation,
            tank_panel,
            stray_panel,
            audio_panel,
            stage_panel,
            parts_panel,
            ..
        } = self;
        let unit = preferences.unit;
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
        // The tank as the figures drive it (on the field solution, calibrated once there are
        // readings), as `evaluate` and `tankwright stage` take it.
        let (tank, conditions) = evaluation
            .latest()
            .map_or((recipe.tank, recipe.conditions), |f| (f.tank, f.conditions));
        egui::CollapsingHeader::new("Audio and drift")
            .default_open(false)
            .show(ui, |ui| {
                // Before the first figures: the recipe's own tolerance (its plan's service
                // practice unless typed), never a second copy.
                let tolerance = evaluation
                    .latest()
                    .map_or(recipe.target.tolerance(), |f| f.target.tolerance);
                // Without the junction the panel counts in it (if any): the modulation adds
                // it back at each bias.
                let rest = recipe.audio.rest_of_tank(&tank);
                let figures = evaluation.audio(&rest, &conditions, &recipe.audio, tolerance);
                let audio_max = figures.map_or(15e3, |f| f.audio_max);
                if audio_panel.show(ui, &mut recipe.audio, figures, tolerance)
                    && let Some(coil) = coil.as_ref()
                {
                    // The stage's own junction, from the stage as the recipe keeps it (the
                    // demo stage until one is set), round the tank without the audio's
                    // junction.
                    let bare = recipe.audio.without_junction(&tank);
                    let taken = recipe
                        .stage
                        .clone()
                        .unwrap_or_default()
                        .inputs()
                        .and_then(|i| crate::tuning::stage::analyse(coil, &bare, &conditions, &i))
                        .map_err(|e| e.to_string())
                        .and_then(|f| recipe.audio.use_stage_junction(&f.junction, &tank));
                    audio_panel.stage_junction_taken(taken);
                }
                egui::CollapsingHeader::new(MODULATION_CHARTS)
                    .default_open(true)
                    .show(ui, |ui| {
                        let inputs = recipe.audio.inputs_with(audio_max);
                        if let Some(sweeps) =
                            evaluation.modulation_sweeps(&rest, &conditions, &inputs)
                        {
                            modulation_charts(ui, sweeps);
                        }
                    });
            });
        egui::CollapsingHeader::new(panels::stage::SECTION)
            .default_open(false)
            .show(ui, |ui| {
                stage_panel.show(ui, &mut recipe.stage, coil.as_ref(), &tank, &conditions);
            });
    }

    /// The right column: the verdict, the readouts, the coil's impedance, the target and the
    /// bench log.
    fn right_column(&mut self, ui: &mut egui::Ui, commands: &mut Vec<Command>) {
        let Self {
            recipe,
            preferences,
            evaluation,
            target_panel,
            bench_log,
            field,
            ..
        } = self;
        let unit = preferences.unit;
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
                if let Some(action) = bench_log.ui(ui, recipe, figures, unit) {
                    commands.push(action.into());
                }
            });
    }

    /// The centre: the charts and the coil drawing (of the teaching bench's copy while the
    /// bench is on).
    fn centre(&mut self, ui: &mut egui::Ui, commands: &mut Vec<Command>) {
        let mut overlays = Vec::new();
        let (shown, extras) = self.teaching.centre(&self.evaluation, &mut overlays);
        bench::show(
            ui,
            shown,
            &self.recipe.bench_log,
            self.recipe.winding.spacing,
            self.preferences.unit,
            &extras,
            commands,
        );
    }
}

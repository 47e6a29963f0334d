//! The centre of the window: the coil drawn to scale on top, the live charts below.

use super::Command;
use crate::model::SpacingSpec;
use crate::recipe::BenchEntry;
use crate::ui::charts::{self, ChartView, ReadingMark, SpacingAxis};
use crate::ui::coil_view::coil_view_with_ghost;
use crate::ui::evaluation::Evaluation;
use crate::ui::theme;
use crate::ui::units::LengthUnit;
use eframe::egui::{self, RichText};

/// Narrowest centre that still holds the two charts side by side, points.
const SIDE_BY_SIDE_WIDTH: f32 = 560.0;
/// Share of the centre's height given to the coil drawing.
const DRAWING_SHARE: f32 = 0.36;
/// The least height of a chart (legend and plot), points: below it the plot was a strip
/// (about 110 px at 1280×720, issue 21); the centre scrolls instead.
pub const MIN_CHART_HEIGHT: f32 = 280.0;

/// Said where the trimmer chart would be, for a fixed tank.
pub const FIXED_TANK_NOTE: &str = "A fixed tank: no trimmer, so no trimmer chart. The coil's \
                                   length is the only adjustment: the spacing chart shows it.";

/// What the teaching bench adds to the centre (nothing by default).
#[derive(Default)]
pub struct Extras<'a> {
    /// The coil before the last change, drawn faint behind the present one.
    pub ghost: Option<&'a crate::model::Coil>,
    /// Muted curves on the spacing chart.
    pub overlays: &'a [charts::ChartOverlay],
    /// Show the spacing chart alone, full width (the presentation layout).
    pub spacing_only: bool,
}

/// Show the drawing and charts; what the user drags is returned as commands.
pub fn show(
    ui: &mut egui::Ui,
    evaluation: &Evaluation,
    readings: &[BenchEntry],
    spacing: SpacingSpec,
    unit: LengthUnit,
    extras: &Extras<'_>,
    commands: &mut Vec<Command>,
) {
    let Some(figures) = evaluation.latest() else {
        ui.centered_and_justified(|ui| {
            ui.label("No coil to draw yet: the input is refused (see the readouts).");
        });
        return;
    };
    if evaluation.current().is_err() {
        ui.label(
            RichText::new(
                "Showing the last coil that could be built; the present input is refused.",
            )
            .color(theme::refusal(ui)),
        );
    }
    // Everything below scrolls when the centre is too short for the drawing and charts at
    // their least heights; inside, the available height is still the visible height.
    let picks = egui::ScrollArea::vertical()
        .id_salt("tankwright centre")
        .auto_shrink(false)
        .show(ui, |ui| {
            drawing_and_charts(ui, evaluation, figures, readings, spacing, unit, extras)
        })
        .inner;
    commands.extend(picks);
}

/// The coil drawing and the charts below it: each chart at least [`MIN_CHART_HEIGHT`] tall;
/// what the user drags, as commands.
fn drawing_and_charts(
    ui: &mut egui::Ui,
    evaluation: &Evaluation,
    figures: &crate::recipe::Figures,
    readings: &[BenchEntry],
    spacing: SpacingSpec,
    unit: LengthUnit,
    extras: &Extras<'_>,
) -> Vec<Command> {
    let mut commands = Vec::new();
    let width = ui.available_width();
    let drawing_height = (ui.available_height() * DRAWING_SHARE).max(160.0);
    let drawn = ui
        .allocate_ui(egui::vec2(width, drawing_height), |ui| {
            coil_view_with_ghost(ui, &figures.coil, extras.ghost, unit)
        })
        .inner;
    if let Some(length) = drawn {
        commands.push(Command::SetLength(length));
    }
    ui.separator();

    let readings: Vec<ReadingMark> = readings
        .iter()
        .map(|e| ReadingMark {
            length: e.length,
            setting: e.trimmer_setting,
            measured: e.measured,
            added: e.added_capacitance,
        })
        .collect();
    let view = ChartView {
        cache: evaluation.sweeps(),
        uncalibrated: evaluation.uncalibrated_sweeps(),
        classical: evaluation.classical_comparison(),
        readings: &readings,
        coil: &figures.coil,
        tank: &figures.tank,
        target_hz: figures.target.channel,
        channel_width_hz: figures.target.channel_width,
        resonance_hz: figures.analysis.resonance,
        axis: match spacing {
            SpacingSpec::Length(_) => SpacingAxis::Length,
            SpacingSpec::Gap(_) => SpacingAxis::Gap,
        },
        unit,
        overlays: extras.overlays,
        operating: evaluation.operating(),
    };
    let fixed = figures.tank.is_fixed();
    if fixed && !extras.spacing_only {
        // No flat trimmer chart for a tank with no trimmer: a sentence says why.
        ui.label(FIXED_TANK_NOTE);
    }
    let chart_height = ui.available_height().max(MIN_CHART_HEIGHT);
    let (spacing_pick, trimmer_pick) = if extras.spacing_only || fixed {
        let size = egui::vec2(width, chart_height);
        let pick = ui.allocate_ui(size, |ui| charts::spacing_chart(ui, &view));
        (pick.inner, None)
    } else if ui.available_width() >= SIDE_BY_SIDE_WIDTH {
        ui.columns(2, |columns| {
            let size = egui::vec2(columns[0].available_width(), chart_height);
            (
                columns[0]
                    .allocate_ui(size, |ui| charts::spacing_chart(ui, &view))
                    .inner,
                columns[1]
                    .allocate_ui(size, |ui| charts::trimmer_chart(ui, &view))
                    .inner,
            )
        })
    } else {
        // A narrow centre stacks the charts, each at least the least height (the centre
        // scrolls).
        let half = (0.5 * chart_height - ui.spacing().item_spacing.y).max(MIN_CHART_HEIGHT);
        let size = egui::vec2(width, half);
        (
            ui.allocate_ui(size, |ui| charts::spacing_chart(ui, &view))
                .inner,
            ui.allocate_ui(size, |ui| charts::trimmer_chart(ui, &view))
                .inner,
        )
    };
    if let Some(length) = spacing_pick {
        commands.push(Command::SetLength(length));
    }
    if let Some(setting) = trimmer_pick {
        commands.push(Command::SetTrimmer(setting));
    }
    commands
}

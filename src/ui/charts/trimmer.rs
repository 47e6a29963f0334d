//! Resonance against trimmer setting at the present spacing.

use super::{
    CLASSICAL_CURVE_LABEL, ChartView, aeronautical_band, held_bounds, hover, legend, palette,
    pointer_x, present_marker, reading_points, still_plot, target_channel,
};
use eframe::egui;
use egui_plot::{Line, PlotPoints};

/// Accessible name of the chart.
pub const TRIMMER_CHART_LABEL: &str = "trimmer chart";

/// Resonance against trimmer setting at the present spacing, with the target line and the present
/// setting marked. Returns a new setting (0–1) when clicked/dragged.
pub fn trimmer_chart(ui: &mut egui::Ui, view: &ChartView<'_>) -> Option<f64> {
    let visuals = ui.visuals().clone();
    let curve = view.cache.trimmer_curve();
    let (y_lo, y_hi) = view.frequency_axis(curve.iter().map(|p| p[1]));
    let hold_id = ui.make_persistent_id("tankwright trimmer chart bounds");
    let bounds = held_bounds(ui, hold_id, [-2.0, 102.0, y_lo, y_hi]);

    let plot = still_plot("tankwright trimmer chart", "trimmer setting (%)".to_owned())
        .label_formatter(|pos| Some(hover::with_marker(pos, |x| hover::trimmer_text(view, x))));
    // Readings at the present length only: at another length they lie on another curve.
    let here = view.coil.length();
    let same_length: Vec<_> = view
        .readings
        .iter()
        .copied()
        .filter(|r| (r.length - here).abs() <= 1e-6)
        .collect();
    legend::show(
        ui,
        &legend::trimmer_entries(
            view,
            &visuals,
            (bounds[2], bounds[3]),
            (
                same_length.iter().any(|r| !r.clipped()),
                same_length.iter().any(|r| r.clipped()),
            ),
        ),
    );

    // The legend is drawn above the chart (legend.rs); keep its entries in step with the items.
    let response = plot.show(ui, |plot_ui| {
        plot_ui.set_plot_bounds_x(bounds[0]..=bounds[1]);
        plot_ui.set_plot_bounds_y(bounds[2]..=bounds[3]);
        let points: PlotPoints<'_> = curve.iter().map(|p| [p[0] * 100.0, p[1] * 1e-6]).collect();
        plot_ui.line(
            Line::new("resonance", points)
                .color(palette::trimmer(&visuals, 0.5))
                .width(1.8),
        );
        if let Some(classical) = view.classical {
            let points: PlotPoints<'_> = classical
                .cache
                .trimmer_curve()
                .iter()
                .map(|p| [p[0] * 100.0, p[1] * 1e-6])
                .collect();
            plot_ui.line(
                Line::new(CLASSICAL_CURVE_LABEL, points)
                    .color(palette::CLASSICAL)
                    .style(egui_plot::LineStyle::dotted_dense())
                    .width(1.4),
            );
        }
        target_channel(plot_ui, view);
        aeronautical_band(plot_ui, (bounds[2], bounds[3]));
        super::operating_line(plot_ui, view);
        let at_length = ChartView {
            readings: &same_length,
            ..*view
        };
        reading_points(plot_ui, &at_length, |r| r.setting * 100.0);
        present_marker(
            plot_ui,
            "this setting",
            view.tank.trimmer_setting * 100.0,
            view.resonance_hz,
        );
    });

    let x = pointer_x(ui, &response, TRIMMER_CHART_LABEL, hold_id, bounds)?;
    Some((x / 100.0).clamp(0.0, 1.0))
}

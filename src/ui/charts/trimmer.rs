//! Resonance against trimmer setting at the present spacing.

use super::{ChartView, held_bounds, padded, palette, pointer_x, present_marker};
use eframe::egui;
use egui_plot::{
    Axis, ColorConflictHandling, Corner, HLine, HoverPosition, Legend, Line, Plot, PlotPoints, Span,
};

/// Accessible name of the chart.
pub const TRIMMER_CHART_LABEL: &str = "trimmer chart";

/// Resonance against trimmer setting at the present spacing, with the target line and the present
/// setting marked. Returns a new setting (0–1) when clicked/dragged.
pub fn trimmer_chart(ui: &mut egui::Ui, view: &ChartView<'_>) -> Option<f64> {
    let visuals = ui.visuals().clone();
    let curve = view.cache.trimmer_curve();
    let has_target = view.target_hz.is_finite() && view.target_hz > 0.0;
    let (band_lo, band_hi) = view.channel_mhz();

    let (mut f_lo, mut f_hi) = curve
        .iter()
        .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), p| {
            (lo.min(p[1] * 1e-6), hi.max(p[1] * 1e-6))
        });
    if has_target {
        f_lo = f_lo.min(band_lo);
        f_hi = f_hi.max(band_hi);
    }
    let (y_lo, y_hi) = padded(f_lo, f_hi);
    let hold_id = ui.make_persistent_id("tankwright trimmer chart bounds");
    let bounds = held_bounds(ui, hold_id, [-2.0, 102.0, y_lo, y_hi]);

    let plot = Plot::new("tankwright trimmer chart")
        .legend(
            Legend::default()
                .position(Corner::RightTop)
                .text_style(egui::TextStyle::Small)
                .follow_insertion_order(true)
                .color_conflict_handling(ColorConflictHandling::PickFirst),
        )
        .x_axis_label("trimmer setting (%)")
        .y_axis_label("resonance (MHz)")
        .allow_drag(false)
        .allow_zoom(false)
        .allow_scroll(false)
        .allow_boxed_zoom(false)
        .allow_double_click_reset(false)
        .allow_axis_zoom_drag(false)
        .show_crosshair(true)
        .min_size(egui::vec2(160.0, 120.0))
        .label_formatter(|pos| {
            let (name, p) = match pos {
                HoverPosition::NearDataPoint {
                    plot_name,
                    position,
                    ..
                } => (*plot_name, *position),
                HoverPosition::Elsewhere { position } => ("", *position),
            };
            let head = if name.is_empty() {
                String::new()
            } else {
                format!("{name}\n")
            };
            Some(format!("{head}{:.3} MHz\ntrimmer {:.1} %", p.y, p.x))
        });

    // Items are added in legend order (the legend sits in the upper right corner); each name's
    // first item gives its legend colour.
    let response = plot.show(ui, |plot_ui| {
        plot_ui.set_plot_bounds_x(bounds[0]..=bounds[1]);
        plot_ui.set_plot_bounds_y(bounds[2]..=bounds[3]);
        let points: PlotPoints<'_> = curve.iter().map(|p| [p[0] * 100.0, p[1] * 1e-6]).collect();
        plot_ui.line(
            Line::new("resonance", points)
                .color(palette::trimmer(&visuals, 0.5))
                .width(1.8),
        );
        if has_target {
            plot_ui.hline(
                HLine::new("target channel", view.target_hz * 1e-6)
                    .color(palette::TARGET)
                    .width(1.5),
            );
            plot_ui.span(
                Span::new("target channel", band_lo..=band_hi)
                    .axis(Axis::Y)
                    .fill(palette::target_fill())
                    .border_width(0.0),
            );
        }
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

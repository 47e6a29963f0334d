//! Resonance against spacing, one curve per trimmer setting.

use super::{ChartView, held_bounds, padded, palette, pointer_x, present_marker};
use crate::tuning::sweep::touching_length;
use eframe::egui;
use egui_plot::{
    Axis, ColorConflictHandling, Corner, HLine, HoverPosition, Legend, Line, LineStyle, Plot,
    PlotPoints, Span, VLine,
};

/// Accessible name of the chart.
pub const SPACING_CHART_LABEL: &str = "spacing chart";

/// Resonance against spacing, one curve per trimmer setting 0/25/50/75/100 %, target channel shaded,
/// present coil marked, the turns-touching limit drawn. Returns a new coil length (metres, turns×pitch)
/// when the user clicks or drags on the chart.
pub fn spacing_chart(ui: &mut egui::Ui, view: &ChartView<'_>) -> Option<f64> {
    let visuals = ui.visuals().clone();
    let touching = touching_length(view.coil);
    let (_, longest) = view.cache.length_range_swept();
    let longest = longest.max(touching * 1.001).max(view.coil.length);
    let x_touch = view.x_of_length(touching);
    let x_long = view.x_of_length(longest);
    // A little room left of the limit, so that it reads as a line and not the frame.
    let x_lo = x_touch - 0.04 * (x_long - x_touch);

    let (band_lo, band_hi) = view.channel_mhz();
    let has_target = view.target_hz.is_finite() && view.target_hz > 0.0;
    let (mut f_lo, mut f_hi) = (f64::INFINITY, f64::NEG_INFINITY);
    for curve in view.cache.spacing_curves() {
        for p in &curve.points {
            f_lo = f_lo.min(p[1] * 1e-6);
            f_hi = f_hi.max(p[1] * 1e-6);
        }
    }
    if has_target {
        f_lo = f_lo.min(band_lo);
        f_hi = f_hi.max(band_hi);
    }
    let (y_lo, y_hi) = padded(f_lo, f_hi);

    let hold_id = ui.make_persistent_id("tankwright spacing chart bounds");
    let bounds = held_bounds(ui, hold_id, [x_lo, x_long, y_lo, y_hi]);

    let unit = view.unit;
    let axis = view.axis;
    let decimals = unit.decimals();
    let suffix = unit.suffix();
    let spacing_name = axis.label();

    let plot = Plot::new("tankwright spacing chart")
        .legend(
            Legend::default()
                .position(Corner::RightBottom)
                .text_style(egui::TextStyle::Small)
                .follow_insertion_order(true)
                .color_conflict_handling(ColorConflictHandling::PickFirst),
        )
        .x_axis_label(format!("{spacing_name} ({suffix})"))
        .y_axis_label("resonance (MHz)")
        .allow_drag(false)
        .allow_zoom(false)
        .allow_scroll(false)
        .allow_boxed_zoom(false)
        .allow_double_click_reset(false)
        .allow_axis_zoom_drag(false)
        .show_crosshair(true)
        .min_size(egui::vec2(160.0, 120.0))
        .label_formatter(move |pos| {
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
            Some(format!(
                "{head}{:.3} MHz\n{spacing_name} {:.*} {suffix}",
                p.y, decimals, p.x
            ))
        });

    // Items are added in legend order read from the bottom (the legend sits in the lower right
    // corner and stacks upward); each name's first item gives its legend colour.
    let response = plot.show(ui, |plot_ui| {
        plot_ui.set_plot_bounds_x(bounds[0]..=bounds[1]);
        plot_ui.set_plot_bounds_y(bounds[2]..=bounds[3]);

        // The limit, and the impossible region left of it.
        plot_ui.vline(
            VLine::new("turns touching", x_touch)
                .color(palette::touching(&visuals))
                .width(1.5)
                .style(LineStyle::dashed_loose()),
        );
        plot_ui.span(
            Span::new("turns touching", (bounds[0].min(x_touch))..=x_touch)
                .fill(palette::touching_fill(&visuals))
                .border_width(0.0),
        );

        // The channel is narrow beside the sweep, so its centre is drawn as a line too.
        if has_target {
            plot_ui.hline(
                HLine::new("target channel", view.target_hz * 1e-6)
                    .color(palette::TARGET)
                    .width(1.0),
            );
            plot_ui.span(
                Span::new("target channel", band_lo..=band_hi)
                    .axis(Axis::Y)
                    .fill(palette::target_fill())
                    .border_color(palette::TARGET.gamma_multiply(0.6))
                    .border_width(1.0),
            );
        }

        for curve in view.cache.spacing_curves().iter().rev() {
            let name = format!("trimmer {:.0} %", curve.setting * 100.0);
            let points: PlotPoints<'_> = curve
                .points
                .iter()
                .map(|p| [view.x_of_length(p[0]), p[1] * 1e-6])
                .collect();
            plot_ui.line(
                Line::new(name, points)
                    .color(palette::trimmer(&visuals, curve.setting))
                    .width(1.8),
            );
        }

        present_marker(
            plot_ui,
            "this coil",
            view.x_of_length(view.coil.length),
            view.resonance_hz,
        );
    });

    let x = pointer_x(ui, &response, SPACING_CHART_LABEL, hold_id, bounds)?;
    let length = view.length_of_x(x);
    let (lo, hi) = (
        view.length_of_x(bounds[0]).max(touching),
        view.length_of_x(bounds[1]),
    );
    let hi = hi.min(crate::ui::coil_view::LONGEST);
    Some(length.clamp(lo, hi.max(lo)))
}

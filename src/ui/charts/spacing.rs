//! Resonance against spacing, one curve per trimmer setting.

use super::{
    ChartView, aeronautical_band, held_bounds, hover_text, palette, pointer_x, present_marker,
    reading_points, still_plot, target_channel,
};
use eframe::egui;
use egui_plot::{Corner, Line, LineStyle, PlotPoints, Span, VLine};

/// Accessible name of the chart.
pub const SPACING_CHART_LABEL: &str = "spacing chart";

/// Resonance against spacing, one curve per trimmer setting 0/25/50/75/100 %, target channel shaded,
/// present coil marked, the turns-touching limit drawn. Returns a new coil length (metres, turns×pitch)
/// when the user clicks or drags on the chart.
pub fn spacing_chart(ui: &mut egui::Ui, view: &ChartView<'_>) -> Option<f64> {
    let visuals = ui.visuals().clone();
    let touching = view.coil.shortest_length();
    let (_, longest) = view.cache.length_range_swept();
    let longest = longest.max(touching * 1.001).max(view.coil.length());
    let x_touch = view.x_of_length(touching);
    let x_long = view.x_of_length(longest);
    // A little room left of the limit, so that it reads as a line and not the frame.
    let x_lo = x_touch - 0.04 * (x_long - x_touch);

    let (y_lo, y_hi) = view.frequency_axis(
        view.cache
            .spacing_curves()
            .iter()
            .flat_map(|c| c.points.iter().map(|p| p[1])),
    );

    let hold_id = ui.make_persistent_id("tankwright spacing chart bounds");
    let bounds = held_bounds(ui, hold_id, [x_lo, x_long, y_lo, y_hi]);

    let unit = view.unit;
    let axis = view.axis;
    let decimals = unit.decimals();
    let suffix = unit.suffix();
    let spacing_name = axis.label();

    let plot = still_plot(
        "tankwright spacing chart",
        Corner::RightBottom,
        format!("{spacing_name} ({suffix})"),
    )
    .label_formatter(move |pos| {
        Some(hover_text(pos, |x| {
            format!("{spacing_name} {x:.decimals$} {suffix}")
        }))
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

        target_channel(plot_ui, view);
        aeronautical_band(plot_ui, (bounds[2], bounds[3]));

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

        if let Some(before) = view.uncalibrated {
            let present = view.tank.trimmer_setting;
            if let Some(curve) = before.spacing_curves().iter().min_by(|a, b| {
                (a.setting - present)
                    .abs()
                    .total_cmp(&(b.setting - present).abs())
            }) {
                let points: PlotPoints<'_> = curve
                    .points
                    .iter()
                    .map(|p| [view.x_of_length(p[0]), p[1] * 1e-6])
                    .collect();
                plot_ui.line(
                    Line::new(
                        format!("before calibration, {:.0} %", curve.setting * 100.0),
                        points,
                    )
                    .color(palette::UNCALIBRATED)
                    .style(LineStyle::dashed_dense())
                    .width(1.4),
                );
            }
        }
        super::overlay::draw(plot_ui, view);
        reading_points(plot_ui, view, |r| view.x_of_length(r.length));

        present_marker(
            plot_ui,
            "this coil",
            view.x_of_length(view.coil.length()),
            view.resonance_hz,
        );
    });

    let x = pointer_x(ui, &response, SPACING_CHART_LABEL, hold_id, bounds)?;
    let length = view.length_of_x(x);
    let (lo, hi) = (
        view.length_of_x(bounds[0]).max(touching),
        view.length_of_x(bounds[1]),
    );
    let hi = hi.min(crate::model::limits::LENGTH_MAX);
    Some(length.clamp(lo, hi.max(lo)))
}

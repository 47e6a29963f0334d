//! Resonance against spacing, one curve per trimmer setting.

use super::{
    CLASSICAL_CURVE_LABEL, ChartView, aeronautical_band, held_bounds, hover, legend, palette,
    pointer_x, present_marker, reading_points, still_plot, target_channel,
};
use crate::tuning::sweep::SpacingCurve;
use crate::units::to_mhz;
use eframe::egui;
use egui_plot::{Line, LineStyle, PlotPoints, Span, VLine};

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

    let plot = spacing_plot(view);
    legend::show(
        ui,
        &legend::spacing_entries(view, &visuals, (bounds[2], bounds[3])),
    );

    // The legend is drawn above the chart (legend.rs); keep its entries in step with the items.
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
            Span::new("", (bounds[0].min(x_touch))..=x_touch)
                .fill(palette::touching_fill(&visuals))
                .border_width(0.0),
        );

        target_channel(plot_ui, view);
        aeronautical_band(plot_ui, (bounds[2], bounds[3]));
        super::spread_band::spread_band(plot_ui, view);

        let fixed = view.tank.is_fixed();
        for curve in view.cache.spacing_curves().iter().rev() {
            let name = if fixed {
                super::FIXED_CURVE_LABEL.to_owned()
            } else {
                format!("trimmer {:.0} %", curve.setting * 100.0)
            };
            let points: PlotPoints<'_> = curve
                .points
                .iter()
                .map(|p| [view.x_of_length(p[0]), to_mhz(p[1])])
                .collect();
            plot_ui.line(
                Line::new(name, points)
                    .color(palette::trimmer(&visuals, curve.setting))
                    .width(1.8),
            );
        }
        if !fixed {
            curve_labels(plot_ui, view, &visuals, bounds[1]);
        }

        if let Some(before) = view.uncalibrated {
            let present = view.tank.trimmer_setting;
            if let Some(curve) = before.spacing_curve_nearest(present) {
                let points: PlotPoints<'_> = curve
                    .points
                    .iter()
                    .map(|p| [view.x_of_length(p[0]), to_mhz(p[1])])
                    .collect();
                let name = if fixed {
                    "before calibration".to_owned()
                } else {
                    format!("before calibration, {:.0} %", curve.setting * 100.0)
                };
                plot_ui.line(
                    Line::new(name, points)
                        .color(palette::UNCALIBRATED)
                        .style(LineStyle::dashed_dense())
                        .width(1.4),
                );
            }
        }
        if let Some(classical) = view.classical
            && let Some(curve) = classical
                .cache
                .spacing_curve_nearest(view.tank.trimmer_setting)
        {
            let points: PlotPoints<'_> = curve
                .points
                .iter()
                .map(|p| [view.x_of_length(p[0]), to_mhz(p[1])])
                .collect();
            plot_ui.line(
                Line::new(
                    format!("{CLASSICAL_CURVE_LABEL}, {:.0} %", curve.setting * 100.0),
                    points,
                )
                .color(palette::CLASSICAL)
                .style(LineStyle::dotted_dense())
                .width(1.4),
            );
        }
        super::overlay::draw(plot_ui, view);
        super::operating_line(plot_ui, view);
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

/// The plot itself: still axes at 1–2–5 steps in the user's unit, and hover text giving each
/// curve's resonance at the pointer's length ([`hover::spacing_text`]).
fn spacing_plot<'a>(view: &'a ChartView<'a>) -> egui_plot::Plot<'a> {
    still_plot(
        "tankwright spacing chart",
        format!("{} ({})", view.axis.label(), view.unit.suffix()),
    )
    .label_formatter(move |pos| Some(hover::with_marker(pos, |x| hover::spacing_text(view, x))))
}

/// Each curve's trimmer setting written at its last point inside the chart ("25 %"), in the
/// curve's colour, so the curves can be told apart without the legend; where curves run too
/// close for two labels, the lower one's is left out (the legend's ramp still tells them).
fn curve_labels(
    plot_ui: &mut egui_plot::PlotUi<'_>,
    view: &ChartView<'_>,
    visuals: &egui::Visuals,
    x_max: f64,
) {
    /// Height of a label, points (small text), and the least gap between two.
    const ROOM: f32 = 12.0;
    let mut ends: Vec<(f32, [f64; 2], &SpacingCurve)> = view
        .cache
        .spacing_curves()
        .iter()
        .filter_map(|curve| {
            let end = curve
                .points
                .iter()
                .rev()
                .map(|p| [view.x_of_length(p[0]), to_mhz(p[1])])
                .find(|p| p[0] <= x_max && p[1].is_finite())?;
            let y = plot_ui
                .screen_from_plot(egui_plot::PlotPoint::new(end[0], end[1]))
                .y;
            Some((y, end, curve))
        })
        .collect();
    ends.sort_by(|a, b| a.0.total_cmp(&b.0));
    let mut last_y = f32::NEG_INFINITY;
    for (y, end, curve) in ends {
        if y - last_y < ROOM {
            continue;
        }
        last_y = y;
        plot_ui.text(
            egui_plot::Text::new(
                "",
                egui_plot::PlotPoint::new(end[0], end[1]),
                egui::RichText::new(format!("{:.0} %", curve.setting * 100.0))
                    .small()
                    .strong()
                    .color(palette::trimmer(visuals, curve.setting)),
            )
            .anchor(egui::Align2::RIGHT_BOTTOM),
        );
    }
}

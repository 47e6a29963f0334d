//! Axis ticks at sensible steps: 1, 2 or 5 × 10^k of the axis unit (common practice for
//! chart scales), the smallest such step that leaves room for its label, at any zoom and in
//! any unit (mm, inches, %, MHz). egui_plot's own spacer steps by powers of ten only, so a
//! 0–0.6 mm gap axis or a 0.2–0.6 in length axis had room for one label ("0", "1").
//!
//! Marks that are multiples of the labelled step carry that step (and get a label); the
//! marks between carry a fifth (or, for a step of 2 × 10^k, a quarter) of it and stay
//! unlabelled, as grid lines.

use egui_plot::{GridInput, GridMark};

/// The plot's smallest grid spacing, points (egui_plot's `grid_spacing` minimum, set
/// explicitly by the charts so that [`GridInput::base_step_size`] converts to value per
/// point).
pub const GRID_MIN_POINTS: f32 = 8.0;

/// Room for a label along the x axis, points: labels closer than `X_LABEL_FADE.0` are not
/// drawn, and fully drawn from `X_LABEL_FADE.1`.
pub const X_LABEL_FADE: (f32, f32) = (40.0, 50.0);
/// The same for the y axis (egui_plot's default of 20–30 points).
pub const Y_LABEL_FADE: (f32, f32) = (20.0, 30.0);

/// The smallest 1–2–5 × 10^k at least `least` (positive, finite; else 1).
pub fn nice_step(least: f64) -> f64 {
    if !(least.is_finite() && least > 0.0) {
        return 1.0;
    }
    let decade = 10f64.powf(least.log10().floor());
    [1.0, 2.0, 5.0, 10.0]
        .into_iter()
        .map(|m| m * decade)
        .find(|s| *s >= least * (1.0 - 1e-9))
        .unwrap_or(10.0 * decade)
}

/// Decimals that print every multiple of `step` exactly: 0.05 → 2, 0.2 → 1, 5 → 0.
pub fn decimals_for(step: f64) -> usize {
    if !(step.is_finite() && step > 0.0) {
        return 0;
    }
    let d = (-step.log10() - 1e-9).ceil();
    if d <= 0.0 { 0 } else { d as usize }
}

/// The labelled step and the grid step under it for an axis showing `per_point` value units
/// per point, with labels at least `label_points` apart.
pub fn steps(per_point: f64, label_points: f32) -> (f64, f64) {
    let label = nice_step(per_point * f64::from(label_points));
    let mantissa = label / 10f64.powf(label.log10().floor());
    let minor = if (mantissa - 2.0).abs() < 1e-6 {
        label / 4.0
    } else {
        label / 5.0
    };
    (label, minor)
}

/// Grid marks for `input` with labels at least `label_points` apart (see the module note).
pub fn marks(input: &GridInput, label_points: f32) -> Vec<GridMark> {
    let (lo, hi) = input.bounds;
    let per_point = input.base_step_size / f64::from(GRID_MIN_POINTS);
    if !(lo.is_finite() && hi.is_finite() && hi > lo && per_point > 0.0) {
        return Vec::new();
    }
    let (label, minor) = steps(per_point, label_points);
    // A mark on an edge counts as inside (0.6 / 0.04 is 14.999… in floating point).
    let first = (lo / minor - 1e-9).ceil() as i64;
    let last = (hi / minor + 1e-9).floor() as i64;
    // Never more than a few hundred lines, whatever the bounds.
    if last - first > 1000 {
        return Vec::new();
    }
    let per_label = (label / minor).round() as i64;
    (first..=last)
        .map(|i| GridMark {
            value: i as f64 * minor,
            step_size: if i.rem_euclid(per_label) == 0 {
                label
            } else {
                minor
            },
        })
        .collect()
}

/// The label of a mark: the value with the decimals its step needs, never "-0".
pub fn label(mark: GridMark) -> String {
    crate::tuning::digits::fixed(mark.value, decimals_for(mark.step_size))
}

/// An x axis with `title`, 1–2–5 labels and room for them (see [`X_LABEL_FADE`]).
pub fn x_axis(title: String) -> egui_plot::AxisHints<'static> {
    egui_plot::AxisHints::new_x()
        .label(title)
        .formatter(|mark, _| label(mark))
        .label_spacing(X_LABEL_FADE.0..=X_LABEL_FADE.1)
}

/// Put 1–2–5 ticks on both axes of `plot`, the x axis titled `x_title`, the y axis
/// `y_title`.
pub fn nice_axes<'a>(
    plot: egui_plot::Plot<'a>,
    x_title: String,
    y_title: &str,
) -> egui_plot::Plot<'a> {
    plot.grid_spacing(GRID_MIN_POINTS..=300.0)
        .custom_x_axes(vec![x_axis(x_title)])
        .y_axis_label(y_title.to_owned())
        .y_axis_formatter(|mark, _| label(mark))
        .x_grid_spacer(|input| marks(&input, X_LABEL_FADE.1))
        .y_grid_spacer(|input| marks(&input, Y_LABEL_FADE.1))
}

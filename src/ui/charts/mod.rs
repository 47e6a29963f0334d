//! Live charts of the resonance against spacing and trimmer setting.
//!
//! The sweeps are computed into a [`ChartCache`] only when the coil, tank or conditions change;
//! drawing borrows them through a [`ChartView`] and never changes the model. A click or drag on
//! a chart returns the value under the pointer for the caller to apply.

mod cache;
mod spacing;
mod trimmer;

use crate::model::{Coil, Tank};
use crate::ui::units::LengthUnit;
use eframe::egui::{self, Color32};

pub use cache::ChartCache;
pub use spacing::{SPACING_CHART_LABEL, spacing_chart};
pub use trimmer::{TRIMMER_CHART_LABEL, trimmer_chart};

/// Which spacing figure the x axis shows.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Default)]
pub enum SpacingAxis {
    /// Coil length (turns × pitch).
    #[default]
    Length,
    /// Clear gap between neighbouring turns' insulation.
    Gap,
}

impl SpacingAxis {
    /// Name of the figure as shown on the axis and in hover text.
    pub fn label(self) -> &'static str {
        match self {
            SpacingAxis::Length => "coil length",
            SpacingAxis::Gap => "gap",
        }
    }
}

/// Everything the charts draw from (borrowed; drawing never changes the model).
pub struct ChartView<'a> {
    /// Sweeps computed for `coil` and `tank` by [`ChartCache::refresh`].
    pub cache: &'a ChartCache,
    /// The present coil.
    pub coil: &'a Coil,
    /// The present tank.
    pub tank: &'a Tank,
    /// Target channel centre, hertz.
    pub target_hz: f64,
    /// Width of the target channel, hertz.
    pub channel_width_hz: f64,
    /// The present resonance, hertz.
    pub resonance_hz: f64,
    /// Which spacing figure the x axis shows.
    pub axis: SpacingAxis,
    /// Unit of the x axis.
    pub unit: LengthUnit,
}

impl ChartView<'_> {
    /// A coil length in metres as the spacing chart's x value (display units).
    pub(crate) fn x_of_length(&self, length: f64) -> f64 {
        match self.axis {
            SpacingAxis::Length => self.unit.from_metres(length),
            SpacingAxis::Gap => self
                .unit
                .from_metres(length / self.coil.turns - self.coil.wire_overall),
        }
    }

    /// The spacing chart's x value (display units) as a coil length in metres.
    pub(crate) fn length_of_x(&self, x: f64) -> f64 {
        match self.axis {
            SpacingAxis::Length => self.unit.to_metres(x),
            SpacingAxis::Gap => self.coil.turns * (self.unit.to_metres(x) + self.coil.wire_overall),
        }
    }

    /// The target channel, MHz: (low edge, high edge).
    pub(crate) fn channel_mhz(&self) -> (f64, f64) {
        let half = 0.5 * self.channel_width_hz.abs();
        (
            (self.target_hz - half) * 1e-6,
            (self.target_hz + half) * 1e-6,
        )
    }
}

/// Our palette. Trimmer settings are a sequential ramp from the theme's strong text colour
/// (0 %, least capacitance) to a warm amber (100 %, most capacitance); the marks sit on
/// mid-lightness hues that read on both the light and the dark panel.
pub(crate) mod palette {
    use super::*;

    /// The 100 % end of the trimmer ramp.
    const RAMP_END: Color32 = Color32::from_rgb(0xd9, 0x74, 0x1c);
    /// The present coil or setting.
    pub const PRESENT: Color32 = Color32::from_rgb(0x2f, 0x86, 0xd6);
    /// The target channel.
    pub const TARGET: Color32 = Color32::from_rgb(0x3a, 0xa8, 0x5c);

    fn lerp(a: Color32, b: Color32, t: f32) -> Color32 {
        let t = t.clamp(0.0, 1.0);
        let mix = |x: u8, y: u8| (f32::from(x) + (f32::from(y) - f32::from(x)) * t).round() as u8;
        Color32::from_rgb(mix(a.r(), b.r()), mix(a.g(), b.g()), mix(a.b(), b.b()))
    }

    /// Colour of the curve for trimmer `setting` (0–1).
    pub fn trimmer(visuals: &egui::Visuals, setting: f64) -> Color32 {
        lerp(visuals.strong_text_color(), RAMP_END, setting as f32)
    }

    /// Translucent fill of the target channel band.
    pub fn target_fill() -> Color32 {
        Color32::from_rgba_unmultiplied(TARGET.r(), TARGET.g(), TARGET.b(), 56)
    }

    /// The turns-touching limit (the theme's error colour).
    pub fn touching(visuals: &egui::Visuals) -> Color32 {
        visuals.error_fg_color
    }

    /// Translucent fill of the impossible region left of the touching limit.
    pub fn touching_fill(visuals: &egui::Visuals) -> Color32 {
        let c = visuals.error_fg_color;
        Color32::from_rgba_unmultiplied(c.r(), c.g(), c.b(), 28)
    }
}

/// Remember a chart's bounds while a drag lasts, so that the axes do not rescale under the
/// pointer as the dragged value changes the sweep; `bounds` are used when no drag is going on.
pub(crate) fn held_bounds(ui: &egui::Ui, id: egui::Id, bounds: [f64; 4]) -> [f64; 4] {
    ui.data(|d| d.get_temp::<[f64; 4]>(id)).unwrap_or(bounds)
}

/// Start, keep or forget the held bounds after the chart was shown.
pub(crate) fn hold_bounds_while_dragging(
    ui: &egui::Ui,
    id: egui::Id,
    response: &egui::Response,
    bounds: [f64; 4],
) {
    ui.data_mut(|d| {
        if response.dragged() {
            if d.get_temp::<[f64; 4]>(id).is_none() {
                d.insert_temp(id, bounds);
            }
        } else {
            d.remove::<[f64; 4]>(id);
        }
    });
}

/// Bounds of a y range with a margin, never empty.
pub(crate) fn padded(lo: f64, hi: f64) -> (f64, f64) {
    let (lo, hi) = if lo.is_finite() && hi.is_finite() && hi > lo {
        (lo, hi)
    } else if lo.is_finite() {
        (lo - 0.5, lo + 0.5)
    } else {
        (0.0, 1.0)
    };
    let m = 0.06 * (hi - lo);
    (lo - m, hi + m)
}

/// The present coil or setting: a filled point at the resonance and a dotted line through it.
pub(crate) fn present_marker(
    plot_ui: &mut egui_plot::PlotUi<'_>,
    name: &str,
    x: f64,
    resonance_hz: f64,
) {
    if resonance_hz.is_finite() {
        plot_ui.points(
            egui_plot::Points::new(name, vec![[x, resonance_hz * 1e-6]])
                .color(palette::PRESENT)
                .filled(true)
                .radius(5.0),
        );
    }
    plot_ui.vline(
        egui_plot::VLine::new(name, x)
            .color(palette::PRESENT.gamma_multiply(0.6))
            .width(1.0)
            .style(egui_plot::LineStyle::dotted_dense()),
    );
}

/// After a chart is drawn: name it for assistive tools, hold its axes during a drag, and
/// return the plot x under the pointer when it was clicked or dragged.
pub(crate) fn pointer_x<R>(
    ui: &egui::Ui,
    response: &egui_plot::PlotResponse<R>,
    label: &'static str,
    hold_id: egui::Id,
    bounds: [f64; 4],
) -> Option<f64> {
    let r = &response.response;
    r.widget_info(|| egui::WidgetInfo::labeled(egui::Role::Figure, ui.is_enabled(), label));
    hold_bounds_while_dragging(ui, hold_id, r, bounds);
    if !(r.clicked() || r.dragged()) {
        return None;
    }
    let pos = r.interact_pointer_pos()?;
    Some(response.transform.value_from_position(pos).x)
}

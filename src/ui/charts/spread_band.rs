//! The spread band around the present curve on the spacing chart: where the built coil can be
//! expected to land at each length (kept in the [`super::ChartCache`] by the evaluation, from
//! [`crate::recipe::expectation()`]): the builder's tolerances and the stray estimate's range
//! before any measurement, what the fit's errors leave after a bench calibration.

use super::{ChartView, palette};
use crate::units::to_mhz;
use eframe::egui::{Color32, Stroke};
use egui_plot::{FilledArea, PlotUi};

/// Legend name of the band before any measurement.
pub const BAND_BEFORE_LABEL: &str = "expected spread (95 %)";

/// Legend name of the band after a bench calibration.
pub const BAND_CALIBRATED_LABEL: &str = "spread after calibration (95 %)";

/// Translucent fill of the band, in the present coil's colour.
fn fill() -> Color32 {
    let c = palette::PRESENT;
    Color32::from_rgba_unmultiplied(c.r(), c.g(), c.b(), 48)
}

/// Draw the band (nothing when there is none); points the engine could not compute are left
/// out.
pub(crate) fn spread_band(plot_ui: &mut PlotUi<'_>, view: &ChartView<'_>) {
    let (band, calibrated) = view.cache.spread_band();
    let (mut xs, mut lows, mut highs) = (Vec::new(), Vec::new(), Vec::new());
    for &[l, lo, hi] in band {
        if l.is_finite() && lo.is_finite() && hi.is_finite() {
            xs.push(view.x_of_length(l));
            lows.push(to_mhz(lo));
            highs.push(to_mhz(hi));
        }
    }
    if xs.len() < 2 {
        return;
    }
    let name = if calibrated {
        BAND_CALIBRATED_LABEL
    } else {
        BAND_BEFORE_LABEL
    };
    plot_ui.add(
        FilledArea::new(name, &xs, &lows, &highs)
            .fill_color(fill())
            .stroke(Stroke::new(0.8, palette::PRESENT.gamma_multiply(0.5)))
            .allow_hover(false),
    );
}

//! Live charts of the resonance against spacing and trimmer setting, and the modulation charts
//! (carrier against bias, deviation against audio level) in [`modulation`].
//!
//! The sweeps are computed into a [`ChartCache`] only when the coil, tank or conditions change;
//! drawing borrows them through a [`ChartView`] and never changes the model. A click or drag on
//! a chart returns the value under the pointer for the caller to apply.

mod cache;
pub mod hover;
pub mod impedance;
pub mod legend;
pub mod modulation;
mod overlay;
mod spacing;
mod spread_band;
pub mod ticks;
mod trimmer;

use crate::model::{Coil, Tank};
use crate::tuning::service::AERONAUTICAL;
use crate::ui::units::LengthUnit;
use crate::units::to_mhz;
use eframe::egui::{self, Color32};

pub use cache::{ChartCache, SETTINGS};
pub use overlay::{ChartOverlay, OverlayKind};

pub use spacing::{SPACING_CHART_LABEL, spacing_chart};
pub use spread_band::{BAND_BEFORE_LABEL, BAND_CALIBRATED_LABEL};
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

/// A bench reading as the charts draw it.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct ReadingMark {
    /// Coil length at the reading, metres.
    pub length: f64,
    /// Trimmer setting at the reading, 0–1.
    pub setting: f64,
    /// Measured frequency, hertz.
    pub measured: f64,
    /// A known capacitor clipped across the tank for the reading, farads (0 for none): such
    /// a reading lies on another curve and is drawn apart (`reading_points`).
    pub added: f64,
}

/// Name of the classical comparison curve (our own words for the shape the classical formulas
/// give: Nagaoka's coefficient, or its short form by Wheeler, with Rosa's corrections and the
/// leads; the driving model of [`crate::model::InductanceModel`]).
pub const CLASSICAL_CURVE_LABEL: &str = "textbook formulas (Nagaoka/Wheeler)";

/// The classical comparison the charts draw once the field shape is shown.
#[derive(Clone, Copy)]
pub struct ClassicalComparison<'a> {
    /// The classical formulas' sweeps for the same coil and tank, without the field
    /// solution's factor.
    pub cache: &'a ChartCache,
    /// Their resonance at the present coil and setting, hertz.
    pub here: f64,
}

impl ReadingMark {
    /// Whether a capacitor was clipped on for the reading.
    pub fn clipped(&self) -> bool {
        self.added > 0.0
    }

    /// The name a clipped-on reading is drawn and hovered by: "reading with +10.0 pF
    /// clipped on".
    pub fn clipped_name(&self) -> String {
        format!("reading with {} clipped on", clip_words(self.added))
    }
}

/// A clipped-on capacitance as its marker's label: "+10.0 pF".
pub fn clip_words(farads: f64) -> String {
    format!(
        "+{} pF",
        crate::tuning::digits::fixed(crate::units::to_pf(farads), 1)
    )
}

pub use crate::tuning::sweep::FIXED_CURVE_LABEL;

/// Everything the charts draw from (borrowed; drawing never changes the model).
pub struct ChartView<'a> {
    /// Sweeps computed for `coil` and `tank` by [`ChartCache::refresh`].
    pub cache: &'a ChartCache,
    /// The uncalibrated model's sweeps, when the figures are calibrated on bench readings.
    pub uncalibrated: Option<&'a ChartCache>,
    /// The classical formulas' curves for comparison, while the curves are on the field
    /// shape.
    pub classical: Option<ClassicalComparison<'a>>,
    /// The bench readings, drawn as points.
    pub readings: &'a [ReadingMark],
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
    /// Muted extra curves on the spacing chart (the teaching bench's ghost and reference).
    pub overlays: &'a [ChartOverlay],
    /// Where the oscillator stage kept in the recipe runs, when that differs from the tank's
    /// resonance ([`Operating::differing`]).
    pub operating: Option<Operating>,
}

/// The oscillator stage's operating frequency (`tuning::stage`: the tank with the
/// transistor's capacitances) for the charts.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Operating {
    /// The operating frequency, hertz.
    pub frequency: f64,
    /// It minus the tank's alone (with its Clapp capacitor, when there is one), hertz.
    pub pulling: f64,
    /// The stage has a Clapp series capacitor (its tank is not the charts' tank alone).
    pub clapp: bool,
}

impl Operating {
    /// The stage's figures when the operating frequency differs from the charts' present
    /// resonance `shown` hertz by a kilohertz or more as shown (the readouts' resolution),
    /// else `None`.
    pub fn differing(frequency: f64, pulling: f64, clapp: bool, shown: f64) -> Option<Self> {
        let apart = (frequency - shown).abs();
        (frequency.is_finite() && pulling.is_finite() && apart >= 500.0).then_some(Self {
            frequency,
            pulling,
            clapp,
        })
    }

    /// Its name on the charts and in their legends: where it runs and the pulling in kHz.
    pub fn label(&self) -> String {
        format!(
            "oscillator runs at {} (pulled {} kHz{})",
            crate::tuning::digits::mhz(self.frequency),
            crate::tuning::digits::signed(crate::units::to_khz(self.pulling), 0),
            if self.clapp {
                " from the tank with its Clapp capacitor"
            } else {
                ""
            }
        )
    }
}

/// The oscillator's operating frequency as a dashed line across the chart, named with where it
/// runs and the pulling.
pub(crate) fn operating_line(plot_ui: &mut egui_plot::PlotUi<'_>, view: &ChartView<'_>) {
    if let Some(op) = view.operating {
        plot_ui.hline(
            egui_plot::HLine::new(op.label(), to_mhz(op.frequency))
                .color(palette::OPERATING)
                .style(egui_plot::LineStyle::dashed_loose())
                .width(1.4),
        );
    }
}

impl ChartView<'_> {
    /// A coil length in metres as the spacing chart's x value (display units).
    pub fn x_of_length(&self, length: f64) -> f64 {
        match self.axis {
            SpacingAxis::Length => self.unit.from_metres(length),
            SpacingAxis::Gap => self.unit.from_metres(self.coil.gap_for_length(length)),
        }
    }

    /// The spacing chart's x value (display units) as a coil length in metres.
    pub fn length_of_x(&self, x: f64) -> f64 {
        match self.axis {
            SpacingAxis::Length => self.unit.to_metres(x),
            SpacingAxis::Gap => self.coil.length_for_gap(self.unit.to_metres(x)),
        }
    }

    /// Whether a target channel is set.
    pub(crate) fn has_target(&self) -> bool {
        self.target_hz.is_finite() && self.target_hz > 0.0
    }

    /// The frequency axis, MHz: the range of `hertz`, widened to hold the target channel and
    /// padded.
    pub(crate) fn frequency_axis(&self, hertz: impl Iterator<Item = f64>) -> (f64, f64) {
        let (mut lo, mut hi) = hertz.fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), f| {
            (lo.min(to_mhz(f)), hi.max(to_mhz(f)))
        });
        if self.has_target() {
            let (band_lo, band_hi) = self.channel_mhz();
            lo = lo.min(band_lo);
            hi = hi.max(band_hi);
        }
        padded(lo, hi)
    }

    /// The target channel, MHz: (low edge, high edge).
    pub(crate) fn channel_mhz(&self) -> (f64, f64) {
        let half = 0.5 * self.channel_width_hz.abs();
        (to_mhz(self.target_hz - half), to_mhz(self.target_hz + half))
    }
}

/// Our palette ([`crate::palette`]) as egui colours. Trimmer settings are a sequential ramp
/// from the theme's strong text colour (0 %, least capacitance) to a warm amber (100 %).
pub(crate) mod palette {
    use super::*;

    const fn egui(c: crate::palette::Rgb) -> Color32 {
        Color32::from_rgb(c.0, c.1, c.2)
    }

    /// The present coil or setting.
    pub const PRESENT: Color32 = egui(crate::palette::PRESENT);
    /// The oscillator stage's operating frequency.
    pub const OPERATING: Color32 = egui(crate::palette::OPERATING);
    /// Bench readings.
    pub const READING: Color32 = egui(crate::palette::READING);
    /// The model before calibration.
    pub const UNCALIBRATED: Color32 = egui(crate::palette::UNCALIBRATED);
    /// The classical formulas' comparison curve.
    pub const CLASSICAL: Color32 = egui(crate::palette::CLASSICAL);
    /// The target channel.
    pub const TARGET: Color32 = egui(crate::palette::TARGET);
    /// The aeronautical band: a warning red of our own, readable on both themes.
    pub const AERONAUTICAL: Color32 = egui(crate::palette::AERONAUTICAL);

    /// Translucent fill of the aeronautical band.
    pub fn aeronautical_fill() -> Color32 {
        Color32::from_rgba_unmultiplied(AERONAUTICAL.r(), AERONAUTICAL.g(), AERONAUTICAL.b(), 40)
    }

    /// Colour of the curve for trimmer `setting` (0–1).
    pub fn trimmer(visuals: &egui::Visuals, setting: f64) -> Color32 {
        let from = visuals.strong_text_color();
        let c = crate::palette::Rgb(from.r(), from.g(), from.b())
            .towards(crate::palette::RAMP_END, setting);
        egui(c)
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

/// `plot` with every pan, zoom, scroll and reset gesture turned off: every chart in the window
/// holds still (a drag sets a value instead, where it does anything).
pub(crate) fn held_still(plot: egui_plot::Plot<'_>) -> egui_plot::Plot<'_> {
    plot.allow_drag(false)
        .allow_zoom(false)
        .allow_scroll(false)
        .allow_boxed_zoom(false)
        .allow_double_click_reset(false)
        .allow_axis_zoom_drag(false)
}

/// The smallest and largest finite value of `values` (infinities when there is none).
pub(crate) fn finite_range(values: impl Iterator<Item = f64>) -> (f64, f64) {
    values
        .filter(|v| v.is_finite())
        .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), v| {
            (lo.min(v), hi.max(v))
        })
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
            egui_plot::Points::new(name, vec![[x, to_mhz(resonance_hz)]])
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

/// The least height of a live chart's plot, points (its legend comes on top): the centre
/// scrolls rather than squeeze a chart to a strip (issue 21: about 110 px at 1280×720).
pub const MIN_PLOT_HEIGHT: f32 = 220.0;

/// A chart that holds still: no pan, zoom or scroll (a drag sets a value instead), a crosshair,
/// no legend inside (each chart draws its own above it: [`legend`]), resonance in MHz up the
/// side and `x_label` along the bottom, both axes at 1–2–5 steps ([`ticks`]).
pub(crate) fn still_plot<'a>(id: &str, x_label: String) -> egui_plot::Plot<'a> {
    let plot = held_still(egui_plot::Plot::new(id))
        .show_crosshair(true)
        .min_size(egui::vec2(160.0, MIN_PLOT_HEIGHT));
    ticks::nice_axes(plot, x_label, "resonance (MHz)")
}

/// Bench readings as points at (`x_of(reading)`, measured MHz): the unclipped readings as
/// filled diamonds, each reading taken with a capacitor clipped on as a hollow square of its
/// own, labelled with the capacitance ("+10.0 pF"): it lies on another curve (the tank plus
/// that capacitor), so it must not read as a point of the curves drawn.
pub(crate) fn reading_points(
    plot_ui: &mut egui_plot::PlotUi<'_>,
    view: &ChartView<'_>,
    x_of: impl Fn(&ReadingMark) -> f64,
) {
    let plain: Vec<[f64; 2]> = view
        .readings
        .iter()
        .filter(|r| !r.clipped())
        .map(|r| [x_of(r), to_mhz(r.measured)])
        .collect();
    if !plain.is_empty() {
        plot_ui.points(
            egui_plot::Points::new(READINGS_LABEL, plain)
                .color(palette::READING)
                .shape(egui_plot::MarkerShape::Diamond)
                .filled(true)
                .radius(5.0),
        );
    }
    for r in view.readings.iter().filter(|r| r.clipped()) {
        let at = [x_of(r), to_mhz(r.measured)];
        plot_ui.points(
            egui_plot::Points::new(r.clipped_name(), vec![at])
                .color(palette::READING)
                .shape(egui_plot::MarkerShape::Square)
                .filled(false)
                .radius(5.5),
        );
        plot_ui.text(
            egui_plot::Text::new(
                "",
                egui_plot::PlotPoint::new(at[0], at[1]),
                egui::RichText::new(format!("  {}", clip_words(r.added)))
                    .small()
                    .color(palette::READING),
            )
            .anchor(egui::Align2::LEFT_CENTER),
        );
    }
}

/// Name of the unclipped bench readings on the charts (their legend entry and hover).
pub const READINGS_LABEL: &str = "bench readings";

/// Name of the legend entry for readings taken with a capacitor clipped on.
pub const CLIPPED_READINGS_LABEL: &str = "reading with a capacitor clipped on (its own curve)";

/// The target channel: its band shaded and its centre drawn as a line (the band alone is too
/// narrow to see beside a sweep of tens of MHz).
pub(crate) fn target_channel(plot_ui: &mut egui_plot::PlotUi<'_>, view: &ChartView<'_>) {
    if !view.has_target() {
        return;
    }
    let (band_lo, band_hi) = view.channel_mhz();
    plot_ui.hline(
        egui_plot::HLine::new("target channel", to_mhz(view.target_hz))
            .color(palette::TARGET)
            .width(1.0),
    );
    // Spans are left unnamed: egui_plot would write the name inside the band, cut short;
    // the legend above the chart names them.
    plot_ui.span(
        egui_plot::Span::new("", band_lo..=band_hi)
            .axis(egui_plot::Axis::Y)
            .fill(palette::target_fill())
            .border_color(palette::TARGET.gamma_multiply(0.6))
            .border_width(1.0),
    );
}

/// Name of the shaded aeronautical band on the charts (and its legend entry).
pub const AERONAUTICAL_BAND_LABEL: &str = "aeronautical band (108–137 MHz)";

/// The aeronautical band, 108–137 MHz ([`AERONAUTICAL`]), shaded across the chart when the
/// frequency axis (`y_mhz`, MHz: low, high) reaches into it. The axis is never widened to
/// show it, so the band (and its legend entry) appears only when the sweep comes near it.
pub(crate) fn aeronautical_band(plot_ui: &mut egui_plot::PlotUi<'_>, y_mhz: (f64, f64)) {
    let (lo, hi) = (to_mhz(AERONAUTICAL.0), to_mhz(AERONAUTICAL.1));
    if !(y_mhz.1 > lo && y_mhz.0 < hi) {
        return;
    }
    plot_ui.span(
        // Unnamed: egui_plot would write the name inside the band, cut short ("aer…"); the
        // legend above the chart names it.
        egui_plot::Span::new("", lo..=hi)
            .axis(egui_plot::Axis::Y)
            .fill(palette::aeronautical_fill())
            .border_color(palette::AERONAUTICAL.gamma_multiply(0.7))
            .border_width(1.0),
    );
}

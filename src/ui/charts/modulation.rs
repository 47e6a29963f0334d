//! The modulation charts: the carrier against the junction's reverse bias, with the audio's
//! swing drawn as a band, and the peak deviation (up and down) against the audio's peak
//! voltage, with the service's limit.
//!
//! Every point is the engine's (`tuning::modulation::carrier_over_bias`,
//! `deviation_over_audio` and `modulation`, the functions `evaluate --junction-…` uses).
//! [`ModulationSweeps`] keeps them between frames; `ui::evaluation` owns it and refreshes it
//! only when the coil, tank, conditions or the junction's inputs change.

use super::legend::{self, Entry, Swatch};
use super::palette;
use crate::model::{Coil, Conditions, Tank};
use crate::tuning::modulation::{
    Modulation, ModulationInputs, Service, carrier_over_bias, deviation_over_audio, modulation,
};
use crate::units::{to_khz, to_mhz};
use eframe::egui;
use egui_plot::{HLine, Line, LineStyle, Plot, PlotPoints, Points, Span, VLine};

/// Accessible name of the carrier-against-bias chart.
pub const CARRIER_BIAS_CHART_LABEL: &str = "carrier against reverse bias chart";
/// Accessible name of the deviation-against-audio chart.
pub const DEVIATION_CHART_LABEL: &str = "deviation against audio peak chart";

/// Points per curve.
const SAMPLES: usize = 121;
/// The bias axis reaches at least this far, volts (a 9 V battery's range and a little more).
const BIAS_AXIS_MIN_TOP: f64 = 10.0;

/// Inputs the sweeps were computed from.
type Key = (Coil, Tank, Conditions, ModulationInputs);

/// The modulation charts' data, recomputed only when their inputs change.
#[derive(Default)]
pub struct ModulationSweeps {
    key: Option<Key>,
    present: Option<Modulation>,
    service: Option<Service>,
    carrier: Vec<[f64; 2]>,
    deviation: Vec<[f64; 3]>,
}

impl ModulationSweeps {
    /// Recompute if (coil, tank, conditions, inputs) differ from the last call; true if it
    /// recomputed. `tank` is the tank without the junction (its external capacitance is
    /// everything but the modulator, as `evaluate` and the audio panel take it).
    pub fn refresh(
        &mut self,
        coil: &Coil,
        tank: &Tank,
        conditions: &Conditions,
        inputs: &ModulationInputs,
    ) -> bool {
        let key = (*coil, *tank, *conditions, *inputs);
        if self.key == Some(key) {
            return false;
        }
        let other = tank.external_capacitance();
        let present = modulation(coil, other, conditions, inputs);
        let service = Service::for_carrier(present.carrier);
        let (vb, va) = (inputs.bias_v, inputs.audio_peak_v.abs());

        // Bias axis: from 0 V (or the audio's negative peak, if it goes forward) to past the
        // swing's top.
        let lo = (vb - va).min(0.0);
        let hi = (1.5 * (vb + va)).max(BIAS_AXIS_MIN_TOP);
        let biases = spaced(lo, hi);
        self.carrier = carrier_over_bias(coil, other, conditions, &inputs.modulator, &biases);

        // Audio axis: to where the deviation reaches the limit with a quarter to spare (by the
        // present sensitivity), at least twice the present peak, and not far past the bias
        // (beyond it the junction is driven forward).
        let limit = service.peak_deviation_limit();
        let slope = present.sensitivity.abs();
        let reach = if slope > 0.0 {
            limit / slope
        } else {
            f64::INFINITY
        };
        let top = (1.25 * reach)
            .min((vb + 1.0).max(2.0 * va))
            .max(2.0 * va)
            .max(0.05);
        let peaks = spaced(0.0, top);
        self.deviation =
            deviation_over_audio(coil, other, conditions, &inputs.modulator, vb, &peaks);

        self.present = Some(present);
        self.service = Some(service);
        self.key = Some(key);
        true
    }

    /// The carrier against reverse bias: (volts, hertz), bias ascending.
    pub fn carrier_over_bias(&self) -> &[[f64; 2]] {
        &self.carrier
    }

    /// The peak deviations against the audio's peak: (volts, upward hertz, downward hertz),
    /// peak ascending.
    pub fn deviation_over_audio(&self) -> &[[f64; 3]] {
        &self.deviation
    }

    /// The modulation at the present bias and audio level.
    pub fn present(&self) -> Option<&Modulation> {
        self.present.as_ref()
    }

    /// The service the deviation is judged against (from the carrier).
    pub fn service(&self) -> Option<Service> {
        self.service
    }

    /// The inputs the sweeps were computed for.
    pub fn inputs(&self) -> Option<&ModulationInputs> {
        self.key.as_ref().map(|k| &k.3)
    }
}

/// `SAMPLES` values from `lo` to `hi`, evenly spaced.
fn spaced(lo: f64, hi: f64) -> Vec<f64> {
    let step = (hi - lo) / (SAMPLES - 1) as f64;
    (0..SAMPLES).map(|i| lo + step * i as f64).collect()
}

/// A chart that only shows (no pan, zoom or drag); its legend is drawn above it
/// ([`super::legend`]), as on the other charts, so no entry covers a curve.
///
/// Its width is what the panel shows from the chart's left edge to the panel's visible right
/// edge (the clip rectangle): inside the left panel's sideways scroll area the room egui
/// offers grows with any wider row above (the drift table), and the chart ran past the
/// panel's edge with the end of its bias axis hidden (issue 21).
fn plain_plot(ui: &egui::Ui, id: &str, x_label: &str, y_label: &str) -> Plot<'static> {
    let visible = ui.clip_rect().right() - ui.cursor().left() - ui.spacing().item_spacing.x;
    let width = visible.min(ui.available_width()).max(160.0);
    // 1–2–5 ticks with labels on both axes, as on the other charts (the bias axis showed
    // only "0" with egui_plot's own spacing at this width).
    let plot = super::held_still(Plot::new(id))
        .width(width)
        .show_crosshair(true);
    super::ticks::nice_axes(plot, x_label.to_owned(), y_label)
        .height(190.0)
        .min_size(egui::vec2(160.0, 120.0))
}

/// Range of `values` with a margin, never empty.
fn padded(values: impl Iterator<Item = f64>) -> (f64, f64) {
    let (lo, hi) = super::finite_range(values);
    super::padded(lo, hi)
}

/// Name the chart for assistive tools.
fn name_chart(ui: &egui::Ui, response: &egui::Response, label: &'static str) {
    response.widget_info(|| egui::WidgetInfo::labeled(egui::Role::Figure, ui.is_enabled(), label));
}

/// The carrier against the junction's reverse bias, with the audio's swing (bias ± peak)
/// shaded and the present bias marked.
pub fn carrier_bias_chart(ui: &mut egui::Ui, sweeps: &ModulationSweeps) {
    let (Some(present), Some(inputs)) = (sweeps.present(), sweeps.inputs()) else {
        return;
    };
    let strong = ui.visuals().strong_text_color();
    let curve = sweeps.carrier_over_bias();
    let (vb, va) = (inputs.bias_v, inputs.audio_peak_v.abs());
    let (y_lo, y_hi) = padded(curve.iter().map(|p| to_mhz(p[1])));
    let x_lo = curve.first().map_or(0.0, |p| p[0]);
    let x_hi = curve.last().map_or(BIAS_AXIS_MIN_TOP, |p| p[0]);
    let mut entries = vec![Entry::new("carrier", Swatch::Line(strong))];
    if va > 0.0 {
        entries.push(Entry::new(
            "audio swing (bias ± peak)",
            Swatch::Band(palette::target_fill()),
        ));
        entries.push(Entry::new(
            "carrier at the audio's peaks",
            Swatch::Point(palette::TARGET),
        ));
    }
    entries.push(Entry::new("present bias", Swatch::Point(palette::PRESENT)));
    legend::show(ui, &entries);
    let response = plain_plot(
        ui,
        "tankwright carrier against bias",
        "junction reverse bias (V)",
        "carrier (MHz)",
    )
    .label_formatter(|pos| carrier_bias_hover(curve, hover_point(pos).x))
    .show(ui, |plot_ui| {
        plot_ui.set_plot_bounds_x(x_lo..=x_hi);
        plot_ui.set_plot_bounds_y(y_lo..=y_hi);
        let points: PlotPoints<'_> = curve.iter().map(|p| [p[0], to_mhz(p[1])]).collect();
        plot_ui.line(Line::new("carrier", points).color(strong).width(1.8));
        if va > 0.0 {
            plot_ui.span(
                Span::new("audio swing (bias ± peak)", (vb - va)..=(vb + va))
                    .axis(egui_plot::Axis::X)
                    .fill(palette::target_fill())
                    .border_color(palette::TARGET.gamma_multiply(0.7))
                    .border_width(1.0),
            );
            let swing = [
                [vb - va, to_mhz(present.carrier - present.deviation_down)],
                [vb + va, to_mhz(present.carrier + present.deviation_up)],
            ];
            plot_ui.points(
                Points::new("carrier at the audio's peaks", swing.to_vec())
                    .color(palette::TARGET)
                    .filled(true)
                    .radius(3.5),
            );
        }
        plot_ui.points(
            Points::new("present bias", vec![[vb, to_mhz(present.carrier)]])
                .color(palette::PRESENT)
                .filled(true)
                .radius(5.0),
        );
        plot_ui.vline(
            VLine::new("present bias", vb)
                .color(palette::PRESENT.gamma_multiply(0.6))
                .width(1.0)
                .style(LineStyle::dotted_dense()),
        );
    });
    name_chart(ui, &response.response, CARRIER_BIAS_CHART_LABEL);
}

/// The hover text of the carrier-against-bias chart at the pointer's bias `x` (volts): the
/// curve read there, interpolated between its samples, never the pointer's own height;
/// `None` off the curve. `curve` is [`ModulationSweeps::carrier_over_bias`] (volts, hertz).
pub fn carrier_bias_hover(curve: &[[f64; 2]], x: f64) -> Option<String> {
    let hz = super::hover::value_at(curve, x)?;
    Some(format!(
        "{}\n{:.2} V reverse bias",
        crate::tuning::digits::mhz(hz),
        x
    ))
}

/// The point under the pointer (or the data point nearest it).
fn hover_point(pos: &egui_plot::HoverPosition<'_>) -> egui_plot::PlotPoint {
    match pos {
        egui_plot::HoverPosition::NearDataPoint { position, .. }
        | egui_plot::HoverPosition::Elsewhere { position } => *position,
    }
}

/// The peak deviation up and down against the audio's peak voltage at the present bias, with
/// the service's limit and the present level marked.
pub fn deviation_chart(ui: &mut egui::Ui, sweeps: &ModulationSweeps) {
    let (Some(present), Some(inputs), Some(service)) =
        (sweeps.present(), sweeps.inputs(), sweeps.service())
    else {
        return;
    };
    let visuals = ui.visuals().clone();
    let curve = sweeps.deviation_over_audio();
    let limit_khz = to_khz(service.peak_deviation_limit());
    let (vb, va) = (inputs.bias_v, inputs.audio_peak_v.abs());
    let (_, y_hi) = padded(
        curve
            .iter()
            .flat_map(|p| [to_khz(p[1]), to_khz(p[2])])
            .chain([0.0, limit_khz]),
    );
    let x_hi = curve.last().map_or(1.0, |p| p[0]);
    let mut entries = vec![
        Entry::new("upwards (bias + peak)", Swatch::Line(palette::PRESENT)),
        Entry::new(
            "downwards (bias − peak)",
            Swatch::Line(palette::trimmer(&visuals, 1.0)),
        ),
        Entry::new(
            format!("limit ±{limit_khz:.0} kHz"),
            Swatch::Dashed(palette::AERONAUTICAL),
        ),
    ];
    if vb < x_hi {
        entries.push(Entry::new(
            "peak = bias (forward beyond)",
            Swatch::Dashed(palette::UNCALIBRATED),
        ));
    }
    entries.push(Entry::new(
        "present audio peak",
        Swatch::Point(palette::READING),
    ));
    legend::show(ui, &entries);
    let response = plain_plot(
        ui,
        "tankwright deviation against audio",
        "audio peak at the junction (V)",
        "peak deviation (kHz)",
    )
    .label_formatter(|pos| {
        let p = hover_point(pos);
        Some(format!("{:.1} kHz\n{:.3} V audio peak", p.y, p.x))
    })
    .show(ui, |plot_ui| {
        plot_ui.set_plot_bounds_x(0.0..=x_hi);
        plot_ui.set_plot_bounds_y(0.0..=y_hi);
        let up: PlotPoints<'_> = curve.iter().map(|p| [p[0], to_khz(p[1])]).collect();
        let down: PlotPoints<'_> = curve.iter().map(|p| [p[0], to_khz(p[2])]).collect();
        plot_ui.line(
            Line::new("upwards (bias + peak)", up)
                .color(palette::PRESENT)
                .width(1.8),
        );
        plot_ui.line(
            Line::new("downwards (bias − peak)", down)
                .color(palette::trimmer(&visuals, 1.0))
                .width(1.8),
        );
        plot_ui.hline(
            HLine::new(format!("limit ±{limit_khz:.0} kHz"), limit_khz)
                .color(palette::AERONAUTICAL)
                .width(1.5)
                .style(LineStyle::dashed_loose()),
        );
        if vb < x_hi {
            plot_ui.vline(
                VLine::new("peak = bias (forward beyond)", vb)
                    .color(palette::UNCALIBRATED)
                    .width(1.0)
                    .style(LineStyle::dotted_loose()),
            );
        }
        plot_ui.points(
            Points::new(
                "present audio peak",
                vec![
                    [va, to_khz(present.deviation_up)],
                    [va, to_khz(present.deviation_down)],
                ],
            )
            .color(palette::READING)
            .filled(true)
            .radius(4.5),
        );
    });
    name_chart(ui, &response.response, DEVIATION_CHART_LABEL);
}

/// Both charts, one under the other, with a line naming the service's limit.
pub fn modulation_charts(ui: &mut egui::Ui, sweeps: &ModulationSweeps) {
    carrier_bias_chart(ui, sweeps);
    ui.add_space(4.0);
    deviation_chart(ui, sweeps);
    if let Some(service) = sweeps.service() {
        ui.add(
            egui::Label::new(egui::RichText::new(format!("Limit: {}.", service.label())).weak())
                .wrap(),
        );
    }
}

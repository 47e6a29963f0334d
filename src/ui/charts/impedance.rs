//! The coil's impedance against frequency: |Z|, R and |X| (ohms) and Q, from 1 MHz to past the
//! self-resonance, on log–log axes, the field solution and the classical estimate side by
//! side, the operating frequency and the self-resonances marked.
//!
//! egui_plot draws linear axes, so the values are drawn as their base-10 logarithms and the
//! tick labels turn them back (1, 10, 100 … at the decades). The field solution's sweep comes
//! from the worker ([`crate::ui::field_worker`]); the classical curve is
//! [`crate::tuning::impedance::classical_impedance`] at the same frequencies.

use crate::recipe::{FieldBasis, Figures};
use crate::tuning::impedance::{DEFAULT_FROM, PAST_RESONANCE, classical_impedance};
use crate::tuning::measured_field::network_impedance;
use crate::ui::field_worker::FieldWorker;
use crate::units::{to_mhz, to_nh, to_pf};
use eframe::egui::{self, Color32, RichText};
use egui_plot::{Corner, GridMark, Legend, Line, LineStyle, Plot, PlotPoints, VLine};
use num_complex::Complex64;
use std::ops::RangeInclusive;

/// Accessible name of the ohms chart.
pub const IMPEDANCE_CHART_LABEL: &str = "impedance chart";
/// Accessible name of the Q chart.
pub const Q_CHART_LABEL: &str = "Q chart";
/// The note under the Q chart.
pub const Q_NOTE: &str = "Q is X/R where the coil is inductive. The field solution's R has the \
                          skin effect and radiation but not the crowding between turns, so its \
                          Q reads high.";
/// Frequencies drawn for the classical curve when there is no field sweep yet.
const CLASSICAL_POINTS: usize = 80;

/// Colours of the three impedance curves (|Z|, R, |X|) and Q.
const Z_COLOUR: Color32 = Color32::from_rgb(0x3a, 0x7b, 0xd5);
const R_COLOUR: Color32 = Color32::from_rgb(0xd0, 0x7a, 0x1c);
const X_COLOUR: Color32 = Color32::from_rgb(0x2f, 0x9e, 0x5b);
const Q_COLOUR: Color32 = Color32::from_rgb(0x8a, 0x5c, 0xc9);
const OPERATING_COLOUR: Color32 = Color32::from_rgb(0xc0, 0x39, 0x2b);

/// Decade labels for a log10 axis: "1", "10", "100", "1k" at whole decades, nothing between.
fn decade_label(mark: GridMark, _range: &RangeInclusive<f64>) -> String {
    let rounded = mark.value.round();
    if (mark.value - rounded).abs() > 1e-6 {
        return String::new();
    }
    let v = 10f64.powf(rounded);
    if v >= 1e6 {
        format!("{:.0}M", crate::units::to_megohm(v))
    } else if v >= 1e3 {
        format!("{:.0}k", crate::units::to_kohm(v))
    } else if v >= 1.0 {
        format!("{v:.0}")
    } else {
        format!("{v}")
    }
}

/// Hover text with the values turned back from their logarithms.
fn hover(name: &str, x: f64, y: f64, unit: &str) -> String {
    let head = if name.is_empty() {
        String::new()
    } else {
        format!("{name}\n")
    };
    format!(
        "{head}{:.4} MHz\n{:.4} {unit}",
        10f64.powf(x),
        10f64.powf(y)
    )
}

fn log_plot<'a>(id: &'a str, y_label: &'a str, unit: &'static str, height: f32) -> Plot<'a> {
    super::held_still(Plot::new(id))
        .height(height)
        .legend(
            Legend::default()
                .position(Corner::LeftTop)
                .text_style(egui::TextStyle::Small)
                .follow_insertion_order(true),
        )
        .x_axis_label("frequency (MHz)")
        .y_axis_label(y_label)
        .x_axis_formatter(decade_label)
        .y_axis_formatter(decade_label)
        .label_formatter(move |pos| {
            let (name, p) = match pos {
                egui_plot::HoverPosition::NearDataPoint {
                    plot_name,
                    position,
                    ..
                } => (*plot_name, *position),
                egui_plot::HoverPosition::Elsewhere { position } => ("", *position),
            };
            Some(hover(name, p.x, p.y, unit))
        })
}

/// One curve as (log10 MHz, log10 value) points, leaving out points with no finite logarithm.
fn log_points(frequencies: &[f64], value: impl Fn(usize) -> f64) -> PlotPoints<'static> {
    frequencies
        .iter()
        .enumerate()
        .filter_map(|(i, f)| {
            let v = value(i);
            (v.is_finite() && v > 0.0).then(|| [(to_mhz(*f)).log10(), v.log10()])
        })
        .collect()
}

/// The classical curve at `frequencies`, kept in the window's memory until the classical
/// model or the frequencies change, so an idle frame with the fold open computes nothing.
#[derive(Clone)]
struct ClassicalCurve {
    /// The model's figures and frequencies it was computed for.
    key: Vec<f64>,
    impedance: Vec<Complex64>,
}

fn classical_curve(
    ui: &egui::Ui,
    a: &crate::model::Analysis,
    frequencies: &[f64],
) -> Vec<Complex64> {
    let id = egui::Id::unique("tankwright classical impedance");
    let mut key = vec![
        a.total_inductance,
        a.self_capacitance,
        a.dc_resistance,
        a.ac_resistance,
        a.resonance,
        a.coil.length(),
    ];
    key.extend_from_slice(frequencies);
    if let Some(kept) = ui.data(|d| d.get_temp::<ClassicalCurve>(id))
        && kept.key == key
    {
        return kept.impedance;
    }
    let impedance: Vec<Complex64> = frequencies
        .iter()
        .map(|&f| classical_impedance(a, f))
        .collect();
    ui.data_mut(|d| {
        d.insert_temp(
            id,
            ClassicalCurve {
                key,
                impedance: impedance.clone(),
            },
        );
    });
    impedance
}

/// The section: a line saying what is drawn, the ohms chart and the Q chart. The classical
/// curve is the classical model alone ([`Figures::classical`]); the operating frequency is
/// the resonance that drives the figures (field-solved when the field solution leads).
pub fn impedance_section(ui: &mut egui::Ui, figures: Option<&Figures>, field: &FieldWorker) {
    let Some(figures) = figures else {
        ui.label("No coil: the input is refused (see the readouts).");
        return;
    };
    let a = &figures.classical;
    let result = field.ready();
    let sweep = result.and_then(|r| r.sweep.as_ref()?.as_ref().ok());
    let status = match (result, sweep) {
        (Some(_), Some(s)) => format!(
            "Field solution ({} segments) solid, classical estimate dashed.",
            s.segments
        ),
        (Some(r), None) => match &r.sweep {
            Some(Err(e)) => format!("Classical estimate only: {e}."),
            _ => "Classical estimate only while the field solution's sweep is computed.".to_owned(),
        },
        (None, _) => "Classical estimate only while the field solution is computed.".to_owned(),
    };
    ui.add(egui::Label::new(RichText::new(status).small()).wrap());

    // Frequencies: the field sweep's, else 1 MHz to past the lumped self-resonance.
    let frequencies: Vec<f64> = match sweep {
        Some(s) => s.points.iter().map(|p| p.frequency).collect(),
        None => {
            let to = PAST_RESONANCE * a.self_resonance.lumped.max(2.0 * DEFAULT_FROM);
            let step = (to / DEFAULT_FROM).ln() / (CLASSICAL_POINTS - 1) as f64;
            (0..CLASSICAL_POINTS)
                .map(|i| DEFAULT_FROM * (step * i as f64).exp())
                .collect()
        }
    };
    let classical = classical_curve(ui, a, &frequencies);
    let field_z: Option<Vec<Complex64>> =
        sweep.map(|s| s.points.iter().map(|p| p.impedance).collect());

    let operating = (to_mhz(figures.analysis.resonance)).log10();
    let operating_name = match (&figures.field, figures.calibrated()) {
        (_, true) => "operating frequency (calibrated)",
        (FieldBasis::Solved { .. }, false) => "operating frequency (field-solved)",
        (FieldBasis::Held { .. }, false) => "operating frequency (updating)",
        (FieldBasis::Classical { .. }, false) => "operating frequency (classical model)",
    };
    let field_srf = result
        .and_then(|r| r.tank.as_ref().ok())
        .map(|t| (to_mhz(t.self_resonance)).log10());
    let lumped_srf = (to_mhz(a.self_resonance.lumped)).log10();
    let height = (ui.available_width() * 0.5).clamp(150.0, 230.0);
    // A coil measurement kept with the recipe: its network over the band measured, and what
    // it says against the field solution of the coil as measured.
    let measured = figures.measured.as_ref();
    match measured {
        Some(Ok(m)) => {
            let seen = m
                .measured
                .self_resonance_seen
                .map(|f| format!(", reactance crossing zero at {:.1} MHz", to_mhz(f)))
                .unwrap_or_default();
            ui.add(
                egui::Label::new(
                    RichText::new(format!(
                        "Measured coil dotted: {:.1} nH, {:.3} pF{seen}; {:.3} × the field \
                         solution's inductance and {:.2} × its self-capacitance over the same \
                         band.",
                        to_nh(m.measured.inductance),
                        to_pf(m.measured.self_capacitance),
                        m.scale,
                        m.measured.self_capacitance / m.field.self_capacitance
                    ))
                    .small(),
                )
                .wrap(),
            );
        }
        Some(Err(reason)) => {
            ui.add(
                egui::Label::new(
                    RichText::new(format!("Measured coil not used: {reason}.")).small(),
                )
                .wrap(),
            );
        }
        None => {}
    }
    let measured_points: Option<Vec<(f64, Complex64)>> =
        measured.and_then(|m| m.as_ref().ok()).map(|m| {
            let (lo, hi) = m.band;
            let n = 60;
            (0..n)
                .map(|i| {
                    let f = lo * (hi / lo).powf(i as f64 / (n - 1) as f64);
                    (f, network_impedance(&m.measured, f))
                })
                .collect()
        });

    let markers = |plot_ui: &mut egui_plot::PlotUi<'_>| {
        plot_ui.vline(
            VLine::new(operating_name, operating)
                .color(OPERATING_COLOUR)
                .width(1.5),
        );
        if let Some(x) = field_srf {
            plot_ui.vline(
                VLine::new("self-resonance, field", x)
                    .color(Color32::GRAY)
                    .style(LineStyle::dotted_dense()),
            );
        }
        plot_ui.vline(
            VLine::new("self-resonance, lumped", lumped_srf)
                .color(Color32::GRAY)
                .style(LineStyle::dashed_loose()),
        );
    };

    let ohms = log_plot("tankwright impedance chart", "ohms", "ohm", height).show(ui, |plot_ui| {
        type Part = fn(&Complex64) -> f64;
        let parts: [(&str, Color32, Part); 3] = [
            ("|Z|", Z_COLOUR, |z| z.norm()),
            ("R", R_COLOUR, |z| z.re),
            ("|X|", X_COLOUR, |z| z.im.abs()),
        ];
        for (name, colour, part) in parts {
            if let Some(zs) = &field_z {
                plot_ui.line(
                    Line::new(
                        format!("{name} field"),
                        log_points(&frequencies, |i| part(&zs[i])),
                    )
                    .color(colour)
                    .width(1.8),
                );
            }
            plot_ui.line(
                Line::new(
                    format!("{name} classical"),
                    log_points(&frequencies, |i| part(&classical[i])),
                )
                .color(colour)
                .style(LineStyle::dashed_dense())
                .width(1.2),
            );
            if let Some(pts) = &measured_points {
                let freqs: Vec<f64> = pts.iter().map(|p| p.0).collect();
                let points = log_points(&freqs, |i| part(&pts[i].1));
                plot_ui.line(
                    Line::new(format!("{name} measured"), points)
                        .color(colour)
                        .style(LineStyle::dotted_dense())
                        .width(1.6),
                );
            }
        }
        markers(plot_ui);
    });
    ohms.response
        .widget_info(|| egui::WidgetInfo::labeled(egui::Role::Figure, true, IMPEDANCE_CHART_LABEL));

    let q = log_plot("tankwright q chart", "Q", "", 0.7 * height).show(ui, |plot_ui| {
        let quality = |z: &Complex64| z.im / z.re;
        if let Some(zs) = &field_z {
            plot_ui.line(
                Line::new("Q field", log_points(&frequencies, |i| quality(&zs[i])))
                    .color(Q_COLOUR)
                    .width(1.8),
            );
        }
        plot_ui.line(
            Line::new(
                "Q classical",
                log_points(&frequencies, |i| quality(&classical[i])),
            )
            .color(Q_COLOUR)
            .style(LineStyle::dashed_dense())
            .width(1.2),
        );
        markers(plot_ui);
    });
    q.response
        .widget_info(|| egui::WidgetInfo::labeled(egui::Role::Figure, true, Q_CHART_LABEL));
    ui.add(egui::Label::new(RichText::new(Q_NOTE).small().weak()).wrap());
}

//! How far the audio swings the carrier, and whether it stays on its channel: the junction
//! across the tank as a voltage-controlled capacitor, its deviation, distortion and bandwidth
//! judged against the service, and the drift budget with its verdict.
//!
//! Every figure is the engine's (`tuning::modulation`, `tuning::drift`, the same as
//! `evaluate --junction-…`); they are recomputed only when an input changes.

use crate::model::{Coil, Conditions, Tank};
use crate::physics::dielectric_class::{CLASSES, TemperatureClass};
use crate::physics::junction::JunctionLaw;
use crate::tuning::drift::{DriftBudget, DriftInputs, DriftTank, drift_budget};
use crate::tuning::modulation::{
    Modulation, ModulationInputs, ModulationVerdict, Modulator, Service, judge, modulation,
};
use eframe::egui;

/// Accessible name of the fixed capacitor's class picker.
pub const CLASS_LABEL: &str = "Fixed capacitor class";

/// The panel's inputs, in display units, and the last results.
pub struct AudioPanel {
    cj0_pf: f64,
    vj: f64,
    m: f64,
    bias_v: f64,
    audio_peak_v: f64,
    coupling_pf: f64,
    class: TemperatureClass,
    cached: Option<(Key, Results)>,
}

type Key = (Coil, Tank, Conditions, [f64; 6], &'static str, f64);

struct Results {
    modulation: Modulation,
    verdict: ModulationVerdict,
    drift: DriftBudget,
}

impl Default for AudioPanel {
    fn default() -> Self {
        // A small-signal VHF transistor's collector–base junction (common practice: a few pF
        // at zero bias, φ ≈ 0.75 V, m ≈ 0.33), biased at 4.5 V from a 9 V battery.
        Self {
            cj0_pf: 3.5,
            vj: 0.75,
            m: 0.33,
            bias_v: 4.5,
            audio_peak_v: 0.1,
            coupling_pf: 0.0,
            class: CLASSES[1],
            cached: None,
        }
    }
}

fn number(ui: &mut egui::Ui, label: &str, value: &mut f64, range: (f64, f64), suffix: &str) {
    let l = ui.label(label);
    ui.add(
        egui::DragValue::new(value)
            .range(range.0..=range.1)
            .speed(0.01)
            .max_decimals(3)
            .suffix(suffix),
    )
    .labelled_by(l.id);
    ui.end_row();
}

impl AudioPanel {
    /// Show the junction inputs, the modulation and the drift budget for `coil` in `tank`,
    /// judged against a channel `tolerance` (± hertz).
    pub fn show(
        &mut self,
        ui: &mut egui::Ui,
        coil: Option<&Coil>,
        tank: &Tank,
        conditions: &Conditions,
        tolerance: f64,
    ) {
        egui::Grid::new("tankwright junction inputs")
            .num_columns(2)
            .show(ui, |ui| {
                number(ui, "Junction Cj0", &mut self.cj0_pf, (0.1, 200.0), " pF");
                number(ui, "Junction potential", &mut self.vj, (0.2, 1.5), " V");
                number(ui, "Grading exponent", &mut self.m, (0.1, 0.9), "");
                number(ui, "Reverse bias", &mut self.bias_v, (0.0, 30.0), " V");
                number(ui, "Audio peak", &mut self.audio_peak_v, (0.0, 5.0), " V");
                number(
                    ui,
                    "Coupling capacitor",
                    &mut self.coupling_pf,
                    (0.0, 100.0),
                    " pF",
                );
                let l = ui.label(CLASS_LABEL);
                egui::ComboBox::from_id_salt("tankwright fixed class")
                    .selected_text(format!("{} ({})", self.class.code, self.class.trade_name))
                    .show_ui(ui, |ui| {
                        for c in CLASSES {
                            let text = format!("{} ({})", c.code, c.trade_name);
                            ui.selectable_value(&mut self.class, c, text);
                        }
                    })
                    .response
                    .labelled_by(l.id);
                ui.end_row();
            });
        ui.weak("Coupling 0 pF: the junction sits straight across the tank.");
        let Some(coil) = coil else {
            return;
        };
        let key: Key = (
            *coil,
            *tank,
            *conditions,
            [
                self.cj0_pf,
                self.vj,
                self.m,
                self.bias_v,
                self.audio_peak_v,
                self.coupling_pf,
            ],
            self.class.code,
            tolerance,
        );
        if self.cached.as_ref().is_none_or(|(k, _)| *k != key) {
            let modulator = Modulator {
                law: JunctionLaw::new(self.cj0_pf * 1e-12, self.vj, self.m),
                coupling: (self.coupling_pf > 0.0).then_some(self.coupling_pf * 1e-12),
            };
            let other = tank.external_capacitance();
            let m = modulation(
                coil,
                other,
                conditions,
                &ModulationInputs {
                    modulator,
                    bias_v: self.bias_v,
                    audio_peak_v: self.audio_peak_v,
                    audio_max_hz: 15e3,
                },
            );
            let verdict = judge(&m, Service::for_carrier(m.carrier));
            let drift = drift_budget(
                coil,
                &DriftTank {
                    fixed: tank.fixed,
                    other: other - tank.fixed,
                    junction: Some((modulator, self.bias_v)),
                },
                conditions,
                &DriftInputs {
                    supply_v: 9.0,
                    supply_change_v: -2.0,
                    temperature_change_k: 20.0,
                    fixed_class: self.class,
                    hand: 1e-12,
                    load: 0.5e-12,
                    channel_tolerance: tolerance,
                },
            );
            self.cached = Some((
                key,
                Results {
                    modulation: m,
                    verdict,
                    drift,
                },
            ));
        }
        let Some((_, r)) = &self.cached else {
            return;
        };
        let m = &r.modulation;
        let wrap = |ui: &mut egui::Ui, text: String| {
            ui.add(egui::Label::new(text).wrap());
        };
        wrap(
            ui,
            format!(
                "Carrier {:.3} MHz with the junction at {:.2} pF; deviation +{:.1} / −{:.1} kHz, \
                 {:.1} kHz per volt, second harmonic {:.2} %, Carson bandwidth {:.0} kHz.",
                m.carrier * 1e-6,
                m.junction_at_bias * 1e12,
                m.deviation_up * 1e-3,
                m.deviation_down * 1e-3,
                m.sensitivity * 1e-3,
                m.distortion * 100.0,
                m.carson_bandwidth * 1e-3
            ),
        );
        for advice in &r.verdict.advice {
            wrap(ui, advice.clone());
        }
        ui.add_space(4.0);
        ui.strong("Drift budget (9 V battery to 7 V, +20 K, a hand, a load)");
        egui::Grid::new("tankwright drift")
            .striped(true)
            .num_columns(2)
            .show(ui, |ui| {
                for line in &r.drift.lines {
                    ui.label(line.source.label());
                    ui.label(format!("{:+.1} kHz", line.shift * 1e-3));
                    ui.end_row();
                }
                ui.strong("worst case");
                ui.strong(format!("±{:.1} kHz", r.drift.worst_case * 1e-3));
                ui.end_row();
            });
        let verdict = if r.drift.within_tolerance {
            format!("Stays within ±{:.1} kHz of the channel.", tolerance * 1e-3)
        } else {
            format!(
                "Leaves the ±{:.1} kHz channel tolerance; the largest cause is {}.",
                tolerance * 1e-3,
                r.drift.dominant.map_or("unknown", |d| d.label())
            )
        };
        wrap(ui, verdict);
        for remedy in &r.drift.remedies {
            wrap(ui, format!("Remedy: {remedy}"));
        }
    }
}

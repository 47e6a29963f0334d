//! The oscillator stage round the tank (issue 25): its bias and transistor typed here, a small
//! schematic with the values on it, and the engine's figures and advice (`tuning::stage`, the
//! same function `tankwright stage` calls, on the tank the figures drive). The settings live
//! in the window, not in the recipe; they are recomputed only when an input or the tank
//! changes.

use super::stage_schematic::{self, Values};
use crate::model::{Coil, Conditions, Tank};
use crate::tuning::stage::{
    Bias, FREQUENCY_ACCURACY, RELIABLE_LOOP_GAIN, StageFigures, StageInputs, Start, Topology,
    Transistor, stage,
};
use eframe::egui;

/// The collapsible section holding the panel.
pub const SECTION: &str = "The oscillator stage";
/// Accessible names of the number fields.
pub const SUPPLY_LABEL: &str = "Stage supply";
/// Upper bias resistor field.
pub const UPPER_LABEL: &str = "Upper bias resistor";
/// Lower bias resistor field.
pub const LOWER_LABEL: &str = "Lower bias resistor";
/// Emitter resistor field.
pub const EMITTER_LABEL: &str = "Emitter resistor";
/// hFE field.
pub const HFE_LABEL: &str = "Current gain hFE";
/// Base–emitter capacitance field.
pub const CBE_LABEL: &str = "Base–emitter capacitance";
/// Base–collector capacitance field.
pub const CBC_LABEL: &str = "Base–collector capacitance";
/// Transit frequency field.
pub const FT_LABEL: &str = "Transit frequency";
/// Battery field.
pub const BATTERY_LABEL: &str = "Battery capacity";
/// The box a transistor's `.model` line is pasted into.
pub const MODEL_LABEL: &str = "Transistor .model text";
/// The button that reads it.
pub const USE_MODEL_BUTTON: &str = "Use this transistor model";
/// The button that goes back to the four figures.
pub const USE_FIGURES_BUTTON: &str = "Use the four figures";

/// What the user sets, in display units.
#[derive(Clone, Copy, Debug, PartialEq)]
struct Settings {
    topology: Topology,
    supply_v: f64,
    upper_ohm: f64,
    lower_ohm: f64,
    emitter_ohm: f64,
    hfe: f64,
    cbe_pf: f64,
    cbc_pf: f64,
    ft_mhz: f64,
    battery_mah: f64,
}

/// The panel's inputs and its last figures.
pub struct StagePanel {
    settings: Settings,
    model_text: String,
    /// The transistor read from the pasted line, when it is used instead of the figures.
    model: Option<Transistor>,
    /// Why the last pasted line was refused.
    model_error: Option<String>,
    cached: Option<(Key, Result<StageFigures, String>)>,
}

type Key = (Coil, Tank, Conditions, Settings, Option<Transistor>);

impl Default for StagePanel {
    fn default() -> Self {
        // The Lantern Hill club's bench stage (demo data): a 9 V battery, a 10 k / 10 k base
        // divider and 100 k in the emitter, a small VHF transistor's figures.
        Self {
            settings: Settings {
                topology: Topology::CommonBase,
                supply_v: 9.0,
                upper_ohm: 10e3,
                lower_ohm: 10e3,
                emitter_ohm: 100e3,
                hfe: 80.0,
                cbe_pf: 2.0,
                cbc_pf: 0.8,
                ft_mhz: 800.0,
                battery_mah: 500.0,
            },
            model_text: String::new(),
            model: None,
            model_error: None,
            cached: None,
        }
    }
}

fn number(
    ui: &mut egui::Ui,
    label: &str,
    value: &mut f64,
    range: (f64, f64),
    speed: f64,
    suffix: &str,
) {
    let l = ui.label(label);
    ui.add(
        egui::DragValue::new(value)
            .range(range.0..=range.1)
            .speed(speed)
            .max_decimals(3)
            .suffix(suffix),
    )
    .labelled_by(l.id);
    ui.end_row();
}

/// A resistance for the drawing: "47k", "1k2", "330".
fn ohms(r: f64) -> String {
    let trim = |v: f64| {
        let s = format!("{v:.2}");
        s.trim_end_matches('0').trim_end_matches('.').to_owned()
    };
    if r >= 1e6 {
        format!("{}M", trim(r / 1e6))
    } else if r >= 1e3 {
        format!("{}k", trim(r / 1e3))
    } else {
        trim(r)
    }
}

impl StagePanel {
    fn inputs(&self) -> StageInputs {
        let s = &self.settings;
        StageInputs {
            topology: s.topology,
            bias: Bias {
                supply_v: s.supply_v,
                upper: s.upper_ohm,
                lower: s.lower_ohm,
                emitter: s.emitter_ohm,
            },
            transistor: self.model.clone().unwrap_or_else(|| {
                Transistor::from_figures(s.hfe, s.cbe_pf * 1e-12, s.cbc_pf * 1e-12, s.ft_mhz * 1e6)
            }),
            battery_charge: Some(s.battery_mah * 3.6),
        }
    }

    fn transistor_ui(&mut self, ui: &mut egui::Ui) {
        let s = &mut self.settings;
        match &self.model {
            None => {
                egui::Grid::new("tankwright stage transistor")
                    .num_columns(2)
                    .show(ui, |ui| {
                        number(ui, HFE_LABEL, &mut s.hfe, (5.0, 2000.0), 1.0, "");
                        number(ui, CBE_LABEL, &mut s.cbe_pf, (0.0, 1000.0), 0.05, " pF");
                        number(ui, CBC_LABEL, &mut s.cbc_pf, (0.0, 100.0), 0.02, " pF");
                        number(ui, FT_LABEL, &mut s.ft_mhz, (10.0, 100_000.0), 10.0, " MHz");
                    });
            }
            Some(t) => {
                let mut text = format!(
                    "Transistor from the model {}: hFE {:.0}, IS {:.2e} A, TF {:.0} ps.",
                    t.name.as_deref().unwrap_or("?"),
                    t.beta,
                    t.saturation_current,
                    t.transit_time * 1e12
                );
                if !t.unused.is_empty() {
                    text.push_str(&format!(" Not used: {}.", t.unused.join(", ")));
                }
                ui.add(egui::Label::new(text).wrap());
                if ui.button(USE_FIGURES_BUTTON).clicked() {
                    self.model = None;
                }
            }
        }
        egui::CollapsingHeader::new("Paste a transistor's SPICE .model line")
            .default_open(false)
            .show(ui, |ui| {
                let l = ui.label(MODEL_LABEL);
                ui.add(
                    egui::TextEdit::multiline(&mut self.model_text)
                        .hint_text(".model NAME NPN(IS=… BF=… CJE=… CJC=… TF=…)")
                        .desired_rows(3)
                        .desired_width(f32::INFINITY)
                        .font(egui::TextStyle::Monospace),
                )
                .labelled_by(l.id);
                if ui.button(USE_MODEL_BUTTON).clicked() {
                    match Transistor::from_model(&self.model_text) {
                        Ok(t) => {
                            self.model = Some(t);
                            self.model_error = None;
                        }
                        Err(e) => {
                            self.model_error = Some(format!(
                                "Not read: {e}. The transistor is unchanged; the text is kept \
                                 for correcting."
                            ));
                        }
                    }
                }
                if let Some(e) = &self.model_error {
                    let colour = ui.visuals().error_fg_color;
                    ui.add(egui::Label::new(egui::RichText::new(e).color(colour)).wrap());
                }
            });
    }

    /// Show the stage's inputs, its schematic and its figures for `coil` in `tank` at
    /// `conditions` (the tank the figures drive).
    pub fn show(
        &mut self,
        ui: &mut egui::Ui,
        coil: Option<&Coil>,
        tank: &Tank,
        conditions: &Conditions,
    ) {
        let s = &mut self.settings;
        ui.horizontal(|ui| {
            for t in Topology::ALL {
                ui.selectable_value(&mut s.topology, t, t.label());
            }
        });
        egui::Grid::new("tankwright stage bias")
            .num_columns(2)
            .show(ui, |ui| {
                number(ui, SUPPLY_LABEL, &mut s.supply_v, (0.5, 30.0), 0.05, " V");
                number(ui, UPPER_LABEL, &mut s.upper_ohm, (1.0, 10e6), 50.0, " Ω");
                number(ui, LOWER_LABEL, &mut s.lower_ohm, (1.0, 10e6), 50.0, " Ω");
                number(
                    ui,
                    EMITTER_LABEL,
                    &mut s.emitter_ohm,
                    (1.0, 10e6),
                    50.0,
                    " Ω",
                );
                number(
                    ui,
                    BATTERY_LABEL,
                    &mut s.battery_mah,
                    (1.0, 1e6),
                    10.0,
                    " mAh",
                );
            });
        self.transistor_ui(ui);
        let Some(coil) = coil else {
            return;
        };
        let key: Key = (*coil, *tank, *conditions, self.settings, self.model.clone());
        if self.cached.as_ref().is_none_or(|(k, _)| *k != key) {
            let figures = stage(coil, tank, conditions, &self.inputs()).map_err(|e| e.to_string());
            self.cached = Some((key, figures));
        }
        let s = self.settings;
        let own = tank.fixed + tank.trimmer_at(tank.trimmer_setting) + tank.stray;
        let (c_upper, c_lower) = tank.feedback.map_or((String::new(), String::new()), |d| {
            (
                format!("{:.1} pF", d.upper * 1e12),
                format!("{:.1} pF", d.lower * 1e12),
            )
        });
        stage_schematic::draw(
            ui,
            s.topology,
            &Values {
                supply: format!("{} V", s.supply_v),
                upper: ohms(s.upper_ohm),
                lower: ohms(s.lower_ohm),
                emitter: ohms(s.emitter_ohm),
                c_upper,
                c_lower,
                tank: format!("{:.1} pF", own * 1e12),
                coil: format!("{} t", coil.turns()),
            },
        );
        let Some((_, figures)) = &self.cached else {
            return;
        };
        match figures {
            Err(e) => {
                let colour = ui.visuals().error_fg_color;
                ui.add(egui::Label::new(egui::RichText::new(e).color(colour)).wrap());
            }
            Ok(f) => figures_ui(ui, f, s.battery_mah),
        }
    }
}

/// The figures, one line each, and the advice.
fn figures_ui(ui: &mut egui::Ui, f: &StageFigures, battery_mah: f64) {
    let op = &f.operating_point;
    let mut line = |text: String| {
        ui.add(egui::Label::new(text).wrap());
    };
    line(format!(
        "Loop gain {:.2}: {} (the trade asks {RELIABLE_LOOP_GAIN:.0} or more, common practice)",
        f.loop_gain,
        f.start.label()
    ));
    line(format!(
        "Collector {:.3} mA at {:.2} V collector–emitter{}",
        op.collector_current * 1e3,
        op.collector_emitter_v,
        if f.active {
            ""
        } else {
            ", not in the active region"
        }
    ));
    for fault in &f.rating_faults {
        line(format!("Rating: {fault}"));
    }
    let accuracy = if f.start == Start::TooHard {
        "a hard start runs further off".to_owned()
    } else {
        format!("within about {:.1} %", FREQUENCY_ACCURACY * 100.0)
    };
    line(format!(
        "Runs at {:.3} MHz ({accuracy}); the tank alone {:.3} MHz: pulled {:+.0} kHz",
        f.frequency * 1e-6,
        f.tank_frequency * 1e-6,
        f.pulling * 1e-3
    ));
    line(format!(
        "Base–collector junction {:.2} pF ({:.1} % of the tank): {:+.1} kHz per volt",
        f.junction.capacitance * 1e12,
        f.junction.share * 100.0,
        f.junction.hz_per_volt * 1e-3
    ));
    let hours = f.battery_life.map_or(0.0, |t| t / 3600.0);
    line(format!(
        "Supply {:.3} mA: a {battery_mah:.0} mAh battery lasts about {hours:.0} hours",
        f.supply_current * 1e3
    ));
    line(format!("Advice: {}", f.advice));
}

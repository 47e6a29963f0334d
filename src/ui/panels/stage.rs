//! The oscillator stage round the tank (issue 25): its bias and transistor typed here, a small
//! schematic with the values on it, and the engine's figures and advice (`tuning::stage`, the
//! same function `tankwright stage` calls, on the tank the figures drive). The settings are
//! the recipe's (`Recipe::stage`, saved with it; the demo stage is shown until the first
//! change sets them); the figures are recomputed only when a setting or the tank changes.

use super::stage_schematic::{self, Values};
use crate::model::{Coil, Conditions, Tank};
use crate::tuning::stage::settings::{CBC_RANGE_F, CBE_RANGE_F, CLAPP_RANGE_F, FT_RANGE_HZ};
use crate::tuning::stage::transistor::BETA_RANGE;
use crate::tuning::stage::{
    BATTERY_RANGE_MAH, RELIABLE_LOOP_GAIN, RESISTOR_RANGE_OHM, SUPPLY_RANGE_V, StageFigures,
    StageSettings, Start, Topology, Transistor, TransistorSpec, frequency_accuracy, stage,
};
use crate::units;
use crate::units::{to_khz, to_kohm, to_ma, to_megohm, to_mhz, to_pf, to_ps};
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

/// Clapp capacitor field (common collector).
pub const CLAPP_LABEL: &str = "Clapp series capacitor";
/// The switch that puts a Clapp capacitor in the common-collector stage.
pub const CLAPP_SWITCH: &str = "Clapp series capacitor in the tank's branch";

/// The panel's pasted text, its last refusal and its last figures; the settings themselves
/// live in the recipe (`Recipe::stage`), so they are saved with it.
#[derive(Default)]
pub struct StagePanel {
    model_text: String,
    /// Why the last pasted line was refused.
    model_error: Option<String>,
    cached: Option<(Key, Result<StageFigures, String>)>,
}

type Key = (Coil, Tank, Conditions, StageSettings);

/// A number field showing an SI value in a display `unit` (its two conversions):
/// the SI value is written back only when the field was changed, so a value is never rounded
/// by merely being shown.
#[expect(
    clippy::too_many_arguments,
    reason = "one row of a grid: its label, value, range, display unit, step and suffix"
)]
fn number(
    ui: &mut egui::Ui,
    label: &str,
    value: &mut f64,
    range: (f64, f64),
    unit: units::Pair,
    speed: f64,
    suffix: &str,
    changed: &mut bool,
) {
    let l = ui.label(label);
    let (to, from) = unit;
    let mut shown = to(*value);
    let r = crate::ui::widgets::steady(ui, label, |ui| {
        ui.add(
            egui::DragValue::new(&mut shown)
                .range(to(range.0)..=to(range.1))
                .speed(speed)
                .max_decimals(3)
                .suffix(suffix),
        )
        .labelled_by(l.id)
    });
    if r.changed() {
        *value = from(shown);
        *changed = true;
    }
    ui.end_row();
}

/// A resistance for the drawing: "47k", "1k2", "330".
fn ohms(r: f64) -> String {
    let trim = |v: f64| {
        let s = format!("{v:.2}");
        s.trim_end_matches('0').trim_end_matches('.').to_owned()
    };
    if r >= 1e6 {
        format!("{}M", trim(to_megohm(r)))
    } else if r >= 1e3 {
        format!("{}k", trim(to_kohm(r)))
    } else {
        trim(r)
    }
}

impl StagePanel {
    fn transistor_ui(
        &mut self,
        ui: &mut egui::Ui,
        settings: &mut StageSettings,
        changed: &mut bool,
    ) {
        match &mut settings.transistor {
            TransistorSpec::Figures { hfe, cbe, cbc, ft } => {
                egui::Grid::new("tankwright stage transistor")
                    .num_columns(2)
                    .show(ui, |ui| {
                        number(
                            ui,
                            HFE_LABEL,
                            hfe,
                            BETA_RANGE,
                            units::AS_SI,
                            1.0,
                            "",
                            changed,
                        );
                        number(
                            ui,
                            CBE_LABEL,
                            cbe,
                            CBE_RANGE_F,
                            units::PF,
                            0.05,
                            " pF",
                            changed,
                        );
                        number(
                            ui,
                            CBC_LABEL,
                            cbc,
                            CBC_RANGE_F,
                            units::PF,
                            0.02,
                            " pF",
                            changed,
                        );
                        number(
                            ui,
                            FT_LABEL,
                            ft,
                            FT_RANGE_HZ,
                            units::MHZ,
                            10.0,
                            " MHz",
                            changed,
                        );
                    });
            }
            TransistorSpec::Model(text) => {
                match Transistor::from_model(text) {
                    Ok(t) => {
                        let mut line = format!(
                            "Transistor from the model {}: hFE {:.0}, IS {:.2e} A, TF {:.0} ps.",
                            t.name.as_deref().unwrap_or("?"),
                            t.beta,
                            t.saturation_current,
                            to_ps(t.transit_time)
                        );
                        if !t.unused.is_empty() {
                            line.push_str(&format!(" Not used: {}.", t.unused.join(", ")));
                        }
                        ui.add(egui::Label::new(line).wrap());
                    }
                    Err(e) => {
                        let colour = ui.visuals().error_fg_color;
                        ui.add(
                            egui::Label::new(
                                egui::RichText::new(format!("The recipe's model line: {e}"))
                                    .color(colour),
                            )
                            .wrap(),
                        );
                    }
                }
                if ui.button(USE_FIGURES_BUTTON).clicked() {
                    settings.transistor = StageSettings::default().transistor;
                    *changed = true;
                }
            }
        }
        egui::CollapsingHeader::new("Paste a transistor's SPICE .model line")
            .default_open(false)
            .show(ui, |ui| {
                let l = ui.label(MODEL_LABEL);
                ui.add(
                    egui::TextEdit::multiline(&mut self.model_text)
                        .id_salt("stage_model_line")
                        .hint_text(".model NAME NPN(IS=… BF=… CJE=… CJC=… TF=…)")
                        .desired_rows(3)
                        .desired_width(f32::INFINITY)
                        .font(egui::TextStyle::Monospace),
                )
                .labelled_by(l.id);
                if ui.button(USE_MODEL_BUTTON).clicked() {
                    match Transistor::from_model(&self.model_text) {
                        Ok(_) => {
                            settings.transistor = TransistorSpec::Model(self.model_text.clone());
                            self.model_error = None;
                            *changed = true;
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

    /// Show the stage's inputs (the recipe's `stage`, the demo stage until one is set: set
    /// there on the first change), its schematic and its figures for `coil` in `tank` at
    /// `conditions` (the tank the figures drive).
    pub fn show(
        &mut self,
        ui: &mut egui::Ui,
        kept: &mut Option<StageSettings>,
        coil: Option<&Coil>,
        tank: &Tank,
        conditions: &Conditions,
    ) {
        let mut s = kept.clone().unwrap_or_default();
        let mut changed = false;
        ui.horizontal(|ui| {
            for t in Topology::ALL {
                changed |= ui.selectable_value(&mut s.topology, t, t.label()).changed();
            }
        });
        let c = &mut changed;
        egui::Grid::new("tankwright stage bias")
            .num_columns(2)
            .show(ui, |ui| {
                let b = &mut s.bias;
                number(
                    ui,
                    SUPPLY_LABEL,
                    &mut b.supply_v,
                    SUPPLY_RANGE_V,
                    units::AS_SI,
                    0.05,
                    " V",
                    c,
                );
                let r = RESISTOR_RANGE_OHM;
                number(
                    ui,
                    UPPER_LABEL,
                    &mut b.upper,
                    r,
                    units::AS_SI,
                    50.0,
                    " Ω",
                    c,
                );
                number(
                    ui,
                    LOWER_LABEL,
                    &mut b.lower,
                    r,
                    units::AS_SI,
                    50.0,
                    " Ω",
                    c,
                );
                number(
                    ui,
                    EMITTER_LABEL,
                    &mut b.emitter,
                    r,
                    units::AS_SI,
                    50.0,
                    " Ω",
                    c,
                );
                let mut charge = s.battery_charge.unwrap_or(units::from_mah(500.0));
                let before = charge;
                let range = (
                    units::from_mah(BATTERY_RANGE_MAH.0),
                    units::from_mah(BATTERY_RANGE_MAH.1),
                );
                number(
                    ui,
                    BATTERY_LABEL,
                    &mut charge,
                    range,
                    units::MAH,
                    10.0,
                    " mAh",
                    c,
                );
                if charge != before {
                    s.battery_charge = Some(charge);
                }
            });
        if s.topology == Topology::CommonCollector {
            let mut on = s.clapp.is_some();
            if ui.checkbox(&mut on, CLAPP_SWITCH).changed() {
                s.clapp = on.then_some(units::from_pf(10.0));
                changed = true;
            }
            if let Some(cs) = &mut s.clapp {
                egui::Grid::new("tankwright stage clapp")
                    .num_columns(2)
                    .show(ui, |ui| {
                        number(
                            ui,
                            CLAPP_LABEL,
                            cs,
                            CLAPP_RANGE_F,
                            units::PF,
                            0.1,
                            " pF",
                            &mut changed,
                        );
                    });
            }
        } else if s.clapp.is_some() {
            // Leaving the common-collector stage takes its Clapp capacitor out.
            s.clapp = None;
            changed = true;
        }
        self.transistor_ui(ui, &mut s, &mut changed);
        if changed {
            *kept = Some(s.clone());
        }
        let Some(coil) = coil else {
            return;
        };
        let key: Key = (*coil, *tank, *conditions, s.clone());
        if self.cached.as_ref().is_none_or(|(k, _)| *k != key) {
            let figures = s
                .inputs()
                .and_then(|i| stage(coil, tank, conditions, &i))
                .map_err(|e| e.to_string());
            self.cached = Some((key, figures));
        }
        let own = tank.fixed + tank.trimmer_at(tank.trimmer_setting) + tank.stray;
        let (c_upper, c_lower) = tank.feedback.map_or((String::new(), String::new()), |d| {
            (
                format!("{:.1} pF", to_pf(d.upper)),
                format!("{:.1} pF", to_pf(d.lower)),
            )
        });
        let b = &s.bias;
        stage_schematic::draw(
            ui,
            s.topology,
            &Values {
                supply: format!("{} V", b.supply_v),
                upper: ohms(b.upper),
                lower: ohms(b.lower),
                emitter: ohms(b.emitter),
                c_upper,
                c_lower,
                tank: format!("{:.1} pF", to_pf(own)),
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
            Ok(f) => figures_ui(ui, f, s.battery_charge.map_or(0.0, units::to_mah)),
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
        to_ma(op.collector_current),
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
        format!(
            "within about {:.1} %",
            frequency_accuracy(f.topology) * 100.0
        )
    };
    line(format!(
        "Runs at {:.3} MHz ({accuracy}); the tank alone {:.3} MHz: pulled {:+.0} kHz",
        to_mhz(f.frequency),
        to_mhz(f.tank_frequency),
        to_khz(f.pulling)
    ));
    line(format!(
        "Base–collector junction {:.2} pF ({:.1} % of the tank): {:+.1} kHz per volt",
        to_pf(f.junction.capacitance),
        f.junction.share * 100.0,
        to_khz(f.junction.hz_per_volt)
    ));
    let hours = f.battery_life.map_or(0.0, |t| t / 3600.0);
    line(format!(
        "Supply {:.3} mA: a {battery_mah:.0} mAh battery lasts about {hours:.0} hours",
        to_ma(f.supply_current)
    ));
    line(format!("Advice: {}", f.advice));
}

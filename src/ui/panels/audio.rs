//! How far the audio swings the carrier, and whether it stays on its channel: the junction
//! across the tank as a voltage-controlled capacitor, its deviation, distortion and bandwidth
//! judged against the service, and the drift budget with its verdict.
//!
//! Every figure is the engine's (`tuning::modulation`, `tuning::drift`, the same as
//! `evaluate --junction-…`); they are recomputed only when an input changes.

use crate::model::{Coil, Conditions, Tank};
use crate::physics::dielectric_class::{CLASSES, TemperatureClass};
use crate::physics::junction::{DEFAULT_FORWARD_KNEE, JunctionLaw};
use crate::tuning::drift::{
    DriftBudget, DriftInputs, DriftSource, DriftTank, UsualChanges, drift_budget,
};
use crate::tuning::modulation::{
    Modulation, ModulationInputs, ModulationVerdict, Modulator, Service, judge, modulation,
};
use crate::tuning::spice_model::{DeviceType, JunctionModel, parse_model};
use eframe::egui;

/// Accessible name of the fixed capacitor's class picker.
pub const CLASS_LABEL: &str = "Fixed capacitor class";
/// Accessible name of the box a SPICE `.model` line is pasted into.
pub const MODEL_TEXT_LABEL: &str = "SPICE .model text";
/// The button that reads the pasted `.model` line into the junction's fields.
pub const USE_MODEL_BUTTON: &str = "Use this model";
/// The collapsible section holding the paste box.
pub const PASTE_SECTION: &str = "Paste a SPICE .model line";
/// The field of the RF peak across the tank (it swings the junction beside the audio).
pub const RF_PEAK_LABEL: &str = "RF peak across the tank";
/// The switch that puts the junction at its bias in the tank of every figure.
pub const COUNT_JUNCTION: &str = "Count the junction in the tank";

/// The junction fields' ranges (what a pasted model must fall in): Cj0 in pF, φ in volts, m.
const CJ0_PF_RANGE: (f64, f64) = (0.1, 1000.0);
const VJ_RANGE: (f64, f64) = (0.1, 3.0);
const M_RANGE: (f64, f64) = (0.05, 4.0);

/// What the user sets in the panel, in display units.
#[derive(Clone, Copy, Debug, PartialEq)]
struct Settings {
    cj0_pf: f64,
    vj: f64,
    m: f64,
    /// SPICE's FC, from a pasted model (else SPICE's default).
    forward_knee: f64,
    bias_v: f64,
    audio_peak_v: f64,
    /// The RF peak across the tank, volts (it swings the junction beside the audio).
    rf_peak_v: f64,
    audio_max_khz: f64,
    coupling_pf: f64,
    class: TemperatureClass,
    supply_v: f64,
    supply_change_v: f64,
    temperature_change_k: f64,
    hand_pf: f64,
    load_pf: f64,
    /// The junction at its bias is part of the tank for every figure of the window (the
    /// readouts, verdict, advice and charts), as `evaluate --junction-…` counts it.
    in_tank: bool,
}

/// The panel's inputs and the last results.
pub struct AudioPanel {
    settings: Settings,
    /// The `.model` text as typed or pasted (never cleared by the panel).
    model_text: String,
    /// What became of the last "Use this model": a summary, or why it was refused.
    model_note: Option<Result<String, String>>,
    /// The highest audio frequency was typed: it no longer follows the service's.
    audio_max_typed: bool,
    cached: Option<(Key, Results)>,
}

type Key = (Coil, Tank, Conditions, Settings, f64);

struct Results {
    modulation: Modulation,
    service: Service,
    verdict: ModulationVerdict,
    drift: DriftBudget,
}

impl Default for AudioPanel {
    fn default() -> Self {
        // A small-signal VHF transistor's collector–base junction (common practice: a few pF
        // at zero bias, φ ≈ 0.75 V, m ≈ 0.33), biased at 4.5 V from a 9 V battery; the drift
        // budget's changes: the battery running down to 7 V, 20 K warmer, a hand (1 pF) and a
        // load change (0.5 pF) near the coil (common practice).
        Self {
            settings: Settings {
                cj0_pf: 3.5,
                vj: 0.75,
                m: 0.33,
                forward_knee: DEFAULT_FORWARD_KNEE,
                bias_v: 4.5,
                audio_peak_v: 0.1,
                rf_peak_v: crate::tuning::modulation::TANK_RF_PEAK_V,
                audio_max_khz: 15.0,
                coupling_pf: 0.0,
                class: crate::physics::dielectric_class::by_name(UsualChanges::CLASS)
                    .unwrap_or(CLASSES[1]),
                supply_v: UsualChanges::SUPPLY_V,
                supply_change_v: UsualChanges::SUPPLY_CHANGE_V,
                temperature_change_k: UsualChanges::TEMPERATURE_CHANGE_K,
                hand_pf: UsualChanges::HAND * 1e12,
                load_pf: UsualChanges::LOAD * 1e12,
                in_tank: false,
            },
            model_text: String::new(),
            model_note: None,
            audio_max_typed: false,
            cached: None,
        }
    }
}

fn number(ui: &mut egui::Ui, label: &str, value: &mut f64, range: (f64, f64), suffix: &str) {
    let l = ui.label(label);
    crate::ui::widgets::steady(ui, label, |ui| {
        ui.add(
            egui::DragValue::new(value)
                .range(range.0..=range.1)
                .speed(0.01)
                .max_decimals(3)
                .suffix(suffix),
        )
        .labelled_by(l.id)
    });
    ui.end_row();
}

/// `value` inside `range`, or a sentence saying it is not.
fn in_range(name: &str, value: f64, range: (f64, f64), unit: &str) -> Result<(), String> {
    if (range.0..=range.1).contains(&value) {
        Ok(())
    } else {
        Err(format!(
            "{name} = {}{unit} is outside the {}–{}{unit} the junction fields take",
            short(value),
            range.0,
            range.1
        ))
    }
}

/// A number to four decimals without trailing zeros ("12.5", "2000").
fn short(value: f64) -> String {
    let text = format!("{value:.4}");
    text.trim_end_matches('0').trim_end_matches('.').to_owned()
}

/// Check a parsed model against the fields' ranges and describe it in a sentence.
fn describe(model: &JunctionModel) -> Result<String, String> {
    let law = &model.law;
    let (cj, vj, m, what) = match model.device {
        DeviceType::Diode => ("CJO", "VJ", "M", "diode"),
        DeviceType::Npn => (
            "CJC",
            "VJC",
            "MJC",
            "NPN transistor, collector–base junction",
        ),
        DeviceType::Pnp => (
            "CJC",
            "VJC",
            "MJC",
            "PNP transistor, collector–base junction",
        ),
    };
    in_range(cj, law.cj0 * 1e12, CJ0_PF_RANGE, " pF")?;
    in_range(vj, law.contact_potential, VJ_RANGE, " V")?;
    in_range(m, law.grading, M_RANGE, "")?;
    let mut text = format!(
        "Read {} ({what}): Cj0 {} pF, potential {} V, exponent {}, FC {}.",
        model.name,
        short(law.cj0 * 1e12),
        short(law.contact_potential),
        short(law.grading),
        short(law.forward_knee)
    );
    if !model.defaulted.is_empty() {
        text.push_str(&format!(
            " Not given, SPICE's default used: {}.",
            model.defaulted.join(", ")
        ));
    }
    if model.ignored.is_empty() {
        text.push_str(" No other parameters.");
    } else {
        text.push_str(&format!(
            " Ignored (no part in the capacitance law): {}.",
            model.ignored.join(", ")
        ));
    }
    Ok(text)
}

impl Settings {
    fn modulator(&self) -> Modulator {
        Modulator {
            law: JunctionLaw {
                forward_knee: self.forward_knee,
                ..JunctionLaw::new(self.cj0_pf * 1e-12, self.vj, self.m)
            },
            coupling: (self.coupling_pf > 0.0).then_some(self.coupling_pf * 1e-12),
        }
    }

    fn inputs(&self) -> ModulationInputs {
        ModulationInputs {
            modulator: self.modulator(),
            bias_v: self.bias_v,
            audio_peak_v: self.audio_peak_v,
            audio_max_hz: self.audio_max_khz * 1e3,
            rf_peak_v: self.rf_peak_v,
        }
    }
}

impl AudioPanel {
    /// The junction, its bias and the audio as the engine takes them (the charts use these).
    pub fn inputs(&self) -> ModulationInputs {
        self.settings.inputs()
    }

    /// The junction and its bias when it is counted in the tank of every figure (the switch
    /// [`COUNT_JUNCTION`]); the window puts it there with
    /// [`crate::tuning::modulation::tank_with_junction`].
    pub fn junction_in_tank(&self) -> Option<(Modulator, f64)> {
        let s = &self.settings;
        s.in_tank.then(|| (s.modulator(), s.bias_v))
    }

    /// `tank` (as the figures drive it) without the junction this panel counted in it: what
    /// the modulation's figures and charts take as the rest of the tank.
    pub fn without_junction(&self, tank: &Tank) -> Tank {
        match self.junction_in_tank() {
            Some((m, bias)) => Tank {
                stray: tank.stray - m.across_tank(bias),
                ..*tank
            },
            None => *tank,
        }
    }

    /// Read the pasted `.model` text into the junction's fields, or say why not (the text and
    /// the fields are left as they were).
    fn use_model(&mut self) {
        let read = parse_model(&self.model_text)
            .map_err(|e| e.to_string())
            .and_then(|model| describe(&model).map(|text| (model.law, text)));
        self.model_note = Some(match read {
            Ok((law, text)) => {
                let s = &mut self.settings;
                s.cj0_pf = law.cj0 * 1e12;
                s.vj = law.contact_potential;
                s.m = law.grading;
                s.forward_knee = law.forward_knee;
                Ok(text)
            }
            Err(e) => Err(format!(
                "Not read: {e}. The junction's fields are unchanged; the text is kept for \
                 correcting."
            )),
        });
    }

    /// The paste box, its button and what became of the last attempt.
    fn paste_ui(&mut self, ui: &mut egui::Ui) {
        egui::CollapsingHeader::new(PASTE_SECTION)
            .default_open(false)
            .show(ui, |ui| {
                let l = ui.label(MODEL_TEXT_LABEL);
                ui.add(
                    egui::TextEdit::multiline(&mut self.model_text)
                        .id_salt("junction_model_line")
                        .hint_text(".model NAME D(CJO=… VJ=… M=…)")
                        .desired_rows(3)
                        .desired_width(f32::INFINITY)
                        .font(egui::TextStyle::Monospace),
                )
                .labelled_by(l.id);
                ui.weak(
                    "A diode (CJO, VJ, M) or a transistor's collector–base junction (CJC, VJC, \
                     MJC); lines starting with + continue it.",
                );
                if ui.button(USE_MODEL_BUTTON).clicked() {
                    self.use_model();
                }
                match &self.model_note {
                    Some(Ok(text)) => {
                        ui.add(egui::Label::new(text.as_str()).wrap());
                    }
                    Some(Err(text)) => {
                        let colour = ui.visuals().error_fg_color;
                        ui.add(
                            egui::Label::new(egui::RichText::new(text.as_str()).color(colour))
                                .wrap(),
                        );
                    }
                    None => {}
                }
            });
    }

    /// Show the junction inputs, the modulation and the drift budget for `coil` in `tank`
    /// (everything but the junction: [`without_junction`](Self::without_junction)), judged
    /// against a channel `tolerance` (± hertz).
    pub fn show(
        &mut self,
        ui: &mut egui::Ui,
        coil: Option<&Coil>,
        tank: &Tank,
        conditions: &Conditions,
        tolerance: f64,
    ) {
        let s = &mut self.settings;
        egui::Grid::new("tankwright junction inputs")
            .num_columns(2)
            .show(ui, |ui| {
                number(ui, "Junction Cj0", &mut s.cj0_pf, CJ0_PF_RANGE, " pF");
                number(ui, "Junction potential", &mut s.vj, VJ_RANGE, " V");
                number(ui, "Grading exponent", &mut s.m, M_RANGE, "");
                number(ui, "Reverse bias", &mut s.bias_v, (0.0, 30.0), " V");
                number(ui, "Audio peak", &mut s.audio_peak_v, (0.0, 5.0), " V");
                number(ui, RF_PEAK_LABEL, &mut s.rf_peak_v, (0.0, 50.0), " V");
                let before = s.audio_max_khz;
                number(
                    ui,
                    "Highest audio frequency",
                    &mut s.audio_max_khz,
                    (0.1, 100.0),
                    " kHz",
                );
                // Typed: kept; untouched: the service's (set below once the carrier is known).
                if s.audio_max_khz != before {
                    self.audio_max_typed = true;
                }
                number(
                    ui,
                    "Coupling capacitor",
                    &mut s.coupling_pf,
                    (0.0, 100.0),
                    " pF",
                );
            });
        ui.weak("Coupling 0 pF: the junction sits straight across the tank.");
        ui.checkbox(&mut s.in_tank, COUNT_JUNCTION).on_hover_text(
            "On: the junction's capacitance at its bias joins the tank for every figure (the \
             readouts, verdict, advice and charts), as evaluate --junction-… counts it. Off: \
             the figures are the tank as entered, and the carrier below adds the junction to it.",
        );
        if s.in_tank {
            ui.weak("The readouts, verdict, advice and charts include the junction at its bias.");
        } else {
            ui.weak(
                "Not counted: the readouts and verdict are the tank as entered, without the \
                 junction; the carrier below adds it.",
            );
        }
        // A bias the supply cannot give is said, never taken silently.
        if let Some(why) = crate::tuning::modulation::bias_beyond_supply(
            self.settings.bias_v,
            self.settings.audio_peak_v,
            self.settings.supply_v,
        ) {
            ui.add(
                egui::Label::new(egui::RichText::new(why).color(crate::ui::theme::caution(ui)))
                    .wrap(),
            );
        }
        self.paste_ui(ui);
        let Some(coil) = coil else {
            return;
        };
        let key: Key = (*coil, *tank, *conditions, self.settings, tolerance);
        if self.cached.as_ref().is_none_or(|(k, _)| *k != key) {
            let other = tank.external_capacitance();
            let mut m = modulation(coil, other, conditions, &self.settings.inputs());
            let service = Service::for_carrier(m.carrier);
            // Until it is typed, the highest audio frequency is the service's (2 m voice
            // 3 kHz, broadcast 15 kHz); the carrier does not depend on it.
            let own = service.audio_max() * 1e-3;
            if !self.audio_max_typed && self.settings.audio_max_khz != own {
                self.settings.audio_max_khz = own;
                m = modulation(coil, other, conditions, &self.settings.inputs());
            }
            let key: Key = (*coil, *tank, *conditions, self.settings, tolerance);
            let s = &self.settings;
            let inputs = s.inputs();
            let verdict = judge(&m, service);
            let drift = drift_budget(
                coil,
                &DriftTank {
                    fixed: tank.fixed,
                    other: other - tank.fixed,
                    junction: Some((inputs.modulator, s.bias_v)),
                },
                conditions,
                &DriftInputs {
                    supply_v: s.supply_v,
                    supply_change_v: s.supply_change_v,
                    temperature_change_k: s.temperature_change_k,
                    fixed_class: s.class,
                    hand: s.hand_pf * 1e-12,
                    load: s.load_pf * 1e-12,
                    channel_tolerance: tolerance,
                },
            );
            self.cached = Some((
                key,
                Results {
                    modulation: m,
                    service,
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
                "Carrier {:.3} MHz with the junction at {:.2} pF ({:.2} pF at the audio's upper \
                 peak, {:.2} pF at its lower); deviation +{:.1} / −{:.1} kHz, {:.1} kHz per \
                 volt, second harmonic {:.2} %, Carson bandwidth {:.0} kHz.",
                m.carrier * 1e-6,
                m.junction_at_bias * 1e12,
                m.junction_at_high_bias * 1e12,
                m.junction_at_low_bias * 1e12,
                m.deviation_up * 1e-3,
                m.deviation_down * 1e-3,
                m.sensitivity * 1e-3,
                m.distortion * 100.0,
                m.carson_bandwidth * 1e-3
            ),
        );
        wrap(ui, swing_words(m, self.settings.audio_peak_v));
        let v = &r.verdict;
        if Service::applying_to(r.modulation.carrier).is_none() {
            wrap(
                ui,
                format!(
                    "No service applies at {:.3} MHz: neither the FM broadcast band (76–108 \
                     MHz) nor the 2 m band (144–148 MHz) holds it. The figures below use {} \
                     only as a yardstick.",
                    r.modulation.carrier * 1e-6,
                    r.service.label()
                ),
            );
        }
        wrap(
            ui,
            format!(
                "Judged against {}: the larger peak is {:.0} % of the limit ({}); Carson's \
                 bandwidth {} the {:.0} kHz channel.",
                r.service.label(),
                v.deviation_ratio * 100.0,
                if v.deviation_ok { "within" } else { "over" },
                if v.bandwidth_ok {
                    "fits"
                } else {
                    "spills out of"
                },
                r.service.channel_width() * 1e-3
            ),
        );
        for advice in &v.advice {
            wrap(ui, advice.clone());
        }
        ui.add(
            egui::Label::new(
                egui::RichText::new(
                    "More deviation: a higher audio level, a larger coupling capacitor or less \
                     bias (the law is steeper near 0 V); less: the reverse.",
                )
                .weak(),
            )
            .wrap(),
        );
        ui.add_space(4.0);
        self.drift_ui(ui, tolerance);
    }

    /// The drift budget: the changes (editable), each cause's shift, the worst case and the
    /// verdict with its remedies.
    fn drift_ui(&mut self, ui: &mut egui::Ui, tolerance: f64) {
        ui.strong("Drift budget");
        let s = &mut self.settings;
        egui::Grid::new("tankwright drift changes")
            .num_columns(2)
            .show(ui, |ui| {
                number(ui, "Supply voltage", &mut s.supply_v, (1.0, 30.0), " V");
                number(
                    ui,
                    "Supply change",
                    &mut s.supply_change_v,
                    (-30.0, 30.0),
                    " V",
                );
                number(
                    ui,
                    "Temperature change",
                    &mut s.temperature_change_k,
                    (-80.0, 80.0),
                    " K",
                );
                let l = ui.label(CLASS_LABEL);
                egui::ComboBox::from_id_salt("tankwright fixed class")
                    .selected_text(format!("{} ({})", s.class.code, s.class.trade_name))
                    .show_ui(ui, |ui| {
                        for c in CLASSES {
                            let text = format!("{} ({})", c.code, c.trade_name);
                            ui.selectable_value(&mut s.class, c, text);
                        }
                    })
                    .response
                    .labelled_by(l.id);
                ui.end_row();
                number(ui, "Hand near the coil", &mut s.hand_pf, (0.0, 10.0), " pF");
                number(ui, "Load change", &mut s.load_pf, (-10.0, 10.0), " pF");
            });
        let Some((_, r)) = &self.cached else {
            return;
        };
        let wrap = |ui: &mut egui::Ui, text: String| {
            ui.add(egui::Label::new(text).wrap());
        };
        egui::Grid::new("tankwright drift")
            .striped(true)
            .num_columns(3)
            .show(ui, |ui| {
                for line in &r.drift.lines {
                    ui.label(line.source.label());
                    ui.label(change_text(line.source, line.change));
                    ui.label(format!("{:+.1} kHz", line.shift * 1e-3));
                    ui.end_row();
                }
                ui.label("all at once");
                ui.label("");
                ui.label(format!("{:+.1} kHz", r.drift.total * 1e-3));
                ui.end_row();
                ui.strong("worst case");
                ui.label("");
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

/// A drift line's change as shown: volts, kelvin or picofarads.
fn change_text(source: DriftSource, change: f64) -> String {
    match source.unit() {
        "F" => format!("{:+.2} pF", change * 1e12),
        unit => format!("{change:+.1} {unit}"),
    }
}

/// The junction's swing in words: the audio's and the RF's peaks beside each other and the
/// least reverse voltage they leave ("Swings on the junction: audio ±0.10 V, RF ±2.00 V peak
/// (…); least reverse voltage 2.40 V.").
fn swing_words(m: &Modulation, audio_peak_v: f64) -> String {
    format!(
        "Swings on the junction: audio ±{:.2} V, RF ±{:.2} V peak; least reverse voltage \
         {:.2} V{}.",
        audio_peak_v.abs(),
        m.rf_at_junction,
        m.least_reverse_v,
        if m.forward_on_peaks {
            " (driven forward on the peaks)"
        } else {
            ""
        }
    )
}

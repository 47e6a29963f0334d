//! How far the audio swings the carrier, and whether it stays on its channel: the junction
//! across the tank as a voltage-controlled capacitor, its deviation, distortion and bandwidth
//! judged against the service, and the drift budget with its verdict.
//!
//! Every figure is the engine's (`tuning::modulation`, `tuning::drift`, the same as
//! `evaluate --junction-…`); they are recomputed only when an input changes.

use crate::physics::dielectric_class::CLASSES;
use crate::tuning::audio::{
    AUDIO_MAX_RANGE_HZ, AUDIO_PEAK_RANGE_V, AudioFigures, AudioSettings, BIAS_RANGE_V, CJ0_RANGE_F,
    COUPLING_RANGE_F, HAND_RANGE_F, LOAD_RANGE_F, M_RANGE, SUPPLY_CHANGE_RANGE_V, SUPPLY_RANGE_V,
    TEMPERATURE_CHANGE_RANGE_K, VJ_RANGE_V,
};
use crate::tuning::drift::DriftSource;
use crate::tuning::modulation::Service;
use crate::tuning::spice_model::{DeviceType, JunctionModel, parse_model};
use crate::units;
use crate::units::{to_khz, to_mhz, to_pf};
use eframe::egui;

/// The field of the RF peak across the tank (it swings the junction beside the audio).
pub const RF_PEAK_LABEL: &str = "RF peak across the tank";
/// Accessible name of the fixed capacitor's class picker.
pub const CLASS_LABEL: &str = "Fixed capacitor class";
/// Accessible name of the box a SPICE `.model` line is pasted into.
pub const MODEL_TEXT_LABEL: &str = "SPICE .model text";
/// The button that reads the pasted `.model` line into the junction's fields.
pub const USE_MODEL_BUTTON: &str = "Use this model";
/// The collapsible section holding the paste box.
pub const PASTE_SECTION: &str = "Paste a SPICE .model line";
/// The switch that puts the junction at its bias in the tank of every figure.
pub const COUNT_JUNCTION: &str = "Count the junction in the tank";

/// The pasted `.model` text and what became of it; the settings themselves are the recipe's
/// (`Recipe::audio`, saved with it) and the figures the one cache's
/// (`Evaluation::audio`).
#[derive(Default)]
pub struct AudioPanel {
    /// The `.model` text as typed or pasted (never cleared by the panel).
    model_text: String,
    /// What became of the last "Use this model": a summary, or why it was refused.
    model_note: Option<Result<String, String>>,
    /// Why the stage's junction was not taken, after the last try.
    stage_note: Option<String>,
}

/// The button that takes the oscillator stage's own base–collector junction.
pub const USE_STAGE_JUNCTION: &str = "Use the stage transistor's base–collector junction";

/// A number field showing an SI value in a display `unit` (its two conversions):
/// written back only when the field was changed, so a value is never rounded by being shown.
fn number(
    ui: &mut egui::Ui,
    label: &str,
    value: &mut f64,
    range: (f64, f64),
    unit: units::Pair,
    suffix: &str,
) -> bool {
    let l = ui.label(label);
    let (to, from) = unit;
    let mut shown = to(*value);
    let r = crate::ui::widgets::steady(ui, label, |ui| {
        ui.add(
            egui::DragValue::new(&mut shown)
                .range(to(range.0)..=to(range.1))
                .speed(0.01)
                .max_decimals(3)
                .suffix(suffix),
        )
        .labelled_by(l.id)
    });
    ui.end_row();
    if r.changed() {
        *value = from(shown);
    }
    r.changed()
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
    let pf = (units::to_pf(CJ0_RANGE_F.0), units::to_pf(CJ0_RANGE_F.1));
    in_range(cj, to_pf(law.cj0), pf, " pF")?;
    in_range(vj, law.contact_potential, VJ_RANGE_V, " V")?;
    in_range(m, law.grading, M_RANGE, "")?;
    let mut text = format!(
        "Read {} ({what}): Cj0 {} pF, potential {} V, exponent {}, FC {}.",
        model.name,
        short(to_pf(law.cj0)),
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

impl AudioPanel {
    /// Read the pasted `.model` text into the junction's fields, or say why not (the text and
    /// the fields are left as they were).
    fn use_model(&mut self, settings: &mut AudioSettings) {
        let read = parse_model(&self.model_text)
            .map_err(|e| e.to_string())
            .and_then(|model| describe(&model).map(|text| (model.law, text)));
        self.model_note = Some(match read {
            Ok((law, text)) => {
                settings.junction = law;
                Ok(text)
            }
            Err(e) => Err(format!(
                "Not read: {e}. The junction's fields are unchanged; the text is kept for \
                 correcting."
            )),
        });
    }

    /// The paste box, its button and what became of the last attempt.
    fn paste_ui(&mut self, ui: &mut egui::Ui, settings: &mut AudioSettings) {
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
                    self.use_model(settings);
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

    /// Show the junction inputs (the recipe's `settings`), the modulation and the drift
    /// budget (`figures`, the one cache's for these settings, the coil and the tank without the
    /// junction), judged against a channel `tolerance` (± hertz). True when
    /// [`USE_STAGE_JUNCTION`] was pressed (the window then takes the stage's junction and
    /// reports back through [`stage_junction_taken`](Self::stage_junction_taken)).
    pub fn show(
        &mut self,
        ui: &mut egui::Ui,
        settings: &mut AudioSettings,
        figures: Option<&AudioFigures>,
        tolerance: f64,
    ) -> bool {
        let s = settings;
        let asked = ui
            .button(USE_STAGE_JUNCTION)
            .on_hover_text(
                "The oscillator stage's transistor (the recipe's stage, or the demo stage) as the \
                 modulating junction: its law, its collector–base voltage as the bias, straight \
                 across the tank, with the stage's other capacitances beside it, so the carrier's \
                 slope here is the stage panel's.",
            )
            .clicked();
        if let Some(why) = &self.stage_note {
            let colour = ui.visuals().error_fg_color;
            ui.add(
                egui::Label::new(egui::RichText::new(format!("Not taken: {why}.")).color(colour))
                    .wrap(),
            );
        }
        if s.beside > 0.0 {
            ui.weak(format!(
                "With the stage's transistor: {:.2} pF of its other capacitances beside the \
                 junction.",
                units::to_pf(s.beside)
            ));
        }
        egui::Grid::new("tankwright junction inputs")
            .num_columns(2)
            .show(ui, |ui| {
                let j = &mut s.junction;
                number(
                    ui,
                    "Junction Cj0",
                    &mut j.cj0,
                    CJ0_RANGE_F,
                    units::PF,
                    " pF",
                );
                number(
                    ui,
                    "Junction potential",
                    &mut j.contact_potential,
                    VJ_RANGE_V,
                    units::AS_SI,
                    " V",
                );
                number(
                    ui,
                    "Grading exponent",
                    &mut j.grading,
                    M_RANGE,
                    units::AS_SI,
                    "",
                );
                number(
                    ui,
                    "Reverse bias",
                    &mut s.bias_v,
                    BIAS_RANGE_V,
                    units::AS_SI,
                    " V",
                );
                number(
                    ui,
                    "Audio peak",
                    &mut s.audio_peak_v,
                    AUDIO_PEAK_RANGE_V,
                    units::AS_SI,
                    " V",
                );
                number(
                    ui,
                    RF_PEAK_LABEL,
                    &mut s.rf_peak_v,
                    crate::tuning::audio::RF_PEAK_RANGE_V,
                    units::AS_SI,
                    " V",
                );
                // Untouched: the service's (the figures say which); typed: kept.
                let mut audio_max = s.audio_max.or(figures.map(|f| f.audio_max)).unwrap_or(15e3);
                if number(
                    ui,
                    "Highest audio frequency",
                    &mut audio_max,
                    AUDIO_MAX_RANGE_HZ,
                    units::KHZ,
                    " kHz",
                ) {
                    s.audio_max = Some(audio_max);
                }
                number(
                    ui,
                    "Coupling capacitor",
                    &mut s.coupling,
                    COUPLING_RANGE_F,
                    units::PF,
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
        if let Some(why) =
            crate::tuning::modulation::bias_beyond_supply(s.bias_v, s.audio_peak_v, s.supply_v)
        {
            ui.add(
                egui::Label::new(egui::RichText::new(why).color(crate::ui::theme::caution(ui)))
                    .wrap(),
            );
        }
        self.paste_ui(ui, s);
        let Some(r) = figures else {
            return asked;
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
                to_mhz(m.carrier),
                to_pf(m.junction_at_bias),
                to_pf(m.junction_at_high_bias),
                to_pf(m.junction_at_low_bias),
                to_khz(m.deviation_up),
                to_khz(m.deviation_down),
                to_khz(m.sensitivity),
                m.distortion * 100.0,
                to_khz(m.carson_bandwidth)
            ),
        );
        wrap(ui, swing_words(m, s.audio_peak_v));
        let v = &r.verdict;
        if Service::applying_to(r.modulation.carrier).is_none() {
            wrap(
                ui,
                format!(
                    "No service applies at {:.3} MHz: neither the FM broadcast band (76–108 \
                     MHz) nor the 2 m band (144–148 MHz) holds it. The figures below use {} \
                     only as a yardstick.",
                    to_mhz(r.modulation.carrier),
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
                to_khz(r.service.channel_width())
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
        drift_ui(ui, s, r, tolerance);
        asked
    }

    /// What became of taking the stage's junction: `Ok`, or why not (said in the panel).
    pub fn stage_junction_taken(&mut self, taken: Result<(), String>) {
        self.stage_note = taken.err();
    }
}

/// The drift budget: the changes (editable), each cause's shift, the worst case and the
/// verdict with its remedies.
fn drift_ui(ui: &mut egui::Ui, s: &mut AudioSettings, r: &AudioFigures, tolerance: f64) {
    ui.strong("Drift budget");
    egui::Grid::new("tankwright drift changes")
        .num_columns(2)
        .show(ui, |ui| {
            number(
                ui,
                "Supply voltage",
                &mut s.supply_v,
                SUPPLY_RANGE_V,
                units::AS_SI,
                " V",
            );
            number(
                ui,
                "Supply change",
                &mut s.supply_change_v,
                SUPPLY_CHANGE_RANGE_V,
                units::AS_SI,
                " V",
            );
            number(
                ui,
                "Temperature change",
                &mut s.temperature_change_k,
                TEMPERATURE_CHANGE_RANGE_K,
                units::AS_SI,
                " K",
            );
            let l = ui.label(CLASS_LABEL);
            egui::ComboBox::from_id_salt("tankwright fixed class")
                .selected_text(format!(
                    "{} ({})",
                    s.fixed_class.code, s.fixed_class.trade_name
                ))
                .show_ui(ui, |ui| {
                    for c in CLASSES {
                        let text = format!("{} ({})", c.code, c.trade_name);
                        ui.selectable_value(&mut s.fixed_class, c, text);
                    }
                })
                .response
                .labelled_by(l.id);
            ui.end_row();
            number(
                ui,
                "Hand near the coil",
                &mut s.hand,
                HAND_RANGE_F,
                units::PF,
                " pF",
            );
            number(
                ui,
                "Load change",
                &mut s.load,
                LOAD_RANGE_F,
                units::PF,
                " pF",
            );
        });
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
                ui.label(format!("{:+.1} kHz", to_khz(line.shift)));
                ui.end_row();
            }
            ui.label("all at once");
            ui.label("");
            ui.label(format!("{:+.1} kHz", to_khz(r.drift.total)));
            ui.end_row();
            ui.strong("worst case");
            ui.label("");
            ui.strong(format!("±{:.1} kHz", to_khz(r.drift.worst_case)));
            ui.end_row();
        });
    let verdict = if r.drift.within_tolerance {
        format!("Stays within ±{:.1} kHz of the channel.", to_khz(tolerance))
    } else {
        format!(
            "Leaves the ±{:.1} kHz channel tolerance; the largest cause is {}.",
            to_khz(tolerance),
            r.drift.dominant.map_or("unknown", |d| d.label())
        )
    };
    wrap(ui, verdict);
    for remedy in &r.drift.remedies {
        wrap(ui, format!("Remedy: {remedy}"));
    }
}

/// A drift line's change as shown: volts, kelvin or picofarads.
fn change_text(source: DriftSource, change: f64) -> String {
    match source.unit() {
        "F" => format!("{:+.2} pF", to_pf(change)),
        unit => format!("{change:+.1} {unit}"),
    }
}

/// The junction's swing in words: the audio's and the RF's peaks beside each other and the
/// least reverse voltage they leave ("Swings on the junction: audio ±0.10 V, RF ±2.00 V peak;
/// least reverse voltage 2.40 V.").
fn swing_words(m: &crate::tuning::modulation::Modulation, audio_peak_v: f64) -> String {
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

//! The bench log: readings taken at the bench, listed, and the correction the latest one
//! implies (how far to stretch or squeeze to land on the target).

use crate::model::{Coil, Conditions, Tank};
use crate::recipe::{BenchEntry, Recipe, rules};
use crate::tuning::fit::{Correction, correct_from_measurement, length_uncertainty};
use crate::tuning::solve::stretch_sensitivity;
use crate::ui::units::LengthUnit;
use eframe::egui;

/// What the bench log asks the app to do (applied at the end of the frame).
#[derive(Clone, Debug, PartialEq)]
#[must_use]
pub enum BenchLogAction {
    /// Append a reading.
    Record(BenchEntry),
    /// Remove the reading at this index.
    Remove(usize),
    /// Set the coil length (metres) to the corrected one.
    SetLength(f64),
}

/// The inputs a correction was computed from, and the result (kept so an idle frame does not
/// redo the fit).
type CachedCorrection = (
    (BenchEntry, Coil, Tank, Conditions, f64),
    Option<ReadingCorrection>,
);

/// Transient state: the reading being typed, and the last correction computed.
#[derive(Clone, Debug)]
pub struct BenchLogPanel {
    cached: Option<CachedCorrection>,
    measured_mhz: f64,
    instrument: String,
    error_ppm: f64,
    error_known: bool,
    note: String,
}

impl Default for BenchLogPanel {
    fn default() -> Self {
        Self {
            cached: None,
            measured_mhz: 0.0,
            instrument: String::new(),
            error_ppm: 10.0,
            error_known: false,
            note: String::new(),
        }
    }
}

/// The correction implied by one reading, with its uncertainty from the instrument.
#[derive(Clone, Debug, PartialEq)]
pub struct ReadingCorrection {
    /// The fitted correction.
    pub correction: Correction,
    /// Length uncertainty from the instrument's error alone, metres (if its error is known).
    pub length_uncertainty: Option<f64>,
}

/// The correction the reading implies for a coil like `coil` in `tank`, aimed at `target`.
///
/// The coil is taken at the reading's length and the tank at the reading's trimmer setting.
pub fn correction_for(
    entry: &BenchEntry,
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    target: f64,
) -> Option<ReadingCorrection> {
    let at_reading = coil.with_length(entry.length);
    let c_ext = tank.external_capacitance_at(entry.trimmer_setting.clamp(0.0, 1.0));
    let correction =
        correct_from_measurement(&at_reading, c_ext, conditions, entry.measured, target)?;
    let length_uncertainty = entry.error_ppm.and_then(|ppm| {
        let slope = stretch_sensitivity(
            &at_reading,
            c_ext + correction.extra_capacitance,
            conditions,
        );
        length_uncertainty(ppm, entry.measured, slope)
    });
    Some(ReadingCorrection {
        correction,
        length_uncertainty,
    })
}

impl BenchLogPanel {
    /// Draw the log. `coil` is the present validated coil (None while the input is refused).
    pub fn ui(
        &mut self,
        ui: &mut egui::Ui,
        recipe: &Recipe,
        coil: Option<&Coil>,
        unit: LengthUnit,
    ) -> Option<BenchLogAction> {
        let mut action = None;
        let log = &recipe.bench_log;
        if log.is_empty() {
            ui.weak("No readings yet. After winding, measure the tank and record it here.");
        }
        egui::Grid::new("bench_log_readings")
            .striped(true)
            .num_columns(5)
            .show(ui, |ui| {
                if !log.is_empty() {
                    ui.strong("measured");
                    ui.strong("length");
                    ui.strong("trimmer");
                    ui.strong("instrument, note");
                    ui.label("");
                    ui.end_row();
                }
                for (i, e) in log.iter().enumerate() {
                    ui.label(format!("{:.4} MHz", e.measured * 1e-6));
                    ui.label(unit.show(e.length));
                    ui.label(format!("{:.0} %", e.trimmer_setting * 100.0));
                    let ppm = e
                        .error_ppm
                        .map(|p| format!(" (±{p} ppm)"))
                        .unwrap_or_default();
                    let mut text = format!("{}{ppm}", e.instrument);
                    if !e.note.is_empty() {
                        text = format!("{text}; {}", e.note);
                    }
                    ui.label(text);
                    if ui
                        .small_button("Remove")
                        .on_hover_text(format!("remove reading {}", i + 1))
                        .clicked()
                    {
                        action = Some(BenchLogAction::Remove(i));
                    }
                    ui.end_row();
                }
            });

        if let (Some(latest), Some(coil)) = (log.last(), coil) {
            action = action.or(self.correction_ui(ui, latest, coil, recipe, unit));
        }

        ui.separator();
        action.or(self.record_ui(ui, recipe, coil, unit))
    }

    /// The correction for `latest`, recomputed only when its inputs change.
    fn correction(
        &mut self,
        latest: &BenchEntry,
        coil: &Coil,
        recipe: &Recipe,
    ) -> Option<ReadingCorrection> {
        let key = (
            latest.clone(),
            *coil,
            recipe.tank,
            recipe.conditions,
            recipe.target.channel,
        );
        if let Some((k, result)) = &self.cached
            && *k == key
        {
            return result.clone();
        }
        let result = correction_for(
            latest,
            coil,
            &recipe.tank,
            &recipe.conditions,
            recipe.target.channel,
        );
        self.cached = Some((key, result.clone()));
        result
    }

    fn correction_ui(
        &mut self,
        ui: &mut egui::Ui,
        latest: &BenchEntry,
        coil: &Coil,
        recipe: &Recipe,
        unit: LengthUnit,
    ) -> Option<BenchLogAction> {
        let target = recipe.target.channel;
        let Some(fit) = self.correction(latest, coil, recipe) else {
            ui.colored_label(
                ui.visuals().warn_fg_color,
                "The latest reading is far from anything this coil and tank can do: check the \
                 reading, the turns and the capacitors.",
            );
            return None;
        };
        let extra = fit.correction.extra_capacitance * 1e12;
        ui.label(format!(
            "The latest reading behaves as if the tank had {extra:+.2} pF beyond the model \
             (stray, device and wiring)."
        ))
        .on_hover_text(
            "Every difference between the build and the model is lumped into one capacitance \
             that reproduces the reading; the correction below uses it.",
        );
        match &fit.correction.length_for_target {
            Ok(length) => {
                let change = length - latest.length;
                let verb = if change >= 0.0 { "stretch" } else { "squeeze" };
                let mut text = format!(
                    "To land on {:.3} MHz at the same trimmer setting: {verb} by {} to {}.",
                    target * 1e-6,
                    unit.show(change.abs()),
                    unit.show(*length)
                );
                if let Some(u) = fit.length_uncertainty {
                    text.push_str(&format!(" (±{} from the instrument)", unit.show(u)));
                }
                ui.strong(text);
                if ui
                    .button("Set the coil to the corrected length")
                    .on_hover_text("changes the coil length on screen; undo restores it")
                    .clicked()
                {
                    return Some(BenchLogAction::SetLength(*length));
                }
            }
            Err(why) => {
                ui.colored_label(
                    ui.visuals().warn_fg_color,
                    format!("No length reaches the target: {why}"),
                );
            }
        }
        None
    }

    fn record_ui(
        &mut self,
        ui: &mut egui::Ui,
        recipe: &Recipe,
        coil: Option<&Coil>,
        unit: LengthUnit,
    ) -> Option<BenchLogAction> {
        let mut action = None;
        ui.label("New reading, at the present length and trimmer setting:");
        egui::Grid::new("bench_log_new")
            .num_columns(2)
            .show(ui, |ui| {
                let label = ui.label("Measured frequency");
                ui.add(
                    egui::DragValue::new(&mut self.measured_mhz)
                        .range(0.0..=3000.0)
                        .speed(0.01)
                        .fixed_decimals(4)
                        .suffix(" MHz"),
                )
                .labelled_by(label.id)
                .on_hover_text("measured frequency of the tank, MHz");
                ui.end_row();
                let label = ui.label("Instrument");
                ui.add(
                    egui::TextEdit::singleline(&mut self.instrument)
                        .hint_text("counter, dip meter, receiver…"),
                )
                .labelled_by(label.id);
                ui.end_row();
                ui.checkbox(&mut self.error_known, "Instrument error known");
                ui.add_enabled(
                    self.error_known,
                    egui::DragValue::new(&mut self.error_ppm)
                        .range(0.0..=100_000.0)
                        .suffix(" ppm"),
                )
                .on_hover_text("instrument error, ppm");
                ui.end_row();
                let label = ui.label("Note");
                ui.add(egui::TextEdit::singleline(&mut self.note))
                    .labelled_by(label.id);
                ui.end_row();
            });
        let length = coil.map(|c| c.length);
        // The reading as it would be recorded, judged by the recipe rules (the loader's), so
        // the log never holds a reading the file could not open with.
        let entry = length.map(|length| BenchEntry {
            measured: self.measured_mhz * 1e6,
            length,
            trimmer_setting: recipe.tank.trimmer_setting,
            instrument: self.instrument.trim().to_owned(),
            error_ppm: self.error_known.then_some(self.error_ppm),
            note: self.note.trim().to_owned(),
        });
        let full = recipe.bench_log.len() >= rules::READINGS_MAX;
        let refusal = entry
            .as_ref()
            .and_then(|e| rules::check_reading(e, recipe.bench_log.len()).err());
        let hint = match (&entry, &refusal) {
            _ if full => format!(
                "the log is full: a recipe keeps at most {} readings (remove old ones first)",
                rules::READINGS_MAX
            ),
            (None, _) => "the coil on screen is refused: fix it first".to_owned(),
            (Some(_), Some(r)) => r.reason.clone(),
            (Some(e), None) => format!(
                "records {:.4} MHz at {} and trimmer {:.0} %",
                self.measured_mhz,
                unit.show(e.length),
                recipe.tank.trimmer_setting * 100.0
            ),
        };
        let enabled = entry.is_some() && refusal.is_none() && !full;
        if ui
            .add_enabled(enabled, egui::Button::new("Record reading"))
            .on_hover_text(&hint)
            .on_disabled_hover_text(&hint)
            .clicked()
            && enabled
            && let Some(entry) = entry
        {
            action = Some(BenchLogAction::Record(entry));
            self.note.clear();
        }
        action
    }
}

//! The bench log: readings taken at the bench, listed with their residuals against the
//! calibrated model; the fit they imply (extra capacitance and inductance scale with their
//! standard errors, warnings); the one instruction that lands the target; and the form that
//! records, edits or removes a reading (every change is a recipe change, so undo covers it).
//!
//! Nothing here computes physics: the fit and the advice come from the recipe's figures
//! ([`crate::recipe::figures()`]), the same ones the build sheet and the commands print.

use crate::recipe::{BenchEntry, Figures, Recipe, rules};
use crate::tuning::advice::Advice;
use crate::tuning::fit::{Fit, length_uncertainty};
use crate::tuning::reading_reach;
use crate::ui::units::LengthUnit;
use crate::ui::widgets::steady;
use crate::units::{from_mhz, from_mm, from_pf, to_khz, to_mhz, to_nh, to_pf};
use eframe::egui;

/// What the bench log asks the app to do (applied at the end of the frame).
#[derive(Clone, Debug, PartialEq)]
#[must_use]
pub enum BenchLogAction {
    /// Append a reading.
    Record(BenchEntry),
    /// Replace the reading at this index.
    Replace(usize, BenchEntry),
    /// Remove the reading at this index.
    Remove(usize),
    /// Set the coil length (metres).
    SetLength(f64),
    /// Set the trimmer (0–1).
    SetTrimmer(f64),
    /// Wind another number of turns to a length (metres).
    SetTurns(f64, f64),
}

/// Accessible name of the checkbox that puts reading `index` (0 = oldest) in the fit although
/// the fit suspects it of being a harmonic.
pub fn include_label(index: usize) -> String {
    format!("Include reading {} in the fit anyway", index + 1)
}

/// Whether the fit suspects reading `index` of being a harmonic (left out, or included by the
/// user).
fn suspected(fit: Option<&Fit>, index: usize) -> bool {
    fit.is_some_and(|f| {
        f.warnings.iter().any(|w| {
            matches!(w, crate::tuning::fit::FitWarning::Harmonic { reading, .. } if *reading == index)
        })
    })
}

/// Accessible name of the button that carries out the advice.
pub const APPLY_ADVICE_LABEL: &str = "Apply the advice";

/// Transient state: the reading being typed (cleared after recording and when another
/// document is opened), and which reading is being edited.
#[derive(Clone, Debug, Default)]
pub struct BenchLogPanel {
    form: Form,
    /// Index of the reading whose values the form holds, while editing one.
    editing: Option<usize>,
}

/// The entry form, in display units.
#[derive(Clone, Debug)]
struct Form {
    measured_mhz: f64,
    /// Coil length as measured; `None` takes the present length.
    length: Option<f64>,
    /// Trimmer setting, percent; `None` takes the present setting.
    trimmer_pct: Option<f64>,
    added_pf: f64,
    /// The clipped-on capacitor's tolerance, percent (kept with the reading while one is
    /// clipped on).
    added_tolerance_pct: f64,
    instrument: String,
    error_known: bool,
    error_ppm: f64,
    note: String,
}

impl Default for Form {
    fn default() -> Self {
        Self {
            measured_mhz: 0.0,
            length: None,
            trimmer_pct: None,
            added_pf: 0.0,
            added_tolerance_pct: crate::tuning::fit::CLIP_ON_TOLERANCE * 100.0,
            instrument: String::new(),
            error_known: false,
            error_ppm: 10.0,
            note: String::new(),
        }
    }
}

impl Form {
    fn of(e: &BenchEntry) -> Self {
        Self {
            measured_mhz: to_mhz(e.measured),
            length: Some(e.length),
            trimmer_pct: Some(e.trimmer_setting * 100.0),
            added_pf: to_pf(e.added_capacitance),
            added_tolerance_pct: e
                .added_tolerance
                .unwrap_or(crate::tuning::fit::CLIP_ON_TOLERANCE)
                * 100.0,
            instrument: e.instrument.clone(),
            error_known: e.error_ppm.is_some(),
            error_ppm: e.error_ppm.unwrap_or(10.0),
            note: e.note.clone(),
        }
    }
}

impl BenchLogPanel {
    /// Forget the form and any edit in progress (another document was opened).
    pub fn reset(&mut self) {
        *self = Self::default();
    }

    /// Draw the log. `figures` are the recipe's (None while the input is refused).
    pub fn ui(
        &mut self,
        ui: &mut egui::Ui,
        recipe: &Recipe,
        figures: Option<&Figures>,
        unit: LengthUnit,
    ) -> Option<BenchLogAction> {
        let mut action = None;
        let log = &recipe.bench_log;
        if self.editing.is_some_and(|i| i >= log.len()) {
            self.editing = None;
        }
        let fit = figures
            .and_then(|f| f.fit.as_ref())
            .and_then(|r| r.as_ref().ok());
        if log.is_empty() {
            ui.weak("No readings yet. After winding, measure the tank and record it here.");
        } else {
            action = self.readings_table(ui, log, fit, unit);
        }
        if let Some(f) = figures {
            action = action.or(fit_ui(ui, f, unit));
            if let Some(line) = &f.line {
                inverse_square_chart(ui, recipe, line);
            }
        }
        ui.separator();
        action.or(self.form_ui(ui, recipe, figures, unit))
    }

    fn readings_table(
        &mut self,
        ui: &mut egui::Ui,
        log: &[BenchEntry],
        fit: Option<&Fit>,
        unit: LengthUnit,
    ) -> Option<BenchLogAction> {
        let mut action = None;
        // The figures in a grid that scrolls sideways on its own when the column is narrow;
        // each reading's instrument and note below it, wrapping, with its buttons.
        egui::ScrollArea::horizontal()
            .id_salt("bench_log_readings_scroll")
            .show(ui, |ui| {
                egui::Grid::new("bench_log_readings")
                    .striped(true)
                    .num_columns(5)
                    .show(ui, |ui| {
                        ui.strong("#");
                        ui.strong("measured");
                        ui.strong("length");
                        ui.strong("trimmer");
                        ui.strong("off the fit");
                        ui.end_row();
                        for (i, e) in log.iter().enumerate() {
                            ui.label(format!("{}", i + 1));
                            ui.label(format!("{:.4} MHz", to_mhz(e.measured)));
                            ui.label(unit.show(e.length));
                            let mut trimmer = format!("{:.0} %", e.trimmer_setting * 100.0);
                            if e.added_capacitance > 0.0 {
                                trimmer
                                    .push_str(&format!(" +{:.1} pF", to_pf(e.added_capacitance)));
                            }
                            ui.label(trimmer);
                            residual_cell(ui, fit, i);
                            ui.end_row();
                        }
                    });
            });
        for (i, e) in log.iter().enumerate() {
            let ppm = e
                .error_ppm
                .map(|p| format!(" (±{p} ppm)"))
                .unwrap_or_default();
            let mut text = format!("{}. {}{ppm}", i + 1, e.instrument);
            if !e.note.is_empty() {
                text = format!("{text}; {}", e.note);
            }
            // The buttons first, so they keep their place whatever the note's length.
            ui.horizontal_wrapped(|ui| {
                if ui
                    .small_button("Change")
                    .on_hover_text(format!("change reading {}", i + 1))
                    .clicked()
                {
                    self.form = Form::of(e);
                    self.editing = Some(i);
                }
                if ui
                    .small_button("Remove")
                    .on_hover_text(format!("remove reading {}", i + 1))
                    .clicked()
                {
                    action = Some(BenchLogAction::Remove(i));
                    if self.editing == Some(i) {
                        self.editing = None;
                        self.form = Form::default();
                    }
                }
                ui.add(egui::Label::new(egui::RichText::new(text).weak()).wrap());
            });
            // A reading the fit suspects of being a harmonic is left out until the user
            // includes it (the fit's warning above says why).
            if suspected(fit, i) {
                let mut on = e.include_anyway;
                if ui
                    .checkbox(&mut on, include_label(i))
                    .on_hover_text(
                        "This reading is near 2×, 3×, ½× or ⅓× the prediction, so the fit \
                         leaves it out as a likely harmonic or the wrong tank. Tick it if you \
                         are sure it is the tank's own resonance.",
                    )
                    .changed()
                {
                    action = Some(BenchLogAction::Replace(
                        i,
                        BenchEntry {
                            include_anyway: on,
                            ..e.clone()
                        },
                    ));
                }
            }
        }
        action
    }

    fn form_ui(
        &mut self,
        ui: &mut egui::Ui,
        recipe: &Recipe,
        figures: Option<&Figures>,
        unit: LengthUnit,
    ) -> Option<BenchLogAction> {
        let present_length = figures.map(|f| f.coil.length());
        let present_trimmer = recipe.tank.trimmer_setting * 100.0;
        match self.editing {
            Some(i) => ui.label(format!("Editing reading {}:", i + 1)),
            None => ui.label("New reading:"),
        };
        let form = &mut self.form;
        egui::Grid::new("bench_log_new")
            .num_columns(2)
            .show(ui, |ui| {
                let label = ui.label("Measured frequency");
                steady(ui, "measured", |ui| {
                    ui.add(
                        egui::DragValue::new(&mut form.measured_mhz)
                            .range(0.0..=3000.0)
                            .speed(0.01)
                            .fixed_decimals(4)
                            .suffix(" MHz"),
                    )
                    .labelled_by(label.id)
                    .on_hover_text("measured frequency of the tank, MHz")
                });
                ui.end_row();

                let label = ui.label("Coil length as measured");
                let mut length = form.length.or(present_length).unwrap_or(0.0);
                let per_unit = unit.metres_per_unit();
                let mut shown = length / per_unit;
                let changed = steady(ui, "length", |ui| {
                    ui.add(
                        egui::DragValue::new(&mut shown)
                            .range(0.0..=from_mm(2000.0) / per_unit)
                            .speed(0.01)
                            .fixed_decimals(unit.decimals())
                            .suffix(format!(" {}", unit.suffix())),
                    )
                    .labelled_by(label.id)
                    .on_hover_text(
                        "the coil's length when you read the frequency; defaults to the \
                         present length",
                    )
                    .changed()
                });
                if changed {
                    length = shown * per_unit;
                    form.length = Some(length);
                }
                ui.end_row();

                let label = ui.label("Trimmer setting then");
                let mut trimmer = form.trimmer_pct.unwrap_or(present_trimmer);
                if steady(ui, "trimmer", |ui| {
                    ui.add(
                        egui::DragValue::new(&mut trimmer)
                            .range(0.0..=100.0)
                            .speed(0.5)
                            .fixed_decimals(0)
                            .suffix(" %"),
                    )
                    .labelled_by(label.id)
                    .changed()
                }) {
                    form.trimmer_pct = Some(trimmer);
                }
                ui.end_row();

                let label = ui.label("Known capacitor clipped on");
                steady(ui, "clipped on", |ui| {
                    ui.add(
                        egui::DragValue::new(&mut form.added_pf)
                            .range(0.0..=1000.0)
                            .speed(0.1)
                            .fixed_decimals(1)
                            .suffix(" pF"),
                    )
                    .labelled_by(label.id)
                    .on_hover_text(
                        "a capacitor of known value clipped across the tank for this reading \
                         (0 for none): a second reading with one separates the coil's \
                         inductance from the stray capacitance",
                    )
                });
                ui.end_row();

                if form.added_pf > 0.0 {
                    let label = ui.label("Its tolerance");
                    ui.add(
                        egui::DragValue::new(&mut form.added_tolerance_pct)
                            .range(0.0..=50.0)
                            .speed(0.1)
                            .fixed_decimals(1)
                            .prefix("± ")
                            .suffix(" %"),
                    )
                    .labelled_by(label.id)
                    .on_hover_text(
                        "the clipped-on capacitor's tolerance as marked on it: the calibration \
                         carries it into the stray's and the inductance's errors",
                    );
                    ui.end_row();
                }

                let label = ui.label("Instrument");
                ui.add(
                    egui::TextEdit::singleline(&mut form.instrument)
                        .id_salt("bench_log_instrument")
                        .hint_text("counter, dip meter, receiver…")
                        .desired_width(field_width(ui)),
                )
                .labelled_by(label.id);
                ui.end_row();
                ui.checkbox(&mut form.error_known, "Instrument error known");
                steady(ui, "error", |ui| {
                    ui.add_enabled(
                        form.error_known,
                        egui::DragValue::new(&mut form.error_ppm)
                            .range(0.0..=100_000.0)
                            .suffix(" ppm"),
                    )
                    .on_hover_text("instrument error, ppm")
                });
                ui.end_row();
                let label = ui.label("Note");
                ui.add(
                    egui::TextEdit::singleline(&mut form.note)
                        .id_salt("bench_log_note")
                        .desired_width(field_width(ui)),
                )
                .labelled_by(label.id);
                ui.end_row();
            });
        // Kept to the field's resolution, as every typed value is: the present length (turns
        // × pitch from a gap) is 15.090000000000001 mm, which the file would write as such.
        let length = self.form.length.or(present_length).map(|l| {
            crate::ui::widgets::to_si_at_resolution(
                unit.from_metres(l),
                unit.metres_per_unit(),
                unit.decimals(),
            )
        });
        let valid = self.form.measured_mhz > 0.0 && self.form.measured_mhz.is_finite();
        // The reading as it would be recorded, judged by the recipe rules (the loader's), so
        // the log never holds a reading the file could not open with.
        // An edit keeps the reading's "include anyway" (set by its own checkbox).
        let include_anyway = self
            .editing
            .and_then(|i| recipe.bench_log.get(i))
            .is_some_and(|e| e.include_anyway);
        let entry = length.map(|length| BenchEntry {
            include_anyway,
            measured: from_mhz(self.form.measured_mhz),
            length,
            trimmer_setting: (self.form.trimmer_pct.unwrap_or(present_trimmer) / 100.0)
                .clamp(0.0, 1.0),
            added_capacitance: from_pf(self.form.added_pf.max(0.0)),
            instrument: self.form.instrument.trim().to_owned(),
            error_ppm: self.form.error_known.then_some(self.form.error_ppm),
            note: self.form.note.trim().to_owned(),
            added_tolerance: (self.form.added_pf > 0.0)
                .then_some(self.form.added_tolerance_pct / 100.0),
        });
        let full = self.editing.is_none() && recipe.bench_log.len() >= rules::READINGS_MAX;
        let index = self.editing.unwrap_or(recipe.bench_log.len());
        let refusal = entry
            .as_ref()
            .and_then(|e| rules::check_reading(e, index).err());
        // A reading this tank cannot give (above its resonance with no stray at all) is
        // refused where it enters, with the highest it could show.
        let beyond = entry.as_ref().and_then(|e| {
            let coil = crate::model::Coil::from_winding(&recipe.winding).ok()?;
            reading_reach::check(&coil, &recipe.tank, &recipe.conditions, &e.reading()).err()
        });
        let hint = match (&entry, &refusal) {
            _ if full => format!(
                "the log is full: a recipe keeps at most {} readings (remove old ones first)",
                rules::READINGS_MAX
            ),
            (None, _) => "the coil on screen is refused: fix it first".to_owned(),
            (Some(_), Some(r)) => r.reason.clone(),
            (Some(_), None) if beyond.is_some() => beyond.clone().unwrap_or_default(),
            (Some(e), None) => format!(
                "records {:.4} MHz at {} and trimmer {:.0} %",
                self.form.measured_mhz,
                unit.show(e.length),
                e.trimmer_setting * 100.0
            ),
        };
        let mut action = None;
        ui.horizontal(|ui| {
            let button = match self.editing {
                Some(_) => "Save changes to the reading",
                None => "Record reading",
            };
            if ui
                .add_enabled(
                    valid && entry.is_some() && refusal.is_none() && beyond.is_none() && !full,
                    egui::Button::new(button),
                )
                .on_hover_text(&hint)
                .on_disabled_hover_text(&hint)
                .clicked()
                && let Some(e) = entry
            {
                action = Some(match self.editing {
                    Some(i) => BenchLogAction::Replace(i, e),
                    None => BenchLogAction::Record(e),
                });
                // The instrument is usually the same for the next reading; the rest is not.
                let instrument = std::mem::take(&mut self.form.instrument);
                let (known, ppm) = (self.form.error_known, self.form.error_ppm);
                self.form = Form {
                    instrument,
                    error_known: known,
                    error_ppm: ppm,
                    ..Form::default()
                };
                self.editing = None;
            }
            if self.editing.is_some() && ui.button("Cancel edit").clicked() {
                self.editing = None;
                self.form = Form::default();
            }
        });
        if let Some(reason) = &beyond {
            ui.colored_label(
                ui.visuals().warn_fg_color,
                format!("Not recorded: {reason}"),
            );
        }
        action
    }
}

/// A text field's width in the form's second column: what the column leaves, within reason.
fn field_width(ui: &egui::Ui) -> f32 {
    ui.available_width().clamp(80.0, 240.0)
}

/// Reading `i`'s distance from the fit, marked when it exceeds the fit's limit.
fn residual_cell(ui: &mut egui::Ui, fit: Option<&Fit>, i: usize) {
    match fit.and_then(|f| Some((f.residuals.get(i)?, f.sigmas.get(i)?))) {
        Some((r, s)) => {
            let text = format!("{:+.1} kHz", to_khz(*r));
            if r.abs() > crate::tuning::fit::RESIDUAL_LIMIT * s {
                ui.colored_label(ui.visuals().warn_fg_color, text)
            } else {
                ui.label(text)
            }
            .on_hover_text(format!(
                "measured minus the calibrated model; the instrument's error is ±{:.1} kHz",
                to_khz(*s)
            ));
        }
        None => {
            ui.label("–");
        }
    }
}

/// The fit and the advice, from the recipe's figures.
fn fit_ui(ui: &mut egui::Ui, figures: &Figures, unit: LengthUnit) -> Option<BenchLogAction> {
    match &figures.fit {
        None => {}
        Some(Err(e)) => {
            ui.colored_label(ui.visuals().warn_fg_color, format!("No calibration: {e}."));
        }
        Some(Ok(fit)) => {
            let scale = match fit.inductance_scale_error {
                Some(err) => format!(
                    "inductance {:.3} ± {:.3} × the model's",
                    fit.calibration.inductance_scale, err
                ),
                None => "inductance as modelled (not separable from these readings)".to_owned(),
            };
            ui.label(format!(
                "Calibrated on {} reading{}: {:+.2} ± {:.2} pF beyond the model; {scale}.",
                fit.readings_used,
                if fit.readings_used == 1 { "" } else { "s" },
                to_pf(fit.calibration.extra_capacitance),
                to_pf(fit.extra_capacitance_error),
            ))
            .on_hover_text(
                "Weighted least squares on the model (moved onto the field solution when it \
                 leads): the extra capacitance (stray, device, wiring) and, when readings differ \
                 in capacitance or length, the build's inductance over the model's. Every \
                 figure on screen now uses them.",
            );
            for w in &fit.warnings {
                ui.colored_label(ui.visuals().warn_fg_color, w.to_string());
            }
        }
    }
    let t = &figures.target;
    let show = |m: f64| unit.show(m);
    let mut text = format!(
        "To land on {} MHz: {}.",
        crate::tuning::digits::channel_mhz(t.channel),
        t.advice.text(show)
    );
    if let (Advice::Stretch { .. }, Some(Ok(fit))) = (&t.advice, &figures.fit)
        && let Some(sigma) = fit.sigmas.last()
        && let Some(u) = length_uncertainty(*sigma, t.stretch_sensitivity)
    {
        text.push_str(&format!(
            " ({} from the instrument)",
            unit.show_uncertainty(u)
        ));
    }
    ui.strong(text);
    let action = match &t.advice {
        Advice::Stretch { length, .. } => Some(BenchLogAction::SetLength(*length)),
        Advice::SetTrimmer { setting, .. } => Some(BenchLogAction::SetTrimmer(*setting)),
        Advice::ChangeTurns { to, length, .. } => Some(BenchLogAction::SetTurns(*to, *length)),
        Advice::OnChannel { .. } | Advice::OutOfReach(_) => None,
    };
    if action.is_some()
        && ui
            .button(APPLY_ADVICE_LABEL)
            .on_hover_text("changes the coil or trimmer on screen; undo restores it")
            .clicked()
    {
        return action;
    }
    None
}

/// Accessible name of the 1/f² chart.
pub const INVERSE_SQUARE_LABEL: &str = "one over f squared against capacitance";

/// The bench builder's check by hand: 1/f² (in 1/MHz²) of the readings at the latest length
/// against the external capacitance (pF), with the fitted straight line drawn back to where it
/// crosses zero. Its slope is 4π²·L and the crossing lies at minus the capacitance the model
/// does not see plus the coil's self-capacitance.
fn inverse_square_chart(
    ui: &mut egui::Ui,
    recipe: &Recipe,
    line: &crate::tuning::fit::InverseSquareLine,
) {
    use egui_plot::{Line, Plot, PlotPoints, Points};
    let length = recipe.bench_log.last().map_or(0.0, |e| e.length);
    let points: Vec<[f64; 2]> = recipe
        .readings()
        .iter()
        .filter(|r| (r.length - length).abs() <= 1e-9)
        .map(|r| {
            [
                to_pf(r.external_capacitance(&recipe.tank)),
                1.0 / (to_mhz(r.measured) * to_mhz(r.measured)),
            ]
        })
        .collect();
    let x_max = points.iter().map(|p| p[0]).fold(0.0, f64::max) * 1.1;
    let x_min = to_pf(-line.hidden_capacitance);
    // y in 1/MHz²: 1/f² [s²] × (1e6)², the line's 1/f² at `pf` picofarads.
    let per_mhz_squared = from_mhz(1.0) * from_mhz(1.0);
    let y_at = |pf: f64| (line.slope * from_pf(pf) + line.intercept) * per_mhz_squared;
    ui.label(format!(
        "1/f² against the tank's capacitance: {:.1} nH from the slope, {:.2} pF unseen by the \
         model plus the coil's own from where the line crosses zero",
        to_nh(line.inductance),
        to_pf(line.hidden_capacitance)
    ));
    let response = Plot::new("tankwright inverse square chart")
        .height(150.0)
        .x_axis_label("capacitance across the coil (pF)")
        .y_axis_label("1/f² (1/MHz²)")
        .allow_drag(false)
        .allow_zoom(false)
        .allow_scroll(false)
        .allow_boxed_zoom(false)
        .show(ui, |plot_ui| {
            plot_ui.line(
                Line::new(
                    "fitted line",
                    PlotPoints::from(vec![[x_min, y_at(x_min)], [x_max, y_at(x_max)]]),
                )
                .width(1.5),
            );
            plot_ui.points(
                Points::new("readings", points)
                    .shape(egui_plot::MarkerShape::Diamond)
                    .filled(true)
                    .radius(4.0),
            );
        });
    response
        .response
        .widget_info(|| egui::WidgetInfo::labeled(egui::Role::Figure, true, INVERSE_SQUARE_LABEL));
}

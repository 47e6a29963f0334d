//! Where the missing picofarads come from: the stray estimate part by part for a building
//! method, the total with its range, the frequency window that range leaves, the spread the
//! builder's tolerances add, the fitted stray beside the estimate once bench readings exist,
//! and an action that puts the typical stray into the tank.
//!
//! The figures are the engine's, computed once per change of the recipe by
//! [`crate::recipe::expectation()`] (the same estimate as `evaluate --construction`); the
//! building method and the tolerances are kept in the recipe (`stray_estimate`).

use crate::recipe::rules::check_tolerances;
use crate::recipe::{Expectation, StraySettings};
use crate::tuning::construction::Construction;
use crate::tuning::digits;
use crate::tuning::stray::{Role, Span};
use crate::ui::widgets::Quantity;
use crate::units::to_pf;
use eframe::egui;

/// Accessible name of the building-method picker.
pub const CONSTRUCTION_LABEL: &str = "Building method";

/// Accessible name of the action that applies the estimate.
pub const APPLY_STRAY_LABEL: &str = "Use the typical stray";

/// Name of the row with the stray the bench readings imply.
pub const FITTED_LABEL: &str = "fitted from the bench";

/// Name of the row with the difference between the fitted stray and the estimate.
pub const DIFFERENCE_LABEL: &str = "fitted less estimate";

/// Names of the tolerance fields.
pub const FORMER_TOLERANCE_LABEL: &str = "Former ±";
/// See [`FORMER_TOLERANCE_LABEL`].
pub const LENGTH_TOLERANCE_LABEL: &str = "Length ±";
/// See [`FORMER_TOLERANCE_LABEL`].
pub const WIRE_TOLERANCE_LABEL: &str = "Wire ±";
/// See [`FORMER_TOLERANCE_LABEL`].
pub const TURNS_TOLERANCE_LABEL: &str = "Turns ±";
/// See [`FORMER_TOLERANCE_LABEL`].
pub const CAPACITOR_TOLERANCE_LABEL: &str = "Fixed capacitor ±";

/// The panel's own state: why the last tolerance typed was refused, if it was.
#[derive(Default)]
pub struct StrayPanel {
    refusal: Option<String>,
}

/// A tolerance in millimetres (the slider to ±0.5 mm; any number may be typed).
fn mm<'a>(label: &'a str, value: &'a mut f64, note: &'a str) -> Quantity<'a> {
    Quantity::new(label, value, 1e-3, 0.0..=0.5)
        .decimals(2)
        .suffix("mm")
        .note(note)
}

fn pf(s: Span) -> String {
    format!(
        "{:.2} ({:.2}–{:.2}) pF",
        to_pf(s.typical),
        to_pf(s.low),
        to_pf(s.high)
    )
}

impl StrayPanel {
    /// Show the estimate in `expectation` (for the recipe's `settings`, which the picker and
    /// the tolerance fields edit); `entered_stray` is the tank's stray as entered, farads.
    /// Returns the stray to put into the tank when the user applies the estimate.
    pub fn show(
        &mut self,
        ui: &mut egui::Ui,
        settings: &mut StraySettings,
        expectation: Option<&Expectation>,
        entered_stray: f64,
    ) -> Option<f64> {
        // The section is indented inside the left panel: its sliders take what is left of
        // the visible width, so no field runs past the panel's edge at 1280×720 (a row wider
        // than the panel widens the panel's content, and every line below then wraps past
        // the edge too).
        ui.spacing_mut().slider_width =
            (ui.available_width() - crate::ui::widgets::LABEL_WIDTH - 92.0).clamp(40.0, 150.0);
        let label = ui.label(CONSTRUCTION_LABEL);
        egui::ComboBox::from_id_salt("tankwright construction")
            .selected_text(settings.construction.label())
            .show_ui(ui, |ui| {
                for c in Construction::ALL {
                    ui.selectable_value(&mut settings.construction, c, c.label());
                }
            })
            .response
            .labelled_by(label.id);
        self.tolerances(ui, settings);
        let e = expectation?;
        let estimate = &e.estimate;
        // The parts in a table that scrolls sideways on its own when the panel is narrow.
        egui::ScrollArea::horizontal()
            .id_salt("tankwright stray parts scroll")
            .show(ui, |ui| {
                egui::Grid::new("tankwright stray parts")
                    .striped(true)
                    .num_columns(2)
                    .show(ui, |ui| {
                        for part in estimate.parts.iter().filter(|p| p.role == Role::Stray) {
                            ui.label(part.kind.label()).on_hover_text(part.method);
                            ui.label(pf(part.value));
                            ui.end_row();
                        }
                        ui.strong("stray in all");
                        ui.strong(pf(estimate.stray_term()));
                        ui.end_row();
                        ui.label("across the coil in all");
                        ui.label(pf(estimate.total()));
                        ui.end_row();
                        if let Some(f) = e.fitted {
                            ui.label(FITTED_LABEL).on_hover_text(
                                "the stray as entered plus the capacitance the bench calibration \
                         found beyond the model, with its standard error",
                            );
                            ui.label(format!(
                                "{} pF, standard error {}",
                                digits::fixed(to_pf(f.value), 2),
                                digits::plus_minus(to_pf(f.error), 2, "pF")
                            ));
                            ui.end_row();
                            ui.label(DIFFERENCE_LABEL);
                            ui.label(format!(
                                "{} pF ({} the estimate's range)",
                                digits::signed(to_pf(f.difference), 2),
                                if f.within_estimate {
                                    "within"
                                } else {
                                    "outside"
                                }
                            ));
                            ui.end_row();
                        }
                    });
            });
        let w = e.window;
        ui.add(
            egui::Label::new(format!(
                "Expect {} from the estimate alone (typical {}).",
                digits::spread_range(w.low, w.high),
                digits::mhz_at(w.typical, digits::spread_decimals(w.high - w.low))
            ))
            .wrap(),
        );
        let (lo, hi) = e.before.expected;
        ui.add(
            egui::Label::new(format!(
                "With the winding's own tolerances too, and the estimate's range around the \
                 stray as entered ({:.2} pF): expect {} before the first measurement, a spread \
                 of {} (95 % of {} draws).",
                to_pf(entered_stray),
                digits::spread_range(lo, hi),
                digits::spread_width(hi - lo),
                crate::recipe::expectation::DRAWS
            ))
            .wrap(),
        );
        if e.calibrated {
            let (lo, hi) = e.expected;
            ui.add(
                egui::Label::new(format!(
                    "After the bench calibration: expect {}, a spread of {} (the fit's errors).",
                    digits::spread_range(lo, hi),
                    digits::spread_width(hi - lo)
                ))
                .wrap(),
            );
        }
        let typical = estimate.stray_term().typical;
        ui.button(APPLY_STRAY_LABEL)
            .on_hover_text(format!(
                "set the tank's stray capacitance to {:.2} pF (undo restores it)",
                to_pf(typical)
            ))
            .clicked()
            .then_some(typical)
    }

    /// The builder's tolerances, each refused (and kept as it was) by the recipe rules when
    /// out of range, with the reason on a row of its own.
    fn tolerances(&mut self, ui: &mut egui::Ui, settings: &mut StraySettings) {
        let before = settings.tolerances;
        let t = &mut settings.tolerances;
        let mut changed = false;
        changed |= mm(
            FORMER_TOLERANCE_LABEL,
            &mut t.former_diameter,
            "how far the former's diameter may be from its figure",
        )
        .show(ui)
        .changed();
        changed |= mm(
            LENGTH_TOLERANCE_LABEL,
            &mut t.length,
            "how closely the coil's length is set",
        )
        .show(ui)
        .changed();
        changed |= Quantity::new(WIRE_TOLERANCE_LABEL, &mut t.wire_diameter, 1e-3, 0.0..=0.1)
            .decimals(3)
            .suffix("mm")
            .note("how far the bare wire may be from its nominal diameter")
            .show(ui)
            .changed();
        changed |= Quantity::new(TURNS_TOLERANCE_LABEL, &mut t.turns, 1.0, 0.0..=1.0)
            .decimals(2)
            .step(0.05)
            .note("turns as counted: a quarter when counted to a quarter turn")
            .show(ui)
            .changed();
        changed |= Quantity::new(
            CAPACITOR_TOLERANCE_LABEL,
            &mut t.fixed_fraction,
            0.01,
            0.0..=20.0,
        )
        .decimals(1)
        .suffix("%")
        .note("the fixed capacitor's tolerance")
        .show(ui)
        .changed();
        if changed {
            match check_tolerances(t) {
                Ok(()) => self.refusal = None,
                Err(r) => {
                    *t = before;
                    self.refusal = Some(format!("Not taken: {}", r.reason));
                }
            }
        }
        // Always a row, so nothing moves when a value is refused.
        let text = egui::RichText::new(self.refusal.as_deref().unwrap_or(" "))
            .color(crate::ui::theme::refusal(ui));
        ui.add(egui::Label::new(text).wrap());
    }
}

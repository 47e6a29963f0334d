//! Where the missing picofarads come from: the stray estimate part by part for a building
//! method, the total with its range, the frequency window that range leaves, and an action that
//! puts the typical stray into the tank.
//!
//! The estimate is the engine's (`tuning::stray`, the same inputs as `evaluate --construction`);
//! it is recomputed only when the coil, tank or building method changes.

use crate::model::{Coil, Conditions, Tank};
use crate::tuning::construction::Construction;
use crate::tuning::expectation::{DRAWS, TOLERANCES_IN_WORDS, expect_before_measuring};
use crate::tuning::spread::Spread;
use crate::tuning::stray::{Role, Span, StrayEstimate};
use eframe::egui;

/// Accessible name of the building-method picker.
pub const CONSTRUCTION_LABEL: &str = "Building method";

/// Accessible name of the action that applies the estimate.
pub const APPLY_STRAY_LABEL: &str = "Use the typical stray";

type Key = (Coil, Tank, Conditions, f64, Construction);

/// The panel's own state: the building method and the last estimate.
#[derive(Default)]
pub struct StrayPanel {
    construction: Option<Construction>,
    cached: Option<(Key, StrayEstimate, Span, Spread)>,
}

impl StrayPanel {
    /// Show the estimate for `coil` (with its `self_capacitance`) in `tank`; returns the stray
    /// to put into the tank when the user applies it.
    pub fn show(
        &mut self,
        ui: &mut egui::Ui,
        coil: Option<&Coil>,
        self_capacitance: f64,
        tank: &Tank,
        conditions: &Conditions,
    ) -> Option<f64> {
        let construction = *self.construction.get_or_insert(Construction::CopperClad);
        let label = ui.label(CONSTRUCTION_LABEL);
        let mut picked = construction;
        egui::ComboBox::from_id_salt("tankwright construction")
            .selected_text(picked.label())
            .show_ui(ui, |ui| {
                for c in Construction::ALL {
                    ui.selectable_value(&mut picked, c, c.label());
                }
            })
            .response
            .labelled_by(label.id);
        self.construction = Some(picked);
        let coil = coil?;
        // The estimate replaces the stray as entered, so it is made without it (applying it
        // then changes nothing here).
        let without_guess = Tank {
            stray: 0.0,
            ..*tank
        };
        let key = (*coil, without_guess, *conditions, self_capacitance, picked);
        if self.cached.as_ref().is_none_or(|(k, _, _, _)| *k != key) {
            let e = expect_before_measuring(coil, tank, conditions, self_capacitance, picked);
            let (estimate, window, spread) = (e.estimate, e.window, e.spread);
            self.cached = Some((key, estimate, window, spread));
        }
        let (_, estimate, window, spread) = self.cached.as_ref()?;
        let pf = |s: Span| {
            format!(
                "{:.2} ({:.2}–{:.2}) pF",
                s.typical * 1e12,
                s.low * 1e12,
                s.high * 1e12
            )
        };
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
            });
        ui.add(
            egui::Label::new(format!(
                "Expect {:.3}–{:.3} MHz before the first measurement (typical {:.3} MHz).",
                window.low * 1e-6,
                window.high * 1e-6,
                window.typical * 1e-6
            ))
            .wrap(),
        );
        ui.add(
            egui::Label::new(format!(
                "With the winding's own tolerances too ({TOLERANCES_IN_WORDS}): expect \
                 {:.3}–{:.3} MHz (95 % of {DRAWS} draws).",
                spread.expected.0 * 1e-6,
                spread.expected.1 * 1e-6
            ))
            .wrap(),
        );
        let typical = estimate.stray_term().typical;
        ui.button(APPLY_STRAY_LABEL)
            .on_hover_text(format!(
                "set the tank's stray capacitance to {:.2} pF (undo restores it)",
                typical * 1e12
            ))
            .clicked()
            .then_some(typical)
    }
}

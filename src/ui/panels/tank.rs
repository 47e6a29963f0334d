//! The capacitive side of the tank, and the conditions of the evaluation.

use super::{ROW_GAP, capacitance_quantity, heading};
use crate::model::{Conditions, FeedbackDivider, Field, InductanceModel, Tank};
use crate::ui::widgets::{Quantity, row_label};
use eframe::egui;

/// A divider to start from when the user first ticks the box (a common Colpitts pair).
const STARTING_DIVIDER: FeedbackDivider = FeedbackDivider {
    upper: 10e-12,
    lower: 22e-12,
};

/// The tank panel's own state: the divider values kept while the box is unticked.
pub struct TankPanel {
    kept_divider: FeedbackDivider,
}

impl Default for TankPanel {
    fn default() -> Self {
        Self {
            kept_divider: STARTING_DIVIDER,
        }
    }
}

impl TankPanel {
    /// Show the tank controls; `refused` names the field the engine refused, if any.
    pub fn show(
        &mut self,
        ui: &mut egui::Ui,
        tank: &mut Tank,
        conditions: &mut Conditions,
        refused: Option<Field>,
    ) {
        let is = |field: Field| refused == Some(field);
        heading(ui, "Tank");
        ui.scope(|ui| {
            ui.spacing_mut().item_spacing.y = ROW_GAP;
            let _ = capacitance_quantity("Fixed capacitor", &mut tank.fixed, (0.0, 50.0))
                .note("The fixed tank capacitor across the coil")
                .refused(is(Field::FixedCapacitance))
                .show(ui);
            let _ = capacitance_quantity("Trimmer minimum", &mut tank.trimmer_min, (0.0, 20.0))
                .note("Trimmer capacitance fully open")
                .refused(is(Field::Trimmer))
                .show(ui);
            let _ = capacitance_quantity("Trimmer maximum", &mut tank.trimmer_max, (0.0, 60.0))
                .note("Trimmer capacitance fully closed")
                .refused(is(Field::Trimmer))
                .show(ui);
            let _ = Quantity::new(
                "Trimmer setting",
                &mut tank.trimmer_setting,
                0.01,
                0.0..=100.0,
            )
            .step(0.5)
            .decimals(1)
            .suffix("%")
            .note("0 % is the minimum capacitance, 100 % the maximum (a linear trimmer)")
            .refused(is(Field::TrimmerSetting))
            .show(ui);
            let _ = capacitance_quantity("Stray capacitance", &mut tank.stray, (0.0, 20.0))
                .note("Device, wiring and layout capacitance across the coil")
                .refused(is(Field::StrayCapacitance))
                .show(ui);

            ui.horizontal(|ui| {
                row_label(ui, "Feedback divider");
                let mut enabled = tank.feedback.is_some();
                if ui
                    .checkbox(&mut enabled, "across the tank")
                    .on_hover_text("Two capacitors in series across the tank (Colpitts feedback)")
                    .changed()
                {
                    if enabled {
                        tank.feedback = Some(self.kept_divider);
                    } else if let Some(divider) = tank.feedback.take() {
                        self.kept_divider = divider;
                    }
                }
            });
            if let Some(divider) = &mut tank.feedback {
                let _ = capacitance_quantity("Upper capacitor", &mut divider.upper, (1.0, 220.0))
                    .logarithmic(true)
                    .note("From the hot end of the tank to the tap")
                    .refused(is(Field::Feedback))
                    .show(ui);
                let _ = capacitance_quantity("Lower capacitor", &mut divider.lower, (1.0, 220.0))
                    .logarithmic(true)
                    .note("From the tap to ground")
                    .refused(is(Field::Feedback))
                    .show(ui);
            }

            let _ = Quantity::new(
                "Wire temperature",
                &mut conditions.temperature_c,
                1.0,
                -20.0..=100.0,
            )
            .step(1.0)
            .decimals(0)
            .suffix("°C")
            .note("Copper temperature: sets the resistivity, hence the loss and Q")
            .refused(is(Field::Temperature))
            .show(ui);

            ui.horizontal(|ui| {
                let label = row_label(ui, "Inductance model");
                egui::ComboBox::from_id_salt("inductance_model")
                    .selected_text(conditions.model.label())
                    .width(ui.spacing().slider_width)
                    .show_ui(ui, |ui| {
                        for model in InductanceModel::ALL {
                            ui.selectable_value(&mut conditions.model, model, model.label());
                        }
                    })
                    .response
                    .on_hover_text("The model whose inductance sets the resonance")
                    .labelled_by(label.id);
            });
        });
    }
}

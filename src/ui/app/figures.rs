//! The figures on screen: the field worker asked for the present coil, its answer taken, the
//! evaluation brought up to the recipe, and the charts' field shape.

use super::App;
use crate::recipe::{Footing, Recipe};
use crate::ui::field_worker::FieldRequest;
use eframe::egui;

impl App {
    /// Hand the present coil to the field worker (a no-op when it has not changed; nothing
    /// while the field solution is switched off or the recipe is refused), take its answer if
    /// one has come, and bring the figures up to the recipe and the answer; true if they
    /// changed.
    pub(super) fn refresh_figures(&mut self, ctx: &egui::Context) -> bool {
        // The junction counted in the tank (the audio settings' switch) is in every figure,
        // put there by the same function as `evaluate --junction-…`; never in the recipe's
        // tank.
        let with_junction = self
            .recipe
            .audio
            .junction_in_tank()
            .map(|(m, bias)| Recipe {
                tank: crate::tuning::modulation::tank_with_junction(&self.recipe.tank, &m, bias),
                ..self.recipe.clone()
            });
        let recipe = with_junction.as_ref().unwrap_or(&self.recipe);
        let footing = self.preferences.footing();
        let request = (footing == Footing::FieldSolution)
            .then(|| field_request(recipe))
            .flatten();
        self.field.ask(request, ctx);
        self.field.poll();
        let answer = self.field.ready().map(|a| &a.tank);
        let input = self.evaluation.field_input(footing, answer);
        let mut changed = self.evaluation.refresh(recipe, input);
        // The figures on the field solution, landed off the frame (held meanwhile).
        self.figures_worker
            .ask(self.evaluation.figures_request(), ctx);
        self.figures_worker.poll();
        changed |= self.evaluation.set_figures(self.figures_worker.ready());
        // Then the charts' field shape for the figures now shown.
        self.shape.ask(self.evaluation.shape_request(), ctx);
        self.shape.poll();
        // The stage kept in the recipe, for the charts' operating-frequency line.
        self.evaluation.refresh_stage(self.recipe.stage.as_ref());
        let shaped = self.evaluation.set_shape(self.shape.ready());
        // And the "before calibration" curve's, while the figures are calibrated.
        self.uncalibrated_shape
            .ask(self.evaluation.uncalibrated_shape_request(), ctx);
        self.uncalibrated_shape.poll();
        let before = self
            .evaluation
            .set_uncalibrated_shape(self.uncalibrated_shape.ready());
        shaped || before || changed
    }

    /// The classical formulas' comparison the charts draw (for tests).
    pub fn classical_comparison(&self) -> Option<crate::ui::charts::ClassicalComparison<'_>> {
        self.evaluation.classical_comparison()
    }

    /// Whether the "before calibration" curve is on the field shape (for tests).
    pub fn uncalibrated_curve_field_shaped(&self) -> bool {
        self.evaluation.uncalibrated_field_shaped()
    }

    /// The "before calibration" sweeps as drawn, while the figures are calibrated (for
    /// tests).
    pub fn uncalibrated_chart_sweeps(&self) -> Option<&crate::ui::charts::ChartCache> {
        self.evaluation.uncalibrated_sweeps()
    }

    /// Whether anything shown is still being computed off the frame: the field solution, the
    /// figures landed on it, or the charts' field shape (the window marks it "updating").
    pub fn updating(&self) -> bool {
        self.field.is_working()
            || self.evaluation.is_updating()
            || self.shape.is_working()
            || self.uncalibrated_shape.is_working()
    }

    /// Where the stage kept in the recipe runs, as the charts show it (for tests and
    /// captures).
    pub fn chart_operating(&self) -> Option<crate::ui::charts::Operating> {
        self.evaluation.operating()
    }

    /// Whether the charts draw the field shape (for tests and captures).
    pub fn charts_field_shaped(&self) -> bool {
        self.evaluation.field_shaped()
    }

    /// The charts' sweeps as drawn (for tests and captures): the present figures' curves.
    pub fn chart_sweeps(&self) -> &crate::ui::charts::ChartCache {
        self.evaluation.sweeps()
    }

    /// The field solution of the present coil, once the worker has it.
    pub fn field_solution(&self) -> Option<&crate::ui::field_worker::FieldResult> {
        self.field.ready()
    }
}

/// What the field worker is asked to solve for `recipe` (`None` when its coil or tank is
/// refused): the coil, everything across it but its own capacitance, and the temperature (the
/// only condition the field solution uses, so choosing another driving model asks for
/// nothing new; the field solution knows nothing of the bench readings either).
fn field_request(recipe: &Recipe) -> Option<FieldRequest> {
    let coil = crate::model::Coil::from_winding(&recipe.winding).ok()?;
    recipe.tank.validate().ok()?;
    Some(FieldRequest {
        coil,
        external_capacitance: recipe.tank.external_capacitance(),
        conditions: crate::tuning::field_tank::field_conditions(&recipe.conditions),
    })
}

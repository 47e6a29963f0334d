//! Every figure of a recipe, computed once by the engine: the one function the window, the
//! build sheet and the headless commands call, so they cannot disagree.
//!
//! Once the recipe holds bench readings, the calibrated model (the fit's extra capacitance and
//! inductance scale applied; see [`crate::tuning::fit`]) drives every figure: the analysis, the
//! target figures and the advice. The uncalibrated analysis is kept beside it.

use super::document::Recipe;
use crate::model::{Analysis, Coil, Conditions, InputError, Tank, evaluate, evaluate_coil};
use crate::tuning::fit::{Fit, FitError, InverseSquareLine, fit, inverse_square_line};
use crate::tuning::target::{TargetFigures, target_figures};
use crate::tuning::verdict::{Aim, Verdict, judge};

/// Everything computed for a valid recipe.
#[derive(Clone, Debug, PartialEq)]
pub struct Figures {
    /// The validated coil.
    pub coil: Coil,
    /// The tank that drives the figures (calibrated when there are readings that fit).
    pub tank: Tank,
    /// The conditions that drive the figures (calibrated likewise).
    pub conditions: Conditions,
    /// Every figure of the engine, calibrated when there are readings that fit.
    pub analysis: Analysis,
    /// The model as it stands, before any calibration.
    pub uncalibrated: Analysis,
    /// The fit of the bench readings (`None` when there are none).
    pub fit: Option<Result<Fit, FitError>>,
    /// The straight line of 1/f² against external capacitance through the readings at the
    /// latest reading's length (`None` with fewer than two there).
    pub line: Option<InverseSquareLine>,
    /// Against the target, by the driving (calibrated) model.
    pub target: TargetFigures,
    /// The verdict against the recipe's channel and band plan, by the driving (calibrated)
    /// model: what the window's verdict block and the build sheet both show.
    pub verdict: Verdict,
}

impl Figures {
    /// Whether the figures come from a model calibrated on bench readings.
    pub fn calibrated(&self) -> bool {
        matches!(self.fit, Some(Ok(_)))
    }

    /// How many readings the calibration rests on (0 when uncalibrated).
    pub fn readings_used(&self) -> usize {
        match &self.fit {
            Some(Ok(f)) => f.readings_used,
            _ => 0,
        }
    }
}

/// Every figure of `recipe`, or the refusal naming the field at fault.
pub fn figures(recipe: &Recipe) -> Result<Figures, InputError> {
    let uncalibrated = evaluate(&recipe.winding, &recipe.tank, &recipe.conditions)?;
    let coil = uncalibrated.coil;
    let readings = recipe.readings();
    let fit =
        (!readings.is_empty()).then(|| fit(&coil, &recipe.tank, &recipe.conditions, &readings));
    let (tank, conditions, analysis) = match &fit {
        Some(Ok(f)) => {
            let tank = f.calibration.tank(&recipe.tank);
            let conditions = f.calibration.conditions(&recipe.conditions);
            let analysis = evaluate_coil(&coil, tank.external_capacitance(), &conditions);
            (tank, conditions, analysis)
        }
        _ => (recipe.tank, recipe.conditions, uncalibrated.clone()),
    };
    let target = target_figures(
        &coil,
        &tank,
        &conditions,
        &recipe.target.plan,
        recipe.target.channel,
        recipe.target.tolerance(),
    );
    let line = inverse_square_line(&recipe.tank, &readings);
    let aim = Aim::new(recipe.target.plan.clone(), Some(recipe.target.channel))
        .with_tolerance(recipe.target.tolerance());
    let verdict = judge(&coil, &tank, &conditions, &aim);
    Ok(Figures {
        line,
        coil,
        tank,
        conditions,
        analysis,
        uncalibrated,
        fit,
        target,
        verdict,
    })
}

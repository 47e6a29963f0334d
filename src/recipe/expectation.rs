//! Where the built coil can be expected to land, for a recipe: the stray estimate for its
//! building method, the frequency window it leaves, the spread with the builder's tolerances
//! (before any measurement), and, once bench readings calibrate the model, what the fit's errors
//! leave. The window's stray panel, verdict line and spacing-chart band all read this one
//! computation (`ui::evaluation` keeps it between frames).

use super::document::Recipe;
use super::figures::Figures;
use crate::model::Tank;
use crate::tuning::spread::{Spread, TankParts, calibrated_band, linear_band, spread};
use crate::tuning::stray::{Span, StrayEstimate, estimate_stray, frequency_window, inputs_for};

/// Monte Carlo draws for the spread at the present coil (at least 1000, as the issue of the
/// spread asks; tests/engine/batch_spread.rs holds the linear band to it).
pub const DRAWS: usize = 1000;

/// Seed of the draws, so the same recipe always shows the same figures.
const SEED: u64 = 1;

/// The fitted stray beside the estimate.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct FittedStray {
    /// The stray the readings imply: the tank's stray as entered plus the fit's extra
    /// capacitance, farads.
    pub value: f64,
    /// Its standard error, farads.
    pub error: f64,
    /// Fitted minus the estimate's typical stray, farads.
    pub difference: f64,
    /// Whether the fitted value lies within the estimate's low–high range.
    pub within_estimate: bool,
}

/// What to expect of a recipe's build.
#[derive(Clone, Debug, PartialEq)]
pub struct Expectation {
    /// The stray estimate for the recipe's building method (made without the stray as
    /// entered, which it would replace).
    pub estimate: StrayEstimate,
    /// The frequency window the estimate's range leaves, hertz.
    pub window: Span,
    /// The spread at the present coil before any measurement: the builder's tolerances and
    /// the estimate's range around the stray as entered (Monte Carlo and linear).
    pub before: Spread,
    /// The band drawn around the present curve on the spacing chart: (length in metres, low
    /// and high hertz) at each length asked for; before calibration the linear band of the
    /// same inputs as [`Expectation::before`], after it the band the fit's errors leave.
    pub band: Vec<[f64; 3]>,
    /// The range to expect at the present coil, hertz: the central 95 % of the draws before
    /// calibration, the calibrated band at the present length after it.
    pub expected: (f64, f64),
    /// Whether the band and [`Expectation::expected`] come from a bench calibration.
    pub calibrated: bool,
    /// The fitted stray beside the estimate, when the readings were fitted.
    pub fitted: Option<FittedStray>,
}

/// The stray term the spread draws from: the stray as entered, with the estimate's range
/// around it (low − typical below, high − typical above, never below zero), so that the band
/// surrounds the curve drawn; once the estimate is applied, it is the estimate itself.
fn stray_around_entered(estimate: &StrayEstimate, entered: f64) -> Span {
    let s = estimate.stray_term();
    Span::new(
        (entered - (s.typical - s.low)).max(0.0),
        entered,
        entered + (s.high - s.typical),
    )
}

/// What to expect of `recipe`'s build, with its `figures` (from [`super::figures()`]), and the
/// band over `lengths` (metres, the spacing chart's).
pub fn expectation(recipe: &Recipe, figures: &Figures, lengths: &[f64]) -> Expectation {
    let settings = &recipe.stray_estimate;
    let coil = &figures.coil;
    let tank = &recipe.tank;
    // Before the bench readings: the model moved onto the field solution when there is one.
    let conditions = &figures.uncalibrated_conditions;
    let without_entered = Tank {
        stray: 0.0,
        ..*tank
    };
    let inputs = inputs_for(
        coil,
        &without_entered,
        figures.uncalibrated.self_capacitance,
        settings.tolerances.fixed_fraction,
        Some(settings.construction),
    );
    let estimate = estimate_stray(&inputs);
    let window = frequency_window(coil, conditions, &estimate);
    let tolerances = settings
        .tolerances
        .with_stray(stray_around_entered(&estimate, tank.stray));
    let parts = TankParts {
        fixed: tank.fixed,
        other: tank.external_capacitance() - tank.fixed - tank.stray,
    };
    let before = spread(coil, &parts, conditions, &tolerances, DRAWS, SEED);
    let fit = match &figures.fit {
        Some(Ok(fit)) => Some(fit),
        _ => None,
    };
    let (band, expected) = match fit {
        Some(fit) => {
            let external = figures.tank.external_capacitance();
            let band = calibrated_band(coil, external, &figures.conditions, fit, lengths);
            let here = calibrated_band(coil, external, &figures.conditions, fit, &[coil.length()]);
            let expected = here.first().map_or((f64::NAN, f64::NAN), |p| (p[1], p[2]));
            (band, expected)
        }
        None => (
            linear_band(coil, &parts, conditions, &tolerances, lengths),
            before.expected,
        ),
    };
    let fitted = fit.map(|fit| {
        let value = tank.stray + fit.calibration.extra_capacitance;
        let s = estimate.stray_term();
        FittedStray {
            value,
            error: fit.extra_capacitance_error,
            difference: value - s.typical,
            within_estimate: s.low <= value && value <= s.high,
        }
    });
    Expectation {
        estimate,
        window,
        before,
        band,
        expected,
        calibrated: fit.is_some(),
        fitted,
    }
}

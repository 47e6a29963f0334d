//! What to expect before the first measurement: the stray estimate for a building method, the
//! frequency window its range leaves, and the spread once the winding's own tolerances are
//! added (Monte Carlo, [`super::spread`]). The window's stray panel and the printed build sheet
//! both call [`expect_before_measuring`], so they show the same figures.

use super::construction::Construction;
use super::spread::{Spread, TankParts, Tolerances, spread};
use super::stray::{Span, StrayEstimate, estimate_stray, frequency_window, inputs_for};
use crate::model::{Coil, Conditions, Tank};

/// The fixed capacitor's tolerance assumed (common practice: ±5 % ceramic).
pub const FIXED_TOLERANCE: f64 = 0.05;

/// Winding tolerances of a hand-wound coil (common practice): the former ±0.1 mm, the length
/// as set ±0.2 mm, the wire ±0.01 mm, the turns counted to a quarter.
pub const WINDING: (f64, f64, f64, f64) = (0.1e-3, 0.2e-3, 0.01e-3, 0.25);

/// Monte Carlo draws for the spread (at least 1000; the band agrees with linear propagation,
/// tests/batch_spread.rs).
pub const DRAWS: usize = 1000;

/// The same words wherever the tolerances are named.
pub const TOLERANCES_IN_WORDS: &str = "former ±0.1 mm, length ±0.2 mm, wire ±0.01 mm, turns to \
     a quarter, fixed capacitor ±5 %";

/// The expectation for one coil and tank.
#[derive(Clone, Debug, PartialEq)]
pub struct Expectation {
    /// The building method the stray was estimated for.
    pub construction: Construction,
    /// The stray estimate, part by part.
    pub estimate: StrayEstimate,
    /// The resonance over the stray estimate's range (low, typical, high), hertz.
    pub window: Span,
    /// The spread with the winding's tolerances too ([`WINDING`], [`FIXED_TOLERANCE`]).
    pub spread: Spread,
}

/// The expectation for `coil` (with its `self_capacitance`) in `tank` built by
/// `construction`. The tank's own stray is left out: the estimate replaces it.
pub fn expect_before_measuring(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    self_capacitance: f64,
    construction: Construction,
) -> Expectation {
    let without_guess = Tank {
        stray: 0.0,
        ..*tank
    };
    let inputs = inputs_for(
        coil,
        &without_guess,
        self_capacitance,
        FIXED_TOLERANCE,
        Some(construction),
    );
    let estimate = estimate_stray(&inputs);
    let window = frequency_window(coil, conditions, &estimate);
    let tolerances = Tolerances {
        former_diameter: WINDING.0,
        length: WINDING.1,
        wire_diameter: WINDING.2,
        turns: WINDING.3,
        fixed_fraction: FIXED_TOLERANCE,
        stray: estimate.stray_term(),
    };
    let parts = TankParts {
        fixed: tank.fixed,
        other: without_guess.external_capacitance() - tank.fixed,
    };
    let spread = spread(coil, &parts, conditions, &tolerances, DRAWS, 1);
    Expectation {
        construction,
        estimate,
        window,
        spread,
    }
}

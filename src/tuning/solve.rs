//! Solving for the spacing or trimmer setting that lands the tank on a target.

use super::sweep::touching_length;
use crate::model::{Coil, Conditions, Tank, evaluate::resonance_of};
use std::fmt;

/// Why no spacing or setting reaches the target.
#[derive(Clone, Debug, PartialEq)]
pub enum Unreachable {
    /// Even close-wound the tank resonates above the target (needs more L or C).
    AboveEvenCloseWound {
        /// Resonance with the turns touching, hertz.
        close_wound: f64,
    },
    /// Even stretched to the longest length the tank resonates below the target.
    BelowEvenStretched {
        /// Resonance at the longest length tried, hertz.
        stretched: f64,
    },
    /// The target is outside what the trimmer can reach.
    OutsideTrimmer {
        /// Lowest reachable resonance (trimmer at maximum), hertz.
        low: f64,
        /// Highest reachable resonance (trimmer at minimum), hertz.
        high: f64,
    },
}

impl fmt::Display for Unreachable {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Unreachable::AboveEvenCloseWound { close_wound } => write!(
                f,
                "even close-wound the tank resonates at {:.3} MHz, above the target: add a turn or capacitance",
                close_wound * 1e-6
            ),
            Unreachable::BelowEvenStretched { stretched } => write!(
                f,
                "even stretched the tank resonates at {:.3} MHz, below the target: remove a turn or capacitance",
                stretched * 1e-6
            ),
            Unreachable::OutsideTrimmer { low, high } => write!(
                f,
                "the trimmer reaches only {:.3}–{:.3} MHz at this spacing",
                low * 1e-6,
                high * 1e-6
            ),
        }
    }
}

/// Longest coil a stretch solver will propose: four diameters or 30 pitches of the wire,
/// whichever is longer (common practice: beyond that a self-supporting coil sags).
pub fn longest_length(coil: &Coil) -> f64 {
    (4.0 * coil.mean_diameter).max(touching_length(coil) * 3.0)
}

fn bisect(mut lo: f64, mut hi: f64, mut above: impl FnMut(f64) -> bool) -> f64 {
    // `above(x)` is false at lo and true at hi; 60 halvings reach f64 resolution.
    for _ in 0..60 {
        let mid = 0.5 * (lo + hi);
        if above(mid) {
            hi = mid;
        } else {
            lo = mid;
        }
    }
    0.5 * (lo + hi)
}

/// Coil length (metres) that lands the tank on `target` hertz across `external_capacitance`.
///
/// Resonance rises monotonically as the coil is stretched (less inductance), so bisection on
/// length between close-wound and [`longest_length`] finds it.
pub fn length_for_target(
    coil: &Coil,
    external_capacitance: f64,
    conditions: &Conditions,
    target: f64,
) -> Result<f64, Unreachable> {
    let f_at = |l: f64| resonance_of(&coil.with_length(l), external_capacitance, conditions);
    let lo = touching_length(coil);
    let hi = longest_length(coil);
    let f_lo = f_at(lo);
    if f_lo > target {
        return Err(Unreachable::AboveEvenCloseWound { close_wound: f_lo });
    }
    let f_hi = f_at(hi);
    if f_hi < target {
        return Err(Unreachable::BelowEvenStretched { stretched: f_hi });
    }
    Ok(bisect(lo, hi, |l| f_at(l) >= target))
}

/// Trimmer setting (0–1) that lands the tank on `target` at the coil's present length.
pub fn setting_for_target(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    target: f64,
) -> Result<f64, Unreachable> {
    let (low, high) = trimmer_window(coil, tank, conditions);
    if !(low..=high).contains(&target) {
        return Err(Unreachable::OutsideTrimmer { low, high });
    }
    // More setting, more capacitance, lower frequency.
    Ok(bisect(0.0, 1.0, |s| {
        resonance_of(coil, tank.external_capacitance_at(s), conditions) <= target
    }))
}

/// Lowest and highest resonance the trimmer reaches at this length: (at maximum, at minimum).
pub fn trimmer_window(coil: &Coil, tank: &Tank, conditions: &Conditions) -> (f64, f64) {
    (
        resonance_of(coil, tank.external_capacitance_at(1.0), conditions),
        resonance_of(coil, tank.external_capacitance_at(0.0), conditions),
    )
}

/// How far the resonance moves per metre of stretch, Hz/m (positive: stretching raises it),
/// by a central difference of ±1 % of the length (one-sided when close-wound).
pub fn stretch_sensitivity(coil: &Coil, external_capacitance: f64, conditions: &Conditions) -> f64 {
    let h = 0.01 * coil.length;
    let lo = (coil.length - h).max(touching_length(coil));
    let hi = coil.length + h;
    let f = |l: f64| resonance_of(&coil.with_length(l), external_capacitance, conditions);
    (f(hi) - f(lo)) / (hi - lo)
}

/// How far the resonance moves per unit of trimmer setting (Hz per 100 %), at the present
/// setting, by a central difference of ±1 %.
pub fn trimmer_sensitivity(coil: &Coil, tank: &Tank, conditions: &Conditions) -> f64 {
    let s = tank.trimmer_setting;
    let lo = (s - 0.01).max(0.0);
    let hi = (s + 0.01).min(1.0);
    let f = |x: f64| resonance_of(coil, tank.external_capacitance_at(x), conditions);
    (f(hi) - f(lo)) / (hi - lo)
}

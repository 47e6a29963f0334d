//! Solving for the length, trimmer setting or turns that land the tank on a target.
//!
//! Resonance against coil length is not monotonic everywhere: near self-resonance, and with
//! long leads whose inductance does not shrink as the coil stretches while Medhurst's
//! self-capacitance does change, the curve can turn over. So the length solver never assumes a
//! direction: it scans the whole buildable range for sign changes of f(l) − target, brackets
//! every root and bisects each, and proposes the root nearest the present length.

use crate::model::{Coil, Conditions, Tank, evaluate::resonance_of};
use std::fmt;

/// Why no spacing or setting reaches the target.
#[derive(Clone, Debug, PartialEq)]
pub enum Unreachable {
    /// Over the whole buildable range of lengths the tank resonates above the target
    /// (needs more L or C).
    AboveEvenCloseWound {
        /// Lowest resonance over the range of lengths, hertz.
        close_wound: f64,
    },
    /// Over the whole range of lengths the tank resonates below the target.
    BelowEvenStretched {
        /// Highest resonance over the range of lengths, hertz.
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
                "even at its lowest ({}) the tank resonates above the target: add a turn or capacitance",
                super::digits::mhz(*close_wound)
            ),
            Unreachable::BelowEvenStretched { stretched } => write!(
                f,
                "even at its highest ({}) the tank resonates below the target: remove a turn or capacitance",
                super::digits::mhz(*stretched)
            ),
            Unreachable::OutsideTrimmer { low, high } => write!(
                f,
                "the trimmer reaches only {} at this spacing",
                super::digits::mhz_range(*low, *high)
            ),
        }
    }
}

/// Points of the scan that brackets the roots in length: fine enough that a turnover (a
/// maximum of f over l) is never stepped over between two points in practice.
const SCAN_POINTS: usize = 96;

/// `above(x)` is false at lo and true at hi; 60 halvings reach f64 resolution.
fn bisect(lo: f64, hi: f64, above: impl FnMut(f64) -> bool) -> f64 {
    crate::physics::roots::bisect(lo, hi, 60, above)
}

/// Resonance (hertz) of `coil` stretched or squeezed to `length` across `external_capacitance`;
/// NaN for a length the model refuses.
pub fn resonance_at_length(
    coil: &Coil,
    length: f64,
    external_capacitance: f64,
    conditions: &Conditions,
) -> f64 {
    coil.with_length(length).map_or(f64::NAN, |c| {
        resonance_of(&c, external_capacitance, conditions)
    })
}

/// Every coil length (metres, ascending) between [`Coil::shortest_length`] and
/// [`Coil::longest_proposed_length`] that lands the tank on `target` hertz, or why none does.
pub fn lengths_for_target(
    coil: &Coil,
    external_capacitance: f64,
    conditions: &Conditions,
    target: f64,
) -> Result<Vec<f64>, Unreachable> {
    let f_at = |l: f64| resonance_at_length(coil, l, external_capacitance, conditions);
    let lo = coil.shortest_length();
    let hi = coil.longest_proposed_length().max(lo);
    roots_of(lo, hi, f_at, target)
}

/// Every x in [lo, hi] (ascending) where `f_at(x)` = `target`, by a scan of `SCAN_POINTS`
/// points and bisection of each sign change, or why none is (the curve's lowest above the
/// target, or its highest below it). `f_at` returns NaN where it has no value.
pub fn roots_of(
    lo: f64,
    hi: f64,
    f_at: impl Fn(f64) -> f64,
    target: f64,
) -> Result<Vec<f64>, Unreachable> {
    let step = (hi - lo) / (SCAN_POINTS - 1) as f64;
    let scan: Vec<[f64; 2]> = (0..SCAN_POINTS)
        .map(|i| {
            let l = if i + 1 == SCAN_POINTS {
                hi
            } else {
                lo + step * i as f64
            };
            [l, f_at(l)]
        })
        .filter(|p| p[1].is_finite())
        .collect();
    let mut roots = Vec::new();
    for w in scan.windows(2) {
        let ([a, fa], [b, fb]) = (w[0], w[1]);
        if fa == target {
            roots.push(a);
        } else if (fa < target) != (fb < target) {
            let rising = fb > fa;
            roots.push(bisect(a, b, |l| (f_at(l) >= target) == rising));
        }
    }
    if let Some(&[l, f]) = scan.last()
        && f == target
    {
        roots.push(l);
    }
    if !roots.is_empty() {
        return Ok(roots);
    }
    let lowest = scan.iter().map(|p| p[1]).fold(f64::INFINITY, f64::min);
    let highest = scan.iter().map(|p| p[1]).fold(f64::NEG_INFINITY, f64::max);
    if lowest > target {
        Err(Unreachable::AboveEvenCloseWound {
            close_wound: lowest,
        })
    } else {
        Err(Unreachable::BelowEvenStretched { stretched: highest })
    }
}

/// The coil length (metres) that lands the tank on `target` hertz nearest the coil's present
/// length (see [`lengths_for_target`] for all of them).
pub fn length_for_target(
    coil: &Coil,
    external_capacitance: f64,
    conditions: &Conditions,
    target: f64,
) -> Result<f64, Unreachable> {
    let roots = lengths_for_target(coil, external_capacitance, conditions, target)?;
    let present = coil.length();
    Ok(roots
        .into_iter()
        .min_by(|a, b| (a - present).abs().total_cmp(&(b - present).abs()))
        .unwrap_or(present))
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
/// by a central difference of ±1 % of the length (one-sided at the ends of the range).
pub fn stretch_sensitivity(coil: &Coil, external_capacitance: f64, conditions: &Conditions) -> f64 {
    let h = 0.01 * coil.length();
    let lo = (coil.length() - h).max(coil.shortest_length());
    let hi = (coil.length() + h).min(crate::model::limits::LENGTH_MAX);
    let f = |l: f64| resonance_at_length(coil, l, external_capacitance, conditions);
    (f(hi) - f(lo)) / (hi - lo)
}

/// A coil with another number of turns that lands the target.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct TurnsChange {
    /// The new number of turns (a whole number of quarter turns).
    pub turns: f64,
    /// The coil length (turns × pitch) that then lands the target, metres.
    pub length: f64,
}

/// Most quarter turns added or removed when looking for a coil that reaches the target.
pub const MAX_QUARTER_STEPS: u32 = 80;

/// The smallest change in quarter turns (same wire, diameter and leads) after which some
/// buildable length lands `target`; the length proposed keeps the pitch nearest the present
/// one. `None` when no change of up to 20 turns does.
pub fn turns_for_target(
    coil: &Coil,
    external_capacitance: f64,
    conditions: &Conditions,
    target: f64,
) -> Option<TurnsChange> {
    let pitch = coil.pitch();
    for k in 1..=MAX_QUARTER_STEPS {
        for sign in [1.0, -1.0] {
            let turns = coil.turns() + sign * 0.25 * f64::from(k);
            let Ok(candidate) = coil.with_turns(turns, turns * pitch) else {
                continue;
            };
            let Ok(length) =
                length_for_target(&candidate, external_capacitance, conditions, target)
            else {
                continue;
            };
            return Some(TurnsChange { turns, length });
        }
    }
    None
}

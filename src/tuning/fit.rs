//! Correcting from a bench measurement: what the build really has, and how far to move.

use super::solve::{Unreachable, length_for_target};
use crate::model::{Coil, Conditions, evaluate::resonance_of};

/// What a measurement says about the build.
#[derive(Clone, Debug, PartialEq)]
pub struct Correction {
    /// Capacitance the build has beyond the model's, farads (negative: less than assumed).
    /// It lumps every error (stray, device capacitance, former-diameter slip) into one number
    /// that reproduces the measurement.
    pub extra_capacitance: f64,
    /// Coil length that lands the target with that extra capacitance, metres.
    pub length_for_target: Result<f64, Unreachable>,
    /// Length change from the coil as measured, metres (positive: stretch).
    pub stretch: Option<f64>,
}

/// Find the extra capacitance that makes the model reproduce `measured` hertz for `coil`
/// across `external_capacitance`, then the length that hits `target`.
///
/// Returns `None` when no capacitance between −(external) and +1 nF reproduces the
/// measurement (a reading far from anything this coil can do).
pub fn correct_from_measurement(
    coil: &Coil,
    external_capacitance: f64,
    conditions: &Conditions,
    measured: f64,
    target: f64,
) -> Option<Correction> {
    if !(measured.is_finite() && measured > 0.0) {
        return None;
    }
    let f_at = |dc: f64| resonance_of(coil, external_capacitance + dc, conditions);
    let lo = -external_capacitance;
    let hi = 1e-9;
    // Frequency falls as capacitance rises.
    if f_at(lo) < measured || f_at(hi) > measured {
        return None;
    }
    let (mut a, mut b) = (lo, hi);
    for _ in 0..80 {
        let mid = 0.5 * (a + b);
        if f_at(mid) > measured {
            a = mid;
        } else {
            b = mid;
        }
    }
    let extra = 0.5 * (a + b);
    let length = length_for_target(coil, external_capacitance + extra, conditions, target);
    Some(Correction {
        extra_capacitance: extra,
        stretch: length.as_ref().ok().map(|l| l - coil.length),
        length_for_target: length,
    })
}

/// Length uncertainty (metres) that an instrument error of `error_ppm` on a reading of
/// `measured` hertz carries, for a coil whose resonance moves `slope` Hz per metre of stretch:
/// |ppm·10⁻⁶·f / slope|. `None` for a coil whose stretch does not move it.
pub fn length_uncertainty(error_ppm: f64, measured: f64, slope: f64) -> Option<f64> {
    (slope.abs() > 0.0).then(|| (error_ppm * 1e-6 * measured / slope).abs())
}

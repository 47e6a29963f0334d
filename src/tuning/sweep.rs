//! Sweeps of the resonance for the charts.

use super::landing::Shape;
use crate::model::batch::{SweepColumns, resonance_over_lengths};
use crate::model::{Coil, Conditions, Tank, evaluate::resonance_of};

/// The name of the one curve a fixed tank (no trimmer travel) draws on a spacing chart, in
/// the window and the hand-outs: in place of one curve per trimmer setting, all alike.
pub const FIXED_CURVE_LABEL: &str = "resonance (no trimmer)";

/// Trimmer settings the spacing chart draws a curve for (the window and the hand-outs).
pub const CHART_SETTINGS: [f64; 5] = [0.0, 0.25, 0.5, 0.75, 1.0];

/// Points per chart curve: about one or two per horizontal pixel of a panel-sized chart.
pub const CHART_SAMPLES: usize = 240;

/// The lengths a spacing chart sweeps for `coil` when nothing holds its axis: close-wound
/// (turns touching) to the longest length proposed, or 1.5 × the present length if longer.
pub fn chart_length_range(coil: &Coil) -> (f64, f64) {
    let lo = coil.shortest_length();
    let hi = coil.longest_proposed_length().max(1.5 * coil.length());
    (lo, hi)
}

/// The lengths the teaching bench's sweep runs between, metres: the coil's shortest
/// buildable length (close-wound; bare wire keeps its minimum gap) to the longest a solver
/// proposes, widened to hold the coil's own length. Inside [`chart_length_range`] (same low
/// end, and its high end is at least both of these), so the charts' field shape
/// ([`super::landing::chart_shape`]) reaches every length the sweep shows.
pub fn teaching_range(coil: &Coil) -> (f64, f64) {
    let lo = coil.shortest_length();
    let hi = coil.longest_proposed_length().max(coil.length()).max(lo);
    (lo, hi)
}

/// Resonance against coil length at one trimmer setting.
#[derive(Clone, Debug, PartialEq)]
pub struct SpacingCurve {
    /// Trimmer setting 0–1.
    pub setting: f64,
    /// (coil length in metres, resonance in hertz).
    pub points: Vec<[f64; 2]>,
}

/// Resonance against coil length for each trimmer setting.
///
/// `lengths` is the (shortest, longest) coil length in metres, kept within what the coil can be
/// wound to ([`Coil::shortest_length`] to the model's longest). `samples` points per curve,
/// evenly spaced in length, each curve computed in one call of the batch path
/// ([`resonance_over_lengths`]: equal to the per-point path within 1e-9, tests/engine/batch_spread.rs).
pub fn spacing_sweep(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    settings: &[f64],
    lengths: (f64, f64),
    samples: usize,
) -> Vec<SpacingCurve> {
    let lo = lengths.0.max(coil.shortest_length());
    let hi = lengths
        .1
        .max(lo * 1.001)
        .min(crate::model::limits::LENGTH_MAX);
    let n = samples.max(2);
    let lengths: Vec<f64> = (0..n)
        .map(|i| lo + (hi - lo) * i as f64 / (n - 1) as f64)
        .collect();
    let mut columns = SweepColumns::default();
    let mut out = vec![0.0; n];
    settings
        .iter()
        .map(|&setting| {
            let c_ext = tank.external_capacitance_at(setting);
            resonance_over_lengths(coil, c_ext, conditions, &lengths, &mut out, &mut columns);
            let points = lengths.iter().zip(&out).map(|(&l, &f)| [l, f]).collect();
            SpacingCurve { setting, points }
        })
        .collect()
}

/// [`spacing_sweep`] on the field shape when given: each point is the classical model with
/// the shape's factor at its length and capacitance ([`Shape::resonance_at`], one
/// evaluation per point rather than the batch path: 1 200 points take about a millisecond);
/// tests/engine/landing.rs measures the curves against exact field solves.
pub fn spacing_sweep_on(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    settings: &[f64],
    lengths: (f64, f64),
    samples: usize,
    shape: Option<&Shape>,
) -> Vec<SpacingCurve> {
    let mut curves = spacing_sweep(coil, tank, conditions, settings, lengths, samples);
    if let Some(shape) = shape {
        for curve in &mut curves {
            let c_ext = tank.external_capacitance_at(curve.setting);
            for p in &mut curve.points {
                p[1] = shape.resonance_at(coil, p[0], c_ext);
            }
        }
    }
    curves
}

/// Resonance against trimmer setting (0–1) at the coil's own length: (setting, hertz).
pub fn trimmer_sweep(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    samples: usize,
) -> Vec<[f64; 2]> {
    let n = samples.max(2);
    (0..n)
        .map(|i| {
            let s = i as f64 / (n - 1) as f64;
            [
                s,
                resonance_of(coil, tank.external_capacitance_at(s), conditions),
            ]
        })
        .collect()
}

/// [`trimmer_sweep`] on the field shape when given: the resonance at the coil's own length
/// with the shape's factor at each setting's capacitance ([`Shape::resonance_at`]); exact
/// where the shape solved the field (the present coil at the trimmer's ends and present
/// setting, [`super::landing::chart_shape`]).
pub fn trimmer_sweep_on(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    samples: usize,
    shape: Option<&Shape>,
) -> Vec<[f64; 2]> {
    let mut points = trimmer_sweep(coil, tank, conditions, samples);
    if let Some(shape) = shape {
        for p in &mut points {
            p[1] = shape.resonance_at(coil, coil.length(), tank.external_capacitance_at(p[0]));
        }
    }
    points
}

/// A band around the classical curve of `coil` across `external` (`band`: length in metres,
/// low and high hertz, as [`super::spread`] gives it) moved onto the field shape: each point
/// scaled by the field-shaped resonance over the classical one at its length, so the band
/// surrounds the field-shaped curve and keeps its relative width (the spread is the model's
/// linear propagation of the tolerances, a fraction of the resonance; the shape changes that
/// fraction's base by a few per cent at most).
pub fn band_on_shape(
    band: &[[f64; 3]],
    coil: &Coil,
    external: f64,
    conditions: &Conditions,
    shape: &Shape,
) -> Vec<[f64; 3]> {
    band.iter()
        .map(|&[l, lo, hi]| {
            let classical = coil
                .with_length(l)
                .map_or(f64::NAN, |c| resonance_of(&c, external, conditions));
            let r = shape.resonance_at(coil, l, external) / classical;
            [l, lo * r, hi * r]
        })
        .collect()
}

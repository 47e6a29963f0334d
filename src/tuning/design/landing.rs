//! The coil lengths that land the target at the trimmer's mid-travel, for one coil across
//! several tank capacitances, on the model moved onto the field solution by a factor that
//! follows the coil's length ([`ScaleCurve`]): the resonance over the scan's lengths by the
//! batch path (one sweep per capacitance, [`crate::model::batch::resonance_over_lengths`]) or
//! point by point ([`crate::tuning::solve::resonance_at_length`], the plain per-candidate loop
//! the batch is measured and tested against), each divided by √s (f ∝ s^(−1/2) for a factor s
//! on the inductance), then every sign change of f − target refined on the per-point path.
//!
//! Both scan the per-point solver's lengths (96 points from the close-wound length to the
//! longest proposed, [`Coil::longest_proposed_length`]), so they bracket the same roots; each
//! root is refined by regula falsi (Illinois) to 1e-12 of the target.

use crate::model::batch::{SweepColumns, resonance_over_lengths};
use crate::model::{Coil, Conditions};
use crate::tuning::solve::{Unreachable, resonance_at_length};

/// The field solution's factor on the model's inductance against l/D for one former and wire:
/// piecewise linear through the points solved, held level beyond them. The factor follows the
/// length strongly (the leads and the closing path weigh more as the turns open out: 1.11 at
/// l/D = 0.8 to 1.44 at 3.9 for 3.75 turns on 6 mm, measured with `tankwright evaluate`).
#[derive(Clone, Debug, PartialEq)]
pub struct ScaleCurve {
    points: Vec<(f64, f64)>,
}

impl ScaleCurve {
    /// One factor everywhere.
    pub fn flat(scale: f64) -> Self {
        Self {
            points: vec![(1.0, scale)],
        }
    }

    /// Through (l/D, factor) points (any order; at least one, else the factor 1).
    pub fn through(mut points: Vec<(f64, f64)>) -> Self {
        points.retain(|p| p.0.is_finite() && p.1.is_finite() && p.1 > 0.0);
        points.sort_by(|a, b| a.0.total_cmp(&b.0));
        points.dedup_by(|a, b| (a.0 - b.0).abs() < 1e-9);
        if points.is_empty() {
            return Self::flat(1.0);
        }
        Self { points }
    }

    /// The factor at l/D = `x`.
    pub fn at(&self, x: f64) -> f64 {
        let p = &self.points;
        let (first, last) = (p[0], p[p.len() - 1]);
        if x.is_nan() || x <= first.0 {
            return first.1;
        }
        if x >= last.0 {
            return last.1;
        }
        let i = p.partition_point(|q| q.0 <= x).clamp(1, p.len() - 1);
        let (a, b) = (p[i - 1], p[i]);
        a.1 + (b.1 - a.1) * (x - a.0) / (b.0 - a.0)
    }

    /// `base` with the factor at `coil`'s l/D on the inductance.
    pub fn conditions(&self, coil: &Coil, base: &Conditions) -> Conditions {
        Conditions {
            inductance_scale: base.inductance_scale * self.at(coil.length_over_diameter()),
            ..*base
        }
    }
}

/// How the search finds landing lengths.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Default)]
pub enum Method {
    /// The batch path: one sweep per capacitance (the default).
    #[default]
    Batch,
    /// The per-point path at each length of each candidate (the plain loop, for tests and
    /// the bench).
    PerCandidate,
}

/// Points of the scan (the per-point solver's own count, so both bracket the same roots).
const SCAN_POINTS: usize = 96;

/// Scratch kept between calls, so a search allocates once.
#[derive(Clone, Debug, Default)]
pub struct Scratch {
    lengths: Vec<f64>,
    out: Vec<f64>,
    columns: SweepColumns,
}

/// For each of `externals` (farads): the lengths (metres, ascending) that land `target`
/// hertz on the model under `conditions` moved by `curve`, or why none does.
pub fn landing_lengths(
    coil: &Coil,
    externals: &[f64],
    conditions: &Conditions,
    curve: &ScaleCurve,
    target: f64,
    method: Method,
    scratch: &mut Scratch,
) -> Vec<Result<Landing, Unreachable>> {
    let lo = coil.shortest_length();
    let hi = coil.longest_proposed_length().max(lo);
    let step = (hi - lo) / (SCAN_POINTS - 1) as f64;
    scratch.lengths.clear();
    scratch.lengths.extend((0..SCAN_POINTS).map(|i| {
        if i + 1 == SCAN_POINTS {
            hi
        } else {
            lo + step * i as f64
        }
    }));
    scratch.out.clear();
    scratch.out.resize(SCAN_POINTS, 0.0);
    let inv_d = 1.0 / coil.mean_diameter();
    externals
        .iter()
        .map(|&c| {
            match method {
                Method::Batch => {
                    resonance_over_lengths(
                        coil,
                        c,
                        conditions,
                        &scratch.lengths,
                        &mut scratch.out,
                        &mut scratch.columns,
                    );
                }
                Method::PerCandidate => {
                    for (f, &l) in scratch.out.iter_mut().zip(&scratch.lengths) {
                        *f = resonance_at_length(coil, l, c, conditions);
                    }
                }
            }
            for (f, &l) in scratch.out.iter_mut().zip(&scratch.lengths) {
                *f /= curve.at(l * inv_d).sqrt();
            }
            roots(
                coil,
                c,
                conditions,
                curve,
                target,
                &scratch.lengths,
                &scratch.out,
            )
        })
        .collect()
}

/// The landing lengths of one tank, and the highest resonance the scan reached.
#[derive(Clone, Debug, PartialEq)]
pub struct Landing {
    /// Lengths that land the target, metres, ascending.
    pub lengths: Vec<f64>,
    /// The highest resonance over the scan (stretching reaches no higher), hertz.
    pub highest: f64,
}

/// The roots bracketed by the scan, refined; or the solver's refusal.
fn roots(
    coil: &Coil,
    external: f64,
    conditions: &Conditions,
    curve: &ScaleCurve,
    target: f64,
    lengths: &[f64],
    f: &[f64],
) -> Result<Landing, Unreachable> {
    let mut found = Vec::new();
    let mut lowest = f64::INFINITY;
    let mut highest = f64::NEG_INFINITY;
    for i in 0..lengths.len() {
        if !f[i].is_finite() {
            continue;
        }
        lowest = lowest.min(f[i]);
        highest = highest.max(f[i]);
        if f[i] == target {
            found.push(lengths[i]);
            continue;
        }
        if i + 1 < lengths.len() && f[i + 1].is_finite() && (f[i] < target) != (f[i + 1] < target) {
            found.push(refine(
                coil,
                external,
                conditions,
                curve,
                target,
                (lengths[i], f[i]),
                (lengths[i + 1], f[i + 1]),
            ));
        }
    }
    if !found.is_empty() {
        return Ok(Landing {
            lengths: found,
            highest,
        });
    }
    if lowest > target {
        Err(Unreachable::AboveEvenCloseWound {
            close_wound: lowest,
        })
    } else {
        Err(Unreachable::BelowEvenStretched { stretched: highest })
    }
}

/// Regula falsi with the Illinois step (Dowell and Jarratt, BIT 11, 1971) on f(l) − target
/// inside a bracket, to 1e-12 of the target (or 1e-9 of the length).
fn refine(
    coil: &Coil,
    external: f64,
    conditions: &Conditions,
    curve: &ScaleCurve,
    target: f64,
    (a, fa): (f64, f64),
    (b, fb): (f64, f64),
) -> f64 {
    let stop = crate::physics::roots::Stop {
        width: 0.0,
        relative_width: 1e-9,
        value: 1e-12 * target,
        steps: 60,
    };
    // A length the model refuses (NaN) ends the search there.
    let found = crate::physics::roots::illinois((a, fa - target), (b, fb - target), stop, |x| {
        let at = Conditions {
            inductance_scale: conditions.inductance_scale * curve.at(x / coil.mean_diameter()),
            ..*conditions
        };
        let g = resonance_at_length(coil, x, external, &at) - target;
        if g.is_finite() { Ok(g) } else { Err(x) }
    });
    found.map_or_else(|x| x, |f| f.x)
}

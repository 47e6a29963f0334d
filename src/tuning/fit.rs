//! Calibrating the model from bench readings: what the build really has.
//!
//! # Method
//! Each reading i gives a measured frequency fᵢ with the coil at length lᵢ, the trimmer at its
//! setting and any known capacitor clipped on, so the model's external capacitance Cᵢ is known.
//! Two numbers describe how the build departs from the model:
//! - ΔC, capacitance the build has beyond the model's (stray, device, layout), farads;
//! - s, the build's inductance over the model's (former slip, lead dress, turns miscounted).
//!
//! They are found by weighted least squares on the model itself,
//! min Σ ((fᵢ − f(lᵢ, Cᵢ + ΔC; s·L)) / σᵢ)², by Gauss–Newton with a finite-difference Jacobian
//! (Press et al., *Numerical Recipes*, 3rd ed., 2007, §15.5), σᵢ being the instrument's error
//! (ppm × fᵢ; [`ASSUMED_ERROR_PPM`] when not given). The standard errors are the square roots of
//! the diagonal of (JᵀWJ)⁻¹, scaled by the reduced χ² when it exceeds 1 (§15.4).
//!
//! One reading, or readings that do not tell capacitance from inductance (all at one
//! capacitance and length), determine ΔC alone; s is then held at 1 and the fit says so.
//! Readings at different total capacitance (trimmer settings, or the classic bench trick of
//! clipping on a known capacitor) separate the two, because f⁻² = 4π²·s·L·(Cᵢ + ΔC + C_self)
//! is a line in Cᵢ whose slope is the inductance and whose intercept is the hidden capacitance
//! ([`inverse_square_line`]); readings at different lengths constrain s through the model's
//! length dependence.

use super::solve::resonance_at_length;
use crate::model::{Coil, Conditions, Tank, evaluate::resonance_of};
use crate::units::{from_ppm, to_khz, to_pf};
use std::f64::consts::PI;
use std::fmt;

/// Error assumed for a reading whose instrument's error is not given, ppm (common practice: a
/// counter on an uncompensated crystal time base is good to some 10 ppm).
pub const ASSUMED_ERROR_PPM: f64 = 10.0;

/// A scale factor further than this from 1 suggests another coil than the one modelled
/// (common practice: a turn miscounted changes L by 2/N, 40 % at five turns; a former a
/// millimetre off changes it by some 15–30 % on 5–8 mm coils).
pub const SCALE_PLAUSIBLE: f64 = 0.15;

/// A reading within this fraction of 2×, 3×, ½× or ⅓× the prediction is suspected of being a
/// harmonic or the wrong tank (common practice).
pub const HARMONIC_WINDOW: f64 = 0.04;

/// Residuals beyond this many instrument errors are flagged.
pub const RESIDUAL_LIMIT: f64 = 3.0;

/// Largest standard error of the scale factor at which it is reported as determined: beyond
/// it the readings do not separate inductance from capacitance and the stray alone is fitted.
const SCALE_ERROR_MAX: f64 = 0.25;

/// One bench reading in the engine's terms. SI units.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Reading {
    /// Measured frequency, hertz.
    pub measured: f64,
    /// Coil length (turns × pitch) as measured at the time, metres.
    pub length: f64,
    /// Trimmer setting at the time, 0–1.
    pub trimmer_setting: f64,
    /// A known capacitance clipped across the tank for this reading, farads (0 for none).
    pub added_capacitance: f64,
    /// That capacitor's tolerance as a fraction, if stated (else [`CLIP_ON_TOLERANCE`]).
    pub added_tolerance: Option<f64>,
    /// The instrument's frequency error, ppm, if known.
    pub error_ppm: Option<f64>,
}

impl Reading {
    /// Everything across the coil for this reading but the build's unknowns, farads.
    pub fn external_capacitance(&self, tank: &Tank) -> f64 {
        tank.external_capacitance_at(self.trimmer_setting.clamp(0.0, 1.0)) + self.added_capacitance
    }

    /// The reading's standard error, hertz.
    pub fn sigma(&self) -> f64 {
        from_ppm(self.error_ppm.unwrap_or(ASSUMED_ERROR_PPM).abs().max(1e-3)) * self.measured
    }
}

/// How the build departs from the model: applied, it makes the model reproduce the readings.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Calibration {
    /// Capacitance beyond the model's, farads (negative: less than assumed).
    pub extra_capacitance: f64,
    /// The build's inductance over the model's.
    pub inductance_scale: f64,
}

impl Calibration {
    /// The model as it stands.
    pub const NONE: Calibration = Calibration {
        extra_capacitance: 0.0,
        inductance_scale: 1.0,
    };

    /// The tank with the extra capacitance added to its stray term.
    pub fn tank(&self, tank: &Tank) -> Tank {
        Tank {
            stray: tank.stray + self.extra_capacitance,
            ..*tank
        }
    }

    /// The conditions with the inductance scale applied.
    pub fn conditions(&self, conditions: &Conditions) -> Conditions {
        Conditions {
            inductance_scale: conditions.inductance_scale * self.inductance_scale,
            ..*conditions
        }
    }
}

/// Something about a fit worth a builder's attention.
#[derive(Clone, Debug, PartialEq)]
pub enum FitWarning {
    /// The stray term came out negative: the tank holds less capacitance than its parts.
    NegativeStray {
        /// The tank's stray plus the fitted extra, farads.
        total: f64,
    },
    /// The readings cannot tell inductance from capacitance; the stray alone was fitted.
    ScaleUndetermined {
        /// Why, in words.
        reason: &'static str,
    },
    /// A reading's residual is far beyond its instrument's error.
    Inconsistent {
        /// Index of the reading (0 = oldest).
        reading: usize,
        /// Measured minus fitted, hertz.
        residual: f64,
        /// The reading's standard error, hertz.
        sigma: f64,
    },
    /// The fitted scale factor is far from 1.
    ScaleImplausible {
        /// The fitted scale factor.
        scale: f64,
    },
    /// A reading sits near a multiple or fraction of the prediction.
    Harmonic {
        /// Index of the reading.
        reading: usize,
        /// "2×", "3×", "½×" or "⅓×".
        ratio: &'static str,
        /// The model's prediction for that reading, hertz.
        predicted: f64,
        /// Left out of the calibration (while other readings are not suspected).
        left_out: bool,
    },
    /// Some readings carry no instrument error; [`ASSUMED_ERROR_PPM`] was used.
    AssumedError {
        /// How many readings.
        readings: usize,
    },
}

impl fmt::Display for FitWarning {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            FitWarning::NegativeStray { total } => write!(
                f,
                "the fit needs {:.2} pF of stray, below zero: check the fixed capacitor's value \
                 and the trimmer's range",
                to_pf(*total)
            ),
            FitWarning::ScaleUndetermined { reason } => write!(
                f,
                "{reason}: only the stray was fitted. Add a reading at another trimmer setting \
                 or with a known capacitor clipped on to separate the inductance"
            ),
            FitWarning::Inconsistent {
                reading,
                residual,
                sigma,
            } => write!(
                f,
                "reading {} is {:+.1} kHz from the fit, {:.0} times its instrument error: a \
                 misread or a coil that moved",
                reading + 1,
                to_khz(*residual),
                (residual / sigma).abs()
            ),
            FitWarning::ScaleImplausible { scale } => write!(
                f,
                "the build's inductance is {:+.0} % from the model: check the turns count and \
                 the former diameter",
                (scale - 1.0) * 100.0
            ),
            FitWarning::Harmonic {
                reading,
                ratio,
                predicted,
                left_out,
            } => write!(
                f,
                "reading {} is about {ratio} the predicted {}: is this a harmonic, or the \
                 wrong tank?{}",
                reading + 1,
                super::digits::mhz(*predicted),
                if *left_out {
                    " It is left out of the calibration."
                } else {
                    ""
                }
            ),
            FitWarning::AssumedError { readings } => write!(
                f,
                "{readings} reading(s) give no instrument error: {ASSUMED_ERROR_PPM} ppm assumed"
            ),
        }
    }
}

/// Why no fit was made.
#[derive(Clone, Debug, PartialEq)]
pub enum FitError {
    /// There are no readings.
    NoReadings,
    /// A reading's length or frequency is not one the model can take.
    BadReading {
        /// Index of the reading.
        reading: usize,
        /// Why, in words.
        reason: String,
    },
    /// No capacitance reproduces the readings (a reading far from anything this coil can do).
    NoSolution,
}

impl fmt::Display for FitError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            FitError::NoReadings => f.write_str("no readings to fit"),
            FitError::BadReading { reading, reason } => {
                write!(f, "reading {}: {reason}", reading + 1)
            }
            FitError::NoSolution => f.write_str(
                "no capacitance makes this coil reproduce the readings: check the instrument, \
                 the turns and the tank",
            ),
        }
    }
}

/// The result of calibrating the model on the readings.
#[derive(Clone, Debug, PartialEq)]
pub struct Fit {
    /// The calibration found.
    pub calibration: Calibration,
    /// Standard error of the extra capacitance, farads.
    pub extra_capacitance_error: f64,
    /// Standard error of the scale factor; `None` when the scale was held at 1.
    pub inductance_scale_error: Option<f64>,
    /// Covariance of the extra capacitance and the scale factor, farads (the off-diagonal of
    /// the same (JᵀWJ)⁻¹, scaled alike; 0 when the scale was held at 1).
    pub covariance: f64,
    /// Measured minus calibrated model for each reading, hertz (oldest first).
    pub residuals: Vec<f64>,
    /// Each reading's standard error, hertz.
    pub sigmas: Vec<f64>,
    /// How many readings the fit used.
    pub readings_used: usize,
    /// What to look at.
    pub warnings: Vec<FitWarning>,
}

/// A reading prepared for fitting: its coil, external capacitance and standard error.
#[derive(Clone)]
struct Prepared {
    coil: Coil,
    external: f64,
    measured: f64,
    sigma: f64,
    /// The field solution's factor on the classical inductance at this reading's coil
    /// (relative to the conditions' scale; 1 on the classical shape).
    factor: f64,
    /// The known capacitor clipped on for this reading, farads (part of `external`).
    added: f64,
    /// Its tolerance as a fraction (the reading's, else [`CLIP_ON_TOLERANCE`]).
    added_tolerance: f64,
}

impl Prepared {
    fn model(&self, conditions: &Conditions, p: [f64; 2]) -> f64 {
        let c = self.external + p[0];
        if c.is_nan() || c <= 0.0 {
            return f64::NAN;
        }
        let cond = Conditions {
            inductance_scale: conditions.inductance_scale * p[1] * self.factor,
            ..*conditions
        };
        resonance_of(&self.coil, c, &cond)
    }
}

/// Calibrate the model of `coil` in `tank` on `readings` (see the module's method), on the
/// classical shape under `conditions` (the same factor on the inductance at every reading).
pub fn fit(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    readings: &[Reading],
) -> Result<Fit, FitError> {
    fit_on(coil, tank, conditions, readings, None)
}

/// Rounds of re-solving the field at the readings' coils (each settles the factors for the
/// parameters of the round before; the factors move with the parameters only through the
/// frequency, so two or three rounds settle them).
const FIELD_ROUNDS: usize = 4;

/// [`fit`] on the field-led model when `field` (the recipe's conditions for the field
/// solution) is given: each reading is modelled by the field solution of its own coil and
/// capacitance, the calibration's extra capacitance added and its scale on the field-solved
/// apparent inductance ([`crate::tuning::landing::FieldLed`]), so the calibration does not
/// depend on where the coil is now. Each round solves the field once per reading at the
/// parameters found so far and turns it into a factor on the classical inductance there; the
/// least squares then run on the classical model with those factors, until the parameters
/// settle (within 0.001 pF and 1e-6 of the scale). `conditions` start the first round.
pub fn fit_on(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    readings: &[Reading],
    field: Option<&Conditions>,
) -> Result<Fit, FitError> {
    fit_on_held(coil, tank, conditions, readings, field, 1.0)
}

/// [`fit_on`] with the inductance scale held at `held_scale` while the readings cannot tell
/// it (one reading, or all at one capacitance and length), and started there otherwise: the
/// scale a measured coil gives ([`crate::tuning::measured_field`]), so one reading then fixes
/// the stray with the measured inductance kept.
pub fn fit_on_held(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    readings: &[Reading],
    field: Option<&Conditions>,
    held_scale: f64,
) -> Result<Fit, FitError> {
    if readings.is_empty() {
        return Err(FitError::NoReadings);
    }
    let mut prepared = Vec::with_capacity(readings.len());
    for (i, r) in readings.iter().enumerate() {
        if !(r.measured.is_finite() && r.measured > 0.0) {
            return Err(FitError::BadReading {
                reading: i,
                reason: "the frequency is not a positive number".to_owned(),
            });
        }
        let coil = coil
            .with_length(r.length)
            .map_err(|e| FitError::BadReading {
                reading: i,
                reason: e.reason,
            })?;
        prepared.push(Prepared {
            coil,
            external: r.external_capacitance(tank),
            measured: r.measured,
            sigma: r.sigma(),
            factor: 1.0,
            added: r.added_capacitance,
            added_tolerance: r.added_tolerance.unwrap_or(CLIP_ON_TOLERANCE),
        });
    }
    let mut warnings = harmonics(&prepared, conditions);
    // Suspected harmonics are left out while any reading is not suspected.
    let suspected: Vec<usize> = warnings
        .iter()
        .filter_map(|w| match w {
            FitWarning::Harmonic { reading, .. } => Some(*reading),
            _ => None,
        })
        .collect();
    let leave_out = !suspected.is_empty() && suspected.len() < prepared.len();
    let mut left: Vec<(usize, Prepared)> = Vec::new();
    let mut used: Vec<usize> = Vec::with_capacity(prepared.len());
    if leave_out {
        for w in &mut warnings {
            if let FitWarning::Harmonic { left_out, .. } = w {
                *left_out = true;
            }
        }
        let all = std::mem::take(&mut prepared);
        for (i, p) in all.into_iter().enumerate() {
            if suspected.contains(&i) {
                left.push((i, p));
            } else {
                used.push(i);
                prepared.push(p);
            }
        }
    } else {
        used.extend(0..prepared.len());
    }
    let assumed = readings.iter().filter(|r| r.error_ppm.is_none()).count();
    if assumed > 0 {
        warnings.push(FitWarning::AssumedError { readings: assumed });
    }

    let start = [
        stray_alone(&prepared[0], conditions, held_scale).ok_or(FitError::NoSolution)?,
        held_scale,
    ];
    let one_point = prepared.iter().all(|p| {
        (p.external - prepared[0].external).abs() <= 1e-9 * p.external.abs().max(1e-15)
            && p.coil.length() == prepared[0].coil.length()
    });
    let two = if one_point {
        if prepared.len() > 1 {
            warnings.push(FitWarning::ScaleUndetermined {
                reason: "all readings are at one capacitance and length",
            });
        }
        None
    } else {
        gauss_newton(&prepared, conditions, start, true)
            .filter(|s| s.errors[1].is_some_and(|e| e <= SCALE_ERROR_MAX))
            .or_else(|| {
                warnings.push(FitWarning::ScaleUndetermined {
                    reason: "the readings differ too little in capacitance or length to tell \
                             inductance from capacitance",
                });
                None
            })
    };
    let with_scale = two.is_some();
    let mut solution = match two {
        Some(s) => s,
        None => gauss_newton(&prepared, conditions, start, false).ok_or(FitError::NoSolution)?,
    };
    if let Some(field) = field {
        for _ in 0..FIELD_ROUNDS {
            if !field_factors(&mut prepared, conditions, field, solution.params) {
                break;
            }
            let Some(next) = gauss_newton(&prepared, conditions, solution.params, with_scale)
            else {
                break;
            };
            let moved = [
                (next.params[0] - solution.params[0]).abs(),
                (next.params[1] - solution.params[1]).abs(),
            ];
            solution = next;
            if moved[0] <= 1e-15 && moved[1] <= 1e-6 {
                break;
            }
        }
    }

    clip_on_tolerance(&prepared, conditions, with_scale, &mut solution);
    let [extra, scale] = solution.params;
    // Residuals of every reading, the left-out ones on their own field solution too.
    if let Some(field) = field {
        let mut lone: Vec<Prepared> = left.iter().map(|(_, p)| p.clone()).collect();
        if field_factors(&mut lone, conditions, field, solution.params) {
            for ((_, p), q) in left.iter_mut().zip(lone) {
                p.factor = q.factor;
            }
        }
    }
    let mut residuals = vec![0.0; readings.len()];
    let mut sigmas = vec![0.0; readings.len()];
    for (&i, p) in used.iter().zip(&prepared) {
        residuals[i] = p.measured - p.model(conditions, solution.params);
        sigmas[i] = p.sigma;
    }
    for (i, p) in &left {
        residuals[*i] = p.measured - p.model(conditions, solution.params);
        sigmas[*i] = p.sigma;
    }
    for &i in &used {
        let (r, s) = (&residuals[i], &sigmas[i]);
        if r.abs() > RESIDUAL_LIMIT * s {
            warnings.push(FitWarning::Inconsistent {
                reading: i,
                residual: *r,
                sigma: *s,
            });
        }
    }
    if (scale - 1.0).abs() > SCALE_PLAUSIBLE {
        warnings.push(FitWarning::ScaleImplausible { scale });
    }
    if tank.stray + extra < 0.0 {
        warnings.push(FitWarning::NegativeStray {
            total: tank.stray + extra,
        });
    }
    Ok(Fit {
        calibration: Calibration {
            extra_capacitance: extra,
            inductance_scale: scale,
        },
        extra_capacitance_error: solution.errors[0].unwrap_or(f64::NAN),
        inductance_scale_error: solution.errors[1],
        covariance: solution.covariance,
        residuals,
        sigmas,
        readings_used: prepared.len(),
        warnings,
    })
}

/// Tolerance of a known capacitor clipped on for a reading, as a fraction (common practice:
/// class-1 ceramic parts of ±5 %, the usual grade for a bench's reference capacitors).
pub const CLIP_ON_TOLERANCE: f64 = 0.05;

/// Add what the clipped-on capacitors' tolerance leaves in the parameters to their errors:
/// the least squares run again with every such capacitor larger by its tolerance (the
/// reading's own, else [`CLIP_ON_TOLERANCE`]; taken as one part used for every reading, so
/// fully correlated), and the shift of each parameter is added
/// in quadrature to its standard error (and the product of the shifts to the covariance).
fn clip_on_tolerance(
    prepared: &[Prepared],
    conditions: &Conditions,
    with_scale: bool,
    solution: &mut Solution,
) {
    if !prepared.iter().any(|p| p.added > 0.0) {
        return;
    }
    let shifted: Vec<Prepared> = prepared
        .iter()
        .map(|p| Prepared {
            external: p.external + p.added_tolerance * p.added,
            ..p.clone()
        })
        .collect();
    let Some(moved) = gauss_newton(&shifted, conditions, solution.params, with_scale) else {
        return;
    };
    let d = [
        moved.params[0] - solution.params[0],
        moved.params[1] - solution.params[1],
    ];
    for (k, e) in solution.errors.iter_mut().enumerate() {
        if let Some(e) = e {
            *e = e.hypot(d[k]);
        }
    }
    if with_scale {
        solution.covariance += d[0] * d[1];
    }
}

/// Set each reading's factor to the field solution's at its coil and capacitance for the
/// parameters `p` (ΔC, scale on the field solution); false (factors untouched) when a field
/// solve or its factor fails.
fn field_factors(
    prepared: &mut [Prepared],
    conditions: &Conditions,
    field: &Conditions,
    p: [f64; 2],
) -> bool {
    let mut factors: Vec<f64> = Vec::with_capacity(prepared.len());
    for (i, q) in prepared.iter().enumerate() {
        let c = q.external + p[0];
        // Readings at one coil and capacitance share one solve.
        if let Some(j) = prepared[..i]
            .iter()
            .position(|o| o.coil == q.coil && o.external == q.external)
        {
            factors.push(factors[j]);
            continue;
        }
        let Ok(f) = crate::tuning::field_tank::field_resonance(&q.coil, c, field, p[1]) else {
            return false;
        };
        let at = Conditions {
            inductance_scale: conditions.inductance_scale * p[1],
            ..*conditions
        };
        let Some(k) = crate::tuning::field_tank::matching_scale(&q.coil, c, &at, f) else {
            return false;
        };
        factors.push(k);
    }
    for (q, k) in prepared.iter_mut().zip(factors) {
        q.factor = k;
    }
    true
}

/// Readings near 2×, 3×, ½× or ⅓× the uncalibrated prediction.
fn harmonics(prepared: &[Prepared], conditions: &Conditions) -> Vec<FitWarning> {
    const RATIOS: [(f64, &str); 4] = [(2.0, "2×"), (3.0, "3×"), (0.5, "½×"), (1.0 / 3.0, "⅓×")];
    let mut out = Vec::new();
    for (i, p) in prepared.iter().enumerate() {
        let predicted = p.model(conditions, [0.0, 1.0]);
        let ratio = p.measured / predicted;
        if let Some((_, name)) = RATIOS
            .iter()
            .find(|(k, _)| (ratio / k - 1.0).abs() <= HARMONIC_WINDOW)
        {
            out.push(FitWarning::Harmonic {
                reading: i,
                ratio: name,
                predicted,
                left_out: false,
            });
        }
    }
    out
}

/// The extra capacitance that makes the model reproduce one reading at `scale`, by bisection
/// between −(external) and +1 nF; `None` when none does.
fn stray_alone(p: &Prepared, conditions: &Conditions, scale: f64) -> Option<f64> {
    let f_at = |dc: f64| p.model(conditions, [dc, scale]);
    let (a, b) = (-p.external * (1.0 - 1e-9), 1e-9);
    // Frequency falls as capacitance rises.
    if !(f_at(a) >= p.measured && f_at(b) <= p.measured) {
        return None;
    }
    Some(crate::physics::roots::bisect(a, b, 80, |dc| {
        let f = f_at(dc);
        f <= p.measured || f.is_nan()
    }))
}

/// A least-squares solution: the parameters and their standard errors (`None` for one held).
struct Solution {
    params: [f64; 2],
    errors: [Option<f64>; 2],
    /// Covariance of the two parameters (0 when the scale is held).
    covariance: f64,
}

/// Gauss–Newton on (ΔC, s), or on ΔC alone with s = 1 when `with_scale` is false.
fn gauss_newton(
    prepared: &[Prepared],
    conditions: &Conditions,
    start: [f64; 2],
    with_scale: bool,
) -> Option<Solution> {
    // Steps of the finite differences: 0.01 pF and 1e-6 in the scale.
    const STEP: [f64; 2] = [1e-14, 1e-6];
    let mut p = start;
    let mut normal = [[0.0; 2]; 2];
    let mut chi2 = 0.0;
    for round in 0..30 {
        normal = [[0.0; 2]; 2];
        let mut gradient = [0.0; 2];
        chi2 = 0.0;
        for q in prepared {
            let r = (q.measured - q.model(conditions, p)) / q.sigma;
            let mut row = [0.0; 2];
            for (k, step) in STEP.iter().enumerate() {
                let (mut up, mut down) = (p, p);
                up[k] += step;
                down[k] -= step;
                row[k] =
                    (q.model(conditions, up) - q.model(conditions, down)) / (2.0 * step * q.sigma);
            }
            if !with_scale {
                row[1] = 0.0;
            }
            for a in 0..2 {
                gradient[a] += row[a] * r;
                for b in 0..2 {
                    normal[a][b] += row[a] * row[b];
                }
            }
            chi2 += r * r;
        }
        if !chi2.is_finite() {
            return None;
        }
        let delta = if with_scale {
            let det = normal[0][0] * normal[1][1] - normal[0][1] * normal[1][0];
            if det.is_nan() || det == 0.0 {
                return None;
            }
            [
                (normal[1][1] * gradient[0] - normal[0][1] * gradient[1]) / det,
                (normal[0][0] * gradient[1] - normal[1][0] * gradient[0]) / det,
            ]
        } else {
            if normal[0][0].is_nan() || normal[0][0] <= 0.0 {
                return None;
            }
            [gradient[0] / normal[0][0], 0.0]
        };
        p = [p[0] + delta[0], p[1] + delta[1]];
        if p[1].is_nan() || p[1] <= 0.0 {
            return None;
        }
        if delta[0].abs() < 1e-19 && delta[1].abs() < 1e-13 && round > 0 {
            break;
        }
    }
    let n = prepared.len() as f64;
    let free = if with_scale { 2.0 } else { 1.0 };
    let inflate = if n > free {
        (chi2 / (n - free)).max(1.0)
    } else {
        1.0
    };
    let (errors, covariance) = if with_scale {
        let det = normal[0][0] * normal[1][1] - normal[0][1] * normal[1][0];
        (
            [
                Some((inflate * normal[1][1] / det).sqrt()),
                Some((inflate * normal[0][0] / det).sqrt()),
            ],
            -inflate * normal[0][1] / det,
        )
    } else {
        ([Some((inflate / normal[0][0]).sqrt()), None], 0.0)
    };
    Some(Solution {
        params: p,
        errors,
        covariance,
    })
}

/// The bench builder's straight line: 1/f² against the external capacitance of the readings
/// taken at one coil length. f⁻² = 4π²·L·(C + C_hidden), so the slope gives L and the
/// intercept over the slope the capacitance the model does not see plus the self-capacitance.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct InverseSquareLine {
    /// Slope of 1/f² against capacitance, s²/F.
    pub slope: f64,
    /// Intercept at zero external capacitance, s².
    pub intercept: f64,
    /// The inductance the slope implies, henries: slope/(4π²).
    pub inductance: f64,
    /// The capacitance hidden from the model plus the coil's self-capacitance, farads:
    /// intercept/slope.
    pub hidden_capacitance: f64,
    /// The points used: (external capacitance in farads, 1/f² in s²).
    pub points: usize,
}

/// The weighted straight-line fit of 1/f² against external capacitance over the readings at
/// the latest reading's length (weights from each reading's error; Press et al. 2007, §15.2).
/// `None` with fewer than two readings at that length or no spread in capacitance.
pub fn inverse_square_line(tank: &Tank, readings: &[Reading]) -> Option<InverseSquareLine> {
    let length = readings.last()?.length;
    let pts: Vec<(f64, f64, f64)> = readings
        .iter()
        .filter(|r| (r.length - length).abs() <= 1e-9)
        .map(|r| {
            let y = 1.0 / (r.measured * r.measured);
            // σ(1/f²) = 2σ_f/f³.
            let sigma = 2.0 * r.sigma() / (r.measured * r.measured * r.measured);
            (r.external_capacitance(tank), y, 1.0 / (sigma * sigma))
        })
        .collect();
    if pts.len() < 2 {
        return None;
    }
    let (mut s, mut sx, mut sy, mut sxx, mut sxy) = (0.0, 0.0, 0.0, 0.0, 0.0);
    for &(x, y, w) in &pts {
        s += w;
        sx += w * x;
        sy += w * y;
        sxx += w * x * x;
        sxy += w * x * y;
    }
    let det = s * sxx - sx * sx;
    if det.is_nan() || det.abs() <= 1e-12 * s * sxx {
        return None;
    }
    let slope = (s * sxy - sx * sy) / det;
    let intercept = (sxx * sy - sx * sxy) / det;
    Some(InverseSquareLine {
        slope,
        intercept,
        inductance: slope / (4.0 * PI * PI),
        hidden_capacitance: intercept / slope,
        points: pts.len(),
    })
}

/// Length uncertainty (metres) that a reading's standard error `sigma` hertz carries, for a
/// coil whose resonance moves `slope` Hz per metre of stretch: |σ / slope|. `None` for a coil
/// whose stretch does not move it.
pub fn length_uncertainty(sigma: f64, slope: f64) -> Option<f64> {
    (slope.abs() > 0.0).then(|| (sigma / slope).abs())
}

/// The resonance the (calibrated) model predicts for a reading's coil length and capacitance,
/// hertz: what the readings are drawn against on the charts.
pub fn predicted_for(coil: &Coil, tank: &Tank, conditions: &Conditions, reading: &Reading) -> f64 {
    resonance_at_length(
        coil,
        reading.length,
        reading.external_capacitance(tank),
        conditions,
    )
}

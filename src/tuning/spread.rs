//! How far the built coil's frequency can land from the prediction, before any measurement:
//! the winding's tolerances and the stray estimate's range carried to the resonance, by Monte
//! Carlo and by linear propagation.
//!
//! Each tolerance is a ± bound drawn uniformly (a builder's "to within ± x"); the turns are
//! counted to a quarter (± ¼ turn); the stray term is drawn from the triangular distribution
//! on its low, typical and high figures. The linear propagation uses each input's standard
//! deviation (tol/√3 for a uniform bound; √((a² + b² + c² − ab − ac − bc)/18) for the
//! triangular) and central-difference sensitivities; the tests hold it to the Monte Carlo run.

use super::stray::Span;
use crate::model::batch::{SweepColumns, resonance_over_lengths};
use crate::model::{Coil, Conditions, evaluate::resonance_of};
use crate::units::to_mm;
use rand_core::{Rng, SeedableRng};
use rand_xoshiro::Xoshiro256PlusPlus;

/// The builder's tolerances (± bounds, SI) and the stray term's range.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Tolerances {
    /// Former diameter, ± metres.
    pub former_diameter: f64,
    /// Coil length, ± metres.
    pub length: f64,
    /// Bare wire diameter, ± metres.
    pub wire_diameter: f64,
    /// Turns, ± turns (a quarter when counted to a quarter).
    pub turns: f64,
    /// Fixed capacitor, ± fraction of its value.
    pub fixed_fraction: f64,
    /// The stray term: low, typical, high, farads.
    pub stray: Span,
}

/// A builder's tolerances on the winding and the fixed capacitor (± bounds, SI); the stray
/// term's range comes from the estimate ([`BuildTolerances::with_stray`]).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct BuildTolerances {
    /// Former diameter, ± metres.
    pub former_diameter: f64,
    /// Coil length as set, ± metres.
    pub length: f64,
    /// Bare wire diameter, ± metres.
    pub wire_diameter: f64,
    /// Turns, ± turns.
    pub turns: f64,
    /// Fixed capacitor, ± fraction of its value.
    pub fixed_fraction: f64,
}

impl BuildTolerances {
    /// A hand-wound coil (common practice): the former ±0.1 mm, the length as set ±0.2 mm, the
    /// wire ±0.01 mm, the turns counted to a quarter, a ±5 % ceramic fixed capacitor.
    pub const HAND_WOUND: Self = Self {
        former_diameter: 0.1e-3,
        length: 0.2e-3,
        wire_diameter: 0.01e-3,
        turns: 0.25,
        fixed_fraction: 0.05,
    };

    /// The spread's tolerances with the stray term's range.
    pub fn with_stray(self, stray: Span) -> Tolerances {
        Tolerances {
            former_diameter: self.former_diameter,
            length: self.length,
            wire_diameter: self.wire_diameter,
            turns: self.turns,
            fixed_fraction: self.fixed_fraction,
            stray,
        }
    }

    /// The tolerances in a builder's words, display units (the build sheet and the stray
    /// panel name them the same way): "former ±0.10 mm, length ±0.20 mm, wire ±0.010 mm,
    /// turns ±0.25, fixed capacitor ±5 %".
    pub fn in_words(&self) -> String {
        format!(
            "former ±{:.2} mm, length ±{:.2} mm, wire ±{:.3} mm, turns ±{}, fixed capacitor ±{} %",
            to_mm(self.former_diameter),
            to_mm(self.length),
            to_mm(self.wire_diameter),
            self.turns,
            self.fixed_fraction * 100.0
        )
    }
}

impl Default for BuildTolerances {
    fn default() -> Self {
        Self::HAND_WOUND
    }
}

/// The tank around the coil, split as the spread needs it.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct TankParts {
    /// The fixed capacitor's nominal value, farads.
    pub fixed: f64,
    /// Everything else drawn (trimmer at its setting, divider), farads; the stray term is in
    /// [`Tolerances::stray`].
    pub other: f64,
}

/// The spread at one coil.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Spread {
    /// Resonance with every input at its nominal (typical) value, hertz.
    pub nominal: f64,
    /// Lowest and highest of the Monte Carlo draws, hertz.
    pub draws_range: (f64, f64),
    /// The central 95 % of the draws (2.5th and 97.5th percentiles), hertz: "expect …".
    pub expected: (f64, f64),
    /// Standard deviation of the draws, hertz.
    pub draws_sigma: f64,
    /// Linear propagation: the mean (nominal moved by the stray's skew), hertz.
    pub linear_mean: f64,
    /// Linear propagation: standard deviation, hertz.
    pub linear_sigma: f64,
    /// Linear propagation: mean ± 1.96σ, hertz.
    pub linear_band: (f64, f64),
    /// Each input's share of the linear variance, in the order of [`INPUT_NAMES`].
    pub shares: [f64; 6],
}

/// The inputs of the spread, in the order of [`Spread::shares`].
pub const INPUT_NAMES: [&str; 6] = [
    "former diameter",
    "coil length",
    "wire diameter",
    "turns",
    "fixed capacitor",
    "stray capacitance",
];

/// A coil with its former, wire, turns and length moved (every other figure kept; see
/// [`Coil::varied`]); a draw the model refuses keeps the nominal coil.
fn perturbed(coil: &Coil, d_former: f64, d_wire: f64, d_turns: f64, d_length: f64) -> Coil {
    coil.varied(d_former, d_wire, d_turns, d_length)
        .unwrap_or(*coil)
}

/// A uniform draw on [0, 1) from 53 random bits.
fn unit(rng: &mut Xoshiro256PlusPlus) -> f64 {
    (rng.next_u64() >> 11) as f64 * (1.0 / (1u64 << 53) as f64)
}

/// A uniform draw on [−1, 1).
fn symmetric(rng: &mut Xoshiro256PlusPlus) -> f64 {
    2.0 * unit(rng) - 1.0
}

/// A draw from the triangular distribution on (low, mode, high), by inverting its CDF.
fn triangular(rng: &mut Xoshiro256PlusPlus, s: Span) -> f64 {
    let (a, c, b) = (s.low, s.typical, s.high);
    if b <= a {
        return c;
    }
    let u = unit(rng);
    let split = (c - a) / (b - a);
    if u < split {
        a + ((b - a) * (c - a) * u).sqrt()
    } else {
        b - ((b - a) * (b - c) * (1.0 - u)).sqrt()
    }
}

/// Standard deviation of the triangular distribution on `s`.
fn triangular_sigma(s: Span) -> f64 {
    let (a, c, b) = (s.low, s.typical, s.high);
    ((a * a + b * b + c * c - a * b - a * c - b * c) / 18.0)
        .max(0.0)
        .sqrt()
}

/// One draw of the six inputs' offsets from nominal (former, length, wire, turns, fixed as a
/// fraction, stray as an absolute capacitance).
fn draw(rng: &mut Xoshiro256PlusPlus, t: &Tolerances) -> [f64; 6] {
    [
        t.former_diameter * symmetric(rng),
        t.length * symmetric(rng),
        t.wire_diameter * symmetric(rng),
        t.turns * symmetric(rng),
        t.fixed_fraction * symmetric(rng),
        triangular(rng, t.stray),
    ]
}

fn resonance_with(
    coil: &Coil,
    tank: &TankParts,
    conditions: &Conditions,
    x: &[f64; 6],
    stray: f64,
) -> f64 {
    let c = perturbed(coil, x[0], x[2], x[3], x[1]);
    resonance_of(
        &c,
        tank.fixed * (1.0 + x[4]) + tank.other + stray,
        conditions,
    )
}

/// Percentile `p` (0–1) of `values` (reordered in place), by selection.
fn percentile(values: &mut [f64], p: f64) -> f64 {
    let n = values.len();
    if n == 0 {
        return f64::NAN;
    }
    let k = ((p * (n - 1) as f64).round() as usize).min(n - 1);
    *values.select_nth_unstable_by(k, f64::total_cmp).1
}

/// Each input's scale for the finite-difference step (its ± bound; the stray's whole range).
fn bounds(t: &Tolerances) -> [f64; 6] {
    [
        t.former_diameter,
        t.length,
        t.wire_diameter,
        t.turns,
        t.fixed_fraction,
        (t.stray.high - t.stray.low).max(0.0),
    ]
}

/// Each input's standard deviation: tol/√3 for a uniform bound, the triangular's for the stray.
fn sigmas(t: &Tolerances) -> [f64; 6] {
    [
        t.former_diameter / 3f64.sqrt(),
        t.length / 3f64.sqrt(),
        t.wire_diameter / 3f64.sqrt(),
        t.turns / 3f64.sqrt(),
        t.fixed_fraction / 3f64.sqrt(),
        triangular_sigma(t.stray),
    ]
}

/// The spread of the resonance for `coil` in `tank` with `tolerances`: Monte Carlo with
/// `draws` draws (at least 1000 is advised) from a generator seeded with `seed` (the same
/// seed gives the same band), and linear propagation beside it.
pub fn spread(
    coil: &Coil,
    tank: &TankParts,
    conditions: &Conditions,
    tolerances: &Tolerances,
    draws: usize,
    seed: u64,
) -> Spread {
    let t = tolerances;
    let zero = [0.0; 6];
    let nominal = resonance_with(coil, tank, conditions, &zero, t.stray.typical);

    // Linear propagation: central differences with a step of a thousandth of each bound.
    let bounds = bounds(t);
    let sigmas = sigmas(t);
    let mut variance_parts = [0.0; 6];
    let mut slope_stray = 0.0;
    for i in 0..6 {
        let h = 1e-3 * bounds[i];
        if h <= 0.0 {
            continue;
        }
        let (mut up, mut down) = (zero, zero);
        up[i] = h;
        down[i] = -h;
        let (s_up, s_down) = if i == 5 {
            (t.stray.typical + h, t.stray.typical - h)
        } else {
            (t.stray.typical, t.stray.typical)
        };
        let slope = (resonance_with(coil, tank, conditions, &up, s_up)
            - resonance_with(coil, tank, conditions, &down, s_down))
            / (2.0 * h);
        if i == 5 {
            slope_stray = slope;
        }
        variance_parts[i] = (slope * sigmas[i]).powi(2);
    }
    let variance: f64 = variance_parts.iter().sum();
    let linear_sigma = variance.sqrt();
    let stray_mean = (t.stray.low + t.stray.typical + t.stray.high) / 3.0;
    let linear_mean = nominal + slope_stray * (stray_mean - t.stray.typical);
    let shares = if variance > 0.0 {
        variance_parts.map(|v| v / variance)
    } else {
        [0.0; 6]
    };

    // Monte Carlo.
    let mut rng = Xoshiro256PlusPlus::seed_from_u64(seed);
    let mut values: Vec<f64> = (0..draws)
        .map(|_| {
            let x = draw(&mut rng, t);
            resonance_with(coil, tank, conditions, &x, x[5])
        })
        .collect();
    let n = values.len().max(1) as f64;
    let mean = values.iter().sum::<f64>() / n;
    let draws_sigma =
        (values.iter().map(|v| (v - mean).powi(2)).sum::<f64>() / (n - 1.0).max(1.0)).sqrt();
    let lo = values.iter().copied().fold(f64::INFINITY, f64::min);
    let hi = values.iter().copied().fold(f64::NEG_INFINITY, f64::max);
    let expected = (
        percentile(&mut values, 0.025),
        percentile(&mut values, 0.975),
    );
    Spread {
        nominal,
        draws_range: (lo, hi),
        expected,
        draws_sigma,
        linear_mean,
        linear_sigma,
        linear_band: (
            linear_mean - 1.96 * linear_sigma,
            linear_mean + 1.96 * linear_sigma,
        ),
        shares,
    }
}

/// The spread drawn as a band around a spacing curve: at each of `lengths` (metres), the
/// central 95 % of `draws` Monte Carlo builds, as (length, low hertz, high hertz).
///
/// Each draw is one built coil (its former, wire, turns, fixed capacitor and stray drawn
/// once, and its length off by one drawn amount at every point of the curve), swept over the
/// lengths by the batch path.
pub fn spread_band(
    coil: &Coil,
    tank: &TankParts,
    conditions: &Conditions,
    tolerances: &Tolerances,
    lengths: &[f64],
    draws: usize,
    seed: u64,
) -> Vec<[f64; 3]> {
    let t = tolerances;
    let m = lengths.len();
    let mut rng = Xoshiro256PlusPlus::seed_from_u64(seed);
    let mut grid = vec![0.0; draws * m];
    let mut shifted = vec![0.0; m];
    let mut columns = SweepColumns::default();
    for row in grid.chunks_exact_mut(m.max(1)).take(draws) {
        let x = draw(&mut rng, t);
        let c = perturbed(coil, x[0], x[2], x[3], 0.0);
        for (s, &l) in shifted.iter_mut().zip(lengths) {
            *s = l + x[1];
        }
        let external = tank.fixed * (1.0 + x[4]) + tank.other + x[5];
        resonance_over_lengths(&c, external, conditions, &shifted, row, &mut columns);
    }
    let mut column = vec![0.0; draws];
    let index = |p: f64| ((p * (draws.max(1) - 1) as f64).round() as usize).min(draws.max(1) - 1);
    let (k_low, k_high) = (index(0.025), index(0.975));
    lengths
        .iter()
        .enumerate()
        .map(|(j, &l)| {
            if draws == 0 {
                return [l, f64::NAN, f64::NAN];
            }
            for (i, v) in column.iter_mut().enumerate() {
                *v = grid[i * m + j];
            }
            // The high percentile first; the low one is then in the part below it.
            let high = *column.select_nth_unstable_by(k_high, f64::total_cmp).1;
            let low = *column[..k_high.max(1)]
                .select_nth_unstable_by(k_low.min(k_high.max(1) - 1), f64::total_cmp)
                .1;
            [l, low, high]
        })
        .collect()
}

/// The nominal resonance at each of `lengths` (the batch path), with the sweep's columns for
/// the perturbed sweeps that follow.
fn nominal_over_lengths(
    coil: &Coil,
    external: f64,
    conditions: &Conditions,
    lengths: &[f64],
) -> (Vec<f64>, SweepColumns) {
    let mut columns = SweepColumns::default();
    let mut nominal = vec![0.0; lengths.len()];
    resonance_over_lengths(
        coil,
        external,
        conditions,
        lengths,
        &mut nominal,
        &mut columns,
    );
    (nominal, columns)
}

/// The spread as a band over `lengths` (metres) by linear propagation: at each length the
/// method of [`spread`]'s linear figures (each input's standard deviation times the central
/// difference of the resonance in it, added in quadrature; the mean moved by the stray's
/// skew), every curve swept by the batch path. Returns (length, mean − 1.96σ, mean + 1.96σ)
/// in hertz. Thirteen sweeps instead of a thousand; tests/engine/batch_spread.rs holds it to
/// [`spread`] at each length, and [`spread`]'s linear figures to its Monte Carlo draws.
pub fn linear_band(
    coil: &Coil,
    tank: &TankParts,
    conditions: &Conditions,
    tolerances: &Tolerances,
    lengths: &[f64],
) -> Vec<[f64; 3]> {
    let t = tolerances;
    let m = lengths.len();
    let external = tank.fixed + tank.other + t.stray.typical;
    let (nominal, mut columns) = nominal_over_lengths(coil, external, conditions, lengths);
    let (bounds, sigmas) = (bounds(t), sigmas(t));
    let mut variance = vec![0.0; m];
    let mut slope_stray = vec![0.0; m];
    let (mut up, mut down, mut shifted) = (vec![0.0; m], vec![0.0; m], vec![0.0; m]);
    for i in 0..6 {
        let h = 1e-3 * bounds[i];
        if h.is_nan() || h <= 0.0 {
            continue;
        }
        for (d, out) in [(h, &mut up), (-h, &mut down)] {
            let (c, cap) = match i {
                0 => (perturbed(coil, d, 0.0, 0.0, 0.0), external),
                2 => (perturbed(coil, 0.0, d, 0.0, 0.0), external),
                3 => (perturbed(coil, 0.0, 0.0, d, 0.0), external),
                4 => (*coil, external + tank.fixed * d),
                5 => (*coil, external + d),
                _ => (*coil, external),
            };
            for (s, &l) in shifted.iter_mut().zip(lengths) {
                *s = if i == 1 { l + d } else { l };
            }
            resonance_over_lengths(&c, cap, conditions, &shifted, out, &mut columns);
        }
        for j in 0..m {
            let slope = (up[j] - down[j]) / (2.0 * h);
            variance[j] += (slope * sigmas[i]).powi(2);
            if i == 5 {
                slope_stray[j] = slope;
            }
        }
    }
    let skew = (t.stray.low + t.stray.typical + t.stray.high) / 3.0 - t.stray.typical;
    (0..m)
        .map(|j| {
            let mean = nominal[j] + slope_stray[j] * skew;
            let half = 1.96 * variance[j].sqrt();
            [lengths[j], mean - half, mean + half]
        })
        .collect()
}

/// What a bench calibration leaves of the spread: the fit's parameter errors carried to the
/// resonance of the calibrated model at each of `lengths` (metres), as (length, low, high)
/// hertz.
///
/// # Method
/// Linear propagation of the fit's covariance (the standard errors and covariance of the extra
/// capacitance ΔC and the inductance scale s from (JᵀWJ)⁻¹, scaled by the reduced χ² as the fit
/// does; Press et al., *Numerical Recipes*, 3rd ed., 2007, §15.4–15.5):
/// σ_f² = g_C²σ_C² + g_s²σ_s² + 2·g_C·g_s·cov(ΔC, s), with g_C = ∂f/∂ΔC and g_s = ∂f/∂s by
/// central differences at each length through the batch path, and the band f ± 1.96σ_f.
/// The winding's tolerances and the stray estimate no longer enter: the readings measured the
/// build itself, and the fit took its departures into ΔC and s. The band is at each length as
/// measured (an error in setting the length moves along the curve, not off it).
///
/// `external` is the calibrated tank's external capacitance (the fitted ΔC in it) and
/// `conditions` the calibrated conditions (the fitted s in them).
pub fn calibrated_band(
    coil: &Coil,
    external: f64,
    conditions: &Conditions,
    fit: &super::fit::Fit,
    lengths: &[f64],
) -> Vec<[f64; 3]> {
    let m = lengths.len();
    let (nominal, mut columns) = nominal_over_lengths(coil, external, conditions, lengths);
    // Steps: 0.01 pF and a millionth of the scale (the fit's own).
    const STEP_C: f64 = 1e-14;
    const STEP_S: f64 = 1e-6;
    let (mut up, mut down) = (vec![0.0; m], vec![0.0; m]);
    let mut slope = |external_d: f64, scale_d: f64, out: &mut Vec<f64>| {
        for (sign, buf) in [(1.0, &mut up), (-1.0, &mut down)] {
            let cond = Conditions {
                inductance_scale: conditions.inductance_scale * (1.0 + sign * scale_d),
                ..*conditions
            };
            resonance_over_lengths(
                coil,
                external + sign * external_d,
                &cond,
                lengths,
                buf,
                &mut columns,
            );
        }
        out.clear();
        out.extend(up.iter().zip(&down).map(|(u, d)| u - d));
    };
    let s = fit.calibration.inductance_scale;
    let mut g_c = Vec::with_capacity(m);
    slope(STEP_C, 0.0, &mut g_c);
    g_c.iter_mut().for_each(|g| *g /= 2.0 * STEP_C);
    let sigma_c = fit.extra_capacitance_error;
    let (sigma_s, cov) = match fit.inductance_scale_error {
        Some(e) => (e, fit.covariance),
        None => (0.0, 0.0),
    };
    let mut g_s = vec![0.0; m];
    if sigma_s > 0.0 {
        // The conditions hold base·s; s ± h is base·s·(1 ± h/s).
        slope(0.0, STEP_S / s, &mut g_s);
        g_s.iter_mut().for_each(|g| *g /= 2.0 * STEP_S);
    }
    (0..m)
        .map(|j| {
            let variance = (g_c[j] * sigma_c).powi(2)
                + (g_s[j] * sigma_s).powi(2)
                + 2.0 * g_c[j] * g_s[j] * cov;
            let half = 1.96 * variance.max(0.0).sqrt();
            [lengths[j], nominal[j] - half, nominal[j] + half]
        })
        .collect()
}

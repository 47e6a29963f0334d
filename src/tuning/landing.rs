//! The field-led model away from the present coil, and instructions that land on it.
//!
//! The figures move the classical model onto the field solution at the present coil by one
//! factor on its inductance ([`super::field_tank::matching_scale`]); away from that coil the
//! factor changes (the loop of helix, leads and closing path gains inductance as the coil is
//! stretched, and long leads make the field-solved resonance peak and fall while the
//! classical one keeps rising). So an instruction found on the classical shape alone misses
//! where the tool's own evaluation of the proposed coil lands. Here every instruction finishes
//! on exact field solves of the candidate coil:
//! - [`FieldLed::resonance`]: the tank of a coil across a capacitance solved with the field
//!   solution, its apparent inductance times the bench calibration's scale (what the figures
//!   give for that coil);
//! - [`land_length`] and [`land_setting`]: secant steps from the classical answer, closed by
//!   the Illinois variant of regula falsi once the target is bracketed (M. Dowell and
//!   P. Jarratt, BIT 11, 1971), on the field-led resonance of each candidate, to within
//!   [`LANDING`] of the target;
//! - [`Shape`]: the factor solved at a handful of lengths and interpolated (cubic Hermite),
//!   the field-shaped curve over the whole range, used to find the roots when the classical
//!   shape has none or points the wrong way ([`lengths`]), and drawn by every chart
//!   ([`chart_shape`]).

use super::field_tank::{field_resonance, matching_scale};
use super::solve::{self, Unreachable};
use crate::model::{Coil, Conditions, Tank, evaluate::resonance_of};

/// A landing stops within this fraction of the target (100 Hz at 100 MHz: far inside any
/// channel tolerance, and above the field solution's own 1e-9).
pub const LANDING: f64 = 1e-6;

/// Most field solves one landing takes before it gives up.
const MAX_SOLVES: usize = 14;

/// Lengths at which [`Shape`] solves the field for the advice's scan.
pub const SHAPE_POINTS: usize = 9;

/// The field-led model: the field solution of any coil, with a bench calibration's
/// inductance scale on it. Copy it from the figures ([`crate::recipe::Figures::led`]).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct FieldLed {
    /// The recipe's conditions: the temperature for the field solution, the driving model for
    /// the classical shape. Their inductance scale is not used.
    pub conditions: Conditions,
    /// The factor on the field-solved apparent inductance: the bench calibration's inductance
    /// scale, 1 before any.
    pub scale: f64,
}

impl FieldLed {
    /// The field-led resonance of `coil` across `external` farads, hertz (`None` when the
    /// field solution fails for that coil).
    pub fn resonance(&self, coil: &Coil, external: f64) -> Option<f64> {
        field_resonance(coil, external, &self.conditions, self.scale)
            .ok()
            .filter(|f| f.is_finite() && *f > 0.0)
    }

    /// The classical model's conditions moved onto the field-led resonance of this coil
    /// across `external` (the overall factor on the classical inductance), with that
    /// resonance, hertz.
    pub fn conditions_at(&self, coil: &Coil, external: f64) -> Option<(Conditions, f64)> {
        let f = self.resonance(coil, external)?;
        let k = self.factor_for(coil, external, f)?;
        Some((
            Conditions {
                inductance_scale: k,
                ..self.conditions
            },
            f,
        ))
    }

    /// The overall factor on the classical inductance that makes the classical model of
    /// `coil` across `external` resonate at `resonance`.
    fn factor_for(&self, coil: &Coil, external: f64, resonance: f64) -> Option<f64> {
        let unit = Conditions {
            inductance_scale: 1.0,
            ..self.conditions
        };
        matching_scale(coil, external, &unit, resonance)
    }
}

/// The lengths an instruction may propose for `coil`, metres: from the shortest buildable
/// length (bare turns keep [`super::buildable::minimum_gap`]) to
/// [`Coil::longest_proposed_length`].
pub fn proposable_range(coil: &Coil) -> (f64, f64) {
    let lo = super::buildable::shortest_buildable_length(coil).max(coil.shortest_length());
    (lo, coil.longest_proposed_length().max(lo))
}

/// An instruction's length found on the field-led model.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Landed {
    /// The coil length, metres.
    pub length: f64,
    /// The field-led resonance there, hertz.
    pub resonance: f64,
    /// Hz per metre of stretch there (from the last two field solves; negative: stretching
    /// further lowers the frequency).
    pub slope: f64,
}

/// The length of `coil` across `external` whose field-led resonance is `target`, from
/// `start` (the classical answer); `None` when the steps leave the buildable range, turn
/// back (the curve turns over between here and there) or do not settle.
///
/// # Method
/// The first step is Newton's with the classical model's slope at `start` (the classical
/// model moved onto the field-led resonance there); then secant steps through the last two
/// solves until the target is bracketed, then regula falsi (Illinois) on the bracket, until
/// the resonance is within [`LANDING`] of the target. Usually three or four field solves.
pub fn land_length(
    led: &FieldLed,
    coil: &Coil,
    external: f64,
    target: f64,
    start: f64,
) -> Option<Landed> {
    land_length_with(led, coil, external, target, start, None)
}

/// [`land_length`] with the first step's slope (Hz/m) given (the field shape's, where the
/// classical model's would point the wrong way).
fn land_length_with(
    led: &FieldLed,
    coil: &Coil,
    external: f64,
    target: f64,
    start: f64,
    slope: Option<f64>,
) -> Option<Landed> {
    let (lo, hi) = proposable_range(coil);
    let eps = LANDING * target;
    let f_at = |l: f64| -> Option<f64> { led.resonance(&coil.with_length(l).ok()?, external) };
    let x0 = start.clamp(lo, hi);
    let c0 = coil.with_length(x0).ok()?;
    let (cond0, f0) = led.conditions_at(&c0, external)?;
    let slope0 = slope.unwrap_or_else(|| solve::stretch_sensitivity(&c0, external, &cond0));
    let g0 = f0 - target;
    if g0.abs() <= eps {
        return Some(Landed {
            length: x0,
            resonance: f0,
            slope: slope0,
        });
    }
    if !(slope0.is_finite() && slope0 != 0.0) {
        return None;
    }
    let (mut a, mut ga) = (x0, g0);
    let mut b = (x0 - g0 / slope0).clamp(lo, hi);
    let mut solves = 1;
    loop {
        if b == a || solves >= MAX_SOLVES {
            return None;
        }
        let fb = f_at(b)?;
        solves += 1;
        let gb = fb - target;
        let slope = (gb - ga) / (b - a);
        if gb.abs() <= eps {
            return Some(Landed {
                length: b,
                resonance: fb,
                slope,
            });
        }
        if ga.signum() != gb.signum() {
            return bracket(a, ga, b, gb, eps, f_at, target, solves);
        }
        // Still on one side: the curve must run the way the classical slope said and the
        // step must have come closer, else it turns over here.
        if slope.signum() != slope0.signum() || gb.abs() >= ga.abs() {
            return None;
        }
        let next = (b - gb / slope).clamp(lo, hi);
        (a, ga) = (b, gb);
        b = next;
    }
}

/// Regula falsi (Illinois) on a bracket [a, b] of g = f − target.
#[expect(
    clippy::too_many_arguments,
    reason = "a bracket is two points, the stop, the function and the count so far"
)]
fn bracket(
    a: f64,
    ga: f64,
    b: f64,
    gb: f64,
    eps: f64,
    f_at: impl Fn(f64) -> Option<f64>,
    target: f64,
    solves: usize,
) -> Option<Landed> {
    let stop = crate::physics::roots::Stop {
        width: 0.0,
        relative_width: 0.0,
        value: eps,
        steps: MAX_SOLVES.saturating_sub(solves),
    };
    let found = crate::physics::roots::illinois((a, ga), (b, gb), stop, |x| {
        f_at(x).map(|f| f - target).ok_or(())
    })
    .ok()?;
    if !found.converged || found.value.is_nan() {
        return None;
    }
    let [(x0, g0), (x1, g1)] = found.bracket;
    Some(Landed {
        length: found.x,
        resonance: found.value + target,
        slope: (g1 - g0) / (x1 - x0),
    })
}

/// The trimmer setting (0–1) at which `coil` in `tank` resonates at `target` on the
/// field-led model, from `start` (the classical answer); `None` when the target is outside the
/// trimmer's reach there or the steps do not settle. Same steps as [`land_length`] in the
/// setting (more setting, more capacitance, lower frequency, everywhere).
pub fn land_setting(
    led: &FieldLed,
    coil: &Coil,
    tank: &Tank,
    target: f64,
    start: f64,
) -> Option<f64> {
    let eps = LANDING * target;
    let f_at = |s: f64| led.resonance(coil, tank.external_capacitance_at(s));
    let x0 = start.clamp(0.0, 1.0);
    let f0 = f_at(x0)?;
    let g0 = f0 - target;
    if g0.abs() <= eps {
        return Some(x0);
    }
    // The end of the travel on the far side of the target brackets it (one solve).
    let end = if g0 > 0.0 { 1.0 } else { 0.0 };
    if x0 == end {
        return None;
    }
    // Newton's first step on 1/f² ∝ C (a line in the setting), kept inside the travel.
    let c0 = tank.external_capacitance_at(x0);
    let dc = tank.trimmer_max - tank.trimmer_min;
    let first = if dc > 0.0 {
        (x0 + (c0 * (f0 / target).powi(2) - c0) / dc).clamp(0.0, 1.0)
    } else {
        end
    };
    let g1 = f_at(first)? - target;
    if g1.abs() <= eps {
        return Some(first);
    }
    if g1.signum() != g0.signum() {
        return bracket(x0, g0, first, g1, eps, f_at, target, 2).map(|l| l.length);
    }
    if first == end {
        return None;
    }
    let ge = f_at(end)? - target;
    if ge.signum() == g1.signum() {
        return None;
    }
    bracket(first, g1, end, ge, eps, f_at, target, 3).map(|l| l.length)
}

/// The factor on the classical inductance solved with the field at a handful of lengths (and
/// one or more capacitances) and interpolated between them: the field-shaped resonance over a
/// range of lengths, at the cost of one field solve per length and capacitance.
///
/// # Interpolation
/// In length, cubic Hermite with three-point slopes (held at the ends); in capacitance, the
/// polynomial through the capacitances solved (Lagrange, held outside them). The factor moves smoothly
/// (a few per cent over the range on short leads, tens of per cent with 40 mm leads), so
/// the resonance it gives follows the field solution to within what
/// tests/engine/landing.rs measures along each chart.
#[derive(Clone, Debug, PartialEq)]
pub struct Shape {
    lengths: Vec<f64>,
    /// Ascending capacitances, farads.
    capacitances: Vec<f64>,
    /// factors[j][i]: at capacitances[j] and lengths[i].
    factors: Vec<Vec<f64>>,
    conditions: Conditions,
}

impl Shape {
    /// Solve the field at `points` lengths evenly spread over the proposable range of `coil`
    /// ([`proposable_range`]) across `external`; `None` with fewer than two.
    pub fn solve(led: &FieldLed, coil: &Coil, external: f64, points: usize) -> Option<Shape> {
        Shape::solve_over(led, coil, &[external], proposable_range(coil), points)
    }

    /// Solve the field at `points` lengths spread over `range` (metres, kept within what the
    /// model accepts; closer together towards the short end) at each of `externals` (farads;
    /// two or three: the trimmer's ends and middle); `None` when fewer than two lengths solve
    /// at every capacitance.
    pub fn solve_over(
        led: &FieldLed,
        coil: &Coil,
        externals: &[f64],
        range: (f64, f64),
        points: usize,
    ) -> Option<Shape> {
        let candidates = spread_lengths(coil, range, points);
        Shape::solve_at(led, coil, externals, &candidates)
    }

    /// Solve the field at each of `candidates` (metres, ascending; a length the model refuses
    /// is left out) and each of `externals` (farads); `None` when fewer than two lengths
    /// solve at every capacitance.
    pub fn solve_at(
        led: &FieldLed,
        coil: &Coil,
        externals: &[f64],
        candidates: &[f64],
    ) -> Option<Shape> {
        let n = candidates.len();
        let mut capacitances: Vec<f64> = externals.to_vec();
        capacitances.sort_by(f64::total_cmp);
        capacitances.dedup();
        let mut lengths = Vec::with_capacity(n);
        let mut factors = vec![Vec::with_capacity(n); capacitances.len()];
        for &l in candidates {
            let Ok(c) = coil.with_length(l) else {
                continue;
            };
            let column: Option<Vec<f64>> = capacitances
                .iter()
                .map(|&x| led.conditions_at(&c, x).map(|(k, _)| k.inductance_scale))
                .collect();
            if let Some(column) = column {
                lengths.push(l);
                for (row, k) in factors.iter_mut().zip(column) {
                    row.push(k);
                }
            }
        }
        (lengths.len() >= 2 && !capacitances.is_empty()).then_some(Shape {
            lengths,
            capacitances,
            factors,
            conditions: led.conditions,
        })
    }

    /// The interpolated factor at `length` across the first capacitance solved.
    pub fn factor_at(&self, length: f64) -> f64 {
        hermite(&self.lengths, &self.factors[0], length)
    }

    /// The interpolated factor at `length` across `external` farads: in capacitance, the
    /// polynomial through every capacitance solved (Lagrange; three at most are asked for).
    /// Beyond the capacitances solved it is carried on for up to half their span (a hand's
    /// 1–2 pF past the top of a trimmer's travel on the teaching bench: held there instead, the
    /// factor missed exact field solves by up to 14 kHz on the bench demo, carried on it stays
    /// within the chart's 5 kHz, tests/engine/chart_shape.rs), held past that.
    pub fn factor_at_capacitance(&self, length: f64, external: f64) -> f64 {
        let c = &self.capacitances;
        let m = c.len();
        let reach = 0.5 * (c[m - 1] - c[0]);
        let x = external.clamp(c[0] - reach, c[m - 1] + reach);
        (0..m)
            .map(|j| {
                let weight: f64 = (0..m)
                    .filter(|&i| i != j)
                    .map(|i| (x - c[i]) / (c[j] - c[i]))
                    .product();
                weight * hermite(&self.lengths, &self.factors[j], length)
            })
            .sum()
    }

    /// The field-shaped resonance of `coil` at `length` across `external`, hertz (NaN for a
    /// length the model refuses).
    pub fn resonance_at(&self, coil: &Coil, length: f64, external: f64) -> f64 {
        coil.with_length(length).map_or(f64::NAN, |c| {
            let cond = Conditions {
                inductance_scale: self.factor_at_capacitance(length, external),
                ..self.conditions
            };
            resonance_of(&c, external, &cond)
        })
    }

    /// The classical model's conditions moved onto the field shape at `length` across
    /// `external` farads (the interpolated factor as the overall inductance scale): what a
    /// derived copy of the coil at another length carries, such as the teaching bench's, so
    /// its figures are the shape's there (tests/engine/chart_shape.rs measures them against
    /// exact field solves over the teaching sweep's lengths).
    pub fn conditions_at(&self, length: f64, external: f64) -> Conditions {
        Conditions {
            inductance_scale: self.factor_at_capacitance(length, external),
            ..self.conditions
        }
    }

    /// The lengths at which the factor was solved, metres.
    pub fn lengths(&self) -> &[f64] {
        &self.lengths
    }

    /// How many field solves the shape took.
    pub fn solves(&self) -> usize {
        self.lengths.len() * self.capacitances.len()
    }
}

/// Cubic Hermite interpolation of (x, y) at `at`, with three-point slopes (one-sided at the
/// ends), held outside the points.
fn hermite(x: &[f64], y: &[f64], at: f64) -> f64 {
    let n = x.len();
    if at <= x[0] {
        return y[0];
    }
    if at >= x[n - 1] {
        return y[n - 1];
    }
    let i = x.partition_point(|&v| v <= at).clamp(1, n - 1) - 1;
    let slope = |j: usize| -> f64 {
        if j == 0 {
            (y[1] - y[0]) / (x[1] - x[0])
        } else if j == n - 1 {
            (y[n - 1] - y[n - 2]) / (x[n - 1] - x[n - 2])
        } else {
            (y[j + 1] - y[j - 1]) / (x[j + 1] - x[j - 1])
        }
    };
    let h = x[i + 1] - x[i];
    let t = (at - x[i]) / h;
    let (t2, t3) = (t * t, t * t * t);
    (2.0 * t3 - 3.0 * t2 + 1.0) * y[i]
        + (t3 - 2.0 * t2 + t) * h * slope(i)
        + (-2.0 * t3 + 3.0 * t2) * y[i + 1]
        + (t3 - t2) * h * slope(i + 1)
}

/// `points` lengths (at least two) spread over `range` (metres, kept within what the model
/// accepts), closer together towards close-wound, where the factor moves fastest.
fn spread_lengths(coil: &Coil, range: (f64, f64), points: usize) -> Vec<f64> {
    let lo = range.0.max(coil.shortest_length());
    let hi = range.1.max(lo).min(crate::model::limits::LENGTH_MAX);
    let n = points.max(2);
    (0..n)
        .map(|i| {
            let u = i as f64 / (n - 1) as f64;
            lo + (hi - lo) * 0.5 * u * (1.0 + u)
        })
        .collect()
}

/// Lengths at which [`chart_shape`] solves the field, besides the present one.
pub const CHART_SHAPE_POINTS: usize = 11;

/// [`CHART_SHAPE_POINTS`] lengths over `range` for a chart: u^1.5 spacing (u even over
/// 0–1), closer still towards close-wound than [`spread_lengths`], where the factor bends
/// most (the first interval is 3 % of the range). Chosen by measurement on the bench demo
/// (tests/engine/chart_shape.rs): with nine or ten lengths, or u², the worst error along the
/// chart was 6–9 kHz, near close-wound; with these, 4.6 kHz, the rest being the field
/// solution's own steps as its straight parts gain a segment (a few kHz either way).
fn chart_lengths(coil: &Coil, range: (f64, f64)) -> Vec<f64> {
    let lo = range.0.max(coil.shortest_length());
    let hi = range.1.max(lo).min(crate::model::limits::LENGTH_MAX);
    let n = CHART_SHAPE_POINTS;
    (0..n)
        .map(|i| lo + (hi - lo) * (i as f64 / (n - 1) as f64).powf(1.5))
        .collect()
}

/// The trimmer setting whose capacitance a chart's shape solves between the ends: the
/// present one, so the shape is exact there, unless it lies within 10 % of travel of an end
/// (then the middle, which keeps three capacitances for the interpolation).
fn middle_setting(present: f64) -> f64 {
    if (0.1..=0.9).contains(&present) {
        present
    } else {
        0.5
    }
}

/// The field shape a chart of `coil` in `tank` draws over `range` (metres): the factor solved
/// with the field at [`CHART_SHAPE_POINTS`] lengths spread over the range and at the present
/// length, each across the trimmer's two ends and the present setting (or the middle when
/// the present setting is near an end): 36 field solves (0.2–0.3 s in release), so the curves and the trimmer's
/// sweep are exact at the present coil and setting and follow the field solution between
/// (tests/engine/landing.rs measures them against exact field solves). The window's worker
/// ([`crate::ui::field_worker`]) and the hand-outs call this one function.
pub fn chart_shape(led: &FieldLed, coil: &Coil, tank: &Tank, range: (f64, f64)) -> Option<Shape> {
    let mut lengths = chart_lengths(coil, range);
    let present = coil.length();
    let (lo, hi) = (lengths[0], lengths[lengths.len() - 1]);
    if (lo..=hi).contains(&present) {
        // The present length as a node; a node closer to it than a third of the smallest
        // spacing is dropped (three-point slopes across a tiny step would be noise).
        let gap = lengths
            .windows(2)
            .map(|w| w[1] - w[0])
            .fold(f64::INFINITY, f64::min);
        lengths.retain(|&l| (l - present).abs() >= gap / 3.0);
        let at = lengths.partition_point(|&l| l < present);
        lengths.insert(at, present);
    }
    let externals = [
        tank.external_capacitance_at(0.0),
        tank.external_capacitance_at(middle_setting(tank.trimmer_setting)),
        tank.external_capacitance_at(1.0),
    ];
    Shape::solve_at(led, coil, &externals, &lengths)
}

/// Where the field-led resonance reaches `target`: the landed length nearest the present
/// one and how many lengths land it.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Found {
    /// The length proposed.
    pub landed: Landed,
    /// How many lengths over the range land the target.
    pub roots: usize,
}

/// The length of `coil` across `external` nearest its present length whose field-led
/// resonance is `target`, or why none is (`conditions`: the classical model at the present
/// coil, as the figures carry it).
///
/// The classical shape's roots, nearest first, are landed with [`land_length`]; where that
/// fails (no classical root, or the field-led curve turns over before it) the roots are
/// found on the field shape ([`Shape`], [`SHAPE_POINTS`] solves) and landed from there.
pub fn lengths(
    led: &FieldLed,
    coil: &Coil,
    external: f64,
    conditions: &Conditions,
    target: f64,
) -> Result<Found, Unreachable> {
    let present = coil.length();
    let nearest_first = |mut roots: Vec<f64>| {
        roots.sort_by(|a, b| (a - present).abs().total_cmp(&(b - present).abs()));
        roots
    };
    let (lo, hi) = proposable_range(coil);
    if let Ok(roots) = solve::lengths_for_target(coil, external, conditions, target) {
        let roots: Vec<f64> = roots.into_iter().filter(|&r| r >= lo).collect();
        let n = roots.len();
        if let Some(landed) = nearest_first(roots)
            .into_iter()
            .take(2)
            .find_map(|r| land_length(led, coil, external, target, r))
        {
            return Ok(Found { landed, roots: n });
        }
    }
    let Some(shape) = Shape::solve(led, coil, external, SHAPE_POINTS) else {
        // No field solution along the range: the classical answer stands (the fallback).
        return classical_found(coil, external, conditions, target);
    };
    let on_shape = |l: f64| shape.resonance_at(coil, l, external);
    let roots = solve::roots_of(lo, hi, on_shape, target)?;
    let n = roots.len();
    // Each root landed from the shape's own slope there; failing that, bracketed by steps
    // out from it on field solves.
    let step = (hi - lo) / (4 * SHAPE_POINTS) as f64;
    nearest_first(roots.clone())
        .into_iter()
        .find_map(|r| {
            let (a, b) = ((r - 0.1 * step).max(lo), (r + 0.1 * step).min(hi));
            let slope = (on_shape(b) - on_shape(a)) / (b - a);
            land_length_with(led, coil, external, target, r, Some(slope))
                .or_else(|| bracket_out(led, coil, external, target, r, step))
        })
        .map(|landed| Found { landed, roots: n })
        .ok_or({
            // The shape says it reaches, the field solves do not confirm it: out of reach
            // on the side the shape's extremes say.
            let lowest = roots
                .iter()
                .map(|&r| on_shape(r))
                .fold(f64::INFINITY, f64::min);
            if lowest > target {
                Unreachable::AboveEvenCloseWound {
                    close_wound: lowest,
                }
            } else {
                Unreachable::BelowEvenStretched { stretched: target }
            }
        })
}

/// Field solves at `r` ± `step`, ± 2·`step`, … until one pair brackets `target`, then
/// regula falsi on it (at most four steps each way).
fn bracket_out(
    led: &FieldLed,
    coil: &Coil,
    external: f64,
    target: f64,
    r: f64,
    step: f64,
) -> Option<Landed> {
    let (lo, hi) = proposable_range(coil);
    let f_at = |l: f64| -> Option<f64> { led.resonance(&coil.with_length(l).ok()?, external) };
    let g_r = f_at(r)? - target;
    let eps = LANDING * target;
    if g_r.abs() <= eps {
        return Some(Landed {
            length: r,
            resonance: g_r + target,
            slope: f64::NAN,
        });
    }
    let mut solves = 1;
    for k in 1..=4 {
        for sign in [1.0, -1.0] {
            let x = (r + sign * step * f64::from(1 << (k - 1))).clamp(lo, hi);
            if x == r {
                continue;
            }
            let g = f_at(x)? - target;
            solves += 1;
            if g.signum() != g_r.signum() {
                return bracket(r, g_r, x, g, eps, f_at, target, solves);
            }
        }
    }
    None
}

/// The classical shape's answer, unlanded (where the field solution fails along the way).
fn classical_found(
    coil: &Coil,
    external: f64,
    conditions: &Conditions,
    target: f64,
) -> Result<Found, Unreachable> {
    let (lo, hi) = proposable_range(coil);
    let f_at = |l: f64| solve::resonance_at_length(coil, l, external, conditions);
    let roots = solve::roots_of(lo, hi, f_at, target)?;
    let n = roots.len();
    let present = coil.length();
    let length = roots
        .into_iter()
        .min_by(|a, b| (a - present).abs().total_cmp(&(b - present).abs()))
        .unwrap_or(present);
    Ok(Found {
        landed: Landed {
            length,
            resonance: solve::resonance_at_length(coil, length, external, conditions),
            slope: solve::stretch_sensitivity(
                &coil.with_length(length).unwrap_or(*coil),
                external,
                conditions,
            ),
        },
        roots: n,
    })
}

/// Most candidates for another number of turns that are checked with field solves.
const TURNS_CHECKED: usize = 6;

/// Another number of turns (same wire, diameter and leads, the pitch kept) whose field-led
/// resonance lands `target` at some buildable length, the fewest quarter turns first, in the
/// direction `why` says (a tank above the target even close-wound needs more turns, one
/// below it even at its highest fewer). Candidates the classical shape (`conditions`) says
/// reach the target are checked with [`lengths`], at most `TURNS_CHECKED` of them.
pub fn turns(
    led: &FieldLed,
    coil: &Coil,
    external: f64,
    conditions: &Conditions,
    target: f64,
    why: &Unreachable,
) -> Option<solve::TurnsChange> {
    let sign = match why {
        Unreachable::AboveEvenCloseWound { .. } => 1.0,
        Unreachable::BelowEvenStretched { .. } => -1.0,
        Unreachable::OutsideTrimmer { .. } => return None,
    };
    let pitch = coil.pitch();
    let mut checked = 0;
    for k in 1..=solve::MAX_QUARTER_STEPS {
        let turns = coil.turns() + sign * 0.25 * f64::from(k);
        let Ok(c) = coil.with_turns(turns, turns * pitch) else {
            continue;
        };
        if solve::lengths_for_target(&c, external, conditions, target).is_err() {
            continue;
        }
        checked += 1;
        if checked > TURNS_CHECKED {
            return None;
        }
        if let Ok(found) = lengths(led, &c, external, conditions, target) {
            return Some(solve::TurnsChange {
                turns,
                length: found.landed.length,
            });
        }
    }
    None
}

/// How far the field-led resonance of `coil` across `external` moves per metre of stretch,
/// Hz/m, by a central difference of ±1 % of the length on two field solves (one-sided at the
/// ends of the range), as [`solve::stretch_sensitivity`] on the classical shape.
pub fn stretch_sensitivity(led: &FieldLed, coil: &Coil, external: f64) -> Option<f64> {
    let h = 0.01 * coil.length();
    let lo = (coil.length() - h).max(coil.shortest_length());
    let hi = (coil.length() + h).min(crate::model::limits::LENGTH_MAX);
    let f = |l: f64| led.resonance(&coil.with_length(l).ok()?, external);
    Some((f(hi)? - f(lo)?) / (hi - lo))
}

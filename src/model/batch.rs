//! The resonance over many lengths (or many capacitances) of one coil in one call.
//!
//! The same physics as [`super::evaluate::resonance_of`] (Nagaoka's exact sheet, Rosa's
//! round-wire correction, the two leads, Medhurst's self-capacitance, and the self-consistent
//! solve for the wire's internal inductance), arranged for sweeps: what does not change along
//! the sweep (k_m, the leads, the logarithm of the wire's size, the resistivity, the slope of
//! the inductance in the internal-inductance fraction) is computed once; the rest runs as
//! passes over columns (struct of arrays) with fixed iteration counts chosen once per call and
//! no branches inside the loops, so the compiler can vectorise them. Results equal the
//! per-point path within 1e-9 (relative), which the tests check.
//!
//! The fast path covers the round-wire and current-sheet models where the wire is thick
//! against its skin depth (r/δ > 10, the asymptotic internal impedance; true for any practical
//! VHF wire). Outside that (another model, very thin wire, a low frequency) each point is
//! computed by the per-point path instead, with the same results.

// The passes index several parallel columns at once, re-sliced to one length first so the
// bounds checks are hoisted; iterator chains over five columns would read worse.
#![expect(
    clippy::needless_range_loop,
    reason = "index loops over parallel columns keep the passes branch-free for the vectoriser"
)]

use super::coil::Coil;
use super::evaluate::resonance_of;
use super::inductance_model::{Conditions, InductanceModel};
use crate::physics::constants::MU_0;
use crate::physics::{copper, leads, medhurst, round_wire};
use std::f64::consts::PI;

/// What the batch needs of a coil (an adapter, so the batch does not lean on the coil's fields
/// anywhere else).
#[derive(Clone, Copy, Debug)]
struct Shape {
    mean_diameter: f64,
    turns: f64,
    wire_bare: f64,
    lead_length: f64,
}

impl Shape {
    fn of(coil: &Coil) -> Self {
        Self {
            mean_diameter: coil.mean_diameter(),
            turns: coil.turns(),
            wire_bare: coil.wire_bare(),
            lead_length: coil.lead_length(),
        }
    }
}

/// Largest δ/r at which the asymptotic internal inductance fraction holds (r/δ ≥ 10).
const DEPTH_RATIO_LIMIT: f64 = 0.1;

/// Relative error in the solved inductance the fixed number of rounds must reach: well inside
/// the per-point path's own 2e-9, so the two agree within 1e-9 in frequency.
const ROUNDS_TOLERANCE: f64 = 1e-12;

/// Most rounds the fast path will take; beyond this the per-point path is used.
const MAX_ROUNDS: usize = 8;

/// Which way a batch call computed its points.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum BatchPath {
    /// The column passes (the fast path).
    Columns,
    /// One point at a time by the per-point path (another model, or r/δ below 10).
    PerPoint,
}

/// Working columns for the batch, kept between calls so that a sweep does not allocate.
#[derive(Clone, Debug, Default)]
pub struct SweepColumns {
    mean: Vec<f64>,
    geo: Vec<f64>,
    sum: Vec<f64>,
    bare: Vec<f64>,
    capacitance: Vec<f64>,
    gain: Vec<f64>,
    inductance: Vec<f64>,
}

impl SweepColumns {
    fn resize(&mut self, n: usize) {
        for col in [
            &mut self.mean,
            &mut self.geo,
            &mut self.sum,
            &mut self.bare,
            &mut self.capacitance,
            &mut self.gain,
            &mut self.inductance,
        ] {
            col.clear();
            col.resize(n, 0.0);
        }
    }
}

/// Bins of equal width in ln(l/D) over Medhurst's table, for finding the segment without a
/// search: each bin (width ln 500/128 ≈ 0.049) is narrower than the table's narrowest step in
/// ln(l/D) (ln(1/0.9) ≈ 0.105), so a bin holds at most one entry.
const BINS: usize = 128;

/// Medhurst's table as the batch uses it: the l/D of each entry (padded with +∞), H, the
/// logarithms, and for each bin the count of entries below the bin's start.
struct MedhurstColumns {
    x: [f64; 36],
    h: [f64; 33],
    ln_x: [f64; 33],
    inv_step: [f64; 33],
    ln_start: f64,
    bins_per_ln: f64,
    below: [usize; BINS],
}

fn medhurst_columns() -> &'static MedhurstColumns {
    static COLS: std::sync::OnceLock<MedhurstColumns> = std::sync::OnceLock::new();
    COLS.get_or_init(|| {
        let t = medhurst::table();
        let mut c = MedhurstColumns {
            x: [f64::INFINITY; 36],
            h: [0.0; 33],
            ln_x: [0.0; 33],
            inv_step: [0.0; 33],
            ln_start: 0.0,
            bins_per_ln: 0.0,
            below: [0; BINS],
        };
        for (i, &(x, h)) in t.iter().enumerate().take(33) {
            c.x[i] = x;
            c.h[i] = h;
            c.ln_x[i] = x.ln();
        }
        for i in 0..32 {
            c.inv_step[i] = 1.0 / (c.ln_x[i + 1] - c.ln_x[i]);
        }
        c.ln_start = c.ln_x[0];
        let width = (c.ln_x[32] - c.ln_x[0]) / BINS as f64;
        c.bins_per_ln = 1.0 / width;
        for (b, below) in c.below.iter_mut().enumerate() {
            let start = (c.ln_start + b as f64 * width).exp();
            *below = t.partition_point(|&(x, _)| x < start);
        }
        c
    })
}

/// Medhurst's factor from l/D and its logarithm, branch-free: the segment is the count of
/// table entries below x (what [`medhurst::factor`]'s search finds), taken from the count
/// below the bin's start, less one, plus three comparisons (one for the entry the bin may
/// hold, two spare for a bin misplaced by rounding at either edge), then interpolated in
/// ln(l/D) exactly as there.
#[inline(always)]
fn medhurst_factor(t: &MedhurstColumns, x: f64, ln_x: f64) -> f64 {
    // `as usize` saturates: below the table gives bin 0 (NaN too), above it the last bin.
    let bin = (((ln_x - t.ln_start) * t.bins_per_ln) as usize).min(BINS - 1);
    let base = t.below[bin].saturating_sub(1);
    let below = base
        + usize::from(t.x[base] < x)
        + usize::from(t.x[base + 1] < x)
        + usize::from(t.x[base + 2] < x);
    let i = below.clamp(1, 32);
    let (h0, h1) = (t.h[i - 1], t.h[i]);
    let s = (ln_x - t.ln_x[i - 1]) * t.inv_step[i - 1];
    (h0 + s * (h1 - h0)).max(0.0)
}

/// The parts of the driving inductance that do not change along a sweep.
#[derive(Clone, Copy, Debug)]
struct Shared {
    /// The conditions' inductance scale, already in every inductance below.
    inductance_scale: f64,
    /// µ0·N²/12 (scaled): the current sheet is this × bracket/(l²·M).
    sheet_scale: f64,
    /// Rosa's µ0·a·N (zero when the current sheet drives: no correction).
    rosa_scale: f64,
    /// k_s at χ = 0 less ln l: 3/2 − ln(2/(N·d)), so that k_s = this − ln l.
    k_s_offset: f64,
    k_m: f64,
    /// Both leads at χ = 0.
    leads_surface: f64,
    /// dL/dχ: Rosa's µ0·a·N/4 plus the leads' internal part.
    slope: f64,
    /// √(2ρ/µ0)/r: the solver's gain is G = this·C^(1/4), and δ/r = G·L^(1/4).
    depth_scale: f64,
}

/// The column form a model has on the batch path, if any: `Some(true)` with Rosa's round-wire
/// correction, `Some(false)` as the current sheet alone, `None` for the per-point path. No
/// `_ =>` arm: a new model must choose here, and the batch test walks
/// [`InductanceModel::ALL`] through this.
pub const fn column_form(model: InductanceModel) -> Option<bool> {
    match model {
        InductanceModel::RoundWire => Some(true),
        InductanceModel::CurrentSheet => Some(false),
        InductanceModel::FilamentSum
        | InductanceModel::Lundin1985
        | InductanceModel::Wheeler1928 => None,
    }
}

fn shared(shape: &Shape, conditions: &Conditions) -> Option<Shared> {
    let rosa = column_form(conditions.model)?;
    let (d, n, w) = (shape.mean_diameter, shape.turns, shape.wire_bare);
    // The driving inductance (coil and leads) is scaled as a whole, as the per-point path
    // does (a bench calibration's inductance scale).
    let scale = conditions.inductance_scale;
    let lead = leads::straight_wire_inductance_limits(shape.lead_length, 0.5 * w);
    let rosa_scale = if rosa {
        scale * MU_0 * 0.5 * d * n
    } else {
        0.0
    };
    let leads_surface = scale * 2.0 * lead[0];
    let slope = (0.25 * rosa_scale + scale * 2.0 * (lead[1] - lead[0])).abs();
    let resistivity = copper::resistivity(conditions.temperature_c);
    Some(Shared {
        inductance_scale: scale,
        sheet_scale: scale * MU_0 / 12.0 * n * n,
        rosa_scale,
        k_s_offset: 1.5 - (2.0 / (n * w)).ln(),
        k_m: round_wire::k_m(n),
        leads_surface,
        slope,
        depth_scale: (resistivity * (2.0 / MU_0)).sqrt() / (0.5 * w),
    })
}

/// Rounds of the AGM that bring the slowest element (the shortest coil: the largest parameter
/// m) to the per-point path's stop; every other element converges in as many or fewer.
fn agm_rounds(d2: f64, shortest: f64) -> usize {
    let l = shortest;
    let mut a = (d2 + l * l).sqrt();
    let mut b = l;
    for round in 1..=12 {
        let c = 0.5 * (a - b);
        let next_a = 0.5 * (a + b);
        b = (a * b).sqrt();
        a = next_a;
        if c <= 1e-9 * a {
            return round;
        }
    }
    12
}

/// Fixed-point rounds needed for the whole batch to reach [`ROUNDS_TOLERANCE`], from a bound on
/// the internal inductance fraction (χ ≤ 2.05·δ/r in the asymptotic range) and the contraction
/// bound of the per-point solver (k ≤ 1.01·ΔL·χ/(4L)); `None` outside the fast path.
fn solve_rounds(slope: f64, l0_min: f64, l0_max: f64, gain_max: f64) -> Option<usize> {
    let depth_max = gain_max * (l0_max + slope).sqrt().sqrt();
    // Written so that NaN takes the refusal path.
    let fast = depth_max < DEPTH_RATIO_LIMIT && l0_min > 0.0;
    if !fast {
        return None;
    }
    let chi_max = (2.05 * depth_max).min(1.0);
    let start_error = slope * chi_max / l0_min;
    let k = 1.01 * slope * chi_max / (4.0 * l0_min);
    if start_error <= ROUNDS_TOLERANCE {
        return Some(1);
    }
    if k.is_nan() || k >= 0.5 {
        return None;
    }
    // start_error · k^(R−1) ≤ tol, counting the start as the first round.
    let more = ((ROUNDS_TOLERANCE / start_error).ln() / k.ln()).ceil();
    let rounds = 1 + more.max(0.0) as usize;
    (rounds <= MAX_ROUNDS).then_some(rounds)
}

/// Resonance in hertz of `coil` at each of `lengths` (current-sheet lengths, metres; same turns,
/// wire and leads) across `external_capacitance` farads, written into `out` (same length).
///
/// Equal to `resonance_of(&coil.with_length(l), external_capacitance, conditions)` for each l
/// within 1e-9 relative. Lengths should be at or above the close-wound length (the caller's
/// check, as for [`Coil::with_length`]); a length that is not positive gives NaN.
pub fn resonance_over_lengths(
    coil: &Coil,
    external_capacitance: f64,
    conditions: &Conditions,
    lengths: &[f64],
    out: &mut [f64],
    columns: &mut SweepColumns,
) -> BatchPath {
    let n = lengths.len().min(out.len());
    let (lengths, out) = (&lengths[..n], &mut out[..n]);
    let shape = Shape::of(coil);
    let Some(s) = shared(&shape, conditions) else {
        per_point_lengths(coil, external_capacitance, conditions, lengths, out);
        return BatchPath::PerPoint;
    };
    if n == 0 {
        return BatchPath::Columns;
    }
    let d = shape.mean_diameter;
    let d2 = d * d;
    let ln_d = d.ln();
    let inv_d = 1.0 / d;
    let med = medhurst_columns();
    columns.resize(n);
    let c = columns;

    // Pass 1 (scalar: the logarithm is a library call and Medhurst's table a lookup): ln l
    // for k_s and Medhurst's factor, giving the tank capacitance with the self-capacitance
    // and Rosa's correction at χ = 0 (k_s = offset − ln l, kept in `bare` until the sheet is
    // known).
    {
        let (cap, bare) = (&mut c.capacitance[..n], &mut c.bare[..n]);
        for i in 0..n {
            let l = lengths[i];
            let ln_l = l.ln();
            let h_factor = medhurst_factor(med, l * inv_d, ln_l - ln_d);
            cap[i] = external_capacitance + h_factor * d * 1e-10;
            bare[i] = s.rosa_scale * (s.k_s_offset - ln_l + s.k_m);
        }
    }
    // The extremes are taken in separate folds, so that the passes themselves carry no
    // reduction and vectorise.
    let shortest = lengths.iter().copied().fold(f64::INFINITY, f64::min);

    // Pass 2: the AGM from h = √(D² + l²) and l, the same number of rounds for every element.
    let rounds = agm_rounds(d2, shortest);
    {
        let (mean, geo, sum) = (&mut c.mean[..n], &mut c.geo[..n], &mut c.sum[..n]);
        for i in 0..n {
            let l = lengths[i];
            mean[i] = (d2 + l * l).sqrt();
            geo[i] = l;
            sum[i] = 0.5 * d2;
        }
        let mut weight = 0.5_f64;
        for _ in 0..rounds {
            weight *= 2.0;
            for i in 0..n {
                let (a, b) = (mean[i], geo[i]);
                let half = 0.5 * (a - b);
                sum[i] += weight * half * half;
                geo[i] = (a * b).sqrt();
                mean[i] = 0.5 * (a + b);
            }
        }
    }

    // Pass 3: the exact sheet, the driving inductance at χ = 0, the skin-depth gain.
    {
        let gain_scale = s.depth_scale;
        let (mean, sum, cap) = (&c.mean[..n], &c.sum[..n], &c.capacitance[..n]);
        let (bare, gain) = (&mut c.bare[..n], &mut c.gain[..n]);
        for i in 0..n {
            let l = lengths[i];
            let l2 = l * l;
            let h2 = d2 + l2;
            let m = mean[i];
            let bracket = 2.0 * PI * (h2 * d2 + sum[i] * (l2 - d2)) - 4.0 * d2 * d * m;
            let sheet = bracket / (l2 * m) * s.sheet_scale;
            bare[i] = sheet - bare[i] + s.leads_surface;
            gain[i] = gain_scale * cap[i].sqrt().sqrt();
        }
    }
    let l0_min = c.bare.iter().copied().fold(f64::INFINITY, f64::min);
    let l0_max = c.bare.iter().copied().fold(0.0, f64::max);
    let gain_max = c.gain.iter().copied().fold(0.0, f64::max);

    let Some(solve) = solve_rounds(s.slope, l0_min, l0_max, gain_max) else {
        per_point_lengths(coil, external_capacitance, conditions, lengths, out);
        return BatchPath::PerPoint;
    };
    solve_columns(c, s.slope, solve, out);
    BatchPath::Columns
}

/// Resonance in hertz of `coil` across each of `capacitances` (external, farads), into `out`.
///
/// Equal to `resonance_of(coil, c, conditions)` for each c within 1e-9 relative.
pub fn resonance_over_capacitances(
    coil: &Coil,
    conditions: &Conditions,
    capacitances: &[f64],
    out: &mut [f64],
    columns: &mut SweepColumns,
) -> BatchPath {
    let n = capacitances.len().min(out.len());
    let (capacitances, out) = (&capacitances[..n], &mut out[..n]);
    let shape = Shape::of(coil);
    let per_point = |out: &mut [f64]| {
        for (f, &cap) in out.iter_mut().zip(capacitances) {
            *f = resonance_of(coil, cap, conditions);
        }
    };
    let Some(s) = shared(&shape, conditions) else {
        per_point(out);
        return BatchPath::PerPoint;
    };
    if n == 0 {
        return BatchPath::Columns;
    }
    // Everything but the capacitance is shared: one sheet, one self-capacitance.
    let d = shape.mean_diameter;
    let l = coil.length();
    let sheet = s.inductance_scale * crate::physics::nagaoka::sheet(d, l, shape.turns).inductance;
    let ln_l = l.ln();
    let l0 = sheet - s.rosa_scale * (s.k_s_offset - ln_l + s.k_m) + s.leads_surface;
    let self_capacitance = medhurst::self_capacitance(d, l / d);
    columns.resize(n);
    let c = columns;
    let mut gain_max = 0.0_f64;
    for i in 0..n {
        c.capacitance[i] = capacitances[i] + self_capacitance;
        c.bare[i] = l0;
        let g = s.depth_scale * c.capacitance[i].sqrt().sqrt();
        c.gain[i] = g;
        gain_max = gain_max.max(g);
    }
    let Some(solve) = solve_rounds(s.slope, l0, l0, gain_max) else {
        per_point(out);
        return BatchPath::PerPoint;
    };
    solve_columns(c, s.slope, solve, out);
    BatchPath::Columns
}

/// The fixed-point solve on columns: L ← L₀ + ΔL·χ(G·L^(1/4)), `rounds` times from L₀, then
/// f = 1/(2π√(L·C)). `bare` holds L₀, `gain` G, `capacitance` C.
fn solve_columns(c: &mut SweepColumns, slope: f64, rounds: usize, out: &mut [f64]) {
    let n = out.len();
    let (bare, gain, cap) = (&c.bare[..n], &c.gain[..n], &c.capacitance[..n]);
    let inductance = &mut c.inductance[..n];
    inductance.copy_from_slice(bare);
    for _ in 0..rounds {
        for i in 0..n {
            let depth = gain[i] * inductance[i].sqrt().sqrt();
            inductance[i] = bare[i] + slope * copper::asymptotic_fraction(depth);
        }
    }
    for i in 0..n {
        out[i] = (0.5 / PI) / (inductance[i] * cap[i]).sqrt();
    }
}

fn per_point_lengths(
    coil: &Coil,
    external_capacitance: f64,
    conditions: &Conditions,
    lengths: &[f64],
    out: &mut [f64],
) {
    for (f, &l) in out.iter_mut().zip(lengths) {
        *f = coil.with_length(l).map_or(f64::NAN, |c| {
            resonance_of(&c, external_capacitance, conditions)
        });
    }
}

/// [`resonance_over_lengths`] into a new vector (allocates its own columns).
pub fn resonance_over_lengths_vec(
    coil: &Coil,
    external_capacitance: f64,
    conditions: &Conditions,
    lengths: &[f64],
) -> Vec<f64> {
    let mut out = vec![0.0; lengths.len()];
    let mut columns = SweepColumns::default();
    resonance_over_lengths(
        coil,
        external_capacitance,
        conditions,
        lengths,
        &mut out,
        &mut columns,
    );
    out
}

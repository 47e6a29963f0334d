//! The cost of a field solution, bounded before any work is done.
//!
//! The moment method's cost grows with the number of unknowns n (one triangle basis per node
//! of the cut wire): the frequency-independent integrals hold 2·P matrices of n² reals (P the
//! series terms, see [`super::matrix::series_terms`]), each frequency assembles an n×n
//! complex matrix and factors it in place by Gaussian elimination, about (8/3)·n³ real
//! multiply-adds for a complex matrix (G. H. Golub and C. F. Van Loan, *Matrix
//! Computations*, 4th ed., 2013, §3.2.6: 2n³/3 flops, four real products per complex one).
//! A self-resonance search and a tank solution take a few dozen such frequencies.
//!
//! [`check`] refuses a wire whose held matrices would exceed [`MEMORY_LIMIT_BYTES`] or whose
//! unknowns exceed [`UNKNOWNS_LIMIT`] (the count measured to keep a whole `evaluate` within
//! [`TIME_LIMIT_SECONDS`] on the project machine; see `tests/engine/field_budget.rs`), so the
//! caller falls back on the classical model with the reason instead of working for half a
//! minute and half a gigabyte.

use super::geometry::{FieldError, Structure};

/// Most memory a field solution may hold, bytes (the one-model work's bound for every coil
/// the tool accepts).
pub const MEMORY_LIMIT_BYTES: f64 = 200e6;

/// The time a whole field-led evaluation may take, seconds (the one-model work's bound).
pub const TIME_LIMIT_SECONDS: f64 = 2.0;

/// Most unknowns solved. After the change (same machine and load, 4 December 2026): 25 turns
/// (400 unknowns) 0.66 s and 50 MB, 35 turns (455) 0.91 s, 60 turns (480, at 8 a turn)
/// 1.05 s and 69 MB; 75 and 100 turns declined at once. Measured before it with `/usr/bin/time` on `tankwright evaluate … --json`
/// (release build, the project machine's 2 cores while other builds ran, 4 December 2026;
/// an 8 mm coil of 0.5 mm wire at 16 segments a turn): 320 unknowns 0.31 s and 34 MB,
/// 480 1.18 s and 69 MB, 560 1.72 s and 92 MB, 640 2.88 s and 118 MB, 800 4.79 s and
/// 180 MB, 1200 16.1 s and 393 MB. The time goes as about n³ (the factorisation), so 2 s is
/// passed between 560 and 640.
pub const UNKNOWNS_LIMIT: usize = 560;

/// What a field solution of a cut wire would hold and do.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Cost {
    /// Unknowns: one triangle basis a node.
    pub unknowns: usize,
    /// Series terms of the frequency-independent integrals.
    pub powers: usize,
}

impl Cost {
    /// The cost of `structure` with `powers` series terms.
    pub fn of(structure: &Structure, powers: usize) -> Self {
        Self {
            unknowns: structure.bases.len(),
            powers,
        }
    }

    /// Bytes held at once: 2·P real n×n matrices, the Gram matrix, and the complex matrix
    /// assembled and factored for one frequency (with its copy of the right-hand side).
    pub fn bytes(&self) -> f64 {
        let n = self.unknowns as f64;
        let reals = (2 * self.powers + 1) as f64;
        (reals * 8.0 + 16.0) * n * n + 64.0 * n
    }
}

/// Frequencies × n³ a sweep may solve on top of its model's fixed part (the integrals and the
/// self-resonance search, bounded by [`check`]). Measured with `tankwright impedance` in
/// release on the project machine while other builds ran (4 December 2026; a 10 mm former,
/// 0.8 mm wire at 2 mm a turn): going from 2 to 40 points added 0.07 s at 160 unknowns,
/// 0.41 s at 320, 1.10 s at 455 and 2.01 s at 480 (60 turns, 3.3 s in all): about 5e-10 s
/// × n³ a frequency. Twenty frequencies at 480 unknowns (about 1 s) keeps a whole sweep of
/// the largest coil accepted near the 2 s of [`TIME_LIMIT_SECONDS`].
pub const SWEEP_WORK_LIMIT: f64 = 20.0 * 480.0 * 480.0 * 480.0;

/// Most frequencies a sweep of a model with `unknowns` unknowns may solve within
/// [`SWEEP_WORK_LIMIT`] (never below 2).
pub fn most_sweep_points(unknowns: usize) -> usize {
    let n = unknowns.max(1) as f64;
    ((SWEEP_WORK_LIMIT / (n * n * n)).floor() as usize).max(2)
}

/// Unknowns kept for the leads and the closing path when the helix's share is worked out
/// (graded, about 20 a straight part; see [`super::geometry::Structure::build`]).
pub const STRAIGHT_RESERVE: usize = 80;

/// Refuse a wire the solution could not finish within the bounds, with the reason (the
/// unknowns, the memory and the limits), before anything is integrated.
pub fn check(cost: &Cost) -> Result<(), FieldError> {
    let bytes = cost.bytes();
    if cost.unknowns > UNKNOWNS_LIMIT || bytes > MEMORY_LIMIT_BYTES {
        return Err(FieldError::TooCostly(format!(
            "{} unknowns and {:.0} MB would take more than the {} s and {:.0} MB a solution \
             may use (at most {} unknowns: about {} turns at the fewest segments a turn)",
            cost.unknowns,
            bytes * 1e-6,
            TIME_LIMIT_SECONDS,
            MEMORY_LIMIT_BYTES * 1e-6,
            UNKNOWNS_LIMIT,
            (UNKNOWNS_LIMIT - STRAIGHT_RESERVE) / 8
        )));
    }
    Ok(())
}

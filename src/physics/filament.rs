//! Inductance as a sum over filamentary rings: each turn's self-inductance plus Maxwell's
//! mutual inductance for every pair of turns.
//!
//! This is an independent route to the round-wire inductance (it treats each turn as a closed
//! circular ring of round wire, ignoring the helix's pitch angle), used to cross-check Rosa.

use super::constants::MU_0;
use super::elliptic::complete_k_e;

/// Self-inductance of one circular ring of round wire, henries.
///
/// # Formula
/// L = µ0·a·(ln(8a/r) − 2 + χ/4), with a the ring's mean radius, r the wire radius and χ the
/// internal-inductance fraction (1 for uniform current: Kirchhoff's ln(8a/r) − 7/4, Grover 1946
/// p. 143; 0 for surface current at high frequency). Valid for r ≪ a.
pub fn ring_self_inductance(
    radius: f64,
    wire_radius: f64,
    internal_inductance_fraction: f64,
) -> f64 {
    MU_0 * radius * ((8.0 * radius / wire_radius).ln() - 2.0 + 0.25 * internal_inductance_fraction)
}

/// Mutual inductance of two coaxial circles, henries (Maxwell).
///
/// # Formula
/// Radii a and A, axial separation s: k² = 4aA/((a+A)² + s²),
/// M = µ0·√(aA)·[(2/k − k)·K(k) − (2/k)·E(k)]
/// (J. C. Maxwell, *A Treatise on Electricity and Magnetism*, 1873, §701; Grover 1946 eq. 77),
/// evaluated with parameter m = k².
pub fn coaxial_mutual_inductance(radius_a: f64, radius_b: f64, separation: f64) -> f64 {
    let sum = radius_a + radius_b;
    let m = 4.0 * radius_a * radius_b / (sum * sum + separation * separation);
    let k = m.sqrt();
    let (big_k, big_e) = complete_k_e(m);
    MU_0 * (radius_a * radius_b).sqrt() * ((2.0 / k - k) * big_k - 2.0 / k * big_e)
}

/// Inductance of `rings` equal coaxial rings of round wire at a fixed pitch, henries.
///
/// # Formula
/// L = n·L_ring + 2·Σ_{s=1}^{n−1} (n − s)·M(s·p): equal spacing makes every pair s pitches
/// apart alike, so the double sum over pairs needs only n − 1 mutual inductances.
pub fn ring_stack_inductance(
    rings: u32,
    radius: f64,
    pitch: f64,
    wire_radius: f64,
    internal_inductance_fraction: f64,
) -> f64 {
    let n = f64::from(rings);
    let mut total = n * ring_self_inductance(radius, wire_radius, internal_inductance_fraction);
    for s in 1..rings {
        let sf = f64::from(s);
        total += 2.0 * (n - sf) * coaxial_mutual_inductance(radius, radius, sf * pitch);
    }
    total
}

/// Filament-sum inductance for a possibly fractional number of turns, henries.
///
/// Whole turns are summed directly; for a fractional count the result is interpolated
/// linearly in N between the whole counts either side at the same pitch (a coil's inductance
/// is smooth in N; the interpolation error is below the method's own 0.02–0.5 %).
pub fn filament_sum(
    turns: f64,
    radius: f64,
    pitch: f64,
    wire_radius: f64,
    internal_inductance_fraction: f64,
) -> f64 {
    let n = turns.max(1.0);
    let lower = n.floor();
    let frac = n - lower;
    // Turns are validated to a few hundred at most, so the casts are exact.
    let lo = ring_stack_inductance(
        lower as u32,
        radius,
        pitch,
        wire_radius,
        internal_inductance_fraction,
    );
    if frac < 1e-12 {
        return lo;
    }
    let hi = ring_stack_inductance(
        lower as u32 + 1,
        radius,
        pitch,
        wire_radius,
        internal_inductance_fraction,
    );
    lo + frac * (hi - lo)
}

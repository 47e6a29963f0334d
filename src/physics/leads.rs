//! The two straight leads between the coil and the rest of the tank.

use super::constants::MU_0;
use std::f64::consts::PI;

/// Self-inductance of a straight round wire, henries.
///
/// # Formula
/// L = (µ0·ℓ/2π)·(ln(2ℓ/r) − 1 + χ/4), for length ℓ ≫ radius r, with χ the internal-inductance
/// fraction (Rosa 1908, Bull. Bureau of Standards 4, 301; Grover 1946 eq. 7: χ = 1 gives the
/// familiar ln(2ℓ/r) − 3/4). Zero for zero length. Below ℓ ≈ 1.4·r the external part
/// ln(2ℓ/r) − 1 of the long-wire formula turns negative; it is then taken as zero, while the
/// internal part χ/4 is kept, so the result stays linear in χ.
pub fn straight_wire_inductance(
    length: f64,
    wire_radius: f64,
    internal_inductance_fraction: f64,
) -> f64 {
    if length <= 0.0 {
        return 0.0;
    }
    let external = ((2.0 * length / wire_radius).ln() - 1.0).max(0.0);
    length * (MU_0 / (2.0 * PI)) * (external + 0.25 * internal_inductance_fraction)
}

/// Straight-wire inductance with surface current (χ = 0) and with uniform current (χ = 1),
/// henries: the inductance at any χ is the linear blend of the two (one logarithm for both).
pub fn straight_wire_inductance_limits(length: f64, wire_radius: f64) -> [f64; 2] {
    if length <= 0.0 {
        return [0.0, 0.0];
    }
    let scale = length * (MU_0 / (2.0 * PI));
    let external = ((2.0 * length / wire_radius).ln() - 1.0).max(0.0);
    [scale * external, scale * (external + 0.25)]
}

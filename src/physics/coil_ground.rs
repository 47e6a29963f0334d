//! A coil standing over a ground plane: its capacitance to the plane, and how much of that
//! appears across the tank when the voltage along the coil is not uniform.

use super::wire_capacitance::wire_over_plane_per_length;

/// Capacitance of a single-layer coil lying with its axis parallel to a ground plane at
/// `axis_height` (axis to plane), farads.
///
/// # Formula
/// The winding is taken as a conducting cylinder of its mean diameter D and length l, so
/// C = l·2π·ε₀/acosh(h/(D/2)) (the wire-over-plane solution of
/// [`wire_over_plane_per_length`] with the coil's outline as the wire). The open pitch and the
/// ends are neglected: the first lowers, the second raises the figure, each by a few tens of
/// per cent for short open coils (an estimate, shown with a range by the callers). Requires
/// h > D/2.
pub fn coil_to_plane(mean_diameter: f64, length: f64, axis_height: f64) -> f64 {
    length * wire_over_plane_per_length(axis_height, 0.5 * mean_diameter, 1.0)
}

/// Fraction of a capacitance spread evenly along the coil that appears across the tank when
/// the voltage to the plane varies linearly from `start`·V at one end to `end`·V at the other
/// (V the tank voltage).
///
/// # Formula
/// The equivalent lumped capacitance C_eq across the tank stores the same energy as the
/// distributed one: ½·C_eq·V² = ½∫₀ˡ (C/l)·v(x)² dx with v(x) = V·(a + (b − a)·x/l), so
/// C_eq/C = ∫₀¹ (a + (b − a)·u)² du = (a² + a·b + b²)/3.
/// With one end at RF ground (a = 0, b = 1) this is **one third** ([`GROUNDED_END_FRACTION`]);
/// a coil whose whole length swings with the hot end (a = b = 1) gives 1.
pub fn linear_gradient_fraction(start: f64, end: f64) -> f64 {
    (start * start + start * end + end * end) / 3.0
}

/// The share of the coil-to-ground capacitance across the tank for a uniform voltage gradient
/// with one end at RF ground: 1/3 (see [`linear_gradient_fraction`]).
pub const GROUNDED_END_FRACTION: f64 = 1.0 / 3.0;

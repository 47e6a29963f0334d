//! Capacitance of straight round wires: one over a ground plane, and two side by side.
//!
//! Both are the exact two-dimensional solutions (long wires, end effects neglected), from the
//! method of images: a line charge and its image give circular equipotentials, so a round
//! wire over a plane is solved exactly by an off-centre line charge (S. Ramo, J. R. Whinnery,
//! T. Van Duzer, *Fields and Waves in Communication Electronics*, 3rd ed. 1994, §1.20 and
//! Table 5.11, "parallel-wire" and "wire above ground plane" lines).

use super::constants::EPSILON_0;
use std::f64::consts::PI;

/// Capacitance per metre of a round wire of radius `radius` whose centre is at `height` above
/// an infinite conducting plane, in a medium of relative permittivity `relative_permittivity`.
///
/// # Formula
/// C/ℓ = 2π·ε₀·ε_r / acosh(h/r)   (image method; Ramo, Whinnery, Van Duzer 1994, Table 5.11).
/// For h ≫ r, acosh(h/r) → ln(2h/r), the thin-wire form. Requires h > r (the wire clear of the
/// plane); returns +∞ at h = r and NaN below.
pub fn wire_over_plane_per_length(height: f64, radius: f64, relative_permittivity: f64) -> f64 {
    2.0 * PI * EPSILON_0 * relative_permittivity / (height / radius).acosh()
}

/// Capacitance per metre between two parallel round wires of diameter `diameter`, centres
/// `spacing` apart, in a medium of relative permittivity `relative_permittivity`.
///
/// # Formula
/// C/ℓ = π·ε₀·ε_r / acosh(s/d)   (Ramo, Whinnery, Van Duzer 1994, Table 5.11, parallel-wire
/// line; the air line's impedance is then Z₀ = (η₀/π)·acosh(s/d) ≈ 119.9·acosh(s/d) Ω). It is half of
/// [`wire_over_plane_per_length`] with h = s/2, r = d/2: the plane midway between the wires is
/// an equipotential, and the two halves are in series. For s ≫ d, acosh(s/d) → ln(2s/d).
/// Requires s > d (wires not touching).
pub fn parallel_wires_per_length(spacing: f64, diameter: f64, relative_permittivity: f64) -> f64 {
    PI * EPSILON_0 * relative_permittivity / (spacing / diameter).acosh()
}

//! Parallel-plate capacitance, with the fringing field estimated by Palmer's formula.

use super::constants::EPSILON_0;
use std::f64::consts::PI;

/// Capacitance of two parallel plates of `area` a distance `gap` apart filled with a
/// dielectric of relative permittivity `relative_permittivity`, fringing neglected, farads.
///
/// # Formula
/// C = ε₀·ε_r·A/d (uniform field between the plates).
pub fn parallel_plate(area: f64, gap: f64, relative_permittivity: f64) -> f64 {
    EPSILON_0 * relative_permittivity * area / gap
}

/// Factor by which fringing raises the parallel-plate capacitance of a rectangular plate
/// `width` × `length` at `gap` (≥ 1).
///
/// # Formula
/// H. B. Palmer, "The capacitance of a parallel-plate capacitor by the Schwartz–Christoffel
/// transformation", Trans. AIEE 56 (1937) 363–366: for each side w,
/// F(w) = 1 + (d/(π·w))·(1 + ln(2π·w/d)), and the rectangle's factor is F(width)·F(length).
/// Palmer's case is two equal plates in one uniform medium; a pad over a ground plane through
/// a board has part of its fringe field in air (lower permittivity), so this factor is the
/// upper end of the pad's fringing and 1 the lower end. Valid for w ≳ d.
pub fn palmer_fringing_factor(width: f64, length: f64, gap: f64) -> f64 {
    let side = |w: f64| 1.0 + gap / (PI * w) * (1.0 + (2.0 * PI * w / gap).ln());
    side(width) * side(length)
}

//! Complete elliptic integrals of the first and second kind.
//!
//! **Convention: the parameter `m = k²`**, as in DLMF §19.2 written K(k) with k² = m and as in
//! Abramowitz & Stegun 17.3. Callers holding the modulus k must square it first.

use std::f64::consts::FRAC_PI_2;

/// Complete elliptic integrals K(m) and E(m) together, for 0 ≤ m < 1.
///
/// # Formula
/// Arithmetic-geometric mean (DLMF 19.8.1 and 19.8.6): with a₀ = 1, b₀ = √(1−m), c₀ = √m,
/// K = π/(2·AGM) and E = K·(1 − Σ 2ⁿ⁻¹ cₙ²), through [`agm_with_sum`].
///
/// Returns `(f64::INFINITY, 1.0)` at m = 1 and NaN outside [0, 1]; callers validate first.
pub fn complete_k_e(m: f64) -> (f64, f64) {
    if !(0.0..=1.0).contains(&m) {
        return (f64::NAN, f64::NAN);
    }
    if m == 1.0 {
        return (f64::INFINITY, 1.0);
    }
    let (mean, sum) = agm_with_sum(1.0, (1.0 - m).sqrt(), m);
    let k = FRAC_PI_2 / mean;
    (k, k * (1.0 - sum))
}

/// The arithmetic-geometric mean M of a₀ ≥ b₀ > 0 and the sum S = Σₙ 2ⁿ⁻¹ cₙ² that gives E.
///
/// # Formula
/// aₙ₊₁ = (aₙ+bₙ)/2, bₙ₊₁ = √(aₙbₙ), cₙ₊₁ = (aₙ−bₙ)/2, with c₀² = a₀² − b₀² passed in
/// (`c0_squared`) so that the caller can supply it without cancellation (DLMF 19.8.1, 19.8.6).
/// Both are homogeneous: for a₀ = h, b₀ = h·k′ the parameter is m = c₀²/h² and
/// K(m) = π·h/(2M), E(m) = K(m)·(1 − S/h²). Converges quadratically: four or five rounds give
/// double precision for m ≤ 0.999999.
pub fn agm_with_sum(a0: f64, b0: f64, c0_squared: f64) -> (f64, f64) {
    let mut a = a0;
    let mut b = b0;
    let mut sum = 0.5 * c0_squared; // 2⁻¹ c₀²
    let mut weight = 0.5_f64;
    for _ in 0..12 {
        let c = 0.5 * (a - b);
        weight *= 2.0;
        sum += weight * c * c;
        let next_a = 0.5 * (a + b);
        b = (a * b).sqrt();
        a = next_a;
        // The next c is about c²/(4a): below 1e-9·a here it is below 1e-18·a, so `a` already
        // equals the mean to double precision and the sum has all its terms.
        if c <= 1e-9 * a {
            break;
        }
    }
    (a, sum)
}

/// Complete elliptic integral of the first kind K(m), parameter m = k².
pub fn complete_k(m: f64) -> f64 {
    complete_k_e(m).0
}

/// Complete elliptic integral of the second kind E(m), parameter m = k².
pub fn complete_e(m: f64) -> f64 {
    complete_k_e(m).1
}

//! Capacitance between two side-by-side copper strips on a board (stripboard tracks).

use super::constants::EPSILON_0;
use super::elliptic::complete_k;

/// Capacitance per metre between two coplanar strips of width `width` separated by `gap`
/// (edge to edge) on a board of relative permittivity `relative_permittivity`, thin copper.
///
/// # Formula
/// Coplanar strips by conformal mapping (K. C. Gupta, R. Garg, I. Bahl, P. Bhartia,
/// *Microstrip Lines and Slotlines*, 2nd ed. 1996, ch. 7, coplanar strips; after C. P. Wen
/// 1969): with k = s/(s + 2w) and k′ = √(1 − k²),
/// C/ℓ = ε₀·ε_eff·K(k′)/K(k), ε_eff = (ε_r + 1)/2
/// (half the field in the board, half in air: the thick-board limit; a thinner board lowers
/// ε_eff a little). K takes the parameter m = k² (see [`complete_k`]).
pub fn coplanar_strips_per_length(width: f64, gap: f64, relative_permittivity: f64) -> f64 {
    let k = gap / (gap + 2.0 * width);
    let k2 = k * k;
    let eps_eff = 0.5 * (relative_permittivity + 1.0);
    EPSILON_0 * eps_eff * complete_k(1.0 - k2) / complete_k(k2)
}

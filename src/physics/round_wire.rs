//! Rosa's correction from the current sheet to a coil of round wire.
//!
//! E. B. Rosa, "The self and mutual inductances of linear conductors", Bull. Bureau of
//! Standards 4 (1908) 301, and "On the geometrical mean distances of rectangular areas and the
//! calculation of self-inductance", Bull. Bureau of Standards 3 (1907) 1; as set out in
//! F. W. Grover, *Inductance Calculations* (1946), pp. 148–150:
//! L = L_sheet − µ0·a·N·(k_s + k_m), with a the mean radius.

use super::constants::MU_0;

/// Self-inductance term k_s of Rosa's correction, with the wire's internal inductance.
///
/// # Formula
/// k_s = 3/2 − ln(2p/d) − χ/4, where χ is the wire's internal inductance as a fraction of its
/// uniform-current value (see [`super::copper::internal_impedance`]). With χ = 1 this is Rosa's
/// k_s = 5/4 − ln(2p/d) (Grover 1946, p. 149); with χ → 0 (skin depth ≪ radius, as at VHF)
/// the internal flux vanishes and k_s = 3/2 − ln(2p/d). The transition follows the same Bessel
/// impedance that gives the AC resistance, so there is no switch at a chosen frequency.
pub fn k_s(pitch: f64, wire_diameter: f64, internal_inductance_fraction: f64) -> f64 {
    1.5 - (2.0 * pitch / wire_diameter).ln() - 0.25 * internal_inductance_fraction
}

/// Mutual-inductance term k_m of Rosa's correction for `turns` turns, closed form.
///
/// # Formula
/// Asymptotic expansion of the exact sum [`k_m_exact`] in 1/N (coefficients from memory,
/// checked against the exact sum to about 1e-8 for N ≥ 1 in the project's tests):
/// k_m ≈ ln(2π) − 3/2 − ln N/(6N) − 0.33084236/N − 1/(120N³) + 1/(504N⁵) − 0.0011923/N⁷
/// + 0.0005068/N⁹.
///
/// It is smooth in N, so fractional turns are handled. The limit N → ∞ is
/// ln(2π) − 3/2 = 0.33788 (Grover 1946, p. 150).
pub fn k_m(turns: f64) -> f64 {
    let n = turns.max(1.0);
    let inv = 1.0 / n;
    let inv2 = inv * inv;
    let inv3 = inv2 * inv;
    let inv5 = inv3 * inv2;
    let inv7 = inv5 * inv2;
    let inv9 = inv7 * inv2;
    (2.0 * std::f64::consts::PI).ln()
        - 1.5
        - n.ln() * inv * (1.0 / 6.0)
        - 0.330_842_36 * inv
        - inv3 * (1.0 / 120.0)
        + inv5 * (1.0 / 504.0)
        - 0.001_192_3 * inv7
        + 0.000_506_8 * inv9
}

/// Mutual-inductance term k_m for a whole number of turns, by geometric mean distances.
///
/// # Formula
/// k_m(N) = (2/N)·Σ_{s=1}^{N−1} (N−s)·[ln s − ln(R_s/p)], with the geometric mean distance of
/// two strips s pitches apart given by
/// ln(R_s/p) = ½[(s+1)² ln(s+1) + (s−1)² ln(s−1)] − s² ln s − 3/2
/// (Rosa 1907; Grover 1946, p. 150, whose table this reproduces).
pub fn k_m_exact(turns: u32) -> f64 {
    let n = f64::from(turns);
    let xlnx = |x: f64| if x > 0.0 { x * x * x.ln() } else { 0.0 };
    let mut sum = 0.0;
    for s in 1..turns {
        let s = f64::from(s);
        let ln_gmd = 0.5 * (xlnx(s + 1.0) + xlnx(s - 1.0)) - xlnx(s) - 1.5;
        sum += (n - s) * (s.ln() - ln_gmd);
    }
    2.0 * sum / n
}

/// Rosa's correction µ0·a·N·(k_s + k_m), henries, to subtract from the current sheet.
pub fn correction(mean_diameter: f64, turns: f64, k_s: f64, k_m: f64) -> f64 {
    MU_0 * 0.5 * mean_diameter * turns * (k_s + k_m)
}

//! Self-resonance of a single-layer coil.

use super::constants::SPEED_OF_LIGHT;
use std::f64::consts::PI;

/// Lumped self-resonance 1/(2π√(L·C_self)), hertz.
///
/// Crude for single-layer coils (self-resonance is a wave effect along the helix), but the
/// usual first estimate.
pub fn lumped_self_resonance(inductance: f64, self_capacitance: f64) -> f64 {
    1.0 / (2.0 * PI * (inductance * self_capacitance).sqrt())
}

/// Axial velocity factor of a helix (wave speed along the axis over c).
///
/// # Formula
/// VF = 1/√(1 + 20·(D/p)^2.5·(D/λ0)^0.5), with D the helix diameter, p the pitch and λ0 the
/// free-space wavelength (A. G. Kandoian and W. Sichak, "Wide-frequency-range tuned helical
/// antennas and circuits", Electrical Communication 30, 1953), an empirical fit for long
/// helices.
pub fn axial_velocity_factor(mean_diameter: f64, pitch: f64, frequency: f64) -> f64 {
    let lambda0 = SPEED_OF_LIGHT / frequency;
    let shape = (mean_diameter / pitch).powf(2.5);
    1.0 / (1.0 + 20.0 * shape * (mean_diameter / lambda0).sqrt()).sqrt()
}

/// Helical-line self-resonance, hertz: the frequency where the coil's axial length is half a
/// wavelength of the wave travelling along the helix (two-terminal, both ends open), with the
/// Kandoian–Sichak velocity factor.
///
/// # Formula
/// f = VF(f)·c/(2·l). With H = c/(2l), s = 20·(D/p)^2.5·√(D/c) and u = √f this is
/// g(u) = s·u⁵ + u⁴ − H² = 0, which has one positive root, below both (H²/s)^(1/5) and √H.
/// It is found by Halley's method (cubic convergence), started from the smaller bound with the
/// fifth root approximated by dividing the exponent of H²/s by five (the initial-guess device of
/// W. Kahan's cube root in fdlibm's `cbrt`, within about 8 %). It stops after a step below
/// 1e-5·u: with cubic convergence the error left is then of order (1e-5)³ relative, and the
/// tests check the result against bisection to 1e-12.
pub fn helical_self_resonance(mean_diameter: f64, pitch: f64, length: f64) -> f64 {
    let ratio = mean_diameter / pitch;
    // (D/p)^2.5·√(D/c) = (D/p)²·√((D/p)·(D/c)).
    let s = 20.0 * ratio * ratio * (ratio * mean_diameter * (1.0 / SPEED_OF_LIGHT)).sqrt();
    let h = 0.5 * SPEED_OF_LIGHT / length;
    let h2 = h * h;
    let mut u = approximate_fifth_root(h2 / s).min(h.sqrt());
    for _ in 0..30 {
        let u2 = u * u;
        let u3 = u2 * u;
        let g = (s * u + 1.0) * u3 * u - h2;
        let dg = (5.0 * s * u + 4.0) * u3;
        let ddg = (20.0 * s * u + 12.0) * u2;
        // Halley: u ← u − 2g·g′/(2g′² − g·g″).
        let step = 2.0 * g * dg / (2.0 * dg * dg - g * ddg);
        u -= step;
        if step.abs() <= 1e-5 * u {
            break;
        }
    }
    u * u
}

/// x^(1/5) to within about 8 % for positive normal x, from the bit pattern alone: the IEEE 754
/// exponent field, read as an integer together with the mantissa, is close to 2⁵²·(log₂x + 1023),
/// so dividing the offset from the bias by five takes the fifth root of the leading power of two.
fn approximate_fifth_root(x: f64) -> f64 {
    const BIAS: u64 = 1023 << 52;
    let bits = x.to_bits();
    if !(x.is_normal() && x > 0.0) {
        return x;
    }
    let shifted = if bits >= BIAS {
        BIAS + (bits - BIAS) / 5
    } else {
        BIAS - (BIAS - bits) / 5
    };
    f64::from_bits(shifted)
}

#[cfg(test)]
mod tests {
    use super::{SPEED_OF_LIGHT, approximate_fifth_root, helical_self_resonance};

    #[test]
    fn fifth_root_guess_is_within_eight_per_cent() {
        let mut x = 1e-300_f64;
        while x < 1e300 {
            let exact = x.powf(0.2);
            let err = (approximate_fifth_root(x) / exact - 1.0).abs();
            assert!(err < 0.08, "x {x:e}: guess off by {err}");
            x *= 1.37;
        }
    }

    /// The root of s·u⁵ + u⁴ = H² by bisection, for comparison.
    fn bisected(d: f64, p: f64, l: f64) -> f64 {
        let s = 20.0 * (d / p).powf(2.5) * (d / SPEED_OF_LIGHT).sqrt();
        let h2 = (0.5 * SPEED_OF_LIGHT / l).powi(2);
        let (mut lo, mut hi) = (0.0_f64, (0.5 * SPEED_OF_LIGHT / l).sqrt());
        for _ in 0..200 {
            let mid = 0.5 * (lo + hi);
            if s * mid.powi(5) + mid.powi(4) > h2 {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        lo * lo
    }

    #[test]
    fn halley_matches_bisection() {
        for d in [2e-3, 5e-3, 10e-3, 30e-3, 100e-3] {
            for p_over_d in [0.01, 0.05, 0.2, 1.0, 5.0] {
                for turns in [1.0, 3.0, 10.0, 100.0] {
                    let p = p_over_d * d;
                    let l = p * turns;
                    let fast = helical_self_resonance(d, p, l);
                    let slow = bisected(d, p, l);
                    assert!(
                        (fast / slow - 1.0).abs() < 1e-12,
                        "D {d} p {p} N {turns}: {fast} vs {slow}"
                    );
                }
            }
        }
    }
}

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
/// s·u⁵ + u⁴ − H² = 0, solved by Newton's method. For coils, s·u ≫ 1, so the start
/// u₀ = (H²/s)^(1/5)·(1 − 1/(5·s·u₁)) with u₁ = (H²/s)^(1/5) is already within about
/// (s·u)⁻² of the root; Newton's quadratic convergence then needs one or two steps.
pub fn helical_self_resonance(mean_diameter: f64, pitch: f64, length: f64) -> f64 {
    let ratio = mean_diameter / pitch;
    let s = 20.0 * ratio * ratio * ratio.sqrt() * (mean_diameter * (1.0 / SPEED_OF_LIGHT)).sqrt();
    let h = 0.5 * SPEED_OF_LIGHT / length;
    let h2 = h * h;
    let leading = (h2 / s).powf(0.2);
    // Both (H²/s)^(1/5) and √H bound the root from above; the first-order correction for the
    // u⁴ term brings the start within (s·u)⁻² of it.
    let mut u = (leading * (1.0 - 0.2 / (s * leading))).min(h.sqrt());
    for _ in 0..30 {
        let u3 = u * u * u;
        let g = s * u3 * u * u + u3 * u - h2;
        let dg = 5.0 * s * u3 * u + 4.0 * u3;
        let step = g / dg;
        u -= step;
        // Quadratic convergence: after a step of 1e-6 the error left is about 1e-12.
        if step.abs() <= 1e-6 * u {
            break;
        }
    }
    u * u
}

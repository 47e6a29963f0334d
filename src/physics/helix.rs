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
/// f = VF(f)·c/(2·l), solved by relaxed fixed-point iteration: VF varies as f^(−1/4) at most,
/// so the plain map has slope near −1/4 and the step f ← f + 0.8·(g(f) − f) cancels it.
pub fn helical_self_resonance(mean_diameter: f64, pitch: f64, length: f64) -> f64 {
    let shape = 20.0 * (mean_diameter / pitch).powf(2.5) * (mean_diameter / SPEED_OF_LIGHT).sqrt();
    let half_wave = SPEED_OF_LIGHT / (2.0 * length);
    let mut f = half_wave;
    for _ in 0..40 {
        let vf = 1.0 / (1.0 + shape * f.sqrt()).sqrt();
        let next = half_wave * vf;
        if (next - f).abs() <= 1e-10 * next {
            return next;
        }
        f += 0.8 * (next - f);
    }
    f
}

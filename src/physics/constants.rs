//! Physical constants (SI).

/// Vacuum permeability µ0 in H/m, the classical defined value 4π·10⁻⁷.
///
/// The 2019 SI makes µ0 a measured quantity, but it differs from 4π·10⁻⁷ by about 1e-10,
/// far below anything a hand-wound coil can show.
pub const MU_0: f64 = 4.0e-7 * std::f64::consts::PI;

/// Speed of light in vacuum, m/s (exact, SI).
pub const SPEED_OF_LIGHT: f64 = 299_792_458.0;

/// Vacuum permittivity ε0 = 1/(µ0 c²) in F/m.
pub const EPSILON_0: f64 = 1.0 / (MU_0 * SPEED_OF_LIGHT * SPEED_OF_LIGHT);

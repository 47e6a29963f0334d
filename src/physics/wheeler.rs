//! Wheeler's 1928 formula for a single-layer solenoid.

/// Shortest coil, as a fraction of the mean radius, for which Wheeler claimed about 1 %.
///
/// H. A. Wheeler, "Simple inductance formulas for radio coils", Proc. IRE 16 (1928) 1398:
/// valid for l > 0.8·a (from memory of the paper's wording; the project's reference tests
/// measure the actual error against the exact current sheet).
pub const MIN_LENGTH_OVER_RADIUS: f64 = 0.8;

/// Inductance by Wheeler 1928, henries.
///
/// # Formula
/// L\[µH\] = a²N²/(9a + 10l), with the mean radius a and the length l in inches
/// (Wheeler 1928, Proc. IRE 16, 1398). Here converted to SI: metres in, henries out.
pub fn inductance(mean_diameter: f64, length: f64, turns: f64) -> f64 {
    const INCHES_PER_METRE: f64 = 1.0 / 0.0254;
    let a = 0.5 * mean_diameter * INCHES_PER_METRE;
    let l = length * INCHES_PER_METRE;
    a * a * turns * turns / (9.0 * a + 10.0 * l) * 1e-6
}

/// Whether the shape is inside Wheeler's stated range (l > 0.8·a).
pub fn in_range(mean_diameter: f64, length: f64) -> bool {
    length > MIN_LENGTH_OVER_RADIUS * 0.5 * mean_diameter
}

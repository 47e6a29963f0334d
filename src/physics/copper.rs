//! Copper: resistivity with temperature, skin depth, and the internal impedance of round wire.

use super::constants::MU_0;
use std::f64::consts::PI;

/// Resistivity of annealed copper at 20 °C, Ω·m: 1/58 Ω·mm²/m
/// (International Annealed Copper Standard, IEC 60028).
pub const RESISTIVITY_20C: f64 = 1.0 / 58.0 * 1e-6;

/// Temperature coefficient of resistance of annealed copper at 20 °C, per kelvin
/// (IEC 60028: 0.00393 /K).
pub const TEMPERATURE_COEFFICIENT: f64 = 0.00393;

/// Linear thermal expansion coefficient of copper near 20 °C, per kelvin: 16.5·10⁻⁶ /K
/// (CRC Handbook of Chemistry and Physics, "Thermal expansion of metals and alloys";
/// value from memory). A coil's dimensions all grow by this fraction per kelvin.
pub const LINEAR_EXPANSION: f64 = 16.5e-6;

/// Resistivity of annealed copper at `temperature_c` (°C), Ω·m.
///
/// # Formula
/// ρ(T) = ρ20·(1 + α20·(T − 20 °C)), the linear law of IEC 60028, good to a few per cent
/// between −50 °C and 150 °C.
pub fn resistivity(temperature_c: f64) -> f64 {
    RESISTIVITY_20C * (1.0 + TEMPERATURE_COEFFICIENT * (temperature_c - 20.0))
}

/// Skin depth δ = √(ρ/(π f µ0)) in metres, for a non-magnetic conductor.
pub fn skin_depth(resistivity: f64, frequency: f64) -> f64 {
    (resistivity / (PI * frequency * MU_0)).sqrt()
}

/// Internal impedance of an isolated straight round wire relative to its DC resistance.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct InternalImpedance {
    /// R_ac / R_dc, ≥ 1.
    pub resistance_ratio: f64,
    /// Internal inductance relative to its low-frequency value µ0/(8π) per metre, in (0, 1].
    pub internal_inductance_fraction: f64,
}

/// Below this r/δ the Bessel series is used, above it the asymptotic expansion.
const SERIES_LIMIT: f64 = 10.0;

/// Internal impedance of round wire for `radius_over_skin_depth` = r/δ (q ≥ 0).
///
/// # Formula
/// Z/R_dc = (kr/2)·J0(kr)/J1(kr) with k = (1 − j)/δ (S. Ramo, J. Whinnery, T. Van Duzer,
/// *Fields and Waves in Communication Electronics*, §5.12; also W. C. Johnson 1963).
/// R_ac/R_dc is its real part; the internal inductance is its imaginary part over ω, and
/// since ω·(µ0/8π)/R_dc = q²/4 the fraction is Im(Z/R_dc)/(q²/4).
/// For q ≤ 10 the power series of J0 and J1 is summed; above, the asymptotic expansion in
/// v = 1/q (see `asymptotic_impedance`) is used, which meets the series at q = 10 to
/// about 1e-8.
pub fn internal_impedance(radius_over_skin_depth: f64) -> InternalImpedance {
    let q = radius_over_skin_depth.max(0.0);
    if q <= SERIES_LIMIT {
        series_impedance(q)
    } else {
        asymptotic_impedance(q, 1.0 / q)
    }
}

/// [`internal_impedance`] taking the reciprocal, δ/r, for solvers that get δ/r without a
/// division: above r/δ = 10 the internal inductance fraction is then a polynomial in δ/r and
/// only the resistance ratio needs r/δ itself.
pub fn internal_impedance_at_depth_ratio(skin_depth_over_radius: f64) -> InternalImpedance {
    let v = skin_depth_over_radius;
    if v.is_nan() || v * SERIES_LIMIT >= 1.0 {
        series_impedance((1.0 / v).max(0.0))
    } else {
        asymptotic_impedance(1.0 / v.max(0.0), v.max(0.0))
    }
}

/// The internal inductance fraction alone at δ/r (see [`internal_impedance_at_depth_ratio`]):
/// above r/δ = 10 a polynomial in δ/r, with no division.
pub fn internal_inductance_fraction_at_depth_ratio(skin_depth_over_radius: f64) -> f64 {
    let v = skin_depth_over_radius;
    if v.is_nan() || v * SERIES_LIMIT >= 1.0 {
        internal_impedance_at_depth_ratio(v).internal_inductance_fraction
    } else {
        asymptotic_fraction(v.max(0.0))
    }
}

/// The asymptotic internal inductance fraction at v = δ/r (see `asymptotic_impedance`),
/// clamped to [0, 1]: a polynomial in v, with no division and no branch, for batch paths.
/// Valid for v = δ/r below 0.1 (r/δ above 10); callers check the range.
pub fn asymptotic_fraction(v: f64) -> f64 {
    let v2 = v * v;
    let v4 = v2 * v2;
    let fraction = v * 2.0 - v2 * v * (0.375 + v * (0.375 + v * (63.0 / 256.0)))
        + v4 * v2 * v * (1899.0 / 4096.0 + v * (81.0 / 64.0 + v * (543_483.0 / 262_144.0)));
    fraction.clamp(0.0, 1.0)
}

/// Power-series branch of [`internal_impedance`], for q ≤ 10.
fn series_impedance(q: f64) -> InternalImpedance {
    let (re, im) = bessel_ratio(q);
    let fraction = if q < 1e-3 { 1.0 } else { im / (0.25 * q * q) };
    InternalImpedance {
        resistance_ratio: re.max(1.0),
        internal_inductance_fraction: fraction.clamp(0.0, 1.0),
    }
}

/// Asymptotic branch of [`internal_impedance`] for q = r/δ > 10, given q and v = 1/q.
///
/// # Formula
/// For large |z| with Im z < 0, J_n(z) is dominated by the Hankel function H_n⁽¹⁾(z), and the
/// ratio y = H₁⁽¹⁾/H₀⁽¹⁾ satisfies y′ = 1 − y/z + y² (from DLMF 10.6.2–10.6.3). Its series
/// y = −i + 1/(2z) − i/(8z²) − 1/(8z³) + … put into (z/2)·J0/J1 ≈ z/(2y) at z = (1 − j)q gives
/// R_ac/R_dc = q/2 + 1/4 + 3v/32 − 63v³/1024 − 27v⁴/256 − 1899v⁵/16384 + 543483v⁷/1048576,
/// χ = Im(Z/R_dc)/(q²/4) = 2v − 3v³/8 − 3v⁴/8 − 63v⁵/256 + 1899v⁷/4096 + 81v⁸/64
///     + 543483v⁹/262144.
/// The first three terms are the classical (1+j)q/2 + 1/4 + (1−j)·3/(32q). The coefficients
/// were derived for this project (series solution of the Riccati equation, by sympy) and
/// checked against mpmath's Bessel functions; the tests hold them to it and check the join
/// with the series at q = 10.
fn asymptotic_impedance(q: f64, v: f64) -> InternalImpedance {
    let v2 = v * v;
    let v4 = v2 * v2;
    let tail = v * (3.0 / 32.0)
        - v2 * v * (63.0 / 1024.0 + v * (27.0 / 256.0 + v * (1899.0 / 16384.0)))
        + v4 * v2 * v * (543_483.0 / 1_048_576.0);
    InternalImpedance {
        resistance_ratio: (0.5 * q + 0.25 + tail).max(1.0),
        internal_inductance_fraction: asymptotic_fraction(v),
    }
}

/// (kr/2)·J0(kr)/J1(kr) for kr = (1 − j)q, summed as power series; returns (re, im).
fn bessel_ratio(q: f64) -> (f64, f64) {
    // z = (1 − j) q, z²/4 = −j q²/2, so −z²/4 = j q²/2 =: j·s.
    let s = 0.5 * q * q;
    // J0(z) = Σ (−z²/4)^n / (n!)²; (2/z)·J1(z) = Σ (−z²/4)^n / (n!(n+1)!).
    let (mut t0r, mut t0i) = (1.0_f64, 0.0_f64);
    let (mut t1r, mut t1i) = (1.0_f64, 0.0_f64);
    let (mut j0r, mut j0i) = (1.0_f64, 0.0_f64);
    let (mut j1r, mut j1i) = (1.0_f64, 0.0_f64);
    for n in 1..200 {
        let nf = n as f64;
        // multiply by j·s / (n·n) and j·s / (n·(n+1)): (a + jb)·j = −b + ja
        let f0 = s / (nf * nf);
        let f1 = s / (nf * (nf + 1.0));
        (t0r, t0i) = (-t0i * f0, t0r * f0);
        (t1r, t1i) = (-t1i * f1, t1r * f1);
        j0r += t0r;
        j0i += t0i;
        j1r += t1r;
        j1i += t1i;
        if t0r.abs() + t0i.abs() < 1e-18 * (j0r.abs() + j0i.abs()) && nf > s.sqrt() {
            break;
        }
    }
    // (z/2)·J0/J1 = J0 / ((2/z)·J1)
    let den = j1r * j1r + j1i * j1i;
    ((j0r * j1r + j0i * j1i) / den, (j0i * j1r - j0r * j1i) / den)
}

/// DC resistance of a round wire, Ω: ρ·length/(π r²).
pub fn dc_resistance(resistivity: f64, diameter: f64, length: f64) -> f64 {
    let r = 0.5 * diameter;
    resistivity * length / (PI * r * r)
}

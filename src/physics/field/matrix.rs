//! The moment matrix: frequency-independent parts computed once, summed per frequency.
//!
//! # Formula
//! Galerkin's method (test functions = basis functions) on the mixed-potential electric-field
//! integral equation of a thin wire with triangle basis functions Λ_n (R. F. Harrington,
//! *Field Computation by Moment Methods*, 1968, ch. 4; D. R. Wilton and C. M. Butler,
//! "Efficient numerical techniques for solving Pocklington's equation and their relationships
//! to other methods", IEEE Trans. AP-24, 1976, pp. 83–86, who show that triangle basis and
//! testing functions give Pocklington's equation a well-behaved, convergent discretisation):
//!
//! Z_mn = jωµ0 ∫∫ Λ_m·Λ_n G ds ds′ + (1/(jωε0)) ∫∫ (∇·Λ_m)(∇′·Λ_n) G ds ds′ + z_s ∫ Λ_m·Λ_n ds,
//!
//! with G = e^{−jkR}/(4πR) on the reduced kernel (see [`super::kernel`]) and z_s the wire's
//! internal impedance per metre (Harrington 1968 §4.7, impedance loading), from the Bessel
//! form of [`crate::physics::copper::internal_impedance`]. On a segment of length Δ the rising
//! half of a triangle is u (divergence +1/Δ), the falling half 1 − u (divergence −1/Δ).
//! Galerkin testing makes Z symmetric, so the computed impedance is reciprocal by construction.

use super::geometry::{Structure, dot};
use super::kernel::{FAR_POINTS, Moments, NEAR_POINTS, Rule, pair_moments};
use crate::physics::constants::{EPSILON_0, MU_0};
use crate::physics::copper::internal_impedance;
use num_complex::Complex64;
use std::f64::consts::PI;

/// The frequency-independent matrices of one structure.
#[derive(Clone, Debug)]
pub struct StaticMatrices {
    /// Number of basis functions.
    pub size: usize,
    /// Vector-potential parts, one n×n matrix (row-major) per power p of the series.
    vector: Vec<Vec<f64>>,
    /// Scalar-potential parts, likewise.
    scalar: Vec<Vec<f64>>,
    /// ∫ Λ_m·Λ_n ds, for the wire's internal impedance.
    gram: Vec<f64>,
    /// Largest distance between points of the wire (for the series' truncation), metres.
    extent: f64,
    /// Wire radius.
    radius: f64,
}

/// Series terms needed for relative truncation error below 1e-15 at kR = `x`: the bound on the
/// tail is Σ_{p>P} x^p/p!, since every moment of R^{p−1} is at most extent^p times the p = 0
/// moment's size.
pub fn series_terms(x: f64) -> usize {
    let mut term = 1.0;
    let mut p = 0usize;
    while p < 2 || term > 1e-16 || (p as f64) < x {
        p += 1;
        term *= x / p as f64;
        if p > 400 {
            break;
        }
    }
    p + 1
}

impl StaticMatrices {
    /// Integrate every segment pair once, with the series carried to `powers` terms.
    pub fn new(structure: &Structure, powers: usize) -> Self {
        let segs = &structure.segments;
        let n = structure.bases.len();
        let far = Rule::gauss_legendre(FAR_POINTS);
        let near = Rule::gauss_legendre(NEAR_POINTS);
        // For each segment: (basis, divergence sign, half) for the halves lying on it.
        // half 0: rising (u), half 1: falling (1 − u).
        let mut halves: Vec<Vec<(usize, f64, usize)>> = vec![Vec::new(); segs.len()];
        for (b, basis) in structure.bases.iter().enumerate() {
            halves[basis.arrive].push((b, 1.0, 0));
            halves[basis.leave].push((b, -1.0, 1));
        }
        let mut vector = vec![vec![0.0; n * n]; powers];
        let mut scalar = vec![vec![0.0; n * n]; powers];
        let mut moments: Vec<Moments> = vec![[0.0; 4]; powers];
        for i in 0..segs.len() {
            for j in i..segs.len() {
                if halves[i].is_empty() || halves[j].is_empty() {
                    continue;
                }
                moments.iter_mut().for_each(|m| *m = [0.0; 4]);
                pair_moments(
                    &segs[i],
                    &segs[j],
                    structure.wire_radius,
                    &far,
                    &near,
                    &mut moments,
                );
                let tangents = dot(segs[i].direction, segs[j].direction);
                let (di, dj) = (segs[i].length, segs[j].length);
                for &(bm, sm, hm) in &halves[i] {
                    for &(bn, sn, hn) in &halves[j] {
                        let divergence = sm * sn / (di * dj);
                        for (p, m) in moments.iter().enumerate() {
                            // ∫∫ f_m(u) f_n(u′) R^{p−1} with f = u (rising) or 1 − u (falling).
                            let overlap = match (hm, hn) {
                                (0, 0) => m[3],
                                (0, _) => m[1] - m[3],
                                (_, 0) => m[2] - m[3],
                                _ => m[0] - m[1] - m[2] + m[3],
                            };
                            let v = tangents * overlap;
                            let s = divergence * m[0];
                            vector[p][bm * n + bn] += v;
                            scalar[p][bm * n + bn] += s;
                            if i != j {
                                vector[p][bn * n + bm] += v;
                                scalar[p][bn * n + bm] += s;
                            }
                        }
                    }
                }
            }
        }
        let mut gram = vec![0.0; n * n];
        for (i, seg) in segs.iter().enumerate() {
            for &(bm, _, hm) in &halves[i] {
                for &(bn, _, hn) in &halves[i] {
                    // ∫₀¹ u² = ∫₀¹ (1 − u)² = 1/3, ∫₀¹ u(1 − u) = 1/6.
                    let f = if hm == hn { 1.0 / 3.0 } else { 1.0 / 6.0 };
                    gram[bm * n + bn] += f * seg.length;
                }
            }
        }
        Self {
            size: n,
            vector,
            scalar,
            gram,
            extent: structure.extent() + structure.wire_radius,
            radius: structure.wire_radius,
        }
    }

    /// Series terms held.
    pub fn powers(&self) -> usize {
        self.vector.len()
    }

    /// Highest frequency the held terms serve to the stated accuracy, hertz.
    pub fn max_frequency(&self) -> f64 {
        // Largest x with series_terms(x) ≤ powers, found by bisection on the monotone count.
        let (mut lo, mut hi) = (0.0_f64, 400.0_f64);
        for _ in 0..60 {
            let mid = 0.5 * (lo + hi);
            if series_terms(mid) <= self.powers() {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        lo / self.extent * crate::physics::constants::SPEED_OF_LIGHT / (2.0 * PI)
    }

    /// The moment matrix at `frequency` (row-major), for a wire of `resistivity`.
    pub fn assemble(&self, frequency: f64, resistivity: f64) -> Vec<Complex64> {
        let n = self.size;
        let omega = 2.0 * PI * frequency;
        let k = omega * (MU_0 * EPSILON_0).sqrt();
        let jw_mu = Complex64::new(0.0, omega * MU_0);
        let inv_jw_eps = Complex64::new(0.0, -1.0 / (omega * EPSILON_0));
        let terms = series_terms(k * self.extent).min(self.powers());
        let mut z = vec![Complex64::new(0.0, 0.0); n * n];
        // (−jk)^p/p!/(4π)
        let mut c = Complex64::new(1.0 / (4.0 * PI), 0.0);
        for p in 0..terms {
            let a = c * jw_mu;
            let b = c * inv_jw_eps;
            for ((zi, v), s) in z.iter_mut().zip(&self.vector[p]).zip(&self.scalar[p]) {
                *zi += a * *v + b * *s;
            }
            c *= Complex64::new(0.0, -k / (p + 1) as f64);
        }
        let zs = surface_impedance_per_metre(self.radius, resistivity, frequency);
        for (zi, g) in z.iter_mut().zip(&self.gram) {
            if *g != 0.0 {
                *zi += zs * *g;
            }
        }
        z
    }
}

/// The wire's internal impedance per metre at `frequency`, Ω/m.
///
/// # Formula
/// z_s = R_dc′·(R_ac/R_dc) + jω·(µ0/8π)·χ, with R_dc′ = ρ/(πa²) and the ratio and χ from the
/// Bessel form of the round wire's internal impedance ([`internal_impedance`]).
pub fn surface_impedance_per_metre(radius: f64, resistivity: f64, frequency: f64) -> Complex64 {
    let depth = crate::physics::copper::skin_depth(resistivity, frequency);
    let inner = internal_impedance(radius / depth);
    let r_dc = resistivity / (PI * radius * radius);
    let omega = 2.0 * PI * frequency;
    Complex64::new(
        r_dc * inner.resistance_ratio,
        omega * MU_0 / (8.0 * PI) * inner.internal_inductance_fraction,
    )
}

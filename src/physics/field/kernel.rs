//! Integrals of the thin-wire kernel over pairs of straight segments.
//!
//! # Formula
//! The thin-wire kernel: the current flows as a uniform tube on the source wire's surface and
//! the field is tested on the observing wire's axis. Along a straight wire this is the reduced
//! kernel R = √(z² + a²), z the distance along the source and a the wire radius
//! (R. F. Harrington, *Field Computation by Moment Methods*, 1968, §4.2; G. J. Burke and
//! A. J. Poggio, *Numerical Electromagnetics Code (NEC)*, Part I, 1981, §2.2). Off the
//! source's axis the tube acts as its axial filament (the logarithmic potential of a uniform
//! ring of current is the filament's outside the ring and constant inside it), so this solver
//! takes R² = z² + max(ρ², a²), ρ the observation point's distance from the source segment's
//! line: the reduced kernel on the wire itself, and the true axis-to-axis distance between
//! separate parts of the wire. Neighbouring turns therefore couple at their axis separation, as
//! in Maxwell's ring formula; the plain reduced kernel everywhere would act as a separation
//! √(s² + a²) and lower the neighbours' mutual inductance by a term of order a²/s² (over 1 %
//! of L on a coil with the pitch twice the wire diameter).
//!
//! The free-space Green's function e^{−jkR}/(4πR) is expanded in its Taylor series,
//! e^{−jkR}/R = Σ_{p≥0} (−jk)^p R^{p−1}/p!, so every segment pair needs only the real moments
//! ∫∫ u^α u′^β R^{p−1} ds ds′ (u, u′ ∈ [0, 1] along each segment, α, β ∈ {0, 1}), once for all
//! frequencies; the frequency enters as the coefficients (−jk)^p/p!. The series converges for
//! every kR; the terms kept are set by k·(the wire's extent) at the highest frequency asked for.
//!
//! The p = 0 term, 1/R, peaks at 1/a where the segments meet. For segments near each other
//! (midpoints closer than three segment lengths) its inner integral is done exactly,
//! ∫₀^Δ ds′/√((s′ − t)² + ρ²) = asinh((Δ − t)/ρ) + asinh(t/ρ) and
//! ∫₀^Δ s′ ds′/√((s′ − t)² + ρ²) = √((Δ − t)² + ρ²) − √(t² + ρ²) + t·(the first),
//! with t the observation point's position along the source segment and ρ² = max(ρ², a²) as
//! above (the line case of D. R. Wilton, S. M. Rao, A. W.
//! Glisson et al., "Potential integrals for uniform and linear source distributions on
//! polygonal and polyhedral domains", IEEE Trans. AP-32, 1984), and the outer one by
//! Gauss–Legendre quadrature with [`NEAR_POINTS`] points. All other integrals (the smooth
//! powers R^{p−1}, p ≥ 1, and 1/R between distant segments) use Gauss–Legendre product rules.

use super::geometry::{Segment, dot, norm, sub};

/// Gauss–Legendre points per segment for distant pairs.
pub const FAR_POINTS: usize = 4;
/// Gauss–Legendre points per segment for near pairs.
pub const NEAR_POINTS: usize = 10;

/// Gauss–Legendre nodes and weights on [0, 1].
#[derive(Clone, Debug)]
pub struct Rule {
    /// Nodes in (0, 1).
    pub nodes: Vec<f64>,
    /// Weights, summing to 1.
    pub weights: Vec<f64>,
}

impl Rule {
    /// The n-point rule, nodes found by Newton's method on the Legendre polynomial from the
    /// usual cosine start (Abramowitz and Stegun 1964, 25.4.29).
    pub fn gauss_legendre(n: usize) -> Self {
        let mut nodes = vec![0.0; n];
        let mut weights = vec![0.0; n];
        let nf = n as f64;
        for i in 0..n {
            let mut x = (std::f64::consts::PI * (i as f64 + 0.75) / (nf + 0.5)).cos();
            let mut derivative = 1.0;
            for _ in 0..100 {
                // P_n(x) and P_n′(x) by the three-term recurrence.
                let (mut p0, mut p1) = (1.0, x);
                for k in 2..=n {
                    let kf = k as f64;
                    let p2 = ((2.0 * kf - 1.0) * x * p1 - (kf - 1.0) * p0) / kf;
                    p0 = p1;
                    p1 = p2;
                }
                // p1 = P_n(x), p0 = P_{n−1}(x) (for n = 1 the loop is skipped: x and 1).
                derivative = nf * (x * p1 - p0) / (x * x - 1.0);
                let dx = p1 / derivative;
                x -= dx;
                if dx.abs() < 1e-15 {
                    break;
                }
            }
            nodes[i] = 0.5 * (1.0 - x);
            weights[i] = 1.0 / ((1.0 - x * x) * derivative * derivative);
        }
        Self { nodes, weights }
    }
}

/// The four moments of one power of R over a segment pair:
/// [∫∫R^q, ∫∫u·R^q, ∫∫u′·R^q, ∫∫u·u′·R^q] (u along the observing segment, u′ along the source).
pub type Moments = [f64; 4];

/// The moments of R^{p−1} for p = 0 … `out.len()` − 1 between observing segment `obs` and
/// source segment `src`, added into `out`.
pub fn pair_moments(
    obs: &Segment,
    src: &Segment,
    radius: f64,
    far: &Rule,
    near: &Rule,
    out: &mut [Moments],
) {
    let reach = 3.0 * obs.length.max(src.length);
    let is_near = norm(sub(obs.middle(), src.middle())) < reach;
    let rule = if is_near { near } else { far };
    let a2 = radius * radius;
    let powers = out.len();
    for (&u, &w) in rule.nodes.iter().zip(&rule.weights) {
        let r = obs.at(u);
        let wo = w * obs.length;
        let first_smooth = if is_near {
            // 1/R exactly along the source segment.
            let rel = sub(r, src.start);
            let t = dot(rel, src.direction);
            let rho2 = (dot(rel, rel) - t * t).max(a2);
            let rho = rho2.sqrt();
            let d = src.length;
            let i0 = ((d - t) / rho).asinh() + (t / rho).asinh();
            let i1 = ((d - t) * (d - t) + rho2).sqrt() - (t * t + rho2).sqrt() + t * i0;
            let i1 = i1 / d;
            let m = &mut out[0];
            m[0] += wo * i0;
            m[1] += wo * u * i0;
            m[2] += wo * i1;
            m[3] += wo * u * i1;
            1
        } else {
            0
        };
        if first_smooth >= powers {
            continue;
        }
        for (&v, &wv) in rule.nodes.iter().zip(&rule.weights) {
            let rp = src.at(v);
            let d = sub(r, rp);
            let along = dot(d, src.direction);
            let big_r = dot(d, d).max(along * along + a2).sqrt();
            let weight = wo * wv * src.length;
            // R^{p−1}, starting at p = first_smooth.
            let mut power = if first_smooth == 0 { 1.0 / big_r } else { 1.0 };
            for m in out.iter_mut().skip(first_smooth) {
                let f = weight * power;
                m[0] += f;
                m[1] += f * u;
                m[2] += f * v;
                m[3] += f * u * v;
                power *= big_r;
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::physics::field::matrix::series_terms;
    use num_complex::Complex64;

    #[test]
    fn gauss_legendre_integrates_polynomials_of_degree_2n_minus_1_exactly() {
        for n in [1, 2, 4, 10] {
            let rule = Rule::gauss_legendre(n);
            for degree in 0..2 * n {
                let sum: f64 = rule
                    .nodes
                    .iter()
                    .zip(&rule.weights)
                    .map(|(x, w)| w * x.powi(degree as i32))
                    .sum();
                let exact = 1.0 / (degree as f64 + 1.0);
                assert!((sum - exact).abs() < 1e-14, "n {n}, x^{degree}: {sum}");
            }
        }
    }

    fn segment(start: [f64; 3], direction: [f64; 3], length: f64) -> Segment {
        Segment {
            start,
            direction,
            length,
        }
    }

    #[test]
    fn taylor_moments_sum_to_the_retarded_kernel_far_out() {
        // Two 50 mm segments 0.6 m apart at k = 8 /m (kR ≈ 5): the series of moments, cut at
        // the count `series_terms` gives, against e^{−jkR}/R (the same thin-wire R) integrated
        // directly with the same product rule (far apart, so both use the plain Gauss rule).
        let a = segment([0.0, 0.0, 0.0], [1.0, 0.0, 0.0], 0.05);
        let b = segment([0.1, 0.6, 0.0], [0.0, 0.6, 0.8], 0.05);
        let radius = 0.5e-3;
        let k = 8.0;
        let far = Rule::gauss_legendre(FAR_POINTS);
        let near = Rule::gauss_legendre(NEAR_POINTS);
        let terms = series_terms(k * 0.75);
        let mut m = vec![[0.0; 4]; terms];
        pair_moments(&a, &b, radius, &far, &near, &mut m);
        let mut series = Complex64::new(0.0, 0.0);
        let mut c = Complex64::new(1.0, 0.0);
        for (p, mp) in m.iter().enumerate() {
            series += c * mp[3];
            c *= Complex64::new(0.0, -k / (p + 1) as f64);
        }
        let mut direct = Complex64::new(0.0, 0.0);
        for (&u, &wu) in far.nodes.iter().zip(&far.weights) {
            for (&v, &wv) in far.nodes.iter().zip(&far.weights) {
                let d = sub(a.at(u), b.at(v));
                let along = dot(d, b.direction);
                let r = dot(d, d).max(along * along + radius * radius).sqrt();
                let g = Complex64::new(0.0, -k * r).exp() / r;
                direct += g * (wu * wv * a.length * b.length * u * v);
            }
        }
        assert!(
            (series - direct).norm() < 1e-12 * direct.norm(),
            "{series} vs {direct}"
        );
    }

    #[test]
    fn self_term_matches_the_closed_form_of_the_reduced_kernel() {
        // ∫₀^Δ∫₀^Δ ds ds′/√((s − s′)² + a²) = 2[Δ·asinh(Δ/a) − √(Δ² + a²) + a] (exact).
        let (length, radius) = (2e-3, 0.5e-3);
        let s = segment([0.0; 3], [0.0, 0.0, 1.0], length);
        let far = Rule::gauss_legendre(FAR_POINTS);
        let near = Rule::gauss_legendre(NEAR_POINTS);
        let mut m = vec![[0.0; 4]; 1];
        pair_moments(&s, &s, radius, &far, &near, &mut m);
        let exact = 2.0
            * (length * (length / radius).asinh() - (length * length + radius * radius).sqrt()
                + radius);
        assert!(
            (m[0][0] / exact - 1.0).abs() < 1e-6,
            "{} vs {exact}",
            m[0][0]
        );
    }
}

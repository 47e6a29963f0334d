//! High-frequency proximity-effect factor of the wire of a single-layer solenoid.
//!
//! Φ = (AC resistance of the coil's wire) / (AC resistance of the same wire straight and
//! isolated), in the limit where the skin depth is much smaller than both the wire radius and
//! the gap between turns (VHF). In that limit the wire is field-excluding and the loss per unit
//! length is proportional to ∮K² ds, K being the surface current density.
//!
//! # Model: the infinite solenoid wall
//! A 2-D periodic row of identical round cylinders of diameter d = 2a at pitch p along x, each
//! carrying the same current I, with the field H0 = I/p on one side of the row (inside the coil)
//! and 0 on the other. It is solved by Lord Rayleigh's method of periodic multipole expansions
//! (Lord Rayleigh, "On the influence of obstacles arranged in rectangular order upon the
//! properties of a medium", Phil. Mag. 34, 1892), with Rayleigh's lattice sums.
//!
//! With z = x + iy and the complex potential Ω whose real part is the flux function (A_z/µ0),
//! |H| = |dΩ/dz|. Take
//!
//! Ω(z) = −(I/2π)·ln sin(πz/p) − i(I/2p)·z + Σ_{m≥1} c_m Σ_n (a/(z − np))^m,
//!
//! i.e. the row of line currents, a uniform field making the far field H0 on one side and 0 on
//! the other, and a periodic multipole of every order m (the m-th is proportional to the
//! (m−1)-th derivative of cot(πz/p)). Expanding the neighbours' terms about the centre of one
//! cylinder uses the lattice sums Σ_{n≠0} (np)^{−k} = 2ζ(k)/p^k (k even, zero for k odd) and
//! the product formula for sin. The condition "flux function constant on |z| = a" then holds
//! term by term in the Fourier modes e^{ijθ} of the circle, giving with t = a/p and
//! B_jm = C(m+j−1, j)·2ζ(m+j)·t^{m+j} (only m + j even):
//!
//! - odd orders, c_m = i·I·g_m:  g_j + Σ_m B_jm g_m = −(t/2)·δ_{j1};
//! - even orders, c_m = I·h_m:  h_j + Σ_m B_jm h_m = −ζ(j)·t^j/(π j).
//!
//! The tangential field on the circle follows from the stream function, and Parseval's theorem
//! gives exactly
//!
//! Φ = (∮K² ds) / (I²/(2πa)) = 1 + 8π² Σ_j j²·x_j²,   x_j = g_j or h_j.
//!
//! Without the neighbours' multipoles (B = 0, t → 0) this reduces to 1 + 2π²t² =
//! 1 + (π²/2)(d/p)²: the isolated wire's uniform current plus a cylinder in a uniform
//! transverse field of H0/2.
//!
//! The truncated system converges geometrically, the coefficients falling like ρ^j with
//! ρ = q − √(q² − 1), q = p/d (ρ/a is the limit point of the images of one cylinder in its
//! neighbour); the order is chosen from that rate.

use std::f64::consts::PI;
use std::sync::OnceLock;

/// Smallest p/d in the fast-path table; smaller inputs are clamped to it.
const TABLE_Q_MIN: f64 = 1.01;
/// Largest p/d in the fast-path table; beyond it the wide-spacing series is used.
const TABLE_Q_MAX: f64 = 20.0;
/// Number of table intervals (uniform in w = √(p/d − 1)).
const TABLE_INTERVALS: usize = 96;
/// Largest multipole order used by [`wall_proximity_factor_exact`] (reached only for
/// p/d < 1.005; even at p/d = 1.000001 order 100 is already converged to 1e-15).
const MAX_ORDER: usize = 256;
/// Largest order accepted by [`wall_proximity_factor_truncated`] (bounds the memory used).
const TRUNCATED_ORDER_CAP: usize = 1024;

/// Proximity factor Φ for the infinite solenoid wall, by Rayleigh's multipole method.
/// `pitch_over_diameter` = p/d, must be > 1 (turns not touching). Returns Φ ≥ 1.
///
/// The multipole order is chosen (conservatively) from the convergence rate
/// ρ = q − √(q² − 1) so that the neglected terms are below about 1e-14, capped at 256 for
/// p/d < 1.005, where it is still converged (see the module documentation for the method).
/// Inputs ≤ 1 or non-finite give NaN (the caller validates geometry; the fast path
/// [`wall_proximity_factor`] clamps instead).
pub fn wall_proximity_factor_exact(pitch_over_diameter: f64) -> f64 {
    let q = pitch_over_diameter;
    if !(q.is_finite() && q > 1.0) {
        return f64::NAN;
    }
    wall_proximity_factor_truncated(q, order_for(q))
}

/// Φ for the infinite solenoid wall with the multipole expansion truncated at `order`
/// (orders 1..=order), by Rayleigh's multipole method. Exposed for convergence checks;
/// use [`wall_proximity_factor_exact`] in practice. `order` = 0 gives the isolated wire, 1;
/// orders above 1024 are treated as 1024.
/// Inputs ≤ 1 or non-finite give NaN.
pub fn wall_proximity_factor_truncated(pitch_over_diameter: f64, order: usize) -> f64 {
    let q = pitch_over_diameter;
    if !(q.is_finite() && q > 1.0) {
        return f64::NAN;
    }
    match wall_coefficients(q, order.min(TRUNCATED_ORDER_CAP)) {
        Some(x) => {
            let sum: f64 = x
                .iter()
                .enumerate()
                .map(|(i, xj)| {
                    let j = (i + 1) as f64;
                    j * j * xj * xj
                })
                .sum();
            1.0 + 8.0 * PI * PI * sum
        }
        None => f64::NAN,
    }
}

/// Fast path used in every evaluation: piecewise-cubic interpolation in a table of
/// [`wall_proximity_factor_exact`] built once (on first use) over p/d from 1.01 to 20,
/// uniform in w = √(p/d − 1) (denser near touching, where Φ varies fastest). Beyond the table
/// it uses the wide-spacing series of the same multipole solution (dipole and quadrupole with
/// their self-coupling; neglected terms O((d/p)⁸), about 2e-12 at p/d = 20).
///
/// Inputs below the table's first entry (including ≤ 1) or non-finite are clamped to the
/// table's first entry, Φ(1.01) (the caller validates geometry).
#[inline]
pub fn wall_proximity_factor(pitch_over_diameter: f64) -> f64 {
    let q = pitch_over_diameter;
    let table = table();
    if !(q.is_finite() && q > TABLE_Q_MIN) {
        return table.first;
    }
    if q >= TABLE_Q_MAX {
        return wide_spacing_series(q);
    }
    let w = (q - 1.0).sqrt();
    // s ∈ (0, TABLE_INTERVALS) because TABLE_Q_MIN < q < TABLE_Q_MAX; the min() only
    // guards rounding at the top end (s = TABLE_INTERVALS gives u = 1 in the last interval).
    let s = (w - table.w_min) * table.inv_h;
    let i = (s as usize).min(TABLE_INTERVALS - 1);
    let u = s - i as f64;
    match table.coeffs.get(i) {
        Some(c) => c[0] + u * (c[1] + u * (c[2] + u * c[3])),
        None => table.first,
    }
}

/// Wide-spacing limit 1 + (π²/2)(d/p)²: the isolated wire plus a cylinder in a uniform
/// transverse field H0/2 (the leading term of Rayleigh's multipole solution, see the module
/// documentation). Good only for p/d ≳ 4; the next term is −(5π⁴/72)(d/p)⁴.
pub fn wide_spacing_proximity_factor(pitch_over_diameter: f64) -> f64 {
    let s = 1.0 / pitch_over_diameter;
    1.0 + 0.5 * PI * PI * s * s
}

/// Wide-spacing series of the Rayleigh solution: the dipole g₁ and quadrupole h₂ with their
/// self-coupling through the lattice sums, i.e. Φ = 1 + 8π²(g₁² + 4h₂²) with
/// g₁ = −(t/2)/(1 + π²t²/3) and h₂ = −(πt²/12)/(1 + 6ζ(4)t⁴), t = d/(2p). The neglected terms
/// are O(t⁸) relative; expanded, Φ = 1 + (π²/2)(d/p)² − (5π⁴/72)(d/p)⁴ + …
fn wide_spacing_series(q: f64) -> f64 {
    let t = 0.5 / q;
    let t2 = t * t;
    let zeta4 = PI.powi(4) / 90.0;
    let g1 = -0.5 * t / (1.0 + PI * PI * t2 / 3.0);
    let h2 = -(PI * t2 / 12.0) / (1.0 + 6.0 * zeta4 * t2 * t2);
    1.0 + 8.0 * PI * PI * (g1 * g1 + 4.0 * h2 * h2)
}

/// Multipole order for p/d = q: enough that ρ^(2N)·N² (the size of the neglected terms of
/// Φ if the coefficients fell like ρ^j, ρ = q − √(q²−1)) is below about 1e-14. This bound is
/// conservative: the coefficients actually fall faster (the field in the gap is weak because
/// no net flux passes between the turns), e.g. order 64 is converged to 1e-15 at p/d = 1.01.
fn order_for(q: f64) -> usize {
    // −ln ρ = acosh q.
    let rate = q.acosh();
    let mut n = 8usize;
    while n < MAX_ORDER {
        let nf = n as f64;
        if 2.0 * nf * rate - 2.0 * nf.ln() > 14.0 * std::f64::consts::LN_10 {
            break;
        }
        n += 2;
    }
    n
}

/// Solve Rayleigh's truncated system for p/d = q with multipole orders 1..=order.
/// Returns x_j (j = 1..=order): g_j for odd j, h_j for even j, in units of I.
fn wall_coefficients(q: f64, order: usize) -> Option<Vec<f64>> {
    let mut x = vec![0.0; order];
    if order == 0 {
        return Some(x);
    }
    let t = 0.5 / q;
    let ln_t = t.ln();
    // 2ζ(k) for k = 0..=2·order (entries below 2 unused).
    let two_zeta: Vec<f64> = (0..=2 * order)
        .map(|k| if k >= 2 { 2.0 * zeta(k) } else { 0.0 })
        .collect();
    // ln k! for k = 0..=2·order.
    let mut ln_fact = vec![0.0; 2 * order + 1];
    for k in 1..ln_fact.len() {
        ln_fact[k] = ln_fact[k - 1] + (k as f64).ln();
    }
    for parity in [1usize, 2] {
        // Orders of this parity: parity, parity + 2, ...
        let orders: Vec<usize> = (parity..=order).step_by(2).collect();
        let n = orders.len();
        if n == 0 {
            continue;
        }
        let mut a = vec![0.0; n * n];
        let mut b = vec![0.0; n];
        for (r, &j) in orders.iter().enumerate() {
            let row = &mut a[r * n..(r + 1) * n];
            for (col, &m) in orders.iter().enumerate() {
                let k = m + j;
                // C(m+j−1, j)·t^(m+j)
                let ln_term = ln_fact[k - 1] - ln_fact[j] - ln_fact[m - 1] + k as f64 * ln_t;
                row[col] = two_zeta[k] * ln_term.exp();
            }
            row[r] += 1.0;
            b[r] = if parity == 1 {
                if j == 1 { -0.5 * t } else { 0.0 }
            } else {
                -0.5 * two_zeta[j] * (j as f64 * ln_t).exp() / (PI * j as f64)
            };
        }
        solve_dense(&mut a, &mut b, n)?;
        for (r, &j) in orders.iter().enumerate() {
            x[j - 1] = b[r];
        }
    }
    Some(x)
}

/// Riemann ζ(k) for integer k ≥ 2: direct sum to N − 1 plus the Euler–Maclaurin tail
/// (corrections through B₈), N = 32; the first neglected term is below 1e-17 for all k ≥ 2.
fn zeta(k: usize) -> f64 {
    const N: usize = 32;
    if k > 60 {
        // 2^−k already below 1e-18: only the first few terms matter.
        let e = -(k as i32);
        return 1.0 + 2f64.powi(e) + 3f64.powi(e) + 4f64.powi(e);
    }
    let s = k as f64;
    let mut sum = 0.0;
    for n in (1..N).rev() {
        sum += (n as f64).powf(-s);
    }
    let nf = N as f64;
    let nk = nf.powf(-s);
    let inv2 = 1.0 / (nf * nf);
    // Σ_{n≥N} n^−s = N^(1−s)/(s−1) + N^−s/2 − Σ_k B_2k/(2k)!·f^(2k−1)(N), f(n) = n^−s.
    let p1 = s;
    let p3 = p1 * (s + 1.0) * (s + 2.0);
    let p5 = p3 * (s + 3.0) * (s + 4.0);
    let p7 = p5 * (s + 5.0) * (s + 6.0);
    let tail = nf * nk / (s - 1.0)
        + 0.5 * nk
        + nk / nf
            * (p1 / 12.0 - inv2 * (p3 / 720.0 - inv2 * (p5 / 30240.0 - inv2 * p7 / 1209600.0)));
    sum + tail
}

/// Gaussian elimination with partial pivoting on the row-major n×n matrix `a`; the solution
/// overwrites `b`. Returns None if the matrix is numerically singular.
fn solve_dense(a: &mut [f64], b: &mut [f64], n: usize) -> Option<()> {
    for k in 0..n {
        // Pivot.
        let mut piv = k;
        let mut best = a[k * n + k].abs();
        for r in k + 1..n {
            let v = a[r * n + k].abs();
            if v > best {
                best = v;
                piv = r;
            }
        }
        if !(best > 0.0 && best.is_finite()) {
            return None;
        }
        if piv != k {
            for c in 0..n {
                a.swap(k * n + c, piv * n + c);
            }
            b.swap(k, piv);
        }
        let (top, rest) = a.split_at_mut((k + 1) * n);
        let pivot_row = &top[k * n + k..k * n + n];
        let inv = 1.0 / pivot_row[0];
        let bk = b[k];
        for (r, row) in rest.chunks_exact_mut(n).enumerate() {
            let f = row[k] * inv;
            if f != 0.0 {
                for (x, p) in row[k..].iter_mut().zip(pivot_row) {
                    *x -= f * p;
                }
                b[k + 1 + r] -= f * bk;
            }
        }
    }
    for k in (0..n).rev() {
        let row = &a[k * n..(k + 1) * n];
        let s: f64 = row[k + 1..]
            .iter()
            .zip(&b[k + 1..])
            .map(|(x, y)| x * y)
            .sum();
        b[k] = (b[k] - s) / row[k];
    }
    Some(())
}

/// Interpolation table of the fast path.
struct Table {
    /// Φ at the first node, p/d = 1.01.
    first: f64,
    /// w = √(p/d − 1) at the first node.
    w_min: f64,
    /// 1 / node spacing in w.
    inv_h: f64,
    /// Per-interval cubic in the local coordinate u ∈ [0, 1]: c0 + c1 u + c2 u² + c3 u³.
    coeffs: Vec<[f64; 4]>,
}

#[inline]
fn table() -> &'static Table {
    static TABLE: OnceLock<Table> = OnceLock::new();
    TABLE.get_or_init(build_table)
}

/// Build the table: Φ exact at nodes uniform in w = √(p/d − 1); on each interval the cubic
/// through the four nearest nodes (Lagrange, shifted inwards at the ends).
fn build_table() -> Table {
    let w_min = (TABLE_Q_MIN - 1.0).sqrt();
    let w_max = (TABLE_Q_MAX - 1.0).sqrt();
    let h = (w_max - w_min) / TABLE_INTERVALS as f64;
    let values: Vec<f64> = (0..=TABLE_INTERVALS)
        .map(|i| {
            let w = w_min + h * i as f64;
            wall_proximity_factor_exact(1.0 + w * w)
        })
        .collect();
    let coeffs = (0..TABLE_INTERVALS)
        .map(|i| {
            // Nodes i−1, i, i+1, i+2 (shifted at the ends), local u = 0 at node i.
            let start = i.saturating_sub(1).min(TABLE_INTERVALS - 3);
            let off = start as f64 - i as f64; // u of the first node: −1, 0 or −2
            let y = [
                values[start],
                values[start + 1],
                values[start + 2],
                values[start + 3],
            ];
            cubic_through(off, y)
        })
        .collect();
    Table {
        first: values[0],
        w_min,
        inv_h: 1.0 / h,
        coeffs,
    }
}

/// Monomial coefficients of the cubic through (u0 + k, y[k]), k = 0..4.
fn cubic_through(u0: f64, y: [f64; 4]) -> [f64; 4] {
    // Newton divided differences on unit spacing.
    let d1 = [y[1] - y[0], y[2] - y[1], y[3] - y[2]];
    let d2 = [(d1[1] - d1[0]) / 2.0, (d1[2] - d1[1]) / 2.0];
    let d3 = (d2[1] - d2[0]) / 3.0;
    // p(u) = y0 + d1₀(u−a) + d2₀(u−a)(u−a−1) + d3(u−a)(u−a−1)(u−a−2), a = u0.
    let a0 = u0;
    let a1 = u0 + 1.0;
    let a2 = u0 + 2.0;
    // Expand into monomials.
    let c3 = d3;
    let c2 = d2[0] - d3 * (a0 + a1 + a2);
    let c1 = d1[0] - d2[0] * (a0 + a1) + d3 * (a0 * a1 + a0 * a2 + a1 * a2);
    let c0 = y[0] - d1[0] * a0 + d2[0] * a0 * a1 - d3 * a0 * a1 * a2;
    [c0, c1, c2, c3]
}

#[cfg(test)]
mod tests {
    //! Independent check of the lattice-sum algebra: evaluate the complex potential directly
    //! (closed-form log sin for the line-current row, direct sums over the nearest 2·N0 + 1
    //! cylinders for the multipoles plus a Euler–Maclaurin tail), then verify on points of the
    //! circle that the flux function is constant and that ∮|dΩ/dz|² ds gives the same Φ as
    //! Parseval's formula.
    use super::*;

    #[derive(Clone, Copy)]
    struct C(f64, f64);
    impl C {
        fn add(self, o: C) -> C {
            C(self.0 + o.0, self.1 + o.1)
        }
        fn mul(self, o: C) -> C {
            C(self.0 * o.0 - self.1 * o.1, self.0 * o.1 + self.1 * o.0)
        }
        fn scale(self, s: f64) -> C {
            C(self.0 * s, self.1 * s)
        }
        fn inv(self) -> C {
            let d = self.0 * self.0 + self.1 * self.1;
            C(self.0 / d, -self.1 / d)
        }
        fn powi(self, m: usize) -> C {
            (0..m).fold(C(1.0, 0.0), |acc, _| acc.mul(self))
        }
        fn abs2(self) -> f64 {
            self.0 * self.0 + self.1 * self.1
        }
    }

    const N0: i64 = 40;

    /// Σ_{n>N0} n^−s by Euler–Maclaurin.
    fn hurwitz_tail(s: f64) -> f64 {
        let n = N0 as f64;
        let nk = n.powf(-s);
        n * nk / (s - 1.0) - 0.5 * nk + s * nk / (12.0 * n)
            - s * (s + 1.0) * (s + 2.0) * nk / (720.0 * n * n * n)
    }

    fn binom(n: usize, k: usize) -> f64 {
        (0..k).fold(1.0, |acc, i| acc * (n - i) as f64 / (i + 1) as f64)
    }

    /// F_m(z) = Σ_n (a/(z − np))^m for m = 0..=max_m (entry 0 unused), with a = 1 (lengths
    /// in units of a), p = 1/t.
    fn row_multipoles(max_m: usize, z: C, t: f64) -> Vec<C> {
        let p = 1.0 / t;
        let mut f = vec![C(0.0, 0.0); max_m + 1];
        for n in -N0..=N0 {
            let w = z.add(C(-(n as f64) * p, 0.0)).inv();
            let mut wm = w;
            for fm in f.iter_mut().skip(1) {
                *fm = fm.add(wm);
                wm = wm.mul(w);
            }
        }
        // Tail |n| > N0: (−1)^m Σ_k C(m+k−1, k) z^k · 2 t^(m+k) Σ_{n>N0} n^−(m+k), m+k even.
        for (m, fm) in f.iter_mut().enumerate().skip(1) {
            let sign = if m % 2 == 0 { 1.0 } else { -1.0 };
            for k in 0..24 {
                if (m + k) % 2 == 0 {
                    let e = (m + k) as f64;
                    let coef = sign * binom(m + k - 1, k) * 2.0 * t.powf(e) * hurwitz_tail(e);
                    *fm = fm.add(z.powi(k).scale(coef));
                }
            }
        }
        f
    }

    fn check(q: f64) {
        // At order N the Fourier modes j > N of the boundary condition are not imposed; they
        // are O(t^(N+1)) in the flux function (Φ, quadratic, is far better). Use an order well
        // above `order_for` so that the residual reflects the algebra, not the truncation.
        let order = 2 * order_for(q).max(30);
        let x = wall_coefficients(q, order).unwrap_or_default();
        assert_eq!(x.len(), order);
        let t = 0.5 / q; // a = 1, p = 1/t
        let p = 1.0 / t;
        let npts = 256;
        let mut re_min = f64::INFINITY;
        let mut re_max = f64::NEG_INFINITY;
        let mut k2 = 0.0;
        for i in 0..npts {
            let th = 2.0 * PI * i as f64 / npts as f64;
            let z = C(th.cos(), th.sin());
            // Source: −(1/2π) ln sin(πz/p) − i z/(2p); I = 1.
            let (u, v) = (PI * z.0 / p, PI * z.1 / p);
            let sin_w = C(u.sin() * v.cosh(), u.cos() * v.sinh());
            let cos_w = C(u.cos() * v.cosh(), -u.sin() * v.sinh());
            let mut re = -0.5 * sin_w.abs2().ln() / (2.0 * PI) + z.1 / (2.0 * p);
            // dΩ/dz of the source: −(1/2p) cot(πz/p) − i/(2p).
            let mut d = cos_w.mul(sin_w.inv()).scale(-0.5 / p).add(C(0.0, -0.5 / p));
            let f = row_multipoles(order + 1, z, t);
            for (idx, &xm) in x.iter().enumerate() {
                let m = idx + 1;
                let c = if m % 2 == 1 { C(0.0, xm) } else { C(xm, 0.0) };
                re += c.mul(f[m]).0;
                // d/dz F_m = −m F_{m+1} (a = 1).
                d = d.add(c.mul(f[m + 1]).scale(-(m as f64)));
            }
            re_min = re_min.min(re);
            re_max = re_max.max(re);
            k2 += d.abs2();
        }
        // Flux function constant on the circle (its variation without the multipoles is ~t).
        assert!(
            re_max - re_min < 1e-11,
            "q={q}: flux varies by {}",
            re_max - re_min
        );
        // Φ = a∫|Ω'|²dθ / (1/(2πa)) with a = 1 and the periodic trapezoid rule.
        let phi_quad = 2.0 * PI * k2 * 2.0 * PI / npts as f64;
        let phi = wall_proximity_factor_truncated(q, order);
        assert!(
            (phi_quad - phi).abs() < 1e-9 * phi,
            "q={q}: quadrature {phi_quad} vs Parseval {phi}"
        );
    }

    #[test]
    fn boundary_condition_and_parseval_hold_by_direct_evaluation() {
        for q in [1.1, 1.5, 2.0, 5.0] {
            check(q);
        }
    }

    #[test]
    fn zeta_matches_closed_forms() {
        assert!((zeta(2) - PI * PI / 6.0).abs() < 1e-15);
        assert!((zeta(4) - PI.powi(4) / 90.0).abs() < 1e-15);
        assert!((zeta(6) - PI.powi(6) / 945.0).abs() < 1e-15);
        assert!((zeta(3) - 1.202_056_903_159_594_2).abs() < 1e-15);
    }

    #[test]
    fn order_grows_towards_touching() {
        assert!(order_for(1.01) > order_for(1.5));
        assert!(order_for(1.5) >= order_for(20.0));
        assert!(order_for(1.0 + 1e-9) <= MAX_ORDER);
    }
}

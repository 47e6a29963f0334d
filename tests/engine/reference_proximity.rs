//! Reference checks of the HF proximity-effect factor of the infinite solenoid wall
//! (`tankwright::physics::proximity`), solved by Rayleigh's multipole method.

use std::f64::consts::PI;
use tankwright::physics::proximity::{
    wall_proximity_factor, wall_proximity_factor_exact, wall_proximity_factor_truncated,
    wide_spacing_proximity_factor,
};

/// Proximity factor Φ of the infinite solenoid wall (2-D periodic row of field-excluding round
/// wires) at p/d = 1.05 … 5: boundary-element solutions of the surface current computed with
/// scipy as a cross-check by an independent numerical method — neither a publication nor a
/// measurement, and the computation (with its scipy version) is not kept in the repository.
/// Given to 3 significant figures.
/// (3.14 at p/d = 1.1 is the oracle's value, not π.)
#[expect(
    clippy::approx_constant,
    reason = "3.14 is the tabulated proximity factor at p/d = 1.1, not an approximation of π"
)]
const ORACLE_WALL: [(f64, f64); 6] = [
    (1.05, 3.27),
    (1.1, 3.14),
    (1.5, 2.42),
    (2.0, 1.93),
    (3.0, 1.48),
    (5.0, 1.19),
];

/// Grid of p/d from 1.01 to 40, denser near touching.
fn grid(n: usize) -> impl Iterator<Item = f64> {
    (0..=n).map(move |i| {
        let u = i as f64 / n as f64;
        1.01 + (40.0 - 1.01) * u * u * u
    })
}

#[test]
fn wall_matches_boundary_element_oracle() {
    // Boundary-element oracle (3 s.f.): tolerance = half a unit in the third significant
    // digit (0.005) plus 0.001 for the oracle's own boundary-element discretisation.
    for (q, oracle) in ORACLE_WALL {
        let phi = wall_proximity_factor_exact(q);
        assert!(
            (phi - oracle).abs() <= 0.005 + 0.001,
            "p/d = {q}: Rayleigh {phi} vs BEM oracle {oracle}"
        );
        // The fast path must give the same answer at the oracle points.
        let fast = wall_proximity_factor(q);
        assert!(
            (fast - oracle).abs() <= 0.005 + 0.001,
            "p/d = {q}: fast path {fast} vs BEM oracle {oracle}"
        );
    }
}

#[test]
fn wall_reduces_to_wide_spacing_limit() {
    // Wide-spacing limit Φ ≈ 1 + (π²/2)(d/p)²: the isolated wire's uniform current plus a
    // cylinder in a uniform transverse field (see `physics::proximity`). Expanding Rayleigh's
    // solution (dipole g₁ = −(t/2)/(1 + π²t²/3), quadrupole h₂ = −πt²/12, t = d/2p) the next
    // term is −(5π⁴/72)(d/p)⁴ and the one after +(π⁶/96)(d/p)⁶; at p/d = 20 the limit must
    // agree with the full solution within the next-order term.
    let q = 20.0;
    let s: f64 = 1.0 / q;
    let next = 5.0 * PI.powi(4) / 72.0 * s.powi(4);
    let after = PI.powi(6) / 96.0 * s.powi(6);
    let exact = wall_proximity_factor_exact(q);
    let wide = wide_spacing_proximity_factor(q);
    assert!(
        (exact - wide).abs() <= next,
        "p/d = 20: exact {exact} vs wide-spacing {wide}, next term {next}"
    );
    // With the (d/p)⁴ term included the remainder is within the (d/p)⁶ term.
    assert!(
        (exact - (wide - next)).abs() <= after,
        "p/d = 20: exact {exact} vs two-term series {}, next term {after}",
        wide - next
    );
}

#[test]
fn multipole_series_converges_on_doubling_the_order() {
    // Rayleigh's method: the truncated system converges geometrically; doubling the order
    // must shrink the change, and the production order must agree with the largest order
    // (400) to 1e-12 relative.
    for q in [1.01, 1.02, 1.05, 1.1, 1.5, 2.0, 3.0, 5.0, 20.0] {
        let exact = wall_proximity_factor_exact(q);
        let best = wall_proximity_factor_truncated(q, 400);
        assert!(
            (exact - best).abs() <= 1e-12 * best,
            "p/d = {q}: production order {exact} vs order 400 {best}"
        );
        let mut prev_change = f64::INFINITY;
        for n in [4usize, 8, 16] {
            let change = (wall_proximity_factor_truncated(q, 2 * n)
                - wall_proximity_factor_truncated(q, n))
            .abs();
            assert!(
                change < prev_change || change < 1e-14,
                "p/d = {q}: change {change} on doubling {n} did not shrink from {prev_change}"
            );
            prev_change = change;
        }
        // Order 64 → 128 changes nothing visible even at p/d = 1.01.
        let change = (wall_proximity_factor_truncated(q, 128)
            - wall_proximity_factor_truncated(q, 64))
        .abs();
        assert!(
            change <= 1e-12 * best,
            "p/d = {q}: 64 → 128 changed by {change}"
        );
    }
}

#[test]
fn fast_path_agrees_with_exact() {
    // The fast path (a table over p/d = 1.01..20, the wide-spacing series beyond) is held to
    // the exact multipole solution within 1e-4 relative: a design requirement of ours (no
    // outside source), far inside the 3-figure oracle above.
    for q in grid(600) {
        let exact = wall_proximity_factor_exact(q);
        let fast = wall_proximity_factor(q);
        assert!(
            ((fast - exact) / exact).abs() <= 1e-4,
            "p/d = {q}: fast {fast} vs exact {exact}"
        );
    }
    for q in [60.0, 100.0, 1e3, 1e6] {
        let exact = wall_proximity_factor_exact(q);
        let fast = wall_proximity_factor(q);
        assert!(((fast - exact) / exact).abs() <= 1e-4, "p/d = {q}");
    }
}

#[test]
fn monotone_decreasing_in_pitch() {
    // Physical expectation: wider spacing, weaker proximity effect.
    let qs: Vec<f64> = grid(400).collect();
    for pair in qs.windows(2) {
        let (a, b) = (pair[0], pair[1]);
        assert!(
            wall_proximity_factor_exact(b) < wall_proximity_factor_exact(a),
            "exact not decreasing between p/d = {a} and {b}"
        );
        assert!(
            wall_proximity_factor(b) < wall_proximity_factor(a),
            "fast path not decreasing between p/d = {a} and {b}"
        );
    }
}

#[test]
fn at_least_one_and_finite() {
    // Φ ≥ 1 (proximity only adds loss); the fast path clamps invalid inputs to p/d = 1.01.
    for q in grid(400) {
        for phi in [
            wall_proximity_factor_exact(q),
            wall_proximity_factor(q),
            wide_spacing_proximity_factor(q),
        ] {
            assert!(phi.is_finite() && phi >= 1.0, "p/d = {q}: Φ = {phi}");
        }
    }
    let first = wall_proximity_factor(1.01);
    for q in [
        1.0,
        0.5,
        0.0,
        -3.0,
        f64::NAN,
        f64::INFINITY,
        f64::NEG_INFINITY,
        1.005,
    ] {
        let phi = wall_proximity_factor(q);
        assert!(phi.is_finite() && phi >= 1.0, "p/d = {q}: Φ = {phi}");
        assert_eq!(
            phi, first,
            "p/d = {q} must clamp to the table's first entry"
        );
    }
    assert!((first - wall_proximity_factor_exact(1.01)).abs() < 1e-12);
    // Φ exists for every spacing from nearly touching up: at 1.0001 the order cap still
    // converges.
    let near = wall_proximity_factor_exact(1.0001);
    assert!(near.is_finite() && near >= 1.0);
}

//! Complete elliptic integrals against DLMF and an independent crate.
use approx::assert_relative_eq;
use tankwright::physics::elliptic::{complete_e, complete_k, complete_k_e};

/// NIST Digital Library of Mathematical Functions (DLMF), eq. 19.20.2:
/// R_F(0,1,2) = 1.31102877714605990523, and K(m = ½) = √2·R_F(0,1,2) = 1.8540746773013719184;
/// E(½) = 1.3506438810476755025 by Legendre's relation. K(½) and E(½) computed with
/// mpmath 1.3.0 (`ellipk`, `ellipe`) at 25 digits for this test; mpmath's `elliprf(0, 1, 2)`
/// reproduces DLMF's R_F to all 21 digits given.
#[test]
fn k_and_e_at_one_half_match_dlmf() {
    assert_relative_eq!(
        complete_k(0.5),
        1.854_074_677_301_371_9,
        max_relative = 4e-16
    );
    assert_relative_eq!(
        complete_k(0.5),
        2f64.sqrt() * 1.311_028_777_146_059_9,
        max_relative = 4e-16
    );
    assert_relative_eq!(
        complete_e(0.5),
        1.350_643_881_047_675_5,
        max_relative = 4e-16
    );
}

/// K(0.9) = 2.5780921133481731882, E(0.9) = 1.1047747327040733261 (parameter m = 0.9; computed
/// with mpmath 1.3.0 `ellipk`/`ellipe` at 25 digits for this test).
#[test]
fn k_and_e_at_nine_tenths() {
    assert_relative_eq!(
        complete_k(0.9),
        2.578_092_113_348_173_2,
        max_relative = 1e-15
    );
    assert_relative_eq!(
        complete_e(0.9),
        1.104_774_732_704_073_3,
        max_relative = 1e-15
    );
}

/// K(0) = E(0) = π/2 (DLMF 19.6.1).
#[test]
fn k_and_e_at_zero_are_half_pi() {
    assert_eq!(complete_k(0.0), std::f64::consts::FRAC_PI_2);
    assert_eq!(complete_e(0.0), std::f64::consts::FRAC_PI_2);
}

/// Against the `ellip` crate (1.2.0, parameter m) over a grid of m in [0, 0.999]. Its README
/// states a maximum error of 20.95 ε for `ellipk` and 3.00 ε for `ellipe` against Wolfram
/// data; the tolerance is that plus 4 ε for our AGM (ε = 2.22e-16). Where the two disagree
/// most (m = 0.85) mpmath at 30 digits gives K = 2.38901648632557999, which we match to 1 ε.
#[test]
fn k_and_e_agree_with_the_ellip_crate() {
    for i in 0..=999 {
        let m = f64::from(i) / 1000.0;
        let (k, e) = complete_k_e(m);
        let k_ref = ellip::ellipk(m).expect("ellipk defined on [0,1)");
        let e_ref = ellip::ellipe(m).expect("ellipe defined on [0,1]");
        assert_relative_eq!(k, k_ref, max_relative = 25.0 * f64::EPSILON);
        assert_relative_eq!(e, e_ref, max_relative = 7.0 * f64::EPSILON);
    }
}

/// mpmath 1.3.0 at 30 digits: K(0.85) = 2.3890164863255799933 (computed for this test).
#[test]
fn k_where_the_crates_differ_most() {
    assert_relative_eq!(
        complete_k(0.85),
        2.389_016_486_325_58,
        max_relative = 2.0 * f64::EPSILON
    );
}

/// Legendre's relation E·K′ + E′·K − K·K′ = π/2 (DLMF 19.7.1), with primes at 1 − m.
#[test]
fn legendre_relation_holds() {
    for i in 1..100 {
        let m = f64::from(i) / 100.0;
        let (k, e) = complete_k_e(m);
        let (kp, ep) = complete_k_e(1.0 - m);
        assert_relative_eq!(
            e * kp + ep * k - k * kp,
            std::f64::consts::FRAC_PI_2,
            max_relative = 1e-14
        );
    }
}

/// Outside the domain the functions return NaN rather than a wrong number; at m = 1, K diverges.
#[test]
fn domain_edges() {
    assert!(complete_k(-0.1).is_nan());
    assert!(complete_k(1.1).is_nan());
    assert!(complete_k(1.0).is_infinite());
    assert_eq!(complete_e(1.0), 1.0);
}

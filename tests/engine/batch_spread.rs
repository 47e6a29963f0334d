//! The batch sweep against the per-point path, and the spread band's two methods against each
//! other.

use tankwright::model::batch::{
    BatchPath, SweepColumns, column_form, resonance_over_capacitances, resonance_over_lengths,
};
use tankwright::model::evaluate::resonance_of;
use tankwright::model::{
    Coating, Coil, Conditions, DiameterSpec, Gauge, InductanceModel, SpacingSpec, Winding, WireSpec,
};
use tankwright::tuning::spread::{TankParts, Tolerances, spread, spread_band};
use tankwright::tuning::stray::Span;

fn coil(former: f64, wire: f64, turns: f64, length: f64, lead: f64) -> Coil {
    Coil::from_winding(&Winding {
        diameter: DiameterSpec::Former(former),
        wire: WireSpec {
            gauge: Gauge::Metric(wire),
            coating: Coating::EnamelGrade1,
        },
        turns,
        spacing: SpacingSpec::Length(length),
        lead_length: lead,
    })
    .expect("valid coil")
}

fn lengths_for(c: &Coil, n: usize, longest: f64) -> Vec<f64> {
    let lo = c.turns() * c.wire_overall();
    (0..n)
        .map(|i| lo + (longest - lo) * i as f64 / (n - 1) as f64)
        .collect()
}

/// The batch path is the per-point path rearranged: equal within 1e-9 relative (the per-point
/// solver's own stop), over VHF coils from stubby to long, several wires and every model (the
/// ones without a column form through the per-point fallback).
#[test]
fn batch_over_lengths_equals_per_point() {
    let cases = [
        (6e-3, 1.0e-3, 5.0, 5e-3, 20e-12),
        (8e-3, 0.8e-3, 3.5, 0.0, 10e-12),
        (10e-3, 1.5e-3, 8.0, 10e-3, 33e-12),
        (4e-3, 0.5e-3, 12.0, 3e-3, 4e-12),
        (25e-3, 2.0e-3, 2.0, 20e-3, 50e-12),
    ];
    let mut columns = SweepColumns::default();
    // Every model, so a new one is checked without editing this list: those with a column
    // form must take the fast path, the rest fall back; all give the per-point figures.
    for model in InductanceModel::ALL {
        let cond = Conditions {
            model,
            ..Conditions::default()
        };
        for &(former, wire, turns, lead, cap) in &cases {
            let c = coil(former, wire, turns, turns * wire * 1.5, lead);
            let lengths = lengths_for(&c, 1000, 60e-3);
            let mut out = vec![0.0; lengths.len()];
            let path = resonance_over_lengths(&c, cap, &cond, &lengths, &mut out, &mut columns);
            let expected = match column_form(model) {
                Some(_) => BatchPath::Columns,
                None => BatchPath::PerPoint,
            };
            assert_eq!(path, expected, "{model:?}: the fast path covers VHF coils");
            for (&l, &f) in lengths.iter().zip(&out) {
                let want = resonance_of(&c.with_length(l).unwrap(), cap, &cond);
                assert!(
                    ((f - want) / want).abs() < 1e-9,
                    "{model:?} former {former} turns {turns} length {l}: batch {f} per-point {want}"
                );
            }
        }
    }
}

#[test]
fn batch_over_capacitances_equals_per_point() {
    let cond = Conditions::default();
    let c = coil(6e-3, 1e-3, 5.0, 8e-3, 5e-3);
    let caps: Vec<f64> = (0..500).map(|i| 1e-12 + 0.2e-12 * i as f64).collect();
    let mut out = vec![0.0; caps.len()];
    let mut columns = SweepColumns::default();
    let path = resonance_over_capacitances(&c, &cond, &caps, &mut out, &mut columns);
    assert_eq!(path, BatchPath::Columns);
    for (&cap, &f) in caps.iter().zip(&out) {
        let want = resonance_of(&c, cap, &cond);
        assert!(((f - want) / want).abs() < 1e-9, "C {cap}: {f} vs {want}");
    }
}

/// Outside the fast path (the filament sum drives; a hair-thin wire at a low frequency, where
/// r/δ < 10) the batch falls back to the per-point path: the results are the same figures.
#[test]
fn batch_falls_back_where_the_fast_path_does_not_hold() {
    let mut columns = SweepColumns::default();
    let thin = coil(5e-3, 0.05e-3, 40.0, 10e-3, 0.0);
    let cond = Conditions::default();
    let lengths = lengths_for(&thin, 50, 40e-3);
    let mut out = vec![0.0; lengths.len()];
    let path = resonance_over_lengths(&thin, 2e-9, &cond, &lengths, &mut out, &mut columns);
    assert_eq!(path, BatchPath::PerPoint);
    for (&l, &f) in lengths.iter().zip(&out) {
        let want = resonance_of(&thin.with_length(l).unwrap(), 2e-9, &cond);
        assert!(((f - want) / want).abs() < 1e-12);
    }
    let fil = Conditions {
        model: InductanceModel::FilamentSum,
        ..Conditions::default()
    };
    let c = coil(6e-3, 1e-3, 5.0, 8e-3, 5e-3);
    let lengths = lengths_for(&c, 20, 20e-3);
    let mut out = vec![0.0; lengths.len()];
    let path = resonance_over_lengths(&c, 20e-12, &fil, &lengths, &mut out, &mut columns);
    assert_eq!(path, BatchPath::PerPoint);
    for (&l, &f) in lengths.iter().zip(&out) {
        let want = resonance_of(&c.with_length(l).unwrap(), 20e-12, &fil);
        assert!(((f - want) / want).abs() < 1e-12);
    }
}

fn demo_tolerances() -> Tolerances {
    Tolerances {
        former_diameter: 0.1e-3,
        length: 0.5e-3,
        wire_diameter: 0.02e-3,
        turns: 0.25,
        fixed_fraction: 0.05,
        stray: Span::new(3e-12, 5e-12, 8e-12),
    }
}

const TANK: TankParts = TankParts {
    fixed: 15e-12,
    other: 4e-12,
};

/// Monte Carlo (2000 draws) and linear propagation agree on the spread's standard deviation.
/// The draws' σ has a sampling error of about √((κ − 1)/(4n)) relative (κ the kurtosis, at
/// most 3 for these sums of uniform and triangular inputs: ≤ 1.6 % at n = 2000); the linear
/// method's own error is second order in the tolerances (well under 1 % here). 5 % allows
/// three standard errors.
#[test]
fn monte_carlo_and_linear_propagation_agree() {
    let c = coil(6e-3, 1e-3, 5.0, 8e-3, 5e-3);
    let s = spread(
        &c,
        &TANK,
        &Conditions::default(),
        &demo_tolerances(),
        2000,
        7,
    );
    let ratio = s.draws_sigma / s.linear_sigma;
    assert!((ratio - 1.0).abs() < 0.05, "σ MC/linear = {ratio}");
    // Both contain the nominal; the draws' full range contains the linear 95 % band.
    assert!(s.expected.0 < s.nominal && s.nominal < s.expected.1);
    assert!(s.linear_band.0 < s.nominal && s.nominal < s.linear_band.1);
    assert!(s.draws_range.0 <= s.linear_band.0 && s.linear_band.1 <= s.draws_range.1);
    // The shares of the variance add to one.
    let total: f64 = s.shares.iter().sum();
    assert!((total - 1.0).abs() < 1e-12);
}

/// The band as drawn: at the coil's own length it matches the point spread (same seed, same
/// draws: the length tolerance enters the same way), and every point's band holds the curve.
#[test]
fn band_over_lengths_holds_the_curve() {
    let c = coil(6e-3, 1e-3, 5.0, 8e-3, 5e-3);
    let cond = Conditions::default();
    let lengths = lengths_for(&c, 60, 20e-3);
    let band = spread_band(&c, &TANK, &cond, &demo_tolerances(), &lengths, 1000, 3);
    for [l, lo, hi] in band {
        let f = resonance_of(
            &c.with_length(l).unwrap(),
            TANK.fixed + TANK.other + 5e-12,
            &cond,
        );
        assert!(lo < f && f < hi, "length {l}: {lo} {f} {hi}");
    }
}

/// The band at the coil's own length is the point spread's central 95 %: the same seed draws
/// the same builds in the same order, one through the batch path and one point by point.
#[test]
fn band_at_the_coil_length_is_the_point_spread() {
    let c = coil(6e-3, 1e-3, 5.0, 8e-3, 5e-3);
    let cond = Conditions::default();
    let band = spread_band(
        &c,
        &TANK,
        &cond,
        &demo_tolerances(),
        &[c.length()],
        1000,
        11,
    );
    let point = spread(&c, &TANK, &cond, &demo_tolerances(), 1000, 11);
    let [_, lo, hi] = band[0];
    assert!(
        ((lo - point.expected.0) / lo).abs() < 1e-9,
        "{lo} vs {:?}",
        point.expected
    );
    assert!(
        ((hi - point.expected.1) / hi).abs() < 1e-9,
        "{hi} vs {:?}",
        point.expected
    );
}

/// Medhurst's table found without a search: a fine sweep of l/D from below the table's first
/// entry (0.1) to beyond its last (50), so every segment, every boundary and both extended
/// ends are crossed, equal to the per-point path (which searches).
#[test]
fn batch_crosses_every_medhurst_segment() {
    let cond = Conditions::default();
    let mut columns = SweepColumns::default();
    // Former 60 mm, 2 turns of 2 mm wire: close-wound l/D ≈ 0.07.
    let wide = coil(60e-3, 2e-3, 2.0, 5e-3, 0.0);
    // Former 1.2 mm, 10 turns of 0.3 mm wire: l/D up to 70 at 105 mm.
    let slim = coil(1.2e-3, 0.3e-3, 10.0, 4e-3, 0.0);
    for (c, longest) in [(&wide, 0.9), (&slim, 105e-3)] {
        let lengths = lengths_for(c, 5000, longest);
        let ld_first = lengths[0] / c.mean_diameter();
        let ld_last = lengths[lengths.len() - 1] / c.mean_diameter();
        let mut out = vec![0.0; lengths.len()];
        let path = resonance_over_lengths(c, 10e-12, &cond, &lengths, &mut out, &mut columns);
        assert_eq!(path, BatchPath::Columns);
        for (&l, &f) in lengths.iter().zip(&out) {
            let want = resonance_of(&c.with_length(l).unwrap(), 10e-12, &cond);
            assert!(
                ((f - want) / want).abs() < 1e-9,
                "l/D {}: {f} vs {want}",
                l / c.mean_diameter()
            );
        }
        assert!(ld_first < 0.1 || ld_last > 50.0, "{ld_first}–{ld_last}");
    }
}

/// A bench calibration scales the driving inductance (coil and leads); the batch path scales it
/// as the per-point path does, so the calibrated charts and bands equal it within 1e-9 too.
#[test]
fn batch_honours_the_calibrated_inductance_scale() {
    let mut columns = SweepColumns::default();
    let c = coil(6e-3, 1e-3, 5.0, 8e-3, 5e-3);
    for scale in [0.93, 1.0, 1.07] {
        let cond = Conditions {
            inductance_scale: scale,
            ..Conditions::default()
        };
        let lengths = lengths_for(&c, 200, 20e-3);
        let mut out = vec![0.0; lengths.len()];
        let path = resonance_over_lengths(&c, 20e-12, &cond, &lengths, &mut out, &mut columns);
        assert_eq!(path, BatchPath::Columns);
        for (&l, &f) in lengths.iter().zip(&out) {
            let want = resonance_of(&c.with_length(l).unwrap(), 20e-12, &cond);
            assert!(
                ((f - want) / want).abs() < 1e-9,
                "scale {scale} l {l}: {f} vs {want}"
            );
        }
        let caps: Vec<f64> = (0..50).map(|i| 5e-12 + 0.5e-12 * i as f64).collect();
        let mut out = vec![0.0; caps.len()];
        resonance_over_capacitances(&c, &cond, &caps, &mut out, &mut columns);
        for (&cap, &f) in caps.iter().zip(&out) {
            let want = resonance_of(&c, cap, &cond);
            assert!(
                ((f - want) / want).abs() < 1e-9,
                "scale {scale} C {cap}: {f} vs {want}"
            );
        }
    }
}

/// The spacing chart's sweep runs on the batch path: every point equals the per-point path
/// within 1e-9 (its own stop), at each trimmer setting, calibrated or not.
#[test]
fn spacing_sweep_equals_the_per_point_path() {
    use tankwright::tuning::sweep::spacing_sweep;
    let c = coil(6e-3, 1e-3, 5.0, 8e-3, 5e-3);
    // The demo's tank (invented data): 6.8 pF fixed, 2–10 pF trimmer at half, 6 pF stray, the
    // 10/22 pF divider.
    let tank = tankwright::recipe::Recipe::demo().tank;
    for scale in [1.0, 1.04] {
        let cond = Conditions {
            inductance_scale: scale,
            ..Conditions::default()
        };
        let curves = spacing_sweep(&c, &tank, &cond, &[0.0, 0.5, 1.0], (5e-3, 16e-3), 240);
        assert_eq!(curves.len(), 3);
        for curve in &curves {
            assert_eq!(curve.points.len(), 240);
            let cap = tank.external_capacitance_at(curve.setting);
            for &[l, f] in &curve.points {
                let want = resonance_of(&c.with_length(l).unwrap(), cap, &cond);
                assert!(((f - want) / want).abs() < 1e-9, "l {l}: {f} vs {want}");
            }
        }
    }
}

/// The chart's band is linear propagation over the lengths through the batch path: at each
/// length it is the point spread's linear band (whose σ the Monte Carlo draws hold in
/// `monte_carlo_and_linear_propagation_agree`). Bound: the two paths agree within 1e-9 f, and
/// each slope is a difference over 2h = 2e-3 of the input's bound, so a slope may differ by
/// 1e-9 f/h and its share of σ (× bound/√3) by 1e-9 f/(1e-3·√3) ≈ 5.8e-7 f; six inputs and the
/// factor 1.96 give at most 7e-6 f on an edge.
#[test]
fn linear_band_is_the_point_spread_at_every_length() {
    use tankwright::tuning::spread::linear_band;
    let c = coil(6e-3, 1e-3, 5.0, 8e-3, 5e-3);
    let cond = Conditions::default();
    let lengths = lengths_for(&c, 12, 20e-3);
    // Start beyond the close-wound length, where the turns and wire can move both ways.
    let lengths = &lengths[2..];
    let band = linear_band(&c, &TANK, &cond, &demo_tolerances(), lengths);
    for [l, lo, hi] in band {
        let point = spread(
            &c.with_length(l).unwrap(),
            &TANK,
            &cond,
            &demo_tolerances(),
            0,
            1,
        );
        let (want_lo, want_hi) = point.linear_band;
        let bound = 7e-6 * point.nominal;
        assert!((lo - want_lo).abs() < bound, "l {l}: {lo} vs {want_lo}");
        assert!((hi - want_hi).abs() < bound, "l {l}: {hi} vs {want_hi}");
        // Both contain the nominal.
        assert!(lo < point.nominal && point.nominal < hi);
    }
}

/// A normal draw (Box–Muller) from two uniform ones.
fn normal(rng: &mut rand_xoshiro::Xoshiro256PlusPlus) -> f64 {
    use rand_core::Rng;
    let unit = |rng: &mut rand_xoshiro::Xoshiro256PlusPlus| {
        ((rng.next_u64() >> 11) as f64 + 0.5) * (1.0 / (1u64 << 53) as f64)
    };
    let (u, v) = (unit(rng), unit(rng));
    (-2.0 * u.ln()).sqrt() * (2.0 * std::f64::consts::PI * v).cos()
}

/// After a calibration the band is what the fit's errors leave (linear propagation of the
/// fit's covariance, Press et al. 2007 §15.4–15.5): refitting many noisy copies of the same
/// readings scatters the calibrated prediction at another length by the band's σ. Three
/// readings at three trimmer settings (the fit separates inductance from capacitance), 20 ppm
/// counter error; 300 refits give σ to about 1/√(2·299) ≈ 4 % (one standard error), so the
/// check allows three, 12 %.
#[test]
fn calibrated_band_matches_the_scatter_of_refits() {
    use rand_core::SeedableRng;
    use tankwright::model::Tank;
    use tankwright::tuning::fit::{Reading, fit};
    use tankwright::tuning::spread::calibrated_band;
    let c = coil(6e-3, 1e-3, 5.0, 8e-3, 5e-3);
    let cond = Conditions::default();
    let tank = Tank {
        fixed: 6.8e-12,
        trimmer_min: 2e-12,
        trimmer_max: 10e-12,
        trimmer_setting: 0.5,
        stray: 3e-12,
        feedback: None,
    };
    // The build as it really is: 1.5 pF more than the model, 3 % more inductance.
    let truth_tank = Tank {
        stray: tank.stray + 1.5e-12,
        ..tank
    };
    let truth = Conditions {
        inductance_scale: 1.03,
        ..cond
    };
    let ppm = 20.0;
    let exact: Vec<Reading> = [0.0, 0.5, 1.0]
        .iter()
        .map(|&s| Reading {
            measured: resonance_of(&c, truth_tank.external_capacitance_at(s), &truth),
            length: c.length(),
            trimmer_setting: s,
            added_capacitance: 0.0,
            error_ppm: Some(ppm),
            added_tolerance: None,
        })
        .collect();
    let at = 12e-3;
    let predict = |f: &tankwright::tuning::fit::Fit| {
        resonance_of(
            &c.with_length(at).unwrap(),
            f.calibration.tank(&tank).external_capacitance(),
            &f.calibration.conditions(&cond),
        )
    };
    let exact_fit = fit(&c, &tank, &cond, &exact).unwrap();
    assert!(exact_fit.inductance_scale_error.is_some(), "s is fitted");
    let band = calibrated_band(
        &c,
        exact_fit.calibration.tank(&tank).external_capacitance(),
        &exact_fit.calibration.conditions(&cond),
        &exact_fit,
        &[at],
    );
    let [_, lo, hi] = band[0];
    let centre = predict(&exact_fit);
    assert!(lo < centre && centre < hi);
    let sigma_band = (hi - lo) / (2.0 * 1.96);

    let mut rng = rand_xoshiro::Xoshiro256PlusPlus::seed_from_u64(5);
    let n = 300;
    let predictions: Vec<f64> = (0..n)
        .map(|_| {
            let noisy: Vec<Reading> = exact
                .iter()
                .map(|r| Reading {
                    measured: r.measured * (1.0 + ppm * 1e-6 * normal(&mut rng)),
                    ..*r
                })
                .collect();
            predict(&fit(&c, &tank, &cond, &noisy).unwrap())
        })
        .collect();
    let mean = predictions.iter().sum::<f64>() / n as f64;
    let sigma =
        (predictions.iter().map(|p| (p - mean).powi(2)).sum::<f64>() / (n - 1) as f64).sqrt();
    let ratio = sigma / sigma_band;
    assert!(
        (ratio - 1.0).abs() < 0.12,
        "σ of refits {sigma} Hz vs band σ {sigma_band} Hz"
    );
    // And the calibrated band is far narrower than the spread before measurement.
    let before = spread(
        &c.with_length(at).unwrap(),
        &TankParts {
            fixed: tank.fixed,
            other: tank.external_capacitance() - tank.fixed - tank.stray,
        },
        &cond,
        &Tolerances {
            stray: Span::new(1e-12, 3e-12, 6e-12),
            ..demo_tolerances()
        },
        0,
        1,
    );
    assert!(hi - lo < 0.1 * (before.linear_band.1 - before.linear_band.0));
}

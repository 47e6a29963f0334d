//! The calibration on the field-led model: readings synthesised from the field solution with
//! a known extra capacitance and inductance scale are recovered within their errors; a
//! reading the fit suspects of being a harmonic is left out; a clipped-on capacitor's
//! tolerance enters the errors.
//!
//! Method: weighted least squares (Press et al., *Numerical Recipes*, 3rd ed., 2007,
//! §15.4–15.5). The clip-on check follows from the straight line f⁻² = 4π²·L·(C + C_h)
//! (Press et al. §15.2): two readings without and with a capacitor Cₐ give L from the
//! difference of f⁻² over Cₐ, so a part ε off moves the inductance by ε/(1 + ε) and the
//! hidden capacitance by ε·(C + C_h) (to first order).

use tankwright::model::Coil;
use tankwright::recipe::{BenchEntry, Recipe, figures};
use tankwright::tuning::field_tank::field_tank_scaled;
use tankwright::tuning::fit::{CLIP_ON_TOLERANCE, FitWarning};

/// The bench demo with readings of a build whose tank holds `extra` farads more than the
/// recipe and whose inductance is `scale` × the field solution's, read at the given
/// (trimmer setting, clipped-on capacitance) pairs.
fn with_readings(extra: f64, scale: f64, at: &[(f64, f64)], error_ppm: f64) -> Recipe {
    let mut r = Recipe::demo();
    let coil = Coil::from_winding(&r.winding).expect("valid");
    for &(setting, added) in at {
        let measured = field_tank_scaled(
            &coil,
            r.tank.external_capacitance_at(setting) + added + extra,
            &r.conditions,
            scale,
        )
        .expect("solves")
        .resonance;
        r.bench_log.push(BenchEntry {
            include_anyway: false,
            measured,
            length: coil.length(),
            trimmer_setting: setting,
            added_capacitance: added,
            instrument: "counter".to_owned(),
            error_ppm: Some(error_ppm),
            note: String::new(),
            added_tolerance: None,
        });
    }
    r
}

#[test]
fn a_suspected_harmonic_is_left_out_and_the_build_is_still_recovered() {
    let (extra, scale) = (0.5e-12, 1.01);
    let mut r = with_readings(extra, scale, &[(0.0, 0.0), (1.0, 0.0)], 1.0);
    let clean = figures(&r).expect("valid");
    let clean_fit = clean.fit.clone().expect("readings").expect("fits");
    // Recovered within the fit's errors (readings exact to the field solution's 1e-9).
    let e_c = clean_fit.extra_capacitance_error;
    let e_s = clean_fit
        .inductance_scale_error
        .expect("the scale is fitted");
    assert!((clean_fit.calibration.extra_capacitance - extra).abs() <= e_c.max(2e-15));
    assert!((clean_fit.calibration.inductance_scale - scale).abs() <= e_s.max(2e-6));
    // A third reading at twice the tank's frequency (the counter caught the second
    // harmonic).
    let mut third = r.bench_log[0].clone();
    third.measured *= 2.0;
    r.bench_log.push(third);
    let f = figures(&r).expect("valid");
    let fit = f.fit.clone().expect("readings").expect("fits");
    assert_eq!(fit.readings_used, 2);
    assert!(
        fit.warnings.iter().any(|w| matches!(
            w,
            FitWarning::Harmonic {
                reading: 2,
                left_out: true,
                ..
            }
        )),
        "{:?}",
        fit.warnings
    );
    assert!(
        fit.warnings
            .iter()
            .any(|w| w.to_string().contains("left out of the calibration"))
    );
    assert_eq!(fit.calibration, clean_fit.calibration);
    assert_eq!(fit.residuals.len(), 3);
}

#[test]
fn the_clipped_on_capacitors_tolerance_enters_the_errors() {
    let (extra, scale) = (0.8e-12, 0.98);
    let added = 10e-12;
    let r = with_readings(extra, scale, &[(0.5, 0.0), (0.5, added)], 1.0);
    let f = figures(&r).expect("valid");
    let fit = f.fit.clone().expect("readings").expect("fits");
    let e_s = fit.inductance_scale_error.expect("the scale is fitted");
    let e_c = fit.extra_capacitance_error;
    // First order (see the module's note): the scale moves by ε/(1 + ε) of itself and the
    // hidden capacitance by ε·(C + C_h), C_h here taken as what the field-led tank holds
    // beyond the recipe's external capacitance (the extra; the coil's own capacitance is in
    // its apparent inductance). Second-order terms are some ε² = 0.25 % of these.
    let eps = CLIP_ON_TOLERANCE;
    let expected_scale = scale * eps / (1.0 + eps);
    let expected_c = eps * (r.tank.external_capacitance_at(0.5) + extra);
    eprintln!(
        "scale ±{e_s:.4} (first order {expected_scale:.4}); stray ±{:.2} pF (first order {:.2} pF)",
        e_c * 1e12,
        expected_c * 1e12
    );
    assert!((e_s / expected_scale - 1.0).abs() <= 0.1, "{e_s}");
    assert!(e_c >= 0.5 * expected_c, "{e_c}");
    // Still recovered within those errors.
    assert!((fit.calibration.inductance_scale - scale).abs() <= e_s);
    assert!((fit.calibration.extra_capacitance - extra).abs() <= e_c);
}

/// Issue 24: the clip-on capacitor's tolerance kept with the reading. A 1 % part (stated on
/// the reading) leaves the scale ε/(1 + ε) with ε = 0.01 (the same first-order line as the
/// test above), a fifth of the ±5 % taken when nothing is stated.
#[test]
fn a_clip_on_tolerance_stated_with_the_reading_is_the_one_used() {
    let (extra, scale) = (0.8e-12, 0.98);
    let added = 10e-12;
    let mut r = with_readings(extra, scale, &[(0.5, 0.0), (0.5, added)], 1.0);
    r.bench_log[1].added_tolerance = Some(0.01);
    let fit = figures(&r)
        .expect("valid")
        .fit
        .expect("readings")
        .expect("fits");
    let e_s = fit.inductance_scale_error.expect("the scale is fitted");
    let eps = 0.01;
    let expected_scale = scale * eps / (1.0 + eps);
    // The readings' own error (1 ppm) adds in quadrature: small beside 0.0097.
    assert!(
        (e_s / expected_scale - 1.0).abs() <= 0.1,
        "{e_s} against {expected_scale}"
    );
    assert!((fit.calibration.inductance_scale - scale).abs() <= e_s);
}

#[test]
fn the_field_solved_self_capacitance_resonates_the_meter_inductance_at_the_self_resonance() {
    use tankwright::recipe::demos;
    use tankwright::tuning::field_tank::{field_tank, ratio_in_words};
    for (name, r) in demos().into_iter().take(2) {
        let coil = Coil::from_winding(&r.winding).expect("valid");
        let t = field_tank(&coil, r.tank.external_capacitance(), &r.conditions).expect("solves");
        let c_self = t.self_capacitance();
        // Thomson's formula both ways: the lumped pair resonates at the self-resonance.
        let f = 1.0 / (2.0 * std::f64::consts::PI * (t.low_frequency_inductance * c_self).sqrt());
        assert!((f / t.self_resonance - 1.0).abs() < 1e-12);
        // The meter's inductance lies below the apparent inductance at the operating
        // frequency (X/ω rises towards the self-resonance), by about (f/f_self)².
        let rise = t.apparent_inductance / t.low_frequency_inductance - 1.0;
        let lumped = 1.0 / (1.0 - (t.resonance / t.self_resonance).powi(2)) - 1.0;
        // This coil's own ratio of Medhurst's capacitance and the lumped self-resonance to
        // the field solution's (the labels' figure).
        let a = tankwright::model::evaluate(&r.winding, &r.tank, &r.conditions).expect("valid");
        let classical = format!(
            "Medhurst {}, lumped self-resonance {}",
            ratio_in_words(a.self_capacitance, c_self).expect("a ratio"),
            ratio_in_words(a.self_resonance.lumped, t.self_resonance).expect("a ratio")
        );
        eprintln!(
            "{name}: L₀ {:.2} nH, apparent {:.2} nH (rise {:.4}, lumped {lumped:.4}), \
             C_self {:.3} pF; {classical}",
            t.low_frequency_inductance * 1e9,
            t.apparent_inductance * 1e9,
            rise,
            c_self * 1e12
        );
        // Within a tenth of itself: the lumped picture holds this far below the
        // self-resonance (the coils' operating points are at a tenth of it or less).
        assert!((rise / lumped - 1.0).abs() < 0.1, "{rise} vs {lumped}");
    }
}

/// Issue 20: a reading the fit suspects of being a harmonic is left out until the user
/// includes it ([`BenchEntry::include_anyway`]); included, it is one of the readings the
/// weighted least squares (Press et al., *Numerical Recipes*, 3rd ed., 2007, §15.4) minimise,
/// so its residual falls and the calibration moves towards it, and the warning says it is in.
/// The readings are synthesised from the field solution of the demo's coil (the truth), one
/// of them at twice the tank's frequency (a counter on the second harmonic).
#[test]
fn a_suspected_harmonic_is_used_once_included() {
    let (extra, scale) = (0.5e-12, 1.01);
    let mut r = with_readings(extra, scale, &[(0.0, 0.0), (1.0, 0.0)], 1.0);
    let mut third = r.bench_log[0].clone();
    third.measured *= 2.0;
    r.bench_log.push(third);
    let left = figures(&r)
        .expect("valid")
        .fit
        .expect("readings")
        .expect("fits");
    assert_eq!(left.readings_used, 2, "left out by default");
    r.bench_log[2].include_anyway = true;
    let used = figures(&r)
        .expect("valid")
        .fit
        .expect("readings")
        .expect("fits");
    assert_eq!(used.readings_used, 3, "used once included");
    assert!(
        used.warnings.iter().any(|w| matches!(
            w,
            FitWarning::Harmonic {
                reading: 2,
                left_out: false,
                included: true,
                ..
            }
        )),
        "{:?}",
        used.warnings
    );
    assert!(
        used.warnings
            .iter()
            .any(|w| w.to_string().contains("because you included it"))
    );
    // In the least squares: its residual is smaller than when it was left out, and the
    // calibration is pulled off the truth (the reading is not the tank's resonance).
    eprintln!(
        "residual of the 2x reading: left out {:.1} kHz, included {:.1} kHz; stray {:.3} -> {:.3} pF",
        left.residuals[2] * 1e-3,
        used.residuals[2] * 1e-3,
        left.calibration.extra_capacitance * 1e12,
        used.calibration.extra_capacitance * 1e12
    );
    assert!(used.residuals[2].abs() < left.residuals[2].abs());
    assert!(
        (used.calibration.extra_capacitance - extra).abs()
            > (left.calibration.extra_capacitance - extra).abs()
    );
    // Its residual far beyond the counter's 1 ppm is flagged.
    assert!(
        used.warnings
            .iter()
            .any(|w| matches!(w, FitWarning::Inconsistent { .. })),
        "{:?}",
        used.warnings
    );
}

/// Issue 20: the shipped demos' bench readings are consistent with the model they are
/// fitted on: every residual within the fit's flag limit of three instrument errors
/// (`RESIDUAL_LIMIT`; common practice for a reading's consistency), no reading suspected of
/// being a harmonic, and no fit warning of inconsistency. (The 2 m demo once fitted with
/// residuals of −858 and +213 kHz, 573 × its instrument error.) Weighted least squares: Press
/// et al., *Numerical Recipes*, 3rd ed., 2007, §15.4.
#[test]
fn the_shipped_demos_readings_fit_within_their_instrument_errors() {
    use tankwright::tuning::fit::RESIDUAL_LIMIT;
    let mut fitted = 0;
    for (name, r) in tankwright::recipe::demos() {
        if r.bench_log.is_empty() {
            continue;
        }
        let fit = figures(&r)
            .expect("valid")
            .fit
            .expect("readings")
            .unwrap_or_else(|e| panic!("{name}: {e}"));
        for (i, (res, sigma)) in fit.residuals.iter().zip(&fit.sigmas).enumerate() {
            eprintln!(
                "{name}: reading {} off the fit by {:+.3} kHz (instrument ±{:.2} kHz)",
                i + 1,
                res * 1e-3,
                sigma * 1e-3
            );
            assert!(
                res.abs() <= RESIDUAL_LIMIT * sigma,
                "{name}: reading {}",
                i + 1
            );
        }
        assert!(
            !fit.warnings.iter().any(|w| matches!(
                w,
                FitWarning::Harmonic { .. } | FitWarning::Inconsistent { .. }
            )),
            "{name}: {:?}",
            fit.warnings
        );
        fitted += 1;
    }
    assert!(fitted >= 2, "the demos with readings: {fitted}");
}

//! Solvers and the correction from a bench measurement.

use tankwright::model::evaluate::resonance_of;
use tankwright::model::{
    Coating, Coil, Conditions, DiameterSpec, Gauge, SpacingSpec, Tank, Winding, WireSpec,
};
use tankwright::tuning::fit::{Reading, fit};
use tankwright::tuning::solve::{
    Unreachable, length_for_target, setting_for_target, stretch_sensitivity, trimmer_window,
};

fn demo_coil() -> Coil {
    Coil::from_winding(&Winding {
        diameter: DiameterSpec::Former(6e-3),
        wire: WireSpec {
            gauge: Gauge::Metric(1e-3),
            coating: Coating::Bare,
        },
        turns: 5.0,
        spacing: SpacingSpec::Length(8e-3),
        lead_length: 5e-3,
    })
    .expect("valid")
}

/// Thomson's formula f = 1/(2π√(LC)): with L fixed, adding ΔC scales f by √(C/(C+ΔC)). The
/// engine's L moves with frequency only through the wire's internal inductance (a few ppm
/// here), so the scaling must hold to 1e-4.
#[test]
fn resonance_scales_as_thomson_with_capacitance() {
    let coil = demo_coil();
    let cond = Conditions::default();
    let c_self = tankwright::physics::medhurst::self_capacitance(
        coil.mean_diameter(),
        coil.length_over_diameter(),
    );
    let f1 = resonance_of(&coil, 20e-12, &cond);
    let f2 = resonance_of(&coil, 30e-12, &cond);
    let expected = ((20e-12 + c_self) / (30e-12 + c_self)).sqrt();
    assert!(
        (f2 / f1 - expected).abs() < 1e-4,
        "{} vs {expected}",
        f2 / f1
    );
}

/// A reading made with a hidden extra capacitance is fitted back to that capacitance, and the
/// corrected length lands the target when the extra capacitance is really there.
#[test]
fn a_measurement_is_corrected_to_the_target() {
    let coil = demo_coil();
    let cond = Conditions::default();
    let c_ext = 26e-12;
    let tank = Tank::fixed_only(c_ext, 0.0);
    let hidden = 2.2e-12;
    let measured = resonance_of(&coil, c_ext + hidden, &cond);
    let target = 98.7e6;
    let reading = Reading {
        include_anyway: false,
        measured,
        length: coil.length(),
        trimmer_setting: 0.0,
        added_capacitance: 0.0,
        error_ppm: Some(1.0),
        added_tolerance: None,
    };
    let fitted = fit(&coil, &tank, &cond, &[reading]).expect("reachable");
    let extra = fitted.calibration.extra_capacitance;
    assert!((extra - hidden).abs() < 1e-16, "{extra}");
    assert_eq!(
        fitted.inductance_scale_error, None,
        "one reading cannot give the scale"
    );
    let calibrated = fitted.calibration.tank(&tank);
    let length = length_for_target(&coil, calibrated.external_capacitance(), &cond, target)
        .expect("a length exists");
    let landed = resonance_of(&coil.with_length(length).unwrap(), c_ext + hidden, &cond);
    assert!((landed - target).abs() < 1.0, "{landed}");
    // More capacitance than assumed: the coil must be stretched (less L) to come back up.
    assert!(length > coil.length());
}

#[test]
fn solvers_land_on_their_targets() {
    let coil = demo_coil();
    let cond = Conditions::default();
    let tank = Tank {
        fixed: 6.8e-12,
        trimmer_min: 2e-12,
        trimmer_max: 10e-12,
        trimmer_setting: 0.5,
        stray: 6e-12,
        feedback: None,
    };
    let (low, high) = trimmer_window(&coil, &tank, &cond);
    assert!(low < high);
    let mid = 0.5 * (low + high);
    let s = setting_for_target(&coil, &tank, &cond, mid).expect("inside the window");
    let f = resonance_of(&coil, tank.external_capacitance_at(s), &cond);
    assert!((f - mid).abs() < 1.0);
    assert!(matches!(
        setting_for_target(&coil, &tank, &cond, high * 1.1),
        Err(Unreachable::OutsideTrimmer { .. })
    ));
    // Bare turns stay 0.1 mm apart, so the closest this coil gets is 100.6 MHz across 20 pF.
    let l = length_for_target(&coil, 20e-12, &cond, 105e6).expect("reachable");
    assert!((resonance_of(&coil.with_length(l).unwrap(), 20e-12, &cond) - 105e6).abs() < 1.0);
    assert!(matches!(
        length_for_target(&coil, 20e-12, &cond, 1e6),
        Err(Unreachable::AboveEvenCloseWound { .. })
    ));
}

/// Stretch moves a 5-turn FM coil by MHz per millimetre: "stretching a 4-turn coil by a couple
/// of millimetres moves it by several MHz" (common practice).
#[test]
fn stretch_sensitivity_is_megahertz_per_millimetre() {
    let per_mm = stretch_sensitivity(&demo_coil(), 26e-12, &Conditions::default()) * 1e-3;
    assert!(per_mm > 1e6 && per_mm < 10e6, "{per_mm} Hz/mm");
}

/// An instrument error of 10 ppm on 100 MHz is 1 kHz; at 1 MHz per mm of stretch that is
/// 1 µm of length (arithmetic of the definition of ppm).
#[test]
fn instrument_error_as_length() {
    let reading = Reading {
        include_anyway: false,
        measured: 100e6,
        length: 8e-3,
        trimmer_setting: 0.0,
        added_capacitance: 0.0,
        error_ppm: Some(10.0),
        added_tolerance: None,
    };
    let sigma = reading.sigma();
    assert!((sigma - 1e3).abs() < 1e-9, "{sigma}");
    let u = tankwright::tuning::fit::length_uncertainty(sigma, 1e6 / 1e-3).expect("moves");
    assert!((u - 1e-6).abs() < 1e-18, "{u}");
    assert!(tankwright::tuning::fit::length_uncertainty(sigma, 0.0).is_none());
}

/// Where the resonance turns over against length (a large coil of few turns with long leads
/// and almost no external capacitance: stretching shrinks the coil's inductance but grows
/// Medhurst's self-capacitance, and the leads' inductance does not shrink), a target below the
/// peak is reached at two lengths. The solver brackets both on its scan and each, evaluated
/// again, lands within 1 kHz; the proposal is the one nearest the present length.
#[test]
fn a_turning_curve_gives_both_roots() {
    let coil = Coil::from_winding(&Winding {
        diameter: DiameterSpec::Former(30e-3),
        wire: WireSpec {
            gauge: Gauge::Metric(1e-3),
            coating: Coating::EnamelGrade1,
        },
        turns: 3.0,
        spacing: SpacingSpec::Length(10e-3),
        lead_length: 100e-3,
    })
    .expect("valid");
    let cond = Conditions::default();
    let c_ext = 0.2e-12;
    let lo = coil.shortest_length();
    let hi = coil.longest_proposed_length();
    let f_at = |l: f64| resonance_of(&coil.with_length(l).unwrap(), c_ext, &cond);
    let scan: Vec<f64> = (0..200)
        .map(|i| f_at(lo + (hi - lo) * f64::from(i) / 199.0))
        .collect();
    let (peak_i, peak) = scan
        .iter()
        .copied()
        .enumerate()
        .max_by(|a, b| a.1.total_cmp(&b.1))
        .unwrap();
    assert!(
        peak_i > 0 && peak_i < 199,
        "this coil's resonance does not turn over inside the range (peak at {peak_i})"
    );
    let target = peak - 0.3 * (peak - scan[0].max(scan[199]));
    let roots = tankwright::tuning::solve::lengths_for_target(&coil, c_ext, &cond, target)
        .expect("reachable");
    assert_eq!(roots.len(), 2, "{roots:?}");
    for l in &roots {
        assert!((f_at(*l) - target).abs() < 1e3, "{l}: {}", f_at(*l));
    }
    let chosen = length_for_target(&coil, c_ext, &cond, target).unwrap();
    let nearest = roots
        .iter()
        .copied()
        .min_by(|a, b| {
            (a - coil.length())
                .abs()
                .total_cmp(&(b - coil.length()).abs())
        })
        .unwrap();
    assert_eq!(chosen, nearest);
}

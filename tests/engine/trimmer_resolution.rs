//! Trimmer advice at the resolution of a hand: when a whole per cent of the trimmer's travel
//! moves the tank more than the channel's tolerance, the advice says so and proposes a
//! smaller trimmer or a series capacitor, and every place that shows the advice (the figures'
//! verdict, the build sheet) shows the same instruction.
//!
//! Sources: the tank resonates at f = 1/(2π√(LC)) (Thomson's formula; any circuits text,
//! e.g. F. E. Terman, "Radio Engineers' Handbook", 1943, section 3); capacitors in series
//! add as reciprocals, 1/C = 1/C₁ + 1/C₂ (ibid.). The proposed parts are held to exact field
//! solves of the tank they make (`FieldLed::resonance`, the model every instruction lands
//! on; the field solution itself is held to nec2c in tests/engine/reference_field.rs). A
//! hand's step of one per cent of travel is common practice.

use tankwright::handout::sheet;
use tankwright::model::SpacingSpec;
use tankwright::recipe::{Footing, Recipe, figures};
use tankwright::tuning::advice::{Advice, CoarseTrimmer, TRIMMER_HAND_STEP};

/// The bench demo with its coil 0.05 mm longer than the length that lands the channel: less
/// than a hand can stretch, more than the tolerance off.
pub fn just_off() -> Recipe {
    let mut r = Recipe::demo();
    let f = figures(&r).expect("valid");
    let length = f
        .target
        .length_for_target
        .expect("the demo reaches its channel");
    r.winding.spacing = SpacingSpec::Length(length + 0.05e-3);
    r
}

#[test]
fn a_trimmer_too_coarse_for_the_channel_is_named_with_what_would_do() {
    let r = just_off();
    let f = figures(&r).expect("valid");
    let led = f.led.expect("the field solution leads");
    let tolerance = f.target.tolerance;
    let Advice::SetTrimmer {
        setting,
        coarse: Some(c),
        ..
    } = f.target.advice.clone()
    else {
        panic!("expected a coarse trimmer: {}", f.target.advice);
    };
    eprintln!("{}", f.target.advice);
    // One per cent moves the tank more than the tolerance, by field solves too.
    let half = 0.5 * TRIMMER_HAND_STEP;
    let step_of = |ext: &dyn Fn(f64) -> f64| {
        (led.resonance(&f.coil, ext(setting - half)).expect("solves")
            - led.resonance(&f.coil, ext(setting + half)).expect("solves"))
        .abs()
    };
    let present = step_of(&|s| f.tank.external_capacitance_at(s));
    assert!(present > tolerance, "{present} Hz per per cent");
    assert!(
        (present - c.per_step).abs() <= 0.01 * c.per_step,
        "{present} against {}",
        c.per_step
    );
    assert_eq!(c.tolerance, tolerance);
    // A trimmer of the span proposed, at the same capacitance at the setting: one per cent
    // then moves the tank by the tolerance (to first order in the step: within 2 %).
    let ct = f.tank.trimmer_at(setting);
    let smaller = tankwright::model::Tank {
        trimmer_min: ct - setting * c.span_at_most,
        trimmer_max: ct + (1.0 - setting) * c.span_at_most,
        ..f.tank
    };
    let step = step_of(&|s| smaller.external_capacitance_at(s));
    assert!(
        (step - tolerance).abs() <= 0.02 * tolerance,
        "smaller trimmer: {step} Hz per per cent"
    );
    // The series capacitor with the fixed part added: the same capacitance at the setting
    // (1/C = 1/C₁ + 1/C₂), and one per cent moves the tank by the tolerance.
    let series = |a: f64, b: f64| a * b / (a + b);
    let with_series = |s: f64| {
        f.tank.external_capacitance_at(s) - f.tank.trimmer_at(s)
            + c.fixed_added
            + series(f.tank.trimmer_at(s), c.series_at_most)
    };
    approx::assert_relative_eq!(
        with_series(setting),
        f.tank.external_capacitance_at(setting),
        max_relative = 1e-12
    );
    let step = step_of(&with_series);
    assert!(
        (step - tolerance).abs() <= 0.02 * tolerance,
        "series capacitor: {step} Hz per per cent"
    );
    // The instruction says so; the build sheet says the same.
    let text = f.target.advice.to_string();
    assert!(text.contains("a hand cannot set it"), "{text}");
    assert!(text.contains(&c.text()), "{text}");
    let sheet = sheet(&r, Footing::FieldSolution).expect("a sheet");
    assert!(
        sheet.verdict.iter().any(|l| l.contains(&c.text())),
        "{:?}",
        sheet.verdict
    );
}

#[test]
fn a_fine_trimmer_is_set_without_a_warning() {
    // The same coil with a trimmer whose whole travel spans 0.4 pF: one per cent moves the
    // tank a few kHz, well inside the 15 kHz tolerance.
    let mut r = just_off();
    r.tank.trimmer_min = 5.8e-12;
    r.tank.trimmer_max = 6.2e-12;
    let f = figures(&r).expect("valid");
    match &f.target.advice {
        Advice::SetTrimmer { coarse, .. } => assert!(coarse.is_none(), "{}", f.target.advice),
        other => panic!("expected a trimmer setting: {other}"),
    }
    let c = CoarseTrimmer::check(&f.coil, &f.tank, &f.conditions, 0.5, f.target.tolerance);
    assert!(c.is_none());
}

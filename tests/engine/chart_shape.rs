//! The charts' field shape ([`chart_shape`]): what the window's charts, their hover, the
//! spread band and the hand-outs draw when the field solution leads. Each curve is held to
//! exact field solves of the coil at that length across that capacitance
//! ([`FieldLed::resonance`], the field-led model every instruction lands on).
//!
//! The field solution itself is held to nec2c in tests/engine/reference_field.rs; here the
//! approximation is held to it. The stated accuracy is 5 kHz along the chart, a third of the
//! FM on-channel tolerance (15 kHz, `BandPlan::default_tolerance`), the same bound
//! tests/engine/landing.rs holds the field shape to; at the present coil and setting, where
//! the shape solves the field itself, the curve is that solve (to the field solution's own
//! 1e-9 and the classical model's re-solve of the factor, 1e-12).

use tankwright::handout::{ChartKind, chart_data};
use tankwright::model::{Coil, Tank};
use tankwright::recipe::{BenchEntry, Recipe, figures};
use tankwright::tuning::landing::{FieldLed, chart_shape};
use tankwright::tuning::sweep::{
    CHART_SETTINGS, chart_length_range, spacing_sweep, spacing_sweep_on, teaching_range,
    trimmer_sweep_on,
};

/// The chart's stated accuracy against exact field solves, hertz.
const CHART_ACCURACY: f64 = 5e3;

/// Lengths spread evenly over `range` (not the shape's own nodes), metres.
fn probes(range: (f64, f64), n: usize) -> Vec<f64> {
    (0..n)
        .map(|i| range.0 + (range.1 - range.0) * (i as f64 + 0.37) / n as f64)
        .collect()
}

/// The worst difference (hertz) between the shape's spacing curves at `settings` and exact
/// field solves at 11 lengths, and the same for the classical shape through the present
/// coil (the curves before this work, for comparison).
fn worst_along_chart(led: &FieldLed, coil: &Coil, tank: &Tank, settings: &[f64]) -> (f64, f64) {
    let range = chart_length_range(coil);
    let shape = chart_shape(led, coil, tank, range).expect("the shape solves");
    let (present, _) = led
        .conditions_at(coil, tank.external_capacitance())
        .expect("solves");
    let (mut worst, mut worst_held) = (0.0_f64, 0.0_f64);
    for &l in &probes(range, 23) {
        let c = coil.with_length(l).expect("valid");
        for &s in settings {
            let ext = tank.external_capacitance_at(s);
            let exact = led.resonance(&c, ext).expect("solves");
            let shaped = shape.resonance_at(coil, l, ext);
            let held =
                spacing_sweep(coil, tank, &present, &[s], (l, l * 1.0001), 2)[0].points[0][1];
            worst = worst.max((shaped - exact).abs());
            worst_held = worst_held.max((held - exact).abs());
        }
    }
    (worst, worst_held)
}

fn demo_with(lead: f64, setting: f64) -> (Recipe, Coil) {
    let mut r = Recipe::demo();
    r.winding.lead_length = lead;
    r.tank.trimmer_setting = setting;
    let coil = Coil::from_winding(&r.winding).expect("valid");
    (r, coil)
}

#[test]
fn the_chart_shape_follows_exact_field_solves_along_every_curve() {
    // The bench demo with short and long leads, at the trimmer's middle and off it (the
    // shape then solves the present setting's capacitance), and on a calibrated model
    // (a bench scale of 1.04 on the field-solved inductance).
    for (lead, setting, scale) in [
        (5e-3, 0.5, 1.0),
        (5e-3, 0.3, 1.0),
        (25e-3, 0.7, 1.0),
        (40e-3, 0.5, 1.0),
        (5e-3, 0.5, 1.04),
    ] {
        let (r, coil) = demo_with(lead, setting);
        let led = FieldLed {
            conditions: r.conditions,
            scale,
        };
        let (worst, held) = worst_along_chart(&led, &coil, &r.tank, &CHART_SETTINGS);
        eprintln!(
            "leads {:.0} mm, trimmer {:.0} %, scale {scale}: field shape within {:.2} kHz of \
             exact field solves along the chart (classical shape through the present coil: \
             {:.0} kHz)",
            lead * 1e3,
            setting * 100.0,
            worst * 1e-3,
            held * 1e-3
        );
        assert!(worst <= CHART_ACCURACY, "{:.2} kHz", worst * 1e-3);
        // The comparison shows what the shape is for: the held factor misses by far more.
        assert!(held > 10.0 * worst, "{held} against {worst}");
    }
}

#[test]
fn the_chart_shape_is_the_field_solve_at_the_present_coil_and_setting() {
    for (lead, setting) in [(5e-3, 0.5), (5e-3, 0.3), (25e-3, 0.95)] {
        let (r, coil) = demo_with(lead, setting);
        let led = FieldLed {
            conditions: r.conditions,
            scale: 1.0,
        };
        let shape =
            chart_shape(&led, &coil, &r.tank, chart_length_range(&coil)).expect("the shape solves");
        let exact = led
            .resonance(&coil, r.tank.external_capacitance())
            .expect("solves");
        let shaped = shape.resonance_at(&coil, coil.length(), r.tank.external_capacitance());
        // 0.95 is near the end: the middle is solved instead, and the present setting is
        // interpolated between 0.5 and 1 (within the chart's accuracy).
        let bound = if setting == 0.95 {
            CHART_ACCURACY
        } else {
            1e-8 * exact
        };
        assert!(
            (shaped - exact).abs() <= bound,
            "leads {lead}, trimmer {setting}: {shaped} against {exact}"
        );
        // The trimmer's sweep at the present length: exact at the ends.
        let sweep = trimmer_sweep_on(
            &coil,
            &r.tank,
            &led_conditions(&led, &coil, &r.tank),
            5,
            Some(&shape),
        );
        for p in [sweep[0], sweep[4]] {
            let e = led
                .resonance(&coil, r.tank.external_capacitance_at(p[0]))
                .expect("solves");
            assert!((p[1] - e).abs() <= 1e-8 * e, "{p:?} against {e}");
        }
        for p in &sweep[1..4] {
            let e = led
                .resonance(&coil, r.tank.external_capacitance_at(p[0]))
                .expect("solves");
            assert!((p[1] - e).abs() <= CHART_ACCURACY, "{p:?} against {e}");
        }
    }
}

fn led_conditions(led: &FieldLed, coil: &Coil, tank: &Tank) -> tankwright::model::Conditions {
    led.conditions_at(coil, tank.external_capacitance())
        .expect("solves")
        .0
}

#[test]
fn the_hand_out_charts_draw_the_field_shape() {
    // The bench demo, uncalibrated and after two readings (the calibrated field-led model).
    let plain = Recipe::demo();
    let mut calibrated = Recipe::demo();
    for (length, measured) in [(8e-3, 97.95e6), (9.5e-3, 99.35e6)] {
        calibrated.bench_log.push(BenchEntry {
            include_anyway: false,
            measured,
            length,
            trimmer_setting: 0.5,
            added_capacitance: 0.0,
            added_tolerance: None,
            instrument: "frequency counter".to_owned(),
            error_ppm: Some(2.0),
            note: String::new(),
        });
    }
    for r in [plain, calibrated] {
        let f = figures(&r).expect("valid");
        let led = f.led.expect("the field solution leads");
        let chart = chart_data(ChartKind::Spacing, &r, &f);
        let mut worst = 0.0_f64;
        for curve in &chart.curves {
            let ext = f.tank.external_capacitance_at(curve.setting);
            for p in curve.points.iter().step_by(37) {
                let c = f.coil.with_length(p.0 * 1e-3).expect("valid");
                let exact = led.resonance(&c, ext).expect("solves");
                worst = worst.max((p.1 * 1e6 - exact).abs());
            }
        }
        eprintln!(
            "hand-out spacing chart ({} readings): within {:.2} kHz of exact field solves",
            r.bench_log.len(),
            worst * 1e-3
        );
        assert!(worst <= CHART_ACCURACY, "{:.2} kHz", worst * 1e-3);
        // The same curves as the engine's own sweep on the same shape (one function for
        // the window and the paper).
        let shape = chart_shape(&led, &f.coil, &f.tank, chart_length_range(&f.coil));
        let engine = spacing_sweep_on(
            &f.coil,
            &f.tank,
            &f.conditions,
            &[0.5],
            chart_length_range(&f.coil),
            tankwright::tuning::sweep::CHART_SAMPLES,
            shape.as_ref(),
        );
        let drawn = chart
            .curves
            .iter()
            .find(|c| c.setting == 0.5)
            .expect("a 50 % curve");
        for (a, b) in drawn.points.iter().zip(&engine[0].points) {
            assert_eq!(a.1, tankwright::units::to_mhz(b[1]));
        }
        let trimmer = chart_data(ChartKind::Trimmer, &r, &f);
        for p in trimmer.curves[0].points.iter().step_by(24) {
            let exact = led
                .resonance(&f.coil, f.tank.external_capacitance_at(p.0 / 100.0))
                .expect("solves");
            assert!(
                (p.1 * 1e6 - exact).abs() <= CHART_ACCURACY,
                "trimmer {} %: {} against {exact}",
                p.0,
                p.1
            );
        }
    }
}

/// Issue 20: the teaching bench's sweep and captions on the field shape. The bench shows the
/// coil at each length of its sweep ([`teaching_range`]) with a hand's 0–2 pF on the stray
/// (common practice: 1–2 pF), its figures on the charts' own shape (the window's, over
/// [`chart_length_range`], which holds every length the sweep reaches): the frequency every
/// caption names through `Shape::conditions_at`, the trimmer's travel the capacitance
/// caption names read off the shape at the travel's ends. Held to exact field solves of each
/// coil ([`FieldLed::resonance`]) within the chart's stated 5 kHz. The classical shape
/// through the present coil, which the bench drew before, is printed for comparison.
#[test]
fn the_teaching_sweep_follows_exact_field_solves() {
    use tankwright::model::evaluate::resonance_of;
    for (lead, setting, scale) in [(5e-3, 0.5, 1.0), (25e-3, 0.3, 1.0), (5e-3, 0.5, 1.04)] {
        let (r, coil) = demo_with(lead, setting);
        let led = FieldLed {
            conditions: r.conditions,
            scale,
        };
        let range = teaching_range(&coil);
        let chart = chart_length_range(&coil);
        assert!(
            chart.0 <= range.0 && range.1 <= chart.1,
            "{range:?} {chart:?}"
        );
        let shape = chart_shape(&led, &coil, &r.tank, chart).expect("the shape solves");
        let (present, _) = led
            .conditions_at(&coil, r.tank.external_capacitance())
            .expect("solves");
        let (mut worst, mut worst_held) = (0.0_f64, 0.0_f64);
        for &l in &probes(range, 23) {
            let c = coil.with_length(l).expect("valid");
            for hand in [0.0, 1e-12, 2e-12] {
                let tank = Tank {
                    stray: r.tank.stray + hand,
                    ..r.tank
                };
                let ext = tank.external_capacitance();
                let exact = led.resonance(&c, ext).expect("solves");
                let shown = resonance_of(&c, ext, &shape.conditions_at(l, ext));
                worst = worst.max((shown - exact).abs());
                worst_held = worst_held.max((resonance_of(&c, ext, &present) - exact).abs());
                for end in [0.0, 1.0] {
                    let ext = tank.external_capacitance_at(end);
                    let exact = led.resonance(&c, ext).expect("solves");
                    worst = worst.max((shape.resonance_at(&coil, l, ext) - exact).abs());
                }
            }
        }
        eprintln!(
            "teaching sweep, leads {:.0} mm, trimmer {:.0} %, scale {scale}: within {:.2} kHz of \
             exact field solves (classical shape through the present coil: {:.0} kHz)",
            lead * 1e3,
            setting * 100.0,
            worst * 1e-3,
            worst_held * 1e-3
        );
        assert!(worst <= CHART_ACCURACY, "{:.2} kHz", worst * 1e-3);
        assert!(worst_held > 10.0 * worst, "{worst_held} against {worst}");
    }
}

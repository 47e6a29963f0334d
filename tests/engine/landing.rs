//! Every instruction lands where it says: carried out and evaluated again by the tool's own
//! model (the field solution of the proposed coil, with the calibration on it), the tank is
//! within the channel's tolerance.
//!
//! The field solution itself is held to nec2c in tests/engine/reference_field.rs; here the
//! instructions are held to it (self-consistency: what the tool says a coil will do is what it
//! says once that coil is built). Tolerances: the channel's own on-channel tolerance (the
//! band plan's, `BandPlan::default_tolerance`), never widened.

use approx::assert_relative_eq;
use tankwright::model::{
    Coating, Coil, Conditions, DiameterSpec, Gauge, SpacingSpec, Tank, Winding, WireSpec,
};
use tankwright::recipe::{BenchEntry, Recipe, demos, figures};
use tankwright::tuning::BandPlan;
use tankwright::tuning::advice::{Advice, advise, advise_on};
use tankwright::tuning::field_tank::{TOLERANCE, field_resonance, field_tank, field_tank_scaled};
use tankwright::tuning::landing::{FieldLed, Shape, proposable_range};
use tankwright::tuning::sweep::{chart_length_range, spacing_sweep, spacing_sweep_on};

/// The recipe with the advice carried out (turns, length and trimmer as proposed).
fn carried_out(r: &Recipe, turns: f64, length: f64, setting: f64) -> Recipe {
    let mut out = r.clone();
    out.winding.turns = turns;
    out.winding.spacing = SpacingSpec::Length(length);
    out.tank.trimmer_setting = setting;
    out
}

#[test]
fn every_shipped_demo_instruction_lands_within_the_channel_tolerance() {
    for (name, r) in demos() {
        let f = figures(&r).expect("the demo is valid");
        let channel = r.target.channel;
        let tolerance = f.target.tolerance;
        let p = f
            .target
            .advice
            .proposal(&f.coil, f.tank.trimmer_setting)
            .expect("the demos' channels are within reach");
        let after = figures(&carried_out(&r, p.turns, p.length, p.trimmer_setting))
            .expect("the proposal is valid");
        let miss = after.analysis.resonance - channel;
        // Before this landing, the classical shape with the present factor held missed by
        // -176.7 (bench), +268.2 (2 m), -174.0 (enamel) and -687.7 kHz (field day), measured
        // 2026-12-04 with the same evaluation.
        eprintln!(
            "{name}: \"{}\" lands {:+.1} kHz, tolerance {:.1} kHz",
            f.target.advice,
            miss * 1e-3,
            tolerance * 1e-3
        );
        assert!(
            miss.abs() <= tolerance,
            "{name}: {} lands {:+.1} kHz off",
            f.target.advice,
            miss * 1e-3
        );
    }
}

/// A small deterministic generator (Knuth's MMIX linear congruential constants, *The Art of
/// Computer Programming* vol. 2, §3.3.4) so the random coils are the same on every run.
struct Lcg(u64);

impl Lcg {
    fn unit(&mut self) -> f64 {
        self.0 = self
            .0
            .wrapping_mul(6_364_136_223_846_793_005)
            .wrapping_add(1_442_695_040_888_963_407);
        (self.0 >> 11) as f64 / (1u64 << 53) as f64
    }
    fn between(&mut self, lo: f64, hi: f64) -> f64 {
        lo + (hi - lo) * self.unit()
    }
}

/// A random coil for `band` (FM or 2 m): former, wire, turns, length and leads (0–40 mm),
/// and a tank of a fixed capacitor and a trimmer.
fn random_case(g: &mut Lcg, two_metre: bool) -> (Coil, Tank) {
    let wire = g.between(0.7e-3, 1.2e-3);
    let turns = if two_metre {
        (g.between(2.0, 4.0) * 4.0).round() / 4.0
    } else {
        (g.between(3.0, 7.0) * 4.0).round() / 4.0
    };
    let former = g.between(5e-3, 8e-3);
    let lead = g.between(0.0, 40e-3);
    let winding = Winding {
        diameter: DiameterSpec::Former(former),
        wire: WireSpec {
            gauge: Gauge::Metric(wire),
            coating: Coating::EnamelGrade1,
        },
        turns,
        spacing: SpacingSpec::Length(turns * wire * g.between(1.5, 2.5)),
        lead_length: lead,
    };
    let coil = Coil::from_winding(&winding).expect("a valid random coil");
    let fixed = if two_metre {
        g.between(3e-12, 8e-12)
    } else {
        g.between(12e-12, 27e-12)
    };
    let tank = Tank {
        fixed,
        trimmer_min: 2e-12,
        trimmer_max: 10e-12,
        trimmer_setting: 0.5,
        stray: 3e-12,
        feedback: None,
    };
    (coil, tank)
}

#[test]
fn instructions_on_random_coils_land_on_their_own_field_solution() {
    let conditions = Conditions::default();
    let led = FieldLed {
        conditions,
        scale: 1.0,
    };
    let mut g = Lcg(20_261_204);
    let (mut landed, mut worst, mut classical_worst) = (0, 0.0_f64, 0.0_f64);
    for case in 0..10 {
        let two_metre = case % 2 == 1;
        let plan = if two_metre {
            BandPlan::TwoMetreRegion1
        } else {
            BandPlan::UsFm
        };
        let tolerance = plan.default_tolerance();
        let (coil, tank) = random_case(&mut g, two_metre);
        let external = tank.external_capacitance();
        let Some((present_conditions, present)) = led.conditions_at(&coil, external) else {
            panic!("case {case}: the field solution fails on a random coil");
        };
        // Both directions: a channel 1–5 % above or below where the coil is now.
        let sign = if case % 4 < 2 { 1.0 } else { -1.0 };
        let target = present * (1.0 + sign * g.between(0.01, 0.05));
        let advice = advise_on(
            &coil,
            &tank,
            &present_conditions,
            target,
            tolerance,
            Some(&led),
        );
        let Some(p) = advice.proposal(&coil, tank.trimmer_setting) else {
            eprintln!("case {case}: {advice}");
            continue;
        };
        let proposed = coil
            .with_turns(p.turns, p.length)
            .expect("the proposal is a coil the model accepts");
        // Buildable: within the range an instruction may propose.
        let (lo, hi) = proposable_range(&proposed);
        assert!(
            (lo - 1e-12..=hi + 1e-12).contains(&p.length),
            "case {case}: {advice}"
        );
        let truth = field_tank(
            &proposed,
            tank.external_capacitance_at(p.trimmer_setting),
            &conditions,
        )
        .expect("the proposed coil solves")
        .resonance;
        let miss = truth - target;
        // The same instruction on the classical shape with the present factor held.
        let old = advise(&coil, &tank, &present_conditions, target, tolerance);
        if let Some(q) = old.proposal(&coil, tank.trimmer_setting)
            && let Ok(c) = coil.with_turns(q.turns, q.length)
            && let Ok(t) = field_tank(
                &c,
                tank.external_capacitance_at(q.trimmer_setting),
                &conditions,
            )
        {
            classical_worst = classical_worst.max((t.resonance - target).abs());
        }
        eprintln!(
            "case {case}: leads {:.1} mm, {:.3} → {:.3} MHz: \"{advice}\" lands {:+.2} kHz",
            coil.lead_length() * 1e3,
            present * 1e-6,
            target * 1e-6,
            miss * 1e-3
        );
        assert!(
            miss.abs() <= tolerance,
            "case {case}: {advice} lands {:+.1} kHz off",
            miss * 1e-3
        );
        landed += 1;
        worst = worst.max(miss.abs());
    }
    eprintln!(
        "{landed} of 10 landed; worst miss {:.3} kHz (classical shape: {:.1} kHz)",
        worst * 1e-3,
        classical_worst * 1e-3
    );
    assert!(landed >= 9, "only {landed} of 10 proposals were made");
}

#[test]
fn the_resonance_alone_is_the_full_tank_solution() {
    // The landing's solve skips the self-resonance search; its root is the same.
    for (name, r) in demos().into_iter().take(2) {
        let coil = Coil::from_winding(&r.winding).expect("valid");
        let c = r.tank.external_capacitance();
        let full = field_tank(&coil, c, &r.conditions)
            .expect("solves")
            .resonance;
        let lean = field_resonance(&coil, c, &r.conditions, 1.0).expect("solves");
        assert_relative_eq!(full, lean, max_relative = 2.0 * TOLERANCE);
        eprintln!("{name}: {full} Hz, {lean} Hz");
    }
}

/// One build on the simulated bench: the builder winds to each proposal to the nearest
/// 0.05 mm, reads the tank with the trimmer at 50 %, logs the reading and asks again. The
/// truth is the field-solved tank with the build's hidden extra capacitance and inductance
/// scale. Returns how many readings it took until the advice was to leave the coil (with the
/// trimmer set within 25–75 % of its travel) and the tank then sat within the tolerance.
fn bench_build(
    channel: f64,
    lead: f64,
    hidden_pf: f64,
    hidden_scale: f64,
    log: &mut String,
) -> Option<usize> {
    let mut r = Recipe::demo();
    r.target.channel = channel;
    r.winding.lead_length = lead;
    r.bench_log.clear();
    let tolerance = r.target.tolerance();
    let truth = |r: &Recipe, setting: f64| {
        let coil = Coil::from_winding(&r.winding).expect("valid");
        field_tank_scaled(
            &coil,
            r.tank.external_capacitance_at(setting) + hidden_pf * 1e-12,
            &r.conditions,
            hidden_scale,
        )
        .expect("the build solves")
        .resonance
    };
    for readings in 0..=3 {
        let f = figures(&r).expect("valid");
        let advice = f.target.advice.clone();
        match advice {
            Advice::OnChannel { .. } | Advice::SetTrimmer { .. } if readings > 0 => {
                let setting = match advice {
                    Advice::SetTrimmer { setting, .. } => setting,
                    _ => r.tank.trimmer_setting,
                };
                let miss = truth(&r, setting) - channel;
                log.push_str(&format!(
                    "  after {readings} reading(s): \"{advice}\": {:+.1} kHz at {:.0} %\n",
                    miss * 1e-3,
                    setting * 100.0
                ));
                return ((0.25..=0.75).contains(&setting) && miss.abs() <= tolerance)
                    .then_some(readings);
            }
            _ => {}
        }
        let p = advice.proposal(&f.coil, 0.5)?;
        log.push_str(&format!("  after {readings} reading(s): \"{advice}\"\n"));
        if p.turns != r.winding.turns {
            // Another coil: the old readings describe the old one.
            r.bench_log.clear();
            r.winding.turns = p.turns;
        }
        let wound = (p.length / 0.05e-3).round() * 0.05e-3;
        r.winding.spacing = SpacingSpec::Length(wound);
        r.tank.trimmer_setting = 0.5;
        let measured = truth(&r, 0.5);
        r.bench_log.push(BenchEntry {
            include_anyway: false,
            measured,
            length: wound,
            trimmer_setting: 0.5,
            added_capacitance: 0.0,
            instrument: "counter".to_owned(),
            error_ppm: Some(10.0),
            note: String::new(),
            added_tolerance: None,
        });
    }
    None
}

#[test]
fn simulated_bench_builds_land_by_their_second_reading() {
    // Hidden departures of the kind a build has: stray from −1 to +3 pF beyond the
    // estimate, inductance 5 % either side (common practice: lead dress and former slip).
    let builds = [
        (92.1e6, 5e-3, 2.0, 1.04),
        (98.7e6, 5e-3, -1.0, 0.96),
        (104.3e6, 5e-3, 3.0, 1.05),
        (95.5e6, 20e-3, 1.0, 0.97),
    ];
    for (i, &(channel, lead, pf, scale)) in builds.iter().enumerate() {
        eprintln!(
            "build {i}: {:.1} MHz, leads {:.0} mm, hidden {pf:+.1} pF, ×{scale}",
            channel * 1e-6,
            lead * 1e3
        );
        let mut log = String::new();
        let landed = bench_build(channel, lead, pf, scale, &mut log);
        eprint!("{log}");
        assert!(
            landed.is_some_and(|n| n <= 2),
            "build {i} did not land by its second reading ({landed:?})"
        );
    }
}

/// The largest difference (hertz) between the chart's curves and exact field solves at
/// every point of a 13-point sweep at two trimmer settings: on the field shape, and on the
/// classical shape with the present factor held (for comparison).
fn chart_error(lead: f64, points: usize) -> (f64, f64) {
    let mut r = Recipe::demo();
    r.winding.lead_length = lead;
    let coil = Coil::from_winding(&r.winding).expect("valid");
    let led = FieldLed {
        conditions: r.conditions,
        scale: 1.0,
    };
    let (present, _) = led
        .conditions_at(&coil, r.tank.external_capacitance())
        .expect("solves");
    let range = chart_length_range(&coil);
    let solved = [
        r.tank.external_capacitance_at(0.0),
        r.tank.external_capacitance_at(0.5),
        r.tank.external_capacitance_at(1.0),
    ];
    let shape = Shape::solve_over(&led, &coil, &solved, range, points).expect("solves");
    // Between the settings solved, and between the lengths solved (13 points evenly over the
    // range against 9 lengths closer together at the short end).
    let settings = [0.25, 0.75];
    let shaped = spacing_sweep_on(&coil, &r.tank, &present, &settings, range, 13, Some(&shape));
    let held = spacing_sweep(&coil, &r.tank, &present, &settings, range, 13);
    let (mut worst, mut worst_held) = (0.0_f64, 0.0_f64);
    for (curve, old) in shaped.iter().zip(&held) {
        let c = r.tank.external_capacitance_at(curve.setting);
        for (p, q) in curve.points.iter().zip(&old.points) {
            let exact = led
                .resonance(&coil.with_length(p[0]).expect("valid"), c)
                .expect("solves");
            worst = worst.max((p[1] - exact).abs());
            worst_held = worst_held.max((q[1] - exact).abs());
        }
    }
    (worst, worst_held)
}

#[test]
fn the_field_shaped_chart_follows_exact_field_solves() {
    // Nine lengths at the trimmer's ends and middle (27 field solves) for the chart's range.
    for lead in [5e-3, 25e-3] {
        let (shaped, held) = chart_error(lead, 9);
        eprintln!(
            "leads {:.0} mm: field shape within {:.2} kHz of exact field solves along the chart \
             (classical shape with the factor held: {:.0} kHz)",
            lead * 1e3,
            shaped * 1e-3,
            held * 1e-3
        );
        // The chart's stated accuracy: a third of the FM on-channel tolerance (15 kHz).
        assert!(shaped <= 5e3, "{:.2} kHz", shaped * 1e-3);
    }
}

#[test]
fn past_the_peak_of_a_long_lead_coil_the_advice_turns_back_or_removes_a_turn() {
    // The bench demo with 25 mm leads: its field-solved resonance peaks near 19–21 mm of
    // coil length and falls beyond, while the classical curve keeps rising.
    let mut r = Recipe::demo();
    r.winding.lead_length = 25e-3;
    let tolerance = r.target.tolerance();
    let lands = |r: &Recipe, channel: f64| {
        let mut r = r.clone();
        r.target.channel = channel;
        let f = figures(&r).expect("valid");
        let advice = f.target.advice.clone();
        let p = advice
            .proposal(&f.coil, f.tank.trimmer_setting)
            .expect("a proposal");
        let after = figures(&carried_out(&r, p.turns, p.length, p.trimmer_setting))
            .expect("the proposal is valid");
        (advice, after.analysis.resonance - channel)
    };
    // Above the peak: no length reaches it; a turn fewer does.
    let (advice, miss) = lands(&r, 96.1e6);
    eprintln!("96.1 MHz: \"{advice}\" lands {:+.2} kHz", miss * 1e-3);
    assert!(
        matches!(advice, Advice::ChangeTurns { from, to, .. } if to < from),
        "{advice}"
    );
    assert!(miss.abs() <= tolerance);
    // Below the peak from a coil stretched past it: the nearest length is on the falling
    // side, and the advice says that there stretching lowers the frequency.
    r.winding.spacing = SpacingSpec::Length(27e-3);
    let (advice, miss) = lands(&r, 95.1e6);
    eprintln!(
        "95.1 MHz from 27 mm: \"{advice}\" lands {:+.2} kHz",
        miss * 1e-3
    );
    assert!(
        matches!(advice, Advice::Stretch { falling: true, .. }),
        "{advice}"
    );
    assert!(advice.to_string().contains("stretching further lowers"));
    assert!(miss.abs() <= tolerance);
}

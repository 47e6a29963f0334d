//! Modulation and drift in the window: the deviation shown is the engine's figure for the
//! junction law and levels set, and the drift budget's worst case changes with the fixed
//! capacitor's temperature class and with the changes budgeted for; the two modulation charts
//! are shown and move the way the junction's law says; a pasted SPICE `.model` line fills the
//! law or is refused with a message, keeping what was typed. The figures themselves are
//! checked against ngspice and the standard's table in tests/engine/reference_junction.rs and
//! tests/engine/reference_stray.rs.

use crate::common;

use common::screen_text;
use egui_kittest::Harness;
use egui_kittest::kittest::{NodeT, Queryable};
use tankwright::model::Coil;
use tankwright::physics::junction::JunctionLaw;
use tankwright::tuning::modulation::Service;
use tankwright::tuning::modulation::{ModulationInputs, Modulator, modulation};
use tankwright::ui::App;
use tankwright::ui::app::MODULATION_CHARTS;
use tankwright::ui::charts::modulation::{
    CARRIER_BIAS_CHART_LABEL, DEVIATION_CHART_LABEL, ModulationSweeps,
};
use tankwright::ui::panels::audio::{
    CLASS_LABEL, MODEL_TEXT_LABEL, PASTE_SECTION, USE_MODEL_BUTTON,
};

fn workbench() -> Harness<'static, App> {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 2800.0))
        .build_eframe(|cc| App::new(cc).with_field_solution(false));
    harness.run();
    harness.get_by_label("Audio and drift").click();
    harness.run();
    harness
}

fn set(harness: &mut Harness<'_, App>, label: &str, value: f64) {
    harness.get_by_label(label).set_value_accesskit(value);
    harness.run();
}

fn line_starting(harness: &Harness<'_, App>, start: &str) -> String {
    screen_text(harness)
        .into_iter()
        .find(|t| t.starts_with(start))
        .unwrap_or_else(|| panic!("no line starting {start:?}"))
}

#[test]
fn the_deviation_shown_is_the_engines_and_drift_follows_the_capacitor_class() {
    let mut harness = workbench();
    set(&mut harness, "Reverse bias", 3.0);
    set(&mut harness, "Audio peak", 0.5);
    let recipe = harness.state().recipe().clone();
    let coil = Coil::from_winding(&recipe.winding).unwrap();
    let m = modulation(
        &coil,
        recipe.tank.external_capacitance(),
        &recipe.conditions,
        &ModulationInputs {
            modulator: Modulator {
                law: JunctionLaw::new(3.5e-12, 0.75, 0.33),
                coupling: None,
            },
            bias_v: 3.0,
            audio_peak_v: 0.5,
            audio_max_hz: 15e3,
            rf_peak_v: tankwright::tuning::modulation::TANK_RF_PEAK_V,
        },
    );
    let line = line_starting(&harness, "Carrier ");
    let expected = format!(
        "deviation +{:.1} / −{:.1} kHz",
        m.deviation_up * 1e-3,
        m.deviation_down * 1e-3
    );
    assert!(line.contains(&expected), "{line} vs {expected}");

    let before = line_starting(&harness, "±");
    harness.get_by_label(CLASS_LABEL).click();
    harness.run();
    harness.get_by_label("U2J (N750)").click();
    harness.run();
    let after = line_starting(&harness, "±");
    assert_ne!(before, after, "the worst case follows the capacitor class");
}

/// The engine's modulation of the window's recipe for a collector–base law, bias and audio.
fn engine(harness: &Harness<'_, App>, law: JunctionLaw, bias_v: f64, audio_peak_v: f64) -> String {
    let recipe = harness.state().recipe().clone();
    let coil = Coil::from_winding(&recipe.winding).unwrap();
    let m = modulation(
        &coil,
        recipe.tank.external_capacitance(),
        &recipe.conditions,
        &ModulationInputs {
            modulator: Modulator {
                law,
                coupling: None,
            },
            bias_v,
            audio_peak_v,
            audio_max_hz: 15e3,
            rf_peak_v: tankwright::tuning::modulation::TANK_RF_PEAK_V,
        },
    );
    format!(
        "deviation +{:.1} / −{:.1} kHz",
        m.deviation_up * 1e-3,
        m.deviation_down * 1e-3
    )
}

#[test]
fn the_drift_table_follows_the_changes_budgeted_for() {
    let mut harness = workbench();
    let before = line_starting(&harness, "±");
    set(&mut harness, "Hand near the coil", 2.0);
    let after = line_starting(&harness, "±");
    assert_ne!(
        before, after,
        "a larger hand capacitance changes the worst case"
    );
    assert!(
        screen_text(&harness).iter().any(|t| t == "+2.00 pF"),
        "the hand's change is shown"
    );
}

/// The charts' data as the window last drew them.
fn sweeps<'a>(harness: &'a Harness<'_, App>) -> &'a ModulationSweeps {
    harness.state().modulation_sweeps()
}

/// Physics the charts must show (the depletion law C = Cj0/(1 + V/φ)^m, e.g. S. M. Sze,
/// "Physics of Semiconductor Devices", 2nd ed. 1981, §2.3, with f = 1/(2π√(LC))):
/// - more reverse bias, less junction capacitance, a higher carrier (the curve rises);
/// - the law flattens as the bias rises (|dC/dV| = m·C/(φ + V)), so the same audio gives less
///   deviation at a higher bias;
/// - f(V) is concave (d²f/dV² < 0 whenever (m + 1)·C_tank > 1.5·m·C_j, true for m < 2 since
///   C_tank ≥ C_j), so the downward peak deviation exceeds the upward one;
/// - the deviation grows with the audio's peak.
#[test]
fn modulation_charts_are_shown_and_move_with_the_bias() {
    let mut harness = workbench();
    assert!(
        harness.query_by_label(MODULATION_CHARTS).is_some(),
        "the charts' section is there"
    );
    harness.get_by_label(CARRIER_BIAS_CHART_LABEL);
    harness.get_by_label(DEVIATION_CHART_LABEL);

    set(&mut harness, "Reverse bias", 3.0);
    set(&mut harness, "Audio peak", 0.2);
    let s = sweeps(&harness);
    assert_eq!(s.inputs().map(|i| i.bias_v), Some(3.0));
    let curve = s.carrier_over_bias().to_vec();
    assert!(curve.len() > 50);
    for w in curve.windows(2) {
        assert!(
            w[1][0] > w[0][0] && w[1][1] > w[0][1],
            "carrier rises with bias: {w:?}"
        );
    }
    let low_bias = *s.present().unwrap();
    let deviation = s.deviation_over_audio().to_vec();
    for w in deviation.windows(2) {
        assert!(
            w[1][1] > w[0][1] && w[1][2] > w[0][2],
            "deviation grows: {w:?}"
        );
        assert!(
            w[1][2] > w[1][1],
            "down exceeds up on a concave f(V): {w:?}"
        );
    }
    // The audio axis reaches the service's limit (the range is chosen for it).
    let limit = Service::for_carrier(low_bias.carrier).peak_deviation_limit();
    let last = deviation.last().unwrap();
    assert!(last[1].max(last[2]) >= limit, "{last:?} vs {limit}");
    // The present carrier lies on the curve: the batch sweep at the bias equals the point.
    let on_curve = curve
        .iter()
        .min_by(|a, b| (a[0] - 3.0).abs().total_cmp(&(b[0] - 3.0).abs()))
        .unwrap();
    let step = curve[1][0] - curve[0][0];
    let slope =
        (curve[curve.len() - 1][1] - curve[0][1]) / (curve[curve.len() - 1][0] - curve[0][0]);
    assert!((on_curve[0] - 3.0).abs() <= step);
    assert!(
        (on_curve[1] - low_bias.carrier).abs() <= 10.0 * slope.abs() * step,
        "{on_curve:?} vs {}",
        low_bias.carrier
    );

    set(&mut harness, "Reverse bias", 6.0);
    let high_bias = *sweeps(&harness).present().unwrap();
    assert!(
        high_bias.carrier > low_bias.carrier,
        "carrier rises with reverse bias"
    );
    assert!(
        high_bias.deviation_up + high_bias.deviation_down
            < low_bias.deviation_up + low_bias.deviation_down,
        "the law is flatter at the higher bias"
    );
}

#[test]
fn sweeps_are_recomputed_only_when_their_inputs_change() {
    let recipe = tankwright::recipe::Recipe::demo();
    let coil = Coil::from_winding(&recipe.winding).unwrap();
    let mut inputs = ModulationInputs {
        modulator: Modulator {
            law: JunctionLaw::new(3.5e-12, 0.75, 0.33),
            coupling: None,
        },
        bias_v: 4.5,
        audio_peak_v: 0.1,
        audio_max_hz: 15e3,
        rf_peak_v: tankwright::tuning::modulation::TANK_RF_PEAK_V,
    };
    let mut s = ModulationSweeps::default();
    assert!(s.refresh(&coil, &recipe.tank, &recipe.conditions, &inputs));
    assert!(!s.refresh(&coil, &recipe.tank, &recipe.conditions, &inputs));
    inputs.bias_v = 5.0;
    assert!(s.refresh(&coil, &recipe.tank, &recipe.conditions, &inputs));
}

fn paste(harness: &mut Harness<'_, App>, text: &str) {
    if harness.query_by_label(MODEL_TEXT_LABEL).is_none() {
        harness.get_by_label(PASTE_SECTION).click();
        harness.run();
    }
    harness
        .get_by_label(MODEL_TEXT_LABEL)
        .set_text_value_accesskit(text);
    harness.run();
    harness.get_by_label(USE_MODEL_BUTTON).click();
    harness.run();
}

/// An invented varactor's model on two lines (continuation), with scale suffixes and
/// parameters outside the capacitance law; the law's numbers go into the fields and the
/// figures follow (the reader itself is checked in tests/engine/reference_junction.rs).
#[test]
fn a_pasted_model_fills_the_law_and_lists_what_it_ignores() {
    let mut harness = workbench();
    let text = ".model LHV1 D(IS=2f RS=0.6 CJO=12.5p VJ=0.68\n+ M=0.44 TT=3n BV=30)";
    paste(&mut harness, text);
    let value = |label: &str| {
        harness
            .get_by_label(label)
            .accesskit_node()
            .numeric_value()
            .unwrap()
    };
    approx::assert_relative_eq!(value("Junction Cj0"), 12.5, max_relative = 1e-12);
    approx::assert_relative_eq!(value("Junction potential"), 0.68, max_relative = 1e-12);
    approx::assert_relative_eq!(value("Grading exponent"), 0.44, max_relative = 1e-12);
    let note = line_starting(&harness, "Read LHV1");
    assert!(
        note.contains("Ignored (no part in the capacitance law): IS, RS, TT, BV."),
        "{note}"
    );
    let expected = engine(&harness, JunctionLaw::new(12.5e-12, 0.68, 0.44), 4.5, 0.1);
    let line = line_starting(&harness, "Carrier ");
    assert!(line.contains(&expected), "{line} vs {expected}");
}

/// A line the reader refuses, and one whose numbers the fields cannot hold: a message, the
/// fields as they were, and the text kept.
#[test]
fn a_bad_model_line_is_refused_and_nothing_is_lost() {
    let mut harness = workbench();
    let before = line_starting(&harness, "Carrier ");
    for (text, says) in [
        (".model Q1 JFET(CGS=2p)", "type JFET has no junction law"),
        (
            ".model V9 D(CJO=2n VJ=0.7 M=0.5)",
            "CJO = 2000 pF is outside",
        ),
        ("CJO=10p VJ=0.7", "does not start with .model"),
    ] {
        paste(&mut harness, text);
        let message = line_starting(&harness, "Not read: ");
        assert!(message.contains(says), "{text}: {message}");
        assert_eq!(
            line_starting(&harness, "Carrier "),
            before,
            "{text}: fields unchanged"
        );
        let kept = harness.get_by_label(MODEL_TEXT_LABEL).value();
        assert_eq!(kept.as_deref(), Some(text), "the text is kept");
        let cj0 = harness
            .get_by_label("Junction Cj0")
            .accesskit_node()
            .numeric_value();
        assert_eq!(cj0, Some(3.5));
    }
}

/// Issue 21: on 2 m the highest audio frequency is the service's voice channel (3 kHz,
/// common practice for speech), not broadcast's 15 kHz, until the user types one; a carrier
/// in no service's band is said to be so rather than judged silently as 2 m.
#[test]
fn the_audio_top_follows_the_service_and_a_carrier_in_no_band_is_named() {
    let mut harness = workbench();
    let value = |h: &Harness<'_, App>| {
        h.get_by_label("Highest audio frequency")
            .accesskit_node()
            .numeric_value()
            .expect("a number")
    };
    assert_eq!(value(&harness), 15.0, "FM broadcast demo");
    // The demo's coil with a small tank: a 2 m carrier.
    let two_metre = tankwright::recipe::demos::demos()
        .into_iter()
        .find(|(n, _)| n.contains("two_metre"))
        .map(|(_, r)| r)
        .expect("2 m demo");
    *harness.state_mut().recipe_mut() = two_metre;
    harness.run();
    harness.run();
    assert_eq!(value(&harness), 3.0, "2 m voice");
    // Typed: kept whatever the service (the setting is the recipe's since issue 19, so the
    // recipe keeps it while its coil and tank go back to the FM demo's).
    set(&mut harness, "Highest audio frequency", 5.0);
    let demo = tankwright::recipe::Recipe::demo();
    let recipe = harness.state_mut().recipe_mut();
    recipe.winding = demo.winding;
    recipe.tank = demo.tank;
    recipe.target = demo.target;
    harness.run();
    harness.run();
    assert_eq!(value(&harness), 5.0);
    // 243.9 MHz-ish: the demo coil with almost no capacitance.
    let recipe = harness.state_mut().recipe_mut();
    recipe.tank.fixed = 0.1e-12;
    recipe.tank.stray = 0.1e-12;
    recipe.tank.feedback = None;
    harness.run();
    harness.run();
    let carrier = harness.state().figures().expect("valid").analysis.resonance;
    assert!(carrier > 148e6, "{carrier}");
    assert!(line_starting(&harness, "No service applies at").contains("only as a yardstick"));
}

/// The audio panel's settings are the recipe's (issue 19: kept with it, SI inside): each edit
/// lands in `Recipe::audio`, a typed highest audio frequency is kept as typed, and the carrier
/// shown is the engine's (`tuning::audio::audio_figures`, through `tuning::modulation`, whose
/// junction law is checked against ngspice in tests/engine/reference_junction.rs) for the
/// settings kept.
#[test]
fn the_audio_settings_are_kept_in_the_recipe() {
    use tankwright::tuning::audio::{AudioSettings, audio_figures};
    let mut harness = workbench();
    assert_eq!(harness.state().recipe().audio, AudioSettings::default());
    set(&mut harness, "Junction Cj0", 5.0);
    set(&mut harness, "Coupling capacitor", 10.0);
    set(&mut harness, "Hand near the coil", 2.0);
    set(&mut harness, "Highest audio frequency", 8.0);
    let a = harness.state().recipe().audio;
    assert!((a.junction.cj0 - 5e-12).abs() < 1e-24, "{}", a.junction.cj0);
    assert!((a.coupling - 10e-12).abs() < 1e-24, "{}", a.coupling);
    assert!((a.hand - 2e-12).abs() < 1e-24, "{}", a.hand);
    assert_eq!(a.audio_max, Some(8e3));
    let recipe = harness.state().recipe().clone();
    let coil = Coil::from_winding(&recipe.winding).unwrap();
    let tolerance = recipe.target.tolerance();
    let f = audio_figures(&coil, &recipe.tank, &recipe.conditions, &a, tolerance);
    let line = line_starting(&harness, "Carrier ");
    let expected = format!(
        "Carrier {:.3} MHz with the junction at {:.2} pF",
        f.modulation.carrier * 1e-6,
        f.modulation.junction_at_bias * 1e12
    );
    assert!(line.starts_with(&expected), "{line} vs {expected}");
    assert!(
        line.contains(&format!(
            "Carson bandwidth {:.0} kHz",
            f.modulation.carson_bandwidth * 1e-3
        )),
        "{line}"
    );
}

/// Issue 25: the audio panel offers the oscillator stage's own transistor as the modulating
/// junction. Taken, the law and bias are the stage's (its collector–base junction at the
/// operating point) and the carrier's slope the panel works with is the stage panel's figure
/// for the same junction in the same tank (both through `tuning::modulation`, whose junction
/// law is checked against ngspice's operating-point capacitance in
/// tests/engine/reference_junction.rs). Through a Clapp capacitor the junction is not across
/// the tank, and taking it is refused in words.
#[test]
fn the_stage_transistors_junction_modulates_at_the_stages_own_slope() {
    use tankwright::recipe::{Footing, figures_on};
    use tankwright::tuning::audio::audio_figures;
    use tankwright::tuning::stage::{Topology, stage};
    use tankwright::ui::panels::audio::USE_STAGE_JUNCTION;
    let mut harness = workbench();
    set(&mut harness, "Audio peak", 0.0);
    harness.get_by_label(USE_STAGE_JUNCTION).click();
    harness.run();
    let recipe = harness.state().recipe().clone();
    let f = figures_on(&recipe, Footing::Classical).expect("figures");
    let settings = recipe.stage.clone().unwrap_or_default();
    let s = stage(
        &f.coil,
        &f.tank,
        &f.conditions,
        &settings.inputs().expect("inputs"),
    )
    .expect("stage")
    .junction;
    assert_eq!(recipe.audio.junction, s.law);
    assert_eq!(recipe.audio.bias_v, s.bias_v);
    assert_eq!(recipe.audio.coupling, 0.0);
    let a = audio_figures(
        &f.coil,
        &recipe.audio.rest_of_tank(&f.tank),
        &f.conditions,
        &recipe.audio,
        recipe.target.tolerance(),
    );
    let rel = (a.modulation.sensitivity - s.hz_per_volt) / s.hz_per_volt;
    assert!(
        rel.abs() <= 1e-6,
        "panel {} Hz/V, stage {} Hz/V",
        a.modulation.sensitivity,
        s.hz_per_volt
    );
    let line = line_starting(&harness, "Carrier ");
    let slope = format!("{:.1} kHz per volt", s.hz_per_volt * 1e-3);
    assert!(line.contains(&slope), "{line} lacks {slope}");

    // A Clapp stage: refused, the settings unchanged.
    let before = harness.state().recipe().audio;
    let recipe = harness.state_mut().recipe_mut();
    let mut clapp = recipe.stage.clone().unwrap_or_default();
    clapp.topology = Topology::CommonCollector;
    clapp.clapp = Some(10e-12);
    recipe.stage = Some(clapp);
    harness.run();
    harness.get_by_label(USE_STAGE_JUNCTION).click();
    harness.run();
    let refused = line_starting(&harness, "Not taken: ");
    assert!(refused.contains("Clapp"), "{refused}");
    assert_eq!(harness.state().recipe().audio, before);
}

//! The oscillator stage in the window (issue 25): the panel driven by label shows the
//! engine's figures (`tuning::stage`, the function `tankwright stage` calls, on the tank the
//! figures drive), follows an edit of the emitter resistor and of the topology, and reads a
//! pasted transistor `.model` line or refuses it keeping the text. The figures themselves are
//! checked against ngspice and a textbook hand calculation in tests/engine/reference_stage.rs.

use crate::common::screen_text;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use tankwright::recipe::{Footing, figures_on};
use tankwright::tuning::stage::{Bias, StageInputs, Topology, Transistor, stage};
use tankwright::ui::App;
use tankwright::ui::panels::stage::{
    EMITTER_LABEL, MODEL_LABEL, SECTION, USE_FIGURES_BUTTON, USE_MODEL_BUTTON,
};

fn workbench() -> Harness<'static, App> {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 3200.0))
        .build_eframe(|cc| App::new(cc).with_field_solution(false));
    harness.run();
    harness.get_by_label(SECTION).click();
    harness.run();
    harness
}

fn line_starting(harness: &Harness<'_, App>, start: &str) -> String {
    screen_text(harness)
        .into_iter()
        .find(|t| t.starts_with(start))
        .unwrap_or_else(|| panic!("no line starting {start:?}"))
}

/// The engine's stage for the window's recipe (classical footing, as the window here runs)
/// with the panel's demo bias and the emitter resistor `re`.
fn engine(
    harness: &Harness<'_, App>,
    topology: Topology,
    re: f64,
) -> tankwright::tuning::stage::StageFigures {
    let f = figures_on(harness.state().recipe(), Footing::Classical).expect("figures");
    let inputs = StageInputs {
        topology,
        bias: Bias {
            supply_v: 9.0,
            upper: 10e3,
            lower: 10e3,
            emitter: re,
        },
        transistor: Transistor::from_figures(80.0, 2e-12, 0.8e-12, 800e6),
        battery_charge: Some(500.0 * 3.6),
        clapp: None,
    };
    stage(&f.coil, &f.tank, &f.conditions, &inputs).expect("stage")
}

#[test]
fn the_stage_shown_is_the_engines_and_follows_the_emitter_resistor() {
    let mut harness = workbench();
    let s = engine(&harness, Topology::CommonBase, 100e3);
    let shown = line_starting(&harness, "Loop gain ");
    assert!(
        shown.starts_with(&format!(
            "Loop gain {:.2}: {}",
            s.loop_gain,
            s.start.label()
        )),
        "{shown}"
    );
    let advice = line_starting(&harness, "Advice: ");
    assert_eq!(advice, format!("Advice: {}", s.advice));
    let runs = line_starting(&harness, "Runs at ");
    assert!(
        runs.contains(&format!("{:.3} MHz", s.frequency * 1e-6)),
        "{runs}"
    );

    // A smaller emitter resistor: more current, a larger loop gain, as the engine has it.
    harness
        .get_by_label(EMITTER_LABEL)
        .set_value_accesskit(4700.0);
    harness.run();
    let hard = engine(&harness, Topology::CommonBase, 4700.0);
    assert!(hard.loop_gain > s.loop_gain);
    let shown = line_starting(&harness, "Loop gain ");
    assert!(
        shown.starts_with(&format!("Loop gain {:.2}", hard.loop_gain)),
        "{shown}"
    );
    let collector = line_starting(&harness, "Collector ");
    assert!(
        collector.starts_with(&format!(
            "Collector {:.3} mA",
            hard.operating_point.collector_current * 1e3
        )),
        "{collector}"
    );

    // The other topology.
    harness
        .get_by_label(Topology::CommonCollector.label())
        .click();
    harness.run();
    let cc = engine(&harness, Topology::CommonCollector, 4700.0);
    let shown = line_starting(&harness, "Loop gain ");
    assert!(
        shown.starts_with(&format!("Loop gain {:.2}", cc.loop_gain)),
        "{shown}"
    );
}

fn paste(harness: &mut Harness<'_, App>, text: &str) {
    if harness.query_by_label(MODEL_LABEL).is_none() {
        harness
            .get_by_label("Paste a transistor's SPICE .model line")
            .click();
        harness.run();
    }
    harness
        .get_by_label(MODEL_LABEL)
        .set_text_value_accesskit(text);
    harness.run();
    harness.get_by_label(USE_MODEL_BUTTON).click();
    harness.run();
}

#[test]
fn a_pasted_model_is_read_or_refused_keeping_the_text() {
    let mut harness = workbench();
    paste(&mut harness, ".model BAD PNP(CJC=1p)");
    let refused = line_starting(&harness, "Not read: ");
    assert!(refused.contains("NPN"), "{refused}");
    assert_eq!(
        harness.get_by_label(MODEL_LABEL).value().as_deref(),
        Some(".model BAD PNP(CJC=1p)"),
        "the text is kept for correcting"
    );
    paste(
        &mut harness,
        ".model LHQ NPN(IS=2e-15 BF=90 CJC=0.8p TF=180p VAF=60)",
    );
    let read = line_starting(&harness, "Transistor from the model LHQ");
    assert!(read.contains("Not used: VAF"), "{read}");
    harness.get_by_label(USE_FIGURES_BUTTON).click();
    harness.run();
    assert!(
        !screen_text(&harness)
            .iter()
            .any(|t| t.starts_with("Transistor from the model")),
        "the figures are back"
    );
}

/// The stage's settings are the recipe's (issue 19: one home, saved with it): nothing is set
/// until a change, then each change lands in `Recipe::stage`, the Clapp capacitor with the
/// common-collector stage, and the figures shown are the engine's for the settings kept.
#[test]
fn the_stage_settings_are_kept_in_the_recipe() {
    use tankwright::ui::panels::stage::{CLAPP_LABEL, CLAPP_SWITCH};
    let mut harness = workbench();
    assert_eq!(
        harness.state().recipe().stage,
        None,
        "nothing set before a change"
    );
    harness
        .get_by_label(EMITTER_LABEL)
        .set_value_accesskit(4700.0);
    harness.run();
    let kept = harness.state().recipe().stage.clone().expect("kept");
    assert_eq!(kept.bias.emitter, 4700.0);
    assert_eq!(kept.topology, Topology::CommonBase);
    harness
        .get_by_label(Topology::CommonCollector.label())
        .click();
    harness.run();
    harness.get_by_label(CLAPP_SWITCH).click();
    harness.run();
    harness.get_by_label(CLAPP_LABEL).set_value_accesskit(6.8);
    harness.run();
    let kept = harness.state().recipe().stage.clone().expect("kept");
    assert_eq!(kept.topology, Topology::CommonCollector);
    let clapp = kept.clapp.expect("a Clapp capacitor");
    assert!((clapp - 6.8e-12).abs() < 1e-24, "{clapp}");
    let f = figures_on(harness.state().recipe(), Footing::Classical).expect("figures");
    let s = stage(
        &f.coil,
        &f.tank,
        &f.conditions,
        &kept.inputs().expect("inputs"),
    )
    .expect("stage");
    let shown = line_starting(&harness, "Loop gain ");
    assert!(
        shown.starts_with(&format!("Loop gain {:.2}", s.loop_gain)),
        "{shown}"
    );
    let runs = line_starting(&harness, "Runs at ");
    assert!(
        runs.contains(&format!("{:.3} MHz", s.frequency * 1e-6)),
        "{runs}"
    );
    // Back to common base: the Clapp capacitor goes with the common-collector stage.
    harness.get_by_label(Topology::CommonBase.label()).click();
    harness.run();
    assert_eq!(
        harness
            .state()
            .recipe()
            .stage
            .as_ref()
            .and_then(|s| s.clapp),
        None
    );
}

/// Issue 25: with a stage kept in the recipe, the charts carry the stage's operating frequency
/// (the tank with the transistor's capacitances, `tuning::stage`, checked against ngspice in
/// tests/engine/reference_stage.rs) where it differs from the tank's, named with the pulling
/// in kHz in both legends; without a stage kept, nothing.
#[test]
fn the_charts_carry_the_stages_operating_frequency_and_its_pulling() {
    use tankwright::tuning::stage::StageSettings;
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 1000.0))
        .build_eframe(|cc| App::new(cc).with_field_solution(false));
    harness.run();
    assert_eq!(harness.state().chart_operating(), None, "no stage kept");
    assert!(
        !screen_text(&harness)
            .iter()
            .any(|t| t.starts_with("oscillator runs at")),
        "no line without a stage"
    );
    let settings = StageSettings::default();
    harness.state_mut().recipe_mut().stage = Some(settings.clone());
    harness.run();
    let f = figures_on(harness.state().recipe(), Footing::Classical).expect("figures");
    let s = stage(
        &f.coil,
        &f.tank,
        &f.conditions,
        &settings.inputs().expect("inputs"),
    )
    .expect("stage");
    assert!(
        s.pulling.abs() > 1e3,
        "the demo stage pulls: {} Hz",
        s.pulling
    );
    let shown = harness.state().chart_operating().expect("on the charts");
    assert_eq!((shown.frequency, shown.pulling), (s.frequency, s.pulling));
    // The tank alone is the present point the charts mark.
    assert!((s.tank_frequency - f.analysis.resonance).abs() < 1e-6);
    let label = format!(
        "oscillator runs at {:.3} MHz (pulled {}{:.0} kHz)",
        s.frequency * 1e-6,
        if s.pulling < 0.0 { "-" } else { "+" },
        s.pulling.abs() * 1e-3
    );
    let entries = screen_text(&harness)
        .into_iter()
        .filter(|t| *t == label)
        .count();
    assert_eq!(entries, 2, "one legend entry above each chart: {label}");

    // A Clapp stage: its pulling is against the tank with its series capacitor, and the line
    // says so.
    let mut clapp = settings;
    clapp.topology = tankwright::tuning::stage::Topology::CommonCollector;
    clapp.bias.emitter = 10e3;
    clapp.clapp = Some(10e-12);
    harness.state_mut().recipe_mut().stage = Some(clapp.clone());
    harness.run();
    let c = stage(
        &f.coil,
        &f.tank,
        &f.conditions,
        &clapp.inputs().expect("inputs"),
    )
    .expect("stage");
    let shown = harness.state().chart_operating().expect("on the charts");
    assert_eq!((shown.frequency, shown.pulling), (c.frequency, c.pulling));
    assert!(
        shown
            .label()
            .ends_with("kHz from the tank with its Clapp capacitor)"),
        "{}",
        shown.label()
    );
    assert!(screen_text(&harness).contains(&shown.label()));
}

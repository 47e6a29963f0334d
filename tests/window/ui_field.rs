//! The field solution in the window: computed off the frame; it leads the resonance (and the
//! verdict and advice with it) with the same figure the headless path gives; while a changed
//! coil is solved the last factor is held; an in-flight solution for a coil that has since
//! changed is dropped; switched off, the classical model leads; the impedance chart.
//!
//! These hold the window to the engine's own headless figures (`recipe::figures`); the field
//! solution itself is checked against nec2c in tests/engine/reference_field.rs.

use crate::common;

use common::screen_text;
use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use std::time::{Duration, Instant};
use tankwright::model::{InductanceModel, evaluate};
use tankwright::recipe::{FieldBasis, FieldInput, Figures, figures, figures_with};
use tankwright::tuning::digits;
use tankwright::ui::App;
use tankwright::ui::charts::impedance::Q_NOTE;
use tankwright::ui::panels::readouts::{
    CLASSICAL_RESONANCE, FIELD_RESONANCE, FIELD_SOLVED, MODEL, READOUTS_HEADING, RESONANCE,
    SWITCHED_OFF, UPDATING,
};
use tankwright::ui::panels::top_bar::FIELD_SOLUTION_ENTRY;

fn workbench(size: egui::Vec2) -> Harness<'static, App> {
    let mut harness = Harness::builder()
        .with_size(size)
        .build_eframe(|cc| App::new(cc));
    harness.run();
    harness
}

/// The figure beside the readout `name` and the word after it.
fn readout_with_mark(harness: &Harness<'_, App>, name: &str) -> (String, String) {
    let text = screen_text(harness);
    let at = text
        .iter()
        .position(|t| t == name)
        .unwrap_or_else(|| panic!("no readout named {name:?} on screen"));
    (text[at + 1].clone(), text[at + 2].clone())
}

/// Run frames until the resonance that leads is marked field-solved (the worker thread's
/// time, not a timing check: the bound only stops a hung test).
fn wait_for_field(harness: &mut Harness<'_, App>) {
    let start = Instant::now();
    while readout_with_mark(harness, RESONANCE).1 != FIELD_SOLVED {
        assert!(
            start.elapsed() < Duration::from_secs(120),
            "the field solution never arrived"
        );
        std::thread::sleep(Duration::from_millis(5));
        harness.step();
    }
}

/// The headless figures for what the window holds: the same function the commands and the
/// build sheet call, with the field solution solved there and then.
fn headless(harness: &Harness<'_, App>) -> Figures {
    figures(harness.state().recipe()).expect("a valid coil")
}

#[test]
fn a_change_holds_the_last_factor_until_the_field_solution_replaces_it() {
    let mut harness = workbench(egui::vec2(1400.0, 900.0));
    wait_for_field(&mut harness);
    let first = headless(&harness);
    let tank = *first.field.tank().expect("the demo coil solves");
    // The resonance that leads is the field-solved tank's, the same figure the headless path
    // gives, and the verdict and advice work on it.
    let (shown, _) = readout_with_mark(&harness, RESONANCE);
    assert_eq!(shown, digits::mhz(tank.resonance));
    let app = harness.state().figures().expect("valid").clone();
    approx::assert_relative_eq!(app.analysis.resonance, tank.resonance, max_relative = 1e-9);
    approx::assert_relative_eq!(app.verdict.resonance, tank.resonance, max_relative = 1e-9);
    assert_eq!(app.verdict, first.verdict);
    // The classical model is beside it, with its difference.
    let (classical, _) = readout_with_mark(&harness, CLASSICAL_RESONANCE);
    let model = first.classical.resonance;
    assert_eq!(
        classical,
        format!(
            "{} ({})",
            digits::mhz(model),
            digits::offset(model - app.analysis.resonance)
        )
    );
    // The classical self-resonances carry this coil's own ratio to the field solution.
    let ratio = |classical: f64| {
        tankwright::tuning::field_tank::ratio_in_words(classical, tank.self_resonance)
            .expect("a ratio")
    };
    assert_eq!(
        readout_with_mark(&harness, "Self-resonance, lumped").1,
        ratio(app.analysis.self_resonance.lumped)
    );
    assert_eq!(
        readout_with_mark(&harness, "Self-resonance, helical").1,
        ratio(app.analysis.self_resonance.helical)
    );
    // The apparent inductance shown is the field solution's X/ω at that resonance.
    assert_eq!(
        readout_with_mark(&harness, "Apparent inductance"),
        (
            format!("{:.1} nH", tank.apparent_inductance * 1e9),
            FIELD_SOLVED.to_owned()
        )
    );

    harness
        .get_by_role_and_label(Role::Slider, "Turns")
        .set_value_accesskit(6.0);
    // The frame that applies the change asks for a new solution; until it comes, the factor
    // found for five turns is held on the six-turn model (no jump back to the classical model).
    harness.step();
    harness.step();
    assert_eq!(harness.state().recipe().winding.turns, 6.0);
    let held = harness.state().figures().expect("valid").clone();
    if let FieldBasis::Held { scale } = held.field {
        let (estimate, mark) = readout_with_mark(&harness, RESONANCE);
        assert_eq!(mark, UPDATING);
        assert_eq!(scale, first.field.scale());
        let expected = figures_with(harness.state().recipe(), FieldInput::Held(scale))
            .expect("valid")
            .analysis
            .resonance;
        assert_eq!(estimate, digits::mhz(expected));
    } else {
        // The worker answered within those two frames: it must be the six-turn coil's.
        let now = headless(&harness);
        assert!(held.field.tank().is_some(), "{:?}", held.field);
        assert_eq!(held.field.tank(), now.field.tank());
    }

    wait_for_field(&mut harness);
    let second = headless(&harness);
    let (solved, _) = readout_with_mark(&harness, RESONANCE);
    assert_eq!(solved, digits::mhz(second.analysis.resonance));
    assert_ne!(first.analysis.resonance, second.analysis.resonance);
    let result = harness.state().field_solution().expect("ready");
    assert_eq!(result.request.coil.turns(), 6.0);
}

#[test]
fn a_solution_for_a_coil_that_has_changed_is_dropped() {
    let mut harness = workbench(egui::vec2(1400.0, 900.0));
    // Two changes in quick succession: the first coil's solution, in flight or queued, never
    // reaches the screen.
    for turns in [6.0, 7.0] {
        harness
            .get_by_role_and_label(Role::Slider, "Turns")
            .set_value_accesskit(turns);
        harness.step();
    }
    wait_for_field(&mut harness);
    let result = harness.state().field_solution().expect("ready");
    assert_eq!(result.request.coil.turns(), 7.0);
    let (solved, _) = readout_with_mark(&harness, RESONANCE);
    assert_eq!(solved, digits::mhz(headless(&harness).analysis.resonance));
}

#[test]
fn another_driving_model_asks_for_nothing_new_and_stays_field_solved() {
    let mut harness = workbench(egui::vec2(1400.0, 900.0));
    wait_for_field(&mut harness);
    let before = readout_with_mark(&harness, RESONANCE);
    let asked = harness.state().field_solution().expect("ready").request;
    harness.state_mut().recipe_mut().conditions.model = InductanceModel::Wheeler1928;
    harness.step();
    harness.step();
    // The field solution uses only the temperature: the same answer serves, and the factor
    // moves the new model onto it in the same frame (the same resonance at once; the figures
    // away from the present coil are landed again off the frame, marked "updating" until
    // then, issue 20).
    assert_eq!(
        harness.state().field_solution().map(|r| r.request),
        Some(asked)
    );
    assert_eq!(readout_with_mark(&harness, RESONANCE).0, before.0);
    wait_for_field(&mut harness);
    assert_eq!(
        harness.state().field_solution().map(|r| r.request),
        Some(asked)
    );
    assert_eq!(readout_with_mark(&harness, RESONANCE), before);
    assert_eq!(
        harness.state().figures().expect("valid").analysis.resonance,
        headless(&harness).analysis.resonance
    );
}

#[test]
fn switched_off_the_classical_model_leads_and_no_worker_answer_is_used() {
    let mut harness = workbench(egui::vec2(1400.0, 900.0));
    wait_for_field(&mut harness);
    harness.get_by_label("View").click();
    harness.run();
    harness.get_by_label(FIELD_SOLUTION_ENTRY).click();
    harness.run();
    harness.run();
    assert!(!harness.state().preferences().field_solution);
    let (shown, mark) = readout_with_mark(&harness, RESONANCE);
    assert_eq!(mark, MODEL);
    let r = harness.state().recipe().clone();
    let classical = evaluate(&r.winding, &r.tank, &r.conditions).expect("valid");
    assert_eq!(shown, digits::mhz(classical.resonance));
    assert_eq!(
        harness.state().figures().expect("valid").verdict.resonance,
        classical.resonance
    );
    assert_eq!(readout_with_mark(&harness, FIELD_RESONANCE).0, SWITCHED_OFF);
    assert!(harness.state().field_solution().is_none());
}

#[test]
fn the_impedance_chart_opens_inside_a_small_window() {
    let mut harness = workbench(egui::vec2(1280.0, 720.0));
    // On a short screen the readouts start folded: open them as a user would.
    harness.get_by_label(READOUTS_HEADING).click();
    harness.run();
    wait_for_field(&mut harness);
    // The tank comes first (the figures wait for it), the chart's sweep after it.
    let start = Instant::now();
    while harness
        .state()
        .field_solution()
        .is_none_or(|r| r.sweep.is_none())
    {
        assert!(
            start.elapsed() < Duration::from_secs(120),
            "the sweep never arrived"
        );
        std::thread::sleep(Duration::from_millis(5));
        harness.step();
    }
    // The section sits under the readouts: scroll the right column to it, open it, and
    // bring its charts into view.
    harness.get_by_label("Impedance of the coil").scroll_to_me();
    harness.run();
    harness.get_by_label("Impedance of the coil").click();
    harness.run();
    harness.get_by_label(Q_NOTE).scroll_to_me();
    harness.run();
    let chart = harness.get_by_label("impedance chart");
    let q = harness.get_by_label("Q chart");
    let width = 1280.0;
    for rect in [chart.rect(), q.rect()] {
        assert!(rect.width() > 150.0 && rect.height() > 100.0, "{rect:?}");
        assert!(rect.left() >= 0.0 && rect.right() <= width, "{rect:?}");
    }
    let text = screen_text(&harness);
    assert!(
        text.iter()
            .any(|t| t.starts_with("Field solution (") && t.contains("segments")),
        "{text:?}"
    );
}

/// Issue 24: a coil measurement kept with the recipe is drawn on the impedance chart beside the
/// field solution and the classical estimate, with the differences in words, and it
/// calibrates the figures (the verdict's basis line says so). The measurement is the demo
/// coil's field solution with every impedance × 1.04 (Terman's network: L × 1.04, C / 1.04),
/// so the window must state 1.040 of the field solution's inductance.
#[test]
fn a_kept_measurement_is_drawn_on_the_impedance_chart_and_calibrates() {
    use tankwright::instruments::touchstone::ImpedanceSample;
    use tankwright::model::Coil;
    use tankwright::recipe::Recipe;
    use tankwright::tuning::impedance::impedance_sweep;
    use tankwright::tuning::measured_coil::fit_measured_coil;
    use tankwright::tuning::measured_field::CoilMeasurement;
    let mut recipe = Recipe::demo();
    let coil = Coil::from_winding(&recipe.winding).expect("coil");
    let band = (20e6, 200e6);
    let sweep = impedance_sweep(&coil, 20.0, Some(band.0), Some(band.1), 24, None).expect("solves");
    let samples: Vec<ImpedanceSample> = sweep
        .points
        .iter()
        .map(|p| ImpedanceSample {
            frequency: p.frequency,
            impedance: p.impedance * 1.04,
        })
        .collect();
    recipe.coil_measurement = Some(CoilMeasurement {
        source: "wound.s1p".to_owned(),
        winding: recipe.winding,
        band,
        coil: fit_measured_coil(&samples, None).expect("fits"),
    });
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1600.0, 1000.0))
        .build_eframe(move |_cc| App::with_recipe(recipe.clone()));
    harness.run();
    // Calibrated by the measurement, the resonance is marked calibrated, not field-solved:
    // wait for the worker's tank and sweep themselves, and for the figures landed on them.
    let start = Instant::now();
    while harness
        .state()
        .field_solution()
        .is_none_or(|r| r.sweep.is_none())
        || harness.state().updating()
    {
        assert!(
            start.elapsed() < Duration::from_secs(120),
            "the sweep never arrived"
        );
        std::thread::sleep(Duration::from_millis(5));
        harness.step();
    }
    harness.get_by_label("Impedance of the coil").scroll_to_me();
    harness.run();
    harness.get_by_label("Impedance of the coil").click();
    harness.run();
    let text = screen_text(&harness);
    assert!(
        text.iter().any(|t| t.starts_with("Measured coil dotted:")
            && t.contains("1.040 × the field solution's inductance")),
        "{text:?}"
    );
    assert!(
        text.iter()
            .any(|t| t.contains("Calibrated on the measured coil's inductance")),
        "{text:?}"
    );
}

//! The field solution in the window: computed off the frame, shown as an estimate until it
//! arrives, then marked field-solved with the same figure the headless path gives; an
//! in-flight solution for a coil that has since changed is dropped; the impedance chart.

mod common;

use common::screen_text;
use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use std::time::{Duration, Instant};
use tankwright::tuning::field_tank::field_tank;
use tankwright::ui::App;
use tankwright::ui::charts::impedance::Q_NOTE;
use tankwright::ui::panels::readouts::{BEING_COMPUTED, FIELD_RESONANCE, MODEL, READOUTS_HEADING};

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

/// Run frames until the field-solved resonance is shown (the worker thread's time, not a
/// timing check: the bound only stops a hung test).
fn wait_for_field(harness: &mut Harness<'_, App>) {
    let start = Instant::now();
    while readout_with_mark(harness, FIELD_RESONANCE).0 == BEING_COMPUTED {
        assert!(
            start.elapsed() < Duration::from_secs(120),
            "the field solution never arrived"
        );
        std::thread::sleep(Duration::from_millis(5));
        harness.step();
    }
}

/// The headless figure for what the window holds: the same function `evaluate` calls.
fn headless_mhz(harness: &Harness<'_, App>) -> String {
    let app = harness.state();
    let figures = app.figures().expect("a valid coil");
    let tank = field_tank(
        &figures.coil,
        figures.uncalibrated.external_capacitance,
        &app.recipe().conditions,
    )
    .expect("the demo coil solves");
    format!("{:.3} MHz", tank.resonance * 1e-6)
}

#[test]
fn a_change_shows_the_estimate_until_the_field_solution_replaces_it() {
    let mut harness = workbench(egui::vec2(1400.0, 900.0));
    wait_for_field(&mut harness);
    let (shown, _) = readout_with_mark(&harness, FIELD_RESONANCE);
    let first = headless_mhz(&harness);
    assert!(
        shown.starts_with(&format!("{first} (")),
        "{shown} vs {first}"
    );
    // The model's resonance leads, beside it: the figure the verdict uses.
    let (model, mark) = readout_with_mark(&harness, "Resonance");
    assert_eq!(mark, MODEL);
    let classical = harness.state().analysis().expect("valid").resonance;
    assert_eq!(model, format!("{:.3} MHz", classical * 1e-6));

    harness
        .get_by_role_and_label(Role::Slider, "Turns")
        .set_value_accesskit(6.0);
    // The frame that applies the change asks for a new solution; the next one says it is
    // being computed, and the model's figure is already the new coil's.
    harness.step();
    harness.step();
    assert_eq!(harness.state().recipe().winding.turns, 6.0);
    assert_eq!(
        readout_with_mark(&harness, FIELD_RESONANCE).0,
        BEING_COMPUTED
    );
    let (estimate, _) = readout_with_mark(&harness, "Resonance");
    let classical = harness.state().analysis().expect("valid").resonance;
    assert_eq!(estimate, format!("{:.3} MHz", classical * 1e-6));

    wait_for_field(&mut harness);
    let (solved, _) = readout_with_mark(&harness, FIELD_RESONANCE);
    let second = headless_mhz(&harness);
    assert!(
        solved.starts_with(&format!("{second} (")),
        "{solved} vs {second}"
    );
    assert_ne!(first, second, "the field solution follows the coil");
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
    let (solved, _) = readout_with_mark(&harness, FIELD_RESONANCE);
    let headless = headless_mhz(&harness);
    assert!(
        solved.starts_with(&format!("{headless} (")),
        "{solved} vs {headless}"
    );
}

#[test]
fn the_impedance_chart_opens_inside_a_small_window() {
    let mut harness = workbench(egui::vec2(1280.0, 720.0));
    // On a short screen the readouts start folded: open them as a user would.
    harness.get_by_label(READOUTS_HEADING).click();
    harness.run();
    wait_for_field(&mut harness);
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

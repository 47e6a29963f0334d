//! Issue 20: the figures landed on the field solution are computed off the frame. When the
//! field solution's answer for a changed coil arrives, the window shows the figures with its
//! factor held at once (marked "updating" in the top bar) while a worker lands every figure
//! away from the present coil on field solves; its answer then replaces them, and an answer
//! for a coil that has since changed is dropped. The settled figures are those of
//! `recipe::figures` (the function `report` and the build sheet call, which solves the field
//! there and then), so the window and the commands agree; the field solution itself is held
//! to nec2c in tests/engine/reference_field.rs.
//!
//! Nothing is timed: each wait is for a condition, with a generous deadline that only stops
//! a hung test.

use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use std::time::{Duration, Instant};
use tankwright::recipe::{FieldBasis, figures};
use tankwright::ui::App;
use tankwright::ui::panels::top_bar::UPDATING_MARK;

fn workbench() -> Harness<'static, App> {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 900.0))
        .build_eframe(|cc| App::new(cc));
    harness.run();
    harness
}

/// Run frames until nothing is being computed off the frame and the figures stand on this
/// coil's own field solution.
fn settle(harness: &mut Harness<'_, App>) {
    let start = Instant::now();
    loop {
        harness.step();
        let app = harness.state();
        let solved = app
            .figures()
            .is_some_and(|f| matches!(f.field, FieldBasis::Solved { .. }) && f.led.is_some());
        if solved && !app.updating() {
            harness.step();
            return;
        }
        assert!(
            start.elapsed() < Duration::from_secs(300),
            "the figures never settled"
        );
        std::thread::sleep(Duration::from_millis(5));
    }
}

/// The settled window's figures are the headless ones for the same recipe.
fn agrees_with_headless(harness: &Harness<'_, App>) {
    let shown = harness.state().figures().expect("valid").clone();
    let headless = figures(harness.state().recipe()).expect("valid");
    assert_eq!(shown.coil, headless.coil);
    assert!(
        (shown.analysis.resonance / headless.analysis.resonance - 1.0).abs() <= 1e-9,
        "{} against {}",
        shown.analysis.resonance,
        headless.analysis.resonance
    );
    assert_eq!(shown.target.advice, headless.target.advice);
    assert_eq!(shown.target.window, headless.target.window);
    assert_eq!(shown.led, headless.led);
}

#[test]
fn after_a_coil_change_the_figures_settle_on_the_field_solution() {
    let mut harness = workbench();
    settle(&mut harness);
    agrees_with_headless(&harness);
    assert_eq!(harness.query_all_by_label(UPDATING_MARK).count(), 0);

    harness
        .get_by_role_and_label(Role::Slider, "Turns")
        .set_value_accesskit(6.0);
    harness.step();
    harness.step();
    // At once: the six-turn coil's figures (held or classical), marked as updating.
    assert_eq!(harness.state().figures().expect("valid").coil.turns(), 6.0);
    assert!(harness.state().updating());
    assert_eq!(harness.query_all_by_label(UPDATING_MARK).count(), 1);
    settle(&mut harness);
    assert_eq!(harness.state().figures().expect("valid").coil.turns(), 6.0);
    agrees_with_headless(&harness);
    assert_eq!(harness.query_all_by_label(UPDATING_MARK).count(), 0);
}

#[test]
fn an_answer_for_a_coil_since_changed_is_dropped() {
    let mut harness = workbench();
    settle(&mut harness);
    // Two changes, the second before anything for the first could land.
    for turns in [6.0, 7.0] {
        harness
            .get_by_role_and_label(Role::Slider, "Turns")
            .set_value_accesskit(turns);
        harness.step();
        harness.step();
    }
    settle(&mut harness);
    assert_eq!(harness.state().figures().expect("valid").coil.turns(), 7.0);
    agrees_with_headless(&harness);
    // Still settled a while later: nothing stale arrives after.
    for _ in 0..10 {
        std::thread::sleep(Duration::from_millis(20));
        harness.step();
    }
    assert!(!harness.state().updating());
    agrees_with_headless(&harness);
}

/// Issue 20: where the field solution leads, the readouts give the coil's self-capacitance
/// from it (the capacitance that resonates the low-frequency inductance at the field-solved
/// self-resonance; Medhurst 1947's table stays beside it as the classical comparison) and name
/// the inductance an LCR meter reads (low frequency) apart from the apparent inductance at the
/// operating frequency. The figures are `recipe::figures`' own field-solved tank (held to
/// nec2c in tests/engine/reference_field.rs), as printed to their digits.
#[test]
fn the_readouts_give_the_field_self_capacitance_and_the_meter_inductance() {
    use tankwright::ui::panels::readouts::METER_INDUCTANCE;
    let mut harness = workbench();
    settle(&mut harness);
    let headless = figures(harness.state().recipe()).expect("valid");
    let tank = headless.field.tank().expect("the demo coil solves");
    let text = crate::common::screen_text(&harness);
    let after = |name: &str| {
        let at = text
            .iter()
            .position(|t| t == name)
            .unwrap_or_else(|| panic!("no readout {name:?}"));
        text[at + 1].clone()
    };
    assert_eq!(
        after(METER_INDUCTANCE),
        format!("{:.1} nH", tank.low_frequency_inductance * 1e9)
    );
    assert_eq!(
        after("Self-capacitance"),
        format!("{:.2} pF", tank.self_capacitance() * 1e12)
    );
    // The meter's inductance lies below the apparent inductance at the operating frequency.
    assert!(tank.low_frequency_inductance < tank.apparent_inductance);
}

//! The stray estimate in the window: a building method gives a breakdown whose total and
//! frequency window change with it, and applying it puts the typical stray into the tank.
//! The figures are the engine's (`tuning::stray`, checked in tests/reference_stray.rs); this
//! checks that the window shows and applies them.

mod common;

use common::screen_text;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use tankwright::ui::App;
use tankwright::ui::panels::stray::{APPLY_STRAY_LABEL, CONSTRUCTION_LABEL};

fn workbench() -> Harness<'static, App> {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 1400.0))
        .build_eframe(|cc| App::new(cc));
    harness.run();
    harness.get_by_label("Where the stray comes from").click();
    harness.run();
    harness
}

fn stray_lines(harness: &Harness<'_, App>) -> Vec<String> {
    let text = screen_text(harness);
    let start = text
        .iter()
        .position(|t| t == CONSTRUCTION_LABEL)
        .expect("the stray panel is open");
    text[start..]
        .iter()
        .take_while(|t| t.as_str() != APPLY_STRAY_LABEL)
        .cloned()
        .collect()
}

#[test]
fn another_building_method_changes_the_breakdown_and_applying_sets_the_stray() {
    let mut harness = workbench();
    let first = stray_lines(&harness);
    assert!(first.iter().any(|t| t == "stray in all"), "{first:?}");
    assert!(first.iter().any(|t| t.starts_with("Expect ")), "{first:?}");
    assert!(
        first
            .iter()
            .any(|t| t.starts_with("With the winding's own tolerances")),
        "{first:?}"
    );

    harness.get_by_label(CONSTRUCTION_LABEL).click();
    harness.run();
    harness.get_by_label("solderless breadboard").click();
    harness.run();
    let second = stray_lines(&harness);
    assert_ne!(first, second, "the breakdown follows the building method");

    let before = harness.state().recipe().tank.stray;
    harness.get_by_label(APPLY_STRAY_LABEL).click_accesskit();
    harness.run();
    let after = harness.state().recipe().tank.stray;
    assert_ne!(before, after);
    // Applying again changes nothing: the estimate replaces the stray as entered.
    harness.get_by_label(APPLY_STRAY_LABEL).click_accesskit();
    harness.run();
    assert_eq!(harness.state().recipe().tank.stray, after);
}

//! Design from the parts on hand in the window: the panel's search (the engine's
//! `tuning::design::search`, checked against `recipe::figures` and `tankwright evaluate` in
//! tests/engine/design.rs and tests/cli/cli_design.rs) answers without freezing the window,
//! and Load puts the candidate into the recipe as one undo step.

use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use tankwright::ui::App;
use tankwright::ui::panels::parts_on_hand::SEARCH_LABEL;

#[test]
fn a_candidate_loads_into_the_recipe_and_undo_brings_the_old_back() {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 1000.0))
        .build_eframe(|cc| App::new(cc).with_field_solution(false));
    harness.run();
    harness
        .get_by_label("Design from the parts on hand")
        .click();
    harness.run();
    let before = harness.state().recipe().clone();
    harness.get_by_label(SEARCH_LABEL).click();
    // The spinner repaints while the search runs: step, never wait for the window to settle.
    harness.step();
    // The search runs on its own thread: wait for the table with a generous deadline (a
    // debug build solves the field some tens of times).
    let deadline = std::time::Instant::now() + std::time::Duration::from_secs(300);
    while harness.query_by_label("Load 1").is_none() {
        assert!(
            std::time::Instant::now() < deadline,
            "no candidate within 300 s"
        );
        std::thread::sleep(std::time::Duration::from_millis(50));
        harness.step();
    }
    harness.get_by_label("Load 1").click();
    harness.run();
    let loaded = harness.state().recipe().clone();
    assert_ne!(loaded.winding, before.winding);
    assert!(
        loaded.name.starts_with("Designed for 98.7"),
        "{}",
        loaded.name
    );
    assert_eq!(loaded.target.channel, before.target.channel);
    // Every part of the loaded coil comes from the panel's drawer (5–8 mm formers, 2–10 or
    // 4–20 pF trimmers).
    assert!(matches!(
        loaded.winding.diameter,
        tankwright::model::DiameterSpec::Former(d) if [5e-3, 6e-3, 7e-3, 8e-3].contains(&d)
    ));
    assert!([2e-12, 4e-12].contains(&loaded.tank.trimmer_min));
    harness.get_by_label("Undo").click();
    harness.run();
    assert_eq!(harness.state().recipe().winding, before.winding);
    assert_eq!(harness.state().recipe().tank, before.tank);
}

//! Issue 20: a reading the fit suspects of being a harmonic (about 2× or ½× the prediction)
//! is left out of the calibration until the user includes it, with a checkbox beside that
//! reading in the bench log (and only there).
//!
//! The "bench" is the engine itself (the classical model, the field solution switched off so
//! no worker's answer moves a figure between two reads): two readings at the trimmer's ends
//! are the model's own resonance, a third is twice the first (a counter on the second
//! harmonic; common practice). The fit is weighted least squares (Press et al., *Numerical
//! Recipes*, 3rd ed., 2007, §15.4), held to its forward model in tests/engine/bench_fit.rs.

use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use tankwright::model::evaluate::resonance_of;
use tankwright::recipe::BenchEntry;
use tankwright::ui::App;
use tankwright::ui::bench_log::include_label;

fn workbench() -> Harness<'static, App> {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 1400.0))
        .build_eframe(|cc| App::new(cc).with_field_solution(false));
    harness.run();
    harness
}

/// A reading of `measured` hertz at the present coil and `setting`.
fn entry(harness: &Harness<'_, App>, measured: f64, setting: f64) -> BenchEntry {
    let coil = harness.state().figures().expect("valid").coil;
    BenchEntry {
        measured,
        length: coil.length(),
        trimmer_setting: setting,
        added_capacitance: 0.0,
        added_tolerance: None,
        instrument: "counter".to_owned(),
        error_ppm: Some(2.0),
        note: String::new(),
        include_anyway: false,
    }
}

#[test]
fn a_suspected_harmonic_is_included_with_its_checkbox() {
    let mut harness = workbench();
    let recipe = harness.state().recipe().clone();
    let coil = harness.state().figures().expect("valid").coil;
    let at = |s: f64| {
        resonance_of(
            &coil,
            recipe.tank.external_capacitance_at(s),
            &recipe.conditions,
        )
    };
    let readings = [
        entry(&harness, at(0.0), 0.0),
        entry(&harness, at(1.0), 1.0),
        entry(&harness, 2.0 * at(0.0), 0.0),
    ];
    harness.state_mut().recipe_mut().bench_log.extend(readings);
    harness.run();
    harness.run();
    assert_eq!(harness.state().figures().expect("valid").readings_used(), 2);
    // The checkbox only on the suspected reading.
    assert_eq!(harness.query_all_by_label(&include_label(0)).count(), 0);
    assert_eq!(harness.query_all_by_label(&include_label(1)).count(), 0);
    let label = include_label(2);
    assert_eq!(label, "Include reading 3 in the fit anyway");
    harness.get_by_label(&label).scroll_to_me();
    harness.run();
    harness.get_by_label(&label).click_accesskit();
    harness.run();
    harness.run();
    assert!(harness.state().recipe().bench_log[2].include_anyway);
    let f = harness.state().figures().expect("valid");
    assert_eq!(f.readings_used(), 3, "the included reading is in the fit");
    // Still shown (so it can be unticked), and unticking leaves it out again.
    harness.get_by_label(&label).click_accesskit();
    harness.run();
    harness.run();
    assert!(!harness.state().recipe().bench_log[2].include_anyway);
    assert_eq!(harness.state().figures().expect("valid").readings_used(), 2);
}

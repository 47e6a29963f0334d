//! Modulation and drift in the window: the deviation shown is the engine's figure for the
//! junction law and levels set, and the drift budget's worst case changes with the fixed
//! capacitor's temperature class. The figures themselves are checked against ngspice and the
//! standard's table in tests/reference_junction.rs and tests/reference_stray.rs.

mod common;

use common::screen_text;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use tankwright::model::Coil;
use tankwright::physics::junction::JunctionLaw;
use tankwright::tuning::modulation::{ModulationInputs, Modulator, modulation};
use tankwright::ui::App;
use tankwright::ui::panels::audio::CLASS_LABEL;

fn workbench() -> Harness<'static, App> {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 1600.0))
        .build_eframe(|cc| App::new(cc));
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

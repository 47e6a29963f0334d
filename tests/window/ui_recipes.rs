//! Recipes and the bench log through the whole window, driven by label and role.

use crate::common;

use common::{QueuedAnswers as Scripted, screen_text};
use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use tankwright::recipe::store;
use tankwright::ui::App;
use tankwright::ui::files::Picked;

fn workbench(asker: Scripted) -> Harness<'static, App> {
    common::window_with_asker(asker, 1400.0, 1400.0)
}

fn menu(harness: &mut Harness<'_, App>, item: &str) {
    harness.get_by_label("Recipe").click();
    harness.run();
    harness.get_by_label(item).click();
    harness.run();
}

#[test]
fn edit_save_reopen_and_compare() {
    let dir = tempfile::tempdir().expect("temp dir");
    let path = dir.path().join("six_turns.ron");
    let asker = Scripted::default();
    let mut harness = workbench(asker.clone());
    assert!(
        !harness.state().title().starts_with('•'),
        "{}",
        harness.state().title()
    );

    harness
        .get_by_role_and_label(Role::Slider, "Turns")
        .set_value_accesskit(6.0);
    harness.run();
    assert!(
        harness.state().title().starts_with('•'),
        "an edit marks the recipe unsaved"
    );

    asker.0.borrow_mut().push_back(Picked::Path(path.clone()));
    menu(&mut harness, "Save… Ctrl+S");
    assert!(path.exists(), "saved to {}", path.display());
    assert!(
        !harness.state().title().starts_with('•'),
        "saved: {}",
        harness.state().title()
    );
    let edited = harness.state().recipe().clone();
    assert_eq!(store::load(&path).expect("the file reads back"), edited);

    menu(&mut harness, "New recipe Ctrl+N");
    assert_ne!(
        harness.state().recipe().winding.turns,
        6.0,
        "a new recipe replaced it"
    );

    asker.0.borrow_mut().push_back(Picked::Path(path.clone()));
    menu(&mut harness, "Open… Ctrl+O");
    assert_eq!(harness.state().recipe(), &edited);
}

/// A reading below the model's resonance means more capacitance than assumed: the window says
/// to stretch, and its button does.
#[test]
fn a_bench_reading_gives_the_stretch_to_the_target() {
    let mut harness = workbench(Scripted::default());
    let before = harness.state().recipe().winding.spacing;
    harness
        .get_by_label("Measured frequency")
        .set_value_accesskit(97.5);
    harness.run();
    // The bench log sits below the readouts: bring it into view first, as a user scrolls.
    harness.get_by_label("Record reading").scroll_to_me();
    harness.run();
    harness.get_by_label("Record reading").click();
    harness.run();
    let log = &harness.state().recipe().bench_log;
    assert_eq!(log.len(), 1);
    assert_eq!(log[0].measured, 97.5e6);
    let text = screen_text(&harness).join("\n");
    assert!(text.contains("stretch the coil by"), "{text}");
    assert!(text.contains("beyond the model"), "{text}");

    harness
        .get_by_label(tankwright::ui::bench_log::APPLY_ADVICE_LABEL)
        .scroll_to_me();
    harness.run();
    harness
        .get_by_label(tankwright::ui::bench_log::APPLY_ADVICE_LABEL)
        .click();
    harness.run();
    let after = harness.state().recipe().winding.spacing;
    assert_ne!(before, after);
    let (tankwright::model::SpacingSpec::Length(l0), tankwright::model::SpacingSpec::Length(l1)) =
        (before, after)
    else {
        panic!("the demo gives the length: {after:?}");
    };
    assert!(l1 > l0, "stretched from {l0} to {l1}");
}

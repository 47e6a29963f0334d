//! Recipe → New starts from a stated starting point (issue 21): the usual parts of the
//! service on screen, no feedback divider hiding across the tank, and the first screen says
//! where to start.

use crate::common::screen_text;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use tankwright::recipe::Recipe;
use tankwright::tuning::service::Service;
use tankwright::ui::App;

fn new_from(recipe: Recipe) -> Harness<'static, App> {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1280.0, 720.0))
        .build_eframe(move |_cc| App::with_recipe(recipe.clone()).with_field_solution(false));
    harness.run();
    harness.get_by_label("Recipe").click();
    harness.run();
    harness.get_by_label("New recipe Ctrl+N").click();
    harness.run();
    harness
}

#[test]
fn new_starts_from_the_services_parts_with_no_hidden_divider_and_says_where_to_start() {
    let two_metre = tankwright::recipe::demos::demos()
        .into_iter()
        .find(|(_, r)| r.target.plan.service() == Some(Service::TwoMetreAmateur))
        .map(|(_, r)| r)
        .expect("a 2 m demo");
    for (from, service) in [
        (Recipe::demo(), Service::FmBroadcast),
        (two_metre, Service::TwoMetreAmateur),
    ] {
        // The demo it starts from has a divider ticked: the new recipe must not keep it.
        let harness = new_from(from);
        let recipe = harness.state().recipe();
        assert_eq!(recipe.name, "New recipe");
        assert_eq!(
            recipe.tank.feedback, None,
            "{service:?}: a divider was kept"
        );
        assert!(recipe.bench_log.is_empty());
        assert_eq!(recipe.target.plan.service(), Some(service));
        assert!(
            recipe.notes.starts_with("Starting point for"),
            "{}",
            recipe.notes
        );
        let text = screen_text(&harness).join("\n");
        assert!(
            text.contains(&format!("from the {} starting point", service.label()))
                && text.contains("pick the band plan and channel on the right"),
            "the first screen does not say where to start:\n{text}"
        );
        // In band on the figures the window shows by default (the field solution leads):
        // tests/engine/verdict.rs, each_services_starting_point_is_in_band_and_hides_no_divider.
        assert!(harness.state().figures().is_some(), "the start is valid");
    }
}

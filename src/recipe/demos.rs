//! The demo recipes under assets/recipes, compiled in: an invented scenario (the Lantern Hill
//! radio club's bench coils). Opening one gives a copy; saving it goes to the user's folder.

use super::document::Recipe;
use super::format::from_text;

/// File name and text of every demo, the first being [`Recipe::demo`].
pub const SOURCES: [(&str, &str); 4] = [
    (
        "lantern_hill_bench_oscillator.ron",
        include_str!("../../assets/recipes/lantern_hill_bench_oscillator.ron"),
    ),
    (
        "lantern_hill_two_metre_buffer.ron",
        include_str!("../../assets/recipes/lantern_hill_two_metre_buffer.ron"),
    ),
    (
        "apprentice_enamel_exercise.ron",
        include_str!("../../assets/recipes/apprentice_enamel_exercise.ron"),
    ),
    (
        "field_day_club_channels.ron",
        include_str!("../../assets/recipes/field_day_club_channels.ron"),
    ),
];

/// The demo recipes: (file name, recipe), in menu order. A demo that fails to read is left
/// out (the tests make sure none does).
pub fn demos() -> Vec<(&'static str, Recipe)> {
    SOURCES
        .iter()
        .filter_map(|&(name, text)| from_text(text).ok().map(|r| (name, r)))
        .collect()
}

/// What "new recipe" starts from: the demo's coil and tank under a new name, with no notes
/// and an empty bench log (a workable coil to shape, rather than empty fields).
pub fn starting_recipe() -> Recipe {
    Recipe {
        name: "New recipe".to_owned(),
        notes: String::new(),
        bench_log: Vec::new(),
        ..Recipe::demo()
    }
}

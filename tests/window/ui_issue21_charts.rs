//! Issue 21's charts in the window, driven by label and role: a fixed tank has one curve and
//! a sentence in place of the trimmer chart, its hover lists no identical lines, a reading
//! taken with a capacitor clipped on has its own marker and legend entry, the charts keep
//! their least height at 1280×720, and the presentation layout's legends are projector-sized.
//!
//! Sources: Thomson's formula f = 1/(2π√(LC)): a tank with no variable capacitance has one
//! resonance per coil length, hence one curve. Projector type of about 18 pt is common
//! practice for slides (nothing smaller read from the back of a small room).

use crate::common::screen_text;
use egui_kittest::Harness;
use egui_kittest::kittest::{NodeT, Queryable};
use tankwright::model::{Coil, Conditions, Tank, evaluate_coil};
use tankwright::recipe::{BenchEntry, Recipe, figures, store};
use tankwright::ui::App;
use tankwright::ui::charts::{
    CLIPPED_READINGS_LABEL, ChartCache, ChartView, FIXED_CURVE_LABEL, MIN_PLOT_HEIGHT,
    READINGS_LABEL, SPACING_CHART_LABEL, SpacingAxis, TRIMMER_CHART_LABEL, hover,
};
use tankwright::ui::panels::bench::FIXED_TANK_NOTE;
use tankwright::ui::teaching::presentation::LEGEND_POINTS;
use tankwright::ui::units::LengthUnit;

const RECIPES: [&str; 4] = [
    "assets/recipes/apprentice_enamel_exercise.ron",
    "assets/recipes/field_day_club_channels.ron",
    "assets/recipes/lantern_hill_bench_oscillator.ron",
    "assets/recipes/lantern_hill_two_metre_buffer.ron",
];

fn shipped(path: &str) -> Recipe {
    store::load(std::path::Path::new(path)).unwrap_or_else(|e| panic!("{path}: {e}"))
}

fn open(recipe: Recipe, size: (f32, f32)) -> Harness<'static, App> {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(size.0, size.1))
        .build_eframe(move |_cc| App::with_recipe(recipe.clone()).with_field_solution(false));
    harness.run();
    harness
}

#[test]
fn a_fixed_tank_shows_one_curve_and_a_sentence_instead_of_the_trimmer_chart() {
    let recipe = shipped(RECIPES[0]);
    assert!(recipe.tank.is_fixed());
    let harness = open(recipe, (1600.0, 1000.0));
    assert!(
        harness
            .query_all_by_label(TRIMMER_CHART_LABEL)
            .next()
            .is_none(),
        "a trimmer chart for a fixed tank"
    );
    harness.get_by_label(FIXED_TANK_NOTE);
    harness.get_by_label(FIXED_CURVE_LABEL);
    harness.get_by_label(SPACING_CHART_LABEL);
    harness.get_by_label("none (a fixed tank)");
    let text = screen_text(&harness).join("\n");
    assert!(!text.contains("Trimmer reaches"), "{text}");
    assert!(!text.contains("trimmer's travel"), "{text}");
    assert!(text.contains("the fixed tank ("), "{text}");
    // A tank with a trimmer keeps both charts.
    let harness = open(shipped(RECIPES[2]), (1600.0, 1000.0));
    harness.get_by_label(TRIMMER_CHART_LABEL);
    assert!(harness.query_all_by_label(FIXED_TANK_NOTE).next().is_none());
}

/// The hover over a fixed tank's spacing chart: one line for its one curve, read at the
/// pointer's length (the engine's resonance there within the sweep's interpolation: half a
/// kHz of display rounding plus an eighth of the curve's bend per sample).
#[test]
fn the_hover_of_a_fixed_tank_lists_its_one_curve_once() {
    let demo = Recipe::demo();
    let coil = Coil::from_winding(&demo.winding).expect("valid");
    let tank = Tank::fixed_only(10e-12, 4e-12);
    let conditions = Conditions::default();
    let mut cache = ChartCache::default();
    cache.refresh(&coil, &tank, &conditions);
    assert_eq!(cache.spacing_curves().len(), 1);
    let exact = evaluate_coil(&coil, tank.external_capacitance(), &conditions).resonance;
    let bend = cache.spacing_curves()[0]
        .points
        .windows(3)
        .map(|w| (w[2][1] - 2.0 * w[1][1] + w[0][1]).abs())
        .fold(0.0, f64::max);
    let view = ChartView {
        classical: None,
        uncalibrated: None,
        readings: &[],
        cache: &cache,
        coil: &coil,
        tank: &tank,
        target_hz: 98.7e6,
        channel_width_hz: 200e3,
        resonance_hz: exact,
        axis: SpacingAxis::Length,
        unit: LengthUnit::Millimetres,
        overlays: &[],
        operating: None,
    };
    let text = hover::spacing_text(&view, view.x_of_length(coil.length()));
    let lines: Vec<&str> = text.lines().skip(1).collect();
    assert_eq!(lines.len(), 1, "{text}");
    let shown: f64 = lines[0]
        .trim_start_matches(&format!("{FIXED_CURVE_LABEL}: "))
        .trim_end_matches(" MHz")
        .parse()
        .unwrap_or_else(|_| panic!("{text}"));
    assert!(
        (shown * 1e6 - exact).abs() <= 500.0 + bend / 8.0 + 1e-6,
        "{shown} MHz against {exact} Hz"
    );
}

#[test]
fn a_reading_with_a_clipped_on_capacitor_has_its_own_legend_entry() {
    let mut recipe = Recipe::demo();
    let f = figures(&recipe).expect("valid");
    let entry = |measured: f64, added: f64| BenchEntry {
        include_anyway: false,
        measured,
        length: f.coil.length(),
        trimmer_setting: recipe.tank.trimmer_setting,
        added_capacitance: added,
        instrument: "club counter".to_owned(),
        error_ppm: None,
        note: String::new(),
        added_tolerance: None,
    };
    let plain = entry(f.target.resonance - 0.5e6, 0.0);
    recipe.bench_log.push(plain);
    let harness = open(recipe.clone(), (1600.0, 1000.0));
    assert!(harness.query_all_by_label(READINGS_LABEL).next().is_some());
    assert!(
        harness
            .query_all_by_label(CLIPPED_READINGS_LABEL)
            .next()
            .is_none()
    );
    let clipped = entry(f.target.resonance - 9.0e6, 10e-12);
    recipe.bench_log.push(clipped);
    let harness = open(recipe, (1600.0, 1000.0));
    // On both charts (the reading is at the present length).
    assert_eq!(
        harness.query_all_by_label(CLIPPED_READINGS_LABEL).count(),
        2
    );
    assert_eq!(harness.query_all_by_label(READINGS_LABEL).count(), 2);
}

/// At 1280×720 every shipped recipe's charts keep their least height (the spacing chart was
/// about 110 px tall); the centre scrolls instead. The chart's figure is its data area: the
/// plot's least height less the x axis's tick labels and title below it (24 pt at most).
#[test]
fn at_1280_by_720_every_chart_keeps_its_least_height() {
    for path in RECIPES {
        let harness = open(shipped(path), (1280.0, 720.0));
        let labels = [SPACING_CHART_LABEL, TRIMMER_CHART_LABEL];
        let mut seen = 0;
        for label in labels {
            for node in harness.query_all_by_label(label) {
                seen += 1;
                let h = node.rect().height();
                assert!(h >= MIN_PLOT_HEIGHT - 24.0, "{path}: {label} {h} pt tall");
            }
        }
        assert!(seen >= 1, "{path}: no chart");
    }
}

/// The presentation layout's legends are projector-sized (about 18 pt); the desk's are not.
#[test]
fn presentation_legends_are_projector_sized() {
    let mut harness = open(Recipe::demo(), (1280.0, 720.0));
    let height = |h: &Harness<'_, App>| {
        h.query_all_by_label("this coil")
            .map(|n| n.rect().height())
            .fold(0.0f32, f32::max)
    };
    let desk = height(&harness);
    assert!(desk > 0.0 && desk < LEGEND_POINTS, "desk legend {desk} pt");
    harness.key_press(egui::Key::F5);
    harness.run();
    assert!(harness.state().teaching().presentation());
    let projected = height(&harness);
    assert!(
        projected >= LEGEND_POINTS,
        "presentation legend {projected} pt, under {LEGEND_POINTS}"
    );
}

/// The Export menu greys the trimmer chart of a fixed tank (no setting moves its resonance)
/// and keeps the spacing chart; a tank with a trimmer offers both.
#[test]
fn the_export_menu_offers_no_trimmer_chart_for_a_fixed_tank() {
    for (path, fixed) in [(RECIPES[0], true), (RECIPES[2], false)] {
        let mut harness = open(shipped(path), (1600.0, 1000.0));
        harness.get_by_label("Export").click();
        harness.run();
        for ext in ["SVG", "PNG"] {
            let (trimmer, spacing) = (
                format!("Trimmer chart as {ext}…"),
                format!("Spacing chart as {ext}…"),
            );
            let disabled = |label: &str| harness.get_by_label(label).accesskit_node().is_disabled();
            assert_eq!(disabled(&trimmer), fixed, "{path}: trimmer {ext}");
            assert!(!disabled(&spacing), "{path}: spacing {ext}");
        }
    }
}

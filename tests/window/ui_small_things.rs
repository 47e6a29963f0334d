//! Issue 21's small things, through the window: figures carry the digits their uncertainty
//! allows, one rounding of the wire to cut in the window, `report` and the sheet, values kept
//! to the field's resolution when saved, typed digits never dropped, the channel list.
//!
//! Sources: the Guide to the expression of uncertainty in measurement (JCGM 100:2008, "GUM"),
//! §7.2.6: an uncertainty is stated to at most two significant digits, and the estimate is
//! rounded to the same place; that is the rule checked for every spread on screen.

use crate::common;

use common::screen_text;
use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::{NodeT, Queryable};
use tankwright::model::SpacingSpec;
use tankwright::recipe::{Footing, Recipe, format, store};
use tankwright::ui::App;

const RECIPES: [&str; 4] = [
    "assets/recipes/apprentice_enamel_exercise.ron",
    "assets/recipes/field_day_club_channels.ron",
    "assets/recipes/lantern_hill_bench_oscillator.ron",
    "assets/recipes/lantern_hill_two_metre_buffer.ron",
];

fn open(recipe: Recipe) -> Harness<'static, App> {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1600.0, 1000.0))
        .build_eframe(move |_cc| App::with_recipe(recipe.clone()).with_field_solution(false));
    harness.run();
    harness
}

fn shipped(path: &str) -> Recipe {
    store::load(std::path::Path::new(path)).unwrap_or_else(|e| panic!("{path}: {e}"))
}

/// The number at the start of `text`, with its count of decimals.
fn number_at(text: &str) -> Option<(f64, usize)> {
    let digits: String = text
        .chars()
        .take_while(|c| c.is_ascii_digit() || *c == '.')
        .collect();
    let value = digits.parse().ok()?;
    let decimals = digits.split_once('.').map_or(0, |(_, d)| d.len());
    Some((value, decimals))
}

/// Every "low–high MHz" range in `line`, with the decimals each end is written to.
fn ranges(line: &str) -> Vec<(f64, f64, usize)> {
    let mut out = Vec::new();
    for (i, _) in line.match_indices('–') {
        let before = &line[..i];
        let start = before
            .rfind(|c: char| !(c.is_ascii_digit() || c == '.'))
            .map_or(0, |p| p + 1);
        let after = &line[i + '–'.len_utf8()..];
        if let (Some((low, d1)), Some((high, d2))) = (number_at(&before[start..]), number_at(after))
        {
            let rest = &after[after
                .find(|c: char| !(c.is_ascii_digit() || c == '.'))
                .unwrap_or(after.len())..];
            if rest.starts_with(" MHz") {
                assert_eq!(d1, d2, "both ends to the same place: {line}");
                out.push((low, high, d1));
            }
        }
    }
    out
}

#[test]
fn every_spread_on_screen_carries_only_the_digits_its_width_allows() {
    let mut checked = 0;
    for path in RECIPES {
        let harness = open(shipped(path));
        for line in screen_text(&harness) {
            if !line.to_lowercase().contains("expect ") {
                continue;
            }
            for (low, high, decimals) in ranges(&line) {
                let width = high - low;
                let step = 10f64.powi(-(decimals as i32));
                // GUM §7.2.6: the width to at most two significant digits, so the last digit
                // written is no finer than a hundredth of the width; below 100 kHz, 1 kHz (the
                // tank frequency's own resolution, 3 decimals) is the finest step written.
                assert!(
                    step >= width / 100.0 || (width < 0.1 && decimals == 3),
                    "{path}: {decimals} decimals for a {width:.4} MHz spread: {line}"
                );
                checked += 1;
            }
        }
    }
    assert!(checked >= 4, "only {checked} spreads found on screen");
}

#[test]
fn a_spread_over_a_megahertz_reads_to_a_tenth_or_a_hundredth() {
    // The case: a 9.6 MHz spread read "92.569–102.154 MHz".
    let mut wide = 0;
    for path in RECIPES {
        let harness = open(shipped(path));
        for line in screen_text(&harness) {
            if !line.to_lowercase().contains("expect ") {
                continue;
            }
            for (low, high, decimals) in ranges(&line) {
                if high - low >= 1.0 {
                    assert!(decimals <= 2, "{path}: {line}");
                    wide += 1;
                }
            }
        }
    }
    assert!(
        wide >= 1,
        "no spread of a megahertz or more on the shipped recipes"
    );
}

#[test]
fn the_wire_to_cut_reads_the_same_in_the_window_the_report_and_the_sheet() {
    for path in RECIPES {
        let recipe = shipped(path);
        let harness = open(recipe.clone());
        let text = screen_text(&harness);
        let at = text
            .iter()
            .position(|t| t == "Wire to cut")
            .unwrap_or_else(|| panic!("{path}: no wire to cut on screen"));
        let window = text[at + 1].clone();
        let report = tankwright::cli::build_report(&recipe).expect("report");
        let report_line = report
            .lines()
            .find(|l| l.trim_start().starts_with("wire to cut"))
            .expect("wire to cut in the report");
        let sheet = tankwright::handout::sheet(&recipe, Footing::Classical).expect("sheet");
        let sheet_row = sheet
            .coil
            .iter()
            .find(|(name, _)| name == "wire to cut")
            .map(|(_, v)| v.clone())
            .expect("wire to cut on the sheet");
        assert!(window.ends_with(" mm"), "{window}");
        assert!(
            report_line.contains(&format!(" {window} ")),
            "{path}: window {window:?}, report {report_line:?}"
        );
        assert!(
            sheet_row.starts_with(&format!("{window} ")),
            "{path}: window {window:?}, sheet {sheet_row:?}"
        );
    }
}

#[test]
fn no_uncertainty_is_shown_as_plus_minus_zero() {
    for path in RECIPES {
        let harness = open(shipped(path));
        for line in screen_text(&harness) {
            assert!(
                !line.contains("±0.00 ") && !line.contains("±0.000 "),
                "{path}: {line}"
            );
        }
    }
}

#[test]
fn a_reading_at_the_present_length_is_saved_to_the_fields_resolution() {
    let mut recipe = Recipe::demo();
    // A length the field cannot show exactly (turns × pitch from a gap often lands so:
    // 15.090000000000001 mm): the next double above the demo's length.
    let coil = tankwright::model::Coil::from_winding(&recipe.winding).expect("valid demo");
    let length = f64::from_bits(coil.length().to_bits() + 1);
    recipe.winding.spacing = SpacingSpec::Length(length);
    let mut harness = open(recipe);
    harness.get_by_label("Measured frequency").scroll_to_me();
    harness.run();
    harness.get_by_label("Measured frequency").focus();
    harness.run();
    harness.get_by_label("Measured frequency").type_text("98.1");
    harness.run();
    harness.key_press(egui::Key::Enter);
    harness.run();
    harness.get_by_label("Record reading").scroll_to_me();
    harness.run();
    harness.get_by_label("Record reading").click_accesskit();
    harness.run();
    let recipe = harness.state().recipe().clone();
    assert_eq!(recipe.bench_log.len(), 1, "reading recorded");
    let text = format::to_text(&recipe);
    let line = text
        .lines()
        .find(|l| l.trim_start().starts_with("coil_length_mm:"))
        .expect("the reading's length in the file");
    let value = line
        .trim()
        .trim_start_matches("coil_length_mm:")
        .trim()
        .trim_end_matches(',');
    let decimals = value.split_once('.').map_or(0, |(_, d)| d.len());
    assert!(
        decimals <= 2,
        "the length field shows 2 decimals, the file holds {value}"
    );
}

/// Type `text` into the focused field one key at a time, a frame after each (40 ms a key, as
/// a fast typist), calling `between` after the key numbered `at`.
fn type_slowly(
    harness: &mut Harness<'static, App>,
    text: &str,
    at: usize,
    between: impl FnOnce(&mut App),
) {
    let mut between = Some(between);
    for (i, c) in text.chars().enumerate() {
        harness.event(egui::Event::Text(c.to_string()));
        harness.step();
        if i + 1 == at
            && let Some(f) = between.take()
        {
            // Something above the field changes while it is being typed in (a field solution
            // or an evaluation arriving under load): the lines above it grow.
            f(harness.state_mut());
            harness.step();
            harness.step();
        }
    }
    harness.key_press(egui::Key::Enter);
    harness.run();
}

/// Focus the number field (spin button) named `label`.
fn focus(harness: &mut Harness<'static, App>, label: &str) {
    harness
        .get_by_role_and_label(Role::SpinButton, label)
        .scroll_to_me();
    harness.run();
    harness
        .get_by_role_and_label(Role::SpinButton, label)
        .focus();
    harness.run();
}

#[test]
fn a_typed_reading_keeps_every_digit_while_the_column_above_it_changes() {
    let mut harness = open(Recipe::demo());
    focus(&mut harness, "Measured frequency");
    // Select all and type over the field's 0.0000.
    harness.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::A);
    harness.run();
    // A reading arrives (another window's working copy, an undo): the log's table and the
    // calibration appear above the form.
    type_slowly(&mut harness, "86.05", 2, |app| add_reading(app, 98.3));
    harness.get_by_label("Record reading").scroll_to_me();
    harness.run();
    harness.get_by_label("Record reading").click_accesskit();
    harness.run();
    let log = &harness.state().recipe().bench_log;
    assert_eq!(log.len(), 2, "the typed reading recorded");
    assert!(
        (log[1].measured - 86.05e6).abs() < 1.0,
        "typed 86.05, recorded {} MHz",
        log[1].measured * 1e-6
    );
}

/// A reading for the demo's present coil, as if it had come from elsewhere mid-typing.
fn add_reading(app: &mut App, mhz: f64) {
    let mut recipe = app.recipe().clone();
    let coil = tankwright::model::Coil::from_winding(&recipe.winding).expect("valid");
    recipe.bench_log.push(tankwright::recipe::BenchEntry {
        include_anyway: false,
        measured: mhz * 1e6,
        length: coil.length(),
        trimmer_setting: recipe.tank.trimmer_setting,
        added_capacitance: 0.0,
        added_tolerance: None,
        instrument: String::new(),
        error_ppm: None,
        note: String::new(),
    });
    *app.recipe_mut() = recipe;
}

#[test]
fn a_typed_tolerance_keeps_every_digit_while_the_verdict_above_it_changes() {
    let mut harness = open(Recipe::demo());
    focus(&mut harness, "On channel within ±");
    harness.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::A);
    harness.run();
    // The figures change mid-typing (an undo of a capacitor, a field solution arriving):
    // the tank falls below the band, and the verdict above the field gains its lines.
    type_slowly(&mut harness, "12.5", 2, |app| {
        app.recipe_mut().tank.fixed = 45e-12;
    });
    let tolerance = harness.state().recipe().target.tolerance();
    assert!(
        (tolerance - 12.5e3).abs() < 1e-6,
        "typed 12.5 kHz, the target holds {} kHz",
        tolerance * 1e-3
    );
}

/// The demo aimed at V40 on the IARU Region 1 plan (12.5 kHz raster; IARU Region 1 VHF
/// Managers Handbook: V40 = 145.500 MHz, the mobile calling channel).
fn region_1_demo() -> Harness<'static, App> {
    let mut recipe = Recipe::demo();
    recipe.target.plan = tankwright::tuning::BandPlan::TwoMetreRegion1;
    recipe.target.channel = 145.45e6;
    open(recipe)
}

fn open_picker(harness: &mut Harness<'static, App>) {
    harness
        .get_by_role_and_label(Role::ComboBox, "Channel")
        .scroll_to_me();
    harness.run();
    harness
        .get_by_role_and_label(Role::ComboBox, "Channel")
        .click();
    harness.run();
    harness.run();
}

#[test]
fn the_channel_list_writes_every_channel_on_the_plans_raster() {
    let mut harness = region_1_demo();
    open_picker(&mut harness);
    let labels: Vec<String> = screen_text(&harness)
        .into_iter()
        .filter(|t| t.starts_with("145.") && t.contains(" MHz"))
        .collect();
    assert!(labels.len() >= 10, "{labels:?}");
    for label in &labels {
        let number = label.split(' ').next().expect("a number");
        let decimals = number.split_once('.').map_or(0, |(_, d)| d.len());
        // 12.5 kHz needs four decimals of MHz: every channel is written with four.
        assert_eq!(decimals, 4, "{label} among {labels:?}");
    }
}

#[test]
fn enter_with_several_matches_takes_the_channel_typed_or_the_first_and_says_which() {
    let mut harness = region_1_demo();
    open_picker(&mut harness);
    // "145.5" is V40 exactly, and is also the start of 145.5125, 145.525, …
    harness
        .get_by_role_and_label(
            Role::TextInput,
            tankwright::ui::panels::channel_picker::FIND_LABEL,
        )
        .type_text("145.5");
    harness.run();
    assert!(
        screen_text(&harness)
            .iter()
            .any(|t| t.starts_with("Enter takes 145.5000 MHz (V40")),
        "{:?}",
        screen_text(&harness)
    );
    harness.key_press(egui::Key::Enter);
    harness.run();
    assert_eq!(harness.state().recipe().target.channel, 145.5e6);

    // A word several channels carry: Enter takes the first listed, named beforehand.
    open_picker(&mut harness);
    harness
        .get_by_role_and_label(
            Role::TextInput,
            tankwright::ui::panels::channel_picker::FIND_LABEL,
        )
        .type_text("repeater output");
    harness.run();
    let said = screen_text(&harness)
        .into_iter()
        .find(|t| t.starts_with("Enter takes "))
        .expect("the line naming what Enter takes");
    assert!(said.contains("V48"), "{said}");
    harness.key_press(egui::Key::Enter);
    harness.run();
    // V48 = 145.000 + 48 × 0.0125 = 145.600 MHz, the first repeater output.
    assert_eq!(harness.state().recipe().target.channel, 145.6e6);
}

/// The window a user starts, on a recipe file whose coil is refused (turns 0), at 1280×720.
fn restarted_on_a_refused_recipe(dir: &std::path::Path) -> Harness<'static, App> {
    let mut recipe = Recipe::demo();
    recipe.winding.turns = 0.0;
    let path = dir.join("refused.ron");
    std::fs::write(&path, format::to_text(&recipe)).expect("written");
    let folder = dir.join("data");
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1280.0, 720.0))
        .build_eframe(move |_cc| {
            App::restore(folder.clone(), Some(&path)).with_field_solution(false)
        });
    harness.run();
    harness.run();
    harness
}

#[test]
fn after_restarting_on_a_refused_recipe_the_panels_agree_there_is_no_coil_drawn() {
    let dir = tempfile::tempdir().expect("temp dir");
    let harness = restarted_on_a_refused_recipe(dir.path());
    assert!(harness.state().figures().is_none(), "the recipe is refused");
    let text = screen_text(&harness).join("\n");
    assert!(text.contains("No coil to draw yet"), "{text}");
    assert!(
        !text.contains("the last coil that could be built"),
        "one panel says a coil is drawn, the centre says none:\n{text}"
    );
}

#[test]
fn the_notices_dismiss_button_is_inside_the_window_at_1280() {
    let dir = tempfile::tempdir().expect("temp dir");
    let harness = restarted_on_a_refused_recipe(dir.path());
    let dismiss = harness
        .get_by_role_and_label(Role::Button, "Dismiss")
        .rect();
    assert!(
        dismiss.right() <= 1280.0 && dismiss.left() >= 0.0,
        "Dismiss at {dismiss:?} in a 1280-point window"
    );
}

#[test]
fn the_unsaved_mark_is_shown_inside_the_window() {
    let mut harness = open(Recipe::demo());
    let mark = tankwright::ui::panels::top_bar::UNSAVED_MARK;
    assert!(
        harness.query_by_label(mark).is_none(),
        "nothing changed yet"
    );
    harness.state_mut().recipe_mut().winding.turns = 6.0;
    harness.run();
    harness.get_by_label(mark);
}

#[test]
fn the_stray_section_fits_the_left_panel_at_1280_by_720() {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1280.0, 720.0))
        .build_eframe(|_cc| {
            App::with_recipe(shipped("assets/recipes/lantern_hill_two_metre_buffer.ron"))
                .with_field_solution(false)
        });
    harness.run();
    harness
        .get_by_label("Where the stray comes from")
        .scroll_to_me();
    harness.run();
    harness
        .get_by_label("Where the stray comes from")
        .click_accesskit();
    harness.run();
    harness.run();
    // The centre begins where the coil drawing's pane begins; nothing of the stray section
    // (its fields and its lines of text) may reach past it.
    let centre_left = harness
        .root()
        .children_recursive()
        .filter(|n| n.accesskit_node().role() == Role::Pane)
        .find(|p| {
            p.children_recursive()
                .any(|c| c.accesskit_node().label().as_deref() == Some("coil drawing"))
        })
        .and_then(|p| {
            p.children_recursive()
                .filter_map(|c| c.accesskit_node().bounding_box())
                .map(|b| b.x0)
                .reduce(f64::min)
        })
        .expect("the centre pane");
    let mut checked = 0;
    for node in harness.root().children_recursive() {
        let n = node.accesskit_node();
        let text = n.value().or_else(|| n.label()).unwrap_or_default();
        let ours = text.starts_with("Expect ")
            || text.starts_with("With the winding")
            || text.starts_with("After the bench")
            || (n.role() == Role::SpinButton && text.ends_with('±'));
        if !ours {
            continue;
        }
        let b = n.bounding_box().expect("laid out");
        if b.x0 >= centre_left {
            // The verdict's own "Expect …" line, in the right-hand column.
            continue;
        }
        assert!(
            b.x1 <= centre_left + 0.5,
            "'{text}' runs to x = {} past the panel's edge at {centre_left}",
            b.x1
        );
        checked += 1;
    }
    assert!(
        checked >= 3,
        "only {checked} nodes of the stray section found"
    );
}

#[test]
fn a_bias_above_the_supply_is_said() {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 2800.0))
        .build_eframe(|_cc| App::with_recipe(Recipe::demo()).with_field_solution(false));
    harness.run();
    harness.get_by_label("Audio and drift").click();
    harness.run();
    let said = |h: &Harness<'_, App>| {
        screen_text(h)
            .iter()
            .any(|t| t.starts_with("Caution: the reverse bias"))
    };
    // The demo's 4.5 V from a 9 V battery: nothing to say.
    assert!(!said(&harness));
    harness
        .get_by_role_and_label(Role::SpinButton, "Reverse bias")
        .set_value_accesskit(12.0);
    harness.run();
    harness.run();
    assert!(
        said(&harness),
        "a 12 V bias from a 9 V supply taken silently"
    );
}

#[test]
fn the_carrier_against_bias_hover_reads_the_curve_at_the_pointers_bias() {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 2800.0))
        .build_eframe(|_cc| App::with_recipe(Recipe::demo()).with_field_solution(false));
    harness.run();
    harness.get_by_label("Audio and drift").click();
    harness.run();
    harness.run();
    let sweeps = harness.state().modulation_sweeps();
    let present = sweeps.present().expect("the sweeps are computed");
    let bias = sweeps.inputs().expect("inputs").bias_v;
    // At the present bias the curve is the engine's present carrier (tuning::modulation),
    // whatever height the pointer is at: the text is read from the curve, to 1 kHz.
    let text =
        tankwright::ui::charts::modulation::carrier_bias_hover(sweeps.carrier_over_bias(), bias)
            .expect("on the curve");
    let mhz: f64 = text
        .split(' ')
        .next()
        .and_then(|t| t.parse().ok())
        .expect("MHz first");
    assert!(
        (mhz - present.carrier * 1e-6).abs() <= 0.002,
        "hover {text:?}, engine {} MHz",
        present.carrier * 1e-6
    );
    assert!(
        tankwright::ui::charts::modulation::carrier_bias_hover(sweeps.carrier_over_bias(), -5.0)
            .is_none(),
        "nothing off the curve"
    );
}

#[test]
fn the_carrier_against_bias_chart_fits_the_left_panel_at_1280() {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1280.0, 720.0))
        .build_eframe(|_cc| {
            App::with_recipe(shipped("assets/recipes/lantern_hill_bench_oscillator.ron"))
                .with_field_solution(false)
        });
    harness.run();
    harness.get_by_label("Audio and drift").scroll_to_me();
    harness.run();
    harness.get_by_label("Audio and drift").click_accesskit();
    harness.run();
    let label = tankwright::ui::charts::modulation::CARRIER_BIAS_CHART_LABEL;
    harness.get_by_label(label).scroll_to_me();
    harness.run();
    harness.run();
    let chart = harness.get_by_label(label).rect();
    let drawing_left = harness.get_by_label("coil drawing").rect().left();
    assert!(
        chart.right() < drawing_left,
        "the chart runs to x = {} past the centre at {drawing_left}",
        chart.right()
    );
}

//! The teaching bench driven as an instructor would: the View menu, the sweep, the steps, the
//! hand key, the presentation key and the reference, by label and role.
//!
//! Each check compares what the window shows with the engine itself (`tankwright::model::
//! evaluate`, the same function `recipe::figures` calls) or with the arithmetic of the sweep
//! (a kittest frame lasts the harness's step, 0.25 s), never with figures written down here.

use crate::common;

use common::{QueuedAnswers as Scripted, screen_text};
use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use tankwright::model::{Coil, SpacingSpec, Tank, evaluate};
use tankwright::recipe::{Recipe, store};
use tankwright::tuning::digits;
use tankwright::ui::App;
use tankwright::ui::charts::{SPACING_CHART_LABEL, TRIMMER_CHART_LABEL};
use tankwright::ui::files::Picked;
use tankwright::ui::teaching::{
    DIFFERENCES_HEADING, FREQUENCY_LABEL, GHOST_LABEL, INDUCTANCE_LABEL, PANEL_HEADING,
    PIN_FILE_LABEL, PIN_PRESENT_LABEL, SWEEP_PAUSE_LABEL, SWEEP_START_LABEL, sweep,
};

/// Seconds one harness frame lasts (egui_kittest's default step).
const FRAME: f64 = 0.25;

/// The window with the teaching bench opened from the View menu.
fn bench(asker: Scripted) -> Harness<'static, App> {
    let mut harness = common::window_with_asker(asker, 1400.0, 1000.0);
    harness.get_by_label("View").click();
    harness.run();
    harness.get_by_label("Teaching bench").click();
    harness.run();
    assert!(harness.state().teaching().is_on());
    harness.get_by_label(PANEL_HEADING);
    harness
}

/// The figure shown beside the readout named `name`.
fn readout(harness: &Harness<'_, App>, name: &str) -> String {
    let text = screen_text(harness);
    let at = text
        .iter()
        .position(|t| t == name)
        .unwrap_or_else(|| panic!("no readout named {name:?} on screen"));
    text[at + 1].clone()
}

fn number(figure: &str) -> f64 {
    let head: String = figure
        .trim()
        .chars()
        .take_while(|c| c.is_ascii_digit() || matches!(c, '.' | '-' | '+'))
        .collect();
    head.parse()
        .unwrap_or_else(|_| panic!("{figure:?} does not start with a number"))
}

fn shown_length(harness: &Harness<'_, App>) -> f64 {
    harness
        .state()
        .teaching()
        .shown()
        .expect("the bench shows a coil")
        .coil
        .length()
}

#[test]
fn the_sweep_stretches_the_coil_and_the_readouts_follow() {
    let mut harness = bench(Scripted::default());
    let original = harness.state().recipe().clone();
    let coil = harness.state().figures().expect("valid demo").coil;
    let (lo, hi) = sweep::range(&coil);
    let seconds = harness.state().teaching().sweep().seconds;
    let l_before = number(&readout(&harness, INDUCTANCE_LABEL));
    let f_before = number(&readout(&harness, FREQUENCY_LABEL));

    harness.get_by_label(SWEEP_START_LABEL).click();
    harness.run_steps(2);
    let start = shown_length(&harness);
    harness.run_steps(4);
    let later = shown_length(&harness);
    // Four frames of 0.25 s at (hi − lo)/seconds metres per second, towards the long end.
    let expected = 4.0 * FRAME * (hi - lo) / seconds;
    approx::assert_relative_eq!(later - start, expected, max_relative = 1e-9);
    harness.get_by_label(SWEEP_PAUSE_LABEL);

    // Longer coil: less inductance, higher frequency, on screen and in the figures the
    // spacing chart's marker is drawn from.
    let l_after = number(&readout(&harness, INDUCTANCE_LABEL));
    let f_after = number(&readout(&harness, FREQUENCY_LABEL));
    assert!(l_after < l_before, "inductance {l_before} → {l_after} nH");
    assert!(f_after > f_before, "frequency {f_before} → {f_after} MHz");
    let shown = harness.state().teaching().shown().expect("shown").clone();
    assert_eq!(
        readout(&harness, FREQUENCY_LABEL),
        digits::mhz(shown.analysis.resonance)
    );
    let engine = {
        let mut r = original.clone();
        r.winding.spacing = SpacingSpec::Length(later);
        evaluate(&r.winding, &r.tank, &r.conditions).expect("valid")
    };
    approx::assert_relative_eq!(
        shown.analysis.resonance,
        engine.resonance,
        max_relative = 1e-12
    );

    // Run on to the long end: the sweep turns back and never leaves the buildable range.
    harness.run_steps((seconds / FRAME) as usize + 4);
    let back = shown_length(&harness);
    assert!(back < hi && back >= lo, "{lo} ≤ {back} < {hi}");
    assert_eq!(harness.state().teaching().sweep().direction, -1.0);
    harness.get_by_label(SWEEP_PAUSE_LABEL).click();
    harness.run();
    assert!(!harness.state().teaching().sweep().running);
    // The saved recipe never moved.
    assert_eq!(harness.state().recipe(), &original);
}

#[test]
fn step_buttons_move_the_length_by_their_step_and_leave_a_ghost() {
    let mut harness = bench(Scripted::default());
    let original = harness.state().recipe().clone();
    let l0 = shown_length(&harness);
    assert!(harness.state().teaching().ghost().is_none());
    assert_eq!(harness.query_all_by_label(GHOST_LABEL).count(), 0);

    harness.get_by_label("+0.5 mm").click();
    harness.run();
    approx::assert_relative_eq!(shown_length(&harness), l0 + 0.5e-3, max_relative = 1e-12);
    harness.get_by_label("−0.1 mm").click();
    harness.run();
    approx::assert_relative_eq!(shown_length(&harness), l0 + 0.4e-3, max_relative = 1e-12);
    harness.get_by_label("+0.1 mm").click();
    harness.run();
    harness.get_by_label("−0.5 mm").click();
    harness.run();
    approx::assert_relative_eq!(shown_length(&harness), l0, max_relative = 1e-12);

    // The ghost is the coil before the last step (0.5 mm longer), on the chart's legend.
    let ghost = harness.state().teaching().ghost().expect("a ghost").clone();
    approx::assert_relative_eq!(ghost.coil.length(), l0 + 0.5e-3, max_relative = 1e-12);
    assert!(harness.query_all_by_label(GHOST_LABEL).count() >= 1);
    // Its marker sits at the engine's frequency for that length.
    let mut longer = original.clone();
    longer.winding.spacing = SpacingSpec::Length(l0 + 0.5e-3);
    let engine = evaluate(&longer.winding, &longer.tank, &longer.conditions).expect("valid");
    approx::assert_relative_eq!(ghost.resonance, engine.resonance, max_relative = 1e-12);

    // Steps never go below the close-wound length.
    let shortest = Coil::from_winding(&original.winding)
        .expect("valid")
        .shortest_length();
    for _ in 0..60 {
        harness.get_by_label("−0.5 mm").click();
        harness.run();
    }
    approx::assert_relative_eq!(shown_length(&harness), shortest, max_relative = 1e-12);
    assert_eq!(harness.state().recipe(), &original);
}

#[test]
fn a_change_to_the_recipe_leaves_a_ghost_too() {
    let mut harness = bench(Scripted::default());
    let before = shown_length(&harness);
    harness
        .get_by_role_and_label(Role::Slider, "Turns")
        .set_value_accesskit(6.0);
    harness.run();
    let ghost = harness
        .state()
        .teaching()
        .ghost()
        .expect("a ghost after the edit");
    approx::assert_relative_eq!(ghost.coil.turns(), 5.0);
    approx::assert_relative_eq!(ghost.coil.length(), before);
    assert!(harness.query_all_by_label(GHOST_LABEL).count() >= 1);
}

/// The resonance of `recipe` by the engine with `extra` farads more stray.
fn with_stray(recipe: &Recipe, extra: f64) -> f64 {
    let tank = Tank {
        stray: recipe.tank.stray + extra,
        ..recipe.tank
    };
    evaluate(&recipe.winding, &tank, &recipe.conditions)
        .expect("valid")
        .resonance
}

#[test]
fn holding_h_lowers_the_carrier_by_the_engines_figure_for_the_hand() {
    let mut harness = bench(Scripted::default());
    let original = harness.state().recipe().clone();
    let base = with_stray(&original, 0.0);
    assert_eq!(readout(&harness, FREQUENCY_LABEL), digits::mhz(base));

    harness.key_down(egui::Key::H);
    harness.run();
    assert!(harness.state().teaching().hand_held());
    // The default hand is 1 pF (common practice): the engine with the stray + 1 pF.
    let expected = with_stray(&original, 1e-12);
    let shown = harness.state().teaching().shown().expect("shown").clone();
    approx::assert_relative_eq!(shown.analysis.resonance, expected, max_relative = 1e-12);
    assert_eq!(readout(&harness, FREQUENCY_LABEL), digits::mhz(expected));
    assert!(expected < base);
    // 1 pF in a tank of some 20 pF moves the carrier by far more than a channel.
    assert!(!shown.target.on_channel);
    assert!(
        screen_text(&harness)
            .iter()
            .any(|t| t.ends_with("off the channel")),
        "the carrier is said to be off the channel"
    );
    harness.key_up(egui::Key::H);
    harness.run();
    assert!(!harness.state().teaching().hand_held());
    assert_eq!(readout(&harness, FREQUENCY_LABEL), digits::mhz(base));

    // A 2 pF hand, typed into its field.
    harness
        .get_by_role_and_label(Role::Slider, "Hand capacitance")
        .set_value_accesskit(2.0);
    harness.run();
    harness.key_down(egui::Key::H);
    harness.run();
    let shown = harness.state().teaching().shown().expect("shown").clone();
    approx::assert_relative_eq!(
        shown.analysis.resonance,
        with_stray(&original, 2e-12),
        max_relative = 1e-12
    );
    harness.key_up(egui::Key::H);
    harness.run();
    // The hand never reaches the recipe.
    assert_eq!(harness.state().recipe(), &original);
}

#[test]
fn f5_switches_the_presentation_layout() {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1280.0, 720.0))
        .build_eframe(|cc| App::new(cc).with_field_solution(false));
    harness.run();
    assert!(harness.query_by_label(TRIMMER_CHART_LABEL).is_some());
    harness.key_press(egui::Key::F5);
    harness.run();
    assert!(harness.state().teaching().presentation());
    // Fewer controls: the winding panel and the trimmer chart give way to the spacing chart,
    // the large readouts and the caption.
    assert!(
        harness
            .query_by_role_and_label(Role::Slider, "Turns")
            .is_none()
    );
    assert!(harness.query_by_label(TRIMMER_CHART_LABEL).is_none());
    harness.get_by_label(SPACING_CHART_LABEL);
    harness.get_by_label(FREQUENCY_LABEL);
    harness.get_by_label(INDUCTANCE_LABEL);
    harness.key_press(egui::Key::F5);
    harness.run();
    assert!(!harness.state().teaching().presentation());
    // Also from the View menu.
    harness.get_by_label("View").click();
    harness.run();
    harness.get_by_label("Presentation layout F5").click();
    harness.run();
    assert!(harness.state().teaching().presentation());
}

#[test]
fn a_pinned_reference_stays_on_the_chart_with_its_differences() {
    let dir = tempfile::tempdir().expect("temp dir");
    let path = dir.path().join("known_good.ron");
    let mut good = Recipe::demo();
    good.winding.turns = 6.0;
    good.winding.spacing = SpacingSpec::Length(9.0e-3);
    store::save(&path, &good).expect("saved");

    let asker = Scripted::default();
    let mut harness = bench(asker.clone());
    let original = harness.state().recipe().clone();

    // The present recipe first.
    harness.get_by_label(PIN_PRESENT_LABEL).click();
    harness.run();
    let name = original.name.clone();
    assert_eq!(
        harness
            .query_all_by_label(&format!("reference: {name}"))
            .count(),
        1,
        "its curve's legend entry"
    );
    harness.get_by_label(DIFFERENCES_HEADING);

    // Then a file, through the same dialog as Open….
    asker.0.borrow_mut().push_back(Picked::Path(path.clone()));
    harness.get_by_label(PIN_FILE_LABEL).click();
    harness.run();
    assert_eq!(
        harness
            .query_all_by_label("reference: known_good.ron")
            .count(),
        1
    );
    let text = screen_text(&harness);
    let list = text
        .iter()
        .position(|t| t == DIFFERENCES_HEADING)
        .expect("the list of differences");
    let row = |quantity: &str| -> Vec<String> {
        let at = list
            + text[list..]
                .iter()
                .position(|t| t == quantity)
                .unwrap_or_else(|| panic!("no row {quantity:?}"));
        text[at..at + 4].to_vec()
    };
    assert_eq!(row("Turns")[1..], ["5", "6", "-1.00"]);
    assert_eq!(row("Coil length")[1..], ["8.00 mm", "9.00 mm", "-1.00 mm"]);
    let reference = harness.state().teaching().reference().expect("pinned");
    // The pinned file is evaluated on the window's footing: with the field solution switched
    // off here, the classical model (the engine's own evaluate), like the present recipe.
    let engine = evaluate(&good.winding, &good.tank, &good.conditions).expect("valid");
    let predicted = row("Predicted");
    assert_eq!(predicted[2], digits::mhz(engine.resonance));
    assert_eq!(
        predicted[3],
        digits::offset(
            harness
                .state()
                .figures()
                .expect("valid")
                .uncalibrated
                .resonance
                - engine.resonance
        )
    );
    assert_eq!(reference.figures.analysis.resonance, engine.resonance);
    assert_eq!(
        row("Measured (last reading)")[1..3],
        ["none logged", "none logged"]
    );
    // Pinning never changes the recipe.
    assert_eq!(harness.state().recipe(), &original);
}

#[test]
fn at_1280_by_720_the_presentation_keeps_its_readouts_inside_the_window() {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1280.0, 720.0))
        .build_eframe(|cc| App::new(cc).with_field_solution(false));
    harness.run();
    harness.get_by_label("View").click();
    harness.run();
    harness.get_by_label("Teaching bench").click();
    harness.run();
    // A wide list of differences must not push the panel out of the window.
    harness.get_by_label(PIN_PRESENT_LABEL).click();
    harness.run();
    harness.key_press(egui::Key::F5);
    harness.run();
    let window = egui::Rect::from_min_size(egui::Pos2::ZERO, egui::vec2(1280.0, 720.0));
    for label in [INDUCTANCE_LABEL, FREQUENCY_LABEL, PANEL_HEADING, "Spacing"] {
        let rect = harness
            .query_all_by_label(label)
            .last()
            .unwrap_or_else(|| panic!("{label:?} shown"))
            .rect();
        assert!(
            window.contains_rect(rect),
            "{label:?} at {rect:?} leaves the 1280×720 window"
        );
    }
    // The spacing chart takes the rest of the width: at least half the window.
    let chart = harness.get_by_label(SPACING_CHART_LABEL).rect();
    assert!(chart.width() >= 640.0, "chart {chart:?}");
}

/// Issue 21: the differences compare the length being demonstrated, not only the recipe's.
/// The demo's 8.00 mm pinned, then shown 0.5 mm longer: the row reads 8.50 against 8.00 mm.
#[test]
fn the_differences_compare_the_demonstrated_length() {
    let mut harness = bench(Scripted::default());
    harness.get_by_label(PIN_PRESENT_LABEL).click();
    harness.run();
    harness.get_by_label("+0.5 mm").click();
    harness.run();
    let text = screen_text(&harness);
    let list = text
        .iter()
        .position(|t| t == DIFFERENCES_HEADING)
        .expect("the list of differences");
    assert!(text[list..].iter().any(|t| t == "Shown here"), "{text:?}");
    let at = list
        + text[list..]
            .iter()
            .position(|t| t == "Coil length")
            .expect("a length row");
    assert_eq!(text[at + 1..at + 4], ["8.50 mm", "8.00 mm", "+0.50 mm"]);
    // The recipe itself is unchanged.
    assert_eq!(
        harness.state().recipe().winding.spacing,
        SpacingSpec::Length(8.0e-3)
    );
}

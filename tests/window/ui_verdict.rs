//! The verdict block through the whole window: the answer leads the right column, the
//! aeronautical caution appears when the trimmer's travel reaches 108–137 MHz and the charts
//! shade that band, and on a 1280×720 screen the verdict's lines are there, wrapped inside
//! the window.
//!
//! The verdict itself is the engine's ([`tankwright::tuning::verdict::judge`], checked in
//! tests/engine/verdict.rs); here the window must show exactly what it says. The band edges are the
//! ITU Radio Regulations, Article 5 (108–117.975 MHz aeronautical radionavigation,
//! 117.975–137 MHz aeronautical mobile (R)).

use crate::common;

use common::screen_text;
use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::{NodeT, Queryable};
use tankwright::model::InductanceModel;
use tankwright::tuning::verdict::FlagKind;
use tankwright::ui::App;
use tankwright::ui::charts::{AERONAUTICAL_BAND_LABEL, SPACING_CHART_LABEL, TRIMMER_CHART_LABEL};
use tankwright::ui::panels::channel_picker::FIND_LABEL;
use tankwright::ui::panels::model_dots::{dots, row_text};
use tankwright::ui::panels::readouts::READOUTS_HEADING;
use tankwright::ui::panels::target::TOLERANCE_LABEL;

/// The window with the classical model leading (the field solution switched off), so the
/// figures cannot change under a test when the worker answers; the field solution's own
/// window tests are in tests/window/ui_field.rs.
fn window(width: f32, height: f32) -> Harness<'static, App> {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(width, height))
        .build_eframe(|cc| App::new(cc).with_field_solution(false));
    harness.run();
    harness
}

/// Whether some text on screen starts with `prefix`.
fn shows_line_starting(harness: &Harness<'_, App>, prefix: &str) -> bool {
    screen_text(harness).iter().any(|t| t.starts_with(prefix))
}

/// The screen rectangle of the first label whose text starts with `prefix`.
fn rect_of_line(harness: &Harness<'_, App>, prefix: &str) -> Option<egui::Rect> {
    harness
        .root()
        .children_recursive()
        .find(|node| {
            let n = node.accesskit_node();
            n.role() == Role::Label && n.value().is_some_and(|v| v.starts_with(prefix))
        })
        .map(|node| node.rect())
}

#[test]
fn the_verdict_leads_with_the_channel_and_the_next_step() {
    let harness = window(1400.0, 1000.0);
    let figures = harness.state().figures().expect("the demo recipe is valid");
    let verdict = &figures.verdict;
    let text = screen_text(&harness);
    assert!(text.iter().any(|t| t == "Verdict"), "no verdict heading");
    assert!(
        text.contains(&verdict.channel_text()),
        "channel line {:?} missing",
        verdict.channel_text()
    );
    assert!(text.contains(&verdict.safety_text()));
    assert!(text.contains(&format!("Next: {}", verdict.next_step())));
    // The demo recipe has no bench readings yet.
    assert!(shows_line_starting(&harness, "Not calibrated"));
    // Every flag the engine raised is listed.
    for flag in &verdict.flags {
        assert!(text.contains(&format!("Caution: {}", flag.text)));
    }
    // The verdict sits above the readouts.
    let verdict_y = rect_of_line(&harness, "Next: ")
        .expect("next step shown")
        .top();
    let readouts_y = harness.get_by_label("Readouts").rect().top();
    assert!(verdict_y < readouts_y, "verdict below the readouts");
}

#[test]
fn a_trimmer_reaching_the_aeronautical_band_is_flagged_and_shaded() {
    let mut harness = window(1400.0, 1000.0);
    // The demo tank's travel stays below 108 MHz (its spacing chart may still sweep into
    // the band as the coil is stretched, and then shades it).
    assert!(
        !harness
            .state()
            .figures()
            .expect("valid")
            .verdict
            .has(FlagKind::Aeronautical)
    );
    assert!(!shows_line_starting(
        &harness,
        "Next: Keep this tank off the air"
    ));
    // Less fixed capacitance: the trimmer's travel climbs through 108 MHz.
    harness.state_mut().recipe_mut().tank.fixed = 1.0e-12;
    harness.run();
    let verdict = harness.state().figures().expect("valid").verdict.clone();
    assert!(
        verdict.reach.high > 108e6,
        "the chosen tank should reach past 108 MHz: {} Hz",
        verdict.reach.high
    );
    assert!(verdict.has(FlagKind::Aeronautical));
    let flag = verdict
        .flags
        .iter()
        .find(|f| f.kind == FlagKind::Aeronautical)
        .expect("flag raised");
    let text = screen_text(&harness);
    assert!(
        text.contains(&format!("Caution: {}", flag.text)),
        "aeronautical caution not shown"
    );
    assert!(text.iter().any(|t| t.starts_with("Not safe")));
    assert!(
        text.iter()
            .any(|t| t.starts_with("Next: Keep this tank off the air"))
    );
    // Both charts shade the band: a legend entry each.
    let entries = harness
        .query_all_by_label("aeronautical band (108–137 MHz)")
        .count();
    assert_eq!(entries, 2, "legend entries for the aeronautical band");
}

#[test]
fn at_1280_by_720_the_verdict_lines_are_shown_inside_the_window() {
    let harness = window(1280.0, 720.0);
    let verdict = harness.state().figures().expect("valid").verdict.clone();
    let screen = egui::Rect::from_min_size(egui::Pos2::ZERO, egui::vec2(1280.0, 720.0));
    for prefix in [
        verdict.channel_text(),
        verdict.safety_text(),
        "Next: ".to_owned(),
    ] {
        let rect = rect_of_line(&harness, &prefix)
            .unwrap_or_else(|| panic!("line {prefix:?} not on screen"));
        // Wrapped, not clipped: the whole line lies inside the window.
        assert!(
            screen.contains_rect(rect),
            "line {prefix:?} at {rect:?} runs outside the window"
        );
    }
}

#[test]
fn the_band_is_not_drawn_when_the_charts_stay_below_it() {
    let mut harness = window(1400.0, 1000.0);
    // Much more fixed capacitance: every curve of both charts stays far below 108 MHz, and
    // the axis is never widened just to show the band.
    harness.state_mut().recipe_mut().tank.fixed = 40e-12;
    harness.run();
    harness.run();
    let verdict = &harness.state().figures().expect("valid").verdict;
    assert!(
        verdict.reach.high < 100e6,
        "reach {} Hz",
        verdict.reach.high
    );
    assert_eq!(
        harness
            .query_all_by_label("aeronautical band (108–137 MHz)")
            .count(),
        0
    );
}

#[test]
fn a_bench_reading_makes_the_verdict_calibrated() {
    let mut harness = window(1400.0, 1000.0);
    let figures = harness.state().figures().expect("valid").clone();
    let tank = harness.state().recipe().tank;
    // A reading 1 MHz below the model at the present coil and trimmer.
    harness
        .state_mut()
        .recipe_mut()
        .bench_log
        .push(tankwright::recipe::BenchEntry {
            include_anyway: false,
            measured: figures.analysis.resonance - 1.0e6,
            length: figures.coil.length(),
            trimmer_setting: tank.trimmer_setting,
            added_capacitance: 0.0,
            instrument: "counter".to_owned(),
            error_ppm: None,
            note: String::new(),
            added_tolerance: None,
        });
    harness.run();
    harness.run();
    let figures = harness.state().figures().expect("valid");
    assert!(figures.calibrated(), "the one reading should fit");
    assert_eq!(figures.readings_used(), 1);
    let text = screen_text(&harness);
    assert!(
        text.iter()
            .any(|t| t == "Calibrated on 1 bench reading (on the classical model)")
    );
    // The verdict follows the calibrated model, as the readouts do.
    assert!(
        (figures.verdict.resonance - figures.analysis.resonance).abs() < 1.0,
        "verdict {} Hz against calibrated analysis {} Hz",
        figures.verdict.resonance,
        figures.analysis.resonance
    );
}

/// The right column's left edge at this size: where its first heading starts.
fn right_column_left(harness: &Harness<'_, App>) -> f32 {
    harness.get_by_label("Verdict").rect().left()
}

/// Every node with text whose rectangle starts in the right column, with its rectangle.
fn right_column_text(harness: &Harness<'_, App>, left: f32) -> Vec<(String, egui::Rect)> {
    harness
        .root()
        .children_recursive()
        .filter_map(|node| {
            let n = node.accesskit_node();
            let text = if n.role() == Role::Label {
                n.value()
            } else {
                n.label()
            }?;
            let rect = node.rect();
            (rect.left() >= left - 0.5 && !text.is_empty()).then_some((text, rect))
        })
        .collect()
}

/// No text in the right column runs past the window's right edge (it wraps instead; the
/// column scrolls only up and down).
fn assert_nothing_clipped(harness: &Harness<'_, App>, width: f32) {
    let left = right_column_left(harness);
    let texts = right_column_text(harness, left);
    assert!(texts.len() > 20, "only {} texts read", texts.len());
    for (text, rect) in &texts {
        assert!(
            rect.right() <= width + 0.5,
            "{text:?} at {rect:?} runs past the window's right edge ({width})"
        );
    }
}

#[test]
fn at_1280_by_720_no_text_in_the_right_column_is_clipped_and_the_bench_log_shows() {
    let mut harness = window(1280.0, 720.0);
    assert_nothing_clipped(&harness, 1280.0);
    // The bench log's fold is on screen without scrolling (the readouts start folded at
    // this height; the verdict and the target stay open).
    let bench = harness.get_by_label("Bench log").rect();
    assert!(
        bench.bottom() <= 720.0 && bench.top() >= 0.0,
        "bench log at {bench:?}, off a 720-point screen"
    );
    let verdict_y = harness.get_by_label("Verdict").rect().top();
    assert!(verdict_y < bench.top());
    // Unfolded, the readouts (with the inductance chart) wrap inside the column too.
    harness.get_by_label(READOUTS_HEADING).click();
    harness.run();
    harness.run();
    assert!(
        screen_text(&harness)
            .iter()
            .any(|t| t == "Self-capacitance"),
        "the readouts did not unfold"
    );
    assert_nothing_clipped(&harness, 1280.0);
    // A tank that reaches the aeronautical band: its cautions are long; they wrap as well.
    harness.state_mut().recipe_mut().tank.fixed = 1.0e-12;
    harness.run();
    harness.run();
    assert!(
        harness
            .state()
            .figures()
            .expect("valid")
            .verdict
            .has(FlagKind::Aeronautical)
    );
    assert_nothing_clipped(&harness, 1280.0);
}

#[test]
fn at_1280_by_720_the_verdict_and_the_aeronautical_shading_are_found_outside_the_curves() {
    let mut harness = window(1280.0, 720.0);
    harness.state_mut().recipe_mut().tank.fixed = 1.0e-12;
    harness.run();
    harness.run();
    let verdict = harness.state().figures().expect("valid").verdict.clone();
    let text = screen_text(&harness);
    assert!(text.contains(&verdict.channel_text()));
    assert!(text.iter().any(|t| t.starts_with("Not safe")));
    // Both charts shade the band and name it in their legends, which sit above the charts:
    // no legend entry covers a curve.
    let entries: Vec<egui::Rect> = harness
        .query_all_by_label(AERONAUTICAL_BAND_LABEL)
        .map(|n| n.rect())
        .collect();
    assert_eq!(entries.len(), 2, "legend entries for the aeronautical band");
    for chart in [SPACING_CHART_LABEL, TRIMMER_CHART_LABEL] {
        let plot = harness.get_by_label(chart).rect();
        for entry in &entries {
            assert!(
                !plot.intersects(*entry),
                "a legend entry at {entry:?} lies on the {chart} at {plot:?}"
            );
        }
    }
}

#[test]
fn the_channel_picker_opens_at_the_present_channel_and_can_be_typed_into() {
    let mut harness = window(1280.0, 720.0);
    assert_eq!(harness.state().recipe().target.channel, 98.7e6);
    harness
        .get_by_role_and_label(Role::ComboBox, "Channel")
        .click();
    harness.run();
    harness.run();
    // 98.7 MHz is US FM channel 254 (47 CFR §73.201: 88.1 + 0.2 × (254 − 201) MHz), the 54th
    // of 100: unscrolled, it would sit some 50 rows below the top of the list.
    let find = harness
        .get_by_role_and_label(Role::TextInput, FIND_LABEL)
        .rect();
    let present = harness
        .get_by_role_and_label(Role::Button, "98.7 MHz (channel 254)")
        .rect();
    let first = harness
        .get_by_role_and_label(Role::Button, "88.1 MHz (channel 201)")
        .rect();
    assert!(
        present.top() > find.bottom() && present.bottom() < find.bottom() + 320.0,
        "present channel at {present:?}, list starts below {find:?}"
    );
    assert!(
        first.bottom() < find.top(),
        "the list was not scrolled: the first channel is at {first:?}"
    );

    // Typing narrows the list; Enter takes the one channel left.
    harness
        .get_by_role_and_label(Role::TextInput, FIND_LABEL)
        .type_text("99.1");
    harness.run();
    assert!(
        harness
            .query_by_role_and_label(Role::Button, "98.7 MHz (channel 254)")
            .is_none()
    );
    harness
        .get_by_role_and_label(Role::Button, "99.1 MHz (channel 256)")
        .rect();
    harness.key_press(egui::Key::Enter);
    harness.run();
    assert_eq!(harness.state().recipe().target.channel, 99.1e6);

    // A frequency that is no channel of the plan can be aimed at as typed.
    harness
        .get_by_role_and_label(Role::ComboBox, "Channel")
        .click();
    harness.run();
    harness.run();
    harness
        .get_by_role_and_label(Role::TextInput, FIND_LABEL)
        .type_text("100.05");
    harness.run();
    harness
        .get_by_label("Aim at 100.05 MHz (typed, not a channel of this plan)")
        .click();
    harness.run();
    assert_eq!(harness.state().recipe().target.channel, 100.05e6);
    let verdict = &harness.state().figures().expect("valid").verdict;
    assert_eq!(verdict.target, Some(100.05e6));
}

#[test]
fn the_tolerance_field_moves_the_on_channel_verdict_at_its_boundary() {
    let mut harness = window(1400.0, 1000.0);
    // Aim 12.345 kHz below the present resonance (a typed frequency).
    let resonance = harness.state().figures().expect("valid").analysis.resonance;
    harness.state_mut().recipe_mut().target.channel = (resonance - 12_345.0).round();
    harness.run();
    let offset = harness
        .state()
        .figures()
        .expect("valid")
        .verdict
        .offset
        .expect("a target");
    assert!((offset - 12_345.0).abs() <= 0.5, "offset {offset} Hz");
    // The FM broadcast default, ±15 kHz (common practice, tuning/service.rs): on channel.
    let on = |h: &Harness<'_, App>| h.state().figures().expect("valid").verdict.on_channel;
    assert_eq!(on(&harness), Some(true));
    for (khz, expected) in [(12.3, false), (12.4, true), (12.3, false)] {
        harness
            .get_by_role_and_label(Role::SpinButton, TOLERANCE_LABEL)
            .set_value_accesskit(khz);
        harness.run();
        assert_eq!(
            harness.state().recipe().target.tolerance,
            Some(khz * 1e3),
            "the field did not reach the recipe"
        );
        assert_eq!(on(&harness), Some(expected), "±{khz} kHz");
        let line = harness
            .state()
            .figures()
            .expect("valid")
            .verdict
            .channel_text();
        assert!(line.starts_with(if expected {
            "On channel"
        } else {
            "Off channel"
        }));
        assert!(screen_text(&harness).contains(&line), "{line:?} not shown");
    }
    // Back to the plan's default (brought into view first, as a user scrolls: the advice
    // above it may run to several lines).
    harness.get_by_label("Plan default").scroll_to_me();
    harness.run();
    harness.get_by_label("Plan default").click();
    harness.run();
    assert_eq!(harness.state().recipe().target.tolerance, None);
    assert_eq!(on(&harness), Some(true));
}

#[test]
fn each_method_keeps_its_hover_note_in_the_inductance_chart() {
    // As the window opens: the field solution on.
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 1000.0))
        .build_eframe(|cc| App::new(cc));
    harness.run();
    // Let the field solution and the charts' field shape arrive first, so the rows above stay
    // put while the pointer rests (the bound only stops a hung test).
    let start = std::time::Instant::now();
    while harness.state().field_solution().is_none() || !harness.state().charts_field_shaped() {
        assert!(
            start.elapsed().as_secs() < 120,
            "the field solution never arrived"
        );
        std::thread::sleep(std::time::Duration::from_millis(5));
        harness.step();
    }
    harness.run();
    let analysis = harness.state().analysis().expect("valid").clone();
    let rows = dots(&analysis);
    assert_eq!(rows.len(), InductanceModel::ALL.len() + 1);
    for model in InductanceModel::ALL {
        let row = rows
            .iter()
            .find(|d| d.name == model.label())
            .expect("every method has a row");
        harness.get_by_label(&row_text(row)).scroll_to_me();
        harness.run();
        harness.get_by_label(&row_text(row)).hover();
        harness.run();
        // Tooltips wait for the pointer to rest; let time pass.
        for _ in 0..60 {
            harness.step();
        }
        harness.run();
        let text = screen_text(&harness);
        assert!(
            text.iter().any(|t| t == model.method()),
            "no note for {} on screen",
            model.label()
        );
    }
}

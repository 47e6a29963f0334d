//! The verdict block through the whole window: the answer leads the right column, the
//! aeronautical caution appears when the trimmer's travel reaches 108–137 MHz and the charts
//! shade that band, and on a 1280×720 screen the verdict's lines are there, wrapped inside
//! the window.
//!
//! The verdict itself is the engine's ([`tankwright::tuning::verdict::judge`], checked in
//! tests/verdict.rs); here the window must show exactly what it says. The band edges are the
//! ITU Radio Regulations, Article 5 (108–117.975 MHz aeronautical radionavigation,
//! 117.975–137 MHz aeronautical mobile (R)).

mod common;

use common::screen_text;
use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::{NodeT, Queryable};
use tankwright::tuning::verdict::FlagKind;
use tankwright::ui::App;

fn window(width: f32, height: f32) -> Harness<'static, App> {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(width, height))
        .build_eframe(|cc| App::new(cc));
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
            measured: figures.analysis.resonance - 1.0e6,
            length: figures.coil.length(),
            trimmer_setting: tank.trimmer_setting,
            added_capacitance: 0.0,
            instrument: "counter".to_owned(),
            error_ppm: None,
            note: String::new(),
        });
    harness.run();
    harness.run();
    let figures = harness.state().figures().expect("valid");
    assert!(figures.calibrated(), "the one reading should fit");
    assert_eq!(figures.readings_used(), 1);
    let text = screen_text(&harness);
    assert!(text.iter().any(|t| t == "Calibrated on 1 bench reading"));
    // The verdict follows the calibrated model, as the readouts do.
    assert!(
        (figures.verdict.resonance - figures.analysis.resonance).abs() < 1.0,
        "verdict {} Hz against calibrated analysis {} Hz",
        figures.verdict.resonance,
        figures.analysis.resonance
    );
}

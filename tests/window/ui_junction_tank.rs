//! The junction across the tank drives every figure: with the audio panel's junction counted
//! in the tank, the window's readouts, verdict and next step give the same carrier as the
//! audio panel and as `tankwright evaluate` with the same junction flags (one `tuning`
//! function, `modulation::tank_with_junction`, puts it there for both).
//!
//! The junction law is held to ngspice in tests/engine/reference_junction.rs and the field
//! solution to nec2c in tests/engine/reference_field.rs; here the window is held to the
//! command line on the same tank (self-consistency, to the 1 kHz the figures are shown to).

use crate::common::screen_text;
use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use std::process::Command;
use std::time::{Duration, Instant};
use tankwright::tuning::digits;
use tankwright::ui::App;
use tankwright::ui::panels::audio::COUNT_JUNCTION;
use tankwright::ui::panels::readouts::{FIELD_SOLVED, RESONANCE};

/// The audio panel's default junction (a small VHF transistor's collector–base junction,
/// common practice): Cj0 3.5 pF, φ 0.75 V, m 0.33, at 4.5 V reverse bias.
const JUNCTION_FLAGS: [&str; 8] = [
    "--junction-cj0-pf",
    "3.5",
    "--junction-vj",
    "0.75",
    "--junction-m",
    "0.33",
    "--bias-v",
    "4.5",
];

/// The figure beside the readout `name` and the word after it.
fn readout_with_mark(harness: &Harness<'_, App>, name: &str) -> (String, String) {
    let text = screen_text(harness);
    let at = text
        .iter()
        .position(|t| t == name)
        .unwrap_or_else(|| panic!("no readout named {name:?} on screen"));
    (text[at + 1].clone(), text[at + 2].clone())
}

/// Run frames until the resonance that leads is field-solved for the tank now shown (the
/// worker's time; the bound only stops a hung test).
fn wait_for_field(harness: &mut Harness<'_, App>) {
    let start = Instant::now();
    loop {
        harness.step();
        if readout_with_mark(harness, RESONANCE).1 == FIELD_SOLVED {
            return;
        }
        assert!(
            start.elapsed() < Duration::from_secs(180),
            "the field solution never arrived"
        );
        std::thread::sleep(Duration::from_millis(5));
    }
}

fn line_starting(harness: &Harness<'_, App>, start: &str) -> String {
    screen_text(harness)
        .into_iter()
        .find(|t| t.starts_with(start))
        .unwrap_or_else(|| panic!("no line starting {start:?}"))
}

/// `tankwright evaluate --recipe FILE` with the junction flags (and `extra`), its stdout.
fn evaluate(recipe: &tankwright::recipe::Recipe, extra: &[&str]) -> String {
    let dir = std::env::temp_dir().join(format!("tankwright-junction-{}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("a temporary folder");
    let file = dir.join("demo.ron");
    tankwright::recipe::store::save(&file, recipe).expect("saved");
    let out = Command::new(env!("CARGO_BIN_EXE_tankwright"))
        .arg("evaluate")
        .arg("--recipe")
        .arg(&file)
        .args(JUNCTION_FLAGS)
        .args(extra)
        .output()
        .expect("the program runs");
    let _ = std::fs::remove_dir_all(&dir);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout).expect("text")
}

#[test]
fn the_junction_counted_in_the_tank_drives_every_figure_as_on_the_command_line() {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 2800.0))
        .build_eframe(|cc| App::new(cc));
    harness.run();
    harness.get_by_label("Audio and drift").click();
    harness.run();
    wait_for_field(&mut harness);
    let (without, _) = readout_with_mark(&harness, RESONANCE);

    harness
        .get_by_role_and_label(Role::CheckBox, COUNT_JUNCTION)
        .click();
    harness.run();
    wait_for_field(&mut harness);
    let (with, _) = readout_with_mark(&harness, RESONANCE);
    assert_ne!(with, without, "the junction moves the readout");

    // The command line on the same recipe with the same junction.
    let recipe = harness.state().recipe().clone();
    let json: serde_json::Value =
        serde_json::from_str(&evaluate(&recipe, &["--json"])).expect("JSON");
    let cli = json["resonance_mhz"].as_f64().expect("a resonance") * 1e6;
    eprintln!("without the junction {without}; with it {with}; evaluate {cli} Hz");
    assert_eq!(with, digits::mhz(cli), "window readout against evaluate");
    // The audio panel's carrier is the same tank's.
    let carrier = line_starting(&harness, "Carrier ");
    assert!(
        carrier.starts_with(&format!("Carrier {:.3} MHz", cli * 1e-6)),
        "{carrier} against {cli}"
    );
    // The verdict's channel line and next step are the command line's.
    let text = evaluate(&recipe, &[]);
    let f = harness.state().figures().expect("valid");
    let channel_line = f.verdict.channel_text();
    assert!(
        screen_text(&harness).contains(&channel_line),
        "{channel_line} not on screen"
    );
    assert!(
        text.lines().any(|l| l.trim() == channel_line),
        "{channel_line} not in {text}"
    );
    let next = format!("Next: {}", f.verdict.next_step());
    assert!(
        text.lines().any(|l| l.trim() == next),
        "{next} not in {text}"
    );
    approx::assert_relative_eq!(f.analysis.resonance, cli, max_relative = 1e-9);

    // Switched off again: the tank as entered (the readout before).
    harness
        .get_by_role_and_label(Role::CheckBox, COUNT_JUNCTION)
        .click();
    harness.run();
    wait_for_field(&mut harness);
    assert_eq!(readout_with_mark(&harness, RESONANCE).0, without);
    assert!(
        harness.state().recipe().tank == recipe.tank,
        "the recipe never holds the junction"
    );
}

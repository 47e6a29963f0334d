//! One instruction everywhere at the resolution of a hand: a tank a hand cannot trim onto
//! its channel (one per cent of the trimmer's travel moves it more than the tolerance) gets
//! the same instruction, naming the smaller trimmer or series capacitor, in the window's
//! verdict, in `report` and in `solve`, since all of them show `recipe::figures`' advice.
//!
//! The instruction's physics (Thomson's formula, series capacitors) is held to exact field
//! solves in tests/engine/trimmer_resolution.rs; here the places that show it are held to
//! one another.

use crate::common::screen_text;
use egui_kittest::Harness;
use std::process::Command;
use std::time::{Duration, Instant};
use tankwright::model::SpacingSpec;
use tankwright::recipe::{Recipe, figures};
use tankwright::tuning::advice::Advice;
use tankwright::ui::App;
use tankwright::ui::panels::readouts::{FIELD_SOLVED, RESONANCE};

/// The bench demo with its coil 0.05 mm longer than the length that lands the channel.
fn just_off() -> Recipe {
    let mut r = Recipe::demo();
    let f = figures(&r).expect("valid");
    let length = f.target.length_for_target.expect("reaches");
    r.winding.spacing = SpacingSpec::Length(length + 0.05e-3);
    r
}

fn run(args: &[&str]) -> String {
    let out = Command::new(env!("CARGO_BIN_EXE_tankwright"))
        .args(args)
        .output()
        .expect("the program runs");
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout).expect("text")
}

#[test]
fn a_coarse_trimmer_gets_the_same_instruction_in_the_window_report_and_solve() {
    let r = just_off();
    let f = figures(&r).expect("valid");
    let Advice::SetTrimmer {
        coarse: Some(c), ..
    } = &f.target.advice
    else {
        panic!("expected a coarse trimmer: {}", f.target.advice);
    };
    let note = c.text();

    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 1600.0))
        .build_eframe(move |_| App::with_recipe(just_off()));
    harness.run();
    let start = Instant::now();
    loop {
        harness.step();
        let text = screen_text(&harness);
        let at = text.iter().position(|t| t == RESONANCE).expect("readout");
        if text[at + 2] == FIELD_SOLVED {
            break;
        }
        assert!(
            start.elapsed() < Duration::from_secs(180),
            "no field solution"
        );
        std::thread::sleep(Duration::from_millis(5));
    }
    let text = screen_text(&harness);
    let next = text
        .iter()
        .find(|t| t.starts_with("Next: "))
        .expect("the verdict's next step");
    assert!(next.contains(&note), "{next}");

    let dir = std::env::temp_dir().join(format!("tankwright-trimmer-{}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("a temporary folder");
    let file = dir.join("just-off.ron");
    tankwright::recipe::store::save(&file, &r).expect("saved");
    let path = file.to_str().expect("a path");
    let report = run(&["report", path]);
    let solve = run(&["solve", "--recipe", path]);
    let _ = std::fs::remove_dir_all(&dir);
    assert!(report.contains(&note), "{report}");
    assert!(solve.contains(&note), "{solve}");
}

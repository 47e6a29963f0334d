//! `tankwright solve` and `tankwright fit`, run as a user runs them.
//!
//! The answers are checked against the engine itself: the coil `solve` proposes, evaluated
//! again, must land the target within 1 kHz; `fit` must print what the library's fit gives
//! for the same recipe (the window shows the same figures: `recipe::figures`).

use serde_json::Value;
use std::path::{Path, PathBuf};
use std::process::{Command, Output};
use tankwright::model::{Coil, evaluate::resonance_of};
use tankwright::recipe::{figures, store};

fn run(args: &[&str]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_tankwright"))
        .args(args)
        .output()
        .expect("the binary runs")
}

fn asset(name: &str) -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("assets/recipes")
        .join(name)
}

fn json(o: &Output) -> Value {
    assert!(o.status.success(), "{}", String::from_utf8_lossy(&o.stderr));
    serde_json::from_slice(&o.stdout).expect("one JSON object")
}

#[test]
fn solve_lands_the_target_within_a_kilohertz() {
    for name in [
        "lantern_hill_bench_oscillator.ron",
        "lantern_hill_two_metre_buffer.ron",
        "apprentice_enamel_exercise.ron",
    ] {
        let file = asset(name);
        let v = json(&run(&[
            "solve",
            "--recipe",
            file.to_str().unwrap(),
            "--json",
        ]));
        for key in [
            "length_mm",
            "turns",
            "trimmer_pct",
            "resonance_mhz",
            "calibrated",
            "advice",
        ] {
            assert!(v.get(key).is_some(), "{name}: no {key} in {v}");
        }
        let recipe = store::load(&file).unwrap();
        let f = figures(&recipe).unwrap();
        let coil = Coil::from_winding(&recipe.winding).unwrap();
        let proposed = coil
            .with_turns(
                v["turns"].as_f64().unwrap(),
                v["length_mm"].as_f64().unwrap() * 1e-3,
            )
            .unwrap();
        let setting = v["trimmer_pct"].as_f64().unwrap() / 100.0;
        // The tool's own evaluation of the proposed coil: its field-led model (the field
        // solution of that coil with the calibration on it), not the present coil's factor.
        let external = f.tank.external_capacitance_at(setting);
        let landed = f
            .led
            .and_then(|led| led.resonance(&proposed, external))
            .unwrap_or_else(|| resonance_of(&proposed, external, &f.conditions));
        let target = recipe.target.channel;
        assert!(
            (landed - target).abs() < 1e3 || f.target.on_channel,
            "{name}: {landed} Hz for {target} Hz"
        );
        assert_eq!(v["calibrated"].as_bool(), Some(f.calibrated()), "{name}");
    }
}

#[test]
fn solve_takes_another_target_and_trimmer() {
    let file = asset("lantern_hill_bench_oscillator.ron");
    let v = json(&run(&[
        "solve",
        "--recipe",
        file.to_str().unwrap(),
        "--target-mhz",
        "101.1",
        "--trimmer-pct",
        "40",
        "--json",
    ]));
    assert!(
        (v["resonance_mhz"].as_f64().unwrap() - 101.1).abs() < 1e-3,
        "{v}"
    );
    let text = run(&[
        "solve",
        "--recipe",
        file.to_str().unwrap(),
        "--target-mhz",
        "101.1",
    ]);
    let text = String::from_utf8(text.stdout).unwrap();
    // The target as typed (a channel keeps the decimals its raster needs, up to four).
    assert!(text.contains("To land 101.1 MHz"), "{text}");
}

#[test]
fn fit_prints_the_calibration_of_the_readings() {
    let file = asset("lantern_hill_two_metre_buffer.ron");
    let v = json(&run(&["fit", "--recipe", file.to_str().unwrap(), "--json"]));
    for key in [
        "stray_pf",
        "stray_pf_error",
        "inductance_scale",
        "inductance_scale_error",
        "residuals_khz",
        "readings_used",
        "warnings",
    ] {
        assert!(v.get(key).is_some(), "no {key} in {v}");
    }
    let recipe = store::load(&file).unwrap();
    let f = figures(&recipe).unwrap();
    let fit = f.fit.clone().expect("readings").expect("fits");
    assert_eq!(
        v["readings_used"].as_u64(),
        Some(recipe.bench_log.len() as u64)
    );
    assert_eq!(
        v["residuals_khz"].as_array().map(Vec::len),
        Some(recipe.bench_log.len())
    );
    let stray = (recipe.tank.stray + fit.calibration.extra_capacitance) * 1e12;
    assert!((v["stray_pf"].as_f64().unwrap() - stray).abs() < 1e-9);
}

#[test]
fn bad_input_is_refused_with_a_message() {
    let file = asset("lantern_hill_bench_oscillator.ron");
    let f = file.to_str().unwrap();
    for args in [
        vec!["solve"],
        vec!["solve", "--recipe", "/no/such/file.ron"],
        vec!["solve", "--recipe", f, "--target-mhz", "lots"],
        vec!["solve", "--recipe", f, "--target-mhz", "0.01"],
        vec!["solve", "--recipe", f, "--trimmer-pct", "150"],
        vec!["solve", "--recipe", f, "--bogus", "1"],
        vec!["fit", "--recipe", f, "stray"],
        vec!["fit", "--recipe", f],
    ] {
        let o = run(&args);
        assert!(!o.status.success(), "{args:?} succeeded");
        let err = String::from_utf8_lossy(&o.stderr);
        assert!(err.starts_with("tankwright: "), "{args:?}: {err}");
        assert_eq!(err.lines().count(), 1, "{args:?}: {err}");
    }
}

/// A 12.5 kHz channel keeps its fourth decimal in `solve`'s heading (145.3375 MHz would read
/// 145.338 at 1 kHz, a frequency that is not on that raster; 12.5 kHz channels on 2 m:
/// common practice).
#[test]
fn solve_names_a_twelve_and_a_half_kilohertz_channel_whole() {
    let out = run(&[
        "solve",
        "--recipe",
        concat!(
            env!("CARGO_MANIFEST_DIR"),
            "/assets/recipes/field_day_club_channels.ron"
        ),
    ]);
    let text = String::from_utf8(out.stdout).expect("utf-8");
    assert!(text.starts_with("To land 145.3375 MHz,"), "{text}");
}

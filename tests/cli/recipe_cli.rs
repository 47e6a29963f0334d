//! `tankwright report FILE` and `tankwright evaluate --recipe FILE --json`, run as a user would.

use crate::common::{asset, run, stdout};
use serde_json::Value;
use std::collections::BTreeSet;
use std::process::Output;

/// Every key path in a JSON value ("a.b"), for comparing shapes.
fn key_paths(v: &Value, prefix: &str, out: &mut BTreeSet<String>) {
    if let Value::Object(map) = v {
        for (k, child) in map {
            let path = format!("{prefix}{k}");
            key_paths(child, &format!("{path}."), out);
            out.insert(path);
        }
    }
}

#[test]
fn evaluate_recipe_json_has_the_keys_of_the_flag_form_and_the_recipes_figures() {
    let file = asset("lantern_hill_two_metre_buffer.ron");
    // As written: the recipe's coil and tank alone (its readings calibrate the default form;
    // see evaluate_of_a_recipe_with_readings_is_calibrated_unless_asked_as_written).
    let o = run(&[
        "evaluate",
        "--recipe",
        file.to_str().unwrap(),
        "--json",
        "--as-written",
    ]);
    assert!(o.status.success(), "{}", String::from_utf8_lossy(&o.stderr));
    let from_recipe: Value = serde_json::from_str(&stdout(&o)).unwrap();
    // The same coil by flags (the tank's capacitors summed by hand: 4.7 + 2 + 0.5 × 6 pF).
    let o = run(&[
        "evaluate",
        "--former-diameter-mm",
        "5",
        "--turns",
        "5",
        "--length-mm",
        "7",
        "--wire-mm",
        "0.8",
        "--enamel",
        "1",
        "--lead-mm",
        "4",
        "--capacitance-pf",
        "9.7",
        "--stray-pf",
        "4",
        "--temperature-c",
        "22",
        "--json",
    ]);
    assert!(o.status.success());
    let from_flags: Value = serde_json::from_str(&stdout(&o)).unwrap();
    let (mut a, mut b) = (BTreeSet::new(), BTreeSet::new());
    key_paths(&from_recipe, "", &mut a);
    key_paths(&from_flags, "", &mut b);
    assert_eq!(a, b);
    assert!(a.contains("resonance_mhz") && a.contains("inductance_nh.total"));
    let f = |v: &Value| v["resonance_mhz"].as_f64().unwrap();
    assert!(
        (f(&from_recipe) - f(&from_flags)).abs() < 1e-9 * f(&from_flags),
        "{} vs {}",
        f(&from_recipe),
        f(&from_flags)
    );
    assert_eq!(
        from_recipe["external_capacitance_pf"]
            .as_f64()
            .unwrap()
            .round(),
        14.0
    );
}

#[test]
fn report_reads_as_a_build_sheet() {
    let file = asset("lantern_hill_two_metre_buffer.ron");
    let o = run(&["report", file.to_str().unwrap()]);
    assert!(o.status.success(), "{}", String::from_utf8_lossy(&o.stderr));
    let text = stdout(&o);
    for needle in [
        "Recipe: Lantern Hill 2 m buffer tank",
        "Notes: Odile Varga's tank",
        "To wind",
        "former                  5.000 mm",
        "0.800 mm, enamel grade 1",
        "turns                    5.00",
        "length (N x pitch)      7.000 mm",
        "leads                     4.0 mm each",
        "wire to cut",
        "Tank",
        "fixed                    4.70 pF",
        "trimmer                  5.00 pF   (2.0–8.0 pF at 50 %)",
        "channel              145.5000 MHz",
        "offset",
        "length for target",
        "kHz per mm",
        "Bench log",
        "1. 149.9320 MHz at 7.50 mm, trimmer 50 % (club dip meter, dial reading) — first try",
        "±5 ppm",
        "beyond the model",
        "next step",
        "licence",
        // The analysis report follows.
        "Inductance (coil only)",
        "Nagaoka K_N",
    ] {
        assert!(text.contains(needle), "missing {needle:?} in\n{text}");
    }
}

#[test]
fn report_names_the_us_fm_channel_number() {
    let o = run(&[
        "report",
        asset("lantern_hill_bench_oscillator.ron").to_str().unwrap(),
    ]);
    assert!(o.status.success());
    // 47 CFR §73.201: channel n at 88.1 + 0.2·(n − 201) MHz, so 98.7 MHz is channel 254.
    assert!(
        stdout(&o).contains("98.7000 MHz   (channel 254)"),
        "{}",
        stdout(&o)
    );
    assert!(stdout(&o).contains("no measurements yet"));
}

fn assert_one_line_failure(o: &Output, words: &str) {
    assert!(!o.status.success());
    assert!(o.stdout.is_empty(), "{}", stdout(o));
    let err = String::from_utf8(o.stderr.clone()).unwrap();
    assert_eq!(err.lines().count(), 1, "{err}");
    assert!(err.starts_with("tankwright: "), "{err}");
    assert!(err.contains(words), "{err}");
}

#[test]
fn a_bad_file_fails_with_one_line() {
    let dir = tempfile::tempdir().unwrap();
    let bad = dir.path().join("bad.ron");
    std::fs::write(
        &bad,
        "TankwrightRecipe(\n    schema: 1,\n    name: \"x\",\n    coil: Winding(turns: NaN",
    )
    .unwrap();
    let bad = bad.to_str().unwrap();
    assert_one_line_failure(&run(&["report", bad]), "line 4 column");
    assert_one_line_failure(&run(&["evaluate", "--recipe", bad, "--json"]), "bad.ron");
    assert_one_line_failure(&run(&["report"]), "recipe file");
    let newer = dir.path().join("newer.ron");
    std::fs::write(&newer, "TankwrightRecipe(schema: 7, hologram: true)").unwrap();
    assert_one_line_failure(
        &run(&["report", newer.to_str().unwrap()]),
        "made by a newer Tankwright (schema 7, this one reads up to 1)",
    );
}

#[test]
fn recipe_and_coil_flags_do_not_mix() {
    let file = asset("lantern_hill_bench_oscillator.ron");
    assert_one_line_failure(
        &run(&[
            "evaluate",
            "--recipe",
            file.to_str().unwrap(),
            "--turns",
            "3",
        ]),
        "--turns",
    );
}

#[test]
fn channel_numbers_only_for_the_us_plan() {
    let o = run(&[
        "report",
        asset("apprentice_enamel_exercise.ron").to_str().unwrap(),
    ]);
    assert!(o.status.success());
    let text = stdout(&o);
    assert!(
        text.contains("channel               96.3000 MHz\n"),
        "{text}"
    );
    assert!(!text.contains("(channel 2"), "{text}");
}

/// Issue 20: `evaluate --recipe` on a recipe with bench readings states the calibrated figure
/// that `report`, `solve` and the window state (`recipe::figures`), so the coil `solve`
/// proposes evaluates to its target; `--as-written` gives the recipe alone (the figures
/// before the readings).
#[test]
fn evaluate_of_a_recipe_with_readings_is_calibrated_unless_asked_as_written() {
    let file = asset("lantern_hill_two_metre_buffer.ron");
    let path = file.to_str().expect("utf-8");
    let recipe = tankwright::recipe::store::load(&file).expect("opens");
    let f = tankwright::recipe::figures(&recipe).expect("valid");
    assert!(f.calibrated(), "the demo's readings fit");
    let mhz = |args: &[&str]| -> (f64, serde_json::Value) {
        let o = run(args);
        assert!(o.status.success(), "{}", String::from_utf8_lossy(&o.stderr));
        let v: serde_json::Value = serde_json::from_slice(&o.stdout).expect("JSON");
        (v["resonance_mhz"].as_f64().expect("number"), v)
    };
    let (calibrated, v) = mhz(&["evaluate", "--recipe", path, "--json"]);
    approx::assert_relative_eq!(calibrated * 1e6, f.analysis.resonance, max_relative = 1e-9);
    assert_eq!(
        v["calibrated_on_readings"].as_u64(),
        Some(f.readings_used() as u64)
    );
    let (written, v) = mhz(&["evaluate", "--recipe", path, "--json", "--as-written"]);
    approx::assert_relative_eq!(written * 1e6, f.uncalibrated.resonance, max_relative = 1e-9);
    assert!(v.get("calibrated_on_readings").is_none());
    assert!(
        (written - calibrated).abs() > 0.1,
        "the readings move the 2 m tank"
    );
}

//! `tankwright measured`, run as a user runs it: a Touchstone file read into the coil's
//! figures, beside the field solution of a recipe's coil, and bad files refused with the line.
//!
//! The reader and the fit are held to known networks in tests/engine/reference_touchstone.rs
//! (Touchstone 1.1/2.0 specifications; Pozar, *Microwave Engineering*, 2012); here the file is
//! the field solution of the demo's own coil, written at the very frequencies the command
//! samples the field solution at, so the two reductions must agree to the file's 13 digits:
//! this checks the plumbing (file, units, keys, ratios), not the physics.

use crate::common::{asset, asset_str, run_text};
use tankwright::model::Coil;
use tankwright::recipe::store;
use tankwright::tuning::impedance::impedance_sweep;

fn demo_file(dir: &std::path::Path) -> String {
    let recipe = store::load(&asset("lantern_hill_bench_oscillator.ron")).expect("demo opens");
    let coil = Coil::from_winding(&recipe.winding).expect("demo coil");
    // The command samples the field solution in 24 log-spaced points over the file's band.
    let sweep = impedance_sweep(
        &coil,
        recipe.conditions.temperature_c,
        Some(20e6),
        Some(200e6),
        24,
        None,
    )
    .expect("field solution");
    let mut text = String::from("! the demo coil's field solution\n# Hz Z RI R 50\n");
    for p in &sweep.points {
        // Version 1.1: Z normalised to R.
        text += &format!(
            "{:.17e} {:.17e} {:.17e}\n",
            p.frequency,
            p.impedance.re / 50.0,
            p.impedance.im / 50.0
        );
    }
    let path = dir.join("demo-coil.s1p");
    std::fs::write(&path, text).expect("written");
    path.to_str().expect("utf-8").to_owned()
}

#[test]
fn a_measured_coil_is_reduced_and_compared_with_the_field_solution() {
    let dir = tempfile::tempdir().expect("temp dir");
    let file = demo_file(dir.path());
    let recipe = asset_str("lantern_hill_bench_oscillator.ron");
    let (ok, out, err) = run_text(&["measured", &file, "--recipe", &recipe, "--json"]);
    assert!(ok, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).expect("JSON");
    for key in [
        "inductance_nh",
        "self_capacitance_pf",
        "series_resistance_ohm",
        "self_resonance_mhz",
        "q",
        "residual_pct",
        "model",
    ] {
        assert!(v.get(key).is_some(), "missing {key}: {out}");
    }
    let l = v["inductance_nh"].as_f64().expect("number");
    // A 5-turn FM coil: tens of nanohenries (the demo lands near 98 MHz with ~30 pF).
    assert!((20.0..300.0).contains(&l), "{l} nH");
    let ratio = v["ratio_to_field"]["inductance"].as_f64().expect("ratio");
    assert!((ratio - 1.0).abs() < 1e-9, "ratio {ratio}");
    let ratio_c = v["ratio_to_field"]["self_capacitance"]
        .as_f64()
        .expect("ratio");
    assert!((ratio_c - 1.0).abs() < 1e-6, "ratio {ratio_c}");

    let (ok, text, err) = run_text(&["measured", &file]);
    assert!(ok, "{err}");
    assert!(text.contains("inductance (low-frequency)"), "{text}");
    assert!(text.contains(" nH"), "{text}");
}

#[test]
fn bad_files_and_flags_are_refused_with_a_reason() {
    let dir = tempfile::tempdir().expect("temp dir");
    let bad = dir.path().join("bad.s1p");
    std::fs::write(&bad, "# MHz S RI R 50\n100 0.1 0.2\n101 0.1 oops\n").expect("written");
    let bad = bad.to_str().expect("utf-8");
    let (ok, _, err) = run_text(&["measured", bad]);
    assert!(!ok);
    assert!(err.contains("line 3") && err.contains("oops"), "{err}");

    let (ok, _, err) = run_text(&["measured", "coil.txt"]);
    assert!(!ok);
    assert!(err.contains(".s1p"), "{err}");

    let missing = dir.path().join("missing.s2p");
    let (ok, _, err) = run_text(&["measured", missing.to_str().expect("utf-8")]);
    assert!(!ok);
    assert!(err.contains("cannot be read"), "{err}");

    let (ok, _, err) = run_text(&["measured", bad, "--at-mhz", "-3"]);
    assert!(!ok);
    assert!(err.contains("--at-mhz"), "{err}");
}

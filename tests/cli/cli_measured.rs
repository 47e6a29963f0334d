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

/// Issue 24: the measured coil kept with the recipe calibrates the model as readings do. The
/// "measured" coil here is the demo coil's field solution with every impedance multiplied by
/// 1.04: the lumped network's L becomes 1.04 L and C becomes C/1.04 (Terman's network, the
/// reduction's line 1/(X/ω) = 1/L − ω²C scales exactly), so the scale on the field solution
/// is known to be 1.04. Kept, it must calibrate the inductance at 1.04; then one reading
/// synthesised from the field solution at that scale with a hidden extra 0.7 pF must give the
/// 0.7 pF back (one reading alone, with the scale held at 1, cannot).
#[test]
fn a_kept_measurement_calibrates_the_inductance_and_one_reading_then_the_stray() {
    use tankwright::recipe::{BenchEntry, figures};
    use tankwright::tuning::field_tank::field_tank_scaled;
    let scale = 1.04;
    let dir = tempfile::tempdir().expect("temp dir");
    let recipe_path = dir.path().join("bench.ron");
    std::fs::copy(asset("lantern_hill_bench_oscillator.ron"), &recipe_path).expect("copied");
    let recipe_str = recipe_path.to_str().expect("utf-8");
    let mut recipe = store::load(&recipe_path).expect("opens");
    let coil = Coil::from_winding(&recipe.winding).expect("coil");
    let sweep = impedance_sweep(
        &coil,
        recipe.conditions.temperature_c,
        Some(20e6),
        Some(200e6),
        24,
        None,
    )
    .expect("field solution");
    let mut text = String::from("! the demo coil, 4 % more inductance\n# MHz Z RI R 50\n");
    for p in &sweep.points {
        let z = p.impedance * scale;
        text += &format!(
            "{:.15e} {:.17e} {:.17e}\n",
            p.frequency * 1e-6,
            z.re / 50.0,
            z.im / 50.0
        );
    }
    let s1p = dir.path().join("wound-coil.s1p");
    std::fs::write(&s1p, text).expect("written");
    let s1p = s1p.to_str().expect("utf-8");

    let before = std::fs::read(&recipe_path).expect("read");
    let (ok, _, err) = run_text(&["measured", s1p, "--keep"]);
    assert!(!ok && err.contains("--keep needs --recipe"), "{err}");
    assert_eq!(std::fs::read(&recipe_path).expect("read"), before);

    let (ok, out, err) = run_text(&["measured", s1p, "--recipe", recipe_str, "--keep"]);
    assert!(ok, "{err}");
    assert!(out.contains("kept with"), "{out}");
    let kept = store::load(&recipe_path).expect("opens");
    let m = kept.coil_measurement.as_ref().expect("kept");
    assert_eq!(m.source, "wound-coil.s1p");
    let f = figures(&kept).expect("valid");
    let s = f.measured_scale().expect("the measurement applies");
    assert!((s / scale - 1.0).abs() < 1e-6, "{s}");
    assert!(
        f.basis_text().contains("measured coil"),
        "{}",
        f.basis_text()
    );
    // The present coil on the field solution at that scale.
    let truth = field_tank_scaled(
        &coil,
        kept.tank.external_capacitance(),
        &kept.conditions,
        scale,
    )
    .expect("solves")
    .resonance;
    assert!(
        (f.analysis.resonance - truth).abs() < 10.0,
        "{} against {truth}",
        f.analysis.resonance
    );
    let (ok, report, err) = run_text(&["report", recipe_str]);
    assert!(ok, "{err}");
    assert!(report.contains("measured coil"), "{report}");

    // One reading of a build with 0.7 pF hidden: the stray comes back with the measured
    // inductance kept.
    let extra = 0.7e-12;
    let measured = field_tank_scaled(
        &coil,
        kept.tank.external_capacitance() + extra,
        &kept.conditions,
        scale,
    )
    .expect("solves")
    .resonance;
    recipe = kept.clone();
    recipe.bench_log.push(BenchEntry {
        include_anyway: false,
        measured,
        length: coil.length(),
        trimmer_setting: recipe.tank.trimmer_setting,
        added_capacitance: 0.0,
        added_tolerance: None,
        instrument: "counter".to_owned(),
        error_ppm: Some(1.0),
        note: String::new(),
    });
    let fit = figures(&recipe)
        .expect("valid")
        .fit
        .expect("a reading")
        .expect("fits");
    assert!((fit.calibration.inductance_scale / scale - 1.0).abs() < 1e-6);
    assert!(
        (fit.calibration.extra_capacitance - extra).abs() < 1e-15,
        "{} pF",
        fit.calibration.extra_capacitance * 1e12
    );
    // Without the measurement the same reading is read as another stray.
    recipe.coil_measurement = None;
    let plain = figures(&recipe)
        .expect("valid")
        .fit
        .expect("a reading")
        .expect("fits");
    assert!((plain.calibration.extra_capacitance - extra).abs() > 0.1e-12);
}

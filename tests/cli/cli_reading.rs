//! `tankwright reading add`: a bench reading appended to a recipe from the command line and
//! then used by `fit`, as the window's bench log would (the calibration itself is held to its
//! forward model in tests/engine/bench_fit.rs).

use crate::common::{asset, run_text};
use tankwright::recipe::store;

#[test]
fn a_reading_is_appended_and_the_fit_uses_it() {
    let dir = tempfile::tempdir().expect("temp dir");
    let file = dir.path().join("bench.ron");
    std::fs::copy(asset("lantern_hill_bench_oscillator.ron"), &file).expect("copied");
    let path = file.to_str().expect("utf-8");
    let before = store::load(&file).expect("opens").bench_log.len();
    let (ok, said, err) = run_text(&[
        "reading",
        "add",
        path,
        "--mhz",
        "97.9",
        "--trimmer-pct",
        "40",
        "--instrument",
        "counter",
        "--error-ppm",
        "2",
    ]);
    assert!(ok, "{err}");
    assert!(said.contains("added reading"), "{said}");
    let recipe = store::load(&file).expect("opens");
    assert_eq!(recipe.bench_log.len(), before + 1);
    let r = recipe.bench_log.last().expect("reading");
    assert_eq!(r.measured, 97.9e6);
    assert_eq!(r.trimmer_setting, 0.4);
    assert_eq!(r.instrument, "counter");
    assert_eq!(r.error_ppm, Some(2.0));
    // The length defaults to the recipe's coil.
    let coil = tankwright::model::Coil::from_winding(&recipe.winding).expect("coil");
    assert!((r.length - coil.length()).abs() < 1e-12);
    let (ok, out, err) = run_text(&["fit", "--recipe", path, "--json"]);
    assert!(ok, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).expect("JSON");
    // The bench demo ships with no readings: the one added is the one the fit rests on.
    assert_eq!(
        v["readings_used"].as_u64(),
        Some((before + 1) as u64),
        "{out}"
    );
}

#[test]
fn a_bad_reading_is_refused_and_the_file_kept() {
    let dir = tempfile::tempdir().expect("temp dir");
    let file = dir.path().join("bench.ron");
    std::fs::copy(asset("lantern_hill_bench_oscillator.ron"), &file).expect("copied");
    let path = file.to_str().expect("utf-8");
    let before = std::fs::read(&file).expect("read");
    for (args, words) in [
        (vec!["reading", "add", path], "--mhz"),
        (vec!["reading", "add", path, "--mhz", "-3"], "--mhz -3"),
        (
            vec![
                "reading",
                "add",
                path,
                "--mhz",
                "98",
                "--trimmer-pct",
                "140",
            ],
            "--trimmer-pct",
        ),
        (vec!["reading", "remove", path], "unknown reading command"),
        (
            vec!["reading", "add", path, "--mhz", "98", "--colour", "red"],
            "--colour",
        ),
    ] {
        let (ok, _, err) = run_text(&args);
        assert!(!ok, "{args:?} accepted");
        assert!(err.contains(words), "{args:?}: {err}");
        assert_eq!(
            std::fs::read(&file).expect("read"),
            before,
            "{args:?} changed the file"
        );
    }
}

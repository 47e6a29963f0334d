//! Issue 21 through the command line: a fixed tank's chart and report, and the RF swing in
//! the forward-conduction warning of `evaluate`.
//!
//! Sources: a tank with no variable capacitance has one resonance per coil length,
//! f = 1/(2π√(LC)) (Thomson's formula), so there is no trimmer chart to draw; the RF peak
//! across a tank of a small oscillator, 2 V, is common practice (from memory).

use crate::common::{JUNCTION_COIL, asset_str, run_text as run};

/// The shipped apprentice exercise is a fixed tank.
const FIXED: &str = "apprentice_enamel_exercise.ron";

#[test]
fn chart_kind_trimmer_on_a_fixed_tank_is_refused_with_the_reason() {
    let dir = tempfile::tempdir().expect("temp dir");
    let out = dir.path().join("t.png");
    let recipe = asset_str(FIXED);
    let (ok, _, err) = run(&[
        "chart",
        &recipe,
        "--kind",
        "trimmer",
        "--out",
        out.to_str().expect("utf-8"),
    ]);
    assert!(!ok, "a trimmer chart of a fixed tank was written");
    assert!(err.contains("no trimmer chart for a fixed tank"), "{err}");
    assert!(err.contains("--kind spacing"), "{err}");
    assert!(!out.exists());
    // The spacing chart is made.
    let (ok, _, err) = run(&[
        "chart",
        &recipe,
        "--kind",
        "spacing",
        "--out",
        out.to_str().expect("utf-8"),
    ]);
    assert!(ok, "{err}");
    assert!(out.exists());
}

#[test]
fn the_report_of_a_fixed_tank_says_so_and_never_a_travel_to_itself() {
    let (ok, out, err) = run(&["report", &asset_str(FIXED)]);
    assert!(ok, "{err}");
    assert!(out.contains("none (a fixed tank"), "{out}");
    assert!(out.contains("the fixed tank ("), "{out}");
    assert!(!out.contains("trimmer's travel"), "{out}");
    assert!(!out.contains("over the trimmer"), "{out}");
    assert!(!out.contains("or trimmer at"), "{out}");
}

/// A junction straight across the tank at 2.2 V bias with a 0.5 V audio peak: the 2 V RF
/// peak (default) drives it forward (2.2 − 0.5 − 2 = −0.3 V); with `--rf-peak-v 1` it stays
/// reverse (0.7 V). The JSON says so with the RF at the junction beside.
#[test]
fn the_forward_warning_counts_the_rf_peak() {
    let run_json = |extra: &[&str]| {
        let mut args: Vec<&str> = JUNCTION_COIL.to_vec();
        args.extend_from_slice(&[
            "--junction-cj0-pf",
            "2.2",
            "--junction-vj",
            "0.65",
            "--junction-m",
            "0.4",
            "--bias-v",
            "2.2",
            "--audio-peak-v",
            "0.5",
        ]);
        args.extend_from_slice(extra);
        let (ok, out, err) = run(&args);
        assert!(ok, "{err}");
        serde_json::from_str::<serde_json::Value>(&out).expect("JSON")
    };
    let v = run_json(&[]);
    let m = &v["modulation"];
    assert_eq!(m["rf_at_junction_v"].as_f64(), Some(2.0));
    assert_eq!(m["forward_on_peaks"].as_bool(), Some(true));
    assert!((m["least_reverse_v"].as_f64().expect("number") + 0.3).abs() < 1e-9);
    let advice = m["advice"].to_string();
    assert!(advice.contains("RF across the junction"), "{advice}");
    let v = run_json(&["--rf-peak-v", "1"]);
    assert_eq!(v["modulation"]["forward_on_peaks"].as_bool(), Some(false));
    let (ok, _, err) = run(&[&JUNCTION_COIL[..], &["--rf-peak-v", "1"]].concat());
    assert!(!ok && err.contains("need a junction"), "{err}");
}

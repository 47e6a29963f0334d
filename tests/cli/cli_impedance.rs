//! The headless `impedance` command, run as a user would run it.

use crate::common::run_text as run;

/// The demo coil: 7 mm mean diameter, 5 turns over 8 mm, 1 mm wire, 5 mm leads.
const COIL: [&str; 11] = [
    "impedance",
    "--mean-diameter-mm",
    "7",
    "--turns",
    "5",
    "--length-mm",
    "8",
    "--wire-mm",
    "1",
    "--lead-mm",
    "5",
];

fn with(extra: &[&'static str]) -> Vec<&'static str> {
    let mut v = COIL.to_vec();
    v.extend_from_slice(extra);
    v
}

#[test]
fn json_has_the_sweep_and_the_self_resonance() {
    let (ok, out, err) = run(&with(&[
        "--points",
        "5",
        "--capacitance-pf",
        "20",
        "--json",
    ]));
    assert!(ok, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).expect("one JSON object");
    for key in [
        "method",
        "self_resonance_mhz",
        "ceiling_mhz",
        "segments",
        "operating",
        "points",
    ] {
        assert!(v.get(key).is_some(), "missing {key}: {out}");
    }
    let srf = v["self_resonance_mhz"].as_f64().expect("a number");
    let points = v["points"].as_array().expect("an array");
    assert_eq!(points.len(), 5);
    // Default range: 1 MHz to 1.25 × the self-resonance, rising.
    let first = points[0]["mhz"].as_f64().expect("mhz");
    let last = points[4]["mhz"].as_f64().expect("mhz");
    assert!((first - 1.0).abs() < 1e-9, "{first}");
    assert!((last / srf - 1.25).abs() < 1e-6, "{last} vs {srf}");
    for p in points {
        for key in ["mhz", "r_ohm", "x_ohm", "abs_ohm", "apparent_nh", "q"] {
            assert!(p.get(key).is_some(), "point lacks {key}: {p}");
        }
        assert!(p["r_ohm"].as_f64().expect("r") >= 0.0, "passive: {p}");
    }
    // Below the self-resonance the coil is inductive.
    assert!(points[0]["x_ohm"].as_f64().expect("x") > 0.0);
    let op = &v["operating"];
    assert!(op["mhz"].as_f64().expect("operating frequency") > first);
    assert!(op["apparent_nh"].as_f64().expect("X/w") > 0.0);
}

#[test]
fn a_chosen_range_is_kept_and_the_text_names_the_geometry() {
    let (ok, out, err) = run(&with(&[
        "--from-mhz",
        "50",
        "--to-mhz",
        "150",
        "--points",
        "3",
    ]));
    assert!(ok, "{err}");
    assert!(out.contains("first parallel self-resonance"), "{out}");
    assert!(out.contains("leads 5.0 mm each to the board"), "{out}");
    for f in ["50.0000", "86.6025", "150.0000"] {
        assert!(out.contains(f), "no {f} MHz row in:\n{out}");
    }
}

#[test]
fn bad_input_is_refused_with_a_message() {
    let cases: [(&[&'static str], &str); 6] = [
        (&["--points", "1"], "--points 1"),
        (
            &["--from-mhz", "200", "--to-mhz", "100"],
            "must be above --from-mhz",
        ),
        (&["--from-mhz", "-3"], "must be above 0 MHz"),
        (
            &["--to-mhz", "900000"],
            "the highest frequency solved for this coil",
        ),
        (&["--points", "many"], "expects a whole number"),
        (&["--colour", "red"], "unknown flag --colour"),
    ];
    for (extra, message) in cases {
        let (ok, out, err) = run(&with(extra));
        assert!(!ok, "{extra:?} accepted: {out}");
        assert!(out.is_empty(), "{extra:?} printed {out}");
        assert!(
            err.contains(message),
            "{extra:?}: '{err}' lacks '{message}'"
        );
    }
    // A coil the model refuses: turns overlapping.
    let (ok, _, err) = run(&[
        "impedance",
        "--mean-diameter-mm",
        "7",
        "--turns",
        "5",
        "--length-mm",
        "3",
        "--wire-mm",
        "1",
    ]);
    assert!(!ok);
    assert!(err.contains("overlap"), "{err}");
}

#[test]
fn evaluate_json_carries_the_field_solution() {
    let mut eval = with(&["--capacitance-pf", "20", "--json"]);
    eval[0] = "evaluate";
    let (ok, out, err) = run(&eval);
    assert!(ok, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).expect("one JSON object");
    let field = v["self_resonance_mhz"]["field_solved"]
        .as_f64()
        .expect("field_solved");
    for key in ["lumped", "helical"] {
        assert!(
            v["self_resonance_mhz"][key].as_f64().is_some(),
            "kept {key}"
        );
    }
    let apparent = v["inductance_nh"]["apparent"].as_f64().expect("apparent");
    assert!(v["inductance_nh"]["apparent_classical"].as_f64().is_some());
    // The same figures as the impedance command gives for the same coil and tank.
    let (ok, out, err) = run(&with(&[
        "--capacitance-pf",
        "20",
        "--points",
        "2",
        "--json",
    ]));
    assert!(ok, "{err}");
    let z: serde_json::Value = serde_json::from_str(&out).expect("one JSON object");
    assert_eq!(z["self_resonance_mhz"].as_f64(), Some(field));
    assert_eq!(z["operating"]["apparent_nh"].as_f64(), Some(apparent));
}

#[test]
fn evaluate_keeps_working_when_the_field_solution_refuses() {
    // Leads shorter than the wire diameter: the classical figures stand, the field solution
    // says why it is absent.
    let (ok, out, err) = run(&[
        "evaluate",
        "--mean-diameter-mm",
        "7",
        "--turns",
        "5",
        "--length-mm",
        "8",
        "--wire-mm",
        "1",
        "--lead-mm",
        "0.5",
        "--json",
    ]);
    assert!(ok, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).expect("one JSON object");
    assert!(v["self_resonance_mhz"]["field_solved"].is_null());
    let note = v["field_solution_note"].as_str().expect("a note");
    assert!(note.contains("leads shorter"), "{note}");
    assert!(v["inductance_nh"]["apparent"].as_f64().is_some());
    // The classical figures lead, and say so.
    assert_eq!(v["resonance_source"], "classical");
    assert_eq!(v["resonance_mhz"], v["resonance_mhz_classical"]);
    assert_eq!(
        v["inductance_nh"]["apparent"],
        v["inductance_nh"]["apparent_classical"]
    );
}

/// Issue 20: `impedance --recipe` works at the calibrated operating frequency: on a recipe with
/// bench readings its operating point is the frequency `evaluate --recipe` states (both from
/// `recipe::figures`), and with `--as-written` the recipe's own.
#[test]
fn impedance_of_a_recipe_with_readings_is_taken_at_the_calibrated_frequency() {
    let recipe = crate::common::asset_str("lantern_hill_two_metre_buffer.ron");
    let mhz = |args: &[&str], key: &str| -> f64 {
        let (ok, out, err) = run(args);
        assert!(ok, "{args:?}: {err}");
        let v: serde_json::Value = serde_json::from_str(&out).expect("JSON");
        let x = if key == "operating" {
            v["operating"]["mhz"].as_f64()
        } else {
            v[key].as_f64()
        };
        x.unwrap_or_else(|| panic!("no {key} in {out}"))
    };
    for as_written in [false, true] {
        let mut imp = vec!["impedance", "--recipe", &recipe, "--points", "2", "--json"];
        let mut eva = vec!["evaluate", "--recipe", &recipe, "--json"];
        if as_written {
            imp.push("--as-written");
            eva.push("--as-written");
        }
        let (a, b) = (mhz(&imp, "operating"), mhz(&eva, "resonance_mhz"));
        assert!(
            (a / b - 1.0).abs() < 1e-9,
            "as written {as_written}: {a} against {b}"
        );
    }
    let (ok, out, err) = run(&["impedance", "--recipe", &recipe, "--points", "2"]);
    assert!(ok, "{err}");
    assert!(out.contains("calibrated on the recipe's"), "{out}");
}

//! The headless `evaluate` command, run as a user would run it.

use crate::common::run_text as run;
use std::process::Command;

const COIL: [&str; 14] = [
    "evaluate",
    "--mean-diameter-mm",
    "7",
    "--turns",
    "5",
    "--length-mm",
    "7",
    "--wire-mm",
    "1",
    "--lead-mm",
    "5",
    "--capacitance-pf",
    "20",
    "--json",
];

#[test]
fn json_has_every_key_the_issue_names() {
    let (ok, out, err) = run(&COIL);
    assert!(ok, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).expect("one JSON object");
    for key in [
        "nagaoka_coefficient",
        "self_capacitance_pf",
        "total_capacitance_pf",
        "resonance_mhz",
        "ac_resistance_ohm",
        "q",
        "wire_length_mm",
        "warnings",
    ] {
        assert!(v.get(key).is_some(), "missing {key}");
    }
    for key in [
        "wheeler_1928",
        "current_sheet",
        "lundin_1985",
        "round_wire_low_freq",
        "round_wire",
        "filament_sum",
    ] {
        assert!(
            v["inductance_nh"][key].as_f64().is_some(),
            "missing inductance_nh.{key}"
        );
    }
    for key in ["lumped", "helical"] {
        assert!(
            v["self_resonance_mhz"][key].as_f64().is_some(),
            "missing self_resonance_mhz.{key}"
        );
    }
    // Grover 1946 Table 36: K_N = 0.688423 at l/D = 1.
    assert!((v["nagaoka_coefficient"].as_f64().unwrap_or(0.0) - 0.688423).abs() < 2e-6);
    // Thomson: f = 1/(2π√(LC)), with the reported total L (the model's, scaled onto the field
    // solution) and the total capacitance (self-capacitance included).
    let l = v["inductance_nh"]["total"].as_f64().unwrap_or(0.0) * 1e-9;
    let c = v["total_capacitance_pf"].as_f64().unwrap_or(0.0) * 1e-12;
    let f = v["resonance_mhz"].as_f64().unwrap_or(0.0) * 1e6;
    assert!((f * 2.0 * std::f64::consts::PI * (l * c).sqrt() - 1.0).abs() < 1e-9);
    // The resonance that leads is the field-solved one: Thomson's formula again with the
    // field's apparent inductance X/ω at that very frequency and the external capacitance
    // alone (the coil's own capacitance is inside X), to the solver's 1e-9.
    assert_eq!(v["resonance_source"], "field_solved");
    let l = v["inductance_nh"]["apparent"].as_f64().unwrap_or(0.0) * 1e-9;
    let c = v["external_capacitance_pf"].as_f64().unwrap_or(0.0) * 1e-12;
    let f = v["resonance_mhz"].as_f64().unwrap_or(0.0) * 1e6;
    assert!((f * 2.0 * std::f64::consts::PI * (l * c).sqrt() - 1.0).abs() < 2e-9);
}

#[test]
fn the_report_has_units() {
    let (ok, out, _) = run(&COIL[..13]);
    assert!(ok);
    for unit in ["mm", "nH", "pF", "MHz", "ohm"] {
        assert!(out.contains(unit), "report lacks {unit}:\n{out}");
    }
}

#[test]
fn bad_input_gives_one_line_and_failure() {
    for args in [
        vec!["evaluate", "--turns", "5"],
        vec![
            "evaluate",
            "--mean-diameter-mm",
            "7",
            "--turns",
            "five",
            "--length-mm",
            "7",
            "--wire-mm",
            "1",
        ],
        vec![
            "evaluate",
            "--mean-diameter-mm",
            "7",
            "--turns",
            "5",
            "--length-mm",
            "2",
            "--wire-mm",
            "1",
        ],
        vec![
            "evaluate",
            "--mean-diameter-mm",
            "7",
            "--turns",
            "5",
            "--length-mm",
            "7",
            "--wire-mm",
            "1",
            "--bogus",
            "3",
        ],
    ] {
        let (ok, out, err) = run(&args);
        assert!(!ok, "{args:?} should fail");
        assert!(out.is_empty());
        assert_eq!(err.trim().lines().count(), 1, "{err}");
        assert!(!err.contains("NaN") && !err.contains("panicked"), "{err}");
    }
}

/// The words of a working `evaluate` without `--json`.
const PLAIN: [&str; 9] = [
    "evaluate",
    "--mean-diameter-mm",
    "7",
    "--turns",
    "5",
    "--length-mm",
    "7",
    "--wire-mm",
    "1",
];

#[test]
fn stray_words_and_single_dash_flags_are_refused() {
    let with = |extra: &[&str]| {
        let mut v: Vec<&str> = PLAIN.to_vec();
        v.extend_from_slice(extra);
        run(&v)
    };
    assert!(with(&[]).0, "the plain command works");
    let (ok, out, err) = with(&["stray"]);
    assert!(
        !ok && out.is_empty() && err.contains("unexpected word 'stray'"),
        "{err}"
    );
    let (ok, _, err) = with(&["-json"]);
    assert!(
        !ok && err.contains("'-json'") && err.contains("two dashes"),
        "{err}"
    );
    // `--turns 5 6`: the 6 is a stray word.
    let mut v: Vec<&str> = PLAIN.to_vec();
    v.insert(5, "6");
    let (ok, _, err) = run(&v);
    assert!(!ok && err.contains("unexpected word '6'"), "{err}");
    let (ok, _, err) = run(&["report", "a.ron", "-x"]);
    assert!(!ok && err.contains("'-x'"), "{err}");
}

#[test]
fn control_characters_are_not_echoed_raw() {
    let mut v: Vec<&str> = PLAIN.to_vec();
    v.extend_from_slice(&["--model", "\u{1b}[2J\u{7}wheel"]);
    let (ok, _, err) = run(&v);
    assert!(!ok);
    assert!(!err.contains('\u{1b}') && !err.contains('\u{7}'), "{err:?}");
    assert!(err.contains("\\u{1b}[2J"), "shown escaped: {err}");

    // A recipe whose name holds an escape sequence: the report shows it escaped.
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("named.ron");
    let mut r = tankwright::recipe::Recipe::demo();
    r.name = "club\u{1b}]0;owned\u{7} coil".to_owned();
    tankwright::recipe::save(&path, &r).unwrap();
    let (ok, out, err) = run(&["report", path.to_str().unwrap()]);
    assert!(ok, "{err}");
    assert!(!out.contains('\u{1b}') && !out.contains('\u{7}'), "{out:?}");
    assert!(out.contains("club\\u{1b}]0;owned\\u{7} coil"), "{out}");
}

#[cfg(target_os = "linux")]
#[test]
fn a_full_or_closed_standard_output_ends_with_a_message_not_a_panic() {
    // Full: /dev/full refuses every write with "no space left on device".
    let full = std::fs::OpenOptions::new()
        .write(true)
        .open("/dev/full")
        .unwrap();
    let out = Command::new(env!("CARGO_BIN_EXE_tankwright"))
        .args(PLAIN)
        .stdout(full)
        .output()
        .unwrap();
    let err = String::from_utf8_lossy(&out.stderr);
    assert_eq!(out.status.code(), Some(1), "{err}");
    assert!(err.contains("cannot write the output"), "{err}");
    assert!(!err.contains("panicked"), "{err}");

    // Closed: the reading end is gone before the command writes.
    let (reader, writer) = std::io::pipe().unwrap();
    drop(reader);
    let out = Command::new(env!("CARGO_BIN_EXE_tankwright"))
        .args(PLAIN)
        .stdout(writer)
        .output()
        .unwrap();
    let err = String::from_utf8_lossy(&out.stderr);
    assert_eq!(out.status.code(), Some(1), "{err}");
    assert!(err.contains("cannot write the output"), "{err}");
    assert!(!err.contains("panicked"), "{err}");
}

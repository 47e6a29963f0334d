//! Inputs outside what the physics allows are refused with the reason and the accepted range;
//! NaN and inf never reach the output as figures (issue 22, "Impossible results printed as
//! results"). Each case printed "NaN kHz", "inf kHz" or a JSON null before the fix.
//!
//! Sources for the ranges: EIA-198-1 (class-1 ceramic coefficients specified over −55 to
//! +125 °C, a 180 K span); S. M. Sze, *Physics of Semiconductor Devices*, 2nd ed., 1981,
//! Appendix G (band gaps: a junction's contact potential lies below it); ITU-R BS.450
//! (the stereo multiplex's data subcarrier at 57 kHz, below the 100 kHz audio limit).

use crate::common::run_text as run;
use std::process::{Command, Stdio};

/// A small FM coil with a modulating junction, so every drift and modulation line is made.
const COIL: [&str; 21] = [
    "evaluate",
    "--mean-diameter-mm",
    "8",
    "--turns",
    "5",
    "--length-mm",
    "8",
    "--wire-mm",
    "1",
    "--capacitance-pf",
    "20",
    "--junction-cj0-pf",
    "10",
    "--junction-vj",
    "0.7",
    "--junction-m",
    "0.5",
    "--bias-v",
    "4",
    "--audio-peak-v",
    "0.1",
];

fn with(extra: &[&str]) -> Vec<String> {
    COIL.iter().chain(extra).map(|s| (*s).to_owned()).collect()
}

/// The coil with its turns given as `word`.
fn turns(word: &str) -> Vec<String> {
    let mut args = with(&[]);
    let at = args.iter().position(|a| a == "--turns").expect("turns") + 1;
    args[at] = word.to_owned();
    args
}

fn run_owned(args: &[String]) -> (bool, String, String) {
    let refs: Vec<&str> = args.iter().map(String::as_str).collect();
    run(&refs)
}

/// True when `text` holds "NaN" or "inf" as a word (a figure that came out undefined).
fn has_undefined(text: &str) -> bool {
    text.split(|c: char| !c.is_ascii_alphanumeric())
        .any(|w| w == "NaN" || w == "inf" || w == "nan")
}

/// Refused, naming the flag and an accepted range, and printing nothing on standard output.
fn assert_refused(extra: &[&str], flag: &str, range: &str) {
    for json in [false, true] {
        let mut args = with(extra);
        if json {
            args.push("--json".to_owned());
        }
        let (ok, out, err) = run_owned(&args);
        assert!(!ok, "{extra:?} accepted:\n{out}");
        assert!(out.is_empty(), "{extra:?} printed:\n{out}");
        assert!(
            err.contains(flag),
            "{extra:?}: message does not name {flag}: {err}"
        );
        assert!(
            err.contains(range),
            "{extra:?}: message lacks the range {range}: {err}"
        );
        assert!(!has_undefined(&err), "{err}");
    }
}

#[test]
fn the_coil_itself_is_accepted_and_prints_no_undefined_figure() {
    for json in [false, true] {
        let mut args = with(&[]);
        if json {
            args.push("--json".to_owned());
        }
        let (ok, out, err) = run_owned(&args);
        assert!(ok, "{err}");
        assert!(!has_undefined(&out), "{out}");
        if json {
            let v: serde_json::Value = serde_json::from_str(&out).expect("JSON");
            for line in v["drift"].as_array().expect("drift lines") {
                assert!(
                    line["shift_khz"].is_f64(),
                    "drift shift not a number: {line}"
                );
            }
            assert!(v["modulation"]["carson_bandwidth_khz"].is_f64());
        }
    }
}

#[test]
fn a_negative_hand_is_refused_with_its_range() {
    assert_refused(&["--hand-pf", "-19"], "--hand-pf", "0–100 pF");
}

#[test]
fn a_load_change_that_empties_the_tank_is_refused() {
    // -100 pF is inside the flag's own range but more than this tank holds.
    let (ok, out, err) = run_owned(&with(&["--load-change-pf", "-100"]));
    assert!(!ok && out.is_empty(), "{out}");
    assert!(
        err.contains("--load-change-pf") && err.contains("zero or below"),
        "{err}"
    );
    assert_refused(
        &["--load-change-pf", "-1e6"],
        "--load-change-pf",
        "-100–100 pF",
    );
}

#[test]
fn a_temperature_change_beyond_the_classes_is_refused() {
    assert_refused(
        &["--temperature-change-k", "-1e6"],
        "--temperature-change-k",
        "-180–180 K",
    );
}

#[test]
fn an_audio_limit_of_1e308_is_refused_in_short_figures() {
    assert_refused(
        &["--audio-max-khz", "1e308"],
        "--audio-max-khz",
        "0.001–100 kHz",
    );
    let (_, _, err) = run_owned(&with(&["--audio-max-khz", "1e308"]));
    assert!(err.contains("1e308"), "{err}");
    assert!(
        !err.contains("00000000000000000000"),
        "a 300-digit number: {err}"
    );
}

#[test]
fn a_model_line_with_vj_of_one_picovolt_is_refused() {
    let (ok, out, err) = run(&[
        "evaluate",
        "--mean-diameter-mm",
        "8",
        "--turns",
        "5",
        "--length-mm",
        "8",
        "--wire-mm",
        "1",
        "--capacitance-pf",
        "20",
        "--junction-model",
        ".model X D(CJO=10p VJ=1p M=0.5)",
        "--bias-v",
        "4",
    ]);
    assert!(!ok && out.is_empty(), "{out}");
    assert!(err.contains("VJ") && err.contains("0.1–3.5 V"), "{err}");
    let mut args = with(&[]);
    let vj = args.iter().position(|a| a == "0.7").expect("the coil's VJ");
    args[vj] = "1e-12".to_owned();
    let (ok, out, err) = run_owned(&args);
    assert!(!ok && out.is_empty(), "{out}");
    assert!(
        err.contains("--junction-vj 1e-12") && err.contains("0.1–3.5 V"),
        "{err}"
    );
}

#[test]
fn a_huge_number_in_a_message_is_shortened() {
    let big = format!("1{}", "0".repeat(300));
    let (ok, _, err) = run_owned(&with(&["--hand-pf", &big]));
    assert!(!ok);
    assert!(err.len() < 300, "message of {} bytes: {err}", err.len());
    let word = format!("x{}", "9".repeat(300));
    let (ok, _, err) = run_owned(&turns(&word));
    assert!(!ok);
    assert!(err.len() < 300 && err.contains('…'), "{err}");
}

#[test]
fn bidirectional_controls_never_reach_the_terminal() {
    for c in [
        '\u{202e}', '\u{202a}', '\u{2066}', '\u{2069}', '\u{200f}', '\u{061c}',
    ] {
        let word = format!("5{c}evil");
        let (ok, out, err) = run_owned(&turns(&word));
        assert!(!ok);
        assert!(!out.contains(c) && !err.contains(c), "{c:?} passed: {err}");
        assert!(err.contains(&format!("{}", c.escape_unicode())), "{err}");
    }
}

fn recipe() -> String {
    format!(
        "{}/assets/recipes/lantern_hill_bench_oscillator.ron",
        env!("CARGO_MANIFEST_DIR")
    )
}

#[test]
fn report_with_standard_output_closed_fails_with_a_message() {
    let out = Command::new("sh")
        .args(["-c", "exec \"$0\" report \"$1\" >&-"])
        .arg(env!("CARGO_BIN_EXE_tankwright"))
        .arg(recipe())
        .stderr(Stdio::piped())
        .output()
        .expect("sh runs");
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(!out.status.success(), "exit 0 with the output lost");
    assert!(err.contains("standard output is closed"), "{err}");
    // The same command to /dev/null (write-only, as a shell opens it) is a normal run.
    let out = Command::new(env!("CARGO_BIN_EXE_tankwright"))
        .args(["report", &recipe()])
        .stdout(Stdio::null())
        .output()
        .expect("runs");
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
}

#[test]
fn the_last_guard_names_the_figure_that_came_out_undefined() {
    let err = tankwright::cli::refuse_undefined("Tank\n  Q                         NaN\n")
        .expect_err("NaN refused");
    assert!(err.contains("Q"), "{err}");
    assert!(tankwright::cli::refuse_undefined("  self-resonance (inf MHz)\n").is_err());
    // Words that merely contain the letters pass.
    assert!(tankwright::cli::refuse_undefined("information: infinite NaNo Nancy\n").is_ok());
}

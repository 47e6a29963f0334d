//! `tankwright design`, run as a user runs it: every proposed candidate, evaluated on its own
//! by `tankwright evaluate` with the candidate's parameters, lands the target within the FM
//! channel's tolerance (±15 kHz, the service's default) at its trimmer setting; its spread band
//! lies within the trimmer's reach; `--save-best` writes a recipe that opens and lands; bad
//! flags are refused before any solve, naming the flag and the accepted range, and leave no
//! file.
//!
//! Outside source for the hand check: Thomson's formula f = 1/(2π√(LC)) (W. Thomson, Phil.
//! Mag. 5, 1853) on the inductance and capacitance `evaluate` reports for the candidate.

use crate::common::run;
use serde_json::Value;
use std::process::Output;

fn json(o: &Output) -> Value {
    assert!(o.status.success(), "{}", String::from_utf8_lossy(&o.stderr));
    serde_json::from_slice(&o.stdout).expect("one JSON object")
}

const SMALL: [&str; 12] = [
    "design",
    "--target-mhz",
    "98.7",
    "--formers-mm",
    "5",
    "--wires-mm",
    "0.8,1.25",
    "--fixed-pf",
    "15,18",
    "--trimmers-pf",
    "2-10",
    "--json",
];

fn num(v: &Value, key: &str) -> f64 {
    v[key]
        .as_f64()
        .unwrap_or_else(|| panic!("{key} is a number in {v}"))
}

#[test]
fn each_candidate_lands_the_target_when_evaluated_on_its_own() {
    let mut args = SMALL.to_vec();
    args.extend(["--count", "2"]);
    let v = json(&run(&args));
    let candidates = v["candidates"].as_array().expect("candidates");
    assert!(!candidates.is_empty(), "{}", v["ruled_out"]);
    assert!(v["ruled_out"].is_array());
    for c in candidates {
        let s = |key: &str| format!("{}", num(c, key));
        let e = json(&run(&[
            "evaluate",
            "--former-diameter-mm",
            &s("former_mm"),
            "--wire-mm",
            &s("wire_mm"),
            "--turns",
            &s("turns"),
            "--length-mm",
            &s("length_mm"),
            "--lead-mm",
            &s("lead_mm"),
            "--capacitance-pf",
            &s("fixed_pf"),
            "--stray-pf",
            &s("stray_pf"),
            "--trimmer-min-pf",
            &s("trimmer_min_pf"),
            "--trimmer-max-pf",
            &s("trimmer_max_pf"),
            "--trimmer-pct",
            &s("trimmer_pct"),
            "--target-mhz",
            "98.7",
            "--json",
        ]));
        let f = num(&e, "resonance_mhz");
        assert!(
            (f - 98.7).abs() <= 0.015,
            "evaluate puts candidate {c} at {f} MHz"
        );
        assert!((f - num(c, "resonance_mhz")).abs() < 1e-6);
        // Thomson's formula on evaluate's own inductance and capacitance.
        let l = e["inductance_nh"]["total"].as_f64().expect("total") * 1e-9;
        let cap = num(&e, "total_capacitance_pf") * 1e-12;
        let thomson = 1.0 / (2.0 * std::f64::consts::PI * (l * cap).sqrt()) * 1e-6;
        assert!(
            (thomson - f).abs() / f < 1e-6,
            "Thomson {thomson} against {f}"
        );
        // The spread band inside the trimmer's reach.
        let reach = c["trimmer_reach_mhz"].as_array().expect("reach");
        let band = c["resonance_range_mhz"].as_array().expect("band");
        let (r0, r1) = (
            reach[0].as_f64().expect("lo"),
            reach[1].as_f64().expect("hi"),
        );
        let (b0, b1) = (band[0].as_f64().expect("lo"), band[1].as_f64().expect("hi"));
        assert!(
            r0 <= b0 && b1 <= r1,
            "band {b0}–{b1} outside reach {r0}–{r1}"
        );
        for key in [
            "khz_per_mm",
            "q",
            "self_resonance_mhz",
            "trimmer_pct",
            "enamel",
        ] {
            assert!(c.get(key).is_some(), "{key} missing");
        }
        assert!(!c["reasons"].as_array().expect("reasons").is_empty());
    }
}

#[test]
fn save_best_writes_a_recipe_that_lands() {
    let dir = std::env::temp_dir().join(format!("tankwright-design-{}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("a folder");
    let file = dir.join("best.ron");
    let mut args = SMALL.to_vec();
    let path = file.to_string_lossy().into_owned();
    args.extend(["--count", "1", "--save-best", &path]);
    let v = json(&run(&args));
    let best = &v["candidates"][0];
    let recipe = tankwright::recipe::store::load(&file).expect("the saved recipe opens");
    let f = tankwright::recipe::figures(&recipe).expect("valid");
    assert!((f.analysis.resonance * 1e-6 - num(best, "resonance_mhz")).abs() < 1e-6);
    assert!((f.analysis.resonance - 98.7e6).abs() <= recipe.target.tolerance());
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn bad_flags_are_refused_naming_the_flag_and_range() {
    let dir = std::env::temp_dir().join(format!("tankwright-design-bad-{}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("a folder");
    let file = dir.join("never.ron");
    let path = file.to_string_lossy().into_owned();
    let cases: [(&str, &str, &str); 6] = [
        ("--formers-mm", "0.2", "1–50 mm"),
        ("--wires-mm", "9", "0.1–3 mm"),
        ("--trimmers-pf", "10-2", "maximum must be above"),
        ("--fixed-pf", "E7:1-10", "E6, E12 or E24"),
        ("--count", "0", "1–20"),
        ("--target-mhz", "0.01", "MHz"),
    ];
    for (flag, value, says) in cases {
        let mut args: Vec<&str> = SMALL.to_vec();
        let i = args.iter().position(|a| *a == flag);
        match i {
            Some(i) => args[i + 1] = value,
            None => args.extend([flag, value]),
        }
        args.extend(["--save-best", &path]);
        let o = run(&args);
        assert!(!o.status.success(), "{flag} {value} accepted");
        let err = String::from_utf8_lossy(&o.stderr);
        assert!(err.contains(flag), "{flag}: {err}");
        assert!(err.contains(says), "{flag}: {err}");
        assert!(!file.exists(), "{flag}: a file was written");
    }
    let o = run(&["design", "--target-mhz", "98.7"]);
    assert!(String::from_utf8_lossy(&o.stderr).contains("--formers-mm is missing"));
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn nothing_found_is_said_and_nothing_saved() {
    let dir = std::env::temp_dir().join(format!("tankwright-design-none-{}", std::process::id()));
    std::fs::create_dir_all(&dir).expect("a folder");
    let file = dir.join("none.ron");
    let path = file.to_string_lossy().into_owned();
    let o = run(&[
        "design",
        "--target-mhz",
        "98.7",
        "--formers-mm",
        "5",
        "--wires-mm",
        "1",
        "--fixed-pf",
        "10",
        "--trimmers-pf",
        "6-30",
        "--save-best",
        &path,
    ]);
    assert!(!o.status.success());
    let err = String::from_utf8_lossy(&o.stderr);
    assert!(err.contains("nothing saved"), "{err}");
    assert!(err.contains("108.000 MHz"), "{err}");
    assert!(!file.exists());
    std::fs::remove_dir_all(&dir).ok();
}

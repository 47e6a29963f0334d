//! `tankwright new`: a recipe written from the same coil and tank flags `evaluate` reads
//! (issue 24). The file it writes opens, and `evaluate --recipe` on it states the same
//! resonance as `evaluate` with the flags (one model, one reader of the flags); an existing
//! file is never replaced without `--replace`.

use crate::common::run_text;

const FLAGS: [&str; 18] = [
    "--former-diameter-mm",
    "6",
    "--turns",
    "5",
    "--length-mm",
    "8",
    "--wire-mm",
    "1.0",
    "--lead-mm",
    "5",
    "--capacitance-pf",
    "18",
    "--stray-pf",
    "6",
    "--trimmer-min-pf",
    "2",
    "--trimmer-max-pf",
    "10",
];

fn resonance(json: &str) -> f64 {
    let v: serde_json::Value = serde_json::from_str(json).expect("JSON");
    v["resonance_mhz"]
        .as_f64()
        .unwrap_or_else(|| panic!("no resonance_mhz in {json}"))
}

#[test]
fn a_new_recipe_holds_the_flags_and_evaluates_as_they_do() {
    let dir = tempfile::tempdir().expect("temp dir");
    let file = dir.path().join("shed.ron");
    let path = file.to_str().expect("utf-8");
    let mut args = vec!["new", path, "--target-mhz", "98.3", "--name", "Shed coil"];
    args.extend(FLAGS);
    args.extend(["--construction", "stripboard"]);
    let (ok, out, err) = run_text(&args);
    assert!(ok, "{err}");
    assert!(out.contains("wrote"), "{out}");
    let recipe = tankwright::recipe::store::load(&file).expect("opens");
    assert_eq!(recipe.name, "Shed coil");
    assert_eq!(recipe.target.channel, 98.3e6);
    assert_eq!(recipe.tank.fixed, 18e-12);
    assert_eq!(recipe.stray_estimate.construction.key(), "stripboard");

    let mut by_flags = vec!["evaluate", "--json", "--trimmer-pct", "50"];
    by_flags.extend(FLAGS);
    let (ok, flags_out, err) = run_text(&by_flags);
    assert!(ok, "{err}");
    let (ok, recipe_out, err) = run_text(&["evaluate", "--recipe", path, "--json"]);
    assert!(ok, "{err}");
    assert_eq!(resonance(&flags_out), resonance(&recipe_out));

    // Never over an existing file without --replace; the file is kept.
    let before = std::fs::read(&file).expect("read");
    let (ok, _, err) = run_text(&args);
    assert!(!ok && err.contains("exists: nothing written"), "{err}");
    assert_eq!(std::fs::read(&file).expect("read"), before);
    args[5] = "Shed coil, rewound";
    args.push("--replace");
    let (ok, _, err) = run_text(&args);
    assert!(ok, "{err}");
    let recipe = tankwright::recipe::store::load(&file).expect("opens");
    assert_eq!(recipe.name, "Shed coil, rewound");
}

#[test]
fn a_new_recipe_without_a_target_or_with_bad_flags_writes_nothing() {
    let dir = tempfile::tempdir().expect("temp dir");
    let file = dir.path().join("shed.ron");
    let path = file.to_str().expect("utf-8");
    let mut args = vec!["new", path];
    args.extend(FLAGS);
    let (ok, _, err) = run_text(&args);
    assert!(!ok && err.contains("--target-mhz"), "{err}");
    let mut args = vec!["new", path, "--target-mhz", "98.3", "--turns-typo", "3"];
    args.extend(FLAGS);
    let (ok, _, err) = run_text(&args);
    assert!(!ok && err.contains("--turns-typo"), "{err}");
    assert!(!file.exists());
}

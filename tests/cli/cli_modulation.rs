//! The headless `evaluate` with the stray estimate, a modulating junction and the drift
//! budget, run as a user would run it.

use crate::common::{JUNCTION_COIL, run_text as run};

fn json(extra: &[&str]) -> serde_json::Value {
    let mut args: Vec<&str> = JUNCTION_COIL.to_vec();
    args.extend_from_slice(extra);
    let (ok, out, err) = run(&args);
    assert!(ok, "{err}");
    serde_json::from_str(&out).expect("one JSON object")
}

fn num(v: &serde_json::Value, path: &[&str]) -> f64 {
    let mut x = v;
    for p in path {
        x = &x[*p];
    }
    x.as_f64()
        .unwrap_or_else(|| panic!("{path:?} is not a number in {v}"))
}

const JUNCTION: [&str; 10] = [
    "--junction-cj0-pf",
    "2.2",
    "--junction-vj",
    "0.65",
    "--junction-m",
    "0.4",
    "--bias-v",
    "4",
    "--audio-peak-v",
    "0.3",
];

#[test]
fn breakdown_and_range_are_in_the_json() {
    let v = json(&["--stray-pf", "3"]);
    let parts = v["stray_breakdown_pf"]
        .as_object()
        .expect("breakdown object");
    let mut sum = 0.0;
    for (k, p) in parts {
        let (lo, typ, hi) = (num(p, &["low"]), num(p, &["typical"]), num(p, &["high"]));
        assert!(lo <= typ && typ <= hi, "{k}");
        if k != "total" {
            sum += typ;
        }
    }
    assert!((sum - num(&v, &["stray_breakdown_pf", "total", "typical"])).abs() < 1e-9);
    assert_eq!(
        num(&v, &["stray_breakdown_pf", "entered_stray", "typical"]),
        3.0
    );
    assert_eq!(
        num(&v, &["stray_breakdown_pf", "fixed_capacitor", "high"]),
        22.0 * 1.05
    );
    // Without a construction the typical estimate is the tank as given: the range holds the
    // resonance.
    // (The range is the classical model's spread, so it holds the classical resonance.)
    let f = num(&v, &["resonance_mhz_classical"]);
    assert!(
        num(&v, &["resonance_range_mhz", "low"]) < f
            && f < num(&v, &["resonance_range_mhz", "high"])
    );
    assert!(v["modulation"].is_null());

    // A construction adds its parts and pulls the window down.
    let w = json(&["--stray-pf", "3", "--construction", "breadboard"]);
    assert_eq!(
        num(&w, &["stray_breakdown_pf", "neighbour_strips", "typical"]),
        4.0
    );
    assert!(num(&w, &["resonance_range_mhz", "high"]) < num(&v, &["resonance_range_mhz", "high"]));
}

/// With a junction the resonance includes it at the bias, and the modulation block carries
/// the keys; the pasted `.model` line and the three numbers give the same figures.
#[test]
fn modulation_block_from_numbers_or_model_line() {
    let plain = json(&[]);
    let v = json(&JUNCTION);
    let m = &v["modulation"];
    for key in [
        "junction_pf",
        "deviation_up_khz",
        "deviation_down_khz",
        "sensitivity_khz_per_v",
        "distortion_pct",
        "carson_bandwidth_khz",
    ] {
        assert!(m[key].is_number(), "missing {key}");
    }
    // Cj = 2.2/(1 + 4/0.65)^0.4 pF.
    let cj = 2.2 / (1.0f64 + 4.0 / 0.65).powf(0.4);
    assert!((num(m, &["junction_pf"]) - cj).abs() < 1e-12);
    assert!(num(&v, &["resonance_mhz"]) < num(&plain, &["resonance_mhz"]));
    // The modulation block works on the model that leads (moved onto the field solution):
    // its carrier is the resonance reported, and the classical model moves the same way.
    assert!(num(&v, &["resonance_mhz_classical"]) < num(&plain, &["resonance_mhz_classical"]));
    assert!((num(m, &["carrier_mhz"]) - num(&v, &["resonance_mhz"])).abs() < 1e-9);
    let up = num(m, &["deviation_up_khz"]);
    let down = num(m, &["deviation_down_khz"]);
    assert!(up > 0.0 && down > up);
    assert!((num(m, &["sensitivity_khz_per_v"]) - (up + down) / 0.6).abs() < 1e-9);
    assert!((num(m, &["carson_bandwidth_khz"]) - 2.0 * (down + 15.0)).abs() < 1e-9);

    let model = json(&[
        "--junction-model",
        ".model Q1 NPN(IS=1f BF=120\n+ CJC=2.2p VJC=0.65 MJC=0.4)",
        "--bias-v",
        "4",
        "--audio-peak-v",
        "0.3",
    ]);
    let mm = &model["modulation"];
    assert_eq!(mm["deviation_up_khz"], m["deviation_up_khz"]);
    assert_eq!(
        mm["model_parameters_ignored"],
        serde_json::json!(["IS", "BF"])
    );

    // Through a coupling capacitor the swing is smaller.
    let mut coupled: Vec<&str> = JUNCTION.to_vec();
    coupled.extend_from_slice(&["--coupling-pf", "2.2"]);
    let c = json(&coupled);
    assert!(num(&c["modulation"], &["deviation_up_khz"]) < up);
}

#[test]
fn drift_lines_and_class() {
    let v = json(&JUNCTION);
    let lines = v["drift"].as_array().expect("drift list");
    let sources: Vec<&str> = lines
        .iter()
        .map(|l| l["source"].as_str().expect("source"))
        .collect();
    assert_eq!(
        sources,
        [
            "supply",
            "coil_expansion",
            "fixed_capacitor_temperature",
            "junction_temperature",
            "hand",
            "load"
        ]
    );
    for l in lines {
        assert!(l["change"].is_string() && l["shift_khz"].is_number());
    }
    // C0G/NP0 is 0 ± 30 ppm/K (EIA-198 / IEC 60384-8): the budget books the worse end, so
    // its line is not zero (issue 21); the engine's own check of the size is in
    // tests/engine/reference_stray.rs.
    let c0g = num(&lines[2], &["shift_khz"]);
    assert!(c0g != 0.0 && c0g.is_finite(), "{c0g}");
    let mut n750: Vec<&str> = JUNCTION.to_vec();
    n750.extend_from_slice(&["--capacitor-class", "N750"]);
    let w = json(&n750);
    assert!(num(&w["drift"][2], &["shift_khz"]) > 0.0);
    assert_ne!(
        num(&w, &["drift_total_khz", "sum"]),
        num(&v, &["drift_total_khz", "sum"])
    );
}

#[test]
fn bad_flags_are_refused_in_words() {
    let with = |extra: &[&str]| {
        let mut args: Vec<&str> = JUNCTION_COIL.to_vec();
        args.extend_from_slice(extra);
        run(&args)
    };
    for (extra, says) in [
        (vec!["--bias-v", "3"], "need a junction"),
        (vec!["--junction-cj0-pf", "2"], "all three"),
        (
            vec![
                "--junction-cj0-pf",
                "2",
                "--junction-vj",
                "0.7",
                "--junction-m",
                "0.5",
            ],
            "--bias-v",
        ),
        (
            vec!["--junction-model", ".model X R(R=1)", "--bias-v", "3"],
            "type R",
        ),
        (vec!["--construction", "veroboard"], "not one of"),
        (vec!["--capacitor-class", "X7R"], "not one of"),
        (
            vec![
                "--junction-cj0-pf",
                "2",
                "--junction-vj",
                "0.7",
                "--junction-m",
                "0.5",
                "--bias-v",
                "-1",
            ],
            "reverse-biased",
        ),
    ] {
        let (ok, _, err) = with(&extra);
        assert!(!ok, "{extra:?} accepted");
        assert!(err.contains(says), "{extra:?}: {err}");
    }
}

#[test]
fn the_report_shows_the_new_sections() {
    let mut args: Vec<&str> = JUNCTION_COIL[..13].to_vec();
    args.extend_from_slice(&JUNCTION);
    args.extend_from_slice(&["--construction", "copper-clad"]);
    let (ok, out, err) = run(&args);
    assert!(ok, "{err}");
    for s in [
        "Tank capacitance by part",
        "coil to ground plane",
        "Modulation",
        "Drift",
        "resonance range",
    ] {
        assert!(out.contains(s), "missing {s}");
    }
}

/// Issue 20: `--construction` with `--stray-pf` added the stray twice in the estimate (the
/// layout's wiring and the entered figure for the same wiring). With a construction the
/// layout builds the stray and the entered figure is left out of the estimate, so its total
/// is the same with or without `--stray-pf`; without a construction the entered figure is
/// the estimate's own part.
#[test]
fn a_construction_and_an_entered_stray_are_not_added_twice() {
    let total = |extra: &[&str]| -> (f64, f64) {
        let mut args = vec![
            "evaluate",
            "--former-diameter-mm",
            "6",
            "--turns",
            "5",
            "--length-mm",
            "8",
            "--wire-mm",
            "1",
            "--capacitance-pf",
            "18",
            "--json",
        ];
        args.extend(extra);
        let (ok, out, err) = crate::common::run_text(&args);
        assert!(ok, "{err}");
        let v: serde_json::Value = serde_json::from_str(&out).expect("JSON");
        let b = &v["stray_breakdown_pf"];
        (
            b["total"]["typical"].as_f64().expect("total"),
            b["entered_stray"]["typical"].as_f64().expect("entered"),
        )
    };
    let (layout, _) = total(&["--construction", "stripboard"]);
    let (both, entered) = total(&["--construction", "stripboard", "--stray-pf", "6"]);
    assert_eq!(layout, both, "the entered stray was added to the layout's");
    assert_eq!(entered, 0.0);
    let (plain, entered) = total(&["--stray-pf", "6"]);
    assert_eq!(entered, 6.0);
    assert!(plain > 6.0, "{plain}");
}

/// Issue 19: the drift was judged against 50 kHz on the command line and against the
/// channel's tolerance in the window. One rule now: the channel's own tolerance (the
/// recipe's, or the practice of the service the target or the carrier is in, the verdict's
/// `Aim`), unless `--channel-tolerance-khz` is given.
#[test]
fn the_drift_is_judged_against_the_channels_own_tolerance() {
    use tankwright::tuning::verdict::Aim;
    let khz = |args: &[&str]| -> f64 {
        let (ok, out, err) = crate::common::run_text(args);
        assert!(ok, "{err}");
        let v: serde_json::Value = serde_json::from_str(&out).expect("JSON");
        v["drift_total_khz"]["channel_tolerance"]
            .as_f64()
            .unwrap_or_else(|| panic!("no tolerance in {out}"))
    };
    let file = crate::common::asset("lantern_hill_bench_oscillator.ron");
    let recipe = tankwright::recipe::store::load(&file).expect("opens");
    let path = file.to_str().expect("utf-8");
    assert_eq!(
        khz(&["evaluate", "--recipe", path, "--json"]),
        recipe.target.tolerance() / 1e3
    );
    let coil = [
        "evaluate",
        "--former-diameter-mm",
        "6",
        "--turns",
        "5",
        "--length-mm",
        "8",
        "--wire-mm",
        "1",
        "--capacitance-pf",
        "24",
        "--json",
    ];
    let fm = Aim::typed(98.3e6).tolerance / 1e3;
    let mut with_target = coil.to_vec();
    with_target.extend(["--target-mhz", "98.3"]);
    assert_eq!(khz(&with_target), fm);
    // No target: the service whose band holds the carrier (this tank sits in FM broadcast).
    assert_eq!(khz(&coil), fm);
    let mut given = coil.to_vec();
    given.extend(["--channel-tolerance-khz", "50"]);
    assert_eq!(khz(&given), 50.0);
}

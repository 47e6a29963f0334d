//! `tankwright stage`: the oscillator stage round a recipe's tank, run as a user runs it.
//! The figures are the engine's (`tuning::stage` on `recipe::figures`' tank: the one model),
//! whose outside references are in tests/engine/reference_stage.rs (ngspice, the
//! tapped-capacitor hand calculation); here the command's contract: the JSON keys, the same
//! figures as the engine, the transistor either way, every mistake refused with its range and
//! a failure code, nothing on standard output.

use crate::common::{asset_str, run_text};
use tankwright::tuning::stage::{Bias, StageInputs, Topology, Transistor, stage};

const RECIPE: &str = "lantern_hill_bench_oscillator.ron";
const MODEL: &str = ".model LHQ NPN(IS=2e-15 BF=90 CJE=1.6p CJC=0.8p TF=180p VAF=60)";

fn base_args(recipe: &str) -> Vec<String> {
    [
        "stage",
        "--recipe",
        recipe,
        "--supply-v",
        "9",
        "--bias-upper-ohm",
        "10000",
        "--bias-lower-ohm",
        "10000",
        "--emitter-ohm",
        "47000",
    ]
    .map(str::to_owned)
    .to_vec()
}

fn run(args: &[String]) -> (bool, String, String) {
    let a: Vec<&str> = args.iter().map(String::as_str).collect();
    run_text(&a)
}

/// The JSON carries the keys the issue names, and each figure is the engine's for the same
/// recipe and inputs (the window and the command line call the same functions).
#[test]
fn json_keys_and_figures_are_the_engines() {
    let recipe = asset_str(RECIPE);
    let mut args = base_args(&recipe);
    args.extend(
        [
            "--transistor-model",
            MODEL,
            "--battery-mah",
            "500",
            "--json",
        ]
        .map(str::to_owned),
    );
    let (ok, out, err) = run(&args);
    assert!(ok, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).expect("JSON");
    for key in [
        "starts",
        "loop_gain",
        "start_margin",
        "collector_ma",
        "collector_emitter_v",
        "frequency_mhz",
        "pulling_khz",
        "supply_ma",
        "advice",
    ] {
        assert!(v.get(key).is_some(), "no {key} in {out}");
    }
    let loaded = tankwright::recipe::store::load(std::path::Path::new(&recipe)).expect("loads");
    let f = tankwright::recipe::figures(&loaded).expect("figures");
    let inputs = StageInputs {
        topology: Topology::CommonBase,
        bias: Bias {
            supply_v: 9.0,
            upper: 10e3,
            lower: 10e3,
            emitter: 47e3,
        },
        transistor: Transistor::from_model(MODEL).expect("model"),
        battery_charge: Some(500.0 * 3.6),
        clapp: None,
    };
    let s = stage(&f.coil, &f.tank, &f.conditions, &inputs).expect("stage");
    let num = |k: &str| v[k].as_f64().unwrap_or_else(|| panic!("{k} not a number"));
    // serde_json reads a float back within an ulp or two (no `float_roundtrip` feature).
    let same = |k: &str, engine: f64| {
        let json = num(k);
        assert!(
            (json - engine).abs() <= 1e-14 * engine.abs(),
            "{k}: JSON {json}, engine {engine}"
        );
    };
    assert_eq!(v["starts"].as_bool(), Some(s.starts()));
    same("loop_gain", s.loop_gain);
    same("start_margin", s.start_margin);
    same("collector_ma", s.operating_point.collector_current * 1e3);
    same("collector_emitter_v", s.operating_point.collector_emitter_v);
    same("frequency_mhz", s.frequency * 1e-6);
    same("pulling_khz", s.pulling * 1e-3);
    same("supply_ma", s.supply_current * 1e3);
    assert_eq!(v["advice"].as_str(), Some(s.advice.as_str()));
    // The tank alone is the recipe's own resonance, as every other command states it.
    assert!((num("tank_frequency_mhz") - f.analysis.resonance * 1e-6).abs() < 1e-9);
    // 500 mAh at the supply current (the battery's capacity over the current).
    assert!((num("battery_hours") - 500.0 / num("supply_ma")).abs() < 1e-9);
    assert_eq!(v["unused_model_parameters"][0].as_str(), Some("VAF"));
}

/// The transistor from its four figures, the common-collector topology, and the text report
/// with its advice and the licence caution.
#[test]
fn text_report_from_the_four_figures() {
    let recipe = asset_str(RECIPE);
    let mut args = base_args(&recipe);
    args.extend(
        [
            "--hfe",
            "80",
            "--cbe-pf",
            "2",
            "--cbc-pf",
            "0.8",
            "--ft-mhz",
            "800",
            "--topology",
            "common-collector",
        ]
        .map(str::to_owned),
    );
    let (ok, out, err) = run(&args);
    assert!(ok, "{err}");
    assert!(out.contains("common-collector Colpitts"), "{out}");
    assert!(out.contains("loop gain"), "{out}");
    assert!(out.contains("Advice: "), "{out}");
    assert!(out.contains("needs a licence"), "{out}");
}

/// Every mistake is refused in words, with the accepted range where there is one, a failure
/// code and nothing on standard output.
#[test]
fn mistakes_are_refused_with_the_range() {
    let recipe = asset_str(RECIPE);
    let no_divider = asset_str("apprentice_enamel_exercise.ron");
    let figures = [
        "--hfe", "80", "--cbe-pf", "2", "--cbc-pf", "0.8", "--ft-mhz", "800",
    ];
    let with = |r: &str, extra: &[&str]| {
        let mut a = base_args(r);
        a.extend(extra.iter().map(|s| (*s).to_owned()));
        a
    };
    let mut cases: Vec<(Vec<String>, &str)> = vec![
        (with(&recipe, &[]), "the transistor is needed"),
        (with(&recipe, &figures[..6]), "the transistor is needed"),
        (
            with(
                &recipe,
                &[&figures[..], &["--transistor-model", MODEL]].concat(),
            ),
            "not both",
        ),
        (
            with(&recipe, &["--transistor-model", ".model Q PNP(CJC=1p)"]),
            "NPN",
        ),
        (
            with(
                &recipe,
                &[&figures[..], &["--topology", "common-emitter"]].concat(),
            ),
            "common-base or common-collector",
        ),
        (
            with(&recipe, &[&figures[..], &["--battery-mah", "0"]].concat()),
            "1–1000000 mAh",
        ),
        (
            with(&recipe, &[&figures[..], &["--frequency", "1"]].concat()),
            "unknown flag",
        ),
        (with(&no_divider, &figures), "no feedback divider"),
    ];
    for (flag, bad, range) in [
        ("--supply-v", "60", "0.5–30 V"),
        ("--supply-v", "NaN", "expects a number"),
        ("--emitter-ohm", "inf", "expects a number"),
        ("--emitter-ohm", "0", "1–10000000 ohm"),
        ("--bias-lower-ohm", "-5", "1–10000000 ohm"),
    ] {
        let mut a = with(&recipe, &figures);
        let i = a.iter().position(|w| w == flag).expect("flag present");
        a[i + 1] = bad.to_owned();
        cases.push((a, range));
    }
    for (flag, bad, range) in [
        ("--hfe", "1", "5–2000"),
        ("--ft-mhz", "1e9", "10–100000 MHz"),
        ("--cbc-pf", "-1", "0–100 pF"),
    ] {
        let mut a = with(&recipe, &figures);
        let i = a.iter().position(|w| w == flag).expect("flag present");
        a[i + 1] = bad.to_owned();
        cases.push((a, range));
    }
    for (args, words) in cases {
        let (ok, out, err) = run(&args);
        assert!(!ok, "accepted: {args:?}");
        assert!(out.is_empty(), "printed for {args:?}: {out}");
        assert!(err.contains(words), "{args:?}: '{err}' lacks '{words}'");
    }
}

/// The usage text names the command.
#[test]
fn help_names_the_stage_command() {
    let (ok, out, _) = run_text(&["help"]);
    assert!(ok);
    assert!(
        out.contains("tankwright stage --recipe FILE --supply-v V"),
        "{out}"
    );
}

/// The demo recipe with a stage kept in it (the window's stage panel, or a hand edit, puts it
/// there), written to `dir`.
fn recipe_with_stage(dir: &std::path::Path) -> (String, tankwright::recipe::Recipe) {
    use tankwright::tuning::stage::{Ratings, StageSettings, TransistorSpec};
    let mut r =
        tankwright::recipe::store::load(std::path::Path::new(&asset_str(RECIPE))).expect("loads");
    r.stage = Some(StageSettings {
        topology: Topology::CommonBase,
        bias: Bias {
            supply_v: 9.0,
            upper: 10e3,
            lower: 10e3,
            emitter: 47e3,
        },
        transistor: TransistorSpec::Model(MODEL.to_owned()),
        ratings: Ratings::default(),
        battery_charge: Some(500.0 * 3.6),
        clapp: None,
    });
    let path = dir.join("with_stage.ron");
    tankwright::recipe::store::save(&path, &r).expect("saves");
    (path.to_str().expect("utf-8").to_owned(), r)
}

/// `stage --recipe R` with no stage flags takes the stage kept in the recipe: the same output
/// as the same settings given as flags; a flag given replaces its setting alone.
#[test]
fn the_recipes_stage_is_used_when_no_flags_are_given_and_flags_override_it() {
    let dir = tempfile::tempdir().expect("temporary directory");
    let (path, recipe) = recipe_with_stage(dir.path());
    let (ok, kept, err) = run_text(&["stage", "--recipe", &path, "--json"]);
    assert!(ok, "{err}");
    let mut flags = base_args(&path);
    flags.extend(
        [
            "--transistor-model",
            MODEL,
            "--battery-mah",
            "500",
            "--json",
        ]
        .map(str::to_owned),
    );
    let (ok, given, err) = run(&flags);
    assert!(ok, "{err}");
    assert_eq!(
        kept, given,
        "the kept stage and the same flags give the same figures"
    );

    // One flag over the kept stage: the emitter resistor alone changes.
    let (ok, out, err) = run_text(&[
        "stage",
        "--recipe",
        &path,
        "--emitter-ohm",
        "4700",
        "--json",
    ]);
    assert!(ok, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).expect("JSON");
    let f = tankwright::recipe::figures(&recipe).expect("figures");
    let mut settings = recipe.stage.clone().expect("kept");
    settings.bias.emitter = 4700.0;
    let s = stage(
        &f.coil,
        &f.tank,
        &f.conditions,
        &settings.inputs().expect("inputs"),
    )
    .expect("stage");
    let json = v["collector_ma"].as_f64().expect("a number");
    let engine = s.operating_point.collector_current * 1e3;
    assert!(
        (json - engine).abs() <= 1e-14 * engine,
        "{json} against {engine}"
    );
    assert_eq!(v["loop_gain"].as_f64(), Some(s.loop_gain));

    // A Clapp capacitor needs the common-collector stage; with it, it is used.
    let (ok, out, err) = run_text(&["stage", "--recipe", &path, "--clapp-pf", "10"]);
    assert!(!ok && out.is_empty(), "{out}");
    assert!(err.contains("common-collector"), "{err}");
    let (ok, _, err) = run_text(&[
        "stage",
        "--recipe",
        &path,
        "--topology",
        "common-collector",
        "--clapp-pf",
        "0.2",
    ]);
    assert!(!ok && err.contains("0.5–1000 pF"), "{err}");
}

//! The oscillator stage kept in the recipe file (issue 25): an optional section, so files
//! written before it still read; saved and opened unchanged, with either transistor form and a
//! Clapp capacitor; each value out of the range the stage's analysis accepts refused at the
//! load, naming the field and the range. The ranges are the stage's own
//! (`tuning::stage::settings`); the stage's figures are checked against ngspice in
//! tests/engine/reference_stage.rs.

use tankwright::recipe::{Recipe, format, store};
use tankwright::tuning::stage::{Bias, Ratings, StageSettings, Topology, TransistorSpec};

fn with_figures() -> Recipe {
    Recipe {
        stage: Some(StageSettings {
            topology: Topology::CommonBase,
            bias: Bias {
                supply_v: 9.0,
                upper: 12e3,
                lower: 8.2e3,
                emitter: 47e3,
            },
            transistor: TransistorSpec::Figures {
                hfe: 80.0,
                cbe: 2.2e-12,
                cbc: 0.8e-12,
                ft: 800e6,
            },
            ratings: Ratings {
                collector_emitter_max: Some(15.0),
                collector_max: Some(25e-3),
                dissipation_max: Some(225e-3),
            },
            battery_charge: Some(500.0 * 3.6),
            clapp: None,
        }),
        ..Recipe::demo()
    }
}

fn with_model_and_clapp() -> Recipe {
    Recipe {
        stage: Some(StageSettings {
            topology: Topology::CommonCollector,
            bias: Bias {
                supply_v: 6.0,
                upper: 22e3,
                lower: 22e3,
                emitter: 1e3,
            },
            transistor: TransistorSpec::Model(
                ".model LHQ NPN(IS=2e-15 BF=90 CJE=1.6p CJC=0.8p TF=180p VAF=60)".to_owned(),
            ),
            ratings: Ratings::default(),
            battery_charge: None,
            clapp: Some(6.8e-12),
        }),
        ..Recipe::demo()
    }
}

#[test]
fn a_kept_stage_survives_saving_and_opening() {
    let dir = tempfile::tempdir().expect("temporary directory");
    for (k, r) in [with_figures(), with_model_and_clapp()]
        .into_iter()
        .enumerate()
    {
        let path = dir.path().join(format!("stage{k}.ron"));
        store::save(&path, &r).expect("saves");
        assert_eq!(store::load(&path).expect("opens"), r);
        let first = std::fs::read_to_string(&path).expect("text");
        store::save(&path, &store::load(&path).expect("opens")).expect("saves again");
        assert_eq!(std::fs::read_to_string(&path).expect("text"), first);
    }
    // Units in the names, as the rest of the file.
    let text = format::to_text(&with_figures());
    for needle in [
        "supply_v: 9.0",
        "emitter_ohm: 47000.0",
        "cbc_pf: 0.8",
        "ft_mhz: 800.0",
    ] {
        assert!(text.contains(needle), "missing {needle} in\n{text}");
    }
    assert!(format::to_text(&with_model_and_clapp()).contains("clapp_pf: Some(6.8)"));
}

#[test]
fn a_file_without_a_stage_reads_as_before() {
    let text = format::to_text(&Recipe::demo());
    assert!(
        !text.contains("stage:"),
        "no stage is written while none is set"
    );
    assert_eq!(format::from_text(&text).expect("reads").stage, None);
}

/// Each value beyond the stage's accepted range is refused by the loader with the field and
/// the range, and so is a Clapp capacitor outside the common-collector stage and a `.model`
/// line the stage's reader refuses.
#[test]
fn a_stage_value_out_of_range_is_refused_at_the_load_with_the_range() {
    let good = format::to_text(&with_figures());
    assert!(format::from_text(&good).is_ok());
    let cases = [
        (
            "emitter_ohm: 47000.0",
            "emitter_ohm: 0.5",
            "stage.emitter_ohm",
            "1–10000000 ohm",
        ),
        (
            "supply_v: 9.0",
            "supply_v: 45.0",
            "stage.supply_v",
            "0.5–30 V",
        ),
        ("hfe: 80.0", "hfe: 2.0", "stage.hfe", "5–2000"),
        ("cbc_pf: 0.8", "cbc_pf: 250.0", "stage.cbc_pf", "0–100 pF"),
        (
            "ft_mhz: 800.0",
            "ft_mhz: 1.0",
            "stage.ft_mhz",
            "10–100000 MHz",
        ),
    ];
    for (from, to, field, range) in cases {
        assert!(good.contains(from), "{from} not in the text");
        let err = format::from_text(&good.replacen(from, to, 1)).expect_err("refused");
        assert_eq!(err.field.as_deref(), Some(field), "{err}");
        assert!(err.reason.contains(range), "{to}: {err}");
        assert!(err.position.is_some(), "{to}: the line is named: {err}");
    }
    let clapp = format::to_text(&with_model_and_clapp());
    let err =
        format::from_text(&clapp.replacen("topology: CommonCollector", "topology: CommonBase", 1))
            .expect_err("a Clapp capacitor in the common-base stage is refused");
    assert_eq!(err.field.as_deref(), Some("stage.clapp_pf"), "{err}");
    let err = format::from_text(&clapp.replacen("clapp_pf: Some(6.8)", "clapp_pf: Some(0.1)", 1))
        .expect_err("refused");
    assert!(err.reason.contains("0.5–1000 pF"), "{err}");
    let err = format::from_text(&clapp.replacen("LHQ NPN(", "LHQ PNP(", 1)).expect_err("refused");
    assert_eq!(err.field.as_deref(), Some("stage.transistor"), "{err}");
}

/// The audio panel's settings kept in the file (issue 19): absent while they are the usual
/// ones (older files read as before), written in display units when set, read back
/// unchanged, and refused at the load with the range when out of it. The ranges are the
/// audio panel's own (`tuning::audio`); the modulation's figures are checked against ngspice
/// in tests/engine/reference_junction.rs.
#[test]
fn the_audio_settings_are_kept_in_the_file_and_judged() {
    use tankwright::tuning::audio::AudioSettings;
    let usual = format::to_text(&Recipe::demo());
    assert!(!usual.contains("audio:"), "not written while usual");
    assert_eq!(
        format::from_text(&usual).expect("reads").audio,
        AudioSettings::default()
    );
    let mut r = Recipe::demo();
    r.audio.junction.cj0 = 5.6e-12;
    r.audio.bias_v = 3.0;
    r.audio.audio_max = Some(3e3);
    r.audio.coupling = 10e-12;
    r.audio.hand = 2e-12;
    r.audio.in_tank = true;
    r.audio.fixed_class = tankwright::physics::dielectric_class::by_name("N750").expect("class");
    let dir = tempfile::tempdir().expect("temporary directory");
    let path = dir.path().join("audio.ron");
    store::save(&path, &r).expect("saves");
    assert_eq!(store::load(&path).expect("opens"), r);
    let text = std::fs::read_to_string(&path).expect("text");
    for needle in [
        "junction_cj0_pf: 5.6",
        "reverse_bias_v: 3.0",
        "audio_max_khz: Some(3.0)",
        "coupling_pf: 10.0",
        "hand_pf: 2.0",
        "junction_in_tank: true",
    ] {
        assert!(text.contains(needle), "missing {needle} in\n{text}");
    }
    let cases = [
        (
            "reverse_bias_v: 3.0",
            "reverse_bias_v: 40.0",
            "audio.reverse_bias_v",
            "0–30 V",
        ),
        (
            "junction_cj0_pf: 5.6",
            "junction_cj0_pf: 0.01",
            "audio.junction_cj0_pf",
            "0.1–1000 pF",
        ),
        ("hand_pf: 2.0", "hand_pf: 11.0", "audio.hand_pf", "0–10 pF"),
    ];
    for (from, to, field, range) in cases {
        let err = format::from_text(&text.replacen(from, to, 1)).expect_err("refused");
        assert_eq!(err.field.as_deref(), Some(field), "{err}");
        assert!(err.reason.contains(range), "{to}: {err}");
    }
    let err = format::from_text(&text.replacen("fixed_class: \"", "fixed_class: \"X9", 1))
        .expect_err("an unknown class is refused");
    assert_eq!(err.field.as_deref(), Some("audio.fixed_class"), "{err}");
    assert!(err.reason.contains("C0G"), "{err}");
}

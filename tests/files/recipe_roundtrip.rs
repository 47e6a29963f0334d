//! Recipes survive saving and opening unchanged; every demo asset opens and validates.

use proptest::prelude::*;
use std::path::Path;
use tankwright::model::{Coating, Gauge, InductanceModel, WireSpec, evaluate};
use tankwright::recipe::schema::{
    AimSheet, BuildingMethod, CoatingName, CoilMeasurementSheet, CoilSheet, ConditionsSheet,
    DiameterMm, DividerSheet, ModelName, PlanName, ReadingSheet, RecipeFile, Scaled, SpacingMm,
    StraySheet, TankSheet, WireSize,
};
use tankwright::recipe::{self, Recipe, demos, format, store};

fn demo_with_log() -> Recipe {
    let mut r = Recipe::demo();
    r.bench_log.push(recipe::BenchEntry {
        include_anyway: false,
        measured: 99.134e6,
        length: 8.0e-3,
        trimmer_setting: 0.5,
        added_capacitance: 4.7e-12,
        instrument: "bench counter".to_owned(),
        error_ppm: Some(2.5),
        note: "first light, \"quoted\"# and r#\"raw\"##, a \\ backslash\nsecond line".to_owned(),
        added_tolerance: None,
    });
    r
}

#[test]
fn save_then_load_gives_the_same_recipe() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("bench.ron");
    let r = demo_with_log();
    store::save(&path, &r).unwrap();
    assert_eq!(store::load(&path).unwrap(), r);
    // Saving what was loaded writes the same bytes.
    let first = std::fs::read_to_string(&path).unwrap();
    store::save(&path, &store::load(&path).unwrap()).unwrap();
    assert_eq!(std::fs::read_to_string(&path).unwrap(), first);
}

#[test]
fn the_text_is_readable_with_units_in_the_names() {
    let text = format::to_text(&Recipe::demo());
    assert!(text.starts_with("// Tankwright coil recipe"));
    for needle in [
        "TankwrightRecipe(",
        "schema: 1,",
        "diameter: FormerMm(6.0)",
        "wire: BareMm(1.0)",
        "spacing: LengthMm(8.0)",
        "fixed_pf: 6.8,",
        "trimmer_setting_percent: 50.0,",
        "channel_mhz: 98.7,",
    ] {
        assert!(text.contains(needle), "missing {needle} in\n{text}");
    }
}

#[test]
fn demo_equals_the_first_demo_asset() {
    let (file, first) = &demos()[0];
    assert_eq!(*file, "lantern_hill_bench_oscillator.ron");
    assert_eq!(*first, Recipe::demo());
}

#[test]
fn every_asset_recipe_loads_validates_and_is_listed() {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("assets/recipes");
    let mut count = 0;
    for entry in std::fs::read_dir(&dir).unwrap() {
        let path = entry.unwrap().path();
        if path.extension().is_none_or(|x| x != "ron") {
            continue;
        }
        count += 1;
        let r = store::load(&path).unwrap_or_else(|e| panic!("{e}"));
        evaluate(&r.winding, &r.tank, &r.conditions).unwrap();
        assert!(!r.name.is_empty(), "{} has no name", path.display());
        let name = path.file_name().unwrap().to_str().unwrap();
        let listed = recipe::demos::SOURCES
            .iter()
            .find(|(n, _)| *n == name)
            .unwrap_or_else(|| panic!("{name} is not compiled in"));
        assert_eq!(listed.1, std::fs::read_to_string(&path).unwrap());
        // The assets are in the form the program writes.
        assert_eq!(format::to_text(&r), listed.1, "{name} is not canonical");
    }
    assert_eq!(count, recipe::demos::SOURCES.len());
    assert_eq!(demos().len(), count);
}

#[test]
fn integers_and_omitted_fields_are_read_as_a_builder_would_write_them() {
    let text = r#"TankwrightRecipe(
        schema: 1,
        name: "Scribbled on the back of an envelope",
        coil: Winding(diameter: FormerMm(6), wire: Awg(18), turns: 5, spacing: GapMm(1)),
        tank: Tank(fixed_pf: 22),
        aim: Aim(plan: UsFm, channel_mhz: 100.1),
    )"#;
    let r = format::from_text(text).unwrap();
    assert_eq!(r.winding.turns, 5.0);
    assert_eq!(r.winding.lead_length, 0.0);
    assert_eq!(r.winding.wire.coating, Coating::Bare);
    assert_eq!(r.tank.fixed, 22e-12);
    assert_eq!(r.tank.feedback, None);
    assert_eq!(r.conditions, tankwright::model::Conditions::default());
    assert!(r.notes.is_empty() && r.bench_log.is_empty());
    // A file from before the on-channel tolerance: the plan's default (its service's
    // practice, ±15 kHz for FM broadcast: common practice, tuning/service.rs).
    assert_eq!(r.target.tolerance, None);
    assert_eq!(r.target.tolerance(), 15e3);
}

#[test]
fn the_on_channel_tolerance_is_read_written_and_judged() {
    let old = r#"TankwrightRecipe(
        schema: 1,
        name: "Club test channel",
        coil: Winding(diameter: FormerMm(6), wire: Awg(18), turns: 5, spacing: GapMm(1)),
        tank: Tank(fixed_pf: 22),
        aim: Aim(plan: UsFm, channel_mhz: 100.1),
    )"#;
    let with = old.replace(
        "channel_mhz: 100.1)",
        "channel_mhz: 100.1, on_channel_within_khz: Some(4.5))",
    );
    let r = format::from_text(&with).unwrap();
    assert_eq!(r.target.tolerance, Some(4.5e3));
    assert_eq!(r.target.tolerance(), 4.5e3);
    // Written back as typed, and read back to the same recipe.
    let text = format::to_text(&r);
    assert!(text.contains("on_channel_within_khz: Some(4.5)"), "{text}");
    assert_eq!(format::from_text(&text).unwrap(), r);
    // The default is not written: an old program reads the file the new one saves.
    let plain = format::to_text(&format::from_text(old).unwrap());
    assert!(!plain.contains("on_channel_within_khz"), "{plain}");
    // The verdict and the target figures use it.
    let f = recipe::figures(&r).unwrap();
    assert_eq!(f.verdict.tolerance, 4.5e3);
    assert_eq!(f.target.tolerance, 4.5e3);
    // Nonsense is refused, naming the field.
    for bad in ["0.0", "-3.0", "2000.0"] {
        let text = old.replace(
            "channel_mhz: 100.1)",
            &format!("channel_mhz: 100.1, on_channel_within_khz: Some({bad}))"),
        );
        let e = format::from_text(&text).unwrap_err();
        assert!(
            e.to_string().contains("on_channel_within_khz"),
            "{bad}: {e}"
        );
    }
}

fn overall(wire: WireSize, coating: CoatingName) -> Option<f64> {
    let spec = WireSpec {
        gauge: match wire {
            WireSize::BareMm(d) => Gauge::Metric(d.si()),
            WireSize::Awg(n) => Gauge::Awg(n),
            WireSize::Swg(n) => Gauge::Swg(n),
        },
        coating: match coating {
            CoatingName::Bare => Coating::Bare,
            CoatingName::EnamelGrade1 => Coating::EnamelGrade1,
            CoatingName::EnamelGrade2 => Coating::EnamelGrade2,
        },
    };
    spec.bare_diameter().map(|d| spec.overall_diameter(d) * 1e3)
}

/// Millimetres as written in the file.
fn mm(value: f64) -> tankwright::recipe::schema::Millimetres {
    Scaled::from_file_units(value)
}

/// Numbers as a builder types them: `digits` decimals.
fn typed(lo: f64, hi: f64, digits: i32) -> impl Strategy<Value = f64> {
    let scale = 10f64.powi(digits);
    ((lo * scale) as i64..=(hi * scale) as i64).prop_map(move |n| n as f64 / scale)
}

/// Any float in a range (values from sliders).
fn any_in(lo: f64, hi: f64) -> impl Strategy<Value = f64> {
    lo..hi
}

fn file_strategy(
    num: fn(f64, f64) -> BoxedStrategy<f64>,
    fix: fn(f64) -> f64,
) -> impl Strategy<Value = RecipeFile> {
    let wire = prop_oneof![
        num(0.1, 2.5).prop_map(|d| WireSize::BareMm(mm(d))),
        (10..=36i32).prop_map(WireSize::Awg),
        (10..=36i32).prop_map(WireSize::Swg),
    ];
    let coating = prop_oneof![
        Just(CoatingName::Bare),
        Just(CoatingName::EnamelGrade1),
        Just(CoatingName::EnamelGrade2)
    ];
    let diameter = prop_oneof![
        num(2.0, 30.0).prop_map(|d| DiameterMm::FormerMm(mm(d))),
        num(4.0, 40.0).prop_map(|d| DiameterMm::MeanMm(mm(d))),
    ];
    let coil = (
        diameter,
        wire,
        coating,
        num(1.0, 25.0),
        num(0.0, 3.0),
        any::<bool>(),
        num(1.0, 3.0),
        num(0.0, 30.0),
    )
        .prop_map(
            move |(diameter, wire, coating, turns, gap, as_length, factor, lead)| {
                let spacing = match overall(wire, coating) {
                    Some(o) if as_length => SpacingMm::LengthMm(mm(fix(turns * o * factor))),
                    _ => SpacingMm::GapMm(mm(gap)),
                };
                CoilSheet {
                    diameter,
                    wire,
                    coating,
                    turns,
                    spacing,
                    each_lead_mm: mm(lead),
                }
            },
        );
    let tank = (
        num(0.0, 100.0),
        num(0.0, 5.0),
        num(0.0, 30.0),
        num(0.0, 100.0),
        num(0.0, 10.0),
        proptest::option::of((num(1.0, 100.0), num(1.0, 100.0))),
    )
        .prop_map(move |(fixed, tmin, span, setting, stray, fb)| TankSheet {
            fixed_pf: Scaled::from_file_units(fixed),
            trimmer_min_pf: Scaled::from_file_units(tmin),
            trimmer_max_pf: Scaled::from_file_units(fix(tmin + span)),
            trimmer_setting_percent: Scaled::from_file_units(setting),
            stray_pf: Scaled::from_file_units(stray),
            feedback: fb.map(|(u, l)| DividerSheet {
                upper_pf: Scaled::from_file_units(u),
                lower_pf: Scaled::from_file_units(l),
            }),
        });
    let plan = prop_oneof![
        Just(PlanName::UsFm),
        Just(PlanName::Fm100kHz),
        Just(PlanName::TwoMetreRegion1),
        Just(PlanName::JapanFmWide),
        Just(PlanName::JapanFm),
        Just(PlanName::TwoMetreRegion2),
        Just(PlanName::TwoMetreRegion2Step20kHz),
        Just(PlanName::TwoMetreRegion3),
        proptest::collection::vec(num(30.0, 500.0), 1..5).prop_map(|list| PlanName::OwnList {
            channels_mhz: list.into_iter().map(Scaled::from_file_units).collect(),
        }),
    ];
    let model = proptest::sample::select(InductanceModel::ALL.to_vec()).prop_map(ModelName);
    let method = prop_oneof![
        Just(BuildingMethod::CopperClad),
        Just(BuildingMethod::GroundPlaneBoard),
        Just(BuildingMethod::Stripboard),
        Just(BuildingMethod::Perfboard),
        Just(BuildingMethod::Breadboard),
    ];
    let stray_estimate = (
        method,
        num(0.0, 20.0),
        num(0.0, 1.0),
        num(0.0, 1.0),
        num(0.0, 0.1),
        num(0.0, 1.0),
    )
        .prop_map(|(m, cap, former, length, wire, turns)| StraySheet {
            building_method: m,
            capacitor_tolerance_percent: Scaled::from_file_units(cap),
            former_tolerance_mm: mm(former),
            length_tolerance_mm: mm(length),
            wire_tolerance_mm: mm(wire),
            turns_tolerance: turns,
        });
    let reading = (
        num(30.0, 500.0),
        num(0.5, 100.0),
        num(0.0, 100.0),
        "[a-z ]{0,12}",
        proptest::option::of(num(0.0, 50.0)),
        "\\PC{0,20}",
        prop_oneof![Just(0.0), num(0.1, 100.0)],
        proptest::option::of(num(0.0, 50.0)),
        any::<bool>(),
    )
        .prop_map(
            |(f, l, s, instrument, ppm, note, added, tolerance, include_anyway)| ReadingSheet {
                include_anyway,
                measured_mhz: Scaled::from_file_units(f),
                coil_length_mm: Scaled::from_file_units(l),
                trimmer_percent: Scaled::from_file_units(s),
                added_pf: Scaled::from_file_units(added),
                added_tolerance_percent: tolerance.map(Scaled::from_file_units),
                instrument,
                error_ppm: ppm,
                note,
            },
        );
    (
        "\\PC{0,30}",
        "\\PC{0,60}",
        coil,
        tank,
        (num(-20.0, 80.0), model, any::<bool>()),
        plan,
        (
            num(30.0, 500.0),
            proptest::option::of(num(0.1, 1000.0)),
            stray_estimate,
        ),
        proptest::collection::vec(reading, 0..4),
        proptest::option::of((
            (num(1.0, 100.0), num(100.0, 500.0)),
            num(10.0, 900.0),
            num(0.05, 3.0),
            num(0.001, 5.0),
            num(10.0, 1000.0),
            num(0.0, 20.0),
            3usize..200,
            proptest::option::of(num(100.0, 3000.0)),
        )),
    )
        .prop_map(
            |(
                name,
                notes,
                coil,
                tank,
                (t, m, fs),
                plan,
                (channel, within, stray_estimate),
                bench_log,
                measurement,
            )| {
                let coil_measurement =
                    measurement.map(|((lo, hi), l, c, r, q, residual, used, crossing)| {
                        CoilMeasurementSheet {
                            source: "bench.s1p".to_owned(),
                            coil: coil.clone(),
                            lowest_mhz: Scaled::from_file_units(lo),
                            highest_mhz: Scaled::from_file_units(hi),
                            inductance_nh: Scaled::from_file_units(l),
                            self_capacitance_pf: Scaled::from_file_units(c),
                            series_resistance_ohm: r,
                            stated_at_mhz: Scaled::from_file_units(lo),
                            q,
                            reactance_crosses_zero_mhz: crossing.map(Scaled::from_file_units),
                            residual_percent: Scaled::from_file_units(residual),
                            samples_used: used,
                        }
                    });
                RecipeFile {
                    schema: 1,
                    name,
                    notes,
                    coil,
                    tank,
                    conditions: ConditionsSheet {
                        wire_temperature_c: t,
                        drives_resonance: m,
                        filament_sum: fs,
                    },
                    aim: AimSheet {
                        plan,
                        channel_mhz: Scaled::from_file_units(channel),
                        on_channel_within_khz: within.map(Scaled::from_file_units),
                    },
                    bench_log,
                    stray_estimate,
                    coil_measurement,
                    stage: None,
                    audio: Default::default(),
                }
            },
        )
}

/// Rounded to three decimals, as typed.
fn three_decimals(x: f64) -> f64 {
    (x * 1000.0).round() / 1000.0
}

fn typed_num(lo: f64, hi: f64) -> BoxedStrategy<f64> {
    typed(lo, hi, 3).boxed()
}

fn slider_num(lo: f64, hi: f64) -> BoxedStrategy<f64> {
    any_in(lo, hi).boxed()
}

/// Parse a generated file; `None` when the model refuses its geometry (e.g. a former too
/// small for the wire), which the generator does not try to avoid.
fn open(file: &RecipeFile) -> Option<Recipe> {
    let text = ron::to_string(file).unwrap();
    match format::from_text(&text) {
        Ok(r) => Some(r),
        Err(e) => {
            assert_eq!(e.kind, recipe::LoadErrorKind::Invalid, "{e}");
            None
        }
    }
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 200, ..ProptestConfig::default() })]

    #[test]
    fn random_recipes_round_trip_exactly(file in file_strategy(slider_num, std::convert::identity)) {
        let Some(r) = open(&file) else { return Err(TestCaseError::reject("refused geometry")) };
        let again = format::from_text(&format::to_text(&r)).unwrap();
        prop_assert_eq!(again, r);
    }

    #[test]
    fn typed_values_are_written_back_as_typed(file in file_strategy(typed_num, three_decimals)) {
        let Some(r) = open(&file) else { return Err(TestCaseError::reject("refused geometry")) };
        let text = format::to_text(&r);
        let written: RecipeFile = ron::from_str(&text).unwrap();
        prop_assert_eq!(&written, &file);
        // The digits in the file are the ones typed.
        let typed_fixed = format!("fixed_pf: {:?},", file.tank.fixed_pf.file_units());
        prop_assert!(text.contains(&typed_fixed), "{} not in {}", typed_fixed, text);
    }
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 300, ..ProptestConfig::default() })]

    /// Values straight from the sliders (any SI float, not typed digits) read back to the
    /// same bits.
    #[test]
    fn slider_values_in_si_round_trip_to_the_same_bits(
        // From 5.5 mm: the demo's five bare turns keep 0.1 mm apart.
        length in 5.5e-3..30e-3f64,
        fixed in 0.0..50e-12f64,
        setting in 0.0..1.0f64,
        stray in 0.0..10e-12f64,
        channel in 88e6..108e6f64,
        measured in 60e6..150e6f64,
        tolerance in proptest::option::of(100.0..1e6f64),
    ) {
        let mut r = Recipe::demo();
        r.winding.spacing = tankwright::model::SpacingSpec::Length(length);
        r.tank.fixed = fixed;
        r.tank.trimmer_setting = setting;
        r.tank.stray = stray;
        r.target.channel = channel;
        r.target.tolerance = tolerance;
        r.bench_log.push(recipe::BenchEntry {
            include_anyway: false,
            measured,
            length,
            trimmer_setting: setting,
            added_capacitance: 0.0,
            instrument: String::new(),
            error_ppm: None,
            note: String::new(),
            added_tolerance: None,
        });
        let back = format::from_text(&format::to_text(&r)).unwrap();
        prop_assert_eq!(back, r);
    }
}

/// The stray estimate's building method and tolerances (added after the first files were
/// written): a file without them opens with the usual figures and is written back without
/// them; other figures are written under `stray_estimate` and read back exactly.
#[test]
fn stray_estimate_settings_round_trip_and_old_files_get_the_usual_ones() {
    use tankwright::recipe::StraySettings;
    use tankwright::tuning::construction::Construction;
    let old = format::to_text(&Recipe::demo());
    assert!(
        !old.contains("stray_estimate"),
        "the usual figures are not written"
    );
    let read = format::from_text(&old).unwrap();
    assert_eq!(read.stray_estimate, StraySettings::default());

    let mut r = demo_with_log();
    r.stray_estimate.construction = Construction::Breadboard;
    r.stray_estimate.tolerances.former_diameter = 0.05e-3;
    r.stray_estimate.tolerances.length = 0.3e-3;
    r.stray_estimate.tolerances.wire_diameter = 0.005e-3;
    r.stray_estimate.tolerances.turns = 0.5;
    r.stray_estimate.tolerances.fixed_fraction = 0.02;
    let text = format::to_text(&r);
    for needle in [
        "building_method: Breadboard",
        "capacitor_tolerance_percent: 2.0",
        "former_tolerance_mm: 0.05",
        "length_tolerance_mm: 0.3",
        "wire_tolerance_mm: 0.005",
        "turns_tolerance: 0.5",
    ] {
        assert!(text.contains(needle), "missing {needle} in\n{text}");
    }
    assert_eq!(format::from_text(&text).unwrap(), r);

    // A file giving only some of them keeps the usual figures for the rest.
    let partial = old.replace(
        "bench_log:",
        "stray_estimate: StrayEstimate(building_method: Perfboard),\n    bench_log:",
    );
    assert_ne!(partial, old, "the demo text has a bench_log field");
    let read = format::from_text(&partial).unwrap();
    assert_eq!(read.stray_estimate.construction, Construction::Perfboard);
    assert_eq!(
        read.stray_estimate.tolerances,
        StraySettings::default().tolerances
    );

    // A tolerance out of range is refused naming its field, and the file still opens as written.
    let bad = old.replace(
        "bench_log:",
        "stray_estimate: StrayEstimate(turns_tolerance: -1.0),\n    bench_log:",
    );
    let err = format::from_text(&bad).unwrap_err();
    assert!(err.to_string().contains("turns_tolerance"), "{err}");
    let opened = format::read_text(&bad).unwrap();
    assert_eq!(opened.recipe.stray_estimate.tolerances.turns, -1.0);
}

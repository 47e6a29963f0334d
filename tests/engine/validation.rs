//! Refusals: impossible or meaningless input names its field and says why.

use tankwright::model::{
    Coating, Conditions, DiameterSpec, FeedbackDivider, Field, Gauge, SpacingSpec, Tank, Winding,
    WireSpec, evaluate,
};

fn good() -> Winding {
    Winding {
        diameter: DiameterSpec::Former(6e-3),
        wire: WireSpec {
            gauge: Gauge::Awg(18),
            coating: Coating::EnamelGrade1,
        },
        turns: 5.0,
        spacing: SpacingSpec::Length(8e-3),
        lead_length: 5e-3,
    }
}

fn tank() -> Tank {
    Tank::fixed_only(20e-12, 5e-12)
}

fn refused(w: Winding, t: Tank) -> (Field, String) {
    let e = evaluate(&w, &t, &Conditions::default()).expect_err("must be refused");
    (e.field, e.to_string())
}

#[test]
fn the_good_coil_is_accepted() {
    assert!(evaluate(&good(), &tank(), &Conditions::default()).is_ok());
}

#[test]
fn touching_turns_are_refused_with_the_minimum_length() {
    let (field, msg) = refused(
        Winding {
            spacing: SpacingSpec::Length(4e-3),
            ..good()
        },
        tank(),
    );
    assert_eq!(field, Field::Spacing);
    assert!(msg.contains("below the insulated wire diameter"), "{msg}");
    assert!(msg.contains("at least"), "{msg}");
}

#[test]
fn each_bad_field_is_named() {
    let cases: Vec<(Winding, Tank, Field)> = vec![
        (
            Winding {
                turns: 0.0,
                ..good()
            },
            tank(),
            Field::Turns,
        ),
        (
            Winding {
                turns: f64::NAN,
                ..good()
            },
            tank(),
            Field::Turns,
        ),
        (
            Winding {
                diameter: DiameterSpec::Former(-1e-3),
                ..good()
            },
            tank(),
            Field::Diameter,
        ),
        (
            Winding {
                diameter: DiameterSpec::Mean(0.5e-3),
                ..good()
            },
            tank(),
            Field::Diameter,
        ),
        (
            Winding {
                diameter: DiameterSpec::Former(5.0),
                ..good()
            },
            tank(),
            Field::Diameter,
        ),
        (
            Winding {
                wire: WireSpec {
                    gauge: Gauge::Awg(99),
                    coating: Coating::Bare,
                },
                ..good()
            },
            tank(),
            Field::Wire,
        ),
        (
            Winding {
                wire: WireSpec {
                    gauge: Gauge::Metric(f64::INFINITY),
                    coating: Coating::Bare,
                },
                ..good()
            },
            tank(),
            Field::Wire,
        ),
        (
            Winding {
                spacing: SpacingSpec::Gap(-0.1e-3),
                ..good()
            },
            tank(),
            Field::Spacing,
        ),
        (
            Winding {
                spacing: SpacingSpec::Length(f64::NAN),
                ..good()
            },
            tank(),
            Field::Spacing,
        ),
        (
            Winding {
                lead_length: -1e-3,
                ..good()
            },
            tank(),
            Field::LeadLength,
        ),
        (
            good(),
            Tank::fixed_only(-1e-12, 0.0),
            Field::FixedCapacitance,
        ),
        (good(), Tank::fixed_only(1.0, 0.0), Field::FixedCapacitance),
        (
            good(),
            Tank {
                trimmer_min: 10e-12,
                trimmer_max: 2e-12,
                ..tank()
            },
            Field::Trimmer,
        ),
        (
            good(),
            Tank {
                trimmer_setting: 1.5,
                ..tank()
            },
            Field::TrimmerSetting,
        ),
        (
            good(),
            Tank::fixed_only(10e-12, f64::NAN),
            Field::StrayCapacitance,
        ),
        (
            good(),
            Tank {
                feedback: Some(FeedbackDivider {
                    upper: 0.0,
                    lower: 10e-12,
                }),
                ..tank()
            },
            Field::Feedback,
        ),
    ];
    for (w, t, field) in cases {
        let (got, msg) = refused(w, t);
        assert_eq!(got, field, "{msg}");
        assert!(
            !msg.contains("NaN") || msg.contains("not a number"),
            "{msg}"
        );
    }
}

#[test]
fn temperature_out_of_range_is_refused() {
    let c = Conditions {
        temperature_c: 900.0,
        ..Conditions::default()
    };
    let e = evaluate(&good(), &tank(), &c).expect_err("refused");
    assert_eq!(e.field, Field::Temperature);
}

/// Wheeler's range (l > 0.8a, Wheeler 1928) and Medhurst's table (l/D ≥ 0.1) raise warnings
/// on a short, fat coil.
#[test]
fn short_fat_coil_warns() {
    let w = Winding {
        diameter: DiameterSpec::Mean(40e-3),
        wire: WireSpec {
            gauge: Gauge::Metric(0.5e-3),
            coating: Coating::Bare,
        },
        turns: 3.0,
        spacing: SpacingSpec::Length(3e-3),
        lead_length: 0.0,
    };
    let a = evaluate(&w, &tank(), &Conditions::default()).expect("valid");
    let text: Vec<&str> = a.warnings.iter().map(|w| w.message.as_str()).collect();
    assert!(text.iter().any(|m| m.contains("Wheeler")), "{text:?}");
    assert!(text.iter().any(|m| m.contains("Medhurst")), "{text:?}");
}

//! Bad recipe files are refused with a message that says where (line and column, or the
//! field) and why; nothing panics, whatever the bytes.

use proptest::prelude::*;
use tankwright::recipe::{LoadErrorKind, demos::SOURCES, format};

/// The 2 m demo: it has a bench log, so every part of the schema is present.
fn base() -> &'static str {
    SOURCES[1].1
}

/// The base text with `from` replaced by `to` (which must be present).
fn edited(from: &str, to: &str) -> String {
    assert!(base().contains(from), "{from} is not in the base recipe");
    base().replacen(from, to, 1)
}

/// What a case expects: the kind, where, and words the message must contain.
struct Case {
    what: &'static str,
    text: String,
    kind: LoadErrorKind,
    line: Option<usize>,
    field: Option<&'static str>,
    words: &'static str,
}

fn line_of(text: &str, needle: &str) -> usize {
    1 + text
        .lines()
        .position(|l| l.contains(needle))
        .unwrap_or_else(|| panic!("{needle} not in text"))
}

fn cases() -> Vec<Case> {
    let mut out = Vec::new();
    let mut add = |what, text: String, kind, line_needle: Option<&str>, field, words| {
        let line = line_needle.map(|n| line_of(&text, n));
        out.push(Case {
            what,
            text,
            kind,
            line,
            field,
            words,
        });
    };
    use LoadErrorKind::*;
    add("empty", String::new(), Empty, None, None, "empty");
    add("blank", "  \n\t\n".into(), Empty, None, None, "empty");
    let half = &base()[..base().len() / 2];
    add("truncated", half.to_owned(), Syntax, None, None, "");
    add(
        "wrong type",
        edited("turns: 5.0,", "turns: \"five\","),
        Syntax,
        Some("turns: \"five\""),
        None,
        "",
    );
    add(
        "text where a size goes",
        edited("fixed_pf: 4.7,", "fixed_pf: \"4.7\","),
        Syntax,
        Some("fixed_pf: \"4.7\""),
        None,
        "expected a number",
    );
    add(
        "unknown field in the coil",
        edited("turns: 5.0,", "turns: 5.0,\n        colour: \"red\","),
        Syntax,
        Some("colour"),
        None,
        "colour",
    );
    add(
        "unknown top-level field",
        edited("schema: 1,", "schema: 1,\n    owner: \"me\","),
        Syntax,
        Some("owner"),
        None,
        "owner",
    );
    add(
        "missing coil",
        {
            let start = base().find("    coil: Winding(").unwrap();
            let end = base().find("    tank: Tank(").unwrap();
            format!("{}{}", &base()[..start], &base()[end..])
        },
        Syntax,
        None,
        None,
        "coil",
    );
    add(
        "another program's struct",
        edited("TankwrightRecipe(", "SomethingElse("),
        Syntax,
        Some("SomethingElse("),
        None,
        "TankwrightRecipe",
    );
    add(
        "NaN turns",
        edited("turns: 5.0,", "turns: NaN,"),
        Invalid,
        Some("turns: NaN"),
        Some("coil.turns"),
        "not a number",
    );
    add(
        "negative former",
        edited("FormerMm(5.0)", "FormerMm(-5.0)"),
        Invalid,
        Some("FormerMm(-5.0)"),
        Some("coil.diameter"),
        "positive",
    );
    add(
        "absurd turns",
        edited("turns: 5.0,", "turns: 1e9,"),
        Invalid,
        Some("turns: 1e9"),
        Some("coil.turns"),
        "outside",
    );
    add(
        "turns that overlap",
        edited("LengthMm(7.0)", "LengthMm(1.0)"),
        Invalid,
        Some("LengthMm(1.0)"),
        Some("coil.spacing"),
        "overlap",
    );
    add(
        "gauge off the table",
        edited("BareMm(0.8)", "Awg(99)"),
        Invalid,
        Some("Awg(99)"),
        Some("coil.wire"),
        "AWG",
    );
    add(
        "absurd capacitor",
        edited("fixed_pf: 4.7,", "fixed_pf: 1e9,"),
        Invalid,
        Some("fixed_pf: 1e9"),
        Some("tank.fixed_pf"),
        "outside",
    );
    add(
        "negative stray",
        edited("stray_pf: 4.0,", "stray_pf: -4.0,"),
        Invalid,
        Some("stray_pf: -4.0"),
        Some("tank.stray_pf"),
        "outside",
    );
    add(
        "trimmer upside down",
        edited("trimmer_max_pf: 8.0,", "trimmer_max_pf: 1.0,"),
        Invalid,
        Some("trimmer_max_pf: 1.0"),
        Some("tank.trimmer_max_pf"),
        "below its minimum",
    );
    add(
        "trimmer past its end",
        edited(
            "trimmer_setting_percent: 50.0,",
            "trimmer_setting_percent: 150.0,",
        ),
        Invalid,
        Some("trimmer_setting_percent: 150.0"),
        Some("tank.trimmer_setting_percent"),
        "0–100 %",
    );
    add(
        "hot wire",
        edited("wire_temperature_c: 22.0,", "wire_temperature_c: 500.0,"),
        Invalid,
        Some("wire_temperature_c: 500.0"),
        Some("conditions.wire_temperature_c"),
        "°C",
    );
    add(
        "channel at zero",
        edited("channel_mhz: 145.5,", "channel_mhz: 0.0,"),
        Invalid,
        Some("channel_mhz: 0.0"),
        Some("aim.channel_mhz"),
        "outside",
    );
    add(
        "empty own list",
        edited("plan: TwoMetreRegion1,", "plan: OwnList(channels_mhz: []),"),
        Invalid,
        Some("plan: OwnList"),
        Some("aim.plan.channels_mhz"),
        "at least one",
    );
    add(
        "reading not a number",
        edited("measured_mhz: 147.532,", "measured_mhz: NaN,"),
        Invalid,
        Some("measured_mhz: NaN"),
        Some("bench_log[1].measured_mhz"),
        "not a number",
    );
    add(
        "negative instrument error",
        edited("error_ppm: Some(5.0),", "error_ppm: Some(-5.0),"),
        Invalid,
        Some("error_ppm: Some(-5.0)"),
        Some("bench_log[1].error_ppm"),
        "ppm",
    );
    add(
        "schema zero",
        edited("schema: 1,", "schema: 0,"),
        Invalid,
        Some("schema: 0"),
        Some("schema"),
        "schema 0",
    );
    add(
        "negative schema",
        edited("schema: 1,", "schema: -1,"),
        Syntax,
        Some("schema: -1"),
        None,
        "",
    );
    add(
        "junk with a NUL",
        "\u{0}\u{1}\u{2}junk(((".to_owned(),
        Syntax,
        Some("junk"),
        None,
        "",
    );
    out
}

#[test]
fn each_malformed_file_says_where_and_why() {
    for case in cases() {
        let err = match format::from_text(&case.text) {
            Ok(_) => panic!("{}: accepted", case.what),
            Err(e) => e,
        };
        let shown = err.to_string();
        assert_eq!(err.kind, case.kind, "{}: {shown}", case.what);
        if let Some(line) = case.line {
            let (at, _) = err
                .position
                .unwrap_or_else(|| panic!("{}: no position in {shown}", case.what));
            assert_eq!(at, line, "{}: {shown}", case.what);
            assert!(shown.contains(&format!("line {line} column")), "{shown}");
        }
        if matches!(case.kind, LoadErrorKind::Syntax) {
            assert!(
                err.position.is_some(),
                "{}: no position in {shown}",
                case.what
            );
        }
        if let Some(field) = case.field {
            assert_eq!(err.field.as_deref(), Some(field), "{}: {shown}", case.what);
            assert!(shown.contains(&format!("field {field}")), "{shown}");
        }
        assert!(shown.contains(case.words), "{}: {shown}", case.what);
        println!("{:<28} {shown}", case.what);
    }
}

#[test]
fn invalid_utf8_is_refused_with_its_position() {
    let mut bytes = b"// Tankwright\nTankwrightRecipe(\n  name: \"".to_vec();
    bytes.extend_from_slice(&[0xff, 0xfe, b'"']);
    let err = format::from_bytes(&bytes).unwrap_err();
    assert_eq!(err.kind, LoadErrorKind::NotText);
    assert_eq!(err.position, Some((3, 10)));
    assert!(err.to_string().contains("UTF-8"), "{err}");
}

#[test]
fn a_newer_schema_is_refused_by_name_not_by_its_new_fields() {
    let newer = edited(
        "schema: 1,",
        "schema: 2,\n    winding_machine: Lathe(rpm: 60),",
    )
    .replace(
        "wire: BareMm(0.8),",
        "wire: Litz(strands: 7, each_mm: 0.1),",
    );
    let err = format::from_text(&newer).unwrap_err();
    assert_eq!(err.kind, LoadErrorKind::Newer { schema: 2 });
    assert!(
        err.to_string()
            .contains("made by a newer Tankwright (schema 2, this one reads up to 1)"),
        "{err}"
    );
}

#[test]
fn an_oversized_file_is_refused_before_parsing() {
    let huge = format!("{}{}", base(), " ".repeat(format::MAX_BYTES));
    assert_eq!(
        format::from_text(&huge).unwrap_err().kind,
        LoadErrorKind::TooLarge
    );
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 2000, ..ProptestConfig::default() })]

    #[test]
    fn random_bytes_never_panic(bytes in proptest::collection::vec(any::<u8>(), 0..400)) {
        // Ok is allowed in principle; an error must say something.
        if let Err(e) = format::from_bytes(&bytes) {
            prop_assert!(!e.reason.is_empty());
        }
    }

    #[test]
    fn damaged_recipes_never_panic_and_anything_accepted_is_valid(
        at in 0.0..1.0f64,
        truncate in any::<bool>(),
        junk in "\\PC{0,6}",
    ) {
        let chars: Vec<char> = base().chars().collect();
        let i = (at * chars.len() as f64) as usize;
        let damaged: String = if truncate {
            chars[..i].iter().collect()
        } else {
            chars[..i].iter().copied().chain(junk.chars()).chain(chars[i..].iter().copied()).collect()
        };
        match format::from_text(&damaged) {
            Ok(r) => {
                prop_assert!(tankwright::model::evaluate(&r.winding, &r.tank, &r.conditions).is_ok());
            }
            Err(e) => prop_assert!(!e.to_string().is_empty()),
        }
    }
}

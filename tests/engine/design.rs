//! Design from the parts on hand (`tuning::design`): every candidate, opened as a recipe and
//! computed by `recipe::figures` (what the window and `report` show), lands the target within
//! the channel's tolerance; its spread band lies inside the trimmer's reach; no part off the
//! list is proposed; the batch search finds what the plain per-candidate loop finds; a search
//! that finds nothing says which constraint ruled everything out.
//!
//! Outside sources: Thomson's formula for the resonance of an LC circuit, f = 1/(2π√(LC))
//! (W. Thomson, "On transient electric currents", Phil. Mag. 5, 1853), as a hand check of
//! one candidate from its inductance and capacitance; the E12 series of IEC 60063:2015
//! (Table 1); the inch (25.4 mm exactly, international yard and pound agreement, 1959).

use tankwright::model::{Coating, Gauge, WireSpec, evaluate_coil};
use tankwright::recipe::{expectation, figures, from_design::recipe_of};
use tankwright::tuning::construction::Construction;
use tankwright::tuning::design::parts::{
    PartsOnHand, TrimmerPart, e_series_between, parse_fixed_list, parse_former, parse_wire,
};
use tankwright::tuning::design::{Design, DesignSettings, Method, plan_for, search};
use tankwright::tuning::stray::Span;
use tankwright::tuning::verdict::{Aim, FlagKind};

const MM: f64 = 1e-3;
const PF: f64 = 1e-12;
const TARGET: f64 = 98.7e6;

fn bare(d_mm: f64) -> WireSpec {
    WireSpec {
        gauge: Gauge::Metric(d_mm * MM),
        coating: Coating::Bare,
    }
}

/// A small drawer that holds candidates for 98.7 MHz (found by the search itself on a
/// larger list: 5 mm former, 18 pF, the 2–10 pF trimmer).
fn small_parts() -> PartsOnHand {
    PartsOnHand {
        formers: vec![5.0 * MM],
        wires: vec![bare(0.8), bare(1.25)],
        fixed: vec![15.0 * PF, 18.0 * PF],
        trimmers: vec![TrimmerPart {
            min: 2.0 * PF,
            max: 10.0 * PF,
        }],
        lead_length: 5.0 * MM,
        construction: Construction::CopperClad,
    }
}

fn aim() -> Aim {
    Aim::new(plan_for(TARGET), Some(TARGET))
}

fn settings(count: usize) -> DesignSettings {
    DesignSettings {
        count,
        ..DesignSettings::default()
    }
}

fn run(parts: &PartsOnHand, s: &DesignSettings) -> Design {
    search(parts, &aim(), s).expect("the parts are accepted")
}

#[test]
fn each_candidate_lands_the_target_by_the_recipe_figures() {
    let parts = small_parts();
    let s = settings(3);
    let d = run(&parts, &s);
    assert!(!d.candidates.is_empty(), "ruled out: {:?}", d.ruled_out);
    for c in &d.candidates {
        let recipe = recipe_of(c, &aim(), &s, parts.construction);
        let f = figures(&recipe).expect("the candidate's recipe is valid");
        let tolerance = recipe.target.tolerance();
        let off = f.analysis.resonance - TARGET;
        assert!(
            off.abs() <= tolerance,
            "candidate {c:?} lands {off} Hz off by recipe::figures (tolerance {tolerance})"
        );
        // The candidate's own figure is the recipe's (same model, same field solution).
        assert!((c.resonance - f.analysis.resonance).abs() < 1.0);
        // Near mid-travel, as asked.
        assert!(
            (0.3..=0.7).contains(&c.trimmer_setting),
            "{}",
            c.trimmer_setting
        );
        // The spread band lies inside what the trimmer reaches, by the figures' own window.
        let (low, high) = f.target.window;
        assert!(
            c.spread.0 >= low && c.spread.1 <= high,
            "spread {:?} outside the reach {low}–{high}",
            c.spread
        );
        // The whole travel stays in the FM band and off 108–137 MHz, harmonics too: the
        // verdict agrees (a travel near a band edge is allowed, ranked lower).
        assert!(
            !f.verdict.flags.iter().any(|x| matches!(
                x.kind,
                FlagKind::Aeronautical | FlagKind::OutsideBand | FlagKind::HarmonicAeronautical
            )),
            "{:?}",
            f.verdict.flags
        );
        assert!(f.verdict.is_buildable(), "{:?}", f.verdict.flags);
        assert!(!c.reasons.is_empty());
    }
}

#[test]
fn spread_without_the_device_allowance_is_the_stray_panels() {
    // With no allowance for the device, the candidate's spread band is exactly what the
    // window's stray panel shows for the saved recipe (recipe::expectation).
    let parts = small_parts();
    let s = DesignSettings {
        device: Span::exact(0.0),
        ..settings(1)
    };
    let d = run(&parts, &s);
    let c = d.candidates.first().expect("a candidate");
    let recipe = recipe_of(c, &aim(), &s, parts.construction);
    let f = figures(&recipe).expect("valid");
    let e = expectation(&recipe, &f, &[]);
    assert!((e.before.expected.0 - c.spread.0).abs() < 1.0);
    assert!((e.before.expected.1 - c.spread.1).abs() < 1.0);
}

#[test]
fn thomson_hand_check_of_one_candidate() {
    // f = 1/(2π√(LC)) (Thomson 1853) with L the driving inductance the engine solved and C
    // the external capacitance plus the coil's own (Medhurst), both read from the analysis of
    // the candidate's coil in its tank: the candidate's resonance must be that f.
    let parts = small_parts();
    let s = settings(1);
    let d = run(&parts, &s);
    let c = d.candidates.first().expect("a candidate");
    let recipe = recipe_of(c, &aim(), &s, parts.construction);
    let f = figures(&recipe).expect("valid");
    let a = evaluate_coil(&f.coil, recipe.tank.external_capacitance(), &f.conditions);
    let by_hand =
        1.0 / (2.0 * std::f64::consts::PI * (a.total_inductance * a.total_capacitance).sqrt());
    assert!(
        ((by_hand - c.resonance) / c.resonance).abs() < 1e-6,
        "Thomson {by_hand} against the candidate's {}",
        c.resonance
    );
    // And the capacitance is what the candidate lists: fixed + trimmer at its setting + stray.
    let listed =
        c.fixed + c.trimmer.min + c.trimmer_setting * (c.trimmer.max - c.trimmer.min) + c.stray;
    assert!((a.external_capacitance - listed).abs() < 1e-18);
}

#[test]
fn never_proposes_a_part_not_on_the_list() {
    let parts = small_parts();
    let d = run(&parts, &settings(5));
    for c in &d.candidates {
        assert!(parts.formers.contains(&c.former));
        assert!(parts.wires.contains(&c.wire));
        assert!(parts.fixed.contains(&c.fixed));
        assert!(parts.trimmers.contains(&c.trimmer));
        assert_eq!(c.lead_length, parts.lead_length);
        assert_eq!((c.turns * 4.0).fract(), 0.0, "quarter turns: {}", c.turns);
        // Lengths a hand sets: to 0.1 mm.
        assert!(((c.length * 1e4).round() - c.length * 1e4).abs() < 1e-6);
    }
}

#[test]
fn the_batch_search_finds_what_the_plain_loop_finds() {
    let parts = small_parts();
    let batch = run(&parts, &settings(3));
    let plain = run(
        &parts,
        &DesignSettings {
            method: Method::PerCandidate,
            ..settings(3)
        },
    );
    assert_eq!(batch.landed, plain.landed);
    assert_eq!(batch.passed_screen, plain.passed_screen);
    assert_eq!(batch.candidates.len(), plain.candidates.len());
    for (b, p) in batch.candidates.iter().zip(&plain.candidates) {
        assert_eq!(
            (b.former, b.wire, b.fixed, b.trimmer, b.turns, b.length),
            (p.former, p.wire, p.fixed, p.trimmer, p.turns, p.length)
        );
        assert!((b.resonance - p.resonance).abs() < 1.0);
    }
}

#[test]
fn a_refusal_names_the_constraint_that_ruled_everything_out() {
    // A 6–30 pF trimmer with 10 pF fixed swings the tank by a factor √(40/16) ≈ 1.58 over its
    // travel: centred on 98.7 MHz it must cross 108 MHz, whatever the coil.
    let parts = PartsOnHand {
        fixed: vec![10.0 * PF],
        trimmers: vec![TrimmerPart {
            min: 6.0 * PF,
            max: 30.0 * PF,
        }],
        ..small_parts()
    };
    let d = run(&parts, &settings(3));
    assert!(d.candidates.is_empty());
    let first = d.ruled_out.first().expect("a reason");
    assert!(first.starts_with("no candidate:"), "{first}");
    assert!(first.contains("travel"), "{first}");
    assert!(first.contains("crosses 108.000 MHz"), "{first}");
    assert!(
        d.ruled_out
            .iter()
            .any(|r| r.starts_with("no candidate with the 6–30 pF trimmer")),
        "{:?}",
        d.ruled_out
    );
}

#[test]
fn parts_are_read_and_refused_by_name() {
    // 1/4 in = 6.35 mm exactly (the inch is 25.4 mm).
    assert!((parse_former("1/4in").expect("a fraction") - 6.35e-3).abs() < 1e-12);
    assert!((parse_former("6.5").expect("mm") - 6.5e-3).abs() < 1e-15);
    assert!(parse_former("six").is_err());
    assert_eq!(
        parse_wire("awg18", Coating::EnamelGrade1)
            .expect("awg")
            .gauge,
        Gauge::Awg(18)
    );
    assert!(parse_wire("awg99", Coating::Bare).is_err());
    // IEC 60063:2015 Table 1, E12 from 4.7 to 47: 4.7 5.6 6.8 8.2 10 12 15 18 22 27 33 39 47.
    let e12 = e_series_between(12, 4.7, 47.0).expect("E12");
    assert_eq!(
        e12,
        vec![
            4.7, 5.6, 6.8, 8.2, 10.0, 12.0, 15.0, 18.0, 22.0, 27.0, 33.0, 39.0, 47.0
        ]
    );
    let fixed = parse_fixed_list("E6:10-33, 5").expect("a series and a value");
    assert_eq!(fixed.len(), 5);
    let mut bad = small_parts();
    bad.formers.push(0.2 * MM);
    let e = bad.check().expect_err("a 0.2 mm former is refused");
    assert_eq!(e.list, "formers");
    assert!(e.message.contains("1–50 mm"), "{}", e.message);
    let mut bad = small_parts();
    bad.trimmers.push(TrimmerPart {
        min: 10.0 * PF,
        max: 2.0 * PF,
    });
    assert_eq!(bad.check().expect_err("backwards").list, "trimmers");
}

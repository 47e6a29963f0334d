//! The demo recipes under assets/recipes, compiled in: an invented scenario (the Lantern Hill
//! radio club's bench coils). Opening one gives a copy; saving it goes to the user's folder.

use super::document::{Recipe, Target};
use super::format::from_text;
use crate::model::{Coating, DiameterSpec, Gauge, SpacingSpec, Tank, Winding, WireSpec};
use crate::tuning::BandPlan;
use crate::tuning::service::Service;

/// File name and text of every demo, the first being [`Recipe::demo`].
pub const SOURCES: [(&str, &str); 4] = [
    (
        "lantern_hill_bench_oscillator.ron",
        include_str!("../../assets/recipes/lantern_hill_bench_oscillator.ron"),
    ),
    (
        "lantern_hill_two_metre_buffer.ron",
        include_str!("../../assets/recipes/lantern_hill_two_metre_buffer.ron"),
    ),
    (
        "apprentice_enamel_exercise.ron",
        include_str!("../../assets/recipes/apprentice_enamel_exercise.ron"),
    ),
    (
        "field_day_club_channels.ron",
        include_str!("../../assets/recipes/field_day_club_channels.ron"),
    ),
];

/// The demo recipes: (file name, recipe), in menu order. A demo that fails to read is left
/// out (the tests make sure none does).
pub fn demos() -> Vec<(&'static str, Recipe)> {
    SOURCES
        .iter()
        .filter_map(|&(name, text)| from_text(text).ok().map(|r| (name, r)))
        .collect()
}

/// What "new recipe" starts from for `service` (the service of the recipe on screen; FM
/// broadcast when it has none): a workable coil of the service's usual parts, stated in the
/// notes, with nothing hidden — no feedback divider across the tank, no bench readings.
///
/// The parts (common practice for a hand-wound free-running tank, chosen with this program's
/// own model so the whole trimmer travel stays inside the band with the edge margin):
/// - FM broadcast: 6 mm former, 1.0 mm bare copper, 5 turns over 11 mm, 5 mm leads;
///   18 pF fixed, a 2–10 pF trimmer at half travel, 6 pF stray: about 97 MHz, travel about
///   91–104 MHz on the field solution (93–107 MHz on the classical model alone, which runs
///   about 3 % higher here: inside the band on either), aimed at 98.0 MHz on the 100 kHz
///   plan.
/// - 2 m amateur: 5 mm former, 1.0 mm bare copper, 3 turns over 7.5 mm, 4 mm leads; 27 pF
///   fixed, a 1–2.5 pF trimmer at half travel (a small trimmer: the 2 m band is only 3 % wide),
///   4 pF stray: about 146 MHz, travel about 144.3–147.6 MHz on the field solution, aimed at
///   146.0 MHz (Region 2). The band is narrower than the two models' difference (about 3 %),
///   so on the classical model alone the same parts sit above the band: the first bench
///   reading settles it.
pub fn starting_recipe(service: Option<Service>) -> Recipe {
    let demo = Recipe::demo();
    let start = StartingPoint::of(service.unwrap_or(Service::FmBroadcast));
    Recipe {
        name: "New recipe".to_owned(),
        notes: start.note.to_owned(),
        winding: Winding {
            diameter: DiameterSpec::Former(start.former),
            wire: WireSpec {
                gauge: Gauge::Metric(start.wire),
                coating: Coating::Bare,
            },
            turns: start.turns,
            spacing: SpacingSpec::Length(start.length),
            lead_length: start.lead,
        },
        tank: Tank {
            fixed: start.fixed,
            trimmer_min: start.trimmer.0,
            trimmer_max: start.trimmer.1,
            trimmer_setting: 0.5,
            stray: start.stray,
            feedback: None,
        },
        target: Target {
            plan: start.plan,
            channel: start.channel,
            tolerance: None,
        },
        bench_log: Vec::new(),
        ..demo
    }
}

/// A service's starting parts (SI units).
struct StartingPoint {
    former: f64,
    wire: f64,
    turns: f64,
    length: f64,
    lead: f64,
    fixed: f64,
    trimmer: (f64, f64),
    stray: f64,
    plan: BandPlan,
    channel: f64,
    note: &'static str,
}

impl StartingPoint {
    fn of(service: Service) -> Self {
        match service {
            Service::FmBroadcast => StartingPoint {
                former: 6.0e-3,
                wire: 1.0e-3,
                turns: 5.0,
                length: 11.0e-3,
                lead: 5.0e-3,
                fixed: 18e-12,
                trimmer: (2e-12, 10e-12),
                stray: 6e-12,
                plan: BandPlan::Fm100k,
                channel: 98.0e6,
                note: FM_START,
            },
            Service::TwoMetreAmateur => StartingPoint {
                former: 5.0e-3,
                wire: 1.0e-3,
                turns: 3.0,
                length: 7.5e-3,
                lead: 4.0e-3,
                fixed: 27e-12,
                trimmer: (1e-12, 2.5e-12),
                stray: 4e-12,
                plan: BandPlan::TwoMetreRegion2,
                channel: 146.0e6,
                note: TWO_METRE_START,
            },
        }
    }
}

/// Where a new FM broadcast recipe starts, and where to begin (its notes).
pub const FM_START: &str = "Starting point for FM broadcast: 5 turns of 1.0 mm bare copper on a \
     6 mm former, spread to 11 mm, 5 mm leads; 18 pF fixed capacitor, 2–10 pF trimmer at half \
     travel, 6 pF stray; no feedback divider across the tank (tick it if your oscillator has \
     one). Where to start: pick your band plan and channel on the right, then set the coil on \
     the left to the former and wire you have, and follow the verdict's \"Next\".";

/// Where a new 2 m recipe starts, and where to begin (its notes).
pub const TWO_METRE_START: &str = "Starting point for 2 m: 3 turns of 1.0 mm bare copper on a \
     5 mm former, spread to 7.5 mm, 4 mm leads; 27 pF fixed capacitor, 1–2.5 pF trimmer at half \
     travel (the band is only 3 % wide, so the trimmer is small), 4 pF stray; no feedback \
     divider across the tank (tick it if your oscillator has one). Where to start: pick your \
     band plan and channel on the right, then set the coil on the left to the former and wire \
     you have, and follow the verdict's \"Next\".";

//! The recipe as the program holds it: SI units, validated by the model's rules.

use crate::model::{
    Coating, Conditions, DiameterSpec, FeedbackDivider, Gauge, InductanceModel, SpacingSpec, Tank,
    Winding, WireSpec,
};
use crate::tuning::BandPlan;
use crate::tuning::construction::Construction;
use crate::tuning::fit::Reading;
use crate::tuning::spread::BuildTolerances;

/// The channel a recipe aims at.
#[derive(Clone, Debug, PartialEq)]
pub struct Target {
    /// The band plan the channel is picked from.
    pub plan: BandPlan,
    /// The channel centre, hertz.
    pub channel: f64,
    /// "On channel" means within ± this of the channel centre, hertz; `None`: the plan's
    /// default, the practice of its service ([`BandPlan::default_tolerance`]).
    pub tolerance: Option<f64>,
}

impl Target {
    /// The on-channel tolerance judged against, hertz: the user's, else the plan's default.
    pub fn tolerance(&self) -> f64 {
        self.tolerance
            .filter(|t| t.is_finite() && *t > 0.0)
            .unwrap_or_else(|| self.plan.default_tolerance())
    }
}

/// One measurement at the bench.
#[derive(Clone, Debug, PartialEq)]
pub struct BenchEntry {
    /// Measured resonance (or oscillation) frequency, hertz.
    pub measured: f64,
    /// Coil length (turns × pitch) at the time, metres.
    pub length: f64,
    /// Trimmer setting at the time, 0–1.
    pub trimmer_setting: f64,
    /// A known capacitor clipped across the tank for this reading, farads (0 for none).
    pub added_capacitance: f64,
    /// That capacitor's tolerance as a fraction (0.05 for ±5 %), if stated; the fit takes
    /// [`crate::tuning::fit::CLIP_ON_TOLERANCE`] otherwise.
    pub added_tolerance: Option<f64>,
    /// What it was measured with (free text).
    pub instrument: String,
    /// The instrument's frequency error in ppm, if known.
    pub error_ppm: Option<f64>,
    /// Anything else worth keeping.
    pub note: String,
    /// The user's word that the fit takes this reading even when it suspects it of being a
    /// harmonic (about 2× or ½× the prediction); such a reading is left out otherwise.
    pub include_anyway: bool,
}

/// The stray estimate's inputs and the builder's tolerances, kept with the recipe so the window
/// shows the same estimate and spread when the recipe is opened again.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct StraySettings {
    /// How the circuit is built (fills the estimate's layout).
    pub construction: Construction,
    /// The winding's and the fixed capacitor's tolerances.
    pub tolerances: BuildTolerances,
}

impl Default for StraySettings {
    fn default() -> Self {
        Self {
            construction: Construction::CopperClad,
            tolerances: BuildTolerances::HAND_WOUND,
        }
    }
}

/// A coil recipe: the winding, the tank it works in, its target, and what was measured.
#[derive(Clone, Debug, PartialEq)]
pub struct Recipe {
    /// Short name, shown in the title bar.
    pub name: String,
    /// Free notes.
    pub notes: String,
    /// The coil as the builder knows it.
    pub winding: Winding,
    /// The tank.
    pub tank: Tank,
    /// Temperature and the driving inductance model.
    pub conditions: Conditions,
    /// The channel aimed at.
    pub target: Target,
    /// Measurements, oldest first.
    pub bench_log: Vec<BenchEntry>,
    /// The stray estimate's building method and the tolerances of the spread.
    pub stray_estimate: StraySettings,
    /// The coil as a network analyser measured it, if kept.
    pub coil_measurement: Option<crate::tuning::measured_field::CoilMeasurement>,
    /// The oscillator stage round the tank, if set (its bias, transistor, battery, Clapp
    /// capacitor).
    pub stage: Option<crate::tuning::stage::StageSettings>,
    /// The audio panel's junction, audio and drift changes (the usual ones until set).
    pub audio: crate::tuning::audio::AudioSettings,
}

impl BenchEntry {
    /// The reading in the engine's terms.
    pub fn reading(&self) -> Reading {
        Reading {
            measured: self.measured,
            length: self.length,
            trimmer_setting: self.trimmer_setting,
            added_capacitance: self.added_capacitance,
            error_ppm: self.error_ppm,
            added_tolerance: self.added_tolerance,
            include_anyway: self.include_anyway,
        }
    }
}

impl Recipe {
    /// Every bench reading in the engine's terms, oldest first.
    pub fn readings(&self) -> Vec<Reading> {
        self.bench_log.iter().map(BenchEntry::reading).collect()
    }

    /// The demo coil: an invented scenario (see assets/recipes). A 5-turn coil of 1.0 mm bare
    /// copper on a 6 mm former for a bench oscillator aimed at 98.7 MHz, with a 2–10 pF trimmer.
    pub fn demo() -> Self {
        Self {
            name: "Lantern Hill bench oscillator".to_owned(),
            notes: "Practice coil for the Thursday apprentices: wind on the 6 mm drill shank, \
                    spread to 8 mm, trim to the club's test channel."
                .to_owned(),
            winding: Winding {
                diameter: DiameterSpec::Former(6.0e-3),
                wire: WireSpec {
                    gauge: Gauge::Metric(1.0e-3),
                    coating: Coating::Bare,
                },
                turns: 5.0,
                spacing: SpacingSpec::Length(8.0e-3),
                lead_length: 5.0e-3,
            },
            tank: Tank {
                fixed: 6.8e-12,
                trimmer_min: 2e-12,
                trimmer_max: 10e-12,
                trimmer_setting: 0.5,
                stray: 6e-12,
                feedback: Some(FeedbackDivider {
                    upper: 10e-12,
                    lower: 22e-12,
                }),
            },
            conditions: Conditions {
                temperature_c: 25.0,
                model: InductanceModel::RoundWire,
                filament_sum: true,
                inductance_scale: 1.0,
            },
            target: Target {
                plan: BandPlan::UsFm,
                channel: 98.7e6,
                tolerance: None,
            },
            bench_log: Vec::new(),
            stray_estimate: StraySettings::default(),
            coil_measurement: None,
            stage: None,
            audio: Default::default(),
        }
    }
}

//! One landed coil judged as a builder would, in the order a builder would give up on it: the
//! trimmer's whole travel and its harmonics stay in the
//! band and off protected frequencies ([`crate::tuning::verdict::band_flags`]); the spread
//! band fits inside the trimmer's reach, so the first build lands by turning the trimmer;
//! squeezing the coil by 0.1 mm moves at most a stated share of the reach
//! ([`crate::tuning::solve::stretch_sensitivity`]); the self-resonance lies well above the
//! travel. Every figure comes from the tuning functions the verdict and the target panel use.

use super::DesignSettings;
use crate::model::{Coil, Conditions, Tank};
use crate::tuning::digits::{mhz, mhz_range, width};
use crate::tuning::field_tank::LUMPED_SELF_RESONANCE_BIAS;
use crate::tuning::solve::{stretch_sensitivity, trimmer_window};
use crate::tuning::spread::{TankParts, linear_band, spread};
use crate::tuning::stray::Span;
use crate::tuning::verdict::{Aim, Flag, FlagKind, Reach, band_flags};
use crate::units::to_pf;

/// Monte Carlo draws and seed of the confirmed spread: the figures of
/// `recipe::expectation` (tests/engine/design.rs holds the two equal).
pub const DRAWS: usize = 1000;
/// Seed of the draws.
pub const SEED: u64 = 1;

/// The test a candidate fell at, in the order they are applied.
#[derive(Clone, Copy, Debug, PartialEq, Eq, PartialOrd, Ord, Hash)]
pub enum Stage {
    /// No buildable length lands the target at mid-travel.
    Lands,
    /// The trimmer's travel leaves the band or reaches protected frequencies.
    Travel,
    /// The spread band does not fit inside the trimmer's reach.
    Spread,
    /// A 0.1 mm squeeze moves more than the stated share of the reach.
    Gentle,
    /// The self-resonance is not well above the travel.
    SelfResonance,
}

impl Stage {
    /// Every stage, in order.
    pub const ALL: [Stage; 5] = [
        Stage::Lands,
        Stage::Travel,
        Stage::Spread,
        Stage::Gentle,
        Stage::SelfResonance,
    ];

    /// The constraint in a few words, for summaries.
    pub fn label(self) -> &'static str {
        match self {
            Stage::Lands => "no buildable length lands the target at mid-travel",
            Stage::Travel => {
                "the trimmer's travel leaves the band or reaches protected frequencies"
            }
            Stage::Spread => "the spread of the build does not fit inside the trimmer's reach",
            Stage::Gentle => "the coil is too touchy: a 0.1 mm squeeze moves too much of the reach",
            Stage::SelfResonance => "the self-resonance is not well above the operating frequency",
        }
    }
}

/// Why a candidate was dropped.
#[derive(Clone, Debug, PartialEq)]
pub struct Failure {
    /// Where.
    pub stage: Stage,
    /// In words with the numbers (it completes "… because ").
    pub text: String,
}

/// Which spread to take.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum SpreadKind {
    /// Linear propagation at the one length (screening: thirteen batch sweeps).
    Linear,
    /// The central 95 % of [`DRAWS`] Monte Carlo builds (the confirmed figure, as the stray
    /// panel shows it).
    Draws,
}

/// The figures of a candidate that passed.
#[derive(Clone, Debug, PartialEq)]
pub struct Judged {
    /// Resonance at the tank's setting, hertz.
    pub resonance: f64,
    /// Trimmer at maximum and at minimum, hertz.
    pub reach: (f64, f64),
    /// The spread band at the setting, hertz (low, high).
    pub spread: (f64, f64),
    /// The reach widened by the spread: what the travel of a build at the spread's edge may
    /// cover, hertz (told, not judged: the builder trims from mid-travel).
    pub travel: (f64, f64),
    /// Stretch sensitivity, hertz per metre.
    pub stretch: f64,
    /// The share of the reach a 0.1 mm squeeze moves.
    pub squeeze_share: f64,
    /// Self-resonance, hertz (field-solved when confirmed, else the lumped estimate moved by
    /// its measured bias).
    pub self_resonance: f64,
    /// Band-edge flags (drift margin), kept as a penalty rather than a refusal.
    pub edge_flags: Vec<Flag>,
}

/// Judge `coil` in `tank` (its setting where the candidate lands) with the stray term's span
/// `stray` (around `tank.stray`), under `conditions` (the field solution's scale in them when
/// confirmed). `self_resonance`: the field-solved one when there is one.
#[expect(
    clippy::too_many_arguments,
    reason = "the candidate's parts, the aim and the settings are each needed"
)]
pub fn judge_candidate(
    coil: &Coil,
    tank: &Tank,
    stray: Span,
    conditions: &Conditions,
    aim: &Aim,
    settings: &DesignSettings,
    kind: SpreadKind,
    self_resonance: Option<f64>,
) -> Result<Judged, Failure> {
    let external = tank.external_capacitance();
    let resonance = crate::model::evaluate::resonance_of(coil, external, conditions);
    let (low, high) = trimmer_window(coil, tank, conditions);
    let reach = (low.min(high), high.max(low));
    let parts = TankParts {
        fixed: tank.fixed,
        other: external - tank.fixed - tank.stray,
    };
    let tolerances = settings.tolerances.with_stray(stray);
    let band = match kind {
        SpreadKind::Linear => {
            let b = linear_band(coil, &parts, conditions, &tolerances, &[coil.length()]);
            b.first().map_or((f64::NAN, f64::NAN), |p| (p[1], p[2]))
        }
        SpreadKind::Draws => spread(coil, &parts, conditions, &tolerances, DRAWS, SEED).expected,
    };
    let travel = (
        reach.0 - (resonance - band.0).max(0.0),
        reach.1 + (band.1 - resonance).max(0.0),
    );
    let trimmer = format!(
        "the {}–{} pF trimmer",
        super::parts::short(to_pf(tank.trimmer_min)),
        super::parts::short(to_pf(tank.trimmer_max))
    );
    // The travel as the verdict judges it (the trimmer's whole reach at this coil); the
    // travel of a build at the spread's edge is told in the reasons, not refused.
    let flags = band_flags(
        Reach {
            low: reach.0,
            high: reach.1,
        },
        aim.plan.band(),
        aim.edge_margin,
    );
    if let Some(f) = flags.iter().find(|f| {
        matches!(
            f.kind,
            FlagKind::Aeronautical | FlagKind::OutsideBand | FlagKind::HarmonicAeronautical
        )
    }) {
        return Err(Failure {
            stage: Stage::Travel,
            text: travel_text(f.kind, &trimmer, reach, aim),
        });
    }
    if !(band.0 >= reach.0 && band.1 <= reach.1) {
        return Err(Failure {
            stage: Stage::Spread,
            text: format!(
                "the build may land anywhere in {} ({} wide), but {trimmer} reaches only {}",
                mhz_range(band.0, band.1),
                width(band.1 - band.0),
                mhz_range(reach.0, reach.1)
            ),
        });
    }
    let stretch = stretch_sensitivity(coil, external, conditions);
    let squeeze_share = (stretch * 0.1e-3).abs() / (reach.1 - reach.0).max(f64::MIN_POSITIVE);
    if squeeze_share > settings.gentle_share {
        return Err(Failure {
            stage: Stage::Gentle,
            text: format!(
                "squeezing it by 0.1 mm moves {} ({:.0} % of the reach of {trimmer}; at most {:.0} % \
                 is accepted)",
                width(stretch * 0.1e-3),
                100.0 * squeeze_share,
                100.0 * settings.gentle_share
            ),
        });
    }
    let self_resonance = self_resonance.unwrap_or_else(|| {
        let own = crate::physics::medhurst::self_capacitance(
            coil.mean_diameter(),
            coil.length_over_diameter(),
        );
        let lumped = resonance * ((external + own) / own).sqrt();
        lumped / (0.5 * (LUMPED_SELF_RESONANCE_BIAS.low + LUMPED_SELF_RESONANCE_BIAS.high))
    });
    if self_resonance.is_nan() || self_resonance < settings.self_resonance_ratio * travel.1 {
        return Err(Failure {
            stage: Stage::SelfResonance,
            text: format!(
                "its self-resonance ({}) is less than {} times the top of the travel ({})",
                crate::tuning::digits::self_resonance(self_resonance),
                settings.self_resonance_ratio,
                mhz(travel.1)
            ),
        });
    }
    let edge_flags = flags
        .into_iter()
        .filter(|f| f.kind == FlagKind::BandEdge)
        .collect();
    Ok(Judged {
        resonance,
        reach,
        spread: band,
        travel,
        stretch,
        squeeze_share,
        self_resonance,
        edge_flags,
    })
}

/// The travel's failure in words: "the 4–20 pF trimmer's travel (…) crosses 108.000 MHz into
/// the aeronautical band".
fn travel_text(kind: FlagKind, trimmer: &str, reach: (f64, f64), aim: &Aim) -> String {
    let (aero_low, aero_high) = crate::tuning::service::AERONAUTICAL;
    let span = mhz_range(reach.0, reach.1);
    match kind {
        FlagKind::Aeronautical => format!(
            "{trimmer}'s travel ({span}) crosses {} into the aeronautical band",
            if reach.1 >= aero_low && reach.0 < aero_low {
                mhz(aero_low)
            } else {
                mhz(aero_high)
            }
        ),
        FlagKind::HarmonicAeronautical => format!(
            "a harmonic of {trimmer}'s travel ({span}) reaches the aeronautical band (108–137 MHz)"
        ),
        _ => match aim.plan.band() {
            Some(b) => format!("{trimmer}'s travel ({span}) leaves the {}", b.name),
            None => format!("{trimmer}'s travel ({span}) leaves the band"),
        },
    }
}

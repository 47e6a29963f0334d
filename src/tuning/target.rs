//! Where a coil stands against its target channel, and what to do about it: the figures the
//! window's Target panel, the build sheet and the headless commands all show.

use super::advice::{Advice, advise};
use super::bands::BandPlan;
use super::solve::{self, Unreachable};
use crate::model::{Coil, Conditions, Tank, evaluate::resonance_of};

/// Where the coil stands against its target channel.
#[derive(Clone, Debug, PartialEq)]
pub struct TargetFigures {
    /// The target channel centre, hertz.
    pub channel: f64,
    /// The present resonance, hertz.
    pub resonance: f64,
    /// Resonance minus target, hertz.
    pub offset: f64,
    /// Width of one channel of the plan, hertz.
    pub channel_width: f64,
    /// Lowest and highest resonance the trimmer reaches at this spacing, hertz.
    pub window: (f64, f64),
    /// Channels of the plan inside that window, hertz.
    pub in_reach: Vec<f64>,
    /// Coil length that lands on the target at the present trimmer setting (the nearest of
    /// several when the curve turns over), metres.
    pub length_for_target: Result<f64, Unreachable>,
    /// Trimmer setting that lands on the target at the present length, 0–1.
    pub setting_for_target: Result<f64, Unreachable>,
    /// How far the resonance moves per metre of stretch, hertz per metre.
    pub stretch_sensitivity: f64,
    /// Within this of the channel centre counts as on channel, hertz.
    pub tolerance: f64,
    /// Whether the resonance is within the tolerance.
    pub on_channel: bool,
    /// The one instruction that lands the target.
    pub advice: Advice,
}

/// Channel width assumed for a custom list with fewer than two channels, hertz.
const CUSTOM_CHANNEL_WIDTH: f64 = 100e3;

/// Width of one channel of `channels` (the smallest spacing), hertz.
pub fn channel_width(channels: &[f64]) -> f64 {
    channels
        .windows(2)
        .map(|w| w[1] - w[0])
        .filter(|d| *d > 0.0)
        .fold(None, |acc: Option<f64>, d| {
            Some(acc.map_or(d, |a| a.min(d)))
        })
        .unwrap_or(CUSTOM_CHANNEL_WIDTH)
}

/// The target figures of `coil` in `tank` aimed at `channel` hertz of `plan`, on channel within
/// `tolerance` hertz (pass the calibrated tank and conditions once there are bench readings).
pub fn target_figures(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    plan: &BandPlan,
    channel: f64,
    tolerance: f64,
) -> TargetFigures {
    let external = tank.external_capacitance();
    let resonance = resonance_of(coil, external, conditions);
    let window = solve::trimmer_window(coil, tank, conditions);
    TargetFigures {
        channel,
        resonance,
        offset: resonance - channel,
        channel_width: channel_width(&plan.channels()),
        window,
        in_reach: plan.within(window.0, window.1),
        length_for_target: solve::length_for_target(coil, external, conditions, channel),
        setting_for_target: solve::setting_for_target(coil, tank, conditions, channel),
        stretch_sensitivity: solve::stretch_sensitivity(coil, external, conditions),
        tolerance,
        on_channel: (resonance - channel).abs() <= tolerance,
        advice: advise(coil, tank, conditions, channel, tolerance),
    }
}

//! Where a coil stands against its target channel, and what to do about it: the figures the
//! window's Target panel, the build sheet and the headless commands all show.

use super::advice::{Advice, advise, advise_landed};
use super::bands::BandPlan;
use super::landing::{self, FieldLed};
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
/// `tolerance` hertz (pass the calibrated tank and conditions once there are bench readings),
/// on the classical shape alone (see [`target_figures_on`]).
pub fn target_figures(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    plan: &BandPlan,
    channel: f64,
    tolerance: f64,
) -> TargetFigures {
    target_figures_on(coil, tank, conditions, plan, channel, tolerance, None)
}

/// [`target_figures`] on the field-led model `led` when given: the trimmer's reach, the
/// length and setting for the target, the kHz per mm and the advice all come from field
/// solves of the coils they name ([`super::landing`]); `conditions` is the classical model
/// moved onto the field-led resonance at the present coil (as [`crate::recipe::figures()`]
/// gives it), the start of every search and the fallback where a field solve fails.
pub fn target_figures_on(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    plan: &BandPlan,
    channel: f64,
    tolerance: f64,
    led: Option<&FieldLed>,
) -> TargetFigures {
    let external = tank.external_capacitance();
    let resonance = resonance_of(coil, external, conditions);
    let classical_window = solve::trimmer_window(coil, tank, conditions);
    let Some(led) = led else {
        return TargetFigures {
            channel,
            resonance,
            offset: resonance - channel,
            channel_width: channel_width(&plan.channels()),
            window: classical_window,
            in_reach: plan.within(classical_window.0, classical_window.1),
            length_for_target: solve::length_for_target(coil, external, conditions, channel),
            setting_for_target: solve::setting_for_target(coil, tank, conditions, channel),
            stretch_sensitivity: solve::stretch_sensitivity(coil, external, conditions),
            tolerance,
            on_channel: (resonance - channel).abs() <= tolerance,
            advice: advise(coil, tank, conditions, channel, tolerance),
        };
    };
    let at = |setting: f64, fallback: f64| {
        led.resonance(coil, tank.external_capacitance_at(setting))
            .unwrap_or(fallback)
    };
    let window = (at(1.0, classical_window.0), at(0.0, classical_window.1));
    let found = landing::lengths(led, coil, external, conditions, channel);
    let setting_for_target = if (window.0..=window.1).contains(&channel) {
        let start = solve::setting_for_target(coil, tank, conditions, channel)
            .unwrap_or(tank.trimmer_setting);
        Ok(landing::land_setting(led, coil, tank, channel, start).unwrap_or(start))
    } else {
        Err(Unreachable::OutsideTrimmer {
            low: window.0,
            high: window.1,
        })
    };
    let advice = advise_landed(
        coil,
        tank,
        conditions,
        channel,
        tolerance,
        led,
        resonance,
        found.clone(),
    );
    TargetFigures {
        channel,
        resonance,
        offset: resonance - channel,
        channel_width: channel_width(&plan.channels()),
        window,
        in_reach: plan.within(window.0, window.1),
        length_for_target: found.map(|f| f.landed.length),
        setting_for_target,
        stretch_sensitivity: landing::stretch_sensitivity(led, coil, external)
            .unwrap_or_else(|| solve::stretch_sensitivity(coil, external, conditions)),
        tolerance,
        on_channel: (resonance - channel).abs() <= tolerance,
        advice,
    }
}

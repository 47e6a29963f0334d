//! One instruction for a stage that will not start, starts with too little margin or starts
//! too hard: the one part to change and the preferred value to change it to.
//!
//! The changes tried, in the builder's order of preference: the emitter resistor (it sets the
//! current, and so g_m, without moving the tank), the lower bias resistor (when the
//! transistor is not in its active region), then the divider's lower capacitor (the divider's
//! ratio; the tank then needs retrimming). Each value of the E12 series (IEC 60063:2015,
//! through [`crate::tuning::design::parts::e_series_between`]) is put through the same
//! analysis; the one nearest the present value whose loop gain lands between
//! [`RELIABLE_LOOP_GAIN`] and [`TOO_HARD_LOOP_GAIN`] with the transistor active and within its
//! ratings is proposed.

use super::{RELIABLE_LOOP_GAIN, StageFigures, StageInputs, Start, TOO_HARD_LOOP_GAIN, analyse};
use crate::model::{Coil, Conditions, FeedbackDivider, Tank};
use crate::tuning::design::parts::e_series_between;

/// A change and what it gives.
struct Proposal {
    text: String,
    distance: f64,
}

fn ohms(r: f64) -> String {
    if r >= 1e6 {
        format!("{} MΩ", trim(r / 1e6))
    } else if r >= 1e3 {
        format!("{} kΩ", trim(r / 1e3))
    } else {
        format!("{} Ω", trim(r))
    }
}

fn trim(v: f64) -> String {
    let s = format!("{v:.2}");
    s.trim_end_matches('0').trim_end_matches('.').to_owned()
}

fn acceptable(f: &StageFigures) -> bool {
    f.active
        && f.rating_faults.is_empty()
        && (RELIABLE_LOOP_GAIN..=TOO_HARD_LOOP_GAIN).contains(&f.loop_gain)
}

/// The nearest acceptable value of the E12 series from `low` to `high` for a part now at
/// `present`, with `apply` building the stage with that value.
fn nearest(
    present: f64,
    low: f64,
    high: f64,
    apply: impl Fn(f64) -> Option<StageFigures>,
) -> Option<(f64, StageFigures)> {
    let values = e_series_between(12, low, high)?;
    values
        .into_iter()
        .filter(|v| (v / present - 1.0).abs() > 1e-6)
        .filter_map(|v| apply(v).filter(acceptable).map(|f| (v, f)))
        .min_by(|a, b| {
            (a.0 / present)
                .ln()
                .abs()
                .total_cmp(&(b.0 / present).ln().abs())
        })
}

/// The advice for the stage analysed as `now`.
pub fn advise(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    inputs: &StageInputs,
    now: &StageFigures,
) -> String {
    if acceptable(now) {
        return format!(
            "Nothing to change: the loop gain {:.1} lies within the usual {RELIABLE_LOOP_GAIN:.0}–\
             {TOO_HARD_LOOP_GAIN:.0} (common practice).",
            now.loop_gain
        );
    }
    let with_inputs = |i: StageInputs, t: &Tank| analyse(coil, t, conditions, &i).ok();
    let mut proposals: Vec<Proposal> = Vec::new();
    let b = inputs.bias;
    let why = match now.start {
        Start::TooHard => "to tame the start",
        Start::NotBiased => "to bring the transistor into its active region",
        _ => "for a reliable start",
    };
    if let Some((v, f)) = nearest(b.emitter, 10.0, 1e6, |v| {
        let mut i = inputs.clone();
        i.bias.emitter = v;
        with_inputs(i, tank)
    }) {
        proposals.push(Proposal {
            text: format!(
                "Change the emitter resistor from {} to {} (E12) {why}: loop gain {:.1}, \
                 collector current {:.2} mA.",
                ohms(b.emitter),
                ohms(v),
                f.loop_gain,
                f.operating_point.collector_current * 1e3
            ),
            distance: 0.0,
        });
    }
    if proposals.is_empty()
        && let Some((v, f)) = nearest(b.lower, 100.0, 1e6, |v| {
            let mut i = inputs.clone();
            i.bias.lower = v;
            with_inputs(i, tank)
        })
    {
        proposals.push(Proposal {
            text: format!(
                "Change the lower bias resistor from {} to {} (E12) {why}: loop gain {:.1}, \
                 collector current {:.2} mA.",
                ohms(b.lower),
                ohms(v),
                f.loop_gain,
                f.operating_point.collector_current * 1e3
            ),
            distance: 1.0,
        });
    }
    if proposals.is_empty()
        && let Some(d) = tank.feedback
        && let Some((v, f)) = nearest(d.lower * 1e12, 1.0, 1000.0, |v| {
            let t = Tank {
                feedback: Some(FeedbackDivider {
                    upper: d.upper,
                    lower: v * 1e-12,
                }),
                ..*tank
            };
            with_inputs(inputs.clone(), &t)
        })
    {
        proposals.push(Proposal {
            text: format!(
                "Change the divider's lower capacitor from {} pF to {} pF (E12; ratio 1:{:.1}) \
                 {why}, then retrim the tank: loop gain {:.1}.",
                trim(d.lower * 1e12),
                trim(v),
                v * 1e-12 / d.upper,
                f.loop_gain
            ),
            distance: 2.0,
        });
    }
    proposals
        .into_iter()
        .min_by(|a, b| a.distance.total_cmp(&b.distance))
        .map(|p| p.text)
        .unwrap_or_else(|| {
            format!(
                "No single E12 change of the emitter resistor, the lower bias resistor or the \
                 divider's lower capacitor brings the loop gain ({:.1}) within {RELIABLE_LOOP_GAIN:.0}–\
                 {TOO_HARD_LOOP_GAIN:.0}: a better coil (higher Q) or a faster transistor is needed.",
                now.loop_gain
            )
        })
}

//! One instruction for a stage that will not start, starts with too little margin or starts
//! too hard: the one part to change and the preferred value to change it to.
//!
//! The changes tried, in the builder's order of preference: the emitter resistor (it sets the
//! current, and so g_m, without moving the tank), the lower bias resistor (when the
//! transistor is not in its active region), then the divider's lower capacitor (the divider's
//! ratio; the tank then needs retrimming). Each value of the E12 series (IEC 60063:2015,
//! one decade from [`crate::tuning::design::parts::e_series`], here over 1 Ω–10 MΩ and
//! 1 pF–1 nF) is put through the same
//! analysis; the one nearest the present value whose loop gain lands between
//! [`RELIABLE_LOOP_GAIN`] and [`TOO_HARD_LOOP_GAIN`] with the transistor active and within its
//! ratings is proposed.

use super::{RELIABLE_LOOP_GAIN, StageFigures, StageInputs, Start, TOO_HARD_LOOP_GAIN, analyse};
use crate::model::{Coil, Conditions, FeedbackDivider, Tank};
use crate::tuning::design::parts::e_series;
use crate::units::{to_kohm, to_ma, to_megohm, to_pf};

/// The part the advice changes.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Part {
    /// The emitter resistor (ohms).
    EmitterResistor,
    /// The base divider's lower resistor (ohms).
    LowerBiasResistor,
    /// The feedback divider's lower capacitor (farads).
    LowerDividerCapacitor,
}

impl Part {
    /// The JSON's name.
    pub fn json_name(self) -> &'static str {
        match self {
            Part::EmitterResistor => "emitter_resistor",
            Part::LowerBiasResistor => "lower_bias_resistor",
            Part::LowerDividerCapacitor => "lower_divider_capacitor",
        }
    }
}

/// One change of one part to a value of the E12 series (SI: ohms or farads).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Change {
    /// The part.
    pub part: Part,
    /// Its value now.
    pub from: f64,
    /// The value proposed.
    pub to: f64,
    /// The loop gain with the change made.
    pub loop_gain: f64,
    /// The collector current with the change made, amperes.
    pub collector_current: f64,
}

impl Change {
    /// `inputs` and `tank` with the change made.
    pub fn apply(&self, inputs: &StageInputs, tank: &Tank) -> (StageInputs, Tank) {
        let (mut i, mut t) = (inputs.clone(), *tank);
        match self.part {
            Part::EmitterResistor => i.bias.emitter = self.to,
            Part::LowerBiasResistor => i.bias.lower = self.to,
            Part::LowerDividerCapacitor => {
                if let Some(d) = t.feedback {
                    t.feedback = Some(FeedbackDivider {
                        upper: d.upper,
                        lower: self.to,
                    });
                }
            }
        }
        (i, t)
    }
}

fn ohms(r: f64) -> String {
    if r >= 1e6 {
        format!("{} MΩ", trim(to_megohm(r)))
    } else if r >= 1e3 {
        format!("{} kΩ", trim(to_kohm(r)))
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

/// The E12 values from `low` to `high` (same unit), each decade from 1e-3 to 1e7 of the unit.
fn e12_between(low: f64, high: f64) -> Option<Vec<f64>> {
    let series = e_series(12)?;
    let mut out = Vec::new();
    for decade in -3..=7 {
        let scale = 10f64.powi(decade);
        for &m in series {
            // Rounded to the series' two figures, so 10^k·m does not drift.
            let v = (m * scale * 1e4).round() / 1e4;
            if v >= low * (1.0 - 1e-9) && v <= high * (1.0 + 1e-9) {
                out.push(v);
            }
        }
    }
    Some(out)
}

/// The nearest acceptable value of the E12 series from `low` to `high` for a part now at
/// `present`, with `apply` building the stage with that value.
fn nearest(
    present: f64,
    low: f64,
    high: f64,
    apply: impl Fn(f64) -> Option<StageFigures>,
) -> Option<(f64, StageFigures)> {
    let values = e12_between(low, high)?;
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

/// The one change that brings the loop gain of the stage analysed as `now` within
/// [`RELIABLE_LOOP_GAIN`]–[`TOO_HARD_LOOP_GAIN`], the transistor active and within its
/// ratings: the emitter resistor if any E12 value of it will do, else the lower bias resistor,
/// else the divider's lower capacitor; each the value nearest the present one. `None` when the
/// stage needs no change or no single change will do.
pub fn propose(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    inputs: &StageInputs,
    now: &StageFigures,
) -> Option<Change> {
    if acceptable(now) {
        return None;
    }
    let b = inputs.bias;
    let tries: [(Part, f64, f64, f64); 3] = [
        (Part::EmitterResistor, b.emitter, 10.0, 1e6),
        (Part::LowerBiasResistor, b.lower, 100.0, 1e6),
        (
            Part::LowerDividerCapacitor,
            tank.feedback.map_or(0.0, |d| to_pf(d.lower)),
            1.0,
            1000.0,
        ),
    ];
    tries.into_iter().find_map(|(part, present, low, high)| {
        if present <= 0.0 {
            return None;
        }
        // The divider's capacitor is searched in picofarads (the series' decades).
        let unit = if part == Part::LowerDividerCapacitor {
            1e-12
        } else {
            1.0
        };
        let (to, f) = nearest(present, low, high, |v| {
            let probe = Change {
                part,
                from: present * unit,
                to: v * unit,
                loop_gain: 0.0,
                collector_current: 0.0,
            };
            let (i, t) = probe.apply(inputs, tank);
            analyse(coil, &t, conditions, &i).ok()
        })?;
        Some(Change {
            part,
            from: present * unit,
            to: to * unit,
            loop_gain: f.loop_gain,
            collector_current: f.operating_point.collector_current,
        })
    })
}

/// The advice in one instruction for the stage analysed as `now`, with the change it names.
pub fn advise(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    inputs: &StageInputs,
    now: &StageFigures,
) -> (String, Option<Change>) {
    if acceptable(now) {
        let text = format!(
            "Nothing to change: the loop gain {:.1} lies within the usual {RELIABLE_LOOP_GAIN:.0}–\
             {TOO_HARD_LOOP_GAIN:.0} (common practice).",
            now.loop_gain
        );
        return (text, None);
    }
    let why = match now.start {
        Start::TooHard => "to tame the start",
        Start::NotBiased => "to bring the transistor into its active region",
        _ => "for a reliable start",
    };
    let change = propose(coil, tank, conditions, inputs, now);
    let text = match change {
        Some(c) => match c.part {
            Part::EmitterResistor | Part::LowerBiasResistor => format!(
                "Change the {} from {} to {} (E12) {why}: loop gain {:.1}, collector current \
                 {:.2} mA.",
                if c.part == Part::EmitterResistor {
                    "emitter resistor"
                } else {
                    "lower bias resistor"
                },
                ohms(c.from),
                ohms(c.to),
                c.loop_gain,
                to_ma(c.collector_current)
            ),
            Part::LowerDividerCapacitor => format!(
                "Change the divider's lower capacitor from {} pF to {} pF (E12; ratio 1:{:.1}) \
                 {why}, then retrim the tank: loop gain {:.1}.",
                trim(to_pf(c.from)),
                trim(to_pf(c.to)),
                c.to / tank.feedback.map_or(c.to, |d| d.upper),
                c.loop_gain
            ),
        },
        None => format!(
            "No single E12 change of the emitter resistor, the lower bias resistor or the \
             divider's lower capacitor brings the loop gain ({:.1}) within \
             {RELIABLE_LOOP_GAIN:.0}–{TOO_HARD_LOOP_GAIN:.0}: a better coil (higher Q) or a \
             faster transistor is needed.",
            now.loop_gain
        ),
    };
    (text, change)
}

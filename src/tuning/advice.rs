//! What to do next at the bench, at the resolution of a hand.
//!
//! The advice is one instruction: stretch or squeeze to a length; or, when that change is
//! smaller than a builder can set, leave the coil and set the trimmer; or, when no length
//! reaches the channel, change the turns by quarter turns and wind to a length.

use super::landing::{self, FieldLed};
use super::solve::{Unreachable, length_for_target, setting_for_target, turns_for_target};
use crate::model::{Coil, Conditions, Tank};
use crate::units::{to_khz, to_mm, to_pf};
use std::fmt;

/// The smallest change in coil length a builder can set by hand, metres (about 0.1 mm: common
/// practice for a coil stretched with fingers or a plastic tool).
pub const HAND_RESOLUTION: f64 = 0.1e-3;

/// One instruction that lands the target.
#[derive(Clone, Debug, PartialEq)]
pub enum Advice {
    /// The tank is already within the on-channel tolerance: leave it.
    OnChannel {
        /// Resonance minus target, hertz.
        offset: f64,
    },
    /// Stretch (positive change) or squeeze the coil to `length`.
    Stretch {
        /// The length that lands the target, metres.
        length: f64,
        /// From the present length, metres (positive: stretch).
        change: f64,
        /// How many lengths land the target (more than one where the curve turns over; the
        /// one nearest the present length is proposed).
        roots: usize,
        /// At that length stretching further lowers the frequency (the curve has turned
        /// over: long leads, or near the coil's self-resonance).
        falling: bool,
    },
    /// The change in length is below [`HAND_RESOLUTION`]: leave the coil, set the trimmer.
    SetTrimmer {
        /// The setting that lands the target, 0–1.
        setting: f64,
        /// The length change it replaces, metres.
        instead_of: f64,
        /// When a whole per cent of the trimmer's travel there moves the tank more than the
        /// channel's tolerance (the setting is finer than a hand can find): by how much, and
        /// the smaller trimmer or series capacitor that would make it settable.
        coarse: Option<CoarseTrimmer>,
    },
    /// No length reaches the target with the present turns.
    ChangeTurns {
        /// The present turns.
        from: f64,
        /// The turns that reach it.
        to: f64,
        /// The length that then lands the target, metres.
        length: f64,
    },
    /// Nothing within reach lands the target.
    OutOfReach(String),
}

/// The resolution a hand sets a trimmer to: one per cent of its travel (about 3.6° of a
/// half-turn trimmer's 180°: common practice for a trimmer turned with a plastic tool).
pub const TRIMMER_HAND_STEP: f64 = 0.01;

/// A trimmer too coarse for the channel at the setting proposed: one [`TRIMMER_HAND_STEP`] of
/// its travel moves the tank more than the channel's tolerance, and what would make it
/// settable.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct CoarseTrimmer {
    /// How far one per cent of travel moves the resonance there, hertz.
    pub per_step: f64,
    /// The channel's on-channel tolerance, hertz.
    pub tolerance: f64,
    /// The largest span (maximum − minimum capacitance) a trimmer may have for one per cent
    /// to move the tank by the tolerance at most, farads.
    pub span_at_most: f64,
    /// The largest capacitor in series with the present trimmer that does the same, farads.
    pub series_at_most: f64,
    /// What to add to the fixed capacitor beside that series capacitor, so that the tank keeps
    /// its capacitance at the setting proposed, farads.
    pub fixed_added: f64,
}

impl CoarseTrimmer {
    /// Whether one per cent of the travel of `tank`'s trimmer at `setting` moves the
    /// resonance of `coil` (under `conditions`) by more than `tolerance` hertz, and if so
    /// what would not.
    ///
    /// # Method
    /// The step is the resonance difference across ±½ % of travel (the classical model moved
    /// onto the field-led resonance at the present coil; its slope in capacitance is the
    /// field solution's within the factor's small change across one per cent). The
    /// resonance moves in proportion to the trimmer's capacitance step, so a span scaled by
    /// tolerance/step moves it by the tolerance. A capacitor Cs in series with the trimmer
    /// Ct scales its steps by (Cs/(Ct + Cs))², so Cs = Ct·k/(1 − k) with k = √(tolerance/step)
    /// does the same; it takes Ct²/(Ct + Cs) from the tank at the setting, which the fixed
    /// capacitor gets back.
    pub fn check(
        coil: &Coil,
        tank: &Tank,
        conditions: &Conditions,
        setting: f64,
        tolerance: f64,
    ) -> Option<CoarseTrimmer> {
        let half = 0.5 * TRIMMER_HAND_STEP;
        let s = setting.clamp(half, 1.0 - half);
        let f = |x: f64| {
            crate::model::evaluate::resonance_of(coil, tank.external_capacitance_at(x), conditions)
        };
        let per_step = (f(s - half) - f(s + half)).abs();
        if !(per_step.is_finite() && tolerance > 0.0 && per_step > tolerance) {
            return None;
        }
        let ratio = tolerance / per_step;
        let ct = tank.trimmer_at(setting);
        let k = ratio.sqrt();
        let series_at_most = ct * k / (1.0 - k);
        Some(CoarseTrimmer {
            per_step,
            tolerance,
            span_at_most: (tank.trimmer_max - tank.trimmer_min) * ratio,
            series_at_most,
            fixed_added: ct * ct / (ct + series_at_most),
        })
    }

    /// What to do about it, in a builder's words.
    pub fn text(&self) -> String {
        // Rounded down (span, series) and to the nearest (the fixed part): 0.1 pF.
        let down = |farads: f64| (farads * 1e13).floor() / 10.0;
        format!(
            "a whole per cent of its travel there moves the tank {:.0} kHz, more than the \
             ±{:.0} kHz the channel allows, so a hand cannot set it: fit a trimmer whose \
             travel spans at most {:.1} pF, or put at most {:.1} pF in series with this one \
             and add {:.1} pF to the fixed capacitor",
            to_khz(self.per_step),
            to_khz(self.tolerance),
            down(self.span_at_most),
            down(self.series_at_most),
            to_pf(self.fixed_added)
        )
    }
}

/// The coil and trimmer the advice lands on.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Proposal {
    /// Coil length (turns × pitch), metres.
    pub length: f64,
    /// Turns.
    pub turns: f64,
    /// Trimmer setting, 0–1.
    pub trimmer_setting: f64,
}

impl Advice {
    /// The coil and trimmer setting after following the advice, starting from `coil` with the
    /// trimmer at `setting`; `None` when nothing lands the target.
    pub fn proposal(&self, coil: &Coil, setting: f64) -> Option<Proposal> {
        let (length, turns, trimmer_setting) = match *self {
            Advice::Stretch { length, .. } => (length, coil.turns(), setting),
            Advice::SetTrimmer { setting, .. } => (coil.length(), coil.turns(), setting),
            Advice::ChangeTurns { to, length, .. } => (length, to, setting),
            Advice::OnChannel { .. } => (coil.length(), coil.turns(), setting),
            Advice::OutOfReach(_) => return None,
        };
        Some(Proposal {
            length,
            turns,
            trimmer_setting,
        })
    }

    /// The resonance (hertz) the proposal gives in `tank`: on the field-led model `led` when
    /// given (a field solve of the proposed coil, what the figures will say once it is built),
    /// else the classical model under `conditions`.
    pub fn predicted(
        &self,
        coil: &Coil,
        tank: &Tank,
        conditions: &Conditions,
        led: Option<&FieldLed>,
    ) -> Option<f64> {
        let p = self.proposal(coil, tank.trimmer_setting)?;
        let proposed = coil.with_turns(p.turns, p.length).ok()?;
        let external = tank.external_capacitance_at(p.trimmer_setting);
        led.and_then(|led| led.resonance(&proposed, external))
            .or_else(|| {
                Some(crate::model::evaluate::resonance_of(
                    &proposed, external, conditions,
                ))
            })
    }

    /// The instruction in a builder's words, lengths shown by `show` (display units).
    pub fn text(&self, show: impl Fn(f64) -> String) -> String {
        match self {
            Advice::Stretch {
                length,
                change,
                roots,
                falling,
            } => {
                let verb = if *change >= 0.0 { "stretch" } else { "squeeze" };
                let mut s = format!(
                    "{verb} the coil by {} to {}",
                    show(change.abs()),
                    show(*length)
                );
                if *roots > 1 {
                    s.push_str(&format!(
                        " (the nearest of {roots} lengths that land the channel)"
                    ));
                }
                if *falling {
                    s.push_str(
                        "; there, stretching further lowers the frequency and squeezing \
                         raises it",
                    );
                }
                s
            }
            Advice::SetTrimmer {
                setting,
                instead_of,
                coarse,
            } => {
                let mut s = format!(
                    "leave the coil (the stretch needed, {}, is below what a hand can set) and \
                     set the trimmer to {:.0} %",
                    show(instead_of.abs()),
                    setting * 100.0
                );
                if let Some(c) = coarse {
                    s.push_str(" — though ");
                    s.push_str(&c.text());
                }
                s
            }
            Advice::ChangeTurns { from, to, length } => {
                let quarters = ((to - from) * 4.0).round();
                let verb = if quarters > 0.0 { "add" } else { "remove" };
                format!(
                    "no length reaches the channel with {from} turns: {verb} {} quarter turn{} \
                     ({to} turns) and wind to {}",
                    quarters.abs(),
                    if quarters.abs() == 1.0 { "" } else { "s" },
                    show(*length)
                )
            }
            Advice::OutOfReach(why) => why.clone(),
            Advice::OnChannel { offset } => format!(
                "on channel ({:+.1} kHz): leave the coil and the trimmer as they are",
                to_khz(*offset)
            ),
        }
    }
}

impl fmt::Display for Advice {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(&self.text(|m| format!("{:.2} mm", to_mm(m))))
    }
}

/// The one instruction that lands `coil` in `tank` on `target` hertz, or leaves it when it is
/// within `tolerance` hertz of it (pass the calibrated tank and conditions once there are
/// readings), on the classical shape alone (see [`advise_on`] for the field-led model).
pub fn advise(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    target: f64,
    tolerance: f64,
) -> Advice {
    let external = tank.external_capacitance();
    let offset = crate::model::evaluate::resonance_of(coil, external, conditions) - target;
    let found = super::solve::lengths_for_target(coil, external, conditions, target).map(|roots| {
        let length = length_for_target(coil, external, conditions, target).unwrap_or(coil.length());
        (length, roots.len(), false)
    });
    decide(
        coil,
        offset,
        tolerance,
        found,
        || setting_for_target(coil, tank, conditions, target).ok(),
        |_| turns_for_target(coil, external, conditions, target),
    )
    .at_hand_resolution(coil, tank, conditions, tolerance)
}

/// The one instruction on the field-led model `led` (`None`: the classical shape, as
/// [`advise`]): every length and setting it proposes is landed with field solves of the
/// proposed coil ([`super::landing`]), so the tool's own evaluation of the proposal is within
/// [`super::landing::LANDING`] of the target.
pub fn advise_on(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    target: f64,
    tolerance: f64,
    led: Option<&FieldLed>,
) -> Advice {
    let Some(led) = led else {
        return advise(coil, tank, conditions, target, tolerance);
    };
    let external = tank.external_capacitance();
    let present = led
        .resonance(coil, external)
        .unwrap_or_else(|| crate::model::evaluate::resonance_of(coil, external, conditions));
    let found = landing::lengths(led, coil, external, conditions, target);
    advise_landed(
        coil, tank, conditions, target, tolerance, led, present, found,
    )
}

/// [`advise_on`] with the present field-led resonance and the landed length already found.
#[expect(
    clippy::too_many_arguments,
    reason = "the landed pieces are computed once by the target figures and handed on"
)]
pub fn advise_landed(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    target: f64,
    tolerance: f64,
    led: &FieldLed,
    present: f64,
    found: Result<landing::Found, Unreachable>,
) -> Advice {
    let external = tank.external_capacitance();
    let found = found.map(|f| (f.landed.length, f.roots, f.landed.slope < 0.0));
    decide(
        coil,
        present - target,
        tolerance,
        found,
        || {
            let start =
                setting_for_target(coil, tank, conditions, target).unwrap_or(tank.trimmer_setting);
            landing::land_setting(led, coil, tank, target, start)
        },
        |why| landing::turns(led, coil, external, conditions, target, why),
    )
    .at_hand_resolution(coil, tank, conditions, tolerance)
}

impl Advice {
    /// A trimmer setting checked against the resolution of a hand ([`CoarseTrimmer::check`]);
    /// every other instruction as it is.
    fn at_hand_resolution(
        self,
        coil: &Coil,
        tank: &Tank,
        conditions: &Conditions,
        tolerance: f64,
    ) -> Advice {
        match self {
            Advice::SetTrimmer {
                setting,
                instead_of,
                ..
            } => Advice::SetTrimmer {
                setting,
                instead_of,
                coarse: CoarseTrimmer::check(coil, tank, conditions, setting, tolerance),
            },
            other => other,
        }
    }
}

/// The instruction from the offset, the length found (length, roots, falling) and, when
/// needed, the trimmer setting and the change of turns.
fn decide(
    coil: &Coil,
    offset: f64,
    tolerance: f64,
    found: Result<(f64, usize, bool), Unreachable>,
    setting: impl FnOnce() -> Option<f64>,
    turns: impl FnOnce(&Unreachable) -> Option<super::solve::TurnsChange>,
) -> Advice {
    if offset.abs() <= tolerance {
        return Advice::OnChannel { offset };
    }
    match found {
        Ok((length, roots, falling)) => {
            let change = length - coil.length();
            if change.abs() < HAND_RESOLUTION
                && let Some(setting) = setting()
            {
                return Advice::SetTrimmer {
                    setting,
                    instead_of: change,
                    coarse: None,
                };
            }
            Advice::Stretch {
                length,
                change,
                roots,
                falling,
            }
        }
        Err(why) => match turns(&why) {
            Some(t) => Advice::ChangeTurns {
                from: coil.turns(),
                to: t.turns,
                length: t.length,
            },
            None => Advice::OutOfReach(why.to_string()),
        },
    }
}

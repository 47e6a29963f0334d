//! The tank's resonance with the coil's field-solved apparent inductance, and which figure
//! leads: the field solution when it is available, the classical engine's otherwise.
//!
//! The classical engine ([`crate::model::evaluate()`]) puts Medhurst's self-capacitance beside
//! the quasi-static inductance. The field solution ([`crate::physics::field`]) gives the
//! coil's whole terminal reactance X(f) (helix, leads and the closing path, with the wire's own
//! capacitance and the propagation along it), so the tank across the external capacitance C
//! resonates where the terminal susceptances cancel: ω·C = 1/X(ω), i.e.
//! f = 1/(2π√(L_app(f)·C)) with L_app = X/ω. The self-capacitance is then not added again.
//!
//! The field solution leads by moving the classical model onto it: [`matching_scale`] is the
//! factor on the model's inductance that makes the model meet the field-solved resonance at
//! the present coil, and [`FieldBasis`] records what was applied. Away from the present coil
//! the factor changes; what the tool proposes there is landed on field solves of the proposed
//! coil ([`crate::tuning::landing`]), and the field shape ([`crate::tuning::landing::Shape`])
//! carries the factor along a chart.
//! [`crate::recipe::figures()`] (the headless commands, the build sheet) and the window's
//! cached evaluation both go through [`FieldBasis::of`].

use crate::model::{Coil, Conditions, wire_coil};
use crate::physics::field::{Feed, FieldError, FieldModel};
use std::f64::consts::PI;

/// Relative tolerance on the field-solved tank resonance (0.1 Hz at 100 MHz).
pub const TOLERANCE: f64 = 1e-9;

/// The tank solved with the field-solved apparent inductance.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct FieldTank {
    /// Resonance of the coil across the external capacitance, hertz.
    pub resonance: f64,
    /// Apparent inductance X/ω at that resonance, henries (coil, leads and closing path).
    pub apparent_inductance: f64,
    /// Series resistance Re Z there, ohms (skin effect and radiation; no proximity effect).
    pub series_resistance: f64,
    /// The coil's first parallel self-resonance at the terminals, hertz.
    pub self_resonance: f64,
    /// The inductance an LCR meter reads, henries: the low-frequency inductance of the same
    /// wire, X/ω·(1 − (f/f_self)²) at a tenth of the self-resonance (where X/ω is within 1 %
    /// of it and the lumped correction leaves some 1e-4), as against the apparent inductance
    /// X/ω at the operating frequency. NaN where the self-resonance was not searched for.
    pub low_frequency_inductance: f64,
    /// Segments the wire was cut into.
    pub segments: usize,
    /// Impedance evaluations the resonance took (after the self-resonance's search).
    pub evaluations: usize,
}

impl FieldTank {
    /// The coil's self-capacitance on the field solution, farads: the lumped capacitance that
    /// resonates the low-frequency inductance at the field-solved self-resonance,
    /// 1/((2π·f_self)²·L₀). Where the field solution leads this is the coil's figure;
    /// Medhurst's stays a labelled classical comparison.
    pub fn self_capacitance(&self) -> f64 {
        let w = 2.0 * PI * self.self_resonance;
        1.0 / (w * w * self.low_frequency_inductance)
    }

    /// Unloaded Q of the coil there, X/R (optimistic: no proximity effect, see
    /// [`crate::physics::field`]).
    pub fn q(&self) -> f64 {
        2.0 * PI * self.resonance * self.apparent_inductance / self.series_resistance
    }
}

/// What of `conditions` the field solution uses: the temperature, with the defaults for the
/// rest (a change of the driving model or a calibration leaves the field solution as it is, so
/// the window's worker is not asked again for it).
pub fn field_conditions(conditions: &Conditions) -> Conditions {
    Conditions {
        temperature_c: conditions.temperature_c,
        ..Conditions::default()
    }
}

/// Solve the tank of `coil` across `external_capacitance` farads at the conditions'
/// temperature with the field solution (nothing else of `conditions` enters).
///
/// # Formula
/// With φ(f) = ln(ω²·C·L_app(f)), the resonance is φ = 0. On ln f, φ rises with slope
/// 2 + d ln L_app/d ln f, which is above 2 where the self-resonance makes X/ω climb, and only
/// a little below 2 at the low end, where the wire's internal inductance falls (at most as
/// f^(−1/2) on a fraction of L), so φ has one root below the self-resonance. From the start
/// (the classical resonance, clamped below the field-solved self-resonance) the fixed-point
/// step f' = f·e^(−φ(f)/2) = 1/(2π√(L_app(f)·C)) moves towards the root: past it where X/ω
/// rises with f, short of it where it falls; secant steps through the last two points follow
/// until φ changes sign, and the Illinois variant of regula falsi on ln f (Dowell and Jarratt,
/// BIT 11, 1971) closes the bracket to [`TOLERANCE`]. Usually four to eight impedance
/// evaluations.
///
/// Neither the field solution's factor nor a bench calibration's is applied here: the field
/// solution is of the wire as drawn (see [`FieldBasis`] for how it then leads).
pub fn field_tank(
    coil: &Coil,
    external_capacitance: f64,
    conditions: &Conditions,
) -> Result<FieldTank, FieldError> {
    field_tank_scaled(coil, external_capacitance, conditions, 1.0)
}

/// [`field_tank`] with the field-solved apparent inductance multiplied by `scale` (a bench
/// calibration's inductance scale on the field solution, [`crate::tuning::landing`]): the
/// resonance where ω·C·scale·X(ω) = 1. The returned `apparent_inductance` is the wire's own
/// X/ω (unscaled).
pub fn field_tank_scaled(
    coil: &Coil,
    external_capacitance: f64,
    conditions: &Conditions,
    scale: f64,
) -> Result<FieldTank, FieldError> {
    if !(scale.is_finite() && scale > 0.0) {
        return Err(FieldError::Geometry(
            "the inductance scale on the field solution is not a positive number".to_owned(),
        ));
    }
    solve_tank(coil, external_capacitance, conditions, scale, true)
}

/// The resonance alone of [`field_tank_scaled`], hertz, without the search for the coil's
/// self-resonance (which takes some sixteen impedance evaluations of the twenty a tank
/// takes): for the solvers that land an instruction on many candidate coils
/// ([`crate::tuning::landing`]). The same root to [`TOLERANCE`]: the search starts from the
/// classical resonance and steps back from any frequency where the reactance is not
/// inductive (at or above the self-resonance) instead of being kept below it.
pub fn field_resonance(
    coil: &Coil,
    external_capacitance: f64,
    conditions: &Conditions,
    scale: f64,
) -> Result<f64, FieldError> {
    if !(scale.is_finite() && scale > 0.0) {
        return Err(FieldError::Geometry(
            "the inductance scale on the field solution is not a positive number".to_owned(),
        ));
    }
    solve_tank(coil, external_capacitance, conditions, scale, false).map(|t| t.resonance)
}

/// The tank's root (see [`field_tank`]); the self-resonance is searched for and bounds the
/// search when `with_self_resonance`, else it is NaN in the result and the model's highest
/// frequency bounds the search.
fn solve_tank(
    coil: &Coil,
    external_capacitance: f64,
    conditions: &Conditions,
    scale: f64,
    with_self_resonance: bool,
) -> Result<FieldTank, FieldError> {
    let wire = wire_coil(coil, conditions.temperature_c);
    let model = FieldModel::new(&wire, wire.segments_per_turn(), Feed::Terminals)?;
    if !(external_capacitance.is_finite() && external_capacitance > 0.0) {
        return Err(FieldError::Geometry(
            "no capacitance across the coil: the tank would be the coil's own self-resonance"
                .to_owned(),
        ));
    }
    let self_resonance = if with_self_resonance {
        model.first_resonance()?
    } else {
        f64::NAN
    };
    let ceiling = if with_self_resonance {
        self_resonance
    } else {
        model.max_frequency()
    };
    // The start: the classical resonance on the field's own conditions, so the answer depends
    // on nothing of `conditions` but the temperature.
    let classical = crate::model::evaluate::resonance_of(
        coil,
        external_capacitance,
        &Conditions {
            inductance_scale: scale,
            ..field_conditions(conditions)
        },
    );
    let mut evaluations = 0;
    // φ at ln f, with the impedance there.
    let mut phi = |ln_f: f64| -> Result<(f64, num_complex::Complex64), FieldError> {
        let f = ln_f.exp();
        let z = model.impedance(f)?;
        evaluations += 1;
        let omega = 2.0 * PI * f;
        // X ≤ 0 only at or above the self-resonance: treat it as far above the root.
        let value = if z.im > 0.0 {
            (omega * external_capacitance * scale * z.im).ln()
        } else {
            f64::INFINITY
        };
        Ok((value, z))
    };
    let top = ceiling.ln();
    let mut start = classical.min(0.9 * ceiling).ln();
    let (mut g0, mut z0) = phi(start)?;
    // Without the self-resonance's bound the start may lie above it: step down by halves
    // of an octave until the reactance is inductive.
    let mut down = 0;
    while !g0.is_finite() {
        down += 1;
        if down > 20 {
            return Err(FieldError::NoResonance);
        }
        start -= 0.5 * std::f64::consts::LN_2;
        (g0, z0) = phi(start)?;
    }
    let (mut last, mut z_last) = (start, z0);
    let (mut lo, mut hi) = (start, start);
    if g0.abs() > 2.0 * TOLERANCE {
        // Bracket: the fixed-point step, then secant steps through the last two points
        // until φ changes sign (or lands on the root).
        let (mut a, mut ga) = (start, g0);
        let mut b = (start - 0.5 * g0).min(top - 1e-9);
        let (mut gb, zb) = phi(b)?;
        (last, z_last) = (b, zb);
        let mut tries = 0;
        while ga.signum() == gb.signum() && gb.abs() > 2.0 * TOLERANCE {
            tries += 1;
            if tries > 40 {
                return Err(FieldError::NoResonance);
            }
            if gb.is_finite() {
                let next = if gb != ga {
                    b - gb * (b - a) / (gb - ga)
                } else {
                    b - 0.5 * gb
                };
                (a, ga) = (b, gb);
                b = next.min(top - 1e-9);
            } else {
                // Past the self-resonance: back towards the last inductive point.
                b = 0.5 * (a + b);
            }
            let (g, z) = phi(b)?;
            gb = g;
            (last, z_last) = (b, z);
        }
        if gb.abs() <= 2.0 * TOLERANCE {
            (lo, hi) = (b, b);
        } else {
            // Regula falsi (Illinois) where φ is finite, else halve the bracket.
            let stop = crate::physics::roots::Stop {
                width: TOLERANCE,
                relative_width: 0.0,
                value: 2.0 * TOLERANCE,
                steps: 60,
            };
            let found = crate::physics::roots::illinois((a, ga), (b, gb), stop, |x| {
                let (g, z) = phi(x)?;
                (last, z_last) = (x, z);
                Ok::<f64, FieldError>(g)
            })?;
            (lo, hi) = (found.x, found.x);
        }
    }
    let ln_f = 0.5 * (lo + hi);
    let z = if ln_f == last {
        z_last
    } else {
        evaluations += 1;
        model.impedance(ln_f.exp())?
    };
    let resonance = ln_f.exp();
    let low_frequency_inductance = if with_self_resonance {
        let f = 0.1 * self_resonance;
        model.impedance(f)?.im / (2.0 * PI * f) * (1.0 - 0.01)
    } else {
        f64::NAN
    };
    Ok(FieldTank {
        resonance,
        apparent_inductance: z.im / (2.0 * PI * resonance),
        series_resistance: z.re,
        self_resonance,
        low_frequency_inductance,
        segments: model.segments(),
        evaluations,
    })
}

/// Largest relative step the matching scale may still be taking when it is accepted.
const SCALE_TOLERANCE: f64 = 1e-12;

/// The factor on the classical model's inductance that brings the model's resonance of
/// `coil` across `external_capacitance` onto `target` hertz (the field-solved resonance of the
/// same tank), relative to `conditions.inductance_scale`; `None` when no scale in the engine's
/// accepted range (0.5–2 overall) does it.
///
/// # Method
/// The classical resonance is f(s) = 1/(2π√(s·L(f)·(C + C_self))), where only the wire's
/// internal inductance in L depends (weakly) on f. So f ∝ s^(−1/2) almost exactly, and the
/// step s ← s·(f(s)/target)² is Newton's step on ln f against ln s with the slope −½; it lands
/// within 1e-12 relative in two or three steps (at most 20 are taken).
///
/// Why a scale on the inductance: the field solution's X/ω holds the coil's own capacitance and
/// the propagation along the wire; the classical model holds them as Medhurst's capacitance
/// beside a quasi-static inductance. A factor on that inductance, solved at the present coil,
/// moves the model onto the field solution there and keeps the model's shape (how the
/// resonance moves with length and trimmer) for the charts and the advice, the same way a
/// bench calibration's inductance scale does ([`crate::tuning::fit`]).
pub fn matching_scale(
    coil: &Coil,
    external_capacitance: f64,
    conditions: &Conditions,
    target: f64,
) -> Option<f64> {
    if !(target.is_finite() && target > 0.0) {
        return None;
    }
    let base = conditions.inductance_scale;
    let mut s = 1.0_f64;
    for _ in 0..20 {
        let at = Conditions {
            inductance_scale: base * s,
            ..*conditions
        };
        let f = crate::model::evaluate::resonance_of(coil, external_capacitance, &at);
        if !(f.is_finite() && f > 0.0) {
            return None;
        }
        let next = s * (f / target).powi(2);
        let overall = base * next;
        if !Conditions::INDUCTANCE_SCALE_RANGE.contains(&overall) {
            return None;
        }
        let settled = ((next - s) / s).abs() <= SCALE_TOLERANCE;
        s = next;
        if settled {
            return Some(s);
        }
    }
    None
}

/// The field solution handed to [`crate::recipe::figures_with`] and the headless `evaluate`.
#[derive(Clone, Debug, PartialEq)]
pub enum FieldInput {
    /// Solved for this recipe's coil, external capacitance and conditions (what
    /// [`field_tank`] returns for them).
    Solved(Result<FieldTank, FieldError>),
    /// No solution for this recipe yet: hold this scale, solved for an earlier coil (the
    /// window, while its worker solves the present one, so the figures do not jump back to the
    /// classical model on every step of a drag).
    Held(f64),
    /// No field solution: the classical model leads, for the reason given.
    Unsolved(Unled),
}

/// Why the classical model leads: one variant per reason, so a reader tells "being computed"
/// from "switched off" by matching, never by comparing sentences.
#[derive(Clone, Debug, PartialEq)]
pub enum Unled {
    /// The window's worker is solving the first coil (nothing to hold yet).
    Pending,
    /// The field solution is switched off (the View menu, or the classical footing).
    SwitchedOff,
    /// The inputs already carry the field solution's factor in their conditions (a derived
    /// copy, such as the teaching bench's): nothing more to apply.
    Carried,
    /// The field solution declined or failed, or no factor in range meets it: why.
    Failed(String),
}

impl std::fmt::Display for Unled {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            Unled::Pending => f.write_str("the field solution is being computed"),
            Unled::SwitchedOff => f.write_str("the field solution is switched off"),
            Unled::Carried => {
                f.write_str("the recipe's factor on the inductance is carried in its conditions")
            }
            Unled::Failed(why) => f.write_str(why),
        }
    }
}

/// What the field solution did to the figures.
#[derive(Clone, Debug, PartialEq)]
pub enum FieldBasis {
    /// The model's inductance is scaled by `scale` so that it meets `tank.resonance`, the
    /// field-solved resonance of this recipe's tank.
    Solved {
        /// The field-solved tank.
        tank: FieldTank,
        /// The factor on the classical model's inductance.
        scale: f64,
    },
    /// An earlier coil's scale, held while this coil is being solved.
    Held {
        /// The factor on the classical model's inductance.
        scale: f64,
    },
    /// The classical model as it stands.
    Classical {
        /// Why the field solution is not applied.
        why: Unled,
    },
}

impl FieldBasis {
    /// What `field` does to the model of `coil` across `external_capacitance` farads under
    /// `conditions`: for a solution of this tank, the [`matching_scale`] that brings the model
    /// onto it (the classical model with the reason when no scale in range does).
    pub fn of(
        coil: &Coil,
        external_capacitance: f64,
        conditions: &Conditions,
        field: FieldInput,
    ) -> Self {
        match field {
            FieldInput::Solved(Ok(tank)) => {
                match matching_scale(coil, external_capacitance, conditions, tank.resonance) {
                    Some(scale) => FieldBasis::Solved { tank, scale },
                    None => FieldBasis::Classical {
                        why: Unled::Failed(format!(
                            "the field-solved resonance ({}) is further from the \
                             model's than an inductance factor of 0.5–2 explains",
                            super::digits::mhz(tank.resonance)
                        )),
                    },
                }
            }
            FieldInput::Solved(Err(e)) => FieldBasis::Classical {
                why: Unled::Failed(e.to_string()),
            },
            FieldInput::Held(scale) => FieldBasis::Held { scale },
            FieldInput::Unsolved(why) => FieldBasis::Classical { why },
        }
    }

    /// `conditions` with this basis's factor on the inductance.
    pub fn conditions(&self, conditions: &Conditions) -> Conditions {
        Conditions {
            inductance_scale: conditions.inductance_scale * self.scale(),
            ..*conditions
        }
    }

    /// The factor on the classical model's inductance (1 for the classical model).
    pub fn scale(&self) -> f64 {
        match self {
            FieldBasis::Solved { scale, .. } | FieldBasis::Held { scale } => *scale,
            FieldBasis::Classical { .. } => 1.0,
        }
    }

    /// The field-solved tank, when it is this recipe's.
    pub fn tank(&self) -> Option<&FieldTank> {
        match self {
            FieldBasis::Solved { tank, .. } => Some(tank),
            _ => None,
        }
    }

    /// Name in the JSON (`resonance_source`): `field_solved`, `held` or `classical`.
    pub fn json_name(&self) -> &'static str {
        match self {
            FieldBasis::Solved { .. } => "field_solved",
            FieldBasis::Held { .. } => "held",
            FieldBasis::Classical { .. } => "classical",
        }
    }
}

/// The classical estimates' bias against the field solution, as measured
/// (tests/engine/reference_field.rs, 2026-12-02): the ratio classical ÷ field, lowest and highest.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct MeasuredBias {
    /// Lowest ratio measured.
    pub low: f64,
    /// Highest ratio measured.
    pub high: f64,
}

impl MeasuredBias {
    /// In words for a label: "29–30 % low", "24–27 % high", "1.47–1.75 × the field solution's".
    pub fn in_words(self) -> String {
        if self.high < 1.0 {
            format!(
                "{:.0}–{:.0} % low",
                100.0 * (1.0 - self.high),
                100.0 * (1.0 - self.low)
            )
        } else if self.low > 1.0 && self.high < 1.4 {
            format!(
                "{:.0}–{:.0} % high",
                100.0 * (self.low - 1.0),
                100.0 * (self.high - 1.0)
            )
        } else {
            format!("{:.2}–{:.2} × the field solution's", self.low, self.high)
        }
    }
}

/// A classical estimate of this coil against the field solution's figure, in words for a
/// label: "0.71 × the field solution's (29 % low)", "1.25 × the field solution's (25 %
/// high)" (the coil's own ratio, where [`MeasuredBias`] states the range measured over many).
pub fn ratio_in_words(classical: f64, field: f64) -> Option<String> {
    let r = classical / field;
    if !(r.is_finite() && r > 0.0) {
        return None;
    }
    let side = if r < 1.0 { "low" } else { "high" };
    Some(format!(
        "{r:.2} × the field solution's ({:.0} % {side})",
        100.0 * (r - 1.0).abs()
    ))
}

/// The lumped self-resonance (Medhurst's capacitance with the inductance) over the field
/// solution's, isolated coils of 6–25 mm, 3–12 turns.
pub const LUMPED_SELF_RESONANCE_BIAS: MeasuredBias = MeasuredBias {
    low: 0.698,
    high: 0.715,
};

/// The helical-line self-resonance (Kandoian–Sichak velocity factor) over the field
/// solution's, the same coils.
pub const HELICAL_SELF_RESONANCE_BIAS: MeasuredBias = MeasuredBias {
    low: 1.241,
    high: 1.267,
};

/// The classical apparent-inductance rise L/(1 − (f/f_self)²) − L over the field solution's
/// rise of X/ω, FM coils of 7–12 mm with leads at 92–112 MHz.
pub const APPARENT_RISE_BIAS: MeasuredBias = MeasuredBias {
    low: 1.47,
    high: 1.75,
};

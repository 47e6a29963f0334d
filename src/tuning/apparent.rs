//! Whether the apparent inductance means anything for a tank, and why not when it does not:
//! the one judgement the window's readouts and the text report both show.
//!
//! The apparent inductance L/(1 − (f/f_self)²) (the coil's inductance raised by its own
//! distributed capacitance; see `model::evaluate`) is what a bridge would read across a coil
//! used below its self-resonance. With nothing across the coil the tank *is* the coil at
//! its self-resonance, and there the formula divides by zero; at or above the self-resonance
//! the coil no longer behaves as an inductance at all.

use crate::model::Analysis;

/// Why the apparent inductance is not shown.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum NoApparent {
    /// No external capacitance: the coil resonates with its own self-capacitance only.
    NoExternalCapacitance,
    /// The tank's frequency is at or above the coil's (lumped) self-resonance.
    AtOrAboveSelfResonance,
}

impl NoApparent {
    /// In words, for the window and the report.
    pub fn reason(self) -> &'static str {
        match self {
            NoApparent::NoExternalCapacitance => {
                "no meaning here: nothing is across the coil, so the tank is the coil at its own \
                 self-resonance, where L/(1 − (f/f_self)²) divides by zero"
            }
            NoApparent::AtOrAboveSelfResonance => {
                "no meaning here: the tank runs at or above the coil's self-resonance, where the \
                 coil no longer behaves as an inductance"
            }
        }
    }
}

/// The apparent inductance at the tank's resonance, henries, or why it has no meaning.
pub fn apparent_inductance(a: &Analysis) -> Result<f64, NoApparent> {
    // NaN counts as no capacitance: `partial_cmp` is Some(Greater) only for a positive value.
    if a.external_capacitance.partial_cmp(&0.0) != Some(std::cmp::Ordering::Greater) {
        return Err(NoApparent::NoExternalCapacitance);
    }
    let value = a.apparent_inductance;
    let below_self =
        a.resonance.partial_cmp(&a.self_resonance.lumped) == Some(std::cmp::Ordering::Less);
    if !below_self || !value.is_finite() || value <= 0.0 {
        return Err(NoApparent::AtOrAboveSelfResonance);
    }
    Ok(value)
}

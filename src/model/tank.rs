//! The capacitive side of the tank.

use super::error::{Field, InputError};
use crate::units::to_pf;

/// Two capacitors in series across the tank (the feedback divider of a Colpitts oscillator).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct FeedbackDivider {
    /// Capacitor from the hot end to the tap, farads.
    pub upper: f64,
    /// Capacitor from the tap to ground, farads.
    pub lower: f64,
}

impl FeedbackDivider {
    /// Series capacitance C1·C2/(C1 + C2), farads.
    pub fn series_capacitance(&self) -> f64 {
        let sum = self.upper + self.lower;
        if sum > 0.0 {
            self.upper * self.lower / sum
        } else {
            0.0
        }
    }
}

/// Everything across the coil except its own self-capacitance.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Tank {
    /// Fixed tank capacitor, farads.
    pub fixed: f64,
    /// Trimmer at its minimum, farads.
    pub trimmer_min: f64,
    /// Trimmer at its maximum, farads.
    pub trimmer_max: f64,
    /// Trimmer setting, 0 (minimum capacitance) to 1 (maximum).
    pub trimmer_setting: f64,
    /// Stray capacitance: device, wiring and layout, farads.
    pub stray: f64,
    /// Optional feedback divider across the tank.
    pub feedback: Option<FeedbackDivider>,
}

impl Tank {
    /// Whether the tank is fixed: no trimmer, or one whose travel spans nothing (minimum equal
    /// to maximum), so no setting moves the resonance.
    pub fn is_fixed(&self) -> bool {
        self.trimmer_max <= self.trimmer_min
    }

    /// Trimmer capacitance at `setting` (0–1), farads, assuming a linear trimmer.
    pub fn trimmer_at(&self, setting: f64) -> f64 {
        self.trimmer_min + setting * (self.trimmer_max - self.trimmer_min)
    }

    /// External capacitance across the coil at the current setting, farads.
    pub fn external_capacitance(&self) -> f64 {
        self.external_capacitance_at(self.trimmer_setting)
    }

    /// External capacitance across the coil at trimmer `setting`, farads.
    pub fn external_capacitance_at(&self, setting: f64) -> f64 {
        self.fixed
            + self.trimmer_at(setting)
            + self.stray
            + self.feedback.map_or(0.0, |f| f.series_capacitance())
    }

    /// A tank that is one fixed capacitance plus stray (the command line's form).
    pub fn fixed_only(capacitance: f64, stray: f64) -> Self {
        Self {
            fixed: capacitance,
            trimmer_min: 0.0,
            trimmer_max: 0.0,
            trimmer_setting: 0.0,
            stray,
            feedback: None,
        }
    }
}

/// Largest capacitance accepted anywhere in the tank, farads (10 nF: far beyond any VHF tank).
pub const CAPACITANCE_MAX: f64 = 10e-9;

#[inline]
fn check_capacitance(field: Field, what: &str, value: f64) -> Result<(), InputError> {
    // NaN fails both comparisons and so takes the refusal path.
    if (0.0..=CAPACITANCE_MAX).contains(&value) {
        Ok(())
    } else {
        Err(capacitance_refusal(field, what, value))
    }
}

#[cold]
#[inline(never)]
fn capacitance_refusal(field: Field, what: &str, value: f64) -> InputError {
    if !value.is_finite() {
        return InputError::new(field, format!("{what} is not a number"));
    }
    InputError::new(
        field,
        format!(
            "{what} {:.3} pF is outside 0–{:.0} pF",
            to_pf(value),
            to_pf(CAPACITANCE_MAX)
        ),
    )
}

impl Tank {
    /// Check the tank: every capacitance finite and within 0–[`CAPACITANCE_MAX`], trimmer
    /// maximum ≥ minimum, setting 0–1, both feedback capacitors above zero.
    pub fn validate(&self) -> Result<(), InputError> {
        check_capacitance(Field::FixedCapacitance, "fixed capacitance", self.fixed)?;
        check_capacitance(Field::Trimmer, "trimmer minimum", self.trimmer_min)?;
        check_capacitance(Field::Trimmer, "trimmer maximum", self.trimmer_max)?;
        if self.trimmer_max < self.trimmer_min {
            return Err(InputError::new(
                Field::Trimmer,
                format!(
                    "trimmer maximum {:.2} pF is below its minimum {:.2} pF",
                    to_pf(self.trimmer_max),
                    to_pf(self.trimmer_min)
                ),
            ));
        }
        if !self.trimmer_setting.is_finite() || !(0.0..=1.0).contains(&self.trimmer_setting) {
            return Err(InputError::new(
                Field::TrimmerSetting,
                format!(
                    "trimmer setting {} % is outside 0–100 %",
                    self.trimmer_setting * 100.0
                ),
            ));
        }
        check_capacitance(Field::StrayCapacitance, "stray capacitance", self.stray)?;
        if let Some(fb) = self.feedback {
            check_capacitance(Field::Feedback, "upper feedback capacitor", fb.upper)?;
            check_capacitance(Field::Feedback, "lower feedback capacitor", fb.lower)?;
            if fb.upper <= 0.0 || fb.lower <= 0.0 {
                return Err(InputError::new(
                    Field::Feedback,
                    "both feedback capacitors must be above 0 pF",
                ));
            }
        }
        Ok(())
    }
}

//! Refusals of impossible or meaningless input.

use std::fmt;

/// Which input was at fault.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Field {
    /// Former or mean diameter.
    Diameter,
    /// Wire size.
    Wire,
    /// Number of turns.
    Turns,
    /// Coil length or gap.
    Spacing,
    /// Lead length.
    LeadLength,
    /// Fixed capacitor.
    FixedCapacitance,
    /// Trimmer range.
    Trimmer,
    /// Trimmer setting.
    TrimmerSetting,
    /// Stray capacitance.
    StrayCapacitance,
    /// Feedback divider.
    Feedback,
    /// Wire temperature.
    Temperature,
    /// The bench calibration (inductance scale).
    Calibration,
}

impl Field {
    /// Name of the field as shown to the user.
    pub fn label(self) -> &'static str {
        match self {
            Field::Diameter => "diameter",
            Field::Wire => "wire",
            Field::Turns => "turns",
            Field::Spacing => "spacing",
            Field::LeadLength => "lead length",
            Field::FixedCapacitance => "fixed capacitance",
            Field::Trimmer => "trimmer",
            Field::TrimmerSetting => "trimmer setting",
            Field::StrayCapacitance => "stray capacitance",
            Field::Feedback => "feedback divider",
            Field::Temperature => "temperature",
            Field::Calibration => "bench calibration",
        }
    }
}

/// An input that cannot describe a real coil and tank, with the reason.
#[derive(Clone, Debug, PartialEq)]
pub struct InputError {
    /// The field at fault.
    pub field: Field,
    /// What is wrong and what would be right, in words.
    pub reason: String,
}

impl InputError {
    pub(crate) fn new(field: Field, reason: impl Into<String>) -> Self {
        Self {
            field,
            reason: reason.into(),
        }
    }
}

impl fmt::Display for InputError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{}: {}", self.field.label(), self.reason)
    }
}

impl std::error::Error for InputError {}

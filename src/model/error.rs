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
        write!(f, "{}: {}", self.field.label(), short_numbers(&self.reason))
    }
}

/// `text` with every number of more than 15 digits written in scientific notation with six
/// significant digits ("-8e19", not twenty digits; "1e308", not 309): a message is read, and
/// a figure past every range needs its size, not its digits.
pub fn short_numbers(text: &str) -> String {
    let chars: Vec<char> = text.chars().collect();
    let mut out = String::with_capacity(text.len());
    let mut i = 0;
    while i < chars.len() {
        if chars[i].is_ascii_digit() {
            let start = i;
            while i < chars.len() && (chars[i].is_ascii_digit() || chars[i] == '.') {
                i += 1;
            }
            let token: String = chars[start..i].iter().collect();
            let digits = token.chars().filter(char::is_ascii_digit).count();
            match token.trim_end_matches('.').parse::<f64>() {
                Ok(v) if digits > 15 => {
                    let e = format!("{v:.5e}");
                    // Trailing zeros of the mantissa dropped: "8.00000e19" → "8e19".
                    let (m, x) = e.split_once('e').unwrap_or((&e, "0"));
                    let m = m.trim_end_matches('0').trim_end_matches('.');
                    out.push_str(&format!("{m}e{x}"));
                }
                _ => out.push_str(&token),
            }
        } else {
            out.push(chars[i]);
            i += 1;
        }
    }
    out
}

impl std::error::Error for InputError {}

//! A validated coil: the geometry every formula takes, derived in one place.

use super::error::{Field, InputError};
use super::winding::{DiameterSpec, SpacingSpec, Winding};

/// Limits that separate a hand-wound air coil from nonsense (common practice, generous).
mod limits {
    /// Mean diameter, metres.
    pub const DIAMETER: (f64, f64) = (0.5e-3, 0.3);
    /// Bare wire diameter, metres.
    pub const WIRE: (f64, f64) = (0.02e-3, 6e-3);
    /// Turns.
    pub const TURNS: (f64, f64) = (1.0, 500.0);
    /// Coil length, metres.
    pub const LENGTH_MAX: f64 = 2.0;
    /// Lead length, metres.
    pub const LEAD_MAX: f64 = 0.5;
}

/// A coil whose geometry has been checked: every figure is finite, positive and physical.
///
/// All lengths in metres. Built only by [`Coil::from_winding`].
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Coil {
    /// Mean (wire-centre) diameter D.
    pub mean_diameter: f64,
    /// Former diameter (inside of the winding) = D − overall wire diameter.
    pub former_diameter: f64,
    /// Bare copper diameter d.
    pub wire_bare: f64,
    /// Diameter over the insulation.
    pub wire_overall: f64,
    /// Turns N.
    pub turns: f64,
    /// Pitch p, centre to centre of neighbouring turns.
    pub pitch: f64,
    /// Current-sheet length l = N·p.
    pub length: f64,
    /// Each of the two leads.
    pub lead_length: f64,
}

/// `value` if finite, else the refusal naming `field`. The refusal is built out of line: the
/// accepted case is the one every evaluation takes.
#[inline]
fn finite(field: Field, what: &str, value: f64) -> Result<f64, InputError> {
    if value.is_finite() {
        Ok(value)
    } else {
        Err(not_a_number(field, what))
    }
}

#[cold]
#[inline(never)]
fn not_a_number(field: Field, what: &str) -> InputError {
    InputError::new(field, format!("{what} is not a number"))
}

/// `value` if it lies in `lo..=hi`, else the refusal (not a number, or out of range).
#[inline]
fn within(
    field: Field,
    what: &str,
    value: f64,
    range: (f64, f64),
    unit: Unit,
) -> Result<f64, InputError> {
    // NaN fails both comparisons and so takes the refusal path.
    if value >= range.0 && value <= range.1 {
        Ok(value)
    } else {
        Err(out_of_range(field, what, value, range, unit))
    }
}

#[cold]
#[inline(never)]
fn out_of_range(
    field: Field,
    what: &str,
    value: f64,
    (lo, hi): (f64, f64),
    unit: Unit,
) -> InputError {
    if !value.is_finite() {
        return not_a_number(field, what);
    }
    InputError::new(
        field,
        format!(
            "{what} {} is outside {}–{}",
            unit.show(value),
            unit.show(lo),
            unit.show(hi)
        ),
    )
}

/// Display unit for error messages.
#[derive(Clone, Copy)]
enum Unit {
    Mm,
    Count,
}

impl Unit {
    fn show(self, v: f64) -> String {
        match self {
            Unit::Mm => format!("{:.3} mm", v * 1e3),
            Unit::Count => format!("{v}"),
        }
    }
}

impl Coil {
    /// Check a winding and derive its geometry.
    ///
    /// Refuses, naming the field: non-finite values, sizes outside hand-winding ranges, a
    /// former diameter that leaves no room, and a pitch below the insulated wire diameter
    /// (turns would touch or overlap).
    pub fn from_winding(w: &Winding) -> Result<Self, InputError> {
        let bare = w.wire.bare_diameter().ok_or_else(|| {
            InputError::new(
                Field::Wire,
                "gauge number is outside the AWG 8–40 / SWG 8–40 tables",
            )
        })?;
        let bare = within(
            Field::Wire,
            "bare wire diameter",
            bare,
            limits::WIRE,
            Unit::Mm,
        )?;
        let overall = w.wire.overall_diameter(bare);
        let turns = within(Field::Turns, "turns", w.turns, limits::TURNS, Unit::Count)?;
        let mean = match w.diameter {
            DiameterSpec::Mean(d) => {
                let d = finite(Field::Diameter, "mean diameter", d)?;
                if d <= overall {
                    return Err(InputError::new(
                        Field::Diameter,
                        format!(
                            "mean diameter {} must exceed the wire's overall diameter {}",
                            Unit::Mm.show(d),
                            Unit::Mm.show(overall)
                        ),
                    ));
                }
                d
            }
            DiameterSpec::Former(d) => {
                let d = finite(Field::Diameter, "former diameter", d)?;
                if d <= 0.0 {
                    return Err(InputError::new(
                        Field::Diameter,
                        format!("former diameter {} must be positive", Unit::Mm.show(d)),
                    ));
                }
                d + overall
            }
        };
        let mean = within(
            Field::Diameter,
            "mean diameter",
            mean,
            limits::DIAMETER,
            Unit::Mm,
        )?;
        // The length as given (not recomputed from the pitch), so that every formula that takes
        // it sees the builder's figure and need not wait for the division.
        let (pitch, length) = match w.spacing {
            SpacingSpec::Length(l) => {
                let l = finite(Field::Spacing, "coil length", l)?;
                (l / turns, l)
            }
            SpacingSpec::Gap(g) => {
                let g = finite(Field::Spacing, "gap", g)?;
                if g < 0.0 {
                    return Err(InputError::new(
                        Field::Spacing,
                        format!("gap {} is negative: turns would overlap", Unit::Mm.show(g)),
                    ));
                }
                let pitch = overall + g;
                (pitch, pitch * turns)
            }
        };
        if pitch < overall {
            return Err(InputError::new(
                Field::Spacing,
                format!(
                    "pitch {} is below the insulated wire diameter {}: turns would overlap \
                     (coil length must be at least {} for {} turns)",
                    Unit::Mm.show(pitch),
                    Unit::Mm.show(overall),
                    Unit::Mm.show(overall * turns),
                    turns
                ),
            ));
        }
        if length > limits::LENGTH_MAX {
            return Err(InputError::new(
                Field::Spacing,
                format!(
                    "coil length {} is beyond {}",
                    Unit::Mm.show(length),
                    Unit::Mm.show(limits::LENGTH_MAX)
                ),
            ));
        }
        let lead = within(
            Field::LeadLength,
            "lead length",
            w.lead_length,
            (0.0, limits::LEAD_MAX),
            Unit::Mm,
        )?;
        Ok(Self {
            mean_diameter: mean,
            former_diameter: mean - overall,
            wire_bare: bare,
            wire_overall: overall,
            turns,
            pitch,
            length,
            lead_length: lead,
        })
    }

    /// Gap between the insulation of neighbouring turns, metres (zero when close-wound).
    pub fn gap(&self) -> f64 {
        (self.pitch - self.wire_overall).max(0.0)
    }

    /// l/D.
    pub fn length_over_diameter(&self) -> f64 {
        self.length / self.mean_diameter
    }

    /// Wire to cut, metres: the helix √((πD)² + p²) per turn times N, plus both leads.
    pub fn wire_length(&self) -> f64 {
        let circumference = std::f64::consts::PI * self.mean_diameter;
        let per_turn = (circumference * circumference + self.pitch * self.pitch).sqrt();
        per_turn * self.turns + 2.0 * self.lead_length
    }

    /// The same coil with another current-sheet length (same turns and wire), for sweeps.
    /// Not validated: callers keep the length at or above turns × overall diameter.
    pub fn with_length(&self, length: f64) -> Self {
        Self {
            pitch: length / self.turns,
            length,
            ..*self
        }
    }
}

//! A validated coil: the geometry every formula takes, derived in one place.

use super::error::{Field, InputError};
use super::winding::{DiameterSpec, SpacingSpec, Winding};

/// Limits that separate a hand-wound air coil from nonsense (common practice, generous).
pub mod limits {
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
    /// Smallest clear gap between bare (or tinned) turns, metres: closer than a hand can set
    /// them apart (about 0.1 mm, common practice) they touch, and touching bare turns short
    /// each other.
    pub const BARE_GAP_MIN: f64 = 0.1e-3;
}

/// A coil whose geometry has been checked: every figure is finite, positive and physical.
///
/// All lengths in metres. The fields are private: [`Coil::from_winding`] and
/// [`Coil::with_length`] are the only ways to make one, and both check.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Coil {
    mean_diameter: f64,
    former_diameter: f64,
    wire_bare: f64,
    wire_overall: f64,
    turns: f64,
    pitch: f64,
    length: f64,
    lead_length: f64,
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
                (overall + g, length_from_gap(overall, turns, g))
            }
        };
        check_length(turns, overall, overall <= bare, pitch, length)?;
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

    /// Mean (wire-centre) diameter D.
    pub fn mean_diameter(&self) -> f64 {
        self.mean_diameter
    }

    /// Former diameter (inside of the winding) = D − overall wire diameter.
    pub fn former_diameter(&self) -> f64 {
        self.former_diameter
    }

    /// Bare copper diameter d.
    pub fn wire_bare(&self) -> f64 {
        self.wire_bare
    }

    /// Diameter over the insulation (the bare diameter for bare wire).
    pub fn wire_overall(&self) -> f64 {
        self.wire_overall
    }

    /// Turns N.
    pub fn turns(&self) -> f64 {
        self.turns
    }

    /// Pitch p, centre to centre of neighbouring turns.
    pub fn pitch(&self) -> f64 {
        self.pitch
    }

    /// Current-sheet length l = N·p.
    pub fn length(&self) -> f64 {
        self.length
    }

    /// Each of the two leads.
    pub fn lead_length(&self) -> f64 {
        self.lead_length
    }

    /// Whether the wire has no insulation (bare or tinned copper).
    pub fn is_bare(&self) -> bool {
        self.wire_overall <= self.wire_bare
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

    /// Shortest length this coil can be wound to: close-wound (turns × overall wire diameter)
    /// for insulated wire; for bare wire, with [`limits::BARE_GAP_MIN`] between the turns.
    pub fn shortest_length(&self) -> f64 {
        self.turns * shortest_pitch(self.wire_overall, self.is_bare())
    }

    /// Longest length a solver proposes or a chart sweeps to: four diameters or three times the
    /// close-wound length, whichever is longer (common practice: beyond that a self-supporting
    /// coil sags), never beyond [`limits::LENGTH_MAX`].
    pub fn longest_proposed_length(&self) -> f64 {
        (4.0 * self.mean_diameter)
            .max(3.0 * self.shortest_length())
            .min(limits::LENGTH_MAX)
    }

    /// Coil length (turns × pitch) for a clear gap between the turns' insulation.
    pub fn length_for_gap(&self, gap: f64) -> f64 {
        length_from_gap(self.wire_overall, self.turns, gap)
    }

    /// Clear gap between the turns' insulation for a coil length (zero when close-wound).
    pub fn gap_for_length(&self, length: f64) -> f64 {
        (length / self.turns - self.wire_overall).max(0.0)
    }

    /// The coil with its former, bare wire, turns and length moved by the given amounts (the
    /// insulation's build kept), for tolerance studies. The length is raised to the new
    /// shortest length when the change would make the turns overlap (a coil cannot be wound
    /// shorter); the result is checked as [`Coil::from_winding`] checks it.
    pub fn varied(
        &self,
        d_former: f64,
        d_wire: f64,
        d_turns: f64,
        d_length: f64,
    ) -> Result<Self, InputError> {
        let build = self.wire_overall - self.wire_bare;
        let bare = within(
            Field::Wire,
            "bare wire diameter",
            self.wire_bare + d_wire,
            limits::WIRE,
            Unit::Mm,
        )?;
        let overall = bare + build;
        let former = self.former_diameter + d_former;
        let mean = within(
            Field::Diameter,
            "mean diameter",
            former + overall,
            limits::DIAMETER,
            Unit::Mm,
        )?;
        let turns = within(
            Field::Turns,
            "turns",
            self.turns + d_turns,
            limits::TURNS,
            Unit::Count,
        )?;
        let base = Self {
            mean_diameter: mean,
            former_diameter: former,
            wire_bare: bare,
            wire_overall: overall,
            turns,
            ..*self
        };
        base.with_length((self.length + d_length).max(base.shortest_length()))
    }

    /// The coil with every dimension times `k` (thermal expansion: k within a few parts in
    /// 10⁴ of 1, which keeps every check the coil passed).
    pub fn scaled(&self, k: f64) -> Self {
        Self {
            mean_diameter: self.mean_diameter * k,
            former_diameter: self.former_diameter * k,
            wire_bare: self.wire_bare * k,
            wire_overall: self.wire_overall * k,
            turns: self.turns,
            pitch: self.pitch * k,
            length: self.length * k,
            lead_length: self.lead_length * k,
        }
    }

    /// The same wire, diameter and leads wound with `turns` turns to `length`, checked as
    /// [`Coil::from_winding`] checks it.
    pub fn with_turns(&self, turns: f64, length: f64) -> Result<Self, InputError> {
        let turns = within(Field::Turns, "turns", turns, limits::TURNS, Unit::Count)?;
        Self { turns, ..*self }.with_length(length)
    }

    /// The same coil (turns, wire, diameter, leads) at another current-sheet length, checked
    /// as [`Coil::from_winding`] checks it.
    pub fn with_length(&self, length: f64) -> Result<Self, InputError> {
        let length = finite(Field::Spacing, "coil length", length)?;
        let pitch = length / self.turns;
        check_length(self.turns, self.wire_overall, self.is_bare(), pitch, length)?;
        Ok(Self {
            pitch,
            length,
            ..*self
        })
    }
}

/// Coil length (turns × pitch) with a clear gap between the turns' insulation.
fn length_from_gap(overall: f64, turns: f64, gap: f64) -> f64 {
    (overall + gap) * turns
}

/// Shortest pitch: the overall wire diameter, plus [`limits::BARE_GAP_MIN`] for bare wire.
fn shortest_pitch(overall: f64, bare: bool) -> f64 {
    if bare {
        overall + limits::BARE_GAP_MIN
    } else {
        overall
    }
}

/// Refuse a pitch below the insulated wire diameter (turns would overlap; a relative 1e-12 is
/// allowed for the rounding of length/turns), bare turns closer than
/// [`limits::BARE_GAP_MIN`], and a length beyond [`limits::LENGTH_MAX`].
fn check_length(
    turns: f64,
    overall: f64,
    bare: bool,
    pitch: f64,
    length: f64,
) -> Result<(), InputError> {
    if bare
        && pitch >= overall * (1.0 - 1e-12)
        && pitch < shortest_pitch(overall, true) * (1.0 - 1e-12)
    {
        return Err(InputError::new(
            Field::Spacing,
            format!(
                "bare turns {} apart would touch and short each other: leave at least {} \
                 between bare turns (coil length at least {} for {} turns)",
                Unit::Mm.show((pitch - overall).max(0.0)),
                Unit::Mm.show(limits::BARE_GAP_MIN),
                Unit::Mm.show(shortest_pitch(overall, true) * turns),
                turns
            ),
        ));
    }
    if pitch < overall * (1.0 - 1e-12) {
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
    Ok(())
}

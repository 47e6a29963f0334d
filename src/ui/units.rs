//! How lengths are shown in the window: millimetres or inches (the conversions themselves are
//! [`crate::units`]).

/// How lengths are shown.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Default)]
pub enum LengthUnit {
    /// Millimetres.
    #[default]
    Millimetres,
    /// Inches.
    Inches,
}

impl LengthUnit {
    /// Metres per display unit.
    pub fn metres_per_unit(self) -> f64 {
        match self {
            LengthUnit::Millimetres => crate::units::from_mm(1.0),
            // Exact by definition (the international inch, 1959).
            LengthUnit::Inches => 0.0254,
        }
    }

    /// Metres to display units.
    pub fn from_metres(self, metres: f64) -> f64 {
        metres / self.metres_per_unit()
    }

    /// Display units to metres.
    pub fn to_metres(self, value: f64) -> f64 {
        value * self.metres_per_unit()
    }

    /// Unit suffix.
    pub fn suffix(self) -> &'static str {
        match self {
            LengthUnit::Millimetres => "mm",
            LengthUnit::Inches => "in",
        }
    }

    /// Decimal places that suit the unit for coil dimensions.
    pub fn decimals(self) -> usize {
        match self {
            LengthUnit::Millimetres => 2,
            LengthUnit::Inches => 3,
        }
    }

    /// A length formatted with its unit.
    pub fn show(self, metres: f64) -> String {
        format!(
            "{:.*} {}",
            self.decimals(),
            self.from_metres(metres),
            self.suffix()
        )
    }
}

impl LengthUnit {
    /// The wire to cut, at the resolution one rule gives everywhere
    /// ([`crate::tuning::digits::wire_to_cut_mm`]): whole millimetres, or in inches the
    /// hundredth (0.25 mm) nearest.
    pub fn show_wire_to_cut(self, metres: f64) -> String {
        match self {
            LengthUnit::Millimetres => crate::tuning::digits::wire_to_cut_mm(metres),
            LengthUnit::Inches => format!(
                "{} in",
                crate::tuning::digits::fixed(self.from_metres(metres), 2)
            ),
        }
    }

    /// An uncertainty of a length at this unit's resolution: "±0.12 mm", or "under 0.01 mm"
    /// when it rounds to nothing there.
    pub fn show_uncertainty(self, metres: f64) -> String {
        crate::tuning::digits::plus_minus(self.from_metres(metres), self.decimals(), self.suffix())
    }
}

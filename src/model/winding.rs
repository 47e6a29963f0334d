//! The winding as a builder knows it: former, wire, turns, spacing, leads.

use crate::physics::wire_gauge::{self, EnamelGrade};

/// How the coil's diameter is given.
#[derive(Clone, Copy, Debug, PartialEq)]
pub enum DiameterSpec {
    /// Diameter of the former (mandrel, drill shank) the wire is wound on, metres.
    Former(f64),
    /// Mean (wire-centre) diameter, metres: what the formulas use.
    Mean(f64),
}

/// Wire size.
#[derive(Clone, Copy, Debug, PartialEq)]
pub enum Gauge {
    /// American Wire Gauge number (ASTM B258).
    Awg(i32),
    /// Imperial Standard Wire Gauge number (BS 3737).
    Swg(i32),
    /// Bare copper diameter in metres.
    Metric(f64),
}

/// Insulation on the wire.
#[derive(Clone, Copy, Debug, PartialEq)]
pub enum Coating {
    /// Bare or tinned copper.
    Bare,
    /// Enamelled, IEC 60317 grade 1 (thin) maximum overall diameter.
    EnamelGrade1,
    /// Enamelled, IEC 60317 grade 2 (medium) maximum overall diameter.
    EnamelGrade2,
}

/// A wire: size and insulation.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct WireSpec {
    /// Size of the copper.
    pub gauge: Gauge,
    /// Insulation over it.
    pub coating: Coating,
}

impl WireSpec {
    /// Bare copper diameter in metres, or `None` for a gauge number outside the tables.
    pub fn bare_diameter(&self) -> Option<f64> {
        match self.gauge {
            Gauge::Awg(n) => {
                let (lo, hi) = wire_gauge::AWG_RANGE;
                (lo..=hi).contains(&n).then(|| wire_gauge::awg_diameter(n))
            }
            Gauge::Swg(n) => wire_gauge::swg_diameter(n),
            Gauge::Metric(d) => Some(d),
        }
    }

    /// Overall diameter over the insulation, metres, for a given bare diameter.
    pub fn overall_diameter(&self, bare: f64) -> f64 {
        match self.coating {
            Coating::Bare => bare,
            Coating::EnamelGrade1 => wire_gauge::enamelled_diameter(bare, EnamelGrade::Grade1),
            Coating::EnamelGrade2 => wire_gauge::enamelled_diameter(bare, EnamelGrade::Grade2),
        }
    }
}

/// How the spacing of the turns is given.
#[derive(Clone, Copy, Debug, PartialEq)]
pub enum SpacingSpec {
    /// Coil length in metres, taken as turns × pitch: the current-sheet length, in which each
    /// turn occupies one pitch. (Measured outside to outside over the wire, a winding is about
    /// one wire diameter longer than N × pitch − pitch, i.e. close to this when gap ≈ 0.)
    Length(f64),
    /// Clear gap between neighbouring turns' insulation, metres: pitch = overall diameter + gap.
    Gap(f64),
}

/// A single-layer air-core winding as a builder specifies it.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Winding {
    /// Former or mean diameter.
    pub diameter: DiameterSpec,
    /// The wire.
    pub wire: WireSpec,
    /// Number of turns (fractional allowed, e.g. 4.5).
    pub turns: f64,
    /// Coil length or gap between turns.
    pub spacing: SpacingSpec,
    /// Length of each of the two straight leads, metres.
    pub lead_length: f64,
}

//! The one adapter from a validated [`Coil`] to the field solver's plain wire description.

use super::coil::Coil;
use crate::physics::copper::resistivity;
use crate::physics::field::WireCoil;

/// The wire of `coil` at `temperature_c` (°C), for [`crate::physics::field`].
pub fn wire_coil(coil: &Coil, temperature_c: f64) -> WireCoil {
    WireCoil {
        mean_diameter: coil.mean_diameter(),
        pitch: coil.pitch(),
        turns: coil.turns(),
        wire_radius: 0.5 * coil.wire_bare(),
        lead_length: coil.lead_length(),
        resistivity: resistivity(temperature_c),
    }
}

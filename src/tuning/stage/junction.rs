//! The base–collector junction as the modulating capacitance across the tank: the
//! transistor's own junction, worked by the same [`crate::tuning::modulation`] as the audio
//! panel's junction law.

use super::bias::OperatingPoint;
use super::transistor::{JunctionCapacitance, Transistor};
use crate::model::{Coil, Conditions};
use crate::physics::junction::JunctionLaw;
use crate::tuning::modulation::{ModulationInputs, Modulator, modulation};

/// The base–collector junction as the modulating capacitance across the tank.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct JunctionShare {
    /// C_bc at the operating point, farads.
    pub capacitance: f64,
    /// Its share of all the capacitance the coil sees.
    pub share: f64,
    /// The carrier's movement per volt of collector–base voltage, hertz per volt (positive:
    /// more reverse bias, less capacitance, a higher carrier).
    pub hz_per_volt: f64,
}

/// The base–collector junction across the tank (`loaded_external` farads across the coil, the
/// junction included, beside the coil's `self_capacitance`): its capacitance, share, and the
/// carrier's slope against the collector–base voltage by [`crate::tuning::modulation`] (the junction
/// straight across the tank, as in the common-base stage where base and supply are both at
/// RF ground). A fixed C_bc is taken as SPICE's default law (V_JC = 0.75 V, M_JC = 0.33,
/// Berkeley SPICE3 manual) through the given value at the operating point.
pub fn junction_share(
    coil: &Coil,
    conditions: &Conditions,
    loaded_external: f64,
    self_capacitance: f64,
    t: &Transistor,
    op: &OperatingPoint,
) -> JunctionShare {
    let vcb = op.collector_base_v.max(0.0);
    let law = match t.base_collector {
        JunctionCapacitance::Law(law) => law,
        JunctionCapacitance::Fixed(c) => {
            JunctionLaw::new(c * (1.0 + vcb / 0.75).powf(0.33), 0.75, 0.33)
        }
    };
    let c = law.capacitance(vcb);
    let m = modulation(
        coil,
        loaded_external - c,
        conditions,
        &ModulationInputs {
            modulator: Modulator {
                law,
                coupling: None,
            },
            bias_v: vcb,
            audio_peak_v: 0.0,
            audio_max_hz: 15e3,
            rf_peak_v: crate::tuning::modulation::TANK_RF_PEAK_V,
        },
    );
    JunctionShare {
        capacitance: c,
        share: c / (loaded_external + self_capacitance),
        hz_per_volt: m.sensitivity,
    }
}

//! The base–collector junction as the modulating capacitance across the tank: the
//! transistor's own junction, worked by the same [`crate::tuning::modulation`] as the audio
//! panel's junction law.

use super::bias::OperatingPoint;
use super::transistor::{JunctionCapacitance, Transistor};
use crate::model::evaluate::resonance_of;
use crate::model::{Coil, Conditions};
use crate::physics::junction::JunctionLaw;
use crate::physics::junction::series;
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
    /// The junction's law (its own, or a fixed C_bc as SPICE's default law: [`bias_law`]).
    pub law: JunctionLaw,
    /// Its reverse bias at the operating point (V_CB), volts.
    pub bias_v: f64,
    /// Everything across the coil beside the junction (but the coil's self-capacitance),
    /// farads, when the junction sits straight across the tank; `None` through a Clapp
    /// capacitor. With the law and the bias, what the audio panel needs to modulate with this
    /// junction in this stage's tank.
    pub rest: Option<f64>,
}

/// What the coil sees besides the junction, farads.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Across {
    /// The tank's own capacitors (fixed, trimmer, stray) straight across the coil.
    pub own: f64,
    /// The rest at the junction's node (the divider with C_π), beside the junction.
    pub rest_at_base: f64,
    /// The Clapp capacitor between that node and the coil, if any.
    pub clapp: Option<f64>,
    /// The coil's self-capacitance.
    pub self_capacitance: f64,
}

impl Across {
    /// Everything across the coil but its self-capacitance with the junction at `c`, farads.
    pub fn external(&self, c: f64) -> f64 {
        let at_node = self.rest_at_base + c;
        self.own + self.clapp.map_or(at_node, |cs| series(cs, at_node))
    }
}

/// The base–collector junction as the coil sees it (`across`: the rest of the tank): its
/// capacitance, share, and the carrier's slope against the collector–base voltage. Without a
/// Clapp capacitor the junction sits straight across the tank (in the common-base stage base
/// and supply are both at RF ground; in the common-collector one the collector is), and the
/// slope is [`crate::tuning::modulation`]'s, the audio panel's own function. Through a Clapp
/// capacitor C_s it reaches the coil as part of C_s in series with the node's capacitance, so
/// it counts (C_s/(C_s + C_node))² of itself (the derivative of the series capacitance), and
/// the slope is the same central difference of the resonance as the modulation's. A fixed
/// C_bc is taken as SPICE's default law (V_JC = 0.75 V, M_JC = 0.33, Berkeley SPICE3 manual)
/// through the given value at the operating point.
pub fn junction_share(
    coil: &Coil,
    conditions: &Conditions,
    across: &Across,
    t: &Transistor,
    op: &OperatingPoint,
) -> JunctionShare {
    let vcb = op.collector_base_v.max(0.0);
    let law = bias_law(t, vcb);
    let c = law.capacitance(vcb);
    let total = across.external(c) + across.self_capacitance;
    match across.clapp {
        None => {
            let m = modulation(
                coil,
                across.external(0.0),
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
                share: c / total,
                hz_per_volt: m.sensitivity,
                law,
                bias_v: vcb,
                rest: Some(across.external(0.0)),
            }
        }
        Some(cs) => {
            let p = cs / (cs + across.rest_at_base + c);
            let f = |v: f64| resonance_of(coil, across.external(law.capacitance(v)), conditions);
            let h = 1e-4 * (law.contact_potential + vcb.abs());
            JunctionShare {
                capacitance: c,
                share: p * p * c / total,
                hz_per_volt: (f(vcb + h) - f(vcb - h)) / (2.0 * h),
                law,
                bias_v: vcb,
                rest: None,
            }
        }
    }
}

/// The junction law of the transistor's base–collector junction: its own law, or a fixed C_bc
/// taken as SPICE's default law (V_JC = 0.75 V, M_JC = 0.33) through the given value at
/// `vcb` volts of reverse bias. The audio panel offers this law as the modulating junction.
pub fn bias_law(t: &Transistor, vcb: f64) -> JunctionLaw {
    match t.base_collector {
        JunctionCapacitance::Law(law) => law,
        JunctionCapacitance::Fixed(c) => {
            JunctionLaw::new(c * (1.0 + vcb / 0.75).powf(0.33), 0.75, 0.33)
        }
    }
}

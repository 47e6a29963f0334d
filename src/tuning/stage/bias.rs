//! The stage's DC operating point: the base divider reduced to its Thévenin source, V_BE from
//! the transistor's law, the collector and emitter currents and voltages.
//!
//! # Method
//! V_TH = V_s·R2/(R1 + R2), R_TH = R1·R2/(R1 + R2); the base loop
//! V_TH = I_B·R_TH + V_BE + I_E·R_E with I_B = I_C/β, I_E = I_C·(β + 1)/β, and
//! I_C = I_S·(exp(V_BE/V_T) − 1) solved for V_BE by bisection (the loop's current falls as V_BE
//! rises, the law's rises, so the root is single). The textbook four-resistor bias
//! (A. S. Sedra and K. C. Smith, *Microelectronic Circuits*, the BJT biasing section, from
//! memory). The coil carries the collector current from the supply (its DC resistance from
//! the tank's model), so V_C = V_s − I_C·R_dc in both topologies' DC path; in the
//! common-collector stage the collector goes straight to the supply (R_dc = 0 there).

use super::transistor::Transistor;

/// The collector–emitter voltage below which the transistor is taken as saturated, volts
/// (common practice for a small-signal silicon transistor: V_CE(sat) ≈ 0.2 V, with margin).
pub const SATURATION_V: f64 = 0.3;

/// The DC operating point (SI).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct OperatingPoint {
    /// Collector current, amperes.
    pub collector_current: f64,
    /// Base current, amperes.
    pub base_current: f64,
    /// Emitter current, amperes.
    pub emitter_current: f64,
    /// Base–emitter voltage, volts.
    pub base_emitter_v: f64,
    /// Base voltage to ground, volts.
    pub base_v: f64,
    /// Emitter voltage to ground, volts.
    pub emitter_v: f64,
    /// Collector voltage to ground, volts.
    pub collector_v: f64,
    /// Collector–emitter voltage, volts.
    pub collector_emitter_v: f64,
    /// Collector–base reverse voltage, volts.
    pub collector_base_v: f64,
    /// Current drawn from the supply (bias divider's top resistor plus the collector), amperes.
    pub supply_current: f64,
    /// Transconductance I_C/V_T, siemens.
    pub transconductance: f64,
    /// Dissipation in the transistor V_CE·I_C, watts.
    pub dissipation: f64,
}

impl OperatingPoint {
    /// Whether the transistor is in forward activity: V_CE above [`SATURATION_V`] and the
    /// collector–base junction reverse biased.
    pub fn active(&self) -> bool {
        self.collector_emitter_v > SATURATION_V && self.collector_base_v > 0.0
    }
}

/// The bias resistors and supply (SI).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Bias {
    /// Supply voltage, volts.
    pub supply_v: f64,
    /// Base divider, supply to base, ohms.
    pub upper: f64,
    /// Base divider, base to ground, ohms.
    pub lower: f64,
    /// Emitter resistor, ohms.
    pub emitter: f64,
}

impl Bias {
    /// The divider's Thévenin voltage, volts.
    pub fn thevenin_v(&self) -> f64 {
        self.supply_v * self.lower / (self.upper + self.lower)
    }

    /// The divider's Thévenin resistance R1·R2/(R1 + R2), ohms.
    pub fn thevenin_r(&self) -> f64 {
        self.upper * self.lower / (self.upper + self.lower)
    }
}

/// The operating point of `t` under `bias`, with `collector_dc_r` ohms (the coil's DC
/// resistance) between the supply and the collector.
pub fn operating_point(t: &Transistor, bias: &Bias, collector_dc_r: f64) -> OperatingPoint {
    let (vth, rth, re) = (bias.thevenin_v(), bias.thevenin_r(), bias.emitter);
    let beta = t.beta;
    // The base loop's collector current for a given V_BE.
    let loop_ic = |vbe: f64| (vth - vbe) / (rth / beta + re * (beta + 1.0) / beta);
    let (mut lo, mut hi) = (0.0_f64, vth.max(0.0));
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if t.collector_current(mid) > loop_ic(mid) {
            hi = mid;
        } else {
            lo = mid;
        }
    }
    let vbe = 0.5 * (lo + hi);
    let ic = t.collector_current(vbe).max(0.0);
    let ib = ic / beta;
    let ie = ic + ib;
    let ve = ie * re;
    let vb = ve + vbe;
    let vc = bias.supply_v - ic * collector_dc_r;
    let supply_current = (bias.supply_v - vb) / bias.upper + ic;
    OperatingPoint {
        collector_current: ic,
        base_current: ib,
        emitter_current: ie,
        base_emitter_v: vbe,
        base_v: vb,
        emitter_v: ve,
        collector_v: vc,
        collector_emitter_v: vc - ve,
        collector_base_v: vc - vb,
        supply_current,
        transconductance: ic / super::transistor::THERMAL_VOLTAGE,
        dissipation: (vc - ve) * ic,
    }
}

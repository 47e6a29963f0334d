//! The oscillator's transistor: the few figures a builder has (hFE, the two junction
//! capacitances, the transit frequency) or a SPICE `.model NAME NPN(...)` line.
//!
//! # The model
//! The Ebers–Moll transport law in forward activity, I_C = I_S·(exp(V_BE/V_T) − 1) with
//! I_B = I_C/β, and the hybrid-π small-signal model at the operating point: g_m = I_C/V_T,
//! g_π = g_m/β, C_π = C_je(V_BE) + τ_F·g_m, C_μ = C_jc(V_CB) (the Gummel–Poon model of SPICE
//! reduced to its first-order terms: no Early voltage, no high-injection knee, no base
//! resistance; P. R. Gray and R. G. Meyer, *Analysis and Design of Analog Integrated
//! Circuits*, chapter 1, from memory). The depletion capacitances follow the law in
//! [`crate::physics::junction`] (SPICE's, with its forward knee FC for the emitter junction).

use crate::physics::junction::JunctionLaw;
use crate::tuning::spice_model::{DeviceType, ModelError, parse_model, parse_statement};

/// Thermal voltage kT/q at SPICE's nominal 27 °C (300.15 K), volts (CODATA 2018 k/q =
/// 8.617333e-5 V/K).
pub const THERMAL_VOLTAGE: f64 = 8.617_333e-5 * 300.15;

/// Base–emitter voltage assumed at 1 mA when only hFE and the capacitances are given: 0.65 V
/// for a small silicon transistor (common practice).
pub const VBE_AT_1MA: f64 = 0.65;

/// A junction capacitance: a fixed figure (as a data sheet gives it) or SPICE's bias law.
#[derive(Clone, Copy, Debug, PartialEq)]
pub enum JunctionCapacitance {
    /// The same capacitance at every bias, farads.
    Fixed(f64),
    /// The depletion law of a `.model` line.
    Law(JunctionLaw),
}

impl JunctionCapacitance {
    /// The capacitance at a reverse bias `reverse_v` (negative: forward), farads.
    pub fn at(&self, reverse_v: f64) -> f64 {
        match self {
            JunctionCapacitance::Fixed(c) => *c,
            JunctionCapacitance::Law(law) => law.capacitance(reverse_v),
        }
    }
}

/// Ratings the builder may state; each absent one is not checked.
#[derive(Clone, Copy, Debug, Default, PartialEq)]
pub struct Ratings {
    /// Largest collector–emitter voltage (V_CEO), volts.
    pub collector_emitter_max: Option<f64>,
    /// Largest collector current, amperes.
    pub collector_max: Option<f64>,
    /// Largest dissipation, watts.
    pub dissipation_max: Option<f64>,
}

/// The transistor as the stage's analysis sees it (SI).
#[derive(Clone, Debug, PartialEq)]
pub struct Transistor {
    /// The model's name, when read from a `.model` line.
    pub name: Option<String>,
    /// Forward current gain β (hFE; SPICE `BF`).
    pub beta: f64,
    /// Transport saturation current I_S, amperes (SPICE `IS`).
    pub saturation_current: f64,
    /// Base–emitter depletion capacitance (SPICE `CJE`, `VJE`, `MJE`).
    pub base_emitter: JunctionCapacitance,
    /// Base–collector depletion capacitance (SPICE `CJC`, `VJC`, `MJC`).
    pub base_collector: JunctionCapacitance,
    /// Forward transit time τ_F, seconds (SPICE `TF`; from f_T as 1/(2π·f_T)).
    pub transit_time: f64,
    /// Ratings to check the operating point against.
    pub ratings: Ratings,
    /// Parameters of a `.model` line this analysis does not use, upper case, in order.
    pub unused: Vec<String>,
}

/// The parameters of a `.model` line the stage uses.
pub const USED_PARAMETERS: [&str; 10] = [
    "IS", "BF", "CJE", "VJE", "MJE", "CJC", "VJC", "MJC", "FC", "TF",
];

/// Accepted hFE.
pub const BETA_RANGE: (f64, f64) = (5.0, 2000.0);

impl Transistor {
    /// From the figures on a data sheet: hFE, C_be and C_bc (each taken at every bias) and
    /// the transit frequency f_T, with τ_F = 1/(2π·f_T) (the junction capacitances' share of
    /// f_T neglected: from memory, the usual first estimate of SPICE's TF) and I_S set so
    /// that V_BE = 0.65 V at 1 mA ([`VBE_AT_1MA`]).
    pub fn from_figures(beta: f64, cbe: f64, cbc: f64, transit_frequency: f64) -> Self {
        Self {
            name: None,
            beta,
            saturation_current: 1e-3 / (VBE_AT_1MA / THERMAL_VOLTAGE).exp(),
            base_emitter: JunctionCapacitance::Fixed(cbe),
            base_collector: JunctionCapacitance::Fixed(cbc),
            transit_time: 1.0 / (2.0 * std::f64::consts::PI * transit_frequency),
            ratings: Ratings::default(),
            unused: Vec::new(),
        }
    }

    /// From a SPICE `.model NAME NPN(...)` line (continuation lines allowed). Missing
    /// parameters take SPICE's defaults (Berkeley SPICE3 manual: IS = 1e-16 A, BF = 100,
    /// CJE = 0, VJE = 0.75 V, MJE = 0.33, TF = 0); CJC is required (the reader of
    /// [`crate::tuning::spice_model`] gives its law). The rest is listed in
    /// [`Transistor::unused`].
    pub fn from_model(text: &str) -> Result<Self, ModelError> {
        let statement = parse_statement(text)?;
        if statement.device != DeviceType::Npn {
            return Err(ModelError(format!(
                ".model {}: the stage is built round an NPN transistor (the type is not NPN)",
                statement.name
            )));
        }
        let junction = parse_model(text)?;
        let get = |k: &str| statement.get(k);
        let beta = get("BF").unwrap_or(100.0);
        let is = get("IS").unwrap_or(1e-16);
        let tf = get("TF").unwrap_or(0.0);
        let cje = get("CJE").unwrap_or(0.0);
        let vje = get("VJE").unwrap_or(0.75);
        let mje = get("MJE").unwrap_or(0.33);
        let name = &statement.name;
        if !(BETA_RANGE.0..=BETA_RANGE.1).contains(&beta) {
            return Err(ModelError(format!(
                ".model {name}: BF = {beta:e} is outside {}–{}",
                BETA_RANGE.0, BETA_RANGE.1
            )));
        }
        if !(1e-20..=1e-9).contains(&is) {
            return Err(ModelError(format!(
                ".model {name}: IS = {is:e} A is outside 1e-20–1e-9 A"
            )));
        }
        if !(0.0..=1e-7).contains(&tf) {
            return Err(ModelError(format!(
                ".model {name}: TF = {tf:e} s is outside 0–1e-7 s"
            )));
        }
        let sane_cje = (0.0..=1e-9).contains(&cje) && (0.1..=3.5).contains(&vje) && mje > 0.0;
        if !sane_cje || mje >= 5.0 {
            return Err(ModelError(format!(
                ".model {name}: CJE = {cje:e} F must be 0–1e-9 F, VJE = {vje:e} 0.1–3.5 V, \
                 MJE = {mje:e} between 0 and 5"
            )));
        }
        let emitter_law = JunctionLaw {
            cj0: cje,
            contact_potential: vje,
            grading: mje,
            forward_knee: junction.law.forward_knee,
        };
        let unused = statement
            .params
            .iter()
            .map(|(k, _)| k.clone())
            .filter(|k| !USED_PARAMETERS.contains(&k.as_str()))
            .fold(Vec::new(), |mut v: Vec<String>, k| {
                if !v.contains(&k) {
                    v.push(k);
                }
                v
            });
        Ok(Self {
            name: Some(statement.name),
            beta,
            saturation_current: is,
            base_emitter: JunctionCapacitance::Law(emitter_law),
            base_collector: JunctionCapacitance::Law(junction.law),
            transit_time: tf,
            ratings: Ratings::default(),
            unused,
        })
    }

    /// V_BE at collector current `ic`, volts: V_T·ln(1 + I_C/I_S).
    pub fn base_emitter_voltage(&self, ic: f64) -> f64 {
        THERMAL_VOLTAGE * (ic.max(0.0) / self.saturation_current).ln_1p()
    }

    /// I_C at base–emitter voltage `vbe`, amperes: I_S·(exp(V_BE/V_T) − 1).
    pub fn collector_current(&self, vbe: f64) -> f64 {
        self.saturation_current * (vbe / THERMAL_VOLTAGE).exp_m1()
    }

    /// The transit frequency at collector current `ic` and the operating point's junction
    /// capacitances: f_T = g_m/(2π·(C_π + C_μ)), hertz.
    pub fn transit_frequency(&self, ic: f64, vbe: f64, vcb: f64) -> f64 {
        let gm = ic / THERMAL_VOLTAGE;
        let c = self.base_emitter.at(-vbe) + self.transit_time * gm + self.base_collector.at(vcb);
        gm / (2.0 * std::f64::consts::PI * c)
    }
}

//! The capacitance of a p–n junction (a transistor's collector–base junction or a varactor)
//! as a function of its bias: the depletion law SPICE uses.

/// The three numbers of the depletion-capacitance law, plus SPICE's forward-bias knee.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct JunctionLaw {
    /// Zero-bias capacitance Cj0, farads (SPICE `CJO` for a diode, `CJC` for a transistor's
    /// collector–base junction).
    pub cj0: f64,
    /// Built-in (contact) potential φ, volts (`VJ` / `VJC`), typically 0.5–0.9 V.
    pub contact_potential: f64,
    /// Grading exponent m (`M` / `MJC`): 1/2 for an abrupt junction, 1/3 for a linearly
    /// graded one, up to about 2 for hyperabrupt varactors.
    pub grading: f64,
    /// Forward-bias coefficient FC (SPICE's `FC`, default 0.5): above a forward bias of FC·φ
    /// the law is continued by its tangent.
    pub forward_knee: f64,
}

/// SPICE's default forward-bias coefficient FC.
pub const DEFAULT_FORWARD_KNEE: f64 = 0.5;

/// Rate at which a silicon junction's contact potential falls with temperature, V/K
/// (about −2 mV/K: common practice). It makes the junction capacitance rise when warm.
pub const CONTACT_POTENTIAL_SLOPE: f64 = -2e-3;

impl JunctionLaw {
    /// A law with SPICE's default forward-bias coefficient.
    pub fn new(cj0: f64, contact_potential: f64, grading: f64) -> Self {
        Self {
            cj0,
            contact_potential,
            grading,
            forward_knee: DEFAULT_FORWARD_KNEE,
        }
    }

    /// Junction capacitance at a **reverse** bias `reverse_v` volts (negative = forward), farads.
    ///
    /// # Formula
    /// With the junction voltage V_d = −V_r (SPICE's sign; L. W. Nagel, *SPICE2: a computer
    /// program to simulate semiconductor circuits*, UC Berkeley ERL-M520, 1975; the ngspice
    /// manual's diode model):
    /// C = Cj0·(1 − V_d/φ)^(−m) = Cj0/(1 + V_r/φ)^m for V_d < FC·φ, and above it the tangent
    /// C = Cj0/(1 − FC)^(1+m)·(1 − FC·(1 + m) + m·V_d/φ).
    pub fn capacitance(&self, reverse_v: f64) -> f64 {
        let phi = self.contact_potential;
        let m = self.grading;
        let fc = self.forward_knee;
        let vd = -reverse_v;
        if vd < fc * phi {
            self.cj0 * (1.0 - vd / phi).powf(-m)
        } else {
            self.cj0 / (1.0 - fc).powf(1.0 + m) * (1.0 - fc * (1.0 + m) + m * vd / phi)
        }
    }

    /// dC/dV_r, farads per volt (negative: more reverse bias, less capacitance).
    ///
    /// # Formula
    /// In the depletion region dC/dV_r = −m·C/(φ + V_r).
    pub fn slope(&self, reverse_v: f64) -> f64 {
        let vd = -reverse_v;
        let phi = self.contact_potential;
        let m = self.grading;
        if vd < self.forward_knee * phi {
            -m * self.capacitance(reverse_v) / (phi + reverse_v)
        } else {
            -self.cj0 / (1.0 - self.forward_knee).powf(1.0 + m) * m / phi
        }
    }

    /// The same junction warmer by `delta_t` kelvin.
    ///
    /// # Formula
    /// φ(T) = φ + (dφ/dT)·ΔT with dφ/dT = [`CONTACT_POTENTIAL_SLOPE`] (common practice), and
    /// Cj0(T) = Cj0·(1 + m·(4·10⁻⁴·ΔT − Δφ/φ)), the zero-bias scaling of the SPICE2 diode
    /// model (P. Antognetti, G. Massobrio, *Semiconductor Device Modeling with SPICE*, 2nd ed.
    /// 1993, ch. 1; from memory). A first-order estimate for a few tens of kelvin.
    pub fn at_temperature_offset(&self, delta_t: f64) -> Self {
        let d_phi = CONTACT_POTENTIAL_SLOPE * delta_t;
        let phi = self.contact_potential;
        Self {
            cj0: self.cj0 * (1.0 + self.grading * (4e-4 * delta_t - d_phi / phi)),
            contact_potential: phi + d_phi,
            ..*self
        }
    }
}

/// Two capacitors in series, farads: a·b/(a + b) (zero when both are zero).
pub fn series(a: f64, b: f64) -> f64 {
    let sum = a + b;
    if sum > 0.0 { a * b / sum } else { 0.0 }
}

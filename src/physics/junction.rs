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

    /// The same junction at `temperature_c` when its parameters hold at `nominal_c` (°C).
    ///
    /// # Formula
    /// The SPICE diode model's temperature law (Berkeley SPICE3 and ngspice; P. Antognetti,
    /// G. Massobrio, *Semiconductor Device Modeling with SPICE*, 2nd ed. 1993, ch. 1), with
    /// T_ref = 300.15 K, V_t = kT/q and the silicon gap E_g(T) = 1.16 − 7.02·10⁻⁴·T²/(T + 1108) eV:
    /// pbfact(T) = −2·V_t·(1.5·ln(T/T_ref) + q·(−E_g(T)/(2kT) + 1.1150877/(2k·T_ref))),
    /// φ₀ = (φ − pbfact(T_nom))/(T_nom/T_ref), φ(T) = pbfact(T) + (T/T_ref)·φ₀,
    /// Cj0(T) = Cj0·(1 + m·(4·10⁻⁴·(T − T_ref) − (φ(T) − φ₀)/φ₀))
    ///             /(1 + m·(4·10⁻⁴·(T_nom − T_ref) − (φ − φ₀)/φ₀)).
    /// The contact potential falls by about 2 mV/K and the capacitance rises; the tests hold
    /// this to ngspice's operating point at other temperatures.
    pub fn at_temperature(&self, nominal_c: f64, temperature_c: f64) -> Self {
        const K: f64 = 1.380_649e-23;
        const Q: f64 = 1.602_176_634e-19;
        const T_REF: f64 = 300.15;
        let kelvin = |c: f64| c + 273.15;
        let (t, t_nom) = (kelvin(temperature_c), kelvin(nominal_c));
        let gap = |t: f64| 1.16 - 7.02e-4 * t * t / (t + 1108.0);
        let pbfact = |t: f64| {
            let vt = K * t / Q;
            let arg = -gap(t) / (2.0 * K * t) + 1.115_087_7 / (2.0 * K * T_REF);
            -2.0 * vt * (1.5 * (t / T_REF).ln() + Q * arg)
        };
        let phi = self.contact_potential;
        let m = self.grading;
        let phi0 = (phi - pbfact(t_nom)) / (t_nom / T_REF);
        let phi_t = pbfact(t) + (t / T_REF) * phi0;
        let old = 1.0 + m * (4e-4 * (t_nom - T_REF) - (phi - phi0) / phi0);
        let new = 1.0 + m * (4e-4 * (t - T_REF) - (phi_t - phi0) / phi0);
        Self {
            cj0: self.cj0 / old * new,
            contact_potential: phi_t,
            ..*self
        }
    }
}

/// Two capacitors in series, farads: a·b/(a + b) (zero when both are zero).
pub fn series(a: f64, b: f64) -> f64 {
    let sum = a + b;
    if sum > 0.0 { a * b / sum } else { 0.0 }
}

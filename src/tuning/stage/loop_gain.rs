//! The small-signal loop gain of the Colpitts stage, from the nodal admittances of the whole
//! circuit at one frequency.
//!
//! # Method
//! Two nodes carry the signal: the tank's hot end (the collector in the common-base stage,
//! the base in the common-collector one) and the emitter. Every passive element and the
//! transistor's g_π, C_π, C_μ enter the 2×2 nodal admittance matrix **Y**; the controlled
//! source g_m·v_be is the one element left out. Driving that source from an independent
//! voltage v_x gives the return ratio T = v_be/v_x = cᵀ·**Y**⁻¹·**g** (H. W. Bode, *Network
//! Analysis and Feedback Amplifier Design*, 1945, chapter IV, the return ratio of a controlled
//! source): the circuit's determinant with the source in place is det **Y**·(1 − T), so it
//! oscillates where T is real and at least 1 (the Barkhausen criterion). The loop gain stated
//! is the transconductance over the least that makes T reach 1 at zero phase
//! (`critical_scale` in the stage's module), which is T itself wherever T grows in
//! proportion to g_m.
//!
//! Unlike the ideal-transformer view of the tapped capacitor (the emitter's load reflected to
//! the collector by the divider ratio squared, as in K. K. Clarke and D. T. Hess,
//! *Communication Circuits: Analysis and Design*, 1971, chapter 6, from memory), nothing here
//! assumes the emitter's resistance large against the lower capacitor's reactance, which at VHF
//! and a milliampere or more it is not. [`transformer_estimate`] gives that textbook figure for
//! comparison.
//!
//! The tank is the coil as the model gives it at the operating frequency (inductance L in
//! series with its AC resistance R, its self-capacitance beside it) with the tank's own
//! capacitors across it.

use num_complex::Complex64;

/// The common-base or common-collector Colpitts stage.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Default)]
pub enum Topology {
    /// Base at RF ground; the tank from collector to supply; the divider from collector to
    /// emitter and emitter to ground.
    #[default]
    CommonBase,
    /// Collector at RF ground; the tank from base to ground (through a blocking capacitor
    /// taken as a short at RF); the divider from base to emitter and emitter to ground; the
    /// base bias divider across the tank.
    CommonCollector,
}

impl Topology {
    /// Both topologies, for lists.
    pub const ALL: [Topology; 2] = [Topology::CommonBase, Topology::CommonCollector];

    /// The command line's name.
    pub fn cli_name(self) -> &'static str {
        match self {
            Topology::CommonBase => "common-base",
            Topology::CommonCollector => "common-collector",
        }
    }

    /// In words.
    pub fn label(self) -> &'static str {
        match self {
            Topology::CommonBase => "common-base Colpitts",
            Topology::CommonCollector => "common-collector Colpitts",
        }
    }

    /// From the command line's name.
    pub fn from_cli_name(name: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|t| t.cli_name() == name)
    }
}

/// The small-signal circuit at the operating point (SI).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Network {
    /// The topology.
    pub topology: Topology,
    /// The coil's inductance, henries.
    pub inductance: f64,
    /// The coil's series (AC) resistance, ohms.
    pub series_resistance: f64,
    /// Everything across the coil but the divider and the transistor: self-capacitance,
    /// fixed, trimmer, stray; farads.
    pub tank_capacitance: f64,
    /// Divider, tank's hot end to emitter, farads.
    pub upper: f64,
    /// Divider, emitter to ground, farads.
    pub lower: f64,
    /// Emitter resistor, ohms.
    pub emitter_r: f64,
    /// The bias divider's Thévenin resistance, ohms (across the tank in the common-collector
    /// stage; at RF ground in the common-base one).
    pub base_r: f64,
    /// Transconductance, siemens.
    pub gm: f64,
    /// β, for g_π = g_m/β.
    pub beta: f64,
    /// Base–emitter capacitance: depletion plus τ_F·g_m, farads.
    pub c_pi: f64,
    /// Base–collector capacitance, farads.
    pub c_mu: f64,
    /// The Clapp series capacitor between the coil's hot end and the base, farads (common
    /// collector only; `None`: the coil meets the base through a short at RF).
    pub clapp: Option<f64>,
}

impl Network {
    /// The same network with the transistor's active part (g_m, g_π and the diffusion share
    /// `diffusion` of C_π) scaled by `k`: the large-signal transconductance of the steady
    /// oscillation as a share of the small-signal one.
    pub fn limited(&self, k: f64, diffusion: f64) -> Self {
        Self {
            gm: self.gm * k,
            c_pi: self.c_pi - diffusion + diffusion * k,
            ..*self
        }
    }

    /// The coil's admittance with the tank's capacitors at complex frequency `s`.
    fn tank(&self, s: Complex64) -> Complex64 {
        Complex64::new(1.0, 0.0) / (self.series_resistance + s * self.inductance)
            + s * self.tank_capacitance
    }

    /// The coil's branch from the base to ground in the common-collector stage: the tank,
    /// in series with the Clapp capacitor when there is one.
    fn coil_branch(&self, s: Complex64) -> Complex64 {
        let y = self.tank(s);
        match self.clapp {
            Some(c) => Complex64::new(1.0, 0.0) / (Complex64::new(1.0, 0.0) / y + 1.0 / (s * c)),
            None => y,
        }
    }

    /// The return ratio T at angular frequency `w`.
    pub fn return_ratio(&self, w: f64) -> Complex64 {
        self.return_ratio_at(Complex64::new(0.0, w))
    }

    /// The return ratio T at complex frequency `s` (Laplace variable, 1/s).
    pub fn return_ratio_at(&self, s: Complex64) -> Complex64 {
        let g_pi = self.gm / self.beta;
        let zero = Complex64::new(0.0, 0.0);
        // Nodes: 0 the tank's hot end, 1 the emitter.
        let (y, g, ctrl) = match self.topology {
            Topology::CommonBase => {
                let y00 = self.tank(s) + s * (self.c_mu + self.upper);
                let y01 = -s * self.upper;
                let y11 = s * (self.upper + self.lower + self.c_pi) + g_pi + 1.0 / self.emitter_r;
                // g_m·v_be flows from the collector (node 0) to the emitter (node 1);
                // v_be = −v_e.
                (
                    [[y00, y01], [y01, y11]],
                    [Complex64::new(-1.0, 0.0), Complex64::new(1.0, 0.0)],
                    [zero, Complex64::new(-1.0, 0.0)],
                )
            }
            Topology::CommonCollector => {
                let ybe = s * (self.upper + self.c_pi) + g_pi;
                let y00 = self.coil_branch(s) + s * self.c_mu + 1.0 / self.base_r + ybe;
                let y11 = ybe + s * self.lower + 1.0 / self.emitter_r;
                // g_m·v_be flows from the collector (RF ground) into the emitter (node 1);
                // v_be = v_b − v_e.
                (
                    [[y00, -ybe], [-ybe, y11]],
                    [zero, Complex64::new(1.0, 0.0)],
                    [Complex64::new(1.0, 0.0), Complex64::new(-1.0, 0.0)],
                )
            }
        };
        let det = y[0][0] * y[1][1] - y[0][1] * y[1][0];
        // v = Y⁻¹·(g_m·g); T = cᵀ·v.
        let v0 = (y[1][1] * g[0] - y[0][1] * g[1]) / det * self.gm;
        let v1 = (y[0][0] * g[1] - y[1][0] * g[0]) / det * self.gm;
        ctrl[0] * v0 + ctrl[1] * v1
    }

    /// The circuit's natural frequency near `around` hertz: the root s of T(s) = 1 (the
    /// determinant with the source in place), by Newton's method from s = j·2π·around. Its
    /// imaginary part over 2π is the frequency a small ring runs at, its real part the ring's
    /// growth rate (1/s; negative: it dies away). `None` when Newton's method does not settle.
    pub fn natural_frequency(&self, around: f64) -> Option<Complex64> {
        let mut s = Complex64::new(0.0, 2.0 * std::f64::consts::PI * around);
        for _ in 0..60 {
            let f = self.return_ratio_at(s) - 1.0;
            let h = 1e-7 * s.norm();
            let d = (self.return_ratio_at(s + h) - self.return_ratio_at(s - h)) / (2.0 * h);
            let step = f / d;
            s -= step;
            if !(s.re.is_finite() && s.im.is_finite()) {
                return None;
            }
            if step.norm() < 1e-13 * s.norm() {
                return (s.im > 0.0).then_some(s);
            }
        }
        None
    }

    /// The frequency (hertz) nearest `around` where T's phase is zero with T's real part
    /// positive, and T there; `None` when there is none within ±40 % of `around`. The search
    /// steps out from `around` by geometrically growing offsets (1e-5 of it, then 1.4 times
    /// as far each step) on both sides, then bisects the first sign change of Im T.
    pub fn zero_phase(&self, around: f64) -> Option<(f64, f64)> {
        let w0 = 2.0 * std::f64::consts::PI * around;
        let im = |w: f64| self.return_ratio(w).im;
        let mut best: Option<(f64, f64)> = None;
        for side in [1.0, -1.0] {
            let (mut a, mut ia) = (w0, im(w0));
            let mut offset = 1e-5;
            while offset <= 0.4 {
                let b = w0 * (1.0 + side * offset);
                let ib = im(b);
                if ia.signum() != ib.signum() {
                    let (mut lo, mut hi, mut ilo) = (a, b, ia);
                    for _ in 0..64 {
                        let mid = 0.5 * (lo + hi);
                        let imid = im(mid);
                        if ilo.signum() == imid.signum() {
                            (lo, ilo) = (mid, imid);
                        } else {
                            hi = mid;
                        }
                    }
                    let w = 0.5 * (lo + hi);
                    let t = self.return_ratio(w).re;
                    if t > 0.0 {
                        let closer = best.is_none_or(|(bw, _)| (w - w0).abs() < (bw - w0).abs());
                        if closer {
                            best = Some((w, t));
                        }
                        break;
                    }
                }
                (a, ia) = (b, ib);
                offset *= 1.4;
            }
        }
        best.map(|(w, t)| (w / (2.0 * std::f64::consts::PI), t))
    }
}

/// The ideal-transformer estimate of the common-base loop gain at resonance, for comparison:
/// T = g_m·n·R_L with n = C1/(C1 + C2 + C_π) the divider's ratio and R_L the tank's parallel
/// loss resistance R_p = (ωL)²/R in parallel with the emitter's load (R_E ∥ α/g_m)/n² reflected
/// to the collector (Clarke and Hess 1971, chapter 6, from memory; valid while the emitter's
/// load is large against the reactance of C2).
pub fn transformer_estimate(n: &Network, frequency: f64) -> f64 {
    let w = 2.0 * std::f64::consts::PI * frequency;
    let ratio = n.upper / (n.upper + n.lower + n.c_pi);
    let rp = (w * n.inductance).powi(2) / n.series_resistance;
    let alpha = n.beta / (n.beta + 1.0);
    let r_emitter = 1.0 / (1.0 / n.emitter_r + n.gm / alpha);
    let reflected = r_emitter / (ratio * ratio);
    let rl = rp * reflected / (rp + reflected);
    n.gm * ratio * rl
}

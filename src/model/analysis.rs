//! Every figure computed for one coil and tank, with its warnings. SI units throughout.

use super::coil::Coil;
use super::inductance_model::InductanceModel;

/// Inductance of the coil (without leads) by every model, henries.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Inductances {
    /// Wheeler 1928 closed form.
    pub wheeler_1928: f64,
    /// Nagaoka's current sheet, exact.
    pub current_sheet: f64,
    /// Lundin 1985 closed form of the current sheet.
    pub lundin_1985: f64,
    /// Rosa's round-wire correction with uniform current (low frequency).
    pub round_wire_low_freq: f64,
    /// Rosa's round-wire correction with the internal inductance at the resonance.
    pub round_wire: f64,
    /// Sum over rings with Maxwell's mutual inductance, at the resonance (if computed).
    pub filament_sum: Option<f64>,
    /// Both straight leads, at the resonance.
    pub leads: f64,
    /// Rosa's k_s at the resonance.
    pub k_s: f64,
    /// Rosa's k_m.
    pub k_m: f64,
    /// Internal-inductance fraction of the wire at the resonance (1 at DC, → 0 at VHF).
    pub internal_inductance_fraction: f64,
}

impl Inductances {
    /// The coil's inductance by `model` (without leads); `None` for the filament sum when the
    /// conditions did not ask for it (see [`Conditions::computes_filament_sum`]).
    ///
    /// [`Conditions::computes_filament_sum`]: super::Conditions::computes_filament_sum
    pub fn by_model(&self, model: InductanceModel) -> Option<f64> {
        match model {
            InductanceModel::Wheeler1928 => Some(self.wheeler_1928),
            InductanceModel::CurrentSheet => Some(self.current_sheet),
            InductanceModel::Lundin1985 => Some(self.lundin_1985),
            InductanceModel::RoundWire => Some(self.round_wire),
            InductanceModel::FilamentSum => self.filament_sum,
        }
    }

    /// Largest minus smallest of the models that account for the wire (round wire at the
    /// resonance and filament sum) and the sheet models, as a fraction of the round-wire value.
    pub fn spread(&self) -> f64 {
        let mut values = vec![
            self.wheeler_1928,
            self.current_sheet,
            self.lundin_1985,
            self.round_wire_low_freq,
            self.round_wire,
        ];
        values.extend(self.filament_sum);
        let max = values.iter().copied().fold(f64::MIN, f64::max);
        let min = values.iter().copied().fold(f64::MAX, f64::min);
        (max - min) / self.round_wire
    }
}

/// Two estimates of the coil's own resonance, hertz.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct SelfResonance {
    /// 1/(2π√(L·C_self)) with Medhurst's self-capacitance.
    pub lumped: f64,
    /// Half-wave resonance of the helix with the Kandoian–Sichak velocity factor.
    pub helical: f64,
}

impl SelfResonance {
    /// The lower (more cautious) of the two.
    pub fn lower(&self) -> f64 {
        self.lumped.min(self.helical)
    }
}

/// What a warning is about, so the window can show it beside the right number.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum WarningTopic {
    /// One of the inductance models is outside its range.
    Inductance,
    /// Self-capacitance outside Medhurst's table.
    SelfCapacitance,
    /// The operating frequency is not well below self-resonance, or the estimate is weak.
    SelfResonance,
    /// Loss and Q: a model outside its range.
    Loss,
    /// The leads dominate.
    Leads,
    /// The resonance lies in a band worth a caution.
    Band,
    /// Something about the tank capacitance.
    Tank,
}

/// A figure that is computed but should be read with care.
#[derive(Clone, Debug, PartialEq)]
pub struct Warning {
    /// What it concerns.
    pub topic: WarningTopic,
    /// In words, with numbers.
    pub message: String,
}

/// Every figure for one coil and tank at its own resonance. SI units.
#[derive(Clone, Debug, PartialEq)]
pub struct Analysis {
    /// The validated coil the formulas saw (its geometry: diameters, pitch, gap, length, l/D,
    /// wire to cut).
    pub coil: Coil,
    /// Nagaoka's coefficient K_N for D/l.
    pub nagaoka_coefficient: f64,
    /// Coil inductance by every model.
    pub inductance: Inductances,
    /// The model that drives the resonance.
    pub model: InductanceModel,
    /// Coil (by the chosen model) plus leads, henries: what the tank sees at low frequency.
    pub total_inductance: f64,
    /// Apparent inductance at the resonance, L/(1 − (f/f_self)²) with the lumped
    /// self-resonance: what a bridge would measure across the coil's terminals.
    pub apparent_inductance: f64,
    /// Medhurst self-capacitance, farads.
    pub self_capacitance: f64,
    /// Medhurst's H factor used (pF per cm of diameter).
    pub medhurst_factor: f64,
    /// Everything across the coil except its self-capacitance, farads.
    pub external_capacitance: f64,
    /// External plus self-capacitance, farads.
    pub total_capacitance: f64,
    /// Resonant frequency of the tank, hertz.
    pub resonance: f64,
    /// Self-resonance estimates.
    pub self_resonance: SelfResonance,
    /// Copper resistivity at the wire temperature, Ω·m.
    pub resistivity: f64,
    /// Skin depth at the resonance, metres.
    pub skin_depth: f64,
    /// R_ac/R_dc of the straight isolated wire at the resonance.
    pub skin_resistance_ratio: f64,
    /// Proximity factor Φ applied to the coil's wire (not the leads).
    pub proximity_factor: f64,
    /// DC resistance of coil and leads, ohms.
    pub dc_resistance: f64,
    /// AC resistance of coil and leads at the resonance, ohms.
    pub ac_resistance: f64,
    /// Unloaded Q of the coil at the resonance: ωL/R_ac.
    pub q: f64,
    /// Cautions about figures outside a model's range.
    pub warnings: Vec<Warning>,
}

impl Analysis {
    /// Warnings about one topic.
    pub fn warnings_about(&self, topic: WarningTopic) -> impl Iterator<Item = &Warning> {
        self.warnings.iter().filter(move |w| w.topic == topic)
    }
}

//! From a winding and tank to every figure: the engine's one entry point.

use super::analysis::{Analysis, Geometry, Inductances, SelfResonance};
use super::coil::Coil;
use super::error::{Field, InputError};
use super::tank::Tank;
use super::winding::Winding;
use crate::physics::{
    copper, filament, helix, leads, medhurst, nagaoka, proximity, round_wire, wheeler,
};
use std::f64::consts::PI;

/// Which inductance model drives the resonance (the others are reported beside it).
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum InductanceModel {
    /// Wheeler 1928 closed form.
    Wheeler1928,
    /// Nagaoka's current sheet, exact.
    CurrentSheet,
    /// Lundin 1985 closed form.
    Lundin1985,
    /// Rosa's round-wire correction, frequency-aware (the default).
    RoundWire,
    /// Sum over rings (Maxwell's mutual inductance).
    FilamentSum,
}

impl InductanceModel {
    /// Every model, in the order shown.
    pub const ALL: [InductanceModel; 5] = [
        InductanceModel::RoundWire,
        InductanceModel::FilamentSum,
        InductanceModel::CurrentSheet,
        InductanceModel::Lundin1985,
        InductanceModel::Wheeler1928,
    ];

    /// Short name with the method's author.
    pub fn label(self) -> &'static str {
        match self {
            InductanceModel::Wheeler1928 => "Wheeler 1928",
            InductanceModel::CurrentSheet => "Nagaoka current sheet",
            InductanceModel::Lundin1985 => "Lundin 1985",
            InductanceModel::RoundWire => "Rosa round wire",
            InductanceModel::FilamentSum => "Maxwell filament sum",
        }
    }
}

/// Conditions of the evaluation that are not part of the coil or tank.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Conditions {
    /// Wire temperature, °C.
    pub temperature_c: f64,
    /// The model that drives the resonance.
    pub model: InductanceModel,
    /// Also compute the filament sum when another model drives (it costs N Maxwell terms).
    pub filament_sum: bool,
}

impl Default for Conditions {
    fn default() -> Self {
        Self {
            temperature_c: 20.0,
            model: InductanceModel::RoundWire,
            filament_sum: true,
        }
    }
}

/// Largest capacitance accepted anywhere in the tank, farads (10 nF: far beyond any VHF tank).
const CAPACITANCE_MAX: f64 = 10e-9;

fn check_capacitance(field: Field, what: &str, value: f64) -> Result<(), InputError> {
    if !value.is_finite() {
        return Err(InputError::new(field, format!("{what} is not a number")));
    }
    if !(0.0..=CAPACITANCE_MAX).contains(&value) {
        return Err(InputError::new(
            field,
            format!("{what} {:.3} pF is outside 0–10000 pF", value * 1e12),
        ));
    }
    Ok(())
}

/// Check a tank: every capacitance finite and within 0–10 nF, trimmer max ≥ min, setting 0–1.
pub(crate) fn validate_tank(t: &Tank) -> Result<(), InputError> {
    check_capacitance(Field::FixedCapacitance, "fixed capacitance", t.fixed)?;
    check_capacitance(Field::Trimmer, "trimmer minimum", t.trimmer_min)?;
    check_capacitance(Field::Trimmer, "trimmer maximum", t.trimmer_max)?;
    if t.trimmer_max < t.trimmer_min {
        return Err(InputError::new(
            Field::Trimmer,
            format!(
                "trimmer maximum {:.2} pF is below its minimum {:.2} pF",
                t.trimmer_max * 1e12,
                t.trimmer_min * 1e12
            ),
        ));
    }
    if !t.trimmer_setting.is_finite() || !(0.0..=1.0).contains(&t.trimmer_setting) {
        return Err(InputError::new(
            Field::TrimmerSetting,
            format!(
                "trimmer setting {} % is outside 0–100 %",
                t.trimmer_setting * 100.0
            ),
        ));
    }
    check_capacitance(Field::StrayCapacitance, "stray capacitance", t.stray)?;
    if let Some(fb) = t.feedback {
        check_capacitance(Field::Feedback, "upper feedback capacitor", fb.upper)?;
        check_capacitance(Field::Feedback, "lower feedback capacitor", fb.lower)?;
        if fb.upper <= 0.0 || fb.lower <= 0.0 {
            return Err(InputError::new(
                Field::Feedback,
                "both feedback capacitors must be above 0 pF",
            ));
        }
    }
    Ok(())
}

fn validate_conditions(c: &Conditions) -> Result<(), InputError> {
    if !c.temperature_c.is_finite() || !(-60.0..=200.0).contains(&c.temperature_c) {
        return Err(InputError::new(
            Field::Temperature,
            format!(
                "wire temperature {} °C is outside −60–200 °C",
                c.temperature_c
            ),
        ));
    }
    Ok(())
}

/// Evaluate a winding in a tank: validate, then compute every figure.
pub fn evaluate(
    winding: &Winding,
    tank: &Tank,
    conditions: &Conditions,
) -> Result<Analysis, InputError> {
    let coil = Coil::from_winding(winding)?;
    validate_tank(tank)?;
    validate_conditions(conditions)?;
    Ok(evaluate_coil(
        &coil,
        tank.external_capacitance(),
        conditions,
    ))
}

/// The frequency-independent part of a coil's figures, computed once per evaluation.
///
/// Rosa's k_s, the ring self-inductance and the leads are linear in the wire's internal
/// inductance fraction χ, so each is kept as its values at χ = 0 and χ = 1 and blended.
#[derive(Clone, Copy, Debug)]
struct Fixed {
    nagaoka: f64,
    current_sheet: f64,
    k_m: f64,
    /// Rosa round-wire inductance with surface current (χ = 0) and uniform current (χ = 1).
    round_wire: [f64; 2],
    /// Both leads at χ = 0 and χ = 1.
    leads: [f64; 2],
    /// The driving model's inductance when it does not depend on frequency.
    sheet_model: Option<f64>,
    medhurst_factor: f64,
    self_capacitance: f64,
}

impl Fixed {
    fn new(coil: &Coil, model: InductanceModel) -> Self {
        let d = coil.mean_diameter;
        let d_over_l = d / coil.length;
        let nagaoka = nagaoka::coefficient(d_over_l);
        let current_sheet = nagaoka::current_sheet_inductance(d, coil.length, coil.turns, nagaoka);
        let k_m = round_wire::k_m(coil.turns);
        // k_s is 3/2 − ln(2p/d) − χ/4: one logarithm serves both limits.
        let k_s_surface = round_wire::k_s(coil.pitch, coil.wire_bare, 0.0);
        let rosa = |k_s: f64| current_sheet - round_wire::correction(d, coil.turns, k_s, k_m);
        let lead = leads::straight_wire_inductance_limits(coil.lead_length, 0.5 * coil.wire_bare);
        let sheet_model = match model {
            InductanceModel::Wheeler1928 => Some(wheeler::inductance(d, coil.length, coil.turns)),
            InductanceModel::CurrentSheet => Some(current_sheet),
            InductanceModel::Lundin1985 => Some(nagaoka::current_sheet_inductance(
                d,
                coil.length,
                coil.turns,
                nagaoka::coefficient_lundin(d_over_l),
            )),
            InductanceModel::RoundWire | InductanceModel::FilamentSum => None,
        };
        let medhurst_factor = medhurst::factor(coil.length_over_diameter());
        Self {
            nagaoka,
            current_sheet,
            k_m,
            round_wire: [rosa(k_s_surface), rosa(k_s_surface - 0.25)],
            leads: [2.0 * lead[0], 2.0 * lead[1]],
            sheet_model,
            medhurst_factor,
            // Medhurst: H pF per cm of diameter.
            self_capacitance: medhurst_factor * d * 1e-10,
        }
    }

    /// The driving inductance (coil by the model, plus leads) with surface current, the
    /// high-frequency limit: the starting point of the resonance iteration.
    fn high_frequency_inductance(&self) -> f64 {
        self.sheet_model.unwrap_or(self.round_wire[0]) + self.leads[0]
    }
}

fn blend(pair: [f64; 2], chi: f64) -> f64 {
    pair[0] + chi * (pair[1] - pair[0])
}

/// Inductances at one frequency.
#[derive(Clone, Copy, Debug)]
struct AtFrequency {
    chi: f64,
    skin: copper::InternalImpedance,
    skin_depth: f64,
    round_wire: f64,
    filament: Option<f64>,
    leads: f64,
    driving: f64,
}

fn at_frequency(
    coil: &Coil,
    fixed: &Fixed,
    c: &Conditions,
    skin_scale: f64,
    frequency: f64,
) -> AtFrequency {
    let radius = 0.5 * coil.wire_bare;
    let radius_over_skin_depth = skin_scale * frequency.sqrt();
    let skin_depth = radius / radius_over_skin_depth;
    let skin = copper::internal_impedance(radius_over_skin_depth);
    let chi = skin.internal_inductance_fraction;
    let round_wire = blend(fixed.round_wire, chi);
    let filament = (c.filament_sum || c.model == InductanceModel::FilamentSum).then(|| {
        filament::filament_sum(
            coil.turns,
            0.5 * coil.mean_diameter,
            coil.pitch,
            radius,
            chi,
        )
    });
    let leads = blend(fixed.leads, chi);
    let coil_l = match c.model {
        InductanceModel::RoundWire => round_wire,
        InductanceModel::FilamentSum => filament.unwrap_or(round_wire),
        _ => fixed.sheet_model.unwrap_or(round_wire),
    };
    AtFrequency {
        chi,
        skin,
        skin_depth,
        round_wire,
        filament,
        leads,
        driving: coil_l + leads,
    }
}

fn lc_frequency(inductance: f64, capacitance: f64) -> f64 {
    1.0 / (2.0 * PI * (inductance * capacitance).sqrt())
}

/// Relative step of the iteration below which it stops. The map contracts by k ≈ ½·|d ln L /
/// d ln f|, under 1e-3 at VHF (the internal inductance is a fraction of a per cent of L), so
/// the error left after a step of 1e-6 is about k·1e-6 < 1e-9 (0.1 Hz at 100 MHz).
const RESONANCE_STEP_TOLERANCE: f64 = 1e-6;

/// Solve f = 1/(2π√(L(f)·C)) by fixed-point iteration. L depends on f only through the wire's
/// internal inductance; starting from its surface-current limit, two rounds usually reach
/// [`RESONANCE_STEP_TOLERANCE`]. The figures returned are those at the last frequency tried,
/// which differ from those at the returned frequency by k times the last step.
fn solve(
    coil: &Coil,
    fixed: &Fixed,
    c: &Conditions,
    resistivity: f64,
    capacitance: f64,
) -> (f64, AtFrequency) {
    let mut f = lc_frequency(fixed.high_frequency_inductance(), capacitance);
    let skin_scale = copper::radius_over_skin_depth_per_root_hz(resistivity, 0.5 * coil.wire_bare);
    let mut at = at_frequency(coil, fixed, c, skin_scale, f);
    for _ in 0..12 {
        let next = lc_frequency(at.driving, capacitance);
        if (next - f).abs() <= RESONANCE_STEP_TOLERANCE * next {
            return (next, at);
        }
        f = next;
        at = at_frequency(coil, fixed, c, skin_scale, f);
    }
    (f, at)
}

/// Resonant frequency only, hertz, for a validated coil and an external capacitance: the same
/// solution as [`evaluate_coil`] without the other figures (for sweeps and solvers).
pub fn resonance_of(coil: &Coil, external_capacitance: f64, conditions: &Conditions) -> f64 {
    let fixed = Fixed::new(coil, conditions.model);
    let c = Conditions {
        filament_sum: false,
        ..*conditions
    };
    let resistivity = copper::resistivity(conditions.temperature_c);
    solve(
        coil,
        &fixed,
        &c,
        resistivity,
        external_capacitance + fixed.self_capacitance,
    )
    .0
}

/// Every figure for a validated coil across `external_capacitance` farads.
///
/// The self-capacitance is counted once: added to the tank capacitance beside the coil's
/// inductance. The apparent inductance is reported separately and not used again.
pub fn evaluate_coil(coil: &Coil, external_capacitance: f64, conditions: &Conditions) -> Analysis {
    let fixed = Fixed::new(coil, conditions.model);
    let resistivity = copper::resistivity(conditions.temperature_c);
    let total_capacitance = external_capacitance + fixed.self_capacitance;
    let (f, at) = solve(coil, &fixed, conditions, resistivity, total_capacitance);
    let d = coil.mean_diameter;
    let l = coil.length;
    let lod = coil.length_over_diameter();

    let inductance = Inductances {
        wheeler_1928: wheeler::inductance(d, l, coil.turns),
        current_sheet: fixed.current_sheet,
        lundin_1985: nagaoka::current_sheet_inductance(
            d,
            l,
            coil.turns,
            nagaoka::coefficient_lundin(d / l),
        ),
        round_wire_low_freq: fixed.round_wire[1],
        round_wire: at.round_wire,
        filament_sum: at.filament,
        leads: at.leads,
        k_s: round_wire::k_s(coil.pitch, coil.wire_bare, at.chi),
        k_m: fixed.k_m,
        internal_inductance_fraction: at.chi,
    };

    let self_resonance = SelfResonance {
        lumped: helix::lumped_self_resonance(at.driving, fixed.self_capacitance),
        helical: helix::helical_self_resonance(d, coil.pitch, l),
    };
    let ratio_to_self = f / self_resonance.lumped;
    let apparent_inductance = at.driving / (1.0 - ratio_to_self * ratio_to_self).max(1e-9);

    let wire_length = coil.wire_length();
    let coil_wire = wire_length - 2.0 * coil.lead_length;
    let proximity_factor = proximity::wall_proximity_factor(coil.pitch / coil.wire_bare);
    let r_dc_coil = copper::dc_resistance(resistivity, coil.wire_bare, coil_wire);
    let r_dc_leads = copper::dc_resistance(resistivity, coil.wire_bare, 2.0 * coil.lead_length);
    let ac_resistance = at.skin.resistance_ratio * (r_dc_coil * proximity_factor + r_dc_leads);
    let q = 2.0 * PI * f * at.driving / ac_resistance;

    let geometry = Geometry {
        mean_diameter: d,
        former_diameter: coil.former_diameter,
        wire_bare: coil.wire_bare,
        wire_overall: coil.wire_overall,
        turns: coil.turns,
        pitch: coil.pitch,
        gap: coil.gap(),
        length: l,
        length_over_diameter: lod,
        lead_length: coil.lead_length,
        wire_length,
    };

    let mut analysis = Analysis {
        geometry,
        nagaoka_coefficient: fixed.nagaoka,
        inductance,
        model: conditions.model,
        total_inductance: at.driving,
        apparent_inductance,
        self_capacitance: fixed.self_capacitance,
        medhurst_factor: fixed.medhurst_factor,
        external_capacitance,
        total_capacitance,
        resonance: f,
        self_resonance,
        resistivity,
        skin_depth: at.skin_depth,
        skin_resistance_ratio: at.skin.resistance_ratio,
        proximity_factor,
        dc_resistance: r_dc_coil + r_dc_leads,
        ac_resistance,
        q,
        warnings: Vec::new(),
    };
    analysis.warnings = super::warnings::collect(&analysis, coil);
    analysis
}

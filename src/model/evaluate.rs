//! From a winding and tank to every figure: the engine's one entry point.

use super::analysis::{Analysis, Inductances, SelfResonance};
use super::coil::Coil;
use super::error::{Field, InputError};
use super::inductance_model::{Conditions, InductanceModel};
use super::tank::Tank;
use super::winding::Winding;
use crate::physics::constants::MU_0;
use crate::physics::{
    copper, filament, helix, leads, medhurst, nagaoka, proximity, round_wire, wheeler,
};
use std::f64::consts::PI;

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
    if !Conditions::INDUCTANCE_SCALE_RANGE.contains(&c.inductance_scale) {
        return Err(InputError::new(
            Field::Calibration,
            format!(
                "inductance scale {} is outside 0.5–2 (a build that far from the model is \
                 another coil)",
                c.inductance_scale
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
    tank.validate()?;
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
/// inductance fraction χ, so each is kept as its values at χ = 0 and χ = 1 and blended; the
/// driving inductance is therefore affine in χ too.
#[derive(Clone, Copy, Debug)]
struct Fixed {
    /// Bare wire radius r.
    wire_radius: f64,
    sheet: nagaoka::Sheet,
    k_m: f64,
    /// Rosa's k_s with surface current (χ = 0); it falls by χ/4.
    k_s_surface: f64,
    /// Rosa round-wire inductance with surface current (χ = 0) and uniform current (χ = 1).
    round_wire: [f64; 2],
    /// The filament sum at χ = 0 and χ = 1, when it is asked for or drives.
    filament: Option<[f64; 2]>,
    /// Both leads at χ = 0 and χ = 1.
    leads: [f64; 2],
    /// The driving inductance (coil by the model, plus leads) at χ = 0 and χ = 1.
    driving: [f64; 2],
    /// `driving[0]` with Lundin's closed form in place of the exact sheet: within a few ppm of
    /// it, and ready before the elliptic integrals are (see [`solve`]).
    driving_estimate: f64,
    /// The current sheet by Lundin's closed form.
    lundin: f64,
    medhurst_factor: f64,
    self_capacitance: f64,
}

impl Fixed {
    fn new(coil: &Coil, c: &Conditions) -> Self {
        let d = coil.mean_diameter();
        let l = coil.length();
        let sheet = nagaoka::sheet(d, l, coil.turns());
        let k_m = round_wire::k_m(coil.turns());
        // k_s is 3/2 − ln(2p/d) − χ/4: one logarithm serves both limits.
        let k_s_surface = round_wire::k_s(coil.pitch(), coil.wire_bare(), 0.0);
        let correction = |k_s: f64| round_wire::correction(d, coil.turns(), k_s, k_m);
        let surface_correction = correction(k_s_surface);
        let round_wire = [
            sheet.inductance - surface_correction,
            sheet.inductance - correction(k_s_surface - 0.25),
        ];
        let lundin = lundin_inductance(coil);
        let lead =
            leads::straight_wire_inductance_limits(coil.lead_length(), 0.5 * coil.wire_bare());
        let leads = [2.0 * lead[0], 2.0 * lead[1]];
        let filament = c.computes_filament_sum().then(|| {
            let at = |chi: f64| {
                filament::filament_sum(
                    coil.turns(),
                    0.5 * d,
                    coil.pitch(),
                    0.5 * coil.wire_bare(),
                    chi,
                )
            };
            [at(0.0), at(1.0)]
        });
        let coil_pair = match c.model {
            InductanceModel::RoundWire => round_wire,
            InductanceModel::FilamentSum => filament.unwrap_or(round_wire),
            InductanceModel::Wheeler1928 => [wheeler::inductance(d, l, coil.turns()); 2],
            InductanceModel::CurrentSheet => [sheet.inductance; 2],
            InductanceModel::Lundin1985 => [lundin; 2],
        };
        let scale = c.inductance_scale;
        let driving = [
            scale * (coil_pair[0] + leads[0]),
            scale * (coil_pair[1] + leads[1]),
        ];
        let driving_estimate = match c.model {
            InductanceModel::RoundWire => scale * (lundin - surface_correction + leads[0]),
            InductanceModel::CurrentSheet => scale * (lundin + leads[0]),
            InductanceModel::FilamentSum
            | InductanceModel::Lundin1985
            | InductanceModel::Wheeler1928 => driving[0],
        };
        let length_over_diameter = l / d;
        let medhurst_factor = medhurst::factor(length_over_diameter);
        Self {
            wire_radius: 0.5 * coil.wire_bare(),
            sheet,
            k_m,
            k_s_surface,
            round_wire,
            filament,
            leads,
            driving,
            driving_estimate,
            lundin,
            medhurst_factor,
            // Medhurst: H pF per cm of diameter.
            self_capacitance: medhurst_factor * d * 1e-10,
        }
    }
}

/// The current sheet with Lundin's closed form for Nagaoka's coefficient.
fn lundin_inductance(coil: &Coil) -> f64 {
    let (d, l) = (coil.mean_diameter(), coil.length());
    nagaoka::current_sheet_inductance(d, l, coil.turns(), nagaoka::coefficient_lundin(d / l))
}

fn blend(pair: [f64; 2], chi: f64) -> f64 {
    pair[0] + chi * (pair[1] - pair[0])
}

/// Bound on the relative error of the solved inductance at which the iteration stops:
/// 2e-9, so the frequency (∝ L^(−1/2)) is within 1e-9 (0.1 Hz at 100 MHz).
const RESONANCE_TOLERANCE: f64 = 2e-9;

/// The self-consistent operating point.
#[derive(Clone, Copy, Debug)]
struct Resonance {
    frequency: f64,
    /// Angular frequency, rad/s.
    omega: f64,
    /// Driving inductance (coil and leads), henries.
    inductance: f64,
    /// The wire's internal impedance at the last frequency tried.
    skin: copper::InternalImpedance,
    /// δ/r at the last frequency tried.
    depth_over_radius: f64,
}

/// Solve f = 1/(2π√(L(f)·C)) by fixed-point iteration.
///
/// L depends on f only through the wire's internal inductance fraction χ, L = L₀ + χ·ΔL, and χ
/// on f through the skin depth: δ = √(ρ/(πfµ0)) and f = 1/(2π√(LC)) give
/// δ/r = G·L^(1/4) with G = √(2ρ√C/µ0)/r. So the iteration runs on L alone,
/// L ← T(L) = L₀ + ΔL·χ(G·L^(1/4)), with two square roots a round and (above r/δ = 10) no
/// division.
///
/// **Start.** The fixed point of the same map with L₀ taken from Lundin's closed form (a few
/// ppm from the exact sheet), to first order: L_s = L̃₀ + ΔL·χ(G·L̃₀^(1/4)). It needs no
/// elliptic integral, so the processor computes it while the exact sheet is still under way.
///
/// **Stop.** T contracts with k = ΔL·|dχ/dL| = ΔL·|d ln χ/d ln q|·χ/(4L) ≤ ΔL·χ/(4L), since
/// |d ln χ/d ln q| ≤ 1 for round wire (q = r/δ ∝ L^(−1/4); checked over 1e-3 ≤ q ≤ 1e4 in the
/// tests). χ moves by a fraction k between iterates, so k_b = 1.01·ΔL·χ/(4L) bounds k with
/// margin, and the error after a step s is at most k_b/(1 − k_b)·|s|. The loop stops once
/// that is below [`RESONANCE_TOLERANCE`]·L, i.e. 1.01·ΔL·χ·(|s| + tol·L) ≤ 4·tol·L². At VHF
/// k is about 1e-4 and the start is within a few ppm, so one round usually suffices. The
/// figures returned are those at the last inductance tried, whose frequency differs from
/// the returned one by about half the last step, relatively.
fn solve(fixed: &Fixed, resistivity: f64, capacitance: f64) -> Resonance {
    let gain = (resistivity * (2.0 / MU_0) * capacitance.sqrt()).sqrt() / fixed.wire_radius;
    let [l0, l1] = fixed.driving;
    let slope = (l1 - l0).abs();
    let depth_at = |inductance: f64| gain * inductance.sqrt().sqrt();
    let chi_at = copper::internal_inductance_fraction_at_depth_ratio;
    let estimate = fixed.driving_estimate;
    let mut tried = estimate + slope * chi_at(depth_at(estimate));
    let mut depth_over_radius = depth_at(tried);
    let mut chi = chi_at(depth_over_radius);
    let mut next = l0 + slope * chi;
    for _ in 0..12 {
        let bound = 1.01 * slope * chi * ((next - tried).abs() + RESONANCE_TOLERANCE * next);
        if bound <= 4.0 * RESONANCE_TOLERANCE * next * next {
            break;
        }
        tried = next;
        depth_over_radius = depth_at(tried);
        chi = chi_at(depth_over_radius);
        next = l0 + slope * chi;
    }
    // ω = 1/√(LC).
    let omega = 1.0 / (next * capacitance).sqrt();
    Resonance {
        frequency: omega * (0.5 / PI),
        omega,
        inductance: next,
        skin: copper::internal_impedance_at_depth_ratio(depth_over_radius),
        depth_over_radius,
    }
}

/// Resonant frequency only, hertz, for a validated coil and an external capacitance: the same
/// solution as [`evaluate_coil`] without the other figures (for sweeps and solvers).
pub fn resonance_of(coil: &Coil, external_capacitance: f64, conditions: &Conditions) -> f64 {
    let c = Conditions {
        filament_sum: false,
        ..*conditions
    };
    let fixed = Fixed::new(coil, &c);
    let resistivity = copper::resistivity(conditions.temperature_c);
    solve(
        &fixed,
        resistivity,
        external_capacitance + fixed.self_capacitance,
    )
    .frequency
}

/// Every figure for a validated coil across `external_capacitance` farads.
///
/// The self-capacitance is counted once: added to the tank capacitance beside the coil's
/// inductance. The apparent inductance is reported separately and not used again.
#[inline(never)]
pub fn evaluate_coil(coil: &Coil, external_capacitance: f64, conditions: &Conditions) -> Analysis {
    let fixed = Fixed::new(coil, conditions);
    let resistivity = copper::resistivity(conditions.temperature_c);
    let total_capacitance = external_capacitance + fixed.self_capacitance;
    let op = solve(&fixed, resistivity, total_capacitance);
    let chi = op.skin.internal_inductance_fraction;
    let d = coil.mean_diameter();
    let l = coil.length();

    let inductance = Inductances {
        wheeler_1928: wheeler::inductance(d, l, coil.turns()),
        current_sheet: fixed.sheet.inductance,
        lundin_1985: fixed.lundin,
        round_wire_low_freq: fixed.round_wire[1],
        round_wire: blend(fixed.round_wire, chi),
        filament_sum: fixed.filament.map(|pair| blend(pair, chi)),
        leads: blend(fixed.leads, chi),
        k_s: fixed.k_s_surface - 0.25 * chi,
        k_m: fixed.k_m,
        internal_inductance_fraction: chi,
    };

    let self_resonance = SelfResonance {
        lumped: helix::lumped_self_resonance(op.inductance, fixed.self_capacitance),
        helical: helix::helical_self_resonance(d, coil.pitch(), l),
    };
    // (f/f_lumped)² = C_self/C: both come from the same inductance, so
    // L/(1 − (f/f_lumped)²) = L·C/(C − C_self).
    let apparent_inductance =
        op.inductance * total_capacitance / (external_capacitance.max(1e-9 * total_capacitance));

    let wire_length = coil.wire_length();
    let coil_wire = wire_length - 2.0 * coil.lead_length();
    let proximity_factor = proximity::wall_proximity_factor(coil.pitch() / coil.wire_bare());
    let r_dc_coil = copper::dc_resistance(resistivity, coil.wire_bare(), coil_wire);
    let r_dc_leads = copper::dc_resistance(resistivity, coil.wire_bare(), 2.0 * coil.lead_length());
    let ac_resistance = op.skin.resistance_ratio * (r_dc_coil * proximity_factor + r_dc_leads);
    let q = op.omega * op.inductance / ac_resistance;

    let skin_depth = 0.5 * coil.wire_bare() * op.depth_over_radius;
    let warnings = super::warnings::collect(&super::warnings::Judged {
        coil,
        inductance: &inductance,
        self_resonance: &self_resonance,
        resonance: op.frequency,
        total_inductance: op.inductance,
        external_capacitance,
        skin_depth,
    });

    Analysis {
        coil: *coil,
        nagaoka_coefficient: fixed.sheet.coefficient,
        inductance,
        model: conditions.model,
        total_inductance: op.inductance,
        apparent_inductance,
        self_capacitance: fixed.self_capacitance,
        medhurst_factor: fixed.medhurst_factor,
        external_capacitance,
        total_capacitance,
        resonance: op.frequency,
        self_resonance,
        resistivity,
        skin_depth,
        skin_resistance_ratio: op.skin.resistance_ratio,
        proximity_factor,
        dc_resistance: r_dc_coil + r_dc_leads,
        ac_resistance,
        q,
        warnings,
    }
}

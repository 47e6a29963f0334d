//! The coil's impedance against frequency from the field solution, for the impedance chart and
//! the headless `impedance` command (both call this, never their own copies).

use crate::model::{Coil, wire_coil};
use crate::physics::field::{Feed, FieldError, FieldModel, FieldSolution};
use num_complex::Complex64;

/// Default start of a sweep, hertz.
pub const DEFAULT_FROM: f64 = 1e6;
/// A default sweep ends this far past the self-resonance.
pub const PAST_RESONANCE: f64 = 1.25;

/// One frequency of a sweep.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct ImpedancePoint {
    /// Hertz.
    pub frequency: f64,
    /// Impedance at the terminals, ohms.
    pub impedance: Complex64,
}

impl ImpedancePoint {
    /// Apparent inductance X/ω, henries.
    pub fn apparent_inductance(&self) -> f64 {
        self.impedance.im / (2.0 * std::f64::consts::PI * self.frequency)
    }

    /// Q = |X|/R (infinite for a lossless point).
    pub fn quality(&self) -> f64 {
        self.impedance.im.abs() / self.impedance.re
    }
}

/// Z(f) of a coil at its terminals, with its first parallel self-resonance.
#[derive(Clone, Debug, PartialEq)]
pub struct ImpedanceSweep {
    /// First parallel self-resonance at the terminals, hertz.
    pub self_resonance: f64,
    /// Highest frequency the solution answers for, hertz.
    pub ceiling: f64,
    /// Segments the wire was cut into.
    pub segments: usize,
    /// The sweep, in rising frequency, spaced evenly on a log scale.
    pub points: Vec<ImpedancePoint>,
    /// The tank's operating frequency, if one was given, with the impedance there.
    pub operating: Option<ImpedancePoint>,
}

/// Most frequencies a sweep of `coil` may solve within the field solution's time bound
/// ([`crate::physics::field::budget::most_sweep_points`]), known before any work.
pub fn most_points(coil: &Coil, temperature_c: f64) -> Result<usize, FieldError> {
    let wire = wire_coil(coil, temperature_c);
    let unknowns = FieldModel::unknowns(&wire, wire.segments_per_turn(), Feed::Terminals)?;
    Ok(crate::physics::field::budget::most_sweep_points(unknowns))
}

impl ImpedanceSweep {
    /// The sweep's points as impedance samples, as a measured file gives them (for the same
    /// reduction, [`crate::tuning::measured_coil::fit_measured_coil`]).
    pub fn samples(&self) -> Vec<crate::instruments::touchstone::ImpedanceSample> {
        self.points
            .iter()
            .map(|p| crate::instruments::touchstone::ImpedanceSample {
                frequency: p.frequency,
                impedance: p.impedance,
            })
            .collect()
    }
}

/// Sweep `coil` at `temperature_c` over `from`…`to` hertz (defaults: 1 MHz to 1.25 × the
/// self-resonance, or the solution's ceiling if lower) in `points` log-spaced frequencies
/// (at most [`most_points`]: a larger count is cut to it, so the sweep's time stays bounded;
/// the result's `points` say how many were solved), and solve at the `operating` frequency if
/// given.
pub fn impedance_sweep(
    coil: &Coil,
    temperature_c: f64,
    from: Option<f64>,
    to: Option<f64>,
    points: usize,
    operating: Option<f64>,
) -> Result<ImpedanceSweep, FieldError> {
    let wire = wire_coil(coil, temperature_c);
    let model = FieldModel::new(&wire, wire.segments_per_turn(), Feed::Terminals)?;
    let self_resonance = model.first_resonance()?;
    let ceiling = model.max_frequency();
    let from = from.unwrap_or(DEFAULT_FROM);
    let to = to.unwrap_or((PAST_RESONANCE * self_resonance).min(ceiling));
    for f in [Some(from), Some(to), operating].into_iter().flatten() {
        if !(f.is_finite() && f > 0.0 && f <= ceiling) {
            return Err(FieldError::Frequency(f));
        }
    }
    let count = points.clamp(2, most_points(coil, temperature_c)?);
    let ratio = (to / from).ln() / (count - 1) as f64;
    let points = (0..count)
        .map(|i| {
            let frequency = from * (ratio * i as f64).exp();
            model.impedance(frequency).map(|impedance| ImpedancePoint {
                frequency,
                impedance,
            })
        })
        .collect::<Result<Vec<_>, _>>()?;
    let operating = match operating {
        Some(frequency) => Some(ImpedancePoint {
            frequency,
            impedance: model.impedance(frequency)?,
        }),
        None => None,
    };
    Ok(ImpedanceSweep {
        self_resonance,
        ceiling,
        segments: model.segments(),
        points,
        operating,
    })
}

/// The field solution of `coil` at `temperature_c`: first parallel self-resonance, and X/ω
/// and R at `operating_frequency`.
pub fn field_solution(
    coil: &Coil,
    temperature_c: f64,
    operating_frequency: f64,
) -> Result<FieldSolution, FieldError> {
    let wire = wire_coil(coil, temperature_c);
    FieldModel::new(&wire, wire.segments_per_turn(), Feed::Terminals)?.solve(operating_frequency)
}

/// The classical estimate of the coil's terminal impedance at `frequency` hertz, for drawing
/// beside the field solution: the analysis's inductance (coil by the driving model plus the
/// leads) in series with its AC resistance, scaled to `frequency` by the round wire's
/// skin-effect ratio (the proximity factor held), with Medhurst's self-capacitance across both.
///
/// # Formula
/// Z = (R + jωL)/(1 − ω²LC_self + jωRC_self), the lumped equivalent whose pole is the lumped
/// self-resonance 1/(2π√(L·C_self)); R(f) = R_ac·k(f)/k(f₀), k the resistance ratio of the
/// Bessel internal impedance (see [`crate::physics::copper::internal_impedance`]) and f₀ the
/// analysis's resonance. L keeps its value at f₀ (its internal-inductance part changes by well
/// under 1 % over the chart).
pub fn classical_impedance(a: &crate::model::Analysis, frequency: f64) -> Complex64 {
    use crate::physics::copper::{internal_impedance, skin_depth};
    let radius = 0.5 * a.coil.wire_bare();
    let ratio = internal_impedance(radius / skin_depth(a.resistivity, frequency)).resistance_ratio;
    let r = a.ac_resistance * ratio / a.skin_resistance_ratio;
    let omega = 2.0 * std::f64::consts::PI * frequency;
    let l = a.total_inductance;
    let c = a.self_capacitance;
    let series = Complex64::new(r, omega * l);
    series / Complex64::new(1.0 - omega * omega * l * c, omega * r * c)
}

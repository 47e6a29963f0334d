//! A coil measured by a network analyser set beside the field solution of the same coil, and
//! used to calibrate the field-led model.
//!
//! The field solution of the coil as measured is swept over the measurement's own band and
//! reduced by the same fit ([`super::measured_coil::fit_measured_coil`]), so the two
//! inductances are the same quantity of the same network taken the same way. Their ratio is
//! the inductance scale on the field solution ([`super::landing::FieldLed::scale`]), the same
//! scale a bench calibration fits from two readings: a measured coil calibrates the model as
//! readings do (one reading then fixes the stray with this inductance kept). The reduction's
//! own error against a full-wave solver's impedance of a coil is within the fit's residual
//! (tests/engine/reference_field.rs, nec2c).

use super::impedance::impedance_sweep;
use super::measured_coil::{MeasuredCoil, fit_measured_coil};
use crate::model::{Coil, Conditions, Winding};

/// Frequencies the field solution is sampled at for the comparison (cut to what the coil's
/// field solution may solve, [`super::impedance::most_points`]).
pub const FIELD_POINTS: usize = 24;

/// A coil measured across frequency, kept with the recipe.
#[derive(Clone, Debug, PartialEq)]
pub struct CoilMeasurement {
    /// Where it came from (the file's name as given), for people.
    pub source: String,
    /// The coil as it was when measured.
    pub winding: Winding,
    /// The band the samples covered, hertz (lowest, highest).
    pub band: (f64, f64),
    /// The measured network.
    pub coil: MeasuredCoil,
}

/// The measurement against the field solution of the coil as measured.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct MeasuredAgainstField {
    /// The measured network.
    pub measured: MeasuredCoil,
    /// The band measured, hertz.
    pub band: (f64, f64),
    /// The field solution reduced the same way over the same band.
    pub field: MeasuredCoil,
    /// Measured inductance over the field solution's: the inductance scale on the field
    /// solution.
    pub scale: f64,
}

/// The field solution of `coil` at `temperature_c` reduced like a measurement over
/// `band` hertz (cut to what the solution answers for), with R and Q stated nearest `at`.
pub fn field_reduction(
    coil: &Coil,
    temperature_c: f64,
    band: (f64, f64),
    at: f64,
) -> Result<MeasuredCoil, String> {
    let (from, to) = band;
    let probe = impedance_sweep(coil, temperature_c, Some(from), None, 2, None)
        .map_err(|e| format!("the field solution of the coil: {e}"))?;
    let to = to.min(probe.ceiling);
    if to <= from {
        return Err("the measurement's band lies above what the field solution answers for".into());
    }
    let sweep = impedance_sweep(
        coil,
        temperature_c,
        Some(from),
        Some(to),
        FIELD_POINTS,
        None,
    )
    .map_err(|e| format!("the field solution of the coil: {e}"))?;
    let samples = sweep.samples();
    let mut fitted =
        fit_measured_coil(&samples, Some(at)).map_err(|e| format!("field solution: {e}"))?;
    // The self-resonance is the solution's own, not the line's extrapolation.
    fitted.self_resonance_seen = Some(sweep.self_resonance);
    Ok(fitted)
}

/// The measured network's impedance at `f` hertz: L in series with R, shunted by C (R as
/// stated at one frequency; the skin effect raises it with frequency).
pub fn network_impedance(m: &MeasuredCoil, f: f64) -> num_complex::Complex64 {
    use num_complex::Complex64;
    let w = 2.0 * std::f64::consts::PI * f;
    let series = Complex64::new(m.series_resistance, w * m.inductance);
    if m.self_capacitance <= 0.0 {
        return series;
    }
    let shunt = Complex64::new(0.0, -1.0 / (w * m.self_capacitance));
    series * shunt / (series + shunt)
}

/// Why a kept measurement does not apply to `winding`: another former, wire or turns (the
/// length may differ: the field solution is taken at the length measured).
pub fn applies_to(m: &CoilMeasurement, winding: &Winding) -> Result<(), String> {
    let (a, b) = (&m.winding, winding);
    if a.diameter != b.diameter
        || a.wire != b.wire
        || a.turns != b.turns
        || a.lead_length != b.lead_length
    {
        return Err(format!(
            "the measured coil ({}) is not this one: its former, wire, turns or leads differ",
            m.source
        ));
    }
    Ok(())
}

/// The measurement `m` against the field solution of the coil as measured, at
/// `conditions`' temperature; the reason when it cannot be compared.
pub fn against_field(
    m: &CoilMeasurement,
    conditions: &Conditions,
) -> Result<MeasuredAgainstField, String> {
    let coil = Coil::from_winding(&m.winding).map_err(|e| e.to_string())?;
    let field = field_reduction(&coil, conditions.temperature_c, m.band, m.coil.at_frequency)?;
    let scale = m.coil.inductance / field.inductance;
    if !(scale.is_finite() && Conditions::INDUCTANCE_SCALE_RANGE.contains(&scale)) {
        return Err(format!(
            "the measured inductance is {} of the field solution's: outside 0.5–2, another \
             coil or a fixture not calibrated out",
            crate::model::short_numbers(&format!("{scale:.3}"))
        ));
    }
    Ok(MeasuredAgainstField {
        measured: m.coil,
        band: m.band,
        field,
        scale,
    })
}

//! `tankwright measured FILE.s1p|FILE.s2p [--recipe R] [--at-mhz F] [--json]`: a coil
//! measured across frequency by a network analyser, reduced to its inductance,
//! self-capacitance, series resistance, Q and self-resonance (`tuning::measured_coil`); with a
//! recipe, the same reduction of the field solution of the recipe's coil over the same band,
//! and the ratios of the two.

use super::args::Args;
use crate::instruments::touchstone;
use crate::model::Coil;
use crate::recipe::store;
use crate::tuning::impedance::impedance_sweep;
use crate::tuning::measured_coil::{MeasuredCoil, fit_measured_coil};
use serde_json::{Value, json};
use std::fmt::Write as _;
use std::path::Path;

/// Largest file read (a sweep of a few thousand points is a few hundred kilobytes).
const MAX_BYTES: u64 = 16 * 1024 * 1024;
/// Frequencies the field solution is sampled at for the comparison.
const FIELD_POINTS: usize = 24;

fn ports_of(file: &str) -> Result<usize, String> {
    let lower = file.to_ascii_lowercase();
    if lower.ends_with(".s1p") {
        Ok(1)
    } else if lower.ends_with(".s2p") {
        Ok(2)
    } else {
        Err(format!(
            "{}: name a Touchstone file .s1p (coil across one port) or .s2p (coil in series \
             between two ports)",
            super::clean(file)
        ))
    }
}

fn read_text(file: &str) -> Result<String, String> {
    let path = Path::new(file);
    let meta = std::fs::metadata(path)
        .map_err(|e| format!("{}: cannot be read: {e}", super::clean(file)))?;
    if !meta.is_file() {
        return Err(format!("{}: not a regular file", super::clean(file)));
    }
    if meta.len() > MAX_BYTES {
        return Err(format!(
            "{}: {} bytes is more than the {} MiB a sweep file may hold",
            super::clean(file),
            meta.len(),
            MAX_BYTES / (1024 * 1024)
        ));
    }
    let bytes =
        std::fs::read(path).map_err(|e| format!("{}: cannot be read: {e}", super::clean(file)))?;
    String::from_utf8(bytes).map_err(|_| format!("{}: not a text file", super::clean(file)))
}

/// The field solution of `coil` reduced the same way, over `from`…`to` hertz (clamped to what
/// the solution answers for), with R and Q stated nearest `at` hertz.
fn field_reduction(
    coil: &Coil,
    temperature_c: f64,
    (from, to): (f64, f64),
    at: f64,
) -> Result<MeasuredCoil, String> {
    let probe = impedance_sweep(coil, temperature_c, Some(from), None, 2, None)
        .map_err(|e| format!("the field solution of the recipe's coil: {e}"))?;
    let to = to.min(probe.ceiling);
    if to <= from {
        return Err("the file's band lies above what the field solution answers for".into());
    }
    let sweep = impedance_sweep(
        coil,
        temperature_c,
        Some(from),
        Some(to),
        FIELD_POINTS,
        None,
    )
    .map_err(|e| format!("the field solution of the recipe's coil: {e}"))?;
    let samples: Vec<touchstone::ImpedanceSample> = sweep
        .points
        .iter()
        .map(|p| touchstone::ImpedanceSample {
            frequency: p.frequency,
            impedance: p.impedance,
        })
        .collect();
    let mut fitted =
        fit_measured_coil(&samples, Some(at)).map_err(|e| format!("field solution: {e}"))?;
    // The self-resonance is the solution's own, not the line's extrapolation.
    fitted.self_resonance_seen = Some(sweep.self_resonance);
    Ok(fitted)
}

fn figures_json(m: &MeasuredCoil) -> Value {
    json!({
        "inductance_nh": m.inductance * 1e9,
        "self_capacitance_pf": m.self_capacitance * 1e12,
        "series_resistance_ohm": m.series_resistance,
        "at_mhz": m.at_frequency * 1e-6,
        "q": m.q,
        "self_resonance_mhz": if m.self_resonance.is_finite() {
            json!(m.self_resonance * 1e-6)
        } else {
            Value::Null
        },
        "self_resonance_seen_mhz": m.self_resonance_seen.map(|f| f * 1e-6),
        "residual_pct": m.residual * 100.0,
        "samples_used": m.used,
    })
}

fn figures_text(out: &mut String, m: &MeasuredCoil) {
    let _ = writeln!(
        out,
        "  inductance (low-frequency)  {:.2} nH",
        m.inductance * 1e9
    );
    let _ = writeln!(
        out,
        "  self-capacitance            {:.3} pF",
        m.self_capacitance * 1e12
    );
    let _ = writeln!(
        out,
        "  series resistance           {:.4} Ω at {:.3} MHz",
        m.series_resistance,
        m.at_frequency * 1e-6
    );
    let _ = writeln!(
        out,
        "  Q                           {:.0} at {:.3} MHz",
        m.q,
        m.at_frequency * 1e-6
    );
    if m.self_resonance.is_finite() {
        let _ = writeln!(
            out,
            "  self-resonance              {:.2} MHz (from the fitted network)",
            m.self_resonance * 1e-6
        );
    } else {
        let _ = writeln!(
            out,
            "  self-resonance              not seen: the band lies far below it"
        );
    }
    if let Some(f) = m.self_resonance_seen {
        let _ = writeln!(out, "  reactance crosses zero at   {:.2} MHz", f * 1e-6);
    }
    let _ = writeln!(
        out,
        "  fit: {} samples, RMS difference of X {:.2} %",
        m.used,
        m.residual * 100.0
    );
}

/// Run `measured` on the words after the subcommand; Ok(stdout) or Err(one-line message).
pub fn run_measured(words: Vec<String>) -> Result<String, String> {
    let args = Args::parse(words, &["json"]).map_err(|e| e.to_string())?;
    let at = args.number("at-mhz").map_err(|e| e.to_string())?;
    if let Some(f) = at
        && !(f > 0.0 && f < 1e5)
    {
        return Err(format!(
            "--at-mhz {f}: give a frequency above 0 and below 100 GHz"
        ));
    }
    let recipe_file = args.text("recipe").map(str::to_owned);
    args.reject_unknown().map_err(|e| e.to_string())?;
    let [file] = args.positional.as_slice() else {
        return Err(
            "usage: tankwright measured FILE.s1p|FILE.s2p [--recipe R] [--at-mhz F] [--json]"
                .into(),
        );
    };
    let ports = ports_of(file)?;
    // Everything is checked before the file's sweep or any field solution is worked.
    let coil = match &recipe_file {
        Some(r) => {
            let recipe = store::load(Path::new(r)).map_err(|e| e.to_string())?;
            let coil = Coil::from_winding(&recipe.winding).map_err(|e| e.to_string())?;
            Some((coil, recipe.conditions.temperature_c))
        }
        None => None,
    };
    let text = read_text(file)?;
    let measurement =
        touchstone::read(&text, ports).map_err(|e| format!("{}: {e}", super::clean(file)))?;
    let measured = fit_measured_coil(&measurement.samples, at.map(|f| f * 1e6))
        .map_err(|e| format!("{}: {e}", super::clean(file)))?;
    let (from, to) = (
        measurement.samples[0].frequency,
        measurement.samples[measurement.samples.len() - 1].frequency,
    );
    let field = match &coil {
        Some((c, t)) => Some(field_reduction(c, *t, (from, to), measured.at_frequency)?),
        None => None,
    };
    let fixture = match measurement.fixture {
        touchstone::Fixture::OnePort => "one port, coil across it",
        touchstone::Fixture::SeriesThrough => "two ports, coil in series between them",
    };
    if args.switch("json") {
        let mut v = json!({
            "file": file,
            "fixture": fixture,
            "reference_ohm": measurement.reference_ohm,
            "band_mhz": [from * 1e-6, to * 1e-6],
            "model": "inductance L with series resistance R, shunted by self-capacitance C; \
                      1/(X/ω) = 1/L − ω²C fitted by least squares",
        });
        if let Value::Object(map) = &mut v
            && let Value::Object(fig) = figures_json(&measured)
        {
            map.extend(fig);
        }
        if let Some(f) = &field {
            v["field_solution"] = figures_json(f);
            v["ratio_to_field"] = json!({
                "inductance": measured.inductance / f.inductance,
                "self_capacitance": if f.self_capacitance > 0.0 {
                    json!(measured.self_capacitance / f.self_capacitance)
                } else {
                    Value::Null
                },
                "self_resonance": match (measured.self_resonance.is_finite(), f.self_resonance_seen) {
                    (true, Some(fs)) => json!(measured.self_resonance / fs),
                    _ => Value::Null,
                },
            });
        }
        return serde_json::to_string_pretty(&v)
            .map(|s| s + "\n")
            .map_err(|e| e.to_string());
    }
    let mut out = String::new();
    let _ = writeln!(
        out,
        "{} ({fixture}, {:.0} Ω), {} samples from {:.3} to {:.3} MHz",
        super::clean(file),
        measurement.reference_ohm,
        measurement.samples.len(),
        from * 1e-6,
        to * 1e-6
    );
    let _ = writeln!(
        out,
        "model: L in series with R, shunted by C; 1/(X/ω) = 1/L − ω²C by least squares"
    );
    let _ = writeln!(out, "measured:");
    figures_text(&mut out, &measured);
    if let Some(f) = &field {
        let _ = writeln!(
            out,
            "field solution of the recipe's coil, reduced the same way:"
        );
        figures_text(&mut out, f);
        let _ = writeln!(
            out,
            "measured / field solution: inductance {:.3}",
            measured.inductance / f.inductance
        );
    }
    Ok(out)
}

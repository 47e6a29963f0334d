//! `tankwright measured FILE.s1p|FILE.s2p [--recipe R] [--at-mhz F] [--json]`: a coil
//! measured across frequency by a network analyser, reduced to its inductance,
//! self-capacitance, series resistance, Q and self-resonance (`tuning::measured_coil`); with a
//! recipe, the same reduction of the field solution of the recipe's coil over the same band,
//! and the ratios of the two; with `--keep`, the measurement kept with the recipe, where it
//! calibrates the inductance (`recipe::figures`).

use super::args::Args;
use crate::instruments::touchstone;
use crate::model::Coil;
use crate::recipe::store;
use crate::tuning::measured_coil::{MeasuredCoil, fit_measured_coil};
use crate::units::{from_mhz, to_mhz, to_nh, to_pf};
use serde_json::{Value, json};
use std::fmt::Write as _;
use std::path::Path;

/// Largest file read (a sweep of a few thousand points is a few hundred kilobytes).
const MAX_BYTES: u64 = 16 * 1024 * 1024;

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

fn figures_json(m: &MeasuredCoil) -> Value {
    json!({
        "inductance_nh": to_nh(m.inductance),
        "self_capacitance_pf": to_pf(m.self_capacitance),
        "series_resistance_ohm": m.series_resistance,
        "at_mhz": to_mhz(m.at_frequency),
        "q": m.q,
        "self_resonance_mhz": if m.self_resonance.is_finite() {
            json!(to_mhz(m.self_resonance))
        } else {
            Value::Null
        },
        "self_resonance_seen_mhz": m.self_resonance_seen.map(to_mhz),
        "residual_pct": m.residual * 100.0,
        "samples_used": m.used,
    })
}

fn figures_text(out: &mut String, m: &MeasuredCoil) {
    let _ = writeln!(
        out,
        "  inductance (low-frequency)  {:.2} nH",
        to_nh(m.inductance)
    );
    let _ = writeln!(
        out,
        "  self-capacitance            {:.3} pF",
        to_pf(m.self_capacitance)
    );
    let _ = writeln!(
        out,
        "  series resistance           {:.4} Ω at {}",
        m.series_resistance,
        crate::tuning::digits::mhz(m.at_frequency)
    );
    let _ = writeln!(
        out,
        "  Q                           {:.0} at {}",
        m.q,
        crate::tuning::digits::mhz(m.at_frequency)
    );
    if m.self_resonance.is_finite() {
        let _ = writeln!(
            out,
            "  self-resonance              {} (from the fitted network)",
            crate::tuning::digits::mhz_at(m.self_resonance, 2)
        );
    } else {
        let _ = writeln!(
            out,
            "  self-resonance              not seen: the band lies far below it"
        );
    }
    if let Some(f) = m.self_resonance_seen {
        let _ = writeln!(
            out,
            "  reactance crosses zero at   {}",
            crate::tuning::digits::mhz_at(f, 2)
        );
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
    let args = Args::parse(words, &["json", "keep"]).map_err(|e| e.to_string())?;
    let keep = args.switch("keep");
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
    if keep && recipe_file.is_none() {
        return Err("--keep needs --recipe R, the recipe to keep the measurement with".into());
    }
    let [file] = args.positional.as_slice() else {
        return Err(
            "usage: tankwright measured FILE.s1p|FILE.s2p [--recipe R [--keep]] [--at-mhz F] [--json]"
                .into(),
        );
    };
    let ports = ports_of(file)?;
    // Everything is checked before the file's sweep or any field solution is worked.
    let coil = match &recipe_file {
        Some(r) => {
            let recipe = store::load(Path::new(r)).map_err(|e| e.to_string())?;
            let coil = Coil::from_winding(&recipe.winding).map_err(|e| e.to_string())?;
            Some((coil, recipe.conditions.temperature_c, recipe))
        }
        None => None,
    };
    let text = read_text(file)?;
    let measurement =
        touchstone::read(&text, ports).map_err(|e| format!("{}: {e}", super::clean(file)))?;
    let measured = fit_measured_coil(&measurement.samples, at.map(from_mhz))
        .map_err(|e| format!("{}: {e}", super::clean(file)))?;
    let (from, to) = (
        measurement.samples[0].frequency,
        measurement.samples[measurement.samples.len() - 1].frequency,
    );
    let field = match &coil {
        Some((c, t, _)) => Some(crate::tuning::measured_field::field_reduction(
            c,
            *t,
            (from, to),
            measured.at_frequency,
        )?),
        None => None,
    };
    // Kept with the recipe: the coil as it is in the recipe now is the coil measured.
    let kept = match (keep, coil, &recipe_file, &field) {
        (true, Some((_, _, mut recipe)), Some(r), Some(f)) => {
            let scale = measured.inductance / f.inductance;
            if !crate::model::Conditions::INDUCTANCE_SCALE_RANGE.contains(&scale) {
                return Err(format!(
                    "nothing kept: the measured inductance is {scale:.3} of the field solution's \
                     for the recipe's coil (outside 0.5–2): another coil, or a fixture not \
                     calibrated out"
                ));
            }
            let source = Path::new(file)
                .file_name()
                .map_or_else(|| file.clone(), |n| n.to_string_lossy().into_owned());
            recipe.coil_measurement = Some(crate::tuning::measured_field::CoilMeasurement {
                source,
                winding: recipe.winding,
                band: (from, to),
                coil: measured,
            });
            store::save(Path::new(r), &recipe).map_err(|e| e.to_string())?;
            Some((r.clone(), scale))
        }
        _ => None,
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
            "band_mhz": [to_mhz(from), to_mhz(to)],
            "model": "inductance L with series resistance R, shunted by self-capacitance C; \
                      1/(X/ω) = 1/L − ω²C fitted by least squares",
        });
        if let Value::Object(map) = &mut v
            && let Value::Object(fig) = figures_json(&measured)
        {
            map.extend(fig);
        }
        if let Some((r, scale)) = &kept {
            v["kept_with"] = json!(r);
            v["inductance_scale_on_field"] = json!(scale);
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
        "{} ({fixture}, {:.0} Ω), {} samples over {}",
        super::clean(file),
        measurement.reference_ohm,
        measurement.samples.len(),
        crate::tuning::digits::mhz_range(from, to)
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
    if let Some((r, scale)) = &kept {
        let _ = writeln!(
            out,
            "kept with {}: the recipe's inductance is now calibrated at {scale:.3} of the field \
             solution's while its bench readings cannot tell the inductance apart",
            super::clean(r)
        );
    }
    Ok(out)
}

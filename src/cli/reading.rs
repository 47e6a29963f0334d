//! `tankwright reading add RECIPE (--mhz F | --spectrum SWEEP.csv) [--length-mm L]
//! [--trimmer-pct P] [--clip-pf C] [--instrument TEXT] [--error-ppm E] [--note TEXT]`: a bench
//! reading (typed, or the carrier of a receiver's power sweep, with the sweep's bin step as its
//! error; `instruments::sweep_csv`) appended to a recipe
//! from the command line, saved atomically like the window's save (the recipe's rules judge
//! the result first, so a reading the window would refuse is refused here with the same
//! words). Then `report`, `solve` and `fit` calibrate on it.

use super::args::Args;
use crate::model::Coil;
use crate::recipe::{BenchEntry, store};
use crate::units::{from_mhz, from_mm, from_pf, to_mhz, to_ppm};
use std::path::Path;

const USAGE: &str = "tankwright reading add RECIPE.ron (--mhz F | --spectrum SWEEP.csv) [--length-mm L] [--trimmer-pct P] \
                     [--clip-pf C] [--instrument TEXT] [--error-ppm E] [--note TEXT]";

fn within(name: &str, v: f64, lo: f64, hi: f64, unit: &str) -> Result<f64, String> {
    if v.is_finite() && v >= lo && v <= hi {
        Ok(v)
    } else {
        Err(format!("--{name} {v}: give {lo}–{hi}{unit}"))
    }
}

/// The text of a receiver's sweep file (at most 64 MiB).
fn read_sweep(file: &str) -> Result<String, String> {
    let path = Path::new(file);
    let meta = std::fs::metadata(path)
        .map_err(|e| format!("{}: cannot be read: {e}", super::clean(file)))?;
    if !meta.is_file() || meta.len() > 64 * 1024 * 1024 {
        return Err(format!(
            "{}: not a regular file of at most 64 MiB",
            super::clean(file)
        ));
    }
    std::fs::read_to_string(path)
        .map_err(|e| format!("{}: cannot be read as text: {e}", super::clean(file)))
}

/// Run `reading` on the words after the subcommand; Ok(what was done) or Err(message).
pub fn run_reading(words: Vec<String>) -> Result<String, String> {
    let args = Args::parse(words, &[]).map_err(|e| e.to_string())?;
    let (verb, file) = match args.positional.as_slice() {
        [verb, file] => (verb.as_str(), file.as_str()),
        _ => return Err(format!("usage: {USAGE}")),
    };
    if verb != "add" {
        return Err(format!(
            "unknown reading command '{}': {USAGE}",
            super::clean(verb)
        ));
    }
    let number = |name: &str| args.number(name).map_err(|e| e.to_string());
    let spectrum = args.text("spectrum").map(str::to_owned);
    let (mhz, spectrum_error_ppm, spectrum_note) = match (number("mhz")?, &spectrum) {
        (Some(_), Some(_)) => {
            return Err("give --mhz or --spectrum FILE.csv, not both".into());
        }
        (None, None) => {
            return Err(format!(
                "reading add needs --mhz F (or --spectrum FILE.csv): {USAGE}"
            ));
        }
        (Some(mhz), None) => (mhz, None, None),
        (None, Some(csv)) => {
            let text = read_sweep(csv)?;
            let c = crate::instruments::sweep_csv::carrier(&text)
                .map_err(|e| format!("{}: {e}", super::clean(csv)))?;
            (
                to_mhz(c.frequency),
                Some(to_ppm(c.error / c.frequency)),
                Some(format!(
                    "carrier from a receiver sweep ({:.1} dB above its median, {} bins)",
                    c.above_median_db, c.bins
                )),
            )
        }
    };
    let mhz = within("mhz", mhz, 0.1, 3000.0, " MHz")?;
    let length = number("length-mm")?
        .map(|v| within("length-mm", v, 0.01, 1000.0, " mm"))
        .transpose()?;
    let trimmer = number("trimmer-pct")?
        .map(|v| within("trimmer-pct", v, 0.0, 100.0, " %"))
        .transpose()?;
    let clip = number("clip-pf")?
        .map(|v| within("clip-pf", v, 0.0, 10_000.0, " pF"))
        .transpose()?;
    let clip_tolerance = number("clip-tolerance-pct")?
        .map(|v| within("clip-tolerance-pct", v, 0.0, 50.0, " %"))
        .transpose()?;
    if clip_tolerance.is_some() && clip.is_none() {
        return Err("--clip-tolerance-pct needs --clip-pf, the capacitor it belongs to".into());
    }
    let error_ppm = number("error-ppm")?
        .map(|v| within("error-ppm", v, 0.0, 100_000.0, " ppm"))
        .transpose()?
        .or(spectrum_error_ppm);
    let instrument = args
        .text("instrument")
        .map(str::to_owned)
        .or_else(|| {
            spectrum
                .as_ref()
                .map(|f| format!("receiver sweep {}", super::clean(f)))
        })
        .unwrap_or_default();
    let note = args
        .text("note")
        .map(str::to_owned)
        .or(spectrum_note)
        .unwrap_or_default();
    args.reject_unknown().map_err(|e| e.to_string())?;

    let path = Path::new(file);
    let mut recipe = store::load(path).map_err(|e| e.to_string())?;
    let coil = Coil::from_winding(&recipe.winding).map_err(|e| e.to_string())?;
    let entry = BenchEntry {
        measured: from_mhz(mhz),
        length: length.map_or(coil.length(), from_mm),
        trimmer_setting: trimmer.map_or(recipe.tank.trimmer_setting, |p| p / 100.0),
        added_capacitance: from_pf(clip.unwrap_or(0.0)),
        instrument,
        error_ppm,
        note,
        added_tolerance: clip_tolerance.map(|p| p / 100.0),
    };
    crate::tuning::reading_reach::check(&coil, &recipe.tank, &recipe.conditions, &entry.reading())
        .map_err(|reason| format!("--mhz: {reason}; {} is kept as it was", super::clean(file)))?;
    recipe.bench_log.push(entry);
    store::save(path, &recipe).map_err(|e| e.to_string())?;
    Ok(format!(
        "added reading {} ({mhz} MHz) to {}; `tankwright report {}` shows the calibration\n",
        recipe.bench_log.len(),
        super::clean(file),
        super::clean(file)
    ))
}

//! `tankwright reading add RECIPE --mhz F [--length-mm L] [--trimmer-pct P] [--clip-pf C]
//! [--instrument TEXT] [--error-ppm E] [--note TEXT]`: a bench reading appended to a recipe
//! from the command line, saved atomically like the window's save (the recipe's rules judge
//! the result first, so a reading the window would refuse is refused here with the same
//! words). Then `report`, `solve` and `fit` calibrate on it.

use super::args::Args;
use crate::model::Coil;
use crate::recipe::{BenchEntry, store};
use std::path::Path;

const USAGE: &str = "tankwright reading add RECIPE.ron --mhz F [--length-mm L] [--trimmer-pct P] \
                     [--clip-pf C] [--instrument TEXT] [--error-ppm E] [--note TEXT]";

fn within(name: &str, v: f64, lo: f64, hi: f64, unit: &str) -> Result<f64, String> {
    if v.is_finite() && v >= lo && v <= hi {
        Ok(v)
    } else {
        Err(format!("--{name} {v}: give {lo}–{hi}{unit}"))
    }
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
    let mhz = number("mhz")?.ok_or_else(|| format!("reading add needs --mhz F: {USAGE}"))?;
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
    let error_ppm = number("error-ppm")?
        .map(|v| within("error-ppm", v, 0.0, 100_000.0, " ppm"))
        .transpose()?;
    let instrument = args.text("instrument").unwrap_or("").to_owned();
    let note = args.text("note").unwrap_or("").to_owned();
    args.reject_unknown().map_err(|e| e.to_string())?;

    let path = Path::new(file);
    let mut recipe = store::load(path).map_err(|e| e.to_string())?;
    let coil = Coil::from_winding(&recipe.winding).map_err(|e| e.to_string())?;
    let entry = BenchEntry {
        measured: mhz * 1e6,
        length: length.map_or(coil.length(), |l| l * 1e-3),
        trimmer_setting: trimmer.map_or(recipe.tank.trimmer_setting, |p| p / 100.0),
        added_capacitance: clip.unwrap_or(0.0) * 1e-12,
        instrument,
        error_ppm,
        note,
    };
    recipe.bench_log.push(entry);
    store::save(path, &recipe).map_err(|e| e.to_string())?;
    Ok(format!(
        "added reading {} ({mhz} MHz) to {}; `tankwright report {}` shows the calibration\n",
        recipe.bench_log.len(),
        super::clean(file),
        super::clean(file)
    ))
}

//! `tankwright sheet RECIPE.ron --out FILE.pdf` (the build sheet and worksheet) and
//! `tankwright chart RECIPE.ron --kind spacing|trimmer --out FILE.svg|.png`.

use super::args::Args;
use crate::handout::{ChartKind, write_chart, write_sheet};
use crate::recipe::Footing;
use crate::recipe::store;
use std::path::Path;

/// The recipe file and the `--out` path of a hand-out command.
fn file_and_out<'a>(
    args: &'a Args,
    command: &str,
    usage: &str,
) -> Result<(&'a str, &'a str), String> {
    let out = args.text("out");
    let file = match args.positional.as_slice() {
        [one] => one.as_str(),
        [] => return Err(format!("{command} needs a recipe file: {usage}")),
        _ => return Err(format!("{command} takes one recipe file: {usage}")),
    };
    let out = out.ok_or_else(|| format!("{command} needs --out FILE: {usage}"))?;
    if out.trim().is_empty() {
        return Err(format!("--out names no file: {usage}"));
    }
    Ok((file, out))
}

/// Run `sheet` on the words after the subcommand; Ok(what was written) or Err(message).
pub fn run_sheet(words: Vec<String>) -> Result<String, String> {
    const USAGE: &str = "tankwright sheet RECIPE.ron --out FILE.pdf";
    let args = Args::parse(words, &[]).map_err(|e| e.to_string())?;
    let (file, out) = file_and_out(&args, "sheet", USAGE)?;
    args.reject_unknown().map_err(|e| e.to_string())?;
    let recipe = store::load(Path::new(file)).map_err(|e| e.to_string())?;
    write_sheet(&recipe, Path::new(out), Footing::FieldSolution)?;
    Ok(format!("wrote the build sheet and worksheet to {out}\n"))
}

/// Run `spice` on the words after the subcommand: the tank as a SPICE netlist
/// (`handout::spice_netlist`); Ok(what was written) or Err(message).
pub fn run_spice(words: Vec<String>) -> Result<String, String> {
    const USAGE: &str = "tankwright spice RECIPE.ron --out FILE.cir";
    let args = Args::parse(words, &[]).map_err(|e| e.to_string())?;
    let (file, out) = file_and_out(&args, "spice", USAGE)?;
    args.reject_unknown().map_err(|e| e.to_string())?;
    let lower = out.to_ascii_lowercase();
    if ![".cir", ".sp", ".spice", ".net"]
        .iter()
        .any(|e| lower.ends_with(e))
    {
        return Err(format!(
            "--out {}: name a netlist file .cir, .sp, .spice or .net",
            super::clean(out)
        ));
    }
    let recipe = store::load(Path::new(file)).map_err(|e| e.to_string())?;
    let f = crate::recipe::figures(&recipe).map_err(|e| format!("invalid recipe: {e}"))?;
    let (text, _) = crate::handout::spice_netlist(&recipe, &f)?;
    store::write_atomically(
        Path::new(out),
        text.as_bytes(),
        |w: &mut dyn std::io::Write, b| w.write_all(b),
    )
    .map_err(|e| e.to_string())?;
    Ok(format!(
        "wrote the tank's netlist to {out} (resonance {}; run: ngspice -b {out})\n",
        crate::tuning::digits::mhz_at(f.analysis.resonance, 6)
    ))
}

/// Run `chart` on the words after the subcommand; Ok(what was written) or Err(message).
pub fn run_chart(words: Vec<String>) -> Result<String, String> {
    const USAGE: &str =
        "tankwright chart RECIPE.ron --kind spacing|trimmer --out FILE.svg|FILE.png";
    let args = Args::parse(words, &[]).map_err(|e| e.to_string())?;
    let (file, out) = file_and_out(&args, "chart", USAGE)?;
    let kind = match args.text("kind") {
        None => ChartKind::Spacing,
        Some(name) => ChartKind::from_cli_name(name).ok_or_else(|| {
            format!(
                "unknown chart '{}': --kind is one of {}",
                super::clean(name),
                ChartKind::ALL.map(ChartKind::cli_name).join(", ")
            )
        })?,
    };
    args.reject_unknown().map_err(|e| e.to_string())?;
    let recipe = store::load(Path::new(file)).map_err(|e| e.to_string())?;
    write_chart(&recipe, kind, Path::new(out), Footing::FieldSolution)?;
    Ok(format!("wrote the {} chart to {out}\n", kind.cli_name()))
}

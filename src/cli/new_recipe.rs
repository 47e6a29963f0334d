//! `tankwright new RECIPE.ron FLAGS`: a recipe written from the coil and tank flags `evaluate`
//! reads (the same reader, [`EvaluateRequest::from_args`]), with a name, notes, the target
//! and how the circuit is built, so a script can start a recipe the window and `reading add`
//! then carry on. The file is judged by the recipe rules before the atomic save (as the
//! window's save), and an existing file is never replaced unless `--replace` is given.

use super::args::Args;
use super::evaluate::EvaluateRequest;
use crate::recipe::{Recipe, StraySettings, Target};
use std::path::Path;

/// Usage line for `new`.
pub const USAGE: &str = "tankwright new RECIPE.ron COIL-FLAGS [--name TEXT] [--notes TEXT] \
                         --target-mhz F [--tolerance-khz K] [--construction NAME] [--replace]";

/// Run `new` on the words after the subcommand; Ok(what was written) or Err(one line).
pub fn run_new(mut words: Vec<String>) -> Result<String, String> {
    // The file comes first; the flags after it are the coil reader's.
    if words.first().is_none_or(|w| w.starts_with("--")) {
        return Err(format!("usage: {USAGE}"));
    }
    let file = words.remove(0);
    let args = Args::parse(words, &["replace", "json"]).map_err(|e| e.to_string())?;
    if !file.ends_with(".ron") {
        return Err(format!(
            "'{}': a recipe file ends in .ron",
            super::clean(&file)
        ));
    }
    let construction = super::stray_flags::construction_flag(&args)
        .map_err(|e| e.to_string())?
        .unwrap_or(StraySettings::default().construction);
    let name = args.text("name").unwrap_or("New coil").to_owned();
    let notes = args.text("notes").unwrap_or_default().to_owned();
    let replace = args.switch("replace");
    let req = EvaluateRequest::from_args(&args).map_err(|e| e.to_string())?;
    let tolerance_typed = args.number("tolerance-khz").ok().flatten().is_some();
    let Some(channel) = req.aim.target else {
        return Err(format!(
            "new needs --target-mhz F, the channel the tank aims at: {USAGE}"
        ));
    };
    args.reject_unknown().map_err(|e| e.to_string())?;
    // The coil and tank must be ones the model takes (the window would open the file and
    // refuse it otherwise).
    crate::model::evaluate(&req.winding, &req.tank, &req.conditions)
        .map_err(|e| format!("invalid input: {e}"))?;
    let from_flags = req.recipe();
    let recipe = Recipe {
        name,
        notes,
        target: Target {
            channel,
            tolerance: tolerance_typed.then_some(req.aim.tolerance),
            ..from_flags.target
        },
        stray_estimate: StraySettings {
            construction,
            ..StraySettings::default()
        },
        ..from_flags
    };
    crate::recipe::rules::judge(&recipe).map_err(|r| format!("{}: {}", r.field, r.reason))?;
    let path = Path::new(&file);
    if !replace && (path.exists() || path.is_symlink()) {
        return Err(format!(
            "{} exists: nothing written (give --replace to write over it)",
            super::clean(&file)
        ));
    }
    crate::recipe::save(path, &recipe).map_err(|e| e.to_string())?;
    Ok(format!(
        "wrote {}; `tankwright report {}` shows its figures, `tankwright {}` opens it\n",
        super::clean(&file),
        super::clean(&file),
        super::clean(&file)
    ))
}

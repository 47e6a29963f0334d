//! `evaluate --recipe FILE` (and `impedance --recipe FILE`): the coil, tank, conditions,
//! readings and aim (channel and on-channel tolerance) of a saved recipe instead of flags,
//! calibrated on its bench readings as `recipe::figures` does for `report`, `solve` and the
//! window (`--as-written`: the recipe alone, its readings and kept measurement left aside).

use super::args::Args;
use super::evaluate::EvaluateRequest;
use crate::recipe::{Recipe, store};
use crate::tuning::verdict::Aim;
use std::path::Path;

/// The recipe a file holds and the aim it carries; only `--json` and `--as-written` may stand
/// beside `--recipe`. With `--as-written` the readings and a kept coil measurement are left
/// out, so nothing calibrates it.
pub(crate) fn recipe_from_file(args: &Args, file: &str) -> Result<(Recipe, Aim), String> {
    args.reject_unknown()
        .map_err(|e| format!("with --recipe only --json and --as-written may be given: {e}"))?;
    if let Some(word) = args.positional.first() {
        return Err(format!(
            "unexpected word '{}' after --recipe",
            super::clean(word)
        ));
    }
    let mut recipe = store::load(Path::new(file)).map_err(|e| e.to_string())?;
    if args.switch("as-written") {
        recipe.bench_log.clear();
        recipe.coil_measurement = None;
    }
    let aim = Aim::new(recipe.target.plan.clone(), Some(recipe.target.channel))
        .with_tolerance(recipe.target.tolerance());
    Ok((recipe, aim))
}

/// The request a recipe file describes, calibrated as `recipe::figures` calibrates it.
pub(crate) fn request_from_recipe(args: &Args, file: &str) -> Result<EvaluateRequest, String> {
    let (recipe, aim) = recipe_from_file(args, file)?;
    let calibrated = !recipe.bench_log.is_empty() || recipe.coil_measurement.is_some();
    let bench = if calibrated {
        let m = crate::recipe::modelled(&recipe).map_err(|e| format!("invalid recipe: {e}"))?;
        m.calibrated().then(|| super::evaluate::BenchCalibration {
            tank: m.tank,
            conditions: m.conditions,
            led: m.led,
            readings: m.readings_used(),
        })
    } else {
        None
    };
    Ok(EvaluateRequest {
        aim,
        winding: recipe.winding,
        tank: recipe.tank,
        conditions: recipe.conditions,
        json: args.switch("json"),
        bench,
    })
}

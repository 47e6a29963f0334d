//! `evaluate --recipe FILE`: the coil, tank, conditions and aim (channel and on-channel
//! tolerance) of a saved recipe instead of flags, calibrated on its bench readings as
//! `recipe::figures` does for `report`, `solve` and the window (`--as-written`: the recipe
//! alone).

use super::args::Args;
use super::evaluate::EvaluateRequest;
use crate::recipe::store;
use std::path::Path;

/// The request a recipe file describes; only `--json` may stand beside `--recipe`.
pub(crate) fn request_from_recipe(args: &Args, file: &str) -> Result<EvaluateRequest, String> {
    args.reject_unknown()
        .map_err(|e| format!("with --recipe only --json and --as-written may be given: {e}"))?;
    if let Some(word) = args.positional.first() {
        return Err(format!(
            "unexpected word '{}' after --recipe",
            super::clean(word)
        ));
    }
    let recipe = store::load(Path::new(file)).map_err(|e| e.to_string())?;
    // The bench readings (and a kept coil measurement) calibrate the figures as `report`,
    // `solve` and the window do, unless the recipe is asked for as written.
    let uncalibrated = recipe.bench_log.is_empty() && recipe.coil_measurement.is_none();
    let bench = if args.switch("as-written") || uncalibrated {
        None
    } else {
        let f = crate::recipe::figures(&recipe).map_err(|e| format!("invalid recipe: {e}"))?;
        f.calibrated().then(|| super::evaluate::BenchCalibration {
            tank: f.tank,
            conditions: f.conditions,
            led: f.led,
            readings: f.readings_used(),
        })
    };
    Ok(EvaluateRequest {
        aim: crate::tuning::verdict::Aim::new(
            recipe.target.plan.clone(),
            Some(recipe.target.channel),
        )
        .with_tolerance(recipe.target.tolerance()),
        winding: recipe.winding,
        tank: recipe.tank,
        conditions: recipe.conditions,
        json: args.switch("json"),
        bench,
    })
}

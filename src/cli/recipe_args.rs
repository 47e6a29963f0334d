//! `evaluate --recipe FILE`: the coil, tank, conditions and aim (channel and on-channel
//! tolerance) of a saved recipe instead of flags: the recipe as written, its bench readings
//! left to `report`, `solve` and `fit`, which calibrate on them.

use super::args::Args;
use super::evaluate::EvaluateRequest;
use crate::recipe::store;
use std::path::Path;

/// The request a recipe file describes; only `--json` may stand beside `--recipe`.
pub(crate) fn request_from_recipe(args: &Args, file: &str) -> Result<EvaluateRequest, String> {
    args.reject_unknown()
        .map_err(|e| format!("with --recipe only --json may be given: {e}"))?;
    if let Some(word) = args.positional.first() {
        return Err(format!(
            "unexpected word '{}' after --recipe",
            super::clean(word)
        ));
    }
    let recipe = store::load(Path::new(file)).map_err(|e| e.to_string())?;
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
    })
}

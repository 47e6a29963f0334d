//! `tankwright solve` and `tankwright fit`: the bench loop for scripts, from a saved recipe.
//!
//! Both compute through [`crate::recipe::figures()`], the same function the window and `report`
//! use, so the three cannot disagree.

use super::args::Args;
use crate::recipe::{Figures, Recipe, figures, store};
use crate::tuning::fit::inverse_square_line;
use crate::units::{from_mhz, to_khz, to_khz_per_mm, to_mhz, to_mm, to_nh, to_pf};
use serde_json::json;
use std::path::Path;

/// The recipe named by `--recipe`, with `--target-mhz` and `--trimmer-pct` applied if given.
fn recipe_from(args: &Args, command: &str) -> Result<Recipe, String> {
    let file = args
        .text("recipe")
        .ok_or_else(|| format!("{command} needs --recipe FILE.ron"))?
        .to_owned();
    let target = args.number("target-mhz").map_err(|e| e.to_string())?;
    let trimmer = args.number("trimmer-pct").map_err(|e| e.to_string())?;
    args.reject_unknown().map_err(|e| e.to_string())?;
    if let Some(word) = args.positional.first() {
        return Err(format!("unexpected word '{word}' (see 'tankwright help')"));
    }
    let mut recipe = store::load(Path::new(&file)).map_err(|e| e.to_string())?;
    if let Some(mhz) = target {
        if !(1.0..=3000.0).contains(&mhz) {
            return Err(format!("--target-mhz {mhz} is outside 1–3000 MHz"));
        }
        recipe.target.channel = from_mhz(mhz);
    }
    if let Some(pct) = trimmer {
        if !(0.0..=100.0).contains(&pct) {
            return Err(format!("--trimmer-pct {pct} is outside 0–100 %"));
        }
        recipe.tank.trimmer_setting = pct / 100.0;
    }
    Ok(recipe)
}

fn figures_of(recipe: &Recipe) -> Result<Figures, String> {
    figures(recipe).map_err(|e| format!("invalid recipe: {e}"))
}

/// Run `solve`: the coil that lands the target, in the builder's terms.
pub fn run_solve(words: Vec<String>) -> Result<String, String> {
    let args = Args::parse(words, &["json"]).map_err(|e| e.to_string())?;
    let recipe = recipe_from(&args, "solve")?;
    let f = figures_of(&recipe)?;
    let advice = &f.target.advice;
    let Some(p) = advice.proposal(&f.coil, f.tank.trimmer_setting) else {
        return Err(format!("no coil within reach lands the target: {advice}"));
    };
    let predicted = advice
        .predicted(&f.coil, &f.tank, &f.conditions, f.led.as_ref())
        .ok_or_else(|| "the proposed coil is refused by the model".to_owned())?;
    if args.switch("json") {
        let mut s = json!({
            "target_mhz": to_mhz(f.target.channel),
            "length_mm": to_mm(p.length),
            "turns": p.turns,
            "trimmer_pct": p.trimmer_setting * 100.0,
            "resonance_mhz": to_mhz(predicted),
            "calibrated": f.calibrated(),
            "resonance_source": f.field.json_name(),
            "readings_used": f.readings_used(),
            "advice": advice.to_string(),
        })
        .to_string();
        s.push('\n');
        return Ok(s);
    }
    let model = if f.calibrated() {
        format!("the model calibrated on {} reading(s)", f.readings_used())
    } else if f.field.tank().is_some() {
        "the field solution (no bench readings yet)".to_owned()
    } else {
        "the classical model (no bench readings yet)".to_owned()
    };
    Ok(format!(
        "To land {} MHz, by {model}:\n  {advice}\n  coil: {} turns, {:.3} mm long; trimmer at {:.0} %\n  predicted: {}\n",
        crate::tuning::digits::channel_mhz(f.target.channel),
        p.turns,
        to_mm(p.length),
        p.trimmer_setting * 100.0,
        crate::tuning::digits::mhz(predicted)
    ))
}

/// Run `fit`: the calibration the recipe's bench readings imply.
pub fn run_fit(words: Vec<String>) -> Result<String, String> {
    let args = Args::parse(words, &["json"]).map_err(|e| e.to_string())?;
    let recipe = recipe_from(&args, "fit")?;
    let f = figures_of(&recipe)?;
    let fit = match &f.fit {
        None => return Err("the recipe has no bench readings to fit".to_owned()),
        Some(Err(e)) => return Err(format!("no fit: {e}")),
        Some(Ok(fit)) => fit,
    };
    let stray = recipe.tank.stray + fit.calibration.extra_capacitance;
    let line = inverse_square_line(&recipe.tank, &recipe.readings());
    if args.switch("json") {
        let mut s = json!({
            "stray_pf": to_pf(stray),
            "stray_pf_error": to_pf(fit.extra_capacitance_error),
            "extra_pf": to_pf(fit.calibration.extra_capacitance),
            "inductance_scale": fit.calibration.inductance_scale,
            "inductance_scale_error": fit.inductance_scale_error,
            "residuals_khz": fit.residuals.iter().copied().map(to_khz).collect::<Vec<_>>(),
            "instrument_errors_khz": fit.sigmas.iter().copied().map(to_khz).collect::<Vec<_>>(),
            "readings_used": fit.readings_used,
            "stretch_khz_per_mm": to_khz_per_mm(f.target.stretch_sensitivity),
            "inverse_square_line": line.map(|l| json!({
                "inductance_nh": to_nh(l.inductance),
                "hidden_pf": to_pf(l.hidden_capacitance),
                "points": l.points,
            })),
            "warnings": fit.warnings.iter().map(ToString::to_string).collect::<Vec<_>>(),
        })
        .to_string();
        s.push('\n');
        return Ok(s);
    }
    let mut out = vec![format!("Calibrated on {} reading(s):", fit.readings_used)];
    out.push(format!(
        "  stray              {:>8.2} ± {:.2} pF   ({:+.2} pF beyond the recipe's {:.2} pF)",
        to_pf(stray),
        to_pf(fit.extra_capacitance_error),
        to_pf(fit.calibration.extra_capacitance),
        to_pf(recipe.tank.stray)
    ));
    out.push(match fit.inductance_scale_error {
        Some(e) => format!(
            "  inductance scale   {:>8.4} ± {e:.4}",
            fit.calibration.inductance_scale
        ),
        None => "  inductance scale   not separable from these readings (held at 1)".to_owned(),
    });
    for (i, (r, s)) in fit.residuals.iter().zip(&fit.sigmas).enumerate() {
        out.push(format!(
            "  reading {:<2}         {:>+8.2} kHz off the fit (instrument ±{:.2} kHz)",
            i + 1,
            to_khz(*r),
            to_khz(*s)
        ));
    }
    out.push(format!(
        "  stretch moves it   {:>8.1} kHz per mm (calibrated)",
        to_khz_per_mm(f.target.stretch_sensitivity)
    ));
    if let Some(l) = line {
        out.push(format!(
            "  1/f² line          {:>8.1} nH, {:.2} pF hidden ({} readings at one length)",
            to_nh(l.inductance),
            to_pf(l.hidden_capacitance),
            l.points
        ));
    }
    for w in &fit.warnings {
        out.push(format!("  - {w}"));
    }
    let mut text = out.join("\n");
    text.push('\n');
    Ok(text)
}

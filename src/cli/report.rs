//! `tankwright report FILE`: a recipe as a build sheet, then every figure.

use super::args::Args;
use crate::model::{Analysis, Coating, Coil, DiameterSpec, Gauge, SpacingSpec};
use crate::recipe::{Figures, Recipe, figures, store};
use crate::tuning::BandPlan;
use crate::tuning::bands::us_fm_channel_number;
use crate::tuning::buildable::former_drills;
use crate::tuning::digits;
use crate::units::{to_khz, to_khz_per_mm, to_mhz, to_mm, to_pf};
use std::path::Path;

/// Run `report` on the words after the subcommand; Ok(stdout) or Err(one-line message).
pub fn run_report(words: Vec<String>) -> Result<String, String> {
    let args = Args::parse(words, &[]).map_err(|e| e.to_string())?;
    args.reject_unknown().map_err(|e| e.to_string())?;
    let file = match args.positional.as_slice() {
        [one] => one,
        [] => return Err("report needs a recipe file: tankwright report FILE.ron".to_owned()),
        _ => return Err("report takes one recipe file".to_owned()),
    };
    let recipe = store::load(Path::new(file)).map_err(|e| e.to_string())?;
    build_report(&recipe)
}

/// The readable build report of a recipe: name, notes, how to wind it, the tank, the target
/// and how to reach it, the bench log, then the full analysis.
pub fn build_report(r: &Recipe) -> Result<String, String> {
    let f = figures(r).map_err(|e| format!("invalid recipe: {e}"))?;
    let a = f.analysis.clone();
    let mut out = Vec::new();
    out.push(format!("Recipe: {}", r.name));
    out.push(String::new());
    // The verdict first: what the builder acts on.
    out.extend(super::verdict::verdict_lines(&f.verdict));
    out.push(String::new());
    if !r.notes.trim().is_empty() {
        out.push(format!("Notes: {}", r.notes.trim()));
        out.push(String::new());
    }
    winding_lines(r, &f.coil, &a, &mut out);
    tank_lines(r, &mut out);
    target_lines(r, &f, &mut out);
    bench_lines(r, &f, &mut out);
    out.push(String::new());
    out.push(format!("Caution: {}", crate::cautions::ONE_LINE));
    out.push(String::new());
    let mut text = out.join("\n");
    text.push('\n');
    text.push_str(&super::analysis_report(&a));
    // The field-solved tank of the recipe as written, and how it moved the model.
    text.push_str(&super::text::field_report(
        &f.classical,
        &f.field,
        f.calibrated(),
    ));
    Ok(text)
}

fn winding_lines(r: &Recipe, coil: &Coil, a: &Analysis, out: &mut Vec<String>) {
    let w = &r.winding;
    let g = &a.coil;
    out.push("To wind".to_owned());
    out.push(match w.diameter {
        DiameterSpec::Former(d) => format!(
            "  former             {:>10.3} mm   (mean diameter {:.3} mm)",
            to_mm(d),
            to_mm(g.mean_diameter())
        ),
        DiameterSpec::Mean(d) => format!(
            "  mean diameter      {:>10.3} mm   (former {:.3} mm)",
            to_mm(d),
            to_mm(g.former_diameter())
        ),
    });
    let drills = former_drills(coil);
    let drill = [drills.metric, drills.inch]
        .into_iter()
        .flatten()
        .map(|d| format!("{} ({})", d.label, digits::mm(d.difference, 2)))
        .collect::<Vec<_>>();
    if !drill.is_empty() {
        out.push(format!(
            "  nearest drill/rod  {}   (size minus former)",
            drill.join(" or ")
        ));
    }
    let size = match w.wire.gauge {
        Gauge::Awg(n) => format!("AWG {n} ({:.3} mm)", to_mm(g.wire_bare())),
        Gauge::Swg(n) => format!("SWG {n} ({:.3} mm)", to_mm(g.wire_bare())),
        Gauge::Metric(d) => format!("{:.3} mm", to_mm(d)),
    };
    let coating = match w.wire.coating {
        Coating::Bare => "bare copper".to_owned(),
        Coating::EnamelGrade1 => {
            format!("enamel grade 1, {:.3} mm overall", to_mm(g.wire_overall()))
        }
        Coating::EnamelGrade2 => {
            format!("enamel grade 2, {:.3} mm overall", to_mm(g.wire_overall()))
        }
    };
    out.push(format!("  wire               {size}, {coating}"));
    out.push(format!("  turns              {:>10.2}", g.turns()));
    out.push(match w.spacing {
        SpacingSpec::Length(l) => format!(
            "  length (N x pitch) {:>10.3} mm   (gap {:.3} mm between turns)",
            to_mm(l),
            to_mm(g.gap())
        ),
        SpacingSpec::Gap(gap) => format!(
            "  gap between turns  {:>10.3} mm   (length {:.3} mm)",
            to_mm(gap),
            to_mm(g.length())
        ),
    });
    out.push(format!(
        "  leads              {:>10.1} mm each",
        to_mm(g.lead_length())
    ));
    out.push(format!(
        "  wire to cut        {:>13}   (helix plus both leads)",
        crate::tuning::digits::wire_to_cut_mm(g.wire_length())
    ));
    out.push(String::new());
}

fn tank_lines(r: &Recipe, out: &mut Vec<String>) {
    let t = &r.tank;
    out.push("Tank".to_owned());
    out.push(format!("  fixed              {:>10.2} pF", to_pf(t.fixed)));
    if t.is_fixed() {
        out.push(fixed_trimmer_words(t, "  trimmer            "));
    } else {
        out.push(format!(
            "  trimmer            {:>10.2} pF   ({:.1}–{:.1} pF at {:.0} %)",
            to_pf(t.trimmer_at(t.trimmer_setting)),
            to_pf(t.trimmer_min),
            to_pf(t.trimmer_max),
            t.trimmer_setting * 100.0
        ));
    }
    out.push(format!("  stray              {:>10.2} pF", to_pf(t.stray)));
    if let Some(f) = t.feedback {
        out.push(format!(
            "  feedback divider   {:>10.2} pF   ({:.1} pF over {:.1} pF, in series)",
            to_pf(f.series_capacitance()),
            to_pf(f.upper),
            to_pf(f.lower)
        ));
    }
    out.push(format!(
        "  across the coil    {:>10.2} pF   (without its self-capacitance)",
        to_pf(t.external_capacitance())
    ));
    out.push(String::new());
}

/// The trimmer's line for a fixed tank: "none (a fixed tank)", naming a capacitance of no
/// span entered as a trimmer.
fn fixed_trimmer_words(t: &crate::model::Tank, label: &str) -> String {
    if t.trimmer_min > 0.0 {
        format!(
            "{label}none (a fixed tank; {:.2} pF of no span entered as a trimmer)",
            to_pf(t.trimmer_min)
        )
    } else {
        format!("{label}none (a fixed tank)")
    }
}

fn target_lines(r: &Recipe, f: &Figures, out: &mut Vec<String>) {
    let t = &f.target;
    let target = t.channel;
    out.push("Target".to_owned());
    out.push(format!("  band plan          {}", r.target.plan.label()));
    // Channel numbers belong to the US plan (47 CFR §73.201).
    let number = matches!(r.target.plan, BandPlan::UsFm)
        .then(|| us_fm_channel_number(target))
        .flatten()
        .map(|n| format!("   (channel {n})"))
        .unwrap_or_default();
    out.push(format!(
        "  channel            {:>10.4} MHz{number}",
        to_mhz(target)
    ));
    out.push(format!(
        "  resonance now      {:>10.3} MHz   offset {}",
        to_mhz(t.resonance),
        digits::offset(t.offset)
    ));
    // What the figures rest on, in the words the window and the sheet use.
    out.push(format!("  figures            {}", f.basis_text()));
    match &t.length_for_target {
        Ok(l) => out.push(format!(
            "  length for target  {:>10.3} mm   ({} mm from now)",
            to_mm(*l),
            digits::signed(to_mm(l - f.coil.length()), 3)
        )),
        Err(e) => out.push(format!("  length for target  not proposed: {e}")),
    }
    out.push(format!(
        "  stretch moves it   {:>10.1} kHz per mm",
        to_khz_per_mm(t.stretch_sensitivity)
    ));
    if !r.tank.is_fixed() {
        match &t.setting_for_target {
            Ok(s) => out.push(format!(
                "  or trimmer at      {:>10.1} %    (at the present length)",
                s * 100.0
            )),
            Err(e) => out.push(format!("  trimmer alone      not enough: {e}")),
        }
    }
    out.push(format!("  next step          {}", t.advice));
    out.push(String::new());
}

fn bench_lines(r: &Recipe, f: &Figures, out: &mut Vec<String>) {
    out.push("Bench log".to_owned());
    if r.bench_log.is_empty() {
        out.push("  no measurements yet".to_owned());
        return;
    }
    for (i, e) in r.bench_log.iter().enumerate() {
        let error = e
            .error_ppm
            .map(|p| format!(", ±{p} ppm"))
            .unwrap_or_default();
        let instrument = if e.instrument.is_empty() {
            "instrument not noted".to_owned()
        } else {
            e.instrument.clone()
        };
        let note = if e.note.is_empty() {
            String::new()
        } else {
            format!(" — {}", e.note)
        };
        out.push(format!(
            "  {}. {:.4} MHz at {:.2} mm, trimmer {:.0} % ({instrument}{error}){note}",
            i + 1,
            to_mhz(e.measured),
            to_mm(e.length),
            e.trimmer_setting * 100.0
        ));
    }
    match &f.fit {
        Some(Ok(fit)) => {
            out.push(format!(
                "  calibration: {:+.2} ± {:.2} pF beyond the model",
                to_pf(fit.calibration.extra_capacitance),
                to_pf(fit.extra_capacitance_error)
            ));
            match fit.inductance_scale_error {
                Some(e) => out.push(format!(
                    "  inductance {:.3} ± {:.3} × the model's",
                    fit.calibration.inductance_scale, e
                )),
                None => {
                    out.push("  inductance as modelled (not separable from these readings)".into())
                }
            }
            for (i, r) in fit.residuals.iter().enumerate() {
                out.push(format!(
                    "  reading {} is {:+.1} kHz off the fit",
                    i + 1,
                    to_khz(*r)
                ));
            }
            for w in &fit.warnings {
                out.push(format!("  - {w}"));
            }
        }
        Some(Err(e)) => out.push(format!("  no calibration: {e}")),
        None => {}
    }
}

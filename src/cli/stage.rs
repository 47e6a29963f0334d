//! `tankwright stage --recipe R --supply-v V --bias-upper-ohm R1 --bias-lower-ohm R2
//! --emitter-ohm RE (--transistor-model '.model NAME NPN(...)' | --hfe B --cbe-pf C --cbc-pf C
//! --ft-mhz F) [--topology common-base|common-collector] [--clapp-pf C] [--battery-mah M]
//! [--json]`: the one-transistor Colpitts stage round a recipe's tank (`tuning::stage` on the
//! tank `recipe::figures` drives): will it start, where will it run, what does it draw. A
//! stage kept in the recipe (`Recipe::stage`) gives every setting whose flag is not given.

use super::args::{Args, short};
use crate::recipe::store;
use crate::tuning::stage::advice::Part;
use crate::tuning::stage::settings::{
    CBC_RANGE_F, CBE_RANGE_F, CLAPP_RANGE_F, FT_RANGE_HZ, IC_MAX_RANGE_A, PTOT_RANGE_W,
    VCEO_RANGE_V,
};
use crate::tuning::stage::{
    BATTERY_RANGE_MAH, Bias, RESISTOR_RANGE_OHM, Ratings, SUPPLY_RANGE_V, StageFigures,
    StageInputs, StageSettings, Start, Topology, Transistor, TransistorSpec, frequency_accuracy,
    stage, transistor::BETA_RANGE,
};
use crate::units;
use crate::units::{to_khz, to_ma, to_mhz, to_millisiemens, to_pf, to_us};
use serde_json::json;
use std::path::Path;

const USAGE: &str = "tankwright stage --recipe R --supply-v V --bias-upper-ohm R1 \
                     --bias-lower-ohm R2 --emitter-ohm RE (--transistor-model '.model NAME \
                     NPN(...)' | --hfe B --cbe-pf C --cbc-pf C --ft-mhz F) [--topology \
                     common-base|common-collector] [--clapp-pf C] [--battery-mah M] \
                     [--vceo-v V] [--ic-max-ma I] [--ptot-mw P] [--json] (a stage kept in \
                     the recipe stands in for every flag not given)";

/// A flag's number within `lo`–`hi` (display units), or the refusal naming the range.
fn within(
    args: &Args,
    name: &str,
    (lo, hi): (f64, f64),
    unit: &str,
) -> Result<Option<f64>, String> {
    match args.number(name).map_err(|e| e.to_string())? {
        None => Ok(None),
        Some(v) if (lo..=hi).contains(&v) => Ok(Some(v)),
        Some(v) => Err(format!("--{name} {}: give {lo}–{hi}{unit}", short(v))),
    }
}

/// The transistor from `--transistor-model` or from the four figures (never both), over the
/// recipe's (`kept`): a figure given alone replaces that figure of the recipe's four.
fn transistor(args: &Args, kept: Option<&TransistorSpec>) -> Result<TransistorSpec, String> {
    let model = args.text("transistor-model").map(str::to_owned);
    let figures = [
        within(args, "hfe", BETA_RANGE, "")?,
        within(args, "cbe-pf", scaled(CBE_RANGE_F, units::to_pf), " pF")?,
        within(args, "cbc-pf", scaled(CBC_RANGE_F, units::to_pf), " pF")?,
        within(args, "ft-mhz", scaled(FT_RANGE_HZ, units::to_mhz), " MHz")?,
    ];
    let any_figure = figures.iter().any(Option::is_some);
    let needed = || {
        format!(
            "the transistor is needed: --transistor-model, or all four of --hfe, \
             --cbe-pf, --cbc-pf and --ft-mhz (or a stage kept in the recipe); usage: {USAGE}"
        )
    };
    match (model, kept) {
        (Some(_), _) if any_figure => Err(
            "give --transistor-model or --hfe, --cbe-pf, --cbc-pf and --ft-mhz, not both".into(),
        ),
        (Some(text), _) => {
            Transistor::from_model(&text).map_err(|e| e.to_string())?;
            Ok(TransistorSpec::Model(text))
        }
        (None, Some(TransistorSpec::Figures { hfe, cbe, cbc, ft })) => {
            let [b, e, c, t] = figures;
            Ok(TransistorSpec::Figures {
                hfe: b.unwrap_or(*hfe),
                cbe: e.map_or(*cbe, units::from_pf),
                cbc: c.map_or(*cbc, units::from_pf),
                ft: t.map_or(*ft, units::from_mhz),
            })
        }
        (None, kept) => match (figures, kept) {
            ([Some(b), Some(e), Some(c), Some(t)], _) => Ok(TransistorSpec::Figures {
                hfe: b,
                cbe: units::from_pf(e),
                cbc: units::from_pf(c),
                ft: units::from_mhz(t),
            }),
            (_, Some(spec)) if !any_figure => Ok(spec.clone()),
            _ => Err(needed()),
        },
    }
}

/// An SI range in display units, to nine figures (so 1 nF reads 1000 pF, not 1000.0000000000001).
fn scaled((lo, hi): (f64, f64), to: fn(f64) -> f64) -> (f64, f64) {
    let r = |x: f64| format!("{x:.9e}").parse().unwrap_or(x);
    (r(to(lo)), r(to(hi)))
}

/// The stage's settings: the recipe's (`kept`), each flag given replacing its setting; with no
/// stage kept, the supply, the three resistors and the transistor must be given.
fn settings(args: &Args, kept: Option<&StageSettings>) -> Result<StageSettings, String> {
    let need = |name: &str, given: Option<f64>, from: Option<f64>| {
        given.or(from).ok_or_else(|| {
            format!("--{name} is needed (no stage is kept in the recipe); usage: {USAGE}")
        })
    };
    let topology = match args.text("topology") {
        None => kept.map_or(Topology::CommonBase, |k| k.topology),
        Some(name) => Topology::from_cli_name(name).ok_or_else(|| {
            format!(
                "unknown topology '{}': --topology is common-base or common-collector",
                super::clean(name)
            )
        })?,
    };
    let bias = Bias {
        supply_v: need(
            "supply-v",
            within(args, "supply-v", SUPPLY_RANGE_V, " V")?,
            kept.map(|k| k.bias.supply_v),
        )?,
        upper: need(
            "bias-upper-ohm",
            within(args, "bias-upper-ohm", RESISTOR_RANGE_OHM, " ohm")?,
            kept.map(|k| k.bias.upper),
        )?,
        lower: need(
            "bias-lower-ohm",
            within(args, "bias-lower-ohm", RESISTOR_RANGE_OHM, " ohm")?,
            kept.map(|k| k.bias.lower),
        )?,
        emitter: need(
            "emitter-ohm",
            within(args, "emitter-ohm", RESISTOR_RANGE_OHM, " ohm")?,
            kept.map(|k| k.bias.emitter),
        )?,
    };
    let battery = within(args, "battery-mah", BATTERY_RANGE_MAH, " mAh")?.map(units::from_mah);
    let clapp =
        within(args, "clapp-pf", scaled(CLAPP_RANGE_F, units::to_pf), " pF")?.map(units::from_pf);
    let kept_ratings = kept.map(|k| k.ratings).unwrap_or_default();
    let ratings = Ratings {
        collector_emitter_max: within(args, "vceo-v", VCEO_RANGE_V, " V")?
            .or(kept_ratings.collector_emitter_max),
        collector_max: within(
            args,
            "ic-max-ma",
            scaled(IC_MAX_RANGE_A, units::to_ma),
            " mA",
        )?
        .map(units::from_ma)
        .or(kept_ratings.collector_max),
        dissipation_max: within(args, "ptot-mw", scaled(PTOT_RANGE_W, units::to_mw), " mW")?
            .map(units::from_mw)
            .or(kept_ratings.dissipation_max),
    };
    // The recipe's Clapp capacitor stays with the common-collector stage only.
    let kept_clapp = kept
        .and_then(|k| k.clapp)
        .filter(|_| topology == Topology::CommonCollector);
    let s = StageSettings {
        topology,
        bias,
        transistor: transistor(args, kept.map(|k| &k.transistor))?,
        ratings,
        battery_charge: battery.or(kept.and_then(|k| k.battery_charge)),
        clapp: clapp.or(kept_clapp),
    };
    if s.clapp.is_some() && topology != Topology::CommonCollector {
        return Err(
            "--clapp-pf: a Clapp series capacitor belongs to the common-collector stage \
             (add --topology common-collector)"
                .into(),
        );
    }
    Ok(s)
}

/// Run `stage` on the words after the subcommand; Ok(the figures) or Err(message).
pub fn run_stage(words: Vec<String>) -> Result<String, String> {
    let args = Args::parse(words, &["json"]).map_err(|e| e.to_string())?;
    args.reject_positional().map_err(|e| e.to_string())?;
    let file = args
        .text("recipe")
        .map(str::to_owned)
        .ok_or_else(|| format!("--recipe is needed; usage: {USAGE}"))?;
    for name in [
        "topology",
        "supply-v",
        "bias-upper-ohm",
        "bias-lower-ohm",
        "emitter-ohm",
        "battery-mah",
        "clapp-pf",
        "transistor-model",
        "hfe",
        "cbe-pf",
        "cbc-pf",
        "ft-mhz",
        "vceo-v",
        "ic-max-ma",
        "ptot-mw",
    ] {
        let _ = args.text(name);
    }
    args.reject_unknown().map_err(|e| e.to_string())?;
    let recipe = store::load(Path::new(&file)).map_err(|e| e.to_string())?;
    let settings = settings(&args, recipe.stage.as_ref())?;
    let f = crate::recipe::figures(&recipe).map_err(|e| format!("invalid recipe: {e}"))?;
    let inputs = settings.inputs().map_err(|e| e.to_string())?;
    let battery = settings.battery_charge.map(units::to_mah);
    let s = stage(&f.coil, &f.tank, &f.conditions, &inputs).map_err(|e| e.to_string())?;
    if args.switch("json") {
        let v = stage_json(&s, battery);
        return serde_json::to_string_pretty(&v)
            .map(|t| t + "\n")
            .map_err(|e| e.to_string());
    }
    Ok(stage_text(&s, &inputs, battery))
}

/// The stage's figures as JSON, display units in the key names.
pub fn stage_json(s: &StageFigures, battery_mah: Option<f64>) -> serde_json::Value {
    let op = &s.operating_point;
    json!({
        "topology": s.topology.cli_name(),
        "starts": s.starts(),
        "start": s.start.label(),
        "loop_gain": s.loop_gain,
        "start_margin": s.start_margin,
        "transformer_estimate": s.transformer_estimate,
        "collector_ma": to_ma(op.collector_current),
        "collector_emitter_v": op.collector_emitter_v,
        "base_v": op.base_v,
        "emitter_v": op.emitter_v,
        "transconductance_ms": to_millisiemens(op.transconductance),
        "active": s.active,
        "rating_faults": s.rating_faults,
        "c_pi_pf": to_pf(s.c_pi),
        "c_mu_pf": to_pf(s.c_mu),
        "transit_frequency_mhz": to_mhz(s.transit_frequency),
        "coil_resistance_ohm": s.coil_resistance,
        "coil_q": s.coil_q,
        "frequency_mhz": to_mhz(s.frequency),
        "frequency_accuracy": frequency_accuracy(s.topology),
        "small_signal_frequency_mhz": s.small_signal_frequency.map(to_mhz),
        "tank_frequency_mhz": to_mhz(s.tank_frequency),
        "pulling_khz": to_khz(s.pulling),
        "supply_ma": to_ma(s.supply_current),
        "battery_mah": battery_mah,
        "battery_hours": s.battery_life.map(|t| t / 3600.0),
        "junction": {
            "c_bc_pf": to_pf(s.junction.capacitance),
            "share": s.junction.share,
            "khz_per_v": to_khz(s.junction.hz_per_volt),
        },
        "unused_model_parameters": s.unused,
        "advice": s.advice,
        "advice_change": s.change.map(|c| {
            let (scale, unit) = match c.part {
                Part::LowerDividerCapacitor => (1e12, "pF"),
                Part::EmitterResistor | Part::LowerBiasResistor => (1.0, "ohm"),
            };
            json!({
                "part": c.part.json_name(),
                "from": c.from * scale,
                "to": c.to * scale,
                "unit": unit,
                "loop_gain": c.loop_gain,
            })
        }),
        "caution": crate::cautions::ONE_LINE,
    })
}

/// The stage's figures as text.
fn stage_text(s: &StageFigures, inputs: &StageInputs, battery_mah: Option<f64>) -> String {
    let op = &s.operating_point;
    let b = &inputs.bias;
    let mut out = vec![
        format!("The {} stage round the tank", s.topology.label()),
        format!(
            "  bias: {} V supply, {} / {} ohm divider, {} ohm emitter resistor",
            short(b.supply_v),
            short(b.upper),
            short(b.lower),
            short(b.emitter)
        ),
        format!(
            "  operating point: collector {:.3} mA, collector-emitter {:.2} V, base {:.2} V, \
             emitter {:.2} V, gm {:.2} mS{}",
            to_ma(op.collector_current),
            op.collector_emitter_v,
            op.base_v,
            op.emitter_v,
            to_millisiemens(op.transconductance),
            if s.active {
                ""
            } else {
                " (not in the active region)"
            }
        ),
    ];
    for fault in &s.rating_faults {
        out.push(format!("  rating: {fault}"));
    }
    out.push(format!(
        "  transistor at that point: C_pi {:.2} pF, C_mu {:.2} pF, fT {:.0} MHz",
        to_pf(s.c_pi),
        to_pf(s.c_mu),
        to_mhz(s.transit_frequency)
    ));
    out.push(format!(
        "  coil at the operating frequency: {:.3} ohm, Q {:.0}",
        s.coil_resistance, s.coil_q
    ));
    out.push(format!(
        "  loop gain {:.2} ({}; the trade asks 3 or more, common practice): start margin {:.2}",
        s.loop_gain,
        s.start.label(),
        s.start_margin
    ));
    let accuracy = if s.start == Start::TooHard {
        "a start this hard limits on the collector's swing: expect it up to a few per cent off"
            .to_owned()
    } else {
        format!(
            "within about {:.1} %",
            frequency_accuracy(s.topology) * 100.0
        )
    };
    out.push(format!(
        "  frequency {:.4} MHz ({accuracy}), tank alone {:.4} MHz: pulled {:+.0} kHz",
        to_mhz(s.frequency),
        to_mhz(s.tank_frequency),
        to_khz(s.pulling)
    ));
    if let (Some(f), Some(rate)) = (s.small_signal_frequency, s.ring_growth_rate)
        && s.start != Start::TooHard
    {
        out.push(format!(
            "  at switch-on it rings at {:.4} MHz, {} tenfold every {:.2} us",
            to_mhz(f),
            if rate > 0.0 { "growing" } else { "dying away" },
            to_us(std::f64::consts::LN_10 / rate.abs())
        ));
    }
    out.push(format!(
        "  base-collector junction: {:.2} pF, {:.1} % of the tank's capacitance, {:+.1} kHz per volt",
        to_pf(s.junction.capacitance),
        s.junction.share * 100.0,
        to_khz(s.junction.hz_per_volt)
    ));
    let mut supply = format!("  supply current {:.3} mA", to_ma(s.supply_current));
    if let (Some(m), Some(t)) = (battery_mah, s.battery_life) {
        supply.push_str(&format!(
            ": a {} mAh battery lasts about {:.0} hours",
            short(m),
            t / 3600.0
        ));
    }
    out.push(supply);
    if !s.unused.is_empty() {
        out.push(format!(
            "  .model parameters not used: {}",
            s.unused.join(", ")
        ));
    }
    out.push(format!("Advice: {}", s.advice));
    out.push(format!("Caution: {}", crate::cautions::ONE_LINE));
    out.join("\n") + "\n"
}

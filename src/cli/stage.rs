//! `tankwright stage --recipe R --supply-v V --bias-upper-ohm R1 --bias-lower-ohm R2
//! --emitter-ohm RE (--transistor-model '.model NAME NPN(...)' | --hfe B --cbe-pf C --cbc-pf C
//! --ft-mhz F) [--topology common-base|common-collector] [--battery-mah M] [--json]`: the
//! one-transistor Colpitts stage round a recipe's tank (`tuning::stage` on the tank
//! `recipe::figures` drives): will it start, where will it run, what does it draw.

use super::args::{Args, short};
use crate::recipe::store;
use crate::tuning::stage::advice::Part;
use crate::tuning::stage::{
    BATTERY_RANGE_MAH, Bias, FREQUENCY_ACCURACY, RESISTOR_RANGE_OHM, Ratings, SUPPLY_RANGE_V,
    StageFigures, StageInputs, Start, Topology, Transistor, stage, transistor::BETA_RANGE,
};
use serde_json::json;
use std::path::Path;

const USAGE: &str = "tankwright stage --recipe R --supply-v V --bias-upper-ohm R1 \
                     --bias-lower-ohm R2 --emitter-ohm RE (--transistor-model '.model NAME \
                     NPN(...)' | --hfe B --cbe-pf C --cbc-pf C --ft-mhz F) [--topology \
                     common-base|common-collector] [--battery-mah M] [--vceo-v V] \
                     [--ic-max-ma I] [--ptot-mw P] [--json]";

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

fn required(args: &Args, name: &str, range: (f64, f64), unit: &str) -> Result<f64, String> {
    within(args, name, range, unit)?.ok_or_else(|| format!("--{name} is needed; usage: {USAGE}"))
}

/// The transistor from `--transistor-model` or from the four figures (never both).
fn transistor(args: &Args) -> Result<Transistor, String> {
    let model = args.text("transistor-model").map(str::to_owned);
    let figures = [
        within(args, "hfe", BETA_RANGE, "")?,
        within(args, "cbe-pf", (0.0, 1000.0), " pF")?,
        within(args, "cbc-pf", (0.0, 100.0), " pF")?,
        within(args, "ft-mhz", (10.0, 100_000.0), " MHz")?,
    ];
    let any_figure = figures.iter().any(Option::is_some);
    let mut t = match (model, figures) {
        (Some(_), _) if any_figure => {
            return Err(
                "give --transistor-model or --hfe, --cbe-pf, --cbc-pf and --ft-mhz, not both"
                    .into(),
            );
        }
        (Some(text), _) => Transistor::from_model(&text).map_err(|e| e.to_string())?,
        (None, [Some(b), Some(cbe), Some(cbc), Some(ft)]) => {
            Transistor::from_figures(b, cbe * 1e-12, cbc * 1e-12, ft * 1e6)
        }
        (None, _) => {
            return Err(format!(
                "the transistor is needed: --transistor-model, or all four of --hfe, \
                 --cbe-pf, --cbc-pf and --ft-mhz; usage: {USAGE}"
            ));
        }
    };
    t.ratings = Ratings {
        collector_emitter_max: within(args, "vceo-v", (1.0, 1000.0), " V")?,
        collector_max: within(args, "ic-max-ma", (0.01, 10_000.0), " mA")?.map(|i| i * 1e-3),
        dissipation_max: within(args, "ptot-mw", (1.0, 100_000.0), " mW")?.map(|p| p * 1e-3),
    };
    Ok(t)
}

/// Run `stage` on the words after the subcommand; Ok(the figures) or Err(message).
pub fn run_stage(words: Vec<String>) -> Result<String, String> {
    let args = Args::parse(words, &["json"]).map_err(|e| e.to_string())?;
    args.reject_positional().map_err(|e| e.to_string())?;
    let file = args
        .text("recipe")
        .map(str::to_owned)
        .ok_or_else(|| format!("--recipe is needed; usage: {USAGE}"))?;
    let topology = match args.text("topology") {
        None => Topology::CommonBase,
        Some(name) => Topology::from_cli_name(name).ok_or_else(|| {
            format!(
                "unknown topology '{}': --topology is common-base or common-collector",
                super::clean(name)
            )
        })?,
    };
    let bias = Bias {
        supply_v: required(&args, "supply-v", SUPPLY_RANGE_V, " V")?,
        upper: required(&args, "bias-upper-ohm", RESISTOR_RANGE_OHM, " ohm")?,
        lower: required(&args, "bias-lower-ohm", RESISTOR_RANGE_OHM, " ohm")?,
        emitter: required(&args, "emitter-ohm", RESISTOR_RANGE_OHM, " ohm")?,
    };
    let battery = within(&args, "battery-mah", BATTERY_RANGE_MAH, " mAh")?;
    let transistor = transistor(&args)?;
    args.reject_unknown().map_err(|e| e.to_string())?;
    let recipe = store::load(Path::new(&file)).map_err(|e| e.to_string())?;
    let f = crate::recipe::figures(&recipe).map_err(|e| format!("invalid recipe: {e}"))?;
    let inputs = StageInputs {
        topology,
        bias,
        transistor,
        battery_charge: battery.map(|m| m * 3.6),
    };
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
        "collector_ma": op.collector_current * 1e3,
        "collector_emitter_v": op.collector_emitter_v,
        "base_v": op.base_v,
        "emitter_v": op.emitter_v,
        "transconductance_ms": op.transconductance * 1e3,
        "active": s.active,
        "rating_faults": s.rating_faults,
        "c_pi_pf": s.c_pi * 1e12,
        "c_mu_pf": s.c_mu * 1e12,
        "transit_frequency_mhz": s.transit_frequency * 1e-6,
        "coil_resistance_ohm": s.coil_resistance,
        "coil_q": s.coil_q,
        "frequency_mhz": s.frequency * 1e-6,
        "frequency_accuracy": FREQUENCY_ACCURACY,
        "small_signal_frequency_mhz": s.small_signal_frequency.map(|f| f * 1e-6),
        "tank_frequency_mhz": s.tank_frequency * 1e-6,
        "pulling_khz": s.pulling * 1e-3,
        "supply_ma": s.supply_current * 1e3,
        "battery_mah": battery_mah,
        "battery_hours": s.battery_life.map(|t| t / 3600.0),
        "junction": {
            "c_bc_pf": s.junction.capacitance * 1e12,
            "share": s.junction.share,
            "khz_per_v": s.junction.hz_per_volt * 1e-3,
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
            op.collector_current * 1e3,
            op.collector_emitter_v,
            op.base_v,
            op.emitter_v,
            op.transconductance * 1e3,
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
        s.c_pi * 1e12,
        s.c_mu * 1e12,
        s.transit_frequency * 1e-6
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
        format!("within about {:.1} %", FREQUENCY_ACCURACY * 100.0)
    };
    out.push(format!(
        "  frequency {:.4} MHz ({accuracy}), tank alone {:.4} MHz: pulled {:+.0} kHz",
        s.frequency * 1e-6,
        s.tank_frequency * 1e-6,
        s.pulling * 1e-3
    ));
    if let (Some(f), Some(rate)) = (s.small_signal_frequency, s.ring_growth_rate)
        && s.start != Start::TooHard
    {
        out.push(format!(
            "  at switch-on it rings at {:.4} MHz, {} tenfold every {:.2} us",
            f * 1e-6,
            if rate > 0.0 { "growing" } else { "dying away" },
            std::f64::consts::LN_10 / rate.abs() * 1e6
        ));
    }
    out.push(format!(
        "  base-collector junction: {:.2} pF, {:.1} % of the tank's capacitance, {:+.1} kHz per volt",
        s.junction.capacitance * 1e12,
        s.junction.share * 100.0,
        s.junction.hz_per_volt * 1e-3
    ));
    let mut supply = format!("  supply current {:.3} mA", s.supply_current * 1e3);
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

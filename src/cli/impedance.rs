//! `tankwright impedance`: the coil's impedance at its terminals against frequency, from the
//! field solution (see `physics::field`), for scripts.

use super::args::{ArgError, Args};
use super::evaluate::EvaluateRequest;
use crate::model::Coil;
use crate::tuning::impedance::{ImpedancePoint, ImpedanceSweep, impedance_sweep};
use crate::units::{from_mhz, to_mhz, to_nh};
use serde_json::{Value, json};
use std::fmt::Write as _;

/// Most points a sweep may ask for (each is one solution of the moment matrix).
const MAX_POINTS: i32 = 2000;
/// Points when `--points` is not given.
const DEFAULT_POINTS: i32 = 40;

/// The sweep's own flags, read before the coil's.
struct Range {
    from: Option<f64>,
    to: Option<f64>,
    points: usize,
    /// Whether `--points` was given (else the default, cut to what the coil allows).
    points_given: bool,
}

fn range(args: &Args) -> Result<Range, ArgError> {
    let from = args.number("from-mhz")?;
    let to = args.number("to-mhz")?;
    for (name, v) in [("from-mhz", from), ("to-mhz", to)] {
        if let Some(x) = v
            && x <= 0.0
        {
            return Err(ArgError(format!("--{name} must be above 0 MHz, got {x}")));
        }
    }
    if let (Some(a), Some(b)) = (from, to)
        && b <= a
    {
        return Err(ArgError(format!(
            "--to-mhz {b} must be above --from-mhz {a}"
        )));
    }
    let given = args.integer("points")?;
    let points = given.unwrap_or(DEFAULT_POINTS);
    if !(2..=MAX_POINTS).contains(&points) {
        return Err(ArgError(format!(
            "--points {points}: give 2 to {MAX_POINTS} frequencies"
        )));
    }
    Ok(Range {
        from: from.map(from_mhz),
        to: to.map(from_mhz),
        points: points as usize,
        points_given: given.is_some(),
    })
}

/// Run `impedance` on the words after the subcommand; Ok(stdout) or Err(one-line message).
pub fn run_impedance(words: Vec<String>) -> Result<String, String> {
    let args = Args::parse(words, &["json", "as-written"]).map_err(|e| e.to_string())?;
    let range = range(&args).map_err(|e| e.to_string())?;
    let req = match args.text("recipe") {
        Some(file) => super::recipe_args::request_from_recipe(&args, file)?,
        None => EvaluateRequest::from_args(&args).map_err(|e| e.to_string())?,
    };
    if let Some(word) = args.positional.first() {
        return Err(format!("unexpected word '{word}'"));
    }
    // The classical evaluation validates the coil, tank and conditions; the tank's operating
    // frequency, when it has a capacitance, is the one `evaluate` leads with: field-solved
    // (tuning::field_tank), else classical.
    let analysis = crate::model::evaluate(&req.winding, &req.tank, &req.conditions)
        .map_err(|e| format!("invalid input: {e}"))?;
    let coil = Coil::from_winding(&req.winding).map_err(|e| format!("invalid input: {e}"))?;
    // The range is checked against the wire before any solution is started (a solve can
    // take seconds; a mistaken --to-mhz must be refused at once).
    let wire = crate::model::wire_coil(&coil, req.conditions.temperature_c);
    wire.check().map_err(|e| e.to_string())?;
    let ceiling = wire.frequency_ceiling();
    for (name, v) in [("from-mhz", range.from), ("to-mhz", range.to)] {
        if let Some(hz) = v
            && hz > ceiling
        {
            return Err(format!(
                "--{name} {} is outside the solved range: above {}, the highest \
                 frequency solved for this coil (where its wire is 1.5 wavelengths long); \
                 give 0–{}",
                super::args::short(to_mhz(hz)),
                crate::tuning::digits::mhz_at(ceiling, 1),
                crate::tuning::digits::mhz_at(ceiling, 1)
            ));
        }
    }
    // Each point solves the moment matrix once: the count is bounded by the coil's size
    // before any work (a 60-turn coil took 3.3 s for the default 40 points).
    let most = crate::tuning::impedance::most_points(&coil, req.conditions.temperature_c)
        .map_err(|e| e.to_string())?;
    if range.points > most && range.points_given {
        return Err(format!(
            "--points {}: this coil's field solution solves at most {most} frequencies within              the {} s a solution may take; give 2–{most}",
            range.points,
            crate::physics::field::budget::TIME_LIMIT_SECONDS
        ));
    }
    // With a recipe calibrated on its readings, the operating frequency is the calibrated
    // tank's (the figures' conditions put the model on the calibrated field-led resonance),
    // as `evaluate --recipe`, `report` and the window state it.
    let calibrated = req.bench.as_ref().map(|b| {
        crate::model::evaluate_coil(&coil, b.tank.external_capacitance(), &b.conditions).resonance
    });
    let operating = calibrated.or_else(|| {
        (req.tank.external_capacitance() > 0.0).then(|| {
            let field = crate::tuning::field_tank::field_tank(
                &coil,
                analysis.external_capacitance,
                &req.conditions,
            );
            // The field-solved tank when there is one (what `evaluate` leads with).
            field.map_or(analysis.resonance, |f| f.resonance)
        })
    });
    let sweep = impedance_sweep(
        &coil,
        req.conditions.temperature_c,
        range.from,
        range.to,
        range.points,
        operating,
    )
    .map_err(|e| e.to_string())?;
    Ok(if req.json {
        let mut v = sweep_json(&sweep);
        v["operating_calibrated"] = json!(calibrated.is_some());
        let mut s = v.to_string();
        s.push('\n');
        s
    } else {
        let mut text = sweep_text(&sweep, coil.lead_length());
        if let Some(b) = &req.bench {
            let _ = writeln!(
                text,
                "(the operating frequency is the tank calibrated on the recipe's {} bench \
                 reading{}; --as-written for the recipe alone)",
                b.readings,
                if b.readings == 1 { "" } else { "s" }
            );
        }
        if sweep.points.len() < range.points {
            let _ = writeln!(
                text,
                "({} points, not {}: the most this coil's field solution solves within {} s)",
                sweep.points.len(),
                range.points,
                crate::physics::field::budget::TIME_LIMIT_SECONDS
            );
        }
        text
    })
}

fn point_json(p: &ImpedancePoint) -> Value {
    json!({
        "mhz": to_mhz(p.frequency),
        "r_ohm": p.impedance.re,
        "x_ohm": p.impedance.im,
        "abs_ohm": p.impedance.norm(),
        "apparent_nh": to_nh(p.apparent_inductance()),
        "q": finite_or_null(p.quality()),
    })
}

fn finite_or_null(x: f64) -> Value {
    if x.is_finite() { json!(x) } else { Value::Null }
}

/// The sweep as one JSON object; units in the key names.
pub fn sweep_json(s: &ImpedanceSweep) -> Value {
    json!({
        "method": "field solution (thin-wire method of moments)",
        "self_resonance_mhz": to_mhz(s.self_resonance),
        "ceiling_mhz": to_mhz(s.ceiling),
        "segments": s.segments,
        "operating": s.operating.as_ref().map(point_json),
        "points": s.points.iter().map(point_json).collect::<Vec<_>>(),
    })
}

/// The sweep as a table for people.
pub fn sweep_text(s: &ImpedanceSweep, lead_length: f64) -> String {
    let mut out = String::new();
    let setting = if lead_length > 0.0 {
        format!(
            "leads {:.1} mm each to the board, loop closed beneath the coil",
            lead_length * 1e3
        )
    } else {
        "isolated coil, terminals at its two ends".to_owned()
    };
    // Writing to a String cannot fail.
    let _ = writeln!(
        out,
        "Impedance at the terminals (field solution, {} segments; {setting})",
        s.segments
    );
    let _ = writeln!(
        out,
        "first parallel self-resonance  {}",
        crate::tuning::digits::self_resonance(s.self_resonance)
    );
    if let Some(p) = &s.operating {
        let _ = writeln!(
            out,
            "at the operating frequency {}: R {:.4} ohm, X {:.3} ohm, X/w {:.2} nH",
            crate::tuning::digits::mhz(p.frequency),
            p.impedance.re,
            p.impedance.im,
            to_nh(p.apparent_inductance())
        );
    }
    let _ = writeln!(
        out,
        "{:>12} {:>12} {:>12} {:>12} {:>12} {:>9}",
        "MHz", "R ohm", "X ohm", "|Z| ohm", "X/w nH", "Q"
    );
    for p in &s.points {
        let _ = writeln!(
            out,
            "{:>12.4} {:>12.5} {:>12.4} {:>12.4} {:>12.3} {:>9.1}",
            to_mhz(p.frequency),
            p.impedance.re,
            p.impedance.im,
            p.impedance.norm(),
            to_nh(p.apparent_inductance()),
            p.quality()
        );
    }
    out
}

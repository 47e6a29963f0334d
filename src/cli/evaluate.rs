//! `tankwright evaluate`: one coil from flags, every figure out.

use super::args::{ArgError, Args};
use crate::model::{
    Coating, Conditions, DiameterSpec, Gauge, InductanceModel, SpacingSpec, Tank, Winding, WireSpec,
};

/// A coil, tank and conditions read from the command line.
#[derive(Clone, Debug, PartialEq)]
pub struct EvaluateRequest {
    /// The coil.
    pub winding: Winding,
    /// The tank.
    pub tank: Tank,
    /// Temperature and model.
    pub conditions: Conditions,
    /// Print JSON instead of the report.
    pub json: bool,
}

const MM: f64 = 1e-3;
const PF: f64 = 1e-12;

fn one_of<T>(
    args: &Args,
    a: &str,
    b: &str,
    what: &str,
    fa: impl Fn(f64) -> T,
    fb: impl Fn(f64) -> T,
) -> Result<T, ArgError> {
    match (args.number(a)?, args.number(b)?) {
        (Some(x), None) => Ok(fa(x)),
        (None, Some(x)) => Ok(fb(x)),
        (Some(_), Some(_)) => Err(ArgError(format!("give either --{a} or --{b}, not both"))),
        (None, None) => Err(ArgError(format!("{what} is missing: give --{a} or --{b}"))),
    }
}

fn model_named(name: &str) -> Result<InductanceModel, ArgError> {
    Ok(match name {
        "round-wire" => InductanceModel::RoundWire,
        "filament-sum" => InductanceModel::FilamentSum,
        "current-sheet" => InductanceModel::CurrentSheet,
        "lundin" => InductanceModel::Lundin1985,
        "wheeler" => InductanceModel::Wheeler1928,
        other => {
            return Err(ArgError(format!(
                "--model '{other}' is not one of round-wire, filament-sum, current-sheet, lundin, wheeler"
            )));
        }
    })
}

impl EvaluateRequest {
    /// Read the request from parsed flags.
    pub fn from_args(args: &Args) -> Result<Self, ArgError> {
        let diameter = one_of(
            args,
            "mean-diameter-mm",
            "former-diameter-mm",
            "the diameter",
            |d| DiameterSpec::Mean(d * MM),
            |d| DiameterSpec::Former(d * MM),
        )?;
        let turns = args
            .number("turns")?
            .ok_or_else(|| ArgError("--turns is missing".to_owned()))?;
        let spacing = one_of(
            args,
            "length-mm",
            "gap-mm",
            "the spacing",
            |l| SpacingSpec::Length(l * MM),
            |g| SpacingSpec::Gap(g * MM),
        )?;
        let gauge = match (
            args.number("wire-mm")?,
            args.integer("awg")?,
            args.integer("swg")?,
        ) {
            (Some(d), None, None) => Gauge::Metric(d * MM),
            (None, Some(n), None) => Gauge::Awg(n),
            (None, None, Some(n)) => Gauge::Swg(n),
            (None, None, None) => {
                return Err(ArgError(
                    "the wire is missing: give --wire-mm, --awg or --swg".to_owned(),
                ));
            }
            _ => {
                return Err(ArgError(
                    "give only one of --wire-mm, --awg, --swg".to_owned(),
                ));
            }
        };
        let coating = match args.integer("enamel")? {
            None => Coating::Bare,
            Some(1) => Coating::EnamelGrade1,
            Some(2) => Coating::EnamelGrade2,
            Some(g) => return Err(ArgError(format!("--enamel {g}: the grade is 1 or 2"))),
        };
        let lead = args.number("lead-mm")?.unwrap_or(0.0) * MM;
        let capacitance = args.number("capacitance-pf")?.unwrap_or(0.0) * PF;
        let stray = args.number("stray-pf")?.unwrap_or(0.0) * PF;
        let mut conditions = Conditions::default();
        if let Some(t) = args.number("temperature-c")? {
            conditions.temperature_c = t;
        }
        if let Some(m) = args.text("model") {
            conditions.model = model_named(m)?;
        }
        args.reject_unknown()?;
        Ok(Self {
            winding: Winding {
                diameter,
                wire: WireSpec { gauge, coating },
                turns,
                spacing,
                lead_length: lead,
            },
            tank: Tank::fixed_only(capacitance, stray),
            conditions,
            json: args.switch("json"),
        })
    }
}

/// Run `evaluate` on the words after the subcommand; Ok(stdout) or Err(one-line message).
pub fn run_evaluate(words: Vec<String>) -> Result<String, String> {
    let args = Args::parse(words, &["json"]).map_err(|e| e.to_string())?;
    // The stray, junction and drift flags are read first, so the coil's reader sees them used.
    let extras = super::stray_flags::Extras::from_args(&args).map_err(|e| e.to_string())?;
    let req = match args.text("recipe") {
        Some(file) => super::recipe_args::request_from_recipe(&args, file)?,
        None => EvaluateRequest::from_args(&args).map_err(|e| e.to_string())?,
    };
    // With a junction given, the tank's resonance includes its capacitance at the bias.
    let mut tank = req.tank;
    tank.stray += extras.junction_across_tank();
    let analysis = crate::model::evaluate(&req.winding, &tank, &req.conditions)
        .map_err(|e| format!("invalid input: {e}"))?;
    let more = super::stray_flags::ExtraFigures::compute(&extras, &req, &analysis)?;
    Ok(if req.json {
        let mut v = super::json::analysis_json(&analysis);
        more.add_json(&mut v);
        let mut s = v.to_string();
        s.push('\n');
        s
    } else {
        super::text::analysis_report(&analysis) + &more.text()
    })
}

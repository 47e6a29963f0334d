//! `tankwright evaluate`: one coil from flags, every figure out.

use super::args::{ArgError, Args};
use crate::model::{
    Coating, Conditions, DiameterSpec, Gauge, InductanceModel, SpacingSpec, Tank, Winding, WireSpec,
};
use crate::recipe::{Recipe, StraySettings, Target};
use crate::tuning::verdict::Aim;
use crate::units::{from_mm, from_pf};

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
    /// What the verdict judges against: the target (`--target-mhz`, or the recipe's
    /// channel) and the tolerance.
    pub aim: Aim,
    /// A recipe's bench calibration, as `recipe::figures` makes it (`None` from flags, for a
    /// recipe without readings that fit, and with `--as-written`).
    pub bench: Option<BenchCalibration>,
}

/// A recipe's bench calibration as [`crate::recipe::figures`] makes it, so `evaluate
/// --recipe` states the figures `report`, `solve` and the window state.
#[derive(Clone, Debug, PartialEq)]
pub struct BenchCalibration {
    /// The calibrated tank (the fitted stray).
    pub tank: Tank,
    /// The conditions that put the model on the calibrated field-led resonance.
    pub conditions: Conditions,
    /// The field-led model with the calibration's scale (`None` where the classical model
    /// leads).
    pub led: Option<crate::tuning::landing::FieldLed>,
    /// Readings the calibration rests on.
    pub readings: usize,
}

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
    InductanceModel::from_cli_name(name).ok_or_else(|| {
        ArgError(format!(
            "--model '{}' is not one of {}",
            super::clean(name),
            InductanceModel::cli_names(", ")
        ))
    })
}

impl EvaluateRequest {
    /// The recipe these flags describe: no readings, the usual stray settings, aimed at the
    /// target when one was given (without one the channel is 0 Hz, which nothing but the
    /// aim reads: [`crate::recipe::modelled`] does not).
    pub fn recipe(&self) -> Recipe {
        Recipe {
            name: "From the command line".to_owned(),
            notes: String::new(),
            winding: self.winding,
            tank: self.tank,
            conditions: self.conditions,
            target: Target {
                plan: self.aim.plan.clone(),
                channel: self.aim.target.unwrap_or(0.0),
                tolerance: Some(self.aim.tolerance),
            },
            bench_log: Vec::new(),
            stray_estimate: StraySettings::default(),
            coil_measurement: None,
            stage: None,
            audio: Default::default(),
        }
    }

    /// Read the request from parsed flags.
    pub fn from_args(args: &Args) -> Result<Self, ArgError> {
        let diameter = one_of(
            args,
            "mean-diameter-mm",
            "former-diameter-mm",
            "the diameter",
            |d| DiameterSpec::Mean(from_mm(d)),
            |d| DiameterSpec::Former(from_mm(d)),
        )?;
        let turns = args
            .number("turns")?
            .ok_or_else(|| ArgError("--turns is missing".to_owned()))?;
        let spacing = one_of(
            args,
            "length-mm",
            "gap-mm",
            "the spacing",
            |l| SpacingSpec::Length(from_mm(l)),
            |g| SpacingSpec::Gap(from_mm(g)),
        )?;
        let gauge = match (
            args.number("wire-mm")?,
            args.integer("awg")?,
            args.integer("swg")?,
        ) {
            (Some(d), None, None) => Gauge::Metric(from_mm(d)),
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
        let lead = from_mm(args.number("lead-mm")?.unwrap_or(0.0));
        let trimmer = trimmer_from_args(args)?;
        let aim = aim_from_args(args)?;
        let capacitance = from_pf(args.number("capacitance-pf")?.unwrap_or(0.0));
        let stray = from_pf(args.number("stray-pf")?.unwrap_or(0.0));
        let mut conditions = Conditions::default();
        if let Some(t) = args.number("temperature-c")? {
            conditions.temperature_c = t;
        }
        if let Some(m) = args.text("model") {
            conditions.model = model_named(m)?;
        }
        args.reject_unknown()?;
        args.reject_positional()?;
        Ok(Self {
            winding: Winding {
                diameter,
                wire: WireSpec { gauge, coating },
                turns,
                spacing,
                lead_length: lead,
            },
            tank: Tank {
                trimmer_min: trimmer.0,
                trimmer_max: trimmer.1,
                trimmer_setting: trimmer.2,
                ..Tank::fixed_only(capacitance, stray)
            },
            conditions,
            json: args.switch("json"),
            aim,
            bench: None,
        })
    }
}

/// `--trimmer-min-pf`, `--trimmer-max-pf`, `--trimmer-pct`: (min F, max F, setting 0–1).
/// Without them, no trimmer; the range needs both ends, and the setting a range.
fn trimmer_from_args(args: &Args) -> Result<(f64, f64, f64), ArgError> {
    let min = args.number("trimmer-min-pf")?;
    let max = args.number("trimmer-max-pf")?;
    let pct = args.number("trimmer-pct")?;
    let (min, max) = match (min, max) {
        (None, None) => {
            if pct.is_some() {
                return Err(ArgError(
                    "--trimmer-pct needs the trimmer's range: give --trimmer-min-pf and \
                     --trimmer-max-pf"
                        .to_owned(),
                ));
            }
            return Ok((0.0, 0.0, 0.0));
        }
        (Some(a), Some(b)) => (a, b),
        _ => {
            return Err(ArgError(
                "give both --trimmer-min-pf and --trimmer-max-pf".to_owned(),
            ));
        }
    };
    if min < 0.0 || max < min {
        return Err(ArgError(format!(
            "the trimmer range {min}–{max} pF is not a range: need 0 <= --trimmer-min-pf <= \
             --trimmer-max-pf"
        )));
    }
    let pct = pct.unwrap_or(50.0);
    if !(0.0..=100.0).contains(&pct) {
        return Err(ArgError(format!(
            "--trimmer-pct {pct} is outside 0–100 (0 = minimum capacitance)"
        )));
    }
    Ok((from_pf(min), from_pf(max), pct / 100.0))
}

/// `--target-mhz` (any frequency in 1–3000 MHz) and `--tolerance-khz` (default: the
/// practice of the service whose band holds the target).
fn aim_from_args(args: &Args) -> Result<Aim, ArgError> {
    let target = args.text("target-mhz");
    let tolerance = args.number("tolerance-khz")?;
    let aim = match target {
        Some(t) => {
            let hz = crate::tuning::channel_list::parse_target_mhz(t)
                .map_err(|e| ArgError(format!("--target-mhz: {e}")))?;
            Aim::typed(hz)
        }
        None => {
            if tolerance.is_some() {
                return Err(ArgError("--tolerance-khz needs --target-mhz".to_owned()));
            }
            Aim::new(crate::tuning::BandPlan::Custom(Vec::new()), None)
        }
    };
    match tolerance {
        Some(k) if k < 0.0 => Err(ArgError(format!(
            "--tolerance-khz {k} must be zero or more"
        ))),
        Some(k) => Ok(aim.with_tolerance(k * 1e3)),
        None => Ok(aim),
    }
}

/// Run `evaluate` on the words after the subcommand; Ok(stdout) or Err(one-line message).
///
/// One pipeline with the window, `report`, `solve` and the sheet: the recipe (from the file,
/// or built from the flags) is modelled by [`crate::recipe::modelled`] (the field solution
/// leading, the bench readings calibrating) and aimed by [`crate::recipe::aimed`].
pub fn run_evaluate(words: Vec<String>) -> Result<String, String> {
    let args = Args::parse(words, &["json", "as-written"]).map_err(|e| e.to_string())?;
    // The stray, junction and drift flags are read first, so the coil's reader sees them used.
    let extras = super::stray_flags::Extras::from_args(&args).map_err(|e| e.to_string())?;
    let json = args.switch("json");
    let (recipe, aim) = match args.text("recipe") {
        Some(file) => super::recipe_args::recipe_from_file(&args, file)?,
        None => {
            let req = EvaluateRequest::from_args(&args).map_err(|e| e.to_string())?;
            (req.recipe(), req.aim)
        }
    };
    // With a junction given, it is across the tank in every figure (as the window's switch
    // puts it), the bench calibration included.
    let with_junction = Recipe {
        tank: extras.tank_with_junction(&recipe.tank),
        ..recipe.clone()
    };
    let m = crate::recipe::modelled(&with_junction).map_err(|e| format!("invalid input: {e}"))?;
    let (_, verdict) = crate::recipe::aimed(&m, &aim);
    // The stray and drift figures take the tank as written (they add the junction
    // themselves) under the conditions that drive the figures.
    let req = EvaluateRequest {
        winding: recipe.winding,
        tank: recipe.tank,
        conditions: m.conditions,
        json,
        aim,
        bench: None,
    };
    let more = super::stray_flags::ExtraFigures::compute(&extras, &req, &m.analysis)?;
    let calibrated = m.calibrated();
    Ok(if json {
        let mut object = super::json::analysis_json(&m.analysis);
        super::verdict::add_verdict_json(&mut object, &verdict, &m.analysis);
        super::json::add_field_solution(&mut object, &m.classical, &m.field);
        if let (true, serde_json::Value::Object(map)) = (calibrated, &mut object) {
            map.insert(
                "calibrated_on_readings".to_owned(),
                serde_json::Value::from(m.readings_used()),
            );
        }
        more.add_json(&mut object);
        let mut s = object.to_string();
        s.push('\n');
        s
    } else {
        let mut s = super::verdict::verdict_lines(&verdict).join("\n");
        s.push_str("\n\n");
        s.push_str(&super::text::analysis_report(&m.analysis));
        s.push_str(&super::text::field_report(
            &m.classical,
            &m.field,
            calibrated,
        ));
        s.push_str(&more.text());
        s
    })
}

//! The `evaluate` flags for the stray estimate, the modulating junction and the drift budget,
//! and the figures they add to the output. Every figure comes from `tuning`; this file only
//! reads flags and converts units.

use super::args::{ArgError, Args};
use super::evaluate::EvaluateRequest;
use crate::model::{Analysis, Coil, Tank};
use crate::physics::dielectric_class::{self, TemperatureClass};
use crate::physics::junction::JunctionLaw;
use crate::tuning::construction::Construction;
use crate::tuning::drift::{DriftBudget, DriftInputs, DriftSource, DriftTank, drift_budget};
use crate::tuning::modulation::{
    Modulation, ModulationInputs, ModulationVerdict, Modulator, Service, judge, modulation,
};
use crate::tuning::spice_model::parse_model;
use crate::tuning::stray::{
    PartKind, Span, StrayEstimate, StrayInputs, estimate_stray, frequency_window,
};
use serde_json::{Value, json};

const PF: f64 = 1e-12;
const KHZ: f64 = 1e3;

/// The extra flags, read before the coil's own (so that the coil's reader does not refuse
/// them as unknown).
#[derive(Clone, Debug, PartialEq)]
pub(crate) struct Extras {
    construction: Option<Construction>,
    fixed_tolerance: f64,
    junction: Option<JunctionFlags>,
    drift: DriftFlags,
}

#[derive(Clone, Debug, PartialEq)]
struct JunctionFlags {
    modulator: Modulator,
    bias_v: f64,
    audio_peak_v: f64,
    audio_max_hz: f64,
    ignored: Vec<String>,
}

#[derive(Clone, Copy, Debug, PartialEq)]
struct DriftFlags {
    supply_v: f64,
    supply_change_v: f64,
    temperature_change_k: f64,
    class: TemperatureClass,
    hand: f64,
    load: f64,
    channel_tolerance: f64,
}

fn positive(args: &Args, name: &str) -> Result<Option<f64>, ArgError> {
    match args.number(name)? {
        Some(v) if v <= 0.0 => Err(ArgError(format!("--{name} must be above zero, got {v}"))),
        other => Ok(other),
    }
}

impl Extras {
    /// Read the extra flags (all optional).
    pub(crate) fn from_args(args: &Args) -> Result<Self, ArgError> {
        let construction = match args.text("construction") {
            None => None,
            Some(k) => Some(Construction::by_key(k).ok_or_else(|| {
                let keys: Vec<&str> = Construction::ALL.iter().map(|c| c.key()).collect();
                ArgError(format!(
                    "--construction '{k}' is not one of {}",
                    keys.join(", ")
                ))
            })?),
        };
        let fixed_tolerance = match args.number("capacitance-tolerance-pct")? {
            None => 0.05,
            Some(p) if (0.0..100.0).contains(&p) => p / 100.0,
            Some(p) => {
                return Err(ArgError(format!(
                    "--capacitance-tolerance-pct {p} is outside 0–100"
                )));
            }
        };
        let junction = Self::junction(args)?;
        let class_name = args.text("capacitor-class").unwrap_or("C0G");
        let class = dielectric_class::by_name(class_name).ok_or_else(|| {
            let names: Vec<&str> = dielectric_class::CLASSES.iter().map(|c| c.code).collect();
            ArgError(format!(
                "--capacitor-class '{class_name}' is not one of {} (or their N/P names)",
                names.join(", ")
            ))
        })?;
        let supply_v = positive(args, "supply-v")?.unwrap_or(9.0);
        let drift = DriftFlags {
            supply_v,
            supply_change_v: args.number("supply-change-v")?.unwrap_or(-2.0),
            temperature_change_k: args.number("temperature-change-k")?.unwrap_or(20.0),
            class,
            hand: args.number("hand-pf")?.unwrap_or(1.0) * PF,
            load: args.number("load-change-pf")?.unwrap_or(0.5) * PF,
            channel_tolerance: positive(args, "channel-tolerance-khz")?.unwrap_or(50.0) * KHZ,
        };
        if supply_v + drift.supply_change_v <= 0.0 {
            return Err(ArgError(format!(
                "--supply-change-v {} takes the {supply_v} V supply to zero or below",
                drift.supply_change_v
            )));
        }
        Ok(Self {
            construction,
            fixed_tolerance,
            junction,
            drift,
        })
    }

    fn junction(args: &Args) -> Result<Option<JunctionFlags>, ArgError> {
        let three = (
            args.number("junction-cj0-pf")?,
            args.number("junction-vj")?,
            args.number("junction-m")?,
        );
        let model = args.text("junction-model");
        let bias = args.number("bias-v")?;
        let audio = args.number("audio-peak-v")?;
        let coupling = positive(args, "coupling-pf")?;
        let audio_max = positive(args, "audio-max-khz")?;
        let (law, ignored) = match (three, model) {
            ((None, None, None), None) => {
                if bias.is_some() || audio.is_some() || coupling.is_some() {
                    return Err(ArgError(
                        "--bias-v, --audio-peak-v and --coupling-pf need a junction: give \
                         --junction-cj0-pf, --junction-vj and --junction-m, or --junction-model"
                            .to_owned(),
                    ));
                }
                return Ok(None);
            }
            ((Some(c), Some(vj), Some(m)), None) => {
                if !(c > 0.0 && vj > 0.0 && m > 0.0 && m < 5.0) {
                    return Err(ArgError(format!(
                        "junction: Cj0 {c} pF and φ {vj} V must be above zero, m {m} between 0 and 5"
                    )));
                }
                (JunctionLaw::new(c * PF, vj, m), Vec::new())
            }
            ((None, None, None), Some(text)) => {
                let parsed =
                    parse_model(text).map_err(|e| ArgError(format!("--junction-model: {e}")))?;
                (parsed.law, parsed.ignored)
            }
            ((_, _, _), Some(_)) => {
                return Err(ArgError(
                    "give either --junction-model or the three --junction-… numbers, not both"
                        .to_owned(),
                ));
            }
            _ => {
                return Err(ArgError(
                    "the junction needs all three of --junction-cj0-pf, --junction-vj, --junction-m"
                        .to_owned(),
                ));
            }
        };
        let bias_v = bias.ok_or_else(|| {
            ArgError("--bias-v (the junction's DC reverse bias) is missing".to_owned())
        })?;
        if bias_v < 0.0 {
            return Err(ArgError(format!(
                "--bias-v {bias_v}: the junction must be reverse-biased (0 V or more)"
            )));
        }
        Ok(Some(JunctionFlags {
            modulator: Modulator {
                law,
                coupling: coupling.map(|c| c * PF),
            },
            bias_v,
            audio_peak_v: audio.unwrap_or(0.0).abs(),
            audio_max_hz: audio_max.unwrap_or(15.0) * KHZ,
            ignored,
        }))
    }

    /// Capacitance the junction puts across the tank at its bias, farads (0 without one).
    pub(crate) fn junction_across_tank(&self) -> f64 {
        self.junction
            .as_ref()
            .map_or(0.0, |j| j.modulator.across_tank(j.bias_v))
    }
}

/// The figures the extras add, computed once for both outputs.
pub(crate) struct ExtraFigures {
    estimate: StrayEstimate,
    window: Span,
    modulation: Option<(Modulation, ModulationVerdict, Vec<String>)>,
    drift: DriftBudget,
}

/// The stray estimate's inputs from the tank as given (and the construction, if any).
fn stray_inputs(extras: &Extras, coil: &Coil, tank: &Tank, analysis: &Analysis) -> StrayInputs {
    crate::tuning::stray::inputs_for(
        coil,
        tank,
        analysis.self_capacitance,
        extras.fixed_tolerance,
        extras.construction,
    )
}

impl ExtraFigures {
    /// Compute everything for `req` (whose tank is as given, without the junction) and the
    /// analysis of the tank with the junction.
    pub(crate) fn compute(
        extras: &Extras,
        req: &EvaluateRequest,
        analysis: &Analysis,
    ) -> Result<Self, String> {
        let coil = Coil::from_winding(&req.winding).map_err(|e| format!("invalid input: {e}"))?;
        let mut inputs = stray_inputs(extras, &coil, &req.tank, analysis);
        if let Some(j) = &extras.junction {
            inputs.junction = Some(crate::tuning::stray::DeviceJunction {
                law: j.modulator.law,
                reverse_bias: j.bias_v,
                spread: 0.0,
                coupling: j.modulator.coupling,
            });
        }
        inputs.check().map_err(|e| format!("invalid input: {e}"))?;
        let estimate = estimate_stray(&inputs);
        let window = frequency_window(&coil, &req.conditions, &estimate);
        let other = req.tank.external_capacitance();
        let modulation = extras.junction.as_ref().map(|j| {
            let m = modulation(
                &coil,
                other,
                &req.conditions,
                &ModulationInputs {
                    modulator: j.modulator,
                    bias_v: j.bias_v,
                    audio_peak_v: j.audio_peak_v,
                    audio_max_hz: j.audio_max_hz,
                },
            );
            let service = Service::for_carrier(m.carrier);
            (m, judge(&m, service), j.ignored.clone())
        });
        let d = &extras.drift;
        let drift = drift_budget(
            &coil,
            &DriftTank {
                fixed: req.tank.fixed,
                other: other - req.tank.fixed,
                junction: extras.junction.as_ref().map(|j| (j.modulator, j.bias_v)),
            },
            &req.conditions,
            &DriftInputs {
                supply_v: d.supply_v,
                supply_change_v: d.supply_change_v,
                temperature_change_k: d.temperature_change_k,
                fixed_class: d.class,
                hand: d.hand,
                load: d.load,
                channel_tolerance: d.channel_tolerance,
            },
        );
        Ok(Self {
            estimate,
            window,
            modulation,
            drift,
        })
    }

    /// Add `stray_breakdown_pf`, `resonance_range_mhz`, `modulation` and `drift` to `v`.
    pub(crate) fn add_json(&self, v: &mut Value) {
        let Some(obj) = v.as_object_mut() else {
            return;
        };
        // Every part's key, zero where the part is not in the circuit, so the keys are the
        // same for every coil.
        let mut parts = serde_json::Map::new();
        for kind in PartKind::ALL {
            let value = self
                .estimate
                .part(kind)
                .map_or(Span::exact(0.0), |p| p.value);
            parts.insert(
                kind.key().to_owned(),
                json!({
                    "low": value.low / PF,
                    "typical": value.typical / PF,
                    "high": value.high / PF,
                }),
            );
        }
        let total = self.estimate.total();
        parts.insert(
            "total".to_owned(),
            json!({"low": total.low / PF, "typical": total.typical / PF, "high": total.high / PF}),
        );
        obj.insert("stray_breakdown_pf".to_owned(), Value::Object(parts));
        obj.insert(
            "resonance_range_mhz".to_owned(),
            json!({"low": self.window.low * 1e-6, "high": self.window.high * 1e-6}),
        );
        obj.insert(
            "modulation".to_owned(),
            match &self.modulation {
                None => Value::Null,
                Some((m, verdict, ignored)) => json!({
                    "junction_pf": m.junction_at_bias / PF,
                    "junction_at_peaks_pf": [m.junction_at_high_bias / PF, m.junction_at_low_bias / PF],
                    "carrier_mhz": m.carrier * 1e-6,
                    "deviation_up_khz": m.deviation_up / KHZ,
                    "deviation_down_khz": m.deviation_down / KHZ,
                    "sensitivity_khz_per_v": m.sensitivity / KHZ,
                    "distortion_pct": m.distortion * 100.0,
                    "carson_bandwidth_khz": m.carson_bandwidth / KHZ,
                    "deviation_within_limit": verdict.deviation_ok,
                    "advice": verdict.advice,
                    "model_parameters_ignored": ignored,
                }),
            },
        );
        let drift: Vec<Value> = self
            .drift
            .lines
            .iter()
            .map(|l| {
                json!({
                    "source": l.source.key(),
                    "change": change_text(l.source, l.change),
                    "shift_khz": l.shift / KHZ,
                })
            })
            .collect();
        obj.insert("drift".to_owned(), Value::Array(drift));
        obj.insert(
            "drift_total_khz".to_owned(),
            json!({
                "sum": self.drift.total / KHZ,
                "worst_case": self.drift.worst_case / KHZ,
                "within_tolerance": self.drift.within_tolerance,
                "dominant": self.drift.dominant.map(|d| d.key()),
            }),
        );
    }

    /// The same figures as readable lines.
    pub(crate) fn text(&self) -> String {
        let mut s = String::from("\nTank capacitance by part (low / typical / high, pF)\n");
        for p in &self.estimate.parts {
            s.push_str(&format!(
                "  {:<34} {:>7.2} {:>7.2} {:>7.2}\n",
                p.kind.label(),
                p.value.low / PF,
                p.value.typical / PF,
                p.value.high / PF
            ));
        }
        let t = self.estimate.total();
        s.push_str(&format!(
            "  {:<34} {:>7.2} {:>7.2} {:>7.2}\n  resonance range    {:.3}–{:.3} MHz\n",
            "total",
            t.low / PF,
            t.typical / PF,
            t.high / PF,
            self.window.low * 1e-6,
            self.window.high * 1e-6
        ));
        if let Some((m, verdict, ignored)) = &self.modulation {
            s.push_str(&format!(
                "\nModulation\n  junction at bias   {:>10.3} pF ({:.3} / {:.3} pF at the audio peaks)\n  \
                 deviation          +{:.2} / -{:.2} kHz, {:.2} kHz/V\n  \
                 distortion         {:>10.2} % second harmonic\n  \
                 Carson bandwidth   {:>10.1} kHz\n",
                m.junction_at_bias / PF,
                m.junction_at_high_bias / PF,
                m.junction_at_low_bias / PF,
                m.deviation_up / KHZ,
                m.deviation_down / KHZ,
                m.sensitivity / KHZ,
                m.distortion * 100.0,
                m.carson_bandwidth / KHZ
            ));
            for a in &verdict.advice {
                s.push_str(&format!("  {a}\n"));
            }
            if !ignored.is_empty() {
                s.push_str(&format!(
                    "  model parameters ignored: {}\n",
                    ignored.join(" ")
                ));
            }
        }
        s.push_str("\nDrift\n");
        for l in &self.drift.lines {
            s.push_str(&format!(
                "  {:<34} {:>12} {:>+9.2} kHz\n",
                l.source.label(),
                change_text(l.source, l.change),
                l.shift / KHZ
            ));
        }
        s.push_str(&format!(
            "  total {:+.2} kHz, worst case {:.2} kHz: {}\n",
            self.drift.total / KHZ,
            self.drift.worst_case / KHZ,
            if self.drift.within_tolerance {
                "within the channel tolerance"
            } else {
                "outside the channel tolerance"
            }
        ));
        for r in &self.drift.remedies {
            s.push_str(&format!("  {r}\n"));
        }
        s
    }
}

/// A drift line's change in display units.
fn change_text(source: DriftSource, change: f64) -> String {
    match source.unit() {
        "V" => format!("{change:+.2} V"),
        "K" => format!("{change:+.1} K"),
        _ => format!("{:+.2} pF", change / PF),
    }
}

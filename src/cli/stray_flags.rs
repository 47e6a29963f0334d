//! The `evaluate` flags for the stray estimate, the modulating junction and the drift budget,
//! and the figures they add to the output. Every figure comes from `tuning`; this file only
//! reads flags and converts units.

use super::args::{ArgError, Args, short};
use super::evaluate::EvaluateRequest;
use crate::model::{Analysis, Coil, Tank};
use crate::physics::dielectric_class::{self, TemperatureClass};
use crate::physics::junction::JunctionLaw;
use crate::tuning::construction::Construction;
use crate::tuning::drift::{
    DriftBudget, DriftInputs, DriftSource, DriftTank, UsualChanges, drift_budget,
};
use crate::tuning::modulation::{
    Modulation, ModulationInputs, ModulationVerdict, Modulator, Service, judge, modulation,
};
use crate::tuning::spice_model::{CONTACT_POTENTIAL_V, parse_model};
use crate::tuning::stray::{
    PartKind, Span, StrayEstimate, StrayInputs, estimate_stray, frequency_window,
};
use crate::units::{from_khz, from_pf, to_khz, to_mhz, to_pf};
use serde_json::{Value, json};

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
    rf_peak_v: f64,
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
    /// `--channel-tolerance-khz`, hertz; `None`: the channel's own.
    channel_tolerance: Option<f64>,
}

fn positive(args: &Args, name: &str) -> Result<Option<f64>, ArgError> {
    match args.number(name)? {
        Some(v) if v <= 0.0 => Err(ArgError(format!(
            "--{name} must be above zero, got {}",
            short(v)
        ))),
        other => Ok(other),
    }
}

/// A flag's value, refused outside `low..=high` (display units) with the reason and the
/// accepted range, so that no figure is computed from an input the physics does not allow.
fn within(
    args: &Args,
    name: &str,
    (low, high): (f64, f64),
    unit: &str,
    why: &str,
) -> Result<Option<f64>, ArgError> {
    match args.number(name)? {
        Some(v) if !(low..=high).contains(&v) => Err(ArgError(format!(
            "--{name} {} is outside {}–{} {unit}: {why}",
            short(v),
            short(low),
            short(high)
        ))),
        other => Ok(other),
    }
}

/// The accepted hand capacitance, pF: a hand adds capacitance (never removes it); a few pF is
/// usual near an unshielded coil (common practice), 100 pF is far beyond any hand.
pub(crate) const HAND_PF: (f64, f64) = (0.0, 100.0);
/// The accepted load change, pF, either way (common practice: a loosely coupled load moves
/// the tank by well under a picofarad; 100 pF is far beyond any coupling).
pub(crate) const LOAD_CHANGE_PF: (f64, f64) = (-100.0, 100.0);
/// The accepted temperature change, K: the class-1 ceramic coefficients are specified over
/// −55 to +125 °C (EIA-198-1), a span of 180 K; beyond it no coefficient here holds.
pub(crate) const TEMPERATURE_CHANGE_K: (f64, f64) = (-180.0, 180.0);
/// The accepted highest audio frequency, kHz: Carson's rule for a modulating tone; 100 kHz
/// covers a broadcast stereo multiplex with its data subcarrier (57 kHz, ITU-R BS.450).
pub(crate) const AUDIO_MAX_KHZ: (f64, f64) = (0.001, 100.0);

/// `--construction NAME` (`None` when not given), refused with the names it takes: the one
/// reader for `evaluate`, `design` and `new`.
pub(crate) fn construction_flag(args: &Args) -> Result<Option<Construction>, ArgError> {
    args.text("construction")
        .map(|k| {
            Construction::by_key(k).ok_or_else(|| {
                let keys: Vec<&str> = Construction::ALL.iter().map(|c| c.key()).collect();
                ArgError(format!(
                    "--construction '{}' is not one of {}",
                    super::clean(k),
                    keys.join(", ")
                ))
            })
        })
        .transpose()
}

impl Extras {
    /// Read the extra flags (all optional).
    pub(crate) fn from_args(args: &Args) -> Result<Self, ArgError> {
        let construction = construction_flag(args)?;
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
        let class_name = args.text("capacitor-class").unwrap_or(UsualChanges::CLASS);
        let class = dielectric_class::by_name(class_name).ok_or_else(|| {
            let names: Vec<&str> = dielectric_class::CLASSES.iter().map(|c| c.code).collect();
            ArgError(format!(
                "--capacitor-class '{class_name}' is not one of {} (or their N/P names)",
                names.join(", ")
            ))
        })?;
        let supply_v = positive(args, "supply-v")?.unwrap_or(UsualChanges::SUPPLY_V);
        let drift = DriftFlags {
            supply_v,
            supply_change_v: args
                .number("supply-change-v")?
                .unwrap_or(UsualChanges::SUPPLY_CHANGE_V),
            temperature_change_k: within(
                args,
                "temperature-change-k",
                TEMPERATURE_CHANGE_K,
                "K",
                "the capacitors' temperature classes are specified over -55 to +125 °C",
            )?
            .unwrap_or(UsualChanges::TEMPERATURE_CHANGE_K),
            class,
            hand: within(
                args,
                "hand-pf",
                HAND_PF,
                "pF",
                "a hand near the coil adds capacitance",
            )?
            .map_or(UsualChanges::HAND, from_pf),
            load: within(
                args,
                "load-change-pf",
                LOAD_CHANGE_PF,
                "pF",
                "the change the load makes to the tank",
            )?
            .map_or(UsualChanges::LOAD, from_pf),
            channel_tolerance: positive(args, "channel-tolerance-khz")?.map(from_khz),
        };
        if supply_v + drift.supply_change_v <= 0.0 {
            return Err(ArgError(format!(
                "--supply-change-v {} takes the {} V supply to zero or below",
                short(drift.supply_change_v),
                short(supply_v)
            )));
        }
        if supply_v > 1e3 || drift.supply_change_v.abs() > 1e3 {
            return Err(ArgError(
                "--supply-v and --supply-change-v are accepted up to 1000 V (a small \
                 oscillator's supply)"
                    .to_owned(),
            ));
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
        let rf = args.number("rf-peak-v")?;
        let coupling = positive(args, "coupling-pf")?;
        let audio_max = within(
            args,
            "audio-max-khz",
            AUDIO_MAX_KHZ,
            "kHz",
            "the highest audio frequency of the modulation",
        )?;
        let (law, ignored) = match (three, model) {
            ((None, None, None), None) => {
                if bias.is_some() || audio.is_some() || rf.is_some() || coupling.is_some() {
                    return Err(ArgError(
                        "--bias-v, --audio-peak-v, --rf-peak-v and --coupling-pf need a junction: give \
                         --junction-cj0-pf, --junction-vj and --junction-m, or --junction-model"
                            .to_owned(),
                    ));
                }
                return Ok(None);
            }
            ((Some(c), Some(vj), Some(m)), None) => {
                if !(c > 0.0 && c <= 1e6 && m > 0.0 && m < 5.0) {
                    return Err(ArgError(format!(
                        "junction: Cj0 {} pF must be above zero (at most 1e6 pF), m {} between 0 and 5",
                        short(c),
                        short(m)
                    )));
                }
                let (lo, hi) = CONTACT_POTENTIAL_V;
                if !(lo..=hi).contains(&vj) {
                    return Err(ArgError(format!(
                        "--junction-vj {} is outside {lo}–{hi} V: a junction's contact \
                         potential lies below its band gap",
                        short(vj)
                    )));
                }
                (JunctionLaw::new(from_pf(c), vj, m), Vec::new())
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
        if !(0.0..=1e3).contains(&bias_v) {
            return Err(ArgError(format!(
                "--bias-v {} is outside 0–1000 V: the junction must be reverse-biased (0 V or more)",
                short(bias_v)
            )));
        }
        if let Some(a) = audio
            && a.abs() > 1e3
        {
            return Err(ArgError(format!(
                "--audio-peak-v {} is outside -1000–1000 V",
                short(a)
            )));
        }
        let rf_peak_v = rf.unwrap_or(crate::tuning::modulation::TANK_RF_PEAK_V);
        if !(0.0..=1e3).contains(&rf_peak_v) {
            return Err(ArgError(format!(
                "--rf-peak-v {} is outside 0–1000 V (the RF peak across the tank)",
                short(rf_peak_v)
            )));
        }
        Ok(Some(JunctionFlags {
            modulator: Modulator {
                law,
                coupling: coupling.map(from_pf),
            },
            bias_v,
            audio_peak_v: audio.unwrap_or(0.0).abs(),
            audio_max_hz: from_khz(audio_max.unwrap_or(15.0)),
            rf_peak_v,
            ignored,
        }))
    }

    /// Capacitance the junction puts across the tank at its bias, farads (0 without one).
    pub(crate) fn junction_across_tank(&self) -> f64 {
        self.junction
            .as_ref()
            .map_or(0.0, |j| j.modulator.across_tank(j.bias_v))
    }

    /// `tank` with the junction across it at its bias
    /// ([`crate::tuning::modulation::tank_with_junction`], as the window does), or as given
    /// without one.
    pub(crate) fn tank_with_junction(&self, tank: &Tank) -> Tank {
        self.junction.as_ref().map_or(*tank, |j| {
            crate::tuning::modulation::tank_with_junction(tank, &j.modulator, j.bias_v)
        })
    }
}

/// The figures the extras add, computed once for both outputs.
pub(crate) struct ExtraFigures {
    estimate: StrayEstimate,
    window: Span,
    modulation: Option<(Modulation, ModulationVerdict, Vec<String>)>,
    drift: DriftBudget,
}

/// The stray estimate's inputs from the tank as given (and the construction, if any). With a
/// construction the layout builds the stray itself, so the stray entered (`--stray-pf`, the
/// builder's own figure for the same wiring) is left out of the estimate rather than added to
/// it a second time, as the window's estimate does (`recipe::expectation`).
fn stray_inputs(extras: &Extras, coil: &Coil, tank: &Tank, analysis: &Analysis) -> StrayInputs {
    let tank = match extras.construction {
        Some(_) => Tank {
            stray: 0.0,
            ..*tank
        },
        None => *tank,
    };
    crate::tuning::stray::inputs_for(
        coil,
        &tank,
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
                    rf_peak_v: j.rf_peak_v,
                },
            );
            let service = Service::for_carrier(m.carrier);
            (m, judge(&m, service), j.ignored.clone())
        });
        let d = &extras.drift;
        let tank_total = other + analysis.self_capacitance + extras.junction_across_tank();
        if tank_total + d.load <= 0.0 {
            return Err(format!(
                "--load-change-pf {} takes the tank's {:.2} pF to zero or below",
                short(to_pf(d.load)),
                to_pf(tank_total)
            ));
        }
        let warm = req.conditions.temperature_c + d.temperature_change_k;
        if warm <= -273.15 {
            return Err(format!(
                "--temperature-change-k {} takes the wire from {} °C below absolute zero",
                short(d.temperature_change_k),
                short(req.conditions.temperature_c)
            ));
        }
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
                // The channel's own tolerance unless one is given, as the window judges it: the
                // target's (the recipe's, or its service's practice), else the practice of the
                // service whose band holds the carrier.
                channel_tolerance: d.channel_tolerance.unwrap_or(match req.aim.target {
                    Some(_) => req.aim.tolerance,
                    None => crate::tuning::verdict::Aim::typed(analysis.resonance).tolerance,
                }),
            },
        );
        let figures = Self {
            estimate,
            window,
            modulation,
            drift,
        };
        figures.check_finite()?;
        Ok(figures)
    }

    /// Refuse figures that came out NaN or infinite (an input the checks above let through):
    /// the message names the figure, and no NaN or inf reaches the screen or the JSON.
    fn check_finite(&self) -> Result<(), String> {
        let mut named: Vec<(&str, f64)> = vec![
            ("resonance range low", self.window.low),
            ("resonance range high", self.window.high),
            ("drift total", self.drift.total),
            ("drift worst case", self.drift.worst_case),
        ];
        for l in &self.drift.lines {
            named.push((l.source.label(), l.shift));
        }
        for p in &self.estimate.parts {
            named.push((p.kind.label(), p.value.typical));
        }
        if let Some((m, _, _)) = &self.modulation {
            named.extend([
                ("junction at bias", m.junction_at_bias),
                ("carrier", m.carrier),
                ("deviation up", m.deviation_up),
                ("deviation down", m.deviation_down),
                ("sensitivity", m.sensitivity),
                ("distortion", m.distortion),
                ("Carson bandwidth", m.carson_bandwidth),
            ]);
        }
        match named.iter().find(|(_, v)| !v.is_finite()) {
            Some((name, _)) => Err(format!(
                "the {name} cannot be computed for these inputs (it comes out undefined): \
                 check the drift, junction and audio flags"
            )),
            None => Ok(()),
        }
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
                    "low": to_pf(value.low),
                    "typical": to_pf(value.typical),
                    "high": to_pf(value.high),
                }),
            );
        }
        let total = self.estimate.total();
        parts.insert(
            "total".to_owned(),
            json!({"low": to_pf(total.low), "typical": to_pf(total.typical), "high": to_pf(total.high)}),
        );
        obj.insert("stray_breakdown_pf".to_owned(), Value::Object(parts));
        obj.insert(
            "resonance_range_mhz".to_owned(),
            json!({"low": to_mhz(self.window.low), "high": to_mhz(self.window.high)}),
        );
        obj.insert(
            "modulation".to_owned(),
            match &self.modulation {
                None => Value::Null,
                Some((m, verdict, ignored)) => json!({
                    "junction_pf": to_pf(m.junction_at_bias),
                    "junction_at_peaks_pf": [to_pf(m.junction_at_high_bias), to_pf(m.junction_at_low_bias)],
                    "carrier_mhz": to_mhz(m.carrier),
                    "deviation_up_khz": to_khz(m.deviation_up),
                    "deviation_down_khz": to_khz(m.deviation_down),
                    "sensitivity_khz_per_v": to_khz(m.sensitivity),
                    "distortion_pct": m.distortion * 100.0,
                    "carson_bandwidth_khz": to_khz(m.carson_bandwidth),
                    "rf_at_junction_v": m.rf_at_junction,
                    "least_reverse_v": m.least_reverse_v,
                    "forward_on_peaks": m.forward_on_peaks,
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
                    "shift_khz": to_khz(l.shift),
                })
            })
            .collect();
        obj.insert("drift".to_owned(), Value::Array(drift));
        obj.insert(
            "drift_total_khz".to_owned(),
            json!({
                "sum": to_khz(self.drift.total),
                "worst_case": to_khz(self.drift.worst_case),
                "within_tolerance": self.drift.within_tolerance,
                "channel_tolerance": to_khz(self.drift.channel_tolerance),
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
                to_pf(p.value.low),
                to_pf(p.value.typical),
                to_pf(p.value.high)
            ));
        }
        let t = self.estimate.total();
        s.push_str(&format!(
            "  {:<34} {:>7.2} {:>7.2} {:>7.2}\n  resonance range    {:.3}–{:.3} MHz\n",
            "total",
            to_pf(t.low),
            to_pf(t.typical),
            to_pf(t.high),
            to_mhz(self.window.low),
            to_mhz(self.window.high)
        ));
        if let Some((m, verdict, ignored)) = &self.modulation {
            s.push_str(&format!(
                "\nModulation\n  junction at bias   {:>10.3} pF ({:.3} / {:.3} pF at the audio peaks)\n  \
                 deviation          +{:.2} / -{:.2} kHz, {:.2} kHz/V\n  \
                 distortion         {:>10.2} % second harmonic\n  \
                 Carson bandwidth   {:>10.1} kHz\n",
                to_pf(m.junction_at_bias),
                to_pf(m.junction_at_high_bias),
                to_pf(m.junction_at_low_bias),
                to_khz(m.deviation_up),
                to_khz(m.deviation_down),
                to_khz(m.sensitivity),
                m.distortion * 100.0,
                to_khz(m.carson_bandwidth)
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
                to_khz(l.shift)
            ));
        }
        s.push_str(&format!(
            "  total {:+.2} kHz, worst case {:.2} kHz: {}\n",
            to_khz(self.drift.total),
            to_khz(self.drift.worst_case),
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
        _ => format!("{:+.2} pF", to_pf(change)),
    }
}

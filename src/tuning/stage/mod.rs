//! The oscillator round the tank: a one-transistor Colpitts stage (common base, or common
//! collector). Will it start, where will it run once the transistor's capacitances load the
//! tank, what does it draw from the battery, and what to change when it will not start or
//! starts too hard.
//!
//! The tank is the recipe's, through the one model (`recipe::figures` hands over its coil,
//! tank and conditions; [`crate::model::evaluate_coil`] gives the coil's inductance,
//! self-capacitance and AC resistance at the operating frequency). The recipe's feedback
//! divider is the stage's tapped capacitor: its upper capacitor from the tank's hot end to the
//! emitter, its lower one from the emitter to ground.
//!
//! - [`transistor`]: the transistor's figures or `.model` line;
//! - [`bias`]: the DC operating point;
//! - [`loop_gain`]: the small-signal network, its return ratio and natural frequency;
//! - [`critical`]: the loop gain as the transconductance over the critical one, and the
//!   steady oscillation's frequency;
//! - [`junction`]: the base–collector junction's share of the modulation;
//! - [`advice`]: the one change that brings the loop gain into the trade's range.

pub mod advice;
pub mod bias;
pub mod critical;
pub mod junction;
pub mod loop_gain;
pub mod settings;
pub mod transistor;

use crate::model::{Coil, Conditions, Tank, evaluate::resonance_of, evaluate_coil};
use crate::physics::junction::series;
use crate::units::{to_ma, to_mw, to_pf};
pub use bias::{Bias, OperatingPoint, operating_point};
pub use critical::critical_scale;
pub use junction::{JunctionShare, junction_share};
pub use loop_gain::{Network, Topology};
pub use settings::{SettingRefused, StageSettings, TransistorSpec};
pub use transistor::{JunctionCapacitance, Ratings, Transistor};

/// Below this loop gain a stage may start on the bench and fail cold, with a weaker
/// transistor or a flatter battery: the trade aims for 3 or more (common practice; the
/// usual advice is a small-signal loop gain of 2–3 at the least).
pub const RELIABLE_LOOP_GAIN: f64 = 3.0;

/// Above this loop gain the stage limits hard: a distorted collector swing rich in
/// harmonics, the frequency set more by the transistor than by the tank, and a risk of
/// squegging (common practice).
pub const TOO_HARD_LOOP_GAIN: f64 = 10.0;

/// The small-signal frequency's stated accuracy, relative: the circuit's natural frequency at
/// the operating point against ngspice's ring of the same circuit while it is still small
/// (tests/engine/reference_stage.rs, the simulator's integration error taken out).
pub const SMALL_SIGNAL_ACCURACY: f64 = 1e-4;

/// The operating frequency's stated accuracy, relative, while the loop gain lies within
/// [`RELIABLE_LOOP_GAIN`]–[`TOO_HARD_LOOP_GAIN`]. The describing function
/// ([`critical_scale`]) moves the small-signal frequency the right way as the swing grows,
/// but not far enough: the junctions' capacitances swing with the signal and the emitter
/// current's harmonics flow in the divider, which a fundamental-only model does not see
/// (against ngspice's steady oscillation of the same circuit, tests/engine/reference_stage.rs:
/// the tool low by 0.9e-4 to 1.6e-3, more with a 1:1 divider and a higher loop gain; with
/// fixed junction capacitances, the four-figure transistor, 2.5e-5 at a loop gain of 5). Harder
/// starts limit on the collector's swing and run further off (measured: 0.5–1.6 % at loop
/// gains of 30–200).
pub const FREQUENCY_ACCURACY: f64 = 2e-3;

/// The operating frequency's stated accuracy in the common-collector stage, relative, while
/// the loop gain lies within [`RELIABLE_LOOP_GAIN`]–[`TOO_HARD_LOOP_GAIN`]. Measured against
/// ngspice's steady oscillation (tests/engine/reference_stage.rs, the Clapp cases: C3 3.3–33
/// pF, loop gains 5.3–9.9): the tool low by 1.7e-4 to 2.2e-3, most with the larger series
/// capacitors at the higher loop gains (the base's larger swing limits the stage further
/// than the describing function, [`critical_scale`], sees), so above the common-base
/// stage's [`FREQUENCY_ACCURACY`].
pub const FREQUENCY_ACCURACY_COMMON_COLLECTOR: f64 = 3e-3;

/// The operating frequency's stated accuracy for `topology` (relative, loop gain 3–10).
pub fn frequency_accuracy(topology: Topology) -> f64 {
    match topology {
        Topology::CommonBase => FREQUENCY_ACCURACY,
        Topology::CommonCollector => FREQUENCY_ACCURACY_COMMON_COLLECTOR,
    }
}

/// Accepted supply, volts.
pub const SUPPLY_RANGE_V: (f64, f64) = (0.5, 30.0);
/// Accepted resistors (bias divider and emitter), ohms.
pub const RESISTOR_RANGE_OHM: (f64, f64) = (1.0, 10e6);
/// Accepted battery capacity, milliampere-hours.
pub const BATTERY_RANGE_MAH: (f64, f64) = (1.0, 1e6);

/// What the stage is built from (SI; the battery's capacity in coulombs).
#[derive(Clone, Debug, PartialEq)]
pub struct StageInputs {
    /// Common base or common collector.
    pub topology: Topology,
    /// Supply and bias resistors.
    pub bias: Bias,
    /// The transistor.
    pub transistor: Transistor,
    /// The battery's capacity, coulombs (1 mAh = 3.6 C).
    pub battery_charge: Option<f64>,
    /// A Clapp series capacitor between the tank and the base, farads (common collector
    /// only): the coil with the tank's own capacitors, in series with it, from base to ground.
    pub clapp: Option<f64>,
}

/// How readily the stage starts.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Start {
    /// The transistor is not in forward activity (cut off or saturated).
    NotBiased,
    /// Loop gain below 1.
    WillNotStart,
    /// Loop gain 1 to [`RELIABLE_LOOP_GAIN`].
    Marginal,
    /// Loop gain [`RELIABLE_LOOP_GAIN`] to [`TOO_HARD_LOOP_GAIN`].
    Reliable,
    /// Loop gain above [`TOO_HARD_LOOP_GAIN`].
    TooHard,
}

impl Start {
    /// The judgement of a loop gain `t` for an operating point that is (`active`) or is not
    /// in forward activity.
    pub fn of(t: f64, active: bool) -> Self {
        if !active {
            Start::NotBiased
        } else if t < 1.0 {
            Start::WillNotStart
        } else if t < RELIABLE_LOOP_GAIN {
            Start::Marginal
        } else if t <= TOO_HARD_LOOP_GAIN {
            Start::Reliable
        } else {
            Start::TooHard
        }
    }

    /// In words.
    pub fn label(self) -> &'static str {
        match self {
            Start::NotBiased => "not biased into its active region",
            Start::WillNotStart => "will not start",
            Start::Marginal => "starts, with too little margin",
            Start::Reliable => "starts reliably",
            Start::TooHard => "starts too hard",
        }
    }
}

/// Every figure of the stage (SI).
#[derive(Clone, Debug, PartialEq)]
pub struct StageFigures {
    /// The topology analysed.
    pub topology: Topology,
    /// The DC operating point.
    pub operating_point: OperatingPoint,
    /// Whether the transistor is in forward activity.
    pub active: bool,
    /// Ratings the operating point exceeds, in words.
    pub rating_faults: Vec<String>,
    /// Base–emitter capacitance at the operating point (depletion plus diffusion), farads.
    pub c_pi: f64,
    /// Base–collector capacitance at the operating point, farads.
    pub c_mu: f64,
    /// The transistor's transit frequency at the operating point, hertz.
    pub transit_frequency: f64,
    /// The coil's AC resistance at the operating frequency, ohms.
    pub coil_resistance: f64,
    /// The coil's Q at the operating frequency.
    pub coil_q: f64,
    /// The small-signal circuit at the operating point.
    pub network: Network,
    /// The small-signal loop gain: the transconductance over the least that sustains
    /// oscillation ([`critical_scale`]); 0 when the transistor is not active or no such
    /// transconductance exists.
    pub loop_gain: f64,
    /// The ideal-transformer textbook estimate of the same loop gain, for comparison
    /// (common base only).
    pub transformer_estimate: Option<f64>,
    /// Loop gain over [`RELIABLE_LOOP_GAIN`]: 1 or more starts reliably.
    pub start_margin: f64,
    /// How readily it starts.
    pub start: Start,
    /// The small ring's frequency at switch-on (the circuit's natural frequency at the
    /// operating point, [`Network::natural_frequency`]), hertz.
    pub small_signal_frequency: Option<f64>,
    /// The small ring's growth rate at switch-on, 1/s (negative: it dies away).
    pub ring_growth_rate: Option<f64>,
    /// The operating frequency, hertz: the steady oscillation's (the transistor's active part
    /// scaled down until the loop gain is 1, [`critical_scale`]) when it starts, else the
    /// dying ring's, else the loaded tank's resonance.
    pub frequency: f64,
    /// The tank's resonance alone (no transistor), hertz.
    pub tank_frequency: f64,
    /// Operating frequency minus the tank's alone, hertz.
    pub pulling: f64,
    /// Current from the supply, amperes.
    pub supply_current: f64,
    /// Battery life at that current, seconds (with a battery given).
    pub battery_life: Option<f64>,
    /// The base–collector junction's share of the modulation.
    pub junction: JunctionShare,
    /// `.model` parameters not used.
    pub unused: Vec<String>,
    /// One instruction: what to change, or that nothing needs changing.
    pub advice: String,
    /// The change the advice names, if any.
    pub change: Option<advice::Change>,
}

impl StageFigures {
    /// Whether the stage starts (loop gain at least 1 with the transistor active).
    pub fn starts(&self) -> bool {
        !matches!(self.start, Start::NotBiased | Start::WillNotStart)
    }
}

/// Why the stage cannot be analysed.
#[derive(Clone, Debug, PartialEq)]
pub struct StageError(pub String);

impl std::fmt::Display for StageError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(&self.0)
    }
}

impl std::error::Error for StageError {}

fn check(what: &str, v: f64, (lo, hi): (f64, f64), unit: &str) -> Result<(), StageError> {
    if (lo..=hi).contains(&v) {
        Ok(())
    } else {
        Err(StageError(format!(
            "{what} {v} is outside {lo}–{hi} {unit}"
        )))
    }
}

impl StageInputs {
    /// Refuse inputs outside the accepted ranges, naming the input.
    pub fn check(&self) -> Result<(), StageError> {
        let b = &self.bias;
        check("the supply", b.supply_v, SUPPLY_RANGE_V, "V")?;
        check(
            "the upper bias resistor",
            b.upper,
            RESISTOR_RANGE_OHM,
            "ohm",
        )?;
        check(
            "the lower bias resistor",
            b.lower,
            RESISTOR_RANGE_OHM,
            "ohm",
        )?;
        check("the emitter resistor", b.emitter, RESISTOR_RANGE_OHM, "ohm")?;
        check(
            "hFE",
            self.transistor.beta,
            transistor::BETA_RANGE,
            "(a ratio)",
        )?;
        if let Some(q) = self.battery_charge {
            check("the battery", q / 3.6, BATTERY_RANGE_MAH, "mAh")?;
        }
        if let Some(c) = self.clapp {
            check(
                "the Clapp capacitor",
                to_pf(c),
                (
                    to_pf(settings::CLAPP_RANGE_F.0),
                    to_pf(settings::CLAPP_RANGE_F.1),
                ),
                "pF",
            )?;
            if self.topology != Topology::CommonCollector {
                return Err(StageError(
                    "a Clapp series capacitor belongs to the common-collector stage".to_owned(),
                ));
            }
        }
        Ok(())
    }
}

/// The stage round `coil` in `tank` at `conditions` (the figures' driving tank, as
/// `recipe::figures` gives it), built from `inputs`.
pub fn stage(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    inputs: &StageInputs,
) -> Result<StageFigures, StageError> {
    let mut f = analyse(coil, tank, conditions, inputs)?;
    (f.advice, f.change) = advice::advise(coil, tank, conditions, inputs, &f);
    Ok(f)
}

/// Everything but the advice (the advice's search calls this for each change it tries).
pub fn analyse(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    inputs: &StageInputs,
) -> Result<StageFigures, StageError> {
    inputs.check()?;
    let divider = tank.feedback.ok_or_else(|| {
        StageError(
            "the tank has no feedback divider: the Colpitts stage needs its two capacitors \
             (add them to the recipe's tank)"
                .to_owned(),
        )
    })?;
    let t = &inputs.transistor;
    let conditions = Conditions {
        filament_sum: false,
        ..*conditions
    };
    let conditions = &conditions;
    let own = tank.fixed + tank.trimmer_at(tank.trimmer_setting) + tank.stray;
    let tank_alone = evaluate_coil(coil, tank.external_capacitance(), conditions);
    let collector_dc_r = match inputs.topology {
        Topology::CommonBase => tank_alone.dc_resistance,
        Topology::CommonCollector => 0.0,
    };
    let op = operating_point(t, &inputs.bias, collector_dc_r);
    let gm = op.transconductance;
    let diffusion = t.transit_time * gm;
    let c_pi = t.base_emitter.at(-op.base_emitter_v) + diffusion;
    let c_mu = t.base_collector.at(op.collector_base_v.max(0.0));
    // What the coil sees beyond its own capacitors: the divider with the transistor's
    // capacitances, through the Clapp capacitor when there is one.
    let at_base = match inputs.topology {
        Topology::CommonBase => c_mu + series(divider.upper, divider.lower + c_pi),
        Topology::CommonCollector => c_mu + series(divider.upper + c_pi, divider.lower),
    };
    let through_clapp = |c: f64| inputs.clapp.map_or(c, |cs| series(cs, c));
    let loaded_external = own + through_clapp(at_base);
    let loaded = evaluate_coil(coil, loaded_external, conditions);
    let network = Network {
        topology: inputs.topology,
        inductance: loaded.total_inductance,
        series_resistance: loaded.ac_resistance,
        tank_capacitance: own + loaded.self_capacitance,
        upper: divider.upper,
        lower: divider.lower,
        emitter_r: inputs.bias.emitter,
        base_r: inputs.bias.thevenin_r(),
        gm: gm.max(1e-15),
        beta: t.beta,
        c_pi,
        c_mu,
        clapp: inputs.clapp,
    };
    let active = op.active() && op.collector_current > 0.0;
    let small = network.zero_phase(loaded.resonance);
    let critical = critical_scale(&network, diffusion, small.map_or(loaded.resonance, |s| s.0));
    let loop_gain = match (active, critical) {
        (true, Some((k, _))) => 1.0 / k,
        _ => 0.0,
    };
    let start = Start::of(loop_gain, active);
    let starts = !matches!(start, Start::NotBiased | Start::WillNotStart);
    let ring = small.and_then(|(fs, _)| network.natural_frequency(fs));
    let ring_frequency = ring.map(|s| s.im / (2.0 * std::f64::consts::PI));
    let frequency = match (critical, ring_frequency, small) {
        (Some((_, f)), _, _) if starts => f,
        (_, Some(f), _) => f,
        (_, _, Some((fs, _))) => fs,
        _ => loaded.resonance,
    };
    // The tank alone: its own capacitors and the divider (through the Clapp capacitor when
    // there is one), no transistor.
    let tank_frequency = resonance_of(
        coil,
        own + through_clapp(series(divider.upper, divider.lower)),
        conditions,
    );
    let junction = junction_share(
        coil,
        conditions,
        &junction::Across {
            own,
            rest_at_base: at_base - c_mu,
            clapp: inputs.clapp,
            self_capacitance: loaded.self_capacitance,
        },
        t,
        &op,
    );
    let mut rating_faults = Vec::new();
    let r = &t.ratings;
    if let Some(max) = r.collector_emitter_max {
        // The collector swings up to about twice the supply in the common-base stage.
        let peak = match inputs.topology {
            Topology::CommonBase => 2.0 * inputs.bias.supply_v,
            Topology::CommonCollector => op.collector_emitter_v,
        };
        if peak > max {
            rating_faults.push(format!(
                "the collector–emitter voltage reaches about {peak:.1} V, above the rated {max:.1} V"
            ));
        }
    }
    if let Some(max) = r.collector_max
        && op.collector_current > max
    {
        rating_faults.push(format!(
            "the collector current {:.2} mA is above the rated {:.2} mA",
            to_ma(op.collector_current),
            to_ma(max)
        ));
    }
    if let Some(max) = r.dissipation_max
        && op.dissipation > max
    {
        rating_faults.push(format!(
            "the dissipation {:.0} mW is above the rated {:.0} mW",
            to_mw(op.dissipation),
            to_ma(max)
        ));
    }
    Ok(StageFigures {
        topology: inputs.topology,
        operating_point: op,
        active,
        rating_faults,
        c_pi,
        c_mu,
        transit_frequency: t.transit_frequency(
            op.collector_current,
            op.base_emitter_v,
            op.collector_base_v.max(0.0),
        ),
        coil_resistance: loaded.ac_resistance,
        coil_q: loaded.q,
        network,
        loop_gain,
        transformer_estimate: (inputs.topology == Topology::CommonBase && active)
            .then(|| loop_gain::transformer_estimate(&network, loaded.resonance)),
        start_margin: loop_gain / RELIABLE_LOOP_GAIN,
        start,
        small_signal_frequency: ring_frequency,
        ring_growth_rate: ring.map(|s| s.re),
        frequency,
        tank_frequency,
        pulling: frequency - tank_frequency,
        supply_current: op.supply_current,
        battery_life: inputs
            .battery_charge
            .map(|q| q / op.supply_current.max(1e-12)),
        junction,
        unused: t.unused.clone(),
        advice: String::new(),
        change: None,
    })
}

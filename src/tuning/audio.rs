//! The audio side of the tank as the builder sets it and the recipe keeps it (SI): the
//! modulating junction (its law, bias and coupling), the audio, and the drift budget's changes;
//! and every figure the window's "Audio and drift" shows, from the one function
//! [`audio_figures`] (through [`crate::tuning::modulation`] and [`crate::tuning::drift`], the
//! functions `evaluate --junction-…` calls).

use crate::model::{Coil, Conditions, Tank};
use crate::physics::dielectric_class::{CLASSES, TemperatureClass};
use crate::physics::junction::{DEFAULT_FORWARD_KNEE, JunctionLaw};
use crate::tuning::drift::{DriftBudget, DriftInputs, DriftTank, UsualChanges, drift_budget};
use crate::tuning::modulation::{
    Modulation, ModulationInputs, ModulationVerdict, Modulator, Service, judge, modulation,
};
use crate::units;

/// Accepted zero-bias junction capacitance, farads.
pub const CJ0_RANGE_F: (f64, f64) = (0.1e-12, 1000e-12);
/// Accepted contact potential, volts.
pub const VJ_RANGE_V: (f64, f64) = (0.1, 3.0);
/// Accepted grading exponent.
pub const M_RANGE: (f64, f64) = (0.05, 4.0);
/// Accepted forward-bias coefficient FC (SPICE takes it below 1).
pub const FC_RANGE: (f64, f64) = (0.0, 0.95);
/// Accepted reverse bias, volts.
pub const BIAS_RANGE_V: (f64, f64) = (0.0, 30.0);
/// Accepted audio peak at the junction, volts.
pub const AUDIO_PEAK_RANGE_V: (f64, f64) = (0.0, 5.0);
/// The RF peak across the tank the panel takes, volts.
pub const RF_PEAK_RANGE_V: (f64, f64) = (0.0, 50.0);
/// Accepted highest audio frequency, hertz.
pub const AUDIO_MAX_RANGE_HZ: (f64, f64) = (100.0, 100e3);
/// Accepted coupling capacitor, farads (0: the junction straight across the tank).
pub const COUPLING_RANGE_F: (f64, f64) = (0.0, 100e-12);
/// Accepted supply the bias is set at, volts.
pub const SUPPLY_RANGE_V: (f64, f64) = (1.0, 30.0);
/// Accepted supply change, volts.
pub const SUPPLY_CHANGE_RANGE_V: (f64, f64) = (-30.0, 30.0);
/// Accepted temperature change, kelvin.
pub const TEMPERATURE_CHANGE_RANGE_K: (f64, f64) = (-80.0, 80.0);
/// Accepted capacitance beside the junction, farads.
pub const BESIDE_RANGE_F: (f64, f64) = (0.0, 1e-9);
/// Accepted hand capacitance, farads.
pub const HAND_RANGE_F: (f64, f64) = (0.0, 10e-12);
/// Accepted load change, farads.
pub const LOAD_RANGE_F: (f64, f64) = (-10e-12, 10e-12);

/// The audio panel's settings (SI).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct AudioSettings {
    /// The modulating junction's law.
    pub junction: JunctionLaw,
    /// Its DC reverse bias, volts.
    pub bias_v: f64,
    /// The audio's peak at the junction, volts.
    pub audio_peak_v: f64,
    /// The RF peak across the tank, volts (it swings the junction beside the audio; the
    /// forward-conduction warning counts both).
    pub rf_peak_v: f64,
    /// The highest audio frequency, hertz; `None`: the service's (2 m voice 3 kHz, broadcast
    /// 15 kHz), following the carrier.
    pub audio_max: Option<f64>,
    /// A coupling capacitor in series with the junction, farads (0: straight across the tank).
    pub coupling: f64,
    /// The fixed capacitor's temperature class.
    pub fixed_class: TemperatureClass,
    /// The supply the bias is set at, volts.
    pub supply_v: f64,
    /// The supply's change, volts.
    pub supply_change_v: f64,
    /// The temperature's change, kelvin.
    pub temperature_change_k: f64,
    /// A hand near the coil, farads.
    pub hand: f64,
    /// A load change, farads.
    pub load: f64,
    /// The junction at its bias counts in the tank of every figure (as `evaluate
    /// --junction-…` counts it).
    pub in_tank: bool,
    /// Capacitance beside the junction that the tank as entered does not hold, farads: the
    /// oscillator transistor's other capacitances through the divider, taken with the stage
    /// transistor's own junction ([`AudioSettings::use_stage_junction`]); 0 otherwise.
    pub beside: f64,
}

impl Default for AudioSettings {
    /// A small-signal VHF transistor's collector–base junction (common practice: a few pF at
    /// zero bias, φ ≈ 0.75 V, m ≈ 0.33), biased at 4.5 V from a 9 V battery; the drift
    /// budget's usual changes ([`UsualChanges`]).
    fn default() -> Self {
        Self {
            junction: JunctionLaw {
                forward_knee: DEFAULT_FORWARD_KNEE,
                ..JunctionLaw::new(3.5e-12, 0.75, 0.33)
            },
            bias_v: 4.5,
            audio_peak_v: 0.1,
            rf_peak_v: crate::tuning::modulation::TANK_RF_PEAK_V,
            audio_max: None,
            coupling: 0.0,
            fixed_class: crate::physics::dielectric_class::by_name(UsualChanges::CLASS)
                .unwrap_or(CLASSES[1]),
            supply_v: UsualChanges::SUPPLY_V,
            supply_change_v: UsualChanges::SUPPLY_CHANGE_V,
            temperature_change_k: UsualChanges::TEMPERATURE_CHANGE_K,
            hand: UsualChanges::HAND,
            load: UsualChanges::LOAD,
            in_tank: false,
            beside: 0.0,
        }
    }
}

/// A setting out of its range: its key in the recipe file and the reason with the range.
#[derive(Clone, Debug, PartialEq)]
pub struct AudioRefused {
    /// The file's key.
    pub key: &'static str,
    /// Why, with the range.
    pub reason: String,
}

impl AudioSettings {
    /// The modulating element.
    pub fn modulator(&self) -> Modulator {
        Modulator {
            law: self.junction,
            coupling: (self.coupling > 0.0).then_some(self.coupling),
        }
    }

    /// The modulation's inputs with the highest audio frequency `audio_max` hertz.
    pub fn inputs_with(&self, audio_max: f64) -> ModulationInputs {
        ModulationInputs {
            modulator: self.modulator(),
            bias_v: self.bias_v,
            audio_peak_v: self.audio_peak_v,
            audio_max_hz: audio_max,
            rf_peak_v: self.rf_peak_v,
        }
    }

    /// The junction and its bias when it counts in the tank of every figure.
    pub fn junction_in_tank(&self) -> Option<(Modulator, f64)> {
        self.in_tank.then(|| (self.modulator(), self.bias_v))
    }

    /// `tank` (as the figures drive it) without the junction these settings count in it.
    pub fn without_junction(&self, tank: &Tank) -> Tank {
        match self.junction_in_tank() {
            Some((m, bias)) => Tank {
                stray: tank.stray - m.across_tank(bias),
                ..*tank
            },
            None => *tank,
        }
    }

    /// Everything across the coil but the junction for the audio's figures and charts:
    /// `tank` (as the figures drive it) without the junction these settings count in it, with
    /// the capacitance [`beside`](Self::beside) it added to the stray.
    pub fn rest_of_tank(&self, tank: &Tank) -> Tank {
        let t = self.without_junction(tank);
        Tank {
            stray: t.stray + self.beside,
            ..t
        }
    }

    /// Modulate with the oscillator stage's own base–collector junction (`share`, from
    /// `tuning::stage`, for a stage round `tank` as the figures drive it): its law, its bias
    /// at the operating point, straight across the tank, and the stage's other capacitances
    /// beside it, so the carrier's slope here is the stage's. Refused (settings unchanged)
    /// when the junction reaches the tank through a Clapp capacitor.
    pub fn use_stage_junction(
        &mut self,
        share: &crate::tuning::stage::JunctionShare,
        tank: &Tank,
    ) -> Result<(), String> {
        let rest = share.rest.ok_or_else(|| {
            "through a Clapp capacitor the stage's junction is not across the tank; the stage \
             panel gives its carrier's slope"
                .to_owned()
        })?;
        let entered = self.without_junction(tank).external_capacitance();
        self.junction = share.law;
        self.bias_v = share.bias_v;
        self.coupling = 0.0;
        self.beside = (rest - entered).max(0.0);
        Ok(())
    }

    /// The first setting out of its range, or `Ok`.
    pub fn check(&self) -> Result<(), AudioRefused> {
        let j = &self.junction;
        let items: [Limit<'_>; 15] = [
            (
                "transistor_beside_pf",
                "the capacitance beside the junction",
                self.beside,
                BESIDE_RANGE_F,
                units::to_pf,
                "pF",
            ),
            (
                "junction_cj0_pf",
                "Cj0",
                j.cj0,
                CJ0_RANGE_F,
                units::to_pf,
                "pF",
            ),
            (
                "junction_potential_v",
                "the junction potential",
                j.contact_potential,
                VJ_RANGE_V,
                same,
                "V",
            ),
            (
                "grading_exponent",
                "the grading exponent",
                j.grading,
                M_RANGE,
                same,
                "",
            ),
            ("forward_knee", "FC", j.forward_knee, FC_RANGE, same, ""),
            (
                "reverse_bias_v",
                "the reverse bias",
                self.bias_v,
                BIAS_RANGE_V,
                same,
                "V",
            ),
            (
                "audio_peak_v",
                "the audio peak",
                self.audio_peak_v,
                AUDIO_PEAK_RANGE_V,
                same,
                "V",
            ),
            (
                "rf_peak_v",
                "the RF peak across the tank",
                self.rf_peak_v,
                RF_PEAK_RANGE_V,
                same,
                "V",
            ),
            (
                "coupling_pf",
                "the coupling capacitor",
                self.coupling,
                COUPLING_RANGE_F,
                units::to_pf,
                "pF",
            ),
            (
                "drift_supply_v",
                "the supply",
                self.supply_v,
                SUPPLY_RANGE_V,
                same,
                "V",
            ),
            (
                "supply_change_v",
                "the supply change",
                self.supply_change_v,
                SUPPLY_CHANGE_RANGE_V,
                same,
                "V",
            ),
            (
                "temperature_change_k",
                "the temperature change",
                self.temperature_change_k,
                TEMPERATURE_CHANGE_RANGE_K,
                same,
                "K",
            ),
            (
                "hand_pf",
                "the hand's capacitance",
                self.hand,
                HAND_RANGE_F,
                units::to_pf,
                "pF",
            ),
            (
                "load_change_pf",
                "the load change",
                self.load,
                LOAD_RANGE_F,
                units::to_pf,
                "pF",
            ),
            (
                "audio_max_khz",
                "the highest audio frequency",
                self.audio_max.unwrap_or(15e3),
                AUDIO_MAX_RANGE_HZ,
                units::to_khz,
                "kHz",
            ),
        ];
        for (key, what, v, (lo, hi), to, unit) in items {
            if !(v.is_finite() && (lo..=hi).contains(&v)) {
                let s = |x: f64| {
                    let x = to(x);
                    format!("{}", format!("{x:.9e}").parse::<f64>().unwrap_or(x))
                };
                return Err(AudioRefused {
                    key,
                    reason: format!(
                        "{what} {} {unit} is outside {}–{} {unit}",
                        s(v),
                        s(lo),
                        s(hi)
                    ),
                });
            }
        }
        Ok(())
    }
}

/// A setting's file key, name, value, accepted range, display conversion and unit.
type Limit<'a> = (
    &'static str,
    &'a str,
    f64,
    (f64, f64),
    fn(f64) -> f64,
    &'a str,
);

/// No conversion (volts, kelvin, a ratio).
fn same(x: f64) -> f64 {
    x
}

/// Everything "Audio and drift" shows.
#[derive(Clone, Debug, PartialEq)]
pub struct AudioFigures {
    /// The highest audio frequency used, hertz (the settings', else the service's).
    pub audio_max: f64,
    /// The modulation.
    pub modulation: Modulation,
    /// The service judged against.
    pub service: Service,
    /// The modulation's verdict.
    pub verdict: ModulationVerdict,
    /// The drift budget.
    pub drift: DriftBudget,
}

/// The audio's figures for `coil` in `tank` (everything across the coil but the junction:
/// [`AudioSettings::without_junction`]) at `conditions`, judged against a channel `tolerance`
/// (± hertz). Until it is set, the highest audio frequency is the service's at the carrier
/// (the carrier does not depend on it).
pub fn audio_figures(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    settings: &AudioSettings,
    tolerance: f64,
) -> AudioFigures {
    let other = tank.external_capacitance();
    let first = settings.audio_max.unwrap_or(15e3);
    let mut m = modulation(coil, other, conditions, &settings.inputs_with(first));
    let service = Service::for_carrier(m.carrier);
    let audio_max = settings.audio_max.unwrap_or_else(|| service.audio_max());
    if audio_max != first {
        m = modulation(coil, other, conditions, &settings.inputs_with(audio_max));
    }
    let drift = drift_budget(
        coil,
        &DriftTank {
            fixed: tank.fixed,
            other: other - tank.fixed,
            junction: Some((settings.modulator(), settings.bias_v)),
        },
        conditions,
        &DriftInputs {
            supply_v: settings.supply_v,
            supply_change_v: settings.supply_change_v,
            temperature_change_k: settings.temperature_change_k,
            fixed_class: settings.fixed_class,
            hand: settings.hand,
            load: settings.load,
            channel_tolerance: tolerance,
        },
    );
    AudioFigures {
        audio_max,
        verdict: judge(&m, service),
        modulation: m,
        service,
        drift,
    }
}

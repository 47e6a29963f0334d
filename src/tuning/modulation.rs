//! Frequency modulation by a junction across the tank: how far the audio swings the carrier,
//! how lopsided the swing is, and how it sits with the service's limits.
//!
//! A reverse-biased junction is a voltage-controlled capacitor (the law in
//! [`crate::physics::junction`]). Either the oscillator transistor's own collector–base
//! junction sits across the tank (the one-transistor stage, common base: base and supply rail
//! at RF ground), or a varactor is coupled across it through a series capacitor. The audio
//! moves the junction's reverse bias by ± its peak; the tank's resonance follows.

use crate::model::{Coil, Conditions, Tank, evaluate::resonance_of};
use crate::physics::junction::{JunctionLaw, series};

/// The modulating element: a junction, directly across the tank or through a coupling
/// capacitor.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Modulator {
    /// The junction's law.
    pub law: JunctionLaw,
    /// Series coupling capacitor, farads (None: the junction sits directly across the tank).
    pub coupling: Option<f64>,
}

impl Modulator {
    /// Capacitance the modulator puts across the tank at a reverse bias `reverse_v`, farads.
    ///
    /// # Formula
    /// C = Cj(V) directly, or Cj·Cc/(Cj + Cc) through a coupling capacitor Cc.
    pub fn across_tank(&self, reverse_v: f64) -> f64 {
        let cj = self.law.capacitance(reverse_v);
        self.coupling.map_or(cj, |cc| series(cj, cc))
    }
}

/// `tank` with the modulator across it at its DC reverse bias `bias_v`: the junction's
/// capacitance there (through its coupling capacitor, if any) joins the stray, so every figure
/// of the tank (resonance, verdict, advice, charts) includes it. The one place both
/// `evaluate --junction-…` and the window (the audio panel's "count the junction" switch)
/// put the junction in the tank; the modulation's own figures then take the tank without it
/// ([`modulation`]'s `other_capacitance`) and find the same carrier.
pub fn tank_with_junction(tank: &Tank, modulator: &Modulator, bias_v: f64) -> Tank {
    Tank {
        stray: tank.stray + modulator.across_tank(bias_v),
        ..*tank
    }
}

/// What sets the modulation.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct ModulationInputs {
    /// The modulating element.
    pub modulator: Modulator,
    /// DC reverse bias across the junction, volts.
    pub bias_v: f64,
    /// Audio peak voltage at the junction, volts.
    pub audio_peak_v: f64,
    /// Highest audio frequency, hertz (for Carson's bandwidth).
    pub audio_max_hz: f64,
    /// The RF peak voltage across the tank, volts: the oscillation itself swings the junction
    /// beside the audio ([`rf_at_junction`]); [`TANK_RF_PEAK_V`] when not known.
    pub rf_peak_v: f64,
}

/// The RF peak across the tank of a small transistor oscillator when nothing better is known,
/// volts: 2 V (common practice, from memory: a one-transistor VHF oscillator on a 9 V supply
/// swings its tank by one to a few volts peak).
pub const TANK_RF_PEAK_V: f64 = 2.0;

/// The RF peak across the junction when the tank swings `rf_peak_v` volts peak: all of it
/// with the junction straight across the tank; through a coupling capacitor Cc, the share of
/// the capacitive divider Cc and Cj in series, V·Cc/(Cc + Cj) (two capacitors in series carry
/// the same charge, so each takes a voltage inversely proportional to its capacitance). Cj is
/// the junction's capacitance at 0 V, where it starts to conduct: the share at that moment.
pub fn rf_at_junction(modulator: &Modulator, rf_peak_v: f64) -> f64 {
    let v = rf_peak_v.abs();
    match modulator.coupling {
        None => v,
        Some(cc) => {
            let cj = modulator.law.capacitance(0.0);
            v * cc / (cc + cj)
        }
    }
}

/// The modulation's figures (SI: farads, hertz, hertz per volt; distortion as a fraction).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Modulation {
    /// Junction capacitance at the bias (the junction alone, before any coupling capacitor).
    pub junction_at_bias: f64,
    /// Junction capacitance at the audio's positive peak (bias + peak: the least capacitance).
    pub junction_at_high_bias: f64,
    /// Junction capacitance at the audio's negative peak (bias − peak: the most capacitance).
    pub junction_at_low_bias: f64,
    /// The carrier: the resonance with the junction at its bias, hertz.
    pub carrier: f64,
    /// Peak deviation upwards (at bias + peak), hertz.
    pub deviation_up: f64,
    /// Peak deviation downwards (at bias − peak), hertz, as a positive number.
    pub deviation_down: f64,
    /// Modulation sensitivity: (f(bias + peak) − f(bias − peak))/(2·peak), hertz per volt.
    pub sensitivity: f64,
    /// Second-harmonic distortion of the demodulated audio implied by the asymmetry, as a
    /// fraction of the fundamental.
    pub distortion: f64,
    /// Carson's bandwidth 2·(Δf + f_audio) with Δf the larger deviation, hertz.
    pub carson_bandwidth: f64,
    /// The RF peak across the junction, volts ([`rf_at_junction`]).
    pub rf_at_junction: f64,
    /// The least reverse voltage on the junction: bias − audio peak − RF peak at the
    /// junction, volts (negative: it is driven forward on those peaks).
    pub least_reverse_v: f64,
    /// Whether the audio's negative peak together with the RF's drives the junction into
    /// forward bias (`least_reverse_v` below 0).
    pub forward_on_peaks: bool,
}

/// Second-harmonic distortion of an FM swing whose peaks are `up` and `down` (both positive).
///
/// # Formula
/// With the instantaneous frequency f(v) = f₀ + α·v + β·v² and v = V·sin θ, the swing is
/// f₀ + β·V²/2 + α·V·sin θ − (β·V²/2)·cos 2θ, so H₂/H₁ = β·V/(2α). The peaks give
/// up = αV + βV² and down = αV − βV², hence H₂/H₁ = |up − down|/(2·(up + down)). A quadratic
/// fit to the curved law: good while the distortion is a few per cent (the tests hold it to a
/// Fourier sum of the swing).
pub fn asymmetry_distortion(up: f64, down: f64) -> f64 {
    let sum = up + down;
    if sum > 0.0 {
        (up - down).abs() / (2.0 * sum)
    } else {
        0.0
    }
}

/// Carson's rule for the bandwidth holding about 98 % of an FM signal's power:
/// B = 2·(Δf + f_m) (J. R. Carson, "Notes on the theory of modulation", Proc. IRE 10, 1922).
pub fn carson_bandwidth(peak_deviation: f64, audio_max: f64) -> f64 {
    2.0 * (peak_deviation + audio_max)
}

/// The modulation of `coil` whose tank has `other_capacitance` farads (everything external but
/// the modulator) at `conditions`.
pub fn modulation(
    coil: &Coil,
    other_capacitance: f64,
    conditions: &Conditions,
    inputs: &ModulationInputs,
) -> Modulation {
    let m = &inputs.modulator;
    let (vb, va) = (inputs.bias_v, inputs.audio_peak_v.abs());
    let f = |v: f64| resonance_of(coil, other_capacitance + m.across_tank(v), conditions);
    let carrier = f(vb);
    let up = f(vb + va) - carrier;
    let down = carrier - f(vb - va);
    let sensitivity = if va > 0.0 {
        (up + down) / (2.0 * va)
    } else {
        // No audio: the slope at the bias, from the law's derivative.
        let h = 1e-4 * (m.law.contact_potential + vb.abs());
        (f(vb + h) - f(vb - h)) / (2.0 * h)
    };
    let rf = rf_at_junction(m, inputs.rf_peak_v);
    let least_reverse_v = vb - va - rf;
    Modulation {
        junction_at_bias: m.law.capacitance(vb),
        junction_at_high_bias: m.law.capacitance(vb + va),
        junction_at_low_bias: m.law.capacitance(vb - va),
        carrier,
        deviation_up: up,
        deviation_down: down,
        sensitivity,
        distortion: asymmetry_distortion(up, down),
        carson_bandwidth: carson_bandwidth(up.max(down), inputs.audio_max_hz),
        rf_at_junction: rf,
        least_reverse_v,
        forward_on_peaks: least_reverse_v < 0.0,
    }
}

/// The service the transmitter is judged against.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Service {
    /// FM sound broadcasting, 88–108 MHz.
    FmBroadcast,
    /// Narrow-band FM on the 2 m amateur band.
    TwoMetreNarrowBand,
}

impl Service {
    /// The service a carrier belongs to: 2 m amateur above 120 MHz, FM broadcast below
    /// (the two services this tool serves).
    pub fn for_carrier(carrier: f64) -> Self {
        if carrier > 120e6 {
            Service::TwoMetreNarrowBand
        } else {
            Service::FmBroadcast
        }
    }

    /// Peak deviation allowed, hertz.
    ///
    /// FM broadcast: ±75 kHz (ITU-R Recommendation BS.450, "Transmission standards for FM
    /// sound broadcasting at VHF"). 2 m narrow-band FM: ±5 kHz on 25 kHz channels (common
    /// practice; ±2.5 kHz where 12.5 kHz channels are used).
    pub fn peak_deviation_limit(self) -> f64 {
        match self {
            Service::FmBroadcast => 75e3,
            Service::TwoMetreNarrowBand => 5e3,
        }
    }

    /// The channel the signal should stay inside, hertz: 200 kHz for broadcast (the channel
    /// raster; 47 CFR 15.239 bounds a US low-power transmitter's emission to 200 kHz), 25 kHz
    /// for 2 m FM (common practice).
    pub fn channel_width(self) -> f64 {
        match self {
            Service::FmBroadcast => 200e3,
            Service::TwoMetreNarrowBand => 25e3,
        }
    }

    /// The service whose band holds `carrier`, if any: FM broadcast 76–108 MHz (Japan's
    /// lower edge to the ITU Region 1/2 upper edge, RR Art. 5), 2 m 144–148 MHz (RR Art. 5).
    /// `None` between and beyond them (243.9 MHz is no 2 m carrier): the caller says so.
    pub fn applying_to(carrier: f64) -> Option<Self> {
        if (76e6..=108e6).contains(&carrier) {
            Some(Service::FmBroadcast)
        } else if (144e6..=148e6).contains(&carrier) {
            Some(Service::TwoMetreNarrowBand)
        } else {
            None
        }
    }

    /// The highest audio frequency the service carries, hertz: 15 kHz for FM broadcast
    /// (ITU-R Recommendation BS.450, from memory), 3 kHz for 2 m voice FM (a speech channel
    /// of 300–3000 Hz: common practice, as ITU-T G.712's telephone band).
    pub fn audio_max(self) -> f64 {
        match self {
            Service::FmBroadcast => 15e3,
            Service::TwoMetreNarrowBand => 3e3,
        }
    }

    /// Name shown.
    pub fn label(self) -> &'static str {
        match self {
            Service::FmBroadcast => "FM broadcast (±75 kHz, ITU-R BS.450)",
            Service::TwoMetreNarrowBand => "2 m narrow-band FM (±5 kHz, common practice)",
        }
    }
}

/// How the modulation sits with the service.
#[derive(Clone, Debug, PartialEq)]
pub struct ModulationVerdict {
    /// The larger peak deviation is within the service's limit.
    pub deviation_ok: bool,
    /// Carson's bandwidth fits the channel.
    pub bandwidth_ok: bool,
    /// Larger peak deviation over the limit (1 = at the limit).
    pub deviation_ratio: f64,
    /// Plain-text advice, one sentence each.
    pub advice: Vec<String>,
}

/// Distortion above which the advice speaks up (5 %: common practice for a simple transmitter).
const DISTORTION_NOTE: f64 = 0.05;

/// Judge `m` against `service` and say how to get more or less deviation.
pub fn judge(m: &Modulation, service: Service) -> ModulationVerdict {
    let peak = m.deviation_up.max(m.deviation_down);
    let limit = service.peak_deviation_limit();
    let ratio = peak / limit;
    let mut advice = Vec::new();
    if ratio > 1.0 {
        advice.push(format!(
            "The swing is {ratio:.1} times the limit: lower the audio level, use a smaller \
             coupling capacitor, or raise the junction's bias (its law is flatter there)."
        ));
    } else if ratio < 0.3 {
        advice.push(
            "The swing is well under the limit: raise the audio level, use a larger coupling \
             capacitor, or lower the junction's bias (its law is steeper there)."
                .to_owned(),
        );
    }
    if m.distortion > DISTORTION_NOTE {
        advice.push(format!(
            "The swing is lopsided ({:.1} % second harmonic): raise the bias or lower the audio \
             level so the junction works on a straighter part of its law.",
            m.distortion * 100.0
        ));
    }
    if m.forward_on_peaks {
        let audio = m.least_reverse_v + m.rf_at_junction;
        advice.push(format!(
            "The audio's negative peaks together with the RF across the junction ({:.2} V \
             peak) drive it forward by {:.2} V: it conducts on those peaks and clips. Raise \
             the bias by at least that much{}.",
            m.rf_at_junction,
            -m.least_reverse_v,
            if audio < 0.0 {
                " (the audio alone already passes the bias)"
            } else {
                ", or couple the junction through a smaller capacitor so less RF reaches it"
            }
        ));
    }
    let bandwidth_ok = m.carson_bandwidth <= service.channel_width();
    if !bandwidth_ok {
        advice.push(
            "Carson's bandwidth spills out of the channel: less deviation or a lower top \
             audio frequency (an audio low-pass filter) brings it in."
                .to_owned(),
        );
    }
    ModulationVerdict {
        deviation_ok: ratio <= 1.0,
        bandwidth_ok,
        deviation_ratio: ratio,
        advice,
    }
}

/// The carrier against the junction's reverse bias, for a chart: (bias volts, hertz) at each
/// of `biases`, through the batch path over capacitances.
pub fn carrier_over_bias(
    coil: &Coil,
    other_capacitance: f64,
    conditions: &Conditions,
    modulator: &Modulator,
    biases: &[f64],
) -> Vec<[f64; 2]> {
    let caps: Vec<f64> = biases
        .iter()
        .map(|&v| other_capacitance + modulator.across_tank(v))
        .collect();
    let mut out = vec![0.0; caps.len()];
    let mut columns = crate::model::batch::SweepColumns::default();
    crate::model::batch::resonance_over_capacitances(
        coil,
        conditions,
        &caps,
        &mut out,
        &mut columns,
    );
    biases.iter().zip(out).map(|(&v, f)| [v, f]).collect()
}

/// The peak deviations against the audio's peak voltage, for a chart: (peak volts, upward
/// hertz, downward hertz) at each of `peaks`, at `bias_v`.
pub fn deviation_over_audio(
    coil: &Coil,
    other_capacitance: f64,
    conditions: &Conditions,
    modulator: &Modulator,
    bias_v: f64,
    peaks: &[f64],
) -> Vec<[f64; 3]> {
    // Carrier first, then each peak's two capacitances, in one batch.
    let mut caps = Vec::with_capacity(1 + 2 * peaks.len());
    caps.push(other_capacitance + modulator.across_tank(bias_v));
    for &p in peaks {
        let p = p.abs();
        caps.push(other_capacitance + modulator.across_tank(bias_v + p));
        caps.push(other_capacitance + modulator.across_tank(bias_v - p));
    }
    let mut out = vec![0.0; caps.len()];
    let mut columns = crate::model::batch::SweepColumns::default();
    crate::model::batch::resonance_over_capacitances(
        coil,
        conditions,
        &caps,
        &mut out,
        &mut columns,
    );
    let carrier = out[0];
    peaks
        .iter()
        .enumerate()
        .map(|(i, &p)| [p.abs(), out[1 + 2 * i] - carrier, carrier - out[2 + 2 * i]])
        .collect()
}

/// Why a reverse bias cannot be had from the supply, or `None` when it can: a junction
/// biased through a divider or a potentiometer from the supply sees at most the supply, and
/// with the audio on top its reverse voltage swings to bias + audio peak (common practice: a
/// bias network cannot raise a voltage above the rail that feeds it). Volts in.
pub fn bias_beyond_supply(bias_v: f64, audio_peak_v: f64, supply_v: f64) -> Option<String> {
    if !(bias_v.is_finite() && audio_peak_v.is_finite() && supply_v.is_finite()) {
        return None;
    }
    let top = bias_v + audio_peak_v.abs();
    (top > supply_v).then(|| {
        format!(
            "Caution: the reverse bias ({bias_v:.2} V) with the audio peak reaches {top:.2} V, \
             above the {supply_v:.2} V supply (the drift budget's): a bias taken from that \
             supply cannot give it. Lower the bias or the audio, or raise the supply."
        )
    })
}

//! A coil measured across frequency (impedance samples, e.g. from a network analyser's
//! Touchstone file) reduced to the figures a builder compares with the model: inductance,
//! self-capacitance, series resistance, Q and self-resonance.
//!
//! # Model and method
//! The coil's usual lumped equivalent: its inductance L in series with a resistance R, the
//! pair shunted by its self-capacitance C (F. E. Terman, *Radio Engineers' Handbook*, 1943,
//! §2, "distributed capacitance of coils"; the same network underlies Medhurst's 1947
//! measurements). Below the self-resonance, with Q ≫ 1, the apparent inductance X/ω of this
//! network obeys 1/(X/ω) = 1/L − ω²C, a straight line in ω²: a least-squares line through the
//! samples with X > 0 gives L (intercept) and C (slope), from which the self-resonance is
//! 1/(2π√(LC)). R at each sample follows from Re Z = R/(1 − ω²LC)² (Q ≫ 1), and is stated at
//! one frequency since it rises with the skin effect. The residual is the RMS relative
//! difference of X between the fitted network and the samples used.

use crate::instruments::touchstone::ImpedanceSample;
use std::f64::consts::PI;

/// What the samples say about the coil.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct MeasuredCoil {
    /// Low-frequency inductance of the fitted network, henries.
    pub inductance: f64,
    /// Self-capacitance of the fitted network, farads.
    pub self_capacitance: f64,
    /// Series resistance at [`Self::at_frequency`], ohms.
    pub series_resistance: f64,
    /// The frequency R and Q are stated at, hertz.
    pub at_frequency: f64,
    /// Q = ωL/R at [`Self::at_frequency`].
    pub q: f64,
    /// 1/(2π√(LC)), hertz.
    pub self_resonance: f64,
    /// Where the measured reactance crosses zero going up, hertz, if the samples reach it.
    pub self_resonance_seen: Option<f64>,
    /// RMS relative difference of X between the network and the samples used.
    pub residual: f64,
    /// Samples the line was fitted through.
    pub used: usize,
}

/// Why no coil could be fitted.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct FitRefusal(pub String);

impl std::fmt::Display for FitRefusal {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(&self.0)
    }
}

/// Fits the coil's network to `samples`, stating R and Q at `at` hertz (the sample nearest to
/// it below the self-resonance), or at the highest inductive sample when `at` is `None`.
pub fn fit_measured_coil(
    samples: &[ImpedanceSample],
    at: Option<f64>,
) -> Result<MeasuredCoil, FitRefusal> {
    // Where X turns from inductive to capacitive: the self-resonance. Located on the
    // susceptance B = Im(1/Z), which passes smoothly through zero there (B ≈ ωC − 1/(ωL)),
    // where X itself swings through a pole: linear interpolation of B errs by about
    // Δf²/(8f) over a step Δf.
    let mut seen = None;
    for w in samples.windows(2) {
        let (a, b) = (w[0], w[1]);
        if a.impedance.im > 0.0 && b.impedance.im <= 0.0 {
            let (ba, bb) = ((1.0 / a.impedance).im, (1.0 / b.impedance).im);
            let t = if bb > ba { -ba / (bb - ba) } else { 0.5 };
            seen = Some(a.frequency + t.clamp(0.0, 1.0) * (b.frequency - a.frequency));
            break;
        }
    }
    // Inductive samples below the crossing, where the line holds (well below it: 1/(X/ω)
    // falls to zero at the self-resonance, so the last few per cent carry little weight).
    let limit = seen.map_or(f64::INFINITY, |f| 0.9 * f);
    let used: Vec<(f64, f64)> = samples
        .iter()
        .filter(|s| s.impedance.im > 0.0 && s.frequency < limit)
        .map(|s| {
            let w = 2.0 * PI * s.frequency;
            (w * w, w / s.impedance.im)
        })
        .collect();
    if used.len() < 3 {
        return Err(FitRefusal(format!(
            "{} inductive samples below the self-resonance: at least 3 are needed to fit the coil",
            used.len()
        )));
    }
    let n = used.len() as f64;
    let (sx, sy) = used.iter().fold((0.0, 0.0), |a, p| (a.0 + p.0, a.1 + p.1));
    let (mx, my) = (sx / n, sy / n);
    let (sxx, sxy) = used.iter().fold((0.0, 0.0), |a, p| {
        (a.0 + (p.0 - mx).powi(2), a.1 + (p.0 - mx) * (p.1 - my))
    });
    if sxx.is_nan() || sxx <= 0.0 {
        return Err(FitRefusal(
            "the samples need more than one frequency".into(),
        ));
    }
    let slope = sxy / sxx;
    let intercept = my - slope * mx;
    if intercept.is_nan() || intercept <= 0.0 {
        return Err(FitRefusal(
            "the reactance does not behave like a coil's (no positive inductance fits)".into(),
        ));
    }
    let inductance = 1.0 / intercept;
    // A slightly positive slope (noise on a coil far below its self-resonance) means no
    // self-capacitance can be seen: keep it at zero rather than negative.
    let self_capacitance = (-slope).max(0.0);
    let self_resonance = if self_capacitance > 0.0 {
        1.0 / (2.0 * PI * (inductance * self_capacitance).sqrt())
    } else {
        f64::INFINITY
    };
    let x_model = |f: f64| {
        let w = 2.0 * PI * f;
        w * inductance / (1.0 - w * w * inductance * self_capacitance)
    };
    let inductive: Vec<&ImpedanceSample> = samples
        .iter()
        .filter(|s| s.impedance.im > 0.0 && s.frequency < limit)
        .collect();
    let residual = (inductive
        .iter()
        .map(|s| ((x_model(s.frequency) - s.impedance.im) / s.impedance.im).powi(2))
        .sum::<f64>()
        / n)
        .sqrt();
    let chosen = match at {
        Some(f) => inductive
            .iter()
            .min_by(|a, b| (a.frequency - f).abs().total_cmp(&(b.frequency - f).abs()))
            .copied(),
        None => inductive.last().copied(),
    };
    let Some(chosen) = chosen else {
        return Err(FitRefusal(
            "no inductive sample to state the resistance at".into(),
        ));
    };
    let w = 2.0 * PI * chosen.frequency;
    let detune = 1.0 - w * w * inductance * self_capacitance;
    let series_resistance = chosen.impedance.re * detune * detune;
    if series_resistance.is_nan() || series_resistance <= 0.0 {
        return Err(FitRefusal(format!(
            "the resistance at {} is not positive: the file's losses are below its accuracy",
            crate::tuning::digits::mhz(chosen.frequency)
        )));
    }
    Ok(MeasuredCoil {
        inductance,
        self_capacitance,
        series_resistance,
        at_frequency: chosen.frequency,
        q: w * inductance / series_resistance,
        self_resonance,
        self_resonance_seen: seen,
        residual,
        used: used.len(),
    })
}

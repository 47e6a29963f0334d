//! The tank as a SPICE netlist: the coil as an equivalent network fitted to the field
//! solution around the operating frequency, the fixed capacitor, the trimmer at its setting,
//! the stray, the feedback divider, an AC sweep around the resonance and a `.meas` that prints
//! it as `resonance = VALUE` (hertz). Text only; the command line writes it.
//!
//! # The coil's network
//! The coil's lumped equivalent, L in series with R, shunted by C (F. E. Terman, *Radio
//! Engineers' Handbook*, 1943, §2), fitted to the field solution's impedance over the stated
//! band by `tuning::measured_coil` (1/(X/ω) = 1/L − ω²C by least squares), with R at the
//! operating frequency. A bench calibration's factor k on the apparent inductance enters as
//! L·k and C/k (which scales X/ω by exactly k, the network's self-resonance unchanged) and R·k
//! (Q unchanged). Where the field solution does not lead, the coil is the classical model's
//! apparent inductance at the resonance, a single inductor.
//!
//! # The resonance measured
//! A 1 A AC current source drives the tank; its voltage's phase passes through zero where the
//! tank's susceptance vanishes, ωC_ext = X/(R² + X²), which lies within (1/Q²)/2 of the tool's
//! ωC_ext = 1/X (5e-5 at Q = 100). `.meas ac resonance WHEN vp(hot)=0` reads it between two of
//! the sweep's points (linear interpolation over a 20 kHz step at 100 MHz).

use crate::model::Coil;
use crate::recipe::{Figures, Recipe};
use crate::tuning::impedance::impedance_sweep;
use crate::tuning::measured_coil::{MeasuredCoil, fit_measured_coil};
use crate::units::{to_mhz, to_pf};
use std::f64::consts::PI;
use std::fmt::Write as _;

/// Half-width of the band the coil's network is fitted over, as a share of the resonance.
pub const FIT_HALF_BAND: f64 = 0.25;
/// Field-solution points over the band.
const FIT_POINTS: usize = 16;
/// Half-width of the AC sweep, as a share of the resonance.
const SWEEP_HALF_SPAN: f64 = 0.03;
/// Points of the AC sweep.
const SWEEP_POINTS: usize = 3001;

/// How the coil enters the netlist.
#[derive(Clone, Copy, Debug, PartialEq)]
pub enum CoilNetwork {
    /// Fitted to the field solution (calibration applied).
    Fitted(MeasuredCoil),
    /// The classical model's apparent inductance at the resonance, henries.
    Classical(f64),
}

/// The netlist of `recipe`'s tank as the figures `f` drive it, with the network used.
pub fn spice_netlist(recipe: &Recipe, f: &Figures) -> Result<(String, CoilNetwork), String> {
    let resonance = f.analysis.resonance;
    if !(resonance.is_finite() && resonance > 0.0) {
        return Err("the tank has no resonance to write a netlist around".into());
    }
    let network = match &f.led {
        Some(led) => CoilNetwork::Fitted(fitted_coil(
            &f.coil,
            led.conditions.temperature_c,
            resonance,
            led.scale,
        )?),
        None => CoilNetwork::Classical(f.analysis.apparent_inductance),
    };
    let tank = &f.tank;
    let mut out = String::new();
    let w = &mut out;
    let _ = writeln!(
        w,
        "* Tankwright: the tank of \"{}\" as a SPICE netlist",
        clean(&recipe.name)
    );
    let _ = writeln!(
        w,
        "* Run: ngspice -b THIS_FILE   (prints resonance = VALUE in hertz)"
    );
    let _ = writeln!(
        w,
        "* The tool's resonance: {:.6} MHz ({})",
        to_mhz(resonance),
        f.basis_text()
    );
    let _ = writeln!(
        w,
        "* Nodes: hot = the coil's hot end, 0 = ground (the coil's cold end)"
    );
    let _ = writeln!(w, "*");
    match network {
        CoilNetwork::Fitted(m) => {
            let _ = writeln!(
                w,
                "* The coil: L in series with R, shunted by C, fitted by least squares to the field\n\
                 * solution of the wire (helix, leads, closing path) from {:.3} to {:.3} MHz\n\
                 * ({} points; RMS difference of X {:.3} %), R at {:.3} MHz.",
                to_mhz(resonance * (1.0 - FIT_HALF_BAND)),
                to_mhz(resonance * (1.0 + FIT_HALF_BAND)),
                m.used,
                m.residual * 100.0,
                to_mhz(m.at_frequency)
            );
            if let Some(led) = &f.led
                && (led.scale - 1.0).abs() > 1e-12
            {
                let _ = writeln!(
                    w,
                    "* The bench calibration's factor {:.5} on the apparent inductance is in L, C and R.",
                    led.scale
                );
            }
            let _ = writeln!(w, "Lcoil hot coil_r {:.9e}", m.inductance);
            let _ = writeln!(w, "Rcoil coil_r 0 {:.9e}", m.series_resistance);
            let _ = writeln!(w, "Ccoil_self hot 0 {:.9e}", m.self_capacitance);
        }
        CoilNetwork::Classical(l) => {
            let _ = writeln!(
                w,
                "* The coil: the classical model's apparent inductance at the resonance (the field\n\
                 * solution does not lead: {}).",
                f.field.json_name()
            );
            let _ = writeln!(w, "Lcoil hot 0 {l:.9e}");
        }
    }
    let _ = writeln!(w, "* The fixed capacitor");
    let _ = writeln!(w, "Cfixed hot 0 {:.9e}", tank.fixed.max(1e-18));
    if tank.trimmer_max > 0.0 {
        let _ = writeln!(
            w,
            "* The trimmer at {:.1} % of its travel ({:.2}-{:.2} pF, linear)",
            tank.trimmer_setting * 100.0,
            to_pf(tank.trimmer_min),
            to_pf(tank.trimmer_max)
        );
        let _ = writeln!(
            w,
            "Ctrimmer hot 0 {:.9e}",
            tank.trimmer_at(tank.trimmer_setting)
        );
    }
    let _ = writeln!(
        w,
        "* The stray capacitance ({})",
        if f.calibrated() {
            "as the bench calibration fitted it"
        } else {
            "as the recipe gives it"
        }
    );
    let _ = writeln!(w, "Cstray hot 0 {:.9e}", tank.stray.max(1e-18));
    if let Some(d) = tank.feedback {
        let _ = writeln!(w, "* The feedback divider: hot end to tap, tap to ground");
        let _ = writeln!(w, "Cdiv_upper hot tap {:.9e}", d.upper);
        let _ = writeln!(w, "Cdiv_lower tap 0 {:.9e}", d.lower);
        // A DC path for the tap (SPICE needs one at every node); far above the tank's impedance.
        let _ = writeln!(w, "Rtap_dc tap 0 1e12");
    }
    let _ = writeln!(
        w,
        "* A 1 A AC current into the hot end: the tank's voltage peaks at resonance"
    );
    let _ = writeln!(w, "Idrive 0 hot DC 0 AC 1");
    let (lo, hi) = (
        resonance * (1.0 - SWEEP_HALF_SPAN),
        resonance * (1.0 + SWEEP_HALF_SPAN),
    );
    let _ = writeln!(w, ".ac lin {SWEEP_POINTS} {lo:.6e} {hi:.6e}");
    // ngspice in batch mode keeps only what is saved; the phase is measured from v(hot).
    let _ = writeln!(w, ".save v(hot)");
    let _ = writeln!(w, ".meas ac resonance WHEN vp(hot)=0");
    let _ = writeln!(w, ".end");
    Ok((out, network))
}

/// The coil's network fitted to its field solution around `resonance`, with the calibration
/// factor `scale` on the apparent inductance.
fn fitted_coil(
    coil: &Coil,
    temperature_c: f64,
    resonance: f64,
    scale: f64,
) -> Result<MeasuredCoil, String> {
    let sweep = impedance_sweep(
        coil,
        temperature_c,
        Some(resonance * (1.0 - FIT_HALF_BAND)),
        Some(resonance * (1.0 + FIT_HALF_BAND)),
        FIT_POINTS,
        None,
    )
    .map_err(|e| format!("the field solution of the coil: {e}"))?;
    let samples = sweep.samples();
    let mut m = fit_measured_coil(&samples, Some(resonance))
        .map_err(|e| format!("the coil's network: {e}"))?;
    m.inductance *= scale;
    m.self_capacitance /= scale;
    m.series_resistance *= scale;
    m.self_resonance = 1.0 / (2.0 * PI * (m.inductance * m.self_capacitance).sqrt());
    Ok(m)
}

/// A recipe's name on a comment line: no line breaks or control characters.
fn clean(name: &str) -> String {
    name.chars()
        .map(|c| if c.is_control() { ' ' } else { c })
        .collect()
}

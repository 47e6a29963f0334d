//! The junction law against ngspice, the `.model` reader, and modulation's figures against
//! independent computations of the same quantities.

use std::process::Command;
use tankwright::model::evaluate::resonance_of;
use tankwright::model::{
    Coating, Coil, Conditions, DiameterSpec, Gauge, SpacingSpec, Winding, WireSpec,
};
use tankwright::physics::junction::JunctionLaw;
use tankwright::tuning::modulation::{
    ModulationInputs, Modulator, Service, asymmetry_distortion, carson_bandwidth, judge, modulation,
};
use tankwright::tuning::spice_model::{DeviceType, parse_model, parse_number};

/// A varactor-like diode model as a library prints it: continuation lines, unit suffixes,
/// parameters that are not part of the capacitance law. No series resistance: with RS the
/// forward current's drop I·RS moves ngspice's internal junction voltage (the first run with
/// RS = 0.5 Ω differed by 2.6e-6 at 0.2 V forward, which is that drop through dC/dV).
const DIODE_MODEL: &str = "\
.model LHVAR D(IS=3.2n N=1.05
+ CJO=22.5pF VJ=0.68 M=0.48 ; zero-bias capacitance and grading
+ TT=0 BV=30 IBV=10u FC=0.5)";

/// Run ngspice in batch mode on `netlist` and return every `name = value` it prints.
fn ngspice_values(netlist: &str) -> Vec<(String, f64)> {
    let dir = tempfile::tempdir().expect("temporary directory");
    let path = dir.path().join("junction.cir");
    std::fs::write(&path, netlist).expect("write netlist");
    let out = Command::new("ngspice")
        .arg("-b")
        .arg(&path)
        .output()
        .expect("ngspice runs (Debian package ngspice; .ci/setup installs it)");
    let text = String::from_utf8_lossy(&out.stdout).into_owned();
    text.lines()
        .filter_map(|l| {
            let (k, v) = l.split_once(" = ")?;
            Some((k.trim().to_owned(), v.trim().parse().ok()?))
        })
        .collect()
}

/// ngspice 39 (Debian package), diode model, operating point at each bias: the device's
/// capacitance `@d1[cd]` (depletion only: TT = 0, so no diffusion part) against
/// `JunctionLaw::capacitance` of the same `.model` text through our reader. ngspice prints
/// seven significant figures, so they must agree to within 1e-6 relative. The biases run from
/// 12 V reverse through zero to 0.5 V forward, past SPICE's knee FC·VJ = 0.34 V, where both
/// continue the law by its tangent.
#[test]
fn junction_law_matches_ngspice_operating_point() {
    let model = parse_model(DIODE_MODEL).expect("model reads");
    let biases = [12.0, 6.0, 3.0, 1.0, 0.2, 0.0, -0.2, -0.34, -0.5];
    let mut net = String::from("junction law check\nV1 k 0 DC 0\nD1 0 k LHVAR\n");
    net.push_str(DIODE_MODEL);
    net.push_str("\n.control\n");
    for v in biases {
        // Reverse bias: the cathode (k) above the anode (ground).
        net.push_str(&format!("alter V1 dc={v}\nop\nprint @d1[cd]\n"));
    }
    net.push_str(".endc\n.end\n");
    let values = ngspice_values(&net);
    let cd: Vec<f64> = values
        .iter()
        .filter(|(k, _)| k == "@d1[cd]")
        .map(|p| p.1)
        .collect();
    assert_eq!(cd.len(), biases.len(), "ngspice printed {values:?}");
    for (v, spice) in biases.iter().zip(cd) {
        let ours = model.law.capacitance(*v);
        assert!(
            ((ours - spice) / spice).abs() < 1e-6,
            "reverse {v} V: ours {ours:e}, ngspice {spice:e}"
        );
    }
}

/// The junction's temperature law against ngspice: the same diode at 3 V reverse at 77 °C and
/// −13 °C (TNOM 27 °C), ngspice's `@d1[cd]` against `JunctionLaw::at_temperature`, within its
/// seven printed figures.
#[test]
fn junction_temperature_law_matches_ngspice() {
    let model = parse_model(DIODE_MODEL).expect("model reads");
    let temps = [27.0, 77.0, -13.0, 45.0];
    let mut net = String::from("junction temperature check\nV1 k 0 DC 3\nD1 0 k LHVAR\n");
    net.push_str(DIODE_MODEL);
    net.push_str("\n.control\n");
    for t in temps {
        net.push_str(&format!("set temp={t}\nop\nprint @d1[cd]\n"));
    }
    net.push_str(".endc\n.end\n");
    let values = ngspice_values(&net);
    let cd: Vec<f64> = values
        .iter()
        .filter(|(k, _)| k == "@d1[cd]")
        .map(|p| p.1)
        .collect();
    assert_eq!(cd.len(), temps.len(), "ngspice printed {values:?}");
    for (t, spice) in temps.iter().zip(cd) {
        let ours = model.law.at_temperature(27.0, *t).capacitance(3.0);
        assert!(
            ((ours - spice) / spice).abs() < 1e-6,
            "{t} °C: ours {ours:e}, ngspice {spice:e}"
        );
    }
}

#[test]
fn model_reader_takes_continuations_suffixes_and_lists_the_rest() {
    let m = parse_model(DIODE_MODEL).expect("reads");
    assert_eq!(m.name, "LHVAR");
    assert_eq!(m.device, DeviceType::Diode);
    assert!((m.law.cj0 - 22.5e-12).abs() < 1e-24);
    assert_eq!(m.law.contact_potential, 0.68);
    assert_eq!(m.law.grading, 0.48);
    assert_eq!(m.ignored, ["IS", "N", "TT", "BV", "IBV"]);
    assert!(m.defaulted.is_empty());

    // A transistor: the collector–base junction's CJC/VJC/MJC, lower case, no parentheses,
    // spaces around '=', a comment line inside.
    let bjt = ".model lh918 npn is=0.1f bf=80 vaf=100\n* junction capacitances\n\
               + cje = 1.1p vje=0.75 mje=0.33 cjc=0.95p vjc=0.6 mjc=0.4 tf=0.2n $ from a data book";
    let m = parse_model(bjt).expect("reads");
    assert_eq!(m.device, DeviceType::Npn);
    assert!((m.law.cj0 - 0.95e-12).abs() < 1e-24);
    assert_eq!(m.law.contact_potential, 0.6);
    assert_eq!(m.law.grading, 0.4);
    assert_eq!(m.ignored, ["IS", "BF", "VAF", "CJE", "VJE", "MJE", "TF"]);

    // Missing VJC/MJC take SPICE's defaults and say so.
    let m = parse_model(".MODEL Q2 PNP(CJC=2p)").expect("reads");
    assert_eq!(m.law.contact_potential, 0.75);
    assert_eq!(m.law.grading, 0.33);
    assert_eq!(m.defaulted, ["VJC", "MJC"]);

    // Suffixes, SPICE's way.
    for (text, want) in [
        ("10p", 10e-12),
        ("2.5pF", 2.5e-12),
        ("1.5e-12", 1.5e-12),
        ("3meg", 3e6),
        ("3M", 3e-3),
        ("470f", 470e-15),
        ("2n", 2e-9),
        ("0.7V", 0.7),
        ("1e3k", 1e6),
    ] {
        let got = parse_number(text).expect(text);
        assert!((got - want).abs() <= 1e-12 * want.abs(), "{text}: {got}");
    }
    assert_eq!(parse_number("pico"), None);

    // Refusals name the problem.
    for (bad, says) in [
        ("model X D(CJO=1p)", ".model"),
        (".model X R(R=1k)", "type R"),
        (".model X D(IS=1n)", "CJO"),
        (".model X D(CJO=abc)", "not a number"),
        (".model X D(CJO=1p M=9)", "between 0 and 5"),
    ] {
        let e = parse_model(bad).expect_err(bad);
        assert!(e.0.contains(says), "{bad}: {}", e.0);
    }
}

fn demo_coil() -> Coil {
    Coil::from_winding(&Winding {
        diameter: DiameterSpec::Former(6e-3),
        wire: WireSpec {
            gauge: Gauge::Metric(0.8e-3),
            coating: Coating::EnamelGrade1,
        },
        turns: 5.0,
        spacing: SpacingSpec::Length(8e-3),
        lead_length: 4e-3,
    })
    .expect("valid")
}

fn collector_base() -> Modulator {
    Modulator {
        law: JunctionLaw::new(2.2e-12, 0.65, 0.4),
        coupling: None,
    }
}

/// The deviations are the engine's resonance at the two peak capacitances, less the carrier:
/// an identity, to 1e-9 relative.
#[test]
fn deviation_is_the_resonance_at_the_peak_capacitances() {
    let coil = demo_coil();
    let cond = Conditions::default();
    for coupling in [None, Some(4.7e-12)] {
        let m = Modulator {
            coupling,
            ..collector_base()
        };
        let inputs = ModulationInputs {
            modulator: m,
            bias_v: 4.0,
            audio_peak_v: 0.8,
            audio_max_hz: 15e3,
            rf_peak_v: tankwright::tuning::modulation::TANK_RF_PEAK_V,
        };
        let out = modulation(&coil, 18e-12, &cond, &inputs);
        let across = |c: f64| coupling.map_or(c, |cc| c * cc / (c + cc));
        let f = |cj: f64| resonance_of(&coil, 18e-12 + across(cj), &cond);
        let law = m.law;
        let carrier = f(law.capacitance(4.0));
        let up = f(law.capacitance(4.8)) - carrier;
        let down = carrier - f(law.capacitance(3.2));
        assert!(((out.carrier - carrier) / carrier).abs() < 1e-12);
        assert!(((out.deviation_up - up) / up).abs() < 1e-9);
        assert!(((out.deviation_down - down) / down).abs() < 1e-9);
        // The curved law: the swing down (towards more capacitance) is the larger.
        assert!(out.deviation_down > out.deviation_up);
        // Carson's rule, J. R. Carson 1922: B = 2(Δf + f_m).
        let carson = 2.0 * (out.deviation_down + 15e3);
        assert!((out.carson_bandwidth - carson).abs() < 1e-6);
        assert_eq!(carson_bandwidth(75e3, 15e3), 180e3);
    }
}

/// The asymmetry estimate of the second harmonic against a direct Fourier sum of the
/// instantaneous frequency over one audio cycle (256 samples of the engine's resonance with
/// the junction at bias + V·sin θ). The estimate fits a parabola through the two peaks, so it
/// departs from the Fourier figure by a relative amount of order (V/(φ + V_b))²: the check
/// asks 2 % at V = 0.3 V and that the departure falls about fourfold when V halves.
#[test]
fn distortion_estimate_matches_a_fourier_sum_of_the_swing() {
    let coil = demo_coil();
    let cond = Conditions::default();
    let m = collector_base();
    let fourier = |va: f64| {
        let n = 256;
        let (mut a1, mut b1, mut a2, mut b2) = (0.0, 0.0, 0.0, 0.0);
        for k in 0..n {
            let th = 2.0 * std::f64::consts::PI * k as f64 / n as f64;
            let f = resonance_of(&coil, 18e-12 + m.across_tank(3.0 + va * th.sin()), &cond);
            a1 += f * th.cos();
            b1 += f * th.sin();
            a2 += f * (2.0 * th).cos();
            b2 += f * (2.0 * th).sin();
        }
        (a2 * a2 + b2 * b2).sqrt() / (a1 * a1 + b1 * b1).sqrt()
    };
    let estimate = |va: f64| {
        let out = modulation(
            &coil,
            18e-12,
            &cond,
            &ModulationInputs {
                modulator: m,
                bias_v: 3.0,
                audio_peak_v: va,
                audio_max_hz: 15e3,
                rf_peak_v: tankwright::tuning::modulation::TANK_RF_PEAK_V,
            },
        );
        assert_eq!(
            out.distortion,
            asymmetry_distortion(out.deviation_up, out.deviation_down)
        );
        out.distortion
    };
    let err = |va: f64| (estimate(va) - fourier(va)) / fourier(va);
    let (e1, e2) = (err(0.3), err(0.15));
    assert!(e1.abs() < 0.02, "relative error at 0.3 V: {e1}");
    let ratio = e1 / e2;
    assert!(
        (3.0..5.0).contains(&ratio),
        "error ratio {ratio} (expected about 4)"
    );
}

/// Judged against the service: ±75 kHz (ITU-R BS.450) for broadcast, ±5 kHz for 2 m
/// narrow-band FM (common practice); too much swing names the cures.
#[test]
fn service_limits_and_advice() {
    assert_eq!(Service::FmBroadcast.peak_deviation_limit(), 75e3);
    assert_eq!(Service::TwoMetreNarrowBand.peak_deviation_limit(), 5e3);
    let coil = demo_coil();
    let out = modulation(
        &coil,
        18e-12,
        &Conditions::default(),
        &ModulationInputs {
            modulator: collector_base(),
            bias_v: 4.0,
            audio_peak_v: 1.0,
            audio_max_hz: 15e3,
            rf_peak_v: tankwright::tuning::modulation::TANK_RF_PEAK_V,
        },
    );
    let narrow = judge(&out, Service::TwoMetreNarrowBand);
    assert!(!narrow.deviation_ok);
    assert!(narrow.advice[0].contains("lower the audio level"));
    assert!(!out.forward_on_peaks);
}

/// The chart sweeps are the point figures: the carrier at each bias and the deviations at each
/// audio peak equal `modulation`'s (the batch path against the per-point one: within 1e-9 of
/// the carrier).
#[test]
fn chart_sweeps_match_the_point_figures() {
    use tankwright::tuning::modulation::{carrier_over_bias, deviation_over_audio};
    let coil = demo_coil();
    let cond = Conditions::default();
    let m = collector_base();
    let biases: Vec<f64> = (0..40).map(|i| 0.5 + 0.25 * i as f64).collect();
    for [v, f] in carrier_over_bias(&coil, 18e-12, &cond, &m, &biases) {
        let want = resonance_of(&coil, 18e-12 + m.across_tank(v), &cond);
        assert!(((f - want) / want).abs() < 1e-9);
    }
    let peaks = [0.1, 0.5, 1.0, 2.0];
    for [p, up, down] in deviation_over_audio(&coil, 18e-12, &cond, &m, 4.0, &peaks) {
        let point = modulation(
            &coil,
            18e-12,
            &cond,
            &ModulationInputs {
                modulator: m,
                bias_v: 4.0,
                audio_peak_v: p,
                audio_max_hz: 15e3,
                rf_peak_v: tankwright::tuning::modulation::TANK_RF_PEAK_V,
            },
        );
        let tol = 1e-9 * point.carrier;
        assert!((up - point.deviation_up).abs() < tol, "{p} V up");
        assert!((down - point.deviation_down).abs() < tol, "{p} V down");
    }
}

/// The RF peak that reaches a junction coupled to the tank through Cc: ngspice's AC analysis
/// of the same diode (at 0 V, where it starts to conduct) in series with Cc, driven by the
/// tank's 2 V peak at 100 MHz (ngspice 39, Debian package): the magnitude across the diode
/// against `rf_at_junction`, V·Cc/(Cc + Cj(0)). The diode's conductance at 0 V, IS/(N·Vt) ≈
/// 1.2e-7 S, is 1e-5 of the capacitors' admittance and in quadrature with it, so ngspice's
/// seven printed figures must agree to 1e-5. Straight across the tank (no Cc) the junction
/// takes the whole 2 V. The 2 V default is common practice (see TANK_RF_PEAK_V).
#[test]
fn rf_share_at_the_junction_matches_ngspice_ac() {
    use tankwright::tuning::modulation::{TANK_RF_PEAK_V, rf_at_junction};
    let model = parse_model(DIODE_MODEL).expect("model reads");
    for cc_pf in [2.2, 4.7, 47.0] {
        let mut net = format!(
            "coupled junction\nV1 t 0 DC 0 AC {TANK_RF_PEAK_V}\nC1 t k {cc_pf}p\n\
             D1 0 k LHVAR\nRB k 0 1G\n"
        );
        net.push_str(DIODE_MODEL);
        net.push_str("\n.control\nac lin 1 100meg 100meg\nprint vm(k)\n.endc\n.end\n");
        let values = ngspice_values(&net);
        let spice = values
            .iter()
            .find(|(k, _)| k.starts_with("vm(k)"))
            .map(|p| p.1)
            .unwrap_or_else(|| panic!("ngspice printed {values:?}"));
        let ours = rf_at_junction(
            &Modulator {
                law: model.law,
                coupling: Some(cc_pf * 1e-12),
            },
            TANK_RF_PEAK_V,
        );
        assert!(
            ((ours - spice) / spice).abs() < 1e-5,
            "Cc {cc_pf} pF: ours {ours} V, ngspice {spice} V"
        );
    }
    let straight = Modulator {
        law: model.law,
        coupling: None,
    };
    assert_eq!(rf_at_junction(&straight, TANK_RF_PEAK_V), TANK_RF_PEAK_V);
}

/// The forward-conduction warning counts the RF beside the audio: a junction straight across
/// the tank at 2.2 V bias with a 0.5 V audio peak is driven forward by the 2 V RF peak
/// (2.2 − 0.5 − 2 = −0.3 V), though the audio alone leaves it 1.7 V reverse; through a
/// 4.7 pF capacitor only the divider's share of the RF reaches it and it stays reverse.
#[test]
fn the_forward_warning_counts_the_rf_swing() {
    use tankwright::tuning::modulation::TANK_RF_PEAK_V;
    let coil = demo_coil();
    let cond = Conditions::default();
    let run = |coupling: Option<f64>| {
        modulation(
            &coil,
            18e-12,
            &cond,
            &ModulationInputs {
                modulator: Modulator {
                    coupling,
                    ..collector_base()
                },
                bias_v: 2.2,
                audio_peak_v: 0.5,
                audio_max_hz: 3e3,
                rf_peak_v: TANK_RF_PEAK_V,
            },
        )
    };
    let straight = run(None);
    assert!(straight.forward_on_peaks);
    assert!((straight.least_reverse_v - (2.2 - 0.5 - 2.0)).abs() < 1e-12);
    let advice = judge(&straight, Service::TwoMetreNarrowBand).advice;
    assert!(
        advice
            .iter()
            .any(|a| a.contains("RF across the junction (2.00 V peak)")),
        "{advice:?}"
    );
    let coupled = run(Some(4.7e-12));
    // Cj(0) = 2.2 pF: 2 V × 4.7/(4.7 + 2.2) = 1.36 V.
    assert!((coupled.rf_at_junction - 2.0 * 4.7 / 6.9).abs() < 1e-9);
    assert!(!coupled.forward_on_peaks);
}

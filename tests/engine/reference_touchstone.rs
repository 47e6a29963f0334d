//! Touchstone files (Touchstone File Format Specification 1.1, EIA/IBIS Open Forum 2002, and
//! 2.0, IBIS Open Forum 2009) written here from a known network, in every option the format
//! has, read back into the coil's figures.
//!
//! The network is the coil's lumped equivalent (L in series with R, shunted by C; F. E. Terman,
//! *Radio Engineers' Handbook*, 1943, §2). Its impedance is computed here from the circuit
//! alone, and turned into S, Y or Z by the textbook relations (D. M. Pozar, *Microwave
//! Engineering*, 4th ed., 2012: Γ = (Z − Z0)/(Z + Z0), §2.3; a series impedance between two
//! ports, S11 = Z/(Z + 2Z0), S21 = 2Z0/(Z + 2Z0), Table 4.2 via §4.3). The reader and the fit
//! must give L and C back. The fit's line 1/(X/ω) = 1/L − ω²C is exact for the lossless network;
//! the resistance moves X by a share of order 1/Q², 1e-4 at the Q of 100 used here, so L and C
//! are held to 1e-3 and R (stated at one frequency, recovered through (1 − ω²LC)²) to 1e-2.

use num_complex::Complex64;
use std::f64::consts::PI;
use tankwright::instruments::touchstone::{self, Fixture};
use tankwright::tuning::measured_coil::fit_measured_coil;

const L: f64 = 120e-9;
const C: f64 = 0.9e-12;
/// Q = ωL/R = 100 at 100 MHz.
const R: f64 = 2.0 * PI * 100e6 * L / 100.0;

fn network(f: f64) -> Complex64 {
    let w = 2.0 * PI * f;
    let series = Complex64::new(R, w * L);
    let shunt = Complex64::new(0.0, -1.0 / (w * C));
    series * shunt / (series + shunt)
}

fn frequencies() -> Vec<f64> {
    // 20 to 300 MHz: the self-resonance is near 485 MHz, so every sample is inductive.
    (0..30).map(|i| 20e6 + i as f64 * 10e6).collect()
}

#[derive(Clone, Copy)]
enum Param {
    S,
    Y,
    Z,
}

#[derive(Clone, Copy)]
enum Form {
    Ri,
    Ma,
    Db,
}

fn pair(z: Complex64, form: Form) -> String {
    match form {
        Form::Ri => format!("{:.15e} {:.15e}", z.re, z.im),
        Form::Ma => format!("{:.15e} {:.15e}", z.norm(), z.arg().to_degrees()),
        Form::Db => format!(
            "{:.15e} {:.15e}",
            20.0 * z.norm().log10(),
            z.arg().to_degrees()
        ),
    }
}

/// The file text for the network, one port across or two ports in series.
fn file(
    ports: usize,
    param: Param,
    form: Form,
    unit: (&str, f64),
    z0: f64,
    version_two: bool,
) -> String {
    let mut out = String::from("! written by the test from a known network\n");
    if version_two {
        out += "[Version] 2.0\n";
    }
    let p = match param {
        Param::S => "S",
        Param::Y => "Y",
        Param::Z => "Z",
    };
    let f = match form {
        Form::Ri => "RI",
        Form::Ma => "MA",
        Form::Db => "DB",
    };
    out += &format!("# {} {p} {f} R {z0}\n", unit.0);
    if version_two {
        out += &format!(
            "[Number of Ports] {ports}\n[Number of Frequencies] {}\n",
            frequencies().len()
        );
        if ports == 2 {
            out += "[Two-Port Data Order] 21_12\n";
        }
        out += "[Network Data]\n";
    }
    // 1.1 normalises Y and Z to the reference impedance; 2.0 writes ohms and siemens.
    let nz = if version_two { 1.0 } else { z0 };
    for fr in frequencies() {
        let z = network(fr);
        let values: Vec<Complex64> = match (ports, param) {
            (1, Param::S) => vec![(z - z0) / (z + z0)],
            (1, Param::Z) => vec![z / nz],
            (1, Param::Y) => vec![(1.0 / z) * nz],
            (_, Param::S) => {
                let s11 = z / (z + 2.0 * z0);
                let s21 = 2.0 * z0 / (z + 2.0 * z0);
                vec![s11, s21, s21, s11]
            }
            (_, Param::Y) => {
                let y = (1.0 / z) * nz;
                vec![y, -y, -y, y]
            }
            (_, Param::Z) => unreachable!("a series element alone has no Z parameters"),
        };
        let line: Vec<String> = values.iter().map(|v| pair(*v, form)).collect();
        out += &format!("{:.9} {}\n", fr / unit.1, line.join(" "));
    }
    if version_two {
        out += "[End]\n";
    }
    out
}

fn check(text: &str, ports: usize, what: &str) {
    let m = touchstone::read(text, ports).unwrap_or_else(|e| panic!("{what}: refused: {e}"));
    assert_eq!(m.samples.len(), frequencies().len(), "{what}");
    assert_eq!(
        m.fixture,
        if ports == 1 {
            Fixture::OnePort
        } else {
            Fixture::SeriesThrough
        }
    );
    let fit = fit_measured_coil(&m.samples, Some(100e6)).expect("fits");
    let rel = |a: f64, b: f64| (a - b).abs() / b;
    assert!(
        rel(fit.inductance, L) < 1e-3,
        "{what}: L {:e}",
        fit.inductance
    );
    assert!(
        rel(fit.self_capacitance, C) < 1e-3,
        "{what}: C {:e}",
        fit.self_capacitance
    );
    assert!(
        rel(fit.series_resistance, R) < 1e-2,
        "{what}: R {}",
        fit.series_resistance
    );
    assert!((fit.at_frequency - 100e6).abs() < 1.0, "{what}");
    let srf = 1.0 / (2.0 * PI * (L * C).sqrt());
    assert!(rel(fit.self_resonance, srf) < 1e-3, "{what}");
    assert!(fit.residual < 1e-3, "{what}: residual {}", fit.residual);
}

#[test]
fn every_format_option_gives_the_network_back() {
    let units = [("Hz", 1.0), ("kHz", 1e3), ("MHz", 1e6), ("GHz", 1e9)];
    let mut cases = 0;
    for version_two in [false, true] {
        for (ports, params) in [
            (1, &[Param::S, Param::Y, Param::Z][..]),
            (2, &[Param::S, Param::Y][..]),
        ] {
            for &param in params {
                for form in [Form::Ri, Form::Ma, Form::Db] {
                    for (i, unit) in units.iter().enumerate() {
                        let z0 = if i % 2 == 0 { 50.0 } else { 75.0 };
                        let text = file(ports, param, form, *unit, z0, version_two);
                        check(
                            &text,
                            ports,
                            &format!("{ports}-port v2={version_two} {}", unit.0),
                        );
                        cases += 1;
                    }
                }
            }
        }
    }
    assert_eq!(cases, 2 * 5 * 3 * 4);
}

#[test]
fn defaults_are_the_specification_s() {
    // Version 1.1: no option line means GHz, S, MA, R 50.
    let mut text = String::new();
    for fr in frequencies() {
        let z = network(fr);
        let s = (z - 50.0) / (z + 50.0);
        text += &format!("{:.12} {}\n", fr / 1e9, pair(s, Form::Ma));
    }
    check(&text, 1, "defaults");
}

#[test]
fn the_self_resonance_is_seen_where_the_reactance_crosses_zero() {
    // A sweep through the self-resonance (about 484 MHz) in 20 MHz steps: the crossing is
    // interpolated on the susceptance, B ≈ ωC − 1/(ωL), whose linear interpolation over a step
    // Δf errs by Δf²/(8f) = 0.10 MHz (the resistance moves the crossing by (R/ωL)²/2 of f,
    // 2e-6); the line is fitted below 0.9 of it.
    let mut text = String::from("# MHz Z RI R 50\n");
    for i in 0..40 {
        let fr = 20e6 + i as f64 * 20e6;
        let z = network(fr) / 50.0;
        text += &format!("{} {:.15e} {:.15e}\n", fr / 1e6, z.re, z.im);
    }
    let m = touchstone::read(&text, 1).expect("reads");
    let fit = fit_measured_coil(&m.samples, None).expect("fits");
    let srf = 1.0 / (2.0 * PI * (L * C).sqrt());
    let seen = fit.self_resonance_seen.expect("crossing seen");
    assert!((seen - srf).abs() < 0.12e6, "seen {seen:e} against {srf:e}");
    assert!((fit.inductance - L).abs() / L < 1e-3);
}

#[test]
fn malformed_files_are_refused_with_the_line_and_the_reason() {
    let cases: [(&str, &str, usize); 8] = [
        ("# MHz S RI R 50\n100 0.1\n", "whole rows", 2),
        ("# MHz S RI R 50\n100 0.1 abc\n", "abc is not a number", 2),
        ("# MHz S RI R -5\n100 0.1 0.2\n", "reference impedance", 1),
        ("# MHz Q RI R 50\n", "unknown word", 1),
        ("# MHz S RI R 50\n100 0.1 0.2\n90 0.1 0.2\n", "rise", 3),
        ("# MHz S RI R 50\n! nothing\n", "no data", 0),
        ("[Version] 3.0\n", "version", 1),
        ("# MHz H RI R 50\n", "H parameters", 1),
    ];
    for (text, words, line) in cases {
        let e = touchstone::read(text, 1).expect_err(text);
        assert!(e.reason.contains(words), "{text:?}: {e}");
        assert_eq!(e.line, line, "{text:?}: {e}");
    }
    // S11 = 1 is an open standard: no finite impedance.
    let e = touchstone::read("# MHz S RI R 50\n100 1 0\n", 1).expect_err("open");
    assert!(e.reason.contains("finite"), "{e}");
    // Too few inductive samples to fit.
    let m = touchstone::read("# MHz Z RI R 50\n100 0.1 1\n200 0.1 2\n", 1).expect("reads");
    assert!(fit_measured_coil(&m.samples, None).is_err());
}

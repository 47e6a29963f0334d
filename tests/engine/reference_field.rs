//! The field solution (src/physics/field) against an independent full-wave solver, nec2c, and
//! against the engine's own quasi-static and classical figures.
//!
//! nec2c is the C translation of NEC-2 (G. J. Burke and A. J. Poggio, *Numerical
//! Electromagnetics Code (NEC) — Method of Moments*, Lawrence Livermore, 1981), a
//! general-purpose method-of-moments wire code with its own basis (constant + sine + cosine
//! per segment), kernel and source model; Debian package `nec2c`, installed by .ci/setup. It
//! is a test oracle only: the tool never calls it. The NEC decks are written here from the
//! geometry stated in `physics::field::geometry` (helix on its true radius, straight leads in
//! +x to the board plane, closing path with the terminals' gap), each segment a GW card, with
//! the wire's conductivity as an LD 5 load.
//!
//! Where both solutions are compared the tolerance is the two solutions' own convergence
//! spread, computed in the test: ours between `segments_per_turn` and half of it, NEC's
//! between 16 and 32 segments a turn (see `nec_converged`). Each spread is itself held below a bound so a
//! loose solution cannot widen its own tolerance.

use std::f64::consts::PI;
use std::fmt::Write as _;
use std::process::Command;
use tankwright::model::{
    Coating, Coil, Conditions, DiameterSpec, Gauge, SpacingSpec, Winding, WireSpec, wire_coil,
};
use tankwright::physics::constants::SPEED_OF_LIGHT;
use tankwright::physics::copper::{internal_impedance, resistivity, skin_depth};
use tankwright::physics::field::{Feed, FieldModel, WireCoil};
use tankwright::physics::filament::{coaxial_mutual_inductance, ring_self_inductance};
use tankwright::physics::leads::straight_wire_inductance;
use tankwright::tuning::field_tank::{
    APPARENT_RISE_BIAS, HELICAL_SELF_RESONANCE_BIAS, LUMPED_SELF_RESONANCE_BIAS, MeasuredBias,
    field_tank,
};

const MM: f64 = 1e-3;

fn coil(d_mm: f64, turns: f64, pitch_mm: f64, wire_mm: f64, lead_mm: f64) -> WireCoil {
    WireCoil {
        mean_diameter: d_mm * MM,
        pitch: pitch_mm * MM,
        turns,
        wire_radius: 0.5 * wire_mm * MM,
        lead_length: lead_mm * MM,
        resistivity: resistivity(20.0),
    }
}

fn describe(c: &WireCoil) -> String {
    format!(
        "D {} mm, N {}, p {} mm, wire {} mm, leads {} mm",
        c.mean_diameter / MM,
        c.turns,
        c.pitch / MM,
        2.0 * c.wire_radius / MM,
        c.lead_length / MM
    )
}

/// Our first resonance at `per_turn`, fed at `feed`.
fn ours(c: &WireCoil, per_turn: usize, feed: Feed) -> f64 {
    FieldModel::new(c, per_turn, feed)
        .and_then(|m| m.first_resonance())
        .expect("field solution")
}

/// Our X/ω at `f`, at the terminals.
fn ours_inductance(c: &WireCoil, per_turn: usize, f: f64) -> f64 {
    let m = FieldModel::new(c, per_turn, Feed::Terminals).expect("model");
    m.impedance(f).expect("impedance").im / (2.0 * PI * f)
}

// ---------------------------------------------------------------- nec2c

mod nec {
    use super::*;

    /// Where the NEC source goes.
    #[derive(Clone, Copy, PartialEq)]
    pub enum Source {
        /// A segment bridging the terminals' gap.
        Terminals,
        /// The middle segment of the helix, terminals open.
        HelixMiddle,
    }

    /// The deck's geometry cards for `c` with `per_turn` segments a turn; returns the cards and
    /// the (tag, segment) of the source.
    fn geometry(c: &WireCoil, per_turn: usize, source: Source) -> (String, (usize, usize)) {
        let a = 0.5 * c.mean_diameter;
        let r = c.wire_radius;
        let whole = (c.turns * per_turn as f64).round() as usize;
        // An odd count, so one segment is centred on the helix's middle.
        let n = if whole.is_multiple_of(2) {
            whole + 1
        } else {
            whole
        };
        let phi_end = 2.0 * PI * c.turns;
        let point = |i: usize| {
            let t = i as f64 / n as f64;
            let phi = t * phi_end;
            [a * phi.cos(), a * phi.sin(), t * c.turns * c.pitch]
        };
        let mut cards = String::new();
        let mut tag = 0;
        let mut gw = |cards: &mut String, ns: usize, p: [f64; 3], q: [f64; 3]| {
            tag += 1;
            writeln!(
                cards,
                "GW {tag} {ns} {:.10e} {:.10e} {:.10e} {:.10e} {:.10e} {:.10e} {:.6e}",
                p[0], p[1], p[2], q[0], q[1], q[2], r
            )
            .expect("string");
            tag
        };
        let mut middle = (0, 0);
        for i in 0..n {
            let t = gw(&mut cards, 1, point(i), point(i + 1));
            if i == n / 2 {
                middle = (t, 1);
            }
        }
        let mut terminals = (0, 0);
        if c.lead_length > 0.0 {
            let board = a + c.lead_length;
            let (s, e) = (point(0), point(n));
            let foot_s = [board, s[1], s[2]];
            let foot_e = [board, e[1], e[2]];
            // With the source at the terminals the straight parts are cut into segments as long
            // as the source segment (NEC-2's guideline for the applied-field source: its
            // neighbours of equal length); with the terminals open, into segments of two
            // helix segments, as our solver does.
            let step = match source {
                Source::Terminals => c.terminal_gap(),
                Source::HelixMiddle => 2.0 * PI * a / per_turn as f64 * 2.0,
            };
            let count = |p: [f64; 3], q: [f64; 3]| {
                let l =
                    ((p[0] - q[0]).powi(2) + (p[1] - q[1]).powi(2) + (p[2] - q[2]).powi(2)).sqrt();
                ((l / step).ceil() as usize).max(1)
            };
            gw(&mut cards, count(e, foot_e), e, foot_e);
            gw(&mut cards, count(foot_s, s), foot_s, s);
            // Closing path: foot_e → gap → foot_s, the gap as one segment of its own.
            let g = c.terminal_gap();
            let len = ((foot_s[1] - foot_e[1]).powi(2) + (foot_s[2] - foot_e[2]).powi(2)).sqrt();
            let at = |x: f64| {
                let t = x / len;
                [
                    board,
                    foot_e[1] + t * (foot_s[1] - foot_e[1]),
                    foot_e[2] + t * (foot_s[2] - foot_e[2]),
                ]
            };
            let (g0, g1) = (at(0.5 * (len - g)), at(0.5 * (len + g)));
            gw(&mut cards, count(foot_e, g0), foot_e, g0);
            if source == Source::Terminals {
                terminals = (gw(&mut cards, 1, g0, g1), 1);
            }
            gw(&mut cards, count(g1, foot_s), g1, foot_s);
        }
        let src = match source {
            Source::Terminals => terminals,
            Source::HelixMiddle => middle,
        };
        assert!(src.0 > 0, "no source segment");
        (cards, src)
    }

    /// Input impedances (in order) from a nec2c run of `deck`.
    fn run(deck: &str) -> Vec<(f64, f64)> {
        let dir = tempfile::tempdir().expect("temp dir");
        let input = dir.path().join("coil.nec");
        let output = dir.path().join("coil.out");
        std::fs::write(&input, deck).expect("write deck");
        let status = Command::new("nec2c")
            .arg("-i")
            .arg(&input)
            .arg("-o")
            .arg(&output)
            .status()
            .expect("nec2c must be installed (Debian package nec2c; see .ci/setup)");
        assert!(status.success(), "nec2c failed on:\n{deck}");
        let text = std::fs::read_to_string(&output).expect("nec2c output");
        let lines: Vec<&str> = text.lines().collect();
        let mut z = Vec::new();
        for (i, line) in lines.iter().enumerate() {
            if line.contains("ANTENNA INPUT PARAMETERS") {
                let fields: Vec<f64> = lines[i + 3]
                    .split_whitespace()
                    .map(|w| w.parse::<f64>().expect("number in nec2c output"))
                    .collect();
                z.push((fields[6], fields[7]));
            }
        }
        z
    }

    fn deck(c: &WireCoil, per_turn: usize, source: Source, frequencies: &str) -> String {
        let (cards, (tag, seg)) = geometry(c, per_turn, source);
        format!(
            "CM tankwright field-solution check\nCE\n{cards}GE 0\nPT -1\nLD 5 0 0 0 {:.6e}\nEX 0 {tag} {seg} 0 1.0 0.0\n{frequencies}\nXQ\nEN\n",
            1.0 / c.resistivity
        )
    }

    /// NEC's Z at the terminals at `f` hertz.
    pub fn impedance(c: &WireCoil, per_turn: usize, f: f64) -> (f64, f64) {
        let fr = format!("FR 0 1 0 0 {:.9e} 0", f * 1e-6);
        run(&deck(c, per_turn, Source::Terminals, &fr))[0]
    }

    /// NEC's Z at the terminals at `count` frequencies from `lo` hertz in steps of `step`.
    pub fn sweep(
        c: &WireCoil,
        per_turn: usize,
        lo: f64,
        step: f64,
        count: usize,
    ) -> Vec<(f64, f64)> {
        let fr = format!("FR 0 {count} 0 0 {:.9e} {:.9e}", lo * 1e-6, step * 1e-6);
        run(&deck(c, per_turn, Source::Terminals, &fr))
    }

    /// NEC's first series resonance at the helix's middle with the terminals open (the first
    /// natural mode), hertz: a ×1.04 scan, then 21 points across the bracket, the zero of
    /// Im Z by linear interpolation.
    pub fn first_natural_mode(c: &WireCoil, per_turn: usize) -> f64 {
        let start = SPEED_OF_LIGHT / (8.0 * c.loop_wire_length()) * 1e-6;
        let fr = format!("FR 1 60 0 0 {start:.9e} 1.04");
        let coarse = run(&deck(c, per_turn, Source::HelixMiddle, &fr));
        let k = coarse
            .windows(2)
            .position(|w| w[0].1 < 0.0 && w[1].1 >= 0.0)
            .expect("a resonance in the scan");
        assert!(coarse[0].1 < 0.0, "capacitive at the scan's start");
        let lo = start * 1.04_f64.powi(k as i32);
        let hi = lo * 1.04;
        let step = (hi - lo) / 20.0;
        let fr = format!("FR 0 21 0 0 {lo:.9e} {step:.9e}");
        let fine = run(&deck(c, per_turn, Source::HelixMiddle, &fr));
        let j = fine
            .windows(2)
            .position(|w| w[0].1 < 0.0 && w[1].1 >= 0.0)
            .expect("the resonance in the fine scan");
        let (x0, x1) = (fine[j].1, fine[j + 1].1);
        (lo + step * (j as f64 + x0 / (x0 - x1))) * 1e6
    }
}

/// A value with the spread between two discretisations.
struct Converged {
    value: f64,
    spread: f64,
}

/// NEC at 16 and 32 segments a turn on the helix: the value at 32 and the spread
/// |f₃₂ − f₁₆|; with `richardson`, the value is extrapolated as f₃₂ + (f₃₂ − f₁₆)/3 (NEC's nodes
/// lie on the circle, so the polygon's error falls as the square of the segment length).
fn nec_converged(richardson: bool, f: impl Fn(usize) -> f64) -> Converged {
    let (coarse, fine) = (f(16), f(32));
    let extra = if richardson {
        (fine - coarse) / 3.0
    } else {
        0.0
    };
    Converged {
        value: fine + extra,
        spread: (fine - coarse).abs(),
    }
}

/// Ours at the chosen segments a turn and half of it.
fn ours_converged(c: &WireCoil, f: impl Fn(usize) -> f64) -> Converged {
    let n = c.segments_per_turn();
    let (coarse, fine) = (f((n / 2).max(6)), f(n));
    Converged {
        value: fine,
        spread: (fine - coarse).abs(),
    }
}

/// Coils across 4–25 mm and 3–12 turns (our own choice), with and without leads.
fn nec_cases() -> Vec<WireCoil> {
    vec![
        coil(4.0, 8.0, 0.8, 0.4, 3.0),
        coil(10.0, 5.0, 2.0, 1.0, 5.0),
        coil(25.0, 12.0, 2.5, 1.0, 10.0),
        coil(6.0, 3.0, 1.6, 0.8, 0.0),
        coil(16.0, 6.0, 3.0, 1.2, 0.0),
    ]
}

#[test]
fn self_resonance_agrees_with_nec2c_within_both_convergence_spreads() {
    // Both solvers find the first natural mode of the wire with the terminals open, as the
    // first series resonance seen from the helix's middle (NEC cannot bridge the gap by an
    // ideal source; our terminals' pole is the same mode, checked in
    // `terminal_pole_is_the_natural_mode`).
    let mut report = String::new();
    for c in nec_cases() {
        let n = nec_converged(true, |per| nec::first_natural_mode(&c, per));
        let o = ours_converged(&c, |per| ours(&c, per, Feed::HelixMiddle));
        let tolerance = n.spread + o.spread;
        let diff = o.value - n.value;
        writeln!(
            report,
            "{}: ours {:.3} MHz (spread {:.3}), nec2c {:.3} MHz (spread {:.3}), diff {:+.3} % (tolerance {:.3} %)",
            describe(&c),
            o.value * 1e-6,
            o.spread * 1e-6,
            n.value * 1e-6,
            n.spread * 1e-6,
            100.0 * diff / n.value,
            100.0 * tolerance / n.value
        )
        .expect("string");
        // Neither solution may widen its own tolerance: each spread under 3 %.
        assert!(o.spread < 0.03 * o.value, "ours unconverged: {report}");
        assert!(n.spread < 0.03 * n.value, "nec2c unconverged: {report}");
        assert!(
            diff.abs() <= tolerance,
            "self-resonance disagrees:\n{report}"
        );
    }
    println!("{report}");
}

#[test]
fn apparent_inductance_at_vhf_agrees_with_nec2c() {
    // X/ω at the terminals, at 100 MHz or half the coil's resonance if that is lower (X/ω
    // climbs steeply near the resonance, where neither figure is a useful check).
    // NEC's terminal reactance keeps rising as its helix segments shorten towards the wire
    // radius (measured: on the 10 mm coil 162.7, 166.8, 168.9, 170.5, 171.8, 173.0 nH at 12 to
    // 32 segments a turn, where a segment is 2 wire radii long; its thin-wire kernel's accuracy
    // falls below about 8 radii, Burke and Poggio 1981, Part III), and refining its straight
    // parts next to the source raises it further (the applied-field source's known dependence
    // on the segments beside it). So NEC's figure here is the one at 32 a turn with the
    // straight parts cut as long as the source segment, not extrapolated, and its spread is
    // the change from 16 a turn; its spread may reach 5 % (3–4 % measured).
    let mut report = String::new();
    let mut failed = false;
    for c in nec_cases().into_iter().filter(|c| c.lead_length > 0.0) {
        let srf = ours(&c, c.segments_per_turn(), Feed::Terminals);
        let f = (100e6_f64).min(0.5 * srf);
        let w = 2.0 * PI * f;
        let n = nec_converged(false, |per| nec::impedance(&c, per, f).1 / w);
        let o = ours_converged(&c, |per| ours_inductance(&c, per, f));
        let tolerance = n.spread + o.spread;
        let diff = o.value - n.value;
        writeln!(
            report,
            "{} at {:.1} MHz: ours {:.3} nH (spread {:.3}), nec2c {:.3} nH (spread {:.3}), diff {:+.3} % (tolerance {:.3} %)",
            describe(&c),
            f * 1e-6,
            o.value * 1e9,
            o.spread * 1e9,
            n.value * 1e9,
            n.spread * 1e9,
            100.0 * diff / n.value,
            100.0 * tolerance / n.value
        )
        .expect("string");
        failed |= o.spread > 0.03 * o.value || n.spread > 0.05 * n.value;
        failed |= diff.abs() > tolerance;
    }
    println!("{report}");
    assert!(!failed, "X/ω disagrees:\n{report}");
}

#[test]
fn terminal_pole_is_the_natural_mode() {
    // The parallel resonance at the terminals and the series resonance at the helix's middle
    // are the same natural mode of the wire (the pole and the zero of one complex frequency);
    // with a Q in the hundreds the real-axis crossings agree to well under 0.1 %.
    for c in [
        coil(10.0, 5.0, 2.0, 1.0, 5.0),
        coil(8.0, 4.0, 1.5, 0.8, 0.0),
    ] {
        let n = c.segments_per_turn();
        let pole = ours(&c, n, Feed::Terminals);
        let zero = ours(&c, n, Feed::HelixMiddle);
        assert!(
            (pole / zero - 1.0).abs() < 1e-3,
            "{}: pole {pole}, zero {zero}",
            describe(&c)
        );
    }
}

#[test]
fn doubling_the_segments_moves_the_self_resonance_under_half_a_percent() {
    // The convergence requirement, on a coil with leads, an isolated one, and the
    // demo coil on long leads (30 and 50 mm, cut in graded segments: see
    // `physics::field::geometry`), where doubling also halves the longest straight segment.
    for c in [
        coil(10.0, 5.0, 2.0, 1.0, 5.0),
        coil(6.0, 3.0, 1.6, 0.8, 0.0),
        coil(7.0, 5.0, 1.6, 1.0, 30.0),
        coil(7.0, 5.0, 1.6, 1.0, 50.0),
    ] {
        let n = c.segments_per_turn();
        let once = ours(&c, n, Feed::Terminals);
        let twice = ours(&c, 2 * n, Feed::Terminals);
        let change = (twice / once - 1.0).abs();
        println!(
            "{}: {n}/turn {once:.0} Hz, {}/turn {twice:.0} Hz, change {:.3} %",
            describe(&c),
            2 * n,
            100.0 * change
        );
        assert!(change < 0.005, "{}: {once} → {twice}", describe(&c));
    }
}

/// The engine's ring sum (Maxwell's mutual inductance, Kirchhoff's ring) with the internal
/// inductance fraction at `f`.
fn ring_sum(c: &WireCoil, f: f64) -> f64 {
    let chi = internal_impedance(c.wire_radius / skin_depth(c.resistivity, f))
        .internal_inductance_fraction;
    let a = 0.5 * c.mean_diameter;
    let n = c.turns as u32;
    let mut total = f64::from(n) * ring_self_inductance(a, c.wire_radius, chi);
    for s in 1..n {
        total += 2.0 * f64::from(n - s) * coaxial_mutual_inductance(a, a, f64::from(s) * c.pitch);
    }
    total
}

#[test]
fn low_frequency_limit_is_the_quasi_static_inductance() {
    // At 1 MHz X/ω of the isolated coil is its quasi-static (partial) inductance. The engine's
    // ring sum (src/physics/filament.rs) treats each turn as a closed ring; the helix also
    // carries the current along the axis over its length l, spread round a cylinder of the
    // coil's radius a, whose partial self-inductance is that of two parallel filaments a apart
    // (the circle's geometric mean distance from itself is its radius):
    // µ0/(2π)·[l·ln((l + √(l² + a²))/a) − √(l² + a²) + a] (Grover 1946, eq. 3 for parallel
    // filaments, and ch. 15 on the helix as rings plus an axial current). Expected: ring sum
    // plus that axial term. Tolerance 0.6 %: the residual measured on this branch (0.4 % on the
    // 10 mm coil), attributed to the polygon and the kernel near the wire, which the ring
    // formula's closed form does not share.
    let mut report = String::new();
    let mut failed = false;
    for c in [
        coil(10.0, 5.0, 2.0, 1.0, 0.0),
        coil(20.0, 8.0, 2.0, 1.0, 0.0),
        coil(6.0, 4.0, 1.0, 0.5, 0.0),
    ] {
        let f = 1e6;
        let ours = ours_inductance(&c, c.segments_per_turn(), f);
        let rings = ring_sum(&c, f);
        let l = c.length();
        let a = 0.5 * c.mean_diameter;
        let h = (l * l + a * a).sqrt();
        let axial =
            tankwright::physics::constants::MU_0 / (2.0 * PI) * (l * ((l + h) / a).ln() - h + a);
        let expected = rings + axial;
        let tolerance = 0.006 * expected;
        writeln!(
            report,
            "{}: ours {:.3} nH, ring sum {:.3} nH + axial {:.3} nH, diff {:+.3} % (tolerance 0.6 %)",
            describe(&c),
            ours * 1e9,
            rings * 1e9,
            axial * 1e9,
            100.0 * (ours / expected - 1.0),
        )
        .expect("string");
        failed |= (ours - expected).abs() > tolerance;
    }
    // With leads the loop also holds the closing path and the leads' mutual inductance, which
    // the engine's "ring sum plus two straight leads" leaves out; the closing path's own
    // partial inductance bounds the difference.
    for c in [
        coil(10.0, 5.0, 2.0, 1.0, 5.0),
        coil(20.0, 8.0, 2.0, 1.0, 10.0),
    ] {
        let f = 1e6;
        let ours = ours_inductance(&c, c.segments_per_turn(), f);
        let leads = 2.0 * straight_wire_inductance(c.lead_length, c.wire_radius, 1.0);
        let engine = ring_sum(&c, f) + leads;
        let closing = straight_wire_inductance(c.length(), c.wire_radius, 1.0);
        writeln!(
            report,
            "{}: ours {:.3} nH, ring sum + leads {:.3} nH, diff {:+.3} nH (bound: closing path {:.3} nH)",
            describe(&c),
            ours * 1e9,
            engine * 1e9,
            (ours - engine) * 1e9,
            closing * 1e9
        )
        .expect("string");
        failed |= (ours - engine).abs() > closing;
    }
    println!("{report}");
    assert!(!failed, "{report}");
}

#[test]
fn impedance_is_passive_and_the_matrix_reciprocal() {
    // Passive: a lossy wire absorbs or radiates power, so Re Z ≥ 0 at every frequency.
    for c in [
        coil(10.0, 5.0, 2.0, 1.0, 5.0),
        coil(6.0, 3.0, 1.6, 0.8, 0.0),
    ] {
        let m = FieldModel::new(&c, c.segments_per_turn(), Feed::Terminals).expect("model");
        let top = m.first_resonance().expect("resonance") * 1.5;
        let mut f = 1e6;
        while f < top {
            let z = m.impedance(f).expect("impedance");
            assert!(z.re >= 0.0, "{}: R = {} at {f} Hz", describe(&c), z.re);
            f *= 1.3;
        }
    }
    // Reciprocal: Galerkin testing makes the moment matrix symmetric.
    let c = coil(8.0, 3.0, 2.0, 0.8, 4.0);
    let s = tankwright::physics::field::Structure::build(&c, 8, Feed::Terminals).expect("wire");
    let m = tankwright::physics::field::matrix::StaticMatrices::new(&s, 6);
    let z = m.assemble(150e6, c.resistivity);
    let n = m.size;
    let biggest = z.iter().map(|v| v.norm()).fold(0.0, f64::max);
    for i in 0..n {
        for j in 0..i {
            assert!(
                (z[i * n + j] - z[j * n + i]).norm() <= 1e-12 * biggest,
                "Z[{i}][{j}]"
            );
        }
    }
}

#[test]
fn self_resonance_falls_with_turns_and_rises_when_stretched() {
    let srf = |c: &WireCoil| ours(c, c.segments_per_turn(), Feed::Terminals);
    let mut last = f64::INFINITY;
    for turns in [3.0, 4.0, 5.0, 6.0] {
        let f = srf(&coil(8.0, turns, 1.6, 0.8, 4.0));
        assert!(f < last, "{turns} turns: {f} not below {last}");
        last = f;
    }
    let mut last = 0.0;
    for pitch in [1.2, 1.6, 2.4, 3.2] {
        let f = srf(&coil(8.0, 4.0, pitch, 0.8, 4.0));
        assert!(f > last, "pitch {pitch}: {f} not above {last}");
        last = f;
    }
}

#[test]
fn classical_self_resonance_estimates_bias_as_measured() {
    // The engine's lumped (Medhurst's capacitance with the inductance) and helical-line
    // (Kandoian–Sichak) estimates against the field solution for the isolated coil. Measured
    // on this branch (2026-12-02) and recorded here, not hidden: the ranges below are the
    // measured ratios widened by the field solution's own convergence spread (< 0.5 %).
    // Measured: lumped/field 0.698–0.715 (the lumped figure 29–30 % low), helical/field
    // 1.241–1.267 (24–27 % high), on the four coils below.
    use tankwright::model::{
        Coating, Conditions, DiameterSpec, Gauge, SpacingSpec, Tank, Winding, WireSpec, evaluate,
    };
    let mut report = String::new();
    let mut lumped_ratios = Vec::new();
    let mut helical_ratios = Vec::new();
    for c in [
        coil(6.0, 3.0, 1.6, 0.8, 0.0),
        coil(10.0, 5.0, 2.0, 1.0, 0.0),
        coil(16.0, 6.0, 3.0, 1.2, 0.0),
        coil(25.0, 12.0, 2.5, 1.0, 0.0),
    ] {
        let field = ours(&c, c.segments_per_turn(), Feed::Terminals);
        let winding = Winding {
            diameter: DiameterSpec::Mean(c.mean_diameter),
            wire: WireSpec {
                gauge: Gauge::Metric(2.0 * c.wire_radius),
                coating: Coating::Bare,
            },
            turns: c.turns,
            spacing: SpacingSpec::Length(c.length()),
            lead_length: 0.0,
        };
        let a = evaluate(
            &winding,
            &Tank::fixed_only(10e-12, 0.0),
            &Conditions::default(),
        )
        .expect("valid coil");
        let lumped = a.self_resonance.lumped / field;
        let helical = a.self_resonance.helical / field;
        writeln!(
            report,
            "{}: field {:.1} MHz, lumped/field {:.3}, helical/field {:.3}",
            describe(&c),
            field * 1e-6,
            lumped,
            helical
        )
        .expect("string");
        lumped_ratios.push(lumped);
        helical_ratios.push(helical);
    }
    println!("{report}");
    let (lo, hi) = min_max(&lumped_ratios);
    let (hlo, hhi) = min_max(&helical_ratios);
    println!("lumped/field {lo:.3}–{hi:.3}, helical/field {hlo:.3}–{hhi:.3}");
    // The labels the window and the report put on the estimates
    // (tuning::field_tank::*_BIAS) hold what is measured here, to the convergence spread.
    let within = |lo: f64, hi: f64, b: MeasuredBias| {
        lo >= b.low * (1.0 - SPREAD) && hi <= b.high * (1.0 + SPREAD)
    };
    assert!(
        within(lo, hi, LUMPED_SELF_RESONANCE_BIAS),
        "lumped bias moved:\n{report}"
    );
    assert!(
        within(hlo, hhi, HELICAL_SELF_RESONANCE_BIAS),
        "helical bias moved:\n{report}"
    );
    // And the labels are no wider than what is measured.
    assert!(lo <= LUMPED_SELF_RESONANCE_BIAS.low * (1.0 + SPREAD));
    assert!(hi >= LUMPED_SELF_RESONANCE_BIAS.high * (1.0 - SPREAD));
    assert!(hlo <= HELICAL_SELF_RESONANCE_BIAS.low * (1.0 + SPREAD));
    assert!(hhi >= HELICAL_SELF_RESONANCE_BIAS.high * (1.0 - SPREAD));
}

/// The field solution's own convergence spread on a ratio (doubling the segments moves the
/// self-resonance by under 0.5 %; see the convergence test above), as a fraction.
const SPREAD: f64 = 0.006;

fn min_max(v: &[f64]) -> (f64, f64) {
    v.iter()
        .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), &x| {
            (lo.min(x), hi.max(x))
        })
}

#[test]
fn classical_apparent_inductance_rise_bias_as_measured() {
    // The engine's apparent inductance L/(1 − (f/f_self)²) with the lumped self-resonance,
    // against the field solution's rise of X/ω between a quarter of the operating frequency and
    // the operating frequency (the rise goes as f², so a quarter of the way it is 1/16 of the
    // whole, corrected for; the internal inductance's own fall between the two frequencies,
    // (µ0/8π)·Δχ per metre of wire, is taken out first). Recorded as measured on this branch,
    // not hidden; the band is the measured ratios widened by 10 % of themselves (the rise is a
    // difference of two nearly equal figures, each converged to about 0.1 %).
    // Measured (2026-12-02): classical/field rise 1.47, 1.66, 1.75, 1.52 on the four coils
    // below at 92–112 MHz: the classical figure overstates the rise 1.5–1.75 times.
    use tankwright::model::{
        Coating, Conditions, DiameterSpec, Gauge, SpacingSpec, Tank, Winding, WireSpec, evaluate,
    };
    use tankwright::physics::constants::MU_0;
    let mut report = String::new();
    let mut ratios = Vec::new();
    for (c, tank_pf) in [
        (coil(7.0, 5.0, 1.6, 1.0, 5.0), 20.0),
        (coil(10.0, 5.0, 2.0, 1.0, 5.0), 15.0),
        (coil(12.0, 4.0, 2.5, 1.2, 6.0), 20.0),
        (coil(8.0, 8.0, 1.5, 0.8, 5.0), 10.0),
    ] {
        let winding = Winding {
            diameter: DiameterSpec::Mean(c.mean_diameter),
            wire: WireSpec {
                gauge: Gauge::Metric(2.0 * c.wire_radius),
                coating: Coating::Bare,
            },
            turns: c.turns,
            spacing: SpacingSpec::Length(c.length()),
            lead_length: c.lead_length,
        };
        let a = evaluate(
            &winding,
            &Tank::fixed_only(tank_pf * 1e-12, 0.0),
            &Conditions::default(),
        )
        .expect("valid coil");
        let f = a.resonance;
        let classical = a.apparent_inductance / a.total_inductance - 1.0;
        let m = FieldModel::new(&c, c.segments_per_turn(), Feed::Terminals).expect("model");
        let at = |f: f64| m.impedance(f).expect("impedance").im / (2.0 * PI * f);
        let chi = |f: f64| {
            internal_impedance(c.wire_radius / skin_depth(c.resistivity, f))
                .internal_inductance_fraction
        };
        let internal_fall = MU_0 / (8.0 * PI) * (chi(0.25 * f) - chi(f)) * c.loop_wire_length();
        let base = at(0.25 * f) - internal_fall;
        let field = (at(f) / base - 1.0) * 16.0 / 15.0;
        let ratio = classical / field;
        writeln!(
            report,
            "{} with {tank_pf} pF at {:.1} MHz: classical rise {:.3} %, field rise {:.3} %, ratio {:.2}",
            describe(&c),
            f * 1e-6,
            100.0 * classical,
            100.0 * field,
            ratio
        )
        .expect("string");
        ratios.push(ratio);
    }
    println!("{report}");
    let (lo, hi) = min_max(&ratios);
    println!("classical/field rise {lo:.2}–{hi:.2}");
    // The label on the classical apparent inductance (tuning::field_tank::APPARENT_RISE_BIAS)
    // holds what is measured here, widened by 10 % of itself (see above).
    let b = APPARENT_RISE_BIAS;
    assert!(
        lo >= 0.9 * b.low && hi <= 1.1 * b.high,
        "the classical rise's bias moved:\n{report}"
    );
    assert!(lo <= b.low * (1.0 + SPREAD) && hi >= b.high * (1.0 - SPREAD));
}

// ---------------------------------------------------------------- the tank

/// The model's coil for the same wire as [`coil`] (mean diameter, length N·p, bare wire).
fn model_coil(d_mm: f64, turns: f64, pitch_mm: f64, wire_mm: f64, lead_mm: f64) -> Coil {
    Coil::from_winding(&Winding {
        diameter: DiameterSpec::Mean(d_mm * MM),
        wire: WireSpec {
            gauge: Gauge::Metric(wire_mm * MM),
            coating: Coating::Bare,
        },
        turns,
        spacing: SpacingSpec::Length(turns * pitch_mm * MM),
        lead_length: lead_mm * MM,
    })
    .expect("a valid coil")
}

#[test]
fn tank_resonance_meets_nec2c_reactance() {
    // The tank's field-solved resonance f (tuning::field_tank) is where the coil's terminal
    // reactance meets the capacitance: ω²·C·(X/ω) = 1. Here X comes from nec2c at our f
    // (Burke and Poggio 1981; the deck as in `apparent_inductance_at_vhf_agrees_with_nec2c`,
    // whose leads nec2c cuts into uniform segments as long as the source gap, an independent
    // check of our graded leads). The residual ω²·C·X_nec/ω − 1 is the relative difference of
    // the two reactances, held to the same tolerance as X/ω there: the two solutions'
    // convergence spreads. Coils of our own choosing, 22 pF (an FM tank), leads 5 and 30 mm.
    let mut report = String::new();
    let mut failed = false;
    //
    // Not checked here, measured on this branch: the demo coil (D 7 mm, 1 mm wire, 8 mm long)
    // gives X/ω 104.4 nH (5 mm leads) and 133.5 nH (30 mm leads) against nec2c's 112.3 and
    // 142.7 nH, 7.6 % and 6.9 % apart, beyond both spreads. Its mean diameter is only seven wire
    // diameters: nec2c's helix segments are then 2.7 and 1.4 wire radii long at 16 and 32 a
    // turn, where its thin-wire kernel is outside its stated range (Burke and Poggio 1981,
    // Part III), and ours 4 radii. The disagreement does not depend on the leads (the same
    // with 5 and 30 mm) nor on the graded cut of the leads (uniform segments give the same
    // 133.511 nH): it is the fat-wire limit of both codes, left open.
    for (d, n, p, w, lead) in [
        (10.0, 5.0, 2.0, 1.0, 5.0),
        (10.0, 5.0, 2.0, 1.0, 30.0),
        (10.0, 5.0, 2.0, 0.6, 30.0),
    ] {
        let c = coil(d, n, p, w, lead);
        let model = model_coil(d, n, p, w, lead);
        assert_eq!(wire_coil(&model, 20.0), c, "the same wire");
        let capacitance = 22e-12;
        let tank = field_tank(&model, capacitance, &Conditions::default()).expect("solves");
        let f = tank.resonance;
        let omega = 2.0 * PI * f;
        // Our own X/ω at f is the tank's apparent inductance, and meets the condition to the
        // solver's tolerance.
        let own = ours_inductance(&c, c.segments_per_turn(), f);
        assert!((own / tank.apparent_inductance - 1.0).abs() < 1e-12);
        assert!((omega * omega * capacitance * own - 1.0).abs() < 3e-9);
        let nec = nec_converged(false, |per| nec::impedance(&c, per, f).1 / omega);
        let o = ours_converged(&c, |per| ours_inductance(&c, per, f));
        let residual = omega * omega * capacitance * nec.value - 1.0;
        let tolerance = (nec.spread + o.spread) / nec.value;
        writeln!(
            report,
            "{} with 22 pF: f {:.4} MHz, X/ω ours {:.3} nH, nec2c {:.3} nH; ω²C·X_nec/ω − 1 = {:+.3} % (tolerance {:.3} %)",
            describe(&c),
            f * 1e-6,
            own * 1e9,
            nec.value * 1e9,
            100.0 * residual,
            100.0 * tolerance
        )
        .expect("string");
        failed |= nec.spread > 0.05 * nec.value || o.spread > 0.03 * o.value;
        failed |= residual.abs() > tolerance;
    }
    println!("{report}");
    assert!(
        !failed,
        "the tank's resonance misses nec2c's reactance:\n{report}"
    );
}

#[test]
fn tank_resonance_settles_below_the_self_resonance_for_any_capacitance() {
    // The self-consistent solution (fixed-point step to bracket, then regula falsi on ln f)
    // from 0.2 pF, where the tank sits near the coil's own resonance and X/ω climbs steeply,
    // to 1 nF: always below the self-resonance, self-consistent to 1e-9, and falling as C
    // rises (an identity of the resonance condition).
    let model = model_coil(7.0, 5.0, 1.6, 1.0, 5.0);
    let c = wire_coil(&model, 20.0);
    let mut last = f64::INFINITY;
    for capacitance in [0.2e-12, 1e-12, 5e-12, 22e-12, 100e-12, 1e-9] {
        let tank = field_tank(&model, capacitance, &Conditions::default()).expect("solves");
        let f = tank.resonance;
        assert!(f < tank.self_resonance && f < last, "{capacitance}: {f}");
        let omega = 2.0 * PI * f;
        let x = ours_inductance(&c, c.segments_per_turn(), f);
        assert!(
            (omega * omega * capacitance * x - 1.0).abs() < 3e-9,
            "{capacitance}: {} after {} evaluations",
            omega * omega * capacitance * x - 1.0,
            tank.evaluations
        );
        assert!(tank.evaluations <= 40, "{}", tank.evaluations);
        last = f;
    }
}

/// Issue 24: a Touchstone file made from nec2c's impedance of a coil (not from a lumped
/// network) read back into the coil's figures. The file holds S11 of the coil across one
/// 50 ohm port (Γ = (Z − Z0)/(Z + Z0), Pozar, *Microwave Engineering*, 4th ed., 2012, §2.3), RI
/// form, version 1.1, every 10 MHz from 10 MHz to past the first parallel resonance at the
/// terminals. The references are nec2c's own, taken apart from the file: the resonance from
/// a scan twenty times finer, the low-frequency inductance from X/ω at 10 MHz.
#[test]
fn a_touchstone_file_of_a_coil_solved_by_nec2c_gives_its_figures_back() {
    use num_complex::Complex64;
    use tankwright::instruments::touchstone;
    use tankwright::tuning::measured_coil::fit_measured_coil;
    let c = coil(10.0, 5.0, 2.0, 1.0, 5.0);
    let per = 16;
    let (lo, step) = (10e6, 10e6);
    let z = nec::sweep(&c, per, lo, step, 80);
    // The first parallel resonance: X turns from inductive to capacitive.
    let k = z
        .windows(2)
        .position(|w| w[0].1 > 0.0 && w[1].1 <= 0.0)
        .expect("the sweep passes the self-resonance");
    let top = (k + 8).min(z.len());
    let mut text = String::from("! nec2c's terminal impedance of a 5-turn coil\n# MHz S RI R 50\n");
    for (i, &(r, x)) in z[..top].iter().enumerate() {
        let zz = Complex64::new(r, x);
        let s11 = (zz - 50.0) / (zz + 50.0);
        writeln!(
            text,
            "{:.6} {:.15e} {:.15e}",
            (lo + step * i as f64) * 1e-6,
            s11.re,
            s11.im
        )
        .expect("string");
    }
    let m = touchstone::read(&text, 1).expect("reads");
    let coil_fit = fit_measured_coil(&m.samples, Some(100e6)).expect("fits");

    // nec2c's resonance on a scan twenty times finer across the bracket, located on the
    // susceptance B = Im 1/Z (smooth through the pole of X).
    let f_k = lo + step * k as f64;
    let fine = nec::sweep(&c, per, f_k, step / 20.0, 21);
    let b = |(r, x): (f64, f64)| (1.0 / Complex64::new(r, x)).im;
    let j = fine
        .windows(2)
        .position(|w| w[0].1 > 0.0 && w[1].1 <= 0.0)
        .expect("the resonance in the fine scan");
    let (b0, b1) = (b(fine[j]), b(fine[j + 1]));
    let srf = f_k + step / 20.0 * (j as f64 - b0 / (b1 - b0));
    // The low-frequency inductance: X/ω at 10 MHz, less the lumped rise (f/f₀)² (0.1 %).
    let l_ref = z[0].1 / (2.0 * PI * lo) * (1.0 - (lo / srf).powi(2));

    let seen = coil_fit
        .self_resonance_seen
        .expect("the file crosses the resonance");
    // The file's crossing is interpolated on B over its 10 MHz step: within Δf²/(8f)
    // (linear interpolation of a smooth curve, the fit's stated error).
    let seen_tol = step * step / (8.0 * srf);
    println!(
        "self-resonance: file {:.3} MHz, nec2c fine {:.3} MHz (tolerance {:.3} MHz); network's \
         {:.3} MHz; L {:.3} nH against nec2c's {:.3} nH; C {:.3} pF; Q {:.0} at 100 MHz; \
         residual {:.4}",
        seen * 1e-6,
        srf * 1e-6,
        seen_tol * 1e-6,
        coil_fit.self_resonance * 1e-6,
        coil_fit.inductance * 1e9,
        l_ref * 1e9,
        coil_fit.self_capacitance * 1e12,
        coil_fit.q,
        coil_fit.residual
    );
    assert!((seen - srf).abs() <= seen_tol, "{seen} against {srf}");
    // The lumped network (L–R shunted by C) stands for the distributed coil to within the
    // fit's stated RMS residual on X; its L is held to nec2c's to that residual.
    assert!(
        (coil_fit.inductance / l_ref - 1.0).abs() <= coil_fit.residual.max(1e-3),
        "L {} against {}",
        coil_fit.inductance,
        l_ref
    );
}

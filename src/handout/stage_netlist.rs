//! The oscillator stage as a SPICE netlist: the same circuit the stage's analysis
//! (`tuning::stage`) solves, for a circuit simulator to start from rest. Text only.
//!
//! The coil is the model's at the stage's operating frequency (L in series with its AC
//! resistance, its self-capacitance beside the tank's own capacitors, as in
//! [`crate::tuning::stage::Network`]); the transistor is a Gummel–Poon `.model` carrying the
//! parameters the analysis uses (Berkeley SPICE3's defaults for the rest). The base is held at
//! RF ground by a 1 µF capacitor (common base), the tank meets the base through a 1 µF
//! blocking capacitor (common collector; the Clapp capacitor in its place when there is one): the shorts at RF the analysis takes them for (2 mΩ
//! at 80 MHz; a 10 nF part's 0.2 Ω in series with the divider's side moved ngspice's
//! frequency by 4e-4 in the common-collector stage). A 2 ns current step of 10 µA into the tank's hot end
//! starts the transient from the operating point, so the ring either grows (the stage starts)
//! or dies away.

use crate::tuning::stage::{JunctionCapacitance, StageFigures, StageInputs, Topology};
use crate::units::{to_ma, to_mhz};
use std::fmt::Write as _;

/// The analysis the netlist asks for.
#[derive(Clone, Copy, Debug, PartialEq)]
pub enum StageRun {
    /// The DC operating point (`.op`).
    OperatingPoint,
    /// A transient from the operating point over `stop` seconds, with steps no longer than
    /// `max_step` seconds.
    Transient {
        /// Length of the run, seconds.
        stop: f64,
        /// Longest time step, seconds.
        max_step: f64,
    },
}

/// The netlist of the stage `f` (analysed from `inputs`), with `run`; `extra` lines (e.g. a
/// `.control` block) go before `.end`. Nodes: `vcc`, `base`, `emit`, `col`, and `hot` (the
/// tank's hot end: the collector in the common-base stage, the tank's side of the blocking
/// capacitor in the common-collector one).
pub fn stage_netlist(f: &StageFigures, inputs: &StageInputs, run: StageRun, extra: &str) -> String {
    let n = &f.network;
    let b = &inputs.bias;
    let t = &inputs.transistor;
    let mut out = String::new();
    let w = &mut out;
    let _ = writeln!(
        w,
        "* Tankwright: the {} stage round the tank (ngspice -b THIS_FILE)",
        f.topology.label()
    );
    let _ = writeln!(
        w,
        "* The tool: loop gain {:.4}, operating frequency {:.6} MHz, collector {:.6} mA",
        f.loop_gain,
        to_mhz(f.frequency),
        to_ma(f.operating_point.collector_current)
    );
    let _ = writeln!(w, "Vcc vcc 0 DC {:.9e}", b.supply_v);
    let _ = writeln!(w, "R1 vcc base {:.9e}", b.upper);
    let _ = writeln!(w, "R2 base 0 {:.9e}", b.lower);
    let _ = writeln!(w, "Re emit 0 {:.9e}", b.emitter);
    // The tank's cold end: the supply (common base) or ground (common collector).
    let (cold, tap_from) = match f.topology {
        Topology::CommonBase => ("vcc", "hot"),
        Topology::CommonCollector => ("0", "base"),
    };
    let _ = writeln!(
        w,
        "* The coil (L in series with its AC resistance at the operating frequency)"
    );
    let _ = writeln!(w, "Lcoil {cold} coil_r {:.9e}", n.inductance);
    let _ = writeln!(w, "Rcoil coil_r hot {:.9e}", n.series_resistance);
    let _ = writeln!(
        w,
        "* The tank's own capacitance: self-capacitance, fixed, trimmer and stray"
    );
    let _ = writeln!(w, "Ctank hot {cold} {:.9e}", n.tank_capacitance.max(1e-18));
    let _ = writeln!(w, "* The feedback divider");
    let _ = writeln!(w, "Cdiv_upper {tap_from} emit {:.9e}", n.upper);
    let _ = writeln!(w, "Cdiv_lower emit 0 {:.9e}", n.lower);
    match f.topology {
        Topology::CommonBase => {
            let _ = writeln!(w, "Cbase base 0 1u");
            let _ = writeln!(w, "Vcol hot col DC 0");
        }
        Topology::CommonCollector => match n.clapp {
            Some(c) => {
                let _ = writeln!(
                    w,
                    "* The Clapp series capacitor between the tank and the base"
                );
                let _ = writeln!(w, "Cclapp hot base {c:.9e}");
                let _ = writeln!(w, "Vcol vcc col DC 0");
            }
            None => {
                let _ = writeln!(w, "Cblock hot base 1u");
                let _ = writeln!(w, "Vcol vcc col DC 0");
            }
        },
    }
    let _ = writeln!(w, "Q1 col base emit QSTAGE");
    let (cje, vje, mje) = law_parts(t.base_emitter);
    let (cjc, vjc, mjc) = law_parts(t.base_collector);
    let fc = match t.base_collector {
        JunctionCapacitance::Law(l) => l.forward_knee,
        JunctionCapacitance::Fixed(_) => crate::physics::junction::DEFAULT_FORWARD_KNEE,
    };
    let _ = writeln!(
        w,
        ".model QSTAGE NPN(IS={:.9e} BF={:.9e} CJE={cje:.9e} VJE={vje} MJE={mje} \
         CJC={cjc:.9e} VJC={vjc} MJC={mjc} FC={fc} TF={:.9e})",
        t.saturation_current, t.beta, t.transit_time
    );
    match run {
        StageRun::OperatingPoint => {
            let _ = writeln!(w, ".op");
        }
        StageRun::Transient { stop, max_step } => {
            let _ = writeln!(w, "* A 10 uA, 2 ns kick into the tank's hot end");
            let _ = writeln!(w, "Ikick 0 hot PULSE(0 10u 1n 0.1n 0.1n 2n 1)");
            let _ = writeln!(w, ".tran {max_step:.6e} {stop:.6e} 0 {max_step:.6e}");
        }
    }
    out.push_str(extra);
    if !extra.is_empty() && !extra.ends_with('\n') {
        out.push('\n');
    }
    out.push_str(".end\n");
    out
}

/// CJ, VJ, M of a junction (a fixed capacitance as M = 0: the same at every bias).
fn law_parts(c: JunctionCapacitance) -> (f64, f64, f64) {
    match c {
        JunctionCapacitance::Fixed(c) => (c, 0.75, 0.0),
        JunctionCapacitance::Law(l) => (l.cj0, l.contact_potential, l.grading),
    }
}

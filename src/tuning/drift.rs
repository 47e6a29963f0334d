//! The stability budget: how far each usual cause moves the carrier, the sum, and whether it
//! stays on its channel.

use super::modulation::Modulator;
use crate::model::{Coil, Conditions, evaluate::resonance_of};
use crate::physics::copper::LINEAR_EXPANSION;
use crate::physics::dielectric_class::TemperatureClass;

/// A cause of drift.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum DriftSource {
    /// The supply voltage changes and the junction's bias follows it.
    Supply,
    /// Copper's expansion scales the coil.
    CoilExpansion,
    /// The fixed capacitor's temperature coefficient.
    FixedCapacitorTemperature,
    /// The junction's capacitance changes with temperature.
    JunctionTemperature,
    /// A hand near the coil.
    Hand,
    /// The load (antenna, next stage) changes.
    Load,
}

impl DriftSource {
    /// Name shown.
    pub fn label(self) -> &'static str {
        match self {
            DriftSource::Supply => "supply voltage",
            DriftSource::CoilExpansion => "coil expansion with temperature",
            DriftSource::FixedCapacitorTemperature => "fixed capacitor with temperature",
            DriftSource::JunctionTemperature => "junction with temperature",
            DriftSource::Hand => "hand near the coil",
            DriftSource::Load => "load change",
        }
    }

    /// Key for machine-readable output.
    pub fn key(self) -> &'static str {
        match self {
            DriftSource::Supply => "supply",
            DriftSource::CoilExpansion => "coil_expansion",
            DriftSource::FixedCapacitorTemperature => "fixed_capacitor_temperature",
            DriftSource::JunctionTemperature => "junction_temperature",
            DriftSource::Hand => "hand",
            DriftSource::Load => "load",
        }
    }

    /// SI unit of the change: volts, kelvin or farads.
    pub fn unit(self) -> &'static str {
        match self {
            DriftSource::Supply => "V",
            DriftSource::CoilExpansion
            | DriftSource::FixedCapacitorTemperature
            | DriftSource::JunctionTemperature => "K",
            DriftSource::Hand | DriftSource::Load => "F",
        }
    }

    /// The usual remedy, in a sentence (common practice).
    pub fn remedy(self) -> &'static str {
        match self {
            DriftSource::Supply => {
                "Regulate the oscillator's supply (a zener or a small regulator) so the \
                 junction's bias cannot follow the battery down."
            }
            DriftSource::CoilExpansion => {
                "Wind stiff wire on a rigid former, and offset the coil's drift with a tank \
                 capacitor of a small negative coefficient (N030–N150)."
            }
            DriftSource::FixedCapacitorTemperature => {
                "Use C0G/NP0 capacitors in the tank (or a class chosen to cancel the coil's \
                 drift)."
            }
            DriftSource::JunctionTemperature => {
                "Keep the junction's share of the tank small: a larger tank capacitance, or \
                 couple the junction through a small capacitor."
            }
            DriftSource::Hand => {
                "Put the oscillator in a metal box or behind a shield, ground the trimmer's \
                 rotor, and tune with an insulated tool."
            }
            DriftSource::Load => {
                "Add a buffer stage between the oscillator and the antenna, and couple the \
                 load loosely."
            }
        }
    }
}

/// The changes to budget for (SI).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct DriftInputs {
    /// Supply voltage the bias is set at, volts.
    pub supply_v: f64,
    /// Change of the supply, volts (e.g. −2 for a 9 V battery running down to 7 V).
    pub supply_change_v: f64,
    /// Temperature change, kelvin.
    pub temperature_change_k: f64,
    /// The fixed capacitor's temperature-coefficient class.
    pub fixed_class: TemperatureClass,
    /// A hand near the coil: capacitance added across the tank, farads (0.5–2 pF: common
    /// practice).
    pub hand: f64,
    /// Load change: capacitance added across the tank, farads.
    pub load: f64,
    /// Channel tolerance: how far the carrier may move, ± hertz.
    pub channel_tolerance: f64,
}

/// The changes budgeted when the builder gives none (common practice for a small battery
/// oscillator on the bench): a 9 V battery running down to 7 V, 20 K warmer, a C0G fixed
/// capacitor, a hand near the coil (1 pF) and a load change (0.5 pF). The window's audio panel
/// and `tankwright evaluate` both start from these.
pub struct UsualChanges;

impl UsualChanges {
    /// Supply voltage the bias is set at, volts.
    pub const SUPPLY_V: f64 = 9.0;
    /// Change of the supply, volts.
    pub const SUPPLY_CHANGE_V: f64 = -2.0;
    /// Temperature change, kelvin.
    pub const TEMPERATURE_CHANGE_K: f64 = 20.0;
    /// The fixed capacitor's class code.
    pub const CLASS: &'static str = "C0G";
    /// A hand near the coil, farads.
    pub const HAND: f64 = 1e-12;
    /// A load change, farads.
    pub const LOAD: f64 = 0.5e-12;
}

/// The tank as the drift budget needs it.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct DriftTank {
    /// The fixed capacitor, farads (the part the class applies to).
    pub fixed: f64,
    /// Everything else external except the junction, farads.
    pub other: f64,
    /// The junction across the tank and its reverse bias, volts, if there is one.
    pub junction: Option<(Modulator, f64)>,
}

/// One line of the budget.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct DriftLine {
    /// The cause.
    pub source: DriftSource,
    /// The change assumed, in the unit of [`DriftSource::unit`].
    pub change: f64,
    /// The carrier's shift, hertz (signed).
    pub shift: f64,
}

/// The whole budget.
#[derive(Clone, Debug, PartialEq)]
pub struct DriftBudget {
    /// The carrier before any change, hertz.
    pub carrier: f64,
    /// One line per cause.
    pub lines: Vec<DriftLine>,
    /// Sum of the signed shifts (every change at once, as entered), hertz.
    pub total: f64,
    /// Sum of the shifts' sizes (each the worst way), hertz.
    pub worst_case: f64,
    /// The worst case stays within the channel tolerance.
    pub within_tolerance: bool,
    /// The channel tolerance judged against, ± hertz.
    pub channel_tolerance: f64,
    /// The cause with the largest shift.
    pub dominant: Option<DriftSource>,
    /// Remedies, the dominant cause's first, then any other cause above a quarter of the
    /// tolerance.
    pub remedies: Vec<&'static str>,
}

/// The drift budget of `coil` in `tank`.
///
/// # Formula
/// Each shift is the engine's resonance with the one change applied less the carrier:
/// supply — the junction's bias scaled by (V_s + ΔV_s)/V_s (the bias divider follows the
/// supply); coil — every dimension × (1 + α_Cu·ΔT) with α_Cu = 16.5·10⁻⁶/K, and the wire's
/// resistivity at the new temperature; fixed capacitor — C × (1 + TC·ΔT) with the class's
/// nominal TC (IEC 60384-8 / EIA-198); junction — the law warmed by ΔT by SPICE's
/// temperature law ([`crate::physics::junction::JunctionLaw::at_temperature`], its
/// parameters taken at the working temperature); hand and load — their
/// capacitance added across the tank.
pub fn drift_budget(
    coil: &Coil,
    tank: &DriftTank,
    conditions: &Conditions,
    inputs: &DriftInputs,
) -> DriftBudget {
    let junction_c = |m: &Modulator, v: f64| m.across_tank(v);
    let base_junction = tank.junction.map_or(0.0, |(m, v)| junction_c(&m, v));
    let external = tank.fixed + tank.other + base_junction;
    let carrier = resonance_of(coil, external, conditions);
    let shift_with = |c: f64| resonance_of(coil, c, conditions) - carrier;
    let dt = inputs.temperature_change_k;
    let mut lines = Vec::new();
    if let Some((m, bias)) = tank.junction
        && inputs.supply_v > 0.0
    {
        let v = bias * (inputs.supply_v + inputs.supply_change_v) / inputs.supply_v;
        lines.push(DriftLine {
            source: DriftSource::Supply,
            change: inputs.supply_change_v,
            shift: shift_with(external - base_junction + junction_c(&m, v)),
        });
    }
    let warm = Conditions {
        temperature_c: conditions.temperature_c + dt,
        ..*conditions
    };
    lines.push(DriftLine {
        source: DriftSource::CoilExpansion,
        change: dt,
        shift: resonance_of(&coil.scaled(1.0 + LINEAR_EXPANSION * dt), external, &warm) - carrier,
    });
    // The class's nominal coefficient is not a promise: any part of it may lie anywhere in
    // ±its tolerance (C0G/NP0: 0 ± 30 ppm/K, EIA-198 / IEC 60384-8). The budget books the
    // worse end, so a C0G capacitor is never counted as drifting not at all.
    let class = inputs.fixed_class;
    let fixed_shift = |ppm: f64| shift_with(external + tank.fixed * ppm * 1e-6 * dt);
    let (a, b) = (
        fixed_shift(class.ppm_per_k - class.tolerance_ppm_per_k),
        fixed_shift(class.ppm_per_k + class.tolerance_ppm_per_k),
    );
    lines.push(DriftLine {
        source: DriftSource::FixedCapacitorTemperature,
        change: dt,
        shift: if a.abs() >= b.abs() { a } else { b },
    });
    if let Some((m, bias)) = tank.junction {
        let warm_m = Modulator {
            law: m
                .law
                .at_temperature(conditions.temperature_c, conditions.temperature_c + dt),
            ..m
        };
        lines.push(DriftLine {
            source: DriftSource::JunctionTemperature,
            change: dt,
            shift: shift_with(external - base_junction + junction_c(&warm_m, bias)),
        });
    }
    lines.push(DriftLine {
        source: DriftSource::Hand,
        change: inputs.hand,
        shift: shift_with(external + inputs.hand),
    });
    lines.push(DriftLine {
        source: DriftSource::Load,
        change: inputs.load,
        shift: shift_with(external + inputs.load),
    });
    let total = lines.iter().map(|l| l.shift).sum();
    let worst_case: f64 = lines.iter().map(|l| l.shift.abs()).sum();
    let dominant = lines
        .iter()
        .max_by(|a, b| a.shift.abs().total_cmp(&b.shift.abs()))
        .map(|l| l.source);
    let mut remedies = Vec::new();
    if let Some(d) = dominant {
        remedies.push(d.remedy());
    }
    for l in &lines {
        if Some(l.source) != dominant && l.shift.abs() > 0.25 * inputs.channel_tolerance {
            remedies.push(l.source.remedy());
        }
    }
    DriftBudget {
        carrier,
        lines,
        total,
        worst_case,
        within_tolerance: worst_case <= inputs.channel_tolerance,
        channel_tolerance: inputs.channel_tolerance,
        dominant,
        remedies,
    }
}

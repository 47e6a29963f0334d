//! The readable report of an [`Analysis`].

use crate::model::{Analysis, InductanceModel};
use crate::tuning::apparent::apparent_inductance;
use crate::tuning::digits;
use crate::tuning::field_tank::{
    APPARENT_RISE_BIAS, FieldBasis, HELICAL_SELF_RESONANCE_BIAS, LUMPED_SELF_RESONANCE_BIAS,
};
use crate::units::{to_mhz, to_mm, to_nh, to_pf, to_um};

/// A plain-text report with units, one figure a line.
pub fn analysis_report(a: &Analysis) -> String {
    let g = &a.coil;
    let i = &a.inductance;
    let mut s = String::new();
    let mut line = |t: String| {
        s.push_str(&t);
        s.push('\n');
    };
    line("Coil".to_owned());
    line(format!(
        "  mean diameter      {:>10.3} mm   (former {:.3} mm)",
        to_mm(g.mean_diameter()),
        to_mm(g.former_diameter())
    ));
    line(format!(
        "  wire               {:>10.3} mm bare, {:.3} mm overall",
        to_mm(g.wire_bare()),
        to_mm(g.wire_overall())
    ));
    line(format!("  turns              {:>10.2}", g.turns()));
    line(format!(
        "  length (N x pitch) {:>10.3} mm   pitch {:.3} mm, gap {:.3} mm",
        to_mm(g.length()),
        to_mm(g.pitch()),
        to_mm(g.gap())
    ));
    line(format!(
        "  l/D                {:>10.3}",
        g.length_over_diameter()
    ));
    line(format!(
        "  wire to cut        {:>13}   (helix plus two {:.1} mm leads)",
        crate::tuning::digits::wire_to_cut_mm(g.wire_length()),
        to_mm(g.lead_length())
    ));
    line("Inductance (coil only)".to_owned());
    line(format!(
        "  Nagaoka K_N        {:>10.6}",
        a.nagaoka_coefficient
    ));
    for m in InductanceModel::ALL {
        let mark = if m == a.model {
            "  <- drives the resonance"
        } else {
            ""
        };
        match i.by_model(m) {
            Some(v) => line(format!("  {:<18} {:>10.2} nH{mark}", m.label(), to_nh(v))),
            None => line(format!("  {:<18} {:>10}", m.label(), "not computed")),
        }
        if m == InductanceModel::RoundWire {
            line(format!(
                "  {:<18} {:>10.2} nH",
                "  (uniform current)",
                to_nh(i.round_wire_low_freq)
            ));
        }
    }
    line(format!("  leads (both)       {:>10.2} nH", to_nh(i.leads)));
    line(format!(
        "  total              {:>10.2} nH",
        to_nh(a.total_inductance)
    ));
    line(format!(
        "  apparent           {}",
        match apparent_inductance(a) {
            Ok(l) => format!(
                "{:>10.2} nH   at the resonance, L/(1 - (f/f_self)^2); its rise over L \
                 measures {} rise",
                to_nh(l),
                APPARENT_RISE_BIAS.in_words()
            ),
            Err(why) => why.reason().to_owned(),
        }
    ));
    line("Capacitance".to_owned());
    line(format!(
        "  self (Medhurst)    {:>10.3} pF   H = {:.3}",
        to_pf(a.self_capacitance),
        a.medhurst_factor
    ));
    line(format!(
        "  external           {:>10.3} pF",
        to_pf(a.external_capacitance)
    ));
    line(format!(
        "  total              {:>10.3} pF",
        to_pf(a.total_capacitance)
    ));
    line("Resonance".to_owned());
    line(format!(
        "  tank               {:>10} MHz",
        digits::mhz_plain(a.resonance)
    ));
    line(format!(
        "  self, lumped       {:>14}   (measured {} against the field solution)",
        digits::self_resonance(a.self_resonance.lumped),
        LUMPED_SELF_RESONANCE_BIAS.in_words()
    ));
    line(format!(
        "  self, helical line {:>14}   (measured {} against the field solution)",
        digits::self_resonance(a.self_resonance.helical),
        HELICAL_SELF_RESONANCE_BIAS.in_words()
    ));
    line("Loss".to_owned());
    line(format!(
        "  skin depth         {:>10.2} µm",
        to_um(a.skin_depth)
    ));
    line(format!(
        "  R_ac / R_dc        {:>10.2}   proximity factor {:.2}",
        a.skin_resistance_ratio, a.proximity_factor
    ));
    line(format!(
        "  AC resistance      {:>10.4} ohm (DC {:.4} ohm)",
        a.ac_resistance, a.dc_resistance
    ));
    line(format!("  Q                  {:>10.0}", a.q));
    if !a.warnings.is_empty() {
        line("Warnings".to_owned());
        for w in &a.warnings {
            line(format!("  - {}", w.message));
        }
    }
    s
}

/// The field solution's lines for the report: the field-solved tank and how it moved the
/// model (see [`crate::tuning::field_tank::FieldBasis`]); `classical` is the model before it.
/// `calibrated`: bench readings calibrate the model on top (the calibration then leads).
pub fn field_report(classical: &Analysis, basis: &FieldBasis, calibrated: bool) -> String {
    let mut s = String::from("Field solution (the wire solved from its own currents)\n");
    match basis {
        FieldBasis::Solved { tank: f, scale } => {
            s.push_str(&format!(
                "  tank               {:>10.4} MHz   apparent inductance {:.2} nH (X/omega)\n",
                to_mhz(f.resonance),
                to_nh(f.apparent_inductance)
            ));
            s.push_str(&format!(
                "  self-resonance     {:>10.0} MHz   (first parallel, at the terminals)\n",
                to_mhz(f.self_resonance)
            ));
            s.push_str(&format!(
                "  series resistance  {:>10.4} ohm   Q {:.0} (skin effect and radiation only)\n",
                f.series_resistance,
                f.q()
            ));
            s.push_str(&format!("  segments           {:>10}\n", f.segments));
            s.push_str(&format!(
                "  inductance (meter) {:>10.2} nH   what an LCR meter reads, well below the \
                 self-resonance\n",
                to_nh(f.low_frequency_inductance)
            ));
            s.push_str(&format!(
                "  self-capacitance   {:>10.3} pF   (resonates it at the self-resonance)\n",
                to_pf(f.self_capacitance())
            ));
            // This coil's own ratios of the classical estimates to the field solution (the
            // range measured over many coils stands beside each estimate above).
            for (what, classical_value, field_value) in [
                (
                    "Medhurst's self-capacitance",
                    classical.self_capacitance,
                    f.self_capacitance(),
                ),
                (
                    "lumped self-resonance",
                    classical.self_resonance.lumped,
                    f.self_resonance,
                ),
                (
                    "helical self-resonance",
                    classical.self_resonance.helical,
                    f.self_resonance,
                ),
            ] {
                if let Some(words) =
                    crate::tuning::field_tank::ratio_in_words(classical_value, field_value)
                {
                    s.push_str(&format!("  this coil: {what} is {words}\n"));
                }
            }
            let lead = if calibrated {
                "the bench calibration leads, on the model moved onto the field solution"
            } else {
                "the field-solved resonance leads"
            };
            s.push_str(&format!(
                "  {lead}: the model's inductance x {scale:.4} meets it\n  (classical model \
                 alone: {:.4} MHz)\n",
                to_mhz(classical.resonance)
            ));
        }
        FieldBasis::Held { scale } => s.push_str(&format!(
            "  an earlier coil's factor {scale:.4} on the model's inductance is held\n"
        )),
        FieldBasis::Classical { why } => {
            s.push_str(&format!("  not available: {why}\n"));
            s.push_str(if calibrated {
                "  the bench calibration leads, on the classical model\n"
            } else {
                "  the classical resonance leads\n"
            });
        }
    }
    s
}

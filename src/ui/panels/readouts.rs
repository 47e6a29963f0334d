//! The readouts: every figure of the analysis with its unit, method and cautions, or the
//! reason the input was refused.

use super::{heading, model_dots};
use crate::model::{InputError, WarningTopic};
use crate::recipe::{FieldBasis, Figures, Unled};
use crate::tuning::apparent::apparent_inductance;
use crate::tuning::digits;
use crate::tuning::field_tank::{
    APPARENT_RISE_BIAS, HELICAL_SELF_RESONANCE_BIAS, LUMPED_SELF_RESONANCE_BIAS,
};
use crate::ui::evaluation::Evaluation;
use crate::ui::theme;
use crate::ui::units::LengthUnit;
use crate::ui::widgets::{Readout, caution_mark, cautions_line};
use crate::units::{to_nh, to_pf};
use eframe::egui::{self, RichText};

/// Inductance in nanohenries with its unit.
/// The hover beside a classical self-resonance estimate's ratio to the field solution.
const RATIO_HOVER: &str = "This coil's classical estimate over its field-solved self-resonance \
     (while the field solution is not at hand: the range measured against it on isolated \
     coils of 6–25 mm and 3–12 turns)";

/// This coil's own ratio of a classical self-resonance estimate to the field solution's,
/// in words, while the field solution is solved for this coil.
fn own_ratio(classical: f64, figures: &Figures) -> Option<String> {
    match &figures.field {
        FieldBasis::Solved { tank, .. } => {
            crate::tuning::field_tank::ratio_in_words(classical, tank.self_resonance)
        }
        _ => None,
    }
}

fn show_nh(henries: f64) -> String {
    format!("{:.1} nH", to_nh(henries))
}

/// Capacitance in picofarads with its unit.
fn show_pf(farads: f64) -> String {
    format!("{:.2} pF", to_pf(farads))
}

/// Heading of the readouts (and the name of their fold).
pub const READOUTS_HEADING: &str = "Readouts";

/// Name of the readout that leads: the resonance that drives every figure.
pub const RESONANCE: &str = "Resonance";
/// Name of the readout with the field-solved resonance, shown when it does not lead.
pub const FIELD_RESONANCE: &str = "Resonance, field-solved";
/// Name of the readout with the classical model's resonance, shown when it does not lead.
pub const CLASSICAL_RESONANCE: &str = "Resonance, classical model";
/// What the field-solved readout shows while the field solution is being computed.
pub const BEING_COMPUTED: &str = "being computed";
/// What the field-solved readout shows while the field solution is switched off.
pub const SWITCHED_OFF: &str = "switched off";
/// Word after the resonance when the model is calibrated on bench readings.
pub const CALIBRATED: &str = "calibrated";
/// Word after the resonance when the field solution sets it.
pub const FIELD_SOLVED: &str = "field-solved";
/// Word after the resonance while the field solution of a changed coil is computed (the
/// factor found for the coil before is held).
pub const UPDATING: &str = "updating";
/// Word after the resonance when it is the classical model's alone.
pub const MODEL: &str = "model";

/// Show the readouts for the present recipe under a fold (open to begin with when `open`),
/// or, never folded, why the recipe was refused. The resonance that leads is the one the
/// verdict, the charts and the advice use: field-solved when the field solution is there,
/// calibrated once there are bench readings, the classical model's otherwise; the others are
/// shown beneath it with their difference from it.
pub fn show(ui: &mut egui::Ui, evaluation: &Evaluation, unit: LengthUnit, open: bool) {
    match evaluation.current() {
        Ok(figures) => {
            egui::CollapsingHeader::new(RichText::new(READOUTS_HEADING).heading())
                .id_salt("readouts")
                .default_open(open)
                .show(ui, |ui| figures_rows(ui, figures, unit));
        }
        Err(error) => {
            heading(ui, READOUTS_HEADING);
            refusal(ui, error, evaluation.latest().is_some());
        }
    }
}

/// The reason the input was refused, in place of the readouts. `last_drawn`: an earlier
/// coil could be built and is still drawn (the centre says so); otherwise (a refused recipe
/// opened at the start) there is nothing drawn, and this says the same as the centre.
fn refusal(ui: &mut egui::Ui, error: &InputError, last_drawn: bool) {
    egui::Frame::new()
        .fill(theme::refusal_fill(ui))
        .stroke(egui::Stroke::new(1.0, theme::refusal(ui)))
        .corner_radius(4.0)
        .inner_margin(10.0)
        .show(ui, |ui| {
            ui.set_width(ui.available_width());
            ui.horizontal(|ui| {
                caution_mark(ui);
                ui.label(
                    RichText::new(format!(
                        "The {} cannot be built as given",
                        error.field.label()
                    ))
                    .strong()
                    .size(16.0)
                    .color(theme::refusal(ui)),
                );
            });
            ui.add(egui::Label::new(RichText::new(&error.reason).color(theme::refusal(ui))).wrap());
            ui.add_space(4.0);
            ui.label(if last_drawn {
                "Nothing you typed is lost: correct the value and the figures return. The \
                 drawing and charts show the last coil that could be built."
            } else {
                "Nothing you typed is lost: correct the value and the figures return, with the \
                 drawing and charts (no coil of this recipe could be built yet)."
            });
        });
}

/// The word after the resonance and what it means.
fn lead_mark(figures: &Figures) -> (&'static str, String) {
    if figures.calibrated() {
        return (
            CALIBRATED,
            format!(
                "The model calibrated on {} bench reading(s): the fitted stray and inductance \
                 factor applied",
                figures.readings_used()
            ),
        );
    }
    match &figures.field {
        FieldBasis::Solved { tank, scale } => (
            FIELD_SOLVED,
            format!(
                "The coil solved from its own currents (thin-wire method of moments, with its \
                 leads and the path beneath it): the tank resonates where the terminal \
                 reactance X meets the capacitance, f = 1/(2π√((X/ω)·C)), with X/ω = {} there. \
                 The model's inductance × {scale:.4} meets it, so the charts and the advice \
                 follow it. Record a bench reading to calibrate",
                show_nh(tank.apparent_inductance)
            ),
        ),
        FieldBasis::Held { scale } => (
            UPDATING,
            format!(
                "The coil changed: its field solution is being computed; meanwhile the factor \
                 × {scale:.4} found for the coil before is held on the model's inductance"
            ),
        ),
        FieldBasis::Classical { why } => (
            MODEL,
            format!("The classical model alone ({why}). Record a bench reading to calibrate"),
        ),
    }
}

fn figures_rows(ui: &mut egui::Ui, figures: &Figures, unit: LengthUnit) {
    let a = &figures.analysis;
    let (word, how) = lead_mark(figures);
    Readout::new(
        RESONANCE,
        digits::mhz(a.resonance),
        "The figure the verdict, the charts and the advice use: 1/(2π√(LC)) with the driving \
         model's inductance plus the leads (scaled to the field solution when it leads, and by \
         the calibration) and the total capacitance (Medhurst's self-capacitance added), \
         iterated until the frequency-dependent terms settle",
    )
    .emphasis(true)
    .note(word, how)
    .warnings(a.warnings_about(WarningTopic::Band))
    .show(ui);
    let lead = a.resonance;
    let beside = |f: f64| format!("{} ({})", digits::mhz(f), digits::offset(f - lead));
    let field_leads = word == FIELD_SOLVED;
    if !field_leads {
        let (value, more) = match &figures.field {
            FieldBasis::Solved { tank, .. } => (
                beside(tank.resonance),
                format!(
                    "Before the bench readings; in brackets: from the resonance above. \
                     Apparent inductance X/ω there {}",
                    show_nh(tank.apparent_inductance)
                ),
            ),
            FieldBasis::Held { .. } => (BEING_COMPUTED.to_owned(), String::new()),
            FieldBasis::Classical {
                why: Unled::Pending,
            } => (BEING_COMPUTED.to_owned(), String::new()),
            FieldBasis::Classical {
                why: why @ Unled::SwitchedOff,
            } => (SWITCHED_OFF.to_owned(), format!("{why}.")),
            FieldBasis::Classical { why } => ("not available".to_owned(), format!("Why: {why}.")),
        };
        Readout::new(
            FIELD_RESONANCE,
            value,
            "The coil solved from its own currents (thin-wire method of moments, with its \
             leads and the path beneath it), the tank where its terminal reactance meets the \
             capacitance",
        )
        .more(move || more.clone())
        .show(ui);
    }
    if field_leads || figures.calibrated() || matches!(figures.field, FieldBasis::Held { .. }) {
        Readout::new(
            CLASSICAL_RESONANCE,
            beside(figures.classical.resonance),
            "The classical model alone: the driving inductance method with the leads and \
             Medhurst's self-capacitance, no field solution, no bench readings. In brackets: \
             from the resonance above",
        )
        .show(ui);
    }
    ui.add_space(4.0);
    ui.label(RichText::new("Inductance of the coil (without leads), by method").strong());
    model_dots::show(ui, a);
    for warning in a.warnings_about(WarningTopic::Inductance) {
        cautions_line(ui, &warning.message);
    }
    Readout::new(
        "Leads",
        show_nh(a.inductance.leads),
        "Both straight leads as round wires (Rosa 1908, Grover 1946), internal inductance at \
         the resonance",
    )
    .warnings(a.warnings_about(WarningTopic::Leads))
    .show(ui);
    Readout::new(
        "Total inductance",
        show_nh(a.total_inductance),
        "The driving model's coil inductance plus both leads (times the field solution's factor \
         when it leads, and the calibration's once there are readings)",
    )
    .show(ui);
    let classical_note = "L/(1 − (f/f_self)²) with the lumped self-resonance: what a bridge \
                          would read across the coil at the resonance";
    // With a field solution, its X/ω (the classical model alone beside it); without, the
    // classical formula on the driving model (calibrated once there are readings).
    match (figures.field.tank(), apparent_inductance(a)) {
        (Some(tank), _) => {
            let more = match apparent_inductance(&figures.classical) {
                Ok(l) => format!(
                    "The classical estimate, {classical_note}: {} (its rise over L measures {} \
                     rise on FM coils)",
                    show_nh(l),
                    APPARENT_RISE_BIAS.in_words()
                ),
                Err(why) => format!("The classical estimate is not shown: {}", why.reason()),
            };
            Readout::new(
                "Apparent inductance",
                show_nh(tank.apparent_inductance),
                "X/ω at the terminals at the field-solved resonance: what a bridge would read \
                 across the coil there (the coil, its leads and the path beneath it)",
            )
            .note(FIELD_SOLVED, "From the field solution")
            .more(move || more.clone())
            .show(ui);
        }
        (None, Ok(l)) => Readout::new("Apparent inductance", show_nh(l), classical_note)
            .more(|| {
                format!(
                    "Its rise over L measures {} rise on FM coils",
                    APPARENT_RISE_BIAS.in_words()
                )
            })
            .show(ui),
        (None, Err(why)) => {
            Readout::new(
                "Apparent inductance",
                "not shown".to_owned(),
                classical_note,
            )
            .show(ui);
            ui.add(egui::Label::new(RichText::new(why.reason()).small().weak()).wrap());
        }
    }

    ui.add_space(4.0);
    Readout::new(
        "Self-capacitance",
        show_pf(a.self_capacitance),
        "Medhurst 1947 table: H × diameter in cm (pF), coil standing on one end, about ±5 %",
    )
    .warnings(a.warnings_about(WarningTopic::SelfCapacitance))
    .show(ui);
    Readout::new(
        "Total capacitance",
        show_pf(a.total_capacitance),
        "Fixed capacitor, trimmer at its setting, stray and the feedback divider in series, plus \
         the coil's self-capacitance (counted once)",
    )
    .warnings(a.warnings_about(WarningTopic::Tank))
    .show(ui);
    Readout::new(
        "Self-resonance, lumped",
        digits::self_resonance(a.self_resonance.lumped),
        "1/(2π√(L·C_self)) with Medhurst's self-capacitance: the usual first estimate",
    )
    .note(
        own_ratio(a.self_resonance.lumped, figures)
            .unwrap_or_else(|| LUMPED_SELF_RESONANCE_BIAS.in_words()),
        RATIO_HOVER,
    )
    .show(ui);
    Readout::new(
        "Self-resonance, field",
        match &figures.field {
            FieldBasis::Solved { tank, .. } => digits::self_resonance(tank.self_resonance),
            FieldBasis::Held { .. } => BEING_COMPUTED.to_owned(),
            FieldBasis::Classical {
                why: Unled::Pending,
            } => BEING_COMPUTED.to_owned(),
            FieldBasis::Classical {
                why: Unled::SwitchedOff,
            } => SWITCHED_OFF.to_owned(),
            FieldBasis::Classical { .. } => "not available".to_owned(),
        },
        "First parallel self-resonance at the terminals from the field solution (the wire, its \
         leads and the path beneath the coil)",
    )
    .show(ui);
    Readout::new(
        "Self-resonance, helical",
        digits::self_resonance(a.self_resonance.helical),
        "Half-wave resonance of the helix as a slow-wave line with the Kandoian–Sichak \
         velocity factor",
    )
    .note(
        own_ratio(a.self_resonance.helical, figures)
            .unwrap_or_else(|| HELICAL_SELF_RESONANCE_BIAS.in_words()),
        RATIO_HOVER,
    )
    .warnings(a.warnings_about(WarningTopic::SelfResonance))
    .show(ui);

    ui.add_space(4.0);
    Readout::new(
        "Q, unloaded",
        format!("{:.0}", a.q),
        "ωL/R_ac: skin effect from the round wire's internal impedance, the proximity factor of \
         an infinite row of turns (Rayleigh's multipole method) and copper resistivity at the \
         wire temperature (IEC 60028)",
    )
    .emphasis(true)
    .warnings(a.warnings_about(WarningTopic::Loss))
    .show(ui);
    Readout::new(
        "AC resistance",
        format!("{:.3} Ω", a.ac_resistance),
        "Coil and leads at the resonance: DC resistance × skin-effect ratio, with the proximity \
         factor on the coil's wire",
    )
    .show(ui);
    Readout::new(
        "Wire to cut",
        unit.show_wire_to_cut(a.coil.wire_length()),
        "Helix √((πD)² + p²) per turn times the turns, plus both leads; to the millimetre, \
         as the report and the build sheet state it (the leads are trimmed after soldering)",
    )
    .emphasis(true)
    .show(ui);
    Readout::new(
        "Length ÷ diameter",
        format!("{:.2}", a.coil.length_over_diameter()),
        "Coil length (turns × pitch) over the mean diameter",
    )
    .show(ui);
}

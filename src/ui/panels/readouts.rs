//! The readouts: every figure of the analysis with its unit, method and cautions, or the
//! reason the input was refused.

use super::{heading, model_dots};
use crate::model::{InputError, WarningTopic};
use crate::tuning::apparent::apparent_inductance;
use crate::tuning::digits;
use crate::tuning::field_tank::{InductanceSource, leading};
use crate::ui::evaluation::Evaluation;
use crate::ui::field_worker::FieldWorker;
use crate::ui::theme;
use crate::ui::units::{LengthUnit, nh, pf};
use crate::ui::widgets::{Readout, caution_mark, cautions_line};
use eframe::egui::{self, RichText};

/// Inductance in nanohenries with its unit.
fn show_nh(henries: f64) -> String {
    format!("{:.1} nH", nh(henries))
}

/// Capacitance in picofarads with its unit.
fn show_pf(farads: f64) -> String {
    format!("{:.2} pF", pf(farads))
}

/// Heading of the readouts (and the name of their fold).
pub const READOUTS_HEADING: &str = "Readouts";

/// Name of the readout with the field-solved resonance, shown beside the model's.
pub const FIELD_RESONANCE: &str = "Resonance, field-solved";
/// What that readout shows while the field solution is being computed.
pub const BEING_COMPUTED: &str = "being computed";
/// Word after the resonance when the model is calibrated on bench readings.
pub const CALIBRATED: &str = "calibrated";
/// Word after the resonance when it is the model's, not yet calibrated.
pub const MODEL: &str = "model";

/// Show the readouts for the present recipe under a fold (open to begin with when `open`),
/// or, never folded, why the recipe was refused. The resonance is the model's (calibrated once
/// there are bench readings): the one the verdict, the charts and the advice use; the field
/// solution's is shown beside it once `field` has it, with the difference.
pub fn show(
    ui: &mut egui::Ui,
    evaluation: &Evaluation,
    unit: LengthUnit,
    open: bool,
    field: &FieldWorker,
) {
    match evaluation.current() {
        Ok(figures) => {
            egui::CollapsingHeader::new(RichText::new(READOUTS_HEADING).heading())
                .id_salt("readouts")
                .default_open(open)
                .show(ui, |ui| figures_rows(ui, figures, unit, field));
        }
        Err(error) => {
            heading(ui, READOUTS_HEADING);
            refusal(ui, error);
        }
    }
}

/// The reason the input was refused, in place of the readouts.
fn refusal(ui: &mut egui::Ui, error: &InputError) {
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
            ui.label(
                "Nothing you typed is lost: correct the value and the figures return. The \
                 drawing and charts show the last coil that could be built.",
            );
        });
}

fn figures_rows(
    ui: &mut egui::Ui,
    figures: &crate::recipe::Figures,
    unit: LengthUnit,
    field: &FieldWorker,
) {
    let a = &figures.analysis;
    let solved = field.ready().map(|r| &r.tank);
    let (word, how) = if figures.calibrated() {
        (
            CALIBRATED,
            format!(
                "The model calibrated on {} bench reading(s): the fitted stray and inductance \
                 scale applied",
                figures.readings_used()
            ),
        )
    } else {
        (
            MODEL,
            "Not yet calibrated: record a bench reading to correct it".to_owned(),
        )
    };
    Readout::new(
        "Resonance",
        digits::mhz(a.resonance),
        "1/(2π√(LC)) with the driving model's inductance plus the leads and the total \
         capacitance (Medhurst's self-capacitance added), iterated until the \
         frequency-dependent terms settle: the figure the verdict, the charts and the advice use",
    )
    .emphasis(true)
    .note(word, how)
    .warnings(a.warnings_about(WarningTopic::Band))
    .show(ui);
    let lead = leading(&figures.uncalibrated, solved, false);
    Readout::new(
        FIELD_RESONANCE,
        match (solved, lead.source) {
            (Some(Ok(_)), InductanceSource::FieldSolved) => format!(
                "{} ({})",
                digits::mhz(lead.resonance),
                digits::offset(lead.resonance - a.resonance)
            ),
            (Some(Err(_)), _) | (Some(Ok(_)), InductanceSource::Classical) => {
                "not available".to_owned()
            }
            (None, _) => BEING_COMPUTED.to_owned(),
        },
        "The coil solved from its own currents (thin-wire method of moments, with its leads \
         and the path beneath it): the tank resonates where the coil's terminal reactance X \
         meets the capacitance, f = 1/(2π√((X/ω)·C)), solved self-consistently with the \
         self-capacitance inside X. A second opinion on the uncalibrated tank; the bench \
         readings decide",
    )
    .more(move || match (solved, &lead.why_classical) {
        (Some(Ok(_)), None) => format!(
            "In brackets: from the model's resonance. Apparent inductance X/ω there {}",
            show_nh(lead.apparent_inductance)
        ),
        (_, Some(why)) => format!("Why not: {why}."),
        _ => String::new(),
    })
    .show(ui);
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
        "The driving model's coil inductance plus both leads",
    )
    .show(ui);
    let apparent_note = "L/(1 − (f/f_self)²) with the lumped self-resonance: what a bridge \
                         would read across the coil at the resonance (the field solution's X/ω \
                         is under its resonance above)";
    match apparent_inductance(a) {
        Ok(l) => Readout::new("Apparent inductance", show_nh(l), apparent_note).show(ui),
        Err(why) => {
            Readout::new("Apparent inductance", "not shown".to_owned(), apparent_note).show(ui);
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
    .show(ui);
    Readout::new(
        "Self-resonance, field",
        match solved {
            Some(Ok(f)) => digits::self_resonance(f.self_resonance),
            Some(Err(_)) => "not available".to_owned(),
            None => BEING_COMPUTED.to_owned(),
        },
        "First parallel self-resonance at the terminals from the field solution (the wire, its \
         leads and the path beneath the coil)",
    )
    .more(move || match solved {
        Some(Err(e)) => e.to_string(),
        _ => String::new(),
    })
    .show(ui);
    Readout::new(
        "Self-resonance, helical",
        digits::self_resonance(a.self_resonance.helical),
        "Half-wave resonance of the helix as a slow-wave line with the Kandoian–Sichak \
         velocity factor",
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
        unit.show(a.coil.wire_length()),
        "Helix √((πD)² + p²) per turn times the turns, plus both leads",
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

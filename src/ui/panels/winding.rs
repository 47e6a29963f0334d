//! The winding: diameter, wire, turns, spacing and leads.

use super::{ROW_GAP, heading, length_quantity};
use crate::model::{Coating, Coil, DiameterSpec, Field, Gauge, SpacingSpec, Winding};
use crate::physics::wire_gauge;
use crate::ui::units::LengthUnit;
use crate::ui::widgets::{Quantity, row_label};
use eframe::egui;

/// Names of the insulation choices.
fn coating_label(coating: Coating) -> &'static str {
    match coating {
        Coating::Bare => "bare copper",
        Coating::EnamelGrade1 => "enamel, grade 1",
        Coating::EnamelGrade2 => "enamel, grade 2",
    }
}

/// The gauge numbers of AWG (or SWG) nearest to a bare diameter.
fn nearest_gauge(diameter: f64, range: (i32, i32), size: impl Fn(i32) -> Option<f64>) -> i32 {
    (range.0..=range.1)
        .filter_map(|n| size(n).map(|d| (n, (d - diameter).abs())))
        .min_by(|a, b| a.1.total_cmp(&b.1))
        .map_or(range.0, |(n, _)| n)
}

/// A row of mutually exclusive choices with a label in the label column.
fn choice_row<T: PartialEq + Copy>(
    ui: &mut egui::Ui,
    label: &str,
    current: T,
    options: &[(T, &str)],
) -> Option<T> {
    let mut picked = None;
    ui.horizontal(|ui| {
        row_label(ui, label);
        for &(value, name) in options {
            if ui.radio(current == value, name).clicked() && current != value {
                picked = Some(value);
            }
        }
    });
    picked
}

/// Show the winding controls. `coil` is the validated coil of the present (or last valid)
/// winding, used to keep the coil the same when the user switches what is given.
/// `refused` names the field the engine refused, if any, to mark its control.
pub fn show(
    ui: &mut egui::Ui,
    winding: &mut Winding,
    coil: Option<&Coil>,
    unit: LengthUnit,
    refused: Option<Field>,
) {
    heading(ui, "Winding");
    ui.scope(|ui| {
        ui.spacing_mut().item_spacing.y = ROW_GAP;
        diameter_rows(ui, winding, coil, unit, refused == Some(Field::Diameter));
        wire_rows(ui, winding, refused == Some(Field::Wire));
        let _ = Quantity::new("Turns", &mut winding.turns, 1.0, 1.0..=30.0)
            .step(0.25)
            .decimals(2)
            .note("Whole turns and fractions in quarter-turn steps")
            .refused(refused == Some(Field::Turns))
            .show(ui);
        spacing_rows(ui, winding, coil, unit, refused == Some(Field::Spacing));
        let _ = length_quantity(
            "Lead length",
            &mut winding.lead_length,
            unit,
            (0.0, 40.0),
            0.5,
        )
        .note("Each of the two straight leads, from the coil to the solder joint")
        .refused(refused == Some(Field::LeadLength))
        .show(ui);
    });
    // The derived figures only for a coil the engine accepts (not the last good one). The
    // two lines are always there, one line high each, so nothing below moves (and no field
    // being typed into loses its place) while an input is refused; two short lines fit the
    // panel's narrowest width whole.
    let (diameters, pitch) = match coil.filter(|_| refused.is_none()) {
        Some(coil) => (
            format!(
                "Former {} · mean diameter {}",
                unit.show(coil.former_diameter()),
                unit.show(coil.mean_diameter()),
            ),
            format!(
                "Pitch {} · wire over insulation {}",
                unit.show(coil.pitch()),
                unit.show(coil.wire_overall()),
            ),
        ),
        None => (
            "Former – · mean diameter – (input refused)".to_owned(),
            "Pitch – · wire over insulation –".to_owned(),
        ),
    };
    ui.add(egui::Label::new(diameters).truncate());
    ui.add(egui::Label::new(pitch).truncate());
}

fn diameter_rows(
    ui: &mut egui::Ui,
    w: &mut Winding,
    coil: Option<&Coil>,
    unit: LengthUnit,
    refused: bool,
) {
    let is_former = matches!(w.diameter, DiameterSpec::Former(_));
    if let Some(former) = choice_row(
        ui,
        "Diameter given",
        is_former,
        &[(true, "former"), (false, "mean")],
    ) {
        w.diameter = match (w.diameter, coil) {
            (DiameterSpec::Mean(_), Some(c)) if former => DiameterSpec::Former(c.former_diameter()),
            (DiameterSpec::Former(_), Some(c)) if !former => DiameterSpec::Mean(c.mean_diameter()),
            (DiameterSpec::Mean(d) | DiameterSpec::Former(d), _) if former => {
                DiameterSpec::Former(d)
            }
            (DiameterSpec::Mean(d) | DiameterSpec::Former(d), _) => DiameterSpec::Mean(d),
        };
    }
    match &mut w.diameter {
        DiameterSpec::Former(d) => {
            let _ = length_quantity("Former diameter", d, unit, (1.0, 30.0), 0.1)
                .note("Diameter of the mandrel or drill shank the wire is wound on")
                .refused(refused)
                .show(ui);
        }
        DiameterSpec::Mean(d) => {
            let _ = length_quantity("Mean diameter", d, unit, (1.0, 30.0), 0.1)
                .note("Wire-centre diameter: former diameter plus one wire diameter")
                .refused(refused)
                .show(ui);
        }
    }
}

fn wire_rows(ui: &mut egui::Ui, w: &mut Winding, refused: bool) {
    #[derive(Clone, Copy, PartialEq)]
    enum Kind {
        Awg,
        Swg,
        Metric,
    }
    let kind = match w.wire.gauge {
        Gauge::Awg(_) => Kind::Awg,
        Gauge::Swg(_) => Kind::Swg,
        Gauge::Metric(_) => Kind::Metric,
    };
    if let Some(new) = choice_row(
        ui,
        "Wire size in",
        kind,
        &[(Kind::Awg, "AWG"), (Kind::Swg, "SWG"), (Kind::Metric, "mm")],
    ) {
        let bare = w.wire.bare_diameter().unwrap_or(1.0e-3);
        w.wire.gauge = match new {
            Kind::Awg => Gauge::Awg(nearest_gauge(bare, wire_gauge::AWG_RANGE, |n| {
                Some(wire_gauge::awg_diameter(n))
            })),
            Kind::Swg => Gauge::Swg(nearest_gauge(
                bare,
                wire_gauge::SWG_RANGE,
                wire_gauge::swg_diameter,
            )),
            Kind::Metric => Gauge::Metric(bare),
        };
    }
    match &mut w.wire.gauge {
        Gauge::Awg(n) => gauge_number(ui, "Wire gauge (AWG)", n, wire_gauge::AWG_RANGE, refused),
        Gauge::Swg(n) => gauge_number(ui, "Wire gauge (SWG)", n, wire_gauge::SWG_RANGE, refused),
        Gauge::Metric(d) => {
            let _ = Quantity::new("Bare wire diameter", d, 1e-3, 0.1..=3.0)
                .step(0.01)
                .decimals(2)
                .suffix("mm")
                .note("Copper diameter without insulation")
                .refused(refused)
                .show(ui);
        }
    }
    ui.horizontal(|ui| {
        let label = row_label(ui, "Insulation");
        egui::ComboBox::from_id_salt("insulation")
            .selected_text(coating_label(w.wire.coating))
            .width(ui.spacing().slider_width)
            .show_ui(ui, |ui| {
                for coating in [Coating::Bare, Coating::EnamelGrade1, Coating::EnamelGrade2] {
                    ui.selectable_value(&mut w.wire.coating, coating, coating_label(coating));
                }
            })
            .response
            .on_hover_text(
                "Overall diameter over the insulation by IEC 60317 (grade 1 thin, grade 2 medium)",
            )
            .labelled_by(label.id);
    });
}

fn gauge_number(ui: &mut egui::Ui, label: &str, n: &mut i32, range: (i32, i32), refused: bool) {
    let mut value = f64::from(*n);
    let _ = Quantity::new(
        label,
        &mut value,
        1.0,
        f64::from(range.0)..=f64::from(range.1),
    )
    .step(1.0)
    .decimals(0)
    .note("Gauge number: larger numbers are thinner wire")
    .refused(refused)
    .show(ui);
    let rounded = value.round();
    if rounded.is_finite() && rounded.abs() < 1000.0 {
        // The cast is exact: a whole number well inside i32.
        *n = rounded as i32;
    }
}

fn spacing_rows(
    ui: &mut egui::Ui,
    w: &mut Winding,
    coil: Option<&Coil>,
    unit: LengthUnit,
    refused: bool,
) {
    let is_length = matches!(w.spacing, SpacingSpec::Length(_));
    if let Some(length) = choice_row(
        ui,
        "Spacing given",
        is_length,
        &[(true, "coil length"), (false, "gap")],
    ) {
        w.spacing = match (w.spacing, coil) {
            (_, Some(c)) if length => SpacingSpec::Length(c.length()),
            (_, Some(c)) => SpacingSpec::Gap(c.gap()),
            (SpacingSpec::Length(x) | SpacingSpec::Gap(x), None) if length => {
                SpacingSpec::Length(x)
            }
            (SpacingSpec::Length(x) | SpacingSpec::Gap(x), None) => SpacingSpec::Gap(x),
        };
    }
    match &mut w.spacing {
        SpacingSpec::Length(l) => {
            let _ = length_quantity("Coil length", l, unit, (0.5, 60.0), 0.05)
                .note("Turns × pitch: the length of the current sheet the formulas use")
                .refused(refused)
                .show(ui);
        }
        SpacingSpec::Gap(g) => {
            let _ = length_quantity("Gap between turns", g, unit, (0.0, 5.0), 0.01)
                .note("Clear space between the insulation of neighbouring turns")
                .refused(refused)
                .show(ui);
        }
    }
}

/// Set the coil length (metres) the way the user gives the spacing: as a length, or as the
/// gap that gives that length for this coil's turns and wire.
pub fn set_length(winding: &mut Winding, coil: &Coil, length: f64) {
    if !length.is_finite() {
        return;
    }
    winding.spacing = match winding.spacing {
        SpacingSpec::Length(_) => SpacingSpec::Length(length),
        SpacingSpec::Gap(_) => SpacingSpec::Gap(coil.gap_for_length(length)),
    };
}

//! The window's panels, one file each. Each shows its part of the recipe and records what the
//! user asked for that cannot be done mid-layout as a [`Command`].

pub mod audio;
pub mod bench;
pub mod channel_picker;
pub mod model_dots;
pub mod parts_on_hand;
pub mod readouts;
pub mod stage;
pub mod stage_schematic;
pub mod stray;
pub mod tank;
pub mod target;
pub mod target_figures;
pub mod top_bar;
pub mod verdict;
pub mod winding;

use crate::ui::units::LengthUnit;
use crate::ui::widgets::Quantity;
use crate::units::from_mm;

/// Something the user asked for, carried out at the end of the frame.
#[derive(Clone, Debug, PartialEq)]
#[must_use]
pub enum Command {
    /// Go back one step.
    Undo,
    /// Go forward one step.
    Redo,
    /// Set the coil length (turns × pitch), metres; given as a gap if the user gives a gap.
    SetLength(f64),
    /// Set the trimmer, 0–1.
    SetTrimmer(f64),
    /// Wind another number of turns to a coil length (metres).
    SetTurns(f64, f64),
    /// Open the cautions window.
    OpenCautions,
    /// Switch between light and dark.
    ToggleTheme,
    /// Show lengths in this unit.
    SetUnit(LengthUnit),
    /// Let the field solution lead the resonance (true) or the classical model (false).
    SetFieldSolution(bool),
    /// Append a bench reading to the log.
    RecordReading(crate::recipe::BenchEntry),
    /// Replace the bench reading at this index.
    ReplaceReading(usize, crate::recipe::BenchEntry),
    /// Remove the bench reading at this index.
    RemoveReading(usize),
}

/// A length control in the user's unit: `range_mm` and `step_mm` are in millimetres and
/// converted for inches.
pub(crate) fn length_quantity<'a>(
    label: &'a str,
    metres: &'a mut f64,
    unit: LengthUnit,
    range_mm: (f64, f64),
    step_mm: f64,
) -> Quantity<'a> {
    let per_unit = unit.metres_per_unit();
    let to_unit = |mm: f64| from_mm(mm) / per_unit;
    let (step, decimals) = match unit {
        LengthUnit::Millimetres => (step_mm, unit.decimals()),
        LengthUnit::Inches => (
            0.0005_f64.max((to_unit(step_mm) * 2000.0).round() / 2000.0),
            4,
        ),
    };
    Quantity::new(
        label,
        metres,
        per_unit,
        to_unit(range_mm.0)..=to_unit(range_mm.1),
    )
    .step(step)
    .decimals(decimals)
    .suffix(unit.suffix())
}

/// A capacitance control in picofarads.
pub(crate) fn capacitance_quantity<'a>(
    label: &'a str,
    farads: &'a mut f64,
    range_pf: (f64, f64),
) -> Quantity<'a> {
    Quantity::new(label, farads, 1e-12, range_pf.0..=range_pf.1)
        .step(0.1)
        .decimals(1)
        .suffix("pF")
}

/// Vertical gap between control rows, points.
pub(crate) const ROW_GAP: f32 = 6.0;

/// A section heading inside a side panel.
pub(crate) fn heading(ui: &mut eframe::egui::Ui, text: &str) {
    ui.add_space(4.0);
    ui.heading(text);
    ui.separator();
}

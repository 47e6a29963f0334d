//! The verdict block at the top of the right column: the answer first — on channel or by how
//! much, in band and safe over the trimmer's travel, buildable, calibrated or not — then the
//! next step. Everything shown comes from [`crate::recipe::Figures::verdict`], computed once
//! per change by the engine ([`crate::tuning::verdict::judge`]), the same verdict the build
//! sheet prints.

use super::heading;
use crate::recipe::{Expectation, Figures};
use crate::tuning::digits;
use crate::tuning::verdict::Verdict;
use crate::ui::evaluation::Evaluation;
use crate::ui::theme;
use crate::ui::units::LengthUnit;
use eframe::egui::{self, Color32, RichText};

/// Heading of the block (also its name for assistive tools).
pub const VERDICT_HEADING: &str = "Verdict";

/// Show the verdict for the present figures; nothing when the input is refused (the readouts
/// below say why).
pub fn show(ui: &mut egui::Ui, evaluation: &Evaluation, unit: LengthUnit) {
    if let Ok(figures) = evaluation.current() {
        heading(ui, VERDICT_HEADING);
        block(ui, figures, evaluation.expectation(), unit);
    }
}

/// A wrapping line in `color` (no clipping in a narrow column).
fn line(ui: &mut egui::Ui, text: impl Into<String>, color: Option<Color32>, strong: bool) {
    let mut rich = RichText::new(text.into());
    if let Some(c) = color {
        rich = rich.color(c);
    }
    if strong {
        rich = rich.strong();
    }
    ui.add(egui::Label::new(rich).wrap());
}

/// The buildability line.
pub fn buildable_text(verdict: &Verdict) -> &'static str {
    if verdict.is_buildable() {
        "Buildable: the bare turns keep their gap"
    } else {
        "Not buildable as drawn: see the cautions below"
    }
}

/// The spread line: where the build can be expected to land at the present coil, with the
/// spread's width, before the first measurement or after the calibration.
pub fn expectation_text(e: &Expectation) -> String {
    let (lo, hi) = e.expected;
    if e.calibrated {
        format!(
            "Expect {} now (a spread of {}, from the fit's errors)",
            digits::spread_range(lo, hi),
            digits::spread_width(hi - lo)
        )
    } else {
        format!(
            "Expect {} before the first measurement (a spread of {})",
            digits::spread_range(lo, hi),
            digits::spread_width(hi - lo)
        )
    }
}

fn block(
    ui: &mut egui::Ui,
    figures: &Figures,
    expectation: Option<&Expectation>,
    unit: LengthUnit,
) {
    let v = &figures.verdict;
    let good = theme::on_target(ui);
    let caution = theme::caution(ui);
    let channel_colour = match v.on_channel {
        Some(true) => good,
        Some(false) => caution,
        None => ui.visuals().text_color(),
    };
    line(ui, v.channel_text(), Some(channel_colour), true);
    line(
        ui,
        v.safety_text(),
        Some(if v.is_safe() { good } else { caution }),
        false,
    );
    line(
        ui,
        buildable_text(v),
        Some(if v.is_buildable() { good } else { caution }),
        false,
    );
    for flag in &v.flags {
        line(ui, format!("Caution: {}", flag.text), Some(caution), false);
    }
    line(ui, figures.basis_text(), None, false);
    if let Some(e) = expectation {
        line(ui, expectation_text(e), None, false);
    }
    ui.add_space(2.0);
    line(
        ui,
        format!("Next: {}", v.next_step_in(|m| unit.show(m))),
        None,
        true,
    );
}

//! A number control: a slider with a typed-value field beside it, over an SI value shown in
//! display units.

use crate::ui::theme;
use eframe::egui::{self, Response, SliderClamping};
use std::ops::RangeInclusive;

/// A labelled slider and number field that edit one SI value (metres, farads, turns…) shown
/// in display units, on one row: the name in the fixed label column ([`row_label`]), the
/// slider (`ui.spacing().slider_width` wide), the field.
///
/// The slider covers the usual range; the field accepts any number typed into it (the engine
/// refuses what cannot be built, with a reason), so nothing typed is lost to clamping.
#[must_use = "call .show(ui)"]
pub struct Quantity<'a> {
    label: &'a str,
    value: &'a mut f64,
    si_per_unit: f64,
    range: RangeInclusive<f64>,
    step: f64,
    decimals: usize,
    suffix: &'a str,
    logarithmic: bool,
    note: Option<&'a str>,
    refused: bool,
}

impl<'a> Quantity<'a> {
    /// A control named `label` over `value` (SI), with the slider spanning `range` in display
    /// units, where one display unit is `si_per_unit` SI units.
    pub fn new(
        label: &'a str,
        value: &'a mut f64,
        si_per_unit: f64,
        range: RangeInclusive<f64>,
    ) -> Self {
        Self {
            label,
            value,
            si_per_unit,
            range,
            step: 0.0,
            decimals: 2,
            suffix: "",
            logarithmic: false,
            note: None,
            refused: false,
        }
    }

    /// Step of the slider and of arrow-key nudges, display units.
    pub fn step(mut self, step: f64) -> Self {
        self.step = step;
        self
    }

    /// Decimals shown in the field.
    pub fn decimals(mut self, decimals: usize) -> Self {
        self.decimals = decimals;
        self
    }

    /// Unit shown after the number.
    pub fn suffix(mut self, suffix: &'a str) -> Self {
        self.suffix = suffix;
        self
    }

    /// A logarithmic slider (for ranges spanning decades).
    pub fn logarithmic(mut self, logarithmic: bool) -> Self {
        self.logarithmic = logarithmic;
        self
    }

    /// A hover note on the label, explaining the quantity.
    pub fn note(mut self, note: &'a str) -> Self {
        self.note = Some(note);
        self
    }

    /// Mark the control as the one the engine refused (its name turns red).
    pub fn refused(mut self, refused: bool) -> Self {
        self.refused = refused;
        self
    }

    /// Add the row. The response is the union of slider and field; `changed()` is true when
    /// either moved the value.
    pub fn show(self, ui: &mut egui::Ui) -> Response {
        // The row keeps its ids whatever is drawn above it (a typed value is never dropped
        // when the lines above change mid-typing: see `steady`).
        let name = self.label;
        super::steady(ui, name, |ui| ui.horizontal(|ui| self.row(ui)).inner)
    }

    fn row(self, ui: &mut egui::Ui) -> Response {
        let Self {
            label,
            value,
            si_per_unit,
            range,
            step,
            decimals,
            suffix,
            logarithmic,
            note,
            refused,
        } = self;
        let text = if refused {
            egui::RichText::new(label)
                .color(theme::refusal(ui))
                .strong()
        } else {
            egui::RichText::new(label)
        };
        let mut label_response = row_label(ui, text);
        if let Some(note) = note {
            label_response = label_response.on_hover_text(note);
        }
        let suffix = if suffix.is_empty() {
            String::new()
        } else {
            format!(" {suffix}")
        };

        let mut slider = egui::Slider::from_get_set(range, |new| {
            if let Some(v) = new {
                *value = to_si_at_resolution(v, si_per_unit, decimals);
            }
            *value / si_per_unit
        })
        .show_value(false)
        .clamping(SliderClamping::Never)
        .logarithmic(logarithmic);
        if step > 0.0 {
            slider = slider.step_by(step);
        }
        let slider_response = ui.add(slider).labelled_by(label_response.id);

        // One step per arrow key on the field (and per point of drag on it).
        let speed = if step > 0.0 { step } else { 0.01 };
        // A typed value is taken when committed (Enter, Tab, focus lost), not at each keystroke:
        // typing 1000000 turns never shows a 1-turn coil on the way.
        let field = egui::DragValue::from_get_set(|new| {
            if let Some(v) = new {
                *value = to_si_at_resolution(v, si_per_unit, decimals);
            }
            *value / si_per_unit
        })
        .update_while_editing(false)
        // egui clamps an existing value into the field's range even untouched, and orders NaN
        // above +inf, so a NaN read from a file (`turns: NaN`) became inf in the working copy;
        // the field has no range of its own, so nothing else is clamped: keep what was written.
        .clamp_existing_to_range(false)
        .speed(speed)
        .fixed_decimals(decimals)
        .suffix(suffix)
        .min_size(egui::vec2(72.0, 0.0));
        let field_response = ui.add(field).labelled_by(label_response.id);
        slider_response | field_response
    }
}

/// `display` (in display units) rounded to `decimals` places, in SI. Where the unit is a power
/// of ten of SI (mm, pF, percent) the rounded number is divided by that power, which gives the
/// SI value nearest the decimal shown, so the file (which writes the SI value's shortest
/// digits with the point moved) holds the digits shown: 11.5 mm, never 11.499999999999999.
pub fn to_si_at_resolution(display: f64, si_per_unit: f64, decimals: usize) -> f64 {
    if !display.is_finite() {
        return display * si_per_unit;
    }
    let scale = 10f64.powi(i32::try_from(decimals.min(15)).unwrap_or(15));
    let rounded = (display * scale).round() / scale;
    let per_si = 1.0 / si_per_unit;
    if per_si >= 1.0 && (per_si.round() - per_si).abs() <= per_si * 1e-12 {
        rounded / per_si.round()
    } else {
        rounded * si_per_unit
    }
}

/// Width of the label column of the control rows, points.
pub const LABEL_WIDTH: f32 = 124.0;

/// A row's name, padded to the label column so the controls after it line up.
pub fn row_label(ui: &mut egui::Ui, text: impl Into<egui::WidgetText>) -> Response {
    let response = ui.label(text);
    let pad = LABEL_WIDTH - response.rect.width() - ui.spacing().item_spacing.x;
    ui.add_space(pad.max(0.0));
    response
}

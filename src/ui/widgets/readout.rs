//! One computed figure: its name, the number with its unit, how it was found (on hover), and
//! any caution the engine attached to it, right beside it.

use crate::model::Warning;
use crate::ui::theme;
use eframe::egui::{self, RichText};

/// Text size of a caution line, points (a little under the body text).
const CAUTION_SIZE: f32 = 11.5;
/// Indent of a name under a heading, points.
const INDENT: f32 = 8.0;
/// Width of the name column of a readout, points.
const NAME_WIDTH: f32 = 150.0;

/// A figure ready to show.
#[must_use = "call .show(ui)"]
pub struct Readout<'a> {
    name: &'a str,
    value: String,
    method: &'a str,
    warnings: Vec<&'a Warning>,
    emphasis: bool,
    colour: Option<egui::Color32>,
    indent: bool,
    more: Option<Box<dyn FnOnce() -> String + 'a>>,
    note: Option<(String, String)>,
}

impl<'a> Readout<'a> {
    /// `value` already carries its unit ("7.52 nH"); `method` names how it was computed.
    pub fn new(name: &'a str, value: String, method: &'a str) -> Self {
        Self {
            name,
            value,
            method,
            warnings: Vec::new(),
            emphasis: false,
            colour: None,
            indent: false,
            more: None,
            note: None,
        }
    }

    /// Cautions to show beside the figure.
    pub fn warnings(mut self, warnings: impl IntoIterator<Item = &'a Warning>) -> Self {
        self.warnings.extend(warnings);
        self
    }

    /// Show the number larger (the figure that matters most).
    pub fn emphasis(mut self, emphasis: bool) -> Self {
        self.emphasis = emphasis;
        self
    }

    /// Indent the name (a figure that belongs to the heading above it).
    pub fn indent(mut self, indent: bool) -> Self {
        self.indent = indent;
        self
    }

    /// More detail for the figure's hover note, worked out only when the note is shown.
    pub fn more(mut self, more: impl FnOnce() -> String + 'a) -> Self {
        self.more = Some(Box::new(more));
        self
    }

    /// A short word after the figure (such as where it comes from), with its hover note.
    pub fn note(mut self, word: impl Into<String>, hover: impl Into<String>) -> Self {
        self.note = Some((word.into(), hover.into()));
        self
    }

    /// Show the number in this colour (e.g. on target or off it).
    pub fn colour(mut self, colour: egui::Color32) -> Self {
        self.colour = Some(colour);
        self
    }

    /// Add the row, and one line per caution under it.
    pub fn show(self, ui: &mut egui::Ui) {
        let Self {
            name,
            value,
            method,
            warnings,
            emphasis,
            colour,
            indent,
            more,
            note,
        } = self;
        ui.horizontal(|ui| {
            // A fixed-width name column without a child ui per row (cheap on idle frames).
            let mut room = NAME_WIDTH;
            if indent {
                ui.add_space(INDENT);
                room -= INDENT;
            }
            let name_width = ui.label(name).on_hover_text(method).rect.width();
            ui.add_space((room - name_width - ui.spacing().item_spacing.x).max(0.0));
            // Last line of defence: a figure that came out non-finite is never shown as a number.
            let value = if shows_non_number(&value) {
                "no finite figure".to_owned()
            } else {
                value
            };
            let mut text = RichText::new(value).monospace();
            if emphasis {
                text = text.strong().size(16.0);
            }
            if let Some(colour) = colour {
                text = text.color(colour);
            }
            // Wrapped in what is left of the row: a long figure never runs past the panel.
            ui.add(egui::Label::new(text).wrap()).on_hover_ui(|ui| {
                ui.label(method);
                if let Some(more) = more {
                    ui.label(more());
                }
            });
            if let Some((word, hover)) = note {
                ui.label(RichText::new(word).small().weak())
                    .on_hover_text(hover);
            }
            if !warnings.is_empty() {
                let all: Vec<&str> = warnings.iter().map(|w| w.message.as_str()).collect();
                caution_mark(ui).on_hover_text(all.join("\n\n"));
            }
        });
        for warning in warnings {
            cautions_line(ui, &warning.message);
        }
    }
}

/// True if `text` holds a non-finite number as Rust formats one ("NaN", "inf", "-inf").
fn shows_non_number(text: &str) -> bool {
    text.split(|c: char| c.is_whitespace() || "()–,/".contains(c))
        .any(|word| matches!(word.trim_start_matches(['+', '-']), "NaN" | "inf"))
}

/// A caution in small amber text with the caution mark, indented under the figure it concerns.
pub fn cautions_line(ui: &mut egui::Ui, message: &str) {
    ui.horizontal_top(|ui| {
        ui.add_space(12.0);
        caution_mark(ui);
        ui.add(
            egui::Label::new(
                RichText::new(message)
                    .size(CAUTION_SIZE)
                    .color(theme::caution(ui)),
            )
            .wrap(),
        );
    });
}

/// The caution mark: an amber triangle with an exclamation mark, drawn (the default fonts
/// have no such glyph).
pub fn caution_mark(ui: &mut egui::Ui) -> egui::Response {
    let size = ui.text_style_height(&egui::TextStyle::Body);
    let (rect, response) = ui.allocate_exact_size(egui::vec2(size, size), egui::Sense::hover());
    if ui.is_rect_visible(rect) {
        let colour = theme::caution(ui);
        let r = rect.shrink(1.0);
        let points = vec![r.center_top(), r.right_bottom(), r.left_bottom()];
        ui.painter().add(egui::Shape::convex_polygon(
            points,
            colour,
            egui::Stroke::NONE,
        ));
        let ink = if ui.visuals().dark_mode {
            egui::Color32::BLACK
        } else {
            egui::Color32::WHITE
        };
        let x = r.center().x;
        let stroke = egui::Stroke::new(1.6, ink);
        ui.painter().line_segment(
            [
                egui::pos2(x, r.top() + r.height() * 0.35),
                egui::pos2(x, r.bottom() - r.height() * 0.32),
            ],
            stroke,
        );
        ui.painter()
            .circle_filled(egui::pos2(x, r.bottom() - r.height() * 0.16), 1.0, ink);
    }
    response
}

#[cfg(test)]
mod tests {
    use super::shows_non_number;

    #[test]
    fn non_finite_figures_are_recognised_and_words_are_not() {
        for text in [
            format!("{} MHz", f64::NAN),
            format!("{:.1} nH", f64::INFINITY),
            format!("{:+.0} kHz/mm", f64::NEG_INFINITY),
            format!("91.755–{:.3} MHz", f64::NAN),
        ] {
            assert!(shows_non_number(&text), "{text}");
        }
        assert!(!shows_non_number("98.564 MHz"));
        assert!(!shows_non_number("the infinite-wall model"));
    }
}

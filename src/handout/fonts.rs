//! The one typeface of the hand-outs: Ubuntu Light, the window's own text face (the bytes
//! egui already carries, from `epaint_default_fonts`), so the PDF, the PNG and the window read
//! alike and nothing is looked up on the system. Its licence (the Ubuntu Font Licence) allows
//! embedding it in documents.

use ab_glyph::{Font, FontRef, ScaleFont};
use std::sync::OnceLock;

/// The typeface's bytes.
pub const FACE: &[u8] = epaint_default_fonts::UBUNTU_LIGHT;

/// The family name the charts ask plotters for (its sans-serif family).
pub const FAMILY: &str = "sans-serif";

/// Register the face with plotters (once per process) so that its bitmap backend can draw text
/// and every backend measures text the same way.
pub fn register_for_charts() -> Result<(), String> {
    static DONE: OnceLock<Result<(), String>> = OnceLock::new();
    DONE.get_or_init(|| {
        plotters::style::register_font(FAMILY, plotters::style::FontStyle::Normal, FACE)
            .map_err(|_| "the built-in typeface could not be read".to_owned())
    })
    .clone()
}

/// Measuring text in the face.
pub struct Metrics {
    font: FontRef<'static>,
}

impl Metrics {
    /// The face's metrics.
    pub fn new() -> Result<Self, String> {
        FontRef::try_from_slice(FACE)
            .map(|font| Self { font })
            .map_err(|_| "the built-in typeface could not be read".to_owned())
    }

    /// Width of `text` at `em` points per em, points.
    pub fn width(&self, text: &str, em: f32) -> f32 {
        // ab_glyph scales by line height; the em is that height times units per em over the
        // unscaled height.
        let units = self.font.units_per_em().unwrap_or(1000.0);
        let scale = ab_glyph::PxScale::from(em * self.font.height_unscaled() / units);
        let scaled = self.font.as_scaled(scale);
        let mut width = 0.0;
        let mut previous = None;
        for c in text.chars() {
            let id = scaled.glyph_id(c);
            if let Some(p) = previous {
                width += scaled.kern(p, id);
            }
            width += scaled.h_advance(id);
            previous = Some(id);
        }
        width
    }

    /// The em size whose line height (ascent to descent) is `height`: plotters sizes text by
    /// its line height, a PDF by its em.
    pub fn em_for_height(&self, height: f32) -> f32 {
        let units = self.font.units_per_em().unwrap_or(1000.0);
        let line = self.font.height_unscaled();
        if line > 0.0 {
            height * units / line
        } else {
            height
        }
    }

    /// Ascent above the baseline for text of line height `height`.
    pub fn ascent_for_height(&self, height: f32) -> f32 {
        let line = self.font.height_unscaled();
        if line > 0.0 {
            height * self.font.ascent_unscaled() / line
        } else {
            0.8 * height
        }
    }

    /// `text` broken into lines no wider than `width` points at `em` (words kept whole; a
    /// word wider than the line stands alone on its line).
    pub fn wrap(&self, text: &str, em: f32, width: f32) -> Vec<String> {
        let mut lines = Vec::new();
        for paragraph in text.split('\n') {
            let mut line = String::new();
            for word in paragraph.split_whitespace() {
                let candidate = if line.is_empty() {
                    word.to_owned()
                } else {
                    format!("{line} {word}")
                };
                if self.width(&candidate, em) <= width || line.is_empty() {
                    line = candidate;
                } else {
                    lines.push(std::mem::take(&mut line));
                    line = word.to_owned();
                }
            }
            lines.push(line);
        }
        lines
    }
}

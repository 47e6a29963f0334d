//! The presentation layout: larger type and charts, fewer controls, readable on a projector at
//! 1280×720. F5 (used by nothing else in the window) or the View menu switches it.
//!
//! Only this frame's style of the window's root is enlarged, so the change needs no undoing:
//! switching back simply stops enlarging it.

use eframe::egui::{self, Key, TextStyle};

/// The key that switches the presentation layout.
pub const PRESENTATION_KEY: Key = Key::F5;

/// How much larger the type is (a 12.5 pt body reads about 20 pt: legible from the back of a
/// small room on a 1280×720 projector, common practice for slides).
pub const TYPE_SCALE: f32 = 1.6;

/// The small type (the charts' legends, their curve labels and hover) on a projector, points:
/// about 18 pt, read from the back of a small room on a 1280×720 projector like the body
/// (common practice for slides: nothing under about 18 pt). The legends sit above the charts
/// (charts/legend.rs), so their larger type covers no curve.
pub const LEGEND_POINTS: f32 = 18.0;

/// Enlarge `style`'s type and spacing for the projector.
pub fn enlarge(style: &mut egui::Style) {
    for (text_style, font) in &mut style.text_styles {
        match text_style {
            TextStyle::Small => font.size = font.size.max(LEGEND_POINTS),
            _ => font.size *= TYPE_SCALE,
        }
    }
    style.spacing.interact_size *= 1.3;
    style.spacing.button_padding *= 1.4;
    style.spacing.item_spacing *= 1.2;
}

//! Light and dark themes, and the few colours of our own that mean something.

use eframe::egui::{self, Color32};

/// Which theme the window uses.
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq, serde::Serialize, serde::Deserialize)]
pub enum Theme {
    /// Dark background (the default: benches are often dim).
    #[default]
    Dark,
    /// Light background.
    Light,
}

impl Theme {
    /// The other theme.
    pub fn toggled(self) -> Self {
        match self {
            Theme::Dark => Theme::Light,
            Theme::Light => Theme::Dark,
        }
    }

    /// Label for the switch that moves to the other theme.
    pub fn switch_label(self) -> &'static str {
        match self {
            Theme::Dark => "Light theme",
            Theme::Light => "Dark theme",
        }
    }

    /// Make this the context's theme.
    pub fn apply(self, ctx: &egui::Context) {
        ctx.set_theme(match self {
            Theme::Dark => egui::Theme::Dark,
            Theme::Light => egui::Theme::Light,
        });
    }
}

/// Colour for a caution beside a figure (amber, darker on light backgrounds).
pub fn caution(ui: &egui::Ui) -> Color32 {
    if ui.visuals().dark_mode {
        Color32::from_rgb(236, 178, 64)
    } else {
        Color32::from_rgb(158, 96, 0)
    }
}

/// Colour for a refusal of the input (brick red).
pub fn refusal(ui: &egui::Ui) -> Color32 {
    if ui.visuals().dark_mode {
        Color32::from_rgb(240, 110, 96)
    } else {
        Color32::from_rgb(170, 40, 30)
    }
}

/// Colour for "on target" and "within reach" (a muted green).
pub fn on_target(ui: &egui::Ui) -> Color32 {
    if ui.visuals().dark_mode {
        Color32::from_rgb(120, 200, 140)
    } else {
        Color32::from_rgb(30, 120, 60)
    }
}

/// Background of the frame that replaces the readouts when the input is refused.
pub fn refusal_fill(ui: &egui::Ui) -> Color32 {
    if ui.visuals().dark_mode {
        Color32::from_rgb(60, 24, 22)
    } else {
        Color32::from_rgb(252, 228, 224)
    }
}

//! Extra curves on the spacing chart, drawn muted: the coil before the last change (the
//! teaching bench's ghost) and a pinned reference build.
//!
//! Each overlay carries its own coil, so that on the gap axis its lengths are turned into its
//! own gaps (a reference wound with another wire has another gap at the same length).

use super::ChartView;
use crate::model::Coil;
use crate::units::to_mhz;
use eframe::egui::Color32;
use egui_plot::{Line, LineStyle, MarkerShape, PlotPoints, Points};

/// What an overlay stands for (it sets the style).
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum OverlayKind {
    /// The coil as it was before the last change.
    Ghost,
    /// A build pinned for comparison.
    Reference,
}

impl OverlayKind {
    /// Its muted colour, on the chart and in the legend.
    pub(super) fn colour(self) -> Color32 {
        match self {
            // A quiet grey-violet and a quiet teal of our own: both read on either theme.
            OverlayKind::Ghost => Color32::from_rgb(0x9a, 0x94, 0xb0),
            OverlayKind::Reference => Color32::from_rgb(0x5f, 0xa3, 0x9c),
        }
    }
}

/// One muted curve (and its marker) on the spacing chart.
#[derive(Clone, Debug, PartialEq)]
pub struct ChartOverlay {
    /// Legend name (also the accessible name of its legend entry).
    pub name: String,
    /// Ghost or reference.
    pub kind: OverlayKind,
    /// The overlay's own coil (for the gap axis).
    pub coil: Coil,
    /// Resonance against coil length: (metres, hertz). Empty for a marker alone.
    pub curve: Vec<[f64; 2]>,
    /// The overlay's own point: (coil length in metres, resonance in hertz).
    pub marker: Option<[f64; 2]>,
}

impl ChartOverlay {
    fn x(&self, view: &ChartView<'_>, length: f64) -> f64 {
        match view.axis {
            super::SpacingAxis::Length => view.unit.from_metres(length),
            super::SpacingAxis::Gap => view.unit.from_metres(self.coil.gap_for_length(length)),
        }
    }
}

/// Draw the view's overlays: each curve dashed in its muted colour, each marker hollow.
pub(crate) fn draw(plot_ui: &mut egui_plot::PlotUi<'_>, view: &ChartView<'_>) {
    for overlay in view.overlays {
        let colour = overlay.kind.colour();
        if !overlay.curve.is_empty() {
            let points: PlotPoints<'_> = overlay
                .curve
                .iter()
                .filter(|p| p[1].is_finite())
                .map(|p| [overlay.x(view, p[0]), to_mhz(p[1])])
                .collect();
            let style = match overlay.kind {
                OverlayKind::Ghost => LineStyle::dotted_dense(),
                OverlayKind::Reference => LineStyle::dashed_loose(),
            };
            plot_ui.line(
                Line::new(overlay.name.as_str(), points)
                    .color(colour)
                    .style(style)
                    .width(1.6),
            );
        }
        if let Some([length, hz]) = overlay.marker
            && hz.is_finite()
        {
            plot_ui.points(
                Points::new(
                    overlay.name.as_str(),
                    vec![[overlay.x(view, length), to_mhz(hz)]],
                )
                .color(colour)
                .shape(MarkerShape::Circle)
                .filled(false)
                .radius(6.0),
            );
        }
    }
}

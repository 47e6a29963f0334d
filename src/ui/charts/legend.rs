//! The charts' legends, drawn above each chart rather than inside it, so that no entry ever
//! covers a curve (at 1280×720 a chart is about 200 points wide, and a legend inside it hid
//! half the curves). Entries wrap onto as many rows as the width needs.

use super::palette;
use super::{AERONAUTICAL, AERONAUTICAL_BAND_LABEL, CLASSICAL_CURVE_LABEL, ChartView};
use eframe::egui::{self, Color32};

/// How an entry's swatch is drawn.
#[derive(Clone, Copy, Debug, PartialEq)]
pub enum Swatch {
    /// A solid line.
    Line(Color32),
    /// A dashed line.
    Dashed(Color32),
    /// A dotted line.
    Dotted(Color32),
    /// A shaded band.
    Band(Color32),
    /// A point.
    Point(Color32),
    /// A hollow square (a reading taken with a capacitor clipped on).
    HollowSquare(Color32),
    /// A colour ramp from one colour to the other (the trimmer curves).
    Ramp(Color32, Color32),
}

/// One legend entry.
#[derive(Clone, Debug, PartialEq)]
pub struct Entry {
    /// The name, as the item on the chart is called.
    pub name: String,
    /// Its swatch.
    pub swatch: Swatch,
}

impl Entry {
    /// An entry called `name` with `swatch`.
    pub fn new(name: impl Into<String>, swatch: Swatch) -> Self {
        Self {
            name: name.into(),
            swatch,
        }
    }
}

/// Width of a swatch, points.
const SWATCH_WIDTH: f32 = 18.0;

/// Draw `entries` in wrapping rows, small text; each entry (swatch and name) is one widget
/// that moves to the next row whole, named by its name for assistive tools.
pub fn show(ui: &mut egui::Ui, entries: &[Entry]) {
    ui.horizontal_wrapped(|ui| {
        ui.spacing_mut().item_spacing = egui::vec2(10.0, 1.0);
        for entry in entries {
            entry_widget(ui, entry);
        }
    });
}

fn entry_widget(ui: &mut egui::Ui, entry: &Entry) {
    let font = egui::TextStyle::Small.resolve(ui.style());
    let colour = ui.visuals().text_color();
    // A name longer than the chart is wide (a half-width chart beside the other) wraps within
    // it rather than running over the neighbour's legend.
    let wrap_width = (ui.max_rect().width() - SWATCH_WIDTH - 3.0).max(40.0);
    let galley = ui
        .painter()
        .layout(entry.name.clone(), font, colour, wrap_width);
    let height = galley
        .size()
        .y
        .max(ui.text_style_height(&egui::TextStyle::Small));
    let size = egui::vec2(SWATCH_WIDTH + 3.0 + galley.size().x, height);
    let (rect, response) = ui.allocate_exact_size(size, egui::Sense::hover());
    response.widget_info(|| egui::WidgetInfo::labeled(egui::Role::Label, true, &entry.name));
    if !ui.is_rect_visible(rect) {
        return;
    }
    let swatch_rect = egui::Rect::from_min_size(rect.min, egui::vec2(SWATCH_WIDTH, rect.height()));
    paint_swatch(ui.painter(), swatch_rect, entry.swatch);
    ui.painter().galley(
        egui::pos2(swatch_rect.right() + 3.0, rect.top()),
        galley,
        colour,
    );
}

fn paint_swatch(p: &egui::Painter, rect: egui::Rect, swatch: Swatch) {
    let mid = rect.center().y;
    let (l, r) = (rect.left() + 1.0, rect.right() - 1.0);
    match swatch {
        Swatch::Line(c) => {
            p.line_segment(
                [egui::pos2(l, mid), egui::pos2(r, mid)],
                egui::Stroke::new(2.0, c),
            );
        }
        Swatch::Dashed(c) => {
            p.add(egui::Shape::dashed_line(
                &[egui::pos2(l, mid), egui::pos2(r, mid)],
                egui::Stroke::new(1.6, c),
                3.0,
                2.0,
            ));
        }
        Swatch::Dotted(c) => {
            p.add(egui::Shape::dotted_line(
                &[egui::pos2(l, mid), egui::pos2(r, mid)],
                c,
                3.0,
                1.0,
            ));
        }
        Swatch::Band(c) => {
            p.rect_filled(rect.shrink2(egui::vec2(1.0, 2.0)), 1.0, c);
        }
        Swatch::Point(c) => {
            p.circle_filled(rect.center(), 3.5, c);
        }
        Swatch::HollowSquare(c) => {
            p.rect_stroke(
                egui::Rect::from_center_size(rect.center(), egui::vec2(8.0, 8.0)),
                0.0,
                egui::Stroke::new(1.5, c),
                egui::StrokeKind::Middle,
            );
        }
        Swatch::Ramp(a, b) => {
            let steps = 6;
            for i in 0..steps {
                let t0 = i as f32 / steps as f32;
                let t1 = (i + 1) as f32 / steps as f32;
                let colour = lerp(a, b, (t0 + t1) / 2.0);
                p.line_segment(
                    [
                        egui::pos2(l + (r - l) * t0, mid),
                        egui::pos2(l + (r - l) * t1, mid),
                    ],
                    egui::Stroke::new(3.0, colour),
                );
            }
        }
    }
}

fn lerp(a: Color32, b: Color32, t: f32) -> Color32 {
    let mix = |x: u8, y: u8| (f32::from(x) + (f32::from(y) - f32::from(x)) * t).round() as u8;
    Color32::from_rgb(mix(a.r(), b.r()), mix(a.g(), b.g()), mix(a.b(), b.b()))
}

/// Whether the aeronautical band shows on a frequency axis of `y_mhz` (low, high), as
/// [`super::aeronautical_band`] decides.
fn shows_aeronautical(y_mhz: (f64, f64)) -> bool {
    let (lo, hi) = (AERONAUTICAL.0 * 1e-6, AERONAUTICAL.1 * 1e-6);
    y_mhz.1 > lo && y_mhz.0 < hi
}

/// The entries both charts share after their own curves: target channel, aeronautical band
/// (when the axis reaches it), bench readings (when there are any shown).
fn shared(view: &ChartView<'_>, y_mhz: (f64, f64), readings: bool, clipped: bool) -> Vec<Entry> {
    let mut out = Vec::new();
    if view.has_target() {
        out.push(Entry::new(
            "target channel",
            Swatch::Band(palette::target_fill()),
        ));
    }
    if let Some(op) = view.operating {
        out.push(Entry::new(op.label(), Swatch::Dashed(palette::OPERATING)));
    }
    if shows_aeronautical(y_mhz) {
        out.push(Entry::new(
            AERONAUTICAL_BAND_LABEL,
            Swatch::Band(palette::AERONAUTICAL.gamma_multiply(0.6)),
        ));
    }
    if readings {
        out.push(Entry::new(
            super::READINGS_LABEL,
            Swatch::Point(palette::READING),
        ));
    }
    if clipped {
        out.push(Entry::new(
            super::CLIPPED_READINGS_LABEL,
            Swatch::HollowSquare(palette::READING),
        ));
    }
    out
}

/// The classical comparison's entry, with how far the classical formulas put this coil from
/// the field solution: "textbook formulas (Nagaoka/Wheeler): +1.234 MHz from the field
/// solution here" (dotted).
pub fn classical_entry(view: &ChartView<'_>) -> Option<Entry> {
    let c = view.classical?;
    Some(Entry::new(
        format!(
            "{CLASSICAL_CURVE_LABEL}: {} from the field solution here",
            crate::tuning::digits::offset(c.here - view.resonance_hz)
        ),
        Swatch::Dotted(palette::CLASSICAL),
    ))
}

/// The spacing chart's legend for a frequency axis of `y_mhz`.
pub fn spacing_entries(
    view: &ChartView<'_>,
    visuals: &egui::Visuals,
    y_mhz: (f64, f64),
) -> Vec<Entry> {
    let curves = if view.tank.is_fixed() {
        Entry::new(
            super::FIXED_CURVE_LABEL,
            Swatch::Line(palette::trimmer(visuals, 0.0)),
        )
    } else {
        Entry::new(
            "trimmer 0–100 %",
            Swatch::Ramp(
                palette::trimmer(visuals, 0.0),
                palette::trimmer(visuals, 1.0),
            ),
        )
    };
    let mut out = vec![
        curves,
        Entry::new("this coil", Swatch::Point(palette::PRESENT)),
        Entry::new("turns touching", Swatch::Dashed(palette::touching(visuals))),
    ];
    if view.uncalibrated.is_some() {
        out.push(Entry::new(
            "before calibration",
            Swatch::Dashed(palette::UNCALIBRATED),
        ));
    }
    out.extend(classical_entry(view));
    // The teaching bench's ghost and pinned reference, by the names they carry.
    out.extend(
        view.overlays
            .iter()
            .map(|o| Entry::new(o.name.clone(), Swatch::Dashed(o.kind.colour()))),
    );
    out.extend(shared(
        view,
        y_mhz,
        view.readings.iter().any(|r| !r.clipped()),
        view.readings.iter().any(|r| r.clipped()),
    ));
    out
}

/// The trimmer chart's legend for a frequency axis of `y_mhz`; `readings` (unclipped, with
/// a capacitor clipped on) when bench readings at the present length are drawn.
pub fn trimmer_entries(
    view: &ChartView<'_>,
    visuals: &egui::Visuals,
    y_mhz: (f64, f64),
    readings: (bool, bool),
) -> Vec<Entry> {
    let mut out = vec![
        Entry::new(
            "resonance at this spacing",
            Swatch::Line(palette::trimmer(visuals, 0.5)),
        ),
        Entry::new("this setting", Swatch::Point(palette::PRESENT)),
    ];
    out.extend(classical_entry(view));
    out.extend(shared(view, y_mhz, readings.0, readings.1));
    out
}

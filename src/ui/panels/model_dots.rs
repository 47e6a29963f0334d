//! The coil's inductance by every method, as a small dot chart instead of a column of
//! figures: one row per method on a shared nanohenry axis, the spread between the smallest
//! and largest shaded, the method that drives the resonance drawn solid. Each row keeps its
//! hover note (the method's name, figure and how it was found: [`InductanceModel::method`]).

use crate::model::{Analysis, InductanceModel};
use crate::tuning::digits;
use crate::ui::charts::ticks;
use crate::ui::theme;
use crate::units::to_nh;
use eframe::egui::{self, Color32, RichText, Sense};

/// Height of one row, points.
const ROW: f32 = 15.0;
/// Width of the names column, points (the longest method name in small text fits).
const NAMES: f32 = 136.0;
/// Room for an axis label, points.
const LABEL_ROOM: f32 = 48.0;

/// One dot: a method's name, its inductance in henries (`None`: not computed) and its note.
#[derive(Clone, Debug, PartialEq)]
pub struct Dot {
    /// As shown.
    pub name: String,
    /// Henries.
    pub value: Option<f64>,
    /// How it was computed (the hover note).
    pub note: String,
    /// Whether it drives the resonance.
    pub driving: bool,
}

/// The rows for an analysis: every model of [`InductanceModel::ALL`], then Rosa's
/// round-wire figure with the current spread evenly (low frequency), for comparison.
pub fn dots(a: &Analysis) -> Vec<Dot> {
    let mut out: Vec<Dot> = InductanceModel::ALL
        .into_iter()
        .map(|m| Dot {
            name: m.label().to_owned(),
            value: a.inductance.by_model(m),
            note: m.method().to_owned(),
            driving: m == a.model,
        })
        .collect();
    out.push(Dot {
        name: "Rosa round wire, DC".to_owned(),
        value: Some(a.inductance.round_wire_low_freq),
        note: "Rosa's round-wire correction with the current spread evenly through the wire \
               (low frequency), for comparison"
            .to_owned(),
        driving: false,
    });
    out
}

/// A row's text for assistive tools and tests: "Rosa round wire 52.31 nH (drives the
/// resonance)".
pub fn row_text(dot: &Dot) -> String {
    let value = dot.value.map_or_else(
        || "not computed".to_owned(),
        |v| format!("{} nH", digits::fixed(to_nh(v), 2)),
    );
    if dot.driving {
        format!("{} {value} (drives the resonance)", dot.name)
    } else {
        format!("{} {value}", dot.name)
    }
}

/// Draw the chart: the rows, the shaded spread, an axis in nH under them.
pub fn show(ui: &mut egui::Ui, a: &Analysis) {
    let rows = dots(a);
    let values: Vec<f64> = rows.iter().filter_map(|d| d.value).collect();
    let (lo, hi) = values
        .iter()
        .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), v| {
            (lo.min(*v), hi.max(*v))
        });
    if !(lo.is_finite() && hi.is_finite()) {
        return;
    }
    // The axis: the spread with a margin, never narrower than ±0.5 % of the middle.
    let mid = 0.5 * (lo + hi);
    let half = (0.5 * (hi - lo)).max(0.005 * mid.abs()) * 1.15;
    let (axis_lo, axis_hi) = (to_nh(mid - half), to_nh(mid + half));

    let width = ui.available_width();
    let plot_width = (width - NAMES).max(80.0);
    let to_x = |left: f32, nh: f64| {
        left + NAMES + ((nh - axis_lo) / (axis_hi - axis_lo)) as f32 * plot_width
    };
    let muted = ui.visuals().weak_text_color();
    let text = ui.visuals().text_color();
    let accent = crate::ui::charts::palette::PRESENT;
    let spread_fill = theme_spread_fill(ui);
    let font = egui::TextStyle::Small.resolve(ui.style());

    let top = ui.cursor().top();
    let left = ui.cursor().left();
    // The spread, behind every row.
    let band = egui::Rect::from_x_y_ranges(
        to_x(left, to_nh(lo))..=to_x(left, to_nh(hi)),
        top..=top + ROW * rows.len() as f32,
    );
    ui.painter().rect_filled(band, 2.0, spread_fill);

    for dot in &rows {
        let (rect, response) = ui.allocate_exact_size(egui::vec2(width, ROW), Sense::hover());
        response.widget_info(|| egui::WidgetInfo::labeled(egui::Role::Label, true, row_text(dot)));
        let painter = ui.painter();
        let colour = if dot.driving { text } else { muted };
        painter.text(
            egui::pos2(rect.left() + 4.0, rect.center().y),
            egui::Align2::LEFT_CENTER,
            &dot.name,
            font.clone(),
            colour,
        );
        // A faint guide line along the row.
        painter.line_segment(
            [
                egui::pos2(rect.left() + NAMES, rect.center().y),
                egui::pos2(rect.right(), rect.center().y),
            ],
            egui::Stroke::new(0.5, muted.gamma_multiply(0.4)),
        );
        match dot.value {
            Some(v) => {
                let centre = egui::pos2(to_x(rect.left(), to_nh(v)), rect.center().y);
                if dot.driving {
                    painter.circle_filled(centre, 4.5, accent);
                } else {
                    painter.circle_stroke(centre, 3.5, egui::Stroke::new(1.5, text));
                }
            }
            None => {
                painter.text(
                    egui::pos2(rect.left() + NAMES, rect.center().y),
                    egui::Align2::LEFT_CENTER,
                    "not computed",
                    font.clone(),
                    muted,
                );
            }
        }
        response.on_hover_ui(|ui| {
            ui.label(RichText::new(row_text(dot)).strong());
            ui.label(&dot.note);
        });
    }
    axis(ui, (axis_lo, axis_hi), plot_width, &font, muted);
    let spread = a.inductance.spread() * 100.0;
    ui.add(
        egui::Label::new(
            RichText::new(format!(
                "Spread {} % (largest minus smallest, as a share of the round-wire figure); \
                 the solid dot drives the resonance",
                digits::fixed(spread, 1)
            ))
            .small(),
        )
        .wrap(),
    );
}

/// Ticks in nH at 1–2–5 steps under the rows.
fn axis(
    ui: &mut egui::Ui,
    (lo, hi): (f64, f64),
    plot_width: f32,
    font: &egui::FontId,
    colour: Color32,
) {
    let width = ui.available_width();
    let (rect, _) = ui.allocate_exact_size(egui::vec2(width, ROW), Sense::hover());
    let per_point = (hi - lo) / f64::from(plot_width);
    let (step, _) = ticks::steps(per_point, LABEL_ROOM);
    let decimals = ticks::decimals_for(step);
    let painter = ui.painter();
    let x0 = rect.left() + NAMES;
    painter.text(
        egui::pos2(rect.left() + 4.0, rect.center().y),
        egui::Align2::LEFT_CENTER,
        "nH",
        font.clone(),
        colour,
    );
    let mut k = (lo / step).ceil();
    while k * step <= hi {
        let v = k * step;
        let x = x0 + ((v - lo) / (hi - lo)) as f32 * plot_width;
        painter.line_segment(
            [egui::pos2(x, rect.top()), egui::pos2(x, rect.top() + 3.0)],
            egui::Stroke::new(1.0, colour),
        );
        painter.text(
            egui::pos2(x, rect.top() + 3.0),
            egui::Align2::CENTER_TOP,
            digits::fixed(v, decimals),
            font.clone(),
            colour,
        );
        k += 1.0;
    }
}

/// Fill of the spread band: the theme's caution colour, faint.
fn theme_spread_fill(ui: &egui::Ui) -> Color32 {
    let c = theme::caution(ui);
    Color32::from_rgba_unmultiplied(c.r(), c.g(), c.b(), 36)
}

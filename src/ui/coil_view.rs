//! The coil drawn to scale, side view, with a handle on the free end to stretch or squeeze it.
//!
//! The helix x = x₀ + p·θ/2π, y = (D/2)·cos θ seen from the side: each turn is a back half
//! (drawn lighter, behind) rising from the bottom to the top and a front half descending, both
//! stroked with the wire's real overall diameter (and the bare copper inside it when insulated).

use crate::model::{Coil, limits};
use crate::ui::units::LengthUnit;
use eframe::egui::{
    self, Align2, Color32, CursorIcon, FontId, Pos2, Rect, Sense, Stroke, pos2, vec2,
};
use std::f64::consts::{PI, TAU};

/// Accessible name and hover text of the free-end handle.
pub const HANDLE_LABEL: &str = "drag to stretch or squeeze";

/// Accessible name of the drawing.
pub const COIL_VIEW_LABEL: &str = "coil drawing";

/// Screen margin around the drawing, points.
const MARGIN: f32 = 14.0;
/// Room for a dimension line with its text, points.
const DIMENSION_ROOM: f32 = 30.0;
/// Tallest the coil itself is drawn, points.
const MAX_COIL_HEIGHT: f32 = 200.0;
/// Room kept right of the free end for stretching, as a fraction of the length.
const STRETCH_ROOM: f64 = 0.35;

/// Copper, front half.
const COPPER: Color32 = Color32::from_rgb(0xc8, 0x7a, 0x3c);
/// Enamel over the copper.
const ENAMEL: Color32 = Color32::from_rgb(0x8a, 0x3b, 0x1e);

/// Where the drawing sits on screen: screen x = `origin_x` + metres·`scale`.
#[derive(Clone, Copy, Debug, PartialEq)]
struct Layout {
    /// Points per metre.
    scale: f32,
    /// Screen x of the coil's left end (first wire centre).
    origin_x: f32,
}

/// Side view of the coil to scale: turns as the wire crossing above and below the axis with the
/// wire's real thickness, both leads, dimension lines with the length and gap in `unit`. The free
/// (right-hand) end can be dragged to stretch or squeeze: returns the new length (metres) while
/// dragging, never below the coil's shortest length nor beyond the longest the model accepts.
pub fn coil_view(ui: &mut egui::Ui, coil: &Coil, unit: LengthUnit) -> Option<f64> {
    coil_view_with_ghost(ui, coil, None, unit)
}

/// [`coil_view`] with `ghost`, the coil before the last change, drawn faint behind it (its
/// wire's centre line in a muted colour, and its free end marked "before").
pub fn coil_view_with_ghost(
    ui: &mut egui::Ui,
    coil: &Coil,
    ghost: Option<&Coil>,
    unit: LengthUnit,
) -> Option<f64> {
    let g = coil;
    let touching_length = coil.shortest_length();
    let width = ui.available_width().max(120.0);
    let wire = g.wire_overall().max(g.wire_bare()).max(0.0);
    let outer = g.mean_diameter() + wire;
    let lead = g.lead_length().max(0.0);
    // Fit the coil (with room to stretch), both leads and the wire's own thickness.
    let longest = ghost.map_or(g.length(), |c| c.length().max(g.length()));
    let span = longest * (1.0 + STRETCH_ROOM) + 2.0 * lead + wire;
    let fit_w = (width - 2.0 * MARGIN).max(40.0) / span.max(1e-6) as f32;
    // Within the height given (the dimension lines need their room), up to a sensible size.
    let budget =
        (ui.available_height() - 2.0 * (DIMENSION_ROOM + MARGIN)).clamp(24.0, MAX_COIL_HEIGHT);
    let fit_h = budget / outer.max(1e-6) as f32;
    // While the end is dragged the scale stays as it was when the drag began, so the pointer
    // maps to a length through the drawing the user grabbed.
    let handle_id = ui.next_auto_id().with("free end");
    let held = ui.data(|d| d.get_temp::<Layout>(handle_id));
    let scale = held.map_or(fit_w.min(fit_h), |l| l.scale);
    let coil_h = (outer as f32 * scale).max(8.0);
    let height = coil_h + 2.0 * DIMENSION_ROOM + 2.0 * MARGIN;

    let (area, painter) = ui.allocate_painter(vec2(width, height), Sense::hover());
    let rect = area.rect;
    area.widget_info(|| egui::WidgetInfo::labeled(egui::Role::Figure, true, COIL_VIEW_LABEL));
    let layout = held.unwrap_or(Layout {
        scale,
        // Centred, with the stretch room kept on the right.
        origin_x: rect.left()
            + 0.5 * (width - span as f32 * scale).max(2.0 * MARGIN)
            + ((lead + 0.5 * wire) as f32) * scale,
    });
    let s = layout.scale;
    let x_at = |m: f64| layout.origin_x + m as f32 * s;
    let axis_y = rect.top() + MARGIN + DIMENSION_ROOM + 0.5 * coil_h;
    let y_at = |m: f64| axis_y - m as f32 * s;
    let radius = 0.5 * g.mean_diameter();

    let visuals = ui.visuals();
    let ink = visuals.text_color();
    let faint = visuals.weak_text_color();
    let background = visuals.extreme_bg_color;
    let back_copper = blend(COPPER, background, 0.55);
    let back_enamel = blend(ENAMEL, background, 0.55);
    let wire_px = (wire as f32 * s).max(1.0);
    let bare_px = (g.wire_bare() as f32 * s).max(1.0);
    let insulated = g.wire_overall() > g.wire_bare() * 1.001 && wire_px - bare_px >= 0.5;

    // The axis, faint.
    painter.line_segment(
        [
            pos2(x_at(-lead), axis_y),
            pos2(x_at(g.length() + lead), axis_y),
        ],
        Stroke::new(1.0, faint.gamma_multiply(0.5)),
    );

    // Helix: starts at the bottom (θ = π) so that both leads leave along the bottom tangent.
    let turns = g.turns().max(0.0);
    let pitch = if turns > 0.0 { g.length() / turns } else { 0.0 };
    let theta_end = PI + TAU * turns;
    let point = |theta: f64| -> Pos2 {
        let m = pitch * (theta - PI) / TAU;
        pos2(x_at(m), y_at(radius * theta.cos()))
    };
    let half_path = |from: f64| -> Option<Vec<Pos2>> {
        let to = (from + PI).min(theta_end);
        (to > from).then(|| {
            let steps = 16;
            (0..=steps)
                .map(|i| point(from + (to - from) * f64::from(i) / f64::from(steps)))
                .collect()
        })
    };
    let halves = (2.0 * turns).ceil() as usize;
    let mut back = Vec::new();
    let mut front = Vec::new();
    for k in 0..halves {
        let from = PI + PI * k as f64;
        if let Some(path) = half_path(from) {
            // From π to 2π (mod 2π) the wire is behind the axis: sin θ < 0 faces away.
            if k % 2 == 0 {
                back.push(path)
            } else {
                front.push(path)
            }
        }
    }
    let stroke_path = |path: &[Pos2], outer_c: Color32, inner_c: Color32| {
        painter.line(
            path.to_vec(),
            Stroke::new(wire_px, if insulated { outer_c } else { inner_c }),
        );
        if insulated {
            painter.line(path.to_vec(), Stroke::new(bare_px, inner_c));
        }
    };
    if let Some(before) = ghost {
        crate::ui::teaching::ghost::draw_coil(&painter, before, (layout.origin_x, axis_y), s);
    }
    for path in &back {
        stroke_path(path, back_enamel, back_copper);
    }

    // Leads: straight stubs from both ends along the bottom tangent.
    let start = point(PI);
    let end = point(theta_end);
    let lead_px = lead as f32 * s;
    let lead_stroke = |from: Pos2, dx: f32| {
        let to = pos2(from.x + dx, from.y);
        painter.line_segment(
            [from, to],
            Stroke::new(wire_px, if insulated { ENAMEL } else { COPPER }),
        );
        if insulated {
            painter.line_segment([from, to], Stroke::new(bare_px, COPPER));
        }
    };
    lead_stroke(start, -lead_px);
    lead_stroke(end, lead_px);

    for path in &front {
        stroke_path(path, ENAMEL, COPPER);
    }

    // Where the free end would be close-wound: a short tick under the coil.
    let touch_x = x_at(touching_length);
    let bottom_edge = axis_y + 0.5 * coil_h;
    painter.line_segment(
        [
            pos2(touch_x, bottom_edge + 2.0),
            pos2(touch_x, bottom_edge + 9.0),
        ],
        Stroke::new(1.5, visuals.error_fg_color.gamma_multiply(0.8)),
    );

    // Dimension: length, above the coil.
    // The body text's size, so the presentation layout's larger type reaches the drawing.
    let font = FontId::proportional(
        ui.style().text_styles[&egui::TextStyle::Body]
            .size
            .max(12.0),
    );
    let top = axis_y - 0.5 * coil_h;
    let dim_y = top - 10.0;
    dimension(
        &painter,
        (x_at(0.0), x_at(g.length())),
        dim_y,
        top,
        ink,
        &format!("length {}", unit.show(g.length())),
        Align2::CENTER_BOTTOM,
        &font,
    );

    // Dimension: gap, below the coil between the first two turns' bottom crossings.
    let bottom = axis_y + 0.5 * coil_h;
    let gap_y = bottom + 10.0;
    if turns >= 1.0 {
        let first = x_at(0.5 * wire);
        let second = x_at(pitch - 0.5 * wire);
        dimension(
            &painter,
            (first, second.max(first)),
            gap_y,
            bottom,
            ink,
            &format!("gap {}", unit.show(g.gap())),
            Align2::LEFT_TOP,
            &font,
        );
    } else {
        painter.text(
            pos2(x_at(0.0), gap_y),
            Align2::LEFT_TOP,
            format!("gap {}", unit.show(g.gap())),
            font.clone(),
            ink,
        );
    }

    // The handle on the free end.
    let handle_rect = Rect::from_center_size(
        pos2(x_at(g.length()), axis_y),
        vec2((wire_px + 10.0).max(16.0), coil_h + 8.0),
    );
    let handle = ui
        .interact(handle_rect, handle_id, Sense::DRAG | Sense::FOCUSABLE)
        .on_hover_cursor(CursorIcon::ResizeHorizontal)
        .on_hover_text(HANDLE_LABEL);
    let step = keyboard_step(unit);
    let floor = touching_length.max(0.0);
    let ceiling = limits::LENGTH_MAX.max(floor);
    let nudged = nudge(ui, &handle, unit, step, g.length(), (floor, ceiling));
    handle.widget_info(|| {
        egui::WidgetInfo::slider(
            true,
            unit.from_metres(nudged.unwrap_or(g.length())),
            HANDLE_LABEL,
        )
    });
    ui.ctx().accesskit_node_builder(handle_id, |b| {
        use egui::accesskit::Action;
        b.set_min_numeric_value(unit.from_metres(floor));
        b.set_max_numeric_value(unit.from_metres(ceiling));
        b.set_numeric_value_step(unit.from_metres(step));
        b.add_action(Action::SetValue);
        b.add_action(Action::Increment);
        b.add_action(Action::Decrement);
    });
    let active = handle.hovered() || handle.dragged() || handle.has_focus();
    let handle_colour = if active {
        visuals.widgets.active.fg_stroke.color
    } else {
        visuals.widgets.inactive.fg_stroke.color
    };
    painter.rect_stroke(
        handle_rect.shrink(2.0),
        3.0,
        Stroke::new(
            if active { 2.0 } else { 1.0 },
            handle_colour.gamma_multiply(0.8),
        ),
        egui::StrokeKind::Inside,
    );
    let c = handle_rect.center();
    for dx in [-2.0, 2.0] {
        painter.line_segment(
            [pos2(c.x + dx, c.y - 6.0), pos2(c.x + dx, c.y + 6.0)],
            Stroke::new(1.5, handle_colour),
        );
    }

    ui.data_mut(|d| {
        if handle.dragged() {
            if d.get_temp::<Layout>(handle_id).is_none() {
                d.insert_temp(handle_id, layout);
            }
        } else {
            d.remove::<Layout>(handle_id);
        }
    });

    if handle.dragged()
        && let Some(pointer) = handle.interact_pointer_pos()
    {
        let metres = f64::from((pointer.x - layout.origin_x) / s);
        return Some(metres.clamp(floor, ceiling));
    }
    nudged
}

/// One arrow-key or screen-reader step of the free end, metres: a tenth of a millimetre, or
/// five thousandths of an inch.
fn keyboard_step(unit: LengthUnit) -> f64 {
    match unit {
        LengthUnit::Millimetres => unit.to_metres(0.1),
        LengthUnit::Inches => unit.to_metres(0.005),
    }
}

/// The length asked for from the keyboard (arrows while the handle has focus) or by a screen
/// reader (increment, decrement, set value in `unit`), clamped to `(floor, ceiling)`.
fn nudge(
    ui: &egui::Ui,
    handle: &egui::Response,
    unit: LengthUnit,
    step: f64,
    length: f64,
    (floor, ceiling): (f64, f64),
) -> Option<f64> {
    use egui::accesskit::{Action, ActionData};
    let id = handle.id;
    let mut steps = 0i64;
    if handle.has_focus() {
        ui.memory_mut(|m| {
            m.set_focus_lock_filter(
                id,
                egui::EventFilter {
                    horizontal_arrows: true,
                    ..Default::default()
                },
            );
        });
        ui.input(|i| {
            steps += i.num_presses(egui::Key::ArrowRight) as i64;
            steps -= i.num_presses(egui::Key::ArrowLeft) as i64;
        });
    }
    let (wanted, steps) = ui.input(|i| {
        let set = i
            .accesskit_action_requests(id, Action::SetValue)
            .filter_map(|r| match r.data {
                Some(ActionData::NumericValue(v)) => Some(unit.to_metres(v)),
                _ => None,
            })
            .last();
        let more = i.num_accesskit_action_requests(id, Action::Increment) as i64;
        let less = i.num_accesskit_action_requests(id, Action::Decrement) as i64;
        (set, steps + more - less)
    });
    let asked = match (wanted, steps) {
        (Some(v), n) => v + n as f64 * step,
        (None, 0) => return None,
        (None, n) => length + n as f64 * step,
    };
    asked.is_finite().then(|| asked.clamp(floor, ceiling))
}

/// A dimension line at height `y` between `xs`, with extension lines up or down to `from_y`
/// and `text` beside it.
#[expect(
    clippy::too_many_arguments,
    reason = "a drawing primitive: painter, geometry, style and label are all it needs"
)]
fn dimension(
    painter: &egui::Painter,
    xs: (f32, f32),
    y: f32,
    from_y: f32,
    colour: Color32,
    text: &str,
    align: Align2,
    font: &FontId,
) {
    let stroke = Stroke::new(1.0, colour);
    let (a, b) = xs;
    for x in [a, b] {
        painter.line_segment(
            [pos2(x, from_y), pos2(x, y + (y - from_y).signum() * 3.0)],
            stroke,
        );
    }
    painter.line_segment([pos2(a, y), pos2(b, y)], stroke);
    // Arrowheads point outward when the span is too short to hold them.
    let inward = b - a >= 12.0;
    for (x, dir) in [(a, 1.0_f32), (b, -1.0)] {
        let d = if inward { dir } else { -dir };
        let tip = pos2(x, y);
        painter.line_segment([tip, pos2(x + 5.0 * d, y - 3.0)], stroke);
        painter.line_segment([tip, pos2(x + 5.0 * d, y + 3.0)], stroke);
    }
    if !inward {
        painter.line_segment([pos2(a - 8.0, y), pos2(b + 8.0, y)], stroke);
    }
    let at = match align.y() {
        egui::Align::Max => pos2(0.5 * (a + b), y - 3.0),
        _ => pos2(a, y + 5.0),
    };
    painter.text(at, align, text, font.clone(), colour);
}

/// `a` mixed toward `b` by `t`.
fn blend(a: Color32, b: Color32, t: f32) -> Color32 {
    let mix = |x: u8, y: u8| (f32::from(x) + (f32::from(y) - f32::from(x)) * t).round() as u8;
    Color32::from_rgb(mix(a.r(), b.r()), mix(a.g(), b.g()), mix(a.b(), b.b()))
}

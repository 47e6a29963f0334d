//! The stage's small schematic, drawn by the tool with egui's painter: the parts of the
//! common-base or common-collector Colpitts stage with their values written beside them.
//! A drawing only (no input): the values come from the stage panel's settings.

use crate::tuning::stage::Topology;
use eframe::egui::{self, Align2, Color32, FontId, Painter, Pos2, Stroke, vec2};

/// Values written on the drawing, already formatted.
pub struct Values {
    /// Supply, e.g. "9 V".
    pub supply: String,
    /// Upper bias resistor.
    pub upper: String,
    /// Lower bias resistor.
    pub lower: String,
    /// Emitter resistor.
    pub emitter: String,
    /// Divider, hot end to emitter.
    pub c_upper: String,
    /// Divider, emitter to ground.
    pub c_lower: String,
    /// The tank's own capacitance (fixed, trimmer, stray).
    pub tank: String,
    /// The coil.
    pub coil: String,
}

/// Draws in points from the top-left corner of the schematic's box.
struct Pen<'a> {
    painter: &'a Painter,
    origin: Pos2,
    stroke: Stroke,
    text: Color32,
}

impl Pen<'_> {
    fn p(&self, x: f32, y: f32) -> Pos2 {
        self.origin + vec2(x, y)
    }

    fn wire(&self, pts: &[(f32, f32)]) {
        let pts: Vec<Pos2> = pts.iter().map(|&(x, y)| self.p(x, y)).collect();
        self.painter.add(egui::Shape::line(pts, self.stroke));
    }

    fn label(&self, x: f32, y: f32, text: &str, align: Align2) {
        self.painter.text(
            self.p(x, y),
            align,
            text,
            FontId::proportional(11.0),
            self.text,
        );
    }

    /// A vertical resistor from (x, y0) to (x, y1): leads and a box.
    fn resistor(&self, x: f32, y0: f32, y1: f32, text: &str) {
        let mid = 0.5 * (y0 + y1);
        self.wire(&[(x, y0), (x, mid - 12.0)]);
        self.wire(&[(x, mid + 12.0), (x, y1)]);
        let r = egui::Rect::from_center_size(self.p(x, mid), vec2(8.0, 24.0));
        self.painter
            .rect_stroke(r, 0.0, self.stroke, egui::StrokeKind::Middle);
        self.label(x + 7.0, mid, text, Align2::LEFT_CENTER);
    }

    /// A vertical capacitor from (x, y0) to (x, y1): leads and two plates.
    fn capacitor(&self, x: f32, y0: f32, y1: f32, text: &str) {
        let mid = 0.5 * (y0 + y1);
        self.wire(&[(x, y0), (x, mid - 3.0)]);
        self.wire(&[(x, mid + 3.0), (x, y1)]);
        self.wire(&[(x - 9.0, mid - 3.0), (x + 9.0, mid - 3.0)]);
        self.wire(&[(x - 9.0, mid + 3.0), (x + 9.0, mid + 3.0)]);
        self.label(x + 11.0, mid, text, Align2::LEFT_CENTER);
    }

    /// A horizontal capacitor from (x0, y) to (x1, y).
    fn capacitor_across(&self, x0: f32, x1: f32, y: f32, text: &str) {
        let mid = 0.5 * (x0 + x1);
        self.wire(&[(x0, y), (mid - 3.0, y)]);
        self.wire(&[(mid + 3.0, y), (x1, y)]);
        self.wire(&[(mid - 3.0, y - 9.0), (mid - 3.0, y + 9.0)]);
        self.wire(&[(mid + 3.0, y - 9.0), (mid + 3.0, y + 9.0)]);
        self.label(mid, y - 11.0, text, Align2::CENTER_BOTTOM);
    }

    /// A vertical coil from (x, y0) to (x, y1): four bumps.
    fn inductor(&self, x: f32, y0: f32, y1: f32, text: &str) {
        let mid = 0.5 * (y0 + y1);
        let (a, b) = (mid - 20.0, mid + 20.0);
        self.wire(&[(x, y0), (x, a)]);
        self.wire(&[(x, b), (x, y1)]);
        let mut pts = Vec::new();
        for turn in 0..4 {
            let top = a + 10.0 * turn as f32;
            for k in 0..=8 {
                let t = std::f32::consts::PI * k as f32 / 8.0;
                pts.push((x - 6.0 * t.sin(), top + 5.0 - 5.0 * t.cos()));
            }
        }
        self.wire(&pts);
        self.label(x - 9.0, mid, text, Align2::RIGHT_CENTER);
    }

    fn ground(&self, x: f32, y: f32) {
        for (i, half) in [8.0_f32, 5.0, 2.0].into_iter().enumerate() {
            let yy = y + 3.0 * i as f32;
            self.wire(&[(x - half, yy), (x + half, yy)]);
        }
    }

    fn dot(&self, x: f32, y: f32) {
        self.painter
            .circle_filled(self.p(x, y), 2.2, self.stroke.color);
    }

    /// An NPN transistor: base lead from the left (or right) at (bx, by), collector up to
    /// (cx, cy), emitter down to (cx, ey).
    fn npn(&self, cx: f32, cy: f32, ey: f32, by: f32, base_x: f32) {
        let body = self.p(cx, by);
        self.painter.circle_stroke(body, 13.0, self.stroke);
        let bar = if base_x < cx { cx - 5.0 } else { cx + 5.0 };
        self.wire(&[(bar, by - 7.0), (bar, by + 7.0)]);
        self.wire(&[(base_x, by), (bar, by)]);
        let side = if base_x < cx { 1.0 } else { -1.0 };
        self.wire(&[(bar, by - 3.0), (cx + side * 4.0, by - 9.0), (cx, cy)]);
        self.wire(&[(bar, by + 3.0), (cx + side * 4.0, by + 9.0), (cx, ey)]);
        // The emitter's arrow.
        let tip = self.p(cx + side * 4.0, by + 9.0);
        let back = vec2(-side * 5.0, -3.0);
        self.painter.add(egui::Shape::convex_polygon(
            vec![
                tip,
                tip + back + vec2(0.0, -2.5),
                tip + back + vec2(side * 1.5, 3.0),
            ],
            self.stroke.color,
            Stroke::NONE,
        ));
    }
}

/// Draw the stage's schematic in a box of its own.
pub fn draw(ui: &mut egui::Ui, topology: Topology, v: &Values) {
    let (response, painter) = ui.allocate_painter(vec2(280.0, 225.0), egui::Sense::hover());
    let visuals = ui.visuals();
    let pen = Pen {
        painter: &painter,
        // Room above the supply rail for its label.
        origin: response.rect.min + vec2(0.0, 10.0),
        stroke: Stroke::new(1.2, visuals.text_color()),
        text: visuals.text_color(),
    };
    let gnd = 195.0;
    pen.wire(&[(20.0, 12.0), (265.0, 12.0)]);
    pen.label(20.0, 8.0, &format!("+{}", v.supply), Align2::LEFT_BOTTOM);
    match topology {
        Topology::CommonBase => {
            // Tank from the supply to the collector.
            pen.inductor(60.0, 12.0, 80.0, &v.coil);
            pen.capacitor(100.0, 12.0, 80.0, &v.tank);
            pen.wire(&[(60.0, 80.0), (160.0, 80.0)]);
            pen.dot(60.0, 80.0);
            pen.dot(100.0, 80.0);
            pen.dot(100.0, 12.0);
            pen.dot(60.0, 12.0);
            // Transistor: collector up, emitter down, base to the right.
            pen.npn(160.0, 80.0, 140.0, 110.0, 200.0);
            // Divider: collector to emitter, emitter to ground.
            pen.capacitor(60.0, 80.0, 140.0, &v.c_upper);
            pen.wire(&[(60.0, 140.0), (160.0, 140.0)]);
            pen.dot(60.0, 140.0);
            pen.dot(160.0, 140.0);
            pen.capacitor(60.0, 140.0, gnd, &v.c_lower);
            pen.ground(60.0, gnd);
            pen.resistor(160.0, 140.0, gnd, &v.emitter);
            pen.ground(160.0, gnd);
            // Base: bias divider and its decoupling capacitor.
            pen.wire(&[(200.0, 110.0), (235.0, 110.0)]);
            pen.resistor(235.0, 12.0, 110.0, &v.upper);
            pen.resistor(235.0, 110.0, gnd, &v.lower);
            pen.ground(235.0, gnd);
            pen.capacitor(205.0, 110.0, gnd, "");
            pen.ground(205.0, gnd);
            pen.dot(205.0, 110.0);
            pen.dot(235.0, 110.0);
            pen.dot(235.0, 12.0);
        }
        Topology::CommonCollector => {
            // Tank from the base's side to ground, through a blocking capacitor.
            pen.wire(&[(35.0, 100.0), (70.0, 100.0)]);
            pen.inductor(35.0, 100.0, gnd, &v.coil);
            pen.ground(35.0, gnd);
            pen.capacitor(62.0, 100.0, gnd, &v.tank);
            pen.ground(62.0, gnd);
            pen.dot(62.0, 100.0);
            pen.capacitor_across(70.0, 100.0, 100.0, "");
            pen.wire(&[(100.0, 100.0), (175.0, 100.0)]);
            pen.dot(112.0, 100.0);
            pen.dot(140.0, 100.0);
            // Bias divider on the base.
            pen.resistor(112.0, 12.0, 100.0, &v.upper);
            pen.dot(112.0, 12.0);
            pen.resistor(112.0, 100.0, gnd, &v.lower);
            pen.ground(112.0, gnd);
            // Transistor: base from the left, collector to the supply, emitter down.
            pen.npn(200.0, 12.0, 150.0, 100.0, 175.0);
            pen.dot(200.0, 12.0);
            // Divider: base to emitter, emitter to ground.
            pen.capacitor(140.0, 100.0, 150.0, &v.c_upper);
            pen.wire(&[(140.0, 150.0), (200.0, 150.0)]);
            pen.dot(140.0, 150.0);
            pen.dot(200.0, 150.0);
            pen.capacitor(140.0, 150.0, gnd, &v.c_lower);
            pen.ground(140.0, gnd);
            pen.resistor(200.0, 150.0, gnd, &v.emitter);
            pen.ground(200.0, gnd);
        }
    }
}

//! The build sheet and worksheet laid out on A4 pages with krilla: text in the window's own
//! typeface (embedded and subset, with its Unicode map, so the text can be searched and
//! copied), the spacing chart drawn by plotters through [`super::pdf_backend`].

use super::chart_draw;
use super::fonts::{FACE, Metrics};
use super::pdf_backend::PdfBackend;
use super::sheet::{BENCH_COLUMNS, BENCH_ROWS, Row, Sheet};
use krilla::Document;
use krilla::color::rgb;
use krilla::geom::{PathBuilder, Point, Rect, Transform};
use krilla::metadata::Metadata;
use krilla::num::NormalizedF32;
use krilla::page::PageSettings;
use krilla::paint::{Fill, Stroke};
use krilla::surface::Surface;
use krilla::text::{Font, TextDirection};
use plotters::prelude::IntoDrawingArea;

/// A4, points.
const PAGE: (f32, f32) = (595.28, 841.89);
/// Margin all round, points.
const MARGIN: f32 = 42.0;
/// Body text, points per em.
const BODY: f32 = 9.5;
/// Line advance of body text, points.
const LEADING: f32 = 13.0;
/// Width of the label column of a table of rows, points.
const LABEL_WIDTH: f32 = 150.0;
/// The chart's size in plotters pixels and the points each pixel takes on the page.
const CHART_PIXELS: (u32, u32) = (1020, 600);
const CHART_POINTS_PER_PIXEL: f32 = (PAGE.0 - 2.0 * MARGIN) / 1020.0;
/// Sizes on the chart are multiplied by this (1 is the 960-pixel chart file).
const CHART_SCALE: f64 = 1.15;

/// The PDF bytes of `sheet`.
pub fn sheet_pdf(sheet: &Sheet) -> Result<Vec<u8>, String> {
    super::fonts::register_for_charts()?;
    let metrics = Metrics::new()?;
    let font = Font::new(FACE.into(), 0).ok_or("the built-in typeface could not be read")?;
    let mut document = Document::new();
    document.set_metadata(
        Metadata::new()
            .title(format!("Build sheet and worksheet: {}", sheet.name))
            .creator("Tankwright".to_owned()),
    );
    let mut pages = Pages {
        document: &mut document,
        font,
        metrics: &metrics,
    };
    pages.build_sheet(sheet)?;
    pages.chart_page(sheet)?;
    pages.worksheet(sheet)?;
    document
        .finish()
        .map_err(|e| format!("the PDF could not be made: {e:?}"))
}

struct Pages<'d> {
    document: &'d mut Document,
    font: Font,
    metrics: &'d Metrics,
}

/// A cursor down one page.
struct Writer<'a, 'p> {
    surface: &'a mut Surface<'p>,
    font: Font,
    metrics: &'a Metrics,
    y: f32,
    /// Set when a line would have run past the bottom margin and was left out.
    cut: bool,
}

/// The lowest baseline of body text, points.
const BOTTOM: f32 = PAGE.1 - MARGIN - 14.0;

fn black() -> Fill {
    shade(0x1a, 0x1a, 0x1a)
}

fn shade(r: u8, g: u8, b: u8) -> Fill {
    Fill {
        paint: rgb::Color::new(r, g, b).into(),
        opacity: NormalizedF32::ONE,
        rule: Default::default(),
    }
}

impl<'a, 'p> Writer<'a, 'p> {
    /// A cursor at the top margin of the page drawn on `surface`.
    fn new(surface: &'a mut Surface<'p>, font: Font, metrics: &'a Metrics) -> Self {
        Self {
            surface,
            font,
            metrics,
            y: MARGIN,
            cut: false,
        }
    }

    /// The page's title, 17 pt, on the first line below the top margin.
    fn title(&mut self, text: &str) {
        self.y += 18.0;
        self.text_at(MARGIN, self.y, 17.0, text, black());
    }

    fn text_at(&mut self, x: f32, y: f32, em: f32, text: &str, fill: Fill) {
        self.surface.set_stroke(None);
        self.surface.set_fill(Some(fill));
        self.surface.draw_text(
            Point::from_xy(x, y),
            self.font.clone(),
            em,
            text,
            false,
            TextDirection::Auto,
        );
    }

    /// A wrapped paragraph at `x`, `width` wide; returns the lines written.
    fn paragraph(&mut self, x: f32, width: f32, em: f32, text: &str, fill: &Fill) -> usize {
        let lines = self.metrics.wrap(text, em, width);
        for line in &lines {
            if self.y + em * LEADING / BODY > BOTTOM {
                self.cut = true;
                break;
            }
            self.y += em * LEADING / BODY;
            self.text_at(x, self.y, em, line, fill.clone());
        }
        lines.len()
    }

    fn heading(&mut self, text: &str) {
        self.y += 10.0;
        self.y += 14.0;
        self.text_at(MARGIN, self.y, 12.5, text, shade(0x10, 0x3c, 0x6e));
        self.y += 4.0;
        self.rule(MARGIN, PAGE.0 - MARGIN, 0.6, (0x10, 0x3c, 0x6e));
    }

    fn rule(&mut self, x0: f32, x1: f32, width: f32, colour: (u8, u8, u8)) {
        let mut pb = PathBuilder::new();
        pb.move_to(x0, self.y);
        pb.line_to(x1, self.y);
        if let Some(path) = pb.finish() {
            self.surface.set_fill(None);
            self.surface.set_stroke(Some(Stroke {
                paint: rgb::Color::new(colour.0, colour.1, colour.2).into(),
                width,
                ..Default::default()
            }));
            self.surface.draw_path(&path);
        }
    }

    /// The note at the foot of a page whose text did not all fit.
    fn note_if_cut(&mut self) {
        if self.cut {
            self.text_at(
                MARGIN,
                PAGE.1 - MARGIN,
                8.0,
                "Some lines did not fit on this page: `tankwright report` prints them all.",
                shade(0x8a, 0x1c, 0x1c),
            );
        }
    }

    fn rows(&mut self, rows: &[Row]) {
        let value_x = MARGIN + LABEL_WIDTH;
        let width = PAGE.0 - MARGIN - value_x;
        for (label, value) in rows {
            let top = self.y;
            self.text_at(MARGIN, top + LEADING, BODY, label, shade(0x55, 0x55, 0x55));
            let n = self.paragraph(value_x, width, BODY, value, &black());
            self.y = top + LEADING * n.max(1) as f32 + 2.0;
        }
    }

    fn box_at(&mut self, x: f32, y: f32, w: f32, h: f32, width: f32) {
        let Some(rect) = Rect::from_xywh(x, y, w, h) else {
            return;
        };
        let mut pb = PathBuilder::new();
        pb.push_rect(rect);
        if let Some(path) = pb.finish() {
            self.surface.set_fill(None);
            self.surface.set_stroke(Some(Stroke {
                paint: rgb::Color::new(0x60, 0x60, 0x60).into(),
                width,
                ..Default::default()
            }));
            self.surface.draw_path(&path);
        }
    }
}

impl Pages<'_> {
    fn build_sheet(&mut self, sheet: &Sheet) -> Result<(), String> {
        let mut page = self.document.start_page_with(page_settings()?);
        let mut surface = page.surface();
        let mut w = Writer::new(&mut surface, self.font.clone(), self.metrics);
        w.title(&format!("Build sheet: {}", sheet.name));
        let full = PAGE.0 - 2.0 * MARGIN;
        w.paragraph(MARGIN, full, BODY, &sheet.basis, &shade(0x55, 0x55, 0x55));
        if !sheet.notes.is_empty() {
            let notes = first_lines(w.metrics, &sheet.notes, BODY, full, 6);
            w.paragraph(MARGIN, full, BODY, &notes, &black());
        }
        w.heading("The coil to wind");
        w.rows(&sheet.coil);
        w.heading("The tank");
        w.rows(&sheet.tank);
        w.heading("The target and the expected window");
        w.rows(&sheet.target);
        w.y += 4.0;
        for line in &sheet.expect {
            w.paragraph(MARGIN, full, BODY, line, &black());
        }
        w.heading("Verdict");
        for line in &sheet.verdict {
            w.paragraph(MARGIN, full, BODY, line, &shade(0x10, 0x3c, 0x6e));
        }
        w.y += 8.0;
        w.paragraph(
            MARGIN,
            full,
            BODY,
            &format!("Caution: {}", crate::cautions::ONE_LINE),
            &shade(0x8a, 0x1c, 0x1c),
        );
        w.note_if_cut();
        footer(&mut surface, &self.font, "build sheet", 1);
        surface.finish();
        page.finish();
        Ok(())
    }

    fn chart_page(&mut self, sheet: &Sheet) -> Result<(), String> {
        let mut page = self.document.start_page_with(page_settings()?);
        let mut surface = page.surface();
        let mut w = Writer::new(&mut surface, self.font.clone(), self.metrics);
        let full = PAGE.0 - 2.0 * MARGIN;
        w.title("How spacing moves the frequency");
        let explained = if sheet.spacing.fixed_tank {
            "The curve is the resonance of this fixed tank (no trimmer) as the same turns are \
             spread from touching to well spaced: spreading lowers the inductance and raises \
             the frequency, and the length is the only adjustment. The shaded band is the \
             target channel; the dot is the coil as drawn."
        } else {
            "Each curve is the resonance for one trimmer setting as the same turns are spread \
             from touching to well spaced: spreading lowers the inductance and raises the \
             frequency. The shaded band is the target channel; the dot is the coil as drawn."
        };
        w.paragraph(MARGIN, full, BODY, explained, &black());
        let top = w.y + 10.0;
        w.y = top + CHART_PIXELS.1 as f32 * CHART_POINTS_PER_PIXEL;
        w.heading("Steps");
        for (i, step) in sheet.steps.iter().enumerate() {
            w.paragraph(MARGIN, full, BODY, &format!("{}. {step}", i + 1), &black());
        }
        w.note_if_cut();
        surface.push_transform(&Transform::from_row(
            CHART_POINTS_PER_PIXEL,
            0.0,
            0.0,
            CHART_POINTS_PER_PIXEL,
            MARGIN,
            top,
        ));
        let drawn = {
            let backend =
                PdfBackend::new(&mut surface, CHART_PIXELS, self.font.clone(), self.metrics);
            let root = backend.into_drawing_area();
            chart_draw::draw(&root, &sheet.spacing, CHART_SCALE)
        };
        surface.pop();
        drawn?;
        footer(&mut surface, &self.font, "spacing chart", 2);
        surface.finish();
        page.finish();
        Ok(())
    }

    fn worksheet(&mut self, sheet: &Sheet) -> Result<(), String> {
        let mut page = self.document.start_page_with(page_settings()?);
        let mut surface = page.surface();
        let mut w = Writer::new(&mut surface, self.font.clone(), self.metrics);
        let full = PAGE.0 - 2.0 * MARGIN;
        w.title(&format!("Worksheet: {}", sheet.name));
        w.y += 22.0;
        w.text_at(
            MARGIN,
            w.y,
            BODY,
            "Name ____________________   Date ____________   Instructor ____________________",
            black(),
        );
        w.heading("Bench readings");
        let widths = [0.05, 0.17, 0.14, 0.13, 0.25, 0.26];
        let row_h = 17.0;
        let top = w.y + 6.0;
        let mut x = MARGIN;
        for (col, width) in BENCH_COLUMNS.iter().zip(widths) {
            w.text_at(x + 3.0, top + 12.0, 8.5, col, shade(0x55, 0x55, 0x55));
            x += width * full;
        }
        for r in 0..=BENCH_ROWS {
            let y = top + row_h * r as f32;
            let mut x = MARGIN;
            for (c, width) in widths.iter().enumerate() {
                w.box_at(x, y, width * full, row_h, 0.5);
                if r >= 1
                    && let Some(cell) = sheet.readings.get(r - 1).map(|cells| &cells[c])
                {
                    let fitted = fit(w.metrics, cell, 8.5, width * full - 6.0);
                    w.text_at(x + 3.0, y + 12.0, 8.5, &fitted, black());
                }
                if r >= 1 && c == 0 && sheet.readings.get(r - 1).is_none() {
                    w.text_at(
                        x + 3.0,
                        y + 12.0,
                        8.5,
                        &r.to_string(),
                        shade(0x99, 0x99, 0x99),
                    );
                }
                x += width * full;
            }
        }
        w.y = top + row_h * (BENCH_ROWS + 1) as f32;
        w.heading("Cautions");
        for (heading, text) in &sheet.cautions {
            w.y += 2.0;
            w.paragraph(MARGIN, full, BODY, heading, &shade(0x8a, 0x1c, 0x1c));
            w.paragraph(MARGIN, full, 8.8, text, &black());
        }
        w.note_if_cut();
        footer(&mut surface, &self.font, "worksheet", 3);
        surface.finish();
        page.finish();
        Ok(())
    }
}

fn page_settings() -> Result<PageSettings, String> {
    PageSettings::from_wh(PAGE.0, PAGE.1).ok_or_else(|| "bad page size".to_owned())
}

/// `text` cut to fit `width` at `em`, with an ellipsis when cut.
fn fit(metrics: &Metrics, text: &str, em: f32, width: f32) -> String {
    if metrics.width(text, em) <= width {
        return text.to_owned();
    }
    let mut cut: String = text.to_owned();
    while !cut.is_empty() && metrics.width(&format!("{cut}…"), em) > width {
        cut.pop();
    }
    format!("{cut}…")
}

fn footer(surface: &mut Surface<'_>, font: &Font, what: &str, page: usize) {
    surface.set_stroke(None);
    surface.set_fill(Some(shade(0x88, 0x88, 0x88)));
    surface.draw_text(
        Point::from_xy(MARGIN, PAGE.1 - MARGIN / 2.0),
        font.clone(),
        7.5,
        &format!("Tankwright {what} · page {page} of {PAGES}"),
        false,
        TextDirection::Auto,
    );
}

/// Pages in the document.
const PAGES: usize = 3;

/// The first `n` lines of `text` wrapped at `width`, with an ellipsis when there were more.
fn first_lines(metrics: &Metrics, text: &str, em: f32, width: f32, n: usize) -> String {
    let lines = metrics.wrap(text, em, width);
    if lines.len() <= n {
        return text.to_owned();
    }
    format!("{}…", lines[..n].join(" "))
}

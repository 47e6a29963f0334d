//! A plotters drawing backend on a krilla page, so the build sheet's chart is drawn by the
//! same function as the SVG and PNG files ([`super::chart_draw::draw`]) and stays vector (and
//! its text searchable) in the PDF.
//!
//! Coordinates are plotters' integer pixels; the caller places and scales them on the page
//! with a transform pushed on the surface before the chart is drawn.

use super::fonts::Metrics;
use krilla::color::rgb;
use krilla::geom::{PathBuilder, Point, Rect, Transform};
use krilla::num::NormalizedF32;
use krilla::paint::{Fill, LineCap, LineJoin, Stroke};
use krilla::surface::Surface;
use krilla::text::{Font, TextDirection};
use plotters_backend::text_anchor::{HPos, VPos};
use plotters_backend::{
    BackendColor, BackendCoord, BackendStyle, BackendTextStyle, DrawingBackend, DrawingErrorKind,
    FontTransform,
};

/// Drawing never fails on a krilla surface; the type only satisfies plotters.
#[derive(Debug)]
pub struct NoError;

impl std::fmt::Display for NoError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str("PDF drawing error")
    }
}

impl std::error::Error for NoError {}

/// A `width` × `height` pixel drawing area on a krilla surface.
pub struct PdfBackend<'s, 'p> {
    surface: &'s mut Surface<'p>,
    size: (u32, u32),
    font: Font,
    metrics: &'s Metrics,
}

impl<'s, 'p> PdfBackend<'s, 'p> {
    /// A backend of `size` pixels drawing on `surface` with `font` (measured by `metrics`).
    pub fn new(
        surface: &'s mut Surface<'p>,
        size: (u32, u32),
        font: Font,
        metrics: &'s Metrics,
    ) -> Self {
        Self {
            surface,
            size,
            font,
            metrics,
        }
    }

    fn fill(colour: BackendColor) -> Fill {
        Fill {
            paint: rgb::Color::new(colour.rgb.0, colour.rgb.1, colour.rgb.2).into(),
            opacity: NormalizedF32::new(colour.alpha.clamp(0.0, 1.0) as f32)
                .unwrap_or(NormalizedF32::ONE),
            rule: Default::default(),
        }
    }

    fn stroke(colour: BackendColor, width: u32) -> Stroke {
        Stroke {
            paint: rgb::Color::new(colour.rgb.0, colour.rgb.1, colour.rgb.2).into(),
            width: width.max(1) as f32,
            opacity: NormalizedF32::new(colour.alpha.clamp(0.0, 1.0) as f32)
                .unwrap_or(NormalizedF32::ONE),
            line_cap: LineCap::Round,
            line_join: LineJoin::Round,
            ..Default::default()
        }
    }

    fn paint(&mut self, path: PathBuilder, fill: Option<Fill>, stroke: Option<Stroke>) {
        if let Some(path) = path.finish() {
            self.surface.set_fill(fill);
            self.surface.set_stroke(stroke);
            self.surface.draw_path(&path);
        }
    }

    fn polyline(points: impl IntoIterator<Item = BackendCoord>, close: bool) -> PathBuilder {
        let mut pb = PathBuilder::new();
        for (i, (x, y)) in points.into_iter().enumerate() {
            if i == 0 {
                pb.move_to(x as f32, y as f32);
            } else {
                pb.line_to(x as f32, y as f32);
            }
        }
        if close {
            pb.close();
        }
        pb
    }
}

impl DrawingBackend for PdfBackend<'_, '_> {
    type ErrorType = NoError;

    fn get_size(&self) -> (u32, u32) {
        self.size
    }

    fn ensure_prepared(&mut self) -> Result<(), DrawingErrorKind<NoError>> {
        Ok(())
    }

    fn present(&mut self) -> Result<(), DrawingErrorKind<NoError>> {
        Ok(())
    }

    fn draw_pixel(
        &mut self,
        (x, y): BackendCoord,
        colour: BackendColor,
    ) -> Result<(), DrawingErrorKind<NoError>> {
        if colour.alpha > 0.0 {
            let mut pb = PathBuilder::new();
            if let Some(r) = Rect::from_xywh(x as f32, y as f32, 1.0, 1.0) {
                pb.push_rect(r);
            }
            self.paint(pb, Some(Self::fill(colour)), None);
        }
        Ok(())
    }

    fn draw_line<S: BackendStyle>(
        &mut self,
        from: BackendCoord,
        to: BackendCoord,
        style: &S,
    ) -> Result<(), DrawingErrorKind<NoError>> {
        let pb = Self::polyline([from, to], false);
        self.paint(
            pb,
            None,
            Some(Self::stroke(style.color(), style.stroke_width())),
        );
        Ok(())
    }

    fn draw_rect<S: BackendStyle>(
        &mut self,
        upper_left: BackendCoord,
        bottom_right: BackendCoord,
        style: &S,
        fill: bool,
    ) -> Result<(), DrawingErrorKind<NoError>> {
        let (l, t) = (
            upper_left.0.min(bottom_right.0),
            upper_left.1.min(bottom_right.1),
        );
        let (r, b) = (
            upper_left.0.max(bottom_right.0),
            upper_left.1.max(bottom_right.1),
        );
        let pb = Self::polyline([(l, t), (r, t), (r, b), (l, b)], true);
        if fill {
            self.paint(pb, Some(Self::fill(style.color())), None);
        } else {
            self.paint(
                pb,
                None,
                Some(Self::stroke(style.color(), style.stroke_width())),
            );
        }
        Ok(())
    }

    fn draw_path<S: BackendStyle, I: IntoIterator<Item = BackendCoord>>(
        &mut self,
        path: I,
        style: &S,
    ) -> Result<(), DrawingErrorKind<NoError>> {
        let pb = Self::polyline(path, false);
        self.paint(
            pb,
            None,
            Some(Self::stroke(style.color(), style.stroke_width())),
        );
        Ok(())
    }

    fn fill_polygon<S: BackendStyle, I: IntoIterator<Item = BackendCoord>>(
        &mut self,
        vert: I,
        style: &S,
    ) -> Result<(), DrawingErrorKind<NoError>> {
        let pb = Self::polyline(vert, true);
        self.paint(pb, Some(Self::fill(style.color())), None);
        Ok(())
    }

    fn draw_circle<S: BackendStyle>(
        &mut self,
        (cx, cy): BackendCoord,
        radius: u32,
        style: &S,
        fill: bool,
    ) -> Result<(), DrawingErrorKind<NoError>> {
        // Four cubic arcs (the usual 0.5523 control-point factor).
        let (x, y, r) = (cx as f32, cy as f32, radius as f32);
        let k = 0.552_284_8 * r;
        let mut pb = PathBuilder::new();
        pb.move_to(x + r, y);
        pb.cubic_to(x + r, y + k, x + k, y + r, x, y + r);
        pb.cubic_to(x - k, y + r, x - r, y + k, x - r, y);
        pb.cubic_to(x - r, y - k, x - k, y - r, x, y - r);
        pb.cubic_to(x + k, y - r, x + r, y - k, x + r, y);
        pb.close();
        if fill {
            self.paint(pb, Some(Self::fill(style.color())), None);
        } else {
            self.paint(
                pb,
                None,
                Some(Self::stroke(style.color(), style.stroke_width())),
            );
        }
        Ok(())
    }

    fn draw_text<T: BackendTextStyle>(
        &mut self,
        text: &str,
        style: &T,
        (x, y): BackendCoord,
    ) -> Result<(), DrawingErrorKind<NoError>> {
        let colour = style.color();
        if colour.alpha <= 0.0 || text.is_empty() {
            return Ok(());
        }
        // plotters sizes text by its line height; the PDF by its em.
        let height = style.size() as f32;
        let em = self.metrics.em_for_height(height);
        let width = self.metrics.width(text, em);
        let dx = match style.anchor().h_pos {
            HPos::Left => 0.0,
            HPos::Center => -width / 2.0,
            HPos::Right => -width,
        };
        let ascent = self.metrics.ascent_for_height(height);
        let dy = match style.anchor().v_pos {
            VPos::Top => ascent,
            VPos::Center => ascent - height / 2.0,
            VPos::Bottom => ascent - height,
        };
        let angle = match style.transform() {
            FontTransform::None => 0.0,
            FontTransform::Rotate90 => 90.0,
            FontTransform::Rotate180 => 180.0,
            FontTransform::Rotate270 => 270.0,
        };
        self.surface
            .push_transform(&Transform::from_rotate_at(angle, x as f32, y as f32));
        self.surface.set_stroke(None);
        self.surface.set_fill(Some(Self::fill(colour)));
        self.surface.draw_text(
            Point::from_xy(x as f32 + dx, y as f32 + dy),
            self.font.clone(),
            em,
            text,
            false,
            TextDirection::Auto,
        );
        self.surface.pop();
        Ok(())
    }

    fn estimate_text_size<T: BackendTextStyle>(
        &self,
        text: &str,
        style: &T,
    ) -> Result<(u32, u32), DrawingErrorKind<NoError>> {
        let height = style.size() as f32;
        let width = self.metrics.width(text, self.metrics.em_for_height(height));
        Ok((width.ceil().max(0.0) as u32, height.ceil().max(0.0) as u32))
    }
}

//! A chart as an SVG document or a PNG image, drawn by plotters' SVG and bitmap backends
//! with [`super::chart_draw::draw`] (the same drawing as the build sheet's chart). The PNG is
//! encoded by the `image` crate the window already uses for its screenshots.

use super::chart_data::ChartData;
use super::chart_draw::draw;
use image::ImageEncoder;
use plotters::prelude::{BitMapBackend, IntoDrawingArea, SVGBackend};

/// Size of a chart file, pixels: 16:9, readable on a projector and on paper.
pub const CHART_SIZE: (u32, u32) = (1280, 720);

/// Sizes on a chart file are multiplied by this (1 is a 960-pixel-wide chart).
const FILE_SCALE: f64 = 1280.0 / 960.0;

/// The chart as an SVG document.
pub fn chart_svg(data: &ChartData) -> Result<String, String> {
    super::fonts::register_for_charts()?;
    let mut text = String::new();
    {
        let root = SVGBackend::with_string(&mut text, CHART_SIZE).into_drawing_area();
        draw(&root, data, FILE_SCALE)?;
    }
    Ok(text)
}

/// The chart as a PNG image (8-bit RGB).
pub fn chart_png(data: &ChartData) -> Result<Vec<u8>, String> {
    super::fonts::register_for_charts()?;
    let (w, h) = CHART_SIZE;
    let mut pixels = vec![0u8; w as usize * h as usize * 3];
    {
        let root = BitMapBackend::with_buffer(&mut pixels, CHART_SIZE).into_drawing_area();
        draw(&root, data, FILE_SCALE)?;
    }
    let mut png = Vec::new();
    image::codecs::png::PngEncoder::new(&mut png)
        .write_image(&pixels, w, h, image::ExtendedColorType::Rgb8)
        .map_err(|e| format!("the PNG could not be encoded: {e}"))?;
    Ok(png)
}

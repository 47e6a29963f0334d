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

/// Where the title, plot and legend column lie on a chart file ([`CHART_SIZE`]).
pub fn chart_file_layout() -> super::chart_draw::ChartLayout {
    super::chart_draw::layout(CHART_SIZE, FILE_SCALE)
}

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

/// Each side of the PNG is drawn this many times larger, then every `SUPERSAMPLE` ×
/// `SUPERSAMPLE` block is averaged into one pixel: plotters' bitmap backend fills a thick
/// line as a polygon with whole-pixel edges, and the averaging smooths its steps (anti-aliasing
/// by supersampling, Crow 1977, "The aliasing problem in computer-generated shaded images").
pub const SUPERSAMPLE: u32 = 3;

/// The chart as a PNG image (8-bit RGB), drawn [`SUPERSAMPLE`] times larger and averaged
/// down to [`CHART_SIZE`].
pub fn chart_png(data: &ChartData) -> Result<Vec<u8>, String> {
    super::fonts::register_for_charts()?;
    let (w, h) = CHART_SIZE;
    let big = (w * SUPERSAMPLE, h * SUPERSAMPLE);
    let mut large = vec![0u8; big.0 as usize * big.1 as usize * 3];
    {
        let root = BitMapBackend::with_buffer(&mut large, big).into_drawing_area();
        draw(&root, data, FILE_SCALE * f64::from(SUPERSAMPLE))?;
    }
    let pixels = box_average(&large, big.0 as usize, SUPERSAMPLE as usize);
    let mut png = Vec::new();
    image::codecs::png::PngEncoder::new(&mut png)
        .write_image(&pixels, w, h, image::ExtendedColorType::Rgb8)
        .map_err(|e| format!("the PNG could not be encoded: {e}"))?;
    Ok(png)
}

/// `pixels` (RGB, `width` wide) with every `n` × `n` block averaged into one pixel (rounded).
fn box_average(pixels: &[u8], width: usize, n: usize) -> Vec<u8> {
    let height = pixels.len() / 3 / width;
    let (w, h) = (width / n, height / n);
    let mut out = vec![0u8; w * h * 3];
    let count = (n * n) as u32;
    for y in 0..h {
        for x in 0..w {
            for c in 0..3 {
                let mut sum = 0u32;
                for dy in 0..n {
                    let row = (y * n + dy) * width;
                    for dx in 0..n {
                        sum += u32::from(pixels[(row + x * n + dx) * 3 + c]);
                    }
                }
                out[(y * w + x) * 3 + c] = ((sum + count / 2) / count) as u8;
            }
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::box_average;

    #[test]
    fn a_block_becomes_its_mean() {
        // A 4 × 2 image of two 2 × 2 blocks: one black, one three-quarters white.
        let mut px = vec![0u8; 4 * 2 * 3];
        for (i, v) in [0u8, 0, 255, 255, 0, 0, 255, 0].iter().enumerate() {
            px[i * 3..i * 3 + 3].fill(*v);
        }
        let out = box_average(&px, 4, 2);
        assert_eq!(out.len(), 2 * 3);
        assert_eq!(&out[0..3], &[0, 0, 0]);
        assert_eq!(&out[3..6], &[191, 191, 191]);
    }
}

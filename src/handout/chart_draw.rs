//! Drawing a chart with plotters on any of its backends: the SVG and bitmap backends for the
//! chart files, [`super::pdf_backend`] for the build sheet. One drawing function, so every
//! format shows the same chart.

use super::chart_data::{ChartData, ChartKind};
use super::fonts::FAMILY;
use plotters::coord::Shift;
use plotters::prelude::*;

/// The palette ([`crate::palette`]) as plotters' colours, for print.
mod ink {
    use crate::palette::{self, Rgb};
    use plotters::style::RGBColor;
    const fn ink(c: Rgb) -> RGBColor {
        RGBColor(c.0, c.1, c.2)
    }
    pub const PRESENT: RGBColor = ink(palette::PRESENT);
    pub const READING: RGBColor = ink(palette::READING);
    pub const TARGET: RGBColor = ink(palette::TARGET);
    pub const AERONAUTICAL: RGBColor = ink(palette::AERONAUTICAL);
    pub const TOUCHING: RGBColor = ink(palette::TOUCHING);
    pub const GRID: RGBColor = ink(palette::GRID);
    pub const GRID_BOLD: RGBColor = ink(palette::GRID_BOLD);

    /// Colour of the curve for trimmer `setting` (0–1).
    pub fn ramp(setting: f64) -> RGBColor {
        let c = palette::RAMP_START.towards(palette::RAMP_END, setting);
        RGBColor(c.0, c.1, c.2)
    }
}
use ink::ramp;

/// Draw `data` filling `root`; `scale` multiplies every size (text, lines, margins) so that
/// the same chart reads the same at 960 pixels wide (`scale` 1) and on a printed page.
pub fn draw<DB: DrawingBackend>(
    root: &DrawingArea<DB, Shift>,
    data: &ChartData,
    scale: f64,
) -> Result<(), String> {
    let px = |v: f64| (v * scale).round().max(1.0) as u32;
    let font = |size: f64| (FAMILY, size * scale).into_font();
    let fail = |e: DrawingAreaErrorKind<DB::ErrorType>| format!("drawing the chart failed: {e}");
    root.fill(&WHITE).map_err(fail)?;
    let (x0, x1) = data.x_range();
    let (y0, y1) = data.y_range();
    let mut chart = ChartBuilder::on(root)
        .margin(px(14.0))
        .caption(&data.title, font(19.0))
        .x_label_area_size(px(46.0))
        .y_label_area_size(px(64.0))
        .build_cartesian_2d(x0..x1, y0..y1)
        .map_err(fail)?;
    chart
        .configure_mesh()
        .x_desc(data.x_label)
        .y_desc("resonance (MHz)")
        .label_style(font(13.0))
        .axis_desc_style(font(14.0))
        .light_line_style(ink::GRID.stroke_width(px(1.0)))
        .bold_line_style(ink::GRID_BOLD.stroke_width(px(1.0)))
        .axis_style(BLACK.stroke_width(px(1.0)))
        .x_labels(10)
        .y_labels(8)
        .max_light_lines(2)
        .draw()
        .map_err(fail)?;

    let legend_line = move |colour: RGBColor, width: u32| {
        move |(x, y): (i32, i32)| {
            PathElement::new(
                vec![(x, y), (x + (22.0 * scale) as i32, y)],
                colour.stroke_width(width),
            )
        }
    };

    if let Some((lo, hi)) = data.aeronautical() {
        chart
            .draw_series(std::iter::once(Rectangle::new(
                [(x0, lo), (x1, hi)],
                ink::AERONAUTICAL.mix(0.15).filled(),
            )))
            .map_err(fail)?
            .label("aeronautical band (108–137 MHz): never radiate here")
            .legend(legend_line(ink::AERONAUTICAL, px(6.0)));
    }
    if let Some(channel) = data.channel {
        chart
            .draw_series(std::iter::once(Rectangle::new(
                [(x0, channel.edges.0), (x1, channel.edges.1)],
                ink::TARGET.mix(0.25).filled(),
            )))
            .map_err(fail)?;
        chart
            .draw_series(LineSeries::new(
                [(x0, channel.centre), (x1, channel.centre)],
                ink::TARGET.stroke_width(px(1.5)),
            ))
            .map_err(fail)?
            .label(format!(
                "target channel {} MHz",
                crate::tuning::digits::channel_mhz(channel.centre * 1e6)
            ))
            .legend(legend_line(ink::TARGET, px(2.0)));
    }
    if let Some(x) = data.touching {
        chart
            .draw_series(DashedLineSeries::new(
                [(x, y0), (x, y1)],
                px(6.0),
                px(4.0),
                ink::TOUCHING.stroke_width(px(1.5)),
            ))
            .map_err(fail)?
            .label("turns touching")
            .legend(legend_line(ink::TOUCHING, px(1.5)));
    }
    for curve in &data.curves {
        let colour = match data.kind {
            ChartKind::Spacing => ramp(curve.setting),
            ChartKind::Trimmer => ramp(0.5),
        };
        chart
            .draw_series(LineSeries::new(
                curve.points.iter().copied(),
                colour.stroke_width(px(2.0)),
            ))
            .map_err(fail)?
            .label(curve.label.as_str())
            .legend(legend_line(colour, px(2.0)));
    }
    if !data.readings.is_empty() {
        chart
            .draw_series(
                data.readings.iter().map(|&(x, y)| {
                    TriangleMarker::new((x, y), px(6.0) as i32, ink::READING.filled())
                }),
            )
            .map_err(fail)?
            .label("bench readings")
            .legend(move |(x, y)| {
                TriangleMarker::new(
                    (x + (11.0 * scale) as i32, y),
                    (6.0 * scale) as i32,
                    ink::READING.filled(),
                )
            });
    }
    if let Some((x, y)) = data.present.filter(|p| p.0.is_finite() && p.1.is_finite()) {
        let what = match data.kind {
            ChartKind::Spacing => "this coil",
            ChartKind::Trimmer => "this setting",
        };
        chart
            .draw_series(std::iter::once(Circle::new(
                (x, y),
                px(5.0),
                ink::PRESENT.filled(),
            )))
            .map_err(fail)?
            .label(format!("{what}: {}", crate::tuning::digits::mhz(y * 1e6)))
            .legend(move |(x, y)| {
                Circle::new(
                    (x + (11.0 * scale) as i32, y),
                    (5.0 * scale) as u32,
                    ink::PRESENT.filled(),
                )
            });
    }
    let corner = match data.kind {
        ChartKind::Spacing => SeriesLabelPosition::LowerRight,
        ChartKind::Trimmer => SeriesLabelPosition::UpperRight,
    };
    chart
        .configure_series_labels()
        .position(corner)
        .label_font(font(12.0))
        .background_style(WHITE.mix(0.9))
        .border_style(ink::GRID_BOLD.stroke_width(px(1.0)))
        .margin(px(8.0))
        .legend_area_size(px(30.0))
        .draw()
        .map_err(fail)?;
    root.present().map_err(fail)
}

//! Drawing a chart with plotters on any of its backends: the SVG and bitmap backends for the
//! chart files, [`super::pdf_backend`] for the build sheet. One drawing function, so every
//! format shows the same chart.

use super::chart_data::{ChartData, ChartKind};
use super::fonts::FAMILY;
use plotters::coord::Shift;
use plotters::prelude::*;
use plotters::style::text_anchor::{HPos, Pos, VPos};

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
use crate::units::from_mhz;
use ink::ramp;

/// How a legend entry's swatch is drawn.
#[derive(Clone, Copy, Debug)]
enum Swatch {
    /// A line of this width (scaled pixels).
    Line(RGBColor, f64),
    /// A dashed line.
    Dashed(RGBColor),
    /// A filled triangle (bench readings).
    Triangle(RGBColor),
    /// A hollow square (a reading with a capacitor clipped on).
    HollowSquare(RGBColor),
    /// A filled circle (the present coil or setting).
    Circle(RGBColor),
}

/// Width of the legend's column at scale 1 (a 960-pixel-wide chart), pixels.
const LEGEND_WIDTH: f64 = 250.0;
/// Where the legend's names start in its column at scale 1, pixels (the swatches end at 32).
const LEGEND_TEXT_LEFT: f64 = 40.0;

/// Where the parts of a chart go on a drawing `size` pixels at `scale`: the title's height
/// along the top, and below it the plot (axes and their labels) on the left and the legend in
/// a column of its own on the right, so no legend entry ever covers a curve.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct ChartLayout {
    /// Height of the title band, pixels.
    pub title_height: u32,
    /// The x where the legend's column starts (the plot ends there), pixels.
    pub legend_left: u32,
    /// The x where the legend's names start (its swatches lie left of it), pixels.
    pub legend_text_left: u32,
}

/// The layout of a chart drawn `size` pixels at `scale` ([`draw`] uses it).
pub fn layout(size: (u32, u32), scale: f64) -> ChartLayout {
    let px = |v: f64| (v * scale).round().max(1.0) as u32;
    let legend = px(LEGEND_WIDTH).min(size.0 / 3);
    let legend_left = size.0.saturating_sub(legend);
    ChartLayout {
        title_height: px(40.0),
        legend_left,
        legend_text_left: legend_left + px(LEGEND_TEXT_LEFT),
    }
}

/// Draw `data` filling `root`; `scale` multiplies every size (text, lines, margins) so that
/// the same chart reads the same at 960 pixels wide (`scale` 1) and on a printed page. The
/// legend has a column of its own right of the plot ([`layout`]).
pub fn draw<DB: DrawingBackend>(
    root: &DrawingArea<DB, Shift>,
    data: &ChartData,
    scale: f64,
) -> Result<(), String> {
    let px = |v: f64| (v * scale).round().max(1.0) as u32;
    let font = |size: f64| (FAMILY, size * scale).into_font();
    let fail = |e: DrawingAreaErrorKind<DB::ErrorType>| format!("drawing the chart failed: {e}");
    root.fill(&WHITE).map_err(fail)?;
    let parts = layout(root.dim_in_pixel(), scale);
    let (title_area, body) = root.split_vertically(parts.title_height);
    let title_style = TextStyle::from(font(19.0))
        .color(&BLACK)
        .pos(Pos::new(HPos::Center, VPos::Center));
    title_area
        .draw(&Text::new(
            data.title.as_str(),
            (
                (root.dim_in_pixel().0 / 2) as i32,
                (parts.title_height / 2) as i32,
            ),
            title_style,
        ))
        .map_err(fail)?;
    let (plot_area, legend_area) = body.split_horizontally(parts.legend_left);
    let mut legend: Vec<(String, Swatch)> = Vec::new();
    let (x0, x1) = data.x_range();
    let (y0, y1) = data.y_range();
    let mut chart = ChartBuilder::on(&plot_area)
        .margin(px(14.0))
        .margin_top(px(4.0))
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

    if let Some((lo, hi)) = data.aeronautical() {
        chart
            .draw_series(std::iter::once(Rectangle::new(
                [(x0, lo), (x1, hi)],
                ink::AERONAUTICAL.mix(0.15).filled(),
            )))
            .map_err(fail)?;
        legend.push((
            "aeronautical band (108–137 MHz): never radiate here".to_owned(),
            Swatch::Line(ink::AERONAUTICAL, 6.0),
        ));
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
            .map_err(fail)?;
        legend.push((
            format!(
                "target channel {} MHz",
                crate::tuning::digits::channel_mhz(from_mhz(channel.centre))
            ),
            Swatch::Line(ink::TARGET, 2.0),
        ));
    }
    if let Some(x) = data.touching {
        chart
            .draw_series(DashedLineSeries::new(
                [(x, y0), (x, y1)],
                px(6.0),
                px(4.0),
                ink::TOUCHING.stroke_width(px(1.5)),
            ))
            .map_err(fail)?;
        legend.push(("turns touching".to_owned(), Swatch::Dashed(ink::TOUCHING)));
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
            .map_err(fail)?;
        legend.push((curve.label.clone(), Swatch::Line(colour, 2.0)));
    }
    if !data.readings.is_empty() {
        chart
            .draw_series(
                data.readings.iter().map(|&(x, y)| {
                    TriangleMarker::new((x, y), px(6.0) as i32, ink::READING.filled())
                }),
            )
            .map_err(fail)?;
        legend.push(("bench readings".to_owned(), Swatch::Triangle(ink::READING)));
    }
    // A reading with a capacitor clipped on lies on a curve of its own (the tank plus that
    // capacitor): a hollow square labelled with the capacitance, apart from the others.
    for &(x, y, pf) in &data.clipped {
        let label = format!("+{} pF", crate::tuning::digits::fixed(pf, 1));
        let size = px(5.0) as i32;
        chart
            .draw_series(std::iter::once(
                EmptyElement::at((x, y))
                    + Rectangle::new(
                        [(-size, -size), (size, size)],
                        ink::READING.stroke_width(px(2.0)),
                    )
                    + Text::new(
                        label,
                        (size + px(4.0) as i32, -size),
                        font(12.0).color(&ink::READING),
                    ),
            ))
            .map_err(fail)?;
    }
    if !data.clipped.is_empty() {
        legend.push((
            "reading with a capacitor clipped on (labelled with it; its own curve)".to_owned(),
            Swatch::HollowSquare(ink::READING),
        ));
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
            .map_err(fail)?;
        legend.push((
            format!("{what}: {}", crate::tuning::digits::mhz(from_mhz(y))),
            Swatch::Circle(ink::PRESENT),
        ));
    }
    draw_legend(&legend_area, &legend, scale).map_err(fail)?;
    root.present().map_err(fail)
}

/// The legend in its own column: a swatch and the entry's name per entry, the name wrapped
/// to the column's width.
fn draw_legend<DB: DrawingBackend>(
    area: &DrawingArea<DB, Shift>,
    entries: &[(String, Swatch)],
    scale: f64,
) -> Result<(), DrawingAreaErrorKind<DB::ErrorType>> {
    let s = |v: f64| (v * scale).round() as i32;
    let style = TextStyle::from((FAMILY, 13.0 * scale).into_font()).color(&BLACK);
    let (width, _) = area.dim_in_pixel();
    let text_left = s(LEGEND_TEXT_LEFT);
    let text_width = (width as i32 - text_left - s(6.0)).max(s(40.0));
    let line_height = s(17.0);
    let mut y = s(14.0);
    for (name, swatch) in entries {
        // The swatch level with the middle of the name's first line.
        let mid = y + s(5.5);
        let (l, r) = (s(8.0), s(32.0));
        match *swatch {
            Swatch::Line(c, w) => {
                area.draw(&PathElement::new(
                    vec![(l, mid), (r, mid)],
                    c.stroke_width(s(w).max(1) as u32),
                ))?;
            }
            Swatch::Dashed(c) => {
                let dash = s(5.0).max(2);
                let mut x = l;
                while x < r {
                    area.draw(&PathElement::new(
                        vec![(x, mid), ((x + dash).min(r), mid)],
                        c.stroke_width(s(1.5).max(1) as u32),
                    ))?;
                    x += 2 * dash;
                }
            }
            Swatch::Triangle(c) => {
                area.draw(&TriangleMarker::new(((l + r) / 2, mid), s(6.0), c.filled()))?;
            }
            Swatch::HollowSquare(c) => {
                let h = s(5.0);
                let x = (l + r) / 2;
                area.draw(&Rectangle::new(
                    [(x - h, mid - h), (x + h, mid + h)],
                    c.stroke_width(s(2.0).max(1) as u32),
                ))?;
            }
            Swatch::Circle(c) => {
                area.draw(&Circle::new(
                    ((l + r) / 2, mid),
                    s(5.0).max(1) as u32,
                    c.filled(),
                ))?;
            }
        }
        for line in wrapped(area, name, &style, text_width)? {
            area.draw(&Text::new(line, (text_left, y), style.clone()))?;
            y += line_height;
        }
        y += s(6.0);
    }
    Ok(())
}

/// `text` cut into lines no wider than `width` pixels, at spaces (a word wider than the
/// column stands on its own line).
fn wrapped<DB: DrawingBackend>(
    area: &DrawingArea<DB, Shift>,
    text: &str,
    style: &TextStyle<'_>,
    width: i32,
) -> Result<Vec<String>, DrawingAreaErrorKind<DB::ErrorType>> {
    let mut lines = Vec::new();
    let mut line = String::new();
    for word in text.split(' ') {
        let candidate = if line.is_empty() {
            word.to_owned()
        } else {
            format!("{line} {word}")
        };
        let (w, _) = area.estimate_text_size(&candidate, style)?;
        if w as i32 > width && !line.is_empty() {
            lines.push(std::mem::replace(&mut line, word.to_owned()));
        } else {
            line = candidate;
        }
    }
    if !line.is_empty() {
        lines.push(line);
    }
    Ok(lines)
}

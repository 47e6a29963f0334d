//! Hover text: the curves' values at the pointer's length or setting, interpolated along the
//! sweep — never the pointer's own height, which is just where the mouse happens to be.

use super::ChartView;
use crate::tuning::digits;

/// The value of a polyline at `x` by linear interpolation between its samples (`points` in
/// ascending x); `None` outside the samples or for an empty line.
pub fn value_at(points: &[[f64; 2]], x: f64) -> Option<f64> {
    let (first, last) = (points.first()?, points.last()?);
    if !(x >= first[0] && x <= last[0]) {
        return None;
    }
    let i = points.partition_point(|p| p[0] < x);
    if i == 0 {
        return Some(first[1]);
    }
    let (a, b) = (points[i - 1], points[i]);
    let span = b[0] - a[0];
    if span <= 0.0 {
        return Some(b[1]);
    }
    Some(a[1] + (b[1] - a[1]) * (x - a[0]) / span)
}

/// The x of a hover position: the data point's when the pointer is near one, else the
/// pointer's; and the name of the item near the pointer, if any.
fn hovered<'a>(pos: &egui_plot::HoverPosition<'a>) -> (f64, &'a str, f64) {
    match pos {
        egui_plot::HoverPosition::NearDataPoint {
            plot_name,
            position,
            ..
        } => (position.x, *plot_name, position.y),
        egui_plot::HoverPosition::Elsewhere { position } => (position.x, "", f64::NAN),
    }
}

/// A reading or marker near the pointer, as a first line: "bench readings: 98.412 MHz".
fn marker_line(name: &str, y_mhz: f64) -> Option<String> {
    let is_marker = name == super::READINGS_LABEL
        || name == "this coil"
        || name == "this setting"
        || (name.starts_with("reading with ") && name.ends_with(" clipped on"));
    (is_marker && y_mhz.is_finite()).then(|| format!("{name}: {} MHz", digits::fixed(y_mhz, 3)))
}

/// The spacing chart's hover text at plot x `x` (display units): the spacing there, then each
/// curve's resonance at that length.
pub fn spacing_text(view: &ChartView<'_>, x: f64) -> String {
    let length = view.length_of_x(x);
    let decimals = view.unit.decimals();
    let mut lines = vec![format!(
        "{} {} {}",
        view.axis.label(),
        digits::fixed(x, decimals),
        view.unit.suffix()
    )];
    if length < view.coil.shortest_length() * (1.0 - 1e-9) {
        lines.push("turns touching: no coil here".to_owned());
        return lines.join("\n");
    }
    let mut any = false;
    // A fixed tank has one curve (no trimmer): one line, never five identical ones.
    let fixed = view.tank.is_fixed();
    for curve in view.cache.spacing_curves() {
        if let Some(hz) = value_at(&curve.points, length) {
            any = true;
            lines.push(if fixed {
                format!("{}: {}", super::FIXED_CURVE_LABEL, digits::mhz(hz))
            } else {
                format!(
                    "trimmer {:.0} %: {}",
                    curve.setting * 100.0,
                    digits::mhz(hz)
                )
            });
        }
    }
    if let Some(before) = view.uncalibrated {
        let present = view.tank.trimmer_setting;
        if let Some(curve) = before.spacing_curve_nearest(present)
            && let Some(hz) = value_at(&curve.points, length)
        {
            lines.push(if fixed {
                format!("before calibration: {}", digits::mhz(hz))
            } else {
                format!(
                    "before calibration, {:.0} %: {}",
                    curve.setting * 100.0,
                    digits::mhz(hz)
                )
            });
        }
    }
    if let Some(classical) = view.classical
        && let Some(curve) = classical
            .cache
            .spacing_curve_nearest(view.tank.trimmer_setting)
        && let Some(hz) = value_at(&curve.points, length)
    {
        let field = view
            .cache
            .spacing_curve_nearest(curve.setting)
            .and_then(|c| value_at(&c.points, length));
        lines.push(classical_line(
            &format!("{:.0} %", curve.setting * 100.0),
            hz,
            field,
        ));
    }
    if !any {
        lines.push("beyond the lengths swept".to_owned());
    }
    lines.join("\n")
}

/// The classical comparison's hover line: "textbook formulas (Nagaoka/Wheeler), 50 %:
/// 99.123 MHz (+1.234 MHz from the field solution)".
fn classical_line(at: &str, hz: f64, field: Option<f64>) -> String {
    let diff = field.map_or(String::new(), |f| {
        format!(" ({} from the field solution)", digits::offset(hz - f))
    });
    format!(
        "{}, {at}: {}{diff}",
        super::CLASSICAL_CURVE_LABEL,
        digits::mhz(hz)
    )
}

/// The trimmer chart's hover text at plot x `x` (percent): the setting, then the resonance
/// there.
pub fn trimmer_text(view: &ChartView<'_>, x: f64) -> String {
    let setting = x / 100.0;
    let mut lines = vec![format!("trimmer {} %", digits::fixed(x, 1))];
    let field = value_at(view.cache.trimmer_curve(), setting);
    match field {
        Some(hz) => lines.push(format!("resonance {}", digits::mhz(hz))),
        None => lines.push("outside the trimmer's travel".to_owned()),
    }
    if let Some(classical) = view.classical
        && let Some(hz) = value_at(classical.cache.trimmer_curve(), setting)
    {
        lines.push(classical_line("this spacing", hz, field));
    }
    lines.join("\n")
}

/// The hover text of a chart: a marker near the pointer first, then `text` at its x.
pub(crate) fn with_marker(
    pos: &egui_plot::HoverPosition<'_>,
    text: impl Fn(f64) -> String,
) -> String {
    let (x, name, y) = hovered(pos);
    match marker_line(name, y) {
        Some(first) => format!("{first}\n{}", text(x)),
        None => text(x),
    }
}

#[cfg(test)]
mod tests {
    use super::value_at;

    #[test]
    fn interpolation_is_exact_on_a_straight_line_and_refuses_outside() {
        let line: Vec<[f64; 2]> = (0..=10)
            .map(|i| [f64::from(i), 3.0 * f64::from(i) + 1.0])
            .collect();
        for x in [0.0, 0.25, 4.5, 9.99, 10.0] {
            let v = value_at(&line, x).expect("inside");
            assert!((v - (3.0 * x + 1.0)).abs() < 1e-12, "{x}: {v}");
        }
        assert_eq!(value_at(&line, -0.1), None);
        assert_eq!(value_at(&line, 10.1), None);
        assert_eq!(value_at(&line, f64::NAN), None);
        assert_eq!(value_at(&[], 1.0), None);
    }
}

//! What a chart shows, in display units (mm or %, MHz), from the engine's own sweeps
//! ([`crate::tuning::sweep`], the same settings, range and sample count as the window's
//! charts) over the figures of [`crate::recipe::figures()`], on the field shape
//! ([`crate::tuning::landing::chart_shape`], the window's too) when the field solution leads.

use crate::recipe::{Figures, Recipe};
use crate::tuning::landing::chart_shape;
use crate::tuning::service::AERONAUTICAL;
use crate::tuning::sweep::{
    CHART_SAMPLES, CHART_SETTINGS, FIXED_CURVE_LABEL, chart_length_range, spacing_sweep_on,
    trimmer_sweep_on,
};
use crate::units::{to_mhz, to_mm};

/// Which chart.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum ChartKind {
    /// Resonance against coil length, one curve per trimmer setting.
    Spacing,
    /// Resonance against trimmer setting at the present length.
    Trimmer,
}

impl ChartKind {
    /// Every chart.
    pub const ALL: [ChartKind; 2] = [ChartKind::Spacing, ChartKind::Trimmer];

    /// Its name on the command line (`--kind`).
    pub fn cli_name(self) -> &'static str {
        match self {
            ChartKind::Spacing => "spacing",
            ChartKind::Trimmer => "trimmer",
        }
    }

    /// The chart named `name` on the command line.
    pub fn from_cli_name(name: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|k| k.cli_name() == name)
    }

    /// Its heading.
    pub fn title(self) -> &'static str {
        match self {
            ChartKind::Spacing => "Resonance against coil length",
            ChartKind::Trimmer => "Resonance against trimmer setting",
        }
    }
}

/// One curve.
#[derive(Clone, Debug, PartialEq)]
pub struct Curve {
    /// Legend text.
    pub label: String,
    /// Trimmer setting 0–1 (picks the colour).
    pub setting: f64,
    /// (x, MHz) in display units; a point the model refused is left out.
    pub points: Vec<(f64, f64)>,
}

/// The target channel, MHz.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Channel {
    /// Its centre.
    pub centre: f64,
    /// Its low and high edges.
    pub edges: (f64, f64),
}

/// Everything one chart draws.
#[derive(Clone, Debug, PartialEq)]
pub struct ChartData {
    /// Which chart.
    pub kind: ChartKind,
    /// Heading, with the recipe's name.
    pub title: String,
    /// Text along the x axis, with its unit.
    pub x_label: &'static str,
    /// The curves.
    pub curves: Vec<Curve>,
    /// The x of the turns-touching limit (spacing chart).
    pub touching: Option<f64>,
    /// The present coil or setting: (x, MHz).
    pub present: Option<(f64, f64)>,
    /// The target channel.
    pub channel: Option<Channel>,
    /// Bench readings taken as the tank stands: (x, measured MHz).
    pub readings: Vec<(f64, f64)>,
    /// Bench readings taken with a known capacitor clipped across the tank: (x, measured MHz,
    /// the capacitor in pF). Each lies on a curve of its own (the tank plus that capacitor),
    /// so it is drawn apart from the curves and from the other readings.
    pub clipped: Vec<(f64, f64, f64)>,
    /// A fixed tank (no trimmer travel): the spacing chart has the one curve
    /// ([`FIXED_CURVE_LABEL`]) and there is no trimmer chart ([`refused`]).
    pub fixed_tank: bool,
}

/// Why the chart of `kind` is not made for `recipe`, if it is not: a fixed tank (no trimmer,
/// or one of no span) has no trimmer chart, since no setting moves its resonance.
pub fn refused(kind: ChartKind, recipe: &Recipe) -> Option<String> {
    (kind == ChartKind::Trimmer && recipe.tank.is_fixed()).then(|| {
        "no trimmer chart for a fixed tank: this recipe has no trimmer (or one of no span), so \
         no setting moves the resonance; the spacing chart (--kind spacing) shows it against \
         the coil's length, the only adjustment"
            .to_owned()
    })
}

impl ChartData {
    /// The x range drawn: the curves' (and the touching limit's), never empty.
    pub fn x_range(&self) -> (f64, f64) {
        let xs = self
            .curves
            .iter()
            .flat_map(|c| c.points.iter().map(|p| p.0))
            .chain(self.touching)
            .chain(self.present.map(|p| p.0));
        let (lo, hi) = min_max(xs);
        match self.kind {
            ChartKind::Trimmer => (-2.0, 102.0),
            ChartKind::Spacing => {
                let span = (hi - lo).max(1e-3);
                (lo - 0.04 * span, hi + 0.02 * span)
            }
        }
    }

    /// The frequency range drawn, MHz: the curves and the channel, padded.
    pub fn y_range(&self) -> (f64, f64) {
        let ys = self
            .curves
            .iter()
            .flat_map(|c| c.points.iter().map(|p| p.1))
            .chain(
                self.channel
                    .into_iter()
                    .flat_map(|c| [c.edges.0, c.edges.1]),
            )
            .chain(self.readings.iter().map(|r| r.1))
            .chain(self.clipped.iter().map(|r| r.1));
        let (lo, hi) = min_max(ys);
        let margin = 0.06 * (hi - lo).max(0.5);
        (lo - margin, hi + margin)
    }

    /// The aeronautical band (108–137 MHz) where the frequency range reaches into it.
    pub fn aeronautical(&self) -> Option<(f64, f64)> {
        let (lo, hi) = self.y_range();
        let band = (to_mhz(AERONAUTICAL.0), to_mhz(AERONAUTICAL.1));
        (hi > band.0 && lo < band.1).then_some((band.0.max(lo), band.1.min(hi)))
    }
}

fn min_max(values: impl Iterator<Item = f64>) -> (f64, f64) {
    let (lo, hi) = values
        .filter(|v| v.is_finite())
        .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), v| {
            (lo.min(v), hi.max(v))
        });
    if lo.is_finite() && hi > lo {
        (lo, hi)
    } else if lo.is_finite() {
        (lo - 0.5, lo + 0.5)
    } else {
        (0.0, 1.0)
    }
}

/// The chart of `kind` for `recipe`, from its figures `f`.
pub fn chart_data(kind: ChartKind, recipe: &Recipe, f: &Figures) -> ChartData {
    let channel = (f.target.channel.is_finite() && f.target.channel > 0.0).then(|| {
        let half = 0.5 * f.target.channel_width.abs();
        Channel {
            centre: to_mhz(f.target.channel),
            edges: (
                to_mhz(f.target.channel - half),
                to_mhz(f.target.channel + half),
            ),
        }
    });
    let resonance = to_mhz(f.target.resonance);
    let title = format!("{} — {}", kind.title(), recipe.name.trim());
    let range = chart_length_range(&f.coil);
    // The field shape over the chart when the field solution leads the figures (the
    // classical shape through the present coil otherwise, or where it fails along the way).
    let shape = f
        .led
        .and_then(|led| chart_shape(&led, &f.coil, &f.tank, range));
    let fixed_tank = f.tank.is_fixed();
    // A reading taken with a capacitor clipped on lies on another curve: kept apart.
    let (plain, clipped): (Vec<_>, Vec<_>) = recipe
        .bench_log
        .iter()
        .partition(|e| e.added_capacitance <= 0.0);
    match kind {
        ChartKind::Spacing => {
            // One curve for a fixed tank: five identical ones would only stack up.
            let settings: &[f64] = if fixed_tank { &[0.0] } else { &CHART_SETTINGS };
            let curves = spacing_sweep_on(
                &f.coil,
                &f.tank,
                &f.conditions,
                settings,
                range,
                CHART_SAMPLES,
                shape.as_ref(),
            )
            .into_iter()
            .map(|c| Curve {
                label: if fixed_tank {
                    FIXED_CURVE_LABEL.to_owned()
                } else {
                    format!("trimmer {:.0} %", c.setting * 100.0)
                },
                setting: c.setting,
                points: finite(c.points.iter().map(|p| (to_mm(p[0]), to_mhz(p[1])))),
            })
            .collect();
            ChartData {
                kind,
                title,
                x_label: "coil length, turns × pitch (mm)",
                curves,
                touching: Some(to_mm(f.coil.shortest_length())),
                present: Some((to_mm(f.coil.length()), resonance)),
                channel,
                readings: plain
                    .iter()
                    .map(|e| (to_mm(e.length), to_mhz(e.measured)))
                    .collect(),
                clipped: clipped
                    .iter()
                    .map(|e| {
                        (
                            to_mm(e.length),
                            to_mhz(e.measured),
                            crate::units::to_pf(e.added_capacitance),
                        )
                    })
                    .collect(),
                fixed_tank,
            }
        }
        ChartKind::Trimmer => {
            let points = trimmer_sweep_on(
                &f.coil,
                &f.tank,
                &f.conditions,
                CHART_SAMPLES,
                shape.as_ref(),
            );
            let here = f.coil.length();
            ChartData {
                kind,
                title,
                x_label: "trimmer setting (%)",
                curves: vec![Curve {
                    label: format!("resonance at {:.2} mm", to_mm(here)),
                    setting: 0.5,
                    points: finite(points.iter().map(|p| (p[0] * 100.0, to_mhz(p[1])))),
                }],
                touching: None,
                present: Some((f.tank.trimmer_setting * 100.0, resonance)),
                channel,
                // Readings at the present length only: at another length they lie on
                // another curve.
                readings: plain
                    .iter()
                    .filter(|e| (e.length - here).abs() <= 1e-6)
                    .map(|e| (e.trimmer_setting * 100.0, to_mhz(e.measured)))
                    .collect(),
                clipped: clipped
                    .iter()
                    .filter(|e| (e.length - here).abs() <= 1e-6)
                    .map(|e| {
                        (
                            e.trimmer_setting * 100.0,
                            to_mhz(e.measured),
                            crate::units::to_pf(e.added_capacitance),
                        )
                    })
                    .collect(),
                fixed_tank,
            }
        }
    }
}

fn finite(points: impl Iterator<Item = (f64, f64)>) -> Vec<(f64, f64)> {
    points
        .filter(|p| p.0.is_finite() && p.1.is_finite())
        .collect()
}

//! The ghost: the coil as it was before the last change, kept faint on the drawing and as a
//! muted marker (and curve, when more than the length changed) on the spacing chart, so that
//! before and after can be compared.
//!
//! A change is any difference in what the bench shows (coil, tank, conditions). A run of
//! changes close together — a drag, the sweep — counts as one: the ghost is the state before
//! the run began. A step or the hand counts as a change of its own every time.

use crate::model::{Coil, Conditions, Tank};
use crate::recipe::Figures;
use crate::tuning::sweep::spacing_sweep;
use crate::ui::charts::{ChartOverlay, OverlayKind};
use eframe::egui::{self, Align2, Color32, FontId, Shape, Stroke, pos2};
use std::f64::consts::{PI, TAU};

/// Legend name of the ghost on the spacing chart.
pub const GHOST_LABEL: &str = "before the last change";

/// Seconds of rest after which the next change starts a new run (and takes a new ghost).
pub const REST_SECONDS: f64 = 0.6;

/// Points in the ghost's curve.
const SAMPLES: usize = 160;

/// What the bench showed at one moment.
#[derive(Clone, Debug, PartialEq)]
pub struct Snapshot {
    /// The coil.
    pub coil: Coil,
    /// The tank that drove the figures.
    pub tank: Tank,
    /// The conditions that drove the figures.
    pub conditions: Conditions,
    /// The resonance, hertz.
    pub resonance: f64,
    /// Resonance against length at the tank's own trimmer setting (filled once it is a ghost).
    pub curve: Vec<[f64; 2]>,
}

impl Snapshot {
    /// The snapshot of `figures` (without its curve).
    pub fn of(figures: &Figures) -> Self {
        Self {
            coil: figures.coil,
            tank: figures.tank,
            conditions: figures.conditions,
            resonance: figures.analysis.resonance,
            curve: Vec::new(),
        }
    }

    fn same_state(&self, other: &Self) -> bool {
        self.coil == other.coil && self.tank == other.tank && self.conditions == other.conditions
    }

    /// Whether `present` lies on this snapshot's curve (only the length differs).
    fn same_curve(&self, present: &Figures) -> bool {
        self.coil
            .with_length(present.coil.length())
            .is_ok_and(|c| c == present.coil)
            && self.tank == present.tank
            && self.conditions == present.conditions
    }

    fn fill_curve(&mut self) {
        let range = super::sweep::range(&self.coil);
        self.curve = spacing_sweep(
            &self.coil,
            &self.tank,
            &self.conditions,
            &[self.tank.trimmer_setting],
            range,
            SAMPLES,
        )
        .into_iter()
        .next()
        .map(|c| c.points)
        .unwrap_or_default();
    }

    /// The ghost on the spacing chart: its marker, and its curve unless `present` lies on it.
    pub fn overlay(&self, present: Option<&Figures>) -> ChartOverlay {
        let curve = if present.is_some_and(|p| self.same_curve(p)) {
            Vec::new()
        } else {
            self.curve.clone()
        };
        ChartOverlay {
            name: GHOST_LABEL.to_owned(),
            kind: OverlayKind::Ghost,
            coil: self.coil,
            curve,
            marker: Some([self.coil.length(), self.resonance]),
        }
    }
}

/// Follows what the bench shows and keeps the ghost.
#[derive(Debug)]
pub struct Tracker {
    previous: Option<Snapshot>,
    ghost: Option<Snapshot>,
    last_change: f64,
}

impl Default for Tracker {
    fn default() -> Self {
        Self {
            previous: None,
            ghost: None,
            last_change: f64::NEG_INFINITY,
        }
    }
}

impl Tracker {
    /// The coil before the last change.
    pub fn ghost(&self) -> Option<&Snapshot> {
        self.ghost.as_ref()
    }

    /// What is shown at `time` (seconds); `discrete` when a step or the hand caused it.
    pub fn observe(&mut self, time: f64, now: Snapshot, discrete: bool) {
        let Some(previous) = self.previous.take() else {
            self.previous = Some(now);
            return;
        };
        if previous.same_state(&now) {
            self.previous = Some(previous);
            return;
        }
        if discrete || time - self.last_change > REST_SECONDS {
            let mut ghost = previous;
            ghost.fill_curve();
            self.ghost = Some(ghost);
        }
        self.last_change = time;
        self.previous = Some(now);
    }
}

/// The ghost's colour on the drawing.
const GHOST_INK: Color32 = Color32::from_rgba_premultiplied(0x6c, 0x68, 0x80, 0xa0);

/// Draw `coil` faint on the coil drawing: its wire's centre line (the same helix as the coil
/// drawing: x = x₀ + p·θ/2π, y = (D/2)·cos θ from θ = π) with its free end marked "before".
/// `origin` is the screen point of the left end on the axis, `scale` points per metre.
pub fn draw_coil(painter: &egui::Painter, coil: &Coil, origin: (f32, f32), scale: f32) {
    let (x0, axis_y) = origin;
    let turns = coil.turns().max(0.0);
    if turns <= 0.0 {
        return;
    }
    let pitch = coil.length() / turns;
    let radius = 0.5 * coil.mean_diameter();
    let theta_end = PI + TAU * turns;
    let steps = ((turns * 48.0).ceil() as usize).clamp(16, 4000);
    let path: Vec<egui::Pos2> = (0..=steps)
        .map(|i| {
            let theta = PI + (theta_end - PI) * i as f64 / steps as f64;
            let m = pitch * (theta - PI) / TAU;
            pos2(
                x0 + m as f32 * scale,
                axis_y - (radius * theta.cos()) as f32 * scale,
            )
        })
        .collect();
    painter.add(Shape::line(path, Stroke::new(1.5, GHOST_INK)));
    let end_x = x0 + coil.length() as f32 * scale;
    let half = (radius as f32 * scale).max(6.0) + 8.0;
    painter.add(Shape::dashed_line(
        &[pos2(end_x, axis_y - half), pos2(end_x, axis_y + half)],
        Stroke::new(1.2, GHOST_INK),
        4.0,
        3.0,
    ));
    painter.text(
        pos2(end_x + 3.0, axis_y + half),
        Align2::LEFT_BOTTOM,
        "before",
        FontId::proportional(11.0),
        GHOST_INK,
    );
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::recipe::{Recipe, figures};

    fn shown(length: f64) -> Snapshot {
        let mut recipe = Recipe::demo();
        recipe.winding.spacing = crate::model::SpacingSpec::Length(length);
        Snapshot::of(&figures(&recipe).expect("valid demo"))
    }

    #[test]
    fn a_run_of_changes_keeps_the_state_before_it() {
        let mut t = Tracker::default();
        t.observe(0.0, shown(10e-3), false);
        assert!(t.ghost().is_none(), "nothing has changed yet");
        t.observe(1.0, shown(10.5e-3), false);
        t.observe(1.1, shown(11e-3), false);
        t.observe(1.2, shown(11.5e-3), false);
        let ghost = t.ghost().expect("a ghost after the change");
        assert!((ghost.coil.length() - 10e-3).abs() < 1e-12);
        assert!(!ghost.curve.is_empty());
        // A step right after is a change of its own.
        t.observe(1.3, shown(12e-3), true);
        assert!((t.ghost().expect("ghost").coil.length() - 11.5e-3).abs() < 1e-12);
    }
}

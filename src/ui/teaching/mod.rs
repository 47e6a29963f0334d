//! The teaching bench: a working mode of the same window for showing an apprentice how spacing
//! moves frequency.
//!
//! Nothing here changes the recipe. The bench shows a *derived copy* of it — the recipe's
//! winding at the demonstrated length, its (calibrated, when there are readings) tank with the
//! hand's capacitance added to the stray — evaluated by the same [`crate::recipe::figures()`]
//! through an [`Evaluation`] of its own. One file per concept:
//!
//! - [`sweep`]: the length moving slowly from close-wound to well spaced and back, the steps;
//! - [`ghost`]: the coil before the last change, kept on the drawing and the chart;
//! - [`hand`]: a hand near the coil on demand (hold H or the button);
//! - [`captions`]: short captions in plain words, each with its figure at that moment;
//! - [`mod@reference`]: a known-good build pinned for comparison, and the differences;
//! - [`presentation`]: larger type and fewer controls for a projector (F5);
//! - `panel`: the bench's own panel (controls, large readouts, captions, reference).

pub mod captions;
pub mod ghost;
pub mod hand;
mod panel;
pub mod presentation;
pub mod reference;
pub mod sweep;

use crate::model::Coil;
use crate::recipe::{FieldInput, Figures, Footing, Recipe, Unled};
use crate::tuning::landing::Shape;

use crate::ui::charts::ChartOverlay;
use crate::ui::evaluation::Evaluation;
use crate::ui::panels::bench::Extras;
use eframe::egui;

pub use captions::Topic;
pub use ghost::GHOST_LABEL;
pub use hand::{HAND_BUTTON_LABEL, HAND_DEFAULT, HAND_KEY, HAND_RANGE};
pub use panel::{
    DIFFERENCES_HEADING, FREQUENCY_LABEL, INDUCTANCE_LABEL, PANEL_HEADING, PIN_FILE_LABEL,
    PIN_PRESENT_LABEL, SWEEP_PAUSE_LABEL, SWEEP_START_LABEL,
};
pub use presentation::PRESENTATION_KEY;
pub use reference::{Difference, Reference};
pub use sweep::{STEP_COARSE, STEP_FINE, Sweep};

/// The teaching bench's state (none of it is saved in the recipe).
#[derive(Default)]
pub struct Teaching {
    on: bool,
    presentation: bool,
    sweep: Sweep,
    /// The length shown instead of the recipe's, metres (`None`: the recipe's own).
    length: Option<f64>,
    /// The recipe coil's length last frame, to notice an edit.
    recipe_length: Option<f64>,
    hand: hand::Hand,
    ghost: ghost::Tracker,
    /// A caption the instructor chose (`None`: follow the demonstration).
    topic: Option<Topic>,
    reference: Option<Reference>,
    /// The pinning controls (typed path fallback, last message).
    pin: reference::PinState,
    /// The derived copy's figures and sweeps.
    display: Option<Evaluation>,
    /// The last step or drag asked for a ghost whatever the time since the last change.
    discrete: bool,
    /// The trimmer's travel at the demonstrated coil on the window's field shape (low, high
    /// hertz; `None` on the classical shape): what the capacitance caption names.
    travel: Option<(f64, f64)>,
}

impl Teaching {
    /// Whether the teaching bench is shown.
    pub fn is_on(&self) -> bool {
        self.on
    }

    /// Show or hide the teaching bench (leaving it also leaves the presentation layout and
    /// stops the sweep; the recipe is as it was).
    pub fn set_on(&mut self, on: bool) {
        self.on = on;
        if !on {
            self.presentation = false;
            self.sweep.running = false;
            self.length = None;
            self.hand.button_down = false;
            self.display = None;
        }
    }

    /// Whether the presentation layout is on.
    pub fn presentation(&self) -> bool {
        self.presentation
    }

    /// Switch the presentation layout (it brings the teaching bench with it).
    pub fn set_presentation(&mut self, on: bool) {
        self.presentation = on;
        if on {
            self.on = true;
        }
    }

    /// The demonstrated length, metres, when it differs from the recipe's.
    pub fn demonstrated_length(&self) -> Option<f64> {
        self.length
    }

    /// The sweep.
    pub fn sweep(&self) -> &Sweep {
        &self.sweep
    }

    /// Whether the hand is near the coil now.
    pub fn hand_held(&self) -> bool {
        self.hand.held
    }

    /// The capacitance the hand adds, farads.
    pub fn hand_capacitance(&self) -> f64 {
        self.hand.capacitance
    }

    /// The coil before the last change, if one is kept.
    pub fn ghost(&self) -> Option<&ghost::Snapshot> {
        self.ghost.ghost()
    }

    /// The pinned reference.
    pub fn reference(&self) -> Option<&Reference> {
        self.reference.as_ref()
    }

    /// Pin `recipe` as the reference, named `name`; refused (with the reason) when the engine
    /// refuses it.
    /// Its figures stand on `footing`, the window's (see [`Figures::footing`]), so its
    /// differences compare like with like.
    pub fn pin(&mut self, name: String, recipe: Recipe, footing: Footing) -> Result<(), String> {
        let pinned = Reference::new(name, recipe, footing)?;
        self.reference = Some(pinned);
        Ok(())
    }

    /// Follow the window's footing: a pinned reference on another is evaluated again on it.
    pub fn follow_footing(&mut self, footing: Footing) {
        if self.reference.as_ref().is_none_or(|r| r.footing == footing) {
            return;
        }
        if let Some(r) = self.reference.take() {
            self.reference = Reference::new(r.name.clone(), r.recipe.clone(), footing)
                .ok()
                .or(Some(r));
        }
    }

    /// The figures the bench shows (the derived copy's), when there are any.
    pub fn shown(&self) -> Option<&Figures> {
        self.display.as_ref().and_then(Evaluation::latest)
    }

    /// Before the panels: the keys (F5 anywhere; H while the bench is on), the sweep's step
    /// for this frame and the derived copy's figures.
    pub fn update(&mut self, ctx: &egui::Context, recipe: &Recipe, base: &Evaluation) {
        let typing = ctx.egui_wants_keyboard_input();
        if !typing && ctx.input_mut(|i| i.consume_key(egui::Modifiers::NONE, PRESENTATION_KEY)) {
            self.set_presentation(!self.presentation);
        }
        if !self.on {
            return;
        }
        let Some(base_figures) = base.latest() else {
            self.display = None;
            return;
        };
        self.follow_footing(base_figures.footing());
        let coil = base_figures.coil;
        // An edit of the recipe's length while paused: show the recipe's length again.
        if self.recipe_length != Some(coil.length()) {
            if self.recipe_length.is_some() && !self.sweep.running {
                self.length = None;
            }
            self.recipe_length = Some(coil.length());
        }
        let key_down = !typing && ctx.input(|i| i.key_down(HAND_KEY));
        let was_held = self.hand.held;
        self.hand.held = key_down || self.hand.button_down;
        if was_held != self.hand.held {
            self.discrete = true;
        }
        if self.sweep.running {
            let dt = f64::from(ctx.input(|i| i.stable_dt));
            let from = self.length.unwrap_or(coil.length());
            self.length = Some(self.sweep.advance(from, sweep::range(&coil), dt));
            ctx.request_repaint();
        }
        self.refresh(ctx, recipe, base_figures, base.shape());
    }

    /// Recompute the derived copy and follow its changes with the ghost. `shape`: the
    /// window's field shape (`None` while the classical model leads or it is being solved),
    /// which the derived copy's figures, charts and the travel its captions name are read
    /// from at the demonstrated length.
    fn refresh(
        &mut self,
        ctx: &egui::Context,
        recipe: &Recipe,
        base: &Figures,
        shape: Option<&Shape>,
    ) {
        let derived = derive(recipe, base, self.length, self.hand.added(), shape);
        // The derived copy carries the driving conditions, with the field solution's factor
        // on the inductance already in them (the shape's at its length): nothing more to
        // apply.
        let field = || FieldInput::Unsolved(Unled::Carried);
        let mut changed = match &mut self.display {
            Some(display) => display.refresh(&derived, field()),
            None => {
                self.display = Some(Evaluation::new(&derived, field()));
                true
            }
        };
        if let Some(display) = &mut self.display {
            changed |= display.lend_shape(shape);
        }
        self.travel = shape.and_then(|shape| {
            let coil = crate::model::Coil::from_winding(&derived.winding).ok()?;
            let at = |s: f64| {
                shape.resonance_at(
                    &coil,
                    coil.length(),
                    derived.tank.external_capacitance_at(s),
                )
            };
            Some((at(1.0), at(0.0)))
        });
        if changed {
            ctx.request_repaint();
        }
        let time = ctx.input(|i| i.time);
        if let Some(shown) = self.display.as_ref().and_then(Evaluation::latest) {
            self.ghost.observe(
                time,
                ghost::Snapshot::of(shown),
                std::mem::take(&mut self.discrete),
            );
        }
    }

    /// After the panels: bring the derived copy up to what they changed this frame.
    pub fn settle(&mut self, ctx: &egui::Context, recipe: &Recipe, base: &Evaluation) {
        if let (true, Some(figures)) = (self.on, base.latest()) {
            self.refresh(ctx, recipe, figures, base.shape());
        }
    }

    /// A length asked for by a drag on the drawing or chart: moves the demonstrated length
    /// while there is one (true), else leaves it to the recipe (false).
    pub fn take_length(&mut self, length: f64, coil: &Coil) -> bool {
        if !self.on || self.length.is_none() {
            return false;
        }
        let (lo, hi) = sweep::range(coil);
        self.sweep.running = false;
        self.length = Some(length.clamp(lo, hi));
        true
    }

    /// What the centre is drawn from while the bench is on: the derived copy's evaluation, and
    /// the ghost and reference as extras.
    pub fn centre<'a>(
        &'a self,
        base: &'a Evaluation,
        overlays: &'a mut Vec<ChartOverlay>,
    ) -> (&'a Evaluation, Extras<'a>) {
        let Some(display) = self.display.as_ref().filter(|_| self.on) else {
            return (base, Extras::default());
        };
        overlays.clear();
        if let Some(reference) = &self.reference {
            overlays.push(reference.overlay());
        }
        let present = display.latest();
        if let Some(ghost) = self.ghost.ghost() {
            overlays.push(ghost.overlay(present));
        }
        (
            display,
            Extras {
                ghost: self.ghost.ghost().map(|g| &g.coil),
                overlays,
                spacing_only: self.presentation,
            },
        )
    }

    /// The bench's own panel (on the right while the bench is on).
    pub fn panel(
        &mut self,
        ui: &mut egui::Ui,
        recipe: &Recipe,
        base: &Evaluation,
        unit: crate::ui::units::LengthUnit,
        files: &mut crate::ui::files::FileDesk,
    ) -> Option<f64> {
        panel::show(self, ui, recipe, base, unit, files)
    }

    /// The View menu's entries for the bench.
    pub fn view_menu(&mut self, ui: &mut egui::Ui) {
        let mut on = self.on;
        if ui.checkbox(&mut on, "Teaching bench").changed() {
            self.set_on(on);
            ui.close();
        }
        let mut presenting = self.presentation;
        let keys = ui.ctx().format_shortcut(&egui::KeyboardShortcut::new(
            egui::Modifiers::NONE,
            PRESENTATION_KEY,
        ));
        if ui
            .add(egui::Button::selectable(presenting, "Presentation layout").shortcut_text(keys))
            .clicked()
        {
            presenting = !presenting;
            self.set_presentation(presenting);
            ui.close();
        }
    }
}

/// The recipe as the bench shows it: its winding at `length` (when given), the tank and
/// conditions that drive its figures (calibrated when there are readings, so that the hand is
/// added after the calibration and not fitted away) with `hand` farads more stray, and no
/// readings of its own. With the window's field `shape`, the conditions carry the shape's
/// factor at that length and capacitance (`Shape::conditions_at`: within the chart's 5 kHz
/// of exact field solves over the sweep, tests/engine/chart_shape.rs), else the figures'
/// factor solved at the recipe's own coil.
pub fn derive(
    recipe: &Recipe,
    base: &Figures,
    length: Option<f64>,
    hand: f64,
    shape: Option<&Shape>,
) -> Recipe {
    let mut winding = recipe.winding;
    if let Some(length) = length {
        crate::ui::panels::winding::set_length(&mut winding, &base.coil, length);
    }
    let mut tank = base.tank;
    tank.stray += hand;
    let conditions = match (shape, Coil::from_winding(&winding)) {
        (Some(shape), Ok(coil)) => shape.conditions_at(coil.length(), tank.external_capacitance()),
        _ => base.conditions,
    };
    Recipe {
        winding,
        tank,
        conditions,
        bench_log: Vec::new(),
        ..recipe.clone()
    }
}

//! A hand near the coil, on demand: while H (or the button) is held, a chosen capacitance is
//! added to the tank's stray in the bench's derived copy — never in the recipe.
//!
//! A hand a few centimetres from a VHF tank coil adds of the order of 1–2 pF across it
//! (common practice; the drift budget in `tuning::drift` takes the same range).

use eframe::egui::Key;

/// The key held for the hand.
pub const HAND_KEY: Key = Key::H;
/// Accessible name of the button held for the hand.
pub const HAND_BUTTON_LABEL: &str = "Hold: a hand near the coil";
/// The hand's capacitance at the start, farads (1 pF: common practice).
pub const HAND_DEFAULT: f64 = 1e-12;
/// The capacitances the field accepts, picofarads (1–2 pF: common practice).
pub const HAND_RANGE: (f64, f64) = (1.0, 2.0);

/// The hand's state.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Hand {
    /// What the hand adds, farads.
    pub capacitance: f64,
    /// Held this frame (key or button).
    pub held: bool,
    /// The button is held down.
    pub button_down: bool,
}

impl Default for Hand {
    fn default() -> Self {
        Self {
            capacitance: HAND_DEFAULT,
            held: false,
            button_down: false,
        }
    }
}

impl Hand {
    /// Capacitance added to the stray now, farads (zero when no hand is near).
    pub fn added(&self) -> f64 {
        if self.held { self.capacitance } else { 0.0 }
    }
}

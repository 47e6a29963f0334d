//! Tankwright: a workbench for hand-wound single-layer air-core coils in VHF LC tanks.
//!
//! Layers, each depending only on those above it in this list ([`units`], the conversions to
//! and from display units, and [`palette`] are used by all):
//! - [`physics`]: pure formulas, SI units, each citing its source;
//! - [`model`]: the coil and tank as a builder gives them, validated, and `evaluate()`;
//! - [`tuning`]: sweeps for charts, sensitivities, solving for a target channel, band plans;
//! - [`recipe`]: the saved document and its file format (the only layer that touches the disk);
//! - [`handout`]: the printed build sheet and worksheet (PDF) and the charts (SVG, PNG);
//! - [`instruments`]: files written by measuring instruments (Touchstone), read from text;
//! - [`cli`]: the headless commands;
//! - [`ui`]: the eframe window (the only layer that imports egui).
//!
//! Bad input is refused with a message, never a panic: no `unwrap` or `expect` outside tests
//! (enforced here; `clippy.toml` exempts `#[cfg(test)]` code).
#![warn(clippy::unwrap_used, clippy::expect_used)]

pub mod cautions;
pub mod cli;
pub mod handout;
pub mod instruments;
pub mod model;
pub mod palette;
pub mod physics;
pub mod recipe;
pub mod terminal_text;
pub mod tuning;
pub mod ui;
pub mod units;

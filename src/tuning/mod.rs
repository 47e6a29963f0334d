//! Tuning a coil to a channel: band plans, sweeps for the charts, sensitivities, solving for
//! the spacing, trimmer or turns that hit a target, calibrating from bench readings, and the
//! advice a builder acts on.
//!
//! Uses the model only; still pure (no egui, no I/O). The window and the headless commands call
//! these functions and have no copies of their own.

pub mod advice;
pub mod bands;
pub mod fit;
pub mod solve;
pub mod sweep;
pub mod target;

pub use bands::BandPlan;

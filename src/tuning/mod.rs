//! Tuning a coil to a channel: band plans, sweeps for the charts, sensitivities, solving for
//! the spacing or trimmer that hits a target, and correcting from a bench measurement.
//!
//! Uses the model only; still pure (no egui, no I/O).

pub mod bands;
pub mod fit;
pub mod impedance;
pub mod solve;
pub mod sweep;

pub use bands::BandPlan;

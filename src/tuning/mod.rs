//! Tuning a coil to a channel: band plans, sweeps for the charts, sensitivities, solving for
//! the spacing or trimmer that hits a target, and correcting from a bench measurement; the
//! stray-capacitance estimate and the spread it leaves; modulation and the drift budget.
//!
//! Uses the model only; still pure (no egui, no I/O).

pub mod bands;
pub mod construction;
pub mod drift;
pub mod fit;
pub mod modulation;
pub mod solve;
pub mod spice_model;
pub mod spread;
pub mod stray;
pub mod sweep;

pub use bands::BandPlan;

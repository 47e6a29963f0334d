//! Tuning a coil to a channel: band plans, sweeps for the charts, sensitivities, solving for
//! the spacing, trimmer or turns that hit a target, calibrating from bench readings, the
//! advice a builder acts on, the verdict (on channel, in band, safe, buildable), the
//! stray-capacitance estimate and the spread it leaves, modulation and the drift budget.
//!
//! Uses the model only; still pure (no egui, no I/O). The window and the headless commands call
//! these functions and have no copies of their own.

pub mod advice;
pub mod apparent;
pub mod audio;
pub mod bands;
pub mod buildable;
pub mod channel_list;
pub mod construction;
pub mod design;
pub mod digits;
pub mod drift;
pub mod field_tank;
pub mod fit;
pub mod impedance;
pub mod landing;
pub mod measured_coil;
pub mod measured_field;
pub mod modulation;
pub mod reading_reach;
pub mod service;
pub mod solve;
pub mod spice_model;
pub mod spread;
pub mod stage;
pub mod stray;
pub mod sweep;
pub mod target;
pub mod verdict;

pub use bands::BandPlan;
pub use verdict::{Aim, Flag, FlagKind, Verdict, judge};

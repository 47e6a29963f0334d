//! Tuning a coil to a channel: band plans, sweeps for the charts, sensitivities, solving for
//! the spacing or trimmer that hits a target, correcting from a bench measurement, and the
//! verdict a builder acts on (on channel, in band, safe, buildable).
//!
//! Uses the model only; still pure (no egui, no I/O).

pub mod bands;
pub mod buildable;
pub mod channel_list;
pub mod digits;
pub mod fit;
pub mod service;
pub mod solve;
pub mod sweep;
pub mod verdict;

pub use bands::BandPlan;
pub use verdict::{Aim, Flag, FlagKind, Verdict, judge};

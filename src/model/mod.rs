//! The coil and tank as a builder describes them, validated, and everything computed from them.
//!
//! `evaluate(&winding, &tank, &conditions)` is the one entry point: inputs are checked first
//! (an [`InputError`] names the field and the reason), then every figure is computed into an
//! [`Analysis`] that carries its own warnings.

mod analysis;
pub mod batch;
mod coil;
mod error;
pub mod evaluate;
mod tank;
mod warnings;
mod winding;

pub use analysis::{Analysis, Geometry, Inductances, SelfResonance, Warning, WarningTopic};
pub use coil::Coil;
pub use error::{Field, InputError};
pub use evaluate::{Conditions, InductanceModel, evaluate, evaluate_coil};
pub use tank::{FeedbackDivider, Tank};
pub use winding::{Coating, DiameterSpec, Gauge, SpacingSpec, Winding, WireSpec};

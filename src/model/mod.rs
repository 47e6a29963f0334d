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
mod field_wire;
mod inductance_model;
mod tank;
mod warnings;
mod winding;

pub use analysis::{Analysis, Inductances, SelfResonance, Warning, WarningTopic};
pub use coil::{Coil, limits};
pub use error::{Field, InputError, short_numbers};
pub use evaluate::{evaluate, evaluate_coil};
pub use field_wire::wire_coil;
pub use inductance_model::{Conditions, InductanceModel};
pub use tank::{CAPACITANCE_MAX, FeedbackDivider, Tank};
pub use warnings::AERONAUTICAL_BAND;
pub use winding::{Coating, DiameterSpec, Gauge, SpacingSpec, Winding, WireSpec};

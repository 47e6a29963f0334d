//! The saved coil recipe: the document the window edits and the file it is kept in.
//!
//! `document` holds the in-memory recipe in SI units (no I/O). `schema` is the on-disk layout
//! (mm, pF, MHz, percent), `convert` the one place the two meet, `format` the text (RON) with
//! line-and-column errors, `rules` what a recipe must meet (for the loader and the window
//! alike), `store` the atomic save, `demos` the compiled-in demo recipes, and `figures` every
//! figure of a recipe (the one function the window and the commands call), `expectation` where
//! the build can be expected to land (stray estimate, spread, calibrated band). This
//! layer is the only one that touches the disk.

mod convert;
mod decimal;
pub mod demos;
pub mod document;
pub mod expectation;
pub mod figures;
pub mod format;
pub mod from_design;
pub mod load;
pub mod rules;
pub mod same;
pub mod schema;
pub mod store;

pub use crate::tuning::field_tank::{FieldBasis, FieldInput, Unled};
pub use demos::demos;
pub use document::{BenchEntry, Recipe, StraySettings, Target};
pub use expectation::{Expectation, expectation};
pub use figures::{Figures, Footing, Modelled, aimed, figures, figures_on, figures_with, modelled};
pub use format::Opened;
pub use load::{LoadError, LoadErrorKind};
pub use store::{SaveError, load, open, save};

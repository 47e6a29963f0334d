//! The saved coil recipe: the document the window edits and the file it is kept in.
//!
//! `document` holds the in-memory recipe in SI units (no I/O). `schema` is the on-disk layout
//! (mm, pF, MHz, percent), `convert` the one place the two meet, `format` the text (RON) with
//! line-and-column errors, `rules` what a recipe must meet (for the loader and the window
//! alike), `store` the atomic save, `demos` the compiled-in demo recipes, and `figures` every
//! figure of a recipe (the one function the window and the commands call). This
//! layer is the only one that touches the disk.

mod convert;
mod decimal;
pub mod demos;
pub mod document;
pub mod figures;
pub mod format;
pub mod load;
pub mod rules;
pub mod schema;
pub mod store;

pub use demos::demos;
pub use document::{BenchEntry, Recipe, Target};
pub use figures::{Figures, figures};
pub use format::Opened;
pub use load::{LoadError, LoadErrorKind};
pub use store::{SaveError, load, open, save};

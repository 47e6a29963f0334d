//! The saved coil recipe: the document the window edits and the file it is kept in.
//!
//! `document` holds the in-memory recipe in SI units (no I/O). The file format, loading with
//! line-and-column errors, and atomic saving live beside it; this layer is the only one that
//! touches the disk.

pub mod document;

pub use document::{BenchEntry, Recipe, Target};

//! The engine and its published references: formulas, solvers, calibration, verdict.
//!
//! One test binary per group keeps the build short (see DEVELOPERS.md, "Tests"): each
//! module below was a test file of its own and keeps its own sources named at its top.

mod bands;
mod batch_spread;
mod bench_fit;
mod chart_shape;
mod design;
mod field_budget;
mod field_lead;
mod fit_field;
mod landing;
mod properties;
mod reference_elliptic;
mod reference_field;
mod reference_inductance;
mod reference_junction;
mod reference_loss;
mod reference_proximity;
mod reference_stage;
mod reference_stray;
mod reference_tank;
mod reference_touchstone;
mod trimmer_resolution;
mod tuning;
mod validation;
mod verdict;

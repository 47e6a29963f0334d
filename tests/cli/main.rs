//! The headless commands and the real program, run as a user runs them.
//!
//! One test binary per group keeps the build short (see DEVELOPERS.md, "Tests"): each
//! module below was a test file of its own and keeps its own sources named at its top.

mod cli_bench;
mod cli_design;
mod cli_evaluate;
mod cli_field_budget;
mod cli_fixed_tank;
mod cli_impedance;
mod cli_impossible;
mod cli_measured;
mod cli_modulation;
mod cli_new;
mod cli_reading;
mod cli_sheet;
mod cli_spice;
mod cli_stage;
mod cli_verdict;
mod common;
mod fuzz;
mod recipe_cli;
mod window_kill;

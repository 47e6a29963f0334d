//! The window driven by label and role (egui_kittest).
//!
//! One test binary per group keeps the build short (see DEVELOPERS.md, "Tests"): each
//! module below was a test file of its own and keeps its own sources named at its top.

mod common;
mod recipe_file_desk;
mod ui_audio;
mod ui_bench_loop;
mod ui_charts;
mod ui_design;
mod ui_export;
mod ui_field;
mod ui_field_shape;
mod ui_figures_worker;
mod ui_include_reading;
mod ui_issue21_charts;
mod ui_junction_tank;
mod ui_layout;
mod ui_new_recipe;
mod ui_recipes;
mod ui_small_things;
mod ui_stage;
mod ui_stray;
mod ui_teaching;
mod ui_trimmer_advice;
mod ui_verdict;
mod ui_workbench;
mod ui_working_copy;

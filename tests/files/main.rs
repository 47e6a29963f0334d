//! Recipe files, the working copy and the hand-outs read back.
//!
//! One test binary per group keeps the build short (see DEVELOPERS.md, "Tests"): each
//! module below was a test file of its own and keeps its own sources named at its top.

mod file_safety;
mod handout_files;
mod handout_issue21;
mod recipe_files_respected;
mod recipe_malformed;
mod recipe_roundtrip;
mod recipe_stage;
mod recipe_store;
mod working_copy;

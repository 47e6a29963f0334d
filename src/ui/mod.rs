//! The eframe window: the only layer that imports egui.

pub mod units;

/// Open the window. Until it exists, explain and fail.
pub fn run(_args: Vec<String>) -> Result<(), String> {
    Err("the window is not built yet; use 'tankwright evaluate' (see 'tankwright help')".to_owned())
}

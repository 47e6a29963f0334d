//! In-window file handling: the "Recipe" and "Export" menus, the shortcuts, the ask-before-discarding dialog
//! and the typed-path fallback. The app owns one [`FileDesk`] and carries out the
//! [`FileAction`]s it returns.

mod asker;
mod desk;
mod export;
mod folder;
mod memory;
mod menu;
mod reference;
mod windows;

pub use asker::{NO_DIALOG, PathAsker, Picked, SystemAsker};
pub use desk::{FileAction, FileDesk, Notice};
pub use export::Export;
pub use folder::{default_folder, recipes_in, suggested_file_name};
pub use memory::{FileDeskMemory, RECENT_MAX};
pub use reference::{ReferencePick, read_reference};

//! Asking the user for a path: the system file dialog behind a small trait, so tests can answer
//! instead and the window can fall back to a typed path where no dialog can be shown.

use std::path::{Path, PathBuf};
use std::time::{Duration, Instant};

/// What the user answered.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum Picked {
    /// A file was chosen.
    Path(PathBuf),
    /// The user closed the dialog without choosing.
    Cancelled,
    /// No dialog could be shown; the reason, to tell the user.
    Unavailable(String),
}

/// Something that asks for a recipe path.
pub trait PathAsker {
    /// A recipe file to open, starting in `folder`.
    fn open(&mut self, folder: &Path) -> Picked;
    /// Where to save, starting in `folder` with `suggested` as the file name.
    fn save(&mut self, folder: &Path, suggested: &str) -> Picked;
    /// Where to write an export (`what`, in words, a file ending in `.extension`), starting in
    /// `folder` with `suggested` as the file name. By default asked like a save.
    fn export(&mut self, folder: &Path, suggested: &str, what: &str, extension: &str) -> Picked {
        let _ = (what, extension);
        self.save(folder, suggested)
    }
}

/// Why the typed-path field is shown instead of a dialog.
pub const NO_DIALOG: &str =
    "no system file dialog available (install xdg-desktop-portal or zenity); type a path";

/// A dialog that returns nothing sooner than this was never shown (rfd returns `None` at once
/// when neither the desktop portal nor zenity answers, exactly as for Cancel).
const NOT_SHOWN_WITHIN: Duration = Duration::from_millis(50);

/// The system's file dialog (desktop portal or zenity, through rfd).
#[derive(Debug, Default)]
pub struct SystemAsker {
    /// Set once a dialog proved unavailable, so later requests go straight to the typed path.
    missing: bool,
}

impl SystemAsker {
    fn ask(&mut self, show: impl FnOnce() -> Option<PathBuf>) -> Picked {
        if self.missing || !dialog_possible() {
            self.missing = true;
            return Picked::Unavailable(NO_DIALOG.to_owned());
        }
        let start = Instant::now();
        match show() {
            Some(path) => Picked::Path(path),
            None if start.elapsed() < NOT_SHOWN_WITHIN => {
                self.missing = true;
                Picked::Unavailable(NO_DIALOG.to_owned())
            }
            None => Picked::Cancelled,
        }
    }
}

impl PathAsker for SystemAsker {
    fn open(&mut self, folder: &Path) -> Picked {
        let folder = folder.to_path_buf();
        self.ask(move || {
            rfd::FileDialog::new()
                .set_title("Open a recipe")
                .add_filter("recipe", &["ron"])
                .set_directory(folder)
                .pick_file()
        })
    }

    fn save(&mut self, folder: &Path, suggested: &str) -> Picked {
        let folder = folder.to_path_buf();
        let suggested = suggested.to_owned();
        self.ask(move || {
            rfd::FileDialog::new()
                .set_title("Save the recipe")
                .add_filter("recipe", &["ron"])
                .set_directory(folder)
                .set_file_name(suggested)
                .save_file()
        })
    }

    fn export(&mut self, folder: &Path, suggested: &str, what: &str, extension: &str) -> Picked {
        let folder = folder.to_path_buf();
        let suggested = suggested.to_owned();
        let title = format!("Export {what}");
        let extension = extension.to_owned();
        self.ask(move || {
            rfd::FileDialog::new()
                .set_title(title)
                .add_filter(extension.to_uppercase(), &[extension.as_str()])
                .set_directory(folder)
                .set_file_name(suggested)
                .save_file()
        })
    }
}

/// Whether a system dialog could be shown at all. On Linux and the BSDs that needs a session
/// bus (for the desktop portal) or zenity on the PATH.
fn dialog_possible() -> bool {
    if cfg!(any(target_os = "windows", target_os = "macos")) {
        return true;
    }
    let bus = std::env::var_os("DBUS_SESSION_BUS_ADDRESS").is_some_and(|v| !v.is_empty())
        || std::env::var_os("XDG_RUNTIME_DIR")
            .is_some_and(|dir| Path::new(&dir).join("bus").exists());
    bus || on_path("zenity")
}

fn on_path(program: &str) -> bool {
    std::env::var_os("PATH")
        .is_some_and(|paths| std::env::split_paths(&paths).any(|p| p.join(program).is_file()))
}

//! Recipes on disk: loading with the path in every error, and atomic saving (a temporary file
//! in the same folder, synced, then renamed over the target), so a failed save loses nothing.

use super::document::Recipe;
use super::format::{MAX_BYTES, from_bytes, to_text};
use super::load::{LoadError, LoadErrorKind};
use std::fmt;
use std::fs::{self, File, OpenOptions};
use std::io::{self, Read, Write};
use std::path::{Path, PathBuf};
use std::sync::atomic::{AtomicU32, Ordering};

/// Open a recipe file. The caller's document is untouched on error.
pub fn load(path: &Path) -> Result<Recipe, LoadError> {
    let read = || -> io::Result<Vec<u8>> {
        let file = File::open(path)?;
        let mut bytes = Vec::new();
        // One byte past the limit is enough to know it is too large.
        file.take(MAX_BYTES as u64 + 1).read_to_end(&mut bytes)?;
        Ok(bytes)
    };
    let bytes = read().map_err(|e| {
        LoadError::new(LoadErrorKind::Read, format!("cannot read it: {e}")).with_path(path)
    })?;
    if bytes.len() > MAX_BYTES {
        return Err(LoadError::new(
            LoadErrorKind::TooLarge,
            format!("larger than {MAX_BYTES} bytes: far larger than any recipe"),
        )
        .with_path(path));
    }
    from_bytes(&bytes).map_err(|e| e.with_path(path))
}

/// The step of a save that failed.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum SaveStep {
    /// The recipe holds a value that would be refused on opening.
    Check,
    /// The path names no file.
    Name,
    /// Creating the temporary file beside the target.
    Create,
    /// Writing the text.
    Write,
    /// Flushing it to the disk.
    Sync,
    /// Renaming it over the target.
    Replace,
}

impl SaveStep {
    fn label(self) -> &'static str {
        match self {
            SaveStep::Check => "the recipe would not open again",
            SaveStep::Name => "no file name",
            SaveStep::Create => "cannot create a temporary file in that folder",
            SaveStep::Write => "writing failed",
            SaveStep::Sync => "flushing to the disk failed",
            SaveStep::Replace => "cannot put the new file in place",
        }
    }
}

/// A save that did not happen. Any previous file at the path is unchanged.
#[derive(Clone, Debug, PartialEq)]
pub struct SaveError {
    /// The file that was to be written.
    pub path: PathBuf,
    /// What failed.
    pub step: SaveStep,
    /// The system's reason.
    pub reason: String,
}

impl fmt::Display for SaveError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(
            f,
            "could not save {}: {}: {} (any earlier version of the file is unchanged)",
            self.path.display(),
            self.step.label(),
            self.reason
        )
    }
}

impl std::error::Error for SaveError {}

/// Save a recipe atomically. A recipe that would not open again (a value the model refuses)
/// is not written; the error says which field.
pub fn save(path: &Path, recipe: &Recipe) -> Result<(), SaveError> {
    let text = to_text(recipe);
    if let Err(e) = super::format::from_text(&text) {
        let field = e.field.map(|f| format!("{f}: ")).unwrap_or_default();
        return Err(SaveError {
            path: path.to_path_buf(),
            step: SaveStep::Check,
            reason: format!("{field}{}", e.reason),
        });
    }
    write_atomically(path, text.as_bytes(), |w, bytes| w.write_all(bytes))
}

/// Distinguishes temporary files of one process.
static COUNTER: AtomicU32 = AtomicU32::new(0);

/// Write `bytes` to `path` atomically, with `write` doing the writing into the temporary file
/// (injectable so tests can fail it midway). On any failure the temporary file is removed and
/// the target is untouched.
pub fn write_atomically<F>(path: &Path, bytes: &[u8], write: F) -> Result<(), SaveError>
where
    F: FnOnce(&mut dyn Write, &[u8]) -> io::Result<()>,
{
    let fail = |step: SaveStep, reason: String| SaveError {
        path: path.to_path_buf(),
        step,
        reason,
    };
    let Some(name) = path.file_name() else {
        return Err(fail(SaveStep::Name, "the path ends in no file name".into()));
    };
    let folder = match path.parent() {
        Some(p) if !p.as_os_str().is_empty() => p.to_path_buf(),
        _ => PathBuf::from("."),
    };
    let temp = folder.join(format!(
        ".{}.saving-{}-{}",
        name.to_string_lossy(),
        std::process::id(),
        COUNTER.fetch_add(1, Ordering::Relaxed)
    ));
    let mut file = OpenOptions::new()
        .write(true)
        .create_new(true)
        .open(&temp)
        .map_err(|e| fail(SaveStep::Create, e.to_string()))?;
    let result = (|| {
        write(&mut file, bytes).map_err(|e| (SaveStep::Write, e))?;
        file.flush().map_err(|e| (SaveStep::Write, e))?;
        file.sync_all().map_err(|e| (SaveStep::Sync, e))?;
        // Keep the old file's permissions (a shared recipe stays shared).
        if let Ok(meta) = fs::metadata(path) {
            let _ = fs::set_permissions(&temp, meta.permissions());
        }
        drop(file);
        fs::rename(&temp, path).map_err(|e| (SaveStep::Replace, e))
    })();
    if let Err((step, e)) = result {
        // Best effort: the temporary file is ours and useless now.
        let _ = fs::remove_file(&temp);
        return Err(fail(step, e.to_string()));
    }
    sync_folder(&folder);
    Ok(())
}

/// Make the rename itself durable where the system allows syncing a directory.
fn sync_folder(folder: &Path) {
    #[cfg(unix)]
    if let Ok(dir) = File::open(folder) {
        // Not every file system supports it; the data is already safe in the file.
        let _ = dir.sync_all();
    }
    #[cfg(not(unix))]
    let _ = folder;
}

//! Recipes on disk: loading with the path in every error, and atomic saving (a temporary file
//! in the same folder, synced, then renamed over the target), so a failed save loses nothing.

use super::document::Recipe;
use super::format::{MAX_BYTES, Opened, read_bytes, to_text};
use super::load::{LoadError, LoadErrorKind};
use std::fmt;
use std::fs::{self, File, OpenOptions};
use std::io::{self, Read, Write};
use std::path::{Path, PathBuf};
use std::sync::atomic::{AtomicU32, Ordering};

/// Open and judge a recipe file: the recipe only when it meets every rule. The caller's
/// document is untouched on error.
pub fn load(path: &Path) -> Result<Recipe, LoadError> {
    open(path)?.judged()
}

/// Read a recipe file without judging its values (see [`super::format::read_text`]): a file
/// that breaks a rule comes back as written, with the rule. Anything but a regular file (a
/// FIFO, a device, a folder) is refused before it is opened, so reading never blocks.
pub fn open(path: &Path) -> Result<Opened, LoadError> {
    let read = || -> io::Result<Vec<u8>> {
        let kind = fs::metadata(path)?.file_type();
        if !kind.is_file() {
            let what = if kind.is_dir() {
                "a folder"
            } else {
                "not a regular file (a pipe, socket or device)"
            };
            return Err(io::Error::other(format!("it is {what}, not a recipe file")));
        }
        let file = open_for_reading(path)?;
        // Checked again on the open handle: the name may have been swapped in between.
        if !file.metadata()?.is_file() {
            return Err(io::Error::other("it is not a regular file"));
        }
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
    read_bytes(&bytes)
        .map(|o| Opened {
            refusal: o.refusal.map(|e| e.with_path(path)),
            recipe: o.recipe,
        })
        .map_err(|e| e.with_path(path))
}

/// Open for reading without waiting for a writer should the name be a FIFO after all.
fn open_for_reading(path: &Path) -> io::Result<File> {
    let mut options = OpenOptions::new();
    options.read(true);
    #[cfg(target_os = "linux")]
    {
        use std::os::unix::fs::OpenOptionsExt;
        /// `O_NONBLOCK` on Linux (all architectures Rust supports there but Alpha and SPARC,
        /// which Tankwright does not target); harmless for a regular file.
        const O_NONBLOCK: i32 = 0o4000;
        options.custom_flags(O_NONBLOCK);
    }
    options.open(path)
}

/// The step of a save that failed.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum SaveStep {
    /// The recipe holds a value that would be refused on opening.
    Check,
    /// The path names no file.
    Name,
    /// Following a symbolic link to the file it names.
    Link,
    /// Creating the temporary file beside the target.
    Create,
    /// Writing the text.
    Write,
    /// Flushing it to the disk.
    Sync,
    /// Renaming it over the target.
    Replace,
    /// Flushing the folder, so the rename itself survives a power cut.
    SyncFolder,
}

impl SaveStep {
    /// Every step, in order (for tests that fail each in turn).
    pub const ALL: [SaveStep; 6] = [
        SaveStep::Link,
        SaveStep::Create,
        SaveStep::Write,
        SaveStep::Sync,
        SaveStep::Replace,
        SaveStep::SyncFolder,
    ];
}

impl SaveStep {
    fn label(self) -> &'static str {
        match self {
            SaveStep::Check => "the recipe would not open again",
            SaveStep::Name => "no file name",
            SaveStep::Link => "cannot follow the link to its file",
            SaveStep::Create => "cannot create a temporary file in that folder",
            SaveStep::Write => "writing failed",
            SaveStep::Sync => "flushing to the disk failed",
            SaveStep::Replace => "cannot put the new file in place",
            SaveStep::SyncFolder => "flushing the folder to the disk failed",
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
    if let Some(e) = super::format::read_text(&text).map_or_else(Some, |o| o.refusal) {
        let field = e.field.map(|f| format!("{f}: ")).unwrap_or_default();
        return Err(SaveError {
            path: path.to_path_buf(),
            step: SaveStep::Check,
            reason: format!("{field}{}", e.reason),
        });
    }
    write_atomically(path, text.as_bytes(), |w, bytes| w.write_all(bytes))
}

/// Permissions of a new file the user saves (the system's umask still applies): readable by
/// others, as an editor would make it.
pub const NEW_FILE_MODE: u32 = 0o666;
/// Permissions of the program's own files (working copy, session): the owner's only.
pub const PRIVATE_MODE: u32 = 0o600;

/// How a save goes: the permissions of a new file, and (for tests) a failure injected at one
/// step.
pub struct SaveHow<'a> {
    /// Unix permission bits for a file that does not exist yet (an existing file keeps its own).
    pub new_mode: u32,
    /// Called before each step; an error stops the save there as if the step had failed.
    pub before: &'a mut dyn FnMut(SaveStep) -> io::Result<()>,
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
    let how = SaveHow {
        new_mode: NEW_FILE_MODE,
        before: &mut |_| Ok(()),
    };
    write_atomically_with(path, bytes, write, how)
}

/// The file a save to `path` writes: `path` itself, or, when it is a symbolic link, the file
/// the link names (followed to the end), so the link stays and its target gets the new text.
///
/// A link in a sticky, world-writable folder (the system's temporary folder) is followed
/// only when it belongs to the user or to the folder's owner: the kernel's own rule for
/// such folders (Linux `fs.protected_symlinks`, Documentation/admin-guide/sysctl/fs.rst),
/// which stops another user's link named like the output from redirecting the write onto a
/// file of theirs choosing. The tool resolves links itself, so it applies the rule itself.
pub fn save_target(path: &Path) -> io::Result<PathBuf> {
    let mut target = path.to_path_buf();
    // The kernel's own limit on links followed in one lookup.
    for _ in 0..40 {
        match fs::symlink_metadata(&target) {
            Ok(meta) if meta.file_type().is_symlink() => {
                protected_link(&target, &meta)?;
                let next = fs::read_link(&target)?;
                target = match target.parent() {
                    Some(dir) if next.is_relative() => dir.join(next),
                    _ => next,
                };
            }
            Ok(_) => return Ok(target),
            Err(e) if e.kind() == io::ErrorKind::NotFound => return Ok(target),
            Err(e) => return Err(e),
        }
    }
    Err(io::Error::other("too many levels of symbolic links"))
}

/// Refuse to follow the link at `link` (its own metadata `meta`) when it lies in a sticky,
/// world-writable folder and belongs neither to this process's user nor to the folder's owner.
#[cfg(unix)]
fn protected_link(link: &Path, meta: &fs::Metadata) -> io::Result<()> {
    use std::os::unix::fs::MetadataExt;
    let folder = match link.parent() {
        Some(p) if !p.as_os_str().is_empty() => p,
        _ => Path::new("."),
    };
    let Ok(dir) = fs::metadata(folder) else {
        return Ok(());
    };
    let sticky_shared = dir.mode() & 0o1000 != 0 && dir.mode() & 0o002 != 0;
    let me = effective_uid();
    if sticky_shared && Some(meta.uid()) != me && meta.uid() != dir.uid() {
        return Err(io::Error::new(
            io::ErrorKind::PermissionDenied,
            format!(
                "{} is a link owned by another user (uid {}) in the shared folder {}: not                  followed (the system's rule for links in shared folders, protected_symlinks);                  choose another name or folder",
                link.display(),
                meta.uid(),
                folder.display()
            ),
        ));
    }
    Ok(())
}

#[cfg(not(unix))]
fn protected_link(_link: &Path, _meta: &fs::Metadata) -> io::Result<()> {
    Ok(())
}

/// This process's effective user id, from `/proc/self/status` (Linux); `None` elsewhere, so
/// a link there is followed only when it belongs to the folder's owner.
#[cfg(unix)]
fn effective_uid() -> Option<u32> {
    let status = fs::read_to_string("/proc/self/status").ok()?;
    let line = status.lines().find_map(|l| l.strip_prefix("Uid:"))?;
    line.split_whitespace().nth(1)?.parse().ok()
}

/// Refuse to replace a file no one may write (mode 0444): renaming over it would replace it
/// though its permissions forbid writing, so the user's protection would be ignored.
fn refuse_read_only(path: &Path) -> io::Result<()> {
    #[cfg(unix)]
    {
        use std::os::unix::fs::PermissionsExt;
        if let Ok(meta) = fs::metadata(path)
            && meta.is_file()
            && meta.permissions().mode() & 0o222 == 0
        {
            return Err(io::Error::new(
                io::ErrorKind::PermissionDenied,
                "the file is read-only (no one may write it): not replaced; make it writable \
                 or choose another name",
            ));
        }
    }
    #[cfg(not(unix))]
    if fs::metadata(path).is_ok_and(|m| m.permissions().readonly()) {
        return Err(io::Error::new(
            io::ErrorKind::PermissionDenied,
            "the file is read-only: not replaced",
        ));
    }
    Ok(())
}

/// [`write_atomically`] with the permissions of a new file and a hook before each step.
/// The temporary file is created with the permissions the file will have (the existing
/// file's, else `how.new_mode`), never wider, so the text is never readable by anyone the
/// finished file would not be.
pub fn write_atomically_with<F>(
    path: &Path,
    bytes: &[u8],
    write: F,
    how: SaveHow<'_>,
) -> Result<(), SaveError>
where
    F: FnOnce(&mut dyn Write, &[u8]) -> io::Result<()>,
{
    let fail = |step: SaveStep, reason: String| SaveError {
        path: path.to_path_buf(),
        step,
        reason,
    };
    let before = how.before;
    before(SaveStep::Link).map_err(|e| fail(SaveStep::Link, e.to_string()))?;
    let target = save_target(path).map_err(|e| fail(SaveStep::Link, e.to_string()))?;
    let path = target.as_path();
    refuse_read_only(path).map_err(|e| fail(SaveStep::Create, e.to_string()))?;
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
    // Keep the old file's permissions (a shared recipe stays shared), from the start.
    let existing = fs::metadata(path).ok().map(|m| m.permissions());
    before(SaveStep::Create).map_err(|e| fail(SaveStep::Create, e.to_string()))?;
    let mut options = OpenOptions::new();
    options.write(true).create_new(true);
    #[cfg(unix)]
    {
        use std::os::unix::fs::{OpenOptionsExt, PermissionsExt};
        let mode = existing
            .as_ref()
            .map_or(how.new_mode, |p| p.mode() & 0o7777);
        options.mode(mode);
    }
    #[cfg(not(unix))]
    let _ = how.new_mode;
    let mut file = options
        .open(&temp)
        .map_err(|e| fail(SaveStep::Create, e.to_string()))?;
    let result = (|| {
        before(SaveStep::Write).map_err(|e| (SaveStep::Write, e))?;
        write(&mut file, bytes).map_err(|e| (SaveStep::Write, e))?;
        file.flush().map_err(|e| (SaveStep::Write, e))?;
        before(SaveStep::Sync).map_err(|e| (SaveStep::Sync, e))?;
        file.sync_all().map_err(|e| (SaveStep::Sync, e))?;
        // The mode given at creation is masked by the umask; put the old file's back exactly.
        if let Some(permissions) = existing {
            let _ = file.set_permissions(permissions);
        }
        drop(file);
        before(SaveStep::Replace).map_err(|e| (SaveStep::Replace, e))?;
        fs::rename(&temp, path).map_err(|e| (SaveStep::Replace, e))
    })();
    if let Err((step, e)) = result {
        // Best effort: the temporary file is ours and useless now.
        let _ = fs::remove_file(&temp);
        return Err(fail(step, e.to_string()));
    }
    // The new file is in place; a failure to flush the folder is reported, but the file on
    // disk is the new one either way.
    before(SaveStep::SyncFolder).map_err(|e| fail(SaveStep::SyncFolder, e.to_string()))?;
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

/// Remove temporary files a killed save left in `folder` for `name` (best effort; only files
/// of the pattern this module makes, and only those of processes no longer running).
pub fn sweep_leftovers(folder: &Path, name: &str) {
    // Whether a process still runs is read from /proc, which only Linux is sure to have.
    if !cfg!(target_os = "linux") {
        return;
    }
    let prefix = format!(".{name}.saving-");
    let Ok(entries) = fs::read_dir(folder) else {
        return;
    };
    for entry in entries.flatten() {
        let file_name = entry.file_name();
        let Some(rest) = file_name.to_str().and_then(|n| n.strip_prefix(&prefix)) else {
            continue;
        };
        let pid = rest.split('-').next().and_then(|p| p.parse::<u32>().ok());
        let alive = pid
            .is_some_and(|p| p == std::process::id() || Path::new(&format!("/proc/{p}")).exists());
        if !alive {
            let _ = fs::remove_file(entry.path());
        }
    }
}

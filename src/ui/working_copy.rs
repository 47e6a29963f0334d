//! The working copy: the recipe on screen, kept as a recipe file of its own so a crash, a
//! `kill -9` or a forgotten save loses at most the last second or two.
//!
//! Two files in the data folder ([`data_folder`]): `working-copy.ron`, an ordinary recipe file
//! (open it like any other), and `session.ron`, what else the window keeps (view preferences,
//! recent files, the file the working copy came from and the recipe as last saved there). Both
//! are written by the recipe store's atomic path (temporary file with the final permissions,
//! sync, rename, sync of the folder), so a kill at any moment leaves the previous or the new
//! version, never a cut one.
//!
//! Writing happens on a thread of its own, fed by the window whenever the document or the
//! session changes: the window does not have to paint again for a change to reach the disk
//! (an idle window paints nothing). The writer gathers changes for at most [`WRITE_PAUSE`]
//! between writes, so a change is on disk within about half a second, and it writes what is
//! left when the window closes.

use crate::recipe::same::same;
use crate::recipe::store::{self, PRIVATE_MODE, SaveError, SaveHow, SaveStep};
use crate::recipe::{LoadError, Opened, Recipe, format};
use crate::ui::files::FileDeskMemory;
use crate::ui::panels::parts_on_hand::PartsOnHandText;
use crate::ui::preferences::Preferences;
use serde::{Deserialize, Serialize};
use std::io::{self, Write};
use std::path::{Path, PathBuf};
use std::sync::mpsc::{self, Receiver, RecvTimeoutError, Sender};
use std::sync::{Arc, Mutex};
use std::thread::JoinHandle;
use std::time::{Duration, Instant};

/// The working copy's file name in the data folder.
pub const WORKING_COPY_FILE: &str = "working-copy.ron";
/// The session's file name in the data folder.
pub const SESSION_FILE: &str = "session.ron";
/// The variable that moves the data folder (tests give each run a folder of its own).
pub const DATA_DIR_VARIABLE: &str = "TANKWRIGHT_DATA_DIR";
/// Shortest time between two writes of the same file: changes during a drag are gathered, so
/// the disk is not flushed sixty times a second. Well inside the promise of two seconds.
pub const WRITE_PAUSE: Duration = Duration::from_millis(500);
/// How the warning about a failed working-copy write begins (the window takes it down when
/// writing holds again).
pub const WORKING_COPY_FAILED: &str = "the working copy cannot be kept in";
/// Longest wait for the last write when the window closes.
const EXIT_WAIT: Duration = Duration::from_secs(5);

/// Where the working copy and the session are kept: `$TANKWRIGHT_DATA_DIR` if set, else
/// `$XDG_DATA_HOME/tankwright`, else `~/.local/share/tankwright`, else a `tankwright-data`
/// folder in the working directory.
pub fn data_folder() -> PathBuf {
    let var = |name: &str| {
        std::env::var_os(name)
            .filter(|v| !v.is_empty())
            .map(PathBuf::from)
    };
    if let Some(dir) = var(DATA_DIR_VARIABLE) {
        return dir;
    }
    let data_home = var("XDG_DATA_HOME")
        .filter(|p| p.is_absolute())
        .or_else(|| var("HOME").map(|home| home.join(".local").join("share")));
    match data_home {
        Some(dir) => dir.join("tankwright"),
        None => PathBuf::from("tankwright-data"),
    }
}

/// The lock file of a working-copy slot: the process id of the window that keeps it.
pub const LOCK_FILE: &str = "window.lock";
/// Most windows kept apart on one data folder.
const MAX_SLOTS: usize = 32;

/// The folder of working-copy slot `index` in `data`: the data folder itself for the first
/// window, `window-2`, `window-3`, … inside it for each further one open at the same time.
pub fn slot_folder(data: &Path, index: usize) -> PathBuf {
    if index == 0 {
        data.to_path_buf()
    } else {
        data.join(format!("window-{}", index + 1))
    }
}

/// Whether the process `pid` runs (Linux: `/proc/PID`; elsewhere assumed running).
fn running(pid: u32) -> bool {
    if !cfg!(target_os = "linux") {
        return true;
    }
    pid == std::process::id() || Path::new(&format!("/proc/{pid}")).exists()
}

/// The process that holds the slot in `folder`, if its lock names one that runs.
fn holder(folder: &Path) -> Option<u32> {
    let text = std::fs::read_to_string(folder.join(LOCK_FILE)).ok()?;
    let pid = text.trim().parse::<u32>().ok()?;
    running(pid).then_some(pid)
}

/// A window's claim on one working-copy slot of the data folder, so two windows on one data
/// folder never write over each other's unsaved work: each keeps its working copy and session
/// in a slot of its own. Released (the lock removed) when dropped; a lock left by a killed
/// window names a process that no longer runs, and the slot is free again (its working copy
/// comes back in the next window that takes it, and is offered meanwhile, see [`restore`]).
#[derive(Debug)]
pub struct SlotClaim {
    /// The slot's folder: where this window's working copy and session are kept.
    pub folder: PathBuf,
    lock: Option<PathBuf>,
}

impl Drop for SlotClaim {
    fn drop(&mut self) {
        if let Some(lock) = &self.lock
            && holder(&self.folder) == Some(std::process::id())
        {
            let _ = std::fs::remove_file(lock);
        }
    }
}

/// Claim the first free slot of `data` (a slot is free when no running window holds its
/// lock). The lock is made whole by a hard link (which fails where the lock exists), so two
/// windows starting at once never take the same slot. When no lock can be made at all (a
/// read-only folder) the first slot is used without one, as before.
pub fn claim_slot(data: &Path) -> SlotClaim {
    for index in 0..MAX_SLOTS {
        let folder = slot_folder(data, index);
        if create_private_folder(&folder).is_err() {
            break;
        }
        let lock = folder.join(LOCK_FILE);
        // The lock appears with its content in one step: the process id is written to a file
        // of this process's own, which is then hard-linked to the lock's name (the link fails
        // if the lock exists). A lock made empty and filled afterwards could be read empty by
        // a window starting at the same moment, taken for a dead window's and removed.
        let own = folder.join(format!("{LOCK_FILE}.{}", std::process::id()));
        if std::fs::write(&own, format!("{}\n", std::process::id())).is_err() {
            break;
        }
        let mut claimed = None;
        for _ in 0..2 {
            match std::fs::hard_link(&own, &lock) {
                Ok(()) => {
                    claimed = Some(lock.clone());
                    break;
                }
                Err(e) if e.kind() == io::ErrorKind::AlreadyExists => {
                    if holder(&folder).is_some() {
                        break;
                    }
                    // Left by a window that no longer runs: take it over (once; a window
                    // starting at the same moment may win the new lock, then go on).
                    let _ = std::fs::remove_file(&lock);
                }
                Err(_) => break,
            }
        }
        let _ = std::fs::remove_file(&own);
        if let Some(lock) = claimed {
            return SlotClaim {
                folder,
                lock: Some(lock),
            };
        }
        if !lock.exists() && holder(&folder).is_none() {
            // No lock could be made here at all (links refused): the first slot without one.
            break;
        }
    }
    SlotClaim {
        folder: data.to_path_buf(),
        lock: None,
    }
}

/// The data folder a slot folder belongs to.
fn data_of(folder: &Path) -> &Path {
    match (folder.file_name(), folder.parent()) {
        (Some(name), Some(parent)) if name.to_string_lossy().starts_with("window-") => parent,
        _ => folder,
    }
}

/// Notes for the window in slot `folder`: that it keeps a working copy of its own (another
/// window holds the first), and the working copies with unsaved changes that windows no
/// longer running left in other slots, offered by path.
fn slot_notes(folder: &Path) -> Vec<String> {
    let data = data_of(folder);
    let mut notes = Vec::new();
    if data != folder {
        notes.push(format!(
            "another Tankwright window is open on the data folder: this window keeps its own \
             working copy in {}",
            folder.display()
        ));
    }
    for index in 0..MAX_SLOTS {
        let other = slot_folder(data, index);
        if other == folder || holder(&other).is_some() {
            continue;
        }
        let copy = other.join(WORKING_COPY_FILE);
        if !copy.is_file() {
            continue;
        }
        let left = restore_one(&other);
        if left.has_unsaved_changes() {
            notes.push(format!(
                "a window that closed unexpectedly left unsaved work in {}: open it with \
                 Recipe → Open",
                copy.display()
            ));
        }
    }
    notes
}

/// What the window keeps besides the recipe (the text of `session.ron`).
#[derive(Clone, Debug, Default, PartialEq, Serialize, Deserialize)]
#[serde(default)]
pub struct Session {
    /// How the window shows things.
    pub preferences: Preferences,
    /// Recent files and the recipe folder.
    pub files: FileDeskMemory,
    /// The file the working copy was opened from or last saved to.
    pub origin: Option<PathBuf>,
    /// The recipe as last opened or saved there, as recipe text, so a change not yet saved is
    /// still marked unsaved after a restart.
    pub saved: Option<String>,
    /// The parts on hand, as typed in "Design from the parts on hand".
    pub parts_on_hand: PartsOnHandText,
}

/// The parts of the window's state the session is made of, compared each frame (cheaply, by
/// value) to see whether the session needs writing.
#[derive(Clone, Debug, PartialEq)]
pub struct SessionState {
    /// See [`Session::preferences`].
    pub preferences: Preferences,
    /// See [`Session::files`].
    pub files: FileDeskMemory,
    /// See [`Session::origin`].
    pub origin: Option<PathBuf>,
    /// The recipe as last opened or saved.
    pub saved: Recipe,
    /// See [`Session::parts_on_hand`].
    pub parts_on_hand: PartsOnHandText,
}

impl SessionState {
    fn to_text(&self) -> String {
        let session = Session {
            preferences: self.preferences,
            files: self.files.clone(),
            origin: self.origin.clone(),
            saved: Some(format::to_text(&self.saved)),
            parts_on_hand: self.parts_on_hand.clone(),
        };
        let config = ron::ser::PrettyConfig::new().struct_names(true);
        let body = ron::ser::to_string_pretty(&session, config).unwrap_or_default();
        format!(
            "// Tankwright session: view preferences, recent files, the last saved recipe.\n{body}\n"
        )
    }
}

/// What was found in the data folder at start.
#[derive(Clone, Debug, Default)]
pub struct Restored {
    /// The working copy as written, with any rule it breaks; `None` when there is none.
    pub copy: Option<Opened>,
    /// The session (defaults when there is none or it could not be read).
    pub session: Session,
    /// The recipe as last saved, when the session holds it.
    pub saved: Option<Recipe>,
    /// What could not be read, in words (the files are left as they are).
    pub problems: Vec<String>,
    /// The files that could not be read (moved aside before anything is written over them).
    pub unreadable: Vec<PathBuf>,
}

impl Restored {
    /// Whether the working copy holds changes that were never saved to a file.
    pub fn has_unsaved_changes(&self) -> bool {
        match (&self.copy, &self.saved) {
            (Some(copy), Some(saved)) => !same(&copy.recipe, saved),
            (Some(_), None) => true,
            (None, _) => false,
        }
    }
}

/// Read the working copy and the session from `folder`. Nothing is discarded: a working copy
/// that breaks a rule comes back as written; one that cannot be read at all is left on disk
/// (and moved aside before anything new is written over it, see [`Keeper::start`]).
pub fn restore(folder: &Path) -> Restored {
    let mut out = restore_one(folder);
    out.problems.extend(slot_notes(folder));
    out
}

/// [`restore`] of one slot, without the notes about the others.
fn restore_one(folder: &Path) -> Restored {
    let mut out = Restored::default();
    let copy_path = folder.join(WORKING_COPY_FILE);
    if copy_path.exists() {
        match store::open(&copy_path) {
            Ok(opened) => out.copy = Some(opened),
            Err(e) => {
                out.problems.push(format!(
                    "the last session's working copy could not be read ({e}); it is kept as {}",
                    aside_name(&copy_path).display()
                ));
                out.unreadable.push(copy_path);
            }
        }
    }
    let session_path = folder.join(SESSION_FILE);
    if session_path.exists() {
        let read = std::fs::read_to_string(&session_path)
            .map_err(|e| e.to_string())
            .and_then(|text| ron::from_str::<Session>(&text).map_err(|e| e.to_string()));
        match read {
            Ok(session) => out.session = session,
            Err(e) => {
                out.problems.push(format!(
                    "the session file {} could not be read ({e}); preferences and recent \
                     files start afresh (the file is kept as {})",
                    session_path.display(),
                    aside_name(&session_path).display()
                ));
                out.unreadable.push(session_path.clone());
            }
        }
    }
    if out.copy.is_none() && out.problems.is_empty() && !session_path.exists() {
        from_earlier_version(folder, &mut out);
    }
    out.saved = out
        .session
        .saved
        .as_deref()
        .and_then(|text| format::read_text(text).ok())
        .map(|o| o.recipe);
    out
}

/// eframe's own state file, where versions before the working-copy file kept the working
/// copy, preferences and recent files (it stays; only the window's size and place are in it
/// from now on, under another name).
pub const EARLIER_STATE_FILE: &str = "app.ron";

/// Take over what an earlier version kept in eframe's state file: read only, once, when the
/// data folder has neither a working copy nor a session yet.
fn from_earlier_version(folder: &Path, out: &mut Restored) {
    #[derive(Deserialize)]
    #[serde(default)]
    #[derive(Default)]
    struct EarlierCopy {
        recipe: String,
        saved: String,
        path: Option<PathBuf>,
    }
    let Ok(text) = std::fs::read_to_string(folder.join(EARLIER_STATE_FILE)) else {
        return;
    };
    let Ok(values) = ron::from_str::<std::collections::HashMap<String, String>>(&text) else {
        return;
    };
    let get = |key: &str| values.get(key).map(String::as_str);
    if let Some(p) =
        get(crate::ui::preferences::PREFERENCES_KEY).and_then(|v| ron::from_str(v).ok())
    {
        out.session.preferences = p;
    }
    if let Some(f) = get("tankwright.files").and_then(|v| ron::from_str(v).ok()) {
        out.session.files = f;
    }
    if let Some(copy) =
        get("tankwright.working_copy").and_then(|v| ron::from_str::<EarlierCopy>(v).ok())
        && let Ok(opened) = format::read_text(&copy.recipe)
    {
        out.copy = Some(opened);
        out.session.origin = copy.path;
        out.session.saved = Some(copy.saved);
    }
}

/// Where an unreadable file is moved before it would be written over.
fn aside_name(path: &Path) -> PathBuf {
    let mut name = path.file_name().unwrap_or_default().to_os_string();
    name.push(".unreadable");
    path.with_file_name(name)
}

/// Write the working copy into `folder` atomically, private to the user; `how.before` may
/// inject a failure at any step (tests).
pub fn write_copy(
    folder: &Path,
    recipe: &Recipe,
    before: &mut dyn FnMut(SaveStep) -> io::Result<()>,
    write: impl FnOnce(&mut dyn Write, &[u8]) -> io::Result<()>,
) -> Result<(), SaveError> {
    let text = format::to_text(recipe);
    store::write_atomically_with(
        &folder.join(WORKING_COPY_FILE),
        text.as_bytes(),
        write,
        SaveHow {
            new_mode: PRIVATE_MODE,
            before,
        },
    )
}

fn write_session(folder: &Path, text: &str) -> Result<(), SaveError> {
    store::write_atomically_with(
        &folder.join(SESSION_FILE),
        text.as_bytes(),
        |w, b| w.write_all(b),
        SaveHow {
            new_mode: PRIVATE_MODE,
            before: &mut |_| Ok(()),
        },
    )
}

enum Job {
    Copy(Recipe),
    Session(SessionState),
    Flush(Sender<()>),
}

/// Keeps the working copy and the session on disk: compares each frame's state with what was
/// last handed over and hands any change to a writer thread.
pub struct Keeper {
    folder: PathBuf,
    jobs: Option<Sender<Job>>,
    thread: Option<JoinHandle<()>>,
    sent_copy: Option<Recipe>,
    sent_session: Option<SessionState>,
    failure: Arc<Mutex<Option<String>>>,
    reported: Option<String>,
}

impl Keeper {
    /// Start keeping into `folder` (created if missing, private to the user). A working copy
    /// or session file that could not be read is first moved aside so nothing is lost.
    pub fn start(folder: PathBuf, restored: &Restored) -> Self {
        let _ = create_private_folder(&folder);
        for path in &restored.unreadable {
            let _ = std::fs::rename(path, aside_name(path));
        }
        for name in [WORKING_COPY_FILE, SESSION_FILE] {
            store::sweep_leftovers(&folder, name);
        }
        // A save killed midway leaves its temporary file beside the user's recipe: clean those
        // next to every file the session knows (the file of the working copy, recent files).
        let known = restored.session.origin.iter();
        for path in known.chain(restored.session.files.recent.iter()) {
            if let (Some(dir), Some(name)) = (path.parent(), path.file_name()) {
                let dir = if dir.as_os_str().is_empty() {
                    Path::new(".")
                } else {
                    dir
                };
                store::sweep_leftovers(dir, &name.to_string_lossy());
            }
        }
        let (jobs, inbox) = mpsc::channel();
        let failure = Arc::new(Mutex::new(None));
        let thread_folder = folder.clone();
        let thread_failure = Arc::clone(&failure);
        let thread = std::thread::Builder::new()
            .name("tankwright-working-copy".into())
            .spawn(move || writer(&thread_folder, &inbox, &thread_failure))
            .ok();
        Self {
            folder,
            jobs: thread.as_ref().map(|_| jobs),
            thread,
            sent_copy: restored.copy.as_ref().map(|c| c.recipe.clone()),
            sent_session: None,
            failure,
            reported: None,
        }
    }

    /// The data folder.
    pub fn folder(&self) -> &Path {
        &self.folder
    }

    /// Call every frame: hands over the document and the session if they changed.
    pub fn observe(&mut self, recipe: &Recipe, session: SessionStateRef<'_>) {
        let Some(jobs) = &self.jobs else {
            return;
        };
        if !self
            .sent_copy
            .as_ref()
            .is_some_and(|sent| same(sent, recipe))
        {
            self.sent_copy = Some(recipe.clone());
            let _ = jobs.send(Job::Copy(recipe.clone()));
        }
        if !session.matches(self.sent_session.as_ref()) {
            let state = session.to_owned();
            self.sent_session = Some(state.clone());
            let _ = jobs.send(Job::Session(state));
        }
    }

    /// The last write that failed, in words (cleared by the next that works).
    pub fn failure(&self) -> Option<String> {
        self.failure.lock().ok().and_then(|f| f.clone())
    }

    /// A change in the writing's state not yet reported: `Some(Some(reason))` when a write
    /// failed (each failure given once), `Some(None)` when writing works again after a
    /// failure (so the warning can be taken down), `None` when nothing changed.
    pub fn failure_change(&mut self) -> Option<Option<String>> {
        let now = self.failure();
        if now == self.reported {
            return None;
        }
        self.reported.clone_from(&now);
        Some(now)
    }

    /// A write failure not yet reported (each is given once, until writing works again).
    pub fn new_failure(&mut self) -> Option<String> {
        self.failure_change().flatten()
    }

    /// Write what is pending now and wait for it (at most a few seconds).
    pub fn flush(&mut self) {
        if let Some(jobs) = &self.jobs {
            let (done, wait) = mpsc::channel();
            if jobs.send(Job::Flush(done)).is_ok() {
                let _ = wait.recv_timeout(EXIT_WAIT);
            }
        }
    }
}

impl Drop for Keeper {
    fn drop(&mut self) {
        // Closing the channel makes the writer write what is left and stop.
        self.jobs = None;
        if let Some(thread) = self.thread.take() {
            let _ = thread.join();
        }
    }
}

/// The session's parts as the window holds them (borrowed: nothing is cloned unless changed).
#[derive(Clone, Copy, Debug)]
pub struct SessionStateRef<'a> {
    /// See [`Session::preferences`].
    pub preferences: Preferences,
    /// See [`Session::files`].
    pub files: &'a FileDeskMemory,
    /// See [`Session::origin`].
    pub origin: Option<&'a Path>,
    /// The recipe as last opened or saved.
    pub saved: &'a Recipe,
    /// See [`Session::parts_on_hand`].
    pub parts_on_hand: &'a PartsOnHandText,
}

impl SessionStateRef<'_> {
    fn matches(&self, sent: Option<&SessionState>) -> bool {
        sent.is_some_and(|s| {
            s.preferences == self.preferences
                && s.files == *self.files
                && s.origin.as_deref() == self.origin
                && same(&s.saved, self.saved)
                && s.parts_on_hand == *self.parts_on_hand
        })
    }

    fn to_owned(self) -> SessionState {
        SessionState {
            preferences: self.preferences,
            files: self.files.clone(),
            origin: self.origin.map(Path::to_path_buf),
            saved: self.saved.clone(),
            parts_on_hand: self.parts_on_hand.clone(),
        }
    }
}

fn create_private_folder(folder: &Path) -> io::Result<()> {
    let mut builder = std::fs::DirBuilder::new();
    builder.recursive(true);
    #[cfg(unix)]
    {
        use std::os::unix::fs::DirBuilderExt;
        builder.mode(0o700);
    }
    builder.create(folder)
}

/// The writer thread: takes the latest copy and session, writes them, waits at least
/// [`WRITE_PAUSE`] before the next write, and writes what is left when the channel closes.
fn writer(folder: &Path, inbox: &Receiver<Job>, failure: &Mutex<Option<String>>) {
    let mut copy: Option<Recipe> = None;
    let mut session: Option<SessionState> = None;
    let mut last_write: Option<Instant> = None;
    let mut waiting: Vec<Sender<()>> = Vec::new();
    loop {
        let pending = copy.is_some() || session.is_some();
        let received = if pending {
            let due =
                last_write.map_or(Duration::ZERO, |t| WRITE_PAUSE.saturating_sub(t.elapsed()));
            inbox.recv_timeout(due)
        } else {
            inbox.recv().map_err(|_| RecvTimeoutError::Disconnected)
        };
        let closed = match received {
            Ok(Job::Copy(r)) => {
                copy = Some(r);
                false
            }
            Ok(Job::Session(s)) => {
                session = Some(s);
                false
            }
            Ok(Job::Flush(done)) => {
                waiting.push(done);
                false
            }
            Err(RecvTimeoutError::Timeout) => false,
            Err(RecvTimeoutError::Disconnected) => true,
        };
        // Gather whatever else is queued: only the latest of each is written.
        while let Ok(job) = inbox.try_recv() {
            match job {
                Job::Copy(r) => copy = Some(r),
                Job::Session(s) => session = Some(s),
                Job::Flush(done) => waiting.push(done),
            }
        }
        let due = last_write.is_none_or(|t| t.elapsed() >= WRITE_PAUSE);
        if due || closed || !waiting.is_empty() {
            let mut result = Ok(());
            // A write that fails (a full disk) keeps its job: it is tried again after the
            // pause, without waiting for another edit, until it holds.
            if let Some(r) = copy.take() {
                result = write_copy(folder, &r, &mut |_| Ok(()), |w, b| w.write_all(b));
                if result.is_err() {
                    copy = Some(r);
                }
            }
            if let Some(s) = session.take() {
                let written = write_session(folder, &s.to_text());
                if written.is_err() {
                    session = Some(s);
                }
                result = result.and(written);
            }
            if let Ok(mut slot) = failure.lock() {
                *slot = result.err().map(|e| e.to_string());
            }
            last_write = Some(Instant::now());
            for done in waiting.drain(..) {
                let _ = done.send(());
            }
        }
        if closed {
            return;
        }
    }
}

/// The choice offered when a recovered working copy with unsaved changes differs from the file
/// asked for on the command line.
#[derive(Clone, Debug, PartialEq)]
pub struct Recovery {
    /// The file asked for.
    pub path: PathBuf,
    /// It, as read.
    pub opened: Opened,
}

/// What the user chose about a [`Recovery`].
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum RecoveryChoice {
    /// Keep the recovered changes on screen (the file is not opened).
    KeepRecovered,
    /// Open the file; the recovered changes are dropped.
    OpenFile,
}

/// The question about a recovered working copy, as a modal window.
pub fn recovery_ui(
    ctx: &eframe::egui::Context,
    recovery: &Recovery,
    recovered_name: &str,
) -> Option<RecoveryChoice> {
    use eframe::egui;
    let mut choice = None;
    egui::Modal::new(egui::Id::unique("tankwright-recovered-copy")).show(ctx, |ui| {
        ui.heading("Recovered changes");
        ui.label(format!(
            "The last session ended with unsaved changes to \"{recovered_name}\". They differ \
             from {}, which you asked to open.",
            recovery.path.display()
        ));
        ui.label("Keep the recovered changes on screen (save them from the Recipe menu), or open the file and drop them?");
        ui.add_space(8.0);
        ui.horizontal(|ui| {
            if ui.button("Keep the recovered changes").clicked() {
                choice = Some(RecoveryChoice::KeepRecovered);
            }
            if ui.button("Open the file").clicked() {
                choice = Some(RecoveryChoice::OpenFile);
            }
        });
    });
    choice
}

/// The refusal of an opened recipe, for the notice line: the recipe is shown as written.
pub fn refusal_notice(e: &LoadError) -> String {
    format!(
        "{e}. The recipe is shown as written; correct the value before saving (the working \
         copy keeps it meanwhile)."
    )
}

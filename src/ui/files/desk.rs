//! The file desk's state and what each request does: new, open, save, save as, quit.

use super::asker::{PathAsker, Picked, SystemAsker};
use super::folder::{suggested_file_name, with_ron_extension};
use super::memory::FileDeskMemory;
use crate::recipe::same::same;
use crate::recipe::{self, Recipe, store};
use std::path::{Path, PathBuf};

/// What the app must do after a file request.
#[derive(Clone, Debug, PartialEq)]
#[must_use]
#[expect(
    clippy::large_enum_variant,
    reason = "one is made per user action and moved straight into the app; a box buys nothing"
)]
pub enum FileAction {
    /// A new or opened recipe: the app replaces its document and clears undo.
    Replace(Recipe),
    /// The user confirmed quitting: the app closes the window
    /// (`ViewportCommand::Close`).
    Quit,
}

/// A message for the user about the last file operation.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Notice {
    /// In words.
    pub text: String,
    /// Whether something went wrong.
    pub is_error: bool,
}

/// A request that may drop unsaved changes, or a save.
#[derive(Clone, Debug, PartialEq)]
pub(super) enum Intent {
    /// A new recipe from the starting point of this service (the one of the recipe on screen).
    New(Option<crate::tuning::service::Service>),
    Open,
    OpenPath(PathBuf),
    OpenDemo(usize),
    Quit,
}

/// Which typed-path prompt is open.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub(super) enum Purpose {
    Open,
    SaveAs,
    /// Write an export, its figures on the footing of the screen when it was asked for.
    Export(super::export::Export, crate::recipe::Footing),
}

/// The fallback path field, shown when no system dialog can be.
#[derive(Clone, Debug, PartialEq)]
pub(super) struct PathPrompt {
    pub purpose: Purpose,
    pub text: String,
    pub reason: String,
    /// What to do after a successful save (a request that waited for it).
    pub then: Option<Intent>,
    /// An existing file the user was asked about replacing (save as), while the question is
    /// open.
    pub replace: Option<PathBuf>,
}

/// The app's file handling: where the document came from, whether it changed since, and the
/// dialogs about it.
pub struct FileDesk {
    /// Persisted between runs by the app.
    pub memory: FileDeskMemory,
    /// The last message for the user; the app shows it (see [`FileDesk::notice_ui`]).
    pub notice: Option<Notice>,
    pub(super) path: Option<PathBuf>,
    pub(super) snapshot: Recipe,
    pub(super) pending: Option<Intent>,
    pub(super) prompt: Option<PathPrompt>,
    pub(super) asker: Box<dyn PathAsker>,
    pub(super) close_confirmed: bool,
}

impl FileDesk {
    /// A desk for `doc`, which counts as unchanged, asking through the system dialog.
    pub fn new(memory: FileDeskMemory, doc: &Recipe) -> Self {
        Self {
            memory,
            notice: None,
            path: None,
            snapshot: doc.clone(),
            pending: None,
            prompt: None,
            asker: Box::new(SystemAsker::default()),
            close_confirmed: false,
        }
    }

    /// The same desk asking for paths through `asker` (tests inject paths this way).
    pub fn with_asker(mut self, asker: Box<dyn PathAsker>) -> Self {
        self.asker = asker;
        self
    }

    /// The file the document was opened from or last saved to.
    pub fn path(&self) -> Option<&Path> {
        self.path.as_deref()
    }

    /// The document as last saved or opened (what "unsaved changes" is measured against).
    pub fn saved_snapshot(&self) -> &Recipe {
        &self.snapshot
    }

    /// Whether `doc` differs from what was last saved or opened.
    pub fn is_dirty(&self, doc: &Recipe) -> bool {
        !same(doc, &self.snapshot)
    }

    /// The window title: the recipe's name, with "• " in front while there are unsaved changes.
    pub fn title(&self, doc: &Recipe) -> String {
        let mark = if self.is_dirty(doc) { "• " } else { "" };
        let name = if doc.name.trim().is_empty() {
            "untitled recipe"
        } else {
            doc.name.trim()
        };
        format!("{mark}{name} — Tankwright")
    }

    /// Record that `doc` was just saved to `path`.
    pub fn mark_saved(&mut self, path: &Path, doc: &Recipe) {
        self.path = Some(path.to_path_buf());
        self.snapshot = doc.clone();
        self.memory.remember(path);
    }

    /// Record that `doc` was just opened (from `path`, or from no file: new or demo).
    pub fn mark_opened(&mut self, path: Option<&Path>, doc: &Recipe) {
        self.path = path.map(Path::to_path_buf);
        self.snapshot = doc.clone();
        self.pending = None;
        if let Some(p) = path {
            self.memory.remember(p);
        }
    }

    /// Let the window close without asking about unsaved changes (they are in the working
    /// copy): for the test-only `--print-shown`.
    pub fn confirm_close(&mut self) {
        self.close_confirmed = true;
    }

    /// Whether a dialog of the desk is open (the app may want to hold its own shortcuts).
    pub fn is_asking(&self) -> bool {
        self.pending.is_some() || self.prompt.is_some()
    }

    pub(super) fn tell(&mut self, text: impl Into<String>) {
        self.notice = Some(Notice {
            text: text.into(),
            is_error: false,
        });
    }

    pub(super) fn warn(&mut self, text: impl Into<String>) {
        self.notice = Some(Notice {
            text: text.into(),
            is_error: true,
        });
    }

    /// A request that may drop changes: asks first when `doc` has unsaved changes.
    pub(super) fn request(&mut self, intent: Intent, doc: &Recipe) -> Option<FileAction> {
        if self.is_dirty(doc) {
            self.pending = Some(intent);
            None
        } else {
            self.carry_out(intent)
        }
    }

    /// Do a request without asking.
    pub(super) fn carry_out(&mut self, intent: Intent) -> Option<FileAction> {
        self.pending = None;
        match intent {
            Intent::New(service) => {
                let fresh = recipe::demos::starting_recipe(service);
                self.mark_opened(None, &fresh);
                let service = service.map_or("FM broadcast", |s| s.label());
                self.tell(format!(
                    "new recipe (not saved yet) from the {service} starting point, no feedback \
                     divider: pick the band plan and channel on the right, then set the coil on \
                     the left to your former and wire (the notes list the parts), or open \
                     \"Design from the parts on hand\" on the left to find the coil, capacitor \
                     and trimmer your drawer holds that land the channel"
                ));
                Some(FileAction::Replace(fresh))
            }
            Intent::Open => match self.asker.open(&self.memory.folder) {
                Picked::Path(p) => self.open_path(&p),
                Picked::Cancelled => None,
                Picked::Unavailable(reason) => {
                    self.prompt = Some(PathPrompt {
                        purpose: Purpose::Open,
                        text: self.memory.folder.join("").display().to_string(),
                        reason,
                        then: None,
                        replace: None,
                    });
                    None
                }
            },
            Intent::OpenPath(p) => self.open_path(&p),
            Intent::OpenDemo(i) => {
                let (file, demo) = recipe::demos().into_iter().nth(i)?;
                self.mark_opened(None, &demo);
                self.tell(format!(
                    "opened the demo {file}; \"Save as…\" keeps your own copy in {}",
                    self.memory.folder.display()
                ));
                Some(FileAction::Replace(demo))
            }
            Intent::Quit => {
                self.close_confirmed = true;
                Some(FileAction::Quit)
            }
        }
    }

    /// Open `path`; on failure the document stays as it is and the reason is shown. A recipe
    /// that breaks a rule opens as written, with the rule shown.
    pub(super) fn open_path(&mut self, path: &Path) -> Option<FileAction> {
        match store::open(path) {
            Ok(opened) => {
                let r = opened.recipe;
                self.mark_opened(Some(path), &r);
                if let Some(dir) = path.parent().filter(|d| !d.as_os_str().is_empty()) {
                    self.memory.folder = dir.to_path_buf();
                }
                match &opened.refusal {
                    Some(e) => self.warn(crate::ui::working_copy::refusal_notice(e)),
                    None => self.tell(format!("opened {}", path.display())),
                }
                Some(FileAction::Replace(r))
            }
            Err(e) => {
                if !path.exists() {
                    self.memory.forget(path);
                }
                self.warn(e.to_string());
                None
            }
        }
    }

    /// Save to the known file, or ask where; then carry out `then` if the save succeeded.
    pub(super) fn save(&mut self, doc: &Recipe, then: Option<Intent>) -> Option<FileAction> {
        match self.path.clone() {
            Some(p) => {
                if self.write(&p, doc) {
                    then.and_then(|t| self.carry_out(t))
                } else {
                    None
                }
            }
            None => self.save_as(doc, then),
        }
    }

    /// Ask where to save (creating the recipe folder first), then save.
    pub(super) fn save_as(&mut self, doc: &Recipe, then: Option<Intent>) -> Option<FileAction> {
        let folder = self.memory.folder.clone();
        if let Err(e) = std::fs::create_dir_all(&folder) {
            self.warn(format!(
                "cannot create the recipe folder {}: {e}",
                folder.display()
            ));
        }
        let suggested = suggested_file_name(&doc.name);
        match self.asker.save(&folder, &suggested) {
            Picked::Path(p) => self.save_to(with_ron_extension(p), doc, then),
            Picked::Cancelled => None,
            Picked::Unavailable(reason) => {
                self.prompt = Some(PathPrompt {
                    purpose: Purpose::SaveAs,
                    text: folder.join(suggested).display().to_string(),
                    reason,
                    then,
                    replace: None,
                });
                None
            }
        }
    }

    /// Save to a chosen path, then carry out `then` if it worked.
    pub(super) fn save_to(
        &mut self,
        path: PathBuf,
        doc: &Recipe,
        then: Option<Intent>,
    ) -> Option<FileAction> {
        if self.write(&path, doc) {
            if let Some(dir) = path.parent().filter(|d| !d.as_os_str().is_empty()) {
                self.memory.folder = dir.to_path_buf();
            }
            then.and_then(|t| self.carry_out(t))
        } else {
            None
        }
    }

    pub(super) fn write(&mut self, path: &Path, doc: &Recipe) -> bool {
        match store::save(path, doc) {
            Ok(()) => {
                self.mark_saved(path, doc);
                self.tell(format!("saved {}", path.display()));
                true
            }
            Err(e) => {
                self.warn(e.to_string());
                false
            }
        }
    }
}

//! Test-only command-line helpers for driving the real window where input events cannot reach
//! it (bare Xvfb): `--replay-edit FIELD=VALUE` makes one edit as if typed once the window has
//! drawn, and `--print-shown` prints what the window shows once it has settled, then closes.
//! Neither is in the usage text.

use crate::recipe::Recipe;
use eframe::egui;

/// Frames drawn before the edit is made (layout settled, the working copy restored).
const EDIT_AT_FRAME: u32 = 3;
/// Frames drawn before what is shown is printed.
const PRINT_AT_FRAME: u32 = 4;

/// One edit, as a user would type it into a field.
#[derive(Clone, Debug, PartialEq)]
pub enum Edit {
    /// The "Turns" field.
    Turns(f64),
    /// The "Recipe name" field.
    Name(String),
}

impl Edit {
    /// `turns=6.5` or `name=Some name`.
    pub fn parse(text: &str) -> Result<Self, String> {
        match text.split_once('=') {
            Some(("turns", v)) => v
                .trim()
                .parse::<f64>()
                .ok()
                .filter(|v| v.is_finite())
                .map(Edit::Turns)
                .ok_or_else(|| format!("--replay-edit turns= needs a number, got '{v}'")),
            Some(("name", v)) => Ok(Edit::Name(v.to_owned())),
            _ => Err("--replay-edit takes turns=NUMBER or name=TEXT (a test helper)".into()),
        }
    }

    fn apply(&self, recipe: &mut Recipe) {
        match self {
            Edit::Turns(t) => recipe.winding.turns = *t,
            Edit::Name(n) => recipe.name.clone_from(n),
        }
    }
}

/// Carries out the test helpers frame by frame.
#[derive(Debug)]
pub struct Driver {
    edit: Option<Edit>,
    print_shown: bool,
    frames: u32,
}

impl Driver {
    /// A driver for the given helpers.
    pub fn new(edit: Option<Edit>, print_shown: bool) -> Self {
        Self {
            edit,
            print_shown,
            frames: 0,
        }
    }

    /// Call once per frame after the window is drawn; `title` is the title shown, `notice` the
    /// message line (if any). True when
    /// the window is to close now (without asking about unsaved changes: they are in the
    /// working copy).
    #[expect(
        clippy::print_stdout,
        clippy::print_stderr,
        reason = "the test-only flags report what the real window did to the test that runs it"
    )]
    pub fn step(
        &mut self,
        ctx: &egui::Context,
        recipe: &mut Recipe,
        title: &str,
        notice: Option<&str>,
    ) -> bool {
        self.frames += 1;
        if self.frames < EDIT_AT_FRAME.max(PRINT_AT_FRAME) {
            ctx.request_repaint();
        }
        if self.frames == EDIT_AT_FRAME
            && let Some(edit) = self.edit.take()
        {
            edit.apply(recipe);
            eprintln!("replayed edit: {edit:?}");
            // One more frame, as after a keystroke; then the window is left idle.
            ctx.request_repaint();
        }
        if self.print_shown && self.frames == PRINT_AT_FRAME {
            println!("title: {title}");
            println!("turns field: {:.2}", recipe.winding.turns);
            println!("name field: {}", crate::terminal_text::clean(&recipe.name));
            if let Some(notice) = notice {
                println!("notice: {}", crate::terminal_text::clean(notice));
            }
            ctx.send_viewport_cmd(egui::ViewportCommand::Close);
            return true;
        }
        false
    }
}

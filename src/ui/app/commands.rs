//! Carrying out what the user asked for: every panel, the bench log included, queues a
//! [`Command`] and the window applies them here, in order, at the end of the frame.

use super::App;
use crate::ui::bench_log::BenchLogAction;
use crate::ui::panels::{Command, winding};

impl From<BenchLogAction> for Command {
    fn from(action: BenchLogAction) -> Self {
        match action {
            BenchLogAction::Record(entry) => Command::RecordReading(entry),
            BenchLogAction::Replace(i, entry) => Command::ReplaceReading(i, entry),
            BenchLogAction::Remove(i) => Command::RemoveReading(i),
            BenchLogAction::SetLength(length) => Command::SetLength(length),
            BenchLogAction::SetTrimmer(setting) => Command::SetTrimmer(setting),
            BenchLogAction::SetTurns(turns, length) => Command::SetTurns(turns, length),
        }
    }
}

impl App {
    /// Carry out `command` (at the end of the frame, after every panel has drawn).
    pub(super) fn apply(&mut self, command: Command) {
        match command {
            Command::Undo => {
                self.history.undo(&mut self.recipe);
            }
            Command::Redo => {
                self.history.redo(&mut self.recipe);
            }
            Command::SetLength(length) => {
                if let Some(coil) = self.evaluation.latest().map(|f| f.coil)
                    && !self.teaching.take_length(length, &coil)
                {
                    winding::set_length(&mut self.recipe.winding, &coil, length);
                }
            }
            Command::SetTurns(turns, length) => {
                if let Some(coil) = self.evaluation.latest().map(|f| f.coil)
                    && let Ok(rewound) = coil.with_turns(turns, length)
                {
                    self.recipe.winding.turns = turns;
                    winding::set_length(&mut self.recipe.winding, &rewound, length);
                }
            }
            Command::SetTrimmer(setting) => {
                if setting.is_finite() {
                    self.recipe.tank.trimmer_setting = setting.clamp(0.0, 1.0);
                }
            }
            Command::OpenCautions => self.cautions_open = true,
            Command::ToggleTheme => self.preferences.theme = self.preferences.theme.toggled(),
            Command::SetUnit(unit) => self.preferences.unit = unit,
            Command::SetFieldSolution(on) => self.preferences.field_solution = on,
            Command::RecordReading(entry) => self.recipe.bench_log.push(entry),
            Command::ReplaceReading(i, entry) => {
                if let Some(slot) = self.recipe.bench_log.get_mut(i) {
                    *slot = entry;
                }
            }
            Command::RemoveReading(i) => {
                if i < self.recipe.bench_log.len() {
                    self.recipe.bench_log.remove(i);
                }
            }
        }
    }
}

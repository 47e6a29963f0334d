//! The headless commands: `evaluate` (from flags or `--recipe FILE`) and `report FILE`.
//!
//! Everything here returns strings; `main.rs` prints them and sets the exit code.

mod args;
mod evaluate;
mod json;
mod recipe_args;
mod report;
mod text;

pub use args::{ArgError, Args};
pub use evaluate::{EvaluateRequest, run_evaluate};
pub use json::analysis_json;
pub use report::{build_report, run_report};
pub use text::analysis_report;

/// `text` with control characters shown as escapes (`\u{1b}`), so a name or value cannot
/// move the cursor, change colours or clear the terminal; line feeds and tabs are kept.
pub fn clean(text: &str) -> String {
    if !text
        .chars()
        .any(|c| c.is_control() && c != '\n' && c != '\t')
    {
        return text.to_owned();
    }
    text.chars()
        .map(|c| {
            if c.is_control() && c != '\n' && c != '\t' {
                c.escape_unicode().to_string()
            } else {
                c.to_string()
            }
        })
        .collect()
}

/// Usage text for `--help`.
pub const USAGE: &str = "\
tankwright — workbench for hand-wound air-core VHF coils

usage:
  tankwright [--screenshot FILE.png] [--theme light|dark]
                                          open the window (the last working copy, or the demo)
  tankwright FILE.ron                     open the window on a saved recipe
  tankwright evaluate FLAGS [--json]      print every figure for one coil
  tankwright evaluate --recipe FILE [--json]   the same for a saved recipe
  tankwright report FILE                  a recipe as a build sheet, then every figure
  tankwright help                         this text

evaluate flags (millimetres, picofarads, megahertz):
  --mean-diameter-mm D   mean (wire-centre) diameter     (or --former-diameter-mm)
  --turns N              turns, fractions allowed
  --length-mm L          coil length, turns x pitch      (or --gap-mm G)
  --wire-mm d            bare wire diameter              (or --awg N, --swg N)
  --enamel GRADE         1 or 2: IEC 60317 enamel grade (default bare)
  --lead-mm x            each of the two leads (default 0)
  --capacitance-pf C     external tank capacitance, all of it but stray (default 0)
  --stray-pf S           stray capacitance (default 0)
  --temperature-c T      wire temperature (default 20)
  --model NAME           round-wire | filament-sum | current-sheet | lundin | wheeler
  --json                 one JSON object instead of the report
";

//! The headless commands: `evaluate` (from flags or `--recipe FILE`), `impedance` and
//! `report FILE`.
//!
//! Everything here returns strings; `main.rs` prints them and sets the exit code.

mod args;
mod evaluate;
mod impedance;
mod json;
mod recipe_args;
mod report;
mod text;

pub use args::{ArgError, Args};
pub use evaluate::{EvaluateRequest, run_evaluate};
pub use impedance::run_impedance;
pub use json::analysis_json;
pub use report::{build_report, run_report};
pub use text::analysis_report;

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
  tankwright impedance FLAGS [--from-mhz A] [--to-mhz B] [--points N] [--json]
                                          the coil's impedance against frequency, solved
                                          from its own currents (also with --recipe FILE)
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
  --json                 one JSON object instead of the report; it adds the field
                         solution: self_resonance_mhz.field_solved and, at the tank's
                         resonance, inductance_nh.apparent (classical: apparent_classical)

impedance flags (besides the coil flags above):
  --from-mhz A           first frequency (default 1)
  --to-mhz B             last frequency (default 1.25 x the self-resonance)
  --points N             frequencies, log-spaced (default 40, at most 2000)
  the leads run straight from the coil's ends to the board and the loop closes beneath the
  coil; --lead-mm 0 gives the isolated coil with its two ends as the terminals
";

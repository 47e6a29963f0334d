//! The headless commands: `evaluate` (from flags or `--recipe FILE`) and `report FILE`.
//!
//! Everything here returns strings; `main.rs` prints them and sets the exit code.

mod args;
mod evaluate;
mod json;
mod recipe_args;
mod report;
mod stray_flags;
mod text;

pub use args::{ArgError, Args};
pub use evaluate::{EvaluateRequest, run_evaluate};
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

stray estimate (adds stray_breakdown_pf and resonance_range_mhz):
  --construction NAME    copper-clad | ground-plane-board | stripboard | perfboard | breadboard
  --capacitance-tolerance-pct T   the fixed capacitor's tolerance (default 5)

modulating junction (adds modulation; the tank then includes the junction at its bias):
  --junction-cj0-pf C --junction-vj V --junction-m M   the law Cj0/(1 + V/phi)^m
  --junction-model '.model NAME D(CJO=.. VJ=.. M=..)'  or a SPICE line (D, NPN, PNP)
  --bias-v V             the junction's DC reverse bias
  --audio-peak-v A       audio peak voltage at the junction (default 0)
  --coupling-pf C        series coupling capacitor (absent: junction straight across the tank)
  --audio-max-khz F      highest audio frequency for Carson's bandwidth (default 15)

drift budget (adds drift):
  --supply-v V --supply-change-v D   supply and its change (default 9 and -2)
  --temperature-change-k K           (default 20)
  --capacitor-class C0G|N750|...     the fixed capacitor's class (default C0G)
  --hand-pf H --load-change-pf L     (defaults 1 and 0.5)
  --channel-tolerance-khz T          how far the carrier may move (default 50)
";

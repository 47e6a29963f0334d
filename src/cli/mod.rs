//! The headless commands: `evaluate` (from flags or `--recipe FILE`), `impedance`,
//! `report FILE`, the hand-outs `sheet` and `chart`, and the oscillator `stage`.
//!
//! Everything here returns strings; `main.rs` prints them and sets the exit code.

mod args;
mod bench;
mod design;
mod evaluate;
mod handout;
mod impedance;
mod json;
mod measured;
mod new_recipe;
mod reading;
mod recipe_args;
mod report;
mod stage;
mod stray_flags;
mod text;
mod verdict;

pub use args::{ArgError, Args, quoted, short};
pub use bench::{run_fit, run_solve};
pub use design::{candidate_json, design_json, run_design};
pub use evaluate::{EvaluateRequest, run_evaluate};
pub use handout::{run_chart, run_sheet, run_spice};
pub use impedance::run_impedance;
pub use json::analysis_json;
pub use measured::run_measured;
pub use new_recipe::run_new;
pub use reading::run_reading;
pub use report::{build_report, run_report};
pub use stage::{run_stage, stage_json};
pub use text::analysis_report;
pub use verdict::{add_verdict_json, verdict_lines};

pub use crate::terminal_text::clean;

/// A message as the terminal gets it: long numbers shortened
/// ([`crate::model::short_numbers`]) and control and bidirectional characters escaped
/// ([`clean`]).
pub fn for_terminal(message: &str) -> String {
    clean(&crate::model::short_numbers(message))
}

/// The last guard before a command's output is printed: a figure that came out NaN or
/// infinite ("NaN", "inf" as a word) is refused, naming the line it was on, rather than
/// printed as if it were a result. Every input check should stop such a figure earlier; this
/// keeps one that slipped through off the screen and out of the files.
pub fn refuse_undefined(out: &str) -> Result<(), String> {
    for line in out.lines() {
        let undefined = line
            .split(|c: char| !c.is_ascii_alphanumeric())
            .any(|w| w == "NaN" || w == "inf" || w == "nan");
        if undefined {
            let label: String = line
                .trim()
                .chars()
                .take_while(|c| !c.is_ascii_digit() && *c != '-' && *c != '+' && *c != 'N')
                .collect();
            let label = label.trim().trim_end_matches([':', '=', '"']).trim();
            return Err(format!(
                "a figure cannot be computed for these inputs (it comes out undefined{}); \
                 nothing is printed rather than a false figure: check the inputs against \
                 'tankwright help'",
                if label.is_empty() {
                    String::new()
                } else {
                    format!(": {}", args::quoted(label))
                }
            ));
        }
    }
    Ok(())
}

/// Usage text for `--help`, with the model names from [`InductanceModel::ALL`].
///
/// [`InductanceModel::ALL`]: crate::model::InductanceModel::ALL
pub fn usage() -> String {
    USAGE.replace("{models}", &crate::model::InductanceModel::cli_names(" | "))
}

const USAGE: &str = "\
tankwright — workbench for hand-wound air-core VHF coils

usage:
  tankwright [--screenshot FILE.png] [--theme light|dark] [--presentation]
                                          open the window (the last working copy, or the demo);
                                          --presentation starts in the teaching bench's
                                          presentation layout (F5 switches it)
  tankwright FILE.ron                     open the window on a saved recipe
  tankwright evaluate FLAGS [--json]      print every figure for one coil
  tankwright evaluate --recipe FILE [--json] [--as-written]
                                          the same for a saved recipe, calibrated on its
                                          bench readings as report and solve are
                                          (--as-written: the recipe alone)
  tankwright report FILE                  a recipe as a build sheet, then every figure
  tankwright sheet FILE --out OUT.pdf     the printable build sheet, spacing chart and
                                          apprentice's worksheet (PDF)
  tankwright chart FILE [--kind spacing|trimmer] --out OUT.svg|OUT.png
                                          one chart as SVG or PNG (default: spacing)
  tankwright solve --recipe FILE [--target-mhz F] [--trimmer-pct P] [--json]
                                          the coil and trimmer that land the target
  tankwright fit --recipe FILE [--json]   the calibration the recipe's bench readings imply
  tankwright design --target-mhz F --formers-mm A,B,.. --wires-mm A,B,.. [--enamel 1|2]
           --fixed-pf A,B,.. --trimmers-pf MIN-MAX,.. [--lead-mm X] [--construction NAME]
           [--count N] [--save-best FILE.ron] [--json]
                                          the coil, capacitor and trimmer from the parts on
                                          hand that land F at mid-travel, ranked, with what
                                          was ruled out and why; formers also in inches
                                          (1/4in), wires also awgN or swgN, fixed capacitors
                                          also as a series (E12:4.7-47), 0 for none; lead
                                          default 5 mm, count 1-20 (default 5)
  tankwright impedance FLAGS [--from-mhz A] [--to-mhz B] [--points N] [--json]
                                          the coil's impedance against frequency, solved
                                          from its own currents (also with --recipe FILE)
  tankwright new FILE.ron FLAGS --target-mhz F [--tolerance-khz K] [--name TEXT]
           [--notes TEXT] [--construction NAME] [--replace]
                                          a new recipe from the coil and tank flags above
                                          (never over an existing file without --replace)
  tankwright reading add FILE (--mhz F | --spectrum SWEEP.csv) [--length-mm L] [--trimmer-pct P]
             [--clip-pf C [--clip-tolerance-pct T]] [--instrument TEXT] [--error-ppm E] [--note TEXT]
                                          append a bench reading to a recipe (saved safely;
                                          length and trimmer default to the recipe's)
  tankwright reading include FILE N [--off]
                                          the fit takes reading N although it suspects it
                                          of being a harmonic (--off: left out again)
  tankwright spice FILE --out TANK.cir     the tank as a SPICE netlist (the coil as a network
                                          fitted to the field solution; ngspice -b TANK.cir
                                          prints resonance = VALUE in hertz)
  tankwright measured FILE.s1p|FILE.s2p [--recipe R [--keep]] [--at-mhz F] [--json]
                                          a coil measured by a network analyser (Touchstone
                                          1.1 or 2.0; .s1p across one port, .s2p in series):
                                          its inductance, self-capacitance, resistance, Q and
                                          self-resonance; with a recipe, beside the field
                                          solution of its coil over the same band; --keep
                                          keeps it with the recipe, where it calibrates the
                                          inductance as bench readings would
  tankwright stage --recipe FILE --supply-v V --bias-upper-ohm R1 --bias-lower-ohm R2
           --emitter-ohm RE (--transistor-model '.model NAME NPN(...)'
           | --hfe B --cbe-pf C --cbc-pf C --ft-mhz F) [--topology common-base|common-collector]
           [--clapp-pf C] [--battery-mah M] [--vceo-v V] [--ic-max-ma I] [--ptot-mw P]
           [--json]
                                          the one-transistor Colpitts stage round the recipe's
                                          tank (its feedback divider the tapped capacitor):
                                          operating point, loop gain and start margin, the
                                          frequency with the transistor's capacitances, supply
                                          current and battery life, and what to change; a
                                          stage kept in the recipe stands in for every flag
                                          not given; --clapp-pf (common collector) puts a
                                          Clapp series capacitor in the coil's branch
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
  --model NAME           {models}
  --trimmer-min-pf C     trimmer at its minimum (with --trimmer-max-pf; default no trimmer)
  --trimmer-max-pf C     trimmer at its maximum
  --trimmer-pct P        trimmer setting, 0 = minimum capacitance (default 50)
  --target-mhz F         the frequency aimed at: offset, on channel, band of its service
  --tolerance-khz T      on channel within +/-T (default: the service's practice)
  --json                 one JSON object instead of the report; it adds the field
                         solution: self_resonance_mhz.field_solved and, at the tank's
                         resonance, inductance_nh.apparent (classical: apparent_classical)

impedance flags (besides the coil flags above):
  --from-mhz A           first frequency (default 1)
  --to-mhz B             last frequency (default 1.25 x the self-resonance)
  --points N             frequencies, log-spaced (default 40, at most 2000)
  the leads run straight from the coil's ends to the board and the loop closes beneath the
  coil; --lead-mm 0 gives the isolated coil with its two ends as the terminals

stray estimate (adds stray_breakdown_pf and resonance_range_mhz):
  --construction NAME    copper-clad | ground-plane-board | stripboard | perfboard | breadboard
  --capacitance-tolerance-pct T   the fixed capacitor's tolerance (default 5)

modulating junction (adds modulation; the tank then includes the junction at its bias):
  --junction-cj0-pf C --junction-vj V --junction-m M   the law Cj0/(1 + V/phi)^m
  --junction-model '.model NAME D(CJO=.. VJ=.. M=..)'  or a SPICE line (D, NPN, PNP)
  --bias-v V             the junction's DC reverse bias
  --audio-peak-v A       audio peak voltage at the junction (default 0)
  --rf-peak-v R          RF peak voltage across the tank (default 2, common practice)
  --coupling-pf C        series coupling capacitor (absent: junction straight across the tank)
  --audio-max-khz F      highest audio frequency for Carson's bandwidth (default 15)

drift budget (adds drift):
  --supply-v V --supply-change-v D   supply and its change (default 9 and -2)
  --temperature-change-k K           (default 20)
  --capacitor-class C0G|N750|...     the fixed capacitor's class (default C0G)
  --hand-pf H --load-change-pf L     (defaults 1 and 0.5)
  --channel-tolerance-khz T          how far the carrier may move (default: the channel's)
";

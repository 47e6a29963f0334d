//! The field solution's cost from the command line (issue 22): an out-of-range `--to-mhz` is
//! refused before any solution starts (it was reported after 24 s of work), and a coil too
//! big for the solution's budget is declined with the reason while the classical model leads.

use crate::common::run_text as run;

const SEVENTY_FIVE: [&str; 11] = [
    "--mean-diameter-mm",
    "8",
    "--turns",
    "75",
    "--length-mm",
    "90",
    "--wire-mm",
    "0.5",
    "--capacitance-pf",
    "20",
    "--json",
];

#[test]
fn an_out_of_range_to_mhz_is_refused_with_the_range_before_any_solution() {
    let mut args = vec!["impedance", "--to-mhz", "1e6"];
    args.extend(SEVENTY_FIVE);
    let (ok, out, err) = run(&args);
    assert!(!ok && out.is_empty(), "{out}");
    // The ceiling: 1.5 wavelengths of the loop's wire (about 1.9 m here), near 240 MHz.
    assert!(
        err.contains("--to-mhz 1000000 is outside the solved range: above")
            && err.contains("give 0–"),
        "{err}"
    );
}

#[test]
fn a_seventy_five_turn_coil_is_declined_with_the_reason_and_the_classical_model_leads() {
    let mut args = vec!["evaluate"];
    args.extend(SEVENTY_FIVE);
    let (ok, out, err) = run(&args);
    assert!(ok, "{err}");
    assert!(
        out.contains("field solution declined") && out.contains("unknowns"),
        "no reason given:\n{out}"
    );
}

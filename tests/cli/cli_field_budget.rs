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

/// Issue 22: `impedance` was bounded in unknowns but not in points × cost (a 60-turn coil's
/// default 40 points took 3.3 s in release). Each point factors the moment matrix once, about
/// (8/3)·n³ real products (Golub and Van Loan, *Matrix Computations*, 4th ed., 2013,
/// §3.2.6), so the count a coil may ask is bounded by n³ and checked before any work: an
/// explicit `--points` beyond it is refused with the range, at once.
#[test]
fn a_sweep_asking_more_points_than_the_coil_allows_is_refused_with_the_range() {
    let sixty = [
        "impedance",
        "--former-diameter-mm",
        "10",
        "--turns",
        "60",
        "--length-mm",
        "120",
        "--wire-mm",
        "0.8",
        "--points",
        "40",
    ];
    let (ok, out, err) = run(&sixty);
    assert!(!ok && out.is_empty(), "{out}");
    assert!(
        err.contains("--points 40: this coil's field solution solves at most")
            && err.contains("give 2–"),
        "{err}"
    );
    // The bound follows n³: the small demo-sized coil keeps the default 40 and more; the
    // 60-turn coil (480 unknowns) is held to the twenty the budget names.
    let small = tankwright::model::Coil::from_winding(&tankwright::recipe::Recipe::demo().winding)
        .expect("coil");
    let most_small = tankwright::tuning::impedance::most_points(&small, 20.0).expect("ok");
    assert!(most_small >= 40, "{most_small}");
    assert_eq!(
        tankwright::physics::field::budget::most_sweep_points(480),
        20
    );
}

//! Helpers shared by the command-line tests: run the real binary as a user runs it.

use std::path::{Path, PathBuf};
use std::process::{Command, Output};

/// Runs `tankwright` with `args` and returns what it left.
pub fn run(args: &[&str]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_tankwright"))
        .args(args)
        .output()
        .expect("the binary runs")
}

/// Runs `tankwright` with `args`: whether it succeeded, its standard output and its errors.
pub fn run_text(args: &[&str]) -> (bool, String, String) {
    let out = run(args);
    (out.status.success(), stdout(&out), stderr(&out))
}

/// A shipped demo recipe, by file name.
pub fn asset(name: &str) -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("assets/recipes")
        .join(name)
}

/// A shipped demo recipe's path as text, for an argument list.
pub fn asset_str(name: &str) -> String {
    asset(name).to_str().expect("utf-8").to_owned()
}

/// Standard output as text (invalid UTF-8 shown as replacement characters).
pub fn stdout(o: &Output) -> String {
    String::from_utf8_lossy(&o.stdout).into_owned()
}

/// Standard error as text.
pub fn stderr(o: &Output) -> String {
    String::from_utf8_lossy(&o.stderr).into_owned()
}

/// `evaluate --json` of the coil the junction and drift checks share: 7 mm mean diameter, 5 turns
/// over 9 mm of 0.8 mm wire, 4 mm leads, 22 pF across (one copy for every file that uses it).
pub const JUNCTION_COIL: [&str; 14] = [
    "evaluate",
    "--mean-diameter-mm",
    "7",
    "--turns",
    "5",
    "--length-mm",
    "9",
    "--wire-mm",
    "0.8",
    "--lead-mm",
    "4",
    "--capacitance-pf",
    "22",
    "--json",
];

//! `tankwright spice`: the tank as a netlist, run in ngspice (Debian package `ngspice`,
//! installed by .ci/setup; the tool never calls it), which must find the tool's own resonance
//! within 0.1 % for every shipped recipe (the network's fit to the field solution errs by
//! about half its RMS difference of X in frequency, the zero-phase point by (1/Q²)/2, the
//! sweep's interpolation by under 1e-5). ngspice: the circuit simulator of Nenzi and Vogt,
//! *Ngspice User's Manual*, version 4x, §15.4 (.meas ... WHEN).

use crate::common::{asset_str, run_text};
use std::process::Command;

#[expect(
    clippy::print_stderr,
    reason = "a skipped reference check says so, as the other outside-tool checks do"
)]
fn ngspice_resonance(netlist: &std::path::Path) -> Option<f64> {
    let out = match Command::new("ngspice").arg("-b").arg(netlist).output() {
        Ok(o) => o,
        Err(_) => {
            assert!(
                std::env::var_os("CI").is_none(),
                "ngspice is needed under CI (.ci/setup installs it)"
            );
            eprintln!("skipped: ngspice is not installed (apt install ngspice)");
            return None;
        }
    };
    let text = String::from_utf8_lossy(&out.stdout).into_owned();
    let line = text
        .lines()
        .find(|l| l.trim_start().starts_with("resonance"))
        .unwrap_or_else(|| panic!("no resonance line in ngspice's output:\n{text}"));
    let value = line
        .split('=')
        .nth(1)
        .and_then(|v| v.split_whitespace().next())
        .and_then(|v| v.parse::<f64>().ok())
        .unwrap_or_else(|| panic!("unreadable: {line}"));
    Some(value)
}

#[test]
fn ngspice_finds_the_tools_resonance_in_every_shipped_recipe() {
    let dir = tempfile::tempdir().expect("temp dir");
    for name in [
        "lantern_hill_bench_oscillator.ron",
        "lantern_hill_two_metre_buffer.ron",
        "apprentice_enamel_exercise.ron",
        "field_day_club_channels.ron",
    ] {
        let recipe = asset_str(name);
        let out = dir.path().join(name.replace(".ron", ".cir"));
        let out_s = out.to_str().expect("utf-8");
        let (ok, said, err) = run_text(&["spice", &recipe, "--out", out_s]);
        assert!(ok, "{name}: {err}");
        // The tool's resonance as the command states it (6 decimals of MHz).
        let tool: f64 = said
            .split("resonance ")
            .nth(1)
            .and_then(|s| s.split(" MHz").next())
            .and_then(|s| s.parse().ok())
            .unwrap_or_else(|| panic!("{name}: {said}"));
        let netlist = std::fs::read_to_string(&out).expect("written");
        assert!(
            netlist.contains("Lcoil") && netlist.contains(".meas ac resonance"),
            "{netlist}"
        );
        let Some(found) = ngspice_resonance(&out) else {
            return;
        };
        let rel = (found * 1e-6 - tool).abs() / tool;
        assert!(
            rel < 1e-3,
            "{name}: ngspice {found} Hz, the tool {tool} MHz ({rel:e})"
        );
    }
}

#[test]
fn spice_mistakes_are_refused() {
    let dir = tempfile::tempdir().expect("temp dir");
    let recipe = asset_str("lantern_hill_bench_oscillator.ron");
    let bad = dir.path().join("tank.txt");
    let (ok, _, err) = run_text(&["spice", &recipe, "--out", bad.to_str().expect("utf-8")]);
    assert!(!ok && err.contains(".cir"), "{err}");
    assert!(!bad.exists());
    let (ok, _, err) = run_text(&["spice", &recipe]);
    assert!(!ok && err.contains("--out"), "{err}");
}

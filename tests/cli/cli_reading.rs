//! `tankwright reading add`: a bench reading appended to a recipe from the command line and
//! then used by `fit`, as the window's bench log would (the calibration itself is held to its
//! forward model in tests/engine/bench_fit.rs).

use crate::common::{asset, run_text};
use tankwright::recipe::store;

#[test]
fn a_reading_is_appended_and_the_fit_uses_it() {
    let dir = tempfile::tempdir().expect("temp dir");
    let file = dir.path().join("bench.ron");
    std::fs::copy(asset("lantern_hill_bench_oscillator.ron"), &file).expect("copied");
    let path = file.to_str().expect("utf-8");
    let before = store::load(&file).expect("opens").bench_log.len();
    let (ok, said, err) = run_text(&[
        "reading",
        "add",
        path,
        "--mhz",
        "97.9",
        "--trimmer-pct",
        "40",
        "--instrument",
        "counter",
        "--error-ppm",
        "2",
    ]);
    assert!(ok, "{err}");
    assert!(said.contains("added reading"), "{said}");
    let recipe = store::load(&file).expect("opens");
    assert_eq!(recipe.bench_log.len(), before + 1);
    let r = recipe.bench_log.last().expect("reading");
    assert_eq!(r.measured, 97.9e6);
    assert_eq!(r.trimmer_setting, 0.4);
    assert_eq!(r.instrument, "counter");
    assert_eq!(r.error_ppm, Some(2.0));
    // The length defaults to the recipe's coil.
    let coil = tankwright::model::Coil::from_winding(&recipe.winding).expect("coil");
    assert!((r.length - coil.length()).abs() < 1e-12);
    let (ok, out, err) = run_text(&["fit", "--recipe", path, "--json"]);
    assert!(ok, "{err}");
    let v: serde_json::Value = serde_json::from_str(&out).expect("JSON");
    // The bench demo ships with no readings: the one added is the one the fit rests on.
    assert_eq!(
        v["readings_used"].as_u64(),
        Some((before + 1) as u64),
        "{out}"
    );
}

#[test]
fn a_bad_reading_is_refused_and_the_file_kept() {
    let dir = tempfile::tempdir().expect("temp dir");
    let file = dir.path().join("bench.ron");
    std::fs::copy(asset("lantern_hill_bench_oscillator.ron"), &file).expect("copied");
    let path = file.to_str().expect("utf-8");
    let before = std::fs::read(&file).expect("read");
    for (args, words) in [
        (vec!["reading", "add", path], "--mhz"),
        (vec!["reading", "add", path, "--mhz", "-3"], "--mhz -3"),
        (
            vec![
                "reading",
                "add",
                path,
                "--mhz",
                "98",
                "--trimmer-pct",
                "140",
            ],
            "--trimmer-pct",
        ),
        (vec!["reading", "remove", path], "unknown reading command"),
        (
            vec!["reading", "add", path, "--mhz", "98", "--colour", "red"],
            "--colour",
        ),
    ] {
        let (ok, _, err) = run_text(&args);
        assert!(!ok, "{args:?} accepted");
        assert!(err.contains(words), "{args:?}: {err}");
        assert_eq!(
            std::fs::read(&file).expect("read"),
            before,
            "{args:?} changed the file"
        );
    }
}

/// A receiver's sweep written here: 96–100 MHz in hops of 1 MHz, 5 kHz bins, noise from a
/// seeded generator around −60 dB, and a carrier at 97.5312 MHz 40 dB up. The carrier must
/// come back within the bin step (the file's resolution, kept as the reading's error).
fn sweep_csv(carrier_hz: f64) -> String {
    let mut state: u64 = 0x2545_f491_4f6c_dd1d;
    let mut noise = move || {
        state ^= state << 13;
        state ^= state >> 7;
        state ^= state << 17;
        (state % 1000) as f64 / 1000.0 * 6.0 - 3.0
    };
    let step = 5e3;
    let mut out = String::new();
    for hop in 0..4 {
        let low = 96e6 + hop as f64 * 1e6;
        let high = low + 1e6;
        let bins = ((high - low) / step) as usize;
        let mut row = format!("2026-12-04, 16:40:00, {low}, {high}, {step}, 20");
        for i in 0..bins {
            let f = low + (i as f64 + 0.5) * step;
            let signal = if (f - carrier_hz).abs() < step / 2.0 {
                40.0
            } else {
                0.0
            };
            row += &format!(", {:.2}", -60.0 + noise() + signal);
        }
        out += &row;
        out.push('\n');
    }
    out
}

#[test]
fn a_receivers_sweep_gives_the_carrier_with_its_bin_as_the_error() {
    let dir = tempfile::tempdir().expect("temp dir");
    let file = dir.path().join("bench.ron");
    std::fs::copy(asset("lantern_hill_bench_oscillator.ron"), &file).expect("copied");
    let csv = dir.path().join("sweep.csv");
    let carrier = 97.5312e6;
    std::fs::write(&csv, sweep_csv(carrier)).expect("written");
    let (ok, _, err) = run_text(&[
        "reading",
        "add",
        file.to_str().expect("utf-8"),
        "--spectrum",
        csv.to_str().expect("utf-8"),
    ]);
    assert!(ok, "{err}");
    let recipe = store::load(&file).expect("opens");
    let r = recipe.bench_log.last().expect("reading");
    assert!((r.measured - carrier).abs() <= 5e3, "{}", r.measured);
    let ppm = r.error_ppm.expect("error kept");
    assert!((ppm - 5e3 / r.measured * 1e6).abs() < 1e-9, "{ppm}");
    assert!(r.instrument.contains("receiver sweep"), "{}", r.instrument);

    // Noise alone has no carrier; a short row is refused with its line.
    let flat = dir.path().join("flat.csv");
    std::fs::write(&flat, sweep_csv(1.0)).expect("written");
    let (ok, _, err) = run_text(&[
        "reading",
        "add",
        file.to_str().expect("utf-8"),
        "--spectrum",
        flat.to_str().expect("utf-8"),
    ]);
    assert!(!ok && err.contains("no carrier"), "{err}");
    let short = dir.path().join("short.csv");
    std::fs::write(&short, "2026-12-04, 16:40:00, 96e6, 97e6\n").expect("written");
    let (ok, _, err) = run_text(&[
        "reading",
        "add",
        file.to_str().expect("utf-8"),
        "--spectrum",
        short.to_str().expect("utf-8"),
    ]);
    assert!(!ok && err.contains("line 1"), "{err}");
}

/// Issue 22: one 400 MHz reading on the 2 m demo was taken in and the calibration then printed
/// "trimmer reaches only 247.736–NaN MHz". The 2 m tank (5 turns on 5 mm, 4.7 pF fixed, a
/// 2–8 pF trimmer) cannot resonate near 400 MHz with any stray at or above zero: the reading is
/// refused where it enters, naming the highest frequency this tank could show, and the file is
/// kept. The bound is the tool's own (no stray, the lowest accepted inductance scale), so a
/// reading at the tank's modelled resonance is still taken.
#[test]
fn a_reading_no_stray_could_give_is_refused_with_the_tanks_highest() {
    let dir = tempfile::tempdir().expect("temp dir");
    let file = dir.path().join("two_metre.ron");
    std::fs::copy(asset("lantern_hill_two_metre_buffer.ron"), &file).expect("copied");
    let path = file.to_str().expect("utf-8");
    let before = std::fs::read(&file).expect("read");
    let (ok, _, err) = run_text(&["reading", "add", path, "--mhz", "400"]);
    assert!(!ok, "a 400 MHz reading was taken");
    assert!(err.contains("--mhz"), "{err}");
    assert!(err.contains("above anything this tank can reach"), "{err}");
    // The highest it could show is stated, and it lies between the tank's own resonance and
    // the refused reading.
    let top: f64 = err
        .split("resonate at most at ")
        .nth(1)
        .and_then(|t| t.split(' ').next())
        .and_then(|t| t.parse().ok())
        .unwrap_or_else(|| panic!("no highest frequency in: {err}"));
    assert!(top > 146.0 && top < 400.0, "{top} MHz");
    assert_eq!(std::fs::read(&file).expect("read"), before, "file changed");
    // A reading on the 2 m channel is taken.
    let (ok, _, err) = run_text(&["reading", "add", path, "--mhz", "145.6"]);
    assert!(ok, "{err}");
}

/// Issue 24: the clip-on capacitor's tolerance is kept with the reading (`--clip-tolerance-pct`)
/// and written to the file; without a capacitor it is refused, the file kept.
#[test]
fn the_clip_on_tolerance_is_kept_with_the_reading() {
    let dir = tempfile::tempdir().expect("temp dir");
    let file = dir.path().join("bench.ron");
    std::fs::copy(asset("lantern_hill_bench_oscillator.ron"), &file).expect("copied");
    let path = file.to_str().expect("utf-8");
    let before = std::fs::read(&file).expect("read");
    let (ok, _, err) = run_text(&[
        "reading",
        "add",
        path,
        "--mhz",
        "97.5",
        "--clip-tolerance-pct",
        "1",
    ]);
    assert!(
        !ok && err.contains("--clip-tolerance-pct needs --clip-pf"),
        "{err}"
    );
    assert_eq!(std::fs::read(&file).expect("read"), before);
    let (ok, _, err) = run_text(&[
        "reading",
        "add",
        path,
        "--mhz",
        "97.5",
        "--clip-pf",
        "10",
        "--clip-tolerance-pct",
        "1",
    ]);
    assert!(ok, "{err}");
    let text = std::fs::read_to_string(&file).expect("read");
    assert!(text.contains("added_tolerance_percent: Some(1"), "{text}");
    let r = store::load(&file).expect("opens");
    let last = r.bench_log.last().expect("reading");
    assert_eq!(last.added_capacitance, 10e-12);
    assert_eq!(last.added_tolerance, Some(0.01));
    let (ok, _, err) = run_text(&[
        "reading",
        "add",
        path,
        "--mhz",
        "97.5",
        "--clip-pf",
        "10",
        "--clip-tolerance-pct",
        "80",
    ]);
    assert!(
        !ok && err.contains("--clip-tolerance-pct 80: give 0–50 %"),
        "{err}"
    );
}

/// Issue 20: `reading include FILE N [--off]` sets the reading's "include anyway", saved like
/// `reading add`; the fit then takes a reading it suspects of being a harmonic (left out
/// before). The readings are the demo's tank by its own field solution (the truth here) at the
/// trimmer's two ends, and one at twice the first (a counter on the second harmonic; common
/// practice). A reading number outside the log is refused with the range, the file
/// byte-identical.
#[test]
fn a_suspected_harmonic_is_included_from_the_command_line() {
    use tankwright::recipe::{BenchEntry, Recipe};
    let dir = tempfile::tempdir().expect("temp dir");
    let file = dir.path().join("bench.ron");
    let path = file.to_str().expect("utf-8");
    let mut r = Recipe::demo();
    let coil = tankwright::model::Coil::from_winding(&r.winding).expect("coil");
    for setting in [0.0, 1.0] {
        let measured = tankwright::tuning::field_tank::field_tank(
            &coil,
            r.tank.external_capacitance_at(setting),
            &r.conditions,
        )
        .expect("solves")
        .resonance;
        r.bench_log.push(BenchEntry {
            measured,
            length: coil.length(),
            trimmer_setting: setting,
            added_capacitance: 0.0,
            added_tolerance: None,
            instrument: "counter".to_owned(),
            error_ppm: Some(1.0),
            note: String::new(),
            include_anyway: false,
        });
    }
    let mut harmonic = r.bench_log[0].clone();
    harmonic.measured *= 2.0;
    r.bench_log.push(harmonic);
    store::save(&file, &r).expect("saved");
    let fit = |want_used: u64| {
        let (ok, out, err) = run_text(&["fit", "--recipe", path, "--json"]);
        assert!(ok, "{err}");
        let v: serde_json::Value = serde_json::from_str(&out).expect("JSON");
        assert_eq!(v["readings_used"].as_u64(), Some(want_used), "{out}");
        v
    };
    let v = fit(2);
    assert_eq!(v["left_out_readings"], serde_json::json!([3]), "{v}");

    let (ok, said, err) = run_text(&["reading", "include", path, "3"]);
    assert!(ok, "{err}");
    assert!(said.contains("reading 3"), "{said}");
    assert!(store::load(&file).expect("opens").bench_log[2].include_anyway);
    assert!(
        std::fs::read_to_string(&file)
            .expect("text")
            .contains("include_anyway: true")
    );
    let v = fit(3);
    assert_eq!(v["include_anyway_readings"], serde_json::json!([3]), "{v}");
    assert_eq!(v["left_out_readings"], serde_json::json!([]), "{v}");

    let (ok, _, err) = run_text(&["reading", "include", path, "3", "--off"]);
    assert!(ok, "{err}");
    assert!(!store::load(&file).expect("opens").bench_log[2].include_anyway);
    fit(2);

    // Bad numbers: refused with the range, the file untouched to the byte.
    let before = std::fs::read(&file).expect("read");
    for bad in ["0", "4", "x", "2.5"] {
        let (ok, _, err) = run_text(&["reading", "include", path, bad]);
        assert!(!ok, "{bad} accepted");
        assert!(err.contains("1–3"), "{bad}: {err}");
        assert!(err.contains("kept as it was"), "{bad}: {err}");
        assert_eq!(std::fs::read(&file).expect("read"), before, "{bad}");
    }
    let (ok, _, err) = run_text(&["reading", "include", path]);
    assert!(!ok);
    assert!(err.contains("usage"), "{err}");
}

//! `tankwright sheet` and `tankwright chart` run as a user runs them: what they write, and
//! that every mistake gets a clear message and leaves no file (and an earlier file as it was).

use crate::common::{asset_str as asset, run, stderr};
use std::path::{Path, PathBuf};

fn names_in(dir: &Path) -> Vec<String> {
    let mut names: Vec<String> = std::fs::read_dir(dir)
        .expect("dir")
        .map(|e| e.expect("entry").file_name().to_string_lossy().into_owned())
        .collect();
    names.sort();
    names
}

fn s(p: &Path) -> &str {
    p.to_str().expect("utf-8")
}

/// Fails with a message containing `needle` and leaves `dir` holding exactly `left`.
fn refused(args: &[&str], needle: &str, dir: &Path, left: &[&str]) {
    let o = run(args);
    assert!(!o.status.success(), "{args:?} should fail");
    let e = stderr(&o);
    assert!(e.contains(needle), "{args:?}: '{needle}' not in: {e}");
    assert!(!e.contains("panicked"), "{e}");
    assert_eq!(names_in(dir), left, "{args:?} left files behind");
}

#[test]
fn sheet_writes_a_pdf_and_chart_writes_svg_and_png() {
    let dir = tempfile::tempdir().expect("temp dir");
    let recipe = asset("lantern_hill_bench_oscillator.ron");
    let pdf = dir.path().join("bench.pdf");
    let o = run(&["sheet", &recipe, "--out", s(&pdf)]);
    assert!(o.status.success(), "{}", stderr(&o));
    assert!(String::from_utf8_lossy(&o.stdout).contains("wrote the build sheet"));
    let bytes = std::fs::read(&pdf).expect("written");
    assert!(bytes.starts_with(b"%PDF-"), "a PDF file");
    // Upper-case extensions are the same formats.
    let svg = dir.path().join("spacing.SVG");
    let o = run(&["chart", &recipe, "--kind", "spacing", "--out", s(&svg)]);
    assert!(o.status.success(), "{}", stderr(&o));
    assert!(
        std::fs::read_to_string(&svg)
            .expect("text")
            .contains("<svg")
    );
    let png = dir.path().join("trimmer.png");
    let o = run(&["chart", &recipe, "--kind=trimmer", "--out", s(&png)]);
    assert!(o.status.success(), "{}", stderr(&o));
    image::open(&png).expect("a PNG");
    assert_eq!(
        names_in(dir.path()),
        ["bench.pdf", "spacing.SVG", "trimmer.png"],
        "no temporary files left"
    );
}

#[test]
fn sheet_mistakes_are_named_and_leave_nothing() {
    let dir = tempfile::tempdir().expect("temp dir");
    let d = dir.path();
    let recipe = asset("lantern_hill_bench_oscillator.ron");
    let out = d.join("sheet.pdf");
    refused(&["sheet"], "needs a recipe file", d, &[]);
    refused(&["sheet", &recipe], "needs --out", d, &[]);
    refused(&["sheet", &recipe, "--out"], "--out needs a value", d, &[]);
    refused(
        &["sheet", &recipe, &recipe, "--out", s(&out)],
        "one recipe file",
        d,
        &[],
    );
    refused(
        &["sheet", &recipe, "--out", s(&out), "--colour", "red"],
        "unknown flag --colour",
        d,
        &[],
    );
    let html = d.join("sheet.html");
    refused(&["sheet", &recipe, "--out", s(&html)], ".pdf", d, &[]);
    let none = d.join("sheet");
    refused(
        &["sheet", &recipe, "--out", s(&none)],
        "cannot tell the format",
        d,
        &[],
    );
    let missing = d.join("no_such_recipe.ron");
    refused(
        &["sheet", s(&missing), "--out", s(&out)],
        "no_such_recipe.ron",
        d,
        &[],
    );
    let folder: PathBuf = d.join("no_such_folder").join("sheet.pdf");
    refused(
        &["sheet", &recipe, "--out", s(&folder)],
        "could not save",
        d,
        &[],
    );

    // A broken recipe: the message gives the place, and an earlier sheet stays as it was.
    let broken = d.join("broken.ron");
    std::fs::write(&broken, "TankwrightRecipe(schema: 1, name: \"x\"").expect("write");
    std::fs::write(&out, b"the earlier sheet").expect("write");
    refused(
        &["sheet", s(&broken), "--out", s(&out)],
        "broken.ron",
        d,
        &["broken.ron", "sheet.pdf"],
    );
    assert_eq!(std::fs::read(&out).expect("read"), b"the earlier sheet");
}

#[test]
fn chart_mistakes_are_named_and_leave_nothing() {
    let dir = tempfile::tempdir().expect("temp dir");
    let d = dir.path();
    let recipe = asset("lantern_hill_bench_oscillator.ron");
    let svg = d.join("c.svg");
    refused(
        &["chart", &recipe, "--kind", "smith", "--out", s(&svg)],
        "--kind is one of spacing, trimmer",
        d,
        &[],
    );
    let jpg = d.join("c.jpg");
    refused(
        &["chart", &recipe, "--out", s(&jpg)],
        ".svg or .png",
        d,
        &[],
    );
    refused(&["chart", &recipe], "needs --out", d, &[]);
}

#[test]
fn the_usage_names_the_hand_out_commands() {
    let o = run(&["help"]);
    let text = String::from_utf8_lossy(&o.stdout);
    assert!(
        text.contains("tankwright sheet FILE --out OUT.pdf"),
        "{text}"
    );
    assert!(
        text.contains("tankwright chart FILE [--kind spacing|trimmer]"),
        "{text}"
    );
}

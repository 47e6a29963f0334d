//! Saving respects the user's files and reading accepts what editors write: saves go through a
//! symbolic link to its target; a FIFO or other non-regular file is refused at once instead of
//! blocking; a byte-order mark is skipped; CR-only line endings are read; a recipe that breaks
//! a rule opens as written with the rule named; sizes are capped with the reason.

use std::path::Path;
use std::time::{Duration, Instant};
use tankwright::recipe::{BenchEntry, LoadErrorKind, Recipe, format, store};

fn demo_text() -> String {
    format::to_text(&Recipe::demo())
}

#[cfg(unix)]
#[test]
fn saving_through_a_symbolic_link_updates_its_target_and_keeps_the_link() {
    let dir = tempfile::tempdir().unwrap();
    let real_dir = dir.path().join("shared");
    std::fs::create_dir(&real_dir).unwrap();
    let target = real_dir.join("club.ron");
    store::save(&target, &Recipe::demo()).unwrap();
    let link = dir.path().join("mine.ron");
    // A relative link, resolved from the link's own folder.
    std::os::unix::fs::symlink("shared/club.ron", &link).unwrap();

    let mut changed = Recipe::demo();
    changed.winding.turns = 7.25;
    store::save(&link, &changed).unwrap();

    assert!(
        std::fs::symlink_metadata(&link)
            .unwrap()
            .file_type()
            .is_symlink(),
        "the link is still a link"
    );
    assert_eq!(
        store::load(&target).unwrap(),
        changed,
        "the target has the save"
    );
    assert_eq!(store::load(&link).unwrap(), changed);
    // Nothing left beside the link or the target.
    let beside: Vec<_> = std::fs::read_dir(&real_dir).unwrap().collect();
    assert_eq!(beside.len(), 1);
}

#[cfg(unix)]
#[test]
fn a_fifo_is_refused_at_once_instead_of_blocking() {
    let dir = tempfile::tempdir().unwrap();
    let fifo = dir.path().join("pipe.ron");
    let made = std::process::Command::new("mkfifo")
        .arg(&fifo)
        .status()
        .expect("mkfifo runs");
    assert!(made.success());
    let started = Instant::now();
    let err = store::open(&fifo).unwrap_err();
    // Not a timing test: without the check the open would never return at all.
    assert!(started.elapsed() < Duration::from_secs(10));
    assert_eq!(err.kind, LoadErrorKind::Read);
    assert!(err.to_string().contains("not a regular file"), "{err}");
    let err = store::open(dir.path()).unwrap_err();
    assert!(err.to_string().contains("a folder"), "{err}");
}

#[test]
fn a_byte_order_mark_is_skipped() {
    let text = format!("\u{feff}{}", demo_text());
    assert_eq!(format::from_text(&text).unwrap(), Recipe::demo());
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("bom.ron");
    std::fs::write(&path, text.as_bytes()).unwrap();
    assert_eq!(store::load(&path).unwrap(), Recipe::demo());
}

#[test]
fn cr_only_and_crlf_line_endings_are_read() {
    let text = demo_text();
    // The header is `//` comments: read with CR as a line end, or the comment would swallow
    // the whole file.
    let old_mac = text.replace('\n', "\r");
    assert_eq!(format::from_text(&old_mac).unwrap(), Recipe::demo());
    let windows = text.replace('\n', "\r\n");
    assert_eq!(format::from_text(&windows).unwrap(), Recipe::demo());
    // Positions in errors count CR-only lines as lines.
    let broken = old_mac.replace("turns: 5.0", "turns: five");
    let err = format::from_text(&broken).unwrap_err();
    let line = text.lines().position(|l| l.contains("turns: 5.0")).unwrap() + 1;
    assert_eq!(err.position.map(|p| p.0), Some(line), "{err}");
}

#[test]
fn a_recipe_that_breaks_a_rule_opens_as_written_with_the_rule_named() {
    let mut r = Recipe::demo();
    r.winding.turns = 30.0; // raised before the coil was stretched: the turns overlap
    r.notes = "keep me".to_owned();
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("crowded.ron");
    let text = format::to_text(&r);
    std::fs::write(&path, &text).unwrap();

    let opened = store::open(&path).unwrap();
    assert_eq!(opened.recipe, r);
    let refusal = opened.refusal.unwrap();
    assert_eq!(refusal.kind, LoadErrorKind::Invalid);
    assert!(
        refusal
            .field
            .as_deref()
            .is_some_and(|f| f.starts_with("coil."))
    );
    assert!(refusal.path.as_deref() == Some(path.as_path()));
    // The strict reading (the CLI's) refuses the same file, with the same words.
    assert_eq!(store::load(&path).unwrap_err(), refusal);
    // And a save refuses to write it (it would not open again without the refusal).
    assert!(store::save(&dir.path().join("again.ron"), &r).is_err());
}

fn reading(mhz: f64) -> BenchEntry {
    BenchEntry {
        include_anyway: false,
        measured: mhz * 1e6,
        length: 8e-3,
        trimmer_setting: 0.5,
        added_capacitance: 0.0,
        instrument: String::new(),
        error_ppm: None,
        note: String::new(),
        added_tolerance: None,
    }
}

#[test]
fn sizes_are_capped_with_the_reason() {
    use tankwright::recipe::rules::{CHANNELS_MAX, READINGS_MAX};
    let mut r = Recipe::demo();
    r.bench_log = (0..=READINGS_MAX).map(|_| reading(98.0)).collect();
    let err = format::read_text(&format::to_text(&r)).unwrap_err();
    assert_eq!(err.kind, LoadErrorKind::TooLarge);
    assert!(
        err.reason.contains(&format!("at most {READINGS_MAX}")) && err.reason.contains("crawl"),
        "{err}"
    );
    r.bench_log.truncate(READINGS_MAX);
    assert!(
        format::from_text(&format::to_text(&r)).is_ok(),
        "the cap itself is allowed"
    );

    let mut r = Recipe::demo();
    r.target.plan = tankwright::tuning::BandPlan::Custom(
        (0..=CHANNELS_MAX).map(|i| 88e6 + i as f64 * 1e4).collect(),
    );
    let err = format::read_text(&format::to_text(&r)).unwrap_err();
    assert_eq!(err.kind, LoadErrorKind::TooLarge);
    assert!(
        err.field.as_deref() == Some("aim.plan.channels_mhz"),
        "{err}"
    );
}

#[test]
fn the_save_path_of_a_plain_file_is_itself() {
    let p = Path::new("/nonexistent/folder/plain.ron");
    assert_eq!(store::save_target(p).unwrap(), p);
}

//! Saving is atomic: a save that fails midway leaves the old file as it was and no
//! temporary file behind; loading names the file in every error.

use std::io::{self, Write};
use std::path::Path;
use tankwright::recipe::store::{self, SaveStep, write_atomically};
use tankwright::recipe::{LoadErrorKind, Recipe, format};

fn names_in(dir: &Path) -> Vec<String> {
    let mut v: Vec<String> = std::fs::read_dir(dir)
        .unwrap()
        .map(|e| e.unwrap().file_name().to_string_lossy().into_owned())
        .collect();
    v.sort();
    v
}

#[test]
fn a_failure_mid_write_leaves_the_old_file_intact_and_no_temporary() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("club.ron");
    let old = Recipe::demo();
    store::save(&path, &old).unwrap();
    let old_bytes = std::fs::read(&path).unwrap();

    let mut changed = Recipe::demo();
    changed.name = "Changed and never saved".to_owned();
    changed.winding.turns = 7.0;
    let text = format::to_text(&changed);
    let err = write_atomically(&path, text.as_bytes(), |w: &mut dyn Write, bytes| {
        w.write_all(&bytes[..bytes.len() / 2])?;
        Err(io::Error::other("disk full (simulated)"))
    })
    .unwrap_err();

    assert_eq!(err.step, SaveStep::Write);
    let shown = err.to_string();
    assert!(
        shown.contains("club.ron") && shown.contains("disk full"),
        "{shown}"
    );
    assert_eq!(std::fs::read(&path).unwrap(), old_bytes);
    assert_eq!(store::load(&path).unwrap(), old);
    assert_eq!(names_in(dir.path()), vec!["club.ron".to_owned()]);
}

#[test]
fn a_successful_save_replaces_the_file_and_leaves_nothing_else() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("club.ron");
    store::save(&path, &Recipe::demo()).unwrap();
    let mut changed = Recipe::demo();
    changed.winding.turns = 6.0;
    store::save(&path, &changed).unwrap();
    assert_eq!(store::load(&path).unwrap(), changed);
    assert_eq!(names_in(dir.path()), vec!["club.ron".to_owned()]);
}

#[test]
fn saving_into_a_missing_folder_says_why() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("no such folder").join("club.ron");
    let err = store::save(&path, &Recipe::demo()).unwrap_err();
    assert_eq!(err.step, SaveStep::Create);
    assert!(err.to_string().contains("no such folder"), "{err}");
}

#[test]
fn saving_over_a_folder_fails_and_cleans_up() {
    let dir = tempfile::tempdir().unwrap();
    let target = dir.path().join("taken.ron");
    std::fs::create_dir(&target).unwrap();
    std::fs::write(target.join("inside.txt"), "keep me").unwrap();
    let err = store::save(&target, &Recipe::demo()).unwrap_err();
    assert_eq!(err.step, SaveStep::Replace);
    assert_eq!(names_in(dir.path()), vec!["taken.ron".to_owned()]);
    assert_eq!(
        std::fs::read_to_string(target.join("inside.txt")).unwrap(),
        "keep me"
    );
}

#[test]
fn load_errors_name_the_file() {
    let dir = tempfile::tempdir().unwrap();
    let missing = dir.path().join("gone.ron");
    let err = store::load(&missing).unwrap_err();
    assert_eq!(err.kind, LoadErrorKind::Read);
    assert!(err.to_string().starts_with(&missing.display().to_string()));

    let bad = dir.path().join("bad.ron");
    std::fs::write(&bad, "TankwrightRecipe(\n  schema: 1,\n  name: 5,\n)").unwrap();
    let err = store::load(&bad).unwrap_err();
    assert_eq!(err.kind, LoadErrorKind::Syntax);
    let shown = err.to_string();
    assert!(
        shown.starts_with(&format!("{}, line 3 column", bad.display())),
        "{shown}"
    );

    let binary = dir.path().join("photo.ron");
    std::fs::write(
        &binary,
        [0x89, b'P', b'N', b'G', 0x0d, 0x0a, 0x1a, 0x0a, 0xff],
    )
    .unwrap();
    assert_eq!(
        store::load(&binary).unwrap_err().kind,
        LoadErrorKind::NotText
    );
}

#[test]
fn a_recipe_that_would_not_open_again_is_not_written() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("club.ron");
    store::save(&path, &Recipe::demo()).unwrap();
    let mut bad = Recipe::demo();
    bad.winding.turns = 0.0;
    let err = store::save(&path, &bad).unwrap_err();
    assert_eq!(err.step, SaveStep::Check);
    assert!(err.to_string().contains("coil.turns"), "{err}");
    assert_eq!(store::load(&path).unwrap(), Recipe::demo());
}

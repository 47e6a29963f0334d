//! The Export menu through the whole window: the file dialog answered by an injected asker,
//! the typed-path prompt where no dialog can be shown, and the files checked by reading them
//! back (PDF header, SVG root, PNG decoded at its size).

use crate::common;

use common::screen_text;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use std::cell::RefCell;
use std::collections::VecDeque;
use std::path::Path;
use std::rc::Rc;
use tankwright::handout::{CHART_SIZE, ChartKind, chart_bytes};
use tankwright::recipe::Footing;
use tankwright::ui::App;
use tankwright::ui::files::{NO_DIALOG, PathAsker, Picked};

/// Answers the dialogs from a queue the test fills, and records the export requests.
#[derive(Clone, Default)]
struct Scripted {
    answers: Rc<RefCell<VecDeque<Picked>>>,
    asked: Rc<RefCell<Vec<String>>>,
}

impl PathAsker for Scripted {
    fn open(&mut self, _folder: &Path) -> Picked {
        Picked::Cancelled
    }
    fn save(&mut self, _folder: &Path, _suggested: &str) -> Picked {
        Picked::Cancelled
    }
    fn export(&mut self, _folder: &Path, suggested: &str, what: &str, ext: &str) -> Picked {
        self.asked
            .borrow_mut()
            .push(format!("{what} as {suggested} (.{ext})"));
        self.answers
            .borrow_mut()
            .pop_front()
            .unwrap_or(Picked::Cancelled)
    }
}

fn workbench(asker: Scripted) -> Harness<'static, App> {
    common::window_with_asker(asker, 1400.0, 1000.0)
}

fn export(harness: &mut Harness<'_, App>, item: &str) {
    harness.get_by_label("Export").click();
    harness.run();
    harness.get_by_label(item).click();
    harness.run();
}

#[test]
fn every_export_writes_its_file_where_the_dialog_says() {
    let dir = tempfile::tempdir().expect("temp dir");
    let asker = Scripted::default();
    let mut harness = workbench(asker.clone());
    let cases = [
        ("Build sheet and worksheet (PDF)…", "sheet.pdf"),
        ("Spacing chart as SVG…", "spacing.svg"),
        ("Spacing chart as PNG…", "spacing.png"),
        ("Trimmer chart as SVG…", "trimmer.svg"),
        // No extension typed: the export's own is added.
        ("Trimmer chart as PNG…", "trimmer"),
    ];
    for (item, name) in cases {
        asker
            .answers
            .borrow_mut()
            .push_back(Picked::Path(dir.path().join(name)));
        export(&mut harness, item);
    }
    let asked = asker.asked.borrow().clone();
    assert_eq!(asked.len(), 5, "{asked:?}");
    assert!(
        asked[0].starts_with("the build sheet and worksheet as ")
            && asked[0].ends_with("_sheet.pdf (.pdf)"),
        "{asked:?}"
    );
    let read = |name: &str| std::fs::read(dir.path().join(name)).expect(name);
    assert!(read("sheet.pdf").starts_with(b"%PDF-"));
    for svg in ["spacing.svg", "trimmer.svg"] {
        assert!(String::from_utf8(read(svg)).expect("text").contains("<svg"));
    }
    for png in ["spacing.png", "trimmer.png"] {
        let img = image::load_from_memory(&read(png)).expect("a PNG");
        assert_eq!((img.width(), img.height()), CHART_SIZE);
    }
    let text = screen_text(&harness).join("\n");
    assert!(
        text.contains("exported the trimmer chart (PNG) to"),
        "{text}"
    );
    // What is exported stands where the screen does: this window has the field solution
    // switched off, so the chart is the classical model's, not the field solution's.
    let recipe = harness.state().recipe().clone();
    let svg = Path::new("x.svg");
    let classical =
        chart_bytes(&recipe, ChartKind::Spacing, svg, Footing::Classical).expect("drawn");
    let solved =
        chart_bytes(&recipe, ChartKind::Spacing, svg, Footing::FieldSolution).expect("drawn");
    assert_eq!(read("spacing.svg"), classical);
    assert_ne!(classical, solved);
}

#[test]
fn without_a_dialog_the_typed_path_exports_and_a_bad_one_is_explained() {
    let dir = tempfile::tempdir().expect("temp dir");
    let asker = Scripted::default();
    let mut harness = workbench(asker.clone());
    asker
        .answers
        .borrow_mut()
        .push_back(Picked::Unavailable(NO_DIALOG.to_owned()));
    export(&mut harness, "Spacing chart as SVG…");
    harness.get_by_label("Export the spacing chart (SVG)");
    harness.get_by_label(NO_DIALOG);
    // A format that is not offered is refused with a message; the prompt stays open.
    let wrong = dir.path().join("chart.gif");
    type_path(&mut harness, &wrong);
    let text = screen_text(&harness).join("\n");
    assert!(text.contains(".svg or .png"), "{text}");
    assert!(
        harness
            .query_by_label("Export the spacing chart (SVG)")
            .is_some()
    );
    assert!(!wrong.exists());
    let target = dir.path().join("typed.svg");
    type_path(&mut harness, &target);
    assert!(
        std::fs::read_to_string(&target)
            .expect("written")
            .contains("<svg")
    );
    assert!(
        harness
            .query_by_label("Export the spacing chart (SVG)")
            .is_none()
    );
}

/// Type `path` into the prompt's field and press its button.
fn type_path(harness: &mut Harness<'_, App>, path: &Path) {
    let field = harness.get_by_label("File path");
    field.focus();
    field.set_text_value_accesskit(&path.display().to_string());
    harness.run();
    harness.get_by_label("Write the file").click();
    harness.run();
}

//! The file desk driven like a person would: by menu labels and buttons, in a small harness
//! app, with the file dialog answered by an injected asker.

use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use std::cell::RefCell;
use std::collections::VecDeque;
use std::path::{Path, PathBuf};
use std::rc::Rc;
use tankwright::recipe::{Recipe, store};
use tankwright::ui::files::{FileAction, FileDesk, FileDeskMemory, NO_DIALOG, PathAsker, Picked};

/// Answers dialogs from a queue the test fills, and records what was asked.
#[derive(Clone, Default)]
struct Scripted {
    answers: Rc<RefCell<VecDeque<Picked>>>,
    asked: Rc<RefCell<Vec<String>>>,
}

impl Scripted {
    fn answer(&self, p: Picked) {
        self.answers.borrow_mut().push_back(p);
    }

    fn next(&self, what: String) -> Picked {
        self.asked.borrow_mut().push(what);
        self.answers
            .borrow_mut()
            .pop_front()
            .unwrap_or(Picked::Cancelled)
    }
}

impl PathAsker for Scripted {
    fn open(&mut self, folder: &Path) -> Picked {
        self.next(format!("open in {}", folder.display()))
    }

    fn save(&mut self, folder: &Path, suggested: &str) -> Picked {
        self.next(format!("save {suggested} in {}", folder.display()))
    }
}

/// The harness app: a document, the desk, and two fields to edit.
struct Bench {
    doc: Recipe,
    desk: FileDesk,
    replaced: usize,
    quit: bool,
}

impl Bench {
    fn apply(&mut self, action: Option<FileAction>) {
        match action {
            Some(FileAction::Replace(r)) => {
                self.doc = r;
                self.replaced += 1;
            }
            Some(FileAction::Quit) => self.quit = true,
            None => {}
        }
    }
}

fn ui(ui: &mut egui::Ui, b: &mut Bench) {
    let mut action = None;
    egui::MenuBar::new().ui(ui, |ui| {
        ui.menu_button("Recipe", |ui| {
            action = b.desk.menu_ui(ui, &b.doc);
        });
    });
    b.apply(action);
    ui.label(b.desk.title(&b.doc));
    let label = ui.label("Recipe name");
    ui.text_edit_singleline(&mut b.doc.name)
        .labelled_by(label.id);
    ui.add(egui::Slider::new(&mut b.doc.winding.turns, 1.0..=20.0).text("Turns"));
    b.desk.notice_ui(ui);
    let a = b.desk.shortcuts(ui.ctx(), &b.doc);
    b.apply(a);
    let a = b.desk.windows_ui(ui.ctx(), &b.doc);
    b.apply(a);
}

fn harness(folder: &Path, asker: &Scripted) -> Harness<'static, Bench> {
    let memory = FileDeskMemory {
        recent: Vec::new(),
        folder: folder.to_path_buf(),
    };
    let doc = Recipe::demo();
    let desk = FileDesk::new(memory, &doc).with_asker(Box::new(asker.clone()));
    Harness::builder()
        .with_size(egui::vec2(900.0, 700.0))
        .build_ui_state(
            ui,
            Bench {
                doc,
                desk,
                replaced: 0,
                quit: false,
            },
        )
}

/// Open the "Recipe" menu and click `item` (its label, followed by the shortcut if any).
fn menu(h: &mut Harness<'_, Bench>, item: &str) {
    h.get_by_label("Recipe").click();
    h.run();
    let with_keys = format!("{item} ");
    let item = item.to_owned();
    h.get_by(move |n| {
        n.role() == egui::accesskit::Role::Button
            && n.label()
                .is_some_and(|l| l == item || l.starts_with(&with_keys))
    })
    .click();
    h.run();
}

fn set_turns(h: &mut Harness<'_, Bench>, turns: f64) {
    h.get_by_role_and_label(egui::accesskit::Role::Slider, "Turns")
        .set_value_accesskit(turns);
    h.run();
}

#[test]
fn edit_save_reopen_and_compare() {
    let dir = tempfile::tempdir().unwrap();
    let asker = Scripted::default();
    let mut h = harness(dir.path(), &asker);
    h.run();
    assert!(!h.state().desk.is_dirty(&h.state().doc));
    h.get_by_label("Lantern Hill bench oscillator — Tankwright");

    set_turns(&mut h, 6.0);
    assert_eq!(h.state().doc.winding.turns, 6.0);
    h.get_by_label("• Lantern Hill bench oscillator — Tankwright");

    // Save as…: the asker answers a path without extension; the desk adds ".ron".
    asker.answer(Picked::Path(dir.path().join("six turns")));
    menu(&mut h, "Save as…");
    let saved_path = dir.path().join("six turns.ron");
    assert_eq!(
        asker.asked.borrow().last().unwrap(),
        &format!(
            "save lantern_hill_bench_oscillator.ron in {}",
            dir.path().display()
        )
    );
    let saved = store::load(&saved_path).unwrap();
    assert_eq!(saved, h.state().doc);
    assert_eq!(saved.winding.turns, 6.0);
    h.get_by_label("Lantern Hill bench oscillator — Tankwright");
    assert_eq!(h.state().desk.memory.recent, vec![saved_path.clone()]);

    // Change again, then open the saved file: the desk asks first.
    set_turns(&mut h, 9.0);
    asker.answer(Picked::Path(saved_path.clone()));
    menu(&mut h, "Open…");
    h.get_by_label("Unsaved changes");
    assert_eq!(
        h.state().doc.winding.turns,
        9.0,
        "nothing replaced before the answer"
    );
    h.get_by_label("Discard changes").click();
    h.run();
    assert!(h.query_by_label("Unsaved changes").is_none());
    assert_eq!(h.state().doc, saved);
    assert_eq!(h.state().replaced, 1);
    assert!(!h.state().desk.is_dirty(&h.state().doc));
    assert_eq!(h.state().desk.path(), Some(saved_path.as_path()));

    // Ctrl+S saves in place once something changed.
    set_turns(&mut h, 7.0);
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::S);
    h.run();
    assert_eq!(store::load(&saved_path).unwrap().winding.turns, 7.0);
    assert!(!h.state().desk.is_dirty(&h.state().doc));
}

#[test]
fn keep_editing_keeps_the_document_and_a_failed_open_leaves_it_alone() {
    let dir = tempfile::tempdir().unwrap();
    let asker = Scripted::default();
    let mut h = harness(dir.path(), &asker);
    h.run();
    set_turns(&mut h, 8.0);
    menu(&mut h, "New recipe");
    h.get_by_label("Keep editing").click();
    h.run();
    assert_eq!(h.state().doc.winding.turns, 8.0);
    assert_eq!(h.state().replaced, 0);

    let broken = dir.path().join("broken.ron");
    std::fs::write(&broken, "TankwrightRecipe(schema: 1, name: ").unwrap();
    asker.answer(Picked::Path(broken));
    menu(&mut h, "Open…");
    h.get_by_label("Discard changes").click();
    h.run();
    assert_eq!(
        h.state().doc.winding.turns,
        8.0,
        "a bad file replaces nothing"
    );
    let notice = h.state().desk.notice.clone().unwrap();
    assert!(
        notice.is_error && notice.text.contains("broken.ron, line 1 column"),
        "{notice:?}"
    );
}

#[test]
fn without_a_system_dialog_a_typed_path_saves_and_opens() {
    let dir = tempfile::tempdir().unwrap();
    let folder = dir.path().join("recipes");
    let asker = Scripted::default();
    let mut h = harness(&folder, &asker);
    h.run();
    set_turns(&mut h, 5.5);

    asker.answer(Picked::Unavailable(NO_DIALOG.to_owned()));
    menu(&mut h, "Save…");
    // The folder is created on the first save, and the prompt says why it is shown.
    assert!(folder.is_dir());
    h.get_by_label(NO_DIALOG);
    let typed = folder.join("typed.ron");
    let field = h.get_by_label("File path");
    field.focus();
    field.set_text_value_accesskit(&typed.display().to_string());
    h.run();
    h.get_by_label("Save").click();
    h.run();
    assert_eq!(store::load(&typed).unwrap().winding.turns, 5.5);
    assert!(h.query_by_label("Save the recipe").is_none());

    // Open: the prompt lists the folder's recipes; pick one by name.
    h.state_mut().doc.winding.turns = 12.0;
    let doc = h.state().doc.clone();
    h.state_mut().desk.mark_opened(None, &doc);
    asker.answer(Picked::Unavailable(NO_DIALOG.to_owned()));
    menu(&mut h, "Open…");
    h.get_by_label("typed.ron").click();
    h.run();
    h.get_by_label("Open").click();
    h.run();
    assert_eq!(h.state().doc.winding.turns, 5.5);
    assert_eq!(h.state().desk.path(), Some(typed.as_path()));
}

#[test]
fn demos_open_as_copies_and_quitting_asks_first() {
    let dir = tempfile::tempdir().unwrap();
    let asker = Scripted::default();
    let mut h = harness(dir.path(), &asker);
    h.run();
    h.get_by_label("Recipe").click();
    h.run();
    h.get_by_label("Demo recipes").click();
    h.run();
    h.get_by_label("Lantern Hill 2 m buffer tank").click();
    h.run();
    assert_eq!(h.state().doc.name, "Lantern Hill 2 m buffer tank");
    assert_eq!(h.state().desk.path(), None, "a demo is never saved over");

    set_turns(&mut h, 6.0);
    // The window's close button.
    h.input_mut()
        .viewports
        .entry(egui::ViewportId::ROOT)
        .or_default()
        .events
        .push(egui::ViewportEvent::Close);
    h.step();
    let held = h
        .output()
        .viewport_output
        .values()
        .any(|v| v.commands.contains(&egui::ViewportCommand::CancelClose));
    assert!(
        held,
        "the close is held back while there are unsaved changes"
    );
    h.run();
    h.get_by_label("Unsaved changes");
    assert!(!h.state().quit);
    h.get_by_label("Discard changes").click();
    h.run();
    assert!(h.state().quit);
    // The app now closes the window; that close is no longer held.
    h.input_mut()
        .viewports
        .entry(egui::ViewportId::ROOT)
        .or_default()
        .events
        .push(egui::ViewportEvent::Close);
    h.step();
    assert!(
        !h.output()
            .viewport_output
            .values()
            .any(|v| v.commands.contains(&egui::ViewportCommand::CancelClose))
    );
}

#[test]
fn the_memory_survives_serialisation_and_fills_in_defaults() {
    let m = FileDeskMemory {
        recent: vec![PathBuf::from("/bench/a.ron")],
        folder: PathBuf::from("/bench"),
    };
    let text = ron::to_string(&m).unwrap();
    assert_eq!(ron::from_str::<FileDeskMemory>(&text).unwrap(), m);
    let partial: FileDeskMemory = ron::from_str("(recent: [\"/x.ron\"])").unwrap();
    assert_eq!(partial.recent, vec![PathBuf::from("/x.ron")]);
    assert_eq!(partial.folder, FileDeskMemory::default().folder);
}

#[test]
fn save_first_then_start_a_new_recipe() {
    let dir = tempfile::tempdir().unwrap();
    let asker = Scripted::default();
    let mut h = harness(dir.path(), &asker);
    h.run();
    set_turns(&mut h, 4.0);
    let edited = h.state().doc.clone();
    asker.answer(Picked::Path(dir.path().join("kept.ron")));
    menu(&mut h, "New recipe");
    // Never saved before, so saving asks where: the button says so.
    h.get_by_label("Save first…").click();
    h.run();
    assert_eq!(store::load(&dir.path().join("kept.ron")).unwrap(), edited);
    assert_eq!(h.state().doc.name, "New recipe");
    assert_eq!(h.state().replaced, 1);
    assert!(!h.state().desk.is_dirty(&h.state().doc));
    assert_eq!(h.state().desk.path(), None);
    h.get_by_label("New recipe — Tankwright");
}

#[test]
fn a_typed_save_as_onto_an_existing_file_asks_first() {
    let dir = tempfile::tempdir().unwrap();
    let folder = dir.path().join("recipes");
    std::fs::create_dir_all(&folder).unwrap();
    let existing = folder.join("club.ron");
    let mut theirs = Recipe::demo();
    theirs.name = "Somebody else's coil".to_owned();
    store::save(&existing, &theirs).unwrap();
    let before = std::fs::read(&existing).unwrap();

    let asker = Scripted::default();
    let mut h = harness(&folder, &asker);
    h.run();
    set_turns(&mut h, 6.0);
    asker.answer(Picked::Unavailable(NO_DIALOG.to_owned()));
    menu(&mut h, "Save…");
    let field = h.get_by_label("File path");
    field.focus();
    field.set_text_value_accesskit(&existing.display().to_string());
    h.run();
    h.get_by_label("Save").click();
    h.run();
    h.get_by_label(&format!(
        "{} already exists. Replace it with this recipe?",
        existing.display()
    ));
    assert_eq!(
        std::fs::read(&existing).unwrap(),
        before,
        "nothing written yet"
    );

    // "Keep it": the file stays, the prompt stays open for another name.
    h.get_by_label("Keep it").click();
    h.run();
    assert_eq!(std::fs::read(&existing).unwrap(), before);
    h.get_by_label("File path");

    // Asked again, "Replace it" writes.
    h.get_by_label("Save").click();
    h.run();
    h.get_by_label("Replace it").click();
    h.run();
    assert_eq!(
        store::load(&existing).unwrap().winding.turns,
        6.0,
        "{:?} {:?}",
        h.state().desk.notice,
        h.state().doc.winding.turns
    );
    assert!(
        h.query_by_label("Save the recipe").is_none(),
        "the prompt closed"
    );
}

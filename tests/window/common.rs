//! Helpers used by all the window tests.

use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::NodeT;
use tankwright::ui::App;
use tankwright::ui::files::{PathAsker, Picked};

/// Every piece of text on screen, in the order it was laid out.
pub fn screen_text<S>(harness: &Harness<'_, S>) -> Vec<String> {
    harness
        .root()
        .children_recursive()
        .filter_map(|node| {
            let n = node.accesskit_node();
            if n.role() == Role::Label {
                n.value()
            } else {
                n.label()
            }
        })
        .collect()
}

/// Answers the file dialogs (open and save) from a queue the test fills; cancels when empty.
#[derive(Clone, Default)]
pub struct QueuedAnswers(pub std::rc::Rc<std::cell::RefCell<std::collections::VecDeque<Picked>>>);

impl PathAsker for QueuedAnswers {
    fn open(&mut self, _folder: &std::path::Path) -> Picked {
        self.0.borrow_mut().pop_front().unwrap_or(Picked::Cancelled)
    }
    fn save(&mut self, _folder: &std::path::Path, _suggested: &str) -> Picked {
        self.0.borrow_mut().pop_front().unwrap_or(Picked::Cancelled)
    }
}

/// The whole window, `width` × `height` points, with the field solution switched off (so a
/// worker's answer cannot move a figure between two reads) and the file dialogs answered by
/// `asker`; one frame run.
pub fn window_with_asker<A: PathAsker + Clone + 'static>(
    asker: A,
    width: f32,
    height: f32,
) -> Harness<'static, App> {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(width, height))
        .build_eframe(move |cc| {
            App::new(cc)
                .with_field_solution(false)
                .with_path_asker(Box::new(asker.clone()))
        });
    harness.run();
    harness
}

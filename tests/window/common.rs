//! Helpers used by all the window tests.

use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::NodeT;

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

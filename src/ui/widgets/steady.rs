//! Typed fields whose identity does not depend on what was drawn before them.
//!
//! egui gives a widget without an id of its own the next "automatic" id of its `Ui`: a count
//! of what was added before it. A `DragValue` or `TextEdit` keeps its focus and the text being
//! typed under that id, so when anything above the field changes between two frames (a
//! reading added to the log, a caution line from an evaluation or a field solution that
//! arrived, the spacing given by gap instead of length), the field being typed in gets a new
//! id: it loses the focus, the text typed so far is dropped or taken half-typed, and the
//! next keys go nowhere (86.05 became 86.0000, issue 21). Each typed field is therefore put
//! in a `Ui` with an explicit id made from its parent's stable id and its own name.

use eframe::egui;

/// Run `add` in a child `Ui` whose id is the parent's stable id with `name`, so the widgets in
/// it keep their ids (focus, text being typed) whatever is added above them. `name` must be
/// unique among the fields of one parent (the field's own label is).
pub fn steady<R>(
    ui: &mut egui::Ui,
    name: impl egui::AsIdSalt,
    add: impl FnOnce(&mut egui::Ui) -> R,
) -> R {
    let id = ui.scope_id().with(("steady field", name));
    ui.scope_builder(egui::UiBuilder::new().scope_id(id), add)
        .inner
}

//! The bar across the top: menus, undo and redo, units and theme.

use super::Command;
use crate::ui::theme::Theme;
use crate::ui::units::LengthUnit;
use eframe::egui;

/// Shown after the recipe's name in the bar while it has changes not yet saved.
pub const UNSAVED_MARK: &str = "• unsaved changes";

/// Shown in the bar while figures or curves are being computed off the frame (the figures
/// shown meanwhile hold the field solution's factor, the curves the classical shape).
pub const UPDATING_MARK: &str = "updating…";

/// What the bar needs to know to draw itself.
pub struct BarState<'a> {
    /// The recipe's name, shown in the bar.
    pub recipe_name: &'a str,
    /// Does the recipe have changes not yet saved to its file (or to any file)?
    pub unsaved: bool,
    /// Is there a step to undo?
    pub can_undo: bool,
    /// Is there a step to redo?
    pub can_redo: bool,
    /// Lengths shown in.
    pub unit: LengthUnit,
    /// Present theme.
    pub theme: Theme,
    /// Whether the field solution leads the resonance.
    pub field_solution: bool,
    /// Whether figures or curves are being computed off the frame.
    pub updating: bool,
}

/// The View menu's entry that lets the field solution lead the resonance.
pub const FIELD_SOLUTION_ENTRY: &str = "Resonance from the field solution";

/// Shortcut text for undo.
const UNDO_KEYS: &str = "Ctrl+Z";
/// Shortcut text for redo.
const REDO_KEYS: &str = "Ctrl+Shift+Z";

/// Show the menu bar and the tool row beneath it. `recipe_menu` draws the first menu of the
/// bar (the "Recipe" menu: new, open…, save, save as…), supplied by the app; `view_more`
/// draws the end of the View menu (the teaching bench's entries).
pub fn show(
    ui: &mut egui::Ui,
    state: &BarState<'_>,
    commands: &mut Vec<Command>,
    recipe_menu: impl FnOnce(&mut egui::Ui),
    view_more: impl FnOnce(&mut egui::Ui),
) {
    egui::MenuBar::new().ui(ui, |ui| {
        recipe_menu(ui);
        ui.menu_button("Edit", |ui| {
            if ui
                .add_enabled(
                    state.can_undo,
                    egui::Button::new("Undo change").shortcut_text(UNDO_KEYS),
                )
                .clicked()
            {
                commands.push(Command::Undo);
            }
            if ui
                .add_enabled(
                    state.can_redo,
                    egui::Button::new("Redo change").shortcut_text(REDO_KEYS),
                )
                .clicked()
            {
                commands.push(Command::Redo);
            }
        });
        ui.menu_button("View", |ui| {
            if ui.button(state.theme.switch_label()).clicked() {
                commands.push(Command::ToggleTheme);
            }
            for unit in [LengthUnit::Millimetres, LengthUnit::Inches] {
                let name = match unit {
                    LengthUnit::Millimetres => "Lengths in millimetres",
                    LengthUnit::Inches => "Lengths in inches",
                };
                if ui.radio(state.unit == unit, name).clicked() {
                    commands.push(Command::SetUnit(unit));
                }
            }
            ui.separator();
            let mut on = state.field_solution;
            if ui
                .checkbox(&mut on, FIELD_SOLUTION_ENTRY)
                .on_hover_text(
                    "On: the coil solved from its own currents sets the resonance, and the \
                     model's inductance is scaled to meet it. Off: the classical model alone \
                     (Medhurst's self-capacitance beside the driving inductance).",
                )
                .changed()
            {
                commands.push(Command::SetFieldSolution(on));
            }
            ui.separator();
            view_more(ui);
        });
        ui.separator();
        ui.label(egui::RichText::new(state.recipe_name).strong());
        // The same mark as the window title's, inside the window: a full-screen window or a
        // desktop without title bars shows no title.
        if state.unsaved {
            ui.label(egui::RichText::new(UNSAVED_MARK).italics())
                .on_hover_text("Recipe → Save keeps them in the recipe's file");
        }
        if state.updating {
            ui.label(egui::RichText::new(UPDATING_MARK).weak().italics())
                .on_hover_text(
                    "The field solution, the figures landed on it or the charts' field shape \
                     for this coil are being computed; meanwhile the figures hold the field \
                     solution's factor and the curves the classical shape",
                );
        }
    });
    ui.horizontal(|ui| {
        if ui
            .add_enabled(state.can_undo, egui::Button::new("Undo"))
            .on_hover_text(format!("Go back one change ({UNDO_KEYS})"))
            .clicked()
        {
            commands.push(Command::Undo);
        }
        if ui
            .add_enabled(state.can_redo, egui::Button::new("Redo"))
            .on_hover_text(format!("Go forward one change ({REDO_KEYS})"))
            .clicked()
        {
            commands.push(Command::Redo);
        }
        ui.separator();
        ui.label("Lengths in");
        for (unit, name) in [
            (LengthUnit::Millimetres, "millimetres"),
            (LengthUnit::Inches, "inches"),
        ] {
            if ui.selectable_label(state.unit == unit, name).clicked() && state.unit != unit {
                commands.push(Command::SetUnit(unit));
            }
        }
        ui.separator();
        if ui.button(state.theme.switch_label()).clicked() {
            commands.push(Command::ToggleTheme);
        }
    });
}

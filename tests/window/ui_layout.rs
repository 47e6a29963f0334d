//! The window keeps its shape (issue 21): the right-hand column stays readable and reachable
//! at every window size from 1280×720 up, whatever the recipe holds — every shipped recipe,
//! after a reading is recorded, after the 2 m plan is chosen.
//!
//! What is checked: every widget and line of text in the right column lies inside the part of
//! the window the column occupies, between the centre's right edge and the window's right
//! edge. Before the fix a bench table wider than the column made egui keep the content's right
//! edge: the panel's visible part became a sliver at the window's edge, the centre painted
//! over the rest, and the lines ran hundreds of points past the window (their beginnings
//! under the charts, "Record reading" out of reach).

use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::{NodeT, Queryable};
use tankwright::ui::App;

/// The window sizes the issue names: the smallest supported and a common desktop one.
const SIZES: [(f32, f32); 2] = [(1280.0, 720.0), (1600.0, 1000.0)];

fn window(recipe: tankwright::recipe::Recipe, size: (f32, f32)) -> Harness<'static, App> {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(size.0, size.1))
        .build_eframe(move |_cc| App::with_recipe(recipe.clone()).with_field_solution(false));
    harness.run();
    harness
}

/// Whether `node` is labelled or valued `marker`.
fn is(node: &egui_kittest::Node<'_>, marker: &str) -> bool {
    let n = node.accesskit_node();
    n.label().as_deref() == Some(marker) || n.value().as_deref() == Some(marker)
}

/// The right edge of what the pane (panel) holding a node marked `marker` shows (a pane has
/// no bounds of its own here: the union of its nodes').
fn pane_right<S>(harness: &Harness<'_, S>, marker: &str) -> f64 {
    for pane in harness.root().children_recursive() {
        if pane.accesskit_node().role() != Role::Pane
            || !pane.children_recursive().any(|c| is(&c, marker))
        {
            continue;
        }
        return pane
            .children_recursive()
            .filter_map(|c| c.accesskit_node().bounding_box())
            .map(|b| b.x1)
            .fold(f64::NEG_INFINITY, f64::max);
    }
    panic!("no pane holds '{marker}'");
}

/// Every node in the right column (the pane holding `heading`) that lies outside the room
/// between the centre (the pane holding the coil drawing) and the window's right edge.
/// With `tables_scroll`, the content of a table scrolling sideways inside the column (a
/// container with a horizontal scroll bar of its own) may run past the column; its scroll bar
/// may not.
fn outside_the_column<S>(
    harness: &Harness<'_, S>,
    heading: &str,
    width: f64,
    tables_scroll: bool,
) -> Vec<String> {
    let centre_right = pane_right(harness, "coil drawing");
    let mut out = Vec::new();
    for pane in harness.root().children_recursive() {
        let p = pane.accesskit_node();
        if p.role() != Role::Pane || !pane.children_recursive().any(|c| is(&c, heading)) {
            continue;
        }
        // A text field's text runs past the field when it scrolls inside it: the field's
        // own box is what must fit.
        let mut in_fields = std::collections::HashSet::new();
        for node in pane.children_recursive() {
            let scrolls_sideways = || {
                node.children().any(|c| {
                    let c = c.accesskit_node();
                    c.role() == Role::ScrollBar
                        && c.bounding_box().is_some_and(|b| b.width() > b.height())
                })
            };
            if node.accesskit_node().role() == Role::TextInput
                || (tables_scroll && scrolls_sideways())
            {
                in_fields.extend(
                    node.children_recursive()
                        .filter(|c| c.accesskit_node().role() != Role::ScrollBar)
                        .map(|c| c.accesskit_node().id()),
                );
            }
        }
        for node in pane.children_recursive() {
            if in_fields.contains(&node.accesskit_node().id()) {
                continue;
            }
            let n = node.accesskit_node();
            let Some(b) = n.bounding_box() else { continue };
            if b.width() <= 0.0 || b.height() <= 0.0 {
                continue;
            }
            // Half a point for rounding to pixels.
            if b.x0 < centre_right - 0.5 || b.x1 > width + 0.5 {
                out.push(format!(
                    "{:?} '{}' at x {:.0}..{:.0} (column {:.0}..{:.0})",
                    n.role(),
                    n.label().or(n.value()).unwrap_or_default(),
                    b.x0,
                    b.x1,
                    centre_right,
                    width
                ));
            }
        }
    }
    out
}

fn assert_column_in_place<S>(harness: &Harness<'_, S>, size: (f32, f32), what: &str) {
    let out = outside_the_column(harness, "Verdict", f64::from(size.0), false);
    assert!(
        out.is_empty(),
        "{what} at {}×{}: the right column runs outside its room:\n{}",
        size.0,
        size.1,
        out.join("\n")
    );
}

/// As [`assert_column_in_place`], for the pane holding `heading`, whose tables may scroll.
fn assert_pane_in_place<S>(harness: &Harness<'_, S>, heading: &str, size: (f32, f32), what: &str) {
    let out = outside_the_column(harness, heading, f64::from(size.0), true);
    assert!(
        out.is_empty(),
        "{what} at {}×{}: the right column runs outside its room:\n{}",
        size.0,
        size.1,
        out.join("\n")
    );
}

#[test]
fn every_shipped_recipe_keeps_the_right_column_in_its_room() {
    let demos = tankwright::recipe::demos::demos();
    assert_eq!(demos.len(), tankwright::recipe::demos::SOURCES.len());
    for (name, recipe) in demos {
        for size in SIZES {
            let harness = window(recipe.clone(), size);
            assert_column_in_place(&harness, size, name);
        }
    }
}

/// Type `text` into the field named `label` and press Enter, as a user would.
fn type_into(harness: &mut Harness<'_, App>, label: &str, text: &str) {
    harness.get_by_label(label).scroll_to_me();
    harness.run();
    harness.get_by_label(label).focus();
    harness.run();
    harness.get_by_label(label).type_text(text);
    harness.run();
    harness.key_press(egui::Key::Enter);
    harness.run();
}

#[test]
fn recording_readings_keeps_the_right_column_and_its_button_in_reach() {
    for size in SIZES {
        let mut harness = window(tankwright::recipe::Recipe::demo(), size);
        assert!(harness.state().recipe().bench_log.is_empty());
        // The instrument is kept for the next reading; the note is not.
        type_into(&mut harness, "Instrument", "club counter, loop pickup");
        for (i, mhz) in ["97.2", "97.05"].into_iter().enumerate() {
            type_into(
                &mut harness,
                "Note",
                "first try, coil as wound and left overnight",
            );
            type_into(&mut harness, "Measured frequency", mhz);
            // Reached by the pointer, not only by assistive technology.
            harness.get_by_label("Record reading").scroll_to_me();
            harness.run();
            harness.get_by_label("Record reading").click();
            harness.run();
            assert_eq!(
                harness.state().recipe().bench_log.len(),
                i + 1,
                "reading {} was not recorded by a click at {}×{}",
                i + 1,
                size.0,
                size.1
            );
            assert_column_in_place(&harness, size, &format!("after reading {}", i + 1));
        }
    }
}

#[test]
fn choosing_the_two_metre_plan_keeps_the_right_column_in_its_room() {
    for size in SIZES {
        let mut harness = window(tankwright::recipe::Recipe::demo(), size);
        harness
            .get_by_role_and_label(Role::ComboBox, "Band plan")
            .scroll_to_me();
        harness.run();
        harness
            .get_by_role_and_label(Role::ComboBox, "Band plan")
            .click();
        harness.run();
        harness
            .get_by_label("2 m amateur, Region 2 (144–148 MHz, 20 kHz FM)")
            .click();
        harness.run();
        assert_eq!(
            harness.state().recipe().target.plan,
            tankwright::tuning::BandPlan::TwoMetreRegion2Step20k
        );
        assert_column_in_place(&harness, size, "after choosing the 2 m plan");
    }
}

#[test]
fn the_teaching_bench_keeps_its_column_in_its_room_in_both_layouts() {
    use tankwright::ui::teaching::{PANEL_HEADING, PIN_PRESENT_LABEL};
    for (name, recipe) in tankwright::recipe::demos::demos() {
        for size in SIZES {
            let mut harness = window(recipe.clone(), size);
            harness.get_by_label("View").click();
            harness.run();
            harness.get_by_label("Teaching bench").click();
            harness.run();
            // A pinned reference brings the widest thing the bench shows: the differences.
            harness.get_by_label(PIN_PRESENT_LABEL).click();
            harness.run();
            assert_pane_in_place(&harness, PANEL_HEADING, size, name);
            harness.key_press(egui::Key::F5);
            harness.run();
            assert_pane_in_place(
                &harness,
                PANEL_HEADING,
                size,
                &format!("{name} in the presentation layout"),
            );
        }
    }
}

/// Issue 21: a repeated "+0.1 mm" click landed on "Back to the recipe's length" once the
/// "Showing … mm" line appeared and pushed the buttons down. Every control of the teaching
/// bench keeps its place when the shown length appears, and the second click by pointer at
/// the same place steps again.
#[test]
fn the_teaching_bench_controls_never_move_under_the_pointer() {
    let mut harness = window(tankwright::recipe::Recipe::demo(), (1280.0, 720.0));
    harness.get_by_label("View").click();
    harness.run();
    harness.get_by_label("Teaching bench").click();
    harness.run();
    let labels = [
        "+0.1 mm",
        "−0.1 mm",
        "+0.5 mm",
        "Back to the recipe's length",
        "Keep this length in the recipe",
    ];
    let before: Vec<egui::Rect> = labels
        .iter()
        .map(|l| harness.get_by_label(l).rect())
        .collect();
    assert!(harness.state().teaching().demonstrated_length().is_none());
    let length = harness.state().figures().expect("valid").coil.length();
    let at = before[0].center();
    for clicks in 1..=2 {
        harness.hover_at(at);
        harness.run();
        harness.event(egui::Event::PointerButton {
            pos: at,
            button: egui::PointerButton::Primary,
            pressed: true,
            modifiers: egui::Modifiers::NONE,
        });
        harness.event(egui::Event::PointerButton {
            pos: at,
            button: egui::PointerButton::Primary,
            pressed: false,
            modifiers: egui::Modifiers::NONE,
        });
        harness.run();
        let shown = harness
            .state()
            .teaching()
            .demonstrated_length()
            .expect("a length is shown");
        assert!(
            (shown - (length + f64::from(clicks) * 0.1e-3)).abs() < 1e-9,
            "click {clicks} at the first click's place: {shown} m shown"
        );
        let after: Vec<egui::Rect> = labels
            .iter()
            .map(|l| harness.get_by_label(l).rect())
            .collect();
        assert_eq!(after, before, "controls moved after click {clicks}");
    }
}

//! The workbench window driven as a person would: by label and role, reading what is on screen.

use crate::common;

use common::screen_text;
use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use tankwright::model::SpacingSpec;
use tankwright::ui::App;

/// The window with the classical model leading (the field solution switched off), so no
/// worker's answer can move a figure or a row between two reads of a test; the field
/// solution's window tests are in tests/window/ui_field.rs.
fn workbench() -> Harness<'static, App> {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 900.0))
        .build_eframe(|cc| App::new(cc).with_field_solution(false));
    harness.run();
    harness
}

/// The figure shown beside the readout named `name`.
fn readout(harness: &Harness<'_, App>, name: &str) -> String {
    let text = screen_text(harness);
    let at = text
        .iter()
        .position(|t| t == name)
        .unwrap_or_else(|| panic!("no readout named {name:?} on screen"));
    text[at + 1].clone()
}

/// The row of the inductance chart for the method called `name`, as read by assistive tools:
/// "Rosa round wire 52.31 nH (drives the resonance)".
fn model_row(harness: &Harness<'_, App>, name: &str) -> String {
    let prefix = format!("{name} ");
    screen_text(harness)
        .into_iter()
        .find(|t| t.starts_with(&prefix) && t.contains(" nH"))
        .unwrap_or_else(|| panic!("no row for {name:?} in the inductance chart"))
}

/// The inductance the chart shows for the method called `name`, nH.
fn model_nh(harness: &Harness<'_, App>, name: &str) -> f64 {
    let row = model_row(harness, name);
    number(row.trim_start_matches(name))
}

/// The leading number of a figure such as "98.712 MHz" or "+35.2 kHz".
fn number(figure: &str) -> f64 {
    let head: String = figure
        .trim()
        .chars()
        .take_while(|c| c.is_ascii_digit() || matches!(c, '.' | '-' | '+' | '−'))
        .collect();
    head.replace('−', "-")
        .parse()
        .unwrap_or_else(|_| panic!("{figure:?} does not start with a number"))
}

/// The resonance readout: the model's figure, the one the verdict and the offsets use (the
/// field-solved figure is its own row; see tests/window/ui_field.rs).
fn resonance_mhz(harness: &mut Harness<'_, App>) -> f64 {
    let figure = readout(harness, "Resonance");
    assert!(figure.ends_with(" MHz"), "resonance shown as {figure:?}");
    number(&figure)
}

/// No figure on screen is NaN or infinite (as Rust formats them: "NaN", "inf", "-inf").
fn assert_no_nan(harness: &Harness<'_, App>) {
    for text in screen_text(harness) {
        let non_number = text
            .split(|c: char| c.is_whitespace() || "()–,/".contains(c))
            .any(|word| matches!(word.trim_start_matches(['+', '-']), "NaN" | "inf"));
        assert!(!non_number, "non-number on screen: {text:?}");
    }
}

#[test]
fn demo_recipe_opens_with_every_readout_in_its_unit() {
    let mut harness = workbench();
    let f = resonance_mhz(&mut harness);
    // The demo aims at 98.7 MHz; the engine lands it in the FM broadcast band.
    assert!((88.0..108.0).contains(&f), "demo resonance {f} MHz");
    assert!(readout(&harness, "Self-capacitance").ends_with(" pF"));
    assert!(readout(&harness, "Total capacitance").ends_with(" pF"));
    assert!(readout(&harness, "Self-resonance, lumped").ends_with(" MHz"));
    assert!(readout(&harness, "Self-resonance, helical").ends_with(" MHz"));
    assert!(readout(&harness, "Wire to cut").ends_with(" mm"));
    assert!(model_row(&harness, "Rosa round wire").ends_with(" nH (drives the resonance)"));
    assert!(
        screen_text(&harness)
            .iter()
            .any(|t| t.starts_with("Spread ") && t.contains(" %")),
        "no spread of the models on screen"
    );
    assert!(readout(&harness, "Offset from target").contains(" kHz"));
    assert_no_nan(&harness);
}

#[test]
fn more_turns_lower_the_frequency() {
    let mut harness = workbench();
    let before = resonance_mhz(&mut harness);
    harness
        .get_by_role_and_label(Role::Slider, "Turns")
        .set_value_accesskit(6.0);
    harness.run();
    assert_eq!(harness.state().recipe().winding.turns, 6.0);
    let after = resonance_mhz(&mut harness);
    assert!(
        after < before,
        "6 turns: {after} MHz, 5 turns: {before} MHz"
    );
}

#[test]
fn stretching_with_the_length_slider_raises_the_frequency() {
    let mut harness = workbench();
    let before = resonance_mhz(&mut harness);
    harness
        .get_by_role_and_label(Role::Slider, "Coil length")
        .set_value_accesskit(12.0);
    harness.run();
    let after = resonance_mhz(&mut harness);
    assert!(after > before, "12 mm: {after} MHz, 8 mm: {before} MHz");
    assert_eq!(
        harness.state().recipe().winding.spacing,
        SpacingSpec::Length(12.0e-3)
    );
}

#[test]
fn dragging_the_free_end_of_the_drawing_raises_the_frequency() {
    let mut harness = workbench();
    let before = resonance_mhz(&mut harness);
    let handle = harness
        .get_by_label("drag to stretch or squeeze")
        .rect()
        .center();
    let to = handle + egui::vec2(60.0, 0.0);
    harness.hover_at(handle);
    harness.run();
    harness.drag_at(handle);
    harness.run();
    harness.hover_at(handle + egui::vec2(30.0, 0.0));
    harness.run();
    harness.hover_at(to);
    harness.run();
    harness.drop_at(to);
    harness.run();
    let SpacingSpec::Length(length) = harness.state().recipe().winding.spacing else {
        panic!("spacing is no longer given as a length");
    };
    assert!(length > 8.0e-3, "dragged to {length} m");
    let after = resonance_mhz(&mut harness);
    assert!(
        after > before,
        "stretched: {after} MHz, before: {before} MHz"
    );
}

#[test]
fn picking_another_channel_changes_the_offset() {
    let mut harness = workbench();
    let before = number(&readout(&harness, "Offset from target"));
    // The target panel sits below the readouts: bring it into view first.
    harness.get_by_label("Higher channel").scroll_to_me();
    harness.run();
    harness.get_by_label("Higher channel").click();
    harness.run();
    assert_eq!(harness.state().recipe().target.channel, 98.9e6);
    let after = number(&readout(&harness, "Offset from target"));
    // One US FM channel up is 200 kHz: the offset falls by that much.
    assert!(
        (before - after - 200.0).abs() < 0.15,
        "offset {before} kHz became {after} kHz"
    );
}

#[test]
fn picking_a_channel_from_the_list_changes_the_offset() {
    let mut harness = workbench();
    let before = number(&readout(&harness, "Offset from target"));
    harness
        .get_by_role_and_label(Role::ComboBox, "Channel")
        .scroll_to_me();
    harness.run();
    harness
        .get_by_role_and_label(Role::ComboBox, "Channel")
        .click();
    harness.run();
    harness
        .get_by_label("98.1 MHz (channel 251)")
        .scroll_to_me();
    harness.run();
    harness.get_by_label("98.1 MHz (channel 251)").click();
    harness.run();
    assert_eq!(harness.state().recipe().target.channel, 98.1e6);
    let after = number(&readout(&harness, "Offset from target"));
    assert!(
        (after - before - 600.0).abs() < 0.15,
        "offset {before} kHz became {after} kHz"
    );
}

#[test]
fn touching_turns_show_the_reason_and_no_nan() {
    let mut harness = workbench();
    harness
        .get_by_role_and_label(Role::Slider, "Coil length")
        .set_value_accesskit(1.0);
    harness.run();
    // 5 turns of 1 mm wire cannot fit in 1 mm: the engine refuses, the window says why.
    let text = screen_text(&harness).join("\n");
    assert!(
        text.contains("cannot be built"),
        "no refusal on screen:\n{text}"
    );
    assert!(
        text.contains("turns would overlap"),
        "no reason on screen:\n{text}"
    );
    assert!(harness.state().analysis().is_none());
    assert!(
        !screen_text(&harness).iter().any(|t| t == "Resonance"),
        "readouts still shown for a refused coil"
    );
    assert_no_nan(&harness);
    // The drawing of the last coil that could be built stays, to drag back from.
    harness.get_by_label("coil drawing");
    // What was typed is kept.
    assert_eq!(
        harness.state().recipe().winding.spacing,
        SpacingSpec::Length(1.0e-3)
    );
}

#[test]
fn a_warning_sits_beside_its_figure() {
    let mut harness = workbench();
    // A 2-turn coil: the engine warns that both self-resonance estimates are rough.
    harness
        .get_by_role_and_label(Role::Slider, "Turns")
        .set_value_accesskit(2.0);
    harness.run();
    let text = screen_text(&harness);
    let figure = text
        .iter()
        .position(|t| t == "Self-resonance, helical")
        .expect("self-resonance readout");
    let caution = text
        .iter()
        .position(|t| t.contains("fewer than 5 turns"))
        .expect("the few-turns caution is on screen");
    assert!(
        caution > figure && caution < figure + 6,
        "caution at {caution}, figure at {figure}"
    );
}

#[test]
fn undo_restores_the_previous_value_and_redo_reapplies_it() {
    let mut harness = workbench();
    let before = resonance_mhz(&mut harness);
    harness
        .get_by_role_and_label(Role::Slider, "Turns")
        .set_value_accesskit(7.5);
    harness.run();
    assert_eq!(harness.state().recipe().winding.turns, 7.5);
    harness.get_by_label("Undo").click();
    harness.run();
    assert_eq!(harness.state().recipe().winding.turns, 5.0);
    assert_eq!(resonance_mhz(&mut harness), before);
    harness.get_by_label("Redo").click();
    harness.run();
    assert_eq!(harness.state().recipe().winding.turns, 7.5);
}

#[test]
fn ctrl_z_undoes_and_ctrl_shift_z_redoes() {
    let mut harness = workbench();
    harness
        .get_by_role_and_label(Role::Slider, "Trimmer setting")
        .set_value_accesskit(80.0);
    harness.run();
    assert_eq!(harness.state().recipe().tank.trimmer_setting, 0.8);
    harness.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::Z);
    harness.run();
    assert_eq!(harness.state().recipe().tank.trimmer_setting, 0.5);
    harness.key_press_modifiers(
        egui::Modifiers::COMMAND | egui::Modifiers::SHIFT,
        egui::Key::Z,
    );
    harness.run();
    assert_eq!(harness.state().recipe().tank.trimmer_setting, 0.8);
}

#[test]
fn clicking_the_trimmer_chart_sets_the_trimmer() {
    let mut harness = workbench();
    let before = resonance_mhz(&mut harness);
    let chart = harness
        .get_by_label(tankwright::ui::charts::TRIMMER_CHART_LABEL)
        .rect();
    let at = egui::pos2(chart.left() + 0.85 * chart.width(), chart.center().y);
    harness.hover_at(at);
    harness.run();
    harness.drag_at(at);
    harness.run();
    harness.drop_at(at);
    harness.run();
    let setting = harness.state().recipe().tank.trimmer_setting;
    assert!(
        setting > 0.6,
        "trimmer at {setting} after a click near 100 %"
    );
    // More trimmer capacitance, lower resonance.
    assert!(resonance_mhz(&mut harness) < before);
}

#[test]
fn arrow_keys_nudge_the_focused_slider_by_a_quarter_turn() {
    let mut harness = workbench();
    harness.get_by_role_and_label(Role::Slider, "Turns").focus();
    harness.run();
    harness.key_press(egui::Key::ArrowRight);
    harness.run();
    assert_eq!(harness.state().recipe().winding.turns, 5.25);
    harness.key_press(egui::Key::ArrowLeft);
    harness.key_press(egui::Key::ArrowLeft);
    harness.run();
    assert_eq!(harness.state().recipe().winding.turns, 4.75);
}

#[test]
fn arrow_keys_step_the_number_field_too() {
    let mut harness = workbench();
    harness
        .get_by_role_and_label(Role::SpinButton, "Turns")
        .focus();
    harness.run();
    harness.key_press(egui::Key::ArrowUp);
    harness.run();
    assert_eq!(harness.state().recipe().winding.turns, 5.25);
}

#[test]
fn stretch_to_target_lands_on_the_channel() {
    let mut harness = workbench();
    // The verdict block sits above the target panel: bring the button into view first.
    harness.get_by_label("Stretch to target").scroll_to_me();
    harness.run();
    harness.get_by_label("Stretch to target").click();
    harness.run();
    let offset = number(&readout(&harness, "Offset from target"));
    assert!(offset.abs() < 1.0, "offset after stretching: {offset} kHz");
}

#[test]
fn inches_show_lengths_in_inches() {
    let mut harness = workbench();
    harness.get_by_label("inches").click();
    harness.run();
    assert!(readout(&harness, "Wire to cut").ends_with(" in"));
}

#[test]
fn cautions_open_from_the_main_screen() {
    let mut harness = workbench();
    let text = screen_text(&harness).join("\n");
    assert!(text.contains("needs a licence"), "no caution line:\n{text}");
    harness.get_by_label("Cautions…").click();
    harness.run();
    let text = screen_text(&harness).join("\n");
    assert!(text.contains("47 CFR §15.239"));
    assert!(text.contains("108–137 MHz"));
    assert!(text.contains("amateur licence"));
    assert!(text.contains("Soldering"));
}

#[test]
fn theme_switches_between_dark_and_light() {
    let mut harness = workbench();
    assert!(harness.ctx.theme() == egui::Theme::Dark);
    harness.get_by_label("Light theme").click();
    harness.run();
    assert_eq!(harness.ctx.theme(), egui::Theme::Light);
}

#[test]
fn switching_what_is_given_keeps_the_coil() {
    let mut harness = workbench();
    let before = resonance_mhz(&mut harness);
    harness.get_by_label("gap").click();
    harness.run();
    let SpacingSpec::Gap(gap) = harness.state().recipe().winding.spacing else {
        panic!("spacing not given as a gap");
    };
    // 8 mm over 5 turns is a 1.6 mm pitch; less the 1 mm bare wire leaves 0.6 mm.
    assert!((gap - 0.6e-3).abs() < 1e-9, "gap {gap}");
    harness.get_by_label("mean").click();
    harness.run();
    assert_eq!(
        harness.state().recipe().winding.diameter,
        tankwright::model::DiameterSpec::Mean(7.0e-3)
    );
    let after = resonance_mhz(&mut harness);
    assert!(
        (after - before).abs() < 1e-3,
        "{before} MHz became {after} MHz"
    );
}

#[test]
fn a_custom_list_of_channels_can_be_typed() {
    let mut harness = workbench();
    harness
        .get_by_role_and_label(Role::ComboBox, "Band plan")
        .scroll_to_me();
    harness.run();
    harness
        .get_by_role_and_label(Role::ComboBox, "Band plan")
        .click();
    harness.run();
    harness.get_by_label("Custom list").click();
    harness.run();
    harness
        .get_by_role_and_label(Role::TextInput, "Channels (MHz)")
        .set_text_value_accesskit("99.5, 101.3");
    harness.run();
    let target = &harness.state().recipe().target;
    assert_eq!(
        target.plan,
        tankwright::tuning::BandPlan::Custom(vec![99.5e6, 101.3e6])
    );
    assert_eq!(target.channel, 99.5e6);
    let offset = number(&readout(&harness, "Offset from target"));
    let resonance = resonance_mhz(&mut harness);
    assert!(
        (offset - (resonance - 99.5) * 1e3).abs() < 0.6,
        "offset {offset} kHz at {resonance} MHz"
    );
    // A typo is reported and the last good list kept.
    harness
        .get_by_role_and_label(Role::TextInput, "Channels (MHz)")
        .set_text_value_accesskit("99.5, 10x");
    harness.run();
    let text = screen_text(&harness).join("\n");
    assert!(text.contains("“10x” is not a frequency in MHz"), "{text}");
    assert_eq!(
        harness.state().recipe().target.plan,
        tankwright::tuning::BandPlan::Custom(vec![99.5e6, 101.3e6])
    );
}

#[test]
fn another_inductance_model_can_drive_the_resonance() {
    let mut harness = workbench();
    let before = resonance_mhz(&mut harness);
    let sheet = model_nh(&harness, "Nagaoka current sheet");
    let round_wire = model_nh(&harness, "Rosa round wire");
    harness
        .get_by_role_and_label(Role::ComboBox, "Inductance model")
        .click();
    harness.run();
    harness
        .get_by_role_and_label(Role::Button, "Nagaoka current sheet")
        .click();
    harness.run();
    // The chosen model is marked, and its (larger) inductance lowers the resonance.
    assert!(model_row(&harness, "Nagaoka current sheet").ends_with("(drives the resonance)"));
    assert_eq!(model_nh(&harness, "Nagaoka current sheet"), sheet);
    assert!(sheet > round_wire);
    let after = resonance_mhz(&mut harness);
    assert!(
        after < before,
        "current sheet: {after} MHz, round wire: {before} MHz"
    );
}

#[test]
fn extreme_typed_values_give_figures_or_a_reason_never_nan() {
    let mut harness = workbench();
    let cases: [(&str, f64); 10] = [
        ("Turns", 0.5),
        ("Turns", 1.0),
        ("Turns", 30.0),
        ("Coil length", 1900.0),
        ("Coil length", 0.0),
        ("Former diameter", 0.1),
        ("Former diameter", 250.0),
        ("Lead length", 400.0),
        ("Trimmer setting", 140.0),
        ("Stray capacitance", -3.0),
    ];
    for (control, value) in cases {
        // Start each case from the demo coil.
        harness
            .state_mut()
            .set_document(tankwright::recipe::Recipe::demo());
        harness.run();
        harness
            .get_by_role_and_label(Role::SpinButton, control)
            .set_value_accesskit(value);
        harness.run();
        assert_no_nan(&harness);
        let text = screen_text(&harness);
        let figures = text.iter().any(|t| t == "Resonance");
        let refusal = text.iter().any(|t| t.contains("cannot be built as given"));
        assert!(
            figures != refusal,
            "{control} = {value}: figures {figures}, refusal {refusal}"
        );
        assert_eq!(
            figures,
            harness.state().analysis().is_some(),
            "{control} = {value}: the screen and the engine disagree"
        );
        // The readouts' guard against non-finite figures never had to step in.
        assert!(
            !text.iter().any(|t| t == "no finite figure"),
            "{control} = {value}: the engine gave a non-finite figure"
        );
    }
}

#[test]
fn clicking_the_spacing_chart_sets_the_gap_when_the_gap_is_given() {
    let mut harness = workbench();
    let before = resonance_mhz(&mut harness);
    harness.get_by_label("gap").click();
    harness.run();
    let chart = harness
        .get_by_label(tankwright::ui::charts::SPACING_CHART_LABEL)
        .rect();
    let at = egui::pos2(chart.left() + 0.8 * chart.width(), chart.center().y);
    harness.hover_at(at);
    harness.run();
    harness.drag_at(at);
    harness.run();
    harness.drop_at(at);
    harness.run();
    let SpacingSpec::Gap(gap) = harness.state().recipe().winding.spacing else {
        panic!("the click turned the gap into another kind of spacing");
    };
    // The demo's gap is 0.6 mm; a click far to the right of it asks for a longer coil.
    assert!(gap > 1.0e-3, "gap after the click: {gap} m");
    assert!(resonance_mhz(&mut harness) > before);
}

#[test]
fn hovering_a_figure_names_its_method() {
    let mut harness = workbench();
    let row = model_row(&harness, "Rosa round wire");
    harness.get_by_label(&row).hover();
    harness.run();
    // Tooltips wait for the pointer to rest; let time pass.
    for _ in 0..60 {
        harness.step();
    }
    harness.run();
    let text = screen_text(&harness).join("\n");
    assert!(
        text.contains("Rosa 1907/Grover 1946 round-wire correction of Nagaoka's current sheet"),
        "no method note on screen:\n{text}"
    );
}

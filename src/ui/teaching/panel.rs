//! The teaching bench's panel: the demonstrated length and the way back to the recipe, large
//! readouts, the sweep's controls, the hand, the caption, and the reference with its
//! differences. In the presentation layout the finer controls are left out.

use super::captions::{self, Moment, Topic};
use super::sweep::{self, STEP_COARSE, STEP_FINE};
use super::{HAND_BUTTON_LABEL, HAND_RANGE, Teaching};
use crate::recipe::{Figures, Footing, Recipe};
use crate::tuning::digits;
use crate::ui::evaluation::Evaluation;
use crate::ui::files::ReferencePick;
use crate::ui::files::{FileDesk, read_reference};
use crate::ui::panels::capacitance_quantity;
use crate::ui::theme;
use crate::ui::units::LengthUnit;
use crate::units::{from_pf, to_nh};
use eframe::egui::{self, RichText};

/// The panel's heading.
pub const PANEL_HEADING: &str = "Teaching bench";
/// Name of the large inductance readout.
pub const INDUCTANCE_LABEL: &str = "Inductance now";
/// Name of the large frequency readout.
pub const FREQUENCY_LABEL: &str = "Frequency now";
/// The sweep's button while it is paused.
pub const SWEEP_START_LABEL: &str = "Start the sweep";
/// The sweep's button while it runs.
pub const SWEEP_PAUSE_LABEL: &str = "Pause the sweep";
/// Pins the recipe being edited.
pub const PIN_PRESENT_LABEL: &str = "Pin this recipe as the reference";
/// Pins a recipe file.
pub const PIN_FILE_LABEL: &str = "Pin a recipe file…";
/// Name of the list of differences from the reference.
pub const DIFFERENCES_HEADING: &str = "Differences from the reference";

/// The step buttons: label and step, metres.
const STEPS: [(&str, f64); 4] = [
    ("−0.5 mm", -STEP_COARSE),
    ("−0.1 mm", -STEP_FINE),
    ("+0.1 mm", STEP_FINE),
    ("+0.5 mm", STEP_COARSE),
];

/// Show the panel; returns a length to keep in the recipe when the instructor asks for it.
pub(super) fn show(
    teaching: &mut Teaching,
    ui: &mut egui::Ui,
    recipe: &Recipe,
    base: &Evaluation,
    unit: LengthUnit,
    files: &mut FileDesk,
) -> Option<f64> {
    let mut keep = None;
    ui.heading(PANEL_HEADING);
    let Some(base_figures) = base.latest() else {
        ui.label("No coil to show: the recipe is refused (see the readouts).");
        return None;
    };
    let Some(shown) = teaching.shown().cloned() else {
        ui.label("The bench's copy of the recipe is refused; change the recipe.");
        return None;
    };
    let presenting = teaching.presentation;
    let coil = base_figures.coil;
    let range = sweep::range(&coil);

    // The sweep and the steps first: nothing above them appears or vanishes.
    ui.horizontal_wrapped(|ui| {
        let label = if teaching.sweep.running {
            SWEEP_PAUSE_LABEL
        } else {
            SWEEP_START_LABEL
        };
        if ui.button(label).clicked() {
            teaching.sweep.running = !teaching.sweep.running;
            if teaching.sweep.running && teaching.length.is_none() {
                teaching.length = Some(coil.length());
            }
        }
        for (text, step) in STEPS {
            if ui
                .button(text)
                .on_hover_text("Move the shown length by this much (pauses the sweep)")
                .clicked()
            {
                let from = teaching.length.unwrap_or(coil.length());
                teaching.sweep.running = false;
                teaching.length = Some(sweep::stepped(from, step, range));
                teaching.discrete = true;
            }
        }
    });
    if !presenting {
        ui.horizontal(|ui| {
            let label = ui.label("Seconds end to end");
            ui.add(egui::Slider::new(
                &mut teaching.sweep.seconds,
                sweep::SECONDS_RANGE.0..=sweep::SECONDS_RANGE.1,
            ))
            .labelled_by(label.id);
        });
        ui.label(
            RichText::new(format!(
                "The sweep runs from close-wound ({}) to well spaced ({}) and back.",
                unit.show(range.0),
                unit.show(range.1)
            ))
            .weak(),
        );
    }
    ui.add_space(6.0);

    // What is shown, below the controls above (so they never move under the pointer when
    // it appears), its buttons always in place and greyed while the recipe's own length is
    // shown.
    if !presenting {
        ui.horizontal_wrapped(|ui| {
            let shown = teaching.length.is_some();
            if ui
                .add_enabled(shown, egui::Button::new("Back to the recipe's length"))
                .clicked()
            {
                teaching.sweep.running = false;
                teaching.length = None;
                teaching.discrete = true;
            }
            if ui
                .add_enabled(shown, egui::Button::new("Keep this length in the recipe"))
                .clicked()
                && let Some(length) = teaching.length
            {
                teaching.sweep.running = false;
                keep = Some(length);
            }
        });
    }
    match teaching.length {
        Some(length) => ui.label(format!(
            "Showing {} (the recipe keeps {}).",
            unit.show(length),
            unit.show(coil.length())
        )),
        None => ui.label("Showing the recipe's length. Nothing here changes the recipe."),
    };
    ui.add_space(6.0);

    // The hand.
    ui.horizontal_wrapped(|ui| {
        let button = ui
            .add(egui::Button::new(HAND_BUTTON_LABEL).selected(teaching.hand.held))
            .on_hover_text("Hold the button, or hold H, to add the hand's capacitance");
        let down = button.is_pointer_button_down_on();
        if down != teaching.hand.button_down {
            teaching.hand.button_down = down;
            ui.ctx().request_repaint();
        }
        ui.label("or hold H");
    });
    if !presenting {
        let mut farads = teaching.hand.capacitance;
        let _ = capacitance_quantity("Hand capacitance", &mut farads, HAND_RANGE)
            .note("What a hand near the coil adds to the stray (1–2 pF: common practice)")
            .show(ui);
        let (lo, hi) = (from_pf(HAND_RANGE.0), from_pf(HAND_RANGE.1));
        if farads.is_finite() {
            teaching.hand.capacitance = farads.clamp(lo, hi);
        }
    }
    ui.add_space(6.0);

    readouts(ui, &shown);
    ui.add_space(6.0);

    // The caption.
    let moment = Moment {
        hand_held: teaching.hand.held,
        hand: teaching.hand.capacitance,
        without_hand: teaching
            .hand
            .held
            .then(|| {
                teaching
                    .ghost
                    .ghost()
                    .filter(|g| g.coil == shown.coil)
                    .map(|g| g.resonance)
            })
            .flatten(),
        travel: teaching.travel,
    };
    let followed = captions::follow(&shown, &moment);
    let topic = teaching.topic.unwrap_or(followed);
    // Room for the longest caption, so the controls below do not jump as the figures change.
    let line = ui.style().text_styles[&egui::TextStyle::Body].size * 1.3;
    egui::Frame::group(ui.style()).show(ui, |ui| {
        ui.set_width(ui.available_width());
        ui.set_min_height(8.0 * line);
        ui.label(RichText::new(topic.name()).strong());
        ui.label(captions::caption(topic, &shown, &moment, unit));
    });
    ui.horizontal_wrapped(|ui| {
        if ui
            .selectable_label(teaching.topic.is_none(), "Follow the demonstration")
            .clicked()
        {
            teaching.topic = None;
        }
        for topic in Topic::ALL {
            let chosen = teaching.topic.unwrap_or(followed) == topic;
            if ui.selectable_label(chosen, topic.name()).clicked() {
                teaching.topic = Some(topic);
            }
        }
    });
    ui.add_space(6.0);

    // Against the reference: what is demonstrated (the shown length), not only the recipe.
    reference_ui(
        teaching,
        ui,
        recipe,
        &shown,
        unit,
        files,
        base_figures.footing(),
    );
    keep
}

/// The two large readouts and where the carrier stands against the channel.
fn readouts(ui: &mut egui::Ui, shown: &Figures) {
    let inductance = format!("{:.1} nH", to_nh(shown.analysis.total_inductance));
    let frequency = digits::mhz(shown.analysis.resonance);
    let big = big_size(ui, &[&inductance, &frequency]);
    egui::Grid::new("teaching readouts")
        .num_columns(2)
        .spacing([16.0, 2.0])
        .show(ui, |ui| {
            ui.label(INDUCTANCE_LABEL);
            ui.label(RichText::new(inductance).size(big).strong());
            ui.end_row();
            ui.label(FREQUENCY_LABEL);
            ui.label(RichText::new(frequency).size(big).strong());
            ui.end_row();
        });
    let t = &shown.target;
    let (words, colour) = if t.on_channel {
        ("on channel", theme_ok(ui))
    } else {
        ("off the channel", theme::refusal(ui))
    };
    ui.label(
        RichText::new(format!(
            "{} from {} MHz: {words}",
            digits::offset(t.offset),
            digits::channel_mhz(t.channel)
        ))
        .color(colour),
    );
}

/// The readouts' large type: half as large again as a heading, or as large as lets the widest
/// value sit beside its label in the panel's width (a readout never widens the panel).
fn big_size(ui: &egui::Ui, values: &[&str]) -> f32 {
    let big = ui.style().text_styles[&egui::TextStyle::Heading].size * 1.5;
    let body = egui::TextStyle::Body.resolve(ui.style());
    let label = [INDUCTANCE_LABEL, FREQUENCY_LABEL]
        .iter()
        .map(|l| {
            ui.painter()
                .layout_no_wrap((*l).to_owned(), body.clone(), egui::Color32::WHITE)
                .size()
                .x
        })
        .fold(0.0, f32::max);
    let widest = values
        .iter()
        .map(|v| {
            ui.painter()
                .layout_no_wrap(
                    (*v).to_owned(),
                    egui::FontId::proportional(big),
                    egui::Color32::WHITE,
                )
                .size()
                .x
        })
        .fold(0.0, f32::max);
    // The grid's gap between the columns, and a margin for the bold face.
    let room = ui.available_width() - label - 16.0 - 8.0;
    if widest > room && widest > 0.0 {
        (big * room / widest).max(body.size)
    } else {
        big
    }
}

fn theme_ok(ui: &egui::Ui) -> egui::Color32 {
    if ui.visuals().dark_mode {
        egui::Color32::from_rgb(0x6f, 0xc2, 0x86)
    } else {
        egui::Color32::from_rgb(0x23, 0x7a, 0x3f)
    }
}

/// Pinning and the differences.
fn reference_ui(
    teaching: &mut Teaching,
    ui: &mut egui::Ui,
    recipe: &Recipe,
    present: &Figures,
    unit: LengthUnit,
    files: &mut FileDesk,
    footing: Footing,
) {
    ui.strong("Reference build");
    if !teaching.presentation {
        ui.horizontal_wrapped(|ui| {
            if ui.button(PIN_PRESENT_LABEL).clicked() {
                let name = if recipe.name.trim().is_empty() {
                    "this recipe".to_owned()
                } else {
                    recipe.name.trim().to_owned()
                };
                let outcome = teaching.pin(name, recipe.clone(), footing);
                teaching.pin.message = outcome.err().map(|e| (e, true));
            }
            if ui.button(PIN_FILE_LABEL).clicked() {
                let pick = files.ask_reference();
                pin_picked(teaching, pick, files, footing);
            }
            ui.menu_button("Pin a demo recipe", |ui| {
                for (file, demo) in crate::recipe::demos() {
                    if ui.button(demo.name.clone()).clicked() {
                        let outcome = teaching.pin(file.to_owned(), demo, footing);
                        teaching.pin.message = outcome.err().map(|e| (e, true));
                        ui.close();
                    }
                }
            });
            if teaching.reference.is_some() && ui.button("Unpin").clicked() {
                teaching.reference = None;
            }
        });
        let mut typed_pick = None;
        if let Some(typed) = &mut teaching.pin.typed {
            ui.label(RichText::new(teaching.pin.reason.as_str()).weak());
            let mut go = false;
            ui.horizontal(|ui| {
                let label = ui.label("Reference file");
                let field = ui
                    .add(
                        egui::TextEdit::singleline(typed)
                            .id_salt("reference_file")
                            .desired_width(220.0),
                    )
                    .labelled_by(label.id);
                go = field.lost_focus() && ui.input(|i| i.key_pressed(egui::Key::Enter));
                go |= ui.button("Pin").clicked();
            });
            if go {
                typed_pick = Some(read_reference(std::path::Path::new(typed.trim())));
            }
        }
        if let Some(pick) = typed_pick {
            pin_picked(teaching, pick, files, footing);
        }
        if let Some((text, is_error)) = &teaching.pin.message {
            let mut rich = RichText::new(text);
            if *is_error {
                rich = rich.color(theme::refusal(ui));
            }
            ui.label(rich);
        }
    }
    let Some(reference) = &teaching.reference else {
        if teaching.presentation {
            ui.label(RichText::new("None pinned.").weak());
        }
        return;
    };
    ui.label(format!(
        "Pinned: {} (its curve is the dashed one on the spacing chart).",
        reference.name
    ));
    let rows = reference.differences(recipe, present, unit);
    let demonstrating = teaching.length.is_some();
    egui::CollapsingHeader::new(DIFFERENCES_HEADING)
        .default_open(true)
        .show(ui, |ui| {
            // Its own horizontal scroll, so a wide list never widens the panel.
            egui::ScrollArea::horizontal()
                .id_salt("teaching differences scroll")
                .show(ui, |ui| {
                    egui::Grid::new("teaching differences")
                        .num_columns(4)
                        .striped(true)
                        .show(ui, |ui| {
                            ui.strong("");
                            ui.strong(if demonstrating {
                                "Shown here"
                            } else {
                                "This recipe"
                            });
                            ui.strong("Reference");
                            ui.strong("Difference");
                            ui.end_row();
                            for row in rows {
                                ui.label(row.quantity);
                                ui.label(row.present);
                                ui.label(row.reference);
                                ui.label(row.change);
                                ui.end_row();
                            }
                        });
                });
        });
}

/// Pin what the file dialog (or the typed path) gave.
fn pin_picked(teaching: &mut Teaching, pick: ReferencePick, files: &FileDesk, footing: Footing) {
    match pick {
        ReferencePick::Read(name, recipe) => match teaching.pin(name.clone(), *recipe, footing) {
            Ok(()) => {
                teaching.pin.typed = None;
                teaching.pin.message = Some((format!("pinned {name}"), false));
            }
            Err(e) => teaching.pin.message = Some((e, true)),
        },
        ReferencePick::Cancelled => {}
        ReferencePick::Unavailable(reason) => {
            teaching.pin.reason = reason;
            teaching.pin.typed = Some(files.reference_folder().join("").display().to_string());
        }
        ReferencePick::Failed(why) => teaching.pin.message = Some((why, true)),
    }
}

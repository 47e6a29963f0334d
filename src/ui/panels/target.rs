//! The target: band plan and channel, and where the coil stands against it.

use super::channel_picker::ChannelPicker;
use super::{Command, heading, target_figures};
use crate::recipe::Target;
use crate::tuning::BandPlan;
use crate::ui::evaluation::Evaluation;
use crate::ui::theme;
use crate::ui::units::LengthUnit;
use crate::units::{from_khz, from_mhz, to_khz, to_mhz};
use eframe::egui::{self, RichText};

/// A frequency in MHz with as many decimals as it needs (one at least, four at most).
pub fn show_mhz(hz: f64) -> String {
    let text = format!("{:.4}", to_mhz(hz));
    let trimmed = text.trim_end_matches('0');
    let trimmed = if trimmed.ends_with('.') {
        format!("{trimmed}0")
    } else {
        trimmed.to_owned()
    };
    format!("{trimmed} MHz")
}

/// Parse a list of MHz values separated by commas, semicolons or spaces, into hertz.
fn parse_mhz_list(text: &str) -> Result<Vec<f64>, String> {
    let mut out = Vec::new();
    for token in text
        .split(|c: char| c == ',' || c == ';' || c.is_whitespace())
        .filter(|t| !t.is_empty())
    {
        match token.parse::<f64>() {
            Ok(v) if v.is_finite() && v > 0.0 => out.push(from_mhz(v)),
            _ => return Err(format!("“{token}” is not a frequency in MHz")),
        }
    }
    if out.is_empty() {
        return Err("the list is empty: type one or more frequencies in MHz".to_owned());
    }
    // The recipe rules (the loader's): range and count.
    crate::recipe::rules::check_channels(&out).map_err(|r| r.reason)?;
    Ok(out)
}

/// The MHz list as typed back.
fn format_mhz_list(list: &[f64]) -> String {
    list.iter()
        .map(|hz| show_mhz(*hz).trim_end_matches(" MHz").to_owned())
        .collect::<Vec<_>>()
        .join(", ")
}

/// The target panel's own state: the custom list as typed, the channel picker's field.
#[derive(Default)]
pub struct TargetPanel {
    custom_text: String,
    custom_problem: Option<String>,
    channel_picker: ChannelPicker,
}

impl TargetPanel {
    /// Show the target controls and figures.
    pub fn show(
        &mut self,
        ui: &mut egui::Ui,
        target: &mut Target,
        evaluation: &Evaluation,
        unit: LengthUnit,
        commands: &mut Vec<Command>,
    ) {
        heading(ui, "Target");
        self.pickers(ui, target, evaluation);
        ui.add_space(6.0);
        match evaluation.current() {
            Ok(figures) => target_figures::show(ui, target, figures, unit, commands),
            Err(_) => {
                ui.label("The target figures need a coil the engine accepts (see the readouts).");
            }
        }
    }

    fn pickers(&mut self, ui: &mut egui::Ui, target: &mut Target, evaluation: &Evaluation) {
        // Keep the typed list in step with the recipe (after undo, say), unless it holds a
        // problem the user is still fixing.
        if let BandPlan::Custom(list) = &target.plan
            && self.custom_problem.is_none()
            && parse_mhz_list(&self.custom_text).ok().as_ref() != Some(list)
        {
            self.custom_text = format_mhz_list(list);
        }
        // The grid's label column ("On channel within ±") takes about 140 points, and a
        // combo box adds its arrow and padding (about 45) to the width it is given.
        let wide = (ui.available_width() - 200.0).clamp(100.0, 220.0);
        egui::Grid::new("target_grid")
            .num_columns(2)
            .spacing([8.0, 6.0])
            .show(ui, |ui| {
                let label = ui.label("Band plan");
                let mut picked = None;
                let plan_label = target.plan.label();
                // The width is a least width: the box is held to it by the room it is given.
                let room = egui::vec2(wide + 45.0, ui.spacing().interact_size.y);
                ui.allocate_ui(room, |ui| {
                    egui::ComboBox::from_id_salt("band_plan")
                        .selected_text(target.plan.label())
                        .width(wide)
                        // A long plan name is cut with "…" rather than widening the column.
                        .truncate()
                        .show_ui(ui, |ui| {
                            for plan in BandPlan::built_in() {
                                let selected = plan == target.plan;
                                if ui.selectable_label(selected, plan.label()).clicked()
                                    && !selected
                                {
                                    picked = Some(plan);
                                }
                            }
                            let custom = matches!(target.plan, BandPlan::Custom(_));
                            if ui.selectable_label(custom, "Custom list").clicked() && !custom {
                                let list = parse_mhz_list(&self.custom_text)
                                    .unwrap_or_else(|_| vec![target.channel]);
                                picked = Some(BandPlan::Custom(list));
                            }
                        })
                        .response
                        .labelled_by(label.id)
                        .on_hover_text(plan_label);
                });
                ui.end_row();
                if let Some(plan) = picked {
                    if let Some(nearest) = plan.nearest(target.channel) {
                        target.channel = nearest;
                    }
                    if let BandPlan::Custom(list) = &plan {
                        self.custom_text = format_mhz_list(list);
                        self.custom_problem = None;
                    }
                    target.plan = plan;
                }

                if matches!(target.plan, BandPlan::Custom(_)) {
                    let label = ui.label("Channels (MHz)");
                    let response = ui
                        .add(
                            egui::TextEdit::singleline(&mut self.custom_text)
                                .id_salt("own_channel_list")
                                .hint_text("e.g. 98.7, 101.1, 145.5")
                                .desired_width(wide),
                        )
                        .labelled_by(label.id);
                    if response.changed() {
                        match parse_mhz_list(&self.custom_text) {
                            Ok(list) => {
                                self.custom_problem = None;
                                let plan = BandPlan::Custom(list);
                                let channels = plan.channels();
                                if !channels.contains(&target.channel)
                                    && let Some(nearest) = plan.nearest(target.channel)
                                {
                                    target.channel = nearest;
                                }
                                target.plan = plan;
                            }
                            Err(problem) => self.custom_problem = Some(problem),
                        }
                    }
                    ui.end_row();
                }

                let label = ui.label("Channel");
                ui.horizontal(|ui| {
                    let channels = evaluation.channels();
                    let index = channels.iter().position(|c| *c == target.channel);
                    let lower = index
                        .and_then(|i| i.checked_sub(1))
                        .and_then(|i| channels.get(i));
                    let higher = index.map_or(channels.first(), |i| channels.get(i + 1));
                    if ui
                        .add_enabled(lower.is_some(), egui::Button::new("‹"))
                        .on_hover_text("Next channel down")
                        .accessible_name("Lower channel")
                        .clicked()
                        && let Some(c) = lower
                    {
                        target.channel = *c;
                    }
                    if let Some(c) = self.channel_picker.show(
                        ui,
                        label.id,
                        &target.plan,
                        channels,
                        target.channel,
                        wide - 60.0,
                    ) {
                        target.channel = c;
                    }
                    if ui
                        .add_enabled(higher.is_some(), egui::Button::new("›"))
                        .on_hover_text("Next channel up")
                        .accessible_name("Higher channel")
                        .clicked()
                        && let Some(c) = higher
                    {
                        target.channel = *c;
                    }
                });
                ui.end_row();

                tolerance_row(ui, target);
                ui.end_row();
            });
        ui.add(egui::Label::new(RichText::new(tolerance_note(target)).small().weak()).wrap());
        if let Some(problem) = &self.custom_problem {
            ui.label(RichText::new(problem).color(theme::refusal(ui)));
        }
    }
}

/// Accessible name (and label) of the on-channel tolerance field.
pub const TOLERANCE_LABEL: &str = "On channel within ±";

/// The on-channel tolerance: the user's, in kHz, or the plan's default (its service's
/// practice, [`BandPlan::default_tolerance`]); a button goes back to the default.
fn tolerance_row(ui: &mut egui::Ui, target: &mut crate::recipe::Target) {
    let (lo, hi) = crate::recipe::rules::TOLERANCE_KHZ;
    let label = ui.label(TOLERANCE_LABEL).on_hover_text(TOLERANCE_NOTE);
    ui.horizontal(|ui| {
        let mut khz = to_khz(target.tolerance());
        let field = crate::ui::widgets::steady(ui, TOLERANCE_LABEL, |ui| {
            ui.add(
                egui::DragValue::new(&mut khz)
                    .range(lo..=hi)
                    .speed(0.1)
                    .fixed_decimals(1)
                    .suffix(" kHz")
                    .update_while_editing(false),
            )
            .labelled_by(label.id)
            .on_hover_text(TOLERANCE_NOTE)
        });
        if field.changed() && khz.is_finite() {
            // Rounded to the field's 0.1 kHz before it reaches the recipe.
            let hz = from_khz((khz.clamp(lo, hi) * 10.0).round() / 10.0);
            if (hz - target.tolerance()).abs() > 0.5 {
                target.tolerance = Some(hz);
            }
        }
        let default = target.plan.default_tolerance();
        if ui
            .add_enabled(
                target.tolerance.is_some(),
                egui::Button::new("Plan default"),
            )
            .on_hover_text(format!(
                "Back to the plan's default, ±{:.1} kHz (common practice)",
                to_khz(default)
            ))
            .clicked()
        {
            target.tolerance = None;
        }
    });
}

/// Hover note of the tolerance field.
const TOLERANCE_NOTE: &str = "The resonance counts as on channel when it lies within this of the \
     channel centre. Your choice; the default follows the service's practice (FM broadcast \
     ±15 kHz, 2 m FM ±2.5 kHz, any other list ±10 kHz: common practice), never the spacing \
     of the channels.";

/// Where the tolerance comes from, in words.
fn tolerance_note(target: &crate::recipe::Target) -> String {
    let default = to_khz(target.plan.default_tolerance());
    let service = target
        .plan
        .service()
        .map_or("a list in no known band", |s| s.label());
    match target.tolerance {
        None => format!(
            "±{default:.1} kHz is the default for {service} (common practice); type your own."
        ),
        Some(_) => format!(
            "Your own tolerance; the default for {service} is ±{default:.1} kHz (common \
             practice)."
        ),
    }
}

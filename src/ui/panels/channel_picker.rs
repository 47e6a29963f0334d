//! The channel picker: a drop-down of the plan's channels that opens scrolled to the present
//! channel and can be typed into — to find a channel by its frequency or note ("146.5",
//! "V40", "calling"), or to aim at a typed frequency that is no channel of the plan.
//!
//! The list and its matching are the plan's own ([`BandPlan::channel_label`],
//! [`BandPlan::matching`]); a typed frequency passes the recipe rules' range
//! ([`crate::recipe::rules::check_frequency_mhz`]) before it can be picked.

use crate::tuning::BandPlan;
use crate::units::from_mhz;
use eframe::egui::{self, RichText};

/// Accessible name of the text field inside the open picker.
pub const FIND_LABEL: &str = "Find a channel or type a frequency (MHz)";

/// Height of the list inside the open picker, points.
const LIST_HEIGHT: f32 = 300.0;

/// The picker's own state between frames.
#[derive(Default)]
pub struct ChannelPicker {
    /// What is typed in the picker's field.
    typed: String,
    /// The picker opened and the list has not yet been scrolled to the present channel.
    fresh: bool,
}

/// A typed frequency in MHz, in hertz, if it is one a recipe may aim at.
pub fn typed_frequency(text: &str) -> Option<f64> {
    let t = text
        .trim()
        .trim_end_matches("MHz")
        .trim_end_matches("mhz")
        .trim();
    let mhz: f64 = t.parse().ok()?;
    crate::recipe::rules::check_frequency_mhz(mhz, "the typed frequency").ok()?;
    // Whole hertz, as a plan's channels are.
    Some((from_mhz(mhz)).round())
}

impl ChannelPicker {
    /// Show the picker for `channel` of `plan` (labelled by `label`); returns the frequency
    /// picked, hertz, if the user picked one this frame.
    pub fn show(
        &mut self,
        ui: &mut egui::Ui,
        label: egui::Id,
        plan: &BandPlan,
        channels: &[f64],
        channel: f64,
        width: f32,
    ) -> Option<f64> {
        let salt = "channel";
        let mut picked = None;
        let shown = plan.channel_label(channel);
        // The width is a least width: the box is held to it by the room it is given.
        let room = egui::vec2(width + 45.0, ui.spacing().interact_size.y);
        ui.allocate_ui(room, |ui| {
            // The id the combo box gives its button (it makes an IdSalt of the salt first),
            // in the Ui the box is shown in.
            let button_id = ui.make_persistent_id(egui::IdSalt::new(salt));
            let was_open = egui::ComboBox::is_open(ui.ctx(), button_id);
            egui::ComboBox::from_id_salt(salt)
                .selected_text(shown.clone())
                .width(width)
                .truncate()
                // Room for the field and the list; the list scrolls on its own below the field.
                .height(LIST_HEIGHT + 80.0)
                .close_behavior(egui::PopupCloseBehavior::CloseOnClickOutside)
                .show_ui(ui, |ui| {
                    if !was_open {
                        self.typed.clear();
                        self.fresh = true;
                    }
                    picked = self.contents(ui, plan, channels, channel);
                    if picked.is_some() {
                        ui.close();
                    }
                })
                .response
                .labelled_by(label)
                .on_hover_text(shown);
        });
        picked
    }

    /// The field, the typed frequency (when it is no channel of the plan), and the list.
    fn contents(
        &mut self,
        ui: &mut egui::Ui,
        plan: &BandPlan,
        channels: &[f64],
        channel: f64,
    ) -> Option<f64> {
        // Done once the popup is shown for real (its first frame only measures it).
        let fresh = self.fresh && !ui.is_sizing_pass();
        if fresh {
            self.fresh = false;
        }
        let mut picked = None;
        let find = ui.label(RichText::new(FIND_LABEL).small());
        let field = ui
            .add(
                egui::TextEdit::singleline(&mut self.typed)
                    .id_salt("channel_picker_find")
                    .hint_text("e.g. 98.7, 146.52, V40, calling")
                    .desired_width(f32::INFINITY),
            )
            .labelled_by(find.id);
        if fresh {
            field.request_focus();
        }
        let entered = field.lost_focus() && ui.input(|i| i.key_pressed(egui::Key::Enter));
        let matching = if self.typed.trim().is_empty() {
            channels.to_vec()
        } else {
            plan.matching(&self.typed)
        };
        let number = typed_frequency(&self.typed);
        let typed = number.filter(|f| !plan.has_channel(*f));
        // What Enter takes: the typed frequency (off the plan), else the channel typed exactly
        // ("145.5" is V40 though 145.5125 matches too), else the one match, else the first
        // match in the list, which a line names before Enter is pressed.
        let exact = number.filter(|f| plan.has_channel(*f));
        let enter_takes = typed.or(exact).or(matching.first().copied());
        if let Some(f) = typed {
            let text = format!(
                "Aim at {} MHz (typed, not a channel of this plan)",
                crate::tuning::digits::channel_mhz(f)
            );
            if ui.selectable_label(false, text).clicked() {
                picked = Some(f);
            }
        } else if matching.is_empty() {
            ui.label(RichText::new("No channel matches; type a frequency in MHz").weak());
        } else if matching.len() > 1
            && !self.typed.trim().is_empty()
            && let Some(f) = enter_takes
        {
            let why = if exact.is_some() {
                "the channel typed"
            } else {
                "the first of the matches"
            };
            ui.label(
                RichText::new(format!("Enter takes {} ({why})", plan.channel_label(f))).weak(),
            );
        }
        if entered && !self.typed.trim().is_empty() {
            picked = picked.or(enter_takes);
        }
        ui.separator();
        egui::ScrollArea::vertical()
            .id_salt("channel list")
            .max_height(LIST_HEIGHT)
            .auto_shrink([false, true])
            .show(ui, |ui| {
                for &c in &matching {
                    let selected = (c - channel).abs() < 1.0;
                    let response = ui.selectable_label(selected, plan.channel_label(c));
                    if selected && fresh {
                        response.scroll_to_me(Some(egui::Align::Center));
                    }
                    if response.clicked() {
                        picked = Some(c);
                    }
                }
            });
        picked
    }
}

#[cfg(test)]
mod tests {
    use super::typed_frequency;

    #[test]
    fn typed_frequencies_are_read_in_mhz_and_nonsense_is_not() {
        assert_eq!(typed_frequency("146.52"), Some(146.52e6));
        assert_eq!(typed_frequency(" 98.7 MHz "), Some(98.7e6));
        // Outside the recipe rules' 1–3000 MHz, or not a number: nothing to aim at.
        assert_eq!(typed_frequency("1e9"), None);
        assert_eq!(typed_frequency("0.5"), None);
        assert_eq!(typed_frequency("V40"), None);
        assert_eq!(typed_frequency(""), None);
        assert_eq!(typed_frequency("NaN"), None);
    }
}

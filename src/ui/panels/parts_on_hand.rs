//! The parts on hand and what they make: the builder's drawer typed as lists (formers, wires,
//! fixed capacitors, trimmers, lead length), a search for the recipe's channel
//! ([`crate::tuning::design::search`], the same as `tankwright design`, run on a thread of its
//! own so the window keeps drawing), the ranked table with the reasons, what was ruled out,
//! and a button per candidate that loads it into the recipe (an undo step like any other
//! change).
//!
//! Self-contained: [`PartsOnHandPanel::show`] takes the recipe; the typed lists
//! ([`PartsOnHandText`]) are serde, to be kept with the preferences.

use crate::model::Coating;
use crate::recipe::Recipe;
use crate::recipe::from_design::recipe_of;
use crate::tuning::construction::Construction;
use crate::tuning::design::parts::{
    PartsOnHand, entries, parse_fixed_list, parse_former, parse_trimmer, parse_wire,
};
use crate::tuning::design::{Design, DesignSettings, fixed_label, search};
use crate::tuning::digits::{mhz_range, mm, spread_range};
use crate::tuning::verdict::Aim;
use crate::units::from_mm;
use eframe::egui;
use std::sync::mpsc::{Receiver, TryRecvError, channel};

/// Accessible names of the fields.
pub const FORMERS_LABEL: &str = "Formers (mm, or 1/4in)";
/// See [`FORMERS_LABEL`].
pub const WIRES_LABEL: &str = "Wires (mm, awgN, swgN)";
/// See [`FORMERS_LABEL`].
pub const ENAMEL_LABEL: &str = "Enamelled";
/// See [`FORMERS_LABEL`].
pub const FIXED_LABEL: &str = "Fixed capacitors (pF, or E12:4.7-47)";
/// See [`FORMERS_LABEL`].
pub const TRIMMERS_LABEL: &str = "Trimmers (pF, min-max)";
/// See [`FORMERS_LABEL`].
pub const LEAD_LABEL: &str = "Each lead";
/// The search button.
pub const SEARCH_LABEL: &str = "Find coils for this channel";

/// The parts on hand as typed (kept with the preferences).
#[derive(Clone, Debug, PartialEq, serde::Serialize, serde::Deserialize)]
#[serde(default)]
pub struct PartsOnHandText {
    /// Former diameters.
    pub formers: String,
    /// Wires.
    pub wires: String,
    /// Enamel grade for every wire: 0 bare, 1 or 2.
    pub enamel: u8,
    /// Fixed capacitors.
    pub fixed: String,
    /// Trimmers.
    pub trimmers: String,
    /// Each lead, millimetres.
    pub lead_mm: f64,
}

impl Default for PartsOnHandText {
    /// The Lantern Hill club's drawer (invented demo data): drill shanks of 5–8 mm, three
    /// bare wires, a strip of E12 ceramics and two trimmers.
    fn default() -> Self {
        Self {
            formers: "5, 6, 7, 8".to_owned(),
            wires: "0.8, 1.0, 1.25".to_owned(),
            enamel: 0,
            fixed: "E12:10-47".to_owned(),
            trimmers: "2-10, 4-20".to_owned(),
            lead_mm: 5.0,
        }
    }
}

impl PartsOnHandText {
    /// The parts, read and checked, or the first mistake naming its list.
    pub fn parts(&self, construction: Construction) -> Result<PartsOnHand, String> {
        let coating = match self.enamel {
            1 => Coating::EnamelGrade1,
            2 => Coating::EnamelGrade2,
            _ => Coating::Bare,
        };
        fn read<T>(
            name: &str,
            text: &str,
            f: impl Fn(&str) -> Result<T, String>,
        ) -> Result<Vec<T>, String> {
            entries(text)
                .into_iter()
                .map(|t| f(t).map_err(|e| format!("{name}: {e}")))
                .collect()
        }
        let parts = PartsOnHand {
            formers: read("formers", &self.formers, parse_former)?,
            wires: read("wires", &self.wires, |t| parse_wire(t, coating))?,
            fixed: parse_fixed_list(&self.fixed).map_err(|e| format!("fixed capacitors: {e}"))?,
            trimmers: read("trimmers", &self.trimmers, parse_trimmer)?,
            lead_length: from_mm(self.lead_mm),
            construction,
        };
        parts.check().map_err(|e| e.to_string())?;
        Ok(parts)
    }
}

/// What a finished search was asked, to load its candidates.
struct Asked {
    aim: Aim,
    settings: DesignSettings,
    construction: Construction,
}

/// The panel's state: the typed parts, a search running, the last answer.
#[derive(Default)]
pub struct PartsOnHandPanel {
    /// The parts as typed.
    pub text: PartsOnHandText,
    running: Option<(Receiver<Result<Design, String>>, Asked)>,
    answer: Option<(Result<Design, String>, Asked)>,
    refusal: Option<String>,
}

impl PartsOnHandPanel {
    /// Whether a search is running.
    pub fn is_searching(&self) -> bool {
        self.running.is_some()
    }

    /// The last answer, when there is one.
    pub fn design(&self) -> Option<&Design> {
        self.answer.as_ref().and_then(|(d, _)| d.as_ref().ok())
    }

    /// The panel. A click on a candidate's Load button replaces `recipe` with it.
    pub fn show(&mut self, ui: &mut egui::Ui, recipe: &mut Recipe) {
        self.poll(ui.ctx());
        egui::Grid::new("tankwright parts on hand")
            .num_columns(2)
            .show(ui, |ui| {
                for (label, text) in [
                    (FORMERS_LABEL, &mut self.text.formers),
                    (WIRES_LABEL, &mut self.text.wires),
                    (FIXED_LABEL, &mut self.text.fixed),
                    (TRIMMERS_LABEL, &mut self.text.trimmers),
                ] {
                    let l = ui.label(label);
                    ui.add(
                        egui::TextEdit::singleline(text)
                            .id_salt(("parts_on_hand", label))
                            .desired_width(150.0),
                    )
                    .labelled_by(l.id);
                    ui.end_row();
                }
                let l = ui.label(ENAMEL_LABEL);
                egui::ComboBox::from_id_salt("tankwright parts enamel")
                    .selected_text(match self.text.enamel {
                        1 => "grade 1",
                        2 => "grade 2",
                        _ => "bare",
                    })
                    .show_ui(ui, |ui| {
                        ui.selectable_value(&mut self.text.enamel, 0, "bare");
                        ui.selectable_value(&mut self.text.enamel, 1, "grade 1");
                        ui.selectable_value(&mut self.text.enamel, 2, "grade 2");
                    })
                    .response
                    .labelled_by(l.id);
                ui.end_row();
                let l = ui.label(LEAD_LABEL);
                crate::ui::widgets::steady(ui, LEAD_LABEL, |ui| {
                    ui.add(
                        egui::DragValue::new(&mut self.text.lead_mm)
                            .range(0.0..=50.0)
                            .speed(0.1)
                            .max_decimals(1)
                            .suffix(" mm"),
                    )
                    .labelled_by(l.id)
                });
                ui.end_row();
            });
        let searching = self.running.is_some();
        let clicked = ui
            .add_enabled(!searching, egui::Button::new(SEARCH_LABEL))
            .on_hover_text(format!(
                "For {} MHz, built as '{}'",
                crate::tuning::digits::channel_mhz(recipe.target.channel),
                recipe.stray_estimate.construction.label()
            ))
            .clicked();
        if clicked {
            self.start(recipe, ui.ctx());
        }
        if searching {
            ui.horizontal(|ui| {
                ui.spinner();
                ui.label("Searching the parts…");
            });
        }
        if let Some(r) = &self.refusal {
            ui.colored_label(ui.visuals().warn_fg_color, r);
        }
        let mut load = None;
        if let Some((answer, asked)) = &self.answer {
            match answer {
                Err(e) => {
                    ui.colored_label(ui.visuals().warn_fg_color, e);
                }
                Ok(d) => {
                    if let Some(i) = table(ui, d) {
                        load = d
                            .candidates
                            .get(i)
                            .map(|c| recipe_of(c, &asked.aim, &asked.settings, asked.construction));
                    }
                }
            }
        }
        if let Some(new) = load {
            // The history picks the change up next frame: one undo step brings the old back.
            *recipe = new;
        }
    }

    fn start(&mut self, recipe: &Recipe, ctx: &egui::Context) {
        let construction = recipe.stray_estimate.construction;
        let parts = match self.text.parts(construction) {
            Ok(p) => p,
            Err(e) => {
                self.refusal = Some(e);
                return;
            }
        };
        self.refusal = None;
        let aim = Aim::new(recipe.target.plan.clone(), Some(recipe.target.channel))
            .with_tolerance(recipe.target.tolerance());
        let settings = DesignSettings {
            conditions: crate::model::Conditions {
                inductance_scale: 1.0,
                ..recipe.conditions
            },
            tolerances: recipe.stray_estimate.tolerances,
            ..DesignSettings::default()
        };
        let (tx, rx) = channel();
        let (a, s) = (aim.clone(), settings.clone());
        let ctx = ctx.clone();
        std::thread::spawn(move || {
            let answer = search(&parts, &a, &s).map_err(|e| e.to_string());
            // The window may have closed; then nobody waits for the answer.
            let _ = tx.send(answer);
            ctx.request_repaint();
        });
        self.running = Some((
            rx,
            Asked {
                aim,
                settings,
                construction,
            },
        ));
    }

    fn poll(&mut self, ctx: &egui::Context) {
        let Some((rx, _)) = &self.running else {
            return;
        };
        match rx.try_recv() {
            Ok(answer) => {
                if let Some((_, asked)) = self.running.take() {
                    self.answer = Some((answer, asked));
                }
            }
            Err(TryRecvError::Empty) => {
                ctx.request_repaint_after(std::time::Duration::from_millis(100))
            }
            Err(TryRecvError::Disconnected) => {
                self.running = None;
                self.refusal = Some("the search stopped without an answer".to_owned());
            }
        }
    }
}

/// The ranked table; the index of the candidate whose Load button was clicked.
fn table(ui: &mut egui::Ui, d: &Design) -> Option<usize> {
    let mut clicked = None;
    if d.candidates.is_empty() {
        ui.label("No coil from these parts lands the channel.");
    }
    for (i, c) in d.candidates.iter().enumerate() {
        ui.separator();
        ui.horizontal_wrapped(|ui| {
            if ui
                .button(format!("Load {}", i + 1))
                .on_hover_text("Put this coil and tank into the recipe (undo brings the old back)")
                .clicked()
            {
                clicked = Some(i);
            }
            ui.label(format!(
                "{}. {} turns, {} former, {} long; {}, {} trimmer at {:.0} %",
                i + 1,
                crate::tuning::design::parts::short(c.turns),
                mm(c.former, 2),
                mm(c.length, 1),
                fixed_label(c.fixed),
                c.trimmer.label(),
                100.0 * c.trimmer_setting
            ));
        });
        ui.label(format!(
            "{}; build lands within {}; reach {}; {:.0} kHz/mm; Q {:.0}",
            crate::tuning::design::parts::wire_label(&c.wire),
            spread_range(c.spread.0, c.spread.1),
            mhz_range(c.reach.0, c.reach.1),
            c.khz_per_mm().abs(),
            c.q
        ));
        egui::CollapsingHeader::new("Why")
            .id_salt(("tankwright design why", i))
            .default_open(false)
            .show(ui, |ui| {
                for r in &c.reasons {
                    ui.label(format!("• {r}"));
                }
            });
    }
    if !d.ruled_out.is_empty() {
        egui::CollapsingHeader::new(format!("Ruled out ({})", d.ruled_out.len()))
            .id_salt("tankwright design ruled out")
            .default_open(d.candidates.is_empty())
            .show(ui, |ui| {
                for r in &d.ruled_out {
                    ui.label(format!("• {r}"));
                }
            });
    }
    clicked
}

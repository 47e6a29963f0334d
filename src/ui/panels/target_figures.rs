//! Where the coil stands against its target channel: offset, trimmer reach, channels in
//! reach, and the length or setting that lands on the channel.

use super::Command;
use super::target::show_mhz;
use crate::recipe::Figures;
use crate::recipe::Target;
use crate::ui::theme;
use crate::ui::units::LengthUnit;
use crate::ui::widgets::{Readout, cautions_line};
use crate::units::to_khz;
use eframe::egui;

/// Channels listed in the hover note of "Channels in reach".
const LISTED_IN_NOTE: usize = 60;

/// Where the coil stands against the target, and the buttons that move it there.
pub fn show(
    ui: &mut egui::Ui,
    target: &Target,
    figures: &Figures,
    unit: LengthUnit,
    commands: &mut Vec<Command>,
) {
    let t = &figures.target;
    let on_channel = t.on_channel;
    let colour = if on_channel {
        theme::on_target(ui)
    } else {
        theme::caution(ui)
    };
    let side = if on_channel {
        "on channel"
    } else if t.offset > 0.0 {
        "above"
    } else {
        "below"
    };
    let note = format!(
        "Resonance minus the channel centre, by the {} model; on channel means within ±{:.1} \
         kHz of it (the tolerance set below the channel)",
        if figures.calibrated() {
            "calibrated"
        } else {
            "uncalibrated"
        },
        to_khz(t.tolerance)
    );
    Readout::new(
        "Offset from target",
        format!("{}, {side}", crate::tuning::digits::offset(t.offset)),
        &note,
    )
    .emphasis(true)
    .colour(colour)
    .show(ui);
    if figures.calibrated() {
        let before = figures.uncalibrated.resonance;
        Readout::new(
            "Model before calibration",
            format!(
                "{} ({})",
                crate::tuning::digits::mhz(before),
                crate::tuning::digits::offset(before - t.channel)
            ),
            "What the model predicted before the bench readings calibrated it (on the field \
             solution when it leads); every other figure and the charts use the calibrated \
             model",
        )
        .indent(true)
        .show(ui);
    }
    if figures.tank.is_fixed() {
        // A fixed tank: no travel to list, no channels "in reach" of a trimmer, no setting
        // for the target; the length is the adjustment (below).
        Readout::new(
            "Trimmer",
            "none (a fixed tank)".to_owned(),
            "This tank has no trimmer (or one of no span): its resonance moves only with the \
             coil's length or a change of fixed capacitance",
        )
        .show(ui);
    } else {
        trimmer_readouts(ui, figures, target, commands);
    }

    let per_unit = to_khz(t.stretch_sensitivity * unit.metres_per_unit());
    Readout::new(
        &format!("kHz per {} of stretch", unit.suffix()),
        format!("{per_unit:+.0} kHz/{}", unit.suffix()),
        "How far the resonance moves when the coil is stretched, at the present trimmer setting \
         (central difference of ±1 % of the length)",
    )
    .show(ui);

    match &t.length_for_target {
        Ok(length) => {
            let change = length - figures.coil.length();
            Readout::new(
                "Length for target",
                format!(
                    "{} ({}{})",
                    unit.show(*length),
                    if change >= 0.0 { "+" } else { "−" },
                    unit.show(change.abs())
                ),
                "Coil length (turns × pitch) that lands on the channel at the present trimmer \
                 setting, by bisection between close-wound and four diameters",
            )
            .show(ui);
            if ui
                .button("Stretch to target")
                .on_hover_text("Set the coil length to the length for target")
                .clicked()
            {
                commands.push(Command::SetLength(*length));
            }
        }
        Err(why) => {
            Readout::new(
                "Length for target",
                "out of reach".to_owned(),
                "Coil length that lands on the channel at the present trimmer setting",
            )
            .show(ui);
            cautions_line(ui, &why.to_string());
            ui.add_enabled(false, egui::Button::new("Stretch to target"));
        }
    }
}

/// The trimmer's readouts: what it reaches, the channels in that reach, and the setting for
/// the target (a tank with a trimmer travel).
fn trimmer_readouts(
    ui: &mut egui::Ui,
    figures: &Figures,
    target: &Target,
    commands: &mut Vec<Command>,
) {
    let t = &figures.target;
    Readout::new(
        "Trimmer reaches",
        crate::tuning::digits::mhz_range(t.window.0, t.window.1),
        "Resonance with the trimmer at its maximum and at its minimum, at this spacing",
    )
    .show(ui);
    let reach = match t.in_reach.as_slice() {
        [] => "no channel of this plan".to_owned(),
        [one] => show_mhz(*one),
        [first, .., last] if t.in_reach.len() > 4 => format!(
            "{} channels, {}–{}",
            t.in_reach.len(),
            show_mhz(*first).trim_end_matches(" MHz"),
            show_mhz(*last)
        ),
        list => {
            list.iter()
                .map(|c| show_mhz(*c).trim_end_matches(" MHz").to_owned())
                .collect::<Vec<_>>()
                .join(", ")
                + " MHz"
        }
    };
    Readout::new(
        "Channels in reach",
        reach,
        "Channels of the band plan inside the trimmer's reach",
    )
    .more(|| {
        let mut listed: Vec<String> = t
            .in_reach
            .iter()
            .take(LISTED_IN_NOTE)
            .map(|c| show_mhz(*c).trim_end_matches(" MHz").to_owned())
            .collect();
        if t.in_reach.len() > LISTED_IN_NOTE {
            listed.push("…".to_owned());
        }
        format!("In MHz: {}", listed.join(", "))
    })
    .show(ui);
    let reachable = t.in_reach.contains(&target.channel);
    if !reachable {
        cautions_line(
            ui,
            "the target channel is outside the trimmer's reach at this spacing",
        );
    }

    match &t.setting_for_target {
        Ok(setting) => {
            ui.horizontal(|ui| {
                Readout::new(
                    "Trimmer for target",
                    format!("{:.1} %", setting * 100.0),
                    "Trimmer setting that lands on the channel at the present length",
                )
                .show(ui);
                if ui.button("Trim to target").clicked() {
                    commands.push(Command::SetTrimmer(*setting));
                }
            });
        }
        Err(why) => {
            Readout::new(
                "Trimmer for target",
                "out of reach".to_owned(),
                "Trimmer setting that lands on the channel at the present length",
            )
            .show(ui);
            cautions_line(ui, &why.to_string());
        }
    }
}

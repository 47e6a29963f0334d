//! Short captions in our own plain words, one per idea, each naming the quantity it speaks of
//! and its value at that moment. Every value is read from the figures the bench shows
//! ([`crate::recipe::figures()`] of its derived copy): nothing is recomputed here.
//!
//! Sources: inductance against spacing is Nagaoka's current-sheet coefficient (Nagaoka 1909)
//! and Wheeler's short form of it (Wheeler 1928); the coil's own capacitance is Medhurst's
//! table (Medhurst 1947); the resonance is 1/(2π√(LC)) (Thomson's formula). The hand's
//! 1–2 pF, the shorting of touching turns and "keep well below self-resonance" are common
//! practice.

use crate::model::limits;
use crate::recipe::Figures;
use crate::tuning::digits;
use crate::ui::units::LengthUnit;
use crate::units::{to_nh, to_pf};

/// What a caption speaks of.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Topic {
    /// Why the inductance falls as the turns separate.
    Spacing,
    /// Why the trimmer and the stray capacitance shift the whole curve.
    Capacitance,
    /// What a hand near the coil does.
    Hand,
    /// Why touching turns short the coil.
    Touching,
    /// Why self-resonance sets a ceiling.
    Ceiling,
}

impl Topic {
    /// Every topic, in the order a lesson takes them.
    pub const ALL: [Topic; 5] = [
        Topic::Spacing,
        Topic::Capacitance,
        Topic::Hand,
        Topic::Touching,
        Topic::Ceiling,
    ];

    /// Short name, for the topic buttons.
    pub fn name(self) -> &'static str {
        match self {
            Topic::Spacing => "Spacing",
            Topic::Capacitance => "Trimmer and stray",
            Topic::Hand => "A hand nearby",
            Topic::Touching => "Touching turns",
            Topic::Ceiling => "Self-resonance",
        }
    }
}

/// What is going on at the bench, to pick the caption that fits.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Moment {
    /// The hand is near the coil.
    pub hand_held: bool,
    /// The capacitance the hand adds, farads.
    pub hand: f64,
    /// The resonance without the hand, hertz (the bench's figure before the hand came).
    pub without_hand: Option<f64>,
    /// The trimmer's travel at this coil on the field shape (low, high hertz), when the
    /// field solution leads; `None`: the figures' own window.
    pub travel: Option<(f64, f64)>,
}

/// The caption that fits the moment: the hand while it is held, touching turns at the
/// close-wound end, else spacing.
pub fn follow(shown: &Figures, moment: &Moment) -> Topic {
    let coil = &shown.coil;
    let (lo, hi) = super::sweep::range(coil);
    if moment.hand_held {
        Topic::Hand
    } else if coil.length() - lo <= 0.03 * (hi - lo) {
        Topic::Touching
    } else {
        Topic::Spacing
    }
}

/// The caption for `topic` with the values of `shown`.
pub fn caption(topic: Topic, shown: &Figures, moment: &Moment, unit: LengthUnit) -> String {
    let a = &shown.analysis;
    let f = digits::mhz(a.resonance);
    let text = topic_caption(topic, shown, moment, unit, &f);
    // The sweep can carry the shown carrier into the aeronautical band: say so while it is.
    let (aero_low, aero_high) = crate::tuning::service::AERONAUTICAL;
    if (aero_low..=aero_high).contains(&a.resonance) {
        format!(
            "{text} At {f} the carrier is inside the aeronautical band (108–137 MHz: \
             navigation and air-traffic voice, ITU Radio Regulations Art. 5): a demonstration \
             on the bench only, never on the air."
        )
    } else {
        text
    }
}

fn topic_caption(
    topic: Topic,
    shown: &Figures,
    moment: &Moment,
    unit: LengthUnit,
    f: &str,
) -> String {
    let a = &shown.analysis;
    let coil = &shown.coil;
    match topic {
        Topic::Spacing => format!(
            "As the turns move apart, each turn shares less of its field with its neighbours, \
             so the coil's inductance falls and the frequency rises (Nagaoka's coefficient; \
             Wheeler's formula is its short form). Now: length {}, gap {}, Nagaoka's \
             coefficient {:.3}, inductance {:.1} nH with the leads, frequency {f}.",
            unit.show(coil.length()),
            unit.show(coil.gap()),
            a.nagaoka_coefficient,
            to_nh(a.total_inductance),
        ),
        Topic::Capacitance if shown.tank.is_fixed() => {
            // A fixed tank: no trimmer to name, no travel from a frequency to itself.
            let tank = &shown.tank;
            format!(
                "The fixed capacitor ({:.1} pF) and the stray ({:.1} pF) sit across the coil \
                 beside its own {:.2} pF: {:.2} pF in all, with no trimmer (a fixed tank). The \
                 frequency goes as 1/√(LC), so more capacitance lowers every point of the \
                 curve in the same proportion: the whole curve moves down. At this length the \
                 tank resonates at {}.",
                to_pf(tank.fixed + tank.trimmer_at(tank.trimmer_setting)),
                to_pf(tank.stray),
                to_pf(a.self_capacitance),
                to_pf(a.total_capacitance),
                digits::mhz(shown.target.resonance),
            )
        }
        Topic::Capacitance => {
            let tank = &shown.tank;
            let (low, high) = moment.travel.unwrap_or(shown.target.window);
            format!(
                "The trimmer ({:.1} pF at {:.0} %), the fixed capacitor ({:.1} pF) and the \
                 stray ({:.1} pF) sit across the coil beside its own {:.2} pF: {:.2} pF in all. \
                 The frequency goes as 1/√(LC), so more capacitance lowers every point of the \
                 curve in the same proportion: the whole curve moves down. At this length the \
                 trimmer's travel spans {}.",
                to_pf(tank.trimmer_at(tank.trimmer_setting)),
                tank.trimmer_setting * 100.0,
                to_pf(tank.fixed),
                to_pf(tank.stray),
                to_pf(a.self_capacitance),
                to_pf(a.total_capacitance),
                digits::mhz_range(low, high),
            )
        }
        Topic::Hand => {
            let t = &shown.target;
            let place = if t.on_channel {
                "still on channel"
            } else {
                "off the channel"
            };
            if moment.hand_held {
                let back = moment.without_hand.map_or(String::new(), |f0| {
                    format!(" Let go and it returns to {}.", digits::mhz(f0))
                });
                // The hand's own shift, beside the distance from the channel.
                let shift = moment.without_hand.map_or(String::new(), |f0| {
                    format!(
                        " (the hand's own shift: {})",
                        digits::offset(a.resonance - f0)
                    )
                });
                format!(
                    "A hand near the coil adds about {:.1} pF to the stray (common practice: \
                     1–2 pF): total capacitance {:.2} pF, so the carrier drops to {f}{shift}, \
                     {} from the {} MHz channel: {place}.{back}",
                    to_pf(moment.hand),
                    to_pf(a.total_capacitance),
                    digits::offset(t.offset),
                    digits::channel_mhz(t.channel),
                )
            } else {
                format!(
                    "Hold H (or the button) to bring a hand near: it adds {:.1} pF to the stray \
                     (common practice: 1–2 pF). Now the carrier is at {f}, {} from the {} MHz \
                     channel: {place}. This is why the coil is screened or kept away from \
                     fingers once tuned.",
                    to_pf(moment.hand),
                    digits::offset(t.offset),
                    digits::channel_mhz(t.channel),
                )
            }
        }
        Topic::Touching => {
            let shortest = unit.show(coil.shortest_length());
            if coil.is_bare() {
                format!(
                    "Bare turns that touch short each other: the current takes the short cut, \
                     the shorted turns drop out, the inductance falls sharply and the carrier \
                     jumps or stops (common practice). So bare wire keeps at least {} between \
                     turns here (shortest length {shortest}). Gap now {}.",
                    unit.show(limits::BARE_GAP_MIN),
                    unit.show(coil.gap()),
                )
            } else {
                format!(
                    "Enamelled turns may touch (close-wound, {shortest} here): the enamel keeps \
                     them apart. Scrape or overheat it and the touching turns short each other, \
                     drop out of the coil and the carrier jumps (common practice). Gap now {}, \
                     inductance {:.1} nH.",
                    unit.show(coil.gap()),
                    to_nh(a.total_inductance),
                )
            }
        }
        Topic::Ceiling => {
            let srf = a.self_resonance.lower();
            format!(
                "The coil has capacitance of its own ({:.2} pF by Medhurst's table, {:.2} pF \
                 per cm of diameter). With its inductance it resonates by itself at about {} \
                 (the lower of the two estimates, which are rough). Above that the coil acts as \
                 a capacitor, so no tank built on it reaches there; the carrier at {f} is at {:.0} \
                 % of it. Stay well below (common practice).",
                to_pf(a.self_capacitance),
                a.medhurst_factor,
                digits::self_resonance(srf),
                100.0 * a.resonance / srf,
            )
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::recipe::{Recipe, figures};

    #[test]
    fn every_caption_names_its_figure_as_the_window_shows_it() {
        let shown = figures(&Recipe::demo()).expect("valid demo");
        let moment = Moment {
            hand_held: false,
            hand: 1e-12,
            without_hand: None,
            travel: None,
        };
        let unit = LengthUnit::Millimetres;
        let spacing = caption(Topic::Spacing, &shown, &moment, unit);
        assert!(spacing.contains(&format!("{:.1} nH", to_nh(shown.analysis.total_inductance))));
        assert!(spacing.contains(&digits::mhz(shown.analysis.resonance)));
        let ceiling = caption(Topic::Ceiling, &shown, &moment, unit);
        assert!(ceiling.contains(&digits::self_resonance(
            shown.analysis.self_resonance.lower()
        )));
        let c = caption(Topic::Capacitance, &shown, &moment, unit);
        assert!(c.contains(&format!(
            "{:.2} pF in all",
            to_pf(shown.analysis.total_capacitance)
        )));
        for topic in Topic::ALL {
            let text = caption(topic, &shown, &moment, unit);
            assert!(!text.contains("NaN") && !text.contains("inf"), "{text}");
        }
    }

    /// Issue 21: a carrier swept into 108–137 MHz (ITU RR Art. 5) is said to be there, and
    /// the held hand's caption gives the hand's own shift beside the channel's distance.
    #[test]
    fn the_aeronautical_band_and_the_hands_own_shift_are_said() {
        let unit = LengthUnit::Millimetres;
        let demo = figures(&Recipe::demo()).expect("valid demo");
        let at_rest = Moment {
            hand_held: false,
            hand: 1e-12,
            without_hand: None,
            travel: None,
        };
        assert!(demo.analysis.resonance < 108e6);
        let text = caption(Topic::Spacing, &demo, &at_rest, unit);
        assert!(!text.contains("aeronautical"), "{text}");
        // The demo with less capacitance: its carrier above 108 MHz.
        let mut high = Recipe::demo();
        high.tank.fixed = 1e-12;
        let shown = figures(&high).expect("valid");
        assert!((108e6..=137e6).contains(&shown.analysis.resonance));
        for topic in Topic::ALL {
            let text = caption(topic, &shown, &at_rest, unit);
            assert!(text.contains("inside the aeronautical band"), "{text}");
        }
        // The hand held: 3.07 MHz below where it was, say.
        let held = Moment {
            hand_held: true,
            hand: 1e-12,
            without_hand: Some(demo.analysis.resonance + 3.07e6),
            travel: None,
        };
        let text = caption(Topic::Hand, &demo, &held, unit);
        assert!(text.contains("the hand's own shift: -3.070 MHz"), "{text}");
    }
}

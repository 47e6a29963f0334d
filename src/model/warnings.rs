//! Cautions attached to an [`Analysis`]: figures outside a model's range.

use super::analysis::{Inductances, SelfResonance, Warning, WarningTopic};
use super::coil::Coil;
use crate::physics::{medhurst, wheeler};

/// Operating frequency above this fraction of self-resonance raises the apparent inductance by
/// more than about 6 % ((f/f_self)²): worth a warning (common practice).
const SELF_RESONANCE_MARGIN: f64 = 0.25;
/// Rosa's corrections come from straight-conductor geometric mean distances; beyond a pitch of
/// half the diameter the neglected curvature terms (order (p/D)²) exceed about 3 %.
const ROSA_MAX_PITCH_OVER_DIAMETER: f64 = 0.5;
/// Leads carrying more than this fraction of the total inductance are worth a warning.
const LEADS_FRACTION: f64 = 0.2;
/// Below this r/δ the high-frequency proximity model overstates the loss.
const MIN_RADIUS_OVER_SKIN_DEPTH: f64 = 3.0;
/// The aeronautical band a tank must not reach, hertz: 108–117.975 MHz aeronautical
/// radionavigation (VOR, ILS localizer) and 117.975–137 MHz aeronautical mobile (R), air
/// traffic voice (ITU Radio Regulations, Article 5). The one home of these figures: the
/// verdict reads them as `tuning::service::AERONAUTICAL`.
pub const AERONAUTICAL_BAND: (f64, f64) = (108e6, 137e6);
use crate::units::{to_mhz, to_mm, to_um};
use AERONAUTICAL_BAND as AERONAUTICAL;

fn push(out: &mut Vec<Warning>, topic: WarningTopic, message: String) {
    out.push(Warning { topic, message });
}

/// The figures the warnings judge, gathered before they go into an
/// [`Analysis`](super::Analysis) (so that the analysis can be built in its final place).
pub(super) struct Judged<'a> {
    pub coil: &'a Coil,
    pub inductance: &'a Inductances,
    pub self_resonance: &'a SelfResonance,
    pub resonance: f64,
    pub total_inductance: f64,
    pub external_capacitance: f64,
    pub skin_depth: f64,
}

/// All warnings for an evaluation's figures.
pub(super) fn collect(a: &Judged<'_>) -> Vec<Warning> {
    let mut out = Vec::new();
    let g = a.coil;
    if !wheeler::in_range(g.mean_diameter(), g.length()) {
        let err = (a.inductance.wheeler_1928 / a.inductance.current_sheet - 1.0) * 100.0;
        push(
            &mut out,
            WarningTopic::Inductance,
            format!(
                "Wheeler 1928 is outside its range (length {:.2} mm < 0.8 × radius); it differs \
                 from the exact current sheet by {err:+.1} %",
                to_mm(g.length())
            ),
        );
    }
    if g.pitch() > ROSA_MAX_PITCH_OVER_DIAMETER * g.mean_diameter() {
        push(
            &mut out,
            WarningTopic::Inductance,
            format!(
                "pitch {:.2} mm exceeds half the diameter: Rosa's round-wire correction assumes \
                 a pitch small against the diameter; trust the filament sum here",
                to_mm(g.pitch())
            ),
        );
    }
    if !medhurst::in_table(g.length_over_diameter()) {
        push(
            &mut out,
            WarningTopic::SelfCapacitance,
            format!(
                "l/D = {:.3} is outside Medhurst's table (0.1–50): self-capacitance extrapolated",
                g.length_over_diameter()
            ),
        );
    }
    let lower = a.self_resonance.lower();
    if a.resonance > SELF_RESONANCE_MARGIN * lower {
        let ratio = a.resonance / lower;
        push(
            &mut out,
            WarningTopic::SelfResonance,
            format!(
                "resonance is {:.0} % of the lower self-resonance estimate ({:.0} MHz): the \
                 coil no longer behaves as a plain inductance",
                ratio * 100.0,
                to_mhz(lower)
            ),
        );
    }
    if g.turns() < 5.0 {
        push(
            &mut out,
            WarningTopic::SelfResonance,
            "fewer than 5 turns: both self-resonance estimates are rough (the helical-line model \
             assumes a long helix; leads and mounting dominate)"
                .to_owned(),
        );
    }
    if 0.5 * g.wire_bare() < MIN_RADIUS_OVER_SKIN_DEPTH * a.skin_depth {
        push(
            &mut out,
            WarningTopic::Loss,
            format!(
                "skin depth {:.1} µm is not small against the wire radius: the proximity factor \
                 (a high-frequency model) overstates the loss",
                to_um(a.skin_depth)
            ),
        );
    }
    if g.length_over_diameter() < 1.0 {
        push(
            &mut out,
            WarningTopic::Loss,
            "short coil (l/D < 1): the end turns add proximity loss that the infinite-wall model \
             leaves out, so Q is likely optimistic"
                .to_owned(),
        );
    }
    if a.inductance.leads > LEADS_FRACTION * a.total_inductance {
        push(
            &mut out,
            WarningTopic::Leads,
            format!(
                "the leads carry {:.0} % of the inductance: their routing will move the frequency",
                a.inductance.leads / a.total_inductance * 100.0
            ),
        );
    }
    if a.external_capacitance <= 0.0 {
        push(
            &mut out,
            WarningTopic::Tank,
            "no external capacitance: the coil resonates with its own self-capacitance only"
                .to_owned(),
        );
    }
    if (AERONAUTICAL.0..=AERONAUTICAL.1).contains(&a.resonance) {
        push(
            &mut out,
            WarningTopic::Band,
            format!(
                "{:.2} MHz is in the aeronautical band (108–137 MHz): do not radiate there",
                to_mhz(a.resonance)
            ),
        );
    }
    out
}

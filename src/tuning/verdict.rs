//! The verdict a builder acts on: on channel or by how much, inside the band over the whole
//! trimmer travel, clear of the aeronautical band, where the harmonics land, and whether the
//! coil can be built.
//!
//! Pure: the window and the headless commands call [`judge`] and show what it returns.

use super::bands::BandPlan;
use super::buildable::gap_flags;
use super::digits::{channel_mhz, mhz, mhz_range, offset};
use super::service::{
    AERONAUTICAL, AERONAUTICAL_EMERGENCY, BROADCAST_IF, Band, Service, allocations_touched,
    protected_touched,
};
use super::solve::trimmer_window;
use crate::model::{Coil, Conditions, Tank, evaluate::resonance_of};
use crate::units::{to_mm, to_pf};

/// What a flag is about.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum FlagKind {
    /// Some frequency the trimmer reaches lies in 108–137 MHz.
    Aeronautical,
    /// The trimmer reaches within the drift margin of the band's edge.
    BandEdge,
    /// The trimmer reaches outside the chosen band.
    OutsideBand,
    /// Bare turns touch: the coil cannot work as drawn.
    BareTurns,
    /// Bare turns closer than the minimum gap.
    NarrowGap,
    /// A 2nd or 3rd harmonic of a reachable frequency lies in 108–137 MHz.
    HarmonicAeronautical,
    /// The trimmer's travel, or its 2nd or 3rd harmonic, crosses an internationally protected
    /// distress or safety frequency ([`crate::tuning::service::PROTECTED`]).
    ProtectedFrequency,
}

impl FlagKind {
    /// The machine name, as in the JSON: "aeronautical", "band_edge", "outside_band",
    /// "bare_turns", "narrow_gap", "harmonic_aeronautical", "protected_frequency".
    pub fn key(self) -> &'static str {
        match self {
            FlagKind::Aeronautical => "aeronautical",
            FlagKind::BandEdge => "band_edge",
            FlagKind::OutsideBand => "outside_band",
            FlagKind::BareTurns => "bare_turns",
            FlagKind::NarrowGap => "narrow_gap",
            FlagKind::HarmonicAeronautical => "harmonic_aeronautical",
            FlagKind::ProtectedFrequency => "protected_frequency",
        }
    }

    /// Whether the flag is about safety or the law (as against buildability).
    pub fn is_safety(self) -> bool {
        matches!(
            self,
            FlagKind::Aeronautical
                | FlagKind::OutsideBand
                | FlagKind::BandEdge
                | FlagKind::HarmonicAeronautical
                | FlagKind::ProtectedFrequency
        )
    }

    /// Whether the flag is about the safety of others (aircraft, ships, distress beacons),
    /// as against merely leaving the chosen band.
    pub fn endangers(self) -> bool {
        matches!(
            self,
            FlagKind::Aeronautical | FlagKind::HarmonicAeronautical | FlagKind::ProtectedFrequency
        )
    }
}

/// One thing the builder must know before going on, in words with numbers.
#[derive(Clone, Debug, PartialEq)]
pub struct Flag {
    /// What it is about.
    pub kind: FlagKind,
    /// In words, with the numbers and what to do.
    pub text: String,
}

impl Flag {
    /// A flag of `kind` saying `text`.
    pub fn new(kind: FlagKind, text: String) -> Self {
        Self { kind, text }
    }
}

/// What the tank is aimed at and the builder's settings for judging it.
#[derive(Clone, Debug, PartialEq)]
pub struct Aim {
    /// The plan the target was picked from (its band is the one the tank must stay in).
    pub plan: BandPlan,
    /// The target frequency, hertz: a channel of the plan or any typed frequency.
    pub target: Option<f64>,
    /// "On channel" means |resonance − target| ≤ this, hertz. Set by the user; the default
    /// is the plan's service practice ([`BandPlan::default_tolerance`]).
    pub tolerance: f64,
    /// Drift margin at the band's edges, hertz ([`BandPlan::default_edge_margin`]).
    pub edge_margin: f64,
}

impl Aim {
    /// An aim with the plan's default tolerance and edge margin.
    pub fn new(plan: BandPlan, target: Option<f64>) -> Self {
        Self {
            tolerance: plan.default_tolerance(),
            edge_margin: plan.default_edge_margin(),
            plan,
            target,
        }
    }

    /// An aim at a typed frequency with no plan: the band is that of the service whose band
    /// holds it (FM broadcast, Japan FM, 2 m), if any.
    pub fn typed(target: f64) -> Self {
        Self::new(BandPlan::Custom(vec![target]), Some(target))
    }

    /// The same aim with the user's tolerance, hertz (negative or non-finite: the default).
    pub fn with_tolerance(mut self, tolerance: f64) -> Self {
        if tolerance.is_finite() && tolerance >= 0.0 {
            self.tolerance = tolerance;
        }
        self
    }

    /// The same aim with the user's edge margin, hertz (negative or non-finite: the
    /// default).
    pub fn with_edge_margin(mut self, margin: f64) -> Self {
        if margin.is_finite() && margin >= 0.0 {
            self.edge_margin = margin;
        }
        self
    }
}

/// The frequencies the trimmer reaches at the present spacing, hertz.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Reach {
    /// Trimmer at its maximum.
    pub low: f64,
    /// Trimmer at its minimum.
    pub high: f64,
}

impl Reach {
    /// Whether the tank has no travel at all (a fixed tank: no trimmer, or one of no span),
    /// so the reach is the one resonance. [`judge`] takes both ends from the same formula,
    /// so a trimmer of no span gives exactly equal ends.
    pub fn is_fixed(&self) -> bool {
        self.high <= self.low
    }

    /// What the texts name: "the trimmer's travel (92.600–102.200 MHz)", or "the fixed tank
    /// (94.850 MHz)" when there is no travel (never a range from a frequency to itself).
    pub fn named(&self) -> String {
        if self.is_fixed() {
            format!("the fixed tank ({})", mhz(self.low))
        } else {
            format!("the trimmer's travel ({})", mhz_range(self.low, self.high))
        }
    }

    /// The reach as a frequency or a range: "94.850 MHz" or "92.600–102.200 MHz".
    pub fn text(&self) -> String {
        if self.is_fixed() {
            mhz(self.low)
        } else {
            mhz_range(self.low, self.high)
        }
    }

    /// The `n`th harmonic of the reach, named as [`named`](Self::named) names the reach:
    /// "the 2nd harmonic of the trimmer's travel (185.2–204.4 MHz)" or "the 2nd harmonic of
    /// the fixed tank (189.700 MHz)".
    fn harmonic_named(&self, n: u32) -> String {
        let order = if n == 2 { "2nd" } else { "3rd" };
        let k = f64::from(n);
        let h = Reach {
            low: k * self.low,
            high: k * self.high,
        };
        if self.is_fixed() {
            format!("the {order} harmonic of the fixed tank ({})", h.text())
        } else {
            format!(
                "the {order} harmonic of the trimmer's travel ({})",
                h.text()
            )
        }
    }
}

/// A harmonic and what it falls in over the whole trimmer travel.
#[derive(Clone, Debug, PartialEq)]
pub struct Harmonic {
    /// 2 or 3.
    pub order: u32,
    /// At the present resonance, hertz.
    pub frequency: f64,
    /// Over the trimmer's travel, hertz.
    pub low: f64,
    /// Over the trimmer's travel, hertz.
    pub high: f64,
    /// The allocations it touches (ITU Radio Regulations Art. 5, common practice where
    /// marked).
    pub falls_in: Vec<&'static str>,
}

/// Where a broadcast receiver hears the oscillator again, by its image.
#[derive(Clone, Debug, PartialEq)]
pub struct ReceiverImage {
    /// Dial setting at which a receiver with its local oscillator above the signal hears
    /// the oscillator as an image: f − 2 × 10.7 MHz, hertz.
    pub dial_oscillator_above: f64,
    /// The same for a local oscillator below the signal: f + 2 × 10.7 MHz, hertz.
    pub dial_oscillator_below: f64,
    /// In words.
    pub text: String,
}

/// The verdict on a coil in its tank against an aim.
#[derive(Clone, Debug, PartialEq)]
pub struct Verdict {
    /// The present resonance, hertz.
    pub resonance: f64,
    /// What the trimmer reaches at the present spacing.
    pub reach: Reach,
    /// The target, hertz, if there is one.
    pub target: Option<f64>,
    /// Resonance minus target, hertz.
    pub offset: Option<f64>,
    /// The tolerance judged against, hertz.
    pub tolerance: f64,
    /// |offset| ≤ tolerance; `None` without a target.
    pub on_channel: Option<bool>,
    /// The band the tank must stay in, if known.
    pub band: Option<Band>,
    /// 2nd and 3rd harmonics.
    pub harmonics: Vec<Harmonic>,
    /// The receiver image, for a broadcast band.
    pub image: Option<ReceiverImage>,
    /// Safety and buildability flags, most serious first.
    pub flags: Vec<Flag>,
    /// The one instruction that lands the target, when the caller has it (see
    /// [`Verdict::with_advice`]): the channel's next step then says exactly what to do.
    pub advice: Option<crate::tuning::advice::Advice>,
    /// When the travel leaves the band (or comes within the margin, or reaches a protected
    /// frequency): which fixed capacitor, or which trimmer, keeps the whole travel inside
    /// the band with the margin, at the present coil ([`remedy`]).
    pub remedy: Option<String>,
}

impl Verdict {
    /// No flag about safety or the law.
    pub fn is_safe(&self) -> bool {
        !self.flags.iter().any(|f| f.kind.is_safety())
    }

    /// No bare turns touching or too close.
    pub fn is_buildable(&self) -> bool {
        !self
            .flags
            .iter()
            .any(|f| matches!(f.kind, FlagKind::BareTurns | FlagKind::NarrowGap))
    }

    /// Whether a flag of `kind` is raised.
    pub fn has(&self, kind: FlagKind) -> bool {
        self.flags.iter().any(|f| f.kind == kind)
    }

    /// The channel line: "On channel: +3.2 kHz from 98.7 MHz (within ±15.0 kHz)" or
    /// "Off channel: -9.336 MHz from 98.7 MHz (tolerance ±15.0 kHz): …", or the resonance
    /// alone without a target.
    pub fn channel_text(&self) -> String {
        let tol = offset(self.tolerance);
        let tol = tol.trim_start_matches('+');
        match (self.target, self.offset, self.on_channel) {
            (Some(t), Some(o), Some(true)) => {
                format!(
                    "On channel: {} from {} MHz (within ±{tol})",
                    offset(o),
                    channel_mhz(t)
                )
            }
            (Some(t), Some(o), _) => format!(
                "Off channel: {} from {} MHz (tolerance ±{tol}): {}",
                offset(o),
                channel_mhz(t),
                if o > 0.0 {
                    "lower it (squeeze the turns or add capacitance)"
                } else {
                    "raise it (stretch the turns or take capacitance away)"
                }
            ),
            _ => format!("Resonance {} (no target set)", mhz(self.resonance)),
        }
    }

    /// The same verdict with the instruction that lands the target (from
    /// [`crate::tuning::advice::advise`] on the same coil, tank and conditions), so the
    /// channel's next step is that instruction rather than a direction.
    pub fn with_advice(mut self, advice: crate::tuning::advice::Advice) -> Self {
        self.advice = Some(advice);
        self
    }

    /// What to do next, lengths in millimetres (see [`next_step_in`](Self::next_step_in)).
    pub fn next_step(&self) -> String {
        self.next_step_in(|m| format!("{:.2} mm", to_mm(m)))
    }

    /// What to do next, the most pressing first: touching bare turns, the aeronautical band,
    /// leaving the band, a narrow gap, the band's edge, then the channel: off channel, the
    /// advice when there is one (lengths shown by `show`), else the direction to move.
    pub fn next_step_in(&self, show: impl Fn(f64) -> String) -> String {
        let band = self.band.map_or("band", |b| b.name);
        if self.has(FlagKind::BareTurns) {
            return "Space the bare turns apart before anything else: touching turns short each \
                    other"
                .to_owned();
        }
        let remedy = self
            .remedy
            .as_ref()
            .map(|r| format!(": {r}"))
            .unwrap_or_default();
        let fixed = self.reach.is_fixed();
        if self.has(FlagKind::Aeronautical) {
            return if fixed {
                format!(
                    "Keep this tank off the air: change the fixed capacitance or the coil so the \
                     fixed tank ({}) moves out of 108–137 MHz{remedy}",
                    mhz(self.reach.low)
                )
            } else {
                format!(
                    "Keep this tank off the air: change the fixed capacitance or fit a smaller \
                     trimmer so its whole travel stays out of 108–137 MHz{remedy}"
                )
            };
        }
        let reached = protected_touched(self.reach.low, self.reach.high);
        if let Some(p) = reached.first() {
            return if fixed {
                format!(
                    "Keep this tank off the air: the fixed tank ({}) sits on {}, {}; change the \
                     fixed capacitance or the coil so it moves clear{remedy}",
                    mhz(self.reach.low),
                    p.frequency,
                    p.use_
                )
            } else {
                format!(
                    "Keep this tank off the air: its travel crosses {}, {}; change the fixed \
                     capacitance or fit a smaller trimmer so the whole travel stays \
                     clear{remedy}",
                    p.frequency, p.use_
                )
            };
        }
        if self.has(FlagKind::OutsideBand) {
            return if fixed {
                format!(
                    "Move the fixed tank ({}) into the {band}: change the fixed capacitance or the \
                     coil's length{remedy}",
                    mhz(self.reach.low)
                )
            } else {
                format!(
                    "Narrow or re-centre the trimmer's travel (fixed capacitance, trimmer size) so \
                     it stays inside the {band}{remedy}"
                )
            };
        }
        if self.has(FlagKind::NarrowGap) {
            return "Open the gap between the bare turns to the minimum or more".to_owned();
        }
        if self.has(FlagKind::BandEdge) {
            return format!(
                "Move {} away from the edge of the {band}: a warming oscillator \
                 drifts{remedy}",
                if fixed {
                    "the fixed tank"
                } else {
                    "the trimmer's travel"
                }
            );
        }
        if self.on_channel == Some(false)
            && let Some(advice) = &self.advice
        {
            let text = advice.text(show);
            let mut chars = text.chars();
            return chars
                .next()
                .map(|c| c.to_uppercase().chain(chars).collect())
                .unwrap_or(text);
        }
        match (self.on_channel, self.offset) {
            (Some(true), _) => {
                "On channel: fix the turns in place (wax or glue) and log a bench reading"
                    .to_owned()
            }
            (Some(false), Some(o)) if o > 0.0 && fixed => {
                "Lower the frequency: squeeze the turns together (a fixed tank has no trimmer)"
                    .to_owned()
            }
            (Some(false), _) if fixed => {
                "Raise the frequency: stretch the turns apart (a fixed tank has no trimmer)"
                    .to_owned()
            }
            (Some(false), Some(o)) if o > 0.0 => {
                "Lower the frequency: squeeze the turns together or turn the trimmer up".to_owned()
            }
            (Some(false), _) => {
                "Raise the frequency: stretch the turns apart or turn the trimmer down".to_owned()
            }
            (None, _) => "Pick a target channel or type a frequency".to_owned(),
        }
    }

    /// The safety line: "In band over the trimmer's travel: …" (or "In band: the fixed
    /// tank (…) …" when there is no trimmer) or how many flags.
    pub fn safety_text(&self) -> String {
        let reach = self.reach.text();
        let named = self.reach.named();
        let fixed = self.reach.is_fixed();
        if self.is_safe() {
            match (self.band, fixed) {
                (Some(b), false) => format!(
                    "In band over the trimmer's travel: {reach} inside the {}",
                    b.name
                ),
                (Some(b), true) => format!("In band: {named} is inside the {}", b.name),
                (None, false) => {
                    format!("Clear of the aeronautical band over the trimmer's travel: {reach}")
                }
                (None, true) => format!("Clear of the aeronautical band: {named}"),
            }
        } else {
            let n = self.flags.iter().filter(|f| f.kind.is_safety()).count();
            let cautions = format!("{n} caution{}", if n == 1 { "" } else { "s" });
            let band = self.band.map_or("band", |b| b.name);
            let leaves = if fixed { "lies outside" } else { "leaves" };
            if self.flags.iter().any(|f| f.kind.endangers()) {
                format!("Not safe: {named} raises {cautions}")
            } else if self.has(FlagKind::OutsideBand) {
                format!("Outside the band: {named} {leaves} the {band}")
            } else {
                format!(
                    "Near the band's edge: {named} comes close to the edge of the {band} \
                     ({cautions})"
                )
            }
        }
    }
}

/// Whether an offset is on channel: |offset| ≤ tolerance (hertz). The tolerance is the
/// user's (default from the service's practice), never the channel spacing.
pub fn on_channel(offset: f64, tolerance: f64) -> bool {
    offset.abs() <= tolerance
}

/// The verdict on `coil` in `tank` against `aim`: the present resonance, the trimmer's
/// whole travel at the present spacing ([`trimmer_window`]), band and aeronautical flags
/// over that travel ([`band_flags`]), harmonics ([`harmonics`]), the receiver image for a
/// broadcast band ([`receiver_image`]) and the gap flags
/// ([`gap_flags`]).
pub fn judge(coil: &Coil, tank: &Tank, conditions: &Conditions, aim: &Aim) -> Verdict {
    let resonance = resonance_of(coil, tank.external_capacitance(), conditions);
    let (low, high) = trimmer_window(coil, tank, conditions);
    // The present point is inside the window; min/max guard a trimmer given backwards.
    let reach = Reach {
        low: low.min(high).min(resonance),
        high: high.max(low).max(resonance),
    };
    let band = aim.plan.band();
    let mut flags = band_flags(reach, band, aim.edge_margin);
    let remedy = band
        .filter(|_| {
            flags.iter().any(|f| {
                matches!(
                    f.kind,
                    FlagKind::Aeronautical | FlagKind::OutsideBand | FlagKind::BandEdge
                )
            }) || !protected_touched(reach.low, reach.high).is_empty()
        })
        .map(|b| remedy(coil, tank, conditions, &b, aim.edge_margin));
    flags.extend(gap_flags(coil));
    let offset = aim.target.map(|t| resonance - t);
    Verdict {
        resonance,
        reach,
        target: aim.target,
        offset,
        tolerance: aim.tolerance,
        on_channel: offset.map(|o| on_channel(o, aim.tolerance)),
        band,
        harmonics: harmonics(resonance, reach),
        image: band
            .filter(|b| b.service == Service::FmBroadcast)
            .map(|b| receiver_image(resonance, &b)),
        flags,
        advice: None,
        remedy,
    }
}

/// Standard capacitor values, pF (IEC 60063 E12 series, 1–82 pF): what a remedy names.
const E12_PF: [f64; 24] = [
    1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2, 10.0, 12.0, 15.0, 18.0, 22.0, 27.0,
    33.0, 39.0, 47.0, 56.0, 68.0, 82.0,
];

/// The external capacitance (farads) that puts `coil` at `frequency` (hertz): the model's
/// resonance inverted by bisection (it falls as the capacitance grows).
fn capacitance_for(coil: &Coil, conditions: &Conditions, frequency: f64) -> f64 {
    crate::physics::roots::bisect(0.0, 2e-9, 80, |c| {
        let f = resonance_of(coil, c, conditions);
        f <= frequency || f.is_nan()
    })
}

/// Which fixed capacitor, or which trimmer, keeps the whole trimmer travel inside `band`
/// less `margin` at each edge, for `coil` as it is: the external capacitance must lie
/// between that of the upper limit (trimmer at its minimum) and that of the lower limit
/// (trimmer at its maximum). With this trimmer, the range of fixed capacitance that does so
/// and a standard (E12) value in it; when the trimmer's own travel is wider than the band
/// allows, the largest trimmer travel that fits and the fixed capacitance to go with it.
pub fn remedy(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    band: &Band,
    margin: f64,
) -> String {
    let (f_low, f_high) = (band.low + margin, band.high - margin);
    if f_high <= f_low {
        return format!("the {} is narrower than twice the edge margin", band.name);
    }
    let need_min = capacitance_for(coil, conditions, f_high);
    let need_max = capacitance_for(coil, conditions, f_low);
    let trimmer_min = tank.trimmer_at(0.0);
    let trimmer_max = tank.trimmer_at(1.0);
    // Everything across the coil but the fixed capacitor and the trimmer (stray, divider).
    let others = tank.external_capacitance_at(0.0) - trimmer_min - tank.fixed;
    let pf = |c: f64| to_pf(c);
    let room = need_max - need_min;
    let span = trimmer_max - trimmer_min;
    if span <= room {
        let lo = need_min - others - trimmer_min;
        let hi = need_max - others - trimmer_max;
        if hi <= 0.0 {
            return format!(
                "even with no fixed capacitor this trimmer takes the tank below {}: the coil \
                 needs fewer turns or more length",
                mhz(f_low)
            );
        }
        let lo = lo.max(0.0);
        let standard = E12_PF
            .iter()
            .copied()
            .filter(|v| (pf(lo)..=pf(hi)).contains(v))
            .min_by(|a, b| {
                (a - pf(0.5 * (lo + hi)))
                    .abs()
                    .total_cmp(&(b - pf(0.5 * (lo + hi))).abs())
            });
        let standard = standard
            .map(|v| format!(" ({v} pF is a standard value)"))
            .unwrap_or_default();
        format!(
            "a fixed capacitor of {:.1}–{:.1} pF{standard} with this trimmer keeps the whole \
             travel inside {}",
            pf(lo),
            pf(hi),
            mhz_range(f_low, f_high)
        )
    } else {
        // The widest trimmer that fits, from the present trimmer's minimum, and the fixed
        // capacitance that centres it.
        let fixed = need_min - others - trimmer_min;
        if fixed < 0.0 {
            return format!(
                "this trimmer's minimum alone takes the tank below {}: the coil needs fewer \
                 turns or more length",
                mhz(f_high)
            );
        }
        format!(
            "this trimmer's {:.1} pF travel is wider than the band allows; a trimmer of at most \
             {:.1} pF travel ({:.1}–{:.1} pF) with a fixed capacitor of {:.1} pF keeps the \
             whole travel inside {}",
            pf(span),
            pf(room),
            pf(trimmer_min),
            pf(trimmer_min + room),
            pf(fixed),
            mhz_range(f_low, f_high)
        )
    }
}

/// The band flags for a trimmer reach, most serious first:
/// - [`FlagKind::Aeronautical`] when any of [low, high] lies in 108–137 MHz (edges
///   included; ITU Radio Regulations Art. 5);
/// - per band edge, [`FlagKind::OutsideBand`] when the reach passes the edge, else
///   [`FlagKind::BandEdge`] when it comes closer than `edge_margin` (strictly);
/// - [`FlagKind::ProtectedFrequency`] when the reach, or its 2nd or 3rd harmonic, crosses a
///   protected distress and safety frequency ([`crate::tuning::service::PROTECTED`]): one
///   flag for the travel and one per harmonic, naming each frequency with its source;
/// - [`FlagKind::HarmonicAeronautical`] when a 2nd or 3rd harmonic of the reach lies in
///   108–137 MHz.
///
/// A reach wholly above or below the band raises one [`FlagKind::OutsideBand`] saying so.
pub fn band_flags(reach: Reach, band: Option<Band>, edge_margin: f64) -> Vec<Flag> {
    let mut flags = Vec::new();
    let (aero_low, aero_high) = AERONAUTICAL;
    // "the trimmer's travel (X–Y MHz)" or "the fixed tank (X MHz)" (no trimmer: no travel,
    // and never a range from a frequency to itself).
    let named = reach.named();
    let fixed = reach.is_fixed();
    if reach.high >= aero_low && reach.low <= aero_high {
        let (a, b) = (reach.low.max(aero_low), reach.high.min(aero_high));
        let emergency = if (a..=b).contains(&AERONAUTICAL_EMERGENCY) {
            ", including 121.5 MHz, the aeronautical emergency frequency"
        } else {
            ""
        };
        let (what, cure) = if fixed {
            (
                format!("{named} is in the aeronautical band"),
                "change the fixed capacitance or the coil so the tank moves clear",
            )
        } else {
            (
                format!(
                    "the trimmer's travel reaches {}: {} is in the aeronautical band",
                    reach.text(),
                    mhz_range(a, b)
                ),
                "narrow the trimmer or change the fixed capacitance so the whole travel stays \
                 clear",
            )
        };
        flags.push(Flag::new(
            FlagKind::Aeronautical,
            format!(
                "{what} (108–137 MHz: navigation and air-traffic voice, ITU Radio Regulations \
                 Art. 5){emergency}. Do not let this tank radiate there: {cure}, and follow \
                 your local rules"
            ),
        ));
    }
    if let Some(band) = band {
        let wholly_above = reach.low > band.high;
        let wholly_below = reach.high < band.low;
        if wholly_above || wholly_below {
            let side = if wholly_above { "above" } else { "below" };
            let text = if fixed {
                format!(
                    "{named} lies {side} the {}: with no trimmer, only the fixed capacitance \
                     or the coil moves it into the band",
                    band.name
                )
            } else {
                format!(
                    "the trimmer's whole travel ({}) lies {side} the {}: no setting of the \
                     trimmer puts the tank inside the band",
                    reach.text(),
                    band.name
                )
            };
            flags.push(Flag::new(FlagKind::OutsideBand, text));
        }
        let edge = |flags: &mut Vec<Flag>, beyond: bool, near: bool, side: &str, at: f64| {
            if wholly_above || wholly_below {
            } else if beyond {
                // Only a travel can pass an edge: a fixed tank wholly outside is said above.
                flags.push(Flag::new(
                    FlagKind::OutsideBand,
                    format!(
                        "{named} passes the {side} edge of the {} at {}: one turn of the \
                         trimmer puts the tank outside the band",
                        band.name,
                        mhz(at)
                    ),
                ));
            } else if near {
                flags.push(Flag::new(
                    FlagKind::BandEdge,
                    format!(
                        "{named} comes within {} of the {side} edge of the {} at {}: a \
                         free-running oscillator drifts that far as it warms (common practice)",
                        offset(edge_margin).trim_start_matches('+'),
                        band.name,
                        mhz(at)
                    ),
                ));
            }
        };
        edge(
            &mut flags,
            reach.low < band.low,
            reach.low < band.low + edge_margin,
            "lower",
            band.low,
        );
        edge(
            &mut flags,
            reach.high > band.high,
            reach.high > band.high - edge_margin,
            "upper",
            band.high,
        );
    }
    // One flag for the travel and one for each harmonic, naming every protected frequency
    // crossed with its use and source.
    let protected = |low: f64, high: f64| {
        protected_touched(low, high)
            .iter()
            .map(|p| format!("{}, {} [{}]", p.frequency, p.use_, p.source))
            .collect::<Vec<_>>()
    };
    let (verb, move_it) = if fixed {
        (
            "sits on",
            "change the fixed capacitance or the coil so it moves clear",
        )
    } else {
        ("crosses", "narrow or move the travel so it stays clear")
    };
    let crossed = protected(reach.low, reach.high);
    if !crossed.is_empty() {
        flags.push(Flag::new(
            FlagKind::ProtectedFrequency,
            format!(
                "{named} {verb} protected distress and safety frequencies: {}. Any emission \
                 that could disturb them is prohibited: keep this tank off the air and \
                 {move_it}",
                crossed.join("; ")
            ),
        ));
    }
    for n in [2u32, 3] {
        let (h_low, h_high) = (f64::from(n) * reach.low, f64::from(n) * reach.high);
        let crossed = protected(h_low, h_high);
        if !crossed.is_empty() {
            flags.push(Flag::new(
                FlagKind::ProtectedFrequency,
                format!(
                    "{} {verb} protected distress and safety frequencies: {}. Filter the \
                     output, keep the tank screened, and move the {} if the harmonic can leave \
                     the bench",
                    reach.harmonic_named(n),
                    crossed.join("; "),
                    if fixed { "tank" } else { "travel" }
                ),
            ));
        }
    }
    for n in [2u32, 3] {
        let k = f64::from(n);
        let (h_low, h_high) = (k * reach.low, k * reach.high);
        if h_high >= aero_low && h_low <= aero_high {
            flags.push(Flag::new(
                FlagKind::HarmonicAeronautical,
                format!(
                    "{} reaches the aeronautical band (108–137 MHz): filter the output and \
                     keep the tank screened",
                    reach.harmonic_named(n)
                ),
            ));
        }
    }
    flags
}

/// The 2nd and 3rd harmonics of `resonance` and of the trimmer's `reach`, with the
/// allocations they touch (a tank's harmonics are what an oscillator radiates beside its
/// fundamental; common practice: e.g. an FM-band oscillator's 2nd harmonic lands in
/// 176–216 MHz, broadcasting Band III).
pub fn harmonics(resonance: f64, reach: Reach) -> Vec<Harmonic> {
    [2u32, 3]
        .into_iter()
        .map(|order| {
            let n = f64::from(order);
            let (low, high) = (n * reach.low, n * reach.high);
            Harmonic {
                order,
                frequency: n * resonance,
                low,
                high,
                falls_in: allocations_touched(low, high)
                    .into_iter()
                    .map(|a| a.name)
                    .collect(),
            }
        })
        .collect()
}

/// Where a broadcast receiver hears an oscillator at `resonance` by its image, 2 × 10.7 MHz
/// away (common practice: superheterodyne FM receivers use a 10.7 MHz IF, and a receiver
/// tuned to f_dial with its local oscillator above also accepts f_dial + 21.4 MHz).
pub fn receiver_image(resonance: f64, band: &Band) -> ReceiverImage {
    let shift = 2.0 * BROADCAST_IF;
    let above = resonance - shift;
    let below = resonance + shift;
    let on_dial = |f: f64| {
        if band.contains(f) {
            " (on the dial)"
        } else {
            " (off the dial)"
        }
    };
    ReceiverImage {
        dial_oscillator_above: above,
        dial_oscillator_below: below,
        text: format!(
            "a broadcast receiver also hears this tank's signal by its image, 2 × 10.7 MHz \
             away: with the dial at {}{} when its local oscillator runs above the signal, at \
             {}{} when below (common practice); check the dial before trusting a reading",
            mhz(above),
            on_dial(above),
            mhz(below),
            on_dial(below)
        ),
    }
}

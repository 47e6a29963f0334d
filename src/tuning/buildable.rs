//! Whether a coil can be built as drawn: bare turns need air between them, a proposed
//! stretch must leave it, and the former should be a drill or rod the builder has.

use super::solve::{Unreachable, length_for_target};
use super::verdict::{Flag, FlagKind};
use crate::model::{Coil, Conditions, evaluate::resonance_of};
use std::fmt;

/// Smallest gap between bare turns, metres, in absolute terms: 0.2 mm.
pub const MIN_BARE_GAP: f64 = 0.2e-3;
/// Smallest gap between bare turns as a fraction of the wire diameter: a quarter.
pub const MIN_BARE_GAP_FRACTION: f64 = 0.25;

/// Whether the coil is wound with bare (or tinned) wire, whose turns must not touch.
pub fn is_bare(coil: &Coil) -> bool {
    coil.is_bare()
}

/// The smallest gap (metres) this coil's turns should keep: for bare wire the larger of
/// 0.2 mm and a quarter of the wire diameter, for insulated wire zero (close-wound is fine).
///
/// Common practice: a hand-spread coil's turns sit a tenth of a millimetre or so off the
/// spacing intended, solder or tinning can bridge a hair's gap, and a knock closes a small
/// one; a quarter of the wire diameter keeps thick wire's turns clearly apart.
pub fn minimum_gap(coil: &Coil) -> f64 {
    if coil.is_bare() {
        MIN_BARE_GAP.max(MIN_BARE_GAP_FRACTION * coil.wire_overall())
    } else {
        0.0
    }
}

/// The shortest coil (turns × pitch, metres) that keeps [`minimum_gap`] between turns.
pub fn shortest_buildable_length(coil: &Coil) -> f64 {
    coil.length_for_gap(minimum_gap(coil))
}

/// The gap flags of a coil: [`FlagKind::BareTurns`] when bare turns touch (a coil that
/// cannot work: the turns short each other), [`FlagKind::NarrowGap`] when bare turns are
/// closer than [`minimum_gap`]. Insulated wire raises neither.
pub fn gap_flags(coil: &Coil) -> Vec<Flag> {
    let min = minimum_gap(coil);
    if !coil.is_bare() {
        return Vec::new();
    }
    // A gap within a micrometre of zero is touching (pitch = wire diameter as typed).
    let gap = coil.gap();
    if gap <= 1e-6 {
        return vec![Flag::new(
            FlagKind::BareTurns,
            format!(
                "bare turns touch (gap {}): they short each other. Space them at least {} \
                 apart (coil length {} or more), or use enamelled wire",
                super::digits::mm(gap, 2),
                super::digits::mm(min, 2),
                super::digits::mm(shortest_buildable_length(coil), 1)
            ),
        )];
    }
    if gap < min {
        return vec![Flag::new(
            FlagKind::NarrowGap,
            format!(
                "the gap between bare turns is {}, below the {} a hand-spread coil keeps \
                 reliably (common practice): a knock or a blob of solder will short them",
                super::digits::mm(gap, 2),
                super::digits::mm(min, 2)
            ),
        )];
    }
    Vec::new()
}

/// A proposed length that would leave bare turns closer than [`minimum_gap`].
#[derive(Clone, Debug, PartialEq)]
pub struct TooTight {
    /// The length proposed, metres.
    pub proposed: f64,
    /// The shortest buildable length, metres.
    pub shortest: f64,
    /// The gap the proposal would leave, metres.
    pub gap: f64,
    /// The smallest gap accepted, metres.
    pub minimum_gap: f64,
    /// The tank's resonance at the shortest buildable length, hertz, when known.
    pub at_shortest: Option<f64>,
}

impl fmt::Display for TooTight {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        use super::digits::{mhz, mm};
        write!(
            f,
            "{} would leave {} between bare turns, under the {} minimum: no shorter than {}",
            mm(self.proposed, 2),
            mm(self.gap.max(0.0), 2),
            mm(self.minimum_gap, 2),
            mm(self.shortest, 2)
        )?;
        if let Some(at) = self.at_shortest {
            write!(
                f,
                ", where the tank resonates at {}: add a turn or capacitance to go lower",
                mhz(at)
            )?;
        }
        Ok(())
    }
}

/// `proposed` (metres) if the coil can be built at that length, else the refusal with the
/// shortest buildable length. Insulated wire may close-wind; bare wire keeps
/// [`minimum_gap`].
pub fn check_length(coil: &Coil, proposed: f64) -> Result<f64, TooTight> {
    let shortest = shortest_buildable_length(coil);
    if proposed >= shortest - 1e-9 {
        return Ok(proposed);
    }
    Err(TooTight {
        proposed,
        shortest,
        gap: proposed / coil.turns() - coil.wire_overall(),
        minimum_gap: minimum_gap(coil),
        at_shortest: None,
    })
}

/// Why "stretch to target" proposes no length.
#[derive(Clone, Debug, PartialEq)]
pub enum StretchRefusal {
    /// No spacing reaches the target.
    Unreachable(Unreachable),
    /// The spacing that reaches it would leave bare turns too close.
    TooTight(TooTight),
}

impl fmt::Display for StretchRefusal {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            StretchRefusal::Unreachable(u) => u.fmt(f),
            StretchRefusal::TooTight(t) => t.fmt(f),
        }
    }
}

/// "Stretch to target" that never proposes an unbuildable coil: the length from
/// [`length_for_target`], refused when it would leave bare turns closer than
/// [`minimum_gap`] (the refusal says the shortest buildable length and where the tank then
/// resonates).
pub fn buildable_length_for_target(
    coil: &Coil,
    external_capacitance: f64,
    conditions: &Conditions,
    target: f64,
) -> Result<f64, StretchRefusal> {
    let length = length_for_target(coil, external_capacitance, conditions, target)
        .map_err(StretchRefusal::Unreachable)?;
    check_length(coil, length).map_err(|mut t| {
        t.at_shortest = coil
            .with_length(t.shortest)
            .ok()
            .map(|c| resonance_of(&c, external_capacitance, conditions));
        StretchRefusal::TooTight(t)
    })
}

/// A drill or rod size near the former.
#[derive(Clone, Debug, PartialEq)]
pub struct DrillSize {
    /// Its diameter, metres.
    pub diameter: f64,
    /// As marked: "6.0 mm", "15/64 in".
    pub label: String,
    /// Drill minus former, metres.
    pub difference: f64,
}

/// The nearest metric and fractional-inch drill (or rod) to a former diameter.
#[derive(Clone, Debug, PartialEq)]
pub struct NearestDrills {
    /// Metric series: 0.1 mm steps from 1.0 to 10.0 mm, 0.5 mm steps from 10.5 to 20 mm
    /// (common practice: jobber drill sets and rod stock). `None` outside 0.95–20.25 mm.
    pub metric: Option<DrillSize>,
    /// Fractional inch: 1/64" steps from 1/16" to 1/2", 1/32" steps to 1" (common
    /// practice: fractional drill sets). `None` outside half a step of the series.
    pub inch: Option<DrillSize>,
}

/// Metric series in tenths of a millimetre.
fn metric_series() -> impl Iterator<Item = u32> {
    (10..=100).chain((105..=200).step_by(5))
}

/// Fractional-inch series in 64ths.
fn inch_series() -> impl Iterator<Item = u32> {
    (4..=32).chain((34..=64).step_by(2))
}

fn gcd(a: u32, b: u32) -> u32 {
    if b == 0 { a } else { gcd(b, a % b) }
}

fn inch_label(sixty_fourths: u32) -> String {
    let g = gcd(sixty_fourths, 64);
    let (n, d) = (sixty_fourths / g, 64 / g);
    if d == 1 {
        format!("{n} in")
    } else {
        format!("{n}/{d} in")
    }
}

/// The nearest drill or rod to `former` metres in each series (ties go to the smaller:
/// the wire springs out a little when released, common practice).
pub fn nearest_drills(former: f64) -> NearestDrills {
    const INCH: f64 = 25.4e-3;
    let pick = |sizes: Vec<(f64, String)>, half_step_low: f64, half_step_high: f64| {
        let (first, last) = (sizes.first()?.0, sizes.last()?.0);
        if !(former >= first - half_step_low && former <= last + half_step_high) {
            return None;
        }
        sizes
            .into_iter()
            .min_by(|a, b| (a.0 - former).abs().total_cmp(&(b.0 - former).abs()))
            .map(|(diameter, label)| DrillSize {
                diameter,
                label,
                difference: diameter - former,
            })
    };
    let metric = pick(
        metric_series()
            .map(|t| {
                (
                    f64::from(t) * 1e-4,
                    format!("{:.1} mm", f64::from(t) / 10.0),
                )
            })
            .collect(),
        0.05e-3,
        0.25e-3,
    );
    let inch = pick(
        inch_series()
            .map(|s| (f64::from(s) * INCH / 64.0, inch_label(s)))
            .collect(),
        INCH / 128.0,
        INCH / 64.0,
    );
    NearestDrills { metric, inch }
}

/// The nearest drills or rods to the coil's former diameter (see [`nearest_drills`]).
pub fn former_drills(coil: &Coil) -> NearestDrills {
    nearest_drills(coil.former_diameter())
}

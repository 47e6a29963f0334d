//! Design from the parts on hand: the former, wire, turns, length, fixed capacitor and trimmer
//! that land a target channel at the trimmer's mid-travel and stay landable whatever the build
//! does.
//!
//! # Method
//! 1. **Screen** (the batch path). For each former and wire, turns in quarter steps from one
//!    upwards; for each turns, one sweep of the solver's 96 lengths (close-wound to the longest
//!    a hand winds, [`crate::model::Coil::longest_proposed_length`]) for each fixed capacitor
//!    and trimmer at mid-travel, with the stray estimate of the building method
//!    ([`crate::tuning::stray`]) and the device's allowance ([`DesignSettings::device`]); every
//!    sign change of f − target is a landing length ([`landing`]). Turns stop once every tank
//!    lands below the target even stretched (more turns only go lower). The model is moved onto
//!    the field solution by one field solve per former and wire (the matching factor of
//!    [`crate::tuning::field_tank`] at a middle landed coil), as `recipe::figures` moves it.
//! 2. **Judge** each landed coil ([`judge`]): the trimmer's travel and its harmonics in band and
//!    off 108–137 MHz (as the verdict judges them), the spread band (linear propagation of the builder's tolerances and the
//!    stray's range, [`crate::tuning::spread::linear_band`]) inside the trimmer's reach, a 0.1 mm
//!    squeeze moving at most [`DesignSettings::gentle_share`] of the reach, the self-resonance
//!    above [`DesignSettings::self_resonance_ratio`] times the top of the travel. Bare turns keep
//!    the buildable gap ([`crate::tuning::buildable::check_length`]).
//! 3. **Rank** by the room the spread leaves inside the reach, then gentleness, less a penalty
//!    for a travel within the drift margin of a band edge ([`score`]).
//! 4. **Confirm** the best with exact field solves ([`confirm`]): the length solved again on
//!    the field-solved model, rounded to 0.1 mm, the trimmer set to land the target there, the
//!    spread from [`judge::DRAWS`] Monte Carlo builds, Q from the driving model; ranked again
//!    with Q.
//!
//! What was ruled out is kept per part ([`ruled_out`]): each former, wire, capacitor and trimmer
//! with no candidate is named with the furthest test any of its combinations reached and why
//! it failed there.

pub mod confirm;
pub mod judge;
pub mod landing;
pub mod parts;
pub mod ruled_out;

use crate::model::{Coil, Conditions, DiameterSpec, SpacingSpec, Tank, Winding, WireSpec};
use crate::tuning::buildable::{self, check_length, shortest_buildable_length};
use crate::tuning::construction::Construction;
use crate::tuning::digits::{mhz, mhz_range, mm, spread_range, spread_width, width};
use crate::tuning::field_tank::{FieldBasis, FieldInput, field_tank};
use crate::tuning::spread::BuildTolerances;
use crate::tuning::stray::{Span, estimate_stray, inputs_for};
use crate::tuning::verdict::Aim;
use judge::{Failure, Judged, SpreadKind, Stage, judge_candidate};
pub use landing::{Method, ScaleCurve};
use parts::{PartsError, PartsOnHand, TrimmerPart, short, wire_label};
use ruled_out::Tally;

// One picofarad in SI, for the table of typical values below.
const PF: f64 = crate::units::from_pf(1.0);

/// How the search judges and how much it confirms.
#[derive(Clone, Debug, PartialEq)]
pub struct DesignSettings {
    /// Temperature and driving model (the field solution moves it, as in `recipe::figures`).
    pub conditions: Conditions,
    /// The builder's tolerances for the spread.
    pub tolerances: BuildTolerances,
    /// Allowance for the active device's own capacitance across the tank, farads (low,
    /// typical, high): the stray estimate by building method has no term for it.
    pub device: Span,
    /// Largest share of the trimmer's reach a 0.1 mm squeeze of the coil may move.
    pub gentle_share: f64,
    /// The self-resonance must be at least this many times the top of the travel.
    pub self_resonance_ratio: f64,
    /// Candidates proposed.
    pub count: usize,
    /// Most candidates confirmed with field solves (about 50 ms each).
    pub confirm: usize,
    /// Batch path or the plain per-candidate loop.
    pub method: Method,
}

impl Default for DesignSettings {
    /// - device: 1–4 pF, typical 2 pF (from memory: a small-signal VHF transistor's output
    ///   capacitance; the 2N3904's data sheet gives at most 4 pF);
    /// - a 0.1 mm squeeze moves at most 10 % of the reach (our own criterion: a slip of the
    ///   hand then costs a tenth of the trimmer's travel);
    /// - self-resonance at least twice the top of the travel (common practice: well above,
    ///   so the coil's inductance is still the quasi-static one);
    /// - five candidates; at most forty tried on the field solution (one that fails costs one
    ///   field solve, about 10 ms).
    fn default() -> Self {
        Self {
            conditions: Conditions::default(),
            tolerances: BuildTolerances::HAND_WOUND,
            device: Span::new(1.0 * PF, 2.0 * PF, 4.0 * PF),
            gentle_share: 0.1,
            self_resonance_ratio: 2.0,
            count: 5,
            confirm: 40,
            method: Method::Batch,
        }
    }
}

/// One proposal: the parts, the coil, where the trimmer lands it, and why it ranks where it
/// does.
#[derive(Clone, Debug, PartialEq)]
pub struct Candidate {
    /// Former diameter, metres (as on the list).
    pub former: f64,
    /// The wire (as on the list).
    pub wire: WireSpec,
    /// Turns (quarter steps).
    pub turns: f64,
    /// Coil length (turns × pitch), metres, to 0.1 mm.
    pub length: f64,
    /// Each lead, metres.
    pub lead_length: f64,
    /// Fixed capacitor, farads (as on the list; 0: none).
    pub fixed: f64,
    /// The trimmer (as on the list).
    pub trimmer: TrimmerPart,
    /// Trimmer setting that lands the target, 0–1 (near ½).
    pub trimmer_setting: f64,
    /// The stray the tank is solved with (the estimate's typical figure and the device's),
    /// farads.
    pub stray: f64,
    /// The stray term's range, farads.
    pub stray_span: Span,
    /// Resonance at the setting, hertz.
    pub resonance: f64,
    /// Trimmer at maximum and at minimum, hertz.
    pub reach: (f64, f64),
    /// The spread band at the setting (central 95 % of the builds), hertz.
    pub spread: (f64, f64),
    /// Stretch sensitivity, hertz per metre.
    pub stretch: f64,
    /// Share of the reach a 0.1 mm squeeze moves.
    pub squeeze_share: f64,
    /// Unloaded Q (driving model).
    pub q: f64,
    /// Self-resonance, hertz (field-solved when [`Candidate::field_solved`]).
    pub self_resonance: f64,
    /// Wire to cut, metres (helix and both leads).
    pub wire_to_cut: f64,
    /// Whether the figures stand on the field solution (else the classical model).
    pub field_solved: bool,
    /// The factor on the classical inductance that meets the field solution.
    pub inductance_scale: f64,
    /// The rank's score (higher is better; see [`score`]).
    pub score: f64,
    /// Why it ranks where it does, and what to know, in words.
    pub reasons: Vec<String>,
}

impl Candidate {
    /// The stretch sensitivity in kHz per mm.
    pub fn khz_per_mm(&self) -> f64 {
        self.stretch * 1e-6
    }
}

/// The search's answer.
#[derive(Clone, Debug, PartialEq)]
pub struct Design {
    /// Best first.
    pub candidates: Vec<Candidate>,
    /// What was ruled out and why, in words.
    pub ruled_out: Vec<String>,
    /// Coils that landed the target at some buildable length.
    pub landed: usize,
    /// Of those, how many passed the screen.
    pub passed_screen: usize,
    /// Candidates solved with the field solution.
    pub confirmed: usize,
}

/// The score a judged candidate ranks by: the share of the reach the spread leaves spare on
/// its tighter side (0–½), plus 0.3 × how far below the squeeze limit it stays (0–1), less
/// 0.25 for a travel within the drift margin of a band edge, plus (once confirmed) 0.1 × Q/200
/// capped at 0.1. Our own weighting: room to trim first, a steady hand second, Q last.
pub fn score(j: &Judged, settings: &DesignSettings, q: Option<f64>) -> f64 {
    let reach = (j.reach.1 - j.reach.0).max(f64::MIN_POSITIVE);
    let margin = ((j.spread.0 - j.reach.0).min(j.reach.1 - j.spread.1) / reach).max(0.0);
    let gentle = (1.0 - j.squeeze_share / settings.gentle_share).clamp(0.0, 1.0);
    let edge = if j.edge_flags.is_empty() { 0.0 } else { 0.25 };
    let q = q.map_or(0.0, |q| 0.1 * (q / 200.0).clamp(0.0, 1.0));
    margin + 0.3 * gentle - edge + q
}

/// The stray term for `coil` with `fixed` and `trimmer` built by `construction`: the
/// estimate's stray parts ([`estimate_stray`] on [`inputs_for`], as the stray panel makes it)
/// plus the device's allowance, as (typical − low, typical, typical + high) around the typical
/// sum, the way `recipe::expectation` puts the estimate's range around the stray as entered.
pub fn stray_span(
    coil: &Coil,
    fixed: f64,
    trimmer: TrimmerPart,
    settings: &DesignSettings,
    construction: Construction,
) -> Span {
    let tank = Tank {
        fixed,
        trimmer_min: trimmer.min,
        trimmer_max: trimmer.max,
        trimmer_setting: 0.5,
        stray: 0.0,
        feedback: None,
    };
    let own = crate::physics::medhurst::self_capacitance(
        coil.mean_diameter(),
        coil.length_over_diameter(),
    );
    let inputs = inputs_for(
        coil,
        &tank,
        own,
        settings.tolerances.fixed_fraction,
        Some(construction),
    );
    let s = estimate_stray(&inputs).stray_term();
    let d = settings.device;
    let entered = s.typical + d.typical;
    Span::new(
        (entered - (s.typical - s.low) - (d.typical - d.low)).max(0.0),
        entered,
        entered + (s.high - s.typical) + (d.high - d.typical),
    )
}

/// Stretching must be able to take the tank this far above the target (our own criterion: a
/// landing near the top of the curve of resonance against length rests on the model's last
/// per cent, and the builder could not stretch to correct it).
const STRETCH_HEADROOM: f64 = 1.02;

/// Most turns tried (quarter steps from one).
const MAX_TURNS: f64 = 60.0;

/// A screened candidate waiting to be confirmed.
#[derive(Clone, Debug)]
struct Screened {
    key: [usize; 4],
    coil: Coil,
    score: f64,
}

/// Search the parts on hand for tanks that land `aim`'s target (see the module's method).
/// Refuses parts outside their accepted ranges, naming the list, before any solve.
pub fn search(
    parts: &PartsOnHand,
    aim: &Aim,
    settings: &DesignSettings,
) -> Result<Design, PartsError> {
    parts.check()?;
    let target = aim
        .target
        .filter(|t| t.is_finite() && *t > 0.0)
        .ok_or(PartsError {
            list: "target",
            message: "no target frequency".to_owned(),
        })?;
    let mut tally = Tally::new(parts);
    let mut screened = Vec::new();
    let mut landed = 0;
    let mut scratch = landing::Scratch::default();
    for (fi, &former) in parts.formers.iter().enumerate() {
        for (wi, wire) in parts.wires.iter().enumerate() {
            let mut pair = screen_pair(
                parts,
                [fi, wi],
                former,
                *wire,
                &ScaleCurve::flat(1.0),
                target,
                aim,
                settings,
                &mut scratch,
            );
            // Field solves at the shortest, a middle and the longest landed coil (by l/D)
            // give the factor that moves the model onto the field solution along the length,
            // as `recipe::figures` moves it at one coil; screen again on it.
            let curve = field_curve(&pair.landed, &settings.conditions);
            if let Some(curve) = curve {
                pair = screen_pair(
                    parts,
                    [fi, wi],
                    former,
                    *wire,
                    &curve,
                    target,
                    aim,
                    settings,
                    &mut scratch,
                );
            }
            landed += pair.landed.len();
            tally.merge(pair.failures);
            screened.extend(pair.passed);
        }
    }
    let passed_screen = screened.len();
    for s in &screened {
        tally.passed(s.key);
    }
    screened.sort_by(|a, b| b.score.total_cmp(&a.score));
    let mut candidates = Vec::new();
    let mut confirmed = 0;
    for s in screened.iter().take(settings.confirm.max(settings.count)) {
        if candidates.len() >= settings.count {
            break;
        }
        confirmed += 1;
        let [fi, wi, ki, mi] = s.key;
        let (fixed, trimmer) = (parts.fixed[ki], parts.trimmers[mi]);
        match confirm::confirm(
            &s.coil,
            fixed,
            trimmer,
            aim,
            target,
            settings,
            parts.construction,
        ) {
            Ok(c) => candidates.push(candidate(
                parts.formers[fi],
                parts.wires[wi],
                c,
                trimmer,
                settings,
            )),
            Err(f) => tally.fail_confirmed(s.key, describe(parts, s.key, s.coil.turns(), &f)),
        }
    }
    candidates.sort_by(|a, b| b.score.total_cmp(&a.score));
    let n = candidates.len();
    for (i, c) in candidates.iter_mut().enumerate() {
        let rank = rank_reason(c, i, n, settings);
        c.reasons.insert(0, rank);
    }
    Ok(Design {
        ruled_out: tally.words(parts, candidates.is_empty(), passed_screen),
        candidates,
        landed,
        passed_screen,
        confirmed,
    })
}

/// The field solution's factor along the length for one former and wire, from field solves
/// at the shortest, a middle and the longest of the `landed` coils (by l/D); `None` when
/// nothing landed.
fn field_curve(landed: &[(Coil, f64)], conditions: &Conditions) -> Option<ScaleCurve> {
    if landed.is_empty() {
        return None;
    }
    let mut order: Vec<usize> = (0..landed.len()).collect();
    order.sort_by(|&a, &b| {
        landed[a]
            .0
            .length_over_diameter()
            .total_cmp(&landed[b].0.length_over_diameter())
    });
    let mut picks = vec![order[0], order[order.len() / 2], order[order.len() - 1]];
    picks.dedup();
    let points = picks
        .into_iter()
        .map(|i| {
            let (coil, external) = landed[i];
            let solved = field_tank(&coil, external, conditions);
            let basis = FieldBasis::of(&coil, external, conditions, FieldInput::Solved(solved));
            (coil.length_over_diameter(), basis.scale())
        })
        .collect();
    Some(ScaleCurve::through(points))
}

/// What one former and wire leave after the screen.
struct Pair {
    landed: Vec<(Coil, f64)>,
    passed: Vec<Screened>,
    failures: Vec<([usize; 4], (Stage, String))>,
}

/// "5 mm former, 1 mm bare wire, 10 pF, the 4–20 pF trimmer, 5.25 turns".
fn describe(parts: &PartsOnHand, key: [usize; 4], turns: f64, f: &Failure) -> (Stage, String) {
    let [fi, wi, ki, mi] = key;
    (
        f.stage,
        format!(
            "{} former, {}, {}, the {} trimmer, {} turns: {}",
            mm(parts.formers[fi], 2).replace(".00 mm", " mm"),
            wire_label(&parts.wires[wi]),
            fixed_label(parts.fixed[ki]),
            parts.trimmers[mi].label(),
            short(turns),
            f.text
        ),
    )
}

/// "10 pF fixed", "no fixed capacitor".
pub fn fixed_label(fixed: f64) -> String {
    if fixed > 0.0 {
        format!("{} pF fixed", short(crate::units::to_pf(fixed)))
    } else {
        "no fixed capacitor".to_owned()
    }
}

#[expect(
    clippy::too_many_arguments,
    reason = "the pair, the model's conditions, the aim and the scratch are each needed"
)]
fn screen_pair(
    parts: &PartsOnHand,
    [fi, wi]: [usize; 2],
    former: f64,
    wire: WireSpec,
    curve: &ScaleCurve,
    target: f64,
    aim: &Aim,
    settings: &DesignSettings,
    scratch: &mut landing::Scratch,
) -> Pair {
    let mut pair = Pair {
        landed: Vec::new(),
        passed: Vec::new(),
        failures: Vec::new(),
    };
    let combos: Vec<[usize; 2]> = (0..parts.fixed.len())
        .flat_map(|k| (0..parts.trimmers.len()).map(move |m| [k, m]))
        .collect();
    let mut externals = vec![0.0; combos.len()];
    let mut quarter = 4u32;
    while f64::from(quarter) * 0.25 <= MAX_TURNS {
        let turns = f64::from(quarter) * 0.25;
        quarter += 1;
        let winding = Winding {
            diameter: DiameterSpec::Former(former),
            wire,
            turns,
            spacing: SpacingSpec::Gap(buildable::MIN_BARE_GAP),
            lead_length: parts.lead_length,
        };
        let coil = match Coil::from_winding(&winding) {
            Ok(c) => c,
            Err(e) => {
                for &[k, m] in &combos {
                    pair.failures.push((
                        [fi, wi, k, m],
                        describe(
                            parts,
                            [fi, wi, k, m],
                            turns,
                            &Failure {
                                stage: Stage::Lands,
                                text: e.to_string(),
                            },
                        ),
                    ));
                }
                break;
            }
        };
        // The stray estimate at a middle length (one diameter, within the buildable range):
        // the layout's parts hardly move with the length; the confirmation makes it again.
        let middle = coil.mean_diameter().clamp(
            shortest_buildable_length(&coil),
            coil.longest_proposed_length()
                .max(shortest_buildable_length(&coil)),
        );
        let reference = coil.with_length(middle).unwrap_or(coil);
        let strays: Vec<Span> = combos
            .iter()
            .map(|&[k, m]| {
                stray_span(
                    &reference,
                    parts.fixed[k],
                    parts.trimmers[m],
                    settings,
                    parts.construction,
                )
            })
            .collect();
        for (i, &[k, m]) in combos.iter().enumerate() {
            externals[i] = parts.fixed[k] + parts.trimmers[m].mid() + strays[i].typical;
        }
        let results = landing::landing_lengths(
            &coil,
            &externals,
            &settings.conditions,
            curve,
            target,
            settings.method,
            scratch,
        );
        let mut all_below = true;
        for (i, result) in results.into_iter().enumerate() {
            let [k, m] = combos[i];
            let key = [fi, wi, k, m];
            let fail = |pair: &mut Pair, stage: Stage, text: String| {
                pair.failures
                    .push((key, describe(parts, key, turns, &Failure { stage, text })));
            };
            let roots = match result {
                Ok(r) => r,
                Err(u) => {
                    if !matches!(
                        u,
                        crate::tuning::solve::Unreachable::BelowEvenStretched { .. }
                    ) {
                        all_below = false;
                    }
                    fail(&mut pair, Stage::Lands, u.to_string());
                    continue;
                }
            };
            all_below = false;
            if roots.highest < STRETCH_HEADROOM * target {
                fail(
                    &mut pair,
                    Stage::Lands,
                    format!(
                        "stretched to its longest it reaches only {}, within {:.0} % of the \
                         target: the landing would rest on the model's last per cent",
                        mhz(roots.highest),
                        100.0 * (STRETCH_HEADROOM - 1.0)
                    ),
                );
                continue;
            }
            for root in roots.lengths {
                if let Err(t) = check_length(&coil, root) {
                    fail(&mut pair, Stage::Lands, t.to_string());
                    continue;
                }
                let Ok(at) = coil.with_length(root) else {
                    continue;
                };
                let tank = Tank {
                    fixed: parts.fixed[k],
                    trimmer_min: parts.trimmers[m].min,
                    trimmer_max: parts.trimmers[m].max,
                    trimmer_setting: 0.5,
                    stray: strays[i].typical,
                    feedback: None,
                };
                pair.landed.push((at, externals[i]));
                match judge_candidate(
                    &at,
                    &tank,
                    strays[i],
                    &curve.conditions(&at, &settings.conditions),
                    aim,
                    settings,
                    SpreadKind::Linear,
                    None,
                ) {
                    Ok(j) => pair.passed.push(Screened {
                        key,
                        coil: at,
                        score: score(&j, settings, None),
                    }),
                    Err(f) => fail(&mut pair, f.stage, f.text),
                }
            }
        }
        if all_below {
            break;
        }
    }
    pair
}

fn candidate(
    former: f64,
    wire: WireSpec,
    c: confirm::Confirmed,
    trimmer: TrimmerPart,
    settings: &DesignSettings,
) -> Candidate {
    let j = &c.judged;
    let coil = c.coil;
    let mut reasons = vec![
        format!(
            "{} turns of {} on the {} former, {} long (wire to cut {}): lands {} with the \
             trimmer at {:.0} %",
            short(coil.turns()),
            wire_label(&wire),
            mm(former, 2).replace(".00 mm", " mm"),
            mm(coil.length(), 1),
            mm(coil.wire_length(), 0),
            mhz(j.resonance),
            100.0 * c.tank.trimmer_setting
        ),
        format!(
            "the build may land within {} ({} wide); {} reaches {}, so the trimmer brings any \
             of them onto the channel",
            spread_range(j.spread.0, j.spread.1),
            spread_width(j.spread.1 - j.spread.0),
            format_args!("the {} trimmer", trimmer.label()),
            mhz_range(j.reach.0, j.reach.1)
        ),
        format!(
            "squeezing or stretching it by 0.1 mm moves {} ({:.1} % of the reach)",
            width(j.stretch * 0.1e-3),
            100.0 * j.squeeze_share
        ),
        format!(
            "Q {:.0}; self-resonance {} ({:.1} times the top of the travel)",
            c.q,
            crate::tuning::digits::self_resonance(j.self_resonance),
            j.self_resonance / j.travel.1
        ),
    ];
    let (aero_low, aero_high) = crate::tuning::service::AERONAUTICAL;
    if j.travel.1 >= aero_low && j.travel.0 <= aero_high {
        reasons.push(format!(
            "a build at the edge of its spread, with the trimmer turned to its end, could reach \
             {}: trim from mid-travel and watch the frequency as you turn",
            mhz_range(j.travel.0, j.travel.1)
        ));
    }
    for f in &j.edge_flags {
        reasons.push(format!("near a band edge: {}", f.text));
    }
    reasons.push(match &c.classical_because {
        None => format!(
            "figures on the field-solved tank (the model's inductance × {:.3})",
            c.scale
        ),
        Some(why) => format!("figures on the classical model: {why}"),
    });
    Candidate {
        former,
        wire,
        turns: coil.turns(),
        length: coil.length(),
        lead_length: coil.lead_length(),
        fixed: c.tank.fixed,
        trimmer,
        trimmer_setting: c.tank.trimmer_setting,
        stray: c.tank.stray,
        stray_span: c.stray,
        resonance: j.resonance,
        reach: j.reach,
        spread: j.spread,
        stretch: j.stretch,
        squeeze_share: j.squeeze_share,
        q: c.q,
        self_resonance: j.self_resonance,
        wire_to_cut: coil.wire_length(),
        field_solved: c.classical_because.is_none(),
        inductance_scale: c.scale,
        score: score(j, settings, Some(c.q)),
        reasons,
    }
}

/// The rank in words: what puts this candidate where it is.
fn rank_reason(c: &Candidate, i: usize, n: usize, settings: &DesignSettings) -> String {
    let reach = (c.reach.1 - c.reach.0).max(f64::MIN_POSITIVE);
    let spare = ((c.spread.0 - c.reach.0).min(c.reach.1 - c.spread.1) / reach).max(0.0);
    let gentle = if c.squeeze_share <= 0.5 * settings.gentle_share {
        "gentle to set by hand"
    } else {
        "touchy to set by hand"
    };
    format!(
        "ranked {} of {n}: the spread leaves {:.0} % of the trimmer's reach spare on its \
         tighter side; {gentle} ({:.1} % of the reach per 0.1 mm); Q {:.0}",
        i + 1,
        100.0 * spare,
        100.0 * c.squeeze_share,
        c.q
    )
}

/// The plan a typed target is judged on: the first built-in plan that has it as a channel,
/// else a list of its own (whose band is that of the service holding it).
pub fn plan_for(target: f64) -> crate::tuning::BandPlan {
    crate::tuning::BandPlan::built_in()
        .into_iter()
        .find(|p| p.has_channel(target))
        .unwrap_or_else(|| crate::tuning::BandPlan::Custom(vec![target]))
}

//! A screened candidate confirmed on the field-solved tank, the way `recipe::figures` computes
//! a recipe's figures: the coil solved with [`crate::tuning::field_tank::field_tank`] at its
//! tank, the model moved onto it by [`FieldBasis::of`] (the matching inductance factor), the
//! length solved again on the moved model, rounded to 0.1 mm (what a hand sets), and the
//! trimmer setting solved to land the target there (near mid-travel). The stray estimate is
//! made again for the final coil, and the candidate judged again with the spread of
//! [`super::judge::DRAWS`] Monte Carlo builds.

use super::judge::{Failure, Judged, SpreadKind, Stage, judge_candidate};
use super::parts::TrimmerPart;
use super::{DesignSettings, stray_span};
use crate::model::{Coil, Conditions, Tank, evaluate_coil};
use crate::tuning::buildable::shortest_buildable_length;
use crate::tuning::field_tank::{FieldBasis, FieldInput, field_tank};
use crate::tuning::solve::{lengths_for_target, setting_for_target};
use crate::tuning::stray::Span;
use crate::tuning::verdict::Aim;

/// What a confirmed candidate is.
#[derive(Clone, Debug, PartialEq)]
pub struct Confirmed {
    /// The coil as wound (length to 0.1 mm).
    pub coil: Coil,
    /// The tank at the setting that lands the target (stray: the estimate's typical figure
    /// with the device's allowance).
    pub tank: Tank,
    /// The stray term's span around `tank.stray`.
    pub stray: Span,
    /// The judged figures on the field-solved model.
    pub judged: Judged,
    /// Unloaded Q of the coil in the tank, by the driving model (as the readouts show it).
    pub q: f64,
    /// The factor on the classical inductance that meets the field solution (1: classical).
    pub scale: f64,
    /// Why the field solution did not lead, when it did not.
    pub classical_because: Option<String>,
}

/// Rounds of the length (and of the setting) against the field solution; the factor moves
/// by parts in 10⁴ between rounds, so two settle it well inside a channel's tolerance.
const ROUNDS: usize = 2;

/// The length to 0.1 mm, never below the shortest buildable length.
fn hand_length(coil: &Coil, length: f64) -> f64 {
    let rounded = (length * 1e4).round() / 1e4;
    let floor = shortest_buildable_length(coil);
    if rounded < floor - 1e-12 {
        (floor * 1e4).ceil() / 1e4
    } else {
        rounded
    }
}

fn basis_at(coil: &Coil, external: f64, conditions: &Conditions) -> FieldBasis {
    let solved = field_tank(coil, external, conditions);
    FieldBasis::of(coil, external, conditions, FieldInput::Solved(solved))
}

/// Confirm the candidate `coil` (at its screened landing length) with `fixed` and `trimmer`.
pub fn confirm(
    coil: &Coil,
    fixed: f64,
    trimmer: TrimmerPart,
    aim: &Aim,
    target: f64,
    settings: &DesignSettings,
    construction: crate::tuning::construction::Construction,
) -> Result<Confirmed, Failure> {
    let base = &settings.conditions;
    let lands = |text: String| Failure {
        stage: Stage::Lands,
        text,
    };
    let mut coil = *coil;
    let tank_at = |coil: &Coil, setting: f64| {
        let stray = stray_span(coil, fixed, trimmer, settings, construction);
        (
            Tank {
                fixed,
                trimmer_min: trimmer.min,
                trimmer_max: trimmer.max,
                trimmer_setting: setting,
                stray: stray.typical,
                feedback: None,
            },
            stray,
        )
    };
    for _ in 0..ROUNDS {
        let (tank, _) = tank_at(&coil, 0.5);
        let external = tank.external_capacitance();
        let conditions = basis_at(&coil, external, base).conditions(base);
        let roots = lengths_for_target(&coil, external, &conditions, target)
            .map_err(|u| lands(u.to_string()))?;
        let present = coil.length();
        let length = roots
            .into_iter()
            .min_by(|a, b| (a - present).abs().total_cmp(&(b - present).abs()))
            .unwrap_or(present);
        coil = coil.with_length(length).map_err(|e| lands(e.to_string()))?;
    }
    coil = coil
        .with_length(hand_length(&coil, coil.length()))
        .map_err(|e| lands(e.to_string()))?;
    let mut setting = 0.5;
    for _ in 0..ROUNDS {
        let (tank, _) = tank_at(&coil, setting);
        let conditions = basis_at(&coil, tank.external_capacitance(), base).conditions(base);
        setting = setting_for_target(&coil, &tank, &conditions, target).map_err(|u| {
            lands(format!(
                "wound to {} it cannot be trimmed onto the target: {u}",
                crate::tuning::digits::mm(coil.length(), 1)
            ))
        })?;
    }
    let (tank, stray) = tank_at(&coil, setting);
    // The figures as `recipe::figures` makes them: the field solution at this tank.
    let basis = basis_at(&coil, tank.external_capacitance(), base);
    let conditions = basis.conditions(base);
    let judged = judge_candidate(
        &coil,
        &tank,
        stray,
        &conditions,
        aim,
        settings,
        SpreadKind::Draws,
        basis.tank().map(|t| t.self_resonance),
    )?;
    let q = evaluate_coil(&coil, tank.external_capacitance(), &conditions).q;
    let classical_because = match &basis {
        FieldBasis::Classical { why } => Some(why.to_string()),
        _ => None,
    };
    Ok(Confirmed {
        coil,
        tank,
        stray,
        judged,
        q,
        scale: basis.scale(),
        classical_because,
    })
}

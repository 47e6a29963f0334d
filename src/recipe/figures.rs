//! Every figure of a recipe, computed once by the engine: the one function the window, the
//! build sheet and the headless commands call, so they cannot disagree.
//!
//! Three layers, each applied on the one before:
//! 1. the classical model (the driving inductance method, the leads, Medhurst's
//!    self-capacitance): [`Figures::classical`];
//! 2. the field solution of the same coil, when there is one: the model's inductance scaled so
//!    that the model meets the field-solved resonance at the present coil
//!    ([`crate::tuning::field_tank::matching_scale`]), so the field solution leads the
//!    resonance while the model keeps its shape for the charts and the advice:
//!    [`Figures::uncalibrated`];
//! 3. the bench readings, when there are any: the fit's extra capacitance and inductance scale
//!    ([`crate::tuning::fit::fit_on`]), each reading modelled by the field solution of its
//!    own coil, the scale on the field-solved apparent inductance; the present coil is then
//!    the calibrated field-solved tank exactly. One reading fixes the stray with the
//!    field-solved inductance kept; two or more fit the inductance too.
//!
//! Away from the present coil (the length and setting for the target, the trimmer's reach,
//! the kHz per mm and the advice) every figure is landed on field solves of the coil it names
//! ([`crate::tuning::landing`], [`Figures::led`]), so an instruction carried out is where the
//! figures then say it is.
//!
//! The result drives every figure: the analysis, the target figures, the verdict, the advice
//! and (in the window) the charts.

use super::document::Recipe;
use crate::model::{Analysis, Coil, Conditions, InputError, Tank, evaluate, evaluate_coil};
use crate::tuning::field_tank::{FieldBasis, FieldInput, Unled, field_tank};
use crate::tuning::fit::{Fit, FitError, InverseSquareLine, fit_on_held, inverse_square_line};
use crate::tuning::landing::FieldLed;
use crate::tuning::measured_field::{MeasuredAgainstField, against_field, applies_to};
use crate::tuning::target::{TargetFigures, target_figures_on};
use crate::tuning::verdict::{Aim, Verdict, judge};

/// Everything computed for a valid recipe.
#[derive(Clone, Debug, PartialEq)]
pub struct Figures {
    /// The validated coil.
    pub coil: Coil,
    /// The tank that drives the figures (calibrated when there are readings that fit).
    pub tank: Tank,
    /// The conditions that drive the figures (the field solution's scale on the inductance,
    /// and the calibration's when there are readings that fit).
    pub conditions: Conditions,
    /// Every figure of the engine, calibrated when there are readings that fit.
    pub analysis: Analysis,
    /// The classical model as it stands: no field solution, no bench readings.
    pub classical: Analysis,
    /// Before the bench readings: the classical model moved onto the field solution when there
    /// is one (else the classical model itself).
    pub uncalibrated: Analysis,
    /// The conditions of [`uncalibrated`](Self::uncalibrated) (the field solution's scale on
    /// the inductance).
    pub uncalibrated_conditions: Conditions,
    /// What the field solution did to the figures.
    pub field: FieldBasis,
    /// The field-led model the target figures and the advice were landed on (`None` while
    /// the classical model leads or an earlier coil's factor is held).
    pub led: Option<FieldLed>,
    /// The fit of the bench readings (`None` when there are none).
    pub fit: Option<Result<Fit, FitError>>,
    /// The kept coil measurement against the field solution of the coil as measured (`None`
    /// when none is kept or the field solution is not at hand; the reason when it does not
    /// apply). Its scale calibrates the inductance while the readings cannot tell it.
    pub measured: Option<Result<MeasuredAgainstField, String>>,
    /// The straight line of 1/f² against external capacitance through the readings at the
    /// latest reading's length (`None` with fewer than two there).
    pub line: Option<InverseSquareLine>,
    /// Against the target, by the driving (calibrated) model.
    pub target: TargetFigures,
    /// The verdict against the recipe's channel and band plan, by the driving (calibrated)
    /// model: what the window's verdict block and the build sheet both show.
    pub verdict: Verdict,
}

impl Figures {
    /// Whether the figures come from a model calibrated on bench readings.
    pub fn calibrated(&self) -> bool {
        matches!(self.fit, Some(Ok(_))) || self.measured_scale().is_some()
    }

    /// The inductance scale the kept coil measurement puts on the field solution, when it
    /// applies and the readings do not fit the scale themselves.
    pub fn measured_scale(&self) -> Option<f64> {
        measured_scale(&self.fit, &self.measured)
    }

    /// What the figures rest on, in one line (the window's verdict and the build sheet):
    /// "Calibrated on N bench readings (on the field solution)", or, before any, "Not
    /// calibrated: the field solution only, no bench readings yet" (or the classical model).
    pub fn basis_text(&self) -> String {
        let basis = match &self.field {
            FieldBasis::Solved { .. } => "the field solution",
            FieldBasis::Held { .. } => "the field solution (updating)",
            FieldBasis::Classical { .. } => "the classical model",
        };
        let measured = self
            .measured_scale()
            .map(|s| format!("the measured coil's inductance ({s:.3} of the field solution's)"));
        match (&self.fit, measured) {
            (Some(Ok(_)), measured) => {
                let n = self.readings_used();
                let with = measured.map(|m| format!(" and {m}")).unwrap_or_default();
                format!(
                    "Calibrated on {n} bench reading{}{with} (on {basis})",
                    if n == 1 { "" } else { "s" }
                )
            }
            (_, Some(m)) if self.fit.is_none() => {
                format!("Calibrated on {m}, no bench readings yet (on {basis})")
            }
            (Some(Err(_)), _) => {
                "Not calibrated: the bench readings could not be fitted (see the bench log)"
                    .to_owned()
            }
            (None, _) => format!("Not calibrated: {basis} only, no bench readings yet"),
        }
    }

    /// The footing these figures stand on: classical when the field solution was switched
    /// off for them, the field solution otherwise (also while it is pending or failed, when
    /// the classical model stands in for it).
    pub fn footing(&self) -> Footing {
        match self.field {
            FieldBasis::Classical {
                why: Unled::SwitchedOff,
            } => Footing::Classical,
            _ => Footing::FieldSolution,
        }
    }

    /// How many readings the calibration rests on (0 when uncalibrated).
    pub fn readings_used(&self) -> usize {
        match &self.fit {
            Some(Ok(f)) => f.readings_used,
            _ => 0,
        }
    }
}

/// Every figure of `recipe`, with the field solution of its coil solved here (the headless
/// commands and the build sheet; the window hands its worker's answer to [`figures_with`]),
/// or the refusal naming the field at fault. A field solution that fails leaves the
/// classical model leading, with the reason in [`Figures::field`].
pub fn figures(recipe: &Recipe) -> Result<Figures, InputError> {
    let classical = evaluate(&recipe.winding, &recipe.tank, &recipe.conditions)?;
    let solved = field_tank(
        &classical.coil,
        recipe.tank.external_capacitance(),
        &recipe.conditions,
    );
    assemble(recipe, classical, FieldInput::Solved(solved))
}

/// What the figures stand on: the field solution (solved here) or the classical model alone
/// (the window's setting switched off), so what is printed or pinned matches the screen.
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq)]
pub enum Footing {
    /// The field solution leads (the default everywhere).
    #[default]
    FieldSolution,
    /// The classical model alone.
    Classical,
}

impl Footing {
    /// The footing of the window's setting: on, the field solution.
    pub fn of_setting(field_solution: bool) -> Self {
        if field_solution {
            Footing::FieldSolution
        } else {
            Footing::Classical
        }
    }
}

/// Every figure of `recipe` on `footing`: [`figures`] on the field solution, the classical
/// model alone otherwise.
pub fn figures_on(recipe: &Recipe, footing: Footing) -> Result<Figures, InputError> {
    match footing {
        Footing::FieldSolution => figures(recipe),
        Footing::Classical => figures_with(recipe, FieldInput::Unsolved(Unled::SwitchedOff)),
    }
}

/// Every figure of `recipe` with the field solution as given, or the refusal naming the
/// field at fault.
pub fn figures_with(recipe: &Recipe, field: FieldInput) -> Result<Figures, InputError> {
    let classical = evaluate(&recipe.winding, &recipe.tank, &recipe.conditions)?;
    assemble(recipe, classical, field)
}

/// The recipe's tank as the figures model it, before it is aimed at a channel: the classical
/// model, moved onto the field solution when there is one, calibrated on the bench readings
/// (and a kept coil measurement) when there are any. [`Figures`] is this aimed at the
/// recipe's channel; `tankwright evaluate` aims it at the flags' target, or at none.
#[derive(Clone, Debug, PartialEq)]
pub struct Modelled {
    /// The validated coil.
    pub coil: Coil,
    /// The tank that drives the figures (calibrated when there are readings that fit).
    pub tank: Tank,
    /// The conditions that drive the figures.
    pub conditions: Conditions,
    /// Every figure of the engine, calibrated when there are readings that fit.
    pub analysis: Analysis,
    /// The classical model as it stands: no field solution, no bench readings.
    pub classical: Analysis,
    /// Before the bench readings.
    pub uncalibrated: Analysis,
    /// The conditions of `uncalibrated`.
    pub uncalibrated_conditions: Conditions,
    /// What the field solution did to the figures.
    pub field: FieldBasis,
    /// The field-led model the target figures and the advice are landed on.
    pub led: Option<FieldLed>,
    /// The fit of the bench readings (`None` when there are none).
    pub fit: Option<Result<Fit, FitError>>,
    /// The kept coil measurement against the field solution of the coil as measured.
    pub measured: Option<Result<MeasuredAgainstField, String>>,
    /// The straight line of 1/f² against external capacitance through the readings at the
    /// latest reading's length.
    pub line: Option<InverseSquareLine>,
}

impl Modelled {
    /// Whether the model is calibrated on bench readings or a kept coil measurement (as
    /// [`Figures::calibrated`]).
    pub fn calibrated(&self) -> bool {
        matches!(self.fit, Some(Ok(_))) || measured_scale(&self.fit, &self.measured).is_some()
    }

    /// How many readings the calibration rests on (0 when uncalibrated).
    pub fn readings_used(&self) -> usize {
        match &self.fit {
            Some(Ok(f)) => f.readings_used,
            _ => 0,
        }
    }
}

/// The scale a kept coil measurement puts on the field solution, when it applies and the
/// readings do not fit the scale themselves.
fn measured_scale(
    fit: &Option<Result<Fit, FitError>>,
    measured: &Option<Result<MeasuredAgainstField, String>>,
) -> Option<f64> {
    let m = measured.as_ref()?.as_ref().ok()?;
    match fit {
        Some(Ok(f)) if f.inductance_scale_error.is_some() => None,
        _ => Some(m.scale),
    }
}

/// The recipe's tank modelled (see [`Modelled`]) with its field solution solved here, as
/// [`figures`] does.
pub fn modelled(recipe: &Recipe) -> Result<Modelled, InputError> {
    let classical = evaluate(&recipe.winding, &recipe.tank, &recipe.conditions)?;
    let solved = field_tank(
        &classical.coil,
        recipe.tank.external_capacitance(),
        &recipe.conditions,
    );
    model(recipe, classical, FieldInput::Solved(solved))
}

/// The target figures and the verdict of `m` against `aim`: with a target, the target
/// figures (landed on the field-led model) and the verdict with their advice; without one,
/// the verdict on the band alone. The one aiming step of [`figures`] and `evaluate`.
pub fn aimed(m: &Modelled, aim: &Aim) -> (Option<TargetFigures>, Verdict) {
    let verdict = judge(&m.coil, &m.tank, &m.conditions, aim);
    match aim.target {
        Some(channel) => {
            let target = target_figures_on(
                &m.coil,
                &m.tank,
                &m.conditions,
                &aim.plan,
                channel,
                aim.tolerance,
                m.led.as_ref(),
            );
            let verdict = verdict.with_advice(target.advice.clone());
            (Some(target), verdict)
        }
        None => (None, verdict),
    }
}

/// The figures on the classical analysis of a valid recipe.
fn assemble(
    recipe: &Recipe,
    classical: Analysis,
    field: FieldInput,
) -> Result<Figures, InputError> {
    let m = model(recipe, classical, field)?;
    let aim = Aim::new(recipe.target.plan.clone(), Some(recipe.target.channel))
        .with_tolerance(recipe.target.tolerance());
    let (Some(target), verdict) = aimed(&m, &aim) else {
        unreachable!("a recipe's aim always has its channel");
    };
    let Modelled {
        coil,
        tank,
        conditions,
        analysis,
        classical,
        uncalibrated,
        uncalibrated_conditions,
        field,
        led,
        fit,
        measured,
        line,
    } = m;
    Ok(Figures {
        line,
        coil,
        tank,
        conditions,
        analysis,
        classical,
        uncalibrated,
        uncalibrated_conditions,
        field,
        led,
        fit,
        measured,
        target,
        verdict,
    })
}

/// The model of a valid recipe on its classical analysis (see [`Modelled`]).
fn model(recipe: &Recipe, classical: Analysis, field: FieldInput) -> Result<Modelled, InputError> {
    let coil = classical.coil;
    let external = recipe.tank.external_capacitance();
    let basis = FieldBasis::of(&coil, external, &recipe.conditions, field);
    let base = basis.conditions(&recipe.conditions);
    let uncalibrated = if basis.scale() == 1.0 {
        classical.clone()
    } else {
        evaluate(&recipe.winding, &recipe.tank, &base)?
    };
    let readings = recipe.readings();
    // The field-led model reaches the readings' coils and the proposals' only with this
    // recipe's own field solution (not while an earlier coil's factor is held).
    let field_conditions = matches!(basis, FieldBasis::Solved { .. }).then_some(recipe.conditions);
    // A kept coil measurement calibrates the field-led model's inductance (the field solution
    // of the coil as measured, reduced over the same band).
    let measured = match (&recipe.coil_measurement, &field_conditions) {
        (Some(m), Some(fc)) => {
            Some(applies_to(m, &recipe.winding).and_then(|()| against_field(m, fc)))
        }
        _ => None,
    };
    let held = measured
        .as_ref()
        .and_then(|m| m.as_ref().ok())
        .map_or(1.0, |m| m.scale);
    let fit = (!readings.is_empty()).then(|| {
        fit_on_held(
            &coil,
            &recipe.tank,
            &base,
            &readings,
            field_conditions.as_ref(),
            held,
        )
    });
    let mut led = field_conditions.map(|conditions| FieldLed {
        conditions,
        scale: 1.0,
    });
    let (tank, conditions, analysis) = match &fit {
        Some(Ok(f)) => {
            let tank = f.calibration.tank(&recipe.tank);
            let mut conditions = f.calibration.conditions(&base);
            if let Some(l) = &mut led {
                l.scale = f.calibration.inductance_scale;
                // The present coil on the calibrated field-led model exactly (the factor at
                // the calibrated capacitance).
                match l.conditions_at(&coil, tank.external_capacitance()) {
                    Some((c, _)) => conditions = c,
                    None => led = None,
                }
            }
            let analysis = evaluate_coil(&coil, tank.external_capacitance(), &conditions);
            (tank, conditions, analysis)
        }
        _ => match &mut led {
            // No readings that fit: the measured coil's scale alone, the present coil on the
            // field-led model exactly at it.
            Some(l) if held != 1.0 => {
                l.scale = held;
                match l.conditions_at(&coil, recipe.tank.external_capacitance()) {
                    Some((c, _)) => {
                        let analysis = evaluate_coil(&coil, recipe.tank.external_capacitance(), &c);
                        (recipe.tank, c, analysis)
                    }
                    None => {
                        led = None;
                        (recipe.tank, base, uncalibrated.clone())
                    }
                }
            }
            _ => (recipe.tank, base, uncalibrated.clone()),
        },
    };
    let line = inverse_square_line(&recipe.tank, &readings);
    Ok(Modelled {
        line,
        coil,
        tank,
        conditions,
        analysis,
        classical,
        uncalibrated,
        uncalibrated_conditions: base,
        field: basis,
        led,
        fit,
        measured,
    })
}

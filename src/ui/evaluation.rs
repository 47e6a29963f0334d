//! What the window shows, computed from the recipe only when the recipe changes.
//!
//! The engine does the work (`model::evaluate`, `tuning::solve`); this keeps its answers
//! between frames so an idle frame computes nothing.

use crate::model::{Analysis, Coil, Conditions, InputError, Tank, Winding, evaluate};
use crate::recipe::{Recipe, Target};
use crate::tuning::BandPlan;
use crate::tuning::solve::{self, Unreachable};

/// Channel width assumed for a custom list with fewer than two channels, hertz.
const CUSTOM_CHANNEL_WIDTH: f64 = 100e3;

/// Where the coil stands against its target channel.
#[derive(Clone, Debug, PartialEq)]
pub struct TargetFigures {
    /// The target channel centre, hertz.
    pub channel: f64,
    /// Resonance minus target, hertz.
    pub offset: f64,
    /// Width of one channel of the plan, hertz.
    pub channel_width: f64,
    /// Lowest and highest resonance the trimmer reaches at this spacing, hertz.
    pub window: (f64, f64),
    /// Channels of the plan inside that window, hertz.
    pub in_reach: Vec<f64>,
    /// Coil length that lands on the target at the present trimmer setting, metres.
    pub length_for_target: Result<f64, Unreachable>,
    /// Trimmer setting that lands on the target at the present length, 0–1.
    pub setting_for_target: Result<f64, Unreachable>,
    /// How far the resonance moves per metre of stretch, hertz per metre.
    pub stretch_sensitivity: f64,
}

/// Everything computed for a valid recipe.
#[derive(Clone, Debug, PartialEq)]
pub struct Figures {
    /// The validated coil.
    pub coil: Coil,
    /// The tank it was evaluated in.
    pub tank: Tank,
    /// Every figure of the engine.
    pub analysis: Analysis,
    /// Against the target.
    pub target: TargetFigures,
}

/// Inputs the figures were computed from.
#[derive(Clone, PartialEq)]
struct Inputs {
    winding: Winding,
    tank: Tank,
    conditions: Conditions,
    target: Target,
}

impl Inputs {
    fn of(recipe: &Recipe) -> Self {
        Self {
            winding: recipe.winding,
            tank: recipe.tank,
            conditions: recipe.conditions,
            target: recipe.target.clone(),
        }
    }

    /// Same inputs as `recipe`'s, compared without cloning.
    fn is_of(&self, recipe: &Recipe) -> bool {
        self.winding == recipe.winding
            && self.tank == recipe.tank
            && self.conditions == recipe.conditions
            && self.target == recipe.target
    }
}

/// The cached evaluation of the recipe.
pub struct Evaluation {
    inputs: Inputs,
    current: Result<Figures, InputError>,
    last_good: Option<Figures>,
    plan: BandPlan,
    channels: Vec<f64>,
}

impl Evaluation {
    /// The evaluation of `recipe`.
    pub fn new(recipe: &Recipe) -> Self {
        let inputs = Inputs::of(recipe);
        Self {
            current: compute(&inputs),
            inputs,
            last_good: None,
            plan: recipe.target.plan.clone(),
            channels: recipe.target.plan.channels(),
        }
    }

    /// Recompute if the recipe's coil, tank, conditions or target changed; true if it did.
    pub fn refresh(&mut self, recipe: &Recipe) -> bool {
        if self.plan != recipe.target.plan {
            self.channels = recipe.target.plan.channels();
            self.plan = recipe.target.plan.clone();
        }
        if self.inputs.is_of(recipe) {
            return false;
        }
        let inputs = Inputs::of(recipe);
        let next = compute(&inputs);
        let previous = std::mem::replace(&mut self.current, next);
        match (&self.current, previous) {
            (Ok(_), _) => self.last_good = None,
            (Err(_), Ok(good)) => self.last_good = Some(good),
            (Err(_), Err(_)) => {}
        }
        self.inputs = inputs;
        true
    }

    /// The figures for the recipe as it stands, or the reason it was refused.
    pub fn current(&self) -> Result<&Figures, &InputError> {
        self.current.as_ref()
    }

    /// The figures of the last valid recipe while the present one is refused.
    pub fn last_good(&self) -> Option<&Figures> {
        self.last_good.as_ref()
    }

    /// The present figures if valid, else the last valid ones (for the drawing and charts).
    pub fn latest(&self) -> Option<&Figures> {
        self.current.as_ref().ok().or(self.last_good.as_ref())
    }

    /// Channels of the recipe's band plan, hertz, ascending.
    pub fn channels(&self) -> &[f64] {
        &self.channels
    }
}

/// Width of one channel of `channels` (the smallest spacing), hertz.
pub fn channel_width(channels: &[f64]) -> f64 {
    channels
        .windows(2)
        .map(|w| w[1] - w[0])
        .filter(|d| *d > 0.0)
        .fold(None, |acc: Option<f64>, d| {
            Some(acc.map_or(d, |a| a.min(d)))
        })
        .unwrap_or(CUSTOM_CHANNEL_WIDTH)
}

fn compute(inputs: &Inputs) -> Result<Figures, InputError> {
    let analysis = evaluate(&inputs.winding, &inputs.tank, &inputs.conditions)?;
    let coil = Coil::from_winding(&inputs.winding)?;
    let tank = inputs.tank;
    let conditions = &inputs.conditions;
    let external = tank.external_capacitance();
    let window = solve::trimmer_window(&coil, &tank, conditions);
    let channel = inputs.target.channel;
    let target = TargetFigures {
        channel,
        offset: analysis.resonance - channel,
        channel_width: channel_width(&inputs.target.plan.channels()),
        window,
        in_reach: inputs.target.plan.within(window.0, window.1),
        length_for_target: solve::length_for_target(&coil, external, conditions, channel),
        setting_for_target: solve::setting_for_target(&coil, &tank, conditions, channel),
        stretch_sensitivity: solve::stretch_sensitivity(&coil, external, conditions),
    };
    Ok(Figures {
        coil,
        tank,
        analysis,
        target,
    })
}

//! What the window shows, computed from the recipe only when the recipe changes.
//!
//! The engine does the work ([`crate::recipe::figures_with()`],
//! [`crate::recipe::expectation()`], `tuning::sweep`); this is the one place that keeps its
//! answers between frames — the figures (on the field solution once the worker has it,
//! calibrated once there are bench readings), the target figures, the advice, the charts'
//! sweeps, the spread band around the present curve and the audio panel's figures — so an
//! idle frame computes
//! nothing, and the sweeps are always those of the figures shown (the same coil, tank and
//! conditions).
//!
//! The field solution arrives from a worker thread ([`crate::ui::field_worker`]) some
//! milliseconds after each change. Until it does, the factor it put on the model's inductance
//! for the coil before is held ([`FieldInput::Held`]), so a drag does not flick between the
//! classical model and the field solution on every step; the answer then replaces it.

use crate::model::InputError;
use crate::physics::field::FieldError;
use crate::recipe::same::same;
use crate::recipe::{
    BenchEntry, Expectation, FieldBasis, FieldInput, Figures, Footing, Recipe, StraySettings,
    Target, Unled, expectation, figures_with,
};
use crate::tuning::BandPlan;
use crate::tuning::audio::{AudioFigures, AudioSettings, audio_figures};
use crate::tuning::field_tank::FieldTank;
use crate::tuning::landing::Shape;
use crate::tuning::stage::StageSettings;
use crate::ui::charts::ChartCache;
use crate::ui::charts::Operating;
use crate::ui::charts::modulation::ModulationSweeps;
use crate::ui::field_worker::{FiguresRequest, FiguresResult, ShapeRequest, ShapeResult};

/// What the stage's operating frequency was computed for.
type StageKey = (
    crate::model::Coil,
    crate::model::Tank,
    crate::model::Conditions,
    StageSettings,
);

/// What the audio figures were computed for: the coil, the tank without the junction, the
/// conditions, the settings and the channel's tolerance.
type AudioKey = (
    crate::model::Coil,
    crate::model::Tank,
    crate::model::Conditions,
    AudioSettings,
    f64,
);

/// Inputs the figures were computed from.
#[derive(Clone, PartialEq)]
struct Inputs {
    winding: crate::model::Winding,
    tank: crate::model::Tank,
    conditions: crate::model::Conditions,
    target: Target,
    bench_log: Vec<BenchEntry>,
    stray: StraySettings,
    field: FieldInput,
}

impl Inputs {
    fn of(recipe: &Recipe, field: FieldInput) -> Self {
        Self {
            field,
            winding: recipe.winding,
            tank: recipe.tank,
            conditions: recipe.conditions,
            target: recipe.target.clone(),
            bench_log: recipe.bench_log.clone(),
            stray: recipe.stray_estimate,
        }
    }

    /// Same inputs as `recipe`'s, compared without cloning.
    /// NaN matches NaN (see [`same`]): a refused recipe holding NaN is not recomputed on
    /// every frame.
    fn is_of(&self, recipe: &Recipe, field: &FieldInput) -> bool {
        same(&self.field, field)
            && same(&self.winding, &recipe.winding)
            && same(&self.tank, &recipe.tank)
            && same(&self.conditions, &recipe.conditions)
            && same(&self.target, &recipe.target)
            && same(&self.bench_log, &recipe.bench_log)
            && same(&self.stray, &recipe.stray_estimate)
    }
}

/// The cached evaluation of the recipe.
pub struct Evaluation {
    inputs: Inputs,
    current: Result<Figures, InputError>,
    last_good: Option<Figures>,
    plan: BandPlan,
    channels: Vec<f64>,
    sweeps: ChartCache,
    uncalibrated_sweeps: ChartCache,
    expectation: Option<Expectation>,
    modulation_sweeps: ModulationSweeps,
    /// The oscillator stage kept in the recipe, what its operating frequency was computed
    /// for, and that frequency for the charts.
    stage: Option<(StageKey, Option<Operating>)>,
    /// The audio panel's figures with what they were computed for.
    audio: Option<(AudioKey, AudioFigures)>,
    /// The field shape the charts draw, with what it was solved for (the shape worker's
    /// answer for the figures shown; dropped when they change).
    shape: Option<(ShapeRequest, Shape)>,
    /// The field shape of the model before the bench readings (scale 1 on the field
    /// solution, the recipe's tank), for the "before calibration" curve.
    uncalibrated_shape: Option<(ShapeRequest, Shape)>,
    /// The figures asked of the figures worker, while those shown hold the field solution's
    /// factor at the present coil ([`FieldInput::Held`]) until they arrive.
    pending: Option<FiguresRequest>,
    /// The classical formulas' sweeps (no field solution's factor), drawn dotted for
    /// comparison while the charts are on the field shape.
    classical_sweeps: ChartCache,
    /// A shape lent by another evaluation whose coil this one shows at another length (the
    /// teaching bench's derived copy draws on the window's shape).
    lent_shape: Option<Shape>,
}

impl Evaluation {
    /// The evaluation of `recipe` with `field` (the window's first frame: pending).
    pub fn new(recipe: &Recipe, field: FieldInput) -> Self {
        let inputs = Inputs::of(recipe, field.clone());
        let mut evaluation = Self {
            current: figures_with(recipe, field),
            inputs,
            last_good: None,
            plan: recipe.target.plan.clone(),
            channels: recipe.target.plan.channels(),
            sweeps: ChartCache::default(),
            uncalibrated_sweeps: ChartCache::default(),
            expectation: None,
            modulation_sweeps: ModulationSweeps::default(),
            audio: None,
            stage: None,
            shape: None,
            uncalibrated_shape: None,
            lent_shape: None,
            classical_sweeps: ChartCache::default(),
            pending: None,
        };
        evaluation.refresh_sweeps();
        evaluation.refresh_expectation(recipe);
        evaluation
    }

    /// What to expect of the build, for the figures shown (kept with the last valid ones
    /// while the recipe is refused); its band goes to the spacing chart's sweeps, over the
    /// same lengths as the curves.
    fn refresh_expectation(&mut self, recipe: &Recipe) {
        let Ok(f) = &self.current else {
            return;
        };
        let lengths: Vec<f64> = self
            .sweeps
            .spacing_curves()
            .first()
            .map(|c| c.points.iter().map(|p| p[0]).collect())
            .unwrap_or_default();
        let e = expectation(recipe, f, &lengths);
        self.expectation = Some(e);
        self.apply_band();
    }

    /// Hand the expectation's band to the spacing chart, moved onto the field shape when the
    /// curves are on it ([`band_on_shape`](crate::tuning::sweep::band_on_shape)).
    fn apply_band(&mut self) {
        let (Some(e), Ok(f)) = (&self.expectation, &self.current) else {
            return;
        };
        let band = match self.drawn_shape() {
            Some(shape) => crate::tuning::sweep::band_on_shape(
                &e.band,
                &f.coil,
                f.tank.external_capacitance(),
                &f.conditions,
                shape,
            ),
            None => e.band.clone(),
        };
        self.sweeps.set_band(band, e.calibrated);
    }

    /// Bring the sweeps up to the figures shown (a no-op when they already match).
    fn refresh_sweeps(&mut self) {
        if let Some(f) = self.current.as_ref().ok().or(self.last_good.as_ref()) {
            let shape = self
                .shape
                .as_ref()
                .map(|(_, s)| s)
                .or(self.lent_shape.as_ref());
            self.sweeps
                .refresh_on(&f.coil, &f.tank, &f.conditions, shape);
            if self.shape.is_some() {
                self.classical_sweeps
                    .refresh(&f.coil, &f.tank, &self.inputs.conditions);
            }
            if f.calibrated() {
                self.uncalibrated_sweeps.refresh_on(
                    &f.coil,
                    &self.inputs.tank,
                    &f.uncalibrated_conditions,
                    self.uncalibrated_shape.as_ref().map(|(_, s)| s),
                );
            }
        }
    }

    /// The shape the charts draw: the worker's for these figures, else one lent.
    fn drawn_shape(&self) -> Option<&Shape> {
        self.shape
            .as_ref()
            .map(|(_, s)| s)
            .or(self.lent_shape.as_ref())
    }

    /// The classical formulas' curves for comparison (the recipe's own conditions, no field
    /// solution's factor, on the tank the figures drive), while the charts draw the field
    /// shape solved for these figures.
    pub fn classical_comparison(&self) -> Option<crate::ui::charts::ClassicalComparison<'_>> {
        let f = self.current.as_ref().ok()?;
        self.shape.as_ref()?;
        let coil = &f.coil;
        Some(crate::ui::charts::ClassicalComparison {
            cache: &self.classical_sweeps,
            here: crate::model::evaluate::resonance_of(
                coil,
                f.tank.external_capacitance(),
                &self.inputs.conditions,
            ),
        })
    }

    /// The field shape the charts draw (the worker's answer for the figures shown), for a
    /// derived copy of the coil at another length to carry (the teaching bench).
    pub fn shape(&self) -> Option<&Shape> {
        self.shape.as_ref().map(|(_, s)| s)
    }

    /// Draw the charts on `shape`, solved for the same coil at another length (the window's,
    /// lent to the teaching bench's derived copy, whose own figures carry no field-led model
    /// to ask a worker with); true if the charts changed.
    pub fn lend_shape(&mut self, shape: Option<&Shape>) -> bool {
        if self.lent_shape.as_ref() == shape {
            return false;
        }
        self.lent_shape = shape.cloned();
        self.refresh_sweeps();
        self.apply_band();
        true
    }

    /// What the "before calibration" curve's field shape is to be solved for: the figures'
    /// field-led model at scale 1 on the recipe's tank, while the figures shown are
    /// calibrated and the field solution leads.
    pub fn uncalibrated_shape_request(&self) -> Option<ShapeRequest> {
        let f = self.current.as_ref().ok().filter(|f| f.calibrated())?;
        let Some(led) = f.led else {
            // Kept for this coil and tank while the figures are being landed.
            return self
                .uncalibrated_shape
                .as_ref()
                .filter(|_| self.pending.is_some())
                .map(|(r, _)| *r)
                .filter(|r| r.coil == f.coil && r.tank == self.inputs.tank);
        };
        Some(ShapeRequest {
            led: crate::tuning::landing::FieldLed { scale: 1.0, ..led },
            coil: f.coil,
            tank: self.inputs.tank,
            range: self.uncalibrated_sweeps.length_range_swept(),
        })
    }

    /// Take the worker's answer for the "before calibration" curve's shape; true if the
    /// curve changed.
    pub fn set_uncalibrated_shape(&mut self, answer: Option<&ShapeResult>) -> bool {
        let wanted = self.uncalibrated_shape_request();
        let shape = answer
            .filter(|a| Some(a.request) == wanted)
            .and_then(|a| Some((a.request, a.shape.clone()?)));
        if shape == self.uncalibrated_shape {
            return false;
        }
        self.uncalibrated_shape = shape;
        self.refresh_sweeps();
        true
    }

    /// Whether the "before calibration" curve is on the field shape.
    pub fn uncalibrated_field_shaped(&self) -> bool {
        self.uncalibrated_shape.is_some()
    }

    /// What the charts' field shape is to be solved for: the figures shown when the field
    /// solution leads them (`None` while the classical model leads, an earlier coil's factor
    /// is held, or the recipe is refused).
    pub fn shape_request(&self) -> Option<ShapeRequest> {
        let f = self.current.as_ref().ok()?;
        match f.led {
            Some(led) => Some(ShapeRequest {
                led,
                coil: f.coil,
                tank: f.tank,
                range: self.sweeps.length_range_swept(),
            }),
            // While the figures are being landed, the shape already drawn for this coil and
            // tank is kept (a change of the target alone needs no new shape); failing that,
            // with no readings and no kept measurement the landed figures' field-led model is
            // known already (scale 1 on the recipe's own tank), so the shape is solved beside
            // them rather than after.
            None => {
                let pending = self.pending.as_ref()?;
                let kept = self
                    .shape
                    .as_ref()
                    .map(|(r, _)| *r)
                    .filter(|r| r.coil == f.coil && r.tank == f.tank);
                let r = &pending.recipe;
                kept.or_else(|| {
                    (r.bench_log.is_empty() && r.coil_measurement.is_none()).then(|| ShapeRequest {
                        led: crate::tuning::landing::FieldLed {
                            conditions: r.conditions,
                            scale: 1.0,
                        },
                        coil: f.coil,
                        tank: f.tank,
                        range: self.sweeps.length_range_swept(),
                    })
                })
            }
        }
    }

    /// Take the shape worker's answer: the charts are redrawn on it when it is for the
    /// figures shown ([`shape_request`](Self::shape_request)); true if the charts changed.
    pub fn set_shape(&mut self, answer: Option<&ShapeResult>) -> bool {
        let wanted = self.shape_request();
        let shape = answer
            .filter(|a| Some(a.request) == wanted)
            .and_then(|a| Some((a.request, a.shape.clone()?)));
        if shape == self.shape {
            return false;
        }
        self.shape = shape;
        self.refresh_sweeps();
        self.apply_band();
        true
    }

    /// Whether the charts draw the field shape (else the classical shape through the
    /// present coil: the field solution is off, pending or failed along the chart).
    pub fn field_shaped(&self) -> bool {
        self.drawn_shape().is_some()
    }

    /// What the figures take from the field solution on `footing`, given the worker's
    /// `answer` for the present coil (`None` while it is being computed, or when there is
    /// nothing to ask: the recipe is refused): the answer when there is one; while it is
    /// pending, the factor the figures shown already carry (held); the classical model while
    /// there is none or the footing is classical.
    pub fn field_input(
        &self,
        footing: Footing,
        answer: Option<&Result<FieldTank, FieldError>>,
    ) -> FieldInput {
        match (footing, answer) {
            (Footing::Classical, _) => FieldInput::Unsolved(Unled::SwitchedOff),
            (Footing::FieldSolution, Some(answer)) => FieldInput::Solved(answer.clone()),
            (Footing::FieldSolution, None) => match self.latest().map(|f| &f.field) {
                Some(FieldBasis::Solved { scale, .. } | FieldBasis::Held { scale }) => {
                    FieldInput::Held(*scale)
                }
                _ => FieldInput::Unsolved(Unled::Pending),
            },
        }
    }

    /// Recompute if the recipe's coil, tank, conditions, target or readings changed, or what
    /// the field solution gives (see [`field_input`](Self::field_input)); true if it did.
    pub fn refresh(&mut self, recipe: &Recipe, field: FieldInput) -> bool {
        if self.plan != recipe.target.plan {
            self.channels = recipe.target.plan.channels();
            self.plan = recipe.target.plan.clone();
        }
        if self.inputs.is_of(recipe, &field) {
            return false;
        }
        let inputs = Inputs::of(recipe, field.clone());
        // A field solution's answer lands every figure away from the present coil on field
        // solves: too long for a frame, so the figures worker computes them while the figures
        // shown hold the answer's factor at the present coil (exact there).
        self.pending = None;
        let next = match held_meanwhile(recipe, &field) {
            Some(held) => {
                self.pending = Some(FiguresRequest {
                    recipe: recipe.clone(),
                    field,
                });
                figures_with(recipe, held)
            }
            None => figures_with(recipe, field),
        };
        self.inputs = inputs;
        self.install(next, recipe);
        true
    }

    /// The figures to ask the figures worker for (`None`: the figures shown are complete).
    pub fn figures_request(&self) -> Option<FiguresRequest> {
        self.pending.clone()
    }

    /// Whether the figures shown hold the field solution's factor while the worker computes
    /// them on it (the window marks them "updating").
    pub fn is_updating(&self) -> bool {
        self.pending.is_some()
    }

    /// Take the figures worker's answer: shown when it is for the figures asked (a stale
    /// one is dropped); true if the figures changed.
    pub fn set_figures(&mut self, answer: Option<&FiguresResult>) -> bool {
        let Some(answer) = answer else {
            return false;
        };
        let Some(pending) = &self.pending else {
            return false;
        };
        if !same(&answer.request.recipe, &pending.recipe) || answer.request.field != pending.field {
            return false;
        }
        self.pending = None;
        let recipe = answer.request.recipe.clone();
        self.install(answer.figures.clone(), &recipe);
        true
    }

    /// Show `next` as the figures of `recipe`: the last good ones kept while it is refused,
    /// shapes solved for other figures dropped, the sweeps and expectation brought up to it.
    fn install(&mut self, next: Result<Figures, InputError>, recipe: &Recipe) {
        let previous = std::mem::replace(&mut self.current, next);
        match (&self.current, previous) {
            (Ok(_), _) => self.last_good = None,
            (Err(_), Ok(good)) => self.last_good = Some(good),
            (Err(_), Err(_)) => {}
        }
        // A shape solved for other figures is dropped (the worker is asked again).
        let still = self.current.as_ref().ok().and_then(|f| {
            let (r, _) = self.shape.as_ref()?;
            let led = f.led == Some(r.led) || (f.led.is_none() && self.pending.is_some());
            Some(led && f.coil == r.coil && f.tank == r.tank)
        });
        if still != Some(true) {
            self.shape = None;
        }
        let still = self.current.as_ref().ok().and_then(|f| {
            let (r, _) = self.uncalibrated_shape.as_ref()?;
            let led = match f.led {
                Some(l) => l.conditions == r.led.conditions,
                None => self.pending.is_some(),
            };
            Some(led && f.coil == r.coil && self.inputs.tank == r.tank)
        });
        if still != Some(true) {
            self.uncalibrated_shape = None;
        }
        self.refresh_sweeps();
        self.refresh_expectation(recipe);
    }

    /// Where the build can be expected to land (the stray estimate, the spread before any
    /// measurement, the band after a calibration), for the figures [`latest`](Self::latest)
    /// returns.
    pub fn expectation(&self) -> Option<&Expectation> {
        self.expectation.as_ref()
    }

    /// The charts' sweeps for the figures [`latest`](Self::latest) returns (calibrated once
    /// there are readings).
    pub fn sweeps(&self) -> &ChartCache {
        &self.sweeps
    }

    /// The uncalibrated model's sweeps, when the figures shown are calibrated.
    pub fn uncalibrated_sweeps(&self) -> Option<&ChartCache> {
        self.latest()
            .filter(|f| f.calibrated())
            .map(|_| &self.uncalibrated_sweeps)
    }

    /// The modulation charts' sweeps for the junction `inputs` across `tank` (the tank as
    /// given, without the junction) on the coil shown, recomputed only when the coil, tank,
    /// conditions or inputs change. Kept apart from [`refresh`](Self::refresh): the junction's
    /// inputs are the audio panel's, not the recipe's. `None` while there is no valid coil.
    pub fn modulation_sweeps(
        &mut self,
        tank: &crate::model::Tank,
        conditions: &crate::model::Conditions,
        inputs: &crate::tuning::modulation::ModulationInputs,
    ) -> Option<&ModulationSweeps> {
        let coil = self.latest()?.coil;
        self.modulation_sweeps
            .refresh(&coil, tank, conditions, inputs);
        Some(&self.modulation_sweeps)
    }

    /// The audio panel's figures for its `settings` with the junction across `tank` (the tank
    /// as the figures drive it, without the junction) on the coil shown, judged against
    /// `tolerance` (± hertz): recomputed only when one of these changes. `None` while there is
    /// no valid coil.
    pub fn audio(
        &mut self,
        tank: &crate::model::Tank,
        conditions: &crate::model::Conditions,
        settings: &AudioSettings,
        tolerance: f64,
    ) -> Option<&AudioFigures> {
        let coil = self.latest()?.coil;
        let key: AudioKey = (coil, *tank, *conditions, *settings, tolerance);
        if self.audio.as_ref().is_none_or(|(k, _)| !same(k, &key)) {
            let figures = audio_figures(&coil, tank, conditions, settings, tolerance);
            self.audio = Some((key, figures));
        }
        self.audio.as_ref().map(|(_, f)| f)
    }

    /// Bring the oscillator stage's operating frequency up to the stage `settings` kept in the
    /// recipe round the figures shown (`tuning::stage::analyse`, the function of the stage
    /// panel and `tankwright stage`): recomputed only when the settings or the figures'
    /// coil, tank or conditions change; nothing without a stage kept.
    pub fn refresh_stage(&mut self, settings: Option<&StageSettings>) {
        let Some((settings, f)) = settings.zip(self.latest()) else {
            self.stage = None;
            return;
        };
        let key: StageKey = (f.coil, f.tank, f.conditions, settings.clone());
        if self.stage.as_ref().is_some_and(|(k, _)| same(k, &key)) {
            return;
        }
        let operating = settings
            .inputs()
            .and_then(|i| crate::tuning::stage::analyse(&f.coil, &f.tank, &f.conditions, &i))
            .ok()
            .and_then(|s| {
                let clapp = s.network.clapp.is_some();
                Operating::differing(s.frequency, s.pulling, clapp, f.analysis.resonance)
            });
        self.stage = Some((key, operating));
    }

    /// Where the stage kept in the recipe runs, when it differs from the tank's resonance
    /// (for the charts).
    pub fn operating(&self) -> Option<Operating> {
        self.stage.as_ref().and_then(|(_, o)| *o)
    }

    /// The modulation charts' sweeps as last computed (for tests and captures).
    pub fn modulation_sweeps_shown(&self) -> &ModulationSweeps {
        &self.modulation_sweeps
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

/// What the figures take from the field solution while the figures worker lands them on
/// `field` (`None`: nothing to wait for, compute them at once): for a solution of this coil
/// that the model meets, its factor at the present coil, held (the present coil's figures
/// are then the field solution's, every figure away from it on that one factor).
fn held_meanwhile(recipe: &Recipe, field: &FieldInput) -> Option<FieldInput> {
    if !matches!(field, FieldInput::Solved(Ok(_))) {
        return None;
    }
    let coil = crate::model::Coil::from_winding(&recipe.winding).ok()?;
    match FieldBasis::of(
        &coil,
        recipe.tank.external_capacitance(),
        &recipe.conditions,
        field.clone(),
    ) {
        FieldBasis::Solved { scale, .. } => Some(FieldInput::Held(scale)),
        _ => None,
    }
}

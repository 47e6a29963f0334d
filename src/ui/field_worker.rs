//! Work off the frame: one generic [`Worker`] (a thread of its own per [`Task`]), used three
//! ways.
//! - [`FieldTask`]: the field solution of the present coil (the tank's resonance with the
//!   field-solved apparent inductance, then the impedance sweep for the chart), while the
//!   window shows the classical estimate or the factor held from the coil before.
//! - [`FiguresTask`]: once that answer is in, every figure landed on it
//!   ([`crate::recipe::figures_with`]: the fit at each reading's coil, the length and setting
//!   for the target, the trimmer's reach, the advice, all on field solves), while the window
//!   shows the figures with the answer's factor held at the present coil, marked "updating".
//! - [`ShapeTask`]: the field shape the charts draw
//!   ([`crate::tuning::landing::chart_shape`], some thirty field solves) for the figures
//!   shown, and for the "before calibration" curve, so the curves, their hover and the spread
//!   band follow the field solution along the chart and not only at the present coil; until
//!   it arrives the charts draw the classical shape through the field-solved point.
//!
//! Each change of what a worker is asked starts a new generation. An answer asked for under
//! an older generation is dropped: the thread skips queued requests that are no longer the
//! newest, a task may stop between its parts once `stale()` says so, and the window ignores
//! any answer whose generation is not the present one. A thread ends when the window drops
//! its worker (the request channel closes).

use crate::model::{Coil, Conditions, InputError, Tank};
use crate::physics::field::FieldError;
use crate::recipe::same::same;
use crate::recipe::{FieldInput, Figures, Recipe, figures_with};
use crate::tuning::field_tank::{FieldTank, field_tank};
use crate::tuning::impedance::{ImpedanceSweep, impedance_sweep};
use crate::tuning::landing::{FieldLed, Shape, chart_shape};
use eframe::egui;
use std::sync::Arc;
use std::sync::atomic::{AtomicU64, Ordering};
use std::sync::mpsc::{Receiver, Sender, channel};

/// Frequencies in the chart's sweep (log-spaced from 1 MHz to past the self-resonance).
pub const SWEEP_POINTS: usize = 80;

/// What the field solution is asked for.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct FieldRequest {
    /// The coil as built (validated).
    pub coil: Coil,
    /// Everything across the coil except its own capacitance, farads.
    pub external_capacitance: f64,
    /// Temperature (and the rest, for the classical start).
    pub conditions: Conditions,
}

/// The answer for one request.
#[derive(Clone, Debug, PartialEq)]
pub struct FieldResult {
    /// What was solved.
    pub request: FieldRequest,
    /// The tank with the field-solved apparent inductance.
    pub tank: Result<FieldTank, FieldError>,
    /// Z(f) from 1 MHz to past the self-resonance, with the tank's resonance as the operating
    /// frequency; `None` while it is still being computed (the tank, which the figures need,
    /// is sent first).
    pub sweep: Option<Result<ImpedanceSweep, FieldError>>,
}

impl FieldRequest {
    fn sweep(&self, operating: Option<f64>) -> Result<ImpedanceSweep, FieldError> {
        impedance_sweep(
            &self.coil,
            self.conditions.temperature_c,
            None,
            None,
            SWEEP_POINTS,
            operating,
        )
    }
}

/// A computation the window hands to a thread of its own ([`Worker`]): what it is asked, what
/// it answers, and how.
pub trait Task: 'static {
    /// What it is asked to compute.
    type Request: Clone + PartialEq + std::fmt::Debug + Send + 'static;
    /// What it answers (one or more times per request, the last the whole answer).
    type Answer: Clone + Send + 'static;
    /// The thread's name.
    const NAME: &'static str;
    /// Compute `request`, handing each answer to `send` (false: the window has gone, stop);
    /// `stale()` turns true once a newer request has been asked, and the work may stop there.
    fn run(
        request: &Self::Request,
        stale: &dyn Fn() -> bool,
        send: &mut dyn FnMut(Self::Answer) -> bool,
    );
}

struct Job<R> {
    generation: u64,
    request: R,
    repaint: egui::Context,
}

/// The window's ends of a worker's two channels: requests out, answers (with the generation
/// they were asked under) back.
type Channel<T> = (
    Sender<Job<<T as Task>::Request>>,
    Receiver<(u64, <T as Task>::Answer)>,
);

/// The window's side of a worker thread (see the module's note on generations): the request
/// asked last, and the newest answer for it once one has come. The thread starts with the
/// first request and ends when the worker is dropped (its request channel closes).
pub struct Worker<T: Task> {
    generation: u64,
    newest: Arc<AtomicU64>,
    asked: Option<T::Request>,
    channel: Option<Channel<T>>,
    ready: Option<T::Answer>,
    failed_to_start: bool,
}

impl<T: Task> Default for Worker<T> {
    fn default() -> Self {
        Self {
            generation: 0,
            newest: Arc::default(),
            asked: None,
            channel: None,
            ready: None,
            failed_to_start: false,
        }
    }
}

impl<T: Task> Worker<T> {
    /// Ask for `request` (None: nothing to compute, e.g. the input is refused). A request the
    /// same as the last one asked ([`same`]: NaN matching NaN) is a no-op; any other starts a
    /// new generation and drops what is shown or in flight.
    pub fn ask(&mut self, request: Option<T::Request>, ctx: &egui::Context) {
        let unchanged = match (&request, &self.asked) {
            (Some(a), Some(b)) => same(a, b),
            (None, None) => true,
            _ => false,
        };
        if unchanged {
            return;
        }
        self.generation += 1;
        self.newest.store(self.generation, Ordering::SeqCst);
        self.asked.clone_from(&request);
        self.ready = None;
        let Some(request) = request else {
            return;
        };
        if self.channel.is_none() {
            self.channel = self.start();
        }
        let job = Job {
            generation: self.generation,
            request,
            repaint: ctx.clone(),
        };
        let sent = self
            .channel
            .as_ref()
            .is_some_and(|(jobs, _)| jobs.send(job).is_ok());
        if !sent {
            // No thread (it could not be started, or it stopped): what is shown stays.
            self.channel = None;
            self.failed_to_start = true;
        }
    }

    fn start(&self) -> Option<Channel<T>> {
        let (jobs, inbox) = channel::<Job<T::Request>>();
        let (outbox, done) = channel::<(u64, T::Answer)>();
        let newest = Arc::clone(&self.newest);
        std::thread::Builder::new()
            .name(T::NAME.to_owned())
            .spawn(move || work::<T>(&inbox, &outbox, &newest))
            .ok()
            .map(|_| (jobs, done))
    }

    /// Take any answers the thread has sent; keep the newest for the present generation (a
    /// stale answer is dropped).
    pub fn poll(&mut self) {
        let Some((_, done)) = &self.channel else {
            return;
        };
        while let Ok((generation, answer)) = done.try_recv() {
            if generation == self.generation {
                self.ready = Some(answer);
            }
        }
    }

    /// The newest answer for the present request, once one has arrived.
    pub fn ready(&self) -> Option<&T::Answer> {
        self.ready.as_ref()
    }

    /// The request asked last.
    pub fn asked(&self) -> Option<&T::Request> {
        self.asked.as_ref()
    }

    /// True while an answer for the present request is being computed.
    pub fn is_working(&self) -> bool {
        self.asked.is_some() && self.ready.is_none() && !self.failed_to_start
    }
}

/// The thread: take the newest request, compute it unless a newer one has come, send each
/// answer back and wake the window.
fn work<T: Task>(
    inbox: &Receiver<Job<T::Request>>,
    outbox: &Sender<(u64, T::Answer)>,
    newest: &AtomicU64,
) {
    while let Ok(mut job) = inbox.recv() {
        while let Ok(newer) = inbox.try_recv() {
            job = newer;
        }
        let generation = job.generation;
        let stale = || generation != newest.load(Ordering::SeqCst);
        if stale() {
            continue;
        }
        let mut gone = false;
        T::run(&job.request, &stale, &mut |answer| {
            if outbox.send((generation, answer)).is_err() {
                gone = true;
                return false;
            }
            job.repaint.request_repaint();
            true
        });
        if gone {
            break;
        }
    }
}

/// The field solution of the present coil: the tank first (the figures wait for it), then
/// the chart's impedance sweep.
pub struct FieldTask;

impl Task for FieldTask {
    type Request = FieldRequest;
    type Answer = FieldResult;
    const NAME: &'static str = "tankwright field solution";

    fn run(r: &FieldRequest, stale: &dyn Fn() -> bool, send: &mut dyn FnMut(FieldResult) -> bool) {
        let tank = field_tank(&r.coil, r.external_capacitance, &r.conditions);
        if stale() {
            return;
        }
        let mut result = FieldResult {
            request: *r,
            tank,
            sweep: None,
        };
        if !send(result.clone()) || stale() {
            return;
        }
        result.sweep = Some(r.sweep(result.tank.as_ref().ok().map(|t| t.resonance)));
        send(result);
    }
}

/// The window's side of the field solution's thread.
pub type FieldWorker = Worker<FieldTask>;

/// What the charts' field shape is solved for: the figures' field-led model, coil and tank
/// (calibrated once there are readings), and the lengths the spacing chart sweeps.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct ShapeRequest {
    /// The field-led model of the figures shown ([`crate::recipe::Figures::led`]).
    pub led: FieldLed,
    /// The coil shown.
    pub coil: Coil,
    /// The tank that drives the figures.
    pub tank: Tank,
    /// The spacing chart's lengths, metres (shortest, longest).
    pub range: (f64, f64),
}

/// The shape for one request: `None` when the field solution failed along the chart (the
/// classical shape then stays drawn).
#[derive(Clone, Debug, PartialEq)]
pub struct ShapeResult {
    /// What was solved.
    pub request: ShapeRequest,
    /// The field shape over the chart's lengths.
    pub shape: Option<Shape>,
}

/// The charts' field shape for the figures shown ([`chart_shape`], some thirty field
/// solves).
pub struct ShapeTask;

impl Task for ShapeTask {
    type Request = ShapeRequest;
    type Answer = ShapeResult;
    const NAME: &'static str = "tankwright field shape";

    fn run(r: &ShapeRequest, _stale: &dyn Fn() -> bool, send: &mut dyn FnMut(ShapeResult) -> bool) {
        let shape = chart_shape(&r.led, &r.coil, &r.tank, r.range);
        send(ShapeResult { request: *r, shape });
    }
}

/// The window's side of a field shape's thread.
pub type ShapeWorker = Worker<ShapeTask>;

/// What the figures are computed for off the frame: the recipe (with whatever the window
/// counts across the tank) and the field solution's answer for its coil. Computing them
/// lands every figure away from the present coil on field solves (the fit at each reading's
/// coil, the length and setting for the target, the trimmer's reach, the advice), too long
/// for a frame; the window shows the figures with the answer's factor held meanwhile.
#[derive(Clone, Debug, PartialEq)]
pub struct FiguresRequest {
    /// The recipe as the figures see it.
    pub recipe: Recipe,
    /// The field solution's answer for its coil.
    pub field: FieldInput,
}

/// The figures for one request.
#[derive(Clone, Debug)]
pub struct FiguresResult {
    /// What was computed.
    pub request: FiguresRequest,
    /// [`figures_with`] of it.
    pub figures: Result<Figures, InputError>,
}

/// Every figure of a recipe on its field solution ([`figures_with`]).
pub struct FiguresTask;

impl Task for FiguresTask {
    type Request = FiguresRequest;
    type Answer = FiguresResult;
    const NAME: &'static str = "tankwright figures";

    fn run(
        r: &FiguresRequest,
        _stale: &dyn Fn() -> bool,
        send: &mut dyn FnMut(FiguresResult) -> bool,
    ) {
        let figures = figures_with(&r.recipe, r.field.clone());
        send(FiguresResult {
            request: r.clone(),
            figures,
        });
    }
}

/// The window's side of the figures' thread.
pub type FiguresWorker = Worker<FiguresTask>;

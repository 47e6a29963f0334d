//! The field solution off the frame: a thread of its own solves the coil from its own currents
//! (the tank's resonance with the field-solved apparent inductance, and the impedance sweep
//! for the chart) while the window shows the classical estimate; the answer replaces the
//! estimate when it arrives.
//!
//! A second thread ([`ShapeWorker`]) then solves the field shape the charts draw
//! ([`crate::tuning::landing::chart_shape`], some thirty field solves) for the figures shown,
//! so the curves, their hover and the spread band follow the field solution along the chart
//! and not only at the present coil; until it arrives the charts draw the classical shape
//! through the field-solved point.
//!
//! Each change of the coil, tank capacitance or conditions starts a new generation. A
//! solution asked for under an older generation is dropped: the thread skips queued requests
//! that are no longer the newest, checks again between its two parts, and the window ignores
//! any answer whose generation is not the present one. The thread ends when the window drops
//! the worker (its request channel closes).

use crate::model::{Coil, Conditions, Tank};
use crate::physics::field::FieldError;
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

struct Job {
    generation: u64,
    request: FieldRequest,
    repaint: egui::Context,
}

struct Done {
    generation: u64,
    result: FieldResult,
}

/// The window's side of the worker thread.
#[derive(Default)]
pub struct FieldWorker {
    generation: u64,
    newest: Arc<AtomicU64>,
    asked: Option<FieldRequest>,
    channel: Option<(Sender<Job>, Receiver<Done>)>,
    ready: Option<FieldResult>,
    failed_to_start: bool,
}

impl FieldWorker {
    /// Ask for `request` (None: nothing to solve, e.g. the input is refused). A request equal
    /// to the last one asked is a no-op; any other starts a new generation and drops what is
    /// shown or in flight.
    pub fn ask(&mut self, request: Option<FieldRequest>, ctx: &egui::Context) {
        if request == self.asked {
            return;
        }
        self.generation += 1;
        self.newest.store(self.generation, Ordering::SeqCst);
        self.asked = request;
        self.ready = None;
        let Some(request) = request else {
            return;
        };
        let job = Job {
            generation: self.generation,
            request,
            repaint: ctx.clone(),
        };
        if self.channel.is_none() {
            self.channel = self.start();
        }
        let sent = self
            .channel
            .as_ref()
            .is_some_and(|(jobs, _)| jobs.send(job).is_ok());
        if !sent {
            // No thread (it could not be started, or it stopped): the estimate stays shown.
            self.channel = None;
            self.failed_to_start = true;
        }
    }

    fn start(&mut self) -> Option<(Sender<Job>, Receiver<Done>)> {
        let (jobs, inbox) = channel::<Job>();
        let (outbox, done) = channel::<Done>();
        let newest = Arc::clone(&self.newest);
        std::thread::Builder::new()
            .name("tankwright field solution".to_owned())
            .spawn(move || work(&inbox, &outbox, &newest))
            .ok()
            .map(|_| (jobs, done))
    }

    /// Take any answers the thread has sent; keep the newest for the present generation (the
    /// tank alone, then the tank with its sweep).
    pub fn poll(&mut self) {
        let Some((_, done)) = &self.channel else {
            return;
        };
        while let Ok(d) = done.try_recv() {
            if d.generation == self.generation && Some(d.result.request) == self.asked {
                self.ready = Some(d.result);
            }
        }
    }

    /// The field solution of the present request, once it has arrived.
    pub fn ready(&self) -> Option<&FieldResult> {
        self.ready.as_ref()
    }

    /// True while a solution for the present request is being computed.
    pub fn is_working(&self) -> bool {
        self.asked.is_some() && self.ready.is_none() && !self.failed_to_start
    }
}

/// The thread: take the newest request, solve it unless a newer one has come, send it back.
fn work(inbox: &Receiver<Job>, outbox: &Sender<Done>, newest: &AtomicU64) {
    while let Ok(mut job) = inbox.recv() {
        while let Ok(newer) = inbox.try_recv() {
            job = newer;
        }
        let stale = || job.generation != newest.load(Ordering::SeqCst);
        if stale() {
            continue;
        }
        let r = &job.request;
        let tank = field_tank(&r.coil, r.external_capacitance, &r.conditions);
        if stale() {
            continue;
        }
        // The tank first: the figures wait for it; the chart's sweep follows.
        let mut result = FieldResult {
            request: *r,
            tank,
            sweep: None,
        };
        if !send(outbox, &job, result.clone()) {
            break;
        }
        if stale() {
            continue;
        }
        result.sweep = Some(r.sweep(result.tank.as_ref().ok().map(|t| t.resonance)));
        if !send(outbox, &job, result) {
            break;
        }
    }
}

/// Send `result` for `job` and wake the window; false when the window has gone.
fn send(outbox: &Sender<Done>, job: &Job, result: FieldResult) -> bool {
    let sent = outbox
        .send(Done {
            generation: job.generation,
            result,
        })
        .is_ok();
    if sent {
        job.repaint.request_repaint();
    }
    sent
}

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

/// A shape answer with the generation it was asked under.
type ShapeDone = (u64, ShapeResult);

struct ShapeJob {
    generation: u64,
    request: ShapeRequest,
    repaint: egui::Context,
}

/// The window's side of the thread that solves the charts' field shape: the same
/// generations as [`FieldWorker`] (a request for figures that have since changed is
/// skipped, an answer for them ignored).
#[derive(Default)]
pub struct ShapeWorker {
    generation: u64,
    newest: Arc<AtomicU64>,
    asked: Option<ShapeRequest>,
    channel: Option<(Sender<ShapeJob>, Receiver<ShapeDone>)>,
    ready: Option<ShapeResult>,
}

impl ShapeWorker {
    /// Ask for the shape of `request` (None: nothing to solve, e.g. the classical model
    /// leads); a request equal to the last one asked is a no-op.
    pub fn ask(&mut self, request: Option<ShapeRequest>, ctx: &egui::Context) {
        if request == self.asked {
            return;
        }
        self.generation += 1;
        self.newest.store(self.generation, Ordering::SeqCst);
        self.asked = request;
        self.ready = None;
        let Some(request) = request else {
            return;
        };
        if self.channel.is_none() {
            let (jobs, inbox) = channel::<ShapeJob>();
            let (outbox, done) = channel();
            let newest = Arc::clone(&self.newest);
            self.channel = std::thread::Builder::new()
                .name("tankwright field shape".to_owned())
                .spawn(move || shape_work(&inbox, &outbox, &newest))
                .ok()
                .map(|_| (jobs, done));
        }
        let job = ShapeJob {
            generation: self.generation,
            request,
            repaint: ctx.clone(),
        };
        let sent = self
            .channel
            .as_ref()
            .is_some_and(|(jobs, _)| jobs.send(job).is_ok());
        if !sent {
            // No thread: the classical shape stays drawn.
            self.channel = None;
        }
    }

    /// Take any answer the thread has sent for the present request.
    pub fn poll(&mut self) {
        let Some((_, done)) = &self.channel else {
            return;
        };
        while let Ok((generation, result)) = done.try_recv() {
            if generation == self.generation && Some(result.request) == self.asked {
                self.ready = Some(result);
            }
        }
    }

    /// The shape of the present request, once it has arrived.
    pub fn ready(&self) -> Option<&ShapeResult> {
        self.ready.as_ref()
    }
}

/// The shape thread: take the newest request, solve it unless a newer one has come.
fn shape_work(inbox: &Receiver<ShapeJob>, outbox: &Sender<(u64, ShapeResult)>, newest: &AtomicU64) {
    while let Ok(mut job) = inbox.recv() {
        while let Ok(newer) = inbox.try_recv() {
            job = newer;
        }
        if job.generation != newest.load(Ordering::SeqCst) {
            continue;
        }
        let r = &job.request;
        let shape = chart_shape(&r.led, &r.coil, &r.tank, r.range);
        let result = ShapeResult { request: *r, shape };
        if outbox.send((job.generation, result)).is_err() {
            break;
        }
        job.repaint.request_repaint();
    }
}

//! Cost of one headless frame of the whole window: `egui::Context::run_ui` over the full
//! window (panels, widgets, coil drawing and charts) at 1280×800 points.
//!
//! `ui_frame/after_change`: the recipe's turns flip between two values before each frame, so
//! the frame re-evaluates the coil, re-solves the target figures and re-sweeps the charts.
//! `ui_frame/after_change_classical`: the same with the field solution switched off (no
//! worker thread solving each new coil on the other core, no second evaluation when its
//! answer comes), for comparison in the same run.
//! `ui_frame/idle`: nothing changes; the caches hold and only layout is left.
//! Budgets: 3 ms after a change, 0.5 ms idle.
//! `ui_frame/idle_tessellated` adds turning the frame's shapes into meshes, which the window
//! also does before painting (no budget; for the record).

use criterion::{Criterion, criterion_group};
use std::hint::black_box;
use tankwright::recipe::Recipe;
use tankwright::ui::App;

/// The window size the frame is laid out for, points.
const SIZE: egui::Vec2 = egui::vec2(1280.0, 800.0);

/// A frame clock: input for the next frame, 1/60 s after the last.
struct Clock {
    time: f64,
}

impl Clock {
    fn next(&mut self) -> egui::RawInput {
        self.time += 1.0 / 60.0;
        egui::RawInput {
            screen_rect: Some(egui::Rect::from_min_size(egui::Pos2::ZERO, SIZE)),
            time: Some(self.time),
            predicted_dt: 1.0 / 60.0,
            ..Default::default()
        }
    }
}

/// Run one frame; returns the number of shapes it drew.
fn frame(ctx: &egui::Context, app: &mut App, input: egui::RawInput) -> usize {
    ctx.run_ui(input, |ui| app.show(ui)).shapes.len()
}

/// Run one frame and tessellate its shapes, as the window would before painting.
fn painted_frame(ctx: &egui::Context, app: &mut App, input: egui::RawInput) -> usize {
    let output = ctx.run_ui(input, |ui| app.show(ui));
    ctx.tessellate(output.shapes, output.pixels_per_point).len()
}

/// A context and app that have settled (fonts loaded, grids sized, caches filled).
fn settled() -> (egui::Context, App, Clock) {
    settled_with(true)
}

/// The same, with the field solution on or off.
fn settled_with(field_solution: bool) -> (egui::Context, App, Clock) {
    let ctx = egui::Context::default();
    let mut app = App::with_recipe(Recipe::demo()).with_field_solution(field_solution);
    let mut clock = Clock { time: 0.0 };
    for _ in 0..5 {
        frame(&ctx, &mut app, clock.next());
    }
    (ctx, app, clock)
}

fn ui_frame(c: &mut Criterion) {
    let mut group = c.benchmark_group("ui_frame");

    for (name, field_solution) in [("after_change", true), ("after_change_classical", false)] {
        let (ctx, mut app, mut clock) = settled_with(field_solution);
        let mut flip = false;
        group.bench_function(name, |b| {
            b.iter(|| {
                flip = !flip;
                app.recipe_mut().winding.turns = if flip { 5.25 } else { 5.0 };
                black_box(frame(&ctx, &mut app, clock.next()))
            });
        });
    }

    let (ctx, mut app, mut clock) = settled();
    group.bench_function("idle", |b| {
        b.iter(|| black_box(frame(&ctx, &mut app, clock.next())));
    });

    let (ctx, mut app, mut clock) = settled();
    group.bench_function("idle_tessellated", |b| {
        b.iter(|| black_box(painted_frame(&ctx, &mut app, clock.next())));
    });

    group.finish();
}

criterion_group!(benches, ui_frame);

//! Engine benchmarks: one full evaluation, and the 50-turn filament sum.
//!
//! Run with `cargo bench --bench perf` (one binary; names after `--` filter). Budget (2-core CI
//! machine): `evaluate_point` at most 100 ns median.

use criterion::{Criterion, criterion_group};
use std::hint::black_box;
use tankwright::model::{
    Coating, Coil, Conditions, DiameterSpec, Gauge, SpacingSpec, Tank, Winding, WireSpec, evaluate,
    evaluate::resonance_of, evaluate_coil,
};
use tankwright::physics::{filament, helix, medhurst, nagaoka, proximity, round_wire};

fn demo_winding() -> Winding {
    Winding {
        diameter: DiameterSpec::Former(6e-3),
        wire: WireSpec {
            gauge: Gauge::Metric(1e-3),
            coating: Coating::Bare,
        },
        turns: 5.0,
        spacing: SpacingSpec::Length(8e-3),
        lead_length: 5e-3,
    }
}

fn engine(c: &mut Criterion) {
    let w = demo_winding();
    let t = Tank::fixed_only(20e-12, 6e-12);
    // All models but the filament sum.
    let cond = Conditions {
        filament_sum: false,
        ..Conditions::default()
    };
    c.bench_function("evaluate_point", |b| {
        b.iter(|| evaluate(black_box(&w), black_box(&t), black_box(&cond)))
    });
    c.bench_function("filament_sum_50", |b| {
        b.iter(|| filament::filament_sum(black_box(50.0), 5e-3, 1.2e-3, 0.5e-3, 0.02))
    });
}

/// The parts of `evaluate_point`, to see where its time goes (no budgets of their own):
/// `latency` chains each evaluation on the last; `evaluate_by_ref` observes the result by
/// reference instead of moving the ~340-byte value out (the move is the harness's cost);
/// `resonance_of` is the frequency-only path the sweeps and charts call.
fn parts(c: &mut Criterion) {
    let w = demo_winding();
    let cond = Conditions {
        filament_sum: false,
        ..Conditions::default()
    };
    let coil = Coil::from_winding(&w).expect("demo winding is valid");
    let mut g = c.benchmark_group("parts");
    g.bench_function("latency", |b| {
        let mut tank = Tank::fixed_only(20e-12, 6e-12);
        b.iter(|| {
            let a = evaluate(&w, &tank, &cond).expect("valid");
            // Feed the result back (adding zero) so that each evaluation waits for the last.
            tank.stray = 6e-12 + a.resonance * 0.0;
            a.q
        })
    });
    g.bench_function("evaluate_by_ref", |b| {
        let t = Tank::fixed_only(20e-12, 6e-12);
        b.iter(|| {
            let a = evaluate(black_box(&w), black_box(&t), black_box(&cond));
            black_box(&a);
        })
    });
    g.bench_function("resonance_of", |b| {
        b.iter(|| resonance_of(black_box(&coil), black_box(26e-12), black_box(&cond)))
    });
    g.bench_function("validate", |b| b.iter(|| Coil::from_winding(black_box(&w))));
    g.bench_function("evaluate_coil", |b| {
        b.iter(|| evaluate_coil(black_box(&coil), black_box(26e-12), black_box(&cond)))
    });
    g.bench_function("nagaoka_sheet", |b| {
        b.iter(|| nagaoka::sheet(black_box(7e-3), black_box(8e-3), black_box(5.0)))
    });
    g.bench_function("lundin", |b| {
        b.iter(|| nagaoka::coefficient_lundin(black_box(0.875)))
    });
    g.bench_function("helical_self_resonance", |b| {
        b.iter(|| {
            helix::helical_self_resonance(black_box(7e-3), black_box(1.6e-3), black_box(8e-3))
        })
    });
    g.bench_function("medhurst", |b| b.iter(|| medhurst::factor(black_box(1.14))));
    g.bench_function("k_m", |b| b.iter(|| round_wire::k_m(black_box(5.0))));
    g.bench_function("proximity", |b| {
        b.iter(|| proximity::wall_proximity_factor(black_box(1.6)))
    });
    g.finish();
}

/// The bench loop: calibrating on three readings (stray and inductance scale by least
/// squares) and solving the demo for a target by the bracketing length solver.
fn bench_loop(c: &mut Criterion) {
    let r = tankwright::recipe::Recipe::demo();
    let coil = Coil::from_winding(&r.winding).expect("demo winding is valid");
    let truth = tankwright::tuning::fit::Calibration {
        extra_capacitance: 1.2e-12,
        inductance_scale: 1.03,
    };
    let readings: Vec<tankwright::tuning::fit::Reading> = [0.0, 0.5, 1.0]
        .into_iter()
        .map(|setting| {
            let f = resonance_of(
                &coil,
                truth.tank(&r.tank).external_capacitance_at(setting),
                &truth.conditions(&r.conditions),
            );
            tankwright::tuning::fit::Reading {
                include_anyway: false,
                measured: f,
                length: coil.length(),
                trimmer_setting: setting,
                added_capacitance: 0.0,
                error_ppm: Some(5.0),
                added_tolerance: None,
            }
        })
        .collect();
    c.bench_function("fit_3_readings", |b| {
        b.iter(|| {
            tankwright::tuning::fit::fit(
                black_box(&coil),
                black_box(&r.tank),
                &r.conditions,
                black_box(&readings),
            )
        })
    });
    let external = r.tank.external_capacitance();
    c.bench_function("solve_target", |b| {
        b.iter(|| {
            tankwright::tuning::solve::length_for_target(
                black_box(&coil),
                black_box(external),
                &r.conditions,
                black_box(101.1e6),
            )
        })
    });
}

criterion_group!(benches, engine, parts, bench_loop);

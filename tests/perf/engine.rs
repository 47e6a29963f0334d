//! Engine benchmarks: one full evaluation, and the 50-turn filament sum.
//!
//! Run with `cargo bench --bench engine`. Budget (2-core CI machine): `evaluate_point` at most
//! 100 ns median.

use criterion::{Criterion, criterion_group, criterion_main};
use std::hint::black_box;
use tankwright::model::{
    Coating, Conditions, DiameterSpec, Gauge, SpacingSpec, Tank, Winding, WireSpec, evaluate,
};
use tankwright::physics::filament;

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

criterion_group!(benches, engine);
criterion_main!(benches);

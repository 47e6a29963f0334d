//! Sweep benchmarks: the batch resonance path and the spread band as the chart draws it.
//!
//! Run with `cargo bench --bench perf` (one binary; names after `--` filter). Budgets (2-core
//! project machine): `sweep_batch` per element at most 1/10 of the numpy/scipy peer's per-element
//! time for the same resonance path, measured in the same sitting; `spread_band` (1000 draws over
//! the chart's 240 lengths, percentiles included) within one 60 Hz frame, 16.7 ms, on one core.
//!
//! The coil is the peer's: mean diameter 7 mm, 5 turns of 1 mm wire, 5 mm leads, 25 pF, over
//! 1000 lengths from 5.2 to 28 mm.

use criterion::{Criterion, Throughput, criterion_group};
use std::hint::black_box;
use tankwright::model::batch::{SweepColumns, resonance_over_lengths};
use tankwright::model::evaluate::resonance_of;
use tankwright::model::{
    Coating, Coil, Conditions, DiameterSpec, Gauge, SpacingSpec, Winding, WireSpec,
};
use tankwright::tuning::spread::{TankParts, Tolerances, spread_band};
use tankwright::tuning::stray::Span;

fn peer_coil() -> Coil {
    Coil::from_winding(&Winding {
        diameter: DiameterSpec::Mean(7e-3),
        wire: WireSpec {
            gauge: Gauge::Metric(1e-3),
            coating: Coating::Bare,
        },
        turns: 5.0,
        spacing: SpacingSpec::Length(8e-3),
        lead_length: 5e-3,
    })
    .expect("the peer's coil is valid")
}

fn lengths(n: usize, lo: f64, hi: f64) -> Vec<f64> {
    (0..n)
        .map(|i| lo + (hi - lo) * i as f64 / (n - 1) as f64)
        .collect()
}

fn sweep(c: &mut Criterion) {
    let coil = peer_coil();
    let cond = Conditions {
        filament_sum: false,
        ..Conditions::default()
    };
    let ls = lengths(1000, 5.2e-3, 28e-3);
    let mut out = vec![0.0; ls.len()];
    let mut columns = SweepColumns::default();
    let mut g = c.benchmark_group("sweep");
    g.throughput(Throughput::Elements(ls.len() as u64));
    g.bench_function("sweep_batch", |b| {
        b.iter(|| {
            resonance_over_lengths(
                black_box(&coil),
                black_box(25e-12),
                &cond,
                black_box(&ls),
                &mut out,
                &mut columns,
            );
            black_box(&out);
        })
    });
    // The per-point path over the same lengths, for the ratio.
    g.bench_function("sweep_per_point", |b| {
        b.iter(|| {
            for (f, &l) in out.iter_mut().zip(&ls) {
                *f = resonance_of(&coil.with_length(black_box(l)).unwrap(), 25e-12, &cond);
            }
            black_box(&out);
        })
    });
    g.finish();

    let tolerances = Tolerances {
        former_diameter: 0.1e-3,
        length: 0.5e-3,
        wire_diameter: 0.02e-3,
        turns: 0.25,
        fixed_fraction: 0.05,
        stray: Span::new(3e-12, 5e-12, 8e-12),
    };
    let tank = TankParts {
        fixed: 15e-12,
        other: 5e-12,
    };
    // The chart's 240 lengths from close-wound to four times that.
    let close = coil.turns() * coil.wire_overall();
    let chart = lengths(240, close, 4.0 * close);
    c.bench_function("spread_band", |b| {
        b.iter(|| {
            spread_band(
                black_box(&coil),
                &tank,
                &cond,
                &tolerances,
                black_box(&chart),
                1000,
                1,
            )
        })
    });
}

/// Where `spread_band`'s time goes (no budgets): the two percentiles of one length's 1000
/// draws, as the band takes them for each of its 240 lengths.
fn parts(c: &mut Criterion) {
    let mut g = c.benchmark_group("parts");
    // 1000 values in a scrambled order, like one length's draws.
    let values: Vec<f64> = (0..1000u64)
        .map(|i| ((i * 7919) % 1000) as f64 * 1e3 + 98e6)
        .collect();
    let mut column = values.clone();
    g.bench_function("band_percentiles_one_length", |b| {
        b.iter(|| {
            column.copy_from_slice(&values);
            let high = *column.select_nth_unstable_by(975, f64::total_cmp).1;
            let low = *column[..975].select_nth_unstable_by(25, f64::total_cmp).1;
            black_box((low, high))
        })
    });
    g.finish();
}

/// The design search over 5 formers × 4 wires × 12 fixed capacitors × 3 trimmers for
/// 98.7 MHz (`tuning::design::search`; budget 2 s on one core), by the batch path and by the
/// plain per-candidate loop (the per-point path at each length), for the ratio.
fn design(c: &mut Criterion) {
    use tankwright::tuning::construction::Construction;
    use tankwright::tuning::design::parts::{PartsOnHand, TrimmerPart, e_series_between};
    use tankwright::tuning::design::{DesignSettings, Method, plan_for, search};
    use tankwright::tuning::verdict::Aim;
    let wire = |d: f64| WireSpec {
        gauge: Gauge::Metric(d * 1e-3),
        coating: Coating::Bare,
    };
    let trimmer = |a: f64, b: f64| TrimmerPart {
        min: a * 1e-12,
        max: b * 1e-12,
    };
    let parts = PartsOnHand {
        formers: [5.0, 6.0, 7.0, 8.0, 10.0].map(|d| d * 1e-3).to_vec(),
        wires: [0.6, 0.8, 1.0, 1.25].map(wire).to_vec(),
        fixed: e_series_between(12, 10.0, 82.0)
            .expect("E12")
            .into_iter()
            .map(|v| v * 1e-12)
            .collect(),
        trimmers: vec![trimmer(2.0, 10.0), trimmer(4.0, 20.0), trimmer(6.0, 30.0)],
        lead_length: 5e-3,
        construction: Construction::CopperClad,
    };
    assert_eq!(parts.combinations(), 5 * 4 * 12 * 3);
    let aim = Aim::new(plan_for(98.7e6), Some(98.7e6));
    let mut g = c.benchmark_group("design");
    g.sample_size(10);
    // `screen_only_*`: no candidate confirmed (count 0), so the field solves left are the
    // three per former and wire that move the screen onto the field solution.
    for (name, method, count) in [
        ("search_5x4x12x3_batch", Method::Batch, 5),
        ("search_5x4x12x3_per_candidate", Method::PerCandidate, 5),
        ("screen_only_5x4x12x3_batch", Method::Batch, 0),
        (
            "screen_only_5x4x12x3_per_candidate",
            Method::PerCandidate,
            0,
        ),
    ] {
        let settings = DesignSettings {
            method,
            count,
            ..DesignSettings::default()
        };
        g.bench_function(name, |b| {
            b.iter(|| black_box(search(&parts, &aim, &settings).expect("accepted")))
        });
    }
    g.finish();
}

criterion_group!(benches, sweep, parts, design);

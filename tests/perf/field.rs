//! Field-solution benchmarks: the first parallel self-resonance of the demo coil (5 turns,
//! 7 mm mean diameter, 1 mm wire, 8 mm long, 5 mm leads) solved from scratch.
//!
//! Run with `cargo bench --bench perf` (one binary; names after `--` filter). Budget (one core of
//! the 2-core project machine): `field_solve_srf` at most 200 ms median. Its peers in the same run,
//! `field_parts/…`, show where the time goes: the frequency-independent integrals
//! (`static_integrals`) and one frequency's fill and factorisation (`one_frequency`); the resonance
//! search costs about a dozen of the latter. `field_solve_srf_leads/…` is the same coil on 30, 50
//! and 200 mm leads (graded straight segments keep the count bounded; same budget), and
//! `field_tank_resonance` the 22 pF tank's resonance solved with the field-solved apparent
//! inductance (the figure `evaluate` and the window's worker compute; same budget).

use criterion::{Criterion, criterion_group};
use std::hint::black_box;
use std::time::Duration;
use tankwright::model::{
    Coating, Coil, DiameterSpec, Gauge, SpacingSpec, Winding, WireSpec, wire_coil,
};
use tankwright::physics::field::{Feed, FieldModel, WireCoil};

fn demo_wire() -> WireCoil {
    wire_with_leads(5e-3)
}

/// The demo coil with leads of `lead` metres each.
fn wire_with_leads(lead: f64) -> WireCoil {
    wire_coil(&coil_with_leads(lead), 20.0)
}

fn demo_coil() -> Coil {
    coil_with_leads(5e-3)
}

fn coil_with_leads(lead: f64) -> Coil {
    let winding = Winding {
        diameter: DiameterSpec::Former(6e-3),
        wire: WireSpec {
            gauge: Gauge::Metric(1e-3),
            coating: Coating::Bare,
        },
        turns: 5.0,
        spacing: SpacingSpec::Length(8e-3),
        lead_length: lead,
    };
    Coil::from_winding(&winding).expect("demo winding is valid")
}

fn field(c: &mut Criterion) {
    let wire = demo_wire();
    let per_turn = wire.segments_per_turn();
    c.bench_function("field_solve_srf", |b| {
        b.iter(|| {
            FieldModel::new(black_box(&wire), per_turn, Feed::Terminals)
                .and_then(|m| m.first_resonance())
                .expect("demo coil resonates")
        })
    });
    // Long leads (30, 50 and 200 mm): cut in graded segments, so the count stays bounded and
    // the self-resonance stays within the budget.
    let mut long = c.benchmark_group("field_solve_srf_leads");
    for lead_mm in [30u32, 50, 200] {
        let wire = wire_with_leads(f64::from(lead_mm) * 1e-3);
        long.bench_function(format!("{lead_mm}mm"), |b| {
            b.iter(|| {
                FieldModel::new(black_box(&wire), per_turn, Feed::Terminals)
                    .and_then(|m| m.first_resonance())
                    .expect("the coil resonates")
            })
        });
    }
    long.finish();
    // The tank's resonance with the field-solved apparent inductance (what evaluate and the
    // window's worker compute), the demo tank of 22 pF.
    let coil = demo_coil();
    c.bench_function("field_tank_resonance", |b| {
        b.iter(|| {
            tankwright::tuning::field_tank::field_tank(
                black_box(&coil),
                22e-12,
                &tankwright::model::Conditions::default(),
            )
            .expect("the demo tank resonates")
        })
    });
    let mut g = c.benchmark_group("field_parts");
    g.bench_function("static_integrals", |b| {
        b.iter(|| FieldModel::new(black_box(&wire), per_turn, Feed::Terminals).expect("model"))
    });
    let model = FieldModel::new(&wire, per_turn, Feed::Terminals).expect("model");
    g.bench_function("one_frequency", |b| {
        b.iter(|| model.impedance(black_box(100e6)).expect("impedance"))
    });
    g.finish();
}

criterion_group! {
    name = benches;
    config = Criterion::default().sample_size(10).measurement_time(Duration::from_secs(3));
    targets = field
}

//! The benchmarks, one binary (each was a binary of its own; one link instead of four keeps
//! CI's build short). Run them all with `cargo bench --bench perf`, or a group by name, e.g.
//! `cargo bench --bench perf -- field_solve_srf`. Budgets and measured medians:
//! tests/perf/README.md.

mod engine;
mod field;
mod sweep;
mod ui_frame;

criterion::criterion_main!(
    engine::benches,
    field::benches,
    sweep::benches,
    ui_frame::benches
);

//! Self-capacitance of a single-layer solenoid by Medhurst's table.
//!
//! R. G. Medhurst, "H.F. resistance and self-capacitance of single-layer solenoids",
//! Wireless Engineer 24 (1947) pp. 35–43 and 80–92: C_self = H·D pF with D the diameter in cm,
//! measured on coils standing on one end; about ±5 % claimed.

/// Medhurst's table: (l/D, H), Medhurst 1947 (above). A second-hand transcription, not re-read
/// against the paper.
const TABLE: [(f64, f64); 33] = [
    (0.1, 0.96),
    (0.15, 0.79),
    (0.2, 0.70),
    (0.25, 0.64),
    (0.3, 0.60),
    (0.35, 0.57),
    (0.4, 0.54),
    (0.45, 0.52),
    (0.5, 0.50),
    (0.6, 0.48),
    (0.7, 0.47),
    (0.8, 0.46),
    (0.9, 0.46),
    (1.0, 0.46),
    (1.5, 0.47),
    (2.0, 0.50),
    (2.5, 0.56),
    (3.0, 0.61),
    (3.5, 0.67),
    (4.0, 0.72),
    (4.5, 0.77),
    (5.0, 0.81),
    (6.0, 0.92),
    (7.0, 1.01),
    (8.0, 1.12),
    (9.0, 1.22),
    (10.0, 1.32),
    (15.0, 1.86),
    (20.0, 2.36),
    (25.0, 2.9),
    (30.0, 3.4),
    (40.0, 4.6),
    (50.0, 5.8),
];

/// Shortest l/D in Medhurst's table.
pub const MIN_LENGTH_OVER_DIAMETER: f64 = 0.1;
/// Longest l/D in Medhurst's table.
pub const MAX_LENGTH_OVER_DIAMETER: f64 = 50.0;

/// Medhurst's factor H (pF per cm of diameter) for a coil of shape `length_over_diameter`.
///
/// # Formula
/// Linear interpolation in ln(l/D) between the table's entries (the table is smooth on that
/// scale); outside the table the end segment is extended, and the caller should warn
/// (see [`in_table`]).
pub fn factor(length_over_diameter: f64) -> f64 {
    let x = length_over_diameter.max(1e-6);
    let i = TABLE
        .partition_point(|&(lx, _)| lx < x)
        .clamp(1, TABLE.len() - 1);
    let (_, h0) = TABLE[i - 1];
    let (_, h1) = TABLE[i];
    // ln(x/x0)/ln(x1/x0), with the table's logarithms and their spacings taken once.
    let logs = log_table();
    let t = (x.ln() - logs.ln_x[i - 1]) * logs.inv_step[i - 1];
    (h0 + t * (h1 - h0)).max(0.0)
}

/// ln(l/D) of each table entry and 1/(ln x₁ − ln x₀) of each interval, computed once.
struct LogTable {
    ln_x: [f64; 33],
    inv_step: [f64; 32],
}

fn log_table() -> &'static LogTable {
    static LOGS: std::sync::OnceLock<LogTable> = std::sync::OnceLock::new();
    LOGS.get_or_init(|| {
        let ln_x = TABLE.map(|(x, _)| x.ln());
        let inv_step = std::array::from_fn(|i| 1.0 / (ln_x[i + 1] - ln_x[i]));
        LogTable { ln_x, inv_step }
    })
}

/// Whether `length_over_diameter` lies inside Medhurst's table.
pub fn in_table(length_over_diameter: f64) -> bool {
    (MIN_LENGTH_OVER_DIAMETER..=MAX_LENGTH_OVER_DIAMETER).contains(&length_over_diameter)
}

/// Self-capacitance in farads: H·D with D in cm gives pF, so C = H·D\[m\]·1e-10 F.
pub fn self_capacitance(mean_diameter: f64, length_over_diameter: f64) -> f64 {
    factor(length_over_diameter) * mean_diameter * 1e-10
}

/// The table itself, for tests and for showing on screen.
pub fn table() -> &'static [(f64, f64)] {
    &TABLE
}

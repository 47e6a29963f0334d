//! Wire gauges and the overall diameter of enamelled wire.

/// Bare diameter of American Wire Gauge `n` in metres (ASTM B258).
///
/// # Formula
/// d = 0.127 mm · 92^((36 − n)/39); gauges 0000…0 are n = −3…0.
pub fn awg_diameter(n: i32) -> f64 {
    0.127e-3 * 92f64.powf(f64::from(36 - n) / 39.0)
}

/// Smallest and largest AWG numbers offered.
pub const AWG_RANGE: (i32, i32) = (8, 40);

/// Imperial Standard Wire Gauge, bare diameter in inches, gauges 8 to 40 (BS 3737; values from
/// memory, not checked against the standard).
const SWG_INCHES: [(i32, f64); 33] = [
    (8, 0.160),
    (9, 0.144),
    (10, 0.128),
    (11, 0.116),
    (12, 0.104),
    (13, 0.092),
    (14, 0.080),
    (15, 0.072),
    (16, 0.064),
    (17, 0.056),
    (18, 0.048),
    (19, 0.040),
    (20, 0.036),
    (21, 0.032),
    (22, 0.028),
    (23, 0.024),
    (24, 0.022),
    (25, 0.020),
    (26, 0.018),
    (27, 0.0164),
    (28, 0.0148),
    (29, 0.0136),
    (30, 0.0124),
    (31, 0.0116),
    (32, 0.0108),
    (33, 0.0100),
    (34, 0.0092),
    (35, 0.0084),
    (36, 0.0076),
    (37, 0.0068),
    (38, 0.0060),
    (39, 0.0052),
    (40, 0.0048),
];

/// Smallest and largest SWG numbers offered.
pub const SWG_RANGE: (i32, i32) = (8, 40);

/// Bare diameter of Standard Wire Gauge `n` in metres, or `None` outside 8–40.
pub fn swg_diameter(n: i32) -> Option<f64> {
    SWG_INCHES
        .iter()
        .find(|&&(g, _)| g == n)
        .map(|&(_, inches)| inches * 0.0254)
}

/// Enamel grade of IEC 60317 (grade 1 thinnest).
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum EnamelGrade {
    /// Grade 1 (thin build).
    Grade1,
    /// Grade 2 (medium build).
    Grade2,
}

/// IEC 60317-0-1 maximum overall diameter, mm: (bare, grade 1, grade 2), as reproduced in a wire
/// maker's table and in a national adoption of the standard, which agree where they overlap
/// (not read from the IEC text itself).
const IEC_60317: [(f64, f64, f64); 6] = [
    (0.250, 0.281, 0.297),
    (0.500, 0.544, 0.566),
    (0.711, 0.766, 0.795),
    (1.016, 1.080, 1.113),
    (1.219, 1.285, 1.318),
    (1.626, 1.698, 1.735),
];

/// Maximum overall diameter of enamelled wire of bare diameter `bare` (metres), metres.
///
/// # Formula
/// The enamel increment (overall − bare) of IEC 60317-0-1 interpolated linearly in the bare
/// diameter between the tabulated sizes, held proportional to the bare diameter outside them.
pub fn enamelled_diameter(bare: f64, grade: EnamelGrade) -> f64 {
    let bare_mm = bare * 1e3;
    let inc = |row: &(f64, f64, f64)| match grade {
        EnamelGrade::Grade1 => row.1 - row.0,
        EnamelGrade::Grade2 => row.2 - row.0,
    };
    let first = &IEC_60317[0];
    let last = &IEC_60317[IEC_60317.len() - 1];
    let increment = if bare_mm <= first.0 {
        inc(first) * bare_mm / first.0
    } else if bare_mm >= last.0 {
        inc(last) * bare_mm / last.0
    } else {
        let i = IEC_60317
            .iter()
            .position(|r| r.0 >= bare_mm)
            .unwrap_or(1)
            .max(1);
        let (lo, hi) = (&IEC_60317[i - 1], &IEC_60317[i]);
        let t = (bare_mm - lo.0) / (hi.0 - lo.0);
        inc(lo) + t * (inc(hi) - inc(lo))
    };
    (bare_mm + increment) * 1e-3
}

//! Temperature-coefficient classes of class-1 (temperature-compensating) ceramic capacitors.
//!
//! The three-character code of EIA-198 (EIA RS-198, *Ceramic dielectric capacitors classes I,
//! II, III and IV*), which IEC 60384-8 (fixed capacitors of ceramic dielectric, class 1)
//! follows: the first character is the significant figure of the coefficient in ppm/K, the
//! second its multiplier, the third the tolerance on it (all over 25–85 °C). The trade also
//! names the same classes by sign and size: NP0 (= C0G), N150, N750 and so on.

/// A class-1 temperature coefficient: nominal slope and its tolerance, ppm per kelvin.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct TemperatureClass {
    /// The EIA-198 code, e.g. "C0G".
    pub code: &'static str,
    /// The trade name by sign and size, e.g. "NP0", "N750".
    pub trade_name: &'static str,
    /// Nominal temperature coefficient, ppm/K (negative: capacitance falls when warm).
    pub ppm_per_k: f64,
    /// Tolerance on the coefficient, ± ppm/K.
    pub tolerance_ppm_per_k: f64,
}

/// The classes a builder meets, decoded from their EIA-198 codes (see [`decode`]).
pub const CLASSES: [TemperatureClass; 10] = [
    class("M7G", "P100", 100.0, 30.0),
    class("C0G", "NP0", 0.0, 30.0),
    class("B2G", "N030", -30.0, 30.0),
    class("U1G", "N075", -75.0, 30.0),
    class("P2G", "N150", -150.0, 30.0),
    class("S2H", "N330", -330.0, 60.0),
    class("T2H", "N470", -470.0, 60.0),
    class("U2J", "N750", -750.0, 120.0),
    class("P3K", "N1500", -1500.0, 250.0),
    class("R3L", "N2200", -2200.0, 500.0),
];

const fn class(
    code: &'static str,
    trade_name: &'static str,
    ppm_per_k: f64,
    tolerance_ppm_per_k: f64,
) -> TemperatureClass {
    TemperatureClass {
        code,
        trade_name,
        ppm_per_k,
        tolerance_ppm_per_k,
    }
}

/// The class by its EIA code or trade name (case-insensitive; "NPO" with the letter O too).
pub fn by_name(name: &str) -> Option<TemperatureClass> {
    let n = name.trim().to_ascii_uppercase().replace("NPO", "NP0");
    let n = if n == "COG" { "C0G".to_owned() } else { n };
    CLASSES
        .iter()
        .copied()
        .find(|c| c.code == n || c.trade_name == n)
}

/// Decode an EIA-198 class-1 code into (nominal ppm/K, ± tolerance ppm/K).
///
/// # Formula
/// EIA-198 class 1: significant figure C 0.0, B 0.3, L 0.8, A 0.9, M 1.0, P 1.5, R 2.2,
/// S 3.3, T 4.7, V 5.6, U 7.5; multiplier 0 −1, 1 −10, 2 −100, 3 −1000, 4 −10000, 5 +1,
/// 6 +10, 7 +100, 8 +1000, 9 +10000; tolerance G ±30, H ±60, J ±120, K ±250, L ±500,
/// M ±1000, N ±2500 ppm/K. The coefficient is figure × multiplier.
pub fn decode(code: &str) -> Option<(f64, f64)> {
    let c: Vec<char> = code.trim().to_ascii_uppercase().chars().collect();
    if c.len() != 3 {
        return None;
    }
    let figure = match c[0] {
        'C' => 0.0,
        'B' => 0.3,
        'L' => 0.8,
        'A' => 0.9,
        'M' => 1.0,
        'P' => 1.5,
        'R' => 2.2,
        'S' => 3.3,
        'T' => 4.7,
        'V' => 5.6,
        'U' => 7.5,
        _ => return None,
    };
    let multiplier = match c[1] {
        '0' => -1.0,
        '1' => -10.0,
        '2' => -100.0,
        '3' => -1000.0,
        '4' => -10000.0,
        '5' => 1.0,
        '6' => 10.0,
        '7' => 100.0,
        '8' => 1000.0,
        '9' => 10000.0,
        _ => return None,
    };
    let tolerance = match c[2] {
        'G' => 30.0,
        'H' => 60.0,
        'J' => 120.0,
        'K' => 250.0,
        'L' => 500.0,
        'M' => 1000.0,
        'N' => 2500.0,
        _ => return None,
    };
    // 0.0 × −1 would be −0; the class is plain zero.
    Some((figure * multiplier + 0.0, tolerance))
}

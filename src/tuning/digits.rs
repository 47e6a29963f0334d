//! Figures with sensible digits, for the window, the report and the JSON's text: the same
//! helpers everywhere so that a figure reads the same in each.
//!
//! Rules: a tank frequency to 1 kHz, a self-resonance to 1 MHz, an offset in kHz up to
//! ±999 kHz and in MHz beyond, and never a negative zero ("-0.00 mm" reads as a fault).
//! A range that states an uncertainty (a spread) carries the digits its width allows: two
//! significant figures of the width, never finer than 1 kHz ([`spread_decimals`]); the wire to
//! cut is stated to the millimetre everywhere ([`wire_to_cut_mm`]); an uncertainty that rounds
//! to nothing at the shown resolution is said to be below it ([`plus_minus`]).

use crate::units::{to_khz, to_mhz, to_mm};
/// `value` with `decimals` decimals, never "-0.0…": a value that rounds to zero is shown
/// unsigned. Non-finite values read "—".
pub fn fixed(value: f64, decimals: usize) -> String {
    if !value.is_finite() {
        return "—".to_owned();
    }
    let s = format!("{value:.decimals$}");
    match s.strip_prefix('-') {
        Some(rest) if rest.chars().all(|c| c == '0' || c == '.') => rest.to_owned(),
        _ => s,
    }
}

/// `value` with `decimals` decimals and an explicit sign ("+1.5", "-0.3"), zero unsigned.
pub fn signed(value: f64, decimals: usize) -> String {
    let s = fixed(value, decimals);
    if s.starts_with('-') || s.chars().all(|c| c == '0' || c == '.') || s == "—" {
        s
    } else {
        format!("+{s}")
    }
}

/// A tank frequency in MHz to 1 kHz, without the unit: "98.700".
pub fn mhz_plain(hz: f64) -> String {
    fixed(to_mhz(hz), 3)
}

/// A tank frequency in MHz to 1 kHz: "98.700 MHz".
pub fn mhz(hz: f64) -> String {
    format!("{} MHz", mhz_plain(hz))
}

/// A range of frequencies to 1 kHz: "94.100–109.900 MHz".
pub fn mhz_range(low: f64, high: f64) -> String {
    format!("{}–{} MHz", mhz_plain(low), mhz_plain(high))
}

/// A self-resonance in MHz to 1 MHz: "412 MHz" (the estimates are rough; more digits would
/// promise what they do not hold).
pub fn self_resonance(hz: f64) -> String {
    format!("{} MHz", fixed(to_mhz(hz), 0))
}

/// A channel or typed target in MHz with the decimals it needs, one to four: "98.7",
/// "146.52", "145.2125" (channels are exact; a 12.5 kHz raster needs the fourth decimal,
/// which [`mhz`]'s 1 kHz would round away).
pub fn channel_mhz(hz: f64) -> String {
    let s = fixed(to_mhz(hz), 4);
    if !s.contains('.') {
        return s;
    }
    let t = s.trim_end_matches('0');
    if t.ends_with('.') {
        format!("{t}0")
    } else {
        t.to_owned()
    }
}

/// An offset from the target with its sign: to 0.1 kHz while that reads below 1000 kHz
/// ("+12.3 kHz", "+999.9 kHz"), in MHz to 1 kHz beyond ("-9.336 MHz"). Zero reads
/// "0.0 kHz".
pub fn offset(hz: f64) -> String {
    let khz = to_khz(hz);
    // Decide on the figure as shown, so 999.96 kHz does not read "+1000.0 kHz".
    if fixed(khz.abs(), 1).parse::<f64>().unwrap_or(f64::INFINITY) < 1000.0 {
        format!("{} kHz", signed(khz, 1))
    } else {
        format!("{} MHz", signed(to_mhz(hz), 3))
    }
}

/// A width (a spread, never signed) in the offset's units: "450.0 kHz", "1.234 MHz".
pub fn width(hz: f64) -> String {
    offset(hz.abs()).trim_start_matches('+').to_owned()
}

/// A length in millimetres with `decimals` decimals: "8.00 mm", never "-0.00 mm".
pub fn mm(metres: f64, decimals: usize) -> String {
    format!("{} mm", fixed(to_mm(metres), decimals))
}

/// Decimals (of MHz) for the figures of a spread `width_hz` wide: enough to give the width two
/// significant figures, never finer than 1 kHz (3 decimals) and never coarser than 1 MHz.
/// A 9.6 MHz spread is stated to 0.1 MHz, a 450 kHz one to 10 kHz, a 30 kHz one to 1 kHz: the
/// digits beyond are inside the spread's own uncertainty (a 95 % interval from a few thousand
/// draws moves in its second figure from run to run).
pub fn spread_decimals(width_hz: f64) -> usize {
    let width_mhz = to_mhz(width_hz.abs());
    if !width_mhz.is_finite() || width_mhz <= 0.0 {
        return 3;
    }
    // The first significant figure's decimal place, plus one more.
    let first = -width_mhz.log10().floor();
    (first + 1.0).clamp(0.0, 3.0) as usize
}

/// A frequency in MHz at `decimals`, with the unit: "98.7 MHz".
pub fn mhz_at(hz: f64, decimals: usize) -> String {
    format!("{} MHz", fixed(to_mhz(hz), decimals))
}

/// A spread's range with the digits its width allows ([`spread_decimals`]): "92.6–102.2 MHz"
/// for a 9.6 MHz spread, "98.412–98.451 MHz" for a 39 kHz one.
pub fn spread_range(low: f64, high: f64) -> String {
    let d = spread_decimals(high - low);
    format!("{}–{} MHz", fixed(to_mhz(low), d), fixed(to_mhz(high), d))
}

/// A spread's width to two significant figures (1 kHz at the finest): "9.6 MHz",
/// "450 kHz", "39 kHz".
pub fn spread_width(hz: f64) -> String {
    let hz = hz.abs();
    let d = spread_decimals(hz);
    if hz >= 1e6 || d == 0 {
        // One or two significant figures above 1 MHz: d is 0 or 1 here.
        format!("{} MHz", fixed(to_mhz(hz), d.min(1)))
    } else {
        // Below 1 MHz in kHz: the same resolution, 10^(3 - d) kHz.
        let step = 10f64.powi(3 - i32::try_from(d).unwrap_or(3));
        format!("{} kHz", fixed((to_khz(hz) / step).round() * step, 0))
    }
}

/// The wire to cut, to the millimetre: "119 mm". A wire is cut with a rule marked in
/// millimetres and its leads are trimmed after soldering, so a finer figure promises nothing
/// (common practice). The window, `report` and the sheet all state it so.
pub fn wire_to_cut_mm(metres: f64) -> String {
    format!("{} mm", fixed(to_mm(metres), 0))
}

/// An uncertainty `value` shown at `decimals` with `unit`: "±0.12 mm"; when it rounds to zero
/// at that resolution, "under 0.01 mm" (never "±0.00 mm").
pub fn plus_minus(value: f64, decimals: usize, unit: &str) -> String {
    let shown = fixed(value.abs(), decimals);
    if shown.chars().all(|c| c == '0' || c == '.') {
        let step = fixed(
            10f64.powi(-i32::try_from(decimals.min(15)).unwrap_or(15)),
            decimals,
        );
        format!("under {step} {unit}")
    } else {
        format!("±{shown} {unit}")
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_spread_carries_the_digits_its_width_allows() {
        // The case: a 9.6 MHz spread was "92.569–102.154 MHz".
        assert_eq!(spread_range(92.569e6, 102.154e6), "92.6–102.2 MHz");
        assert_eq!(spread_width(102.154e6 - 92.569e6), "9.6 MHz");
        assert_eq!(spread_range(98.45e6, 98.9e6), "98.45–98.90 MHz");
        assert_eq!(spread_width(450e3), "450 kHz");
        assert_eq!(spread_range(98.412e6, 98.451e6), "98.412–98.451 MHz");
        assert_eq!(spread_width(39e3), "39 kHz");
        assert_eq!(spread_width(3.2e3), "3 kHz");
        assert_eq!(spread_range(80e6, 120e6), "80–120 MHz");
    }

    #[test]
    fn wire_to_cut_and_uncertainties() {
        assert_eq!(wire_to_cut_mm(0.11877), "119 mm");
        assert_eq!(plus_minus(0.004, 2, "mm"), "under 0.01 mm");
        assert_eq!(plus_minus(0.123, 2, "mm"), "±0.12 mm");
        assert_eq!(plus_minus(0.0004, 3, "in"), "under 0.001 in");
    }
}

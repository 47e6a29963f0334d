//! Figures with sensible digits, for the window, the report and the JSON's text: the same
//! helpers everywhere so that a figure reads the same in each.
//!
//! Rules: a tank frequency to 1 kHz, a self-resonance to 1 MHz, an offset in kHz up to
//! ±999 kHz and in MHz beyond, and never a negative zero ("-0.00 mm" reads as a fault).

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
    fixed(hz * 1e-6, 3)
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
    format!("{} MHz", fixed(hz * 1e-6, 0))
}

/// A channel or typed target in MHz with the decimals it needs, one to four: "98.7",
/// "146.52", "145.2125" (channels are exact; a 12.5 kHz raster needs the fourth decimal,
/// which [`mhz`]'s 1 kHz would round away).
pub fn channel_mhz(hz: f64) -> String {
    let s = fixed(hz * 1e-6, 4);
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
    let khz = hz * 1e-3;
    // Decide on the figure as shown, so 999.96 kHz does not read "+1000.0 kHz".
    if fixed(khz.abs(), 1).parse::<f64>().unwrap_or(f64::INFINITY) < 1000.0 {
        format!("{} kHz", signed(khz, 1))
    } else {
        format!("{} MHz", signed(hz * 1e-6, 3))
    }
}

/// A width (a spread, never signed) in the offset's units: "450.0 kHz", "1.234 MHz".
pub fn width(hz: f64) -> String {
    offset(hz.abs()).trim_start_matches('+').to_owned()
}

/// A length in millimetres with `decimals` decimals: "8.00 mm", never "-0.00 mm".
pub fn mm(metres: f64, decimals: usize) -> String {
    format!("{} mm", fixed(metres * 1e3, decimals))
}

//! The parts on hand, as a builder lists them: formers (drill shanks or rods, millimetres or
//! fractional inches), wires (millimetres, AWG or SWG; bare or enamelled), fixed capacitors (a
//! list, or a preferred-number series over a range), trimmers (minimum–maximum), the lead
//! length and the building method. Each typed entry is read here, refused with the accepted
//! range named, before any solve. SI inside.

use crate::model::{Coating, Gauge, WireSpec};
use crate::physics::wire_gauge;
use crate::tuning::construction::Construction;

// One millimetre and one picofarad in SI, for the tables of typical values below.
const MM: f64 = crate::units::from_mm(1.0);
const PF: f64 = crate::units::from_pf(1.0);
// Exact by definition (the international inch, 1959).
const INCH: f64 = 25.4e-3;

/// Former diameters accepted, metres (a drill shank or rod a hand winds a VHF coil on;
/// common practice).
pub const FORMER_RANGE: (f64, f64) = (1.0e-3, 50.0e-3);
/// Bare wire diameters accepted, metres (common practice for self-supporting VHF coils).
pub const WIRE_RANGE: (f64, f64) = (0.1e-3, 3.0e-3);
/// Fixed capacitors accepted, farads (0 = no fixed capacitor).
pub const FIXED_RANGE: (f64, f64) = (0.0, 1000e-12);
/// Trimmer ends accepted, farads.
pub const TRIMMER_RANGE: (f64, f64) = (0.0, 500e-12);
/// Lead lengths accepted, metres.
pub const LEAD_RANGE: (f64, f64) = (0.0, 50e-3);
/// Most entries in any one list (keeps a search within its time).
pub const LIST_MAX: usize = 40;

/// A trimmer capacitor: its capacitance at each end of its travel, farads.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct TrimmerPart {
    /// At minimum capacitance.
    pub min: f64,
    /// At maximum capacitance.
    pub max: f64,
}

impl TrimmerPart {
    /// As marked: "4–20 pF".
    pub fn label(&self) -> String {
        format!("{}–{} pF", short(self.min / PF), short(self.max / PF))
    }

    /// Capacitance at mid-travel, farads (a linear trimmer, as the model takes it).
    pub fn mid(&self) -> f64 {
        0.5 * (self.min + self.max)
    }
}

/// Everything on the bench to build the tank from.
#[derive(Clone, Debug, PartialEq)]
pub struct PartsOnHand {
    /// Former diameters, metres.
    pub formers: Vec<f64>,
    /// Wires.
    pub wires: Vec<WireSpec>,
    /// Fixed capacitors, farads (0: none fitted).
    pub fixed: Vec<f64>,
    /// Trimmers.
    pub trimmers: Vec<TrimmerPart>,
    /// Each of the coil's two leads, metres.
    pub lead_length: f64,
    /// How the circuit is built (fills the stray estimate's layout).
    pub construction: Construction,
}

impl PartsOnHand {
    /// Refuse an empty or over-long list, or a part outside its accepted range, naming the
    /// list and the range (the command line and the window check before any solve).
    pub fn check(&self) -> Result<(), PartsError> {
        let list = |name: &'static str, n: usize| {
            if n == 0 {
                Err(PartsError::new(
                    name,
                    "the list is empty: give at least one",
                ))
            } else if n > LIST_MAX {
                Err(PartsError::new(
                    name,
                    format!("{n} entries; at most {LIST_MAX} are accepted"),
                ))
            } else {
                Ok(())
            }
        };
        list(FORMERS, self.formers.len())?;
        list(WIRES, self.wires.len())?;
        list(FIXED, self.fixed.len())?;
        list(TRIMMERS, self.trimmers.len())?;
        for &f in &self.formers {
            in_range(FORMERS, "former", f, FORMER_RANGE, MM, "mm")?;
        }
        for w in &self.wires {
            let d = w.bare_diameter().ok_or_else(|| {
                PartsError::new(WIRES, "a gauge number is outside the AWG/SWG 8–40 tables")
            })?;
            in_range(WIRES, "bare wire", d, WIRE_RANGE, MM, "mm")?;
        }
        for &c in &self.fixed {
            in_range(FIXED, "fixed capacitor", c, FIXED_RANGE, PF, "pF")?;
        }
        for t in &self.trimmers {
            in_range(TRIMMERS, "trimmer minimum", t.min, TRIMMER_RANGE, PF, "pF")?;
            in_range(TRIMMERS, "trimmer maximum", t.max, TRIMMER_RANGE, PF, "pF")?;
            if t.max.partial_cmp(&t.min) != Some(std::cmp::Ordering::Greater) {
                return Err(PartsError::new(
                    TRIMMERS,
                    format!("{}: the maximum must be above the minimum", t.label()),
                ));
            }
        }
        in_range(LEAD, "lead", self.lead_length, LEAD_RANGE, MM, "mm")?;
        Ok(())
    }

    /// How many combinations of former, wire, fixed capacitor and trimmer the search tries.
    pub fn combinations(&self) -> usize {
        self.formers.len() * self.wires.len() * self.fixed.len() * self.trimmers.len()
    }
}

/// Names of the lists, as the errors give them (the command line maps them to its flags).
pub const FORMERS: &str = "formers";
/// The wires' list.
pub const WIRES: &str = "wires";
/// The fixed capacitors' list.
pub const FIXED: &str = "fixed capacitors";
/// The trimmers' list.
pub const TRIMMERS: &str = "trimmers";
/// The lead length.
pub const LEAD: &str = "lead length";

/// A part list refused: which list, and why (with the accepted range).
#[derive(Clone, Debug, PartialEq)]
pub struct PartsError {
    /// The list at fault: one of [`FORMERS`], [`WIRES`], [`FIXED`], [`TRIMMERS`], [`LEAD`].
    pub list: &'static str,
    /// Why, in words.
    pub message: String,
}

impl PartsError {
    fn new(list: &'static str, message: impl Into<String>) -> Self {
        Self {
            list,
            message: message.into(),
        }
    }
}

impl std::fmt::Display for PartsError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "{}: {}", self.list, self.message)
    }
}

fn in_range(
    list: &'static str,
    what: &str,
    value: f64,
    (lo, hi): (f64, f64),
    unit: f64,
    unit_name: &str,
) -> Result<(), PartsError> {
    if value >= lo && value <= hi {
        Ok(())
    } else {
        Err(PartsError::new(
            list,
            format!(
                "{what} {} {unit_name} is outside {}–{} {unit_name}",
                short(value / unit),
                short(lo / unit),
                short(hi / unit)
            ),
        ))
    }
}

/// A number with the decimals it needs (up to four): "4.7", "0.25", "100".
pub fn short(v: f64) -> String {
    if !v.is_finite() {
        return format!("{v}");
    }
    let s = format!("{v:.4}");
    let s = s.trim_end_matches('0').trim_end_matches('.');
    if s == "-0" {
        "0".to_owned()
    } else {
        s.to_owned()
    }
}

/// Split a typed list on commas, semicolons and spaces.
pub fn entries(text: &str) -> Vec<&str> {
    text.split(|c: char| c == ',' || c == ';' || c.is_whitespace())
        .filter(|t| !t.is_empty())
        .collect()
}

fn number(token: &str, what: &str) -> Result<f64, String> {
    match token.trim().parse::<f64>() {
        Ok(v) if v.is_finite() => Ok(v),
        _ => Err(format!("'{token}' is not {what}")),
    }
}

/// A former typed in millimetres ("6", "6.5mm") or fractional or decimal inches ("1/4in",
/// "0.25in", "3/16\""), in metres.
pub fn parse_former(token: &str) -> Result<f64, String> {
    let t = token.trim();
    let inch = t
        .strip_suffix("in")
        .or_else(|| t.strip_suffix('"'))
        .map(str::trim);
    match inch {
        Some(v) => {
            let inches = match v.split_once('/') {
                Some((n, d)) => {
                    let (n, d) = (number(n, "a fraction")?, number(d, "a fraction")?);
                    if d <= 0.0 {
                        return Err(format!("'{t}': the fraction's denominator must be above 0"));
                    }
                    n / d
                }
                None => number(v, "a size in inches")?,
            };
            Ok(inches * INCH)
        }
        None => {
            let v = t.strip_suffix("mm").map_or(t, str::trim);
            Ok(number(v, "a diameter in mm (or inches, e.g. 1/4in)")? * MM)
        }
    }
}

/// A wire typed as its bare diameter in millimetres ("1.0"), an AWG number ("awg18") or an
/// SWG number ("swg20"), with the coating given for the whole list.
pub fn parse_wire(token: &str, coating: Coating) -> Result<WireSpec, String> {
    let t = token.trim().to_ascii_lowercase();
    let gauge = if let Some(n) = t.strip_prefix("awg") {
        let n: i32 = n
            .trim()
            .parse()
            .map_err(|_| format!("'{token}': AWG needs a whole number, e.g. awg18"))?;
        let (lo, hi) = wire_gauge::AWG_RANGE;
        if !(lo..=hi).contains(&n) {
            return Err(format!("'{token}': AWG numbers run {lo}–{hi}"));
        }
        Gauge::Awg(n)
    } else if let Some(n) = t.strip_prefix("swg") {
        let n: i32 = n
            .trim()
            .parse()
            .map_err(|_| format!("'{token}': SWG needs a whole number, e.g. swg20"))?;
        let (lo, hi) = wire_gauge::SWG_RANGE;
        if !(lo..=hi).contains(&n) {
            return Err(format!("'{token}': SWG numbers run {lo}–{hi}"));
        }
        Gauge::Swg(n)
    } else {
        let v = t.strip_suffix("mm").map_or(t.as_str(), str::trim);
        Gauge::Metric(number(v, "a wire diameter in mm (or awgN, swgN)")? * MM)
    };
    Ok(WireSpec { gauge, coating })
}

/// The wire as marked: "1.00 mm", "AWG 18", "SWG 20", with "enamelled" when it is.
pub fn wire_label(w: &WireSpec) -> String {
    let size = match w.gauge {
        Gauge::Metric(d) => format!("{} mm", short(d / MM)),
        Gauge::Awg(n) => format!("AWG {n}"),
        Gauge::Swg(n) => format!("SWG {n}"),
    };
    match w.coating {
        Coating::Bare => format!("{size} bare"),
        Coating::EnamelGrade1 => format!("{size} enamelled (grade 1)"),
        Coating::EnamelGrade2 => format!("{size} enamelled (grade 2)"),
    }
}

/// The E6, E12 and E24 series of preferred numbers (IEC 60063:2015, Table 1), one decade.
pub fn e_series(n: u32) -> Option<&'static [f64]> {
    const E6: [f64; 6] = [1.0, 1.5, 2.2, 3.3, 4.7, 6.8];
    const E12: [f64; 12] = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2];
    const E24: [f64; 24] = [
        1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1,
        5.6, 6.2, 6.8, 7.5, 8.2, 9.1,
    ];
    match n {
        6 => Some(&E6),
        12 => Some(&E12),
        24 => Some(&E24),
        _ => None,
    }
}

/// The values of series E`n` from `low` to `high` (inclusive, same unit as given).
pub fn e_series_between(n: u32, low: f64, high: f64) -> Option<Vec<f64>> {
    let series = e_series(n)?;
    let mut out = Vec::new();
    for decade in -3..=4 {
        let scale = 10f64.powi(decade);
        for &m in series {
            // Rounded to the series' two figures, so 10^k·m does not drift.
            let v = (m * scale * 1e4).round() / 1e4;
            if v >= low * (1.0 - 1e-9) && v <= high * (1.0 + 1e-9) {
                out.push(v);
            }
        }
    }
    Some(out)
}

/// Fixed capacitors typed in picofarads: values ("4.7, 6.8, 10"), a preferred-number series
/// over a range ("E12:4.7-47"), or both; 0 means no fixed capacitor. In farads, ascending,
/// each value once.
pub fn parse_fixed_list(text: &str) -> Result<Vec<f64>, String> {
    let mut values = Vec::new();
    for token in entries(text) {
        let upper = token.to_ascii_uppercase();
        if let Some(rest) = upper.strip_prefix('E') {
            let (n, range) = rest
                .split_once(':')
                .ok_or_else(|| format!("'{token}': a series is written E12:LOW-HIGH"))?;
            let n: u32 = n
                .parse()
                .map_err(|_| format!("'{token}': the series is E6, E12 or E24"))?;
            let (lo, hi) = range
                .split_once('-')
                .ok_or_else(|| format!("'{token}': a series is written E12:LOW-HIGH"))?;
            let (lo, hi) = (
                number(lo, "a capacitance in pF")?,
                number(hi, "a capacitance in pF")?,
            );
            if !(lo > 0.0 && hi >= lo) {
                return Err(format!(
                    "'{token}': the range must run upwards from above 0 pF"
                ));
            }
            let series = e_series_between(n, lo, hi)
                .ok_or_else(|| format!("'{token}': the series is E6, E12 or E24"))?;
            values.extend(series.into_iter().map(|v| v * PF));
        } else {
            let v = token.strip_suffix("pF").unwrap_or(token);
            values.push(number(v, "a capacitance in pF")? * PF);
        }
    }
    if values.is_empty() {
        return Err("the list is empty: give values in pF or a series, e.g. E12:4.7-47".to_owned());
    }
    values.sort_by(f64::total_cmp);
    values.dedup_by(|a, b| (*a - *b).abs() < 1e-18);
    Ok(values)
}

/// A trimmer typed as "MIN-MAX" in picofarads ("2-10", "4–20"), in farads.
pub fn parse_trimmer(token: &str) -> Result<TrimmerPart, String> {
    let t = token.trim().trim_end_matches("pF");
    let (lo, hi) = t
        .split_once('-')
        .or_else(|| t.split_once('–'))
        .ok_or_else(|| format!("'{token}': a trimmer is written MIN-MAX in pF, e.g. 2-10"))?;
    let (lo, hi) = (
        number(lo, "a capacitance in pF")?,
        number(hi, "a capacitance in pF")?,
    );
    Ok(TrimmerPart {
        min: lo * PF,
        max: hi * PF,
    })
}

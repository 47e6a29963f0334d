//! The rules a recipe must meet: the one list the loader, the saver and the window all apply,
//! so the window can never hold (or write) what the loader would refuse, and a file that breaks
//! a rule can still be opened as it is, with the rule it breaks shown.
//!
//! The coil, tank and conditions are judged by the model itself (`model::evaluate`); the rest
//! (name, target, bench log, sizes) here.

use super::document::{BenchEntry, Recipe};
use crate::model::Field;
use crate::tuning::BandPlan;
use crate::tuning::spread::BuildTolerances;
use crate::units::{to_khz, to_mhz, to_mm, to_nh, to_pf};

/// Frequencies a recipe may name, MHz: wider than any VHF tank, narrow enough to catch typos.
pub const FREQUENCY_MHZ: (f64, f64) = (1.0, 3000.0);
/// On-channel tolerances a recipe may set, kHz: from 0.1 kHz (finer than a free-running LC
/// oscillator holds for a minute; common practice) to 1000 kHz (past that, "on channel" says
/// nothing in any VHF service).
pub const TOLERANCE_KHZ: (f64, f64) = (0.1, 1000.0);
/// Longest name accepted, characters.
pub const NAME_MAX: usize = 200;
/// Largest instrument error accepted, ppm.
pub const PPM_MAX: f64 = 1e6;
/// Longest coil length a bench reading may record, mm (as the model's limit).
pub const BENCH_LENGTH_MAX_MM: f64 = to_mm(crate::model::limits::LENGTH_MAX);
/// Most bench readings a recipe keeps. A coil is trimmed in tens of readings, not thousands;
/// the window lists every reading and works out the latest correction on each frame, so a
/// log of tens of thousands (a pasted data dump) made every mouse event cost about a second.
pub const READINGS_MAX: usize = 500;
/// Most channels an own channel list holds. The busiest built-in plan (FM on 100 kHz steps)
/// has 201; the channel picker lists them all, so tens of thousands made the window crawl.
pub const CHANNELS_MAX: usize = 500;

/// Largest winding tolerance the spread takes, ± mm (a former, length or wire off by more is
/// another coil).
pub const TOLERANCE_MM_MAX: f64 = 5.0;
/// Largest turns tolerance, ± turns.
pub const TURNS_TOLERANCE_MAX: f64 = 2.0;
/// Largest fixed-capacitor tolerance, ± percent.
pub const CAPACITOR_TOLERANCE_PERCENT_MAX: f64 = 50.0;

/// A rule a recipe breaks: the field in file terms (e.g. `bench_log[2].measured_mhz`), which
/// occurrence of its key in the file the field is (for pointing at its line), and why.
#[derive(Clone, Debug, PartialEq)]
pub struct Refusal {
    /// The field in file terms.
    pub field: String,
    /// The key as written in the file, and which occurrence of it (0-based).
    pub key: (&'static str, usize),
    /// Why, in words.
    pub reason: String,
    /// Whether the recipe is too large to be opened at all (a size cap, not a value).
    pub too_large: bool,
}

impl Refusal {
    fn new(field: impl Into<String>, key: &'static str, nth: usize, reason: String) -> Self {
        Self {
            field: field.into(),
            key: (key, nth),
            reason,
            too_large: false,
        }
    }
}

impl std::fmt::Display for Refusal {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "{}: {}", self.field, self.reason)
    }
}

/// Whether `value` (MHz) is a frequency a recipe may name; `what` names it in the reason.
pub fn check_frequency_mhz(value: f64, what: &str) -> Result<(), String> {
    let (lo, hi) = FREQUENCY_MHZ;
    if !value.is_finite() {
        return Err(format!("{what} is not a number"));
    }
    if !(lo..=hi).contains(&value) {
        return Err(format!("{what} {value} MHz is outside {lo}–{hi} MHz"));
    }
    Ok(())
}

/// Whether `khz` is an on-channel tolerance a recipe may set ([`TOLERANCE_KHZ`]).
pub fn check_tolerance_khz(khz: f64) -> Result<(), String> {
    let (lo, hi) = TOLERANCE_KHZ;
    if !khz.is_finite() {
        return Err("the on-channel tolerance is not a number".to_owned());
    }
    if !(lo..=hi).contains(&khz) {
        return Err(format!(
            "the on-channel tolerance ±{khz} kHz is outside ±{lo}–{hi} kHz"
        ));
    }
    Ok(())
}

/// The sizes a recipe may have (readings, channels); checked before anything else, since a
/// recipe past them is not opened at all.
pub fn check_sizes(readings: usize, channels: usize) -> Result<(), Refusal> {
    if readings > READINGS_MAX {
        return Err(Refusal {
            too_large: true,
            ..Refusal::new(
                "bench_log",
                "bench_log",
                0,
                format!(
                    "{readings} bench readings; a recipe keeps at most {READINGS_MAX} (a coil is \
                     trimmed in tens of readings, and thousands would make the window crawl)"
                ),
            )
        });
    }
    if channels > CHANNELS_MAX {
        return Err(Refusal {
            too_large: true,
            ..Refusal::new(
                "aim.plan.channels_mhz",
                "channels_mhz",
                0,
                format!(
                    "{channels} channels in the own list; at most {CHANNELS_MAX} (the largest \
                     built-in plan has 201, and tens of thousands would make the window crawl)"
                ),
            )
        });
    }
    Ok(())
}

/// One bench reading (the `i`th, 0-based) by the recipe rules.
pub fn check_reading(r: &BenchEntry, i: usize) -> Result<(), Refusal> {
    let field = |key: &str| format!("bench_log[{i}].{key}");
    check_frequency_mhz(to_mhz(r.measured), "the measured frequency")
        .map_err(|reason| Refusal::new(field("measured_mhz"), "measured_mhz", i, reason))?;
    let l = to_mm(r.length);
    if !l.is_finite() || l <= 0.0 || l > BENCH_LENGTH_MAX_MM {
        return Err(Refusal::new(
            field("coil_length_mm"),
            "coil_length_mm",
            i,
            format!("coil length {l} mm is outside 0–{BENCH_LENGTH_MAX_MM} mm"),
        ));
    }
    let s = r.trimmer_setting * 100.0;
    if !s.is_finite() || !(0.0..=100.0).contains(&s) {
        return Err(Refusal::new(
            field("trimmer_percent"),
            "trimmer_percent",
            i,
            format!("trimmer setting {s} % is outside 0–100 %"),
        ));
    }
    if let Some(ppm) = r.error_ppm
        && (!ppm.is_finite() || !(0.0..=PPM_MAX).contains(&ppm))
    {
        return Err(Refusal::new(
            field("error_ppm"),
            "error_ppm",
            i,
            format!("instrument error {ppm} ppm is outside 0–{PPM_MAX} ppm"),
        ));
    }
    if let Some(t) = r.added_tolerance
        && (!t.is_finite() || !(0.0..=0.5).contains(&t))
    {
        return Err(Refusal::new(
            field("added_tolerance_percent"),
            "added_tolerance_percent",
            i,
            format!(
                "clip-on capacitor tolerance {} % is outside 0–50 % (common practice: parts \
                 are sold at ±1 % to ±20 %)",
                crate::model::short_numbers(&format!("{}", t * 100.0))
            ),
        ));
    }
    if !(0.0..=crate::model::CAPACITANCE_MAX).contains(&r.added_capacitance) {
        return Err(Refusal::new(
            field("added_pf"),
            "added_pf",
            i,
            format!(
                "added capacitance {} pF is outside 0–{:.0} pF",
                to_pf(r.added_capacitance),
                to_pf(crate::model::CAPACITANCE_MAX)
            ),
        ));
    }
    Ok(())
}

/// An own channel list (MHz each) by the recipe rules.
pub fn check_channels(channels_hz: &[f64]) -> Result<(), Refusal> {
    let at = |reason: String| Refusal::new("aim.plan.channels_mhz", "channels_mhz", 0, reason);
    if channels_hz.is_empty() {
        return Err(at(
            "an own channel list needs at least one channel".to_owned()
        ));
    }
    check_sizes(0, channels_hz.len())?;
    for (i, &f) in channels_hz.iter().enumerate() {
        check_frequency_mhz(to_mhz(f), &format!("channel {}", i + 1)).map_err(at)?;
    }
    Ok(())
}

/// The spread's tolerances by the recipe rules: each a number from 0 to its limit. The
/// key names the file's field (`stray_estimate.<key>`).
pub fn check_tolerances(t: &BuildTolerances) -> Result<(), Refusal> {
    let mm = TOLERANCE_MM_MAX;
    let items = [
        (
            "former_tolerance_mm",
            "former tolerance",
            to_mm(t.former_diameter),
            mm,
            "mm",
        ),
        (
            "length_tolerance_mm",
            "length tolerance",
            to_mm(t.length),
            mm,
            "mm",
        ),
        (
            "wire_tolerance_mm",
            "wire tolerance",
            to_mm(t.wire_diameter),
            mm,
            "mm",
        ),
        (
            "turns_tolerance",
            "turns tolerance",
            t.turns,
            TURNS_TOLERANCE_MAX,
            "turns",
        ),
        (
            "capacitor_tolerance_percent",
            "capacitor tolerance",
            t.fixed_fraction * 100.0,
            CAPACITOR_TOLERANCE_PERCENT_MAX,
            "%",
        ),
    ];
    for (key, what, value, max, unit) in items {
        if !value.is_finite() || !(0.0..=max).contains(&value) {
            return Err(Refusal::new(
                format!("stray_estimate.{key}"),
                key,
                0,
                format!("{what} {value} {unit} is outside 0–{max} {unit}"),
            ));
        }
    }
    Ok(())
}

/// Judge a whole recipe: the first rule it breaks, or `Ok`. The loader, the saver and the
/// window all call this one function.
pub fn judge(r: &Recipe) -> Result<(), Refusal> {
    let channels = match &r.target.plan {
        BandPlan::Custom(list) => list.len(),
        _ => 0,
    };
    check_sizes(r.bench_log.len(), channels)?;
    if r.name.chars().count() > NAME_MAX {
        return Err(Refusal::new(
            "name",
            "name",
            0,
            format!("the name is longer than {NAME_MAX} characters"),
        ));
    }
    // The same rules as the sliders: the engine refuses, naming its field.
    if let Err(e) = crate::model::evaluate(&r.winding, &r.tank, &r.conditions) {
        let (field, key) = file_field(e.field, r);
        return Err(Refusal::new(field, key, 0, e.reason));
    }
    if let BandPlan::Custom(list) = &r.target.plan {
        check_channels(list)?;
    }
    check_frequency_mhz(to_mhz(r.target.channel), "the target channel")
        .map_err(|reason| Refusal::new("aim.channel_mhz", "channel_mhz", 0, reason))?;
    if let Some(t) = r.target.tolerance {
        check_tolerance_khz(to_khz(t)).map_err(|reason| {
            Refusal::new(
                "aim.on_channel_within_khz",
                "on_channel_within_khz",
                0,
                reason,
            )
        })?;
    }
    for (i, reading) in r.bench_log.iter().enumerate() {
        check_reading(reading, i)?;
    }
    if let Some(m) = &r.coil_measurement {
        check_measurement(m)?;
    }
    if let Some(s) = &r.stage {
        check_stage(s)?;
    }
    r.audio
        .check()
        .map_err(|e| Refusal::new(format!("audio.{}", e.key), e.key, 0, e.reason))?;
    check_tolerances(&r.stray_estimate.tolerances)
}

/// The oscillator stage's settings by the recipe rules: each within the range the stage's
/// analysis accepts (`tuning::stage::settings`), the `.model` line read by the stage's reader.
pub fn check_stage(s: &crate::tuning::stage::StageSettings) -> Result<(), Refusal> {
    s.check()
        .map_err(|e| Refusal::new(format!("stage.{}", e.key), e.key, 0, e.reason))
}

/// A kept coil measurement by the recipe rules: a coil the model takes, a band of positive
/// frequencies, and a network of positive inductance and resistance.
pub fn check_measurement(
    m: &crate::tuning::measured_field::CoilMeasurement,
) -> Result<(), Refusal> {
    let refuse = |key: &'static str, reason: String| {
        Err(Refusal::new(
            format!("coil_measurement.{key}"),
            key,
            0,
            reason,
        ))
    };
    if let Err(e) = crate::model::Coil::from_winding(&m.winding) {
        return refuse("coil", format!("the coil measured: {}", e.reason));
    }
    let (lo, hi) = m.band;
    if !(lo.is_finite() && hi.is_finite() && lo > 0.0 && hi > lo && hi <= 1e11) {
        return refuse(
            "highest_mhz",
            "the band measured must run from above 0 up to at most 100 GHz, lowest first"
                .to_owned(),
        );
    }
    let c = &m.coil;
    let checks: [(&'static str, f64, f64, &str); 6] = [
        ("inductance_nh", to_nh(c.inductance), 1e6, "nH"),
        ("self_capacitance_pf", to_pf(c.self_capacitance), 1e3, "pF"),
        ("series_resistance_ohm", c.series_resistance, 1e6, "ohm"),
        ("stated_at_mhz", to_mhz(c.at_frequency), 1e5, "MHz"),
        ("q", c.q, 1e7, ""),
        ("residual_percent", c.residual * 100.0, 1e3, "%"),
    ];
    for (key, v, max, unit) in checks {
        let positive = key == "inductance_nh" || key == "stated_at_mhz";
        if !v.is_finite() || v < 0.0 || v > max || (positive && v == 0.0) {
            return refuse(
                key,
                format!(
                    "{key} {} {unit} is outside {}–{max} {unit}",
                    crate::model::short_numbers(&format!("{v}")),
                    if positive { "above 0" } else { "0" }
                ),
            );
        }
    }
    Ok(())
}

/// The file field (and its key in the text) a model field comes from.
fn file_field(field: Field, r: &Recipe) -> (&'static str, &'static str) {
    match field {
        Field::Diameter => ("coil.diameter", "diameter"),
        Field::Wire => ("coil.wire", "wire"),
        Field::Turns => ("coil.turns", "turns"),
        Field::Spacing => ("coil.spacing", "spacing"),
        Field::LeadLength => ("coil.each_lead_mm", "each_lead_mm"),
        Field::FixedCapacitance => ("tank.fixed_pf", "fixed_pf"),
        Field::Trimmer => {
            if (0.0..=crate::model::CAPACITANCE_MAX).contains(&r.tank.trimmer_min) {
                ("tank.trimmer_max_pf", "trimmer_max_pf")
            } else {
                ("tank.trimmer_min_pf", "trimmer_min_pf")
            }
        }
        Field::TrimmerSetting => ("tank.trimmer_setting_percent", "trimmer_setting_percent"),
        Field::StrayCapacitance => ("tank.stray_pf", "stray_pf"),
        Field::Feedback => ("tank.feedback", "feedback"),
        Field::Temperature => ("conditions.wire_temperature_c", "wire_temperature_c"),
        Field::Calibration => ("bench_log", "bench_log"),
    }
}

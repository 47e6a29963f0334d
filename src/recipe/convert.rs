//! The one place where the file's units (mm, pF, MHz, percent) meet the model's SI units, and
//! where a parsed file is checked by the same rules as the sliders.

use super::document::{BenchEntry, Recipe, Target};
use super::load::{LoadError, LoadErrorKind};
use super::schema::{
    AimSheet, CoatingName, CoilSheet, ConditionsSheet, DiameterMm, DividerSheet, ModelName,
    PlanName, ReadingSheet, RecipeFile, SCHEMA, Scaled, SpacingMm, TankSheet, WireSize,
};
use crate::model::{
    Coating, Conditions, DiameterSpec, FeedbackDivider, Field, Gauge, SpacingSpec, Tank, Winding,
    WireSpec,
};
use crate::tuning::BandPlan;

/// Frequencies a recipe may name, MHz: wider than any VHF tank, narrow enough to catch typos.
const FREQUENCY_MHZ: (f64, f64) = (1.0, 3000.0);
/// Longest name accepted, characters.
const NAME_MAX: usize = 200;
/// Largest instrument error accepted, ppm.
const PPM_MAX: f64 = 1e6;
/// Longest coil length a bench reading may record, mm (as the model's limit).
const BENCH_LENGTH_MAX_MM: f64 = crate::model::limits::LENGTH_MAX * 1e3;

/// The file form of a recipe.
pub(crate) fn to_file_form(r: &Recipe) -> RecipeFile {
    let w = &r.winding;
    let t = &r.tank;
    RecipeFile {
        schema: SCHEMA,
        name: r.name.clone(),
        notes: r.notes.clone(),
        coil: CoilSheet {
            diameter: match w.diameter {
                DiameterSpec::Former(d) => DiameterMm::FormerMm(Scaled::from_si(d)),
                DiameterSpec::Mean(d) => DiameterMm::MeanMm(Scaled::from_si(d)),
            },
            wire: match w.wire.gauge {
                Gauge::Metric(d) => WireSize::BareMm(Scaled::from_si(d)),
                Gauge::Awg(n) => WireSize::Awg(n),
                Gauge::Swg(n) => WireSize::Swg(n),
            },
            coating: match w.wire.coating {
                Coating::Bare => CoatingName::Bare,
                Coating::EnamelGrade1 => CoatingName::EnamelGrade1,
                Coating::EnamelGrade2 => CoatingName::EnamelGrade2,
            },
            turns: w.turns,
            spacing: match w.spacing {
                SpacingSpec::Length(l) => SpacingMm::LengthMm(Scaled::from_si(l)),
                SpacingSpec::Gap(g) => SpacingMm::GapMm(Scaled::from_si(g)),
            },
            each_lead_mm: Scaled::from_si(w.lead_length),
        },
        tank: TankSheet {
            fixed_pf: Scaled::from_si(t.fixed),
            trimmer_min_pf: Scaled::from_si(t.trimmer_min),
            trimmer_max_pf: Scaled::from_si(t.trimmer_max),
            trimmer_setting_percent: Scaled::from_si(t.trimmer_setting),
            stray_pf: Scaled::from_si(t.stray),
            feedback: t.feedback.map(|f| DividerSheet {
                upper_pf: Scaled::from_si(f.upper),
                lower_pf: Scaled::from_si(f.lower),
            }),
        },
        conditions: ConditionsSheet {
            wire_temperature_c: r.conditions.temperature_c,
            drives_resonance: ModelName(r.conditions.model),
            filament_sum: r.conditions.filament_sum,
        },
        aim: AimSheet {
            plan: match &r.target.plan {
                BandPlan::UsFm => PlanName::UsFm,
                BandPlan::Fm100k => PlanName::Fm100kHz,
                BandPlan::JapanFmWide => PlanName::JapanFmWide,
                BandPlan::JapanFm => PlanName::JapanFm,
                BandPlan::TwoMetreRegion1 => PlanName::TwoMetreRegion1,
                BandPlan::TwoMetreRegion2 => PlanName::TwoMetreRegion2,
                BandPlan::TwoMetreRegion2Step20k => PlanName::TwoMetreRegion2Step20kHz,
                BandPlan::TwoMetreRegion3 => PlanName::TwoMetreRegion3,
                BandPlan::Custom(list) => PlanName::OwnList {
                    channels_mhz: list.iter().map(|&f| Scaled::from_si(f)).collect(),
                },
            },
            channel_mhz: Scaled::from_si(r.target.channel),
        },
        bench_log: r
            .bench_log
            .iter()
            .map(|e| ReadingSheet {
                measured_mhz: Scaled::from_si(e.measured),
                coil_length_mm: Scaled::from_si(e.length),
                trimmer_percent: Scaled::from_si(e.trimmer_setting),
                added_pf: Scaled::from_si(e.added_capacitance),
                instrument: e.instrument.clone(),
                error_ppm: e.error_ppm,
                note: e.note.clone(),
            })
            .collect(),
    }
}

/// The file field (and which occurrence of its key in the text) a model field comes from.
fn file_field(field: Field, sheet: &RecipeFile) -> (&'static str, &'static str) {
    match field {
        Field::Diameter => ("coil.diameter", "diameter"),
        Field::Wire => ("coil.wire", "wire"),
        Field::Turns => ("coil.turns", "turns"),
        Field::Spacing => ("coil.spacing", "spacing"),
        Field::LeadLength => ("coil.each_lead_mm", "each_lead_mm"),
        Field::FixedCapacitance => ("tank.fixed_pf", "fixed_pf"),
        Field::Trimmer => {
            if (0.0..=crate::model::CAPACITANCE_MAX).contains(&sheet.tank.trimmer_min_pf.si()) {
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

/// A refusal of one value: the field in file terms and where its key stands in the text.
fn refuse(text: &str, field: &str, key: &str, nth: usize, reason: String) -> LoadError {
    LoadError::new(LoadErrorKind::Invalid, reason)
        .about(field)
        .at(super::load::locate_key(text, key, nth))
}

fn check_frequency(value: f64, what: &str) -> Result<(), String> {
    let (lo, hi) = FREQUENCY_MHZ;
    if !value.is_finite() {
        return Err(format!("{what} is not a number"));
    }
    if !(lo..=hi).contains(&value) {
        return Err(format!("{what} {value} MHz is outside {lo}–{hi} MHz"));
    }
    Ok(())
}

/// The recipe a parsed file describes, checked by the model's rules. `text` is the file's
/// text, used only to point at the line of a refused field.
pub(crate) fn from_file_form(sheet: RecipeFile, text: &str) -> Result<Recipe, LoadError> {
    if sheet.name.chars().count() > NAME_MAX {
        return Err(refuse(
            text,
            "name",
            "name",
            0,
            format!("the name is longer than {NAME_MAX} characters"),
        ));
    }
    let c = &sheet.coil;
    let winding = Winding {
        diameter: match c.diameter {
            DiameterMm::FormerMm(d) => DiameterSpec::Former(d.si()),
            DiameterMm::MeanMm(d) => DiameterSpec::Mean(d.si()),
        },
        wire: WireSpec {
            gauge: match c.wire {
                WireSize::BareMm(d) => Gauge::Metric(d.si()),
                WireSize::Awg(n) => Gauge::Awg(n),
                WireSize::Swg(n) => Gauge::Swg(n),
            },
            coating: match c.coating {
                CoatingName::Bare => Coating::Bare,
                CoatingName::EnamelGrade1 => Coating::EnamelGrade1,
                CoatingName::EnamelGrade2 => Coating::EnamelGrade2,
            },
        },
        turns: c.turns,
        spacing: match c.spacing {
            SpacingMm::LengthMm(l) => SpacingSpec::Length(l.si()),
            SpacingMm::GapMm(g) => SpacingSpec::Gap(g.si()),
        },
        lead_length: c.each_lead_mm.si(),
    };
    let t = &sheet.tank;
    let tank = Tank {
        fixed: t.fixed_pf.si(),
        trimmer_min: t.trimmer_min_pf.si(),
        trimmer_max: t.trimmer_max_pf.si(),
        trimmer_setting: t.trimmer_setting_percent.si(),
        stray: t.stray_pf.si(),
        feedback: t.feedback.map(|f| FeedbackDivider {
            upper: f.upper_pf.si(),
            lower: f.lower_pf.si(),
        }),
    };
    let k = &sheet.conditions;
    let conditions = Conditions {
        temperature_c: k.wire_temperature_c,
        model: k.drives_resonance.0,
        filament_sum: k.filament_sum,
        inductance_scale: 1.0,
    };
    // The same rules as the sliders: the engine refuses, naming its field.
    if let Err(e) = crate::model::evaluate(&winding, &tank, &conditions) {
        let (field, key) = file_field(e.field, &sheet);
        return Err(refuse(text, field, key, 0, e.reason));
    }
    let plan = match &sheet.aim.plan {
        PlanName::UsFm => BandPlan::UsFm,
        PlanName::Fm100kHz => BandPlan::Fm100k,
        PlanName::JapanFmWide => BandPlan::JapanFmWide,
        PlanName::JapanFm => BandPlan::JapanFm,
        PlanName::TwoMetreRegion1 => BandPlan::TwoMetreRegion1,
        PlanName::TwoMetreRegion2 | PlanName::TwoMetreRegion2And3 => BandPlan::TwoMetreRegion2,
        PlanName::TwoMetreRegion2Step20kHz => BandPlan::TwoMetreRegion2Step20k,
        PlanName::TwoMetreRegion3 => BandPlan::TwoMetreRegion3,
        PlanName::OwnList { channels_mhz } => {
            if channels_mhz.is_empty() {
                return Err(refuse(
                    text,
                    "aim.plan.channels_mhz",
                    "channels_mhz",
                    0,
                    "an own channel list needs at least one channel".to_owned(),
                ));
            }
            for (i, &f) in channels_mhz.iter().enumerate() {
                check_frequency(f.file_units(), &format!("channel {}", i + 1)).map_err(
                    |reason| refuse(text, "aim.plan.channels_mhz", "channels_mhz", 0, reason),
                )?;
            }
            BandPlan::Custom(channels_mhz.iter().map(|&f| f.si()).collect())
        }
    };
    check_frequency(sheet.aim.channel_mhz.file_units(), "the target channel")
        .map_err(|reason| refuse(text, "aim.channel_mhz", "channel_mhz", 0, reason))?;
    let target = Target {
        plan,
        channel: sheet.aim.channel_mhz.si(),
    };
    let mut bench_log = Vec::with_capacity(sheet.bench_log.len());
    for (i, reading) in sheet.bench_log.iter().enumerate() {
        bench_log.push(reading_from_file(reading, i, text)?);
    }
    Ok(Recipe {
        name: sheet.name,
        notes: sheet.notes,
        winding,
        tank,
        conditions,
        target,
        bench_log,
    })
}

fn reading_from_file(r: &ReadingSheet, i: usize, text: &str) -> Result<BenchEntry, LoadError> {
    let field = |key: &str| format!("bench_log[{i}].{key}");
    check_frequency(r.measured_mhz.file_units(), "the measured frequency")
        .map_err(|reason| refuse(text, &field("measured_mhz"), "measured_mhz", i, reason))?;
    let l = r.coil_length_mm.file_units();
    if !l.is_finite() || l <= 0.0 || l > BENCH_LENGTH_MAX_MM {
        return Err(refuse(
            text,
            &field("coil_length_mm"),
            "coil_length_mm",
            i,
            format!("coil length {l} mm is outside 0–{BENCH_LENGTH_MAX_MM} mm"),
        ));
    }
    let s = r.trimmer_percent.file_units();
    if !s.is_finite() || !(0.0..=100.0).contains(&s) {
        return Err(refuse(
            text,
            &field("trimmer_percent"),
            "trimmer_percent",
            i,
            format!("trimmer setting {s} % is outside 0–100 %"),
        ));
    }
    if let Some(ppm) = r.error_ppm
        && (!ppm.is_finite() || !(0.0..=PPM_MAX).contains(&ppm))
    {
        return Err(refuse(
            text,
            &field("error_ppm"),
            "error_ppm",
            i,
            format!("instrument error {ppm} ppm is outside 0–{PPM_MAX} ppm"),
        ));
    }
    let added = r.added_pf.si();
    if !(0.0..=crate::model::CAPACITANCE_MAX).contains(&added) {
        return Err(refuse(
            text,
            &field("added_pf"),
            "added_pf",
            i,
            format!(
                "added capacitance {} pF is outside 0–{:.0} pF",
                r.added_pf.text(),
                crate::model::CAPACITANCE_MAX * 1e12
            ),
        ));
    }
    Ok(BenchEntry {
        measured: r.measured_mhz.si(),
        length: r.coil_length_mm.si(),
        trimmer_setting: r.trimmer_percent.si(),
        added_capacitance: added,
        instrument: r.instrument.clone(),
        error_ppm: r.error_ppm,
        note: r.note.clone(),
    })
}

//! The one place where the file's units (mm, pF, MHz, percent) meet the model's SI units. A
//! parsed file is judged afterwards, by the same rules as the window (`rules.rs`).

use super::document::{BenchEntry, Recipe, StraySettings, Target};
use super::schema::{
    AimSheet, AudioSheet, BuildingMethod, CoatingName, CoilMeasurementSheet, CoilSheet,
    ConditionsSheet, DiameterMm, DividerSheet, ModelName, PlanName, ReadingSheet, RecipeFile,
    SCHEMA, Scaled, SpacingMm, StageSheet, StraySheet, TankSheet, TopologyName, TransistorSheet,
    WireSize,
};
use crate::model::{
    Coating, Conditions, DiameterSpec, FeedbackDivider, Gauge, SpacingSpec, Tank, Winding, WireSpec,
};
use crate::physics::junction::JunctionLaw;
use crate::tuning::BandPlan;
use crate::tuning::audio::AudioSettings;
use crate::tuning::construction::Construction;
use crate::tuning::measured_coil::MeasuredCoil;
use crate::tuning::measured_field::CoilMeasurement;
use crate::tuning::spread::BuildTolerances;
use crate::tuning::stage::{Bias, Ratings, StageSettings, Topology, TransistorSpec};

/// The file form of a recipe.
pub(crate) fn to_file_form(r: &Recipe) -> RecipeFile {
    let w = &r.winding;
    let t = &r.tank;
    RecipeFile {
        schema: SCHEMA,
        name: r.name.clone(),
        notes: r.notes.clone(),
        coil: coil_sheet(w),
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
            on_channel_within_khz: r.target.tolerance.map(Scaled::from_si),
        },
        bench_log: r
            .bench_log
            .iter()
            .map(|e| ReadingSheet {
                measured_mhz: Scaled::from_si(e.measured),
                coil_length_mm: Scaled::from_si(e.length),
                trimmer_percent: Scaled::from_si(e.trimmer_setting),
                added_pf: Scaled::from_si(e.added_capacitance),
                added_tolerance_percent: e.added_tolerance.map(Scaled::from_si),
                instrument: e.instrument.clone(),
                error_ppm: e.error_ppm,
                note: e.note.clone(),
                include_anyway: e.include_anyway,
            })
            .collect(),
        stray_estimate: stray_sheet(&r.stray_estimate),
        coil_measurement: r.coil_measurement.as_ref().map(measurement_sheet),
        stage: r.stage.as_ref().map(stage_sheet),
        audio: audio_sheet(&r.audio),
    }
}

/// The audio settings in the file's terms.
pub(crate) fn audio_sheet(a: &AudioSettings) -> AudioSheet {
    AudioSheet {
        junction_cj0_pf: Scaled::from_si(a.junction.cj0),
        junction_potential_v: a.junction.contact_potential,
        grading_exponent: a.junction.grading,
        forward_knee: a.junction.forward_knee,
        reverse_bias_v: a.bias_v,
        audio_peak_v: a.audio_peak_v,
        rf_peak_v: a.rf_peak_v,
        audio_max_khz: a.audio_max.map(Scaled::from_si),
        coupling_pf: Scaled::from_si(a.coupling),
        fixed_class: a.fixed_class.code.to_owned(),
        drift_supply_v: a.supply_v,
        supply_change_v: a.supply_change_v,
        temperature_change_k: a.temperature_change_k,
        hand_pf: Scaled::from_si(a.hand),
        load_change_pf: Scaled::from_si(a.load),
        junction_in_tank: a.in_tank,
        transistor_beside_pf: Scaled::from_si(a.beside),
    }
}

/// The audio settings a file gives (judged afterwards: `rules::check_audio`; a class this
/// build does not know is refused before, by the reader).
fn audio_settings(s: &AudioSheet) -> AudioSettings {
    let class = crate::physics::dielectric_class::by_name(&s.fixed_class);
    let usual = AudioSettings::default();
    {
        AudioSettings {
            junction: JunctionLaw {
                cj0: s.junction_cj0_pf.si(),
                contact_potential: s.junction_potential_v,
                grading: s.grading_exponent,
                forward_knee: s.forward_knee,
            },
            bias_v: s.reverse_bias_v,
            audio_peak_v: s.audio_peak_v,
            rf_peak_v: s.rf_peak_v,
            audio_max: s.audio_max_khz.map(Scaled::si),
            coupling: s.coupling_pf.si(),
            fixed_class: class.unwrap_or(usual.fixed_class),
            supply_v: s.drift_supply_v,
            supply_change_v: s.supply_change_v,
            temperature_change_k: s.temperature_change_k,
            hand: s.hand_pf.si(),
            load: s.load_change_pf.si(),
            in_tank: s.junction_in_tank,
            beside: s.transistor_beside_pf.si(),
        }
    }
}

/// 1 mAh in coulombs.
const MAH: f64 = 3.6;

/// The stage's settings in the file's terms.
fn stage_sheet(s: &StageSettings) -> StageSheet {
    StageSheet {
        topology: match s.topology {
            Topology::CommonBase => TopologyName::CommonBase,
            Topology::CommonCollector => TopologyName::CommonCollector,
        },
        supply_v: s.bias.supply_v,
        bias_upper_ohm: s.bias.upper,
        bias_lower_ohm: s.bias.lower,
        emitter_ohm: s.bias.emitter,
        transistor: match &s.transistor {
            TransistorSpec::Figures { hfe, cbe, cbc, ft } => TransistorSheet::Figures {
                hfe: *hfe,
                cbe_pf: Scaled::from_si(*cbe),
                cbc_pf: Scaled::from_si(*cbc),
                ft_mhz: Scaled::from_si(*ft),
            },
            TransistorSpec::Model(text) => TransistorSheet::SpiceModel(text.clone()),
        },
        vceo_v: s.ratings.collector_emitter_max,
        ic_max_ma: s.ratings.collector_max.map(Scaled::from_si),
        ptot_mw: s.ratings.dissipation_max.map(Scaled::from_si),
        battery_mah: s.battery_charge.map(|q| q / MAH),
        clapp_pf: s.clapp.map(Scaled::from_si),
    }
}

/// The stage's settings a file gives (judged afterwards, as the rest).
fn stage_settings(s: &StageSheet) -> StageSettings {
    StageSettings {
        topology: match s.topology {
            TopologyName::CommonBase => Topology::CommonBase,
            TopologyName::CommonCollector => Topology::CommonCollector,
        },
        bias: Bias {
            supply_v: s.supply_v,
            upper: s.bias_upper_ohm,
            lower: s.bias_lower_ohm,
            emitter: s.emitter_ohm,
        },
        transistor: match &s.transistor {
            TransistorSheet::Figures {
                hfe,
                cbe_pf,
                cbc_pf,
                ft_mhz,
            } => TransistorSpec::Figures {
                hfe: *hfe,
                cbe: cbe_pf.si(),
                cbc: cbc_pf.si(),
                ft: ft_mhz.si(),
            },
            TransistorSheet::SpiceModel(text) => TransistorSpec::Model(text.clone()),
        },
        ratings: Ratings {
            collector_emitter_max: s.vceo_v,
            collector_max: s.ic_max_ma.map(Scaled::si),
            dissipation_max: s.ptot_mw.map(Scaled::si),
        },
        battery_charge: s.battery_mah.map(|m| m * MAH),
        clapp: s.clapp_pf.map(Scaled::si),
    }
}

/// The file form of the stray estimate's settings.
pub(crate) fn stray_sheet(s: &StraySettings) -> StraySheet {
    let t = &s.tolerances;
    StraySheet {
        building_method: match s.construction {
            Construction::CopperClad => BuildingMethod::CopperClad,
            Construction::GroundPlaneBoard => BuildingMethod::GroundPlaneBoard,
            Construction::Stripboard => BuildingMethod::Stripboard,
            Construction::Perfboard => BuildingMethod::Perfboard,
            Construction::Breadboard => BuildingMethod::Breadboard,
        },
        capacitor_tolerance_percent: Scaled::from_si(t.fixed_fraction),
        former_tolerance_mm: Scaled::from_si(t.former_diameter),
        length_tolerance_mm: Scaled::from_si(t.length),
        wire_tolerance_mm: Scaled::from_si(t.wire_diameter),
        turns_tolerance: t.turns,
    }
}

/// The stray estimate's settings a file gives.
fn stray_settings(s: &StraySheet) -> StraySettings {
    StraySettings {
        construction: match s.building_method {
            BuildingMethod::CopperClad => Construction::CopperClad,
            BuildingMethod::GroundPlaneBoard => Construction::GroundPlaneBoard,
            BuildingMethod::Stripboard => Construction::Stripboard,
            BuildingMethod::Perfboard => Construction::Perfboard,
            BuildingMethod::Breadboard => Construction::Breadboard,
        },
        tolerances: BuildTolerances {
            former_diameter: s.former_tolerance_mm.si(),
            length: s.length_tolerance_mm.si(),
            wire_diameter: s.wire_tolerance_mm.si(),
            turns: s.turns_tolerance,
            fixed_fraction: s.capacitor_tolerance_percent.si(),
        },
    }
}

/// The recipe a parsed file describes, as written: nothing is judged here (see
/// [`super::rules::judge`]), so a file that breaks a rule still opens with every field kept.
pub(crate) fn from_file_form(sheet: RecipeFile) -> Recipe {
    let winding = winding_of(&sheet.coil);
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
            BandPlan::Custom(channels_mhz.iter().map(|&f| f.si()).collect())
        }
    };
    let target = Target {
        plan,
        channel: sheet.aim.channel_mhz.si(),
        tolerance: sheet.aim.on_channel_within_khz.map(Scaled::si),
    };
    let bench_log = sheet
        .bench_log
        .iter()
        .map(|r| BenchEntry {
            measured: r.measured_mhz.si(),
            length: r.coil_length_mm.si(),
            trimmer_setting: r.trimmer_percent.si(),
            added_capacitance: r.added_pf.si(),
            instrument: r.instrument.clone(),
            error_ppm: r.error_ppm,
            note: r.note.clone(),
            added_tolerance: r.added_tolerance_percent.map(Scaled::si),
            include_anyway: r.include_anyway,
        })
        .collect();
    Recipe {
        name: sheet.name,
        notes: sheet.notes,
        winding,
        tank,
        conditions,
        target,
        bench_log,
        stray_estimate: stray_settings(&sheet.stray_estimate),
        coil_measurement: sheet.coil_measurement.as_ref().map(measurement_of),
        stage: sheet.stage.as_ref().map(stage_settings),
        audio: audio_settings(&sheet.audio),
    }
}

/// A kept coil measurement in the file's terms.
fn measurement_sheet(m: &CoilMeasurement) -> CoilMeasurementSheet {
    let c = &m.coil;
    CoilMeasurementSheet {
        source: m.source.clone(),
        coil: coil_sheet(&m.winding),
        lowest_mhz: Scaled::from_si(m.band.0),
        highest_mhz: Scaled::from_si(m.band.1),
        inductance_nh: Scaled::from_si(c.inductance),
        self_capacitance_pf: Scaled::from_si(c.self_capacitance),
        series_resistance_ohm: c.series_resistance,
        stated_at_mhz: Scaled::from_si(c.at_frequency),
        q: c.q,
        reactance_crosses_zero_mhz: c.self_resonance_seen.map(Scaled::from_si),
        residual_percent: Scaled::from_si(c.residual),
        samples_used: c.used,
    }
}

/// A file's coil measurement; the network's self-resonance follows from its L and C.
fn measurement_of(s: &CoilMeasurementSheet) -> CoilMeasurement {
    let (l, c) = (s.inductance_nh.si(), s.self_capacitance_pf.si());
    let self_resonance = if c > 0.0 && l > 0.0 {
        1.0 / (2.0 * std::f64::consts::PI * (l * c).sqrt())
    } else {
        f64::INFINITY
    };
    CoilMeasurement {
        source: s.source.clone(),
        winding: winding_of(&s.coil),
        band: (s.lowest_mhz.si(), s.highest_mhz.si()),
        coil: MeasuredCoil {
            inductance: l,
            self_capacitance: c,
            series_resistance: s.series_resistance_ohm,
            at_frequency: s.stated_at_mhz.si(),
            q: s.q,
            self_resonance,
            self_resonance_seen: s.reactance_crosses_zero_mhz.map(Scaled::si),
            residual: s.residual_percent.si(),
            used: s.samples_used,
        },
    }
}

/// The winding in the file's terms.
pub(crate) fn coil_sheet(w: &Winding) -> CoilSheet {
    CoilSheet {
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
    }
}

/// The winding of a file's coil.
pub(crate) fn winding_of(c: &CoilSheet) -> Winding {
    Winding {
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
    }
}

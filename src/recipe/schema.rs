//! The on-disk recipe, schema 1: what a builder reads and edits by hand.
//!
//! Units are in the names: millimetres (`_mm`, `…Mm`), picofarads (`_pf`), megahertz
//! (`_mhz`), degrees Celsius (`_c`), percent and ppm. These structs are separate from the SI
//! model types; `convert` is the one place that translates between them.

use super::decimal::{si_from_text, text_from_si};
use crate::model::InductanceModel;
use ron::value::RawValue;
use serde::{Deserialize, Deserializer, Serialize, Serializer, de::Error as _};

/// The schema this build writes and the newest it reads.
pub const SCHEMA: u32 = 1;

/// A number written in units of 10^-EXP of its SI unit (mm: EXP = 3) and held in SI.
///
/// Written as the SI value's shortest digits with the decimal point moved, and read from the
/// digits as written, so both directions are exact: "6.8" pF is the SI literal 6.8e-12 F, and
/// any SI value reads back to the same bits.
#[derive(Clone, Copy, Debug, Default, PartialEq)]
pub struct Scaled<const EXP: i32>(f64);

/// Millimetres.
pub type Millimetres = Scaled<3>;
/// Picofarads.
pub type Picofarads = Scaled<12>;
/// Megahertz.
pub type Megahertz = Scaled<-6>;
/// Kilohertz.
pub type Kilohertz = Scaled<-3>;
/// Percent of a 0–1 fraction.
pub type Percent = Scaled<2>;

impl<const EXP: i32> Scaled<EXP> {
    /// From the SI value.
    pub fn from_si(si: f64) -> Self {
        Self(si)
    }

    /// The SI value.
    pub fn si(self) -> f64 {
        self.0
    }

    /// From a number in the file's unit, read as its shortest decimal digits.
    pub fn from_file_units(value: f64) -> Self {
        Self(si_from_text(&format!("{value:?}"), EXP).unwrap_or(f64::NAN))
    }

    /// The number in the file's unit (as written, parsed as a float).
    pub fn file_units(self) -> f64 {
        text_from_si(self.0, EXP).parse().unwrap_or(f64::NAN)
    }

    /// The number as written in the file.
    pub fn text(self) -> String {
        text_from_si(self.0, EXP)
    }
}

impl<const EXP: i32> Serialize for Scaled<EXP> {
    fn serialize<S: Serializer>(&self, serializer: S) -> Result<S::Ok, S::Error> {
        match RawValue::from_boxed_ron(self.text().into_boxed_str()) {
            Ok(raw) => raw.serialize(serializer),
            // Only for a serialiser other than RON's: the nearest float.
            Err(_) => serializer.serialize_f64(self.file_units()),
        }
    }
}

impl<'de, const EXP: i32> Deserialize<'de> for Scaled<EXP> {
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> Result<Self, D::Error> {
        let raw = Box::<RawValue>::deserialize(deserializer)?;
        let token = number_token(raw.get_ron());
        si_from_text(token, EXP)
            .map(Self)
            .ok_or_else(|| D::Error::custom(format!("expected a number, found {token}")))
    }
}

/// The number in a raw value, without surrounding blanks or comments.
fn number_token(raw: &str) -> &str {
    let mut text = raw.trim();
    loop {
        let before = text;
        if let Some(rest) = text.strip_prefix("/*") {
            text = rest
                .split_once("*/")
                .map_or("", |(_, after)| after)
                .trim_start();
        }
        if let Some(rest) = text.strip_prefix("//") {
            text = rest
                .split_once('\n')
                .map_or("", |(_, after)| after)
                .trim_start();
        }
        if text == before {
            break;
        }
    }
    let end = text
        .find(['/', ' ', '\t', '\n', '\r'])
        .unwrap_or(text.len());
    &text[..end]
}

/// A whole recipe file.
#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(rename = "TankwrightRecipe", deny_unknown_fields)]
pub struct RecipeFile {
    /// File schema version; read first, so a newer file is refused before anything else.
    pub schema: u32,
    /// Short name of the recipe.
    pub name: String,
    /// Free notes.
    #[serde(default)]
    pub notes: String,
    /// The winding as wound.
    pub coil: CoilSheet,
    /// The capacitors across the coil.
    pub tank: TankSheet,
    /// Wire temperature and the model that drives the resonance.
    #[serde(default)]
    pub conditions: ConditionsSheet,
    /// The channel aimed at.
    pub aim: AimSheet,
    /// Bench measurements, oldest first.
    #[serde(default)]
    pub bench_log: Vec<ReadingSheet>,
    /// The stray estimate's building method and the spread's tolerances (absent: the usual
    /// hand-wound figures on copper-clad board; not written while they are those).
    #[serde(default, skip_serializing_if = "StraySheet::is_usual")]
    pub stray_estimate: StraySheet,
    /// The coil as a network analyser measured it (absent: none kept).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub coil_measurement: Option<CoilMeasurementSheet>,
    /// The oscillator stage round the tank (absent: none set; older files have none).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub stage: Option<StageSheet>,
    /// The audio panel's junction, audio and drift changes (absent: the usual ones; not
    /// written while they are those).
    #[serde(default, skip_serializing_if = "AudioSheet::is_usual")]
    pub audio: AudioSheet,
}

/// The modulating junction, the audio and the drift budget's changes: pF, V, kHz, K.
#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(rename = "Audio", deny_unknown_fields, default)]
pub struct AudioSheet {
    /// The junction's zero-bias capacitance, pF.
    pub junction_cj0_pf: Picofarads,
    /// Its contact potential, volts.
    pub junction_potential_v: f64,
    /// Its grading exponent.
    pub grading_exponent: f64,
    /// SPICE's forward-bias coefficient FC.
    pub forward_knee: f64,
    /// The junction's DC reverse bias, volts.
    pub reverse_bias_v: f64,
    /// The audio's peak at the junction, volts.
    pub audio_peak_v: f64,
    /// The RF peak across the tank, volts (absent in older files: the usual 2 V).
    pub rf_peak_v: f64,
    /// The highest audio frequency, kHz (absent: the service's).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub audio_max_khz: Option<Kilohertz>,
    /// A coupling capacitor in series with the junction, pF (0: straight across the tank).
    pub coupling_pf: Picofarads,
    /// The fixed capacitor's temperature class (EIA-198 code, e.g. C0G).
    pub fixed_class: String,
    /// The supply the bias is set at, volts.
    pub drift_supply_v: f64,
    /// The supply's change, volts.
    pub supply_change_v: f64,
    /// The temperature's change, kelvin.
    pub temperature_change_k: f64,
    /// A hand near the coil, pF.
    pub hand_pf: Picofarads,
    /// A load change, pF.
    pub load_change_pf: Picofarads,
    /// The junction at its bias counts in the tank of every figure.
    pub junction_in_tank: bool,
    /// The oscillator transistor's other capacitances beside its junction, pF (taken with
    /// the stage's own junction; 0: none).
    #[serde(skip_serializing_if = "is_zero_pf")]
    pub transistor_beside_pf: Picofarads,
}

impl AudioSheet {
    /// Whether these are the usual settings (then the file leaves them out).
    pub fn is_usual(&self) -> bool {
        *self == Self::default()
    }
}

impl Default for AudioSheet {
    fn default() -> Self {
        super::convert::audio_sheet(&crate::tuning::audio::AudioSettings::default())
    }
}

/// Milliamperes (of a rating).
pub type Milliamperes = Scaled<3>;
/// Milliwatts (of a rating).
pub type Milliwatts = Scaled<3>;

/// The one-transistor stage round the tank: volts, ohms, pF, MHz, mA, mW, mAh.
#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(rename = "Stage", deny_unknown_fields)]
pub struct StageSheet {
    /// Which Colpitts stage.
    pub topology: TopologyName,
    /// Supply, volts.
    pub supply_v: f64,
    /// Base divider, supply to base, ohms.
    pub bias_upper_ohm: f64,
    /// Base divider, base to ground, ohms.
    pub bias_lower_ohm: f64,
    /// Emitter resistor, ohms.
    pub emitter_ohm: f64,
    /// The transistor.
    pub transistor: TransistorSheet,
    /// Collector–emitter rating, volts (absent: not checked).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub vceo_v: Option<f64>,
    /// Collector current rating, mA (absent: not checked).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub ic_max_ma: Option<Milliamperes>,
    /// Dissipation rating, mW (absent: not checked).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub ptot_mw: Option<Milliwatts>,
    /// The battery's capacity, mAh (absent: no battery life stated).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub battery_mah: Option<f64>,
    /// A Clapp series capacitor between the tank and the base, pF (common collector only;
    /// absent: none).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub clapp_pf: Option<Picofarads>,
}

/// The stage's topology.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Serialize, Deserialize)]
pub enum TopologyName {
    /// Base at RF ground, the tank in the collector.
    CommonBase,
    /// Collector at RF ground, the tank at the base.
    CommonCollector,
}

/// The stage's transistor.
#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
pub enum TransistorSheet {
    /// The four figures of a data sheet.
    Figures {
        /// Current gain.
        hfe: f64,
        /// Base–emitter capacitance, pF.
        cbe_pf: Picofarads,
        /// Base–collector capacitance, pF.
        cbc_pf: Picofarads,
        /// Transit frequency, MHz.
        ft_mhz: Megahertz,
    },
    /// A SPICE `.model NAME NPN(...)` line as pasted.
    SpiceModel(String),
}

/// Nanohenries.
pub type Nanohenries = Scaled<9>;

/// A coil measured across frequency and reduced to its network (see
/// `tuning::measured_coil`), with the coil as it was and the band measured.
#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(rename = "CoilMeasurement", deny_unknown_fields)]
pub struct CoilMeasurementSheet {
    /// Where it came from (the file's name).
    pub source: String,
    /// The coil as it was when measured.
    pub coil: CoilSheet,
    /// Lowest frequency of the samples, MHz.
    pub lowest_mhz: Megahertz,
    /// Highest frequency of the samples, MHz.
    pub highest_mhz: Megahertz,
    /// Low-frequency inductance of the fitted network, nH.
    pub inductance_nh: Nanohenries,
    /// Self-capacitance of the fitted network, pF.
    pub self_capacitance_pf: Picofarads,
    /// Series resistance at `stated_at_mhz`, ohms.
    pub series_resistance_ohm: f64,
    /// Where R and Q are stated, MHz.
    pub stated_at_mhz: Megahertz,
    /// Q at `stated_at_mhz`.
    pub q: f64,
    /// Where the measured reactance crosses zero going up, MHz, if the samples reach it.
    #[serde(default)]
    pub reactance_crosses_zero_mhz: Option<Megahertz>,
    /// RMS relative difference of X between the network and the samples, percent.
    pub residual_percent: Percent,
    /// Samples the network was fitted through.
    pub samples_used: usize,
}

/// The stray estimate's inputs and the builder's tolerances.
#[derive(Clone, Copy, Debug, PartialEq, Serialize, Deserialize)]
#[serde(rename = "StrayEstimate", deny_unknown_fields, default)]
pub struct StraySheet {
    /// How the circuit is built.
    pub building_method: BuildingMethod,
    /// The fixed capacitor's tolerance, ± percent.
    pub capacitor_tolerance_percent: Percent,
    /// The former's diameter, ± mm.
    pub former_tolerance_mm: Millimetres,
    /// The coil length as set, ± mm.
    pub length_tolerance_mm: Millimetres,
    /// The bare wire's diameter, ± mm.
    pub wire_tolerance_mm: Millimetres,
    /// Turns as counted, ± turns.
    pub turns_tolerance: f64,
}

impl StraySheet {
    /// Whether these are the usual figures (then the file leaves them out).
    pub fn is_usual(&self) -> bool {
        *self == Self::default()
    }
}

impl Default for StraySheet {
    fn default() -> Self {
        super::convert::stray_sheet(&super::document::StraySettings::default())
    }
}

/// Ways of building the circuit (see `tuning::construction`).
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq, Serialize, Deserialize)]
pub enum BuildingMethod {
    /// Copper-clad board, parts over the plane.
    #[default]
    CopperClad,
    /// A printed board with a ground plane.
    GroundPlaneBoard,
    /// Stripboard.
    Stripboard,
    /// Perforated board, point to point.
    Perfboard,
    /// A solderless breadboard.
    Breadboard,
}

/// The winding as the builder knows it.
#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(rename = "Winding", deny_unknown_fields)]
pub struct CoilSheet {
    /// Former (mandrel) or mean diameter.
    pub diameter: DiameterMm,
    /// Wire size.
    pub wire: WireSize,
    /// Insulation.
    #[serde(default)]
    pub coating: CoatingName,
    /// Turns, fractions allowed.
    pub turns: f64,
    /// Coil length or clear gap.
    pub spacing: SpacingMm,
    /// Each of the two straight leads, mm.
    #[serde(default)]
    pub each_lead_mm: Millimetres,
}

/// How the diameter is given, mm.
#[derive(Clone, Copy, Debug, PartialEq, Serialize, Deserialize)]
pub enum DiameterMm {
    /// The former the wire is wound on.
    FormerMm(Millimetres),
    /// Wire-centre diameter.
    MeanMm(Millimetres),
}

/// Wire size.
#[derive(Clone, Copy, Debug, PartialEq, Serialize, Deserialize)]
pub enum WireSize {
    /// Bare copper diameter, mm.
    BareMm(Millimetres),
    /// American Wire Gauge number.
    Awg(i32),
    /// Standard Wire Gauge number.
    Swg(i32),
}

/// Insulation on the wire.
#[derive(Clone, Copy, Debug, Default, PartialEq, Serialize, Deserialize)]
pub enum CoatingName {
    /// Bare or tinned copper.
    #[default]
    Bare,
    /// Enamel, IEC 60317 grade 1.
    EnamelGrade1,
    /// Enamel, IEC 60317 grade 2.
    EnamelGrade2,
}

/// How the spacing is given, mm.
#[derive(Clone, Copy, Debug, PartialEq, Serialize, Deserialize)]
pub enum SpacingMm {
    /// Coil length, turns × pitch.
    LengthMm(Millimetres),
    /// Clear gap between neighbouring turns.
    GapMm(Millimetres),
}

/// The capacitors across the coil, pF.
#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(rename = "Tank", deny_unknown_fields)]
pub struct TankSheet {
    /// Fixed capacitor.
    pub fixed_pf: Picofarads,
    /// Trimmer at its minimum.
    #[serde(default)]
    pub trimmer_min_pf: Picofarads,
    /// Trimmer at its maximum.
    #[serde(default)]
    pub trimmer_max_pf: Picofarads,
    /// Trimmer setting: 0 at its minimum, 100 at its maximum.
    #[serde(default)]
    pub trimmer_setting_percent: Percent,
    /// Device, wiring and layout.
    #[serde(default)]
    pub stray_pf: Picofarads,
    /// Optional feedback divider across the tank.
    #[serde(default)]
    pub feedback: Option<DividerSheet>,
}

/// Two capacitors in series across the tank, pF.
#[derive(Clone, Copy, Debug, PartialEq, Serialize, Deserialize)]
#[serde(rename = "Divider", deny_unknown_fields)]
pub struct DividerSheet {
    /// Hot end to tap.
    pub upper_pf: Picofarads,
    /// Tap to ground.
    pub lower_pf: Picofarads,
}

/// Conditions of the evaluation.
#[derive(Clone, Copy, Debug, PartialEq, Serialize, Deserialize)]
#[serde(rename = "Conditions", deny_unknown_fields)]
pub struct ConditionsSheet {
    /// Wire temperature, °C.
    #[serde(default = "room_temperature")]
    pub wire_temperature_c: f64,
    /// The inductance model that drives the resonance.
    #[serde(default)]
    pub drives_resonance: ModelName,
    /// Also compute Maxwell's filament sum.
    #[serde(default = "yes")]
    pub filament_sum: bool,
}

fn is_zero_pf(c: &Picofarads) -> bool {
    c.si() == 0.0
}

fn room_temperature() -> f64 {
    20.0
}

fn yes() -> bool {
    true
}

impl Default for ConditionsSheet {
    fn default() -> Self {
        Self {
            wire_temperature_c: room_temperature(),
            drives_resonance: ModelName::default(),
            filament_sum: yes(),
        }
    }
}

/// An inductance model written by its [`InductanceModel::file_name`] (`RoundWire`, …): the
/// names come from [`InductanceModel::ALL`], so a new model needs nothing here.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct ModelName(pub InductanceModel);

impl Default for ModelName {
    fn default() -> Self {
        Self(InductanceModel::RoundWire)
    }
}

impl Serialize for ModelName {
    fn serialize<S: Serializer>(&self, serializer: S) -> Result<S::Ok, S::Error> {
        let index = InductanceModel::ALL
            .iter()
            .position(|m| *m == self.0)
            .and_then(|i| u32::try_from(i).ok())
            .unwrap_or(0);
        serializer.serialize_unit_variant("ModelName", index, self.0.file_name())
    }
}

/// A variant's name read as an identifier (RON writes `RoundWire`, not `"RoundWire"`).
struct Identifier(String);

impl<'de> Deserialize<'de> for Identifier {
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> Result<Self, D::Error> {
        struct Name;
        impl serde::de::Visitor<'_> for Name {
            type Value = Identifier;
            fn expecting(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
                f.write_str("a model's name")
            }
            fn visit_str<E: serde::de::Error>(self, v: &str) -> Result<Identifier, E> {
                Ok(Identifier(v.to_owned()))
            }
        }
        deserializer.deserialize_identifier(Name)
    }
}

impl<'de> Deserialize<'de> for ModelName {
    fn deserialize<D: Deserializer<'de>>(deserializer: D) -> Result<Self, D::Error> {
        struct Named;
        impl<'de> serde::de::Visitor<'de> for Named {
            type Value = ModelName;
            fn expecting(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
                write!(f, "one of {}", InductanceModel::FILE_NAMES.join(", "))
            }
            fn visit_enum<A: serde::de::EnumAccess<'de>>(
                self,
                data: A,
            ) -> Result<Self::Value, A::Error> {
                use serde::de::VariantAccess;
                let (Identifier(name), variant) = data.variant()?;
                variant.unit_variant()?;
                InductanceModel::from_file_name(&name)
                    .map(ModelName)
                    .ok_or_else(|| A::Error::unknown_variant(&name, &InductanceModel::FILE_NAMES))
            }
        }
        deserializer.deserialize_enum("ModelName", &InductanceModel::FILE_NAMES, Named)
    }
}

/// The channel aimed at.
#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(rename = "Aim", deny_unknown_fields)]
pub struct AimSheet {
    /// The band plan the channel comes from.
    pub plan: PlanName,
    /// Channel centre, MHz.
    pub channel_mhz: Megahertz,
    /// "On channel" means within ± this many kHz of the centre; absent: the plan's default
    /// (its service's practice). Added after schema 1 was first written: older files omit it.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub on_channel_within_khz: Option<Kilohertz>,
}

/// Band plans.
#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub enum PlanName {
    /// FM broadcast, US raster (200 kHz).
    UsFm,
    /// FM broadcast on 100 kHz.
    Fm100kHz,
    /// FM broadcast, Japan with the 2014 wide-FM extension (76–95 MHz).
    JapanFmWide,
    /// FM broadcast, Japan traditional (76–90 MHz).
    JapanFm,
    /// 2 m amateur, ITU Region 1.
    TwoMetreRegion1,
    /// 2 m amateur, ITU Region 2 (ARRL plan, 15 kHz FM channels).
    TwoMetreRegion2,
    /// 2 m amateur, ITU Region 2, 20 kHz FM channels.
    TwoMetreRegion2Step20kHz,
    /// 2 m amateur, ITU Region 3.
    TwoMetreRegion3,
    /// Older files' "2 m, Regions 2 and 3" (a 12.5 kHz grid from 144 MHz that left out
    /// 146.52 MHz): read as the Region 2 plan, never written.
    TwoMetreRegion2And3,
    /// The builder's own channels, MHz.
    OwnList {
        /// Channel centres, MHz.
        channels_mhz: Vec<Megahertz>,
    },
}

/// One bench measurement.
#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(rename = "Reading", deny_unknown_fields)]
pub struct ReadingSheet {
    /// Measured frequency, MHz.
    pub measured_mhz: Megahertz,
    /// Coil length (turns × pitch) at the time, mm.
    pub coil_length_mm: Millimetres,
    /// Trimmer setting at the time, percent.
    pub trimmer_percent: Percent,
    /// A known capacitor clipped across the tank for this reading, pF (0 or absent: none).
    #[serde(default, skip_serializing_if = "is_zero_pf")]
    pub added_pf: Picofarads,
    /// That capacitor's tolerance, percent (absent: not stated; the fit takes ±5 %).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub added_tolerance_percent: Option<Percent>,
    /// What it was measured with.
    #[serde(default)]
    pub instrument: String,
    /// The instrument's frequency error, ppm, if known.
    #[serde(default)]
    pub error_ppm: Option<f64>,
    /// Anything else.
    #[serde(default)]
    pub note: String,
    /// The fit takes this reading even when it suspects it of being a harmonic (absent:
    /// false, so files written before it read as they did).
    #[serde(default, skip_serializing_if = "is_false")]
    pub include_anyway: bool,
}

/// Whether a switch is off (written only when on).
fn is_false(b: &bool) -> bool {
    !*b
}

/// Only the version, for reading it before anything else; every other field is ignored.
#[derive(Deserialize)]
#[serde(rename = "TankwrightRecipe")]
pub(crate) struct SchemaProbe {
    /// The file's schema.
    pub schema: u64,
}

//! The stage as a builder sets it and a recipe keeps it (SI): the topology, the supply and
//! resistors, the transistor as its four figures or the `.model` line as pasted, its ratings,
//! the battery and, in the common-collector stage, a Clapp series capacitor. The window's stage
//! panel, `tankwright stage` and the recipe file hold this one type; [`StageSettings::inputs`]
//! reads it into what the analysis takes, refusing what is out of range with the range.

use super::transistor::{BETA_RANGE, Ratings, Transistor};
use crate::units;

/// No conversion (volts, ohms, a ratio).
fn same(x: f64) -> f64 {
    x
}
use super::{
    BATTERY_RANGE_MAH, Bias, RESISTOR_RANGE_OHM, SUPPLY_RANGE_V, StageError, StageInputs, Topology,
};

/// Accepted base–emitter capacitance of the four figures, farads.
pub const CBE_RANGE_F: (f64, f64) = (0.0, 1e-9);
/// Accepted base–collector capacitance of the four figures, farads.
pub const CBC_RANGE_F: (f64, f64) = (0.0, 100e-12);
/// Accepted transit frequency, hertz.
pub const FT_RANGE_HZ: (f64, f64) = (10e6, 100e9);
/// Accepted Clapp series capacitor, farads: from 0.5 pF (below it the hand's and the leads'
/// capacitance rule it; common practice) to 1 nF (past it, the capacitor is a mere DC block).
pub const CLAPP_RANGE_F: (f64, f64) = (0.5e-12, 1e-9);
/// Accepted collector–emitter rating, volts.
pub const VCEO_RANGE_V: (f64, f64) = (1.0, 1000.0);
/// Accepted collector current rating, amperes.
pub const IC_MAX_RANGE_A: (f64, f64) = (10e-6, 10.0);
/// Accepted dissipation rating, watts.
pub const PTOT_RANGE_W: (f64, f64) = (1e-3, 100.0);

/// The transistor as given: four figures, or a pasted `.model` line kept as written.
#[derive(Clone, Debug, PartialEq)]
pub enum TransistorSpec {
    /// hFE, the two junction capacitances (farads) and the transit frequency (hertz).
    Figures {
        /// Current gain.
        hfe: f64,
        /// Base–emitter capacitance, farads.
        cbe: f64,
        /// Base–collector capacitance, farads.
        cbc: f64,
        /// Transit frequency, hertz.
        ft: f64,
    },
    /// A SPICE `.model NAME NPN(...)` line, as pasted.
    Model(String),
}

/// Everything the builder sets for the stage (SI).
#[derive(Clone, Debug, PartialEq)]
pub struct StageSettings {
    /// Common base or common collector.
    pub topology: Topology,
    /// Supply and bias resistors.
    pub bias: Bias,
    /// The transistor.
    pub transistor: TransistorSpec,
    /// Ratings to check against (each optional).
    pub ratings: Ratings,
    /// The battery's capacity, coulombs (1 mAh = 3.6 C).
    pub battery_charge: Option<f64>,
    /// A Clapp series capacitor between the tank and the base (common collector only), farads.
    pub clapp: Option<f64>,
}

impl Default for StageSettings {
    /// The Lantern Hill club's bench stage (demo data): a 9 V battery of 500 mAh, a 10 k /
    /// 10 k base divider and 100 k in the emitter, a small VHF transistor's figures.
    fn default() -> Self {
        Self {
            topology: Topology::CommonBase,
            bias: Bias {
                supply_v: 9.0,
                upper: 10e3,
                lower: 10e3,
                emitter: 100e3,
            },
            transistor: TransistorSpec::Figures {
                hfe: 80.0,
                cbe: 2e-12,
                cbc: 0.8e-12,
                ft: 800e6,
            },
            ratings: Ratings::default(),
            battery_charge: Some(units::from_mah(500.0)),
            clapp: None,
        }
    }
}

/// Why a setting is refused: the setting's key (as the recipe file names it) and the reason
/// with the accepted range.
#[derive(Clone, Debug, PartialEq)]
pub struct SettingRefused {
    /// The file's key (`supply_v`, `hfe`, `clapp_pf`, …).
    pub key: &'static str,
    /// Why, with the range.
    pub reason: String,
}

fn within(
    key: &'static str,
    what: &str,
    v: f64,
    (lo, hi): (f64, f64),
    to: fn(f64) -> f64,
    unit: &str,
) -> Result<(), SettingRefused> {
    if v.is_finite() && (lo..=hi).contains(&v) {
        Ok(())
    } else {
        // To nine figures: 1 nF reads 1000 pF, not 1000.0000000000001.
        let s = |x: f64| {
            let v = to(x);
            format!("{}", format!("{v:.9e}").parse::<f64>().unwrap_or(v))
        };
        Err(SettingRefused {
            key,
            reason: format!(
                "{what} {} {unit} is outside {}–{} {unit}",
                s(v),
                s(lo),
                s(hi)
            ),
        })
    }
}

impl StageSettings {
    /// The first setting out of its range, or `Ok` (the `.model` line is read, and refused
    /// with the reader's reason).
    pub fn check(&self) -> Result<(), SettingRefused> {
        let b = &self.bias;
        within(
            "supply_v",
            "the supply",
            b.supply_v,
            SUPPLY_RANGE_V,
            same,
            "V",
        )?;
        let r = RESISTOR_RANGE_OHM;
        within(
            "bias_upper_ohm",
            "the upper bias resistor",
            b.upper,
            r,
            same,
            "ohm",
        )?;
        within(
            "bias_lower_ohm",
            "the lower bias resistor",
            b.lower,
            r,
            same,
            "ohm",
        )?;
        within(
            "emitter_ohm",
            "the emitter resistor",
            b.emitter,
            r,
            same,
            "ohm",
        )?;
        match &self.transistor {
            TransistorSpec::Figures { hfe, cbe, cbc, ft } => {
                within("hfe", "hFE", *hfe, BETA_RANGE, same, "")?;
                within(
                    "cbe_pf",
                    "the base–emitter capacitance",
                    *cbe,
                    CBE_RANGE_F,
                    units::to_pf,
                    "pF",
                )?;
                within(
                    "cbc_pf",
                    "the base–collector capacitance",
                    *cbc,
                    CBC_RANGE_F,
                    units::to_pf,
                    "pF",
                )?;
                within(
                    "ft_mhz",
                    "the transit frequency",
                    *ft,
                    FT_RANGE_HZ,
                    units::to_mhz,
                    "MHz",
                )?;
            }
            TransistorSpec::Model(text) => {
                Transistor::from_model(text).map_err(|e| SettingRefused {
                    key: "transistor",
                    reason: e.to_string(),
                })?;
            }
        }
        let t = &self.ratings;
        if let Some(v) = t.collector_emitter_max {
            within("vceo_v", "the V_CEO rating", v, VCEO_RANGE_V, same, "V")?;
        }
        if let Some(v) = t.collector_max {
            within(
                "ic_max_ma",
                "the collector current rating",
                v,
                IC_MAX_RANGE_A,
                units::to_ma,
                "mA",
            )?;
        }
        if let Some(v) = t.dissipation_max {
            within(
                "ptot_mw",
                "the dissipation rating",
                v,
                PTOT_RANGE_W,
                units::to_mw,
                "mW",
            )?;
        }
        if let Some(q) = self.battery_charge {
            let mah = (
                units::from_mah(BATTERY_RANGE_MAH.0),
                units::from_mah(BATTERY_RANGE_MAH.1),
            );
            within("battery_mah", "the battery", q, mah, units::to_mah, "mAh")?;
        }
        if let Some(c) = self.clapp {
            within(
                "clapp_pf",
                "the Clapp capacitor",
                c,
                CLAPP_RANGE_F,
                units::to_pf,
                "pF",
            )?;
            if self.topology != Topology::CommonCollector {
                return Err(SettingRefused {
                    key: "clapp_pf",
                    reason: "a Clapp series capacitor belongs to the common-collector stage \
                             (choose that topology, or leave the capacitor out)"
                        .to_owned(),
                });
            }
        }
        Ok(())
    }

    /// The transistor these settings describe, with their ratings.
    pub fn transistor(&self) -> Result<Transistor, StageError> {
        let mut t = match &self.transistor {
            TransistorSpec::Figures { hfe, cbe, cbc, ft } => {
                Transistor::from_figures(*hfe, *cbe, *cbc, *ft)
            }
            TransistorSpec::Model(text) => {
                Transistor::from_model(text).map_err(|e| StageError(e.to_string()))?
            }
        };
        t.ratings = self.ratings;
        Ok(t)
    }

    /// What the analysis takes, or the first setting refused (with its range).
    pub fn inputs(&self) -> Result<StageInputs, StageError> {
        self.check().map_err(|e| StageError(e.reason))?;
        Ok(StageInputs {
            topology: self.topology,
            bias: self.bias,
            transistor: self.transistor()?,
            battery_charge: self.battery_charge,
            clapp: self.clapp,
        })
    }
}

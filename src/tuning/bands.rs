//! Band plans: the channels a tank may be aimed at, the band they lie in, and the service's
//! practice (how close counts as "on channel", how much room to leave at the band's edges).
//!
//! Each plan names the regulation or band plan it follows beside it. Where a figure is the
//! trade's habit rather than a published number it is marked "common practice"; where it is
//! recalled rather than checked against the document, "from memory".

use super::service::{Band, Service};
use crate::units::{to_khz, to_mhz};

/// A list of channel centres to aim at.
#[derive(Clone, Debug, PartialEq)]
pub enum BandPlan {
    /// US FM broadcast, 47 CFR §73.201 (FM broadcast band 88–108 MHz, channels 201–300 at
    /// 88.1–107.9 MHz on 200 kHz).
    UsFm,
    /// FM broadcast on a 100 kHz raster, 87.5–108.0 MHz: the band of ITU Radio Regulations
    /// Article 5 for Region 1 (87.5–108 MHz) with carriers on multiples of 100 kHz, as
    /// planned in the Geneva 1984 regional agreement (GE84) — raster from memory, common
    /// practice in Europe, Africa and much of Asia.
    Fm100k,
    /// Japan's FM band since the 2014 wide-FM extension: 76–95 MHz, 100 kHz raster
    /// (76.1–94.9 MHz). The 90–95 MHz part was opened in 2014 for the FM relays of AM
    /// stations; a further 95–99 MHz extension was opened in May 2025 (both from press
    /// reports, not the Ministry's text; raster common practice).
    JapanFmWide,
    /// Japan's traditional FM band, 76–90 MHz, 100 kHz raster (76.1–89.9 MHz; common
    /// practice, from memory).
    JapanFm,
    /// 2 m amateur band, ITU Region 1: 144–146 MHz (ITU Radio Regulations Article 5). FM
    /// channels of the IARU Region 1 VHF band plan (12.5 kHz spacing since Tel Aviv 1996):
    /// V00–V63 = 145.000–145.7875 MHz, Vnn = 145.000 MHz + nn × 12.5 kHz; repeater inputs
    /// V00–V15, simplex V16–V47 with 145.500 MHz (V40) the mobile calling channel, repeater
    /// outputs V48–V63 (channel designators from memory).
    TwoMetreRegion1,
    /// 2 m amateur band, ITU Region 2: 144–148 MHz (RR Article 5; 47 CFR §97.301 in the US).
    /// FM channels of the ARRL 2 m band plan on 15 kHz steps, 146.010–147.990 MHz: repeater
    /// inputs 146.01–146.37, simplex 146.40–146.58 (146.52 the national simplex calling
    /// frequency), repeater outputs 146.61–147.39, simplex 147.42–147.57, repeater inputs
    /// 147.60–147.99 MHz (segments from the ARRL plan, from memory).
    TwoMetreRegion2,
    /// 2 m amateur band, ITU Region 2, in the areas that coordinate 20 kHz FM channels:
    /// even multiples of 20 kHz, 146.020–147.980 MHz, holding 146.52 MHz (common practice in
    /// parts of the US, e.g. simplex 146.42–146.58 MHz; from memory).
    TwoMetreRegion2Step20k,
    /// 2 m amateur band, ITU Region 3: 144–148 MHz (RR Article 5; some countries, Japan
    /// among them, allow only 144–146 MHz). National FM plans differ (12.5, 20 or 25 kHz);
    /// here the 12.5 kHz raster over 145.000–148.000 MHz, which holds the 25 kHz channels,
    /// with 145.000 MHz (JARL FM calling, Japan) and 146.500 MHz (WIA national FM simplex
    /// calling, Australia) named — all from memory.
    TwoMetreRegion3,
    /// A list of the user's own, hertz.
    Custom(Vec<f64>),
}

/// Hertz in a raster, by whole-hertz arithmetic so that no step drifts.
fn raster(first_hz: u64, last_hz: u64, step_hz: u64) -> Vec<f64> {
    let step = usize::try_from(step_hz).unwrap_or(usize::MAX).max(1);
    (first_hz..=last_hz)
        .step_by(step)
        .map(|hz| hz as f64)
        .collect()
}

/// Within 1 Hz: channels are whole hertz, frequencies from files round-trip exactly.
fn same(a: f64, b: f64) -> bool {
    (a - b).abs() < 1.0
}

impl BandPlan {
    /// The built-in plans, for pickers (the custom list is offered separately).
    pub fn built_in() -> Vec<BandPlan> {
        vec![
            BandPlan::UsFm,
            BandPlan::Fm100k,
            BandPlan::JapanFmWide,
            BandPlan::JapanFm,
            BandPlan::TwoMetreRegion1,
            BandPlan::TwoMetreRegion2,
            BandPlan::TwoMetreRegion2Step20k,
            BandPlan::TwoMetreRegion3,
        ]
    }

    /// Name as shown.
    pub fn label(&self) -> &'static str {
        match self {
            BandPlan::UsFm => "FM broadcast, US (88.1–107.9 MHz, 200 kHz)",
            BandPlan::Fm100k => "FM broadcast (87.5–108 MHz, 100 kHz)",
            BandPlan::JapanFmWide => "FM broadcast, Japan with wide FM (76–95 MHz, 100 kHz)",
            BandPlan::JapanFm => "FM broadcast, Japan traditional (76–90 MHz, 100 kHz)",
            BandPlan::TwoMetreRegion1 => "2 m amateur, Region 1 (144–146 MHz, 12.5 kHz FM)",
            BandPlan::TwoMetreRegion2 => "2 m amateur, Region 2 (144–148 MHz, 15 kHz FM)",
            BandPlan::TwoMetreRegion2Step20k => "2 m amateur, Region 2 (144–148 MHz, 20 kHz FM)",
            BandPlan::TwoMetreRegion3 => "2 m amateur, Region 3 (144–148 MHz, 12.5 kHz FM)",
            BandPlan::Custom(_) => "Custom list",
        }
    }

    /// The regulation or band plan the channels follow, with its year, as shown beside the
    /// plan (the doc comment of each variant says which parts are from memory).
    pub fn source(&self) -> &'static str {
        match self {
            BandPlan::UsFm => "47 CFR §73.201 (US FCC rules, FM broadcast channels)",
            BandPlan::Fm100k => {
                "ITU Radio Regulations Art. 5 (Region 1: 87.5–108 MHz); 100 kHz carriers as \
                 planned in the GE84 agreement (Geneva 1984) — common practice"
            }
            BandPlan::JapanFmWide => {
                "Japan (MIC): 76–90 MHz, extended to 95 MHz in 2014 for wide FM; 100 kHz \
                 raster — common practice, from memory (95–99 MHz opened in 2025)"
            }
            BandPlan::JapanFm => {
                "Japan (MIC): 76–90 MHz before 2014; 100 kHz raster — common practice, from \
                 memory"
            }
            BandPlan::TwoMetreRegion1 => {
                "IARU Region 1 VHF band plan (VHF Managers Handbook, 12.5 kHz FM since Tel \
                 Aviv 1996); ITU Radio Regulations Art. 5"
            }
            BandPlan::TwoMetreRegion2 => {
                "ARRL 2 m band plan (FM segments on 15 kHz steps); 47 CFR §97.301; ITU Radio \
                 Regulations Art. 5"
            }
            BandPlan::TwoMetreRegion2Step20k => {
                "Regional US coordination on 20 kHz steps (common practice, from memory); \
                 ITU Radio Regulations Art. 5"
            }
            BandPlan::TwoMetreRegion3 => {
                "ITU Radio Regulations Art. 5 (Region 3: 144–148 MHz); national plans differ \
                 (JARL, WIA) — from memory"
            }
            BandPlan::Custom(_) => "your own list",
        }
    }

    /// Channel centres in hertz, ascending. A custom list is sorted, with duplicates and
    /// nonsense (non-finite, not positive) left out; [`parse_channel_list`] says why when
    /// a list is typed.
    ///
    /// [`parse_channel_list`]: super::channel_list::parse_channel_list
    pub fn channels(&self) -> Vec<f64> {
        match self {
            BandPlan::UsFm => raster(88_100_000, 107_900_000, 200_000),
            BandPlan::Fm100k => raster(87_500_000, 108_000_000, 100_000),
            BandPlan::JapanFmWide => raster(76_100_000, 94_900_000, 100_000),
            BandPlan::JapanFm => raster(76_100_000, 89_900_000, 100_000),
            BandPlan::TwoMetreRegion1 => raster(145_000_000, 145_787_500, 12_500),
            BandPlan::TwoMetreRegion2 => raster(146_010_000, 147_990_000, 15_000),
            BandPlan::TwoMetreRegion2Step20k => raster(146_020_000, 147_980_000, 20_000),
            BandPlan::TwoMetreRegion3 => raster(145_000_000, 148_000_000, 12_500),
            BandPlan::Custom(list) => {
                let mut v: Vec<f64> = list
                    .iter()
                    .copied()
                    .filter(|f| f.is_finite() && *f > 0.0)
                    .collect();
                v.sort_by(f64::total_cmp);
                v.dedup();
                v
            }
        }
    }

    /// The channel nearest `frequency`, hertz, or `None` for an empty plan.
    pub fn nearest(&self, frequency: f64) -> Option<f64> {
        self.channels()
            .into_iter()
            .min_by(|a, b| (a - frequency).abs().total_cmp(&(b - frequency).abs()))
    }

    /// Channels inside [low, high] hertz.
    pub fn within(&self, low: f64, high: f64) -> Vec<f64> {
        self.channels()
            .into_iter()
            .filter(|f| (low..=high).contains(f))
            .collect()
    }

    /// Index in [`channels`](Self::channels) of the channel nearest `frequency`, so that a
    /// picker opens at the present channel. `None` for an empty plan.
    pub fn nearest_index(&self, frequency: f64) -> Option<usize> {
        self.channels()
            .iter()
            .enumerate()
            .min_by(|a, b| (a.1 - frequency).abs().total_cmp(&(b.1 - frequency).abs()))
            .map(|(i, _)| i)
    }

    /// The channels whose picker label ([`channel_label`](Self::channel_label)) contains
    /// `typed` (case-insensitive, spaces trimmed): "146.5" finds 146.505, 146.52, …; "V40"
    /// or "calling" finds the calling channels. Empty text: every channel.
    pub fn matching(&self, typed: &str) -> Vec<f64> {
        let t = typed.trim().to_lowercase();
        self.channels()
            .into_iter()
            .filter(|&f| t.is_empty() || self.channel_label(f).to_lowercase().contains(&t))
            .collect()
    }

    /// Whether `frequency` (hertz) is one of the plan's channels (within 1 Hz).
    pub fn has_channel(&self, frequency: f64) -> bool {
        self.channels().iter().any(|&c| same(c, frequency))
    }

    /// The band the plan's channels lie in. A custom list takes the band of the first
    /// service whose band holds every channel (see [`Band::holding`]); `None` when no
    /// service's band holds them all.
    pub fn band(&self) -> Option<Band> {
        match self {
            BandPlan::UsFm => Some(Band::US_FM),
            BandPlan::Fm100k => Some(Band::FM_REGION_1),
            BandPlan::JapanFmWide => Some(Band::JAPAN_FM_WIDE),
            BandPlan::JapanFm => Some(Band::JAPAN_FM),
            BandPlan::TwoMetreRegion1 => Some(Band::TWO_METRE_REGION_1),
            BandPlan::TwoMetreRegion2 | BandPlan::TwoMetreRegion2Step20k => {
                Some(Band::TWO_METRE_REGION_2)
            }
            BandPlan::TwoMetreRegion3 => Some(Band::TWO_METRE_REGION_3),
            BandPlan::Custom(_) => Band::holding(&self.channels()),
        }
    }

    /// The service the plan belongs to, if known (a custom list: that of its band).
    pub fn service(&self) -> Option<Service> {
        self.band().map(|b| b.service)
    }

    /// Default "on channel" tolerance, hertz: the service's practice (see
    /// [`Service::default_tolerance`]), or 10 kHz for a list in no known band (common
    /// practice, our choice). Never derived from the spacing of the channels.
    pub fn default_tolerance(&self) -> f64 {
        self.service()
            .map_or(GENERIC_TOLERANCE, Service::default_tolerance)
    }

    /// Default drift margin at the band's edges, hertz (see [`Service::default_edge_margin`]).
    pub fn default_edge_margin(&self) -> f64 {
        self.service()
            .map_or(GENERIC_EDGE_MARGIN, Service::default_edge_margin)
    }

    /// What the plan says about a channel beyond its frequency: the US channel number, the
    /// IARU Region 1 designator, a calling frequency, the segment. `None` for an unnamed
    /// frequency.
    pub fn channel_note(&self, frequency: f64) -> Option<String> {
        let khz = to_khz(frequency).round() as i64;
        match self {
            BandPlan::UsFm => us_fm_channel_number(frequency).map(|n| format!("channel {n}")),
            BandPlan::TwoMetreRegion1 => {
                let steps = (frequency - 145.0e6) / 12_500.0;
                let n = steps.round();
                if !(0.0..=63.0).contains(&n) || !same(steps * 12_500.0, n * 12_500.0) {
                    return None;
                }
                let n = n as u32;
                let what = match n {
                    0..=15 => "repeater input",
                    16 => "simplex (space communication)",
                    30 => "simplex, digital voice calling",
                    40 => "simplex, mobile calling",
                    17..=47 => "simplex",
                    _ => "repeater output",
                };
                Some(format!("V{n:02}, {what}"))
            }
            BandPlan::TwoMetreRegion2 | BandPlan::TwoMetreRegion2Step20k => {
                if khz == 146_520 {
                    return Some("national simplex calling".to_owned());
                }
                let what = match khz {
                    146_010..=146_370 | 147_600..=147_990 => "repeater input",
                    146_400..=146_580 | 147_420..=147_570 => "simplex",
                    146_610..=147_390 => "repeater output",
                    _ => return None,
                };
                Some(what.to_owned())
            }
            BandPlan::TwoMetreRegion3 => match khz {
                145_000 => Some("FM calling, Japan (JARL)".to_owned()),
                146_500 => Some("national FM simplex calling, Australia (WIA)".to_owned()),
                _ => None,
            },
            _ => None,
        }
    }

    /// Decimals (of MHz) every channel of the plan is written with in a list: those of its
    /// raster, so one list never mixes "145.5" with "145.5125" (12.5 kHz: 4, 15 kHz: 3,
    /// 20 kHz: 2, 100 and 200 kHz: 1). A custom list takes the fewest decimals (at least one,
    /// at most four) that write each of its channels exactly.
    pub fn channel_decimals(&self) -> usize {
        match self {
            BandPlan::UsFm | BandPlan::Fm100k | BandPlan::JapanFmWide | BandPlan::JapanFm => 1,
            BandPlan::TwoMetreRegion1 | BandPlan::TwoMetreRegion3 => 4,
            BandPlan::TwoMetreRegion2 => 3,
            BandPlan::TwoMetreRegion2Step20k => 2,
            BandPlan::Custom(_) => {
                let channels = self.channels();
                (1..=4)
                    .find(|&d| {
                        // One unit of the last decimal, hertz: 100 kHz for d = 1.
                        let unit = 10f64.powi(6 - i32::try_from(d).unwrap_or(4));
                        channels
                            .iter()
                            .all(|f| ((f / unit).round() * unit - f).abs() < 0.5)
                    })
                    .unwrap_or(4)
            }
        }
    }

    /// The channel as listed in a picker: frequency with the decimals of the plan's raster
    /// ([`channel_decimals`](Self::channel_decimals): "145.5000", "145.2125"), then its note:
    /// "145.5000 MHz (V40, simplex, mobile calling)".
    pub fn channel_label(&self, frequency: f64) -> String {
        // A typed frequency off the raster keeps its own digits (100.05 is not 100.1).
        let mhz = if self.has_channel(frequency) {
            super::digits::fixed(to_mhz(frequency), self.channel_decimals())
        } else {
            super::digits::channel_mhz(frequency)
        };
        match self.channel_note(frequency) {
            Some(note) => format!("{mhz} MHz ({note})"),
            None => format!("{mhz} MHz"),
        }
    }
}

/// "On channel" tolerance for a list in no known band, hertz (common practice, our choice).
const GENERIC_TOLERANCE: f64 = 10e3;
/// Edge margin for a list in no known band, hertz (as for FM broadcast: common practice).
const GENERIC_EDGE_MARGIN: f64 = 200e3;

/// US FM channel number (201–300) of a frequency on the 200 kHz raster, per 47 CFR §73.201:
/// channel n is centred at 88.1 + 0.2·(n − 201) MHz.
pub fn us_fm_channel_number(frequency: f64) -> Option<u32> {
    let n = ((frequency - 88.1e6) / 0.2e6).round() + 201.0;
    let centre = 88.1e6 + 0.2e6 * (n - 201.0);
    ((201.0..=300.0).contains(&n) && (frequency - centre).abs() < 1.0).then_some(n as u32)
}

//! Radio services and their bands: what a tank's frequencies (and their harmonics) fall in.
//!
//! Allocations follow the ITU Radio Regulations, Article 5 (Table of Frequency Allocations,
//! edition of 2020), where a service's band is named; the tolerance and margin defaults are
//! the trade's practice and marked so.

/// The service a band plan belongs to: it sets how close counts as "on channel" and how
/// much room to leave at the band's edges.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum Service {
    /// FM sound broadcasting (wideband FM, ±75 kHz peak deviation).
    FmBroadcast,
    /// The 2 m amateur band (narrowband FM, ±5 kHz or ±2.5 kHz peak deviation).
    TwoMetreAmateur,
}

impl Service {
    /// Default "on channel" tolerance, hertz. Never derived from channel spacing.
    ///
    /// - FM broadcast: ±15 kHz. A broadcast receiver's 10.7 MHz IF filter is commonly about
    ///   180 kHz wide (from memory: the usual ceramic filters come in 110–280 kHz widths)
    ///   and the signal swings ±75 kHz (47 CFR §73.310: 100 % modulation is ±75 kHz); half
    ///   the filter less the swing leaves about 15 kHz before the peaks reach the filter's
    ///   skirt (common practice).
    /// - 2 m amateur FM: ±2.5 kHz: the frequency error commonly held by land-mobile and
    ///   amateur FM equipment (ETSI EN 300 086 allows about that for 25 kHz channels, from
    ///   memory), and what a 15 kHz IF filter leaves beside ±5 kHz deviation with margin
    ///   (common practice).
    pub fn default_tolerance(self) -> f64 {
        match self {
            Service::FmBroadcast => 15e3,
            Service::TwoMetreAmateur => 2.5e3,
        }
    }

    /// Default drift margin at the band's edges, hertz: the room a free-running LC
    /// oscillator needs so that its signal stays inside the band as it warms up.
    ///
    /// About 0.1 % warm-up drift (common practice for a hand-built LC oscillator with NP0
    /// capacitors) plus the peak deviation: FM broadcast 100 kHz + 75 kHz → 200 kHz;
    /// 2 m 146 kHz + 5 kHz → 150 kHz (rounded up; common practice).
    pub fn default_edge_margin(self) -> f64 {
        match self {
            Service::FmBroadcast => 200e3,
            Service::TwoMetreAmateur => 150e3,
        }
    }

    /// Name as shown.
    pub fn label(self) -> &'static str {
        match self {
            Service::FmBroadcast => "FM broadcast",
            Service::TwoMetreAmateur => "2 m amateur",
        }
    }
}

/// A service's band: edges in hertz and its name.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Band {
    /// Lower edge, hertz.
    pub low: f64,
    /// Upper edge, hertz.
    pub high: f64,
    /// Name as shown, with its edges.
    pub name: &'static str,
    /// The service.
    pub service: Service,
}

impl Band {
    /// US FM broadcast band, 88–108 MHz (47 CFR §73.201).
    pub const US_FM: Band = Band::new(88e6, 108e6, "FM broadcast band (88–108 MHz)", FM);
    /// FM broadcast, ITU Region 1: 87.5–108 MHz (RR Article 5).
    pub const FM_REGION_1: Band = Band::new(87.5e6, 108e6, "FM broadcast band (87.5–108 MHz)", FM);
    /// Japan's FM band with the 2014 wide-FM extension, 76–95 MHz (from memory).
    pub const JAPAN_FM_WIDE: Band = Band::new(76e6, 95e6, "Japan FM band (76–95 MHz)", FM);
    /// Japan's traditional FM band, 76–90 MHz (from memory).
    pub const JAPAN_FM: Band = Band::new(76e6, 90e6, "Japan FM band (76–90 MHz)", FM);
    /// 2 m amateur, Region 1: 144–146 MHz (RR Article 5).
    pub const TWO_METRE_REGION_1: Band = Band::new(144e6, 146e6, "2 m band (144–146 MHz)", AM2);
    /// 2 m amateur, Region 2: 144–148 MHz (RR Article 5; 47 CFR §97.301).
    pub const TWO_METRE_REGION_2: Band = Band::new(144e6, 148e6, "2 m band (144–148 MHz)", AM2);
    /// 2 m amateur, Region 3: 144–148 MHz (RR Article 5).
    pub const TWO_METRE_REGION_3: Band = Band::new(144e6, 148e6, "2 m band (144–148 MHz)", AM2);

    const fn new(low: f64, high: f64, name: &'static str, service: Service) -> Band {
        Band {
            low,
            high,
            name,
            service,
        }
    }

    /// Whether `frequency` (hertz) lies inside the band, edges included.
    pub fn contains(&self, frequency: f64) -> bool {
        (self.low..=self.high).contains(&frequency)
    }

    /// The first band that holds every one of `channels` (hertz), tried in the order: FM
    /// broadcast 87.5–108 MHz, Japan 76–95 MHz, 2 m 144–148 MHz. `None` for an empty list or
    /// one that straddles services.
    pub fn holding(channels: &[f64]) -> Option<Band> {
        if channels.is_empty() {
            return None;
        }
        [
            Band::FM_REGION_1,
            Band::JAPAN_FM_WIDE,
            Band::TWO_METRE_REGION_2,
        ]
        .into_iter()
        .find(|b| channels.iter().all(|&f| b.contains(f)))
    }
}

const FM: Service = Service::FmBroadcast;
const AM2: Service = Service::TwoMetreAmateur;

/// The aeronautical band a tank must not reach, hertz (ITU Radio Regulations, Article 5; the
/// figures live once, in [`crate::model::AERONAUTICAL_BAND`]).
pub const AERONAUTICAL: (f64, f64) = crate::model::AERONAUTICAL_BAND;

/// The aeronautical emergency frequency, 121.5 MHz (ITU Radio Regulations Appendix 15).
pub const AERONAUTICAL_EMERGENCY: f64 = 121.5e6;

/// A distress or safety frequency no emission may disturb, with the rule that protects it.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Protected {
    /// Lower edge, hertz (the frequency itself for a single frequency).
    pub low: f64,
    /// Upper edge, hertz (the frequency itself for a single frequency).
    pub high: f64,
    /// The frequency as written, e.g. "156.8 MHz".
    pub frequency: &'static str,
    /// What it is for.
    pub use_: &'static str,
    /// Where it is protected (ITU Radio Regulations; "from memory" where the value was not
    /// checked against the text).
    pub source: &'static str,
}

/// The internationally protected distress and safety frequencies between 70 and 460 MHz:
/// what a VHF tank's fundamental (76–148 MHz) or its 2nd and 3rd harmonics can reach. ITU
/// Radio Regulations, Appendix 15 (frequencies for distress and safety communications for
/// the GMDSS and non-GMDSS, Table 15-2, above 30 MHz) and the Article 5 footnotes named
/// beside each entry. The single frequencies 121.5, 156.525, 156.8 and 243 MHz are those RR
/// No. 5.111 names for search and rescue; 121.5, 156.525, 156.8 and 406–406.1 MHz are those
/// on which RR Article 31 prohibits any emission capable of harmful interference. Values
/// marked "from memory" were not checked against the text of the Regulations here.
pub const PROTECTED: [Protected; 10] = [
    protected(
        121.5e6,
        121.5e6,
        "121.5 MHz",
        "aeronautical emergency frequency",
        "ITU RR Appendix 15, Table 15-2; RR No. 5.111 and 5.200",
    ),
    protected(
        123.1e6,
        123.1e6,
        "123.1 MHz",
        "aeronautical search and rescue, auxiliary to 121.5 MHz",
        "ITU RR Appendix 15, Table 15-2; RR No. 5.200 (from memory)",
    ),
    protected(
        156.3e6,
        156.3e6,
        "156.3 MHz (maritime channel 6)",
        "ship and aircraft search and rescue coordination",
        "ITU RR Appendix 15, Table 15-2 (from memory)",
    ),
    // The guard band either side of channels 70 and 16 (RR No. 5.227 and 5.226, from
    // memory): no emission in 156.4875–156.5625 and 156.7625–156.8375 MHz.
    protected(
        156.4875e6,
        156.5625e6,
        "156.525 MHz (maritime channel 70)",
        "digital selective calling for distress, urgency and safety",
        "ITU RR Appendix 15, Table 15-2; RR No. 5.111 and 5.227 (guard band from memory)",
    ),
    protected(
        156.65e6,
        156.65e6,
        "156.65 MHz (maritime channel 13)",
        "ship-to-ship navigation safety",
        "ITU RR Appendix 15, Table 15-2 (from memory)",
    ),
    protected(
        156.7625e6,
        156.8375e6,
        "156.8 MHz (maritime channel 16)",
        "distress, urgency and safety calling by voice",
        "ITU RR Appendix 15, Table 15-2; RR No. 5.111 and 5.226 (guard band from memory)",
    ),
    protected(
        161.975e6,
        161.975e6,
        "161.975 MHz (AIS 1)",
        "AIS search and rescue transmitters",
        "ITU RR Appendix 15, Table 15-2 (from memory)",
    ),
    protected(
        162.025e6,
        162.025e6,
        "162.025 MHz (AIS 2)",
        "AIS search and rescue transmitters",
        "ITU RR Appendix 15, Table 15-2 (from memory)",
    ),
    protected(
        243e6,
        243e6,
        "243 MHz",
        "survival craft and search and rescue (military aeronautical emergency)",
        "ITU RR Appendix 15, Table 15-2; RR No. 5.111 and 5.256",
    ),
    protected(
        406e6,
        406.1e6,
        "406.0–406.1 MHz",
        "satellite distress beacons (EPIRB, ELT, PLB: COSPAS-SARSAT)",
        "ITU RR Appendix 15, Table 15-2; RR No. 5.266 and 5.267 (from memory)",
    ),
];

const fn protected(
    low: f64,
    high: f64,
    frequency: &'static str,
    use_: &'static str,
    source: &'static str,
) -> Protected {
    Protected {
        low,
        high,
        frequency,
        use_,
        source,
    }
}

/// The protected frequencies that [low, high] hertz touches (edges included), ascending.
pub fn protected_touched(low: f64, high: f64) -> Vec<&'static Protected> {
    PROTECTED
        .iter()
        .filter(|p| p.low <= high && p.high >= low)
        .collect()
}

/// Intermediate frequency of broadcast FM receivers, 10.7 MHz (common practice).
pub const BROADCAST_IF: f64 = 10.7e6;

/// One allocation a harmonic can land in.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Allocation {
    /// Lower edge, hertz.
    pub low: f64,
    /// Upper edge, hertz.
    pub high: f64,
    /// What it is, with its source.
    pub name: &'static str,
}

/// Allocations worth naming for a VHF tank's harmonics (ITU Radio Regulations Article 5
/// unless marked; edges rounded to what matters for a caution).
pub const ALLOCATIONS: [Allocation; 13] = [
    alloc(76e6, 95e6, "FM broadcast, Japan (76–95 MHz)"),
    alloc(87.5e6, 108e6, "FM broadcast (87.5–108 MHz, RR Art. 5)"),
    alloc(
        108e6,
        137e6,
        "aeronautical band (108–137 MHz: navigation and air-traffic voice, RR Art. 5)",
    ),
    alloc(
        137e6,
        138e6,
        "weather and space-operation satellites (137–138 MHz, RR Art. 5)",
    ),
    alloc(
        144e6,
        148e6,
        "2 m amateur band (144–146/148 MHz, RR Art. 5)",
    ),
    alloc(
        156e6,
        162.05e6,
        "maritime VHF (156–162.05 MHz, RR Appendix 18; channel 16 at 156.8 MHz)",
    ),
    alloc(
        174e6,
        230e6,
        "broadcasting Band III: TV and DAB (174–230 MHz, RR Art. 5; US TV channels 7–13 at \
         174–216 MHz)",
    ),
    alloc(
        225e6,
        400e6,
        "military aeronautical UHF (225–400 MHz, common practice)",
    ),
    alloc(
        406e6,
        406.1e6,
        "distress beacons (406–406.1 MHz, RR Art. 5: COSPAS-SARSAT)",
    ),
    alloc(430e6, 440e6, "70 cm amateur band (430–440 MHz, RR Art. 5)"),
    alloc(
        440e6,
        470e6,
        "land mobile UHF (about 440–470 MHz, common practice)",
    ),
    alloc(
        470e6,
        694e6,
        "UHF television (470–694 MHz in Region 1, RR Art. 5)",
    ),
    alloc(
        52.5e6,
        76e6,
        "VHF low band: TV Band I and land mobile (common practice)",
    ),
];

const fn alloc(low: f64, high: f64, name: &'static str) -> Allocation {
    Allocation { low, high, name }
}

/// The allocations that [low, high] hertz touches, in ascending order of their lower edge.
pub fn allocations_touched(low: f64, high: f64) -> Vec<&'static Allocation> {
    let mut out: Vec<&'static Allocation> = ALLOCATIONS
        .iter()
        .filter(|a| a.low <= high && a.high >= low)
        .collect();
    out.sort_by(|a, b| a.low.total_cmp(&b.low));
    out
}

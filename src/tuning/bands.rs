//! Band plans: the channels a tank may be aimed at.

/// A list of channel centres to aim at.
#[derive(Clone, Debug, PartialEq)]
pub enum BandPlan {
    /// US FM broadcast, 47 CFR §73.201: 88.1–107.9 MHz on 200 kHz (channels 201–300).
    UsFm,
    /// FM broadcast on a 100 kHz raster, 87.5–108.0 MHz (common practice in many regions).
    Fm100k,
    /// 2 m amateur band, ITU Region 1: 144–146 MHz (47 CFR §97.301 notes the regions), on a
    /// 12.5 kHz raster (common practice).
    TwoMetreRegion1,
    /// 2 m amateur band, ITU Regions 2 and 3: 144–148 MHz, 12.5 kHz raster.
    TwoMetreRegion23,
    /// A list of the user's own, hertz.
    Custom(Vec<f64>),
}

impl BandPlan {
    /// The built-in plans, for pickers.
    pub fn built_in() -> [BandPlan; 4] {
        [
            BandPlan::UsFm,
            BandPlan::Fm100k,
            BandPlan::TwoMetreRegion1,
            BandPlan::TwoMetreRegion23,
        ]
    }

    /// Name as shown.
    pub fn label(&self) -> &'static str {
        match self {
            BandPlan::UsFm => "FM broadcast, US (88.1–107.9 MHz, 200 kHz)",
            BandPlan::Fm100k => "FM broadcast (87.5–108 MHz, 100 kHz)",
            BandPlan::TwoMetreRegion1 => "2 m amateur, Region 1 (144–146 MHz)",
            BandPlan::TwoMetreRegion23 => "2 m amateur, Regions 2/3 (144–148 MHz)",
            BandPlan::Custom(_) => "Custom list",
        }
    }

    /// Channel centres in hertz, ascending.
    pub fn channels(&self) -> Vec<f64> {
        // Whole-number kHz arithmetic avoids drift in the rasters.
        let raster = |first_khz: u64, last_khz: u64, step_hz: u64| -> Vec<f64> {
            (first_khz * 1000..=last_khz * 1000)
                .step_by(usize::try_from(step_hz).unwrap_or(1))
                .map(|hz| hz as f64)
                .collect()
        };
        match self {
            BandPlan::UsFm => raster(88_100, 107_900, 200_000),
            BandPlan::Fm100k => raster(87_500, 108_000, 100_000),
            BandPlan::TwoMetreRegion1 => raster(144_000, 146_000, 12_500),
            BandPlan::TwoMetreRegion23 => raster(144_000, 148_000, 12_500),
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
}

/// US FM channel number (201–300) of a frequency on the 200 kHz raster, per 47 CFR §73.201:
/// channel n is centred at 88.1 + 0.2·(n − 201) MHz.
pub fn us_fm_channel_number(frequency: f64) -> Option<u32> {
    let n = ((frequency - 88.1e6) / 0.2e6).round() + 201.0;
    let centre = 88.1e6 + 0.2e6 * (n - 201.0);
    ((201.0..=300.0).contains(&n) && (frequency - centre).abs() < 1.0).then_some(n as u32)
}

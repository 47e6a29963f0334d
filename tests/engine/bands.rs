//! Band plan tables against the regulations and band plans they name, the default
//! tolerances (never from the channel spacing) and typed lists refused with a message.

use tankwright::tuning::BandPlan;
use tankwright::tuning::bands::us_fm_channel_number;
use tankwright::tuning::channel_list::{parse_channel_list, parse_target_mhz};
use tankwright::tuning::service::Service;

fn first_last_count(plan: &BandPlan) -> (f64, f64, usize) {
    let ch = plan.channels();
    (ch[0], *ch.last().expect("channels"), ch.len())
}

/// Steps between neighbouring channels, to the hertz.
fn steps(plan: &BandPlan) -> Vec<i64> {
    plan.channels()
        .windows(2)
        .map(|w| (w[1] - w[0]).round() as i64)
        .collect()
}

/// 47 CFR §73.201: the FM broadcast band is 88–108 MHz; channels 201–300, channel n centred
/// at 88.1 + 0.2 (n − 201) MHz.
#[test]
fn us_fm_follows_47_cfr_73_201() {
    let plan = BandPlan::UsFm;
    assert_eq!(first_last_count(&plan), (88.1e6, 107.9e6, 100));
    assert!(steps(&plan).iter().all(|&s| s == 200_000));
    let band = plan.band().expect("a band");
    assert_eq!((band.low, band.high), (88e6, 108e6));
    assert_eq!(us_fm_channel_number(88.1e6), Some(201));
    assert_eq!(us_fm_channel_number(107.9e6), Some(300));
    assert_eq!(plan.channel_note(98.7e6).as_deref(), Some("channel 254"));
}

/// ITU RR Art. 5 (Region 1 broadcasting 87.5–108 MHz) with carriers on multiples of
/// 100 kHz (GE84 planning; common practice): 87.5 … 108.0 MHz is 206 raster points.
#[test]
fn fm_100_khz_raster_spans_87_5_to_108() {
    let plan = BandPlan::Fm100k;
    assert_eq!(first_last_count(&plan), (87.5e6, 108.0e6, 206));
    assert!(steps(&plan).iter().all(|&s| s == 100_000));
    let band = plan.band().expect("a band");
    assert_eq!((band.low, band.high), (87.5e6, 108e6));
}

/// Japan: 76–90 MHz traditionally, 76–95 MHz since the 2014 wide-FM extension (press
/// reports of the Ministry's decision; stations such as 90.5 and 93.0 MHz in Tokyo since
/// 2015), 100 kHz raster (common practice): 76.1–89.9 and 76.1–94.9 MHz.
#[test]
fn japan_fm_bands() {
    let wide = BandPlan::JapanFmWide;
    assert_eq!(first_last_count(&wide), (76.1e6, 94.9e6, 189));
    assert!(wide.has_channel(90.5e6) && wide.has_channel(93.0e6));
    let b = wide.band().expect("a band");
    assert_eq!((b.low, b.high), (76e6, 95e6));
    let old = BandPlan::JapanFm;
    assert_eq!(first_last_count(&old), (76.1e6, 89.9e6, 139));
    assert!(!old.has_channel(90.5e6));
    let b = old.band().expect("a band");
    assert_eq!((b.low, b.high), (76e6, 90e6));
    assert!(
        steps(&wide)
            .iter()
            .chain(&steps(&old))
            .all(|&s| s == 100_000)
    );
}

/// IARU Region 1 VHF band plan (12.5 kHz FM channels since Tel Aviv 1996): repeater inputs
/// 145.000–145.1875, simplex 145.200–145.5875 with 145.500 MHz mobile calling (V40),
/// repeater outputs 145.600–145.7875 MHz; band 144–146 MHz (RR Art. 5).
#[test]
fn region_1_two_metre_fm_channels() {
    let plan = BandPlan::TwoMetreRegion1;
    assert_eq!(first_last_count(&plan), (145.0e6, 145.7875e6, 64));
    assert!(steps(&plan).iter().all(|&s| s == 12_500));
    assert_eq!(
        plan.channel_note(145.5e6).as_deref(),
        Some("V40, simplex, mobile calling")
    );
    assert_eq!(
        plan.channel_note(145.2e6).as_deref(),
        Some("V16, simplex (space communication)")
    );
    assert_eq!(
        plan.channel_note(145.5875e6).as_deref(),
        Some("V47, simplex")
    );
    assert_eq!(
        plan.channel_note(145.6e6).as_deref(),
        Some("V48, repeater output")
    );
    assert_eq!(
        plan.channel_note(145.1875e6).as_deref(),
        Some("V15, repeater input")
    );
    assert_eq!(plan.channel_note(145.2063e6), None, "between channels");
    assert_eq!(
        plan.channel_label(145.2125e6),
        "145.2125 MHz (V17, simplex)"
    );
    let labels: std::collections::BTreeSet<String> = plan
        .channels()
        .iter()
        .map(|&f| plan.channel_label(f))
        .collect();
    assert_eq!(labels.len(), 64, "every channel's label is distinct");
    let b = plan.band().expect("a band");
    assert_eq!((b.low, b.high), (144e6, 146e6));
}

/// ARRL 2 m band plan (Region 2): 146.52 MHz the national simplex calling frequency; simplex
/// 146.40–146.58 and 147.42–147.57 MHz, repeater outputs 146.61–147.39 MHz, on 15 kHz steps;
/// band 144–148 MHz (47 CFR §97.301).
#[test]
fn region_2_two_metre_plan_holds_146_52() {
    let plan = BandPlan::TwoMetreRegion2;
    assert!(plan.has_channel(146.52e6));
    assert_eq!(
        plan.channel_note(146.52e6).as_deref(),
        Some("national simplex calling")
    );
    assert_eq!(first_last_count(&plan), (146.01e6, 147.99e6, 133));
    assert!(steps(&plan).iter().all(|&s| s == 15_000));
    // The simplex segments as the plan lists them.
    assert_eq!(plan.within(146.40e6, 146.58e6).len(), 13);
    assert_eq!(plan.within(147.42e6, 147.57e6).len(), 11);
    for f in [146.40e6, 146.58e6, 147.42e6, 147.57e6, 146.61e6, 147.39e6] {
        assert!(plan.has_channel(f), "{f}");
    }
    assert_eq!(
        plan.channel_note(146.94e6).as_deref(),
        Some("repeater output")
    );
    let b = plan.band().expect("a band");
    assert_eq!((b.low, b.high), (144e6, 148e6));
    // 20 kHz areas: 146.52 and 146.94 are on that grid too (common practice).
    let p20 = BandPlan::TwoMetreRegion2Step20k;
    assert!(p20.has_channel(146.52e6) && p20.has_channel(146.94e6));
    assert!(steps(&p20).iter().all(|&s| s == 20_000));
    assert_eq!(first_last_count(&p20), (146.02e6, 147.98e6, 99));
}

/// Region 3 (RR Art. 5: 144–148 MHz; from memory: JARL FM calling 145.00 MHz, WIA national
/// FM simplex calling 146.500 MHz).
#[test]
fn region_3_two_metre_plan() {
    let plan = BandPlan::TwoMetreRegion3;
    assert!(plan.has_channel(145.0e6) && plan.has_channel(146.5e6));
    assert!(
        plan.channel_note(145.0e6)
            .is_some_and(|n| n.contains("JARL"))
    );
    assert!(
        plan.channel_note(146.5e6)
            .is_some_and(|n| n.contains("WIA"))
    );
    let b = plan.band().expect("a band");
    assert_eq!((b.low, b.high), (144e6, 148e6));
}

#[test]
fn every_channel_lies_inside_its_plans_band() {
    for plan in BandPlan::built_in() {
        let band = plan.band().expect("built-in plans have a band");
        for f in plan.channels() {
            assert!(band.contains(f), "{} {f}", plan.label());
        }
        assert!(!plan.source().is_empty());
    }
}

/// The tolerance is the service's practice, never the channel spacing: lists with very
/// different spacings in one band get the same tolerance, and it is not the spacing.
#[test]
fn tolerance_never_depends_on_channel_spacing() {
    let fm = Service::FmBroadcast.default_tolerance();
    let two = Service::TwoMetreAmateur.default_tolerance();
    for list in [vec![88.5e6, 107.9e6], vec![98.1e6, 98.3e6], vec![99.1e6]] {
        assert_eq!(BandPlan::Custom(list).default_tolerance(), fm);
    }
    for list in [
        vec![146.52e6, 146.94e6, 147.3e6],
        vec![145.5e6, 145.5125e6],
        vec![144.2e6],
    ] {
        assert_eq!(BandPlan::Custom(list).default_tolerance(), two);
    }
    // Plans of one service on 100 and 200 kHz rasters, and 12.5, 15, 20 kHz on 2 m.
    assert_eq!(BandPlan::UsFm.default_tolerance(), fm);
    assert_eq!(BandPlan::Fm100k.default_tolerance(), fm);
    assert_eq!(BandPlan::JapanFm.default_tolerance(), fm);
    for p in [
        BandPlan::TwoMetreRegion1,
        BandPlan::TwoMetreRegion2,
        BandPlan::TwoMetreRegion2Step20k,
        BandPlan::TwoMetreRegion3,
    ] {
        assert_eq!(p.default_tolerance(), two);
    }
    // The defaults are the stated practice (15 kHz FM broadcast, 2.5 kHz 2 m FM), each
    // below half of any channel spacing in the plans.
    assert_eq!((fm, two), (15e3, 2.5e3));
}

#[test]
fn custom_list_refuses_absurd_entries_naming_them() {
    let e = parse_channel_list("99.1, 1e9, 99.1").expect_err("1e9 MHz is absurd");
    assert!(e.0.contains("entry 2"), "{e}");
    assert!(e.0.contains("1000000000 MHz"), "{e}");
    assert!(e.0.contains("outside 1–3000 MHz"), "{e}");
    let e = parse_channel_list("99.1, abc").expect_err("a word");
    assert!(e.0.contains("'abc'") && e.0.contains("entry 2"), "{e}");
    assert!(parse_channel_list(" , ").is_err());
    assert!(parse_channel_list("99.1, NaN").is_err());
    assert!(parse_channel_list("99.1, -5").is_err());
}

#[test]
fn custom_list_removes_duplicates_with_a_note() {
    let list = parse_channel_list("99.1, 101.1; 99.10 99.1").expect("valid");
    assert_eq!(list.channels, vec![99.1e6, 101.1e6]);
    assert_eq!(
        list.notes,
        vec!["99.1 MHz was given 3 times: kept once".to_owned()]
    );
    let plain = parse_channel_list("146.52 146.94").expect("valid");
    assert!(plain.notes.is_empty());
}

/// A target may be any frequency, on a channel or not; nonsense is refused.
#[test]
fn typed_targets() {
    assert_eq!(parse_target_mhz("146.52").expect("valid"), 146.52e6);
    assert_eq!(parse_target_mhz(" 98.75 MHz").expect("valid"), 98.75e6);
    assert!(!BandPlan::UsFm.has_channel(98.75e6));
    assert!(parse_target_mhz("1e9").is_err());
    assert!(parse_target_mhz("").is_err());
    assert!(parse_target_mhz("ninety").is_err());
}

/// Files saved with the old "2 m, Regions 2 and 3" plan (a 12.5 kHz grid from 144 MHz that
/// left out 146.52 MHz) open on the Region 2 plan, and save under its new name.
#[test]
fn old_region_2_and_3_files_open_as_region_2() {
    let (_, text) = tankwright::recipe::demos::SOURCES[1];
    let old = text.replace("plan: TwoMetreRegion1,", "plan: TwoMetreRegion2And3,");
    assert_ne!(old, text);
    let r = tankwright::recipe::format::from_text(&old).expect("opens");
    assert_eq!(r.target.plan, BandPlan::TwoMetreRegion2);
    let saved = tankwright::recipe::format::to_text(&r);
    assert!(saved.contains("plan: TwoMetreRegion2,"), "{saved}");
}

/// A picker opens at the present channel and can be typed into.
#[test]
fn picker_helpers_find_the_present_and_typed_channels() {
    let plan = BandPlan::TwoMetreRegion2;
    let i = plan.nearest_index(146.523e6).expect("a channel");
    assert_eq!(plan.channels()[i], 146.52e6);
    assert_eq!(plan.matching("calling"), vec![146.52e6]);
    assert_eq!(plan.matching("146.5"), plan.within(146.5e6, 146.599e6));
    assert_eq!(BandPlan::TwoMetreRegion1.matching("v40"), vec![145.5e6]);
    assert_eq!(plan.matching("").len(), plan.channels().len());
    assert!(plan.matching("999").is_empty());
    assert_eq!(BandPlan::Custom(Vec::new()).nearest_index(1e8), None);
}

//! Display units at the edge, in one place: every figure is SI inside the tool (metres,
//! farads, henries, hertz, ohms, amperes, watts, volts, seconds), and these are the only
//! conversions to and from the units a builder reads and types (mm, pF, nH, MHz, kHz, mA…).
//!
//! Each pair multiplies by a power of ten in the same way everywhere (`to_*` from SI,
//! `from_*` to SI), so a figure converted in the window, the command line, the sheet and the
//! JSON is the same bits. Formatting (digits, ranges, signs) is `crate::tuning::digits`.

/// Declares a `to_$unit` / `from_$unit` pair from the exact power of ten between the unit and
/// SI (1e3, 1e6, 1e9 and 1e12 are exact in binary floating point; their reciprocals are not):
/// `up` multiplies by it going to the display unit, `down` divides. Multiplying or dividing by
/// an exact power is correctly rounded, so `to_mhz(98.1e6)` is 98.1 and a typed "15.09" mm
/// comes back as 15.09, never 15.090000000000001.
macro_rules! unit_pair {
    ($to:ident, $from:ident, up $power:expr, $si:literal, $unit:literal) => {
        #[doc = concat!($si, " to ", $unit, ".")]
        #[inline]
        #[must_use]
        pub const fn $to(si: f64) -> f64 {
            si * $power
        }

        #[doc = concat!($unit, " to ", $si, ".")]
        #[inline]
        #[must_use]
        pub const fn $from(value: f64) -> f64 {
            value / $power
        }
    };
    ($to:ident, $from:ident, down $power:expr, $si:literal, $unit:literal) => {
        #[doc = concat!($si, " to ", $unit, ".")]
        #[inline]
        #[must_use]
        pub const fn $to(si: f64) -> f64 {
            si / $power
        }

        #[doc = concat!($unit, " to ", $si, ".")]
        #[inline]
        #[must_use]
        pub const fn $from(value: f64) -> f64 {
            value * $power
        }
    };
}

unit_pair!(to_mm, from_mm, up 1e3, "Metres", "millimetres");
unit_pair!(to_um, from_um, up 1e6, "Metres", "micrometres");
unit_pair!(to_pf, from_pf, up 1e12, "Farads", "picofarads");
unit_pair!(to_nf, from_nf, up 1e9, "Farads", "nanofarads");
unit_pair!(to_uf, from_uf, up 1e6, "Farads", "microfarads");
unit_pair!(to_nh, from_nh, up 1e9, "Henries", "nanohenries");
unit_pair!(to_uh, from_uh, up 1e6, "Henries", "microhenries");
unit_pair!(to_mhz, from_mhz, down 1e6, "Hertz", "megahertz");
unit_pair!(to_khz, from_khz, down 1e3, "Hertz", "kilohertz");
unit_pair!(to_ghz, from_ghz, down 1e9, "Hertz", "gigahertz");
unit_pair!(to_ma, from_ma, up 1e3, "Amperes", "milliamperes");
unit_pair!(to_ua, from_ua, up 1e6, "Amperes", "microamperes");
unit_pair!(to_mw, from_mw, up 1e3, "Watts", "milliwatts");
unit_pair!(to_kohm, from_kohm, down 1e3, "Ohms", "kilohms");
unit_pair!(to_mohm, from_mohm, up 1e3, "Ohms", "milliohms");
unit_pair!(to_ms, from_ms, up 1e3, "Seconds", "milliseconds");
unit_pair!(to_us, from_us, up 1e6, "Seconds", "microseconds");
unit_pair!(to_ps, from_ps, up 1e12, "Seconds", "picoseconds");
unit_pair!(to_megohm, from_megohm, down 1e6, "Ohms", "megohms");
unit_pair!(to_millisiemens, from_millisiemens, up 1e3, "Siemens", "millisiemens");
unit_pair!(to_ppm, from_ppm, up 1e6, "A fraction", "parts per million");

/// Hertz to kilohertz per millimetre, for a slope in hertz per metre (the stretch
/// sensitivity as a builder reads it: kHz/mm).
#[inline]
#[must_use]
pub const fn to_khz_per_mm(hz_per_metre: f64) -> f64 {
    hz_per_metre / 1e6
}

/// Coulombs in milliampere-hours (1 mAh = 3.6 C): a battery's capacity.
pub const fn to_mah(coulombs: f64) -> f64 {
    coulombs / 3.6
}

/// Milliampere-hours in coulombs.
pub const fn from_mah(mah: f64) -> f64 {
    mah * 3.6
}

/// A display unit as its two conversions: (from SI, to SI).
pub type Pair = (fn(f64) -> f64, fn(f64) -> f64);

const fn same(x: f64) -> f64 {
    x
}

/// The SI unit itself (volts, ohms, a ratio): no conversion.
pub const AS_SI: Pair = (same, same);
/// Picofarads.
pub const PF: Pair = (to_pf, from_pf);
/// Megahertz.
pub const MHZ: Pair = (to_mhz, from_mhz);
/// Kilohertz.
pub const KHZ: Pair = (to_khz, from_khz);
/// Milliampere-hours.
pub const MAH: Pair = (to_mah, from_mah);

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn each_pair_returns_what_it_was_given() {
        type Conversion = fn(f64) -> f64;
        let pairs: [(Conversion, Conversion); 21] = [
            (to_mm, from_mm),
            (to_um, from_um),
            (to_pf, from_pf),
            (to_nf, from_nf),
            (to_uf, from_uf),
            (to_nh, from_nh),
            (to_uh, from_uh),
            (to_mhz, from_mhz),
            (to_khz, from_khz),
            (to_ghz, from_ghz),
            (to_ma, from_ma),
            (to_ua, from_ua),
            (to_mw, from_mw),
            (to_kohm, from_kohm),
            (to_mohm, from_mohm),
            (to_ms, from_ms),
            (to_ppm, from_ppm),
            (to_us, from_us),
            (to_ps, from_ps),
            (to_megohm, from_megohm),
            (to_millisiemens, from_millisiemens),
        ];
        for (to, from) in pairs {
            for si in [1e-12, 3.3e-9, 0.1, 1.0, 98.7e6] {
                let back = from(to(si));
                assert!(
                    ((back - si) / si).abs() < 4.0 * f64::EPSILON,
                    "{si} → {back}"
                );
            }
        }
    }

    #[test]
    fn the_prefixes_are_the_si_ones() {
        // BIPM, The International System of Units (SI brochure, 9th ed., 2019), Table 7:
        // milli 1e-3, micro 1e-6, nano 1e-9, pico 1e-12, kilo 1e3, mega 1e6, giga 1e9.
        // An exact power of ten, so decimal figures come back as typed.
        let near = |a: f64, b: f64| a == b;
        assert!(near(to_mm(0.012), 12.0));
        assert!(near(to_pf(22e-12), 22.0));
        assert!(near(to_nh(150e-9), 150.0));
        assert!(near(to_mhz(98.7e6), 98.7));
        assert!(near(to_khz(15e3), 15.0));
        assert!(near(from_mm(8.43), 0.00843));
        // 250 kHz per millimetre is 250e3 Hz per 1e-3 m.
        assert!(near(to_khz_per_mm(250e3 / 1e-3), 250.0));
    }
}

//! The chart colours, one home for the window's charts and the printed ones: hues of our own
//! at mid lightness, so they read on the light and the dark panel and print in grey too. The
//! trimmer curves run on a ramp from near-black (0 %, least capacitance) to amber (100 %).
//!
//! Plain 8-bit sRGB triples, free of any drawing library: `ui::charts` turns them into egui
//! colours and `handout::chart_draw` into plotters' (one conversion each).

/// An sRGB colour, 8 bits a channel.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub struct Rgb(pub u8, pub u8, pub u8);

impl Rgb {
    /// The colour a share `t` (0–1, clamped) of the way from `self` to `to`.
    pub fn towards(self, to: Rgb, t: f64) -> Rgb {
        let t = t.clamp(0.0, 1.0);
        let mix = |a: u8, b: u8| (f64::from(a) + (f64::from(b) - f64::from(a)) * t).round() as u8;
        Rgb(mix(self.0, to.0), mix(self.1, to.1), mix(self.2, to.2))
    }
}

/// The 0 % end of the trimmer ramp on paper (the window starts from the theme's strong text).
pub const RAMP_START: Rgb = Rgb(0x26, 0x26, 0x26);
/// The 100 % end of the trimmer ramp.
pub const RAMP_END: Rgb = Rgb(0xd9, 0x74, 0x1c);
/// The present coil or setting.
pub const PRESENT: Rgb = Rgb(0x2f, 0x86, 0xd6);
/// Bench readings.
pub const READING: Rgb = Rgb(0xb8, 0x3f, 0xa8);
/// The model before calibration.
pub const UNCALIBRATED: Rgb = Rgb(0x8c, 0x8c, 0x8c);
/// The classical formulas' comparison curve (dotted) once the field shape is drawn.
pub const CLASSICAL: Rgb = Rgb(0x4f, 0x7a, 0x9e);
/// The oscillator stage's operating frequency: a violet of our own.
pub const OPERATING: Rgb = Rgb(0x7b, 0x52, 0xc4);
/// The target channel.
pub const TARGET: Rgb = Rgb(0x3a, 0xa8, 0x5c);
/// The aeronautical band: a warning red of our own.
pub const AERONAUTICAL: Rgb = Rgb(0xd2, 0x3c, 0x3c);
/// The turns-touching limit on paper (the window uses the theme's error colour).
pub const TOUCHING: Rgb = Rgb(0xb0, 0x30, 0x30);
/// Grid lines on paper.
pub const GRID: Rgb = Rgb(0xe4, 0xe4, 0xe4);
/// Major grid lines on paper.
pub const GRID_BOLD: Rgb = Rgb(0xc8, 0xc8, 0xc8);

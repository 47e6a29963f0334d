//! The highest frequency a bench reading of this tank could show.
//!
//! A reading is the tank's resonance with the coil at the reading's length, the trimmer at its
//! setting and any clipped-on capacitor across it. The calibration explains a reading by a
//! stray capacitance (never below zero) and an inductance scale (never below the lowest the
//! tool accepts, [`Conditions::INDUCTANCE_SCALE_RANGE`]). With no stray at all and the
//! inductance at that lowest scale the tank resonates at its highest: a reading above that
//! cannot be this tank (a harmonic, another oscillator, the instrument's image), and taking it
//! in would need a negative stray. The reading is refused where it enters, with that highest
//! frequency in the reason.

use crate::model::{Coil, Conditions, Tank};
use crate::tuning::fit::Reading;
use crate::tuning::solve::resonance_at_length;
use crate::units::to_mm;

/// Hertz: the tank's resonance for `reading`'s coil length, trimmer setting and added
/// capacitance with no stray and the inductance at the lowest accepted scale (an upper bound
/// on what the bench can see from this tank); NaN for a length the model refuses.
pub fn highest_possible(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    reading: &Reading,
) -> f64 {
    let lowest = Conditions {
        inductance_scale: *Conditions::INDUCTANCE_SCALE_RANGE.start(),
        ..*conditions
    };
    let no_stray = Tank {
        stray: 0.0,
        ..*tank
    };
    let external =
        no_stray.external_capacitance_at(reading.trimmer_setting) + reading.added_capacitance;
    resonance_at_length(coil, reading.length, external, &lowest)
}

/// `Err(reason)` when `reading` lies above [`highest_possible`] for this tank.
pub fn check(
    coil: &Coil,
    tank: &Tank,
    conditions: &Conditions,
    reading: &Reading,
) -> Result<(), String> {
    // A length the model refuses (NaN) is judged by the recipe rules, not here.
    let top = highest_possible(coil, tank, conditions, reading);
    if top.is_finite() && reading.measured > top {
        return Err(format!(
            "{} is above anything this tank can reach: with no stray at all and the \
             inductance at {} of the model's, the coil at {:.2} mm and the trimmer at {:.0} % \
             resonate at most at {}; is it a harmonic or another signal? Check the \
             instrument's reading",
            super::digits::mhz(reading.measured),
            Conditions::INDUCTANCE_SCALE_RANGE.start(),
            to_mm(reading.length),
            reading.trimmer_setting * 100.0,
            super::digits::mhz(top)
        ));
    }
    Ok(())
}

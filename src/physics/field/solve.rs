//! Terminal impedance Z(f) and the first parallel self-resonance of a wire.

use super::geometry::{Feed, FieldError, Structure, WireCoil};
use super::lu::solve_in_place;
use super::matrix::{StaticMatrices, series_terms};
use crate::physics::constants::SPEED_OF_LIGHT;
use num_complex::Complex64;
use std::f64::consts::PI;

/// A wire ready to be solved at any frequency up to its ceiling: the geometry cut into
/// segments and the frequency-independent integrals done.
#[derive(Clone, Debug)]
pub struct FieldModel {
    coil: WireCoil,
    feed: Feed,
    feed_basis: usize,
    segments: usize,
    matrices: StaticMatrices,
}

/// What the field solution says about a coil at one operating frequency.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct FieldSolution {
    /// First parallel self-resonance at the terminals, hertz.
    pub self_resonance: f64,
    /// Apparent inductance X/ω at the operating frequency, henries.
    pub apparent_inductance: f64,
    /// Series resistance Re Z at the operating frequency, ohms (skin effect and radiation;
    /// not the proximity effect between turns).
    pub series_resistance: f64,
    /// Segments the wire was cut into.
    pub segments: usize,
}

impl FieldModel {
    /// Cut `coil` into segments with `per_turn` segments a turn on the helix, driven at `feed`,
    /// and integrate for frequencies up to the coil's [`WireCoil::frequency_ceiling`].
    pub fn new(coil: &WireCoil, per_turn: usize, feed: Feed) -> Result<Self, FieldError> {
        Self::up_to(coil, per_turn, feed, coil.frequency_ceiling())
    }

    /// The unknowns [`FieldModel::new`] would solve for `coil` (the wire cut, nothing
    /// integrated: cheap), for bounding the work before it starts.
    pub fn unknowns(coil: &WireCoil, per_turn: usize, feed: Feed) -> Result<usize, FieldError> {
        Ok(Structure::build(coil, per_turn.max(4), feed)?.bases.len())
    }

    /// As [`FieldModel::new`], for frequencies up to `max_frequency`.
    pub fn up_to(
        coil: &WireCoil,
        per_turn: usize,
        feed: Feed,
        max_frequency: f64,
    ) -> Result<Self, FieldError> {
        if !(max_frequency.is_finite() && max_frequency > 0.0) {
            return Err(FieldError::Frequency(max_frequency));
        }
        let structure = Structure::build(coil, per_turn.max(4), feed)?;
        let k = 2.0 * PI * max_frequency / SPEED_OF_LIGHT;
        let powers = series_terms(k * (structure.extent() + structure.wire_radius));
        super::budget::check(&super::budget::Cost::of(&structure, powers))?;
        let matrices = StaticMatrices::new(&structure, powers);
        Ok(Self {
            coil: *coil,
            feed,
            feed_basis: structure.feed,
            segments: structure.segments.len(),
            matrices,
        })
    }

    /// Segments in the model.
    pub fn segments(&self) -> usize {
        self.segments
    }

    /// Highest frequency this model answers for, hertz.
    pub fn max_frequency(&self) -> f64 {
        self.matrices.max_frequency()
    }

    /// Impedance at the feed, ohms (1 V across the gap over the current through it).
    pub fn impedance(&self, frequency: f64) -> Result<Complex64, FieldError> {
        self.admittance(frequency).map(|y| y.inv())
    }

    /// Admittance at the feed, siemens: the current through the gap for 1 V across it.
    ///
    /// # Formula
    /// The delta-gap source: the tested incident field is V·Λ_m(gap), which is V for the basis
    /// function peaking at the gap and 0 for the rest (Harrington 1968 §4.3), so Y = I_feed/V.
    pub fn admittance(&self, frequency: f64) -> Result<Complex64, FieldError> {
        if !(frequency.is_finite() && frequency > 0.0) || frequency > self.max_frequency() {
            return Err(FieldError::Frequency(frequency));
        }
        let n = self.matrices.size;
        let mut z = self.matrices.assemble(frequency, self.coil.resistivity);
        let mut v = vec![Complex64::new(0.0, 0.0); n];
        let feed = self.feed_basis;
        v[feed] = Complex64::new(1.0, 0.0);
        let current = solve_in_place(&mut z, n, &v).ok_or(FieldError::Singular)?;
        let y = current[feed];
        if y.re.is_finite() && y.im.is_finite() {
            Ok(y)
        } else {
            Err(FieldError::Singular)
        }
    }

    /// The first resonance at the feed, hertz.
    ///
    /// At the terminals this is the first parallel resonance: the susceptance Im Y, negative
    /// (inductive) at low frequency, crosses zero where the reactance has its pole. At the
    /// helix's middle it is the first series resonance, where Im Z crosses zero from below (the
    /// open helix is capacitive at low frequency), which is the first natural mode.
    ///
    /// # Formula
    /// A scan upward in steps of ×1.2 from the frequency at which the loop's wire is an eighth
    /// of a wavelength until the sign changes, then the Illinois variant of regula falsi
    /// (M. Dowell and P. Jarratt, BIT 11, 1971) on the bracket, stopped at 1e-7 relative.
    pub fn first_resonance(&self) -> Result<f64, FieldError> {
        let wire = self.coil.loop_wire_length();
        let ceiling = self.max_frequency();
        let sign_of = |f: f64| -> Result<f64, FieldError> {
            Ok(match self.feed {
                Feed::Terminals => self.admittance(f)?.im,
                Feed::HelixMiddle => self.impedance(f)?.im,
            })
        };
        let mut lo = SPEED_OF_LIGHT / (8.0 * wire);
        let mut g_lo = sign_of(lo)?;
        // Below the first resonance the sign must be negative; step down if it is not.
        let mut tries = 0;
        while g_lo >= 0.0 {
            lo *= 0.5;
            g_lo = sign_of(lo)?;
            tries += 1;
            if tries > 6 {
                return Err(FieldError::NoResonance);
            }
        }
        let (mut hi, mut g_hi);
        loop {
            hi = (lo * 1.2).min(ceiling);
            g_hi = sign_of(hi)?;
            if g_hi > 0.0 {
                break;
            }
            if hi >= ceiling {
                return Err(FieldError::NoResonance);
            }
            lo = hi;
            g_lo = g_hi;
        }
        let stop = crate::physics::roots::Stop {
            width: 0.0,
            relative_width: 1e-7,
            value: 0.0,
            steps: 100,
        };
        Ok(crate::physics::roots::illinois((lo, g_lo), (hi, g_hi), stop, sign_of)?.x)
    }

    /// Self-resonance, apparent inductance and series resistance at `operating_frequency`.
    pub fn solve(&self, operating_frequency: f64) -> Result<FieldSolution, FieldError> {
        let self_resonance = self.first_resonance()?;
        let z = self.impedance(operating_frequency)?;
        Ok(FieldSolution {
            self_resonance,
            apparent_inductance: z.im / (2.0 * PI * operating_frequency),
            series_resistance: z.re,
            segments: self.segments,
        })
    }
}

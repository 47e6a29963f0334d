//! The guided sweep: the coil length moving slowly from close-wound to well spaced and back,
//! and the fine and coarse steps.
//!
//! Time is egui's (`stable_dt` each frame), so a test harness that advances frames advances the
//! sweep by exactly its frame time.

use crate::model::Coil;

/// The coarse step of the length buttons, metres (0.5 mm).
pub const STEP_COARSE: f64 = 0.5e-3;
/// The fine step of the length buttons, metres (0.1 mm).
pub const STEP_FINE: f64 = 0.1e-3;

/// Seconds from one end of the sweep to the other, at the start and at the slider's ends.
pub const SECONDS_DEFAULT: f64 = 20.0;
/// Slowest and fastest sweep the slider offers, seconds end to end.
pub const SECONDS_RANGE: (f64, f64) = (4.0, 60.0);

/// Longest frame the sweep moves through at once, seconds (a stalled frame does not jump).
const LONGEST_FRAME: f64 = 0.25;

/// The lengths the sweep runs between, metres ([`crate::tuning::sweep::teaching_range`]: the
/// coil's shortest buildable length to the longest a solver proposes, widened to hold the
/// coil's own length).
pub fn range(coil: &Coil) -> (f64, f64) {
    crate::tuning::sweep::teaching_range(coil)
}

/// The sweep's state.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Sweep {
    /// Whether the length is moving.
    pub running: bool,
    /// Towards the long end (+1) or the short end (−1).
    pub direction: f64,
    /// Seconds from one end to the other.
    pub seconds: f64,
}

impl Default for Sweep {
    fn default() -> Self {
        Self {
            running: false,
            direction: 1.0,
            seconds: SECONDS_DEFAULT,
        }
    }
}

impl Sweep {
    /// The length `dt` seconds on from `length` inside `(lo, hi)`, turning back at either end.
    pub fn advance(&mut self, length: f64, (lo, hi): (f64, f64), dt: f64) -> f64 {
        let span = hi - lo;
        if span.is_nan() || span <= 0.0 || !length.is_finite() {
            return length;
        }
        let dt = if dt.is_finite() {
            dt.clamp(0.0, LONGEST_FRAME)
        } else {
            0.0
        };
        let seconds = self.seconds.clamp(SECONDS_RANGE.0, SECONDS_RANGE.1);
        let mut next = length.clamp(lo, hi) + self.direction * span / seconds * dt;
        if next >= hi {
            next = hi - (next - hi).min(span);
            self.direction = -1.0;
        } else if next <= lo {
            next = lo + (lo - next).min(span);
            self.direction = 1.0;
        }
        next.clamp(lo, hi)
    }
}

/// `length` moved by `step` metres, kept inside `(lo, hi)`.
pub fn stepped(length: f64, step: f64, (lo, hi): (f64, f64)) -> f64 {
    (length + step).clamp(lo, hi)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn advances_at_the_set_pace_and_turns_back_at_the_ends() {
        let mut sweep = Sweep {
            running: true,
            direction: 1.0,
            seconds: 10.0,
        };
        // 10 mm in 10 s: 0.25 s moves 0.25 mm.
        let l = sweep.advance(5e-3, (5e-3, 15e-3), 0.25);
        assert!((l - 5.25e-3).abs() < 1e-12, "{l}");
        let l = sweep.advance(14.9e-3, (5e-3, 15e-3), 0.25);
        assert!((l - 14.85e-3).abs() < 1e-12, "{l}");
        assert_eq!(sweep.direction, -1.0);
        let l = sweep.advance(5.1e-3, (5e-3, 15e-3), 0.25);
        assert!((l - 5.15e-3).abs() < 1e-12, "{l}");
        assert_eq!(sweep.direction, 1.0);
    }

    #[test]
    fn steps_stay_inside_the_buildable_range() {
        assert_eq!(stepped(5.2e-3, -STEP_COARSE, (5e-3, 15e-3)), 5e-3);
        assert!((stepped(6e-3, STEP_FINE, (5e-3, 15e-3)) - 6.1e-3).abs() < 1e-15);
    }
}

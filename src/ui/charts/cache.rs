//! Sweep results kept between frames, recomputed only when the coil, tank or conditions change.

use crate::model::{Coil, Conditions, Tank};
use crate::tuning::landing::Shape;
use crate::tuning::sweep::{SpacingCurve, chart_length_range, spacing_sweep_on, trimmer_sweep_on};

/// Trimmer settings the spacing chart draws a curve for (shared with the hand-outs).
pub use crate::tuning::sweep::CHART_SETTINGS as SETTINGS;

/// Points per curve (shared with the hand-outs).
pub(crate) use crate::tuning::sweep::CHART_SAMPLES as SAMPLES;

/// Sweep results plus the inputs they were computed from; recomputed only when those change.
#[derive(Default)]
pub struct ChartCache {
    inputs: Option<(Coil, Tank, Conditions)>,
    shape: Option<Shape>,
    range: (f64, f64),
    spacing: Vec<SpacingCurve>,
    trimmer: Vec<[f64; 2]>,
    band: Vec<[f64; 3]>,
    band_calibrated: bool,
}

impl ChartCache {
    /// Recompute the sweeps on the classical shape if (coil, tank, conditions) differ from the
    /// last call; true if it recomputed.
    pub fn refresh(&mut self, coil: &Coil, tank: &Tank, conditions: &Conditions) -> bool {
        self.refresh_on(coil, tank, conditions, None)
    }

    /// Recompute the sweeps if (coil, tank, conditions) or the field shape differ from the
    /// last call; true if it recomputed. With a `shape` ([`crate::tuning::landing::chart_shape`]
    /// over [`length_range_swept`](Self::length_range_swept)) every curve is the field-shaped
    /// one; without, the classical model's shape through the present coil.
    pub fn refresh_on(
        &mut self,
        coil: &Coil,
        tank: &Tank,
        conditions: &Conditions,
        shape: Option<&Shape>,
    ) -> bool {
        let inputs = (*coil, *tank, *conditions);
        if self.inputs == Some(inputs) && self.shape.as_ref() == shape {
            return false;
        }
        let range = self.length_range(coil);
        // A fixed tank (no trimmer travel) has one curve: five identical ones would only
        // stack up and fill the hover with the same line five times.
        let settings: &[f64] = if tank.is_fixed() { &[0.0] } else { &SETTINGS };
        self.spacing = spacing_sweep_on(coil, tank, conditions, settings, range, SAMPLES, shape);
        self.trimmer = trimmer_sweep_on(coil, tank, conditions, SAMPLES, shape);
        self.shape = shape.cloned();
        // The sweep raises the low end to the touching limit; keep what it actually used.
        self.range = self
            .spacing
            .first()
            .and_then(|c| Some((c.points.first()?[0], c.points.last()?[0])))
            .unwrap_or(range);
        self.inputs = Some(inputs);
        true
    }

    /// The lengths swept: close-wound to somewhat past the present length.
    ///
    /// The upper end is kept while only the length changes and it still leaves room both ways,
    /// so that dragging the spacing does not rescale the axis under the pointer every frame.
    fn length_range(&self, coil: &Coil) -> (f64, f64) {
        let (lo, wanted) = chart_length_range(coil);
        let same_winding = self
            .inputs
            .is_some_and(|(old, _, _)| same_winding(&old, coil));
        let kept = self.range.1;
        let hi = if same_winding && kept >= 1.2 * coil.length() && kept <= 2.0 * wanted {
            kept
        } else {
            wanted
        };
        (lo, hi)
    }

    /// Lengths swept, metres: (turns touching, longest).
    pub fn length_range_swept(&self) -> (f64, f64) {
        self.range
    }

    /// Whether the curves are on the field shape (else the classical shape through the
    /// present coil).
    pub fn field_shaped(&self) -> bool {
        self.shape.is_some()
    }

    /// Resonance against coil length, one curve per setting in 0/25/50/75/100 %.
    pub fn spacing_curves(&self) -> &[SpacingCurve] {
        &self.spacing
    }

    /// The spacing curve whose trimmer setting is nearest `setting` (a fraction).
    pub fn spacing_curve_nearest(&self, setting: f64) -> Option<&SpacingCurve> {
        self.spacing.iter().min_by(|a, b| {
            (a.setting - setting)
                .abs()
                .total_cmp(&(b.setting - setting).abs())
        })
    }

    /// Keep the spread band around the present curve: (length in metres, low and high hertz),
    /// and whether it is what a bench calibration leaves (set by the evaluation, which
    /// computes it once per change of the recipe).
    pub(crate) fn set_band(&mut self, band: Vec<[f64; 3]>, calibrated: bool) {
        self.band = band;
        self.band_calibrated = calibrated;
    }

    /// The spread band around the present curve and whether it is after a calibration.
    pub fn spread_band(&self) -> (&[[f64; 3]], bool) {
        (&self.band, self.band_calibrated)
    }

    /// Resonance against trimmer setting at the present length: (setting 0–1, hertz).
    pub fn trimmer_curve(&self) -> &[[f64; 2]] {
        &self.trimmer
    }
}

/// Everything but the spacing is the same.
fn same_winding(a: &Coil, b: &Coil) -> bool {
    a.with_length(b.length()).is_ok_and(|a| a == *b)
}

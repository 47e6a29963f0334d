//! The capacitive side of the tank.

/// Two capacitors in series across the tank (the feedback divider of a Colpitts oscillator).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct FeedbackDivider {
    /// Capacitor from the hot end to the tap, farads.
    pub upper: f64,
    /// Capacitor from the tap to ground, farads.
    pub lower: f64,
}

impl FeedbackDivider {
    /// Series capacitance C1·C2/(C1 + C2), farads.
    pub fn series_capacitance(&self) -> f64 {
        let sum = self.upper + self.lower;
        if sum > 0.0 {
            self.upper * self.lower / sum
        } else {
            0.0
        }
    }
}

/// Everything across the coil except its own self-capacitance.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Tank {
    /// Fixed tank capacitor, farads.
    pub fixed: f64,
    /// Trimmer at its minimum, farads.
    pub trimmer_min: f64,
    /// Trimmer at its maximum, farads.
    pub trimmer_max: f64,
    /// Trimmer setting, 0 (minimum capacitance) to 1 (maximum).
    pub trimmer_setting: f64,
    /// Stray capacitance: device, wiring and layout, farads.
    pub stray: f64,
    /// Optional feedback divider across the tank.
    pub feedback: Option<FeedbackDivider>,
}

impl Tank {
    /// Trimmer capacitance at `setting` (0–1), farads, assuming a linear trimmer.
    pub fn trimmer_at(&self, setting: f64) -> f64 {
        self.trimmer_min + setting * (self.trimmer_max - self.trimmer_min)
    }

    /// External capacitance across the coil at the current setting, farads.
    pub fn external_capacitance(&self) -> f64 {
        self.external_capacitance_at(self.trimmer_setting)
    }

    /// External capacitance across the coil at trimmer `setting`, farads.
    pub fn external_capacitance_at(&self, setting: f64) -> f64 {
        self.fixed
            + self.trimmer_at(setting)
            + self.stray
            + self.feedback.map_or(0.0, |f| f.series_capacitance())
    }

    /// A tank that is one fixed capacitance plus stray (the command line's form).
    pub fn fixed_only(capacitance: f64, stray: f64) -> Self {
        Self {
            fixed: capacitance,
            trimmer_min: 0.0,
            trimmer_max: 0.0,
            trimmer_setting: 0.0,
            stray,
            feedback: None,
        }
    }
}

//! A receiver's power sweep written as CSV (one row per hop: date, time, the hop's lowest and
//! highest frequency in hertz, the bin step in hertz, the samples averaged, then one power in
//! dB per bin; the layout that common command-line sweep tools for software-defined receivers
//! write), reduced to the carrier: the strongest bin's frequency, with the bin step as its
//! error (the resolution: the carrier lies somewhere in the bin, and tools differ on whether a
//! bin's frequency is its lower edge or its centre; no interpolation between bins is claimed).
//!
//! Text in, numbers out: no file is opened here.

/// The carrier found in a sweep.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Carrier {
    /// The strongest bin's frequency, hertz (the bin's lower edge plus half a step).
    pub frequency: f64,
    /// The bin step, hertz: the reading's error.
    pub error: f64,
    /// Its power, dB (as the file gives it).
    pub power_db: f64,
    /// How far it stands above the median of all bins, dB.
    pub above_median_db: f64,
    /// Bins read.
    pub bins: usize,
}

/// Why a sweep was refused: the line (1-based) and the reason.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct SweepError {
    /// Line of the file, counted from 1; 0 when no one line is to blame.
    pub line: usize,
    /// What is wrong, in words.
    pub reason: String,
}

impl std::fmt::Display for SweepError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        if self.line == 0 {
            write!(f, "{}", self.reason)
        } else {
            write!(f, "line {}: {}", self.line, self.reason)
        }
    }
}

/// A carrier must stand this far above the median of the bins to be taken for one, dB
/// (common practice: a clear signal on a quiet band is tens of dB up; a few dB is noise).
pub const MIN_ABOVE_MEDIAN_DB: f64 = 10.0;

fn field(line: usize, text: &str, what: &str) -> Result<f64, SweepError> {
    let v: f64 = text.trim().parse().map_err(|_| SweepError {
        line,
        reason: format!("the {what} '{}' is not a number", shorten(text.trim())),
    })?;
    if v.is_finite() {
        Ok(v)
    } else {
        Err(SweepError {
            line,
            reason: format!("the {what} is not a finite number"),
        })
    }
}

fn shorten(s: &str) -> String {
    let t: String = s.chars().take(24).collect();
    if s.chars().count() > 24 { t + "…" } else { t }
}

/// Reads `text` and finds the carrier.
pub fn carrier(text: &str) -> Result<Carrier, SweepError> {
    let mut best: Option<(f64, f64, f64)> = None; // (power, frequency, step)
    let mut powers = Vec::new();
    for (index, raw) in text.lines().enumerate() {
        let line = index + 1;
        let content = raw.trim();
        if content.is_empty() || content.starts_with('#') {
            continue;
        }
        let cells: Vec<&str> = content.split(',').collect();
        if cells.len() < 7 {
            return Err(SweepError {
                line,
                reason: format!(
                    "{} columns: a row needs date, time, lowest Hz, highest Hz, step Hz, \
                     samples and at least one power in dB",
                    cells.len()
                ),
            });
        }
        let low = field(line, cells[2], "lowest frequency")?;
        let high = field(line, cells[3], "highest frequency")?;
        let step = field(line, cells[4], "bin step")?;
        if low <= 0.0 || high <= low || step <= 0.0 || step > high - low {
            return Err(SweepError {
                line,
                reason: "the row's frequencies must rise (0 < lowest < highest) with a step \
                         above 0 and at most the row's span"
                    .into(),
            });
        }
        for (i, cell) in cells[6..].iter().enumerate() {
            let p = field(line, cell, "power")?;
            let f = low + (i as f64 + 0.5) * step;
            powers.push(p);
            if best.is_none_or(|b| p > b.0) {
                best = Some((p, f, step));
            }
        }
    }
    let Some((power, frequency, error)) = best else {
        return Err(SweepError {
            line: 0,
            reason: "the file holds no sweep rows".into(),
        });
    };
    powers.sort_by(f64::total_cmp);
    let median = powers[powers.len() / 2];
    let above = power - median;
    if above < MIN_ABOVE_MEDIAN_DB {
        return Err(SweepError {
            line: 0,
            reason: format!(
                "no carrier: the strongest bin ({}) stands only {above:.1} dB above the \
                 median of the sweep (at least {MIN_ABOVE_MEDIAN_DB} dB is needed)",
                crate::tuning::digits::mhz(frequency)
            ),
        });
    }
    Ok(Carrier {
        frequency,
        error,
        power_db: power,
        above_median_db: above,
        bins: powers.len(),
    })
}

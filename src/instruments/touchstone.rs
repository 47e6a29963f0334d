//! Reading a Touchstone file (the open .s1p/.s2p format of network analysers) into the
//! impedance of the device measured.
//!
//! # Format
//! Touchstone File Format Specification, Version 1.1 (EIA/IBIS Open Forum, 2002) and
//! Version 2.0 (IBIS Open Forum, 2009): `!` starts a comment; the option line
//! `# <unit> <parameter> <format> R <n>` (defaults GHz, S, MA, R 50; any order, any case);
//! each data line is a frequency followed by the parameters, as real/imaginary (RI),
//! magnitude/angle in degrees (MA) or dB/angle (DB). Version 1.1 writes Y and Z normalised to
//! the reference impedance; version 2.0 writes them in siemens and ohms. Two-port data is in
//! the order S11 S21 S12 S22 (2.0: unless `[Two-Port Data Order] 12_21`).
//!
//! # From the parameters to the device's impedance
//! One port (the coil across the port): Z = Z0 (1 + S11)/(1 − S11), or Z directly, or 1/Y
//! (D. M. Pozar, *Microwave Engineering*, 4th ed., 2012, §2.3, Γ = (Z − Z0)/(Z + Z0)).
//! Two ports with the coil in series between them ("series-through"): a series impedance
//! between two Z0 ports has S21 = 2Z0/(2Z0 + Z) (Pozar §4.4, Table 4.2 with §4.3's
//! conversion), so Z = 2 Z0 (1 − S21)/S21; from Y parameters Z = −1/Y21; from Z parameters the
//! series arm of the equivalent T, Z11 − Z21.
//!
//! Text in, numbers out: no file is opened here (the command line reads the file).

use num_complex::Complex64;

/// One frequency and the device's impedance there.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct ImpedanceSample {
    /// Frequency, hertz.
    pub frequency: f64,
    /// Impedance of the device, ohms.
    pub impedance: Complex64,
}

/// How the device sat in the measurement.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Fixture {
    /// Across one port (.s1p).
    OnePort,
    /// In series between two ports (.s2p, series-through).
    SeriesThrough,
}

/// A Touchstone file read into impedances.
#[derive(Clone, Debug, PartialEq)]
pub struct Measurement {
    /// How the device sat in the measurement.
    pub fixture: Fixture,
    /// The reference impedance, ohms.
    pub reference_ohm: f64,
    /// Samples in the file's order (frequencies rising).
    pub samples: Vec<ImpedanceSample>,
}

/// Why a file was refused: the line (1-based; 0 for the file as a whole) and the reason.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct TouchstoneError {
    /// Line of the file, counted from 1; 0 when no one line is to blame.
    pub line: usize,
    /// What is wrong, in words.
    pub reason: String,
}

impl std::fmt::Display for TouchstoneError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        if self.line == 0 {
            write!(f, "{}", self.reason)
        } else {
            write!(f, "line {}: {}", self.line, self.reason)
        }
    }
}

#[derive(Clone, Copy, Debug, PartialEq, Eq)]
enum Parameter {
    S,
    Y,
    Z,
}

#[derive(Clone, Copy, Debug, PartialEq, Eq)]
enum Format {
    RealImaginary,
    MagnitudeAngle,
    DecibelAngle,
}

struct Options {
    unit: f64,
    parameter: Parameter,
    format: Format,
    reference: f64,
}

impl Default for Options {
    fn default() -> Self {
        Self {
            unit: 1e9,
            parameter: Parameter::S,
            format: Format::MagnitudeAngle,
            reference: 50.0,
        }
    }
}

fn refuse<T>(line: usize, reason: impl Into<String>) -> Result<T, TouchstoneError> {
    Err(TouchstoneError {
        line,
        reason: reason.into(),
    })
}

/// The text of one number, shortened for a message.
fn shown(word: &str) -> String {
    let w: String = word.chars().take(24).collect();
    if word.chars().count() > 24 {
        format!("{w}…")
    } else {
        w
    }
}

fn read_options(words: &[&str], line: usize) -> Result<Options, TouchstoneError> {
    let mut o = Options::default();
    let mut i = 0;
    while i < words.len() {
        let w = words[i].to_ascii_uppercase();
        match w.as_str() {
            "HZ" => o.unit = 1.0,
            "KHZ" => o.unit = 1e3,
            "MHZ" => o.unit = 1e6,
            "GHZ" => o.unit = 1e9,
            "S" => o.parameter = Parameter::S,
            "Y" => o.parameter = Parameter::Y,
            "Z" => o.parameter = Parameter::Z,
            "G" | "H" => {
                return refuse(
                    line,
                    format!("{w} parameters are not read (give S, Y or Z parameters)"),
                );
            }
            "RI" => o.format = Format::RealImaginary,
            "MA" => o.format = Format::MagnitudeAngle,
            "DB" => o.format = Format::DecibelAngle,
            "R" => {
                let Some(v) = words.get(i + 1) else {
                    return refuse(line, "R in the option line needs the reference impedance");
                };
                let r: f64 = match v.parse() {
                    Ok(r) => r,
                    Err(_) => {
                        return refuse(
                            line,
                            format!("reference impedance {} is not a number", shown(v)),
                        );
                    }
                };
                if !(r.is_finite() && r > 0.0 && r < 1e6) {
                    return refuse(
                        line,
                        format!(
                            "reference impedance {} must be above 0 and below 1 MΩ",
                            shown(v)
                        ),
                    );
                }
                o.reference = r;
                i += 1;
            }
            _ => {
                return refuse(
                    line,
                    format!("unknown word {} in the option line", shown(&w)),
                );
            }
        }
        i += 1;
    }
    Ok(o)
}

fn pair(a: f64, b: f64, format: Format) -> Complex64 {
    match format {
        Format::RealImaginary => Complex64::new(a, b),
        Format::MagnitudeAngle => Complex64::from_polar(a, b.to_radians()),
        Format::DecibelAngle => Complex64::from_polar(10f64.powf(a / 20.0), b.to_radians()),
    }
}

/// Reads `text` as a Touchstone file of `ports` ports (1 or 2, from the file's extension or
/// its `[Number of Ports]` line) into the device's impedance at each frequency.
pub fn read(text: &str, ports: usize) -> Result<Measurement, TouchstoneError> {
    let mut options: Option<Options> = None;
    let mut version_two = false;
    let mut ports = ports;
    let mut order_12_21 = false;
    // Each data row: its first line and the numbers gathered (2.0 and long rows may wrap).
    let mut numbers: Vec<(usize, f64)> = Vec::new();
    for (index, raw) in text.lines().enumerate() {
        let line = index + 1;
        let content = raw.split('!').next().unwrap_or("").trim();
        if content.is_empty() {
            continue;
        }
        if let Some(rest) = content.strip_prefix('#') {
            if options.is_some() {
                // The specification: only the first option line counts.
                continue;
            }
            let words: Vec<&str> = rest.split_whitespace().collect();
            options = Some(read_options(&words, line)?);
            continue;
        }
        if let Some(rest) = content.strip_prefix('[') {
            let Some((keyword, value)) = rest.split_once(']') else {
                return refuse(line, "a keyword line needs its closing ]");
            };
            let keyword = keyword.trim().to_ascii_lowercase();
            let value = value.trim();
            match keyword.as_str() {
                "version" => {
                    if !value.starts_with('2') {
                        return refuse(
                            line,
                            format!("version {} is not read (1.1 or 2.0)", shown(value)),
                        );
                    }
                    version_two = true;
                }
                "number of ports" => match value.parse::<usize>() {
                    Ok(n @ 1..=2) => ports = n,
                    _ => {
                        return refuse(
                            line,
                            format!(
                                "{} ports: only one- and two-port files are read",
                                shown(value)
                            ),
                        );
                    }
                },
                "two-port data order" => order_12_21 = value.eq_ignore_ascii_case("12_21"),
                "matrix format" if ports == 2 && !value.eq_ignore_ascii_case("full") => {
                    return refuse(line, "only the full matrix format is read for two ports");
                }
                "reference" => {
                    // One value per port: the same for both in any fixture read here.
                    if let Some(first) = value.split_whitespace().next() {
                        let r: f64 = first.parse().unwrap_or(f64::NAN);
                        if !(r.is_finite() && r > 0.0) {
                            return refuse(
                                line,
                                format!("reference {} is not an impedance", shown(first)),
                            );
                        }
                        if let Some(o) = options.as_mut() {
                            o.reference = r;
                        }
                    }
                }
                "end" => break,
                // Counts and descriptions are not needed to read the data.
                _ => {}
            }
            continue;
        }
        for word in content.split_whitespace() {
            match word.parse::<f64>() {
                Ok(v) if v.is_finite() => numbers.push((line, v)),
                _ => return refuse(line, format!("{} is not a number", shown(word))),
            }
        }
    }
    let options = options.unwrap_or_default();
    if !(1..=2).contains(&ports) {
        return refuse(0, "only one- and two-port files are read (.s1p, .s2p)");
    }
    let per_row = 1 + 2 * ports * ports;
    if numbers.is_empty() {
        return refuse(0, "the file holds no data");
    }
    if !numbers.len().is_multiple_of(per_row) {
        let line = numbers.last().map_or(0, |n| n.0);
        return refuse(
            line,
            format!(
                "{} numbers do not make whole rows of {per_row} (frequency and {} values)",
                numbers.len(),
                per_row - 1
            ),
        );
    }
    let z0 = options.reference;
    let mut samples = Vec::with_capacity(numbers.len() / per_row);
    let mut last = 0.0;
    for row in numbers.chunks(per_row) {
        let line = row[0].0;
        let frequency = row[0].1 * options.unit;
        if frequency.is_nan() || frequency <= 0.0 {
            return refuse(line, "frequencies must be above 0");
        }
        if frequency <= last {
            return refuse(line, "frequencies must rise from row to row");
        }
        last = frequency;
        let values: Vec<Complex64> = row[1..]
            .chunks(2)
            .map(|p| pair(p[0].1, p[1].1, options.format))
            .collect();
        // Y and Z of version 1.1 are normalised to the reference impedance.
        let scale_z = if version_two { 1.0 } else { z0 };
        let scale_y = if version_two { 1.0 } else { 1.0 / z0 };
        let z = match (ports, options.parameter) {
            (1, Parameter::S) => {
                let s = values[0];
                z0 * (1.0 + s) / (1.0 - s)
            }
            (1, Parameter::Z) => values[0] * scale_z,
            (1, Parameter::Y) => 1.0 / (values[0] * scale_y),
            (_, parameter) => {
                // File order S11 S21 S12 S22, or S11 S12 S21 S22 with 12_21.
                let (p11, p21) = if order_12_21 {
                    (values[0], values[2])
                } else {
                    (values[0], values[1])
                };
                match parameter {
                    Parameter::S => 2.0 * z0 * (1.0 - p21) / p21,
                    Parameter::Z => (p11 - p21) * scale_z,
                    Parameter::Y => {
                        // A series element Z has Y21 = −1/Z.
                        -1.0 / (p21 * scale_y)
                    }
                }
            }
        };
        if !(z.re.is_finite() && z.im.is_finite()) {
            return refuse(
                line,
                "these values give no finite impedance (a short or open standard?)",
            );
        }
        samples.push(ImpedanceSample {
            frequency,
            impedance: z,
        });
    }
    Ok(Measurement {
        fixture: if ports == 1 {
            Fixture::OnePort
        } else {
            Fixture::SeriesThrough
        },
        reference_ohm: z0,
        samples,
    })
}

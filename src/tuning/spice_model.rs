//! Reading a junction's capacitance law from a SPICE `.model` line.
//!
//! Accepts what data sheets and model libraries print: `.model NAME D(CJO=… VJ=… M=…)` for a
//! diode or varactor, `.model NAME NPN(… CJC=… VJC=… MJC=…)` (or PNP) for a transistor's
//! collector–base junction; continuation lines starting with `+`; comments (`*` lines, and
//! `;` or `$` to the end of a line); parameters with or without parentheses and spaces around
//! `=`; SPICE's scale suffixes (f p n u m k meg g t, case-insensitive, trailing unit letters
//! ignored, as in "2.5pF"). Parameters other than the capacitance law are ignored and listed.
//! Missing VJ/M (VJC/MJC) take SPICE's defaults, and are listed as such (defaults from the
//! Berkeley SPICE3 manual: diode VJ = 1 V, M = 0.5; BJT VJC = 0.75 V, MJC = 0.33; FC = 0.5).

use crate::physics::junction::JunctionLaw;

/// The device type of a `.model` line.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum DeviceType {
    /// `D`: a diode or varactor (CJO, VJ, M).
    Diode,
    /// `NPN` transistor (collector–base: CJC, VJC, MJC).
    Npn,
    /// `PNP` transistor (collector–base: CJC, VJC, MJC).
    Pnp,
}

/// A parsed `.model` line.
#[derive(Clone, Debug, PartialEq)]
pub struct JunctionModel {
    /// The model's name as written.
    pub name: String,
    /// The device type.
    pub device: DeviceType,
    /// The junction law (for a transistor, its collector–base junction).
    pub law: JunctionLaw,
    /// Parameters present but not used, upper case, in order.
    pub ignored: Vec<String>,
    /// Law parameters missing and taken at SPICE's default.
    pub defaulted: Vec<&'static str>,
}

/// Why a line could not be read.
#[derive(Clone, Debug, PartialEq)]
pub struct ModelError(pub String);

impl std::fmt::Display for ModelError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(&self.0)
    }
}

impl std::error::Error for ModelError {}

/// A SPICE number with an optional scale suffix: "10p", "2.5pF", "1.2e-12", "3meg", "0.75V".
pub fn parse_number(text: &str) -> Option<f64> {
    let t = text.trim();
    let bytes = t.as_bytes();
    let mut end = 0;
    let mut seen_digit = false;
    let mut i = 0;
    if i < bytes.len() && (bytes[i] == b'+' || bytes[i] == b'-') {
        i += 1;
    }
    while i < bytes.len() && (bytes[i].is_ascii_digit() || bytes[i] == b'.') {
        seen_digit |= bytes[i].is_ascii_digit();
        i += 1;
        end = i;
    }
    if !seen_digit {
        return None;
    }
    // An exponent only if digits follow the 'e'.
    if i < bytes.len() && (bytes[i] == b'e' || bytes[i] == b'E') {
        let mut j = i + 1;
        if j < bytes.len() && (bytes[j] == b'+' || bytes[j] == b'-') {
            j += 1;
        }
        let digits_from = j;
        while j < bytes.len() && bytes[j].is_ascii_digit() {
            j += 1;
        }
        if j > digits_from {
            end = j;
        }
    }
    let mantissa: f64 = t[..end].parse().ok()?;
    let suffix = t[end..].to_ascii_lowercase();
    let scale = if suffix.starts_with("meg") {
        1e6
    } else if suffix.starts_with("mil") {
        25.4e-6
    } else {
        match suffix.chars().next() {
            None => 1.0,
            Some('t') => 1e12,
            Some('g') => 1e9,
            Some('k') => 1e3,
            Some('m') => 1e-3,
            Some('u') => 1e-6,
            Some('n') => 1e-9,
            Some('p') => 1e-12,
            Some('f') => 1e-15,
            Some('a') => 1e-18,
            Some(c) if c.is_ascii_alphabetic() => 1.0,
            Some(_) => return None,
        }
    };
    let v = mantissa * scale;
    v.is_finite().then_some(v)
}

/// Strip comments and join continuation lines into one logical line.
fn logical_line(text: &str) -> String {
    let mut out = String::new();
    for raw in text.lines() {
        let line = raw.split([';', '$']).next().unwrap_or("");
        let trimmed = line.trim();
        if trimmed.is_empty() || trimmed.starts_with('*') {
            continue;
        }
        out.push(' ');
        out.push_str(trimmed.strip_prefix('+').unwrap_or(trimmed));
    }
    out
}

/// A `.model` statement read into its name, device type and parameters (upper-case names,
/// values in SI with the scale suffixes applied, in the order written).
#[derive(Clone, Debug, PartialEq)]
pub struct ModelStatement {
    /// The model's name as written.
    pub name: String,
    /// The device type.
    pub device: DeviceType,
    /// NAME = VALUE pairs, names upper case, in order.
    pub params: Vec<(String, f64)>,
}

impl ModelStatement {
    /// The last value given for `key` (upper case).
    pub fn get(&self, key: &str) -> Option<f64> {
        self.params
            .iter()
            .rev()
            .find(|(p, _)| p == key)
            .map(|p| p.1)
    }
}

/// Read a `.model` statement's name, type and parameters without judging them (the junction
/// law is [`parse_model`]; the oscillator stage reads a transistor's other parameters here).
pub fn parse_statement(text: &str) -> Result<ModelStatement, ModelError> {
    let line = logical_line(text);
    // Parentheses and '=' with spaces become plain separators.
    let spaced = line.replace(['(', ')', ','], " ").replace('=', " = ");
    let words: Vec<&str> = spaced.split_whitespace().collect();
    let mut w = words.iter();
    match w.next() {
        Some(first) if first.eq_ignore_ascii_case(".model") => {}
        _ => {
            return Err(ModelError("the text does not start with .model".to_owned()));
        }
    }
    let name = w
        .next()
        .ok_or_else(|| ModelError(".model needs a name and a type".to_owned()))?
        .to_string();
    let kind = w
        .next()
        .ok_or_else(|| ModelError(format!(".model {name} has no device type")))?;
    let device = match kind.to_ascii_uppercase().as_str() {
        "D" => DeviceType::Diode,
        "NPN" => DeviceType::Npn,
        "PNP" => DeviceType::Pnp,
        other => {
            return Err(ModelError(format!(
                ".model {name}: type {other} has no junction law here (use D, NPN or PNP)"
            )));
        }
    };
    let rest: Vec<&str> = w.copied().collect();
    let mut params: Vec<(String, f64)> = Vec::new();
    let mut i = 0;
    while i < rest.len() {
        let key = rest[i].to_ascii_uppercase();
        if i + 2 < rest.len() && rest.get(i + 1) == Some(&"=") {
            let value_text = rest[i + 2];
            let value = parse_number(value_text).ok_or_else(|| {
                ModelError(format!(
                    ".model {name}: {key} = '{value_text}' is not a number"
                ))
            })?;
            params.push((key, value));
            i += 3;
        } else if rest.get(i + 1) == Some(&"=") {
            return Err(ModelError(format!(".model {name}: {key} has no value")));
        } else {
            return Err(ModelError(format!(
                ".model {name}: '{}' is not a NAME=VALUE parameter",
                rest[i]
            )));
        }
    }
    Ok(ModelStatement {
        name,
        device,
        params,
    })
}

/// Parse a `.model` statement (one line, or several joined by `+` continuation lines).
pub fn parse_model(text: &str) -> Result<JunctionModel, ModelError> {
    let ModelStatement {
        name,
        device,
        params,
    } = parse_statement(text)?;
    let (cj_key, vj_key, m_key, vj_default, m_default) = match device {
        DeviceType::Diode => ("CJO", "VJ", "M", 1.0, 0.5),
        DeviceType::Npn | DeviceType::Pnp => ("CJC", "VJC", "MJC", 0.75, 0.33),
    };
    let find = |k: &str| params.iter().rev().find(|(p, _)| p == k).map(|p| p.1);
    // SPICE also accepts CJ0 for CJO and PB for VJ.
    let cj0 = find(cj_key).or_else(|| (device == DeviceType::Diode).then(|| find("CJ0")).flatten());
    let cj0 = cj0.filter(|c| *c > 0.0).ok_or_else(|| {
        ModelError(format!(
            ".model {name}: no {cj_key} (zero-bias junction capacitance) above zero"
        ))
    })?;
    let mut defaulted = Vec::new();
    let vj = find(vj_key)
        .or_else(|| (device == DeviceType::Diode).then(|| find("PB")).flatten())
        .unwrap_or_else(|| {
            defaulted.push(vj_key_static(device));
            vj_default
        });
    let m = find(m_key).unwrap_or_else(|| {
        defaulted.push(m_key_static(device));
        m_default
    });
    let fc = find("FC").unwrap_or(crate::physics::junction::DEFAULT_FORWARD_KNEE);
    let (lo, hi) = CONTACT_POTENTIAL_V;
    if !(lo..=hi).contains(&vj) {
        return Err(ModelError(format!(
            ".model {name}: {vj_key} = {vj:e} is outside {lo}–{hi} V: a junction's contact \
             potential lies below its band gap"
        )));
    }
    let sane = cj0 <= 1e-6 && m > 0.0 && m < 5.0 && (0.0..1.0).contains(&fc);
    if !sane {
        return Err(ModelError(format!(
            ".model {name}: {cj_key} = {cj0:e} must be at most 1e-6 F, {m_key} = {m:e} between 0 and 5, FC = {fc:e} in 0–1"
        )));
    }
    let used = [cj_key, vj_key, m_key, "FC", "CJ0", "PB"];
    let ignored = params
        .iter()
        .map(|(k, _)| k.clone())
        .filter(|k| {
            !used.contains(&k.as_str())
                || (device != DeviceType::Diode && (k == "CJ0" || k == "PB"))
        })
        .collect();
    Ok(JunctionModel {
        name,
        device,
        law: JunctionLaw {
            cj0,
            contact_potential: vj,
            grading: m,
            forward_knee: fc,
        },
        ignored,
        defaulted,
    })
}

/// The accepted contact potential φ, volts: a junction's built-in potential lies below its
/// band gap (1.12 V silicon, about 3.3 V silicon carbide; Sze, *Physics of Semiconductor
/// Devices*, 1981, Appendix G); below 0.1 V SPICE's temperature law gives a negative φ at
/// room temperature (from memory: ngspice raises VJ below 0.1 V to 0.1 V).
pub const CONTACT_POTENTIAL_V: (f64, f64) = (0.1, 3.5);

fn vj_key_static(d: DeviceType) -> &'static str {
    if d == DeviceType::Diode { "VJ" } else { "VJC" }
}

fn m_key_static(d: DeviceType) -> &'static str {
    if d == DeviceType::Diode { "M" } else { "MJC" }
}

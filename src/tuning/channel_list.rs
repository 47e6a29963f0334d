//! Typed frequencies: a target typed in MHz, and a custom channel list typed as text.
//!
//! A target can be any frequency in the range a tank may be aimed at; nonsense (not a
//! number, 1e9 MHz) is refused with a message naming the entry, and a list loses nothing
//! silently: duplicates are removed with a note saying so.

use crate::units::{from_mhz, to_mhz};
use std::fmt;

/// Frequencies a target or channel may name, hertz: wider than any VHF tank, narrow enough
/// to catch a slipped exponent or a value typed in the wrong unit (1–3000 MHz, as the
/// recipe file accepts).
pub const FREQUENCY_RANGE: (f64, f64) = (1e6, 3e9);

/// Most entries a custom list may hold (a longer list is a paste gone wrong).
pub const LIST_MAX: usize = 500;

/// Why a typed frequency or list was refused, in words.
#[derive(Clone, Debug, PartialEq)]
pub struct TypedFrequencyError(pub String);

impl fmt::Display for TypedFrequencyError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(&self.0)
    }
}

impl std::error::Error for TypedFrequencyError {}

/// A custom list as accepted: channel centres in hertz, ascending, and notes on what was
/// changed (duplicates removed).
#[derive(Clone, Debug, PartialEq)]
pub struct ChannelList {
    /// Channel centres, hertz, ascending, each once.
    pub channels: Vec<f64>,
    /// What was changed, for the user ("99.1 MHz was given 2 times: kept once").
    pub notes: Vec<String>,
}

/// Check a frequency in hertz against [`FREQUENCY_RANGE`]; `what` names it in the message.
pub fn check_frequency(hz: f64, what: &str) -> Result<f64, TypedFrequencyError> {
    let (lo, hi) = FREQUENCY_RANGE;
    if !hz.is_finite() {
        return Err(TypedFrequencyError(format!("{what} is not a number")));
    }
    if !(lo..=hi).contains(&hz) {
        return Err(TypedFrequencyError(format!(
            "{what} {} MHz is outside {}–{} MHz",
            shortest_mhz(hz),
            to_mhz(lo),
            to_mhz(hi)
        )));
    }
    Ok(hz)
}

/// A target typed in MHz ("146.52", " 98.7 MHz"), in hertz. Any frequency in
/// [`FREQUENCY_RANGE`] is accepted, on a plan's channel or not.
pub fn parse_target_mhz(text: &str) -> Result<f64, TypedFrequencyError> {
    let t = text.trim();
    let t = t
        .strip_suffix("MHz")
        .or_else(|| t.strip_suffix("mhz"))
        .unwrap_or(t)
        .trim();
    if t.is_empty() {
        return Err(TypedFrequencyError(
            "type a frequency in MHz, e.g. 98.7".to_owned(),
        ));
    }
    let mhz: f64 = t
        .parse()
        .map_err(|_| TypedFrequencyError(format!("'{t}' is not a frequency in MHz")))?;
    check_frequency(from_mhz(mhz), "the target")
}

/// A custom channel list typed as MHz values separated by commas, semicolons or spaces.
///
/// Refuses, naming the entry: a word that is not a number, a value outside
/// [`FREQUENCY_RANGE`], an empty list, more than [`LIST_MAX`] entries. Duplicates (the same
/// frequency to 1 Hz) are kept once, with a note. "99.1, 1e9, 99.1" is refused for its
/// second entry.
pub fn parse_channel_list(text: &str) -> Result<ChannelList, TypedFrequencyError> {
    let tokens: Vec<&str> = text
        .split(|c: char| c == ',' || c == ';' || c.is_whitespace())
        .filter(|t| !t.is_empty())
        .collect();
    if tokens.is_empty() {
        return Err(TypedFrequencyError(
            "the list is empty: type one or more frequencies in MHz".to_owned(),
        ));
    }
    if tokens.len() > LIST_MAX {
        return Err(TypedFrequencyError(format!(
            "the list has {} entries; at most {LIST_MAX} are accepted",
            tokens.len()
        )));
    }
    let mut hz = Vec::with_capacity(tokens.len());
    for (i, token) in tokens.iter().enumerate() {
        let mhz: f64 = token.parse().map_err(|_| {
            TypedFrequencyError(format!(
                "entry {} '{token}' is not a frequency in MHz",
                i + 1
            ))
        })?;
        hz.push(check_frequency(from_mhz(mhz), &format!("entry {}", i + 1))?);
    }
    // Whole hertz: the same channel typed as 99.1 and 99.10 is one channel.
    let mut whole: Vec<f64> = hz.iter().map(|f| f.round()).collect();
    whole.sort_by(f64::total_cmp);
    let mut channels: Vec<f64> = Vec::with_capacity(whole.len());
    let mut notes = Vec::new();
    let mut i = 0;
    while i < whole.len() {
        let f = whole[i];
        let mut n = 1;
        while i + n < whole.len() && whole[i + n] == f {
            n += 1;
        }
        if n > 1 {
            notes.push(format!(
                "{} MHz was given {n} times: kept once",
                shortest_mhz(f)
            ));
        }
        channels.push(f);
        i += n;
    }
    Ok(ChannelList { channels, notes })
}

/// MHz with as many decimals as needed (up to 6: whole hertz), for messages.
fn shortest_mhz(hz: f64) -> String {
    if !hz.is_finite() || hz.abs() >= 1e15 {
        return format!("{}", to_mhz(hz));
    }
    let s = format!("{:.6}", to_mhz(hz));
    let s = s.trim_end_matches('0').trim_end_matches('.');
    s.to_owned()
}

//! The verdict in the headless commands: the lines `report` and `evaluate` print first, and
//! the JSON keys `evaluate --json` adds.

use crate::model::{Analysis, WarningTopic};
use crate::tuning::digits::{mhz, mhz_range};
use crate::tuning::verdict::{FlagKind, Verdict};
use crate::units::{to_khz, to_mhz};
use serde_json::{Value, json};

/// The verdict as report lines: channel, band safety, buildability, each flag, harmonics,
/// the receiver image.
pub fn verdict_lines(v: &Verdict) -> Vec<String> {
    let mut out = vec!["Verdict".to_owned()];
    out.push(format!("  {}", v.channel_text()));
    out.push(format!("  {}", v.safety_text()));
    out.push(if v.is_buildable() {
        "  Buildable as drawn".to_owned()
    } else {
        "  Not buildable as drawn (see below)".to_owned()
    });
    out.push(format!("  Next: {}", v.next_step()));
    for f in &v.flags {
        out.push(format!("  ! {}", f.text));
    }
    for h in &v.harmonics {
        let falls = if h.falls_in.is_empty() {
            "nothing named here".to_owned()
        } else {
            h.falls_in.join("; ")
        };
        // A fixed tank has no travel: the harmonic is one frequency.
        if v.reach.is_fixed() {
            out.push(format!(
                "  harmonic {}: {} (fixed tank): {falls}",
                h.order,
                mhz(h.frequency)
            ));
        } else {
            out.push(format!(
                "  harmonic {}: {} now, {} over the trimmer: {falls}",
                h.order,
                mhz(h.frequency),
                mhz_range(h.low, h.high)
            ));
        }
    }
    if let Some(image) = &v.image {
        out.push(format!("  receiver image: {}", image.text));
    }
    out
}

/// Add the verdict's keys to an `evaluate --json` object: `trimmer_reach_mhz` {low, high},
/// `harmonics_mhz` (2nd and 3rd at the present resonance), `harmonics` (with what they fall
/// in over the trimmer), `offset_khz` and `on_channel` (null without a target),
/// `tolerance_khz`, `flags` [{kind, text}], and the flags' texts appended to `warnings`
/// (the analysis's own aeronautical warning is left out when a flag says it).
pub fn add_verdict_json(object: &mut Value, v: &Verdict, a: &Analysis) {
    let Some(map) = object.as_object_mut() else {
        return;
    };
    map.insert(
        "trimmer_reach_mhz".to_owned(),
        json!({ "low": to_mhz(v.reach.low), "high": to_mhz(v.reach.high) }),
    );
    map.insert(
        "harmonics_mhz".to_owned(),
        json!(
            v.harmonics
                .iter()
                .map(|h| to_mhz(h.frequency))
                .collect::<Vec<_>>()
        ),
    );
    map.insert(
        "harmonics".to_owned(),
        json!(
            v.harmonics
                .iter()
                .map(|h| json!({
                    "order": h.order,
                    "mhz": to_mhz(h.frequency),
                    "low_mhz": to_mhz(h.low),
                    "high_mhz": to_mhz(h.high),
                    "falls_in": h.falls_in,
                }))
                .collect::<Vec<_>>()
        ),
    );
    map.insert("target_mhz".to_owned(), json!(v.target.map(to_mhz)));
    map.insert("offset_khz".to_owned(), json!(v.offset.map(to_khz)));
    map.insert("tolerance_khz".to_owned(), json!(to_khz(v.tolerance)));
    map.insert("on_channel".to_owned(), json!(v.on_channel));
    map.insert("next_step".to_owned(), json!(v.next_step()));
    map.insert(
        "flags".to_owned(),
        json!(
            v.flags
                .iter()
                .map(|f| json!({ "kind": f.kind.key(), "text": f.text }))
                .collect::<Vec<_>>()
        ),
    );
    let aero_flagged = v.has(FlagKind::Aeronautical);
    let warnings: Vec<String> = a
        .warnings
        .iter()
        .filter(|w| !(aero_flagged && w.topic == WarningTopic::Band))
        .map(|w| w.message.clone())
        .chain(v.flags.iter().map(|f| f.text.clone()))
        .collect();
    map.insert("warnings".to_owned(), json!(warnings));
}

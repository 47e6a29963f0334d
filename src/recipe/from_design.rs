//! A design candidate as a recipe the window opens: the coil as proposed (former, wire,
//! turns, length, leads), its tank (fixed capacitor, trimmer at the setting that lands the
//! target, the stray the search solved with), the target and the building method. Its
//! figures, by [`super::figures()`], are the candidate's (tests/engine/design.rs checks it).

use super::document::{Recipe, StraySettings, Target};
use crate::model::{DiameterSpec, SpacingSpec, Tank, Winding};
use crate::tuning::construction::Construction;
use crate::tuning::design::{Candidate, DesignSettings, parts::wire_label};
use crate::tuning::verdict::Aim;

/// The recipe of `candidate`, designed for `aim` with `settings` and built by
/// `construction`.
pub fn recipe_of(
    candidate: &Candidate,
    aim: &Aim,
    settings: &DesignSettings,
    construction: Construction,
) -> Recipe {
    let c = candidate;
    let channel = aim.target.unwrap_or(c.resonance);
    Recipe {
        name: format!(
            "Designed for {} MHz",
            crate::tuning::digits::channel_mhz(channel)
        ),
        notes: format!(
            "From the parts on hand: {} turns of {} on a {} former, {} fixed, the {} trimmer. {}",
            crate::tuning::design::parts::short(c.turns),
            wire_label(&c.wire),
            crate::tuning::digits::mm(c.former, 2),
            crate::tuning::design::parts::short(c.fixed * 1e12) + " pF",
            c.trimmer.label(),
            c.reasons.first().cloned().unwrap_or_default()
        ),
        winding: Winding {
            diameter: DiameterSpec::Former(c.former),
            wire: c.wire,
            turns: c.turns,
            spacing: SpacingSpec::Length(c.length),
            lead_length: c.lead_length,
        },
        tank: Tank {
            fixed: c.fixed,
            trimmer_min: c.trimmer.min,
            trimmer_max: c.trimmer.max,
            trimmer_setting: c.trimmer_setting,
            stray: c.stray,
            feedback: None,
        },
        conditions: settings.conditions,
        target: Target {
            plan: aim.plan.clone(),
            channel,
            tolerance: Some(aim.tolerance),
        },
        bench_log: Vec::new(),
        stray_estimate: StraySettings {
            construction,
            tolerances: settings.tolerances,
        },
        coil_measurement: None,
        stage: None,
        audio: Default::default(),
    }
}

//! Every instruction lands where it says: carried out and evaluated again by the tool's own
//! model (the field solution of the proposed coil, with the calibration on it), the tank is
//! within the channel's tolerance.
//!
//! The field solution itself is held to nec2c in tests/engine/reference_field.rs; here the
//! instructions are held to it (self-consistency: what the tool says a coil will do is what it
//! says once that coil is built). Tolerances: the channel's own on-channel tolerance (the
//! band plan's, `BandPlan::default_tolerance`), never widened.

use tankwright::model::SpacingSpec;
use tankwright::recipe::{Recipe, demos, figures};
use tankwright::tuning::advice::advise;

/// The recipe with the advice carried out (turns, length and trimmer as proposed).
fn carried_out(r: &Recipe, turns: f64, length: f64, setting: f64) -> Recipe {
    let mut out = r.clone();
    out.winding.turns = turns;
    out.winding.spacing = SpacingSpec::Length(length);
    out.tank.trimmer_setting = setting;
    out
}

#[test]
fn every_shipped_demo_instruction_lands_within_the_channel_tolerance() {
    for (name, r) in demos() {
        let f = figures(&r).expect("the demo is valid");
        let channel = r.target.channel;
        let tolerance = f.target.tolerance;
        let p = f
            .target
            .advice
            .proposal(&f.coil, f.tank.trimmer_setting)
            .expect("the demos' channels are within reach");
        let after = figures(&carried_out(&r, p.turns, p.length, p.trimmer_setting))
            .expect("the proposal is valid");
        let miss = after.analysis.resonance - channel;
        // Before: the same instruction on the classical shape with the present factor held.
        let old = advise(&f.coil, &f.tank, &f.conditions, channel, tolerance);
        let old_miss = old.proposal(&f.coil, f.tank.trimmer_setting).map(|q| {
            figures(&carried_out(&r, q.turns, q.length, q.trimmer_setting))
                .expect("valid")
                .analysis
                .resonance
                - channel
        });
        eprintln!(
            "{name}: \"{}\" lands {:+.1} kHz (classical shape: \"{old}\" {:+.1} kHz), tolerance {:.1} kHz",
            f.target.advice,
            miss * 1e-3,
            old_miss.unwrap_or(f64::NAN) * 1e-3,
            tolerance * 1e-3
        );
        assert!(
            miss.abs() <= tolerance,
            "{name}: {} lands {:+.1} kHz off",
            f.target.advice,
            miss * 1e-3
        );
    }
}

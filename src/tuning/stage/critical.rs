//! The critical transconductance: the least g_m at which the stage sustains oscillation, the
//! loop gain stated as g_m over it, and the steady oscillation's frequency there.

use super::loop_gain::Network;

/// The critical scale k on the transistor's active part (g_m, g_π and the diffusion
/// capacitance τ_F·g_m, all proportional to the collector current) at which the return ratio
/// at zero phase is exactly 1, and the frequency there; `None` when no k up to 1e4 gives it
/// (k is held at 1e-9 when even that starts it).
///
/// 1/k is the loop gain stated: how many times the transconductance exceeds the least that
/// sustains oscillation (the critical transconductance of E. Vittoz, M. Degrauwe and S. Bitz,
/// "High-performance crystal oscillator circuits: theory and application", IEEE J. Solid-State
/// Circuits 23(3), 1988, from memory), which is the loop gain wherever the loop gain grows in
/// proportion to g_m. The frequency at k is the steady oscillation's: limiting lowers the
/// fundamental's transconductance until the loop gain is 1 (the describing-function view of
/// K. K. Clarke and D. T. Hess, *Communication Circuits: Analysis and Design*, 1971,
/// chapter 6, from memory).
pub fn critical_scale(network: &Network, diffusion: f64, around: f64) -> Option<(f64, f64)> {
    let gain = |ln_k: f64| network.limited(ln_k.exp(), diffusion).zero_phase(around);
    let (mut lo, mut hi) = (1e-9_f64.ln(), 1e4_f64.ln());
    let above = |ln_k: f64| gain(ln_k).is_some_and(|(_, t)| t >= 1.0);
    if above(lo) {
        // Starts even at a billionth of the transconductance: the figure is held there.
        return gain(lo).map(|(f, _)| (lo.exp(), f));
    }
    if !above(hi) {
        return None;
    }
    for _ in 0..60 {
        let mid = 0.5 * (lo + hi);
        if above(mid) {
            hi = mid;
        } else {
            lo = mid;
        }
    }
    gain(hi).map(|(f, _)| (hi.exp(), f))
}

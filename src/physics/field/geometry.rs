//! The wire as straight segments: the helix, the two leads and the closing path, and the
//! triangle basis functions laid on them.
//!
//! # Geometry (stated once; every caller uses this)
//! The coil's axis is z. The helix of mean radius a = D/2 starts at (a, 0, 0) and turns
//! counter-clockwise seen from +z, rising one pitch p per turn, to its end at angle Φ = 2πN,
//! (a·cos Φ, a·sin Φ, N·p). The board is the plane x = a + ℓ, with ℓ the lead length: each
//! lead runs straight from a coil end in the +x direction (perpendicular to the axis) to the
//! board, and the tank closes the loop by a straight path in the board plane between the two
//! lead feet, beneath the coil. The terminals are a gap at the middle of that closing path
//! ([`WireCoil::terminal_gap`] wide), bridged by an ideal source that carries no field.
//! For whole turns both leads are ℓ long and the closing path is parallel to the axis, N·p long.
//! With ℓ = 0 there are no leads and no closing path: the terminals are the coil's two ends,
//! joined by an ideal source of no length that carries no field of its own (the isolated coil,
//! whose first parallel resonance is its first natural mode with both ends open).
//! The board is only a place: no ground plane is modelled (free space all round).

use super::super::constants::SPEED_OF_LIGHT;
use std::f64::consts::PI;

/// The wire, in plain SI figures (metres, ohm-metres).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct WireCoil {
    /// Mean (wire-centre) diameter D.
    pub mean_diameter: f64,
    /// Pitch p, centre to centre of neighbouring turns.
    pub pitch: f64,
    /// Turns N (fractions allowed).
    pub turns: f64,
    /// Radius of the bare copper.
    pub wire_radius: f64,
    /// Each lead, from a coil end to the board; 0 for the isolated coil.
    pub lead_length: f64,
    /// Resistivity of the wire at its temperature, Ω·m.
    pub resistivity: f64,
}

/// Why a wire cannot be solved.
#[derive(Clone, Debug, PartialEq)]
pub enum FieldError {
    /// The geometry is outside what the thin-wire solution handles.
    Geometry(String),
    /// A frequency outside (0, the model's highest frequency].
    Frequency(f64),
    /// The moment matrix could not be factored (a numerical breakdown).
    Singular,
    /// No self-resonance below the search's upper limit.
    NoResonance,
    /// The solution would take more time or memory than it may (see [`super::budget`]).
    TooCostly(String),
}

impl std::fmt::Display for FieldError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            FieldError::Geometry(why) => write!(f, "field solution refused: {why}"),
            FieldError::Frequency(hz) => write!(
                f,
                "field solution: {:.4} MHz is outside the solved range",
                hz * 1e-6
            ),
            FieldError::Singular => f.write_str("field solution: the moment matrix is singular"),
            FieldError::NoResonance => {
                f.write_str("field solution: no self-resonance found below the search limit")
            }
            FieldError::TooCostly(why) => write!(f, "field solution declined: {why}"),
        }
    }
}

impl std::error::Error for FieldError {}

impl WireCoil {
    /// Check the figures: all finite and positive, turns not overlapping, the closing path clear
    /// of the turns.
    pub fn check(&self) -> Result<(), FieldError> {
        let bad = |what: &str| Err(FieldError::Geometry(what.to_owned()));
        let all = [
            self.mean_diameter,
            self.pitch,
            self.turns,
            self.wire_radius,
            self.resistivity,
        ];
        if all.iter().any(|v| !v.is_finite() || *v <= 0.0) {
            return bad("diameter, pitch, turns, wire radius and resistivity must be positive");
        }
        if !self.lead_length.is_finite() || self.lead_length < 0.0 {
            return bad("the lead length must be zero or positive");
        }
        if self.turns < 1.0 || self.turns > 100.0 {
            return bad("turns must lie between 1 and 100");
        }
        if self.pitch < 2.0 * self.wire_radius {
            return bad("the pitch is below the wire diameter: turns would overlap");
        }
        if self.mean_diameter < 4.0 * self.wire_radius {
            return bad("the mean diameter must be at least twice the wire diameter");
        }
        if self.lead_length > 0.0 && self.lead_length < 2.0 * self.wire_radius {
            return bad("leads shorter than the wire diameter put the closing path on the turns");
        }
        Ok(())
    }

    /// Axial length N·p.
    pub fn length(&self) -> f64 {
        self.turns * self.pitch
    }

    /// Length of wire along the helix.
    pub fn helix_wire_length(&self) -> f64 {
        let c = PI * self.mean_diameter;
        self.turns * (c * c + self.pitch * self.pitch).sqrt()
    }

    /// Total length of conductor in the loop: helix, both leads and the closing path.
    pub fn loop_wire_length(&self) -> f64 {
        if self.lead_length <= 0.0 {
            return self.helix_wire_length();
        }
        let a = 0.5 * self.mean_diameter;
        let phi = 2.0 * PI * self.turns;
        let lead2 = self.lead_length + a * (1.0 - phi.cos());
        let closing = (self.length().powi(2) + (a * phi.sin()).powi(2)).sqrt();
        self.helix_wire_length() + self.lead_length + lead2 + closing
    }

    /// Width of the terminals' gap in the closing path: two wire diameters, or a third of the
    /// closing path if that is shorter.
    ///
    /// The tank's terminals are a gap of this width bridged by an ideal source. A gap of no
    /// width (the delta gap in an unbroken wire) has a capacitance across it that grows without
    /// bound as the segments next to it shrink, so the parallel resonance would never settle
    /// as the wire is cut finer; a gap of definite width has a definite, small capacitance
    /// (which a real tank's terminals also have).
    pub fn terminal_gap(&self) -> f64 {
        let a = 0.5 * self.mean_diameter;
        let phi = 2.0 * PI * self.turns;
        let closing = (self.length().powi(2) + (a * phi.sin()).powi(2)).sqrt();
        (4.0 * self.wire_radius).min(closing / 3.0)
    }

    /// Segments per turn chosen from the geometry (see [`Structure::build`]).
    ///
    /// About one segment per two wire diameters of circumference, at least 8 and at most 16 a
    /// turn: with the equal-area polygon (see [`Structure::build`]) 8–16 a turn already hold
    /// the resonance within a fraction of a per cent (the convergence test doubles it), and a
    /// segment stays at least 1.5 wire radii long even after that doubling, inside the thin-wire
    /// kernel's range (see the module's documentation) for coils down to D = 8 r.
    ///
    /// A coil of many turns takes fewer a turn (never below 8) so that its unknowns stay
    /// within [`super::budget::UNKNOWNS_LIMIT`]; beyond 8 a turn the budget declines it.
    pub fn segments_per_turn(&self) -> usize {
        let c = PI * self.mean_diameter;
        let n = (c / (4.0 * self.wire_radius)).ceil().clamp(8.0, 16.0);
        let helix_share = (super::budget::UNKNOWNS_LIMIT - super::budget::STRAIGHT_RESERVE) as f64;
        let affordable = (helix_share / self.turns.max(1.0)).floor();
        n.min(affordable).max(8.0) as usize
    }

    /// The highest frequency any solution of this wire is asked for: where the loop's wire is
    /// 1.5 wavelengths long (the first parallel resonance of a wire loop or an open helix lies
    /// near half a wavelength of wire, so this is three times above it).
    pub fn frequency_ceiling(&self) -> f64 {
        1.5 * SPEED_OF_LIGHT / self.loop_wire_length()
    }
}

/// One straight segment of wire.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Segment {
    /// Where it starts.
    pub start: [f64; 3],
    /// Unit vector along it, in the reference direction of the current.
    pub direction: [f64; 3],
    /// Its length.
    pub length: f64,
}

impl Segment {
    fn between(from: [f64; 3], to: [f64; 3]) -> Self {
        let d = sub(to, from);
        let length = norm(d);
        Self {
            start: from,
            direction: scale(d, 1.0 / length),
            length,
        }
    }

    /// The point at `u` ∈ [0, 1] along the segment.
    pub fn at(&self, u: f64) -> [f64; 3] {
        add(self.start, scale(self.direction, u * self.length))
    }

    /// Midpoint.
    pub fn middle(&self) -> [f64; 3] {
        self.at(0.5)
    }
}

/// A triangle (rooftop) basis function: current rising linearly from 0 to 1 along its
/// `arrive` segment, then falling from 1 to 0 along its `leave` segment. The two normally share
/// a node; at the terminals of the isolated coil they are the coil's two end segments, joined
/// through the ideal source.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Basis {
    /// Segment on which the current rises to the peak.
    pub arrive: usize,
    /// Segment on which it falls from the peak.
    pub leave: usize,
}

/// Where the wire is driven.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Feed {
    /// At the terminals (the gap in the closing path, or the coil's joined ends when ℓ = 0):
    /// the impedance the tank sees.
    Terminals,
    /// At the middle of the helix, with the terminals left open (the same wire, its two ends
    /// facing each other across the gap, or for ℓ = 0 the coil's ends free): the wire's natural
    /// modes show as zeros of this impedance, at the frequencies of the terminals' poles. Used
    /// to cross-check those poles, and to compare with solvers that cannot bridge a gap by an
    /// ideal source; a series resonance here does not depend on how the source gap is modelled,
    /// since no current flows across the gap's capacitance when the voltage is zero.
    HelixMiddle,
}

/// The discretised wire: segments, basis functions, and which basis carries the source.
#[derive(Clone, Debug, PartialEq)]
pub struct Structure {
    /// Segments in order along the wire.
    pub segments: Vec<Segment>,
    /// Basis functions.
    pub bases: Vec<Basis>,
    /// Index of the basis function whose peak is at the source gap.
    pub feed: usize,
    /// Wire radius.
    pub wire_radius: f64,
}

impl Structure {
    /// Cut the wire into segments: `per_turn` equal segments a turn along the helix (a whole
    /// number of them for the whole wire, so the ends fall on nodes; an even number for the
    /// middle feed), the straight parts in segments no longer than two helix segments.
    ///
    /// # Formula
    /// The helix nodes sit on the radius a·√(δ/sin δ) for an angle step δ, so that each turn's
    /// polygon encloses the circle's area πa² (the flux a turn links; the wire is then long by
    /// a relative δ²/24). Equal-area polygons are common practice in wire-grid models of loops;
    /// here it is chosen by measurement: on a 10 mm, 5-turn coil the isolated coil's
    /// resonance moved 0.02 % from 12 to 24 segments a turn with it, against 2.4 % with the
    /// nodes on the circle and 1.2 % with the chords as long as the arcs.
    pub fn build(coil: &WireCoil, per_turn: usize, feed: Feed) -> Result<Self, FieldError> {
        coil.check()?;
        let a = 0.5 * coil.mean_diameter;
        let mut helix_segments = ((coil.turns * per_turn as f64).round() as usize).max(4);
        if feed == Feed::HelixMiddle && helix_segments % 2 == 1 {
            helix_segments += 1;
        }
        let total_angle = 2.0 * PI * coil.turns;
        let step = total_angle / helix_segments as f64;
        let radius = a * (step / step.sin()).sqrt();
        let height_step = coil.length() / helix_segments as f64;
        let helix: Vec<[f64; 3]> = (0..=helix_segments)
            .map(|i| {
                let phi = step * i as f64;
                [
                    radius * phi.cos(),
                    radius * phi.sin(),
                    height_step * i as f64,
                ]
            })
            .collect();
        let helix_step = norm(sub(helix[1], helix[0]));
        let straight = Grading {
            end_step: 2.0 * helix_step,
            longest: (STRAIGHT_LONGEST * coil.loop_wire_length() / per_turn as f64)
                .max(2.0 * helix_step),
        };
        let mut nodes: Vec<[f64; 3]> = Vec::new();
        let mut helix_middle = helix_segments / 2;
        if coil.lead_length > 0.0 {
            let board = a + coil.lead_length;
            let start = helix[0];
            let end = helix[helix_segments];
            let foot_start = [board, start[1], start[2]];
            let foot_end = [board, end[1], end[2]];
            let closing = sub(foot_start, foot_end);
            let half_gap = 0.5 * coil.terminal_gap() / norm(closing);
            let middle = scale(add(foot_start, foot_end), 0.5);
            let gap_start = add(middle, scale(closing, half_gap));
            let gap_end = sub(middle, scale(closing, half_gap));
            push_line(&mut nodes, gap_start, foot_start, straight);
            push_line(&mut nodes, foot_start, start, straight);
            helix_middle += nodes.len() - 1;
            nodes.extend_from_slice(&helix[1..]);
            push_line(&mut nodes, end, foot_end, straight);
            push_line(&mut nodes, foot_end, gap_end, straight);
        } else {
            nodes = helix;
        }
        let segments: Vec<Segment> = nodes
            .windows(2)
            .map(|w| Segment::between(w[0], w[1]))
            .collect();
        let count = segments.len();
        // A triangle at every node between two segments; for the terminals one more, joining
        // the wire's two ends through the ideal source.
        let mut bases: Vec<Basis> = (1..count)
            .map(|k| Basis {
                arrive: k - 1,
                leave: k,
            })
            .collect();
        let feed_index = match feed {
            Feed::Terminals => {
                bases.insert(
                    0,
                    Basis {
                        arrive: count - 1,
                        leave: 0,
                    },
                );
                0
            }
            // Basis k − 1 peaks at node k.
            Feed::HelixMiddle => helix_middle - 1,
        };
        Ok(Self {
            segments,
            bases,
            feed: feed_index,
            wire_radius: coil.wire_radius,
        })
    }

    /// The largest distance between two points of the wire (a bound: the bounding box's
    /// diagonal).
    pub fn extent(&self) -> f64 {
        let mut lo = [f64::INFINITY; 3];
        let mut hi = [f64::NEG_INFINITY; 3];
        for s in &self.segments {
            for p in [s.start, s.at(1.0)] {
                for k in 0..3 {
                    lo[k] = lo[k].min(p[k]);
                    hi[k] = hi[k].max(p[k]);
                }
            }
        }
        norm(sub(hi, lo))
    }
}

/// The longest straight segment, as a share of the loop's wire over the segments a turn:
/// 0.4·(loop wire)/(per turn), about λ/(5·per turn) at the first resonance (where the loop's
/// wire is near half a wavelength): λ/60 at 12 a turn, and halved when the helix's segments
/// are.
const STRAIGHT_LONGEST: f64 = 0.4;
/// Growth of neighbouring straight segments away from their ends.
const STRAIGHT_GROWTH: f64 = 1.5;

/// How a straight part (lead or closing path) is cut: segments of `end_step` at both of its
/// ends (where it meets the helix, the other straight part or the terminals' gap), growing by
/// [`STRAIGHT_GROWTH`] towards its middle up to `longest`.
///
/// Long leads would otherwise take segments in proportion to their length (a 50 cm lead of a
/// 7 mm coil, 135 segments each); graded, the count stays bounded (about 20 a lead) while the
/// segments near the junctions, where the current and charge change fastest, stay short.
/// Neighbouring segments differ by at most the factor 1.5: abrupt changes in segment length
/// are to be avoided (G. J. Burke and A. J. Poggio, NEC Part III, User's Guide, 1981, on
/// segment lengths at junctions; the factor itself is common practice).
#[derive(Clone, Copy, Debug)]
struct Grading {
    end_step: f64,
    longest: f64,
}

impl Grading {
    /// The segment lengths of a straight part `length` long, in order: equal steps no longer
    /// than the end step, unless the graded cut needs fewer segments (so short parts are cut
    /// exactly as they would be without grading).
    fn lengths(&self, length: f64) -> Vec<f64> {
        let even = ((length / self.end_step).ceil() as usize).max(1);
        let uniform = vec![length / even as f64; even];
        // The ramp at each end: end step, then ×1.5 while it fits twice and stays under the
        // longest; the middle in equal steps no longer than the longest.
        let mut ramp = vec![self.end_step];
        let mut sum = self.end_step;
        let mut step = self.end_step * STRAIGHT_GROWTH;
        while step <= self.longest && 2.0 * (sum + step) < length {
            ramp.push(step);
            sum += step;
            step *= STRAIGHT_GROWTH;
        }
        let middle = length - 2.0 * sum;
        if middle <= 0.0 {
            return uniform;
        }
        let n = ((middle / self.longest.min(step)).ceil() as usize).max(1);
        if 2 * ramp.len() + n >= even {
            return uniform;
        }
        let mut lengths = ramp.clone();
        lengths.extend(std::iter::repeat_n(middle / n as f64, n));
        lengths.extend(ramp.iter().rev());
        lengths
    }
}

/// Append the nodes of a straight line from `from` to `to`, cut as `grading` says (the first
/// node only when the list is empty).
fn push_line(nodes: &mut Vec<[f64; 3]>, from: [f64; 3], to: [f64; 3], grading: Grading) {
    if nodes.is_empty() {
        nodes.push(from);
    }
    let length = norm(sub(to, from));
    let mut along = 0.0;
    let lengths = grading.lengths(length);
    let count = lengths.len();
    for (i, l) in lengths.into_iter().enumerate() {
        along += l;
        // The last node exactly at `to`.
        let t = if i + 1 == count { 1.0 } else { along / length };
        nodes.push(add(from, scale(sub(to, from), t)));
    }
}

pub(super) fn sub(a: [f64; 3], b: [f64; 3]) -> [f64; 3] {
    [a[0] - b[0], a[1] - b[1], a[2] - b[2]]
}

pub(super) fn add(a: [f64; 3], b: [f64; 3]) -> [f64; 3] {
    [a[0] + b[0], a[1] + b[1], a[2] + b[2]]
}

pub(super) fn scale(a: [f64; 3], k: f64) -> [f64; 3] {
    [a[0] * k, a[1] * k, a[2] * k]
}

pub(super) fn dot(a: [f64; 3], b: [f64; 3]) -> f64 {
    a[0] * b[0] + a[1] * b[1] + a[2] * b[2]
}

pub(super) fn norm(a: [f64; 3]) -> f64 {
    dot(a, a).sqrt()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn demo() -> WireCoil {
        WireCoil {
            mean_diameter: 7e-3,
            pitch: 1.6e-3,
            turns: 5.0,
            wire_radius: 0.5e-3,
            lead_length: 5e-3,
            resistivity: 1.0 / 58e6,
        }
    }

    #[test]
    fn the_loop_closes_across_the_gap_with_the_stated_geometry() {
        let c = demo();
        let s = Structure::build(&c, 12, Feed::Terminals).expect("valid");
        let first = s.segments[0].start;
        let last = s.segments[s.segments.len() - 1].at(1.0);
        // The two ends face each other across the terminals' gap, in the board plane.
        let board = 0.5 * c.mean_diameter + c.lead_length;
        assert!((norm(sub(first, last)) - c.terminal_gap()).abs() < 1e-12);
        assert!((first[0] - board).abs() < 1e-12 && (last[0] - board).abs() < 1e-12);
        // Every segment starts where the last one ended.
        for w in s.segments.windows(2) {
            assert!(norm(sub(w[0].at(1.0), w[1].start)) < 1e-12);
        }
        // One basis per node, the ideal source's joining the two ends.
        assert_eq!(s.bases.len(), s.segments.len());
        assert_eq!(s.bases[s.feed].arrive, s.segments.len() - 1);
        assert_eq!(s.bases[s.feed].leave, 0);
        // Wire length: helix (equal-area polygon, long by δ²/24) plus leads and closing path.
        let total: f64 = s.segments.iter().map(|g| g.length).sum();
        let delta = 2.0 * PI / 12.0;
        let expected =
            c.helix_wire_length() * (1.0 + delta * delta / 24.0) + 2.0 * c.lead_length + c.length()
                - c.terminal_gap();
        assert!(
            (total / expected - 1.0).abs() < 2e-3,
            "{total} vs {expected}"
        );
    }

    #[test]
    fn long_leads_are_cut_into_a_bounded_number_of_graded_segments() {
        // Leads of 5 mm to the 0.5 m the coil allows: the count levels off instead of growing
        // with the length, neighbours differ by at most ×1.5, and the pieces add up.
        let mut counts = Vec::new();
        for lead_mm in [5.0, 30.0, 50.0, 100.0, 500.0] {
            let c = WireCoil {
                lead_length: lead_mm * 1e-3,
                ..demo()
            };
            let per_turn = c.segments_per_turn();
            let s = Structure::build(&c, per_turn, Feed::Terminals).expect("valid");
            for w in s.segments.windows(2) {
                let ratio = w[1].length / w[0].length;
                // Helix segments meet straight ones at twice their length, as before grading.
                assert!((1.0 / 2.0 - 1e-9..=2.0 + 1e-9).contains(&ratio), "{ratio}");
            }
            let total: f64 = s.segments.iter().map(|g| g.length).sum();
            let straight = total - c.helix_wire_length();
            assert!(straight > 2.0 * c.lead_length, "{lead_mm} mm: {straight}");
            counts.push(s.segments.len());
        }
        // Bounded: the 0.5 m leads take under twice the segments of the 5 mm ones.
        assert!(counts[4] < 2 * counts[0], "{counts:?}");
        assert!(counts.windows(2).all(|w| w[0] <= w[1]), "{counts:?}");
        // Short parts are cut exactly as without grading: the demo's 5 mm leads in equal steps.
        let g = Grading {
            end_step: 3.0e-3,
            longest: 4.0e-3,
        };
        assert_eq!(g.lengths(5e-3), vec![2.5e-3; 2]);
        let long = g.lengths(0.5);
        assert!((long.iter().sum::<f64>() - 0.5).abs() < 1e-12);
        assert!(long.iter().all(|&l| l <= 4.0e-3 + 1e-15));
    }

    #[test]
    fn the_middle_feed_sits_on_the_helix_middle() {
        let c = demo();
        let s = Structure::build(&c, 12, Feed::HelixMiddle).expect("valid");
        let b = s.bases[s.feed];
        let node = s.segments[b.leave].start;
        // Half-way up the helix: z = l/2.
        assert!((node[2] - 0.5 * c.length()).abs() < 1e-12, "{node:?}");
        assert_eq!(s.bases.len(), s.segments.len() - 1);
    }

    #[test]
    fn impossible_wires_are_refused_with_a_reason() {
        let bad = [
            WireCoil {
                pitch: 0.9e-3,
                ..demo()
            },
            WireCoil {
                lead_length: 0.5e-3,
                ..demo()
            },
            WireCoil {
                turns: 0.5,
                ..demo()
            },
            WireCoil {
                mean_diameter: f64::NAN,
                ..demo()
            },
        ];
        for c in bad {
            assert!(matches!(c.check(), Err(FieldError::Geometry(_))), "{c:?}");
        }
    }
}

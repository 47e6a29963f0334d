//! Where the tank's capacitance comes from, part by part, each with a low, typical and high
//! figure, and the frequency window the total's range leaves.
//!
//! Every part names its method. Parts are of three kinds ([`Role`]): the coil's own
//! self-capacitance (the engine adds it already), the tank's drawn capacitors (fixed capacitor,
//! trimmer, feedback divider: the tank carries them) and the strays nobody drew (the rest);
//! only the last go into the tank's stray term, so nothing is counted twice.

use crate::model::{Coil, Conditions, evaluate::resonance_of};
use crate::physics::{
    coil_ground, coplanar, junction::JunctionLaw, junction::series, plate, wire_capacitance,
};
use crate::units::to_mm;

/// Low, typical and high values of one quantity (SI units of the quantity).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Span {
    /// Lowest plausible value.
    pub low: f64,
    /// Value to design with.
    pub typical: f64,
    /// Highest plausible value.
    pub high: f64,
}

impl Span {
    /// Low, typical, high.
    pub const fn new(low: f64, typical: f64, high: f64) -> Self {
        Self { low, typical, high }
    }

    /// A value known exactly.
    pub const fn exact(v: f64) -> Self {
        Self::new(v, v, v)
    }

    /// `typical` ± a fraction of it.
    pub fn relative(typical: f64, fraction: f64) -> Self {
        Self::new(
            typical * (1.0 - fraction),
            typical,
            typical * (1.0 + fraction),
        )
    }

    /// Each of low, typical, high scaled.
    pub fn scaled(self, k: f64) -> Self {
        Self::new(self.low * k, self.typical * k, self.high * k)
    }

    /// Sum, field by field (a worst-case stack).
    pub fn plus(self, o: Span) -> Self {
        Self::new(
            self.low + o.low,
            self.typical + o.typical,
            self.high + o.high,
        )
    }

    /// Whether low ≤ typical ≤ high.
    pub fn is_ordered(&self) -> bool {
        self.low <= self.typical && self.typical <= self.high
    }
}

/// The span of `f` over inputs that each have a span: f at the typical inputs, and the lowest
/// and highest of f over every corner of the inputs' box (exact for a function monotone in
/// each input, as every part here is).
fn span_of(inputs: &[Span], f: impl Fn(&[f64]) -> f64) -> Span {
    let typ: Vec<f64> = inputs.iter().map(|s| s.typical).collect();
    let typical = f(&typ);
    let (mut low, mut high) = (typical, typical);
    let mut corner = typ.clone();
    for mask in 0..(1usize << inputs.len()) {
        for (j, s) in inputs.iter().enumerate() {
            corner[j] = if mask >> j & 1 == 1 { s.high } else { s.low };
        }
        let v = f(&corner);
        low = low.min(v);
        high = high.max(v);
    }
    Span::new(low, typical, high)
}

/// How a part is carried in the tank (so that nothing is counted twice).
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Role {
    /// The coil's self-capacitance: the engine adds it beside the inductance.
    Engine,
    /// A drawn capacitor the tank already carries (fixed, trimmer, feedback divider).
    Tank,
    /// Capacitance nobody drew: goes into the tank's stray term.
    Stray,
}

/// Which part of the tank's capacitance.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum PartKind {
    /// The coil's own self-capacitance (Medhurst).
    SelfCapacitance,
    /// The coil's capacitance to a ground plane, the share across the tank.
    CoilToGround,
    /// The hot lead to the ground plane.
    LeadToGround,
    /// The two leads to each other.
    LeadToLead,
    /// Pads and traces of the hot node through the board to a ground plane.
    PadsAndTraces,
    /// Neighbouring strips of stripboard or a solderless breadboard.
    NeighbourStrips,
    /// The transistor's collector–base junction at its bias.
    DeviceJunction,
    /// The transistor's input capacitance added to the lower feedback capacitor.
    DeviceInput,
    /// The feedback divider's series capacitance.
    FeedbackDivider,
    /// The trimmer at its setting.
    Trimmer,
    /// The fixed capacitor, with its tolerance.
    FixedCapacitor,
    /// A stray figure entered by hand.
    EnteredStray,
}

impl PartKind {
    /// Every part, in the order drawn.
    pub const ALL: [PartKind; 12] = [
        PartKind::SelfCapacitance,
        PartKind::CoilToGround,
        PartKind::LeadToGround,
        PartKind::LeadToLead,
        PartKind::PadsAndTraces,
        PartKind::NeighbourStrips,
        PartKind::DeviceJunction,
        PartKind::DeviceInput,
        PartKind::FeedbackDivider,
        PartKind::Trimmer,
        PartKind::FixedCapacitor,
        PartKind::EnteredStray,
    ];

    /// Short name for tables and bars.
    pub fn label(self) -> &'static str {
        match self {
            PartKind::SelfCapacitance => "coil self-capacitance",
            PartKind::CoilToGround => "coil to ground plane",
            PartKind::LeadToGround => "hot lead to ground",
            PartKind::LeadToLead => "lead to lead",
            PartKind::PadsAndTraces => "pads and traces",
            PartKind::NeighbourStrips => "neighbouring strips",
            PartKind::DeviceJunction => "collector–base junction",
            PartKind::DeviceInput => "device input on feedback divider",
            PartKind::FeedbackDivider => "feedback divider",
            PartKind::Trimmer => "trimmer",
            PartKind::FixedCapacitor => "fixed capacitor",
            PartKind::EnteredStray => "stray as entered",
        }
    }

    /// Key for machine-readable output (snake case).
    pub fn key(self) -> &'static str {
        match self {
            PartKind::SelfCapacitance => "self_capacitance",
            PartKind::CoilToGround => "coil_to_ground",
            PartKind::LeadToGround => "lead_to_ground",
            PartKind::LeadToLead => "lead_to_lead",
            PartKind::PadsAndTraces => "pads_and_traces",
            PartKind::NeighbourStrips => "neighbour_strips",
            PartKind::DeviceJunction => "device_junction",
            PartKind::DeviceInput => "device_input",
            PartKind::FeedbackDivider => "feedback_divider",
            PartKind::Trimmer => "trimmer",
            PartKind::FixedCapacitor => "fixed_capacitor",
            PartKind::EnteredStray => "entered_stray",
        }
    }
}

/// One part of the estimate.
#[derive(Clone, Debug, PartialEq)]
pub struct StrayPart {
    /// Which part.
    pub kind: PartKind,
    /// How it is carried in the tank.
    pub role: Role,
    /// Its capacitance across the tank, farads.
    pub value: Span,
    /// The method, in a sentence (for a hover note).
    pub method: &'static str,
}

/// The leads between the coil and the board (each lead the same).
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct LeadLayout {
    /// Length of each lead, metres.
    pub length: Span,
    /// Bare wire diameter, metres.
    pub wire_diameter: f64,
    /// Height of the leads' centre over a ground plane, metres (None: no plane near).
    pub height: Option<Span>,
    /// Centre-to-centre spacing of the two leads, metres.
    pub spacing: Span,
}

/// Copper of the hot node over a ground plane through the board.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct PadLayout {
    /// Copper area of the hot node (pads and traces), m².
    pub area: Span,
    /// Width of a typical pad or trace, metres (for the fringing estimate).
    pub width: f64,
    /// Board thickness (copper to ground plane), metres.
    pub board_thickness: f64,
    /// Board's relative permittivity (FR-4 about 4.3–4.7: common practice).
    pub relative_permittivity: Span,
}

/// The hot node's neighbouring strips.
#[derive(Clone, Copy, Debug, PartialEq)]
pub enum StripLayout {
    /// Stripboard tracks: coplanar strips of `width` separated by `gap` on a board of
    /// permittivity `relative_permittivity`, over `length` of the hot strip, with `neighbours`
    /// strips beside it at RF ground.
    Tracks {
        /// Strip width, metres.
        width: f64,
        /// Gap between strips, metres.
        gap: f64,
        /// Length of the hot strip in use, metres.
        length: Span,
        /// Board permittivity.
        relative_permittivity: Span,
        /// Neighbouring strips (0–2).
        neighbours: f64,
    },
    /// A solderless breadboard: a measured figure per pair of adjacent strips (about 2 pF:
    /// common practice).
    Measured {
        /// Capacitance between the hot strip and one neighbour, farads.
        per_neighbour: Span,
        /// Neighbouring strips (0–2).
        neighbours: f64,
    },
}

/// The transistor's collector–base junction, across the tank in a common-base Colpitts stage.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct DeviceJunction {
    /// The junction law (SPICE CJC, VJC, MJC; or CJO, VJ, M).
    pub law: JunctionLaw,
    /// DC reverse bias across the junction, volts.
    pub reverse_bias: f64,
    /// Part-to-part spread of Cj0, as a fraction (e.g. 0.3).
    pub spread: f64,
    /// Series coupling capacitor between the junction and the tank, farads (None: the
    /// junction sits directly across the tank).
    pub coupling: Option<f64>,
}

/// The feedback divider and the device input across its lower capacitor.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct DividerLayout {
    /// Upper capacitor (hot end to tap), farads.
    pub upper: f64,
    /// Lower capacitor (tap to ground), farads.
    pub lower: f64,
    /// The transistor's input capacitance, across the lower capacitor, farads.
    pub device_input: Span,
}

/// Everything the estimate needs. Parts left `None` are not in the circuit.
#[derive(Clone, Debug, PartialEq, Default)]
pub struct StrayInputs {
    /// The coil's self-capacitance as the engine computes it, farads.
    pub self_capacitance: f64,
    /// Mean diameter and current-sheet length of the coil, metres.
    pub coil_mean_diameter: f64,
    /// Coil length, metres.
    pub coil_length: f64,
    /// Height of the coil's axis over a ground plane, metres (None: no plane).
    pub coil_axis_height: Option<Span>,
    /// The leads.
    pub leads: Option<LeadLayout>,
    /// Pads over a ground plane.
    pub pads: Option<PadLayout>,
    /// Neighbouring strips.
    pub strips: Option<StripLayout>,
    /// The collector–base junction.
    pub junction: Option<DeviceJunction>,
    /// The feedback divider.
    pub divider: Option<DividerLayout>,
    /// The trimmer's capacitance at its setting (its minimum, if set there), farads.
    pub trimmer: Option<Span>,
    /// The fixed capacitor's nominal value, farads, and its tolerance as a fraction.
    pub fixed: Option<(f64, f64)>,
    /// A stray figure entered by hand (the tank's own stray term), farads: shown as a part of
    /// its own when above zero.
    pub entered_stray: f64,
}

/// Medhurst's stated accuracy for the self-capacitance, ± fraction (Medhurst 1947).
const SELF_CAPACITANCE_ACCURACY: f64 = 0.05;

/// Range put on the coil-to-plane figure for the open pitch and the ends (our estimate: the
/// first lowers, the second raises it, a few tens of per cent for short open coils).
const COIL_TO_PLANE_SPREAD: f64 = 0.3;

/// The whole estimate.
#[derive(Clone, Debug, PartialEq, Default)]
pub struct StrayEstimate {
    /// The parts, in the order drawn.
    pub parts: Vec<StrayPart>,
}

impl StrayEstimate {
    /// Sum over the parts with `role`.
    pub fn sum_of(&self, role: Role) -> Span {
        self.parts
            .iter()
            .filter(|p| p.role == role)
            .fold(Span::exact(0.0), |acc, p| acc.plus(p.value))
    }

    /// The tank's whole capacitance (every part), farads.
    pub fn total(&self) -> Span {
        self.parts
            .iter()
            .fold(Span::exact(0.0), |acc, p| acc.plus(p.value))
    }

    /// What goes into the tank's stray term (the parts nobody drew), farads.
    pub fn stray_term(&self) -> Span {
        self.sum_of(Role::Stray)
    }

    /// One part, if present.
    pub fn part(&self, kind: PartKind) -> Option<&StrayPart> {
        self.parts.iter().find(|p| p.kind == kind)
    }
}

/// Why a stray estimate's inputs cannot be used: the field, in words.
#[derive(Clone, Debug, PartialEq)]
pub struct StrayInputError(pub String);

impl std::fmt::Display for StrayInputError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(&self.0)
    }
}

impl std::error::Error for StrayInputError {}

/// Check a span: finite, not negative, ordered.
fn check_span(what: &str, s: Span) -> Result<(), StrayInputError> {
    let finite = s.low.is_finite() && s.typical.is_finite() && s.high.is_finite();
    if !finite || s.low < 0.0 || !s.is_ordered() {
        return Err(StrayInputError(format!(
            "{what}: low {:e}, typical {:e}, high {:e} must be numbers, not negative, in order",
            s.low, s.typical, s.high
        )));
    }
    Ok(())
}

impl StrayInputs {
    /// Refuse inputs the formulas cannot take, naming the field: spans out of order or
    /// negative, a coil or lead touching the plane (height at or below its radius), leads
    /// touching each other, a board of no thickness.
    pub fn check(&self) -> Result<(), StrayInputError> {
        if let Some(h) = self.coil_axis_height {
            check_span("coil height over the plane", h)?;
            if h.low <= 0.5 * self.coil_mean_diameter {
                return Err(StrayInputError(format!(
                    "coil height over the plane {:.2} mm must exceed the coil's radius {:.2} mm",
                    to_mm(h.low),
                    to_mm(0.5 * self.coil_mean_diameter)
                )));
            }
        }
        if let Some(l) = self.leads {
            check_span("lead length", l.length)?;
            check_span("lead spacing", l.spacing)?;
            if let Some(h) = l.height {
                check_span("lead height", h)?;
                if h.low <= 0.5 * l.wire_diameter {
                    return Err(StrayInputError(format!(
                        "lead height {:.2} mm must exceed the wire's radius",
                        to_mm(h.low)
                    )));
                }
            }
            if l.spacing.low <= l.wire_diameter {
                return Err(StrayInputError(format!(
                    "lead spacing {:.2} mm must exceed the wire diameter {:.2} mm",
                    to_mm(l.spacing.low),
                    to_mm(l.wire_diameter)
                )));
            }
        }
        if let Some(p) = self.pads {
            check_span("pad area", p.area)?;
            check_span("board permittivity", p.relative_permittivity)?;
            if !(p.board_thickness > 0.0 && p.width > 0.0) {
                return Err(StrayInputError(
                    "board thickness and pad width must be above zero".to_owned(),
                ));
            }
        }
        if let Some(j) = self.junction {
            let law = j.law;
            if !(law.cj0 > 0.0 && law.contact_potential > 0.0 && law.grading > 0.0)
                || j.reverse_bias < 0.0
            {
                return Err(StrayInputError(
                    "junction: Cj0, φ and m must be above zero and the bias reverse (0 V or more)"
                        .to_owned(),
                ));
            }
        }
        if let Some(t) = self.trimmer {
            check_span("trimmer", t)?;
        }
        Ok(())
    }
}

/// Estimate the tank's capacitance part by part (call [`StrayInputs::check`] first: inputs it
/// refuses give infinite or NaN parts here).
pub fn estimate_stray(inputs: &StrayInputs) -> StrayEstimate {
    let mut parts = Vec::new();
    let mut push = |kind, role, value: Span, method| {
        parts.push(StrayPart {
            kind,
            role,
            value,
            method,
        })
    };
    push(
        PartKind::SelfCapacitance,
        Role::Engine,
        Span::relative(inputs.self_capacitance, SELF_CAPACITANCE_ACCURACY),
        "Medhurst 1947 table (±5 % claimed); the engine adds it beside the inductance",
    );
    if let Some(h) = inputs.coil_axis_height {
        let (d, l) = (inputs.coil_mean_diameter, inputs.coil_length);
        let typical = span_of(&[h], |x| {
            coil_ground::GROUNDED_END_FRACTION * coil_ground::coil_to_plane(d, l, x[0])
        });
        let value = Span::new(
            typical.low * (1.0 - COIL_TO_PLANE_SPREAD),
            typical.typical,
            typical.high * (1.0 + COIL_TO_PLANE_SPREAD),
        );
        push(
            PartKind::CoilToGround,
            Role::Stray,
            value,
            "coil outline as a cylinder over the plane (image method, 2πε₀/acosh(h/r) per \
             length); one third across the tank for a uniform gradient with one end grounded",
        );
    }
    if let Some(leads) = inputs.leads {
        let w = leads.wire_diameter;
        if let Some(h) = leads.height {
            let v = span_of(&[leads.length, h], |x| {
                x[0] * wire_capacitance::wire_over_plane_per_length(x[1], 0.5 * w, 1.0)
            });
            push(
                PartKind::LeadToGround,
                Role::Stray,
                v,
                "hot lead as a round wire over the plane: image method, 2πε₀/acosh(h/r) per length",
            );
        }
        let v = span_of(&[leads.length, leads.spacing], |x| {
            x[0] * wire_capacitance::parallel_wires_per_length(x[1], w, 1.0)
        });
        push(
            PartKind::LeadToLead,
            Role::Stray,
            v,
            "two parallel round wires: πε₀/acosh(s/d) per length",
        );
    }
    if let Some(p) = inputs.pads {
        let t = p.board_thickness;
        let base = span_of(&[p.area, p.relative_permittivity], |x| {
            plate::parallel_plate(x[0], t, x[1])
        });
        // Fringing: none at the low end, Palmer's full factor (uniform dielectric) at the high
        // end, half way for the typical figure.
        let palmer = plate::palmer_fringing_factor(p.width, p.area.typical / p.width, t);
        let value = Span::new(
            base.low,
            base.typical * (1.0 + 0.5 * (palmer - 1.0)),
            base.high * palmer,
        );
        push(
            PartKind::PadsAndTraces,
            Role::Stray,
            value,
            "parallel plate through the board, ε₀ε_r·A/t; fringing by Palmer 1937 at the high end",
        );
    }
    if let Some(s) = inputs.strips {
        let v = match s {
            StripLayout::Tracks {
                width,
                gap,
                length,
                relative_permittivity,
                neighbours,
            } => span_of(&[length, relative_permittivity], |x| {
                neighbours * x[0] * coplanar::coplanar_strips_per_length(width, gap, x[1])
            }),
            StripLayout::Measured {
                per_neighbour,
                neighbours,
            } => per_neighbour.scaled(neighbours),
        };
        push(
            PartKind::NeighbourStrips,
            Role::Stray,
            v,
            "coplanar strips (Gupta et al. 1996, conformal mapping) or the builders' measured \
             figure per pair of breadboard strips",
        );
    }
    if let Some(j) = inputs.junction {
        let cj = j.law.capacitance(j.reverse_bias);
        let c = j.coupling.map_or(cj, |cc| series(cj, cc));
        push(
            PartKind::DeviceJunction,
            Role::Stray,
            Span::relative(c, j.spread),
            "junction law Cj0/(1 + V/φ)^m at the bias; in common base the collector–base \
             junction sits straight across the tank (base and supply rail at RF ground)",
        );
    }
    if let Some(dv) = inputs.divider {
        let bare = series(dv.upper, dv.lower);
        let with_input = span_of(&[dv.device_input], |x| series(dv.upper, dv.lower + x[0]));
        push(
            PartKind::FeedbackDivider,
            Role::Tank,
            Span::exact(bare),
            "the two feedback capacitors in series",
        );
        push(
            PartKind::DeviceInput,
            Role::Stray,
            Span::new(
                with_input.low - bare,
                with_input.typical - bare,
                with_input.high - bare,
            ),
            "device input capacitance beside the lower capacitor raises the divider's series \
             value: C1·(C2 + Cin)/(C1 + C2 + Cin) − C1·C2/(C1 + C2)",
        );
    }
    if let Some(t) = inputs.trimmer {
        push(
            PartKind::Trimmer,
            Role::Tank,
            t,
            "the trimmer at its setting, with its maker's spread",
        );
    }
    if let Some((c, tol)) = inputs.fixed {
        push(
            PartKind::FixedCapacitor,
            Role::Tank,
            Span::relative(c, tol),
            "the fixed capacitor with its tolerance",
        );
    }
    if inputs.entered_stray > 0.0 {
        push(
            PartKind::EnteredStray,
            Role::Stray,
            Span::exact(inputs.entered_stray),
            "the stray figure as entered",
        );
    }
    StrayEstimate { parts }
}

/// The estimate's inputs for `coil` in `tank` as given: the coil's own `self_capacitance`, the
/// fixed capacitor with its `fixed_tolerance` (a fraction), the trimmer at its setting, the
/// feedback divider, the stray as entered; and, with a `construction`, its layout (leads,
/// pads, strips, board). The window and the command line both start here.
pub fn inputs_for(
    coil: &Coil,
    tank: &crate::model::Tank,
    self_capacitance: f64,
    fixed_tolerance: f64,
    construction: Option<super::construction::Construction>,
) -> StrayInputs {
    let mut inputs = StrayInputs {
        self_capacitance,
        coil_mean_diameter: coil.mean_diameter(),
        coil_length: coil.length(),
        fixed: (tank.fixed > 0.0).then_some((tank.fixed, fixed_tolerance)),
        trimmer: (tank.trimmer_max > 0.0)
            .then(|| Span::exact(tank.trimmer_at(tank.trimmer_setting))),
        divider: tank.feedback.map(|f| DividerLayout {
            upper: f.upper,
            lower: f.lower,
            device_input: Span::exact(0.0),
        }),
        entered_stray: tank.stray,
        ..StrayInputs::default()
    };
    if let Some(c) = construction {
        c.layout(coil.mean_diameter(), coil.wire_bare())
            .apply_to(&mut inputs);
    }
    inputs
}

/// The frequency window the estimate implies for `coil`, hertz: (lowest, typical, highest).
///
/// The external capacitance is every part but the coil's self-capacitance (which the engine
/// adds itself, at its typical value; its range is added to the external one).
pub fn frequency_window(coil: &Coil, conditions: &Conditions, estimate: &StrayEstimate) -> Span {
    let external = estimate.sum_of(Role::Tank).plus(estimate.stray_term());
    let own = estimate.sum_of(Role::Engine);
    let c_low = external.low + own.low - own.typical;
    let c_high = external.high + own.high - own.typical;
    Span::new(
        resonance_of(coil, c_high.max(0.0), conditions),
        resonance_of(coil, external.typical, conditions),
        resonance_of(coil, c_low.max(0.0), conditions),
    )
}

//! Ways of building the oscillator, each filling the stray estimate's layout with typical
//! ranges. The figures are starting points a builder then edits: the geometry ranges are our
//! own estimates of how such boards are usually built (common practice); the breadboard's
//! figure of about 2 pF between adjacent strips is the one builders quote (common practice).

use super::stray::{LeadLayout, PadLayout, Span, StrayInputs, StripLayout};

// One millimetre and one picofarad in SI, for the tables of typical values below.
const MM: f64 = crate::units::from_mm(1.0);
const PF: f64 = crate::units::from_pf(1.0);

/// A way of building the circuit.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum Construction {
    /// Parts soldered over a solid sheet of copper-clad board ("dead-bug"), the plane at
    /// RF ground everywhere.
    CopperClad,
    /// Stripboard: copper tracks on one side, no ground plane.
    Stripboard,
    /// Perforated board wired point to point, no plane and no tracks.
    Perfboard,
    /// A printed board with a ground plane on the far side.
    GroundPlaneBoard,
    /// A solderless breadboard.
    Breadboard,
}

/// What a construction fills in.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Layout {
    /// Height of the coil's axis over a ground plane.
    pub coil_axis_height: Option<Span>,
    /// The leads.
    pub leads: Option<LeadLayout>,
    /// The hot node's copper over a plane.
    pub pads: Option<PadLayout>,
    /// Neighbouring strips.
    pub strips: Option<StripLayout>,
}

impl Layout {
    /// Put the layout into `inputs`, replacing its layout parts (the device, divider, trimmer
    /// and fixed capacitor are left as they are).
    pub fn apply_to(&self, inputs: &mut StrayInputs) {
        inputs.coil_axis_height = self.coil_axis_height;
        inputs.leads = self.leads;
        inputs.pads = self.pads;
        inputs.strips = self.strips;
    }
}

impl Construction {
    /// Every construction, in the order offered.
    pub const ALL: [Construction; 5] = [
        Construction::CopperClad,
        Construction::GroundPlaneBoard,
        Construction::Stripboard,
        Construction::Perfboard,
        Construction::Breadboard,
    ];

    /// Name shown to the builder.
    pub fn label(self) -> &'static str {
        match self {
            Construction::CopperClad => "copper-clad board, parts over the plane",
            Construction::Stripboard => "stripboard",
            Construction::Perfboard => "perforated board, point to point",
            Construction::GroundPlaneBoard => "printed board with ground plane",
            Construction::Breadboard => "solderless breadboard",
        }
    }

    /// Short key for the command line and files.
    pub fn key(self) -> &'static str {
        match self {
            Construction::CopperClad => "copper-clad",
            Construction::Stripboard => "stripboard",
            Construction::Perfboard => "perfboard",
            Construction::GroundPlaneBoard => "ground-plane-board",
            Construction::Breadboard => "breadboard",
        }
    }

    /// The construction by its key.
    pub fn by_key(key: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|c| c.key() == key)
    }

    /// The layout for a coil of `coil_mean_diameter` wound from `wire_diameter` (both metres).
    pub fn layout(self, coil_mean_diameter: f64, wire_diameter: f64) -> Layout {
        let r = 0.5 * coil_mean_diameter;
        let span_mm = |lo: f64, typ: f64, hi: f64| Span::new(lo * MM, typ * MM, hi * MM);
        let above = |lo: f64, typ: f64, hi: f64| Span::new(r + lo * MM, r + typ * MM, r + hi * MM);
        let leads = |length: Span, height: Option<Span>, spacing: Span| LeadLayout {
            length,
            wire_diameter,
            height,
            spacing,
        };
        match self {
            Construction::CopperClad => Layout {
                coil_axis_height: Some(above(2.0, 4.0, 8.0)),
                leads: Some(leads(
                    span_mm(3.0, 5.0, 8.0),
                    Some(span_mm(2.0, 4.0, 7.0)),
                    span_mm(6.0, 9.0, 14.0),
                )),
                pads: None,
                strips: None,
            },
            Construction::GroundPlaneBoard => Layout {
                coil_axis_height: Some(above(1.6 + 0.5, 1.6 + 2.0, 1.6 + 5.0)),
                leads: Some(leads(
                    span_mm(1.5, 3.0, 5.0),
                    Some(span_mm(2.0, 2.8, 4.0)),
                    span_mm(5.0, 7.6, 10.2),
                )),
                pads: Some(PadLayout {
                    area: Span::new(10.0 * MM * MM, 18.0 * MM * MM, 30.0 * MM * MM),
                    width: 1.5 * MM,
                    board_thickness: 1.6 * MM,
                    relative_permittivity: Span::new(4.3, 4.5, 4.7),
                }),
                strips: None,
            },
            Construction::Stripboard => Layout {
                coil_axis_height: None,
                leads: Some(leads(
                    span_mm(3.0, 5.0, 8.0),
                    None,
                    span_mm(5.08, 7.62, 12.7),
                )),
                pads: None,
                strips: Some(StripLayout::Tracks {
                    width: 2.0 * MM,
                    gap: 0.54 * MM,
                    length: span_mm(10.0, 20.0, 40.0),
                    relative_permittivity: Span::new(4.0, 4.5, 5.0),
                    neighbours: 2.0,
                }),
            },
            Construction::Perfboard => Layout {
                coil_axis_height: None,
                leads: Some(leads(
                    span_mm(5.0, 10.0, 15.0),
                    None,
                    span_mm(5.0, 10.0, 15.0),
                )),
                pads: None,
                strips: None,
            },
            Construction::Breadboard => Layout {
                coil_axis_height: None,
                leads: Some(leads(
                    span_mm(5.0, 8.0, 12.0),
                    None,
                    span_mm(5.08, 7.62, 12.7),
                )),
                pads: None,
                strips: Some(StripLayout::Measured {
                    per_neighbour: Span::new(1.5 * PF, 2.0 * PF, 2.5 * PF),
                    neighbours: 2.0,
                }),
            },
        }
    }
}

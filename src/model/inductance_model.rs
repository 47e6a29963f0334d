//! The inductance models the engine offers, with every name each one goes by, and the
//! conditions of an evaluation.
//!
//! This is the one list of models: the report, the JSON, the readouts, the command-line parser
//! and its usage text, and the recipe file iterate over [`InductanceModel::ALL`] and ask the
//! model for its names, so adding a model is a variant here, its arms in this file, its figure
//! in [`Inductances`](super::Inductances) and its formula in `evaluate.rs` — the compiler points
//! to each.

/// Declares [`InductanceModel`] and [`InductanceModel::ALL`] from one list, so a variant cannot
/// exist without being in `ALL` (a model missing from `ALL` would silently drop out of the
/// report, the JSON, the readouts, the parser and the recipe file).
macro_rules! inductance_models {
    ($($(#[$doc:meta])* $variant:ident,)+) => {
        /// Which inductance model drives the resonance (the others are reported beside it).
        #[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
        pub enum InductanceModel {
            $($(#[$doc])* $variant,)+
        }

        impl InductanceModel {
            /// Every model, in the order shown.
            pub const ALL: [InductanceModel; [$(InductanceModel::$variant),+].len()] =
                [$(InductanceModel::$variant),+];
        }
    };
}

inductance_models! {
    /// Rosa's round-wire correction, frequency-aware (the default).
    RoundWire,
    /// Sum over rings (Maxwell's mutual inductance).
    FilamentSum,
    /// Nagaoka's current sheet, exact.
    CurrentSheet,
    /// Lundin 1985 closed form.
    Lundin1985,
    /// Wheeler 1928 closed form.
    Wheeler1928,
}

impl InductanceModel {
    /// The name each model is written under in a recipe file, in the order of [`Self::ALL`].
    pub const FILE_NAMES: [&'static str; Self::ALL.len()] = {
        let mut names = [""; Self::ALL.len()];
        let mut i = 0;
        while i < Self::ALL.len() {
            names[i] = Self::ALL[i].file_name();
            i += 1;
        }
        names
    };

    /// Short name with the method's author, as shown in the window and the report.
    pub const fn label(self) -> &'static str {
        match self {
            InductanceModel::RoundWire => "Rosa round wire",
            InductanceModel::FilamentSum => "Maxwell filament sum",
            InductanceModel::CurrentSheet => "Nagaoka current sheet",
            InductanceModel::Lundin1985 => "Lundin 1985",
            InductanceModel::Wheeler1928 => "Wheeler 1928",
        }
    }

    /// How the model works and where it comes from (hover notes).
    pub const fn method(self) -> &'static str {
        match self {
            InductanceModel::RoundWire => {
                "Rosa 1907/Grover 1946 round-wire correction of Nagaoka's current sheet, \
                 internal inductance at the resonance"
            }
            InductanceModel::FilamentSum => {
                "Sum over circular rings: each turn's own inductance plus Maxwell's mutual \
                 inductance of every pair (elliptic integrals), at the resonance"
            }
            InductanceModel::CurrentSheet => {
                "Nagaoka 1909 coefficient of a uniform current sheet, exact by complete \
                 elliptic integrals"
            }
            InductanceModel::Lundin1985 => {
                "Lundin 1985 closed-form approximation of Nagaoka's coefficient"
            }
            InductanceModel::Wheeler1928 => {
                "Wheeler 1928 closed form for a single-layer solenoid (about 1 % when the \
                 length exceeds 0.8 × radius)"
            }
        }
    }

    /// The value of the command line's `--model` flag.
    pub const fn cli_name(self) -> &'static str {
        match self {
            InductanceModel::RoundWire => "round-wire",
            InductanceModel::FilamentSum => "filament-sum",
            InductanceModel::CurrentSheet => "current-sheet",
            InductanceModel::Lundin1985 => "lundin",
            InductanceModel::Wheeler1928 => "wheeler",
        }
    }

    /// The key of the model's figure in the JSON output (under `inductance_nh`).
    pub const fn json_key(self) -> &'static str {
        match self {
            InductanceModel::RoundWire => "round_wire",
            InductanceModel::FilamentSum => "filament_sum",
            InductanceModel::CurrentSheet => "current_sheet",
            InductanceModel::Lundin1985 => "lundin_1985",
            InductanceModel::Wheeler1928 => "wheeler_1928",
        }
    }

    /// The name written in a recipe file (`drives_resonance: RoundWire`).
    pub const fn file_name(self) -> &'static str {
        match self {
            InductanceModel::RoundWire => "RoundWire",
            InductanceModel::FilamentSum => "FilamentSum",
            InductanceModel::CurrentSheet => "CurrentSheet",
            InductanceModel::Lundin1985 => "Lundin1985",
            InductanceModel::Wheeler1928 => "Wheeler1928",
        }
    }

    /// The model whose [`cli_name`](Self::cli_name) is `name`.
    pub fn from_cli_name(name: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|m| m.cli_name() == name)
    }

    /// The model whose [`file_name`](Self::file_name) is `name`.
    pub fn from_file_name(name: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|m| m.file_name() == name)
    }

    /// The command-line names joined for messages and usage text: "a | b | c".
    pub fn cli_names(separator: &str) -> String {
        Self::ALL.map(Self::cli_name).join(separator)
    }
}

/// Conditions of the evaluation that are not part of the coil or tank.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Conditions {
    /// Wire temperature, °C.
    pub temperature_c: f64,
    /// The model that drives the resonance.
    pub model: InductanceModel,
    /// Also compute the filament sum when another model drives (it costs N Maxwell terms).
    pub filament_sum: bool,
    /// The build's inductance over the model's (1 for the model as it stands): a bench
    /// calibration's scale factor, applied to the driving inductance (coil and leads).
    pub inductance_scale: f64,
}

impl Default for Conditions {
    fn default() -> Self {
        Self {
            temperature_c: 20.0,
            model: InductanceModel::RoundWire,
            filament_sum: true,
            inductance_scale: 1.0,
        }
    }
}

impl Conditions {
    /// The inductance scales the model accepts, as a share of its own figure: a build further
    /// from the model than a factor of two is another coil (common practice). The one home of
    /// the range: the evaluation refuses outside it and the field solution's factor must meet
    /// it.
    pub const INDUCTANCE_SCALE_RANGE: std::ops::RangeInclusive<f64> = 0.5..=2.0;

    /// Whether the filament sum is computed under these conditions.
    pub fn computes_filament_sum(&self) -> bool {
        self.filament_sum || self.model == InductanceModel::FilamentSum
    }
}

//! Recipe text: pretty RON with a short header, read back with line-and-column errors.

use super::convert::{from_file_form, to_file_form};
use super::document::Recipe;
use super::load::{LoadError, LoadErrorKind, line_col};
use super::schema::{RecipeFile, SCHEMA, SchemaProbe};
use ron::ser::{PrettyConfig, path_meta::Field};

/// The largest recipe text accepted, bytes (a recipe with a long bench log is a few kB).
pub const MAX_BYTES: usize = 4 * 1024 * 1024;

const HEADER: &str = "\
// Tankwright coil recipe. Plain text: edit it by hand if you like.
// Units are in the names: mm, pF, MHz, °C, percent, ppm.
";

fn doc_comments() -> Field {
    let mut root = Field::empty();
    root.build_fields(|top| {
        top.field("schema")
            .with_doc("File layout version; this Tankwright reads up to 1.");
        top.field("coil").build_fields(|coil| {
            coil.field("diameter").with_doc(
                "FormerMm(..): the former it is wound on, or MeanMm(..): wire centre to wire centre.",
            );
            coil.field("wire")
                .with_doc("BareMm(..) copper diameter, Awg(..) or Swg(..).");
            coil.field("coating")
                .with_doc("Bare, EnamelGrade1 or EnamelGrade2 (IEC 60317).");
            coil.field("spacing").with_doc(
                "LengthMm(..): turns x pitch, or GapMm(..): clear gap between turns.",
            );
        });
        top.field("tank").build_fields(|tank| {
            tank.field("trimmer_setting_percent")
                .with_doc("0 = trimmer at its minimum, 100 = at its maximum.");
        });
        top.field("conditions").build_fields(|c| {
            c.field("drives_resonance").with_doc(
                "RoundWire, FilamentSum, CurrentSheet, Lundin1985 or Wheeler1928.",
            );
        });
        top.field("aim").build_fields(|aim| {
            aim.field("on_channel_within_khz").with_doc(
                "On channel within +/- this many kHz of the centre; leave it out for the plan's default.",
            );
            aim.field("plan").with_doc(
                "UsFm, Fm100kHz, JapanFmWide, JapanFm, TwoMetreRegion1, TwoMetreRegion2, TwoMetreRegion2Step20kHz, TwoMetreRegion3 or OwnList(channels_mhz: [..]).",
            );
        });
        top.field("bench_log")
            .with_doc("Measurements, oldest first.");
        top.field("stage").with_doc(
            "The oscillator stage: topology CommonBase or CommonCollector; volts, ohms; transistor Figures(hfe, cbe_pf, cbc_pf, ft_mhz) or SpiceModel(\".model NAME NPN(...)\"); clapp_pf only with CommonCollector.",
        );
        top.field("stray_estimate").with_doc(
            "building_method: CopperClad, GroundPlaneBoard, Stripboard, Perfboard or Breadboard; the tolerances are ± bounds.",
        );
    });
    root
}

/// The recipe as pretty RON, with a short header comment.
pub fn to_text(recipe: &Recipe) -> String {
    let mut config = PrettyConfig::new()
        .struct_names(true)
        .indentor("    ")
        .escape_strings(false);
    config.path_meta = Some(doc_comments());
    let file = to_file_form(recipe);
    match ron::ser::to_string_pretty(&file, config) {
        Ok(body) => format!("{HEADER}{body}\n"),
        // Serialising plain structs of numbers and strings into a String cannot fail; should it
        // ever, the compact form still carries every field.
        Err(_) => format!("{HEADER}{}\n", ron::to_string(&file).unwrap_or_default()),
    }
}

/// A recipe as read from its text, and the first rule it breaks, if any. A recipe that breaks
/// a rule is still the recipe as written, every field kept: the window opens it as it is and
/// shows the refusal.
#[derive(Clone, Debug, PartialEq)]
pub struct Opened {
    /// The recipe as written.
    pub recipe: Recipe,
    /// The rule it breaks (with the field and its line), if any.
    pub refusal: Option<LoadError>,
}

impl Opened {
    /// The recipe, or the rule it breaks.
    pub fn judged(self) -> Result<Recipe, LoadError> {
        match self.refusal {
            Some(e) => Err(e),
            None => Ok(self.recipe),
        }
    }
}

/// Read and judge a recipe: the recipe only when it meets every rule.
pub fn from_text(text: &str) -> Result<Recipe, LoadError> {
    read_text(text)?.judged()
}

/// The rule `recipe` breaks, as a load error pointing at its field in `text`.
pub fn judge(recipe: &Recipe, text: &str) -> Option<LoadError> {
    super::rules::judge(recipe)
        .err()
        .map(|r| refusal_error(r, text))
}

fn refusal_error(r: super::rules::Refusal, text: &str) -> LoadError {
    let kind = if r.too_large {
        LoadErrorKind::TooLarge
    } else {
        LoadErrorKind::Invalid
    };
    LoadError::new(kind, r.reason)
        .about(r.field)
        .at(super::load::locate_key(text, r.key.0, r.key.1))
}

/// Read a recipe from text without judging its values: the schema first, then every field.
/// Fails only when there is no recipe to show (not RON, a missing field, a newer schema, too
/// large); a recipe that breaks a rule comes back as it is, with the rule in
/// [`Opened::refusal`]. A byte-order mark is skipped, and a file whose lines end in a carriage
/// return alone (old Macintosh text) is read as if they ended in line feeds.
pub fn read_text(text: &str) -> Result<Opened, LoadError> {
    let text = text.strip_prefix('\u{feff}').unwrap_or(text);
    let unix;
    let text = if text.contains('\r') && !text.contains('\n') {
        unix = text.replace('\r', "\n");
        unix.as_str()
    } else {
        text
    };
    if text.len() > MAX_BYTES {
        return Err(LoadError::new(
            LoadErrorKind::TooLarge,
            format!(
                "{} bytes is far larger than any recipe (limit {MAX_BYTES})",
                text.len()
            ),
        ));
    }
    if text.trim().is_empty() {
        return Err(LoadError::new(
            LoadErrorKind::Empty,
            "the file is empty: no recipe in it",
        ));
    }
    // The version first, ignoring every other field, so that a newer file is refused as such
    // rather than for the fields this build does not know.
    if let Ok(probe) = ron::from_str::<SchemaProbe>(text) {
        if probe.schema > u64::from(SCHEMA) {
            return Err(LoadError::new(
                LoadErrorKind::Newer {
                    schema: probe.schema,
                },
                format!(
                    "made by a newer Tankwright (schema {}, this one reads up to {SCHEMA})",
                    probe.schema
                ),
            )
            .about("schema"));
        }
        if probe.schema == 0 {
            return Err(LoadError::new(
                LoadErrorKind::Invalid,
                "schema 0 does not exist: the first schema is 1",
            )
            .about("schema")
            .at(super::load::locate_key(text, "schema", 0)));
        }
    }
    let file: RecipeFile = ron::from_str(text).map_err(|e| {
        let end = line_col(text.trim_end(), text.trim_end().len());
        let reached = (e.span.end.line, e.span.end.col);
        let mut reason = plain_reason(&e.code);
        if reached >= end {
            reason.push_str(" (the text stops there: is the file cut short?)");
        }
        LoadError::new(LoadErrorKind::Syntax, reason)
            .at(Some((e.span.start.line, e.span.start.col)))
    })?;
    // Sizes first: a recipe past them is not opened at all (see `rules::READINGS_MAX`).
    let channels = match &file.aim.plan {
        super::schema::PlanName::OwnList { channels_mhz } => channels_mhz.len(),
        _ => 0,
    };
    if let Err(r) = super::rules::check_sizes(file.bench_log.len(), channels) {
        return Err(refusal_error(r, text));
    }
    // A capacitor class this build does not know cannot be held (the recipe keeps the class
    // itself, not its name): refused here, naming the classes it knows.
    if crate::physics::dielectric_class::by_name(&file.audio.fixed_class).is_none() {
        let known: Vec<&str> = crate::physics::dielectric_class::CLASSES
            .iter()
            .map(|c| c.code)
            .collect();
        return Err(LoadError::new(
            LoadErrorKind::Invalid,
            format!(
                "the fixed capacitor's class '{}' is not one of {}",
                crate::terminal_text::clean(&file.audio.fixed_class),
                known.join(", ")
            ),
        )
        .about("audio.fixed_class".to_owned())
        .at(super::load::locate_key(text, "fixed_class", 0)));
    }
    let recipe = from_file_form(file);
    let refusal = judge(&recipe, text);
    Ok(Opened { recipe, refusal })
}

/// The RON reader's complaint in the recipe's terms: its advice to programmers (raise
/// `ron::Options::recursion_limit`, use `serde_stacker`, a raw identifier, a `RawValue`) is
/// no help to someone with a recipe file, so it is replaced or cut, and a long quoted value
/// is cut to 40 characters.
fn plain_reason(code: &ron::Error) -> String {
    match code {
        ron::Error::ExceededRecursionLimit => {
            "brackets nest far deeper than in any recipe (opened and never closed?)".to_owned()
        }
        ron::Error::SuggestRawIdentifier(name) | ron::Error::InvalidIdentifier(name) => {
            let short: String = name.chars().take(40).collect();
            format!("'{short}' is not a name the recipe file uses")
        }
        ron::Error::UnclosedLineComment => "a comment runs to the end of the text".to_owned(),
        ron::Error::ExpectedRawValue => "a value was expected here".to_owned(),
        other => {
            let text = other.to_string();
            let cut = [", try ", " try ", "`ron::"]
                .iter()
                .filter_map(|m| text.find(m))
                .min()
                .unwrap_or(text.len());
            let text = text[..cut].trim_end_matches([',', ' ']).to_owned();
            if text.chars().count() > 200 {
                format!("{}…", text.chars().take(200).collect::<String>())
            } else {
                text
            }
        }
    }
}

/// Read and judge a recipe from raw bytes (see [`from_text`]).
pub fn from_bytes(bytes: &[u8]) -> Result<Recipe, LoadError> {
    read_bytes(bytes)?.judged()
}

/// Read a recipe from raw bytes without judging it (see [`read_text`]): refuses text that is
/// not UTF-8, naming where it stops being so.
pub fn read_bytes(bytes: &[u8]) -> Result<Opened, LoadError> {
    match std::str::from_utf8(bytes) {
        Ok(text) => read_text(text),
        Err(e) => {
            let valid = bytes.get(..e.valid_up_to()).unwrap_or_default();
            let prefix = std::str::from_utf8(valid).unwrap_or_default();
            Err(LoadError::new(
                LoadErrorKind::NotText,
                "not a text file (invalid UTF-8): is this really a recipe?",
            )
            .at(Some(line_col(prefix, prefix.len()))))
        }
    }
}

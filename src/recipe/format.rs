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
            aim.field("plan").with_doc(
                "UsFm, Fm100kHz, JapanFmWide, JapanFm, TwoMetreRegion1, TwoMetreRegion2, TwoMetreRegion2Step20kHz, TwoMetreRegion3 or OwnList(channels_mhz: [..]).",
            );
        });
        top.field("bench_log")
            .with_doc("Measurements, oldest first.");
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

/// Read a recipe from text: the schema first, then every field, then the model's checks.
pub fn from_text(text: &str) -> Result<Recipe, LoadError> {
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
        let mut reason = e.code.to_string();
        if reached >= end {
            reason.push_str(" (the text stops there: is the file cut short?)");
        }
        LoadError::new(LoadErrorKind::Syntax, reason)
            .at(Some((e.span.start.line, e.span.start.col)))
    })?;
    from_file_form(file, text)
}

/// Read a recipe from raw bytes: refuses text that is not UTF-8, naming where it stops being so.
pub fn from_bytes(bytes: &[u8]) -> Result<Recipe, LoadError> {
    match std::str::from_utf8(bytes) {
        Ok(text) => from_text(text),
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

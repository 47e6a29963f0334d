//! Writing hand-outs to files, the format following the file's extension; the one place the
//! hand-outs touch the disk. Each file is written whole or not at all
//! ([`crate::recipe::store::write_atomically`]): a failure leaves any earlier file as it was
//! and no partial file behind.

use super::chart_data::{ChartKind, chart_data};
use super::chart_files::{chart_png, chart_svg};
use super::pdf::sheet_pdf;
use super::sheet::sheet;
use crate::recipe::{Footing, Recipe, figures_on, store};
use std::io::Write;
use std::path::Path;

/// Formats of the build sheet, by extension.
pub const SHEET_EXTENSIONS: [&str; 1] = ["pdf"];

/// Formats of a chart, by extension.
pub const CHART_EXTENSIONS: [&str; 2] = ["svg", "png"];

/// The lower-case extension of `path`, if it is one of `allowed`; else a message naming them.
fn extension(path: &Path, allowed: &[&str], what: &str) -> Result<String, String> {
    let ext = path
        .extension()
        .and_then(|e| e.to_str())
        .map(str::to_ascii_lowercase);
    match ext {
        Some(e) if allowed.contains(&e.as_str()) => Ok(e),
        _ => Err(format!(
            "cannot tell the format of {}: {what} can be written as {} (the file name's \
             extension chooses)",
            path.display(),
            allowed
                .iter()
                .map(|e| format!(".{e}"))
                .collect::<Vec<_>>()
                .join(" or ")
        )),
    }
}

fn write(path: &Path, bytes: &[u8]) -> Result<(), String> {
    store::write_atomically(path, bytes, |w: &mut dyn Write, b| w.write_all(b))
        .map_err(|e| e.to_string())
}

/// The build sheet and worksheet of `recipe`, figures on `footing`, as the bytes of the format
/// `path` names.
pub fn sheet_bytes(recipe: &Recipe, path: &Path, footing: Footing) -> Result<Vec<u8>, String> {
    extension(path, &SHEET_EXTENSIONS, "the build sheet")?;
    sheet_pdf(&sheet(recipe, footing)?)
}

/// Write the build sheet and worksheet of `recipe`, figures on `footing`, to `path` (.pdf).
pub fn write_sheet(recipe: &Recipe, path: &Path, footing: Footing) -> Result<(), String> {
    let bytes = sheet_bytes(recipe, path, footing)?;
    write(path, &bytes)
}

/// The chart of `kind` for `recipe`, figures on `footing`, as the bytes of the format `path`
/// names (.svg or .png).
pub fn chart_bytes(
    recipe: &Recipe,
    kind: ChartKind,
    path: &Path,
    footing: Footing,
) -> Result<Vec<u8>, String> {
    let ext = extension(path, &CHART_EXTENSIONS, "a chart")?;
    if let Some(why) = super::chart_data::refused(kind, recipe) {
        return Err(why);
    }
    let f = figures_on(recipe, footing).map_err(|e| format!("invalid recipe: {e}"))?;
    let data = chart_data(kind, recipe, &f);
    if ext == "svg" {
        chart_svg(&data).map(String::into_bytes)
    } else {
        chart_png(&data)
    }
}

/// Write the chart of `kind` for `recipe`, figures on `footing`, to `path` (.svg or .png).
pub fn write_chart(
    recipe: &Recipe,
    kind: ChartKind,
    path: &Path,
    footing: Footing,
) -> Result<(), String> {
    let bytes = chart_bytes(recipe, kind, path, footing)?;
    write(path, &bytes)
}

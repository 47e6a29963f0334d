//! The recipe folder: where recipes are kept by default, which recipes it holds, and the file
//! name a recipe is offered under.

use std::path::{Path, PathBuf};

/// `$XDG_DATA_HOME/tankwright/recipes`, else `~/.local/share/tankwright/recipes`, else a
/// `tankwright-recipes` folder in the working directory. Created on the first save, not here.
pub fn default_folder() -> PathBuf {
    let data_home = std::env::var_os("XDG_DATA_HOME")
        .filter(|v| !v.is_empty())
        .map(PathBuf::from)
        .filter(|p| p.is_absolute())
        .or_else(|| {
            std::env::var_os("HOME")
                .filter(|v| !v.is_empty())
                .map(|home| PathBuf::from(home).join(".local").join("share"))
        });
    match data_home {
        Some(dir) => dir.join("tankwright").join("recipes"),
        None => PathBuf::from("tankwright-recipes"),
    }
}

/// The `.ron` files directly in `folder`, sorted by name; empty when it does not exist.
pub fn recipes_in(folder: &Path) -> Vec<PathBuf> {
    let Ok(entries) = std::fs::read_dir(folder) else {
        return Vec::new();
    };
    let mut found: Vec<PathBuf> = entries
        .filter_map(Result::ok)
        .map(|e| e.path())
        .filter(|p| p.is_file() && p.extension().is_some_and(|x| x == "ron"))
        .collect();
    found.sort();
    found
}

/// Longest file stem offered, characters.
const STEM_MAX: usize = 60;

/// A file name for a recipe: its name in lower case, words joined by `_`, with `.ron`.
pub fn suggested_file_name(recipe_name: &str) -> String {
    let mut stem = String::new();
    for c in recipe_name.chars().flat_map(char::to_lowercase) {
        if c.is_alphanumeric() {
            stem.push(c);
        } else if !stem.is_empty() && !stem.ends_with('_') {
            stem.push('_');
        }
        if stem.chars().count() >= STEM_MAX {
            break;
        }
    }
    let stem = stem.trim_end_matches('_');
    if stem.is_empty() {
        "recipe.ron".to_owned()
    } else {
        format!("{stem}.ron")
    }
}

/// `path` with a `.ron` extension when it has none.
pub fn with_ron_extension(path: PathBuf) -> PathBuf {
    if path.extension().is_some() {
        path
    } else {
        path.with_extension("ron")
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn file_names_from_recipe_names() {
        assert_eq!(
            suggested_file_name("Lantern Hill 2 m buffer tank"),
            "lantern_hill_2_m_buffer_tank.ron"
        );
        assert_eq!(suggested_file_name("  ?? "), "recipe.ron");
        assert_eq!(
            with_ron_extension(PathBuf::from("/tmp/a")),
            PathBuf::from("/tmp/a.ron")
        );
    }
}

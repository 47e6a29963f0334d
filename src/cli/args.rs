//! A small flag parser: `--name value` pairs and bare switches.

use std::collections::BTreeMap;
use std::fmt;

/// A number for a message: plain while it is short, else in scientific notation ("1e308",
/// never 309 digits); NaN and infinities by name.
pub fn short(v: f64) -> String {
    if !v.is_finite() {
        return if v.is_nan() { "undefined" } else { "infinite" }.to_owned();
    }
    let plain = format!("{v}");
    if plain.len() <= 12 {
        plain
    } else {
        format!("{v:e}")
    }
}

/// Raw text from the command line or a file, for a message: control characters escaped and
/// at most 40 characters kept (a 300-digit word is cut, with "…").
pub fn quoted(text: &str) -> String {
    let mut out: String = text.chars().take(40).collect();
    if text.chars().count() > 40 {
        out.push('…');
    }
    super::clean(&out)
}

/// A command-line mistake, in words.
#[derive(Clone, Debug, PartialEq)]
pub struct ArgError(pub String);

impl fmt::Display for ArgError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(&self.0)
    }
}

impl std::error::Error for ArgError {}

/// Parsed flags: values by name, switches, and positional words.
#[derive(Clone, Debug, Default)]
pub struct Args {
    values: BTreeMap<String, String>,
    switches: Vec<String>,
    /// Words that are not flags, in order.
    pub positional: Vec<String>,
    used: std::cell::RefCell<Vec<String>>,
}

impl Args {
    /// Parse `args`; `switch_names` lists the flags that take no value.
    pub fn parse<I: IntoIterator<Item = String>>(
        args: I,
        switch_names: &[&str],
    ) -> Result<Self, ArgError> {
        let mut out = Args::default();
        let mut it = args.into_iter();
        while let Some(a) = it.next() {
            if let Some(name) = a.strip_prefix("--") {
                let (name, inline) = match name.split_once('=') {
                    Some((n, v)) => (n.to_owned(), Some(v.to_owned())),
                    None => (name.to_owned(), None),
                };
                if switch_names.contains(&name.as_str()) {
                    out.switches.push(name);
                    continue;
                }
                let value = match inline {
                    Some(v) => v,
                    None => it
                        .next()
                        .ok_or_else(|| ArgError(format!("--{} needs a value", quoted(&name))))?,
                };
                if out.values.insert(name.clone(), value).is_some() {
                    return Err(ArgError(format!("--{} is given twice", quoted(&name))));
                }
            } else if a.starts_with('-') && a.len() > 1 {
                return Err(ArgError(format!(
                    "unknown option '{}': options start with two dashes (e.g. --json)",
                    quoted(&a)
                )));
            } else {
                out.positional.push(a);
            }
        }
        Ok(out)
    }

    /// Whether a switch was given.
    pub fn switch(&self, name: &str) -> bool {
        self.switches.iter().any(|s| s == name)
    }

    /// A flag's raw value.
    pub fn text(&self, name: &str) -> Option<&str> {
        self.used.borrow_mut().push(name.to_owned());
        self.values.get(name).map(String::as_str)
    }

    /// A flag's value as a finite number.
    pub fn number(&self, name: &str) -> Result<Option<f64>, ArgError> {
        match self.text(name) {
            None => Ok(None),
            Some(v) => match v.trim().parse::<f64>() {
                Ok(x) if x.is_finite() => Ok(Some(x)),
                _ => Err(ArgError(format!(
                    "--{name} expects a number, got '{}'",
                    quoted(v)
                ))),
            },
        }
    }

    /// A flag's value as a whole number.
    pub fn integer(&self, name: &str) -> Result<Option<i32>, ArgError> {
        match self.text(name) {
            None => Ok(None),
            Some(v) => v.trim().parse::<i32>().map(Some).map_err(|_| {
                ArgError(format!(
                    "--{name} expects a whole number, got '{}'",
                    quoted(v)
                ))
            }),
        }
    }

    /// Refuse any word that is not a flag or a flag's value (a stray word is a mistake, e.g. a
    /// second value after `--turns 5`).
    pub fn reject_positional(&self) -> Result<(), ArgError> {
        match self.positional.first() {
            Some(word) => Err(ArgError(format!(
                "unexpected word '{}': each value follows its flag (see 'tankwright help')",
                quoted(word)
            ))),
            None => Ok(()),
        }
    }

    /// Refuse any flag that no `text`/`number` call asked for (call after reading them all).
    pub fn reject_unknown(&self) -> Result<(), ArgError> {
        let used = self.used.borrow();
        match self.values.keys().find(|k| !used.contains(k)) {
            Some(k) => Err(ArgError(format!(
                "unknown flag --{} (see 'tankwright help')",
                quoted(k)
            ))),
            None => Ok(()),
        }
    }
}

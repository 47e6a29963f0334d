//! Text on its way to a terminal or a captured output, made safe: control characters and
//! bidirectional formatting characters shown as escapes. Below both the command line and the
//! window (the window's `--print-shown` and its refusals use it too), so neither imports the
//! other for it.

/// Whether `c` must not reach a terminal as itself: a control character (but line feed and
/// tab) or one of Unicode's bidirectional formatting characters (U+061C, U+200E–U+200F,
/// U+202A–U+202E, U+2066–U+2069; Unicode Standard Annex #9), which reorder what a terminal
/// shows, so a name could display as something it is not (CVE-2021-42574, "Trojan Source").
fn unsafe_char(c: char) -> bool {
    (c.is_control() && c != '\n' && c != '\t')
        || matches!(c, '\u{061c}' | '\u{200e}' | '\u{200f}' | '\u{202a}'..='\u{202e}' | '\u{2066}'..='\u{2069}')
}

/// `text` with control characters and bidirectional formatting characters shown as escapes
/// (`\u{1b}`, `\u{202e}`), so a name or value cannot move the cursor, change colours, clear
/// the terminal or reorder the line; line feeds and tabs are kept.
pub fn clean(text: &str) -> String {
    if !text.chars().any(unsafe_char) {
        return text.to_owned();
    }
    text.chars()
        .map(|c| {
            if unsafe_char(c) {
                c.escape_unicode().to_string()
            } else {
                c.to_string()
            }
        })
        .collect()
}

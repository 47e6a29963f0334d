//! The eframe window: the only layer that imports egui.

pub mod app;
pub mod bench_log;
pub mod cautions;
pub mod charts;
pub mod coil_view;
pub mod evaluation;
pub mod files;
pub mod panels;
pub mod preferences;
mod screenshot;
pub mod theme;
pub mod undo;
pub mod units;
pub mod widgets;
pub mod working_copy;

pub use app::App;

use std::path::PathBuf;
use std::sync::{Arc, Mutex};

/// Size of the window at start, points.
pub const WINDOW_SIZE: [f32; 2] = [1400.0, 900.0];

/// What the command line asked of the window.
#[derive(Debug, Default, PartialEq)]
struct WindowArgs {
    screenshot: Option<PathBuf>,
    theme: Option<theme::Theme>,
}

fn parse_args(args: Vec<String>) -> Result<WindowArgs, String> {
    let mut out = WindowArgs::default();
    let mut args = args.into_iter();
    while let Some(arg) = args.next() {
        match arg.as_str() {
            "--screenshot" => match args.next() {
                Some(path) if !path.starts_with("--") => out.screenshot = Some(path.into()),
                _ => {
                    return Err(
                        "--screenshot needs a file name, e.g. --screenshot window.png".into(),
                    );
                }
            },
            "--theme" => match args.next().as_deref() {
                Some("dark") => out.theme = Some(theme::Theme::Dark),
                Some("light") => out.theme = Some(theme::Theme::Light),
                _ => return Err("--theme takes 'light' or 'dark'".into()),
            },
            other => {
                return Err(format!(
                    "unknown option '{other}': the window takes --screenshot FILE.png and \
                     --theme light|dark (see 'tankwright help')"
                ));
            }
        }
    }
    Ok(out)
}

/// Open the window: on the last session's working copy if there is one, else on the demo
/// recipe. With `--screenshot FILE.png`, draw a few frames of the demo, save one as a PNG and
/// close; `--theme light|dark` picks the theme for this session.
pub fn run(args: Vec<String>) -> Result<(), String> {
    open(None, args)
}

/// Open the window on `recipe`, opened from the file `path`, with the same flags as [`run`].
pub fn run_recipe(
    recipe: crate::recipe::Recipe,
    path: std::path::PathBuf,
    args: Vec<String>,
) -> Result<(), String> {
    open(Some((recipe, path)), args)
}

fn open(
    document: Option<(crate::recipe::Recipe, std::path::PathBuf)>,
    args: Vec<String>,
) -> Result<(), String> {
    let args = parse_args(args)?;
    let outcome: screenshot::Outcome = Arc::new(Mutex::new(None));
    let capture = args.screenshot.is_some();
    // A capture starts from the defaults, not from the last session, and leaves it untouched:
    // it keeps its state in a scratch file of its own.
    let scratch = capture.then(|| {
        std::env::temp_dir().join(format!("tankwright-capture-{}.ron", std::process::id()))
    });
    let options = eframe::NativeOptions {
        renderer: eframe::Renderer::Glow,
        viewport: eframe::egui::ViewportBuilder::default()
            .with_inner_size(WINDOW_SIZE)
            .with_min_inner_size([1100.0, 700.0])
            .with_title("Tankwright"),
        persist_window: !capture,
        persistence_path: scratch.clone(),
        ..Default::default()
    };
    let job_outcome = Arc::clone(&outcome);
    eframe::run_native(
        "Tankwright",
        options,
        Box::new(move |cc| {
            let mut app = match (capture, document) {
                (true, document) => App::with_recipe(
                    document.map_or_else(crate::recipe::Recipe::demo, |(recipe, _)| recipe),
                ),
                (false, Some((recipe, path))) => App::new(cc).with_file(recipe, &path),
                (false, None) => App::new(cc),
            };
            if let Some(theme) = args.theme {
                app.set_theme(theme);
            }
            if let Some(path) = args.screenshot {
                app.capture_on_start(screenshot::ScreenshotJob::new(path, job_outcome));
            }
            Ok(Box::new(app))
        }),
    )
    .map_err(|e| format!("cannot open the window: {e}"))?;
    if let Some(scratch) = scratch {
        // Best effort: the scratch state is of no use once the capture is done.
        let _ = std::fs::remove_file(scratch);
    }
    if capture {
        let result = outcome
            .lock()
            .map_err(|_| "screenshot state poisoned".to_owned())?
            .take();
        return result.unwrap_or_else(|| Err("the window closed before the screenshot".into()));
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn screenshot_flag_takes_a_path() {
        let args = parse_args(vec!["--screenshot".into(), "a.png".into()]);
        assert_eq!(
            args,
            Ok(WindowArgs {
                screenshot: Some("a.png".into()),
                theme: None,
            })
        );
    }

    #[test]
    fn unknown_flags_are_refused() {
        assert!(parse_args(vec!["--fast".into()]).is_err_and(|e| e.contains("--fast")));
        assert!(parse_args(vec!["--screenshot".into()]).is_err());
    }
}

//! The eframe window: the only layer that imports egui.

pub mod app;
pub mod bench_log;
pub mod cautions;
pub mod charts;
pub mod coil_view;
pub mod evaluation;
pub mod field_worker;
pub mod files;
pub mod panels;
pub mod preferences;
mod replay;
mod screenshot;
pub mod teaching;
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
    /// Start in the teaching bench's presentation layout.
    presentation: bool,
    /// Test only: an edit replayed once the window has drawn (`--replay-edit turns=6.5`).
    replay: Option<replay::Edit>,
    /// Test only: print what the window shows once it has settled, then close.
    print_shown: bool,
}

fn parse_args(args: Vec<String>) -> Result<WindowArgs, String> {
    let mut out = WindowArgs::default();
    let mut args = args.into_iter();
    while let Some(arg) = args.next() {
        match arg.as_str() {
            "--screenshot" => match args.next() {
                Some(path) if !path.starts_with('-') => out.screenshot = Some(path.into()),
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
            "--replay-edit" => {
                let edit = args.next().unwrap_or_default();
                out.replay = Some(replay::Edit::parse(&edit)?);
            }
            "--print-shown" => out.print_shown = true,
            "--presentation" => out.presentation = true,
            other => {
                return Err(format!(
                    "unknown option '{}': the window takes --screenshot FILE.png, \
                     --theme light|dark and --presentation (see 'tankwright help')",
                    crate::terminal_text::clean(other)
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

/// Open the window on the recipe file `path` (after the last session's working copy, which it
/// replaces unless that holds unsaved changes: then the window asks). A file that cannot be
/// read is reported in the window, which opens all the same.
pub fn run_file(path: PathBuf, args: Vec<String>) -> Result<(), String> {
    open(Some(path), args)
}

fn open(file: Option<PathBuf>, args: Vec<String>) -> Result<(), String> {
    let args = parse_args(args)?;
    let outcome: screenshot::Outcome = Arc::new(Mutex::new(None));
    let capture = args.screenshot.is_some();
    // A capture starts from the defaults, not from the last session, and leaves it untouched:
    // eframe's own state goes to a private folder made for this run and removed after.
    let scratch =
        if capture {
            Some(screenshot::scratch_folder().map_err(|e| {
                format!("cannot make a private temporary folder for the capture: {e}")
            })?)
        } else {
            None
        };
    let data = working_copy::data_folder();
    // Each window on the data folder keeps its working copy in a slot of its own (held until
    // the window closes), so two windows never write over each other's unsaved work.
    let claim = (!capture).then(|| working_copy::claim_slot(&data));
    let folder = claim
        .as_ref()
        .map_or_else(|| data.clone(), |c| c.folder.clone());
    let options = eframe::NativeOptions {
        renderer: eframe::Renderer::Glow,
        viewport: eframe::egui::ViewportBuilder::default()
            .with_inner_size(WINDOW_SIZE)
            .with_min_inner_size([1100.0, 700.0])
            .with_title("Tankwright"),
        persist_window: !capture,
        // eframe rewrites its file in place: only the window's size and place are in it.
        persistence_path: Some(match &scratch {
            Some(dir) => dir.join("window.ron"),
            None => data.join("window.ron"),
        }),
        ..Default::default()
    };
    let job_outcome = Arc::clone(&outcome);
    let WindowArgs {
        screenshot,
        theme,
        presentation,
        replay,
        print_shown,
    } = args;
    eframe::run_native(
        "Tankwright",
        options,
        Box::new(move |_cc| {
            let mut app = if capture {
                let recipe = file
                    .as_deref()
                    .and_then(|p| crate::recipe::open(p).ok())
                    .map_or_else(crate::recipe::Recipe::demo, |o| o.recipe);
                App::with_recipe(recipe)
            } else {
                App::restore(folder, file.as_deref())
            };
            if let Some(theme) = theme {
                app.set_theme(theme);
            }
            if presentation {
                app.teaching_mut().set_presentation(true);
            }
            if let Some(path) = screenshot {
                app.capture_on_start(screenshot::ScreenshotJob::new(path, job_outcome));
            }
            if replay.is_some() || print_shown {
                app.test_driver(replay::Driver::new(replay, print_shown));
            }
            Ok(Box::new(app))
        }),
    )
    .map_err(|e| format!("cannot open the window: {e}"))?;
    drop(claim);
    if let Some(scratch) = scratch {
        // Best effort: the scratch state is of no use once the capture is done.
        let _ = std::fs::remove_dir_all(scratch);
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
                ..WindowArgs::default()
            })
        );
    }

    #[test]
    fn unknown_flags_are_refused() {
        assert!(parse_args(vec!["--fast".into()]).is_err_and(|e| e.contains("--fast")));
        assert!(parse_args(vec!["--screenshot".into()]).is_err());
    }
}

//! Entry point: the window by default, headless subcommands for scripts.
#![warn(clippy::unwrap_used, clippy::expect_used)]
#![expect(
    clippy::print_stdout,
    clippy::print_stderr,
    reason = "the entry point is the one place that prints: the commands return strings"
)]

use std::process::ExitCode;

fn main() -> ExitCode {
    let mut args: Vec<String> = std::env::args().skip(1).collect();
    let command = args.first().cloned();
    match command.as_deref() {
        Some("evaluate") => {
            args.remove(0);
            finish(tankwright::cli::run_evaluate(args))
        }
        Some("impedance") => {
            args.remove(0);
            finish(tankwright::cli::run_impedance(args))
        }
        Some("report") => {
            args.remove(0);
            finish(tankwright::cli::run_report(args))
        }
        Some("solve") => {
            args.remove(0);
            finish(tankwright::cli::run_solve(args))
        }
        Some("fit") => {
            args.remove(0);
            finish(tankwright::cli::run_fit(args))
        }
        Some("help") | Some("--help") | Some("-h") => {
            print!("{}", tankwright::cli::usage());
            ExitCode::SUCCESS
        }
        Some(file) if file.ends_with(".ron") => {
            let path = std::path::PathBuf::from(file);
            args.remove(0);
            match tankwright::recipe::store::load(&path) {
                Ok(recipe) => window(tankwright::ui::run_recipe(recipe, path, args)),
                Err(e) => {
                    eprintln!("tankwright: {e}");
                    ExitCode::FAILURE
                }
            }
        }
        _ => window(tankwright::ui::run(args)),
    }
}

fn window(result: Result<(), String>) -> ExitCode {
    match result {
        Ok(()) => ExitCode::SUCCESS,
        Err(e) => {
            eprintln!("tankwright: {e}");
            ExitCode::FAILURE
        }
    }
}

fn finish(result: Result<String, String>) -> ExitCode {
    match result {
        Ok(out) => {
            print!("{out}");
            ExitCode::SUCCESS
        }
        Err(e) => {
            eprintln!("tankwright: {e}");
            ExitCode::FAILURE
        }
    }
}

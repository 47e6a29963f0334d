//! Entry point: the window by default, headless subcommands for scripts.

use std::process::ExitCode;

fn main() -> ExitCode {
    let mut args: Vec<String> = std::env::args().skip(1).collect();
    let command = args.first().cloned();
    match command.as_deref() {
        Some("evaluate") => {
            args.remove(0);
            finish(tankwright::cli::run_evaluate(args))
        }
        Some("report") => {
            args.remove(0);
            finish(tankwright::cli::run_report(args))
        }
        Some("help") | Some("--help") | Some("-h") => {
            print!("{}", tankwright::cli::USAGE);
            ExitCode::SUCCESS
        }
        _ => match tankwright::ui::run(args) {
            Ok(()) => ExitCode::SUCCESS,
            Err(e) => {
                eprintln!("tankwright: {e}");
                ExitCode::FAILURE
            }
        },
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

//! Entry point: the window by default, headless subcommands for scripts.
#![warn(clippy::unwrap_used, clippy::expect_used)]

use std::io::Write;
use std::process::ExitCode;
use tankwright::cli::clean;

fn main() -> ExitCode {
    let mut args: Vec<String> = match std::env::args_os()
        .skip(1)
        .map(|a| a.into_string())
        .collect::<Result<_, _>>()
    {
        Ok(args) => args,
        Err(word) => {
            complain(&format!(
                "the word '{}' on the command line is not valid text (UTF-8)",
                word.to_string_lossy()
            ));
            return ExitCode::FAILURE;
        }
    };
    let command = args.first().cloned();
    let headless = matches!(
        command.as_deref(),
        Some(
            "evaluate"
                | "impedance"
                | "report"
                | "sheet"
                | "chart"
                | "solve"
                | "fit"
                | "stage"
                | "help"
        )
    );
    // A closed standard output (`>&-`) would swallow the output without an error (the
    // standard library ignores EBADF on it), and the first file opened would take its number:
    // refuse before anything is opened.
    if headless && !stdout_open() {
        complain("standard output is closed: the output would be lost (nothing done)");
        return ExitCode::FAILURE;
    }
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
        Some("sheet") => {
            args.remove(0);
            finish(tankwright::cli::run_sheet(args))
        }
        Some("chart") => {
            args.remove(0);
            finish(tankwright::cli::run_chart(args))
        }
        Some("solve") => {
            args.remove(0);
            finish(tankwright::cli::run_solve(args))
        }
        Some("fit") => {
            args.remove(0);
            finish(tankwright::cli::run_fit(args))
        }
        Some("reading") => {
            args.remove(0);
            finish(tankwright::cli::run_reading(args))
        }
        Some("spice") => {
            args.remove(0);
            finish(tankwright::cli::run_spice(args))
        }
        Some("measured") => {
            args.remove(0);
            finish(tankwright::cli::run_measured(args))
        }
        Some("new") => {
            args.remove(0);
            finish(tankwright::cli::run_new(args))
        }
        Some("design") => {
            args.remove(0);
            finish(tankwright::cli::run_design(args))
        }
        Some("stage") => {
            args.remove(0);
            finish(tankwright::cli::run_stage(args))
        }
        Some("help") | Some("--help") | Some("-h") => finish(Ok(tankwright::cli::usage())),
        // The window opens even when the file cannot be read, and says why in it: a
        // double-clicked file must not vanish without a word.
        Some(file) if file.ends_with(".ron") => {
            let path = std::path::PathBuf::from(file);
            args.remove(0);
            window(tankwright::ui::run_file(path, args))
        }
        _ => window(tankwright::ui::run(args)),
    }
}

/// Whether standard output was open when the program started. The standard library opens
/// `/dev/null` read-write in place of a closed standard descriptor before `main`, so a closed
/// standard output shows as `/dev/null` open for reading and writing (a shell's `>/dev/null`
/// opens it write-only). Read from `/proc/self/fdinfo` where it exists (Linux); elsewhere
/// assumed open.
fn stdout_open() -> bool {
    let Ok(target) = std::fs::read_link("/proc/self/fd/1") else {
        return true;
    };
    if target != std::path::Path::new("/dev/null") {
        return true;
    }
    let Ok(info) = std::fs::read_to_string("/proc/self/fdinfo/1") else {
        return true;
    };
    let flags = info
        .lines()
        .find_map(|l| l.strip_prefix("flags:"))
        .and_then(|f| u32::from_str_radix(f.trim(), 8).ok());
    // O_ACCMODE = 3, O_RDWR = 2 (Linux).
    flags.is_none_or(|f| f & 3 != 2)
}

/// Say `message` on standard error; a closed standard error is no reason to panic.
fn complain(message: &str) {
    let _ = writeln!(
        std::io::stderr(),
        "tankwright: {}",
        tankwright::cli::for_terminal(message)
    );
}

fn window(result: Result<(), String>) -> ExitCode {
    match result {
        Ok(()) => ExitCode::SUCCESS,
        Err(e) => {
            complain(&e);
            ExitCode::FAILURE
        }
    }
}

/// Print a command's output (control characters escaped); a closed or full standard output
/// ends the command with a message and a failure code instead of a panic.
fn finish(result: Result<String, String>) -> ExitCode {
    match result.and_then(|out| tankwright::cli::refuse_undefined(&out).map(|()| out)) {
        Ok(out) => {
            let mut stdout = std::io::stdout().lock();
            match stdout
                .write_all(clean(&out).as_bytes())
                .and_then(|()| stdout.flush())
            {
                Ok(()) => ExitCode::SUCCESS,
                Err(e) => {
                    complain(&format!("cannot write the output: {e}"));
                    ExitCode::FAILURE
                }
            }
        }
        Err(e) => {
            complain(&e);
            ExitCode::FAILURE
        }
    }
}

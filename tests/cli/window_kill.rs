//! The promise "a crash loses at most the last few seconds", kept by the real program: the
//! window runs under Xvfb (Mesa's software OpenGL) with a data folder of its own, makes one
//! edit (`--replay-edit`, since key events do not reach a window under bare Xvfb), is left
//! idle for 15 s, is killed with SIGKILL, and is started again: `working-copy.ron` must hold
//! the edit and the window must show it.
//!
//! Needs Xvfb. Without it the test says so and passes, except under CI (the `CI` variable
//! set), where a missing Xvfb is a failure: `.ci/setup` installs it.

use std::io::{BufRead, BufReader};
use std::path::Path;
use std::process::{Child, Command, Stdio};
use std::time::{Duration, Instant};
use tankwright::ui::working_copy::WORKING_COPY_FILE;

/// Idle time before the kill, as the issue asks (the old window wrote only on painted frames).
const IDLE: Duration = Duration::from_secs(15);

/// A private X server for the test, stopped when dropped.
struct Xvfb {
    child: Child,
    display: String,
}

impl Xvfb {
    fn start() -> Option<Self> {
        let mut child = Command::new("Xvfb")
            .args([
                "-displayfd",
                "1",
                "-screen",
                "0",
                "1400x900x24",
                "-nolisten",
                "tcp",
            ])
            .stdout(Stdio::piped())
            .stderr(Stdio::null())
            .spawn()
            .ok()?;
        let mut line = String::new();
        BufReader::new(child.stdout.take()?)
            .read_line(&mut line)
            .ok()?;
        let number = line.trim();
        if number.is_empty() {
            let _ = child.kill();
            return None;
        }
        Some(Self {
            display: format!(":{number}"),
            child,
        })
    }
}

impl Drop for Xvfb {
    fn drop(&mut self) {
        let _ = self.child.kill();
        let _ = self.child.wait();
    }
}

fn window(x: &Xvfb, data: &Path, args: &[&str]) -> Command {
    let mut cmd = Command::new(env!("CARGO_BIN_EXE_tankwright"));
    cmd.args(args)
        .env("DISPLAY", &x.display)
        .env_remove("WAYLAND_DISPLAY")
        .env("LIBGL_ALWAYS_SOFTWARE", "1")
        .env("TANKWRIGHT_DATA_DIR", data)
        // No session bus: the window must not wait for a desktop portal.
        .env_remove("DBUS_SESSION_BUS_ADDRESS");
    cmd
}

fn wait_with_timeout(child: &mut Child, limit: Duration) -> Option<std::process::ExitStatus> {
    let start = Instant::now();
    while start.elapsed() < limit {
        if let Ok(Some(status)) = child.try_wait() {
            return Some(status);
        }
        std::thread::sleep(Duration::from_millis(100));
    }
    let _ = child.kill();
    None
}

#[test]
fn an_edit_survives_sigkill_after_an_idle_window_and_shows_after_restart() {
    let Some(x) = Xvfb::start() else {
        assert!(
            std::env::var_os("CI").is_none(),
            "Xvfb is needed under CI (.ci/setup installs it)"
        );
        eprintln!("skipped: Xvfb is not installed (apt install xvfb to run this test)");
        return;
    };
    let dir = tempfile::tempdir().unwrap();
    let data = dir.path().join("data");

    let mut first = window(&x, &data, &["--replay-edit", "turns=6.5"])
        .stdout(Stdio::null())
        .stderr(Stdio::piped())
        .spawn()
        .expect("the window starts");
    // Wait for the window to make the edit (it says so on stderr), then leave it idle.
    let stderr = first.stderr.take().unwrap();
    let (tx, rx) = std::sync::mpsc::channel();
    std::thread::spawn(move || {
        for line in BufReader::new(stderr).lines().map_while(Result::ok) {
            let _ = tx.send(line);
        }
    });
    let started = Instant::now();
    let mut log = Vec::new();
    while !log.iter().any(|l: &String| l.contains("replayed edit")) {
        assert!(
            started.elapsed() < Duration::from_secs(90),
            "the window never made the edit: {log:?}"
        );
        if let Ok(line) = rx.recv_timeout(Duration::from_millis(200)) {
            log.push(line);
        }
        assert!(
            first.try_wait().unwrap().is_none(),
            "the window exited early: {log:?}"
        );
    }
    std::thread::sleep(IDLE);
    assert!(first.try_wait().unwrap().is_none(), "still running");
    first.kill().unwrap(); // SIGKILL: no exit handler runs.
    let status = first.wait().unwrap();
    assert!(!status.success());

    let copy = data.join(WORKING_COPY_FILE);
    let opened = tankwright::recipe::open(&copy)
        .unwrap_or_else(|e| panic!("{} holds no readable copy: {e}", copy.display()));
    assert_eq!(
        opened.recipe.winding.turns, 6.5,
        "the edit is in the working copy"
    );
    assert!(
        std::fs::read_to_string(&copy)
            .unwrap()
            .contains("turns: 6.5,"),
        "written as typed"
    );

    let mut second = window(&x, &data, &["--print-shown"])
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .expect("the window starts again");
    let mut shown = String::new();
    let mut out = second.stdout.take().unwrap();
    let reader = std::thread::spawn(move || {
        let mut s = String::new();
        let _ = std::io::Read::read_to_string(&mut out, &mut s);
        s
    });
    let status = wait_with_timeout(&mut second, Duration::from_secs(90));
    shown.push_str(&reader.join().unwrap());
    assert!(status.is_some_and(|s| s.success()), "second run: {shown}");
    assert!(shown.contains("turns field: 6.50"), "{shown}");
    assert!(
        shown.contains("title: • Lantern Hill"),
        "marked unsaved after the restart: {shown}"
    );
}

#[test]
fn a_recipe_file_that_cannot_be_read_opens_the_window_and_says_why() {
    let Some(x) = Xvfb::start() else {
        assert!(
            std::env::var_os("CI").is_none(),
            "Xvfb is needed under CI (.ci/setup installs it)"
        );
        eprintln!("skipped: Xvfb is not installed (apt install xvfb to run this test)");
        return;
    };
    let dir = tempfile::tempdir().unwrap();
    let bad = dir.path().join("bad.ron");
    std::fs::write(&bad, "TankwrightRecipe(schema: 1, name: ").unwrap();
    let mut child = window(
        &x,
        &dir.path().join("data"),
        &[bad.to_str().unwrap(), "--print-shown"],
    )
    .stdout(Stdio::piped())
    .stderr(Stdio::null())
    .spawn()
    .expect("the window starts");
    let mut out = child.stdout.take().unwrap();
    let reader = std::thread::spawn(move || {
        let mut s = String::new();
        let _ = std::io::Read::read_to_string(&mut out, &mut s);
        s
    });
    let status = wait_with_timeout(&mut child, Duration::from_secs(90));
    let shown = reader.join().unwrap();
    assert!(status.is_some_and(|s| s.success()), "{shown}");
    assert!(
        shown.contains("notice: could not open") && shown.contains("bad.ron, line 1"),
        "{shown}"
    );
}

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
            started.elapsed() < Duration::from_secs(240),
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
    let status = wait_with_timeout(&mut second, Duration::from_secs(240));
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
    let status = wait_with_timeout(&mut child, Duration::from_secs(240));
    let shown = reader.join().unwrap();
    assert!(status.is_some_and(|s| s.success()), "{shown}");
    assert!(
        shown.contains("notice: could not open") && shown.contains("bad.ron, line 1"),
        "{shown}"
    );
}

/// Start a window with `args` whose stderr lines are passed to the returned channel.
fn spawn_logged(
    x: &Xvfb,
    data: &Path,
    args: &[&str],
) -> (Child, std::sync::mpsc::Receiver<String>) {
    let mut child = window(x, data, args)
        .stdout(Stdio::null())
        .stderr(Stdio::piped())
        .spawn()
        .expect("the window starts");
    let stderr = child.stderr.take().unwrap();
    let (tx, rx) = std::sync::mpsc::channel();
    std::thread::spawn(move || {
        for line in BufReader::new(stderr).lines().map_while(Result::ok) {
            let _ = tx.send(line);
        }
    });
    (child, rx)
}

/// Run a `--print-shown` window to its end; what it printed.
fn shown_by(x: &Xvfb, data: &Path) -> String {
    let mut child = window(x, data, &["--print-shown"])
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
    let status = wait_with_timeout(&mut child, Duration::from_secs(240));
    let shown = reader.join().unwrap();
    assert!(status.is_some_and(|s| s.success()), "{shown}");
    shown
}

/// Turns in the working copy of `folder`, once it holds one of `wanted`.
fn wait_for_turns(folder: &Path, wanted: &[f64]) -> f64 {
    let copy = folder.join(WORKING_COPY_FILE);
    let started = Instant::now();
    loop {
        if let Ok(o) = tankwright::recipe::open(&copy)
            && wanted.contains(&o.recipe.winding.turns)
        {
            return o.recipe.winding.turns;
        }
        assert!(
            started.elapsed() < Duration::from_secs(240),
            "no edit in {}",
            copy.display()
        );
        std::thread::sleep(Duration::from_millis(100));
    }
}

/// Issue 22: two windows on one data folder, each with an unsaved edit, both killed; each
/// edit is in a working copy of its own, and both come back (the first in the next window,
/// the second offered there by path and shown in a window started beside it).
#[test]
fn two_windows_keep_their_own_working_copies_and_both_edits_survive_sigkill() {
    use tankwright::ui::working_copy::{LOCK_FILE, slot_folder};
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
    let (mut a, a_log) = spawn_logged(&x, &data, &["--replay-edit", "turns=6.5"]);
    let (mut b, b_log) = spawn_logged(&x, &data, &["--replay-edit", "turns=7.5"]);
    for (child, log) in [(&mut a, &a_log), (&mut b, &b_log)] {
        let started = Instant::now();
        let mut lines = Vec::new();
        while !lines.iter().any(|l: &String| l.contains("replayed edit")) {
            assert!(
                started.elapsed() < Duration::from_secs(240),
                "a window never made its edit: {lines:?}"
            );
            if let Ok(line) = log.recv_timeout(Duration::from_millis(200)) {
                lines.push(line);
            }
            assert!(
                child.try_wait().unwrap().is_none(),
                "exited early: {lines:?}"
            );
        }
    }
    // Each edit reaches its own slot's working copy (a condition, not a fixed wait).
    let first = wait_for_turns(&slot_folder(&data, 0), &[6.5, 7.5]);
    let second = wait_for_turns(&slot_folder(&data, 1), &[6.5, 7.5]);
    assert_ne!(first, second, "both windows wrote the same working copy");
    a.kill().unwrap();
    b.kill().unwrap();
    let _ = (a.wait(), b.wait());

    // The next window takes the first slot: its edit on screen, the other offered by path.
    let shown = shown_by(&x, &data);
    assert!(
        shown.contains(&format!("turns field: {first:.2}")),
        "{shown}"
    );
    assert!(
        shown.contains("left unsaved work") && shown.contains("window-2"),
        "the other working copy is not offered: {shown}"
    );
    // With a window holding the first slot, the next one takes the second: the other edit.
    let (mut holder, _log) = spawn_logged(&x, &data, &[]);
    let lock = slot_folder(&data, 0).join(LOCK_FILE);
    let started = Instant::now();
    while std::fs::read_to_string(&lock)
        .ok()
        .map(|t| t.trim().to_owned())
        != Some(holder.id().to_string())
    {
        assert!(
            started.elapsed() < Duration::from_secs(240),
            "no lock taken"
        );
        std::thread::sleep(Duration::from_millis(100));
    }
    let shown = shown_by(&x, &data);
    holder.kill().unwrap();
    let _ = holder.wait();
    assert!(
        shown.contains(&format!("turns field: {second:.2}")),
        "{shown}"
    );
    assert!(shown.contains("keeps its own working copy"), "{shown}");
}

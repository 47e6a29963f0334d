//! `--screenshot FILE.png`: render a few frames, capture one, save it, close the window.

use eframe::egui::{self, ColorImage, ViewportCommand};
use std::path::PathBuf;
use std::sync::{Arc, Mutex};

/// Frames drawn before the capture, so layout (grids, panels) has settled.
const SETTLE_FRAMES: u32 = 4;

/// How the capture ended, shared with [`crate::ui::run`] (which outlives the window).
pub type Outcome = Arc<Mutex<Option<Result<(), String>>>>;

/// One pending capture.
pub struct ScreenshotJob {
    path: PathBuf,
    frames: u32,
    requested: bool,
    image: Arc<Mutex<Option<Arc<ColorImage>>>>,
    outcome: Outcome,
}

impl ScreenshotJob {
    /// A capture to `path`, reporting into `outcome`.
    pub fn new(path: PathBuf, outcome: Outcome) -> Self {
        Self {
            path,
            frames: 0,
            requested: false,
            image: Arc::new(Mutex::new(None)),
            outcome,
        }
    }

    /// Call once per frame, after the window is drawn.
    pub fn step(&mut self, ctx: &egui::Context) {
        self.frames += 1;
        ctx.request_repaint();
        if !self.requested && self.frames >= SETTLE_FRAMES {
            self.requested = true;
            let slot = Arc::clone(&self.image);
            let waker = ctx.clone();
            ctx.request_screenshot(move |image| {
                if let Ok(mut slot) = slot.lock() {
                    *slot = Some(image);
                }
                waker.request_repaint();
            });
        }
        let captured = self.image.lock().ok().and_then(|mut slot| slot.take());
        if let Some(image) = captured {
            let result = save_png(&self.path, &image);
            if let Ok(mut outcome) = self.outcome.lock() {
                *outcome = Some(result);
            }
            ctx.send_viewport_cmd(ViewportCommand::Close);
        }
    }
}

/// Write the captured frame as a PNG to the path the user gave, atomically (a temporary file
/// beside it, made new and never followed through a link, then renamed over it).
fn save_png(path: &std::path::Path, image: &ColorImage) -> Result<(), String> {
    let [width, height] = image.size;
    let bytes: Vec<u8> = image
        .pixels
        .iter()
        .flat_map(|c| c.to_srgba_unmultiplied())
        .collect();
    let (Ok(w), Ok(h)) = (u32::try_from(width), u32::try_from(height)) else {
        return Err(format!(
            "screenshot of {width}×{height} pixels is too large"
        ));
    };
    let mut png = Vec::new();
    image::ImageEncoder::write_image(
        image::codecs::png::PngEncoder::new(&mut png),
        &bytes,
        w,
        h,
        image::ExtendedColorType::Rgba8,
    )
    .map_err(|e| format!("cannot encode the screenshot: {e}"))?;
    crate::recipe::store::write_atomically(path, &png, |out, b| out.write_all(b))
        .map_err(|e| format!("cannot save the screenshot: {e}"))
}

/// A folder of our own in the temporary folder for eframe's state during a capture: made new
/// (never an existing folder or link someone else put there), readable by the user only.
pub fn scratch_folder() -> std::io::Result<PathBuf> {
    let base = std::env::temp_dir();
    let seed = std::time::SystemTime::now()
        .duration_since(std::time::UNIX_EPOCH)
        .map_or(0, |d| d.subsec_nanos());
    let mut builder = std::fs::DirBuilder::new();
    #[cfg(unix)]
    {
        use std::os::unix::fs::DirBuilderExt;
        builder.mode(0o700);
    }
    let mut last = None;
    for attempt in 0..16u32 {
        let name = format!(
            "tankwright-capture-{}-{:08x}",
            std::process::id(),
            seed.wrapping_mul(2_654_435_761).wrapping_add(attempt)
        );
        let dir = base.join(name);
        // `create` fails on anything already there, a link included: nothing is followed.
        match builder.create(&dir) {
            Ok(()) => return Ok(dir),
            Err(e) => last = Some(e),
        }
    }
    Err(last.unwrap_or_else(|| std::io::Error::other("no free name")))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_scratch_folder_is_new_and_private() {
        let a = scratch_folder().expect("made");
        let b = scratch_folder().expect("made");
        assert_ne!(a, b, "a new folder each time");
        #[cfg(unix)]
        {
            use std::os::unix::fs::PermissionsExt;
            let mode = std::fs::metadata(&a).expect("there").permissions().mode();
            assert_eq!(mode & 0o077, 0, "{mode:o}");
        }
        for dir in [a, b] {
            std::fs::remove_dir(dir).expect("empty folder removed");
        }
    }
}

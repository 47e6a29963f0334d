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

/// Write the captured frame as a PNG.
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
    image::save_buffer_with_format(
        path,
        &bytes,
        w,
        h,
        image::ExtendedColorType::Rgba8,
        image::ImageFormat::Png,
    )
    .map_err(|e| format!("cannot save the screenshot to {}: {e}", path.display()))
}

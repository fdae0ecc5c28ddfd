//! The status bar and frame-time statistics.

use std::time::Instant;

use egui::RichText;

use super::{WorkbenchApp, theme};

/// A message in the status bar.
#[derive(Debug, Clone)]
pub struct Status {
    /// Text.
    pub text: String,
    /// Whether it reports an error.
    pub error: bool,
    /// When it was set.
    pub at: Instant,
}

/// Frames left out of the frame-time statistics (fonts, first evaluation).
pub const STARTUP_FRAMES: u64 = 5;

/// Frame-time statistics (printed with `COLLIGO_FRAME_STATS=1`).
#[derive(Debug, Default, Clone)]
pub struct FrameStats {
    /// Frames measured.
    pub frames: u64,
    /// Longest frame, s.
    pub max_s: f32,
    /// Sum of frame times, s.
    pub sum_s: f64,
    /// Frames above 16 ms.
    pub over_16ms: u64,
    /// Longest whole frame as eframe measured it (UI, tessellation, paint), s.
    pub max_cpu_s: f32,
}

impl FrameStats {
    /// One line of statistics.
    pub fn report(&self) -> String {
        format!(
            "frames {}, UI mean {:.2} ms, UI max {:.2} ms, UI over 16 ms: {}, whole-frame max {:.2} ms",
            self.frames,
            if self.frames > STARTUP_FRAMES {
                self.sum_s * 1000.0 / (self.frames - STARTUP_FRAMES) as f64
            } else {
                0.0
            },
            self.max_s * 1000.0,
            self.over_16ms,
            self.max_cpu_s * 1000.0
        )
    }
}

impl WorkbenchApp {
    /// Shows a status message (a very long word in it, such as a pasted
    /// id, is shortened).
    pub fn say(&mut self, text: impl Into<String>, error: bool) {
        let text: String = text.into();
        self.status = Some(Status {
            text: colligo_core::error::elide_words(&text).into_owned(),
            error,
            at: Instant::now(),
        });
    }

    pub(super) fn status_bar(&mut self, ui: &mut egui::Ui) {
        ui.horizontal(|ui| {
            match &self.status {
                Some(s) => {
                    let c = if s.error { theme::ERROR } else { theme::MUTED };
                    ui.label(RichText::new(&s.text).color(c));
                }
                None => {
                    ui.label(RichText::new("Ready").color(theme::MUTED));
                }
            }
            ui.with_layout(egui::Layout::right_to_left(egui::Align::Center), |ui| {
                if let Some(e) = &self.eval {
                    ui.label(
                        RichText::new(format!(
                            "computed in {:.2} ms",
                            e.elapsed.as_secs_f64() * 1000.0
                        ))
                        .small()
                        .color(theme::MUTED),
                    );
                }
            });
        });
    }
}

//! Colligo's look: a calm slate background with a water-blue accent and an
//! amber for warnings, so numbers stay readable for hours.

use egui::{Color32, CornerRadius, Stroke, Visuals};

/// Water blue, the accent colour.
pub const ACCENT: Color32 = Color32::from_rgb(46, 134, 171);
/// A softer accent for fills.
pub const ACCENT_SOFT: Color32 = Color32::from_rgb(214, 234, 242);
/// Amber for warnings.
pub const WARN: Color32 = Color32::from_rgb(196, 122, 0);
/// Brick red for errors and refused input.
pub const ERROR: Color32 = Color32::from_rgb(178, 45, 45);
/// Green for values inside a target.
pub const GOOD: Color32 = Color32::from_rgb(46, 125, 50);
/// Muted text.
pub const MUTED: Color32 = Color32::from_rgb(110, 118, 128);

/// Series colours for charts (distinguishable, colour-blind friendly order).
pub const SERIES: [Color32; 8] = [
    Color32::from_rgb(46, 134, 171),
    Color32::from_rgb(230, 159, 0),
    Color32::from_rgb(0, 158, 115),
    Color32::from_rgb(204, 121, 167),
    Color32::from_rgb(86, 180, 233),
    Color32::from_rgb(213, 94, 0),
    Color32::from_rgb(120, 94, 240),
    Color32::from_rgb(90, 90, 90),
];

/// Applies the light theme.
pub fn apply(ctx: &egui::Context) {
    let mut v = Visuals::light();
    v.panel_fill = Color32::from_rgb(246, 248, 250);
    v.window_fill = Color32::from_rgb(252, 253, 254);
    v.extreme_bg_color = Color32::WHITE;
    v.faint_bg_color = Color32::from_rgb(238, 242, 246);
    v.selection.bg_fill = ACCENT_SOFT;
    v.selection.stroke = Stroke::new(1.0, ACCENT);
    v.hyperlink_color = ACCENT;
    v.widgets.hovered.bg_stroke = Stroke::new(1.0, ACCENT);
    v.window_corner_radius = CornerRadius::same(6);
    v.warn_fg_color = WARN;
    v.error_fg_color = ERROR;
    ctx.set_visuals(v);
    ctx.global_style_mut(|s| {
        s.spacing.item_spacing = egui::vec2(8.0, 5.0);
        s.spacing.button_padding = egui::vec2(7.0, 3.0);
    });
}

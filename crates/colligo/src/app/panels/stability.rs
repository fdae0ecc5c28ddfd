//! Stability guidance: the formula's a_w on a scale with the published
//! growth limits and regulatory cut-offs relevant to the product kind,
//! each with its source, and the usual cautions.

use colligo_core::guidance::{Nearest, lines_for, nearest};
use colligo_core::library::{Audience, ThresholdKind, ThresholdRecord};
use egui::{Color32, FontId, Pos2, Rect, RichText, Sense, Stroke, Ui, vec2};

use crate::app::commands::Command;
use crate::app::compute::Evaluation;
use crate::app::document::Document;
use crate::app::panels::{Panel, View};
use crate::app::theme;

/// The stability panel.
#[derive(Debug, Default)]
pub struct StabilityPanel {
    /// Whether the list of lines is expanded.
    pub show_list: bool,
}

impl Panel for StabilityPanel {
    fn ui(&mut self, ui: &mut Ui, view: &View<'_>, _out: &mut Vec<Command>) {
        self.show(ui, view.doc, view.eval);
    }
}

impl StabilityPanel {
    fn show(&mut self, ui: &mut Ui, doc: &Document, eval: Option<&Evaluation>) {
        let kind = doc.project.product;
        ui.horizontal(|ui| {
            ui.heading("Stability guidance");
            ui.label(
                RichText::new(match kind {
                    Audience::Food => "food lines",
                    Audience::Cosmetic => "cosmetic lines",
                })
                .color(theme::MUTED),
            );
        });
        let aw = eval
            .and_then(|e| e.props.as_ref().ok())
            .map(|p| p.water_activity);
        let lines = lines_for(&doc.lib, kind);
        egui::CollapsingHeader::new(format!("{} guidance lines", lines.len()))
            .id_salt("stability-list")
            .default_open(self.show_list)
            .show(ui, |ui| {
                egui::Grid::new("stability-grid")
                    .num_columns(3)
                    .striped(true)
                    .spacing([10.0, 2.0])
                    .show(ui, |ui| {
                        for t in &lines {
                            let (mark, color) = match aw {
                                Some(a) if a < t.water_activity => ("below", theme::GOOD),
                                Some(_) => ("above", theme::WARN),
                                None => ("", theme::MUTED),
                            };
                            ui.label(RichText::new(format!("{:.3}", t.water_activity)).monospace());
                            let source = doc.lib.cite_text(&t.source);
                            ui.label(&t.label)
                                .on_hover_text(format!("{}\n\nSource: {source}", t.meaning));
                            ui.label(RichText::new(mark).color(color)).on_hover_text(
                                match t.kind {
                                    ThresholdKind::GrowthLimit => {
                                        "the formula's a_w compared with the minimum a_w for growth"
                                    }
                                    ThresholdKind::InhibitionBand => {
                                        "the formula's a_w compared with the band's upper limit"
                                    }
                                    ThresholdKind::Regulatory => {
                                        "the formula's a_w compared with the cut-off"
                                    }
                                },
                            );
                            ui.end_row();
                        }
                    });
            });
        ui.label(
            RichText::new(
                "Growth limits are for otherwise optimal conditions; pH, preservatives, temperature and process change them. \
                 A prediction is not a measurement: confirm with a calibrated a_w instrument and let a process authority decide.",
            )
            .small()
            .italics()
            .color(theme::MUTED),
        );
    }
}

/// The a_w scale for the document's product kind, with the formula's a_w
/// and the model band.
pub fn scale_for(ui: &mut Ui, doc: &Document, eval: &Evaluation) {
    let aw = eval.props.as_ref().ok().map(|p| p.water_activity);
    let lines = lines_for(&doc.lib, doc.project.product);
    scale(ui, &lines, aw, eval.band);
    if let Some(a) = aw {
        // The nearest lines on either side, named.
        let Nearest { below, above } = nearest(&lines, a);
        let text = match (below, above) {
            (Some(b), Some(u)) => format!(
                "{a:.3} lies above “{}” ({:.3}) and below “{}” ({:.3})",
                b.label, b.water_activity, u.label, u.water_activity
            ),
            (None, Some(u)) => format!(
                "{a:.3} is below every line; the lowest is “{}” ({:.3})",
                u.label, u.water_activity
            ),
            (Some(b), None) => format!(
                "{a:.3} is above every line; the highest is “{}” ({:.3})",
                b.label, b.water_activity
            ),
            (None, None) => String::new(),
        };
        ui.label(RichText::new(text).small().color(theme::MUTED));
    }
}

/// Paints the a_w scale from 0.55 to 1.0 with the lines and the formula.
fn scale(ui: &mut Ui, lines: &[&ThresholdRecord], aw: Option<f64>, band: Option<(f64, f64)>) {
    let (lo, hi) = (0.55, 1.0);
    let width = ui.available_width().min(520.0);
    let (rect, resp) = ui.allocate_exact_size(vec2(width, 74.0), Sense::hover());
    let p = ui.painter_at(rect);
    let bar = Rect::from_min_max(
        Pos2::new(rect.left() + 6.0, rect.top() + 30.0),
        Pos2::new(rect.right() - 6.0, rect.top() + 44.0),
    );
    let x_of = |a: f64| bar.left() + ((a.clamp(lo, hi) - lo) / (hi - lo)) as f32 * bar.width();
    // Background: drier to the left is paler.
    let steps = 40;
    for k in 0..steps {
        let a0 = lo + (hi - lo) * f64::from(k) / f64::from(steps);
        let a1 = lo + (hi - lo) * f64::from(k + 1) / f64::from(steps);
        let t = (k as f32) / (steps as f32);
        let c = Color32::from_rgb((230.0 - 60.0 * t) as u8, (238.0 - 40.0 * t) as u8, 246);
        p.rect_filled(
            Rect::from_min_max(
                Pos2::new(x_of(a0), bar.top()),
                Pos2::new(x_of(a1) + 0.5, bar.bottom()),
            ),
            0.0,
            c,
        );
    }
    for tick in [0.6, 0.7, 0.8, 0.9, 1.0] {
        let x = x_of(tick);
        p.line_segment(
            [Pos2::new(x, bar.bottom()), Pos2::new(x, bar.bottom() + 4.0)],
            Stroke::new(1.0, theme::MUTED),
        );
        p.text(
            Pos2::new(x, bar.bottom() + 5.0),
            egui::Align2::CENTER_TOP,
            format!("{tick:.1}"),
            FontId::proportional(10.0),
            theme::MUTED,
        );
    }
    let mut hovered = None;
    let pointer = resp.hover_pos();
    for (k, t) in lines.iter().enumerate() {
        let x = x_of(t.water_activity);
        let color = match t.kind {
            ThresholdKind::Regulatory => theme::ERROR,
            ThresholdKind::GrowthLimit => theme::WARN,
            ThresholdKind::InhibitionBand => theme::ACCENT,
        };
        let top = bar.top() - if k % 2 == 0 { 10.0 } else { 18.0 };
        p.line_segment(
            [Pos2::new(x, top), Pos2::new(x, bar.bottom())],
            Stroke::new(1.5, color),
        );
        if let Some(ptr) = pointer
            && (ptr.x - x).abs() < 4.0
        {
            hovered = Some(*t);
        }
    }
    if let Some((a, b)) = band {
        p.rect_filled(
            Rect::from_min_max(
                Pos2::new(x_of(a), bar.top() + 3.0),
                Pos2::new(x_of(b).max(x_of(a) + 2.0), bar.bottom() - 3.0),
            ),
            2.0,
            Color32::from_rgba_unmultiplied(46, 134, 171, 90),
        );
    }
    if let Some(a) = aw {
        let x = x_of(a);
        p.circle_filled(Pos2::new(x, bar.center().y), 6.0, theme::ACCENT);
        // Keep the label inside the scale near its ends.
        let align = if x > rect.right() - 70.0 {
            egui::Align2::RIGHT_TOP
        } else if x < rect.left() + 70.0 {
            egui::Align2::LEFT_TOP
        } else {
            egui::Align2::CENTER_TOP
        };
        p.text(
            Pos2::new(x, rect.top() + 2.0),
            align,
            format!("this formula {a:.3}"),
            FontId::proportional(11.0),
            theme::ACCENT,
        );
    }
    let legend = "lines: red = regulatory cut-off, amber = growth limit, blue = inhibition band; hover a line";
    match hovered {
        Some(t) => {
            resp.on_hover_text(format!(
                "{} — a_w {:.3}\n{}",
                t.label, t.water_activity, t.meaning
            ));
        }
        None => {
            resp.on_hover_text(legend);
        }
    }
}

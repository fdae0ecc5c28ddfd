//! Charts: one ingredient varied; every ingredient's a_w lowering per gram;
//! the freezing curve; vapour pressure against temperature.

use colligo_core::library::WATER_ID;
use egui::RichText;
use egui_plot::{HoverPosition, Legend, Line, Plot, PlotPoint, PlotPoints, Points, VLine};

/// A y axis whose tick labels stay readable on a short plot (labels down
/// to 14 points apart, as many decimals as the grid step needs).
fn y_axis<'a>(label: impl Into<egui::WidgetText>) -> Vec<egui_plot::AxisHints<'a>> {
    vec![
        egui_plot::AxisHints::new_y()
            .label(label)
            .formatter(tick)
            .label_spacing(14.0..=24.0)
            .min_thickness(44.0),
    ]
}

/// Axis tick text with as many decimals as the grid step needs.
fn tick(m: egui_plot::GridMark, _range: &std::ops::RangeInclusive<f64>) -> String {
    let d = if m.step_size > 0.0 {
        (-m.step_size.log10()).ceil().max(0.0) as usize
    } else {
        0
    };
    format!("{:.*}", d.min(6), m.value)
}

/// Hover read-out: the nearest series' name and the point under the cursor.
fn hover(h: &HoverPosition<'_>, fmt: impl Fn(&PlotPoint) -> String) -> Option<String> {
    match h {
        HoverPosition::NearDataPoint {
            plot_name,
            position,
            ..
        } => Some(format!("{plot_name}\n{}", fmt(position))),
        HoverPosition::Elsewhere { position } => Some(fmt(position)),
    }
}

use crate::app::commands::{Action, Command};
use crate::app::compute::{ChartData, ChartJob, Evaluation, SweepProperty};
use crate::app::document::Document;
use crate::app::panels::{Panel, View};
use crate::app::prefs::ChartTab;
use crate::app::theme;

/// The chart panel's own settings (not part of the document).
#[derive(Debug)]
pub struct ChartsPanel {
    /// Variant comparison (computed on the UI thread: a few evaluations).
    pub comparison: super::compare::Comparison,
    /// Ingredient ranking.
    pub ranking: super::compare::Ranking,
    /// Tab shown.
    pub tab: ChartTab,
    /// Ingredient swept (id), None: the first line.
    pub sweep_ingredient: Option<String>,
    /// Property plotted in the sweep.
    pub sweep_property: SweepProperty,
    /// Freezing chart lower end, °C.
    pub freeze_to_c: f64,
    /// Vapour-pressure chart range, °C.
    pub vp_range_c: (f64, f64),
    /// The chart the panel asked for in its last frame (None on the
    /// comparison and ranking tabs, which compute their own).
    pub request: Option<ChartJob>,
}

impl Default for ChartsPanel {
    fn default() -> Self {
        ChartsPanel {
            comparison: super::compare::Comparison::default(),
            ranking: super::compare::Ranking::default(),
            tab: ChartTab::Sweep,
            sweep_ingredient: None,
            sweep_property: SweepProperty::WaterActivity,
            freeze_to_c: -30.0,
            request: None,
            vp_range_c: (0.0, 100.0),
        }
    }
}

impl Panel for ChartsPanel {
    fn ui(&mut self, ui: &mut egui::Ui, view: &View<'_>, out: &mut Vec<Command>) {
        self.show(ui, view.doc, view.eval, view.chart, view.chart_busy, out);
    }
}

impl ChartsPanel {
    /// The job for the current tab, from the document and its evaluation.
    pub fn job(&self, doc: &Document, eval: Option<&Evaluation>) -> Option<ChartJob> {
        let f = doc.formula();
        let resolved = eval.and_then(|e| e.resolved.as_ref().ok())?;
        let batch_g: f64 = resolved.line_kg.iter().sum::<f64>() * 1000.0;
        Some(match self.tab {
            ChartTab::Sweep => {
                let id = self.sweep_id(doc)?;
                let cur = resolved.kg_of(f, &id) * 1000.0;
                let (from_g, to_g) = if id == WATER_ID {
                    (0.5 * cur, 1.5 * cur.max(1.0))
                } else {
                    (0.0, (2.0 * cur).max(0.1 * batch_g).max(1.0))
                };
                ChartJob::Sweep {
                    ingredient: id,
                    from_g,
                    to_g,
                }
            }
            ChartTab::PerGram => ChartJob::PerGram {
                up_to_g: (0.1 * batch_g).max(1.0),
            },
            ChartTab::Freezing => ChartJob::Freezing {
                to_c: self.freeze_to_c,
            },
            ChartTab::VaporPressure => ChartJob::VaporPressure {
                from_c: self.vp_range_c.0,
                to_c: self.vp_range_c.1,
            },
            ChartTab::Variants | ChartTab::Ranking => return None,
        })
    }

    fn sweep_id(&self, doc: &Document) -> Option<String> {
        let f = doc.formula();
        match &self.sweep_ingredient {
            Some(id) if f.lines.iter().any(|l| &l.ingredient == id) => Some(id.clone()),
            _ => f
                .lines
                .iter()
                .find(|l| l.ingredient != WATER_ID)
                .or(f.lines.first())
                .map(|l| l.ingredient.clone()),
        }
    }

    fn show(
        &mut self,
        ui: &mut egui::Ui,
        doc: &Document,
        eval: Option<&Evaluation>,
        data: Option<&ChartData>,
        busy: bool,
        out: &mut Vec<Command>,
    ) {
        self.request = None;
        ui.horizontal(|ui| {
            ui.heading("Charts");
            for (tab, name) in [
                (ChartTab::Sweep, "Vary one ingredient"),
                (ChartTab::PerGram, "Lowering per gram"),
                (ChartTab::Freezing, "Freezing curve"),
                (ChartTab::VaporPressure, "Vapour pressure"),
                (ChartTab::Variants, "Compare variants"),
                (ChartTab::Ranking, "What matters most"),
            ] {
                ui.selectable_value(&mut self.tab, tab, name);
            }
            ui.with_layout(egui::Layout::right_to_left(egui::Align::Center), |ui| {
                let export = Action::ExportChart;
                if ui
                    .button(export.label())
                    .on_hover_text(export.tooltip())
                    .clicked()
                {
                    out.push(export.into());
                }
                // A still label rather than a spinner: the worker repaints
                // when it is done, so nothing animates while waiting.
                if busy {
                    ui.label(RichText::new("updating…").small().color(theme::MUTED));
                }
            });
        });
        match self.tab {
            ChartTab::Variants => {
                self.comparison.ui(ui, doc);
                return;
            }
            ChartTab::Ranking => {
                self.ranking.ui(ui, doc);
                return;
            }
            _ => {}
        }
        self.controls(ui, doc);
        self.request = self.job(doc, eval);
        match data {
            None => {
                ui.label(RichText::new("computing…").color(theme::MUTED));
            }
            Some(ChartData::Failed(e)) => {
                ui.label(RichText::new(format!("No chart: {e}")).color(theme::ERROR));
            }
            Some(d) => self.plot(ui, doc, eval, d),
        }
    }

    fn controls(&mut self, ui: &mut egui::Ui, doc: &Document) {
        ui.horizontal(|ui| match self.tab {
            ChartTab::Sweep => {
                let l = ui.label("Ingredient");
                let current = self.sweep_id(doc).unwrap_or_default();
                let name = |id: &str| doc.lib.ingredient(id).map_or(id.to_string(), |i| doc.lib.ingredients[i].name().to_string());
                let mut pick = current.clone();
                egui::ComboBox::from_id_salt("sweep-ingredient")
                    .selected_text(name(&current))
                    .show_ui(ui, |ui| {
                        let mut seen = Vec::new();
                        for line in &doc.formula().lines {
                            if !seen.contains(&line.ingredient) {
                                ui.selectable_value(&mut pick, line.ingredient.clone(), name(&line.ingredient));
                                seen.push(line.ingredient.clone());
                            }
                        }
                    })
                    .response
                    .labelled_by(l.id);
                if pick != current {
                    self.sweep_ingredient = Some(pick);
                }
                let l = ui.label("against");
                egui::ComboBox::from_id_salt("sweep-property")
                    .selected_text(self.sweep_property.label())
                    .show_ui(ui, |ui| {
                        for p in SweepProperty::ALL {
                            ui.selectable_value(&mut self.sweep_property, p, p.label());
                        }
                    })
                    .response
                    .labelled_by(l.id);
            }
            ChartTab::PerGram => {
                ui.label(RichText::new("Each ingredient of the formula added on its own, up to a tenth of the batch: the steeper the line, the more a gram lowers a_w.").small().color(theme::MUTED));
            }
            ChartTab::Freezing => {
                let l = ui.label("down to");
                ui.add(egui::DragValue::new(&mut self.freeze_to_c).range(-60.0..=-1.0).speed(0.5).suffix(" °C"))
                    .labelled_by(l.id);
            }
            ChartTab::VaporPressure => {
                let l = ui.label("from");
                ui.add(egui::DragValue::new(&mut self.vp_range_c.0).range(-40.0..=150.0).suffix(" °C")).labelled_by(l.id);
                let l = ui.label("to");
                ui.add(egui::DragValue::new(&mut self.vp_range_c.1).range(-30.0..=200.0).suffix(" °C")).labelled_by(l.id);
                if self.vp_range_c.1 <= self.vp_range_c.0 + 1.0 {
                    self.vp_range_c.1 = self.vp_range_c.0 + 1.0;
                }
            }
            ChartTab::Variants | ChartTab::Ranking => {}
        });
    }

    fn plot(&self, ui: &mut egui::Ui, doc: &Document, eval: Option<&Evaluation>, d: &ChartData) {
        let h = ui.available_height().max(200.0);
        match d {
            ChartData::Sweep {
                ingredient,
                sweep,
                vapor_pa,
            } => {
                let name = doc
                    .lib
                    .ingredient(ingredient)
                    .map_or(ingredient.clone(), |i| {
                        doc.lib.ingredients[i].name().to_string()
                    });
                let ys: &[f64] = match self.sweep_property {
                    SweepProperty::WaterActivity => &sweep.water_activity,
                    SweepProperty::FreezingPoint => &sweep.freezing_point_c,
                    SweepProperty::VaporPressure => vapor_pa,
                };
                let pts: Vec<[f64; 2]> = sweep
                    .amount_kg
                    .iter()
                    .zip(ys)
                    .filter(|(_, y)| y.is_finite())
                    .map(|(x, y)| [x * 1000.0, *y])
                    .collect();
                let ylabel = self.sweep_property.label();
                let cur_g = eval
                    .and_then(|e| e.resolved.as_ref().ok())
                    .filter(|_| {
                        doc.formula()
                            .lines
                            .iter()
                            .any(|l| &l.ingredient == ingredient)
                    })
                    .map(|r| r.kg_of(doc.formula(), ingredient) * 1000.0);
                let cur_y = eval.and_then(|e| e.props.as_ref().ok()).and_then(|p| {
                    match self.sweep_property {
                        SweepProperty::WaterActivity => Some(p.water_activity),
                        SweepProperty::FreezingPoint => p.freezing_point_c,
                        SweepProperty::VaporPressure => Some(p.vapor_pressure_pa),
                    }
                });
                Plot::new("sweep-plot")
                    .height(h)
                    .x_axis_label(format!("{name}, g"))
                    .custom_y_axes(y_axis(ylabel))
                    .legend(Legend::default())
                    .label_formatter(|h| hover(h, |v| format!("{:.2} g: {:.4}", v.x, v.y)))
                    .show(ui, |pu| {
                        pu.line(
                            Line::new(format!("{ylabel} vs {name}"), PlotPoints::from(pts))
                                .color(theme::ACCENT)
                                .width(2.0),
                        );
                        if let (Some(x), Some(y)) = (cur_g, cur_y) {
                            pu.points(
                                Points::new("this formula", vec![[x, y]])
                                    .radius(5.0)
                                    .color(theme::WARN),
                            );
                        }
                    });
            }
            ChartData::PerGram(series) => {
                Plot::new("per-gram-plot")
                    .height(h)
                    .x_axis_label("grams added")
                    .custom_y_axes(y_axis("a_w lowering, Δa_w"))
                    .legend(Legend::default())
                    .label_formatter(|h| hover(h, |v| format!("+{:.2} g: Δa_w {:.4}", v.x, v.y)))
                    .show(ui, |pu| {
                        for (k, (id, g, d)) in series.iter().enumerate() {
                            let name = doc
                                .lib
                                .ingredient(id)
                                .map_or(id.clone(), |i| doc.lib.ingredients[i].name().to_string());
                            let slope = if g.len() > 1 && g[1] > 0.0 {
                                d[1] / g[1]
                            } else {
                                0.0
                            };
                            let pts: Vec<[f64; 2]> = g
                                .iter()
                                .zip(d)
                                .filter(|(_, y)| y.is_finite())
                                .map(|(x, y)| [*x, *y])
                                .collect();
                            pu.line(
                                Line::new(
                                    format!("{name} ({slope:.2e} per g)"),
                                    PlotPoints::from(pts),
                                )
                                .color(theme::SERIES[k % theme::SERIES.len()])
                                .width(2.0),
                            );
                        }
                    });
            }
            ChartData::Freezing(c) => {
                let pts: Vec<[f64; 2]> = c
                    .points
                    .iter()
                    .map(|p| [p.temperature_c, p.ice_fraction_of_water])
                    .collect();
                let storage = doc.project.conditions.storage_temperature_c;
                let cur = eval
                    .and_then(|e| e.props.as_ref().ok())
                    .and_then(|p| p.ice_fraction_of_water);
                Plot::new("freezing-plot")
                    .height(h)
                    .x_axis_label("temperature, °C")
                    .custom_y_axes(y_axis("ice, fraction of the water"))
                    .include_y(0.0)
                    .include_y(1.0)
                    .legend(Legend::default())
                    .label_formatter(|h| {
                        hover(h, |v| format!("{:.1} °C: {:.1} % ice", v.x, 100.0 * v.y))
                    })
                    .show(ui, |pu| {
                        pu.line(
                            Line::new("ice fraction", PlotPoints::from(pts))
                                .color(theme::ACCENT)
                                .width(2.0),
                        );
                        if let Some(tf) = c.freezing_point_c {
                            pu.vline(VLine::new("freezing point", tf).color(theme::MUTED));
                        }
                        if let Some(f) = cur {
                            pu.points(
                                Points::new("storage temperature", vec![[storage, f]])
                                    .radius(5.0)
                                    .color(theme::WARN),
                            );
                        }
                    });
            }
            ChartData::VaporPressure(pts) => {
                let f: Vec<[f64; 2]> = pts
                    .iter()
                    .map(|p| [p.temperature_c, p.formula_pa / 1000.0])
                    .collect();
                let w: Vec<[f64; 2]> = pts
                    .iter()
                    .map(|p| [p.temperature_c, p.water_pa / 1000.0])
                    .collect();
                let t_now = doc.project.conditions.temperature_c;
                let p_now = eval
                    .and_then(|e| e.props.as_ref().ok())
                    .map(|p| p.vapor_pressure_pa / 1000.0);
                Plot::new("vp-plot")
                    .height(h)
                    .x_axis_label("temperature, °C")
                    .custom_y_axes(y_axis("vapour pressure, kPa"))
                    .legend(Legend::default())
                    .label_formatter(|h| hover(h, |v| format!("{:.1} °C: {:.3} kPa", v.x, v.y)))
                    .show(ui, |pu| {
                        pu.line(
                            Line::new("pure water", PlotPoints::from(w))
                                .color(theme::MUTED)
                                .width(1.5),
                        );
                        pu.line(
                            Line::new("this formula", PlotPoints::from(f))
                                .color(theme::ACCENT)
                                .width(2.0),
                        );
                        if let Some(p) = p_now {
                            pu.points(
                                Points::new("product temperature", vec![[t_now, p]])
                                    .radius(5.0)
                                    .color(theme::WARN),
                            );
                        }
                    });
            }
            ChartData::Failed(_) => {}
        }
    }
}

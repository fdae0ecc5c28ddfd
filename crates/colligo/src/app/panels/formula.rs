//! The formula table: ingredient lines with amounts and units, computed
//! columns, reordering, the ingredient picker and batch scaling.

use colligo_core::library::SearchHit;
use colligo_core::quantity::{AmountUnit, parse_amount, parse_amount_or, trim_float};
use egui::{Color32, RichText, TextEdit};

use crate::app::commands::{Command, Edit};
use crate::app::compute::Evaluation;
use crate::app::document::Document;
use crate::app::panels::{Panel, View};
use crate::app::theme;

/// The text being typed into one amount field.
#[derive(Debug, Clone, Default)]
struct AmountEdit {
    text: String,
    error: Option<String>,
    /// The document value the text was last set from.
    synced: Option<(f64, AmountUnit)>,
}

/// The formula panel.
#[derive(Debug, Default)]
pub struct FormulaPanel {
    picker_query: String,
    edits: Vec<AmountEdit>,
    scale_text: String,
    scale_error: Option<String>,
    synced_for: Option<(usize, usize)>,
}

impl Panel for FormulaPanel {
    fn ui(&mut self, ui: &mut egui::Ui, view: &View<'_>, out: &mut Vec<Command>) {
        self.show(ui, view.doc, view.eval, out);
    }
}

impl FormulaPanel {
    fn show(
        &mut self,
        ui: &mut egui::Ui,
        doc: &Document,
        eval: Option<&Evaluation>,
        out: &mut Vec<Command>,
    ) {
        let formula = doc.formula();
        self.sync(doc);
        ui.horizontal(|ui| {
            ui.heading("Formula");
            ui.label(RichText::new(format!("— {}", formula.name)).color(theme::MUTED));
        });
        ui.add_space(2.0);
        let lines_info = eval.map(|e| &e.lines);
        egui::ScrollArea::both()
            .id_salt("formula-lines")
            .max_height(ui.available_height() - 70.0)
            .auto_shrink([false, true])
            .show(ui, |ui| {
                egui::Grid::new("formula-grid")
                    .striped(true)
                    .num_columns(7)
                    .spacing([10.0, 4.0])
                    .show(ui, |ui| {
                        for h in [
                            "",
                            "Ingredient",
                            "Amount",
                            "Unit",
                            "% of batch",
                            "Undissolved",
                            "Share of a_w lowering",
                        ] {
                            ui.label(RichText::new(h).strong());
                        }
                        ui.end_row();
                        let n = formula.lines.len();
                        for (i, line) in formula.lines.iter().enumerate() {
                            let name = doc
                                .lib
                                .ingredient(&line.ingredient)
                                .map_or(line.ingredient.as_str(), |k| {
                                    doc.lib.ingredients[k].name()
                                });
                            line_menu(ui, i, n, name, out);
                            let label = ui
                                .allocate_ui_with_layout(
                                    egui::vec2(210.0, 18.0),
                                    egui::Layout::left_to_right(egui::Align::Center),
                                    |ui| ui.add(egui::Label::new(name).truncate()),
                                )
                                .inner
                                .on_hover_text(format!("{name} (id: {})", line.ingredient));
                            self.amount_cell(ui, i, line.unit, label.id, name, out);
                            unit_combo(ui, i, name, line.amount, line.unit, out);
                            let info = lines_info.and_then(|l| l.get(i));
                            match info {
                                Some(info) => {
                                    ui.label(format!("{:.2} %", info.percent))
                                        .on_hover_text(format!("{:.3} g", info.grams));
                                    if info.undissolved_g > 1e-9 {
                                        ui.label(
                                            RichText::new(format!("{:.2} g", info.undissolved_g))
                                                .color(theme::WARN),
                                        )
                                        .on_hover_text("beyond its solubility: may crystallise");
                                    } else {
                                        ui.label("—");
                                    }
                                    share_bar(ui, info.lowering_percent);
                                }
                                None => {
                                    ui.label("—");
                                    ui.label("—");
                                    ui.label("—");
                                }
                            }
                            ui.end_row();
                        }
                    });
                if formula.lines.is_empty() {
                    ui.label(
                        RichText::new("No ingredients yet: add water and what you dissolve in it.")
                            .color(theme::MUTED),
                    );
                }
            });
        ui.separator();
        self.picker(ui, doc, out);
        self.scale_row(ui, eval, out);
    }

    /// Resets text buffers that no longer match the document (undo, scale,
    /// another variant) unless the user is typing in them.
    fn sync(&mut self, doc: &Document) {
        let f = doc.formula();
        let key = (doc.project.active_variant, f.lines.len());
        if self.synced_for != Some(key) {
            self.edits.clear();
            self.synced_for = Some(key);
        }
        self.edits.resize_with(f.lines.len(), AmountEdit::default);
        for (e, l) in self.edits.iter_mut().zip(&f.lines) {
            let v = (l.amount, l.unit);
            if e.synced != Some(v) && e.error.is_none() {
                e.text = trim_float(l.amount);
                e.synced = Some(v);
            }
        }
    }

    fn amount_cell(
        &mut self,
        ui: &mut egui::Ui,
        i: usize,
        unit: AmountUnit,
        label: egui::Id,
        name: &str,
        out: &mut Vec<Command>,
    ) {
        let Some(e) = self.edits.get_mut(i) else {
            return;
        };
        let mut te = TextEdit::singleline(&mut e.text)
            .desired_width(80.0)
            .align(egui::Align2::RIGHT_CENTER);
        if e.error.is_some() {
            te = te.text_color(theme::ERROR);
        }
        let r = ui.add(te).labelled_by(label);
        let r = if let Some(err) = &e.error {
            r.on_hover_text(RichText::new(err).color(theme::ERROR))
        } else {
            r.on_hover_text(format!(
                "Amount of {name}: a number, optionally with a unit (g, kg, mg, oz, lb, %)"
            ))
        };
        if r.changed() {
            // A unit typed with the number wins over the unit column.
            match parse_amount_or(&e.text, unit) {
                Ok(a) => {
                    e.error = None;
                    e.synced = Some((a.value, a.unit));
                    out.push(Command::Edit(Edit::SetAmount {
                        line: i,
                        amount: a.value,
                        unit: a.unit,
                    }));
                }
                Err(err) => e.error = Some(err.to_string()),
            }
        }
        if r.lost_focus() && e.error.is_some() {
            // Leaving a refused field restores the last good value.
            e.error = None;
            e.synced = None;
        }
    }

    fn picker(&mut self, ui: &mut egui::Ui, doc: &Document, out: &mut Vec<Command>) {
        ui.horizontal(|ui| {
            let label = ui.label("Add ingredient");
            let r = ui
                .add(
                    TextEdit::singleline(&mut self.picker_query)
                        .hint_text("type a name, synonym or category…")
                        .desired_width(260.0),
                )
                .labelled_by(label.id);
            if r.lost_focus()
                && ui.input(|i| i.key_pressed(egui::Key::Enter))
                && let Some(h) = doc.lib.search(&self.picker_query, 1).first()
            {
                out.push(add_line(h, doc));
                self.picker_query.clear();
            }
        });
        let hits = doc.lib.search(&self.picker_query, 10);
        if !self.picker_query.trim().is_empty() {
            egui::Frame::group(ui.style()).show(ui, |ui| {
                if hits.is_empty() {
                    ui.label(RichText::new("no ingredient or solute matches").color(theme::MUTED));
                }
                for h in hits {
                    let text = match &h.matched {
                        Some(m) => format!("{}   ({}; “{m}”)", h.name, h.category),
                        None => format!("{}   ({})", h.name, h.category),
                    };
                    if ui
                        .add(egui::Button::new(text).frame(false))
                        .on_hover_text(format!("add {} (id {})", h.name, h.id))
                        .clicked()
                    {
                        out.push(add_line(&h, doc));
                        self.picker_query.clear();
                    }
                }
            });
        }
    }

    fn scale_row(&mut self, ui: &mut egui::Ui, eval: Option<&Evaluation>, out: &mut Vec<Command>) {
        ui.horizontal(|ui| {
            let total = eval
                .and_then(|e| e.resolved.as_ref().ok())
                .map(|r| r.line_kg.iter().sum::<f64>() * 1000.0);
            if let Some(t) = total {
                ui.label(format!("Batch: {t:.1} g"));
            }
            ui.add_space(12.0);
            let label = ui.label("Scale batch to");
            ui.add(
                TextEdit::singleline(&mut self.scale_text)
                    .hint_text("e.g. 5 kg")
                    .desired_width(80.0),
            )
            .labelled_by(label.id);
            if ui
                .button("Scale")
                .on_hover_text("Scale every weighed line to this batch mass")
                .clicked()
            {
                match parse_amount(&self.scale_text).map(|a| a.kg()) {
                    Ok(Some(kg)) if kg > 0.0 => {
                        self.scale_error = None;
                        out.push(Command::Edit(Edit::ScaleBatch {
                            total_g: kg * 1000.0,
                        }));
                    }
                    Ok(_) => self.scale_error = Some("give a mass, e.g. 5 kg".into()),
                    Err(e) => self.scale_error = Some(e.to_string()),
                }
            }
            if let Some(e) = &self.scale_error {
                ui.label(RichText::new(e).color(theme::ERROR));
            }
        });
    }
}

fn add_line(h: &SearchHit, doc: &Document) -> Command {
    let unit = doc.project.units.amount;
    let unit = if unit == AmountUnit::Percent {
        AmountUnit::G
    } else {
        unit
    };
    Command::Edit(Edit::AddLine {
        ingredient: h.id.clone(),
        amount: if unit == AmountUnit::Kg || unit == AmountUnit::Lb {
            0.1
        } else {
            10.0
        },
        unit,
    })
}

fn unit_combo(
    ui: &mut egui::Ui,
    i: usize,
    name: &str,
    amount: f64,
    unit: AmountUnit,
    out: &mut Vec<Command>,
) {
    let mut u = unit;
    let r = egui::ComboBox::from_id_salt(("unit", i))
        .selected_text(unit.symbol())
        .width(52.0)
        .show_ui(ui, |ui| {
            for cand in AmountUnit::ALL {
                ui.selectable_value(&mut u, cand, cand.symbol());
            }
        })
        .response;
    let label = format!("Unit of {name}");
    r.widget_info(|| egui::WidgetInfo::labeled(egui::Role::ComboBox, true, &label));
    if u != unit {
        // Keep the mass when switching between mass units.
        let amount = match (unit.kg_per_unit(), u.kg_per_unit()) {
            (Some(a), Some(b)) => amount * a / b,
            _ => amount,
        };
        let amount = if u == AmountUnit::Percent {
            amount.min(99.0)
        } else {
            amount
        };
        out.push(Command::Edit(Edit::SetAmount {
            line: i,
            amount,
            unit: u,
        }));
    }
}

/// The per-line menu: reorder, duplicate, remove.
fn line_menu(ui: &mut egui::Ui, i: usize, n: usize, name: &str, out: &mut Vec<Command>) {
    let what = format!("Line tools for {name}");
    let r = ui.menu_button("…", |ui| {
        if ui
            .add_enabled(i > 0, egui::Button::new("Move up"))
            .clicked()
        {
            out.push(Command::Edit(Edit::MoveLine { from: i, to: i - 1 }));
        }
        if ui
            .add_enabled(i + 1 < n, egui::Button::new("Move down"))
            .clicked()
        {
            out.push(Command::Edit(Edit::MoveLine { from: i, to: i + 1 }));
        }
        if ui.button("Duplicate this line").clicked() {
            out.push(Command::Edit(Edit::DuplicateLine(i)));
        }
        ui.separator();
        if ui.button("Remove this line").clicked() {
            out.push(Command::Edit(Edit::RemoveLine(i)));
        }
    });
    let r = r.response.on_hover_text(&what);
    r.widget_info(|| egui::WidgetInfo::labeled(egui::Role::Button, true, &what));
}

fn share_bar(ui: &mut egui::Ui, pct: f64) {
    let (rect, resp) = ui.allocate_exact_size(egui::vec2(90.0, 14.0), egui::Sense::hover());
    let p = ui.painter();
    p.rect_filled(rect, 2.0, Color32::from_gray(228));
    let w = rect.width() * (pct.clamp(0.0, 100.0) / 100.0) as f32;
    p.rect_filled(
        egui::Rect::from_min_size(rect.min, egui::vec2(w, rect.height())),
        2.0,
        theme::ACCENT,
    );
    p.text(
        rect.right_center() - egui::vec2(3.0, 0.0),
        egui::Align2::RIGHT_CENTER,
        format!("{pct:.0} %"),
        egui::FontId::proportional(11.0),
        Color32::from_gray(30),
    );
    resp.on_hover_text(format!(
        "{pct:.1} % of the a_w lowering comes from this line"
    ));
}

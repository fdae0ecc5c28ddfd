//! Deciding between formulas: every variant's properties side by side, and
//! which ingredient of the current variant moves a_w and the freezing
//! point most per gram.

use colligo_core::properties::{self, Properties, Wanted};
use colligo_core::sweep::{Sensitivity, sensitivities};
use egui::RichText;
use egui_plot::{Bar, BarChart, Legend, Plot};

use crate::app::compute;
use crate::app::document::Document;
use crate::app::theme;

/// One variant's results.
#[derive(Debug, Clone)]
pub struct VariantRow {
    /// Variant name.
    pub name: String,
    /// Its properties, or why not.
    pub props: Result<Properties, String>,
}

/// The variant comparison, recomputed when the project changes.
#[derive(Debug, Default)]
pub struct Comparison {
    /// [`compute::project_key`] of what the rows were computed from.
    key: Option<u64>,
    /// One row per variant, in project order.
    pub rows: Vec<VariantRow>,
}

impl Comparison {
    /// The table as CSV.
    pub fn csv(&self) -> String {
        crate::csv_out::text(|w| {
            w.write_record([
                "variant",
                "water_activity",
                "erh_percent",
                "freezing_point_c",
                "ice_fraction_of_water",
                "boiling_point_c",
                "water_percent",
                "soluble_solids_percent",
                "error",
            ])?;
            let o = |v: Option<f64>| v.map_or(String::new(), |x| x.to_string());
            for r in &self.rows {
                match &r.props {
                    Ok(p) => w.write_record([
                        r.name.clone(),
                        p.water_activity.to_string(),
                        p.erh_percent.to_string(),
                        o(p.freezing_point_c),
                        o(p.ice_fraction_of_water),
                        o(p.boiling_point_c),
                        p.water_percent.to_string(),
                        p.soluble_solids_percent.to_string(),
                        String::new(),
                    ])?,
                    Err(e) => {
                        w.write_field(&r.name)?;
                        for _ in 0..7 {
                            w.write_field("")?;
                        }
                        w.write_record([e])?;
                    }
                }
            }
            Ok(())
        })
    }

    /// Recomputes when the document changed.
    pub fn refresh(&mut self, doc: &Document) {
        let key = compute::project_key(doc);
        if self.key == Some(key) {
            return;
        }
        self.key = Some(key);
        let cond = doc.project.conditions.to_conditions();
        self.rows = doc
            .project
            .variants
            .iter()
            .map(|v| VariantRow {
                name: v.name.clone(),
                props: v
                    .composition(&doc.lib)
                    .map_err(|e| e.to_string())
                    .and_then(|c| {
                        properties::evaluate(&doc.lib, &c, doc.project.model, &cond, Wanted::ALL)
                            .map_err(|e| e.to_string())
                    }),
            })
            .collect();
    }

    /// Shows the table and a chart of the variants.
    pub fn ui(&mut self, ui: &mut egui::Ui, doc: &Document) {
        self.refresh(doc);
        let active = doc.project.active_variant;
        ui.horizontal_top(|ui| {
            ui.vertical(|ui| {
                egui::Grid::new("variant-table")
                    .num_columns(8)
                    .striped(true)
                    .spacing([12.0, 3.0])
                    .show(ui, |ui| {
                        for h in [
                            "variant",
                            "a_w",
                            "ERH %",
                            "freezing °C",
                            "ice at storage",
                            "boiling °C",
                            "water %",
                            "soluble solids %",
                        ] {
                            ui.label(RichText::new(h).strong());
                        }
                        ui.end_row();
                        for (i, r) in self.rows.iter().enumerate() {
                            let name = if i == active {
                                RichText::new(&r.name).strong().color(theme::ACCENT)
                            } else {
                                RichText::new(&r.name)
                            };
                            ui.label(name);
                            match &r.props {
                                Ok(p) => {
                                    ui.label(format!("{:.4}", p.water_activity));
                                    ui.label(format!("{:.1}", p.erh_percent));
                                    ui.label(
                                        p.freezing_point_c
                                            .map_or("—".into(), |c| format!("{c:.2}")),
                                    );
                                    ui.label(
                                        p.ice_fraction_of_water.map_or("—".into(), |f| {
                                            format!("{:.1} %", 100.0 * f)
                                        }),
                                    );
                                    ui.label(
                                        p.boiling_point_c
                                            .map_or("—".into(), |c| format!("{c:.2}")),
                                    );
                                    ui.label(format!("{:.1}", p.water_percent));
                                    ui.label(format!("{:.1}", p.soluble_solids_percent));
                                }
                                Err(e) => {
                                    ui.label(RichText::new(e).color(theme::ERROR));
                                    for _ in 0..6 {
                                        ui.label("");
                                    }
                                }
                            }
                            ui.end_row();
                        }
                    });
            });
            // Bars start a little below the lowest a_w, so that the
            // differences between variants are visible.
            let lo = self
                .rows
                .iter()
                .filter_map(|r| r.props.as_ref().ok().map(|p| p.water_activity))
                .fold(1.0f64, f64::min);
            let base = ((lo - 0.02) * 50.0).floor() / 50.0;
            let bars: Vec<Bar> = self
                .rows
                .iter()
                .enumerate()
                .filter_map(|(i, r)| {
                    let p = r.props.as_ref().ok()?;
                    Some(
                        Bar::new(i as f64, p.water_activity - base)
                            .base_offset(base)
                            .name(&r.name)
                            .width(0.6)
                            .fill(if i == active {
                                theme::ACCENT
                            } else {
                                theme::SERIES[1]
                            }),
                    )
                })
                .collect();
            let names: Vec<String> = self.rows.iter().map(|r| r.name.clone()).collect();

            Plot::new("variant-bars")
                .height(ui.available_height().max(150.0))
                .width(ui.available_width().max(200.0))
                .y_axis_label("a_w")
                .include_y(base)
                .include_y(1.0)
                .legend(Legend::default())
                .x_axis_formatter(move |m, _| {
                    names
                        .get(m.value.round() as usize)
                        .filter(|_| (m.value - m.value.round()).abs() < 1e-6)
                        .cloned()
                        .unwrap_or_default()
                })
                .show(ui, |pu| pu.bar_chart(BarChart::new("a_w by variant", bars)));
        });
    }
}

/// Which ingredient matters: per-gram effects, recomputed on change.
#[derive(Debug)]
pub struct Ranking {
    /// [`compute::active_key`] of what the rows were computed from.
    key: Option<u64>,
    /// Ranked rows, strongest a_w lowering first, or why not.
    pub rows: Result<Vec<Sensitivity>, String>,
}

impl Default for Ranking {
    fn default() -> Self {
        Ranking {
            key: None,
            rows: Ok(Vec::new()),
        }
    }
}

impl Ranking {
    /// The ranking as CSV.
    pub fn csv(&self) -> String {
        crate::csv_out::text(|w| {
            w.write_record([
                "rank",
                "ingredient",
                "aw_per_g_added",
                "aw_per_g_removed",
                "fp_k_per_g_added",
                "fp_k_per_g_removed",
            ])?;
            if let Ok(rows) = &self.rows {
                for (k, r) in rows.iter().enumerate() {
                    w.write_record([
                        (k + 1).to_string(),
                        r.ingredient.clone(),
                        r.aw_per_g_added.to_string(),
                        r.aw_per_g_removed.to_string(),
                        r.fp_per_g_added.to_string(),
                        r.fp_per_g_removed.to_string(),
                    ])?;
                }
            }
            Ok(())
        })
    }

    /// Recomputes when the document changed.
    pub fn refresh(&mut self, doc: &Document) {
        let key = compute::active_key(doc);
        if self.key == Some(key) && self.rows.is_ok() {
            return;
        }
        self.key = Some(key);
        let mut ids: Vec<String> = Vec::new();
        for l in &doc.formula().lines {
            if !ids.contains(&l.ingredient) {
                ids.push(l.ingredient.clone());
            }
        }
        let cond = doc.project.conditions.to_conditions();
        self.rows = sensitivities(&doc.lib, doc.formula(), &ids, doc.project.model, &cond, 1.0)
            .map_err(|e| e.to_string());
    }

    /// Shows the ranked table.
    pub fn ui(&mut self, ui: &mut egui::Ui, doc: &Document) {
        self.refresh(doc);
        ui.label(
            RichText::new("Change of a_w and of the freezing point for one gram more or less of each ingredient, strongest first.")
                .small()
                .color(theme::MUTED),
        );
        let rows = match &self.rows {
            Ok(r) => r,
            Err(e) => {
                ui.label(RichText::new(e).color(theme::ERROR));
                return;
            }
        };
        let name = |id: &str| {
            doc.lib.ingredient(id).map_or(id.to_string(), |i| {
                doc.lib.ingredients[i].name().to_string()
            })
        };
        egui::ScrollArea::vertical()
            .id_salt("ranking")
            .show(ui, |ui| {
                egui::Grid::new("ranking-grid")
                    .num_columns(6)
                    .striped(true)
                    .spacing([14.0, 3.0])
                    .show(ui, |ui| {
                        for h in [
                            "rank",
                            "ingredient",
                            "Δa_w per g added",
                            "Δa_w per g removed",
                            "Δ freezing K per g added",
                            "Δ freezing K per g removed",
                        ] {
                            ui.label(RichText::new(h).strong());
                        }
                        ui.end_row();
                        let fmt = |v: f64| {
                            if v == 0.0 {
                                "0".into()
                            } else if v.is_finite() {
                                format!("{v:+.2e}")
                            } else {
                                "—".into()
                            }
                        };
                        for (k, r) in rows.iter().enumerate() {
                            ui.label(format!("{}", k + 1));
                            ui.label(name(&r.ingredient));
                            ui.label(RichText::new(fmt(r.aw_per_g_added)).monospace());
                            ui.label(RichText::new(fmt(r.aw_per_g_removed)).monospace());
                            ui.label(RichText::new(fmt(r.fp_per_g_added)).monospace());
                            ui.label(RichText::new(fmt(r.fp_per_g_removed)).monospace());
                            ui.end_row();
                        }
                    });
            });
    }
}

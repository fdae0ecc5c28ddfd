//! The water profile: every property of the active variant, the spread
//! between applicable models, the warnings with their reasons, and the
//! cautions.

use colligo_core::quantity::{PressureUnit, TemperatureUnit, show_value};
use egui::{RichText, Ui};

use crate::CAUTIONS;
use crate::app::commands::Command;
use crate::app::compute::Evaluation;
use crate::app::document::Document;
use crate::app::panels::{Panel, View};
use crate::app::theme;

/// The results panel (its collapsing sections keep their state in egui's
/// memory, which eframe persists).
#[derive(Debug, Default)]
pub struct ResultsPanel {}

fn t_text(c: f64, u: TemperatureUnit) -> String {
    let k = c + colligo_core::water::T_ZERO_C;
    show_value(u.from_kelvin(k), 2, false, u.symbol())
}

fn p_text(pa: f64, u: PressureUnit) -> String {
    let v = pa / u.pa_per_unit();
    let d = if v >= 100.0 {
        1
    } else if v >= 1.0 {
        3
    } else {
        4
    };
    show_value(v, d, false, u.symbol())
}

impl Panel for ResultsPanel {
    fn ui(&mut self, ui: &mut Ui, view: &View<'_>, _out: &mut Vec<Command>) {
        self.show(ui, view.doc, view.eval);
    }
}

impl ResultsPanel {
    fn show(&mut self, ui: &mut Ui, doc: &Document, eval: Option<&Evaluation>) {
        ui.heading("Water profile");
        let Some(eval) = eval else {
            ui.label("computing…");
            return;
        };
        let units = doc.project.units;
        let p = match &eval.props {
            Ok(p) => p,
            Err(e) => {
                ui.label(RichText::new(format!("No result: {e}")).color(theme::ERROR));
                return;
            }
        };
        ui.horizontal(|ui| {
            ui.label(RichText::new("a_w").size(18.0));
            ui.label(RichText::new(format!("{:.3}", p.water_activity)).size(30.0).strong().color(theme::ACCENT))
                .on_hover_text(format!("water activity {:.5}", p.water_activity));
            if let Some((lo, hi)) = eval.band {
                ui.label(RichText::new(format!("models: {lo:.3} – {hi:.3}")).color(theme::MUTED))
                    .on_hover_text("spread of the applicable models (Norrish/Pitzer, Ross, ZSR): an honest uncertainty band");
            }
        });
        ui.label(
            RichText::new(format!("model: {} — {}", p.model.title(), p.model_reason))
                .small()
                .color(theme::MUTED),
        );
        super::stability::scale_for(ui, doc, eval);
        ui.add_space(4.0);
        egui::Grid::new("props").num_columns(2).striped(true).spacing([16.0, 3.0]).show(ui, |ui| {
            let mut row = |k: &str, v: String, tip: &str| {
                ui.label(k).on_hover_text(tip);
                ui.label(RichText::new(v).monospace());
                ui.end_row();
            };
            row("ERH", format!("{:.2} %", p.erh_percent), "equilibrium relative humidity = 100 a_w");
            row(
                "Vapour pressure",
                p_text(p.vapor_pressure_pa, units.pressure),
                "partial pressure of water over the formula, a_w × p_sat (IAPWS; Murphy & Koop 2005 below 0 °C)",
            );
            row("Pure water", p_text(p.pure_water_vapor_pressure_pa, units.pressure), "saturation pressure of water at the product temperature");
            row("Relative lowering", format!("{:.4}", p.relative_lowering), "1 − a_w");
            if let Some(pv) = p.cosolvent_vapor_pressure_pa {
                row("Co-solvent vapour", p_text(pv, units.pressure), "partial pressure of the volatile co-solvent (ethanol), Wilson + Antoine");
            }
            row(
                "Freezing point",
                p.freezing_point_c.map_or("—".into(), |c| t_text(c, units.temperature)),
                "temperature where the formula is in equilibrium with ice",
            );
            row(
                &format!("Ice at {}", t_text(p.storage_temperature_c, units.temperature)),
                p.ice_fraction_of_water.map_or("—".into(), |f| format!("{:.1} % of the water", 100.0 * f)),
                "share of the water frozen at the storage temperature (freeze-concentration)",
            );
            row(
                &format!("Boiling point at {}", p_text(p.pressure_pa, units.pressure)),
                p.boiling_point_c.map_or("—".into(), |c| t_text(c, units.temperature)),
                "a_w p_sat(T) + co-solvent pressure = ambient pressure",
            );
            row("Osmolality", format!("{:.0} mOsmol/kg", p.osmolality_mosmol_per_kg), "−ln a_w / M_w");
            row("Osmotic pressure", format!("{:.2} MPa", p.osmotic_pressure_mpa), "−R T ln a_w / V_w");
            row("Water", format!("{:.2} % of {:.1} g", p.water_percent, p.total_g), "free water of all ingredients");
            row("Soluble solids", format!("{:.2} %", p.soluble_solids_percent), "dissolved solids per mass of solution (like °Brix)");
            if p.insoluble_g > 0.0 {
                row("Insoluble solids", format!("{:.2} g", p.insoluble_g), "fat, protein, starch, fibre: in the batch, not in the solution");
            }
        });
        ui.add_space(4.0);
        egui::CollapsingHeader::new("Every model")
            .default_open(true)
            .show(ui, |ui| {
                egui::Grid::new("models").num_columns(3).striped(true).show(ui, |ui| {
                    ui.label(RichText::new("model").strong());
                    ui.label(RichText::new("a_w").strong());
                    ui.label(RichText::new("freezing point").strong());
                    ui.end_row();
                    for m in &eval.comparison {
                        let name = if m.applicable { m.model.as_str().to_string() } else { format!("{} (partly ideal)", m.model.as_str()) };
                        ui.label(name).on_hover_text(m.model.title());
                        match &m.water_activity {
                            Ok(a) => ui.label(format!("{a:.4}")),
                            Err(e) => ui.label(RichText::new(e.to_string()).color(theme::ERROR)),
                        };
                        ui.label(m.freezing_point_c.map_or("—".into(), |c| t_text(c, units.temperature)));
                        ui.end_row();
                    }
                });
                ui.label(RichText::new("The band above uses the models with parameters for every solute here, not the ideal one.").small().color(theme::MUTED));
            });
        if !p.warnings.is_empty() {
            ui.add_space(4.0);
            ui.label(
                RichText::new(format!(
                    "{} warning{}",
                    p.warnings.len(),
                    if p.warnings.len() == 1 { "" } else { "s" }
                ))
                .color(theme::WARN)
                .strong(),
            );
            egui::ScrollArea::vertical()
                .id_salt("warnings")
                .max_height(170.0)
                .show(ui, |ui| {
                    for w in &p.warnings {
                        ui.label(RichText::new(format!("• {w}")).small().color(
                            if w.is_validity() {
                                theme::WARN
                            } else {
                                ui.visuals().text_color()
                            },
                        ));
                    }
                });
        }
        ui.add_space(6.0);
        ui.label(
            RichText::new(CAUTIONS)
                .small()
                .italics()
                .color(theme::MUTED),
        );
    }
}

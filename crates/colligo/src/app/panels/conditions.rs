//! Conditions: product temperature, pressure or altitude for the boiling
//! point, storage temperature for the ice fraction, and the model.

use colligo_core::library::Audience;
use colligo_core::models::ModelChoice;
use colligo_core::quantity::{
    PressureUnit, TemperatureUnit, parse_pressure, parse_temperature, show_value,
};
use egui::{RichText, TextEdit};

use crate::app::commands::{Command, Edit};
use crate::app::compute::Evaluation;
use crate::app::document::Document;
use crate::app::panels::{Panel, View};
use crate::app::theme;

/// One typed quantity field.
#[derive(Debug, Default)]
struct Field {
    text: String,
    error: Option<String>,
    synced: Option<u64>,
}

impl Field {
    /// Keeps the text in step with the document unless an error is showing.
    fn sync(&mut self, shown: String) {
        let h = {
            use std::hash::{Hash, Hasher};
            let mut s = std::collections::hash_map::DefaultHasher::new();
            shown.hash(&mut s);
            s.finish()
        };
        if self.synced != Some(h) && self.error.is_none() {
            self.text = shown;
            self.synced = Some(h);
        }
    }
}

/// The conditions panel.
#[derive(Debug, Default)]
pub struct ConditionsPanel {
    temperature: Field,
    pressure: Field,
    storage: Field,
}

fn show_temperature(k: f64, u: TemperatureUnit) -> String {
    show_value(u.from_kelvin(k), 2, true, u.symbol())
}

fn show_pressure(pa: f64, u: PressureUnit) -> String {
    show_value(pa / u.pa_per_unit(), 3, true, u.symbol())
}

impl Panel for ConditionsPanel {
    fn ui(&mut self, ui: &mut egui::Ui, view: &View<'_>, out: &mut Vec<Command>) {
        self.show(ui, view.doc, view.eval, out);
    }
}

impl ConditionsPanel {
    fn show(
        &mut self,
        ui: &mut egui::Ui,
        doc: &Document,
        eval: Option<&Evaluation>,
        out: &mut Vec<Command>,
    ) {
        let c = doc.project.conditions.to_conditions();
        let units = doc.project.units;
        self.temperature
            .sync(show_temperature(c.temperature_k, units.temperature));
        self.storage
            .sync(show_temperature(c.storage_temperature_k, units.temperature));
        self.pressure
            .sync(show_pressure(c.pressure_pa, units.pressure));
        egui::Grid::new("conditions")
            .num_columns(3)
            .spacing([8.0, 4.0])
            .show(ui, |ui| {
                quantity_row(
                    ui,
                    "Product temperature",
                    &mut self.temperature,
                    "e.g. 25 °C, 77 °F, 298 K",
                    |t| {
                        parse_temperature(t)
                            .map(|v| Command::Edit(Edit::SetTemperature(v)))
                            .map_err(|e| e.to_string())
                    },
                    out,
                );
                ui.end_row();
                quantity_row(
                    ui,
                    "Pressure or altitude",
                    &mut self.pressure,
                    "e.g. 101.325 kPa, 1 atm, 1600 m",
                    |t| {
                        parse_pressure(t)
                            .map(|v| Command::Edit(Edit::SetPressure(v)))
                            .map_err(|e| e.to_string())
                    },
                    out,
                );
                ui.end_row();
                quantity_row(
                    ui,
                    "Storage temperature",
                    &mut self.storage,
                    "for the ice fraction, e.g. -18 °C",
                    |t| {
                        parse_temperature(t)
                            .map(|v| Command::Edit(Edit::SetStorage(v)))
                            .map_err(|e| e.to_string())
                    },
                    out,
                );
                ui.end_row();
                let l = ui.label("Model");
                let mut m = doc.project.model;
                egui::ComboBox::from_id_salt("model")
                    .selected_text(m.title())
                    .width(250.0)
                    .show_ui(ui, |ui| {
                        for cand in ModelChoice::ALL {
                            ui.selectable_value(&mut m, cand, cand.title());
                        }
                    })
                    .response
                    .labelled_by(l.id);
                if m != doc.project.model {
                    out.push(Command::Edit(Edit::SetModel(m)));
                }
                ui.end_row();
                ui.label("");
                if doc.project.model == ModelChoice::Auto {
                    // What the last evaluation resolved `auto` to.
                    let why = eval
                        .and_then(|e| e.props.as_ref().ok())
                        .map(|p| format!("auto uses {}: {}", p.model, p.model_reason))
                        .unwrap_or_default();
                    ui.label(RichText::new(why).small().color(theme::MUTED));
                }
                ui.end_row();
            });
        ui.horizontal(|ui| {
            ui.label("Units");
            let mut tu = units.temperature;
            egui::ComboBox::from_id_salt("t-unit")
                .selected_text(tu.symbol())
                .width(50.0)
                .show_ui(ui, |ui| {
                    for u in TemperatureUnit::ALL {
                        ui.selectable_value(&mut tu, u, u.symbol());
                    }
                })
                .response
                .on_hover_text("Temperature unit");
            if tu != units.temperature {
                out.push(Command::Edit(Edit::SetTemperatureUnit(tu)));
            }
            let mut pu = units.pressure;
            egui::ComboBox::from_id_salt("p-unit")
                .selected_text(pu.symbol())
                .width(60.0)
                .show_ui(ui, |ui| {
                    for u in PressureUnit::ALL {
                        ui.selectable_value(&mut pu, u, u.symbol());
                    }
                })
                .response
                .on_hover_text("Pressure unit");
            if pu != units.pressure {
                out.push(Command::Edit(Edit::SetPressureUnit(pu)));
            }
            ui.add_space(10.0);
            let mut p = doc.project.product;
            ui.selectable_value(&mut p, Audience::Food, "Food");
            ui.selectable_value(&mut p, Audience::Cosmetic, "Cosmetic");
            if p != doc.project.product {
                out.push(Command::Edit(Edit::SetProduct(p)));
            }
        });
    }
}

fn quantity_row(
    ui: &mut egui::Ui,
    label: &str,
    f: &mut Field,
    hint: &str,
    parse: impl Fn(&str) -> Result<Command, String>,
    out: &mut Vec<Command>,
) {
    let l = ui.label(label);
    let mut te = TextEdit::singleline(&mut f.text)
        .desired_width(140.0)
        .hint_text(hint);
    if f.error.is_some() {
        te = te.text_color(theme::ERROR);
    }
    let r = ui.add(te).labelled_by(l.id);
    // Apply on Enter or when leaving the field; a bad value is refused.
    let commit = r.lost_focus();
    if commit {
        match parse(&f.text) {
            Ok(cmd) => {
                f.error = None;
                f.synced = None;
                out.push(cmd);
            }
            Err(e) => f.error = Some(e),
        }
    } else if r.changed() {
        f.error = None;
    }
    match &f.error {
        Some(e) => {
            ui.label(RichText::new(e).small().color(theme::ERROR));
        }
        None => {
            ui.label("");
        }
    }
}

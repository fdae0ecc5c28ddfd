//! Solving for a target: the amount of one ingredient that brings a_w, ERH,
//! the freezing point or the ice fraction at storage temperature to a
//! value. The answer is shown before it is applied.

use colligo_core::goal::{GoalError, Target, goal_seek};
use colligo_core::library::WATER_ID;
use colligo_core::quantity::{AmountUnit, parse_number, trim_float};
use colligo_core::water::T_ZERO_C;
use egui::{RichText, TextEdit};

use crate::app::commands::{Action, Command, Edit};
use crate::app::compute;
use crate::app::document::Document;
use crate::app::panels::{Panel, View};
use crate::app::theme;

/// The property a goal aims at.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum TargetKind {
    /// Water activity.
    #[default]
    WaterActivity,
    /// ERH, %.
    Erh,
    /// Freezing point, °C.
    FreezingPoint,
    /// Ice fraction of the water at the storage temperature.
    IceFraction,
}

impl TargetKind {
    /// All kinds.
    pub const ALL: [TargetKind; 4] = [
        TargetKind::WaterActivity,
        TargetKind::Erh,
        TargetKind::FreezingPoint,
        TargetKind::IceFraction,
    ];

    /// Label.
    pub fn label(self) -> &'static str {
        match self {
            TargetKind::WaterActivity => "water activity a_w",
            TargetKind::Erh => "ERH, %",
            TargetKind::FreezingPoint => "freezing point, °C",
            TargetKind::IceFraction => "ice fraction at storage temperature (0–1)",
        }
    }
}

/// A found amount, waiting to be applied.
#[derive(Debug, Clone, PartialEq)]
pub struct Answer {
    /// Ingredient id.
    pub ingredient: String,
    /// Amount found, g.
    pub amount_g: f64,
    /// Amount now in the formula, g.
    pub current_g: f64,
    /// a_w there.
    pub water_activity: f64,
    /// Freezing point there, °C.
    pub freezing_point_c: Option<f64>,
    /// Ice fraction at storage there.
    pub ice_fraction: Option<f64>,
    /// Warnings there (solubility etc.).
    pub warnings: Vec<String>,
}

/// What the last "Find amount" gave, and for which inputs.
#[derive(Debug, Clone, PartialEq)]
pub struct Solved {
    /// [`compute::active_key`] of the document when it was found: the
    /// formula, conditions, model and library it holds for.
    pub inputs: u64,
    /// The answer, or why there is none.
    pub outcome: Result<Answer, String>,
}

/// The goal-seek dialog. Its state belongs to one document: the app
/// replaces it with a fresh one whenever the document is replaced.
#[derive(Debug, Default)]
pub struct GoalDialog {
    /// Whether the dialog is open.
    pub open: bool,
    /// Ingredient varied.
    pub ingredient: String,
    /// Property aimed at.
    pub kind: TargetKind,
    /// Target value as typed.
    pub value: String,
    /// The last answer or why there is none. It is shown, and can be
    /// applied, only while the document still has the inputs it was found
    /// for.
    pub result: Option<Solved>,
}

impl Panel for GoalDialog {
    fn ui(&mut self, ui: &mut egui::Ui, view: &View<'_>, out: &mut Vec<Command>) {
        self.show(&ui.ctx().clone(), view.doc, out);
    }
}

impl GoalDialog {
    /// Opens the dialog with sensible defaults for the formula.
    pub fn open_for(&mut self, doc: &Document) {
        self.open = true;
        if !doc
            .formula()
            .lines
            .iter()
            .any(|l| l.ingredient == self.ingredient)
        {
            self.ingredient = doc
                .formula()
                .lines
                .iter()
                .find(|l| l.ingredient != WATER_ID)
                .map(|l| l.ingredient.clone())
                .unwrap_or_default();
        }
        if self.value.is_empty() {
            self.value = "0.85".into();
        }
        self.result = None;
    }

    /// Computes the amount for the current settings.
    pub fn solve(&mut self, doc: &Document) {
        self.result = Some(Solved {
            inputs: compute::active_key(doc),
            outcome: self.compute(doc),
        });
    }

    /// The last result if it was found for the document as it is now.
    pub fn current_result(&self, doc: &Document) -> Option<&Result<Answer, String>> {
        self.result
            .as_ref()
            .filter(|s| s.inputs == compute::active_key(doc))
            .map(|s| &s.outcome)
    }

    fn target(&self, doc: &Document) -> Result<Target, String> {
        let v = parse_number(&self.value)
            .ok_or_else(|| format!("`{}` is not a number", self.value.trim()))?;
        let t = match self.kind {
            TargetKind::WaterActivity => Target::WaterActivity(v),
            TargetKind::Erh => Target::ErhPercent(v),
            TargetKind::FreezingPoint => Target::FreezingPointC(v),
            TargetKind::IceFraction => Target::IceFraction {
                fraction: v,
                storage_k: doc.project.conditions.storage_temperature_c + T_ZERO_C,
            },
        };
        // Let the core's own check speak for impossible values.
        t.check().map_err(|e| e.to_string())?;
        Ok(t)
    }

    fn compute(&self, doc: &Document) -> Result<Answer, String> {
        if self.ingredient.is_empty() {
            return Err("choose the ingredient to vary".into());
        }
        let target = self.target(doc)?;
        let cond = doc.project.conditions.to_conditions();
        let current_g = doc
            .formula()
            .resolve(&doc.lib)
            .map_or(0.0, |r| r.kg_of(doc.formula(), &self.ingredient) * 1000.0);
        match goal_seek(
            &doc.lib,
            doc.formula(),
            &self.ingredient,
            target,
            doc.project.model,
            &cond,
        ) {
            Ok(r) => Ok(Answer {
                ingredient: self.ingredient.clone(),
                amount_g: r.amount_kg * 1000.0,
                current_g,
                water_activity: r.properties.water_activity,
                freezing_point_c: r.properties.freezing_point_c,
                ice_fraction: r.properties.ice_fraction_of_water,
                warnings: r
                    .properties
                    .warnings
                    .iter()
                    .map(ToString::to_string)
                    .collect(),
            }),
            Err(GoalError::Unreachable { reason, .. }) => Err(format!(
                "This target cannot be reached by changing this ingredient: {reason}."
            )),
            Err(e) => Err(e.to_string()),
        }
    }

    /// The command that applies an answer to the formula.
    pub fn apply_command(doc: &Document, a: &Answer) -> Command {
        match doc
            .formula()
            .lines
            .iter()
            .position(|l| l.ingredient == a.ingredient)
        {
            Some(i) => {
                let unit = doc.formula().lines[i].unit;
                let (amount, unit) = match unit.kg_per_unit() {
                    Some(k) => (a.amount_g / 1000.0 / k, unit),
                    None => (a.amount_g, AmountUnit::G),
                };
                Command::Edit(Edit::SetAmount {
                    line: i,
                    amount,
                    unit,
                })
            }
            None => Command::Edit(Edit::AddLine {
                ingredient: a.ingredient.clone(),
                amount: a.amount_g,
                unit: AmountUnit::G,
            }),
        }
    }

    fn show(&mut self, ctx: &egui::Context, doc: &Document, out: &mut Vec<Command>) {
        if !self.open {
            return;
        }
        let mut open = true;
        egui::Window::new("Solve for a target")
            .open(&mut open)
            .resizable(false)
            .collapsible(false)
            .default_width(430.0)
            .show(ctx, |ui| {
                let name = |id: &str| {
                    doc.lib.ingredient(id).map_or(id.to_string(), |i| {
                        doc.lib.ingredients[i].name().to_string()
                    })
                };
                egui::Grid::new("goal-grid")
                    .num_columns(2)
                    .spacing([8.0, 6.0])
                    .show(ui, |ui| {
                        let l = ui.label("Vary");
                        let before = self.ingredient.clone();
                        egui::ComboBox::from_id_salt("goal-ingredient")
                            .selected_text(name(&self.ingredient))
                            .width(260.0)
                            .show_ui(ui, |ui| {
                                let mut seen = Vec::new();
                                for line in &doc.formula().lines {
                                    if !seen.contains(&line.ingredient) {
                                        ui.selectable_value(
                                            &mut self.ingredient,
                                            line.ingredient.clone(),
                                            name(&line.ingredient),
                                        );
                                        seen.push(line.ingredient.clone());
                                    }
                                }
                            })
                            .response
                            .labelled_by(l.id);
                        ui.end_row();
                        let l = ui.label("so that");
                        let kind_before = self.kind;
                        egui::ComboBox::from_id_salt("goal-kind")
                            .selected_text(self.kind.label())
                            .width(260.0)
                            .show_ui(ui, |ui| {
                                for k in TargetKind::ALL {
                                    ui.selectable_value(&mut self.kind, k, k.label());
                                }
                            })
                            .response
                            .labelled_by(l.id);
                        ui.end_row();
                        let l = ui.label("reaches");
                        let r = ui
                            .add(TextEdit::singleline(&mut self.value).desired_width(100.0))
                            .labelled_by(l.id);
                        if r.changed() || self.ingredient != before || self.kind != kind_before {
                            self.result = None;
                        }
                        ui.end_row();
                    });
                if self.kind == TargetKind::IceFraction {
                    ui.label(
                        RichText::new(format!(
                            "at the storage temperature, {:.1} °C",
                            doc.project.conditions.storage_temperature_c
                        ))
                        .small()
                        .color(theme::MUTED),
                    );
                }
                ui.horizontal(|ui| {
                    let find = Action::FindAmount;
                    if ui
                        .button(find.label())
                        .on_hover_text(find.tooltip())
                        .clicked()
                    {
                        // The app writes unsaved work first, then solves.
                        out.push(find.into());
                    }
                });
                let stale = self.result.is_some() && self.current_result(doc).is_none();
                if stale {
                    ui.label(
                        RichText::new(
                            "The formula or the conditions changed since the last answer: find it again.",
                        )
                        .color(theme::WARN),
                    );
                }
                let mut close = false;
                match self.current_result(doc) {
                    None => {}
                    Some(Err(e)) => {
                        ui.label(RichText::new(e).color(theme::ERROR));
                    }
                    Some(Ok(a)) => {
                        ui.separator();
                        ui.label(
                            RichText::new(format!(
                                "{}: {} g (now {} g)",
                                name(&a.ingredient),
                                trim_float((a.amount_g * 100.0).round() / 100.0),
                                trim_float((a.current_g * 100.0).round() / 100.0)
                            ))
                            .strong(),
                        );
                        ui.label(format!(
                            "gives a_w {:.4}, freezing point {}, ice at storage {}",
                            a.water_activity,
                            a.freezing_point_c
                                .map_or("—".into(), |c| format!("{c:.2} °C")),
                            a.ice_fraction
                                .map_or("—".into(), |f| format!("{:.1} %", 100.0 * f))
                        ));
                        for w in &a.warnings {
                            ui.label(RichText::new(format!("- {w}")).small().color(theme::WARN));
                        }
                        ui.horizontal(|ui| {
                            if ui.button("Apply to the formula").clicked() {
                                out.push(Self::apply_command(doc, a));
                                close = true;
                            }
                            if ui.button("Close").clicked() {
                                close = true;
                            }
                        });
                    }
                }
                if close {
                    self.open = false;
                }
                ui.label(
                    RichText::new(
                        "A solved amount is a prediction: make the batch and measure its a_w.",
                    )
                    .small()
                    .italics()
                    .color(theme::MUTED),
                );
            });
        if !open {
            self.open = false;
        }
    }
}

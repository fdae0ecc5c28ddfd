//! The user's own solutes and ingredients: define, list, remove, and carry
//! them between projects through a user library file.

use colligo_core::correlations::TempFn;
use colligo_core::library::{
    Cite, Confidence, IngredientCategory, IngredientRecord, IngredientSolute, InsolubleRecord,
    IonCount, NorrishRecord, SoluteCategory, SoluteKind, SoluteRecord,
};
use colligo_core::quantity::{parse_number, slug};
use egui::{RichText, TextEdit};

use crate::app::commands::{Action, Command, Edit};
use crate::app::document::Document;
use crate::app::panels::{Panel, View};
use crate::app::theme;

/// A draft solute.
#[derive(Debug, Clone)]
pub struct SoluteDraft {
    /// Display name.
    pub name: String,
    /// Molar mass as typed, g/mol.
    pub molar_mass: String,
    /// Dissociates into ions.
    pub electrolyte: bool,
    /// Cation id and count.
    pub cation: (String, u32),
    /// Anion id and count.
    pub anion: (String, u32),
    /// Norrish K as typed (empty: ideal).
    pub norrish_k: String,
    /// Where the numbers come from.
    pub source: String,
}

impl Default for SoluteDraft {
    fn default() -> Self {
        SoluteDraft {
            name: String::new(),
            molar_mass: String::new(),
            electrolyte: false,
            cation: ("Na+".into(), 1),
            anion: ("Cl-".into(), 1),
            norrish_k: String::new(),
            source: String::new(),
        }
    }
}

/// A draft ingredient.
#[derive(Debug, Clone, Default)]
pub struct IngredientDraft {
    /// Display name.
    pub name: String,
    /// Water, g/100 g, as typed.
    pub water: String,
    /// Solutes: (solute id, g/100 g as typed).
    pub solutes: Vec<(String, String)>,
    /// Fat, protein, starch, fibre, g/100 g as typed.
    pub insoluble: [String; 4],
    /// Where the composition comes from.
    pub source: String,
}

/// The library window.
#[derive(Debug, Default)]
pub struct LibraryWindow {
    /// Whether it is open.
    pub open: bool,
    /// Solute being drafted.
    pub solute: SoluteDraft,
    /// Ingredient being drafted.
    pub ingredient: IngredientDraft,
    /// The last problem with a draft.
    pub error: Option<String>,
}

/// A snake_case id from a display name, usable as a library id.
pub fn id_from_name(name: &str) -> String {
    let s = slug(name);
    if s.is_empty() {
        "my_item".into()
    } else if s.starts_with(|c: char| c.is_ascii_digit()) {
        format!("my_{s}")
    } else {
        s
    }
}

fn user_cite(text: &str) -> Cite {
    Cite {
        key: "user".into(),
        at: None,
        tag: Confidence::User,
        note: (!text.trim().is_empty()).then(|| text.trim().to_string()),
    }
}

fn num(text: &str, what: &str) -> Result<f64, String> {
    if text.trim().is_empty() {
        return Ok(0.0);
    }
    let v =
        parse_number(text).ok_or_else(|| format!("{what}: `{}` is not a number", text.trim()))?;
    if !v.is_finite() || v < 0.0 {
        return Err(format!("{what} must be a number ≥ 0"));
    }
    Ok(v)
}

impl SoluteDraft {
    /// The record this draft describes.
    ///
    /// # Errors
    /// Missing name, bad molar mass or K.
    pub fn record(&self) -> Result<SoluteRecord, String> {
        if self.name.trim().is_empty() {
            return Err("give the solute a name".into());
        }
        let m = num(&self.molar_mass, "molar mass")?;
        if m <= 1.0 {
            return Err("give the molar mass in g/mol".into());
        }
        let kind = if self.electrolyte {
            SoluteKind::Electrolyte {
                ions: vec![
                    IonCount {
                        ion: self.cation.0.clone(),
                        count: self.cation.1.max(1),
                    },
                    IonCount {
                        ion: self.anion.0.clone(),
                        count: self.anion.1.max(1),
                    },
                ],
            }
        } else {
            SoluteKind::NonElectrolyte
        };
        let norrish = if self.norrish_k.trim().is_empty() || self.electrolyte {
            None
        } else {
            let k = parse_number(&self.norrish_k)
                .ok_or_else(|| format!("Norrish K: `{}` is not a number", self.norrish_k.trim()))?;
            if !k.is_finite() {
                return Err("Norrish K must be finite".into());
            }
            Some(NorrishRecord {
                k: TempFn::Constant(k),
                max_mole_fraction: 0.1,
                t_range_c: (0.0, 40.0),
                source: user_cite(&self.source),
            })
        };
        Ok(SoluteRecord {
            id: id_from_name(&self.name),
            name: self.name.trim().to_string(),
            synonyms: vec![],
            category: if self.electrolyte {
                SoluteCategory::Salt
            } else {
                SoluteCategory::Sugar
            },
            formula: None,
            molar_mass_g_per_mol: m,
            molar_mass_source: user_cite(&self.source),
            kind,
            norrish,
            solubility: None,
            notes: Some("defined by the user".into()),
        })
    }
}

impl IngredientDraft {
    /// The record this draft describes.
    ///
    /// # Errors
    /// Missing name, bad numbers, a composition that does not add to 100 g.
    pub fn record(&self) -> Result<IngredientRecord, String> {
        if self.name.trim().is_empty() {
            return Err("give the ingredient a name".into());
        }
        let water = num(&self.water, "water")?;
        let mut solutes = Vec::new();
        let mut total = water;
        for (id, g) in &self.solutes {
            if id.trim().is_empty() {
                continue;
            }
            let g = num(g, id)?;
            total += g;
            solutes.push(IngredientSolute {
                solute: id.trim().to_string(),
                g_per_100g: g,
                molar_mass_g_per_mol: None,
            });
        }
        let ins =
            [0, 1, 2, 3].map(|k| num(&self.insoluble[k], ["fat", "protein", "starch", "fibre"][k]));
        let mut v = [0.0; 4];
        for (k, r) in ins.into_iter().enumerate() {
            v[k] = r?;
            total += v[k];
        }
        if (total - 100.0).abs() > 0.5 {
            return Err(format!(
                "the composition adds up to {total:.2} g per 100 g; make it 100"
            ));
        }
        Ok(IngredientRecord {
            id: id_from_name(&self.name),
            name: self.name.trim().to_string(),
            synonyms: vec![],
            category: IngredientCategory::Other,
            water_g_per_100g: water,
            solutes,
            insoluble: InsolubleRecord {
                fat: v[0],
                protein: v[1],
                starch: v[2],
                fibre: v[3],
                other: 0.0,
            },
            source: user_cite(&self.source),
            notes: Some("defined by the user".into()),
        })
    }
}

impl Panel for LibraryWindow {
    fn ui(&mut self, ui: &mut egui::Ui, view: &View<'_>, out: &mut Vec<Command>) {
        self.show(&ui.ctx().clone(), view.doc, out);
    }
}

impl LibraryWindow {
    fn show(&mut self, ctx: &egui::Context, doc: &Document, out: &mut Vec<Command>) {
        if !self.open {
            return;
        }
        let mut open = true;
        egui::Window::new("My ingredients and solutes")
            .open(&mut open)
            .default_width(560.0)
            .show(ctx, |ui| {
                ui.horizontal(|ui| {
                    if ui
                        .button("Export…")
                        .on_hover_text("Save these records to a library file")
                        .clicked()
                    {
                        out.push(Action::ExportUserLibrary.into());
                    }
                    if ui
                        .button("Import…")
                        .on_hover_text("Add records from a library file")
                        .clicked()
                    {
                        out.push(Action::ImportUserLibrary.into());
                    }
                });
                let p = &doc.project;
                if p.user_solutes.is_empty() && p.user_ingredients.is_empty() {
                    ui.label(
                        RichText::new("None yet. They are stored in this project file.")
                            .color(theme::MUTED),
                    );
                }
                for s in &p.user_solutes {
                    ui.horizontal(|ui| {
                        ui.label(format!(
                            "solute {} ({}), {} g/mol",
                            s.name, s.id, s.molar_mass_g_per_mol
                        ));
                        if ui
                            .small_button("delete")
                            .on_hover_text(format!("Delete {}", s.name))
                            .clicked()
                        {
                            out.push(Command::Edit(Edit::RemoveUserRecord(s.id.clone())));
                        }
                    });
                }
                for i in &p.user_ingredients {
                    ui.horizontal(|ui| {
                        ui.label(format!(
                            "ingredient {} ({}), water {} %",
                            i.name, i.id, i.water_g_per_100g
                        ));
                        if ui
                            .small_button("delete")
                            .on_hover_text(format!("Delete {}", i.name))
                            .clicked()
                        {
                            out.push(Command::Edit(Edit::RemoveUserRecord(i.id.clone())));
                        }
                    });
                }
                ui.separator();
                self.solute_form(ui, doc, out);
                ui.separator();
                self.ingredient_form(ui, out);
                if let Some(e) = &self.error {
                    ui.label(RichText::new(e).color(theme::ERROR));
                }
            });
        if !open {
            self.open = false;
        }
    }

    fn solute_form(&mut self, ui: &mut egui::Ui, doc: &Document, out: &mut Vec<Command>) {
        ui.label(RichText::new("New solute").strong());
        let d = &mut self.solute;
        egui::Grid::new("solute-form")
            .num_columns(2)
            .show(ui, |ui| {
                let l = ui.label("Solute name");
                ui.add(TextEdit::singleline(&mut d.name).desired_width(220.0))
                    .labelled_by(l.id);
                ui.end_row();
                let l = ui.label("Molar mass, g/mol");
                ui.add(TextEdit::singleline(&mut d.molar_mass).desired_width(100.0))
                    .labelled_by(l.id);
                ui.end_row();
                ui.label("Kind");
                ui.horizontal(|ui| {
                    ui.selectable_value(&mut d.electrolyte, false, "non-electrolyte");
                    ui.selectable_value(&mut d.electrolyte, true, "electrolyte");
                });
                ui.end_row();
                if d.electrolyte {
                    ui.label("Ions per formula unit");
                    ui.horizontal(|ui| {
                        ion_combo(ui, "cation", &mut d.cation, doc, true);
                        ion_combo(ui, "anion", &mut d.anion, doc, false);
                    });
                    ui.end_row();
                } else {
                    let l = ui.label("Norrish K (empty: ideal)");
                    ui.add(TextEdit::singleline(&mut d.norrish_k).desired_width(100.0))
                        .labelled_by(l.id);
                    ui.end_row();
                }
                let l = ui.label("Solute source");
                ui.add(
                    TextEdit::singleline(&mut d.source)
                        .hint_text("paper, supplier sheet…")
                        .desired_width(260.0),
                )
                .labelled_by(l.id);
                ui.end_row();
            });
        if ui
            .button("Save solute")
            .on_hover_text("Add it to this project (replaces one with the same id)")
            .clicked()
        {
            match self.solute.record() {
                Ok(r) => {
                    out.push(Command::Edit(Edit::PutUserSolute(Box::new(r))));
                    self.error = None;
                    self.solute = SoluteDraft::default();
                }
                Err(e) => self.error = Some(e),
            }
        }
    }

    fn ingredient_form(&mut self, ui: &mut egui::Ui, out: &mut Vec<Command>) {
        ui.label(RichText::new("New ingredient").strong());
        let d = &mut self.ingredient;
        egui::Grid::new("ingredient-form")
            .num_columns(2)
            .show(ui, |ui| {
                let l = ui.label("Ingredient name");
                ui.add(TextEdit::singleline(&mut d.name).desired_width(220.0))
                    .labelled_by(l.id);
                ui.end_row();
                let l = ui.label("Water, g per 100 g");
                ui.add(TextEdit::singleline(&mut d.water).desired_width(80.0))
                    .labelled_by(l.id);
                ui.end_row();
                let mut remove = None;
                for (k, (id, g)) in d.solutes.iter_mut().enumerate() {
                    let l = ui.label(format!("Solute {} id", k + 1));
                    ui.horizontal(|ui| {
                        ui.add(TextEdit::singleline(id).desired_width(160.0))
                            .labelled_by(l.id);
                        let l2 = ui.label(format!("g per 100 g of solute {}", k + 1));
                        ui.add(TextEdit::singleline(g).desired_width(70.0))
                            .labelled_by(l2.id);
                        if ui
                            .small_button("x")
                            .on_hover_text("remove this solute")
                            .clicked()
                        {
                            remove = Some(k);
                        }
                    });
                    ui.end_row();
                }
                if let Some(k) = remove {
                    d.solutes.remove(k);
                }
                for (k, what) in ["Fat", "Protein", "Starch", "Fibre"].iter().enumerate() {
                    let l = ui.label(format!("{what}, g per 100 g"));
                    ui.add(TextEdit::singleline(&mut d.insoluble[k]).desired_width(80.0))
                        .labelled_by(l.id);
                    ui.end_row();
                }
                let l = ui.label("Ingredient source");
                ui.add(
                    TextEdit::singleline(&mut d.source)
                        .hint_text("specification, label, analysis…")
                        .desired_width(260.0),
                )
                .labelled_by(l.id);
                ui.end_row();
            });
        ui.horizontal(|ui| {
            if ui.button("Add a solute to it").clicked() {
                self.ingredient.solutes.push((String::new(), String::new()));
            }
            if ui
                .button("Save ingredient")
                .on_hover_text("Add it to this project (replaces one with the same id)")
                .clicked()
            {
                match self.ingredient.record() {
                    Ok(r) => {
                        out.push(Command::Edit(Edit::PutUserIngredient(Box::new(r))));
                        self.error = None;
                        self.ingredient = IngredientDraft::default();
                    }
                    Err(e) => self.error = Some(e),
                }
            }
        });
    }
}

fn ion_combo(ui: &mut egui::Ui, salt: &str, v: &mut (String, u32), doc: &Document, positive: bool) {
    let l = ui.label(format!("{salt} count"));
    ui.add(egui::DragValue::new(&mut v.1).range(1..=4))
        .labelled_by(l.id);
    egui::ComboBox::from_id_salt(("ion", salt))
        .selected_text(v.0.clone())
        .show_ui(ui, |ui| {
            for ion in doc.lib.ions.iter().filter(|i| (i.z > 0.0) == positive) {
                ui.selectable_value(&mut v.0, ion.record.id.clone(), &ion.record.id);
            }
        })
        .response
        .widget_info(|| {
            egui::WidgetInfo::labeled(egui::Role::ComboBox, true, format!("{salt} ion"))
        });
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ids_from_names() {
        assert_eq!(
            id_from_name("Honey, wildflower (supplier X)"),
            "honey_wildflower_supplier_x"
        );
        assert_eq!(id_from_name("70 % syrup"), "my_70_syrup");
        assert_eq!(id_from_name("!!!"), "my_item");
    }

    #[test]
    fn drafts_make_records() {
        let s = SoluteDraft {
            name: "Tagatose".into(),
            molar_mass: "180.16".into(),
            norrish_k: "2.0".into(),
            ..SoluteDraft::default()
        };
        let r = s.record().unwrap_or_else(|e| panic!("{e}"));
        assert_eq!(r.id, "tagatose");
        assert!(r.norrish.is_some());
        let i = IngredientDraft {
            name: "Syrup".into(),
            water: "30".into(),
            solutes: vec![("sucrose".into(), "70".into())],
            ..IngredientDraft::default()
        };
        assert!(i.record().is_ok());
        let bad = IngredientDraft {
            water: "50".into(),
            ..i
        };
        assert!(bad.record().is_err(), "must add up to 100");
    }
}

//! Every change a user makes goes through a [`Command`]: panels emit them,
//! and one `match` applies them at the end of the frame. A command is
//! either an [`Edit`] of the document (applied by [`apply_edit`], undoable)
//! or an [`Action`] on the window (files, undo, tools; in `actions.rs`, with
//! their menu texts and shortcuts).

use colligo_core::formula::{Formula, Line};
use colligo_core::library::{Audience, IngredientRecord, SoluteRecord, WATER_ID};
use colligo_core::models::ModelChoice;
use colligo_core::properties::Limits;
use colligo_core::quantity::{AmountUnit, PressureUnit, TemperatureUnit};

pub use super::actions::Action;
use super::document::Document;

/// Anything a user asks for.
#[derive(Debug, Clone, PartialEq)]
pub enum Command {
    /// Change the document.
    Edit(Edit),
    /// Act on the window (files, undo, tools).
    Action(Action),
}

impl From<Edit> for Command {
    fn from(e: Edit) -> Self {
        Command::Edit(e)
    }
}

impl From<Action> for Command {
    fn from(a: Action) -> Self {
        Command::Action(a)
    }
}

/// A change to the document.
#[derive(Debug, Clone, PartialEq)]
pub enum Edit {
    /// Add an ingredient line.
    AddLine {
        /// Ingredient id.
        ingredient: String,
        /// Amount.
        amount: f64,
        /// Unit.
        unit: AmountUnit,
    },
    /// Remove a line.
    RemoveLine(usize),
    /// Move a line up or down.
    MoveLine {
        /// From index.
        from: usize,
        /// To index.
        to: usize,
    },
    /// Duplicate a line below itself.
    DuplicateLine(usize),
    /// Set a line's amount and unit.
    SetAmount {
        /// Line index.
        line: usize,
        /// Amount.
        amount: f64,
        /// Unit.
        unit: AmountUnit,
    },
    /// Scale every weighed line so the batch has this mass.
    ScaleBatch {
        /// Target batch mass, g.
        total_g: f64,
    },
    /// Product temperature, K.
    SetTemperature(f64),
    /// Ambient pressure, Pa.
    SetPressure(f64),
    /// Storage temperature, K.
    SetStorage(f64),
    /// Water-activity model.
    SetModel(ModelChoice),
    /// Food or cosmetic.
    SetProduct(Audience),
    /// Temperature display unit.
    SetTemperatureUnit(TemperatureUnit),
    /// Pressure display unit.
    SetPressureUnit(PressureUnit),
    /// Project name.
    SetProjectName(String),
    /// Project notes.
    SetProjectNotes(String),
    /// Show this variant.
    SelectVariant(usize),
    /// Add an empty variant.
    NewVariant,
    /// Copy a variant.
    DuplicateVariant(usize),
    /// Rename a variant.
    RenameVariant {
        /// Index.
        index: usize,
        /// New name.
        name: String,
    },
    /// Delete a variant.
    DeleteVariant(usize),
    /// Notes of the active variant.
    SetVariantNotes(String),
    /// Add (or replace, by id) a user-defined solute.
    PutUserSolute(Box<SoluteRecord>),
    /// Add (or replace, by id) a user-defined ingredient.
    PutUserIngredient(Box<IngredientRecord>),
    /// Remove a user-defined solute or ingredient by id.
    RemoveUserRecord(String),
    /// Add (or replace, by id) the records of a user library file.
    ImportUserRecords(Box<colligo_core::userlib::UserLibrary>),
}

/// Applies an edit to the document.
///
/// # Errors
/// A readable reason when the edit cannot apply (bad index, duplicate
/// name): the document is left as it was.
pub fn apply_edit(doc: &mut Document, cmd: &Edit) -> Result<(), String> {
    let n_lines = doc.formula().lines.len();
    let check_line = |i: usize| {
        if i < n_lines {
            Ok(())
        } else {
            Err(format!("there is no line {}", i + 1))
        }
    };
    match cmd {
        Edit::AddLine {
            ingredient,
            amount,
            unit,
        } => {
            if doc.lib.ingredient(ingredient).is_none() {
                return Err(format!("unknown ingredient `{ingredient}`"));
            }
            doc.formula_mut().lines.push(Line {
                ingredient: ingredient.clone(),
                amount: *amount,
                unit: *unit,
            });
        }
        Edit::RemoveLine(i) => {
            check_line(*i)?;
            doc.formula_mut().lines.remove(*i);
        }
        Edit::MoveLine { from, to } => {
            check_line(*from)?;
            check_line(*to)?;
            let l = doc.formula_mut().lines.remove(*from);
            doc.formula_mut().lines.insert(*to, l);
        }
        Edit::DuplicateLine(i) => {
            check_line(*i)?;
            let l = doc.formula().lines[*i].clone();
            doc.formula_mut().lines.insert(*i + 1, l);
        }
        Edit::SetAmount { line, amount, unit } => {
            check_line(*line)?;
            if !(amount.is_finite() && *amount >= 0.0) {
                return Err(format!("{amount} is not an amount ≥ 0"));
            }
            if *unit == AmountUnit::Percent && *amount >= 100.0 {
                return Err("a share of the batch must be below 100 %".into());
            }
            let l = &mut doc.formula_mut().lines[*line];
            l.amount = *amount;
            l.unit = *unit;
        }
        Edit::ScaleBatch { total_g } => scale_batch(doc, *total_g)?,
        Edit::SetTemperature(k) => {
            let c = k - colligo_core::water::T_ZERO_C;
            within(c, Limits::TEMPERATURE_C, "°C")?;
            doc.project.conditions.temperature_c = c;
        }
        Edit::SetPressure(pa) => {
            let kpa = pa / 1000.0;
            within(kpa, Limits::PRESSURE_KPA, "kPa")?;
            doc.project.conditions.pressure_kpa = kpa;
        }
        Edit::SetStorage(k) => {
            let c = k - colligo_core::water::T_ZERO_C;
            within(c, Limits::STORAGE_TEMPERATURE_C, "°C")?;
            doc.project.conditions.storage_temperature_c = c;
        }
        Edit::SetModel(m) => doc.project.model = *m,
        Edit::SetProduct(p) => doc.project.product = *p,
        Edit::SetTemperatureUnit(u) => doc.project.units.temperature = *u,
        Edit::SetPressureUnit(u) => doc.project.units.pressure = *u,
        Edit::SetProjectName(n) => {
            if n.trim().is_empty() {
                return Err("the project needs a name".into());
            }
            doc.project.name = n.clone();
        }
        Edit::SetProjectNotes(n) => doc.project.notes = n.clone(),
        Edit::SelectVariant(i) => {
            if *i >= doc.project.variants.len() {
                return Err(format!("there is no variant {}", i + 1));
            }
            doc.project.active_variant = *i;
        }
        Edit::NewVariant => {
            let name = unique_name(doc, "Variant");
            doc.project
                .variants
                .push(Formula::new(&name, vec![Line::grams(WATER_ID, 100.0)]));
            doc.project.active_variant = doc.project.variants.len() - 1;
        }
        Edit::DuplicateVariant(i) => {
            let Some(v) = doc.project.variants.get(*i).cloned() else {
                return Err(format!("there is no variant {}", i + 1));
            };
            let name = unique_name(doc, &format!("{} copy", v.name));
            doc.project.variants.insert(i + 1, Formula { name, ..v });
            doc.project.active_variant = i + 1;
        }
        Edit::RenameVariant { index, name } => {
            let name = name.trim();
            if name.is_empty() {
                return Err("a variant needs a name".into());
            }
            if doc
                .project
                .variants
                .iter()
                .enumerate()
                .any(|(j, v)| j != *index && v.name == name)
            {
                return Err(format!("there is already a variant named “{name}”"));
            }
            let Some(v) = doc.project.variants.get_mut(*index) else {
                return Err(format!("there is no variant {}", index + 1));
            };
            v.name = name.to_string();
        }
        Edit::DeleteVariant(i) => {
            if doc.project.variants.len() <= 1 {
                return Err("a project keeps at least one variant".into());
            }
            if *i >= doc.project.variants.len() {
                return Err(format!("there is no variant {}", i + 1));
            }
            doc.project.variants.remove(*i);
            let n = doc.project.variants.len();
            if doc.project.active_variant >= n || doc.project.active_variant > *i {
                doc.project.active_variant =
                    doc.project.active_variant.saturating_sub(1).min(n - 1);
            }
        }
        Edit::SetVariantNotes(n) => doc.formula_mut().notes = n.clone(),
        Edit::PutUserSolute(rec) => with_user_records(doc, |p| {
            put_by_id(&mut p.user_solutes, (**rec).clone(), |s| &s.id);
        })?,
        Edit::PutUserIngredient(rec) => with_user_records(doc, |p| {
            put_by_id(&mut p.user_ingredients, (**rec).clone(), |s| &s.id);
        })?,
        Edit::ImportUserRecords(ul) => with_user_records(doc, |p| {
            for rec in &ul.solutes {
                put_by_id(&mut p.user_solutes, rec.clone(), |s| &s.id);
            }
            for rec in &ul.ingredients {
                put_by_id(&mut p.user_ingredients, rec.clone(), |s| &s.id);
            }
        })?,
        Edit::RemoveUserRecord(id) => {
            let used = doc.project.variants.iter().any(|v| {
                v.lines.iter().any(|l| {
                    l.ingredient == *id
                        || doc.lib.ingredient(&l.ingredient).is_some_and(|i| {
                            doc.lib.ingredients[i]
                                .record
                                .solutes
                                .iter()
                                .any(|s| s.solute == *id)
                        })
                })
            });
            if used {
                return Err(format!(
                    "`{id}` is used in a formula; remove those lines first"
                ));
            }
            with_user_records(doc, |p| {
                p.user_solutes.retain(|s| s.id != *id);
                p.user_ingredients.retain(|s| s.id != *id);
            })?;
        }
    }
    doc.touch();
    Ok(())
}

/// Changes the project's user records through `change`, keeping the
/// document as it was when the result does not make a library.
fn with_user_records(
    doc: &mut Document,
    change: impl FnOnce(&mut colligo_core::Project),
) -> Result<(), String> {
    let mut p = doc.project.clone();
    change(&mut p);
    p.library(doc.base()).map_err(|e| e.to_string())?;
    doc.project = p;
    doc.rebuild_library();
    Ok(())
}

/// Replaces the record with `rec`'s id, or adds it.
fn put_by_id<T>(list: &mut Vec<T>, rec: T, id: impl Fn(&T) -> &String) {
    match list.iter().position(|r| id(r) == id(&rec)) {
        Some(i) => list[i] = rec,
        None => list.push(rec),
    }
}

/// `Ok` when `v` lies in the allowed `range`, else the message shown.
fn within(v: f64, range: (f64, f64), unit: &str) -> Result<(), String> {
    if Limits::within(v, range) {
        Ok(())
    } else {
        Err(format!(
            "{v:.1} {unit} is outside {} to {} {unit}",
            range.0, range.1
        ))
    }
}

fn unique_name(doc: &Document, base: &str) -> String {
    let taken = |n: &str| doc.project.variants.iter().any(|v| v.name == n);
    if !taken(base) && base != "Variant" {
        return base.to_string();
    }
    (1..)
        .map(|i| format!("{base} {i}"))
        .find(|n| !taken(n))
        .unwrap_or_else(|| base.to_string())
}

/// Scales every weighed line so the whole batch weighs `total_g`; percent
/// lines keep their share.
fn scale_batch(doc: &mut Document, total_g: f64) -> Result<(), String> {
    if !(total_g.is_finite() && total_g > 0.0) {
        return Err("the batch mass must be a positive number of grams".into());
    }
    let r = doc.formula().resolve(&doc.lib).map_err(|e| e.to_string())?;
    let current: f64 = r.line_kg.iter().sum::<f64>() * 1000.0;
    if current <= 0.0 {
        return Err("the formula has no mass to scale".into());
    }
    let k = total_g / current;
    for l in &mut doc.formula_mut().lines {
        if l.unit != AmountUnit::Percent {
            l.amount *= k;
        }
    }
    Ok(())
}

//! Every change a user makes goes through a [`Command`]: panels emit them,
//! and one `match` applies them at the end of the frame. Commands with a
//! keyboard shortcut carry their text, tooltip and shortcut here, so menus,
//! tooltips and key handling agree.

use colligo_core::library::WATER_ID;
use std::path::PathBuf;

use colligo_core::formula::{Formula, Line};
use colligo_core::library::Audience;
use colligo_core::library::{IngredientRecord, SoluteRecord};
use colligo_core::models::ModelChoice;
use colligo_core::properties::Limits;
use colligo_core::quantity::{AmountUnit, PressureUnit, TemperatureUnit};
use egui::{Key, KeyboardShortcut, Modifiers};

use super::document::Document;

/// A user action.
#[derive(Debug, Clone, PartialEq)]
pub enum Command {
    /// Start a new project (asks about unsaved changes).
    NewProject,
    /// Choose a project file to open (asks about unsaved changes).
    Open,
    /// Open this file (asks about unsaved changes).
    OpenPath(PathBuf),
    /// Open one of the built-in sample projects.
    OpenSample(usize),
    /// Save to the current file, or ask for one.
    Save,
    /// Save under a new name.
    SaveAs,
    /// Save to this path.
    SaveTo(PathBuf),
    /// Undo the last change.
    Undo,
    /// Redo.
    Redo,
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
    /// Quit (asks about unsaved changes).
    Quit,
}

/// A command with a shortcut, shown in menus and tooltips.
#[derive(Debug, Clone, Copy)]
pub struct Shortcut {
    /// The command's menu text.
    pub text: &'static str,
    /// Tooltip.
    pub tooltip: &'static str,
    /// The key combination.
    pub keys: KeyboardShortcut,
    /// Whether a focused text field takes this key instead.
    pub text_field_takes_it: bool,
}

/// Shortcut commands, in menu order.
pub fn shortcuts() -> [(Command, Shortcut); 6] {
    let cmd = Modifiers::COMMAND;
    let cmd_shift = Modifiers::COMMAND | Modifiers::SHIFT;
    [
        (
            Command::NewProject,
            Shortcut {
                text: "New project",
                tooltip: "Start an empty project",
                keys: KeyboardShortcut::new(cmd, Key::N),
                text_field_takes_it: false,
            },
        ),
        (
            Command::Open,
            Shortcut {
                text: "Open…",
                tooltip: "Open a project file",
                keys: KeyboardShortcut::new(cmd, Key::O),
                text_field_takes_it: false,
            },
        ),
        (
            Command::Save,
            Shortcut {
                text: "Save",
                tooltip: "Save the project to its file",
                keys: KeyboardShortcut::new(cmd, Key::S),
                text_field_takes_it: false,
            },
        ),
        (
            Command::SaveAs,
            Shortcut {
                text: "Save as…",
                tooltip: "Save the project under a new name",
                keys: KeyboardShortcut::new(cmd_shift, Key::S),
                text_field_takes_it: false,
            },
        ),
        (
            Command::Undo,
            Shortcut {
                text: "Undo",
                tooltip: "Undo the last change to the project",
                keys: KeyboardShortcut::new(cmd, Key::Z),
                text_field_takes_it: true,
            },
        ),
        (
            Command::Redo,
            Shortcut {
                text: "Redo",
                tooltip: "Redo the change just undone",
                keys: KeyboardShortcut::new(cmd_shift, Key::Z),
                text_field_takes_it: true,
            },
        ),
    ]
}

/// The shortcut of a command, if it has one.
pub fn shortcut_of(c: &Command) -> Option<Shortcut> {
    shortcuts()
        .into_iter()
        .find(|(k, _)| k == c)
        .map(|(_, s)| s)
}

/// Commands whose shortcuts were pressed this frame. Shortcuts that a text
/// field would take (undo, redo) are left to the field while one has focus.
pub fn pressed(ctx: &egui::Context) -> Vec<Command> {
    let text_focus = ctx.egui_wants_keyboard_input();
    let mut out = Vec::new();
    // Longest combinations first, so Ctrl+Shift+S is not read as Ctrl+S.
    let mut list = shortcuts().to_vec();
    list.sort_by_key(|(_, s)| std::cmp::Reverse(s.keys.modifiers.shift as u8));
    for (c, s) in list {
        if s.text_field_takes_it && text_focus {
            continue;
        }
        if ctx.input_mut(|i| i.consume_shortcut(&s.keys)) {
            out.push(c);
        }
    }
    out
}

/// Applies a document-editing command. File and dialog commands are the
/// app's; they return `Ok(false)` here.
///
/// # Errors
/// A readable reason when the command cannot apply (bad index, duplicate
/// name): the document is left as it was.
pub fn apply_edit(doc: &mut Document, cmd: &Command) -> Result<bool, String> {
    let n_lines = doc.formula().lines.len();
    let check_line = |i: usize| {
        if i < n_lines {
            Ok(())
        } else {
            Err(format!("there is no line {}", i + 1))
        }
    };
    match cmd {
        Command::AddLine {
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
        Command::RemoveLine(i) => {
            check_line(*i)?;
            doc.formula_mut().lines.remove(*i);
        }
        Command::MoveLine { from, to } => {
            check_line(*from)?;
            check_line(*to)?;
            let l = doc.formula_mut().lines.remove(*from);
            doc.formula_mut().lines.insert(*to, l);
        }
        Command::DuplicateLine(i) => {
            check_line(*i)?;
            let l = doc.formula().lines[*i].clone();
            doc.formula_mut().lines.insert(*i + 1, l);
        }
        Command::SetAmount { line, amount, unit } => {
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
        Command::ScaleBatch { total_g } => scale_batch(doc, *total_g)?,
        Command::SetTemperature(k) => {
            let c = k - colligo_core::water::T_ZERO_C;
            within(c, Limits::TEMPERATURE_C, "°C")?;
            doc.project.conditions.temperature_c = c;
        }
        Command::SetPressure(pa) => {
            let kpa = pa / 1000.0;
            within(kpa, Limits::PRESSURE_KPA, "kPa")?;
            doc.project.conditions.pressure_kpa = kpa;
        }
        Command::SetStorage(k) => {
            let c = k - colligo_core::water::T_ZERO_C;
            within(c, Limits::STORAGE_TEMPERATURE_C, "°C")?;
            doc.project.conditions.storage_temperature_c = c;
        }
        Command::SetModel(m) => doc.project.model = *m,
        Command::SetProduct(p) => doc.project.product = *p,
        Command::SetTemperatureUnit(u) => doc.project.units.temperature = *u,
        Command::SetPressureUnit(u) => doc.project.units.pressure = *u,
        Command::SetProjectName(n) => {
            if n.trim().is_empty() {
                return Err("the project needs a name".into());
            }
            doc.project.name = n.clone();
        }
        Command::SetProjectNotes(n) => doc.project.notes = n.clone(),
        Command::SelectVariant(i) => {
            if *i >= doc.project.variants.len() {
                return Err(format!("there is no variant {}", i + 1));
            }
            doc.project.active_variant = *i;
        }
        Command::NewVariant => {
            let name = unique_name(doc, "Variant");
            doc.project
                .variants
                .push(Formula::new(&name, vec![Line::grams(WATER_ID, 100.0)]));
            doc.project.active_variant = doc.project.variants.len() - 1;
        }
        Command::DuplicateVariant(i) => {
            let Some(v) = doc.project.variants.get(*i).cloned() else {
                return Err(format!("there is no variant {}", i + 1));
            };
            let name = unique_name(doc, &format!("{} copy", v.name));
            doc.project.variants.insert(i + 1, Formula { name, ..v });
            doc.project.active_variant = i + 1;
        }
        Command::RenameVariant { index, name } => {
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
        Command::DeleteVariant(i) => {
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
        Command::SetVariantNotes(n) => doc.formula_mut().notes = n.clone(),
        Command::PutUserSolute(rec) => {
            let mut p = doc.project.clone();
            match p.user_solutes.iter_mut().find(|s| s.id == rec.id) {
                Some(s) => *s = (**rec).clone(),
                None => p.user_solutes.push((**rec).clone()),
            }
            p.library(doc.base()).map_err(|e| e.to_string())?;
            doc.project = p;
            doc.rebuild_library();
        }
        Command::PutUserIngredient(rec) => {
            let mut p = doc.project.clone();
            match p.user_ingredients.iter_mut().find(|s| s.id == rec.id) {
                Some(s) => *s = (**rec).clone(),
                None => p.user_ingredients.push((**rec).clone()),
            }
            p.library(doc.base()).map_err(|e| e.to_string())?;
            doc.project = p;
            doc.rebuild_library();
        }
        Command::ImportUserRecords(ul) => {
            let mut p = doc.project.clone();
            for rec in &ul.solutes {
                match p.user_solutes.iter_mut().find(|s| s.id == rec.id) {
                    Some(s) => *s = rec.clone(),
                    None => p.user_solutes.push(rec.clone()),
                }
            }
            for rec in &ul.ingredients {
                match p.user_ingredients.iter_mut().find(|s| s.id == rec.id) {
                    Some(s) => *s = rec.clone(),
                    None => p.user_ingredients.push(rec.clone()),
                }
            }
            p.library(doc.base()).map_err(|e| e.to_string())?;
            doc.project = p;
            doc.rebuild_library();
        }
        Command::RemoveUserRecord(id) => {
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
            let mut p = doc.project.clone();
            p.user_solutes.retain(|s| s.id != *id);
            p.user_ingredients.retain(|s| s.id != *id);
            p.library(doc.base()).map_err(|e| e.to_string())?;
            doc.project = p;
            doc.rebuild_library();
        }
        _ => return Ok(false),
    }
    doc.touch();
    Ok(true)
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

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn shortcuts_do_not_clash() {
        let list = shortcuts();
        for (i, (_, a)) in list.iter().enumerate() {
            for (_, b) in &list[i + 1..] {
                assert_ne!(a.keys, b.keys, "{} and {} share a shortcut", a.text, b.text);
            }
        }
    }
}

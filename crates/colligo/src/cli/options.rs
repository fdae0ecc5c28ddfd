//! The options several subcommands share (where the formula comes from,
//! the conditions, the model), their value parsers, and the [`Job`] they
//! describe together.

use std::path::PathBuf;

use anyhow::{Context, Result, anyhow, bail};
use clap::{Args, ValueEnum};
use colligo_core::error::elide;
use colligo_core::formula::parse_mix;
use colligo_core::keys::ScalarKey;
use colligo_core::models::ModelChoice;
use colligo_core::project::Project;
use colligo_core::properties::Conditions;
use colligo_core::quantity::{parse_amount, parse_pressure, parse_temperature};
use colligo_core::{Formula, Library};

/// Where the formula comes from: a project file (one of its variants), a
/// formula written on the command line, or both (the project's conditions,
/// model and user records with the written formula).
#[derive(Debug, Clone, Default, Args)]
pub struct FormulaArgs {
    /// Project file to take the formula, conditions and model from
    #[arg(value_name = "PROJECT.ron")]
    pub project: Option<PathBuf>,
    /// The project's variant to use [default: the active one]
    #[arg(long, value_name = "NAME")]
    pub variant: Option<String>,
    /// A formula written out, e.g. "water=100g, sucrose=50g" (replaces the
    /// project's formula)
    #[arg(long, value_name = "FORMULA")]
    pub mix: Option<String>,
}

/// The conditions, each overriding the project's (or the defaults: 25 °C,
/// 101.325 kPa, storage at -18 °C).
#[derive(Debug, Clone, Copy, Default, Args)]
pub struct ConditionArgs {
    /// Product temperature, C, F or K (a bare number is °C)
    #[arg(long, value_name = "T", value_parser = parse_temperature, allow_hyphen_values = true)]
    pub temperature: Option<f64>,
    /// Pressure (kPa, hPa, Pa, atm, bar, mmHg, psi) or an altitude (1600m, 5000ft)
    #[arg(long, value_name = "P", value_parser = parse_pressure, allow_hyphen_values = true)]
    pub pressure: Option<f64>,
    /// Storage temperature at which the ice fraction is given
    #[arg(long, value_name = "T", value_parser = parse_temperature, allow_hyphen_values = true)]
    pub storage: Option<f64>,
}

impl ConditionArgs {
    /// Writes the given options onto `cond`.
    pub fn apply(&self, cond: &mut Conditions) {
        if let Some(t) = self.temperature {
            cond.temperature_k = t;
        }
        if let Some(p) = self.pressure {
            cond.pressure_pa = p;
        }
        if let Some(t) = self.storage {
            cond.storage_temperature_k = t;
        }
    }
}

/// The water-activity model option.
#[derive(Debug, Clone, Copy, Default, Args)]
pub struct ModelArgs {
    /// Water-activity model [default: the project's, or auto]
    #[arg(long, value_enum, ignore_case = true)]
    pub model: Option<ModelOption>,
}

/// The models a user can choose on the command line.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum ModelOption {
    /// Norrish for non-electrolytes only, Pitzer for electrolytes only, ZSR for both
    Auto,
    /// Raoult's law with dissociation
    Ideal,
    /// Multi-solute Norrish
    Norrish,
    /// Ross's product of the binaries
    Ross,
    /// Zdanovskii-Stokes-Robinson on the binaries
    Zsr,
    /// Pitzer ion interaction
    Pitzer,
    /// Norrish and Pitzer groups joined by ZSR
    Grouped,
}

impl From<ModelOption> for ModelChoice {
    fn from(m: ModelOption) -> ModelChoice {
        match m {
            ModelOption::Auto => ModelChoice::Auto,
            ModelOption::Ideal => ModelChoice::Ideal,
            ModelOption::Norrish => ModelChoice::Norrish,
            ModelOption::Ross => ModelChoice::Ross,
            ModelOption::Zsr => ModelChoice::Zsr,
            ModelOption::Pitzer => ModelChoice::Pitzer,
            ModelOption::Grouped => ModelChoice::Grouped,
        }
    }
}

/// A mass such as `200g` or `1.5kg`, in kg (shares of the batch are refused).
///
/// # Errors
/// Text that is not an amount, or an amount in %.
pub fn parse_mass_kg(text: &str) -> Result<f64, String> {
    parse_amount(text)
        .map_err(|e| e.to_string())?
        .kg()
        .ok_or_else(|| "must be a mass (g, kg, …), not a share of the batch".to_string())
}

/// A comma-separated list of property keys.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct KeyList(pub Vec<ScalarKey>);

/// Reads `water_activity,freezing_point_c` (spaces and empty items are
/// ignored).
///
/// # Errors
/// An unknown key (the message lists the known ones), or no key at all.
pub fn parse_key_list(text: &str) -> Result<KeyList, String> {
    let keys = text
        .split(',')
        .map(str::trim)
        .filter(|s| !s.is_empty())
        .map(|s| s.parse::<ScalarKey>().map_err(|e| e.to_string()))
        .collect::<Result<Vec<_>, _>>()?;
    if keys.is_empty() {
        return Err("needs at least one key".into());
    }
    Ok(KeyList(keys))
}

/// The formula, conditions, model and library a subcommand works on.
pub struct Job {
    /// Library including the project's user records.
    pub lib: Library,
    /// The formula.
    pub formula: Formula,
    /// Conditions.
    pub cond: Conditions,
    /// Model.
    pub model: ModelChoice,
    /// Title for tables.
    pub title: String,
}

/// What a formula subcommand works on: the formula's source, the
/// conditions and the model.
#[derive(Debug, Clone, Default, Args)]
pub struct JobArgs {
    /// Where the formula comes from.
    #[command(flatten)]
    pub formula: FormulaArgs,
    /// The conditions.
    #[command(flatten)]
    pub conditions: ConditionArgs,
    /// The model.
    #[command(flatten)]
    pub model: ModelArgs,
}

impl JobArgs {
    /// The [`Job`] these options describe.
    ///
    /// # Errors
    /// As [`FormulaArgs::job`].
    pub fn job(&self, base: &Library) -> Result<Job> {
        self.formula.job(base, &self.conditions, &self.model)
    }
}

impl FormulaArgs {
    /// Builds the [`Job`] from the project and/or `--mix`, then applies the
    /// condition and model options.
    ///
    /// # Errors
    /// Unreadable project, unknown variant, bad mix, unknown ingredients
    /// (with suggestions).
    pub fn job(
        &self,
        base: &Library,
        conditions: &ConditionArgs,
        model: &ModelArgs,
    ) -> Result<Job> {
        let (lib, mut formula, mut cond, mut chosen, mut title) = match &self.project {
            Some(path) => {
                let shown = path.display();
                let p = Project::load(path, base)?;
                let lib = p
                    .library(base)
                    .with_context(|| format!("{shown}: user-defined records"))?;
                let variant = match &self.variant {
                    Some(name) => p
                        .variants
                        .iter()
                        .find(|v| &v.name == name)
                        .cloned()
                        .ok_or_else(|| {
                            anyhow!(
                                "{shown}: no variant named `{}` (variants: {})",
                                elide(name),
                                p.variants
                                    .iter()
                                    .map(|v| v.name.as_str())
                                    .collect::<Vec<_>>()
                                    .join(", ")
                            )
                        })?,
                    None => p.active().clone(),
                };
                let title = format!("{} — {}", p.name, variant.name);
                (lib, variant, p.conditions.to_conditions(), p.model, title)
            }
            None => (
                base.clone(),
                Formula::default(),
                Conditions::default(),
                ModelChoice::Auto,
                "formula".to_string(),
            ),
        };
        if let Some(mix) = &self.mix {
            formula = Formula::new("mix", parse_mix(mix)?);
            title = format!("mix: {mix}");
        } else if self.project.is_none() {
            bail!("give a project file or --mix \"water=100g, sucrose=50g\"");
        }
        conditions.apply(&mut cond);
        if let Some(m) = model.model {
            chosen = m.into();
        }
        // Resolve now so that unknown ingredients are reported with suggestions.
        formula.resolve(&lib)?;
        Ok(Job {
            lib,
            formula,
            cond,
            model: chosen,
            title,
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn model_choices_are_the_model_ids() {
        let names: Vec<String> = ModelOption::value_variants()
            .iter()
            .filter_map(|c| Some(c.to_possible_value()?.get_name().to_string()))
            .collect();
        let ids: Vec<String> = ModelOption::value_variants()
            .iter()
            .map(|&c| ModelChoice::from(c).as_str().to_string())
            .collect();
        assert_eq!(names, ids);
        let all: Vec<String> = ModelChoice::ALL
            .iter()
            .map(|m| m.as_str().to_string())
            .collect();
        assert_eq!(ids, all);
    }

    #[test]
    fn key_lists_skip_blanks_and_name_unknown_keys() {
        assert_eq!(
            parse_key_list(" water_activity, ,freezing_point_c,"),
            Ok(KeyList(vec![
                ScalarKey::WaterActivity,
                ScalarKey::FreezingPointC
            ]))
        );
        assert!(parse_key_list(" , ").is_err());
        let e = parse_key_list("water_activity,aw")
            .err()
            .unwrap_or_default();
        assert!(e.contains("`aw`") && e.contains("erh_percent"), "{e}");
    }

    #[test]
    fn masses_refuse_shares() {
        assert_eq!(parse_mass_kg("250g"), Ok(0.25));
        assert!(parse_mass_kg("10%").is_err());
        assert!(parse_mass_kg("lots").is_err());
    }
}

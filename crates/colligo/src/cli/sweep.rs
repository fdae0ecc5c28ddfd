//! `colligo sweep`: every property while one ingredient's amount varies.

use std::io::Write;

use anyhow::Result;
use clap::Args;
use colligo_core::Library;
use colligo_core::sweep;

use super::options::{JobArgs, parse_mass_kg};
use super::output::{PropertiesJson, SweepJson, SweepPointJson, json_text, sweep_table};
use crate::CAUTIONS;

/// Options of `sweep`.
#[derive(Debug, Clone, Args)]
#[command(
    after_help = "The amount runs from --from to --to in --steps equal intervals, so \
there are steps + 1 points. The other lines of the formula stay as they are."
)]
pub struct SweepArgs {
    /// The formula, its conditions and the model.
    #[command(flatten)]
    pub job: JobArgs,
    /// Id of the ingredient to vary (its line is replaced, or added)
    #[arg(long, value_name = "ID")]
    pub ingredient: String,
    /// First amount (a mass: g, kg, mg, oz, lb)
    #[arg(long, value_name = "MASS", default_value = "0g", value_parser = parse_mass_kg, allow_hyphen_values = true)]
    pub from: f64,
    /// Last amount (a mass)
    #[arg(long, value_name = "MASS", value_parser = parse_mass_kg, allow_hyphen_values = true)]
    pub to: f64,
    /// Number of intervals between --from and --to
    #[arg(long, value_name = "N", default_value_t = 50,
          value_parser = clap::value_parser!(u32).range(1..=100_000))]
    pub steps: u32,
    /// Print CSV instead of a tab-separated table
    #[arg(long)]
    pub csv: bool,
    /// Print JSON (takes precedence over --csv)
    #[arg(long)]
    pub json: bool,
}

/// Runs `sweep`.
///
/// # Errors
/// Bad formula or project, or an unknown ingredient. A point that cannot be
/// computed is reported in its row instead.
pub fn run(a: &SweepArgs, base: &Library, out: &mut dyn Write) -> Result<()> {
    let j = a.job.job(base)?;
    let id = a.ingredient.as_str();
    j.lib.ingredient_or_suggest(id)?;
    let amounts = sweep::linspace(a.from, a.to, a.steps as usize + 1);
    let rows = sweep::full_sweep(&j.lib, &j.formula, id, &amounts, j.model, &j.cond)?;
    if a.json {
        let points = amounts
            .iter()
            .zip(&rows)
            .map(|(kg, r)| match r {
                Ok(p) => SweepPointJson::Point {
                    properties: PropertiesJson::new(p),
                    amount_g: kg * 1000.0,
                },
                Err(e) => SweepPointJson::Failed {
                    amount_g: kg * 1000.0,
                    error: e.to_string(),
                },
            })
            .collect();
        let doc = SweepJson {
            ingredient: id,
            points,
            cautions: CAUTIONS,
        };
        writeln!(out, "{}", json_text(&doc)?)?;
    } else {
        out.write_all(sweep_table(id, &amounts, &rows, a.csv).as_bytes())?;
    }
    Ok(())
}

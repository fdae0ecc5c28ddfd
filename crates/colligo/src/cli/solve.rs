//! `colligo solve`: the amount of one ingredient that reaches a target.

use std::io::Write;

use anyhow::Result;
use clap::Args;
use colligo_core::Library;
use colligo_core::goal::{Target, goal_seek};

use super::options::JobArgs;
use super::output::{EvalJson, SolveJson, json_text, properties_table};

/// Options of `solve`.
#[derive(Debug, Clone, Args)]
#[command(
    after_help = "Targets: water_activity=0.85 (or aw=), erh_percent=80 (or erh=), \
freezing_point_c=-5, ice_fraction_of_water@-18C=0.7 (the share of the water frozen at a storage \
temperature, -18 °C when @T is left out).\n\nThe amount is searched from none up to 100 times the \
batch. When no amount reaches the target, the reason (and the closest value) is printed and the \
exit code is 1."
)]
pub struct SolveArgs {
    /// The formula, its conditions and the model.
    #[command(flatten)]
    pub job: JobArgs,
    /// Id of the ingredient whose amount is solved for
    #[arg(long, value_name = "ID")]
    pub ingredient: String,
    /// The property and the value wanted, e.g. water_activity=0.85
    #[arg(long, value_name = "PROPERTY=VALUE", allow_hyphen_values = true)]
    pub target: Target,
    /// Print JSON instead of a table
    #[arg(long)]
    pub json: bool,
}

/// Runs `solve`.
///
/// # Errors
/// Bad formula or project, or a target that cannot be reached (the error
/// says why).
pub fn run(a: &SolveArgs, base: &Library, out: &mut dyn Write) -> Result<()> {
    let j = a.job.job(base)?;
    let id = a.ingredient.as_str();
    let target = a.target;
    let r = goal_seek(&j.lib, &j.formula, id, target, j.model, &j.cond)?;
    if a.json {
        let doc = SolveJson {
            ingredient: id,
            amount_g: r.amount_kg * 1000.0,
            target: target.to_string(),
            properties: EvalJson::new(&r.properties),
        };
        writeln!(out, "{}", json_text(&doc)?)?;
    } else {
        writeln!(
            out,
            "{id}: {:.3} g reaches {target}\n",
            r.amount_kg * 1000.0
        )?;
        write!(out, "{}", properties_table(&r.properties, &j.title))?;
    }
    Ok(())
}

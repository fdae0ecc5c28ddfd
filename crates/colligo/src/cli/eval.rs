//! `colligo eval`: every property of one formula.

use std::io::Write;

use anyhow::Result;
use clap::Args;
use colligo_core::Library;
use colligo_core::properties::{self, Wanted};

use super::options::JobArgs;
use super::output::{EvalJson, json_text, properties_table};

/// Options of `eval`.
#[derive(Debug, Clone, Args)]
pub struct EvalArgs {
    /// The formula, its conditions and the model.
    #[command(flatten)]
    pub job: JobArgs,
    /// Print JSON instead of a table
    #[arg(long)]
    pub json: bool,
}

/// Runs `eval`.
///
/// # Errors
/// Bad formula or project, or a failed evaluation.
pub fn run(a: &EvalArgs, base: &Library, out: &mut dyn Write) -> Result<()> {
    let j = a.job.job(base)?;
    let comp = j.formula.composition(&j.lib)?;
    let p = properties::evaluate(&j.lib, &comp, j.model, &j.cond, Wanted::ALL)?;
    if a.json {
        writeln!(out, "{}", json_text(&EvalJson::new(&p))?)?;
    } else {
        write!(out, "{}", properties_table(&p, &j.title))?;
    }
    Ok(())
}

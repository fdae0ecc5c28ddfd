//! `colligo solve`: the amount of one ingredient that reaches a target.

use std::io::Write;

use anyhow::{Result, anyhow};
use colligo_core::Library;
use colligo_core::goal::{Target, goal_seek};

use crate::cli::{Args, job};
use crate::report;

/// Runs `solve`.
///
/// # Errors
/// Bad arguments, or a target that cannot be reached (the error says why).
pub fn solve(base: &Library, args: &Args, out: &mut dyn Write) -> Result<()> {
    args.job_and(&["ingredient", "target"])?;
    let j = job(base, args)?;
    let id = args.require("ingredient", "the ingredient id to vary")?;
    let target: Target = args
        .get("target")
        .ok_or_else(|| anyhow!("--target is required, e.g. --target water_activity=0.85"))?
        .parse()
        .map_err(|e: String| anyhow!(e))?;
    let r = goal_seek(&j.lib, &j.formula, id, target, j.model, &j.cond)?;
    if args.has("json") {
        let doc = serde_json::json!({
            "ingredient": id,
            "amount_g": r.amount_kg * 1000.0,
            "target": target.to_string(),
            "properties": report::properties_json(&r.properties),
        });
        writeln!(out, "{}", serde_json::to_string_pretty(&doc)?)?;
    } else {
        writeln!(
            out,
            "{id}: {:.3} g reaches {target}\n",
            r.amount_kg * 1000.0
        )?;
        write!(out, "{}", report::properties_table(&r.properties, &j.title))?;
    }
    Ok(())
}

//! `colligo freeze`: the freezing curve of one formula.

use std::io::Write;

use anyhow::{Result, bail};
use clap::Args;
use colligo_core::Library;
use colligo_core::error::elide;
use colligo_core::properties;
use colligo_core::quantity::parse_temperature_c;
use colligo_core::water::T_ZERO_C;

use super::options::JobArgs;
use super::output::{FreezingJson, freezing_table, json_text};

/// Options of `freeze`.
#[derive(Debug, Clone, Args)]
#[command(
    after_help = "The curve runs from --from towards --to in steps of --step (either \
direction). Temperatures take C, F or K; a bare number is °C. Both ends lie between -60 and 0 °C."
)]
pub struct FreezeArgs {
    /// The formula, its conditions and the model.
    #[command(flatten)]
    pub job: JobArgs,
    /// First temperature of the curve (C, F or K; a bare number is °C)
    #[arg(long, value_name = "T", default_value = "-1", value_parser = parse_temperature_c, allow_hyphen_values = true)]
    pub from: f64,
    /// Last temperature of the curve
    #[arg(long, value_name = "T", default_value = "-30", value_parser = parse_temperature_c, allow_hyphen_values = true)]
    pub to: f64,
    /// Spacing of the temperatures, in K (the same as °C)
    #[arg(long, value_name = "K", default_value = "1", value_parser = parse_step, allow_hyphen_values = true)]
    pub step: f64,
    /// Print JSON instead of a table
    #[arg(long)]
    pub json: bool,
}

/// A temperature interval in K (or °C, the same size): a number, optionally
/// followed by `K` or `C`; its sign is ignored.
///
/// # Errors
/// Not a number, not finite, or zero.
pub fn parse_step(text: &str) -> Result<f64, String> {
    let v: f64 = text
        .trim()
        .trim_end_matches(['C', 'c', 'K', 'k'])
        .trim_end_matches('°')
        .trim()
        .parse()
        .map_err(|_| format!("`{}` is not a number", elide(text)))?;
    if !v.is_finite() {
        Err(format!("`{}` is not finite", elide(text)))
    } else if v == 0.0 {
        Err("must not be zero".into())
    } else {
        Ok(v.abs())
    }
}

/// Most points a curve may have.
pub const MAX_POINTS: usize = 100_000;

/// Runs `freeze`.
///
/// # Errors
/// Bad formula or project, temperatures outside −60…0 °C, too many points,
/// or a failed evaluation.
pub fn run(a: &FreezeArgs, base: &Library, out: &mut dyn Write) -> Result<()> {
    let j = a.job.job(base)?;
    let (from, to, step) = (a.from, a.to, a.step);
    if !(-60.0..=0.0).contains(&from) || !(-60.0..=0.0).contains(&to) {
        bail!("--from and --to must lie between -60 and 0 °C");
    }
    // Counted in f64: a tiny step gives a count beyond usize, which must
    // not wrap to a small number.
    let count = ((from - to).abs() / step).floor() + 1.0;
    if count.is_nan() || count > MAX_POINTS as f64 {
        bail!(
            "{} points is too many (at most {MAX_POINTS}); use a larger --step",
            colligo_core::error::short(count)
        );
    }
    let n = count as usize;
    let dir = if to < from { -1.0 } else { 1.0 };
    let temps: Vec<f64> = (0..n)
        .map(|i| from + dir * step * i as f64 + T_ZERO_C)
        .collect();
    let comp = j.formula.composition(&j.lib)?;
    let curve = properties::freezing_curve(&j.lib, &comp, j.model, &j.cond, &temps)?;
    if a.json {
        writeln!(out, "{}", json_text(&FreezingJson::new(&curve))?)?;
    } else {
        write!(out, "{}\n{}", j.title, freezing_table(&curve))?;
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::parse_step;

    #[test]
    fn steps_are_positive_intervals() {
        assert_eq!(parse_step("0.5"), Ok(0.5));
        assert_eq!(parse_step("-2"), Ok(2.0));
        assert_eq!(parse_step("1 K"), Ok(1.0));
        assert_eq!(parse_step("0.25°C"), Ok(0.25));
        assert!(parse_step("0").is_err());
        assert!(parse_step("inf").is_err());
        assert!(parse_step("small").is_err());
    }
}

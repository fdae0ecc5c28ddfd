//! Headless subcommands on the app's binary: `eval`, `freeze`, `sweep`,
//! `batch`, `solve`. Nothing here opens a window.

use std::collections::HashMap;
use std::fmt::Write as _;
use std::io::Write as _;
use std::path::Path;

use anyhow::{Context, Result, anyhow, bail};
use colligo_core::csv::csv_field;
use colligo_core::formula::parse_mix;
use colligo_core::models::ModelChoice;
use colligo_core::project::Project;
use colligo_core::properties::{self, Conditions, Wanted};
use colligo_core::quantity::{parse_amount, parse_pressure, parse_temperature};
use colligo_core::sweep;
use colligo_core::water::T_ZERO_C;
use colligo_core::{Formula, Library};

use crate::report;

/// The subcommand names.
pub const SUBCOMMANDS: [&str; 6] = ["eval", "freeze", "sweep", "batch", "solve", "help"];

/// Usage text.
pub const USAGE: &str = "\
Colligo — water activity, freezing and vapour pressure of aqueous formulations.

usage:
  colligo [PROJECT.ron]                      open the workbench (on the last or a sample project)
  colligo eval [PROJECT.ron] [--variant NAME] [--mix \"water=100g, sucrose=50g\"]
               [--temperature 25C] [--pressure 101.325kPa | 1600m] [--storage -18C]
               [--model auto|ideal|norrish|ross|zsr|pitzer] [--json]
  colligo freeze (PROJECT.ron | --mix ...) [--from -1] [--to -30] [--step 1] [--json]
  colligo sweep  (PROJECT.ron | --mix ...) --ingredient ID --from 0g --to 200g [--steps 50] [--csv | --json]
  colligo batch  FORMULAS.csv [--temperature ..] [--pressure ..] [--model ..] [--properties water_activity,freezing_point_c,..]
  colligo solve  (PROJECT.ron | --mix ...) --ingredient ID --target water_activity=0.85 [--json]
                 targets: water_activity=, erh_percent=, freezing_point_c=, ice_fraction_of_water@-18C=

Amounts take g, kg, mg, oz, lb or % of batch; temperatures C, F or K (default °C);
pressures kPa, hPa, Pa, atm, bar, mmHg, psi or an altitude in m or ft. Ids are solute or ingredient ids.
Sweeps run --steps intervals, i.e. steps + 1 points. Batch CSV: a `name` column, then one column per
ingredient id in grams; one result row per formula on stdout, errors in the `error` column.
";

/// Parsed command-line arguments: positionals, `--key value` options, and switches.
#[derive(Debug, Default)]
pub struct Args {
    /// Positional arguments.
    pub positional: Vec<String>,
    options: HashMap<String, String>,
    switches: Vec<String>,
}

const SWITCHES: [&str; 3] = ["json", "csv", "help"];

impl Args {
    /// Parses everything after the subcommand.
    ///
    /// # Errors
    /// An option without its value, or a repeated option.
    pub fn parse(args: &[String]) -> Result<Args> {
        let mut a = Args::default();
        let mut i = 0;
        while i < args.len() {
            let s = &args[i];
            if let Some(name) = s.strip_prefix("--") {
                let (name, inline) = match name.split_once('=') {
                    Some((n, v)) => (n, Some(v.to_string())),
                    None => (name, None),
                };
                if SWITCHES.contains(&name) {
                    a.switches.push(name.to_string());
                } else {
                    let v = match inline {
                        Some(v) => v,
                        None => {
                            i += 1;
                            args.get(i)
                                .cloned()
                                .ok_or_else(|| anyhow!("--{name} needs a value"))?
                        }
                    };
                    if a.options.insert(name.to_string(), v).is_some() {
                        bail!("--{name} given twice");
                    }
                }
            } else {
                a.positional.push(s.clone());
            }
            i += 1;
        }
        Ok(a)
    }

    /// An option's value.
    pub fn get(&self, name: &str) -> Option<&str> {
        self.options.get(name).map(String::as_str)
    }

    /// A required option's value.
    ///
    /// # Errors
    /// When it was not given, with `hint` on how to give it.
    pub fn require(&self, name: &str, hint: &str) -> Result<&str> {
        self.get(name)
            .ok_or_else(|| anyhow!("--{name} is required ({hint})"))
    }

    /// Whether a switch was given.
    pub fn has(&self, name: &str) -> bool {
        self.switches.iter().any(|s| s == name)
    }

    /// Fails on options not in `allowed`.
    ///
    /// # Errors
    /// The first unknown option.
    pub fn only(&self, allowed: &[&str]) -> Result<()> {
        self.only_job_and(allowed, false)
    }

    /// Fails on options that are neither [`JOB_OPTIONS`] nor in `extra`.
    ///
    /// # Errors
    /// The first unknown option.
    pub fn job_and(&self, extra: &[&str]) -> Result<()> {
        self.only_job_and(extra, true)
    }

    fn only_job_and(&self, allowed: &[&str], job: bool) -> Result<()> {
        for k in self.options.keys() {
            if !(allowed.contains(&k.as_str()) || job && JOB_OPTIONS.contains(&k.as_str())) {
                bail!("unknown option --{k} (see `colligo help`)");
            }
        }
        Ok(())
    }
}

/// Runs a subcommand, writing its output to `out`. Errors are printed to
/// stderr by the caller, which exits non-zero.
///
/// # Errors
/// Any failure, with context.
pub fn run(sub: &str, rest: &[String], out: &mut dyn std::io::Write) -> Result<()> {
    let args = Args::parse(rest)?;
    let lib = Library::builtin().context("loading the built-in library")?;
    match sub {
        "eval" => eval(&lib, &args, out),
        "freeze" => freeze(&lib, &args, out),
        "sweep" => sweep_cmd(&lib, &args, out),
        "batch" => batch(&lib, &args, out),
        "solve" => crate::solve_cli::solve(&lib, &args, out),
        "help" => {
            out.write_all(USAGE.as_bytes())?;
            Ok(())
        }
        _ => bail!("unknown subcommand `{sub}`"),
    }
}

/// The options every formula subcommand takes (project variant, mix, conditions, model).
pub const JOB_OPTIONS: [&str; 6] = [
    "variant",
    "mix",
    "temperature",
    "pressure",
    "storage",
    "model",
];

/// `--temperature`, `--pressure`, `--storage` onto `cond`.
///
/// # Errors
/// Unreadable quantities.
pub fn apply_conditions(args: &Args, cond: &mut Conditions) -> Result<()> {
    if let Some(t) = args.get("temperature") {
        cond.temperature_k = parse_temperature(t)?;
    }
    if let Some(p) = args.get("pressure") {
        cond.pressure_pa = parse_pressure(p)?;
    }
    if let Some(t) = args.get("storage") {
        cond.storage_temperature_k = parse_temperature(t)?;
    }
    Ok(())
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

/// Builds the [`Job`] from a project path and/or `--mix`, then overrides.
///
/// # Errors
/// Unreadable project, bad mix, bad quantities.
pub fn job(base: &Library, args: &Args) -> Result<Job> {
    let (lib, mut formula, mut cond, mut model, mut title) = match args.positional.first() {
        Some(path) => {
            let p = Project::load(Path::new(path), base)?;
            let lib = p
                .library(base)
                .with_context(|| format!("{path}: user-defined records"))?;
            let variant = match args.get("variant") {
                Some(name) => p
                    .variants
                    .iter()
                    .find(|v| v.name == name)
                    .cloned()
                    .ok_or_else(|| {
                        anyhow!(
                            "{path}: no variant named `{name}` (variants: {})",
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
    if args.positional.len() > 1 {
        bail!(
            "only one project file can be given (got {})",
            args.positional.join(" ")
        );
    }
    if let Some(mix) = args.get("mix") {
        formula = Formula::new("mix", parse_mix(mix)?);
        title = format!("mix: {mix}");
    } else if args.positional.is_empty() {
        bail!("give a project file or --mix \"water=100g, sucrose=50g\"");
    }
    apply_conditions(args, &mut cond)?;
    if let Some(m) = args.get("model") {
        model = m.parse::<ModelChoice>()?;
    }
    // Resolve now so that unknown ingredients are reported with suggestions.
    formula.resolve(&lib)?;
    Ok(Job {
        lib,
        formula,
        cond,
        model,
        title,
    })
}

fn eval(base: &Library, args: &Args, out: &mut dyn std::io::Write) -> Result<()> {
    args.job_and(&[])?;
    let j = job(base, args)?;
    let comp = j.formula.composition(&j.lib)?;
    let p = properties::evaluate(&j.lib, &comp, j.model, &j.cond, Wanted::ALL)?;
    if args.has("json") {
        writeln!(
            out,
            "{}",
            serde_json::to_string_pretty(&report::properties_json(&p))?
        )?;
    } else {
        write!(out, "{}", report::properties_table(&p, &j.title))?;
    }
    Ok(())
}

fn number(args: &Args, name: &str, default: f64) -> Result<f64> {
    match args.get(name) {
        None => Ok(default),
        Some(s) => {
            let v = s
                .trim()
                .trim_end_matches(['C', 'c'])
                .trim_end_matches('°')
                .trim()
                .parse::<f64>()
                .map_err(|_| anyhow!("--{name}: `{s}` is not a number"))?;
            if v.is_finite() {
                Ok(v)
            } else {
                bail!("--{name}: `{s}` is not finite")
            }
        }
    }
}

fn freeze(base: &Library, args: &Args, out: &mut dyn std::io::Write) -> Result<()> {
    args.job_and(&["from", "to", "step"])?;
    let j = job(base, args)?;
    let from = number(args, "from", -1.0)?;
    let to = number(args, "to", -30.0)?;
    let step = number(args, "step", 1.0)?.abs();
    if step == 0.0 {
        bail!("--step must not be zero");
    }
    if !(-60.0..=0.0).contains(&from) || !(-60.0..=0.0).contains(&to) {
        bail!("--from and --to must lie between -60 and 0 °C");
    }
    let n = ((from - to).abs() / step).floor() as usize + 1;
    if n > 100_000 {
        bail!("{n} points is too many; use a larger --step");
    }
    let dir = if to < from { -1.0 } else { 1.0 };
    let temps: Vec<f64> = (0..n)
        .map(|i| from + dir * step * i as f64 + T_ZERO_C)
        .collect();
    let comp = j.formula.composition(&j.lib)?;
    let curve = properties::freezing_curve(&j.lib, &comp, j.model, &j.cond, &temps)?;
    if args.has("json") {
        writeln!(
            out,
            "{}",
            serde_json::to_string_pretty(&report::freezing_json(&curve))?
        )?;
    } else {
        write!(out, "{}\n{}", j.title, report::freezing_table(&curve))?;
    }
    Ok(())
}

fn sweep_cmd(base: &Library, args: &Args, out: &mut dyn std::io::Write) -> Result<()> {
    args.job_and(&["ingredient", "from", "to", "steps"])?;
    let j = job(base, args)?;
    let id = args.require("ingredient", "the ingredient id to vary")?;
    j.lib.ingredient_or_suggest(id)?;
    let from = args.get("from").map(parse_amount).transpose()?;
    let to = args
        .get("to")
        .ok_or_else(|| anyhow!("--to AMOUNT is required"))?;
    let to = parse_amount(to)?;
    let from_kg = from
        .map_or(Some(0.0), |a| a.kg())
        .ok_or_else(|| anyhow!("--from must be a mass (g, kg, …)"))?;
    let to_kg = to
        .kg()
        .ok_or_else(|| anyhow!("--to must be a mass (g, kg, …)"))?;
    let steps: usize = args
        .get("steps")
        .unwrap_or("50")
        .parse()
        .map_err(|_| anyhow!("--steps must be a whole number"))?;
    if steps == 0 || steps > 100_000 {
        bail!("--steps must be between 1 and 100000");
    }
    let amounts = sweep::linspace(from_kg, to_kg, steps + 1);
    let rows = sweep::full_sweep(&j.lib, &j.formula, id, &amounts, j.model, &j.cond)?;
    if args.has("json") {
        let pts: Vec<_> = amounts
            .iter()
            .zip(&rows)
            .map(|(kg, r)| match r {
                Ok(p) => {
                    let mut v = report::properties_json(p);
                    if let Some(o) = v.as_object_mut() {
                        o.remove("cautions");
                        o.insert("amount_g".into(), serde_json::json!(kg * 1000.0));
                    }
                    v
                }
                Err(e) => serde_json::json!({"amount_g": kg * 1000.0, "error": e.to_string()}),
            })
            .collect();
        let doc =
            serde_json::json!({"ingredient": id, "points": pts, "cautions": report::CAUTIONS});
        writeln!(out, "{}", serde_json::to_string_pretty(&doc)?)?;
    } else {
        let csv = args.has("csv");
        let sep = if csv { "," } else { "\t" };
        let mut text = String::new();
        let _ = write!(text, "{id}_g");
        for k in report::SCALAR_KEYS {
            let _ = write!(text, "{sep}{k}");
        }
        let _ = writeln!(text, "{sep}model{sep}error");
        for (kg, r) in amounts.iter().zip(&rows) {
            let _ = write!(text, "{}", fmt_num(kg * 1000.0));
            match r {
                Ok(p) => {
                    for k in report::SCALAR_KEYS {
                        let _ = write!(
                            text,
                            "{sep}{}",
                            report::scalar(p, k).map_or(String::new(), fmt_num)
                        );
                    }
                    let _ = writeln!(text, "{sep}{}{sep}", p.model);
                }
                Err(e) => {
                    for _ in report::SCALAR_KEYS {
                        text.push_str(sep);
                    }
                    let _ = writeln!(text, "{sep}{sep}{}", csv_field(&e.to_string()));
                }
            }
        }
        out.write_all(text.as_bytes())?;
    }
    Ok(())
}

/// `v` with 10 significant digits, as [`push_num`] writes it.
pub fn fmt_num(v: f64) -> String {
    let mut s = String::new();
    push_num(&mut s, v);
    s
}

/// Appends `v` with 10 significant digits and no trailing zeros (fixed
/// notation for ordinary magnitudes), without allocating.
pub fn push_num(out: &mut String, v: f64) {
    if !v.is_finite() {
        return;
    }
    let a = v.abs();
    if a != 0.0 && !(1e-4..1e9).contains(&a) {
        let _ = write!(out, "{v:.9e}");
        return;
    }
    let decimals = if a == 0.0 {
        0
    } else if a < 1.0 {
        10 + (-a.log10()).floor() as usize
    } else {
        10usize.saturating_sub(a.log10().floor() as usize + 1)
    };
    let start = out.len();
    let _ = write!(out, "{v:.decimals$}");
    if out[start..].contains('.') {
        while out.ends_with('0') {
            out.pop();
        }
        if out.ends_with('.') {
            out.pop();
        }
    }
}

fn batch(base: &Library, args: &Args, out: &mut dyn std::io::Write) -> Result<()> {
    args.only(&["temperature", "pressure", "storage", "model", "properties"])?;
    let path = args
        .positional
        .first()
        .ok_or_else(|| anyhow!("give the CSV file of formulas"))?;
    let text = std::fs::read_to_string(path).with_context(|| format!("reading {path}"))?;
    let mut cond = Conditions::default();
    apply_conditions(args, &mut cond)?;
    let model: ModelChoice = args.get("model").unwrap_or("auto").parse()?;
    let keys: Vec<&str> = match args.get("properties") {
        Some(list) => {
            let ks: Vec<&str> = list
                .split(',')
                .map(str::trim)
                .filter(|s| !s.is_empty())
                .collect();
            for k in &ks {
                if !report::SCALAR_KEYS.contains(k) {
                    bail!(
                        "unknown property `{k}` (choose from {})",
                        report::SCALAR_KEYS.join(", ")
                    );
                }
            }
            if ks.is_empty() {
                bail!("--properties needs at least one key");
            }
            ks
        }
        None => report::SCALAR_KEYS.to_vec(),
    };
    let rows =
        crate::batch::run_batch(base, &text, &keys, model, &cond).with_context(|| path.clone())?;
    let mut w = std::io::BufWriter::with_capacity(1 << 16, out);
    w.write_all(rows.as_bytes())?;
    w.flush()?;
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn numbers_print_with_ten_significant_digits() {
        assert_eq!(fmt_num(0.945_771_276_584_321), "0.9457712766");
        assert_eq!(fmt_num(101.0), "101");
        assert_eq!(fmt_num(-18.25), "-18.25");
        assert_eq!(fmt_num(0.000_123_456_789_012), "0.000123456789");
        assert_eq!(fmt_num(0.0), "0");
        assert_eq!(fmt_num(3_169.824_486_313_972), "3169.824486");
        assert_eq!(fmt_num(f64::NAN), "");
        assert_eq!(fmt_num(1.5e-7), "1.500000000e-7");
    }
}

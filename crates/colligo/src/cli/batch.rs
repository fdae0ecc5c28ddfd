//! `colligo batch`: one formula per CSV row, one result row per formula.
//!
//! Rows are evaluated with one cached evaluator per distinct set of
//! solutes, and only the requested properties are computed.

use std::io::Write as _;
use std::path::PathBuf;

use anyhow::{Context, Result, bail};
use clap::Args;
use colligo_core::composition::Composition;
use colligo_core::error::elide;
use colligo_core::keys::ScalarKey;
use colligo_core::models::ModelChoice;
use colligo_core::project::without_bom;
use colligo_core::properties::{self, Conditions, QuickEvaluator, Wanted};
use colligo_core::{Library, ModelError};

use super::options::{ConditionArgs, KeyList, ModelOption, parse_key_list};
use super::output::push_num;
use crate::csv_out;

/// Options of `batch`.
#[derive(Debug, Clone, Args)]
#[command(after_help = batch_help())]
pub struct BatchArgs {
    /// CSV files of formulas: a `name` column, then one column per ingredient id (grams)
    #[arg(value_name = "FORMULAS.csv", required = true, num_args = 1..)]
    pub files: Vec<PathBuf>,
    /// The conditions (for every row).
    #[command(flatten)]
    pub conditions: ConditionArgs,
    /// Water-activity model (for every row)
    #[arg(long, value_enum, ignore_case = true, default_value = "auto")]
    pub model: ModelOption,
    /// The columns to compute, comma-separated [default: all]
    #[arg(long, value_name = "KEYS", value_parser = parse_key_list)]
    pub properties: Option<KeyList>,
}

fn batch_help() -> String {
    let keys: Vec<&str> = ScalarKey::ALL.iter().map(|k| k.as_str()).collect();
    format!(
        "Each row of FORMULAS.csv is one formula in grams; an empty cell is none. One CSV row per \
formula goes to stdout, with the reason in the `error` column when a formula cannot be computed.\n\n\
Several files are computed one after the other, in the order given, under one header; each file \
has its own header, and with more than one file an error names the file and its line. A file \
that cannot be read, or a header that cannot be used, stops the batch with the file's name.\n\n\
Properties: {}.",
        keys.join(", ")
    )
}

/// Runs `batch`.
///
/// # Errors
/// An unreadable file, a header without a `name` column, or an unknown
/// ingredient column. Rows that fail are reported in the output.
pub fn run(a: &BatchArgs, base: &Library, out: &mut dyn std::io::Write) -> Result<()> {
    let mut cond = Conditions::default();
    a.conditions.apply(&mut cond);
    let model = ModelChoice::from(a.model);
    let keys: &[ScalarKey] = match &a.properties {
        Some(KeyList(ks)) => ks,
        None => &ScalarKey::ALL,
    };
    let mut w = std::io::BufWriter::with_capacity(1 << 16, out);
    let several = a.files.len() > 1;
    for (n, file) in a.files.iter().enumerate() {
        let path = file.display();
        let bytes = std::fs::read(file).with_context(|| format!("reading {path}"))?;
        let text = String::from_utf8(bytes).with_context(|| format!("reading {path}"))?;
        let origin = if several {
            format!("{path} line")
        } else {
            "line".to_string()
        };
        let rows = run_batch_from(base, without_bom(&text), keys, model, &cond, &origin)
            .with_context(|| path.to_string())?;
        // Every file's rows under the first file's header.
        let body = if n == 0 {
            &rows[..]
        } else {
            rows.iter()
                .position(|&b| b == b'\n')
                .map_or(&[][..], |i| &rows[i + 1..])
        };
        w.write_all(body)?;
    }
    w.flush()?;
    Ok(())
}

/// Whether a record is a blank line (one field of spaces at most).
fn blank(r: &csv::StringRecord) -> bool {
    r.len() == 1 && r.get(0).is_some_and(|f| f.trim().is_empty())
}

/// Runs a batch over the CSV `text`; returns the output CSV.
///
/// Blank lines are skipped; quoted fields may hold commas, quotes and line
/// breaks. An error row names the line its record starts on.
///
/// # Errors
/// A header that names no `name` column or an unknown ingredient.
pub fn run_batch(
    lib: &Library,
    text: &str,
    keys: &[ScalarKey],
    model: ModelChoice,
    cond: &Conditions,
) -> Result<Vec<u8>> {
    run_batch_from(lib, text, keys, model, cond, "line")
}

/// As [`run_batch`], an error row starting with `origin` and the line
/// number (`line 3`, or `b.csv line 3` when several files are computed).
fn run_batch_from(
    lib: &Library,
    text: &str,
    keys: &[ScalarKey],
    model: ModelChoice,
    cond: &Conditions,
    origin: &str,
) -> Result<Vec<u8>> {
    let mut reader = csv::ReaderBuilder::new()
        .has_headers(false)
        .flexible(true)
        .from_reader(text.as_bytes());
    let mut fields = csv::StringRecord::new();
    let header: Vec<String> = loop {
        if !reader.read_record(&mut fields)? {
            bail!("empty file");
        }
        if !blank(&fields) {
            break fields.iter().map(ToString::to_string).collect();
        }
    };
    let name_col = header
        .iter()
        .position(|h| h.trim().eq_ignore_ascii_case("name"));
    let Some(name_col) = name_col else {
        bail!("the header needs a `name` column");
    };
    let mut cols = Vec::new();
    for (i, h) in header.iter().enumerate() {
        if i == name_col {
            continue;
        }
        let id = h.trim();
        let ing = lib.ingredient_or_suggest(id)?;
        cols.push((i, ing));
    }
    let fast = keys.iter().all(|k| !k.needs_full_evaluation());
    let wanted = Wanted {
        freezing_point: keys.contains(&ScalarKey::FreezingPointC),
        boiling_point: keys.contains(&ScalarKey::BoilingPointC),
        ice_fraction: keys.contains(&ScalarKey::IceFractionOfWater),
        contributions: false,
    };
    let mut out = csv_out::builder().from_writer(Vec::with_capacity(64 * 1024));
    out.write_field("name")?;
    for k in keys {
        out.write_field(k.as_str())?;
    }
    out.write_record(["error"])?;
    let mut num = String::new();
    let mut quick = QuickEvaluator::new(lib, model, cond);
    let mut comp = Composition::new();
    let mut values: Vec<Option<f64>> = vec![None; keys.len()];
    while reader.read_record(&mut fields)? {
        if blank(&fields) {
            continue;
        }
        let lineno = fields.position().map_or(0, |p| p.line());
        let name = fields.get(name_col).map_or("", |s| s.trim());
        let row = (|| -> Result<(), String> {
            comp.water_kg = 0.0;
            comp.insoluble_kg = 0.0;
            comp.solutes.clear();
            for &(i, ing) in &cols {
                let cell = fields.get(i).map_or("", |s| s.trim());
                if cell.is_empty() {
                    continue;
                }
                let g: f64 = cell.parse().map_err(|_| {
                    format!(
                        "`{}` in column {} is not a number of grams",
                        elide(cell),
                        header[i].trim()
                    )
                })?;
                if !(g.is_finite() && g >= 0.0) {
                    return Err(format!(
                        "{} g of {} is not a mass ≥ 0",
                        elide(cell),
                        header[i].trim()
                    ));
                }
                comp.add_ingredient(lib, ing, g / 1000.0);
            }
            if comp.water_kg <= 0.0 {
                return Err(ModelError::NoWater.to_string());
            }
            if fast {
                let p = quick.evaluate(&comp).map_err(|e| e.to_string())?;
                for (v, k) in values.iter_mut().zip(keys) {
                    *v = p.read(*k);
                }
            } else {
                let p = properties::evaluate(lib, &comp, model, cond, wanted)
                    .map_err(|e| e.to_string())?;
                for (v, k) in values.iter_mut().zip(keys) {
                    *v = k.read(&p);
                }
            }
            Ok(())
        })();
        out.write_field(name)?;
        match row {
            Ok(()) => {
                for v in &values {
                    num.clear();
                    if let Some(x) = v {
                        push_num(&mut num, *x);
                    }
                    out.write_field(&num)?;
                }
                out.write_record([""])?;
            }
            Err(e) => {
                for _ in keys {
                    out.write_field("")?;
                }
                out.write_record([format!("{origin} {lineno}: {e}")])?;
            }
        }
    }
    Ok(csv_out::finish(out)?)
}

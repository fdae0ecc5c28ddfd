//! `colligo batch`: one formula per CSV row, one result row per formula.
//!
//! Rows are evaluated with one cached evaluator per distinct set of
//! solutes, and only the requested properties are computed.

use std::collections::HashMap;
use std::fmt::Write as _;

use anyhow::{Result, bail};
use colligo_core::composition::Composition;
use colligo_core::models::{CapMode, Evaluator, Model, ModelChoice};
use colligo_core::properties::{self, Conditions, Wanted};
use colligo_core::water::{self, M_W, R, T_ZERO_C};
use colligo_core::{Library, ModelError};

use crate::cli::push_num;
use crate::report;
use colligo_core::csv::{csv_field, split_csv};

/// Keys that follow from ln a_w alone (no freezing or boiling solve).
const FAST_KEYS: [&str; 10] = [
    "water_activity",
    "erh_percent",
    "vapor_pressure_pa",
    "relative_lowering",
    "osmolality_mosmol_per_kg",
    "osmotic_pressure_mpa",
    "water_percent",
    "soluble_solids_percent",
    "temperature_c",
    "storage_temperature_c",
];

/// Runs a batch over the CSV `text`; returns the output CSV.
///
/// # Errors
/// A header that names no `name` column or an unknown ingredient.
pub fn run_batch(
    lib: &Library,
    text: &str,
    keys: &[&str],
    model: ModelChoice,
    cond: &Conditions,
) -> Result<String> {
    let mut lines = text
        .lines()
        .enumerate()
        .filter(|(_, l)| !l.trim().is_empty());
    let Some((_, header)) = lines.next() else {
        bail!("empty file");
    };
    let header = split_csv(header.trim_start_matches('\u{feff}'));
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
    let fast = keys.iter().all(|k| FAST_KEYS.contains(k));
    let wanted = Wanted {
        freezing_point: keys.contains(&"freezing_point_c"),
        boiling_point: keys.contains(&"boiling_point_c"),
        ice_fraction: keys.contains(&"ice_fraction_of_water"),
        contributions: false,
    };
    let t = cond.temperature_k;
    let p_sat = water::p_sat_liquid(t);
    let rt_over_v = R * t / water::molar_volume_liquid(t) / 1e6;
    let mut out = String::with_capacity(64 * 1024);
    out.push_str("name");
    for k in keys {
        out.push(',');
        out.push_str(k);
    }
    out.push_str(",error\n");
    // One evaluator per (model, solute set); rows usually repeat the set of
    // their predecessor, which is checked without hashing.
    let mut evaluators: Vec<Evaluator<'_>> = Vec::new();
    let mut index: HashMap<(Model, Vec<usize>), usize> = HashMap::new();
    let mut last: Option<(Model, usize)> = None;
    let mut last_set: Vec<usize> = Vec::new();
    let mut set: Vec<usize> = Vec::new();
    let mut comp = Composition::new();
    let mut values: Vec<Option<f64>> = vec![None; keys.len()];
    for (lineno, line) in lines {
        let fields = split_csv(line);
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
                        "`{cell}` in column {} is not a number of grams",
                        header[i].trim()
                    )
                })?;
                if !(g.is_finite() && g >= 0.0) {
                    return Err(format!(
                        "{} g of {} is not a mass ≥ 0",
                        cell,
                        header[i].trim()
                    ));
                }
                comp.add_ingredient(lib, ing, g / 1000.0);
            }
            if comp.water_kg <= 0.0 {
                return Err(ModelError::NoWater.to_string());
            }
            if fast {
                if !(properties::T_FREEZE_MIN..=properties::T_BOIL_MAX).contains(&t) {
                    return Err(format!("temperature {:.1} °C out of range", t - T_ZERO_C));
                }
                let resolved = model.resolve(lib, &comp).model;
                set.clear();
                set.extend(
                    comp.solutes
                        .iter()
                        .filter(|s| s.mol > 0.0)
                        .map(|s| s.solute),
                );
                let slot = match last {
                    Some((m, i)) if m == resolved && set == last_set => i,
                    _ => {
                        let i = *index.entry((resolved, set.clone())).or_insert_with(|| {
                            evaluators.push(Evaluator::with_solutes(lib, &set, resolved));
                            evaluators.len() - 1
                        });
                        last = Some((resolved, i));
                        last_set.clone_from(&set);
                        i
                    }
                };
                let ev = &mut evaluators[slot];
                ev.set_composition(&comp);
                let ln_aw = ev.ln_aw(t, comp.water_kg, &CapMode::Equilibrium);
                let aw = ln_aw.exp();
                let dissolved_kg: f64 = ev
                    .components()
                    .iter()
                    .zip(ev.last_dissolved())
                    .map(|(c, d)| d * lib.solutes[c.solute].molar_mass)
                    .sum();
                let total = comp.total_kg();
                for (v, k) in values.iter_mut().zip(keys) {
                    *v = Some(match *k {
                        "water_activity" => aw,
                        "erh_percent" => 100.0 * aw,
                        "vapor_pressure_pa" => aw * p_sat,
                        "relative_lowering" => 1.0 - aw,
                        "osmolality_mosmol_per_kg" => -ln_aw / M_W * 1000.0,
                        "osmotic_pressure_mpa" => -rt_over_v * ln_aw,
                        "water_percent" => 100.0 * comp.water_kg / total,
                        "soluble_solids_percent" => {
                            100.0 * dissolved_kg / (comp.water_kg + dissolved_kg)
                        }
                        "temperature_c" => t - T_ZERO_C,
                        "storage_temperature_c" => cond.storage_temperature_k - T_ZERO_C,
                        _ => f64::NAN,
                    });
                }
            } else {
                let p = properties::evaluate(lib, &comp, model, cond, wanted)
                    .map_err(|e| e.to_string())?;
                for (v, k) in values.iter_mut().zip(keys) {
                    *v = report::scalar(&p, k);
                }
            }
            Ok(())
        })();
        out.push_str(&csv_field(if name.is_empty() { "" } else { name }));
        match row {
            Ok(()) => {
                for v in &values {
                    out.push(',');
                    if let Some(x) = v {
                        push_num(&mut out, *x);
                    }
                }
                out.push_str(",\n");
            }
            Err(e) => {
                for _ in keys {
                    out.push(',');
                }
                let _ = writeln!(out, ",{}", csv_field(&format!("line {}: {e}", lineno + 1)));
            }
        }
    }
    Ok(out)
}

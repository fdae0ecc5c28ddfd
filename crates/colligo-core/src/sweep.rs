//! Sweeps: how the properties of a formula move as one ingredient's amount
//! varies. One evaluator serves the whole sweep, and each freezing point is
//! warm-started from its neighbour.

use crate::composition::Composition;
use crate::error::{FormulaError, ModelError};
use crate::formula::{Formula, Line};
use crate::library::Library;
use crate::models::{CapMode, Evaluator, Model, ModelChoice};
use crate::properties::{self, Conditions, Properties, Wanted};
use crate::quantity::AmountUnit;
use crate::water::T_ZERO_C;

/// Errors of a sweep.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
#[non_exhaustive]
pub enum SweepError {
    /// The formula or ingredient is not usable.
    #[error(transparent)]
    Formula(#[from] FormulaError),
    /// A model evaluation failed.
    #[error(transparent)]
    Model(#[from] ModelError),
}

/// `formula` with ingredient `id` set to `kg` (its first line replaced,
/// or a line added; further lines of the same ingredient are kept).
pub fn with_amount(formula: &Formula, id: &str, kg: f64) -> Formula {
    let mut f = formula.clone();
    let line = Line {
        ingredient: id.to_string(),
        amount: kg * 1000.0,
        unit: AmountUnit::G,
    };
    match f.lines.iter().position(|l| l.ingredient == id) {
        Some(i) => f.lines[i] = line,
        None => f.lines.push(line),
    }
    f
}

/// `n` evenly spaced amounts from `from` to `to` inclusive (n ≥ 2).
pub fn linspace(from: f64, to: f64, n: usize) -> Vec<f64> {
    let n = n.max(2);
    (0..n)
        .map(|i| from + (to - from) * i as f64 / (n - 1) as f64)
        .collect()
}

/// The composition of `formula` with `id` at each amount. Without percent
/// lines the composition is linear in the amount, so the rest of the
/// formula is resolved once; with percent lines every point is resolved.
fn compositions(
    lib: &Library,
    formula: &Formula,
    id: &str,
    ing: usize,
    amounts_kg: &[f64],
) -> Result<Vec<Composition>, FormulaError> {
    let has_percent = formula.lines.iter().any(|l| l.unit == AmountUnit::Percent);
    if has_percent {
        return amounts_kg
            .iter()
            .map(|&kg| with_amount(formula, id, kg).composition(lib))
            .collect();
    }
    let mut rest = formula.clone();
    if let Some(i) = rest.lines.iter().position(|l| l.ingredient == id) {
        rest.lines.remove(i);
    }
    let base = rest.composition(lib)?;
    Ok(amounts_kg
        .iter()
        .map(|&kg| {
            let mut c = base.clone();
            c.add_ingredient(lib, ing, kg);
            c
        })
        .collect())
}

/// Quick sweeps of several ingredients, spread over the machine's cores.
///
/// # Errors
/// The first failing sweep's error.
pub fn quick_sweeps(
    lib: &Library,
    formula: &Formula,
    sweeps: &[(String, Vec<f64>)],
    model: ModelChoice,
    t_k: f64,
    with_freezing: bool,
) -> Result<Vec<QuickSweep>, SweepError> {
    let workers = std::thread::available_parallelism()
        .map_or(1, |n| n.get())
        .min(sweeps.len())
        .max(1);
    if workers == 1 {
        return sweeps
            .iter()
            .map(|(id, a)| quick_sweep(lib, formula, id, a, model, t_k, with_freezing))
            .collect();
    }
    // Contiguous chunks of the jobs, one scoped thread each; results come
    // back in order through the join handles.
    let per = sweeps.len().div_ceil(workers);
    std::thread::scope(|scope| {
        let handles: Vec<_> = sweeps
            .chunks(per)
            .map(|chunk| {
                scope.spawn(move || {
                    chunk
                        .iter()
                        .map(|(id, a)| quick_sweep(lib, formula, id, a, model, t_k, with_freezing))
                        .collect::<Vec<_>>()
                })
            })
            .collect();
        let mut out = Vec::with_capacity(sweeps.len());
        for h in handles {
            match h.join() {
                Ok(results) => out.extend(results),
                // A sweep that panicked is a bug; let it surface as one.
                Err(payload) => std::panic::resume_unwind(payload),
            }
        }
        out.into_iter().collect()
    })
}

/// a_w and freezing point along a sweep (the fast path behind the plots).
#[derive(Debug, Clone, PartialEq)]
pub struct QuickSweep {
    /// The concrete model used for every point.
    pub model: Model,
    /// Amounts of the swept ingredient, kg.
    pub amount_kg: Vec<f64>,
    /// Water activity at each amount.
    pub water_activity: Vec<f64>,
    /// Freezing point, °C (NaN where none).
    pub freezing_point_c: Vec<f64>,
}

/// Compositions of `formula` with `id` at each amount, and one evaluator
/// covering all of them (model resolved once on the richest point so that
/// the curve does not jump between models).
fn prepare<'l>(
    lib: &'l Library,
    formula: &Formula,
    id: &str,
    amounts_kg: &[f64],
    model: ModelChoice,
) -> Result<(Vec<Composition>, Evaluator<'l>), SweepError> {
    let ing = lib.ingredient_or_suggest(id).map_err(FormulaError::from)?;
    let comps = compositions(lib, formula, id, ing, amounts_kg)?;
    // The richest composition: every solute at its largest amount.
    let mut union = Composition::new();
    for c in &comps {
        union.water_kg = union.water_kg.max(c.water_kg);
        for s in c.solutes.iter().filter(|s| s.mol > 0.0) {
            if union.mol_of(s.solute) < s.mol {
                union = union.with_solute_mol(lib, s.solute, s.mol);
            }
        }
    }
    let resolved = model.resolve(lib, &union).model;
    let solutes: Vec<usize> = union.solutes.iter().map(|s| s.solute).collect();
    Ok((comps, Evaluator::with_solutes(lib, &solutes, resolved)))
}

/// a_w at `t_k` and the freezing point for each amount of ingredient `id`.
///
/// # Errors
/// Unknown ingredient, bad formula.
pub fn quick_sweep(
    lib: &Library,
    formula: &Formula,
    id: &str,
    amounts_kg: &[f64],
    model: ModelChoice,
    t_k: f64,
    with_freezing: bool,
) -> Result<QuickSweep, SweepError> {
    let (comps, mut ev) = prepare(lib, formula, id, amounts_kg, model)?;
    let mut aw = Vec::with_capacity(comps.len());
    let mut fp = Vec::with_capacity(comps.len());
    let mut warm = None;
    for c in &comps {
        ev.set_composition(c);
        if c.water_kg <= 0.0 {
            aw.push(f64::NAN);
            if with_freezing {
                fp.push(f64::NAN);
            }
            continue;
        }
        let ln_aw = ev.ln_aw(t_k, c.water_kg, &CapMode::Equilibrium);
        aw.push(ln_aw.exp());
        if with_freezing {
            let before = ev.last_dissolved().to_vec();
            match properties::freezing_point(&mut ev, &before, warm) {
                Ok(tf) => {
                    warm = Some(tf);
                    fp.push(tf - T_ZERO_C);
                }
                Err(_) => fp.push(f64::NAN),
            }
        }
    }
    Ok(QuickSweep {
        model: ev.model(),
        amount_kg: amounts_kg.to_vec(),
        water_activity: aw,
        freezing_point_c: fp,
    })
}

/// Every property for each amount of ingredient `id` (for export).
///
/// # Errors
/// Unknown ingredient, bad formula; a point whose evaluation fails gives
/// its error in place.
pub fn full_sweep(
    lib: &Library,
    formula: &Formula,
    id: &str,
    amounts_kg: &[f64],
    model: ModelChoice,
    cond: &Conditions,
) -> Result<Vec<Result<Properties, ModelError>>, SweepError> {
    lib.ingredient_or_suggest(id).map_err(FormulaError::from)?;
    amounts_kg
        .iter()
        .map(|&kg| {
            let c = with_amount(formula, id, kg).composition(lib)?;
            Ok(properties::evaluate(lib, &c, model, cond, Wanted::ALL))
        })
        .collect()
}

/// Change of a_w and of the freezing point per gram of each ingredient
/// added to (and removed from) `formula`, by central differences of
/// `step_g` grams. Sorted by the a_w change, strongest first.
#[derive(Debug, Clone, PartialEq)]
pub struct Sensitivity {
    /// Ingredient id.
    pub ingredient: String,
    /// Δa_w per gram added.
    pub aw_per_g_added: f64,
    /// Δa_w per gram removed (NaN when the line is absent or too small).
    pub aw_per_g_removed: f64,
    /// Δ freezing point (K) per gram added.
    pub fp_per_g_added: f64,
    /// Δ freezing point (K) per gram removed.
    pub fp_per_g_removed: f64,
}

/// Per-gram effects of each listed ingredient on a_w and the freezing
/// point at `cond`.
///
/// # Errors
/// Bad formula; a failing evaluation.
pub fn sensitivities(
    lib: &Library,
    formula: &Formula,
    ingredients: &[String],
    model: ModelChoice,
    cond: &Conditions,
    step_g: f64,
) -> Result<Vec<Sensitivity>, SweepError> {
    let resolved = formula.resolve(lib)?;
    let base_kg = |id: &str| resolved.kg_of(formula, id);
    let wanted = Wanted {
        freezing_point: true,
        ..Wanted::WATER_ACTIVITY
    };
    let eval = |f: &Formula| -> Result<(f64, f64), SweepError> {
        let c = f.composition(lib)?;
        let p = properties::evaluate(lib, &c, model, cond, wanted)?;
        Ok((p.water_activity, p.freezing_point_c.unwrap_or(f64::NAN)))
    };
    let (aw0, fp0) = eval(formula)?;
    let h = step_g / 1000.0;
    let mut out = Vec::new();
    for id in ingredients {
        let kg = base_kg(id);
        let (aw_up, fp_up) = eval(&with_amount(formula, id, kg + h))?;
        let (aw_dn, fp_dn) = if kg >= h {
            eval(&with_amount(formula, id, kg - h))?
        } else {
            (f64::NAN, f64::NAN)
        };
        out.push(Sensitivity {
            ingredient: id.clone(),
            aw_per_g_added: (aw_up - aw0) / step_g,
            aw_per_g_removed: (aw_dn - aw0) / step_g,
            fp_per_g_added: (fp_up - fp0) / step_g,
            fp_per_g_removed: (fp_dn - fp0) / step_g,
        });
    }
    out.sort_by(|a, b| a.aw_per_g_added.total_cmp(&b.aw_per_g_added));
    Ok(out)
}

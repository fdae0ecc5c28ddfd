//! Goal seeking: the amount of one ingredient that brings a property of a
//! formula to a target, or a clear reason why no amount can.

use std::fmt;
use std::str::FromStr;

use crate::error::{FormulaError, ModelError, compact, elide};
use crate::formula::Formula;
use crate::keys::ScalarKey;
use crate::library::Library;
use crate::models::ModelChoice;
use crate::properties::{self, Conditions, Properties, Wanted};
use crate::quantity::parse_temperature;
use crate::solver::{SolveOptions, brent};
use crate::sweep::with_amount;
use crate::water::T_ZERO_C;

/// A property and the value wanted for it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Target {
    /// Water activity.
    WaterActivity(f64),
    /// Equilibrium relative humidity, %.
    ErhPercent(f64),
    /// Freezing point, °C.
    FreezingPointC(f64),
    /// Ice fraction of the water at a storage temperature.
    IceFraction {
        /// Wanted fraction, 0–1.
        fraction: f64,
        /// Storage temperature, K.
        storage_k: f64,
    },
}

impl Target {
    /// The property's key (as in `eval --json`).
    pub fn key(&self) -> ScalarKey {
        match self {
            Target::WaterActivity(_) => ScalarKey::WaterActivity,
            Target::ErhPercent(_) => ScalarKey::ErhPercent,
            Target::FreezingPointC(_) => ScalarKey::FreezingPointC,
            Target::IceFraction { .. } => ScalarKey::IceFractionOfWater,
        }
    }

    /// The wanted value.
    pub fn value(&self) -> f64 {
        match *self {
            Target::WaterActivity(v) | Target::ErhPercent(v) | Target::FreezingPointC(v) => v,
            Target::IceFraction { fraction, .. } => fraction,
        }
    }

    /// The same kind of target with another value.
    pub fn with_value(&self, v: f64) -> Target {
        match *self {
            Target::WaterActivity(_) => Target::WaterActivity(v),
            Target::ErhPercent(_) => Target::ErhPercent(v),
            Target::FreezingPointC(_) => Target::FreezingPointC(v),
            Target::IceFraction { storage_k, .. } => Target::IceFraction {
                fraction: v,
                storage_k,
            },
        }
    }

    /// Checks that the property can take the value.
    ///
    /// # Errors
    /// [`TargetError::OutOfRange`].
    pub fn check(&self) -> Result<(), TargetError> {
        let v = self.value();
        let ok = v.is_finite()
            && match self {
                Target::WaterActivity(v) => *v > 0.0 && *v < 1.0,
                Target::ErhPercent(v) => *v > 0.0 && *v < 100.0,
                Target::FreezingPointC(v) => *v < 0.0 && *v > -60.0,
                Target::IceFraction {
                    fraction,
                    storage_k,
                } => {
                    (0.0..1.0).contains(fraction)
                        && *storage_k < T_ZERO_C
                        && *storage_k > T_ZERO_C - 60.0
                }
            };
        if ok {
            Ok(())
        } else {
            Err(TargetError::OutOfRange {
                target: self.to_string(),
            })
        }
    }

    fn conditions(&self, cond: &Conditions) -> (Conditions, Wanted) {
        let mut c = *cond;
        let w = match self {
            Target::WaterActivity(_) | Target::ErhPercent(_) => Wanted::WATER_ACTIVITY,
            Target::FreezingPointC(_) => Wanted {
                freezing_point: true,
                ..Wanted::WATER_ACTIVITY
            },
            Target::IceFraction { storage_k, .. } => {
                c.storage_temperature_k = *storage_k;
                Wanted {
                    ice_fraction: true,
                    ..Wanted::WATER_ACTIVITY
                }
            }
        };
        (c, w)
    }

    fn read(&self, p: &Properties) -> Option<f64> {
        self.key().read(p)
    }
}

impl fmt::Display for Target {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let key = self.key();
        match self {
            Target::WaterActivity(v) | Target::ErhPercent(v) | Target::FreezingPointC(v) => {
                write!(f, "{key}={}", compact(*v))
            }
            Target::IceFraction {
                fraction,
                storage_k,
            } => {
                write!(
                    f,
                    "{key}@{}C={}",
                    compact(storage_k - T_ZERO_C),
                    compact(*fraction)
                )
            }
        }
    }
}

impl FromStr for Target {
    type Err = TargetError;
    /// Reads `water_activity=0.85`, `erh_percent=80`, `freezing_point_c=-5`,
    /// `ice_fraction_of_water@-18C=0.7`.
    fn from_str(s: &str) -> Result<Self, TargetError> {
        let (key, value) = s
            .split_once('=')
            .ok_or_else(|| TargetError::NoValue { text: s.into() })?;
        let v: f64 = value
            .trim()
            .parse()
            .map_err(|_| TargetError::NotANumber { text: value.into() })?;
        let key = key.trim();
        let ice = ScalarKey::IceFractionOfWater.as_str();
        let t = match (key, key.parse::<ScalarKey>()) {
            ("aw" | "a_w", _) | (_, Ok(ScalarKey::WaterActivity)) => Target::WaterActivity(v),
            ("erh", _) | (_, Ok(ScalarKey::ErhPercent)) => Target::ErhPercent(v),
            (_, Ok(ScalarKey::FreezingPointC)) => Target::FreezingPointC(v),
            (k, _) if k.starts_with(ice) => {
                let storage = match k.split_once('@') {
                    Some((_, t)) => parse_temperature(t)?,
                    None => T_ZERO_C - 18.0,
                };
                Target::IceFraction {
                    fraction: v,
                    storage_k: storage,
                }
            }
            _ => return Err(TargetError::UnknownKey { key: key.into() }),
        };
        t.check()?;
        Ok(t)
    }
}

/// Text that is not a usable target.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
#[non_exhaustive]
pub enum TargetError {
    /// No `=value`.
    #[error("`{}`: expected property=value, e.g. water_activity=0.85", elide(.text))]
    NoValue {
        /// What was given.
        text: String,
    },
    /// The value is not a number.
    #[error("`{}` is not a number", elide(.text))]
    NotANumber {
        /// What was given.
        text: String,
    },
    /// Not a property a target can be set on.
    #[error(
        "unknown target `{}` (use water_activity, erh_percent, freezing_point_c or ice_fraction_of_water@T)",
        elide(.key)
    )]
    UnknownKey {
        /// The key given.
        key: String,
    },
    /// The storage temperature after `@` cannot be read.
    #[error(transparent)]
    Temperature(#[from] FormulaError),
    /// A value the property cannot take.
    #[error("target {target} is outside what the property can take")]
    OutOfRange {
        /// The target.
        target: String,
    },
}

/// Why a goal seek gave no amount.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
#[non_exhaustive]
pub enum GoalError {
    /// Bad formula or ingredient.
    #[error(transparent)]
    Formula(#[from] FormulaError),
    /// A model evaluation failed.
    #[error(transparent)]
    Model(#[from] ModelError),
    /// The target cannot be reached by changing this ingredient.
    #[error("{target} cannot be reached with {}: {reason}", elide(.ingredient))]
    Unreachable {
        /// The target.
        target: String,
        /// The ingredient.
        ingredient: String,
        /// Why, with the closest value reachable.
        reason: String,
        /// Closest value reached.
        best_value: f64,
        /// Amount at the closest value, kg.
        best_amount_kg: f64,
    },
    /// The target value makes no sense for the property.
    #[error(transparent)]
    BadTarget(TargetError),
}

/// A found amount.
#[derive(Debug, Clone, PartialEq)]
pub struct GoalResult {
    /// Amount of the ingredient, kg.
    pub amount_kg: f64,
    /// The formula with that amount.
    pub formula: Formula,
    /// All properties there.
    pub properties: Properties,
    /// Formula evaluations used.
    pub evaluations: usize,
}

/// Finds the amount of `ingredient` (line replaced or added) that brings
/// `target` about, searching from zero up to 100 times the batch mass.
///
/// # Errors
/// [`GoalError::Unreachable`] with the reason (the direction of the effect,
/// a solubility limit, the property not existing) and the closest value.
pub fn goal_seek(
    lib: &Library,
    formula: &Formula,
    ingredient: &str,
    target: Target,
    model: ModelChoice,
    cond: &Conditions,
) -> Result<GoalResult, GoalError> {
    target.check().map_err(GoalError::BadTarget)?;
    lib.ingredient_or_suggest(ingredient)
        .map_err(FormulaError::from)?;
    let (c, wanted) = target.conditions(cond);
    let tv = target.value();
    let mut evals = 0usize;
    let mut value_at = |kg: f64| -> Result<(Option<f64>, Properties), GoalError> {
        evals += 1;
        let comp = with_amount(formula, ingredient, kg).composition(lib)?;
        let p = properties::evaluate(lib, &comp, model, &c, wanted)?;
        Ok((target.read(&p), p))
    };
    let resolved = formula.resolve(lib)?;
    let batch = resolved.composition.total_kg().max(1e-3);
    let current = resolved.kg_of(formula, ingredient);
    // Scan amounts: 0, then geometric steps up to 100× the batch.
    let mut grid = vec![0.0];
    let mut a = (batch * 1e-3).max(1e-6);
    while a < 100.0 * batch {
        grid.push(a);
        a *= 1.6;
    }
    grid.push(100.0 * batch);
    if current > 0.0 {
        grid.push(current);
        grid.sort_by(f64::total_cmp);
        grid.dedup();
    }
    let mut prev: Option<(f64, f64)> = None;
    let mut best: Option<(f64, f64)> = None;
    let mut bracket = None;
    let mut undissolved_at_best = None;
    for &kg in &grid {
        let (v, p) = match value_at(kg) {
            Ok(x) => x,
            Err(GoalError::Model(ModelError::NoWater)) => continue,
            Err(e) => return Err(e),
        };
        let Some(v) = v else { continue };
        let d = v - tv;
        if best.is_none_or(|(_, bv): (f64, f64)| (bv - tv).abs() > d.abs()) {
            best = Some((kg, v));
            undissolved_at_best = p
                .solutes
                .iter()
                .find(|s| s.undissolved_g > 0.0)
                .map(|s| s.id.clone());
        }
        if d == 0.0 {
            bracket = Some((kg, kg, 0.0, 0.0));
            break;
        }
        if let Some((pk, pd)) = prev
            && pd.signum() != d.signum()
        {
            bracket = Some((pk, kg, pd, d));
            break;
        }
        prev = Some((kg, d));
    }
    let Some((lo, hi, flo, fhi)) = bracket else {
        let (best_kg, best_v) = best.unwrap_or((0.0, f64::NAN));
        let reason = match undissolved_at_best {
            Some(s) => format!(
                "the solubility limit of {s} comes first; the closest reachable is {} = {best_v:.4} at {:.1} g",
                target.key(),
                best_kg * 1000.0
            ),
            None if best_v.is_finite() => format!(
                "the closest reachable between 0 and {:.0} g is {} = {best_v:.4} at {:.1} g",
                100.0 * batch * 1000.0,
                target.key(),
                best_kg * 1000.0
            ),
            None => format!("the {} is not defined for any amount", target.key()),
        };
        return Err(GoalError::Unreachable {
            target: target.to_string(),
            ingredient: ingredient.to_string(),
            reason,
            best_value: best_v,
            best_amount_kg: best_kg,
        });
    };
    let amount = if lo == hi {
        lo
    } else {
        let mut err = None;
        let f = |kg: f64| match value_at(kg) {
            Ok((Some(v), _)) => v - tv,
            Ok((None, _)) => f64::NAN,
            Err(e) => {
                err = Some(e);
                f64::NAN
            }
        };
        let opts = SolveOptions {
            x_tol: 1e-9 * batch.max(1.0),
            f_tol: 1e-9 * tv.abs().max(1e-3),
            max_iter: 100,
        };
        match brent(f, lo, hi, flo, fhi, opts) {
            Ok(r) => r.x,
            Err(e) => {
                return Err(match err {
                    Some(e) => e,
                    None => GoalError::Model(ModelError::Solver {
                        property: "goal seek",
                        source: e,
                    }),
                });
            }
        }
    };
    let f = with_amount(formula, ingredient, amount);
    let comp = f.composition(lib)?;
    let mut c2 = *cond;
    if let Target::IceFraction { storage_k, .. } = target {
        c2.storage_temperature_k = storage_k;
    }
    let p = properties::evaluate(lib, &comp, model, &c2, Wanted::ALL)?;
    Ok(GoalResult {
        amount_kg: amount,
        formula: f,
        properties: p,
        evaluations: evals + 1,
    })
}

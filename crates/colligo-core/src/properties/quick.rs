//! Water activity and what follows from it directly, for many formulas in a
//! row at the same conditions (a batch): one prepared evaluator per model
//! and set of solutes, reused from row to row, no freezing or boiling solve.

use std::collections::HashMap;

use super::{Conditions, WaterAt, check_temperature, derived};
use crate::composition::Composition;
use crate::error::ModelError;
use crate::keys::ScalarKey;
use crate::library::{Library, SoluteIdx};
use crate::models::{CapMode, Evaluator, Model, ModelChoice};
use crate::water::T_ZERO_C;

/// The properties that follow from a_w, the composition and the
/// conditions alone.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct AwProperties {
    /// The concrete model used.
    pub model: Model,
    /// Water activity.
    pub water_activity: f64,
    /// Equilibrium relative humidity, %.
    pub erh_percent: f64,
    /// Partial pressure of water over the formula, Pa.
    pub vapor_pressure_pa: f64,
    /// 1 − a_w.
    pub relative_lowering: f64,
    /// Osmolality, mOsmol/kg water.
    pub osmolality_mosmol_per_kg: f64,
    /// Osmotic pressure, MPa.
    pub osmotic_pressure_mpa: f64,
    /// Water as % of batch.
    pub water_percent: f64,
    /// Dissolved solids as % of the solution.
    pub soluble_solids_percent: f64,
    /// Product temperature, °C.
    pub temperature_c: f64,
    /// Storage temperature, °C.
    pub storage_temperature_c: f64,
}

impl AwProperties {
    /// The value of `key`; `None` for the keys that need a solve beyond
    /// a_w ([`ScalarKey::needs_full_evaluation`]).
    pub fn read(&self, key: ScalarKey) -> Option<f64> {
        Some(match key {
            ScalarKey::WaterActivity => self.water_activity,
            ScalarKey::ErhPercent => self.erh_percent,
            ScalarKey::VaporPressurePa => self.vapor_pressure_pa,
            ScalarKey::RelativeLowering => self.relative_lowering,
            ScalarKey::OsmolalityMosmolPerKg => self.osmolality_mosmol_per_kg,
            ScalarKey::OsmoticPressureMpa => self.osmotic_pressure_mpa,
            ScalarKey::WaterPercent => self.water_percent,
            ScalarKey::SolubleSolidsPercent => self.soluble_solids_percent,
            ScalarKey::TemperatureC => self.temperature_c,
            ScalarKey::StorageTemperatureC => self.storage_temperature_c,
            ScalarKey::FreezingPointC
            | ScalarKey::BoilingPointC
            | ScalarKey::IceFractionOfWater => {
                return None;
            }
        })
    }
}

/// Evaluates [`AwProperties`] for one formula after another.
pub struct QuickEvaluator<'l> {
    lib: &'l Library,
    model: ModelChoice,
    cond: Conditions,
    pure: WaterAt,
    evaluators: Vec<Evaluator<'l>>,
    index: HashMap<(Model, Vec<SoluteIdx>), usize>,
    last: Option<(Model, usize)>,
    last_set: Vec<SoluteIdx>,
    set: Vec<SoluteIdx>,
}

impl<'l> QuickEvaluator<'l> {
    /// An evaluator for formulas under `model` at `cond`.
    pub fn new(lib: &'l Library, model: ModelChoice, cond: &Conditions) -> Self {
        QuickEvaluator {
            lib,
            model,
            cond: *cond,
            pure: WaterAt::new(cond.temperature_k),
            evaluators: Vec::new(),
            index: HashMap::new(),
            last: None,
            last_set: Vec::new(),
            set: Vec::new(),
        }
    }

    /// The properties of `comp`.
    ///
    /// # Errors
    /// No water; the temperature out of range.
    pub fn evaluate(&mut self, comp: &Composition) -> Result<AwProperties, ModelError> {
        let t = self.cond.temperature_k;
        check_temperature(t)?;
        if comp.water_kg <= 0.0 {
            return Err(ModelError::NoWater);
        }
        let lib = self.lib;
        let resolved = self.model.resolve(lib, comp).model;
        self.set.clear();
        self.set.extend(
            comp.solutes
                .iter()
                .filter(|s| s.mol > 0.0)
                .map(|s| s.solute),
        );
        // Rows usually repeat the solute set of their predecessor, which is
        // checked without hashing.
        let slot = match self.last {
            Some((m, i)) if m == resolved && self.set == self.last_set => i,
            _ => {
                let evaluators = &mut self.evaluators;
                let set = &self.set;
                let i = *self
                    .index
                    .entry((resolved, set.clone()))
                    .or_insert_with(|| {
                        evaluators.push(Evaluator::with_solutes(lib, set, resolved));
                        evaluators.len() - 1
                    });
                self.last = Some((resolved, i));
                self.last_set.clone_from(&self.set);
                i
            }
        };
        let ev = &mut self.evaluators[slot];
        ev.set_composition(comp);
        let ln_aw = ev.ln_aw(t, comp.water_kg, &CapMode::Equilibrium);
        let aw = ln_aw.exp();
        let dissolved_kg: f64 = ev
            .components()
            .iter()
            .zip(ev.last_dissolved())
            .map(|(c, d)| d * comp.molar_mass_of(c.solute))
            .sum();
        Ok(AwProperties {
            model: resolved,
            water_activity: aw,
            erh_percent: derived::erh_percent(aw),
            vapor_pressure_pa: self.pure.vapor_pressure_pa(aw),
            relative_lowering: derived::relative_lowering(aw),
            osmolality_mosmol_per_kg: derived::osmolality_mosmol_per_kg(ln_aw),
            osmotic_pressure_mpa: self.pure.osmotic_pressure_mpa(ln_aw),
            water_percent: derived::water_percent(comp.water_kg, comp.total_kg()),
            soluble_solids_percent: derived::soluble_solids_percent(dissolved_kg, comp.water_kg),
            temperature_c: t - T_ZERO_C,
            storage_temperature_c: self.cond.storage_temperature_k - T_ZERO_C,
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::formula::{Formula, Line};
    use crate::properties::{Wanted, evaluate};

    /// The quick path gives the full evaluation's numbers, row after row,
    /// whatever the order of solute sets.
    #[test]
    fn quick_values_equal_the_full_evaluation() {
        let lib = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        let formulas = [
            vec![Line::grams("water", 100.0), Line::grams("sucrose", 150.0)],
            vec![
                Line::grams("water", 100.0),
                Line::grams("sodium_chloride", 20.0),
            ],
            vec![Line::grams("water", 100.0), Line::grams("sucrose", 80.0)],
            vec![
                Line::grams("water", 100.0),
                Line::grams("glucose_syrup_42de", 40.0),
                Line::grams("potassium_chloride", 3.0),
            ],
        ];
        let cond = Conditions::default();
        let mut q = QuickEvaluator::new(&lib, ModelChoice::Auto, &cond);
        for lines in formulas {
            let comp = Formula::new("f", lines)
                .composition(&lib)
                .unwrap_or_else(|e| panic!("{e}"));
            let a = q.evaluate(&comp).unwrap_or_else(|e| panic!("{e}"));
            let p = evaluate(
                &lib,
                &comp,
                ModelChoice::Auto,
                &cond,
                Wanted::WATER_ACTIVITY,
            )
            .unwrap_or_else(|e| panic!("{e}"));
            assert_eq!(a.model, p.model);
            for k in ScalarKey::ALL {
                if let Some(v) = a.read(k) {
                    let w = k.read(&p).unwrap_or(f64::NAN);
                    assert!((v - w).abs() <= 1e-12 * w.abs().max(1.0), "{k}: {v} vs {w}");
                }
            }
        }
    }
}

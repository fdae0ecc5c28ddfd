//! The vapour pressure of a formula over a range of temperatures, beside
//! that of pure water: p = a_w(T) p_sat(T), amounts capped at each
//! temperature's solubility.

use super::{WaterAt, check_temperature};
use crate::composition::Composition;
use crate::error::ModelError;
use crate::library::Library;
use crate::models::{CapMode, Evaluator, ModelChoice};

/// One point of a vapour-pressure curve.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct VaporPoint {
    /// Temperature, °C.
    pub temperature_c: f64,
    /// Partial pressure of water over the formula, Pa.
    pub formula_pa: f64,
    /// Saturation pressure of pure water, Pa.
    pub water_pa: f64,
}

/// The vapour pressure of `comp` at each of `temps_c` (°C).
///
/// # Errors
/// No water; a temperature out of range.
pub fn vapor_pressure_curve(
    lib: &Library,
    comp: &Composition,
    model: ModelChoice,
    temps_c: &[f64],
) -> Result<Vec<VaporPoint>, ModelError> {
    if comp.water_kg <= 0.0 {
        return Err(ModelError::NoWater);
    }
    let temps_k: Vec<f64> = temps_c.iter().map(|t| t + crate::water::T_ZERO_C).collect();
    for &t in &temps_k {
        check_temperature(t)?;
    }
    let mut ev = Evaluator::new(lib, comp, model.resolve(lib, comp).model);
    Ok(temps_c
        .iter()
        .zip(&temps_k)
        .map(|(&tc, &tk)| {
            let aw = ev.ln_aw(tk, comp.water_kg, &CapMode::Equilibrium).exp();
            let pure = WaterAt::new(tk);
            VaporPoint {
                temperature_c: tc,
                formula_pa: pure.vapor_pressure_pa(aw),
                water_pa: pure.p_sat_pa,
            }
        })
        .collect())
}

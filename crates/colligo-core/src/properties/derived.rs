//! What follows from water activity directly, and the simple mass ratios of
//! a batch. One place for each formula, used by [`super::evaluate`] and by
//! every fast path (batch rows, sweeps, charts).
//!
//! - ERH = 100 a_w.
//! - Vapour pressure p = a_w p_sat(T); relative lowering 1 − a_w.
//! - Osmolality = −ln a_w / M_w (osmol per kg of water), reported in mOsmol/kg.
//! - Osmotic pressure Π = −R T ln a_w / V_w, with V_w the molar volume of
//!   liquid water at T.

use crate::water::{self, M_W, R};

/// Equilibrium relative humidity, %.
pub fn erh_percent(aw: f64) -> f64 {
    100.0 * aw
}

/// Relative lowering of the vapour pressure, 1 − a_w.
pub fn relative_lowering(aw: f64) -> f64 {
    1.0 - aw
}

/// Osmolality, mOsmol per kg of water, from ln a_w.
pub fn osmolality_mosmol_per_kg(ln_aw: f64) -> f64 {
    -ln_aw / M_W * 1000.0
}

/// Water as % of the batch.
pub fn water_percent(water_kg: f64, total_kg: f64) -> f64 {
    100.0 * water_kg / total_kg
}

/// Dissolved solids as % of the solution (water + dissolved), like °Brix.
pub fn soluble_solids_percent(dissolved_kg: f64, water_kg: f64) -> f64 {
    100.0 * dissolved_kg / (water_kg + dissolved_kg)
}

/// Pure water's properties at one temperature, computed once for many
/// formulas at that temperature.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct WaterAt {
    /// Temperature, K.
    pub temperature_k: f64,
    /// Saturation pressure of liquid water, Pa.
    pub p_sat_pa: f64,
    /// Molar volume of liquid water, m³/mol.
    pub molar_volume_m3_per_mol: f64,
}

impl WaterAt {
    /// Pure water at `t_k`.
    pub fn new(t_k: f64) -> Self {
        WaterAt {
            temperature_k: t_k,
            p_sat_pa: water::p_sat_liquid(t_k),
            molar_volume_m3_per_mol: water::molar_volume_liquid(t_k),
        }
    }

    /// Partial pressure of water over a solution of activity `aw`, Pa.
    pub fn vapor_pressure_pa(&self, aw: f64) -> f64 {
        aw * self.p_sat_pa
    }

    /// Osmotic pressure, MPa, from ln a_w.
    pub fn osmotic_pressure_mpa(&self, ln_aw: f64) -> f64 {
        -R * self.temperature_k * ln_aw / self.molar_volume_m3_per_mol / 1e6
    }
}

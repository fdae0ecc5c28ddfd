//! Properties of a composition, one file per property or concern:
//!
//! | file | what |
//! |---|---|
//! | `mod.rs` | [`Wanted`], [`Properties`] and [`evaluate`], which puts them together; fast [`water_activity`] |
//! | `conditions.rs` | [`Conditions`] and the one set of ranges they are checked against ([`Limits`]) |
//! | `derived.rs` | what follows from a_w directly: ERH, vapour pressure, relative lowering, osmolality, osmotic pressure; water % and soluble solids |
//! | `freezing.rs` | freezing point, ice fraction with its warm start and eutectic detection, freezing curve |
//! | `boiling.rs` | boiling point at a pressure, co-solvent partial pressure |
//! | `diagnose.rs` | warnings: solubility, and the validity of each solute's parameters under the model in use |
//! | `quick.rs` | a_w and what follows from it for many formulas in a row (batch), one cached evaluator per solute set |
//! | `spread.rs` | every model side by side and the uncertainty band of the applicable ones |
//! | `lines.rs` | each formula line's share of the batch, of the undissolved solids and of the lowering |
//! | `vapor.rs` | vapour pressure over a temperature range |
//!
//! - Vapour pressure p = a_w p_sat(T) (IAPWS; Murphy & Koop 2005 below 0.01 °C).
//! - Freezing point: the T where a_w(T) = p_ice(T)/p_liq(T).
//! - Ice fraction: the mass of ice that brings the remaining solution to ice
//!   equilibrium (freeze-concentration), solubility limits respected.
//! - Boiling point: a_w p_sat(T_b) (+ p of a volatile co-solvent) = P.
//! - Osmolality −ln a_w / M_w; osmotic pressure −R T ln a_w / V_w.

mod boiling;
mod conditions;
pub mod derived;
mod diagnose;
mod freezing;
mod lines;
mod quick;
mod spread;
mod vapor;

use serde::Serialize;

use crate::composition::Composition;
use crate::error::ModelError;
use crate::library::Library;
use crate::models::{CapMode, Evaluator, Model, ModelChoice, Role, cosolvent_pressure};
use crate::warnings::Warning;
use crate::water::T_ZERO_C;

pub use boiling::{T_BOIL_MAX, boiling_point};
pub use conditions::{Conditions, Limits, check_temperature};
pub use derived::WaterAt;
use diagnose::diagnose;
use freezing::supersaturation_warnings;
pub use freezing::{
    FreezingCurve, IcePoint, T_FREEZE_MIN, WarmStart, freezing_curve, freezing_point,
    freezing_point_with, ice_fraction, ice_temperature_for,
};
pub use lines::{LineShare, line_shares};
pub use quick::{AwProperties, QuickEvaluator};
pub use spread::{ModelResult, Spread, compare_models};
pub use vapor::{VaporPoint, vapor_pressure_curve};

/// Which properties to compute.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Wanted {
    /// Freezing point.
    pub freezing_point: bool,
    /// Boiling point.
    pub boiling_point: bool,
    /// Ice fraction at the storage temperature.
    pub ice_fraction: bool,
    /// Per-solute shares of the lowering.
    pub contributions: bool,
}

impl Wanted {
    /// Everything.
    pub const ALL: Wanted = Wanted {
        freezing_point: true,
        boiling_point: true,
        ice_fraction: true,
        contributions: true,
    };
    /// Only water activity and what follows from it directly.
    pub const WATER_ACTIVITY: Wanted = Wanted {
        freezing_point: false,
        boiling_point: false,
        ice_fraction: false,
        contributions: false,
    };
}

/// One solute in a result.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SoluteReport {
    /// Solute id.
    pub id: String,
    /// Display name.
    pub name: String,
    /// Dissolved, g.
    pub dissolved_g: f64,
    /// Not dissolved (beyond solubility), g.
    pub undissolved_g: f64,
    /// Molality of the dissolved part, mol/kg water.
    pub molality_mol_per_kg: f64,
    /// Its share of the lowering of ln a_w (sums to ln a_w over solutes).
    pub ln_aw_share: f64,
}

/// All properties of a composition under one model.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Properties {
    /// Concrete model used.
    pub model: Model,
    /// Why it was chosen (for `auto`).
    pub model_reason: String,
    /// Temperature, °C.
    pub temperature_c: f64,
    /// Pressure, Pa.
    pub pressure_pa: f64,
    /// Water activity.
    pub water_activity: f64,
    /// Equilibrium relative humidity, %.
    pub erh_percent: f64,
    /// Partial pressure of water over the formula, Pa.
    pub vapor_pressure_pa: f64,
    /// Saturation pressure of pure water at the temperature, Pa.
    pub pure_water_vapor_pressure_pa: f64,
    /// Relative lowering of the vapour pressure, 1 − a_w.
    pub relative_lowering: f64,
    /// Partial pressure of a volatile co-solvent (ethanol), Pa.
    pub cosolvent_vapor_pressure_pa: Option<f64>,
    /// Freezing point, °C.
    pub freezing_point_c: Option<f64>,
    /// Freezing-point depression, K.
    pub freezing_point_depression_k: Option<f64>,
    /// Boiling point at the pressure, °C.
    pub boiling_point_c: Option<f64>,
    /// Storage temperature for the ice fraction, °C.
    pub storage_temperature_c: f64,
    /// Ice as a fraction of all water at the storage temperature.
    pub ice_fraction_of_water: Option<f64>,
    /// Osmolality, mOsmol/kg water.
    pub osmolality_mosmol_per_kg: f64,
    /// Osmotic pressure, MPa.
    pub osmotic_pressure_mpa: f64,
    /// Batch mass, g.
    pub total_g: f64,
    /// Water, g.
    pub water_g: f64,
    /// Water as % of batch.
    pub water_percent: f64,
    /// Dissolved solids as % of the solution (water + dissolved), like °Brix.
    pub soluble_solids_percent: f64,
    /// Insoluble solids, g.
    pub insoluble_g: f64,
    /// Per solute.
    pub solutes: Vec<SoluteReport>,
    /// Warnings.
    pub warnings: Vec<Warning>,
}

/// Water activity alone (fast path): ln a_w at `t_k`, solubility-capped.
///
/// # Errors
/// No water; temperature out of range.
pub fn water_activity(
    lib: &Library,
    comp: &Composition,
    model: ModelChoice,
    t_k: f64,
) -> Result<f64, ModelError> {
    check_temperature(t_k)?;
    if comp.water_kg <= 0.0 {
        return Err(ModelError::NoWater);
    }
    let mut ev = Evaluator::new(lib, comp, model.resolve(lib, comp).model);
    Ok(ev.ln_aw(t_k, comp.water_kg, &CapMode::Equilibrium).exp())
}

/// Evaluates every property of `comp` under `model` at `cond`.
///
/// # Errors
/// No water; temperature out of range. Failures of single properties
/// (freezing or boiling point) become `None` plus a warning.
pub fn evaluate(
    lib: &Library,
    comp: &Composition,
    model: ModelChoice,
    cond: &Conditions,
    wanted: Wanted,
) -> Result<Properties, ModelError> {
    let t = cond.temperature_k;
    check_temperature(t)?;
    if comp.water_kg <= 0.0 {
        return Err(ModelError::NoWater);
    }
    // The low end of the range a project may hold, included.
    if !(cond.pressure_pa.is_finite() && cond.pressure_pa >= Limits::PRESSURE_KPA.0 * 1000.0) {
        return Err(ModelError::UnusablePressure {
            pa: cond.pressure_pa,
        });
    }
    let resolution = model.resolve(lib, comp);
    let resolved = resolution.model;
    let mut ev = Evaluator::new(lib, comp, resolved);
    let w = comp.water_kg;
    let sol = ev.solution(t, w, &CapMode::Equilibrium);
    let ln_aw = sol.ln_aw;
    let dissolved = sol.dissolved();
    let aw = ln_aw.exp();
    let pure = WaterAt::new(t);
    let mut warnings = diagnose(lib, &sol);
    let shares = if wanted.contributions {
        sol.contributions()
    } else {
        vec![0.0; dissolved.len()]
    };
    let mut solutes = Vec::new();
    let mut dissolved_kg = 0.0;
    for (i, c) in sol.solutes.iter().enumerate() {
        let s = &lib.solutes[c.solute];
        let molar_mass_kg_per_mol = comp.molar_mass_of(c.solute);
        let d_kg = dissolved[i] * molar_mass_kg_per_mol;
        dissolved_kg += d_kg;
        solutes.push(SoluteReport {
            id: s.id().to_string(),
            name: s.name().to_string(),
            dissolved_g: d_kg * 1000.0,
            undissolved_g: (c.total_mol - dissolved[i]).max(0.0) * molar_mass_kg_per_mol * 1000.0,
            molality_mol_per_kg: dissolved[i] / w,
            ln_aw_share: shares[i],
        });
    }
    let cosolvent: f64 = sol
        .solutes
        .iter()
        .filter(|c| c.role == Role::Volatile)
        .map(|c| cosolvent_pressure(lib, c.solute, c.dissolved_mol, w, t))
        .sum();
    let has_volatile = ev.has_volatile();

    let mut freezing_k = None;
    if wanted.freezing_point || wanted.ice_fraction {
        match freezing_point(&mut ev, &dissolved, None) {
            Ok(tf) => freezing_k = Some(tf),
            Err(e) => warnings.push(Warning::PropertyUnavailable {
                property: "freezing point".into(),
                reason: e.to_string(),
            }),
        }
    }
    let mut ice = None;
    if wanted.ice_fraction {
        let ts = cond.storage_temperature_k;
        if ts.is_nan() || ts < T_FREEZE_MIN {
            warnings.push(Warning::PropertyUnavailable {
                property: "ice fraction".into(),
                reason: format!(
                    "storage at {} °C is below {} °C, the coldest the ice-fraction solve covers (the ice and solution equations are not validated there)",
                    crate::error::signed(ts - T_ZERO_C),
                    crate::error::signed(T_FREEZE_MIN - T_ZERO_C)
                ),
            });
        } else {
            let mut warm = WarmStart::default();
            match ice_fraction(
                &mut ev,
                &dissolved,
                comp.total_kg(),
                ts.min(T_ZERO_C),
                &mut warm,
            ) {
                Ok(p) => {
                    if p.eutectic {
                        warnings.push(Warning::Eutectic {
                            t_c: p.temperature_c,
                        });
                    } else if p.ice_fraction_of_water > 0.0 {
                        supersaturation_warnings(
                            &mut ev,
                            &dissolved,
                            ts,
                            p.ice_fraction_of_water,
                            &mut warnings,
                        );
                    }
                    ice = Some(p.ice_fraction_of_water);
                }
                Err(e) => warnings.push(Warning::PropertyUnavailable {
                    property: "ice fraction".into(),
                    reason: e.to_string(),
                }),
            }
        }
    }
    let mut boiling = None;
    if wanted.boiling_point {
        match boiling_point(&mut ev, cond.pressure_pa, None) {
            Ok(tb) => boiling = Some(tb - T_ZERO_C),
            Err(e) => warnings.push(Warning::PropertyUnavailable {
                property: "boiling point".into(),
                reason: e.to_string(),
            }),
        }
    }
    let total = comp.total_kg();
    let props = Properties {
        model: resolved,
        model_reason: resolution.reason,
        temperature_c: t - T_ZERO_C,
        pressure_pa: cond.pressure_pa,
        water_activity: aw,
        erh_percent: derived::erh_percent(aw),
        vapor_pressure_pa: pure.vapor_pressure_pa(aw),
        pure_water_vapor_pressure_pa: pure.p_sat_pa,
        relative_lowering: derived::relative_lowering(aw),
        cosolvent_vapor_pressure_pa: has_volatile.then_some(cosolvent),
        freezing_point_c: freezing_k.map(|tf| tf - T_ZERO_C),
        freezing_point_depression_k: freezing_k.map(|tf| T_ZERO_C - tf),
        boiling_point_c: boiling,
        storage_temperature_c: cond.storage_temperature_k - T_ZERO_C,
        ice_fraction_of_water: ice,
        osmolality_mosmol_per_kg: derived::osmolality_mosmol_per_kg(ln_aw),
        osmotic_pressure_mpa: pure.osmotic_pressure_mpa(ln_aw),
        total_g: total * 1000.0,
        water_g: w * 1000.0,
        water_percent: derived::water_percent(w, total),
        soluble_solids_percent: derived::soluble_solids_percent(dissolved_kg, w),
        insoluble_g: comp.insoluble_kg * 1000.0,
        solutes,
        warnings,
    };
    props.checked()
}

impl Properties {
    /// Every number reported is a number: a water activity outside (0, 1]
    /// or a non-finite core value is an error; an optional property that
    /// came out non-finite is dropped with a warning saying so.
    fn checked(mut self) -> Result<Properties, ModelError> {
        if !(self.water_activity > 0.0 && self.water_activity <= 1.0) {
            return Err(ModelError::NotUsable {
                property: "water activity",
                value: self.water_activity,
            });
        }
        for (property, v) in [
            ("ERH", self.erh_percent),
            ("vapour pressure", self.vapor_pressure_pa),
            ("relative lowering", self.relative_lowering),
            ("osmolality", self.osmolality_mosmol_per_kg),
            ("osmotic pressure", self.osmotic_pressure_mpa),
            ("total mass", self.total_g),
            ("water", self.water_g),
            ("water content", self.water_percent),
            ("soluble solids", self.soluble_solids_percent),
        ] {
            if !v.is_finite() {
                return Err(ModelError::NotUsable { property, value: v });
            }
        }
        for (property, slot) in [
            (
                "co-solvent vapour pressure",
                &mut self.cosolvent_vapor_pressure_pa,
            ),
            ("freezing point", &mut self.freezing_point_c),
            (
                "freezing-point depression",
                &mut self.freezing_point_depression_k,
            ),
            ("boiling point", &mut self.boiling_point_c),
            ("ice fraction", &mut self.ice_fraction_of_water),
        ] {
            if let Some(v) = *slot
                && !v.is_finite()
            {
                *slot = None;
                self.warnings.push(Warning::PropertyUnavailable {
                    property: property.into(),
                    reason: format!("the model returned {v}, not a number"),
                });
            }
        }
        Ok(self)
    }
}

//! Properties of a composition: water activity, ERH, vapour pressure,
//! freezing and boiling points, ice fraction, osmolality, osmotic pressure.
//!
//! - Vapour pressure p = a_w p_sat(T) (IAPWS; Murphy & Koop 2005 below 0.01 °C).
//! - Freezing point: the T where a_w(T) = p_ice(T)/p_liq(T).
//! - Ice fraction: the mass of ice that brings the remaining solution to ice
//!   equilibrium (freeze-concentration), solubility limits respected.
//! - Boiling point: a_w p_sat(T_b) (+ p of a volatile co-solvent) = P.
//! - Osmolality −ln a_w / M_w; osmotic pressure −R T ln a_w / V_w.

use serde::Serialize;

use crate::composition::Composition;
use crate::error::{ModelError, SolverError};
use crate::library::{Library, SoluteKind};
use crate::models::binary::{WilsonBinary, antoine_pa};
use crate::models::{CapMode, Evaluator, ModelId, Role, auto_choice};
use crate::solver::{SolveOptions, solve_warm};
use crate::warnings::Warning;
use crate::water::{self, M_W, R, T_ZERO_C};

/// Lowest temperature searched for a freezing point or used for an ice
/// fraction, K (−60 °C; the ice-equilibrium equations hold far below).
pub const T_FREEZE_MIN: f64 = 213.15;
/// Highest boiling point searched, K (200 °C).
pub const T_BOIL_MAX: f64 = 473.15;

/// Conditions of an evaluation.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Conditions {
    /// Temperature of the product, K.
    pub temperature_k: f64,
    /// Ambient pressure, Pa (for the boiling point).
    pub pressure_pa: f64,
    /// Storage temperature for the ice fraction, K.
    pub storage_temperature_k: f64,
}

impl Default for Conditions {
    fn default() -> Self {
        Conditions {
            temperature_k: T_ZERO_C + 25.0,
            pressure_pa: water::P_STD,
            storage_temperature_k: T_ZERO_C - 18.0,
        }
    }
}

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
    pub model: ModelId,
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

fn check_temperature(t_k: f64) -> Result<(), ModelError> {
    let (lo, hi) = (T_FREEZE_MIN, T_BOIL_MAX);
    if t_k.is_finite() && (lo..=hi).contains(&t_k) {
        Ok(())
    } else {
        Err(ModelError::TemperatureOutOfRange {
            t_c: t_k - T_ZERO_C,
            min_c: lo - T_ZERO_C,
            max_c: hi - T_ZERO_C,
        })
    }
}

/// Water activity alone (fast path): ln a_w at `t_k`, solubility-capped.
///
/// # Errors
/// No water; temperature out of range.
pub fn water_activity(
    lib: &Library,
    comp: &Composition,
    model: ModelId,
    t_k: f64,
) -> Result<f64, ModelError> {
    check_temperature(t_k)?;
    if comp.water_kg <= 0.0 {
        return Err(ModelError::NoWater);
    }
    let mut ev = Evaluator::new(lib, comp, model);
    Ok(ev.ln_aw(t_k, comp.water_kg, &CapMode::Equilibrium).exp())
}

/// State carried between neighbouring solves to warm-start them.
#[derive(Debug, Clone, Copy, Default)]
pub struct WarmStart {
    /// Last freezing point, K.
    pub freezing_k: Option<f64>,
    /// Last boiling point, K.
    pub boiling_k: Option<f64>,
    /// Freezing point of the composition, K, when known: colder points
    /// then skip the all-liquid check.
    pub known_freezing_k: Option<f64>,
    /// Last liquid-water fraction during freezing, ln(w/W).
    pub ln_liquid: Option<f64>,
    /// Last slope of the ice-fraction equation.
    pub slope: f64,
    /// Temperature of the last ice-fraction answer, K.
    pub t_last: f64,
    /// The answer before it, `(T, ln(w/W))`, for extrapolation.
    pub prev: Option<(f64, f64)>,
    /// The answer before that.
    pub prev2: Option<(f64, f64)>,
}

/// Freezing point, K, of the composition prepared in `ev`, with `before`
/// the amounts dissolved at the product temperature.
///
/// # Errors
/// [`ModelError::Undefined`] when no ice forms above −60 °C; solver errors.
pub fn freezing_point(
    ev: &mut Evaluator<'_>,
    before: &[f64],
    warm: Option<f64>,
) -> Result<f64, ModelError> {
    freezing_point_with(ev, &CapMode::Freezing { before }, warm)
}

/// Freezing point, K, with amounts capped by `mode` at each trial temperature.
///
/// # Errors
/// As [`freezing_point`].
pub fn freezing_point_with(
    ev: &mut Evaluator<'_>,
    mode: &CapMode,
    warm: Option<f64>,
) -> Result<f64, ModelError> {
    let w = ev.water_kg;
    // First guess: the temperature where ice is in equilibrium with the
    // last computed a_w (exact for temperature-independent models), found
    // on the ice curve alone without model evaluations.
    let x0 = match warm {
        Some(t) => t,
        None => {
            let y = ev.last_ln_aw();
            if y.is_finite() && y < 0.0 {
                ice_temperature_for(y)
            } else {
                T_ZERO_C - 1.0
            }
        }
    };
    let mut g = |t: f64| ev.ln_aw(t, w, mode) - water::ice_equilibrium_ln_aw(t);
    let x0 = x0.clamp(T_FREEZE_MIN, T_ZERO_C - 1e-9);
    let slope = -water::ice_equilibrium_dln_aw_dt(x0.min(T_ZERO_C - 0.01));
    let opts = SolveOptions {
        x_tol: 1e-6,
        f_tol: 1e-12,
        max_iter: 100,
    };
    match solve_warm(&mut g, T_FREEZE_MIN, T_ZERO_C, x0, slope, opts) {
        Ok(root) => Ok(root.x),
        Err(SolverError::NoBracket { .. }) => Err(ModelError::Undefined {
            property: "freezing point",
            reason: "no ice forms above −60 °C".into(),
        }),
        Err(e) => Err(ModelError::Solver {
            property: "freezing point",
            source: e,
        }),
    }
}

/// The temperature at which ice is in equilibrium with a solution of
/// ln a_w = `y` (< 0): Newton on the ice curve alone.
pub fn ice_temperature_for(y: f64) -> f64 {
    let mut t = (T_ZERO_C + y / 0.009_69).max(T_FREEZE_MIN);
    for _ in 0..30 {
        let f = water::ice_equilibrium_ln_aw(t) - y;
        let d = water::ice_equilibrium_dln_aw_dt(t);
        let step = f / d;
        t = (t - step).clamp(T_FREEZE_MIN, T_ZERO_C - 1e-9);
        if step.abs() < 1e-10 {
            break;
        }
    }
    t
}

/// The ice fraction at one temperature.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct IcePoint {
    /// Temperature, °C.
    pub temperature_c: f64,
    /// Ice / all water.
    pub ice_fraction_of_water: f64,
    /// Ice / batch mass.
    pub ice_fraction_of_total: f64,
    /// Unfrozen (liquid) water / all water.
    pub liquid_fraction_of_water: f64,
    /// Water bound in crystal hydrates of solutes that crystallised / all water.
    pub hydrate_fraction_of_water: f64,
    /// a_w of the unfrozen solution (= ice equilibrium when ice is present).
    pub water_activity: f64,
    /// True below the eutectic (no liquid left).
    pub fully_frozen: bool,
}

/// Ice fraction at `t_k` for the composition in `ev` (amounts dissolved
/// at the product temperature in `before`).
///
/// # Errors
/// Solver failures.
pub fn ice_fraction(
    ev: &mut Evaluator<'_>,
    before: &[f64],
    total_kg: f64,
    t_k: f64,
    warm: &mut WarmStart,
) -> Result<IcePoint, ModelError> {
    let w_total = ev.water_kg;
    let mode = CapMode::Freezing { before };
    let ln_ice = water::ice_equilibrium_ln_aw(t_k);
    let t_c = t_k - T_ZERO_C;
    let below_known = warm.known_freezing_k.is_some_and(|tf| t_k < tf - 1e-6);
    let f_all_liquid = if below_known {
        1.0
    } else {
        ev.ln_aw(t_k, w_total, &mode) - ln_ice
    };
    if f_all_liquid <= 0.0 {
        return Ok(IcePoint {
            temperature_c: t_c,
            ice_fraction_of_water: 0.0,
            ice_fraction_of_total: 0.0,
            liquid_fraction_of_water: 1.0,
            hydrate_fraction_of_water: 0.0,
            water_activity: (f_all_liquid + ln_ice).exp(),
            fully_frozen: false,
        });
    }
    // When every dissolved solute can crystallise, the freeze-concentrate
    // ends at saturation in all of them; if even that liquid is above ice
    // equilibrium the eutectic has been passed and no liquid remains.
    let pure_water = before.iter().all(|&b| b <= 0.0);
    if pure_water
        || all_saturated_u(ev, before, t_k)
            .is_some_and(|u_sat| ev.ln_aw(t_k, w_total * u_sat.exp(), &mode) - ln_ice > 0.0)
    {
        let bound = ev.hydrate_water_kg(before).min(w_total);
        let ice = w_total - bound;
        warm.ln_liquid = None;
        return Ok(IcePoint {
            temperature_c: t_c,
            ice_fraction_of_water: ice / w_total,
            ice_fraction_of_total: ice / total_kg,
            liquid_fraction_of_water: 0.0,
            hydrate_fraction_of_water: bound / w_total,
            water_activity: ln_ice.exp(),
            fully_frozen: true,
        });
    }
    // ZSR can be turned around: the liquid that gives ln a_w,ice directly.
    let zsr_liquid =
        if ev.model() == ModelId::Zsr && !ev.comps.iter().any(|c| c.role == Role::Volatile) {
            ev.zsr_water_for(t_k, ln_ice, &mode)
                .filter(|w| *w > 0.0 && *w < w_total)
        } else {
            None
        };
    let liquid = match zsr_liquid {
        Some(w) => {
            let u = (w / w_total).ln();
            if let Some(u1) = warm.ln_liquid {
                warm.prev2 = warm.prev;
                warm.prev = Some((warm.t_last, u1));
            }
            warm.t_last = t_k;
            warm.ln_liquid = Some(u);
            w
        }
        None => {
            // Unknown u = ln(w / W), the liquid share of the water. f rises with u.
            let mut f = |u: f64| ev.ln_aw(t_k, w_total * u.exp(), &mode) - ln_ice;
            // Start from the neighbouring temperature's answer, extrapolated
            // linearly when two are known; secant steps from there, with Brent on
            // [1e-6 of the water, all of it] as the fallback.
            let u_floor = (1e-6f64).ln();
            let slope0 = if warm.slope > 0.0 {
                warm.slope
            } else {
                -ln_ice
            };
            let x0 = match (warm.ln_liquid, warm.prev, warm.prev2) {
                // Quadratic through the last three answers (Lagrange form).
                (Some(u2), Some((t1, u1)), Some((t0, u0)))
                    if warm.t_last != t1 && t1 != t0 && warm.t_last != t0 =>
                {
                    let t2 = warm.t_last;
                    let l0 = (t_k - t1) * (t_k - t2) / ((t0 - t1) * (t0 - t2));
                    let l1 = (t_k - t0) * (t_k - t2) / ((t1 - t0) * (t1 - t2));
                    let l2 = (t_k - t0) * (t_k - t1) / ((t2 - t0) * (t2 - t1));
                    u0 * l0 + u1 * l1 + u2 * l2
                }
                (Some(u1), Some((t0, u0)), _) if warm.t_last != t0 => {
                    u1 + (u1 - u0) * (t_k - warm.t_last) / (warm.t_last - t0)
                }
                (Some(u1), _, _) => u1,
                // Dilute-solution estimate: ln a_w scales with 1/w, so the liquid
                // share is ln a_w(all liquid) / ln a_w,ice(T).
                _ => {
                    let y_all = match warm.known_freezing_k {
                        Some(tf) => water::ice_equilibrium_ln_aw(tf),
                        None => f_all_liquid + ln_ice,
                    };
                    if y_all < 0.0 && ln_ice < 0.0 {
                        (y_all / ln_ice).ln()
                    } else {
                        -0.7
                    }
                }
            }
            .clamp(u_floor, -1e-9);
            let opts = SolveOptions {
                x_tol: 1e-7,
                f_tol: 1e-10,
                max_iter: 100,
            };
            let root = solve_warm(&mut f, u_floor, 0.0, x0, slope0, opts).map_err(|e| {
                ModelError::Solver {
                    property: "ice fraction",
                    source: e,
                }
            })?;
            if let Some(u1) = warm.ln_liquid {
                warm.prev2 = warm.prev;
                warm.prev = Some((warm.t_last, u1));
            }
            warm.t_last = t_k;
            warm.ln_liquid = Some(root.x);
            warm.slope = root.slope;
            w_total * root.x.exp()
        }
    };
    // Crystal hydrate formed above the eutectic binds water too.
    ev.dissolve(t_k, liquid, &mode);
    let bound = ev.hydrate_water_since(before);
    let ice = (w_total - liquid - bound).max(0.0);
    Ok(IcePoint {
        temperature_c: t_c,
        ice_fraction_of_water: ice / w_total,
        ice_fraction_of_total: ice / total_kg,
        liquid_fraction_of_water: liquid / w_total,
        hydrate_fraction_of_water: bound / w_total,
        water_activity: ln_ice.exp(),
        fully_frozen: false,
    })
}

/// ln(w/W) at which every dissolved solute would be at half its
/// saturation liquid, when all of them can crystallise on freezing; `None`
/// when some solute stays dissolved or has no solubility limit.
fn all_saturated_u(ev: &mut Evaluator<'_>, before: &[f64], t_k: f64) -> Option<f64> {
    ev.set_t(t_k);
    let mut w_sat = f64::INFINITY;
    let mut any = false;
    for (i, c) in ev.comps.iter().enumerate() {
        if before[i] <= 0.0 {
            continue;
        }
        let s = ev.solubility(i);
        if c.stays_dissolved_on_freezing || !s.is_finite() {
            return None;
        }
        any = true;
        // A solubility of zero (below the data, past the eutectic)
        // saturates at any amount of liquid.
        if s > 0.0 {
            w_sat = w_sat.min(before[i] / s);
        }
    }
    if !any {
        return None;
    }
    if !w_sat.is_finite() {
        return Some(0.0);
    }
    Some((0.5 * w_sat / ev.water_kg).ln().min(0.0))
}

/// Boiling point at `p_pa`, K: a_w p_sat(T) + p_cosolvent(T) = P.
///
/// # Errors
/// No boiling point below 200 °C; solver errors.
pub fn boiling_point(
    ev: &mut Evaluator<'_>,
    p_pa: f64,
    warm: Option<f64>,
) -> Result<f64, ModelError> {
    let w = ev.water_kg;
    let lib = ev.library();
    let ln_p = p_pa.ln();
    let t_pure = water::if97::t_sat(p_pa.clamp(611.3, 2.2e7));
    let volatiles: Vec<(usize, usize)> = ev
        .comps
        .iter()
        .enumerate()
        .filter(|(_, c)| c.role == Role::Volatile)
        .map(|(i, c)| (i, c.solute))
        .collect();
    // First guess from the last computed a_w: a_w p_sat(T) = P on the
    // pure-water curve (Newton, no model evaluations).
    let x0 = warm.unwrap_or_else(|| {
        let y = ev.last_ln_aw();
        let y = if y.is_finite() { y } else { 0.0 };
        let mut t = t_pure;
        for _ in 0..20 {
            let f = y + water::p_sat_liquid(t).ln() - ln_p;
            let step = f / water::dln_p_sat_liquid_dt(t);
            t = (t - step).clamp(T_FREEZE_MIN, T_BOIL_MAX);
            if step.abs() < 1e-9 {
                break;
            }
        }
        t
    });
    let mut h = |t: f64| {
        let ln_aw = ev.ln_aw(t, w, &CapMode::Equilibrium);
        let pw = ln_aw.exp() * water::p_sat_liquid(t);
        let pv: f64 = volatiles
            .iter()
            .map(|&(i, s)| cosolvent_pressure(lib, s, ev.last_dissolved()[i], w, t))
            .sum();
        (pw + pv).ln() - ln_p
    };
    let slope = water::dln_p_sat_liquid_dt(x0);
    let lo = (t_pure - 80.0).max(T_FREEZE_MIN);
    match solve_warm(
        &mut h,
        lo,
        T_BOIL_MAX,
        x0,
        slope,
        SolveOptions {
            x_tol: 1e-7,
            f_tol: 1e-12,
            max_iter: 100,
        },
    ) {
        Ok(root) => Ok(root.x),
        Err(SolverError::NoBracket { .. }) => Err(ModelError::Undefined {
            property: "boiling point",
            reason: "the solution does not boil below 200 °C at this pressure".into(),
        }),
        Err(e) => Err(ModelError::Solver {
            property: "boiling point",
            source: e,
        }),
    }
}

/// Partial pressure of a volatile co-solvent over the formula, Pa: x γ p_sat
/// with γ from its Wilson binary with water (salt-free basis).
pub fn cosolvent_pressure(lib: &Library, solute: usize, mol: f64, water_kg: f64, t_k: f64) -> f64 {
    let Some(v) = lib.solutes[solute].volatile() else {
        return 0.0;
    };
    let nw = water_kg / M_W;
    let x1 = mol / (mol + nw);
    let wb = WilsonBinary::new(v, t_k);
    x1 * wb.ln_gammas(x1).0.exp() * antoine_pa(v, t_k)
}

/// Evaluates every property of `comp` under `model` at `cond`.
///
/// # Errors
/// No water; temperature out of range. Failures of single properties
/// (freezing or boiling point) become `None` plus a warning.
pub fn evaluate(
    lib: &Library,
    comp: &Composition,
    model: ModelId,
    cond: &Conditions,
    wanted: Wanted,
) -> Result<Properties, ModelError> {
    let t = cond.temperature_k;
    check_temperature(t)?;
    if comp.water_kg <= 0.0 {
        return Err(ModelError::NoWater);
    }
    if !(cond.pressure_pa.is_finite() && cond.pressure_pa > 1000.0) {
        return Err(ModelError::Undefined {
            property: "pressure",
            reason: format!("{} Pa is not a usable ambient pressure", cond.pressure_pa),
        });
    }
    let (resolved, reason) = if model == ModelId::Auto {
        auto_choice(lib, comp)
    } else {
        (model, "chosen by the user".to_string())
    };
    let mut ev = Evaluator::new(lib, comp, resolved);
    let w = comp.water_kg;
    let ln_aw = ev.ln_aw(t, w, &CapMode::Equilibrium);
    let dissolved = ev.last_dissolved().to_vec();
    let aw = ln_aw.exp();
    let p_sat = water::p_sat_liquid(t);
    let mut warnings = diagnose(&mut ev, t, w, &dissolved, ln_aw);
    let shares = if wanted.contributions {
        ev.contributions_of(ln_aw, w, &dissolved)
    } else {
        vec![0.0; dissolved.len()]
    };
    let mut solutes = Vec::new();
    let mut dissolved_kg = 0.0;
    for (i, c) in ev.comps.iter().enumerate() {
        let s = &lib.solutes[c.solute];
        let m_kg = comp
            .solutes
            .iter()
            .find(|a| a.solute == c.solute)
            .map_or(0.0, |a| a.kg / a.mol);
        let d_kg = dissolved[i] * m_kg;
        dissolved_kg += d_kg;
        solutes.push(SoluteReport {
            id: s.id().to_string(),
            name: s.name().to_string(),
            dissolved_g: d_kg * 1000.0,
            undissolved_g: (c.mol - dissolved[i]).max(0.0) * m_kg * 1000.0,
            molality_mol_per_kg: dissolved[i] / w,
            ln_aw_share: shares[i],
        });
    }
    let cosolvent: f64 = ev
        .comps
        .iter()
        .enumerate()
        .filter(|(_, c)| c.role == Role::Volatile)
        .map(|(i, c)| cosolvent_pressure(lib, c.solute, dissolved[i], w, t))
        .sum();
    let has_volatile = ev.comps.iter().any(|c| c.role == Role::Volatile);

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
        if (T_FREEZE_MIN..=T_ZERO_C + 50.0).contains(&ts) {
            let mut warm = WarmStart::default();
            match ice_fraction(
                &mut ev,
                &dissolved,
                comp.total_kg(),
                ts.min(T_ZERO_C),
                &mut warm,
            ) {
                Ok(p) => {
                    if p.fully_frozen {
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
    let v_w = water::molar_volume_liquid(t);
    let total = comp.total_kg();
    Ok(Properties {
        model: resolved,
        model_reason: reason,
        temperature_c: t - T_ZERO_C,
        pressure_pa: cond.pressure_pa,
        water_activity: aw,
        erh_percent: 100.0 * aw,
        vapor_pressure_pa: aw * p_sat,
        pure_water_vapor_pressure_pa: p_sat,
        relative_lowering: 1.0 - aw,
        cosolvent_vapor_pressure_pa: has_volatile.then_some(cosolvent),
        freezing_point_c: freezing_k.map(|tf| tf - T_ZERO_C),
        freezing_point_depression_k: freezing_k.map(|tf| T_ZERO_C - tf),
        boiling_point_c: boiling,
        storage_temperature_c: cond.storage_temperature_k - T_ZERO_C,
        ice_fraction_of_water: ice,
        osmolality_mosmol_per_kg: -ln_aw / M_W * 1000.0,
        osmotic_pressure_mpa: -R * t * ln_aw / v_w / 1e6,
        total_g: total * 1000.0,
        water_g: w * 1000.0,
        water_percent: 100.0 * w / total,
        soluble_solids_percent: 100.0 * dissolved_kg / (w + dissolved_kg),
        insoluble_g: comp.insoluble_kg * 1000.0,
        solutes,
        warnings,
    })
}

fn supersaturation_warnings(
    ev: &mut Evaluator<'_>,
    before: &[f64],
    t_k: f64,
    ice_fraction: f64,
    out: &mut Vec<Warning>,
) {
    let liquid = ev.water_kg * (1.0 - ice_fraction);
    ev.set_t(t_k);
    for (i, c) in ev.comps.iter().enumerate() {
        if c.stays_dissolved_on_freezing && before[i] > ev.solubility(i) * liquid {
            out.push(Warning::SupersaturatedOnFreezing {
                solute: ev.library().solutes[c.solute].id().to_string(),
                t_c: t_k - T_ZERO_C,
            });
        }
    }
}

/// Validity and solubility warnings for one evaluation.
fn diagnose(
    ev: &mut Evaluator<'_>,
    t_k: f64,
    w: f64,
    dissolved: &[f64],
    ln_aw: f64,
) -> Vec<Warning> {
    let lib = ev.library();
    let ln_aw_total = ln_aw;
    let model = ev.model();
    let t_c = t_k - T_ZERO_C;
    let mut out = Vec::new();
    ev.set_t(t_k);
    let nw = w / M_W;
    let mut particles = 0.0;
    for (i, c) in ev.comps.iter().enumerate() {
        let s = &lib.solutes[c.solute];
        let id = s.id().to_string();
        particles += c.nu * dissolved[i];
        if let Some(sol) = &s.record.solubility {
            let (lo, hi) = sol.g_per_100g_water.range();
            if c.mol > dissolved[i] * (1.0 + 1e-12) {
                out.push(Warning::Undissolved {
                    solute: id.clone(),
                    undissolved_g: (c.mol - dissolved[i]) * s.molar_mass * 1000.0,
                    solubility_g_per_100g_water: sol.g_per_100g_water.eval(t_c),
                    t_c,
                });
            }
            if (t_c < lo || t_c > hi) && c.mol > 0.5 * ev.solubility(i) * w {
                out.push(Warning::SolubilityExtrapolated {
                    solute: id.clone(),
                    t_c,
                    range_c: (lo, hi),
                });
            }
        }
        let m = dissolved[i] / w;
        if let SoluteKind::Volatile(v) = &s.record.kind
            && c.mol > 0.0
            && t_c < v.wilson.partial_pressure_t_min_c - 0.5
        {
            out.push(Warning::CosolventPressureUnreliable {
                solute: id.clone(),
                t_c,
                t_min_c: v.wilson.partial_pressure_t_min_c,
            });
        }
        // Where each binary is used, and whether the solute matters enough
        // for its parameters' range to matter (≥ 5 % of the result).
        let (m_used, basis, significant) = match model {
            ModelId::Zsr => {
                let m0 = ev.zsr_molality(i).unwrap_or(m).max(m);
                let term = if m0 > 0.0 { m / m0 } else { 0.0 };
                (
                    m0,
                    "binary at the mixture's a_w (ZSR)",
                    term >= 0.05 || ev.comps.len() == 1,
                )
            }
            ModelId::Ross => {
                let share = if ln_aw_total != 0.0 {
                    ev.binary(i).ln_aw(m) / ln_aw_total
                } else {
                    1.0
                };
                (m, "own concentration (Ross)", share >= 0.05)
            }
            _ => (m, "own concentration", true),
        };
        match (model, c.role) {
            (ModelId::Ideal, _) => {}
            (ModelId::Norrish, Role::PitzerSalt | Role::IdealSalt) => out.push(Warning::TreatedAsIdeal {
                solute: id.clone(),
                model,
                why: "the Norrish equation has no constants for electrolytes; its ions are counted ideally".into(),
            }),
            (ModelId::Pitzer, Role::NonElectrolyte) => out.push(Warning::TreatedAsIdeal {
                solute: id.clone(),
                model,
                why: "no Pitzer neutral-species parameters; counted ideally (Raoult)".into(),
            }),
            (ModelId::Norrish | ModelId::Pitzer, Role::Volatile) => {
                out.push(Warning::VolatileByRoss {
                    solute: id.clone(),
                    model,
                });
                binary_validity(lib, c.solute, model, m_used, basis, significant, t_c, &mut out);
            }
            _ => binary_validity(lib, c.solute, model, m_used, basis, significant, t_c, &mut out),
        }
    }
    if model == ModelId::Ideal {
        let xs = particles / (particles + nw);
        if xs > 0.02 {
            out.push(Warning::IdealConcentrated {
                solute_mole_fraction: xs,
            });
        }
    }
    out
}

/// Validity checks of one solute's parameters at molality `m`.
#[allow(clippy::too_many_arguments)]
fn binary_validity(
    lib: &Library,
    solute: usize,
    model: ModelId,
    m: f64,
    basis: &str,
    significant: bool,
    t_c: f64,
    out: &mut Vec<Warning>,
) {
    let s = &lib.solutes[solute];
    let id = s.id().to_string();
    let kind = best_kind(lib, solute);
    if !significant && !matches!(kind, BinaryKind::Ideal) {
        return;
    }
    // The concentration and temperature ranges of the data behind the
    // parameters this solute's binary uses.
    let (concentration, t_range) = match kind {
        BinaryKind::Pitzer(pair) => {
            let p = &lib.pitzer.pairs[pair];
            (Some((m, p.max_molality, "mol/kg")), Some(p.t_range_c))
        }
        BinaryKind::Norrish => match &s.record.norrish {
            Some(n) => (
                Some((
                    m * M_W / (1.0 + m * M_W),
                    n.max_mole_fraction,
                    "mole fraction",
                )),
                Some(n.t_range_c),
            ),
            None => (None, None),
        },
        BinaryKind::Wilson => match &s.record.kind {
            SoluteKind::Volatile(v) => (
                Some((
                    m * s.molar_mass / (1.0 + m * s.molar_mass),
                    v.wilson.max_mass_fraction,
                    "mass fraction (salt-free)",
                )),
                Some(v.wilson.t_range_c),
            ),
            _ => (None, None),
        },
        BinaryKind::Ideal => {
            out.push(Warning::NoNonIdealityData { solute: id, model });
            return;
        }
    };
    if let Some((value, max, unit)) = concentration
        && value > max * (1.0 + 1e-9)
    {
        out.push(Warning::BeyondValidatedConcentration {
            solute: id.clone(),
            model,
            value,
            max,
            unit: unit.into(),
            basis: basis.into(),
        });
    }
    if let Some(range_c) = t_range
        && (t_c < range_c.0 - 0.5 || t_c > range_c.1 + 0.5)
    {
        out.push(Warning::BeyondValidatedTemperature {
            solute: id,
            model,
            t_c,
            range_c,
        });
    }
}

enum BinaryKind {
    Pitzer(usize),
    Norrish,
    Wilson,
    Ideal,
}

fn best_kind(lib: &Library, solute: usize) -> BinaryKind {
    // The same choice as `models::binary::best_binary`, read off the record.
    let s = &lib.solutes[solute];
    if s.volatile().is_some() {
        BinaryKind::Wilson
    } else if let Some(p) = s.pair {
        BinaryKind::Pitzer(p)
    } else if !s.is_electrolyte() && s.record.norrish.is_some() {
        BinaryKind::Norrish
    } else {
        BinaryKind::Ideal
    }
}

/// A freezing curve: the freezing point and the ice fraction at each
/// temperature.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct FreezingCurve {
    /// Concrete model used.
    pub model: ModelId,
    /// Freezing point, °C.
    pub freezing_point_c: Option<f64>,
    /// Points, in the order of the temperatures asked for.
    pub points: Vec<IcePoint>,
    /// Warnings (supersaturation, eutectic), once each.
    pub warnings: Vec<Warning>,
}

/// The ice fraction of `comp` at each of `temps_k`, warm-starting each
/// point from its neighbour. Amounts dissolved are those at the product
/// temperature `cond.temperature_k`.
///
/// # Errors
/// No water; temperature out of range; a failing solve.
pub fn freezing_curve(
    lib: &Library,
    comp: &Composition,
    model: ModelId,
    cond: &Conditions,
    temps_k: &[f64],
) -> Result<FreezingCurve, ModelError> {
    check_temperature(cond.temperature_k)?;
    for &t in temps_k {
        check_temperature(t)?;
    }
    if comp.water_kg <= 0.0 {
        return Err(ModelError::NoWater);
    }
    let mut ev = Evaluator::new(lib, comp, model);
    ev.ln_aw(cond.temperature_k, comp.water_kg, &CapMode::Equilibrium);
    let before = ev.last_dissolved().to_vec();
    let mut warnings = Vec::new();
    let fp = match freezing_point(&mut ev, &before, None) {
        Ok(t) => Some(t - T_ZERO_C),
        Err(e) => {
            warnings.push(Warning::PropertyUnavailable {
                property: "freezing point".into(),
                reason: e.to_string(),
            });
            None
        }
    };
    let total = comp.total_kg();
    let mut warm = WarmStart {
        known_freezing_k: fp.map(|c| c + T_ZERO_C),
        ..WarmStart::default()
    };
    let mut points = Vec::with_capacity(temps_k.len());
    let mut eutectic_noted = false;
    for &t in temps_k {
        let p = ice_fraction(&mut ev, &before, total, t.min(T_ZERO_C), &mut warm)?;
        if p.fully_frozen && !eutectic_noted {
            warnings.push(Warning::Eutectic {
                t_c: p.temperature_c,
            });
            eutectic_noted = true;
        }
        points.push(IcePoint {
            temperature_c: t - T_ZERO_C,
            ..p
        });
    }
    if let Some(coldest) = points
        .iter()
        .filter(|p| !p.fully_frozen && p.ice_fraction_of_water > 0.0)
        .min_by(|a, b| a.temperature_c.total_cmp(&b.temperature_c))
    {
        let (t, f) = (
            coldest.temperature_c + T_ZERO_C,
            coldest.ice_fraction_of_water,
        );
        supersaturation_warnings(&mut ev, &before, t, f, &mut warnings);
    }
    Ok(FreezingCurve {
        model: ev.model(),
        freezing_point_c: fp,
        points,
        warnings,
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::models::binary::{Binary, best_binary};

    /// Ethanol's Wilson fit is checked to 40 % (salt-free mass fraction) and
    /// its own partial pressure from 10 °C (the limits in its record, from
    /// the fit residuals quoted there); results beyond either say so.
    #[test]
    fn ethanol_beyond_its_fit_is_flagged() {
        let lib = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        let e = lib.solute("ethanol").unwrap_or_else(|| panic!("ethanol"));
        let mm = lib.solutes[e].molar_mass;
        let run = |ethanol_g: f64, t_c: f64| {
            let mut c = Composition::new();
            c.add_water((100.0 - ethanol_g) / 1000.0);
            c.add_solute(e, ethanol_g / 1000.0, mm);
            let cond = Conditions {
                temperature_k: T_ZERO_C + t_c,
                ..Conditions::default()
            };
            evaluate(&lib, &c, ModelId::Auto, &cond, Wanted::WATER_ACTIVITY)
                .unwrap_or_else(|err| panic!("{err}"))
                .warnings
        };
        let beyond = |w: &[Warning]| {
            w.iter()
                .any(|w| matches!(w, Warning::BeyondValidatedConcentration { solute, .. } if solute == "ethanol"))
        };
        let pressure = |w: &[Warning]| {
            w.iter()
                .any(|w| matches!(w, Warning::CosolventPressureUnreliable { .. }))
        };
        let ok = run(39.9, 25.0);
        assert!(!beyond(&ok) && !pressure(&ok), "{ok:?}");
        let strong = run(45.0, 25.0);
        assert!(beyond(&strong), "{strong:?}");
        // The same limits hold where another model folds ethanol in by Ross's rule.
        let mut c = Composition::new();
        c.add_water(0.055);
        c.add_solute(e, 0.045, mm);
        for model in [ModelId::Norrish, ModelId::Pitzer] {
            let w = evaluate(
                &lib,
                &c,
                model,
                &Conditions::default(),
                Wanted::WATER_ACTIVITY,
            )
            .unwrap_or_else(|err| panic!("{err}"))
            .warnings;
            assert!(beyond(&w), "{model}: {w:?}");
        }
        let cold = run(20.0, 4.0);
        assert!(pressure(&cold) && !beyond(&cold), "{cold:?}");
    }

    #[test]
    fn validity_checks_use_the_binary_the_models_use() {
        let lib = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        for i in 0..lib.solutes.len() {
            let same = matches!(
                (best_kind(&lib, i), best_binary(&lib, i, 298.15)),
                (BinaryKind::Pitzer(_), Binary::Pitzer(_))
                    | (BinaryKind::Norrish, Binary::Norrish { .. })
                    | (BinaryKind::Wilson, Binary::Wilson(_))
                    | (BinaryKind::Ideal, Binary::Ideal { .. })
            );
            assert!(same, "{}", lib.solutes[i].id());
        }
    }

    #[test]
    fn zsr_liquid_for_ice_equilibrium_is_a_root() {
        use crate::formula::{Formula, Line};
        let lib = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        let f = Formula::new(
            "mix",
            vec![
                Line::grams("water", 500.0),
                Line::grams("sucrose", 150.0),
                Line::grams("glycerol", 30.0),
                Line::grams("sodium_chloride", 25.0),
                Line::grams("potassium_chloride", 60.0),
                Line::grams("lactose", 30.0),
            ],
        );
        let comp = f.composition(&lib).unwrap_or_else(|e| panic!("{e}"));
        let mut ev = Evaluator::new(&lib, &comp, ModelId::Zsr);
        ev.ln_aw(298.15, comp.water_kg, &CapMode::Equilibrium);
        let before = ev.last_dissolved().to_vec();
        let mode = CapMode::Freezing { before: &before };
        for t_c in [-5.0, -10.0, -20.0, -30.0] {
            let t = T_ZERO_C + t_c;
            let y = water::ice_equilibrium_ln_aw(t);
            let w = ev
                .zsr_water_for(t, y, &mode)
                .unwrap_or_else(|| panic!("no liquid at {t_c}"));
            let back = ev.ln_aw(t, w, &mode);
            assert!((back - y).abs() < 1e-9, "{t_c} °C: {back} vs {y}");
        }
    }

    #[test]
    fn ice_temperature_inverts_the_ice_curve() {
        for y in [-0.01, -0.1, -0.3] {
            let t = ice_temperature_for(y);
            assert!((water::ice_equilibrium_ln_aw(t) - y).abs() < 1e-12, "{y}");
        }
    }
}

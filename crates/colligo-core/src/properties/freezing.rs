//! Freezing: the freezing point (the temperature where the solution's a_w
//! equals the ice-equilibrium a_w), the ice fraction at a storage
//! temperature (freeze-concentration with solubility caps, hydrates and the
//! eutectic), and the freezing curve.

use serde::Serialize;

use super::{Conditions, check_temperature};
use crate::composition::Composition;
use crate::error::{ModelError, SolverError};
use crate::library::Library;
use crate::models::{CapMode, Evaluator, Model, ModelChoice};
use crate::solver::{SolveOptions, solve_warm};
use crate::warnings::Warning;
use crate::water::{self, T_ZERO_C};

/// Lowest temperature searched for a freezing point or used for an ice
/// fraction, K (−60 °C; the ice-equilibrium equations hold far below).
pub const T_FREEZE_MIN: f64 = 213.15;

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
/// [`ModelError::NoFreezingPoint`] when no ice forms above −60 °C; solver errors.
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
    let w = ev.water_kg();
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
        Err(SolverError::NoBracket { .. }) => Err(ModelError::NoFreezingPoint {
            min_c: T_FREEZE_MIN - T_ZERO_C,
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
    /// True when no liquid is left: pure water below 0 °C, or a solution
    /// below its eutectic.
    pub fully_frozen: bool,
    /// True when a solution is below its eutectic (false for pure water,
    /// which freezes whole at its freezing point and has no eutectic).
    pub eutectic: bool,
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
    let w_total = ev.water_kg();
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
            eutectic: false,
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
        warm.ln_liquid = None;
        return Ok(frozen_solid(
            ev,
            before,
            w_total,
            total_kg,
            t_c,
            ln_ice,
            !pure_water,
        ));
    }
    // ZSR can be turned around: the liquid that gives ln a_w,ice directly.
    let zsr_liquid = if ev.model() == Model::Zsr && !ev.has_volatile() {
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
            let root = match solve_warm(&mut f, u_floor, 0.0, x0, slope0, opts) {
                Ok(root) => root,
                // Even a liquid of 1e-6 of the water is above ice
                // equilibrium: what stays liquid is a trace of a solute
                // that never crystallises (a co-solvent) in less water
                // than that. The water is frozen but for the hydrates'.
                Err(SolverError::NoBracket { f_lo, .. }) if f_lo > 0.0 => {
                    warm.ln_liquid = None;
                    return Ok(frozen_solid(
                        ev, before, w_total, total_kg, t_c, ln_ice, false,
                    ));
                }
                Err(e) => {
                    return Err(ModelError::Solver {
                        property: "ice fraction",
                        source: e,
                    });
                }
            };
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
        eutectic: false,
    })
}

/// ln(w/W) at which every dissolved solute would be at half its
/// saturation liquid, when all of them can crystallise on freezing; `None`
/// when some solute stays dissolved or has no solubility limit.
fn all_saturated_u(ev: &mut Evaluator<'_>, before: &[f64], t_k: f64) -> Option<f64> {
    ev.set_t(t_k);
    let mut w_sat = f64::INFINITY;
    let mut any = false;
    for (i, (c, &s)) in ev.components().iter().zip(ev.solubilities()).enumerate() {
        if before[i] <= 0.0 {
            continue;
        }
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
    Some((0.5 * w_sat / ev.water_kg()).ln().min(0.0))
}

pub(super) fn supersaturation_warnings(
    ev: &mut Evaluator<'_>,
    before: &[f64],
    t_k: f64,
    ice_fraction: f64,
    out: &mut Vec<Warning>,
) {
    let liquid = ev.water_kg() * (1.0 - ice_fraction);
    ev.set_t(t_k);
    for (i, (c, &s)) in ev.components().iter().zip(ev.solubilities()).enumerate() {
        if c.stays_dissolved_on_freezing && before[i] > s * liquid {
            out.push(Warning::SupersaturatedOnFreezing {
                solute: ev.library().solutes[c.solute].id().to_string(),
                t_c: t_k - T_ZERO_C,
            });
        }
    }
}

/// A freezing curve: the freezing point and the ice fraction at each
/// temperature.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct FreezingCurve {
    /// Concrete model used.
    pub model: Model,
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
    model: ModelChoice,
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
    let mut ev = Evaluator::new(lib, comp, model.resolve(lib, comp).model);
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
        if p.eutectic && !eutectic_noted {
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

/// No liquid left: all the water is ice but for what crystal hydrates bind.
fn frozen_solid(
    ev: &Evaluator<'_>,
    before: &[f64],
    w_total: f64,
    total_kg: f64,
    t_c: f64,
    ln_ice: f64,
    eutectic: bool,
) -> IcePoint {
    let bound = ev.hydrate_water_kg(before).min(w_total);
    let ice = w_total - bound;
    IcePoint {
        temperature_c: t_c,
        ice_fraction_of_water: ice / w_total,
        ice_fraction_of_total: ice / total_kg,
        liquid_fraction_of_water: 0.0,
        hydrate_fraction_of_water: bound / w_total,
        water_activity: ln_ice.exp(),
        fully_frozen: true,
        eutectic,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

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
        let mut ev = Evaluator::new(&lib, &comp, Model::Zsr);
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

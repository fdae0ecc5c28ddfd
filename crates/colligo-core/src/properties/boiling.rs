//! The boiling point at a pressure: a_w p_sat(T) (+ the partial pressure of
//! a volatile co-solvent) = P, and the co-solvent's partial pressure.

use super::T_FREEZE_MIN;
use crate::error::{ModelError, SolverError};
use crate::models::{CapMode, Evaluator, Role, cosolvent_pressure};
use crate::solver::{SolveOptions, solve_warm};
use crate::water;

/// Highest boiling point searched, K (200 °C).
pub const T_BOIL_MAX: f64 = 473.15;

/// Boiling point at `p_pa`, K: a_w p_sat(T) + p_cosolvent(T) = P.
///
/// # Errors
/// No boiling point below 200 °C; solver errors.
pub fn boiling_point(
    ev: &mut Evaluator<'_>,
    p_pa: f64,
    warm: Option<f64>,
) -> Result<f64, ModelError> {
    let w = ev.water_kg();
    let lib = ev.library();
    let ln_p = p_pa.ln();
    let t_pure = water::if97::t_sat(p_pa.clamp(611.3, 2.2e7));
    // Solutes raise the boiling point: if pure water already boils above
    // the hottest temperature searched, so does the solution.
    if t_pure.is_nan() || t_pure >= T_BOIL_MAX {
        return Err(ModelError::NoBoilingPoint {
            max_c: T_BOIL_MAX - water::T_ZERO_C,
        });
    }
    let volatiles: Vec<(usize, usize)> = ev
        .components()
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
        Err(SolverError::NoBracket { .. }) => Err(ModelError::NoBoilingPoint {
            max_c: T_BOIL_MAX - water::T_ZERO_C,
        }),
        Err(e) => Err(ModelError::Solver {
            property: "boiling point",
            source: e,
        }),
    }
}

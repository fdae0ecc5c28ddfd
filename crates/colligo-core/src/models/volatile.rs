//! A volatile co-solvent (ethanol): its Wilson (1964) binary with water,
//! multiplied into a_w by Ross's rule where the mixing model has no terms
//! for it, and its own partial pressure over the formula.

use super::Evaluator;
use super::Role;
use super::binary::{WilsonBinary, antoine_pa};
use crate::library::Library;
use crate::water::M_W;

impl Evaluator<'_> {
    /// Ross factor of the volatile components (their Wilson binaries).
    pub(super) fn volatile_ln_aw(&self, w: f64, d: &[f64]) -> f64 {
        let mut s = 0.0;
        for (i, c) in self.comps.iter().enumerate() {
            if c.role == Role::Volatile
                && let Some(wb) = &self.wilson[i]
            {
                s += wb.ln_aw(d[i] / w);
            }
        }
        s
    }
}

/// Partial pressure of a volatile co-solvent over the formula, Pa: x γ p_sat
/// with γ from its Wilson binary with water (salt-free basis); 0 for a
/// solute that is not volatile.
pub fn cosolvent_pressure(lib: &Library, solute: usize, mol: f64, water_kg: f64, t_k: f64) -> f64 {
    let Some(v) = lib.solutes[solute].volatile() else {
        return 0.0;
    };
    let nw = water_kg / M_W;
    let x1 = mol / (mol + nw);
    let wb = WilsonBinary::new(v, t_k);
    x1 * wb.ln_gammas(x1).0.exp() * antoine_pa(v, t_k)
}

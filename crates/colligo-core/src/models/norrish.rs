//! Multi-solute Norrish (Norrish 1966; Ferro Fontán & Chirife 1981):
//! ln a_w = ln x_w − (Σ ±√|K_i| x_i)², mole fractions over water and every
//! dissolved particle. Electrolytes have no Norrish constants: their ions
//! count ideally (in x_w only). A volatile co-solvent is folded in by Ross's
//! rule.

use super::{Evaluator, Role, Treatment};
use crate::water::M_W;

impl Evaluator<'_> {
    /// Ferro Fontán & Chirife: ln a_w = ln x_w − (Σ ±√|K_i| x_i)², the sign
    /// of each term that of K_i. A negative-K solute's x_i is held at the
    /// edge of its data (as in its binary), so the rule stays monotonic.
    pub(super) fn norrish(&self, w: f64, d: &[f64]) -> f64 {
        let nw = w / M_W;
        let mut particles = 0.0;
        for (i, c) in self.comps.iter().enumerate() {
            if c.role != Role::Volatile {
                particles += c.nu * d[i];
            }
        }
        let ntot = nw + particles;
        let mut sx = 0.0;
        for (i, c) in self.comps.iter().enumerate() {
            if c.role != Role::Volatile && self.signed_sqrt_k[i] != 0.0 {
                sx += self.signed_sqrt_k[i] * (d[i] / ntot).min(self.norrish_x_max[i]);
            }
        }
        // ln x_w = −ln(1 + n/n_w), written with ln_1p to keep precision at
        // infinite dilution.
        -(particles / nw).ln_1p() - sx.signum() * sx * sx + self.volatile_ln_aw(w, d)
    }
}

/// Norrish constants exist for non-electrolytes only.
pub(super) fn treatment(role: Role) -> Treatment {
    match role {
        Role::PitzerSalt | Role::IdealSalt => Treatment::TreatedAsIdeal {
            why: "the Norrish equation has no constants for electrolytes; its ions are counted ideally",
        },
        Role::Volatile => Treatment::VolatileByRoss,
        Role::NonElectrolyte => Treatment::OwnData,
    }
}

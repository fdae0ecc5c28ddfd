//! Multi-solute Norrish (Norrish 1966; Ferro Fontán & Chirife 1981):
//! ln a_w = ln x_w − (Σ √K_i x_i)², mole fractions over water and every
//! dissolved particle. Electrolytes have no Norrish constants: their ions
//! count ideally (in x_w only). A volatile co-solvent is folded in by Ross's
//! rule.
//!
//! A solute with a negative K (positive deviation from Raoult's law: urea,
//! the organic acids, PEG) has no real √K; in the squared sum its signed
//! term would cross with every positive one (−2√K_i √|K_j| x_i x_j > 0), so
//! adding it to a concentrated sugar solution could raise a_w. Each such
//! solute is therefore multiplied in with its own binary instead (Ross
//! 1975), which its data validates: ln a_w = ln x_w' − (Σ_{K>0} √K_i x_i)²
//! + Σ_{K<0} ln a_w,j°(m_j), with x_w' over water and the other particles.

use super::{Evaluator, Role, Treatment};
use crate::water::M_W;

impl Evaluator<'_> {
    /// Ferro Fontán & Chirife with negative-K solutes by Ross's rule, plus
    /// the volatile factor.
    pub(super) fn norrish(&self, w: f64, d: &[f64]) -> f64 {
        self.norrish_part(w, d, true) + self.volatile_ln_aw(w, d)
    }

    /// The Norrish part: non-electrolytes (and, when `with_ions`, the ions
    /// of every electrolyte counted ideally) in `w` kg of water, without
    /// any volatile co-solvent.
    pub(super) fn norrish_part(&self, w: f64, d: &[f64], with_ions: bool) -> f64 {
        let nw = w / M_W;
        let mut particles = 0.0;
        let mut by_ross = 0.0;
        for (i, c) in self.comps.iter().enumerate() {
            match c.role {
                Role::Volatile => {}
                Role::NonElectrolyte if self.signed_sqrt_k[i] < 0.0 => {
                    if d[i] > 0.0 {
                        by_ross += self.binaries[i].ln_aw(d[i] / w);
                    }
                }
                Role::NonElectrolyte => particles += d[i],
                Role::PitzerSalt | Role::IdealSalt if with_ions => particles += c.nu * d[i],
                Role::PitzerSalt | Role::IdealSalt => {}
            }
        }
        let ntot = nw + particles;
        let mut sx = 0.0;
        for (i, c) in self.comps.iter().enumerate() {
            if c.role == Role::NonElectrolyte && self.signed_sqrt_k[i] > 0.0 {
                sx += self.signed_sqrt_k[i] * d[i] / ntot;
            }
        }
        // Any particle added dilutes every x_i: d ln a_w/dn ∝ −1 + 2S² for
        // one counted ideally, −1 − 2S√K + 2S² for one in the sum, so the
        // rule falls with every amount only while S ≤ 1/√2. That is far
        // beyond any solute's data (sucrose alone: x = 0.28, against data
        // to 0.10); beyond it S is held at 1/√2.
        let sx = sx.min(std::f64::consts::FRAC_1_SQRT_2);
        // ln x_w = −ln(1 + n/n_w), written with ln_1p to keep precision at
        // infinite dilution.
        -(particles / nw).ln_1p() - sx * sx + by_ross
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

//! The Pitzer ion-interaction model for the osmotic coefficient of single
//! and mixed electrolytes (Pitzer 1991, Activity Coefficients in
//! Electrolyte Solutions, 2nd ed., ch. 3, eqs. 3.7–3.9 and appendix B),
//! with the unsymmetrical-mixing terms Eθ, Eθ′ (Pitzer 1975, J. Solution
//! Chem. 4:249) evaluated by Harvie's Chebyshev method (Pitzer 1991,
//! appendix B, Table B-1).
//!
//! Osmotic coefficient:
//!
//! Σm(φ − 1) = 2 [ −A_φ I^{3/2}/(1 + b√I)
//!   + Σ_c Σ_a m_c m_a (B^φ_ca + Z C_ca)
//!   + Σ_{i<j, like sign} m_i m_j (θ_ij + Eθ_ij + I Eθ′_ij)
//!   + Σ_{i<j} Σ_k m_i m_j m_k ψ_ijk ],
//!
//! B^φ = β0 + β1 e^{−α1√I} + β2 e^{−α2√I}, C = C0 + C1 e^{−ω√I}
//! (Archer 1992's extension; plain sets have C1 = 0 and C0 = Cφ/(2√|z_c z_a|)),
//! and ln a_w = −φ M_w Σm.

//!
//! | file | what |
//! |---|---|
//! | `mod.rs` | the model's arm of the evaluator and how it treats each kind of solute |
//! | `terms.rs` | A_φ(T), the Debye–Hückel term, Harvie's J and Eθ |
//! | `binary.rs` | one cation–anion pair at a temperature, and the salt alone in water |
//! | `mixture.rs` | the osmotic coefficient of a mixture of ions |

mod binary;
mod mixture;
mod terms;

pub use binary::{PairAtT, PitzerBinary};
pub use mixture::PitzerMixture;
pub use terms::{B, aphi, aphi_crp94, aphi_m88, harvie_j};

use super::{Evaluator, Role, Treatment};
use crate::water::M_W;

impl Evaluator<'_> {
    pub(super) fn pitzer(&mut self, w: f64, d: &[f64]) -> f64 {
        self.ion_m.iter_mut().for_each(|m| *m = 0.0);
        for &(ci, local, count) in &self.salt_ions {
            self.ion_m[local] += count * d[ci] / w;
        }
        let (phi, sum) = self.pitzer.phi(&self.ion_m);
        // Solutes without Pitzer parameters count ideally (Raoult, in the
        // mole-fraction form their own binary uses).
        let mut ideal = 0.0;
        for (i, c) in self.comps.iter().enumerate() {
            if matches!(c.role, Role::NonElectrolyte | Role::IdealSalt) {
                ideal += c.nu * d[i] / w;
            }
        }
        -M_W * phi * sum - (M_W * ideal).ln_1p() + self.volatile_ln_aw(w, d)
    }
}

/// Pitzer parameters exist for ion pairs; neutral solutes count ideally, a
/// volatile co-solvent is folded in by Ross's rule.
pub(super) fn treatment(role: Role) -> Treatment {
    match role {
        Role::NonElectrolyte => Treatment::TreatedAsIdeal {
            why: "no Pitzer neutral-species parameters; counted ideally (Raoult)",
        },
        Role::Volatile => Treatment::VolatileByRoss,
        Role::PitzerSalt | Role::IdealSalt => Treatment::OwnData,
    }
}

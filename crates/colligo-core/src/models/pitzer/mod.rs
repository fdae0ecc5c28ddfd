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

use super::binary::Binary;
use super::{Evaluator, Role, Treatment};
use crate::water::M_W;

impl Evaluator<'_> {
    pub(super) fn pitzer(&mut self, w: f64, d: &[f64]) -> f64 {
        self.pitzer_part(w, d, true) + self.volatile_ln_aw(w, d)
    }

    /// The Pitzer part: the ions of the electrolytes (and, when
    /// `with_neutrals`, the non-electrolytes counted ideally) in `w` kg of
    /// water, without any volatile co-solvent.
    ///
    /// Within the data (Σ_j m_j / m_max,j ≤ 1 over the salts, so every salt
    /// is within its own fit) the equations are used as they stand. Beyond
    /// it they are not: a mixture held at its edge along its own ray would
    /// let a salt with a short range (K₂HPO₄ to 1 mol/kg) pull a salt at
    /// its edge (MgCl₂ near saturation) back to a lower φ, and a_w would
    /// rise as salt is added. Beyond the data each salt keeps its own
    /// binary held at its edge, mixed by ZSR (monotonic in every amount),
    /// scaled by the ratio of the full Pitzer mixture to ZSR at the edge of
    /// the data on the same ray, so the two meet there.
    pub(super) fn pitzer_part(&mut self, w: f64, d: &[f64], with_neutrals: bool) -> f64 {
        let mut f = 0.0;
        let mut ideal = 0.0;
        for (i, c) in self.comps.iter().enumerate() {
            match c.role {
                Role::PitzerSalt => {
                    if let Binary::Pitzer(p) = &self.binaries[i] {
                        f += d[i] / w / p.m_max;
                    }
                }
                // Solutes without Pitzer parameters count ideally (Raoult,
                // in the mole-fraction form their own binary uses).
                Role::IdealSalt => ideal += c.nu * d[i] / w,
                Role::NonElectrolyte if with_neutrals => ideal += c.nu * d[i] / w,
                Role::NonElectrolyte | Role::Volatile => {}
            }
        }
        let salts = if f <= 1.0 {
            self.pitzer_equations(w, d)
        } else {
            let edge = self.pitzer_equations(w * f, d);
            let z_edge = self.salt_zsr(w * f, d);
            let z = self.salt_zsr(w, d);
            if z_edge < 0.0 { z * edge / z_edge } else { z }
        };
        salts - (M_W * ideal).ln_1p()
    }

    /// −φ M_w Σm of the Pitzer salts' ions in `w` kg of water.
    fn pitzer_equations(&mut self, w: f64, d: &[f64]) -> f64 {
        self.ion_m.iter_mut().for_each(|m| *m = 0.0);
        for &(ci, local, count) in &self.salt_ions {
            self.ion_m[local] += count * d[ci] / w;
        }
        let (phi, sum) = self.pitzer.phi(&self.ion_m);
        -M_W * phi * sum
    }

    /// ZSR over the Pitzer salts alone (their binaries held at their
    /// edges) in `w` kg of water.
    fn salt_zsr(&mut self, w: f64, d: &[f64]) -> f64 {
        let mut only = std::mem::take(&mut self.masked);
        only.clear();
        only.extend(
            self.comps
                .iter()
                .zip(d)
                .map(|(c, &n)| if c.role == Role::PitzerSalt { n } else { 0.0 }),
        );
        let y = self.zsr(w, &only);
        self.masked = only;
        y
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

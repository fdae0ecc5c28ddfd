//! Ideal (Raoult) with dissociation: a_w = x_w, every dissolved particle
//! counted (Raoult 1887). No solute data is used, so no solute's ranges
//! apply; on a concentrated solution the properties code warns instead.

use super::{Evaluator, Role, Treatment};
use crate::water::M_W;

impl Evaluator<'_> {
    pub(super) fn ideal(&self, w: f64, d: &[f64]) -> f64 {
        let nw = w / M_W;
        let n: f64 = self.comps.iter().zip(d).map(|(c, n)| c.nu * n).sum();
        -(n / nw).ln_1p()
    }
}

/// The ideal model uses no solute data.
pub(super) fn treatment(_role: Role) -> Treatment {
    Treatment::Ideal
}

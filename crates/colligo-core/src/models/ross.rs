//! Ross (1975): a_w = Π a_w,i°(m_i), each solute's binary a_w at its
//! molality in all of the mixture's water.

use super::{Evaluator, Role, Treatment};

impl Evaluator<'_> {
    pub(super) fn ross(&self, w: f64, d: &[f64]) -> f64 {
        self.binaries
            .iter()
            .zip(d)
            .map(|(b, n)| b.ln_aw(n / w))
            .sum()
    }
}

/// Every solute enters with its own binary.
pub(super) fn treatment(_role: Role) -> Treatment {
    Treatment::OwnData
}

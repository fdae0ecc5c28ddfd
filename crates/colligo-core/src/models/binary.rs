//! Binary (one solute + water) water-activity curves: the building blocks
//! of Ross's and the Zdanovskii-Stokes-Robinson mixing rules, and each
//! solute's "best" model on its own.
//!
//! Every binary gives ln a_w and d ln a_w/dm at a molality m (mol of solute
//! per kg of water), and the inverse m(ln a_w) by safeguarded Newton.

use super::pitzer::PitzerBinary;
use crate::library::{Library, VolatileRecord};
use crate::water::{M_W, R};

/// Which curve a binary uses.
#[derive(Debug, Clone)]
pub enum Binary {
    /// Raoult's law with ν particles per formula unit:
    /// ln a_w = −ln(1 + ν m M_w).
    Ideal {
        /// Particles per formula unit.
        nu: f64,
    },
    /// Norrish (1966): ln a_w = ln(1 − x) − K x², x = m M_w/(1 + m M_w).
    /// A negative K makes the curve turn back up at high x; beyond the data
    /// (x > `x_max`) the excess term is held at its edge value, so the
    /// curve goes on falling like Raoult's law.
    Norrish {
        /// K at the current temperature.
        k: f64,
        /// Highest mole fraction of the data behind K.
        x_max: f64,
    },
    /// Pitzer single salt.
    Pitzer(PitzerBinary),
    /// Wilson (1964) for a volatile co-solvent.
    Wilson(WilsonBinary),
}

impl Binary {
    /// ln a_w and its derivative with respect to m.
    #[inline]
    pub fn ln_aw_dm(&self, m: f64) -> (f64, f64) {
        match self {
            Binary::Ideal { nu } => {
                let u = 1.0 + nu * m * M_W;
                (-u.ln(), -nu * M_W / u)
            }
            Binary::Norrish { k, x_max } => {
                let u = 1.0 + m * M_W;
                let x = m * M_W / u;
                let dx = M_W / (u * u);
                if *k < 0.0 && x > *x_max {
                    (-u.ln() - k * x_max * x_max, -u * dx)
                } else {
                    (-u.ln() - k * x * x, (-u - 2.0 * k * x) * dx)
                }
            }
            Binary::Pitzer(p) => pitzer_ln_aw_dm(p, m),
            Binary::Wilson(w) => {
                let h = 1e-7 * (1.0 + m);
                let f = w.ln_aw(m);
                (f, (w.ln_aw(m + h) - f) / h)
            }
        }
    }

    /// ln a_w at molality m.
    #[inline]
    pub fn ln_aw(&self, m: f64) -> f64 {
        match self {
            Binary::Ideal { nu } => -(nu * m * M_W).ln_1p(),
            Binary::Norrish { k, x_max } => {
                let u = 1.0 + m * M_W;
                let x = m * M_W / u;
                let xe = if *k < 0.0 { x.min(*x_max) } else { x };
                -u.ln() - k * xe * xe
            }
            Binary::Pitzer(p) => p.ln_aw(m),
            Binary::Wilson(w) => w.ln_aw(m),
        }
    }

    /// Molality at which this binary has ln a_w = `y` (< 0), starting from
    /// `guess`. Returns `(m, d ln a_w/dm at m)`; `None` when the curve does
    /// not reach `y` below `m_max` (it turns back up, or stays above `y`).
    pub fn molality_at(&self, y: f64, guess: f64, m_max: f64) -> Option<(f64, f64)> {
        if y >= 0.0 {
            return Some((0.0, self.ln_aw_dm(0.0).1));
        }
        if let Binary::Ideal { nu } = self {
            let m = (-y).exp_m1() / (nu * M_W);
            return Some((m, -nu * M_W / (1.0 + nu * m * M_W)));
        }
        let (mut lo, mut hi) = (0.0_f64, m_max);
        let mut checked_max = false;
        let mut m = if guess.is_finite() && guess > 0.0 && guess < m_max {
            guess
        } else {
            ((-y).exp_m1() / M_W).min(0.5 * m_max)
        };
        for _ in 0..80 {
            let (f, df) = self.ln_aw_dm(m);
            let r = f - y;
            if r.abs() <= 1e-14 * (1.0 + y.abs()) {
                return Some((m, df));
            }
            if r > 0.0 {
                lo = m;
            } else {
                hi = m;
            }
            let mut next = m - r / df;
            if !(df < 0.0 && next > lo && next < hi) {
                if !checked_max && hi == m_max {
                    if self.ln_aw(m_max) > y {
                        return None;
                    }
                    checked_max = true;
                }
                next = 0.5 * (lo + hi);
            }
            if hi - lo <= 1e-15 * hi {
                return Some((next, self.ln_aw_dm(next).1));
            }
            m = next;
        }
        let (f, df) = self.ln_aw_dm(m);
        ((f - y).abs() < 1e-9).then_some((m, df))
    }
}

/// ln a_w and d/dm for a Pitzer binary (analytic, Pitzer 1991 ch. 3).
#[inline]
fn pitzer_ln_aw_dm(p: &PitzerBinary, m: f64) -> (f64, f64) {
    p.ln_aw_dm(m)
}

/// Wilson (1964) activity of water in a co-solvent (1) + water (2) binary,
/// Λ12 = (V2/V1) exp(−a12/RT), Λ21 = (V1/V2) exp(−a21/RT):
/// ln γ2 = −ln(x2 + Λ21 x1) − x1 [Λ12/(x1 + Λ12 x2) − Λ21/(x2 + Λ21 x1)].
#[derive(Debug, Clone, Copy)]
pub struct WilsonBinary {
    l12: f64,
    l21: f64,
}

impl WilsonBinary {
    /// Parameters at `t_k`.
    pub fn new(rec: &VolatileRecord, t_k: f64) -> Self {
        let w = &rec.wilson;
        let v1 = w.v_solute_cm3_per_mol;
        let v2 = w.v_water_cm3_per_mol;
        WilsonBinary {
            l12: v2 / v1 * (-w.a12_j_per_mol.eval(t_k, 0.1) / (R * t_k)).exp(),
            l21: v1 / v2 * (-w.a21_j_per_mol.eval(t_k, 0.1) / (R * t_k)).exp(),
        }
    }

    /// (ln γ1, ln γ2) at co-solvent mole fraction x1.
    pub fn ln_gammas(&self, x1: f64) -> (f64, f64) {
        let x2 = 1.0 - x1;
        let d1 = x1 + self.l12 * x2;
        let d2 = x2 + self.l21 * x1;
        let t = self.l12 / d1 - self.l21 / d2;
        (-d1.ln() + x2 * t, -d2.ln() - x1 * t)
    }

    /// ln a_w at co-solvent molality m.
    pub fn ln_aw(&self, m: f64) -> f64 {
        let x1 = m * M_W / (1.0 + m * M_W);
        (1.0 - x1).ln() + self.ln_gammas(x1).1
    }
}

/// Vapour pressure of a pure volatile co-solvent, Pa (Antoine).
pub fn antoine_pa(rec: &VolatileRecord, t_k: f64) -> f64 {
    let a = &rec.antoine;
    10f64.powf(a.a - a.b / (t_k + a.c)) * 1000.0
}

/// Builds the binary of a library solute at `t_k`: Pitzer for a
/// parameterised salt, Norrish where K exists, Wilson for a volatile,
/// otherwise Raoult with dissociation.
pub fn best_binary(lib: &Library, solute: usize, t_k: f64) -> Binary {
    let s = &lib.solutes[solute];
    if let Some(v) = s.volatile() {
        return Binary::Wilson(WilsonBinary::new(v, t_k));
    }
    if let Some(mut b) = PitzerBinary::for_solute(lib, solute) {
        b.set_t(lib, t_k);
        return Binary::Pitzer(b);
    }
    if !s.is_electrolyte()
        && let Some(n) = &s.record.norrish
    {
        return Binary::Norrish {
            k: n.k_at(t_k),
            x_max: n.max_mole_fraction,
        };
    }
    Binary::Ideal { nu: s.nu }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn inverse_round_trips() {
        for b in [
            Binary::Ideal { nu: 2.0 },
            Binary::Norrish {
                k: 6.47,
                x_max: 0.1,
            },
            Binary::Norrish {
                k: -1.0,
                x_max: 0.1,
            },
            Binary::Norrish {
                k: -2.85,
                x_max: 0.05,
            },
        ] {
            for m in [0.01, 0.5, 2.0, 5.0] {
                let y = b.ln_aw(m);
                let (m2, _) = b.molality_at(y, 1.0, 100.0).unwrap_or((f64::NAN, 0.0));
                assert!((m2 - m).abs() < 1e-9 * m.max(1.0), "{b:?} {m} {m2}");
            }
        }
    }

    #[test]
    fn negative_k_binary_keeps_falling_beyond_its_data() {
        let b = Binary::Norrish {
            k: -2.85,
            x_max: 0.05,
        };
        let mut last = 0.0;
        for i in 1..200 {
            let m = 0.2 * f64::from(i);
            let (f, d) = b.ln_aw_dm(m);
            assert!(f < last && d < 0.0, "m = {m}");
            last = f;
        }
    }

    #[test]
    fn norrish_derivative_matches_finite_difference() {
        let b = Binary::Norrish {
            k: 6.47,
            x_max: 0.1,
        };
        let (_, d) = b.ln_aw_dm(1.3);
        let h = 1e-6;
        let fd = (b.ln_aw(1.3 + h) - b.ln_aw(1.3 - h)) / (2.0 * h);
        assert!((d - fd).abs() < 1e-8);
    }
}

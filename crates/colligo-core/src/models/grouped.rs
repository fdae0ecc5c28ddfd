//! Groups joined by the Zdanovskii-Stokes-Robinson rule: the non-electrolytes
//! together under multi-solute Norrish, the electrolytes together under
//! Pitzer, and the two sub-solutions mixed isopiestically (Zdanovskii 1948;
//! Stokes & Robinson 1966), as Clegg, Seinfeld & Brimblecombe (2001,
//! J. Aerosol Sci. 32:713; recalled from memory) join an electrolyte model
//! and an organic model. A volatile co-solvent is folded in by Ross's rule.
//!
//! The water divides into w₁ + w₂ = w so that each group alone in its share
//! has the same a_w: g₁(w₁) = g₂(w₂) = ln a_w. Each g rises with its water,
//! so the split is one bracketed root. With one group empty the rule is
//! that group's model exactly, which makes `auto` continuous as a solute of
//! a new kind goes from zero upward.

use super::{Evaluator, Role, Treatment};

impl Evaluator<'_> {
    pub(super) fn grouped(&mut self, w: f64, d: &[f64]) -> f64 {
        let mut n_ne = 0.0;
        let mut n_el = 0.0;
        for (i, c) in self.comps.iter().enumerate() {
            match c.role {
                Role::NonElectrolyte => n_ne += d[i],
                Role::PitzerSalt | Role::IdealSalt => n_el += c.nu * d[i],
                Role::Volatile => {}
            }
        }
        let volatile = self.volatile_ln_aw(w, d);
        let y = if n_el <= 0.0 {
            self.group_share(w, w, d, None);
            self.norrish_part(w, d, false)
        } else if n_ne <= 0.0 {
            self.group_share(w, w, d, None);
            self.pitzer_part(w, d, false)
        } else {
            let u = self.group_split(w, d, (n_ne / n_el).ln());
            let w1 = w / (1.0 + (-u).exp());
            let w2 = w / (1.0 + u.exp());
            self.group_share(w1, w2, d, Some(u));
            self.norrish_part(w1, d, false)
        };
        y + volatile
    }

    /// h(u) = g₁(w₁) − g₂(w₂) with w₁ = w/(1 + e^−u), w₂ = w/(1 + e^u): rises
    /// with u from −∞ to +∞.
    fn group_gap(&mut self, w: f64, d: &[f64], u: f64) -> f64 {
        let w1 = w / (1.0 + (-u).exp());
        let w2 = w / (1.0 + u.exp());
        self.norrish_part(w1, d, false) - self.pitzer_part(w2, d, false)
    }

    /// The root u = ln(w₁/w₂), from the last one (or `guess`, the ideal
    /// split in proportion to the particles) by a bracketed Illinois
    /// regula falsi.
    fn group_split(&mut self, w: f64, d: &[f64], guess: f64) -> f64 {
        let u0 = self.group_warm.filter(|u| u.is_finite()).unwrap_or(guess);
        let h0 = self.group_gap(w, d, u0);
        if h0 == 0.0 || !h0.is_finite() {
            return u0;
        }
        // Bracket: step away from u0 against the sign of h, doubling.
        let dir = -h0.signum();
        let (mut a, mut fa) = (u0, h0);
        let mut step = 0.25;
        let (mut b, mut fb);
        loop {
            b = a + dir * step;
            fb = self.group_gap(w, d, b);
            if fb.signum() != fa.signum() || step > 1e3 {
                break;
            }
            (a, fa) = (b, fb);
            step *= 2.0;
        }
        if fb.signum() == fa.signum() {
            return b;
        }
        let mut side = 0;
        for _ in 0..100 {
            let c = (a * fb - b * fa) / (fb - fa);
            let fc = self.group_gap(w, d, c);
            if fc.abs() < 1e-14 || (b - a).abs() < 1e-13 {
                self.group_warm = Some(c);
                return c;
            }
            if fc.signum() == fb.signum() {
                (b, fb) = (c, fc);
                if side == -1 {
                    fa *= 0.5;
                }
                side = -1;
            } else {
                (a, fa) = (c, fc);
                if side == 1 {
                    fb *= 0.5;
                }
                side = 1;
            }
        }
        let c = 0.5 * (a + b);
        self.group_warm = Some(c);
        c
    }

    /// Records each solute's molality in its group's water (read by the
    /// validity warnings, as ZSR's m_i° are).
    fn group_share(&mut self, w1: f64, w2: f64, d: &[f64], u: Option<f64>) {
        if u.is_none() {
            self.group_warm = None;
        }
        for (i, c) in self.comps.iter().enumerate() {
            self.zsr_m[i] = match c.role {
                _ if d[i] <= 0.0 => f64::NAN,
                Role::NonElectrolyte => d[i] / w1,
                Role::PitzerSalt | Role::IdealSalt => d[i] / w2,
                Role::Volatile => f64::NAN,
            };
        }
    }
}

/// Each group's model treats its own solutes with their data.
pub(super) fn treatment(role: Role) -> Treatment {
    match role {
        Role::NonElectrolyte => super::norrish::treatment(role),
        Role::PitzerSalt | Role::IdealSalt => super::pitzer::treatment(role),
        Role::Volatile => Treatment::VolatileByRoss,
    }
}

//! Zdanovskii-Stokes-Robinson (Stokes & Robinson 1966): Σ m_i / m_i°(a_w) = 1,
//! with m_i° the molality of solute i's own binary at the mixture's a_w;
//! solved for a_w, and turned around for the liquid water at a given a_w
//! (the ice fraction).

use super::{CapMode, Component, Evaluator, Role, Treatment};

impl Evaluator<'_> {
    /// ZSR: solve Σ m_i / m_i°(y) = 1 with b_i(m_i°) = y for y = ln a_w.
    ///
    /// All n + 1 unknowns (y and every m_i°) are solved together by Newton's
    /// method on the arrow-shaped system r_i = b_i(m_i°) − y = 0,
    /// G = Σ m_i/m_i° − 1 = 0, which costs one binary evaluation per solute
    /// per iteration. Start: Ross's rule for y and m_i° = m_i y / b_i(m_i).
    /// If Newton stalls, the nested solve ([`super::binary::Binary::molality_at`] inside a
    /// bracketed outer iteration) takes over.
    pub(super) fn zsr(&mut self, w: f64, d: &[f64]) -> f64 {
        let n = self.comps.len();
        let active = (0..n).filter(|&i| d[i] > 0.0).count();
        if active <= 1 {
            return (0..n)
                .filter(|&i| d[i] > 0.0)
                .map(|i| self.binaries[i].ln_aw(d[i] / w))
                .sum();
        }
        // Warm start: the last solution's y and m_i° still satisfy every
        // b_i(m_i°) = y (they do not depend on the composition), so from a
        // neighbouring composition only Σ m_i/m_i° = 1 is off and Newton
        // needs two or three steps.
        let warm = self.zsr_warm.is_some()
            && (0..n).all(|i| d[i] <= 0.0 || (self.zsr_m[i].is_finite() && self.zsr_m[i] > 0.0));
        let mut y;
        if warm {
            y = self.zsr_warm.unwrap_or(0.0);
        } else {
            y = 0.0;
            for i in 0..n {
                let m = d[i] / w;
                if m > 0.0 {
                    let bi = self.binaries[i].ln_aw(m);
                    self.zsr_m[i] = bi; // temporarily b_i(m_i)
                    y += bi;
                }
            }
            for i in 0..n {
                let m = d[i] / w;
                if m > 0.0 {
                    let bi = self.zsr_m[i];
                    self.zsr_m[i] = if bi < 0.0 {
                        m * y / bi
                    } else {
                        m * active as f64
                    };
                }
            }
        }
        self.zsr_warm = None;
        for _ in 0..30 {
            let mut g = -1.0;
            let mut num = 0.0;
            let mut den = 0.0;
            let mut worst_r: f64 = 0.0;
            for i in 0..n {
                let m = d[i] / w;
                if m <= 0.0 {
                    continue;
                }
                let mu = self.zsr_m[i];
                let (b, db) = self.binaries[i].ln_aw_dm(mu);
                let r = b - y;
                worst_r = worst_r.max(r.abs());
                g += m / mu;
                let c = m / (mu * mu * db);
                num += c * r;
                den += c;
                // Keep r_i and b_i' for the update below.
                self.scratch.push((i, r, db));
            }
            if g.abs() < 1e-13 && worst_r < 1e-13 {
                self.scratch.clear();
                self.zsr_warm = Some(y);
                return y;
            }
            let dy = (g + num) / den;
            if !dy.is_finite() || den == 0.0 {
                self.scratch.clear();
                break;
            }
            // Damp the step so that y stays < 0 and every m_i° > 0.
            let mut lam: f64 = 1.0;
            if y + dy >= 0.0 {
                lam = 0.5 * y / -dy;
            }
            for &(i, r, db) in &self.scratch {
                let full = (dy - r) / db;
                let mu = self.zsr_m[i];
                if mu + lam * full <= 0.0 {
                    lam = 0.5 * mu / -full;
                }
            }
            y += lam * dy;
            for &(i, r, db) in &self.scratch {
                self.zsr_m[i] += lam * (dy - r) / db;
            }
            // Newton converges quadratically: from residuals this small a
            // full step leaves an error of order their square (~1e-10 in
            // ln a_w, far below any measurement).
            if lam == 1.0 && g.abs() < 1e-5 && worst_r < 1e-5 {
                self.scratch.clear();
                self.zsr_warm = Some(y);
                return y;
            }
            self.scratch.clear();
            if !y.is_finite() {
                break;
            }
        }
        let y = self.zsr_nested(w, d);
        self.zsr_warm = y.is_finite().then_some(y);
        y
    }

    /// The nested ZSR solve: bracketed Newton on y with each m_i° found by
    /// safeguarded Newton. Slower, but robust where the coupled Newton
    /// stalls (binaries turning back at extreme molality).
    pub(super) fn zsr_nested(&mut self, w: f64, d: &[f64]) -> f64 {
        let n = self.comps.len();
        let mut y: f64 = 0.0;
        let mut active = 0;
        for i in 0..n {
            let m = d[i] / w;
            if m > 0.0 {
                active += 1;
                y += self.binaries[i].ln_aw(m);
            }
        }
        for i in 0..n {
            let m = d[i] / w;
            if m > 0.0 {
                let yi = self.binaries[i].ln_aw(m);
                self.zsr_m[i] = if yi < 0.0 {
                    m * y / yi
                } else {
                    m * active as f64
                };
            }
        }
        let (mut lo, mut hi) = (f64::NEG_INFINITY, 0.0_f64);
        for _ in 0..200 {
            let mut g = -1.0;
            let mut dg = 0.0;
            let mut ok = true;
            for i in 0..n {
                let m = d[i] / w;
                if m <= 0.0 {
                    continue;
                }
                match self.binaries[i].molality_at(y, self.zsr_m[i], 1.0e4) {
                    Some((m0, dlna_dm)) if m0 > 0.0 => {
                        self.zsr_m[i] = m0;
                        g += m / m0;
                        dg += -m / (m0 * m0) / dlna_dm;
                    }
                    _ => {
                        ok = false;
                        break;
                    }
                }
            }
            if !ok {
                // Some binary cannot reach y: y is too low.
                lo = y;
                y = 0.5 * (lo + hi);
                continue;
            }
            if g > 0.0 {
                hi = y;
            } else {
                lo = y;
            }
            if g.abs() < 1e-13 {
                return y;
            }
            let mut next = y - g / dg;
            if !(next > lo && next < hi && next.is_finite()) {
                next = if lo.is_finite() {
                    0.5 * (lo + hi)
                } else {
                    2.0 * y - 1e-12
                };
            }
            if (next - y).abs() < 1e-15 * y.abs().max(1e-12) {
                return next;
            }
            y = next;
        }
        y
    }

    /// ZSR turned around: the liquid water (kg) in which the solutes
    /// available under `mode` give ln a_w = `y` at `t_k`. With every binary
    /// molality m_i°(y) known, Σ n_i / (w m_i°) = 1 gives w directly;
    /// solutes that crystallise are handled by an active set (those at
    /// saturation contribute s_i w / m_i°). `None` when no amount of liquid
    /// reaches `y` (past a eutectic) or a binary cannot reach `y`.
    pub fn zsr_water_for(&mut self, t_k: f64, y: f64, mode: &CapMode<'_>) -> Option<f64> {
        self.set_t(t_k);
        let n = self.comps.len();
        let mut m0 = vec![0.0; n];
        let mut avail = vec![0.0; n];
        for i in 0..n {
            let c = &self.comps[i];
            avail[i] = match mode {
                CapMode::Equilibrium | CapMode::Unlimited => c.mol,
                CapMode::Freezing { before } => before[i],
            };
            if avail[i] <= 0.0 {
                continue;
            }
            let guess = self.zsr_m[i];
            let (m, _) = self.binaries[i].molality_at(y, guess, 1.0e4)?;
            if m <= 0.0 {
                return None;
            }
            m0[i] = m;
        }
        // Which solutes may be capped by solubility at this temperature.
        let cappable = |c: &Component| match mode {
            CapMode::Unlimited => false,
            CapMode::Freezing { .. } => !c.stays_dissolved_on_freezing,
            CapMode::Equilibrium => true,
        };
        let mut capped = vec![false; n];
        let mut w = 0.0;
        for _ in 0..=n {
            let mut num = 0.0;
            let mut den = 1.0;
            for i in 0..n {
                if avail[i] <= 0.0 {
                    continue;
                }
                if capped[i] {
                    den -= self.solubility[i] / m0[i];
                } else {
                    num += avail[i] / m0[i];
                }
            }
            if den <= 0.0 {
                return None;
            }
            w = num / den;
            let mut changed = false;
            for i in 0..n {
                if avail[i] <= 0.0 || !cappable(&self.comps[i]) || !self.solubility[i].is_finite() {
                    continue;
                }
                let over = avail[i] > self.solubility[i] * w;
                if over != capped[i] {
                    capped[i] = over;
                    changed = true;
                }
            }
            if !changed {
                break;
            }
        }
        for i in 0..n {
            if avail[i] > 0.0 {
                self.zsr_m[i] = m0[i];
            }
        }
        self.zsr_warm = Some(y);
        (w.is_finite() && w > 0.0).then_some(w)
    }
}

/// Every solute enters with its own binary, read at m_i°.
pub(super) fn treatment(_role: Role) -> Treatment {
    Treatment::OwnData
}

//! One cation–anion pair: its parameters at a temperature, and the salt
//! alone in water (the binary that Ross's and the ZSR rules build on).

use super::terms::{B, aphi, dh};
use crate::library::{IonIdx, Library, PairRecord, ThirdVirial};
use crate::water::M_W;

/// Parameters of one cation–anion pair at a temperature.
#[derive(Debug, Clone, Copy, Default)]
pub struct PairAtT {
    /// β0.
    pub b0: f64,
    /// β1.
    pub b1: f64,
    /// β2.
    pub b2: f64,
    /// α1.
    pub a1: f64,
    /// α2.
    pub a2: f64,
    /// C0 (= Cφ / (2√|z_c z_a|) for plain sets).
    pub c0: f64,
    /// C1.
    pub c1: f64,
    /// ω.
    pub omega: f64,
}

impl PairAtT {
    /// Evaluates a pair record at `t_k` (pressure effects neglected: 0.1 MPa).
    pub fn new(rec: &PairRecord, zc: f64, za: f64, t_k: f64) -> Self {
        let p = 0.101_325;
        let (c0, c1, omega) = match &rec.c {
            ThirdVirial::CPhi(f) => (f.eval(t_k, p) / (2.0 * (zc * za).abs().sqrt()), 0.0, 0.0),
            ThirdVirial::C0C1 { c0, c1, omega } => (c0.eval(t_k, p), c1.eval(t_k, p), *omega),
        };
        PairAtT {
            b0: rec.beta0.eval(t_k, p),
            b1: rec.beta1.eval(t_k, p),
            b2: rec.beta2.eval(t_k, p),
            a1: rec.alpha1,
            a2: rec.alpha2,
            c0,
            c1,
            omega,
        }
    }

    /// B^φ + Z C at √I = `s`.
    #[inline]
    pub(super) fn bphi_zc(&self, s: f64, z: f64) -> f64 {
        let mut v = self.b0 + self.b1 * (-self.a1 * s).exp();
        if self.b2 != 0.0 {
            v += self.b2 * (-self.a2 * s).exp();
        }
        let c = if self.c1 != 0.0 {
            self.c0 + self.c1 * (-self.omega * s).exp()
        } else {
            self.c0
        };
        v + z * c
    }
}

/// One salt of a single cation and a single anion, for binary (Ross, ZSR)
/// use: ln a_w of the salt alone in water at molality m.
#[derive(Debug, Clone)]
pub struct PitzerBinary {
    /// Pair record index.
    pub pair: usize,
    /// Cation charge.
    pub zc: f64,
    /// Anion charge (negative).
    pub za: f64,
    /// Cations per formula unit.
    pub nc: f64,
    /// Anions per formula unit.
    pub na: f64,
    /// Highest molality of the data; beyond it φ is held at its edge value.
    pub m_max: f64,
    at: PairAtT,
    aphi: f64,
    t: f64,
}

impl PitzerBinary {
    /// A binary for the library pair `pair` with ion counts.
    pub fn new(
        lib: &Library,
        pair: usize,
        cation: IonIdx,
        anion: IonIdx,
        nc: f64,
        na: f64,
    ) -> Self {
        PitzerBinary {
            pair,
            zc: lib.ions[cation].z,
            za: lib.ions[anion].z,
            nc,
            na,
            m_max: lib.pitzer.pairs[pair].max_molality,
            at: PairAtT::default(),
            aphi: 0.0,
            t: f64::NAN,
        }
    }

    /// The binary of a library salt with one cation and one anion that
    /// has Pitzer parameters (`None` otherwise). Call [`Self::set_t`] before use.
    pub fn for_solute(lib: &Library, solute: usize) -> Option<Self> {
        let s = &lib.solutes[solute];
        let pair = s.pair?;
        let (c, nc) = s.ions.iter().copied().find(|(i, _)| lib.ions[*i].z > 0.0)?;
        let (a, na) = s.ions.iter().copied().find(|(i, _)| lib.ions[*i].z < 0.0)?;
        Some(Self::new(lib, pair, c, a, nc, na))
    }

    /// Re-evaluates the temperature-dependent parameters when `t_k` changed.
    pub fn set_t(&mut self, lib: &Library, t_k: f64) {
        if self.t != t_k {
            self.at = PairAtT::new(&lib.pitzer.pairs[self.pair], self.zc, self.za, t_k);
            self.aphi = aphi(t_k);
            self.t = t_k;
        }
    }

    /// Sets the temperature-dependent values directly (shared with a
    /// [`PitzerMixture`] that already evaluated them at `t_k`).
    pub fn set_values(&mut self, at: PairAtT, aphi: f64, t_k: f64) {
        self.at = at;
        self.aphi = aphi;
        self.t = t_k;
    }

    /// Osmotic coefficient at molality `m` (mol of salt per kg water).
    #[inline]
    pub fn phi(&self, m: f64) -> f64 {
        if m <= 0.0 {
            return 1.0;
        }
        let mc = self.nc * m;
        let ma = self.na * m;
        let i = 0.5 * (mc * self.zc * self.zc + ma * self.za * self.za);
        let z = mc * self.zc.abs() + ma * self.za.abs();
        let s = i.sqrt();
        let sum = mc + ma;
        1.0 + 2.0 * (dh(self.aphi, i, s) + mc * ma * self.at.bphi_zc(s, z)) / sum
    }

    /// ln a_w at molality `m`. Beyond the data (m > `m_max`) the osmotic
    /// coefficient is held at its value at `m_max`, so that the binary stays
    /// monotonic when a mixing rule reaches far past it.
    #[inline]
    pub fn ln_aw(&self, m: f64) -> f64 {
        let phi = self.phi(m.min(self.m_max));
        -phi * M_W * (self.nc + self.na) * m
    }

    /// ln a_w and d ln a_w/dm at molality `m`, analytically:
    /// ln a_w = −M_w [ν m + 2 (DH(I) + m_c m_a (B^φ + Z C))], with I, Z, m_c,
    /// m_a all proportional to m.
    #[inline]
    pub fn ln_aw_dm(&self, m: f64) -> (f64, f64) {
        let nu = self.nc + self.na;
        if m <= 0.0 {
            return (0.0, -M_W * nu);
        }
        if m > self.m_max {
            let phi = self.phi(self.m_max);
            return (-phi * M_W * nu * m, -phi * M_W * nu);
        }
        let ki = 0.5 * (self.nc * self.zc * self.zc + self.na * self.za * self.za);
        let kz = self.nc * self.zc.abs() + self.na * self.za.abs();
        let kca = self.nc * self.na;
        let i = ki * m;
        let s = i.sqrt();
        let z = kz * m;
        let at = &self.at;
        // Debye–Hückel term and its derivative in I.
        let den = 1.0 + B * s;
        let dh = -self.aphi * i * s / den;
        let ddh_di = -self.aphi * (1.5 * s + B * i) / (den * den);
        // B^φ + Z C and its derivative in m (ds/dm = ki / (2 s)).
        let e1 = (-at.a1 * s).exp();
        let e2 = if at.b2 != 0.0 {
            (-at.a2 * s).exp()
        } else {
            0.0
        };
        let ew = if at.c1 != 0.0 {
            (-at.omega * s).exp()
        } else {
            0.0
        };
        let c = at.c0 + at.c1 * ew;
        let x = at.b0 + at.b1 * e1 + at.b2 * e2 + z * c;
        let ds_dm = ki / (2.0 * s);
        let dx_dm =
            (-at.a1 * at.b1 * e1 - at.a2 * at.b2 * e2 - z * at.omega * at.c1 * ew) * ds_dm + kz * c;
        let mm = kca * m * m;
        let f = nu * m + 2.0 * (dh + mm * x);
        let df = nu + 2.0 * (ddh_di * ki + 2.0 * kca * m * x + mm * dx_dm);
        (-M_W * f, -M_W * df)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn binary_derivative_matches_finite_difference() {
        let lib = crate::Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        for id in [
            "sodium_chloride",
            "calcium_chloride",
            "sodium_sulfate",
            "magnesium_chloride",
        ] {
            let Some(mut b) = PitzerBinary::for_solute(&lib, lib.solute(id).unwrap_or(0)) else {
                continue;
            };
            b.set_t(&lib, 290.0);
            for m in [0.01, 0.3, 1.0, 3.0] {
                let h = 1e-6 * m;
                let fd = (b.ln_aw(m + h) - b.ln_aw(m - h)) / (2.0 * h);
                let (f, d) = b.ln_aw_dm(m);
                assert!((f - b.ln_aw(m)).abs() < 1e-14, "{id} {m}");
                assert!(
                    (d - fd).abs() < 1e-7 * fd.abs().max(1.0),
                    "{id} {m}: {d} vs {fd}"
                );
            }
        }
    }
}

//! A mixture of ions for the full Pitzer model: the osmotic coefficient with
//! θ, ψ and the unsymmetrical Eθ terms.

use super::binary::PairAtT;
use super::terms::{aphi, dh, etheta_phi};
use crate::library::{IonIdx, Library};

/// A mixture of ions for the full Pitzer model.
#[derive(Debug, Clone, Default)]
pub struct PitzerMixture {
    /// Library ion of each local ion.
    pub ions: Vec<IonIdx>,
    z: Vec<f64>,
    /// `(local cation, local anion, pair record)`.
    pairs: Vec<(usize, usize, usize)>,
    /// Like-sign pairs `(i, j, θ record if any, unsymmetrical)`.
    likes: Vec<(usize, usize, Option<usize>, bool)>,
    /// `(i, j, k, ψ record)`.
    psis: Vec<(usize, usize, usize, usize)>,
    // Temperature-dependent values.
    t: f64,
    aphi: f64,
    pair_at: Vec<PairAtT>,
    theta_at: Vec<f64>,
    psi_at: Vec<f64>,
}

impl PitzerMixture {
    /// Builds the interaction lists for the given library ions.
    pub fn new(lib: &Library, ions: Vec<IonIdx>) -> Self {
        let z: Vec<f64> = ions.iter().map(|&i| lib.ions[i].z).collect();
        let mut pairs = Vec::new();
        let mut likes = Vec::new();
        let mut psis = Vec::new();
        let n = ions.len();
        for c in 0..n {
            for a in 0..n {
                if z[c] > 0.0
                    && z[a] < 0.0
                    && let Some(&p) = lib.pitzer.pair_index.get(&(ions[c], ions[a]))
                {
                    pairs.push((c, a, p));
                }
            }
        }
        for i in 0..n {
            for j in (i + 1)..n {
                if z[i].signum() != z[j].signum() {
                    continue;
                }
                let key = (ions[i].min(ions[j]), ions[i].max(ions[j]));
                let theta = lib.pitzer.theta.get(&key).copied();
                let unsym = z[i] != z[j];
                if theta.is_some() || unsym {
                    likes.push((i, j, theta, unsym));
                }
                for k in 0..n {
                    if z[k].signum() == z[i].signum() {
                        continue;
                    }
                    if let Some(&p) = lib.pitzer.psi.get(&(key.0, key.1, ions[k])) {
                        psis.push((i, j, k, p));
                    }
                }
            }
        }
        PitzerMixture {
            ions,
            z,
            pair_at: vec![PairAtT::default(); pairs.len()],
            theta_at: vec![0.0; likes.len()],
            psi_at: vec![0.0; psis.len()],
            pairs,
            likes,
            psis,
            t: f64::NAN,
            aphi: 0.0,
        }
    }

    /// Number of local ions.
    pub fn len(&self) -> usize {
        self.ions.len()
    }

    /// True when there are no ions.
    pub fn is_empty(&self) -> bool {
        self.ions.is_empty()
    }

    /// Re-evaluates temperature-dependent parameters when `t_k` changed.
    pub fn set_t(&mut self, lib: &Library, t_k: f64) {
        if self.t == t_k {
            return;
        }
        let p = 0.101_325;
        self.aphi = aphi(t_k);
        for (v, &(c, a, rec)) in self.pair_at.iter_mut().zip(&self.pairs) {
            *v = PairAtT::new(&lib.pitzer.pairs[rec], self.z[c], self.z[a], t_k);
        }
        for (v, &(_, _, rec, _)) in self.theta_at.iter_mut().zip(&self.likes) {
            *v = rec.map_or(0.0, |r| lib.pitzer.thetas[r].theta.eval(t_k, p));
        }
        for (v, &(_, _, _, rec)) in self.psi_at.iter_mut().zip(&self.psis) {
            *v = lib.pitzer.psis[rec].psi.eval(t_k, p);
        }
        self.t = t_k;
    }

    /// A_φ at the current temperature.
    pub fn aphi_now(&self) -> f64 {
        self.aphi
    }

    /// The values of library pair `rec` at the current temperature, when
    /// this mixture has that pair.
    pub fn pair_now(&self, rec: usize) -> Option<PairAtT> {
        self.pairs
            .iter()
            .position(|p| p.2 == rec)
            .map(|i| self.pair_at[i])
    }

    /// `(φ, Σm)` for ion molalities `m` (local order), as the equations
    /// give it; the evaluator decides what to do beyond the data
    /// ([`super::super::Evaluator`]'s Pitzer arm).
    pub fn phi(&self, m: &[f64]) -> (f64, f64) {
        let mut i = 0.0;
        let mut zsum = 0.0;
        let mut sum = 0.0;
        for (mi, zi) in m.iter().zip(&self.z) {
            i += mi * zi * zi;
            zsum += mi * zi.abs();
            sum += mi;
        }
        if sum <= 0.0 {
            return (1.0, 0.0);
        }
        (self.phi_scaled(m, 1.0, 0.5 * i, zsum, sum), sum)
    }

    fn phi_scaled(&self, m: &[f64], k: f64, i: f64, zsum: f64, sum: f64) -> f64 {
        let s = i.sqrt();
        let mut acc = dh(self.aphi, i, s);
        let k2 = k * k;
        let k3 = k2 * k;
        for (v, &(c, a, _)) in self.pair_at.iter().zip(&self.pairs) {
            acc += m[c] * m[a] * k2 * v.bphi_zc(s, zsum);
        }
        for (th, &(a, b, _, unsym)) in self.theta_at.iter().zip(&self.likes) {
            let mut phi_ij = *th;
            if unsym && i > 0.0 {
                phi_ij += etheta_phi(self.z[a], self.z[b], self.aphi, i, s);
            }
            acc += m[a] * m[b] * k2 * phi_ij;
        }
        for (ps, &(a, b, c, _)) in self.psi_at.iter().zip(&self.psis) {
            acc += m[a] * m[b] * m[c] * ps * k3;
        }
        1.0 + 2.0 * acc / sum
    }
}

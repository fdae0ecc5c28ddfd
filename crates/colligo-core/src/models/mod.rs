//! Water-activity models and the evaluator that runs them on a composition.
//!
//! | id | model | reference |
//! |---|---|---|
//! | `ideal` | Raoult, dissociated particles counted: a_w = x_w | Raoult (1887) |
//! | `norrish` | ln a_w = ln x_w − (Σ √K_i x_i)² | Norrish (1966); Ferro Fontán & Chirife (1981) |
//! | `ross` | a_w = Π a_w,i°(m_i) | Ross (1975) |
//! | `zsr` | Σ m_i / m_i°(a_w) = 1 | Stokes & Robinson (1966) |
//! | `pitzer` | ln a_w = −φ M_w Σ m (mixed electrolytes, θ, ψ, Eθ) | Pitzer (1991) |
//! | `auto` | Norrish for non-electrolytes, Pitzer for electrolytes, ZSR for both | — |
//!
//! The hot path works on plain `f64` in SI units: moles, kilograms, kelvin.

pub mod binary;
pub mod pitzer;

use std::fmt;
use std::str::FromStr;

use serde::{Deserialize, Serialize};

use crate::composition::Composition;
use crate::library::{FreezeBehaviour, Library, SoluteIdx};
use crate::water::{M_W, T_ZERO_C};
use binary::{Binary, WilsonBinary, best_binary};
use pitzer::PitzerMixture;

/// A water-activity model, as chosen by the user.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize, Default)]
#[serde(rename_all = "snake_case")]
pub enum ModelId {
    /// Pick per mixture.
    #[default]
    Auto,
    /// Raoult's law with dissociation.
    Ideal,
    /// Multi-solute Norrish (Ferro Fontán–Chirife).
    Norrish,
    /// Ross's product rule.
    Ross,
    /// Zdanovskii-Stokes-Robinson.
    Zsr,
    /// Pitzer ion interaction.
    Pitzer,
}

impl ModelId {
    /// All ids, `auto` first.
    pub const ALL: [ModelId; 6] = [
        ModelId::Auto,
        ModelId::Ideal,
        ModelId::Norrish,
        ModelId::Ross,
        ModelId::Zsr,
        ModelId::Pitzer,
    ];

    /// The concrete models (everything but `auto`).
    pub const CONCRETE: [ModelId; 5] = [
        ModelId::Ideal,
        ModelId::Norrish,
        ModelId::Ross,
        ModelId::Zsr,
        ModelId::Pitzer,
    ];

    /// The id used on the command line and in files.
    pub fn as_str(self) -> &'static str {
        match self {
            ModelId::Auto => "auto",
            ModelId::Ideal => "ideal",
            ModelId::Norrish => "norrish",
            ModelId::Ross => "ross",
            ModelId::Zsr => "zsr",
            ModelId::Pitzer => "pitzer",
        }
    }

    /// A descriptive name with its reference.
    pub fn title(self) -> &'static str {
        match self {
            ModelId::Auto => "Automatic choice",
            ModelId::Ideal => "Ideal (Raoult, with dissociation)",
            ModelId::Norrish => "Norrish, multi-solute (Ferro Fontán & Chirife 1981)",
            ModelId::Ross => "Ross (1975) product rule",
            ModelId::Zsr => "Zdanovskii-Stokes-Robinson (Stokes & Robinson 1966)",
            ModelId::Pitzer => "Pitzer ion interaction (Pitzer 1991)",
        }
    }
}

impl fmt::Display for ModelId {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(self.as_str())
    }
}

impl FromStr for ModelId {
    type Err = String;
    fn from_str(s: &str) -> Result<Self, Self::Err> {
        let t = s.trim().to_ascii_lowercase();
        ModelId::ALL
            .into_iter()
            .find(|m| m.as_str() == t)
            .ok_or_else(|| {
                format!("unknown model `{s}` (choose auto, ideal, norrish, ross, zsr or pitzer)")
            })
    }
}

/// The role a solute plays in the evaluator.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Role {
    /// A non-electrolyte.
    NonElectrolyte,
    /// An electrolyte with Pitzer parameters for its ion pair.
    PitzerSalt,
    /// An electrolyte without Pitzer parameters (treated as ideal, dissociated).
    IdealSalt,
    /// A volatile co-solvent.
    Volatile,
}

/// How dissolved amounts are capped by solubility.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum CapMode<'a> {
    /// Every solute is capped at its solubility at the current temperature
    /// in the current water.
    Equilibrium,
    /// No cap at all: every amount counts as dissolved (supersaturated
    /// solutions, as in handbook tables measured on metastable solutions).
    Unlimited,
    /// While water freezes out: solutes that crystallise are capped at
    /// their solubility at the current temperature in the remaining liquid;
    /// glass-forming ones keep the amounts dissolved before freezing.
    Freezing {
        /// mol dissolved before freezing, per component.
        before: &'a [f64],
    },
}

/// One solute in the evaluator.
#[derive(Debug, Clone)]
pub struct Component {
    /// Library solute.
    pub solute: SoluteIdx,
    /// Total amount in the batch, mol.
    pub mol: f64,
    /// Particles per formula unit.
    pub nu: f64,
    /// Role.
    pub role: Role,
    /// Whether it stays dissolved (supersaturates) on freezing.
    pub stays_dissolved_on_freezing: bool,
}

/// Evaluates ln a_w of one composition under one model, caching every
/// temperature-dependent parameter until the temperature changes.
#[derive(Debug, Clone)]
pub struct Evaluator<'l> {
    lib: &'l Library,
    model: ModelId,
    /// Components (solutes present), in library order.
    pub comps: Vec<Component>,
    /// Water in the batch, kg.
    pub water_kg: f64,
    pitzer: PitzerMixture,
    /// For each Pitzer salt component: `(component, local ion, count)`.
    salt_ions: Vec<(usize, usize, f64)>,
    // Caches at temperature `t`.
    t: f64,
    signed_sqrt_k: Vec<f64>,
    norrish_x_max: Vec<f64>,
    binaries: Vec<Binary>,
    wilson: Vec<Option<WilsonBinary>>,
    solubility: Vec<f64>,
    // Scratch.
    dissolved: Vec<f64>,
    ion_m: Vec<f64>,
    zsr_m: Vec<f64>,
    scratch: Vec<(usize, f64, f64)>,
    /// Last converged ZSR solution y; `zsr_m` holds its m_i°.
    zsr_warm: Option<f64>,
    last_ln_aw: f64,
    /// Number of model evaluations so far (for tests and benchmarks).
    pub evaluations: usize,
}

/// Picks the model `auto` uses for a composition, and says why.
pub fn auto_choice(lib: &Library, comp: &Composition) -> (ModelId, String) {
    let present: Vec<_> = comp.solutes.iter().filter(|s| s.mol > 0.0).collect();
    let n_el = present
        .iter()
        .filter(|s| lib.solutes[s.solute].is_electrolyte())
        .count();
    let n_vol = present
        .iter()
        .filter(|s| lib.solutes[s.solute].volatile().is_some())
        .count();
    let n = present.len();
    match (n, n_el, n_vol) {
        (0, _, _) => (ModelId::Ideal, "pure water".into()),
        (1, _, 1) => (
            ModelId::Ross,
            "one volatile co-solvent: its Wilson binary with water".into(),
        ),
        (_, 0, 0) => (
            ModelId::Norrish,
            "non-electrolytes only: multi-solute Norrish".into(),
        ),
        (_, e, 0) if e == n => (
            ModelId::Pitzer,
            "electrolytes only: Pitzer with mixing terms".into(),
        ),
        _ => (
            ModelId::Zsr,
            "electrolytes and non-electrolytes (or a volatile co-solvent) together: ZSR on each solute's best binary"
                .into(),
        ),
    }
}

impl<'l> Evaluator<'l> {
    /// Prepares `comp` for repeated evaluation under `model` (`auto`
    /// resolved by [`auto_choice`]). Only solutes present (mol > 0) take part.
    pub fn new(lib: &'l Library, comp: &Composition, model: ModelId) -> Self {
        let solutes: Vec<SoluteIdx> = comp
            .solutes
            .iter()
            .filter(|s| s.mol > 0.0)
            .map(|s| s.solute)
            .collect();
        let model = if model == ModelId::Auto {
            auto_choice(lib, comp).0
        } else {
            model
        };
        let mut ev = Self::with_solutes(lib, &solutes, model);
        ev.set_composition(comp);
        ev
    }

    /// Prepares an evaluator for a fixed set of solutes (amounts zero until
    /// [`Evaluator::set_composition`]), so one evaluator serves a whole
    /// sweep or batch. `model` must be concrete; `auto` is taken as ideal.
    pub fn with_solutes(lib: &'l Library, solutes: &[SoluteIdx], model: ModelId) -> Self {
        let mut comps = Vec::new();
        let mut sorted = solutes.to_vec();
        sorted.sort_unstable();
        sorted.dedup();
        for &si in &sorted {
            let sol = &lib.solutes[si];
            let role = if sol.volatile().is_some() {
                Role::Volatile
            } else if sol.is_electrolyte() {
                if sol.pair.is_some() {
                    Role::PitzerSalt
                } else {
                    Role::IdealSalt
                }
            } else {
                Role::NonElectrolyte
            };
            let stays = matches!(
                sol.record.solubility.as_ref().map(|s| &s.on_freezing),
                Some(FreezeBehaviour::StaysDissolved { .. })
            );
            comps.push(Component {
                solute: si,
                mol: 0.0,
                nu: sol.nu,
                role,
                stays_dissolved_on_freezing: stays,
            });
        }
        // Ions of the Pitzer salts.
        let mut ions: Vec<usize> = Vec::new();
        let mut salt_ions = Vec::new();
        for (ci, c) in comps.iter().enumerate() {
            if c.role != Role::PitzerSalt {
                continue;
            }
            for &(ion, count) in &lib.solutes[c.solute].ions {
                let local = match ions.iter().position(|&i| i == ion) {
                    Some(p) => p,
                    None => {
                        ions.push(ion);
                        ions.len() - 1
                    }
                };
                salt_ions.push((ci, local, count));
            }
        }
        let n = comps.len();
        let n_ions = ions.len();
        Evaluator {
            lib,
            model,
            water_kg: 0.0,
            pitzer: PitzerMixture::new(lib, ions),
            salt_ions,
            comps,
            t: f64::NAN,
            signed_sqrt_k: vec![0.0; n],
            norrish_x_max: vec![f64::INFINITY; n],
            binaries: vec![Binary::Ideal { nu: 1.0 }; n],
            wilson: vec![None; n],
            solubility: vec![f64::INFINITY; n],
            dissolved: vec![0.0; n],
            ion_m: vec![0.0; n_ions],
            zsr_m: vec![f64::NAN; n],
            scratch: Vec::with_capacity(n),
            zsr_warm: None,
            last_ln_aw: f64::NAN,
            evaluations: 0,
        }
    }

    /// Sets water and solute amounts from `comp`. Solutes of `comp` outside
    /// this evaluator's set are ignored; use [`Evaluator::covers`] first.
    pub fn set_composition(&mut self, comp: &Composition) {
        self.water_kg = comp.water_kg;
        for c in &mut self.comps {
            c.mol = comp.mol_of(c.solute);
        }
    }

    /// True when every solute present in `comp` is in this evaluator.
    pub fn covers(&self, comp: &Composition) -> bool {
        comp.solutes.iter().filter(|s| s.mol > 0.0).all(|s| {
            self.comps
                .binary_search_by_key(&s.solute, |c| c.solute)
                .is_ok()
        })
    }

    /// The concrete model in use.
    pub fn model(&self) -> ModelId {
        self.model
    }

    /// The library.
    pub fn library(&self) -> &'l Library {
        self.lib
    }

    /// Updates the temperature-dependent caches.
    pub fn set_t(&mut self, t_k: f64) {
        if self.t == t_k {
            return;
        }
        let lib = self.lib;
        // Pitzer parameters first: salt binaries share the mixture's values.
        self.pitzer.set_t(lib, t_k);
        let aphi = self.pitzer.aphi_now();
        let first = self.t.is_nan();
        for (i, c) in self.comps.iter().enumerate() {
            let s = &lib.solutes[c.solute];
            if first {
                self.binaries[i] = best_binary(lib, c.solute, t_k);
            }
            match &mut self.binaries[i] {
                Binary::Pitzer(p) => match self.pitzer.pair_now(p.pair) {
                    Some(at) => p.set_values(at, aphi, t_k),
                    None => p.set_t(lib, t_k),
                },
                Binary::Norrish { k, .. } => {
                    if let Some(n) = &s.record.norrish
                        && (first || !n.k.is_constant())
                    {
                        *k = n.k_at(t_k);
                    }
                }
                Binary::Wilson(w) => {
                    if let Some(v) = s.volatile() {
                        *w = WilsonBinary::new(v, t_k);
                    }
                }
                Binary::Ideal { .. } => {}
            }
            (self.signed_sqrt_k[i], self.norrish_x_max[i]) = match (&self.binaries[i], c.role) {
                (Binary::Norrish { k, x_max }, Role::NonElectrolyte) => (
                    k.signum() * k.abs().sqrt(),
                    if *k < 0.0 { *x_max } else { f64::INFINITY },
                ),
                _ => (0.0, f64::INFINITY),
            };
            self.wilson[i] = match &self.binaries[i] {
                Binary::Wilson(w) => Some(*w),
                _ => None,
            };
            if s.record.solubility.is_some() {
                self.solubility[i] = s.solubility_molality(t_k).map_or(f64::INFINITY, |(m, _)| m);
            }
        }
        self.t = t_k;
    }

    /// Solubility of component `i` at the cached temperature, mol/kg.
    pub fn solubility(&self, i: usize) -> f64 {
        self.solubility[i]
    }

    /// The binary curve of component `i` at the cached temperature.
    pub fn binary(&self, i: usize) -> &Binary {
        &self.binaries[i]
    }

    /// Dissolved amounts (mol) at `t_k` in `water_kg` of liquid water.
    pub fn dissolve(&mut self, t_k: f64, water_kg: f64, mode: &CapMode<'_>) -> &[f64] {
        self.set_t(t_k);
        for (i, c) in self.comps.iter().enumerate() {
            let cap = self.solubility[i] * water_kg;
            self.dissolved[i] = match mode {
                CapMode::Equilibrium => c.mol.min(cap),
                CapMode::Unlimited => c.mol,
                CapMode::Freezing { before } => {
                    if c.stays_dissolved_on_freezing {
                        before[i]
                    } else {
                        before[i].min(cap)
                    }
                }
            };
        }
        &self.dissolved
    }

    /// ln a_w at `t_k` with `water_kg` of liquid water, amounts capped by `mode`.
    pub fn ln_aw(&mut self, t_k: f64, water_kg: f64, mode: &CapMode<'_>) -> f64 {
        self.dissolve(t_k, water_kg, mode);
        let d = std::mem::take(&mut self.dissolved);
        let r = self.ln_aw_of(t_k, water_kg, &d);
        self.dissolved = d;
        r
    }

    /// ln a_w at `t_k` for the given dissolved amounts (mol, per component)
    /// in `water_kg` of water. This is the hot path.
    pub fn ln_aw_of(&mut self, t_k: f64, water_kg: f64, dissolved: &[f64]) -> f64 {
        self.set_t(t_k);
        self.evaluations += 1;
        if water_kg <= 0.0 {
            return f64::NEG_INFINITY;
        }
        let r = match self.model {
            ModelId::Ideal | ModelId::Auto => self.ideal(water_kg, dissolved),
            ModelId::Norrish => self.norrish(water_kg, dissolved),
            ModelId::Ross => self.ross(water_kg, dissolved),
            ModelId::Zsr => self.zsr(water_kg, dissolved),
            ModelId::Pitzer => self.pitzer(water_kg, dissolved),
        };
        self.last_ln_aw = r;
        r
    }

    fn ideal(&self, w: f64, d: &[f64]) -> f64 {
        let nw = w / M_W;
        let n: f64 = self.comps.iter().zip(d).map(|(c, n)| c.nu * n).sum();
        -(n / nw).ln_1p()
    }

    /// Ross factor of the volatile components (their Wilson binaries).
    fn volatile_ln_aw(&self, w: f64, d: &[f64]) -> f64 {
        let mut s = 0.0;
        for (i, c) in self.comps.iter().enumerate() {
            if c.role == Role::Volatile
                && let Some(wb) = &self.wilson[i]
            {
                s += wb.ln_aw(d[i] / w);
            }
        }
        s
    }

    /// Ferro Fontán & Chirife: ln a_w = ln x_w − (Σ ±√|K_i| x_i)², the sign
    /// of each term that of K_i. A negative-K solute's x_i is held at the
    /// edge of its data (as in its binary), so the rule stays monotonic.
    fn norrish(&self, w: f64, d: &[f64]) -> f64 {
        let nw = w / M_W;
        let mut particles = 0.0;
        for (i, c) in self.comps.iter().enumerate() {
            if c.role != Role::Volatile {
                particles += c.nu * d[i];
            }
        }
        let ntot = nw + particles;
        let mut sx = 0.0;
        for (i, c) in self.comps.iter().enumerate() {
            if c.role != Role::Volatile && self.signed_sqrt_k[i] != 0.0 {
                sx += self.signed_sqrt_k[i] * (d[i] / ntot).min(self.norrish_x_max[i]);
            }
        }
        // ln x_w = −ln(1 + n/n_w), written with ln_1p to keep precision at
        // infinite dilution.
        -(particles / nw).ln_1p() - sx.signum() * sx * sx + self.volatile_ln_aw(w, d)
    }

    fn ross(&self, w: f64, d: &[f64]) -> f64 {
        self.binaries
            .iter()
            .zip(d)
            .map(|(b, n)| b.ln_aw(n / w))
            .sum()
    }

    fn pitzer(&mut self, w: f64, d: &[f64]) -> f64 {
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

    /// ZSR: solve Σ m_i / m_i°(y) = 1 with b_i(m_i°) = y for y = ln a_w.
    ///
    /// All n + 1 unknowns (y and every m_i°) are solved together by Newton's
    /// method on the arrow-shaped system r_i = b_i(m_i°) − y = 0,
    /// G = Σ m_i/m_i° − 1 = 0, which costs one binary evaluation per solute
    /// per iteration. Start: Ross's rule for y and m_i° = m_i y / b_i(m_i).
    /// If Newton stalls, the nested solve ([`Binary::molality_at`] inside a
    /// bracketed outer iteration) takes over.
    fn zsr(&mut self, w: f64, d: &[f64]) -> f64 {
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
    fn zsr_nested(&mut self, w: f64, d: &[f64]) -> f64 {
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

    /// Shares of each component in the lowering of ln a_w, apportioned by
    /// each solute's binary effect at its molality (they sum to the model's
    /// ln a_w). Outside the hot path.
    pub fn contributions(&mut self, t_k: f64, water_kg: f64, dissolved: &[f64]) -> Vec<f64> {
        let total = self.ln_aw_of(t_k, water_kg, dissolved);
        self.contributions_of(total, water_kg, dissolved)
    }

    /// As [`Evaluator::contributions`], with ln a_w already known (the
    /// binaries must be at the same temperature).
    pub fn contributions_of(&self, total: f64, water_kg: f64, dissolved: &[f64]) -> Vec<f64> {
        let parts: Vec<f64> = self
            .binaries
            .iter()
            .zip(dissolved)
            .map(|(b, n)| {
                if water_kg > 0.0 {
                    b.ln_aw(n / water_kg)
                } else {
                    0.0
                }
            })
            .collect();
        let sum: f64 = parts.iter().sum();
        if sum == 0.0 {
            return vec![0.0; parts.len()];
        }
        parts.iter().map(|p| p / sum * total).collect()
    }

    /// Moles of water one mole of component `c` binds when it crystallises.
    fn hydrate_water_of(&self, c: &Component) -> f64 {
        match self.lib.solutes[c.solute]
            .record
            .solubility
            .as_ref()
            .map(|s| &s.on_freezing)
        {
            Some(FreezeBehaviour::Crystallises { hydrate_water }) => *hydrate_water,
            _ => 0.0,
        }
    }

    /// Water bound as crystal hydrate, kg, when `before` was available and
    /// the last [`Evaluator::dissolve`] left `last_dissolved` in solution.
    pub fn hydrate_water_since(&self, before: &[f64]) -> f64 {
        self.comps
            .iter()
            .zip(before.iter().zip(&self.dissolved))
            .map(|(c, (b, d))| self.hydrate_water_of(c) * (b - d).max(0.0) * M_W)
            .sum()
    }

    /// Water to bind as crystal hydrate, kg, for amounts that did not dissolve.
    pub fn hydrate_water_kg(&self, undissolved: &[f64]) -> f64 {
        self.comps
            .iter()
            .zip(undissolved)
            .map(|(c, u)| self.hydrate_water_of(c) * u * M_W)
            .sum()
    }

    /// ln a_w of the last evaluation (NaN before the first).
    pub fn last_ln_aw(&self) -> f64 {
        self.last_ln_aw
    }

    /// Dissolved amounts of the last [`Evaluator::dissolve`] or
    /// [`Evaluator::ln_aw`] call, mol per component.
    pub fn last_dissolved(&self) -> &[f64] {
        &self.dissolved
    }

    /// The binary molality m_i° of component `i` at the last ZSR solution.
    pub fn zsr_molality(&self, i: usize) -> Option<f64> {
        self.zsr_m.get(i).copied().filter(|m| m.is_finite())
    }

    /// The temperature currently cached, K.
    pub fn temperature(&self) -> f64 {
        self.t
    }

    /// The temperature currently cached, °C.
    pub fn temperature_c(&self) -> f64 {
        self.t - T_ZERO_C
    }
}

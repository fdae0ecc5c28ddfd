//! The evaluator: one composition prepared for repeated evaluation under
//! one concrete [`Model`], caching every temperature-dependent parameter
//! until the temperature changes.
//!
//! Data flows one way: a [`Composition`] goes in ([`Evaluator::new`] or
//! [`Evaluator::set_composition`]); ln a_w comes out of the hot path
//! ([`Evaluator::ln_aw`]); and [`Evaluator::solution`] hands the property
//! code everything it reads about the solution at one state (dissolved
//! amounts, solubilities, binary effects) as a plain [`Solution`], so that
//! code never reaches into the evaluator's caches.

use super::binary::{Binary, WilsonBinary, best_binary};
use super::pitzer::PitzerMixture;
use super::{CapMode, Component, Model, Role};
use crate::composition::Composition;
use crate::library::{FreezeBehaviour, Library, SoluteIdx};
use crate::water::M_W;

/// Evaluates ln a_w of one composition under one model, caching every
/// temperature-dependent parameter until the temperature changes.
#[derive(Debug, Clone)]
pub struct Evaluator<'l> {
    lib: &'l Library,
    pub(super) model: Model,
    /// Components (solutes present), in library order.
    pub(super) comps: Vec<Component>,
    /// Water in the batch, kg.
    water_kg: f64,
    pub(super) pitzer: PitzerMixture,
    /// For each Pitzer salt component: `(component, local ion, count)`.
    pub(super) salt_ions: Vec<(usize, usize, f64)>,
    // Caches at temperature `t`.
    pub(super) t: f64,
    pub(super) signed_sqrt_k: Vec<f64>,
    pub(super) binaries: Vec<Binary>,
    pub(super) wilson: Vec<Option<WilsonBinary>>,
    pub(super) solubility: Vec<f64>,
    // Scratch.
    pub(super) dissolved: Vec<f64>,
    pub(super) ion_m: Vec<f64>,
    pub(super) zsr_m: Vec<f64>,
    pub(super) scratch: Vec<(usize, f64, f64)>,
    pub(super) masked: Vec<f64>,
    /// Last converged ZSR solution y; `zsr_m` holds its m_i°.
    pub(super) zsr_warm: Option<f64>,
    /// Last water split ln(w₁/w₂) of the grouped model.
    pub(super) group_warm: Option<f64>,
    last_ln_aw: f64,
    /// Number of model evaluations so far.
    evaluations: usize,
}

impl<'l> Evaluator<'l> {
    /// Prepares `comp` for repeated evaluation under `model`. Only solutes
    /// present (mol > 0) take part.
    pub fn new(lib: &'l Library, comp: &Composition, model: Model) -> Self {
        let solutes: Vec<SoluteIdx> = comp
            .solutes
            .iter()
            .filter(|s| s.mol > 0.0)
            .map(|s| s.solute)
            .collect();
        let mut ev = Self::with_solutes(lib, &solutes, model);
        ev.set_composition(comp);
        ev
    }

    /// Prepares an evaluator for a fixed set of solutes (amounts zero until
    /// [`Evaluator::set_composition`]), so one evaluator serves a whole
    /// sweep or batch.
    pub fn with_solutes(lib: &'l Library, solutes: &[SoluteIdx], model: Model) -> Self {
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
            binaries: vec![Binary::Ideal { nu: 1.0 }; n],
            wilson: vec![None; n],
            solubility: vec![f64::INFINITY; n],
            dissolved: vec![0.0; n],
            ion_m: vec![0.0; n_ions],
            zsr_m: vec![f64::NAN; n],
            scratch: Vec::with_capacity(n),
            masked: Vec::with_capacity(n),
            zsr_warm: None,
            group_warm: None,
            last_ln_aw: f64::NAN,
            evaluations: 0,
        }
    }

    /// Sets water and solute amounts from `comp`. Solutes of `comp` outside
    /// this evaluator's set are ignored.
    pub fn set_composition(&mut self, comp: &Composition) {
        self.water_kg = comp.water_kg;
        for c in &mut self.comps {
            c.mol = comp.mol_of(c.solute);
        }
    }

    /// The concrete model in use.
    pub fn model(&self) -> Model {
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
            self.signed_sqrt_k[i] = match (&self.binaries[i], c.role) {
                (Binary::Norrish { k, .. }, Role::NonElectrolyte) => k.signum() * k.abs().sqrt(),
                _ => 0.0,
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

    /// The components (solutes present), in library order.
    pub fn components(&self) -> &[Component] {
        &self.comps
    }

    /// Water in the batch, kg.
    pub fn water_kg(&self) -> f64 {
        self.water_kg
    }

    /// Whether a volatile co-solvent takes part.
    pub fn has_volatile(&self) -> bool {
        self.comps.iter().any(|c| c.role == Role::Volatile)
    }

    /// Solubility of each component at the temperature last set
    /// ([`Evaluator::set_t`]), mol per kg of water (infinite where
    /// unlimited).
    pub fn solubilities(&self) -> &[f64] {
        &self.solubility
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
            Model::Ideal => self.ideal(water_kg, dissolved),
            Model::Norrish => self.norrish(water_kg, dissolved),
            Model::Ross => self.ross(water_kg, dissolved),
            Model::Zsr => self.zsr(water_kg, dissolved),
            Model::Pitzer => self.pitzer(water_kg, dissolved),
            Model::Grouped => self.grouped(water_kg, dissolved),
        };
        self.last_ln_aw = r;
        r
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

    /// Number of model evaluations so far (for tests and benchmarks).
    pub fn evaluations(&self) -> usize {
        self.evaluations
    }

    /// ln a_w at `t_k` with `water_kg` of liquid, amounts capped by `mode`,
    /// and everything the property code reads about that solution.
    pub fn solution(&mut self, t_k: f64, water_kg: f64, mode: &CapMode<'_>) -> Solution {
        let ln_aw = self.ln_aw(t_k, water_kg, mode);
        let solutes = self
            .comps
            .iter()
            .enumerate()
            .map(|(i, c)| {
                let d = self.dissolved[i];
                SoluteState {
                    solute: c.solute,
                    role: c.role,
                    nu: c.nu,
                    total_mol: c.mol,
                    dissolved_mol: d,
                    solubility_mol_per_kg: self.solubility[i],
                    binary_ln_aw: if water_kg > 0.0 {
                        self.binaries[i].ln_aw(d / water_kg)
                    } else {
                        0.0
                    },
                    zsr_molality: self.zsr_m.get(i).copied().filter(|m| m.is_finite()),
                }
            })
            .collect();
        Solution {
            model: self.model,
            temperature_k: t_k,
            water_kg,
            ln_aw,
            solutes,
        }
    }
}

/// One solute of a [`Solution`].
#[derive(Debug, Clone, PartialEq)]
pub struct SoluteState {
    /// Library solute.
    pub solute: SoluteIdx,
    /// Its role in the model.
    pub role: Role,
    /// Particles per formula unit.
    pub nu: f64,
    /// Total amount in the batch, mol.
    pub total_mol: f64,
    /// Dissolved, mol.
    pub dissolved_mol: f64,
    /// Solubility at the temperature, mol per kg of water (infinite where
    /// unlimited).
    pub solubility_mol_per_kg: f64,
    /// ln a_w of the solute's own binary with water at its molality in the
    /// solution's water.
    pub binary_ln_aw: f64,
    /// Under ZSR, the binary molality m_i° at the mixture's a_w.
    pub zsr_molality: Option<f64>,
}

/// The solution at one state, as the evaluator computed it.
#[derive(Debug, Clone, PartialEq)]
pub struct Solution {
    /// The model used.
    pub model: Model,
    /// Temperature, K.
    pub temperature_k: f64,
    /// Liquid water, kg.
    pub water_kg: f64,
    /// ln a_w.
    pub ln_aw: f64,
    /// The solutes present, in library order.
    pub solutes: Vec<SoluteState>,
}

impl Solution {
    /// Dissolved amounts, mol, per solute.
    pub fn dissolved(&self) -> Vec<f64> {
        self.solutes.iter().map(|s| s.dissolved_mol).collect()
    }

    /// Molality of solute `i`'s dissolved part, mol per kg of water.
    pub fn molality(&self, i: usize) -> f64 {
        self.solutes[i].dissolved_mol / self.water_kg
    }

    /// Shares of each solute in the lowering of ln a_w, apportioned by each
    /// solute's binary effect at its molality (they sum to ln a_w).
    pub fn contributions(&self) -> Vec<f64> {
        let sum: f64 = self.solutes.iter().map(|s| s.binary_ln_aw).sum();
        if sum == 0.0 {
            return vec![0.0; self.solutes.len()];
        }
        self.solutes
            .iter()
            .map(|s| s.binary_ln_aw / sum * self.ln_aw)
            .collect()
    }
}

//! Water-activity models and the evaluator that runs them on a composition.
//!
//! | id | model | reference | file |
//! |---|---|---|---|
//! | `ideal` | Raoult, dissociated particles counted: a_w = x_w | Raoult (1887) | `ideal.rs` |
//! | `norrish` | ln a_w = ln x_w − (Σ √K_i x_i)² | Norrish (1966); Ferro Fontán & Chirife (1981) | `norrish.rs` |
//! | `ross` | a_w = Π a_w,i°(m_i) | Ross (1975) | `ross.rs` |
//! | `zsr` | Σ m_i / m_i°(a_w) = 1 | Stokes & Robinson (1966) | `zsr.rs` |
//! | `pitzer` | ln a_w = −φ M_w Σ m (mixed electrolytes, θ, ψ, Eθ) | Pitzer (1991) | `pitzer/` |
//! | `grouped` | Norrish group and Pitzer group joined by ZSR | Clegg, Seinfeld & Brimblecombe (2001) | `grouped.rs` |
//! | `auto` | Norrish for non-electrolytes, Pitzer for electrolytes, `grouped` for both | — | [`ModelChoice::resolve`] |
//!
//! What the user chooses ([`ModelChoice`], which may be `auto`) is kept
//! apart from what is computed ([`Model`], always concrete): the
//! [`Evaluator`] takes only a [`Model`], and `auto` is resolved in one
//! place, [`ModelChoice::resolve`].
//!
//! Each model's file holds its ln a_w (an arm of the evaluator's hot path)
//! and how it treats each kind of solute ([`Treatment`]), which the
//! validity warnings read. Each solute's own binary curve (Pitzer, Norrish,
//! Wilson or Raoult) is in `binary.rs`; a volatile co-solvent's Wilson
//! factor, shared by several models, in `volatile.rs`.
//!
//! The hot path works on plain `f64` in SI units: moles, kilograms, kelvin.

pub mod binary;
mod evaluator;
mod grouped;
mod ideal;
mod norrish;
pub mod pitzer;
mod ross;
mod volatile;
mod zsr;

use std::fmt;
use std::str::FromStr;

use serde::{Deserialize, Serialize};

use crate::composition::Composition;
use crate::error::ParseError;
use crate::library::{Library, SoluteIdx};

pub use evaluator::{Evaluator, SoluteState, Solution};
pub use volatile::cosolvent_pressure;

/// A concrete water-activity model: what an evaluation computes with.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum Model {
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
    /// Norrish and Pitzer groups joined by ZSR.
    Grouped,
}

impl Model {
    /// Every model.
    pub const ALL: [Model; 6] = [
        Model::Ideal,
        Model::Norrish,
        Model::Ross,
        Model::Zsr,
        Model::Pitzer,
        Model::Grouped,
    ];

    /// The id used on the command line and in files.
    pub fn as_str(self) -> &'static str {
        ModelChoice::from(self).as_str()
    }

    /// A descriptive name with its reference.
    pub fn title(self) -> &'static str {
        ModelChoice::from(self).title()
    }

    /// How this model treats a solute of `role`.
    pub fn treatment(self, role: Role) -> Treatment {
        match self {
            Model::Ideal => ideal::treatment(role),
            Model::Norrish => norrish::treatment(role),
            Model::Ross => ross::treatment(role),
            Model::Zsr => zsr::treatment(role),
            Model::Pitzer => pitzer::treatment(role),
            Model::Grouped => grouped::treatment(role),
        }
    }
}

impl fmt::Display for Model {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(self.as_str())
    }
}

/// The model as the user chooses it: `auto`, or one concrete model. Stored
/// in project files as its snake_case id.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize, Default)]
#[serde(rename_all = "snake_case")]
pub enum ModelChoice {
    /// Pick per mixture ([`ModelChoice::resolve`]).
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
    /// Norrish and Pitzer groups joined by ZSR.
    Grouped,
}

impl From<Model> for ModelChoice {
    fn from(m: Model) -> Self {
        match m {
            Model::Ideal => ModelChoice::Ideal,
            Model::Norrish => ModelChoice::Norrish,
            Model::Ross => ModelChoice::Ross,
            Model::Zsr => ModelChoice::Zsr,
            Model::Pitzer => ModelChoice::Pitzer,
            Model::Grouped => ModelChoice::Grouped,
        }
    }
}

/// A resolved model choice: the concrete model and why it is used.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Resolution {
    /// The model.
    pub model: Model,
    /// Why (for `auto`), or that the user chose it.
    pub reason: String,
}

impl ModelChoice {
    /// Every choice, `auto` first.
    pub const ALL: [ModelChoice; 7] = [
        ModelChoice::Auto,
        ModelChoice::Ideal,
        ModelChoice::Norrish,
        ModelChoice::Ross,
        ModelChoice::Zsr,
        ModelChoice::Pitzer,
        ModelChoice::Grouped,
    ];

    /// The id used on the command line and in files.
    pub fn as_str(self) -> &'static str {
        match self {
            ModelChoice::Auto => "auto",
            ModelChoice::Ideal => "ideal",
            ModelChoice::Norrish => "norrish",
            ModelChoice::Ross => "ross",
            ModelChoice::Zsr => "zsr",
            ModelChoice::Pitzer => "pitzer",
            ModelChoice::Grouped => "grouped",
        }
    }

    /// A descriptive name with its reference.
    pub fn title(self) -> &'static str {
        match self {
            ModelChoice::Auto => "Automatic choice",
            ModelChoice::Ideal => "Ideal (Raoult, with dissociation)",
            ModelChoice::Norrish => "Norrish, multi-solute (Ferro Fontán & Chirife 1981)",
            ModelChoice::Ross => "Ross (1975) product rule",
            ModelChoice::Zsr => "Zdanovskii-Stokes-Robinson (Stokes & Robinson 1966)",
            ModelChoice::Pitzer => "Pitzer ion interaction (Pitzer 1991)",
            ModelChoice::Grouped => {
                "Norrish and Pitzer groups joined by ZSR (Clegg, Seinfeld & Brimblecombe 2001)"
            }
        }
    }

    /// The concrete model, `None` for `auto`.
    pub fn fixed(self) -> Option<Model> {
        match self {
            ModelChoice::Auto => None,
            ModelChoice::Ideal => Some(Model::Ideal),
            ModelChoice::Norrish => Some(Model::Norrish),
            ModelChoice::Ross => Some(Model::Ross),
            ModelChoice::Zsr => Some(Model::Zsr),
            ModelChoice::Pitzer => Some(Model::Pitzer),
            ModelChoice::Grouped => Some(Model::Grouped),
        }
    }

    /// The model this choice uses for `comp`, and why. The one place where
    /// `auto` is decided.
    pub fn resolve(self, lib: &Library, comp: &Composition) -> Resolution {
        if let Some(model) = self.fixed() {
            return Resolution {
                model,
                reason: "chosen by the user".into(),
            };
        }
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
        // Each arm is the grouped rule with one group empty, so the choice
        // is continuous as a solute of a new kind goes from zero upward.
        let (model, reason) = match (n, n_el, n_vol) {
            (0, _, _) => (Model::Ideal, "pure water"),
            (1, _, 1) => (
                Model::Ross,
                "one volatile co-solvent: its Wilson binary with water",
            ),
            (_, 0, _) => (
                Model::Norrish,
                "non-electrolytes only: multi-solute Norrish",
            ),
            (_, e, v) if e + v == n => {
                (Model::Pitzer, "electrolytes only: Pitzer with mixing terms")
            }
            _ => (
                Model::Grouped,
                "electrolytes and non-electrolytes together: Norrish for the non-electrolytes and Pitzer for the electrolytes, joined by ZSR",
            ),
        };
        Resolution {
            model,
            reason: reason.into(),
        }
    }
}

impl fmt::Display for ModelChoice {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(self.as_str())
    }
}

impl FromStr for ModelChoice {
    type Err = ParseError;
    fn from_str(s: &str) -> Result<Self, Self::Err> {
        let t = s.trim().to_ascii_lowercase();
        ModelChoice::ALL
            .into_iter()
            .find(|m| m.as_str() == t)
            .ok_or_else(|| ParseError::UnknownModel {
                text: s.to_string(),
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

/// How a model treats one kind of solute: with its own data, as ideal
/// (and why), or folded in by Ross's rule.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Treatment {
    /// Nothing non-ideal is modelled at all (the ideal model).
    Ideal,
    /// With the solute's own binary data: its ranges apply.
    OwnData,
    /// The model has no parameters for this kind of solute: counted ideally.
    TreatedAsIdeal {
        /// Why, in a phrase.
        why: &'static str,
    },
    /// A volatile co-solvent's Wilson factor multiplied in (Ross's rule);
    /// its binary's ranges apply.
    VolatileByRoss,
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

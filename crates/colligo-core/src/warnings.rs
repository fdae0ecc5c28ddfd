//! Warnings attached to results: each names the solute, the model and the
//! reason, so a user can judge how far to trust a number.

use std::fmt;

use serde::Serialize;

use crate::models::Model;

/// One warning on a result.
#[derive(Debug, Clone, PartialEq, Serialize)]
#[serde(tag = "kind", rename_all = "snake_case")]
#[non_exhaustive]
pub enum Warning {
    /// More solute than the water can dissolve at this temperature.
    Undissolved {
        /// Solute id.
        solute: String,
        /// Mass that stays undissolved, g.
        undissolved_g: f64,
        /// Solubility, g per 100 g water.
        solubility_g_per_100g_water: f64,
        /// Temperature, °C.
        t_c: f64,
    },
    /// The solubility curve was extrapolated beyond its data.
    SolubilityExtrapolated {
        /// Solute id.
        solute: String,
        /// Temperature, °C.
        t_c: f64,
        /// Range of the data, °C.
        range_c: (f64, f64),
    },
    /// No published non-ideality parameters: Raoult's law was used.
    NoNonIdealityData {
        /// Solute id.
        solute: String,
        /// Model in use.
        model: Model,
    },
    /// The model has no parameters for this kind of solute.
    TreatedAsIdeal {
        /// Solute id.
        solute: String,
        /// Model in use.
        model: Model,
        /// Why.
        why: String,
    },
    /// Concentration beyond the data behind the parameters.
    BeyondValidatedConcentration {
        /// Solute id.
        solute: String,
        /// Model in use.
        model: Model,
        /// Value reached.
        value: f64,
        /// Highest value of the data.
        max: f64,
        /// Unit of value and max.
        unit: String,
        /// Where the value is taken (own molality, ZSR binary molality).
        basis: String,
    },
    /// Temperature beyond the data behind the parameters.
    BeyondValidatedTemperature {
        /// Solute id.
        solute: String,
        /// Model in use.
        model: Model,
        /// Temperature, °C.
        t_c: f64,
        /// Range of the data, °C.
        range_c: (f64, f64),
    },
    /// A volatile co-solvent folded in by Ross's rule.
    VolatileByRoss {
        /// Solute id.
        solute: String,
        /// Model in use.
        model: Model,
    },
    /// A volatile co-solvent's own partial pressure at a temperature where
    /// its fit does not reproduce it.
    CosolventPressureUnreliable {
        /// Solute id.
        solute: String,
        /// Temperature, °C.
        t_c: f64,
        /// Lowest temperature at which the partial pressure is usable, °C.
        t_min_c: f64,
    },
    /// The ideal model on a concentrated solution.
    IdealConcentrated {
        /// Mole fraction of solute particles.
        solute_mole_fraction: f64,
    },
    /// A glass-forming solute is left supersaturated in the freeze-concentrate.
    SupersaturatedOnFreezing {
        /// Solute id.
        solute: String,
        /// Temperature, °C.
        t_c: f64,
    },
    /// The frozen solution passed its eutectic: no liquid remains.
    Eutectic {
        /// Temperature, °C.
        t_c: f64,
    },
    /// A property could not be computed.
    PropertyUnavailable {
        /// Property.
        property: String,
        /// Why.
        reason: String,
    },
}

impl Warning {
    /// True for warnings that say the number may be far off (outside
    /// validated ranges, no data), as opposed to physical notes.
    pub fn is_validity(&self) -> bool {
        matches!(
            self,
            Warning::NoNonIdealityData { .. }
                | Warning::TreatedAsIdeal { .. }
                | Warning::BeyondValidatedConcentration { .. }
                | Warning::BeyondValidatedTemperature { .. }
                | Warning::CosolventPressureUnreliable { .. }
                | Warning::SolubilityExtrapolated { .. }
                | Warning::IdealConcentrated { .. }
                | Warning::VolatileByRoss { .. }
        )
    }

    /// The solute the warning is about, if any.
    pub fn solute(&self) -> Option<&str> {
        match self {
            Warning::Undissolved { solute, .. }
            | Warning::SolubilityExtrapolated { solute, .. }
            | Warning::NoNonIdealityData { solute, .. }
            | Warning::TreatedAsIdeal { solute, .. }
            | Warning::BeyondValidatedConcentration { solute, .. }
            | Warning::BeyondValidatedTemperature { solute, .. }
            | Warning::VolatileByRoss { solute, .. }
            | Warning::CosolventPressureUnreliable { solute, .. }
            | Warning::SupersaturatedOnFreezing { solute, .. } => Some(solute),
            _ => None,
        }
    }
}

impl fmt::Display for Warning {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            Warning::Undissolved {
                solute,
                undissolved_g,
                solubility_g_per_100g_water,
                t_c,
            } => write!(
                f,
                "{solute} exceeds its solubility ({solubility_g_per_100g_water:.1} g per 100 g water at {t_c:.1} °C): \
                 {undissolved_g:.3} g stays undissolved and may crystallise; a_w is that of the saturated solution"
            ),
            Warning::SolubilityExtrapolated {
                solute,
                t_c,
                range_c,
            } => write!(
                f,
                "{solute}: solubility extrapolated to {t_c:.1} °C (data cover {:.0} to {:.0} °C)",
                range_c.0, range_c.1
            ),
            Warning::NoNonIdealityData { solute, model } => write!(
                f,
                "{solute}: no non-ideality data; treated as ideal (Raoult) in the {model} model — a_w may be overestimated"
            ),
            Warning::TreatedAsIdeal { solute, model, why } => {
                write!(f, "{solute}: treated as ideal in the {model} model ({why})")
            }
            Warning::BeyondValidatedConcentration {
                solute,
                model,
                value,
                max,
                unit,
                basis,
            } => write!(
                f,
                "{solute}: {value:.3} {unit} ({basis}) is beyond the data behind the parameters the {model} model uses for it (up to {max:.3} {unit})"
            ),
            Warning::BeyondValidatedTemperature {
                solute,
                model,
                t_c,
                range_c,
            } => write!(
                f,
                "{solute}: {t_c:.1} °C is outside the temperature range of the data behind the parameters the {model} model uses for it ({:.1} to {:.1} °C)",
                range_c.0, range_c.1
            ),
            Warning::VolatileByRoss { solute, model } => write!(
                f,
                "{solute} is volatile: its effect on water is combined by Ross's rule in the {model} model"
            ),
            Warning::CosolventPressureUnreliable {
                solute,
                t_c,
                t_min_c,
            } => write!(
                f,
                "{solute}: its own partial pressure at {t_c:.1} °C is outside what its Wilson fit reproduces (from {t_min_c:.0} °C); the water activity is still within the fit"
            ),
            Warning::IdealConcentrated {
                solute_mole_fraction,
            } => write!(
                f,
                "the ideal model ignores solute interactions; at a solute mole fraction of {solute_mole_fraction:.3} \
                 expect real a_w to differ noticeably"
            ),
            Warning::SupersaturatedOnFreezing { solute, t_c } => write!(
                f,
                "{solute} is supersaturated in the freeze-concentrate at {t_c:.1} °C; it is kept dissolved \
                 (crystallisation is slow in frozen sugar systems)"
            ),
            Warning::Eutectic { t_c } => write!(
                f,
                "at {t_c:.1} °C the solution is below its eutectic: all water is frozen or bound as hydrate"
            ),
            Warning::PropertyUnavailable { property, reason } => write!(f, "{property}: {reason}"),
        }
    }
}

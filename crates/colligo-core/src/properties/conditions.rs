//! The conditions of an evaluation (product temperature, ambient pressure,
//! storage temperature) and the one place their ranges are checked: the
//! evaluation, project files, the command line and the window all use
//! [`Limits`] and the checks here.

use super::{T_BOIL_MAX, T_FREEZE_MIN};
use crate::error::ModelError;
use crate::water::{self, T_ZERO_C};

/// Conditions of an evaluation.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Conditions {
    /// Temperature of the product, K.
    pub temperature_k: f64,
    /// Ambient pressure, Pa (for the boiling point).
    pub pressure_pa: f64,
    /// Storage temperature for the ice fraction, K.
    pub storage_temperature_k: f64,
}

impl Default for Conditions {
    fn default() -> Self {
        Conditions {
            temperature_k: T_ZERO_C + 25.0,
            pressure_pa: water::P_STD,
            storage_temperature_k: T_ZERO_C - 18.0,
        }
    }
}

/// The ranges a user may set, in the units projects store them in.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Limits;

impl Limits {
    /// Product temperature, °C: the range of the water and ice equations
    /// the solves use (−60 °C, the coldest freezing point searched, to
    /// 200 °C, the hottest boiling point searched).
    pub const TEMPERATURE_C: (f64, f64) = (T_FREEZE_MIN - T_ZERO_C, T_BOIL_MAX - T_ZERO_C);
    /// Storage temperature for the ice fraction, °C.
    pub const STORAGE_TEMPERATURE_C: (f64, f64) = (T_FREEZE_MIN - T_ZERO_C, 50.0);
    /// Ambient pressure of a project, kPa.
    pub const PRESSURE_KPA: (f64, f64) = (1.0, 1000.0);

    /// Whether `v` is finite and within `range` (ends included).
    pub fn within(v: f64, range: (f64, f64)) -> bool {
        v.is_finite() && (range.0..=range.1).contains(&v)
    }
}

/// Checks a product temperature, K.
///
/// # Errors
/// [`ModelError::TemperatureOutOfRange`].
pub fn check_temperature(t_k: f64) -> Result<(), ModelError> {
    let (lo, hi) = Limits::TEMPERATURE_C;
    if Limits::within(t_k - T_ZERO_C, (lo, hi)) {
        Ok(())
    } else {
        Err(ModelError::TemperatureOutOfRange {
            t_c: t_k - T_ZERO_C,
            min_c: lo,
            max_c: hi,
        })
    }
}

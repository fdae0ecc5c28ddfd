//! The scalar properties by name: one list for every place that names them
//! (the command line's JSON and CSV columns, batch `--properties`, goal
//! targets).

use std::fmt;
use std::str::FromStr;

use crate::properties::Properties;

/// A scalar property of [`Properties`], named as in `eval --json`.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum ScalarKey {
    /// `water_activity`: a_w.
    WaterActivity,
    /// `erh_percent`: equilibrium relative humidity, %.
    ErhPercent,
    /// `vapor_pressure_pa`: water vapour pressure over the formula, Pa.
    VaporPressurePa,
    /// `relative_lowering`: 1 − a_w.
    RelativeLowering,
    /// `freezing_point_c`: freezing point, °C.
    FreezingPointC,
    /// `boiling_point_c`: boiling point at the pressure, °C.
    BoilingPointC,
    /// `ice_fraction_of_water`: share of the water frozen at the storage temperature.
    IceFractionOfWater,
    /// `osmolality_mosmol_per_kg`: osmolality, mOsmol/kg.
    OsmolalityMosmolPerKg,
    /// `osmotic_pressure_mpa`: osmotic pressure, MPa.
    OsmoticPressureMpa,
    /// `water_percent`: water as % of the batch.
    WaterPercent,
    /// `soluble_solids_percent`: dissolved solids as % of the solution.
    SolubleSolidsPercent,
    /// `temperature_c`: the product temperature, °C.
    TemperatureC,
    /// `storage_temperature_c`: the storage temperature of the ice fraction, °C.
    StorageTemperatureC,
}

impl ScalarKey {
    /// Every key, in output order.
    pub const ALL: [ScalarKey; 13] = [
        ScalarKey::WaterActivity,
        ScalarKey::ErhPercent,
        ScalarKey::VaporPressurePa,
        ScalarKey::RelativeLowering,
        ScalarKey::FreezingPointC,
        ScalarKey::BoilingPointC,
        ScalarKey::IceFractionOfWater,
        ScalarKey::OsmolalityMosmolPerKg,
        ScalarKey::OsmoticPressureMpa,
        ScalarKey::WaterPercent,
        ScalarKey::SolubleSolidsPercent,
        ScalarKey::TemperatureC,
        ScalarKey::StorageTemperatureC,
    ];

    /// The key's name.
    pub fn as_str(self) -> &'static str {
        match self {
            ScalarKey::WaterActivity => "water_activity",
            ScalarKey::ErhPercent => "erh_percent",
            ScalarKey::VaporPressurePa => "vapor_pressure_pa",
            ScalarKey::RelativeLowering => "relative_lowering",
            ScalarKey::FreezingPointC => "freezing_point_c",
            ScalarKey::BoilingPointC => "boiling_point_c",
            ScalarKey::IceFractionOfWater => "ice_fraction_of_water",
            ScalarKey::OsmolalityMosmolPerKg => "osmolality_mosmol_per_kg",
            ScalarKey::OsmoticPressureMpa => "osmotic_pressure_mpa",
            ScalarKey::WaterPercent => "water_percent",
            ScalarKey::SolubleSolidsPercent => "soluble_solids_percent",
            ScalarKey::TemperatureC => "temperature_c",
            ScalarKey::StorageTemperatureC => "storage_temperature_c",
        }
    }

    /// The value in `p`, `None` when the property was not computed or is
    /// not defined (no freezing point, say).
    pub fn read(self, p: &Properties) -> Option<f64> {
        match self {
            ScalarKey::WaterActivity => Some(p.water_activity),
            ScalarKey::ErhPercent => Some(p.erh_percent),
            ScalarKey::VaporPressurePa => Some(p.vapor_pressure_pa),
            ScalarKey::RelativeLowering => Some(p.relative_lowering),
            ScalarKey::FreezingPointC => p.freezing_point_c,
            ScalarKey::BoilingPointC => p.boiling_point_c,
            ScalarKey::IceFractionOfWater => p.ice_fraction_of_water,
            ScalarKey::OsmolalityMosmolPerKg => Some(p.osmolality_mosmol_per_kg),
            ScalarKey::OsmoticPressureMpa => Some(p.osmotic_pressure_mpa),
            ScalarKey::WaterPercent => Some(p.water_percent),
            ScalarKey::SolubleSolidsPercent => Some(p.soluble_solids_percent),
            ScalarKey::TemperatureC => Some(p.temperature_c),
            ScalarKey::StorageTemperatureC => Some(p.storage_temperature_c),
        }
    }

    /// Whether the value needs a solve beyond a_w (freezing point, boiling
    /// point, ice fraction). The others follow from ln a_w, the composition
    /// and the conditions alone.
    pub fn needs_full_evaluation(self) -> bool {
        matches!(
            self,
            ScalarKey::FreezingPointC | ScalarKey::BoilingPointC | ScalarKey::IceFractionOfWater
        )
    }
}

impl fmt::Display for ScalarKey {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(self.as_str())
    }
}

/// A name that is not a [`ScalarKey`].
#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
#[error("unknown property `{}` (choose from {})", crate::error::elide(.key), accepted())]
pub struct UnknownKey {
    /// The name given.
    pub key: String,
}

fn accepted() -> String {
    ScalarKey::ALL
        .iter()
        .map(|k| k.as_str())
        .collect::<Vec<_>>()
        .join(", ")
}

impl FromStr for ScalarKey {
    type Err = UnknownKey;

    /// Reads a key by its exact name (`water_activity`, …).
    fn from_str(s: &str) -> Result<Self, UnknownKey> {
        ScalarKey::ALL
            .into_iter()
            .find(|k| k.as_str() == s)
            .ok_or_else(|| UnknownKey { key: s.to_string() })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn names_round_trip_and_are_distinct() {
        for k in ScalarKey::ALL {
            assert_eq!(k.as_str().parse::<ScalarKey>(), Ok(k));
            assert_eq!(k.to_string(), k.as_str());
        }
        let mut names: Vec<&str> = ScalarKey::ALL.iter().map(|k| k.as_str()).collect();
        names.sort_unstable();
        names.dedup();
        assert_eq!(names.len(), ScalarKey::ALL.len());
    }

    #[test]
    fn unknown_keys_list_the_accepted_ones() {
        let e = "water_activty".parse::<ScalarKey>().err();
        assert_eq!(
            e.as_ref().map(|e| e.key.as_str()),
            Some("water_activty"),
            "{e:?}"
        );
        let text = e.map(|e| e.to_string()).unwrap_or_default();
        assert!(text.starts_with(
            "unknown property `water_activty` (choose from water_activity, erh_percent,"
        ));
        assert!(text.ends_with("storage_temperature_c)"), "{text}");
    }

    #[test]
    fn only_freezing_boiling_and_ice_need_more_than_aw() {
        let full: Vec<ScalarKey> = ScalarKey::ALL
            .into_iter()
            .filter(|k| k.needs_full_evaluation())
            .collect();
        assert_eq!(
            full,
            [
                ScalarKey::FreezingPointC,
                ScalarKey::BoilingPointC,
                ScalarKey::IceFractionOfWater
            ]
        );
    }
}

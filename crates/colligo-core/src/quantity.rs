//! Reading and writing the quantities users type: masses, percentages,
//! temperatures, pressures and altitudes.
//!
//! Typed values are converted once, here, to SI `f64` (kg, K, Pa); every
//! field and parameter after that names its unit (`temperature_k`,
//! `pressure_pa`). The conversion factors are the exact definitions
//! (avoirdupois pound 0.453 592 37 kg; standard atmosphere 101 325 Pa;
//! conventional millimetre of mercury 133.322 387 415 Pa).

use serde::{Deserialize, Serialize};

use crate::error::FormulaError;
use crate::water::T_ZERO_C;

/// A unit for an ingredient amount.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize, Default)]
#[serde(rename_all = "snake_case")]
pub enum AmountUnit {
    /// Gram.
    #[default]
    G,
    /// Kilogram.
    Kg,
    /// Milligram.
    Mg,
    /// Avoirdupois ounce (28.349523125 g, exact).
    Oz,
    /// Avoirdupois pound (453.59237 g, exact).
    Lb,
    /// Percent of the batch mass.
    Percent,
}

impl AmountUnit {
    /// All units, for pickers.
    pub const ALL: [AmountUnit; 6] = [
        AmountUnit::G,
        AmountUnit::Kg,
        AmountUnit::Mg,
        AmountUnit::Oz,
        AmountUnit::Lb,
        AmountUnit::Percent,
    ];

    /// Symbol.
    pub fn symbol(self) -> &'static str {
        match self {
            AmountUnit::G => "g",
            AmountUnit::Kg => "kg",
            AmountUnit::Mg => "mg",
            AmountUnit::Oz => "oz",
            AmountUnit::Lb => "lb",
            AmountUnit::Percent => "%",
        }
    }

    /// kg per unit (None for percent).
    pub fn kg_per_unit(self) -> Option<f64> {
        match self {
            AmountUnit::G => Some(1e-3),
            AmountUnit::Kg => Some(1.0),
            AmountUnit::Mg => Some(1e-6),
            AmountUnit::Oz => Some(0.028_349_523_125),
            AmountUnit::Lb => Some(0.453_592_37),
            AmountUnit::Percent => None,
        }
    }

    fn parse(s: &str) -> Option<Self> {
        match s.trim().to_ascii_lowercase().as_str() {
            "" | "g" | "gram" | "grams" => Some(AmountUnit::G),
            "kg" | "kilogram" | "kilograms" => Some(AmountUnit::Kg),
            "mg" | "milligram" | "milligrams" => Some(AmountUnit::Mg),
            "oz" | "ounce" | "ounces" => Some(AmountUnit::Oz),
            "lb" | "lbs" | "pound" | "pounds" => Some(AmountUnit::Lb),
            "%" | "percent" | "pct" => Some(AmountUnit::Percent),
            _ => None,
        }
    }
}

/// An amount as typed: a number and its unit.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct Amount {
    /// The number.
    pub value: f64,
    /// Its unit.
    pub unit: AmountUnit,
}

impl Amount {
    /// Grams.
    pub fn grams(value: f64) -> Self {
        Amount {
            value,
            unit: AmountUnit::G,
        }
    }

    /// Mass in kg, or None for a percentage.
    pub fn kg(&self) -> Option<f64> {
        self.unit.kg_per_unit().map(|k| k * self.value)
    }

    /// Text such as `50 g` or `12.5 %`.
    pub fn display(&self) -> String {
        format!("{} {}", trim_float(self.value), self.unit.symbol())
    }
}

/// Formats a number without trailing zeros (up to 6 decimals).
pub fn trim_float(v: f64) -> String {
    let s = format!("{v:.6}");
    let s = s.trim_end_matches('0').trim_end_matches('.');
    if s == "-0" { "0".into() } else { s.to_string() }
}

/// Splits `text` into a leading number (sign, digits, one `.` or `,`
/// decimal mark, optional exponent) and the rest.
/// Reads a plain number as users type it: surrounding space ignored, a
/// decimal comma accepted (`12,5`). `None` when it is not a number.
pub fn parse_number(text: &str) -> Option<f64> {
    text.trim().replace(',', ".").parse().ok()
}

/// A snake_case id from a display name: ASCII letters and digits kept
/// (lower-cased), runs of anything else become one `_`, none at the ends.
/// Empty when nothing is left.
pub fn slug(name: &str) -> String {
    let mut out = String::with_capacity(name.len());
    for c in name.chars() {
        if c.is_ascii_alphanumeric() {
            out.push(c.to_ascii_lowercase());
        } else if !out.is_empty() && !out.ends_with('_') {
            out.push('_');
        }
    }
    while out.ends_with('_') {
        out.pop();
    }
    out
}

/// A value with `decimals` decimals and the unit symbol, e.g. `25.00 °C`;
/// with `trim`, trailing zeros go (`25 °C`), as in fields a user edits.
/// Never a negative zero.
pub fn show_value(v: f64, decimals: usize, trim: bool, symbol: &str) -> String {
    let text = if trim {
        let scale = 10f64.powi(decimals as i32);
        trim_float((v * scale).round() / scale)
    } else {
        fixed(v, decimals)
    };
    format!("{text} {symbol}")
}

/// `v` with `decimals` decimals, never a negative zero: a value that
/// rounds to zero prints `0.00`, not `-0.00`. Non-finite values print as
/// Rust prints them (callers show a dash for a missing value); magnitudes
/// from 1e15 up in scientific notation ([`crate::error::short`]).
pub fn fixed(v: f64, decimals: usize) -> String {
    if v.abs() >= 1e15 {
        // Fixed notation would print every digit of 1e308.
        return crate::error::short(v);
    }
    let s = format!("{v:.decimals$}");
    match s.strip_prefix('-') {
        Some(rest) if rest.bytes().all(|b| b == b'0' || b == b'.') => rest.to_string(),
        _ => s,
    }
}

fn split_number(text: &str) -> Option<(f64, &str)> {
    let t = text.trim();
    let b = t.as_bytes();
    let mut i = 0;
    if i < b.len() && (b[i] == b'-' || b[i] == b'+') {
        i += 1;
    }
    let digits_start = i;
    while i < b.len() && b[i].is_ascii_digit() {
        i += 1;
    }
    if i < b.len() && (b[i] == b'.' || b[i] == b',') {
        i += 1;
        while i < b.len() && b[i].is_ascii_digit() {
            i += 1;
        }
    }
    if i == digits_start || !t[digits_start..i].bytes().any(|c| c.is_ascii_digit()) {
        return None;
    }
    // Exponent only when digits follow, so `5 e` is not swallowed.
    if i < b.len() && (b[i] == b'e' || b[i] == b'E') {
        let mut j = i + 1;
        if j < b.len() && (b[j] == b'-' || b[j] == b'+') {
            j += 1;
        }
        if j < b.len() && b[j].is_ascii_digit() {
            while j < b.len() && b[j].is_ascii_digit() {
                j += 1;
            }
            i = j;
        }
    }
    let v = parse_number(&t[..i])?;
    Some((v, t[i..].trim()))
}

/// Reads an amount such as `50g`, `1.5 kg`, `2 lb`, `12 %` (bare numbers are grams).
///
/// # Errors
/// [`FormulaError::BadAmount`] for text that is not a finite, non-negative
/// number with a known unit.
pub fn parse_amount(text: &str) -> Result<Amount, FormulaError> {
    parse_amount_or(text, AmountUnit::G)
}

/// Reads an amount; a bare number takes `default` as its unit.
///
/// # Errors
/// As [`parse_amount`].
pub fn parse_amount_or(text: &str, default: AmountUnit) -> Result<Amount, FormulaError> {
    let bad = |reason: &str| FormulaError::BadAmount {
        text: text.to_string(),
        reason: reason.to_string(),
    };
    if text.trim().is_empty() {
        return Err(bad("empty"));
    }
    let (value, rest) = split_number(text).ok_or_else(|| bad("not a number"))?;
    let unit = if rest.trim().is_empty() {
        default
    } else {
        AmountUnit::parse(rest).ok_or_else(|| bad("unknown unit (use g, kg, mg, oz, lb or %)"))?
    };
    if !value.is_finite() {
        return Err(bad("not a finite number"));
    }
    if value < 0.0 {
        return Err(bad("amounts cannot be negative"));
    }
    if unit == AmountUnit::Percent && value >= 100.0 {
        return Err(bad("a share of the batch must be below 100 %"));
    }
    Ok(Amount { value, unit })
}

/// A temperature unit.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize, Default)]
#[serde(rename_all = "snake_case")]
pub enum TemperatureUnit {
    /// Degree Celsius.
    #[default]
    Celsius,
    /// Degree Fahrenheit.
    Fahrenheit,
    /// Kelvin.
    Kelvin,
}

impl TemperatureUnit {
    /// All units.
    pub const ALL: [TemperatureUnit; 3] = [
        TemperatureUnit::Celsius,
        TemperatureUnit::Fahrenheit,
        TemperatureUnit::Kelvin,
    ];

    /// Symbol.
    pub fn symbol(self) -> &'static str {
        match self {
            TemperatureUnit::Celsius => "°C",
            TemperatureUnit::Fahrenheit => "°F",
            TemperatureUnit::Kelvin => "K",
        }
    }

    /// Kelvin from a value in this unit.
    pub fn to_kelvin(self, v: f64) -> f64 {
        match self {
            TemperatureUnit::Celsius => v + T_ZERO_C,
            TemperatureUnit::Fahrenheit => (v - 32.0) * 5.0 / 9.0 + T_ZERO_C,
            TemperatureUnit::Kelvin => v,
        }
    }

    /// A value in this unit from kelvin.
    pub fn from_kelvin(self, k: f64) -> f64 {
        match self {
            TemperatureUnit::Celsius => k - T_ZERO_C,
            TemperatureUnit::Fahrenheit => (k - T_ZERO_C) * 9.0 / 5.0 + 32.0,
            TemperatureUnit::Kelvin => k,
        }
    }
}

/// Reads a temperature such as `25C`, `25 °C`, `77F`, `298.15 K`, `-18`
/// (bare numbers are °C). Returns kelvin.
///
/// # Errors
/// [`FormulaError::BadQuantity`].
pub fn parse_temperature(text: &str) -> Result<f64, FormulaError> {
    parse_temperature_in(text).map(|(v, unit)| unit.to_kelvin(v))
}

/// Reads a temperature as [`parse_temperature`] does and returns it in °C.
/// A value given in °C (or a bare number) comes back exactly as written,
/// without a round trip through kelvin.
///
/// # Errors
/// [`FormulaError::BadQuantity`].
pub fn parse_temperature_c(text: &str) -> Result<f64, FormulaError> {
    parse_temperature_in(text).map(|(v, unit)| match unit {
        TemperatureUnit::Celsius => v,
        _ => unit.to_kelvin(v) - T_ZERO_C,
    })
}

/// The number and unit of a temperature, checked to lie above absolute zero.
fn parse_temperature_in(text: &str) -> Result<(f64, TemperatureUnit), FormulaError> {
    let bad = |reason: &str| FormulaError::BadQuantity {
        what: "temperature",
        text: text.to_string(),
        reason: reason.to_string(),
    };
    let (v, rest) = split_number(text).ok_or_else(|| bad("not a number"))?;
    let unit = match rest
        .trim()
        .trim_start_matches('°')
        .to_ascii_lowercase()
        .as_str()
    {
        "" | "c" | "degc" | "celsius" => TemperatureUnit::Celsius,
        "f" | "degf" | "fahrenheit" => TemperatureUnit::Fahrenheit,
        "k" | "kelvin" => TemperatureUnit::Kelvin,
        _ => return Err(bad("unknown unit (use C, F or K)")),
    };
    let k = unit.to_kelvin(v);
    if !k.is_finite() || k <= 0.0 {
        return Err(bad("below absolute zero"));
    }
    Ok((v, unit))
}

/// A pressure unit.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize, Default)]
#[serde(rename_all = "snake_case")]
pub enum PressureUnit {
    /// Kilopascal.
    #[default]
    Kpa,
    /// Hectopascal (= mbar).
    Hpa,
    /// Pascal.
    Pa,
    /// Standard atmosphere.
    Atm,
    /// Millimetre of mercury.
    Mmhg,
    /// Pound-force per square inch.
    Psi,
}

impl PressureUnit {
    /// All units.
    pub const ALL: [PressureUnit; 6] = [
        PressureUnit::Kpa,
        PressureUnit::Hpa,
        PressureUnit::Pa,
        PressureUnit::Atm,
        PressureUnit::Mmhg,
        PressureUnit::Psi,
    ];

    /// Symbol.
    pub fn symbol(self) -> &'static str {
        match self {
            PressureUnit::Kpa => "kPa",
            PressureUnit::Hpa => "hPa",
            PressureUnit::Pa => "Pa",
            PressureUnit::Atm => "atm",
            PressureUnit::Mmhg => "mmHg",
            PressureUnit::Psi => "psi",
        }
    }

    /// Pa per unit.
    pub fn pa_per_unit(self) -> f64 {
        match self {
            PressureUnit::Kpa => 1000.0,
            PressureUnit::Hpa => 100.0,
            PressureUnit::Pa => 1.0,
            PressureUnit::Atm => 101_325.0,
            PressureUnit::Mmhg => 133.322_387_415,
            PressureUnit::Psi => 6_894.757_293_168,
        }
    }
}

/// Pressure of the ICAO standard atmosphere (ISO 2533:1975) at geopotential
/// altitude `h_m` in the troposphere (−500 to 11 000 m), Pa:
/// p = 101 325 (1 − 2.255 77e-5 h)^5.255 88.
pub fn pressure_at_altitude(h_m: f64) -> f64 {
    101_325.0 * (1.0 - 2.255_77e-5 * h_m).powf(5.255_88)
}

/// Reads a pressure such as `101.325kPa`, `1 atm`, `840 hPa`, `760 mmHg`,
/// or an altitude `1600 m` / `5000 ft` (converted by the standard
/// atmosphere). Bare numbers are kPa. Returns Pa.
///
/// # Errors
/// [`FormulaError::BadQuantity`].
pub fn parse_pressure(text: &str) -> Result<f64, FormulaError> {
    let bad = |reason: &str| FormulaError::BadQuantity {
        what: "pressure",
        text: text.to_string(),
        reason: reason.to_string(),
    };
    let (v, rest) = split_number(text).ok_or_else(|| bad("not a number"))?;
    let r = rest.trim().to_ascii_lowercase();
    let pa = match r.as_str() {
        "m" | "m altitude" => altitude(v).map_err(|e| bad(&e))?,
        "ft" | "feet" => altitude(v * 0.3048).map_err(|e| bad(&e))?,
        "mbar" => v * 100.0,
        "bar" => v * 1e5,
        "mpa" => v * 1e6,
        _ => {
            let unit = match r.as_str() {
                "" | "kpa" => PressureUnit::Kpa,
                "hpa" => PressureUnit::Hpa,
                "pa" => PressureUnit::Pa,
                "atm" => PressureUnit::Atm,
                "mmhg" | "torr" => PressureUnit::Mmhg,
                "psi" => PressureUnit::Psi,
                _ => {
                    return Err(bad(
                        "unknown unit (use kPa, hPa, Pa, atm, bar, mmHg, psi, or an altitude in m or ft)",
                    ));
                }
            };
            v * unit.pa_per_unit()
        }
    };
    if !pa.is_finite() || pa <= 0.0 {
        return Err(bad("must be a positive pressure"));
    }
    Ok(pa)
}

fn altitude(h: f64) -> Result<f64, String> {
    if (-500.0..=11_000.0).contains(&h) {
        Ok(pressure_at_altitude(h))
    } else {
        Err("altitude must be between −500 and 11 000 m".into())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn numbers_slugs_and_display() {
        assert_eq!(parse_number(" 12,5 "), Some(12.5));
        assert_eq!(parse_number("abc"), None);
        assert_eq!(slug("Mon sirop — 42 DE!"), "mon_sirop_42_de");
        assert_eq!(slug("***"), "");
        assert_eq!(show_value(-0.0001, 2, false, "°C"), "0.00 °C");
        assert_eq!(show_value(25.0, 2, true, "°C"), "25 °C");
        assert_eq!(show_value(101.325, 1, false, "kPa"), "101.3 kPa");
    }

    #[test]
    fn amounts() {
        let a = parse_amount("50g").unwrap_or_else(|e| panic!("{e}"));
        assert_eq!(a, Amount::grams(50.0));
        assert_eq!(parse_amount("1.5 kg").map(|a| a.kg()), Ok(Some(1.5)));
        assert_eq!(
            parse_amount("12,5 %").map(|a| a.unit),
            Ok(AmountUnit::Percent)
        );
        assert_eq!(parse_amount("2lb").map(|a| a.kg()), Ok(Some(0.907_184_74)));
        assert_eq!(parse_amount("3").map(|a| a.unit), Ok(AmountUnit::G));
        assert_eq!(parse_amount("1e2 g").map(|a| a.value), Ok(100.0));
        for bad in [
            "", "abc", "-5 g", "5 stone", "inf", "NaN g", "100 %", "5..5 g", "g",
        ] {
            assert!(parse_amount(bad).is_err(), "{bad}");
        }
    }

    #[test]
    fn temperatures() {
        let close = |a: f64, b: f64| (a - b).abs() < 1e-9;
        assert!(close(parse_temperature("25C").unwrap_or(0.0), 298.15));
        assert!(close(parse_temperature("-18 °C").unwrap_or(0.0), 255.15));
        assert!(close(parse_temperature("32F").unwrap_or(0.0), 273.15));
        assert!(close(parse_temperature("300 K").unwrap_or(0.0), 300.0));
        assert!(close(parse_temperature("0").unwrap_or(1.0), 273.15));
        assert!(parse_temperature("-300C").is_err());
        assert!(parse_temperature("warm").is_err());
    }

    #[test]
    fn temperatures_in_celsius() {
        // °C input comes back bit for bit: -0.1 + 273.15 - 273.15 would not.
        assert_eq!(parse_temperature_c("-0.1").ok(), Some(-0.1));
        assert_eq!(parse_temperature_c("-18.3 °C").ok(), Some(-18.3));
        // By the definitions of the scales: 14 °F = -10 °C, 263.15 K = -10 °C.
        let close = |a: f64, b: f64| (a - b).abs() < 1e-9;
        assert!(close(parse_temperature_c("14F").unwrap_or(0.0), -10.0));
        assert!(close(parse_temperature_c("263.15K").unwrap_or(0.0), -10.0));
        assert!(parse_temperature_c("-300C").is_err());
        assert!(parse_temperature_c("cold").is_err());
    }

    #[test]
    fn pressures() {
        let close = |a: f64, b: f64| (a - b).abs() < 1e-6 * b;
        assert!(close(
            parse_pressure("101.325kPa").unwrap_or(0.0),
            101_325.0
        ));
        assert!(close(parse_pressure("1 atm").unwrap_or(0.0), 101_325.0));
        assert!(close(parse_pressure("0 m").unwrap_or(0.0), 101_325.0));
        // ISO 2533 standard atmosphere at 1000 m: 89 874.6 Pa (table value).
        assert!((parse_pressure("1000 m").unwrap_or(0.0) - 89_874.6).abs() < 5.0);
        assert!(parse_pressure("-1 kPa").is_err());
        assert!(parse_pressure("20000 m").is_err());
    }
}

//! What the subcommands print: the JSON documents (serde structs, keys in
//! declaration order), the readable tables, and the number format of the
//! CSV and tab-separated tables.

use std::fmt::Write as _;

use colligo_core::Properties;
use colligo_core::keys::ScalarKey;
use colligo_core::properties::{FreezingCurve, IcePoint};
use colligo_core::quantity::fixed;
use csv::QuoteStyle;
use serde::ser::{Serialize, SerializeMap, Serializer};

use crate::{CAUTIONS, csv_out};

/// The scalar properties of `eval --json`, keyed and ordered by
/// [`ScalarKey::ALL`]; a missing or non-finite value is left out (by
/// [`json_text`]), and the warnings say why.
#[derive(Debug, Clone, Copy)]
pub struct Scalars<'a>(pub &'a Properties);

impl Serialize for Scalars<'_> {
    fn serialize<S: Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        let mut m = s.serialize_map(Some(ScalarKey::ALL.len()))?;
        for k in ScalarKey::ALL {
            m.serialize_entry(k.as_str(), &k.read(self.0).filter(|x| x.is_finite()))?;
        }
        m.end()
    }
}

/// One solute of the JSON output.
#[derive(Debug, Clone, serde::Serialize)]
pub struct SoluteJson<'a> {
    /// Solute id.
    pub id: &'a str,
    /// Display name.
    pub name: &'a str,
    /// Dissolved, g.
    pub dissolved_g: f64,
    /// Above the solubility limit, g.
    pub undissolved_g: f64,
    /// Molality, mol/kg water.
    pub molality_mol_per_kg: f64,
    /// Share of ln a_w.
    pub ln_aw_share: f64,
}

/// The pretty JSON text of a document as every subcommand prints it: a
/// member whose value is missing (`null`) is left out, and a negative zero
/// is written as `0.0`, so no output holds `null`, NaN, infinity or `-0`.
///
/// # Errors
/// Serialisation errors.
pub fn json_text<T: Serialize>(doc: &T) -> serde_json::Result<String> {
    let mut v = serde_json::to_value(doc)?;
    tidy(&mut v);
    serde_json::to_string_pretty(&v)
}

fn tidy(v: &mut serde_json::Value) {
    use serde_json::Value;
    match v {
        Value::Object(m) => {
            m.retain(|_, x| !x.is_null());
            m.values_mut().for_each(tidy);
        }
        Value::Array(a) => a.iter_mut().for_each(tidy),
        Value::Number(n) if n.is_f64() && n.as_f64() == Some(0.0) => *v = Value::from(0.0),
        _ => {}
    }
}

/// Every property of a formula, without the cautions (a sweep point
/// carries them once for all points).
#[derive(Debug, Clone, serde::Serialize)]
pub struct PropertiesJson<'a> {
    /// `water_activity` … `storage_temperature_c`.
    #[serde(flatten)]
    pub scalars: Scalars<'a>,
    /// The concrete model used.
    pub model: &'static str,
    /// Why that model.
    pub model_reason: &'a str,
    /// Pressure, kPa.
    pub pressure_kpa: f64,
    /// Vapour pressure of pure water at the temperature, Pa.
    pub pure_water_vapor_pressure_pa: f64,
    /// Freezing-point depression, K.
    pub freezing_point_depression_k: Option<f64>,
    /// Partial pressure of a volatile co-solvent, Pa.
    pub cosolvent_vapor_pressure_pa: Option<f64>,
    /// Batch mass, g.
    pub total_g: f64,
    /// Water, g.
    pub water_g: f64,
    /// Insoluble matter, g.
    pub insoluble_g: f64,
    /// Per-solute reports.
    pub solutes: Vec<SoluteJson<'a>>,
    /// Warnings, as sentences.
    pub warnings: Vec<String>,
}

/// A non-finite value becomes `None`, left out as every missing number.
fn finite(v: Option<f64>) -> Option<f64> {
    v.filter(|x| x.is_finite())
}

impl<'a> PropertiesJson<'a> {
    /// The JSON form of `p`.
    pub fn new(p: &'a Properties) -> Self {
        PropertiesJson {
            scalars: Scalars(p),
            model: p.model.as_str(),
            model_reason: &p.model_reason,
            pressure_kpa: p.pressure_pa / 1000.0,
            pure_water_vapor_pressure_pa: p.pure_water_vapor_pressure_pa,
            freezing_point_depression_k: finite(p.freezing_point_depression_k),
            cosolvent_vapor_pressure_pa: finite(p.cosolvent_vapor_pressure_pa),
            total_g: p.total_g,
            water_g: p.water_g,
            insoluble_g: p.insoluble_g,
            solutes: p
                .solutes
                .iter()
                .map(|s| SoluteJson {
                    id: &s.id,
                    name: &s.name,
                    dissolved_g: s.dissolved_g,
                    undissolved_g: s.undissolved_g,
                    molality_mol_per_kg: s.molality_mol_per_kg,
                    ln_aw_share: s.ln_aw_share,
                })
                .collect(),
            warnings: p.warnings.iter().map(ToString::to_string).collect(),
        }
    }
}

/// The document of `eval --json` (also `properties` of `solve --json`).
#[derive(Debug, Clone, serde::Serialize)]
pub struct EvalJson<'a> {
    /// The properties.
    #[serde(flatten)]
    pub properties: PropertiesJson<'a>,
    /// [`CAUTIONS`].
    pub cautions: &'static str,
}

impl<'a> EvalJson<'a> {
    /// The JSON form of `p`, with the cautions.
    pub fn new(p: &'a Properties) -> Self {
        EvalJson {
            properties: PropertiesJson::new(p),
            cautions: CAUTIONS,
        }
    }
}

/// One point of `sweep --json`.
#[derive(Debug, Clone, serde::Serialize)]
#[serde(untagged)]
pub enum SweepPointJson<'a> {
    /// The properties at this amount.
    Point {
        /// The properties.
        #[serde(flatten)]
        properties: PropertiesJson<'a>,
        /// Amount of the varied ingredient, g.
        amount_g: f64,
    },
    /// Why there are none.
    Failed {
        /// Amount of the varied ingredient, g.
        amount_g: f64,
        /// The reason.
        error: String,
    },
}

/// The document of `sweep --json`.
#[derive(Debug, Clone, serde::Serialize)]
pub struct SweepJson<'a> {
    /// The varied ingredient's id.
    pub ingredient: &'a str,
    /// One point per amount.
    pub points: Vec<SweepPointJson<'a>>,
    /// [`CAUTIONS`].
    pub cautions: &'static str,
}

/// The document of `solve --json`.
#[derive(Debug, Clone, serde::Serialize)]
pub struct SolveJson<'a> {
    /// The varied ingredient's id.
    pub ingredient: &'a str,
    /// The amount found, g.
    pub amount_g: f64,
    /// The target, as given back by its `Display`.
    pub target: String,
    /// The properties at that amount, with the cautions.
    pub properties: EvalJson<'a>,
}

/// One temperature of `freeze --json`.
#[derive(Debug, Clone, serde::Serialize)]
pub struct IcePointJson {
    /// Temperature, °C.
    pub temperature_c: f64,
    /// Share of the water that is ice.
    pub ice_fraction_of_water: f64,
    /// Share of the whole batch that is ice.
    pub ice_fraction_of_total: f64,
    /// a_w of the unfrozen part.
    pub water_activity: f64,
    /// Below the eutectic: all freezable water is ice.
    pub fully_frozen: bool,
}

impl From<&IcePoint> for IcePointJson {
    fn from(p: &IcePoint) -> Self {
        IcePointJson {
            temperature_c: p.temperature_c,
            ice_fraction_of_water: p.ice_fraction_of_water,
            ice_fraction_of_total: p.ice_fraction_of_total,
            water_activity: p.water_activity,
            fully_frozen: p.fully_frozen,
        }
    }
}

/// The document of `freeze --json`.
#[derive(Debug, Clone, serde::Serialize)]
pub struct FreezingJson {
    /// The concrete model used.
    pub model: &'static str,
    /// Freezing point, °C.
    pub freezing_point_c: Option<f64>,
    /// One point per temperature.
    pub points: Vec<IcePointJson>,
    /// Warnings, as sentences.
    pub warnings: Vec<String>,
    /// [`CAUTIONS`].
    pub cautions: &'static str,
}

impl FreezingJson {
    /// The JSON form of `c`.
    pub fn new(c: &FreezingCurve) -> Self {
        FreezingJson {
            model: c.model.as_str(),
            freezing_point_c: finite(c.freezing_point_c),
            points: c.points.iter().map(IcePointJson::from).collect(),
            warnings: c.warnings.iter().map(ToString::to_string).collect(),
            cautions: CAUTIONS,
        }
    }
}

fn fmt_opt(v: Option<f64>, digits: usize, unit: &str) -> String {
    match v {
        Some(x) if x.is_finite() => format!("{} {unit}", fixed(x, digits))
            .trim_end()
            .to_string(),
        _ => "—".into(),
    }
}

/// A readable table of properties.
pub fn properties_table(p: &Properties, title: &str) -> String {
    let mut out = String::new();
    out.push_str(&format!("{title}\n"));
    out.push_str(&format!(
        "  at {} °C, {} kPa; model {} ({})\n\n",
        fixed(p.temperature_c, 2),
        fixed(p.pressure_pa / 1000.0, 3),
        p.model.as_str(),
        p.model_reason
    ));
    let rows: Vec<(&str, String)> = vec![
        ("water activity a_w", fixed(p.water_activity, 4)),
        ("ERH", format!("{} %", fixed(p.erh_percent, 2))),
        (
            "vapour pressure",
            format!(
                "{} Pa (pure water {} Pa)",
                fixed(p.vapor_pressure_pa, 1),
                fixed(p.pure_water_vapor_pressure_pa, 1)
            ),
        ),
        ("relative lowering 1 − a_w", fixed(p.relative_lowering, 4)),
        ("freezing point", fmt_opt(p.freezing_point_c, 2, "°C")),
        (
            "ice fraction of water",
            match p.ice_fraction_of_water {
                Some(f) => format!(
                    "{} % at {} °C",
                    fixed(100.0 * f, 1),
                    fixed(p.storage_temperature_c, 1)
                ),
                None => "—".into(),
            },
        ),
        ("boiling point", fmt_opt(p.boiling_point_c, 2, "°C")),
        (
            "osmolality",
            format!("{} mOsmol/kg", fixed(p.osmolality_mosmol_per_kg, 0)),
        ),
        (
            "osmotic pressure",
            format!("{} MPa", fixed(p.osmotic_pressure_mpa, 3)),
        ),
        (
            "water",
            format!(
                "{} % of {} g",
                fixed(p.water_percent, 2),
                fixed(p.total_g, 2)
            ),
        ),
        (
            "soluble solids",
            format!("{} % of the solution", fixed(p.soluble_solids_percent, 2)),
        ),
    ];
    for (k, v) in rows {
        out.push_str(&format!("  {k:<28}{v}\n"));
    }
    if let Some(pv) = p.cosolvent_vapor_pressure_pa {
        out.push_str(&format!(
            "  {:<28}{} Pa\n",
            "co-solvent vapour pressure",
            fixed(pv, 1)
        ));
    }
    out.push_str("\n  solute                      dissolved g   undissolved g   molality mol/kg\n");
    for s in &p.solutes {
        out.push_str(&format!(
            "  {:<26}{:>12}{:>16}{:>18}\n",
            s.id,
            fixed(s.dissolved_g, 3),
            fixed(s.undissolved_g, 3),
            fixed(s.molality_mol_per_kg, 4)
        ));
    }
    if !p.warnings.is_empty() {
        out.push_str("\n  warnings:\n");
        for w in &p.warnings {
            out.push_str(&format!("  - {w}\n"));
        }
    }
    out.push_str(&format!("\n  {CAUTIONS}\n"));
    out
}

/// A readable table of a freezing curve.
pub fn freezing_table(c: &FreezingCurve) -> String {
    let mut out = format!(
        "freezing point: {}   (model {})\n\n  T °C     ice/water   ice/total   a_w\n",
        fmt_opt(c.freezing_point_c, 2, "°C"),
        c.model.as_str()
    );
    for p in &c.points {
        out.push_str(&format!(
            "  {:>6}   {:>9}   {:>9}   {}{}\n",
            fixed(p.temperature_c, 1),
            fixed(p.ice_fraction_of_water, 4),
            fixed(p.ice_fraction_of_total, 4),
            fixed(p.water_activity, 4),
            if p.eutectic {
                "   (below eutectic)"
            } else {
                ""
            }
        ));
    }
    for w in &c.warnings {
        out.push_str(&format!("  - {w}\n"));
    }
    out.push_str(&format!("\n  {CAUTIONS}\n"));
    out
}

/// The table of `sweep`: one row per amount (in g), the [`ScalarKey::ALL`]
/// columns, the model and the error of a point that failed; CSV when `csv`,
/// else tab-separated (where only the error is quoted, by the CSV rule).
pub fn sweep_table<E: std::fmt::Display>(
    id: &str,
    amounts_kg: &[f64],
    rows: &[Result<Properties, E>],
    csv: bool,
) -> String {
    let mut b = csv_out::builder();
    if !csv {
        b.delimiter(b'\t').quote_style(QuoteStyle::Never);
    }
    csv_out::text_with(&b, |w| {
        w.write_field(format!("{id}_g"))?;
        for k in ScalarKey::ALL {
            w.write_field(k.as_str())?;
        }
        w.write_record(["model", "error"])?;
        for (kg, r) in amounts_kg.iter().zip(rows) {
            w.write_field(fmt_num(kg * 1000.0))?;
            match r {
                Ok(p) => {
                    for k in ScalarKey::ALL {
                        w.write_field(k.read(p).map_or(String::new(), fmt_num))?;
                    }
                    w.write_record([p.model.as_str(), ""])?;
                }
                Err(e) => {
                    for _ in ScalarKey::ALL {
                        w.write_field("")?;
                    }
                    let e = e.to_string();
                    w.write_record(["", &if csv { e } else { csv_out::quote(&e) }])?;
                }
            }
        }
        Ok(())
    })
}

/// `v` with 10 significant digits, as [`push_num`] writes it.
pub fn fmt_num(v: f64) -> String {
    let mut s = String::new();
    push_num(&mut s, v);
    s
}

/// Appends `v` with 10 significant digits and no trailing zeros (fixed
/// notation for ordinary magnitudes), without allocating.
pub fn push_num(out: &mut String, v: f64) {
    if !v.is_finite() {
        return;
    }
    // -0 + 0 is +0: never print a negative zero.
    let v = v + 0.0;
    let a = v.abs();
    if a != 0.0 && !(1e-4..1e9).contains(&a) {
        let _ = write!(out, "{v:.9e}");
        return;
    }
    let decimals = if a == 0.0 {
        0
    } else if a < 1.0 {
        10 + (-a.log10()).floor() as usize
    } else {
        10usize.saturating_sub(a.log10().floor() as usize + 1)
    };
    let start = out.len();
    let _ = write!(out, "{v:.decimals$}");
    if out[start..].contains('.') {
        while out.ends_with('0') {
            out.pop();
        }
        if out.ends_with('.') {
            out.pop();
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn numbers_print_with_ten_significant_digits() {
        assert_eq!(fmt_num(0.945_771_276_584_321), "0.9457712766");
        assert_eq!(fmt_num(101.0), "101");
        assert_eq!(fmt_num(-18.25), "-18.25");
        assert_eq!(fmt_num(0.000_123_456_789_012), "0.000123456789");
        assert_eq!(fmt_num(0.0), "0");
        assert_eq!(fmt_num(3_169.824_486_313_972), "3169.824486");
        assert_eq!(fmt_num(f64::NAN), "");
        assert_eq!(fmt_num(1.5e-7), "1.500000000e-7");
    }

    #[test]
    fn sweep_tables_quote_only_the_error() {
        let rows: Vec<Result<Properties, String>> = vec![Err("no water, \"none\"".into())];
        let empties = ",".repeat(ScalarKey::ALL.len() + 2);
        let csv = sweep_table("water", &[0.0], &rows, true);
        let mut lines = csv.lines();
        assert!(lines.next().is_some_and(
            |h| h.starts_with("water_g,water_activity,") && h.ends_with(",model,error")
        ));
        assert_eq!(
            lines.next(),
            Some(format!("0{empties}\"no water, \"\"none\"\"\"").as_str())
        );
        let tsv = sweep_table("water", &[0.0], &rows, false);
        let tabs = "\t".repeat(ScalarKey::ALL.len() + 2);
        assert!(tsv.starts_with("water_g\twater_activity\t"), "{tsv}");
        assert!(
            tsv.ends_with(&format!("\n0{tabs}\"no water, \"\"none\"\"\"\n")),
            "{tsv}"
        );
    }
}

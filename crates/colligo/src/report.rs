//! Turning results into JSON objects and readable tables for the command
//! line (the app shares the cautions text).

use colligo_core::Properties;
use colligo_core::properties::FreezingCurve;
use serde_json::{Value, json};

/// The cautions printed with every result a person may act on.
pub const CAUTIONS: &str = "Predictions are estimates from published models. Confirm with a calibrated water-activity \
measurement (e.g. ISO 18787) before relying on a formula, and defer to local food or cosmetic codes and to a \
process authority or other licensed practice for safety decisions.";

/// The scalar keys of `eval --json`, in output order (also the batch columns).
pub const SCALAR_KEYS: [&str; 13] = [
    "water_activity",
    "erh_percent",
    "vapor_pressure_pa",
    "relative_lowering",
    "freezing_point_c",
    "boiling_point_c",
    "ice_fraction_of_water",
    "osmolality_mosmol_per_kg",
    "osmotic_pressure_mpa",
    "water_percent",
    "soluble_solids_percent",
    "temperature_c",
    "storage_temperature_c",
];

fn opt(v: Option<f64>) -> Value {
    v.filter(|x| x.is_finite()).map_or(Value::Null, Value::from)
}

/// A scalar property by key, `None` when absent.
pub fn scalar(p: &Properties, key: &str) -> Option<f64> {
    match key {
        "water_activity" => Some(p.water_activity),
        "erh_percent" => Some(p.erh_percent),
        "vapor_pressure_pa" => Some(p.vapor_pressure_pa),
        "relative_lowering" => Some(p.relative_lowering),
        "freezing_point_c" => p.freezing_point_c,
        "boiling_point_c" => p.boiling_point_c,
        "ice_fraction_of_water" => p.ice_fraction_of_water,
        "osmolality_mosmol_per_kg" => Some(p.osmolality_mosmol_per_kg),
        "osmotic_pressure_mpa" => Some(p.osmotic_pressure_mpa),
        "water_percent" => Some(p.water_percent),
        "soluble_solids_percent" => Some(p.soluble_solids_percent),
        "temperature_c" => Some(p.temperature_c),
        "storage_temperature_c" => Some(p.storage_temperature_c),
        _ => None,
    }
}

/// The JSON object of `eval --json`.
pub fn properties_json(p: &Properties) -> Value {
    let mut m = serde_json::Map::new();
    for k in SCALAR_KEYS {
        m.insert(k.to_string(), opt(scalar(p, k)));
    }
    m.insert("model".into(), json!(p.model.as_str()));
    m.insert("model_reason".into(), json!(p.model_reason));
    m.insert("pressure_kpa".into(), json!(p.pressure_pa / 1000.0));
    m.insert(
        "pure_water_vapor_pressure_pa".into(),
        json!(p.pure_water_vapor_pressure_pa),
    );
    m.insert(
        "freezing_point_depression_k".into(),
        opt(p.freezing_point_depression_k),
    );
    m.insert(
        "cosolvent_vapor_pressure_pa".into(),
        opt(p.cosolvent_vapor_pressure_pa),
    );
    m.insert("total_g".into(), json!(p.total_g));
    m.insert("water_g".into(), json!(p.water_g));
    m.insert("insoluble_g".into(), json!(p.insoluble_g));
    m.insert(
        "solutes".into(),
        Value::Array(
            p.solutes
                .iter()
                .map(|s| {
                    json!({
                        "id": s.id,
                        "name": s.name,
                        "dissolved_g": s.dissolved_g,
                        "undissolved_g": s.undissolved_g,
                        "molality_mol_per_kg": s.molality_mol_per_kg,
                        "ln_aw_share": s.ln_aw_share,
                    })
                })
                .collect(),
        ),
    );
    m.insert(
        "warnings".into(),
        Value::Array(p.warnings.iter().map(|w| json!(w.to_string())).collect()),
    );
    m.insert("cautions".into(), json!(CAUTIONS));
    Value::Object(m)
}

fn fmt_opt(v: Option<f64>, digits: usize, unit: &str) -> String {
    match v {
        Some(x) if x.is_finite() => format!("{x:.digits$} {unit}").trim_end().to_string(),
        _ => "—".into(),
    }
}

/// A readable table of properties.
pub fn properties_table(p: &Properties, title: &str) -> String {
    let mut out = String::new();
    out.push_str(&format!("{title}\n"));
    out.push_str(&format!(
        "  at {:.2} °C, {:.3} kPa; model {} ({})\n\n",
        p.temperature_c,
        p.pressure_pa / 1000.0,
        p.model.as_str(),
        p.model_reason
    ));
    let rows: Vec<(&str, String)> = vec![
        ("water activity a_w", format!("{:.4}", p.water_activity)),
        ("ERH", format!("{:.2} %", p.erh_percent)),
        (
            "vapour pressure",
            format!(
                "{:.1} Pa (pure water {:.1} Pa)",
                p.vapor_pressure_pa, p.pure_water_vapor_pressure_pa
            ),
        ),
        (
            "relative lowering 1 − a_w",
            format!("{:.4}", p.relative_lowering),
        ),
        ("freezing point", fmt_opt(p.freezing_point_c, 2, "°C")),
        (
            "ice fraction of water",
            match p.ice_fraction_of_water {
                Some(f) => format!("{:.1} % at {:.1} °C", 100.0 * f, p.storage_temperature_c),
                None => "—".into(),
            },
        ),
        ("boiling point", fmt_opt(p.boiling_point_c, 2, "°C")),
        (
            "osmolality",
            format!("{:.0} mOsmol/kg", p.osmolality_mosmol_per_kg),
        ),
        (
            "osmotic pressure",
            format!("{:.3} MPa", p.osmotic_pressure_mpa),
        ),
        (
            "water",
            format!("{:.2} % of {:.2} g", p.water_percent, p.total_g),
        ),
        (
            "soluble solids",
            format!("{:.2} % of the solution", p.soluble_solids_percent),
        ),
    ];
    for (k, v) in rows {
        out.push_str(&format!("  {k:<28}{v}\n"));
    }
    if let Some(pv) = p.cosolvent_vapor_pressure_pa {
        out.push_str(&format!(
            "  {:<28}{pv:.1} Pa\n",
            "co-solvent vapour pressure"
        ));
    }
    out.push_str("\n  solute                      dissolved g   undissolved g   molality mol/kg\n");
    for s in &p.solutes {
        out.push_str(&format!(
            "  {:<26}{:>12.3}{:>16.3}{:>18.4}\n",
            s.id, s.dissolved_g, s.undissolved_g, s.molality_mol_per_kg
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

/// The JSON object of `freeze --json`.
pub fn freezing_json(c: &FreezingCurve) -> Value {
    json!({
        "model": c.model.as_str(),
        "freezing_point_c": opt(c.freezing_point_c),
        "points": c.points.iter().map(|p| json!({
            "temperature_c": p.temperature_c,
            "ice_fraction_of_water": p.ice_fraction_of_water,
            "ice_fraction_of_total": p.ice_fraction_of_total,
            "water_activity": p.water_activity,
            "fully_frozen": p.fully_frozen,
        })).collect::<Vec<_>>(),
        "warnings": c.warnings.iter().map(|w| w.to_string()).collect::<Vec<_>>(),
        "cautions": CAUTIONS,
    })
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
            "  {:>6.1}   {:>9.4}   {:>9.4}   {:.4}{}\n",
            p.temperature_c,
            p.ice_fraction_of_water,
            p.ice_fraction_of_total,
            p.water_activity,
            if p.fully_frozen {
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

//! Physical-range checks of every numeric field of a solute or ingredient
//! record, built-in or the user's: each value finite and within the range
//! the models can use, each error naming the field.

use super::records::{
    FreezeBehaviour, IngredientRecord, NorrishRecord, SoluteKind, SoluteRecord, WilsonRecord,
};
use crate::correlations::TempFn;
use crate::error::{FieldProblem, LibraryError};
use crate::properties::Limits;
use crate::water::T_ZERO_C;

/// Molar masses accepted, g/mol: above hydrogen's, up to large polymers.
pub const MOLAR_MASS_G_PER_MOL: (f64, f64) = (1.0, 1.0e6);
/// Temperatures a data range may span, °C.
pub const DATA_TEMPERATURE_C: (f64, f64) = (-100.0, 400.0);
/// Largest |K| of a Norrish constant accepted. The largest published ones
/// are for polyethylene glycols (PEG-600 about 56, Chirife, Ferro Fontán &
/// Benmergui 1980, from memory); 10⁴ leaves room and refuses nonsense.
pub const NORRISH_K_MAX: f64 = 1.0e4;
/// Liquid molar volumes accepted, cm³/mol.
pub const MOLAR_VOLUME_CM3_PER_MOL: (f64, f64) = (1.0, 1.0e4);
/// Largest |a12|, |a21| of a Wilson pair accepted, J/mol, anywhere a
/// product temperature may lie. Wilson energies of water with alcohols and
/// glycols are of the order of 10² to 10⁴ J/mol (from memory of the
/// compiled vapour–liquid equilibrium tables); 10⁵ leaves room, and keeps
/// Λ = (V/V) exp(−a/RT) a finite number down to −60 °C.
pub const WILSON_ENERGY_MAX_J_PER_MOL: f64 = 1.0e5;
/// Water of crystallisation accepted, mol per mol of solute. The largest
/// in the built-in data is 12 (Na₂HPO₄·12H₂O); 30 leaves room.
pub const HYDRATE_WATER_MAX: f64 = 30.0;

fn problem(id: &str, field: impl Into<String>, problem: FieldProblem) -> LibraryError {
    LibraryError::Field {
        id: id.to_string(),
        field: field.into(),
        problem,
    }
}

/// `v` finite and within `range` (ends included).
fn within(id: &str, field: &str, v: f64, range: (f64, f64)) -> Result<(), LibraryError> {
    if !v.is_finite() {
        return Err(problem(id, field, FieldProblem::NotFinite { value: v }));
    }
    if v < range.0 || v > range.1 {
        return Err(problem(
            id,
            field,
            FieldProblem::OutOfRange {
                value: v,
                min: range.0,
                max: range.1,
            },
        ));
    }
    Ok(())
}

/// A (low, high) range of finite values with low < high, within `bounds`.
fn range_ok(id: &str, field: &str, r: (f64, f64), bounds: (f64, f64)) -> Result<(), LibraryError> {
    within(id, &format!("{field}.0"), r.0, bounds)?;
    within(id, &format!("{field}.1"), r.1, bounds)?;
    if r.0 >= r.1 {
        return Err(problem(
            id,
            field,
            FieldProblem::EmptyRange { lo: r.0, hi: r.1 },
        ));
    }
    Ok(())
}

fn correlation(id: &str, field: &str, f: &TempFn) -> Result<(), LibraryError> {
    f.check()
        .map_err(|e| problem(id, field, FieldProblem::Correlation(e)))
}

/// Checks every numeric field of a solute record.
///
/// # Errors
/// [`LibraryError::Field`] naming the first field out of range.
pub fn solute(rec: &SoluteRecord) -> Result<(), LibraryError> {
    let id = rec.id.as_str();
    within(
        id,
        "molar_mass_g_per_mol",
        rec.molar_mass_g_per_mol,
        MOLAR_MASS_G_PER_MOL,
    )?;
    if let Some(n) = &rec.norrish {
        norrish(id, n)?;
    }
    if let Some(s) = &rec.solubility {
        s.g_per_100g_water.check().map_err(|e| {
            problem(
                id,
                "solubility.g_per_100g_water",
                FieldProblem::Correlation(e),
            )
        })?;
        for (i, &(t, g)) in s.g_per_100g_water.0.iter().enumerate() {
            within(
                id,
                &format!("solubility.g_per_100g_water[{i}].0"),
                t,
                DATA_TEMPERATURE_C,
            )?;
            within(
                id,
                &format!("solubility.g_per_100g_water[{i}].1"),
                g,
                (0.0, 1.0e6),
            )?;
        }
        if let FreezeBehaviour::Crystallises { hydrate_water } = s.on_freezing {
            within(
                id,
                "solubility.on_freezing.hydrate_water",
                hydrate_water,
                (0.0, HYDRATE_WATER_MAX),
            )?;
        }
    }
    if let SoluteKind::Volatile(v) = &rec.kind {
        wilson(id, &v.wilson)?;
        let a = &v.antoine;
        within(id, "kind.antoine.a", a.a, (-1.0e3, 1.0e3))?;
        within(id, "kind.antoine.b", a.b, (-1.0e6, 1.0e6))?;
        within(id, "kind.antoine.c", a.c, (-1.0e3, 1.0e3))?;
        range_ok(
            id,
            "kind.antoine.t_range_c",
            a.t_range_c,
            DATA_TEMPERATURE_C,
        )?;
        // T + C must stay positive over the range, or the equation has a pole in it.
        if a.t_range_c.0 + T_ZERO_C + a.c <= 0.0 {
            return Err(problem(
                id,
                "kind.antoine.c",
                FieldProblem::OutOfRange {
                    value: a.c,
                    min: -(a.t_range_c.0 + T_ZERO_C),
                    max: 1.0e3,
                },
            ));
        }
    }
    Ok(())
}

fn norrish(id: &str, n: &NorrishRecord) -> Result<(), LibraryError> {
    correlation(id, "norrish.k", &n.k)?;
    within(
        id,
        "norrish.max_mole_fraction",
        n.max_mole_fraction,
        (1.0e-9, 0.999),
    )?;
    range_ok(id, "norrish.t_range_c", n.t_range_c, DATA_TEMPERATURE_C)?;
    let x = n.max_mole_fraction;
    // A negative K (positive deviation from Raoult) must leave the binary
    // ln a_w = ln(1 − x) − K x² falling over the data, or adding solute
    // would raise a_w: d/dx < 0 ⇔ −K < 1 / (2x(1 − x)), tightest at x_max.
    let k_min = -1.0 / (2.0 * x * (1.0 - x));
    for t_c in [n.t_range_c.0, n.t_range_c.1] {
        let k = n.k_at(t_c + T_ZERO_C);
        within(id, "norrish.k", k, (-NORRISH_K_MAX, NORRISH_K_MAX))?;
        if k < k_min {
            return Err(problem(
                id,
                "norrish.k",
                FieldProblem::RaisesWaterActivity { k, k_min },
            ));
        }
    }
    Ok(())
}

fn wilson(id: &str, w: &WilsonRecord) -> Result<(), LibraryError> {
    let energies = [
        ("kind.wilson.a12_j_per_mol", &w.a12_j_per_mol),
        ("kind.wilson.a21_j_per_mol", &w.a21_j_per_mol),
    ];
    for (field, f) in energies {
        correlation(id, field, f)?;
        // The models evaluate the energies at any product temperature, not
        // only within the data: every 5 K from −60 to 200 °C, both ends
        // included.
        let (lo, hi) = Limits::TEMPERATURE_C;
        let steps = ((hi - lo) / 5.0).ceil() as usize;
        for i in 0..=steps {
            let t_c = (lo + 5.0 * i as f64).min(hi);
            let a = f.eval(t_c + T_ZERO_C, 0.1);
            within(
                id,
                field,
                a,
                (-WILSON_ENERGY_MAX_J_PER_MOL, WILSON_ENERGY_MAX_J_PER_MOL),
            )?;
        }
    }
    within(
        id,
        "kind.wilson.v_solute_cm3_per_mol",
        w.v_solute_cm3_per_mol,
        MOLAR_VOLUME_CM3_PER_MOL,
    )?;
    within(
        id,
        "kind.wilson.v_water_cm3_per_mol",
        w.v_water_cm3_per_mol,
        MOLAR_VOLUME_CM3_PER_MOL,
    )?;
    range_ok(id, "kind.wilson.t_range_c", w.t_range_c, DATA_TEMPERATURE_C)?;
    within(
        id,
        "kind.wilson.max_mass_fraction",
        w.max_mass_fraction,
        (1.0e-9, 1.0),
    )?;
    within(
        id,
        "kind.wilson.partial_pressure_t_min_c",
        w.partial_pressure_t_min_c,
        DATA_TEMPERATURE_C,
    )?;
    Ok(())
}

/// Checks every numeric field of an ingredient record (the composition
/// adding up is checked where it is normalised).
///
/// # Errors
/// [`LibraryError::Field`] naming the first field out of range.
pub fn ingredient(rec: &IngredientRecord) -> Result<(), LibraryError> {
    let id = rec.id.as_str();
    within(id, "water_g_per_100g", rec.water_g_per_100g, (0.0, 100.5))?;
    let ins = &rec.insoluble;
    for (field, v) in [
        ("insoluble.fat", ins.fat),
        ("insoluble.protein", ins.protein),
        ("insoluble.starch", ins.starch),
        ("insoluble.fibre", ins.fibre),
        ("insoluble.other", ins.other),
    ] {
        within(id, field, v, (0.0, 100.5))?;
    }
    for (i, s) in rec.solutes.iter().enumerate() {
        within(
            id,
            &format!("solutes[{i}].g_per_100g"),
            s.g_per_100g,
            (0.0, 100.5),
        )?;
        if let Some(m) = s.molar_mass_g_per_mol {
            within(
                id,
                &format!("solutes[{i}].molar_mass_g_per_mol"),
                m,
                MOLAR_MASS_G_PER_MOL,
            )?;
        }
    }
    Ok(())
}

//! Freezing points of binary solutions against the CRC Handbook
//! ("Concentrative properties of aqueous solutions", data of A. V. Wolf)
//! and other published tables in `data/freezing_points.csv`.

use colligo_core::composition::Composition;
use colligo_core::models::{CapMode, Evaluator, ModelChoice};
use colligo_core::properties::freezing_point_with;
use colligo_core::water::T_ZERO_C;
use colligo_reference::{Check, Row, Tol, library, table};

/// Relative tolerance on ΔT_f per solute, with the reason.
fn tolerance(r: &Row) -> f64 {
    let id = r.str("solute");
    let w = r.num("mass_percent");
    match id {
        // Two Pitzer models (Archer 1992; FREZCHEM) freeze NaCl 0.1–0.25 K
        // colder than the CRC table above 10 wt %: 2 % there, 1 % below.
        "sodium_chloride" | "potassium_chloride" => {
            if w > 10.0 {
                0.02
            } else {
                0.01
            }
        }
        // Sucrose with Norrish K = 6.47 (Chirife et al. 1980): within
        // 0.02 K to 30 %; 3 % at 40 % where K's data end.
        "sucrose" => 0.03,
        // Lactic acid: one constant K cannot follow both the dilute and the
        // concentrated CRC rows (fit residual 10.5 % at the dilute end).
        "lactic_acid" => 0.11,
        // Ethanol: a temperature-dependent Wilson pair fitted to freezing
        // points and to vapour-liquid equilibria at 30–90 °C together
        // (worst 8.5 %, Lange's 16.4 wt % row); see the solutes file.
        "ethanol" => 0.10,
        // Citric acid and lactose: constant-K fits with a worst residual
        // of 4.9 % and 5.6 %.
        "citric_acid" | "lactose" => 0.06,
        // The rest (glycerol and propylene glycol with K(T), sugars, urea,
        // acetic acid, mannitol): 3.5 %, glycerol 40 % inside the 3 % goal
        // checked separately below.
        _ => 0.035,
    }
}

fn depression(lib: &colligo_core::Library, id: &str, wt: f64) -> f64 {
    let s = lib
        .solute(id)
        .unwrap_or_else(|| panic!("unknown solute {id}"));
    let mut comp = Composition::new();
    comp.add_water(1.0 - wt / 100.0);
    comp.add_solute(s, wt / 100.0, lib.solutes[s].molar_mass);
    let mut ev = Evaluator::new(lib, &comp, ModelChoice::Auto.resolve(lib, &comp).model);
    // Handbook freezing points include metastable, supersaturated
    // solutions (urea beyond its eutectic): no solubility cap.
    T_ZERO_C
        - freezing_point_with(&mut ev, &CapMode::Unlimited, None)
            .unwrap_or_else(|e| panic!("{id} {wt} %: {e}"))
}

#[test]
fn freezing_point_depressions() {
    let lib = library();
    let mut by_solute: std::collections::BTreeMap<String, Check> =
        std::collections::BTreeMap::new();
    for r in table("freezing_points") {
        let id = r.str("solute").to_string();
        let wt = r.num("mass_percent");
        let got = depression(&lib, &id, wt);
        let tol = tolerance(&r);
        by_solute
            .entry(id.clone())
            .or_insert_with(|| Check::new(&format!("freezing_points {id}")))
            .compare(
                &r,
                &format!("ΔT_f {id} {wt} wt %"),
                got,
                r.num("delta_t_k"),
                Tol::Rel(tol),
            );
    }
    colligo_reference::finish_all(by_solute.into_values());
}

/// The temperature-aware glycerol model reproduces the CRC freezing point
/// of 40 wt % glycerol (15.50 K) within 3 %.
#[test]
fn glycerol_40_percent() {
    let lib = library();
    let got = depression(&lib, "glycerol", 40.0);
    // CRC Handbook, Concentrative properties (Wolf): 40 wt % glycerol, ΔT_f = 15.50 K.
    assert!((got - 15.50).abs() <= 0.03 * 15.50, "ΔT_f = {got:.3} K");
}

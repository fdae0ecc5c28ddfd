//! Electrolytes: Pitzer osmotic coefficients and water activities, boiling
//! points, the saturated NaCl solution, the NaCl–ice eutectic and the ice
//! fraction of freezing brine.

use colligo_core::composition::Composition;
use colligo_core::models::{CapMode, Evaluator, Model, ModelChoice};
use colligo_core::properties::{WarmStart, boiling_point, ice_fraction};
use colligo_core::water::{self, M_W, T_ZERO_C};
use colligo_core::{Conditions, Library, Wanted, evaluate};
use colligo_reference::{Check, Row, Tol, library, table};

/// 1 kg of water with each listed solute at its molality.
fn brine(lib: &Library, ids: &str, molalities: &[f64]) -> Composition {
    let mut c = Composition::new();
    c.add_water(1.0);
    for (id, m) in ids.split('+').zip(molalities) {
        let s = lib
            .solute(id)
            .unwrap_or_else(|| panic!("unknown solute {id}"));
        let mm = lib.solutes[s].molar_mass;
        c.add_solute(s, m * mm, mm);
    }
    c
}

fn particles(lib: &Library, ids: &str, molalities: &[f64]) -> f64 {
    ids.split('+')
        .zip(molalities)
        .map(|(id, m)| lib.solutes[lib.solute(id).unwrap_or(0)].nu * m)
        .sum()
}

/// Osmotic coefficients and a_w of single and mixed salts: Archer (1992),
/// Archer (1999), Holmes & Mesmer (1986), Møller (1988) and Harvie, Møller &
/// Weare (1984) as computed by pytzer 0.6.0, and Pitzer (1991) values,
/// against our Pitzer implementation (no solubility cap: the tables include
/// supersaturated points).
#[test]
fn osmotic_coefficients() {
    let lib = library();
    let mut checks: std::collections::BTreeMap<&str, (Check, Check)> =
        std::collections::BTreeMap::new();
    for r in table("osmotic_coefficients") {
        let sys = r.str("system");
        let m = r.nums("molalities");
        let t = r.num("t_c") + T_ZERO_C;
        let c = brine(&lib, sys, &m);
        let mut ev = Evaluator::new(&lib, &c, Model::Pitzer);
        let mols: Vec<f64> = ev.components().iter().map(|x| x.mol).collect();
        let ln_aw = ev.ln_aw_of(t, 1.0, &mols);
        let got_phi = -ln_aw / (M_W * particles(&lib, sys, &m));
        let label = format!("{sys} {m:?} mol/kg at {} °C", r.num("t_c"));
        let (kind, tp, ta) = tolerances(&r);
        let (phi, aw) = checks.entry(kind).or_insert_with(|| {
            (
                Check::new(&format!("osmotic φ, {kind}")),
                Check::new(&format!("osmotic a_w, {kind}")),
            )
        });
        if let Some(want) = r.opt_num("osmotic_coefficient") {
            phi.compare(&r, &label, got_phi, want, Tol::Abs(tp));
        }
        if let Some(want) = r.opt_num("water_activity") {
            aw.compare(&r, &label, ln_aw.exp(), want, Tol::Abs(ta));
        }
    }
    for (_, (phi, aw)) in checks {
        phi.finish();
        aw.finish();
    }
}

/// Tolerances (φ, a_w) by what the reference row computed.
fn tolerances(r: &Row) -> (&'static str, f64, f64) {
    let src = r.source();
    if src.contains("HMW84 set")
        || src.contains("M88 set")
        || src.contains("bC_Ca_Cl_M88")
        || src.contains("Robinson")
    {
        // A different published parameter set (Harvie, Møller & Weare 1984;
        // Møller 1988) or a handbook table: the spread between independent
        // Pitzer sets, up to 7e-3 in φ at 5 mol/kg ionic strength. Na2SO4
        // (Holmes & Mesmer 1986 here, Møller 1988 there) is compared only
        // below its solubility, where the two sets differ by up to 9e-3 in φ
        // (0.3 mol/kg at 0 °C); a set whose φ(T) is wrong, such as the
        // Hovey, Pitzer & Rard (1993) set as transcribed in pytzer, misses
        // these rows by 0.05 in φ and 5e-3 in a_w.
        ("independent parameter sets", 1e-2, 1.5e-3)
    } else if src.contains("linear blend") {
        // The same parameter set and A_φ as ours, evaluated by pytzer: an
        // implementation check.
        ("same set and A_φ (implementation)", 2e-5, 2e-6)
    } else {
        // Same parameter set, A_φ of Archer & Wang (1990) instead of Clegg,
        // Rard & Pitzer (1994): they differ by up to 3e-4 at 25 °C.
        ("same set, Archer-Wang A_φ", 3e-3, 5e-4)
    }
}

/// Boiling points of NaCl brines at 101.325 kPa and at 84 kPa.
#[test]
fn boiling_points() {
    let lib = library();
    let mut c = Check::new("boiling_points");
    for r in table("boiling_points") {
        let sys = r.str("system");
        let m = r.nums("molalities");
        let p = r.num("pressure_kpa") * 1000.0;
        let comp = brine(&lib, sys, &m);
        let mut ev = Evaluator::new(&lib, &comp, Model::Pitzer);
        let tb =
            boiling_point(&mut ev, p, None).unwrap_or_else(|e| panic!("{sys}: {e}")) - T_ZERO_C;
        // pytzer rows: same model, 0.05 K; the handbook row for saturated
        // brine is given to 0.1 K.
        let tol = if r.str("tag") == "Pub" { 0.3 } else { 0.05 };
        c.compare(
            &r,
            &format!("{sys} {m:?} mol/kg at {p} Pa"),
            tb,
            r.num("boiling_point_c"),
            Tol::Abs(tol),
        );
    }
    c.finish();
}

/// ERH over saturated salt solutions at 25 °C (Greenspan 1977): the
/// formula holds excess salt, the model caps it at its solubility.
#[test]
fn saturated_salt_solutions() {
    let lib = library();
    let mut c = Check::new("saturated_solutions");
    for r in table("saturated_solutions") {
        let id = r.str("solute");
        if lib.solute(id).is_none() {
            println!("skipped {id}: not in the library");
            continue;
        }
        let comp = brine(&lib, id, &[20.0]);
        let cond = Conditions {
            temperature_k: r.num("t_c") + T_ZERO_C,
            ..Conditions::default()
        };
        let p = evaluate(
            &lib,
            &comp,
            ModelChoice::Auto,
            &cond,
            Wanted::WATER_ACTIVITY,
        )
        .unwrap_or_else(|e| panic!("{e}"));
        // Greenspan's uncertainty (± 0.12 % for NaCl) plus the solubility
        // curve's: 0.3 % ERH.
        c.compare(
            &r,
            &format!("saturated {id}"),
            p.erh_percent,
            r.num("erh_percent"),
            Tol::Abs(r.num("uncertainty_percent") + 0.3),
        );
    }
    c.finish();
}

/// The NaCl–ice eutectic: the temperature where the saturated solution is
/// in equilibrium with ice (Drebushchak et al. 2017).
#[test]
fn nacl_eutectic() {
    let lib = library();
    let na = lib.solute("sodium_chloride").unwrap_or(0);
    let mut c = Check::new("eutectics");
    for r in table("eutectics") {
        // Find T where a_w(saturated at T) = a_w,ice(T) by bisection.
        let comp = brine(&lib, r.str("solute"), &[8.0]);
        let mut ev = Evaluator::new(&lib, &comp, ModelChoice::Auto.resolve(&lib, &comp).model);
        let mut f =
            |t: f64| ev.ln_aw(t, 1.0, &CapMode::Equilibrium) - water::ice_equilibrium_ln_aw(t);
        let (mut lo, mut hi) = (T_ZERO_C - 30.0, T_ZERO_C - 10.0);
        assert!(f(lo) > 0.0 && f(hi) < 0.0, "no eutectic bracket");
        for _ in 0..60 {
            let mid = 0.5 * (lo + hi);
            if f(mid) > 0.0 { lo = mid } else { hi = mid }
        }
        let te = 0.5 * (lo + hi);
        let (m_sat, _) = lib.solutes[na]
            .solubility_molality(te)
            .unwrap_or((f64::NAN, false));
        let wt =
            100.0 * m_sat * lib.solutes[na].molar_mass / (1.0 + m_sat * lib.solutes[na].molar_mass);
        c.compare(
            &r,
            "eutectic temperature °C",
            te - T_ZERO_C,
            r.num("t_c"),
            Tol::Abs(0.4),
        );
        c.compare(
            &r,
            "eutectic brine wt %",
            wt,
            r.num("mass_percent"),
            Tol::Abs(0.4),
        );
    }
    c.finish();
}

/// Ice fraction of freezing NaCl brines (lever rule on water with the
/// Archer 1992 model and the Gibbs-route ice equilibrium, pytzer + iapws).
#[test]
fn ice_fraction_of_brines() {
    let lib = library();
    let mut c = Check::new("ice_fraction");
    for r in table("ice_fraction") {
        let id = r.str("solute");
        let wt = r.num("mass_percent");
        let s = lib.solute(id).unwrap_or(0);
        let mut comp = Composition::new();
        comp.add_water(1.0 - wt / 100.0);
        comp.add_solute(s, wt / 100.0, lib.solutes[s].molar_mass);
        let mut ev = Evaluator::new(&lib, &comp, ModelChoice::Auto.resolve(&lib, &comp).model);
        ev.ln_aw(298.15, comp.water_kg, &CapMode::Equilibrium);
        let before = ev.last_dissolved().to_vec();
        let t = r.num("t_c") + T_ZERO_C;
        let p = ice_fraction(&mut ev, &before, 1.0, t, &mut WarmStart::default())
            .unwrap_or_else(|e| panic!("{e}"));
        c.compare(
            &r,
            &format!("{wt} wt % {id} at {} °C", r.num("t_c")),
            p.ice_fraction_of_water,
            r.num("ice_fraction_of_water"),
            Tol::Abs(2e-3),
        );
    }
    c.finish();
}

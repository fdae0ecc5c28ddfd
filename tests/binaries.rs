//! Binary solutions at 25–50 °C: water activity of salts and of ethanol,
//! and the Debye–Hückel slope A_φ(T).

use colligo_core::composition::Composition;
use colligo_core::models::pitzer::aphi;
use colligo_core::models::{CapMode, Evaluator, ModelChoice};
use colligo_core::water::T_ZERO_C;
use colligo_reference::{Check, Tol, finish_all, library, table};

/// a_w of binaries from mass %, with each solute's best model (no
/// solubility cap: the tables may include supersaturated points).
#[test]
fn binary_water_activity() {
    let lib = library();
    let mut salts = Check::new("binary a_w, salts (Pitzer; pytzer 0.6.0)");
    let mut ethanol = Check::new("binary a_w, ethanol (Wilson fit vs independent models)");
    for r in table("binary_water_activity") {
        let id = r.str("solute");
        let wt = r.num("mass_percent");
        let s = lib
            .solute(id)
            .unwrap_or_else(|| panic!("unknown solute {id}"));
        let mut c = Composition::new();
        c.add_water(1.0 - wt / 100.0);
        c.add_solute(s, wt / 100.0, lib.solutes[s].molar_mass);
        let mut ev = Evaluator::new(&lib, &c, ModelChoice::Auto.resolve(&lib, &c).model);
        let got = ev
            .ln_aw(r.num("t_c") + T_ZERO_C, c.water_kg, &CapMode::Unlimited)
            .exp();
        let label = format!("{id} {wt} wt % at {} °C", r.num("t_c"));
        if id == "ethanol" {
            // The Wilson pair was fitted to freezing points and to measured
            // vapour pressures at 30–90 °C (Pemberton & Mash 1978). These
            // rows are predictions of other models (CoolProp's mixture
            // equation, Dortmund UNIFAC), independent of the fit. The fit
            // follows the 50 °C measurements to 2.8 % rms in total pressure
            // (worst 7 %, see the ethanol record); model-to-model the check
            // is 3e-2 in a_w.
            ethanol.compare(&r, &label, got, r.num("water_activity"), Tol::Abs(3e-2));
        } else {
            // The same Pitzer parameter sets as pytzer (Archer 1992, 1999;
            // Møller 1988 for CaCl2, which we do not use: 2e-3 there).
            let tol = if id == "calcium_chloride" { 2e-3 } else { 5e-4 };
            salts.compare(&r, &label, got, r.num("water_activity"), Tol::Abs(tol));
        }
    }
    finish_all([salts, ethanol]);
}

/// A_φ: Pitzer (1991) at 25 °C, and the Clegg, Rard & Pitzer (1994) and
/// Møller (1988) fits as computed by pytzer 0.6.0 (our blend uses the
/// first to 90 °C and the second from 100 °C).
#[test]
fn debye_huckel_slope() {
    let mut c = Check::new("A_φ");
    for r in table("aphi") {
        let t = r.num("t_c");
        let got = aphi(t + T_ZERO_C);
        let src = r.source();
        // Our blend is exactly CRP94 up to 90 °C and M88 from 100 °C; a row
        // from the other fit is compared within their difference (7e-4).
        let exact = (src.contains("CRP94") && t <= 90.0) || (src.contains("M88") && t >= 100.0);
        let tol = if exact {
            1e-7
        } else if src.contains("Pitzer (1991)") {
            1e-4
        } else {
            8e-4
        };
        c.compare(
            &r,
            &format!("A_φ({t} °C)"),
            got,
            r.num("aphi"),
            Tol::Abs(tol),
        );
    }
    c.finish();
}

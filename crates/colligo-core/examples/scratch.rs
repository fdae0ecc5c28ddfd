//! scratch
use colligo_core::models::*;
use colligo_core::*;
fn main() {
    let lib = Library::builtin().unwrap();
    let p =
        project::Project::load(std::path::Path::new("samples/ice_cream_mix.ron"), &lib).unwrap();
    let comp = p.active().composition(&lib).unwrap();
    for model in [
        ModelId::Zsr,
        ModelId::Ideal,
        ModelId::Norrish,
        ModelId::Ross,
    ] {
        let mut ev = Evaluator::new(&lib, &comp, model);
        ev.ln_aw(277.15, comp.water_kg, &CapMode::Equilibrium);
        let before = ev.last_dissolved().to_vec();
        let mode = CapMode::Freezing {
            before: before.clone(),
        };
        let t = 255.15;
        let li = water::ice_equilibrium_ln_aw(t);
        print!("{model}: ln_ice {li:.4} | ");
        for u in [0.0f64, -0.5, -1.0, -2.0, -4.0, -8.0, -20.7] {
            let w = comp.water_kg * u.exp();
            let y = ev.ln_aw(t, w, &mode);
            print!("u={u}: {y:.4} ");
        }
        println!();
        for (c, d) in ev.comps.iter().zip(&before) {
            if lib.solutes[c.solute].record.solubility.is_some() && !c.stays_dissolved_on_freezing {
                print!("{} {:.4} ", lib.solutes[c.solute].id(), d);
            }
        }
        println!();
    }
}

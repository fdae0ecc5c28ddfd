//! scratch: ice fraction debug
use colligo_core::models::*;
use colligo_core::properties::*;
use colligo_core::*;
fn main() {
    let lib = Library::builtin().unwrap();
    let mut comp = composition::Composition::new();
    comp.add_water(1.0);
    for (s, m) in [(36usize, 0.5114725439481002), (44, 1.014181690400351)] {
        println!(
            "{} {:?}",
            lib.solutes[s].id(),
            lib.solutes[s]
                .record
                .solubility
                .as_ref()
                .map(|x| &x.on_freezing)
        );
        comp.add_solute(s, m * lib.solutes[s].molar_mass, lib.solutes[s].molar_mass);
    }
    let mut ev = Evaluator::new(&lib, &comp, ModelId::Auto);
    println!("model {}", ev.model());
    ev.ln_aw(298.15, 1.0, &CapMode::Equilibrium);
    let before = ev.last_dissolved().to_vec();
    let mut warm = WarmStart::default();
    for k in 0..30 {
        let t = 273.15 - 0.5 - k as f64;
        let p = ice_fraction(&mut ev, &before, comp.total_kg(), t, &mut warm).unwrap();
        let mode = CapMode::Freezing {
            before: before.clone(),
        };
        let curve: Vec<String> = [-0.1f64, -0.5, -1.0, -2.0, -3.0, -4.0]
            .iter()
            .map(|u| {
                format!(
                    "{:.3}",
                    ev.ln_aw(t, u.exp(), &mode) - water::ice_equilibrium_ln_aw(t)
                )
            })
            .collect();
        println!(
            "{:.2} {:.4} {} {:?}",
            t - 273.15,
            p.ice_fraction_of_water,
            p.fully_frozen,
            curve
        );
    }
}

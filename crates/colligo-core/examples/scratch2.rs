//! scratch: eval counts per point
use colligo_core::*;
use colligo_core::models::*;
use colligo_core::properties::*;
fn main() {
    let lib = Library::builtin().unwrap();
    let p = project::Project::load(std::path::Path::new("samples/pickle_brine.ron"), &lib).unwrap();
    let comp = p.active().composition(&lib).unwrap();
    let mut ev = Evaluator::new(&lib, &comp, ModelId::Auto);
    ev.ln_aw(298.15, comp.water_kg, &CapMode::Equilibrium);
    let before = ev.last_dissolved().to_vec();
    let tf = freezing_point(&mut ev, &before, None).unwrap();
    let mut warm = WarmStart { known_freezing_k: Some(tf), ..Default::default() };
    for i in 0..80 {
        let n = ev.evaluations;
        let p = ice_fraction(&mut ev, &before, comp.total_kg(), 272.65 - 0.5 * i as f64, &mut warm).unwrap();
        println!("{:.1} ice {:.4} evals {} slope {:.3} u {:?}", p.temperature_c, p.ice_fraction_of_water, ev.evaluations - n, warm.slope, warm.ln_liquid);
    }
}

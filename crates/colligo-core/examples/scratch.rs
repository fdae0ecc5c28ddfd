use colligo_core::*;
fn main() {
    let lib = Library::builtin().unwrap();
    for (pct, crc) in [(10.0, 0.63), (20.0, 1.47), (30.0, 2.64), (40.0, 4.45)] {
        let f = Formula::new("s", vec![Line::grams("water", 100.0 - pct), Line::grams("sucrose", pct)]);
        let c = f.composition(&lib).unwrap();
        let p = evaluate(&lib, &c, ModelId::Auto, &Conditions::default(), Wanted::ALL).unwrap();
        println!("{pct}% aw={:.5} fp={:?} crc={crc} bp={:?} ice={:?} osm={:.1} w={:?}", p.water_activity, p.freezing_point_depression_k, p.boiling_point_c, p.ice_fraction_of_water, p.osmolality_mosmol_per_kg, p.warnings.iter().map(|w| w.to_string()).collect::<Vec<_>>());
    }
}

//! scratch: sweep timing per ingredient
use colligo_core::*;
fn main() {
    let lib = Library::builtin().unwrap();
    let f = Formula::new(
        "x",
        vec![
            Line::grams("water", 500.0),
            Line::grams("sucrose", 120.0),
            Line::grams("glucose", 40.0),
            Line::grams("fructose", 40.0),
            Line::grams("maltose", 20.0),
            Line::grams("glycerol", 30.0),
            Line::grams("sorbitol", 25.0),
            Line::grams("propylene_glycol", 10.0),
            Line::grams("citric_acid", 8.0),
            Line::grams("lactic_acid", 6.0),
            Line::grams("sodium_chloride", 30.0),
            Line::grams("potassium_chloride", 8.0),
            Line::grams("sodium_lactate", 12.0),
        ],
    );
    let amounts = sweep::linspace(0.0, 0.2, 200);
    for l in f.lines.iter().take(8) {
        let t0 = std::time::Instant::now();
        let q = sweep::quick_sweep(
            &lib,
            &f,
            &l.ingredient,
            &amounts,
            ModelId::Auto,
            298.15,
            true,
        )
        .unwrap();
        let nan = q.freezing_point_c.iter().filter(|x| x.is_nan()).count();
        println!(
            "{:20} {:?} nan fp {nan}  aw[0]={:.3} aw[end]={:.3} fp {:.2} {:.2}",
            l.ingredient,
            t0.elapsed(),
            q.water_activity[0],
            q.water_activity[199],
            q.freezing_point_c[1],
            q.freezing_point_c[199]
        );
    }
}

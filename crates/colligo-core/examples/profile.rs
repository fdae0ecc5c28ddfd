//! Profiling driver (not part of the product).
use colligo_core::properties::*;
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
    let comp = f.composition(&lib).unwrap();
    let what = std::env::args().nth(1).unwrap_or_default();
    let n: usize = std::env::args()
        .nth(2)
        .and_then(|s| s.parse().ok())
        .unwrap_or(2000);
    let cond = Conditions::default();
    let mut acc = 0.0;
    for _ in 0..n {
        match what.as_str() {
            "full" => {
                acc += evaluate(&lib, &comp, ModelId::Auto, &cond, Wanted::ALL)
                    .unwrap()
                    .water_activity;
            }
            "icecurve" => { let p = Project::load(std::path::Path::new("samples/ice_cream_mix.ron"), &lib).unwrap(); let c = p.active().composition(&lib).unwrap(); let temps: Vec<f64> = (0..80).map(|i| 272.65 - 0.5 * i as f64).collect(); acc += freezing_curve(&lib, &c, ModelId::Auto, &cond, &temps).unwrap().points.len() as f64; }
            "curve" => {
                let temps: Vec<f64> = (0..80).map(|i| 272.65 - 0.5 * i as f64).collect();
                acc += freezing_curve(&lib, &comp, ModelId::Auto, &cond, &temps)
                    .unwrap()
                    .points
                    .len() as f64;
            }
            "sweep" => {
                let a = sweep::linspace(0.0, 0.2, 200);
                acc += sweep::quick_sweep(&lib, &f, "sucrose", &a, ModelId::Auto, 298.15, true)
                    .unwrap()
                    .water_activity[5];
            }
            _ => {}
        }
    }
    println!("{acc}");
}

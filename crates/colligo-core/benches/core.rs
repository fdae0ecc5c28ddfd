//! Speed of the computation core (criterion). Targets are in README.md.

use std::hint::black_box;

use colligo_core::composition::Composition;
use colligo_core::formula::{Formula, Line};
use colligo_core::models::{CapMode, Evaluator, Model, ModelChoice};
use colligo_core::properties::{self, Conditions, Wanted};
use colligo_core::sweep::{linspace, quick_sweep, quick_sweeps};
use colligo_core::water::T_ZERO_C;
use colligo_core::{Library, Project};
use criterion::{Criterion, criterion_group, criterion_main};

/// An invented 12-solute sauce base with three electrolytes.
fn twelve_solutes() -> Formula {
    Formula::new(
        "12 solutes",
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
    )
}

fn sample(lib: &Library, name: &str) -> Formula {
    let path = format!("{}/../../samples/{name}.ron", env!("CARGO_MANIFEST_DIR"));
    Project::load(std::path::Path::new(&path), lib)
        .unwrap_or_else(|e| panic!("{e}"))
        .active()
        .clone()
}

fn benches(c: &mut Criterion) {
    let lib = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
    let f12 = twelve_solutes();
    let comp12: Composition = f12.composition(&lib).unwrap_or_else(|e| panic!("{e}"));
    let t = T_ZERO_C + 25.0;
    let cond = Conditions::default();

    let mut ev = Evaluator::new(
        &lib,
        &comp12,
        ModelChoice::Auto.resolve(&lib, &comp12).model,
    );
    assert_eq!(ev.model(), Model::Grouped);
    ev.ln_aw(t, comp12.water_kg, &CapMode::Equilibrium);
    // Live editing: each evaluation follows a slightly different formula
    // (sucrose alternates between 120 and 121 g), so the solver starts
    // from a neighbour, never from the same answer.
    let comp12b = colligo_core::sweep::with_amount(&f12, "sucrose", 0.121)
        .composition(&lib)
        .unwrap_or_else(|e| panic!("{e}"));
    let mut flip = false;
    c.bench_function(
        "a_w, 12 solutes (3 electrolytes), auto = grouped, prepared evaluator, neighbouring compositions",
        |b| {
            b.iter(|| {
                flip = !flip;
                let c = if flip { &comp12b } else { &comp12 };
                ev.set_composition(black_box(c));
                black_box(ev.ln_aw(t, c.water_kg, &CapMode::Equilibrium))
            })
        },
    );
    c.bench_function(
        "a_w, 12 solutes, from formula (resolve + prepare + solve)",
        |b| {
            b.iter(|| {
                let comp = black_box(&f12).composition(&lib).unwrap_or_default();
                black_box(
                    properties::water_activity(&lib, &comp, ModelChoice::Auto, t).unwrap_or(0.0),
                )
            })
        },
    );
    c.bench_function(
        "full property set, 12 solutes (freezing, boiling, ice fraction)",
        |b| {
            b.iter(|| {
                black_box(properties::evaluate(
                    &lib,
                    black_box(&comp12),
                    ModelChoice::Auto,
                    &cond,
                    Wanted::ALL,
                ))
            })
        },
    );

    let ice_cream = sample(&lib, "ice_cream_mix");
    let comp_ic = ice_cream
        .composition(&lib)
        .unwrap_or_else(|e| panic!("{e}"));
    let temps: Vec<f64> = (0..80).map(|i| T_ZERO_C - 0.5 - 0.5 * i as f64).collect();
    c.bench_function("freezing curve, 80 points, ice-cream mix", |b| {
        b.iter(|| {
            black_box(properties::freezing_curve(
                &lib,
                black_box(&comp_ic),
                ModelChoice::Auto,
                &cond,
                &temps,
            ))
        })
    });
    c.bench_function("freezing curve, 80 points, 12 solutes", |b| {
        b.iter(|| {
            black_box(properties::freezing_curve(
                &lib,
                black_box(&comp12),
                ModelChoice::Auto,
                &cond,
                &temps,
            ))
        })
    });

    // Each ingredient swept over the range the workbench opens on: 0 to
    // twice its amount (water: half to one and a half times).
    let ranges = |f: &Formula| -> Vec<(String, Vec<f64>)> {
        let r = f.resolve(&lib).unwrap_or_else(|e| panic!("{e}"));
        f.lines
            .iter()
            .zip(&r.line_kg)
            .take(8)
            .map(|(l, &kg)| {
                let (lo, hi) = if l.ingredient == "water" {
                    (0.5 * kg, 1.5 * kg)
                } else {
                    (0.0, 2.0 * kg)
                };
                (l.ingredient.clone(), linspace(lo, hi, 200))
            })
            .collect()
    };
    let r12 = ranges(&f12);
    c.bench_function(
        "8 ingredients x 200-point sweeps, a_w + freezing point, 12 solutes, serial",
        |b| {
            b.iter(|| {
                for (id, a) in &r12 {
                    black_box(quick_sweep(&lib, &f12, id, a, ModelChoice::Auto, t, true).ok());
                }
            })
        },
    );
    c.bench_function(
        "8 ingredients x 200-point sweeps, a_w + freezing point, 12 solutes, all cores",
        |b| b.iter(|| black_box(quick_sweeps(&lib, &f12, &r12, ModelChoice::Auto, t, true).ok())),
    );
    let spread = sample(&lib, "reduced_sugar_spread");
    let rs = ranges(&spread);
    c.bench_function(
        "sweeps of every ingredient (6) x 200 points, spread sample, all cores",
        |b| b.iter(|| black_box(quick_sweeps(&lib, &spread, &rs, ModelChoice::Auto, t, true).ok())),
    );
}

criterion_group! {
    name = core;
    config = Criterion::default().sample_size(30).measurement_time(std::time::Duration::from_secs(3)).warm_up_time(std::time::Duration::from_secs(1));
    targets = benches
}
criterion_main!(core);

//! Property tests over random formulas: bounds, monotonicity, reduction to
//! binaries, the ideal limit, the freezing curve, project round-trips.

use colligo_core::composition::Composition;
use colligo_core::formula::{Formula, Line};
use colligo_core::library::{Library, SoluteKind};
use colligo_core::models::binary::best_binary;
use colligo_core::models::{CapMode, Evaluator, ModelChoice};
use colligo_core::project::{Project, ProjectConditions};
use colligo_core::properties::{WarmStart, freezing_point, ice_fraction};
use colligo_core::quantity::AmountUnit;
use colligo_core::water::{M_W, T_ZERO_C};
use proptest::prelude::*;
use std::sync::LazyLock;

static LIB: LazyLock<Library> =
    LazyLock::new(|| Library::builtin().unwrap_or_else(|e| panic!("{e}")));

/// Highest molality at which a solute's parameters are validated (Pitzer
/// max molality, Norrish max mole fraction, 1 mol/kg for ideal ones),
/// also kept below its solubility at 0 °C so that caps do not hide effects.
fn valid_molality(lib: &Library, s: usize) -> f64 {
    let sol = &lib.solutes[s];
    let mut m = match (&sol.record.norrish, sol.pair) {
        (_, Some(p)) => lib.pitzer.pairs[p].max_molality,
        (Some(n), None) if !sol.is_electrolyte() => {
            let x = n.max_mole_fraction;
            x / ((1.0 - x) * M_W)
        }
        _ => 1.0,
    };
    if let Some((ms, _)) = sol.solubility_molality(T_ZERO_C) {
        m = m.min(0.9 * ms);
    }
    if matches!(sol.record.kind, SoluteKind::Volatile(_)) {
        m = m.min(2.0);
    }
    m
}

/// Random compositions of 1 kg water and up to 5 library solutes, each at
/// a fraction of its validated molality divided by the number of solutes.
fn composition() -> impl Strategy<Value = Composition> {
    let n = LIB.solutes.len();
    prop::collection::vec((0..n, 0.0f64..1.0), 1..=5).prop_map(|picks| {
        let k = picks.len() as f64;
        let mut c = Composition::new();
        c.add_water(1.0);
        for (s, f) in picks {
            let m = f * valid_molality(&LIB, s) / k;
            let mm = LIB.solutes[s].molar_mass;
            c.add_solute(s, m * mm, mm);
        }
        c
    })
}

fn model() -> impl Strategy<Value = ModelChoice> {
    prop::sample::select(ModelChoice::ALL.to_vec())
}

fn ln_aw(c: &Composition, model: ModelChoice, t: f64) -> f64 {
    let mut ev = Evaluator::new(&LIB, c, model.resolve(&LIB, c).model);
    ev.ln_aw(t, c.water_kg, &CapMode::Equilibrium)
}

fn freezing_k(c: &Composition, model: ModelChoice) -> f64 {
    let mut ev = Evaluator::new(&LIB, c, model.resolve(&LIB, c).model);
    ev.ln_aw(298.15, c.water_kg, &CapMode::Equilibrium);
    let before = ev.last_dissolved().to_vec();
    freezing_point(&mut ev, &before, None).unwrap_or(f64::NAN)
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 128, ..ProptestConfig::default() })]

    #[test]
    fn water_activity_is_in_unit_interval(c in composition(), m in model(), t_c in -20.0f64..100.0) {
        let aw = ln_aw(&c, m, t_c + T_ZERO_C).exp();
        prop_assert!(aw > 0.0 && aw <= 1.0, "a_w = {aw}");
    }

    #[test]
    fn adding_solute_never_raises_aw_or_freezing_point(
        c in composition(), m in model(), s in 0..LIB.solutes.len(), frac in 0.01f64..0.3,
    ) {
        let dm = frac * valid_molality(&LIB, s) / 5.0;
        let mm = LIB.solutes[s].molar_mass;
        let mut more = c.clone();
        more.add_solute(s, dm * mm, mm);
        // Stay within validity: the enlarged formula must still be valid.
        prop_assume!(more.mol_of(s) <= valid_molality(&LIB, s) * more.water_kg);
        // `auto` may pick another model once a new kind of solute appears;
        // compare both formulas under the model chosen for the larger one.
        let m = if m == ModelChoice::Auto { ModelChoice::from(m.resolve(&LIB, &more).model) } else { m };
        let (a0, a1) = (ln_aw(&c, m, 298.15), ln_aw(&more, m, 298.15));
        prop_assert!(a1 <= a0 + 1e-12, "{} raised ln a_w {a0} → {a1}", LIB.solutes[s].id());
        let (f0, f1) = (freezing_k(&c, m), freezing_k(&more, m));
        prop_assert!(f1 <= f0 + 1e-6, "{} raised the freezing point {f0} → {f1}", LIB.solutes[s].id());
    }

    #[test]
    fn one_solute_reduces_to_its_binary(s in 0..LIB.solutes.len(), f in 0.01f64..1.0, t_c in -10.0f64..90.0) {
        let t = t_c + T_ZERO_C;
        let m = f * valid_molality(&LIB, s);
        let mm = LIB.solutes[s].molar_mass;
        let mut c = Composition::new();
        c.add_water(1.0);
        c.add_solute(s, m * mm, mm);
        let binary = best_binary(&LIB, s, t).ln_aw(m);
        let sol = &LIB.solutes[s];
        let mut rules = vec![ModelChoice::Ross, ModelChoice::Zsr, ModelChoice::Auto];
        if sol.is_electrolyte() && sol.pair.is_some() {
            rules.push(ModelChoice::Pitzer);
        }
        if !sol.is_electrolyte() && sol.volatile().is_none() {
            rules.push(ModelChoice::Norrish);
        }
        for rule in rules {
            let mut ev = Evaluator::new(&LIB, &c, rule.resolve(&LIB, &c).model);
            let got = ev.ln_aw_of(t, 1.0, &[m]);
            prop_assert!((got - binary).abs() <= 1e-10 * binary.abs().max(1e-12),
                "{} under {rule}: {got} vs binary {binary}", sol.id());
        }
    }

    #[test]
    fn infinite_dilution_tends_to_raoult(s in 0..LIB.solutes.len(), m in model()) {
        let mm = LIB.solutes[s].molar_mass;
        let dev = |mol: f64| {
            let mut c = Composition::new();
            c.add_water(1.0);
            c.add_solute(s, mol * mm, mm);
            let got = ln_aw(&c, m, 298.15);
            let ideal = ln_aw(&c, ModelChoice::Ideal, 298.15);
            ((got - ideal) / ideal).abs()
        };
        let (d4, d7) = (dev(1e-4), dev(1e-7));
        // Debye–Hückel: the relative deviation falls like √m for electrolytes.
        prop_assert!(d7 < 2e-3, "{}: relative deviation {d7} at 1e-7 mol/kg", LIB.solutes[s].id());
        prop_assert!(d7 <= d4 + 1e-9, "{}: not shrinking ({d4} → {d7})", LIB.solutes[s].id());
    }

    #[test]
    fn ice_fraction_in_range_and_growing_as_it_cools(c in composition(), m in model()) {
        let mut ev = Evaluator::new(&LIB, &c, m.resolve(&LIB, &c).model);
        ev.ln_aw(298.15, c.water_kg, &CapMode::Equilibrium);
        let before = ev.last_dissolved().to_vec();
        let total = c.total_kg();
        let mut warm = WarmStart::default();
        let mut last = 0.0;
        let mut last_liquid = 1.0;
        let mut last_hydrate = 0.0;
        for k in 0..40 {
            let t = T_ZERO_C - 0.5 - k as f64;
            let p = ice_fraction(&mut ev, &before, total, t, &mut warm).map_err(|e| TestCaseError::fail(e.to_string()))?;
            let f = p.ice_fraction_of_water;
            prop_assert!((0.0..=1.0).contains(&f), "fraction {f} at {t} K");
            if !p.fully_frozen {
                prop_assert!(f < 1.0, "liquid left but fraction {f}");
            }
            // Unfrozen water only ever shrinks on cooling. Ice alone grows
            // unless a crystal hydrate takes up water at the same time.
            prop_assert!(p.liquid_fraction_of_water <= last_liquid + 1e-9, "liquid grew to {} at {t} K", p.liquid_fraction_of_water);
            if p.hydrate_fraction_of_water <= last_hydrate + 1e-12 {
                prop_assert!(f >= last - 1e-9, "fraction fell from {last} to {f} at {t} K");
            }
            last = f;
            last_liquid = p.liquid_fraction_of_water;
            last_hydrate = p.hydrate_fraction_of_water;
        }
    }
}

fn project() -> impl Strategy<Value = Project> {
    let ids: Vec<String> = LIB.ingredients.iter().map(|i| i.id().to_string()).collect();
    let line = (
        prop::sample::select(ids),
        0.0f64..5000.0,
        prop::sample::select(AmountUnit::ALL.to_vec()),
    )
        .prop_map(|(ingredient, amount, unit)| Line {
            ingredient,
            amount: if unit == AmountUnit::Percent {
                amount / 100.0
            } else {
                amount
            },
            unit,
        });
    let variant = (
        prop::collection::vec(line, 0..8),
        "[A-Za-z0-9 ]{1,12}",
        ".{0,40}",
    );
    (
        prop::collection::vec(variant, 1..4),
        "[^\\u{0}]{1,30}",
        -40.0f64..120.0,
        50.0f64..120.0,
        -40.0f64..0.0,
        model(),
    )
        .prop_map(|(vars, name, t, p, s, model)| {
            let variants = vars
                .into_iter()
                .enumerate()
                .map(|(i, (lines, n, notes))| Formula {
                    name: format!("{i} {n}"),
                    notes,
                    lines,
                })
                .collect();
            Project {
                name,
                conditions: ProjectConditions {
                    temperature_c: t,
                    pressure_kpa: p,
                    storage_temperature_c: s,
                },
                model,
                variants,
                ..Project::default()
            }
        })
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 256, ..ProptestConfig::default() })]

    #[test]
    fn project_files_round_trip(p in project()) {
        let text = p.to_ron().map_err(|e| TestCaseError::fail(e.to_string()))?;
        let back = Project::from_ron(&text, "test.ron", &LIB).map_err(|e| TestCaseError::fail(format!("{e}\n{text}")))?;
        prop_assert_eq!(back, p);
    }
}

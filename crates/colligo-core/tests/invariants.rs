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
        // `auto` is resolved for each formula on its own, as a user sees
        // it: it must not jump when a new kind of solute appears.
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

// ---------------------------------------------------------------------------
// Adding a solute to formulas of real ingredients, every model and `auto`.
//
// A seeded generator (not proptest) so that every run checks the same cases
// and the counts can be quoted: formulas of 1-12 library ingredients at up
// to 200 g each in 20-520 g of water, far beyond many solutes' data and up
// to their solubility caps, each with one library solute added (0-200 g).

/// xorshift64: a fixed, dependency-free sequence.
struct Seq(u64);

impl Seq {
    fn next(&mut self) -> f64 {
        self.0 ^= self.0 << 13;
        self.0 ^= self.0 >> 7;
        self.0 ^= self.0 << 17;
        (self.0 >> 11) as f64 / (1u64 << 53) as f64
    }
    fn pick(&mut self, n: usize) -> usize {
        ((self.next() * n as f64) as usize).min(n - 1)
    }
}

/// A random formula's composition and one library solute to add (mass, kg).
fn formula_case(seq: &mut Seq) -> Option<(Composition, Composition, usize)> {
    let k = 1 + seq.pick(12);
    let mut lines = vec![Line::grams("water", 20.0 + 500.0 * seq.next())];
    for _ in 0..k {
        let i = seq.pick(LIB.ingredients.len());
        lines.push(Line::grams(
            LIB.ingredients[i].id(),
            200.0 * seq.next().powi(2),
        ));
    }
    let c0 = Formula::new("case", lines).composition(&LIB).ok()?;
    let s = seq.pick(LIB.solutes.len());
    let mm = LIB.solutes[s].molar_mass;
    let mut c1 = c0.clone();
    c1.add_solute(s, 0.2 * seq.next().powi(3), mm);
    Some((c0, c1, s))
}

/// ln a_w at 25 °C under `choice` (`auto` resolved for this composition,
/// as a user sees it), and the Pitzer salts' share of their data
/// (Σ m_j / m_max,j of the dissolved amounts in the water they share).
fn ln_aw_and_salt_range(c: &Composition, choice: ModelChoice) -> (f64, f64) {
    let model = choice.resolve(&LIB, c).model;
    let mut ev = Evaluator::new(&LIB, c, model);
    let sol = ev.solution(298.15, c.water_kg, &CapMode::Equilibrium);
    let mut f = 0.0;
    for st in &sol.solutes {
        let s = &LIB.solutes[st.solute];
        if let (true, Some(p)) = (s.is_electrolyte(), s.pair) {
            // Under the grouped rule the salts share only their group's
            // part of the water.
            let m = match model {
                colligo_core::models::Model::Grouped => st.zsr_molality.unwrap_or(0.0),
                _ => st.dissolved_mol / c.water_kg,
            };
            f += m / LIB.pitzer.pairs[p].max_molality;
        }
    }
    (sol.ln_aw, f)
}

/// Whether a model mixes salts with the full Pitzer equations (whose
/// mixing terms are only carried, not fitted, beyond the data).
fn uses_pitzer_mixing(choice: ModelChoice, c: &Composition) -> bool {
    matches!(
        choice.resolve(&LIB, c).model,
        colligo_core::models::Model::Pitzer | colligo_core::models::Model::Grouped
    )
}

#[test]
fn adding_a_solute_to_any_formula_never_raises_aw() {
    let cases: usize = std::env::var("COLLIGO_INVARIANT_CASES")
        .ok()
        .and_then(|v| v.parse().ok())
        .unwrap_or(3000);
    let mut seq = Seq(0x5eed_c0ff_ee00_0001);
    let (mut checked, mut beyond, mut beyond_raised) = (0usize, 0usize, 0usize);
    let mut failures = Vec::new();
    for _ in 0..cases {
        let Some((c0, c1, s)) = formula_case(&mut seq) else {
            continue;
        };
        for choice in ModelChoice::ALL {
            let (a0, _) = ln_aw_and_salt_range(&c0, choice);
            let (a1, f1) = ln_aw_and_salt_range(&c1, choice);
            assert!(a0.is_finite() && a1.is_finite() && a1 <= 0.0 && a0 <= 0.0);
            let raised = a1 > a0 + 1e-12;
            if uses_pitzer_mixing(choice, &c1) && f1 > 1.0 {
                // Beyond every salt's data (where the results warn so) the
                // Pitzer mixing terms are carried along at their edge
                // ratio; counted, not required.
                beyond += 1;
                beyond_raised += usize::from(raised);
                continue;
            }
            checked += 1;
            if raised && failures.len() < 10 {
                failures.push(format!(
                    "{choice}: adding {} raised a_w {} → {}",
                    LIB.solutes[s].id(),
                    a0.exp(),
                    a1.exp()
                ));
            }
        }
    }
    eprintln!(
        "adding a solute: {checked} checks held strictly; {beyond} beyond the salts' data under Pitzer mixing, {beyond_raised} of them raised a_w"
    );
    assert!(failures.is_empty(), "{}", failures.join("\n"));
    assert!(checked > cases, "too few cases checked: {checked}");
}

#[test]
fn adding_a_solute_to_any_formula_never_raises_the_freezing_point() {
    let mut seq = Seq(0x5eed_f00d_0000_0002);
    let (mut checked, mut deep) = (0usize, 0usize);
    let mut failures = Vec::new();
    for _ in 0..300 {
        let Some((c0, c1, s)) = formula_case(&mut seq) else {
            continue;
        };
        for choice in ModelChoice::ALL {
            if uses_pitzer_mixing(choice, &c1) && ln_aw_and_salt_range(&c1, choice).1 > 1.0 {
                continue;
            }
            let (f0, f1) = (freezing_k(&c0, choice), freezing_k(&c1, choice));
            // Deeper than −30 °C concentrated formulas crystallise solutes
            // on cooling and the liquidus can cross the ice curve more than
            // once; those are left out here (counted).
            if f0.is_nan() || f1.is_nan() || f1 < T_ZERO_C - 30.0 {
                deep += 1;
                continue;
            }
            checked += 1;
            if f1 > f0 + 1e-6 && failures.len() < 10 {
                failures.push(format!(
                    "{choice}: adding {} raised the freezing point {f0} → {f1} K",
                    LIB.solutes[s].id()
                ));
            }
        }
    }
    eprintln!(
        "freezing point: {checked} checks held; {deep} left out (no freezing point or below -30 °C)"
    );
    assert!(failures.is_empty(), "{}", failures.join("\n"));
    assert!(checked > 500, "too few cases checked: {checked}");
}

/// `auto` is continuous as a solute of a new kind goes from zero upward:
/// the example of a humectant base (Norrish) to which potassium chloride
/// is added, which used to switch to ZSR at the first milligram.
#[test]
fn auto_has_no_jump_when_a_new_kind_of_solute_appears() {
    let base =
        "water=78.6g, isomalt=3.072g, panthenol=51.134g, acetic_acid=33.38g, malic_acid=3.052g";
    let aw = |extra: &str| {
        let f = Formula::new(
            "case",
            colligo_core::formula::parse_mix(&format!("{base}{extra}"))
                .unwrap_or_else(|e| panic!("{e}")),
        );
        let c = f.composition(&LIB).unwrap_or_else(|e| panic!("{e}"));
        ln_aw(&c, ModelChoice::Auto, 298.15).exp()
    };
    let mut last = aw("");
    for g in [1e-6, 1e-3, 0.01, 0.1, 0.256, 1.0, 3.0] {
        let now = aw(&format!(", potassium_chloride={g}g"));
        assert!(now <= last + 1e-12, "{g} g KCl raised a_w {last} → {now}");
        // A step of g grams of KCl lowers a_w by about its ideal effect
        // (2 g/74.55 g/mol particles in 78.6 g water: ~0.5 % per gram),
        // never by a jump.
        assert!(
            last - now < 0.01 * g + 1e-9,
            "{g} g KCl: jump {last} → {now}"
        );
        last = now;
    }
}

/// A sweep of a new ingredient starts where the formula without it is.
#[test]
fn a_sweep_from_zero_starts_at_the_formula_without_the_ingredient() {
    let f = Formula::new(
        "case",
        colligo_core::formula::parse_mix("water=100g, sucrose=60g, glycerol=10g")
            .unwrap_or_else(|e| panic!("{e}")),
    );
    let c = f.composition(&LIB).unwrap_or_else(|e| panic!("{e}"));
    let alone = ln_aw(&c, ModelChoice::Auto, 298.15).exp();
    let amounts = colligo_core::sweep::linspace(0.0, 0.01, 21);
    let s = colligo_core::sweep::quick_sweep(
        &LIB,
        &f,
        "sodium_chloride",
        &amounts,
        ModelChoice::Auto,
        298.15,
        false,
    )
    .unwrap_or_else(|e| panic!("{e}"));
    assert!(
        (s.water_activity[0] - alone).abs() < 1e-12,
        "sweep starts at {} but the formula alone has {alone}",
        s.water_activity[0]
    );
    for w in s.water_activity.windows(2) {
        assert!(w[1] <= w[0] + 1e-12, "sweep rises: {} → {}", w[0], w[1]);
    }
}

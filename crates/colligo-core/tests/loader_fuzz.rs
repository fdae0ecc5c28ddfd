//! Loader fuzz test: mutated project files and user libraries, read
//! through the same calls the command line and the window use
//! (`Project::from_ron`, which `Project::load` calls after reading the
//! file, and `UserLibrary::from_ron`), must never panic, and whatever loads
//! must evaluate to finite properties with 0 < a_w ≤ 1.
//!
//! The seeds are the sample projects in `samples/`, the invented user
//! library `tests/fixtures/user_library.ron`, and a project holding those
//! user records (written by `Project::to_ron`). Each case applies one to
//! three mutations chosen by a seeded ChaCha generator (proptest's
//! `TestRng`, so every run is the same): a number replaced by NaN, inf,
//! 1e309, -0, a huge, tiny or negative value; an identifier or a string
//! replaced by another of the file's (or a model name, NaN, a long text);
//! a token deleted, duplicated or swapped; a run of tokens copied
//! elsewhere; truncation; random bytes; a byte-order mark.
//!
//! `COLLIGO_FUZZ_CASES` sets the number of cases (default 2000 per seed
//! file), `COLLIGO_FUZZ_SEED` the generator's seed. Inputs whose check
//! panics or gives a non-finite value are written to
//! `$TMPDIR/colligo-fuzz/` for a regression test.

use std::collections::BTreeMap;
use std::panic::{AssertUnwindSafe, catch_unwind};
use std::path::PathBuf;
use std::time::{Duration, Instant};

use colligo_core::formula::Line;
use colligo_core::models::ModelChoice;
use colligo_core::properties::{self, Conditions, Properties, Wanted};
use colligo_core::userlib::UserLibrary;
use colligo_core::water::T_ZERO_C;
use colligo_core::{Formula, FormulaError, Library, ModelError, Project, ScalarKey};
use proptest::prelude::RngExt;
use proptest::test_runner::{RngAlgorithm, TestRng};

/// Cases per seed file in the normal test run.
const DEFAULT_CASES_PER_SEED: usize = 2000;

/// A molality above which the core may refuse a formula as outside what
/// the models can represent (`ModelError::NotUsable`): a thousand times
/// the most concentrated solution the library's data cover.
const WATER_STARVED_MOL_PER_KG: f64 = 1.0e4;

/// No mutated input is longer than this (the seeds are a few kB).
const MAX_INPUT_BYTES: usize = 64 * 1024;

#[derive(Clone, Copy, PartialEq, Eq)]
enum Kind {
    Project,
    UserLibrary,
}

struct Seed {
    name: String,
    kind: Kind,
    text: String,
}

fn seeds(base: &Library) -> Vec<Seed> {
    let root = PathBuf::from(env!("CARGO_MANIFEST_DIR"));
    let mut out = Vec::new();
    let samples = root.join("../../samples");
    let mut files: Vec<PathBuf> = std::fs::read_dir(&samples)
        .unwrap_or_else(|e| panic!("{}: {e}", samples.display()))
        .filter_map(|e| e.ok().map(|e| e.path()))
        .filter(|p| p.extension().is_some_and(|x| x == "ron"))
        .collect();
    files.sort();
    for p in files {
        out.push(Seed {
            name: p
                .file_name()
                .map_or_else(String::new, |n| n.to_string_lossy().into()),
            kind: Kind::Project,
            text: std::fs::read_to_string(&p).unwrap_or_else(|e| panic!("{e}")),
        });
    }
    let lib_path = root.join("tests/fixtures/user_library.ron");
    let lib_text = std::fs::read_to_string(&lib_path).unwrap_or_else(|e| panic!("{e}"));
    let user = UserLibrary::from_ron(&lib_text, "user_library.ron", base)
        .unwrap_or_else(|e| panic!("the fixture must load: {e}"));
    out.push(Seed {
        name: "user_library.ron".into(),
        kind: Kind::UserLibrary,
        text: lib_text,
    });
    // A project with the same records, in the writer's own layout.
    let line = |id: &str, g: f64| Line::grams(id, g);
    let mut pct = line("my_polyol", 10.0);
    pct.unit = colligo_core::quantity::AmountUnit::Percent;
    let project = Project {
        name: "User records".into(),
        user_solutes: user.solutes.clone(),
        user_ingredients: user.ingredients.clone(),
        variants: vec![
            Formula::new(
                "Syrup",
                vec![
                    line("water", 100.0),
                    line("my_syrup", 40.0),
                    line("sodium_chloride", 2.0),
                ],
            ),
            Formula::new(
                "Brine",
                vec![line("water", 100.0), line("my_brine", 30.0), pct],
            ),
            Formula::new(
                "Spirit",
                vec![
                    line("water", 80.0),
                    line("my_alcohol", 15.0),
                    line("my_salt", 3.0),
                ],
            ),
        ],
        model: ModelChoice::Zsr,
        ..Project::default()
    };
    let text = project.to_ron().unwrap_or_else(|e| panic!("{e}"));
    Project::from_ron(&text, "user_records.ron", base)
        .unwrap_or_else(|e| panic!("the generated project must load: {e}"));
    out.push(Seed {
        name: "user_records.ron".into(),
        kind: Kind::Project,
        text,
    });
    out
}

// ---------------------------------------------------------------- tokens

#[derive(Clone, Copy, PartialEq, Eq)]
enum Tok {
    Space,
    Comment,
    Number,
    Ident,
    Str,
    Punct,
}

/// Splits RON text into tokens, keeping every byte (concatenating the
/// tokens gives the text back).
fn tokens(text: &str) -> Vec<(Tok, String)> {
    let b = text.as_bytes();
    let mut out = Vec::new();
    let mut i = 0;
    while i < b.len() {
        let start = i;
        let c = b[i];
        let kind = if c.is_ascii_whitespace() {
            while i < b.len() && b[i].is_ascii_whitespace() {
                i += 1;
            }
            Tok::Space
        } else if c == b'/' && b.get(i + 1) == Some(&b'/') {
            while i < b.len() && b[i] != b'\n' {
                i += 1;
            }
            Tok::Comment
        } else if c.is_ascii_digit()
            || ((c == b'-' || c == b'+' || c == b'.')
                && b.get(i + 1).is_some_and(u8::is_ascii_digit))
        {
            i += 1;
            while i < b.len()
                && (b[i].is_ascii_alphanumeric()
                    || b[i] == b'.'
                    || b[i] == b'_'
                    || ((b[i] == b'-' || b[i] == b'+') && matches!(b[i - 1], b'e' | b'E')))
            {
                i += 1;
            }
            Tok::Number
        } else if c.is_ascii_alphabetic() || c == b'_' {
            while i < b.len() && (b[i].is_ascii_alphanumeric() || b[i] == b'_') {
                i += 1;
            }
            Tok::Ident
        } else if c == b'"' {
            i += 1;
            while i < b.len() && b[i] != b'"' {
                if b[i] == b'\\' {
                    i += 1;
                }
                i += 1;
            }
            i = (i + 1).min(b.len());
            Tok::Str
        } else {
            // One character (possibly several bytes).
            i += text[i..].chars().next().map_or(1, char::len_utf8);
            Tok::Punct
        };
        out.push((kind, text[start..i].to_string()));
    }
    out
}

const NUMBERS: [&str; 22] = [
    "NaN",
    "inf",
    "-inf",
    "1e309",
    "-1e309",
    "-0",
    "-0.0",
    "0",
    "1e308",
    "-1e308",
    "1e300",
    "1e-320",
    "5e-324",
    "-1",
    "-273.15",
    "1e9",
    "4294967295",
    "4294967296",
    "18446744073709551616",
    "0.5",
    "99.99999",
    "123456789.123",
];

/// Values a checked field may still take: the ends of the ranges
/// (−60 and 200 °C, 50 °C storage, 1 and 1000 kPa, 10⁹ kg a line), tiny
/// and large amounts, a share just under 100 %.
const EDGES: [&str; 16] = [
    "-60",
    "-59.999",
    "200",
    "199.99",
    "50",
    "1",
    "1000",
    "1e12",
    "999999999999",
    "1e-9",
    "0.0001",
    "99.9999",
    "99.5",
    "5000",
    "0.001",
    "1e-300",
];

const IDENTS: [&str; 14] = [
    "NaN", "inf", "None", "Some", "true", "auto", "ideal", "norrish", "ross", "zsr", "pitzer",
    "percent", "kg", "Constant",
];

fn pick<'a>(rng: &mut TestRng, items: &'a [&'a str]) -> &'a str {
    items[rng.random_range(0..items.len())]
}

/// Indices of tokens of a kind.
fn of_kind(toks: &[(Tok, String)], kind: Tok) -> Vec<usize> {
    toks.iter()
        .enumerate()
        .filter(|(_, t)| t.0 == kind)
        .map(|(i, _)| i)
        .collect()
}

/// Indices of tokens that carry meaning (not spaces or comments).
fn solid(toks: &[(Tok, String)]) -> Vec<usize> {
    toks.iter()
        .enumerate()
        .filter(|(_, t)| !matches!(t.0, Tok::Space | Tok::Comment))
        .map(|(i, _)| i)
        .collect()
}

fn any_of(rng: &mut TestRng, idx: &[usize]) -> Option<usize> {
    (!idx.is_empty()).then(|| idx[rng.random_range(0..idx.len())])
}

/// One mutation of the token list; the name says which (for the counts).
fn mutate_tokens(rng: &mut TestRng, toks: &mut Vec<(Tok, String)>, ids: &[String]) -> &'static str {
    match rng.random_range(0..12u32) {
        0..=1 => {
            if let Some(i) = any_of(rng, &of_kind(toks, Tok::Number)) {
                toks[i].1 = pick(rng, &NUMBERS).to_string();
            }
            "number"
        }
        9..=10 => {
            // A value that may pass the checks: an edge of a range, or the
            // number scaled by a random power of ten.
            if let Some(i) = any_of(rng, &of_kind(toks, Tok::Number)) {
                toks[i].1 = match (rng.random_bool(0.5), toks[i].1.parse::<f64>()) {
                    (true, Ok(v)) => format!("{:?}", v * 10f64.powi(rng.random_range(-12..=12))),
                    _ => pick(rng, &EDGES).to_string(),
                };
            }
            "edge number"
        }
        11 => {
            // Another ingredient on a line (or in a composition).
            let strs = of_kind(toks, Tok::Str);
            if let Some(i) = any_of(rng, &strs) {
                toks[i].1 = format!("\"{}\"", ids[rng.random_range(0..ids.len())]);
            }
            "id"
        }
        3 => {
            let idents = of_kind(toks, Tok::Ident);
            if let (Some(i), Some(j)) = (any_of(rng, &idents), any_of(rng, &idents)) {
                toks[i].1 = if rng.random_bool(0.5) {
                    toks[j].1.clone()
                } else {
                    pick(rng, &IDENTS).to_string()
                };
            }
            "identifier"
        }
        4 => {
            let strs = of_kind(toks, Tok::Str);
            if let (Some(i), Some(j)) = (any_of(rng, &strs), any_of(rng, &strs)) {
                toks[i].1 = match rng.random_range(0..4u32) {
                    0 => toks[j].1.clone(),
                    1 => "\"\"".into(),
                    2 => format!("\"{}\"", "a".repeat(rng.random_range(60..5000))),
                    _ => format!("\"{}\"", ids[rng.random_range(0..ids.len())]),
                };
            }
            "string"
        }
        5 => {
            if let Some(i) = any_of(rng, &solid(toks)) {
                toks.remove(i);
            }
            "delete"
        }
        6 => {
            if let Some(i) = any_of(rng, &solid(toks)) {
                let t = toks[i].clone();
                toks.insert(i, t);
            }
            "duplicate"
        }
        7 => {
            let s = solid(toks);
            if let (Some(i), Some(j)) = (any_of(rng, &s), any_of(rng, &s)) {
                toks.swap(i, j);
            }
            "swap"
        }
        _ => {
            // Copy a run of up to 40 tokens to another place.
            if !toks.is_empty() {
                let from = rng.random_range(0..toks.len());
                let len = rng.random_range(1..=40usize).min(toks.len() - from);
                let run: Vec<_> = toks[from..from + len].to_vec();
                let at = rng.random_range(0..=toks.len());
                toks.splice(at..at, run);
            }
            "splice"
        }
    }
}

/// A mutated copy of `text`: one to three token mutations, sometimes a
/// byte-level one. `None` when the bytes are not UTF-8 (a file that
/// `read_to_string` refuses).
fn mutate(rng: &mut TestRng, text: &str, ids: &[String], tally: &mut Tally) -> Option<String> {
    let mut toks = tokens(text);
    let count = if rng.random_bool(0.6) {
        1
    } else {
        rng.random_range(2..=3u32)
    };
    for _ in 0..count {
        let what = mutate_tokens(rng, &mut toks, ids);
        *tally.mutations.entry(what).or_default() += 1;
    }
    let mut s: String = toks.into_iter().map(|t| t.1).collect();
    match rng.random_range(0..10u32) {
        0 => {
            *tally.mutations.entry("truncate").or_default() += 1;
            let mut cut = rng.random_range(0..=s.len());
            while !s.is_char_boundary(cut) {
                cut -= 1;
            }
            s.truncate(cut);
        }
        1 => {
            *tally.mutations.entry("bytes").or_default() += 1;
            let mut b = s.into_bytes();
            for _ in 0..rng.random_range(1..=8u32) {
                let at = rng.random_range(0..=b.len());
                // Mostly ASCII, so that some of these inputs are text.
                let byte: u8 = if rng.random_bool(0.8) {
                    rng.random_range(0x20..0x7f)
                } else {
                    rng.random()
                };
                if at < b.len() && rng.random_bool(0.5) {
                    b[at] = byte;
                } else {
                    b.insert(at, byte);
                }
            }
            s = String::from_utf8(b).ok()?;
        }
        2 => {
            *tally.mutations.entry("bom").or_default() += 1;
            s.insert(0, '\u{feff}');
        }
        _ => {}
    }
    if s.len() > MAX_INPUT_BYTES {
        let mut cut = MAX_INPUT_BYTES;
        while !s.is_char_boundary(cut) {
            cut -= 1;
        }
        s.truncate(cut);
    }
    Some(s)
}

// ---------------------------------------------------------------- checks

#[derive(Default)]
struct Tally {
    inputs: usize,
    not_utf8: usize,
    loaded: usize,
    rejected: usize,
    evaluations: usize,
    /// The errors a loaded file may give (no water, percentages over
    /// 100 %), by message start: the command line prints them as errors.
    refused: BTreeMap<String, usize>,
    panics: usize,
    non_finite: usize,
    aw_out_of_range: usize,
    /// Loaded, then refused by the formula or the evaluation for a reason
    /// other than no water or percentages over 100 %.
    refused_after_load: usize,
    mutations: BTreeMap<&'static str, usize>,
    slowest: Duration,
    failures: Vec<String>,
}

/// What went wrong with one evaluation that loaded.
#[derive(Debug)]
#[allow(dead_code)] // The fields are read by `Debug`, in the failure list.
enum Bad {
    NonFinite(String),
    WaterActivity(f64),
    /// An error other than those a valid project may give.
    Refused(String),
}

/// Every number the command line reports for `p` must be finite, and a_w
/// in (0, 1].
fn check_properties(p: &Properties) -> Result<(), Bad> {
    if !(p.water_activity > 0.0 && p.water_activity <= 1.0) {
        return Err(Bad::WaterActivity(p.water_activity));
    }
    for k in ScalarKey::ALL {
        if let Some(v) = k.read(p)
            && !v.is_finite()
        {
            return Err(Bad::NonFinite(format!("{} = {v}", k.as_str())));
        }
    }
    let more = [
        (
            "pure_water_vapor_pressure_pa",
            Some(p.pure_water_vapor_pressure_pa),
        ),
        ("cosolvent_vapor_pressure_pa", p.cosolvent_vapor_pressure_pa),
        ("freezing_point_depression_k", p.freezing_point_depression_k),
        ("total_g", Some(p.total_g)),
        ("water_g", Some(p.water_g)),
        ("insoluble_g", Some(p.insoluble_g)),
    ];
    for (name, v) in more {
        if let Some(v) = v
            && !v.is_finite()
        {
            return Err(Bad::NonFinite(format!("{name} = {v}")));
        }
    }
    for s in &p.solutes {
        for (name, v) in [
            ("dissolved_g", s.dissolved_g),
            ("undissolved_g", s.undissolved_g),
            ("molality_mol_per_kg", s.molality_mol_per_kg),
            ("ln_aw_share", s.ln_aw_share),
        ] {
            if !v.is_finite() {
                return Err(Bad::NonFinite(format!("{}.{name} = {v}", s.id)));
            }
        }
    }
    Ok(())
}

/// Evaluates one formula as `colligo eval` does (every property), and the
/// freezing curve at a few temperatures as `colligo freeze` does.
fn evaluate_formula(
    lib: &Library,
    formula: &Formula,
    model: ModelChoice,
    cond: &Conditions,
    tally: &mut Tally,
) -> Result<(), Bad> {
    let refuse = |tally: &mut Tally, e: String| {
        let key: String = e
            .split(|c: char| c == '`' || c.is_ascii_digit())
            .next()
            .unwrap_or("")
            .chars()
            .take(60)
            .collect();
        *tally.refused.entry(key).or_default() += 1;
    };
    // The states a loaded project may hold and the command line reports as
    // an error: a variant without water, or percentages leaving nothing for
    // the weighed lines (a draft), and (below) a formula with almost no
    // water. Any other error after loading is a defect: the loader let
    // through what the evaluation cannot use.
    let comp = match formula.composition(lib) {
        Ok(c) => c,
        Err(e @ FormulaError::PercentOverflow { .. }) => {
            refuse(tally, e.to_string());
            return Ok(());
        }
        Err(e) => return Err(Bad::Refused(e.to_string())),
    };
    tally.evaluations += 1;
    // A formula with almost no water (1e-300 g against grams of solute)
    // lies so far outside every model that the core refuses it with
    // `ModelError::NotUsable` rather than print a_w = 0 or NaN: that typed
    // refusal is the answer there, and only there.
    let max_molality = comp
        .solutes
        .iter()
        .map(|s| s.mol / comp.water_kg)
        .fold(0.0, f64::max);
    let water_starved = max_molality.is_nan() || max_molality > WATER_STARVED_MOL_PER_KG;
    match properties::evaluate(lib, &comp, model, cond, Wanted::ALL) {
        Ok(p) => check_properties(&p)?,
        Err(ModelError::NoWater) => {
            refuse(tally, ModelError::NoWater.to_string());
            return Ok(());
        }
        Err(e @ ModelError::NotUsable { .. }) if water_starved => {
            refuse(tally, format!("(over 1e4 mol/kg) {e}"));
            return Ok(());
        }
        Err(e) => return Err(Bad::Refused(e.to_string())),
    }
    let temps: Vec<f64> = [-1.0, -5.0, -10.0, -20.0, -30.0]
        .iter()
        .map(|c| c + T_ZERO_C)
        .collect();
    match properties::freezing_curve(lib, &comp, model, cond, &temps) {
        Ok(curve) => {
            if let Some(f) = curve.freezing_point_c
                && !f.is_finite()
            {
                return Err(Bad::NonFinite(format!("curve freezing point {f}")));
            }
            for pt in &curve.points {
                let values = [
                    pt.ice_fraction_of_water,
                    pt.ice_fraction_of_total,
                    pt.liquid_fraction_of_water,
                    pt.hydrate_fraction_of_water,
                    pt.water_activity,
                ];
                if values.iter().any(|v| !v.is_finite()) {
                    return Err(Bad::NonFinite(format!(
                        "curve point at {} °C: {values:?}",
                        pt.temperature_c
                    )));
                }
                if !(pt.water_activity > 0.0 && pt.water_activity <= 1.0) {
                    return Err(Bad::WaterActivity(pt.water_activity));
                }
            }
        }
        Err(e) => return Err(Bad::Refused(format!("freezing curve: {e}"))),
    }
    Ok(())
}

/// Loads one input and evaluates whatever loads.
fn check_input(base: &Library, kind: Kind, text: &str, tally: &mut Tally) -> Result<(), Bad> {
    match kind {
        Kind::Project => {
            let Ok(p) = Project::from_ron(text, "fuzz.ron", base) else {
                tally.rejected += 1;
                return Ok(());
            };
            tally.loaded += 1;
            let lib = match p.library(base) {
                Ok(l) => l,
                Err(e) => return Err(Bad::Refused(format!("library after loading: {e}"))),
            };
            let cond = p.conditions.to_conditions();
            for v in &p.variants {
                evaluate_formula(&lib, v, p.model, &cond, tally)?;
            }
        }
        Kind::UserLibrary => {
            let Ok(u) = UserLibrary::from_ron(text, "fuzz-library.ron", base) else {
                tally.rejected += 1;
                return Ok(());
            };
            tally.loaded += 1;
            let lib = match base.with_user_records(&u.solutes, &u.ingredients, ("s", "i")) {
                Ok(l) => l,
                Err((_, e)) => return Err(Bad::Refused(format!("library after loading: {e}"))),
            };
            let ids = u
                .solutes
                .iter()
                .map(|s| s.id.as_str())
                .chain(u.ingredients.iter().map(|i| i.id.as_str()));
            for (n, id) in ids.enumerate() {
                let f = Formula::new(id, vec![Line::grams("water", 100.0), Line::grams(id, 20.0)]);
                // Each record under one of the models in turn.
                let model = ModelChoice::ALL[n % ModelChoice::ALL.len()];
                evaluate_formula(&lib, &f, model, &Conditions::default(), tally)?;
            }
        }
    }
    Ok(())
}

fn keep(name: &str, text: &str) -> String {
    let dir = std::env::temp_dir().join("colligo-fuzz");
    let _ = std::fs::create_dir_all(&dir);
    let p = dir.join(name);
    let _ = std::fs::write(&p, text);
    p.display().to_string()
}

#[test]
fn mutated_projects_and_user_libraries_never_panic_and_evaluate_finite() {
    let base = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
    let seeds = seeds(&base);
    let per_seed = std::env::var("COLLIGO_FUZZ_CASES")
        .ok()
        .and_then(|v| v.parse::<usize>().ok())
        .map_or(DEFAULT_CASES_PER_SEED, |total| total.div_ceil(seeds.len()));
    let seed: u64 = std::env::var("COLLIGO_FUZZ_SEED")
        .ok()
        .and_then(|v| v.parse().ok())
        .unwrap_or(20_260_101);
    let mut key = [0u8; 32];
    key[..8].copy_from_slice(&seed.to_le_bytes());
    let mut rng = TestRng::from_seed(RngAlgorithm::ChaCha, &key);
    let ids: Vec<String> = base
        .ingredients
        .iter()
        .map(|i| i.id().to_string())
        .chain(["my_polyol", "my_alcohol", "my_salt", "my_syrup", "my_brine"].map(String::from))
        .collect();
    let mut tally = Tally::default();
    let started = Instant::now();
    // Panics are counted, not printed one by one.
    let hook = std::panic::take_hook();
    std::panic::set_hook(Box::new(|_| {}));
    for n in 0..per_seed {
        for s in &seeds {
            tally.inputs += 1;
            let Some(text) = mutate(&mut rng, &s.text, &ids, &mut tally) else {
                tally.not_utf8 += 1;
                tally.rejected += 1;
                continue;
            };
            let t0 = Instant::now();
            let mut local = Tally::default();
            let result = catch_unwind(AssertUnwindSafe(|| {
                check_input(&base, s.kind, &text, &mut local)
            }));
            let took = t0.elapsed();
            if took > tally.slowest {
                tally.slowest = took;
                if took > Duration::from_secs(2) {
                    keep(&format!("slow-{}-{n}.ron", s.name), &text);
                }
            }
            tally.loaded += local.loaded;
            tally.rejected += local.rejected;
            tally.evaluations += local.evaluations;
            for (k, v) in local.refused {
                *tally.refused.entry(k).or_default() += v;
            }
            match result {
                Ok(Ok(())) => {}
                Ok(Err(bad)) => {
                    match bad {
                        Bad::NonFinite(_) => tally.non_finite += 1,
                        Bad::WaterActivity(_) => tally.aw_out_of_range += 1,
                        Bad::Refused(_) => tally.refused_after_load += 1,
                    }
                    let at = keep(&format!("bad-{}-{n}.ron", s.name), &text);
                    tally.failures.push(format!("{bad:?}: {at}"));
                }
                Err(payload) => {
                    tally.panics += 1;
                    let msg = payload
                        .downcast_ref::<String>()
                        .cloned()
                        .or_else(|| payload.downcast_ref::<&str>().map(|s| s.to_string()))
                        .unwrap_or_default();
                    let at = keep(&format!("panic-{}-{n}.ron", s.name), &text);
                    tally.failures.push(format!("panic `{msg}`: {at}"));
                }
            }
        }
    }
    std::panic::set_hook(hook);
    eprintln!(
        "loader fuzz (seed {seed}): {} inputs, {} loaded, {} rejected ({} not UTF-8), {} formulas evaluated, {} panics, {} non-finite, {} a_w out of (0, 1], {} other errors after loading; slowest case {:.3} s; {:.1} s in all",
        tally.inputs,
        tally.loaded,
        tally.rejected,
        tally.not_utf8,
        tally.evaluations,
        tally.panics,
        tally.non_finite,
        tally.aw_out_of_range,
        tally.refused_after_load,
        tally.slowest.as_secs_f64(),
        started.elapsed().as_secs_f64()
    );
    eprintln!("mutations: {:?}", tally.mutations);
    eprintln!("errors a loaded project may give (the command line prints these):");
    for (k, v) in &tally.refused {
        eprintln!("  {v:6}  {k}");
    }
    for f in tally.failures.iter().take(20) {
        eprintln!("FAILED {f}");
    }
    assert!(
        tally.loaded > tally.inputs / 20,
        "too few mutated inputs load ({} of {}) for the evaluation to be exercised",
        tally.loaded,
        tally.inputs
    );
    assert!(
        tally.failures.is_empty(),
        "{} panics, {} non-finite, {} a_w out of range, {} other errors after loading",
        tally.panics,
        tally.non_finite,
        tally.aw_out_of_range,
        tally.refused_after_load
    );
}

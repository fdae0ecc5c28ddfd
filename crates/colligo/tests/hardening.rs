//! Inputs a user can produce that once escaped as a panic, a NaN, a null or
//! a negative zero: each one now gets an error naming what is wrong, or a
//! warning with the property left out.

use std::path::PathBuf;
use std::process::{Command, Output};

fn colligo(args: &[&str]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_colligo"))
        .args(args)
        .output()
        .unwrap_or_else(|e| panic!("cannot run colligo: {e}"))
}

fn stderr(o: &Output) -> String {
    String::from_utf8_lossy(&o.stderr).into_owned()
}

fn stdout(o: &Output) -> String {
    String::from_utf8_lossy(&o.stdout).into_owned()
}

fn json(o: &Output) -> serde_json::Value {
    assert!(o.status.success(), "stderr: {}", stderr(o));
    serde_json::from_slice(&o.stdout).unwrap_or_else(|e| panic!("{e}: {}", stdout(o)))
}

/// A project whose only user solute is `solute` (a RON record) and whose
/// formula is 100 g water and 20 g of it; `ingredients` are user
/// ingredient records.
fn project(name: &str, solute: &str, ingredients: &str, line: &str) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("colligo-hardening-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap_or_else(|e| panic!("{e}"));
    let p = dir.join(format!("{name}.ron"));
    let text = format!(
        r#"(
    format_version: 1,
    name: "User record check",
    notes: "",
    product: food,
    conditions: (temperature_c: 25.0, pressure_kpa: 101.325, storage_temperature_c: -18.0),
    model: auto,
    units: (amount: g, temperature: celsius, pressure: kpa),
    user_solutes: [{solute}],
    user_ingredients: [{ingredients}],
    variants: [
        (name: "A", notes: "", lines: [
            (ingredient: "water", amount: 100.0, unit: g),
            {line}
        ]),
    ],
    active_variant: 0,
)"#
    );
    std::fs::write(&p, text).unwrap_or_else(|e| panic!("{e}"));
    p
}

fn polyol(molar_mass: &str, k: &str, t_range: &str) -> String {
    format!(
        r#"(
            id: "my_polyol",
            name: "My polyol",
            category: Polyol,
            molar_mass_g_per_mol: {molar_mass},
            molar_mass_source: (key: "own", tag: Mem),
            kind: NonElectrolyte,
            norrish: (
                k: {k},
                max_mole_fraction: 0.1,
                t_range_c: {t_range},
                source: (key: "own", tag: Mem),
            ),
        )"#
    )
}

fn cosolvent(a12: &str, v_solute: &str, v_water: &str) -> String {
    format!(
        r#"(
            id: "my_alcohol",
            name: "My alcohol",
            category: Alcohol,
            molar_mass_g_per_mol: 46.07,
            molar_mass_source: (key: "own", tag: Mem),
            kind: Volatile((
                wilson: (
                    a12_j_per_mol: {a12},
                    a21_j_per_mol: Constant(2900.0),
                    v_solute_cm3_per_mol: {v_solute},
                    v_water_cm3_per_mol: {v_water},
                    t_range_c: (0.0, 90.0),
                    max_mass_fraction: 0.4,
                    partial_pressure_t_min_c: 10.0,
                    source: (key: "own", tag: Mem),
                ),
                antoine: (
                    a: 7.33675, b: 1648.22, c: -42.232, t_range_c: (3.35, 96.39),
                    source: (key: "own", tag: Mem),
                ),
            )),
        )"#
    )
}

const POLYOL_LINE: &str = r#"(ingredient: "my_polyol", amount: 20.0, unit: g),"#;
const ALCOHOL_LINE: &str = r#"(ingredient: "my_alcohol", amount: 10.0, unit: g),"#;

/// Every bad record is refused on load with the field's path; none panics
/// or reaches a model.
#[test]
fn user_records_out_of_range_are_refused_with_the_field_path() {
    let good = project(
        "good",
        &polyol("150.0", "Constant(1.0)", "(20.0, 30.0)"),
        "",
        POLYOL_LINE,
    );
    let out = colligo(&["eval", good.to_str().unwrap_or_default(), "--json"]);
    let v = json(&out);
    assert!(
        v["water_activity"]
            .as_f64()
            .is_some_and(|a| a > 0.9 && a < 1.0)
    );
    let alcohol = project(
        "alcohol",
        &cosolvent("Constant(367.0)", "58.6", "18.07"),
        "",
        ALCOHOL_LINE,
    );
    json(&colligo(&[
        "eval",
        alcohol.to_str().unwrap_or_default(),
        "--json",
    ]));

    let cases: Vec<(&str, PathBuf, &str)> = vec![
        (
            "NaN t_range bound (once a panic in a clamp)",
            project(
                "nan_range",
                &polyol("150.0", "Constant(1.0)", "(NaN, 30.0)"),
                "",
                POLYOL_LINE,
            ),
            "user_solutes[0].norrish.t_range_c.0",
        ),
        (
            "empty t_range",
            project(
                "empty_range",
                &polyol("150.0", "Constant(1.0)", "(30.0, 20.0)"),
                "",
                POLYOL_LINE,
            ),
            "user_solutes[0].norrish.t_range_c",
        ),
        (
            "K = -273 (a_w would exceed 1)",
            project(
                "k_neg",
                &polyol("150.0", "Constant(-273.0)", "(20.0, 30.0)"),
                "",
                POLYOL_LINE,
            ),
            "user_solutes[0].norrish.k",
        ),
        (
            "K read as infinity",
            project(
                "k_inf",
                &polyol("150.0", "Constant(1e309)", "(20.0, 30.0)"),
                "",
                POLYOL_LINE,
            ),
            "user_solutes[0].norrish.k",
        ),
        (
            "huge K",
            project(
                "k_huge",
                &polyol("150.0", "Constant(1e200)", "(20.0, 30.0)"),
                "",
                POLYOL_LINE,
            ),
            "user_solutes[0].norrish.k",
        ),
        (
            "denormal molar mass",
            project(
                "mm_tiny",
                &polyol("1e-320", "Constant(1.0)", "(20.0, 30.0)"),
                "",
                POLYOL_LINE,
            ),
            "user_solutes[0].molar_mass_g_per_mol",
        ),
        (
            "water volume read as infinity",
            project(
                "v_inf",
                &cosolvent("Constant(367.0)", "58.6", "1e309"),
                "",
                ALCOHOL_LINE,
            ),
            "user_solutes[0].kind.wilson.v_water_cm3_per_mol",
        ),
        (
            "negative solute volume",
            project(
                "v_neg",
                &cosolvent("Constant(367.0)", "-58.6", "18.07"),
                "",
                ALCOHOL_LINE,
            ),
            "user_solutes[0].kind.wilson.v_solute_cm3_per_mol",
        ),
        (
            "negative reference temperature",
            project(
                "t_ref",
                &cosolvent(
                    "Taylor(t_ref_k: -5.0, value: 367.3, d1: 116.0)",
                    "58.6",
                    "18.07",
                ),
                "",
                ALCOHOL_LINE,
            ),
            "user_solutes[0].kind.wilson.a12_j_per_mol",
        ),
        (
            "an ingredient's molar mass override of 1e-320",
            project(
                "ing_mm",
                "",
                r#"(
                    id: "my_syrup", name: "My syrup", category: Sweetener,
                    water_g_per_100g: 20.0,
                    solutes: [(solute: "glucose_oligomers", g_per_100g: 80.0, molar_mass_g_per_mol: 1e-320)],
                    source: (key: "own", tag: Mem),
                )"#,
                r#"(ingredient: "my_syrup", amount: 20.0, unit: g),"#,
            ),
            "user_ingredients[0].solutes[0].molar_mass_g_per_mol",
        ),
    ];
    for (what, path, field) in cases {
        let out = colligo(&["eval", path.to_str().unwrap_or_default()]);
        let err = stderr(&out);
        assert_eq!(out.status.code(), Some(1), "{what}: {err}");
        assert!(!err.contains("panicked"), "{what}: {err}");
        assert!(err.contains(field), "{what}: expected `{field}` in: {err}");
    }
}

/// From 7000 kPa up pure water boils above 200 °C: the boiling point is
/// left out with a warning, every other property is there (once a panic).
#[test]
fn high_pressure_leaves_out_the_boiling_point_with_a_reason() {
    for p in ["7000kPa", "70bar", "20000kPa"] {
        let mix = ["--mix", "water=100g, sucrose=20g", "--pressure", p];
        let v = json(&colligo(&[&["eval", "--json"][..], &mix].concat()));
        assert!(v.get("boiling_point_c").is_none(), "{p}: {v}");
        assert!(v["water_activity"].as_f64().is_some());
        let warned = v["warnings"].as_array().is_some_and(|w| {
            w.iter().any(|s| {
                s.as_str()
                    .is_some_and(|s| s.contains("does not boil below"))
            })
        });
        assert!(warned, "{p}: {v}");
        for sub in [
            vec![
                "sweep",
                "--ingredient",
                "sucrose",
                "--to",
                "40g",
                "--steps",
                "3",
            ],
            vec!["solve", "--ingredient", "sucrose", "--target", "aw=0.98"],
        ] {
            let out = colligo(&[&sub[..], &mix].concat());
            assert!(
                !stderr(&out).contains("panicked"),
                "{sub:?} {p}: {}",
                stderr(&out)
            );
            assert!(out.status.success(), "{sub:?} {p}: {}", stderr(&out));
        }
    }
}

#[test]
fn absurd_amounts_are_refused_not_printed_as_null() {
    for mix in [
        "water=100g, sucrose=1e308g",
        "water=1e308kg, sucrose=1e308kg",
        "water=100g, sodium_chloride=1e308lb",
        "water=2e9kg",
    ] {
        let out = colligo(&["eval", "--mix", mix, "--json"]);
        let err = stderr(&out);
        assert_eq!(out.status.code(), Some(1), "{mix}: {}", stdout(&out));
        assert!(
            err.contains("above the largest a line may hold"),
            "{mix}: {err}"
        );
        assert!(err.len() < 300, "{mix}: {err}");
    }
    // The bound itself is fine.
    json(&colligo(&[
        "eval",
        "--mix",
        "water=1e9kg, sucrose=1e8kg",
        "--json",
    ]));
}

/// No null, NaN, infinity or negative zero in any output of pure water,
/// where every lowering is exactly zero.
#[test]
fn pure_water_prints_no_negative_zero_and_no_null() {
    let out = colligo(&["eval", "--mix", "water=100g"]);
    let table = stdout(&out);
    assert!(out.status.success());
    for bad in ["-0.00 ", "-0 ", "-0.000 ", "NaN", "inf"] {
        assert!(!table.contains(bad), "`{bad}` in:\n{table}");
    }
    assert!(
        table.contains("freezing point              0.00 °C"),
        "{table}"
    );
    // Pure water freezes whole: it has no eutectic to warn of.
    let freeze = stdout(&colligo(&["freeze", "--mix", "water=100g"]));
    for text in [&table, &freeze] {
        assert!(!text.contains("eutectic"), "{text}");
    }
    for args in [
        vec!["eval", "--mix", "water=100g", "--json"],
        vec!["freeze", "--mix", "water=100g", "--json"],
        [&SWEEP_PURE_WATER[..], &["--json"]].concat(),
    ] {
        let out = colligo(&args);
        let text = stdout(&out);
        assert!(out.status.success(), "{args:?}: {}", stderr(&out));
        for bad in ["null", "NaN", "Infinity"] {
            assert!(!text.contains(bad), "{args:?}: `{bad}` in {text}");
        }
        assert!(!negative_zero(&json(&out)), "{args:?}: -0 in {text}");
    }
    let out = colligo(&SWEEP_PURE_WATER);
    assert!(!stdout(&out).contains("\t-0\t"), "{}", stdout(&out));
}

/// Sucrose swept from nothing into pure water.
const SWEEP_PURE_WATER: [&str; 9] = [
    "sweep",
    "--mix",
    "water=100g",
    "--ingredient",
    "sucrose",
    "--to",
    "10g",
    "--steps",
    "3",
];

fn negative_zero(v: &serde_json::Value) -> bool {
    use serde_json::Value;
    match v {
        Value::Number(n) => n.as_f64() == Some(0.0) && n.to_string().starts_with('-'),
        Value::Array(a) => a.iter().any(negative_zero),
        Value::Object(m) => m.values().any(negative_zero),
        _ => false,
    }
}

#[test]
fn freeze_point_count_does_not_wrap() {
    for step in ["1e-18", "1e-300", "0.0001"] {
        let out = colligo(&["freeze", "--mix", "water=100g, sucrose=10g", "--step", step]);
        let err = stderr(&out);
        assert_eq!(out.status.code(), Some(1), "{step}: {}", stdout(&out));
        assert!(err.contains("too many"), "{step}: {err}");
        assert!(err.len() < 200, "{err}");
    }
}

#[test]
fn storage_outside_the_ice_solve_is_said_not_hidden() {
    let v = json(&colligo(&[
        "eval",
        "--mix",
        "water=100g, sucrose=10g",
        "--storage",
        "-70C",
        "--json",
    ]));
    assert!(v.get("ice_fraction_of_water").is_none(), "{v}");
    let warned = v["warnings"].as_array().is_some_and(|w| {
        w.iter().any(|s| {
            s.as_str()
                .is_some_and(|s| s.contains("ice fraction") && s.contains("coldest"))
        })
    });
    assert!(warned, "{v}");
    // Above 0 °C there is no ice: the fraction is 0, not missing.
    for t in ["100C", "5C", "60C"] {
        let v = json(&colligo(&[
            "eval",
            "--mix",
            "water=100g, sucrose=10g",
            "--storage",
            t,
            "--json",
        ]));
        assert_eq!(v["ice_fraction_of_water"].as_f64(), Some(0.0), "{t}: {v}");
    }
}

#[test]
fn huge_numbers_in_messages_are_short() {
    let out = colligo(&["eval", "--mix", "water=100g", "--temperature", "1e308"]);
    let err = stderr(&out);
    assert_eq!(out.status.code(), Some(1));
    assert!(err.contains("1.000e308"), "{err}");
    assert!(err.len() < 200, "{err}");
}

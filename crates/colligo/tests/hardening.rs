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

fn salt(hydrate_water: &str) -> String {
    format!(
        r#"(
            id: "my_salt",
            name: "My salt",
            category: Salt,
            molar_mass_g_per_mol: 58.44,
            molar_mass_source: (key: "own", tag: Mem),
            kind: Electrolyte(ions: [(ion: "Na+", count: 1), (ion: "Cl-", count: 1)]),
            solubility: (
                g_per_100g_water: ([(-21.1, 30.4), (0.1, 35.6), (100.0, 39.0)]),
                on_freezing: Crystallises(hydrate_water: {hydrate_water}),
                source: (key: "own", tag: Mem),
            ),
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
    let good_salt = project(
        "salt",
        &salt("2.0"),
        "",
        r#"(ingredient: "my_salt", amount: 3.0, unit: g),"#,
    );
    json(&colligo(&[
        "freeze",
        good_salt.to_str().unwrap_or_default(),
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
        // Found by tests/loader_fuzz.rs: a Wilson energy that passes its
        // coefficient check but is absurd somewhere in −60 to 200 °C made
        // Λ infinite and the co-solvent's share of ln a_w NaN.
        (
            "Wilson energy reference temperature of 1.2e8 K",
            project(
                "wilson_t_ref",
                &cosolvent(
                    "Taylor(t_ref_k: 123456789.123, value: 367.3, d1: 1.16)",
                    "58.6",
                    "18.07",
                ),
                "",
                ALCOHOL_LINE,
            ),
            "user_solutes[0].kind.wilson.a12_j_per_mol",
        ),
        (
            "Wilson energy of -1e308 J/mol",
            project(
                "wilson_huge",
                &cosolvent("Constant(367.0)", "58.6", "18.07").replace(
                    "a21_j_per_mol: Constant(2900.0)",
                    "a21_j_per_mol: Constant(-1e308)",
                ),
                "",
                ALCOHOL_LINE,
            ),
            "user_solutes[0].kind.wilson.a21_j_per_mol",
        ),
        // Found by tests/loader_fuzz.rs: hydrate water of -inf gave a NaN
        // hydrate share in the freezing curve.
        (
            "hydrate water of -inf",
            project(
                "hydrate_inf",
                &salt("-inf"),
                "",
                r#"(ingredient: "my_salt", amount: 3.0, unit: g),"#,
            ),
            "user_solutes[0].solubility.on_freezing.hydrate_water",
        ),
        (
            "hydrate water of 1e6",
            project(
                "hydrate_huge",
                &salt("1e6"),
                "",
                r#"(ingredient: "my_salt", amount: 3.0, unit: g),"#,
            ),
            "user_solutes[0].solubility.on_freezing.hydrate_water",
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

/// A scratch directory of this test process.
fn scratch(name: &str, text: &[u8]) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("colligo-hardening-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap_or_else(|e| panic!("{e}"));
    let p = dir.join(name);
    std::fs::write(&p, text).unwrap_or_else(|e| panic!("{e}"));
    p
}

fn sample(name: &str) -> String {
    let p = PathBuf::from(env!("CARGO_MANIFEST_DIR")).join(format!("../../samples/{name}"));
    std::fs::read_to_string(&p).unwrap_or_else(|e| panic!("{}: {e}", p.display()))
}

/// The longest run of digits in `text` (a 309-digit 1e308 is the failure).
fn longest_digit_run(text: &str) -> usize {
    text.split(|c: char| !c.is_ascii_digit())
        .map(str::len)
        .max()
        .unwrap_or(0)
}

/// An unknown id of a megabyte, wherever it is written, is named by its
/// start and its length, and the near-match search over it is bounded
/// (the test finishing is the check on the time; no timer is asserted).
/// A single command-line argument is limited by Linux to 128 KiB
/// (MAX_ARG_STRLEN), so the `--mix` case uses 120 000 characters; files
/// carry the full megabyte.
#[test]
fn huge_ids_are_elided_in_every_message() {
    const MB: usize = 1_000_000;
    let long = "a".repeat(MB);
    let arg = "b".repeat(120_000);
    let mix = format!("{arg}=10g, water=90g");
    let base = sample("pickle_brine.ron");
    let in_line = base.replacen(
        r#"(ingredient: "water""#,
        &format!(r#"(ingredient: "{long}""#),
        1,
    );
    assert_ne!(in_line, base, "the sample has no water line");
    let user_id = project(
        "long_user_id",
        "",
        &format!(
            r#"(id: "{long}", name: "Long", category: Sweetener, water_g_per_100g: 100.0,
                solutes: [], source: (key: "own", tag: Mem))"#
        ),
        "",
    );
    let user_solute = project(
        "long_user_solute",
        "",
        &format!(
            r#"(id: "my_syrup", name: "Syrup", category: Sweetener, water_g_per_100g: 20.0,
                solutes: [(solute: "{long}", g_per_100g: 80.0)], source: (key: "own", tag: Mem))"#
        ),
        "",
    );
    let unknown_field = base.replacen("name:", &format!("{long}: 1, name:"), 1);
    let cases: Vec<(&str, Vec<String>)> = vec![
        ("--mix", vec!["eval".into(), "--mix".into(), mix.clone()]),
        (
            "project line",
            vec![
                "eval".into(),
                path_arg(&scratch("long_line.ron", in_line.as_bytes())),
            ],
        ),
        (
            "user ingredient id",
            vec!["eval".into(), path_arg(&user_id)],
        ),
        (
            "user ingredient's solute",
            vec!["eval".into(), path_arg(&user_solute)],
        ),
        (
            "unknown project field",
            vec![
                "eval".into(),
                path_arg(&scratch("long_field.ron", unknown_field.as_bytes())),
            ],
        ),
        (
            "batch column",
            vec![
                "batch".into(),
                path_arg(&scratch(
                    "long_column.csv",
                    format!("name,water,{long}\nA,90,10\n").as_bytes(),
                )),
            ],
        ),
        (
            "batch cell",
            vec![
                "batch".into(),
                path_arg(&scratch(
                    "long_cell.csv",
                    format!("name,water,sucrose\nA,90,{long}\n").as_bytes(),
                )),
            ],
        ),
        (
            "sweep ingredient",
            vec![
                "sweep".into(),
                "--mix".into(),
                "water=100g".into(),
                "--ingredient".into(),
                arg.clone(),
                "--to".into(),
                "10g".into(),
            ],
        ),
        (
            "clap's own value check",
            vec![
                "eval".into(),
                "--mix".into(),
                "water=1g".into(),
                "--model".into(),
                arg.clone(),
            ],
        ),
        (
            "a value parser",
            vec![
                "eval".into(),
                "--mix".into(),
                "water=1g".into(),
                "--temperature".into(),
                arg.clone(),
            ],
        ),
        (
            "target",
            vec![
                "solve".into(),
                "--mix".into(),
                "water=100g".into(),
                "--ingredient".into(),
                "sucrose".into(),
                "--target".into(),
                format!("{arg}=0.9"),
            ],
        ),
    ];
    for (what, args) in cases {
        let args: Vec<&str> = args.iter().map(String::as_str).collect();
        let out = colligo(&args);
        // A bad cell fails its row only: its reason is in the output.
        let (err, code) = if what == "batch cell" {
            (stdout(&out), Some(0))
        } else {
            (stderr(&out), out.status.code().filter(|c| *c != 0))
        };
        assert_eq!(out.status.code(), code, "{what}");
        assert!(
            !err.contains("panicked"),
            "{what}: {}",
            &err[..err.len().min(400)]
        );
        assert!(
            err.len() < 600,
            "{what}: {} bytes: {}…",
            err.len(),
            &err[..400.min(err.len())]
        );
        assert!(
            err.contains("characters"),
            "{what}: the length is not said: {err}"
        );
    }
}

fn path_arg(p: &std::path::Path) -> String {
    p.to_str().unwrap_or_default().to_string()
}

/// A UTF-8 byte-order mark, as some editors write it, is not part of the
/// text: projects and batch files that start with one are read.
#[test]
fn files_starting_with_a_byte_order_mark_are_read() {
    let text = format!("\u{feff}{}", sample("pickle_brine.ron"));
    let p = scratch("bom.ron", text.as_bytes());
    json(&colligo(&["eval", &path_arg(&p), "--json"]));
    let csv = scratch(
        "bom.csv",
        "\u{feff}\"name\",water,sucrose\r\nA,90,10\r\n".as_bytes(),
    );
    let out = colligo(&["batch", &path_arg(&csv)]);
    assert!(out.status.success(), "{}", stderr(&out));
    let table = stdout(&out);
    let row = table.lines().nth(1).unwrap_or_default();
    assert!(row.starts_with("A,0.9"), "{table}");
}

/// `format_version` is the field of the document, not the first text that
/// looks like it: a comment or a note mentioning another version does not
/// count, and a newer file is still told apart by its field.
#[test]
fn format_version_is_read_from_the_document() {
    let base = sample("pickle_brine.ron");
    for (name, text) in [
        ("comment", format!("// format_version: 2\n{base}")),
        (
            "note",
            base.replacen("notes: \"", "notes: \"format_version: 7. ", 1),
        ),
    ] {
        let p = scratch(&format!("version_{name}.ron"), text.as_bytes());
        json(&colligo(&["eval", &path_arg(&p), "--json"]));
    }
    let newer = base
        .replacen("format_version: 1", "format_version: 2", 1)
        .replacen("name:", "colour_of_the_label: \"red\", name:", 1);
    let p = scratch("version_newer.ron", newer.as_bytes());
    let out = colligo(&["eval", &path_arg(&p)]);
    assert_eq!(out.status.code(), Some(1));
    assert!(
        stderr(&out).contains("format version 2 is not supported"),
        "{}",
        stderr(&out)
    );
}

/// `batch a.csv b.csv` computes every file, in order, under one header; an
/// error row names the file it comes from.
#[test]
fn batch_computes_every_file_given() {
    let a = scratch("first.csv", b"name,water,sucrose\nA,90,10\n");
    let b = scratch("second.csv", b"name,water,sodium_chloride\nB,95,5\nC,,5\n");
    let out = colligo(&["batch", &path_arg(&a), &path_arg(&b)]);
    assert!(out.status.success(), "{}", stderr(&out));
    let text = stdout(&out);
    let lines: Vec<&str> = text.lines().collect();
    assert_eq!(lines.len(), 4, "{text}");
    assert!(lines[0].starts_with("name,"), "{text}");
    assert!(lines[1].starts_with("A,0.9"), "{text}");
    assert!(lines[2].starts_with("B,0.9"), "{text}");
    assert!(
        lines[3].starts_with("C,") && lines[3].contains("second.csv line 3"),
        "{text}"
    );
    // One file keeps its plain `line N`.
    let out = colligo(&["batch", &path_arg(&b)]);
    assert!(stdout(&out).contains(",line 3: "), "{}", stdout(&out));
    // A file that cannot be read stops the batch with its name.
    let out = colligo(&["batch", &path_arg(&a), "no/such/file.csv"]);
    assert_eq!(out.status.code(), Some(1));
    assert!(
        stderr(&out).contains("no/such/file.csv"),
        "{}",
        stderr(&out)
    );
}

/// No option's error, nor any table, prints a number of hundreds of digits.
#[test]
fn huge_and_odd_numbers_in_options_print_short() {
    let mix = ["--mix", "water=100g, sucrose=10g"];
    let cases: Vec<Vec<&str>> = vec![
        vec!["eval", "--temperature", "1e308"],
        vec!["eval", "--temperature", "-1e308"],
        vec!["eval", "--temperature", "1e308F"],
        vec!["eval", "--storage", "1e308"],
        vec!["eval", "--storage", "-1e308"],
        vec!["eval", "--pressure", "1e308"],
        vec!["eval", "--pressure", "1e-308"],
        vec!["eval", "--pressure", "1e308m"],
        vec!["freeze", "--from", "1e308"],
        vec!["freeze", "--to", "-1e308"],
        vec!["freeze", "--step", "1e308"],
        vec!["freeze", "--step", "1e-308"],
        vec!["sweep", "--ingredient", "sucrose", "--to", "1e308g"],
        vec![
            "sweep",
            "--ingredient",
            "sucrose",
            "--from",
            "1e300kg",
            "--to",
            "1e308kg",
        ],
        vec!["sweep", "--ingredient", "sucrose", "--to", "1e308%"],
        vec!["solve", "--ingredient", "sucrose", "--target", "aw=1e308"],
        vec![
            "solve",
            "--ingredient",
            "sucrose",
            "--target",
            "freezing_point_c=-1e308",
        ],
        vec![
            "solve",
            "--ingredient",
            "sucrose",
            "--target",
            "ice_fraction_of_water@1e308C=0.5",
        ],
        vec![
            "solve",
            "--ingredient",
            "sucrose",
            "--target",
            "ice_fraction_of_water@-18C=1e308",
        ],
        vec!["batch", "--temperature", "1e308"],
    ];
    let csv = scratch(
        "numbers.csv",
        b"name,water,sucrose\nA,90,1e308\nB,1e-320,10\n",
    );
    for case in cases {
        let mut args = case.clone();
        if case[0] == "batch" {
            args.push(csv.to_str().unwrap_or_default());
        } else {
            args.extend(mix);
        }
        let out = colligo(&args);
        let text = format!("{}{}", stdout(&out), stderr(&out));
        assert!(!text.contains("panicked"), "{case:?}: {text}");
        assert!(
            longest_digit_run(&text) < 20,
            "{case:?}: {}",
            &text[..text.len().min(600)]
        );
    }
}

/// A trace of a solute that never crystallises (here ethanol, 1e-9 g)
/// once made the freezing curve fail below the salt's eutectic: the liquid
/// it keeps is less than the 1e-6 of the water the ice solve looks at, and
/// the solve found no sign change (found by tests/loader_fuzz.rs). A trace
/// changes nothing: the curve is that of the salt brine alone, to 1e-4.
#[test]
fn a_trace_of_cosolvent_does_not_break_the_freezing_curve() {
    let curve = |mix: &str, model: &str| {
        let v = json(&colligo(&[
            "freeze", "--mix", mix, "--model", model, "--json",
        ]));
        v["points"]
            .as_array()
            .map(|pts| {
                pts.iter()
                    .map(|p| p["ice_fraction_of_water"].as_f64().unwrap_or(f64::NAN))
                    .collect::<Vec<f64>>()
            })
            .unwrap_or_default()
    };
    for model in ["zsr", "pitzer", "ross"] {
        let brine = curve("water=80g, sodium_chloride=3g", model);
        let traced = curve("water=80g, ethanol=1e-9g, sodium_chloride=3g", model);
        assert_eq!(brine.len(), 30, "{model}: {brine:?}");
        assert_eq!(brine.len(), traced.len(), "{model}");
        for (i, (a, b)) in brine.iter().zip(&traced).enumerate() {
            assert!((a - b).abs() < 1e-4, "{model}, point {i}: {a} vs {b}");
        }
    }
}

/// A project may hold 1 kPa (the low end of `Limits::PRESSURE_KPA`, which
/// the window accepts too); the evaluation refused exactly that value
/// (found by tests/loader_fuzz.rs).
#[test]
fn the_lowest_pressure_a_project_may_hold_evaluates() {
    let text = sample("pickle_brine.ron").replacen("pressure_kpa: 84.0", "pressure_kpa: 1.0", 1);
    assert!(text.contains("pressure_kpa: 1.0"));
    let p = scratch("low_pressure.ron", text.as_bytes());
    let v = json(&colligo(&["eval", &path_arg(&p), "--json"]));
    assert!(v["water_activity"].as_f64().is_some(), "{v}");
    json(&colligo(&[
        "eval",
        "--mix",
        "water=100g",
        "--pressure",
        "1kPa",
        "--json",
    ]));
    // Below it, the refusal says so.
    let out = colligo(&["eval", "--mix", "water=100g", "--pressure", "0.5kPa"]);
    assert_eq!(out.status.code(), Some(1));
    assert!(stderr(&out).contains("pressure"), "{}", stderr(&out));
}

/// A project line above `formula::MAX_LINE_KG` is refused on load with the
/// line's path, like every other field, rather than loading and then
/// failing to evaluate (found by tests/loader_fuzz.rs).
#[test]
fn a_project_line_above_the_bound_is_refused_on_load() {
    let text = sample("pickle_brine.ron");
    let at = text
        .find(r#"(ingredient: "water", amount: "#)
        .unwrap_or_else(|| panic!("no water line"));
    let rest = &text[at..];
    let end = rest.find(", unit").unwrap_or(0);
    let line = &rest[..end];
    let huge = text.replacen(line, r#"(ingredient: "water", amount: 4.0e12"#, 1);
    let p = scratch("huge_line.ron", huge.as_bytes());
    let out = colligo(&["eval", &path_arg(&p)]);
    let err = stderr(&out);
    assert_eq!(out.status.code(), Some(1), "{err}");
    assert!(
        err.contains(".lines[") && err.contains("].amount") && err.contains("largest a line"),
        "{err}"
    );
    assert!(err.len() < 300, "{err}");
}

/// Issue 8, item 7: adding a pure solute never raises a_w. The examples
/// found by a random search: acetic acid (negative Norrish K) added to a
/// concentrated sorbitol + HFCS solution under Norrish, and a first trace
/// of potassium chloride in a humectant base under `auto` (which used to
/// switch from Norrish to ZSR and jump up).
#[test]
fn adding_a_solute_on_the_command_line_never_raises_water_activity() {
    let aw = |mix: &str, model: &str| {
        let o = colligo(&["eval", "--mix", mix, "--model", model, "--json"]);
        assert!(o.status.success(), "{}", stderr(&o));
        json(&o)["water_activity"].as_f64().unwrap_or(f64::NAN)
    };
    let base = "sorbitol=6.771g, high_fructose_syrup_42=13.576g";
    let (a0, a1) = (
        aw(base, "norrish"),
        aw(&format!("{base}, acetic_acid=0.320g"), "norrish"),
    );
    assert!(a1 < a0, "acetic acid raised a_w {a0} → {a1}");
    let base = "water=78.61150753478944g, isomalt=3.072g, panthenol=51.134g, acetic_acid=33.38g, malic_acid=3.052g";
    let a0 = aw(base, "auto");
    for g in ["0.000256", "0.256"] {
        let a1 = aw(&format!("{base}, potassium_chloride={g}g"), "auto");
        assert!(a1 < a0, "{g} g KCl raised a_w {a0} → {a1}");
        assert!(a0 - a1 < 0.01, "{g} g KCl: a jump {a0} → {a1}");
    }
}

//! The headless subcommands, run as a user would run them.

use std::path::PathBuf;
use std::process::{Command, Output};

fn colligo(args: &[&str]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_colligo"))
        .args(args)
        .output()
        .unwrap_or_else(|e| panic!("cannot run colligo: {e}"))
}

fn sample(name: &str) -> String {
    let p: PathBuf = [env!("CARGO_MANIFEST_DIR"), "..", "..", "samples", name]
        .iter()
        .collect();
    p.to_string_lossy().into_owned()
}

fn json(out: &Output) -> serde_json::Value {
    assert!(
        out.status.success(),
        "stderr: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    serde_json::from_slice(&out.stdout)
        .unwrap_or_else(|e| panic!("{e}: {}", String::from_utf8_lossy(&out.stdout)))
}

#[test]
fn eval_json_has_every_key() {
    let v = json(&colligo(&[
        "eval",
        "--mix",
        "water=1000g, sodium_chloride=58.443g",
        "--json",
    ]));
    for k in [
        "water_activity",
        "erh_percent",
        "vapor_pressure_pa",
        "relative_lowering",
        "freezing_point_c",
        "boiling_point_c",
        "osmolality_mosmol_per_kg",
        "osmotic_pressure_mpa",
        "model",
        "warnings",
        "solutes",
    ] {
        assert!(v.get(k).is_some(), "missing {k}");
    }
    // 1 mol/kg NaCl at 25 °C: a_w = 0.96680 (Archer 1992, via pytzer 0.6.0);
    // boiling point 100.92 °C at 101.325 kPa (same model with IF97 p_s).
    let aw = v["water_activity"].as_f64().unwrap_or(0.0);
    assert!((aw - 0.96680).abs() < 5e-4, "{aw}");
    let bp = v["boiling_point_c"].as_f64().unwrap_or(0.0);
    assert!((bp - 100.92).abs() < 0.05, "{bp}");
    assert_eq!(v["model"], "pitzer");
    let s = &v["solutes"][0];
    for k in ["id", "dissolved_g", "undissolved_g", "molality_mol_per_kg"] {
        assert!(s.get(k).is_some(), "solute missing {k}");
    }
}

#[test]
fn eval_reads_a_sample_project_and_its_variants() {
    let path = sample("reduced_sugar_spread.ron");
    let a = json(&colligo(&[
        "eval",
        &path,
        "--variant",
        "Standard",
        "--json",
    ]));
    let b = json(&colligo(&[
        "eval",
        &path,
        "--variant",
        "Reduced sugar",
        "--json",
    ]));
    assert_ne!(a["water_activity"], b["water_activity"]);
    let table = colligo(&["eval", &path]);
    assert!(table.status.success());
    let text = String::from_utf8_lossy(&table.stdout);
    assert!(
        text.contains("water activity") && text.contains("calibrated"),
        "{text}"
    );
    let bad = colligo(&["eval", &path, "--variant", "nope"]);
    assert!(!bad.status.success());
    assert!(String::from_utf8_lossy(&bad.stderr).contains("no variant named"));
}

#[test]
fn eval_units_and_models() {
    let f = json(&colligo(&[
        "eval",
        "--mix",
        "water=100g, sucrose=50g",
        "--temperature",
        "77F",
        "--model",
        "ideal",
        "--json",
    ]));
    assert!((f["temperature_c"].as_f64().unwrap_or(0.0) - 25.0).abs() < 1e-9);
    assert_eq!(f["model"], "ideal");
    let k = json(&colligo(&[
        "eval",
        "--mix",
        "water=100g, sucrose=50g",
        "--temperature",
        "298.15K",
        "--pressure",
        "1600m",
        "--json",
    ]));
    assert!(k["boiling_point_c"].as_f64().unwrap_or(0.0) < 96.0);
}

#[test]
fn freeze_curve_json() {
    let v = json(&colligo(&[
        "freeze",
        "--mix",
        "water=900g, sodium_chloride=100g",
        "--from",
        "-1",
        "--to",
        "-20",
        "--step",
        "1",
        "--json",
    ]));
    let pts = v["points"].as_array().map(Vec::len).unwrap_or(0);
    assert_eq!(pts, 20);
    let p10 = v["points"]
        .as_array()
        .and_then(|a| {
            a.iter()
                .find(|p| p["temperature_c"].as_f64() == Some(-10.0))
        })
        .cloned()
        .unwrap_or_default();
    // 10 wt % NaCl at −10 °C: 0.317 of the water frozen (Archer 1992 with
    // the IAPWS ice equilibrium, pytzer 0.6.0 + iapws 1.5.5).
    let f = p10["ice_fraction_of_water"].as_f64().unwrap_or(0.0);
    assert!((f - 0.317).abs() < 2e-3, "{f}");
    for k in [
        "temperature_c",
        "ice_fraction_of_water",
        "ice_fraction_of_total",
        "water_activity",
    ] {
        assert!(p10.get(k).is_some(), "{k}");
    }
    assert!(v["freezing_point_c"].as_f64().unwrap_or(0.0) < -6.0);
}

#[test]
fn sweep_csv_and_json() {
    let path = sample("humectant_gel.ron");
    let out = colligo(&[
        "sweep",
        &path,
        "--ingredient",
        "glycerin_995",
        "--from",
        "0g",
        "--to",
        "200g",
        "--steps",
        "10",
        "--csv",
    ]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let text = String::from_utf8_lossy(&out.stdout);
    let lines: Vec<&str> = text.lines().collect();
    assert_eq!(lines.len(), 12, "{text}");
    assert!(lines[0].starts_with("glycerin_995_g,water_activity"));
    let aw: Vec<f64> = lines[1..]
        .iter()
        .filter_map(|l| l.split(',').nth(1)?.parse().ok())
        .collect();
    assert_eq!(aw.len(), 11);
    assert!(
        aw.windows(2).all(|w| w[1] < w[0]),
        "a_w must fall as glycerin is added: {aw:?}"
    );
    let v = json(&colligo(&[
        "sweep",
        &path,
        "--ingredient",
        "glycerin_995",
        "--to",
        "100g",
        "--steps",
        "4",
        "--json",
    ]));
    assert_eq!(v["points"].as_array().map(Vec::len), Some(5));
}

#[test]
fn batch_rows_and_errors() {
    let dir = std::env::temp_dir().join(format!("colligo-cli-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap_or_else(|e| panic!("{e}"));
    let csv = dir.join("f.csv");
    std::fs::write(
        &csv,
        "name,water,sodium_chloride,sucrose\nbrine,1000,58.443,0\nsyrup,100,,50\nbad,100,lots,1\ndry,0,10,10\n",
    )
    .unwrap_or_else(|e| panic!("{e}"));
    let out = colligo(&[
        "batch",
        csv.to_str().unwrap_or_default(),
        "--properties",
        "water_activity,freezing_point_c",
    ]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let text = String::from_utf8_lossy(&out.stdout);
    let rows: Vec<Vec<&str>> = text.lines().map(|l| l.split(',').collect()).collect();
    assert_eq!(
        rows[0],
        vec!["name", "water_activity", "freezing_point_c", "error"]
    );
    assert_eq!(rows.len(), 5);
    let aw: f64 = rows[1][1].parse().unwrap_or(0.0);
    assert!((aw - 0.96680).abs() < 5e-4, "{aw}");
    assert!(rows[3][3].contains("not a number"), "{:?}", rows[3]);
    assert!(rows[4][3].contains("no water"), "{:?}", rows[4]);
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn solve_reaches_the_target_or_says_why() {
    let path = sample("reduced_sugar_spread.ron");
    let v = json(&colligo(&[
        "solve",
        &path,
        "--ingredient",
        "glycerin_995",
        "--target",
        "water_activity=0.85",
        "--json",
    ]));
    let aw = v["properties"]["water_activity"].as_f64().unwrap_or(0.0);
    assert!((aw - 0.85).abs() < 1e-3, "{aw}");
    assert!(v["amount_g"].as_f64().unwrap_or(0.0) > 0.0);
    assert_eq!(v["ingredient"], "glycerin_995");
    // Water only raises a_w: it cannot bring it down to 0.5.
    let out = colligo(&[
        "solve",
        &path,
        "--ingredient",
        "water",
        "--target",
        "water_activity=0.5",
    ]);
    assert!(!out.status.success());
    assert!(String::from_utf8_lossy(&out.stderr).contains("cannot be reached"));
}

#[test]
fn bad_input_gives_an_error_not_a_panic() {
    for args in [
        vec!["eval"],
        vec!["eval", "--mix", "water=lots"],
        vec!["eval", "--mix", "sucrse=10g, water=100g"],
        vec!["eval", "--mix", "water=-5g"],
        vec!["eval", "--mix", "sucrose=10g"],
        vec!["eval", "--mix", "water=100g", "--temperature", "hot"],
        vec!["eval", "--mix", "water=100g", "--model", "magic"],
        vec!["eval", "/nonexistent/project.ron"],
        vec!["freeze", "--mix", "water=100g", "--step", "0"],
        vec!["sweep", "--mix", "water=100g"],
        vec!["batch", "/nonexistent.csv"],
        vec![
            "solve",
            "--mix",
            "water=100g",
            "--ingredient",
            "sucrose",
            "--target",
            "aw=7",
        ],
        vec!["eval", "--bogus", "1"],
    ] {
        let out = colligo(&args);
        assert!(!out.status.success(), "{args:?} should fail");
        let err = String::from_utf8_lossy(&out.stderr);
        assert!(!err.contains("panicked"), "{args:?}: {err}");
        assert!(!err.trim().is_empty(), "{args:?}: no message");
    }
    let out = colligo(&["eval", "--mix", "sucrse=10g, water=100g"]);
    assert!(
        String::from_utf8_lossy(&out.stderr).contains("sucrose"),
        "suggestion expected"
    );
}

#[test]
fn corrupt_project_names_the_file() {
    let dir = std::env::temp_dir().join(format!("colligo-corrupt-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap_or_else(|e| panic!("{e}"));
    let p = dir.join("broken.ron");
    std::fs::write(&p, "(format_version: 1, name: \"x\", conditions: (")
        .unwrap_or_else(|e| panic!("{e}"));
    let out = colligo(&["eval", p.to_str().unwrap_or_default()]);
    assert!(!out.status.success());
    assert!(String::from_utf8_lossy(&out.stderr).contains("broken.ron"));
    std::fs::write(&p, "(format_version: 99, name: \"x\")").unwrap_or_else(|e| panic!("{e}"));
    let out = colligo(&["eval", p.to_str().unwrap_or_default()]);
    assert!(String::from_utf8_lossy(&out.stderr).contains("version 99"));
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn every_subcommand_has_generated_help() {
    for (sub, options) in [
        (
            "eval",
            &[
                "--variant",
                "--mix",
                "--temperature",
                "--pressure",
                "--storage",
                "--model",
                "--json",
            ][..],
        ),
        (
            "freeze",
            &["--from", "--to", "--step", "--json", "--mix"][..],
        ),
        (
            "sweep",
            &[
                "--ingredient",
                "--from",
                "--to",
                "--steps",
                "--csv",
                "--json",
            ][..],
        ),
        ("batch", &["FORMULAS.csv", "--properties", "--model"][..]),
        ("solve", &["--ingredient", "--target", "--json"][..]),
    ] {
        for help in [vec![sub, "--help"], vec!["help", sub]] {
            let out = colligo(&help);
            assert!(out.status.success(), "{help:?}");
            let text = String::from_utf8_lossy(&out.stdout);
            assert!(text.contains(&format!("Usage: colligo {sub}")), "{text}");
            for o in options {
                assert!(text.contains(o), "{sub} --help does not name {o}:\n{text}");
            }
        }
    }
    let out = colligo(&["--help"]);
    assert!(out.status.success());
    let text = String::from_utf8_lossy(&out.stdout);
    for sub in ["eval", "freeze", "sweep", "batch", "solve"] {
        assert!(text.contains(sub), "{text}");
    }
    // The model choice lists every model, and the batch help every property key.
    let text = String::from_utf8_lossy(&colligo(&["eval", "--help"]).stdout).into_owned();
    for m in ["auto", "ideal", "norrish", "ross", "zsr", "pitzer"] {
        assert!(text.contains(m), "{m}: {text}");
    }
    let text = String::from_utf8_lossy(&colligo(&["batch", "--help"]).stdout).into_owned();
    assert!(text.contains("osmolality_mosmol_per_kg") && text.contains("storage_temperature_c"));
}

#[test]
fn unknown_subcommand_fails_with_a_suggestion_and_opens_no_window() {
    for (typed, suggested) in [("evl", Some("eval")), ("frobnicate", None)] {
        let out = colligo(&[typed]);
        // A usage error (2), not the window's failure to start (1) here
        // without a display.
        assert_eq!(out.status.code(), Some(2), "{typed}");
        let err = String::from_utf8_lossy(&out.stderr);
        assert!(err.contains("unrecognized subcommand"), "{err}");
        assert!(err.contains(typed), "{err}");
        assert!(
            !err.contains("window") && !err.contains("panicked"),
            "{err}"
        );
        if let Some(s) = suggested {
            assert!(err.contains(&format!("'{s}'")), "{err}");
        }
    }
    // Options of a subcommand are checked the same way.
    let out = colligo(&["eval", "--mix", "water=100g", "--jsn"]);
    assert_eq!(out.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&out.stderr).contains("--json"));
}

#[test]
fn freeze_temperatures_take_units() {
    let brine = "water=900g, sodium_chloride=100g";
    let v = json(&colligo(&[
        "freeze", "--mix", brine, "--from", "-1F", "--to", "-40", "--step", "1", "--json",
    ]));
    // -1 °F = (-1 - 32) · 5/9 °C by the definition of the Fahrenheit scale.
    let first = v["points"][0]["temperature_c"].as_f64().unwrap_or(0.0);
    assert!((first - (-33.0 * 5.0 / 9.0)).abs() < 1e-9, "{first}");
    // 14 °F is exactly -10 °C: the same curve as `--from -10`.
    let f = colligo(&[
        "freeze", "--mix", brine, "--from", "14F", "--to", "-12", "--json",
    ]);
    let c = colligo(&[
        "freeze", "--mix", brine, "--from", "-10", "--to", "-12", "--json",
    ]);
    assert!(f.status.success() && c.status.success());
    assert_eq!(f.stdout, c.stdout);
    // A bare negative number is °C, with or without `=`.
    let eq = colligo(&["freeze", "--mix", brine, "--from=-10", "--to=-12", "--json"]);
    assert_eq!(eq.stdout, c.stdout);
    let bad = colligo(&["freeze", "--mix", brine, "--from", "-1X"]);
    assert_eq!(bad.status.code(), Some(2));
    assert!(String::from_utf8_lossy(&bad.stderr).contains("--from"));
}

#[test]
fn batch_names_with_line_breaks_round_trip() {
    let dir = std::env::temp_dir().join(format!("colligo-roundtrip-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap_or_else(|e| panic!("{e}"));
    let name = "syrup, \"two\"\nlines";
    let quoted = "\"syrup, \"\"two\"\"\nlines\"";
    // Record 2 spans lines 2-3; line 4 is empty and line 5 blank; the bad
    // row starts on line 6.
    let input = format!("name,water,sucrose\n{quoted},100,50\n\n   \nbad,100,lots\nplain,100,50\n");
    let csv_in = dir.join("in.csv");
    std::fs::write(&csv_in, &input).unwrap_or_else(|e| panic!("{e}"));
    let out = colligo(&[
        "batch",
        csv_in.to_str().unwrap_or_default(),
        "--properties",
        "water_activity",
    ]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let text = String::from_utf8_lossy(&out.stdout).into_owned();
    assert!(text.contains(quoted), "written quoted: {text}");
    let rows: Vec<csv::StringRecord> = csv::ReaderBuilder::new()
        .from_reader(text.as_bytes())
        .records()
        .map(|r| r.unwrap_or_else(|e| panic!("{e}: {text}")))
        .collect();
    assert_eq!(rows.len(), 3, "{text}");
    assert_eq!(rows[0].get(0), Some(name));
    assert_eq!(rows[0].get(2), Some(""));
    // The same formula under a plain name gives the same a_w.
    assert_eq!(rows[2].get(0), Some("plain"));
    assert_eq!(rows[0].get(1), rows[2].get(1));
    assert!(rows[0].get(1).and_then(|s| s.parse::<f64>().ok()).is_some());
    assert_eq!(rows[1].get(0), Some("bad"));
    let err = rows[1].get(2).unwrap_or_default();
    assert!(
        err.starts_with("line 6: ") && err.contains("not a number"),
        "{err}"
    );
    // The output reads back as input too (its extra columns name no
    // ingredient, so that is an error naming the column).
    let again = dir.join("again.csv");
    std::fs::write(&again, &text).unwrap_or_else(|e| panic!("{e}"));
    let out = colligo(&["batch", again.to_str().unwrap_or_default()]);
    assert!(!out.status.success());
    assert!(String::from_utf8_lossy(&out.stderr).contains("water_activity"));
    let _ = std::fs::remove_dir_all(&dir);
}

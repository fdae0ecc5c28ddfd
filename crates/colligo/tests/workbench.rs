//! The workbench driven as a person would: find widgets by label and role,
//! click, type, press keys, and check what the document and the results
//! say. No display or GPU is needed.

use std::path::PathBuf;

mod common;
use common::*;

use colligo::app::commands::{Action, Edit};
use colligo::app::prefs::ChartTab;
use colligo::app::{Modal, WorkbenchApp};
use colligo_core::models::ModelChoice;
use colligo_core::quantity::TemperatureUnit;
use egui::accesskit::Role;
use egui::{Key, Modifiers};
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;

#[test]
fn opens_on_a_sample_with_results() {
    let h = harness("opens");
    let app = h.state();
    assert!(!app.doc.formula().lines.is_empty());
    assert!(aw(&h) > 0.5 && aw(&h) < 1.0);
    assert!(h.query_by_label_contains("Water profile").is_some());
    assert!(
        h.query_by_label_contains("calibrated water-activity measurement")
            .is_some(),
        "cautions shown"
    );
}

#[test]
fn add_an_ingredient_through_the_picker() {
    let mut h = harness("picker");
    let before = h.state().doc.formula().lines.len();
    h.get_by_role_and_label(Role::TextInput, "Add ingredient")
        .click();
    h.run();
    // A synonym finds it too: "E422" is glycerol.
    h.get_by_role_and_label(Role::TextInput, "Add ingredient")
        .type_text("E422");
    h.run();
    h.get_by_label_contains("Glycerol").click();
    h.run();
    let f = h.state().doc.formula();
    assert_eq!(f.lines.len(), before + 1);
    assert_eq!(
        f.lines.last().map(|l| l.ingredient.as_str()),
        Some("glycerol")
    );
}

#[test]
fn changing_an_amount_changes_aw() {
    let mut h = harness("amount");
    let aw0 = aw(&h);
    retype(&mut h, "Sucrose", "500");
    assert_eq!(line_amount(&h, "sucrose"), Some(500.0));
    assert!(
        aw(&h) < aw0 - 1e-4,
        "more sucrose must lower a_w: {aw0} → {}",
        aw(&h)
    );
}

#[test]
fn garbage_in_an_amount_is_refused() {
    let mut h = harness("garbage");
    let before = h.state().doc.project.clone();
    h.get_by_role_and_label(Role::TextInput, "Sucrose").click();
    h.run();
    h.key_press_modifiers(Modifiers::COMMAND, Key::A);
    h.get_by_role_and_label(Role::TextInput, "Sucrose")
        .type_text("lots");
    h.run();
    assert_eq!(
        h.state().doc.project,
        before,
        "the document must not change"
    );
    // A negative mass is refused too.
    h.key_press_modifiers(Modifiers::COMMAND, Key::A);
    h.get_by_role_and_label(Role::TextInput, "Sucrose")
        .type_text("-5");
    h.run();
    assert_eq!(h.state().doc.project, before);
    assert!(aw(&h).is_finite());
}

#[test]
fn switching_the_model() {
    let mut h = harness("model");
    let aw0 = aw(&h);
    h.get_by_role_and_label(Role::ComboBox, "Model").click();
    h.run();
    h.get_by_label("Ideal (Raoult, with dissociation)").click();
    h.run();
    assert_eq!(h.state().doc.project.model, ModelChoice::Ideal);
    assert!(
        (aw(&h) - aw0).abs() > 1e-3,
        "the ideal model gives another a_w"
    );
}

#[test]
fn switching_temperature_units() {
    let mut h = harness("units");
    h.get_by_label("Temperature unit").click();
    h.run();
    h.get_by_label("°F").click();
    h.run();
    assert_eq!(
        h.state().doc.project.units.temperature,
        TemperatureUnit::Fahrenheit
    );
    // 25 °C shows as 77 °F.
    let field = h.get_by_role_and_label(Role::TextInput, "Product temperature");
    assert_eq!(field.value().as_deref(), Some("77 °F"));
}

#[test]
fn changing_temperature_changes_vapour_pressure() {
    let mut h = harness("temperature");
    let p0 = h
        .state()
        .eval
        .as_ref()
        .and_then(|e| e.props.as_ref().ok())
        .map(|p| p.vapor_pressure_pa);
    retype(&mut h, "Product temperature", "40 C");
    let p1 = h
        .state()
        .eval
        .as_ref()
        .and_then(|e| e.props.as_ref().ok())
        .map(|p| p.vapor_pressure_pa);
    assert!((h.state().doc.project.conditions.temperature_c - 40.0).abs() < 1e-9);
    assert!(
        p1.unwrap_or(0.0) > 1.5 * p0.unwrap_or(f64::INFINITY),
        "{p0:?} → {p1:?}"
    );
}

#[test]
fn picking_the_sweep_ingredient() {
    let mut h = harness("sweep");
    h.get_by_role_and_label(Role::ComboBox, "Ingredient")
        .click();
    h.run();
    // The entry in the open list (the table has a label of that name too).
    h.get_by_role_and_label(Role::Button, "Glycerin 99.5 %")
        .click();
    h.run();
    assert_eq!(
        h.state().charts_panel.sweep_ingredient.as_deref(),
        Some("glycerin_995")
    );
    // The chart worker delivers a sweep of that ingredient.
    wait_for(&mut h, |h| {
        matches!(
            h.state().charts.current(),
            Some(colligo::app::compute::ChartData::Sweep { .. })
        )
    });
    if let Some(colligo::app::compute::ChartData::Sweep { ingredient, .. }) =
        h.state().charts.current()
    {
        assert_eq!(ingredient, "glycerin_995");
    } else {
        panic!("no sweep data arrived");
    }
}

#[test]
fn undo_and_redo() {
    let mut h = harness("undo");
    let before = line_amount(&h, "sucrose");
    retype(&mut h, "Sucrose", "123");
    assert_eq!(line_amount(&h, "sucrose"), Some(123.0));
    // Leave the field so the shortcut reaches the document.
    h.key_press(Key::Escape);
    h.run();
    h.key_press_modifiers(Modifiers::COMMAND, Key::Z);
    h.run();
    assert_eq!(line_amount(&h, "sucrose"), before);
    h.key_press_modifiers(Modifiers::COMMAND | Modifiers::SHIFT, Key::Z);
    h.run();
    assert_eq!(line_amount(&h, "sucrose"), Some(123.0));
}

#[test]
fn save_and_reopen_gives_the_same_document() {
    let dir = data_dir("save");
    let mut h = harness_in(dir.clone());
    retype(&mut h, "Sucrose", "333");
    let path = dir.join("spread.ron");
    let ctx = h.ctx.clone();
    h.state_mut().apply(&ctx, Action::SaveTo(path.clone()));
    h.run();
    assert!(!h.state().doc.is_dirty());
    let saved = h.state().doc.project.clone();
    // Open something else, then the saved file again.
    h.state_mut().apply(&ctx, Action::OpenSample(1));
    h.run();
    assert_ne!(h.state().doc.project, saved);
    h.state_mut().apply(&ctx, Action::OpenPath(path.clone()));
    h.run();
    assert_eq!(h.state().doc.project, saved);
    assert_eq!(h.state().doc.path.as_deref(), Some(path.as_path()));
    assert_eq!(h.state().prefs.recent.first(), Some(&path));
}

#[test]
fn a_corrupt_file_shows_an_error_and_keeps_the_project() {
    let dir = data_dir("corrupt");
    let mut h = harness_in(dir.clone());
    let bad = dir.join("broken.ron");
    std::fs::write(
        &bad,
        "(format_version: 1, name: \"half a file\", variants: [",
    )
    .unwrap_or_else(|e| panic!("{e}"));
    let before = h.state().doc.project.clone();
    let ctx = h.ctx.clone();
    h.state_mut().apply(&ctx, Action::OpenPath(bad));
    h.run();
    assert_eq!(h.state().doc.project, before);
    let status = h
        .state()
        .status
        .clone()
        .unwrap_or_else(|| panic!("no message"));
    assert!(
        status.error && status.text.contains("broken.ron"),
        "{}",
        status.text
    );
    assert!(
        h.query_by_label_contains("broken.ron").is_some(),
        "the message is on screen"
    );
}

#[test]
fn unsaved_changes_prompt_before_new() {
    let mut h = harness("prompt");
    retype(&mut h, "Sucrose", "111");
    h.key_press(Key::Escape);
    h.run();
    h.key_press_modifiers(Modifiers::COMMAND, Key::N);
    h.run();
    assert!(matches!(h.state().modal, Some(Modal::Unsaved { .. })));
    assert!(h.query_by_label("Unsaved changes").is_some());
    // Cancel keeps the work.
    h.get_by_label("Cancel").click();
    h.run();
    assert!(h.state().modal.is_none());
    assert_eq!(line_amount(&h, "sucrose"), Some(111.0));
    // Discarding runs the New.
    h.key_press_modifiers(Modifiers::COMMAND, Key::N);
    h.run();
    h.get_by_label("Discard changes").click();
    h.run();
    assert_eq!(h.state().doc.project.name, "Untitled");
}

#[test]
fn closing_the_window_with_unsaved_changes_asks_first() {
    let mut h = harness("close");
    retype(&mut h, "Sucrose", "222");
    h.key_press(Key::Escape);
    h.run();
    h.input_mut()
        .viewports
        .entry(egui::ViewportId::ROOT)
        .or_default()
        .events
        .push(egui::ViewportEvent::Close);
    h.run();
    assert!(
        matches!(h.state().modal, Some(Modal::Unsaved { .. })),
        "close must be held back"
    );
}

#[test]
fn recovery_is_offered_after_a_crash() {
    let dir = data_dir("recover");
    let edited = {
        let mut h = harness_in(dir.clone());
        retype(&mut h, "Sucrose", "444");
        h.state_mut().autosave_now();
        h.state().doc.project.clone()
        // The harness is dropped without a clean exit: a crash.
    };
    let mut h = harness_in(dir);
    assert!(matches!(h.state().modal, Some(Modal::Recover { .. })));
    h.get_by_label("Recover").click();
    h.run();
    assert_eq!(h.state().doc.project.variants, edited.variants);
    assert!(
        h.state().doc.is_dirty(),
        "recovered work is unsaved until saved"
    );
}

#[test]
fn undo_shortcut_stays_with_a_focused_text_field() {
    let mut h = harness("focus");
    retype(&mut h, "Sucrose", "150");
    // Still focused in the field: Ctrl+Z belongs to the field, not the document.
    h.get_by_role_and_label(Role::TextInput, "Sucrose").click();
    h.run();
    h.key_press_modifiers(Modifiers::COMMAND, Key::Z);
    h.run();
    assert_eq!(line_amount(&h, "sucrose"), Some(150.0));
}

#[test]
fn line_tools_remove_duplicate_reorder_and_scale() {
    let mut h = harness("lines");
    let n = h.state().doc.formula().lines.len();
    h.get_by_label("Line tools for Sucrose").click();
    h.run();
    h.get_by_label("Duplicate this line").click();
    h.run();
    assert_eq!(h.state().doc.formula().lines.len(), n + 1);
    let first = h.state().doc.formula().lines[0].ingredient.clone();
    let second = h.state().doc.formula().lines[1].ingredient.clone();
    let first_name = h.state().doc.lib.ingredients
        [h.state().doc.lib.ingredient(&first).unwrap_or(0)]
    .name()
    .to_string();
    h.get_by_label(&format!("Line tools for {first_name}"))
        .click();
    h.run();
    h.get_by_label("Move down").click();
    h.run();
    assert_eq!(h.state().doc.formula().lines[0].ingredient, second);
    assert_eq!(h.state().doc.formula().lines[1].ingredient, first);
    h.get_all_by_label(&format!("Line tools for {first_name}"))
        .next()
        .unwrap_or_else(|| panic!("no line menu"))
        .click();
    h.run();
    h.get_by_label("Remove this line").click();
    h.run();
    assert_eq!(h.state().doc.formula().lines.len(), n);
    retype(&mut h, "Scale batch to", "2 kg");
    h.get_by_label("Scale").click();
    h.run();
    let total: f64 = h
        .state()
        .eval
        .as_ref()
        .and_then(|e| e.resolved.as_ref().ok())
        .map_or(0.0, |r| r.line_kg.iter().sum());
    assert!((total - 2.0).abs() < 1e-9, "{total}");
}

#[test]
fn every_built_in_sample_opens() {
    let lib = colligo_core::Library::builtin().unwrap_or_else(|e| panic!("{e}"));
    for i in 0..colligo::app::files::SAMPLES.len() {
        let p = colligo::app::files::sample(&lib, i).unwrap_or_else(|e| panic!("sample {i}: {e}"));
        assert!(p.variants.len() >= 2, "{}", p.name);
    }
}

#[test]
fn guidance_lines_follow_the_food_or_cosmetic_switch() {
    let mut h = harness("guidance");
    let header = h.get_by_label_contains("guidance lines");
    header.scroll_to_me();
    h.run();
    h.get_by_label_contains("guidance lines").click();
    h.run();
    assert!(
        h.query_by_label("US low-acid / acidified food boundary")
            .is_some()
    );
    assert!(
        h.query_by_label("ISO 29621 low-risk (a_w < 0.75)")
            .is_none()
    );
    click_in_view(&mut h, "Cosmetic");
    assert!(
        h.query_by_label("US low-acid / acidified food boundary")
            .is_none()
    );
    assert!(
        h.query_by_label("ISO 29621 low-risk (a_w < 0.75)")
            .is_some()
    );
    assert!(
        h.query_by_label("Most molds and S. aureus inhibited")
            .is_some(),
        "shared lines stay"
    );
    assert!(
        h.query_all_by_label_contains("process authority").count() > 0,
        "the cautions are shown"
    );
}

#[test]
fn goal_seek_finds_aw_085_and_applies_it() {
    let mut h = harness("goal");
    open_tools(&mut h, "Solve for a target…");
    h.get_by_role_and_label(Role::ComboBox, "Vary").click();
    h.run();
    h.get_by_role_and_label(Role::Button, "Glycerin 99.5 %")
        .click();
    h.run();
    retype(&mut h, "reaches", "0.85");
    let before = h.state().doc.project.clone();
    h.get_by_label("Find amount").click();
    h.run();
    assert_eq!(
        h.state().doc.project,
        before,
        "the answer is shown before it is applied"
    );
    assert!(h.query_by_label_contains("gives a_w 0.85").is_some());
    apply_and_expect(&mut h, 0.85);
}

/// Clicks "Apply to the formula" and checks the formula then has `target`.
fn apply_and_expect(h: &mut Harness<'_, WorkbenchApp>, target: f64) {
    h.get_by_label("Apply to the formula").click();
    h.run();
    assert!(
        (aw(h) - target).abs() < 1e-3,
        "a_w after applying: {}",
        aw(h)
    );
}

#[test]
fn an_unreachable_target_says_why() {
    let mut h = harness("unreachable");
    open_tools(&mut h, "Solve for a target…");
    h.get_by_role_and_label(Role::ComboBox, "Vary").click();
    h.run();
    h.get_by_role_and_label(Role::Button, "Strawberry purée (raw fruit)")
        .click();
    h.run();
    retype(&mut h, "reaches", "0.3");
    h.get_by_label("Find amount").click();
    h.run();
    assert!(h.query_by_label_contains("cannot be reached").is_some());
    assert!(
        h.query_by_label("Apply to the formula").is_none(),
        "no number to apply"
    );
}

#[test]
fn variants_duplicate_rename_delete() {
    let mut h = harness("variants");
    let n = h.state().doc.project.variants.len();
    h.get_by_label("Variant").click();
    h.run();
    h.get_by_label("Duplicate variant").click();
    h.run();
    assert_eq!(h.state().doc.project.variants.len(), n + 1);
    let active = h.state().doc.project.active_variant;
    h.get_by_label("Variant").click();
    h.run();
    h.get_by_label("Rename variant…").click();
    h.run();
    retype(&mut h, "New name", "Trial B");
    assert_eq!(h.state().doc.project.variants[active].name, "Trial B");
    h.get_by_label("Variant").click();
    h.run();
    h.get_by_label("Delete variant").click();
    h.run();
    assert_eq!(h.state().doc.project.variants.len(), n);
    assert!(
        h.state()
            .doc
            .project
            .variants
            .iter()
            .all(|v| v.name != "Trial B")
    );
}

#[test]
fn the_comparison_table_lists_every_variant() {
    let mut h = harness("compare");
    let ctx = h.ctx.clone();
    h.state_mut().apply(&ctx, Edit::NewVariant);
    h.run();
    h.get_by_label("Compare variants").click();
    h.run();
    let names: Vec<String> = h
        .state()
        .doc
        .project
        .variants
        .iter()
        .map(|v| v.name.clone())
        .collect();
    assert_eq!(h.state().charts_panel.comparison.rows.len(), names.len());
    for n in &names {
        // The strip shows each name once; the table shows it again.
        assert!(
            h.query_all_by_label(n).count() >= 2,
            "{n} missing from the table"
        );
    }
}

#[test]
fn a_custom_solute_with_norrish_k_changes_aw_as_the_core_predicts() {
    let mut h = harness("solute");
    open_tools(&mut h, "My ingredients and solutes…");
    retype(&mut h, "Solute name", "Test polyol");
    retype(&mut h, "Molar mass, g/mol", "150");
    retype(&mut h, "Norrish K (empty: ideal)", "2.5");
    h.get_by_label("Save solute").click();
    h.run();
    assert_eq!(h.state().doc.project.user_solutes.len(), 1);
    let ctx = h.ctx.clone();
    h.state_mut().apply(
        &ctx,
        Edit::AddLine {
            ingredient: "test_polyol".into(),
            amount: 80.0,
            unit: colligo_core::quantity::AmountUnit::G,
        },
    );
    h.run();
    // The core on its own, with the same record.
    let app = h.state();
    let lib = app
        .doc
        .project
        .library(app.doc.base())
        .unwrap_or_else(|e| panic!("{e}"));
    let comp = app
        .doc
        .formula()
        .composition(&lib)
        .unwrap_or_else(|e| panic!("{e}"));
    let expected = colligo_core::properties::water_activity(
        &lib,
        &comp,
        app.doc.project.model,
        app.doc.project.conditions.to_conditions().temperature_k,
    )
    .unwrap_or_else(|e| panic!("{e}"));
    assert!(
        (aw(&h) - expected).abs() < 1e-12,
        "{} vs {expected}",
        aw(&h)
    );
    // And the K matters: the same amount of an ideal solute gives a higher a_w.
    let mut ideal = app.doc.project.user_solutes[0].clone();
    ideal.norrish = None;
    let mut p2 = app.doc.project.clone();
    p2.user_solutes = vec![ideal];
    let lib2 = p2.library(app.doc.base()).unwrap_or_else(|e| panic!("{e}"));
    let comp2 = p2
        .active()
        .composition(&lib2)
        .unwrap_or_else(|e| panic!("{e}"));
    let aw_ideal =
        colligo_core::properties::water_activity(&lib2, &comp2, p2.model, 298.15).unwrap_or(0.0);
    assert!(aw_ideal > expected + 1e-4, "{aw_ideal} vs {expected}");
}

fn add_custom_ingredient(h: &mut Harness<'_, WorkbenchApp>) {
    open_tools(h, "My ingredients and solutes…");
    retype(h, "Ingredient name", "House syrup");
    retype(h, "Water, g per 100 g", "30");
    h.get_by_label("Add a solute to it").click();
    h.run();
    retype(h, "Solute 1 id", "sucrose");
    retype(h, "g per 100 g of solute 1", "70");
    h.get_by_label("Save ingredient").click();
    h.run();
}

#[test]
fn a_custom_ingredient_survives_save_and_reopen() {
    let dir = data_dir("custom");
    let mut h = harness_in(dir.clone());
    add_custom_ingredient(&mut h);
    assert_eq!(
        h.state().doc.project.user_ingredients.len(),
        1,
        "{:?}",
        h.state().library_window.error
    );
    let ctx = h.ctx.clone();
    h.state_mut().apply(
        &ctx,
        Edit::AddLine {
            ingredient: "house_syrup".into(),
            amount: 50.0,
            unit: colligo_core::quantity::AmountUnit::G,
        },
    );
    let path = dir.join("with_syrup.ron");
    h.state_mut().apply(&ctx, Action::SaveTo(path.clone()));
    h.run();
    let saved = h.state().doc.project.clone();
    let mut h2 = harness_in(data_dir("custom-reopen"));
    let ctx2 = h2.ctx.clone();
    h2.state_mut().apply(&ctx2, Action::OpenPath(path));
    h2.run();
    assert_eq!(h2.state().doc.project, saved);
    assert!(h2.state().doc.lib.ingredient("house_syrup").is_some());
    assert!(h2.state().eval.as_ref().is_some_and(|e| e.props.is_ok()));
}

#[test]
fn the_user_library_exports_and_imports() {
    let dir = data_dir("userlib");
    let mut h = harness_in(dir.clone());
    add_custom_ingredient(&mut h);
    h.get_by_label("Export…").click();
    h.run();
    let file = dir.join("mine.ron");
    retype(&mut h, "File", &file.display().to_string());
    assert!(
        file.exists(),
        "export wrote the file: {:?}",
        h.state().status
    );
    // A fresh project has none of them, until imported.
    let ctx = h.ctx.clone();
    h.state_mut().apply(&ctx, Action::OpenSample(2));
    h.run();
    if h.query_by_label("Discard changes").is_some() {
        h.get_by_label("Discard changes").click();
        h.run();
    }
    assert!(h.state().doc.project.user_ingredients.is_empty());
    h.get_by_label("Import…").click();
    h.run();
    retype(&mut h, "File", &file.display().to_string());
    assert_eq!(
        h.state().doc.project.user_ingredients.len(),
        1,
        "{:?}",
        h.state().status
    );
    assert!(h.state().doc.lib.ingredient("house_syrup").is_some());
}

#[test]
fn chart_data_exports_to_csv() {
    let dir = data_dir("csv");
    let mut h = harness_in(dir.clone());
    // Wait for the worker's sweep.
    wait_for(&mut h, |h| h.state().charts.current().is_some());
    assert!(h.state().charts.current().is_some(), "no chart data");
    h.get_by_label("Export CSV…").click();
    h.run();
    let file = dir.join("sweep.csv");
    retype(&mut h, "File", &file.display().to_string());
    let text =
        std::fs::read_to_string(&file).unwrap_or_else(|e| panic!("{e}: {:?}", h.state().status));
    let mut lines = text.lines();
    assert!(
        lines
            .next()
            .is_some_and(|l| l.ends_with("_g,water_activity,freezing_point_c,vapor_pressure_pa"))
    );
    assert!(lines.count() > 100);
    // The comparison tab exports its table.
    h.get_by_label("Compare variants").click();
    h.run();
    h.get_by_label("Export CSV…").click();
    h.run();
    let file = dir.join("variants.csv");
    retype(&mut h, "File", &file.display().to_string());
    let text = std::fs::read_to_string(&file).unwrap_or_else(|e| panic!("{e}"));
    assert_eq!(
        text.lines().count(),
        1 + h.state().doc.project.variants.len()
    );
}

#[test]
fn chosen_units_carry_over_to_new_projects() {
    let mut h = harness("unit-prefs");
    h.get_by_label("Temperature unit").click();
    h.run();
    h.get_by_label("K").click();
    h.run();
    let ctx = h.ctx.clone();
    h.state_mut().apply(&ctx, Action::NewProject);
    h.run();
    if h.query_by_label("Discard changes").is_some() {
        h.get_by_label("Discard changes").click();
        h.run();
    }
    assert_eq!(h.state().doc.project.name, "Untitled");
    assert_eq!(
        h.state().doc.project.units.temperature,
        TemperatureUnit::Kelvin
    );
    assert_eq!(h.state().prefs.units.temperature, TemperatureUnit::Kelvin);
}

/// The recovery file of a data directory.
fn recovery_file(dir: &std::path::Path) -> PathBuf {
    dir.join("recovery.ron")
}

/// Leaves a recovery file in `dir` as a crashed session would: sucrose
/// retyped to `grams`, written, no clean exit. Returns the edited project.
fn crash_with_unsaved_sucrose(dir: &std::path::Path, grams: &str) -> colligo_core::Project {
    let mut h = harness_in(dir.to_path_buf());
    retype(&mut h, "Sucrose", grams);
    h.state_mut().autosave_now();
    assert!(recovery_file(dir).exists(), "{:?}", h.state().status);
    h.state().doc.project.clone()
}

fn request_close(h: &mut Harness<'_, WorkbenchApp>) {
    h.input_mut()
        .viewports
        .entry(egui::ViewportId::ROOT)
        .or_default()
        .events
        .push(egui::ViewportEvent::Close);
    h.run();
}

#[test]
fn closing_while_recovery_is_offered_keeps_the_recovery_file() {
    let dir = data_dir("close-recover");
    let edited = crash_with_unsaved_sucrose(&dir, "446");
    {
        let mut h = harness_in(dir.clone());
        assert!(matches!(h.state().modal, Some(Modal::Recover { .. })));
        // The user closes the window without answering the prompt, and
        // eframe ends the app as it does after a close that is not held.
        request_close(&mut h);
        eframe::App::on_exit(h.state_mut(), None);
        assert!(
            recovery_file(&dir).exists(),
            "the recovery file was removed before the user chose"
        );
    }
    // The next start offers it again, and it still holds the edit.
    let mut h = harness_in(dir.clone());
    assert!(matches!(h.state().modal, Some(Modal::Recover { .. })));
    // Shortcuts do not act behind the prompt (Ctrl+O would put the file
    // dialog in its place).
    h.key_press_modifiers(Modifiers::COMMAND, Key::N);
    h.run();
    h.key_press_modifiers(Modifiers::COMMAND, Key::O);
    h.run();
    assert!(matches!(h.state().modal, Some(Modal::Recover { .. })));
    assert!(recovery_file(&dir).exists());
    h.get_by_label("Recover").click();
    h.run();
    assert_eq!(h.state().doc.project.variants, edited.variants);
    // Answered: discarding removes it, as chosen.
    let mut h = harness_in(dir.clone());
    h.get_by_label("Discard").click();
    h.run();
    assert!(!recovery_file(&dir).exists(), "discard removes the file");
}

/// The samples folder of the repository.
fn sample_file(name: &str) -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR"))
        .join("../../samples")
        .join(name)
}

fn variant_names(p: &colligo_core::Project) -> Vec<String> {
    p.variants.iter().map(|v| v.name.clone()).collect()
}

fn active_ingredients(p: &colligo_core::Project) -> Vec<String> {
    let mut ids: Vec<String> = p
        .active()
        .lines
        .iter()
        .map(|l| l.ingredient.clone())
        .collect();
    ids.sort();
    ids.dedup();
    ids
}

/// What the comparison and the ranking show, checked against the open
/// document (both tabs are visited so each is drawn for it).
fn assert_comparison_and_ranking_follow(h: &mut Harness<'_, WorkbenchApp>, what: &str) {
    h.get_by_label("Compare variants").click();
    h.run();
    let shown: Vec<String> = h
        .state()
        .charts_panel
        .comparison
        .rows
        .iter()
        .map(|r| r.name.clone())
        .collect();
    assert_eq!(
        shown,
        variant_names(&h.state().doc.project),
        "comparison after {what}"
    );
    h.get_by_label("What matters most").click();
    h.run();
    let mut ranked: Vec<String> = h
        .state()
        .charts_panel
        .ranking
        .rows
        .as_ref()
        .unwrap_or_else(|e| panic!("ranking after {what}: {e}"))
        .iter()
        .map(|r| r.ingredient.clone())
        .collect();
    ranked.sort();
    assert_eq!(
        ranked,
        active_ingredients(&h.state().doc.project),
        "ranking after {what}"
    );
}

#[test]
fn comparison_and_ranking_follow_every_document_replacement() {
    let dir = data_dir("replace-caches");
    let mut h = harness_in(dir.clone());
    let ctx = h.ctx.clone();
    // Sample A (the spread): both views computed for it.
    assert_comparison_and_ranking_follow(&mut h, "start");
    let a = h.state().doc.project.clone();
    // Open sample B (the brine) from the samples folder while the ranking
    // is shown: the ranking is drawn first, then the comparison.
    h.state_mut()
        .apply(&ctx, Action::OpenPath(sample_file("pickle_brine.ron")));
    h.run();
    let b = h.state().doc.project.clone();
    assert_ne!(variant_names(&a), variant_names(&b));
    let ranked: Vec<String> = h
        .state()
        .charts_panel
        .ranking
        .rows
        .as_ref()
        .map(|r| r.iter().map(|s| s.ingredient.clone()).collect())
        .unwrap_or_default();
    assert!(
        ranked
            .iter()
            .all(|id| b.active().lines.iter().any(|l| &l.ingredient == id)),
        "the ranking lists the previous project's ingredients: {ranked:?}"
    );
    assert!(
        h.query_by_label("Strawberry purée (raw fruit)").is_none(),
        "an ingredient of the previous project is on screen"
    );
    assert_comparison_and_ranking_follow(&mut h, "opening a file");
    assert!(
        h.query_by_label("Reduced sugar").is_none(),
        "a variant of the previous project is on screen"
    );
    // Undo does not step back into the previous document.
    h.key_press_modifiers(Modifiers::COMMAND, Key::Z);
    h.run();
    assert_eq!(h.state().doc.project, b);
    // The built-in samples, a new project, a recovered one.
    h.state_mut().apply(&ctx, Action::OpenSample(2));
    h.run();
    assert_comparison_and_ranking_follow(&mut h, "opening a sample");
    h.state_mut().apply(&ctx, Action::NewProject);
    h.run();
    assert_comparison_and_ranking_follow(&mut h, "a new project");
    drop(h);
    // A crash with unsaved changes to the brine; the next start shows the
    // spread behind the recovery prompt, both views drawn for it.
    {
        let mut h = harness_in(dir.clone());
        let ctx = h.ctx.clone();
        h.state_mut().apply(&ctx, Action::OpenSample(1));
        h.state_mut().apply(
            &ctx,
            Edit::SetAmount {
                line: 0,
                amount: 710.0,
                unit: colligo_core::quantity::AmountUnit::G,
            },
        );
        h.run();
        h.state_mut().autosave_now();
    }
    let mut h = harness_in(dir);
    assert!(matches!(h.state().modal, Some(Modal::Recover { .. })));
    for tab in [ChartTab::Variants, ChartTab::Ranking] {
        h.state_mut().charts_panel.tab = tab;
        h.run();
    }
    assert_eq!(
        h.state().charts_panel.comparison.rows.len(),
        a.variants.len(),
        "the comparison was drawn for the spread behind the prompt"
    );
    h.get_by_label("Recover").click();
    h.run();
    assert_eq!(variant_names(&h.state().doc.project), variant_names(&b));
    assert_comparison_and_ranking_follow(&mut h, "recovering");
}

#[test]
fn the_chart_never_shows_the_previous_projects_data() {
    let mut h = harness("chart-replace");
    wait_for(&mut h, |h| h.state().charts.current().is_some());
    h.run();
    // The spread's sweep varies its strawberry purée; the legend says so.
    assert!(
        h.query_by_label_contains("vs Strawberry purée").is_some(),
        "no sweep legend on screen"
    );
    let ctx = h.ctx.clone();
    h.state_mut().apply(&ctx, Action::OpenSample(1));
    // The first frame of the brine, before its own sweep can be back.
    h.step();
    assert!(
        h.query_by_label_contains("vs Strawberry purée").is_none(),
        "the brine is shown with the spread's sweep"
    );
}

/// A new project of 620 g water and 100 g glycerin.
fn water_and_glycerin(h: &mut Harness<'_, WorkbenchApp>) {
    let ctx = h.ctx.clone();
    h.state_mut().apply(&ctx, Action::NewProject);
    h.run();
    if h.query_by_label("Discard changes").is_some() {
        h.get_by_label("Discard changes").click();
        h.run();
    }
    h.state_mut().apply(
        &ctx,
        Edit::SetAmount {
            line: 0,
            amount: 620.0,
            unit: colligo_core::quantity::AmountUnit::G,
        },
    );
    h.state_mut().apply(
        &ctx,
        Edit::AddLine {
            ingredient: "glycerin_995".into(),
            amount: 100.0,
            unit: colligo_core::quantity::AmountUnit::G,
        },
    );
    h.run();
}

fn solve_glycerin_for(h: &mut Harness<'_, WorkbenchApp>, target: &str) {
    open_tools(h, "Solve for a target…");
    h.get_by_role_and_label(Role::ComboBox, "Vary").click();
    h.run();
    h.get_by_role_and_label(Role::Button, "Glycerin 99.5 %")
        .click();
    h.run();
    retype(h, "reaches", target);
    h.get_by_label("Find amount").click();
    h.run();
}

#[test]
fn a_solved_amount_goes_stale_when_the_formula_changes() {
    let mut h = harness("goal-stale");
    water_and_glycerin(&mut h);
    solve_glycerin_for(&mut h, "0.85");
    assert!(h.query_by_label_contains("gives a_w 0.85").is_some());
    assert!(h.query_by_label("Apply to the formula").is_some());
    // Less water: the amount found no longer gives 0.85.
    // The dialog covers the formula table: reach the field by focus, as
    // the keyboard would.
    h.get_by_role_and_label(Role::TextInput, "Water").focus();
    h.run();
    h.key_press_modifiers(Modifiers::COMMAND, Key::A);
    h.get_by_role_and_label(Role::TextInput, "Water")
        .type_text("300");
    h.run();
    assert_eq!(line_amount(&h, "water"), Some(300.0));
    assert!(
        h.query_by_label_contains("gives a_w 0.85").is_none(),
        "the dialog still claims the old answer"
    );
    assert!(
        h.query_by_label("Apply to the formula").is_none(),
        "an answer for another formula can be applied"
    );
    assert!(h.query_by_label_contains("find it again").is_some());
    // Solved again for this formula, it applies and gives the target.
    h.get_by_label("Find amount").click();
    h.run();
    apply_and_expect(&mut h, 0.85);
}

#[test]
fn the_solve_dialog_starts_afresh_with_another_document() {
    let mut h = harness("goal-reset");
    let ctx = h.ctx.clone();
    solve_glycerin_for(&mut h, "0.8");
    assert!(h.query_by_label("Apply to the formula").is_some());
    // Another document while the dialog shows the answer for this one.
    h.state_mut().apply(&ctx, Action::OpenSample(2));
    h.run();
    assert!(
        h.query_by_label("Apply to the formula").is_none(),
        "the previous project's answer can be applied to this one"
    );
    open_tools(&mut h, "Solve for a target…");
    let field = h.get_by_role_and_label(Role::TextInput, "reaches");
    assert_eq!(
        field.value().as_deref(),
        Some("0.85"),
        "the previous project's target carried over"
    );
    assert!(h.query_by_label_contains("gives a_w").is_none());
}

/// A harness whose frames are 1/60 s apart, so that a few clicks and
/// keys stay well inside the 2 s autosave delay.
fn quick_harness_in(dir: PathBuf) -> Harness<'static, WorkbenchApp> {
    harness_stepping(dir, Some(1.0 / 60.0))
}

#[test]
fn losing_focus_writes_the_recovery_file_at_once() {
    let dir = data_dir("focus-loss");
    let edited = {
        let mut h = quick_harness_in(dir.clone());
        retype(&mut h, "Sucrose", "448");
        assert!(h.state().doc.is_dirty());
        assert!(
            !recovery_file(&dir).exists(),
            "written before the delay: this test needs a shorter step"
        );
        h.event(egui::Event::WindowFocused(false));
        h.run();
        assert!(recovery_file(&dir).exists(), "{:?}", h.state().status);
        h.state().doc.project.clone()
        // Dropped without a clean exit: a crash right after the focus loss.
    };
    let mut h = harness_in(dir);
    h.get_by_label("Recover").click();
    h.run();
    assert_eq!(h.state().doc.project.variants, edited.variants);
}

#[test]
fn unsaved_work_is_written_before_a_solve() {
    let dir = data_dir("before-solve");
    let mut h = quick_harness_in(dir.clone());
    retype(&mut h, "Sucrose", "449");
    open_tools(&mut h, "Solve for a target…");
    h.get_by_role_and_label(Role::ComboBox, "Vary").click();
    h.run();
    h.get_by_role_and_label(Role::Button, "Glycerin 99.5 %")
        .click();
    h.run();
    retype(&mut h, "reaches", "0.85");
    assert!(
        !recovery_file(&dir).exists(),
        "written before the delay: this test needs a shorter step"
    );
    h.get_by_label("Find amount").click();
    h.run();
    assert!(h.query_by_label_contains("gives a_w 0.85").is_some());
    let text = std::fs::read_to_string(recovery_file(&dir))
        .unwrap_or_else(|e| panic!("no recovery file before the solve: {e}"));
    assert!(text.contains("449"), "{text}");
}

#[test]
fn steady_editing_is_written_within_2_s() {
    let dir = data_dir("steady");
    let mut h = quick_harness_in(dir.clone());
    let ctx = h.ctx.clone();
    let start = ctx.input(|i| i.time);
    // A change every 1/60 s for 3 s: never a pause of 2 s.
    let mut amount = 560.0;
    while ctx.input(|i| i.time) - start < 3.0 {
        amount += 1.0;
        h.state_mut().apply(
            &ctx,
            Edit::SetAmount {
                line: 1,
                amount,
                unit: colligo_core::quantity::AmountUnit::G,
            },
        );
        h.step();
        if recovery_file(&dir).exists() {
            break;
        }
    }
    let elapsed = ctx.input(|i| i.time) - start;
    assert!(
        recovery_file(&dir).exists(),
        "nothing written after {elapsed:.2} s of steady editing"
    );
    assert!(elapsed <= 2.1, "first written after {elapsed:.2} s");
}

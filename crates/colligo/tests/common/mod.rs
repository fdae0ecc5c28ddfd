//! Shared kittest helpers for the workbench tests: a harness on a fresh
//! data directory, waiting on the chart worker, typing into fields.
#![allow(dead_code)] // each test binary uses its own subset

use std::path::PathBuf;

use colligo::app::{Startup, WorkbenchApp};
use egui::accesskit::Role;
use egui::{Key, Modifiers};
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;

/// A fresh data directory per test (recovery files live there).
pub fn data_dir(name: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("colligo-ui-{}-{name}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).unwrap_or_else(|e| panic!("{e}"));
    d
}

pub fn harness(name: &str) -> Harness<'static, WorkbenchApp> {
    harness_in(data_dir(name))
}

pub fn harness_in(dir: PathBuf) -> Harness<'static, WorkbenchApp> {
    harness_stepping(dir, None)
}

/// The app on `dir`, with frames `step_dt` s apart (kittest's default
/// when `None`).
pub fn harness_stepping(dir: PathBuf, step_dt: Option<f32>) -> Harness<'static, WorkbenchApp> {
    let app = WorkbenchApp::new(Startup {
        open: None,
        data_dir: Some(dir),
        prefs: Default::default(),
    });
    let mut builder = Harness::builder()
        .with_size(egui::vec2(1400.0, 900.0))
        // The chart worker repaints when its result lands, which can take
        // a few extra frames to settle.
        .with_max_steps(64);
    if let Some(dt) = step_dt {
        builder = builder.with_step_dt(dt);
    }
    let mut h = builder.build_ui_state(|ui, app: &mut WorkbenchApp| app.ui_root(ui), app);
    h.run();
    h
}

/// Steps the app until `done` holds: the chart worker runs on its own
/// thread, so this waits on the wall clock (up to 60 s on a loaded machine).
pub fn wait_for(
    h: &mut Harness<'_, WorkbenchApp>,
    done: impl Fn(&Harness<'_, WorkbenchApp>) -> bool,
) {
    let deadline = std::time::Instant::now() + std::time::Duration::from_secs(60);
    while !done(h) && std::time::Instant::now() < deadline {
        h.step();
        std::thread::sleep(std::time::Duration::from_millis(5));
    }
}

pub fn aw(h: &Harness<'_, WorkbenchApp>) -> f64 {
    h.state()
        .eval
        .as_ref()
        .and_then(|e| e.props.as_ref().ok())
        .map_or(f64::NAN, |p| p.water_activity)
}

/// Replaces the text of the field labelled `label` as a user would:
/// click in it, select all, type, press Enter.
pub fn retype(h: &mut Harness<'_, WorkbenchApp>, label: &str, text: &str) {
    h.get_by_role_and_label(Role::TextInput, label).click();
    h.run();
    h.key_press_modifiers(Modifiers::COMMAND, Key::A);
    h.run();
    h.get_by_role_and_label(Role::TextInput, label)
        .type_text(text);
    h.run();
    h.key_press(Key::Enter);
    h.run();
}

pub fn line_amount(h: &Harness<'_, WorkbenchApp>, id: &str) -> Option<f64> {
    h.state()
        .doc
        .formula()
        .lines
        .iter()
        .find(|l| l.ingredient == id)
        .map(|l| l.amount)
}

/// Scrolls a widget into view, then clicks it, as a person would.
pub fn click_in_view(h: &mut Harness<'_, WorkbenchApp>, label: &str) {
    h.get_by_label(label).scroll_to_me();
    h.run();
    h.get_by_label(label).click();
    h.run();
}

pub fn open_tools(h: &mut Harness<'_, WorkbenchApp>, item: &str) {
    h.get_by_label("Tools").click();
    h.run();
    h.get_by_label(item).click();
    h.run();
}

//! The Colligo workbench: the window, its panels, and the one place where
//! commands change the document.

pub mod commands;
pub mod compute;
pub mod document;
pub mod files;
pub mod panels;
pub mod prefs;
pub mod theme;

use std::path::{Path, PathBuf};
use std::sync::Arc;
use std::time::{Duration, Instant};

use colligo_core::Library;
use colligo_core::project::Project;
use egui::{RichText, ViewportCommand};

use commands::{Command, apply_edit, shortcut_of};
use compute::{ChartWorker, Evaluation};
use document::Document;
use files::{PathDialog, PathPurpose, Recovery};
use panels::charts::ChartsPanel;
use panels::conditions::ConditionsPanel;
use panels::formula::FormulaPanel;
use panels::goal::GoalDialog;
use panels::library::LibraryWindow;
use panels::results::ResultsPanel;
use panels::stability::StabilityPanel;
use prefs::Prefs;

/// How the app starts.
#[derive(Debug, Clone, Default)]
pub struct Startup {
    /// A project file given on the command line.
    pub open: Option<PathBuf>,
    /// Where recovery data lives (None: no autosave).
    pub data_dir: Option<PathBuf>,
    /// Preferences read from storage.
    pub prefs: Prefs,
}

/// A dialog that takes over the window until answered.
#[derive(Debug)]
pub enum Modal {
    /// Unsaved changes would be lost by `then`.
    Unsaved {
        /// What to do after the user chose.
        then: Box<Command>,
    },
    /// Pick a path.
    Path(PathDialog),
    /// Rename a variant.
    Rename {
        /// Variant index.
        index: usize,
        /// The name being typed.
        text: String,
    },
    /// A recovery file from a session that ended without saving.
    Recover {
        /// The recovered project.
        project: Box<Project>,
        /// Its file, if it had one.
        path: Option<PathBuf>,
        /// When it was written.
        written: String,
    },
}

/// A message in the status bar.
#[derive(Debug, Clone)]
pub struct Status {
    /// Text.
    pub text: String,
    /// Whether it reports an error.
    pub error: bool,
    /// When it was set.
    pub at: Instant,
}

/// Frames left out of the frame-time statistics (fonts, first evaluation).
const STARTUP_FRAMES: u64 = 5;

/// Frame-time statistics (printed with `COLLIGO_FRAME_STATS=1`).
#[derive(Debug, Default, Clone)]
pub struct FrameStats {
    /// Frames measured.
    pub frames: u64,
    /// Longest frame, s.
    pub max_s: f32,
    /// Sum of frame times, s.
    pub sum_s: f64,
    /// Frames above 16 ms.
    pub over_16ms: u64,
    /// Longest whole frame as eframe measured it (UI, tessellation, paint), s.
    pub max_cpu_s: f32,
}

impl FrameStats {
    fn report(&self) -> String {
        format!(
            "frames {}, UI mean {:.2} ms, UI max {:.2} ms, UI over 16 ms: {}, whole-frame max {:.2} ms",
            self.frames,
            if self.frames > STARTUP_FRAMES {
                self.sum_s * 1000.0 / (self.frames - STARTUP_FRAMES) as f64
            } else {
                0.0
            },
            self.max_s * 1000.0,
            self.over_16ms,
            self.max_cpu_s * 1000.0
        )
    }
}

/// The application.
pub struct WorkbenchApp {
    /// The open document.
    pub doc: Document,
    /// Preferences.
    pub prefs: Prefs,
    /// The latest evaluation of the active variant.
    pub eval: Option<Evaluation>,
    /// Chart computations.
    pub charts: ChartWorker,
    /// Panels.
    pub formula_panel: FormulaPanel,
    /// Conditions.
    pub conditions_panel: ConditionsPanel,
    /// Results.
    pub results_panel: ResultsPanel,
    /// Charts.
    pub charts_panel: ChartsPanel,
    /// Stability guidance.
    pub stability_panel: StabilityPanel,
    /// Goal seek.
    pub goal: GoalDialog,
    /// The user's own records.
    pub library_window: LibraryWindow,
    /// Commands emitted this frame.
    pub pending: Vec<Command>,
    /// The open dialog.
    pub modal: Option<Modal>,
    /// Status bar message.
    pub status: Option<Status>,
    /// Frame statistics.
    pub stats: FrameStats,
    recovery: Recovery,
    base: Arc<Library>,
    allow_close: bool,
    discarding: bool,
    after_save: Option<Command>,
    themed: bool,
    last_title: String,
    autosaved_revision: Option<u64>,
    last_change: f64,
    data_dir: Option<PathBuf>,
}

impl WorkbenchApp {
    /// Builds the app: opens the given file, else the last project, else a
    /// sample; offers a recovery when the last session left one.
    pub fn new(startup: Startup) -> Self {
        let base = Arc::new(Library::builtin().unwrap_or_else(|e| {
            // The embedded library is checked by the test suite; this can
            // only fail in a broken build.
            panic!("built-in library: {e}")
        }));
        let recovery = Recovery::new(startup.data_dir.clone());
        let mut status = None;
        let mut prefs = startup.prefs;
        let mut opened: Option<(Project, Option<PathBuf>)> = None;
        if let Some(p) = &startup.open {
            match Project::load(p, &base) {
                Ok(proj) => {
                    prefs.remember(p.clone());
                    opened = Some((proj, Some(p.clone())));
                }
                Err(e) => {
                    status = Some(Status {
                        text: format!("Could not open: {e}"),
                        error: true,
                        at: Instant::now(),
                    })
                }
            }
        }
        if opened.is_none()
            && startup.open.is_none()
            && let Some(last) = prefs.recent.first().cloned()
            && let Ok(proj) = Project::load(&last, &base)
        {
            opened = Some((proj, Some(last)));
        }
        let (project, path) =
            opened.unwrap_or_else(|| (files::sample(&base, 0).unwrap_or_default(), None));
        let mut app = WorkbenchApp {
            doc: Document::new(base.clone(), project, path),
            charts: ChartWorker::new(),
            formula_panel: FormulaPanel::default(),
            conditions_panel: ConditionsPanel::default(),
            results_panel: ResultsPanel::default(),
            charts_panel: ChartsPanel {
                tab: prefs.chart_tab,
                ..ChartsPanel::default()
            },
            stability_panel: StabilityPanel::default(),
            goal: GoalDialog::default(),
            library_window: LibraryWindow::default(),
            prefs,
            eval: None,
            pending: Vec::new(),
            modal: None,
            status,
            stats: FrameStats::default(),
            recovery,
            base,
            allow_close: false,
            discarding: false,
            after_save: None,
            themed: false,
            last_title: String::new(),
            autosaved_revision: None,
            last_change: 0.0,
            data_dir: startup.data_dir,
        };
        if let Some((rec, project)) = app.recovery.pending(&app.base) {
            let written = utc_minute(rec.written_unix_s);
            app.modal = Some(Modal::Recover {
                project: Box::new(project),
                path: rec.path,
                written,
            });
        }
        app
    }

    /// The built-in library.
    pub fn base(&self) -> &Arc<Library> {
        &self.base
    }

    /// Where recovery data is written.
    pub fn data_dir(&self) -> Option<&Path> {
        self.data_dir.as_deref()
    }

    /// Shows a status message.
    pub fn say(&mut self, text: impl Into<String>, error: bool) {
        self.status = Some(Status {
            text: text.into(),
            error,
            at: Instant::now(),
        });
    }

    /// Re-evaluates when the inputs changed.
    pub fn refresh(&mut self) {
        let cond = self.doc.project.conditions.to_conditions();
        let key = compute::key_of(
            &self.doc.lib,
            self.doc.formula(),
            &cond,
            self.doc.project.model,
        );
        if self.eval.as_ref().map(|e| e.key) != Some(key) {
            self.eval = Some(compute::evaluate(
                &self.doc.lib,
                self.doc.formula(),
                &cond,
                self.doc.project.model,
            ));
        }
    }

    /// One frame of UI, without eframe (kittest drives this directly).
    pub fn ui_root(&mut self, ui: &mut egui::Ui) {
        let start = Instant::now();
        let ctx = ui.ctx().clone();
        if !self.themed {
            theme::apply(&ctx);
            self.themed = true;
        }
        self.charts.poll();
        self.pending.extend(commands::pressed(&ctx));
        self.handle_close_request(&ctx);
        self.refresh();

        egui::Panel::top("menu-bar").show(ui, |ui| self.menu_bar(ui));
        egui::Panel::bottom("status-bar").show(ui, |ui| self.status_bar(ui));
        let chart_h = self.prefs.chart_height;
        let resp = egui::Panel::bottom("charts")
            .resizable(true)
            .default_size(chart_h)
            .min_size(160.0)
            .show(ui, |ui| {
                let data = self.charts.current().or(self.charts.last());
                let out = self.charts_panel.ui(
                    ui,
                    &self.doc,
                    self.eval.as_ref(),
                    data,
                    self.charts.busy(),
                );
                if let Some(job) = out.job {
                    let cond = self.doc.project.conditions.to_conditions();
                    self.charts.request(
                        &ctx,
                        &self.doc.lib,
                        self.doc.formula(),
                        &cond,
                        self.doc.project.model,
                        job,
                    );
                }
                if out.export {
                    self.export_chart_dialog();
                }
            });
        self.prefs.chart_height = resp.response.rect.height();
        let resp = egui::Panel::right("results")
            .resizable(true)
            .default_size(self.prefs.results_width)
            .min_size(300.0)
            .show(ui, |ui| {
                egui::ScrollArea::vertical()
                    .id_salt("results-scroll")
                    .show(ui, |ui| {
                        self.conditions_panel.ui(ui, &self.doc, &mut self.pending);
                        ui.separator();
                        self.results_panel.ui(ui, &self.doc, self.eval.as_ref());
                        ui.separator();
                        self.stability_panel.ui(ui, &self.doc, self.eval.as_ref());
                    });
            });
        self.prefs.results_width = resp.response.rect.width();
        self.prefs.chart_tab = self.charts_panel.tab;
        egui::CentralPanel::default().show(ui, |ui| {
            self.variant_strip(ui);
            self.formula_panel
                .ui(ui, &self.doc, self.eval.as_ref(), &mut self.pending);
        });
        self.goal.ui(&ctx, &self.doc, &mut self.pending);
        let lib_out = self.library_window.ui(&ctx, &self.doc, &mut self.pending);
        if lib_out.export {
            self.library_dialog(PathPurpose::ExportLibrary);
        }
        if lib_out.import {
            self.library_dialog(PathPurpose::ImportLibrary);
        }
        self.modal_ui(&ctx);

        let time = ctx.input(|i| i.time);
        let cmds = std::mem::take(&mut self.pending);
        for c in cmds {
            self.apply(&ctx, c);
        }
        self.doc.feed_undo(time);
        self.autosave(&ctx, time);
        let title = self.doc.title();
        if title != self.last_title {
            ctx.send_viewport_cmd(ViewportCommand::Title(title.clone()));
            self.last_title = title;
        }
        let dt = start.elapsed().as_secs_f32();
        self.stats.frames += 1;
        // The first frames build fonts and caches: start-up, not editing.
        if self.stats.frames > STARTUP_FRAMES {
            self.stats.max_s = self.stats.max_s.max(dt);
            self.stats.sum_s += f64::from(dt);
            if dt > 0.016 {
                self.stats.over_16ms += 1;
            }
        }
    }

    fn handle_close_request(&mut self, ctx: &egui::Context) {
        if ctx.input(|i| i.viewport().close_requested()) && !self.allow_close {
            if self.doc.is_dirty() {
                ctx.send_viewport_cmd(ViewportCommand::CancelClose);
                if self.modal.is_none() {
                    self.modal = Some(Modal::Unsaved {
                        then: Box::new(Command::Quit),
                    });
                }
            } else {
                self.recovery.clear();
            }
        }
    }

    /// Applies one command (the only place the document changes).
    pub fn apply(&mut self, ctx: &egui::Context, cmd: Command) {
        let time = ctx.input(|i| i.time);
        match &cmd {
            Command::Undo => {
                if !self.doc.undo() {
                    self.say("Nothing to undo", false);
                }
                return;
            }
            Command::Redo => {
                if !self.doc.redo() {
                    self.say("Nothing to redo", false);
                }
                return;
            }
            Command::NewProject
            | Command::Open
            | Command::OpenPath(_)
            | Command::OpenSample(_)
            | Command::Quit
                if self.doc.is_dirty() && !self.discarding =>
            {
                self.modal = Some(Modal::Unsaved {
                    then: Box::new(cmd),
                });
                return;
            }
            _ => {}
        }
        match cmd {
            Command::NewProject => {
                let project = Project {
                    units: self.prefs.units,
                    ..Project::default()
                };
                self.doc = Document::new(self.base.clone(), project, None);
                self.say("New project", false);
            }
            Command::Open => {
                let start = self
                    .prefs
                    .recent
                    .first()
                    .and_then(|p| p.parent())
                    .map(|d| d.display().to_string() + "/")
                    .unwrap_or_default();
                self.modal = Some(Modal::Path(PathDialog::new(PathPurpose::Open, start)));
            }
            Command::OpenPath(p) => self.open_path(&p),
            Command::OpenSample(i) => match files::sample(&self.base, i) {
                Ok(p) => {
                    self.doc = Document::new(self.base.clone(), p, None);
                    self.say(
                        "Opened a sample project (save it to keep your changes)",
                        false,
                    );
                }
                Err(e) => self.say(e, true),
            },
            Command::Save => match self.doc.path.clone() {
                Some(p) => self.save_to(&p),
                None => self.save_as_dialog(),
            },
            Command::SaveAs => self.save_as_dialog(),
            Command::SaveTo(p) => self.save_to(&p),
            Command::Quit => {
                self.allow_close = true;
                self.recovery.clear();
                ctx.send_viewport_cmd(ViewportCommand::Close);
            }
            other => match apply_edit(&mut self.doc, &other) {
                Ok(true) => {
                    self.last_change = time;
                    if matches!(
                        other,
                        Command::SetTemperatureUnit(_) | Command::SetPressureUnit(_)
                    ) {
                        // Remembered for new projects too.
                        self.prefs.units = self.doc.project.units;
                    }
                }
                Ok(false) => {}
                Err(e) => self.say(e, true),
            },
        }
    }

    fn open_path(&mut self, p: &Path) {
        match Project::load(p, &self.base) {
            Ok(proj) => {
                self.doc = Document::new(self.base.clone(), proj, Some(p.to_path_buf()));
                self.prefs.remember(p.to_path_buf());
                self.recovery.clear();
                self.say(format!("Opened {}", p.display()), false);
            }
            // The open project stays as it was.
            Err(e) => self.say(format!("Could not open: {e}"), true),
        }
    }

    fn save_to(&mut self, p: &Path) {
        match self.doc.project.save(p) {
            Ok(()) => {
                self.doc.mark_saved(p.to_path_buf());
                self.prefs.remember(p.to_path_buf());
                self.recovery.clear();
                self.autosaved_revision = None;
                self.say(format!("Saved {}", p.display()), false);
            }
            Err(e) => self.say(format!("Not saved: {e}"), true),
        }
    }

    /// Where new files go by default: beside the project, else beside the
    /// most recent file, else the current directory.
    fn working_dir(&self) -> PathBuf {
        self.doc
            .path
            .as_ref()
            .or(self.prefs.recent.first())
            .and_then(|p| p.parent().map(Path::to_path_buf))
            .or_else(|| std::env::current_dir().ok())
            .unwrap_or_default()
    }

    fn save_as_dialog(&mut self) {
        let suggestion = match &self.doc.path {
            Some(p) => p.display().to_string(),
            None => self
                .working_dir()
                .join(files::file_name_for(&self.doc.project.name))
                .display()
                .to_string(),
        };
        self.modal = Some(Modal::Path(PathDialog::new(PathPurpose::Save, suggestion)));
    }

    fn library_dialog(&mut self, purpose: PathPurpose) {
        let dir = self.working_dir();
        let start = match purpose {
            PathPurpose::ExportLibrary => dir.join("my_ingredients.ron").display().to_string(),
            _ => format!("{}/", dir.display()),
        };
        self.modal = Some(Modal::Path(PathDialog::new(purpose, start)));
    }

    fn export_chart_dialog(&mut self) {
        let dir = self.working_dir();
        let name = format!(
            "{}_{:?}.csv",
            files::file_name_for(&self.doc.project.name).trim_end_matches(".ron"),
            self.charts_panel.tab
        )
        .to_lowercase();
        self.modal = Some(Modal::Path(PathDialog::new(
            PathPurpose::ExportCsv,
            dir.join(name).display().to_string(),
        )));
    }

    /// Writes the recovery file a few seconds after unsaved changes stop.
    fn autosave(&mut self, ctx: &egui::Context, time: f64) {
        if !self.doc.is_dirty() {
            return;
        }
        if self.autosaved_revision == Some(self.doc.revision) {
            return;
        }
        let wait = 2.0;
        if time - self.last_change >= wait {
            if let Err(e) = self
                .recovery
                .write(&self.doc.project, self.doc.path.as_deref())
            {
                self.say(format!("Autosave failed: {e}"), true);
            }
            self.autosaved_revision = Some(self.doc.revision);
        } else {
            // One delayed repaint to write it; no repainting while idle otherwise.
            ctx.request_repaint_after(Duration::from_secs_f64(
                wait - (time - self.last_change) + 0.05,
            ));
        }
    }

    /// Writes the recovery file now (tests use this to simulate a crash).
    pub fn autosave_now(&mut self) {
        if let Err(e) = self
            .recovery
            .write(&self.doc.project, self.doc.path.as_deref())
        {
            self.say(format!("Autosave failed: {e}"), true);
        }
    }

    fn menu_bar(&mut self, ui: &mut egui::Ui) {
        egui::MenuBar::new().ui(ui, |ui| {
            ui.menu_button("File", |ui| {
                for c in [
                    Command::NewProject,
                    Command::Open,
                    Command::Save,
                    Command::SaveAs,
                ] {
                    self.menu_item(ui, c);
                }
                ui.menu_button("Open recent", |ui| {
                    if self.prefs.recent.is_empty() {
                        ui.label("(none yet)");
                    }
                    for p in self.prefs.recent.clone() {
                        if ui.button(p.display().to_string()).clicked() {
                            self.pending.push(Command::OpenPath(p));
                        }
                    }
                });
                ui.menu_button("Open sample", |ui| {
                    for (i, (name, _)) in files::SAMPLES.iter().enumerate() {
                        if ui
                            .button(name.trim_end_matches(".ron").replace('_', " "))
                            .clicked()
                        {
                            self.pending.push(Command::OpenSample(i));
                        }
                    }
                });
                ui.separator();
                if ui.button("Quit").clicked() {
                    self.pending.push(Command::Quit);
                }
            });
            ui.menu_button("Edit", |ui| {
                let can_undo = self.doc.can_undo();
                let can_redo = self.doc.can_redo();
                ui.add_enabled_ui(can_undo, |ui| self.menu_item(ui, Command::Undo));
                ui.add_enabled_ui(can_redo, |ui| self.menu_item(ui, Command::Redo));
            });
            ui.menu_button("Variant", |ui| {
                self.variant_menu(ui, self.doc.project.active_variant)
            });
            ui.menu_button("Tools", |ui| {
                if ui
                    .button("Solve for a target…")
                    .on_hover_text("Find the amount of one ingredient that reaches a target")
                    .clicked()
                {
                    self.goal.open_for(&self.doc);
                }
                if ui.button("My ingredients and solutes…").clicked() {
                    self.library_window.open = true;
                }
            });
            ui.add_space(16.0);
            ui.label(RichText::new(&self.doc.project.name).strong());
            if self.doc.is_dirty() {
                ui.label(RichText::new("unsaved changes").color(theme::WARN))
                    .on_hover_text("changes not saved to a file yet");
            }
        });
    }

    fn menu_item(&mut self, ui: &mut egui::Ui, c: Command) {
        let Some(s) = shortcut_of(&c) else { return };
        let b = egui::Button::new(s.text).shortcut_text(ui.ctx().format_shortcut(&s.keys));
        if ui.add(b).on_hover_text(s.tooltip).clicked() {
            self.pending.push(c);
        }
    }

    fn variant_menu(&mut self, ui: &mut egui::Ui, i: usize) {
        if ui.button("New variant").clicked() {
            self.pending.push(Command::NewVariant);
        }
        if ui.button("Duplicate variant").clicked() {
            self.pending.push(Command::DuplicateVariant(i));
        }
        if ui.button("Rename variant…").clicked() {
            let text = self
                .doc
                .project
                .variants
                .get(i)
                .map(|v| v.name.clone())
                .unwrap_or_default();
            self.modal = Some(Modal::Rename { index: i, text });
        }
        let can_delete = self.doc.project.variants.len() > 1;
        if ui
            .add_enabled(can_delete, egui::Button::new("Delete variant"))
            .clicked()
        {
            self.pending.push(Command::DeleteVariant(i));
        }
        ui.separator();
        if ui.button("Compare variants").clicked() {
            self.charts_panel.tab = prefs::ChartTab::Variants;
        }
    }

    fn variant_strip(&mut self, ui: &mut egui::Ui) {
        ui.horizontal_wrapped(|ui| {
            ui.label(RichText::new("Variants").color(theme::MUTED));
            let names: Vec<String> = self
                .doc
                .project
                .variants
                .iter()
                .map(|v| v.name.clone())
                .collect();
            for (i, name) in names.iter().enumerate() {
                let active = i == self.doc.project.active_variant;
                let r = ui
                    .selectable_label(active, name)
                    .on_hover_text("right-click: rename, duplicate, delete");
                if r.clicked() && !active {
                    self.pending.push(Command::SelectVariant(i));
                }
                r.context_menu(|ui| self.variant_menu(ui, i));
            }
            if ui.small_button("+").on_hover_text("New variant").clicked() {
                self.pending.push(Command::NewVariant);
            }
        });
        ui.separator();
    }

    fn status_bar(&mut self, ui: &mut egui::Ui) {
        ui.horizontal(|ui| {
            match &self.status {
                Some(s) => {
                    let c = if s.error { theme::ERROR } else { theme::MUTED };
                    ui.label(RichText::new(&s.text).color(c));
                }
                None => {
                    ui.label(RichText::new("Ready").color(theme::MUTED));
                }
            }
            ui.with_layout(egui::Layout::right_to_left(egui::Align::Center), |ui| {
                if let Some(e) = &self.eval {
                    ui.label(
                        RichText::new(format!(
                            "computed in {:.2} ms",
                            e.elapsed.as_secs_f64() * 1000.0
                        ))
                        .small()
                        .color(theme::MUTED),
                    );
                }
            });
        });
    }

    fn modal_ui(&mut self, ctx: &egui::Context) {
        let Some(modal) = self.modal.take() else {
            return;
        };
        match modal {
            Modal::Unsaved { then } => {
                let mut choice = None;
                egui::Modal::new(egui::Id::unique("unsaved")).show(ctx, |ui| {
                    ui.heading("Unsaved changes");
                    ui.label(format!(
                        "“{}” has changes that are not saved.",
                        self.doc.project.name
                    ));
                    ui.horizontal(|ui| {
                        if ui.button("Save").clicked() {
                            choice = Some(0);
                        }
                        if ui.button("Discard changes").clicked() {
                            choice = Some(1);
                        }
                        if ui.button("Cancel").clicked() {
                            choice = Some(2);
                        }
                    });
                });
                match choice {
                    Some(0) => match self.doc.path.clone() {
                        Some(p) => {
                            self.save_to(&p);
                            if !self.doc.is_dirty() {
                                self.discard_and(ctx, *then);
                            }
                        }
                        None => {
                            // Ask where to save; the pending action runs
                            // once the save succeeds.
                            self.after_save = Some(*then);
                            self.save_as_dialog();
                        }
                    },
                    Some(1) => self.discard_and(ctx, *then),
                    Some(2) => {}
                    _ => self.modal = Some(Modal::Unsaved { then }),
                }
            }
            Modal::Path(mut d) => {
                d.poll();
                let mut done: Option<Option<PathBuf>> = None;
                egui::Modal::new(egui::Id::unique("path-dialog")).show(ctx, |ui| {
                    ui.heading(d.purpose.title());
                    ui.horizontal(|ui| {
                        let l = ui.label("File");
                        let r = ui
                            .add(egui::TextEdit::singleline(&mut d.text).desired_width(420.0))
                            .labelled_by(l.id);
                        if r.lost_focus() && ui.input(|i| i.key_pressed(egui::Key::Enter)) {
                            done = Some(d.path());
                        }
                        if ui
                            .add_enabled(!d.browsing(), egui::Button::new("Browse…"))
                            .on_hover_text("Use the desktop's file chooser")
                            .clicked()
                        {
                            d.browse(ctx);
                        }
                    });
                    if d.native_unavailable {
                        ui.label(
                            RichText::new("No file chooser answered; type the path here.")
                                .small()
                                .color(theme::MUTED),
                        );
                    }
                    if let Some(e) = &d.error {
                        ui.label(RichText::new(e).color(theme::ERROR));
                    }
                    ui.horizontal(|ui| {
                        let verb = match d.purpose {
                            PathPurpose::Open | PathPurpose::ImportLibrary => "Open",
                            _ => "Save",
                        };
                        if ui.button(verb).clicked() {
                            done = Some(d.path());
                        }
                        if ui.button("Cancel").clicked() {
                            done = Some(None);
                        }
                    });
                });
                match done {
                    None => self.modal = Some(Modal::Path(d)),
                    Some(None) if d.text.trim().is_empty() => {
                        d.error = Some("type a file path".into());
                        self.modal = Some(Modal::Path(d));
                    }
                    Some(None) => self.after_save = None,
                    Some(Some(p)) => self.finish_path(ctx, d, p),
                }
            }
            Modal::Rename { index, mut text } => {
                let mut done = None;
                egui::Modal::new(egui::Id::unique("rename")).show(ctx, |ui| {
                    ui.heading("Rename variant");
                    let l = ui.label("New name");
                    let r = ui
                        .add(egui::TextEdit::singleline(&mut text).desired_width(260.0))
                        .labelled_by(l.id);
                    if r.lost_focus() && ui.input(|i| i.key_pressed(egui::Key::Enter)) {
                        done = Some(true);
                    }
                    ui.horizontal(|ui| {
                        if ui.button("Rename").clicked() {
                            done = Some(true);
                        }
                        if ui.button("Cancel").clicked() {
                            done = Some(false);
                        }
                    });
                });
                match done {
                    Some(true) => self
                        .pending
                        .push(Command::RenameVariant { index, name: text }),
                    Some(false) => {}
                    None => self.modal = Some(Modal::Rename { index, text }),
                }
            }
            Modal::Recover {
                project,
                path,
                written,
            } => {
                let mut choice = None;
                egui::Modal::new(egui::Id::unique("recover")).show(ctx, |ui| {
                    ui.heading("Recover unsaved work?");
                    ui.label(format!(
                        "Colligo found unsaved changes to “{}” from {written}, left when it last closed without saving.",
                        project.name
                    ));
                    ui.horizontal(|ui| {
                        if ui.button("Recover").clicked() {
                            choice = Some(true);
                        }
                        if ui.button("Discard").clicked() {
                            choice = Some(false);
                        }
                    });
                });
                match choice {
                    Some(true) => {
                        self.doc = Document::recovered(self.base.clone(), *project, path);
                        self.say("Recovered unsaved work: save it to keep it", false);
                    }
                    Some(false) => {
                        self.recovery.clear();
                        self.say("Discarded the recovered work", false);
                    }
                    None => {
                        self.modal = Some(Modal::Recover {
                            project,
                            path,
                            written,
                        })
                    }
                }
            }
        }
    }

    /// Runs `then` although the document has unsaved changes (the user
    /// chose to discard them).
    fn discard_and(&mut self, ctx: &egui::Context, then: Command) {
        self.discarding = true;
        self.apply(ctx, then);
        self.discarding = false;
    }

    fn finish_path(&mut self, ctx: &egui::Context, mut d: PathDialog, p: PathBuf) {
        match d.purpose {
            PathPurpose::Open => {
                if !p.exists() {
                    d.error = Some(format!("{}: no such file", p.display()));
                    self.modal = Some(Modal::Path(d));
                    return;
                }
                self.open_path(&p);
            }
            PathPurpose::Save => {
                self.save_to(&p);
                if let Some(then) = self.after_save.take()
                    && !self.doc.is_dirty()
                {
                    self.discard_and(ctx, then);
                }
            }
            PathPurpose::ExportCsv => {
                let text = match self.charts_panel.tab {
                    prefs::ChartTab::Variants => Some(self.charts_panel.comparison.csv()),
                    prefs::ChartTab::Ranking => Some(self.charts_panel.ranking.csv()),
                    _ => self
                        .charts
                        .current()
                        .or(self.charts.last())
                        .map(compute::chart_csv),
                };
                match text {
                    Some(text) => match colligo_core::project::write_atomic(&p, text.as_bytes()) {
                        Ok(()) => self.say(format!("Exported {}", p.display()), false),
                        Err(e) => self.say(format!("Not exported: {e}"), true),
                    },
                    None => self.say("No chart data yet", true),
                }
            }
            PathPurpose::ExportLibrary => {
                let ul = colligo_core::userlib::UserLibrary::new(
                    self.doc.project.user_solutes.clone(),
                    self.doc.project.user_ingredients.clone(),
                );
                match ul.save(&p) {
                    Ok(()) => self.say(
                        format!(
                            "Exported {} records to {}",
                            ul.solutes.len() + ul.ingredients.len(),
                            p.display()
                        ),
                        false,
                    ),
                    Err(e) => self.say(format!("Not exported: {e}"), true),
                }
            }
            PathPurpose::ImportLibrary => {
                match colligo_core::userlib::UserLibrary::load(&p, &self.base) {
                    Ok(ul) => {
                        let n = ul.solutes.len() + ul.ingredients.len();
                        self.pending.push(Command::ImportUserRecords(Box::new(ul)));
                        self.say(format!("Imported {n} records from {}", p.display()), false);
                    }
                    Err(e) => self.say(format!("Not imported: {e}"), true),
                }
            }
        }
    }
}

/// "YYYY-MM-DD HH:MM UTC" from Unix seconds.
fn utc_minute(secs: u64) -> String {
    const FORMAT: &[time::format_description::BorrowedFormatItem<'_>] =
        time::macros::format_description!("[year]-[month]-[day] [hour]:[minute] UTC");
    i64::try_from(secs)
        .ok()
        .and_then(|s| time::OffsetDateTime::from_unix_timestamp(s).ok())
        .and_then(|t| t.format(FORMAT).ok())
        .unwrap_or_else(|| format!("{secs} s after 1970-01-01 00:00 UTC"))
}

impl eframe::App for WorkbenchApp {
    fn ui(&mut self, ui: &mut egui::Ui, frame: &mut eframe::Frame) {
        if let Some(cpu) = frame.info().cpu_usage
            && self.stats.frames > STARTUP_FRAMES
        {
            self.stats.max_cpu_s = self.stats.max_cpu_s.max(cpu);
        }
        self.ui_root(ui);
        // COLLIGO_FRAME_STATS=1 prints frame times now and then (for measuring).
        if std::env::var_os("COLLIGO_FRAME_STATS").is_some()
            && self.stats.frames.is_multiple_of(100)
        {
            eprintln!("{}", self.stats.report());
        }
    }

    fn save(&mut self, storage: &mut dyn eframe::Storage) {
        eframe::set_value(storage, prefs::KEY, &self.prefs);
    }

    fn on_exit(&mut self, _gl: Option<&eframe::glow::Context>) {
        if std::env::var_os("COLLIGO_FRAME_STATS").is_some() {
            eprintln!("{}", self.stats.report());
        }
        if !self.doc.is_dirty() {
            self.recovery.clear();
        }
    }
}

/// Opens the window.
///
/// # Errors
/// When no window can be created (no display).
pub fn run(open: Option<PathBuf>) -> eframe::Result {
    let options = eframe::NativeOptions {
        viewport: egui::ViewportBuilder::default()
            .with_title("Colligo")
            .with_inner_size([1360.0, 860.0])
            .with_min_inner_size([900.0, 600.0]),
        ..Default::default()
    };
    let data_dir = std::env::var_os("COLLIGO_DATA_DIR")
        .map(PathBuf::from)
        .or_else(|| eframe::storage_dir("colligo"));
    eframe::run_native(
        "colligo",
        options,
        Box::new(move |cc| {
            let prefs = cc
                .storage
                .and_then(|s| eframe::get_value(s, prefs::KEY))
                .unwrap_or_default();
            Ok(Box::new(WorkbenchApp::new(Startup {
                open,
                data_dir,
                prefs,
            })))
        }),
    )
}

#[cfg(test)]
mod tests {
    use super::utc_minute;

    #[test]
    fn recovery_times_print_in_utc() {
        // Seconds since the Epoch as POSIX (IEEE Std 1003.1, 4.16) defines
        // them; the dates checked with Python's datetime.
        assert_eq!(utc_minute(0), "1970-01-01 00:00 UTC");
        assert_eq!(utc_minute(951_782_400), "2000-02-29 00:00 UTC");
        assert_eq!(utc_minute(1_700_000_000), "2023-11-14 22:13 UTC");
        assert_eq!(utc_minute(4_102_444_799), "2099-12-31 23:59 UTC");
        assert!(utc_minute(u64::MAX).contains("after 1970"));
    }
}

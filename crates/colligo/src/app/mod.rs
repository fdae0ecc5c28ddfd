//! The Colligo workbench: the window, its panels, and the one place where
//! commands change the document.

pub mod actions;
pub mod commands;
pub mod compute;
pub mod document;
mod fileops;
pub mod files;
mod menu;
mod modals;
pub mod panels;
pub mod prefs;
mod status;
pub mod theme;

use std::path::{Path, PathBuf};
use std::sync::Arc;
use std::time::Instant;

use colligo_core::Library;
use colligo_core::project::Project;
use egui::ViewportCommand;

use commands::{Action, Command, Edit, apply_edit};
use compute::{ChartWorker, Evaluation};
use document::Document;
use files::{PathDialog, PathPurpose, Recovery};
pub use modals::Modal;
use panels::charts::ChartsPanel;
use panels::conditions::ConditionsPanel;
use panels::formula::FormulaPanel;
use panels::goal::GoalDialog;
use panels::library::LibraryWindow;
use panels::results::ResultsPanel;
use panels::stability::StabilityPanel;
use panels::{Panel, View};
use prefs::Prefs;
pub use status::{FrameStats, STARTUP_FRAMES, Status};

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
    after_save: Option<Action>,
    themed: bool,
    last_title: String,
    autosaved_revision: Option<u64>,
    /// Frame time at which autosave first saw the current unwritten
    /// changes (None: nothing unwritten).
    unwritten_since: Option<f64>,
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
            unwritten_since: None,
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

    /// Re-evaluates when the inputs changed.
    pub fn refresh(&mut self) {
        let cond = self.doc.project.conditions.to_conditions();
        let key = compute::key_of(
            self.doc.library_revision,
            self.doc.formula(),
            &cond,
            self.doc.project.model,
        );
        if self.eval.as_ref().map(|e| e.key) != Some(key) {
            self.eval = Some(compute::evaluate(
                key,
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
        // A dialog takes over the window: shortcuts do not act behind it
        // (Ctrl+O would replace it, Ctrl+N the document it asks about).
        if self.modal.is_none() {
            self.pending
                .extend(actions::pressed(&ctx).into_iter().map(Command::Action));
        }
        self.handle_close_request(&ctx);
        self.refresh();

        egui::Panel::top("menu-bar").show(ui, |ui| self.menu_bar(ui));
        egui::Panel::bottom("status-bar").show(ui, |ui| self.status_bar(ui));
        // What every panel reads, built from the fields it borrows so the
        // panels (other fields) can be borrowed mutably beside it.
        macro_rules! view {
            () => {
                View {
                    doc: &self.doc,
                    eval: self.eval.as_ref(),
                    chart: self.charts.shown(&self.doc),
                    chart_busy: self.charts.busy(),
                }
            };
        }
        let chart_h = self.prefs.chart_height;
        let resp = egui::Panel::bottom("charts")
            .resizable(true)
            .default_size(chart_h)
            .min_size(160.0)
            .show(ui, |ui| {
                self.charts_panel.ui(ui, &view!(), &mut self.pending);
            });
        self.prefs.chart_height = resp.response.rect.height();
        if let Some(job) = self.charts_panel.request.take() {
            self.charts.request(&ctx, &self.doc, job);
        }
        let resp = egui::Panel::right("results")
            .resizable(true)
            .default_size(self.prefs.results_width)
            .min_size(300.0)
            .show(ui, |ui| {
                egui::ScrollArea::vertical()
                    .id_salt("results-scroll")
                    .show(ui, |ui| {
                        let view = view!();
                        self.conditions_panel.ui(ui, &view, &mut self.pending);
                        ui.separator();
                        self.results_panel.ui(ui, &view, &mut self.pending);
                        ui.separator();
                        self.stability_panel.ui(ui, &view, &mut self.pending);
                    });
            });
        self.prefs.results_width = resp.response.rect.width();
        self.prefs.chart_tab = self.charts_panel.tab;
        egui::CentralPanel::default().show(ui, |ui| {
            self.variant_strip(ui);
            self.formula_panel.ui(ui, &view!(), &mut self.pending);
        });
        let view = view!();
        self.goal.ui(ui, &view, &mut self.pending);
        self.library_window.ui(ui, &view, &mut self.pending);
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
                    self.modal = Some(Modal::Unsaved { then: Action::Quit });
                }
            } else {
                self.recovery.clear();
            }
        }
    }

    /// Puts `doc` in place of the open document (new, open, sample,
    /// recover): the one place a document is replaced, so nothing that
    /// belonged to the old one stays. The solve dialog starts afresh (its
    /// target and answer were for the old formula); autosave starts
    /// afresh. The old document's recovery file is removed (it was clean,
    /// or the user chose to discard it) unless it is the one offered at
    /// start-up and not yet answered.
    pub(crate) fn replace_document(&mut self, doc: Document) {
        self.doc = doc;
        self.goal = GoalDialog::default();
        self.autosaved_revision = None;
        self.unwritten_since = None;
        self.recovery.clear();
    }

    /// Applies one command (the only place the document changes).
    pub fn apply(&mut self, ctx: &egui::Context, cmd: impl Into<Command>) {
        match cmd.into() {
            Command::Edit(e) => self.apply_edit(e),
            Command::Action(a) => self.act(ctx, a),
        }
    }

    fn apply_edit(&mut self, edit: Edit) {
        match apply_edit(&mut self.doc, &edit) {
            Ok(()) => {
                if matches!(edit, Edit::SetTemperatureUnit(_) | Edit::SetPressureUnit(_)) {
                    // Remembered for new projects too.
                    self.prefs.units = self.doc.project.units;
                }
            }
            Err(e) => self.say(e, true),
        }
    }

    fn act(&mut self, ctx: &egui::Context, action: Action) {
        if action.replaces_document() && self.doc.is_dirty() && !self.discarding {
            self.modal = Some(Modal::Unsaved { then: action });
            return;
        }
        match action {
            Action::Undo => {
                if !self.doc.undo() {
                    self.say("Nothing to undo", false);
                }
            }
            Action::Redo => {
                if !self.doc.redo() {
                    self.say("Nothing to redo", false);
                }
            }
            Action::NewProject => {
                let project = Project {
                    units: self.prefs.units,
                    ..Project::default()
                };
                self.replace_document(Document::new(self.base.clone(), project, None));
                self.say("New project", false);
            }
            Action::Open => {
                let start = self
                    .prefs
                    .recent
                    .first()
                    .and_then(|p| p.parent())
                    .map(|d| d.display().to_string() + "/")
                    .unwrap_or_default();
                self.modal = Some(Modal::Path(PathDialog::new(PathPurpose::Open, start)));
            }
            Action::OpenPath(p) => self.open_path(&p),
            Action::OpenSample(i) => match files::sample(&self.base, i) {
                Ok(p) => {
                    self.replace_document(Document::new(self.base.clone(), p, None));
                    self.say(
                        "Opened a sample project (save it to keep your changes)",
                        false,
                    );
                }
                Err(e) => self.say(e, true),
            },
            Action::Save => match self.doc.path.clone() {
                Some(p) => self.save_to(&p),
                None => self.save_as_dialog(),
            },
            Action::SaveAs => self.save_as_dialog(),
            Action::SaveTo(p) => self.save_to(&p),
            Action::Quit => {
                self.allow_close = true;
                self.recovery.clear();
                ctx.send_viewport_cmd(ViewportCommand::Close);
            }
            Action::SolveForTarget => self.goal.open_for(&self.doc),
            Action::FindAmount => {
                self.keep_unsaved_work();
                self.goal.solve(&self.doc);
                ctx.request_repaint();
            }
            Action::UserLibrary => self.library_window.open = true,
            Action::ExportChart => self.export_chart_dialog(),
            Action::ExportUserLibrary => self.library_dialog(PathPurpose::ExportLibrary),
            Action::ImportUserLibrary => self.library_dialog(PathPurpose::ImportLibrary),
            Action::RenameVariant(index) => {
                let text = self
                    .doc
                    .project
                    .variants
                    .get(index)
                    .map(|v| v.name.clone())
                    .unwrap_or_default();
                self.modal = Some(Modal::Rename { index, text });
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
        if self.allow_close || !self.doc.is_dirty() {
            // Quit (after save or discard) or nothing unsaved.
            self.recovery.clear();
        } else {
            // Ended with unsaved changes nobody discarded (the desktop
            // session ending, say): keep the newest of them.
            self.keep_unsaved_work();
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

//! File operations of the window: opening, saving, the path dialogs for
//! exports, and the autosave that writes the recovery file.

use std::path::{Path, PathBuf};
use std::time::Duration;

use colligo_core::project::Project;

use super::document::Document;
use super::files::{self, PathDialog, PathPurpose};
use super::{Modal, WorkbenchApp};

impl WorkbenchApp {
    pub(super) fn open_path(&mut self, p: &Path) {
        // Reading a file the user picked may be slow or fail badly.
        self.keep_unsaved_work();
        match Project::load(p, &self.base) {
            Ok(proj) => {
                self.replace_document(Document::new(
                    self.base.clone(),
                    proj,
                    Some(p.to_path_buf()),
                ));
                self.prefs.remember(p.to_path_buf());
                self.say(format!("Opened {}", p.display()), false);
            }
            // The open project stays as it was.
            Err(e) => self.say(format!("Could not open: {e}"), true),
        }
    }

    pub(super) fn save_to(&mut self, p: &Path) {
        match self.doc.project.save(p) {
            Ok(()) => {
                self.doc.mark_saved(p.to_path_buf());
                self.prefs.remember(p.to_path_buf());
                self.recovery.clear();
                self.autosaved_revision = None;
                self.unwritten_since = None;
                self.say(format!("Saved {}", p.display()), false);
            }
            Err(e) => self.say(format!("Not saved: {e}"), true),
        }
    }

    /// Where new files go by default: beside the project, else beside the
    /// most recent file, else the current directory.
    pub(super) fn working_dir(&self) -> PathBuf {
        self.doc
            .path
            .as_ref()
            .or(self.prefs.recent.first())
            .and_then(|p| p.parent().map(Path::to_path_buf))
            .or_else(|| std::env::current_dir().ok())
            .unwrap_or_default()
    }

    pub(super) fn save_as_dialog(&mut self) {
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

    pub(super) fn library_dialog(&mut self, purpose: PathPurpose) {
        let dir = self.working_dir();
        let start = match purpose {
            PathPurpose::ExportLibrary => dir.join("my_ingredients.ron").display().to_string(),
            _ => format!("{}/", dir.display()),
        };
        self.modal = Some(Modal::Path(PathDialog::new(purpose, start)));
    }

    pub(super) fn export_chart_dialog(&mut self) {
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

    /// Writes the recovery file 2 s after the first change it does not
    /// hold yet (so typing writes at most every 2 s, not on every key, and
    /// steady editing never goes longer unwritten), and at once when the
    /// window loses the focus: the user may be gone for long, or the
    /// desktop may end the session.
    pub(super) fn autosave(&mut self, ctx: &egui::Context, time: f64) {
        let focus_lost = ctx.input(|i| {
            i.events
                .iter()
                .any(|e| matches!(e, egui::Event::WindowFocused(false)))
        });
        if focus_lost {
            self.keep_unsaved_work();
            return;
        }
        if !self.doc.is_dirty() || self.autosaved_revision == Some(self.doc.revision) {
            self.unwritten_since = None;
            return;
        }
        let since = *self.unwritten_since.get_or_insert(time);
        let wait = 2.0;
        if time - since >= wait {
            self.keep_unsaved_work();
        } else {
            // One delayed repaint to write it; no repainting while idle otherwise.
            ctx.request_repaint_after(Duration::from_secs_f64(wait - (time - since) + 0.05));
        }
    }

    /// Writes the recovery file now if the document has unsaved changes
    /// not written yet: on focus loss, before work that may take long or
    /// read another file (a solve, opening or importing a file, the native
    /// chooser), and when eframe ends the app with unsaved changes. Not
    /// while the user is discarding them.
    pub(super) fn keep_unsaved_work(&mut self) {
        if self.discarding
            || !self.doc.is_dirty()
            || self.autosaved_revision == Some(self.doc.revision)
        {
            return;
        }
        if let Err(e) = self
            .recovery
            .write(&self.doc.project, self.doc.path.as_deref())
        {
            self.say(format!("Autosave failed: {e}"), true);
        }
        self.autosaved_revision = Some(self.doc.revision);
        self.unwritten_since = None;
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
}

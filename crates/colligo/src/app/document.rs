//! The open document: the project, where it lives on disk, its library
//! (built-in plus the project's own records), undo history and dirty state.

use std::path::PathBuf;
use std::sync::Arc;
use std::sync::atomic::{AtomicU64, Ordering};

use colligo_core::project::Project;
use colligo_core::{Formula, Library};
use egui::util::undoer::{Settings, Undoer};

/// A revision number never handed out before in this process: a new, opened
/// or recovered document never reuses one, so nothing cached for an earlier
/// document (a variant comparison, a ranking) is taken for it.
fn next_revision() -> u64 {
    static NEXT: AtomicU64 = AtomicU64::new(1);
    NEXT.fetch_add(1, Ordering::Relaxed)
}

/// The open project and everything derived from it that must stay in step.
pub struct Document {
    /// Which document this is: unique in the process, never changes (views
    /// computed for one document are never shown for another).
    pub id: u64,
    /// The project being edited.
    pub project: Project,
    /// Where it was opened from or last saved to.
    pub path: Option<PathBuf>,
    /// The library the project sees: built-in plus its user records.
    pub lib: Arc<Library>,
    /// Why the project's user records could not be added, if they could not.
    pub library_error: Option<String>,
    base: Arc<Library>,
    saved: Project,
    undoer: Undoer<Project>,
    /// Changes with every change of the project, unique across documents
    /// (autosave and the variant comparison key on it).
    pub revision: u64,
    /// Changes whenever the library is rebuilt (evaluation and chart
    /// caches key on it).
    pub library_revision: u64,
}

impl Document {
    /// A document for `project`, as opened from `path` (None: never saved).
    pub fn new(base: Arc<Library>, project: Project, path: Option<PathBuf>) -> Self {
        let mut d = Document {
            id: next_revision(),
            saved: project.clone(),
            project,
            path,
            lib: base.clone(),
            library_error: None,
            base,
            undoer: Undoer::with_settings(Settings {
                max_undos: 200,
                stable_time: 0.6,
                auto_save_interval: 10.0,
            }),
            revision: next_revision(),
            library_revision: 0,
        };
        d.rebuild_library();
        d
    }

    /// A document that was recovered from an autosave: it starts dirty.
    pub fn recovered(base: Arc<Library>, project: Project, path: Option<PathBuf>) -> Self {
        let mut d = Self::new(base, project, path);
        d.saved = Project {
            name: format!("{} (before recovery)", d.project.name),
            ..d.project.clone()
        };
        d
    }

    /// Rebuilds the library after the project's user records changed.
    pub fn rebuild_library(&mut self) {
        match self.project.library(&self.base) {
            Ok(lib) => {
                self.lib = Arc::new(lib);
                self.library_error = None;
            }
            Err(e) => {
                self.lib = self.base.clone();
                self.library_error = Some(e.to_string());
            }
        }
        self.library_revision = next_revision();
    }

    /// The built-in library.
    pub fn base(&self) -> &Arc<Library> {
        &self.base
    }

    /// True when the project differs from its last saved state.
    pub fn is_dirty(&self) -> bool {
        self.project != self.saved
    }

    /// Records that the project was saved to (or opened from) `path`.
    pub fn mark_saved(&mut self, path: PathBuf) {
        self.saved = self.project.clone();
        self.path = Some(path);
    }

    /// The active variant.
    pub fn formula(&self) -> &Formula {
        self.project.active()
    }

    /// The active variant, mutably (index clamped).
    pub fn formula_mut(&mut self) -> &mut Formula {
        let n = self.project.variants.len();
        let i = self.project.active_variant.min(n.saturating_sub(1));
        &mut self.project.variants[i]
    }

    /// Feeds the undo history with the current state (once per frame).
    pub fn feed_undo(&mut self, time: f64) {
        self.undoer.feed_state(time, &self.project);
    }

    /// Whether there is something to undo or redo.
    pub fn can_undo(&self) -> bool {
        self.undoer.has_undo(&self.project)
    }

    /// Whether there is something to redo.
    pub fn can_redo(&self) -> bool {
        self.undoer.has_redo(&self.project)
    }

    /// Steps back in the history.
    pub fn undo(&mut self) -> bool {
        match self.undoer.undo(&self.project) {
            Some(p) => {
                let p = p.clone();
                self.replace(p);
                true
            }
            None => false,
        }
    }

    /// Steps forward in the history.
    pub fn redo(&mut self) -> bool {
        match self.undoer.redo(&self.project) {
            Some(p) => {
                let p = p.clone();
                self.replace(p);
                true
            }
            None => false,
        }
    }

    fn replace(&mut self, p: Project) {
        let user_changed = p.user_solutes != self.project.user_solutes
            || p.user_ingredients != self.project.user_ingredients;
        self.project = p;
        if user_changed {
            self.rebuild_library();
        }
        self.revision = next_revision();
    }

    /// Marks a change made through a command.
    pub fn touch(&mut self) {
        self.revision = next_revision();
    }

    /// Display name for the window title: project name, file, unsaved mark.
    pub fn title(&self) -> String {
        let file = self
            .path
            .as_ref()
            .and_then(|p| p.file_name())
            .map(|f| f.to_string_lossy().into_owned())
            .unwrap_or_else(|| "not saved yet".into());
        format!(
            "{}{} — {file} — Colligo",
            if self.is_dirty() { "* " } else { "" },
            self.project.name
        )
    }
}

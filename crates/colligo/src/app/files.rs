//! Opening, saving and recovering projects: the built-in samples, the
//! recovery file written while there are unsaved changes, and the in-app
//! path dialog that works with or without a native file chooser.

use std::path::{Path, PathBuf};
use std::sync::mpsc;

use colligo_core::Library;
use colligo_core::project::Project;

/// The sample projects built into the app: (file name, text).
pub const SAMPLES: [(&str, &str); 5] = [
    (
        "reduced_sugar_spread.ron",
        include_str!("../../../../samples/reduced_sugar_spread.ron"),
    ),
    (
        "pickle_brine.ron",
        include_str!("../../../../samples/pickle_brine.ron"),
    ),
    (
        "humectant_gel.ron",
        include_str!("../../../../samples/humectant_gel.ron"),
    ),
    (
        "ice_cream_mix.ron",
        include_str!("../../../../samples/ice_cream_mix.ron"),
    ),
    (
        "soft_caramel_filling.ron",
        include_str!("../../../../samples/soft_caramel_filling.ron"),
    ),
];

/// A sample project by index.
///
/// # Errors
/// Only if a built-in sample is broken (the tests rule that out).
pub fn sample(lib: &Library, i: usize) -> Result<Project, String> {
    let (name, text) = SAMPLES.get(i).ok_or_else(|| format!("no sample {i}"))?;
    Project::from_ron(text, name, lib).map_err(|e| e.to_string())
}

/// Where recovery data lives, and whether the file there waits for the
/// user's answer.
#[derive(Debug, Clone)]
pub struct Recovery {
    dir: Option<PathBuf>,
    /// A file left by an earlier session was offered and the user has not
    /// chosen yet: until [`Recovery::answered`], nothing removes or
    /// overwrites it (closing the window keeps it for the next start).
    awaiting_answer: bool,
}

/// What a recovery file holds: the project and where it came from.
#[derive(Debug, Clone, serde::Serialize, serde::Deserialize)]
pub struct RecoveryRecord {
    /// The file the project belonged to, if any.
    pub path: Option<PathBuf>,
    /// Seconds since the Unix epoch when written.
    pub written_unix_s: u64,
    /// The project as RON text (so the record survives format checks).
    pub project_ron: String,
}

impl Recovery {
    /// Recovery under `dir` (None disables it).
    pub fn new(dir: Option<PathBuf>) -> Self {
        Recovery {
            dir,
            awaiting_answer: false,
        }
    }

    fn file(&self) -> Option<PathBuf> {
        self.dir.as_ref().map(|d| d.join("recovery.ron"))
    }

    /// Writes the unsaved project (atomically).
    ///
    /// # Errors
    /// I/O errors as text; refused while a file from an earlier session
    /// waits for the user's answer.
    pub fn write(&self, project: &Project, path: Option<&Path>) -> Result<(), String> {
        let Some(f) = self.file() else { return Ok(()) };
        if self.awaiting_answer {
            return Err(format!(
                "{} holds work from an earlier session: recover or discard it first",
                f.display()
            ));
        }
        if let Some(d) = f.parent() {
            std::fs::create_dir_all(d).map_err(|e| format!("{}: {e}", d.display()))?;
        }
        let rec = RecoveryRecord {
            path: path.map(Path::to_path_buf),
            written_unix_s: std::time::SystemTime::now()
                .duration_since(std::time::UNIX_EPOCH)
                .map_or(0, |d| d.as_secs()),
            project_ron: project.to_ron().map_err(|e| e.to_string())?,
        };
        let text = ron::ser::to_string_pretty(&rec, ron::ser::PrettyConfig::default())
            .map_err(|e| e.to_string())?;
        colligo_core::project::write_atomic(&f, text.as_bytes()).map_err(|e| e.to_string())
    }

    /// Removes the recovery file (after a save, a discard, or a clean
    /// exit); does nothing while an offered file waits for an answer.
    pub fn clear(&self) {
        if self.awaiting_answer {
            return;
        }
        if let Some(f) = self.file() {
            let _ = std::fs::remove_file(f);
        }
    }

    /// A recovery left behind by a session that did not end cleanly. When
    /// there is one, it is kept on disk until [`Recovery::answered`].
    pub fn pending(&mut self, lib: &Library) -> Option<(RecoveryRecord, Project)> {
        let f = self.file()?;
        let text = std::fs::read_to_string(&f).ok()?;
        let rec: RecoveryRecord = ron::from_str(colligo_core::project::without_bom(&text)).ok()?;
        let p = Project::from_ron(&rec.project_ron, &f.display().to_string(), lib).ok()?;
        self.awaiting_answer = true;
        Some((rec, p))
    }

    /// The user recovered or discarded the offered file: from now on it is
    /// this session's to overwrite or remove.
    pub fn answered(&mut self) {
        self.awaiting_answer = false;
    }

    /// Whether an offered file waits for the user's answer.
    pub fn awaiting_answer(&self) -> bool {
        self.awaiting_answer
    }
}

/// Purpose of the path dialog.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum PathPurpose {
    /// Open a project.
    Open,
    /// Save the project.
    Save,
    /// Export chart data as CSV.
    ExportCsv,
    /// Export the user library.
    ExportLibrary,
    /// Import a user library.
    ImportLibrary,
}

impl PathPurpose {
    /// Dialog title.
    pub fn title(self) -> &'static str {
        match self {
            PathPurpose::Open => "Open project",
            PathPurpose::Save => "Save project as",
            PathPurpose::ExportCsv => "Export chart data (CSV)",
            PathPurpose::ExportLibrary => "Export my ingredients and solutes",
            PathPurpose::ImportLibrary => "Import ingredients and solutes",
        }
    }

    /// File extension.
    pub fn extension(self) -> &'static str {
        match self {
            PathPurpose::ExportCsv => "csv",
            _ => "ron",
        }
    }

    fn saving(self) -> bool {
        matches!(
            self,
            PathPurpose::Save | PathPurpose::ExportCsv | PathPurpose::ExportLibrary
        )
    }
}

/// The in-app path dialog: a text field that always works, plus a button
/// that asks the desktop's native chooser to fill it in when one exists.
#[derive(Debug)]
pub struct PathDialog {
    /// Purpose.
    pub purpose: PathPurpose,
    /// The path being typed.
    pub text: String,
    /// An error from the last attempt.
    pub error: Option<String>,
    native: Option<mpsc::Receiver<Option<PathBuf>>>,
    /// Set when the native chooser returned nothing at all (no chooser on
    /// this desktop, or cancelled).
    pub native_unavailable: bool,
}

impl PathDialog {
    /// A dialog for `purpose`, prefilled with `suggestion`.
    pub fn new(purpose: PathPurpose, suggestion: String) -> Self {
        PathDialog {
            purpose,
            text: suggestion,
            error: None,
            native: None,
            native_unavailable: false,
        }
    }

    /// Starts the native chooser on a helper thread (the UI keeps running).
    pub fn browse(&mut self, ctx: &egui::Context) {
        let (tx, rx) = mpsc::channel();
        let purpose = self.purpose;
        let start = PathBuf::from(&self.text);
        let ctx = ctx.clone();
        std::thread::spawn(move || {
            let mut d = rfd::FileDialog::new().add_filter(purpose.title(), &[purpose.extension()]);
            if let Some(dir) = start.parent().filter(|d| d.is_dir()) {
                d = d.set_directory(dir);
            }
            if let Some(name) = start.file_name() {
                d = d.set_file_name(name.to_string_lossy());
            }
            let picked = if purpose.saving() {
                d.save_file()
            } else {
                d.pick_file()
            };
            let _ = tx.send(picked);
            ctx.request_repaint();
        });
        self.native = Some(rx);
    }

    /// Whether the native chooser is open.
    pub fn browsing(&self) -> bool {
        self.native.is_some()
    }

    /// Takes the native chooser's answer when it arrives.
    pub fn poll(&mut self) {
        if let Some(rx) = &self.native
            && let Ok(ans) = rx.try_recv()
        {
            match ans {
                Some(p) => self.text = p.display().to_string(),
                None => self.native_unavailable = true,
            }
            self.native = None;
        }
    }

    /// The typed path with the extension added when missing.
    pub fn path(&self) -> Option<PathBuf> {
        let t = self.text.trim();
        if t.is_empty() {
            return None;
        }
        let mut p = PathBuf::from(shellexpand_home(t));
        if self.purpose.saving() && p.extension().is_none() {
            p.set_extension(self.purpose.extension());
        }
        Some(p)
    }
}

fn shellexpand_home(t: &str) -> String {
    match (t.strip_prefix("~/"), std::env::var("HOME")) {
        (Some(rest), Ok(home)) => format!("{home}/{rest}"),
        _ => t.to_string(),
    }
}

/// A file name from a project name.
pub fn file_name_for(name: &str) -> String {
    let s = colligo_core::quantity::slug(name);
    format!("{}.ron", if s.is_empty() { "project" } else { &s })
}

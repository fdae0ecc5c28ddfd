//! Dialogs that take over the window until answered: unsaved changes, a
//! file path, renaming a variant, recovering unsaved work.

use std::path::PathBuf;

use colligo_core::project::Project;
use egui::RichText;

use super::commands::{Action, Edit};
use super::compute;
use super::document::Document;
use super::files::{PathDialog, PathPurpose};
use super::{WorkbenchApp, prefs, theme};

/// A dialog that takes over the window until answered.
#[derive(Debug)]
pub enum Modal {
    /// Unsaved changes would be lost by `then`.
    Unsaved {
        /// What to do after the user chose.
        then: Action,
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

impl WorkbenchApp {
    pub(super) fn modal_ui(&mut self, ctx: &egui::Context) {
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
                                self.discard_and(ctx, then);
                            }
                        }
                        None => {
                            // Ask where to save; the pending action runs
                            // once the save succeeds.
                            self.after_save = Some(then);
                            self.save_as_dialog();
                        }
                    },
                    Some(1) => self.discard_and(ctx, then),
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
                            // The desktop's chooser takes over for a while.
                            self.keep_unsaved_work();
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
                        .push(Edit::RenameVariant { index, name: text }.into()),
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
                        // The file stays until the recovered work is saved
                        // (autosave keeps it up to date meanwhile).
                        self.replace_document(Document::recovered(
                            self.base.clone(),
                            *project,
                            path,
                        ));
                        self.recovery.answered();
                        self.say("Recovered unsaved work: save it to keep it", false);
                    }
                    Some(false) => {
                        self.recovery.answered();
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
    pub(super) fn discard_and(&mut self, ctx: &egui::Context, then: Action) {
        self.discarding = true;
        self.apply(ctx, then);
        self.discarding = false;
    }

    pub(super) fn finish_path(&mut self, ctx: &egui::Context, mut d: PathDialog, p: PathBuf) {
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
                    _ => self.charts.shown(&self.doc).map(compute::chart_csv),
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
                self.keep_unsaved_work();
                match colligo_core::userlib::UserLibrary::load(&p, &self.base) {
                    Ok(ul) => {
                        let n = ul.solutes.len() + ul.ingredients.len();
                        self.pending
                            .push(Edit::ImportUserRecords(Box::new(ul)).into());
                        self.say(format!("Imported {n} records from {}", p.display()), false);
                    }
                    Err(e) => self.say(format!("Not imported: {e}"), true),
                }
            }
        }
    }
}

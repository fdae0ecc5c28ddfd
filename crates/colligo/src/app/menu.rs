//! The menu bar and the variant strip.

use egui::RichText;

use super::commands::{Action, Edit};
use super::{WorkbenchApp, files, prefs, theme};

impl WorkbenchApp {
    pub(super) fn menu_bar(&mut self, ui: &mut egui::Ui) {
        egui::MenuBar::new().ui(ui, |ui| {
            ui.menu_button("File", |ui| {
                for a in [
                    Action::NewProject,
                    Action::Open,
                    Action::Save,
                    Action::SaveAs,
                ] {
                    self.menu_item(ui, a, true);
                }
                ui.menu_button("Open recent", |ui| {
                    if self.prefs.recent.is_empty() {
                        ui.label("(none yet)");
                    }
                    for p in self.prefs.recent.clone() {
                        if ui.button(p.display().to_string()).clicked() {
                            self.pending.push(Action::OpenPath(p).into());
                        }
                    }
                });
                ui.menu_button("Open sample", |ui| {
                    for (i, (name, _)) in files::SAMPLES.iter().enumerate() {
                        if ui
                            .button(name.trim_end_matches(".ron").replace('_', " "))
                            .clicked()
                        {
                            self.pending.push(Action::OpenSample(i).into());
                        }
                    }
                });
                ui.separator();
                self.menu_item(ui, Action::Quit, true);
            });
            ui.menu_button("Edit", |ui| {
                let can_undo = self.doc.can_undo();
                let can_redo = self.doc.can_redo();
                self.menu_item(ui, Action::Undo, can_undo);
                self.menu_item(ui, Action::Redo, can_redo);
            });
            ui.menu_button("Variant", |ui| {
                self.variant_menu(ui, self.doc.project.active_variant)
            });
            ui.menu_button("Tools", |ui| {
                self.menu_item(ui, Action::SolveForTarget, true);
                self.menu_item(ui, Action::UserLibrary, true);
            });
            ui.add_space(16.0);
            ui.label(RichText::new(&self.doc.project.name).strong());
            if self.doc.is_dirty() {
                ui.label(RichText::new("unsaved changes").color(theme::WARN))
                    .on_hover_text("changes not saved to a file yet");
            }
        });
    }

    /// A menu entry for `action`: its text, first shortcut and tooltip.
    pub(super) fn menu_item(&mut self, ui: &mut egui::Ui, action: Action, enabled: bool) {
        let mut b = egui::Button::new(action.label());
        if let Some(s) = action.shortcuts().first() {
            b = b.shortcut_text(ui.ctx().format_shortcut(&s.keys));
        }
        if ui
            .add_enabled(enabled, b)
            .on_hover_text(action.tooltip())
            .clicked()
        {
            self.pending.push(action.into());
        }
    }

    pub(super) fn variant_menu(&mut self, ui: &mut egui::Ui, i: usize) {
        if ui.button("New variant").clicked() {
            self.pending.push(Edit::NewVariant.into());
        }
        if ui.button("Duplicate variant").clicked() {
            self.pending.push(Edit::DuplicateVariant(i).into());
        }
        self.menu_item(ui, Action::RenameVariant(i), true);
        let can_delete = self.doc.project.variants.len() > 1;
        if ui
            .add_enabled(can_delete, egui::Button::new("Delete variant"))
            .clicked()
        {
            self.pending.push(Edit::DeleteVariant(i).into());
        }
        ui.separator();
        if ui.button("Compare variants").clicked() {
            self.charts_panel.tab = prefs::ChartTab::Variants;
        }
    }

    pub(super) fn variant_strip(&mut self, ui: &mut egui::Ui) {
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
                    self.pending.push(Edit::SelectVariant(i).into());
                }
                r.context_menu(|ui| self.variant_menu(ui, i));
            }
            if ui.small_button("+").on_hover_text("New variant").clicked() {
                self.pending.push(Edit::NewVariant.into());
            }
        });
        ui.separator();
    }
}

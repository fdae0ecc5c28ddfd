//! What a user asks of the window rather than of the document: files, undo
//! and redo, quitting, opening tools. Each action carries its menu text,
//! tooltip and keyboard shortcuts here, so menus, tooltips and key handling
//! come from one place. Changes to the document are [`super::commands::Edit`]s.

use std::path::PathBuf;

use egui::{Key, KeyboardShortcut, Modifiers};

/// A user action on the window.
#[derive(Debug, Clone, PartialEq)]
pub enum Action {
    /// Start a new project (asks about unsaved changes).
    NewProject,
    /// Choose a project file to open (asks about unsaved changes).
    Open,
    /// Open this file (asks about unsaved changes).
    OpenPath(PathBuf),
    /// Open one of the built-in sample projects (asks about unsaved changes).
    OpenSample(usize),
    /// Save to the current file, or ask for one.
    Save,
    /// Save under a new name.
    SaveAs,
    /// Save to this path.
    SaveTo(PathBuf),
    /// Undo the last change.
    Undo,
    /// Redo.
    Redo,
    /// Quit (asks about unsaved changes).
    Quit,
    /// Open the solve-for-a-target dialog.
    SolveForTarget,
    /// Find the amount the solve dialog asks for (unsaved work is written
    /// to the recovery file first: the search can take a while).
    FindAmount,
    /// Open the window of the user's own solutes and ingredients.
    UserLibrary,
    /// Export the data of the chart shown.
    ExportChart,
    /// Export the user's records to a library file.
    ExportUserLibrary,
    /// Import records from a library file.
    ImportUserLibrary,
    /// Ask for a new name for a variant.
    RenameVariant(usize),
}

/// A key combination that triggers an action.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Shortcut {
    /// The key combination.
    pub keys: KeyboardShortcut,
    /// Whether a focused text field takes this key instead.
    pub text_field_takes_it: bool,
}

impl Shortcut {
    const fn new(modifiers: Modifiers, key: Key, text_field_takes_it: bool) -> Self {
        Shortcut {
            keys: KeyboardShortcut::new(modifiers, key),
            text_field_takes_it,
        }
    }
}

const CMD: Modifiers = Modifiers::COMMAND;
const CMD_SHIFT: Modifiers = Modifiers::COMMAND.plus(Modifiers::SHIFT);

impl Action {
    /// The actions that have keyboard shortcuts, in menu order.
    pub const WITH_SHORTCUTS: [Action; 6] = [
        Action::NewProject,
        Action::Open,
        Action::Save,
        Action::SaveAs,
        Action::Undo,
        Action::Redo,
    ];

    /// Menu text.
    pub fn label(&self) -> &'static str {
        match self {
            Action::NewProject => "New project",
            Action::Open | Action::OpenPath(_) => "Open…",
            Action::OpenSample(_) => "Open sample",
            Action::Save | Action::SaveTo(_) => "Save",
            Action::SaveAs => "Save as…",
            Action::Undo => "Undo",
            Action::Redo => "Redo",
            Action::Quit => "Quit",
            Action::SolveForTarget => "Solve for a target…",
            Action::FindAmount => "Find amount",
            Action::UserLibrary => "My ingredients and solutes…",
            Action::ExportChart => "Export CSV…",
            Action::ExportUserLibrary => "Export to a file…",
            Action::ImportUserLibrary => "Import from a file…",
            Action::RenameVariant(_) => "Rename variant…",
        }
    }

    /// Tooltip.
    pub fn tooltip(&self) -> &'static str {
        match self {
            Action::NewProject => "Start an empty project",
            Action::Open | Action::OpenPath(_) => "Open a project file",
            Action::OpenSample(_) => "Open one of the sample projects",
            Action::Save | Action::SaveTo(_) => "Save the project to its file",
            Action::SaveAs => "Save the project under a new name",
            Action::Undo => "Undo the last change to the project",
            Action::Redo => "Redo the change just undone",
            Action::Quit => "Close Colligo (asks about unsaved changes)",
            Action::SolveForTarget => "Find the amount of one ingredient that reaches a target",
            Action::FindAmount => "Search for the amount that reaches the target",
            Action::UserLibrary => "Define your own solutes and ingredients",
            Action::ExportChart => "Write the data of the chart shown to a CSV file",
            Action::ExportUserLibrary => "Write your own records to a library file",
            Action::ImportUserLibrary => "Add the records of a library file to this project",
            Action::RenameVariant(_) => "Give the variant a new name",
        }
    }

    /// Keyboard shortcuts, the first one shown in menus.
    pub fn shortcuts(&self) -> &'static [Shortcut] {
        const NEW: [Shortcut; 1] = [Shortcut::new(CMD, Key::N, false)];
        const OPEN: [Shortcut; 1] = [Shortcut::new(CMD, Key::O, false)];
        const SAVE: [Shortcut; 1] = [Shortcut::new(CMD, Key::S, false)];
        const SAVE_AS: [Shortcut; 1] = [Shortcut::new(CMD_SHIFT, Key::S, false)];
        const UNDO: [Shortcut; 1] = [Shortcut::new(CMD, Key::Z, true)];
        // Ctrl+Shift+Z and, as on many desktops, Ctrl+Y.
        const REDO: [Shortcut; 2] = [
            Shortcut::new(CMD_SHIFT, Key::Z, true),
            Shortcut::new(CMD, Key::Y, true),
        ];
        match self {
            Action::NewProject => &NEW,
            Action::Open => &OPEN,
            Action::Save => &SAVE,
            Action::SaveAs => &SAVE_AS,
            Action::Undo => &UNDO,
            Action::Redo => &REDO,
            _ => &[],
        }
    }

    /// Whether the action would drop unsaved work (and so asks first).
    pub fn replaces_document(&self) -> bool {
        matches!(
            self,
            Action::NewProject
                | Action::Open
                | Action::OpenPath(_)
                | Action::OpenSample(_)
                | Action::Quit
        )
    }
}

/// Actions whose shortcuts were pressed this frame. Shortcuts that a text
/// field would take (undo, redo) are left to the field while one has focus.
pub fn pressed(ctx: &egui::Context) -> Vec<Action> {
    let text_focus = ctx.egui_wants_keyboard_input();
    let mut list: Vec<(Action, Shortcut)> = Action::WITH_SHORTCUTS
        .iter()
        .flat_map(|a| a.shortcuts().iter().map(move |s| (a.clone(), *s)))
        .collect();
    // Longest combinations first, so Ctrl+Shift+S is not read as Ctrl+S.
    list.sort_by_key(|(_, s)| std::cmp::Reverse(s.keys.modifiers.shift as u8));
    let mut out = Vec::new();
    for (a, s) in list {
        if s.text_field_takes_it && text_focus {
            continue;
        }
        if ctx.input_mut(|i| i.consume_shortcut(&s.keys)) && !out.contains(&a) {
            out.push(a);
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn shortcuts_do_not_clash() {
        let all: Vec<(&str, Shortcut)> = Action::WITH_SHORTCUTS
            .iter()
            .flat_map(|a| a.shortcuts().iter().map(|s| (a.label(), *s)))
            .collect();
        for (i, (a, x)) in all.iter().enumerate() {
            for (b, y) in &all[i + 1..] {
                assert_ne!(x.keys, y.keys, "{a} and {b} share a shortcut");
            }
        }
    }

    #[test]
    fn redo_has_both_common_shortcuts() {
        let keys: Vec<Key> = Action::Redo
            .shortcuts()
            .iter()
            .map(|s| s.keys.logical_key)
            .collect();
        assert_eq!(keys, [Key::Z, Key::Y]);
    }
}

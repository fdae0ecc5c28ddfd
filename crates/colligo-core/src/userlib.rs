//! User libraries: a file of the user's own solutes and ingredients, to
//! carry them from one project to another.
//!
//! ```text
//! (
//!     format_version: 1,
//!     solutes: [ ... ],
//!     ingredients: [ ... ],
//! )
//! ```

use std::path::Path;

use serde::{Deserialize, Serialize};

use crate::error::{LibraryError, ProjectError};
use crate::library::{IngredientRecord, Library, SoluteRecord};
use crate::project::{read_version, ron_options, without_bom, write_atomic};

/// The newest user-library format this build reads and writes.
pub const USER_LIBRARY_VERSION: u32 = 1;

/// A user library file.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct UserLibrary {
    /// Format version.
    pub format_version: u32,
    /// Solutes.
    #[serde(default)]
    pub solutes: Vec<SoluteRecord>,
    /// Ingredients.
    #[serde(default)]
    pub ingredients: Vec<IngredientRecord>,
}

impl UserLibrary {
    /// A user library with these records.
    pub fn new(solutes: Vec<SoluteRecord>, ingredients: Vec<IngredientRecord>) -> Self {
        UserLibrary {
            format_version: USER_LIBRARY_VERSION,
            solutes,
            ingredients,
        }
    }

    /// Reads and checks a user library against `base` (every record must
    /// fit: ids not taken by built-in ones, compositions adding up).
    ///
    /// # Errors
    /// I/O, parse, version and record errors naming the file.
    pub fn load(path: &Path, base: &Library) -> Result<UserLibrary, ProjectError> {
        let shown = path.display().to_string();
        let text = std::fs::read_to_string(path).map_err(|e| ProjectError::Io {
            path: shown.clone(),
            message: e.to_string(),
        })?;
        UserLibrary::from_ron(&text, &shown, base)
    }

    /// Parses and checks a user library from text, as [`UserLibrary::load`]
    /// does; `path` is used in messages.
    ///
    /// # Errors
    /// Parse, version and record errors naming `path`.
    pub fn from_ron(text: &str, path: &str, base: &Library) -> Result<UserLibrary, ProjectError> {
        let shown = path.to_string();
        let text = without_bom(text);
        // The version first, from the parsed document: a library from a
        // newer build gets a version message, not a field error.
        if let Some(Some(found)) = read_version(text)
            && found != USER_LIBRARY_VERSION
        {
            return Err(ProjectError::Version {
                path: shown,
                found,
                supported: USER_LIBRARY_VERSION,
            });
        }
        let lib: UserLibrary = ron_options()
            .from_str(text)
            .map_err(|e| ProjectError::Parse {
                path: shown.clone(),
                message: e.to_string(),
            })?;
        if lib.format_version != USER_LIBRARY_VERSION {
            return Err(ProjectError::Version {
                path: shown,
                found: lib.format_version,
                supported: USER_LIBRARY_VERSION,
            });
        }
        lib.check_at(base)
            .map_err(|(field, e)| ProjectError::Invalid {
                path: shown,
                field,
                message: e.detail(),
            })?;
        Ok(lib)
    }

    /// Checks that every record fits on top of `base`.
    ///
    /// # Errors
    /// The first record that does not fit.
    pub fn check(&self, base: &Library) -> Result<(), LibraryError> {
        self.check_at(base).map_err(|(_, e)| e)
    }

    /// As [`UserLibrary::check`], the error with the path of the field at fault.
    fn check_at(&self, base: &Library) -> Result<(), (String, LibraryError)> {
        base.with_user_records(&self.solutes, &self.ingredients, ("solutes", "ingredients"))
            .map(|_| ())
    }

    /// Writes the library atomically.
    ///
    /// # Errors
    /// Serialisation or I/O errors naming the path.
    pub fn save(&self, path: &Path) -> Result<(), ProjectError> {
        let cfg = ron::ser::PrettyConfig::new().struct_names(false);
        let body = ron::ser::to_string_pretty(self, cfg).map_err(|e| ProjectError::Parse {
            path: path.display().to_string(),
            message: e.to_string(),
        })?;
        write_atomic(
            path,
            format!(
                "// Colligo user library (RON), format version {USER_LIBRARY_VERSION}.\n{body}\n"
            )
            .as_bytes(),
        )
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn write(name: &str, text: &str) -> std::path::PathBuf {
        let dir = std::env::temp_dir().join(format!("colligo-userlib-{}", std::process::id()));
        std::fs::create_dir_all(&dir).unwrap_or_else(|e| panic!("{e}"));
        let p = dir.join(name);
        std::fs::write(&p, text).unwrap_or_else(|e| panic!("{e}"));
        p
    }

    const SYRUP: &str = r#"(id: "my_syrup", name: "My syrup", category: Sweetener,
        water_g_per_100g: 20.0, solutes: [(solute: "sucrose", g_per_100g: 80.0)],
        source: (key: "own", tag: Mem))"#;

    /// A byte-order mark and a comment naming another version are not the
    /// document; the `format_version` field is.
    #[test]
    fn byte_order_mark_and_version_comments_are_not_the_document() {
        let lib = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        let body = format!("(format_version: 1, ingredients: [{SYRUP}])");
        for (name, text) in [
            ("bom.ron", format!("\u{feff}{body}")),
            ("comment.ron", format!("// format_version: 3\n{body}")),
        ] {
            let ul = UserLibrary::load(&write(name, &text), &lib);
            assert!(
                ul.as_ref().is_ok_and(|u| u.ingredients.len() == 1),
                "{name}: {ul:?}"
            );
        }
        // A newer library with a field this build does not know is told
        // apart by its version, not by the field.
        let newer = format!("(format_version: 2, shelf: \"top\", ingredients: [{SYRUP}])");
        match UserLibrary::load(&write("newer.ron", &newer), &lib) {
            Err(ProjectError::Version { found: 2, .. }) => {}
            other => panic!("{other:?}"),
        }
    }
}

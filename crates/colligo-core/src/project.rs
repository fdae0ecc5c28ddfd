//! Project files: a versioned RON document of our own holding named formula
//! variants, conditions, the chosen model, notes, user-defined solutes and
//! ingredients, and unit preferences.
//!
//! ```text
//! (
//!     format_version: 1,
//!     name: "Apricot spread, reduced sugar",
//!     conditions: (temperature_c: 25.0, pressure_kpa: 101.325, storage_temperature_c: -18.0),
//!     model: auto,
//!     variants: [(name: "Base", notes: "", lines: [(ingredient: "water", amount: 100.0, unit: g)])],
//!     ...
//! )
//! ```
//!
//! Loading checks the version and every field and names the file and the
//! field in each error. Undo history is never stored here.

use std::collections::HashSet;
use std::path::Path;

use serde::{Deserialize, Serialize};

use crate::error::ProjectError;
use crate::formula::Formula;
use crate::library::{Audience, IngredientRecord, Library, SoluteRecord};
use crate::models::ModelChoice;
use crate::properties::{Conditions, Limits};
use crate::quantity::{AmountUnit, PressureUnit, TemperatureUnit};
use crate::water::T_ZERO_C;

/// The newest format version this build writes and reads.
pub const FORMAT_VERSION: u32 = 1;

/// Product and storage conditions, in the units named by each field.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct ProjectConditions {
    /// Product temperature, °C.
    pub temperature_c: f64,
    /// Ambient pressure for the boiling point, kPa.
    pub pressure_kpa: f64,
    /// Storage temperature for the ice fraction, °C.
    pub storage_temperature_c: f64,
}

impl Default for ProjectConditions {
    fn default() -> Self {
        ProjectConditions {
            temperature_c: 25.0,
            pressure_kpa: 101.325,
            storage_temperature_c: -18.0,
        }
    }
}

impl ProjectConditions {
    /// As SI conditions.
    pub fn to_conditions(&self) -> Conditions {
        Conditions {
            temperature_k: self.temperature_c + T_ZERO_C,
            pressure_pa: self.pressure_kpa * 1000.0,
            storage_temperature_k: self.storage_temperature_c + T_ZERO_C,
        }
    }
}

/// Display units chosen for the project.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, Default)]
#[serde(deny_unknown_fields)]
pub struct UnitPrefs {
    /// Default unit for new lines.
    #[serde(default)]
    pub amount: AmountUnit,
    /// Temperature display.
    #[serde(default)]
    pub temperature: TemperatureUnit,
    /// Pressure display.
    #[serde(default)]
    pub pressure: PressureUnit,
}

/// A project document.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Project {
    /// Format version ([`FORMAT_VERSION`]).
    pub format_version: u32,
    /// Project name.
    pub name: String,
    /// Free notes.
    #[serde(default)]
    pub notes: String,
    /// Food or cosmetic.
    #[serde(default)]
    pub product: Audience,
    /// Conditions.
    pub conditions: ProjectConditions,
    /// Chosen model.
    pub model: ModelChoice,
    /// Display units.
    #[serde(default)]
    pub units: UnitPrefs,
    /// Formula variants (at least one).
    pub variants: Vec<Formula>,
    /// Index of the variant shown on opening.
    #[serde(default)]
    pub active_variant: usize,
    /// Solutes defined by the user.
    #[serde(default)]
    pub user_solutes: Vec<SoluteRecord>,
    /// Ingredients defined by the user.
    #[serde(default)]
    pub user_ingredients: Vec<IngredientRecord>,
}

impl Default for Project {
    fn default() -> Self {
        Project {
            format_version: FORMAT_VERSION,
            name: "Untitled".into(),
            notes: String::new(),
            product: Audience::Food,
            conditions: ProjectConditions::default(),
            model: ModelChoice::Auto,
            units: UnitPrefs::default(),
            variants: vec![Formula::new(
                "Variant 1",
                vec![crate::formula::Line::grams(crate::library::WATER_ID, 100.0)],
            )],
            active_variant: 0,
            user_solutes: Vec::new(),
            user_ingredients: Vec::new(),
        }
    }
}

/// A text without the UTF-8 byte-order mark some editors write at its
/// start (it is not part of the RON, CSV or JSON it holds).
pub fn without_bom(text: &str) -> &str {
    text.strip_prefix('\u{feff}').unwrap_or(text)
}

/// Only the `format_version` field of a document; every other field is
/// skipped unread, so a file from a newer build (with fields this build
/// does not know) still gives its version.
#[derive(Deserialize)]
struct VersionOnly {
    format_version: Option<u32>,
}

/// The `format_version` of a RON document, read from the parsed document
/// (comments and strings that mention a version are not it). `None` when
/// the text is not a RON struct at all; the full parse then says why.
pub(crate) fn read_version(text: &str) -> Option<Option<u32>> {
    ron_options()
        .from_str::<VersionOnly>(text)
        .ok()
        .map(|v| v.format_version)
}

/// The RON options every Colligo document is read with.
pub(crate) fn ron_options() -> ron::Options {
    ron::Options::default().with_default_extension(ron::extensions::Extensions::IMPLICIT_SOME)
}

impl Project {
    /// Parses and checks a project from text; `path` is used in messages.
    ///
    /// # Errors
    /// [`ProjectError`] naming the path and the problem.
    pub fn from_ron(text: &str, path: &str, lib: &Library) -> Result<Project, ProjectError> {
        let text = without_bom(text);
        match read_version(text) {
            Some(Some(found)) if found != FORMAT_VERSION => {
                return Err(ProjectError::Version {
                    path: path.into(),
                    found,
                    supported: FORMAT_VERSION,
                });
            }
            Some(None) => {
                return Err(ProjectError::Invalid {
                    path: path.into(),
                    field: "format_version".into(),
                    message: "missing (is this a Colligo project file?)".into(),
                });
            }
            _ => {}
        }
        let p: Project = ron_options()
            .from_str(text)
            .map_err(|e| ProjectError::Parse {
                path: path.into(),
                message: e.to_string(),
            })?;
        p.validate(path, lib)?;
        Ok(p)
    }

    /// Reads and checks a project file.
    ///
    /// # Errors
    /// I/O, parse and validation errors, each naming the path.
    pub fn load(path: &Path, lib: &Library) -> Result<Project, ProjectError> {
        let shown = path.display().to_string();
        let text = std::fs::read_to_string(path).map_err(|e| ProjectError::Io {
            path: shown.clone(),
            message: e.to_string(),
        })?;
        Project::from_ron(&text, &shown, lib)
    }

    /// The project as pretty RON text.
    ///
    /// # Errors
    /// Serialisation failures (not expected for valid projects).
    pub fn to_ron(&self) -> Result<String, ProjectError> {
        let cfg = ron::ser::PrettyConfig::new()
            .depth_limit(6)
            .struct_names(false)
            .separate_tuple_members(false)
            .enumerate_arrays(false);
        let body = ron::ser::to_string_pretty(self, cfg).map_err(|e| ProjectError::Parse {
            path: self.name.clone(),
            message: e.to_string(),
        })?;
        Ok(format!(
            "// Colligo project file (RON), format version {FORMAT_VERSION}.\n{body}\n"
        ))
    }

    /// Writes the project atomically: a temporary file beside the target,
    /// flushed to disk, then renamed over it. A failed save leaves the
    /// previous file intact.
    ///
    /// # Errors
    /// I/O errors naming the path.
    pub fn save(&self, path: &Path) -> Result<(), ProjectError> {
        let text = self.to_ron()?;
        write_atomic(path, text.as_bytes())
    }

    /// A library with this project's user solutes and ingredients added.
    ///
    /// # Errors
    /// The first user record that does not fit.
    pub fn library(&self, base: &Library) -> Result<Library, crate::error::LibraryError> {
        self.library_at(base).map_err(|(_, e)| e)
    }

    /// As [`Project::library`], the error with the path of the field at fault.
    fn library_at(&self, base: &Library) -> Result<Library, (String, crate::error::LibraryError)> {
        base.with_user_records(
            &self.user_solutes,
            &self.user_ingredients,
            ("user_solutes", "user_ingredients"),
        )
    }

    /// The active variant (clamped).
    pub fn active(&self) -> &Formula {
        &self.variants[self
            .active_variant
            .min(self.variants.len().saturating_sub(1))]
    }

    /// Checks every field; `path` is used in messages.
    ///
    /// # Errors
    /// [`ProjectError::Invalid`] naming the field.
    pub fn validate(&self, path: &str, base: &Library) -> Result<(), ProjectError> {
        let invalid = |field: String, message: String| ProjectError::Invalid {
            path: path.to_string(),
            field,
            message,
        };
        if self.format_version != FORMAT_VERSION {
            return Err(ProjectError::Version {
                path: path.into(),
                found: self.format_version,
                supported: FORMAT_VERSION,
            });
        }
        let c = &self.conditions;
        let checks = [
            (
                "conditions.temperature_c",
                c.temperature_c,
                Limits::TEMPERATURE_C,
                "°C",
            ),
            (
                "conditions.storage_temperature_c",
                c.storage_temperature_c,
                Limits::STORAGE_TEMPERATURE_C,
                "°C",
            ),
            (
                "conditions.pressure_kpa",
                c.pressure_kpa,
                Limits::PRESSURE_KPA,
                "kPa",
            ),
        ];
        for (field, v, range, unit) in checks {
            if !Limits::within(v, range) {
                return Err(invalid(
                    field.into(),
                    format!(
                        "{} {unit} is outside {} to {} {unit}",
                        crate::error::short(v),
                        crate::error::signed(range.0),
                        crate::error::signed(range.1)
                    ),
                ));
            }
        }
        if self.variants.is_empty() {
            return Err(invalid(
                "variants".into(),
                "a project needs at least one variant".into(),
            ));
        }
        if self.active_variant >= self.variants.len() {
            return Err(invalid(
                "active_variant".into(),
                format!(
                    "{} but there are {} variants",
                    self.active_variant,
                    self.variants.len()
                ),
            ));
        }
        let lib = self
            .library_at(base)
            .map_err(|(field, e)| invalid(field, e.detail()))?;
        let mut names = HashSet::new();
        for (vi, v) in self.variants.iter().enumerate() {
            if v.name.trim().is_empty() {
                return Err(invalid(format!("variants[{vi}].name"), "empty name".into()));
            }
            if !names.insert(v.name.as_str()) {
                return Err(invalid(
                    format!("variants[{vi}].name"),
                    format!("duplicate variant name `{}`", crate::error::elide(&v.name)),
                ));
            }
            for (li, line) in v.lines.iter().enumerate() {
                if lib.ingredient(&line.ingredient).is_none() {
                    let e = lib
                        .ingredient_or_suggest(&line.ingredient)
                        .err()
                        .map(|e| e.to_string())
                        .unwrap_or_default();
                    return Err(invalid(format!("variants[{vi}].lines[{li}].ingredient"), e));
                }
                if !(line.amount.is_finite() && line.amount >= 0.0) {
                    return Err(invalid(
                        format!("variants[{vi}].lines[{li}].amount"),
                        format!(
                            "{} is not a finite amount ≥ 0",
                            crate::error::short(line.amount)
                        ),
                    ));
                }
                if line
                    .amount()
                    .kg()
                    .is_some_and(|kg| kg > crate::formula::MAX_LINE_KG)
                {
                    return Err(invalid(
                        format!("variants[{vi}].lines[{li}].amount"),
                        format!(
                            "{} {} is above the largest a line may hold ({} kg)",
                            crate::error::short(line.amount),
                            line.unit.symbol(),
                            crate::error::short(crate::formula::MAX_LINE_KG)
                        ),
                    ));
                }
                if line.unit == AmountUnit::Percent && line.amount >= 100.0 {
                    return Err(invalid(
                        format!("variants[{vi}].lines[{li}].amount"),
                        "a share of the batch must be below 100 %".into(),
                    ));
                }
            }
        }
        Ok(())
    }
}

/// Writes `bytes` to `path` atomically (temporary file in the same
/// directory, fsync, rename).
///
/// # Errors
/// I/O errors naming the path.
pub fn write_atomic(path: &Path, bytes: &[u8]) -> Result<(), ProjectError> {
    use std::io::Write;
    let shown = path.display().to_string();
    let io = |e: std::io::Error| ProjectError::Io {
        path: shown.clone(),
        message: e.to_string(),
    };
    let dir = path
        .parent()
        .filter(|d| !d.as_os_str().is_empty())
        .unwrap_or(Path::new("."));
    let file_name = path
        .file_name()
        .map(|n| n.to_string_lossy().to_string())
        .unwrap_or_else(|| "project".into());
    let tmp = dir.join(format!(".{file_name}.{}.tmp", std::process::id()));
    let result = (|| {
        let mut f = std::fs::File::create(&tmp)?;
        f.write_all(bytes)?;
        f.sync_all()?;
        std::fs::rename(&tmp, path)
    })();
    if result.is_err() {
        let _ = std::fs::remove_file(&tmp);
    }
    result.map_err(io)
}

//! Colligo's computation core: water activity, vapour pressure, freezing and
//! boiling points, ice fraction and osmolality of multi-solute aqueous
//! formulations, from published thermodynamic models.
//!
//! No GUI and no file dialogs live here; the desktop app and the command
//! line are thin layers over this crate.

pub mod composition;
pub mod correlations;
pub mod error;
pub mod formula;
pub mod goal;
pub mod guidance;
pub mod keys;
pub mod library;
pub mod models;
pub mod project;
pub mod properties;
pub mod quantity;
pub mod solver;
pub mod sweep;
pub mod userlib;
pub mod warnings;
pub mod water;

pub use composition::Composition;
pub use error::{FormulaError, LibraryError, ModelError, ParseError, ProjectError, SolverError};
pub use formula::{Formula, Line};
pub use keys::ScalarKey;
pub use library::Library;
pub use models::{Model, ModelChoice};
pub use project::Project;
pub use properties::{Conditions, Properties, Wanted, evaluate};
pub use warnings::Warning;

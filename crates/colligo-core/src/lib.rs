//! Colligo's computation core: water activity, vapour pressure, freezing and
//! boiling points, ice fraction and osmolality of multi-solute aqueous
//! formulations, from published thermodynamic models.
//!
//! No GUI and no file dialogs live here; the desktop app and the command
//! line are thin layers over this crate.

pub mod error;
pub mod library;
pub mod tfun;
pub mod water;

pub use error::LibraryError;
pub use library::Library;

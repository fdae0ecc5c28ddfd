//! Typed errors of the computation core.

use thiserror::Error;

/// Problems in library data (built-in assets or a user library file).
#[derive(Debug, Clone, PartialEq, Error)]
#[non_exhaustive]
pub enum LibraryError {
    /// A file could not be parsed.
    #[error("cannot read {file}: {message}")]
    Parse {
        /// File name.
        file: String,
        /// Parser message with position.
        message: String,
    },
    /// Two entries share an id.
    #[error("duplicate {what} id `{id}`")]
    Duplicate {
        /// What kind of entry.
        what: &'static str,
        /// The id.
        id: String,
    },
    /// An entry is inconsistent.
    #[error("`{id}`: {message}")]
    Invalid {
        /// The entry.
        id: String,
        /// What is wrong.
        message: String,
    },
    /// A citation names a key missing from the bibliography.
    #[error("`{owner}` cites unknown source `{key}`")]
    UnknownSource {
        /// The key.
        key: String,
        /// Who cites it.
        owner: String,
    },
    /// An ingredient id is unknown.
    #[error("unknown ingredient `{id}`{}", suggest_text(.suggestions))]
    UnknownIngredient {
        /// What was asked for.
        id: String,
        /// Near matches.
        suggestions: Vec<String>,
    },
}

pub(crate) fn suggest_text(s: &[String]) -> String {
    if s.is_empty() {
        String::new()
    } else {
        format!(" (did you mean {}?)", s.iter().map(|x| format!("`{x}`")).collect::<Vec<_>>().join(", "))
    }
}

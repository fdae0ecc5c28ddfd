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
    /// A correlation or table of an entry has bad coefficients.
    #[error("`{id}`: {field}: {source}")]
    Correlation {
        /// The entry.
        id: String,
        /// Which of its fields.
        field: &'static str,
        /// What is wrong.
        source: crate::correlations::CorrelationError,
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

/// A whole number with a typographic minus sign (−60, not -60).
pub(crate) fn signed(v: f64) -> String {
    if v < 0.0 {
        format!("−{:.0}", -v)
    } else {
        format!("{v:.0}")
    }
}

pub(crate) fn suggest_text(s: &[String]) -> String {
    if s.is_empty() {
        String::new()
    } else {
        format!(
            " (did you mean {}?)",
            s.iter()
                .map(|x| format!("`{x}`"))
                .collect::<Vec<_>>()
                .join(", ")
        )
    }
}

/// Why a root finder stopped without an answer.
#[derive(Debug, Clone, Copy, PartialEq, Error)]
#[non_exhaustive]
pub enum SolverError {
    /// The function has the same sign at both ends of the interval.
    #[error("no sign change between {lo} and {hi} (f = {f_lo:.3e} and {f_hi:.3e})")]
    NoBracket {
        /// Lower end.
        lo: f64,
        /// Upper end.
        hi: f64,
        /// f at the lower end.
        f_lo: f64,
        /// f at the upper end.
        f_hi: f64,
    },
    /// The iteration limit was reached.
    #[error("not converged after {iterations} iterations (x = {x}, f = {f:.3e})")]
    NotConverged {
        /// Iterations done.
        iterations: usize,
        /// Last x.
        x: f64,
        /// Last f.
        f: f64,
    },
    /// The function returned NaN or an infinity.
    #[error("the function is not finite at x = {x}")]
    NonFinite {
        /// Where.
        x: f64,
    },
}

/// Problems evaluating a water-activity model or a property.
#[derive(Debug, Clone, PartialEq, Error)]
#[non_exhaustive]
pub enum ModelError {
    /// The mixture has no liquid water.
    #[error("the formula contains no water")]
    NoWater,
    /// The temperature is outside every equation's range.
    #[error(
        "temperature {t_c:.2} °C is outside the range of the water equations ({min_c:.0} to {max_c:.0} °C)"
    )]
    TemperatureOutOfRange {
        /// Requested, °C.
        t_c: f64,
        /// Lowest, °C.
        min_c: f64,
        /// Highest, °C.
        max_c: f64,
    },
    /// A root finder failed for a named property.
    #[error("cannot compute the {property}: {source}")]
    Solver {
        /// Which property.
        property: &'static str,
        /// Why.
        source: SolverError,
    },
    /// No ice forms above the coldest temperature searched.
    #[error("freezing point: no ice forms above {} °C", signed(*.min_c))]
    NoFreezingPoint {
        /// Coldest temperature searched, °C.
        min_c: f64,
    },
    /// The solution does not boil below the hottest temperature searched.
    #[error("boiling point: the solution does not boil below {max_c:.0} °C at this pressure")]
    NoBoilingPoint {
        /// Hottest temperature searched, °C.
        max_c: f64,
    },
    /// An ambient pressure that no evaluation can use.
    #[error("pressure: {pa} Pa is not a usable ambient pressure")]
    UnusablePressure {
        /// The pressure, Pa.
        pa: f64,
    },
}

/// Problems in a formula or an amount typed by a user.
#[derive(Debug, Clone, PartialEq, Error)]
#[non_exhaustive]
pub enum FormulaError {
    /// Unknown ingredient or solute.
    #[error(transparent)]
    Library(#[from] LibraryError),
    /// An amount could not be read.
    #[error("cannot read amount `{text}`: {reason}")]
    BadAmount {
        /// What was typed.
        text: String,
        /// Why.
        reason: String,
    },
    /// A negative or non-finite amount.
    #[error("amount of `{ingredient}` must be a finite number ≥ 0, got {value}")]
    NegativeAmount {
        /// Ingredient id.
        ingredient: String,
        /// The value.
        value: f64,
    },
    /// Percentages of batch add up to 100 % or more.
    #[error(
        "percentages of batch add up to {total:.1} %, leaving nothing for the weighed ingredients"
    )]
    PercentOverflow {
        /// Sum of percentages.
        total: f64,
    },
    /// A mix specification could not be parsed.
    #[error("cannot read `{text}`: {reason}")]
    BadMix {
        /// The offending part.
        text: String,
        /// Why.
        reason: String,
    },
    /// A temperature or pressure could not be read.
    #[error("cannot read {what} `{text}`: {reason}")]
    BadQuantity {
        /// Temperature, pressure…
        what: &'static str,
        /// What was typed.
        text: String,
        /// Why.
        reason: String,
    },
}

/// Problems reading or writing a project file.
#[derive(Debug, Clone, PartialEq, Error)]
#[non_exhaustive]
pub enum ProjectError {
    /// The file is not valid RON or does not match the format.
    #[error("{path}: not a readable Colligo project: {message}")]
    Parse {
        /// File path.
        path: String,
        /// Parser message with line and column.
        message: String,
    },
    /// The file is from a newer or unknown format version.
    #[error(
        "{path}: project format version {found} is not supported (this build reads up to {supported})"
    )]
    Version {
        /// File path.
        path: String,
        /// Version in the file.
        found: u32,
        /// Newest version this build reads.
        supported: u32,
    },
    /// A field has a value that makes no sense.
    #[error("{path}: {field}: {message}")]
    Invalid {
        /// File path.
        path: String,
        /// Dotted path to the field.
        field: String,
        /// What is wrong.
        message: String,
    },
    /// Reading or writing failed.
    #[error("{path}: {message}")]
    Io {
        /// File path.
        path: String,
        /// OS message.
        message: String,
    },
}

/// Text that does not name something the core knows (a model, a target).
#[derive(Debug, Clone, PartialEq, Error)]
#[non_exhaustive]
pub enum ParseError {
    /// Not a model id.
    #[error("unknown model `{text}` (choose auto, ideal, norrish, ross, zsr or pitzer)")]
    UnknownModel {
        /// What was given.
        text: String,
    },
}

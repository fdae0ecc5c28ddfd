//! Typed errors of the computation core.

use std::borrow::Cow;

use thiserror::Error;

/// Text a user wrote that is longer than this many characters is shortened
/// in messages ([`elide`]); no id, unit or number is this long.
pub const MAX_SHOWN_CHARS: usize = 64;

/// How many characters of a shortened text a message keeps.
const KEPT_CHARS: usize = 40;

/// Text a user wrote (an id, an amount, a field name), for a message: as
/// written up to [`MAX_SHOWN_CHARS`] characters, else its first 40
/// characters, `…` and its length, so that a megabyte typed by mistake
/// gives a one-line message.
pub fn elide(text: &str) -> Cow<'_, str> {
    match text.char_indices().nth(MAX_SHOWN_CHARS) {
        None => Cow::Borrowed(text),
        Some(_) => {
            let cut = text
                .char_indices()
                .nth(KEPT_CHARS)
                .map_or(text.len(), |(i, _)| i);
            Cow::Owned(format!(
                "{}… ({} characters)",
                &text[..cut],
                text.chars().count()
            ))
        }
    }
}

/// A whole message from elsewhere (a parser's, a library's) with every run
/// of more than [`MAX_SHOWN_CHARS`] characters without a space shortened as
/// [`elide`] does.
pub fn elide_words(message: &str) -> Cow<'_, str> {
    let long = |w: &str| w.char_indices().nth(MAX_SHOWN_CHARS).is_some();
    if !message.split_whitespace().any(long) {
        return Cow::Borrowed(message);
    }
    let mut out = String::with_capacity(256);
    let mut rest = message;
    while !rest.is_empty() {
        let start = rest
            .find(|c: char| !c.is_whitespace())
            .unwrap_or(rest.len());
        out.push_str(&rest[..start]);
        rest = &rest[start..];
        let end = rest.find(char::is_whitespace).unwrap_or(rest.len());
        let word = &rest[..end];
        // A quoted word keeps its quotes around the shortened text.
        let quotes = ['\'', '`', '"'];
        match word.chars().next() {
            Some(open) if quotes.contains(&open) && word.len() > 2 => {
                let inner = &word[open.len_utf8()..];
                let (inner, tail) = match inner.rfind(quotes) {
                    Some(i) if i > 0 => inner.split_at(i),
                    _ => (inner, ""),
                };
                out.push(open);
                out.push_str(&elide(inner));
                out.push_str(tail);
            }
            _ => out.push_str(&elide(word)),
        }
        rest = &rest[end..];
    }
    Cow::Owned(out)
}

/// A number for a message that must keep its exact value: Rust's shortest
/// round-trip form (`0.85`, `-18`), or in scientific notation when that
/// would be long (`1e308` rather than 309 digits).
pub fn compact(v: f64) -> String {
    let s = v.to_string();
    if s.len() > 20 { format!("{v:e}") } else { s }
}

/// Problems in library data (built-in assets or a user library file).
#[derive(Debug, Clone, PartialEq, Error)]
#[non_exhaustive]
pub enum LibraryError {
    /// A file could not be parsed.
    #[error("cannot read {file}: {}", elide_words(.message))]
    Parse {
        /// File name.
        file: String,
        /// Parser message with position.
        message: String,
    },
    /// Two entries share an id.
    #[error("duplicate {what} id `{}`", elide(.id))]
    Duplicate {
        /// What kind of entry.
        what: &'static str,
        /// The id.
        id: String,
    },
    /// An entry is inconsistent.
    #[error("`{}`: {message}", elide(.id))]
    Invalid {
        /// The entry.
        id: String,
        /// What is wrong.
        message: String,
    },
    /// A field of an entry holds a value outside what the models can use.
    #[error("`{}`: {field}: {problem}", elide(.id))]
    Field {
        /// The entry.
        id: String,
        /// Path of the field within the entry, e.g. `norrish.t_range_c.1`.
        field: String,
        /// What is wrong.
        problem: FieldProblem,
    },
    /// A correlation or table of an entry has bad coefficients.
    #[error("`{}`: {field}: {source}", elide(.id))]
    Correlation {
        /// The entry.
        id: String,
        /// Which of its fields.
        field: &'static str,
        /// What is wrong.
        source: crate::correlations::CorrelationError,
    },
    /// A citation names a key missing from the bibliography.
    #[error("`{}` cites unknown source `{}`", elide(.owner), elide(.key))]
    UnknownSource {
        /// The key.
        key: String,
        /// Who cites it.
        owner: String,
    },
    /// An ingredient id is unknown.
    #[error("unknown ingredient `{}`{}", elide(.id), suggest_text(.suggestions))]
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

impl LibraryError {
    /// The message without the field path, for callers that show the path
    /// themselves (a project's `user_solutes[0].norrish.k`).
    pub fn detail(&self) -> String {
        match self {
            LibraryError::Field { id, problem, .. } => format!("`{}`: {problem}", elide(id)),
            e => e.to_string(),
        }
    }
}

/// What is wrong with one field's value.
#[derive(Debug, Clone, PartialEq, Error)]
#[non_exhaustive]
pub enum FieldProblem {
    /// Not a finite number (NaN or an infinity; RON reads 1e309 as infinity).
    #[error("{} is not a finite number", short(*.value))]
    NotFinite {
        /// The value.
        value: f64,
    },
    /// Outside the physical range.
    #[error("{} is outside {} to {}", short(*.value), short(*.min), short(*.max))]
    OutOfRange {
        /// The value.
        value: f64,
        /// Lowest accepted.
        min: f64,
        /// Highest accepted.
        max: f64,
    },
    /// A range whose low end is not below its high end.
    #[error("the range {} to {} is empty", short(*.lo), short(*.hi))]
    EmptyRange {
        /// Low end.
        lo: f64,
        /// High end.
        hi: f64,
    },
    /// A Norrish constant so negative that a_w would rise with solute.
    #[error(
        "K = {} would make a_w rise as solute is added within the data (it must be at least {k_min:.3} for this max_mole_fraction)", short(*.k)
    )]
    RaisesWaterActivity {
        /// K at an end of its temperature range.
        k: f64,
        /// The lowest K that keeps the binary falling.
        k_min: f64,
    },
    /// Bad coefficients of a correlation or table.
    #[error(transparent)]
    Correlation(crate::correlations::CorrelationError),
}

/// A number for a message: plain for ordinary magnitudes, in scientific
/// notation for huge or tiny ones (so 1e308 does not print 309 digits).
pub fn short(v: f64) -> String {
    let a = v.abs();
    if v == 0.0 {
        "0".into()
    } else if !(1e-4..1e7).contains(&a) {
        format!("{v:.3e}")
    } else {
        let s = format!("{v:.4}");
        let s = s.trim_end_matches('0').trim_end_matches('.');
        s.to_string()
    }
}

/// Why a root finder stopped without an answer.
#[derive(Debug, Clone, Copy, PartialEq, Error)]
#[non_exhaustive]
pub enum SolverError {
    /// The function has the same sign at both ends of the interval.
    #[error("no sign change between {} and {} (f = {f_lo:.3e} and {f_hi:.3e})", short(*.lo), short(*.hi))]
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
    #[error("not converged after {iterations} iterations (x = {}, f = {f:.3e})", short(*.x))]
    NotConverged {
        /// Iterations done.
        iterations: usize,
        /// Last x.
        x: f64,
        /// Last f.
        f: f64,
    },
    /// An interval with no inside: lo not below hi, or an end not finite.
    #[error("the search interval {} to {} is empty", short(*.lo), short(*.hi))]
    EmptyInterval {
        /// Lower end.
        lo: f64,
        /// Upper end.
        hi: f64,
    },
    /// The function returned NaN or an infinity.
    #[error("the function is not finite at x = {}", short(*.x))]
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
    /// A model returned a value that is not a number, or a water activity
    /// outside (0, 1]: the inputs are outside what it can represent.
    #[error("{property} came out as {}, which is not a usable value: the formula is outside what the model can represent", short(*.value))]
    NotUsable {
        /// The property.
        property: &'static str,
        /// What came out.
        value: f64,
    },
    /// The temperature is outside every equation's range.
    #[error(
        "temperature {} °C is outside the range of the water equations ({} to {} °C)",
        short(*.t_c),
        signed(*.min_c),
        signed(*.max_c)
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
    #[error("no ice forms above {} °C", signed(*.min_c))]
    NoFreezingPoint {
        /// Coldest temperature searched, °C.
        min_c: f64,
    },
    /// The solution does not boil below the hottest temperature searched.
    #[error("the solution does not boil below {} °C at this pressure", short(*.max_c))]
    NoBoilingPoint {
        /// Hottest temperature searched, °C.
        max_c: f64,
    },
    /// An ambient pressure that no evaluation can use.
    #[error("pressure: {} Pa is not a usable ambient pressure", short(*.pa))]
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
    #[error("cannot read amount `{}`: {reason}", elide(.text))]
    BadAmount {
        /// What was typed.
        text: String,
        /// Why.
        reason: String,
    },
    /// A negative or non-finite amount.
    #[error("amount of `{}` must be a finite number ≥ 0, got {}", elide(.ingredient), short(*.value))]
    NegativeAmount {
        /// Ingredient id.
        ingredient: String,
        /// The value.
        value: f64,
    },
    /// A line heavier than any batch can be.
    #[error(
        "amount of `{}` is {} kg, above the largest a line may hold ({} kg)",
        elide(.ingredient),
        short(*.kg),
        short(*.max_kg)
    )]
    TooLarge {
        /// Ingredient id.
        ingredient: String,
        /// The amount, kg.
        kg: f64,
        /// The bound, kg.
        max_kg: f64,
    },
    /// Percentages of batch add up to 100 % or more.
    #[error(
        "percentages of batch add up to {} %, leaving nothing for the weighed ingredients", short(*.total)
    )]
    PercentOverflow {
        /// Sum of percentages.
        total: f64,
    },
    /// A mix specification could not be parsed.
    #[error("cannot read `{}`: {reason}", elide(.text))]
    BadMix {
        /// The offending part.
        text: String,
        /// Why.
        reason: String,
    },
    /// A temperature or pressure could not be read.
    #[error("cannot read {what} `{}`: {reason}", elide(.text))]
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
    #[error("{path}: not a readable Colligo project: {}", elide_words(.message))]
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
    #[error("unknown model `{}` (choose auto, ideal, norrish, ross, zsr or pitzer)", elide(.text))]
    UnknownModel {
        /// What was given.
        text: String,
    },
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn long_texts_are_shortened_with_their_length() {
        assert_eq!(elide("sucrose"), "sucrose");
        let long = "x".repeat(1_000_000);
        let e = elide(&long);
        assert!(
            e.starts_with(&"x".repeat(40)) && e.ends_with("… (1000000 characters)"),
            "{e}"
        );
        assert!(e.len() < 80);
        // Characters, not bytes: no cut inside a UTF-8 sequence.
        let accents = "é".repeat(100);
        assert!(elide(&accents).ends_with("(100 characters)"));
        let msg = format!("invalid value '{long}' for '--model <MODEL>'");
        let short_msg = elide_words(&msg);
        assert!(short_msg.starts_with("invalid value 'xxx"), "{short_msg}");
        assert!(
            short_msg.contains("characters)' for '--model <MODEL>'"),
            "{short_msg}"
        );
        assert_eq!(elide_words("a short message"), "a short message");
    }

    #[test]
    fn compact_numbers_keep_their_value() {
        assert_eq!(compact(0.85), "0.85");
        assert_eq!(compact(-18.0), "-18");
        assert_eq!(compact(1e308), "1e308");
        assert_eq!(compact(1e308).parse::<f64>(), Ok(1e308));
    }
}

//! The library of solutes, ions, Pitzer parameters, ingredients and guidance
//! lines: loaded from the RON files in `assets/` (embedded at compile time),
//! checked, and indexed for fast lookup.

mod load;
pub mod records;
mod search;
pub mod validate;
pub use load::MAX_ID_CHARS;
pub use search::{MAX_QUERY_CHARS, MatchKind, SearchHit};

use std::collections::HashMap;

pub use records::*;

use crate::correlations::TempFn;
use crate::error::LibraryError;

/// Index of a solute in [`Library::solutes`].
pub type SoluteIdx = usize;
/// Index of an ion in [`Library::ions`].
pub type IonIdx = usize;

/// Built-in asset texts, embedded at compile time, as `(file name, text)`.
pub mod embedded {
    macro_rules! asset {
        ($path:literal) => {
            ($path, include_str!(concat!("../../../../assets/", $path)))
        };
    }
    /// Bibliography files.
    pub const SOURCES: &[(&str, &str)] = &[
        asset!("sources/core.ron"),
        asset!("sources/electrolytes.ron"),
        asset!("sources/nonelectrolytes.ron"),
        asset!("sources/ingredients.ron"),
        asset!("sources/thresholds.ron"),
    ];
    /// Solute files.
    pub const SOLUTES: &[(&str, &str)] = &[
        asset!("solutes/nonelectrolytes.ron"),
        asset!("solutes/electrolytes.ron"),
    ];
    /// Ions and Pitzer parameters.
    pub const PITZER: &[(&str, &str)] = &[asset!("pitzer.ron")];
    /// Composite ingredients.
    pub const INGREDIENTS: &[(&str, &str)] = &[asset!("ingredients.ron")];
    /// Guidance lines.
    pub const THRESHOLDS: &[(&str, &str)] = &[asset!("thresholds.ron")];
}

/// The texts of a library's data files, each as `(file name, text)`.
#[derive(Debug, Clone, Copy)]
pub struct LibraryTexts<'a> {
    /// Bibliography files.
    pub sources: &'a [(&'a str, &'a str)],
    /// Solute files.
    pub solutes: &'a [(&'a str, &'a str)],
    /// Pitzer files.
    pub pitzer: &'a [(&'a str, &'a str)],
    /// Ingredient files.
    pub ingredients: &'a [(&'a str, &'a str)],
    /// Threshold files.
    pub thresholds: &'a [(&'a str, &'a str)],
}

impl LibraryTexts<'static> {
    /// The embedded built-in files.
    pub const BUILTIN: Self = LibraryTexts {
        sources: embedded::SOURCES,
        solutes: embedded::SOLUTES,
        pitzer: embedded::PITZER,
        ingredients: embedded::INGREDIENTS,
        thresholds: embedded::THRESHOLDS,
    };
}

/// A solute with its references resolved.
#[derive(Debug, Clone)]
pub struct Solute {
    /// The record as stored.
    pub record: SoluteRecord,
    /// Molar mass, kg/mol.
    pub molar_mass: f64,
    /// Ions per formula unit (empty for non-electrolytes).
    pub ions: Vec<(IonIdx, f64)>,
    /// Total particles per formula unit (1 for non-electrolytes).
    pub nu: f64,
    /// The Pitzer pair of a 1-cation, 1-anion electrolyte, when parameterised.
    pub pair: Option<usize>,
    /// Whether the solute was defined by the user (not built in).
    pub user_defined: bool,
}

impl Solute {
    /// Stable id.
    pub fn id(&self) -> &str {
        &self.record.id
    }
    /// Display name.
    pub fn name(&self) -> &str {
        &self.record.name
    }
    /// True for dissociating solutes.
    pub fn is_electrolyte(&self) -> bool {
        matches!(self.record.kind, SoluteKind::Electrolyte { .. })
    }
    /// True for volatile co-solvents.
    pub fn volatile(&self) -> Option<&VolatileRecord> {
        match &self.record.kind {
            SoluteKind::Volatile(v) => Some(v),
            _ => None,
        }
    }
    /// Solubility, mol per kg of water, at `t_k`, with a flag set when the
    /// temperature is outside the tabulated range.
    pub fn solubility_molality(&self, t_k: f64) -> Option<(f64, bool)> {
        let s = self.record.solubility.as_ref()?;
        let t_c = t_k - crate::water::T_ZERO_C;
        let (lo, hi) = s.g_per_100g_water.range();
        let g = s.g_per_100g_water.eval(t_c).max(0.0);
        Some((g * 10.0 / (self.molar_mass * 1000.0), t_c < lo || t_c > hi))
    }
}

/// An ion.
#[derive(Debug, Clone)]
pub struct Ion {
    /// The record.
    pub record: IonRecord,
    /// Charge number.
    pub z: f64,
}

/// An ingredient with its solutes resolved to indices.
#[derive(Debug, Clone)]
pub struct Ingredient {
    /// The record.
    pub record: IngredientRecord,
    /// `(solute, kg of solute per kg of ingredient, molar mass kg/mol)`.
    pub solutes: Vec<(SoluteIdx, f64, f64)>,
    /// Water, kg per kg of ingredient.
    pub water: f64,
    /// Insoluble solids, kg per kg of ingredient.
    pub insoluble: f64,
    /// Whether this ingredient is a pure library solute.
    pub pure_solute: bool,
    /// Whether the user defined it.
    pub user_defined: bool,
}

impl Ingredient {
    /// Stable id.
    pub fn id(&self) -> &str {
        &self.record.id
    }
    /// Display name.
    pub fn name(&self) -> &str {
        &self.record.name
    }
}

/// Pitzer data resolved to ion indices.
#[derive(Debug, Clone, Default)]
pub struct PitzerData {
    /// Pairs, as stored.
    pub pairs: Vec<PairRecord>,
    /// `(cation, anion)` → index in `pairs`.
    pub pair_index: HashMap<(IonIdx, IonIdx), usize>,
    /// `(ion, ion)` with the smaller index first → θ.
    pub theta: HashMap<(IonIdx, IonIdx), usize>,
    /// θ records.
    pub thetas: Vec<ThetaRecord>,
    /// `(ion, ion, other)` with like-sign pair ordered → ψ.
    pub psi: HashMap<(IonIdx, IonIdx, IonIdx), usize>,
    /// ψ records.
    pub psis: Vec<PsiRecord>,
}

/// The whole library.
#[derive(Debug, Clone)]
pub struct Library {
    /// Bibliography.
    pub sources: Vec<SourceRecord>,
    /// Solutes.
    pub solutes: Vec<Solute>,
    /// Ions.
    pub ions: Vec<Ion>,
    /// Pitzer parameters.
    pub pitzer: PitzerData,
    /// Ingredients: composite ones, then water, then one per pure solute.
    pub ingredients: Vec<Ingredient>,
    /// Guidance lines.
    pub thresholds: Vec<ThresholdRecord>,
    solute_index: HashMap<String, SoluteIdx>,
    ion_index: HashMap<String, IonIdx>,
    ingredient_index: HashMap<String, usize>,
    source_index: HashMap<String, usize>,
}

/// Id of the water ingredient.
pub const WATER_ID: &str = "water";

impl Library {
    /// Solute by id.
    pub fn solute(&self, id: &str) -> Option<SoluteIdx> {
        self.solute_index.get(id).copied()
    }

    /// Ingredient by id (composite, pure solute or water).
    pub fn ingredient(&self, id: &str) -> Option<usize> {
        self.ingredient_index.get(id).copied()
    }

    /// Ingredient by id, or an error with the nearest ids suggested.
    ///
    /// # Errors
    /// [`LibraryError::UnknownIngredient`].
    pub fn ingredient_or_suggest(&self, id: &str) -> Result<usize, LibraryError> {
        self.ingredient(id)
            .ok_or_else(|| LibraryError::UnknownIngredient {
                id: id.to_string(),
                suggestions: self.suggest(id),
            })
    }

    /// Source by key.
    pub fn source(&self, key: &str) -> Option<&SourceRecord> {
        self.source_index.get(key).map(|&i| &self.sources[i])
    }

    /// Citation text for a [`Cite`].
    pub fn cite_text(&self, cite: &Cite) -> String {
        let base = self
            .source(&cite.key)
            .map_or(cite.key.as_str(), |s| s.citation.as_str());
        match &cite.at {
            Some(at) => format!("{base} ({at})"),
            None => base.to_string(),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn builtin_library_loads() {
        let lib = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        assert!(lib.solute("sucrose").is_some());
        assert!(lib.ingredient(WATER_ID).is_some());
    }

    #[test]
    fn suggestion_distance_counts_characters() {
        // `suggest` ranks by strsim's Levenshtein distance, which counts
        // characters (not bytes), so accented names are one edit away.
        assert_eq!(strsim::levenshtein("kitten", "sitting"), 3);
        assert_eq!(strsim::levenshtein("", "abc"), 3);
        assert_eq!(strsim::levenshtein("sucrose", "sucrose"), 0);
        assert_eq!(strsim::levenshtein("crème", "creme"), 1);
    }

    #[test]
    fn suggestions_find_typos() {
        let lib = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        let s = lib.suggest("sucrse");
        assert_eq!(s.first().map(String::as_str), Some("sucrose"));
    }
}

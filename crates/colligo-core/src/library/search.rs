//! Finding ingredients by what a user types: the picker's ranked search and
//! the "did you mean" suggestions of error messages, from one scoring.

use super::Library;

/// How well an ingredient matches a query, best first.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord)]
pub enum MatchKind {
    /// The id, the name or a synonym is the query.
    Exact,
    /// The query is a whole word (or words) of the name or a synonym.
    Word,
    /// The name or id starts with the query.
    Prefix,
    /// The name or id contains the query.
    Substring,
    /// A synonym contains the query.
    Synonym,
    /// The category (or the pure solute's family) contains the query.
    Category,
}

/// One ingredient found by [`Library::search`].
#[derive(Debug, Clone, PartialEq)]
pub struct SearchHit {
    /// Index in [`Library::ingredients`].
    pub index: usize,
    /// Ingredient id.
    pub id: String,
    /// Display name.
    pub name: String,
    /// Category label (the solute family for a pure solute).
    pub category: &'static str,
    /// How it matched.
    pub kind: MatchKind,
    /// What matched (a synonym, the category), when not the name or id.
    pub matched: Option<String>,
}

/// Queries longer than this are not compared by edit distance (the cost
/// grows with the product of the lengths; no id is this long).
const MAX_FUZZY_CHARS: usize = super::load::MAX_ID_CHARS;

/// The longest query [`Library::search`] looks for, in characters: longer
/// than any name, synonym or category (each query is compared with every
/// ingredient's texts, so its length multiplies the work).
pub const MAX_QUERY_CHARS: usize = 200;

/// The words of `s`, lower-cased, joined by single spaces and padded with
/// one space at each end, so that `" salt "` finds the whole word.
fn padded_words(s: &str) -> String {
    let words: Vec<String> = s
        .split(|c: char| !c.is_alphanumeric())
        .filter(|w| !w.is_empty())
        .map(str::to_lowercase)
        .collect();
    format!(" {} ", words.join(" "))
}

impl Library {
    /// Ingredients matching `query` (case-insensitive): exact and
    /// whole-word matches of names and synonyms first, then prefixes,
    /// substrings, synonyms and categories; shorter names first within a
    /// kind. Empty for an empty query.
    /// A query longer than [`MAX_QUERY_CHARS`] matches nothing (no name is
    /// that long), so a pasted megabyte costs no search.
    pub fn search(&self, query: &str, limit: usize) -> Vec<SearchHit> {
        let query = query.trim();
        if query.is_empty() || query.char_indices().nth(MAX_QUERY_CHARS).is_some() {
            return Vec::new();
        }
        let q = query.to_lowercase();
        let q_words = padded_words(&q);
        let q_id = q.replace(' ', "_");
        let mut hits: Vec<SearchHit> = Vec::new();
        for (index, ing) in self.ingredients.iter().enumerate() {
            let name = ing.name().to_lowercase();
            let id = ing.id();
            let synonyms = &ing.record.synonyms;
            let solute_cat = ing
                .solutes
                .first()
                .filter(|_| ing.pure_solute)
                .map(|(s, _, _)| self.solutes[*s].record.category.label());
            let category = solute_cat.unwrap_or(ing.record.category.label());
            let synonym_where =
                |f: &dyn Fn(&str) -> bool| synonyms.iter().find(|s| f(&s.to_lowercase())).cloned();
            let words_hit = !q_words.trim().is_empty() && padded_words(&name).contains(&q_words);
            let (kind, matched) = if name == q || id == q_id {
                (MatchKind::Exact, None)
            } else if let Some(s) = synonym_where(&|s| s == q) {
                (MatchKind::Exact, Some(s))
            } else if words_hit {
                (MatchKind::Word, None)
            } else if let Some(s) = synonym_where(&|s| padded_words(s).contains(&q_words)) {
                (MatchKind::Word, Some(s))
            } else if name.starts_with(&q) || id.starts_with(&q_id) {
                (MatchKind::Prefix, None)
            } else if name.contains(&q) || id.contains(&q_id) {
                (MatchKind::Substring, None)
            } else if let Some(s) = synonym_where(&|s| s.contains(&q)) {
                (MatchKind::Synonym, Some(s))
            } else if category.contains(&q) {
                (MatchKind::Category, Some(category.to_string()))
            } else {
                continue;
            };
            hits.push(SearchHit {
                index,
                id: id.to_string(),
                name: ing.name().to_string(),
                category,
                kind,
                matched,
            });
        }
        hits.sort_by(|a, b| {
            a.kind
                .cmp(&b.kind)
                .then_with(|| a.name.len().cmp(&b.name.len()))
                .then_with(|| a.name.cmp(&b.name))
        });
        hits.truncate(limit);
        hits
    }

    /// Up to three ingredient ids close to `query` (edit distance and
    /// substring), for "did you mean" messages and a picker that found
    /// nothing. The work is bounded: only the first 64 characters of a
    /// long query are compared.
    pub fn suggest(&self, query: &str) -> Vec<String> {
        let q: String = query
            .chars()
            .take(MAX_FUZZY_CHARS)
            .collect::<String>()
            .to_lowercase();
        let mut scored: Vec<(usize, &str)> = self
            .ingredients
            .iter()
            .map(|ing| {
                let id = ing.id();
                let mut d = strsim::levenshtein(&q, id);
                if id.contains(&q) || (!id.is_empty() && q.contains(id)) {
                    d = d.min(2);
                }
                for name in std::iter::once(ing.name())
                    .chain(ing.record.synonyms.iter().map(String::as_str))
                {
                    let n = name.to_lowercase();
                    if n.contains(&q) {
                        d = d.min(2);
                    }
                    d = d.min(strsim::levenshtein(&q, &n) + 1);
                }
                (d, id)
            })
            .collect();
        scored.sort();
        let limit = (q.chars().count() / 2).max(3);
        scored
            .into_iter()
            .filter(|(d, _)| *d <= limit)
            .take(3)
            .map(|(_, id)| id.to_string())
            .collect()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn whole_words_rank_before_prefixes() {
        let lib = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        let hits = lib.search("salt", 10);
        let first = hits.first().map(|h| h.kind);
        assert!(
            matches!(first, Some(MatchKind::Exact | MatchKind::Word)),
            "{hits:?}"
        );
        assert!(
            hits[0]
                .name
                .to_lowercase()
                .split_whitespace()
                .any(|w| w == "salt"),
            "{hits:?}"
        );
        // A megabyte pasted into the picker finds nothing, at no cost.
        assert!(lib.search(&"sugar ".repeat(200_000), 10).is_empty());
        assert!(lib.suggest(&"a".repeat(1_000_000)).len() <= 3);
        // The exact id wins over everything.
        assert_eq!(
            lib.search("sucrose", 5).first().map(|h| h.id.as_str()),
            Some("sucrose")
        );
    }
}

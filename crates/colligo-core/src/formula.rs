//! Formulas: lists of (ingredient, amount), and the composition they make.

use serde::{Deserialize, Serialize};

use crate::composition::Composition;
use crate::error::FormulaError;
use crate::library::Library;
use crate::quantity::{Amount, AmountUnit, parse_amount};

/// The largest amount one line may hold, kg (10⁶ t): far above any batch,
/// low enough that sums, moles and molalities stay finite numbers.
pub const MAX_LINE_KG: f64 = 1.0e9;
/// One line of a formula.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Line {
    /// Ingredient id (composite ingredient, library solute, or `water`).
    pub ingredient: String,
    /// The amount, in `unit`.
    pub amount: f64,
    /// Unit of `amount`.
    pub unit: AmountUnit,
}

impl Line {
    /// A line in grams.
    pub fn grams(ingredient: &str, g: f64) -> Self {
        Line {
            ingredient: ingredient.to_string(),
            amount: g,
            unit: AmountUnit::G,
        }
    }

    /// The amount with its unit.
    pub fn amount(&self) -> Amount {
        Amount {
            value: self.amount,
            unit: self.unit,
        }
    }
}

/// A named formula (one variant of a project).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize, Default)]
#[serde(deny_unknown_fields)]
pub struct Formula {
    /// Name shown in the variant list.
    pub name: String,
    /// Free notes.
    #[serde(default)]
    pub notes: String,
    /// The lines, in the user's order.
    pub lines: Vec<Line>,
}

/// A formula resolved against a library.
#[derive(Debug, Clone, PartialEq)]
pub struct Resolved {
    /// The composition.
    pub composition: Composition,
    /// Mass of each line, kg (percent lines resolved against the batch).
    pub line_kg: Vec<f64>,
    /// Library ingredient index of each line.
    pub line_ingredient: Vec<usize>,
}

impl Resolved {
    /// Mass of the first line of ingredient `id`, kg (0 when absent) — the
    /// line a sweep or a goal seek varies.
    pub fn kg_of(&self, formula: &Formula, id: &str) -> f64 {
        formula
            .lines
            .iter()
            .zip(&self.line_kg)
            .find(|(l, _)| l.ingredient == id)
            .map_or(0.0, |(_, kg)| *kg)
    }
}

impl Formula {
    /// A formula from lines.
    pub fn new(name: &str, lines: Vec<Line>) -> Self {
        Formula {
            name: name.to_string(),
            notes: String::new(),
            lines,
        }
    }

    /// Resolves ingredients and amounts into a composition. Percent lines
    /// are shares of the whole batch: batch = Σ weighed / (1 − Σ % / 100).
    /// A formula of percentages only is taken on a 1 kg basis and must add
    /// up to 100 %.
    ///
    /// # Errors
    /// Unknown ingredients (with suggestions), negative or non-finite
    /// amounts, a line above [`MAX_LINE_KG`], percentages that leave no room.
    pub fn resolve(&self, lib: &Library) -> Result<Resolved, FormulaError> {
        let mut weighed = 0.0;
        let mut pct = 0.0;
        let mut idx = Vec::with_capacity(self.lines.len());
        for line in &self.lines {
            let i = lib.ingredient_or_suggest(line.ingredient.trim())?;
            idx.push(i);
            if !(line.amount.is_finite() && line.amount >= 0.0) {
                return Err(FormulaError::NegativeAmount {
                    ingredient: line.ingredient.clone(),
                    value: line.amount,
                });
            }
            match line.amount().kg() {
                Some(kg) => weighed += kg,
                None => pct += line.amount,
            }
        }
        let batch = if pct == 0.0 {
            weighed
        } else if weighed == 0.0 {
            if (pct - 100.0).abs() > 1e-6 {
                return Err(FormulaError::PercentOverflow { total: pct });
            }
            1.0
        } else if pct < 100.0 {
            weighed / (1.0 - pct / 100.0)
        } else {
            return Err(FormulaError::PercentOverflow { total: pct });
        };
        let mut comp = Composition::new();
        let mut line_kg = Vec::with_capacity(self.lines.len());
        for (line, &i) in self.lines.iter().zip(&idx) {
            let kg = line.amount().kg().unwrap_or(line.amount / 100.0 * batch);
            if kg.is_nan() || kg > MAX_LINE_KG {
                return Err(FormulaError::TooLarge {
                    ingredient: line.ingredient.clone(),
                    kg,
                    max_kg: MAX_LINE_KG,
                });
            }
            comp.add_ingredient(lib, i, kg);
            line_kg.push(kg);
        }
        Ok(Resolved {
            composition: comp,
            line_kg,
            line_ingredient: idx,
        })
    }

    /// The composition only.
    ///
    /// # Errors
    /// As [`Formula::resolve`].
    pub fn composition(&self, lib: &Library) -> Result<Composition, FormulaError> {
        Ok(self.resolve(lib)?.composition)
    }
}

/// Reads a mix written as `water=100g, sucrose=50g, sodium_chloride=2 g`
/// (also `;` or new lines between items, `:` instead of `=`).
///
/// # Errors
/// [`FormulaError::BadMix`] or [`FormulaError::BadAmount`].
pub fn parse_mix(text: &str) -> Result<Vec<Line>, FormulaError> {
    let mut lines = Vec::new();
    for part in text.split([',', ';', '\n']) {
        let part = part.trim();
        if part.is_empty() {
            continue;
        }
        let Some((id, amount)) = part.split_once(['=', ':']) else {
            return Err(FormulaError::BadMix {
                text: part.to_string(),
                reason: "expected ingredient=amount, e.g. sucrose=50g".into(),
            });
        };
        let id = id.trim();
        if id.is_empty() {
            return Err(FormulaError::BadMix {
                text: part.to_string(),
                reason: "missing ingredient id".into(),
            });
        }
        let a = parse_amount(amount)?;
        lines.push(Line {
            ingredient: id.to_string(),
            amount: a.value,
            unit: a.unit,
        });
    }
    if lines.is_empty() {
        return Err(FormulaError::BadMix {
            text: text.to_string(),
            reason: "no ingredients".into(),
        });
    }
    Ok(lines)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn mix_parses() {
        let l = parse_mix("water=100g, sucrose = 50 g; salt:2kg").unwrap_or_default();
        assert_eq!(l.len(), 3);
        assert_eq!(l[2].ingredient, "salt");
        assert_eq!(l[2].unit, AmountUnit::Kg);
        assert!(parse_mix("water 100g").is_err());
        assert!(parse_mix("").is_err());
        assert!(parse_mix("water=lots").is_err());
    }

    #[test]
    fn percent_lines_resolve_against_batch() {
        let lib = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        let f = Formula::new(
            "t",
            vec![
                Line::grams("water", 80.0),
                Line {
                    ingredient: "sucrose".into(),
                    amount: 20.0,
                    unit: AmountUnit::Percent,
                },
            ],
        );
        let r = f.resolve(&lib).unwrap_or_else(|e| panic!("{e}"));
        assert!((r.line_kg[1] - 0.020).abs() < 1e-12);
        assert!((r.composition.total_kg() - 0.1).abs() < 1e-12);
    }

    #[test]
    fn unknown_ingredient_suggests() {
        let lib = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        let f = Formula::new("t", vec![Line::grams("sucrse", 1.0)]);
        match f.resolve(&lib) {
            Err(FormulaError::Library(crate::LibraryError::UnknownIngredient {
                suggestions,
                ..
            })) => {
                assert!(suggestions.iter().any(|s| s == "sucrose"));
            }
            other => panic!("{other:?}"),
        }
    }
}

//! Every applicable model side by side: the a_w and freezing point of a
//! composition under each concrete model, and the spread of those that
//! have data for every solute — an honest uncertainty band.

use super::{Conditions, Wanted, evaluate};
use crate::composition::Composition;
use crate::error::ModelError;
use crate::library::Library;
use crate::models::Model;
use crate::warnings::Warning;

/// The a_w and freezing point under one model.
#[derive(Debug, Clone, PartialEq)]
pub struct ModelResult {
    /// The model.
    pub model: Model,
    /// a_w, or why not.
    pub water_activity: Result<f64, ModelError>,
    /// Freezing point, °C.
    pub freezing_point_c: Option<f64>,
    /// Whether the model has parameters for every solute here (no
    /// "treated as ideal" or "folded in by Ross's rule" substitutions).
    pub applicable: bool,
}

/// Every model's result and the band of the applicable ones.
#[derive(Debug, Clone, PartialEq)]
pub struct Spread {
    /// One result per concrete model, in [`Model::ALL`] order.
    pub results: Vec<ModelResult>,
    /// Lowest and highest a_w among the applicable models other than
    /// `ideal`, when at least two remain.
    pub band: Option<(f64, f64)>,
}

/// Evaluates `comp` under every concrete model at `cond`.
pub fn compare_models(lib: &Library, comp: &Composition, cond: &Conditions) -> Spread {
    let results: Vec<ModelResult> = Model::ALL
        .iter()
        .map(|&m| {
            let p = evaluate(
                lib,
                comp,
                m.into(),
                cond,
                Wanted {
                    freezing_point: true,
                    ..Wanted::WATER_ACTIVITY
                },
            );
            match p {
                Ok(p) => ModelResult {
                    model: m,
                    water_activity: Ok(p.water_activity),
                    freezing_point_c: p.freezing_point_c,
                    applicable: !p.warnings.iter().any(|w| {
                        matches!(
                            w,
                            Warning::TreatedAsIdeal { .. } | Warning::VolatileByRoss { .. }
                        )
                    }),
                },
                Err(e) => ModelResult {
                    model: m,
                    water_activity: Err(e),
                    freezing_point_c: None,
                    applicable: false,
                },
            }
        })
        .collect();
    let band = band_of(&results);
    Spread { results, band }
}

fn band_of(c: &[ModelResult]) -> Option<(f64, f64)> {
    let vals: Vec<f64> = c
        .iter()
        .filter(|r| r.applicable && r.model != Model::Ideal)
        .filter_map(|r| r.water_activity.as_ref().ok().copied())
        .collect();
    if vals.len() < 2 {
        return None;
    }
    let lo = vals.iter().copied().fold(f64::INFINITY, f64::min);
    let hi = vals.iter().copied().fold(f64::NEG_INFINITY, f64::max);
    Some((lo, hi))
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::formula::{Formula, Line};

    #[test]
    fn band_spans_the_applicable_models() {
        let lib = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        let f = Formula::new(
            "mix",
            vec![
                Line::grams("water", 100.0),
                Line::grams("sucrose", 60.0),
                Line::grams("glycerol", 10.0),
            ],
        );
        let comp = f.composition(&lib).unwrap_or_else(|e| panic!("{e}"));
        let s = compare_models(&lib, &comp, &Conditions::default());
        assert_eq!(s.results.len(), Model::ALL.len());
        // Non-electrolytes only: Pitzer counts them ideally, so it is not
        // applicable; Norrish, Ross and ZSR are.
        let pitzer = s.results.iter().find(|r| r.model == Model::Pitzer);
        assert!(pitzer.is_some_and(|r| !r.applicable));
        let (lo, hi) = s.band.unwrap_or((f64::NAN, f64::NAN));
        for r in &s.results {
            if r.applicable && r.model != Model::Ideal {
                let aw = r.water_activity.clone().unwrap_or(f64::NAN);
                assert!(aw >= lo && aw <= hi, "{}: {aw} outside {lo}–{hi}", r.model);
            }
        }
        assert!(hi > lo);
    }
}

//! What each line of a formula contributes: its share of the batch, of the
//! undissolved solids and of the lowering of ln a_w (each solute's share
//! split among the lines that bring it, by mass).

use super::Properties;
use crate::formula::Resolved;
use crate::library::Library;

/// One line's computed columns.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct LineShare {
    /// Mass, g.
    pub grams: f64,
    /// Share of the batch, %.
    pub percent: f64,
    /// Solutes of this line that stay undissolved, g.
    pub undissolved_g: f64,
    /// This line's share of the lowering of ln a_w, % (sums to 100).
    pub lowering_percent: f64,
}

/// The computed columns of every line of `r`; without `props` (the
/// evaluation failed) only masses and shares of the batch.
pub fn line_shares(lib: &Library, r: &Resolved, props: Option<&Properties>) -> Vec<LineShare> {
    let total: f64 = r.line_kg.iter().sum();
    let mut out: Vec<LineShare> = r
        .line_kg
        .iter()
        .map(|kg| LineShare {
            grams: kg * 1000.0,
            percent: if total > 0.0 { 100.0 * kg / total } else { 0.0 },
            ..LineShare::default()
        })
        .collect();
    let Some(p) = props else { return out };
    let ln_total: f64 = p.solutes.iter().map(|s| s.ln_aw_share).sum();
    for s in &p.solutes {
        let Some(si) = lib.solute(&s.id) else {
            continue;
        };
        // kg of this solute brought by each line.
        let by_line: Vec<f64> = r
            .line_ingredient
            .iter()
            .zip(&r.line_kg)
            .map(|(&ing, &kg)| {
                lib.ingredients[ing]
                    .solutes
                    .iter()
                    .filter(|(s2, _, _)| *s2 == si)
                    .map(|(_, frac, _)| frac * kg)
                    .sum::<f64>()
            })
            .collect();
        let sum: f64 = by_line.iter().sum();
        if sum <= 0.0 {
            continue;
        }
        for (info, kg) in out.iter_mut().zip(&by_line) {
            let f = kg / sum;
            info.undissolved_g += f * s.undissolved_g;
            if ln_total != 0.0 {
                info.lowering_percent += 100.0 * f * s.ln_aw_share / ln_total;
            }
        }
    }
    out
}

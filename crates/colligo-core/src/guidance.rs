//! Stability guidance: the published growth limits and regulatory cut-offs
//! on the a_w scale for a kind of product (`assets/thresholds.ron`, each
//! line with its source), and where a formula's a_w falls among them.

use crate::library::{Audience, Library, ThresholdRecord};

/// The lines for `audience`, highest a_w first.
pub fn lines_for(lib: &Library, audience: Audience) -> Vec<&ThresholdRecord> {
    let mut v: Vec<&ThresholdRecord> = lib
        .thresholds
        .iter()
        .filter(|t| t.audience.contains(&audience))
        .collect();
    v.sort_by(|a, b| b.water_activity.total_cmp(&a.water_activity));
    v
}

/// The nearest lines at or below and above `aw`.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Nearest<'a> {
    /// The highest line at or below a_w.
    pub below: Option<&'a ThresholdRecord>,
    /// The lowest line above a_w.
    pub above: Option<&'a ThresholdRecord>,
}

/// Where `aw` falls among `lines`.
pub fn nearest<'a>(lines: &[&'a ThresholdRecord], aw: f64) -> Nearest<'a> {
    let below = lines
        .iter()
        .copied()
        .filter(|t| t.water_activity <= aw)
        .max_by(|x, y| x.water_activity.total_cmp(&y.water_activity));
    let above = lines
        .iter()
        .copied()
        .filter(|t| t.water_activity > aw)
        .min_by(|x, y| x.water_activity.total_cmp(&y.water_activity));
    Nearest { below, above }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn nearest_lines_bracket_the_value() {
        let lib = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        let lines = lines_for(&lib, Audience::Food);
        assert!(
            lines
                .windows(2)
                .all(|w| w[0].water_activity >= w[1].water_activity)
        );
        let n = nearest(&lines, 0.88);
        let (b, a) = (
            n.below.map(|t| t.water_activity),
            n.above.map(|t| t.water_activity),
        );
        assert!(
            b.is_some_and(|b| b <= 0.88) && a.is_some_and(|a| a > 0.88),
            "{b:?} {a:?}"
        );
        // No line lies strictly between the two.
        assert!(!lines.iter().any(|t| {
            b.is_some_and(|b| t.water_activity > b) && a.is_some_and(|a| t.water_activity < a)
        }));
    }
}

//! Warnings on an evaluation: solubility (undissolved solute, extrapolated
//! curves), and the validity of each solute's parameters under the model in
//! use (treated as ideal, beyond the data's concentration or temperature).

use crate::library::{Library, SoluteKind};
use crate::models::{Model, Solution, Treatment};
use crate::warnings::Warning;
use crate::water::{M_W, T_ZERO_C};

/// Validity and solubility warnings for one evaluated solution.
pub(super) fn diagnose(lib: &Library, sol: &Solution) -> Vec<Warning> {
    let ln_aw_total = sol.ln_aw;
    let model = sol.model;
    let w = sol.water_kg;
    let t_c = sol.temperature_k - T_ZERO_C;
    let mut out = Vec::new();
    let nw = w / M_W;
    let mut particles = 0.0;
    for (i, c) in sol.solutes.iter().enumerate() {
        let s = &lib.solutes[c.solute];
        let id = s.id().to_string();
        let dissolved = c.dissolved_mol;
        particles += c.nu * dissolved;
        if let Some(rec) = &s.record.solubility {
            let (lo, hi) = rec.g_per_100g_water.range();
            if c.total_mol > dissolved * (1.0 + 1e-12) {
                out.push(Warning::Undissolved {
                    solute: id.clone(),
                    undissolved_g: (c.total_mol - dissolved) * s.molar_mass * 1000.0,
                    solubility_g_per_100g_water: rec.g_per_100g_water.eval(t_c),
                    t_c,
                });
            }
            if (t_c < lo || t_c > hi) && c.total_mol > 0.5 * c.solubility_mol_per_kg * w {
                out.push(Warning::SolubilityExtrapolated {
                    solute: id.clone(),
                    t_c,
                    range_c: (lo, hi),
                });
            }
        }
        let m = sol.molality(i);
        if let SoluteKind::Volatile(v) = &s.record.kind
            && c.total_mol > 0.0
            && t_c < v.wilson.partial_pressure_t_min_c - 0.5
        {
            out.push(Warning::CosolventPressureUnreliable {
                solute: id.clone(),
                t_c,
                t_min_c: v.wilson.partial_pressure_t_min_c,
            });
        }
        // Where each binary is used, and whether the solute matters enough
        // for its parameters' range to matter (≥ 5 % of the result).
        let (m_used, basis, significant) = match model {
            Model::Zsr => {
                let m0 = c.zsr_molality.unwrap_or(m).max(m);
                let term = if m0 > 0.0 { m / m0 } else { 0.0 };
                (
                    m0,
                    "binary at the mixture's a_w (ZSR)",
                    term >= 0.05 || sol.solutes.len() == 1,
                )
            }
            Model::Grouped => (
                c.zsr_molality.unwrap_or(m).max(m),
                "its group's share of the water (grouped ZSR)",
                true,
            ),
            Model::Ross => {
                let share = if ln_aw_total != 0.0 {
                    c.binary_ln_aw / ln_aw_total
                } else {
                    1.0
                };
                (m, "own concentration (Ross)", share >= 0.05)
            }
            _ => (m, "own concentration", true),
        };
        match model.treatment(c.role) {
            Treatment::Ideal => {}
            Treatment::TreatedAsIdeal { why } => out.push(Warning::TreatedAsIdeal {
                solute: id.clone(),
                model,
                why: why.into(),
            }),
            Treatment::VolatileByRoss => {
                out.push(Warning::VolatileByRoss {
                    solute: id.clone(),
                    model,
                });
                binary_validity(
                    lib,
                    c.solute,
                    model,
                    m_used,
                    basis,
                    significant,
                    t_c,
                    &mut out,
                );
            }
            Treatment::OwnData => binary_validity(
                lib,
                c.solute,
                model,
                m_used,
                basis,
                significant,
                t_c,
                &mut out,
            ),
        }
    }
    if model == Model::Ideal {
        let xs = particles / (particles + nw);
        if xs > 0.02 {
            out.push(Warning::IdealConcentrated {
                solute_mole_fraction: xs,
            });
        }
    }
    out
}

/// Validity checks of one solute's parameters at molality `m`.
#[allow(clippy::too_many_arguments)]
fn binary_validity(
    lib: &Library,
    solute: usize,
    model: Model,
    m: f64,
    basis: &str,
    significant: bool,
    t_c: f64,
    out: &mut Vec<Warning>,
) {
    let s = &lib.solutes[solute];
    let id = s.id().to_string();
    let kind = best_kind(lib, solute);
    if !significant && !matches!(kind, BinaryKind::Ideal) {
        return;
    }
    // The concentration and temperature ranges of the data behind the
    // parameters this solute's binary uses.
    let (concentration, t_range) = match kind {
        BinaryKind::Pitzer(pair) => {
            let p = &lib.pitzer.pairs[pair];
            (Some((m, p.max_molality, "mol/kg")), Some(p.t_range_c))
        }
        BinaryKind::Norrish => match &s.record.norrish {
            Some(n) => (
                Some((
                    m * M_W / (1.0 + m * M_W),
                    n.max_mole_fraction,
                    "mole fraction",
                )),
                Some(n.t_range_c),
            ),
            None => (None, None),
        },
        BinaryKind::Wilson => match &s.record.kind {
            SoluteKind::Volatile(v) => (
                Some((
                    m * s.molar_mass / (1.0 + m * s.molar_mass),
                    v.wilson.max_mass_fraction,
                    "mass fraction (salt-free)",
                )),
                Some(v.wilson.t_range_c),
            ),
            _ => (None, None),
        },
        BinaryKind::Ideal => {
            out.push(Warning::NoNonIdealityData { solute: id, model });
            return;
        }
    };
    if let Some((value, max, unit)) = concentration
        && value > max * (1.0 + 1e-9)
    {
        out.push(Warning::BeyondValidatedConcentration {
            solute: id.clone(),
            model,
            value,
            max,
            unit: unit.into(),
            basis: basis.into(),
        });
    }
    if let Some(range_c) = t_range
        && (t_c < range_c.0 - 0.5 || t_c > range_c.1 + 0.5)
    {
        out.push(Warning::BeyondValidatedTemperature {
            solute: id,
            model,
            t_c,
            range_c,
        });
    }
}

enum BinaryKind {
    Pitzer(usize),
    Norrish,
    Wilson,
    Ideal,
}

fn best_kind(lib: &Library, solute: usize) -> BinaryKind {
    // The same choice as `models::binary::best_binary`, read off the record.
    let s = &lib.solutes[solute];
    if s.volatile().is_some() {
        BinaryKind::Wilson
    } else if let Some(p) = s.pair {
        BinaryKind::Pitzer(p)
    } else if !s.is_electrolyte() && s.record.norrish.is_some() {
        BinaryKind::Norrish
    } else {
        BinaryKind::Ideal
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::composition::Composition;
    use crate::models::ModelChoice;
    use crate::models::binary::{Binary, best_binary};
    use crate::properties::{Conditions, Wanted, evaluate};

    /// Ethanol's Wilson fit is checked to 40 % (salt-free mass fraction) and
    /// its own partial pressure from 10 °C (the limits in its record, from
    /// the fit residuals quoted there); results beyond either say so.
    #[test]
    fn ethanol_beyond_its_fit_is_flagged() {
        let lib = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        let e = lib.solute("ethanol").unwrap_or_else(|| panic!("ethanol"));
        let mm = lib.solutes[e].molar_mass;
        let run = |ethanol_g: f64, t_c: f64| {
            let mut c = Composition::new();
            c.add_water((100.0 - ethanol_g) / 1000.0);
            c.add_solute(e, ethanol_g / 1000.0, mm);
            let cond = Conditions {
                temperature_k: T_ZERO_C + t_c,
                ..Conditions::default()
            };
            evaluate(&lib, &c, ModelChoice::Auto, &cond, Wanted::WATER_ACTIVITY)
                .unwrap_or_else(|err| panic!("{err}"))
                .warnings
        };
        let beyond = |w: &[Warning]| {
            w.iter()
                .any(|w| matches!(w, Warning::BeyondValidatedConcentration { solute, .. } if solute == "ethanol"))
        };
        let pressure = |w: &[Warning]| {
            w.iter()
                .any(|w| matches!(w, Warning::CosolventPressureUnreliable { .. }))
        };
        let ok = run(39.9, 25.0);
        assert!(!beyond(&ok) && !pressure(&ok), "{ok:?}");
        let strong = run(45.0, 25.0);
        assert!(beyond(&strong), "{strong:?}");
        // The same limits hold where another model folds ethanol in by Ross's rule.
        let mut c = Composition::new();
        c.add_water(0.055);
        c.add_solute(e, 0.045, mm);
        for model in [ModelChoice::Norrish, ModelChoice::Pitzer] {
            let w = evaluate(
                &lib,
                &c,
                model,
                &Conditions::default(),
                Wanted::WATER_ACTIVITY,
            )
            .unwrap_or_else(|err| panic!("{err}"))
            .warnings;
            assert!(beyond(&w), "{model}: {w:?}");
        }
        let cold = run(20.0, 4.0);
        assert!(pressure(&cold) && !beyond(&cold), "{cold:?}");
    }

    #[test]
    fn validity_checks_use_the_binary_the_models_use() {
        let lib = Library::builtin().unwrap_or_else(|e| panic!("{e}"));
        for i in 0..lib.solutes.len() {
            let same = matches!(
                (best_kind(&lib, i), best_binary(&lib, i, 298.15)),
                (BinaryKind::Pitzer(_), Binary::Pitzer(_))
                    | (BinaryKind::Norrish, Binary::Norrish { .. })
                    | (BinaryKind::Wilson, Binary::Wilson(_))
                    | (BinaryKind::Ideal, Binary::Ideal { .. })
            );
            assert!(same, "{}", lib.solutes[i].id());
        }
    }
}

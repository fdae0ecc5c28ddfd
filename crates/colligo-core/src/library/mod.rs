//! The library of solutes, ions, Pitzer parameters, ingredients and guidance
//! lines: loaded from the RON files in `assets/` (embedded at compile time),
//! checked, and indexed for fast lookup.

pub mod records;

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

fn parse<T: serde::de::DeserializeOwned>(file: &str, text: &str) -> Result<T, LibraryError> {
    ron::from_str(text).map_err(|e| LibraryError::Parse {
        file: file.to_string(),
        message: e.to_string(),
    })
}

impl Library {
    /// The built-in library. Parsed once per call; the app and command
    /// line keep one instance.
    ///
    /// # Errors
    /// Only if the embedded data is broken, which the test suite rules out.
    pub fn builtin() -> Result<Self, LibraryError> {
        Self::from_texts(&LibraryTexts::BUILTIN)
    }

    /// Builds a library from the texts of its data files.
    ///
    /// # Errors
    /// Parse errors, duplicate ids, dangling references, compositions that
    /// do not add up.
    pub fn from_texts(texts: &LibraryTexts<'_>) -> Result<Self, LibraryError> {
        let mut lib = Library {
            sources: Vec::new(),
            solutes: Vec::new(),
            ions: Vec::new(),
            pitzer: PitzerData::default(),
            ingredients: Vec::new(),
            thresholds: Vec::new(),
            solute_index: HashMap::new(),
            ion_index: HashMap::new(),
            ingredient_index: HashMap::new(),
            source_index: HashMap::new(),
        };
        for (file, text) in texts.sources {
            let f: SourceFile = parse(file, text)?;
            for s in f.sources {
                if lib
                    .source_index
                    .insert(s.key.clone(), lib.sources.len())
                    .is_some()
                {
                    return Err(LibraryError::Duplicate {
                        what: "source",
                        id: s.key,
                    });
                }
                lib.sources.push(s);
            }
        }
        for (file, text) in texts.pitzer {
            lib.add_pitzer(parse(file, text)?)?;
        }
        for (file, text) in texts.solutes {
            let f: SoluteFile = parse(file, text)?;
            for s in f.solutes {
                lib.add_solute(s, false)?;
            }
        }
        for (file, text) in texts.ingredients {
            let f: IngredientFile = parse(file, text)?;
            for rec in f.ingredients {
                lib.add_ingredient(rec, false)?;
            }
        }
        lib.add_pure_solute_ingredients()?;
        for (file, text) in texts.thresholds {
            let f: ThresholdFile = parse(file, text)?;
            for t in f.thresholds {
                lib.check_cite(&t.source, &t.id)?;
                if !(0.0..=1.0).contains(&t.water_activity) {
                    return Err(LibraryError::Invalid {
                        id: t.id,
                        message: format!("water activity {} outside [0, 1]", t.water_activity),
                    });
                }
                lib.thresholds.push(t);
            }
        }
        Ok(lib)
    }

    fn check_cite(&self, cite: &Cite, owner: &str) -> Result<(), LibraryError> {
        if self.source_index.contains_key(&cite.key) {
            Ok(())
        } else {
            Err(LibraryError::UnknownSource {
                key: cite.key.clone(),
                owner: owner.to_string(),
            })
        }
    }

    fn ion_idx(&self, id: &str, owner: &str) -> Result<IonIdx, LibraryError> {
        self.ion_index
            .get(id)
            .copied()
            .ok_or_else(|| LibraryError::Invalid {
                id: owner.to_string(),
                message: format!("unknown ion `{id}`"),
            })
    }

    fn add_pitzer(&mut self, file: PitzerFile) -> Result<(), LibraryError> {
        for ion in file.ions {
            if self
                .ion_index
                .insert(ion.id.clone(), self.ions.len())
                .is_some()
            {
                return Err(LibraryError::Duplicate {
                    what: "ion",
                    id: ion.id,
                });
            }
            let z = f64::from(ion.charge);
            self.ions.push(Ion { record: ion, z });
        }
        for p in file.pairs {
            let owner = format!("{}/{}", p.cation, p.anion);
            self.check_cite(&p.source, &owner)?;
            let third: Vec<&TempFn> = match &p.c {
                ThirdVirial::CPhi(f) => vec![f],
                ThirdVirial::C0C1 { c0, c1, .. } => vec![c0, c1],
            };
            for f in [&p.beta0, &p.beta1, &p.beta2].into_iter().chain(third) {
                f.check().map_err(|source| LibraryError::Correlation {
                    id: owner.clone(),
                    field: "Pitzer parameters",
                    source,
                })?;
            }
            let c = self.ion_idx(&p.cation, &owner)?;
            let a = self.ion_idx(&p.anion, &owner)?;
            if self.ions[c].z <= 0.0 || self.ions[a].z >= 0.0 {
                return Err(LibraryError::Invalid {
                    id: owner,
                    message: "a pair needs a cation then an anion".into(),
                });
            }
            let idx = self.pitzer.pairs.len();
            if self.pitzer.pair_index.insert((c, a), idx).is_some() {
                return Err(LibraryError::Duplicate {
                    what: "Pitzer pair",
                    id: owner,
                });
            }
            self.pitzer.pairs.push(p);
        }
        for t in file.thetas {
            let owner = format!("θ {}/{}", t.ions.0, t.ions.1);
            self.check_cite(&t.source, &owner)?;
            let i = self.ion_idx(&t.ions.0, &owner)?;
            let j = self.ion_idx(&t.ions.1, &owner)?;
            if self.ions[i].z.signum() != self.ions[j].z.signum() || i == j {
                return Err(LibraryError::Invalid {
                    id: owner,
                    message: "θ needs two different ions of like sign".into(),
                });
            }
            t.theta
                .check()
                .map_err(|source| LibraryError::Correlation {
                    id: owner.clone(),
                    field: "theta",
                    source,
                })?;
            let key = (i.min(j), i.max(j));
            if self
                .pitzer
                .theta
                .insert(key, self.pitzer.thetas.len())
                .is_some()
            {
                return Err(LibraryError::Duplicate {
                    what: "θ",
                    id: owner,
                });
            }
            self.pitzer.thetas.push(t);
        }
        for p in file.psis {
            let owner = format!("ψ {}/{}/{}", p.ions.0, p.ions.1, p.ions.2);
            self.check_cite(&p.source, &owner)?;
            let i = self.ion_idx(&p.ions.0, &owner)?;
            let j = self.ion_idx(&p.ions.1, &owner)?;
            let k = self.ion_idx(&p.ions.2, &owner)?;
            if self.ions[i].z.signum() != self.ions[j].z.signum()
                || self.ions[k].z.signum() == self.ions[i].z.signum()
            {
                return Err(LibraryError::Invalid {
                    id: owner,
                    message: "ψ needs two like-sign ions, then one of opposite sign".into(),
                });
            }
            p.psi.check().map_err(|source| LibraryError::Correlation {
                id: owner.clone(),
                field: "psi",
                source,
            })?;
            let key = (i.min(j), i.max(j), k);
            if self
                .pitzer
                .psi
                .insert(key, self.pitzer.psis.len())
                .is_some()
            {
                return Err(LibraryError::Duplicate {
                    what: "ψ",
                    id: owner,
                });
            }
            self.pitzer.psis.push(p);
        }
        Ok(())
    }

    /// Adds a solute (built-in or user-defined). Its pure-solute ingredient
    /// comes with [`Library::add_user_solute`] or, for built-in solutes,
    /// when the whole library is built.
    ///
    /// # Errors
    /// Duplicate id, bad molar mass, unknown ions or sources.
    pub fn add_solute(&mut self, rec: SoluteRecord, user: bool) -> Result<SoluteIdx, LibraryError> {
        check_id(&rec.id)?;
        if self.solute_index.contains_key(&rec.id) || rec.id == WATER_ID {
            return Err(LibraryError::Duplicate {
                what: "solute",
                id: rec.id,
            });
        }
        if !(rec.molar_mass_g_per_mol.is_finite() && rec.molar_mass_g_per_mol > 1.0) {
            return Err(LibraryError::Invalid {
                id: rec.id,
                message: format!("molar mass {} g/mol is not valid", rec.molar_mass_g_per_mol),
            });
        }
        if !user {
            self.check_cite(&rec.molar_mass_source, &rec.id)?;
        }
        let mut ions = Vec::new();
        let mut pair = None;
        if let SoluteKind::Electrolyte { ions: list } = &rec.kind {
            if list.is_empty() {
                return Err(LibraryError::Invalid {
                    id: rec.id,
                    message: "an electrolyte needs its ions".into(),
                });
            }
            for ic in list {
                let i = self.ion_idx(&ic.ion, &rec.id)?;
                ions.push((i, f64::from(ic.count)));
            }
            let charge: f64 = ions.iter().map(|(i, n)| self.ions[*i].z * n).sum();
            if charge.abs() > 1e-12 {
                return Err(LibraryError::Invalid {
                    id: rec.id,
                    message: format!("ions do not balance (net charge {charge})"),
                });
            }
            let cations: Vec<_> = ions.iter().filter(|(i, _)| self.ions[*i].z > 0.0).collect();
            let anions: Vec<_> = ions.iter().filter(|(i, _)| self.ions[*i].z < 0.0).collect();
            if let ([c], [a]) = (cations.as_slice(), anions.as_slice()) {
                pair = self.pitzer.pair_index.get(&(c.0, a.0)).copied();
            }
        }
        if let Some(n) = &rec.norrish {
            if !user {
                self.check_cite(&n.source, &rec.id)?;
            }
            n.k.check().map_err(|source| LibraryError::Correlation {
                id: rec.id.clone(),
                field: "norrish.k",
                source,
            })?;
        }
        if let Some(s) = &rec.solubility {
            if !user {
                self.check_cite(&s.source, &rec.id)?;
            }
            s.g_per_100g_water
                .check()
                .map_err(|source| LibraryError::Correlation {
                    id: rec.id.clone(),
                    field: "solubility.g_per_100g_water",
                    source,
                })?;
        }
        if let SoluteKind::Volatile(v) = &rec.kind {
            for f in [&v.wilson.a12_j_per_mol, &v.wilson.a21_j_per_mol] {
                f.check().map_err(|source| LibraryError::Correlation {
                    id: rec.id.clone(),
                    field: "kind.wilson",
                    source,
                })?;
            }
            let w = &v.wilson;
            let usable = (0.0..=1.0).contains(&w.max_mass_fraction)
                && w.max_mass_fraction > 0.0
                && w.partial_pressure_t_min_c.is_finite();
            if !usable {
                return Err(LibraryError::Invalid {
                    id: rec.id.clone(),
                    message: "wilson: max_mass_fraction must be in (0, 1] and partial_pressure_t_min_c finite".into(),
                });
            }
            if !user {
                self.check_cite(&v.wilson.source, &rec.id)?;
                self.check_cite(&v.antoine.source, &rec.id)?;
            }
        }
        let nu = if ions.is_empty() {
            1.0
        } else {
            ions.iter().map(|(_, n)| n).sum()
        };
        let idx = self.solutes.len();
        self.solute_index.insert(rec.id.clone(), idx);
        self.solutes.push(Solute {
            molar_mass: rec.molar_mass_g_per_mol / 1000.0,
            record: rec,
            ions,
            nu,
            pair,
            user_defined: user,
        });
        Ok(idx)
    }

    /// Adds a composite ingredient.
    ///
    /// # Errors
    /// Duplicate id, unknown solute, composition not adding up to 100 g.
    pub fn add_ingredient(
        &mut self,
        rec: IngredientRecord,
        user: bool,
    ) -> Result<usize, LibraryError> {
        check_id(&rec.id)?;
        if self.ingredient_index.contains_key(&rec.id) {
            return Err(LibraryError::Duplicate {
                what: "ingredient",
                id: rec.id,
            });
        }
        if !user {
            self.check_cite(&rec.source, &rec.id)?;
        }
        let mut solutes = Vec::new();
        let mut total = rec.water_g_per_100g + rec.insoluble.total();
        let parts = [
            rec.water_g_per_100g,
            rec.insoluble.fat,
            rec.insoluble.protein,
            rec.insoluble.starch,
            rec.insoluble.fibre,
            rec.insoluble.other,
        ];
        if parts.iter().any(|v| !v.is_finite() || *v < 0.0) {
            return Err(LibraryError::Invalid {
                id: rec.id,
                message: "negative or non-finite composition".into(),
            });
        }
        for s in &rec.solutes {
            let Some(&i) = self.solute_index.get(&s.solute) else {
                return Err(LibraryError::Invalid {
                    id: rec.id.clone(),
                    message: format!("unknown solute `{}`", s.solute),
                });
            };
            if !(s.g_per_100g.is_finite() && s.g_per_100g >= 0.0) {
                return Err(LibraryError::Invalid {
                    id: rec.id.clone(),
                    message: format!("bad amount of `{}`", s.solute),
                });
            }
            let m = s
                .molar_mass_g_per_mol
                .unwrap_or(self.solutes[i].record.molar_mass_g_per_mol)
                / 1000.0;
            total += s.g_per_100g;
            solutes.push((i, s.g_per_100g / 100.0, m));
        }
        if (total - 100.0).abs() > 0.5 {
            return Err(LibraryError::Invalid {
                id: rec.id,
                message: format!("composition adds up to {total:.2} g per 100 g, not 100"),
            });
        }
        // Normalise exactly to 1 kg/kg so rounding in the sources does not
        // create or destroy mass.
        let scale = 100.0 / total;
        for s in &mut solutes {
            s.1 *= scale;
        }
        let idx = self.ingredients.len();
        self.ingredient_index.insert(rec.id.clone(), idx);
        self.ingredients.push(Ingredient {
            water: rec.water_g_per_100g / 100.0 * scale,
            insoluble: rec.insoluble.total() / 100.0 * scale,
            solutes,
            record: rec,
            pure_solute: false,
            user_defined: user,
        });
        Ok(idx)
    }

    fn add_pure_solute_ingredients(&mut self) -> Result<(), LibraryError> {
        let water = IngredientRecord {
            id: WATER_ID.into(),
            name: "Water".into(),
            synonyms: vec!["aqua".into(), "H2O".into(), "deionised water".into()],
            category: IngredientCategory::Water,
            water_g_per_100g: 100.0,
            solutes: vec![],
            insoluble: InsolubleRecord::default(),
            source: Cite {
                key: "iupac2021".into(),
                at: None,
                tag: Confidence::Derived,
                note: Some("pure water".into()),
            },
            notes: None,
        };
        if !self.ingredient_index.contains_key(WATER_ID) {
            self.add_ingredient(water, false)?;
        }
        for i in 0..self.solutes.len() {
            self.add_pure_solute_ingredient(i)?;
        }
        Ok(())
    }

    /// Adds the 100 % ingredient of solute `i` (unless a composite
    /// ingredient already uses that id).
    fn add_pure_solute_ingredient(&mut self, i: SoluteIdx) -> Result<(), LibraryError> {
        let s = &self.solutes[i];
        if self.ingredient_index.contains_key(s.id()) {
            return Ok(());
        }
        let rec = IngredientRecord {
            id: s.id().to_string(),
            name: s.name().to_string(),
            synonyms: s.record.synonyms.clone(),
            category: IngredientCategory::PureSolute,
            water_g_per_100g: 0.0,
            solutes: vec![IngredientSolute {
                solute: s.id().to_string(),
                g_per_100g: 100.0,
                molar_mass_g_per_mol: None,
            }],
            insoluble: InsolubleRecord::default(),
            source: s.record.molar_mass_source.clone(),
            notes: s.record.notes.clone(),
        };
        let user = s.user_defined;
        let idx = self.add_ingredient(rec, true)?;
        self.ingredients[idx].pure_solute = true;
        self.ingredients[idx].user_defined = user;
        Ok(())
    }

    /// Adds a user solute and its pure ingredient in one step.
    ///
    /// # Errors
    /// As [`Library::add_solute`].
    pub fn add_user_solute(&mut self, rec: SoluteRecord) -> Result<SoluteIdx, LibraryError> {
        let i = self.add_solute(rec, true)?;
        self.add_pure_solute_ingredient(i)?;
        Ok(i)
    }

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

    /// Up to three ingredient ids close to `query` (edit distance and
    /// substring), for "did you mean" messages.
    pub fn suggest(&self, query: &str) -> Vec<String> {
        let q = query.to_lowercase();
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

fn check_id(id: &str) -> Result<(), LibraryError> {
    let ok = !id.is_empty()
        && id
            .chars()
            .all(|c| c.is_ascii_lowercase() || c.is_ascii_digit() || c == '_')
        && !id.starts_with('_');
    if ok {
        Ok(())
    } else {
        Err(LibraryError::Invalid {
            id: id.to_string(),
            message: "ids are snake_case: lower-case letters, digits and _".into(),
        })
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

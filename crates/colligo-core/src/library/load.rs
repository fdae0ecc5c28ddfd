//! Building a library from its data files, and adding user records: every
//! record is checked here (ids, citations, ions, coefficient lists,
//! compositions) before it is indexed.

use super::*;
use crate::error::{LibraryError, MAX_SHOWN_CHARS, elide, short};

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
                        message: format!(
                            "water activity {} outside [0, 1]",
                            short(t.water_activity)
                        ),
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
                message: format!("unknown ion `{}`", elide(id)),
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
        validate::solute(&rec)?;
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
                    message: format!("ions do not balance (net charge {})", short(charge)),
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
        validate::ingredient(&rec)?;
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
                    message: format!("unknown solute `{}`", elide(&s.solute)),
                });
            };
            if !(s.g_per_100g.is_finite() && s.g_per_100g >= 0.0) {
                return Err(LibraryError::Invalid {
                    id: rec.id.clone(),
                    message: format!("bad amount of `{}`", elide(&s.solute)),
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
                message: format!(
                    "composition adds up to {} g per 100 g, not 100",
                    short(total)
                ),
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

    /// A copy of this library with a user's solutes and ingredients added,
    /// or the first record that does not fit with the path of the field at
    /// fault (`{solutes_key}[i].field`, `{ingredients_key}[i].field`).
    ///
    /// # Errors
    /// The path and the error of the first record that does not fit.
    pub fn with_user_records(
        &self,
        solutes: &[SoluteRecord],
        ingredients: &[IngredientRecord],
        (solutes_key, ingredients_key): (&str, &str),
    ) -> Result<Library, (String, LibraryError)> {
        let mut lib = self.clone();
        let at = |key: &str, i: usize, e: &LibraryError| match e {
            LibraryError::Field { field, .. } => format!("{key}[{i}].{field}"),
            _ => format!("{key}[{i}]"),
        };
        for (i, s) in solutes.iter().enumerate() {
            lib.add_user_solute(s.clone())
                .map_err(|e| (at(solutes_key, i, &e), e))?;
        }
        for (i, r) in ingredients.iter().enumerate() {
            lib.add_ingredient(r.clone(), true)
                .map_err(|e| (at(ingredients_key, i, &e), e))?;
        }
        Ok(lib)
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
}

/// The longest id a record may have, in characters: ids are typed in
/// formulas and compared by edit distance in "did you mean" suggestions.
pub const MAX_ID_CHARS: usize = MAX_SHOWN_CHARS;

fn check_id(id: &str) -> Result<(), LibraryError> {
    if id.len() > MAX_ID_CHARS {
        return Err(LibraryError::Invalid {
            id: id.to_string(),
            message: format!("ids are at most {MAX_ID_CHARS} characters"),
        });
    }
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

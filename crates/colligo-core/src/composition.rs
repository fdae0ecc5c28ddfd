//! What a formula puts in the pot: kilograms of water, moles of each
//! solute, and insoluble solids.

use crate::library::{Library, SoluteIdx};

/// One solute's total amount in a batch.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SoluteAmount {
    /// Library solute.
    pub solute: SoluteIdx,
    /// Mass, kg.
    pub kg: f64,
    /// Amount, mol.
    pub mol: f64,
}

/// The derived composition of a batch.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct Composition {
    /// Water, kg (free water of all ingredients).
    pub water_kg: f64,
    /// Solutes present, one entry per library solute, in library order.
    pub solutes: Vec<SoluteAmount>,
    /// Insoluble solids (fat, protein, starch, fibre…), kg.
    pub insoluble_kg: f64,
}

impl Composition {
    /// An empty composition.
    pub fn new() -> Self {
        Self::default()
    }

    /// Adds `kg` of water.
    pub fn add_water(&mut self, kg: f64) {
        self.water_kg += kg;
    }

    /// Adds `kg` of a solute with molar mass `molar_mass` (kg/mol).
    pub fn add_solute(&mut self, solute: SoluteIdx, kg: f64, molar_mass: f64) {
        let mol = kg / molar_mass;
        match self.solutes.binary_search_by_key(&solute, |s| s.solute) {
            Ok(i) => {
                self.solutes[i].kg += kg;
                self.solutes[i].mol += mol;
            }
            Err(i) => self.solutes.insert(i, SoluteAmount { solute, kg, mol }),
        }
    }

    /// Adds `kg` of ingredient `ingredient` (library index).
    pub fn add_ingredient(&mut self, lib: &Library, ingredient: usize, kg: f64) {
        let ing = &lib.ingredients[ingredient];
        self.water_kg += ing.water * kg;
        self.insoluble_kg += ing.insoluble * kg;
        for &(s, frac, m) in &ing.solutes {
            self.add_solute(s, frac * kg, m);
        }
    }

    /// Total mass, kg.
    pub fn total_kg(&self) -> f64 {
        self.water_kg + self.insoluble_kg + self.solutes.iter().map(|s| s.kg).sum::<f64>()
    }

    /// A copy with `solute` set to `mol` (added if absent).
    pub fn with_solute_mol(&self, lib: &Library, solute: SoluteIdx, mol: f64) -> Self {
        let mut c = self.clone();
        let m = lib.solutes[solute].molar_mass;
        match c.solutes.binary_search_by_key(&solute, |s| s.solute) {
            Ok(i) => {
                c.solutes[i].mol = mol;
                c.solutes[i].kg = mol * m;
            }
            Err(i) => c.solutes.insert(
                i,
                SoluteAmount {
                    solute,
                    kg: mol * m,
                    mol,
                },
            ),
        }
        c
    }

    /// Mean molar mass of `solute` as the ingredients brought it (an
    /// ingredient may state its own, e.g. for a DP4+ fraction), kg/mol; 0
    /// when absent.
    pub fn molar_mass_of(&self, solute: SoluteIdx) -> f64 {
        self.solutes
            .binary_search_by_key(&solute, |s| s.solute)
            .map_or(0.0, |i| self.solutes[i].kg / self.solutes[i].mol)
    }

    /// Moles of `solute`, 0 when absent.
    pub fn mol_of(&self, solute: SoluteIdx) -> f64 {
        self.solutes
            .binary_search_by_key(&solute, |s| s.solute)
            .map_or(0.0, |i| self.solutes[i].mol)
    }
}

//! The serde records of the built-in library files in `assets/`.
//!
//! Every parameter block carries a [`Cite`]: a key into the bibliography `assets/sources/*.ron`,
//! where it was read (table, equation), and how sure we are of it.

use serde::{Deserialize, Serialize};

use crate::correlations::{Table, TempFn};

/// How a value was obtained.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum Confidence {
    /// Read in the published source or a faithful copy.
    Pub,
    /// Computed with (or transcribed from) a named general-purpose library.
    Lib,
    /// Fitted by us to published data named in the record.
    Fit,
    /// Recalled, not yet confirmed against the primary source.
    Mem,
    /// Derived by a stated calculation from other sourced values
    /// (e.g. a molar mass from IUPAC atomic weights).
    Derived,
    /// Entered by the user (their own data or supplier's specification).
    User,
}

/// A citation: a key into the bibliography, where in it, and confidence.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct Cite {
    /// Key into the bibliography (`assets/sources/*.ron`).
    pub key: String,
    /// Where in the source: table, equation, page.
    #[serde(default)]
    pub at: Option<String>,
    /// How the value was obtained.
    pub tag: Confidence,
    /// Free note: the fit performed, a caveat.
    #[serde(default)]
    pub note: Option<String>,
}

/// One bibliography entry.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct SourceRecord {
    /// Short key, e.g. `"norrish1966"`.
    pub key: String,
    /// Full citation.
    pub citation: String,
    /// DOI or stable address.
    #[serde(default)]
    pub url: Option<String>,
}

/// Broad family of a solute, used for grouping and search.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum SoluteCategory {
    /// Mono- and disaccharides.
    Sugar,
    /// Glucose oligomers and polymers (DP ≥ 3).
    Oligosaccharide,
    /// Sugar alcohols and glycerol.
    Polyol,
    /// Glycols (propylene, butylene glycol, PEG).
    Glycol,
    /// Inorganic and organic salts.
    Salt,
    /// Organic acids.
    Acid,
    /// Amino acids, betaines, urea.
    Nitrogenous,
    /// Preservatives.
    Preservative,
    /// Alcohols (volatile).
    Alcohol,
}

impl SoluteCategory {
    /// Display label.
    pub fn label(self) -> &'static str {
        match self {
            SoluteCategory::Sugar => "sugar",
            SoluteCategory::Oligosaccharide => "oligosaccharide",
            SoluteCategory::Polyol => "polyol",
            SoluteCategory::Glycol => "glycol",
            SoluteCategory::Salt => "salt",
            SoluteCategory::Acid => "acid",
            SoluteCategory::Nitrogenous => "nitrogenous",
            SoluteCategory::Preservative => "preservative",
            SoluteCategory::Alcohol => "alcohol",
        }
    }
}

/// One solute (a dissolvable component) of the library.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct SoluteRecord {
    /// Stable snake_case id.
    pub id: String,
    /// Display name.
    pub name: String,
    /// Other names a user may type (INCI names, E numbers, trade terms).
    #[serde(default)]
    pub synonyms: Vec<String>,
    /// Family.
    pub category: SoluteCategory,
    /// Chemical formula of the dissolved form, e.g. `"C12H22O11"`.
    #[serde(default)]
    pub formula: Option<String>,
    /// Molar mass of the form the amounts refer to, g/mol.
    pub molar_mass_g_per_mol: f64,
    /// Source of the molar mass.
    pub molar_mass_source: Cite,
    /// Non-electrolyte, electrolyte (with its ions) or volatile.
    pub kind: SoluteKind,
    /// Norrish constant for the binary with water, where published or fitted.
    #[serde(default)]
    pub norrish: Option<NorrishRecord>,
    /// Solubility in water against temperature.
    #[serde(default)]
    pub solubility: Option<SolubilityRecord>,
    /// Free note shown in the library browser.
    #[serde(default)]
    pub notes: Option<String>,
}

/// How a solute behaves in solution.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub enum SoluteKind {
    /// Stays as one molecule.
    NonElectrolyte,
    /// Dissociates fully into the listed ions (ids in `assets/pitzer.ron`).
    Electrolyte {
        /// Ions per formula unit.
        ions: Vec<IonCount>,
    },
    /// A volatile co-solvent with its own vapour pressure (ethanol).
    Volatile(Box<VolatileRecord>),
}

/// An ion and how many of it one formula unit releases.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct IonCount {
    /// Ion id, e.g. `"Na+"`.
    pub ion: String,
    /// Stoichiometric count.
    pub count: u32,
}

/// Norrish (1966) constant K in ln a_w = ln x_w − K x_s².
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct NorrishRecord {
    /// K, dimensionless, possibly temperature dependent.
    pub k: TempFn,
    /// Highest solute mole fraction of the data behind K.
    pub max_mole_fraction: f64,
    /// Temperature range of the data behind K, °C.
    #[serde(default = "default_norrish_t_range")]
    pub t_range_c: (f64, f64),
    /// Source of K.
    pub source: Cite,
}

impl NorrishRecord {
    /// K at `t_k`. A temperature-dependent K is held at the ends of its
    /// data range instead of being extrapolated (fitted forms such as
    /// a + b/T can run away outside their data).
    pub fn k_at(&self, t_k: f64) -> f64 {
        let (lo, hi) = self.t_range_c;
        // A NaN end (refused on load anyway) must not reach `clamp`.
        let t = if self.k.is_constant() || lo.is_nan() || hi.is_nan() || lo >= hi {
            t_k
        } else {
            t_k.clamp(lo + crate::water::T_ZERO_C, hi + crate::water::T_ZERO_C)
        };
        self.k.eval(t, 0.1)
    }
}

fn default_norrish_t_range() -> (f64, f64) {
    (20.0, 30.0)
}

/// What happens to a solute that exceeds its solubility while water freezes out.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub enum FreezeBehaviour {
    /// It crystallises (with `hydrate_water` mol of water per mol, e.g. 2 for
    /// NaCl·2H₂O below 0.1 °C), fixing the liquid at saturation.
    Crystallises {
        /// Moles of water bound per mole of solute in the crystal.
        hydrate_water: f64,
    },
    /// It stays supersaturated in the freeze-concentrate (glass-forming
    /// sugars: crystallisation is kinetically hindered at freezer
    /// temperatures); the app warns but does not cap it.
    StaysDissolved {
        /// Why.
        source: Cite,
    },
}

/// Solubility in water.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct SolubilityRecord {
    /// `(°C, g of solute per 100 g of water)`, increasing in °C.
    pub g_per_100g_water: Table,
    /// Behaviour on freezing.
    pub on_freezing: FreezeBehaviour,
    /// Source of the curve.
    pub source: Cite,
}

/// A volatile co-solvent's binary with water.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct VolatileRecord {
    /// Wilson (1964) model of the binary with water.
    pub wilson: WilsonRecord,
    /// Antoine equation for the pure co-solvent's vapour pressure.
    pub antoine: AntoineRecord,
}

/// Wilson (1964) parameters, solute (1) – water (2):
/// Λ12 = (V2/V1) exp(−a12/(R T)), Λ21 = (V1/V2) exp(−a21/(R T)),
/// with a12 and a21 possibly temperature dependent.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct WilsonRecord {
    /// a12 = λ12 − λ11, J/mol.
    pub a12_j_per_mol: TempFn,
    /// a21 = λ21 − λ22, J/mol.
    pub a21_j_per_mol: TempFn,
    /// Liquid molar volume of the solute, cm³/mol.
    pub v_solute_cm3_per_mol: f64,
    /// Liquid molar volume of water, cm³/mol.
    pub v_water_cm3_per_mol: f64,
    /// Temperature range of the fitted data, °C.
    pub t_range_c: (f64, f64),
    /// Highest salt-free mass fraction of the solute (solute / (solute +
    /// water)) at which the fit was checked against data.
    pub max_mass_fraction: f64,
    /// Lowest temperature, °C, at which the solute's own partial pressure
    /// from this fit is usable (the a_w may be valid lower).
    pub partial_pressure_t_min_c: f64,
    /// Source.
    pub source: Cite,
}

/// Antoine equation log10(p/kPa) = A − B/(T/K + C).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct AntoineRecord {
    /// A.
    pub a: f64,
    /// B, K.
    pub b: f64,
    /// C, K.
    pub c: f64,
    /// Range, °C.
    pub t_range_c: (f64, f64),
    /// Source.
    pub source: Cite,
}

/// A solute file (`assets/solutes/*.ron`).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct SoluteFile {
    /// All solutes.
    pub solutes: Vec<SoluteRecord>,
}

/// One ion for the Pitzer model.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct IonRecord {
    /// Id, e.g. `"Na+"`, `"SO4-2"`, `"lactate-"`.
    pub id: String,
    /// Display name.
    pub name: String,
    /// Charge number.
    pub charge: i32,
}

/// Third virial coefficient of a cation–anion pair.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub enum ThirdVirial {
    /// The usual Cφ; C = Cφ / (2 √|z_M z_X|).
    CPhi(TempFn),
    /// Archer's (1992) ionic-strength-dependent form C = C0 + C1 e^(−ω√I)
    /// (C0 here is already the C of the previous variant).
    C0C1 {
        /// C0.
        c0: TempFn,
        /// C1.
        c1: TempFn,
        /// ω, kg^½ mol^-½.
        omega: f64,
    },
}

/// Pitzer parameters of one cation–anion pair.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct PairRecord {
    /// Cation id.
    pub cation: String,
    /// Anion id.
    pub anion: String,
    /// β(0).
    pub beta0: TempFn,
    /// β(1).
    pub beta1: TempFn,
    /// β(2) (2-2 electrolytes); zero when absent.
    #[serde(default = "zero_fn")]
    pub beta2: TempFn,
    /// Third virial coefficient.
    pub c: ThirdVirial,
    /// α1, kg^½ mol^-½ (2 for most salts, 1.4 for 2-2).
    pub alpha1: f64,
    /// α2, kg^½ mol^-½ (12 for 2-2 salts), zero when absent.
    #[serde(default)]
    pub alpha2: f64,
    /// Highest molality of the fitted data, mol/kg.
    pub max_molality: f64,
    /// Temperature range of the fitted data, °C.
    pub t_range_c: (f64, f64),
    /// Source.
    pub source: Cite,
}

fn zero_fn() -> TempFn {
    TempFn::Constant(0.0)
}

/// Pitzer θ between two ions of like sign.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct ThetaRecord {
    /// The two ions.
    pub ions: (String, String),
    /// θ.
    pub theta: TempFn,
    /// Source.
    pub source: Cite,
}

/// Pitzer ψ of two like-sign ions with one of opposite sign.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct PsiRecord {
    /// The two like-sign ions and the third, of opposite sign.
    pub ions: (String, String, String),
    /// ψ.
    pub psi: TempFn,
    /// Source.
    pub source: Cite,
}

/// The Pitzer file `assets/pitzer.ron`.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct PitzerFile {
    /// Ions.
    pub ions: Vec<IonRecord>,
    /// Cation–anion pairs.
    pub pairs: Vec<PairRecord>,
    /// θ terms.
    #[serde(default)]
    pub thetas: Vec<ThetaRecord>,
    /// ψ terms.
    #[serde(default)]
    pub psis: Vec<PsiRecord>,
}

/// Broad family of an ingredient.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum IngredientCategory {
    /// Water.
    Water,
    /// Sugars and syrups.
    Sweetener,
    /// Dairy products.
    Dairy,
    /// Eggs.
    Egg,
    /// Fruit and vegetables.
    Fruit,
    /// Salt products.
    Salt,
    /// Humectant solutions and cosmetic raw materials.
    Humectant,
    /// Fats and oils.
    Fat,
    /// Starches, flours, gums.
    Starch,
    /// Pure library solutes used as ingredients.
    PureSolute,
    /// Anything else.
    Other,
}

impl IngredientCategory {
    /// Display label.
    pub fn label(self) -> &'static str {
        match self {
            IngredientCategory::Water => "water",
            IngredientCategory::Sweetener => "sweetener",
            IngredientCategory::Dairy => "dairy",
            IngredientCategory::Egg => "egg",
            IngredientCategory::Fruit => "fruit",
            IngredientCategory::Salt => "salt",
            IngredientCategory::Humectant => "humectant",
            IngredientCategory::Fat => "fat",
            IngredientCategory::Starch => "starch",
            IngredientCategory::PureSolute => "pure solute",
            IngredientCategory::Other => "other",
        }
    }
}

/// A solute inside an ingredient.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct IngredientSolute {
    /// Solute id.
    pub solute: String,
    /// Mass of it in 100 g of the ingredient, g.
    pub g_per_100g: f64,
    /// Overrides the solute's molar mass (e.g. the mean of a DP4+ fraction).
    #[serde(default)]
    pub molar_mass_g_per_mol: Option<f64>,
}

/// Insoluble solids of an ingredient, g per 100 g. They count in the batch
/// mass, not in the solution.
#[derive(Debug, Clone, Default, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct InsolubleRecord {
    /// Fat, g/100 g.
    #[serde(default)]
    pub fat: f64,
    /// Protein, g/100 g.
    #[serde(default)]
    pub protein: f64,
    /// Starch, g/100 g.
    #[serde(default)]
    pub starch: f64,
    /// Dietary fibre, g/100 g.
    #[serde(default)]
    pub fibre: f64,
    /// Other insoluble matter (insoluble ash, pectin gel), g/100 g.
    #[serde(default)]
    pub other: f64,
}

impl InsolubleRecord {
    /// Total insoluble solids, g/100 g.
    pub fn total(&self) -> f64 {
        self.fat + self.protein + self.starch + self.fibre + self.other
    }
}

/// A composite ingredient a user weighs out.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct IngredientRecord {
    /// Stable snake_case id.
    pub id: String,
    /// Display name.
    pub name: String,
    /// Other names.
    #[serde(default)]
    pub synonyms: Vec<String>,
    /// Family.
    pub category: IngredientCategory,
    /// Water, g/100 g.
    pub water_g_per_100g: f64,
    /// Dissolved solutes.
    #[serde(default)]
    pub solutes: Vec<IngredientSolute>,
    /// Insoluble solids.
    #[serde(default)]
    pub insoluble: InsolubleRecord,
    /// Source of the composition.
    pub source: Cite,
    /// Free note.
    #[serde(default)]
    pub notes: Option<String>,
}

/// The ingredient file `assets/ingredients.ron`.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct IngredientFile {
    /// All composite ingredients.
    pub ingredients: Vec<IngredientRecord>,
}

/// Who a guidance line is for, and which kind of product a project is
/// about (written `food` / `cosmetic` in project files).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize, Default)]
#[serde(rename_all = "snake_case")]
pub enum Audience {
    /// Food products.
    #[default]
    #[serde(alias = "Food")]
    Food,
    /// Cosmetic and personal-care products.
    #[serde(alias = "Cosmetic")]
    Cosmetic,
}

/// What a guidance line says.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum ThresholdKind {
    /// Minimum a_w for growth of an organism.
    GrowthLimit,
    /// A band of organisms inhibited below the value.
    InhibitionBand,
    /// A regulatory or standard cut-off.
    Regulatory,
}

/// A guidance line on the a_w scale.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct ThresholdRecord {
    /// Stable id.
    pub id: String,
    /// Label shown beside the line.
    pub label: String,
    /// The water activity.
    pub water_activity: f64,
    /// Kind.
    pub kind: ThresholdKind,
    /// Audiences the line is relevant to.
    pub audience: Vec<Audience>,
    /// What it means, in a sentence.
    pub meaning: String,
    /// Source.
    pub source: Cite,
}

/// The threshold file `assets/thresholds.ron`.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct ThresholdFile {
    /// All lines.
    pub thresholds: Vec<ThresholdRecord>,
}

/// A bibliography file (`assets/sources/*.ron`).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct SourceFile {
    /// All sources.
    pub sources: Vec<SourceRecord>,
}

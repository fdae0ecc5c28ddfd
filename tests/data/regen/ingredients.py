"""Regenerate assets/ingredients.ron (the built-in composite ingredients).

    python3 tests/data/regen/ingredients.py            (standard library only)
    python3 tests/data/regen/ingredients.py --check    (compare, do not write)

Every number is either a literal read in (or recalled from) the source named
beside it, or computed here from such literals: water of crystallisation from
IUPAC 2021 atomic weights, the DP4+ molar mass of the glucose syrups from their
nominal DE, NaCl from USDA sodium, and the milk-serum salts from the soluble
fractions of Fox & McSweeney (1998), Table 5.6, and the small non-protein-nitrogen
molecules from their Table 4.7. The script also checks that each
composition adds up to 100 g, that each syrup's computed DE equals its nominal
DE, and prints the ideal (Raoult) freezing point of whole milk.

Molar masses of the solutes are read from assets/solutes/*.ron when those files
define them, so that the grams written here give the intended moles; otherwise
the formula masses below are used (same IUPAC weights) and a note is printed.
"""
import pathlib
import re
import sys

ROOT = pathlib.Path(__file__).resolve().parents[3]
OUT = ROOT / "assets" / "ingredients.ron"

# IUPAC 2021 standard atomic weights, abridged to five significant figures
# (Prohaska et al. 2022, Pure Appl. Chem. 94:573, Table 2).
ATOMIC = {
    "H": 1.008, "C": 12.011, "N": 14.007, "O": 15.999, "Na": 22.990, "Mg": 24.305,
    "P": 30.974, "S": 32.06, "Cl": 35.45, "K": 39.098, "Ca": 40.078,
}
M_WATER = 2 * ATOMIC["H"] + ATOMIC["O"]  # 18.015 g/mol


def formula_mass(formula):
    """Molar mass of a formula such as 'K3C6H5O7' or 'CaCl2', g/mol."""
    total = 0.0
    for el, n in re.findall(r"([A-Z][a-z]?)(\d*)", formula):
        total += ATOMIC[el] * (int(n) if n else 1)
    return total


# The dissolved form each solute id refers to (used when the solute files do
# not give a molar mass yet).
SOLUTE_FORMULA = {
    "sucrose": "C12H22O11", "glucose": "C6H12O6", "fructose": "C6H12O6",
    "galactose": "C6H12O6", "lactose": "C12H22O11", "maltose": "C12H22O11",
    "maltotriose": "C18H32O16", "glucose_oligomers": "C24H42O21",
    "glycerol": "C3H8O3", "sorbitol": "C6H14O6", "citric_acid": "C6H8O7",
    "acetic_acid": "C2H4O2", "sodium_chloride": "NaCl", "potassium_chloride": "KCl",
    "calcium_chloride": "CaCl2", "magnesium_chloride": "MgCl2",
    "sodium_sulfate": "Na2SO4", "sodium_acetate": "NaC2H3O2",
    "sodium_lactate": "NaC3H5O3", "calcium_lactate": "CaC6H10O6",
    "sodium_citrate": "Na3C6H5O7", "potassium_citrate": "K3C6H5O7",
    "dipotassium_phosphate": "K2HPO4", "urea": "CH4N2O", "glycine": "C2H5NO2",
}


def library_molar_masses():
    """`id -> molar mass` from the solute files, where they exist."""
    found = {}
    for path in sorted((ROOT / "assets" / "solutes").glob("*.ron")):
        text = path.read_text()
        for m in re.finditer(r'\bid:\s*"([a-z0-9_]+)"(.*?)molar_mass_g_per_mol:\s*([0-9.]+)', text, re.S):
            if "id:" not in m.group(2):
                found[m.group(1)] = float(m.group(3))
    return found


LIB = library_molar_masses()
MISSING = [s for s in SOLUTE_FORMULA if s not in LIB]


def M(solute):
    """Molar mass used for `solute`, g/mol."""
    return LIB.get(solute, formula_mass(SOLUTE_FORMULA[solute]))


ING = []


def ingredient(id, name, category, water, solutes, cite, synonyms=(), insoluble=None, notes=None):
    """Records one ingredient. `solutes` is a list of (id, g/100 g[, molar mass override])."""
    ING.append(dict(id=id, name=name, synonyms=list(synonyms), category=category, water=water,
                    solutes=[s if len(s) == 3 else (s[0], s[1], None) for s in solutes],
                    insoluble=insoluble or {}, cite=cite, notes=notes))


def cite(key, at, tag, note):
    return dict(key=key, at=at, tag=tag, note=note)


def r(x, nd=4):
    return round(x, nd)


# ---------------------------------------------------------------- sweeteners

# Honey, USDA FoodData Central SR Legacy FDC 169640 (NDB 19296) "Honey", per 100 g.
HONEY = dict(water=17.10, protein=0.30, fat=0.0, ash=0.20, carb=82.40, fibre=0.2,
             fructose=40.94, glucose=35.75, sucrose=0.89, maltose=1.44, galactose=3.10,
             K=52.0, Na=4.0, Ca=6.0, Mg=2.0)
h = HONEY
k_cit = h["K"] / 1000 / ATOMIC["K"] / 3 * M("potassium_citrate")  # K as tripotassium citrate
sugars = h["fructose"] + h["glucose"] + h["sucrose"] + h["maltose"] + h["galactose"]
h_other = 100 - h["water"] - h["protein"] - h["fibre"] - sugars - k_cit
ingredient(
    "honey", "Honey", "Sweetener", h["water"],
    [("fructose", h["fructose"]), ("glucose", h["glucose"]), ("galactose", h["galactose"]),
     ("maltose", h["maltose"]), ("sucrose", h["sucrose"]), ("potassium_citrate", r(k_cit))],
    cite("usda_fdc_sr_legacy", "FDC 169640 (SR Legacy, NDB 19296) 'Honey', per 100 g", "Mem",
         "Water 17.10, protein 0.30, fibre 0.2, total sugars 82.12, K 52 mg, Na 4 mg: read in a secondary "
         "copy of this FDC entry (Pub). Individual sugars fructose 40.94, glucose 35.75, galactose 3.10, "
         "maltose 1.44, sucrose 0.89 are recalled from the same entry and not confirmed (Mem); they add up "
         "exactly to the confirmed total of 82.12. Protein is counted insoluble. The 0.20 g ash is mostly "
         f"potassium, whose counter-anion in honey is gluconate: K is written as tripotassium citrate "
         f"({r(k_cit, 3)} g, a stand-in with a multivalent organic anion). The rest "
         f"({r(h_other, 2)} g: other minerals and 0.08 g carbohydrate by difference that the source does not "
         "name) is put under insoluble.other. Codex CXS 12-1981 (from memory) asks blossom honey for "
         "moisture ≤ 20 g and fructose + glucose ≥ 60 g per 100 g; this entry meets both."),
    synonyms=["blossom honey", "mel"],
    insoluble=dict(protein=h["protein"], fibre=h["fibre"], other=r(h_other)),
    notes="Composition varies with floral source; use the supplier's moisture for a_w work.")

# Invert sugar syrup: 95 % of the sucrose inverted, 80 % dry matter.
DM, INV = 80.0, 0.95
M_SUC, M_GLC = M("sucrose"), M("glucose")
dm_suc = 1 - INV                                   # g sucrose left per g sucrose fed
dm_mono = INV / M_SUC * M_GLC                      # g each of glucose and fructose per g fed
dm_total = dm_suc + 2 * dm_mono
suc, glc = DM * dm_suc / dm_total, DM * dm_mono / dm_total
ingredient(
    "invert_sugar_syrup", "Invert sugar syrup (95 % inverted, 80 % dry matter)", "Sweetener", 100 - DM,
    [("glucose", r(glc)), ("fructose", r(glc)), ("sucrose", r(suc))],
    cite("eu_directive_2001_111", "Annex, Part A, point 6 (invert sugar syrup); point 5(a) and (c)", "Derived",
         "The Directive defines invert sugar syrup as partly inverted sucrose with invert sugar "
         "(fructose/dextrose 1.0 ± 0.1) above 50 % of dry matter, dry matter ≥ 62 % and conductivity ash "
         "≤ 0.4 % of dry matter (Pub). This entry is one such syrup, computed: 95 % of the sucrose is "
         "hydrolysed (C12H22O11 + H2O → C6H12O6 + C6H12O6, IUPAC 2021 masses), so 1 g sucrose gives "
         f"{r(dm_suc, 4)} g sucrose + 2 × {r(dm_mono, 4)} g hexoses; the dry matter is then "
         f"{r(100 * dm_suc / dm_total, 2)} % sucrose, {r(100 * dm_mono / dm_total, 2)} % glucose and as much "
         "fructose. The 80 % dry matter and the 95 % degree of inversion are a common commercial grade "
         "(common practice), not values from the Directive: edit them to the supplier's specification."),
    synonyms=["invert syrup", "inverted sugar syrup", "sirop de sucre inverti"])

# Glucose syrups: DP distribution + nominal DE -> molar mass of the DP4+ fraction.
# DE = 100 * M_glucose * (moles of reducing ends) / (dry mass); each molecule
# (glucose, maltose, maltotriose, each DP4+ chain) has one reducing end.


def dp4_molar_mass(de, dp1, dp2, dp3, dp4):
    """Mean molar mass of the DP4+ fraction that gives the nominal DE (per 100 g dry)."""
    ends = de / M("glucose")  # mol of reducing ends per 100 g dry matter
    rest = ends - dp1 / M("glucose") - dp2 / M("maltose") - dp3 / M("maltotriose")
    assert rest > 0, "DP1-DP3 alone exceed the nominal DE"
    return dp4 / rest


def de_of(dp1, dp2, dp3, dp4, m4):
    return 100 * M("glucose") * (dp1 / M("glucose") + dp2 / M("maltose") + dp3 / M("maltotriose") + dp4 / m4) / (dp1 + dp2 + dp3 + dp4)


SYRUPS = [
    # id, DE, dry matter, DP1, DP2, DP3, DP4+ (% of dry matter), source of the DP split
    ("glucose_syrup_42de", 42.0, 80.0, 19.0, 14.0, 11.0, 56.0,
     "hull2010", "typical confectioner's (acid-converted, 42 DE) syrup",
     "DP split 19 / 14 / 11 / 56 % of dry matter (glucose / maltose / maltotriose / higher) as quoted from "
     "Hull (2010) by a secondary source (Wikipedia 'Glucose syrup'); page not confirmed in the book itself"),
    ("glucose_syrup_63de", 63.0, 80.0, 37.0, 32.0, 11.0, 20.0,
     "cra_nutritive_sweeteners", "typical carbohydrate profile of 63 DE acid-enzyme corn syrup",
     "DP split 37 / 32 / 11 / 20 % of dry matter recalled from the Corn Refiners Association's table of "
     "typical corn-syrup profiles, not confirmed (Mem)"),
]
DE_CHECK = []
for sid, de, dm, d1, d2, d3, d4, key, at, split_note in SYRUPS:
    m4 = dp4_molar_mass(de, d1, d2, d3, d4)
    check = de_of(d1, d2, d3, d4, m4)
    DE_CHECK.append((sid, de, m4, check))
    f = dm / 100
    dp = (m4 - M_WATER) / (M("glucose") - M_WATER)
    ingredient(
        sid, f"Glucose syrup {de:.0f} DE ({dm:.0f} % dry matter)", "Sweetener", 100 - dm,
        [("glucose", r(d1 * f)), ("maltose", r(d2 * f)), ("maltotriose", r(d3 * f)),
         ("glucose_oligomers", r(d4 * f), round(m4, 1))],
        cite(key, at, "Derived",
             f"{split_note}. DP4+ molar mass computed so that the syrup's DE equals its nominal {de:.0f}: "
             "DE = 100 × 180.16 × (moles of reducing ends) / (dry mass), one reducing end per molecule; per "
             f"100 g dry matter {d1:g} g glucose (180.16) + {d2:g} g maltose (342.30) + {d3:g} g maltotriose "
             f"(504.44) give {r(d1 / M('glucose') + d2 / M('maltose') + d3 / M('maltotriose'), 5)} mol, so "
             f"the {d4:g} g of DP4+ must carry {r(de / M('glucose') - d1 / M('glucose') - d2 / M('maltose') - d3 / M('maltotriose'), 5)} "
             f"mol: M = {m4:.1f} g/mol (mean DP {dp:.2f}); recomputed DE = {check:.3f}. Dry matter {dm:g} % is a "
             "nominal value (common practice: 43 °Bé syrups are about 80 %), not from the source. Codex CXS "
             "212-1999 requires DE ≥ 20 for glucose syrup. Lane-Eynon DE weighs maltose and higher "
             "oligomers slightly differently from this stoichiometric definition."),
        synonyms=[f"{de:.0f} DE glucose syrup", f"corn syrup {de:.0f} DE", "liquid glucose"],
        notes="Edit dry matter and DP split to the supplier's certificate; the DP4+ molar mass then follows from the DE.")

for sid, fru, glu, hi, dm, at in [
    ("high_fructose_syrup_42", 42.0, 53.0, 5.0, 71.0, "Table 1, HFCS-42"),
    ("high_fructose_syrup_55", 55.0, 42.0, 3.0, 77.0, "Table 1, HFCS-55"),
]:
    f = dm / 100
    ingredient(
        sid, f"High-fructose syrup {fru:.0f} ({dm:.0f} % dry matter)", "Sweetener", 100 - dm,
        [("fructose", r(fru * f)), ("glucose", r(glu * f)), ("maltose", r(hi * f))],
        cite("white2008", at, "Mem",
             f"Dry-basis fructose {fru:g} % and glucose {glu:g} % read in a secondary copy quoting this paper "
             f"(Pub); higher saccharides {hi:g} % and solids {dm:g} % recalled from its Table 1, not confirmed "
             "(Mem). The higher saccharides are written as maltose (DP2, the largest of them) because the "
             "source does not split them; per 100 g = dry-basis % × solids."),
        synonyms=[f"HFCS-{fru:.0f}", f"HFCS {fru:.0f}", f"glucose-fructose syrup {fru:.0f}", "isoglucose"])

# ------------------------------------------------------------ humectants

ingredient(
    "sorbitol_solution_70", "Sorbitol solution 70 %", "Humectant", 30.0, [("sorbitol", 70.0)],
    cite("usp28_sorbitol_solution", "USP 28–NF 23, monograph 'Sorbitol Solution'", "Pub",
         "The monograph requires not less than 64.0 % D-sorbitol and water 28.5–31.5 % (Method I). This "
         "entry takes the nominal 70 % solids of the trade grade (common practice) and counts all of them "
         "as sorbitol; up to about 6 g may be other hexitols and hexitol anhydrides of the same or close "
         "molar mass."),
    synonyms=["sorbitol 70%", "sorbitol, liquid (crystallising)", "E420 (ii)"])
ingredient(
    "glycerin_995", "Glycerin 99.5 %", "Humectant", 0.5, [("glycerol", 99.5)],
    cite("usp29_glycerin", "USP 29–NF 24, monograph 'Glycerin'", "Pub",
         "The monograph requires 99.0–101.0 % C3H8O3 on the anhydrous basis and water not more than 5.0 %. "
         "The 99.5 % grade (0.5 % water) is a trade grade (common practice)."),
    synonyms=["glycerine", "glycerol 99.5%", "E422"])
ingredient(
    "sodium_lactate_solution_60", "Sodium lactate solution 60 %", "Humectant", 40.0, [("sodium_lactate", 60.0)],
    cite("usp28_sodium_lactate_solution", "USP 28–NF 23, monograph 'Sodium Lactate Solution'", "Pub",
         "The monograph requires not less than 50.0 % w/w monosodium lactate and 98.0–102.0 % of the "
         "labelled amount; 60 % is the usual labelled strength (a US drug label for Sodium Lactate, USP "
         "describes it as 'a 60% aqueous solution')."),
    synonyms=["sodium lactate 60%", "E325"])

# ---------------------------------------------------------------- dairy
# Lactose of cows' milk, g per 100 g: Fox & McSweeney (1998), Table 2.1.
FOX_21_COW_LACTOSE = 4.8
# Soluble part of milk salts: Fox & McSweeney (1998), Table 5.6 (after Davies &
# White 1960 and others): concentration in milk, mg/L, and % in solution.
FOX_56 = {"Na": (500, 0.92), "K": (1450, 0.92), "Cl": (1200, 1.00), "SO4": (100, 1.00),
          "P": (750, 0.43), "cit": (1750, 0.94), "Ca": (1200, 0.34), "Mg": (130, 0.67)}
M_ION = {"Na": ATOMIC["Na"], "K": ATOMIC["K"], "Ca": ATOMIC["Ca"], "Mg": ATOMIC["Mg"],
         "Cl": ATOMIC["Cl"], "SO4": formula_mass("SO4"), "P": ATOMIC["P"], "cit": formula_mass("C6H8O7")}


def milk_salts(Na, K, Ca, Mg):
    """Soluble milk salts (g per 100 g) and colloidal mass (g) from USDA Na, K, Ca, Mg (mg/100 g).

    Cations: USDA value × soluble share of Table 5.6. Anions (not in USDA): scaled to the
    ingredient's potassium with the Table 5.6 ratio to K, then × their soluble share.
    Ions are then paired into library salts: Ca and Mg as chlorides, sulfate as
    Na2SO4, the rest of the chloride as NaCl, the rest of the Na as trisodium
    citrate, the rest of the citrate as tripotassium citrate, the rest of the K as
    K2HPO4 (up to the soluble phosphate).
    """
    kr = K / FOX_56["K"][0]  # ingredient K per mg/L of milk K
    mg = {
        "Na": Na * FOX_56["Na"][1], "K": K * FOX_56["K"][1], "Ca": Ca * FOX_56["Ca"][1],
        "Mg": Mg * FOX_56["Mg"][1],
        **{a: kr * FOX_56[a][0] * FOX_56[a][1] for a in ("Cl", "SO4", "P", "cit")},
    }
    mm = {i: mg[i] / M_ION[i] for i in mg}  # mmol per 100 g
    salts = {}
    salts["calcium_chloride"] = mm["Ca"]
    salts["magnesium_chloride"] = mm["Mg"]
    cl = mm["Cl"] - 2 * mm["Ca"] - 2 * mm["Mg"]
    assert cl >= 0, "not enough chloride for Ca and Mg"
    salts["sodium_sulfate"] = mm["SO4"]
    na = mm["Na"] - 2 * mm["SO4"]
    nacl = min(na, cl)
    salts["sodium_chloride"] = nacl
    na, cl = na - nacl, cl - nacl
    k = mm["K"]
    if cl > 0:  # chloride left over: as KCl
        salts["potassium_chloride"] = cl
        k -= cl
    nacit = min(na / 3, mm["cit"])
    salts["sodium_citrate"] = nacit
    cit = mm["cit"] - nacit
    kcit = min(cit, k / 3)
    salts["potassium_citrate"] = kcit
    k -= 3 * kcit
    dkp = min(mm["P"], k / 2)
    salts["dipotassium_phosphate"] = dkp
    k -= 2 * dkp
    left = dict(Na=na - 3 * nacit, K=k, cit=cit - kcit, P=mm["P"] - dkp)
    grams = {s: n * M(s) / 1000 for s, n in salts.items() if n > 1e-9}
    # Colloidal (casein-micelle) salts: the insoluble shares of Table 5.6, with the
    # colloidal inorganic phosphate counted as PO4 and the organic P of casein and
    # phospholipids left inside protein and fat.
    coll_mg = (Ca * (1 - FOX_56["Ca"][1]) + Mg * (1 - FOX_56["Mg"][1]) + Na * (1 - FOX_56["Na"][1])
               + K * (1 - FOX_56["K"][1])
               + kr * FOX_56["P"][0] * (1 - FOX_56["P"][1]) / ATOMIC["P"] * formula_mass("PO4")
               + kr * FOX_56["cit"][0] * (1 - FOX_56["cit"][1]))
    particles = sum(n * {"calcium_chloride": 3, "magnesium_chloride": 3, "sodium_sulfate": 3,
                         "sodium_chloride": 2, "potassium_chloride": 2, "sodium_citrate": 4,
                         "potassium_citrate": 4, "dipotassium_phosphate": 3}[s] for s, n in salts.items())
    return grams, coll_mg / 1000, left, mm, particles


SALT_NOTE = (
    "Soluble minerals: Na, K, Ca, Mg from the USDA entry times the soluble shares of Fox & McSweeney "
    "(1998) Table 5.6 (Na 92 %, K 92 %, Ca 34 %, Mg 67 %); chloride, sulfate, inorganic phosphate and "
    "citrate, which USDA does not give, scaled to this ingredient's potassium with that table's ratios to K "
    "(Cl 1200, SO4 100, P 750, citrate 1750 per 1450 mg K; soluble 100, 100, 43, 94 %). The ions are paired "
    "into library salts (Ca and Mg as chlorides, SO4 as Na2SO4, remaining Cl as NaCl, remaining Na as "
    "trisodium citrate, remaining citrate as tripotassium citrate, remaining K as K2HPO4), which keeps each "
    "ion's amount but treats the salts as fully dissociated (the real serum has Ca-citrate complexes and "
    "H2PO4-). The colloidal calcium phosphate of the casein micelles (the insoluble shares, phosphate as "
    "PO4) is under insoluble.other.")


# Non-protein nitrogen of cows' milk: Fox & McSweeney (1998), Table 4.7, mg N per litre
# (the milk of Table 5.6, whose K is 1450 mg/L). Urea is the principal component.
FOX_47 = {"ammonia": 6.7, "urea": 83.8, "creatinine": 4.9, "creatine": 39.3, "uric acid": 22.8,
          "alpha-amino N": 37.4, "unaccounted": 88.1}
# USDA protein for milk is total nitrogen x 6.38 (from memory), so it includes this NPN.
N_FACTOR_MILK = 6.38


def milk_npn(K):
    """Small NPN solutes (g per 100 g) from the ingredient's K (mg/100 g), and their N (g).

    Table 4.7's urea N as urea (2 N per molecule) and its alpha-amino N (free amino acids,
    glutamic acid predominating) as glycine (1 N), the library's amino acid; both scaled to
    this ingredient's potassium like the anions of milk_salts.
    """
    kr = K / FOX_56["K"][0]
    mmol = {"urea": kr * FOX_47["urea"] / (2 * ATOMIC["N"]),
            "glycine": kr * FOX_47["alpha-amino N"] / ATOMIC["N"]}
    grams = {s: n * M(s) / 1000 for s, n in mmol.items()}
    n_g = kr * (FOX_47["urea"] + FOX_47["alpha-amino N"]) / 1000
    return grams, n_g, sum(mmol.values())


NPN_NOTE = (
    "Non-protein nitrogen: urea N 83.8 and alpha-amino N 37.4 of the 283 mg N/L of Fox & McSweeney "
    "(1998) Table 4.7, scaled to this ingredient's potassium (1450 mg K/L in Table 5.6), as urea and as "
    "glycine (one N per molecule; it stands for the free amino acids, mostly glutamic acid); creatine, "
    "creatinine and uric acid (about 1.5 mmol/L together), ammonia and the unaccounted NPN are left in "
    "the protein. The protein is the source's (total N x 6.38, from "
    "memory) less 6.38 x the N now counted as urea and glycine.")


def dairy(id, name, src, at, tag, water, protein, fat, Na, K, Ca, Mg, sugars, carb, synonyms, extra_note,
          sucrose=None, lactose_per_protein=None, lactose=None, lactose_note=None, notes=None):
    grams, coll, left, mm, particles = milk_salts(Na, K, Ca, Mg)
    npn, npn_n, npn_mmol = milk_npn(K)
    salts = sum(grams.values())
    npn_g = sum(npn.values())
    protein_true = protein - N_FACTOR_MILK * npn_n
    other = coll
    if sucrose is None and lactose is not None:
        other = 100 - water - protein_true - fat - salts - npn_g - lactose
        assert other >= 0, (id, other)
        sugar_list = [("lactose", r(lactose))]
        lac_note = (f"{lactose_note} The source gives {carb} g carbohydrate by difference (which also "
                    f"holds the citrate now counted among the salts) and {sugars} g analysed total sugars; "
                    f"with those sugars as lactose the entry would add up to "
                    f"{r(100 - other + coll + sugars - lactose, 2)} g. insoluble.other "
                    f"({r(other, 3)} g) closes the mass balance: it stands for the colloidal salts, "
                    f"estimated below at {coll:.3f} g, less the {r(coll - other, 3)} g by which the other "
                    "values overshoot 100 g; it has no bearing on a_w or freezing.")
    elif sucrose is None:
        lactose = 100 - water - protein_true - fat - salts - npn_g - coll
        sugar_list = [("lactose", r(lactose))]
        lac_note = (f"Lactose {r(lactose, 2)} g closes the mass balance; the source gives {carb} g "
                    f"carbohydrate by difference (which also holds the citrate now counted among the salts) "
                    f"and {sugars} g analysed total sugars.")
    else:
        lactose = protein * lactose_per_protein
        suc = 100 - water - protein_true - fat - salts - npn_g - coll - lactose
        sugar_list = [("lactose", r(lactose)), ("sucrose", r(suc))]
        lac_note = (f"Total sugars {sugars} g are lactose + added sucrose; lactose {r(lactose, 2)} g is the "
                    f"milk's lactose/protein ratio ({lactose_per_protein:.3f}, from whole_milk, on the "
                    f"source's protein) times the source's protein, and sucrose {r(suc, 2)} g closes the "
                    "mass balance.")
    ingredient(
        id, name, "Dairy", water,
        sugar_list + [(s, r(g)) for s, g in grams.items()] + [(s, r(g)) for s, g in npn.items()],
        cite(src, at, tag,
             f"{extra_note} Fat and protein are insoluble solids. {lac_note} {SALT_NOTE} Salts here: "
             + ", ".join(f"{s} {g:.4f} g" for s, g in grams.items())
             + f"; colloidal salts {coll:.3f} g. Ions left unpaired (mmol/100 g): "
             + ", ".join(f"{i} {v:.3f}" for i, v in left.items() if abs(v) > 5e-4) + ". "
             + NPN_NOTE + " Here: " + ", ".join(f"{s} {g:.4f} g" for s, g in npn.items())
             + f"; protein {protein} - {r(N_FACTOR_MILK * npn_n, 4)} = {r(protein_true, 4)} g."),
        synonyms=synonyms, insoluble=dict(fat=fat, protein=r(protein_true), other=r(other)), notes=notes)
    return lactose, grams, particles + npn_mmol, coll


lac_wm, g_wm, part_wm, _ = dairy(
    "whole_milk", "Whole milk (3.25 % fat)", "usda_fdc_sr_legacy",
    "SR Legacy NDB 01211 'Milk, whole, 3.25% milkfat, without added vitamin A and vitamin D', per 100 g",
    "Derived", water=88.13, protein=3.15, fat=3.27, Na=43, K=132, Ca=113, Mg=10, sugars=5.05, carb=4.78,
    synonyms=["milk", "full-cream milk", "whole cow's milk"],
    extra_note="Water 88.13, protein 3.15, fat 3.27, carbohydrate 4.78, total sugars 5.05, Na 43, K 132, "
               "Ca 113, Mg 10 mg read in a secondary copy of this USDA entry (Pub); its FDC id is not "
               "confirmed here.",
    lactose=FOX_21_COW_LACTOSE,
    lactose_note=f"Lactose {FOX_21_COW_LACTOSE} g is the lactose of cows' milk in Fox & McSweeney (1998) "
                 "Table 2.1 (4.8 %; milk holds only traces of other sugars, their section 2.1).",
    notes="Cows' milk freezes at -0.52 to -0.54 °C (common practice; a freezing point nearer 0 °C points to "
          "added water). Lactose accounts for a little over half of the depression; lactose and chloride "
          "for about 75 % (Henningson 1963).")
LAC_PER_PROTEIN = lac_wm / 3.15  # on the source's (total N) protein

dairy("skim_milk_powder", "Skim milk powder", "usda_fdc_sr_legacy",
      "FDC 170877 (SR Legacy, NDB 01091) 'Milk, dry, nonfat, regular, without added vitamin A and vitamin D', per 100 g",
      "Derived", water=3.16, protein=36.16, fat=0.77, Na=535, K=1794, Ca=1257, Mg=110, sugars=51.98, carb=51.98,
      synonyms=["SMP", "nonfat dry milk", "skimmed milk powder", "NFDM"],
      extra_note="Ca 1257 (1260), Mg 110, K 1794 (1790), Na 535 mg confirmed in a secondary copy of this "
                 "entry (Pub); water 3.16, protein 36.16, fat 0.77, ash 7.93, carbohydrate 51.98 (all "
                 "lactose) recalled from it, not confirmed (Mem).")

dairy("sweetened_condensed_milk", "Sweetened condensed milk", "usda_fdc_sr_legacy",
      "SR Legacy NDB 01095 'Milk, canned, condensed, sweetened', per 100 g", "Mem",
      water=27.16, protein=7.91, fat=8.70, Na=127, K=371, Ca=284, Mg=26, sugars=54.40, carb=54.40,
      sucrose=True, lactose_per_protein=LAC_PER_PROTEIN,
      synonyms=["condensed milk", "SCM"],
      extra_note="Water 27.16, protein 7.91, fat 8.70, ash 1.83, carbohydrate and sugars 54.40, Na 127, "
                 "K 371, Ca 284, Mg 26 mg are recalled from this USDA entry and not confirmed (Mem); FDC id "
                 "not confirmed. Codex CXS 282-1971 (from memory) asks for ≥ 8 % milk fat and ≥ 28 % milk "
                 "solids.")

dairy("cream_heavy", "Heavy whipping cream (36 % fat)", "usda_fdc_sr_legacy",
      "FDC 170859 (SR Legacy, NDB 01053) 'Cream, fluid, heavy whipping', per 100 g", "Mem",
      water=57.71, protein=2.84, fat=36.08, Na=27, K=95, Ca=66, Mg=7, sugars=2.92, carb=2.84,
      synonyms=["cream", "double cream", "whipping cream"],
      extra_note="Protein 2.84, fat 36.1, carbohydrate 2.84 confirmed in a secondary copy of this entry "
                 "(Pub); water 57.71, sugars 2.92 and the minerals Na 27, K 95, Ca 66, Mg 7 mg recalled, "
                 "not confirmed (Mem).")

# Salted butter: NaCl from USDA sodium.
BUT = dict(water=15.87, protein=0.85, fat=81.11, ash=2.11, carb=0.06, Na=643.0, K=24.0)
nacl = BUT["Na"] / ATOMIC["Na"] * M("sodium_chloride") / 1000
kcl = BUT["K"] / ATOMIC["K"] * M("potassium_chloride") / 1000
but_other = 100 - BUT["water"] - BUT["protein"] - BUT["fat"] - nacl - kcl
ingredient(
    "salted_butter", "Salted butter", "Dairy", BUT["water"],
    [("sodium_chloride", r(nacl)), ("potassium_chloride", r(kcl))],
    cite("usda_fdc_sr_legacy", "FDC 173410 (SR Legacy, NDB 01001) 'Butter, salted', per 100 g", "Mem",
         "Water 15.87, protein 0.85, fat 81.11, ash 2.11, carbohydrate 0.06, Na 643 mg, K 24 mg recalled from "
         "this entry, not confirmed (Mem). Sodium to salt: 643 mg Na × 58.44/22.99 = "
         f"{r(nacl, 3)} g NaCl (all Na counted as added salt; the serum's own Na is a few mg); K 24 mg as "
         f"KCl ({r(kcl, 3)} g). The rest, {r(but_other, 3)} g (ash not explained by NaCl and KCl, milk "
         "carbohydrate), is under insoluble.other. All salt is taken as dissolved in the 15.9 g of water "
         "(about 9 % brine)."),
    synonyms=["butter", "salted sweet-cream butter"],
    insoluble=dict(fat=BUT["fat"], protein=BUT["protein"], other=r(but_other)))

# ----------------------------------------------------------------- egg
EY = dict(water=52.31, protein=15.86, fat=26.54, ash=1.71, carb=3.59, sugars=0.56, Na=48.0, K=109.0)
ey_nacl = EY["Na"] / ATOMIC["Na"] * M("sodium_chloride") / 1000
ey_kcl = EY["K"] / ATOMIC["K"] * M("potassium_chloride") / 1000
ey_other = 100 - EY["water"] - EY["protein"] - EY["fat"] - EY["sugars"] - ey_nacl - ey_kcl
ingredient(
    "egg_yolk", "Egg yolk, raw", "Egg", EY["water"],
    [("glucose", EY["sugars"]), ("sodium_chloride", r(ey_nacl)), ("potassium_chloride", r(ey_kcl))],
    cite("usda_fdc_sr_legacy", "FDC 172184 (SR Legacy, NDB 01125) 'Egg, yolk, raw, fresh', per 100 g", "Mem",
         "Protein 15.86 (15.9), fat 26.54 (26.5), carbohydrate 3.59 confirmed in a secondary copy of this "
         "entry (Pub); water 52.31, ash 1.71, sugars 0.56, Na 48, K 109, Ca 129, P 390 mg recalled, not "
         "confirmed (Mem). The free sugar of yolk is taken as glucose (from memory). Soluble minerals: Na "
         f"and K of the yolk plasma as NaCl ({r(ey_nacl, 3)} g = 48 mg Na × 58.44/22.99) and KCl "
         f"({r(ey_kcl, 3)} g) — no published partition was found, so chloride as counter-ion is an "
         "assumption; Ca, Mg and P are bound to phosvitin and lipoproteins of the granules and count as "
         f"insoluble. insoluble.other ({r(ey_other, 2)} g) holds that bound ash and the rest of the "
         "carbohydrate by difference (protein-bound carbohydrate, not dissolved)."),
    synonyms=["yolk", "egg yolks"],
    insoluble=dict(fat=EY["fat"], protein=EY["protein"], other=r(ey_other)))

# ---------------------------------------------------------------- fruit
SB = dict(water=90.95, protein=0.67, fat=0.30, ash=0.40, carb=7.68, fibre=2.0, sucrose=0.47,
          glucose=1.99, fructose=2.44, K=153.0)
sb_sug = SB["sucrose"] + SB["glucose"] + SB["fructose"]
sb_acid = SB["carb"] - SB["fibre"] - sb_sug               # g organic acid, as citric acid
sb_kcit_mmol = SB["K"] / ATOMIC["K"] / 3
sb_kcit = sb_kcit_mmol * M("potassium_citrate") / 1000
sb_citric = sb_acid - sb_kcit_mmol * M("citric_acid") / 1000
sb_other = 100 - SB["water"] - SB["protein"] - SB["fat"] - SB["fibre"] - sb_sug - sb_kcit - sb_citric
ingredient(
    "strawberry_puree", "Strawberry purée (raw fruit)", "Fruit", SB["water"],
    [("fructose", SB["fructose"]), ("glucose", SB["glucose"]), ("sucrose", SB["sucrose"]),
     ("citric_acid", r(sb_citric)), ("potassium_citrate", r(sb_kcit))],
    cite("usda_fdc_sr_legacy", "FDC 167762 (SR Legacy, NDB 09316) 'Strawberries, raw', per 100 g", "Mem",
         "Purée of the raw fruit with nothing added, so the composition is that of the fruit. Water 90.95, "
         "protein 0.67, fat 0.30, ash 0.40, carbohydrate 7.68, fibre 2.0, sucrose 0.47, glucose 1.99, "
         "fructose 2.44, K 153 mg recalled from this entry, not confirmed (Mem; the FDC id is confirmed). "
         f"The carbohydrate by difference not named as fibre or sugar ({r(sb_acid, 2)} g) is taken as the "
         "fruit's organic acids, written as citric acid, the main acid of strawberry (from memory). The "
         "soluble ash is mostly potassium, balanced by those acids: K as tripotassium citrate "
         f"({r(sb_kcit, 3)} g, using {r(sb_kcit_mmol * M('citric_acid') / 1000, 3)} g of the acid), "
         f"leaving {r(sb_citric, 3)} g citric acid. insoluble.other ({r(sb_other, 3)} g) is the rest of "
         "the ash (Ca, Mg, phosphate)."),
    synonyms=["strawberry pulp", "strawberries"],
    insoluble=dict(protein=SB["protein"], fat=SB["fat"], fibre=SB["fibre"], other=r(sb_other)))

TP = dict(water=73.50, protein=4.32, fat=0.47, carb=18.91, fibre=4.1, sugars=12.18, K=1014.0, Na=59.0)
tp_acid = TP["carb"] - TP["fibre"] - TP["sugars"]
tp_kcit_mmol = TP["K"] / ATOMIC["K"] / 3
tp_kcit = tp_kcit_mmol * M("potassium_citrate") / 1000
tp_citric = tp_acid - tp_kcit_mmol * M("citric_acid") / 1000
tp_nacl = TP["Na"] / ATOMIC["Na"] * M("sodium_chloride") / 1000
tp_glc = TP["sugars"] * 0.47
tp_fru = TP["sugars"] - tp_glc
tp_other = 100 - TP["water"] - TP["protein"] - TP["fat"] - TP["fibre"] - TP["sugars"] - tp_kcit - tp_citric - tp_nacl
ingredient(
    "tomato_paste", "Tomato paste (no salt added)", "Fruit", TP["water"],
    [("fructose", r(tp_fru)), ("glucose", r(tp_glc)), ("citric_acid", r(tp_citric)),
     ("potassium_citrate", r(tp_kcit)), ("sodium_chloride", r(tp_nacl))],
    cite("usda_fdc_sr_legacy", "SR Legacy NDB 11546 'Tomato products, canned, paste, without salt added', per 100 g", "Mem",
         "Water 73.50, protein 4.32, fat 0.47, carbohydrate 18.91, fibre 4.1, total sugars 12.18, K 1014, "
         "Na 59 mg recalled from this entry, not confirmed (Mem); FDC id not confirmed. Tomato sugars are "
         "split 47 % glucose / 53 % fructose (from memory: fructose slightly exceeds glucose in tomato). "
         f"Carbohydrate not named as fibre or sugar ({r(tp_acid, 2)} g) is taken as organic acid, written "
         f"as citric acid; K as tripotassium citrate ({r(tp_kcit, 3)} g), Na as NaCl ({r(tp_nacl, 3)} g = "
         f"59 mg × 58.44/22.99). insoluble.other ({r(tp_other, 3)} g) is the rest of the ash (Ca, Mg, "
         "phosphate as carbonates/oxides in the ash) by mass balance."),
    synonyms=["tomato concentrate", "double concentrated tomato"],
    insoluble=dict(protein=TP["protein"], fat=TP["fat"], fibre=TP["fibre"], other=r(tp_other)))

# ------------------------------------------------------------ plant syrups, sugars
MS = dict(water=32.39, protein=0.04, fat=0.06, carb=67.04, sugars=60.46, sucrose=58.31, glucose=1.60,
          fructose=0.52, K=212.0)
ms_k = MS["K"] / ATOMIC["K"] / 3 * M("potassium_citrate") / 1000
ms_anion = ms_k - MS["K"] / 1000                      # citrate part of the K salt, taken from the acids
ms_suc = MS["carb"] - MS["glucose"] - MS["fructose"] - ms_anion  # unnamed carbohydrate counted as sucrose
ms_other = 100 - MS["water"] - MS["protein"] - MS["fat"] - MS["carb"] - MS["K"] / 1000  # ash less K
ingredient(
    "maple_syrup", "Maple syrup", "Sweetener", MS["water"],
    [("sucrose", r(ms_suc)), ("glucose", MS["glucose"]), ("fructose", MS["fructose"]),
     ("potassium_citrate", r(ms_k))],
    cite("usda_fdc_sr_legacy", "SR Legacy NDB 19353 'Syrups, maple', per 100 g", "Mem",
         "Water 32.39, protein 0.04, fat 0.06, carbohydrate 67.04, total sugars 60.46 (sucrose 58.31, "
         "glucose 1.60, fructose 0.52), K 212 mg recalled from this entry, not confirmed (Mem); FDC id not "
         f"confirmed. Of the {r(MS['carb'] - MS['sugars'], 2)} g of carbohydrate by difference not named as a "
         f"sugar, {r(ms_anion, 3)} g is taken as the organic acid (malate) balancing K, and the rest is added "
         "to sucrose, the sugar of maple sap (best fit; an overestimate of moles if it is oligosaccharide). K "
         f"as tripotassium citrate ({r(ms_k, 3)} g), a stand-in for the malate of maple syrup; calcium (as "
         "calcium malate, the 'sugar sand' that settles out) and the rest of the ash are under "
         f"insoluble.other ({r(ms_other, 3)} g)."),
    synonyms=["maple"],
    insoluble=dict(protein=MS["protein"], fat=MS["fat"], other=r(max(ms_other, 0.0))))

BS = dict(water=1.34, protein=0.12, ash=0.45, carb=98.09, sucrose=94.56, glucose=1.35, fructose=1.11)
bs_other = 100 - BS["water"] - BS["protein"] - BS["sucrose"] - BS["glucose"] - BS["fructose"]
ingredient(
    "brown_sugar", "Brown sugar (soft)", "Sweetener", BS["water"],
    [("sucrose", BS["sucrose"]), ("glucose", BS["glucose"]), ("fructose", BS["fructose"])],
    cite("usda_fdc_sr_legacy", "SR Legacy NDB 19334 'Sugars, brown', per 100 g", "Mem",
         "Water 1.34, protein 0.12, ash 0.45, carbohydrate 98.09, sucrose 94.56, glucose 1.35, fructose 1.11 "
         "recalled from this entry, not confirmed (Mem); FDC id not confirmed. The non-sugars of the molasses "
         f"film (ash and {r(BS['carb'] - BS['sucrose'] - BS['glucose'] - BS['fructose'], 2)} g unnamed "
         f"carbohydrate; {r(bs_other, 2)} g in all) are under insoluble.other because the source does not "
         "say what they are; counted dissolved they would lower a_w a little more. Codex CXS 212-1999 asks "
         "soft brown sugar for sucrose + invert sugar ≥ 88.0 %."),
    synonyms=["soft brown sugar", "light brown sugar"],
    insoluble=dict(protein=BS["protein"], other=r(bs_other)))

MO = dict(water=21.87, fat=0.10, carb=74.73, sugars=74.72, K=1464.0)
mo_split = dict(sucrose=29.40, glucose=11.94, fructose=12.79)  # recalled individual sugars
mo_scale = MO["sugars"] / sum(mo_split.values())
mo_kcl = MO["K"] / ATOMIC["K"] * M("potassium_chloride") / 1000
mo_sugars = {s: v * mo_scale for s, v in mo_split.items()}
mo_other = 100 - MO["water"] - MO["fat"] - sum(mo_sugars.values()) - mo_kcl
ingredient(
    "molasses", "Molasses (cane)", "Sweetener", MO["water"],
    [(s, r(v)) for s, v in mo_sugars.items()] + [("potassium_chloride", r(mo_kcl))],
    cite("usda_fdc_sr_legacy", "FDC 168820 (SR Legacy, NDB 19304) 'Molasses', per 100 g", "Mem",
         "Carbohydrate 74.73, total sugars 74.72, fat 0.1, K 1464, Ca 205, Mg 242, Na 37 mg read in a "
         "secondary copy of this entry (Pub; FDC id confirmed); water 21.87 recalled (Mem). The recalled "
         "individual sugars (sucrose 29.40, glucose 11.94, fructose 12.79 g) add to only 54.13 g, so they "
         f"are used as proportions and scaled by {mo_scale:.4f} to the confirmed total (Derived from Mem "
         f"values). Potassium, the main cation, as KCl ({r(mo_kcl, 3)} g), an osmotic stand-in for K "
         "salts of aconitate, chloride and sulfate; Ca, Mg and the rest of the ash (sugars and KCl leave "
         f"{r(mo_other, 3)} g) are under insoluble.other, so a_w is somewhat overestimated."),
    synonyms=["treacle", "black treacle", "cane molasses"],
    insoluble=dict(fat=MO["fat"], other=r(mo_other)))

# ----------------------------------------------------------------- vinegar, salt
ingredient(
    "distilled_vinegar", "Distilled (white) vinegar, 5 % acetic acid", "Other", 95.0, [("acetic_acid", 5.0)],
    cite("usda_sr22", "NDB 02053 'Vinegar, distilled', FOOTNOTE file", "Pub",
         "The SR footnote for NDB 02053 reads 'Contains 5% acetic acid. Total proximates do not equal 100%.' "
         "(Pub; that 02053 is the distilled vinegar entry is from memory). Water is taken as the balance "
         "(Derived); the entry's traces of carbohydrate and ash (< 0.1 g) are ignored."),
    synonyms=["white vinegar", "spirit vinegar"])

TS = dict(water=0.20, Na=38758.0)
ts_nacl = TS["Na"] / ATOMIC["Na"] * M("sodium_chloride") / 1000
ingredient(
    "table_salt", "Table salt", "Salt", TS["water"], [("sodium_chloride", r(ts_nacl))],
    cite("usda_fdc_sr_legacy", "FDC 173468 (SR Legacy, NDB 02047) 'Salt, table', per 100 g", "Mem",
         "Water 0.20 g, ash 99.80 g, Na 38758 mg recalled from this entry, not confirmed (Mem). Sodium to salt: "
         f"38758 mg × 58.44/22.99 = {r(ts_nacl, 2)} g NaCl; the rest ({r(100 - TS['water'] - ts_nacl, 2)} g: "
         "anticaking agent and other salts) is under insoluble.other. Codex CXS 150-1985 (from memory) asks "
         "food-grade salt for ≥ 97 % NaCl on the dry basis. Iodised salt adds potassium iodide or iodate in "
         "the tens of mg per kg, which does not change a_w measurably."),
    synonyms=["salt", "sodium chloride", "iodised salt", "cooking salt"],
    insoluble=dict(other=r(100 - TS["water"] - ts_nacl)))

# ------------------------------------------------------------ hydrated salts
HYDRATES = [
    # id, name, solute, formula of the anhydrous form, n H2O, synonyms
    ("calcium_chloride_dihydrate", "Calcium chloride dihydrate", "calcium_chloride", "CaCl2", 2,
     ["CaCl2·2H2O", "E509"], "Salt"),
    ("magnesium_chloride_hexahydrate", "Magnesium chloride hexahydrate", "magnesium_chloride", "MgCl2", 6,
     ["MgCl2·6H2O", "nigari", "E511"], "Salt"),
    ("trisodium_citrate_dihydrate", "Trisodium citrate dihydrate", "sodium_citrate", "Na3C6H5O7", 2,
     ["sodium citrate", "E331(iii)"], "Salt"),
    ("tripotassium_citrate_monohydrate", "Tripotassium citrate monohydrate", "potassium_citrate", "K3C6H5O7", 1,
     ["potassium citrate", "E332(ii)"], "Salt"),
    ("sodium_acetate_trihydrate", "Sodium acetate trihydrate", "sodium_acetate", "NaC2H3O2", 3,
     ["E262(i)"], "Salt"),
    ("calcium_lactate_pentahydrate", "Calcium lactate pentahydrate", "calcium_lactate", "CaC6H10O6", 5,
     ["E327"], "Salt"),
    ("dextrose_monohydrate", "Dextrose monohydrate", "glucose", "C6H12O6", 1,
     ["glucose monohydrate", "dextrose"], "Sweetener"),
    ("lactose_monohydrate", "Lactose monohydrate", "lactose", "C12H22O11", 1,
     ["milk sugar", "alpha-lactose monohydrate"], "Sweetener"),
    ("citric_acid_monohydrate", "Citric acid monohydrate", "citric_acid", "C6H8O7", 1,
     ["E330"], "Other"),
]
for hid, name, sol, formula, n, syn, cat in HYDRATES:
    m_anh = M(sol)
    m_iupac = formula_mass(formula)
    water = 100 * n * M_WATER / (m_anh + n * M_WATER)
    ingredient(
        hid, name, cat, r(water), [(sol, r(100 - water))],
        cite("iupac2021", "standard atomic weights (abridged)", "Derived",
             f"Water of crystallisation from the formula {formula}·{n}H2O: {n} × {M_WATER:.3f} / "
             f"({m_anh:.3f} + {n} × {M_WATER:.3f}) = {water:.3f} g per 100 g; the rest is {sol} "
             f"({m_anh:.3f} g/mol). The crystal water joins the solution when the salt dissolves."),
        synonyms=syn)
    assert abs(m_anh - m_iupac) < 0.05, (sol, m_anh, m_iupac)


# ----------------------------------------------------------------- output

def fnum(x):
    s = f"{x:.4f}".rstrip("0")
    return s + "0" if s.endswith(".") else s


def fstr(s):
    return '"' + s.replace("\\", "\\\\").replace('"', '\\"') + '"'


def ron():
    lines = ["#![enable(implicit_some)]",
             "// Composite ingredients, g per 100 g of ingredient.",
             "// GENERATED by tests/data/regen/ingredients.py: edit the script (sources and",
             "// derivations live there and in each entry's `source.note`), then rerun it.",
             "(", "    ingredients: ["]
    for i in ING:
        lines.append("        (")
        lines.append(f"            id: {fstr(i['id'])},")
        lines.append(f"            name: {fstr(i['name'])},")
        if i["synonyms"]:
            lines.append("            synonyms: [" + ", ".join(fstr(s) for s in i["synonyms"]) + "],")
        lines.append(f"            category: {i['category']},")
        lines.append(f"            water_g_per_100g: {fnum(i['water'])},")
        if i["solutes"]:
            lines.append("            solutes: [")
            for s, g, m in i["solutes"]:
                extra = f", molar_mass_g_per_mol: {fnum(m)}" if m else ""
                lines.append(f"                (solute: {fstr(s)}, g_per_100g: {fnum(g)}{extra}),")
            lines.append("            ],")
        ins = {k: v for k, v in i["insoluble"].items() if v}
        if ins:
            lines.append("            insoluble: (" + ", ".join(f"{k}: {fnum(v)}" for k, v in ins.items()) + "),")
        c = i["cite"]
        lines.append("            source: (")
        lines.append(f"                key: {fstr(c['key'])},")
        if c["at"]:
            lines.append(f"                at: {fstr(c['at'])},")
        lines.append(f"                tag: {c['tag']},")
        lines.append(f"                note: {fstr(c['note'])},")
        lines.append("            ),")
        if i["notes"]:
            lines.append(f"            notes: {fstr(i['notes'])},")
        lines.append("        ),")
    lines += ["    ],", ")", ""]
    return "\n".join(lines)


def check():
    ok = True
    ids = set()
    for i in ING:
        assert re.fullmatch(r"[a-z0-9][a-z0-9_]*", i["id"]), i["id"]
        assert i["id"] not in ids, i["id"]
        ids.add(i["id"])
        total = i["water"] + sum(g for _, g, _ in i["solutes"]) + sum(i["insoluble"].values())
        neg = [k for k, v in i["insoluble"].items() if v < 0] + [s for s, g, _ in i["solutes"] if g < 0]
        flag = "" if abs(total - 100) <= 0.05 and not neg else "  <-- CHECK"
        ok &= not flag
        print(f"  {i['id']:34s} {total:8.4f} g{flag}")
    return ok


if __name__ == "__main__":
    print(f"{len(ING)} ingredients; composition sums (g per 100 g):")
    ok = check()
    print("DE check (DP4+ molar mass from nominal DE, then DE recomputed):")
    for sid, de, m4, back in DE_CHECK:
        print(f"  {sid}: nominal {de}, DP4+ M = {m4:.1f} g/mol, recomputed DE = {back:.4f}")
        ok &= abs(back - de) < 1e-9
    # Ideal (Raoult, fully dissociated) freezing point of whole milk, as a sanity check.
    wm = next(i for i in ING if i["id"] == "whole_milk")
    lac = next(g for s, g, _ in wm["solutes"] if s == "lactose")
    osm_lac = lac / M("lactose") / wm["water"] * 1000
    osm_salt = part_wm / wm["water"]  # mmol/g water = mol/kg (salts and NPN)
    kf = 1.8597  # K kg/mol, cryoscopic constant of water (CRC Handbook)
    print(f"whole milk: lactose {lac:.3f} g -> {osm_lac:.4f} mol/kg; salts and NPN {osm_salt:.4f} osmol/kg (ideal); "
          f"Raoult-dilute freezing point ≈ -{kf * (osm_lac + osm_salt):.3f} °C "
          f"(lactose alone -{kf * osm_lac:.3f} °C; with osmotic coefficient 0.90 on salts and NPN "
          f"-{kf * (osm_lac + 0.9 * osm_salt):.3f} °C)")
    if MISSING:
        print("note: molar masses not yet in assets/solutes for: " + ", ".join(MISSING)
              + " (formula masses used; rerun once the solute files define them)")
    text = ron()
    if "--check" in sys.argv:
        same = OUT.exists() and OUT.read_text() == text
        print("assets/ingredients.ron is " + ("up to date" if same else "OUT OF DATE"))
        ok &= same
    else:
        OUT.write_text(text)
        print(f"wrote {OUT.relative_to(ROOT)}")
    sys.exit(0 if ok else 1)

#!/usr/bin/env python3
"""Regenerates every Fit, Lib and Derived number of assets/solutes/nonelectrolytes.ron
and the Lib rows of tests/data/*.csv.

Run with the reference tools (CoolProp 8.0.0, thermo 0.6.1, chemicals 1.5.2, scipy):
    /tmp/refvenv/bin/python tests/data/regen/nonelectrolytes.py [--write-csv]
--write-csv rewrites tests/data/freezing_points.csv and tests/data/binary_water_activity.csv.

Model used in every fit (the same as colligo-core):
  Norrish (1966): ln a_w = ln x_w - K(T) x_s^2, mole fractions over water and solute molecules.
  Freezing point: the T at which ln a_w(x, T) = ln a_ice(T), with
  ln a_ice(T) = ln(p_ice/p_liq) of Murphy & Koop (2005) eqs. 7 and 10, shifted by +9.670816e-5
  so that it is zero at 273.15 K (water.rs, ice_equilibrium_ln_aw).
Sources of the data (keys of assets/sources/*.ron):
  crc_concentrative  CRC Handbook "Concentrative properties of aqueous solutions" (data of
                     A. V. Wolf 1966), freezing-point depression at mass % (rows below).
  melinder2010       Melinder (2010) freezing curves as implemented in CoolProp 8.0.0 incompressible
                     mixtures INCOMP::MGL (glycerol), INCOMP::MPG (propylene glycol),
                     INCOMP::MEA (ethanol); mass-fraction basis, valid 0-0.6.
  lange_table_5_13   Lange's Handbook of Chemistry, 15th ed., Table 5.13 (ethanol-water freezing points).
  makinen2010        K(25 C) of glycerol (1.16) used as the pin of the glycerol fit.
  poling2001_chemicals  Antoine constants of ethanol (chemicals 1.5.2, "Antoine Collection Poling").
  pemberton_mash1978 ethanol-water P-x-y at 303.15 K (transcribed in the thermopack repository).
  vlenotes_ethanol_water  ethanol-water isothermal P-x sets at 323.15 and 363.15 K (bldamalla/vle-notes).
  beebe1942_vlenotes, kirschbaum1939_vlizard  isobaric T-x-y checks near 101 kPa.
  badajoz2021        ethanol-water azeotrope at 100 kPa (x1 = 0.899, 351.39 K).
  coolprop800_heos, thermo061_dortmund_unifac  25 and 50 C checks of the ethanol fit (not fitted).
"""
import math
import numpy as np
from scipy.optimize import brentq, least_squares

MW = 18.015268  # g/mol, IAPWS-95
R = 8.314462618
# IUPAC 2021 abridged standard atomic weights (Prohaska et al. 2022, Table 1)
AW = dict(H=1.008, C=12.011, N=14.007, O=15.999)


def molar_mass(formula):
    import re
    return sum(AW[el] * (int(n) if n else 1) for el, n in re.findall(r"([A-Z][a-z]?)(\d*)", formula))


def ln_aw_ice(T):
    if T >= 273.15:
        return 0.0
    ln_ice = 9.550426 - 5723.265 / T + 3.53068 * math.log(T) - 0.00728332 * T
    ln_liq = (54.842763 - 6763.22 / T - 4.210 * math.log(T) + 0.000367 * T
              + math.tanh(0.0415 * (T - 218.8)) * (53.878 - 1331.22 / T - 9.44523 * math.log(T) + 0.014025 * T))
    return ln_ice - ln_liq + 9.670816045215247e-5


def xs_of(wpct, M):
    ns = wpct / M
    nw = (100.0 - wpct) / MW
    return ns / (ns + nw)


def tf_lnaw(wpct, M, lnaw_fn):
    """Freezing temperature (K) of a binary of mass % wpct for a ln a_w(x_s, T) model."""
    xs = xs_of(wpct, M)
    f = lambda T: lnaw_fn(xs, T) - ln_aw_ice(T)
    lo = 180.0
    if f(lo) * f(273.15 - 1e-12) > 0:
        return lo
    return brentq(f, lo, 273.15 - 1e-12, xtol=1e-10)


def tf_norrish(wpct, M, Kfun):
    return tf_lnaw(wpct, M, lambda xs, T: math.log(1 - xs) - Kfun(T) * xs * xs)


# ---------------------------------------------------------------------------------------------
# CRC "Concentrative properties of aqueous solutions" (Wolf 1966), (mass %, freezing-point
# depression / K), transcribed from the CRC 102nd ed. table.
CRC = {
    "acetic_acid": [(0.5, 0.16), (1, 0.32), (2, 0.63), (3, 0.94), (4, 1.26), (5, 1.58), (6, 1.9), (7, 2.23), (8, 2.56), (9, 2.89), (10, 3.23), (11, 3.57), (12, 3.91), (13, 4.26), (14, 4.61), (15, 4.97), (16, 5.33), (17, 5.69), (18, 6.06), (19, 6.43), (20, 6.81), (22, 7.57), (24, 8.36), (26, 9.17), (28, 10.0), (30, 10.84), (32, 11.7), (34, 12.55), (36, 13.38)],
    "citric_acid": [(0.5, 0.05), (1, 0.11), (2, 0.21), (3, 0.32), (4, 0.43), (5, 0.54), (6, 0.65), (7, 0.76), (8, 0.88), (9, 1.0), (10, 1.12), (12, 1.38), (14, 1.66), (16, 1.95), (18, 2.26), (20, 2.57), (22, 2.88), (24, 3.21), (26, 3.55), (28, 3.89), (30, 4.25)],
    "ethanol": [(0.5, 0.2), (1, 0.4), (2, 0.81), (3, 1.23), (4, 1.65), (5, 2.09), (6, 2.54), (7, 2.99), (8, 3.47), (9, 3.96), (10, 4.47), (11, 5.0), (12, 5.56), (13, 6.13), (14, 6.73), (15, 7.36), (16, 8.01), (17, 8.69), (18, 9.4), (19, 10.14), (20, 10.92), (22, 12.6), (24, 14.47), (26, 16.41), (28, 18.43), (30, 20.47), (32, 22.44), (34, 24.27), (36, 25.98), (38, 27.62), (40, 29.26), (42, 30.98), (44, 32.68), (46, 34.36), (48, 36.04), (50, 37.67), (52, 39.2), (54, 40.65), (56, 42.06), (58, 43.49), (60, 44.93), (62, 46.28), (64, 47.52), (66, 48.64), (68, 49.52)],
    "fructose": [(0.5, 0.05), (1, 0.1), (2, 0.21), (3, 0.32), (4, 0.43), (5, 0.54), (6, 0.66), (7, 0.78), (8, 0.9), (9, 1.03), (10, 1.16), (11, 1.29), (12, 1.43), (13, 1.57), (14, 1.71), (15, 1.86), (16, 2.01), (17, 2.16), (18, 2.32), (19, 2.48), (20, 2.64), (22, 3.05), (24, 3.43), (26, 3.82), (28, 4.2)],
    "glucose": [(0.5, 0.05), (1, 0.11), (2, 0.21), (3, 0.32), (4, 0.43), (5, 0.55), (6, 0.67), (7, 0.79), (8, 0.91), (9, 1.04), (10, 1.17), (11, 1.3), (12, 1.44), (13, 1.59), (14, 1.73), (15, 1.88), (16, 2.03), (17, 2.19), (18, 2.35), (19, 2.52), (20, 2.7), (22, 3.07), (24, 3.48), (26, 3.9), (28, 4.34), (30, 4.79)],
    "glycerol": [(0.5, 0.07), (1, 0.18), (2, 0.41), (3, 0.63), (4, 0.85), (5, 1.08), (6, 1.32), (7, 1.56), (8, 1.81), (9, 2.06), (10, 2.32), (12, 2.88), (14, 3.47), (16, 4.09), (18, 4.76), (20, 5.46), (24, 7.01), (28, 8.77), (32, 10.74), (36, 12.96), (40, 15.5)],
    "lactic_acid": [(0.5, 0.1), (1, 0.19), (2, 0.38), (3, 0.57), (4, 0.76), (5, 0.95), (6, 1.16), (7, 1.36), (8, 1.57), (9, 1.79), (10, 2.02), (12, 2.49), (14, 2.99), (16, 3.48), (18, 3.96), (20, 4.44)],
    "lactose": [(0.5, 0.03), (1, 0.06), (1.5, 0.08), (2, 0.11), (2.5, 0.14), (3, 0.17), (3.5, 0.2), (4, 0.23), (4.5, 0.26), (5, 0.29), (5.5, 0.32), (6, 0.35), (6.5, 0.39), (7, 0.42), (7.5, 0.46), (8, 0.5)],
    "maltose": [(0.5, 0.03), (1, 0.06), (2, 0.11), (3, 0.17), (4, 0.23), (5, 0.29), (6, 0.35), (7, 0.42), (8, 0.48), (9, 0.55), (10, 0.62), (11, 0.69), (12, 0.77), (13, 0.84), (14, 0.92), (15, 1.0), (16, 1.08), (17, 1.17), (18, 1.25), (19, 1.34), (20, 1.43), (22, 1.64), (24, 1.85), (26, 2.08), (28, 2.34), (30, 2.62), (32, 2.93), (34, 3.25), (36, 3.6), (38, 3.99), (40, 4.41), (42, 4.88), (44, 5.35)],
    "mannitol": [(0.5, 0.05), (1, 0.1), (1.5, 0.16), (2, 0.21), (2.5, 0.26), (3, 0.32), (3.5, 0.37), (4, 0.43), (4.5, 0.48), (5, 0.54), (5.5, 0.6), (6, 0.66), (6.5, 0.72), (7, 0.77), (7.5, 0.84), (8, 0.9), (8.5, 0.96), (9, 1.02), (9.5, 1.08), (10, 1.15), (11, 1.28), (12, 1.41), (13, 1.55), (14, 1.69), (15, 1.84)],
    "urea": [(0.5, 0.16), (1, 0.31), (2, 0.62), (3, 0.93), (4, 1.24), (5, 1.55), (6, 1.88), (7, 2.22), (8, 2.56), (9, 2.91), (10, 3.26), (11, 3.61), (12, 3.95), (13, 4.3), (14, 4.66), (15, 5.02), (16, 5.4), (17, 5.79), (18, 6.19), (19, 6.59), (20, 7.0), (22, 7.81), (24, 8.64), (26, 9.52), (28, 10.45), (30, 11.4), (32, 12.34), (34, 13.27), (36, 14.2), (38, 15.11), (40, 15.99), (42, 16.83), (44, 17.62)],
    "sucrose": [(10, 0.63), (20, 1.47), (30, 2.64), (40, 4.45)],
}
# Lange's Handbook of Chemistry, 15th ed. (Dean 1999), Table 5.13, ethanol-water: (mass %, K)
LANGE_ETHANOL = [(2.5, 1.0), (4.8, 2.0), (6.8, 3.0), (11.3, 5.0), (13.8, 6.1), (16.4, 7.5), (17.5, 8.7), (18.8, 9.4), (20.3, 10.6), (22.1, 12.2), (24.2, 14.0), (26.7, 16.0), (29.9, 18.9), (33.8, 23.6), (39.0, 28.7), (46.3, 33.9), (56.1, 41.0), (71.9, 51.3)]
LANGE_GLYCEROL = [(10, 1.6), (20, 4.8), (30, 9.5), (40, 15.5), (50, 22.0), (60, 33.6)]

FORMULA = {
    "sucrose": "C12H22O11", "glucose": "C6H12O6", "fructose": "C6H12O6", "galactose": "C6H12O6",
    "lactose": "C12H22O11", "maltose": "C12H22O11", "trehalose": "C12H22O11",
    "maltotriose": "C18H32O16", "glucose_oligomers": "C24H42O21", "glycerol": "C3H8O3",
    "sorbitol": "C6H14O6", "mannitol": "C6H14O6", "xylitol": "C5H12O5", "erythritol": "C4H10O4",
    "maltitol": "C12H24O11", "isomalt": "C12H24O11", "propylene_glycol": "C3H8O2",
    "butylene_glycol": "C4H10O2", "dipropylene_glycol": "C6H14O3", "urea": "CH4N2O",
    "betaine": "C5H11NO2", "glycine": "C2H5NO2", "proline": "C5H9NO2", "citric_acid": "C6H8O7",
    "lactic_acid": "C3H6O3", "malic_acid": "C4H6O5", "acetic_acid": "C2H4O2",
    "panthenol": "C9H19NO4", "ethanol": "C2H6O",
}
M = {k: round(molar_mass(v), 3) for k, v in FORMULA.items()}
# PEG 400: H(OCH2CH2)nOH with the nominal 400 g/mol: n = (400 - M(H2O)) / M(C2H4O)
N_PEG400 = (400.0 - molar_mass("H2O")) / molar_mass("C2H4O")


def melinder(code, w):
    import CoolProp.CoolProp as CP
    return CP.PropsSI("T_freeze", "T", 293.15, "P", 101325, "INCOMP::%s[%g]" % (code, w / 100.0))


def report_norrish(name, Mx, Kfun, rows):
    out = []
    for w, dt in rows:
        p = 273.15 - tf_norrish(w, Mx, Kfun)
        out.append((w, dt, p, p / dt - 1))
    return out


def fit_constant(rows, Mx, min_dt=0.0):
    data = [(w, dt) for w, dt in rows if dt >= min_dt]
    res = lambda p: [(273.15 - tf_norrish(w, Mx, lambda T: p[0])) - dt for w, dt in data]
    r = least_squares(res, [1.0])
    J = r.jac
    s2 = float(np.sum(r.fun ** 2) / max(len(data) - 1, 1))
    jtj = float((J.T @ J)[0, 0])
    sigma = math.sqrt(s2 / jtj) if jtj > 0 else float("inf")
    rms = math.sqrt(float(np.mean(r.fun ** 2)))
    return r.x[0], sigma, rms, data


def main():
    print("== molar masses (IUPAC 2021 abridged) ==")
    for k, v in M.items():
        print(f"  {k:20s} {FORMULA[k]:12s} {v:.3f}")
    print(f"  peg_400: n = {N_PEG400:.3f} ethylene-oxide units for 400 g/mol")

    print("\n== glycerol: K(T) = a + b/T, K(298.15 K) = 1.16 pinned (makinen2010), b fitted to the")
    print("   Melinder freezing curve (CoolProp INCOMP::MGL), 10-40 mass % in steps of 5; relative dT residuals")
    ws = list(range(10, 41, 5))
    mel = [(w, 273.15 - melinder("MGL", w)) for w in ws]

    def res_g(p):
        b = p[0]
        a = 1.16 - b / 298.15
        return [(273.15 - tf_norrish(w, M["glycerol"], lambda T: a + b / T)) / dt - 1 for w, dt in mel]
    r = least_squares(res_g, [1000.0])
    b = r.x[0]
    a = 1.16 - b / 298.15
    print(f"   a = {a:.4f}, b = {b:.2f} K; rms rel. residual vs Melinder {math.sqrt(np.mean(r.fun**2)):.4f}, max {abs(r.fun).max():.4f}")
    print(f"   K(-15 C) = {a + b/258.15:.3f}; K(0 C) = {a + b/273.15:.3f}; K(25 C) = {a + b/298.15:.3f}; x_s(40 %) = {xs_of(40, M['glycerol']):.4f}")
    for w, dt, p, rel in report_norrish("glycerol", M["glycerol"], lambda T: a + b / T, CRC["glycerol"] + LANGE_GLYCEROL[4:]):
        print(f"   check w={w:5.1f} obs {dt:6.2f} pred {p:6.3f} rel {rel:+.4f}")
    for w, dt, p, rel in report_norrish("glycerol", M["glycerol"], lambda T: 1.16, [(40, 15.5)]):
        print(f"   constant K=1.16 at 40 %: pred {p:.3f} vs CRC 15.50 ({rel:+.4f})")

    print("\n== propylene glycol: constant K fitted to Melinder (CoolProp INCOMP::MPG) 10-40 mass %, step 5; relative dT residuals")
    mel = [(w, 273.15 - melinder("MPG", w)) for w in range(10, 41, 5)]
    res_p = lambda p: [(273.15 - tf_norrish(w, M["propylene_glycol"], lambda T: p[0])) / dt - 1 for w, dt in mel]
    r = least_squares(res_p, [3.0])
    kpg = r.x[0]
    print(f"   K = {kpg:.4f}; rms rel. residual {math.sqrt(np.mean(r.fun**2)):.4f}, max {abs(r.fun).max():.4f}; x_s(40 %) = {xs_of(40, M['propylene_glycol']):.4f}")
    print("   Melinder points:", [(w, round(dt, 3)) for w, dt in mel])

    print("\n== constant-K fits to CRC freezing points (rows with dT >= 0.5 K, lactose >= 0.1 K; absolute dT residuals) ==")
    # lactose: its rows only reach 0.5 K, so rows from 0.1 K are used (rounding 0.005 K)
    for s in ["urea", "citric_acid", "lactic_acid", "acetic_acid", "lactose", "maltose", "mannitol", "glucose", "fructose"]:
        k, sig, rms, data = fit_constant(CRC[s], M[s], min_dt=0.1 if s == "lactose" else 0.5)
        rel = [(273.15 - tf_norrish(w, M[s], lambda T: k)) / dt - 1 for w, dt in data]
        print(f"   {s:12s} K = {k:+.3f} +- {sig:.3f} (n={len(data)}, {data[0][0]}-{data[-1][0]} %, x_s max {xs_of(data[-1][0], M[s]):.4f}, dT max {data[-1][1]} K) rms {rms:.3f} K, max rel {max(abs(x) for x in rel):.3f}")

    print("\n== published K checked against CRC ==")
    for s, k in [("sucrose", 6.47), ("glucose", 2.25), ("fructose", 2.25), ("maltose", 4.54), ("mannitol", 0.906)]:
        worst = max(report_norrish(s, M[s], lambda T: k, [r for r in CRC[s] if r[1] >= 0.5]), key=lambda t: abs(t[3]))
        allr = report_norrish(s, M[s], lambda T: k, [r for r in CRC[s] if r[1] >= 0.5])
        rms = math.sqrt(np.mean([(t[2] - t[1]) ** 2 for t in allr]))
        print(f"   {s:10s} K={k}: rms {rms:.3f} K, worst w={worst[0]} obs {worst[1]} pred {worst[2]:.3f} ({worst[3]:+.3f})")

    ethanol()


# Ethanol-water vapour-liquid equilibrium data (ethanol = 1).
# Pemberton & Mash (1978), static method, 303.15 K: (x1, y1, P/kPa), transcribed in the thermopack
# repository (thermotools/thermopack, addon/pyExamples/cpa_water_ethanol.py); pure-component
# pressures 10.472 and 4.247 kPa from the x1 = 1 and x1 = 0 rows of the same isotherm as
# transcribed in bldamalla/vle-notes (data/ethanol-water/T30.csv).
PM1978_303 = dict(T=303.15, p1=10.472, p2=4.247, rows=[
    (0.00435, 0.0412, 4.413), (0.01524, 0.1280, 4.803), (0.02727, 0.2043, 5.203), (0.04633, 0.2975, 5.781),
    (0.06783, 0.3753, 6.386), (0.10991, 0.4743, 7.329), (0.17111, 0.5479, 8.189), (0.24688, 0.5907, 8.723),
    (0.32385, 0.6194, 9.085), (0.38655, 0.6406, 9.303), (0.41758, 0.6508, 9.403), (0.50492, 0.6797, 9.663),
    (0.58087, 0.7087, 9.869), (0.63434, 0.7329, 9.999), (0.72455, 0.7810, 10.199), (0.80840, 0.8337, 10.341),
    (0.85785, 0.8705, 10.394), (0.89064, 0.8979, 10.427), (0.89934, 0.9056, 10.435), (0.92444, 0.9284, 10.445),
    (0.95370, 0.9556, 10.457), (0.97315, 0.9739, 10.467), (0.98153, 0.9819, 10.473)])
# Isothermal P-x sets transcribed in bldamalla/vle-notes, data/ethanol-water/ (x1, P/kPa); first
# and last rows are the pure liquids. T50 and T90 are fitted, T50_2 and T90_2 are checks only.
VLENOTES = {
    "T50": (323.15, [(1.0, 29.467), (0.9469, 29.515), (0.895, 29.483), (0.8412, 29.402), (0.7297, 29.002), (0.6528, 28.6), (0.5917, 28.187), (0.568, 27.979), (0.561, 28.018), (0.4609, 27.144), (0.4526, 27.172), (0.396, 26.604), (0.357, 26.263), (0.3482, 26.169), (0.3442, 26.19), (0.243, 24.93), (0.2297, 24.779), (0.1518, 23.171), (0.1398, 22.822), (0.0878, 20.594), (0.082, 20.276), (0.0536, 18.228), (0.028, 15.899), (0.0253, 15.633), (0.0, 12.347)]),
    "T90": (363.15, [(1.0, 157.892), (0.98153, 158.227), (0.97315, 158.354), (0.9537, 158.6), (0.92445, 158.868), (0.89935, 158.963), (0.85783, 158.914), (0.80833, 158.489), (0.76364, 157.811), (0.72433, 157.003), (0.63399, 154.47), (0.58044, 152.616), (0.50445, 149.595), (0.41705, 145.622), (0.388, 144.188), (0.32356, 140.677), (0.24642, 135.64), (0.17057, 128.811), (0.10939, 119.548), (0.06731, 108.298), (0.04594, 99.667), (0.02693, 89.62), (0.01507, 81.909), (0.00429, 73.726), (0.0, 70.124)]),
    "T50_2": (323.15, [(1.0, 29.515), (0.9434, 29.576), (0.8862, 29.567), (0.8837, 29.474), (0.7753, 29.299), (0.7253, 29.072), (0.6756, 28.824), (0.6269, 28.541), (0.5769, 28.213), (0.5236, 27.828), (0.4987, 27.646), (0.4765, 27.458), (0.4487, 27.216), (0.3991, 26.759), (0.348, 26.257), (0.2999, 25.728), (0.2491, 25.073), (0.1995, 24.242), (0.1505, 23.081), (0.1008, 21.142), (0.0743, 19.614), (0.049, 17.64), (0.022, 15.087), (0.0, 12.375)]),
    "T90_2": (363.15, [(1.0, 158.49), (0.99755, 158.54), (0.95921, 159.16), (0.91231, 159.48), (0.86455, 159.56), (0.81658, 159.16), (0.76903, 158.49), (0.72155, 157.52), (0.67564, 156.31), (0.62981, 154.89), (0.58487, 153.33), (0.53597, 151.47), (0.48771, 149.44), (0.43922, 147.21), (0.3917, 144.9), (0.34348, 142.32), (0.32859, 141.53), (0.29404, 139.51), (0.27556, 138.14), (0.24604, 136.2), (0.22053, 134.07), (0.17001, 129.3), (0.11396, 121.21), (0.05444, 104.13), (0.0, 70.34)]),
}
# Isobaric checks (x1, y1, T/K): Beebe et al. (1942) at 760 torr as transcribed in bldamalla/vle-notes
# (data/ethanol-water/P760.csv, T in deg C there), and Kirschbaum & Gerstner (1939) at 98.6586 kPa as
# transcribed in Lemonexe/VLizard (appPy/data/VLE/EtOH-H2O/1939atm.tsv).
BEEBE_760 = (101325.0, [(x, y, t + 273.15) for x, y, t in [
    (0.0028, 0.0320, 99.30), (0.0118, 0.1130, 96.90), (0.0137, 0.1570, 96.00), (0.0144, 0.1350, 96.00), (0.0176, 0.1560, 95.60),
    (0.0222, 0.1860, 94.80), (0.0246, 0.2120, 93.80), (0.0302, 0.2310, 93.50), (0.0331, 0.2480, 92.90), (0.0519, 0.3180, 90.50),
    (0.0530, 0.3140, 90.50), (0.0625, 0.3390, 89.40), (0.0673, 0.3700, 88.40), (0.0715, 0.3620, 88.60), (0.0871, 0.4060, 87.20),
    (0.1260, 0.4680, 85.40), (0.1430, 0.4780, 84.50), (0.1720, 0.5050, 84.00), (0.2060, 0.5300, 83.40), (0.2100, 0.5270, 83.00),
    (0.2500, 0.5520, 82.30), (0.2840, 0.5670, 82.00), (0.3210, 0.5860, 81.40), (0.3240, 0.5860, 81.50), (0.3450, 0.5910, 81.20),
    (0.4050, 0.6140, 80.90), (0.4300, 0.6260, 80.50), (0.4490, 0.6330, 80.20), (0.5060, 0.6610, 80.00), (0.5450, 0.6730, 79.50),
    (0.6630, 0.7330, 78.80), (0.7350, 0.7760, 78.50), (0.8040, 0.8150, 78.40), (0.9170, 0.9060, 78.30)]])
KIRSCHBAUM_1939 = (98658.6, [
    (0.005521689, 0.059848453, 370.82377), (0.013576588, 0.138879737, 368.873575), (0.023091001, 0.209186116, 366.873375),
    (0.034618501, 0.269147218, 364.92318), (0.051992735, 0.330508421, 362.523), (0.07905307, 0.401761933, 359.823),
    (0.107775107, 0.452702953, 358.073), (0.1291679, 0.479487617, 357.153), (0.157233963, 0.503867047, 356.223),
    (0.166428293, 0.515186965, 355.943), (0.198329383, 0.529329822, 355.273), (0.20849936, 0.530632695, 355.123),
    (0.317234633, 0.578132943, 353.653), (0.414312092, 0.617489791, 352.72304), (0.49032876, 0.646742508, 352.1231),
    (0.498906744, 0.654667798, 352.02311), (0.625820226, 0.712996552, 351.1232), (0.755196063, 0.786431104, 350.42327)])
# Wilson a12(T), a21(T) (J/mol) as fitted: Taylor forms about 298.15 K (tfun.rs TempFn::Taylor).
ETHANOL_TR = 298.15
ETHANOL_START = [367.5, 116.0, -3.375, 2900.1, 23.58]  # value12, d1_12, d2_12, value21, d1_21


def ethanol_a(p, T):
    dt = T - ETHANOL_TR
    return p[0] + p[1] * dt + 0.5 * p[2] * dt * dt, p[3] + p[4] * dt


def ethanol_antoine():
    from chemicals.vapor_pressure import Psat_data_AntoinePoling as D
    row = D.loc["64-17-5"]
    return float(row["A"]), float(row["B"]), float(row["C"]), row


def ethanol():
    print("\n== ethanol: Wilson a12(T), a21(T) (J/mol), V_w/V_e from ChemSep via thermo 0.6.1")
    from thermo.interaction_parameters import IPDB
    import CoolProp.CoolProp as CP
    C = ["64-17-5", "7732-18-5"]
    la = IPDB.get_ip_asymmetric_matrix(name="ChemSep Wilson", CASs=C, ip="aij")
    lb = IPDB.get_ip_asymmetric_matrix(name="ChemSep Wilson", CASs=C, ip="bij")
    ratio = math.exp(la[0][1])  # V_water / V_ethanol
    Vw = 18.07
    Ve = Vw / ratio
    print(f"   ChemSep (thermo 0.6.1) Wilson: a12 = {-lb[0][1]*R:.1f} J/mol, a21 = {-lb[1][0]*R:.1f} J/mol, V_w/V_e = {ratio:.6f} -> V_e = {Ve:.3f} cm3/mol for V_w = {Vw}")
    Me = M["ethanol"]

    def lng(x1, T, a12, a21):
        """(ln gamma_ethanol, ln gamma_water), Wilson (1964)."""
        x2 = 1 - x1
        L12 = (Vw / Ve) * math.exp(-a12 / (R * T))
        L21 = (Ve / Vw) * math.exp(-a21 / (R * T))
        s1, s2 = x1 + L12 * x2, x2 + L21 * x1
        d = L12 / s1 - L21 / s2
        return -math.log(s1) + x2 * d, -math.log(s2) - x1 * d

    def G(p):
        return lambda x, T: lng(x, T, *ethanol_a(p, T))

    def tf(w, p):
        g = G(p)
        return tf_lnaw(w, Me, lambda x, T: math.log(1 - x) + g(x, T)[1])

    def isotherm(name):
        T, rows = VLENOTES[name]
        p1 = [P for x, P in rows if x == 1.0][0]
        p2 = [P for x, P in rows if x == 0.0][0]
        return dict(name=name, T=T, p1=p1, p2=p2, rows=[(x, P) for x, P in rows if 0 < x < 1])
    pm = dict(name="PM1978 303.15", T=PM1978_303["T"], p1=PM1978_303["p1"], p2=PM1978_303["p2"], rows=[(x, P) for x, y, P in PM1978_303["rows"]])
    fit_sets = [pm, isotherm("T50"), isotherm("T90")]
    check_sets = [isotherm("T50_2"), isotherm("T90_2")]

    def p_rel(ds, g, xmax=1.0):
        """Relative residuals of the bubble pressure x1 g1 p1 + x2 g2 p2 (ideal vapour, the set's own pure pressures)."""
        out = []
        for x, P in ds["rows"]:
            if x > xmax:
                continue
            g1, g2 = g(x, ds["T"])
            out.append((x * math.exp(g1) * ds["p1"] + (1 - x) * math.exp(g2) * ds["p2"]) / P - 1)
        return np.array(out)
    mel = [(w, 273.15 - melinder("MEA", w)) for w in range(5, 41, 5)]
    crc = [(w, dt) for w, dt in CRC["ethanol"] if w <= 40 and dt >= 0.5]
    lange = [(w, dt) for w, dt in LANGE_ETHANOL if w <= 40]
    SF, SP = 0.01, 0.01  # weights: 1 % on dT_f, 1 % on P

    def res(p):
        r = [((273.15 - tf(w, p)) / dt - 1) / SF for w, dt in mel + crc]
        for ds in fit_sets:
            r += list(p_rel(ds, G(p)) / SP)
        return np.array(r)
    print("   fit: a12 = v12 + d1_12 (T - 298.15) + d2_12/2 (T - 298.15)^2, a21 = v21 + d1_21 (T - 298.15);")
    print(f"   data: Melinder (CoolProp INCOMP::MEA) 5-40 % step 5 ({len(mel)}) + CRC rows <= 40 %, dT >= 0.5 K ({len(crc)}),")
    print(f"   relative dT / {SF}; P-x at 303.15 (Pemberton & Mash 1978, {len(pm['rows'])}), 323.15 and 363.15 K (vle-notes T50, T90, 23 each), relative P / {SP}")
    r = least_squares(res, ETHANOL_START, x_scale=[100, 10, 1, 100, 10])
    p = r.x
    print(f"   a12: value {p[0]:.1f} J/mol, d1 {p[1]:.3f} J/(mol K), d2 {p[2]:.4f} J/(mol K2); a21: value {p[3]:.1f} J/mol, d1 {p[4]:.3f} J/(mol K)")
    g = G(p)
    print("   a12, a21 (J/mol) at T/C:", {t: tuple(int(round(v)) for v in ethanol_a(p, t + 273.15)) for t in [-60, -35, -20, 0, 25, 50, 78, 100]})
    for name, rows in [("Melinder (fit)", mel), ("CRC (fit)", crc), ("Lange (check)", lange)]:
        rel = np.array([(273.15 - tf(w, p)) / dt - 1 for w, dt in rows])
        i = int(np.abs(rel).argmax())
        print(f"   freezing {name}, n={len(rows)}: rms rel {math.sqrt(np.mean(rel**2)):.4f}, worst {rel[i]:+.4f} at {rows[i][0]} %")
    print("   freezing dT/K predicted:", {w: round(273.15 - tf(w, p), 2) for w in [10, 16.4, 20, 30, 40, 45, 50]},
          "(CRC 45 %: ~33.5, 50 %: 37.67; beyond 40 % the fit is not used)")
    for ds in fit_sets + check_sets:
        rr = p_rel(ds, g)
        rs = p_rel(ds, g, 0.35)
        i = int(np.abs(rr).argmax())
        tag = "fit" if ds in fit_sets else "check"
        print(f"   P-x {ds['name']} ({tag}), n={len(rr)}: rms {math.sqrt(np.mean(rr**2)):.4f}, worst {rr[i]:+.4f} at x1={ds['rows'][i][0]}; x1 <= 0.35: rms {math.sqrt(np.mean(rs**2)):.4f}, worst {np.abs(rs).max():.4f}")
    dy = []
    for x, y, P in PM1978_303["rows"]:
        g1, g2 = g(x, 303.15)
        q1, q2 = x * math.exp(g1) * PM1978_303["p1"], (1 - x) * math.exp(g2) * PM1978_303["p2"]
        dy.append(q1 / (q1 + q2) - y)
    dy = np.array(dy)
    print(f"   y1 at 303.15 K (check, not fitted): rms {math.sqrt(np.mean(dy**2)):.4f}, worst {dy[np.abs(dy).argmax()]:+.4f}")

    A, B, Cc, row = ethanol_antoine()
    pe = lambda T: 10 ** (A - B / (T + Cc))  # Pa
    pw = lambda T: CP.PropsSI("P", "T", T, "Q", 0, "Water")  # IAPWS-95 via CoolProp

    def bubble(x, P):
        def f(T):
            g1, g2 = g(x, T)
            return x * math.exp(g1) * pe(T) + (1 - x) * math.exp(g2) * pw(T) - P
        T = brentq(f, 300.0, 400.0)
        g1, _ = g(x, T)
        return T, x * math.exp(g1) * pe(T) / P
    for name, (P, rows) in [("Beebe 1942, 101.325 kPa", BEEBE_760), ("Kirschbaum 1939, 98.66 kPa", KIRSCHBAUM_1939)]:
        dT, dyy = [], []
        for x, y, T in rows:
            Tb, yb = bubble(x, P)
            dT.append(Tb - T)
            dyy.append(yb - y)
        dT, dyy = np.array(dT), np.array(dyy)
        print(f"   isobaric check {name}, n={len(dT)} (record's Antoine, IAPWS water): bubble T rms {math.sqrt(np.mean(dT**2)):.2f} K, worst {dT[np.abs(dT).argmax()]:+.2f} K; y1 rms {math.sqrt(np.mean(dyy**2)):.4f}, worst {dyy[np.abs(dyy).argmax()]:+.4f}")
    print("   bubble T at 101.325 kPa (C):", {x: round(bubble(x, 101325.0)[0] - 273.15, 2) for x in [0.01, 0.05, 0.1, 0.2, 0.5, 0.8, 0.95]})
    for P in [100000.0, 101325.0]:
        xs = np.linspace(0.5, 0.999, 200)
        d = [bubble(x, P)[1] - x for x in xs]
        az = [brentq(lambda x: bubble(x, P)[1] - x, xs[i], xs[i + 1]) for i in range(len(xs) - 1) if d[i] > 0 >= d[i + 1]]
        print(f"   azeotrope at {P/1000:g} kPa:", [(round(a, 4), round(bubble(a, P)[0] - 273.15, 2)) for a in az])

    from thermo.unifac import UNIFAC, DOUFSG, DOUFIP2016

    def unifac_do(x1, T):
        """(a_w, a_e) from Dortmund modified UNIFAC, 2016 parameters (thermo 0.6.1); CH3 + CH2 + OH(P), H2O."""
        m = UNIFAC.from_subgroups(T=T, xs=[x1, 1 - x1], chemgroups=[{1: 1, 2: 1, 14: 1}, {16: 1}],
                                  subgroups=DOUFSG, interaction_data=DOUFIP2016, version=1)
        gg = m.gammas()
        return (1 - x1) * gg[1], x1 * gg[0]
    for w in [10, 20, 40]:
        x = xs_of(w, Me)
        g1, g2 = g(x, 298.15)
        uw, ue = unifac_do(x, 298.15)
        print(f"   25 C, {w} %: a_w {(1-x)*math.exp(g2):.4f} (CoolProp HEOS {aw_heos(x, 298.15):.4f}, Dortmund UNIFAC {uw:.4f}); "
              f"p_ethanol {x*math.exp(g1)*pe(298.15)/1000:.3f} kPa (Dortmund UNIFAC with the same Antoine {ue*pe(298.15)/1000:.3f})")
    x = xs_of(20, Me)
    print("   20 %: a_w(T):", {t: round((1 - x) * math.exp(g(x, t + 273.15)[1]), 4) for t in range(-35, 101, 15)})
    print("   20 %: gamma_ethanol(T):", {t: round(math.exp(g(x, t + 273.15)[0]), 3) for t in range(-35, 101, 15)},
          "Dortmund UNIFAC:", {t: round(unifac_do(x, t + 273.15)[1] / x, 3) for t in [-35, 25, 85]})

    print("\n== ethanol Antoine: chemicals 1.5.2 'Antoine Collection Poling' (Poling et al. 2001, App. A)")
    print(f"   stored (log10 Pa, T in K): A={A}, B={B}, C={Cc}, {row['Tmin']}-{row['Tmax']} K")
    print(f"   log10(p/kPa) = {A-3:.5f} - {B}/(T/K + ({Cc}))  [A - 3 converts Pa to kPa]")
    for t in [25.0, 78.29]:
        T = t + 273.15
        print(f"   p({t} C) = {10**(A - 3 - B/(T + Cc)):.3f} kPa")
    return p


def aw_heos(x1, T, P=101325.0):
    """a_w of ethanol-water from CoolProp 8.0.0 HEOS (REFPROP 9.1 mixture parameters): f_w / f_w(pure)."""
    import CoolProp.CoolProp as CP
    AS = CP.AbstractState("HEOS", "Ethanol&Water")
    AS.set_mole_fractions([x1, 1 - x1])
    AS.specify_phase(CP.iphase_liquid)
    AS.update(CP.PT_INPUTS, P, T)
    W = CP.AbstractState("HEOS", "Water")
    W.specify_phase(CP.iphase_liquid)
    W.update(CP.PT_INPUTS, P, T)
    return AS.fugacity(1) / W.fugacity(0)


# Rows of references.md section 3 (CRC, Wolf 1966) for the electrolytes, kept beside the rest.
CRC_SALTS = {"sodium_chloride": [(1, 0.59), (2, 1.19), (5, 3.05), (10, 6.56), (20, 16.46)],
             "potassium_chloride": [(1, 0.46), (5, 2.32), (10, 4.81)]}
# references.md section 2: a_w at 25 C computed with pytzer 0.6.0 (Archer 1992 NaCl, Archer 1999
# KCl, Moller 1988 CaCl2), (molality mol/kg, a_w); converted here to mass %.
PYTZER_AW = {"sodium_chloride": (58.440, [(0.1, 0.99665), (0.5, 0.98353), (1, 0.96680), (2, 0.93136), (4, 0.85121), (6, 0.76000)]),
             "potassium_chloride": (74.548, [(0.1, 0.99667), (1, 0.96812), (2, 0.93616), (4, 0.86987)]),
             "calcium_chloride": (110.978, [(0.1, 0.99537), (0.5, 0.97559), (1, 0.94525)])}


def write_csvs(root):
    """Writes tests/data/freezing_points.csv and tests/data/binary_water_activity.csv.

    Freezing points: CRC rows with dT >= 0.5 K (rounding to 0.01 K is then <= 2 %), plus every
    row of references.md section 3; ethanol and glycerol only to 40 % (the data range of their
    models); Lange glycerol 10 % and 20 % are left out (below the ideal-solution depression,
    inconsistent with CRC and Melinder), 50 % and 60 % are beyond the model range.
    """
    import os
    rows = []
    names = {"sucrose": "sucrose", "glucose": "glucose", "fructose": "fructose", "glycerol": "glycerol",
             "maltose": "maltose", "mannitol": "mannitol", "urea": "urea", "citric_acid": "citric_acid",
             "lactic_acid": "lactic_acid", "acetic_acid": "acetic_acid", "lactose": "lactose", "ethanol": "ethanol"}
    for s, data in CRC.items():
        for w, dt in data:
            if dt < 0.5 and s != "sucrose":
                continue
            if s in ("ethanol", "glycerol") and w > 40:
                continue
            rows.append((names[s], w, dt, "wolf_crc102", "Pub"))
    for s, data in CRC_SALTS.items():
        for w, dt in data:
            rows.append((s, w, dt, "wolf_crc102", "Pub"))
    for w, dt in LANGE_ETHANOL:
        if w <= 40:
            rows.append(("ethanol", w, dt, "lange15_t513", "Pub"))
    for w, dt in LANGE_GLYCEROL:
        if w in (30, 40):
            rows.append(("glycerol", w, dt, "lange15_t513", "Pub"))
    for code, s, ws in [("MGL", "glycerol", range(10, 41, 5)), ("MPG", "propylene_glycol", range(10, 41, 5)), ("MEA", "ethanol", range(5, 41, 5))]:
        for w in ws:
            rows.append((s, w, round(273.15 - melinder(code, w), 3), "melinder2010_coolprop", "Lib"))
    with open(os.path.join(root, "freezing_points.csv"), "w") as f:
        f.write("solute,mass_percent,delta_t_k,source,tag\n")
        for r in rows:
            f.write(f"{r[0]},{r[1]:g},{r[2]:g},{r[3]},{r[4]}\n")
    aw = []
    for s, (Ms, data) in PYTZER_AW.items():
        for m, a in data:
            aw.append((s, round(100 * m * Ms / (1000 + m * Ms), 4), 25.0, a, "pytzer060", "Lib"))
    # Ethanol. The source column says whether a row is data of the Wilson fit or independent of it.
    for x in [0.02, 0.05, 0.1, 0.2]:
        w = 100 * x * M["ethanol"] / (x * M["ethanol"] + (1 - x) * MW)
        aw.append(("ethanol", round(w, 4), 25.0, round(aw_heos(x, 298.15), 5), "coolprop800_heos (independent)", "Lib"))
    from thermo.unifac import UNIFAC, DOUFSG, DOUFIP2016
    for t in [25.0, 50.0]:
        for x in [0.02, 0.05, 0.1, 0.2]:
            m = UNIFAC.from_subgroups(T=t + 273.15, xs=[x, 1 - x], chemgroups=[{1: 1, 2: 1, 14: 1}, {16: 1}],
                                      subgroups=DOUFSG, interaction_data=DOUFIP2016, version=1)
            w = 100 * x * M["ethanol"] / (x * M["ethanol"] + (1 - x) * MW)
            aw.append(("ethanol", round(w, 4), t, round((1 - x) * m.gammas()[1], 5), "thermo061_dortmund_unifac (independent)", "Lib"))
    # Pemberton & Mash (1978) at 303.15 K: a_w = P (1 - y1) / p_w*, ideal vapour (their P is Wilson fit data).
    for x, y, P in PM1978_303["rows"]:
        if x <= 0.42:
            w = 100 * x * M["ethanol"] / (x * M["ethanol"] + (1 - x) * MW)
            aw.append(("ethanol", round(w, 4), 30.0, round(P * (1 - y) / PM1978_303["p2"], 4), "pemberton_mash1978 (fit data)", "Derived"))
    with open(os.path.join(root, "binary_water_activity.csv"), "w") as f:
        f.write("solute,mass_percent,t_c,water_activity,source,tag\n")
        for r in aw:
            f.write(f"{r[0]},{r[1]:g},{r[2]:g},{r[3]:g},{r[4]},{r[5]}\n")
    print(f"wrote {len(rows)} freezing points and {len(aw)} water activities")


if __name__ == "__main__":
    import os
    import sys
    main()
    if "--write-csv" in sys.argv:
        write_csvs(os.path.join(os.path.dirname(os.path.abspath(__file__)), ".."))

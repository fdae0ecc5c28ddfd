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


def ethanol():
    print("\n== ethanol: Wilson a12, a21 (J/mol) fitted to the Melinder freezing curve (CoolProp INCOMP::MEA)")
    print("   5-40 mass % in steps of 5, relative dT residuals; V_w/V_e from ChemSep via thermo 0.6.1")
    from thermo.interaction_parameters import IPDB
    C = ["64-17-5", "7732-18-5"]
    la = IPDB.get_ip_asymmetric_matrix(name="ChemSep Wilson", CASs=C, ip="aij")
    lb = IPDB.get_ip_asymmetric_matrix(name="ChemSep Wilson", CASs=C, ip="bij")
    ratio = math.exp(la[0][1])  # V_water / V_ethanol
    Vw = 18.07
    Ve = Vw / ratio
    print(f"   ChemSep (thermo 0.6.1) Wilson: a12 = {-lb[0][1]*R:.1f} J/mol, a21 = {-lb[1][0]*R:.1f} J/mol, V_w/V_e = {ratio:.6f} -> V_e = {Ve:.3f} cm3/mol for V_w = {Vw}")
    Me = M["ethanol"]

    def lngw(x1, T, a12, a21):
        x2 = 1 - x1
        L12 = (Vw / Ve) * math.exp(-a12 / (R * T))
        L21 = (Ve / Vw) * math.exp(-a21 / (R * T))
        return -math.log(x2 + L21 * x1) - x1 * (L12 / (x1 + L12 * x2) - L21 / (x2 + L21 * x1))

    def tf(w, a12, a21):
        return tf_lnaw(w, Me, lambda x, T: math.log(1 - x) + lngw(x, T, a12, a21))
    cs = (-lb[0][1] * R, -lb[1][0] * R)
    for w, dt in [(10, 4.47), (20, 10.92), (30, 20.47)]:
        print(f"   ChemSep set, CRC w={w}: obs {dt} pred {273.15 - tf(w, *cs):.2f}")
    mel = [(w, 273.15 - melinder("MEA", w)) for w in range(5, 41, 5)]
    res = lambda p: [(273.15 - tf(w, *p)) / dt - 1 for w, dt in mel]
    r = least_squares(res, [3356.6, -766.4])
    a12, a21 = r.x
    print(f"   fit: a12 = {a12:.1f} J/mol, a21 = {a21:.1f} J/mol; rms rel. vs Melinder {math.sqrt(np.mean(r.fun**2)):.4f}, max {abs(r.fun).max():.4f}")
    for name, rows in [("CRC", [x for x in CRC["ethanol"] if x[0] <= 40]), ("Lange", [x for x in LANGE_ETHANOL if x[0] <= 40])]:
        rel = np.array([(273.15 - tf(w, a12, a21)) / dt - 1 for w, dt in rows if dt >= 0.5])
        print(f"   check vs {name} (<= 40 %): rms rel {math.sqrt(np.mean(rel**2)):.4f}, max {abs(rel).max():.4f}")
    for w in [10, 20, 30, 40, 50]:
        print(f"   w={w}: pred {273.15 - tf(w, a12, a21):.2f} K")
    # 25 C behaviour against CoolProp's Helmholtz mixture model (REFPROP 9.1 parameters)
    import CoolProp.CoolProp as CP

    def aw_heos(x1, T, P=101325.0):
        AS = CP.AbstractState("HEOS", "Ethanol&Water")
        AS.set_mole_fractions([x1, 1 - x1])
        AS.specify_phase(CP.iphase_liquid)
        AS.update(CP.PT_INPUTS, P, T)
        W = CP.AbstractState("HEOS", "Water")
        W.specify_phase(CP.iphase_liquid)
        W.update(CP.PT_INPUTS, P, T)
        return AS.fugacity(1) / W.fugacity(0)
    for x in [0.02, 0.05, 0.1, 0.2]:
        print(f"   25 C x_e={x}: a_w Wilson-fit {(1-x)*math.exp(lngw(x, 298.15, a12, a21)):.4f}, ChemSep {(1-x)*math.exp(lngw(x, 298.15, *cs)):.4f}, CoolProp HEOS {aw_heos(x, 298.15):.4f}")

    print("\n== ethanol Antoine: chemicals 1.5.2 'Antoine Collection Poling' (Poling et al. 2001, App. A)")
    from chemicals.vapor_pressure import Psat_data_AntoinePoling as D
    row = D.loc["64-17-5"]
    A, B, Cc = float(row["A"]), float(row["B"]), float(row["C"])
    print(f"   stored (log10 Pa, T in K): A={A}, B={B}, C={Cc}, {row['Tmin']}-{row['Tmax']} K")
    print(f"   log10(p/kPa) = {A-3:.5f} - {B}/(T/K + ({Cc}))  [A - 3 converts Pa to kPa]")
    for t in [25.0, 78.29]:
        T = t + 273.15
        print(f"   p({t} C) = {10**(A - 3 - B/(T + Cc)):.3f} kPa")


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
    import CoolProp.CoolProp as CP
    for x in [0.02, 0.05, 0.1, 0.2]:
        AS = CP.AbstractState("HEOS", "Ethanol&Water")
        AS.set_mole_fractions([x, 1 - x])
        AS.specify_phase(CP.iphase_liquid)
        AS.update(CP.PT_INPUTS, 101325.0, 298.15)
        W = CP.AbstractState("HEOS", "Water")
        W.specify_phase(CP.iphase_liquid)
        W.update(CP.PT_INPUTS, 101325.0, 298.15)
        a = AS.fugacity(1) / W.fugacity(0)
        w = 100 * x * M["ethanol"] / (x * M["ethanol"] + (1 - x) * MW)
        aw.append(("ethanol", round(w, 4), 25.0, round(a, 5), "coolprop800_heos", "Lib"))
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

"""Regenerate the pure-water and ice reference tables in tests/data/.

    /tmp/refvenv/bin/python tests/data/regen/water.py      (iapws 1.5.5, pytzer 0.6.0)

Lib rows are computed here; Pub and Mem rows are literals, each with its source.
The script also checks that the libraries reproduce the published check values.
"""
import csv
import math
import pathlib
import warnings

import jax

jax.config.update("jax_enable_x64", True)
import pytzer as pz
from iapws import IAPWS95, iapws97
from iapws._iapws import _Ice, _Sublimation_Pressure
from scipy.optimize import brentq, minimize_scalar

warnings.simplefilter("ignore")  # iapws warns "Using extrapolated values" below 0 C
OUT = pathlib.Path(__file__).resolve().parents[1]
M_W, R = 18.015268, 8.314462618  # g/mol (IAPWS-95); J/(mol K) (CODATA 2018)
M_NACL = 58.443  # g/mol
P_MPA = 0.1  # pressure of the ice-equilibrium, density and ice-fraction tables
W95 = IAPWS95(T=300.0, P=0.1)  # an instance, for its Helmholtz-energy evaluator
IAPWS = "iapws 1.5.5"


def write(name, header, rows):
    for row in rows:
        assert not any("," in str(v) for v in row), row
    with open(OUT / name, "w", newline="") as f:
        w = csv.writer(f, lineterminator="\n")
        w.writerow(header)
        w.writerows(rows)
    print(f"{name}: {len(rows)} rows")


def g(x):
    return f"{x:.9g}"


# --- saturation of liquid water -----------------------------------------------------
IF97_PS = [(300.0, 0.353658941e-2), (500.0, 0.263889776e1), (600.0, 0.123443146e2)]  # MPa
IF97_TS = [(0.1, 372.755919), (1.0, 453.035632)]  # MPa, K
for t, p in IF97_PS:
    assert abs(iapws97._PSat_T(t) / p - 1) < 1e-8
for p, t in IF97_TS:
    assert abs(iapws97._TSat_P(p) - t) < 1e-6


def props95(rho, t):
    """IAPWS-95 pressure (kPa) and specific Gibbs energy (kJ/kg) at (rho, T)."""
    h = W95._Helmholtz(rho, t)
    return h["P"], h["h"] - t * h["s"]


def p_sat_metastable(t):
    """IAPWS-95 vapour pressure of supercooled liquid, Pa: equal Gibbs energy of the
    liquid and vapour roots of p(rho, T) = p (iapws' own saturation routine stops at
    the triple point). Bracket: +-30 % around a Clausius-Clapeyron estimate."""
    p_guess = 611.657 * math.exp(-5400 * (1 / t - 1 / 273.16))
    rho_min = minimize_scalar(lambda r: props95(r, t)[0], bounds=(900, 1000), method="bounded").x

    def dg(p):  # p in kPa
        rl = brentq(lambda r: props95(r, t)[0] - p, rho_min, 1050, xtol=1e-12)
        r0 = p / (W95.R * t)
        rv = brentq(lambda r: props95(r, t)[0] - p, 0.5 * r0, 1.5 * r0, xtol=1e-16)
        return props95(rl, t)[1] - props95(rv, t)[1]

    return 1e3 * brentq(dg, 0.7e-3 * p_guess, 1.3e-3 * p_guess, xtol=1e-14)


sat = [["IF97", g(t), g(p * 1e6), "IAPWS-IF97 Revised Release 2007 Table 35", "Pub"] for t, p in IF97_PS]
for c in [0.01, 10, 20, 25, 30, 40, 50, 60, 70, 80, 90, 100, 110, 120, 150, 200]:
    t = round(273.15 + c, 2)
    p = IAPWS95(T=t, x=0).P * 1e6
    sat.append(["IAPWS-95", f"{t:.2f}", g(p), f"{IAPWS} IAPWS95(T=T; x=0).P (MEoS._saturation)", "Lib"])
for c in [0, -5, -10, -15, -20, -25, -30, -35, -38, -39]:  # no liquid root at -40 C
    t = 273.15 + c
    src = f"{IAPWS} IAPWS95._Helmholtz; liquid-vapour equal-Gibbs solve (IAPWS-95 extrapolated below 273.16 K)"
    sat.append(["IAPWS-95-metastable", f"{t:.2f}", g(p_sat_metastable(t)), src, "Lib"])
write("water_saturation.csv", ["formulation", "t_k", "p_pa", "source", "tag"], sat)
write("water_saturation_temperature.csv", ["formulation", "p_pa", "t_k", "source", "tag"],
      [["IF97", g(p * 1e6), g(t), "IAPWS-IF97 Revised Release 2007 Table 36", "Pub"] for p, t in IF97_TS])

# --- sublimation of ice Ih ---------------------------------------------------------------
assert abs(_Sublimation_Pressure(230.0) / 8.94735e-6 - 1) < 1e-6
subl = [["230", "8.94735", "IAPWS (2011) melting and sublimation release; check value p_subl(230 K)", "Pub"]]
for t in [200, 205, 210, 215, 220, 225, 230, 235, 240, 245, 250, 255, 260, 265, 270, 273.15, 273.16]:
    subl.append([g(t), g(_Sublimation_Pressure(t) * 1e6), f"{IAPWS} _iapws._Sublimation_Pressure(T)", "Lib"])
write("ice_sublimation.csv", ["t_k", "p_pa", "source", "tag"], subl)


# --- water activity of a solution in equilibrium with ice Ih at 0.1 MPa ------------------
def ln_aw_ice(t):
    """ln a_w = (g_ice - g_liq) M_w / (R T); both g in kJ/kg, and kJ/kg x g/mol = J/mol."""
    liq = IAPWS95(T=t, P=P_MPA)
    assert abs(props95(liq.rho, t)[0] - 1e3 * P_MPA) < 1e-6, f"no IAPWS-95 liquid at {t} K"
    return (_Ice(t, P_MPA)["g"] - liq.g) * M_W / (R * t)


temps = list(range(0, -11, -1)) + list(range(-12, -39, -2))  # IAPWS-95: no liquid at 0.1 MPa below ~-39.5 C
src = f"{IAPWS} _iapws._Ice(T;0.1)[g] (IAPWS-06) and IAPWS95(T=T;P=0.1).g; ln aw = (g_ice - g_liq) M_w/(R T)"
write("ice_equilibrium_aw.csv", ["t_c", "water_activity", "source", "tag"],
      [[str(c), f"{math.exp(ln_aw_ice(273.15 + c)):.8f}", src, "Lib"] for c in temps])

# --- liquid density at 0.1 MPa (water boils at 99.606 C there) ------------------------
write("liquid_density.csv", ["t_c", "density_kg_m3", "source", "tag"],
      [[str(c), f"{IAPWS95(T=273.15 + c, P=P_MPA).rho:.4f}", f"{IAPWS} IAPWS95(T=T;P=0.1).rho", "Lib"]
       for c in [0, 4] + list(range(5, 100, 5)) + [99]])

# --- ice fraction of NaCl solutions (Archer 1992 via pytzer + ice equilibrium) -----------
lib = pz.libraries.Library(name="A92")
lib.update_Aphi(pz.debyehueckel.Aosm_AW90)
lib.update_ca("Na", "Cl", pz.parameters.bC_Na_Cl_A92ii)
pz = pz.set_library(pz, lib)
P_DBAR = P_MPA * 100


def ice_fraction(wt, c):
    """Mass share of the water frozen at c (deg C): the brine molality m solves
    ln a_w(NaCl m; T) = ln a_w,ice(T); lever rule on water: 1 - m0/m."""
    t = 273.15 + c
    m0 = 1000 * wt / (M_NACL * (100 - wt))
    f = lambda m: float(pz.log_activity_water({"Na": m, "Cl": m}, t, P_DBAR)) - ln_aw_ice(t)
    return 1 - m0 / brentq(f, m0, 6.2, xtol=1e-12)


src = ("pytzer 0.6.0 Archer (1992) NaCl (Aosm_AW90 + bC_Na_Cl_A92ii) at 10 dbar + "
       f"ice equilibrium by IAPWS-06/IAPWS-95 Gibbs route ({IAPWS}); lever rule on water")
frac = [["NaCl", str(wt), str(c), f"{ice_fraction(wt, c):.4f}", src, "Lib"]
        for wt, cs in [(5, [-5, -10, -15, -20]), (10, [-8, -10, -15, -20]), (15, [-12, -15, -20])]
        for c in cs]
assert abs(float(frac[5][3]) - 0.317) < 5e-4 and abs(float(frac[7][3]) - 0.615) < 5e-4
write("ice_fraction.csv", ["solute", "mass_percent", "t_c", "ice_fraction_of_water", "source", "tag"], frac)

write("eutectics.csv", ["solute", "t_c", "mass_percent", "source", "tag"],
      [["NaCl", "-21.1", "23.3", "Drebushchak Ogienko & Yunoshev (2017) Thermochim. Acta 647:94 (abstract;"
        " ice + NaCl.2H2O eutectic)", "Pub"]])

# --- ERH over saturated salt solutions at 25 C ------------------------------------------
GS = "Greenspan (1977) J. Res. NBS 81A:89"
MEM = f"{GS}; 25 C value from memory - not confirmed against the paper; never a hard oracle"
write("saturated_solutions.csv", ["solute", "t_c", "erh_percent", "uncertainty_percent", "source", "tag"], [
    ["NaCl", "25", "75.29", "0.12", f"{GS} (NaCl 25 C entry)", "Pub"],
    ["LiCl", "25", "11.30", "0.27", MEM, "Mem"],
    ["MgCl2", "25", "32.78", "0.16", MEM, "Mem"],
    ["K2CO3", "25", "43.16", "0.39", MEM, "Mem"],
    ["KCl", "25", "84.34", "0.26", MEM, "Mem"],
    ["K2SO4", "25", "97.30", "0.45", MEM, "Mem"],
])

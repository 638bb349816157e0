#!/usr/bin/python3
"""Density-threshold cases computed directly with TEOS-10 (gsw.rho) and SciPy's brentq.

For each pair of water masses (SA g/kg, CT degC, p dbar) this finds, independently of the
library under test:
  * dS: the Absolute Salinity change of the first, at its own CT and pressure, that makes
    gsw.rho equal the second's (brentq on SA in 0-42 g/kg; density rises with SA there);
  * h_f: the equivalent freshwater input into a layer of thickness H,
    S' = S H / (H + h_f)  =>  h_f = H (S/S' - 1);
  * dT: the CT change of the first, at its own SA and pressure, that does the same: every
    root in -2-40 degC (sign changes on a 0.01 K grid, each refined by brentq), the one
    closest to the first's CT.
An empty field means no solution in range. p_ref, when given, is the pressure at which both
are compared; otherwise each is taken at its own pressure.

Uses Debian's python3-gsw and python3-scipy (versions in the output header):

    /usr/bin/python3 generate_threshold_cases.py     # writes gsw_threshold_cases.csv
"""
import os

import gsw
import numpy as np
import scipy
from scipy.optimize import brentq

HERE = os.path.dirname(os.path.abspath(__file__))

# name, SA1, CT1, p1, SA2, CT2, p2, H (m), p_ref (dbar or None)
CASES = [
    ("tropical_warm_over_cool", 35.5, 28.0, 0.0, 35.0, 20.0, 0.0, 50.0, None),
    ("subpolar_cold_salty_over_warm_fresh", 35.2, 4.0, 0.0, 34.9, 6.0, 0.0, 100.0, None),
    ("intermediate_1000dbar", 34.7, 2.0, 1000.0, 34.9, 3.0, 1000.0, 200.0, None),
    ("deep_4000dbar", 34.9, 1.5, 4000.0, 34.7, 2.0, 4000.0, 500.0, None),
    ("in_situ_at_different_pressures", 35.0, 10.0, 0.0, 35.0, 10.0, 500.0, 100.0, None),
    ("potential_density_referred_to_0", 34.7, 2.0, 1000.0, 34.9, 3.0, 2000.0, 200.0, 0.0),
    ("fresh_water_beyond_maximum_density", 0.5, 10.0, 0.0, 0.5, 6.0, 0.0, 10.0, None),
    ("fresh_water_other_branch", 0.5, 2.0, 0.0, 0.5, 5.0, 0.0, 10.0, None),
    ("brackish_freshening", 20.0, 15.0, 0.0, 18.0, 14.0, 0.0, 20.0, None),
    ("no_solution_hot_light_vs_cold_salty", 10.0, 40.0, 0.0, 42.0, -2.0, 0.0, 50.0, None),
]


def roots(f, lo, hi, step):
    grid = np.arange(lo, hi + step / 2, step)
    grid[-1] = hi
    values = np.array([f(x) for x in grid])
    found = []
    for a, b, fa, fb in zip(grid[:-1], grid[1:], values[:-1], values[1:]):
        if fa == 0:
            found.append(a)
        elif fa * fb < 0:
            found.append(brentq(f, a, b, xtol=1e-14, rtol=4 * np.finfo(float).eps, maxiter=200))
    if values[-1] == 0:
        found.append(hi)
    return found


def main():
    rows = []
    for name, s1, t1, p1, s2, t2, p2, h, p_ref in CASES:
        q1 = p1 if p_ref is None else p_ref
        q2 = p2 if p_ref is None else p_ref
        rho1 = float(gsw.rho(s1, t1, q1))
        rho2 = float(gsw.rho(s2, t2, q2))
        fs = lambda s: float(gsw.rho(s, t1, q1)) - rho2
        ft = lambda t: float(gsw.rho(s1, t, q1)) - rho2
        s_roots = roots(fs, 0.0, 42.0, 0.5)
        t_roots = roots(ft, -2.0, 40.0, 0.01)
        ds = min((r - s1 for r in s_roots), key=abs) if s_roots else None
        dt = min((r - t1 for r in t_roots), key=abs) if t_roots else None
        hf = h * (s1 / (s1 + ds) - 1.0) if ds is not None and s1 + ds > 0 else None
        rows.append((name, s1, t1, p1, s2, t2, p2, h, p_ref, rho1, rho2, ds, hf, dt))

    def fmt(v):
        return "" if v is None else repr(float(v))

    with open(os.path.join(HERE, "gsw_threshold_cases.csv"), "w", encoding="ascii") as f:
        f.write(f"# TEOS-10 threshold cases: gsw.rho (python3-gsw {gsw.__version__}) and scipy.optimize.brentq "
                f"(python3-scipy {scipy.__version__}), by generate_threshold_cases.py\n")
        f.write("# units: SA g/kg, CT degC, p dbar, H m, rho kg/m3, dS g/kg, h_f m, dT K; empty = none / no solution\n")
        f.write("name,SA1,CT1,p1,SA2,CT2,p2,H,p_ref,rho1,rho2,dS,h_f,dT\n")
        for r in rows:
            f.write(",".join([r[0]] + [fmt(v) for v in r[1:]]) + "\n")
    print(f"{len(rows)} cases")


if __name__ == "__main__":
    main()

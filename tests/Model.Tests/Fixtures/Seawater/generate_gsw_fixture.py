#!/usr/bin/python3
"""Reference values of TEOS-10 density, thermal expansion and haline contraction.

Generated with the GSW library as packaged by Debian (python3-gsw; version in the
output header): gsw.rho, gsw.alpha, gsw.beta, which evaluate the 75-term
polynomial of Roquet et al. (2015) in Absolute Salinity SA (g/kg), Conservative
Temperature CT (degC) and sea pressure p (dbar).

Points: a regular grid over the box SA 0-42 g/kg, CT -2-40 degC, p 0-8000 dbar,
plus pseudo-random points in the same box (fixed seed). Some corners of the box
(very warm or very fresh water at great depth, water below freezing) lie outside
the "oceanographic funnel" in which the polynomial was fitted; there the values
still test that this library evaluates the same polynomial as GSW.

Also writes gsw_p_from_z.csv: sea pressure at depths 0-8000 m and latitudes 0-60
degrees from gsw.p_from_z (TEOS-10), the reference for the library's depth-to-pressure
conversion.

    /usr/bin/python3 generate_gsw_fixture.py     # writes gsw_rho_alpha_beta.csv, gsw_p_from_z.csv
"""
import os

import gsw
import numpy as np

HERE = os.path.dirname(os.path.abspath(__file__))


def main():
    SA_grid = np.array([0.0, 5.0, 15.0, 30.0, 34.0, 35.16504, 36.5, 40.0, 42.0])
    CT_grid = np.array([-2.0, 0.0, 4.0, 10.0, 20.0, 30.0, 40.0])
    p_grid = np.array([0.0, 1000.0, 4000.0, 8000.0])
    SA_g, CT_g, p_g = (a.ravel() for a in np.meshgrid(SA_grid, CT_grid, p_grid, indexing="ij"))

    rng = np.random.default_rng(20150601)
    n_random = 150
    SA_r = rng.uniform(0.0, 42.0, n_random)
    CT_r = rng.uniform(-2.0, 40.0, n_random)
    p_r = rng.uniform(0.0, 8000.0, n_random)

    SA = np.concatenate([SA_g, SA_r])
    CT = np.concatenate([CT_g, CT_r])
    p = np.concatenate([p_g, p_r])

    rho = gsw.rho(SA, CT, p)
    alpha = gsw.alpha(SA, CT, p)
    beta = gsw.beta(SA, CT, p)

    with open(os.path.join(HERE, "gsw_rho_alpha_beta.csv"), "w", encoding="ascii") as f:
        f.write(f"# gsw.rho, gsw.alpha, gsw.beta from python3-gsw {gsw.__version__} (Debian) by generate_gsw_fixture.py\n")
        f.write("# units: SA g/kg, CT degC, p dbar, rho kg/m3, alpha 1/K, beta kg/g\n")
        f.write("SA,CT,p,rho,alpha,beta\n")
        for row in zip(SA, CT, p, rho, alpha, beta):
            f.write(",".join(repr(float(v)) for v in row) + "\n")
    print(f"{len(SA)} points")

    depths = np.array([0.0, 10.0, 100.0, 500.0, 1000.0, 2000.0, 3000.0, 4000.0, 5000.0, 6000.0, 7000.0, 8000.0])
    with open(os.path.join(HERE, "gsw_p_from_z.csv"), "w", encoding="ascii") as f:
        f.write(f"# gsw.p_from_z from python3-gsw {gsw.__version__} (Debian) by generate_gsw_fixture.py\n")
        f.write("# units: depth m (positive down; gsw's z = -depth), latitude degrees, p dbar\n")
        f.write("depth,latitude,p\n")
        for lat in (0.0, 15.0, 30.0, 45.0, 60.0):
            for depth, p in zip(depths, gsw.p_from_z(-depths, lat)):
                f.write(f"{float(depth)!r},{lat!r},{abs(float(p))!r}\n")


if __name__ == "__main__":
    main()

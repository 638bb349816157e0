#!/usr/bin/python3
"""Export the official TEOS-10 check values that the library's tests use.

Source: gsw/tests/gsw_cv_v3_0.npz, the GSW check-value file shipped by Debian's
python3-gsw (version recorded in the output header). It holds the TEOS-10 check
cast (SA_chck_cast, CT_chck_cast, p_chck_cast, SP_chck_cast, t_chck_cast; 45 x 3
points padded with NaN), the expected value of every GSW function on it, and the
accepted tolerance of each (the *_ca arrays).

Nothing here is computed by gsw: both CSV files are plain copies of arrays from
the .npz file. Run with Debian's interpreter (numpy and gsw are installed there):

    /usr/bin/python3 export_gsw_check_values.py

Writes gsw_check_cast.csv (one row per finite cast point) and
gsw_check_tolerances.csv (name, tolerance) beside this script.
"""
import os

import gsw
import numpy as np

HERE = os.path.dirname(os.path.abspath(__file__))
NPZ = os.path.join(os.path.dirname(gsw.__file__), "tests", "gsw_cv_v3_0.npz")

# Inputs of the check cast, then the expected values of the functions this library implements.
COLUMNS = [
    "SA_chck_cast", "CT_chck_cast", "p_chck_cast", "SP_chck_cast", "t_chck_cast",
    "rho", "alpha", "beta", "specvol",
    "SR_from_SP", "SP_from_SR",
    "pt_from_CT", "CT_from_pt", "pt0_from_t", "CT_from_t",
    "t90_from_t68",
]
TOLERANCES = [
    "rho_ca", "alpha_ca", "beta_ca", "specvol_ca",
    "SR_from_SP_ca", "SP_from_SR_ca",
    "pt_from_CT_ca", "CT_from_pt_ca", "pt0_from_t_ca", "CT_from_t_ca",
    "t90_from_t68_ca",
]


def main():
    cv = np.load(NPZ)
    header = (
        f"# TEOS-10 check cast exported from {os.path.basename(NPZ)} "
        f"(python3-gsw {gsw.__version__}, Debian) by export_gsw_check_values.py\n"
        "# units: SA g/kg, CT degC, p dbar, SP PSS-78, t degC (ITS-90), rho kg/m3, alpha 1/K, beta kg/g, "
        "specvol m3/kg, temperatures degC\n"
    )
    arrays = [cv[name].ravel() for name in COLUMNS]
    finite = np.all(np.isfinite(np.vstack(arrays)), axis=0)
    with open(os.path.join(HERE, "gsw_check_cast.csv"), "w", encoding="ascii") as f:
        f.write(header)
        f.write(",".join(COLUMNS) + "\n")
        for row in np.vstack(arrays)[:, finite].T:
            f.write(",".join(repr(float(v)) for v in row) + "\n")
    with open(os.path.join(HERE, "gsw_check_tolerances.csv"), "w", encoding="ascii") as f:
        f.write(header)
        f.write("name,tolerance\n")
        for name in TOLERANCES:
            f.write(f"{name},{float(cv[name])!r}\n")
    print(f"{int(finite.sum())} cast points, {len(TOLERANCES)} tolerances")


if __name__ == "__main__":
    main()

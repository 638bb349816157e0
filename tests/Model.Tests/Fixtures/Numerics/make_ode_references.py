#!/usr/bin/python3
"""Reference solutions for the ODE engine's tests and benchmark (tests/Model.Tests/Fixtures/Numerics/ode_references.csv).

Run with Debian's SciPy:  /usr/bin/python3 make_ode_references.py > ode_references.csv
Each problem is solved with scipy.integrate.solve_ivp, method Radau (Hairer & Wanner's RADAU5 order-5 collocation),
rtol 1e-12, and cross-checked with LSODA (BDF/Adams) at rtol 1e-12; the column 'agreement' is the largest relative
difference between the two, an estimate of the reference's own error.
The problems are the standard test problems named in the test code; 'stommel_forced' is an invented two-box salt-advection
scenario of Stommel (1961) type, in the common nondimensional form T' = eta1 - T - |T - S| T, S' = eta2(t) - eta3 S - |T - S| S,
with an invented periodic freshwater forcing eta2(t) = 1 + 0.5 sin(2 pi t / 10), so that it never settles to equilibrium.
"""
import sys
import numpy as np
import scipy
from scipy.integrate import solve_ivp

def robertson(t, y):
    return [-0.04 * y[0] + 1e4 * y[1] * y[2],
            0.04 * y[0] - 1e4 * y[1] * y[2] - 3e7 * y[1] ** 2,
            3e7 * y[1] ** 2]

def vanderpol(mu):
    return lambda t, y: [y[1], mu * (1 - y[0] ** 2) * y[1] - y[0]]

def stommel_forced(eta1, eta2, amplitude, period, eta3):
    return lambda t, y: [eta1 - y[0] - abs(y[0] - y[1]) * y[0],
                         eta2 + amplitude * np.sin(2 * np.pi * t / period) - eta3 * y[1] - abs(y[0] - y[1]) * y[1]]

problems = [
    ("robertson", robertson, [1.0, 0.0, 0.0], [40.0, 1e5], 1e-22),
    ("vanderpol_mu1000", vanderpol(1000.0), [2.0, 0.0], [3000.0], 1e-14),
    ("stommel_forced", stommel_forced(3.0, 1.0, 0.5, 10.0, 0.3), [1.0, 0.5], [50.0], 1e-14),
]

print(f"# SciPy {scipy.__version__} solve_ivp Radau rtol 1e-12 (atol per row), cross-checked with LSODA; see make_ode_references.py")
print("problem,t,agreement,y0,y1,y2")
for name, f, y0, times, atol in problems:
    sols = []
    for method in ("Radau", "LSODA"):
        s = solve_ivp(f, (0.0, times[-1]), y0, method=method, rtol=1e-12, atol=atol, t_eval=times, dense_output=False)
        if not s.success:
            sys.exit(f"{name} {method}: {s.message}")
        sols.append(s.y)
    for k, t in enumerate(times):
        a, b = sols[0][:, k], sols[1][:, k]
        agreement = max(abs(a - b) / np.maximum(abs(a), 1e-300))
        cols = [f"{v:.17g}" for v in a] + [""] * (3 - len(a))
        print(f"{name},{t:.17g},{agreement:.3g}," + ",".join(cols))

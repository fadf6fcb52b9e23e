"""What a user would otherwise write: a natural-parameter sweep of the discretised Bratu problem
(bratu.py) with scipy.optimize.root, each solve warm-started from the previous parameter value's
solution, with the analytic Jacobian, and the eigenvalues of the Jacobian at each solution for
stability. It cannot pass a fold and locates no special points.

usage: python3 naturalSweep.py N FROM TO COUNT      prints one JSON object
Timed inside the script (interpreter start-up and imports excluded).
"""
import json
import sys
import time

import numpy as np
import scipy
from scipy.optimize import root

from bratu import make_bratu

CONVERGED = 1e-10


def main():
    n, lam_from, lam_to, count = int(sys.argv[1]), float(sys.argv[2]), float(sys.argv[3]), int(sys.argv[4])
    rhs, jac = make_bratu(n)
    started = time.perf_counter()
    u = np.zeros(n)
    converged = stable = 0
    worst = 0.0
    for lam in np.linspace(lam_from, lam_to, count):
        sol = root(rhs, u, args=(lam,), jac=jac, method="hybr", tol=1e-12)
        residual = float(np.max(np.abs(rhs(sol.x, lam))))
        # hybr often reports "not making good progress" once it sits at rounding level, so
        # convergence is judged by the residual, as a user would.
        if sol.success or residual <= CONVERGED:
            converged += 1
            u = sol.x
        worst = max(worst, residual)
        if np.max(np.linalg.eigvals(jac(sol.x, lam)).real) < 0:
            stable += 1
    seconds = time.perf_counter() - started
    print(json.dumps({
        "values": count, "seconds": seconds, "converged": converged, "stable": stable,
        "maxResidual": worst, "scipy": scipy.__version__,
    }))


main()

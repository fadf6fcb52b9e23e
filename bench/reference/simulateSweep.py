"""What a user would otherwise write, brute force: at each parameter value, integrate the
discretised Bratu problem (bratu.py) with scipy.integrate.solve_ivp (BDF, analytic Jacobian) until
it settles, i.e. until the max-norm of the right-hand side drops below 1e-8 (a terminal event), or
t = 1e4. Each run starts from the previous value's end state, the kindest start for this method.
It only ever finds stable equilibria and locates no special points.

usage: python3 simulateSweep.py N FROM TO COUNT      prints one JSON object
Timed inside the script (interpreter start-up and imports excluded).
"""
import json
import sys
import time

import numpy as np
import scipy
from scipy.integrate import solve_ivp

from bratu import make_bratu

SETTLED = 1e-8
T_END = 1e4


def main():
    n, lam_from, lam_to, count = int(sys.argv[1]), float(sys.argv[2]), float(sys.argv[3]), int(sys.argv[4])
    rhs, jac = make_bratu(n)

    def settled(t, u, lam):
        return np.max(np.abs(rhs(u, lam))) - SETTLED

    settled.terminal = True
    settled.direction = -1

    started = time.perf_counter()
    u = np.zeros(n)
    reached = 0
    worst = 0.0
    rhs_calls = 0
    for lam in np.linspace(lam_from, lam_to, count):
        sol = solve_ivp(lambda t, y, lam: rhs(y, lam), (0.0, T_END), u, method="BDF",
                        jac=lambda t, y, lam: jac(y, lam), events=settled, args=(lam,),
                        rtol=1e-8, atol=1e-10)
        u = sol.y[:, -1]
        rhs_calls += sol.nfev
        residual = float(np.max(np.abs(rhs(u, lam))))
        worst = max(worst, residual)
        if residual <= SETTLED * 1.01:
            reached += 1
    seconds = time.perf_counter() - started
    print(json.dumps({
        "values": count, "seconds": seconds, "settled": reached, "maxResidual": worst,
        "rhsCalls": rhs_calls, "scipy": scipy.__version__,
    }))


main()

"""LAPACK floor for one continuation point of an n-state model: the wall time of one dense linear
solve plus one full eigenvalue computation, numpy.linalg.solve + numpy.linalg.eigvals, on a random
well-conditioned n x n matrix (2 I + a Gaussian matrix scaled by 0.3/sqrt(n)). Median over many
repeats, timed inside the script (interpreter start-up and imports excluded).

usage: python3 floor.py N [SECONDS]      prints one JSON object
"""
import json
import platform
import sys
import time

import numpy as np


def blas_name():
    try:
        deps = np.show_config(mode="dicts").get("Build Dependencies", {})
        blas = deps.get("blas", {})
        return f"{blas.get('name', '?')} {blas.get('version', '')}".strip()
    except Exception:  # show_config's layout is not a stable API
        return "unknown"


def median_ms(run, budget_s, min_repeats=50):
    times = []
    started = time.perf_counter()
    while len(times) < min_repeats or time.perf_counter() - started < budget_s:
        t0 = time.perf_counter()
        run()
        times.append(time.perf_counter() - t0)
    return float(np.median(times)) * 1e3, len(times)


def main():
    n = int(sys.argv[1])
    budget = float(sys.argv[2]) if len(sys.argv) > 2 else 0.4
    rng = np.random.default_rng(20261202)
    a = 2.0 * np.eye(n) + 0.3 / np.sqrt(n) * rng.standard_normal((n, n))
    b = rng.standard_normal(n)

    def both():
        np.linalg.solve(a, b)
        np.linalg.eigvals(a)

    both()  # first call loads the LAPACK routines
    total, repeats = median_ms(both, budget)
    solve_ms, _ = median_ms(lambda: np.linalg.solve(a, b), budget / 2)
    eig_ms, _ = median_ms(lambda: np.linalg.eigvals(a), budget / 2)
    print(json.dumps({
        "n": n,
        "floorMs": total,
        "solveMs": solve_ms,
        "eigvalsMs": eig_ms,
        "repeats": repeats,
        "condition": float(np.linalg.cond(a)),
        "python": platform.python_version(),
        "numpy": np.__version__,
        "blas": blas_name(),
    }))


main()

"""Discretised 1-D Bratu problem, the same model bench/reactionDiffusion.ts generates for branchtrace.

    u_t = u_xx + lam * exp(u) on (0, 1), u(0) = u(1) = 0,

second-order central differences on N interior points, h = 1 / (N + 1):

    f_i(u) = (u_{i-1} - 2 u_i + u_{i+1}) / h^2 + lam * exp(u_i),   u_0 = u_{N+1} = 0.

The Jacobian is tridiagonal: diag(-2/h^2 + lam exp(u_i)), off-diagonals 1/h^2. It is built as a
dense matrix, which is what a user would usually hand to scipy for a system of this size.
"""
import numpy as np


def make_bratu(n):
    inv_h2 = float(n + 1) ** 2
    lap = np.zeros((n, n))
    idx = np.arange(n)
    lap[idx, idx] = -2.0 * inv_h2
    lap[idx[:-1], idx[:-1] + 1] = inv_h2
    lap[idx[1:], idx[1:] - 1] = inv_h2

    def rhs(u, lam):
        return lap @ u + lam * np.exp(u)

    def jac(u, lam):
        return lap + np.diag(lam * np.exp(u))

    return rhs, jac

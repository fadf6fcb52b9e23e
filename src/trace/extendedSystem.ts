/**
 * The continuation problem in scaled coordinates (see stateWeights.ts): unknown z = (w ⊙ x, λ)
 * ∈ R^{n+1} with λ = p[k], equations F(z) = f(x, p) ∈ R^n, and the n×(n+1) Jacobian
 * F_z = [f_x diag(1/w) | f_λ] (Keller 1977, "Numerical solution of bifurcation and nonlinear
 * eigenvalue problems", §2). All evaluations write into preallocated scratch.
 */
import { allFinite } from '../linalg/norm.js';
import type { System } from '../types.js';

export interface ExtendedSystem {
  readonly system: System;
  /** State dimension n; the unknown has m = n + 1 entries. */
  readonly n: number;
  readonly m: number;
  /** Index of the varied parameter. */
  readonly k: number;
  /** z_i = w_i x_i for i < n. */
  readonly w: Float64Array;
  /** Scratch: the unscaled state and the parameters of the last evaluation. */
  readonly x: Float64Array;
  readonly p: Float64Array;
  /** Scratch: unscaled f_x (n×n, row-major) of the last `jacobian` call. */
  readonly jx: Float64Array;
  /** Scratch: f_λ of the last `jacobian` call. */
  readonly fl: Float64Array;
  /** Sets `x` and `p` from z. */
  load(z: Float64Array): void;
  /** out[0..n) = F(z); false when a value is not finite. */
  residual(z: Float64Array, out: Float64Array): boolean;
  /** Rows 0..n−1 of the m×m row-major `out` = F_z; also fills `jx` and `fl`. False when not finite. */
  jacobian(z: Float64Array, out: Float64Array): boolean;
  /** A new unscaled state vector for z. */
  stateOf(z: Float64Array): Float64Array;
  /** A new scaled unknown for (x, λ). */
  unknownOf(x: Float64Array, lambda: number): Float64Array;
}

export function makeExtendedSystem(system: System, p: Float64Array, k: number, w: Float64Array): ExtendedSystem {
  const n = system.n;
  const m = n + 1;
  const x = new Float64Array(n);
  const pp = Float64Array.from(p);
  const jx = new Float64Array(n * n);
  const fl = new Float64Array(n);
  const load = (z: Float64Array): void => {
    for (let i = 0; i < n; i++) x[i] = z[i]! / w[i]!;
    pp[k] = z[n]!;
  };
  return {
    system, n, m, k, w, x, p: pp, jx, fl, load,
    residual(z, out) {
      load(z);
      system.rhs(x, pp, out);
      for (let i = 0; i < n; i++) if (!Number.isFinite(out[i]!)) return false;
      return true;
    },
    jacobian(z, out) {
      load(z);
      system.jacobian(x, pp, jx);
      system.paramDerivative(x, pp, k, fl);
      if (!allFinite(jx) || !allFinite(fl)) return false;
      for (let i = 0; i < n; i++) {
        const row = i * m;
        for (let j = 0; j < n; j++) out[row + j] = jx[i * n + j]! / w[j]!;
        out[row + n] = fl[i]!;
      }
      return true;
    },
    stateOf(z) {
      const s = new Float64Array(n);
      for (let i = 0; i < n; i++) s[i] = z[i]! / w[i]!;
      return s;
    },
    unknownOf(state, lambda) {
      const z = new Float64Array(m);
      for (let i = 0; i < n; i++) z[i] = state[i]! * w[i]!;
      z[n] = lambda;
      return z;
    },
  };
}

/**
 * Newton's method for F(x) = 0 with a backtracking line search (Armijo condition on ½‖F‖₂²;
 * Dennis & Schnabel 1983, "Numerical Methods for Unconstrained Optimization and Nonlinear
 * Equations", §6.3). Near a root the full step is always accepted, so convergence stays quadratic.
 *
 * Stopping rule (checked at every iterate x, before a step is taken):
 *   converged  ⇔  F(x) = 0 exactly,
 *              or at least minSteps steps were taken (default 0) and: ‖F(x)‖∞ ≤ absTol,
 *              or the last full step satisfied ‖dx‖∞ ≤ absTol·(1 + ‖x‖∞) and ‖F(x)‖∞ ≤ √absTol
 *              (a residual floor set by rounding in badly scaled models).
 * absTol is in the model's units; a caller whose start is already close (a point between two
 * points of a branch) asks for one step, which near a regular root makes the error about its
 * square whatever the units.
 * Other outcomes are statuses, never exceptions:
 *   'non-finite'  F or J has a NaN/Infinity at the current iterate;
 *   'singular'    the LU factorisation has a zero pivot, or the step is not finite;
 *   'stalled'     the line search could not reduce ‖F‖ down to the smallest step fraction;
 *   'max-iter'    maxIter Newton steps were taken without meeting the rule above.
 */
import { luFactor, luSolve } from '../linalg/lu.js';
import { allFinite, normInf } from '../linalg/norm.js';
import type { NewtonResult } from '../types.js';

export type VectorFunction = (x: Float64Array, out: Float64Array) => void;

export interface NewtonOptions {
  absTol: number;
  maxIter: number;
  /** Steps to take before the residual may stop the iteration (unless F is exactly zero). */
  minSteps?: number;
}

export interface NewtonDamping {
  /** Backtrack at all (false: always take the full Newton step). */
  lineSearch: boolean;
  /** Armijo constant c in ‖F(x+λdx)‖² ≤ (1 − 2cλ)‖F(x)‖². */
  armijo: number;
  /** Smallest step fraction λ before giving up with 'stalled'. */
  minFraction: number;
}

/** Common practice (Dennis & Schnabel §6.3 suggest c = 1e-4 and halving). */
export const DEFAULT_DAMPING: NewtonDamping = { lineSearch: true, armijo: 1e-4, minFraction: 1 / 1024 };

function sumSquares(v: Float64Array): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) s += v[i]! * v[i]!;
  return s;
}

export function newton(
  F: VectorFunction,
  J: VectorFunction,
  x0: Float64Array,
  opts: NewtonOptions,
  damping: NewtonDamping = DEFAULT_DAMPING,
): NewtonResult {
  const n = x0.length;
  const x = x0.slice();
  const f = new Float64Array(n);
  const jac = new Float64Array(n * n);
  const dx = new Float64Array(n);
  const trial = new Float64Array(n);
  const fTrial = new Float64Array(n);
  const done = (status: NewtonResult['status'], iterations: number, lastStep: number): NewtonResult => ({
    x, status, iterations, residual: normInf(f), lastStep,
  });
  F(x, f);
  if (!allFinite(f)) return done('non-finite', 0, 0);
  let lastStep = 0;
  let smallFullStep = false;
  for (let it = 0; ; it++) {
    const res = normInf(f);
    const small = res <= opts.absTol || (smallFullStep && res <= Math.sqrt(opts.absTol));
    if (res === 0 || (small && it >= (opts.minSteps ?? 0))) return done('converged', it, lastStep);
    if (it >= opts.maxIter) return done('max-iter', it, lastStep);
    J(x, jac);
    if (!allFinite(jac)) return done('non-finite', it, lastStep);
    const lu = luFactor(jac, n);
    if (lu.singular) return done('singular', it, lastStep);
    luSolve(lu, f, dx);
    if (!allFinite(dx)) return done('singular', it, lastStep);
    const f2 = sumSquares(f);
    // A step at the rounding level is taken in full: ‖F‖ cannot decrease reliably there.
    const search = damping.lineSearch && normInf(dx) > opts.absTol * (1 + normInf(x));
    let lambda = 1;
    for (;;) {
      for (let i = 0; i < n; i++) trial[i] = x[i]! - lambda * dx[i]!;
      F(trial, fTrial);
      const ok = allFinite(fTrial);
      if (!search) {
        if (!ok) {
          x.set(trial);
          f.set(fTrial);
          return done('non-finite', it + 1, lambda * normInf(dx));
        }
        break;
      }
      if (ok && sumSquares(fTrial) <= (1 - 2 * damping.armijo * lambda) * f2) break;
      lambda /= 2;
      if (lambda < damping.minFraction) return done('stalled', it + 1, 0);
    }
    x.set(trial);
    f.set(fTrial);
    lastStep = lambda * normInf(dx);
    smallFullStep = lambda === 1 && lastStep <= opts.absTol * (1 + normInf(x));
  }
}

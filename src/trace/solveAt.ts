/**
 * Newton's method (src/solve/newton.ts) for the equilibrium at a fixed parameter value λ, from a
 * state close to it (a start equilibrium, or a point between two points of a branch). At least one
 * step is taken unless f is exactly zero there: the residual tolerance is in the model's units and
 * can hold far from the root of a model with tiny right-hand sides (concentrations of 1e-6 changing
 * by 1e-9 per second); one Newton step from a close start leaves about the square of the error.
 */
import { newton } from '../solve/newton.js';
import type { NewtonResult } from '../types.js';
import type { ExtendedSystem } from './extendedSystem.js';

export function solveAt(
  ext: ExtendedSystem, x0: Float64Array, lambda: number, opts: { absTol: number; maxIter: number },
): NewtonResult {
  const p = ext.p.slice();
  p[ext.k] = lambda;
  return newton(
    (x, out) => ext.system.rhs(x, p, out),
    (x, out) => ext.system.jacobian(x, p, out),
    x0,
    { absTol: opts.absTol, maxIter: opts.maxIter, minSteps: 1 },
  );
}

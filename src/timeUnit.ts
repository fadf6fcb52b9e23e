/**
 * Slow models in a short time unit (a corrosion or soil process written in seconds, rates of 1e-9
 * per second): residual and eigenvalue tolerances of the numerics are absolute below rates of about
 * 1 per time unit, so such a model would meet them everywhere (every state an "equilibrium"). The
 * time unit is not part of the answer: equilibria, branches and the parameter values of special
 * points are the same in any time unit; rates (eigenvalues, frequencies, residuals of f, the fold
 * coefficient) scale with it, periods inversely, and the first Lyapunov coefficient not at all
 * (Kuznetsov 3rd ed. eq. 3.20: its bracket and the frequency it is divided by both scale with it).
 *
 * So a model whose rates are below SLOW_RATE is computed as f/r, with r its typical rate (the
 * largest eigenvalue magnitude of f_x near the start guess), i.e. in a time unit 1/r times longer,
 * and every rate in the results is multiplied back by r.
 */
import type { CompiledSystem } from './compile/compileModel.js';
import { boxAround, startPoints } from './equilibria/startPoints.js';
import { eigenvalues } from './linalg/eig.js';
import { allFinite } from './linalg/norm.js';
import type { Eigenvalue, Equilibrium, Trace } from './types.js';

/** Below this typical rate (per time unit) a model is computed in a longer time unit. Common practice. */
export const SLOW_RATE = 1e-3;

/** States near the start guess where the typical rate is sampled (besides the guess itself). */
const SAMPLES = 4;

/**
 * The factor r to divide f by (1 for a model that is not slow): the largest eigenvalue magnitude
 * of f_x at the start guess and at a few states within half its size of it (any one of them may
 * sit where f_x vanishes).
 */
export function timeFactor(system: CompiledSystem, params: Float64Array, guess: Float64Array): number {
  const n = system.n;
  const jac = new Float64Array(n * n);
  let rate = 0;
  for (const x of [guess, ...startPoints(boxAround(guess, 0.5, 0), SAMPLES, 1)]) {
    system.jacobian(x, params, jac);
    if (!allFinite(jac)) continue;
    for (const v of eigenvalues(jac, n)) rate = Math.max(rate, Math.hypot(v.re, v.im));
  }
  return rate > 0 && rate < SLOW_RATE ? rate : 1;
}

/** The same model in a time unit 1/r times longer: f and all its derivatives divided by r. */
export function inLongerTime(system: CompiledSystem, r: number): CompiledSystem {
  if (r === 1) return system;
  const scale = (out: Float64Array) => {
    for (let i = 0; i < out.length; i++) out[i]! /= r;
  };
  return {
    ...system,
    rhs: (x, p, out) => { system.rhs(x, p, out); scale(out); },
    jacobian: (x, p, out) => { system.jacobian(x, p, out); scale(out); },
    paramDerivative: (x, p, k, out) => { system.paramDerivative(x, p, k, out); scale(out); },
    secondDerivative: (x, p, u, v, out) => { system.secondDerivative(x, p, u, v, out); scale(out); },
    thirdDerivative: (x, p, u, v, w, out) => { system.thirdDerivative(x, p, u, v, w, out); scale(out); },
    mixedDerivative: (x, p, k, v, out) => { system.mixedDerivative(x, p, k, v, out); scale(out); },
  };
}

const rates = (values: readonly Eigenvalue[], r: number): Eigenvalue[] => values.map((v) => ({ re: v.re * r, im: v.im * r }));

/** A trace computed with inLongerTime(system, r), its rates given back in the model's time unit. */
export function traceInModelTime(trace: Trace, r: number): Trace {
  if (r === 1) return trace;
  return {
    ...trace,
    branches: trace.branches.map((b) => ({
      ...b,
      points: b.points.map((q) => ({
        ...q, eigenvalues: rates(q.eigenvalues, r), maxRealPart: q.maxRealPart * r, residual: q.residual * r,
      })),
    })),
    events: trace.events.map((e) => ({
      ...e,
      eigenvalues: rates(e.eigenvalues, r),
      residual: e.residual * r,
      // The Hopf test is a real part (a rate); the fold and branch-point tests carry no time unit.
      ...(e.type === 'hopf' && { testBefore: e.testBefore * r, testAfter: e.testAfter * r }),
      ...(e.foldCoefficient !== undefined && { foldCoefficient: e.foldCoefficient * r }),
      ...(e.frequency !== undefined && { frequency: e.frequency * r }),
      ...(e.period !== undefined && { period: e.period / r }),
    })),
  };
}

/** Equilibria found with inLongerTime(system, r), their rates given back in the model's time unit. */
export function equilibriaInModelTime(found: readonly Equilibrium[], r: number): Equilibrium[] {
  if (r === 1) return [...found];
  return found.map((e) => ({ ...e, eigenvalues: rates(e.eigenvalues, r), residual: e.residual * r }));
}

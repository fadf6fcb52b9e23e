/**
 * Hand-built traces with analytic branches, standing in for the continuation engine.
 *
 * - sCurve: x' = λ + x − x³, y' = x − y. Equilibria λ = x³ − x, y = x, followed in arclength order
 *   (x increasing). Eigenvalues 1 − 3x² and −1 (analytic: the Jacobian is [[1 − 3x², 0], [1, −1]]).
 *   Folds where 1 − 3x² = 0: x = ∓1/√3, λ = ±2/(3√3) ≈ ±0.3849. Fold coefficient a = ½ f_xx = −3x
 *   (left and right null vectors of the scalar part are 1): a = √3 at x = −1/√3, −√3 at x = +1/√3.
 * - hopf: x' = μx − y + s·x(x² + y²), y' = x + μy + s·y(x² + y²). Equilibrium 0 for every μ,
 *   eigenvalues μ ± i; Hopf at μ = 0 with frequency 1, period 2π and l1 = s (the normal form
 *   ż = (μ + i)z + s·z|z|², Kuznetsov 3rd ed. §3.5).
 * - transcritical: x' = λx − x², y' = −y. Branches x = 0 (eigenvalue λ) and x = λ (eigenvalue −λ),
 *   crossing at λ = 0; the second is started there by branch switching.
 */
import type { Branch, Eigenvalue, ModelInfo, SpecialPoint, Trace, TracePoint } from '../../src/types.js';

export function point(index: number, parameter: number, state: number[], eigenvalues: Eigenvalue[]): TracePoint {
  const maxRealPart = Math.max(...eigenvalues.map((e) => e.re));
  const unstableCount = eigenvalues.filter((e) => e.re > 0).length;
  return {
    index, arclength: index, parameter, state: Float64Array.from(state), eigenvalues,
    stable: unstableCount === 0 && maxRealPart < 0, unstableCount, maxRealPart, residual: 1e-12, iterations: 2,
    step: index === 0 ? 0 : 0.1,
  };
}

const real = (...values: number[]): Eigenvalue[] => values.map((re) => ({ re, im: 0 }));

export function settings(from: number, to: number): Trace['settings'] {
  return {
    parameterIndex: 0, from, to, ds: 0.01, dsMin: 1e-8, dsMax: 0.05, maxPoints: 2000, absTol: 1e-10, maxIter: 8,
    maxBranches: 32,
  };
}

export function info(title: string, parameter: string, unit?: string): ModelInfo {
  return {
    file: 'fixture.yaml',
    title,
    about: 'A hand-built trace with analytic branches.',
    states: [{ name: 'x', start: 0, unit: 'K' }, { name: 'y', start: 0 }],
    parameters: [{ name: parameter, value: 0.1, ...(unit === undefined ? {} : { unit }) }],
  };
}

export const FOLD_X = 1 / Math.sqrt(3);
export const FOLD_LAMBDA = 2 / (3 * Math.sqrt(3));

/** 33 points x = −1.6 … 1.6 (step 0.1); folds between points 10/11 and 21/22. */
export function sCurveTrace(): Trace {
  const points: TracePoint[] = [];
  for (let k = 0; k <= 32; k++) {
    const x = -1.6 + 0.1 * k;
    points.push(point(k, x ** 3 - x, [x, x], real(1 - 3 * x * x, -1)));
  }
  const fold = (id: number, x: number, left: number): SpecialPoint => ({
    id, type: 'fold', branch: 0, parameter: x ** 3 - x, state: Float64Array.from([x, x]), eigenvalues: real(0, -1),
    between: [left, left + 1], testBefore: 1 - 3 * (-1.6 + 0.1 * left) ** 2,
    testAfter: 1 - 3 * (-1.6 + 0.1 * (left + 1)) ** 2, residual: 1e-13, iterations: 3, foldCoefficient: -3 * x,
  });
  return {
    settings: settings(-2.5, 2.5),
    branches: [{ id: 0, origin: { kind: 'start' }, stopped: 'left range', points }],
    events: [fold(0, -FOLD_X, 10), fold(1, FOLD_X, 21)],
    warnings: [],
    interrupted: false,
  };
}

/** μ = −0.5 … 0.5 in steps of 0.1 (11 points), point 5 moved to μ = 0.001 so the Hopf at μ = 0 lies between points 4 and 5. */
export function hopfTrace(s: number): Trace {
  const points: TracePoint[] = [];
  for (let k = 0; k <= 10; k++) {
    const mu = -0.5 + 0.1 * k + (k === 5 ? 1e-3 : 0);
    points.push(point(k, mu, [0, 0], [{ re: mu, im: 1 }, { re: mu, im: -1 }]));
  }
  const event: SpecialPoint = {
    id: 0, type: 'hopf', branch: 0, parameter: 0, state: new Float64Array(2),
    eigenvalues: [{ re: 0, im: 1 }, { re: 0, im: -1 }], between: [4, 5], testBefore: -0.1, testAfter: 1e-3,
    residual: 0, iterations: 4, lyapunov: s, criticality: s < 0 ? 'supercritical' : s > 0 ? 'subcritical' : 'degenerate',
    frequency: 1, period: 2 * Math.PI,
  };
  return {
    settings: settings(-0.5, 0.5),
    branches: [{ id: 0, origin: { kind: 'start' }, stopped: 'left range', points }],
    events: [event], warnings: [], interrupted: false,
  };
}

/** λ = −1 … 1 in steps of 0.25 on x = 0 (branch 0) and on x = λ (branch 1, switched at event 0). */
export function transcriticalTrace(): Trace {
  const trivial: TracePoint[] = [];
  const other: TracePoint[] = [];
  for (let k = 0; k <= 8; k++) {
    const lambda = -1 + 0.25 * k + (k === 4 ? 1e-3 : 0);
    trivial.push(point(k, lambda, [0, 0], real(lambda, -1)));
    other.push(point(k, lambda, [lambda, 0], real(-lambda, -1)));
  }
  const branches: Branch[] = [
    { id: 0, origin: { kind: 'start' }, stopped: 'left range', points: trivial },
    { id: 1, origin: { kind: 'switch', branch: 0, event: 0 }, stopped: 'left range', points: other },
  ];
  const event: SpecialPoint = {
    id: 0, type: 'transcritical', branch: 0, parameter: 0, state: new Float64Array(2), eigenvalues: real(0, -1),
    between: [3, 4], testBefore: -0.25, testAfter: 1e-3, residual: 0, iterations: 3, newBranches: [1],
  };
  return { settings: settings(-1, 1), branches, events: [event], warnings: ['step at its smallest near λ = 0'], interrupted: false };
}

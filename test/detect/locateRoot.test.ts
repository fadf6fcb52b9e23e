import { describe, expect, it } from 'vitest';
import { locateRoot } from '../../src/detect/locateRoot.js';

const opts = { tol: 1e-12, maxIter: 100 };

function solve(g: (s: number) => number, a: number, b: number, o = opts) {
  return locateRoot(g, a, b, g(a), g(b), o);
}

describe('locateRoot', () => {
  it('finds √2 as the root of s² − 2 on [0, 2]', () => {
    // Analytic root √2.
    const r = solve((s) => s * s - 2, 0, 2);
    expect(r.status).toBe('converged');
    expect(Math.abs(r.s - Math.SQRT2)).toBeLessThan(1e-12);
    expect(Math.abs(r.g)).toBeLessThan(1e-11);
    expect(r.bracketWidth).toBeLessThanOrEqual(2e-12);
  });

  it('finds ln 2 from exp(s) − 2 in far fewer evaluations than bisection', () => {
    // Analytic root ln 2. Bisection needs ⌈log2(1/1e-12)⌉ = 40 halvings; Brent 1973 converges superlinearly.
    const r = solve((s) => Math.exp(s) - 2, 0, 1);
    expect(r.status).toBe('converged');
    expect(Math.abs(r.s - Math.LN2)).toBeLessThan(1e-12);
    expect(r.iterations).toBeLessThan(15);
  });

  it('brackets a jump of a discontinuous function to the tolerance', () => {
    // Analytic: sign(s − 0.3) changes sign only at 0.3; the bisection fallback guarantees the bracket.
    const r = solve((s) => (s < 0.3 ? -1 : 1), -1, 2, { tol: 1e-10, maxIter: 200 });
    expect(r.status).toBe('converged');
    expect(Math.abs(r.s - 0.3)).toBeLessThan(1e-10);
  });

  it('finds the triple root of (s − 1)³ within the bound of about log2(width/tol)² evaluations', () => {
    // Analytic root 1 (multiplicity 3; interpolation is slow there, the bound holds by Brent 1973, ch. 4).
    const r = solve((s) => (s - 1) ** 3, 0, 3, { tol: 1e-9, maxIter: 1000 });
    expect(r.status).toBe('converged');
    expect(Math.abs(r.s - 1)).toBeLessThan(1e-8);
    expect(r.iterations).toBeLessThan(Math.log2(3 / 1e-9) ** 2);
  });

  it('returns the end point itself when an end value is exactly zero', () => {
    const r = locateRoot(() => NaN, 0.5, 1, 0, 3, opts);
    expect(r).toEqual({ s: 0.5, g: 0, iterations: 0, status: 'converged', bracketWidth: 0 });
  });

  it('returns "no-bracket" with the smaller end value when the ends have the same sign', () => {
    const r = locateRoot((s) => s * s + 1, -1, 2, 2, 5, opts);
    expect(r.status).toBe('no-bracket');
    expect(r.s).toBe(-1);
  });

  it('returns "non-finite" when the function returns NaN inside the bracket', () => {
    const r = solve((s) => (s > 0.2 && s < 0.8 ? NaN : s - 0.5), 0, 1);
    expect(r.status).toBe('non-finite');
    expect(r.iterations).toBe(1);
  });

  it('returns "max-iter" with a valid bracket when the budget runs out', () => {
    const r = solve((s) => (s - 1) ** 3, 0, 10, { tol: 1e-14, maxIter: 2 });
    expect(r.status).toBe('max-iter');
    expect(r.iterations).toBe(2);
    expect(r.bracketWidth).toBeGreaterThan(1e-14);
  });

  it('locates the root of (s − r)(1 + (s − r)²) for 300 brackets around r spread by a golden-ratio sequence', () => {
    // Analytic: the only real root is r. Roots in [−100, 100], bracket sides in [1e-3, 50] (deterministic).
    const phi = (Math.sqrt(5) - 1) / 2;
    for (let k = 1; k <= 300; k++) {
      const root = -100 + 200 * ((k * phi) % 1);
      const left = 1e-3 + 50 * ((k * phi * phi) % 1);
      const right = 1e-3 + 50 * ((k * Math.SQRT2) % 1);
      const g = (s: number) => (s - root) * (1 + (s - root) ** 2);
      const r = solve(g, root - left, root + right, { tol: 1e-9, maxIter: 200 });
      expect(r.status).toBe('converged');
      expect(Math.abs(r.s - root)).toBeLessThanOrEqual(1e-9 + 4 * Number.EPSILON * Math.abs(root));
    }
  });
});

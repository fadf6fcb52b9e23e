import { describe, expect, it } from 'vitest';
import type { CurveLimits } from '../../src/portrait/followCurve.js';
import { integrate } from '../../src/portrait/integrate.js';
import type { PlaneFrame } from '../../src/portrait/plane.js';
import { CURVE_LIMITS } from '../../src/portrait/portraitDefaults.js';
import { saddleManifolds } from '../../src/portrait/saddleManifolds.js';
import { haltonPoints, trajectories } from '../../src/portrait/trajectories.js';
import type { Equilibrium } from '../../src/types.js';
import { makeSystem, nominalParameters } from '../helpers/handSystem.js';

const limits: CurveLimits = { ...CURVE_LIMITS, maxTime: 100 };
const frame = (x: [number, number], y: [number, number]): PlaneFrame =>
  ({ ix: 0, iy: 1, window: { x, y }, held: new Float64Array(2) });
const equilibrium = (x: number, y: number, extra: Partial<Equilibrium>): Equilibrium => ({
  state: Float64Array.of(x, y), residual: 0, iterations: 0, eigenvalues: [], stable: false,
  unstableDimension: 0, type: 'unknown', ...extra,
});

describe('saddle manifolds', () => {
  // x' = x, y' = −y + x². Analytic: the stable manifold of the origin is the y-axis (x ≡ 0 solves
  // x' = x). The unstable manifold is a graph y = h(x) with h(0) = h'(0) = 0; invariance gives
  // h'(x)·x = −h + x², solved by h = x²/3.
  const sys = makeSystem({
    n: 2,
    rhs: (s, _p, o) => { o[0] = s[0]!; o[1] = -s[1]! + s[0]! ** 2; },
    jacobian: (s, _p, j) => { j[0] = 1; j[1] = 0; j[2] = 2 * s[0]!; j[3] = -1; },
  });
  const saddle = equilibrium(0, 0, {
    eigenvalues: [{ re: 1, im: 0 }, { re: -1, im: 0 }], unstableDimension: 1, type: 'saddle',
    unstableDirections: [Float64Array.of(1, 0)], stableDirections: [Float64Array.of(0, 1)],
  });

  it('draws four curves for a planar saddle: the unstable ones on y = x²/3, the stable ones on the y-axis', () => {
    const curves = saddleManifolds(sys, nominalParameters(sys), frame([-2, 2], [-1.5, 2]), [saddle], { offset: 1e-3, limits });
    expect(curves).toHaveLength(4);
    const unstable = curves.filter((c) => c.kind === 'unstable manifold');
    const stable = curves.filter((c) => c.kind === 'stable manifold');
    expect(unstable).toHaveLength(2);
    expect(stable).toHaveLength(2);
    for (const c of unstable) {
      expect(c.time).toBe('forward');
      expect(c.end).toBe('left window');
      expect(c.saddle).toBe(0);
      // Offset error ε²/3 = (3.5e-3)²/3 ≈ 4e-6 at the start, contracting along the flow; 1e-5 is generous.
      for (const v of c.points) expect(Math.abs(v.y - (v.x * v.x) / 3)).toBeLessThan(1e-5);
      const far = c.points[c.points.length - 1]!;
      expect(Math.abs(far.x)).toBeGreaterThan(2); // it reached the window's side
    }
    expect(new Set(unstable.map((c) => Math.sign(c.points[c.points.length - 1]!.x)))).toEqual(new Set([1, -1]));
    for (const c of stable) {
      expect(c.time).toBe('backward');
      expect(c.end).toBe('left window');
      for (const v of c.points) expect(Math.abs(v.x)).toBeLessThan(1e-12);
      expect(Math.abs(c.points[c.points.length - 1]!.y)).toBeGreaterThan(1.5);
    }
  });

  it('draws nothing for an equilibrium without both stable and unstable directions', () => {
    const node = equilibrium(0, 0, { stable: true, type: 'stable node', stableDirections: [Float64Array.of(1, 0), Float64Array.of(0, 1)] });
    expect(saddleManifolds(sys, nominalParameters(sys), frame([-2, 2], [-2, 2]), [node], { offset: 1e-3, limits })).toHaveLength(0);
  });
});

describe('trajectories', () => {
  it('spreads Halton start points over the window', () => {
    // Halton (1960): the first points in bases 2 and 3 are (1/2, 1/3), (1/4, 2/3), (3/4, 1/9).
    const pts = haltonPoints(3, { x: [0, 4], y: [0, 9] });
    const expected = [[2, 3], [1, 6], [3, 1]];
    pts.forEach((q, k) => {
      expect(Math.abs(q.x - expected[k]![0]!)).toBeLessThan(1e-12);
      expect(Math.abs(q.y - expected[k]![1]!)).toBeLessThan(1e-12);
    });
  });

  it('spirals into a stable focus: the distance to it decreases along every forward trajectory', () => {
    // x' = −0.1x − y, y' = x − 0.1y. Analytic: r' = −0.1 r, so r(t) = r₀ e^(−t/10) falls monotonically.
    const sys = makeSystem({
      n: 2,
      rhs: (s, _p, o) => { o[0] = -0.1 * s[0]! - s[1]!; o[1] = s[0]! - 0.1 * s[1]!; },
      jacobian: (_s, _p, j) => { j[0] = -0.1; j[1] = -1; j[2] = 1; j[3] = -0.1; },
    });
    const focus = equilibrium(0, 0, { stable: true, type: 'stable focus' });
    const curves = trajectories(sys, nominalParameters(sys), frame([-1, 1], [-1, 1]), [focus], { starts: 12, limits });
    expect(curves).toHaveLength(24);
    const forward = curves.filter((c) => c.time === 'forward');
    let reached = 0;
    for (const c of forward) {
      const r = c.points.map((v) => Math.hypot(v.x, v.y));
      for (let k = 1; k < r.length; k++) expect(r[k]!).toBeLessThan(r[k - 1]! * (1 + 1e-9));
      if (c.end === 'near equilibrium') {
        expect(c.reached).toBe(0);
        expect(r[r.length - 1]!).toBeLessThan(0.01 * 2 * Math.SQRT2);
        reached++;
      }
    }
    expect(reached).toBeGreaterThan(6);
    for (const c of curves.filter((q) => q.time === 'backward')) expect(c.end).toBe('left window');
  });

  it('keeps the Lotka–Volterra first integral H = δx − γ ln x + βy − α ln y constant along trajectories', () => {
    // Lotka (1925): x' = αx − βxy, y' = δxy − γy. Analytic: dH/dt = (δ − γ/x)x' + (β − α/y)y' = 0.
    const [al, be, ga, de] = [1, 0.5, 0.75, 0.25];
    const sys = makeSystem({
      n: 2,
      rhs: (s, _p, o) => { o[0] = al * s[0]! - be * s[0]! * s[1]!; o[1] = de * s[0]! * s[1]! - ga * s[1]!; },
      jacobian: (s, _p, j) => { j[0] = al - be * s[1]!; j[1] = -be * s[0]!; j[2] = de * s[1]!; j[3] = de * s[0]! - ga; },
    });
    const H = (x: number, y: number): number => de * x - ga * Math.log(x) + be * y - al * Math.log(y);
    const centre = equilibrium(ga / de, al / be, { type: 'centre-type' });
    // maxChord = Infinity: only integrator points, no interpolated ones.
    const exact: CurveLimits = { ...limits, maxChord: Infinity, maxLength: 6 };
    const curves = trajectories(sys, nominalParameters(sys), frame([0.2, 8], [0.2, 6]), [centre], { starts: 10, limits: exact });
    expect(curves.length).toBeGreaterThanOrEqual(18);
    for (const c of curves) {
      const h0 = H(c.points[0]!.x, c.points[0]!.y);
      let drift = 0;
      for (const v of c.points) drift = Math.max(drift, Math.abs(H(v.x, v.y) - h0));
      // relTol 1e-8 per step over a few hundred steps: the drift stays below 1e-6 (|H| is of order 1).
      expect(drift).toBeLessThan(1e-6);
      expect(['length limit', 'left window', 'time limit']).toContain(c.end);
    }
  });

  it('measures the Van der Pol limit cycle period at μ = 1 as 6.6632868593', () => {
    // van der Pol (1926): x' = y, y' = μ(1 − x²)y − x. Period of the limit cycle for μ = 1:
    // 6.663286859323130 (from memory: the standard value quoted to many digits in numerical ODE texts).
    const f = (_t: number, s: Float64Array, o: Float64Array): void => { o[0] = s[1]!; o[1] = (1 - s[0]! ** 2) * s[1]! - s[0]!; };
    const opts = { relTol: 1e-12, absTol: 1e-12, maxSteps: 200_000 };
    const run = integrate(f, Float64Array.of(2, 0), 0, 60, opts);
    expect(run.status).toBe('done');
    // Upward crossings of x = 0, each located by bisection on the integrated solution from the step before.
    const crossings: number[] = [];
    for (let k = 1; k < run.t.length; k++) {
      const a = run.y[k - 1]!, b = run.y[k]!;
      if (!(a[0]! < 0 && b[0]! >= 0) || run.t[k - 1]! < 20) continue;
      let lo = 0, hi = run.t[k]! - run.t[k - 1]!;
      for (let it = 0; it < 60; it++) {
        const mid = (lo + hi) / 2;
        const part = integrate(f, a, 0, mid, opts);
        if (part.y[part.y.length - 1]![0]! < 0) lo = mid;
        else hi = mid;
      }
      crossings.push(run.t[k - 1]! + (lo + hi) / 2);
    }
    expect(crossings.length).toBeGreaterThanOrEqual(5);
    for (let k = 1; k < crossings.length; k++) {
      expect(Math.abs(crossings[k]! - crossings[k - 1]! - 6.6632868593)).toBeLessThan(1e-8);
    }
  });
});

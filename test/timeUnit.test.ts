import { describe, expect, it } from 'vitest';
import { equilibriaAt } from '../src/equilibriaAt.js';
import { loadModel } from '../src/model/loadModel.js';
import { portraitAt } from '../src/portraitAt.js';
import { prepare } from '../src/setup.js';
import { sweep } from '../src/sweep.js';
import { SLOW_RATE, timeFactor } from '../src/timeUnit.js';

/** The Brusselator (Prigogine & Lefever 1968) with every rate multiplied by k: time counted in units 1/k. */
const brusselator = (k: number) => loadModel(
  `states: { x: 1, y: 2 }\nparameters: { b: 1.5, a: 1, k: ${k} }\nequations:\n` +
  '  x: k*(a - (b + 1)*x + x^2*y)\n  y: k*(b*x - x^2*y)\n', 'brusselator-time.yaml');

describe('the unit of time', () => {
  it('gives the same Hopf point, with frequency and period in the model\'s own time unit', () => {
    // Analytic: Hopf point at b = 1 + a² = 2 with ω = a·k (det J = a²k² there); the first Lyapunov
    // coefficient does not depend on the time unit (Kuznetsov 3rd ed. eq. 3.20), so every k gives the
    // value of k = 1.
    const reference = sweep(brusselator(1), { vary: 'b', from: 0.5, to: 4.5 }).report.events[0]!;
    for (const k of [1e-12, 1e-9, 1e-6, 1e-3, 1e6]) {
      const { report, trace } = sweep(brusselator(k), { vary: 'b', from: 0.5, to: 4.5 });
      const label = `k = ${k}`;
      expect(trace.warnings, label).toEqual([]);
      expect(report.branches, label).toHaveLength(1);
      expect(report.events.map((e) => [e.type, e.criticality]), label).toEqual([['hopf', 'supercritical']]);
      const hopf = report.events[0]!;
      expect(Math.abs(hopf.parameter - 2), label).toBeLessThan(1e-10);
      expect(hopf.frequency! / k, label).toBeCloseTo(1, 9);
      expect(hopf.period! * k, label).toBeCloseTo(2 * Math.PI, 8);
      expect(hopf.lyapunov! / reference.lyapunov!, label).toBeCloseTo(1, 8);
      expect(Math.abs(hopf.eigenvalues[0]!.im) / k, label).toBeCloseTo(1, 9);
      // Along the branch the largest real part is (b − 1 − a²)k/2 while the pair is complex (analytic).
      const q = report.branches[0]!.points.find((p) => Math.abs(p.parameter - 1.5) < 0.3)!;
      expect(q.maxRealPart / k, label).toBeCloseTo((q.parameter - 2) / 2, 8);
    }
  });

  it('finds the one equilibrium of a slow model, with its eigenvalues in the model\'s time unit', () => {
    // Analytic: (x, y) = (a, b/a) = (1, 1.5); eigenvalues k·((b − 1 − a²) ± sqrt((b − 1 − a²)² − 4a²))/2
    // = k·(−0.25 ± 0.968i).
    const { search } = equilibriaAt(brusselator(1e-12));
    expect(search.equilibria).toHaveLength(1);
    const e = search.equilibria[0]!;
    expect(Array.from(e.state)).toEqual([1, 1.5]);
    expect(e.eigenvalues[0]!.re / 1e-12).toBeCloseTo(-0.25, 10);
    expect(Math.abs(e.eigenvalues[0]!.im) / 1e-12).toBeCloseTo(Math.sqrt(15) / 4, 10);
  });

  it('draws the phase portrait of a slow model around its one equilibrium', () => {
    const { equilibria } = portraitAt(brusselator(1e-12), {});
    expect(equilibria.map((e) => Array.from(e.state))).toEqual([[1, 1.5]]);
    expect(equilibria[0]!.eigenvalues[0]!.re / 1e-12).toBeCloseTo(-0.25, 10);
  });

  it('leaves a model alone whose rates are not slow', () => {
    for (const [k, expected] of [[1, 1], [1e6, 1], [10 * SLOW_RATE, 1]] as const) {
      const { system, params, guess } = prepare(brusselator(k));
      expect(timeFactor(system, params, guess)).toBe(expected);
    }
    const { system, params, guess } = prepare(brusselator(1e-9));
    const r = timeFactor(system, params, guess);
    expect(r).toBeGreaterThan(1e-10);
    expect(r).toBeLessThan(1e-8);
  });
});

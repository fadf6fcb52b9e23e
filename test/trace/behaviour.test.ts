/**
 * Behaviour of the continuation on systems with closed-form branches: turning through folds,
 * closed curves, neutral saddles, reversed sweeps and interruption.
 */
import { describe, expect, it } from 'vitest';
import { TRACE } from '../../src/defaults.js';
import { hopfTest } from '../../src/detect/hopfTest.js';
import { message } from '../../src/errors.js';
import { STOP_WHY } from '../../src/trace/reportStops.js';
import { traceBranches } from '../../src/trace/traceBranches.js';
import { traceSettings } from '../../src/trace/traceSettings.js';
import type { SpecialPoint } from '../../src/types.js';
import { makeSystem } from '../helpers/handSystem.js';
import { bisect } from './bisect.js';
import { expectClose } from '../helpers/close.js';
import { expectAllConverged } from './expectTraced.js';
import { textSystem } from './modelFile.js';
import { scalarSystem, withStableDirection } from './traceSystems.js';

/** x' = λ + x − x³, y' = −y: equilibria λ = x³ − x, an S between the folds at x = ∓1/√3. */
const sCurve = withStableDirection((x, l) => l + x - x ** 3, (x) => 1 - 3 * x * x, () => 1);
/** The equilibrium x of the S-curve at λ on its outer part (x³ − x − λ = 0 with |x| > 1). */
const outerRoot = (l: number): number => (l < 0 ? bisect((x) => x ** 3 - x - l, -3, -1) : bisect((x) => x ** 3 - x - l, 1, 3));

const summary = (events: readonly SpecialPoint[]): [string, number][] =>
  events.map((e) => [e.type, e.parameter] as [string, number]).sort((a, b) => a[1] - b[1]);

describe('traceBranches', () => {
  it('follows an S-shaped branch through both folds and stops on both range ends exactly', () => {
    // Analytic: λ = x³ − x has dλ/dx = 3x² − 1 = 0 at x = ∓1/√3, λ = ±2/(3√3). Fold coefficient
    // (src/detect/foldCoefficient.ts): q = p = e1, B(q,q) = g_xx = −6x, so a = −3x = ±√3.
    const trace = traceBranches(sCurve, Float64Array.of(0), traceSettings(0, -1, 1), [Float64Array.of(outerRoot(-1), 0)]);
    expect(trace.branches).toHaveLength(1);
    const branch = trace.branches[0]!;
    expect(branch.stopped).toBe('left range');
    expect(branch.points[0]!.parameter).toBe(-1);
    expect(branch.points[branch.points.length - 1]!.parameter).toBe(1);
    expectClose(branch.points[branch.points.length - 1]!.state[0]!, outerRoot(1), { rel: 1e-10 }, 'last point x (analytic root)');
    expect(trace.events.map((e) => e.type)).toEqual(['fold', 'fold']);
    const lf = 2 / (3 * Math.sqrt(3));
    expectClose(trace.events[0]!.parameter, lf, { rel: 1e-10 }, 'first fold λ = 2/(3√3) (analytic)');
    expectClose(trace.events[1]!.parameter, -lf, { rel: 1e-10 }, 'second fold λ = −2/(3√3) (analytic)');
    expectClose(trace.events[0]!.foldCoefficient!, Math.sqrt(3), { rel: 1e-5 }, 'a = √3 (analytic)');
    expectClose(trace.events[1]!.foldCoefficient!, -Math.sqrt(3), { rel: 1e-5 }, 'a = −√3 (analytic)');
    // Stability: stable on the outer parts, one unstable eigenvalue between the folds (analytic: g_x = 1 − 3x²).
    for (const q of branch.points) expect(q.unstableCount).toBe(1 - 3 * q.state[0]! ** 2 > 1e-6 ? 1 : 0);
    expect(trace.warnings).toEqual([]);
    expectAllConverged(trace);
  });

  it('stops a closed branch with "closed loop" and finds both of its folds', () => {
    // Analytic: x' = 1 − λ² − x² has the circle λ² + x² = 1 as its equilibria. A closed curve that
    // starts at λ = from must touch λ = from, so the sweep over [−1, 2] starts at the fold (−1, 0).
    const circle = withStableDirection((x, l) => 1 - l * l - x * x, (x) => -2 * x, (_x, l) => -2 * l);
    const trace = traceBranches(circle, Float64Array.of(0), traceSettings(0, -1, 2), [Float64Array.of(0, 0)]);
    expect(trace.branches).toHaveLength(1);
    expect(trace.branches[0]!.stopped).toBe('closed loop');
    const folds = summary(trace.events);
    expect(folds.map((f) => f[0])).toEqual(['fold', 'fold']);
    expectClose(folds[0]![1], -1, { rel: 1e-10 }, 'fold at λ = −1 (analytic)');
    expectClose(folds[1]![1], 1, { rel: 1e-10 }, 'fold at λ = 1 (analytic)');
    for (const q of trace.branches[0]!.points) {
      expectClose(q.parameter ** 2 + q.state[0]! ** 2, 1, { abs: 1e-9 }, 'on the unit circle (analytic)');
    }
    expect(trace.warnings).toEqual([]);
    expectAllConverged(trace);
  });

  it('reports no Hopf point at a neutral saddle (real eigenvalues μ and −1 with μ crossing 1)', () => {
    // Analytic: x1' = μ(x1 − 1), x2' = −x2 + x1 − 1, (x3, x4) a stable focus with eigenvalues
    // −0.5 ± 2i. Equilibrium (1, 0, 0, 0) for all μ; eigenvalues μ, −1, −0.5 ± 2i. At μ = 1 the real
    // pair sums to zero, so the bialternate-product test function changes sign, but no eigenvalue
    // crosses the imaginary axis: no Hopf point (and no fold or branch point: μ ≠ 0 on [0.5, 1.5]).
    const system = makeSystem({
      n: 4,
      parameters: { mu: 1 },
      rhs: (x, p, out) => {
        out[0] = p[0]! * (x[0]! - 1);
        out[1] = -x[1]! + x[0]! - 1;
        out[2] = -0.5 * x[2]! - 2 * x[3]!;
        out[3] = 2 * x[2]! - 0.5 * x[3]!;
      },
      jacobian: (_x, p, out) => { out.set([p[0]!, 0, 0, 0, 1, -1, 0, 0, 0, 0, -0.5, -2, 0, 0, 2, -0.5]); },
    });
    const trace = traceBranches(system, Float64Array.of(0.5), traceSettings(0, 0.5, 1.5), [Float64Array.of(1, 0, 0, 0)]);
    expect(trace.branches).toHaveLength(1);
    expect(trace.branches[0]!.stopped).toBe('left range');
    // The test function that a neutral saddle fools does change sign along the branch ...
    const points = trace.branches[0]!.points;
    expect(Math.sign(hopfTest(points[0]!.eigenvalues))).toBe(-Math.sign(hopfTest(points[points.length - 1]!.eigenvalues)));
    // ... but nothing is reported.
    expect(trace.events).toEqual([]);
    expectAllConverged(trace);
  });

  it('finds the same special points when the sweep runs from high to low', () => {
    const forward = traceBranches(sCurve, Float64Array.of(0), traceSettings(0, -1, 1), [Float64Array.of(outerRoot(-1), 0)]);
    const backward = traceBranches(sCurve, Float64Array.of(0), traceSettings(0, 1, -1), [Float64Array.of(outerRoot(1), 0)]);
    const a = summary(forward.events);
    const b = summary(backward.events);
    expect(b.map((e) => e[0])).toEqual(a.map((e) => e[0]));
    // Same points up to the location tolerance (TRACE.locateRelTol, src/defaults.ts).
    a.forEach((e, i) => expectClose(b[i]![1], e[1], { rel: 1e-10 }, `event ${i} parameter`));
    expect(backward.branches[0]!.points[0]!.parameter).toBe(1);
    expectAllConverged(backward);
  });

  it('returns a partial trace marked interrupted when shouldStop says so, keeping finished branches and events', () => {
    // x' = λx − x³ (pitchfork at 0): branch 0 is x = 0, branch 1 the switched parabola x² = λ.
    const system = scalarSystem((u, l) => l * u - u ** 3, (u, l) => l - 3 * u * u, (u) => u, (u) => -6 * u, () => 1);
    const settings = traceSettings(0, -1, 1);
    let firstBranchTicks = 0;
    const full = traceBranches(system, Float64Array.of(0), settings, [Float64Array.of(0)], {
      onProgress: (p) => { if (p.branch === 1) firstBranchTicks++; },
    });
    expect(full.interrupted).toBe(false);
    expect(full.branches).toHaveLength(2);
    let calls = 0;
    let progress = 0;
    const partial = traceBranches(system, Float64Array.of(0), settings, [Float64Array.of(0)], {
      onProgress: () => { progress++; },
      shouldStop: () => ++calls > firstBranchTicks + 5,
    });
    expect(partial.interrupted).toBe(true);
    expect(progress).toBe(calls); // both hooks once per computed point
    expect(partial.branches).toHaveLength(2);
    expect(partial.branches[0]!.stopped).toBe('left range');
    expect(partial.branches[1]!.stopped).toBe('interrupted');
    expect(partial.branches[1]!.points.length).toBeLessThan(full.branches[1]!.points.length);
    expect(partial.events.map((e) => e.type)).toEqual(['pitchfork']);
    expect(partial.events[0]!.parameter).toBe(full.events[0]!.parameter);
  });
});

describe('traceBranches with a window of the other stability shorter than a step', () => {
  // Analytic: with mu = eps − (lam − 1/2)², the oscillator x' = mu x − y − x r², y' = x + mu y − y r² has
  // Hopf points at lam = 1/2 ± sqrt(eps) (supercritical, l1 < 0), and x' = mu x − x³ has pitchforks there.
  // For eps = 1e-6 and 1e-8 the window is 2e-3 and 2e-4 wide, far shorter than a step (0.02 of the
  // range); at eps = −1e-6 the largest real part only comes near zero and nothing is found.
  const model = (eps: number, oscillator: boolean) => textSystem([
    oscillator ? 'states: { x: 0, y: 0 }' : 'states: { x: 0 }',
    `parameters: { lam: 0, eps: ${eps} }`, 'definitions:', '  mu: eps - (lam - 0.5)^2', 'equations:',
    ...(oscillator ? ['  x: mu*x - y - x*(x^2 + y^2)', '  y: x + mu*y - y*(x^2 + y^2)'] : ['  x: mu*x - x^3']),
  ].join('\n'));
  it('finds both Hopf points of a narrow bubble of oscillations, and both pitchforks of a narrow unstable window', () => {
    for (const oscillator of [true, false]) {
      for (const eps of [1e-4, 1e-6, 1e-8]) {
        const system = model(eps, oscillator);
        const trace = traceBranches(system, Float64Array.of(0, eps), traceSettings(0, 0, 1), [new Float64Array(oscillator ? 2 : 1)]);
        const label = `${oscillator ? 'Hopf' : 'pitchfork'}, eps = ${eps}`;
        const events = trace.events.filter((e) => e.branch === 1);
        expect(events.map((e) => e.type), label).toEqual(oscillator ? ['hopf', 'hopf'] : ['pitchfork', 'pitchfork']);
        const at = events.map((e) => e.parameter).sort((a, b) => a - b);
        expectClose(at[0]!, 0.5 - Math.sqrt(eps), { rel: 1e-9 }, label);
        expectClose(at[1]!, 0.5 + Math.sqrt(eps), { rel: 1e-9 }, label);
      }
      const near = traceBranches(model(-1e-6, oscillator), Float64Array.of(0, -1e-6), traceSettings(0, 0, 1), [new Float64Array(oscillator ? 2 : 1)]);
      expect(near.events).toEqual([]);
      expect(near.warnings).toEqual([]);
    }
  });
});

describe('traceBranches limits', () => {
  it('stops starting branches at maxBranches and says so in the warnings', () => {
    // x' = λx − x³: the pitchfork at λ = 0 would start a second branch (analytic: x² = λ).
    const system = scalarSystem((u, l) => l * u - u ** 3, (u, l) => l - 3 * u * u, (u) => u, (u) => -6 * u, () => 1);
    const trace = traceBranches(system, Float64Array.of(0), traceSettings(0, -1, 1, { maxBranches: 1 }), [Float64Array.of(0)]);
    expect(trace.branches).toHaveLength(1);
    expect(trace.events.map((e) => e.type)).toEqual(['pitchfork']);
    expect(trace.events[0]!.newBranches).toEqual([]);
    expect(trace.warnings).toEqual([message.traceBranchLimit(1)]);
  });

  it('reports a branch that ran out of points, and where', () => {
    // The S-curve needs far more than 10 points to cross [−1, 1].
    const trace = traceBranches(sCurve, Float64Array.of(0), traceSettings(0, -1, 1, { maxPoints: 10 }), [Float64Array.of(outerRoot(-1), 0)]);
    const branch = trace.branches[0]!;
    expect(branch.stopped).toBe('point budget');
    expect(branch.points).toHaveLength(10);
    const last = branch.points[branch.points.length - 1]!;
    expect(trace.warnings).toEqual([
      message.traceBranchStopped(1, STOP_WHY['point budget'], 'lambda', last.parameter),
    ]);
  });
});

describe('traceBranches start problems', () => {
  it('drops a start where Newton finds no equilibrium, with a warning', () => {
    // Analytic: x' = λ + x² has no equilibrium for λ > 0, so nothing can be traced from λ = 1.
    const system = scalarSystem((u, l) => l + u * u, (u) => 2 * u, () => 1, () => 2, () => 0);
    const trace = traceBranches(system, Float64Array.of(0), traceSettings(0, 1, 2), [Float64Array.of(0.5)]);
    expect(trace.branches).toEqual([]);
    expect(trace.events).toEqual([]);
    expect(trace.warnings).toHaveLength(1);
    const prefix = message.traceStartFailed('lambda', 1, 'STATUS', 0, 0).split('Newton')[0]!;
    expect(trace.warnings[0]!.startsWith(prefix)).toBe(true);
  });
});

describe('traceBranches with a branch point on a range end or at a start', () => {
  const pitchfork = (): ReturnType<typeof textSystem> => textSystem('states: { x: 0 }\nparameters: { lam: 0 }\nequations:\n  x: lam*x - x^3');
  const onBound = (l: number) => message.traceBoundBranchPoint('lam', l);

  it('starts next to a branch point at the start of the range, and says so', () => {
    // Analytic: x' = λx − x³ has a pitchfork at (0, 0): from λ = 0 the direction of x = 0 is not unique.
    const trace = traceBranches(pitchfork(), Float64Array.of(0), traceSettings(0, 0, 1), [new Float64Array(1)]);
    expect(trace.branches).toHaveLength(1);
    const points = trace.branches[0]!.points;
    expect([points[0]!.parameter, points.at(-1)!.parameter]).toEqual([0, 1]);
    for (const q of points) expect(q.state[0]).toBe(0); // the branch x = 0 (analytic)
    expect(trace.events).toEqual([]);
    expect(trace.warnings).toEqual([onBound(0)]);
  });

  it('lands on a branch point at the end of the range without a failure', () => {
    const trace = traceBranches(pitchfork(), Float64Array.of(-1), traceSettings(0, -1, 0), [new Float64Array(1)]);
    expect(trace.branches[0]!.stopped).toBe('left range');
    expect(trace.branches[0]!.points.at(-1)!.parameter).toBe(0);
    expect(trace.warnings).toEqual([onBound(0)]);
  });

  it('traces both ways from a start inside the range that is a branch point, and reports it', () => {
    const trace = traceBranches(pitchfork(), Float64Array.of(-1), traceSettings(0, -1, 1), [{ state: new Float64Array(1), parameter: 0 }]);
    expect(trace.events.map((e) => e.type)).toEqual(['pitchfork']);
    expect(Math.abs(trace.events[0]!.parameter)).toBeLessThan(1e-10); // analytic: λ = 0
    expect(trace.branches).toHaveLength(2); // x = 0, and x = ±√λ by switching
    expect(trace.warnings).toEqual([]);
  });
});

describe('traceBranches switching at a pitchfork', () => {
  it('walks the new branch away from the branch point on both sides, through the point itself, never onto the old branch', () => {
    // Analytic: x' = (λ/c − 1)x − x³/s² has the pitchfork at λ = c and the new branch |x| = s·√(λ/c − 1).
    // State and parameter of different sizes make the two branches close next to the branch point.
    for (const [c, scale] of [[3, 1], [10, 1], [1, 0.3], [1, 0.1]] as const) {
      const model = textSystem(`states: { x: 0 }\nparameters: { lam: 0, c: ${c}, s: ${scale} }\nequations:\n  x: (lam/c - 1)*x - x^3/s^2`);
      const trace = traceBranches(model, Float64Array.of(0, c, scale), traceSettings(0, 0, 2 * c), [new Float64Array(1)]);
      expect(trace.events.map((e) => e.type)).toEqual(['pitchfork']);
      expect(trace.warnings).toEqual([]);
      const switched = trace.branches[1]!;
      expect(switched.stopped).toBe('left range');
      const xs = switched.points.map((q) => q.state[0]!);
      expect(Math.min(...xs)).toBeLessThan(0); // both halves
      expect(Math.max(...xs)).toBeGreaterThan(0);
      expect(switched.points.some((q) => q.parameter === trace.events[0]!.parameter && q.state[0] === trace.events[0]!.state[0])).toBe(true);
      for (const q of switched.points) {
        expectClose(Math.abs(q.state[0]!), scale * Math.sqrt(Math.max(0, q.parameter / c - 1)), { abs: 1e-6 * scale }, '|x| = s√(λ/c − 1) (analytic)');
      }
    }
  });

  it('follows the same branches in any units: tiny states and right-hand sides as well as large ones', () => {
    // Analytic: x = s·u, λ = c·μ turn x' = (λ/c − 1)x − x³/s² into u' = (μ − 1)u − u³ for every (c, s)
    // (a time scale apart), so with starts x = 0 at λ = 0 and x = −s at λ = 2c, as the equilibrium
    // search may give, every choice must trace the same two branches with the same points. With
    // c = 1e-3 and s = 1e-6 the right-hand side is below 1e-9 near the branch point, under the
    // corrector's residual tolerance: only the Newton step can tell the branch from a point beside it.
    const counts = [[1e3, 1], [1, 1e-4], [1e-3, 1e-6]].map(([c, s]) => {
      const model = textSystem(`states: { x: 0 }\nparameters: { lam: 0, c: ${c}, s: ${s} }\nequations:\n  x: (lam/c - 1)*x - x^3/s^2`);
      const trace = traceBranches(model, Float64Array.of(0, c!, s!), traceSettings(0, 0, 2 * c!), [
        new Float64Array(1), { state: Float64Array.of(-s!), parameter: 2 * c! },
      ]);
      const label = `c = ${c}, s = ${s}`;
      expect(trace.warnings, label).toEqual([]);
      expect(trace.events.map((e) => e.type), label).toEqual(['pitchfork']);
      expect(trace.branches, label).toHaveLength(2);
      const xs = trace.branches[1]!.points.map((q) => q.state[0]!);
      expect(Math.min(...xs) / s!, label).toBeCloseTo(-1, 8);
      expect(Math.max(...xs) / s!, label).toBeCloseTo(1, 8);
      for (const q of trace.branches[1]!.points) {
        // In the scaled variables u = x/s, μ = λ/c the branch is u² = μ − 1 (well conditioned at the tip too).
        expect(Math.abs((q.state[0]! / s!) ** 2 - (q.parameter / c! - 1)), label).toBeLessThan(1e-7);
      }
      return trace.branches.map((b) => b.points.length);
    });
    expect(counts[1]).toEqual(counts[0]);
    expect(counts[2]).toEqual(counts[0]);
  });
});

describe('traceBranches at corners of the model (abs, min, max)', () => {
  it('follows a branch through a saturation corner without stopping', () => {
    // Analytic: x' = −x + min(2λ, 1), y' = x − y: equilibria x = y = min(2λ, 1), one branch with a
    // corner at λ = 1/2 where the saturation is reached; stable everywhere (eigenvalues −1, −1).
    const model = textSystem('states: { x: 0, y: 0 }\nparameters: { lam: 0 }\nequations:\n  x: -x + min(2*lam, 1)\n  y: x - y');
    const trace = traceBranches(model, Float64Array.of(-1), traceSettings(0, -1, 2), [Float64Array.of(-2, -2)]);
    expect(trace.warnings).toEqual([]);
    expect(trace.events).toEqual([]);
    expect(trace.branches).toHaveLength(1);
    const points = trace.branches[0]!.points;
    expect(trace.branches[0]!.stopped).toBe('left range');
    expect([points[0]!.parameter, points[points.length - 1]!.parameter]).toEqual([-1, 2]);
    for (const q of points) {
      const x = Math.min(2 * q.parameter, 1);
      expect(Math.abs(q.state[0]! - x)).toBeLessThan(1e-9);
      expect(Math.abs(q.state[1]! - x)).toBeLessThan(1e-9);
      expect(q.stable).toBe(true);
    }
  });

  it('reports a loss of stability at a corner as a special point at the corner, without a normal form', () => {
    // Analytic: x' = −x + 1.5·max(x − 1, 0) + y, y' = λ − x − 0.1y. Equilibria y = x − 1.5·max(x − 1, 0),
    // λ = x + 0.1y: λ = 1.1x below x = 1, λ = 0.95x + 0.15 above, so one rising branch with a corner
    // at x = y = 1, λ = 1.1. The Jacobian jumps there from [[−1, 1], [−1, −0.1]] (trace −1.1, det 1.1:
    // stable focus) to [[0.5, 1], [−1, −0.1]] (trace 0.4, det 0.95: unstable focus): the pair jumps
    // across the imaginary axis.
    const model = textSystem('states: { x: 0, y: 0 }\nparameters: { lam: 0 }\nequations:\n  x: -x + 1.5*max(x - 1, 0) + y\n  y: lam - x - 0.1*y');
    const trace = traceBranches(model, Float64Array.of(0), traceSettings(0, 0, 2), [Float64Array.of(0, 0)]);
    expect(trace.warnings).toEqual([]);
    expect(trace.branches).toHaveLength(1);
    expect(trace.events.map((e) => [e.type, e.corner])).toEqual([['hopf', true]]);
    const e = trace.events[0]!;
    expectClose(e.parameter, 1.1, { abs: 1e-9 }, 'corner at λ = 1.1 (analytic)');
    expect(e.lyapunov).toBeUndefined();
    expect(e.criticality).toBeUndefined();
    for (const q of trace.branches[0]!.points) if (Math.abs(q.parameter - 1.1) > 1e-6) expect(q.stable).toBe(q.parameter < 1.1);
  });

  it('follows a branch that turns back at a corner, and reports the corner as a fold there, without a coefficient', () => {
    // Analytic: x' = λ − |x| − x³ has equilibria λ = |x| + x³. For x < 0, λ = −x + x³ has a smooth fold
    // at x = −1/√3, λ = 2/(3√3) (f_x = 1 − 3x²: unstable between it and 0); at the corner (0, 0) the
    // branch turns back and rises for x > 0 (f_x = −1 − 3x²: stable). One branch, two folds: the
    // stable state for x > 0 meets the unstable one at λ = 0 and both vanish below it.
    const model = textSystem('states: { x: 1 }\nparameters: { lam: 1 }\nequations:\n  x: lam - abs(x) - x^3');
    const trace = traceBranches(model, Float64Array.of(-1), traceSettings(0, -1, 2), [Float64Array.of(-1.2), { state: Float64Array.of(1), parameter: 2 }]);
    expect(trace.warnings).toEqual([]);
    expect(trace.branches.map((b) => b.stopped)).toEqual(['left range']);
    const events = [...trace.events].sort((p, q) => p.parameter - q.parameter);
    expect(events.map((e) => [e.type, e.corner ?? false])).toEqual([['fold', true], ['fold', false]]);
    expectClose(events[0]!.parameter, 0, { abs: 1e-12 }, 'corner fold at λ = 0 (analytic)');
    expectClose(events[0]!.state[0]!, 0, { abs: 1e-12 }, 'at x = 0 (analytic)');
    expect(events[0]!.foldCoefficient).toBeUndefined();
    expectClose(events[1]!.parameter, 2 / (3 * Math.sqrt(3)), { abs: 1e-10 }, 'fold at λ = 2/(3√3) (analytic)');
    for (const q of trace.branches[0]!.points) {
      const x = q.state[0]!;
      expectClose(q.parameter, Math.abs(x) + x ** 3, { abs: 1e-9 }, 'λ = |x| + x³ (analytic)');
      if (Math.abs(x) > 1e-6 && Math.abs(x + 1 / Math.sqrt(3)) > 1e-6) expect(q.stable).toBe(x > 0 || x < -1 / Math.sqrt(3));
    }
  });
});

describe('traceBranches at the edge of the model\'s domain', () => {
  it('stops with "non-finite" where the branch runs into x < 0 of x\' = √x − λ, and warns', () => {
    // Analytic: equilibria x = λ² for λ ≥ 0 only; at (0, 0) the branch reaches the edge of the
    // domain of √x (f and f_x are NaN or infinite beyond it).
    const system = scalarSystem((u, l) => Math.sqrt(u) - l, (u) => 0.5 / Math.sqrt(u), () => -1, (u) => -0.25 * u ** -1.5, () => 0);
    const trace = traceBranches(system, Float64Array.of(0), traceSettings(0, 1, -1), [Float64Array.of(1)]);
    const branch = trace.branches[0]!;
    expect(branch.stopped).toBe('non-finite');
    const last = branch.points[branch.points.length - 1]!;
    expect(last.parameter).toBeLessThan(1e-3); // close to the edge λ = 0 (analytic)
    expect(last.parameter).toBeGreaterThan(0);
    expect(trace.warnings).toEqual([
      message.traceBranchStopped(1, 'the model gave a value that is not finite', 'lambda', last.parameter),
    ]);
    expectAllConverged(trace);
  });
});

describe('traceSettings', () => {
  it('scales the step lengths by the sweep range and copies the other defaults', () => {
    const s = traceSettings(2, 5, 1, { maxPoints: 7 });
    // src/defaults.ts TRACE: steps are fractions of |to − from| = 4.
    expect(s).toEqual({
      parameterIndex: 2, from: 5, to: 1, ds: TRACE.dsFraction * 4, dsMin: TRACE.dsMinFraction * 4,
      dsMax: TRACE.dsMaxFraction * 4, maxPoints: 7, absTol: TRACE.absTol, maxIter: TRACE.maxIter,
      maxBranches: TRACE.maxBranches,
    });
  });
});
